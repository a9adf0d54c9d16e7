import type { ReportedP } from '../scan/types.js';
import { halfUnitInLastPlace } from '../stats/reportedNumber.js';
import type { Interval } from './recompute.js';

/**
 * The interval of true p-values that a printed "p = v" stands for.
 *
 * Common practice: rounding to the printed decimals; with `allowTruncation`
 * also truncation, which some software and authors use ("p = .04" for .0496).
 * "p = .000" stands for anything that rounds (or truncates) to zero.
 */
export function printedPInterval(printed: ReportedP, allowTruncation: boolean): Interval {
  const half = halfUnitInLastPlace(printed.value);
  const value = printed.value.value;
  return { low: Math.max(0, value - half), high: value + (allowTruncation ? 2 * half : half) };
}

/** Relative slack so that values equal up to floating point rounding count as equal. */
function slack(value: number): number {
  return 1e-9 * Math.max(Math.abs(value), 1e-300);
}

/** True when some p in `recomputed` is compatible with what was printed. */
export function pAgrees(printed: ReportedP, recomputed: Interval, allowTruncation: boolean): boolean {
  const value = printed.value.value;
  switch (printed.comparator) {
    case '=': {
      const stated = printedPInterval(printed, allowTruncation);
      return recomputed.low <= stated.high + slack(stated.high) && recomputed.high >= stated.low - slack(stated.low);
    }
    // An inequality is read leniently: "p < .05" also accepts a p that rounds to .05 at the printed precision.
    case '<':
    case '<=':
      // "p < .0000" (output that printed a rounded zero with a "<") claims what "p = .0000" claims.
      if (value === 0) return pAgrees({ ...printed, comparator: '=' }, recomputed, allowTruncation);
      return recomputed.low <= value + slack(value);
    case '>':
    case '>=':
      return recomputed.high >= value - slack(value);
  }
}

/** Whether the printed p claims significance at alpha: true, false, or null when it does not say. */
export function printedSignificance(printed: ReportedP | null, notSignificant: boolean, alpha: number): boolean | null {
  if (!printed) return notSignificant ? false : null;
  const value = printed.value.value;
  switch (printed.comparator) {
    case '=':
      return value < alpha ? true : value > alpha ? false : null;
    case '<':
    case '<=':
      return value <= alpha ? true : null;
    case '>':
    case '>=':
      return value >= alpha ? false : null;
  }
}

/** Whether the recomputed p is significant at alpha over its whole rounding range, or null when it straddles alpha. */
export function recomputedSignificance(recomputed: Interval, alpha: number): boolean | null {
  if (recomputed.high < alpha) return true;
  if (recomputed.low >= alpha) return false;
  return null;
}

export function crossesAlpha(printed: boolean | null, recomputed: boolean | null): boolean {
  return printed !== null && recomputed !== null && printed !== recomputed;
}
