/**
 * Tables copied with one cell per line, as web pages and some PDF
 * extractions give them:
 *
 *     Table 1 Contrasts run in Experiment 1
 *     dV/hypothesis
 *     Effect tested
 *     F(1,367)
 *     P
 *     False-claim inference scores
 *      H1FIS: NE < FCO
 *     Familiarity backfire effect
 *     5.31
 *     .022a
 *
 * The columns are inferred from the header and the repeating pattern of
 * the rows: the header is the run of cells up to the first value, its
 * known column names (F(1,367), P) are the value columns, and each body row
 * is a run of values after the label cells that precede it. How many label
 * cells a row has is the number most rows have; text cells before them
 * name a section ("False-claim inference scores") and become a row of
 * their own. Cells may stand on lines between blank lines, and may carry
 * the pipes of a table copied from a web page ("| Source |", "DF |").
 *
 * Linear in the table's lines; a table is looked for only after a "Table N"
 * title line, and its search stops at a bounded distance.
 */

import type { CellSpan, DocumentTable } from '../../documents/types.js';
import { classifyHeader, headerKey, isKnownHeader, NAMES_TEST_COLUMN, namesEffectWithTest, P_UNDER_VALUE, readCell, splitRunTogetherNames, TABLE_TITLE, type LineCell, type TextLine } from './cells.js';
import { fit, shapeOf } from './align.js';

type Line = TextLine;

interface Cell extends LineCell {
  /** Spaces only: an empty cell. */
  empty: boolean;
}

/** Longest cell; a longer line is prose and ends the table. */
const MAX_CELL_LENGTH = 120;
/** Most lines between the title and the header's first column name (caption lines, a "From:" line, label headers). */
const MAX_LINES_TO_HEADER = 40;
/** Most cells before the header's first column name (caption lines, group titles, label headers). */
const MAX_CELLS_TO_HEADER = 16;
/** Most header cells. */
const MAX_HEADER_CELLS = 40;
/** Most body cells read for one table. */
const MAX_BODY_CELLS = 4000;
/** Most empty cells one line of spaces stands for. */
const MAX_EMPTY_RUN = 8;
/** Most blank lines in a row between two cells. */
const MAX_BLANK_RUN = 2;
/** Cells on consecutive lines that show a copy giving its empty cells as empty lines. */
const MIN_ADJACENT_CELLS = 2;
/** Most empty lines in a row read as empty cells in such a copy. */
const MAX_EMPTY_LINES = 24;

const TITLE = TABLE_TITLE;
const NOTE = /^\s{0,8}(?:(?:\*|_){0,2}Notes?(?:\*|_){0,2}\s*[.:]|\*{1,3}\s*p\s*[<\u2264=]|[a-h]\s*p\s*[<\u2264=]|Abbreviations?\b)/;

export interface CellPerLineTable {
  table: DocumentTable;
  /** Index of the table's last line. */
  lastLine: number;
}

/** A one-cell-per-line table whose title is `lines[titleLine]`, or null. */
export function readCellPerLineTable(lines: Line[], titleLine: number): CellPerLineTable | null {
  const title = lines[titleLine];
  if (title === undefined || !TITLE.test(title.text)) return null;
  return readCells(lines, titleLine, title, true);
}

/** Fewest known column names, one per line, that start a table one cell per line without a title above it. */
const MIN_UNTITLED_NAMES = 3;
/** Most header cells of a table one cell per line without a title. */
const MAX_UNTITLED_HEADER_CELLS = 16;
/** Longest header cell of such a table (longer lines are prose). */
const MAX_UNTITLED_HEADER_CELL = 40;

/**
 * A table one cell per line without a "Table 2" title above it (a web page
 * that kept the title elsewhere), read from its header: short lines up to
 * the first value, starting at `first`, at least three of them known column
 * names and one naming a test or p ("Variable" / "Control M (SD)" / "t" /
 * "df" / "p"). The header's names must then match the rows' values one to one.
 */
export function readUntitledCellPerLineTable(lines: Line[], first: number): CellPerLineTable | null {
  const opening = stripPipes(lines[first]!.text);
  if (opening === null || opening.text.trim() === '' || opening.text.length > MAX_UNTITLED_HEADER_CELL) return null;
  const names: string[] = [];
  let cellsSeen = 0;
  for (let index = first; index < lines.length && cellsSeen < MAX_UNTITLED_HEADER_CELLS; index++) {
    const inner = stripPipes(lines[index]!.text);
    const text = inner?.text.trim() ?? '';
    if (text === '') continue;
    if (text.length > MAX_UNTITLED_HEADER_CELL) return null;
    if (shapeOf(text).shape !== 'text') break;
    cellsSeen++;
    if (isColumnName(text)) names.push(text);
  }
  const roles = names.map((name) => classifyHeader(name).role);
  // Three known names, one of a test or p; or a statistic and a p ("Characteristic" / "Control n (%)" / "χ2 (df)" / "p").
  const enough = names.length >= MIN_UNTITLED_NAMES ? roles.some((role) => role === 'statistic' || role === 'p') : roles.includes('statistic') && roles.includes('p');
  if (!enough) return null;
  return readCells(lines, first - 1, lines[first]!, false);
}

/** The header's first known column name among the cells (within the first cells and lines under the title), or -1. */
function headerStart(cells: readonly Cell[], titleLine: number): number {
  let seen = 0;
  for (let index = 0; index < cells.length && seen < MAX_CELLS_TO_HEADER && cells[index]!.line <= titleLine + MAX_LINES_TO_HEADER; index++) {
    const cell = cells[index]!;
    if (cell.empty) continue;
    seen++;
    if (isValueCell(cell) && !YEAR_NAME.test(cell.text)) break;
    if (isColumnName(cell.text)) return index;
  }
  return -1;
}

/** The title and the caption lines under it, before the first cell ('' without a title), and whether they (with that cell) say correlations. */
function captionOf(lines: Line[], titleLine: number, titled: boolean, firstCell: Cell | undefined): { caption: string; correlations: boolean } {
  const caption = titled
    ? lines
        .slice(titleLine, firstCell === undefined ? titleLine + 1 : Math.max(titleLine + 1, firstCell.line))
        .map((line) => line.text.trim())
        .filter((text) => text !== '')
        .join(' ')
    : '';
  const titleText = `${caption} ${firstCell?.text ?? ''}`;
  return { caption, correlations: SAYS_CORRELATIONS.test(titleText) && !OTHER_CORRELATIONS.test(titleText) };
}

/**
 * The table whose cells follow `titleLine`; under a title that says correlations, read as a grid of variables when
 * a known column name among the variables' names ("Test", "Age") starts a header that reads no table.
 */
function readCells(lines: Line[], titleLine: number, title: Line, titled: boolean): CellPerLineTable | null {
  return readCellsAs(lines, titleLine, title, titled, false) ?? readCellsAs(lines, titleLine, title, titled, true);
}

/** The table after `titleLine`, its header found from a known column name, or (`asGrid`, under a title that says correlations) as a grid's. */
function readCellsAs(lines: Line[], titleLine: number, title: Line, titled: boolean, asGrid: boolean): CellPerLineTable | null {
  // Whether a table starts here is decided by the cells of the lines the header may start on: without a column
  // name there, and without a title that says correlations, there is none, and the cells after (up to
  // MAX_BODY_CELLS of prose, to the next title) are not collected. (Their first cells are the same either way:
  // collectCells reads line by line.)
  // (headerStart looks at no more than MAX_CELLS_TO_HEADER cells with text, so no more are collected for it: the
  // lines of prose after a table's title were all collected, up to MAX_LINES_TO_HEADER, at every title.)
  const head = collectCells(lines, titleLine + 1, titleLine + MAX_LINES_TO_HEADER, MAX_CELLS_TO_HEADER);
  const headFirstCell = head.find((cell) => !cell.empty);
  if (headerStart(head, titleLine) === -1 && headFirstCell !== undefined && !captionOf(lines, titleLine, titled, headFirstCell).correlations) return null;
  // (Under a title that says correlations, the grid's columns are named by no known name: empty lines among its first
  // cells are cells too, a copy's empty header cells, "Non-shift workers (n = 1,966)" / "" / "" / "Exhaustion".)
  const saysCorrelations = captionOf(lines, titleLine, titled, headFirstCell).correlations;
  // (A grid is read a second time only under such a title, and only when the first reading found no table.)
  if (asGrid && !saysCorrelations) return null;
  // Outside correlations, a header starts within MAX_CELLS_TO_HEADER cells with text and ends at a value within
  // MAX_HEADER_CELLS more: without a value among that many cells there is no table, and the cells after are not
  // collected (a text of short lines, every one a column's name, "F" / "P" / "F" / …, would be read up to
  // MAX_BODY_CELLS cells at each of its lines).
  if (!saysCorrelations && !collectCells(lines, titleLine + 1, Infinity, MAX_CELLS_TO_HEADER + MAX_HEADER_CELLS + 1).some((cell) => !cell.empty && isValueCell(cell))) return null;
  const cells = collectCells(lines, titleLine + 1, Infinity, Infinity, saysCorrelations);
  // The header: from the first known column name, the run of cells up to the first value.
  let first = headerStart(cells, titleLine);
  // A table of correlations names its columns by the variables correlated ("BDQ Physical", "Age"), which no
  // vocabulary knows: its header is the cells right before the first row's label.
  // (The title may stand alone, "Table 3.", with its caption on the next line.)
  const firstCell = cells.find((cell) => !cell.empty);
  const { caption, correlations } = captionOf(lines, titleLine, titled, firstCell);
  // (A numbered matrix's label header, "Variables", may read as a column name; its numbers decide.)
  const grid = correlations ? (numberedHeader(cells) ?? (first === -1 || asGrid ? gridHeader(cells, titleLine) : null)) : null;
  if (asGrid && grid === null) return null;
  if (first === -1 && grid === null) return null;
  if (grid !== null) first = grid.first;
  let firstValue = first;
  let headerCells = 0;
  // (Empty cells in the header are spanned or blank header cells, not values; they do not count towards the limit.)
  while (firstValue < cells.length && headerCells < MAX_HEADER_CELLS && (!isValueCell(cells[firstValue]!) || cells[firstValue]!.empty)) {
    if (!cells[firstValue]!.empty) headerCells++;
    firstValue++;
  }
  if (firstValue >= cells.length || headerCells >= MAX_HEADER_CELLS) return null;
  // The header ends with its last column name; text cells after it are the first row's label.
  let bodyStart = grid?.bodyStart ?? firstValue;
  // (Under a header naming a column of tests, "Test", a test's name that stands before the value in row after row,
  // "t-test" / "4.95, df = 4254.7", is the first row's cell, not the header's. Only there: elsewhere a name that
  // recurs before values, "Wald χ2" / "1.240", is a header repeated over a block of rows.)
  const namesTests = grid === null && cells.slice(first, firstValue).some((cell) => !cell.empty && NAMES_TEST_COLUMN.test(cell.text));
  const namesBeforeRows = namesTests ? cellsBeforeValueRuns(cells.slice(firstValue)) : new Map<string, number>();
  const recurs = (cell: Cell): boolean => (namesBeforeRows.get(headerKey(cell.text)) ?? 0) >= MIN_RECURRING_ROW_CELL;
  if (grid === null) while (bodyStart > first && (!isColumnName(cells[bodyStart - 1]!.text) || recurs(cells[bodyStart - 1]!))) bodyStart--;
  let body = grid !== null && 'numberApart' in grid && grid.numberApart === true ? joinRowNumbers(cells.slice(bodyStart)) : cells.slice(bodyStart);
  // The value columns: when rows have as many values as the header has cells after its label headers, every one
  // of those cells names a column, known or not ("Baseline", "12 weeks", "F(1, 66), p"); otherwise the known names.
  let headerRun = cells.slice(first, bodyStart).filter((cell) => !cell.empty);
  // A header cell that holds a run of numbers is a crushed row of another layout, not a column's name: the lines
  // are not one cell each.
  if (headerRun.some((cell) => numbersIn(cell.text) > MAX_NUMBERS_IN_NAME)) return null;
  // Side-by-side blocks named alike ("D.f. | F ratio | D.f. | F ratio"), where many rows print one block only:
  // the full rows hold every column the header names.
  // Rows under a spanned first column ("Soil depth" over "WSMacA", "MWD", ...) copied with an empty cell at the
  // end of each row but the first: those empty cells are the spanned column's, shifted, not a value column's.
  if (grid === null) body = withoutSpanShiftedEmpties(body, headerRun);
  // Rows padded with empty cells past the last column the header names ("NP" / "1.23" / "16.91" / "***" / "" / ""):
  // a web page's row shorter than its widest row, copied cell by cell. They are no values: counted, they make the
  // rows wider than the header, whose names then land on the wrong columns.
  if (grid === null) body = withoutPaddingEmpties(body, headerRun);
  const typical = typicalValueCount(body);
  const widest = widestValueCount(body);
  const blocksAlike = grid === null && widest > typical && headerRun.length === widest && repeatsBlock(headerRun.map((cell) => headerKey(cell.text)), typical);
  const valueCount = blocksAlike ? widest : typical;
  // A column of footnote letters no header names, after the last value ("1.74" / "b", "2.19" / "a", or a cell left
  // empty): not a value of the row, nor the start of the next row's label.
  if (grid === null && !blocksAlike) body = withoutFootnoteCells(body, valueCount);

  // A header of two full rows: the columns' names, then what the groups' columns hold ("Item" / "EP group" / "CACP
  // group" / "Total" / "X 2/t" / "p" over "n (%)" / "n (%)" / "n (%)" / "" / ""). Its lower row's empty cells may
  // stand after the names, before the first row's label: they are the header's.
  const twoLevel = grid === null ? twoLevelHeader(cells.slice(first, bodyStart), body, valueCount) : null;
  if (twoLevel !== null) {
    headerRun = [cells[first]!, ...twoLevel.upper];
    body = body.slice(twoLevel.emptiesTaken);
    bodyStart += twoLevel.emptiesTaken;
  }
  // Of the runs of that many header cells, the one with the most known names (the last on a tie): cells after it
  // are a section and the first row's label cells, even when one reads like a name ("Photosynthesis", "Fv/Fm", "N").
  const window = grid === null && twoLevel === null && valueCount >= 2 && headerRun.length > valueCount ? bestNameWindow(headerRun, valueCount) : -1;
  if (window >= 0 && window + valueCount < headerRun.length) {
    const lastName = headerRun[window + valueCount - 1]!;
    bodyStart = cells.indexOf(lastName) + 1;
    body = cells.slice(bodyStart);
    headerRun = headerRun.slice(0, window + valueCount);
  }
  // Fewer header cells than values: the columns before the first known name are named by cells no vocabulary
  // knows ("2011", "2012", "Intervention"): as many of the short cells right before it as are missing.
  // (Only after a run of at least two known names of value columns, "χ2 (1)", "P": one known name alone may be
  // a row's label, "Correlation", with the header further back.)
  const knownRun = headerRun.length >= 2 && headerRun.every((cell) => isColumnName(cell.text) && !['label', 'unknown'].includes(classifyHeader(cell.text).role));
  // (Or after one known name of a test, "χ2 (df = 2)", whose columns before are named by the header's cells from its
  // first after the title on, "Risk factor" / "Cases n (%)" / "Controls n (%)": stars give the p, no p column.)
  const loneTest = grid === null && titled && headerRun.length === 1 && namesTestOtherThanR(headerRun[0]!.text);
  const unnamed =
    grid === null && (knownRun || loneTest) && valueCount > headerRun.length
      ? unnamedColumnsBefore(cells, first, valueCount - headerRun.length, titleLine, loneTest ? labelHeaderOnly : undefined)
      : null;
  if (unnamed !== null) {
    headerRun = [...unnamed, ...headerRun];
    first = cells.indexOf(unnamed[0]!);
  }
  // Fewer names than the rows' values, every name known ("Variables" / "Pearson's χ2" / "P values" over rows of four
  // values): the columns after the last known name are named by the short cells right after it that no vocabulary
  // knows ("OAK", "Control"), as many as are missing, when a text cell is left for the first row's label.
  const namedAfter = grid === null && unnamed === null && titled ? unnamedColumnsAfter(body, headerRun) : null;
  if (namedAfter !== null) {
    const lastName = namedAfter[namedAfter.length - 1]!;
    headerRun = [...headerRun, ...namedAfter];
    bodyStart = cells.indexOf(lastName) + 1;
    body = body.slice(body.indexOf(lastName) + 1);
  }
  // Without a title, nothing but the header says where the table starts: its names must match the rows' values
  // one to one (a header cut off above, "MD" / "t (df=29)" / "Sig." over seven values, is not read).
  if (!titled && headerRun.filter((cell) => classifyHeader(cell.text).role !== 'label').length !== valueCount) return null;
  const labelCount = typicalLabelCount(body);
  // (The names after a label column's name, "Source": those are the value columns'.)
  const valueNames = headerRun.length > 0 && classifyHeader(headerRun[0]!.text).role === 'label' ? headerRun.slice(1) : headerRun;
  const everyCell =
    grid !== null
      ? headerRun
      : unnamed !== null
        ? headerRun
        : namedAfter !== null
          ? valueNames
        : valueCount >= 2 && headerRun.length > valueCount
          ? headerRun.slice(headerRun.length - valueCount)
          : valueCount >= 2 && valueNames.length === valueCount
            ? valueNames
            : null;
  const names = everyCell ?? headerRun.filter((cell) => isColumnName(cell.text) && classifyHeader(cell.text).role !== 'label');
  const roles = names.map((cell) => classifyHeader(cell.text));
  const known = roles.filter((role) => role.role !== 'unknown' && role.role !== 'label').length;
  // A results table: a column names a statistic or p, or its cells hold written results ("χ2(2) = 5.496").
  const namesTest = roles.some((role) => role.role === 'statistic' || role.role === 'p' || role.role === 'result');
  const holdsResults = body.some((cell) => !cell.empty && shapeOf(cell.text).shape === 'written');
  if (grid === null && (known < (everyCell ? 1 : 2) || names.length < 2 || !(namesTest || holdsResults))) return null;
  // Label headers: a label name starting the header ("Source"), or the text cells right before the first column name.
  const startsWithLabel = grid === null && classifyHeader(cells[first]!.text).role === 'label';
  // (In a grid, a group's title that states its size, "Night workers (n = 1,223)", heads its columns, not the labels.)
  // (A column of tests' name, "Test", between the label's and the values' names heads label cells too.)
  const testColumn = startsWithLabel ? cells.slice(first + 1, bodyStart).filter((cell) => !cell.empty && NAMES_TEST_COLUMN.test(cell.text) && !names.includes(cell)) : [];
  const labelHeaders = startsWithLabel ? [cells[first]!, ...testColumn] : cells.slice(Math.max(0, first - labelCount), first).filter((cell) => !isValueCell(cell) && !(grid !== null && GROUP_SIZE.test(cell.text)));
  const rows: string[][] = [[labelHeaders.map((cell) => cell.text).join(' / '), ...names.map((cell) => cell.text)]];
  const spans: (CellSpan | null)[][] = [[spanOf(labelHeaders), ...names.map(spanOf1)]];
  if (twoLevel !== null) {
    rows.push(['', ...twoLevel.lower.map((cell) => cell.text)]);
    spans.push([null, ...twoLevel.lower.map((cell) => (cell.empty ? null : spanOf1(cell)))]);
  }
  // Block titles that carry their df ("Treatment (num. df = 1)") before the column names: an upper header row.
  const dfTitles = [...cells.slice(0, first), ...headerRun].filter((cell) => !cell.empty && !names.includes(cell) && TITLE_WITH_DF.test(cell.text));
  // Or titles that each close with their statistic's df ("Group F(1, 58)" / "Time F(2, 116)" over "F" / "p" / "F" /
  // "p"): one per statistic column whose name gives no df, before the names.
  const statisticTitles = dfTitles.length === 0 ? statisticDfTitles(headerRun, names) : [];
  for (const titles of [dfTitles, statisticTitles]) {
    if (titles.length === 0) continue;
    rows.unshift(['', ...titles.map((cell) => cell.text)]);
    spans.unshift([null, ...titles.map(spanOf1)]);
  }
  // Titles of groups side by side that state each group's size ("Non-shift workers (n = 1,966)") before a grid's
  // column names: an upper header row too (the correlations' df come from those sizes), not caption lines.
  const sizeTitles = grid !== null && dfTitles.length === 0 ? cells.slice(0, first).filter((cell) => !cell.empty && cell.line > titleLine && cell.text.length <= MAX_GROUP_TITLE && GROUP_SIZE.test(cell.text)) : [];
  if (sizeTitles.length > 0) {
    rows.unshift(['', ...sizeTitles.map((cell) => cell.text)]);
    spans.unshift([null, ...sizeTitles.map(spanOf1)]);
  }
  let pendingText: Cell[] = [];
  let index = 0;
  // (A header that took every cell leaves no body: no table.)
  if (bodyStart >= cells.length) return null;
  let lastLine = cells[bodyStart]!.line;
  // A p set on the line under a row's last value ("2.80" / "p = .104", "16.64" / "(<.001)"), where no column is the
  // p's: a row of its own with no label, the p in the last column, for the reader to tie to the value above.
  const pUnderRows = grid === null && !roles.some((role) => role.role === 'p');
  const pushPUnder = (cell: Cell): void => {
    rows.push(['', ...names.slice(1).map(() => ''), cell.text]);
    spans.push([null, ...names.slice(1).map(() => null), spanOf1(cell)]);
    lastLine = cell.line;
  };
  while (index < body.length) {
    const cell = body[index]!;
    const previousRow = rows[rows.length - 1]!;
    const underFullRow = pUnderRows && pendingText.length === 0 && rows.length > 1 && previousRow.length === names.length + 1 && previousRow[0] !== '' && previousRow[names.length] !== '';
    if (underFullRow && !cell.empty && P_UNDER_VALUE.test(cell.text)) {
      pushPUnder(cell);
      index++;
      continue;
    }
    if (!isValueCell(cell)) {
      pendingText.push(cell);
      index++;
      continue;
    }
    let end = index;
    while (end < body.length && isValueCell(body[end]!)) end++;
    // (A run one value longer than the columns whose last value is a p alone: that p is under the row's last value.)
    const lastValue = body[end - 1]!;
    const pAfterRow = pUnderRows && end - index === names.length + 1 && !lastValue.empty && P_UNDER_VALUE.test(lastValue.text) && pendingText.length > 0 ? lastValue : null;
    if (pAfterRow !== null) end--;
    const values = body.slice(index, end);
    // A header printed again partway down under other names ("(x̄ ± s)" / "(x̄ ± s)" / "(x̄ ± s)" / "t" / "p"): a
    // header row of its own, before the next row's label, or closing with empty cells when none follows.
    const onlyEmpty = values.every((value) => value.empty);
    const innerHeader = grid === null ? innerHeaderBefore(pendingText, onlyEmpty ? 0 : labelCount, valueCount) : null;
    if (innerHeader !== null) {
      const before = pendingText.slice(0, pendingText.indexOf(innerHeader[0]!));
      if (before.length > 0) {
        rows.push([before.map((text) => text.text).join(' ')]);
        spans.push([spanOf(before)]);
      }
      rows.push(['', ...innerHeader.map((name) => name.text)]);
      spans.push([null, ...innerHeader.map(spanOf1)]);
      pendingText = pendingText.slice(pendingText.indexOf(innerHeader[innerHeader.length - 1]!) + 1);
      if (onlyEmpty) {
        index = end;
        continue;
      }
    }
    const label = pendingText.slice(-labelCount);
    const section = pendingText.slice(0, pendingText.length - label.length);
    if (section.length > 0) {
      rows.push([section.map((text) => text.text).join(' ')]);
      spans.push([spanOf(section)]);
    }
    rows.push([label.map((text) => text.text).join(' '), ...values.map((value) => (value.empty ? '' : value.text))]);
    spans.push([spanOf(label), ...values.map((value) => (value.empty ? null : spanOf1(value)))]);
    lastLine = body[end - 1]!.line;
    pendingText = [];
    index = end;
    if (pAfterRow !== null) {
      pushPUnder(pAfterRow);
      index++;
    }
  }
  if (rows.length < 2) return null;
  const lastCell = body.filter((cell) => cell.line <= lastLine).pop()!;
  return {
    table: {
      start: title.start + (title.text.length - title.text.trimStart().length),
      end: lastCell.end,
      caption: !titled ? null : grid !== null ? captionOfGrid(caption, cells.slice(0, first).filter((cell) => !sizeTitles.includes(cell))) : title.text.trim(),
      notes: [],
      rows,
      headerRows: (dfTitles.length > 0 || statisticTitles.length > 0 || sizeTitles.length > 0 ? 2 : 1) + (twoLevel !== null ? 1 : 0),
      cells: spans,
      layout: 'cell-per-line',
    },
    lastLine,
  };
}

/**
 * The cells after `from`: one per non-blank line, up to a note, a long line of prose, or a gap of blank lines
 * (and, when given, no further than line `lastLine`, and no further than the line that brings the cells with
 * text to `mostTextCells`: the first cells of the same collection, apart from empty cells at its end).
 */
function collectCells(lines: Line[], from: number, lastLine = Infinity, mostTextCells = Infinity, correlations = false): Cell[] {
  const cells: Cell[] = [];
  let textCells = 0;
  let blankRun = 0;
  // Whether a cell so far names a column: kept as cells come, not looked for again at every line.
  let headerSeen = false;
  // Cells on the line right after the cell before, and cells one blank line after it: a copy that puts its cells
  // on consecutive lines gives an empty cell as an empty line, one that separates cells by blank lines does not.
  let adjacentCells = 0;
  let separatedCells = 0;
  let lastCellLine = -1;
  // The last run of empty lines taken as empty cells, until a value comes after it.
  let tailEmpties: { at: number; run: number } | null = null;
  for (let index = from; index < lines.length && index <= lastLine && cells.length < MAX_BODY_CELLS && textCells < mostTextCells; index++) {
    const line = lines[index]!;
    // (A pipe that closes the cell above it, or a line joined onto it: no cell, and no blank line either.)
    if (line.closesCell === true) continue;
    const inner = stripPipes(line.text);
    if (inner === null) {
      if (blankRun === 0 && adjacentCells >= 1 && adjacentCells > 3 * separatedCells) {
        const run = emptyCellLines(lines, index);
        // (After one pair of cells on consecutive lines, a header row's first cells "Means" / "Paired differences",
        // its empty cells are empty lines when a column's name follows on consecutive lines: the copy goes on so.)
        const namesFollow = run > 0 && namesOnConsecutiveLines(lines, index + run);
        // (Only in the header's rows and after them: a caption's blank lines are not cells.)
        if (run > 0 && (adjacentCells >= MIN_ADJACENT_CELLS || namesFollow) && (headerSeen || correlations || namesFollow || isColumnName(lines[index + run]!.text.trim()))) {
          for (let offset = 0; offset < run; offset++) cells.push({ text: '', start: lines[index + offset]!.start, end: lines[index + offset]!.start, line: index + offset, empty: true });
          tailEmpties = { at: cells.length - run, run };
          index += run - 1;
          lastCellLine = index;
          continue;
        }
      }
      if (line.text.trim() === '' && ++blankRun > MAX_BLANK_RUN) break;
      continue;
    }
    if (inner.text.trim() === '') {
      // A line of spaces inside a table copied from a web page stands for empty cells, one per space
      // (a row's empty cells, each a space, run onto one line: "   " for three).
      const spaces = Math.min(MAX_EMPTY_RUN, Math.max(1, line.text.replace(/\|/g, '').length));
      if (line.text.length > 0 && cells.length > 0) {
        for (let count = 0; count < spaces; count++) cells.push({ text: '', start: line.start, end: line.start, line: index, empty: true });
      }
      blankRun = 0;
      continue;
    }
    blankRun = 0;
    const text = inner.text.trim();
    // Before the header, long lines are the caption ("From: <the article's title>"); after it, they end the table.
    if (!headerSeen && text.length > MAX_CELL_LENGTH && index - from < MAX_LINES_TO_HEADER) continue;
    if ((text.length > MAX_CELL_LENGTH && !isLongRowLabel(text, lines, index)) || NOTE.test(text) || (cells.length > 0 && TITLE.test(text))) break;
    const start = line.start + inner.offset + (inner.text.length - inner.text.trimStart().length);
    // A header row run together on one line among lines of one cell each ("t df p Effect size Cohen's d"):
    // a cell per name.
    // (Not when rows follow crushed onto lines of their own: that is a crushed table, read elsewhere.)
    const names = isColumnName(text) || crushedRowFollows(lines, index) ? null : splitRunTogetherNames(text);
    if (names !== null) {
      for (const name of names) cells.push({ text: name.text, start: start + name.start, end: start + name.end, line: index, empty: false });
      textCells += names.length;
      headerSeen ||= names.some((name) => isColumnName(name.text));
      continue;
    }
    cells.push({ text, start, end: start + text.length, line: index, empty: false });
    textCells++;
    headerSeen ||= isColumnName(text);
    if (tailEmpties !== null && isValueCell(cells[cells.length - 1]!)) tailEmpties = null;
    if (index - lastCellLine === 1) adjacentCells++;
    else if (index - lastCellLine - blankRunBefore(lines, index) === 1) separatedCells++;
    lastCellLine = index;
  }
  // Empty lines followed only by text (a heading, a line of prose) end the table: they are not its cells.
  if (tailEmpties !== null && tailEmpties.at + tailEmpties.run < cells.length) cells.splice(tailEmpties.at, tailEmpties.run);
  return cells;
}

/** A group's title that states its size: "Non-shift workers (n = 1,966)", "Women, N = 90". */
const GROUP_SIZE = /\b[nN] ?= ?\d{1,3}(?:,\d{3})*\)?$/;
/** Longest group title over a grid's columns. */
const MAX_GROUP_TITLE = 80;

/** A title that says the table holds correlations; and one that says they are of another kind (their df are not N − 2). */
const SAYS_CORRELATIONS = /correlat/i;
const OTHER_CORRELATIONS = /partial|intra-?class|canonical|\bICC|semi-?partial|cross-?lagged|polychoric|tetrachoric/i;
/** Longest cell taken as the name of a column no vocabulary knows. */
const MAX_UNNAMED_COLUMN = 40;

/**
 * The cells that name the columns after a header's last known name: the short text cells that open `body`, as many
 * as the rows' values (up to each row's last filled one, in most rows) outnumber the header's names of value
 * columns, all of which must be known names; null unless there are exactly that many before the first empty or
 * value cell and a text cell is left after them for the first row's label.
 */
function unnamedColumnsAfter(body: Cell[], headerRun: Cell[]): Cell[] | null {
  const valueNames = headerRun.length > 0 && classifyHeader(headerRun[0]!.text).role === 'label' ? headerRun.slice(1) : headerRun;
  if (valueNames.length < 2 || !valueNames.every((cell) => isColumnName(cell.text) && !['label', 'unknown'].includes(classifyHeader(cell.text).role))) return null;
  const missing = typicalFilledValues(body) - valueNames.length;
  if (missing < 1) return null;
  const names: Cell[] = [];
  let at = 0;
  while (at < body.length && names.length < missing && !isValueCell(body[at]!) && body[at]!.text.length <= MAX_UNNAMED_COLUMN && !isColumnName(body[at]!.text)) names.push(body[at++]!);
  if (names.length !== missing || at >= body.length || (isValueCell(body[at]!) && !body[at]!.empty)) return null;
  // (The first row's label: a text cell before the first value.)
  const firstValue = body.findIndex((cell, index) => index >= at && isValueCell(cell) && !cell.empty);
  if (firstValue <= at || !body.slice(at, firstValue).some((cell) => !cell.empty && !isValueCell(cell))) return null;
  // The names stand before the unnamed columns in the header, so the rows' first values are the known columns': each
  // must fit its column ("10.84(1, 141)" a chi-square, "P = 0.001" a p). A section's title taken for a name, over a
  // column that stands elsewhere, puts a value under the wrong name, which this refuses.
  const roles = valueNames.map((cell) => classifyHeader(cell.text));
  const fullRuns = valueRuns(body).filter((run) => filledLength(run) === valueNames.length + missing);
  return fullRuns.length > 0 && fullRuns.every((run) => roles.every((role, column) => fit(role, shapeOf(run[column]!.text)) > 0)) ? names : null;
}

/**
 * The `valueCount` text cells before the last `labelCount` of `pending` when they name the columns again, a
 * statistic's name and a p's among them ("(x̄ ± s)" / "(x̄ ± s)" / "(x̄ ± s)" / "t" / "p"); null otherwise.
 */
function innerHeaderBefore(pending: Cell[], labelCount: number, valueCount: number): Cell[] | null {
  if (valueCount < 2 || pending.length < valueCount + labelCount) return null;
  const names = pending.slice(pending.length - labelCount - valueCount, pending.length - labelCount);
  const roles = names.map((cell) => classifyHeader(cell.text).role);
  return roles.includes('statistic') && roles.includes('p') && names.every((cell) => cell.text.length <= MAX_UNNAMED_COLUMN) ? names : null;
}

/** Times a cell must stand right before a row's values, after the first row, to be a row's cell rather than a header's. */
const MIN_RECURRING_ROW_CELL = 2;

/** How often each text (by its header key) stands right before a run of values in `body`, the first run's excepted. */
function cellsBeforeValueRuns(body: Cell[]): Map<string, number> {
  const counts = new Map<string, number>();
  for (const { start } of valueRunBounds(body)) {
    const before = body[start - 1];
    if (before === undefined || before.empty) continue;
    const key = headerKey(before.text);
    counts.set(key, (counts.get(key) ?? 0) + 1);
  }
  return counts;
}

/** The runs of value cells (a row's values) in `cells`. */
function valueRuns(cells: Cell[]): Cell[][] {
  return valueRunBounds(cells).map(({ start, end }) => cells.slice(start, end));
}

/** Where each run of value cells in `cells` starts and ends (its end the index after its last cell). */
function valueRunBounds(cells: Cell[]): { start: number; end: number }[] {
  const runs: { start: number; end: number }[] = [];
  let index = 0;
  while (index < cells.length) {
    if (!isValueCell(cells[index]!)) {
      index++;
      continue;
    }
    let end = index;
    while (end < cells.length && isValueCell(cells[end]!)) end++;
    runs.push({ start: index, end });
    index = end;
  }
  return runs;
}

/** How many of a run's values come up to its last filled one. */
function filledLength(run: Cell[]): number {
  let length = run.length;
  while (length > 0 && run[length - 1]!.empty) length--;
  return length;
}

/** The number of values most runs of values in `cells` hold up to their last filled one (0 when none). */
function typicalFilledValues(cells: Cell[]): number {
  const counts = new Map<number, number>();
  for (const run of valueRuns(cells)) {
    const filled = filledLength(run);
    if (filled > 0) counts.set(filled, (counts.get(filled) ?? 0) + 1);
  }
  let best = 0;
  for (const [count, times] of counts) if (times > (counts.get(best) ?? 0)) best = count;
  return best;
}

/**
 * The `missing` cells right before the header's first known name, when each is a short cell on a line of its
 * own after the title that names a column (a year, a group: "2011", "Intervention"), not a label header
 * ("Question", "Variable") and not a caption line; null when there are not that many.
 */
function unnamedColumnsBefore(cells: Cell[], first: number, missing: number, titleLine: number, before?: (cells: Cell[], at: number, titleLine: number) => boolean): Cell[] | null {
  const names: Cell[] = [];
  let index = first - 1;
  for (; index >= 0 && names.length < missing; index--) {
    const cell = cells[index]!;
    if (cell.empty) continue;
    if (cell.line <= titleLine || cell.text.length > MAX_UNNAMED_COLUMN || FROM_LINE.test(cell.text)) return null;
    if (isValueCell(cell) && !YEAR_NAME.test(cell.text)) return null;
    if (classifyHeader(cell.text).role === 'label') return null;
    names.unshift(cell);
  }
  if (names.length !== missing) return null;
  return before === undefined || before(cells, index, titleLine) ? names : null;
}

/** Whether a test's name other than a correlation's ("χ2 (df = 2)", "t", "F"): "Correlation" alone may be a row's label. */
function namesTestOtherThanR(text: string): boolean {
  const role = classifyHeader(text);
  return isColumnName(text) && role.role === 'statistic' && role.kind !== 'r';
}

/**
 * Whether the cells up to `at` are one short text cell, the label column's name, and nothing else after the title
 * ("Risk factor"): the header then starts right under the title, no caption line or row of another table's cells
 * before it, so the cells between it and the test's name can only name the columns before the test's.
 */
function labelHeaderOnly(cells: Cell[], at: number, titleLine: number): boolean {
  let textCells = 0;
  for (let index = at; index >= 0; index--) {
    const cell = cells[index]!;
    if (cell.empty) continue;
    if (cell.line <= titleLine || isValueCell(cell) || cell.text.length > MAX_UNNAMED_COLUMN) return false;
    textCells++;
  }
  return textCells === 1;
}

/** A year naming a column ("2011", "2012"): a header cell, though it reads as a number. */
const YEAR_NAME = /^(?:19|20)\d{2}$/;

/** Longest row label read as one (a survey question as a table's row label). */
const MAX_ROW_LABEL_LENGTH = 300;

/**
 * Whether a line longer than a cell is a long row label rather than prose after the table: one sentence (a
 * survey question, "(3) Did you have opportunity to …?"), not longer than MAX_ROW_LABEL_LENGTH, and followed
 * by a short line (the row's next cell).
 */
function isLongRowLabel(text: string, lines: Line[], index: number): boolean {
  if (text.length > MAX_ROW_LABEL_LENGTH || /[.!?;]\s+\p{Lu}/u.test(text)) return false;
  for (let at = index + 1; at < lines.length && at <= index + MAX_BLANK_RUN + 1; at++) {
    const next = lines[at]!.text.trim();
    if (next === '') continue;
    return next.length <= MAX_CELL_LENGTH / 2;
  }
  return false;
}

/** Most numbers a column's name holds ("F(2, 48)", "95% CI 2.5–97.5": three at most). */
const MAX_NUMBERS_IN_NAME = 3;

/** How many numbers stand as words of their own in a cell's text. */
function numbersIn(text: string): number {
  let count = 0;
  for (const word of text.split(/\s+/)) if (/^[-\u2212\u2013]?(?:\d+(?:[.,]\d+)?|[.,]\d+)$/.test(word)) count++;
  return count;
}

/** A page's line naming the article a table comes from ("From: <title>"), part of the caption. */
const FROM_LINE = /^From:\s/;

/**
 * The header of a correlation table whose column names no vocabulary knows:
 * the cells right before the first row's label cells, as many as most rows
 * have values; null when those are not all text after the title's lines.
 */
function gridHeader(cells: Cell[], titleLine: number): { first: number; bodyStart: number } | null {
  const firstValue = cells.findIndex((cell) => !cell.empty && isValueCell(cell));
  if (firstValue < 0) return null;
  const body = cells.slice(firstValue);
  const valueCount = typicalValueCount(body);
  // Label cells before a row's values: most rows have this many (a section line adds one before some).
  const labelCount = typicalLabelCount(body);
  if (valueCount < 2) return null;
  const bodyStart = firstValue - labelCount;
  // (More label cells than stand before the first value: the lines are no grid.)
  if (bodyStart < 0) return null;
  const header = cells.slice(0, bodyStart).filter((cell) => !cell.empty && !FROM_LINE.test(cell.text) && cell.line > titleLine);
  const names = header.slice(header.length - valueCount);
  if (names.length < valueCount || names.some((cell) => isValueCell(cell))) return null;
  return { first: cells.indexOf(names[0]!), bodyStart };
}

/** Shortest cell before a grid's header taken as a caption line rather than a label header ("Variables"). */
const MIN_CAPTION_CELL = 30;

/** A grid's caption: the title's lines, and the caption lines that stand as cells of their own before the header. */
function captionOfGrid(caption: string, beforeHeader: Cell[]): string {
  const lines = beforeHeader.filter((cell) => !cell.empty && cell.text.length >= MIN_CAPTION_CELL && !caption.includes(cell.text)).map((cell) => cell.text);
  return [caption, ...lines].join(' ');
}

/** Fewest numbers a numbered matrix's header is read from ("1 2 3"). */
const MIN_NUMBERED_COLUMNS = 3;

/**
 * The header of a numbered correlation matrix, one cell per line: "1", "2", … "k" in order, then the first row's
 * label, which starts with its number ("1. Anxiety"); null otherwise. Numbers are value cells to every other
 * reading, so this header is looked for first.
 */
function numberedHeader(cells: Cell[]): { first: number; bodyStart: number; numberApart?: boolean } | null {
  // The columns count up from 1, or from a later variable's number when the first variables' columns are left
  // out ("4 5 6 7 8 9"): the first number followed by the next.
  const start = cells.findIndex((cell, index) => {
    if (cell.empty || !/^\d{1,2}$/.test(cell.text) || index > MAX_CELLS_TO_HEADER * 2) return false;
    const next = cells.slice(index + 1).find((other) => !other.empty);
    return cell.text === '1' || next?.text === String(Number(cell.text) + 1);
  });
  if (start < 0 || start > MAX_CELLS_TO_HEADER * 2) return null;
  let expected = Number(cells[start]!.text);
  const firstNumber = expected;
  let index = start;
  let last = start;
  while (index < cells.length && expected <= MAX_HEADER_CELLS) {
    const cell = cells[index]!;
    if (cell.empty) {
      index++;
      continue;
    }
    if (cell.text !== String(expected)) break;
    last = index;
    expected++;
    index++;
  }
  if (expected - firstNumber < MIN_NUMBERED_COLUMNS) return null;
  const next = cells.slice(last + 1).find((cell) => !cell.empty);
  if (next === undefined) return null;
  if (/^1\.\s?\S/.test(next.text)) return { first: start, bodyStart: last + 1 };
  // The variable's number in a cell of its own before its name ("1" / "Anxiety").
  const afterNext = cells.slice(cells.indexOf(next) + 1).find((cell) => !cell.empty);
  if (/^1\.?$/.test(next.text) && afterNext !== undefined && !isValueCell(afterNext)) return { first: start, bodyStart: last + 1, numberApart: true };
  return null;
}

/**
 * The body of a numbered grid whose rows print the variable's number in a cell of its own before its name
 * ("2" / "Depression"): each number joined to the name after it ("2. Depression"), as the matrix reader reads
 * its rows. Only the numbers that come in order (1, 2, 3, ...) are joined.
 */
function joinRowNumbers(body: Cell[]): Cell[] {
  const joined: Cell[] = [];
  let expected = 1;
  for (let index = 0; index < body.length; index++) {
    const cell = body[index]!;
    const name = body[index + 1];
    if (!cell.empty && cell.text.replace(/\.$/, '') === String(expected) && name !== undefined && !name.empty && !isValueCell(name)) {
      joined.push({ text: `${expected}. ${name.text}`, start: cell.start, end: name.end, line: name.line, empty: false });
      expected++;
      index++;
      continue;
    }
    joined.push(cell);
  }
  return joined;
}

/** Lines looked at after a header line for a crushed row (a superscript line, "2", may come first). */
const CRUSHED_ROW_LOOKAHEAD = 3;

/** Whether one of the next non-blank lines after `index` holds two or more numbers apart by spaces: a crushed row. */
function crushedRowFollows(lines: Line[], index: number): boolean {
  let seen = 0;
  for (let at = index + 1; at < lines.length && seen < CRUSHED_ROW_LOOKAHEAD; at++) {
    const line = lines[at]!;
    const text = line.text.trim();
    if (text === '' || text === '|') continue;
    seen++;
    if (holdsTwoNumbers(line, text)) return true;
  }
  return false;
}

/**
 * Whether a line's words include two or more numbers, kept per line: each line is asked again by the
 * lines before it (the lookahead above) and by every table search that passes it.
 */
const twoNumbersOnLine = new WeakMap<Line, boolean>();

function holdsTwoNumbers(line: Line, trimmed: string): boolean {
  const known = twoNumbersOnLine.get(line);
  if (known !== undefined) return known;
  let numbers = 0;
  for (const word of trimmed.split(/\s+/)) {
    if (readCell(word).kind === 'number' && ++numbers >= 2) break;
  }
  twoNumbersOnLine.set(line, numbers >= 2);
  return numbers >= 2;
}

/** A line without the pipes a web page's table leaves around a cell ("| Source |", "DF |"); null for an empty line. */
function stripPipes(text: string): { text: string; offset: number } | null {
  if (text.length === 0) return null;
  let start = 0;
  let end = text.length;
  while (start < end && (text[start] === ' ' || text[start] === '|')) start++;
  while (end > start && (text[end - 1] === ' ' || text[end - 1] === '|')) end--;
  // The closing bar of an absolute value ends the cell's text, not a pipe around it ("Pr > |t|").
  if (text[end] === '|' && /(?:^|[\s>=<(])\|[^\s|]{1,3}$/.test(text.slice(start, end))) end++;
  if (start === end) {
    // Only spaces or pipes: one pipe ends an empty cell ("|"), spaces are an empty cell, "| |" separates rows.
    const pipes = text.split('|').length - 1;
    if (pipes === 1 || pipes === 0) return { text: ' ', offset: 0 };
    return null;
  }
  return { text: text.slice(start, end), offset: start };
}

/** A statistic with its df written into its cell: "4.95, df = 4254.7", "−7.63; df = 346.02". */
const STATISTIC_WITH_DF = /^(?:[-\u2212\u2013] ?)?(?:\d{1,6}(?:\.\d{1,4})?|\.\d{1,4}) ?[,;] ?df ?= ?\d{1,6}(?:\.\d{1,3})?(?: ?, ?\d{1,6}(?:\.\d{1,3})?)?$/i;

function isValueCell(cell: Cell): boolean {
  if (cell.empty) return true;
  // (A "Statistic" column's cell that writes the df after the value is the row's value, not more of its label.)
  if (STATISTIC_WITH_DF.test(cell.text)) return true;
  // A lone letter that names a column ("d", "z", "p") is a header cell, not a footnote mark.
  if (cell.text.length <= 2 && isColumnName(cell.text)) return false;
  // A footnote letter set apart after the value and its stars ("-.51* a") belongs to the value.
  const shape = shapeOf(cell.text.replace(/(?<=[\d*\u2020\u2021])\s[a-h]$/, '')).shape;
  return shape !== 'text';
}

/** A known column name other than a bare label ("Source" counts too: it starts the header). */
function isColumnName(text: string): boolean {
  return text.length <= 40 && (isKnownHeader(headerKey(text)) || namesEffectWithTest(text));
}

/** A block title with its df: "Treatment (num. df = 1)", "Condition (df = 2, 57)". */
const TITLE_WITH_DF = /\((?:num(?:erator)?\.?\s*)?dfs?\s*=\s*\d+(?:\.\d+)?(?:\s*,\s*\d+(?:\.\d+)?)?\)/i;

/** Start of the run of `size` header cells with the most known column names (the last such run on a tie). */
function bestNameWindow(run: Cell[], size: number): number {
  const known = run.map((cell) => (isColumnName(cell.text) && classifyHeader(cell.text).role !== 'label' ? 1 : 0));
  let best = -1;
  let bestCount = -1;
  let count = known.slice(0, size).reduce((sum: number, value) => sum + value, 0);
  for (let start = 0; start + size <= run.length; start++) {
    if (start > 0) count += known[start + size - 1]! - known[start - 1]!;
    if (count >= bestCount) [best, bestCount] = [start, count];
  }
  return best;
}

/** The number of values most rows have (0 when no row has two). */
function typicalValueCount(body: Cell[]): number {
  const counts = new Map<number, number>();
  for (const run of valueRuns(body)) if (run.length >= 2) counts.set(run.length, (counts.get(run.length) ?? 0) + 1);
  let best = 0;
  let bestCount = 0;
  for (const [count, times] of counts) if (times > bestCount || (times === bestCount && count > best)) [best, bestCount] = [count, times];
  return best;
}

/** The largest number of values a row has. */
function widestValueCount(body: Cell[]): number {
  let widest = 0;
  let run = 0;
  for (const cell of body) {
    run = isValueCell(cell) ? run + 1 : 0;
    widest = Math.max(widest, run);
  }
  return widest;
}

/** Whether the names are one block of `size` names printed again and again ("df", "F", "df", "F"). */
function repeatsBlock(names: string[], size: number): boolean {
  if (size < 1 || names.length % size !== 0 || names.length === size) return false;
  return names.every((name, index) => name === names[index % size]);
}

/**
 * The body without the empty cells that end most rows' values when the header's label names ("Factor",
 * "Variable") leave fewer value columns than those rows have values and every extra cell is empty; the body
 * unchanged otherwise.
 */
function withoutSpanShiftedEmpties(body: Cell[], headerRun: Cell[]): Cell[] {
  let labelNames = 0;
  while (labelNames < headerRun.length && classifyHeader(headerRun[labelNames]!.text).role === 'label') labelNames++;
  const valueNames = headerRun.length - labelNames;
  if (labelNames < 2 || valueNames < 2 || typicalValueCount(body) <= valueNames) return body;
  const kept: Cell[] = [];
  let index = 0;
  while (index < body.length) {
    if (!isValueCell(body[index]!)) {
      kept.push(body[index++]!);
      continue;
    }
    let end = index;
    while (end < body.length && isValueCell(body[end]!)) end++;
    let last = end;
    while (last - index > valueNames && body[last - 1]!.empty) last--;
    kept.push(...body.slice(index, last));
    index = end;
  }
  return typicalValueCount(kept) === valueNames ? kept : body;
}

/**
 * The body without the empty cells that pad rows past their last filled value, when no row fills a cell there
 * and the header ends in exactly as many names of value columns as rows fill (the cell before them names no
 * value column, or the names are one block printed again, "F" / "Sig." / "F" / "Sig.", that the cell before is
 * not part of); the body unchanged otherwise. (A column the header names but no row fills, "F" / "p" / "η2" over
 * rows of two values, keeps its empty cells: the names then outnumber the filled values by one known name.)
 */
function withoutPaddingEmpties(body: Cell[], headerRun: Cell[]): Cell[] {
  const filled = typicalFilledValues(body);
  if (filled < 2 || typicalValueCount(body) <= filled || headerRun.length < filled) return body;
  const runs = valueRunBounds(body);
  if (runs.some(({ start, end }) => filledLength(body.slice(start, end)) > filled)) return body;
  const names = headerRun.slice(headerRun.length - filled);
  if (!names.every((cell) => isValueColumnName(cell.text))) return body;
  const before = headerRun[headerRun.length - filled - 1];
  if (before !== undefined && isValueColumnName(before.text) && !endsRepeatedBlock(names, before)) return body;
  const padding = new Set<number>();
  for (const { start, end } of runs) for (let at = start + filled; at < end; at++) padding.add(at);
  const kept = body.filter((_, at) => !padding.has(at));
  return typicalValueCount(kept) === filled ? kept : body;
}

/** A known name of a value column: not a label's, not unknown. */
function isValueColumnName(text: string): boolean {
  return isColumnName(text) && !['label', 'unknown'].includes(classifyHeader(text).role);
}

/** Whether `names` are one block of names printed again and again, and `before` is none of the block's names. */
function endsRepeatedBlock(names: Cell[], before: Cell): boolean {
  const keys = names.map((cell) => headerKey(cell.text));
  for (let size = 1; size * 2 <= keys.length; size++) {
    if (repeatsBlock(keys, size)) return !keys.slice(0, size).includes(headerKey(before.text));
  }
  return false;
}

/**
 * A header of two full rows after a label column's name: `valueCount` names of columns (a test's or p among them),
 * then as many cells saying what each group's column holds ("n (%)", "Mean (SD)"), empty under the test's columns;
 * the lower row's last empty cells may open `body`. Null unless the cells make exactly those two rows.
 */
/**
 * Header cells before the column names that each name a statistic with its df ("Group F(1, 58)"), one for each
 * column naming that statistic without df ("F"), all of one kind: the titles of those columns' blocks, in order.
 * Empty when the cells are not one such title per column.
 */
function statisticDfTitles(headerRun: Cell[], names: Cell[]): Cell[] {
  const firstName = names.length > 0 ? headerRun.indexOf(names[0]!) : -1;
  if (firstName <= 0) return [];
  const titles = headerRun.slice(0, firstName).filter((cell) => {
    const role = classifyHeader(cell.text);
    return role.role === 'statistic' && role.df.length > 0;
  });
  const kinds = new Set(titles.map((cell) => (classifyHeader(cell.text) as { kind: string }).kind));
  const bareColumns = names.filter((cell) => {
    const role = classifyHeader(cell.text);
    return role.role === 'statistic' && kinds.has(role.kind) && role.df.length === 0 && role.dfInCell !== true;
  });
  return kinds.size === 1 && titles.length >= 2 && titles.length === bareColumns.length ? titles : [];
}

function twoLevelHeader(header: Cell[], body: Cell[], valueCount: number): { upper: Cell[]; lower: Cell[]; emptiesTaken: number } | null {
  if (valueCount < 2 || header.length < 2 || classifyHeader(header[0]!.text).role !== 'label') return null;
  let emptiesTaken = 0;
  while (emptiesTaken < body.length && body[emptiesTaken]!.empty) emptiesTaken++;
  const after = [...header.slice(1), ...body.slice(0, emptiesTaken)];
  if (after.length !== 2 * valueCount) return null;
  const upper = after.slice(0, valueCount);
  const lower = after.slice(valueCount);
  if (upper.some((cell) => cell.empty) || lower.every((cell) => cell.empty)) return null;
  const upperRoles = upper.map((cell) => classifyHeader(cell.text).role);
  if (!upperRoles.some((role) => role === 'statistic' || role === 'p' || role === 'result')) return null;
  // (The lower row names what a group's cells hold, under a group's name; the test's columns have no lower name.)
  const holdsGroupCells = lower.every((cell, column) => cell.empty || (['n', 'descriptive'].includes(classifyHeader(cell.text).role) && ['unknown', 'label'].includes(upperRoles[column]!)));
  return holdsGroupCells ? { upper, lower, emptiesTaken } : null;
}

/** A footnote letter or mark standing as a cell of its own ("b", "*", "†"). */
const FOOTNOTE_CELL = /^(?:[a-h]|[*\u2020\u2021]{1,3})$/;

/**
 * The body without the cells that close a row of `valueCount` values with a footnote: a lone footnote letter or
 * mark, or an empty cell, right after the row's last value and before the next row's label (a text cell) or the
 * end of the table. The body unchanged when no full row is closed so.
 */
function withoutFootnoteCells(body: Cell[], valueCount: number): Cell[] {
  if (valueCount < 2) return body;
  const dropped = new Set<number>();
  // (The cell after a run is no value cell, so a footnote closing a row there is never the next run's start.)
  for (const { start: index, end } of valueRunBounds(body)) {
    // (A lone letter that reads as a value, "a", ends the run one cell late; one that reads as a column name, "b",
    // ends it on time and stands before the next label.)
    const closing = end - index === valueCount + 1 ? end - 1 : end - index === valueCount ? end : -1;
    const cell = body[closing];
    const closesRow = cell !== undefined && (cell.empty || FOOTNOTE_CELL.test(cell.text));
    const next = body[closing + 1];
    if (closesRow && !body[closing - 1]!.empty && (next === undefined || (!next.empty && !isValueCell(next)))) dropped.add(closing);
  }
  return dropped.size === 0 ? body : body.filter((_, at) => !dropped.has(at));
}

/** The number of text cells most rows have before their values. */
function typicalLabelCount(body: Cell[]): number {
  const counts = new Map<number, number>();
  let run = 0;
  let index = 0;
  while (index < body.length) {
    if (!isValueCell(body[index]!)) {
      run++;
      index++;
      continue;
    }
    if (run > 0) counts.set(run, (counts.get(run) ?? 0) + 1);
    while (index < body.length && isValueCell(body[index]!)) index++;
    run = 0;
  }
  let best = 1;
  let bestCount = 0;
  for (const [count, times] of counts) if (times > bestCount || (times === bestCount && count < best)) [best, bestCount] = [count, times];
  return best;
}

function spanOf1(cell: Cell): CellSpan {
  return { start: cell.start, end: cell.end };
}

function spanOf(cells: Cell[]): CellSpan | null {
  const present = cells.filter((cell) => !cell.empty);
  if (present.length === 0) return null;
  return { start: present[0]!.start, end: present[present.length - 1]!.end };
}

/**
 * The number of empty lines from `index` when they stand for empty cells: a run of at most MAX_EMPTY_LINES empty
 * lines followed by a line that can be a cell; 0 otherwise.
 */
function emptyCellLines(lines: Line[], index: number): number {
  let run = 0;
  while (index + run < lines.length && lines[index + run]!.text.length === 0 && run <= MAX_EMPTY_LINES) run++;
  if (run > MAX_EMPTY_LINES) return 0;
  const next = lines[index + run];
  return next !== undefined && next.text.trim() !== '' && next.text.trim().length <= MAX_CELL_LENGTH ? run : 0;
}

/** Lines looked at, on consecutive lines from a run of empty lines' end, for a column's name. */
const NAME_LOOKAHEAD = 8;

/**
 * Whether the lines from `index` are cells on consecutive lines, at least MIN_ADJACENT_CELLS + 1 of them before a
 * blank line, one of the first NAME_LOOKAHEAD a known column's name.
 */
function namesOnConsecutiveLines(lines: Line[], index: number): boolean {
  let named = false;
  let count = 0;
  for (let at = index; at < lines.length && count < NAME_LOOKAHEAD; at++) {
    const text = lines[at]!.text.trim();
    if (text === '' || text.length > MAX_CELL_LENGTH) break;
    count++;
    named ||= isColumnName(text);
  }
  return named && count > MIN_ADJACENT_CELLS;
}

/** The number of blank lines right before line `index`. */
function blankRunBefore(lines: Line[], index: number): number {
  let run = 0;
  while (index - run - 1 >= 0 && lines[index - run - 1]!.text.trim() === '') run++;
  return run;
}
