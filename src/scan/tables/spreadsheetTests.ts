/**
 * t and z tests as a spreadsheet's analysis add-in prints them and theses
 * paste them: one statistic per row, the test's value in the row named
 * "t Stat" (or "z"), its df in the "df" row and its p in the two-tailed P row:
 *
 *     t-Test: Two-Sample Assuming Equal Variances
 *                            Variable 1   Variable 2
 *     Mean                   4.2          3.6
 *     df                     38
 *     t Stat                 2.31
 *     P(T<=t) one-tail       0.013
 *     P(T<=t) two-tail       0.026
 *
 * The rows may come with pipes, tabs, runs of spaces or single spaces; some
 * pages print two comparisons side by side, each value column one test. Only
 * the two-tailed p is taken (plumbline tests t and z two-tailed); without it
 * nothing is read. The test becomes a row "statistic | df | p" for the table
 * reader, each cell pointing at its place in the text.
 */

import type { CellSpan, DocumentTable } from '../../documents/types.js';
import type { TextLine } from './cells.js';
import { spanOfCell as span, tableOverLines } from './rebuilt.js';

type Line = TextLine;

/** The statistic's row: "t Stat", "t stat", "z", "z Stat". */
const STATISTIC_ROW = /^[ \t|]{0,12}(t|z)(?: {1,3}stat(?:istic)?)?[ \t|]{1,40}(?=[-\u2212.\d])/i;
/** The two-tailed p row: "P(T<=t) two-tail", "P(Z<=z) two-tail", "P(Z⇐z) Double tail". */
const TWO_TAILED_P_ROW = /^[ \t|]{0,12}P ?\( ?([TZ]) ?(?:<=|\u21d0|\u2264|<) ?[tz] ?\) ?(?:two[- ]tail(?:ed)?|double[- ]tail(?:ed)?|2[- ]tail(?:ed)?)[ \t|]{1,40}(?=[.\d])/i;
/** The df row. */
const DF_ROW = /^[ \t|]{0,12}df[ \t|]{1,40}(?=\d)/i;
/** A value cell. */
const VALUE = /^[-\u2212\u2013]?(?:\d+(?:\.\d+)?|\.\d+)(?:[eE][-+]?\d{1,3})?$/;
/** Lines around the statistic's row searched for its p and df rows. */
const REACH = 8;

interface Cell {
  text: string;
  start: number;
  end: number;
}

function valuesAfter(line: Line, from: number): Cell[] | null {
  const text = line.text;
  const pattern = text.includes('|') ? /[^|]+/g : text.includes('\t') ? /[^\t]+/g : /\S+/g;
  pattern.lastIndex = from;
  const cells: Cell[] = [];
  for (let match = pattern.exec(text); match !== null; match = pattern.exec(text)) {
    const inner = match[0].trim();
    if (inner === '') continue;
    if (!VALUE.test(inner)) return null;
    const start = line.start + match.index + match[0].indexOf(inner);
    cells.push({ text: inner, start, end: start + inner.length });
  }
  return cells.length > 0 ? cells : null;
}

/** The row among the lines around `center` (before the next statistic row) that `pattern` names, with its values. */
function rowNear(lines: Line[], center: number, pattern: RegExp, kind: string | null): { line: number; values: Cell[] } | null {
  for (let offset = 1; offset <= REACH; offset++) {
    for (const index of [center + offset, center - offset]) {
      const line = lines[index];
      if (line === undefined) continue;
      const match = pattern.exec(line.text);
      if (match === null || (kind !== null && match[1]!.toLowerCase() !== kind)) continue;
      const values = valuesAfter(line, match[0].length);
      if (values !== null) return { line: index, values };
    }
  }
  return null;
}

/** A spreadsheet's t or z test whose statistic row is `lines[index]`, or null. */
export function readSpreadsheetTest(lines: Line[], index: number): { table: DocumentTable; firstLine: number; lastLine: number } | null {
  const line = lines[index]!;
  const match = STATISTIC_ROW.exec(line.text);
  if (match === null) return null;
  const kind = match[1]!.toLowerCase() as 't' | 'z';
  const statistics = valuesAfter(line, match[0].length);
  if (statistics === null) return null;
  const p = rowNear(lines, index, TWO_TAILED_P_ROW, kind);
  if (p === null || p.values.length !== statistics.length) return null;
  const df = kind === 't' ? rowNear(lines, index, DF_ROW, null) : null;
  const rows: string[][] = [['Test', kind, 'df', 'p']];
  const cells: (CellSpan | null)[][] = [[null, null, null, null]];
  statistics.forEach((statistic, column) => {
    const dfCell = df !== null && df.values.length === statistics.length ? df.values[column]! : df !== null && column === 0 ? df.values[0]! : null;
    rows.push([statistics.length > 1 ? `${kind} test ${column + 1}` : `${kind} test`, statistic.text, dfCell?.text ?? '', p.values[column]!.text]);
    cells.push([null, span(statistic), dfCell === null ? null : span(dfCell), span(p.values[column]!)]);
  });
  const used = [index, p.line, ...(df === null ? [] : [df.line])];
  const firstLine = Math.min(...used);
  const lastLine = Math.max(...used);
  return { table: tableOverLines(lines[firstLine]!, lines[lastLine]!, null, rows, cells, 'positions'), firstLine, lastLine };
}
