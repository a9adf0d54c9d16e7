import { stringify } from 'csv-stringify/sync';
import type { DocumentOutput, FindingOutput, Report, StatisticOutput, StreamedReport } from './model.js';
import { visibleControls, visibleLine } from './visible.js';
import { noResultsMessage } from './wording.js';
import { verdictOf, VERDICTS, worstSeverity } from './verdict.js';

/**
 * The CSV report: one row per result (flagged or not) for spreadsheets and
 * statistics software, its columns in the order a reviewer reads a result
 * (CSV_COLUMNS: where, what was printed, what plumbline recomputed, the
 * verdict, why; their JSON Schema is schema/report-csv.schema.json),
 * plus one row per finding about a document as a whole,
 * one row per results table that was not read in full (with the reason), one
 * row for a document in which no result was found, and one row per
 * unreadable document. Numeric columns hold plain numbers (or nothing);
 * text cells that a spreadsheet would run as a formula are neutralised, and
 * control characters in any text cell (a document's text, a file name) are
 * written as visible escapes (src/report/visible.ts), since a CSV is also
 * read in a terminal.
 * A printed p is written with its letter ("p = .021", "p < .001"), so no
 * cell starts with a bare "=" that a spreadsheet would take for a formula.
 */

/** What a row stands for (the `row` column). */
export type CsvRowKind = 'result' | 'document finding' | 'table not read' | 'no results' | 'unreadable';
export const CSV_ROW_KINDS: readonly CsvRowKind[] = ['result', 'document finding', 'table not read', 'no results', 'unreadable'];

/** The verdict on a result (the `verdict` column): its worst finding's severity, or why it has none (verdict.ts). */
export const CSV_VERDICTS = VERDICTS;

interface CsvColumnDefinition {
  name: string;
  /** The part of a reviewer's reading the column belongs to. */
  group: 'where' | 'printed' | 'recomputed' | 'verdict' | 'why' | 'document';
  /** Numeric columns hold a plain number or nothing, and are never neutralised. */
  numeric: boolean;
  /** The words a text column may hold, when it is one of a few. */
  values?: readonly string[];
  description: string;
}

/**
 * The columns, in the order a reviewer reads a result: where it is, what was
 * printed, what plumbline recomputed (with the interval over the values that
 * round to the printed ones), the verdict, and why. The document's own
 * details (its format, its alpha) close the row.
 */
export const CSV_COLUMNS = [
  { name: 'row', group: 'where', numeric: false, values: CSV_ROW_KINDS, description: 'What the row stands for: a result, a finding about the document as a whole, a results table not read in full, a document in which no result was found, or an unreadable document.' },
  { name: 'document', group: 'where', numeric: false, description: 'The document, named relative to the folder the audit was run from.' },
  { name: 'page', group: 'where', numeric: true, description: '1-based page, for formats with pages.' },
  { name: 'line', group: 'where', numeric: true, description: '1-based line of the result (of the text plumbline extracted, for PDF, DOCX, HTML and JATS).' },
  { name: 'column', group: 'where', numeric: true, description: '1-based column of the result.' },
  { name: 'in', group: 'where', numeric: false, values: ['text', 'table', ''], description: '"text" for a result read from running text, "table" for one read from a row of a table.' },
  { name: 'printed', group: 'printed', numeric: false, description: 'The result as printed (for a table not read: its caption).' },
  { name: 'test', group: 'printed', numeric: false, description: 'F, t, chi2, r or z; "H (chi2)" for a Kruskal-Wallis H tested as chi-square, "rs (r)" for Spearman\'s rank correlation.' },
  { name: 'df', group: 'printed', numeric: false, description: 'The degrees of freedom, "2, 57"; "88 (from n)" and the like when they were worked out rather than printed (see note).' },
  { name: 'statistic', group: 'printed', numeric: true, description: 'The printed statistic\'s value (a bound when it was printed with < or >, see printed).' },
  { name: 'p as printed', group: 'printed', numeric: false, description: 'The printed p with its comparator, "p = .021", "p < .001"; empty when no p was printed.' },
  { name: 'p', group: 'printed', numeric: true, description: 'The printed p as a number (the bound for "p < .001").' },
  { name: 'effect sizes', group: 'printed', numeric: false, description: 'Printed effect sizes, "kind=value [95% CI low, high]; ...".' },
  { name: 'recomputed p', group: 'recomputed', numeric: true, description: 'p recomputed from the printed statistic and df.' },
  { name: 'recomputed p low', group: 'recomputed', numeric: true, description: 'Smallest p over the values that round to the printed statistic and df.' },
  { name: 'recomputed p high', group: 'recomputed', numeric: true, description: 'Largest p over the values that round to the printed statistic and df.' },
  { name: 'tails', group: 'recomputed', numeric: false, values: ['upper', 'two', ''], description: 'The tails of the recomputed p.' },
  { name: 'row implies F', group: 'recomputed', numeric: true, description: 'For a table row that does not add up: the F its own SS and df (or MS) imply over its error row.' },
  { name: 'row implies p', group: 'recomputed', numeric: true, description: 'The p of that F at the result\'s df.' },
  { name: 'verdict', group: 'verdict', numeric: false, values: [...CSV_VERDICTS, ''], description: 'The worst severity among the row\'s findings; "no flag" for a result checked without findings, "not checked" for one that could not be recomputed.' },
  { name: 'changes the conclusion', group: 'verdict', numeric: false, values: ['yes', 'no', ''], description: '"yes" when a finding\'s discrepancy puts the p on the other side of the document\'s alpha.' },
  { name: 'p off by', group: 'verdict', numeric: false, values: ['last-digit', 'moderate', 'order-of-magnitude', ''], description: 'How large a p discrepancy is (see pDiscrepancy in the JSON report).' },
  { name: 'rules', group: 'verdict', numeric: false, description: 'The rules that flagged the row, "; " between them.' },
  { name: 'why', group: 'why', numeric: false, description: 'Each finding as "severity rule: message", " | " between them.' },
  { name: 'slip', group: 'why', numeric: false, description: 'A simple slip that reproduces the printed numbers, when one was found.' },
  { name: 'note', group: 'why', numeric: false, description: 'How the df were worked out, why a result was not checked, why a table was not read, why a document has no result, or why it could not be read.' },
  { name: 'format', group: 'document', numeric: false, description: 'The document\'s format (txt, pdf, docx, ...).' },
  { name: 'alpha', group: 'document', numeric: true, description: 'The alpha used for the document (declared in it, or the default).' },
] as const satisfies readonly CsvColumnDefinition[];

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

const DF_FROM_SHORT: Record<NonNullable<StatisticOutput['dfFrom']>, string> = {
  'sample-size': 'from n',
  'study-sample-size': "from the study's N",
  'contingency-table': 'from the table',
  'levene-two-groups': "Levene's, two groups",
  'text-beside-table': 'from the text beside the table',
};

function findingColumns(findings: readonly FindingOutput[]): Row {
  const discrepancy = findings.find((f) => f.pDiscrepancy)?.pDiscrepancy;
  const slips = [...new Set(findings.map((f) => f.slip).filter((slip): slip is string => slip !== undefined))];
  return {
    verdict: worstSeverity(findings) ?? '',
    'changes the conclusion': findings.some((f) => f.crossesAlpha) ? 'yes' : 'no',
    'p off by': discrepancy?.size ?? '',
    rules: [...new Set(findings.map((f) => f.rule))].join('; '),
    why: findings.map((f) => `${f.severity} ${f.rule}: ${visibleLine(f.message)}`).join(' | '),
    slip: slips.map(visibleLine).join('; '),
  };
}

function documentColumns(document: DocumentOutput): Row {
  return {
    document: document.path,
    format: document.format ?? '',
    alpha: finite(document.alpha),
  };
}

function testName(statistic: StatisticOutput): string {
  return statistic.symbol ? `${statistic.symbol} (${statistic.kind})` : statistic.kind;
}

function dfCell(statistic: StatisticOutput): string {
  const df = statistic.df.map((value) => String(value)).join(', ');
  return df !== '' && statistic.dfFrom ? `${df} (${DF_FROM_SHORT[statistic.dfFrom]})` : df;
}

function resultRow(document: DocumentOutput, statistic: StatisticOutput): Row {
  const rec = statistic.recomputed;
  const implied = statistic.findings.find((f) => f.rowImplies)?.rowImplies;
  const verdict = statistic.findings.length > 0 ? findingColumns(statistic.findings) : { verdict: verdictOf(statistic), 'changes the conclusion': 'no' };
  return {
    row: 'result',
    ...documentColumns(document),
    page: statistic.location.page,
    line: statistic.location.line,
    column: statistic.location.column,
    in: statistic.inTable ? 'table' : 'text',
    printed: visibleLine(statistic.text),
    test: testName(statistic),
    df: dfCell(statistic),
    statistic: finite(statistic.value),
    'p as printed': statistic.p ? `p ${statistic.p.comparator} ${visibleLine(statistic.p.text)}` : '',
    p: finite(statistic.p?.value),
    'effect sizes': effectsCell(statistic),
    'recomputed p': finite(rec.p),
    'recomputed p low': finite(rec.pLow),
    'recomputed p high': finite(rec.pHigh),
    tails: rec.evaluable ? rec.tails : '',
    'row implies F': finite(implied?.statistic),
    'row implies p': finite(implied?.p),
    ...verdict,
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
      in: 'table',
      printed: visibleLine(table.caption ?? ''),
      verdict: 'not checked',
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
  return [...csvPieces({ caution: report.caution, summary: report.summary, documents: () => report.documents })].join('');
}

const CSV_OPTIONS = { cast: { number: (value: number) => String(value) }, record_delimiter: 'unix' } as const;

/** The CSV report a piece at a time: the header row, then each document's rows. */
export function* csvPieces(report: StreamedReport): Iterable<string> {
  yield stringify([CSV_COLUMNS.map((c) => c.name)], CSV_OPTIONS);
  for (const document of report.documents()) {
    const records = documentRows(document).map((row) => CSV_COLUMNS.map((column) => cellValue(row, column)));
    if (records.length > 0) yield stringify(records, CSV_OPTIONS);
  }
}
