import type { ReportedNumber } from '../scan/types.js';
import { roundingInterval } from './reportedNumber.js';

/**
 * Granularity checks for summary statistics of integer-valued data: whether
 * a reported mean (GRIM) or standard deviation (GRIMMER) can arise at all
 * from n whole-number scores, or from the means of n people's answers to a
 * fixed number of integer-valued items.
 *
 * ## Method
 * GRIM (Brown & Heathers 2017): the mean of n integers is T / n for an
 * integer total T, so with `items` integer items per person the mean of the
 * item means is T / (n * items). A reported mean stands for the interval of
 * values that round to it (half a unit in the last written place on either
 * side, both ends included, so either rounding convention passes); the mean
 * is possible when some integer T has T / (n * items) in that interval. The
 * check says something only when n * items < 10^decimals; otherwise every
 * mean of that precision is possible (`informative` is false).
 *
 * GRIMMER (Anaya 2016, cited from memory): work with the per-person sums of
 * the items, x_j = items * (person j's item mean), which are integers. With
 * sum T = sum x_j and sample SD s (n - 1 denominator),
 *   Q = sum x_j^2 = (n - 1) s^2 + T^2 / n
 * must be an integer, and since x^2 and x have the same parity, Q and T must
 * have the same parity. For every T allowed by the mean's interval, the SD's
 * interval gives an interval of Q; the SD is possible when one of them holds
 * an integer of T's parity. Scale limits (which bound the largest possible
 * SD) are not used, so the check can only miss impossible SDs, never flag a
 * possible one.
 *
 * The nearest possible values are the closest totals below and above the
 * interval, rounded to the reported precision.
 *
 * ## References
 * - Brown, N. J. L. & Heathers, J. A. J. (2017). The GRIM test: a simple
 *   technique detects numerous anomalies in the reporting of results in
 *   psychology. Social Psychological and Personality Science 8, 363-369.
 * - Anaya, J. (2016). The GRIMMER test: a method for testing the validity
 *   of reported measures of variability. PeerJ Preprints 4:e2400 (cited
 *   from memory).
 */

export interface GrimOutcome {
  /** True when some whole-number total gives a mean that rounds to the reported one. */
  possible: boolean;
  /** False when every mean of this precision is possible for this n (the check says nothing). */
  informative: boolean;
  /** Closest possible means below and above the reported one, at its precision (when impossible). */
  nearest: string[];
}

export interface GrimmerOutcome {
  possible: boolean;
  /** False when the mean is itself impossible, or the check cannot decide (too many totals). */
  informative: boolean;
  nearest: string[];
}

/** Slack for floating-point products at the ends of a rounding interval. */
const SLACK = 1e-9;

/** Most whole-number totals tried by GRIMMER (more means the mean's precision allows many). */
const MAX_TOTALS = 200;

function validCount(count: number): boolean {
  return Number.isInteger(count) && count >= 1 && count <= 1e7;
}

/** The whole-number totals T with T / granularity inside [low, high] (at most `limit + 1` of them). */
function totalsWithin(low: number, high: number, granularity: number, limit: number): number[] {
  const first = Math.ceil(low * granularity - SLACK);
  const last = Math.floor(high * granularity + SLACK);
  const totals: number[] = [];
  for (let total = first; total <= last && totals.length <= limit; total++) totals.push(total);
  return totals;
}

function atPrecision(value: number, decimals: number): string {
  return value.toFixed(decimals);
}

/** GRIM: can the reported mean arise from n people's answers to `items` integer-valued items? */
export function grimTest(mean: ReportedNumber, n: number, items = 1): GrimOutcome {
  if (!validCount(n) || !validCount(items) || mean.exponent !== 0) return { possible: true, informative: false, nearest: [] };
  const granularity = n * items;
  const informative = granularity < 10 ** mean.decimals;
  const { low, high } = roundingInterval(mean);
  const possible = totalsWithin(low, high, granularity, 1).length > 0;
  if (possible) return { possible, informative, nearest: [] };
  const below = Math.floor(low * granularity + SLACK) / granularity;
  const above = Math.ceil(high * granularity - SLACK) / granularity;
  return { possible, informative, nearest: [atPrecision(below, mean.decimals), atPrecision(above, mean.decimals)] };
}

/** GRIMMER: can the reported SD arise, together with the reported mean, from n people's whole-number scores? */
export function grimmerTest(mean: ReportedNumber, sd: ReportedNumber, n: number, items = 1): GrimmerOutcome {
  const undecided = { possible: true, informative: false, nearest: [] };
  if (!validCount(n) || n < 2 || !validCount(items) || mean.exponent !== 0 || sd.exponent !== 0 || !(sd.value >= 0)) return undecided;
  const meanInterval = roundingInterval(mean);
  const sdInterval = roundingInterval(sd);
  const totals = totalsWithin(meanInterval.low * items, meanInterval.high * items, n, MAX_TOTALS);
  if (totals.length === 0 || totals.length > MAX_TOTALS) return undecided;
  const sdLow = Math.max(0, sdInterval.low) * items;
  const sdHigh = sdInterval.high * items;
  const squares = (total: number, s: number): number => (n - 1) * s * s + (total * total) / n;
  const parityMatch = (q: number, total: number): boolean => (((q - total) % 2) + 2) % 2 === 0;
  for (const total of totals) {
    const qLow = Math.ceil(squares(total, sdLow) - SLACK * Math.max(1, squares(total, sdLow)));
    const qHigh = Math.floor(squares(total, sdHigh) + SLACK * Math.max(1, squares(total, sdHigh)));
    for (let q = qLow; q <= qHigh; q++) if (parityMatch(q, total)) return { possible: true, informative: true, nearest: [] };
  }
  // Nearest possible SDs for the total closest to the reported mean.
  const total = totals.reduce((best, t) => (Math.abs(t / n - mean.value * items) < Math.abs(best / n - mean.value * items) ? t : best));
  const floorSquares = (total * total) / n;
  const sdOf = (q: number): number => Math.sqrt(Math.max(0, q - floorSquares) / (n - 1)) / items;
  let below = Math.ceil(squares(total, sdLow) - SLACK) - 1;
  while (below >= Math.ceil(floorSquares - SLACK) && !parityMatch(below, total)) below--;
  let above = Math.floor(squares(total, sdHigh) + SLACK) + 1;
  while (!parityMatch(above, total)) above++;
  const nearest: string[] = [];
  if (below >= Math.ceil(floorSquares - SLACK)) nearest.push(atPrecision(sdOf(below), sd.decimals));
  nearest.push(atPrecision(sdOf(above), sd.decimals));
  return { possible: false, informative: true, nearest };
}
