import { loadJson } from './helpers.js';

/**
 * The arbitrary-precision reference behind the interval bounds and Tukey p
 * of tests/fixtures/refit/refit_tables.json and statsmodels_emmeans.json:
 * tests/fixtures/refit/refit_precision.json, written by
 * gen_refit_precision.py with mpmath 1.2.1 (t and F quantiles as roots of
 * the regularised incomplete beta at 50 digits; the studentized range upper
 * tail and its 0.95 point by a 30-digit double integral). Those two fixtures
 * take their quantiles from SciPy 1.10.1, whose t.ppf is off by about 2e-9
 * relative, and their Tukey p from SciPy's studentized_range.sf, which is
 * off by about 1.2e-14 absolute (4e-5 relative at p = 3e-10, 0 below 1e-14):
 * neither can hold a number to 1e-9 relative. Here a bound is rebuilt as
 * statsmodels' estimate +- the mpmath critical value times statsmodels' SE,
 * and a Tukey p is mpmath's wherever SciPy's p is below 1e-3 (the generator
 * computes all of those), SciPy's above (its absolute error is then below
 * 1e-11 relative).
 */
interface TQuantile { use: 'none' | 'bonferroni' | 'sidak'; comparisons: number | null; df: number; upperTail: number; value: number; scipy: number }
interface FQuantile { df1: number; df2: number; upperTail: number; value: number; scipy: number }
interface RangeQuantile { k: number; df: number; upperTail: number; value: number; scipy: number }
interface TukeyP { k: number; df: number; q: number; t: number; p: number; scipy: number }

export const precision = loadJson<{
  versions: { mpmath: string; scipy: string };
  level: number;
  tQuantiles: TQuantile[];
  fQuantiles: FQuantile[];
  studentizedRangeQuantiles: RangeQuantile[];
  tukeyP: TukeyP[];
}>('refit/refit_precision.json');

export const MPMATH = `mpmath ${precision.versions.mpmath}`;

function only<T>(found: T[], what: string): T {
  if (found.length !== 1) throw new Error(`refit_precision.json has ${found.length} entries for ${what}; run gen_refit_precision.py again`);
  return found[0]!;
}

/** The upper 0.025 point of t on df (95% intervals of means, contrasts, coefficients and unadjusted comparisons). */
export function tCritical(df: number): number {
  return only(precision.tQuantiles.filter((q) => q.use === 'none' && q.df === df), `t(0.025, ${df})`).value;
}

/**
 * The multiple of the SE in a family's simultaneous 95% interval: k means,
 * m comparisons, error df; Holm's intervals are Bonferroni's.
 */
export function familyCritical(adjust: string, k: number, m: number, df: number): number {
  switch (adjust) {
    case 'none':
    case 'lsd':
      return tCritical(df);
    case 'bonferroni':
    case 'holm':
      return only(precision.tQuantiles.filter((q) => q.use === 'bonferroni' && q.comparisons === m && q.df === df), `Bonferroni t, m = ${m}, df = ${df}`).value;
    case 'sidak':
      return only(precision.tQuantiles.filter((q) => q.use === 'sidak' && q.comparisons === m && q.df === df), `Šidák t, m = ${m}, df = ${df}`).value;
    case 'scheffe':
      return Math.sqrt((k - 1) * only(precision.fQuantiles.filter((q) => q.df1 === k - 1 && q.df2 === df), `F(0.05; ${k - 1}, ${df})`).value);
    case 'tukey':
      // With two means q(0.95; 2, df) / sqrt 2 is the t point exactly.
      if (k === 2) return tCritical(df);
      return only(precision.studentizedRangeQuantiles.filter((q) => q.k === k && q.df === df), `q(0.95; ${k}, ${df})`).value / Math.SQRT2;
    default:
      throw new Error(`no critical value for adjustment ${adjust}`);
  }
}

/** The reference interval: estimate +- critical SE. */
export function referenceBounds(estimate: number, se: number, critical: number): { lower: number; upper: number } {
  return { lower: estimate - critical * se, upper: estimate + critical * se };
}

/**
 * The reference Tukey p for |t| among k means on df: mpmath's where the
 * generator computed it, else SciPy's (given), which must then be at least
 * 1e-3 (the generator computes every smaller one).
 */
export function tukeyReferenceP(k: number, df: number, t: number, scipyP: number): { p: number; source: string } {
  const found = precision.tukeyP.filter((r) => r.k === k && r.df === df && Math.abs(r.t - Math.abs(t)) <= 1e-12 * Math.abs(t));
  if (found.length > 0) return { p: found[0]!.p, source: `${MPMATH} (30-digit integral)` };
  if (scipyP < 1e-3) throw new Error(`refit_precision.json has no Tukey p for k = ${k}, df = ${df}, t = ${t} (SciPy ${scipyP}); run gen_refit_precision.py again`);
  return { p: scipyP, source: `SciPy ${precision.versions.scipy} studentized_range.sf` };
}
