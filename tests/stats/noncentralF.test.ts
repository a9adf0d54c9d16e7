import { describe, expect, it } from 'vitest';
import { noncentralFCdf, noncentralFUpperTail } from '../../src/stats/noncentralF.js';
import { fCdf, fUpperTail } from '../../src/stats/fDistribution.js';
import { loadFixture, relativeFailures } from './referenceFixtures.js';

interface NcfPoint {
  f: number; df1: number; df2: number; lambda: number; cdf: number; upper: number;
  scipyCdf: number; scipyUpper: number; scipyCdfRelErr: number; scipyUpperRelErr: number;
}
interface NcfFixture { points: NcfPoint[]; versions: { scipy: string; mpmath: string } }

// Reference: mpmath Poisson-mixture series at 60 and 100 digits (agreeing to 1e-30), checked in the
// generator against a numerical integral of the density; SciPy 1.10.1 scipy.stats.ncf beside it.
// Source: tests/fixtures/stats/gen_noncentral_f.py.
const fixture = loadFixture<NcfFixture>('stats/noncentral_f.json');
const label = (point: NcfPoint) => `F=${point.f} df1=${point.df1} df2=${point.df2} lambda=${point.lambda}`;

describe('noncentral F against the mpmath reference', () => {
  it('covers df1 0.5..100, df2 1..1e5, lambda 0.01..5000, tails down to 1e-250', () => {
    const values = (key: keyof NcfPoint) => fixture.points.map((point) => point[key]);
    expect(Math.min(...values('df1'))).toBeLessThanOrEqual(0.5);
    expect(Math.max(...values('df1'))).toBeGreaterThanOrEqual(100);
    expect(Math.min(...values('df2'))).toBeLessThanOrEqual(1);
    expect(Math.max(...values('df2'))).toBeGreaterThanOrEqual(1e5);
    expect(Math.min(...values('lambda'))).toBeLessThanOrEqual(0.01);
    expect(Math.max(...values('lambda'))).toBeGreaterThanOrEqual(5000);
    expect(Math.min(...values('cdf'))).toBeLessThan(1e-250);
    expect(Math.min(...values('upper'))).toBeLessThan(1e-250);
  });

  // Tolerance 1e-10 relative for both tails at every point.
  it('noncentralFCdf matches to 1e-10 relative', () => {
    const comparisons = fixture.points.map((point) => ({
      label: label(point), computed: noncentralFCdf(point.f, point.df1, point.df2, point.lambda), reference: point.cdf,
    }));
    expect(relativeFailures(comparisons, 1e-10)).toEqual([]);
  });

  it('noncentralFUpperTail matches to 1e-10 relative', () => {
    const comparisons = fixture.points.map((point) => ({
      label: label(point), computed: noncentralFUpperTail(point.f, point.df1, point.df2, point.lambda), reference: point.upper,
    }));
    expect(relativeFailures(comparisons, 1e-10)).toEqual([]);
  });

  it('matches SciPy 1.10.1 scipy.stats.ncf.cdf to 1e-10 where SciPy agrees with mpmath to 1e-12', () => {
    const accurate = fixture.points.filter((point) => point.scipyCdfRelErr <= 1e-12);
    expect(accurate.length).toBeGreaterThan(300);
    const comparisons = accurate.map((point) => ({
      label: label(point), computed: noncentralFCdf(point.f, point.df1, point.df2, point.lambda), reference: point.scipyCdf,
    }));
    expect(relativeFailures(comparisons, 1e-10)).toEqual([]);
  });
});

describe('noncentral F edge cases', () => {
  it('reduces to the central F at lambda = 0', () => {
    expect(noncentralFCdf(2.3, 3, 40, 0)).toBe(fCdf(2.3, 3, 40));
    expect(noncentralFUpperTail(2.3, 3, 40, 0)).toBe(fUpperTail(2.3, 3, 40));
  });

  it('is continuous as lambda -> 0 (common practice)', () => {
    expect(Math.abs(noncentralFUpperTail(2.3, 3, 40, 1e-12) / fUpperTail(2.3, 3, 40) - 1)).toBeLessThan(1e-11);
  });

  it('handles f <= 0, f = Infinity and invalid parameters', () => {
    expect(noncentralFCdf(0, 2, 10, 3)).toBe(0);
    expect(noncentralFUpperTail(0, 2, 10, 3)).toBe(1);
    expect(noncentralFCdf(Infinity, 2, 10, 3)).toBe(1);
    expect(noncentralFUpperTail(Infinity, 2, 10, 3)).toBe(0);
    expect(noncentralFCdf(1, 2, 10, -1)).toBeNaN();
    expect(noncentralFCdf(1, 0, 10, 1)).toBeNaN();
    expect(noncentralFUpperTail(1, 2, NaN, 1)).toBeNaN();
    expect(noncentralFUpperTail(NaN, 2, 10, 1)).toBeNaN();
  });

  it('decreases in lambda at fixed f (the property the interval inversion relies on)', () => {
    let previous = 1;
    for (const lambda of [0, 0.5, 1, 2, 5, 10, 20, 50, 100]) {
      const cdf = noncentralFCdf(4.21, 1, 44, lambda);
      expect(cdf).toBeLessThan(previous);
      previous = cdf;
    }
  });
});
