import { describe, expect, it } from 'vitest';
import {
  cohensDFromTIndependent,
  cohensDzFromTPaired,
  cohensFFromPartialEtaSquared,
  partialEtaSquaredFromF,
  partialOmegaSquaredFromF,
  rFromT,
} from '../../src/stats/effectSizes.js';
import { roundToDecimals } from '../../src/stats/reportedNumber.js';

describe('effect sizes from test statistics', () => {
  // Lakens (2013), Frontiers in Psychology 4:863, worked between-subjects example (two groups of
  // 10 movie ratings). The reported numbers are FROM MEMORY, not re-read from the paper:
  // t(18) = 2.52, d_s = 1.13; F(1, 18) = 6.34, partial eta squared = .26, partial omega squared = .21.
  it('reproduces the Lakens (2013) worked example to the published two decimals (from memory)', () => {
    expect(roundToDecimals(cohensDFromTIndependent(2.52, 10, 10), 2)).toBe(1.13);
    expect(roundToDecimals(partialEtaSquaredFromF(6.34, 1, 18), 2)).toBe(0.26);
    expect(roundToDecimals(partialOmegaSquaredFromF(6.34, 1, 18, 20), 2)).toBe(0.21);
  });

  it('partialEtaSquaredFromF follows F df1 / (F df1 + df2)', () => {
    expect(partialEtaSquaredFromF(4.21, 1, 44)).toBeCloseTo(4.21 / 48.21, 15);
    expect(partialEtaSquaredFromF(0, 3, 20)).toBe(0);
    expect(partialEtaSquaredFromF(Infinity, 3, 20)).toBe(1);
    expect(partialEtaSquaredFromF(-1, 3, 20)).toBeNaN();
    expect(partialEtaSquaredFromF(2, 0, 20)).toBeNaN();
  });

  it('partialOmegaSquaredFromF is below eta squared and negative for F < 1 (common practice)', () => {
    expect(partialOmegaSquaredFromF(6.34, 1, 18, 20)).toBeLessThan(partialEtaSquaredFromF(6.34, 1, 18));
    expect(partialOmegaSquaredFromF(0.5, 2, 27, 30)).toBeLessThan(0);
    expect(partialOmegaSquaredFromF(1, 2, 27, 30)).toBe(0);
  });

  // Cohen (1988): f = .10, .25, .40 correspond to eta squared .0099, .0588, .1379 (from memory:
  // Cohen's "small/medium/large" f and their eta squared equivalents, section 8.2).
  it('cohensFFromPartialEtaSquared inverts eta^2 = f^2 / (1 + f^2)', () => {
    for (const f of [0.1, 0.25, 0.4]) {
      expect(cohensFFromPartialEtaSquared((f * f) / (1 + f * f))).toBeCloseTo(f, 14);
    }
    expect(roundToDecimals(0.25 ** 2 / (1 + 0.25 ** 2), 4)).toBe(0.0588);
    expect(cohensFFromPartialEtaSquared(1.2)).toBeNaN();
  });

  it('rFromT keeps the sign of t and agrees with t^2 = F, r^2 = eta^2 for one df', () => {
    expect(rFromT(-2.52, 18)).toBeLessThan(0);
    expect(rFromT(2.52, 18) ** 2).toBeCloseTo(partialEtaSquaredFromF(2.52 ** 2, 1, 18), 14);
    expect(rFromT(Infinity, 5)).toBe(1);
    expect(rFromT(1, 0)).toBeNaN();
  });

  it('cohensDzFromTPaired divides by sqrt(n)', () => {
    expect(cohensDzFromTPaired(3, 9)).toBe(1);
    expect(cohensDzFromTPaired(3, 0)).toBeNaN();
  });
});
