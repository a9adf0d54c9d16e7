import { betaUpperFromRatio } from './incompleteBeta.js';

/**
 * Pearson correlation r as a t statistic, and its two-tailed p-value.
 *
 * ## Method
 * Under H0: rho = 0 with bivariate normal data, t = r sqrt(df / (1 - r^2))
 * has Student's t distribution with df = n - 2 (Fisher 1915; any textbook,
 * e.g. Howell, Statistical Methods for Psychology). 1 - r^2 is formed as
 * (1 - |r|)(1 + |r|) to keep its digits for |r| near 1. The two-tailed p
 * equals tTwoTailed(rToT(r, df), df) = I_{1-r^2}(df/2, 1/2); we evaluate the
 * incomplete beta at the ratio r^2 : (1 - r^2) directly, which avoids
 * rounding the intermediate t.
 *
 * Edge cases: r = +-1 gives t = +-Infinity and p = 0; |r| > 1, NaN, or df <= 0
 * or NaN gives NaN; r = 0 gives t = 0 and p = 1.
 *
 * ## References
 * - Fisher, R. A. (1915). Frequency distribution of the values of the
 *   correlation coefficient in samples from an indefinitely large
 *   population. Biometrika 10(4), 507-521.
 */
export function rToT(r: number, df: number): number {
  if (!validR(r) || !validDf(df)) return NaN;
  const size = Math.abs(r);
  if (size === 1) return r > 0 ? Infinity : -Infinity;
  return r * Math.sqrt(df / oneMinusRSquared(size));
}

/** Two-tailed p-value for a correlation r tested with df degrees of freedom (df = n - 2). */
export function rTwoTailed(r: number, df: number): number {
  if (!validR(r) || !validDf(df)) return NaN;
  const size = Math.abs(r);
  if (size === 1) return 0;
  if (size === 0) return 1;
  return betaUpperFromRatio(size * size, oneMinusRSquared(size), 0.5, df / 2);
}

function oneMinusRSquared(size: number): number {
  return (1 - size) * (1 + size);
}

function validR(r: number): boolean {
  return !Number.isNaN(r) && Math.abs(r) <= 1;
}

function validDf(df: number): boolean {
  return Number.isFinite(df) && df > 0;
}
