import { z } from 'zod';
import type { CheckModule, FindingDraft, RowImplies } from '../types.js';
import type { ReportedNumber, ReportedResult, TableRowOrigin } from '../../scan/types.js';
import { roundingInterval } from '../../stats/reportedNumber.js';
import { fUpperTail } from '../../stats/index.js';
import { formatRange, formatValue } from '../format.js';
import { crossesAlpha, printedSignificance, recomputedSignificance } from '../pAgreement.js';
import { dfInterval, type Interval } from '../recompute.js';

const optionsSchema = z.object({}).strict();

type Cells = TableRowOrigin['cells'];

/**
 * A row of an ANOVA table checked against itself and its error row, with
 * every printed number standing for the interval that rounds to it:
 * MS = SS / df (effect row and error row), F = MS / MS error, and partial eta
 * squared = SS / (SS + SS error). p from F and df, and partial eta squared
 * from F and df, are checked by p-value-mismatch and partial-eta-squared-mismatch.
 */
export const tableArithmetic: CheckModule<z.infer<typeof optionsSchema>> = {
  id: 'table-arithmetic',
  appliesTo: ['F'],
  optionsSchema,
  messages: {
    msMismatch: "In {table}, row '{row}': MS = {ms} but SS / df = {ss} / {df} = {recomputed} ({range} allowing for rounding).",
    fMismatch:
      "In {table}, row '{row}': F = {f} but MS / MS of '{errorRow}' = {msEffect} / {msError} = {recomputed} ({range} allowing for rounding).",
    partialEtaMismatch:
      "In {table}, row '{row}': partial eta squared = {eta} but SS / (SS + SS of '{errorRow}') = {ss} / ({ss} + {ssError}) = {recomputed} ({range} allowing for rounding).",
  },
  run(result, context) {
    const origin = result.tableRow;
    if (!origin) return [];
    const table = tableName(origin);
    const findings: FindingDraft[] = [];
    const effectMs = checkMeanSquare(origin.cells, table, origin.rowLabel);
    if (effectMs) {
      const implied = origin.errorRow ? rowImplies(result, origin, origin.errorRow) : null;
      findings.push(implied ? { ...effectMs, rowImplies: implied } : effectMs);
    }
    const error = origin.errorRow;
    // The error row is shared by several effects: its own arithmetic is reported once, with the first of them.
    if (error && context.documentIndex.firstWithErrorRow(result)) {
      const errorMs = checkMeanSquare(error.cells, table, error.rowLabel);
      if (errorMs) findings.push(errorMs);
    }
    if (error) {
      const f = checkF(result, origin, table, error, context.alpha);
      if (f) {
        const implied = rowImplies(result, origin, error);
        findings.push(implied ? { ...f, rowImplies: implied } : f);
      }
      const eta = checkPartialEta(origin, table, error);
      if (eta) findings.push(eta);
    }
    return findings;
  },
};

/** "Table 2" from a caption "Table 2. Analysis of variance ...", else "table 3" by position. */
function tableName(origin: TableRowOrigin): string {
  const match = origin.caption === null ? null : /^\s*(Table\s+[A-Z]?\d+[A-Za-z]?)/i.exec(origin.caption);
  return match ? match[1]!.replace(/\s+/g, ' ') : `table ${origin.tableIndex + 1}`;
}

const SLACK = 1e-9;

function overlaps(a: Interval, b: Interval): boolean {
  const slack = SLACK * Math.max(1, Math.abs(a.high), Math.abs(b.high));
  return a.low <= b.high + slack && b.low <= a.high + slack;
}

/** Interval of a printed value that cannot be negative (SS, MS, F). */
function nonNegative(number: ReportedNumber): Interval | null {
  if (!(number.value >= 0)) return null;
  const { low, high } = roundingInterval(number);
  return { low: Math.max(0, low), high };
}

/**
 * A printed number within a twentieth of a percent of what the table's other cells give: a last digit
 * carried from unrounded values (an F computed before the mean squares were rounded), not a mistyped cell.
 * Reported as a warning rather than a failure (common practice: software computes each column from
 * unrounded values, so the printed cells need not reproduce each other exactly).
 */
const NEAR_MISS = 0.0005;

function nearMiss(printed: Interval, recomputed: Interval): boolean {
  const gap = Math.max(recomputed.low - printed.high, printed.low - recomputed.high, 0);
  return gap <= NEAR_MISS * Math.max(Math.abs(recomputed.low), Math.abs(recomputed.high));
}

/** a / b over the intervals; null when b may be zero. */
function divide(a: Interval, b: Interval): Interval | null {
  if (!(b.low > 0)) return null;
  return { low: a.low / b.high, high: a.high / b.low };
}

/** Printed with the decimals of the number it is compared with (at least two). */
function likePrinted(value: number, printed: ReportedNumber): string {
  const text = value.toFixed(Math.max(2, printed.decimals));
  // ".13" is printed without its leading zero; the recomputed value follows suit.
  return printed.text.startsWith('.') || printed.text.startsWith('-.') ? text.replace(/^(-?)0\./, '$1.') : text;
}

/** The interval of a number whose last printed decimal is 0, read at one decimal fewer; null otherwise. */
function withoutPaddingZero(number: ReportedNumber): Interval | null {
  if (number.decimals < 2 || number.exponent !== 0 || !number.text.endsWith('0')) return null;
  return nonNegative({ ...number, text: number.text.slice(0, -1), decimals: number.decimals - 1 });
}

function rowDf(cells: Cells): ReportedNumber | undefined {
  return cells.df ?? cells.df1;
}

/**
 * The intervals MS may stand for: the printed MS and SS / df. When they
 * disagree the MS check reports it, and F is accepted against either, so a
 * single mistyped cell gives a single finding.
 */
function meanSquares(cells: Cells): Interval[] {
  const printed = cells.ms ? nonNegative(cells.ms) : null;
  const df = rowDf(cells);
  const fromSs = cells.ss && df && df.value > 0 ? divideSs(cells.ss, df) : null;
  return [printed, fromSs].filter((interval): interval is Interval => interval !== null);
}

/** MS at the printed numbers: the printed MS, else SS / df. */
function msValue(cells: Cells): number {
  if (cells.ms) return cells.ms.value;
  return (cells.ss?.value ?? NaN) / (rowDf(cells)?.value ?? NaN);
}

function divideSs(ss: ReportedNumber, df: ReportedNumber): Interval | null {
  const ssInterval = nonNegative(ss);
  return ssInterval ? divide(ssInterval, dfInterval(df)) : null;
}

function checkMeanSquare(cells: Cells, table: string, row: string): FindingDraft | null {
  const df = rowDf(cells);
  if (!cells.ss || !cells.ms || !df || !(df.value > 0)) return null;
  const ms = nonNegative(cells.ms);
  const recomputed = divideSs(cells.ss, df);
  if (!ms || !recomputed || overlaps(ms, recomputed)) return null;
  // A last decimal of 0 may be padding ("0.260" for a mean square rounded to 0.26, the column printed to three
  // places): the cell is also taken at one place fewer before it is flagged.
  const padded = withoutPaddingZero(cells.ms);
  if (padded !== null && overlaps(padded, recomputed)) return null;
  return {
    messageId: 'msMismatch',
    ...(nearMiss(ms, recomputed) ? { severityAtMost: 'warn' as const } : {}),
    data: {
      table,
      row,
      ms: cells.ms.text,
      ss: cells.ss.text,
      df: df.text,
      recomputed: likePrinted(cells.ss.value / df.value, cells.ms),
      range: formatRange(recomputed.low, recomputed.high, (v) => formatValue(v)),
    },
  };
}

function checkF(
  result: ReportedResult,
  origin: TableRowOrigin,
  table: string,
  error: NonNullable<TableRowOrigin['errorRow']>,
  alpha: number,
): FindingDraft | null {
  const f = origin.cells.statistic;
  if (!f || result.valueComparator !== '=') return null;
  const effectMs = meanSquares(origin.cells);
  const errorMs = meanSquares(error.cells);
  const printed = nonNegative(f);
  if (effectMs.length === 0 || errorMs.length === 0 || !printed) return null;
  const candidates = effectMs.flatMap((effect) => errorMs.map((err) => divide(effect, err))).filter((c): c is Interval => c !== null);
  if (candidates.length === 0 || candidates.some((candidate) => overlaps(printed, candidate))) return null;
  // Shown at the printed cells: the printed MS when there is one, else SS / df.
  const recomputed = candidates[0]!;
  const effectMsText = origin.cells.ms?.text ?? `(${origin.cells.ss?.text} / ${rowDf(origin.cells)?.text})`;
  const errorMsText = error.cells.ms?.text ?? `(${error.cells.ss?.text} / ${rowDf(error.cells)?.text})`;
  const centre = msValue(origin.cells) / msValue(error.cells);
  let crosses = false;
  const [df1, df2] = result.df;
  if (df1 && df2) {
    const pRecomputed = { low: fUpperTail(recomputed.high, df1.value, df2.value), high: fUpperTail(recomputed.low, df1.value, df2.value) };
    const pPrinted = fUpperTail(f.value, df1.value, df2.value);
    const printedSide = result.p ? printedSignificance(result.p, false, alpha) : pPrinted < alpha;
    crosses = crossesAlpha(printedSide, recomputedSignificance(pRecomputed, alpha));
  }
  return {
    messageId: 'fMismatch',
    crossesAlpha: crosses,
    ...(!crosses && candidates.some((candidate) => nearMiss(printed, candidate)) ? { severityAtMost: 'warn' as const } : {}),
    data: {
      table,
      row: origin.rowLabel,
      f: f.text,
      errorRow: error.rowLabel,
      msEffect: effectMsText,
      msError: errorMsText,
      recomputed: likePrinted(centre, f),
      range: formatRange(recomputed.low, recomputed.high, (v) => formatValue(v)),
    },
  };
}

/**
 * The F a row's own numbers imply over its error row, and its p at the result's df: each mean square from
 * SS / df where the row prints both (what the row's sums of squares say), else its printed MS. The interval
 * covers every value that rounds to the printed cells.
 */
function rowImplies(result: ReportedResult, origin: TableRowOrigin, error: NonNullable<TableRowOrigin['errorRow']>): RowImplies | null {
  const effect = ownMeanSquare(origin.cells);
  const err = ownMeanSquare(error.cells);
  if (!effect || !err || !(err.value > 0)) return null;
  const interval = divide(effect.interval, err.interval);
  const statistic = effect.value / err.value;
  if (!interval || !Number.isFinite(statistic)) return null;
  const [df1, df2] = result.df;
  const known = df1 !== undefined && df2 !== undefined && df1.value > 0 && df2.value > 0;
  return {
    from: `${effect.from} over ${err.from} of '${error.rowLabel}'`,
    statistic,
    statisticLow: interval.low,
    statisticHigh: interval.high,
    p: known ? fUpperTail(statistic, df1.value, df2.value) : null,
    pLow: known ? fUpperTail(interval.high, df1.value, df2.value) : null,
    pHigh: known ? fUpperTail(interval.low, df1.value, df2.value) : null,
  };
}

function ownMeanSquare(cells: Cells): { value: number; interval: Interval; from: string } | null {
  const df = rowDf(cells);
  if (cells.ss && df && df.value > 0) {
    const interval = divideSs(cells.ss, df);
    if (interval) return { value: cells.ss.value / df.value, interval, from: 'SS / df' };
  }
  if (cells.ms) {
    const interval = nonNegative(cells.ms);
    if (interval) return { value: cells.ms.value, interval, from: 'MS' };
  }
  return null;
}

function checkPartialEta(origin: TableRowOrigin, table: string, error: NonNullable<TableRowOrigin['errorRow']>): FindingDraft | null {
  const eta = origin.cells['partial-eta-squared'];
  const ss = origin.cells.ss ? nonNegative(origin.cells.ss) : null;
  const ssError = error.cells.ss ? nonNegative(error.cells.ss) : null;
  if (!eta || !ss || !ssError || !(eta.value >= 0 && eta.value <= 1)) return null;
  if (!(ss.low + ssError.high > 0) || !(ss.high + ssError.low > 0)) return null;
  const recomputed = { low: ss.low / (ss.low + ssError.high), high: ss.high / (ss.high + ssError.low) };
  if (overlaps(roundingInterval(eta), recomputed)) return null;
  const ssValue = origin.cells.ss!.value;
  return {
    messageId: 'partialEtaMismatch',
    data: {
      table,
      row: origin.rowLabel,
      eta: eta.text,
      errorRow: error.rowLabel,
      ss: origin.cells.ss!.text,
      ssError: error.cells.ss!.text,
      recomputed: likePrinted(ssValue / (ssValue + error.cells.ss!.value), eta),
      range: formatRange(recomputed.low, recomputed.high, (v) => formatValue(v)),
    },
  };
}
