import type { ReportedNumber } from '../scan/types.js';
import { roundingInterval } from '../stats/reportedNumber.js';
import type { Interval } from './recompute.js';

/**
 * True when a printed effect size is compatible with a recomputed range:
 * some value in the range rounds to what was printed (common practice:
 * effect sizes are rounded to the printed decimals; truncation is allowed
 * too, as for p-values).
 */
export function effectAgrees(printed: ReportedNumber, recomputed: Interval): boolean {
  const { low, high } = roundingInterval({ ...printed, value: Math.abs(printed.value) });
  const truncationAllowance = high - low; // one more half unit above: truncated values
  const slack = 1e-9;
  return recomputed.low <= high + truncationAllowance / 2 + slack && recomputed.high >= low - slack;
}
