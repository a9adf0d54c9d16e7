import { describe, expect, it } from 'vitest';
import { pRangeOverDf } from '../../src/stats/pOverDf.js';

// Reference values from SciPy 1.x (Debian's python3-scipy), computed with:
//   stats.norm.sf(2.15), 2 * stats.t.sf(2.05, 1), stats.chi2.sf(3.95, 1), and for F the minimum and
//   maximum of stats.f.sf (stats.chi2.sf(df1 * f, df1) for df2 = inf) over the same df grid as pOverDf.ts,
//   halved and doubled as there.
describe('pRangeOverDf: the p-values a statistic can have over every df', () => {
  it('t: from half the normal two-tailed p at the largest |t| to df = 1 at the smallest', () => {
    const range = pRangeOverDf('t', { low: 2.05, high: 2.15 });
    expect(range.low).toBeCloseTo(0.0157776073910905, 12);
    expect(range.high).toBeCloseTo(0.28892606493901596, 12);
    expect(pRangeOverDf('t', { low: -2.15, high: -2.05 })).toEqual(range);
  });

  it('t spanning zero reaches p = 1', () => {
    expect(pRangeOverDf('t', { low: -0.005, high: 0.005 }).high).toBe(1);
  });

  it('chi-square: from df = 1 at the largest value up to 1', () => {
    const range = pRangeOverDf('chi2', { low: 3.85, high: 3.95 });
    expect(range.low).toBeCloseTo(0.04687136780338812, 12);
    expect(range.high).toBe(1);
  });

  it('F: an F below 1 cannot give a small p under any df', () => {
    const range = pRangeOverDf('F', { low: 0.905, high: 0.915 });
    expect(range.low).toBeCloseTo(0.16939562146606477, 10);
    expect(range.high).toBe(1);
  });

  it('F: a large F reaches tiny p-values but not p near 1', () => {
    const range = pRangeOverDf('F', { low: 4.205, high: 4.215 });
    expect(range.low).toBeLessThan(1e-40);
    expect(range.low).toBeGreaterThan(0);
    expect(range.high).toBeCloseTo(0.7462835400109007, 10);
  });
});
