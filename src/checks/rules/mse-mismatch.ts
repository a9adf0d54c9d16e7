import { z } from 'zod';
import type { CheckModule } from '../types.js';
import type { PrintedMeanSquareError, ReportedResult } from '../../scan/types.js';
import { partitionPoint } from '../../sortedSearch.js';
import { roundingInterval } from '../../stats/reportedNumber.js';
import { weightedSpreadRange } from '../../stats/summaryStatistics.js';
import type { NumberInterval } from '../../stats/monotoneImage.js';
import { describeStatistic } from '../describe.js';
import { formatRange, formatValue } from '../format.js';
import { groupSizeProvenance, groupSizeSeverityCap } from '../groupSizes.js';
import { describeGroups } from './group-statistics-test-mismatch.js';

const optionsSchema = z.object({}).strict();

/** How far after the F its MSE may be printed (characters), with no other result and no sentence end between. */
const LINK_REACH = 80;
const SENTENCE_END = /[.!?]\s+[A-Z(]/;

/** The MSE printed with this F: inside its span ("F(2, 57) = 4.21, MSE = 0.87, p = .020") or just after it. */
export function linkedMeanSquareError(result: ReportedResult, errors: readonly PrintedMeanSquareError[], next: ReportedResult | undefined, text: string): PrintedMeanSquareError | null {
  for (let i = partitionPoint(errors.length, (j) => errors[j]!.start < result.start); i < errors.length; i++) {
    const error = errors[i]!;
    if (error.start > result.end + LINK_REACH || (next !== undefined && error.start >= next.start)) return null;
    if (error.start >= result.end && SENTENCE_END.test(text.slice(result.end, error.start))) return null;
    return error;
  }
  return null;
}

/**
 * The MSE printed inside a restatement of a table's result ("... as Table 2 shows, F(2, 57) = 8.40, MSE = 0.87, p =
 * .001"), or just after it in the same sentence with no other test between.
 */
function meanSquareErrorAt(span: { start: number; end: number }, errors: readonly PrintedMeanSquareError[], text: string): PrintedMeanSquareError | null {
  const i = partitionPoint(errors.length, (j) => errors[j]!.start < span.start);
  const error = errors[i];
  if (error === undefined || error.start > span.end + LINK_REACH) return null;
  if (error.start >= span.end) {
    const between = text.slice(span.end, error.start);
    if (SENTENCE_END.test(between) || OTHER_TEST.test(between)) return null;
  }
  return error;
}

/** A test written between a result and an MSE: the MSE is that test's. */
const OTHER_TEST = /\b(?:F|t|χ2|chi2)\s?\(/;

/** The error mean square a table row's error row prints: SS / df where it prints the SS, else its MS; null without either. */
function errorRowMeanSquare(result: ReportedResult): { range: NumberInterval; from: string; atPrinted: number } | null {
  const row = result.tableRow?.errorRow;
  if (!row || result.df.length !== 2) return null;
  const df = row.cells.df ?? row.cells.df2;
  // The error row must be this F's error term: its df the F's second df.
  if (df === undefined || df.decimals !== 0 || df.value !== result.df[1]!.value || !(df.value > 0)) return null;
  const ss = row.cells.ss;
  if (ss !== undefined && ss.value > 0) {
    const box = roundingInterval(ss);
    return { range: { low: box.low / df.value, high: box.high / df.value }, from: `SS = ${ss.text} on ${df.text} df in its "${row.rowLabel}" row`, atPrinted: ss.value / df.value };
  }
  const ms = row.cells.ms;
  if (ms !== undefined && ms.value > 0) return { range: roundingInterval(ms), from: `MS = ${ms.text} in its "${row.rowLabel}" row`, atPrinted: ms.value };
  return null;
}

function overlaps(a: NumberInterval, b: NumberInterval): boolean {
  const slack = 1e-9 * Math.max(1, Math.abs(a.high), Math.abs(b.high));
  return a.low <= b.high + slack && b.low <= a.high + slack;
}

const two = (v: number) => formatValue(v, 2);

/**
 * A table's F restated in the text with an MSE: the MSE against the table's error row (SS / df, or its MS). Null when
 * the result is no such restatement (the one-way reading below then applies); [] when the MSE fits.
 */
function tableDrafts(result: ReportedResult, errors: readonly PrintedMeanSquareError[], text: string): ReturnType<CheckModule['run']> | null {
  if (result.tableRow === undefined || !result.alsoAt) return null;
  const expected = errorRowMeanSquare(result);
  if (expected === null) return null;
  const error = result.alsoAt.map((span) => meanSquareErrorAt(span, errors, text)).find((found) => found !== null) ?? null;
  if (error === null) return null;
  if (overlaps(roundingInterval(error.value), expected.range)) return [];
  const caption = result.tableRow.caption;
  return [
    {
      messageId: 'mseFromTable',
      data: {
        statistic: describeStatistic(result),
        mse: error.text,
        table: caption ? ` (${caption})` : '',
        from: expected.from,
        recomputed: formatValue(expected.atPrinted, 3),
        recomputedRange: formatRange(expected.range.low, expected.range.high, (v) => formatValue(v, 3)),
      },
    },
  ];
}

/**
 * A one-way F printed with its mean squared error and the groups' means,
 * SDs and sizes: the MSE is the pooled variance sum (n_i - 1) s_i^2 / (N - k),
 * and F = [sum n_i (m_i - m)^2 / (k - 1)] / MSE.
 */
export const mseMismatch: CheckModule<z.infer<typeof optionsSchema>> = {
  id: 'mse-mismatch',
  appliesTo: ['F'],
  optionsSchema,
  messages: {
    mseFromTable:
      'The MSE printed with {statistic} ({mse}) is not the error mean square of the ANOVA table the test is restated from{table}: {from} gives {recomputed} ({recomputedRange} allowing for its rounding).',
    mseFromSds:
      'The MSE printed with {statistic} ({mse}) does not follow from the group SDs and sizes reported with it ({groups}): their pooled variance, the one-way MSE, is {pooled} ({pooledRange} allowing for the rounding of every SD).{provenance}',
    fFromMse:
      '{statistic} does not follow from its printed MSE ({mse}) and the group means and sizes reported with it ({groups}): the means give MS_between = {between} ({betweenRange} allowing for their rounding), so F = {recomputed} ({recomputedRange} allowing for the rounding of the MSE too).{provenance}',
  },
  run(result, context) {
    const fromTable = tableDrafts(result, context.document.meanSquareErrors ?? [], context.text);
    if (fromTable !== null) return fromTable;
    const set = result.descriptives;
    if (!set || !result.value || result.valueComparator !== '=' || result.df.length !== 2) return [];
    const error = linkedMeanSquareError(result, context.document.meanSquareErrors ?? [], context.results[context.index + 1], context.text);
    if (error === null) return [];
    const groups = set.groups;
    const k = groups.length;
    if (groups.some((g) => g.n === null || g.n < 2)) return [];
    const total = groups.reduce((sum, g) => sum + g.n!, 0);
    const [df1, df2] = result.df;
    // Only the one-way F of these groups: df (k - 1, N - k) exactly (an ANCOVA or a repeated-measures F has others).
    if (df1!.decimals !== 0 || df2!.decimals !== 0 || df1!.value !== k - 1 || df2!.value !== total - k) return [];
    const mse = roundingInterval(error.value);
    const cap = groupSizeSeverityCap(groups);
    const base = { statistic: describeStatistic(result), mse: error.text, groups: describeGroups(set), provenance: groupSizeProvenance(groups) };
    if (groups.every((g) => g.sd !== null)) {
      const pooled = (pick: (sd: NumberInterval) => number) =>
        groups.reduce((sum, g) => sum + (g.n! - 1) * Math.max(0, pick(roundingInterval(g.sd!))) ** 2, 0) / (total - k);
      const pooledRange = { low: pooled((sd) => sd.low), high: pooled((sd) => sd.high) };
      if (!overlaps(mse, pooledRange)) {
        const atPrinted = groups.reduce((sum, g) => sum + (g.n! - 1) * g.sd!.value ** 2, 0) / (total - k);
        return [
          {
            messageId: 'mseFromSds',
            ...(cap ? { severityAtMost: cap } : {}),
            data: { ...base, pooled: two(atPrinted), pooledRange: formatRange(pooledRange.low, pooledRange.high, two) },
          },
        ];
      }
    }
    const between = weightedSpreadRange(
      groups.map((g) => roundingInterval(g.mean)),
      groups.map((g) => g.n!),
    );
    const msBetween = { low: between.low / (k - 1), high: between.high / (k - 1) };
    const f = { low: msBetween.low / mse.high, high: msBetween.high / mse.low };
    const written = roundingInterval({ ...result.value, value: Math.abs(result.value.value) });
    if (overlaps(written, f)) return [];
    const centre = groups.reduce((sum, g) => sum + g.n! * g.mean.value, 0) / total;
    const atPrinted = groups.reduce((sum, g) => sum + g.n! * (g.mean.value - centre) ** 2, 0) / (k - 1);
    return [
      {
        messageId: 'fFromMse',
        ...(cap ? { severityAtMost: cap } : {}),
        data: {
          ...base,
          between: two(atPrinted),
          betweenRange: formatRange(msBetween.low, msBetween.high, two),
          recomputed: two(atPrinted / error.value.value),
          recomputedRange: formatRange(f.low, f.high, two),
        },
      },
    ];
  },
};
