import { noncentralFCdf, noncentralFUpperTail } from './noncentralF.js';
import { bracketDecreasingRoot, findRootBrent } from './rootFinding.js';

/**
 * Confidence interval for partial eta squared from an observed F, by
 * inverting the noncentral F distribution in its noncentrality parameter.
 *
 * ## Method
 * Steiger (2004), "confidence interval transformation principle": the cdf
 * P(F' <= f; df1, df2, lambda) decreases in lambda, so the two-sided
 * interval at confidence `level` has endpoints
 *   lambda_low:  P(F' <= f; lambda_low)  = (1 + level) / 2,
 *   lambda_high: P(F' <= f; lambda_high) = (1 - level) / 2,
 * with an endpoint set to 0 when the equation has no solution lambda >= 0
 * (the observed F is too small for the data to exclude lambda = 0 on that
 * side). Each endpoint maps monotonically to partial eta squared by
 *   eta^2 = lambda / (lambda + df1 + df2 + 1)
 * (Steiger 2004, eq. for partial eta squared with N = df1 + df2 + 1 in a
 * fixed-effects one-way or factorial ANOVA). The lower endpoint is solved on
 * the upper tail, P(F' >= f; lambda_low) = (1 - level)/2, which is computed
 * directly and avoids cancellation near 1. Roots are bracketed by doubling
 * and refined by Brent's method (rootFinding.ts) to relative tolerance 1e-13
 * in lambda.
 *
 * The default level 0.90 follows Steiger's advice for eta squared, whose
 * 90% two-sided interval matches a .05 one-sided F test.
 *
 * ## References
 * - Steiger, J. H. (2004). Beyond the F test: Effect size confidence
 *   intervals and tests of close fit in the analysis of variance and
 *   contrast analysis. Psychological Methods 9(2), 164-182.
 * - Brent, R. P. (1973). Algorithms for Minimization without Derivatives,
 *   chapter 4.
 */
export function partialEtaSquaredInterval(f: number, df1: number, df2: number, level = 0.9): { low: number; high: number } {
  const { low, high } = noncentralityInterval(f, df1, df2, level);
  const toEta = (lambda: number) => lambda / (lambda + df1 + df2 + 1);
  return { low: toEta(low), high: toEta(high) };
}

/**
 * The noncentrality interval [lambda_low, lambda_high] behind
 * partialEtaSquaredInterval; NaN endpoints for invalid input (f < 0 or NaN,
 * df <= 0, level outside (0, 1)).
 */
export function noncentralityInterval(f: number, df1: number, df2: number, level = 0.9): { low: number; high: number } {
  const invalid = { low: NaN, high: NaN };
  if (!(f >= 0 && Number.isFinite(f) && df1 > 0 && df2 > 0 && Number.isFinite(df1) && Number.isFinite(df2))) return invalid;
  if (!(level > 0 && level < 1)) return invalid;
  const tailProbability = (1 - level) / 2;
  // lambda_low: upper tail P(F' >= f) rises with lambda; solve P(F' >= f) = tail.
  const low = solveIncreasingInLambda((lambda) => noncentralFUpperTail(f, df1, df2, lambda), tailProbability, f, df1);
  // lambda_high: cdf P(F' <= f) falls with lambda; solve cdf = tail.
  const high = solveIncreasingInLambda((lambda) => -noncentralFCdf(f, df1, df2, lambda), -tailProbability, f, df1);
  return { low, high };
}

/** lambda >= 0 with increasingFn(lambda) = target, or 0 when increasingFn(0) >= target already. */
function solveIncreasingInLambda(increasingFn: (lambda: number) => number, target: number, f: number, df1: number): number {
  const gap = (lambda: number) => target - increasingFn(lambda);
  if (gap(0) <= 0) return 0;
  // E[F'] is about (df1 + lambda) / df1, so the root is near df1 * f; start the search on that scale.
  const bracket = bracketDecreasingRoot(gap, 0, Math.max(1, df1 * f));
  if (bracket === null) return NaN;
  return findRootBrent(gap, bracket.lower, bracket.upper, { relativeTolerance: 1e-13, absoluteTolerance: 1e-300 });
}
