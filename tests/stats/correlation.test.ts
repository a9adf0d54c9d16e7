import { describe, expect, it } from 'vitest';
import { rToT, rTwoTailed } from '../../src/stats/correlation.js';
import { tTwoTailed } from '../../src/stats/tDistribution.js';
import { loadFixture, relativeFailures } from './referenceFixtures.js';

interface RPoint { r: number; df: number; p: number; scipy: number; scipyRelErr: number }
interface RFixture { points: RPoint[]; versions: { scipy: string } }

// Reference: mpmath I_{1-r^2}(df/2, 1/2) (50 and 80 digits agreeing), SciPy 1.10.1 via t beside it,
// from tests/fixtures/stats/gen_t.py.
const fixture = loadFixture<RFixture>('stats/r_two_tailed.json');

describe('rTwoTailed against reference fixtures', () => {
  it('covers |r| from 1e-4 to 1 - 1e-12 of both signs and df 0.5..1e6', () => {
    const sizes = fixture.points.map((point) => Math.abs(point.r));
    expect(Math.min(...sizes)).toBeLessThanOrEqual(1e-4);
    expect(Math.max(...sizes)).toBeGreaterThan(1 - 1e-11);
    expect(fixture.points.some((point) => point.r < 0)).toBe(true);
    expect(Math.min(...fixture.points.map((point) => point.df))).toBeLessThanOrEqual(0.5);
    expect(Math.max(...fixture.points.map((point) => point.df))).toBeGreaterThanOrEqual(1e6);
  });

  // Tolerance 1e-10 relative everywhere.
  it('matches mpmath to 1e-10 relative', () => {
    const comparisons = fixture.points.map((point) => ({
      label: `r=${point.r} df=${point.df}`, computed: rTwoTailed(point.r, point.df), reference: point.p,
    }));
    expect(relativeFailures(comparisons, 1e-10)).toEqual([]);
  });

  it('matches SciPy 1.10.1 (2 * scipy.stats.t.sf of the converted t) where SciPy is accurate to 1e-12', () => {
    const accurate = fixture.points.filter((point) => point.scipyRelErr <= 1e-12);
    expect(accurate.length).toBeGreaterThan(150);
    const comparisons = accurate.map((point) => ({
      label: `r=${point.r} df=${point.df}`, computed: rTwoTailed(point.r, point.df), reference: point.scipy,
    }));
    expect(relativeFailures(comparisons, 1e-10)).toEqual([]);
  });
});

describe('rToT and rTwoTailed', () => {
  it('equals the t test on t = r sqrt(df / (1 - r^2))', () => {
    for (const [r, df] of [[0.3, 28], [-0.62, 10], [0.05, 998]] as const) {
      expect(rToT(r, df)).toBeCloseTo(r * Math.sqrt(df / (1 - r * r)), 12);
      expect(Math.abs(rTwoTailed(r, df) / tTwoTailed(rToT(r, df), df) - 1)).toBeLessThan(1e-12);
    }
  });

  it('handles r = +-1, r = 0 and invalid input', () => {
    expect(rToT(1, 10)).toBe(Infinity);
    expect(rToT(-1, 10)).toBe(-Infinity);
    expect(rTwoTailed(-1, 10)).toBe(0);
    expect(rTwoTailed(0, 10)).toBe(1);
    expect(rToT(1.01, 10)).toBeNaN();
    expect(rTwoTailed(0.5, 0)).toBeNaN();
    expect(rTwoTailed(NaN, 5)).toBeNaN();
  });
});
