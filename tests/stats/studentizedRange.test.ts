import { describe, expect, it } from 'vitest';
import { studentizedRangeCdf, studentizedRangeUpperTail } from '../../src/stats/studentizedRange.js';
import { tTwoTailed } from '../../src/stats/tDistribution.js';
import { zTwoTailed } from '../../src/stats/normalDistribution.js';
import { loadFixture, relativeFailures } from './referenceFixtures.js';

interface RangePoint {
  q: number; k: number; df: number | 'Infinity'; cdf: number; upper: number;
  scipyCdf: number; scipyUpper: number; scipyCdfRelErr: number; scipyUpperRelErr: number;
}

// Reference: nested QUADPACK integration at epsrel 1e-13, checked against mpmath (df = Infinity) and a
// looser run (finite df); SciPy 1.10.1 scipy.stats.studentized_range stored beside it. Source:
// tests/fixtures/stats/gen_studentized_range.py.
const points = loadFixture<{ points: RangePoint[] }>('stats/studentized_range.json').points;
const dfOf = (point: RangePoint) => (point.df === 'Infinity' ? Infinity : point.df);
const label = (point: RangePoint) => `q=${point.q} k=${point.k} df=${point.df}`;

describe('studentized range against the reference fixture', () => {
  it('covers q 0.1..30, k 2..100, df 1..1000 and Infinity, upper tails below 1e-20', () => {
    const finiteDfs = points.map(dfOf).filter(Number.isFinite);
    expect(Math.min(...points.map((point) => point.q))).toBeLessThanOrEqual(0.1);
    expect(Math.max(...points.map((point) => point.q))).toBeGreaterThanOrEqual(30);
    expect(Math.min(...points.map((point) => point.k))).toBe(2);
    expect(Math.max(...points.map((point) => point.k))).toBe(100);
    expect(Math.min(...finiteDfs)).toBeLessThanOrEqual(1);
    expect(Math.max(...finiteDfs)).toBeGreaterThanOrEqual(1000);
    expect(points.some((point) => point.df === 'Infinity')).toBe(true);
    expect(Math.min(...points.map((point) => point.upper))).toBeLessThan(1e-20);
  });

  // Tolerance 1e-10 relative on both tails at every point (measured: 7e-14 for the cdf, 4e-14 for the upper tail;
  // refit's Tukey p are held to 1e-9 against mpmath in tests/stats/quantiles.test.ts and tests/refit).
  it('studentizedRangeCdf matches to 1e-10 relative', () => {
    const comparisons = points.map((point) => ({
      label: label(point), computed: studentizedRangeCdf(point.q, point.k, dfOf(point)), reference: point.cdf,
    }));
    expect(relativeFailures(comparisons, 1e-10)).toEqual([]);
  });

  it('studentizedRangeUpperTail matches to 1e-10 relative', () => {
    const comparisons = points.map((point) => ({
      label: label(point), computed: studentizedRangeUpperTail(point.q, point.k, dfOf(point)), reference: point.upper,
    }));
    expect(relativeFailures(comparisons, 1e-10)).toEqual([]);
  });

  it('matches SciPy 1.10.1 studentized_range.cdf to 1e-8 where SciPy agrees with the reference to 1e-10', () => {
    const accurate = points.filter((point) => point.scipyCdfRelErr <= 1e-10);
    expect(accurate.length).toBeGreaterThan(40);
    const comparisons = accurate.map((point) => ({
      label: label(point), computed: studentizedRangeCdf(point.q, point.k, dfOf(point)), reference: point.scipyCdf,
    }));
    expect(relativeFailures(comparisons, 1e-8)).toEqual([]);
  });
});

describe('studentized range identities and edges', () => {
  // For k = 2 the range of two normals is |Z1 - Z2| = sqrt(2) |Z|, so Q = sqrt(2) |T|:
  // P(Q >= q) = P(|T| >= q / sqrt(2)) (common practice; Tukey HSD with two groups is the t test).
  it('reduces to the two-tailed t test at k = 2', () => {
    const comparisons = [[3, 10], [1.2, 4.5], [6.5, 120], [4, Infinity]].map(([q, df]) => ({
      label: `q=${q} k=2 df=${df}`,
      computed: studentizedRangeUpperTail(q!, 2, df!),
      reference: df === Infinity ? zTwoTailed(q! / Math.SQRT2) : tTwoTailed(q! / Math.SQRT2, df!),
    }));
    expect(relativeFailures(comparisons, 1e-10)).toEqual([]);
  });

  it('has cdf + upper tail = 1', () => {
    for (const [q, k, df] of [[3.5, 4, 20], [0.8, 10, 5], [5, 3, Infinity]] as const) {
      expect(Math.abs(studentizedRangeCdf(q, k, df) + studentizedRangeUpperTail(q, k, df) - 1)).toBeLessThan(1e-12);
    }
  });

  it('handles q <= 0, q = Infinity and invalid parameters', () => {
    expect(studentizedRangeCdf(0, 3, 10)).toBe(0);
    expect(studentizedRangeUpperTail(-1, 3, 10)).toBe(1);
    expect(studentizedRangeUpperTail(Infinity, 3, 10)).toBe(0);
    expect(studentizedRangeCdf(2, 1, 10)).toBeNaN();
    expect(studentizedRangeCdf(2, 2.5, 10)).toBeNaN();
    expect(studentizedRangeUpperTail(2, 3, 0)).toBeNaN();
    expect(studentizedRangeUpperTail(NaN, 3, 10)).toBeNaN();
  });
});
