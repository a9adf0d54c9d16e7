import { describe, expect, it } from 'vitest';
import { tTwoTailed, tUpperTail } from '../../src/stats/tDistribution.js';
import { zTwoTailed, zUpperTail } from '../../src/stats/normalDistribution.js';
import { loadFixture, relativeFailures } from './referenceFixtures.js';

interface TPoint {
  t: number; df: number; pOneTailed: number; pTwoTailed: number;
  scipyOneTailed: number; scipyTwoTailed: number; scipyRelErr: number;
}
interface TFixture { points: TPoint[]; versions: { scipy: string } }

// Reference: mpmath (50 and 80 digits agreeing), SciPy 1.10.1 scipy.stats.t.sf beside it,
// via tests/fixtures/stats/gen_t.py.
const fixture = loadFixture<TFixture>('stats/t_tails.json');
const label = (point: TPoint) => `t=${point.t} df=${point.df}`;

describe('t tails against reference fixtures', () => {
  it('covers df 0.5..1e6, |t| 1e-4..1e4 of both signs, p down to 1e-300', () => {
    const dfs = fixture.points.map((point) => point.df);
    const sizes = fixture.points.map((point) => Math.abs(point.t));
    expect(fixture.versions.scipy).toBe('1.10.1');
    expect(Math.min(...dfs)).toBeLessThanOrEqual(0.5);
    expect(Math.max(...dfs)).toBeGreaterThanOrEqual(1e6);
    expect(Math.min(...sizes)).toBeLessThanOrEqual(1e-4 * 1.0001);
    expect(Math.max(...sizes)).toBeGreaterThanOrEqual(1e4 * 0.9999);
    expect(fixture.points.some((point) => point.t < 0)).toBe(true);
    expect(Math.min(...fixture.points.map((point) => point.pTwoTailed))).toBeLessThan(1e-290);
  });

  // Tolerance 1e-10 relative everywhere.
  it('tTwoTailed matches mpmath to 1e-10 relative', () => {
    const comparisons = fixture.points.map((point) => ({
      label: label(point), computed: tTwoTailed(point.t, point.df), reference: point.pTwoTailed,
    }));
    expect(relativeFailures(comparisons, 1e-10)).toEqual([]);
  });

  it('tUpperTail matches mpmath to 1e-10 relative', () => {
    const comparisons = fixture.points.map((point) => ({
      label: label(point), computed: tUpperTail(point.t, point.df), reference: point.pOneTailed,
    }));
    expect(relativeFailures(comparisons, 1e-10)).toEqual([]);
  });

  // Only where SciPy 1.10.1 itself agrees with mpmath to 1e-12 (see scipyRelErr in the fixture).
  it('tUpperTail matches SciPy 1.10.1 scipy.stats.t.sf to 1e-10 where SciPy is accurate', () => {
    const accurate = fixture.points.filter((point) => point.scipyRelErr <= 1e-12);
    expect(accurate.length).toBeGreaterThan(300);
    const comparisons = accurate.map((point) => ({
      label: label(point), computed: tUpperTail(point.t, point.df), reference: point.scipyOneTailed,
    }));
    expect(relativeFailures(comparisons, 1e-10)).toEqual([]);
  });
});

describe('t tails: edge cases', () => {
  it('gives 1 two-tailed and 1/2 one-tailed at t = 0, and 0 at infinite t', () => {
    expect(tTwoTailed(0, 12)).toBe(1);
    expect(tUpperTail(0, 12)).toBe(0.5);
    expect(tTwoTailed(Infinity, 3)).toBe(0);
    expect(tTwoTailed(-Infinity, 3)).toBe(0);
    expect(tUpperTail(-Infinity, 3)).toBe(1);
  });

  // Closed form for df = 1 (Cauchy): P(T >= t) = 1/2 - atan(t)/pi (common practice).
  it('matches the Cauchy closed form at df = 1', () => {
    const comparisons = [0.1, 1, 3, 12.7].map((t) => ({
      label: `t=${t} df=1`, computed: tUpperTail(t, 1), reference: 0.5 - Math.atan(t) / Math.PI,
    }));
    expect(relativeFailures(comparisons, 1e-13)).toEqual([]);
  });

  it('is the normal limit at df = Infinity', () => {
    expect(tUpperTail(1.7, Infinity)).toBe(zUpperTail(1.7));
    expect(tTwoTailed(-2.2, Infinity)).toBe(zTwoTailed(-2.2));
  });

  it('returns NaN for df <= 0 or NaN inputs', () => {
    expect(tTwoTailed(1, 0)).toBeNaN();
    expect(tUpperTail(1, -3)).toBeNaN();
    expect(tTwoTailed(NaN, 5)).toBeNaN();
    expect(tUpperTail(1, NaN)).toBeNaN();
  });

  it('does not overflow for t = 1e150, where t^2 alone would be fine but df + t^2 loses df', () => {
    const p = tTwoTailed(1e150, 1);
    // df = 1: P(|T| >= t) = 1 - 2 atan(t)/pi ~ 2 / (pi t) for large t.
    expect(Math.abs(p / (2 / (Math.PI * 1e150)) - 1)).toBeLessThan(1e-12);
  });
});
