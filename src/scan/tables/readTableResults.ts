/**
 * Turns the rows of ANOVA summary tables (and of tables of t tests,
 * correlations and chi-square tests) into reported results.
 *
 * A table counts when its header names a test statistic column (F, t, χ2, r,
 * z) and the degrees of freedom can be found: in a df column (with the error
 * row's df as the F's second df), in separate numerator/denominator df
 * columns, in the statistic's header ("F(1, 170)"), in the row label
 * ("effect on recall, F(1, 170)") or in a note under the table ("df = 1, 170
 * for all effects"). Tables of descriptive statistics (M, SD, n) have no
 * statistic column and give nothing; neither do look-alikes without df (a
 * column "F" of female counts, a column "f" of frequencies).
 *
 * Rows that are not effects: error rows (Error, Residual(s), Within, Within
 * groups, Error (condition)) are read as the error term of the effects above
 * them; Total and Corrected total are skipped. An Intercept row is read
 * only when the table has a single error row: its test (grand mean = 0) is
 * printed and can be checked like any other, but in repeated-measures
 * output it is tested against an error term that the layout does not show,
 * so the nearest error row would often be wrong there.
 *
 * A row whose cell already holds a complete written result ("t(58) = 2.10,
 * p = .04") is left to the text scanner, which finds it there.
 */

import type { DocumentTable } from '../../documents/types.js';
import { normaliseText } from '../normalise.js';
import { scanText } from '../scan.js';
import { readNameAndValue } from '../effects.js';
import { readPValue } from '../pValue.js';
import { bareEffectName, effectNameKey, readNoteDf, statesNoDf, type NoteDf, type NoteDfException } from './noteDf.js';
import type {
  Comparator,
  EffectKind,
  ReportedInterval,
  ReportedP,
  ReportedEffect,
  ReportedNumber,
  ReportedResult,
  StatisticKind,
  TableColumn,
  TableRowOrigin,
} from '../types.js';
import { parseReportedNumber, roundingInterval } from '../../stats/reportedNumber.js';
import { pRangeOverDf } from '../../stats/pOverDf.js';
import { classifyHeader, withLostPSymbol, gluedFootnoteLetter, ERROR_LABEL, NAMES_TEST_COLUMN, TOTAL_LABEL, namesTwoStatistics, statisticOfTwo, twoStatisticsWithDf, decimalSeparatorOf, headerKey, isNumberCell, P_UNDER_VALUE, readCell, TABLE_TITLE, type ColumnRole, type DecimalSeparator } from './cells.js';
import { readCorrelationGrid, readCorrelationMatrix } from './matrix.js';
import { readWrittenCorrelations } from './writtenCorrelations.js';
import { marksOf, readMarkLegend, type MarkBound } from './marks.js';
import { familyOf, joinFamilies, placeHeaderCells, fit, type ShapeFamily, isValueRole, placeCells, placementIsClear, readsAsWrittenResult, shapeOf, STATISTIC_COMMA_P, STATISTIC_WITH_P, type CellShape } from './align.js';

type CellRecord = ReportedNumber & { start: number; end: number };
type Cells = Partial<Record<TableColumn, CellRecord>>;

/** A column's meaning within one test (one statistic column and the columns that go with it). */
type RoleKey = 'statistic' | 'ss' | 'df' | 'df1' | 'df2' | 'ms' | 'p' | 'n' | `effect:${EffectKind}`;

interface Segment {
  columns: Map<RoleKey, number>;
  /** The statistic's header says its cells hold their df in brackets. */
  dfInCell: boolean;
  /** The statistic's header says its cells hold their p in brackets ("r (P value)": "−0.06 (.60)"). */
  pInCell?: boolean;
  /** Title over the statistic column in a spanning header row ("Recall"), when the table tests several outcomes. */
  title: string | null;
  /** df printed in the statistic's header: "F(1, 170)", or in the title spanning the block ("Treatment (num. df = 1)"). */
  headerDf: ReportedNumber[];
  /** A numerator df from the block's spanning title, when the header gives only the denominator ("(num. df = 7)" over "D. df"). */
  titleDf1?: ReportedNumber;
  /** The kind of statistic of this segment's column (a table may test with several). */
  kind?: StatisticKind;
  /** The symbol its header names, when not the kind's own (Spearman's "ρ" for an r). */
  symbol?: 'rs';
  /**
   * The column right before the statistic when its header cell is empty and no test's column is there: it may
   * hold the statistic's df pair in brackets, "(1, 6) | 43.7 | 0.001" under " | F | P" (see dfPairCellBefore).
   */
  unheadedBefore?: number;
}

interface LocatedCell {
  start: number;
  end: number;
}

const STATISTIC_PRIORITY: StatisticKind[] = ['F', 't', 'chi2', 'r', 'z'];
const CELL_COLUMNS = new Set<string>(['ss', 'df', 'df1', 'df2', 'ms', 'statistic', 'p', 'partial-eta-squared', 'eta-squared', 'generalized-eta-squared', 'omega-squared', 'cohens-d', 'r']);

/**
 * The end of a row label that says the row holds means and SDs: "M SD", "M (SD)", "Mean (SD)", "Mean ± SD".
 * ("MSE", a mean square error, is not "M SE": a lone "m" needs a space or bracket before "sd" or "se".)
 */
const DESCRIPTIVE_ROW_LABEL = /(?:^|\s)(?:(?:m|mean|means)\s?(?:\(sd\)|\u00b1 ?sd|\(se\))|(?:m|mean|means)\s(?:sd|se)|(?:mean|means)(?:sd|se))$|(?:^|\s)(?:mean|means|sd)$/;

/** Whether a row's label names its cells means and SDs and then holds two of them ("… M SD 38.98 12.92"). */
function swallowedValues(label: string): boolean {
  return SUMMARY_THEN_VALUES.test(label);
}

const SUMMARY_THEN_VALUES = /(?:^|\s)(?:M|Mean|Means|mean|means)\s?(?:\(S[DE]\)|S[DE]|\u00b1\s?S[DE])\s[-\u2212]?\d{1,6}[.,]\d{1,4}\s[-\u2212]?\d{1,6}[.,]\d{1,4}(?:\s|$)/;

/** A variable's name, a comma, then its summary's words: "Age (y), mean (SD)", "BMI, M ± SD", "Score, means". */
const VARIABLE_THEN_SUMMARY = /^\p{L}[^,]{0,80}, ?(?:M|m|[Mm]eans?)(?: ?\(S[DE]\)| ?\u00b1 ?S[DE]| S[DE])?$/u;

/** A regression ANOVA's lack-of-fit row and the pure-error row it is tested against. */
const LACK_OF_FIT_LABEL = /^lack[- ]of[- ]fit(?![a-z])/;
const RESIDUAL_LABEL = /^residuals?(?![a-z])/;

/** The first error row after `index`, unless it is the residual (the lack of fit's own parent); null otherwise. */
function pureErrorBelow(rows: readonly VirtualRow[], errorRows: readonly boolean[], index: number): number | null {
  for (let below = index + 1; below < rows.length; below++) {
    if (!errorRows[below]) continue;
    return RESIDUAL_LABEL.test(headerKey(rows[below]!.cells[0] ?? '')) ? null : below;
  }
  return null;
}

const INTERCEPT_LABEL = /^(?:\(?intercept\)?|constant|grand mean)(?![a-z])/;

/** Reads every table's effect rows as results; tables may come from the document's markup and from findTextTables. */
export function readTableResults(text: string, tables: DocumentTable[]): ReportedResult[] {
  return readTables(text, tables).results;
}

/**
 * Every table's results, and the tables that look like results tables
 * (their header names a test statistic or a p column) whose statistics
 * could not all be tied to their df and p: an audit lists those, so that it
 * never looks cleaner than it is.
 */
export function readTables(text: string, tables: DocumentTable[]): { results: ReportedResult[]; unread: UnreadTable[]; completions: RowCompletion[] } {
  const results: ReportedResult[] = [];
  const unread: UnreadTable[] = [];
  const completions: RowCompletion[] = [];
  distinctTables(tables).forEach((table, index) => {
    const reading = readTable(text, table, index);
    for (const result of reading.results) results.push(result);
    if (reading.unread !== null) unread.push(reading.unread);
    for (const completion of reading.completions) completions.push(completion);
  });
  return { results: results.sort((a, b) => a.start - b.start), unread, completions };
}

/**
 * The tables in reading order, each once: the readers write a marked-up
 * table into the text as " | " rows, where findTextTables finds it again;
 * of overlapping tables the one listed first is kept.
 */
function distinctTables(tables: DocumentTable[]): DocumentTable[] {
  const kept: DocumentTable[] = [];
  for (const table of tables) {
    if (!kept.some((other) => table.start < other.end && other.start < table.end)) kept.push(table);
  }
  return kept.sort((a, b) => a.start - b.start);
}

/** A table that looks like a results table but whose statistics could not all be read, and why. */
export interface UnreadTable {
  /** 0-based index of the table in the document, in reading order; null for a titled block no reader recognised as a table. */
  tableIndex: number | null;
  caption: string | null;
  start: number;
  end: number;
  /** Rows that print a statistic (or, for a table of p-values only, a p). */
  rowsWithStatistic: number;
  /** Of those, rows read as results. */
  rowsRead: number;
  reason: UnreadReason;
}

export type UnreadReason =
  /** The header names p but no test statistic: nothing to recompute. */
  | 'no-statistic-column'
  /** The header mentions a test statistic or p in words the reader does not know. */
  | 'columns-not-recognised'
  /** A table title with statistics after it whose layout was not recognised as a table. */
  | 'layout-not-recognised'
  /** Statistics whose df are printed nowhere the table ties to them (df column, error row, header, label, note). */
  | 'no-df'
  /** Statistics read as printed, but without df anywhere the table ties to them: their p-values were not recomputed. */
  | 'read-without-df'
  /** Rows whose cells could not be put under the header's columns without guessing. */
  | 'cells-not-placed'
  /** A z column without p: it may hold standard scores, not tests. */
  | 'z-without-p';

/**
 * A header cell that names a test statistic or a p-value in some spelling,
 * known or not: a lone F, t, z, H, χ2, X2 or p, or the words chi, sig,
 * p-value, statistic (common practice: how results tables label columns).
 */
export function mentionsStatistic(cell: string): boolean {
  if (cell.length > 60) return false;
  const key = normaliseText(cell).text.toLowerCase();
  return /(?:^|[^a-z])(?:f|t|z|h|x2|chi2?|p|sig|p-?value|statistic|chi-?square[d]?)(?![a-z])/.test(key);
}

function unreadTable(table: DocumentTable, tableIndex: number, reason: UnreadReason, rowsWithStatistic: number, rowsRead: number): UnreadTable {
  return { tableIndex, caption: table.caption, start: table.start, end: table.end, rowsWithStatistic, rowsRead, reason };
}

interface TableReading {
  results: ReportedResult[];
  unread: UnreadTable | null;
  completions: RowCompletion[];
}

/**
 * A row whose cell holds a written result ("t(46) = 1.06") that the text
 * scanner reads, with what the row's other cells add to it: the p of the p
 * column, the effect sizes of effect columns ("| t(28) = −.63 | .54 | 0.24 |").
 */
export interface RowCompletion {
  /** Where the cell with the written result is. */
  start: number;
  end: number;
  /** df of the row's df columns, for a result written without them ("F = 14.27" under a df column). */
  df: ReportedNumber[];
  p: ReportedP | null;
  notSignificant: boolean;
  effects: ReportedEffect[];
  /** Another cell of the row prints a test statistic ("U = 349"): an r in the cell is that test's effect size. */
  besideOtherTest: boolean;
}

function readTable(text: string, original: DocumentTable, tableIndex: number): TableReading {
  const table = withHeaderOverValues(original);
  const parts = splitAtInnerHeaders(table) ?? splitByTwoStatistics(table);
  if (parts === null) return readTableRows(text, table, tableIndex);
  // A table whose header is printed again, renamed, partway down ("χ2 | p" over the categorical rows, then
  // "(x̄ ± s) | t | p" over the continuous ones): each part is read under its own header.
  const readings = parts.map((part) => readTableRows(text, part, tableIndex));
  const results = readings.flatMap((reading) => reading.results);
  const completions = readings.flatMap((reading) => reading.completions);
  const unreadParts = readings.flatMap((reading) => (reading.unread === null ? [] : [reading.unread]));
  const unread =
    unreadParts.length === 0
      ? null
      : unreadTable(
          table,
          tableIndex,
          unreadParts[0]!.reason,
          readings.reduce((sum, reading) => sum + (reading.unread?.rowsWithStatistic ?? 0), 0),
          readings.reduce((sum, reading) => sum + (reading.unread?.rowsRead ?? 0), 0),
        );
  return { results, unread, completions };
}

/**
 * A one-line header that names only the value columns, as a program prints a model's coefficients ("Estimate |
 * Std. Error | z value | Pr(>|z|)" over "LENGTH | -0.69301 | 0.04295 | -16.13351 | < 0.00001"): the rows' labels
 * stand under no name, and the header is moved one column right, over the values. Only when the header's first
 * name is a column of values (not a label column's name), every body row has one more filled cell than the
 * header and opens with a label, and the header names a test statistic or a p. The table as it is otherwise.
 */
function withHeaderOverValues(table: DocumentTable): DocumentTable {
  const rows = table.rows;
  if ((table.headerRows ?? 1) !== 1 || rows.length < 3) return table;
  const header = trimTrailingEmpty(rows[0]!);
  if (header.length < 2 || header.some((cell) => cell.trim() === '')) return table;
  const firstRole = classifyHeader(header[0]!).role;
  if (firstRole === 'label' || firstRole === 'unknown') return table;
  const roles = header.map((cell) => classifyHeader(cell).role);
  if (!roles.includes('statistic') && !roles.includes('p')) return table;
  const body = rows.slice(1).filter((row) => row.some((cell) => cell.trim() !== ''));
  const opensWithLabel = (row: string[]): boolean => row[0]!.trim() !== '' && !isNumberCell(row[0]!) && !shapeOf(row[0]!).shape.startsWith('number');
  const oneMore = (row: string[]): boolean => trimTrailingEmpty(row).length === header.length + 1 && row.slice(1, header.length + 1).every((cell) => cell.trim() !== '');
  if (body.length < 2 || !body.every((row) => opensWithLabel(row) && oneMore(row))) return table;
  return {
    ...table,
    rows: [['', ...rows[0]!], ...rows.slice(1)],
    ...(table.cells ? { cells: [[null, ...table.cells[0]!], ...table.cells.slice(1)] } : {}),
  };
}

/** Fewest rows a part of a table split at an inner header must hold. */
const MIN_PART_ROWS = 2;

/**
 * The parts of a table whose header is printed again partway down with other statistic names: a row after the
 * first rows of numbers that holds no number and names a statistic (or p) in the columns where the header above
 * names one, under another name. Null when there is no such row.
 */
function splitAtInnerHeaders(table: DocumentTable): DocumentTable[] | null {
  const rows = table.rows;
  const firstData = rows.findIndex((row) => row.slice(1).some((cell) => isNumberCell(cell)));
  if (firstData < 1) return null;
  const topKinds = statisticNames(rows.slice(0, firstData));
  if (topKinds.size === 0) return null;
  const cuts: number[] = [];
  for (let index = firstData + 1; index < rows.length; index++) {
    const row = rows[index]!;
    if (row.some((cell) => isNumberCell(cell) || shapeOf(cell).shape.startsWith('number'))) continue;
    const kinds = statisticNames([row]);
    if (kinds.size === 0 || [...kinds].every((kind) => topKinds.has(kind))) continue;
    if (!row.some((cell) => classifyHeader(cell).role === 'p')) continue;
    cuts.push(index);
  }
  if (cuts.length === 0) return null;
  const bounds = [0, ...cuts, rows.length];
  const parts: DocumentTable[] = [];
  for (let part = 0; part + 1 < bounds.length; part++) {
    const from = bounds[part]!;
    const to = bounds[part + 1]!;
    if (to - from < MIN_PART_ROWS) continue;
    parts.push({
      ...table,
      rows: rows.slice(from, to),
      headerRows: part === 0 ? table.headerRows : 1,
      ...(table.cells ? { cells: table.cells.slice(from, to) } : {}),
    });
  }
  return parts.length > 1 ? parts : null;
}

/**
 * A table comparing groups whose test column is named for two statistics ("Variable | Group A | Group B | t/χ2 |
 * P"): the rows whose cells hold means and SDs take the continuous variables' statistic (t, F or z), the rows
 * whose cells hold counts with percentages the chi-square (statisticOfTwo). Each kind of row is read as a table
 * of its own under the header with that statistic's symbol; rows of neither kind keep the two-statistic name,
 * under which only cells that write their symbol are read. Null when no header cell names two statistics.
 */
function splitByTwoStatistics(table: DocumentTable): DocumentTable[] | null {
  const rows = table.rows;
  const headerCount = table.headerRows ?? rows.findIndex((row) => row.slice(1).some((cell) => isNumberCell(cell)));
  if (headerCount < 1) return null;
  const named = rows.slice(0, headerCount).flatMap((row, at) => row.flatMap((cell, column) => (column > 0 && namesTwoStatistics(cell) ? [{ at, column, cell }] : [])));
  if (named.length !== 1) return null;
  const { at: headerRow, column, cell: name } = named[0]!;
  const kindOf = (row: string[]): string | null => {
    const role = statisticOfTwo(name, row.filter((_, index) => index !== column).join('  '));
    return role?.role === 'statistic' ? role.kind : null;
  };
  // A variable's row that prints only its test, its categories' counts in the rows under it ("Education, n (%)
  // |  |  | 5.91 (2) | .052" over "Primary | 10 (16.7) | ..."): told by those rows, up to the next test.
  const kindFromBelow = (at: number): string | null => {
    const below: string[][] = [];
    for (let next = at + 1; next < rows.length && below.length < MAX_CATEGORY_ROWS && (rows[next]![column] ?? '').trim() === ''; next++) below.push(rows[next]!);
    return below.length === 0 ? null : kindOf(below.flat());
  };
  const groups = new Map<string | null, number[]>();
  rows.slice(headerCount).forEach((row, offset) => {
    const kind = kindOf(row) ?? ((row[column] ?? '').trim() !== '' ? kindFromBelow(headerCount + offset) : null);
    groups.set(kind, [...(groups.get(kind) ?? []), headerCount + offset]);
  });
  if (![...groups.keys()].some((kind) => kind !== null)) return null;
  const symbol: Record<string, string> = { t: 't', F: 'F', z: 'z', chi2: 'χ2' };
  const dfSuffix = twoStatisticsWithDf(name) ? ' (df)' : '';
  return [...groups.entries()].map(([kind, indices]) => ({
    ...table,
    rows: [...rows.slice(0, headerCount).map((row, at) => (at === headerRow && kind !== null ? row.map((cell, index) => (index === column ? `${symbol[kind]!}${dfSuffix}` : cell)) : row)), ...indices.map((index) => rows[index]!)],
    headerRows: headerCount,
    ...(table.cells ? { cells: [...table.cells.slice(0, headerCount), ...indices.map((index) => table.cells![index]!)] } : {}),
  }));
}

/** Most rows of a variable's categories looked at under its row. */
const MAX_CATEGORY_ROWS = 12;

/** The kinds of statistic the rows' cells name as column names ("χ2", "t", "z"). */
function statisticNames(rows: string[][]): Set<string> {
  const kinds = new Set<string>();
  for (const row of rows) {
    for (const cell of row) {
      const role = classifyHeader(cell);
      if (role.role === 'statistic') kinds.add(role.kind);
    }
  }
  return kinds;
}

/** Cell shapes that hold a value with more beside it: a row with one is a row of the body, not of the header. */
const VALUE_SHAPES = new Set(['number-bracket', 'number-interval', 'statistic-p']);

function readTableRows(text: string, table: DocumentTable, tableIndex: number): TableReading {
  const nothing: TableReading = { results: [], unread: null, completions: [] };
  let rows = table.rows;
  // A correlation matrix: numbered variables against numbered columns (its header is numbers, so it is read apart).
  const matrix = readCorrelationMatrix({ text, table, tableIndex, located: table.cells ?? locateRows(text, table, 1), notes: [...table.notes, notesAfter(text, table.end)].join(' ') });
  if (matrix !== null) return { results: matrix, unread: null, completions: [] };
  // Cells that write each correlation with its symbol ("r = 0.586*"), the sample size in the group's header or the note.
  const written = readWrittenCorrelations({ text, table, tableIndex, located: table.cells ?? locateRows(text, table, 1), notes: [...table.notes, notesAfter(text, table.end)].join(' ') });
  if (written !== null) return { results: written, unread: null, completions: [] };
  // The header ends at the first row with a value: a number, or a number with its bracket ("−0.06 (.60)",
  // "4.21 (2, 57)", "0.04 (−0.45, 0.54)").
  // (A header name that reads as a bound, "p<.05" over a column of marks, is a name.)
  const isValue = (cell: string): boolean => (readCell(cell, 'either').kind === 'number' || VALUE_SHAPES.has(shapeOf(cell).shape)) && classifyHeader(cell).role === 'unknown';
  let headerCount = table.headerRows ?? rows.findIndex((row) => row.slice(1).some(isValue));
  // A section row right above the first data row ("Photosynthesis") belongs to the body, not the header.
  while (table.headerRows === undefined && headerCount > 1 && rows[headerCount - 1]!.slice(1).every((cell) => cell.trim() === '')) headerCount--;
  if (headerCount < 1 || headerCount >= rows.length) return nothing;
  let located = table.cells ?? locateRows(text, table, headerCount);
  const merged = withCorrectionInLabel(rows, located, headerCount);
  if (merged !== null) {
    rows = merged.rows;
    located = merged.located;
  }
  const dfSplit = splitDfHeaderOverPairs(rows, headerCount, located);
  if (dfSplit !== null) {
    rows = dfSplit.rows;
    located = dfSplit.located;
  }
  const unnamed = dfSplit === null ? withUnnamedColumns(rows, headerCount, located, table.layout) : null;
  if (unnamed !== null) {
    rows = unnamed.rows;
    located = unnamed.located;
  }
  const footnoteTests = footnoteTestsOf([...table.notes, ...noteLinesAfter(text, table.end)]);
  const baseSchema = readSchema(rows, headerCount, table.layout, [...table.notes, table.caption ?? '', notesAfter(text, table.end)].join(' '), footnoteTests);
  const families = columnFamilies(rows.slice(headerCount), baseSchema);
  const schema: Schema = families === undefined ? baseSchema : { ...baseSchema, families };
  const roles = schema.roles;
  const kind = STATISTIC_PRIORITY.find((candidate) => roles.some((role) => role.role === 'statistic' && role.kind === candidate));
  const bodyRows = rows.length - headerCount;
  let unplaced = 0;
  // Whether the row before was an error term's: a row named only by a correction after it is one too.
  let afterErrorTerm = false;
  const virtualRows = rows.slice(headerCount).flatMap((row, offset) => {
    const pieces = virtualRowsOf(row, located[headerCount + offset] ?? null, schema, afterErrorTerm);
    unplaced += pieces.unplaced;
    const lastLabel = pieces.rows[pieces.rows.length - 1]?.cells[0] ?? '';
    afterErrorTerm = ERROR_LABEL.test(headerKey(lastLabel)) || (afterErrorTerm && correctionOnly(lastLabel));
    return pieces.rows;
  });
  const completions: RowCompletion[] = [];
  const writtenRows = new Set<number>();
  virtualRows.forEach((row, index) => {
    const completion = completionOf(row.cells, row.at, schema);
    if (completion === undefined) return;
    writtenRows.add(index);
    if (completion !== null) completions.push(completion);
  });
  if (kind === undefined && roles.some((role) => role.role === 'result')) {
    // A "Test" column naming each row's test and a "Statistic" column holding its value ("t-test | 4.95, df = 4254.7").
    // (Crushed, a "Test" column's name may end each row's label: only where the header names that column. One cell
    // per line, the row's label cells are joined into one, the test's last; the label column's header names its
    // columns apart by " / ", "Factor / Test".)
    const namesTestColumn = (cell: string): boolean => NAMES_TEST_COLUMN.test(cell) || (table.layout === 'cell-per-line' && NAMES_TEST_COLUMN.test(cell.split(' / ').pop()!));
    const testEndsLabel = (table.layout === 'crushed' || table.layout === 'cell-per-line') && rows.slice(0, headerCount).some((row) => row.some(namesTestColumn));
    const perRow = readTestPerRow(text, table, tableIndex, rows.slice(headerCount), located.slice(headerCount), testEndsLabel);
    if (perRow.length > 0) return { results: perRow, unread: null, completions };
    // A "Statistic (df)" or "Value (df)" column whose test each row's section ("Chi-square test") or footnote
    // letter ("0.54 (80)a" over "a Independent-samples t test") names.
    const resultColumn = roles.findIndex((role) => role.role === 'result');
    const legend = testLegend([...table.notes, linesAfter(text, table.end)].join(' '));
    const bySection = readResultColumnPerRow(text, table, tableIndex, rows.slice(headerCount), located.slice(headerCount), resultColumn, legend);
    if (bySection.length > 0) {
      // Rows with a value and its df in some cell that were not read (their test unnamed, or the row shifted) are said.
      const withValue = rows.slice(headerCount).filter((row) => row.slice(1).some((cell) => VALUE_WITH_DF.test(cell) && parseReportedNumber(VALUE_WITH_DF.exec(cell)![1]!.replace(/\s/g, ''))?.decimals !== 0)).length;
      const rowsRead = new Set(bySection.map((result) => result.tableRow?.rowLabel)).size;
      return { results: bySection, unread: withValue > rowsRead ? unreadTable(table, tableIndex, 'cells-not-placed', withValue, rowsRead) : null, completions };
    }
  }
  if (kind === undefined) {
    // A table of correlations with its columns named by the variables correlated.
    const grid = readCorrelationGrid({ text, table, tableIndex, located, notes: [...table.notes, linesAfter(text, table.end)].join(' ') }, headerCount);
    if (grid !== null) return { results: grid, unread: null, completions };
    // A table of p-values alone (group comparisons with only a p column) is a results table plumbline cannot check.
    const pColumn = roles.findIndex((role) => role.role === 'p');
    const withP = pColumn < 1 ? 0 : virtualRows.filter((row, index) => !writtenRows.has(index) && readCell(row.cells[pColumn] ?? '', 'either').kind === 'number').length;
    if (withP > 0) return { results: [], unread: unreadTable(table, tableIndex, 'no-statistic-column', withP, 0), completions };
    // A header that mentions a test statistic in words the vocabulary does not know ("F- value", "Chi value (x2)").
    // (Rows whose statistic is written out in a cell, "χ2(1) = 0.80", were read by the text scanner and completed
    // from their row; numbers count only under a column whose name mentions the statistic, where the header
    // names one: a row of group means is no unread test.)
    const mentionedColumns = new Set(rows.slice(0, headerCount).flatMap((row) => row.flatMap((cell, column) => (column > 0 && mentionsStatistic(cell) ? [column] : []))));
    const withNumbers = virtualRows.filter(
      (row, index) => !writtenRows.has(index) && row.cells.some((cell, column) => column > 0 && (mentionedColumns.size === 0 || mentionedColumns.has(column)) && shapeOf(cell).shape.startsWith('number')),
    ).length;
    const mentions = rows.slice(0, headerCount).some((row) => row.some((cell) => mentionsStatistic(cell)));
    return mentions && withNumbers > 0 ? { results: [], unread: unreadTable(table, tableIndex, 'columns-not-recognised', withNumbers, 0), completions } : { ...nothing, completions };
  }
  // Every kind of statistic the header names is read, each with its own columns ("Levene's F | Sig. | t |
  // df | Sig. (2-tailed)"); an r beside another statistic is its effect size, not a test of its own.
  // (Unless the r has a p column of its own, one no other statistic's block takes: "t | p | r | p" under
  // criteria side by side.)
  const named = STATISTIC_PRIORITY.filter((candidate) => roles.some((role) => role.role === 'statistic' && role.kind === candidate));
  const othersP = new Set(named.filter((kind) => kind !== 'r').flatMap((kind) => buildSegments(roles, kind, schema.titles).flatMap((segment) => (segment.columns.has('p') ? [segment.columns.get('p')!] : []))));
  const rHasOwnP = buildSegments(roles, 'r', schema.titles).some((segment) => segment.columns.has('p') && !othersP.has(segment.columns.get('p')!));
  const kinds = named.filter((candidate, _, all) => candidate !== 'r' || rHasOwnP || !all.some((other) => other === 'F' || other === 't' || other === 'chi2'));
  // Significance marks the notes define ("*** p < .001") give a marked value its p bound (marks.ts).
  const legend = readMarkLegend([...table.notes, table.caption ?? '', linesAfter(text, table.end)].join(' '));
  // A column of z without p may hold standard scores, not tests; with marks defined for it, it holds tests.
  const segments = kinds.flatMap((segmentKind) =>
    buildSegments(roles, segmentKind, schema.titles)
      .filter((segment) => segmentKind !== 'z' || segment.columns.has('p') || marksInColumn(rows.slice(headerCount), segment.columns.get('statistic'), legend))
      .map((segment) => ({ ...segment, kind: segmentKind })),
  );
  if (segments.length === 0) return { results: [], unread: unreadTable(table, tableIndex, 'z-without-p', bodyRows, 0), completions };
  titleBlocks(segments, rows.slice(0, headerCount - 1));
  markUnheadedBefore(segments, rows[headerCount - 1] ?? []);

  // A header that states the error's df ("df (error = 57)", "df (error df = 57)") states it as a note would.
  const headerErrorDf = rows
    .slice(0, headerCount)
    .flat()
    .map((cell) => HEADER_ERROR_DF.exec(cell)?.[1])
    .filter((written): written is string => written !== undefined);
  const noteText = [...table.notes, table.caption ?? '', ...(new Set(headerErrorDf).size === 1 ? [`Error df = ${headerErrorDf[0]}.`] : [])].join(' ');
  // (A layout that keeps no notes with the table, one cell per line, leaves them as the lines right after it:
  // those that open as notes are read as the table's notes, "F(2, 96) for all effects" with them. On a line of
  // their own, so that a footnote's marker, "a df = 1.", still opens its statement.)
  const statedDf = readNoteDf(table.notes.length === 0 ? `${noteText}\n${notesAfter(text, table.end)}` : noteText);
  // No df in the caption or notes: the lines just above and below the table may state them (a caption the
  // layout did not tie to the table, a note without "Note.", a sentence under it).
  const noteDf = statesNoDf(statedDf) ? { ...readNoteDf(linesBeside(text, table.start, table.end), true), besideTable: true } : statedDf;
  // Levene's test beside an independent-samples t test ("Levene's Test for Equality of Variances | F | Sig. | t | df | ...").
  // (Or the lines right above the table: a copy may leave the block titles "Levene's Test for Equality of
  // Variances | t-test for Equality of Means" out of the table, over its header.)
  const mentionsLevene = /levene/i.test([noteText, ...rows.slice(0, headerCount).flat()].join(' ')) || /levene/i.test(text.slice(Math.max(0, table.start - 300), table.start + 300));
  // (A layout that keeps no notes with the table, one cell per line, leaves them as the lines right after it.)
  const noteN = readNoteSampleSize(noteText) ?? (table.notes.length === 0 ? readNoteSampleSize(notesAfter(text, table.end)) : null);
  const tableNoteDf = withNamedExceptions(noteDf, [...segments.map((segment) => segment.title ?? ''), ...virtualRows.map((row) => row.cells[0] ?? '')]);
  // A footnote's df ("a df = 1.") are the df of the statistics carrying its marker ("0.80a"), when some do and the
  // column's header does not; the other rows take none of the note's df.
  const statisticColumns = segments.flatMap((segment) => (segment.columns.has('statistic') ? [segment.columns.get('statistic')!] : []));
  const footnoteMark = tableNoteDf.mark;
  const carriesMark = (cell: string | undefined): boolean => footnoteMark !== undefined && cell !== undefined && endsWithMark(cell, footnoteMark);
  const markScoped =
    footnoteMark !== undefined &&
    !rows.slice(0, headerCount).some((row) => statisticColumns.some((column) => carriesMark(row[column]))) &&
    virtualRows.some((row) => statisticColumns.some((column) => carriesMark(row.cells[column])));
  // F columns whose df column lost its pairs' commas ("1.23" for "1, 23"), with no other df for their second number.
  const lostComma = new Set(
    segments.filter(
      (segment) =>
        (segment.kind ?? kind) === 'F' &&
        !segment.columns.has('df2') &&
        !segment.columns.has('df1') &&
        segment.headerDf.length === 0 &&
        tableNoteDf.pair.length === 0 &&
        lostCommaColumn(virtualRows.map((row) => row.cells), segment.columns.get('df')),
    ),
  );
  const separator = decimalSeparatorOf(virtualRows.map((row) => row.cells));
  const errorRows = virtualRows.map((row) => isErrorRow(row.cells, segments, separator));
  continueCorrectedErrorRows(virtualRows, errorRows, segments, separator);
  const nearestErrorRow = pairCorrections(virtualRows, errorRows, nearestErrorRows(errorRows));
  const results: ReportedResult[] = [];
  let rowsWithStatistic = 0;
  const rowOutcomes: { read: boolean; statisticLeft: boolean; hasStatistic: boolean; missingDf: boolean; readWithoutDf: boolean }[] = [];
  // A value without df is read only from a row placed one cell per column, with a p printed beside it that some df can give.
  const acceptWithoutDf = (result: ReportedResult, guessed: boolean | undefined): boolean => guessed !== true && tiedWithoutDf(result) && pReachableWithoutDf(result);

  // The intercept's test is read only where one error row serves every effect (a between-subjects
  // table): in repeated-measures output it is tested against an error term the layout does not show.
  const singleErrorTerm = errorRows.filter(Boolean).length === 1;
  // (A table of a model's coefficients, tested by z, t or a Wald chi-square with no error rows, tests its intercept
  // like any term: none of these statistics has an error term.)
  const coefficientTests = errorRows.every((isError) => !isError) && segments.length > 0 && segments.every((segment) => segment.kind === 'z' || segment.kind === 't' || segment.kind === 'chi2');
  // (Nor does a row that prints its own error df in a denominator df column, as R's MANOVA output does, "(Intercept)
  // 1 0.77685 438.65 1 126 < 2.2e-16": each row's test, the intercept's too, is complete in its row.)
  const printsOwnErrorDf = (row: string[]): boolean =>
    segments.length > 0 && segments.every((segment) => segment.columns.has('df2') && readCell(row[segment.columns.get('df2')!] ?? '', separator).kind === 'number');
  for (let index = 0; index < virtualRows.length; index++) {
    const { cells: row, at: cellsAt, partial, guessed, blockUnknown } = virtualRows[index]!;
    const labelKey = headerKey(row[0] ?? '');
    // A Total row of an ANOVA table prints no statistic; a row named "Total" that does is a measure's ("Total
    // biomass" shortened to "Total" under a section line).
    const totalRow = TOTAL_LABEL.test(labelKey) && !segments.some((segment) => readCell(row[segment.columns.get('statistic')!] ?? '', separator).kind === 'number');
    if (errorRows[index] || totalRow || (INTERCEPT_LABEL.test(labelKey) && !singleErrorTerm && !coefficientTests && !printsOwnErrorDf(row))) continue;
    // A row its label calls means and SDs ("Self-paced control M SD 38.98 12.92 ...") holds descriptives, not
    // tests; when it also shows a test's marks (stars, "n.s.", "η2 = .59") they are counted as not read.
    // (A variable's name, a comma, then how it is summarised, "Age (y), mean (SD)", "BMI, M ± SD", names the
    // row of a table comparing groups: its test stands in the test's columns.)
    if (DESCRIPTIVE_ROW_LABEL.test(labelKey) && !VARIABLE_THEN_SUMMARY.test((row[0] ?? '').trim())) {
      if (row.slice(1).some((cell) => /\*|n\.s\.|=/.test(cell))) rowsWithStatistic++;
      continue;
    }
    if (row.some((cell) => readsAsWrittenResult(cell))) continue;
    // A label that took in a row's values ("Self-paced control M SD 38.98 12.92", when a header cut short by a
    // wrapped line left too few names over the values): the columns under the names are not the values' own.
    if (swallowedValues(row[0] ?? '')) {
      rowsWithStatistic++;
      continue;
    }
    // (A row with no label whose statistic cell holds a p, "p < .001" or "(.006)", prints the p of the row above
    // under its value: not a statistic of its own.)
    const pUnderValue = (row[0] ?? '').trim() === '' && segments.some((segment) => P_UNDER_VALUE.test(row[segment.columns.get('statistic')!] ?? ''));
    const hasStatistic = !pUnderValue && segments.some((segment) => shapeOf(row[segment.columns.get('statistic')!] ?? '').shape.startsWith('number'));
    if (hasStatistic) rowsWithStatistic++;
    // A lack-of-fit test is against pure error, not the residual (common practice in regression ANOVA tables):
    // the error row below it (pure error), or none when that is the residual or there is none.
    const errorIndex = LACK_OF_FIT_LABEL.test(labelKey) ? pureErrorBelow(virtualRows, errorRows, index) : (nearestErrorRow[index] ?? null);
    const rowSpan = spanOfRow(row, cellsAt);
    if (rowSpan === null) continue;
    let read = false;
    let missingDf = false;
    // A row counts as read when every statistic it prints was read (a Levene's F without df beside a t that was read is not).
    let statisticLeft = false;
    const resultsBefore = results.length;
    let readWithoutDf = false;
    const leveneWithoutDf: { segment: Segment; result: ReportedResult | null }[] = [];
    for (const plainSegment of segments) {
      // A footnote letter on the row's statistic or p that the notes define as a test ("0.117a" over "(a) p for
      // t-test"): the row's test is that one, not the column's; one we do not check leaves the row unread.
      const testByFootnote = rowTestByFootnote(row, plainSegment, footnoteTests);
      if (testByFootnote === null) {
        if (shapeOf(row[plainSegment.columns.get('statistic')!] ?? '').shape.startsWith('number')) statisticLeft = true;
        continue;
      }
      // The p set on the line under this row's value, in a table with no p column: read as this row's p.
      const withPBelow = pUnderValueBelow(virtualRows, index, plainSegment);
      const segment = withPBelow?.segment ?? plainSegment;
      const result = readRow({
        text,
        table,
        tableIndex,
        kind: testByFootnote ?? segment.kind ?? kind,
        row: withPBelow?.row ?? row,
        cellsAt: withPBelow?.cellsAt ?? cellsAt,
        segment,
        multiple: segments.length > 1 && blockUnknown !== true,
        errorRow: errorIndex === null ? null : { row: virtualRows[errorIndex]!.cells, cellsAt: virtualRows[errorIndex]!.at },
        noteDf: markScoped && !carriesMark(row[segment.columns.get('statistic') ?? -1]) ? withoutNotePairs(tableNoteDf) : noteDfFor(tableNoteDf, [segment.title ?? '', row[0] ?? '']),
        lostCommaDf: lostComma.has(plainSegment),
        noteN,
        legend,
        rowSpan,
        separator,
      });
      // In a row placed by what its cells hold with cells left out, a statistic with nothing of its own beside
      // it (no p, "n.s.", effect size or df cell) may be any number of the row: a mean under an F column.
      const lone = result !== null && partial === true && !tiedToTest(result) && !result.tableRow?.cells.df && !result.tableRow?.cells.df1 && !result.tableRow?.cells.df2;
      const withoutDf = result !== null && lacksDf(result);
      if (withoutDf) missingDf = true;
      if (withoutDf && mentionsLevene && (segment.kind ?? kind) === 'F') leveneWithoutDf.push({ segment, result });
      // A value without df is a test only when the row ties it to one: a p, "n.s." or an effect size beside it.
      else if (result !== null && !lone && (!withoutDf || acceptWithoutDf(result, guessed))) {
        results.push(result);
        read = true;
        if (withoutDf) readWithoutDf = true;
      } else if (shapeOf(row[segment.columns.get('statistic')!] ?? '').shape.startsWith('number')) statisticLeft = true;
    }
    // Levene's test for two groups has df 1 and N − 2 (k − 1 and N − k; Levene 1960, from memory), the df of the
    // pooled t test printed in the same row.
    const pooledT = results.slice(resultsBefore).find((result) => result.kind === 't' && result.df.length === 1 && result.df[0]!.decimals === 0);
    for (const { segment, result: withoutDfResult } of leveneWithoutDf) {
      const levene =
        pooledT === undefined
          ? null
          : readRow({
              text,
              table,
              tableIndex,
              kind: 'F',
              row,
              cellsAt,
              segment,
              multiple: segments.length > 1,
              errorRow: null,
              noteDf: { pair: [{ value: 1, text: '1', decimals: 0, exponent: 0 }, stripOffsets(pooledT.df[0]!)], single: null, error: null },
              noteN,
              legend,
              rowSpan,
              separator,
            });
      if (levene !== null && !lacksDf(levene)) {
        results.splice(resultsBefore, 0, { ...levene, dfFrom: 'levene-two-groups' });
        continue;
      }
      if (withoutDfResult !== null && acceptWithoutDf(withoutDfResult, guessed)) {
        results.splice(resultsBefore, 0, withoutDfResult);
        readWithoutDf = true;
      } else statisticLeft = true;
    }
    rowOutcomes.push({ read, statisticLeft, hasStatistic, missingDf, readWithoutDf });
  }
  let rowsRead = 0;
  let rowsWithoutDf = 0;
  let rowsReadWithoutDf = 0;
  for (const outcome of rowOutcomes) {
    if (outcome.read && !outcome.statisticLeft) rowsRead++;
    else if (outcome.hasStatistic && outcome.missingDf) rowsWithoutDf++;
    if (outcome.readWithoutDf) rowsReadWithoutDf++;
  }
  // (Rows the layout reader could not rebuild are rows with a statistic not read.)
  const notRebuilt = table.rowsNotRebuilt ?? 0;
  rowsWithStatistic += notRebuilt;
  const missed = rowsWithStatistic - rowsRead + unplaced;
  if (missed <= 0 && rowsReadWithoutDf > 0) return { results, unread: unreadTable(table, tableIndex, 'read-without-df', rowsWithStatistic, rowsReadWithoutDf), completions };
  if (missed <= 0) return { results, unread: null, completions };
  const reason: UnreadReason = rowsWithoutDf >= unplaced && rowsWithoutDf > 0 ? 'no-df' : 'cells-not-placed';
  return { results, unread: unreadTable(table, tableIndex, reason, rowsWithStatistic + unplaced, rowsRead), completions };
}

/** A df column's name that states the error's df: "df (error = 57)", "df (error df: 57)", "df (residual = 57)". */
const HEADER_ERROR_DF = /^\s{0,3}d\.?f\.?\s{0,2}[([]\s{0,2}(?:error|residual|within)(?:\s{1,2}d\.?f\.?)?\s{0,2}[=:]\s{0,2}(\d{1,6})\s{0,2}[)\]]\s{0,3}$/i;

/** Names of tests in a table's cells, and the kind each is checked as. */
const TEST_NAMES: [RegExp, StatisticKind][] = [
  [/^(?:welch'?s? |student'?s? |independent[- ]samples? |paired[- ]samples? )?t[- ]?tests?$/i, 't'],
  [/^(?:pearson'?s? )?correlations?$|^pearson'?s? r$/i, 'r'],
  [/^(?:pearson'?s? )?(?:chi[- ]?squared?|χ2|χ²|x2)(?: tests?)?$/i, 'chi2'],
  [/^(?:one[- ]way |two[- ]way )?(?:anova|f[- ]?tests?)$/i, 'F'],
  [/^z[- ]?tests?$/i, 'z'],
];

function testKindOf(cell: string): StatisticKind | null {
  const text = cell.trim();
  if (text.length > 40) return null;
  return TEST_NAMES.find(([pattern]) => pattern.test(text))?.[1] ?? null;
}

/**
 * The kind of the test a row label's last word names ("Older cats less active correlation", "Female cats more
 * fearful t-test"), or null: one word only, so a label that merely speaks of a test in its words ("t-test
 * results for boys") names none.
 */
function testKindEnding(label: string): StatisticKind | null {
  const lastWord = /\s(\S{1,20})$/.exec(label.trim())?.[1];
  return lastWord === undefined ? null : testKindOf(lastWord);
}

/** "4.95, df = 4254.7" or "−0.43": a statistic, with its df when the cell gives them. */
const STATISTIC_CELL = /^ *((?:[-\u2212\u2013] *)?(?:\d+(?:\.\d+)?|\.\d+))(?: *[,;] *df *= *(\d+(?:\.\d+)?)(?: *, *(\d+(?:\.\d+)?))?)? *$/i;

/**
 * Tables that name each row's test in a cell ("t-test", "correlation") and
 * print its value in a "Statistic" column ("4.95, df = 4254.7"): the value
 * is the cell after the test's name; its df are in that cell, or, for a
 * correlation, follow from the row's n (n - 2); its p is the next cell that
 * can be one. Read from the cells' contents, since such rows are often
 * broken or shifted against the header.
 */
function readTestPerRow(text: string, table: DocumentTable, tableIndex: number, body: string[][], located: ((LocatedCell | null)[] | null)[], testEndsLabel: boolean): ReportedResult[] {
  const results: ReportedResult[] = [];
  body.forEach((row, index) => {
    const cellsAt = located[index] ?? null;
    const cellAt = row.findIndex((cell) => testKindOf(cell) !== null);
    // (A crushed copy gives the test's name to the end of the row's label, "Female cats more fearful t-test", under
    // a header naming a column of tests.)
    const testAt = cellAt >= 0 ? cellAt : testEndsLabel && testKindEnding(row[0] ?? '') !== null ? 0 : -1;
    if (testAt < 0 || cellsAt === null) return;
    const kind = testKindOf(row[testAt]!) ?? testKindEnding(row[testAt]!)!;
    const statisticText = row[testAt + 1] ?? '';
    const match = STATISTIC_CELL.exec(normaliseText(statisticText).text);
    const statisticAt = cellsAt[testAt + 1] ?? null;
    if (!match || statisticAt === null) return;
    const value = parseReportedNumber(match[1]!.replace(/\s/g, ''));
    if (value === null) return;
    const dfTexts = [match[2], match[3]].filter((written): written is string => written !== undefined);
    let df = dfTexts.map((written) => parseReportedNumber(written)!);
    let nCell: ReportedNumber | null = null;
    let pRead: ReportedP | null = null;
    let notSignificant = false;
    for (let column = testAt + 2; column < row.length && pRead === null && !notSignificant; column++) {
      const read = readCell(row[column] ?? '', '.');
      const at = cellsAt[column] ?? null;
      if (read.kind === 'ns') notSignificant = true;
      if (read.kind !== 'number' || at === null) continue;
      if (nCell === null && read.number.decimals === 0 && read.comparator === '=' && read.number.value >= 3 && pRead === null && read.number.value > 1) {
        nCell = read.number;
        continue;
      }
      if (read.number.value <= 1) pRead = { comparator: read.comparator, value: read.number, plural: false, start: at.start + read.start, end: at.start + read.end };
    }
    let dfFrom: 'sample-size' | undefined;
    if (df.length === 0 && kind === 'r' && nCell !== null) {
      df = [{ value: nCell.value - 2, text: String(nCell.value - 2), decimals: 0, exponent: 0 }];
      dfFrom = 'sample-size';
    }
    const needed = kind === 'F' ? 2 : kind === 'z' ? 0 : 1;
    if (df.length !== needed) return;
    const start = statisticAt.start + statisticText.indexOf(match[1]!.trim().slice(0, 1));
    results.push({
      ...rowResult({ text, table, tableIndex, row, kind, value, df, pRead, notSignificant, start, end: pRead?.end ?? statisticAt.end }),
      ...(dfFrom ? { dfFrom } : {}),
      sampleSize: kind === 'r' ? nCell : null,
    });
  });
  return results;
}

/** A result read from one cell of a row (its value, df and p found by the caller), with the row it stands in. */
function rowResult(read: {
  text: string;
  table: DocumentTable;
  tableIndex: number;
  row: string[];
  kind: StatisticKind;
  value: ReportedNumber;
  df: ReportedNumber[];
  pRead: ReportedP | null;
  notSignificant: boolean;
  start: number;
  end: number;
}): ReportedResult {
  const { text, table, tableIndex, row, start, end } = read;
  return {
    kind: read.kind,
    text: text.slice(start, end),
    start,
    end,
    df: read.df,
    sampleSize: null,
    value: read.value,
    valueComparator: '=',
    p: read.pRead,
    notSignificant: read.notSignificant,
    effects: [],
    tableRow: { tableIndex, caption: table.caption, rowLabel: (row[0] ?? '').trim(), cells: {}, errorRow: null },
  };
}

/** A section row's words that name the test of the rows under it: "Chi-square test", "t test", "ANOVA Test, (F test)". */
const SECTION_TEST_NAMES: [RegExp, StatisticKind][] = [
  [/(?:^|[^\p{L}])(?:(?:welch'?s?|student'?s?|independent[- ]samples?|paired[- ]samples?) )?t[- ]?tests?(?![\p{L}])/iu, 't'],
  [/(?:^|[^\p{L}])(?:pearson'?s? )?(?:chi[- ]?squared?|χ2|χ²|x2)(?: tests?)?(?![\p{L}\d])/iu, 'chi2'],
  [/(?:^|[^\p{L}])(?:anova|f[- ]?tests?)(?![\p{L}])/iu, 'F'],
];
/** Tests no kind of ours checks: a section or footnote naming one of them names no kind. */
const OTHER_TEST = /mann[- ]?whitney|wilcoxon|kruskal|fisher|friedman|welch'?s? anova|brown[- ]forsythe|mcnemar|median test|u[- ]test|log[- ]?rank|cochran/i;

/** The one kind of test a short text names, or null (none, several, or a test we do not check). */
function testNamedIn(words: string): StatisticKind | null {
  if (words.length > 60 || OTHER_TEST.test(words)) return null;
  const kinds = new Set(SECTION_TEST_NAMES.filter(([pattern]) => pattern.test(words)).map(([, kind]) => kind));
  return kinds.size === 1 ? [...kinds][0]! : null;
}

/**
 * Footnote letters a table's notes define as tests: "a Independent-samples t test. b Chi-square test." ->
 * a: t, b: chi2. A letter defined twice, or as a test we do not check, names none.
 */
function testLegend(notes: string): Map<string, StatisticKind | null> {
  const legend = new Map<string, StatisticKind | null>();
  for (const match of notes.matchAll(/(?:^|[\s.;,])([a-f])(?:\s?[.:)=]\s?|\s)([^.;]{3,60})/g)) {
    const letter = match[1]!;
    const kind = testNamedIn(match[2]!);
    if (kind === null && !OTHER_TEST.test(match[2]!)) continue;
    legend.set(letter, legend.has(letter) && legend.get(letter) !== kind ? null : kind);
  }
  return legend;
}

/**
 * The tests footnote lines define by their letter, each line opening with it ("a Wald chi-square tests.",
 * "1. b: independent t test", "1. (a) – p for t-test"): a letter defined twice, or as a test we do not check, names none. (Only lines
 * that open with the letter: a letter inside running prose, "a t test was run", defines nothing.)
 */
function footnoteTestsOf(lines: string[]): Map<string, StatisticKind | null> {
  const tests = new Map<string, StatisticKind | null>();
  for (const line of lines) {
    const match = /^(?:\d{1,2}\.\s{1,3})?(?:\(\s?([a-h])\)|([a-h]))(?:\s?[.:)=\u2013\u2014-]\s?|\s)([^.;]{3,60})/.exec(line.trim());
    if (match === null) continue;
    const letter = match[1] ?? match[2]!;
    const kind = testNamedIn(match[3]!);
    if (kind === null && !OTHER_TEST.test(match[3]!)) continue;
    tests.set(letter, tests.has(letter) && tests.get(letter) !== kind ? null : kind);
  }
  return tests;
}

/** The non-blank lines right after a table, up to the next table's title (at most MAX_LEGEND_LINES). */
function noteLinesAfter(text: string, end: number): string[] {
  const lines: string[] = [];
  for (const line of text.slice(end, end + 3000).split('\n')) {
    if (line.trim() === '') continue;
    if (TABLE_TITLE.test(line) || lines.length >= MAX_LEGEND_LINES) break;
    lines.push(line.trim());
  }
  return lines;
}

/**
 * A column of test statistics of no stated kind ("Test Statistics") whose name carries a footnote letter that
 * the notes define as one kind of test ("Test Statisticsa" over "a Wald chi-square tests."): a column of that
 * statistic. Null for any other header.
 */
function testNamedByFootnote(header: string, legend: Map<string, StatisticKind | null>): ColumnRole | null {
  if (classifyHeader(header).role !== 'result') return null;
  const letter = gluedFootnoteLetter(header);
  const kind = letter === null ? null : (legend.get(letter) ?? null);
  return kind === null ? null : { role: 'statistic', kind, df: [] };
}

/** A value with its df in brackets and perhaps a footnote letter: "0.17 (1)", "18.53 (2,1067)", "0.54 (80)a". */
const VALUE_WITH_DF = /^ *((?:[-\u2212\u2013] *)?(?:\d+(?:\.\d+)?|\.\d+)) ?[([] ?(\d{1,5}(?:\.\d{1,2})?)(?: ?[,;] ?(\d{1,6}(?:\.\d{1,2})?))? ?[)\]] ?([a-f])? *$/;

/**
 * Rows of a "Statistic (df)" column (or "Value (df)"), each value printed with its df, whose kind of test is
 * named row by row: by a footnote letter on the value or the row's label that the notes define as a test, or
 * by the nearest section row above that names one ("Chi-square test", "ANOVA Test, (F test)"). A row whose
 * test is named neither way, or as a test we do not check, is not read. Where a copy left a row short (its
 * label, the value and the p only, as web tables with spanning cells come out), the value is the cell after
 * the label.
 */
function readResultColumnPerRow(
  text: string,
  table: DocumentTable,
  tableIndex: number,
  body: string[][],
  located: ((LocatedCell | null)[] | null)[],
  resultColumn: number,
  legend: Map<string, StatisticKind | null>,
): ReportedResult[] {
  if (resultColumn < 1) return [];
  const results: ReportedResult[] = [];
  let sectionKind: StatisticKind | null = null;
  body.forEach((row, index) => {
    const cellsAt = located[index] ?? null;
    const filled = row.map((cell, column) => ({ cell: cell.trim(), column })).filter(({ cell }) => cell !== '');
    // A section row: its label alone (or its label and a dash).
    // (One that names no test, a variable's heading over its levels, leaves the test named before in force.)
    if (filled.length === 1 && filled[0]!.column === 0) {
      sectionKind = testNamedIn(filled[0]!.cell) ?? (OTHER_TEST.test(filled[0]!.cell) ? null : sectionKind);
      return;
    }
    if (cellsAt === null) return;
    const short = filled.length <= 3 && filled[0]?.column === 0 && filled[1] !== undefined && filled[1].column < resultColumn && VALUE_WITH_DF.test(filled[1].cell);
    const statisticColumn = short ? filled[1]!.column : resultColumn;
    const statisticText = row[statisticColumn] ?? '';
    const match = VALUE_WITH_DF.exec(normaliseText(statisticText).text);
    const statisticAt = cellsAt[statisticColumn] ?? null;
    if (match === null || statisticAt === null) return;
    // (A letter on the label only after a bracket, a percent sign or a digit: "Age, M (SD)a", not the last letter of a word.)
    const letter = match[4] ?? /[)\]%\d]([a-f])$/.exec((row[0] ?? '').trim())?.[1];
    // (Or the row's label is the test's name, "Chi-square test | 41.64 (4) | <.01", which names the test of the
    // rows after it too, as a section does.)
    const labelTest = testKindOf(row[0] ?? '');
    if (labelTest !== null) sectionKind = labelTest;
    const kind = letter !== undefined && legend.has(letter) ? legend.get(letter)! : sectionKind;
    if (kind === null) return;
    const value = parseReportedNumber(match[1]!.replace(/\s/g, ''));
    // A test's value has decimals and its df are whole numbers (a t's may have decimals): a count with its
    // percentage, "169 (49.4)", is a group's cell that a copy moved under the column.
    if (value === null || value.decimals === 0) return;
    const df = [match[2], match[3]].filter((written): written is string => written !== undefined).map((written) => parseReportedNumber(written)!);
    // (In a short row, a t's df must be whole too: "45.2 (10.1)" there is a mean and its SD.)
    if (df.length !== (kind === 'F' ? 2 : 1) || ((kind !== 't' || short) && df.some((number) => number.decimals > 0))) return;
    let pRead: ReportedP | null = null;
    let notSignificant = false;
    for (let column = statisticColumn + 1; column < row.length && pRead === null && !notSignificant; column++) {
      const read = readPCell(row[column] ?? '');
      const at = cellsAt[column] ?? null;
      if (read.kind === 'ns') notSignificant = true;
      if (read.kind === 'number' && at !== null && read.number.value <= 1) pRead = { comparator: read.comparator, value: read.number, plural: false, start: at.start + read.start, end: at.start + read.end };
      if ((row[column] ?? '').trim() !== '') break;
    }
    const start = statisticAt.start + statisticText.indexOf(match[1]!.trim().slice(0, 1));
    results.push(rowResult({ text, table, tableIndex, row, kind, value, df, pRead, notSignificant, start, end: pRead?.end ?? statisticAt.end }));
  });
  return results;
}

/**
 * A p column's cell: a p, or "n.s.", or a p followed by a second one in brackets (".74 (.99f)", the p of
 * another analysis a footnote explains): the first is the row's p.
 */
function readPCell(cell: string): ReturnType<typeof readCell> {
  const read = readCell(cell, '.');
  if (read.kind !== 'text') return read;
  const lead = /^(\s*(?:[<>=\u2264\u2265]\s?)?(?:0|1)?[.,]\d+[a-h]?)\s?[([][^()[\]]{1,12}[)\]]\s*$/.exec(cell);
  return lead ? readCell(lead[1]!, '.') : read;
}

/**
 * What a row's other cells (placed under the schema's columns) add to the written result in one of its cells:
 * the p column's p and the effect columns' sizes (a cell "d = 0.31" in a
 * column of unknown meaning counts too). undefined when no cell holds a
 * written result; null when one does but the row adds nothing.
 */
function completionOf(row: string[], cellsAt: (LocatedCell | null)[] | null, schema: Schema): RowCompletion | null | undefined {
  const written = row.findIndex((cell, column) => column > 0 && readsAsWrittenResult(cell));
  if (written < 0) return undefined;
  const at = cellsAt?.[written] ?? null;
  if (at === null) return null;
  let p: ReportedP | null = null;
  let notSignificant = false;
  const effects: ReportedEffect[] = [];
  const df: ReportedNumber[] = [];
  row.forEach((cell, column) => {
    if (column === written || column === 0) return;
    const role = schema.roles[column];
    const cellAt = cellsAt?.[column] ?? null;
    if (role === undefined || cellAt === null) return;
    if (role.role === 'df' || role.role === 'df1' || role.role === 'df2') {
      const pair = PAIR_CELL.exec(cell);
      const read = readCell(cell, '.');
      if (pair) df.push(parseReportedNumber(pair[1]!)!, parseReportedNumber(pair[2]!.replace(',', '.'))!);
      else if (read.kind === 'number' && read.comparator === '=') df.push(read.number);
      return;
    }
    if (role.role === 'p' && p === null && !notSignificant) {
      const read = readPCell(cell);
      if (read.kind === 'ns') notSignificant = true;
      else if (read.kind === 'number') {
        const start = cellAt.start + read.start;
        p = { comparator: read.comparator, value: read.number, plural: false, start, end: cellAt.start + read.end };
      }
      return;
    }
    if (role.role === 'effect') {
      const read = readCell(cell, '.');
      if (read.kind === 'number') effects.push({ kind: role.effect, comparator: read.comparator, value: read.number, interval: null, start: cellAt.start + read.start, end: cellAt.start + read.end });
      return;
    }
    // A cell of its own holding the p ("P = 0.064" after "χ2(2) = 5.496").
    if (p === null && !notSignificant && column > written) {
      const normalised = normaliseText(cell);
      const start = skipLeadingSpace(normalised.text);
      const read = readPValue(normalised.text, start);
      if (read !== null && read.end >= normalised.text.trimEnd().length - 1) {
        p = { ...read, start: cellAt.start + normalised.toOriginal(read.start), end: cellAt.start + normalised.toOriginalEnd(read.end) };
        return;
      }
    }
    if (role.role === 'unknown' || role.role === 'descriptive' || role.role === 'result') {
      // "d = 0.31" in a column headed "Eff. size".
      const normalised = normaliseText(cell);
      const named = readNameAndValue(normalised.text, skipLeadingSpace(normalised.text));
      if (named !== null && named.kind !== null && named.end === normalised.text.trimEnd().length) {
        effects.push({
          kind: named.kind,
          comparator: named.comparator,
          value: named.value,
          interval: null,
          start: cellAt.start + normalised.toOriginal(named.start),
          end: cellAt.start + normalised.toOriginalEnd(named.end),
        });
      }
    }
  });
  if (p === null && !notSignificant && effects.length === 0 && df.length === 0) return null;
  // (The label cell counts: a row cut into pieces at its text cells starts a piece with "U = 349c".)
  const besideOtherTest = row.some((cell, column) => column !== written && OTHER_TEST_CELL.test(cell));
  return { start: at.start, end: at.end, df, p, notSignificant, effects, besideOtherTest };
}

/** A cell printing a test statistic by its symbol: "U = 349", "Z = −2.1", "W = 12", "H = 3.2", "t = 2.1". */
const OTHER_TEST_CELL = /(?:^|[\s(])(?:U|W|H|Z|z|T|t|F|\u03c72|X2)\s{0,2}=\s{0,2}[-\u2212]?\d/;

function skipLeadingSpace(text: string): number {
  return text.length - text.trimStart().length;
}

/** The meaning of each column of a table, and the titles spanning headers put over them. */
interface Schema {
  /** Column roles; column 0 holds the row labels. */
  roles: ColumnRole[];
  /** Text of the header row above the bottom one, per column, for side-by-side blocks. */
  titles: (string | null)[];
  /** True when the body rows' cells stand where the header's columns are (markup, pipes, wide gaps). */
  positional: boolean;
  /** Columns some header row names (a column without any header text takes no cell that needs placing). */
  named: boolean[];
  /** For crushed tables: the form each value column's cells take in the full rows (columnFamilies). */
  families?: (ShapeFamily | null)[];
  /** Columns whose header names an interval ("95% CI"), when any does. */
  intervals?: boolean[];
  /** Columns the header left without a name, given one by withUnnamedColumns: value columns wherever they stand. */
  unnamedColumns?: boolean[];
}

/** Body rows whose cells are not at the header's positions: rebuilt from crushed text. */
const UNPLACED_LAYOUTS = new Set(['crushed', 'cell-per-line']);

/**
 * Reads the header rows into column roles. The bottom header row names the
 * columns; rows above it hold titles of blocks, or names of columns whose
 * header cell spans the header rows. Each header row is laid over the body
 * at the shift that best fits its known names to the body's cells (a table
 * whose label column has no header, a spanning cell that pushes the names
 * after it to the left).
 */
function readSchema(rows: string[][], headerCount: number, layout: DocumentTable['layout'], notes = '', footnoteTests = new Map<string, StatisticKind | null>()): Schema {
  const positional = !UNPLACED_LAYOUTS.has(layout ?? '');
  const body = rows.slice(headerCount);
  const headerRows = rows.slice(0, headerCount).map(trimTrailingEmpty);
  const bodyWidth = typicalWidth(body);
  const width = positional ? Math.max(bodyWidth, ...headerRows.map((row) => row.length)) : Math.max(...headerRows.map((row) => row.length));
  // Where columns are, only the full rows say: a row under a cell spanning several rows lost that cell
  // in the copy, and its cells stand one or more places to the left.
  const fullRows = positional ? body.filter((row) => trimTrailingEmpty(row).length >= bodyWidth) : [];
  const bodyShapes = (fullRows.length >= 2 ? fullRows : body).map((row) => row.map(shapeOf));
  const roles: ColumnRole[] = new Array<ColumnRole>(width).fill({ role: 'unknown' });
  roles[0] = { role: 'label' };
  const assigned = new Array<boolean>(width).fill(false);
  const headerTexts: string[][] = headerRows.map(() => new Array<string>(width).fill(''));
  const levelRoles = headerRows.map((headerRow) =>
    withLostPSymbol(
      headerRow,
      headerRow.map((cell, column) => (column === 0 && !positional ? ({ role: 'label' } as ColumnRole) : cell.trim() === '' ? null : (testNamedByFootnote(cell, footnoteTests) ?? classifyHeader(cell)))),
    ),
  );
  // A column name in an upper header row whose cells fit it is a name spanning the rows below (a copy
  // keeps no row spans): the rows below name the columns under that row's titles, not that one.
  const claimedAbove: Set<number>[] = headerRows.map(() => new Set<number>());
  if (positional) {
    for (let level = 0; level < headerRows.length - 1; level++) {
      const placement = placeHeaderCells(levelRoles[level]!, bodyShapes, width, claimedAbove[level]!);
      const claimed = new Set(claimedAbove[level]);
      levelRoles[level]!.forEach((role, index) => {
        const column = placement[index]!;
        if (role && role.role !== 'unknown' && role.role !== 'label' && role.role !== 'result' && column > 0 && column < width && columnFit(role, bodyShapes, column) > 0) claimed.add(column);
      });
      claimedAbove[level + 1] = claimed;
    }
  }
  for (let level = headerRows.length - 1; level >= 0; level--) {
    const headerRow = headerRows[level]!;
    const headerRoles = levelRoles[level]!;
    const placement = positional ? placeHeaderCells(headerRoles, bodyShapes, width, claimedAbove[level]!) : headerRow.map((_, index) => index);
    headerRow.forEach((cell, index) => {
      let column = placement[index]!;
      if (column < 0 || column >= width) return;
      const role = headerRoles[index];
      // A name over a column whose cells cannot be of its kind, with an unnamed column after it that fits,
      // names that column: a column without a header before it pushed the names left ("| M (SD) | Cohen's d |"
      // over "| ... | t(28) = −.63, p = .54 | 0.24 |").
      if (positional && role && isValueRole(role) && role.role !== 'unknown' && index === headerRow.length - 1 && column + 1 < width) {
        if (columnFit(role, bodyShapes, column) < 0 && columnFit(role, bodyShapes, column + 1) > 0) column++;
      }
      headerTexts[level]![column] = cell.trim();
      if (role === null || role === undefined || role.role === 'unknown' || assigned[column]) return;
      if (column === 0 && role.role !== 'label') return;
      roles[column] = role;
      assigned[column] = true;
    });
  }
  // Columns before the first value column whose body cells are text hold the row label too.
  const titles = roles.map((_, column) => {
    for (let level = headerRows.length - 2; level >= 0; level--) {
      const title = spanningTitle(headerTexts[level]!, column);
      if (title !== null) return title;
    }
    return null;
  });
  // A statistic's df in a header row of their own above or below its name ("χ2" over "(df = 1)"): under its
  // column, or, where a copy shifted that row's cells (it lost the empty cell over the labels), the only such
  // cell of the header for the only statistic column without df.
  const withoutDf = roles.flatMap((role, column) => (role.role === 'statistic' && role.df.length === 0 && !role.dfInCell ? [column] : []));
  const dfCells = headerRows.flatMap((row) => row.map((cell) => cell.trim()).filter((cell) => DF_ALONE.test(cell) || DF_PAIR_ALONE.test(cell)));
  for (const column of withoutDf) {
    const role = roles[column] as Extract<ColumnRole, { role: 'statistic' }>;
    const needed = role.kind === 'F' ? 2 : 1;
    const own = headerTexts.map((texts) => dfAlone(texts[column] ?? '', needed)).find((df) => df !== null) ?? null;
    const only = withoutDf.length === 1 && dfCells.length === 1 ? dfAlone(dfCells[0]!, needed) : null;
    const df = own ?? only;
    if (df !== null) roles[column] = { ...role, df };
  }
  const named = roles.map((_, column) => headerTexts.some((texts) => texts[column] !== ''));
  // A column named by an abbreviation the notes define ("ES effect size (Cohen's d)", "PES = partial eta squared").
  if (notes !== '') {
    roles.forEach((role, column) => {
      if (column === 0 || (role.role !== 'unknown' && role.role !== 'result')) return;
      const own = [...headerTexts].reverse().find((texts) => texts[column] !== '')?.[column];
      const defined = own === undefined ? null : definedInNotes(own, notes);
      if (defined !== null) roles[column] = defined;
    });
  }
  if (!positional) {
    // In a header read from single-spaced words, two names for p in one block are one column named
    // twice ("p-Value Prob > F") or a column of words ("Significance"): only the first takes a cell.
    // Likewise a second p column before any further statistic column ("p-Value", "Prob > F", "Significance").
    // (Only right after the first: a p further on, past other columns, is the next block's: "p (d) 1-β r p 1-β n ... p (d)".)
    let pSeenAt = -1;
    for (let column = 1; column < roles.length; column++) {
      const role = roles[column]!;
      if (role.role === 'statistic') pSeenAt = -1;
      else if (role.role === 'p') {
        if (pSeenAt >= 0 && column === pSeenAt + 1) {
          roles[column] = { role: 'unknown' };
          named[column] = false;
          pSeenAt = column;
          continue;
        }
        pSeenAt = column;
      }
    }
  }
  // A column after the first whose cells hold written results ("Test" over "t(58) = 2.41", "χ2 = 2.40, df = 1") is a
  // column of results, whatever its name says: its cells are not part of the row's label.
  if (positional) {
    for (let column = 1; column < roles.length; column++) {
      if (roles[column]!.role !== 'label' && roles[column]!.role !== 'unknown') continue;
      const cells = body.map((row) => (row[column] ?? '').trim()).filter((cell) => cell !== '');
      if (cells.length > 0 && cells.filter((cell) => shapeOf(cell).shape === 'written').length * 2 > cells.length) roles[column] = { role: 'result' };
    }
  }
  // (A column of its own: "ηp2 [95% CI]" names an effect size printed with its interval in one cell.)
  if (positional) splitSpanningDf(roles, named, body);
  calculatedF(roles, headerTexts[headerTexts.length - 1] ?? []);
  const intervals = (headerRows[headerRows.length - 1] ?? []).map((cell) => INTERVAL_HEADER.test(cell) && classifyHeader(cell).role === 'descriptive');
  const unnamedColumns = (headerRows[headerRows.length - 1] ?? []).map((cell) => cell === UNNAMED_COLUMN);
  return { roles, titles, positional, named, ...(intervals.some(Boolean) ? { intervals } : {}), ...(unnamedColumns.some(Boolean) ? { unnamedColumns } : {}) };
}

/** The name given to the second of two df columns under one "df" header (see splitDfHeaderOverPairs). */
const DF2_NAME = 'df2';

/**
 * A "df" header over both df of an F, where a copy (crushed, one cell per line, tabs without the empty
 * header cell) gives each row one value more than the header names ("Effect df F p" over "Group 2 57 4.21
 * .020"): the header with "df" named "df1" and a "df2" after it, when every row with the extra value holds
 * two whole numbers there, the second at least the first; null otherwise. Rows one value short of that (an
 * error row) are left as they are. A crushed cell that joined a value and "n.s." ("4.21 n.s.") is cut back
 * in two first where the header names a p column for the "n.s.".
 */
function splitDfHeaderOverPairs(
  rows: string[][],
  headerCount: number,
  located: ((LocatedCell | null)[] | null)[],
): { rows: string[][]; located: ((LocatedCell | null)[] | null)[] } | null {
  const header = rows[headerCount - 1]!;
  const roles = header.map((cell) => classifyHeader(cell));
  const dfColumns = roles.flatMap((role, column) => (role.role === 'df' ? [column] : []));
  if (dfColumns.length !== 1 || roles.some((role) => role.role === 'df1' || role.role === 'df2')) return null;
  if (!roles.some((role) => role.role === 'statistic' && role.kind === 'F' && role.df.length === 0 && role.dfInCell !== true)) return null;
  const column = dfColumns[0]!;
  const pNamed = roles.some((role) => role.role === 'p');
  const cut = rows.map((row, index) => (index < headerCount || !pNamed ? { cells: row, at: located[index] ?? null } : cutNotSignificant(row, located[index] ?? null)));
  const body = cut.slice(headerCount).filter(({ cells }) => cells.slice(1).some((cell) => readCell(cell, 'either').kind === 'number'));
  const wider = body.filter(({ cells }) => cells.length === header.length + 1);
  if (wider.length < 2 || wider.length * 2 < body.length || body.some(({ cells }) => cells.length > header.length + 1)) return null;
  const whole = (cell: string | undefined): number | null => (cell !== undefined && /^\d{1,6}$/.test(cell.trim()) ? Number(cell) : null);
  const pairs = wider.every(({ cells }) => {
    const [first, second] = [whole(cells[column]), whole(cells[column + 1])];
    return first !== null && second !== null && first >= 1 && second >= first;
  });
  if (!pairs) return null;
  const widened = [...header.slice(0, column), 'df1', DF2_NAME, ...header.slice(column + 1)];
  const headerAt = located[headerCount - 1];
  return {
    rows: cut.map(({ cells }, index) => (index === headerCount - 1 ? widened : cells)),
    located: cut.map(({ at }, index) => (index === headerCount - 1 && headerAt ? [...headerAt.slice(0, column + 1), null, ...headerAt.slice(column + 1)] : at)),
  };
}

/** The name given to a column the header leaves without one (see withUnnamedColumns). */
const UNNAMED_COLUMN = '(no name)';
/** How much better per full row one side of the header must fit its rows than the other to take unnamed columns. */
const UNNAMED_SIDE_MARGIN = 0.75;
/** Most columns a header may leave without a name and still be read. */
const MAX_UNNAMED_COLUMNS = 2;

/**
 * A header that names fewer columns than the rows hold, in a copy that keeps no positions (one cell per line,
 * crushed): "Source | df | F | p" over "Time 2 7.27 0.002** 0.206", whose last column (an effect size printed
 * as an image, or a header cell lost in the copy) has no name. The header with as many unnamed columns as the
 * full rows hold more, at its end or right after its label, whichever side lets every full row's cells fit the
 * named columns (and only one side does); null otherwise. Rows print one or two values more at most; a header
 * whose rows mostly hold as many values as it names is left alone.
 */
function withUnnamedColumns(
  rows: string[][],
  headerCount: number,
  located: ((LocatedCell | null)[] | null)[],
  layout: DocumentTable['layout'],
): { rows: string[][]; located: ((LocatedCell | null)[] | null)[] } | null {
  if (!UNPLACED_LAYOUTS.has(layout ?? '')) return null;
  const written = trimTrailingEmpty(rows[headerCount - 1]!);
  // Names of the label column after the first ("Oral production fluency | Source | df | F | p", a title over the
  // labels and the labels' own name) are one label column's: the rows print one label.
  let labelNames = 1;
  while (labelNames < written.length - 1 && classifyHeader(written[labelNames]!).role === 'label') labelNames++;
  const header = labelNames === 1 ? written : [written.slice(0, labelNames).join(' / '), ...written.slice(labelNames)];
  const roles = header.map((cell, column) => (column === 0 ? ({ role: 'label' } as ColumnRole) : classifyHeader(cell)));
  // Every named column must be known: an unknown name may itself be the column the rows fill.
  if (header.length < 3 || roles.slice(1).some((role) => role.role === 'unknown' || role.role === 'label' || role.role === 'result')) return null;
  if (!roles.some((role) => role.role === 'statistic')) return null;
  // Only where the header ties df to the statistic (a df column, or df in its name): a value the rows' extra columns
  // leave without df is too loose a reading ("Measure F p" over "Anxiety 12.1 3.2 4.21 .020").
  const dfTied = roles.some((role) => role.role === 'df' || role.role === 'df1' || role.role === 'df2' || (role.role === 'statistic' && (role.df.length > 0 || role.dfInCell === true)));
  if (!dfTied) return null;
  const body = rows.slice(headerCount).map(trimTrailingEmpty).filter((row) => row.slice(1).some((cell) => readCell(cell, 'either').kind === 'number'));
  const widths = body.map((row) => row.length);
  const widest = Math.max(0, ...widths);
  const extra = widest - header.length;
  if (extra < 1 || extra > MAX_UNNAMED_COLUMNS) return null;
  const full = body.filter((row) => row.length === widest);
  if (full.length < 2 || full.length * 2 < body.length) return null;
  const padding = new Array<string>(extra).fill(UNNAMED_COLUMN);
  const sides = [
    { names: [...header, ...padding], at: header.length },
    { names: [header[0]!, ...padding, ...header.slice(1)], at: 1 },
  ];
  // Each side's fit over the full rows: the rows whose every cell fits its named column, and their total fit. One
  // side must fit all full rows but one at most (a cell damaged in the copy, "0. 36"), and fit more of them, or as
  // many clearly better, than the other ("1 3.666 0.066" fits "df F p"; "3.666" under df fits only as a corrected df).
  const fits = sides.map(({ names }) => {
    const sideRoles = names.map((cell, column) => (column === 0 || cell === UNNAMED_COLUMN ? null : classifyHeader(cell)));
    let rows = 0;
    let total = 0;
    for (const row of full) {
      let rowTotal = 0;
      let fitsRow = true;
      for (let column = 1; column < row.length && fitsRow; column++) {
        const role = sideRoles[column];
        if (role === null || role === undefined) continue;
        const score = fit(role, shapeOf(row[column]!));
        if (score <= 0) fitsRow = false;
        rowTotal += score;
      }
      if (!fitsRow) continue;
      rows++;
      total += rowTotal;
    }
    return { rows, total };
  });
  const [end, start] = [fits[0]!, fits[1]!];
  const best = end.rows !== start.rows ? (end.rows > start.rows ? 0 : 1) : end.total >= start.total ? 0 : 1;
  const winner = fits[best]!;
  const other = fits[1 - best]!;
  if (winner.rows < Math.max(2, full.length - 1)) return null;
  if (winner.rows === other.rows && winner.total - other.total < UNNAMED_SIDE_MARGIN * winner.rows) return null;
  const { names, at } = sides[best]!;
  // (The header's located cells: the label names' first stands for the joined label, the others are dropped.)
  const headerAt = located[headerCount - 1];
  const joinedAt = headerAt ? [headerAt[0] ?? null, ...headerAt.slice(labelNames)] : null;
  return {
    rows: rows.map((row, index) => (index === headerCount - 1 ? names : row)),
    located: located.map((cells, index) => (index === headerCount - 1 && joinedAt ? [...joinedAt.slice(0, at), ...new Array<LocatedCell | null>(extra).fill(null), ...joinedAt.slice(at)] : cells)),
  };
}

/** "4.21 n.s." as two cells, "4.21" and "n.s.", with their places in the text where the cell's is known. */
function cutNotSignificant(row: string[], at: (LocatedCell | null)[] | null): { cells: string[]; at: (LocatedCell | null)[] | null } {
  const index = row.findIndex((cell, column) => column > 0 && NUMBER_THEN_NS.test(cell.trim()));
  if (index < 0) return { cells: row, at };
  const [, value = '', ns = ''] = NUMBER_THEN_NS.exec(row[index]!.trim())!;
  const span = at?.[index] ?? null;
  const pieces: (LocatedCell | null)[] = span === null ? [null, null] : [{ start: span.start, end: span.start + value.length }, { start: span.end - ns.length, end: span.end }];
  return {
    cells: [...row.slice(0, index), value, ns, ...row.slice(index + 1)],
    at: at === null ? null : [...at.slice(0, index), ...pieces, ...at.slice(index + 1)],
  };
}

const NUMBER_THEN_NS = /^([-\u2212]?(?:\d+(?:\.\d+)?|\.\d+)) (n\.s\.?|N\.S\.?|ns|NS)$/;

/**
 * A "df" header spanning two columns (a web page's colspan lost in the copy: "df |  | F" over "2 | 57 | 4.21"):
 * when the column after the df column has no name and holds whole numbers at least as large as the df column's in
 * every row, the two are the numerator and denominator df.
 */
function splitSpanningDf(roles: ColumnRole[], named: boolean[], body: string[][]): void {
  for (let column = 1; column + 1 < roles.length; column++) {
    if (roles[column]!.role !== 'df' || roles[column + 1]!.role !== 'unknown' || named[column + 1]) continue;
    const pairs = body.map((row) => [(row[column] ?? '').trim(), (row[column + 1] ?? '').trim()] as const).filter(([first, second]) => first !== '' || second !== '');
    const whole = (cell: string): number | null => (/^\d{1,6}$/.test(cell) ? Number(cell) : null);
    const fits = pairs.length >= 2 && pairs.every(([first, second]) => whole(first) !== null && whole(second) !== null && whole(second)! >= whole(first)!);
    if (!fits) continue;
    roles[column] = { role: 'df1' };
    roles[column + 1] = { role: 'df2' };
    named[column + 1] = true;
  }
}

/**
 * "Fc" (F calculado) is the F only beside "Pr>Fc", its p, as a Brazilian statistics program prints them ("FV | GL |
 * SQ | QM | Fc | Pr>Fc"): on its own "FC" is as often a fold change.
 */
function calculatedF(roles: ColumnRole[], headers: readonly string[]): void {
  if (!headers.some((header) => /^pr ?> ?fc$/.test(headerKey(header)))) return;
  headers.forEach((header, column) => {
    if (headerKey(header) === 'fc' && roles[column]?.role === 'unknown') roles[column] = { role: 'statistic', kind: 'F', df: [] };
  });
}

/** A header naming a column of intervals: "95% CI", "CI", "confidence interval", "[95% CI]". */
const INTERVAL_HEADER = /(?:^|[^A-Za-z])CI(?:$|[^A-Za-z])|confidence interval/i;

/**
 * A crushed copy joins a value and the interval printed in the next column
 * (".30 [.05, .52]" under "r | 95% CI"): where the header names an interval
 * column and the row is short of cells, each value with its interval is cut
 * back into two cells.
 */
function splitValueAndInterval(row: string[], cellsAt: (LocatedCell | null)[] | null, schema: Schema): { row: string[]; cellsAt: (LocatedCell | null)[] | null } {
  if (schema.positional || schema.intervals === undefined) return { row, cellsAt };
  let missing = schema.roles.length - row.length;
  if (missing <= 0) return { row, cellsAt };
  const cells: string[] = [];
  const at: (LocatedCell | null)[] = [];
  row.forEach((cell, index) => {
    const located = cellsAt?.[index] ?? null;
    const bracket = cell.search(/\s[([]/);
    if (index > 0 && missing > 0 && bracket > 0 && shapeOf(cell).shape === 'number-interval') {
      const value = cell.slice(0, bracket).trimEnd();
      const intervalAt = cell.indexOf(cell.slice(bracket).trimStart(), bracket);
      cells.push(value, cell.slice(intervalAt));
      at.push(located === null ? null : { start: located.start, end: located.start + value.length }, located === null ? null : { start: located.start + intervalAt, end: located.end });
      missing--;
      return;
    }
    cells.push(cell);
    at.push(located);
  });
  return { row: cells, cellsAt: cellsAt === null ? null : at };
}

/** A header cell that holds only df, named as df: "(df = 1)", "df = 2, 57", "(df 1)"; with two numbers in brackets for F, "(1, 52)". */
const DF_ALONE = /^\(? ?d\.?f\.? ?[=:]? ?(\d{1,5}(?:\.\d{1,2})?)(?: ?[,;/] ?(\d{1,5}(?:\.\d{1,2})?))? ?\)?$/i;
const DF_PAIR_ALONE = /^\( ?(\d{1,4}(?:\.\d{1,2})?) ?[,;] ?(\d{1,5}(?:\.\d{1,2})?) ?\)$/;

function dfAlone(cell: string, needed: number): ReportedNumber[] | null {
  const text = cell.trim();
  const match = DF_ALONE.exec(text) ?? (needed === 2 ? DF_PAIR_ALONE.exec(text) : null);
  if (match === null) return null;
  const df = [match[1], match[2]].filter((value): value is string => value !== undefined).map((value) => parseReportedNumber(value)!);
  return df.length === needed ? df : null;
}

/** Lines right after a table that are its notes ("Note.", "Abbreviations:", "1. Abbreviations: ...", "a ..."), at most a few. */
/** Lines looked at after a table for the legend of its marks, which may follow other notes. */
const MAX_LEGEND_LINES = 8;

/** The lines after a table up to the next table's title (at most MAX_LEGEND_LINES non-blank ones): where its legend stands. */
function linesAfter(text: string, end: number): string {
  return noteLinesAfter(text, end).join(' ');
}

/** Non-blank lines (at most this many each side) read for df beside a table whose caption and notes state none. */
const MAX_LINES_BESIDE = 3;

/**
 * The lines just above a table (back to its title line, if it has one the
 * layout did not tie to it) and just below it, up to MAX_LINES_BESIDE
 * non-blank lines each side, across at most two blank lines in a row, never
 * into another table's title.
 */
function linesBeside(text: string, start: number, end: number): string {
  const above: string[] = [];
  let blanks = 0;
  for (const line of text.slice(Math.max(0, start - 2000), start).split('\n').reverse().slice(1)) {
    if (line.trim() === '') {
      if (++blanks > 2) break;
      continue;
    }
    blanks = 0;
    above.unshift(line.trim());
    if (TABLE_TITLE.test(line) || above.length >= MAX_LINES_BESIDE) break;
  }
  const below: string[] = [];
  blanks = 0;
  for (const line of text.slice(end, end + 2000).split('\n').slice(1)) {
    if (line.trim() === '') {
      if (++blanks > 2) break;
      continue;
    }
    blanks = 0;
    if (TABLE_TITLE.test(line) || below.length >= MAX_LINES_BESIDE) break;
    below.push(line.trim());
  }
  return [...above, ...below].join(' ');
}

function notesAfter(text: string, end: number): string {
  const after = text.slice(end, end + 3000).split('\n');
  const notes: string[] = [];
  for (const line of after) {
    if (line.trim() === '') continue;
    if (!/^\s{0,8}(?:\d{1,2}\.\s+)?(?:Notes?\b|Abbreviations?\b|[a-h*\u2020\u2021]\s)/.test(line)) break;
    notes.push(line.trim());
    if (notes.length >= 4) break;
  }
  return notes.join(' ');
}

/**
 * The effect size an abbreviation in a header stands for, when the table's notes define it: "ES effect
 * size (Cohen's d)", "PES = partial eta squared", "ES: η2p". Only effect sizes are taken this way.
 */
function definedInNotes(header: string, notes: string): ColumnRole | null {
  const abbreviation = header.trim();
  if (abbreviation.length < 2 || abbreviation.length > 8 || !/^[A-Za-z][A-Za-z0-9.]*$/.test(abbreviation)) return null;
  const escaped = abbreviation.replace(/\./g, '\\.');
  const match = new RegExp(`(?:^|[\\s,;:(])${escaped}(?: ?[=:,] ?| )([^,;]{3,60})`).exec(notes);
  if (!match) return null;
  const definition = match[1]!;
  const bracketed = /\(([^()]{1,30})\)/.exec(definition)?.[1];
  const withoutBrackets = definition.replace(/\([^()]*\)/g, ' ').split(/\s+/).filter((word) => word !== '').join(' ');
  for (const candidate of [bracketed, withoutBrackets, definition.trim()]) {
    if (candidate === undefined) continue;
    const role = classifyHeader(candidate);
    if (role.role === 'effect') return role;
  }
  return null;
}

/** How well a column's body cells fit a role, on average (0 for a column of empty cells). */
function columnFit(role: ColumnRole, bodyShapes: CellShape[][], column: number): number {
  let total = 0;
  let counted = 0;
  for (const row of bodyShapes) {
    const shape = row[column];
    if (shape === undefined || shape.shape === 'empty') continue;
    total += Math.max(-3, fit(role, shape));
    counted++;
  }
  return counted === 0 ? 0 : total / counted;
}

/** The nearest non-empty header text at or left of `column` in a title row (a spanning cell keeps its text in its first column). */
function spanningTitle(texts: string[], column: number): string | null {
  for (let at = column; at >= 1; at--) if (texts[at] !== '') return texts[at]!;
  return null;
}

function trimTrailingEmpty(row: string[]): string[] {
  let end = row.length;
  while (end > 1 && row[end - 1]!.trim() === '') end--;
  return row.slice(0, end);
}

/**
 * The number of cells the full body rows have (trailing empty cells left
 * out): the widest row width that at least a fifth of the rows (and two)
 * share, else the most common one. Not simply the most common: rows under a
 * cell spanning several rows lose that cell in a copy ("MBI | − 0.48 | ..."
 * under "TICS-SSCS | HRV-Bfb | 9.34 (2, 98) | ..."), and may outnumber the
 * full rows; a lone wider row is two rows run together or a stray note.
 */
function typicalWidth(body: string[][]): number {
  const counts = new Map<number, number>();
  let rowsCounted = 0;
  for (const row of body) {
    const width = trimTrailingEmpty(row).length;
    if (width < 2) continue;
    counts.set(width, (counts.get(width) ?? 0) + 1);
    rowsCounted++;
  }
  const shared = Math.max(2, Math.ceil(rowsCounted / 5));
  let widest = 0;
  for (const [width, count] of counts) if (count >= shared && width > widest) widest = width;
  if (widest > 0) return widest;
  let best = 0;
  let bestCount = 0;
  for (const [width, count] of counts) if (count > bestCount || (count === bestCount && width > best)) [best, bestCount] = [width, count];
  return best;
}

/** The offset of the only filled cell when it is a whole number (a df), else -1. */
function loneWholeNumber(cells: { shape: CellShape }[]): number {
  const filled = cells.flatMap((cell, offset) => (cell.shape.shape === 'empty' || cell.shape.shape === 'mark' ? [] : [offset]));
  if (filled.length !== 1) return -1;
  const shape = cells[filled[0]!]!.shape;
  return shape.shape === 'number' && shape.decimals === 0 && shape.comparator === '=' && shape.value >= 1 ? filled[0]! : -1;
}

/** A body row as the interpreter reads it: column 0 the label, the other cells under the schema's columns. */
interface VirtualRow {
  cells: string[];
  at: (LocatedCell | null)[];
  /** Placed by what its cells hold, with cells left out and a statistic column left empty (see readTableRows: a lone statistic of such a row is not read). */
  partial?: boolean;
  /** Placed by the best guess among several placements (numbers given to the label or left out). */
  guessed?: boolean;
  /** Placed in one of several blocks named alike, which one the row does not say: its results name no block. */
  blockUnknown?: boolean;
}

/** A row with no label and a p alone ("p < .001", "(.006)") in one of its columns, placed as written; null for any other row. */
function pUnderValueOnly(written: string[], writtenAt: (LocatedCell | null)[] | null, width: number): VirtualRow | null {
  const filled = written.flatMap((cell, column) => (cell.trim() === '' ? [] : [column]));
  if (filled.length !== 1 || filled[0]! < 1 || filled[0]! >= width || !P_UNDER_VALUE.test(written[filled[0]!]!)) return null;
  const cells = Array.from({ length: width }, (_, column) => written[column] ?? '');
  const at = Array.from({ length: width }, (_, column) => writtenAt?.[column] ?? null);
  return { cells, at };
}

/**
 * The rows a body row stands for. A row is cut where a text cell follows
 * value cells ("Between groups | 6.77 | 4 | ... | Within groups | 22.64 |
 * 30 | ..." printed on one line); each piece's label is its text cells, and
 * its values are put under the columns by position when the layout keeps
 * positions and the piece sits where the header says, otherwise by fit
 * (align.ts).
 */
function virtualRowsOf(written: string[], writtenAt: (LocatedCell | null)[] | null, schema: Schema, afterErrorTerm = false): { rows: VirtualRow[]; unplaced: number } {
  // A row of nothing but a p in one value column ("(<.001)" under an F): kept where it stands, for the row above to
  // take as its p (pUnderValueBelow); read as text, a bracketed p would become a label.
  const pOnly = pUnderValueOnly(written, writtenAt, schema.roles.length);
  if (pOnly !== null) return { rows: [pOnly], unplaced: 0 };
  const split = splitValueAndInterval(written, writtenAt, schema);
  const cellsAt = split.cellsAt;
  let row = split.row;
  const width = schema.roles.length;
  // The empty cells a row's trailing pipe or tab leaves stand for nothing (in a rebuilt row they hold their columns' places).
  let length = row.length;
  while (schema.positional && length > 1 && row[length - 1]!.trim() === '') length--;
  row = row.slice(0, length);
  const shapes = row.map(shapeOf);
  const pieces: { first: number; valuesFrom: number; end: number }[] = [];
  let first = 0;
  let index = 0;
  // Where the layout keeps positions, every cell before the first value column is part of the label ("Chl c | — | N").
  const labelEnd = schema.positional ? schema.roles.findIndex((role, column) => column > 0 && isValueRole(role) && role.role !== 'unknown') : 1;
  while (index < row.length) {
    // Label cells: the first cell always (and the label columns' empty cells), then text cells.
    let valuesFrom = index === first ? index + 1 : index;
    while (valuesFrom < row.length && (shapes[valuesFrom]!.shape === 'text' || (index === 0 && valuesFrom < labelEnd && shapes[valuesFrom]!.shape === 'empty'))) valuesFrom++;
    let end = valuesFrom;
    while (end < row.length && shapes[end]!.shape !== 'text') end++;
    pieces.push({ first, valuesFrom, end });
    first = end;
    index = end;
  }
  // Columns that can take a value: known value columns, and named columns of unknown meaning after the first of those
  // (before it, an unknown header names part of the row label, "Out. rem.").
  const valueColumns = valueColumnsOf(schema);
  const out: VirtualRow[] = [];
  let unplaced = 0;
  for (const piece of pieces) {
    const cells = new Array<string>(width).fill('');
    const at = new Array<LocatedCell | null>(width).fill(null);
    const labelCells = row.slice(piece.first, piece.valuesFrom).map((cell) => cell.trim()).filter((cell) => cell !== '');
    cells[0] = labelCells.join(' ');
    const labelAt = cellsAt ? spanOfCells(cellsAt.slice(piece.first, piece.valuesFrom)) : null;
    at[0] = labelAt;
    const values = row.slice(piece.valuesFrom, piece.end);
    const positionsHold =
      schema.positional && pieces.length === 1 && piece.end <= width && values.every((_, offset) => isValueRole(schema.roles[piece.valuesFrom + offset] ?? { role: 'unknown' }));
    // A rebuilt row with exactly one cell (empty ones included) per column keeps its order one to one.
    // (So does a full one whose test's cells fit their columns, whatever the groups' columns hold: means ± SDs under a
    // lower header "n (%)" that names the cells of the categorical rows.)
    const oneToOne =
      !schema.positional &&
      values.length === valueColumns.length &&
      (values.some((cell) => cell.trim() === '') || fullRowInOrder(values.map((_, offset) => shapes[piece.valuesFrom + offset]!), valueColumns.map(({ role }) => role)));
    if (oneToOne) {
      values.forEach((cell, offset) => {
        const column = valueColumns[offset]!.column;
        cells[column] = cell;
        at[column] = cellsAt?.[piece.valuesFrom + offset] ?? null;
      });
    } else if (positionsHold) {
      values.forEach((cell, offset) => {
        cells[piece.valuesFrom + offset] = cell;
        at[piece.valuesFrom + offset] = cellsAt?.[piece.valuesFrom + offset] ?? null;
      });
    } else {
      const toPlace = values.map((cell, offset) => ({ text: cell, shape: shapes[piece.valuesFrom + offset]! }));
      // An error term's row prints no test: its numbers go under the SS, df and MS columns only ("Error(Time)
      // 143.20 46.98 3.05", where 3.05 could otherwise be an F).
      const errorTerm = ERROR_LABEL.test(headerKey(cells[0])) || (afterErrorTerm && correctionOnly(cells[0]));
      // A statistics program's row for unequal variances ("Equal variances not assumed") prints no Levene's test:
      // its numbers go under the t test's columns only (they would fit Levene's F and Sig. as well).
      const tColumn = UNEQUAL_VARIANCES_ROW.test(cells[0]) ? valueColumns.findIndex(({ role }) => role.role === 'statistic' && role.kind === 't') : -1;
      const rowColumns = errorTerm
        ? valueColumns.filter(({ role }) => role.role !== 'statistic' && role.role !== 'p' && role.role !== 'effect' && role.role !== 'result')
        : tColumn > 0
          ? valueColumns.slice(tColumn)
          : valueColumns;
      const valueRoles = rowColumns.map(({ role }) => role);
      // An error term's row that prints only its df ("Within groups 77" under SS, df, MS, F, p): a lone whole number
      // there is the df (sums of squares are printed with decimals; common practice).
      const loneDf = errorTerm ? loneWholeNumber(toPlace) : -1;
      const dfSlot = valueRoles.findIndex((role) => role.role === 'df' || role.role === 'df2');
      const placed = loneDf >= 0 && dfSlot >= 0 ? { columns: toPlace.map((_, offset) => (offset === loneDf ? dfSlot : -1)), absorbed: 0 } : placeCells(toPlace, valueRoles, schema.families);
      const hasNumbers = toPlace.some((cell) => cell.shape.shape.startsWith('number'));
      if (placed === null) {
        if (hasNumbers) unplaced++;
        continue;
      }
      // With cells left out, which cell is which must follow from what they hold, not from the tie-break.
      const filled = toPlace.filter((cell) => cell.shape.shape !== 'mark' && cell.shape.shape !== 'empty').length;
      // (A row without a statistic, an error term, keeps its leading columns: "Error 28" under df, F, p.)
      const keyColumns = valueRoles.flatMap((role, slot) => (['statistic', 'df', 'df1', 'df2', 'p'].includes(role.role) ? [slot] : []));
      const givesStatistic = placed.columns.some((slot, offset) => slot >= 0 && valueRoles[slot]!.role === 'statistic' && toPlace[offset]!.shape.shape !== 'empty');
      // Rows leave their trailing cells empty (an effect size printed only for significant rows): cells that
      // fill the first columns in order, each fitting its column, every statistic column among them, are clear.
      const slots = placed.columns.filter((slot) => slot >= 0);
      const prefix =
        placed.absorbed === 0 &&
        slots.every((slot, order) => slot === order) &&
        placed.columns.every((slot, offset) => slot < 0 || fit(valueRoles[slot]!, toPlace[offset]!.shape) > 0) &&
        valueRoles.every((role, slot) => role.role !== 'statistic' || slot < slots.length);
      const clarity = { blockUnknown: false };
      if (givesStatistic && filled < valueRoles.length && !prefix && !placementIsClear(toPlace, valueRoles, placed, keyColumns, schema.families, clarity)) {
        unplaced++;
        continue;
      }
      // Cells given back to the label, or a df with decimals, make the placement a guess: where the row has SS, df
      // and MS, the guess must keep MS = SS/df (rows of another table under this header do not: "Healthy 32 42.3
      // 15.4 13 19" or "Cortical 5 57.6 27.3 4 1" under SS, df, MS, F, p). Corrected df (2.18 after a sphericity
      // correction) keep it.
      if ((placed.absorbed > 0 || fractionalDf(toPlace, valueRoles, placed.columns)) && !keepsMeanSquare(toPlace, valueRoles, placed.columns)) {
        unplaced++;
        continue;
      }
      // A number of 1 or more with significance marks ("9.69**") is a test's value: left without a column, it says
      // the header names fewer tests than the row prints, and which value is which cannot be told. (A marked number
      // below 1 may be a group's mean or ratio marked as different from a reference: "0.64 *".)
      // Numbers given back to the label (three or more) among which a bound p stands ("<0.001") say the header
      // names fewer tests than the row prints (descriptives given back hold no such p): which is which cannot be told.
      const absorbed = toPlace.slice(0, placed.absorbed).filter((cell) => cell.shape.shape === 'number');
      // So does a header of statistic columns side by side with no p column ("F (1, 24) | F (2, 48) | F (2, 48)")
      // over rows that print more numbers: each statistic's p and effect size lost their names in the copy.
      // (Not statistics whose cells hold their p, "F(1, 66), p"; and only plain numbers given back, not "M (SD)" cells.)
      const unnamedBlocks =
        absorbed.length >= 2 &&
        !valueRoles.some((role) => role.role === 'p' || (role.role === 'statistic' && role.pInCell === true)) &&
        valueRoles.filter((role) => role.role === 'statistic').length >= 2;
      const testsAbsorbed = unnamedBlocks || (absorbed.length >= MAX_NUMBERS_ABSORBED && absorbed.some((cell) => cell.shape.shape === 'number' && cell.shape.comparator !== '='));
      if (testsAbsorbed || placed.columns.some((slot, offset) => slot < 0 && isMarkedStatistic(toPlace[offset]!.text))) {
        unplaced++;
        continue;
      }
      placed.columns.forEach((slot, offset) => {
        if (slot < 0) return;
        const column = rowColumns[slot]!.column;
        cells[column] = values[offset]!;
        at[column] = cellsAt?.[piece.valuesFrom + offset] ?? null;
      });
      if (placed.absorbed > 0) {
        cells[0] = [cells[0], ...values.slice(0, placed.absorbed)].filter((cell) => cell !== '').join(' ');
        at[0] = cellsAt ? spanOfCells(cellsAt.slice(piece.first, piece.valuesFrom + placed.absorbed)) : null;
      }
      // Cells left out before a statistic column, so that some statistic column got nothing: the row's
      // numbers may stand anywhere (a row of means under F columns).
      const statisticLeftEmpty = valueRoles.some((role, slot) => role.role === 'statistic' && !placed.columns.includes(slot));
      // A row with one number, of a table whose rows print more (a p alone, "Sexo 0,939", or a group's mean):
      // the number may belong to any column.
      const placedCells = placed.columns.filter((slot, offset) => slot >= 0 && toPlace[offset]!.shape.shape !== 'empty').length;
      const lone = placedCells === 1 && valueRoles.length > 1;
      if ((filled < valueRoles.length && statisticLeftEmpty) || lone) {
        out.push({ cells, at, partial: true });
        continue;
      }
      // Numbers given back to the label or left out of every column: the placement is the best guess, which a
      // value with df can be checked against, but a value without df cannot.
      // So is any placement other than one cell per column in order, as far as a value without df is concerned.
      // Cells given back to the label that hold a number with a bracket ("0.032 (0.014)": a group's M (SD), under
      // group columns the header names before its first known one) cannot be a statistic or a p: the rest, one cell
      // per column in order, is placed as clearly as a row without them.
      const descriptivesAbsorbed = placed.absorbed > 0 && toPlace.slice(0, placed.absorbed).every((cell) => cell.shape.shape === 'number-bracket' || MEAN_PLUS_MINUS_SD.test(cell.text));
      const absorbedClearly = placed.absorbed === 0 || descriptivesAbsorbed;
      const inOrder = absorbedClearly && toPlace.length - placed.absorbed === valueRoles.length && placed.columns.slice(placed.absorbed).every((slot, offset) => slot === offset);
      const guessed = !inOrder || placed.columns.some((slot, offset) => slot < 0 && offset >= placed.absorbed && toPlace[offset]!.shape.shape.startsWith('number'));
      if (guessed) {
        out.push({ cells, at, guessed: true, ...(clarity.blockUnknown ? { blockUnknown: true } : {}) });
        continue;
      }
      if (clarity.blockUnknown) {
        out.push({ cells, at, blockUnknown: true });
        continue;
      }
    }
    out.push({ cells, at });
  }
  return { rows: out, unplaced };
}

/** The row label a statistics program gives the t test for unequal variances, under the one for equal variances. */
const UNEQUAL_VARIANCES_ROW = /(?:^|\s)(?:equal variances not assumed|variances not assumed|unequal variances)$/i;

/** A group's mean and SD written "2.89 ± 0.75": a descriptive cell, never a statistic or a p. */
const MEAN_PLUS_MINUS_SD = /^\s*[-\u2212]?(?:\d+(?:\.\d+)?|\.\d+)\s?\u00b1\s?(?:\d+(?:\.\d+)?|\.\d+)\s*$/;

/** Most a placed MS may differ from SS/df, relatively, beyond the rounding of the printed numbers. */
const MEAN_SQUARE_SLACK = 0.05;

type PlacedCells = { text: string; shape: CellShape }[];

/** The number a placement puts under the first column of `role`, or null. */
function placedValue(cells: PlacedCells, roles: ColumnRole[], columns: number[], role: ColumnRole['role']): CellShape | null {
  const offset = columns.findIndex((slot) => slot >= 0 && roles[slot]!.role === role);
  const shape = offset < 0 ? null : cells[offset]!.shape;
  return shape !== null && shape.shape === 'number' ? shape : null;
}

/** Whether a placement puts a number with decimals under df (or df1). */
function fractionalDf(cells: PlacedCells, roles: ColumnRole[], columns: number[]): boolean {
  const df = placedValue(cells, roles, columns, 'df') ?? placedValue(cells, roles, columns, 'df1');
  return df !== null && df.shape === 'number' && df.decimals > 0;
}

/** False when a placement puts numbers under SS, df and MS that do not keep MS = SS/df; true otherwise. */
function keepsMeanSquare(cells: PlacedCells, roles: ColumnRole[], columns: number[]): boolean {
  const valueIn = (role: ColumnRole['role']): number | null => {
    const shape = placedValue(cells, roles, columns, role);
    return shape !== null && shape.shape === 'number' ? shape.value : null;
  };
  const ss = valueIn('ss');
  const df = valueIn('df') ?? valueIn('df1');
  const ms = valueIn('ms');
  if (ss === null || df === null || ms === null || df <= 0 || ms <= 0) return true;
  return Math.abs(ss / df - ms) <= MEAN_SQUARE_SLACK * ms + 0.01;
}

/**
 * Whether a row with one filled cell per value column keeps its order: every cell under a test's column (statistic,
 * df, p, effect size) fits it, a statistic among them, and the other cells are values under groups' columns.
 */
function fullRowInOrder(shapes: CellShape[], roles: ColumnRole[]): boolean {
  const testRoles = new Set(['statistic', 'df', 'df1', 'df2', 'p', 'effect']);
  return (
    roles.some((role) => role.role === 'statistic') &&
    roles.every((role, slot) => (testRoles.has(role.role) ? fit(role, shapes[slot]!) > 0 : ['n', 'descriptive', 'unknown'].includes(role.role) && shapes[slot]!.shape !== 'text'))
  );
}

/**
 * Columns that can take a value: known value columns, and named columns of unknown meaning after the first
 * of those (before it, an unknown header names part of the row label, "Out. rem.").
 */
function valueColumnsOf(schema: Schema): { role: ColumnRole; column: number }[] {
  const firstKnown = schema.roles.findIndex((role, column) => column > 0 && isValueRole(role) && role.role !== 'unknown');
  return schema.roles
    .map((role, column) => ({ role, column }))
    .filter(({ role, column }) => column > 0 && isValueRole(role) && (role.role !== 'unknown' || (schema.named[column] && (column > firstKnown || schema.unnamedColumns?.[column] === true))));
}

/**
 * For a table rebuilt from crushed text, the form each value column's cells take in the rows that fill
 * every column (at least two, all agreeing): "0.048* (0.51)" in every full row of "p (d)" says a plain
 * 0.28 in a shorter row belongs elsewhere. Indexed like valueColumnsOf.
 */
function columnFamilies(body: string[][], schema: Schema): (ShapeFamily | null)[] | undefined {
  if (schema.positional) return undefined;
  const slotRoles = valueColumnsOf(schema).map(({ role }) => role);
  const slots = slotRoles.length;
  const seen: (ShapeFamily | null | 'mixed')[] = new Array<ShapeFamily | null | 'mixed'>(slots).fill(null);
  let fullRows = 0;
  for (const row of body) {
    const shapes = row.map(shapeOf);
    let first = 1;
    while (first < shapes.length && shapes[first]!.shape === 'text') first++;
    const values = shapes.slice(first);
    // A full row counts only when each of its cells fits the column it would stand in one to one (a header
    // read wrongly makes rows of the right length that do not).
    if (values.length !== slots || values.some((shape, slot) => shape.shape === 'text' || shape.shape === 'empty' || shape.shape === 'mark' || fit(slotRoles[slot]!, shape) <= 0)) continue;
    fullRows++;
    values.forEach((shape, slot) => {
      const family = familyOf(shape);
      const before = seen[slot]!;
      if (family === null || before === 'mixed') return;
      seen[slot] = before === null ? family : (joinFamilies(before, family) ?? 'mixed');
    });
  }
  if (fullRows < 2) return undefined;
  return seen.map((family) => (family === 'mixed' ? null : family));
}

function spanOfCells(cells: (LocatedCell | null)[]): LocatedCell | null {
  const present = cells.filter((cell): cell is LocatedCell => cell !== null);
  if (present.length === 0) return null;
  return { start: present[0]!.start, end: present[present.length - 1]!.end };
}

/**
 * Groups columns into tests: one group per statistic column of the table's
 * kind; a column whose meaning already occurs in the current group starts
 * the next one ("df F p | df F p"). Groups without their own df borrow the
 * first group's df columns ("Source | df | F (Recall) | p | F (Recognition) | p").
 */
function buildSegments(roles: ColumnRole[], kind: StatisticKind, upperHeaders: (string | null)[]): Segment[] {
  const pFirst = pFirstPairs(roles, kind);
  if (pFirst !== null) return pFirst;
  const segments: Segment[] = [];
  let current: Segment = { columns: new Map(), title: null, headerDf: [], dfInCell: false };
  // After the column of a statistic of another kind, the columns are that statistic's until one of this kind
  // comes ("F | Sig. | t | df | Sig. (2-tailed)": the df and the second Sig. are the t's).
  let foreign = false;
  roles.forEach((role, column) => {
    const key = roleKey(role, kind);
    if (role.role === 'statistic' && role.kind !== kind && key === null) {
      if (current.columns.has('statistic')) {
        segments.push(current);
        current = { columns: new Map(), title: null, headerDf: [], dfInCell: false };
      }
      foreign = true;
      return;
    }
    if (key === null) return;
    if (foreign && key !== 'statistic') return;
    foreign = false;
    // An effect size under a group title of its own ("T0–1" over "d | CI"), after a statistic whose column has
    // no such title, belongs to that group (a within-group d), not to the test.
    const statisticColumn = current.columns.get('statistic');
    if (key.startsWith('effect:') && statisticColumn !== undefined && isGroupTitle(upperHeaders[column]) && upperHeaders[column] !== upperHeaders[statisticColumn]) return;
    // A p column before the statistic ("p (d)" of a t test printed only as p) gives way to the p right after it ("r | p").
    const pBefore = key === 'p' && statisticColumn !== undefined && (current.columns.get('p') ?? Infinity) < statisticColumn;
    if (pBefore) {
      current.columns.set('p', column);
      return;
    }
    if (current.columns.has(key) && current.columns.has('statistic')) {
      segments.push(current);
      current = { columns: new Map(), title: null, headerDf: [], dfInCell: false };
    }
    current.columns.set(key, column);
    if (key === 'statistic' && role.role === 'statistic') {
      current.headerDf = role.df;
      current.dfInCell = role.dfInCell === true;
      current.pInCell = role.pInCell === true;
      if (role.symbol !== undefined) current.symbol = role.symbol;
      current.title = upperHeaders[column] ?? null;
    }
  });
  segments.push(current);
  const withStatistic = segments.filter((segment) => segment.columns.has('statistic'));
  // Statistics of different kinds side by side before one df and one p column ("χ2 (df) | t (df) | p", "χ2 | t |
  // df | p", a row filling one of them, as tables comparing groups print categorical and continuous variables):
  // the df and the p are each one's.
  for (const segment of withStatistic) {
    const statistic = segment.columns.get('statistic')!;
    let column = statistic + 1;
    while (column < roles.length && roles[column]!.role === 'statistic') column++;
    if (column === statistic + 1) continue;
    for (; column < roles.length && (roles[column]!.role === 'df' || roles[column]!.role === 'p'); column++) {
      const key = roles[column]!.role as 'df' | 'p';
      if (!segment.columns.has(key)) segment.columns.set(key, column);
    }
  }
  const first = withStatistic[0];
  for (const segment of withStatistic.slice(1)) {
    for (const key of ['df', 'df1', 'df2', 'n'] as const) {
      const column = first?.columns.get(key);
      if (!segment.columns.has(key) && column !== undefined) segment.columns.set(key, column);
    }
  }
  return withStatistic;
}

/**
 * Blocks that each print the p before its statistic ("p-value | rs-value" under each outcome): the table's
 * columns of this kind are p and statistic in turn, starting with a p, at least twice, with no other column
 * of a test among them. Each p goes with the statistic right after it; null for any other layout.
 */
function pFirstPairs(roles: ColumnRole[], kind: StatisticKind): Segment[] | null {
  const keyed = roles.flatMap((role, column) => {
    const key = roleKey(role, kind);
    return key === null ? [] : [{ key, column, role }];
  });
  if (keyed.length < 4 || keyed.length % 2 !== 0) return null;
  const alternates = keyed.every((entry, index) => entry.key === (index % 2 === 0 ? 'p' : 'statistic'));
  if (!alternates) return null;
  const segments: Segment[] = [];
  for (let index = 0; index < keyed.length; index += 2) {
    const p = keyed[index]!;
    const statistic = keyed[index + 1]!;
    const role = statistic.role as Extract<ColumnRole, { role: 'statistic' }>;
    segments.push({
      columns: new Map([
        ['p', p.column],
        ['statistic', statistic.column],
      ]),
      title: null,
      headerDf: role.df,
      dfInCell: role.dfInCell === true,
      ...(role.symbol !== undefined ? { symbol: role.symbol } : {}),
    });
  }
  return segments;
}

/** A title over columns that names a group of them, not a column itself ("T0–1", "Recall"; not "F (dfM, dfR)"). */
function isGroupTitle(title: string | null | undefined): boolean {
  return title !== null && title !== undefined && classifyHeader(title).role === 'unknown';
}

/**
 * Side-by-side blocks under titles that span them ("Treatment (num. df =
 * 1) | Temperature (num. df = 7)"): a text table does not say which columns
 * a title spans, but titles stand in the blocks' order to the right of the
 * label headers, so when a header row above the column names has at least
 * as many cells as there are blocks, its last cells title the blocks in
 * order. A df written in a title goes with its block.
 */
function titleBlocks(segments: Segment[], upperRows: string[][]): void {
  for (let level = upperRows.length - 1; level >= 0; level--) {
    const cells = upperRows[level]!.map((cell) => cell.trim()).filter((cell) => cell !== '' && /[a-z]/i.test(cell));
    if (statisticTitlesGiveDf(segments, cells)) return;
    // A row of column names is not a row of titles.
    if (cells.some((cell) => isValueRole(classifyHeader(cell)) && classifyHeader(cell).role !== 'unknown')) continue;
    if (cells.length < segments.length || (segments.length === 1 && !TITLE_DF.test(cells.join(' ')))) continue;
    const titles = cells.slice(cells.length - segments.length);
    segments.forEach((segment, index) => {
      const title = titles[index]!;
      if (segments.length > 1) segment.title = title;
      const df = TITLE_DF.exec(normaliseText(title).text);
      if (df === null) return;
      const first = parseReportedNumber(df[1]!)!;
      if (df[2] !== undefined && segment.headerDf.length === 0) segment.headerDf = [first, parseReportedNumber(df[2])!];
      else segment.titleDf1 = first;
    });
    return;
  }
}

/**
 * Titles that each name a block's statistic with its df ("Group F(1, 58) | Time F(2, 116)" over "F | p | F |
 * p"): one title per block, each of the block's kind with df, over blocks whose own headers give none. Each
 * block takes its title's df, in order. Any other row (fewer or more such titles, another kind, a block that
 * has df) is left to the other readings: df are tied only where one title stands for one block.
 */
function statisticTitlesGiveDf(segments: Segment[], cells: string[]): boolean {
  if (cells.length !== segments.length || segments.some((segment) => segment.headerDf.length > 0 || segment.dfInCell)) return false;
  const titleDf = cells.map((cell, index) => {
    const role = classifyHeader(cell);
    return role.role === 'statistic' && role.kind === segments[index]!.kind && role.df.length > 0 && role.dfInCell !== true ? role.df : null;
  });
  if (titleDf.some((df) => df === null)) return false;
  segments.forEach((segment, index) => {
    segment.headerDf = titleDf[index]!;
    if (segments.length > 1) segment.title = cells[index]!;
  });
  return true;
}

/** "num. df = 1", "df = 7", "df = 2, 57" in a block's title. */
const TITLE_DF = /(?:^|[^a-z])(?:num(?:erator)?\.?\s*)?dfs?\s*=\s*(\d+(?:\.\d+)?)(?:\s*,\s*(\d+(?:\.\d+)?))?/i;

function roleKey(role: ColumnRole, kind: StatisticKind): RoleKey | null {
  switch (role.role) {
    case 'statistic':
      if (role.kind === kind) return 'statistic';
      // An r beside an F, t or chi-square is its effect size; beside a z (Fisher's z comparing two r's) it is a test of its own.
      return role.kind === 'r' && kind !== 'z' ? 'effect:r' : null;
    case 'effect':
      return `effect:${role.effect}`;
    case 'ss':
    case 'df':
    case 'df1':
    case 'df2':
    case 'ms':
    case 'p':
    case 'n':
      return role.role;
    default:
      return null;
  }
}

/**
 * An error term: a row with its df or sums of squares but no statistic,
 * labelled Error, Residual or Within, or, in a table of F tests without a
 * denominator df column, any such row with its df ("Subject/Age", "VES by
 * Subject/Age": the error terms of a split-plot table).
 */
function isErrorRow(row: string[], segments: Segment[], separator: DecimalSeparator): boolean {
  const label = headerKey(row[0] ?? '');
  if (TOTAL_LABEL.test(label) || INTERCEPT_LABEL.test(label)) return false;
  const columns = segments[0]!.columns;
  // (A statistic in any block's column makes the row a test's: "5.91 |  | 2 | .052" under "χ2 | t | df | p".)
  const hasStatistic = segments.some((segment) => readCell(row[segment.columns.get('statistic')!] ?? '', separator).kind === 'number');
  const numberIn = (key: 'df' | 'df1' | 'ss' | 'ms'): boolean => {
    const column = columns.get(key);
    return column !== undefined && readCell(row[column] ?? '', separator).kind === 'number';
  };
  const hasTerms = numberIn('df') || numberIn('df1') || numberIn('ss') || numberIn('ms');
  if (!hasTerms || hasStatistic) return false;
  if (ERROR_LABEL.test(label)) return true;
  // A row its label does not name as an error term is one only when its df is a whole number and its statistic
  // cell is empty: a dash there ("New vs. Given | 1.23 | − | −") marks a test not reported, not an error term.
  const df = readCell(row[columns.get('df') ?? columns.get('df1') ?? -1] ?? '', separator);
  const statisticCell = (row[columns.get('statistic')!] ?? '').trim();
  return (
    !columns.has('df2') &&
    df.kind === 'number' &&
    df.number.decimals === 0 &&
    statisticCell === '' &&
    row.slice(1).every((cell) => !/[=<>]/.test(cell))
  );
}


/**
 * The row, cells and segment of a row with the p under its value read as a p column of its own: when the segment
 * has no p column, the row has a label and a number in the statistic column, and the next row holds nothing but a
 * p ("p < .001", "(.006)") in that same column (how tables print each effect's p under its F). Only the row right
 * above the p is given it: a p under an empty cell, or after a row of the table's other cells, ties to nothing.
 */
function pUnderValueBelow(rows: readonly VirtualRow[], index: number, segment: Segment): { row: string[]; cellsAt: (LocatedCell | null)[] | null; segment: Segment } | null {
  const column = segment.columns.get('statistic');
  const below = rows[index + 1];
  if (column === undefined || segment.columns.has('p') || below === undefined) return null;
  const { cells: row, at: cellsAt } = rows[index]!;
  if ((row[0] ?? '').trim() === '' || !shapeOf(row[column] ?? '').shape.startsWith('number')) return null;
  const pCell = below.cells[column] ?? '';
  if (!P_UNDER_VALUE.test(pCell) || below.cells.some((cell, at) => at !== column && cell.trim() !== '')) return null;
  // (Brackets around the p, "(.006)", "(p = .02)", are the layout's, not the p's: read inside them.)
  const open = pCell.indexOf('(');
  const inner = open === -1 ? pCell : pCell.slice(open + 1, pCell.lastIndexOf(')'));
  const offset = open === -1 ? 0 : open + 1;
  const pAt = below.at?.[column] ?? null;
  const width = Math.max(row.length, column + 1);
  const cells = [...row, ...new Array<string>(width - row.length).fill(''), inner];
  const at = cellsAt === null ? null : [...cellsAt, ...new Array<LocatedCell | null>(width - cellsAt.length).fill(null), pAt === null ? null : { start: pAt.start + offset, end: pAt.start + offset + inner.length }];
  return { row: cells, cellsAt: at, segment: { ...segment, columns: new Map(segment.columns).set('p', width) } };
}

/** For each row, the nearest error row below it; above it only when the table has a single error row. */
/** A sphericity correction's name in a row label, as statistics programs print each effect's and error's rows. */
const CORRECTION_LABEL = /sphericity assumed|greenhouse[- ]?geisser|huynh[- ]?feldt|lower[- ]?bound/i;

/** A label that names only a correction ("Greenhouse-Geisser"), as the rows after an effect's or error's first do. */
function correctionOnly(label: string): boolean {
  return correctionOf(label) !== null && label.replace(CORRECTION_LABEL, '').trim() === '';
}

/** A column naming each row's sphericity correction, as JASP and jamovi print it beside the effect's name. */
const CORRECTION_COLUMN = /^(?:sphericity )?correction$/i;

/**
 * A table whose second column names the sphericity correction of each row ("Cases | Sphericity Correction | Sum of
 * Squares | df | …" over "time | None | …", " | Greenhouse-Geisser | …", "Residuals | None | …"): the correction
 * joined to the row's label, and a row without a label of its own named after the row above ("time
 * Greenhouse-Geisser", "Residuals Greenhouse-Geisser"), as when the correction is part of the label. Null when the
 * table has no such column.
 */
function withCorrectionInLabel(rows: readonly string[][], located: readonly ((LocatedCell | null)[] | null)[], headerCount: number): { rows: string[][]; located: ((LocatedCell | null)[] | null)[] } | null {
  if (!rows.slice(0, headerCount).some((row) => CORRECTION_COLUMN.test((row[1] ?? '').trim()))) return null;
  let effect = '';
  const joined = rows.map((row, index) => {
    if (index < headerCount) return [row[0] ?? '', ...row.slice(2)];
    const own = (row[0] ?? '').trim();
    if (own !== '') effect = own;
    const correction = (row[1] ?? '').trim();
    const label = [own === '' ? effect : own, correction === 'None' || correction === '' ? '' : correction].filter((part) => part !== '').join(' ');
    return [label, ...row.slice(2)];
  });
  const joinedAt = located.map((cells) => {
    if (cells === null) return null;
    const [first, second] = [cells[0] ?? null, cells[1] ?? null];
    const label = first === null ? second : second === null ? first : { ...first, end: second.end };
    return [label, ...cells.slice(2)];
  });
  return { rows: joined, located: joinedAt };
}

function correctionOf(label: string): string | null {
  const match = CORRECTION_LABEL.exec(label);
  return match === null ? null : match[0].toLowerCase().replace(/[- ]/g, '');
}

/**
 * An error term printed once per correction ("Error(Time) | Sphericity Assumed | …" then rows named only
 * "Greenhouse-Geisser", "Huynh-Feldt", "Lower-bound"): the rows after the first, named by their correction
 * alone and printing no test, are error rows too, whatever their df (46.980 after Greenhouse-Geisser).
 */
function continueCorrectedErrorRows(rows: readonly VirtualRow[], errorRows: boolean[], segments: Segment[], separator: DecimalSeparator): void {
  const columns = segments[0]!.columns;
  for (let index = 1; index < rows.length; index++) {
    if (!errorRows[index - 1] || errorRows[index]) continue;
    const label = (rows[index]!.cells[0] ?? '').trim();
    const correction = correctionOf(label);
    if (correction === null || !correctionOnly(label) || correctionOf(rows[index - 1]!.cells[0] ?? '') === null) continue;
    const hasStatistic = readCell(rows[index]!.cells[columns.get('statistic')!] ?? '', separator).kind === 'number';
    if (!hasStatistic) errorRows[index] = true;
  }
}

/**
 * Each corrected row of an effect is tested against the error row of the same correction below it
 * ("Time Greenhouse-Geisser" against "Error(Time) Greenhouse-Geisser"), not the nearest error row.
 */
function pairCorrections(rows: readonly VirtualRow[], errorRows: readonly boolean[], nearest: (number | null)[]): (number | null)[] {
  return nearest.map((errorIndex, index) => {
    const correction = correctionOf(rows[index]!.cells[0] ?? '');
    if (correction === null || errorRows[index] || errorIndex === null) return errorIndex;
    for (let below = errorIndex; below < rows.length && errorRows[below]; below++) {
      if (correctionOf(rows[below]!.cells[0] ?? '') === correction) return below;
    }
    return errorIndex;
  });
}

function nearestErrorRows(errorRows: readonly boolean[]): (number | null)[] {
  // Worked out for every row in one pass from the bottom: a table of many rows stays linear.
  const all = errorRows.flatMap((isError, at) => (isError ? [at] : []));
  const onlyOne = all.length === 1 ? all[0]! : null;
  const nearest = new Array<number | null>(errorRows.length).fill(onlyOne);
  let below: number | null = null;
  for (let index = errorRows.length - 1; index >= 0; index--) {
    nearest[index] = below ?? onlyOne;
    if (errorRows[index]) below = index;
  }
  return nearest;
}

// ------------------------------------------------------------ row reading

interface RowInput {
  text: string;
  table: DocumentTable;
  tableIndex: number;
  kind: StatisticKind;
  row: string[];
  cellsAt: (LocatedCell | null)[];
  segment: Segment;
  multiple: boolean;
  errorRow: { row: string[]; cellsAt: (LocatedCell | null)[] | null } | null;
  noteDf: NoteDf;
  /** The segment's df column holds pairs whose comma a copy turned into a point (lostCommaColumn). */
  lostCommaDf?: boolean;
  noteN: ReportedNumber | null;
  /** The significance marks the table's notes define. */
  legend: ReadonlyMap<string, MarkBound>;
  rowSpan: LocatedCell;
  /** The table's decimal separator (cells.ts, decimalSeparatorOf). */
  separator: DecimalSeparator;
}

interface NumberCell {
  comparator: Comparator;
  record: CellRecord;
  /** The cell marks its number "n.s." too. */
  notSignificant?: true;
}

function numberAt(row: string[], cellsAt: (LocatedCell | null)[] | null, column: number | undefined, separator: DecimalSeparator): NumberCell | null | 'ns' {
  if (column === undefined) return null;
  const cell = row[column] ?? '';
  // "0.001 (1, 6)": a number with the next column's df run onto it by a crushed copy (see dfPairBefore).
  const trailing = TRAILING_DF_PAIR.exec(cell.trim());
  const read = readCell(trailing === null ? cell : cell.slice(0, cell.indexOf(trailing[1]!) + trailing[1]!.length), separator);
  if (read.kind === 'ns') return 'ns';
  if (read.kind !== 'number') return null;
  const at = cellsAt?.[column] ?? null;
  const start = at === null ? -1 : at.start + read.start;
  const end = at === null ? -1 : at.start + read.end;
  return { comparator: read.comparator, record: { ...read.number, start, end }, ...(read.notSignificant ? { notSignificant: true as const } : {}) };
}

/** A plain whole number without comparator or exponent ("0", "1", "12"). */
function isWholeNumberCell(cell: NumberCell): boolean {
  return cell.comparator === '=' && cell.record.decimals === 0 && cell.record.exponent === 0;
}

/** Plain numbers given back to a row's label beyond which its placement is not trusted. */
const MAX_NUMBERS_ABSORBED = 3;

/** A number with significance marks after it: "9.69**", "−2.21†". */
const MARKED_NUMBER = /^[-\u2212\u2013]? ?(\d{1,6}(?:\.\d{1,6})?|\.\d{1,6}) ?(?:\*{1,3}|[\u2020\u2021])$/;

function isMarkedStatistic(cell: string): boolean {
  const match = MARKED_NUMBER.exec(cell.trim());
  return match !== null && Number(match[1]) >= 1;
}

/**
 * Gives each segment the column right before its statistic when that column's name is empty and no segment
 * reads it: "Treatment | | Time" over " | F | P | | F | P", the unnamed column holding each F's df pair.
 */
function markUnheadedBefore(segments: Segment[], namesRow: readonly string[]): void {
  const taken = new Set(segments.flatMap((segment) => [...segment.columns.values()]));
  for (const segment of segments) {
    const statistic = segment.columns.get('statistic');
    if (statistic === undefined || statistic < 2) continue;
    const before = statistic - 1;
    if (!taken.has(before) && (namesRow[before] ?? '').trim() === '') segment.unheadedBefore = before;
  }
}

/** A df pair in brackets standing as a cell: "(1, 6)", "(2, 12)"; groups: the two df. Whole numbers only (a decimal pair may be an interval). */
const DF_PAIR_CELL = /^\((\d{1,4}), ?(\d{1,5})\)$/;

/**
 * An F's df pair in an unnamed cell of its own right before it ("(1, 6) | 43.7 | 0.001" under " | F | P"): only
 * whole numbers, the first at least 1 and smaller than the second, as an F's df are.
 */
function dfPairCellBefore(row: string[], segment: Segment): [ReportedNumber, ReportedNumber] | null {
  if (segment.unheadedBefore === undefined) return null;
  const match = DF_PAIR_CELL.exec((row[segment.unheadedBefore] ?? '').trim());
  if (match === null) return null;
  const first = parseReportedNumber(match[1]!);
  const second = parseReportedNumber(match[2]!);
  if (first === null || second === null || !(first.value >= 1 && first.value < second.value)) return null;
  return [first, second];
}

/**
 * A whole-number df pair in brackets at a cell's end, after a number: "47.43 (1, 6)", "0.001 (1.6, 9.9)" (also
 * apart by a wide gap, "0.001      (2, 12)": an aligned copy whose header names no column over the df).
 */
const TRAILING_DF_PAIR = /^([-\u2212<>=]? ?(?:\d{1,6}(?:\.\d{1,6})?|\.\d{1,6})[*a-h]{0,3}) {1,16}\((\d{1,4}(?:\.\d{1,2})?), ?(\d{1,5}(?:\.\d{1,2})?)\)$/;

/**
 * The df pair printed before an F when a crushed copy ran it onto the cell before ("Treatment F P" over
 * "18.66 47.43 (1, 6) 43.7 0.001"): read only when the cell before is another column's number followed by two
 * df in brackets, the first smaller than the second (a decimal pair around the number is its interval).
 */
function dfPairBefore(row: string[], columns: Map<string, number>): [ReportedNumber, ReportedNumber] | null {
  const at = columns.get('statistic');
  if (at === undefined || at < 2) return null;
  const match = TRAILING_DF_PAIR.exec((row[at - 1] ?? '').trim());
  if (match === null) return null;
  const first = parseReportedNumber(match[2]!);
  const second = parseReportedNumber(match[3]!);
  const before = Number(match[1]!.replace(/[^\d.-]/g, ''));
  if (first === null || second === null || !(first.value >= 1 && first.value < second.value)) return null;
  // (Corrected df are decimal, "(1.6, 9.9)"; a decimal pair around the number is its interval.)
  const whole = first.decimals === 0 && second.decimals === 0;
  if (!whole && before >= first.value && before <= second.value) return null;
  return [first, second];
}

function plainNumber(row: string[], cellsAt: (LocatedCell | null)[] | null, column: number | undefined, separator: DecimalSeparator): NumberCell | null {
  const found = numberAt(row, cellsAt, column, separator);
  return found === 'ns' ? null : found;
}

/** df each kind needs for its p to be recomputed; a correlation is read without them (its df may come from the study's N). */
const DF_NEEDED: Record<StatisticKind, number> = { F: 2, t: 1, chi2: 1, r: 0, z: 0 };

/** Whether a result read from a row lacks the df its p needs. */
function lacksDf(result: ReportedResult): boolean {
  return result.df.length < DF_NEEDED[result.kind];
}

/** Whether the row ties a value to a test: a p (printed, or by marks the notes define), "n.s." or an effect size beside it. */
function tiedToTest(result: ReportedResult): boolean {
  return result.p !== null || result.notSignificant || result.effects.length > 0;
}

/**
 * Whether a row ties a value without df to a test strongly enough to read it: a p printed beside it (its own
 * cell, or in the value's cell) or "n.s.". Marks and effect sizes alone are not enough without df: means and
 * other numbers carry marks too, and nothing else about the value can be checked.
 */
function tiedWithoutDf(result: ReportedResult): boolean {
  return (result.p !== null && result.p.fromMarks === undefined) || result.notSignificant;
}

/**
 * Whether a value read without df can go with the p read beside it under some df (stats/pOverDf.ts): an F of
 * 0.91 with p = .000, or a p below 0, says the row's numbers were put under the wrong columns.
 */
function pReachableWithoutDf(result: ReportedResult): boolean {
  if (result.p === null || result.value === null || result.kind === 'r' || result.kind === 'z') return true;
  const p = result.p.value;
  if (!(p.value >= 0 && p.value <= 1)) return false;
  const rounded = roundingInterval(p);
  // "p < .000" is printed for a p that rounds to .000.
  const below = Math.max(p.value, rounded.high - p.value);
  const printed = result.p.comparator === '<' || result.p.comparator === '<=' ? { low: 0, high: below } : result.p.comparator === '>' || result.p.comparator === '>=' ? { low: p.value, high: 1 } : rounded;
  const value = roundingInterval(result.value);
  const statistic = result.valueComparator === '<' || result.valueComparator === '<=' ? { low: 0, high: result.value.value } : value;
  const reachable = pRangeOverDf(result.kind, statistic);
  return printed.low <= reachable.high && printed.high >= reachable.low;
}

/** A row's result (with no df when the table gives none; see lacksDf), or null. */
function readRow(input: RowInput): ReportedResult | null {
  const { row, cellsAt, segment, kind } = input;
  const columns = segment.columns;
  // "2.71 (41) .010": the statistic, its df and its p in one cell, under "t (df) p".
  const withDfAndP = segment.dfInCell && segment.pInCell ? statisticWithDfAndP(row, cellsAt, columns.get('statistic'), kind) : null;
  // "4.842 (15)": the statistic with its df in brackets, in one cell (read as df where the header says "(df)", or whole numbers).
  const withDf = withDfAndP ?? statisticWithDf(row, cellsAt, columns.get('statistic'), kind, input.separator, segment.dfInCell);
  // "0.11, p > 0.05": the statistic with its p.
  // ("2.24, .15", "18.31, <.001": the p not named, where the header names it: "F, p value (df 1, 24)".)
  const withP =
    withDf === null
      ? (statisticWithP(row, cellsAt, columns.get('statistic')) ??
        (segment.pInCell ? (statisticWithP(row, cellsAt, columns.get('statistic'), STATISTIC_COMMA_P) ?? statisticWithBracketP(row, cellsAt, columns.get('statistic'), input.separator)) : null))
      : null;
  const statistic = withDf?.statistic ?? withP?.statistic ?? plainNumber(row, cellsAt, columns.get('statistic'), input.separator);
  if (statistic === null) return null;
  const cells: Cells = {};
  const record = (key: TableColumn, cell: NumberCell | null): void => {
    if (cell !== null) cells[key] = cell.record;
  };
  record('statistic', statistic);
  const labelDf = readLabelDf(row[0] ?? '');
  // "2, 180": both df of an F in the df column.
  const dfPair = kind === 'F' ? (numberPair(row, cellsAt, columns.get('df'), input.separator) ?? (input.lostCommaDf === true ? lostCommaPair(row, cellsAt, columns.get('df')) : null)) : null;
  const dfCell = dfPair === null ? (withDf?.df.length === 1 ? withDf.df[0]! : plainNumber(row, cellsAt, columns.get('df'), input.separator)) : null;
  const df1Cell = dfPair?.[0] ?? (withDf?.df.length === 2 ? withDf.df[0]! : plainNumber(row, cellsAt, columns.get('df1'), input.separator));
  const df2Cell = dfPair?.[1] ?? (withDf?.df.length === 2 ? withDf.df[1]! : plainNumber(row, cellsAt, columns.get('df2'), input.separator));
  record('df', dfCell);
  record('df1', df1Cell);
  record('df2', df2Cell);
  record('ss', plainNumber(row, cellsAt, columns.get('ss'), input.separator));
  record('ms', plainNumber(row, cellsAt, columns.get('ms'), input.separator));

  let errorRow: TableRowOrigin['errorRow'] = null;
  let errorDf: ReportedNumber | null = null;
  if (input.errorRow !== null && kind === 'F') {
    const errorCells: Cells = {};
    for (const key of ['ss', 'df', 'df1', 'df2', 'ms'] as const) {
      const cell = plainNumber(input.errorRow.row, input.errorRow.cellsAt, columns.get(key), input.separator);
      if (cell !== null) errorCells[key] = cell.record;
    }
    errorRow = { rowLabel: (input.errorRow.row[0] ?? '').trim(), cells: errorCells };
    errorDf = errorCells.df ?? errorCells.df1 ?? null;
  }

  // "47.43 (1, 6) 43.7": an F's df printed in front of it, run onto the cell before by a crushed copy.
  // "(1, 6) | 43.7": the same df in a cell of their own, under no name.
  const dfBefore = kind === 'F' && dfCell === null && df1Cell === null && df2Cell === null ? (dfPairBefore(row, columns) ?? dfPairCellBefore(row, segment)) : null;
  const dfSources: DfSources = {
    dfCell: dfCell?.record ?? null,
    df1Cell: dfBefore?.[0] ?? df1Cell?.record ?? null,
    df2Cell: dfBefore?.[1] ?? df2Cell?.record ?? null,
    errorDf,
    labelDf,
    headerDf: segment.headerDf,
    titleDf1: segment.titleDf1 ?? null,
    noteDf: input.noteDf,
    nCell: plainNumber(row, cellsAt, columns.get('n'), input.separator)?.record ?? null,
    noteN: input.noteN,
  };
  const df = degreesOfFreedom(kind, dfSources);
  // df that only the text beside the table gives are said to come from there (and weigh at most a warning).
  const dfBesideTable = input.noteDf.besideTable === true && df !== null && !sameNumbers(df, degreesOfFreedom(kind, { ...dfSources, noteDf: NO_NOTE_DF }));
  // A correlation's df worked out from the N of its row or the table's note (N − 2) are said to be so.
  const dfFromN = kind === 'r' && df !== null && degreesOfFreedom(kind, { ...dfSources, nCell: null, noteN: null }) === null;
  // A correlation needs no df to be read (as in running text): without an N in its row or the table's note it is
  // checked with the study's stated N, at most as a warning, or left unchecked (checks/documentDf.ts).
  // Without df the statistic is still read as printed (as in running text: "F = 5.60, p = .000"); its p cannot be
  // recomputed, but the checks that need no df still run. The caller keeps it only when the row ties it to a test.
  // An F whose row prints the effect's df but whose table gives no error df keeps the df it prints ("| 3 | 8.798 |").
  const printedEffectDf = kind === 'F' ? (dfCell ?? df1Cell) : null;
  const readDf = df ?? (printedEffectDf !== null && printedEffectDf !== undefined ? [stripOffsets(printedEffectDf.record)] : []);
  if (readDf.some((value) => !(value.value > 0))) return null;
  // Corrections make df fractional either both together (Greenhouse-Geisser, Huynh-Feldt: both times epsilon) or
  // the error df alone (Welch, Brown-Forsythe); a fractional effect df beside a whole error df is another column's number.
  // (Not a pair printed in one bracket before the F, "(1.2, 7)": a corrected error df whose rounding left no decimals.)
  if (kind === 'F' && readDf.length === 2 && !Number.isInteger(readDf[0]!.value) && Number.isInteger(readDf[1]!.value) && dfBefore === null) return null;

  const printedP = withDfAndP?.p ?? withP?.p ?? numberAt(row, cellsAt, columns.get('p'), input.separator);
  // A whole number under p ("0", "1") is not a p as tables print one (with decimals, or "< .001"): it is a count
  // placed in the p column of a row that prints fewer cells than the header names (common practice).
  const pCell = printedP !== null && printedP !== 'ns' && isWholeNumberCell(printedP) ? null : printedP;
  if (pCell !== null && pCell !== 'ns') record('p', pCell);
  // No p printed, but marks after the statistic that the notes define: the p bound they give.
  const markedP = pCell === null ? pFromMarks(row, cellsAt, columns.get('statistic'), input.legend) : null;
  const effects: ReportedEffect[] = [];
  for (const [key, column] of columns) {
    if (!key.startsWith('effect:')) continue;
    const effectKind = key.slice('effect:'.length) as EffectKind;
    const withInterval = plainNumber(row, cellsAt, column, input.separator) === null ? numberWithInterval(row, cellsAt, column, input.separator) : null;
    const cell = withInterval?.cell ?? plainNumber(row, cellsAt, column, input.separator);
    if (cell === null) continue;
    if (CELL_COLUMNS.has(effectKind)) cells[effectKind as TableColumn] = cell.record;
    effects.push({
      kind: effectKind,
      comparator: cell.comparator,
      value: stripOffsets(cell.record),
      interval: withInterval?.interval ?? null,
      start: cell.record.start,
      end: withInterval?.end ?? cell.record.end,
    });
  }
  effects.sort((a, b) => a.start - b.start);

  const label = (row[0] ?? '').trim();
  const sampleSize = kind === 'chi2' ? (plainNumber(row, cellsAt, columns.get('n'), input.separator)?.record ?? input.noteN) : null;
  const { start, end } = input.rowSpan;
  return {
    kind,
    ...(segment.symbol !== undefined && kind === 'r' ? { symbol: segment.symbol } : {}),
    text: input.text.slice(start, end),
    start,
    end,
    df: readDf,
    ...(dfBesideTable ? { dfFrom: 'text-beside-table' as const } : dfFromN ? { dfFrom: 'sample-size' as const } : {}),
    sampleSize: sampleSize === null ? null : stripOffsets(sampleSize),
    value: stripOffsets(statistic.record),
    valueComparator: statistic.comparator,
    p:
      pCell === null || pCell === 'ns'
        ? markedP
        : { comparator: pCell.comparator, value: stripOffsets(pCell.record), plural: false, start: pCell.record.start, end: pCell.record.end },
    // "n.s." after the p, or after the statistic when no p is printed (".14, n.s." under F).
    notSignificant: pCell === 'ns' || pCell?.notSignificant === true || (pCell === null && statistic.notSignificant === true),
    effects,
    tableRow: {
      tableIndex: input.tableIndex,
      caption: input.table.caption,
      rowLabel: input.multiple && segment.title !== null ? `${label} (${segment.title})` : label,
      cells,
      errorRow,
    },
  };
}

/** The p bound of the marks after a value in `column` ("12.314***"), when the legend defines them; null otherwise. */
function pFromMarks(row: string[], cellsAt: (LocatedCell | null)[] | null, column: number | undefined, legend: ReadonlyMap<string, MarkBound>): ReportedP | null {
  if (column === undefined || legend.size === 0) return null;
  const written = (row[column] ?? '').trim();
  const marks = marksOf(written);
  const bound = marks === '' ? undefined : legend.get(marks);
  if (bound === undefined) return null;
  const at = cellsAt?.[column] ?? null;
  const cellStart = at === null ? -1 : at.start + (row[column] ?? '').indexOf(written);
  const start = cellStart < 0 ? -1 : cellStart + written.lastIndexOf(marks);
  return { comparator: bound.comparator, value: bound.value, plural: false, start, end: start < 0 ? -1 : start + marks.length, fromMarks: marks };
}

/** Whether some cell of `column` carries marks the legend defines. */
function marksInColumn(rows: string[][], column: number | undefined, legend: ReadonlyMap<string, MarkBound>): boolean {
  if (column === undefined || legend.size === 0) return false;
  return rows.some((row) => legend.has(marksOf(row[column] ?? '')));
}

const INTERVAL_CELL = /^ *((?:[-\u2212\u2013] *)?(?:\d+(?:\.\d+)?|\.\d+)) *[([] *((?:[-\u2212\u2013] *)?(?:\d+(?:\.\d+)?|\.\d+)) *(?:,|;|to|\u2013|-) *((?:[-\u2212\u2013] *)?(?:\d+(?:\.\d+)?|\.\d+)) *[)\]]/;

/** An estimate with its interval in one cell: "0.04 (–0.45 to 0.54)", "0.31 [0.12, 0.50]"; the level is not stated in the cell. */
function numberWithInterval(
  row: string[],
  cellsAt: (LocatedCell | null)[] | null,
  column: number | undefined,
  separator: DecimalSeparator,
): { cell: NumberCell; interval: ReportedInterval; end: number } | null {
  if (column === undefined || separator === ',') return null;
  const text = row[column] ?? '';
  const match = INTERVAL_CELL.exec(text);
  if (!match) return null;
  const read = (written: string): ReportedNumber | null => {
    const cell = readCell(written, separator);
    return cell.kind === 'number' ? cell.number : null;
  };
  const value = read(match[1]!);
  const low = read(match[2]!);
  const high = read(match[3]!);
  if (value === null || low === null || high === null) return null;
  const at = cellsAt?.[column] ?? null;
  const valueAt = text.indexOf(match[1]!);
  const start = at === null ? -1 : at.start + valueAt;
  return {
    cell: { comparator: '=', record: { ...value, start, end: at === null ? -1 : start + match[1]!.length } },
    interval: { level: null, low, high },
    end: at === null ? -1 : at.start + match.index + match[0].length,
  };
}

/** A statistic cell that holds its p, "0.11, p > 0.05", with the offsets of both numbers. */
function statisticWithP(
  row: string[],
  cellsAt: (LocatedCell | null)[] | null,
  column: number | undefined,
  pattern: RegExp = STATISTIC_WITH_P,
): { statistic: NumberCell; p: NumberCell } | null {
  if (column === undefined) return null;
  const cell = row[column] ?? '';
  const normalised = normaliseText(cell);
  const match = pattern.exec(normalised.text);
  if (!match) return null;
  const at = cellsAt?.[column] ?? null;
  const located = (written: string, from: number, comparator: Comparator): NumberCell | null => {
    const number = parseReportedNumber(written);
    if (number === null) return null;
    const offset = normalised.text.indexOf(written, from);
    return {
      comparator,
      record: { ...number, start: at === null ? -1 : at.start + normalised.toOriginal(offset), end: at === null ? -1 : at.start + normalised.toOriginalEnd(offset + written.length) },
    };
  };
  const statistic = located(match[1]!.replace(/\u2212\s?/, '-'), 0, '=');
  const comparatorText = match[2] ?? '=';
  const comparator = (comparatorText === '<=' || comparatorText === '\u2264' ? '<=' : comparatorText === '>=' || comparatorText === '\u2265' ? '>=' : comparatorText) as Comparator;
  // (The p is looked for after the value, whose own digits may repeat it.)
  const p = located(match[3]!, match[2] === undefined ? normalised.text.indexOf(match[1]!) + match[1]!.length : normalised.text.indexOf(comparatorText), comparator);
  return statistic === null || p === null ? null : { statistic, p };
}

/** "−0.06 (.60)", "−0.50 (<.001)": a statistic with its p in brackets. Groups: value, comparator, p. */
const STATISTIC_BRACKET_P = /^ *((?:[-\u2212\u2013] *)?(?:\d+(?:[.,]\d+)?|[.,]\d+)) *[([] *(?:(<=|>=|<|>|=|\u2264|\u2265) *)?((?:0|1)?[.,]\d+|0|1) *[)\]](?: *(?:[*\u2020\u2021]{1,4}|[a-h]))? *$/;

/** A statistic cell under a header that says it holds the p in brackets ("r (P value)"), with the offsets of both numbers. */
function statisticWithBracketP(
  row: string[],
  cellsAt: (LocatedCell | null)[] | null,
  column: number | undefined,
  separator: DecimalSeparator,
): { statistic: NumberCell; p: NumberCell } | null {
  if (column === undefined) return null;
  const cell = row[column] ?? '';
  const match = STATISTIC_BRACKET_P.exec(cell);
  if (!match) return null;
  const at = cellsAt?.[column] ?? null;
  const valueRead = readCell(match[1]!, separator);
  const pRead = readCell(match[3]!, separator);
  if (valueRead.kind !== 'number' || pRead.kind !== 'number') return null;
  const valueAt = cell.indexOf(match[1]!);
  const pAt = cell.indexOf(match[3]!, valueAt + match[1]!.length);
  const comparatorText = match[2] === '\u2264' ? '<=' : match[2] === '\u2265' ? '>=' : (match[2] ?? '=');
  return {
    statistic: { comparator: '=', record: { ...valueRead.number, start: at === null ? -1 : at.start + valueAt + valueRead.start, end: at === null ? -1 : at.start + valueAt + valueRead.end } },
    p: { comparator: comparatorText as Comparator, record: { ...pRead.number, start: at === null ? -1 : at.start + pAt + pRead.start, end: at === null ? -1 : at.start + pAt + pRead.end } },
  };
}

/** "2.71 (41) .010", "4.21 (2, 57) <.001", "2.71 (41), p = .010". Groups: value, df1, df2, comparator, p. */
const STATISTIC_DF_P = /^ *((?:[-\u2212\u2013] ?)?(?:\d+(?:\.\d+)?|\.\d+)) ?[([] ?(\d{1,6}(?:\.\d+)?) ?(?:[,;] ?(\d{1,6}(?:\.\d+)?) ?)?[)\]][*\u2020\u2021]{0,3}[,;]? ?(?:p ?)?(<=|>=|<|>|=|\u2264|\u2265)? ?((?:0|1)?\.\d+|0|1)[*\u2020\u2021]{0,3}[a-h]? *$/;

/** The comma of a number's thousands: "12,000" (a whole number, three digits after the comma). */
const THOUSANDS_COMMA = /(?<=^\d{1,3}),(?=\d{3}$)/;

/**
 * The df texts a cell's brackets hold. For a statistic with one df (t, χ2, r), "(12,000)" is one df with its
 * thousands set apart by a comma, not two: a comma without a space before exactly three digits, where two df
 * cannot be meant (a bracket of two df is an F's). An F's "(12,000)" stays two numbers, and is refused for its zero.
 */
function oneDfWithThousands(texts: readonly (string | undefined)[], cell: string, kind: StatisticKind): string[] {
  const dfTexts = texts.filter((text): text is string => text !== undefined);
  if (kind === 'F' || dfTexts.length !== 2) return dfTexts;
  const written = `${dfTexts[0]!},${dfTexts[1]!}`;
  return /^\d{1,3}$/.test(dfTexts[0]!) && /^\d{3}$/.test(dfTexts[1]!) && cell.includes(`(${written})`) ? [written] : dfTexts;
}

/** A statistic cell that holds its df and its p (under a header "t (df) p"), with the offsets of each number. */
function statisticWithDfAndP(
  row: string[],
  cellsAt: (LocatedCell | null)[] | null,
  column: number | undefined,
  kind: StatisticKind,
): { statistic: NumberCell; df: NumberCell[]; p: NumberCell } | null {
  if (column === undefined || kind === 'z') return null;
  const cell = row[column] ?? '';
  const match = STATISTIC_DF_P.exec(normaliseText(cell).text === cell ? cell : cell.replace(/\u2212/g, '-'));
  if (!match) return null;
  const dfTexts = oneDfWithThousands([match[2], match[3]], cell, kind);
  if (dfTexts.length !== (kind === 'F' ? 2 : 1) || dfTexts.some((text) => Number(text.replace(',', '')) < 1)) return null;
  const at = cellsAt?.[column] ?? null;
  let from = 0;
  const locate = (written: string, comparator: Comparator): NumberCell | null => {
    const number = parseReportedNumber(written.replace(/\s/g, '').replace('\u2212', '-').replace('\u2013', '-').replace(THOUSANDS_COMMA, ''));
    if (number === null) return null;
    const offset = cell.indexOf(written, from);
    from = offset + written.length;
    return { comparator, record: { ...number, start: at === null ? -1 : at.start + offset, end: at === null ? -1 : at.start + offset + written.length } };
  };
  const statistic = locate(match[1]!, '=');
  const df = dfTexts.map((text) => locate(text, '='));
  const comparatorText = match[4] === '\u2264' ? '<=' : match[4] === '\u2265' ? '>=' : (match[4] ?? '=');
  const p = locate(match[5]!, comparatorText as Comparator);
  if (statistic === null || p === null || df.some((cell) => cell === null)) return null;
  return { statistic, df: df as NumberCell[], p };
}

/** A df column's pair: "1, 28", "(1, 28)", "1/28", "1; 28", "1 and 28", "1 & 28", and with a dash, "1–28" (in a df column a dash joins the two df, as in "F(3–112)"). */
const PAIR_CELL = /^(?:df ?= ?)?([([])? {0,3}(\d{1,5}(?:\.\d+)?)(?: {0,3}[,;/\u2013-] {0,3}| and | & )(\d{1,6}(?:[.,]\d+)?) {0,3}([)\]])?$/;

/** Two df in one cell, "2, 180", "2/180", "(2, 180)", "2 and 180", "df = 2, 180", with the offsets of each. */
function numberPair(row: string[], cellsAt: (LocatedCell | null)[] | null, column: number | undefined, separator: DecimalSeparator): [NumberCell, NumberCell] | null {
  if (column === undefined || separator === ',') return null;
  const cell = row[column] ?? '';
  const match = PAIR_CELL.exec(cell.trim());
  // A bracket opened is closed: "(2, 180" is a cut cell.
  if (!match || (match[1] === undefined) !== (match[4] === undefined)) return null;
  const [first, second] = [match[2]!, match[3]!];
  const at = cellsAt?.[column] ?? null;
  const firstAt = cell.indexOf(first);
  const secondAt = cell.indexOf(second, firstAt + first.length);
  const located = (written: string, offset: number): NumberCell => ({
    comparator: '=',
    record: { ...parseReportedNumber(written.replace(',', '.'))!, start: at === null ? -1 : at.start + offset, end: at === null ? -1 : at.start + offset + written.length },
  });
  return [located(first, firstAt), located(second, secondAt)];
}

/** A df cell whose pair lost its comma to a copy: "1.23" for "1, 23" (see lostCommaColumn). */
const LOST_COMMA_DF = /^(\d{1,2})\.(\d{2,4})$/;

/**
 * Whether an F's df column holds pairs whose comma a copy turned into a point ("1.23", "2.46", "6.138",
 * "10.230" for "1, 23", "2, 46", …): every filled cell is a whole number, a point and two to four digits, at least
 * three of them, and the second numbers follow from the first as a repeated-measures or a between-subjects table
 * gives them (all the same multiple of the first: df2 = df1 × (n − 1); or all the same with the first varying).
 * The point cannot be a decimal point then: a column of corrected df does not keep such a ratio.
 */
function lostCommaColumn(rows: readonly string[][], column: number | undefined): boolean {
  if (column === undefined) return false;
  const pairs: [number, number][] = [];
  for (const row of rows) {
    const cell = (row[column] ?? '').trim();
    if (cell === '') continue;
    const match = LOST_COMMA_DF.exec(cell);
    if (match === null) return false;
    const [first, second] = [Number(match[1]), Number(match[2])];
    if (first < 1 || second <= first || match[2]!.startsWith('0')) return false;
    pairs.push([first, second]);
  }
  if (pairs.length < MIN_LOST_COMMA_ROWS) return false;
  const sameMultiple = pairs.every(([first, second]) => second % first === 0 && second / first === pairs[0]![1] / pairs[0]![0]);
  const sameError = pairs.every(([, second]) => second === pairs[0]![1]) && new Set(pairs.map(([first]) => first)).size > 1;
  return sameMultiple || sameError;
}

/** Fewest df cells that show the lost comma's pattern. */
const MIN_LOST_COMMA_ROWS = 3;

function lostCommaPair(row: string[], cellsAt: (LocatedCell | null)[] | null, column: number | undefined): [NumberCell, NumberCell] | null {
  if (column === undefined) return null;
  const cell = row[column] ?? '';
  const match = LOST_COMMA_DF.exec(cell.trim());
  if (match === null) return null;
  const at = cellsAt?.[column] ?? null;
  const firstAt = cell.indexOf(match[1]!);
  const secondAt = firstAt + match[1]!.length + 1;
  const located = (written: string, offset: number): NumberCell => ({
    comparator: '=',
    record: { ...parseReportedNumber(written)!, start: at === null ? -1 : at.start + offset, end: at === null ? -1 : at.start + offset + written.length },
  });
  return [located(match[1]!, firstAt), located(match[2]!, secondAt)];
}

const STATISTIC_WITH_DF = /^ *((?:[-\u2212\u2013] *)?(?:\d+(?:\.\d+)?|\.\d+))(?: ?(?:[*\u2020\u2021]{1,4}))? *[([] *(?:df ?= ?)?(\d{1,6}(?:\.\d+)?) *(?:[,;] *(\d{1,6}(?:\.\d+)?) *)?[)\]](?: *(?:[*\u2020\u2021]{1,4}|[a-h]))? *$/;

/**
 * A statistic cell that holds the df too: "4.842 (15)" in a column headed
 * "t value (df)", "7.16 (2, 42)" for an F. A bracketed number that cannot
 * be df (a decimal below 1, as in "6.81 (0.078)") is not read as one.
 */
function statisticWithDf(
  row: string[],
  cellsAt: (LocatedCell | null)[] | null,
  column: number | undefined,
  kind: StatisticKind,
  separator: DecimalSeparator,
  dfInCell: boolean,
): { statistic: NumberCell; df: NumberCell[] } | null {
  if (column === undefined || separator === ',') return null;
  const cell = row[column] ?? '';
  const match = STATISTIC_WITH_DF.exec(cell);
  if (!match) return null;
  const bracketed = [match[2], match[3]].filter((text): text is string => text !== undefined);
  // A chi-square has one df: a pair of whole numbers after it, the second the larger, is its df and its sample size,
  // as "χ2(1, N = 141)" prints them without the "N =" ("10.84(1, 141)"); the sample size is not a df. Otherwise a
  // one-df statistic's "(12,000)" is one df with its thousands set apart.
  const dfAndN = kind === 'chi2' && bracketed.length === 2 && bracketed.every((text) => /^\d+$/.test(text)) && Number(bracketed[1]) > Number(bracketed[0]);
  const dfTexts = dfAndN ? bracketed.slice(0, 1) : oneDfWithThousands([match[2], match[3]], cell, kind);
  if (dfTexts.length !== (kind === 'F' ? 2 : 1) || kind === 'z') return null;
  if (dfTexts.some((text) => Number(text.replace(THOUSANDS_COMMA, '')) < 1 || (!dfInCell && text.includes('.')))) return null;
  const at = cellsAt?.[column] ?? null;
  const valueText = match[1]!;
  const statisticRead = readCell(valueText, separator);
  if (statisticRead.kind !== 'number') return null;
  const valueAt = cell.indexOf(valueText);
  const statistic: NumberCell = {
    comparator: statisticRead.comparator,
    record: { ...statisticRead.number, start: at === null ? -1 : at.start + valueAt + statisticRead.start, end: at === null ? -1 : at.start + valueAt + statisticRead.end },
  };
  let from = valueAt + valueText.length;
  const df = dfTexts.map((text) => {
    const offset = cell.indexOf(text, from);
    from = offset + text.length;
    return { comparator: '=' as Comparator, record: { ...parseReportedNumber(text.replace(THOUSANDS_COMMA, ''))!, start: at === null ? -1 : at.start + offset, end: at === null ? -1 : at.start + offset + text.length } };
  });
  return { statistic, df };
}

function stripOffsets(record: ReportedNumber & Partial<LocatedCell>): ReportedNumber {
  return { value: record.value, text: record.text, decimals: record.decimals, exponent: record.exponent };
}

// ---------------------------------------------------- degrees of freedom

interface DfSources {
  dfCell: ReportedNumber | null;
  df1Cell: ReportedNumber | null;
  df2Cell: ReportedNumber | null;
  errorDf: ReportedNumber | null;
  labelDf: ReportedNumber[];
  headerDf: ReportedNumber[];
  titleDf1: ReportedNumber | null;
  noteDf: NoteDf;
  nCell: ReportedNumber | null;
  noteN: ReportedNumber | null;
}

const NO_NOTE_DF: NoteDf = { pair: [], single: null, error: null };

function sameNumbers(a: readonly ReportedNumber[], b: readonly ReportedNumber[] | null): boolean {
  return b !== null && a.length === b.length && a.every((number, index) => number.value === b[index]!.value);
}

/** df in order of closeness to the row: its own cells, the error row, its label, the column header, the table note. */
function degreesOfFreedom(kind: StatisticKind, sources: DfSources): ReportedNumber[] | null {
  const pairFrom = (list: ReportedNumber[]): [ReportedNumber | null, ReportedNumber | null] =>
    list.length === 2 ? [list[0]!, list[1]!] : [null, null];
  const [labelFirst, labelSecond] = pairFrom(sources.labelDf);
  const [headerFirst, headerSecond] = pairFrom(sources.headerDf);
  const [noteFirst, noteSecond] = pairFrom(sources.noteDf.pair);
  if (kind === 'F') {
    const df1 = sources.df1Cell ?? sources.dfCell ?? labelFirst ?? headerFirst ?? sources.titleDf1 ?? noteFirst;
    const df2 = sources.df2Cell ?? sources.errorDf ?? labelSecond ?? headerSecond ?? noteSecond ?? sources.noteDf.error;
    return df1 !== null && df2 !== null ? [stripOffsets(df1), stripOffsets(df2)] : null;
  }
  if (kind === 'z') return [];
  const single = (list: ReportedNumber[]): ReportedNumber | null => (list.length === 1 ? list[0]! : null);
  const fromN = (n: ReportedNumber | null): ReportedNumber | null =>
    n !== null && n.decimals === 0 && n.value > 2 ? { value: n.value - 2, text: String(n.value - 2), decimals: 0, exponent: 0 } : null;
  let df = sources.dfCell ?? sources.df1Cell ?? single(sources.labelDf) ?? single(sources.headerDf) ?? sources.noteDf.single;
  if (df === null && kind === 'r') df = fromN(sources.nCell) ?? fromN(sources.noteN);
  return df === null ? null : [stripOffsets(df)];
}

/**
 * A bracketed df written after a statistic symbol in a row label: "effect on recall, F(1, 170)", or named as df:
 * "Group (df = 2, 57)".
 */
const LABEL_DF = /(?:(?:^|[^a-z])(?:f|t|r|chi2|chi-square|x2)\s*\(\s*(?:df\s*=\s*)?|\(\s*(?:df|d\.f\.)\s*=\s*)(\d+(?:\.\d+)?)\s*(?:[,;/]\s*(\d+(?:\.\d+)?)\s*)?\)/i;

function readLabelDf(label: string): ReportedNumber[] {
  if (label.length > 200) return [];
  const match = LABEL_DF.exec(normaliseText(label).text);
  if (!match) return [];
  return [match[1], match[2]].filter((text): text is string => text !== undefined).map((text) => parseReportedNumber(text)!);
}

function readNoteSampleSize(note: string): ReportedNumber | null {
  // (A full stop may end the note's sentence right after the number, "N = 120."; a decimal is no sample size.)
  const match = /(?:^|[^A-Za-z])N\s*=\s*(\d{1,3}(?:,\d{3})+|\d+)(?!\d|[.,]\d)/.exec(note.slice(0, 2000));
  return match ? parseReportedNumber(match[1]!.replace(/,/g, '')) : null;
}

// ------------------------------------------------------ df a note states with an exception

/** Whether `name` (a block's title or a row's label) is the one a note's exception names. */
function namesException(name: string, exception: NoteDfException): boolean {
  const written = effectNameKey(name);
  if (exception.wholeName) return written.length >= 3 && bareEffectName(written) === bareEffectName(exception.name);
  return written.length >= 3 && (written.includes(exception.name) || exception.name.includes(written));
}

/**
 * A note's df with exceptions ("d.f. = 1,28 except for daily sperm production … d.f. = 1,27") kept only when
 * every exception names a block or a row of the table (`names`); otherwise which tests take which pair cannot be
 * told, and the note gives no pair at all.
 */
function withNamedExceptions(noteDf: NoteDf, names: readonly string[]): NoteDf {
  if (noteDf.exceptions === undefined) return noteDf;
  const named = noteDf.exceptions.every((exception) => names.some((name) => namesException(name, exception)));
  return named ? noteDf : withoutNotePairs(noteDf);
}

/**
 * The test a footnote letter on a row's statistic or p names ("1.573 321 0.117a" over "(a) p for t-test"):
 * undefined when neither carries a letter the notes define as a test; null when the letter names a test we do not
 * check (Fisher's exact test, Mann-Whitney) or more than one.
 */
function rowTestByFootnote(row: readonly string[], segment: Segment, footnoteTests: Map<string, StatisticKind | null>): StatisticKind | null | undefined {
  if (footnoteTests.size === 0) return undefined;
  for (const role of ['statistic', 'p'] as const) {
    const column = segment.columns.get(role);
    const letter = column === undefined ? undefined : /\d ?([a-h])$/.exec((row[column] ?? '').trim())?.[1];
    if (letter !== undefined && footnoteTests.has(letter)) return footnoteTests.get(letter)!;
  }
  return undefined;
}

/** "0.80a", "0.80 a", "χ2a": a cell or header ending in the footnote marker `mark` after a digit. */
function endsWithMark(cell: string, mark: string): boolean {
  const trimmed = cell.trim();
  if (!trimmed.endsWith(mark)) return false;
  const before = trimmed.slice(0, trimmed.length - mark.length).trimEnd();
  return /\d$/.test(before);
}

/** A note's df without the pair and single df it states (a footnote's, for a cell without its marker). */
function withoutNotePairs(noteDf: NoteDf): NoteDf {
  return { pair: [], single: null, error: noteDf.error, ...(noteDf.besideTable ? { besideTable: true } : {}) };
}

/** The note's df for a test in the block titled, or the row labelled, as `names` say: an exception's pair where one names it. */
function noteDfFor(noteDf: NoteDf, names: readonly string[]): NoteDf {
  if (noteDf.exceptions === undefined) return noteDf;
  // (The name written the same first, then the longest one within: "Group x Time" is not "Group".)
  const keys = names.map(effectNameKey);
  const exception =
    noteDf.exceptions.find((candidate) => keys.includes(candidate.name)) ??
    [...noteDf.exceptions].sort((a, b) => b.name.length - a.name.length).find((candidate) => names.some((name) => namesException(name, candidate)));
  const { exceptions: _, ...rest } = noteDf;
  return exception === undefined ? rest : { ...rest, pair: exception.pair };
}

// ------------------------------------------------------ locating the cells

/**
 * Finds each data row's cells in the text: the row's line is the next line of
 * the table holding all its non-empty cells in order, each standing apart
 * from neighbouring digits and letters. Rows not found get null.
 */
function locateRows(text: string, table: DocumentTable, headerCount: number): ((LocatedCell | null)[] | null)[] {
  const lines: LocatedCell[] = [];
  for (let start = table.start; start <= table.end; ) {
    let end = text.indexOf('\n', start);
    if (end === -1 || end > table.end) end = table.end;
    lines.push({ start, end });
    start = end + 1;
  }
  const located: ((LocatedCell | null)[] | null)[] = table.rows.map(() => null);
  // Where the last row found ends: the next row may go on in the same line (several rows run onto one line).
  let nextLine = 0;
  let nextFrom = 0;
  for (let index = headerCount; index < table.rows.length; index++) {
    const row = table.rows[index]!;
    for (let line = nextLine; line < lines.length && line < nextLine + 8; line++) {
      const from = line === nextLine ? nextFrom : 0;
      const cells = matchRow(text, lines[line]!, row, from) ?? matchWithLabelAbove(text, lines, line, row) ?? (table.layout === 'crushed' ? matchRowOverLines(text, lines, line, row, from) : null);
      if (cells !== null) {
        located[index] = cells;
        const last = cells.filter((cell): cell is LocatedCell => cell !== null).pop()!;
        // (A row wrapped over lines ends on a later line than it starts.)
        let lastLine = line;
        while (lastLine + 1 < lines.length && lines[lastLine]!.end < last.end) lastLine++;
        nextLine = lastLine;
        nextFrom = last.end - lines[lastLine]!.start;
        break;
      }
    }
  }
  return located;
}

/** A row whose label stands alone on the line above its values (a non-blank line, one blank line between allowed). */
function matchWithLabelAbove(text: string, lines: LocatedCell[], line: number, row: string[]): (LocatedCell | null)[] | null {
  const label = (row[0] ?? '').trim();
  if (label === '') return null;
  let above = line - 1;
  if (above >= 0 && text.slice(lines[above]!.start, lines[above]!.end).trim() === '') above--;
  if (above < 0) return null;
  const aboveText = text.slice(lines[above]!.start, lines[above]!.end);
  // A label the page wrapped: its first words on the line above, the rest before the values ("1. SPAS a" / "Total
  // Score - - -"); the label's cell runs from the line above into this one.
  const wrappedHead = aboveText.trim();
  if (wrappedHead !== '' && label.length > wrappedHead.length + 1 && label.startsWith(`${wrappedHead} `)) {
    const rest = matchRow(text, lines[line]!, [label.slice(wrappedHead.length + 1), ...row.slice(1)]);
    if (rest === null || rest[0] === null || rest[0]!.start !== lines[line]!.start + leadingSpaces(text, lines[line]!)) return null;
    const headStart = lines[above]!.start + aboveText.indexOf(wrappedHead);
    return [{ start: headStart, end: rest[0]!.end }, ...rest.slice(1)];
  }
  if (aboveText.trim() !== label) return null;
  const values = matchRow(text, lines[line]!, ['', ...row.slice(1)]);
  if (values === null) return null;
  const labelStart = lines[above]!.start + aboveText.indexOf(label);
  return [{ start: labelStart, end: labelStart + label.length }, ...values.slice(1)];
}

/** How many spaces and tabs open a line. */
function leadingSpaces(text: string, line: LocatedCell): number {
  let at = line.start;
  while (at < line.end && (text.charCodeAt(at) === 32 || text.charCodeAt(at) === 9)) at++;
  return at - line.start;
}

/** Most lines a crushed row's wrapped cells are looked for over (as findTextTables joins them). */
const MAX_ROW_LINES = 12;

/**
 * A crushed row whose cells a page wrapped over lines ("Week –1.24" / "(–1.28 to" / "–1.20)" / "56.79 (9682) <.001"):
 * its cells in the fewest lines from `first` on, read with their line breaks as spaces (offsets kept), its first
 * cell on the first of them.
 */
function matchRowOverLines(text: string, lines: LocatedCell[], first: number, row: string[], from: number): (LocatedCell | null)[] | null {
  const firstLine = lines[first]!;
  for (let last = first + 1; last < lines.length && last - first < MAX_ROW_LINES; last++) {
    const span = { start: firstLine.start, end: lines[last]!.end };
    const cells = matchRowIn(text.slice(span.start, span.end).replace(/[\r\n]/g, ' '), span, row, from);
    if (cells === null) continue;
    const firstCell = cells.find((cell): cell is LocatedCell => cell !== null);
    return firstCell !== undefined && firstCell.end <= firstLine.end ? cells : null;
  }
  return null;
}

function matchRow(text: string, line: LocatedCell, row: string[], start = 0): (LocatedCell | null)[] | null {
  return matchRowIn(text.slice(line.start, line.end), line, row, start);
}

/** The cells of `row` in order in `lineText`, the text of `line`; null unless every non-empty cell is found. */
function matchRowIn(lineText: string, line: LocatedCell, row: string[], start = 0): (LocatedCell | null)[] | null {
  const cells: (LocatedCell | null)[] = [];
  let from = start;
  let any = false;
  for (const cell of row) {
    const wanted = cell.trim();
    if (wanted === '') {
      cells.push(null);
      continue;
    }
    const at = findStandalone(lineText, wanted, from);
    if (at === -1) return null;
    cells.push({ start: line.start + at, end: line.start + at + wanted.length });
    from = at + wanted.length;
    any = true;
  }
  return any ? cells : null;
}

function isWordCharacter(code: number): boolean {
  return (code >= 48 && code <= 57) || (code >= 65 && code <= 90) || (code >= 97 && code <= 122) || code === 46;
}

/** First occurrence of `wanted` in `line` at or after `from`, not glued to digits, letters or a decimal point. */
function findStandalone(line: string, wanted: string, from: number): number {
  const startsWord = isWordCharacter(wanted.charCodeAt(0));
  const endsWord = isWordCharacter(wanted.charCodeAt(wanted.length - 1));
  for (let at = line.indexOf(wanted, from); at !== -1; at = line.indexOf(wanted, at + 1)) {
    const before = at > 0 ? line.charCodeAt(at - 1) : 32;
    const after = at + wanted.length < line.length ? line.charCodeAt(at + wanted.length) : 32;
    if ((!startsWord || !isWordCharacter(before)) && (!endsWord || !isWordCharacter(after))) return at;
  }
  return -1;
}

/** From the start of the row label (or first cell) to the end of the last non-empty cell. */
function spanOfRow(row: string[], cellsAt: (LocatedCell | null)[]): LocatedCell | null {
  const present = cellsAt.filter((cell): cell is LocatedCell => cell !== null);
  if (present.length === 0) return null;
  return { start: present[0]!.start, end: present[present.length - 1]!.end };
}
