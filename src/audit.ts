import { checkResults, type CheckedResult } from './checks/engine.js';
import type { ResolvedConfig } from './checks/config.js';
import { createLineIndex } from './scan/lines.js';
import { scanDocument, type ScannableDocument } from './scan/scanDocument.js';
import { plainTextDocument } from './documents/text.js';
import type { DocumentOutput, FindingOutput, StatisticOutput, TableNotReadOutput } from './report/model.js';
import { reported, reportedDown, reportedOrNull, reportedUp } from './report/reportedDigits.js';
import type { UnreadTable } from './scan/tables/index.js';
import { noResultsOf } from './report/wording.js';

/** Maps a text offset to its page, when the document has pages. */
export type PageOf = (offset: number) => number | null;

/** Maps a text offset to the line and column reported for it. */
type LineOf = (offset: number) => { line: number; column: number };

const SURROUNDING_CHARACTERS = 160;

/** Text around a result, cut at word boundaries where possible, for reports that show results in context. */
function surroundingsOf(text: string, start: number, end: number): { before: string; after: string } {
  let before = text.slice(Math.max(0, start - SURROUNDING_CHARACTERS), start);
  let after = text.slice(end, end + SURROUNDING_CHARACTERS);
  if (start > SURROUNDING_CHARACTERS) before = before.replace(/^\S*\s/, '');
  if (end + SURROUNDING_CHARACTERS < text.length) after = after.replace(/\s\S*$/, '');
  return { before, after };
}

function statisticOutput(
  checked: CheckedResult,
  text: string,
  lineOf: LineOf,
  pageOf: PageOf,
): StatisticOutput {
  const { result, recomputation, findings } = checked;
  const { line, column } = lineOf(result.start);
  return {
    kind: result.kind,
    ...(result.symbol ? { symbol: result.symbol } : {}),
    text: result.text,
    location: { page: pageOf(result.start), line, column, start: result.start, end: result.end },
    surroundings: surroundingsOf(text, result.start, result.end),
    df: result.df.map((df) => df.value),
    ...(result.dfFrom ? { dfFrom: result.dfFrom } : {}),
    value: result.value?.value ?? null,
    valueComparator: result.valueComparator,
    p: result.p
      ? { comparator: result.p.comparator, value: result.p.value.value, text: result.p.value.text, ...(result.p.fromMarks !== undefined ? { fromMarks: result.p.fromMarks } : {}) }
      : null,
    notSignificant: result.notSignificant,
    inTable: result.tableRow !== undefined,
    ...(result.alsoAt
      ? {
          alsoAt: result.alsoAt.map((place) => {
            const { line: alsoLine, column: alsoColumn } = lineOf(place.start);
            return { page: pageOf(place.start), line: alsoLine, column: alsoColumn, start: place.start, end: place.end };
          }),
        }
      : {}),
    effects: result.effects.map((effect) => ({
      kind: effect.kind,
      comparator: effect.comparator,
      value: effect.value.value,
      text: effect.value.text,
      interval: effect.interval
        ? { level: effect.interval.level, low: effect.interval.low.value, high: effect.interval.high.value }
        : null,
    })),
    // At the report's digits (reportedDigits.ts): the checks above ran on the full values.
    recomputed: {
      evaluable: recomputation.evaluable,
      reason: recomputation.reason,
      tails: recomputation.tails,
      p: reportedOrNull(recomputation.p),
      pLow: recomputation.pRange ? reportedDown(recomputation.pRange.low) : null,
      pHigh: recomputation.pRange ? reportedUp(recomputation.pRange.high) : null,
      partialEtaSquared: reportedOrNull(recomputation.partialEtaSquared),
      partialEtaSquaredLow: recomputation.partialEtaSquaredRange ? reportedDown(recomputation.partialEtaSquaredRange.low) : null,
      partialEtaSquaredHigh: recomputation.partialEtaSquaredRange ? reportedUp(recomputation.partialEtaSquaredRange.high) : null,
    },
    findings: findings.map(findingOutput),
  };
}

/**
 * A finding as the report holds it: the values its message was filled from
 * (`data`) are in its words already, and the numbers it carries are at the
 * report's digits.
 */
function findingOutput({ data: _filledFrom, ...finding }: CheckedResult['findings'][number]): FindingOutput {
  const { pDiscrepancy, rowImplies } = finding;
  return {
    ...finding,
    ...(pDiscrepancy ? { pDiscrepancy: { ...pDiscrepancy, factor: reportedOrNull(pDiscrepancy.factor) } } : {}),
    ...(rowImplies
      ? {
          rowImplies: {
            ...rowImplies,
            statistic: reported(rowImplies.statistic),
            statisticLow: reportedDown(rowImplies.statisticLow),
            statisticHigh: reportedUp(rowImplies.statisticHigh),
            p: reportedOrNull(rowImplies.p),
            pLow: rowImplies.pLow === null ? null : reportedDown(rowImplies.pLow),
            pHigh: rowImplies.pHigh === null ? null : reportedUp(rowImplies.pHigh),
          },
        }
      : {}),
  };
}

/** Why a table was not read in full, in words a researcher understands. */
function tableNotReadMessage(table: UnreadTable): string {
  const name = table.caption === null ? 'A results table' : `"${table.caption.replace(/\s+/g, ' ').slice(0, 80)}"`;
  const read = table.rowsRead > 0 ? ` ${table.rowsRead} of its ${table.rowsWithStatistic} rows with a statistic were read;` : '';
  switch (table.reason) {
    case 'no-statistic-column':
      return `${name} prints p-values but no test statistic, so nothing in it can be recomputed.`;
    case 'columns-not-recognised':
      return `${name} names a test statistic in its header in words plumbline does not read; its rows were not checked.`;
    case 'layout-not-recognised':
      return `${name} looks like a table of results, but its layout was not recognised as a table; its results were not read.`;
    case 'no-df':
      return `${name}:${read} ${table.rowsWithStatistic - table.rowsRead} statistics were not read because the table does not give their degrees of freedom (no df column, error row, header or note ties df to them).`;
    case 'read-without-df':
      return `${name}: ${table.rowsRead} statistics were read as printed but without degrees of freedom (no df column, error row, header or note ties df to them), so their p-values were not recomputed; only the checks that need no df were run.`;
    case 'cells-not-placed':
      return `${name}:${read} the other rows could not be put under the table's columns without guessing, so they were not read.`;
    case 'z-without-p':
      return `${name} has a z column without p-values; such a column may hold standard scores, so it was not read.`;
  }
}

function tableNotReadOutput(table: UnreadTable, lineOf: LineOf, pageOf: PageOf): TableNotReadOutput {
  const { line, column } = lineOf(table.start);
  return {
    location: { page: pageOf(table.start), line, column, start: table.start, end: table.end },
    caption: table.caption,
    reason: table.reason,
    rowsWithStatistic: table.rowsWithStatistic,
    rowsRead: table.rowsRead,
    message: tableNotReadMessage(table),
  };
}

/** Scans and checks plain text (pasted, or a .txt/.md file): tables and the reference list are found in the text. */
export function auditText(text: string, config: ResolvedConfig, path = '<text>'): DocumentOutput {
  return auditDocument({ ...plainTextDocument(path, 'text', text) }, config, path);
}

/** Scans and checks one document read by a reader. Pure: the document and settings in, the audit out. */
export function auditDocument(
  document: ScannableDocument & { pageOf?: PageOf; lineOf?: LineOf },
  config: ResolvedConfig,
  path = '<text>',
): DocumentOutput {
  const { text } = document;
  const pageOf = document.pageOf ?? (() => null);
  const scan = scanDocument(document);
  const checked = checkResults(text, scan, config);
  // A reader that rewrites its file's text (LaTeX) gives the file's lines; otherwise the text's own are reported.
  const lineOf = document.lineOf ?? createLineIndex(text);
  return {
    path,
    status: 'checked',
    alpha: scan.context.alpha?.value ?? config.defaultAlpha,
    statistics: checked.map((c) => statisticOutput(c, text, lineOf, pageOf)),
    findings: [],
    tablesNotRead: scan.tablesNotRead.map((table) => tableNotReadOutput(table, lineOf, pageOf)),
    // A document without results says why: an empty one (a scanned PDF without text) must not pass for a clean one.
    ...(checked.length === 0 ? { noResults: noResultsOf(/\S/.test(text)) } : {}),
  };
}

export { buildReport, summarise, unreadableDocument } from './report/build.js';
