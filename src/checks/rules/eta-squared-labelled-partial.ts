import { z } from 'zod';
import type { CheckModule } from '../types.js';
import { describeEffect, describeStatistic } from '../describe.js';
import { formatValue } from '../format.js';
import { effectAgrees } from '../effectAgreement.js';

const optionsSchema = z
  .object({
    neighbourhood: z.number().int().positive().default(1500),
  })
  .strict();

/** Eta squared that equals partial eta squared where other effects share the error term. */
export const etaSquaredLabelledPartial: CheckModule<z.infer<typeof optionsSchema>> = {
  id: 'eta-squared-labelled-partial',
  appliesTo: ['F'],
  optionsSchema,
  messages: {
    mislabelled:
      '{effect} equals the partial eta squared of {statistic} ({recomputed}), although {otherCount} other F test(s) nearby share its error df ({errorDf}), so the design has several effects and eta squared should be smaller than partial eta squared. It is probably partial eta squared labelled as eta squared.',
  },
  run(result, context) {
    const recomputation = context.recomputations[context.index];
    const range = recomputation?.partialEtaSquaredRange;
    const errorDf = result.df[1];
    if (!recomputation?.evaluable || !range || !errorDf) return [];
    // Indexed per document: counting the neighbours stays a binary search, not a walk over every result.
    const others = context.documentIndex.fTestsSharingErrorDf(result, errorDf.value, context.options.neighbourhood);
    if (others === 0) return [];
    return result.effects
      .filter((effect) => effect.kind === 'eta-squared' && effect.comparator === '=' && effectAgrees(effect.value, range))
      .map((effect) => ({
        messageId: 'mislabelled',
        data: {
          effect: describeEffect(effect),
          statistic: describeStatistic(result),
          recomputed: formatValue(recomputation.partialEtaSquared ?? range.low, 3),
          otherCount: others,
          errorDf: errorDf.text,
        },
      }));
  },
};
