import type { PrintedEpsilon, ReportedResult } from '../scan/types.js';
import { partitionPoint } from '../sortedSearch.js';
import { roundingInterval } from '../stats/reportedNumber.js';
import { pAgrees } from './pAgreement.js';
import { dfInterval, pRangeOverBox, type Interval, type Recomputation } from './recompute.js';
import type { CheckContext } from './types.js';

/**
 * What a printed sphericity epsilon says about the F test beside it. A
 * correction multiplies both df of the uncorrected test by epsilon
 * (Greenhouse & Geisser 1959; Huynh & Feldt 1976), so printed corrected
 * df are whole numbers times one epsilon, and printed whole-number df with
 * epsilon < 1 are the uncorrected ones.
 */

/** How far from the F test an epsilon may be printed (characters), with no other result and no sentence end between. */
const LINK_REACH = 160;
/** A sentence end: a full stop, question or exclamation mark, then space and a capital or an opening bracket. */
const SENTENCE_END = /[.!?]\s+[A-Z(]/;
/** Largest uncorrected df tried when turning corrected df back into whole numbers. */
const MAX_WHOLE_DF = 100_000;

/** The epsilon printed with this F test (the nearest in its sentence, with no other result between), or null. */
export function linkedEpsilon(result: ReportedResult, context: Pick<CheckContext<unknown>, 'document' | 'results' | 'index' | 'text'>): PrintedEpsilon | null {
  const epsilons = context.document.epsilons ?? [];
  if (result.kind !== 'F' || result.df.length !== 2 || epsilons.length === 0) return null;
  const previous = context.results[context.index - 1];
  const next = context.results[context.index + 1];
  let best: PrintedEpsilon | null = null;
  let bestDistance = Infinity;
  // Epsilons are in text order: start at the first within reach, so the look-up stays logarithmic per result.
  for (let i = partitionPoint(epsilons.length, (j) => epsilons[j]!.end < result.start - LINK_REACH); i < epsilons.length; i++) {
    const epsilon = epsilons[i]!;
    if (epsilon.start > result.end + LINK_REACH) break;
    const before = epsilon.end <= result.start;
    const after = epsilon.start >= result.end;
    // Beyond the neighbouring result, or between the two and nearer to the neighbour ("F(...) = 3.10, p = .064,
    // epsilon = .81, and accuracy, F(...)": the epsilon is the first test's).
    if (before && previous !== undefined && (previous.end > epsilon.start || epsilon.start - previous.end < result.start - epsilon.end)) continue;
    if (after && next !== undefined && (next.start < epsilon.end || next.start - epsilon.end < epsilon.start - result.end)) continue;
    const between = before ? context.text.slice(epsilon.end, result.start) : after ? context.text.slice(result.end, epsilon.start) : '';
    if (SENTENCE_END.test(between)) continue;
    const distance = before ? result.start - epsilon.end : after ? epsilon.start - result.end : 0;
    if (distance < bestDistance) {
      best = epsilon;
      bestDistance = distance;
    }
  }
  return best;
}

export interface WholeDf {
  df1: number;
  df2: number;
}

/**
 * The whole-number df that one epsilon within the printed epsilon's rounding
 * turns into the printed (fractional) df, within their rounding; null when
 * none does. The pair closest to the printed df divided by the printed
 * epsilon is returned.
 */
export function uncorrectedDf(result: ReportedResult, epsilon: PrintedEpsilon): WholeDf | null {
  const [first, second] = result.df;
  if (!first || !second) return null;
  const e = roundingInterval(epsilon.value);
  const d1 = dfInterval(first);
  const d2 = dfInterval(second);
  const candidates = (d: Interval): number[] => {
    const low = Math.max(1, Math.ceil(d.low / e.high - 1e-9));
    const high = Math.min(MAX_WHOLE_DF, Math.floor(d.high / Math.max(e.low, 1e-9) + 1e-9));
    const out: number[] = [];
    for (let u = low; u <= high && out.length < 1000; u++) out.push(u);
    return out;
  };
  let best: WholeDf | null = null;
  let bestScore = Infinity;
  for (const u1 of candidates(d1)) {
    for (const u2 of candidates(d2)) {
      // One epsilon for both df: [e] meets [d1 / u1] and [d2 / u2].
      const low = Math.max(e.low, d1.low / u1, d2.low / u2);
      const high = Math.min(e.high, d1.high / u1, d2.high / u2);
      if (low > high + 1e-12) continue;
      const score = Math.abs(u1 * epsilon.value.value - first.value) + Math.abs(u2 * epsilon.value.value - second.value);
      if (score < bestScore) {
        best = { df1: u1, df2: u2 };
        bestScore = score;
      }
    }
  }
  return best;
}

/** The p range of the F at df given as intervals. */
export function pRangeAt(recomputation: Recomputation, df1: Interval, df2: Interval): Interval | null {
  if (!recomputation.statisticRange) return null;
  return pRangeOverBox('F', recomputation.statisticRange, [df1, df2]);
}

/** Whole-number df printed, epsilon < 1 printed beside them: the p range with both df times the printed epsilon. */
export function correctedRange(result: ReportedResult, recomputation: Recomputation, epsilon: PrintedEpsilon): { range: Interval; df1: Interval; df2: Interval } | null {
  const [first, second] = result.df;
  if (!first || !second || first.decimals !== 0 || second.decimals !== 0 || first.value < 2 || epsilon.value.value >= 1) return null;
  const e = roundingInterval(epsilon.value);
  const df1 = { low: first.value * e.low, high: first.value * e.high };
  const df2 = { low: second.value * e.low, high: second.value * e.high };
  const range = pRangeAt(recomputation, df1, df2);
  return range === null ? null : { range, df1, df2 };
}

/** True when a printed "p =" fits the df corrected by the printed epsilon and not the whole-number df printed. */
export function fitsOnlyWithPrintedEpsilon(result: ReportedResult, recomputation: Recomputation, epsilon: PrintedEpsilon | null, allowTruncation: boolean): boolean {
  if (epsilon === null || !result.p || result.p.comparator !== '=' || !recomputation.pRange) return false;
  const corrected = correctedRange(result, recomputation, epsilon);
  return corrected !== null && !pAgrees(result.p, recomputation.pRange, allowTruncation) && pAgrees(result.p, corrected.range, allowTruncation);
}
