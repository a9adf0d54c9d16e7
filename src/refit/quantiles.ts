import { studentizedRangeUpperTail } from '../stats/studentizedRange.js';
import { tUpperTail } from '../stats/tDistribution.js';
import { fUpperTail } from '../stats/fDistribution.js';

/**
 * Quantiles needed for confidence intervals (src/stats has the tails only).
 *
 * ## Method
 * Inversion of a decreasing upper-tail function by bracketing and bisection
 * (on a doubling bracket), to a relative width of 1e-13 in the quantile. The
 * tails are src/stats' tUpperTail and studentizedRangeUpperTail, which keep
 * relative accuracy in the far tail, so the root is well determined.
 *
 * ## References
 * - Press, W. H. et al. (2007). Numerical Recipes, 3rd ed., section 9.1
 *   (bracketing and bisection).
 */
function invertUpperTail(upper: (x: number) => number, target: number): number {
  let lo = 0;
  let hi = 1;
  while (upper(hi) > target) {
    lo = hi;
    hi *= 2;
    if (hi > 1e12) return Infinity;
  }
  for (let i = 0; i < 200 && hi - lo > 1e-13 * hi; i++) {
    const mid = 0.5 * (lo + hi);
    if (upper(mid) > target) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/** t such that P(T > t) = upperTail, for 0 < upperTail <= 0.5 (t >= 0). */
export function tQuantileUpper(upperTail: number, df: number): number {
  if (!(upperTail > 0 && upperTail <= 0.5)) return NaN;
  return invertUpperTail((x) => tUpperTail(x, df), upperTail);
}

/** q such that P(Q(k, df) > q) = upperTail (studentized range). */
export function studentizedRangeQuantileUpper(upperTail: number, k: number, df: number): number {
  if (!(upperTail > 0 && upperTail < 1)) return NaN;
  return invertUpperTail((x) => studentizedRangeUpperTail(x, k, df), upperTail);
}

/** f such that P(F(df1, df2) > f) = upperTail. */
export function fQuantileUpper(upperTail: number, df1: number, df2: number): number {
  if (!(upperTail > 0 && upperTail < 1)) return NaN;
  return invertUpperTail((x) => fUpperTail(x, df1, df2), upperTail);
}
