import { describe, expect, it } from 'vitest';
import { spearmanTwoTailed } from '../../src/stats/spearman.js';
import { loadFixture } from './referenceFixtures.js';

interface ExactPoint { n: number; s: number; rho: number; p: number }

// Reference: the exact permutation distribution of S, counted by tests/fixtures/stats/gen_spearman.py (n = 4..14).
const exact = loadFixture<{ exact: ExactPoint[] }>('stats/spearman.json').exact;

describe('spearmanTwoTailed', () => {
  it('is the exact permutation p for n <= 9 (as R counts it)', () => {
    const small = exact.filter((point) => point.n <= 9);
    expect(small.length).toBeGreaterThan(150);
    for (const point of small) expect(Math.abs(spearmanTwoTailed(point.rho, point.n) - point.p), `n = ${point.n}, S = ${point.s}`).toBeLessThan(1e-12);
  });

  // AS 89's series against the exact distribution, measured when written: at most 9.9e-4 (n = 10),
  // 6.5e-4 (11), 3.8e-4 (12), 2.3e-4 (13), 1.4e-4 (14) absolute. The t approximation is off by up to 1.2e-2 at n = 10.
  it('is within 1e-3 of the exact p for n = 10..14 (AS 89 Edgeworth series), closer as n grows', () => {
    const worst = new Map<number, number>();
    for (const point of exact.filter((p) => p.n >= 10)) {
      const error = Math.abs(spearmanTwoTailed(point.rho, point.n) - point.p);
      worst.set(point.n, Math.max(worst.get(point.n) ?? 0, error));
    }
    expect([...worst.keys()].sort((a, b) => a - b)).toEqual([10, 11, 12, 13, 14]);
    for (const [n, error] of worst) expect(error, `n = ${n}`).toBeLessThan(1e-3);
    expect(worst.get(14)!).toBeLessThan(worst.get(10)!);
  });

  it('is symmetric in rho, 1 at rho = 0 and NaN outside its domain', () => {
    for (const n of [5, 9, 12, 40, 300]) {
      for (const rho of [0.1, 0.45, 0.8]) expect(spearmanTwoTailed(-rho, n)).toBeCloseTo(spearmanTwoTailed(rho, n), 12);
      expect(spearmanTwoTailed(0, n)).toBe(1);
    }
    expect(spearmanTwoTailed(1.2, 10)).toBeNaN();
    expect(spearmanTwoTailed(0.3, 2)).toBeNaN();
    expect(spearmanTwoTailed(0.3, 10.5)).toBeNaN();
    expect(spearmanTwoTailed(0.3, 2000)).toBeNaN();
  });
});
