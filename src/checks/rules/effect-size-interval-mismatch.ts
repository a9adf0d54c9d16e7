import { z } from 'zod';
import type { CheckModule } from '../types.js';
import { describeStatistic } from '../describe.js';
import { formatValue } from '../format.js';
import { effectAgrees } from '../effectAgreement.js';
import { partialEtaSquaredInterval } from '../../stats/index.js';
import type { Interval } from '../recompute.js';

const optionsSchema = z
  .object({
    assumedLevelWhenUnstated: z.number().gt(0).lt(1).default(0.9),
  })
  .strict();

/** Range of each interval bound over the rounding range of F (both bounds increase with F). */
function boundRanges(statistic: Interval, df1: number, df2: number, level: number): { low: Interval; high: Interval } {
  const atLow = partialEtaSquaredInterval(statistic.low, df1, df2, level);
  const atHigh = partialEtaSquaredInterval(statistic.high, df1, df2, level);
  return { low: { low: atLow.low, high: atHigh.low }, high: { low: atLow.high, high: atHigh.high } };
}

/** A reported confidence interval for partial eta squared against Steiger's (2004) noncentral-F interval. */
export const effectSizeIntervalMismatch: CheckModule<z.infer<typeof optionsSchema>> = {
  id: 'effect-size-interval-mismatch',
  appliesTo: ['F'],
  optionsSchema,
  messages: {
    mismatch:
      'The {level}% CI [{printedLow}, {printedHigh}] reported for partial eta squared does not follow from {statistic}: inverting the noncentral F gives [{recomputedLow}, {recomputedHigh}].{hint}',
  },
  run(result, context) {
    const recomputation = context.recomputations[context.index];
    const [df1, df2] = result.df;
    if (!recomputation?.evaluable || !recomputation.statisticRange || !df1 || !df2 || result.valueComparator !== '=') return [];
    const statistic = recomputation.statisticRange;
    return result.effects
      .filter((effect) => effect.kind === 'partial-eta-squared' && effect.interval)
      .flatMap((effect) => {
        const interval = effect.interval!;
        const level = interval.level ?? context.options.assumedLevelWhenUnstated;
        const expected = boundRanges(statistic, df1.value, df2.value, level);
        if (effectAgrees(interval.low, expected.low) && effectAgrees(interval.high, expected.high)) return [];
        const otherLevel = level === 0.9 ? 0.95 : level === 0.95 ? 0.9 : null;
        let hint = '';
        if (otherLevel !== null) {
          const other = boundRanges(statistic, df1.value, df2.value, otherLevel);
          if (effectAgrees(interval.low, other.low) && effectAgrees(interval.high, other.high)) {
            hint = ` The printed bounds fit the ${Math.round(otherLevel * 100)}% interval: the level may be mislabelled.`;
          }
        }
        const atPrinted = partialEtaSquaredInterval(result.value!.value, df1.value, df2.value, level);
        return [
          {
            messageId: 'mismatch',
            data: {
              level: Math.round(level * 100),
              printedLow: interval.low.text,
              printedHigh: interval.high.text,
              statistic: describeStatistic(result),
              recomputedLow: formatValue(atPrinted.low, 3),
              recomputedHigh: formatValue(atPrinted.high, 3),
              hint,
            },
            ...(hint ? { slip: 'interval-level' } : {}),
          },
        ];
      });
  },
};
