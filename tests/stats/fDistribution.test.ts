import { describe, expect, it } from 'vitest';
import { fCdf, fUpperTail } from '../../src/stats/fDistribution.js';
import { chiSquareUpperTail } from '../../src/stats/chiSquareDistribution.js';
import { loadFixture, relativeFailures, type Comparison } from './referenceFixtures.js';

interface FPoint { f: number; df1: number; df2: number; p: number; scipy: number; scipyRelErr: number }
interface FFixture { points: FPoint[]; skippedBecauseScipyOrReferenceUnderflows: number; versions: { scipy: string } }

// Reference: mpmath (50 and 80 digits agreeing) with SciPy 1.10.1 scipy.stats.f.sf stored beside it,
// via tests/fixtures/stats/gen_f.py.
const fixture = loadFixture<FFixture>('stats/f_upper_tail.json');

function comparisons(points: FPoint[], pick: (point: FPoint) => number): Comparison[] {
  return points.map((point) => ({
    label: `F=${point.f} df1=${point.df1} df2=${point.df2}`,
    computed: fUpperTail(point.f, point.df1, point.df2),
    reference: pick(point),
  }));
}

describe('fUpperTail against reference fixtures', () => {
  it('was generated with SciPy 1.10.1', () => {
    expect(fixture.versions.scipy).toBe('1.10.1');
  });

  it('covers df1 0.5..100, df2 1..1e6, F 1e-4..1e4 and p down to 1e-300', () => {
    const values = (key: keyof FPoint) => fixture.points.map((point) => point[key]);
    expect(Math.min(...values('df1'))).toBeLessThanOrEqual(0.5);
    expect(Math.max(...values('df1'))).toBeGreaterThanOrEqual(100);
    expect(Math.min(...values('df2'))).toBeLessThanOrEqual(1);
    expect(Math.max(...values('df2'))).toBeGreaterThanOrEqual(1e6);
    expect(Math.min(...values('f'))).toBeLessThanOrEqual(1e-4 * 1.0001);
    expect(Math.max(...values('f'))).toBeGreaterThanOrEqual(1e4 * 0.9999);
    expect(Math.min(...values('p'))).toBeLessThan(1e-299);
    expect(fixture.points.length).toBeGreaterThan(2000);
  });

  // Tolerance 1e-10 relative over the whole grid, every p from ~1 down to 1e-300.
  it('matches the mpmath reference to 1e-10 relative at every point', () => {
    expect(relativeFailures(comparisons(fixture.points, (point) => point.p), 1e-10)).toEqual([]);
  });

  // SciPy 1.10.1 (cephes fdtrc) itself is off by up to ~5e-9 near df2 = 1e6, so this
  // comparison uses only the points where SciPy agrees with mpmath to 1e-12.
  it('matches SciPy 1.10.1 scipy.stats.f.sf to 1e-10 relative where SciPy is accurate', () => {
    const accurate = fixture.points.filter((point) => point.scipyRelErr <= 1e-12);
    expect(accurate.length).toBeGreaterThan(1500);
    expect(relativeFailures(comparisons(accurate, (point) => point.scipy), 1e-10)).toEqual([]);
  });
});

describe('fUpperTail edge cases', () => {
  it('reproduces the F(1, 44) = 4.21 example to 1e-10 (SciPy 1.10.1 scipy.stats.f.sf gives 0.0461666749...)', () => {
    // Reference value from the brief's verified betainc(44/(44+4.21), 22, 0.5) = 0.04616667492021663.
    expect(Math.abs(fUpperTail(4.21, 1, 44) / 0.04616667492021663 - 1)).toBeLessThan(1e-10);
  });

  it('returns 1 at f <= 0 and 0 at f = Infinity', () => {
    expect(fUpperTail(0, 3, 20)).toBe(1);
    expect(fUpperTail(-1, 3, 20)).toBe(1);
    expect(fUpperTail(Infinity, 3, 20)).toBe(0);
  });

  it('returns NaN for invalid parameters', () => {
    for (const [f, df1, df2] of [[1, 0, 5], [1, 5, 0], [1, -2, 5], [NaN, 2, 5], [1, NaN, 5], [1, Infinity, 5]] as const) {
      expect(fUpperTail(f, df1, df2)).toBeNaN();
    }
  });

  it('treats df2 = Infinity as the chi-square limit and approaches it as df2 grows', () => {
    const limit = fUpperTail(2.5, 3, Infinity);
    expect(limit).toBe(chiSquareUpperTail(7.5, 3));
    expect(Math.abs(fUpperTail(2.5, 3, 1e9) / limit - 1)).toBeLessThan(1e-7);
  });

  it('has fCdf + fUpperTail = 1 (common practice: complementary tails)', () => {
    for (const [f, df1, df2] of [[0.3, 2, 7], [4.21, 1, 44], [12, 3.4, 55.5], [1.1, 100, 1e6]] as const) {
      expect(Math.abs(fCdf(f, df1, df2) + fUpperTail(f, df1, df2) - 1)).toBeLessThan(1e-14);
    }
  });

  // Closed form for df1 = 2 (Johnson, Kotz & Balakrishnan 1995, Continuous Univariate
  // Distributions vol. 2, ch. 27): P(F >= f) = (1 + 2f/df2)^(-df2/2). It reaches far below
  // machine epsilon, where a 1 - cdf evaluation would return 0.
  it('matches the df1 = 2 closed form, including p far below machine epsilon', () => {
    const comparisons = [[0.5, 7], [4, 30], [500, 200], [1e4, 150], [3, 1e6]].map(([f, df2]) => ({
      label: `F=${f} df1=2 df2=${df2}`,
      computed: fUpperTail(f!, 2, df2!),
      reference: Math.exp((-df2! / 2) * Math.log1p((2 * f!) / df2!)),
    }));
    expect(comparisons[2]!.reference).toBeLessThan(1e-70);
    expect(relativeFailures(comparisons, 1e-12)).toEqual([]);
  });
});
