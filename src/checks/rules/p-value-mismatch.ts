import { z } from 'zod';
import type { CheckModule } from '../types.js';
import { describeP, describeStatistic, describePRange } from '../describe.js';
import { formatP, formatRange } from '../format.js';
import { crossesAlpha, pAgrees, printedSignificance, recomputedSignificance } from '../pAgreement.js';
import { fitsOnlyWhenHalved, fitsOnlyWithSphericityCorrection } from '../pExplanations.js';
import { findSlips } from '../slips.js';

const optionsSchema = z
  .object({
    allowTruncatedP: z.boolean().default(true),
    searchSlips: z.boolean().default(true),
  })
  .strict();

type Options = z.infer<typeof optionsSchema>;

/** The reported p (or "n.s.") against the p recomputed from the statistic and df. */
export const pValueMismatch: CheckModule<Options> = {
  id: 'p-value-mismatch',
  appliesTo: ['F', 't', 'chi2', 'r', 'z'],
  optionsSchema,
  messages: {
    mismatch:
      '{statistic} gives p = {recomputedP} ({recomputedRange} allowing for rounding), but {printedP} is reported.{alphaNote}{slipNote}',
    notSignificantButIs:
      '{statistic} is marked not significant, but it gives p = {recomputedP} ({recomputedRange} allowing for rounding), below alpha = {alpha}.',
  },
  run(result, context) {
    const recomputation = context.recomputations[context.index];
    const range = recomputation?.pRange;
    if (!recomputation?.evaluable || !range) return [];
    const { allowTruncatedP, searchSlips } = context.options;
    const base = {
      statistic: describeStatistic(result),
      recomputedP: formatP(recomputation.p ?? (range.low + range.high) / 2),
      recomputedRange: describePRange(result, formatRange(range.low, range.high)),
      alpha: context.alpha,
    };
    if (!result.p) {
      if (result.notSignificant && recomputedSignificance(range, context.alpha) === true) {
        return [{ messageId: 'notSignificantButIs', data: base, crossesAlpha: true }];
      }
      return [];
    }
    const printed = result.p.value.value;
    if (printed < 0 || printed > 1) return []; // impossible-value reports it
    if (pAgrees(result.p, range, allowTruncatedP)) return [];
    if (fitsOnlyWhenHalved(result, recomputation, allowTruncatedP)) return []; // halved-p reports it
    if (fitsOnlyWithSphericityCorrection(result, recomputation, context.document.sphericity.length > 0, allowTruncatedP)) return [];

    const crosses = crossesAlpha(printedSignificance(result.p, false, context.alpha), recomputedSignificance(range, context.alpha));
    const neighbours = [context.index - 1, context.index + 1]
      .filter((i) => i >= 0 && i < context.results.length)
      .map((i) => ({ result: context.results[i]!, recomputation: context.recomputations[i]! }));
    const slips = searchSlips ? findSlips(result, neighbours, allowTruncatedP) : [];
    const firstSlip = slips[0];
    return [
      {
        messageId: 'mismatch',
        data: {
          ...base,
          printedP: describeP(result),
          alphaNote: crosses ? ` This changes the conclusion at alpha = ${context.alpha}.` : '',
          slipNote: firstSlip ? ` Possible slip: ${firstSlip.explanation}.` : '',
        },
        crossesAlpha: crosses,
        ...(firstSlip ? { slip: firstSlip.id } : {}),
      },
    ];
  },
};
