import type { ReportedResult } from '../scan/types.js';
import { pAgrees } from './pAgreement.js';
import { dfInterval, pRangeOverBox, type Interval, type Recomputation } from './recompute.js';

/** The recomputed p range halved, as a one-tailed (or wrongly halved) p would be. */
export function halvedRange(recomputation: Recomputation): Interval | null {
  const range = recomputation.pRange;
  return range ? { low: range.low / 2, high: range.high / 2 } : null;
}

/** True when the printed p does not fit the recomputed p but fits half of it. */
export function fitsOnlyWhenHalved(result: ReportedResult, recomputation: Recomputation, allowTruncation: boolean): boolean {
  const range = recomputation.pRange;
  const halved = halvedRange(recomputation);
  if (!result.p || !range || !halved) return false;
  // Only an equality is informative: "p < .05" fitting half of p = .08 says little.
  if (result.p.comparator !== '=') return false;
  return !pAgrees(result.p, range, allowTruncation) && pAgrees(result.p, halved, allowTruncation);
}

/**
 * The p range a sphericity correction can produce for an F with these df:
 * from epsilon = 1 (the printed df) to the lower bound epsilon = 1/df1
 * (Greenhouse & Geisser 1959), which gives the largest p.
 */
export function sphericityCorrectedRange(result: ReportedResult, recomputation: Recomputation): Interval | null {
  const [df1, df2] = result.df;
  if (result.kind !== 'F' || !df1 || !df2 || !recomputation.pRange || !recomputation.statisticRange) return null;
  if (df1.value < 2 || df1.decimals !== 0 || df2.decimals !== 0) return null;
  const epsilon = 1 / df1.value;
  const scaled = [dfInterval(df1), dfInterval(df2)].map(({ low, high }) => ({ low: low * epsilon, high: high * epsilon }));
  const atLowerBound = pRangeOverBox('F', recomputation.statisticRange, scaled);
  return { low: recomputation.pRange.low, high: atLowerBound.high };
}

/** True when a sphericity correction stated in the document explains a printed p larger than the uncorrected one. */
export function fitsOnlyWithSphericityCorrection(
  result: ReportedResult,
  recomputation: Recomputation,
  documentStatesCorrection: boolean,
  allowTruncation: boolean,
): boolean {
  if (!documentStatesCorrection || !result.p || !recomputation.pRange) return false;
  if (result.p.comparator !== '=' || result.p.value.value <= recomputation.pRange.high) return false;
  const corrected = sphericityCorrectedRange(result, recomputation);
  return corrected !== null && !pAgrees(result.p, recomputation.pRange, allowTruncation) && pAgrees(result.p, corrected, allowTruncation);
}
