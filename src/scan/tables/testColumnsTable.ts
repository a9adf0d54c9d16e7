/**
 * Tables comparing groups whose header ends with one test's columns ("Variable Group χ2 df p", "… Total χ 2 p",
 * "… t df p d") and whose rows that carry a test end with its cells, as baseline-characteristics tables of health
 * and behavioural papers come out of a web page's text:
 *
 *     Table 5 Comparison of maternal clinical conditions between the groups
 *     Variable Group χ2 df p
 *     Intervention
 *     Freq. (%)
 *     n = 186
 *     Baseline
 *      Reported malaria diagnosis      0.650 1 0.420
 *       Yes 49 (26.3) 56 (30.1)
 *       No 137 (73.7) 130 (69.9)
 *
 * The group headers come one per line, section lines and the categories' counts and the groups' descriptives sit
 * between the rows with a test, the cells are crushed into single spaces and blank cells are runs of spaces: no
 * reader of columns can place such lines. But the test's cells are the last ones of their line in the order the
 * header names them, and each must have its column's shape (a statistic with decimals, a whole df, a proportion
 * for p), so a line whose last tokens fit those shapes exactly is a row with a test, read as "label | statistic |
 * df | p" with each cell pointing at its place in the text; every other line of the table is passed over without
 * ending it. Nothing is taken from another line. The table reader then reads the rows as those of any table.
 *
 * Read only under a "Table N" title a few lines above the header, and only where no other reader took the lines.
 */

import type { CellSpan, DocumentTable } from '../../documents/types.js';
import { classifyHeader, headerKey, isKnownHeader, LONGEST_HEADER_WORDS, TABLE_TITLE, type ColumnRole, type TextLine } from './cells.js';
import { captionBetween, tableOverLines, titleLineAbove } from './rebuilt.js';

type Line = TextLine;

/** What one of the test's columns holds. */
type TestColumn = 'statistic' | 'df' | 'p' | 'effect';

/** A whitespace-separated token of a line, with its offsets in the line. */
interface Token {
  readonly text: string;
  readonly start: number;
  readonly end: number;
}

/** Most non-blank lines between the title and the header (the caption's lines, a "From:" line). */
const MAX_CAPTION_LINES = 3;
/** Longest line read as a header. */
const MAX_HEADER_LENGTH = 250;
/** Longest line read as a line of the table; a longer one is prose. */
const MAX_LINE_LENGTH = 300;
/** Most lines after the header or after a row with a test that may pass without one before the table ends. */
const MAX_LINES_WITHOUT_TEST = 12;
/** Blank lines in a row that end the table. */
const BLANK_LINES_ENDING_TABLE = 2;
/** Fewest rows with a test that make a table (one alone could be a line of anything). */
const MIN_TEST_ROWS = 2;

/** A statistic's cell: a number with decimals, perhaps signed, with stars, daggers or a footnote letter after it. */
const STATISTIC_CELL = /^[-\u2212\u2013]?\d{0,6}\.\d{1,6}(?:[*\u2217\u2020\u2021]{1,3}|[a-h])?$/;
/** A df column's cell: a whole number. */
const DF_CELL = /^\d{1,5}$/;
/** A p cell: a proportion with decimals, perhaps after a comparator, perhaps with stars or a footnote letter after it. */
const P_CELL = /^(?:[<>=\u2264\u2265]\s?)?(?:0?\.\d{1,6}|1\.0{1,6})(?:[*\u2217\u2020\u2021]{1,3}|[a-h])?$/;
/** A comparator standing apart before its p ("< 0.001"). */
const LONE_COMPARATOR = /^[<>=\u2264\u2265]$/;
/** An effect size's cell: a number, perhaps signed. */
const EFFECT_CELL = /^[-\u2212\u2013]?\d{0,6}\.?\d{1,6}$/;
/** An empty cell a copy prints as a dash. */
const EMPTY_CELL = /^[-\u2013\u2014\u2212]$/;
/** A note under the table: "1. (a) …", "Note.", "Abbreviations", "* p < .05", "a …" as a footnote's line. */
const NOTE_LINE = /^\s*(?:\d{1,2}\.\s|Notes?\b|Abbreviations?\b|[*\u2020\u2021]|[a-h]\s?[).:]?\s(?=\p{Ll}))/u;
/** A token where a row's values begin: a number, perhaps signed or after a comparator. */
const NUMBER_START = /^[-\u2212\u2013<>]?\.?\d/;


function tokensOf(text: string): Token[] {
  const tokens: Token[] = [];
  for (const match of text.matchAll(/\S+/g)) tokens.push({ text: match[0], start: match.index!, end: match.index! + match[0].length });
  return tokens;
}

/** The test column a header role stands for, or null (a descriptive column, a label, a correlation). */
function testColumnOf(role: ColumnRole): TestColumn | null {
  if (role.role === 'statistic') return role.kind === 'r' ? null : 'statistic';
  // (A column of statistics of varying kinds, "Test statistic": the table reader names each row's kind or reads none.)
  if (role.role === 'result') return 'statistic';
  if (role.role === 'df' || role.role === 'p') return role.role;
  if (role.role === 'effect') return 'effect';
  return null;
}

/** The shortest known name that ends with token `last` and names a test column: its first token and column. */
function nameEndingAt(tokens: readonly Token[], text: string, last: number): { first: number; column: TestColumn } | null {
  for (let length = 1; length <= LONGEST_HEADER_WORDS && last - length + 1 >= 0; length++) {
    const first = last - length + 1;
    const name = text.slice(tokens[first]!.start, tokens[last]!.end);
    if (!isKnownHeader(headerKey(name))) continue;
    const column = testColumnOf(classifyHeader(name));
    if (column !== null) return { first, column };
  }
  return null;
}

/** The orders a test's columns are printed in at the end of a header: statistic, its df, its p, an effect size. */
const TEST_COLUMN_ORDERS: readonly (readonly TestColumn[])[] = [
  ['statistic', 'df', 'p', 'effect'],
  ['statistic', 'df', 'p'],
  ['statistic', 'p', 'effect'],
  ['statistic', 'p'],
];

/** A header line ending with a test's columns: the names before them (one cell) and the test's names and columns. */
interface TestHeader {
  readonly label: Token;
  readonly names: readonly Token[];
  readonly columns: readonly TestColumn[];
}

/**
 * A header whose last names are one test's columns in one of the usual orders, after at least one word of other
 * columns' names; null when the words before them name a statistic or a p too (side-by-side blocks, read
 * otherwise) or the line holds values.
 */
export function readTestHeader(text: string): TestHeader | null {
  if (text.length > MAX_HEADER_LENGTH || text.trim() === '' || /\d\.\d/.test(text)) return null;
  const tokens = tokensOf(text);
  const names: { first: number; column: TestColumn }[] = [];
  let last = tokens.length - 1;
  while (last >= 1 && names.length < 4) {
    const name = nameEndingAt(tokens, text, last);
    if (name === null || name.first === 0) break;
    names.unshift(name);
    last = name.first - 1;
  }
  // (The longest order the names end with: "F df p" rather than its last two.)
  const columns = names.map((name) => name.column);
  const order = TEST_COLUMN_ORDERS.find((candidate) => candidate.length <= columns.length && candidate.every((column, at) => columns[columns.length - candidate.length + at] === column));
  if (order === undefined) return null;
  const kept = names.slice(names.length - order.length);
  const labelEnd = kept[0]!.first - 1;
  const before = tokens.slice(0, labelEnd + 1);
  if (before.some((token) => ['statistic', 'p', 'result'].includes(classifyHeader(token.text).role))) return null;
  const label = { text: text.slice(before[0]!.start, before[before.length - 1]!.end), start: before[0]!.start, end: before[before.length - 1]!.end };
  const nameTokens = kept.map((name, at) => {
    const end = at + 1 < kept.length ? kept[at + 1]!.first - 1 : tokens.length - 1;
    return { text: text.slice(tokens[name.first]!.start, tokens[end]!.end), start: tokens[name.first]!.start, end: tokens[end]!.end };
  });
  return { label, names: nameTokens, columns: order };
}

/** Whether a token fits a test column's cells; `empty` when it is a dash for an empty cell. */
function fits(token: string, column: TestColumn): 'value' | 'empty' | null {
  if (EMPTY_CELL.test(token)) return 'empty';
  const pattern = column === 'statistic' ? STATISTIC_CELL : column === 'df' ? DF_CELL : column === 'p' ? P_CELL : EFFECT_CELL;
  return pattern.test(token) ? 'value' : null;
}

/** A line's test cells and its label, when its last tokens fit the test's columns exactly. */
interface TestRow {
  readonly label: Token;
  /** The cells in the header's column order; null for a dash. */
  readonly cells: readonly (Token | null)[];
}

/**
 * The test cells that end a line, one token per column (a p may have its comparator standing apart, "< 0.001"),
 * and its label: the words before its first number. Null when the last tokens do not fit, or nothing names the row.
 * A row whose statistic is a dash prints no test of ours (a Fisher's exact test's p alone): it has a `cells[0]` of null.
 */
function readTestRow(text: string, columns: readonly TestColumn[]): TestRow | null {
  const tokens = tokensOf(text);
  const cells: (Token | null)[] = [];
  let at = tokens.length - 1;
  for (let column = columns.length - 1; column >= 0; column--) {
    const token = tokens[at];
    if (token === undefined) return null;
    const fit = fits(token.text, columns[column]!);
    if (fit === null) return null;
    let cell: Token | null = fit === 'value' ? token : null;
    // "< 0.001": the comparator is the p's.
    if (columns[column] === 'p' && fit === 'value' && at > 0 && LONE_COMPARATOR.test(tokens[at - 1]!.text)) {
      at--;
      cell = { text: text.slice(tokens[at]!.start, token.end), start: tokens[at]!.start, end: token.end };
    }
    cells.unshift(cell);
    at--;
  }
  if (at < 0) return null;
  const before = tokens.slice(0, at + 1);
  const firstNumber = before.findIndex((token) => NUMBER_START.test(token.text));
  const words = firstNumber === -1 ? before : before.slice(0, firstNumber);
  // (A value's sign or a range's dash right before the statistic belongs to a descriptive cell: no fit.)
  if (words.length === 0 || !/\p{L}/u.test(words.map((token) => token.text).join(' ')) || /^[\u00b1+]$/.test(before[before.length - 1]!.text)) return null;
  const label = { text: text.slice(words[0]!.start, words[words.length - 1]!.end), start: words[0]!.start, end: words[words.length - 1]!.end };
  return { label, cells };
}

/** Whether a line ends the table: the next title, a note, or prose. */
function endsTable(text: string): boolean {
  if (text.length > MAX_LINE_LENGTH || TABLE_TITLE.test(text) || NOTE_LINE.test(text)) return true;
  // A sentence: many words closed by a full stop.
  const trimmed = text.trim();
  return trimmed.endsWith('.') && trimmed.split(/\s+/).length >= 10;
}

function spanIn(line: Line, token: Token): CellSpan {
  return { start: line.start + token.start, end: line.start + token.end };
}

/**
 * The table whose header is `lines[index]`, ending with a test's columns, under a title a few lines above: its
 * header and its rows with a test, or null when the header is not one or fewer than two rows fit.
 */
export function readTestColumnsTable(lines: Line[], index: number): { table: DocumentTable; firstLine: number; lastLine: number } | null {
  const headerLine = lines[index]!;
  const header = readTestHeader(headerLine.text);
  if (header === null) return null;
  const title = titleLineAbove(lines, index, MAX_CAPTION_LINES);
  if (title < 0) return null;
  const rows: string[][] = [[header.label.text, ...header.names.map((name) => name.text)]];
  const cells: (CellSpan | null)[][] = [[spanIn(headerLine, header.label), ...header.names.map((name) => spanIn(headerLine, name))]];
  let lastLine = index;
  let testRows = 0;
  let blanks = 0;
  for (let at = index + 1; at < lines.length && at - lastLine <= MAX_LINES_WITHOUT_TEST; at++) {
    const line = lines[at]!;
    if (line.text.trim() === '') {
      if (++blanks >= BLANK_LINES_ENDING_TABLE) break;
      continue;
    }
    blanks = 0;
    if (endsTable(line.text) || readTestHeader(line.text) !== null) break;
    const row = readTestRow(line.text, header.columns);
    if (row === null) continue;
    lastLine = at;
    // (A dash for the statistic: a p of a test we do not check, or none; the row is passed over.)
    if (row.cells[0] === null) continue;
    rows.push([row.label.text, ...row.cells.map((cell) => cell?.text ?? '')]);
    cells.push([spanIn(line, row.label), ...row.cells.map((cell) => (cell === null ? null : spanIn(line, cell)))]);
    testRows++;
  }
  if (testRows < MIN_TEST_ROWS) return null;
  return { table: tableOverLines(lines[title]!, lines[lastLine]!, captionBetween(lines, title, index), rows, cells, 'positions'), firstLine: title, lastLine };
}
