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

function overlaps(a: NumberInterval, b: NumberInterval): boolean {
  const slack = 1e-9 * Math.max(1, Math.abs(a.high), Math.abs(b.high));
  return a.low <= b.high + slack && b.low <= a.high + slack;
}

const two = (v: number) => formatValue(v, 2);

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
    mseFromSds:
      'The MSE printed with {statistic} ({mse}) does not follow from the group SDs and sizes reported with it ({groups}): their pooled variance, the one-way MSE, is {pooled} ({pooledRange} allowing for the rounding of every SD).{provenance}',
    fFromMse:
      '{statistic} does not follow from its printed MSE ({mse}) and the group means and sizes reported with it ({groups}): the means give MS_between = {between} ({betweenRange} allowing for their rounding), so F = {recomputed} ({recomputedRange} allowing for the rounding of the MSE too).{provenance}',
  },
  run(result, context) {
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
