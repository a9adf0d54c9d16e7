import { betaUpperFromRatio, betaLowerFromRatio } from './incompleteBeta.js';
import { chiSquareUpperTail } from './chiSquareDistribution.js';

/**
 * Upper tail of the central F distribution, P(F >= f), for F(df1, df2).
 *
 * ## Method
 * P(F >= f) = 1 - I_x(df1/2, df2/2) with x = df1 f / (df1 f + df2)
 * (Abramowitz & Stegun 26.6.2), evaluated as a directly computed incomplete
 * beta tail (see incompleteBeta.ts), never as 1 - cdf, so p-values far below
 * machine epsilon keep their relative accuracy. Degrees of freedom may be
 * non-integer (Welch, Greenhouse-Geisser or Huynh-Feldt corrected df).
 *
 * Edge cases: f <= 0 gives 1 (the whole distribution lies at or above 0);
 * f = +Infinity gives 0; df2 = Infinity is the limit df1 F ~ chi-square(df1)
 * (an F whose error term is known); df1 <= 0 or infinite, df2 <= 0, or any
 * NaN gives NaN.
 *
 * ## References
 * - Abramowitz, M. & Stegun, I. A. (1964). Handbook of Mathematical
 *   Functions, National Bureau of Standards AMS 55, formula 26.6.2.
 * - DiDonato, A. R. & Morris, A. H. (1992). ACM Transactions on Mathematical
 *   Software 18(3), 360-373 (incomplete beta ratios).
 */
export function fUpperTail(f: number, df1: number, df2: number): number {
  if (!validDf(df1) || !(validDf(df2) || df2 === Infinity) || Number.isNaN(f)) return NaN;
  if (f <= 0) return 1;
  if (f === Infinity) return 0;
  if (df2 === Infinity) return chiSquareUpperTail(df1 * f, df1);
  return betaUpperFromRatio(df1 * f, df2, df1 / 2, df2 / 2);
}

/** Lower tail P(F <= f) of the central F distribution, computed directly (same method as fUpperTail). */
export function fCdf(f: number, df1: number, df2: number): number {
  if (!validDf(df1) || !validDf(df2) || Number.isNaN(f)) return NaN;
  if (f <= 0) return 0;
  if (f === Infinity) return 1;
  return betaLowerFromRatio(df1 * f, df2, df1 / 2, df2 / 2);
}

function validDf(df: number): boolean {
  return Number.isFinite(df) && df > 0;
}
