import { describe, expect, it } from 'vitest';
import { describeFactor, pDiscrepancy } from '../../src/checks/pDiscrepancy.js';
import type { Comparator, ReportedP } from '../../src/scan/types.js';
import { num } from './helpers.js';

// Recomputed ranges from SciPy 1.10.1 when these tests were written:
// F(2, 57) = 4.21: scipy.stats.f.sf(4.215, 2, 57) = 0.019624, f.sf(4.205, 2, 57) = 0.019796;
// t(28) = 2.21 two-tailed: 2 * t.sf(2.215, 28) = 0.035067, 2 * t.sf(2.205, 28) = 0.035836;
// t(58) = 1.80 two-tailed: 0.0763 to 0.0779 (2 * t.sf(1.805, 58), 2 * t.sf(1.795, 58)).
const F_2_57 = { low: 0.019624, high: 0.019796 };
const T_28 = { low: 0.035067, high: 0.035836 };
const T_58 = { low: 0.0763, high: 0.0779 };

function printed(text: string): ReportedP {
  const match = /^(<=|>=|=|<|>)\s*(.+)$/.exec(text)!;
  return { comparator: match[1] as Comparator, value: num(match[2]!), plural: false, start: 0, end: 0 };
}

describe('pDiscrepancy: how far a printed p is from the recomputed one', () => {
  it.each([
    // One unit from a p that would fit: .019 (truncated) or .020 (rounded) would.
    ['= .018', F_2_57, true, 'last-digit'],
    ['= .021', F_2_57, true, 'last-digit'],
    // Common practice: "p < .05" for .058 misses the bound by less than one unit of its last digit.
    ['< .05', { low: 0.058, high: 0.0585 }, true, 'last-digit'],
    // "p = .000" stands for less than .0005 (or .001 truncated); .0012 is one unit past.
    ['= .000', { low: 0.0012, high: 0.00121 }, true, 'last-digit'],
    ['= .012', F_2_57, true, 'moderate'],
    ['< .05', T_58, true, 'moderate'],
    // Factor 9.8: just short of an order of magnitude.
    ['= .002', F_2_57, true, 'moderate'],
    ['= .001', F_2_57, true, 'order-of-magnitude'],
    ['= .5', F_2_57, true, 'order-of-magnitude'],
    ['< .001', F_2_57, true, 'order-of-magnitude'],
    ['> .05', { low: 0.001, high: 0.0012 }, true, 'order-of-magnitude'],
    // One unit of a short p can be a factor of 10 or more: the order of magnitude wins.
    ['= .01', { low: 0.0004, high: 0.00041 }, true, 'order-of-magnitude'],
  ] as const)('p %s against [%o] is %s', (p, range, allowTruncation, size) => {
    expect(pDiscrepancy(printed(p), range, allowTruncation).size).toBe(size);
  });

  it('a p truncated instead of rounded, when truncation is not allowed: the last digit, and said to be truncated', () => {
    // .0351 to .0358 rounds to .035 or .036; ".03" is .035 truncated to two places.
    expect(pDiscrepancy(printed('= .03'), T_28, false)).toEqual({ size: 'last-digit', factor: expect.closeTo(0.035067 / 0.03, 6), truncated: true });
    expect(pDiscrepancy(printed('= .018'), F_2_57, true).truncated).toBe(false);
  });

  it('the factor: printed against the nearest recomputed p, at least 1; a printed zero counts as half a unit; none for a recomputed 0', () => {
    expect(pDiscrepancy(printed('= .5'), F_2_57, true).factor).toBeCloseTo(0.5 / 0.019796, 6);
    expect(pDiscrepancy(printed('= .001'), F_2_57, true).factor).toBeCloseTo(0.019624 / 0.001, 6);
    expect(pDiscrepancy(printed('= .000'), F_2_57, true).factor).toBeCloseTo(0.019624 / 0.0005, 6);
    expect(pDiscrepancy(printed('= .04'), { low: 0, high: 0 }, true)).toMatchObject({ size: 'order-of-magnitude', factor: null });
  });

  it('puts the factor in words', () => {
    expect([describeFactor(1.64), describeFactor(25.2), describeFactor(2.5e22), describeFactor(null)]).toEqual([
      'a factor of 1.6',
      'a factor of 25',
      'a factor of about 10^22',
      'many orders of magnitude',
    ]);
  });
});
