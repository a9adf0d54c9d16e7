/**
 * Finds tables in plain text, Markdown and text extracted from PDF, where no
 * markup says "this is a table":
 *
 * - pipe tables: Markdown ("| a | b |", with or without outer pipes, with a
 *   "|---|" separator line) and the " | " rows the document readers write;
 * - whitespace-aligned columns: cells apart by two or more spaces or a tab;
 * - crushed columns, as copying from a PDF leaves them: cells apart by single
 *   spaces ("Condition 12.40 2 6.20 4.21 .018 .13"), recognised by a header
 *   line made of known column names ("Source SS df MS F p ηp") or by rows
 *   that end in a run of numbers under a "Table 2" title.
 *
 * A title line ("Table 2", "Table 2. Analysis of variance for recall", or
 * "Table 2" followed by a title line) right before the rows becomes the
 * caption; lines starting "Note." (or "*p < .05") right after become notes.
 *
 * Linear time: the text is cut into lines once, each line is classified with
 * simple character tests and anchored expressions on bounded pieces, and
 * each line is looked at a bounded number of times.
 */

import type { CellSpan, DocumentTable, TableLayout } from '../../documents/types.js';
import { BARE_TABLE_TITLE, classifyHeader, couldStartHeader, headerKey, isKnownHeader, LONGEST_HEADER_WORDS, P_UNDER_VALUE, readCell, TABLE_TITLE, type TextLine } from './cells.js';
import { isBracketedPairCell, shapeOf } from './align.js';
import { keepAnswers } from '../memo.js';
import { readCellPerLineTable, readUntitledCellPerLineTable } from './cellPerLine.js';
import { readMarkedStatisticCells } from './markedStatisticCells.js';
import { extremes } from '../../arrays.js';
import { readGluedTable } from './glued.js';
import { readGluedMatrix } from './gluedMatrix.js';
import { EndTags, readHtmlTableInText } from './htmlInText.js';
import { readSpssCorrelations } from './spssCorrelations.js';
import { readSpreadsheetTest } from './spreadsheetTests.js';
import { readPThenStatisticTable } from './pThenStatistic.js';
import { readTransposedTable } from './transposed.js';
import { linesClosedByPipes } from './pipeClosed.js';
import { readScatteredStatisticCells } from './scatteredCells.js';
import { readTestColumnsTable } from './testColumnsTable.js';

interface Line extends TextLine {
  /** Cells are separated by single spaces whatever the gaps look like (see withConsistentSeparators). */
  crushed?: boolean;
}

/** A piece of a line with offsets relative to the line. */
interface Piece {
  readonly text: string;
  readonly start: number;
  readonly end: number;
}

/** Lines longer than this are prose (or a whole paragraph on one line), not table rows. */
const MAX_ROW_LENGTH = 400;
/** A row label longer than this is a sentence that happens to end in numbers. */
const MAX_LABEL_LENGTH = 80;
const MAX_LABEL_WORDS = 10;

const TITLE = TABLE_TITLE;
const BARE_TITLE = BARE_TABLE_TITLE;
const NOTE = /^\s{0,8}(?:(?:\*|_){0,2}Notes?(?:\*|_){0,2}\s*[.:]|\*{1,3}\s*p\s*[<\u2264=]|[\u2020\u2021]\s*p\s*[<\u2264=])/;
/** Header fragments that a PDF splits from their superscript ("ηp" over "2"). */
const INCOMPLETE_HEADERS = new Set(['eta', 'etap', 'eta p', 'etag', 'partial eta', 'omega', 'omegap', 'chi', 'x', 'partial omega']);
const HEADER_CONTINUATION = /^\s*(?:2|p|g|p2|2p|g2|2g)(?:\s+(?:2|p|g|p2|2p|g2|2g)){0,3}\s*$/;

/** A short code naming a column, letters then a digit: "T1", "T0\u20132", "W12", "Q3a" (not a bare number). */
const COLUMN_CODE = /^[A-Za-z]{1,3}\d{1,3}(?:[\u2013\u2014-]\d{1,3})?[a-z]?$/;

/** Finds the tables in a text that carries no table markup. */
/**
 * A table one cell per line under the title at `lines[titleLine]`: its rows, or its statistics' rows when it is on
 * its side, or a correlation block or matrix; or, when its rows' order is lost, its cells of a value with its df
 * (scatteredCells.ts). A copy that closes each cell with a lone "|" is read with those pipes
 * as closers, not empty cells (pipeClosed.ts).
 */
function readTitledCellPerLine(lines: TextLine[], titleLine: number): { table: DocumentTable; lastLine: number } | null {
  const cells = linesClosedByPipes(lines, titleLine + 1) ?? lines;
  // (A block whose rows' order is lost first: read as rows, its cells land in the wrong columns.)
  return readScatteredStatisticCells(lines, titleLine) ?? readMarkedStatisticCells(lines, titleLine) ?? readCellPerLineTable(cells, titleLine) ?? readTransposedTable(cells, titleLine) ?? readCorrelationBlock(lines, titleLine) ?? readGluedMatrix(lines, titleLine);
}

export function findTextTables(text: string): DocumentTable[] {
  const lines = splitLines(text).flatMap(splitEmbeddedTable).map(withConsistentSeparators);
  const tables: DocumentTable[] = [];
  let endTags: EndTags | undefined;
  // t and z tests as a spreadsheet prints them ("t Stat", "P(T<=t) two-tail" rows), found first: a reader of the
  // rows around them would take them for an ordinary table.
  const spreadsheet = findSpreadsheetTests(lines);
  let nextSpreadsheet = 0;
  /** The spreadsheet tests on lines up to `lastLine` not yet taken, pushed as tables; the last line they reach. */
  const takeSpreadsheetTests = (lastLine: number): number => {
    let reach = -1;
    while (nextSpreadsheet < spreadsheet.length && spreadsheet[nextSpreadsheet]!.firstLine <= lastLine) {
      const test = spreadsheet[nextSpreadsheet++]!;
      tables.push(test.table);
      reach = Math.max(reach, test.lastLine);
    }
    return reach;
  };
  let index = 0;
  while (index < lines.length) {
    if (nextSpreadsheet < spreadsheet.length && spreadsheet[nextSpreadsheet]!.firstLine === index) {
      index = takeSpreadsheetTests(index) + 1;
      continue;
    }
    // An HTML table left as markup ("<table> … </table>", as Markdown converted from XML keeps complex tables).
    const markup = lines[index]!.text.includes('<') ? readHtmlTableInText(text, lines, index, (endTags ??= new EndTags(text))) : null;
    if (markup !== null) {
      if (markup.table !== null) {
        const title = markup.table.caption === null ? readTitle(lines, index, true) : null;
        tables.push(title === null ? markup.table : { ...markup.table, caption: title.caption, start: lines[title.firstLine]!.start });
      }
      index = markup.lastLine + 1;
      continue;
    }
    // Correlations as statistics software prints them (a "Pearson Correlation", a "Sig. (2-tailed)" and an "N" row
    // per variable), from their first block, or from the header line right above it.
    const software = lines[index]!.text.includes('orrelation') ? readSoftwareCorrelations(lines, index) : null;
    if (software !== null) {
      const title = readTitle(lines, index, true);
      tables.push(title === null ? software.table : { ...software.table, caption: title.caption, start: lines[title.firstLine]!.start });
      index = software.lastLine + 1;
      continue;
    }
    // A table whose last column holds each test as "p (χ2, df)" under "P value (χ2)": its test cells are read whatever
    // its other columns are.
    const pFirst = lines[index]!.text.includes('(') ? readPThenStatisticTable(lines, index) : null;
    if (pFirst !== null) {
      tables.push(pFirst.table);
      index = pFirst.lastLine + 1;
      continue;
    }
    // Under a title, a column of lines each closed by a pipe ("10.84(1, 141) |", "|") is a table a web page copied
    // one cell per line, not a pipe table of one column: the one-cell-per-line reader reads it.
    const piped = readPipeTable(lines, index);
    const cellPerLineWithPipes = piped !== null && TITLE.test(lines[index]!.text) && piped.rows.every((row) => row.filter((cell) => cell.trim() !== '').length <= 1);
    const found = cellPerLineWithPipes ? null : (piped ?? readTabTable(lines, index) ?? readSpacedTable(lines, index));
    if (found === null) {
      const rebuilt =
        (TITLE.test(lines[index]!.text) ? readTitledCellPerLine(lines, index) : null) ??
        readGluedTable(lines, index) ??
        readUntitledCellPerLineTable(lines, index);
      if (rebuilt !== null) {
        const title = rebuilt.table.caption === null ? readTitle(lines, index) : null;
        tables.push(title === null ? rebuilt.table : { ...rebuilt.table, caption: title.caption, start: lines[title.firstLine]!.start });
        index = rebuilt.lastLine + 1;
        continue;
      }
      // A group comparison whose header ends with one test's columns and whose rows with a test end with its cells,
      // between lines no reader of columns places (group headers one per line, categories' counts, descriptives).
      const testColumns = readTestColumnsTable(lines, index);
      if (testColumns !== null) {
        tables.push(testColumns.table);
        index = testColumns.lastLine + 1;
        continue;
      }
      index++;
      continue;
    }
    const { rows, last, layout, cells } = found;
    // Lines between a bare title and a recognised header are the title's; without a header they may be an unread one.
    const firstLine = found.firstLine ?? index;
    const title = readTitle(lines, firstLine, found.headed !== false);
    const notes = readNotes(lines, last + 1);
    const startLine = title?.firstLine ?? firstLine;
    const endLine = notes.lastLine ?? last;
    // A table that holds a spreadsheet's test output is read as that output.
    const spreadsheetReach = takeSpreadsheetTests(endLine);
    if (spreadsheetReach >= 0) {
      index = Math.max(endLine, spreadsheetReach) + 1;
      continue;
    }
    tables.push({
      start: lines[startLine]!.start + leadingSpace(lines[startLine]!.text),
      end: lines[endLine]!.start + lines[endLine]!.text.trimEnd().length,
      caption: title?.caption ?? null,
      notes: notes.notes,
      rows,
      layout,
      ...(cells ? { cells } : {}),
    });
    index = endLine + 1;
  }
  return tables;
}

function splitLines(text: string): Line[] {
  const lines: Line[] = [];
  let start = 0;
  while (start <= text.length) {
    let end = text.indexOf('\n', start);
    if (end === -1) end = text.length;
    const contentEnd = end > start && text.charCodeAt(end - 1) === 13 ? end - 1 : end;
    lines.push({ start, end: contentEnd, text: text.slice(start, contentEnd) });
    start = end + 1;
  }
  return lines;
}

/** A line that may hold a whole table: a test statistic's name and a number somewhere in it. */
/**
 * Two short column names side by side ("SS df", "F p", "t df", "M SD"): what a header run holds and running text
 * almost never does (a quick look before a line is tokenised).
 */
const ADJACENT_NAMES =
  /(?:^|\s)(?:F|t|p|P|df|DF|Df|d\.f\.|SS|MS|Sig\.?|\u03c72|\u03c7\u00b2|X2|r|z|Z|M|SD|n|N|F-value|F-ratio|p-value|P-value|t-value)\s+(?:F|t|p|P|df|DF|Df|d\.f\.|SS|MS|Sig\.?|\u03c72|\u03c7\u00b2|X2|r|z|Z|M|SD|n|N|d|F-value|F-ratio|p-value|P-value|t-value|\u03b7\S{0,3}|Pr\(>F\))(?=\s|$)/;

/** Known header names in a row that make a header run inside a line: enough that prose does not hold them. */
const MIN_EMBEDDED_HEADER_NAMES = 3;

/**
 * A table that a copy put on one line with what stands around it, as page
 * viewers give a whole page of a PDF as one line ("… Table 4. Two-way ANOVA
 * Source SS df MS F p Group 12.40 2 6.20 4.21 .020 Time … Error 83.90 57
 * 1.47 The next …"): cut into lines before its title, before its header (a
 * run of at least three known column names, one naming a test statistic and
 * one a p or df) and after the header, when at least two rows of values
 * follow. Lines that hold no such run come back whole.
 */
function splitEmbeddedTable(line: Line): Line[] {
  if (line.text.length < 30 || line.text.length > MAX_RUN_ON_LINE || !ADJACENT_NAMES.test(line.text) || !/\d/.test(line.text)) return [line];
  // (Words apart by spaces first, a cheap look that passes over most lines of prose before they are tokenised.)
  if (!holdsHeaderStretch(line.text.split(/[ \t]+/))) return [line];
  const tokens = tokenize(line.text);
  for (let index = 0, end = 0; index < tokens.length; index = Math.max(end, index + 1)) {
    const roles: string[] = [];
    end = index;
    // (Most words of a line of prose cannot begin a column's name: passed over without looking up phrases.)
    if (!couldStartHeader(tokens[index]!.text)) continue;
    for (let length = knownPhraseLength(tokens, end); length > 0; length = knownPhraseLength(tokens, end)) {
      roles.push(classifyHeader(join(line.text, tokens[end]!, tokens[end + length - 1]!).text).role);
      end += length;
    }
    const namesTest = roles.includes('statistic') && (roles.includes('p') || roles.includes('df'));
    if (roles.length < MIN_EMBEDDED_HEADER_NAMES || !namesTest || end >= tokens.length || isValueToken(tokens[end]!.text)) continue;
    // The label column's name ("Source", "Variable") is the word before the names, when it is one.
    const headerStart = index > 0 && classifyHeader(tokens[index - 1]!.text).role === 'label' ? index - 1 : index;
    const piece = (from: number, to: number): Line => ({ start: line.start + from, end: line.start + to, text: line.text.slice(from, to) });
    const header = piece(tokens[headerStart]!.start, tokens[end - 1]!.end);
    const rest = piece(tokens[end]!.start, line.text.length);
    if (readHeader(header) === null || splitRunOnRows(rest).length < 2) continue;
    const before = line.text.slice(0, tokens[headerStart]!.start);
    const title = lastTitleStart(before);
    const lead = title > 0 ? [piece(0, title), piece(title, before.length)] : before.trim() === '' ? [] : [piece(0, before.length)];
    return [...lead.map((part) => ({ ...part, text: part.text.trimEnd(), end: part.start + part.text.trimEnd().length })), header, rest];
  }
  return [line];
}

/** Whether some stretch of these words free of numbers and comparisons holds MIN_EMBEDDED_HEADER_NAMES words that could begin a column's name. */
function holdsHeaderStretch(words: string[]): boolean {
  let starts = 0;
  for (const word of words) {
    if (BREAKS_HEADER.test(word)) starts = 0;
    else if (couldStartHeader(word) && ++starts >= MIN_EMBEDDED_HEADER_NAMES) return true;
  }
  return false;
}

/** A word no header holds: a number or a comparison. */
const BREAKS_HEADER = /^[-\u2212]?\.?\d|[=<>\u2264\u2265]/;

/** Where the last "Table 4" of a text begins (0 when none, or at its start). */
function lastTitleStart(text: string): number {
  let last = 0;
  for (const match of text.matchAll(/(?<=\s)(?:Table|TABLE|Tabla|Tabela|Tableau|Tabelle) \d{1,3}\b/g)) last = match.index!;
  return last;
}

function leadingSpace(text: string): number {
  return text.length - text.trimStart().length;
}

function isBlank(line: Line | undefined): boolean {
  return line === undefined || line.text.trim() === '';
}

// ---------------------------------------------------------------- pipe tables

/**
 * Offsets of the pipes that separate cells: not one escaped as Markdown
 * escapes it ("\\|"), nor the bars of an absolute value written inside a
 * cell ("Pr > |t|", "|z|"): a bar with a short symbol right against it and
 * its partner, no space between.
 */
function separatorPipes(text: string): number[] {
  const pipes: number[] = [];
  for (let at = text.indexOf('|'); at !== -1; at = text.indexOf('|', at + 1)) {
    if (at > 0 && text[at - 1] === '\\') continue;
    const absolute = /^\|[^\s|]{1,3}\|/.exec(text.slice(at, at + 5));
    if (absolute && at > 0 && /[\s>=<(]/.test(text[at - 1]!) && !/[^\s|,;)]/.test(text[at + absolute[0].length] ?? ' ')) {
      at += absolute[0].length - 1;
      continue;
    }
    pipes.push(at);
  }
  return pipes;
}

/** The line cut at its separating pipes, each cell trimmed. */
function cutAtPipes(text: string): string[] {
  const cells: string[] = [];
  let from = 0;
  for (const at of separatorPipes(text)) {
    cells.push(text.slice(from, at).trim());
    from = at + 1;
  }
  cells.push(text.slice(from).trim());
  return cells;
}

function pipeCells(line: Line): string[] | null {
  const text = line.text;
  if (!text.includes('|')) return null;
  // A longer line is prose, unless it is a line of many cells (rows run together, cut by splitRunOnPipeRow).
  if (text.length > MAX_ROW_LENGTH && (text.length > MAX_RUN_ON_LINE || countPipes(text) < MIN_RUN_ON_PIPES)) return null;
  let cells = cutAtPipes(text);
  if (cells.length < 2) return null;
  const trimmed = text.trim();
  if (trimmed.startsWith('|')) cells = cells.slice(1);
  // Outer pipes come in pairs in Markdown; a lone trailing pipe ends an empty last cell.
  if (trimmed.startsWith('|') && trimmed.endsWith('|') && cells.length > 0) cells = cells.slice(0, -1);
  return cells.length >= 2 ? cells : null;
}

/** Fewest pipes a line longer than a row must hold to be read as rows run together. */
const MIN_RUN_ON_PIPES = 16;

function countPipes(text: string): number {
  let count = 0;
  for (let at = text.indexOf('|'); at !== -1; at = text.indexOf('|', at + 1)) count++;
  return count;
}

function isSeparatorRow(cells: string[]): boolean {
  return cells.every((cell) => /^:?-{2,}:?$/.test(cell) || cell === '');
}

interface FoundRows {
  rows: string[][];
  last: number;
  layout: TableLayout;
  /** Each cell's offsets, when the finder knows them. */
  cells?: (CellSpan | null)[][];
  /** False when no header line was found (rows under a title only). */
  headed?: boolean;
  /** The table's first line when it starts before the line it was looked for at (block titles over a crushed header). */
  firstLine?: number;
}

/** A line of pipes and spaces only: an empty row. */
const EMPTY_PIPE_ROW = /^[ \t]*\|[ \t|]*$/;
/** Most empty rows in a row inside a pipe table. */
const MAX_EMPTY_PIPE_ROWS = 8;

/** One cell between two pipes and nothing else. */
const SPANNING_PIPE_ROW = /^\s*\|[^|]+\|\s*$/;

function readPipeTable(lines: Line[], first: number): FoundRows | null {
  const rows: Piece[][] = [];
  let index = first;
  let lastLine = first - 1;
  for (; index < lines.length; index++) {
    const cells = pipeCells(lines[index]!);
    if (cells === null) {
      // A blank line between rows, as web pages' copies put them (one, between two rows of pipes).
      if (rows.length > 0 && isBlank(lines[index]) && lines[index + 1] !== undefined && pipeCells(lines[index + 1]!) !== null) continue;
      // Lines of pipes alone ("|"), the empty rows a web page's copy leaves for spacing, when a row of cells follows them.
      if (rows.length > 0 && EMPTY_PIPE_ROW.test(lines[index]!.text)) {
        let next = index + 1;
        while (next < lines.length && next - index < MAX_EMPTY_PIPE_ROWS && EMPTY_PIPE_ROW.test(lines[next]!.text)) next++;
        // (Not when that row is a header: a new table starts there.)
        const nextCells = lines[next] === undefined ? null : pipeCells(lines[next]!);
        if (nextCells !== null && !nextCells.some((cell) => cell !== '' && isKnownHeader(headerKey(cell)))) {
          index = next - 1;
          continue;
        }
      }
      // A page's running head, footer or number where the table runs over a page break (a PDF converted to Markdown
      // gives the page's lines between two runs of pipe rows): passed over when rows as wide as the header go on
      // after it, the header printed again there dropped.
      const resume = rows.length >= 2 && isPageFurniture(lines[index]!.text) ? pipeRowsResumeAfter(lines, index, rows[0]!) : -1;
      if (resume !== -1) {
        index = resume - 1;
        continue;
      }
      // A section row spanning the table, one cell between two pipes ("| Outcome variable |"), inside it.
      const spanning = rows.length > 0 && SPANNING_PIPE_ROW.test(lines[index]!.text) && lines[index + 1] !== undefined && pipeCells(lines[index + 1]!) !== null;
      if (!spanning) break;
      rows.push(pipeCellSpans(lines[index]!, 1));
      lastLine = index;
      continue;
    }
    if (isSeparatorRow(cells)) {
      lastLine = index;
      continue;
    }
    const row = pipeCellSpans(lines[index]!, cells.length);
    // A line longer than a row is rows run together, cut apart only under a header of as many cells as each such
    // row has (under another header which cell is which is not known); otherwise it ends the table.
    const long = lines[index]!.text.length > MAX_ROW_LENGTH;
    const pieces = rows.length > 0 && row.length >= MIN_RUN_ON_ROWS * rows[0]!.length ? splitRunOnPipeRow(row, rows[0]!.length) : null;
    if (pieces !== null) {
      for (const piece of pieces) rows.push(piece);
      lastLine = index;
      continue;
    }
    if (long) break;
    rows.push(row);
    lastLine = index;
  }
  if (rows.length < 2) return null;
  const merged = joinBrokenRows(rows);
  return {
    rows: merged.map((row) => row.map((cell) => cell.text)),
    last: lastLine,
    layout: 'pipe',
    cells: merged.map((row) => row.map((cell) => (cell.text === '' ? null : { start: cell.start, end: cell.end }))),
  };
}

/**
 * Where a pipe table's rows go on after a page break that starts at `index`: past blank lines and page furniture
 * (at most MAX_PAGE_BREAK_LINES lines), and past the header printed again with its separator row, the index of
 * the next row with as many cells as the header; -1 when no such row follows.
 */
function pipeRowsResumeAfter(lines: Line[], index: number, header: readonly Piece[]): number {
  let at = index;
  while (at < lines.length && at - index < MAX_PAGE_BREAK_LINES && (isBlank(lines[at]) || isPageFurniture(lines[at]!.text))) at++;
  let cells = lines[at] === undefined ? null : pipeCells(lines[at]!);
  if (cells !== null && cells.length === header.length && cells.every((cell, column) => cell === header[column]!.text)) {
    at++;
    cells = lines[at] === undefined ? null : pipeCells(lines[at]!);
    if (cells !== null && isSeparatorRow(cells)) {
      at++;
      cells = lines[at] === undefined ? null : pipeCells(lines[at]!);
    }
  }
  return cells !== null && cells.length === header.length && !isSeparatorRow(cells) ? at : -1;
}

// ---------------------------------------------------------------- tab tables

/** The cells of a line whose cells are apart by tabs (a tab inside the line, not only indentation), with offsets. */
function tabCells(line: Line): Piece[] | null {
  const text = line.text;
  if (line.crushed === true || text.length > MAX_ROW_LENGTH || !text.trimStart().includes('\t')) return null;
  // Leading spaces indent the line; a leading tab is an empty first cell (a program's output leaves the effect's
  // name out on the rows of its other statistics: "\tWilks' Lambda\t.851\t…").
  const pieces = splitCells(line, text.length - text.replace(/^ +/, '').length, '\t');
  return pieces.length >= 2 ? pieces : null;
}

/** Longest line read as a row of a tab table whose first cells are empty: longer, it is an indented paragraph. */
const MAX_LEADING_TAB_ROW = 60;

/**
 * Inside a tab table, a line whose cells before the last are empty, given as tabs before one cell ("\t\tp < .001",
 * "\t\t(.006)": a value's p on the row under it, in its column): the empty cells and that one, when they are no
 * more than the table's first row has. Null otherwise (a line indented by a tab outside a table is prose).
 */
function cellsAfterLeadingTabs(line: Line, width: number): Piece[] | null {
  const text = line.text;
  if (line.crushed === true || !text.startsWith('\t') || text.trim() === '' || text.trim().length > MAX_LEADING_TAB_ROW || text.trim().includes('\t')) return null;
  const pieces = splitCells(line, 0, '\t');
  return pieces.length >= 2 && pieces.length <= width ? pieces : null;
}

/**
 * Rows whose cells are apart by tabs, as a copy of a web page's table or a
 * spreadsheet gives them: the tabs say where the cells are, as pipes do
 * (one tab per cell, empty cells included; a blank line between rows is
 * allowed). At least one row must hold numbers.
 */
function readTabTable(lines: Line[], first: number): FoundRows | null {
  if (tabCells(lines[first]!) === null) return null;
  const rows: Piece[][] = [];
  let index = first;
  let last = first;
  for (; index < lines.length; index++) {
    const cells = tabCells(lines[index]!) ?? (rows.length > 0 ? cellsAfterLeadingTabs(lines[index]!, rows[0]!.length) : null);
    if (cells === null) {
      const nextIsRow = lines[index + 1] !== undefined && tabCells(lines[index + 1]!) !== null;
      if (isBlank(lines[index]) && nextIsRow) continue;
      // Several blank lines, the empty rows a web page's copy leaves for spacing, when a row that is no header follows.
      if (isBlank(lines[index]) && rows.length > 0) {
        let next = index + 1;
        while (next < lines.length && next - index < MAX_EMPTY_PIPE_ROWS && isBlank(lines[next])) next++;
        const nextCells = lines[next] === undefined ? null : tabCells(lines[next]!);
        if (nextCells !== null && !nextCells.some((cell) => cell.text !== '' && isKnownHeader(headerKey(cell.text)))) {
          index = next - 1;
          continue;
        }
      }
      // A section line ("Activity/ playfulness") between rows, written without tabs.
      // A lone value between rows ("0.50 (0.32, 0.74)") is a piece of a row the page broke over lines; it is
      // joined with the pieces around it below.
      const loneValue = !isBlank(lines[index]) && isValueToken(lines[index]!.text.trim());
      // A row label the page wrapped: its first words alone on a line, the rest in the row's first cell below
      // ("Cats living in multicat" / "households less aggressive<tab>t-test<tab>…"): one label.
      const wrappedLabel = rows.length > 0 && nextIsRow ? wrappedLabelHead(lines[index]!, tabCells(lines[index + 1]!)![0]!) : null;
      if (wrappedLabel !== null) {
        const nextCells = tabCells(lines[index + 1]!)!;
        rows.push([{ text: `${wrappedLabel.text} ${nextCells[0]!.text}`, start: wrappedLabel.start, end: nextCells[0]!.end }, ...nextCells.slice(1)]);
        last = ++index;
        continue;
      }
      // (A section line may stand over a row whose label is wrapped.)
      const afterNext = lines[index + 2] === undefined ? null : tabCells(lines[index + 2]!);
      const nextIsWrappedRow = !nextIsRow && afterNext !== null && lines[index + 1] !== undefined && wrappedLabelHead(lines[index + 1]!, afterNext[0]!) !== null;
      if ((isSectionLine(lines[index]) && (nextIsRow || nextIsWrappedRow)) || (loneValue && nextIsRow)) {
        const line = lines[index]!;
        const lead = leadingSpace(line.text);
        rows.push([{ text: line.text.trim(), start: line.start + lead, end: line.start + lead + line.text.trim().length }]);
        continue;
      }
      // (A lone number right before a row is taken as a piece of a row above.)
      // A page's running head, footer or page number where the table runs over a page break, with the header
      // printed again after it: passed over when the table's rows go on after it (as in spaced tables).
      if (rows.length > 1 && isPageFurniture(lines[index]!.text)) {
        let resume = index + 1;
        while (resume < lines.length && resume - index <= MAX_PAGE_BREAK_LINES && (isBlank(lines[resume]) || isPageFurniture(lines[resume]!.text) || repeatsRow(lines[resume]!, rows[0]!))) resume++;
        if (resume < lines.length && tabCells(lines[resume]!) !== null) {
          index = resume - 1;
          continue;
        }
      }
      break;
    }
    rows.push(cells);
    last = index;
  }
  const rowsWithValues = rows.filter((row) => row.slice(1).some((cell) => isValueToken(cell.text))).length;
  if (rows.length < 2 || rowsWithValues < 2) return null;
  // Rows a web page broke over lines, as in pipe tables; a row with its label that ends in a tab ends
  // with its empty cells and is whole (padded, so that it is not joined with the next). A piece that
  // starts with a value ("1421 <0.0001") continues the row above.
  // (Walked, not spread into a call: a table of very many rows would overflow the stack; src/arrays.ts.)
  const width = extremes(rows.map((row) => row.length))?.max ?? 0;
  const padded = rows.map((row) => (row.length > 1 && row[row.length - 1]!.text === '' && !isValueToken(row[0]!.text) ? [...row, ...new Array<Piece>(width - row.length).fill({ text: '', start: row[row.length - 1]!.end, end: row[row.length - 1]!.end })] : row));
  const merged = joinBrokenRows(padded);
  return {
    rows: merged.map((row) => row.map((cell) => cell.text)),
    last,
    layout: 'aligned',
    cells: merged.map((row) => row.map((cell) => (cell.text === '' ? null : { start: cell.start, end: cell.end }))),
  };
}

/**
 * The first words of a row label that a page wrapped, on a line of their own over the row's first cell: a line of
 * words only (no tab, no value) whose label goes on in that cell, told by the cell starting in small letters or by
 * the line ending where a label cannot (a comma, a hyphen, "and", "of"...). Null otherwise (a section line stays one).
 */
function wrappedLabelHead(line: Line, firstCell: Piece): Piece | null {
  const text = line.text.trim();
  if (text === '' || text.length > MAX_ROW_LENGTH || text.includes('\t') || TITLE.test(text) || NOTE.test(text) || isPageFurniture(text)) return null;
  if (firstCell.text === '' || !/^[\p{L}(\u00d7*&]/u.test(firstCell.text) || isValueToken(text.split(/\s+/).pop()!)) return null;
  if (!labelGoesOn(text, firstCell.text, true)) return null;
  const lead = leadingSpace(line.text);
  return { text, start: line.start + lead, end: line.start + lead + text.length };
}

/**
 * Whether a label's first words (`head`, a line of their own) go on in the label below (`rest`): the head ends
 * where a label cannot (a comma, a hyphen, "and", "of", "vs."), the rest starts in brackets or with an
 * interaction's sign ("× Emotion"), or (`orLowerCase`: where rows are not categories under a variable) in small
 * letters; or the head is a numbered matrix label ("1. SPAS a" over "Total Score") and the rest is not numbered.
 */
function labelGoesOn(head: string, rest: string, orLowerCase: boolean): boolean {
  return (
    /^[(\u00d7*&]/u.test(rest) ||
    (orLowerCase && /^\p{Ll}/u.test(rest)) ||
    /[,\-\u2013/]$/.test(head) ||
    /\s(?:and|or|of|in|to|with|for|the|than|from|on|at|by|vs\.?|versus)$/i.test(head) ||
    (NUMBERED_LABEL.test(head) && !/^\d/.test(rest))
  );
}

/** Whether a line's tab cells say what `row`'s cells say (a header printed again after a page break). */
function repeatsRow(line: Line, row: readonly Piece[]): boolean {
  const cells = tabCells(line);
  return cells !== null && cells.length === row.length && cells.every((cell, index) => cell.text.trim() === row[index]!.text.trim());
}

/** The cells of a pipe row with their offsets in the text (the same cells pipeCells reads). */
function pipeCellSpans(line: Line, count: number): Piece[] {
  const text = line.text;
  const from = text.trimStart().startsWith('|') ? text.indexOf('|') + 1 : 0;
  return piecesBetween(line, from, separatorPipes(text).filter((at) => at >= from), count);
}

/** A line cut at `separator` from `from` on, each cell trimmed, with its offsets in the text; at most `count` cells. */
function splitCells(line: Line, from: number, separator: string, count = Infinity): Piece[] {
  const separators: number[] = [];
  for (let at = line.text.indexOf(separator, from); at !== -1; at = line.text.indexOf(separator, at + 1)) separators.push(at);
  return piecesBetween(line, from, separators, count);
}

/** The cells of a line from `from` on, cut at the separators' offsets (in order), each trimmed; at most `count`. */
function piecesBetween(line: Line, from: number, separators: readonly number[], count: number): Piece[] {
  const text = line.text;
  const pieces: Piece[] = [];
  let at = from;
  for (const end of [...separators, text.length]) {
    if (pieces.length >= count) break;
    const raw = text.slice(at, end);
    const lead = raw.length - raw.trimStart().length;
    const trimmed = raw.trim();
    pieces.push({ text: trimmed, start: line.start + at + lead, end: line.start + at + lead + trimmed.length });
    at = end + 1;
  }
  return pieces;
}

/**
 * Rows that a web page broke over lines ("Contact 3 | 0.26 * (0.14, 0.43) |"
 * / "0.50 (0.32, 0.74) |" / "- | 3.60 | 0.07 |"): consecutive rows with fewer
 * cells than the header (or most rows) are joined while together they do
 * not exceed that number (their trailing empty cells left out).
 */
/** Fewest rows a line must hold to be cut into rows. */
const MIN_RUN_ON_ROWS = 3;

/**
 * A line of pipe cells that holds several rows one after another ("| Minimum time to collision | 12.4 | 0.002 |
 * … | Max. rightward acceleration | 2.3 | …", as a web page's table copied without its row breaks): cut before
 * each label cell, when the line starts with a label and every piece but the last has the same number of
 * cells as the header, at least a label and two values. Null for any other line.
 */
function splitRunOnPipeRow(row: Piece[], headerWidth: number): Piece[][] | null {
  const labels = row.flatMap((cell, index) => (cell.text !== '' && startsWithLabel([cell]) ? [index] : []));
  if (labels.length < MIN_RUN_ON_ROWS || labels[0] !== 0) return null;
  const size = labels[1]! - labels[0]!;
  if (size < 3 || size !== headerWidth) return null;
  for (let index = 1; index < labels.length; index++) {
    if (labels[index]! - labels[index - 1]! !== size) return null;
  }
  if (row.length - labels[labels.length - 1]! > size) return null;
  return labels.map((start, index) => row.slice(start, labels[index + 1] ?? row.length));
}

function joinBrokenRows(rows: Piece[][]): Piece[][] {
  const counts = new Map<number, number>();
  for (const row of rows) counts.set(row.length, (counts.get(row.length) ?? 0) + 1);
  let width = 0;
  let most = 0;
  for (const [count, times] of counts) if (times > most || (times === most && count > width)) [width, most] = [count, times];
  // The header row shows how many cells a whole row has, even when most rows came out broken.
  width = Math.max(width, rows[0]?.length ?? 0);
  const filled = (row: Piece[]): Piece[] => {
    let end = row.length;
    while (end > 1 && row[end - 1]!.text === '') end--;
    return row.slice(0, end);
  };
  const joined: Piece[][] = [];
  for (let index = 0; index < rows.length; index++) {
    let row = rows[index]!;
    // A piece that begins with a label ("2. Age", "Control variable") is a row of its own, not the rest of this one.
    // (A label alone, "| N introductory notes |", then its values closed by the row's last pipe, "11.0 ± 4.5 | … |
    // <0.05 |": that pipe left an empty cell at the piece's end, which does not count.)
    const labelThenClosedValues = (next: Piece[]): boolean => row.length === 1 && next.length === width && next[0]!.text !== '' && next[width - 1]!.text === '';
    const continues = (next: Piece[]): boolean => (next.length < width || labelThenClosedValues(next)) && !startsWithLabel(next) && filled(row).length + filled(next).length <= width;
    while (row.length < width && index + 1 < rows.length && continues(rows[index + 1]!)) {
      row = [...filled(row), ...rows[index + 1]!];
      index++;
    }
    joined.push(row);
  }
  return joined;
}

/** Whether a row's first cell is a label: text that is not a value ("Age", "2. Age"; not "0.50 (0.32, 0.74)", "-", ""). */
function startsWithLabel(row: Piece[]): boolean {
  const first = row[0]?.text ?? '';
  return /[A-Za-z\u00c0-\u024f\u0370-\u03ff]{2}/.test(first) && !isValueToken(first);
}

// ------------------------------------------------ aligned and crushed tables

/** The spreadsheet t and z tests of the text, in order, each with the lines it spans (no two overlapping). */
function findSpreadsheetTests(lines: Line[]): { table: DocumentTable; firstLine: number; lastLine: number }[] {
  const found: { table: DocumentTable; firstLine: number; lastLine: number }[] = [];
  for (let index = 0; index < lines.length; index++) {
    const text = lines[index]!.text;
    // (Cheap test first: the row starts with its statistic's letter.)
    if (!/^[\s|]*[tTzZ]\b/.test(text)) continue;
    const test = readSpreadsheetTest(lines, index);
    if (test === null || (found.length > 0 && test.firstLine <= found[found.length - 1]!.lastLine)) continue;
    const title = readTitle(lines, test.firstLine, true);
    found.push(title === null ? test : { ...test, table: { ...test.table, caption: title.caption } });
  }
  return found;
}

/** Software-printed correlation blocks starting on this line, or on the next one under this header line. */
function readSoftwareCorrelations(lines: Line[], index: number): { table: DocumentTable; lastLine: number } | null {
  const here = readSpssCorrelations(lines, index);
  if (here !== null) return here;
  const next = lines[index + 1];
  if (next === undefined || !/\d/.test(next.text) || /\d/.test(lines[index]!.text.replace(/\b\d+\b/g, ''))) return null;
  const below = readSpssCorrelations(lines, index + 1);
  return below === null ? null : { table: { ...below.table, start: lines[index]!.start + leadingSpace(lines[index]!.text) }, lastLine: below.lastLine };
}

/**
 * Splits at whitespace outside brackets; "F (2, 57)" and "Error (between)" stay whole, "< .001" is joined.
 * Kept per line text: the readers of aligned, crushed and wrapped tables each tokenize a line, and a line
 * again as the line after the one looked at (readWrappedHeader), so prose lines were split five times over.
 */
const tokenize = keepAnswers(splitTokens);

function splitTokens(text: string): readonly Piece[] {
  const raw: Piece[] = [];
  let at = 0;
  while (at < text.length) {
    while (at < text.length && isSpace(text.charCodeAt(at))) at++;
    if (at >= text.length) break;
    const start = at;
    let depth = 0;
    while (at < text.length) {
      const code = text.charCodeAt(at);
      // Round and square brackets both hold a cell's parts: "(2, 57)", "[-1.1, 0.22]".
      if (code === 40 || code === 91) depth++;
      else if (code === 41 || code === 93) depth = Math.max(0, depth - 1);
      else if (depth === 0 && isSpace(code)) break;
      at++;
    }
    raw.push(...splitGluedP({ text: text.slice(start, at), start, end: at }));
  }
  const tokens: Piece[] = [];
  for (let index = 0; index < raw.length; index++) {
    const token = raw[index]!;
    const previous = tokens[tokens.length - 1];
    // "χ 2": the chi-square symbol with its 2 set apart (a superscript copied as a word) is one token.
    if (previous !== undefined && /^[\u03c7\u03a7]$/.test(previous.text) && /^[2\u00b2]$/.test(token.text) && token.start - previous.end <= 2) {
      tokens[tokens.length - 1] = { text: text.slice(previous.start, token.end), start: previous.start, end: token.end };
      continue;
    }
    // "5.88 × 10−5": a number in scientific notation written with spaces is one token.
    const next = raw[index + 1];
    // (Also as LaTeX left in a converted table's cell: "$6.979 \times 10^{-6}$".)
    if (
      previous !== undefined &&
      next !== undefined &&
      /^(?:[x\u00d7*]|\\times)$/.test(token.text) &&
      /^\$?[-\u2212\u2013]?[\d.,]+$/.test(previous.text) &&
      /^10(?:\^?\{?[-\u2212\u2013+]?\d{1,3}\}?)\$?$/.test(next.text)
    ) {
      tokens[tokens.length - 1] = { text: text.slice(previous.start, next.end), start: previous.start, end: next.end };
      index++;
      continue;
    }
    // "12.3 ± 4.1": a mean and its SD (or SE) set apart by spaces are one cell.
    // (Either may have thousands set apart by commas: "2,396.4 ± 775.8".)
    if (previous !== undefined && next !== undefined && token.text === '\u00b1' && /^[-\u2212]?(?:\d{1,3}(?:,\d{3})+\.\d+|\d+(?:[.,]\d+)?)[a-h*]{0,3}$/.test(previous.text) && /^(?:\d{1,3}(?:,\d{3})+\.\d+|\d+(?:[.,]\d+)?)[a-h*]{0,3}$/.test(next.text)) {
      tokens[tokens.length - 1] = { text: text.slice(previous.start, next.end), start: previous.start, end: next.end };
      index++;
      continue;
    }
    // "t(58) = 2.12", "χ2(1) = 4.29": a result written in a crushed row's cell, its symbol, sign and value set apart
    // by spaces, is one cell (not the symbol in the label and "= 2.12" a value).
    if (previous !== undefined && next !== undefined && /^(?:=|<|>)$/.test(token.text) && WRITTEN_HEAD.test(previous.text) && /^[-\u2212]?(?:\d+(?:\.\d+)?|\.\d+)$/.test(next.text)) {
      tokens[tokens.length - 1] = { text: text.slice(previous.start, next.end), start: previous.start, end: next.end };
      index++;
      continue;
    }
    // "2 / 180": both df of an F with a slash set apart by spaces.
    if (previous !== undefined && next !== undefined && token.text === '/' && /^\d{1,4}$/.test(previous.text) && /^\d{1,6}(?:\.\d+)?$/.test(next.text)) {
      tokens[tokens.length - 1] = { text: text.slice(previous.start, next.end), start: previous.start, end: next.end };
      index++;
      continue;
    }
    // "2, 180", "2; 180": both df of an F in one cell, split at its space.
    const dfPair = previous !== undefined && /^\d{1,4}(?:\.\d+)?[,;]$/.test(previous.text) && /^\d{1,6}(?:[.,]\d+)?$/.test(token.text);
    // "\u2212 0.44": a minus sign set apart from its number (PDF and web copies do); the minus sign, unlike a
    // dash, never stands for an empty cell.
    const detachedMinus = previous !== undefined && previous.text === '\u2212' && /^\.?\d/.test(token.text);
    // "6.84 n.s.", "7.67 *", "3.44 (*)", "0.449 ††": a number's "not significant" or its marks set apart by a space belong to it.
    // (Not across a wide gap: there the marks, or "n.s.", stand in a column of their own, a p column.)
    // ("n.s." only after a value with decimals: after a whole number, "1 10 n.s.", it is the p of a row whose last
    // number is a df.)
    const notSignificantWord = /^(?:n\.s\.?|N\.S\.?|ns|NS)$/.test(token.text);
    const markOfNumber =
      previous !== undefined &&
      token.start - previous.end < 2 &&
      /^(?:n\.s\.?|N\.S\.?|ns|NS|[*\u2020\u2021\u00a7]{1,3}|\(\*{1,3}\))$/.test(token.text) &&
      /^(?:[<>=]\s?)?[-\u2212]?(?:\d+(?:\.\d+)?|\.\d+)$/.test(previous.text) &&
      (!notSignificantWord || previous.text.includes('.'));
    // "Group (2, 57) 4.21": a bracketed df pair after a label's word is a cell of its own, not part of the label.
    const pairAfterWord = (token.text.startsWith('(') || token.text.startsWith('[')) && isBracketedPair(token.text) && previous !== undefined && !isValueToken(previous.text);
    const joinsPrevious =
      previous !== undefined &&
      (dfPair || detachedMinus || markOfNumber || ((token.text.startsWith('(') || token.text.startsWith('[')) && !pairAfterWord) || /^(?:<=|>=|<|>|=|\u2264|\u2265)$/.test(previous.text));
    // "0.26 * (0.14, 0.43)": a value, its stars and its interval are one cell.
    const beforeMark = tokens[tokens.length - 2];
    const markedBracket =
      previous !== undefined && beforeMark !== undefined && /^[([]/.test(token.text) && /^[*\u2020\u2021]{1,4}$/.test(previous.text) && /^[-\u2212]?(?:\d+(?:\.\d+)?|\.\d+)$/.test(beforeMark.text);
    if (markedBracket) {
      tokens.pop();
      tokens[tokens.length - 1] = { text: text.slice(beforeMark.start, token.end), start: beforeMark.start, end: token.end };
    } else if (joinsPrevious) tokens[tokens.length - 1] = { text: text.slice(previous.start, token.end), start: previous.start, end: token.end };
    else tokens.push(token);
    joinNamedDf(text, tokens);
  }
  return tokens;
}

/**
 * "4.95, df = 4254.7": a statistic and its df named after it are one cell (tokens "4.95,", "df" and "= 4254.7"
 * joined at the end of `tokens`, in place), as a "Statistic" column beside a "Test" column holds them.
 */
function joinNamedDf(text: string, tokens: Piece[]): void {
  const [value, name, df] = tokens.slice(-3);
  if (df === undefined || name!.text.toLowerCase() !== 'df' || !/^= ?\d{1,6}(?:\.\d{1,3})?$/.test(df.text) || !/^[-\u2212]?\d{1,6}(?:\.\d{1,6})?,$/.test(value!.text)) return;
  tokens.splice(-3, 3, { text: text.slice(value!.start, df.end), start: value!.start, end: df.end });
}

/** A statistic's symbol with its df in brackets: "t(58)", "F(2, 57)" (one token already), "χ2(1)", "r(98)". */
const WRITTEN_HEAD = /^(?:t|F|r|z|H|U|rs|X2|x2|\u03c72|\u03c7\u00b2|\u03c7 2|chi2)\(\d{1,5}(?:\.\d{1,3})?(?:,\s?\d{1,6}(?:\.\d{1,3})?)?(?:,\s?N\s?=\s?\d{1,6})?\)$/;

/** A value (its stars after it) or a bracketed df, and a p below 1 after "<" glued to it: "241.34<0.0001", "(15)<.001". */
const GLUED_P = /^([-\u2212]?(?:\d{1,7}(?:\.\d{1,6})?|\.\d{1,6})[*\u2020\u2021]{0,3}|\(\d{1,5}(?:\.\d{1,3})?(?:,\s?\d{1,6}(?:\.\d{1,3})?)?\))((?:<|\u2264|<=)0?\.\d{1,6}[*\u2020\u2021a-h]{0,3})$/;

/** A cell with the p after it glued on (a copy that lost the space before "<") as two cells; others as they are. */
function splitGluedP(piece: Piece): Piece[] {
  const glued = GLUED_P.exec(piece.text);
  if (glued === null) return [piece];
  const cut = piece.start + glued[1]!.length;
  return [
    { text: glued[1]!, start: piece.start, end: cut },
    { text: glued[2]!, start: cut, end: piece.end },
  ];
}

/** Longest line read as several rows run together. */
const MAX_RUN_ON_LINE = 6000;

/**
 * A line holding several rows one after another ("Model 5.88 × 10−5 15 ...
 * <0.0001 significant K′ −K′ 1.84 × 10−5 1 ..."), as PDF text gives a table
 * whose line breaks were lost: cut where a label follows a row's values.
 * Each piece with at least two values is a row.
 */
function splitRunOnRows(line: Line): DataLine[] {
  if (line.text.length > MAX_RUN_ON_LINE) return [];
  const tokens = tokenize(line.text);
  const rows: DataLine[] = [];
  let index = 0;
  while (index < tokens.length) {
    const labelStart = index;
    while (index < tokens.length && !isValueToken(tokens[index]!.text)) index++;
    const valuesStart = index;
    while (index < tokens.length && (isValueToken(tokens[index]!.text) || (isMarkToken(tokens[index]!.text) && index > valuesStart))) index++;
    const values = tokens.slice(valuesStart, index);
    if (valuesStart === labelStart || values.length < 2) continue;
    const label = join(line.text, tokens[labelStart]!, tokens[valuesStart - 1]!);
    // A label of many words is a sentence, not a row.
    if (valuesStart - labelStart > MAX_LABEL_WORDS) continue;
    rows.push({ label, values });
  }
  return rows.length >= 2 ? rows : [];
}

function isSpace(code: number): boolean {
  return code === 32 || code === 9 || code === 0xa0;
}

/**
 * A cell that may stand in a row's run of values: a number, a dash for an empty cell, "ns". Kept per token text:
 * every line's last tokens are asked by the row readers, and a token of prose with a sign or a number in it ("=
 * .032,", "F(1,") is read by the text scanner each time (shapeOf's written results); such tokens recur.
 */
const isValueToken = keepAnswers(readsAsValueToken);

function readsAsValueToken(text: string): boolean {
  const kind = readCell(text, 'either').kind;
  if (kind === 'number' || kind === 'ns' || (kind === 'empty' && text.trim() !== '')) return true;
  // A number with a bracketed one ("0.59 (0.5)": M and SD; "4.842 (15)": t and its df), a df pair ("2, 180"), an estimate with its interval.
  // A range ("0.000-0.048", an interval's bounds), and a result written in a cell ("F(2,75)=0.31"), are values of the row too.
  const shape = shapeOf(text).shape;
  if (shape === 'number-bracket' || shape === 'number-interval' || shape === 'pair' || shape === 'range' || shape === 'written') return true;
  // "<0.001 (1, 6)": a p with the next F's df run onto it (the table reader takes the df for that F).
  // "4.95, df = 4254.7": a statistic with its df named (see joinNamedDf).
  return P_WITH_DF_AFTER.test(text) || VALUE_WITH_NAMED_DF.test(text);
}

/** A statistic and its df named after it: "4.95, df = 4254.7", "−7.63, df = 346.02". */
const VALUE_WITH_NAMED_DF = /^[-\u2212]?\d{1,6}(?:\.\d{1,6})?, df ?= ?\d{1,6}(?:\.\d{1,3})?$/i;

/** A df pair in brackets standing as a cell: "(2, 57)", "[1; 38]", "(1/38)" (align.ts reads its shape). */
function isBracketedPair(text: string): boolean {
  return isBracketedPairCell(text);
}

/** A bound p followed by a df pair in brackets. */
const P_WITH_DF_AFTER = /^(?:<=|>=|<|>|\u2264|\u2265)\s?0?\.\d+\s+\(\d{1,4}(?:\.\d{1,2})?,\s?\d{1,5}(?:\.\d{1,2})?\)$/;

function isNumberToken(text: string): boolean {
  return readCell(text, 'either').kind === 'number';
}

/** Stars, daggers or one footnote letter standing as a token of their own. */
function isMarkToken(text: string): boolean {
  // (Or arrows, "↘", "↗↗↗": a column saying which way a difference goes and how significant it is.)
  return /^(?:[*\u2020\u2021\u271d\u00a7\u00b6#\u00a5\u0166\u00aa\u00ba^]{1,4}|[a-h]|\+|[\u2190-\u2199]{1,3})$/.test(text);
}

/**
 * PDF text extraction can put tabs between some cells of a row and single
 * spaces between others ("Source \tSS \tdf MS F \tp", "Error \t171.12 93 1.84").
 * When a tab-separated piece still holds several values or names, the tabs do
 * not mark cells: read the line as space-separated (a tab becomes one space,
 * so offsets do not move).
 */
function withConsistentSeparators(line: Line): Line {
  if (!line.text.includes('\t')) return line;
  const pieces = line.text.split('\t').map((piece) => piece.trim()).filter((piece) => piece !== '');
  const crowded = pieces.slice(1).some((piece) => {
    const words = piece.split(/ +/);
    // (A piece that is one known name of several words, "D. df", is one cell.)
    // (Nor is one value with a space inside, "− 0.44".)
    return words.length > 1 && !isKnownHeader(headerKey(piece)) && !isValueToken(piece) && words.every((word) => isValueToken(word) || isKnownHeader(headerKey(word)));
  });
  return crowded ? { ...line, text: line.text.replace(/\t/g, ' '), crushed: true } : line;
}

/** Cells apart by two or more spaces or a tab, with their offsets. */
function alignedCells(text: string): Piece[] {
  const cells: Piece[] = [];
  const separator = /\t+| {2,}/g;
  let start = leadingSpace(text);
  separator.lastIndex = start;
  for (let match = separator.exec(text); match !== null; match = separator.exec(text)) {
    if (match.index > start) cells.push({ text: text.slice(start, match.index), start, end: match.index });
    start = match.index + match[0].length;
  }
  const end = text.trimEnd().length;
  if (end > start) cells.push({ text: text.slice(start, end), start, end });
  return cells;
}

/**
 * Aligned header cells with a cell that no vocabulary knows but whose words, apart by single spaces, are each a known
 * name of a test's column ("ges p.value", two columns a narrow gap set apart in a program's output): each word a cell.
 */
function splitKnownNames(cells: Piece[]): Piece[] {
  return cells.flatMap((cell, index) => {
    if (index === 0 || !cell.text.includes(' ') || isKnownHeader(headerKey(cell.text))) return [cell];
    const words: Piece[] = [];
    for (const match of cell.text.matchAll(/\S+/g)) words.push({ text: match[0], start: cell.start + match.index!, end: cell.start + match.index! + match[0].length });
    // (Not names of descriptive columns: "M SD" over "12.3 (4.5)" is one column of means and their SDs.)
    return words.length >= 2 && words.every((word) => isKnownHeader(headerKey(word.text)) && !['label', 'descriptive', 'unknown'].includes(classifyHeader(word.text).role)) ? words : [cell];
  });
}

interface HeaderLine {
  readonly columns: readonly Piece[];
  /** True when the columns stand apart by wide gaps, so positions can place data cells. */
  readonly aligned: boolean;
  /** True when the header's cells are separated by single tabs, as rows copied from a word processor are. */
  readonly tabbed: boolean;
}

/**
 * A header line: known column names, after an optional label header
 * ("Source", "Effect", or any words before the first known name). Aligned
 * headers are read cell by cell; crushed ones are grouped into the longest
 * known phrases ("Sum of squares", "Partial eta squared").
 */
/** "OR, odds ratio;", "CI, confidence interval;": an abbreviation, a comma and its meaning in lower case, closed by a semicolon. */
const ABBREVIATION_GLOSS = /(?:^|[\s;.])[\p{Lu}][\p{L}\d]{0,7}, [\p{Ll}][\p{L}\- ]{2,60};/gu;

/** Whether a line lists two or more abbreviations with their meanings, as a caption or note does. */
function isAbbreviationList(text: string): boolean {
  if (!text.includes(';')) return false;
  return (text.match(ABBREVIATION_GLOSS)?.length ?? 0) >= 2;
}

/**
 * Answers about one line, kept per line: readSpacedTable asks them of a line, of the line after it and of the
 * one after that (readWrappedHeader) as it moves down the text, three times over for every line of prose.
 * (The answers are read-only: HeaderLine and DataLine.)
 */
function keptPerLine<Answer>(answer: (line: Line) => Answer): (line: Line) => Answer {
  const kept = new WeakMap<Line, { answer: Answer }>();
  return (line) => {
    const known = kept.get(line);
    if (known !== undefined) return known.answer;
    const fresh = answer(line);
    kept.set(line, { answer: fresh });
    return fresh;
  };
}

const readHeader = keptPerLine(readHeaderOf);

function readHeaderOf(line: Line): HeaderLine | null {
  const text = line.text;
  if (text.length > MAX_ROW_LENGTH || text.trim() === '' || /\d\.\d/.test(text)) return null;
  if (!line.crushed && text.includes('\t')) {
    const cells = text.split('\t').map((cell) => cell.trim());
    const known = cells.filter((cell) => isKnownHeader(headerKey(cell)) || INCOMPLETE_HEADERS.has(headerKey(cell))).length;
    // PDF text extraction can put tabs between some header cells and spaces between others
    // ("Source \tSS \tdf MS F \tp"): a tab cell holding several words that are not one known
    // name means the tabs do not mark cells, so the line is read as crushed instead.
    const mixed = cells.slice(1).some((cell) => /\s/.test(cell) && !isKnownHeader(headerKey(cell)));
    if (!mixed && cells.length >= 3 && known >= 2 && known >= cells.length - 1) {
      return { columns: cells.map((cell) => ({ text: cell, start: 0, end: 0 })), aligned: false, tabbed: true };
    }
  }
  const cells = line.crushed ? [] : splitKnownNames(alignedCells(text));
  if (cells.length >= 3) {
    const known = cells.filter((cell) => isKnownHeader(headerKey(cell.text)) || INCOMPLETE_HEADERS.has(headerKey(cell.text))).length;
    // Wide gaps also set apart names no vocabulary knows, groups' names before a test's columns ("Group A M (SD)
    // Group B M (SD)   t (58)   p"): a header when it names a test statistic and its p, and knows most names.
    const roles = cells.map((cell) => classifyHeader(cell.text).role);
    const namesTest = roles.includes('statistic') && roles.includes('p');
    // (The first cell names the label column in any words: "Characteristic".)
    const unknownAfterFirst = cells.slice(1).filter((cell) => !isKnownHeader(headerKey(cell.text)) && !INCOMPLETE_HEADERS.has(headerKey(cell.text))).length;
    if (known >= 2 && (known >= cells.length - 1 || (namesTest && unknownAfterFirst <= known))) {
      const first = cells[0]!;
      const labelKnown = classifyHeader(first.text).role === 'label' || !isKnownHeader(headerKey(first.text));
      const columns = labelKnown ? cells : [{ text: '', start: 0, end: 0 }, ...cells];
      return { columns, aligned: true, tabbed: false };
    }
  }
  // A caption's list of abbreviations ("OR, odds ratio; CI, confidence interval; LL, lower limit; …") names the
  // columns' words but is no header: a header line does not hold two "name, meaning;" glosses.
  if (isAbbreviationList(text)) return null;
  const tokens = withDfAfterWith(text, withGroupSizes(text, tokenize(text)));
  if (tokens.length < 2) return null;
  // A crushed header names at least two columns; prose rarely has two words that could begin a name.
  if (tokens.filter((token) => couldStartHeader(token.text)).length < 2) return null;
  const columns: Piece[] = [];
  let index = 0;
  let labelEnd = 0;
  // Label header: words up to the first known column name (a label word itself counts as label).
  while (index < tokens.length && index <= MAX_LABEL_WORDS && !startsKnownPhrase(tokens, index)) index++;
  if (index >= tokens.length || index > MAX_LABEL_WORDS) return null;
  if (index > 0) labelEnd = index;
  else if (classifyHeader(tokens[0]!.text).role === 'label') {
    // The label's name, unless the longest phrase is a column's name ("Effect df" is an effect's df, after "Effect").
    const length = knownPhraseLength(tokens, 0);
    const phrase = join(text, tokens[0]!, tokens[length - 1]!).text;
    labelEnd = classifyHeader(phrase).role === 'label' ? length : 1;
    index = labelEnd;
  }
  if (labelEnd > MAX_LABEL_WORDS) return null;
  // Groups named with their sizes between the label's name and the test's columns ("Characteristic
  // Experimental (n=29) Control (n=29) Chi-square (df) ..."): a column each, not words of the label's name.
  const grouped = labelEnd > 1 && ['label', 'unknown'].includes(classifyHeader(tokens[0]!.text).role) ? groupsWithSizes(text, tokens.slice(0, labelEnd)) : null;
  if (grouped !== null) labelEnd = grouped.labelEnd;
  columns.push(labelEnd > 0 ? join(text, tokens[0]!, tokens[labelEnd - 1]!) : { text: '', start: 0, end: 0 });
  let named = 0;
  // (Groups named with their sizes are columns the header names clearly: they count as neither known nor unknown.)
  let unknown = 0;
  if (grouped !== null) columns.push(...grouped.groups);
  /** The column an unknown run of words was pushed as, while it is the last one. */
  let unknownRun = -1;
  let namesTest = false;
  while (index < tokens.length) {
    const length = headerPhraseLength(tokens, index);
    // A footnote letter standing apart after a column's name ("X 2 a P b", the letters superscripts) names no column.
    // (A "b" right after a statistic or p is such a letter too, not a column of regression weights.)
    const previousRole = columns.length > 1 ? classifyHeader(columns[columns.length - 1]!.text).role : null;
    const afterTest = previousRole === 'statistic' || previousRole === 'p';
    // (Not "d" or "g" after a p, which name effect sizes: "t df p d".)
    const effectLetter = classifyHeader(tokens[index]!.text).role === 'effect';
    if ((length === 0 || (afterTest && !effectLetter)) && named > 0 && /^[a-h]$/.test(tokens[index]!.text) && (index + 1 === tokens.length || knownPhraseLength(tokens, index + 1) > 0)) {
      index++;
      continue;
    }
    if (length === 0) {
      // Words the vocabulary does not know ("Baseline", "Difficulty accessing dental care,"): one column of
      // unknown meaning, tolerated when the names around it clearly make a header.
      let end = index + 1;
      while (end < tokens.length && knownPhraseLength(tokens, end) === 0) end++;
      // After a test's p, words to the header's end are one column of remarks, even where a word of them is a known
      // name ("… Z Df p Behavioural differences between test 1 and test 2": not "test" and "1 and" columns).
      if (previousRole === 'p' && end < tokens.length && remarksToEnd(tokens, end)) end = tokens.length;
      // Codes with a digit each ("T0\u20131 T0\u20132", "T1 T2 T3", "W0 W12") are a column each; words ("Time 1",
      // "Baseline", "Difficulty accessing dental care,") are one name.
      const codes = end - index >= 2 && tokens.slice(index, end).every((token) => COLUMN_CODE.test(token.text));
      // Groups named with their sizes ("Intervention (n = 60) Control (n = 58)"): a column each, counted as
      // neither known nor unknown (their names say clearly what they are).
      const sized = codes ? null : namesEndingWithSizes(text, tokens.slice(index, end));
      // Names that repeat their first word ("Group 1 Group 2", "Time 1 Time 2 Time 3"): a column each.
      const repeated = codes || sized !== null ? null : repeatedNames(tokens.slice(index, end));
      if (sized !== null) {
        columns.push(...sized);
        unknownRun = -1;
      } else if (repeated !== null) {
        // (Counted as neither known nor unknown, like groups named with their sizes: their names say they are columns.)
        for (const [first, last] of repeated) columns.push(join(text, tokens[index + first]!, tokens[index + last]!));
        unknownRun = -1;
      } else if (codes) {
        for (let at = index; at < end; at++) columns.push(tokens[at]!);
        unknown += end - index;
      } else {
        columns.push(join(text, tokens[index]!, tokens[end - 1]!));
        unknownRun = columns.length - 1;
        unknown++;
      }
      index = end;
      continue;
    }
    const phrase = join(text, tokens[index]!, tokens[index + length - 1]!);
    const role = classifyHeader(phrase.text).role;
    if (role === 'statistic' || role === 'p') namesTest = true;
    index += length;
    // A group's name before what its column holds ("Group A M (SD)", "Men n (%)") is one column's name.
    const previous = columns[columns.length - 1];
    // (A count with its percentage too, "Men n (%)"; a bare "n" after unknown words is a column of its own: "1-β n".)
    if ((role === 'descriptive' || (role === 'n' && phrase.text.includes('%'))) && columns.length > 1 && previous !== undefined && unknownRun === columns.length - 1) {
      columns[columns.length - 1] = { text: text.slice(previous.start, phrase.end), start: previous.start, end: phrase.end };
      unknownRun = -1;
      unknown--;
      named++;
      continue;
    }
    columns.push(phrase);
    named++;
  }
  withFirstGroupNamed(text, columns);
  // (One column's name is a header after a known label column's name, when it names a statistic: "Variable r (p)".)
  const labelNamed = columns[0]!.text !== '' && classifyHeader(columns[0]!.text).role === 'label';
  const oneStatistic = named === 1 && labelNamed && classifyHeader(columns[columns.length - 1]!.text).role === 'statistic';
  if (unknown === 0) return named >= 2 || oneStatistic ? { columns, aligned: false, tabbed: false } : null;
  // Block titles between names ("SF-12 Physical ... r (P value) SF-12 Mental ... r (P value)"): two statistic
  // names with their titles are a header too.
  const statisticNames = columns.filter((column) => classifyHeader(column.text).role === 'statistic').length;
  // Group names between the label and a test's columns ("Variable Men Women t(58) p"): one run of unknown words
  // before a statistic and its p.
  // (A statistic whose cells hold their p too, "χ2 (p)", names the p.)
  const pNames = columns.filter((column) => {
    const role = classifyHeader(column.text);
    return role.role === 'p' || (role.role === 'statistic' && role.pInCell === true);
  }).length;
  // (Or a test's statistic alone as the last column, its p given by marks: "Item Women Men χ2(1)".)
  const lastNamesStatistic = classifyHeader(columns[columns.length - 1]!.text).role === 'statistic';
  const groupsThenTest = unknown === 1 && statisticNames >= 1 && (pNames >= 1 || lastNamesStatistic);
  return namesTest && (named >= 3 || statisticNames >= 2 || groupsThenTest) && unknown <= named ? { columns, aligned: false, tabbed: false } : null;
}

/**
 * A crushed header of a label column named in any words and one statistic column that states its df ("Sl. no#
 * Statements Chi-square (χ2) value with 88 d.f.", "Item χ2 (df = 2)"): the statistic's cells are the table's only
 * values, their significance given by marks. The df must be in the name (classifyHeader reads them), the label's
 * words hold no number and name no statistic or p. Null for anything else. (Taken only under a table's title: see
 * readSpacedTable.)
 */
function statisticWithDfHeader(line: Line): HeaderLine | null {
  const text = line.text;
  if (text.length > MAX_ROW_LENGTH || isBlank(line) || TITLE.test(text) || NOTE.test(text)) return null;
  const tokens = withDfAfterWith(text, tokenize(text));
  const last = tokens[tokens.length - 1];
  if (last === undefined || tokens.length < 2 || tokens.length - 1 > MAX_LABEL_WORDS) return null;
  const named = classifyHeader(last.text);
  if (named.role !== 'statistic' || (named.df ?? []).length === 0) return null;
  const labelWords = tokens.slice(0, -1);
  if (labelWords.some((token) => /\d/.test(token.text) || ['statistic', 'p'].includes(classifyHeader(token.text).role))) return null;
  return { columns: [join(text, labelWords[0]!, labelWords[labelWords.length - 1]!), last], aligned: false, tabbed: false };
}

/** Most non-blank lines between a table's title and its header ("From: <the article's title>" under a web page's title). */
const MAX_LINES_TITLE_TO_HEADER = 3;

/** Most lines, blank ones too, looked at above a header for its title. */
const MAX_LINES_ABOVE_HEADER = 12;

/** Whether a table's title ("Table 5 …") stands a few short lines above `first`, no row of values between. */
function titleShortlyAbove(lines: Line[], first: number): boolean {
  let seen = 0;
  for (let index = first - 1; index >= 0 && first - index <= MAX_LINES_ABOVE_HEADER && seen <= MAX_LINES_TITLE_TO_HEADER; index--) {
    const line = lines[index]!;
    if (isBlank(line)) continue;
    if (TITLE.test(line.text) && line.text.length <= 300) return true;
    if (line.text.length > 300 || readRowLine(line, true) !== null) return false;
    seen++;
  }
  return false;
}

/** Most characters of a statement a row may hold before its one value (a questionnaire's item, written out). */
const MAX_STATEMENT_LENGTH = 200;

/**
 * A row under a header of one statistic column (statisticWithDfHeader): its label, a statement in any words (a
 * questionnaire's item, "1. GM crops will lead to reductions in biodiversity"), and its last token, the statistic
 * with decimals and its marks if any ("40.33*", "3.10 n.s.", "2.45"). The label holds no comparison ("=", "<"): a
 * sentence reporting a test is prose. Null for anything else.
 */
function statementRow(line: Line): DataLine | null {
  const text = line.text;
  if (text.length > MAX_ROW_LENGTH || TITLE.test(text) || NOTE.test(text)) return null;
  const tokens = tokenize(text);
  let first = tokens.length;
  while (first > 1 && tokens.length - first < 2 && (isMarkToken(tokens[first - 1]!.text) || readCell(tokens[first - 1]!.text, 'either').kind === 'ns')) first--;
  first--;
  // (The statistic prints decimals: a whole number, "… was 58", is a count or a size, and a number closing a
  // sentence, "… was 5.8.", is prose's.)
  const value = tokens[first]?.text ?? '';
  const cell = readCell(value, 'either');
  if (first < 1 || cell.kind !== 'number' || !/\.\d/.test(cell.number.text) || /\d\.$/.test(value)) return null;
  const label = join(text, tokens[0]!, tokens[first - 1]!);
  if (label.text.length > MAX_STATEMENT_LENGTH || !/\p{L}/u.test(label.text) || /[=<>\u2264\u2265]/.test(label.text) || /[;:,]$/.test(label.text)) return null;
  return { label, values: tokens.slice(first) };
}

/** Most lines one wrapped statement may take. */
const MAX_STATEMENT_LINES = 3;

/**
 * A statement row (statementRow) the page wrapped: lines of words without a value at their end, then a line that
 * ends in the statistic, no blank line between. Its label runs over the lines; its values are taken from the last
 * line, where they stand (offsets relative to it, as every row's are). Null when the lines do not make one.
 */
function wrappedStatementRow(lines: Line[], first: number): { data: DataLine; lastLine: number } | null {
  const head = lines[first];
  if (head === undefined || isBlank(head) || TITLE.test(head.text) || NOTE.test(head.text) || statementRow(head) !== null) return null;
  let joined = head.text.trim();
  for (let index = first + 1; index < lines.length && index - first < MAX_STATEMENT_LINES; index++) {
    const line = lines[index]!;
    if (isBlank(line) || TITLE.test(line.text) || NOTE.test(line.text)) return null;
    joined = `${joined} ${line.text.trim()}`;
    const data = statementRow({ ...line, text: joined });
    if (data === null) continue;
    const tokens = tokenize(line.text);
    const values = tokens.slice(tokens.length - data.values.length);
    if (values.length === tokens.length) return null;
    return { data: { label: { text: data.label.text, start: 0, end: 0 }, values }, lastLine: index };
  }
  return null;
}

/**
 * A run of words that names several columns alike, each starting with the same word and as long as the others
 * ("Group 1 Group 2", "Time 1 Time 2 Time 3", "Wave A Wave B"): each name's first and last token index; null when
 * the run does not split so.
 */
function repeatedNames(tokens: readonly Piece[]): [number, number][] | null {
  const first = tokens[0]?.text;
  if (first === undefined || tokens.length < 4) return null;
  const length = tokens.findIndex((token, index) => index > 0 && token.text === first);
  if (length < 2 || tokens.length % length !== 0) return null;
  const names: [number, number][] = [];
  for (let start = 0; start < tokens.length; start += length) {
    if (tokens[start]!.text !== first) return null;
    names.push([start, start + length - 1]);
  }
  return names;
}

/**
 * Whether the header's tokens from `start` name no column of a test's (a statistic, df, p, effect size, sums or
 * mean squares): only words that label rows ("test", "variable") or no known name, with at most two digits among
 * them ("test 1 and test 2").
 */
function remarksToEnd(tokens: readonly Piece[], start: number): boolean {
  const rest = tokens.slice(start);
  if (rest.length > MAX_TRAILING_WORDS || rest.filter((token) => /\d/.test(token.text)).length > 2) return false;
  return rest.every((token) => {
    const role = classifyHeader(token.text).role;
    return role === 'label' || role === 'unknown';
  });
}

/**
 * A crushed header with no name over its labels, whose first group's name was taken for one: "Pregnant women
 * n (%) Non-pregnant mothers n (%) Chi square value p value" gave the label "Pregnant women" and a column
 * "n (%)", while the second group kept its name ("Non-pregnant mothers n (%)"). When the column after the label
 * is what a later group's column holds (the same words ending a later name), the label's words are the first
 * group's name: the label column is left unnamed and the group's column named in full. Changes `columns` in place.
 */
function withFirstGroupNamed(text: string, columns: Piece[]): void {
  const [label, first] = [columns[0], columns[1]];
  if (label === undefined || first === undefined || label.text === '' || classifyHeader(label.text).role === 'label') return;
  const firstRole = classifyHeader(first.text).role;
  if (firstRole !== 'descriptive' && !(firstRole === 'n' && first.text.includes('%'))) return;
  const key = headerKey(first.text);
  const repeated = columns.slice(2).some((column) => {
    const own = headerKey(column.text);
    return own.length > key.length && own.endsWith(` ${key}`) && classifyHeader(column.text).role === 'unknown';
  });
  if (!repeated) return;
  columns.splice(0, 2, { text: '', start: 0, end: 0 }, { text: text.slice(label.start, first.end), start: label.start, end: first.end });
}

/**
 * A header whose names wrapped onto a second line, as narrow PDF columns
 * print them ("Source Type III Sum of" / "Squares df Mean Square F Sig."):
 * read as one single-spaced header when neither line is one alone, neither
 * is a row of values, and the second line is followed by one.
 */
function readWrappedHeader(lines: Line[], first: number): HeaderLine | null {
  const line = lines[first]!;
  const next = lines[first + 1];
  if (next === undefined || isBlank(line) || isBlank(next) || line.text.length + next.text.length > MAX_ROW_LENGTH) return null;
  if (readHeader(next) !== null || readRowLine(next, true) !== null || readRowLine(line, true) !== null) return null;
  const after = lines[first + 2];
  if (after === undefined || readRowLine(after, true) === null) return null;
  const joined: Line = { start: line.start, end: next.end, text: `${line.text.trimEnd()} ${next.text.trimStart()}`, crushed: true };
  const header = readHeader(joined);
  return header === null ? null : { ...header, aligned: false };
}

/**
 * A header a PDF's narrow column broke in two after a name, whose first line reads as a header of its own but names
 * no test ("Dependent variable Source of variation Sum of squares d.f. Mean square" / "F-value P-value Pairwise
 * comparisons"): the two lines as one header, when the second holds names only, the joined header names the test
 * and its p, and a row follows.
 */
function readHeaderGoingOn(lines: Line[], first: number, header: HeaderLine): HeaderLine | null {
  const next = lines[first + 1];
  const after = lines[first + 2];
  // (Crushed lines only: names stacked over a header laid out in columns are read by where they stand.)
  if (header.aligned || header.tabbed || next === undefined || after === undefined || isBlank(next) || /\d|\S\s{3,}\S|\t/.test(next.text) || next.text.length > MAX_HEADER_GOING_ON) return null;
  const roles = (names: readonly string[]): string[] => names.map((name) => classifyHeader(name).role);
  const named = roles(header.columns.map((column) => column.text));
  if (named.includes('statistic') || named.includes('p') || readRowLine(after, true) === null) return null;
  const joined: Line = { start: lines[first]!.start, end: next.end, text: `${lines[first]!.text.trimEnd()} ${next.text.trimStart()}`, crushed: true };
  const whole = readHeader(joined);
  if (whole === null) return null;
  const wholeRoles = roles(whole.columns.map((column) => column.text));
  return wholeRoles.includes('statistic') && wholeRoles.includes('p') ? { ...whole, aligned: false } : null;
}

/** Longest second line of a header broken in two. */
const MAX_HEADER_GOING_ON = 80;

function join(text: string, first: Piece, last: Piece): Piece {
  return { text: text.slice(first.start, last.end), start: first.start, end: last.end };
}

function startsKnownPhrase(tokens: readonly Piece[], index: number): boolean {
  return knownPhraseLength(tokens, index) > 0;
}

/**
 * The words of the header name starting at `index`: the longest known phrase, except that "df Error df" is
 * "df" and "Error df" (a name ends with its noun: "Hypothesis df", "Error df"), not "df Error" and "df".
 */
function headerPhraseLength(tokens: readonly Piece[], index: number): number {
  const length = knownPhraseLength(tokens, index);
  const dfFirst = length === 2 && /^d\.?f\.?$/i.test(tokens[index]!.text) && /^d\.?f\.?$/i.test(tokens[index + 2]?.text ?? '');
  // "df Error df" is "df" then "Error df"; "df num df den" is "df num" then "df den": the second "df" opens a name
  // of its own with the word after it, so the first pair is whole.
  const pairsAfter = knownPhraseLength(tokens, index + 2) === 2;
  return dfFirst && knownPhraseLength(tokens, index + 1) === 2 && !pairsAfter ? 1 : length;
}

/** "n = 30" after a group's name in a header ("Group A n = 30"): one token, part of the name, not an "n" column. */
/** A name that ends with its group's size: "Experimental (n=29)", "Control (N = 30)", "n = 29". */
const GROUP_SIZE_END = /(?:\(\s?[nN]\s?=\s?\d{1,6}\s?\)|^[nN] ?= ?\d{1,6})$/;

/**
 * The label's name and two or more groups' names after it, each group's ending with its size ("Characteristic
 * Experimental (n=29) Control (n=29)", "Knowledge characteristics Rural (n = 300) Urban (n = 329)"): the first
 * group's name runs back from its size over capitalised words only ("Usual care (n=31)"), never over the first
 * word. Null when the words do not end with a group's size, or name one group only.
 */
function groupsWithSizes(text: string, tokens: readonly Piece[]): { labelEnd: number; groups: Piece[] } | null {
  const sized = tokens.map((token, index) => (index > 0 && GROUP_SIZE_END.test(token.text) ? index : -1)).filter((index) => index >= 0);
  if (sized.length < 2 || sized[sized.length - 1] !== tokens.length - 1) return null;
  let firstStart = sized[0]!;
  while (firstStart > 1 && /^\p{Lu}/u.test(tokens[firstStart - 1]!.text) && !GROUP_SIZE_END.test(tokens[firstStart - 1]!.text)) firstStart--;
  const groups: Piece[] = [];
  let start = firstStart;
  for (const end of sized) {
    groups.push(join(text, tokens[start]!, tokens[end]!));
    start = end + 1;
  }
  return { labelEnd: firstStart, groups };
}

/** Two or more names each ending with its group's size, covering all of `tokens`: a piece per name; null otherwise. */
function namesEndingWithSizes(text: string, tokens: readonly Piece[]): Piece[] | null {
  const names: Piece[] = [];
  let start = 0;
  tokens.forEach((token, index) => {
    if (!GROUP_SIZE_END.test(token.text)) return;
    names.push(join(text, tokens[start]!, token));
    start = index + 1;
  });
  return names.length >= 2 && start === tokens.length ? names : null;
}

/**
 * "with 2 df", "with 88 d.f.", "with 1 and 52 degrees of freedom" after a statistic's name in a crushed header
 * ("χ2 with 2 df", "Chi-square (χ2) value with 88 d.f."): one token with the word before it, so that the name and
 * its df make one column, not a column "with 2" and a df column.
 */
function withDfAfterWith(text: string, tokens: readonly Piece[]): Piece[] {
  const merged: Piece[] = [];
  for (let index = 0; index < tokens.length; index++) {
    const length = dfAfterWithLength(tokens, index);
    if (length > 0 && merged.length > 0) {
      let before = merged.pop()!;
      // (The name may end in a word saying the column holds its values: "Chi-square (χ2) value with 88 d.f.".)
      const named = merged[merged.length - 1];
      if (VALUE_WORD.test(before.text) && named !== undefined && classifyHeader(named.text).role === 'statistic') before = merged.pop()!;
      const last = tokens[index + length - 1]!;
      merged.push({ text: text.slice(before.start, last.end), start: before.start, end: last.end });
      index += length - 1;
      continue;
    }
    merged.push(tokens[index]!);
  }
  return merged;
}

/** A word after a statistic's name saying its column holds the statistic's values ("χ2 value", "F statistic"). */
const VALUE_WORD = /^(?:values?|statistics?|scores?)$/i;

/** Tokens in "with N df" or "with N and M df" starting at `index` (0 if none there). */
function dfAfterWithLength(tokens: readonly Piece[], index: number): number {
  if (!/^with$/i.test(tokens[index]?.text ?? '') || !WHOLE_DF.test(tokens[index + 1]?.text ?? '')) return 0;
  let at = index + 2;
  if (/^and$/i.test(tokens[at]?.text ?? '') && WHOLE_DF.test(tokens[at + 1]?.text ?? '')) at += 2;
  if (/^(?:d\.?f\.?|dfs?)$/i.test(tokens[at]?.text ?? '')) return at + 1 - index;
  const words = tokens.slice(at, at + 3).map((token) => token.text.toLowerCase());
  return words.length === 3 && /^degrees?$/.test(words[0]!) && words[1] === 'of' && words[2] === 'freedom' ? at + 3 - index : 0;
}
const WHOLE_DF = /^\d{1,5}$/;

function withGroupSizes(text: string, tokens: readonly Piece[]): Piece[] {
  const merged: Piece[] = [];
  for (let index = 0; index < tokens.length; index++) {
    const token = tokens[index]!;
    const next = tokens[index + 1];
    if (/^[nN]$/.test(token.text) && next !== undefined && /^= ?\d{1,6}$/.test(next.text) && merged.length > 0) {
      merged.push({ text: text.slice(token.start, next.end), start: token.start, end: next.end });
      index++;
      continue;
    }
    merged.push(token);
  }
  return merged;
}

/**
 * A word that names groups, before the letter or number that names one of them ("Group B", "Arm C",
 * "Condition 2"): the letter is the group's name, not a column of its own (a "B" column of regression
 * weights). Common practice in tables comparing groups; with the words of the corpus's other languages.
 */
const GROUP_NOUN = /^(?:groups?|conditions?|arms?|class(?:es)?|clusters?|types?|sites?|waves?|cohorts?|profiles?|samples?|studys?|studies|phases?|levels?|subgroups?|grupos?|groupes?|gruppen?|groep(?:en)?|gruppo|gruppi)$/i;

/** Words in the longest known header phrase starting at `index` (0 if none). */
function knownPhraseLength(tokens: readonly Piece[], index: number): number {
  const longest = longestKnownPhrase(tokens, index, LONGEST_HEADER_WORDS);
  // A phrase that ends with a statistic's symbol beginning a name for two statistics ("Control χ2" before
  // "χ2 or t (df)": words taken for the symbol's qualifier) ends before that symbol: the longer name is the column's.
  if (longest >= 2) {
    const last = index + longest - 1;
    const fromLast = longestKnownPhrase(tokens, last, LONGEST_HEADER_WORDS);
    const name = tokens
      .slice(last, last + fromLast)
      .map((token) => token.text)
      .join(' ');
    if (fromLast >= 2 && classifyHeader(tokens[last]!.text).role === 'statistic' && classifyHeader(name).role === 'result') return longestKnownPhrase(tokens, index, longest - 1);
  }
  return longest;
}

/** Words in the longest known header phrase of at most `most` words starting at `index` (0 if none). */
function longestKnownPhrase(tokens: readonly Piece[], index: number, most: number): number {
  const groupLetter = index > 0 && index < tokens.length && /^[A-Z]$/.test(tokens[index]!.text) && GROUP_NOUN.test(tokens[index - 1]!.text);
  for (let length = Math.min(most, tokens.length - index); length >= 1; length--) {
    const phrase = tokens
      .slice(index, index + length)
      .map((token) => token.text)
      .join(' ');
    const key = headerKey(phrase);
    // (A group's letter is no column's name alone; it may begin a longer one, "X 2" for chi-square.)
    if ((isKnownHeader(key) || INCOMPLETE_HEADERS.has(key)) && !(groupLetter && length === 1)) return length;
  }
  return 0;
}

interface DataLine {
  readonly label: Piece;
  readonly values: readonly Piece[];
}

/** A numbered variable's label ("1. SPAS Total Score", "1 Anxiety"), as matrices number their rows. */
const NUMBERED_LABEL = /^\d{1,2}\.?\s{1,4}\p{L}/u;
/** The diagonal of a correlation matrix as printed: a dash, or a correlation of 1. */
const DIAGONAL_CELL = /^(?:[-\u2013\u2014\u2212]|1|1\.0{1,3})$/;

/** A factor set to one of its levels by name in a row's label: "ROI = R-ant", "Group = Control" (a word on each side). */
const LEVEL_SET_BY_NAME = /(?<=[\p{L}\d)]) ?= ?(?=\p{L})/gu;

/** A row: a label, then a run of values (numbers, dashes, "ns") to the end of the line. */
function readDataLine(line: Line, minimumValues: number): DataLine | null {
  const text = line.text;
  if (text.length > MAX_ROW_LENGTH) return null;
  const tokens = tokenize(text);
  let first = tokens.length;
  // Footnote marks standing alone among the values ("<.001 c 1.21", "9.6 <0.0001 *") belong to the run of values.
  while (first > 0 && (isValueToken(tokens[first - 1]!.text) || (isMarkToken(tokens[first - 1]!.text) && first >= 2 && isValueToken(tokens[first - 2]!.text)))) first--;
  if (first === 0 && tokens.length > 0) first = 1; // all numbers: the first is the label ("1", "2005")
  // A label that ends with a number and a conjunction goes on into the first value ("Grades 1 and 2", "Group 2
  // and 57"): that value is the label's, not the row's first cell.
  while (first > 1 && first < tokens.length && LABEL_CONJUNCTION.test(tokens[first - 1]!.text) && /^\d{1,6}$/.test(tokens[first - 2]!.text)) first++;
  const values = tokens.slice(first);
  const label = first > 0 ? join(text, tokens[0]!, tokens[first - 1]!) : { text: '', start: 0, end: 0 };
  // The first row of a numbered matrix's lower triangle holds only dashes ("1. Anxiety – – –"): still a row.
  // (Or the diagonal alone: "1 Anxiety —".)
  const numberedEmptyRow =
    NUMBERED_LABEL.test(label.text) &&
    ((values.length >= 2 && values.every((token) => /^[-\u2013\u2014]$/.test(token.text))) || (values.length === 1 && DIAGONAL_CELL.test(values[0]!.text)));
  const holdsNumber = (token: Piece): boolean => shapeOf(token.text).shape.startsWith('number') || shapeOf(token.text).shape === 'pair' || VALUE_WITH_NAMED_DF.test(token.text);
  if (values.length < minimumValues || (!numberedEmptyRow && !values.some(holdsNumber))) return null;
  // Two numbers in a row inside the label are another row's values: rows run together on one line.
  const labelNumbers = tokens.slice(0, first).some((token, index) => index > 0 && isNumberToken(token.text) && isNumberToken(tokens[index - 1]!.text));
  if (labelNumbers) return null;
  // (A band of a variable as its label, ">70" or "<1000", is not a comparison.)
  const band = /^[<>\u2264\u2265] ?\d{1,6}$/.test(label.text);
  // (A label may state its df or size in brackets: "Group (df = 2, 57)", "Women (n = 30)", or set a factor to
  // one of its levels by name, "ROI = R-ant", "Group = Control": a level's name is a word, not a number.)
  const comparison = /[=<>]/.test(label.text.replace(/\((?:df|d\.f\.|n|N)\s?=\s?[\d.,; /]{1,20}\)/g, '').replace(LEVEL_SET_BY_NAME, ''));
  if (label.text.length > MAX_LABEL_LENGTH || first > MAX_LABEL_WORDS || (/[.;:,]$/.test(label.text) && !ABBREVIATION_END.test(label.text)) || (comparison && !band)) return null;
  return { label, values };
}

/**
 * A row whose cells are all empty ("2 NA NA NA NA NA", "Girls – – –"): its label (a number too, the phase or
 * step it stands for) and at least two cells that read as empty. Null for anything else.
 */
function rowOfEmptyCells(line: Line): DataLine | null {
  if (line.text.length > MAX_ROW_LENGTH || TITLE.test(line.text) || NOTE.test(line.text)) return null;
  const tokens = tokenize(line.text);
  let first = 1;
  while (first < tokens.length && readCell(tokens[first]!.text, 'either').kind !== 'empty') first++;
  const values = tokens.slice(first);
  if (first > MAX_LABEL_WORDS || values.length < 2 || !values.every((token) => readCell(token.text, 'either').kind === 'empty')) return null;
  return { label: join(line.text, tokens[0]!, tokens[first - 1]!), values };
}

/** A label that ends with an abbreviation's point, not a sentence's: "Anger: FLD vs.", "Age (yrs.)", "Dose (approx.". */
const ABBREVIATION_END = /(?:^|[\s(])(?:vs|etc|incl|approx|resp|min|max|yrs?|mo|wk|no|No)\.$/;

/** Between two whole numbers in a label: "Grades 1 and 2", "Group 2 and 57", "Ages 18 to 25". */
const LABEL_CONJUNCTION = /^(?:and|or|to|&|vs\.?|versus)$/;

/** A label and one value that holds a number ("Age .30 (.020)", "BMI −.12"), for a header of one value column. */
function singleValueRow(line: Line): DataLine | null {
  if (TITLE.test(line.text) || NOTE.test(line.text)) return null;
  const data = readDataLine(line, 1);
  return data !== null && data.values.length === 1 && data.label.text !== '' && /\d/.test(data.values[0]!.text) ? data : null;
}

/** Most words of one name a layout copy stacks over a header's column ("Partial Eta", "Type III Sum"). */
const MAX_STACKED_NAME_WORDS = 4;

/** Most lines of names a layout copy stacks over a header line. */
const MAX_STACKED_HEADER_LINES = 2;

/**
 * The header's names with the words stacked over them, as a PDF's layout copy sets a header of several lines
 * ("Type III" / "Sum of" / "Squares"): each line above (up to MAX_STACKED_HEADER_LINES, no digits, no title)
 * whose pieces all stand over value columns, each over one, gives its words to the names below. Null when none.
 */
function stackedHeaderAbove(lines: Line[], first: number, header: HeaderLine): { names: string[]; firstLine: number } | null {
  const names = header.columns.map((column) => column.text);
  const valuesFrom = header.columns[1]?.start ?? Infinity;
  // A header line that names no label column and starts with a value column where the rows' labels start ("F (dfM,
  // dfR)   p   η²" under "Variable   Group   Overall time effect"): a header's second line, or one whose cells stand
  // apart but not in place; what stands over it is no column name stacked by position.
  if (header.columns[0]!.text === '' && valuesFrom <= leadingSpace(lines[first]!.text)) return null;
  let above = first - 1;
  for (; above >= 0 && first - above <= MAX_STACKED_HEADER_LINES; above--) {
    const line = lines[above]!;
    if (isBlank(line) || TITLE.test(line.text) || NOTE.test(line.text) || /\d/.test(line.text) || line.text.length > MAX_ROW_LENGTH) break;
    const pieces = alignedCells(line.text);
    const targets = pieces.map((piece) => columnUnder(piece, header.columns));
    // (A stacked name is a few words, "Type III", "Sum of": a longer piece is a caption's line.)
    const long = pieces.some((piece) => piece.text.split(/\s+/).length > MAX_STACKED_NAME_WORDS);
    if (pieces.length === 0 || long || pieces.some((piece, index) => piece.start < valuesFrom - 1 || targets[index]! < 1)) break;
    pieces.forEach((piece, index) => (names[targets[index]!] = `${piece.text} ${names[targets[index]!]}`));
  }
  return above === first - 1 ? null : { names, firstLine: above + 1 };
}

/** The column a piece of a line above stands over: the one it overlaps most (-1 if none). */
function columnUnder(piece: Piece, columns: readonly Piece[]): number {
  let best = -1;
  let bestOverlap = 0;
  columns.forEach((column, index) => {
    const overlap = Math.min(piece.end, column.end) - Math.max(piece.start, column.start);
    if (overlap > bestOverlap) [best, bestOverlap] = [index, overlap];
  });
  return best;
}

/** A count with its percentage: "62 (29.4%)", "0 (0.0%)". */
const COUNT_PERCENT = /^\d{1,7} ?\(\d{1,3}(?:[.,]\d{1,2})? ?%\)$/;

/** A line of a label and two or more counts with their percentages, nothing else. */
function isCountRow(line: Line): boolean {
  if (line.text.length > MAX_ROW_LENGTH || isBlank(line)) return false;
  const tokens = tokenize(line.text);
  let first = tokens.length;
  while (first > 0 && COUNT_PERCENT.test(tokens[first - 1]!.text)) first--;
  return first > 0 && tokens.length - first >= 2;
}

/** Most rows of counts in a run (a variable's categories). */
const MAX_COUNT_ROWS = 12;

/** Whether the rows of counts from `index` on end at a row of values (blank lines between allowed). */
function countRowsLeadToRow(lines: Line[], index: number): boolean {
  for (let at = index + 1, seen = 0; at < lines.length && seen <= MAX_COUNT_ROWS; at++) {
    const line = lines[at]!;
    if (isBlank(line)) continue;
    if (isCountRow(line)) {
      seen++;
      continue;
    }
    return readRowLine(line, false) !== null;
  }
  return false;
}

/** Most blank lines between two rows of one table. */
const MAX_BLANK_LINES_IN_TABLE = 2;

/** The index of the first non-blank line after `index`, skipping at most MAX_BLANK_LINES_IN_TABLE blank lines; -1 if none. */
function nonBlankAfter(lines: Line[], index: number): number {
  for (let at = index + 1; at < lines.length && at <= index + 1 + MAX_BLANK_LINES_IN_TABLE; at++) {
    if (!isBlank(lines[at])) return at;
  }
  return -1;
}

/** Most section lines in a row before a data row ("UQYBT" / "Composite score (%)" / rows). */
const MAX_SECTION_LINES = 3;

/** True when, after `index`, a data row follows within a few section lines (and blank lines between). */
function leadsToDataRow(lines: Line[], index: number): boolean {
  let at = index;
  for (let step = 0; step < MAX_SECTION_LINES; step++) {
    at = nonBlankAfter(lines, at);
    if (at === -1) return false;
    if (readRowLine(lines[at]!, false) !== null) return true;
    // Rows run together on one line ("BI − −0.260 0.138 … FTRS Healthy −0.038 0.829 …"), whatever its length.
    if (splitRunOnRows(lines[at]!).length > 0) return true;
    // (A page's running head between a section line and its rows is passed over by the reader.)
    if (!isSectionLine(lines[at]) && !isPageFurniture(lines[at]!.text)) return false;
  }
  return false;
}

/** Most lines a wrapped caption runs on over. */
const MAX_CAPTION_LINES = 3;

/** A line that goes on with a caption: words, ending a sentence or not, no run of values, no header of known names. */
function continuesCaption(line: Line): boolean {
  const text = line.text.trim();
  if (text === '' || text.length > MAX_ROW_LENGTH || TITLE.test(text) || NOTE.test(text) || readHeader(line) !== null) return false;
  const tokens = tokenize(text);
  return tokens.filter((token) => isValueToken(token.text)).length <= 1 && /^[\p{Ll}(]/u.test(text);
}

/** A title (or the caption line under a bare one) that says the table holds correlations. */
const CORRELATIONS_TITLE = /correlat/i;
/** Most header lines between a correlation table's caption and its first row. */
const MAX_CORRELATION_HEADER_LINES = 3;
/** A name without the footnote marks glued after it ("WA*" -> "WA"); a loop, not a pattern, to stay linear. */
function withoutTrailingMarks(name: string): string {
  let end = name.length;
  while (end > 0 && '*\u2020\u2021'.includes(name[end - 1]!)) end--;
  return name.slice(0, end);
}

/** Fewest numbered columns a correlation block's header names. */
const MIN_NUMBERED_COLUMNS = 3;

/** Whether the tokens are at most a few words, then the numbers 1, 2, 3, … in order ("Factors 1 2 3 4 5"). */
function numberedColumns(tokens: readonly Piece[]): boolean {
  const first = tokens.findIndex((token) => /^\d/.test(token.text));
  if (first < 0 || first > MAX_LABEL_WORDS || tokens.length - first < MIN_NUMBERED_COLUMNS) return false;
  // (Numbered columns may go on lettered, "… 12 13 a b c", variables of a second kind.)
  let letters = 0;
  return tokens.slice(first).every((token, offset) => {
    if (letters === 0 && token.text === String(offset + 1)) return true;
    if (token.text !== String.fromCharCode(97 + letters)) return false;
    letters++;
    return true;
  });
}

/**
 * Under numbered (and lettered) columns, a row labelled by its number alone ("2   1 0.423* …"): the label's length in
 * tokens (1) when the line's first token is the `rowIndex`-th column's name, 0 otherwise.
 */
function numberLabelLength(tokens: readonly Piece[], header: readonly string[] | undefined, rowIndex: number): number {
  if (header === undefined || !numberedColumns(header.filter((text) => text !== '').map((text) => ({ text, start: 0, end: 0 })))) return 0;
  const names = header.slice(header.findIndex((text) => /^\d/.test(text)));
  return tokens.length >= 2 && tokens[0]!.text === names[rowIndex] ? 1 : 0;
}

/** A row label's number in brackets at its end, "School health policy (1)" (group: the number). */
const TRAILING_NUMBER = /\((\d{1,2})\)$/;
/** Share of a correlation block's rows whose label names a column too. */
const MIN_MATRIX_ROW_SHARE = 0.7;
/** Most rows read for one correlation block. */
const MAX_CORRELATION_ROWS = 200;

/**
 * A correlation matrix whose header names its columns by the variables (no
 * known column name), crushed into single spaces: "STAI TAI SAQ-S MARS WA"
 * over "STAI – 0.50 0.43 0.50 −0.26". Under a title that says the table
 * holds correlations, the lines of words are its header and each following
 * line of a label and values one row (several blocks side by side stay on
 * one row; the correlation reader cuts them at their labels). Read only when
 * most rows' labels name columns too: a square matrix shows its structure,
 * a crushed rectangle of unknown names does not.
 */
function readCorrelationBlock(lines: Line[], titleIndex: number): { table: DocumentTable; lastLine: number } | null {
  const title = lines[titleIndex]!;
  let index = titleIndex + 1;
  while (index < lines.length && isBlank(lines[index])) index++;
  let caption = BARE_TITLE.test(title.text) && lines[index] !== undefined ? lines[index]!.text.trim() : '';
  if (caption !== '') index++;
  // A caption a page wrapped over lines goes on until a line ends it with a full stop (a few lines at most).
  for (let more = 0; caption !== '' && !/\.$/.test(caption) && more < MAX_CAPTION_LINES && lines[index] !== undefined && continuesCaption(lines[index]!); more++) {
    caption = `${caption} ${lines[index]!.text.trim()}`;
    index++;
  }
  if (!CORRELATIONS_TITLE.test(`${title.text} ${caption}`)) return null;
  // Cells that write each correlation with its symbol ("r = 0.586*") hold spaces themselves: where the rows set such
  // cells apart by wide gaps, every line of the block is cut at its gaps, not at its spaces, and the header's lines
  // are kept as its rows (group titles over the columns' names).
  // (Crushed into single spaces, the rows are cut before each result's symbol and a header line of group titles after
  // each group's size, "Non-shift workers (n = 1,966) Regularly rotating shift workers (n = 1,936)".)
  const written = writtenCellsApart(lines, index) ? 'apart' : writtenCellsCrushed(lines, index) ? 'crushed' : null;
  const cellsOf = (text: string): readonly Piece[] =>
    written === 'apart' ? alignedCells(text) : written === 'crushed' ? (writtenRowCells(text) ?? groupTitleCells(text) ?? tokenize(text)) : tokenize(text);
  const headers: string[][] = [];
  for (; index < lines.length && headers.length < MAX_CORRELATION_HEADER_LINES; index++) {
    const line = lines[index]!;
    if (isBlank(line)) continue;
    // Rows with pipes or tabs are read by the pipe and tab readers.
    if (/[|\t]/.test(line.text)) return null;
    const tokens = cellsOf(line.text);
    // (A label and a dash alone is the matrix's first row, its diagonal: "Anxiety —".)
    const diagonalOnly = tokens.length >= 2 && /^[-\u2013\u2014\u2212]$/.test(tokens[tokens.length - 1]!.text);
    // (Columns numbered 1, 2, 3, … after the labels' name, "Factors 1 2 3 4", are a header, not a row.)
    if (numberedColumns(tokens)) {
      // (Without a name over the labels, the header's first cell is that empty name.)
      headers.push([...(/^\d/.test(tokens[0]!.text) ? [''] : []), ...tokens.map((token) => token.text)]);
      continue;
    }
    if (line.text.length > MAX_ROW_LENGTH || diagonalOnly || tokens.some((token) => isValueToken(token.text) && /\d/.test(token.text))) break;
    // A header with known column names ("r (P value)", "M SD r p") is read by the other readers.
    if (readHeader(line) !== null) return null;
    // The first row, its label wrapped by the page, ends the header.
    if (headers.length > 0 && wrappedLabelRow(line, lines[index + 1], true) !== null) break;
    headers.push(tokens.map((token) => token.text));
  }
  const rows: string[][] = [];
  let last = -1;
  for (; index < lines.length && rows.length < MAX_CORRELATION_ROWS; index++) {
    const line = lines[index]!;
    if (isBlank(line)) continue;
    // A page's running head or number between two rows of the matrix (the rows go on after it with as many values).
    if (rows.length > 0 && isPageFurniture(line.text) && rowOfWidthFollows(lines, index, valuesWithoutMarks(rows[rows.length - 1]!.slice(1)), cellsOf)) continue;
    if (TITLE.test(line.text) || NOTE.test(line.text) || line.text.length > MAX_ROW_LENGTH) break;
    const tokens = cellsOf(line.text);
    const numberLabel = numberLabelLength(tokens, headers[headers.length - 1], rows.length);
    const first = numberLabel > 0 ? numberLabel : tokens.findIndex((token) => isValueToken(token.text));
    // A label the page wrapped over two lines, numbered ("1. SPAS a" / "Total Score - - -") or going on in small
    // letters ("Spatial-temporal parameters Gait" / "speed 0.449 †† 0.430 ††"): one row.
    const wrapped = first === -1 ? wrappedLabelRow(line, lines[index + 1], true) : null;
    if (wrapped !== null) {
      rows.push(wrapped);
      last = ++index;
      continue;
    }
    if (first <= 0) break;
    // (The label as the line prints it, gaps and all, "Spatial-temporal parameters   Gait speed": the reader finds each
    // cell in its line, and a label joined with single spaces is not there, so its row would go unread.)
    rows.push([join(line.text, tokens[0]!, tokens[first - 1]!).text, ...tokens.slice(first).map((token) => token.text)]);
    last = index;
  }
  if (rows.length < 2) return null;
  const block = (header: string[][], layout: TableLayout): { table: DocumentTable; lastLine: number } => ({
    table: {
      start: title.start + leadingSpace(title.text),
      end: lines[last]!.start + lines[last]!.text.trimEnd().length,
      caption: [title.text.trim(), caption].filter((part) => part !== '').join(' '),
      notes: readNotes(lines, last + 1).notes,
      rows: [...header, ...rows],
      headerRows: header.length,
      layout,
    },
    lastLine: last,
  });
  // (Cells that write their symbol say what they hold; which n each takes is left to the reader of such cells.)
  if (written !== null && headers.length > 0) return block(headers, 'aligned');
  const header = headers.length > 0 ? headers[headers.length - 1]! : [''];
  // Without known column names, the structure must show itself: the columns are named by the rows' own labels (a
  // matrix), or the table is left to be listed as not read.
  const named = new Set(header.map(withoutTrailingMarks));
  // (A label may carry its column's number at its end instead, "School health policy (1)" under "Factors 1 2 3".)
  const matrixRows = rows.filter((row) => named.has(withoutTrailingMarks(row[0]!.split(' ')[0]!)) || named.has(TRAILING_NUMBER.exec(row[0]!)?.[1] ?? '\u0000')).length;
  // Or a rectangle: every row gives the same number k of correlations (marks apart), and the header's last k
  // words name the k columns ("Gait Variables MMSE ACE-R" over "Gait speed 0.449 †† 0.430 ††").
  const rectangle = matrixRows < MIN_MATRIX_ROW_SHARE * rows.length ? rectangleHeader(header, rows) : null;
  if (matrixRows < MIN_MATRIX_ROW_SHARE * rows.length && rectangle === null) return null;
  return block([rectangle ?? header], 'crushed');
}

/** Lines looked at for a row of written results set apart by wide gaps. */
const MAX_LINES_TO_WRITTEN_ROW = 6;

/** A correlation written with its symbol and marks, as a piece of a crushed row: "r = 0.586*", "ρ = −.12". */
const WRITTEN_R_PIECE = /(?:^|(?<= ))(?:r|\u03c1) ?= ?[-\u2212\u2013]?\d?\.\d{1,4}(?:\*{1,4}|\u2020{1,2}|\u2021{1,2})?(?= |$)/g;
/** A group's size closing its title: "(n = 1,966)", "n = 90". */
const GROUP_SIZE_CLOSING = /\(?[nN] ?= ?\d{1,3}(?:,\d{3})*\)?(?= |$)/g;

/** A crushed row of a label and two or more correlations written with their symbol ("KOSS r = 0.586* r = 0.536*"), cut into its cells; null otherwise. */
function writtenRowCells(text: string): Piece[] | null {
  const matches = [...text.matchAll(WRITTEN_R_PIECE)];
  if (matches.length < 2) return null;
  const labelEnd = matches[0]!.index!;
  const label = text.slice(0, labelEnd).trim();
  if (label === '') return null;
  const start = leadingSpace(text);
  const cells: Piece[] = [{ text: label, start, end: start + label.length }];
  let at = labelEnd;
  for (const match of matches) {
    // (Nothing but spaces between two results: the row is made of them.)
    if (text.slice(at, match.index).trim() !== '') return null;
    cells.push({ text: match[0], start: match.index!, end: match.index! + match[0].length });
    at = match.index! + match[0].length;
  }
  return text.slice(at).trim() === '' ? cells : null;
}

/** A crushed line of two or more group titles, each closed by its size ("Day workers (n = 1,966) Night workers (n = 1,223)"), cut after each size; null otherwise. */
function groupTitleCells(text: string): Piece[] | null {
  const cells: Piece[] = [];
  let at = leadingSpace(text);
  for (const match of text.matchAll(GROUP_SIZE_CLOSING)) {
    const end = match.index! + match[0].length;
    const title = text.slice(at, end).trim();
    if (title === match[0]) return null;
    const start = at + (text.slice(at, end).length - text.slice(at, end).trimStart().length);
    cells.push({ text: title, start, end });
    at = end;
  }
  return cells.length >= 2 && text.slice(at).trim() === '' ? cells : null;
}

/** Whether one of the first lines from `from` is a crushed row of a label and correlations written with their symbol. */
function writtenCellsCrushed(lines: Line[], from: number): boolean {
  let seen = 0;
  for (let index = from; index < lines.length && seen < MAX_LINES_TO_WRITTEN_ROW; index++) {
    if (isBlank(lines[index])) continue;
    seen++;
    if (writtenRowCells(lines[index]!.text) !== null) return true;
  }
  return false;
}

/**
 * Whether one of the first lines from `from` is a row of a label and results written with their symbol, each
 * apart by two or more spaces ("KOSS   r = 0.586*   r = 0.536*   r = 0.535*").
 */
function writtenCellsApart(lines: Line[], from: number): boolean {
  let seen = 0;
  for (let index = from; index < lines.length && seen < MAX_LINES_TO_WRITTEN_ROW; index++) {
    if (isBlank(lines[index])) continue;
    seen++;
    const cells = alignedCells(lines[index]!.text);
    if (cells.length >= 3 && cells.slice(1).every((cell) => shapeOf(cell.text).shape === 'written')) return true;
  }
  return false;
}

/**
 * A correlation table's row whose label a page wrapped: a line with the label's first words and no value, then a
 * line with the rest of the label and the values; the first line numbered ("1. SPAS a"), or (`orLowerCase`) the
 * second going on in small letters ("parameters Gait speed 0.449"). The second is not numbered itself. Null otherwise.
 */
function wrappedLabelRow(line: Line, next: Line | undefined, orLowerCase = false): string[] | null {
  const head = line.text.trim();
  if (next === undefined || head.length > MAX_WRAPPED_LABEL || TITLE.test(next.text) || NOTE.test(next.text) || TITLE.test(head) || NOTE.test(head)) return null;
  if (!NUMBERED_LABEL.test(head) && !(orLowerCase && /^\p{Ll}/u.test(next.text.trim()))) return null;
  const tokens = tokenize(next.text);
  const first = tokens.findIndex((token) => isValueToken(token.text));
  if (first <= 0 || NUMBERED_LABEL.test(next.text.trim()) || /^\d/.test(tokens[0]!.text)) return null;
  return [`${head} ${tokens.slice(0, first).map((token) => token.text).join(' ')}`, ...tokens.slice(first).map((token) => token.text)];
}

/**
 * A row whose label the page wrapped (see labelGoesOn; rows starting in small letters may be categories here, so
 * they do not tell), for the spaced reader: the row as a data line whose label runs from the first line into the second.
 */
function wrappedLabelDataLine(line: Line, next: Line | undefined): DataLine | null {
  const head = line.text.trim();
  if (next === undefined || head === '' || head.length > MAX_WRAPPED_LABEL || TITLE.test(head) || NOTE.test(head) || isPageFurniture(head) || readDataLine(line, 1) !== null) return null;
  const rest = next.text.trim();
  if (rest === '' || /^\d/.test(rest) || TITLE.test(rest) || NOTE.test(rest) || !labelGoesOn(head, rest, false)) return null;
  // Read as one line (so that a numbered row of dashes alone is a row, as it is unwrapped); the values are then
  // taken from the second line, where they stand (their offsets relative to it, as every row's are).
  const joined = readDataLine({ ...next, text: `${head} ${rest}` }, 1);
  if (joined === null || joined.label.text.length <= head.length) return null;
  const tokens = tokenize(next.text);
  const values = tokens.slice(tokens.length - joined.values.length);
  if (values.length === 0 || values.length === tokens.length) return null;
  return { label: { text: joined.label.text, start: 0, end: 0 }, values };
}

/** Longest first line of a wrapped label ("1. Post-traumatic"). */
const MAX_WRAPPED_LABEL = 40;

function valuesWithoutMarks(cells: readonly string[]): number {
  return cells.filter((cell) => !isMarkToken(cell)).length;
}

/** Whether, past blank lines and page furniture, the next line is a labelled row of `width` values (marks apart). */
function rowOfWidthFollows(lines: Line[], index: number, width: number, cellsOf: (text: string) => readonly Piece[] = tokenize): boolean {
  let next = index + 1;
  while (next < lines.length && next - index <= MAX_PAGE_BREAK_LINES && (isBlank(lines[next]) || isPageFurniture(lines[next]!.text))) next++;
  if (next >= lines.length || next - index > MAX_PAGE_BREAK_LINES) return false;
  const tokens = cellsOf(lines[next]!.text);
  const first = tokens.findIndex((token) => isValueToken(token.text));
  return first > 0 && valuesWithoutMarks(tokens.slice(first).map((token) => token.text)) === width;
}

/**
 * The header of a crushed table of correlations whose every row holds the same number k of correlations (marks
 * standing apart not counted) and whose header line ends with k single-word names: the label column's words, then
 * those k names. Null when the rows differ or a value is not a correlation.
 */
function rectangleHeader(header: string[], rows: string[][]): string[] | null {
  const values = rows.map((row) => row.slice(1).filter((cell) => !isMarkToken(cell)));
  const count = values[0]?.length ?? 0;
  if (count < 1 || header.length < count + 1 || rows.length < 2) return null;
  const correlation = (cell: string): boolean => {
    const read = readCell(withoutTrailingMarks(cell), 'either');
    return read.kind === 'number' && read.number.decimals >= 2 && Math.abs(read.number.value) <= 1;
  };
  if (!values.every((cells) => cells.length === count && cells.every(correlation))) return null;
  return [header.slice(0, header.length - count).join(' '), ...header.slice(header.length - count)];
}

/** Most lines of single-value rows (and section lines) between two full rows of a table. */
const MAX_SPARSE_RUN = 12;

/**
 * True when the line at `index` and those after it, up to a full data row, are
 * rows with a single value, section lines or blank lines (at most
 * MAX_SPARSE_RUN of them): "Sexo 0,939" / "Feminino 8,5 (1,5)" / … / "CCEB
 * -0,136 0,080".
 */
function sparseRunLeadsToRow(lines: Line[], index: number): boolean {
  for (let at = index; at < lines.length && at <= index + MAX_SPARSE_RUN; at++) {
    const line = lines[at]!;
    if (at > index && readRowLine(line, false) !== null) return true;
    if (isBlank(line) || isSectionLine(line)) continue;
    if (TITLE.test(line.text) || NOTE.test(line.text) || readDataLine(line, 1) === null) return false;
  }
  return false;
}

/** A short line without digits inside a table: "Between subjects", "Within subjects". */
function isSectionLine(line: Line | undefined): boolean {
  if (line === undefined) return false;
  const text = line.text.trim();
  // A model's formula heading its block of rows ("eDNA copies/µl = Species × Sampling season × Location").
  if (isModelFormula(text)) return true;
  if (text === '' || text.length > 60 || /[.:;,]$/.test(text) || TITLE.test(text) || NOTE.test(text)) return false;
  // Digits may stand in a name ("GAD-7", "SF-36 PCS"), not as a value at the line's end, except in a numbered
  // group's name ("Sample 1", "Study 2", "Experiment 3b").
  const numberedGroup = /^[A-Z][A-Za-z]+(?: [A-Za-z]+)? \d{1,3}(?:[a-z]|\/\d{1,2})?$/.test(text);
  if (!numberedGroup && /\d/.test(text) && (isValueToken(text.split(/\s+/).pop()!) || /\d\s*\)?$/.test(text))) return false;
  return text.split(/\s+/).length <= 6;
}

/**
 * An outcome and its terms, "Y = A × B", "score ~ group * time": at most 120 characters, one "=" or "~" with
 * words on both sides, terms joined by "×", "*", "+" or ":", and no number among them.
 */
function isModelFormula(text: string): boolean {
  if (text.length > 120 || /\d\s*$/.test(text)) return false;
  const match = /^([^=~<>]{1,50}?) [=~] ([^=~<>]{1,100})$/.exec(text);
  if (match === null || !/\p{L}/u.test(match[1]!)) return false;
  const terms = match[2]!.split(/ [\u00d7*+:x] /);
  return terms.length >= 2 && terms.every((term) => /^\p{L}[\p{L}\p{M}/' ()-]{0,40}$/u.test(term.trim()));
}

function readSpacedTable(lines: Line[], first: number): FoundRows | null {
  // A line of block titles each closed by its statistic's df is the upper row of the header under it, read
  // with that header (the next line's table), not a header of its own.
  if (statisticTitlesOver(lines, first)) return null;
  const firstHeader = readHeader(lines[first]!);
  const wrapped = firstHeader === null ? readWrappedHeader(lines, first) : readHeaderGoingOn(lines, first, firstHeader);
  // A header of one statistic column that states its df, after a label column named in any words ("Statements
  // Chi-square (χ2) value with 88 d.f."), only right under a table's title: alone, such a line could be prose.
  const alone = wrapped === null && readHeader(lines[first]!) === null ? statisticWithDfHeader(lines[first]!) : null;
  const statisticAlone = alone !== null && titleShortlyAbove(lines, first) ? alone : null;
  const header = wrapped ?? readHeader(lines[first]!) ?? statisticAlone;
  const titled = readTitle(lines, first) !== null;
  if (header === null && (!titled || readRowLine(lines[first]!, true) === null)) return null;
  let index = header === null ? first : wrapped !== null ? first + 2 : first + 1;
  // Names a PDF's layout copy stacked over the header line ("Sum of" over "Squares", "Partial Eta" over "Squared").
  // (Not the titles of side-by-side blocks over a header that names a block's columns again, "Confidence   Errors" over
  // "Source df F p df F p": each title is the whole block's, read below, not a word of its block's first column.)
  const titlesOverBlocks = header !== null && header.aligned && wrapped === null && repeatsBlockNames(header) ? capitalisedTitlesOf(lines[first - 1], header) : null;
  const stacked = header !== null && header.aligned && wrapped === null && titlesOverBlocks === null ? stackedHeaderAbove(lines, first, header) : null;
  const columns = stacked?.names ?? header?.columns.map((column) => column.text) ?? null;
  if (header !== null && lines[index] !== undefined && HEADER_CONTINUATION.test(lines[index]!.text)) {
    attachContinuation(columns!, lines[index]!.text.trim().split(/\s+/));
    index++;
  }
  const rows: (string[] | { data: DataLine; line: Line })[] = columns ? [columns] : [];
  // Titles of side-by-side blocks on the line over a crushed header, each closed by its df ("Treatment
  // (num. df = 1) Temperature (num. df = 7)"): an upper header row, cut after each title's df.
  const blockTitles =
    header !== null && !header.tabbed
      ? (dfTitlesOf(lines[first - 1]) ?? (statisticTitlesOver(lines, first - 1) ? dfTitlesOf(lines[first - 1], TITLE_STATISTIC_DF) : null) ?? capitalisedTitlesOf(lines[first - 1], header))
      : null;
  if (blockTitles !== null) rows.unshift(blockTitles);
  let dataRows = 0;
  let subHeaderLines = 0;
  let last = header === null ? first - 1 : index - 1;
  let widest = header === null ? 0 : header.columns.length - 1;
  for (; index < lines.length; index++) {
    const line = lines[index]!;
    // A line of values only, under a row that came out short: the rest of that row, broken over lines
    // by the copy ("Contact 0.26 * (0.14, 0.43)" / "0.50 (0.32, 0.74)" / "- 3.60 0.07").
    const previous = rows[rows.length - 1];
    // A line of nothing but a p under a row of values ("p < .001", "(.006)"): that row's p, set under its value.
    const pUnder = header !== null && columns !== null && previous !== undefined && !Array.isArray(previous) ? pUnderValueCells(line, previous, header, columns.length) : null;
    if (pUnder !== null) {
      rows.push(pUnder);
      last = index;
      continue;
    }
    // (Crushed rows only: their cells are placed by what they hold, not by where they stand on the line.)
    if (header !== null && !header.aligned && !header.tabbed && previous !== undefined && !Array.isArray(previous)) {
      const rest = continuationValues(line, widest - previous.data.values.length);
      if (rest !== null) {
        previous.data = { ...previous.data, values: [...previous.data.values, ...rest] };
        last = index;
        continue;
      }
    }
    // A line of values only under a line that was taken for a section: that line is the row's label, set on a
    // line of its own by the copy ("Group × Time" / "9.80 2 4.90 3.33 .043").
    const sectionAbove = Array.isArray(previous) && previous.slice(1).every((cell) => cell === '') ? previous[0]! : null;
    const labelAbove = columns !== null && sectionAbove !== null ? continuationValues(line, columns.length - 1) : null;
    if (sectionAbove !== null && labelAbove !== null && (labelAbove.length >= 2 || SPARSE_ROW_LABEL.test(sectionAbove))) {
      rows[rows.length - 1] = { data: { label: { text: sectionAbove, start: 0, end: 0 }, values: labelAbove }, line };
      widest = Math.max(widest, labelAbove.length);
      dataRows++;
      last = index;
      continue;
    }
    // A label the page wrapped over two lines ("1. SPAS a" / "Total Score - - -", "Anger: FLD vs." / "PLD vs. Static
    // 43.48 …"): one row.
    const wrappedRow = wrappedLabelDataLine(line, lines[index + 1]);
    if (wrappedRow !== null) {
      widest = Math.max(widest, wrappedRow.values.length);
      rows.push({ data: wrappedRow, line: lines[index + 1]! });
      dataRows++;
      last = ++index;
      continue;
    }
    // Under a header of one value column ("Variable r (p)"), a row holds one value ("Age .30 (.020)").
    // Under a crushed header whose last column holds words ("Pairwise comparisons"), a row may end in that column's
    // words ("… 10.10 <0.001 Healthy adults = PD-CI > PD-MCI"): the row's values are those before the words.
    const crushedHeader = header !== null && !header.aligned && !header.tabbed;
    // (Under a header of one statistic column found only by its df, a row is a statement and its statistic alone.)
    const data = statisticAlone !== null ? statementRow(line) :
      readRowLine(line, dataRows === 0) ??
      (columns !== null && columns.length === 2 ? singleValueRow(line) : null) ??
      (crushedHeader && columns !== null && endsInWordsColumn(columns) ? rowBeforeTrailingWords(line, dataRows === 0) : null);
    if (data !== null) {
      widest = Math.max(widest, data.values.length);
      rows.push({ data, line });
      dataRows++;
      last = index;
      continue;
    }
    // Under a header of one statistic column, a statement the page wrapped over lines, its value on the last.
    const wrappedStatement = statisticAlone !== null ? wrappedStatementRow(lines, index) : null;
    if (wrappedStatement !== null) {
      widest = Math.max(widest, wrappedStatement.data.values.length);
      rows.push({ data: wrappedStatement.data, line: lines[wrappedStatement.lastLine]! });
      dataRows++;
      last = index = wrappedStatement.lastLine;
      continue;
    }
    // Under a crushed header, a row whose cells the page wrapped over several lines.
    const wrappedCells = crushedHeader && columns !== null ? rowWithWrappedCells(lines, index, columns.length - 1) : null;
    if (wrappedCells !== null) {
      widest = Math.max(widest, wrappedCells.data.values.length);
      rows.push({ data: wrappedCells.data, line: wrappedCells.line });
      dataRows++;
      last = index = wrappedCells.lastLine;
      continue;
    }
    // Under a header, a long line may be several rows run together.
    const runOn = header !== null ? splitRunOnRows(line) : [];
    if (runOn.length > 0) {
      for (const piece of runOn) rows.push({ data: piece, line });
      dataRows += runOn.length;
      last = index;
      continue;
    }
    // A page's running head, footer or page number where the table runs over a page break ("Page 12 of 30",
    // "BMC Psychiatry (2021) 21:522", "Table 2 (continued)"), with the header printed again after it: passed over
    // when the table's rows go on after it.
    if (dataRows > 0 && isPageFurniture(line.text)) {
      let resume = index + 1;
      while (resume < lines.length && resume - index <= MAX_PAGE_BREAK_LINES && (isBlank(lines[resume]!) || isPageFurniture(lines[resume]!.text) || readHeader(lines[resume]!) !== null)) resume++;
      if (resume < lines.length && readRowLine(lines[resume]!, false) !== null) {
        index = resume - 1;
        continue;
      }
    }
    // A section line, or a blank line (web pages put them between rows), belongs to the table only when a data row follows it.
    const followed = leadsToDataRow(lines, index);
    // A row of empty cells only ("2 NA NA NA NA NA": a phase with nothing measured) between rows: a row of the table.
    const emptyRow = header !== null && dataRows > 0 && followed ? rowOfEmptyCells(line) : null;
    if (emptyRow !== null) {
      rows.push({ data: emptyRow, line });
      continue;
    }
    if (isBlank(line) && followed) continue;
    if (isSectionLine(line) && followed) {
      rows.push(columns ? [line.text.trim(), ...columns.slice(1).map(() => '')] : [line.text.trim()]);
      continue;
    }
    // Under a header, a row of counts with their percentages only ("≤50 62 (29.4%) 22 (30.1%) …" under "Age 5.343
    // 0.254"), the categories of the variable above it: kept as a line of the table that holds no test, when a
    // row of values follows the run of such rows.
    if (header !== null && dataRows > 0 && isCountRow(line) && countRowsLeadToRow(lines, index)) {
      rows.push(columns ? [line.text.trim(), ...columns.slice(1).map(() => '')] : [line.text.trim()]);
      continue;
    }
    // Under a header, a row with a single value ("Sexo 0,939": a p alone, "Feminino 8,5 (1,5)": a group's M (SD))
    // between rows of the table; the reader decides what its value is, or leaves it.
    const sparse = header !== null && dataRows > 0 && sparseRunLeadsToRow(lines, index) ? readDataLine(line, 1) : null;
    if (sparse !== null && !TITLE.test(line.text) && !NOTE.test(line.text)) {
      rows.push({ data: sparse, line });
      last = index;
      continue;
    }
    // Under a header whose names were read, a second header line of group names before the first row
    // ("Control SE ± 7.5 % SE ± 15.0 % SE ±" under "Characteristics Diet F d.f P"): it names no column the
    // reader needs (the test's columns were named above), so it is passed over. A line that is a header itself
    // is not: the table starts there ("t-test Pearson correlation" over "Group n Mean SD p (d) r p").
    const passOver =
      header !== null && dataRows === 0 && subHeaderLines < MAX_SUB_HEADER_LINES && !isBlank(line) && !TITLE.test(line.text) && !NOTE.test(line.text) && line.text.length <= MAX_ROW_LENGTH;
    if (passOver && readHeader(line) === null && leadsToDataRow(lines, index)) {
      subHeaderLines++;
      continue;
    }
    break;
  }
  if (dataRows === 0) return null;
  const headerAt = columns === null ? -1 : rows.indexOf(columns);
  const widened = headerAt !== -1 && header !== null && !header.aligned && !header.tabbed ? wordPerColumn(columns!, rows) : null;
  if (widened !== null) rows[headerAt] = widened;
  const firstLine = blockTitles !== null ? first - 1 : stacked !== null ? stacked.firstLine : null;
  return { ...placeRows(rows, header, last), headed: header !== null, ...(firstLine !== null ? { firstLine } : {}) };
}

/**
 * The cells of a line that holds nothing but a p ("p < .001", "(.006)", "(<.001)") under a row of values, as
 * tables print each effect's p on the line under its F: a row with no label and the p in the column of the value
 * it stands under (aligned: by position, when the row above has a value there; crushed, where positions say
 * nothing: the last column, when the row above fills every column, so that its last value is the one the p is
 * under). The reader ties it to the value above or leaves it; it never counts as a row of its own. Null when the
 * line is anything else or the column cannot be told.
 */
function pUnderValueCells(line: Line, previous: { data: DataLine; line: Line }, header: HeaderLine, width: number): string[] | null {
  if (header.tabbed || !P_UNDER_VALUE.test(line.text)) return null;
  const text = line.text.trim();
  const cells = new Array<string>(width).fill('');
  if (!header.aligned) {
    if (previous.data.values.length !== width - 1) return null;
    cells[width - 1] = text;
    return cells;
  }
  const start = leadingSpace(line.text);
  if (start === 0) return null;
  const column = columnUnder({ text, start, end: start + text.length }, header.columns);
  const above = placeRow(previous.data, previous.line, header);
  if (column < 1 || above === null || !isNumberToken(above[column] ?? '')) return null;
  cells[column] = text;
  return cells;
}

/**
 * A crushed header whose run of words no vocabulary knows came out as one column ("D.F. F-value p-value Bray
 * Jaccard Uni-U Uni-W", the last four the names of four columns of p), over rows that hold one value per word: the
 * header with each such word a column of its own, when that gives exactly the rows' width (the widest, which two
 * rows at least have). Null otherwise.
 */
function wordPerColumn(columns: readonly string[], rows: readonly (string[] | { data: DataLine; line: Line })[]): string[] | null {
  const widths = rows.flatMap((row) => (Array.isArray(row) ? [] : [row.data.values.length + 1]));
  const width = Math.max(0, ...widths);
  if (width <= columns.length || widths.filter((candidate) => candidate === width).length < 2) return null;
  const cells = columns.flatMap((cell, index) => (index > 0 && /\s/.test(cell) && !isKnownHeader(headerKey(cell)) ? cell.split(/\s+/) : [cell]));
  return cells.length === width ? cells : null;
}

/**
 * The values of a line that holds nothing else (no label), when there are at
 * most `room` of them; null otherwise. (Their offsets stay relative to their
 * own line: a crushed row's cells are kept as text.)
 */
function continuationValues(line: Line, room: number): Piece[] | null {
  if (room <= 0 || isBlank(line) || TITLE.test(line.text) || NOTE.test(line.text)) return null;
  const tokens = tokenize(line.text);
  if (tokens.length === 0 || tokens.length > room || !tokens.every((token) => isValueToken(token.text) || isMarkToken(token.text))) return null;
  return [...tokens];
}

/**
 * The block titles of the line over a crushed header that repeats a test's columns ("F P F P F P F P" under "Term
 * Paired testes mass Epididymal sperm count Daily sperm production Seminal vesicles mass"), cut where a word
 * begins with a capital: kept only when that gives one title per statistic column, after the label column's name
 * or none. (A title with a capital inside, "Sperm count DSP", gives one title too many, and the line is not cut.)
 */
/** Whether a header names its columns after the label in two or more like runs ("df F p df F p", "F p F p"). */
function repeatsBlockNames(header: HeaderLine): boolean {
  const names = header.columns.slice(1).map((column) => headerKey(column.text));
  const blocks = names.filter((name) => name === names[0]).length;
  if (blocks < 2 || names.length % blocks !== 0) return false;
  const width = names.length / blocks;
  return names.every((name, index) => name === names[index % width]);
}

function capitalisedTitlesOf(line: Line | undefined, header: HeaderLine): string[] | null {
  if (line === undefined || isBlank(line) || line.text.length > MAX_ROW_LENGTH || TITLE.test(line.text) || NOTE.test(line.text) || /\d/.test(line.text)) return null;
  const blocks = header.columns.filter((column) => classifyHeader(column.text).role === 'statistic').length;
  if (blocks < 2 || readHeader(line) !== null) return null;
  const titles: string[] = [];
  for (const word of line.text.trim().split(/\s+/)) {
    if (/^\p{Lu}/u.test(word) || titles.length === 0) titles.push(word);
    else titles[titles.length - 1] += ` ${word}`;
  }
  if (titles.length === blocks + 1) return titles;
  if (titles.length === blocks && /^\s/.test(line.text)) return ['', ...titles];
  return null;
}

/** A title's df in brackets: "(num. df = 7)", "(df = 2, 57)". */
const TITLE_DF_BRACKET = /\((?:num(?:erator)?\.?\s*)?dfs?\s*=\s*\d+(?:\.\d+)?(?:\s*,\s*\d+(?:\.\d+)?)?\)/gi;

/**
 * A statistic's symbol with its df closing a block's title: "Group F(1, 58)", "Time F (2, 116)", "Sex χ2(1)",
 * "Post t(48)". (The symbol stands apart from the word before it.)
 */
const TITLE_STATISTIC_DF = /(?<![\p{L}\d])(?:F|t|\u03c7\u00b2|\u03c72|\u03c7 2)\s?[([]\s?\d{1,6}(?:\.\d{1,3})?(?:\s?[,;]\s?\d{1,6}(?:\.\d{1,3})?)?\s?[)\]]/gu;

/**
 * Whether the line at `first` holds block titles each closed by a statistic with its df (see TITLE_STATISTIC_DF)
 * over a header line of column names: "Group F(1, 58) Time F(2, 116)" over "Outcome F p F p". The titles are the
 * header's upper row (the table reader ties each df to a block only where one title stands over each statistic
 * column, readTableResults.ts statisticTitlesGiveDf), never a header of their own over a line of names.
 */
function statisticTitlesOver(lines: Line[], first: number): boolean {
  const titles = dfTitlesOf(lines[first], TITLE_STATISTIC_DF);
  const next = lines[first + 1];
  if (titles === null || next === undefined) return false;
  // (A line of names no vocabulary knows, "Outcome Value p Value p", is a header too, one the finder cannot read:
  // the titles over it are not a header of their own, whose columns the rows' values would be forced under.)
  const header = readHeader(next);
  return header !== null ? !header.tabbed : !isBlank(next) && !/\d/.test(next.text) && /\p{L}/u.test(next.text);
}

/** The block titles of a line that holds at least two titles each closed by its df (by `closing`), or null. */
function dfTitlesOf(line: Line | undefined, closing: RegExp = TITLE_DF_BRACKET): string[] | null {
  if (line === undefined || isBlank(line) || line.text.length > MAX_ROW_LENGTH || TITLE.test(line.text)) return null;
  const titles: string[] = [];
  let from = 0;
  for (const match of line.text.matchAll(closing)) {
    const end = match.index! + match[0].length;
    titles.push(line.text.slice(from, end).trim());
    from = end;
  }
  return titles.length >= 2 && line.text.slice(from).trim() === '' ? ['', ...titles] : null;
}

/**
 * The rows of a table found in text, with their cells under the header's
 * columns where the layout shows where they stand: by tabs, or by position
 * under a header laid out with wide gaps. Otherwise (single spaces, or
 * values that do not fall into distinct columns) every row is kept as its
 * label and its values, and the table reader puts them under the columns
 * by what they hold (align.ts).
 */
function placeRows(rows: (string[] | { data: DataLine; line: Line })[], header: HeaderLine | null, last: number): FoundRows {
  const placed = rows.map((row) => (Array.isArray(row) ? row : placeRow(row.data, row.line, header)));
  if (placed.every((row) => row !== null)) {
    return { rows: placed as string[][], last, layout: header?.tabbed ? 'aligned' : header?.aligned ? 'aligned' : 'crushed' };
  }
  const raw = rows.map((row) => (Array.isArray(row) ? row : [row.data.label.text, ...row.data.values.map((value) => value.text)]));
  return { rows: raw, last, layout: 'crushed' };
}

/** Most lines of group names between a crushed or aligned header and its first row. */
const MAX_SUB_HEADER_LINES = 2;

/** Labels of rows that may carry a single number (an error row with only its df). */
const SPARSE_ROW_LABEL = /^(?:error|residuals?|within|total|corrected total|subjects?|participants?|fehler|erro|erreur|r\u00e9sidus?|res\u00edduos?|residuos?|fout|errore|intra[- ]?grupos?|dentro de (?:los )?grupos)(?![\p{L}])/iu;

/** A data line of a table: two or more values, or one after an error or total label. */
const readFirstRowLine = keptPerLine((line) => readRowLineOf(line, true));
const readLaterRowLine = keptPerLine((line) => readRowLineOf(line, false));

/** Most lines a page break puts between two rows of a table (head, footer, page number, the header again). */
const MAX_PAGE_BREAK_LINES = 6;

/**
 * A line a page puts around its text rather than the table's: a page number ("12", "Page 12 of 30", "12 of 30"),
 * a link or DOI, a download or copyright line, a running head citing the journal ("Micromachines 2018, 9, 522",
 * "BMC Psychiatry (2021) 21:522") or the authors ("Smith et al."), or "Table 2 (continued)".
 */
function isPageFurniture(text: string): boolean {
  const trimmed = text.trim();
  if (trimmed.length === 0 || trimmed.length > 160) return false;
  return (
    /^(?:page\s{1,3})?\d{1,4}(?:\s{1,3}(?:of|\/)\s{1,3}\d{1,4})?$/i.test(trimmed) ||
    /\b\d{1,4}\s(?:of)\s\d{1,4}$/.test(trimmed) ||
    /https?:\/\/|\bdoi\.org\/|\bdoi:\s?10\.|^downloaded from\b|\u00a9|\bcopyright\b/i.test(trimmed) ||
    /\b(?:19|20)\d{2},\s\d{1,3},\s\d{1,6}\b/.test(trimmed) ||
    /\((?:19|20)\d{2}\)\s\d{1,4}:\d{1,6}\b/.test(trimmed) ||
    /^[A-Z][A-Za-z'\u2019-]{1,30}(?:\s(?:and|&)\s[A-Z][A-Za-z'\u2019-]{1,30})?\set\sal\.?$/.test(trimmed) ||
    /^(?:table|tabla|tabela|tableau|tabelle)\s[A-Z]?\d{1,3}[a-z]?\.?\s\(?(?:continued|cont(?:'|\u2019)?d|cont\.|continuaci[oó]n|suite|fortsetzung)\)?\.?$/i.test(trimmed)
  );
}

function readRowLine(line: Line, first: boolean): DataLine | null {
  return first ? readFirstRowLine(line) : readLaterRowLine(line);
}

function readRowLineOf(line: Line, first: boolean): DataLine | null {
  if (TITLE.test(line.text) || NOTE.test(line.text)) return null;
  const data = readDataLine(line, 1);
  if (data === null) return null;
  if (data.values.length >= 2 || (!first && SPARSE_ROW_LABEL.test(data.label.text))) return data;
  // A matrix's first row, its diagonal alone ("1. Anxiety —", "1 Anxiety 1.00").
  if (data.values.length === 1 && NUMBERED_LABEL.test(data.label.text) && DIAGONAL_CELL.test(data.values[0]!.text)) return data;
  return null;
}

/**
 * Whether a header's last column is one no vocabulary knows after its test's columns ("… F-value P-value Pairwise
 * comparisons", "… t p Comments"): a column of words, such as the outcome of comparisons or a remark, that rows
 * may fill after their values.
 */
function endsInWordsColumn(columns: readonly string[]): boolean {
  const roles = columns.map((column) => classifyHeader(column).role);
  return roles.length >= 4 && roles[roles.length - 1] === 'unknown' && roles.includes('statistic') && roles.slice(-3, -1).includes('p');
}

/** Most words a row's trailing cell of words may hold. */
const MAX_TRAILING_WORDS = 12;

/**
 * A row whose values are followed by a cell of words (no digits in them): the row as read without those words.
 * The words must follow a value directly, so a sentence that merely holds numbers is not taken for a row.
 */
function rowBeforeTrailingWords(line: Line, first: boolean): DataLine | null {
  if (TITLE.test(line.text) || NOTE.test(line.text) || line.text.length > MAX_ROW_LENGTH) return null;
  const tokens = tokenize(line.text);
  let wordsStart = tokens.length;
  while (wordsStart > 0 && !/\d/.test(tokens[wordsStart - 1]!.text) && !isValueToken(tokens[wordsStart - 1]!.text)) wordsStart--;
  if (wordsStart === tokens.length || tokens.length - wordsStart > MAX_TRAILING_WORDS || wordsStart < 3) return null;
  if (!isValueToken(tokens[wordsStart - 1]!.text)) return null;
  const data = readRowLineOf({ ...line, text: line.text.slice(0, tokens[wordsStart - 1]!.end) }, first);
  return data !== null && data.values.length >= 2 ? data : null;
}

/** Most lines one row's wrapped cells may take. */
const MAX_WRAPPED_ROW_LINES = 12;

/**
 * A row whose cells a web page wrapped over lines: a label and one value ("Week –1.24"), the value's interval broken
 * at its spaces ("(–1.28 to" / "–1.20)"), and the row's other cells on lines of values only ("56.79 (9682) <.001
 * –1.24"). Lines are joined while a bracket is open, or while the next line starts with a bracket or holds values
 * only; the joined text keeps every offset (each line break becomes as many spaces). Read as one row only when the
 * brackets close, and the row has at least three values and no more than `width` (the header's value columns).
 */
function rowWithWrappedCells(lines: Line[], first: number, width: number): { data: DataLine; line: Line; lastLine: number } | null {
  const head = lines[first]!;
  if (TITLE.test(head.text) || NOTE.test(head.text)) return null;
  const start = readDataLine(head, 1);
  if (start === null || start.label.text === '' || start.values.length !== 1) return null;
  let text = head.text;
  let last = first;
  while (last + 1 < lines.length && last + 1 - first < MAX_WRAPPED_ROW_LINES && text.length <= MAX_ROW_LENGTH) {
    const next = lines[last + 1]!;
    if (isBlank(next) || TITLE.test(next.text) || NOTE.test(next.text)) break;
    const takesNext = bracketDepth(text) > 0 || /^\s*[([]/.test(next.text) || continuationValues(next, width) !== null;
    if (!takesNext) break;
    text += ' '.repeat(next.start - lines[last]!.end) + next.text;
    last++;
  }
  if (last === first || bracketDepth(text) !== 0) return null;
  const line: Line = { start: head.start, end: lines[last]!.end, text };
  const data = readDataLine(line, 3);
  return data !== null && data.values.length <= width ? { data, line, lastLine: last } : null;
}

/** Brackets opened and not closed in a text (round and square alike; a stray closing one counts against). */
function bracketDepth(text: string): number {
  let depth = 0;
  for (const character of text) {
    if (character === '(' || character === '[') depth++;
    else if (character === ')' || character === ']') depth--;
  }
  return depth;
}

/** "ηp" + a following line "2" -> "ηp2" (PDF text puts superscripts on their own line). */
function attachContinuation(columns: string[], pieces: string[]): void {
  const incomplete = columns.map((column, index) => (INCOMPLETE_HEADERS.has(headerKey(column)) ? index : -1)).filter((index) => index >= 0);
  if (incomplete.length === pieces.length) {
    incomplete.forEach((column, index) => (columns[column] = `${columns[column]}${pieces[index]}`));
  } else if (pieces.length === 1 && incomplete.length > 0) {
    const column = incomplete[incomplete.length - 1]!;
    columns[column] = `${columns[column]}${pieces[0]}`;
  }
}

/**
 * Puts a data line's values under the header's columns: by position when
 * the header is laid out with wide gaps and the values fall into distinct
 * columns in order, otherwise left to right (missing cells are the last
 * ones, as in an error row that has no F or p). Values beyond the columns
 * belong to the label ("Block 2 12.40 2 ...").
 */
function placeRow(data: DataLine, line: Line, header: HeaderLine | null): string[] | null {
  if (header !== null && header.tabbed && line.text.includes('\t')) {
    // One tab per cell: empty cells are empty strings between tabs.
    const cells = line.text.split('\t').map((cell) => cell.trim());
    return header.columns.map((_, index) => cells[index] ?? '');
  }
  let label = data.label;
  let values = data.values;
  if (header === null) return [label.text, ...values.map((value) => value.text)];
  if (!header.aligned) return null;
  const width = header.columns.length;
  // One value more than the columns, where the header's one df column has two whole numbers under it ("df"
  // centred over "2   57"): the row is left to the table reader, which splits that df column in two.
  if (values.length === width && dfPairUnderHeader(values, header.columns)) return null;
  if (values.length > width - 1) {
    const extra = values.length - (width - 1);
    label = label.text === '' ? join(line.text, values[0]!, values[extra - 1]!) : join(line.text, label, values[extra - 1]!);
    values = values.slice(extra);
  }
  const row = [label.text, ...new Array<string>(width - 1).fill('')];
  const byPosition = placeByPosition(values, header.columns);
  if (byPosition === null) return null;
  byPosition.forEach((column, index) => (row[column] = values[index]!.text));
  return row;
}

/** Whether the header names one df column and the values at its place and the next are a whole-number df pair. */
function dfPairUnderHeader(values: readonly Piece[], columns: readonly Piece[]): boolean {
  const dfColumns = columns.flatMap((column, index) => (classifyHeader(column.text).role === 'df' ? [index] : []));
  if (dfColumns.length !== 1 || dfColumns[0]! < 1) return false;
  const [first, second] = [values[dfColumns[0]! - 1]?.text ?? '', values[dfColumns[0]!]?.text ?? ''];
  return /^\d{1,6}$/.test(first) && /^\d{1,6}$/.test(second) && Number(first) >= 1 && Number(second) >= Number(first);
}

/** Column of each value by the zones between header cells, or null when they collide or go backwards. */
function placeByPosition(values: readonly Piece[], columns: readonly Piece[]): number[] | null {
  const zones = columns.map((column, index) => {
    const previous = columns[index - 1];
    const next = columns[index + 1];
    return {
      low: previous === undefined ? -Infinity : (previous.end + column.start) / 2,
      high: next === undefined ? Infinity : (column.end + next.start) / 2,
    };
  });
  const placed: number[] = [];
  for (const value of values) {
    const centre = (value.start + value.end) / 2;
    const column = zones.findIndex((zone) => centre >= zone.low && centre < zone.high);
    if (column < 1 || (placed.length > 0 && column <= placed[placed.length - 1]!)) return null;
    placed.push(column);
  }
  return placed;
}

// ------------------------------------------------------------ titles, notes

/** The "Table 2 ..." line(s) right before the line `first`, allowing one blank line. */
function readTitle(lines: Line[], first: number, linesBetween = false): { caption: string; firstLine: number } | null {
  let index = first - 1;
  if (isBlank(lines[index]) && index >= 0) index--;
  const line = lines[index];
  if (line === undefined || index < 0) return null;
  if (TITLE.test(line.text) && line.text.length <= 300) return { caption: line.text.trim(), firstLine: index };
  // APA layout: "Table 2" on its own line, the title on the next; a web page's copy may add a line over
  // the columns ("Measure Pearson Correlation") between the title and the header.
  const between: string[] = [line.text.trim()];
  let above = index - 1;
  let wrapped = 0;
  for (let extra = 0; extra <= (linesBetween ? MAX_LINES_UNDER_TITLE - 1 : 0) + wrapped; extra++) {
    if (isBlank(lines[above]) && above >= 0) above--;
    const candidate = lines[above];
    if (candidate === undefined || above < 0 || isBlank(candidate)) return null;
    if (BARE_TITLE.test(candidate.text) && between.join(' ').length <= 300) return { caption: `${candidate.text.trim()} ${between.join(' ')}`, firstLine: above };
    if (candidate.text.trim().length > 300 || TITLE.test(candidate.text) || readRowLine(candidate, true) !== null) return null;
    // A caption a page wrapped: this line goes on in the one below it, which starts in small letters ("… reaction
    // times to" / "emotional self- and other-related stimuli."); it does not count as a line of its own.
    const wrapsOn = wrapped < MAX_CAPTION_LINES - 1 && !/[.:]$/.test(candidate.text.trim()) && /^\p{Ll}/u.test(between[0]!) && !isBlank(lines[above + 1]);
    if (wrapsOn) wrapped++;
    between.unshift(candidate.text.trim());
    above--;
  }
  return null;
}

/** Lines that may stand between a bare "Table 2" and the table: its title, and a line over the columns. */
const MAX_LINES_UNDER_TITLE = 2;

/** Note lines right after the table (one blank line allowed), each with up to three wrapped continuation lines. */
function readNotes(lines: Line[], first: number): { notes: string[]; lastLine: number | null } {
  const notes: string[] = [];
  let lastLine: number | null = null;
  let index = first;
  if (isBlank(lines[index]) && lines[index + 1] !== undefined && NOTE.test(lines[index + 1]!.text)) index++;
  while (index < lines.length && NOTE.test(lines[index]!.text)) {
    let note = lines[index]!.text.trim();
    lastLine = index;
    index++;
    for (let wrapped = 0; wrapped < 3 && index < lines.length; wrapped++) {
      const next = lines[index]!;
      if (isBlank(next) || NOTE.test(next.text) || TITLE.test(next.text) || /[.!?]$/.test(note)) break;
      note = `${note} ${next.text.trim()}`;
      lastLine = index;
      index++;
    }
    notes.push(note);
  }
  return { notes, lastLine };
}
