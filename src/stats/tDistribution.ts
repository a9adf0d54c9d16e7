import { betaLowerFromRatio } from './incompleteBeta.js';
import { zTwoTailed, zUpperTail } from './normalDistribution.js';

/**
 * Student t tail probabilities, for integer or non-integer df (Welch).
 *
 * ## Method
 * P(|T| >= |t|) = I_x(df/2, 1/2) with x = df / (df + t^2) (Abramowitz &
 * Stegun 26.7.1, expressed as an incomplete beta function), evaluated through a directly computed incomplete beta tail at
 * the ratio (df/|t|) : |t|, which neither overflows for huge t nor forms
 * 1 - x. The one-tailed probability is half of it for t >= 0 and one minus
 * half of it for t < 0 (that value is at least 1/2, so nothing cancels).
 * df = +Infinity is the normal limit.
 *
 * Edge cases: t = 0 gives 1 (two-tailed) and 1/2 (one-tailed); t = +-Infinity
 * gives 0 two-tailed; df <= 0 or NaN, or t NaN, gives NaN. For |t| beyond
 * about 1e154 (df = 1) the ratio df/|t| : |t| makes x underflow and the
 * result is 0 although the true p (about 2/(pi |t|)) is representable.
 *
 * ## References
 * - Abramowitz, M. & Stegun, I. A. (1964). Handbook of Mathematical
 *   Functions, National Bureau of Standards AMS 55, formula 26.7.1 and
 *   26.5 (incomplete beta).
 * - DiDonato, A. R. & Morris, A. H. (1992). ACM Transactions on Mathematical
 *   Software 18(3), 360-373.
 */
export function tTwoTailed(t: number, df: number): number {
  if (!validDf(df) || Number.isNaN(t)) return NaN;
  if (df === Infinity) return zTwoTailed(t);
  const size = Math.abs(t);
  if (size === 0) return 1;
  if (size === Infinity) return 0;
  return betaLowerFromRatio(df / size, size, df / 2, 0.5);
}

/** One-tailed P(T >= t) for Student's t with df degrees of freedom (same method as tTwoTailed). */
export function tUpperTail(t: number, df: number): number {
  if (!validDf(df) || Number.isNaN(t)) return NaN;
  if (df === Infinity) return zUpperTail(t);
  const half = 0.5 * tTwoTailed(t, df);
  return t >= 0 ? half : 1 - half;
}

function validDf(df: number): boolean {
  return !Number.isNaN(df) && df > 0;
}
