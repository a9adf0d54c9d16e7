import { describe, expect, it } from 'vitest';
import { noncentralityInterval, partialEtaSquaredInterval } from '../../src/stats/partialEtaSquaredInterval.js';
import { noncentralFCdf } from '../../src/stats/noncentralF.js';
import { partialEtaSquaredFromF } from '../../src/stats/effectSizes.js';
import { loadFixture, relativeFailures, type Comparison } from './referenceFixtures.js';

interface IntervalPoint {
  f: number; df1: number; df2: number; level: number;
  lambdaLow: number; lambdaHigh: number; low: number; high: number;
}
interface IntervalFixture { points: IntervalPoint[]; worstMpmathRelativeResidual: number; versions: { scipy: string } }

// Reference: the same inversion with SciPy 1.10.1 scipy.stats.ncf and scipy.optimize.brentq, every
// root re-checked with the mpmath series; via tests/fixtures/stats/gen_eta_interval.py.
const fixture = loadFixture<IntervalFixture>('stats/partial_eta_squared_interval.json');
const label = (point: IntervalPoint) => `F=${point.f} df1=${point.df1} df2=${point.df2} level=${point.level}`;

describe('partialEtaSquaredInterval against the SciPy inversion', () => {
  it('covers F 0.01..200, df1 1..10, df2 10..1000, levels .90 and .95, with zero ends', () => {
    expect(Math.min(...fixture.points.map((point) => point.f))).toBeLessThanOrEqual(0.01);
    expect(Math.max(...fixture.points.map((point) => point.f))).toBeGreaterThanOrEqual(200);
    expect(new Set(fixture.points.map((point) => point.level))).toEqual(new Set([0.9, 0.95]));
    expect(fixture.points.some((point) => point.low === 0)).toBe(true);
    expect(fixture.points.some((point) => point.high === 0)).toBe(true);
    expect(fixture.worstMpmathRelativeResidual).toBeLessThan(1e-11);
  });

  // Tolerance: 1e-9 relative on each nonzero endpoint (the reference roots come from brentq on
  // SciPy's ncf, whose residuals against mpmath are below 1e-11; the cdf's slope in lambda
  // turns that into about 1e-10 in lambda). Zero endpoints must be exactly zero.
  it('matches every endpoint to 1e-9 relative (exactly 0 where the reference is 0)', () => {
    const comparisons: Comparison[] = fixture.points.flatMap((point) => {
      const interval = partialEtaSquaredInterval(point.f, point.df1, point.df2, point.level);
      return [
        { label: `${label(point)} low`, computed: interval.low, reference: point.low },
        { label: `${label(point)} high`, computed: interval.high, reference: point.high },
      ];
    });
    expect(relativeFailures(comparisons, 1e-9)).toEqual([]);
  });
});

describe('partialEtaSquaredInterval properties', () => {
  it('puts the endpoints where the noncentral F cdf equals (1 +- level)/2', () => {
    const { low, high } = noncentralityInterval(4.21, 1, 44, 0.9);
    expect(low).toBeGreaterThan(0);
    expect(Math.abs(noncentralFCdf(4.21, 1, 44, low) - 0.95)).toBeLessThan(1e-12);
    expect(Math.abs(noncentralFCdf(4.21, 1, 44, high) - 0.05)).toBeLessThan(1e-12);
  });

  it('contains the point estimate and widens with the level (common practice)', () => {
    const point = partialEtaSquaredFromF(12.5, 2, 57);
    const ninety = partialEtaSquaredInterval(12.5, 2, 57);
    const ninetyFive = partialEtaSquaredInterval(12.5, 2, 57, 0.95);
    expect(ninety.low).toBeLessThan(point);
    expect(ninety.high).toBeGreaterThan(point);
    expect(ninetyFive.low).toBeLessThan(ninety.low);
    expect(ninetyFive.high).toBeGreaterThan(ninety.high);
  });

  it('gives [0, 0] at F = 0 and NaN for invalid input', () => {
    expect(partialEtaSquaredInterval(0, 2, 30)).toEqual({ low: 0, high: 0 });
    expect(partialEtaSquaredInterval(-1, 2, 30).low).toBeNaN();
    expect(partialEtaSquaredInterval(3, 0, 30).high).toBeNaN();
    expect(partialEtaSquaredInterval(3, 2, 30, 1).low).toBeNaN();
  });
});
