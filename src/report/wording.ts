import type { DocumentOutput, NoResultsOutput, Summary } from './model.js';

/**
 * The words every human-readable report (console, Markdown, HTML) uses for
 * its counts, so they say the same thing the same way: results (what was
 * read) and findings (what the rules said about them) are counted apart,
 * and every count takes its noun in the right number ("1 result", "2
 * results", "0 findings").
 */

/** A count with its noun: "1 result", "2 results"; `many` for an irregular plural. */
export function countOf(count: number, one: string, many = `${one}s`): string {
  return `${count} ${count === 1 ? one : many}`;
}

/** "12 documents (11 checked, 1 unreadable)"; "1 document" when every document was read. */
export function documentsPhrase(summary: Summary): string {
  const documents = countOf(summary.documents, 'document');
  return summary.unreadable > 0 ? `${documents} (${summary.checked} checked, ${summary.unreadable} unreadable)` : documents;
}

/** "6 results (5 in text, 1 in tables), 2 of them flagged": what was read, and how many results carry a finding. */
export function resultsPhrase(summary: Summary): string {
  const results = `${countOf(summary.statistics, 'result')} (${summary.resultsInText} in text, ${summary.resultsInTables} in tables)`;
  if (summary.statistics === 0) return results;
  if (summary.flaggedStatistics === 0) return `${results}, none flagged`;
  const flagged = summary.flaggedStatistics === summary.statistics ? (summary.statistics === 1 ? 'flagged' : 'all flagged') : `${summary.flaggedStatistics} of them flagged`;
  return `${results}, ${flagged}`;
}

/** "3 findings (1 fail, 1 warn, 1 note)"; "0 findings". */
export function findingsPhrase(summary: Summary): string {
  const { fail, warn, note } = summary.findings;
  const total = fail + warn + note;
  return total === 0 ? countOf(0, 'finding') : `${countOf(total, 'finding')} (${fail} fail, ${warn} warn, ${note} note)`;
}

/** "1 finding changes the conclusion at alpha", "2 findings change ..."; null when none does. */
export function crossesAlphaPhrase(summary: Summary): string | null {
  if (summary.crossesAlpha === 0) return null;
  return `${countOf(summary.crossesAlpha, 'finding')} ${summary.crossesAlpha === 1 ? 'changes' : 'change'} the conclusion at alpha`;
}

/** "1 results table not read"; null when every results table was read. */
export function tablesNotReadPhrase(summary: Summary): string | null {
  return summary.tablesNotRead === 0 ? null : `${countOf(summary.tablesNotRead, 'results table')} not read`;
}

/** A document's own counts: "1 result, flagged", "6 results, 2 flagged", "6 results, none flagged", "0 results". */
export function documentResultsPhrase(document: DocumentOutput): string {
  const results = document.statistics.length;
  if (results === 0) return countOf(0, 'result');
  const flagged = document.statistics.filter((s) => s.findings.length > 0).length;
  const flags = flagged === 0 ? 'none flagged' : results === 1 ? 'flagged' : `${flagged} flagged`;
  return `${countOf(results, 'result')}, ${flags}`;
}

export const NO_TEXT_MESSAGE = 'The document holds no text to audit (a scanned PDF needs OCR first).';
export const NO_RESULTS_MESSAGE = 'No reported F, t, chi-square, r or z result was found in the document.';

/** Why a document that was read has no results, for the report: its text is empty, or none was found in it. */
export function noResultsOf(hasText: boolean): NoResultsOutput {
  return hasText ? { reason: 'none-found', message: NO_RESULTS_MESSAGE } : { reason: 'empty', message: NO_TEXT_MESSAGE };
}

/** What a report says of a document that was read and holds no result; null for any other document. */
export function noResultsMessage(document: DocumentOutput): string | null {
  if (document.status !== 'checked' || document.statistics.length > 0) return null;
  // JSON Lines written before documents said why carry no reason: nothing was found, at least.
  return document.noResults?.message ?? NO_RESULTS_MESSAGE;
}
