import { describe, expect, it } from 'vitest';
import { chiSquareUpperTail } from '../../src/stats/chiSquareDistribution.js';
import { zTwoTailed, zUpperTail } from '../../src/stats/normalDistribution.js';
import { loadFixture, relativeFailures } from './referenceFixtures.js';

interface ChiPoint { x: number; df: number; p: number; scipy: number; scipyRelErr: number }
interface ZPoint { z: number; pUpper: number; pTwoTailed: number; scipy: number; scipyRelErr: number }
interface Fixture<P> { points: P[]; versions: { scipy: string } }

// References: mpmath (50 and 80 digits agreeing) with SciPy 1.10.1 beside them, via
// tests/fixtures/stats/gen_chisquare.py and tests/fixtures/stats/gen_normal.py.
const chi = loadFixture<Fixture<ChiPoint>>('stats/chisquare_upper_tail.json');
const normal = loadFixture<Fixture<ZPoint>>('stats/normal_tails.json');

describe('chiSquareUpperTail', () => {
  it('fixture covers df 0.5..1e6, x 1e-4..1e4, p down to 1e-300', () => {
    expect(Math.min(...chi.points.map((point) => point.df))).toBeLessThanOrEqual(0.5);
    expect(Math.max(...chi.points.map((point) => point.df))).toBeGreaterThanOrEqual(1e6);
    expect(Math.min(...chi.points.map((point) => point.x))).toBeLessThanOrEqual(1e-4 * 1.0001);
    expect(Math.max(...chi.points.map((point) => point.x))).toBeGreaterThanOrEqual(1e4 * 0.9999);
    expect(Math.min(...chi.points.map((point) => point.p))).toBeLessThan(1e-290);
  });

  // Tolerance 1e-10 relative everywhere.
  it('matches mpmath to 1e-10 relative', () => {
    const comparisons = chi.points.map((point) => ({
      label: `chi2=${point.x} df=${point.df}`, computed: chiSquareUpperTail(point.x, point.df), reference: point.p,
    }));
    expect(relativeFailures(comparisons, 1e-10)).toEqual([]);
  });

  it('matches SciPy 1.10.1 scipy.stats.chi2.sf to 1e-10 where SciPy agrees with mpmath to 1e-12', () => {
    const accurate = chi.points.filter((point) => point.scipyRelErr <= 1e-12);
    expect(accurate.length).toBeGreaterThan(300);
    const comparisons = accurate.map((point) => ({
      label: `chi2=${point.x} df=${point.df}`, computed: chiSquareUpperTail(point.x, point.df), reference: point.scipy,
    }));
    expect(relativeFailures(comparisons, 1e-10)).toEqual([]);
  });

  // Closed form for df = 2: P(X >= x) = exp(-x/2) (common practice).
  it('matches exp(-x/2) at df = 2 and handles edges', () => {
    expect(Math.abs(chiSquareUpperTail(7.3, 2) / Math.exp(-3.65) - 1)).toBeLessThan(1e-14);
    expect(chiSquareUpperTail(0, 3)).toBe(1);
    expect(chiSquareUpperTail(Infinity, 3)).toBe(0);
    expect(chiSquareUpperTail(1, 0)).toBeNaN();
    expect(chiSquareUpperTail(NaN, 2)).toBeNaN();
  });
});

describe('zUpperTail and zTwoTailed', () => {
  it('fixture covers z from -10 to 36.5 (P ~ 1e-291) and p down to 1e-300', () => {
    expect(Math.min(...normal.points.map((point) => point.z))).toBeLessThanOrEqual(-10);
    expect(Math.max(...normal.points.map((point) => point.z))).toBeGreaterThan(36.5);
    expect(Math.min(...normal.points.map((point) => point.pUpper))).toBeLessThan(1e-290);
  });

  // Tolerance 1e-10 relative everywhere.
  it('match mpmath to 1e-10 relative', () => {
    const comparisons = normal.points.flatMap((point) => [
      { label: `z=${point.z} upper`, computed: zUpperTail(point.z), reference: point.pUpper },
      { label: `z=${point.z} two-tailed`, computed: zTwoTailed(point.z), reference: point.pTwoTailed },
    ]);
    expect(relativeFailures(comparisons, 1e-10)).toEqual([]);
  });

  it('match SciPy 1.10.1 scipy.stats.norm.sf to 1e-10 relative', () => {
    const comparisons = normal.points.map((point) => ({
      label: `z=${point.z}`, computed: zUpperTail(point.z), reference: point.scipy,
    }));
    expect(relativeFailures(comparisons, 1e-10)).toEqual([]);
  });

  // Common practice: P(Z >= 1.959963984540054) = 0.025.
  it('gives 0.025 above 1.959963984540054 and handles infinities', () => {
    expect(Math.abs(zUpperTail(1.959963984540054) / 0.025 - 1)).toBeLessThan(1e-12);
    expect(zUpperTail(Infinity)).toBe(0);
    expect(zUpperTail(-Infinity)).toBe(1);
    expect(zTwoTailed(NaN)).toBeNaN();
  });
});
