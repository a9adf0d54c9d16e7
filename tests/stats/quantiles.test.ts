import { describe, expect, it } from 'vitest';
import { fQuantileUpper, studentizedRangeQuantileUpper, tQuantileUpper } from '../../src/stats/quantiles.js';
import { studentizedRangeUpperTail } from '../../src/stats/studentizedRange.js';
import { loadFixture, relativeError, relativeFailures } from './referenceFixtures.js';

/**
 * Reference: tests/fixtures/refit/refit_precision.json, written by
 * tests/fixtures/refit/gen_refit_precision.py with mpmath 1.2.1: t and F
 * points as roots of the regularised incomplete beta at 50 digits, the
 * studentized range upper tail and its 0.95 point by a 30-digit double
 * integral (checked there against a finer evaluation to about 1e-18). These
 * are the critical values and Tukey p behind refit's intervals; SciPy
 * 1.10.1's values are stored beside them.
 */
interface Quantile { value: number; scipy: number; upperTail: number }
const fixture = loadFixture<{
  tQuantiles: Array<Quantile & { df: number; use: string; comparisons: number | null }>;
  fQuantiles: Array<Quantile & { df1: number; df2: number }>;
  studentizedRangeQuantiles: Array<Quantile & { k: number; df: number }>;
  tukeyP: Array<{ k: number; df: number; q: number; p: number; scipy: number }>;
}>('refit/refit_precision.json');

/** Brent's method stops at 1e-14 relative in x; the tails it inverts are good to about 1e-13. */
const QUANTILE_TOL = 1e-12;
/** src/stats/studentizedRange.ts states 4e-14 relative for the upper tail. */
const TAIL_TOL = 1e-11;

describe('quantiles against mpmath (refit_precision.json)', () => {
  it('covers t points from the 0.025 to the Bonferroni point of 28 comparisons, F and studentized range points up to k = 8', () => {
    expect(fixture.tQuantiles.length).toBeGreaterThanOrEqual(20);
    expect(Math.min(...fixture.tQuantiles.map((q) => q.upperTail))).toBeLessThan(0.001);
    expect(Math.max(...fixture.studentizedRangeQuantiles.map((q) => q.k))).toBe(8);
  });

  it(`tQuantileUpper to ${QUANTILE_TOL} relative`, () => {
    const comparisons = fixture.tQuantiles.map((q) => ({ label: `t tail=${q.upperTail} df=${q.df}`, computed: tQuantileUpper(q.upperTail, q.df), reference: q.value }));
    expect(relativeFailures(comparisons, QUANTILE_TOL)).toEqual([]);
  });

  it(`fQuantileUpper to ${QUANTILE_TOL} relative`, () => {
    const comparisons = fixture.fQuantiles.map((q) => ({ label: `F tail=${q.upperTail} df=${q.df1},${q.df2}`, computed: fQuantileUpper(q.upperTail, q.df1, q.df2), reference: q.value }));
    expect(relativeFailures(comparisons, QUANTILE_TOL)).toEqual([]);
  });

  it(`studentizedRangeQuantileUpper to ${QUANTILE_TOL} relative`, () => {
    const comparisons = fixture.studentizedRangeQuantiles.map((q) => ({ label: `q tail=${q.upperTail} k=${q.k} df=${q.df}`, computed: studentizedRangeQuantileUpper(q.upperTail, q.k, q.df), reference: q.value }));
    expect(relativeFailures(comparisons, QUANTILE_TOL)).toEqual([]);
  });

  it('SciPy 1.10.1 misses 1e-9 on some of these points, which is why the reference is mpmath', () => {
    const worst = Math.max(...fixture.tQuantiles.map((q) => relativeError(q.scipy, q.value)));
    expect(worst).toBeGreaterThan(1e-9);
  });
});

describe('studentized range upper tail against mpmath (refit_precision.json)', () => {
  it(`studentizedRangeUpperTail to ${TAIL_TOL} relative at every Tukey p of refit's fixtures, down to about 1e-17`, () => {
    expect(Math.min(...fixture.tukeyP.map((r) => r.p))).toBeLessThan(1e-15);
    const comparisons = fixture.tukeyP.map((r) => ({ label: `q=${r.q} k=${r.k} df=${r.df}`, computed: studentizedRangeUpperTail(r.q, r.k, r.df), reference: r.p }));
    expect(relativeFailures(comparisons, TAIL_TOL)).toEqual([]);
  });
});
