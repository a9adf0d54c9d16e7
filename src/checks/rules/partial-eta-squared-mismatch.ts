import { z } from 'zod';
import type { CheckModule } from '../types.js';
import { describeEffect, describeStatistic } from '../describe.js';
import { formatRange, formatValue } from '../format.js';
import { effectAgrees } from '../effectAgreement.js';

const optionsSchema = z.object({}).strict();

/** Reported partial eta squared against F*df1 / (F*df1 + df2). */
export const partialEtaSquaredMismatch: CheckModule<z.infer<typeof optionsSchema>> = {
  id: 'partial-eta-squared-mismatch',
  appliesTo: ['F'],
  optionsSchema,
  messages: {
    mismatch:
      '{effect} is reported, but {statistic} gives partial eta squared = {recomputed} ({recomputedRange} allowing for rounding).{hint}',
  },
  run(result, context) {
    const recomputation = context.recomputations[context.index];
    const range = recomputation?.partialEtaSquaredRange;
    if (!recomputation?.evaluable || !range) return [];
    return result.effects
      .filter((effect) => effect.kind === 'partial-eta-squared' && effect.comparator === '=')
      .filter((effect) => effect.value.value >= 0 && effect.value.value <= 1) // impossible-value reports the rest
      .filter((effect) => !effectAgrees(effect.value, range))
      .map((effect) => ({
        messageId: 'mismatch',
        data: {
          effect: describeEffect(effect),
          statistic: describeStatistic(result),
          recomputed: formatValue(recomputation.partialEtaSquared ?? range.low),
          recomputedRange: formatRange(range.low, range.high, (v) => formatValue(v)),
          hint: '',
        },
      }));
  },
};
