import type { DocumentOutput, FindingOutput, Report, StatisticOutput, StreamedReport } from './model.js';
import { visibleLine } from './visible.js';
import { tableNotReadTag } from './tableNotRead.js';
import { countOf, crossesAlphaPhrase, documentResultsPhrase, documentsPhrase, findingsPhrase, noResultsMessage, resultsPhrase } from './wording.js';
import { appendAll, extremes } from '../arrays.js';

/**
 * A Markdown summary to paste into a review: the totals, then, for each
 * document with flags, its flagged results (location, the result as printed,
 * severity, rule and message); one line for each document without flags and
 * for each unreadable document; the caution last. Text from documents is
 * kept inert: results and paths go in code spans, messages are escaped so
 * that they cannot form links, emphasis or HTML. Control characters in
 * either are written as visible escapes (src/report/visible.ts), so a
 * summary printed in a terminal or pasted into a review shows what the
 * document holds and does nothing else.
 */

/**
 * A code span that holds any text: the fence is one backtick longer than the
 * longest run of backticks inside, and a space pads text that starts or ends
 * with a backtick (CommonMark strips one such space on each side).
 * Inside a code span a backslash is literal, so "\x1b" shows as written.
 */
export function codeSpan(text: string): string {
  const flat = visibleLine(text);
  const longest = extremes((flat.match(/`+/g) ?? []).map((run) => run.length))?.max ?? 0;
  const fence = '`'.repeat(longest + 1);
  const pad = flat.startsWith('`') || flat.endsWith('`') ? ' ' : '';
  return `${fence}${pad}${flat}${pad}${fence}`;
}

/**
 * Escapes text for inline Markdown: backslashes, backticks, emphasis,
 * brackets, and the `<` and `&` that could open HTML or an entity. A plain
 * "p < .05" stays readable. Controls are made visible first, so the
 * backslash of their escape is itself escaped and "\x1b" shows as written.
 */
export function escapeMarkdown(text: string): string {
  return visibleLine(text)
    .replace(/[\\`*_[\]~|#]/g, (c) => `\\${c}`)
    .replace(/<(?=[A-Za-z/!?])/g, '\\<')
    .replace(/&(?=[#A-Za-z])/g, '\\&');
}

function where(statistic: StatisticOutput): string {
  const page = statistic.location.page === null ? '' : `page ${statistic.location.page}, `;
  return `${page}line ${statistic.location.line}, column ${statistic.location.column}`;
}

function findingLine(finding: FindingOutput, indent: string): string {
  const crosses = finding.crossesAlpha ? ' (changes the conclusion at alpha)' : '';
  return `${indent}- **${finding.severity}** ${codeSpan(finding.rule)}${crosses}: ${escapeMarkdown(finding.message)}`;
}

function tablesNotReadLines(document: DocumentOutput, indent: string): string[] {
  return document.tablesNotRead.map((table) => {
    const page = table.location.page === null ? '' : `page ${table.location.page}, `;
    return `${indent}- **${tableNotReadTag(table)}** (${page}line ${table.location.line}): ${escapeMarkdown(table.message)}`;
  });
}

function flaggedDocument(document: DocumentOutput): string[] {
  const flagged = document.statistics.filter((s) => s.findings.length > 0);
  const noResults = noResultsMessage(document);
  const lines = [`### ${codeSpan(document.path)}`, '', `${documentResultsPhrase(document)}.${noResults === null ? '' : ` ${escapeMarkdown(noResults)}`}`, ''];
  if (document.findings.length > 0) {
    lines.push('- About the document as a whole:');
    for (const finding of document.findings) lines.push(findingLine(finding, '  '));
  }
  for (const statistic of flagged) {
    lines.push(`- ${where(statistic)}: ${codeSpan(statistic.text)}`);
    for (const finding of statistic.findings) lines.push(findingLine(finding, '  '));
  }
  appendAll(lines, tablesNotReadLines(document, ''));
  lines.push('');
  return lines;
}

function hasFlags(document: DocumentOutput): boolean {
  return document.findings.length > 0 || document.statistics.some((s) => s.findings.length > 0);
}

/** The Markdown summary of a report. */
export function formatMarkdown(report: Report): string {
  return [...markdownPieces({ caution: report.caution, summary: report.summary, documents: () => report.documents })].join('');
}

/**
 * The Markdown summary a piece at a time: the totals, the flagged documents, the documents without flags and
 * the unreadable ones (three passes over the documents, each read again), the caution last.
 */
export function* markdownPieces(report: StreamedReport): Iterable<string> {
  const { summary } = report;
  // Results (what was read) and findings (what the rules say of them) are counted apart.
  yield lines([
    '## plumbline audit summary',
    '',
    `**Totals:** ${documentsPhrase(summary)}; ${resultsPhrase(summary)}; ${findingsPhrase(summary)}; ` +
      `${crossesAlphaPhrase(summary) ?? 'no finding changes the conclusion at alpha'}; ` +
      `${countOf(summary.tablesNotRead, 'results table')} not read.`,
    '',
  ]);
  for (const document of report.documents()) if (document.status === 'checked' && hasFlags(document)) yield lines(flaggedDocument(document));
  let cleanSeen = false;
  for (const document of report.documents()) {
    if (document.status !== 'checked' || hasFlags(document)) continue;
    const block: string[] = cleanSeen ? [] : ['### Documents without flags', ''];
    cleanSeen = true;
    const noResults = noResultsMessage(document);
    block.push(`- ${codeSpan(document.path)}: ${noResults === null ? `${documentResultsPhrase(document)}.` : `0 results. ${escapeMarkdown(noResults)}`}`);
    appendAll(block, tablesNotReadLines(document, '  '));
    yield lines(block);
  }
  if (cleanSeen) yield lines(['']);
  let unreadableSeen = false;
  for (const document of report.documents()) {
    if (document.status !== 'unreadable') continue;
    const block: string[] = unreadableSeen ? [] : ['### Unreadable documents', ''];
    unreadableSeen = true;
    block.push(`- ${codeSpan(document.path)}: ${escapeMarkdown(document.error ?? 'no reason given')}`);
    yield lines(block);
  }
  if (unreadableSeen) yield lines(['']);
  yield `> ${escapeMarkdown(report.caution)}\n`;
}

/** Lines each ended by a line break. */
function lines(texts: string[]): string {
  return texts.map((text) => `${text}\n`).join('');
}
