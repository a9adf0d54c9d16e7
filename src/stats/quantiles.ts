import { fUpperTail } from './fDistribution.js';
import { bracketDecreasingRoot, findRootBrent } from './rootFinding.js';
import { studentizedRangeUpperTail } from './studentizedRange.js';
import { tUpperTail } from './tDistribution.js';

/**
 * Upper quantiles (critical values) of t, F and the studentized range: the
 * x with P(X > x) = upperTail. Confidence intervals everywhere in plumbline
 * (post-hoc tests from group means, refit's marginal means, comparisons,
 * contrasts and coefficients) take their critical values from here.
 *
 * ## Method
 * Inversion of the directly computed upper tail (tDistribution.ts,
 * fDistribution.ts, studentizedRange.ts), which keeps its relative accuracy
 * in the far tail, so the root is well determined: an outward doubling
 * bracket from 0, then Brent's method to 1e-14 relative in x
 * (rootFinding.ts).
 *
 * Accuracy: the quantiles behind refit's intervals agree with an mpmath
 * reference (incomplete-beta roots at 50 digits; studentized range by a
 * 40-digit double integral) to better than 1e-12 relative:
 * tests/fixtures/refit/refit_precision.json, written by
 * gen_refit_precision.py and checked in tests/stats/quantiles.test.ts.
 *
 * Edge cases: an upperTail outside (0, 1) (t: outside (0, 0.5]) or invalid
 * df give NaN; a root beyond the bracket's reach gives NaN.
 *
 * ## References
 * - Brent, R. P. (1973). Algorithms for Minimization without Derivatives.
 *   Prentice-Hall, chapter 4.
 * - Press, W. H. et al. (2007). Numerical Recipes, 3rd ed., section 9.1
 *   (bracketing).
 */
function invertDecreasingTail(upperTail: (x: number) => number, target: number): number {
  const difference = (x: number) => upperTail(x) - target;
  const bracket = bracketDecreasingRoot(difference, 0, 1);
  if (bracket === null) return NaN;
  return findRootBrent(difference, bracket.lower, bracket.upper, { relativeTolerance: 1e-14 });
}

/** t >= 0 with P(T > t) = upperTail, for 0 < upperTail <= 0.5. */
export function tQuantileUpper(upperTail: number, df: number): number {
  if (!(upperTail > 0 && upperTail <= 0.5) || !(df > 0)) return NaN;
  if (upperTail === 0.5) return 0;
  return invertDecreasingTail((x) => tUpperTail(x, df), upperTail);
}

/** f with P(F(df1, df2) > f) = upperTail. */
export function fQuantileUpper(upperTail: number, df1: number, df2: number): number {
  if (!(upperTail > 0 && upperTail < 1) || !(df1 > 0) || !(df2 > 0)) return NaN;
  return invertDecreasingTail((x) => fUpperTail(x, df1, df2), upperTail);
}

/** q with P(Q(k, df) > q) = upperTail (studentized range). */
export function studentizedRangeQuantileUpper(upperTail: number, k: number, df: number): number {
  if (!(upperTail > 0 && upperTail < 1)) return NaN;
  return invertDecreasingTail((x) => studentizedRangeUpperTail(x, k, df), upperTail);
}
