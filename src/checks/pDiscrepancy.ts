import type { ReportedP } from '../scan/types.js';
import { halfUnitInLastPlace } from '../stats/reportedNumber.js';
import { printedPInterval } from './pAgreement.js';
import type { Interval } from './recompute.js';

/**
 * How large the gap is between a printed p and the p recomputed from the
 * statistic and df, for a p that does not agree (pAgrees is false):
 *
 * - `last-digit`: within one unit of the last printed digit of a p that
 *   would agree ("p = .018" where .0196 gives .020, or .019 truncated; "p =
 *   .03" for .0354 when truncation is not allowed; "p < .05" for .058): a
 *   p truncated instead of rounded, rounded the wrong way, or one digit
 *   mistyped by one;
 * - `order-of-magnitude`: the printed p and the nearest recomputed p are a
 *   factor of 10 or more apart ("p = .001" for .0196, "p < .001" for .02):
 *   a different result, not a rounding matter. This is judged first, since
 *   one unit of a short p can itself be a factor of 10 ("p = .01" for
 *   .0004);
 * - `moderate`: anything between.
 *
 * `truncated` says that the printed p is the recomputed p cut off at its
 * last printed digit instead of rounded (flagged only when the settings do
 * not allow truncation).
 *
 * `factor` is how many times larger the larger of the two is (at least 1):
 * the printed value ("p = .000" counts as half a unit of its last place),
 * against the recomputed p nearest to it; null when the recomputed p is 0
 * (below the smallest double), where no factor can be given.
 *
 * Common practice: a printed p stands for the values that round (or,
 * allowed by default, truncate) to it, and a slip in the last digit is the
 * smallest discrepancy a printed number can show.
 */
export type PDiscrepancySize = 'last-digit' | 'moderate' | 'order-of-magnitude';

export interface PDiscrepancy {
  size: PDiscrepancySize;
  factor: number | null;
  truncated: boolean;
}

/** Relative slack so that a gap of exactly one unit counts as one unit despite binary rounding. */
const SLACK = 1e-9;

/** The recomputed p nearest to what was printed, and the distance from it to the values the printed p allows. */
function nearest(printed: ReportedP, recomputed: Interval, allowTruncation: boolean): { p: number; gap: number } {
  const value = printed.value.value;
  switch (printed.comparator) {
    case '=': {
      const stated = printedPInterval(printed, allowTruncation);
      if (recomputed.high < stated.low) return { p: recomputed.high, gap: stated.low - recomputed.high };
      if (recomputed.low > stated.high) return { p: recomputed.low, gap: recomputed.low - stated.high };
      return { p: Math.min(Math.max(value, recomputed.low), recomputed.high), gap: 0 };
    }
    case '<':
    case '<=':
      // "p < .0000" claims what "p = .0000" claims (pAgrees reads it so).
      if (value === 0) return nearest({ ...printed, comparator: '=' }, recomputed, allowTruncation);
      return { p: recomputed.low, gap: Math.max(0, recomputed.low - value) };
    case '>':
    case '>=':
      return { p: recomputed.high, gap: Math.max(0, value - recomputed.high) };
  }
}

/** How far apart a printed p and the recomputed range are (see PDiscrepancySize). */
export function pDiscrepancy(printed: ReportedP, recomputed: Interval, allowTruncation: boolean): PDiscrepancy {
  const half = halfUnitInLastPlace(printed.value);
  const unit = 2 * half;
  const { p, gap } = nearest(printed, recomputed, allowTruncation);
  // A printed zero stands for something below half a unit: the factor is taken from that.
  const printedValue = printed.value.value === 0 ? half : printed.value.value;
  const low = Math.min(p, printedValue);
  const factor = low > 0 ? Math.max(p, printedValue) / low : null;
  const truncated = printed.comparator === '=' && Math.abs(Math.floor(p / unit + SLACK) * unit - printed.value.value) <= unit * SLACK;
  if (factor === null || factor >= 10 * (1 - SLACK)) return { size: 'order-of-magnitude', factor, truncated };
  if (gap <= unit * (1 + SLACK)) return { size: 'last-digit', factor, truncated };
  return { size: 'moderate', factor, truncated };
}

/** The factor in words for a message: "1.6", "13", "about 10^5". */
export function describeFactor(factor: number | null): string {
  if (factor === null) return 'many orders of magnitude';
  if (factor < 1000) return `a factor of ${Number(factor.toPrecision(2))}`;
  return `a factor of about 10^${Math.round(Math.log10(factor))}`;
}
