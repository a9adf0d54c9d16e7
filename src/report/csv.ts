import { stringify } from 'csv-stringify/sync';
import type { DocumentOutput, FindingOutput, Report, StatisticOutput } from './model.js';
import { visibleControls, visibleLine } from './visible.js';
import { noResultsMessage } from './wording.js';

/**
 * The CSV report: one row per result (flagged or not) for spreadsheets and
 * statistics software, plus one row per finding about a document as a whole,
 * one row per results table that was not read in full (with the reason), one
 * row for a document in which no result was found, and one row per
 * unreadable document. Numeric columns hold plain numbers (or nothing);
 * text cells that a spreadsheet would run as a formula are neutralised, and
 * control characters in any text cell (a document's text, a file name) are
 * written as visible escapes (src/report/visible.ts), since a CSV is also
 * read in a terminal.
 * Comparators are written as words ("equals", "below", ...), since a cell
 * holding a bare "=" would itself be taken for the start of a formula.
 */

type Severity = FindingOutput['severity'];
const SEVERITY_RANK: Record<Severity, number> = { fail: 3, warn: 2, note: 1 };

/** What a row stands for (the `row` column). */
export type CsvRowKind = 'result' | 'document finding' | 'table not read' | 'no results' | 'unreadable';

/** The columns, in order. Numeric columns are marked so that they are never neutralised. */
export const CSV_COLUMNS = [
  { name: 'row', numeric: false },
  { name: 'document', numeric: false },
  { name: 'status', numeric: false },
  { name: 'format', numeric: false },
  { name: 'alpha', numeric: true },
  { name: 'page', numeric: true },
  { name: 'line', numeric: true },
  { name: 'column', numeric: true },
  { name: 'kind', numeric: false },
  // "H" (Kruskal-Wallis, kind chi2) or "rs" (Spearman, kind r): the symbol written when it is not the kind's own.
  { name: 'symbol', numeric: false },
  { name: 'result text', numeric: false },
  { name: 'df1', numeric: true },
  { name: 'df2', numeric: true },
  { name: 'statistic comparator', numeric: false },
  { name: 'statistic', numeric: true },
  { name: 'reported p comparator', numeric: false },
  { name: 'reported p', numeric: true },
  { name: 'reported p as printed', numeric: false },
  { name: 'recomputed p', numeric: true },
  { name: 'recomputed p low', numeric: true },
  { name: 'recomputed p high', numeric: true },
  { name: 'tails', numeric: false },
  { name: 'effect sizes', numeric: false },
  { name: 'checked', numeric: false },
  { name: 'worst severity', numeric: false },
  { name: 'rules', numeric: false },
  { name: 'changes conclusion', numeric: false },
  { name: 'messages', numeric: false },
  { name: 'note', numeric: false },
] as const;

export type CsvColumn = (typeof CSV_COLUMNS)[number]['name'];
type Cell = string | number | null;
type Row = Partial<Record<CsvColumn, Cell>>;

const FORMULA_START = /^[=+\-@\t\r]/;

/**
 * Makes a text cell safe to open in a spreadsheet: a cell starting with
 * =, +, -, @, a tab or a carriage return would be read as a formula, so it
 * gets a leading single quote.
 */
export function neutraliseCell(text: string): string {
  return FORMULA_START.test(text) ? `'${text}` : text;
}

/** The CSV note for df that were worked out rather than printed. */
const DF_FROM_NOTES: Record<NonNullable<StatisticOutput['dfFrom']>, string> = {
  'sample-size': 'df worked out from the sample size written after the result',
  'study-sample-size': "df worked out from the study's stated sample size, which may not apply to this test",
  'contingency-table': 'df worked out from the table dimensions stated with the chi-square',
  'levene-two-groups': "df of Levene's test for two groups: 1 and the pooled t test's df in the same row",
  'text-beside-table': 'df stated in the text beside the table, not in the table, its caption or its notes',
};

type Comparator = StatisticOutput['valueComparator'];
const COMPARATOR_WORDS: Record<Comparator, string> = { '=': 'equals', '<': 'below', '>': 'above', '<=': 'at most', '>=': 'at least' };

/** The word written in the comparator columns for each comparator. */
export function comparatorWord(comparator: Comparator): string {
  return COMPARATOR_WORDS[comparator];
}

function worstSeverity(findings: readonly FindingOutput[]): Severity | null {
  let worst: Severity | null = null;
  for (const finding of findings) if (worst === null || SEVERITY_RANK[finding.severity] > SEVERITY_RANK[worst]) worst = finding.severity;
  return worst;
}

function finite(value: number | null | undefined): number | null {
  return value === null || value === undefined || !Number.isFinite(value) ? null : value;
}

function percent(level: number): number {
  return level <= 1 ? Math.round(level * 10000) / 100 : level;
}

/** "kind=value; kind<value [95% CI low, high]; ..." */
function effectsCell(statistic: StatisticOutput): string {
  return statistic.effects
    .map((effect) => {
      const interval = effect.interval
        ? ` [${effect.interval.level === null ? '' : `${percent(effect.interval.level)}% `}CI ${effect.interval.low}, ${effect.interval.high}]`
        : '';
      return `${effect.kind}${effect.comparator}${effect.value}${interval}`;
    })
    .join('; ');
}

function findingColumns(findings: readonly FindingOutput[]): Row {
  if (findings.length === 0) return { 'worst severity': '', rules: '', 'changes conclusion': 'false', messages: '' };
  return {
    'worst severity': worstSeverity(findings) ?? '',
    rules: [...new Set(findings.map((f) => f.rule))].join('; '),
    'changes conclusion': findings.some((f) => f.crossesAlpha) ? 'true' : 'false',
    messages: findings.map((f) => `${f.severity} ${f.rule}: ${visibleLine(f.message)}`).join(' | '),
  };
}

function documentColumns(document: DocumentOutput): Row {
  return {
    document: document.path,
    status: document.status,
    format: document.format ?? '',
    alpha: finite(document.alpha),
  };
}

function resultRow(document: DocumentOutput, statistic: StatisticOutput): Row {
  const rec = statistic.recomputed;
  return {
    row: 'result',
    ...documentColumns(document),
    page: statistic.location.page,
    line: statistic.location.line,
    column: statistic.location.column,
    kind: statistic.kind,
    symbol: statistic.symbol ?? '',
    'result text': visibleLine(statistic.text),
    df1: finite(statistic.df[0]),
    df2: finite(statistic.df[1]),
    'statistic comparator': comparatorWord(statistic.valueComparator),
    statistic: finite(statistic.value),
    'reported p comparator': statistic.p ? comparatorWord(statistic.p.comparator) : '',
    'reported p': finite(statistic.p?.value),
    'reported p as printed': statistic.p?.text ?? '',
    'recomputed p': finite(rec.p),
    'recomputed p low': finite(rec.pLow),
    'recomputed p high': finite(rec.pHigh),
    tails: rec.evaluable ? rec.tails : '',
    'effect sizes': effectsCell(statistic),
    checked: rec.evaluable ? 'true' : 'false',
    ...findingColumns(statistic.findings),
    note: rec.evaluable ? (statistic.dfFrom ? DF_FROM_NOTES[statistic.dfFrom] : '') : visibleLine(rec.reason ?? ''),
  };
}

function documentRows(document: DocumentOutput): Row[] {
  if (document.status === 'unreadable') {
    return [{ row: 'unreadable', ...documentColumns(document), note: visibleLine(document.error ?? '') }];
  }
  const rows = document.statistics.map((s) => resultRow(document, s));
  for (const finding of document.findings) rows.push({ row: 'document finding', ...documentColumns(document), ...findingColumns([finding]) });
  for (const table of document.tablesNotRead) {
    rows.push({
      row: 'table not read',
      ...documentColumns(document),
      page: table.location.page,
      line: table.location.line,
      column: table.location.column,
      'result text': visibleLine(table.caption ?? ''),
      checked: 'false',
      note: visibleLine(table.message),
    });
  }
  if (document.statistics.length === 0 && document.findings.length === 0) rows.push({ row: 'no results', ...documentColumns(document), note: noResultsMessage(document) ?? '' });
  return rows;
}

function cellValue(row: Row, column: (typeof CSV_COLUMNS)[number]): string | number {
  const value = row[column.name];
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return column.numeric ? value : neutraliseCell(String(value));
  // Made visible before the formula check: a cell that started with a tab or a carriage return now starts with a backslash.
  return neutraliseCell(visibleControls(value));
}

/** The CSV report: a header row, then one row per result (see CsvRowKind for the other rows). */
export function formatCsv(report: Report): string {
  const records = report.documents.flatMap(documentRows).map((row) => CSV_COLUMNS.map((column) => cellValue(row, column)));
  return stringify([CSV_COLUMNS.map((c) => c.name), ...records], {
    cast: { number: (value) => String(value) },
    record_delimiter: 'unix',
  });
}
