/**
 * Effect sizes recovered from reported test statistics.
 *
 * ## Method
 * Each function inverts the textbook relation between a test statistic and
 * an effect size for one design, stated beside it. Inputs are what a
 * manuscript reports (F with its df, t with its df or group sizes), so a
 * reported effect size can be checked against the statistic it accompanies.
 *
 * - partialEtaSquaredFromF: eta_p^2 = F df1 / (F df1 + df2) (Lakens 2013,
 *   eq. 13; Cohen 1973). Any fixed-effects ANOVA effect whose F has error
 *   df2: one-way, factorial, or repeated measures (with the effect's own
 *   error term).
 * - partialOmegaSquaredFromF: omega_p^2 = df1 (F - 1) / (df1 (F - 1) + N)
 *   (Lakens 2013, eq. 17; Olejnik & Algina 2003). Between-subjects designs,
 *   N = total number of observations. Negative when F < 1 (kept, not
 *   truncated: truncating is a reporting choice).
 * - cohensFFromPartialEtaSquared: f = sqrt(eta^2 / (1 - eta^2)) (Cohen
 *   1988, eq. 8.2.22).
 * - rFromT: r = t / sqrt(t^2 + df) (Rosenthal 1991), point-biserial r for
 *   an independent-groups t test, or the r of a correlation test (df = n-2).
 * - cohensDFromTIndependent: d_s = t sqrt(1/n1 + 1/n2) (Lakens 2013, eq. 2),
 *   Student's pooled-variance t for two independent groups.
 * - cohensDzFromTPaired: d_z = t / sqrt(n) (Lakens 2013, eq. 7), paired or
 *   one-sample t with n pairs.
 * - adjustedRSquared: 1 - (1 - R^2)(N - 1) / (N - k - 1) for a model with an
 *   intercept and k = df1 predictors, N - k - 1 = df2 (as statsmodels'
 *   rsquared_adj computes it); R^2 itself is partialEtaSquaredFromF of the
 *   model's F (Cohen, Cohen, West & Aiken 2003, quoted from memory).
 *
 * ## References
 * - Lakens, D. (2013). Calculating and reporting effect sizes to facilitate
 *   cumulative science: a practical primer for t-tests and ANOVAs. Frontiers
 *   in Psychology 4, 863.
 * - Cohen, J. (1988). Statistical Power Analysis for the Behavioral
 *   Sciences, 2nd ed. Erlbaum.
 * - Olejnik, S. & Algina, J. (2003). Generalized eta and omega squared
 *   statistics. Psychological Methods 8(4), 434-447.
 * - Rosenthal, R. (1991). Meta-Analytic Procedures for Social Research,
 *   revised ed. Sage.
 */

/** Partial eta squared of an ANOVA effect from F(df1, df2); NaN for F < 0 or df <= 0. */
export function partialEtaSquaredFromF(f: number, df1: number, df2: number): number {
  if (!(f >= 0) || !(df1 > 0) || !(df2 > 0)) return NaN;
  if (f === Infinity) return 1;
  return (f * df1) / (f * df1 + df2);
}

/** Adjusted R² from R² and the model F's df (df1 = predictors, df2 = residual df); increasing in R². */
export function adjustedRSquared(rSquared: number, df1: number, df2: number): number {
  return 1 - ((1 - rSquared) * (df1 + df2)) / df2;
}

/** Partial omega squared for a between-subjects effect, F(df1, df2) with totalN observations. */
export function partialOmegaSquaredFromF(f: number, df1: number, df2: number, totalN: number): number {
  if (!(f >= 0) || !(df1 > 0) || !(df2 > 0) || !(totalN > 0) || !Number.isFinite(f)) return NaN;
  const excess = df1 * (f - 1);
  return excess / (excess + totalN);
}

/** Cohen's f from (partial) eta squared in [0, 1). */
export function cohensFFromPartialEtaSquared(etaSquared: number): number {
  if (!(etaSquared >= 0 && etaSquared <= 1)) return NaN;
  return Math.sqrt(etaSquared / (1 - etaSquared));
}

/** Correlation r (same sign as t) from t with df degrees of freedom. */
export function rFromT(t: number, df: number): number {
  if (Number.isNaN(t) || !(df > 0)) return NaN;
  if (!Number.isFinite(t)) return Math.sign(t);
  return t / Math.sqrt(t * t + df);
}

/** Cohen's d_s for two independent groups of sizes n1 and n2 from Student's t. */
export function cohensDFromTIndependent(t: number, n1: number, n2: number): number {
  if (Number.isNaN(t) || !(n1 > 0) || !(n2 > 0)) return NaN;
  return t * Math.sqrt(1 / n1 + 1 / n2);
}

/** Cohen's d_z for a paired (or one-sample) t test on n pairs. */
export function cohensDzFromTPaired(t: number, n: number): number {
  if (Number.isNaN(t) || !(n > 0)) return NaN;
  return t / Math.sqrt(n);
}
