import { z } from 'zod';
import type { CheckModule } from '../types.js';
import { describeEffect, describeStatistic } from '../describe.js';
import { formatRange, formatValue } from '../format.js';
import { effectAgrees } from '../effectAgreement.js';
import { looksPaired, statedGroupSizes } from '../groupSizes.js';
import type { Interval } from '../recompute.js';

const optionsSchema = z
  .object({
    largestGroupImbalanceRatio: z.number().min(1).default(1.25),
  })
  .strict();

/**
 * The range of d an independent-samples t can give.
 * With sizes: t*sqrt(1/n1 + 1/n2) (Lakens 2013, formula 2), and 2t/sqrt(df),
 * the equal-n shortcut many authors use. Without sizes: from the equal-groups
 * minimum 2t/sqrt(N) up to that times the allowed imbalance factor.
 */
function independentDRange(t: Interval, df: number, sizes: [number, number] | null, imbalance: number): Interval {
  const shortcut = 2 / Math.sqrt(df);
  if (sizes) {
    const exact = Math.sqrt(1 / sizes[0] + 1 / sizes[1]);
    return { low: t.low * Math.min(exact, shortcut), high: t.high * Math.max(exact, shortcut) };
  }
  const equalGroups = 2 / Math.sqrt(df + 2);
  return { low: t.low * equalGroups, high: t.high * Math.max(shortcut, equalGroups * imbalance) };
}

export const cohensDMismatch: CheckModule<z.infer<typeof optionsSchema>> = {
  id: 'cohens-d-mismatch',
  appliesTo: ['t'],
  optionsSchema,
  messages: {
    mismatch:
      '{effect} does not fit {statistic} for two independent groups: {basis} gives d = {recomputedRange}. Check the t, the d, or whether the comparison was paired.',
  },
  run(result, context) {
    const recomputation = context.recomputations[context.index];
    const df = result.df[0];
    const statistic = recomputation?.statisticRange;
    if (!recomputation?.evaluable || !statistic || !df || df.decimals !== 0 || result.valueComparator !== '=') return [];
    if (looksPaired(context.text, result.start)) return [];
    const sizes = statedGroupSizes(context.text, result.start, df.value);
    const expected = independentDRange(statistic, df.value, sizes, context.options.largestGroupImbalanceRatio);
    return result.effects
      .filter((effect) => effect.kind === 'cohens-d' && effect.comparator === '=')
      .filter((effect) => !effectAgrees(effect.value, expected))
      .map((effect) => ({
        messageId: 'mismatch',
        data: {
          effect: describeEffect(effect),
          statistic: describeStatistic(result),
          basis: sizes ? `groups of ${sizes[0]} and ${sizes[1]}` : `N = ${df.value + 2} split into two groups`,
          recomputedRange: formatRange(expected.low, expected.high, (v) => formatValue(v, 2)),
        },
      }));
  },
};
