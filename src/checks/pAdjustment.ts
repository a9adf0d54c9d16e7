/**
 * p-values adjusted for multiple comparisons (Bonferroni, Holm, Šidák,
 * Tukey, Scheffé, FDR, or "corrected" / "adjusted"): where the text says a
 * result's p was adjusted, and what that allows.
 *
 * An adjustment is recognised in the result itself ("p_adj = .04"), in its
 * sentence or the sentence before, or in a document-wide statement ("All
 * post hoc comparisons were Bonferroni-corrected") that covers the result: a
 * statement about all p-values covers every result, one about post hoc or
 * pairwise comparisons covers t and z tests and F tests with df1 = 1.
 *
 * An adjusted p is never smaller than the unadjusted one. With the number of
 * comparisons m stated, it is recomputed from the unadjusted p over its
 * rounding range: Bonferroni min(1, m p); Šidák 1 - (1 - p)^m; Holm,
 * Hochberg, Benjamini-Hochberg and an unnamed adjustment anywhere from p to
 * min(1, m p), since their factor depends on the rank of p among the m
 * (Holm 1979; Hochberg 1988; Benjamini & Hochberg 1995: each lies between
 * the unadjusted and the Bonferroni p). Tukey, Scheffé, Dunnett and
 * Games-Howell p-values depend on the number of groups and their data, so
 * they are not recomputed from the statistic alone.
 */

import type { DocumentContext, PAdjustmentMethod, ReportedResult } from '../scan/types.js';
import { adjustmentName, readAdjustment, statedComparisons } from '../scan/pAdjustment.js';
import { pAgrees, printedPInterval } from './pAgreement.js';
import type { Interval, Recomputation } from './recompute.js';
import { sentenceAround, sentenceBefore } from './sentences.js';

export interface FoundAdjustment {
  method: PAdjustmentMethod;
  comparisons: number | null;
  /** The words that state it, as written. */
  statement: string;
  /** 'near': in the result, its sentence or the sentence before; 'document': a document-wide statement. */
  where: 'near' | 'document';
}

/** True when a document-wide statement of this scope covers the result. */
function covers(appliesTo: 'all' | 'post-hoc', result: ReportedResult): boolean {
  if (appliesTo === 'all') return true;
  return result.kind === 't' || result.kind === 'z' || (result.kind === 'F' && result.df[0]?.value === 1);
}

/** The adjustment the text states for this result, or null. */
export function adjustmentFor(result: ReportedResult, text: string, document: DocumentContext): FoundAdjustment | null {
  if (result.start < text.length) {
    const own = sentenceAround(text, result.start, Math.min(result.end, text.length));
    const previous = sentenceBefore(text, own.start);
    for (const sentence of previous === null ? [own] : [own, previous]) {
      const said = text.slice(sentence.start, sentence.end);
      const reading = readAdjustment(said, false);
      if (reading === null) continue;
      // The number of comparisons may be stated in the other sentence ("Three comparisons were made. ... (Bonferroni)").
      const comparisons = reading.comparisons ?? (previous === null ? null : statedComparisons(text.slice(previous.start, own.end)));
      return { method: reading.method, comparisons, statement: said, where: 'near' };
    }
  }
  const statements = (document.pAdjustments ?? []).filter((statement) => covers(statement.appliesTo, result));
  const before = statements.filter((statement) => statement.start < result.start).pop();
  const chosen = before ?? statements[0];
  if (chosen === undefined) return null;
  return { method: chosen.method, comparisons: chosen.comparisons, statement: chosen.text, where: 'document' };
}

/** The range of adjusted p that the unadjusted range allows, when it can be recomputed (m known, a method that m determines). */
export function adjustedPRange(method: PAdjustmentMethod, comparisons: number | null, unadjusted: Interval): Interval | null {
  if (comparisons === null || comparisons < 2) return null;
  const m = comparisons;
  switch (method) {
    case 'bonferroni':
      return { low: Math.min(1, m * unadjusted.low), high: Math.min(1, m * unadjusted.high) };
    case 'sidak':
      return { low: 1 - (1 - unadjusted.low) ** m, high: 1 - (1 - unadjusted.high) ** m };
    case 'holm':
    case 'hochberg':
    case 'fdr':
    case 'unspecified':
      return { low: unadjusted.low, high: Math.min(1, m * unadjusted.high) };
    default:
      return null;
  }
}

export type AdjustmentVerdict =
  /** No adjustment is stated for the result. */
  | { kind: 'none' }
  /** An adjustment is stated, but the printed p is smaller than the unadjusted p (or claims "p <" what the unadjusted p is not), which no adjustment explains. */
  | { kind: 'smaller'; adjustment: FoundAdjustment }
  /** The printed p is the adjusted p recomputed from the statistic. */
  | { kind: 'fits'; adjustment: FoundAdjustment; range: Interval }
  /** The printed p is larger than the unadjusted p, and the adjusted p cannot be recomputed. */
  | { kind: 'unverifiable'; adjustment: FoundAdjustment }
  /** The adjusted p was recomputed, and the printed p is neither it nor the unadjusted p. */
  | { kind: 'fits-neither'; adjustment: FoundAdjustment; range: Interval };

/**
 * What an adjustment says about a printed p (or "n.s.") that does not fit
 * the unadjusted p. Only a p that can be at least the unadjusted one is
 * explained: an adjusted p is never smaller, and "p < v" for an adjusted p
 * implies the same of the unadjusted p.
 */
export function judgeAdjustment(
  result: ReportedResult,
  recomputation: Recomputation,
  text: string,
  document: DocumentContext,
  alpha: number,
  allowTruncation: boolean,
): AdjustmentVerdict {
  const unadjusted = recomputation.pRange;
  if (!recomputation.evaluable || unadjusted === null) return { kind: 'none' };
  if (result.p === null && !result.notSignificant) return { kind: 'none' };
  const adjustment = adjustmentFor(result, text, document);
  if (adjustment === null) return { kind: 'none' };
  if (result.p !== null) {
    const { comparator } = result.p;
    if (comparator === '<' || comparator === '<=') return { kind: 'smaller', adjustment };
    if (comparator === '=' && printedPInterval(result.p, allowTruncation).high < unadjusted.low) return { kind: 'smaller', adjustment };
  }
  const range = adjustedPRange(adjustment.method, adjustment.comparisons, unadjusted);
  if (range === null) return { kind: 'unverifiable', adjustment };
  const fits = result.p === null ? range.high >= alpha : pAgrees(result.p, range, allowTruncation);
  return fits ? { kind: 'fits', adjustment, range } : { kind: 'fits-neither', adjustment, range };
}

/** The adjustment as a message names it: "Bonferroni for 3 comparisons". */
export function describeAdjustment(adjustment: FoundAdjustment): string {
  const name = adjustmentName(adjustment.method);
  return adjustment.comparisons === null ? name : `${name} for ${adjustment.comparisons} comparisons`;
}
