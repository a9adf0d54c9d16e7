import { z } from 'zod';
import type { CheckModule } from '../types.js';
import { describeP, describeStatistic } from '../describe.js';
import { formatP } from '../format.js';

const optionsSchema = z.object({}).strict();

export const pReportedAsZero: CheckModule<z.infer<typeof optionsSchema>> = {
  id: 'p-reported-as-zero',
  appliesTo: ['F', 't', 'chi2', 'r', 'z'],
  optionsSchema,
  messages: {
    zero: '{printedP} is reported for {statistic}. A p-value is never zero (recomputed: p = {recomputedP}); report it as p < .001.',
  },
  run(result, context) {
    // "p < .0000" says no more than "p = .0000".
    if (!result.p || !['=', '<', '<='].includes(result.p.comparator) || result.p.value.value !== 0) return [];
    const recomputed = context.recomputations[context.index]?.p;
    return [
      {
        messageId: 'zero',
        data: {
          printedP: describeP(result),
          statistic: describeStatistic(result),
          recomputedP: recomputed === null || recomputed === undefined ? 'not computable' : formatP(recomputed),
        },
      },
    ];
  },
};
