/**
 * The scanner's entry point: finds every reported test result in a
 * manuscript's text and reads the document-wide context the checks need.
 *
 * Design for linear time: one sticky-free global regular expression with no
 * quantifiers finds candidate statistic symbols (a letter standing alone
 * and followed by a bracket, digit, space or comparator); a hand-written
 * parser with bounded lookahead then reads the few characters after each
 * candidate. Text consumed by one result is never read again as a candidate.
 */

import { readDocumentContext } from './context.js';
import { normaliseText, type NormalisedText } from './normalise.js';
import { readResult, type ResultDraft } from './result.js';
import type { ReportedEffect, ReportedP, ReportedResult, ScanOutput } from './types.js';

/**
 * Candidate statistic symbols in the normalised text: F, t, r, z, Z standing
 * alone; "chi" (from χ, "chi2", "chi-square"); "X2" / "X^2".
 */
const STATISTIC_ANCHOR =
  /(?<![A-Za-z0-9_])(?:[FtrzZ](?=[\s(\[{_0-9=<>s])|[Cc]hi(?=[-\s2^sS])|[Xx]\^?2(?=[\s(\[{]))/g;

/** Scans a manuscript's text (any size) for reported results and document context. */
export function scanText(text: string): ScanOutput {
  const normalised = normaliseText(text);
  return {
    results: findResults(normalised),
    context: readDocumentContext(normalised),
  };
}

/** All results in document order, with offsets into the original text. */
export function findResults(normalised: NormalisedText): ReportedResult[] {
  const source = normalised.text;
  const anchor = new RegExp(STATISTIC_ANCHOR.source, STATISTIC_ANCHOR.flags);
  const results: ReportedResult[] = [];
  for (let match = anchor.exec(source); match !== null; match = anchor.exec(source)) {
    const draft = readResult(source, match.index);
    if (draft === null) continue;
    results.push(toReportedResult(draft, normalised));
    // Whatever the result consumed (its p, effects, an "r" read as an effect size) is not a new candidate.
    if (draft.end > anchor.lastIndex) anchor.lastIndex = draft.end;
  }
  return results;
}

function toReportedResult(draft: ResultDraft, normalised: NormalisedText): ReportedResult {
  const start = normalised.toOriginal(draft.head.start);
  const end = normalised.toOriginalEnd(draft.end);
  return {
    kind: draft.head.kind,
    text: normalised.original.slice(start, end),
    start,
    end,
    df: draft.head.df,
    sampleSize: draft.head.sampleSize,
    value: draft.head.value,
    valueComparator: draft.head.valueComparator,
    p: draft.p === null ? null : mapP(draft.p, normalised),
    notSignificant: draft.notSignificant,
    effects: draft.effects.map((effect) => mapEffect(effect, normalised)),
  };
}

function mapP(p: ReportedP, normalised: NormalisedText): ReportedP {
  return { ...p, start: normalised.toOriginal(p.start), end: normalised.toOriginalEnd(p.end) };
}

function mapEffect(effect: ReportedEffect, normalised: NormalisedText): ReportedEffect {
  return { ...effect, start: normalised.toOriginal(effect.start), end: normalised.toOriginalEnd(effect.end) };
}
