import { fUpperTail } from './fDistribution.js';
import { tTwoTailed } from './tDistribution.js';
import { partialEtaSquaredFromF } from './effectSizes.js';
import { monotoneImage, type NumberInterval } from './monotoneImage.js';

/**
 * Ranges of p-values and effect sizes for a statistic known only to its
 * rounding.
 *
 * ## Method
 * A reported "F(1, 44) = 4.21" stands for any F in [4.205, 4.215] (see
 * roundingInterval in reportedNumber.ts). P(F >= f) decreases in f and
 * partial eta squared increases in f, so each range is the image of the
 * interval under a monotone function (monotoneImage.ts): the ends map to the
 * ends. Likewise the two-tailed t p-value decreases in |t|; for a t interval
 * that straddles 0 the largest p is 1 (at t = 0).
 *
 * ## References
 * - Moore, R. E. (1966). Interval Analysis. Prentice-Hall.
 * - Lakens, D. (2013). Frontiers in Psychology 4, 863 (partial eta squared
 *   from F).
 */

/** Range {pLow, pHigh} of P(F >= f) for f in [fLow, fHigh] (fLow <= fHigh). */
export function fUpperTailRange(fLow: number, fHigh: number, df1: number, df2: number): { pLow: number; pHigh: number } {
  if (!(fLow <= fHigh)) return { pLow: NaN, pHigh: NaN };
  const image = monotoneImage((f) => fUpperTail(f, df1, df2), fLow, fHigh);
  return { pLow: image.low, pHigh: image.high };
}

/** Range {pLow, pHigh} of the two-tailed t p-value for t in [tLow, tHigh]. */
export function tTwoTailedRange(tLow: number, tHigh: number, df: number): { pLow: number; pHigh: number } {
  if (!(tLow <= tHigh)) return { pLow: NaN, pHigh: NaN };
  const straddlesZero = tLow <= 0 && tHigh >= 0;
  const smallest = straddlesZero ? 0 : Math.min(Math.abs(tLow), Math.abs(tHigh));
  const largest = Math.max(Math.abs(tLow), Math.abs(tHigh));
  // p decreases in |t|: the largest |t| gives the smallest p.
  const image = monotoneImage((size) => tTwoTailed(size, df), smallest, largest);
  return { pLow: image.low, pHigh: image.high };
}

/** Range of partial eta squared for F in [fLow, fHigh] with df (df1, df2). */
export function partialEtaSquaredRange(fLow: number, fHigh: number, df1: number, df2: number): NumberInterval {
  if (!(fLow <= fHigh)) return { low: NaN, high: NaN };
  return monotoneImage((f) => partialEtaSquaredFromF(f, df1, df2), Math.max(0, fLow), fHigh);
}
