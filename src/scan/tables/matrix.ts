/**
 * Correlation matrices: the variables are numbered rows, the columns are
 * numbered 1 to k after optional descriptive columns (M, SD), and each cell
 * holds the correlation of its row's variable with its column's, in one
 * triangle of the matrix, often with significance marks:
 *
 *     Variables                 M      SD     1         2        3
 *     1. GAD                    11.1   4.49
 *     2. Age                    20.9   2.55   −0.14
 *     3. BDI                    19.2   10.83  0.47 ***  −0.15
 *
 * Which triangle (and whether the diagonal is printed, as "—" or "1") is
 * read from the rows: the layout that the most rows fit. The correlations
 * are each row's last cells, so numbers between the label and the
 * descriptive columns (a footnote digit, "BDI 1") do not shift them. The
 * df of each r are N − 2 with N from the table's note ("N = 60"); without
 * one, the df are left to the study's stated sample size (checks/documentDf.ts).
 * Marks defined in the note give each r a p bound (marks.ts).
 *
 * Read only when the caption, header or notes say the table holds
 * correlations: other matrices (covariances, distances, loadings) have the
 * same shape.
 */

import type { DocumentTable } from '../../documents/types.js';
import type { ReportedNumber, ReportedP, ReportedResult } from '../types.js';
import { classifyHeader, readCell } from './cells.js';
import { shapeOf } from './align.js';
import { MARK, readMarkLegend, splitMarks, type MarkBound } from './marks.js';
import { appendAll } from '../../arrays.js';
import { parseReportedNumber } from '../../stats/reportedNumber.js';

interface Located {
  start: number;
  end: number;
}

export interface MatrixInput {
  text: string;
  table: DocumentTable;
  tableIndex: number;
  /** Each row's cells' offsets in the text (null where not found). */
  located: ((Located | null)[] | null)[];
  /** The table's notes and the text right after it, where the note's N and the marks' legend stand. */
  notes: string;
}

/** A column number in the header: "1", "2.", "(3)". */
const COLUMN_NUMBER = /^\(?(\d{1,2})[.)]?$/;
/** A row label that starts with the variable's number: "1. GAD", "(2) Age", "3 BDI". */
const ROW_NUMBER = /^\(?(\d{1,2})[.)]?\s+(\S.*)$/;
/** A row label that is the variable's number alone: "2". */
const NUMBER_ALONE = /^(\d{1,2})$/;
/** The diagonal as printed: a dash, a correlation of 1, or a reliability in brackets ("(.89)"). */
/** A cell that stands for no value: a dash of any kind. */
const PLACEHOLDER = /^[-\u2013\u2014\u2212]$/;
const DIAGONAL = /^(?:[-\u2013\u2014\u2212]|1|1\.0{1,3}|\((?:0?\.\d{2,3})\))$/;
const SAYS_CORRELATIONS = /correlat|\br\s*=|pearson|spearman/i;
/** The N of the table's note: "N = 60", "n = 1,024". */
export const NOTE_N = /(?:^|[^A-Za-z])[Nn]\s*=\s*(\d{1,3}(?:,\d{3})+|\d{1,7})(?!\d|\.\d)/;

/** Row layouts: which triangle, and whether the diagonal is printed. */
type Layout = { triangle: 'lower' | 'upper'; diagonal: boolean };
const LAYOUTS: Layout[] = [
  { triangle: 'lower', diagonal: false },
  { triangle: 'lower', diagonal: true },
  { triangle: 'upper', diagonal: false },
  { triangle: 'upper', diagonal: true },
];

/** Share of the numbered rows that must fit one layout. */
const MIN_FITTING_SHARE = 0.7;
/** Fewest correlations a matrix must give to be read as one. */
const MIN_CORRELATIONS = 3;

export interface ValueCell {
  number: string;
  marks: string;
  start: number;
  end: number;
  /** Offsets of the marks (the cell's end when none). */
  marksStart: number;
  /** Where the number starts, when the cell writes something before it ("r = 0.586*"); the cell's start otherwise. */
  numberStart?: number;
  /** The p printed in brackets after the value ("0.45 (<.001)"), where the table says it prints one so. */
  p?: ReportedP;
}

/** A caption, note or header that says each correlation's p stands in brackets after it. */
const SAYS_P_IN_BRACKETS = /\bp[- ]?values?\b[^.]{0,30}\b(?:in |within )?(?:parenthes[ie]s|brackets)|\br\s?\(\s?p\s?\)/i;
/** A correlation with its p in brackets: "0.45 (<.001)", ".38** (.003)". */
const VALUE_WITH_P = /^([-\u2212\u2013]?\d?\.\d+)([*\u2020\u2021]{0,3}) ?\( ?(<|>|=|\u2264|\u2265)? ?(0?\.\d+|1(?:\.0+)?)\)$/;

/** A value cell that holds a correlation and its p in brackets, or null. */
function valueWithPOf(written: string, place: Located): ValueCell | null {
  const match = VALUE_WITH_P.exec(written);
  if (match === null) return null;
  const p = parseReportedNumber(match[4]!);
  if (p === null) return null;
  const pStart = place.start + written.lastIndexOf(match[4]!);
  const comparator = (match[3] === '\u2264' ? '<=' : match[3] === '\u2265' ? '>=' : (match[3] ?? '=')) as ReportedP['comparator'];
  return {
    number: match[1]!,
    marks: match[2]!,
    start: place.start,
    end: place.end,
    marksStart: match[2] === '' ? place.end : place.start + match[1]!.length,
    p: { comparator, value: p, plural: false, start: pStart, end: pStart + match[4]!.length },
  };
}

interface MatrixRow {
  variable: number;
  name: string;
  rowIndex: number;
  values: ValueCell[];
}

/** The correlations of a table read as a correlation matrix, or null when the table is not one. */
export function readCorrelationMatrix(input: MatrixInput): ReportedResult[] | null {
  const { table } = input;
  const headerIndex = table.rows.slice(0, 3).findIndex((row) => numberedColumns(row) !== null);
  if (headerIndex < 0) return null;
  const columns = numberedColumns(table.rows[headerIndex]!)!;
  const said = [table.caption ?? '', input.notes.slice(0, 2000), ...table.rows[headerIndex]!].join(' ');
  if (!SAYS_CORRELATIONS.test(said)) return null;
  // Each correlation's p in brackets after it, as the note says ("p-values in parentheses", "r (p)").
  const pInBrackets = SAYS_P_IN_BRACKETS.test(said);
  const rows = matrixRows(input, headerIndex, pInBrackets);
  if (rows.length < 2) return null;
  const layout = bestLayout(rows, columns);
  if (layout === null) return null;
  const names = new Map(rows.map((row) => [row.variable, row.name]));
  const noteN = NOTE_N.exec(input.notes.slice(0, 2000)) ?? NOTE_N.exec(table.caption ?? '');
  const n = noteN ? Number(noteN[1]!.replace(/,/g, '')) : null;
  const legend = readMarkLegend(input.notes);
  const results: ReportedResult[] = [];
  for (const row of rows) {
    const cells = correlationCells(row, layout, columns);
    if (cells === null) continue;
    for (const { cell, column } of cells) {
      const value = readCell(cell.number).kind === 'number' ? readCell(cell.number) : null;
      if (value === null || value.kind !== 'number') continue;
      const other = names.get(column);
      results.push(correlationResult(input, row, other === undefined ? String(column) : other, cell, value.number, n, legend));
    }
  }
  return results.length >= MIN_CORRELATIONS ? results : null;
}

/** A caption or note that says the correlations are Spearman's rank correlations. */
const SAYS_SPEARMAN = /spearman|\brho\b|\u03c1|rank[- ]order correlation/i;
/** Correlations of another kind than Pearson's or Spearman's between two measures: their df are not N − 2. */
export const OTHER_CORRELATIONS = /partial|intra-?class|canonical|\bICC|semi-?partial|cross-?lagged|polychoric|tetrachoric|auto-?correlat/i;
/** Header roles of columns that are not variables of a correlation grid. */
const NOT_A_VARIABLE: ReadonlySet<string> = new Set(['descriptive', 'n', 'p', 'df', 'df1', 'df2', 'ss', 'ms', 'effect', 'statistic']);
/** Share of a grid's numbers that must be correlations (the rest: a diagonal of 1s, a stray mean). */
const MIN_CORRELATION_SHARE = 0.8;

/**
 * A table of correlations whose columns are named by the variables they
 * correlate with, not by a statistic ("BDQ Physical | BDQ Mental-health"
 * over rows "HDRS | .72** | .70**"), and matrices whose rows and columns are
 * named, several side by side ("STAI | – | 0.50 | 0.43 | Trait | – | 0.57"):
 * read when the caption says the table holds correlations (of no other kind)
 * and nearly every number in its body is one. Each cell is an r of its row's
 * variable with its column's, df N − 2 from the note's N, p from its marks.
 */
export function readCorrelationGrid(input: MatrixInput, headerCount: number): ReportedResult[] | null {
  const { table } = input;
  const caption = table.caption ?? '';
  if (!SAYS_CORRELATIONS.test(caption) || OTHER_CORRELATIONS.test(caption)) return null;
  const header = table.rows[headerCount - 1] ?? [];
  const noteN = NOTE_N.exec(input.notes.slice(0, 2000)) ?? NOTE_N.exec(table.caption ?? '');
  const n = noteN ? Number(noteN[1]!.replace(/,/g, '')) : null;
  const legend = readMarkLegend(input.notes);
  const segments: GridSegment[] = [];
  let numbers = 0;
  // Columns the header names as something else than a variable (M, SD, n, α, p) hold no correlations.
  const otherColumns = new Set(header.flatMap((name, column) => (column > 0 && NOT_A_VARIABLE.has(classifyHeader(name).role) ? [column] : [])));
  table.rows.forEach((row, rowIndex) => {
    if (rowIndex < headerCount) return;
    const whole = row.length === header.length;
    const kept = whole ? row.map((cell, column) => (otherColumns.has(column) ? '' : cell)) : row;
    const read = gridSegments(kept, input.located[rowIndex] ?? null, rowIndex);
    numbers += read.numbers;
    appendAll(segments, read.segments);
  });
  const correlations = segments.reduce((sum, segment) => sum + segment.cells.filter((cell) => cell !== 'diagonal' && isCorrelation(cell.cell)).length, 0);
  if (correlations < MIN_CORRELATIONS || correlations < MIN_CORRELATION_SHARE * numbers) return null;
  // Each block's variables in the order its rows name them (blocks: the segments at one place in their rows).
  const order = new Map<number, string[]>();
  for (const segment of segments) {
    const names = order.get(segment.block) ?? [];
    if (!names.includes(segment.label)) names.push(segment.label);
    order.set(segment.block, names);
  }
  // Which triangle holds the correlations, and which their p, where the notes say ("p values above the diagonal").
  const triangles = trianglesOf(`${caption} ${input.notes.slice(0, 2000)}`);
  const placed = segments.flatMap((segment) => {
    const names = order.get(segment.block)!;
    const diagonalAt = segment.cells.indexOf('diagonal');
    const values = segment.cells.filter((cell): cell is GridCell => cell !== 'diagonal');
    // Cells before the row's diagonal lie in the lower triangle, cells after it in the upper one.
    const triangleAt = (index: number): Triangle | null => (diagonalAt < 0 ? null : index < diagonalAt ? 'lower' : 'upper');
    return values.map((value, index) => ({ segment, value, triangle: triangleAt(index), column: columnName(segment, value, index, values.length, diagonalAt, names, header) }));
  });
  // Where a triangle holds p values, the cells with no known triangle cannot be told apart: the grid is not read.
  if (triangles.p !== null && placed.some((cell) => cell.triangle === null)) return null;
  const pOf = new Map<string, GridCell>();
  for (const cell of placed) if (triangles.p !== null && cell.triangle === triangles.p) pOf.set(`${cell.segment.block}|${cell.segment.label}|${cell.column}`, cell.value);
  const results: ReportedResult[] = [];
  for (const { segment, value, triangle, column } of placed) {
    if (triangles.p !== null && triangle === triangles.p) continue;
    if (triangles.r !== null && triangle !== null && triangle !== triangles.r) continue;
    if (!isCorrelation(value.cell)) continue;
    const result = correlationResult(input, { variable: 0, name: segment.label, rowIndex: segment.rowIndex, values: [] }, column, value.cell, value.value, n, legend);
    // The p of r(i, j) stands at (j, i) in the other triangle.
    const p = pOf.get(`${segment.block}|${column}|${segment.label}`);
    results.push(p === undefined ? result : { ...result, p: { comparator: '=', value: p.value, plural: false, start: p.cell.start, end: p.cell.start + p.cell.number.length } });
  }
  return results;
}

type Triangle = 'upper' | 'lower';

/**
 * Statements of what stands above or below the diagonal, clause by clause:
 * "correlations below the diagonal, p values above it", "above the diagonal
 * are p values". A clause that names p values gives the p triangle; one that
 * names correlations, the r triangle. (Simple patterns per clause keep the
 * matching linear.)
 */
const SIDE_OF_DIAGONAL = /\b(above|below|upper|lower)\s(?:the\s|its\s)?(?:main\s)?(?:diagonal|triangle)\b/i;
const NAMES_P = /\bp[- ]?values?\b|\bprobabilit(?:y|ies)\b|\bsignificance levels?\b/i;
const NAMES_R = /\bcorrelations?\b|\bcoefficients?\b|\br\b|\bpearson|\bspearman/i;

function trianglesOf(text: string): { r: Triangle | null; p: Triangle | null } {
  let r: Triangle | null = null;
  let p: Triangle | null = null;
  for (const clause of text.split(/[.;,]/)) {
    const side = SIDE_OF_DIAGONAL.exec(clause);
    if (side === null) continue;
    const triangle: Triangle = /^(?:above|upper)$/i.test(side[1]!) ? 'upper' : 'lower';
    if (NAMES_P.test(clause)) p ??= triangle;
    else if (NAMES_R.test(clause)) r ??= triangle;
  }
  return { r, p: p === r ? null : p };
}

interface GridCell {
  cell: ValueCell;
  value: ReportedNumber;
  /** Index of the cell in its row. */
  column: number;
}

/** A row's label and the cells after it up to the next label: one row of one block of a grid. */
interface GridSegment {
  label: string;
  rowIndex: number;
  /** Which block of the row (0 for the first label's). */
  block: number;
  /** Whether the row keeps one cell per column (its cells stand under their header names). */
  whole: boolean;
  cells: (GridCell | 'diagonal')[];
}

/** A grid row cut at its labels ("STAI | – | 0.50 | Trait | – | 0.57"), with how many numbers it holds. */
function gridSegments(row: string[], at: (Located | null)[] | null, rowIndex: number): { segments: GridSegment[]; numbers: number } {
  const segments: GridSegment[] = [];
  if (at === null) return { segments, numbers: 0 };
  let numbers = 0;
  let current: GridSegment = { label: (row[0] ?? '').trim(), rowIndex, block: 0, whole: false, cells: [] };
  let previous: ValueCell | null = null;
  for (let column = 1; column < row.length; column++) {
    const written = (row[column] ?? '').trim().replace(/\s[a-h]$/, '');
    const place = at[column] ?? null;
    if (written === '' || place === null) continue;
    if (attachMarks(previous ?? undefined, written, place)) continue;
    previous = null;
    const cell = valueCellOf(written, place);
    const number = cell.number;
    if (DIAGONAL.test(number)) {
      current.cells.push('diagonal');
      continue;
    }
    const read = readCell(number);
    if (read.kind !== 'number') {
      // A value of another form ("0.32 (0.001)", "0.40 [0.21, 0.56]") is no correlation this reader can take
      // alone: it counts against the grid. Only a text cell starts the next block's row.
      if (shapeOf(number).shape !== 'text') {
        numbers++;
        continue;
      }
      segments.push(current);
      current = { label: written, rowIndex, block: current.block + 1, whole: false, cells: [] };
      continue;
    }
    numbers++;
    previous = cell;
    current.cells.push({ cell, value: read.number, column });
  }
  segments.push(current);
  const whole = segments.length === 1;
  return { segments: segments.filter((segment) => segment.label !== '').map((segment) => ({ ...segment, whole })), numbers };
}

/**
 * The variable a grid cell correlates its row's with: after a diagonal, the
 * variables after the row's own in its block (upper triangle); before one,
 * those before it (lower triangle); without a diagonal, the header's name
 * over the cell, when the row keeps one cell per column.
 */
function columnName(segment: GridSegment, value: GridCell, index: number, count: number, diagonalAt: number, names: string[], header: string[]): string {
  const own = names.indexOf(segment.label);
  if (diagonalAt === 0 && own >= 0) return names[own + 1 + index] ?? `column ${value.column}`;
  if (diagonalAt === count && own >= 0) return names[own - count + index] ?? `column ${value.column}`;
  const name = segment.whole ? (header[value.column] ?? '').trim() : '';
  return name === '' ? `column ${value.column}` : name;
}

/** The numbers of a matrix's columns: first to last, one apart. */
interface ColumnRange {
  first: number;
  last: number;
}

/**
 * The numbered columns that end the row (1, 2, ..., k; or k to m, when the first variables' columns are left
 * out: "4 5 6 7 8 9" over demographics correlated with the constructs 4 to 9), or null when the row does not
 * end in two or more numbers counting up one at a time.
 */
function numberedColumns(row: readonly string[]): ColumnRange | null {
  // A trailing pipe leaves an empty cell after the last number ("| 19 | 20 |").
  let end = row.length;
  while (end > 1 && row[end - 1]!.trim() === '') end--;
  // Columns lettered after the numbered ones ("… 12 13 a b c"), variables of a second kind, go on counting.
  let lettersFrom = end;
  while (lettersFrom > 1 && /^[a-z]$/.test(row[lettersFrom - 1]!.trim())) lettersFrom--;
  const letters = row.slice(lettersFrom, end).map((cell) => cell.trim());
  if (!letters.every((letter, index) => letter === String.fromCharCode(97 + index))) return null;
  let first = lettersFrom;
  while (first > 1 && COLUMN_NUMBER.test(row[first - 1]!.trim())) first--;
  const numbers = row.slice(first, lettersFrom).map((cell) => Number(COLUMN_NUMBER.exec(cell.trim())![1]));
  if (numbers.length < 2 || numbers[0]! < 1 || !numbers.every((number, index) => number === numbers[0]! + index)) return null;
  return { first: numbers[0]!, last: numbers[numbers.length - 1]! + letters.length };
}

/** The numbered body rows with their value cells (marks standing as cells of their own joined to their value). */
function matrixRows(input: MatrixInput, headerIndex: number, pInBrackets = false): MatrixRow[] {
  const rows: MatrixRow[] = [];
  input.table.rows.forEach((row, rowIndex) => {
    if (rowIndex <= headerIndex) return;
    // The variable's number and its name in one cell ("1. Anxiety") or in two ("1 | Anxiety").
    const numberApart = COLUMN_NUMBER.test((row[0] ?? '').trim()) && shapeOf((row[1] ?? '').trim()).shape === 'text';
    // (Or the number alone, its name given in the notes: "2 | 1 | 0.42*".)
    const label = ROW_NUMBER.exec(numberApart ? `${(row[0] ?? '').trim()} ${(row[1] ?? '').trim()}` : (row[0] ?? '').trim()) ?? NUMBER_ALONE.exec((row[0] ?? '').trim());
    const at = input.located[rowIndex];
    if (label === null || at === null || at === undefined) return;
    const values: ValueCell[] = [];
    for (let column = numberApart ? 2 : 1; column < row.length; column++) {
      const written = (row[column] ?? '').trim();
      const place = at[column] ?? null;
      if (written === '' || place === null) continue;
      const previous = values[values.length - 1];
      if (attachMarks(previous, written, place)) continue;
      values.push(pInBrackets ? (valueWithPOf(written, place) ?? valueCellOf(written, place)) : valueCellOf(written, place));
    }
    // Dashes filling the other triangle ("0.58** | – | – | –") stand for no value; a row is read from its end.
    while (values.length > 0 && PLACEHOLDER.test(values[values.length - 1]!.number) && values[values.length - 1]!.marks === '') values.pop();
    rows.push({ variable: Number(label[1]), name: (label[2] ?? '').trim(), rowIndex, values });
  });
  return rows;
}

/** A value cell as written, split into its number and the marks glued after it ("0.47***"). */
function valueCellOf(written: string, place: Located): ValueCell {
  const { number, marks } = splitMarks(written);
  return { number, marks, start: place.start, end: place.end, marksStart: marks === '' ? place.end : place.start + written.lastIndexOf(marks) };
}

/** A caret standing apart after a value ("0.12 ^"), a mark some tables use for p < .10 besides stars. */
const CARET_MARK = /^\^{1,2}$/;

/** Marks standing as a cell of their own ("0.47 | ***" crushed to "0.47 ***") joined to the value before them; true when joined. */
function attachMarks(previous: ValueCell | undefined, written: string, place: Located): boolean {
  if (previous === undefined || previous.marks !== '' || !(MARK.test(written) || CARET_MARK.test(written))) return false;
  previous.marks = written;
  previous.marksStart = place.start;
  previous.end = place.end;
  return true;
}

/** Whether the variable has a column of its own, where its diagonal cell stands. */
function hasColumn(variable: number, columns: ColumnRange): boolean {
  return variable >= columns.first && variable <= columns.last;
}

/** Cells a row of `variable` holds under the layout, counted from its end. */
function expectedCells(variable: number, layout: Layout, columns: ColumnRange): number {
  const others =
    layout.triangle === 'lower'
      ? Math.min(variable - 1, columns.last) - columns.first + 1
      : columns.last - Math.max(variable + 1, columns.first) + 1;
  return Math.max(0, others) + (layout.diagonal && hasColumn(variable, columns) ? 1 : 0);
}

function isCorrelation(cell: ValueCell): boolean {
  const read = readCell(cell.number);
  // (A printed 1.00 or 1.000 is the diagonal, a variable with itself: two measures of a matrix never correlate
  // perfectly. Counted as a correlation, it let a layout without a diagonal fit as well as the one with it.)
  return read.kind === 'number' && read.comparator === '=' && Math.abs(read.number.value) < 1 && read.number.decimals >= 1;
}

/** The row's correlation cells with the column each stands in, or null when the row does not fit the layout. */
function correlationCells(row: MatrixRow, layout: Layout, columns: ColumnRange): { cell: ValueCell; column: number }[] | null {
  const count = expectedCells(row.variable, layout, columns);
  if (count === 0 || row.values.length < count) return count === 0 ? [] : null;
  const taken = row.values.slice(row.values.length - count);
  const cells: { cell: ValueCell; column: number }[] = [];
  const diagonal = layout.diagonal && hasColumn(row.variable, columns);
  // The column of the row's first cell: the first column (lower triangle), or the variable's own (upper).
  const firstColumn = layout.triangle === 'lower' ? columns.first : Math.max(row.variable + (diagonal ? 0 : 1), columns.first);
  for (let index = 0; index < taken.length; index++) {
    const cell = taken[index]!;
    const diagonalAt = layout.triangle === 'lower' ? taken.length - 1 : 0;
    if (diagonal && index === diagonalAt) {
      if (!DIAGONAL.test(cell.number)) return null;
      continue;
    }
    if (!isCorrelation(cell)) return null;
    cells.push({ cell, column: firstColumn + index });
  }
  return cells;
}

/** The layout most numbered rows fit, or null when none fits enough of them. */
function bestLayout(rows: MatrixRow[], columns: ColumnRange): Layout | null {
  let best: { layout: Layout; fitting: number; correlations: number } | null = null;
  for (const layout of LAYOUTS) {
    let fitting = 0;
    let correlations = 0;
    for (const row of rows) {
      const cells = correlationCells(row, layout, columns);
      if (cells === null) continue;
      fitting++;
      correlations += cells.length;
    }
    if (best === null || fitting > best.fitting || (fitting === best.fitting && correlations > best.correlations)) best = { layout, fitting, correlations };
  }
  if (best === null || best.fitting < Math.max(2, MIN_FITTING_SHARE * rows.length) || best.correlations < MIN_CORRELATIONS) return null;
  return best.layout;
}

export function correlationResult(
  input: MatrixInput,
  row: MatrixRow,
  otherName: string,
  cell: ValueCell,
  value: ReportedNumber,
  n: number | null,
  legend: Map<string, MarkBound>,
): ReportedResult {
  const bound = cell.marks === '' ? undefined : legend.get(cell.marks);
  const p: ReportedP | null =
    cell.p ?? (bound === undefined ? null : { comparator: bound.comparator, value: bound.value, plural: false, start: cell.marksStart, end: cell.end, fromMarks: cell.marks });
  const df: ReportedNumber[] = n !== null && n > 2 ? [{ value: n - 2, text: String(n - 2), decimals: 0, exponent: 0 }] : [];
  const spearman = SAYS_SPEARMAN.test(`${input.table.caption ?? ''} ${input.notes.slice(0, 2000)}`);
  return {
    kind: 'r',
    ...(spearman ? { symbol: 'rs' as const } : {}),
    text: input.text.slice(cell.start, cell.end),
    start: cell.start,
    end: cell.end,
    df,
    ...(df.length > 0 ? { dfFrom: 'sample-size' as const } : {}),
    sampleSize: n !== null && df.length > 0 ? { value: n, text: String(n), decimals: 0, exponent: 0 } : null,
    value,
    valueComparator: '=',
    p,
    notSignificant: false,
    effects: [],
    tableRow: {
      tableIndex: input.tableIndex,
      caption: input.table.caption,
      rowLabel: `${row.name} \u00d7 ${otherName}`,
      cells: { statistic: { ...value, start: cell.numberStart ?? cell.start, end: (cell.numberStart ?? cell.start) + cell.number.length } },
      errorRow: null,
    },
  };
}
