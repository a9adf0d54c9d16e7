/**
 * Tables copied one cell per line whose rows no reader can rebuild, as a
 * PDF's text gives a table column block by column block:
 *
 *     Canada (CA)
 *     Great Britain (GB)
 *     LRT (RQ1)
 *     NK-R2
 *     χ2(df)
 *     p-value
 *     Model control
 *     6.2 (4)
 *     145.5 (4)
 *     0.184
 *     -
 *
 * Which cell stands in which row and column is lost, but a header that
 * names its test's cells as a value with its df ("χ2(df)", "t (df)") makes
 * each cell of that form the test's value and df by itself: the cell ties
 * them, not its place. Only those are read, each without a p (the p stands
 * somewhere later, and nothing says which is whose).
 *
 * Only where the rows' order is plainly lost (two such cells one right
 * after the other, though the header puts a p after the test's name), and
 * only where nothing else in the table could take that form: the header
 * names one kind of test with its df in the cell, a p, and no column of
 * descriptive values ("M (SD)", "n (%)", "Mean"), df or other statistics;
 * and every bracketed cell below it is a value with its df (a "5.20 (1.30)"
 * or "12 (40%)" anywhere means other columns hold brackets too, and then
 * "5.20 (24)" could be a mean and its n). A cell whose value is a whole
 * number, or a chi-square or F below 0, is not read.
 *
 * Linear in the block's lines; looked at only after a "Table N" title where
 * no other reader found a table.
 */

import type { CellSpan, DocumentTable } from '../../documents/types.js';
import { CELL_BLOCK_NOTE, classifyHeader, headerKey, TABLE_TITLE, type LineCell, type TextLine } from './cells.js';

type Line = TextLine;

type Cell = LineCell;

/** Most lines after the title looked at. */
const MAX_LINES = 300;
/** Most blank lines in a row inside the block. */
const MAX_BLANK_RUN = 2;
/** Longest cell; a longer line is a caption line before the header, and prose after it. */
const MAX_CELL_LENGTH = 60;
/** Most header cells (names of columns, column groups and rows before the first value). */
const MAX_HEADER_CELLS = 40;
/** Fewest cells of a value with its df that make the block worth reading so. */
const MIN_VALUE_CELLS = 2;

/** A value with decimals and its df in brackets, one or two whole numbers: "6.2 (4)", "2.90 (2, 132)", "−1.29 (76)**". */
const VALUE_WITH_DF = /^([-\u2212]?\d{1,4}\.\d{1,4})\*{0,3} ?\( ?(\d{1,5})(?: ?, ?(\d{1,5}))? ?\)\*{0,3}$/;
/** A number in brackets, or after one: a cell that holds more than one number ("5.20 (1.30)", "12 (40%)", "(1.2, 3.4)"). */
const HAS_BRACKET = /[([]/;
/** A cell that is a number (or a placeholder): a value, not a header's name. */
const NUMBER_CELL = /^(?:[<>\u2264\u2265=]\s?)?[-\u2212]?(?:\d|\.\d)|^[-\u2013\u2014]$|^n\.?s\.?$/i;

/** Column roles whose cells may hold a value with a whole number in brackets, or say the df stand apart. */
const HEADS_OTHER_BRACKETS = new Set(['descriptive', 'df', 'df1', 'df2', 'result']);
/** A header's bracket naming what a group's cells hold beside their value: "(%)", "(SD)", "(n)", "(SE)", "(IQR)", "(range)", "(95% CI)". */
const DESCRIBES_BRACKET = /\((?:%|n\b|sd|se|iqr|range|95)/;

/** The cells of a titled block of short lines read as a test's values with their df, or null. */
export function readScatteredStatisticCells(lines: Line[], titleLine: number): { table: DocumentTable; lastLine: number } | null {
  const title = lines[titleLine];
  if (title === undefined || !TABLE_TITLE.test(title.text)) return null;
  const cells = collectCells(lines, titleLine + 1);
  const firstValue = cells.findIndex((cell) => NUMBER_CELL.test(cell.text));
  if (firstValue <= 0) return null;
  const header = cells.slice(Math.max(0, firstValue - MAX_HEADER_CELLS), firstValue);
  const testName = testNameOf(header);
  if (testName === null) return null;
  const role = classifyHeader(testName.text);
  if (role.role !== 'statistic') return null;
  const body = cells.slice(firstValue);
  // Every bracketed cell below the header is a value with its df: no other column holds brackets.
  if (body.some((cell) => HAS_BRACKET.test(cell.text) && !VALUE_WITH_DF.test(cell.text))) return null;
  const dfCount = role.kind === 'F' ? 2 : 1;
  const read = body.filter((cell) => {
    const match = VALUE_WITH_DF.exec(cell.text);
    if (!match || (match[3] === undefined ? 1 : 2) !== dfCount) return false;
    return !((role.kind === 'F' || role.kind === 'chi2') && /^[-\u2212]/.test(match[1]!));
  });
  if (read.length < MIN_VALUE_CELLS || read.length !== body.filter((cell) => VALUE_WITH_DF.test(cell.text)).length) return null;
  // The rows' order is lost: two of the test's cells stand one right after the other, where the header puts a p
  // after the test's name. (In rows, a p or the next row's label would stand between them: a table in row order
  // is left to the readers of rows, which take each value's p.)
  const pAfterTest = header.some((cell, at) => cell === testName && header[at + 1] !== undefined && classifyHeader(header[at + 1]!.text).role === 'p');
  const adjacent = read.some((cell, at) => at > 0 && body.indexOf(cell) === body.indexOf(read[at - 1]!) + 1);
  if (!pAfterTest || !adjacent) return null;
  const rows: string[][] = [['', testName.text]];
  const spans: (CellSpan | null)[][] = [[null, { start: testName.start, end: testName.end }]];
  read.forEach((cell, at) => {
    rows.push([`${testName.text} [${at + 1}]`, cell.text]);
    spans.push([null, { start: cell.start, end: cell.end }]);
  });
  const last = body[body.length - 1]!;
  return {
    table: {
      start: title.start + (title.text.length - title.text.trimStart().length),
      end: last.end,
      caption: title.text.trim(),
      notes: [],
      rows,
      headerRows: 1,
      cells: spans,
      layout: 'positions',
    },
    lastLine: last.line,
  };
}

/**
 * The header's name of the test whose cells hold their df ("χ2(df)"), when it is the only kind of test the header
 * names, a p is named too, and no name is of descriptive values, counts, df or effect sizes; or null.
 */
function testNameOf(header: Cell[]): Cell | null {
  let test: Cell | null = null;
  let kind: string | null = null;
  let namesP = false;
  for (const cell of header) {
    const key = headerKey(cell.text);
    const role = classifyHeader(cell.text);
    if (role.role === 'p') namesP = true;
    else if (role.role === 'statistic') {
      if (role.dfInCell !== true || role.kind === 'r' || (kind !== null && role.kind !== kind)) return null;
      kind = role.kind;
      test ??= cell;
    } else if (HEADS_OTHER_BRACKETS.has(role.role)) return null;
    // (A name no vocabulary knows that holds a bracket of what a group's cells give, "Cases n (%)", "Mean (SD)",
    // heads bracketed values too.)
    else if (role.role === 'unknown' && DESCRIBES_BRACKET.test(key)) return null;
  }
  return namesP ? test : null;
}

/** The short lines after the title, one cell each, up to a note, a line of prose after the header, or a gap. */
function collectCells(lines: Line[], from: number): Cell[] {
  const cells: Cell[] = [];
  let blankRun = 0;
  for (let index = from; index < lines.length && index - from <= MAX_LINES; index++) {
    const line = lines[index]!;
    const text = line.text.trim();
    if (text === '') {
      if (++blankRun > MAX_BLANK_RUN) break;
      continue;
    }
    blankRun = 0;
    if (CELL_BLOCK_NOTE.test(text) || (cells.length > 0 && TABLE_TITLE.test(text))) break;
    if (text.length > MAX_CELL_LENGTH) {
      // (Caption lines before the first cell; prose after it ends the block.)
      if (cells.length > 0) break;
      continue;
    }
    const start = line.start + line.text.indexOf(text);
    cells.push({ text, start, end: start + text.length, line: index });
  }
  return cells;
}
