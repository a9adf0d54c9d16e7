import { z } from 'zod';
import type { CheckModule } from '../types.js';
import { describeP, describeStatistic, quoteFromDocument } from '../describe.js';
import { formatP, formatRange } from '../format.js';
import { pAgrees } from '../pAgreement.js';
import { fitsOnlyWhenHalved, fitsOnlyWithSphericityCorrection } from '../pExplanations.js';
import { fitsOnlyWithPrintedEpsilon, linkedEpsilon } from '../epsilon.js';
import { describeAdjustment, judgeAdjustment } from '../pAdjustment.js';

const optionsSchema = z
  .object({
    allowTruncatedP: z.boolean().default(true),
  })
  .strict();

/** Methods whose p depends on more than the number of comparisons. */
const GROUP_DEPENDENT = new Set(['tukey', 'scheffe', 'dunnett', 'games-howell']);

/**
 * A printed p larger than the unadjusted p of its statistic, where the text
 * says the p-values were adjusted and the adjusted p cannot be recomputed
 * from the statistic alone. p-value-mismatch stays quiet on these; this
 * note says why they were not checked.
 */
export const adjustedP: CheckModule<z.infer<typeof optionsSchema>> = {
  id: 'adjusted-p',
  appliesTo: ['F', 't', 'chi2', 'r', 'z'],
  optionsSchema,
  messages: {
    unverifiable:
      '{printedP} is larger than the unadjusted p of {statistic} (p = {recomputedP}, {recomputedRange} allowing for rounding). The text says the p-values were adjusted ({method}: "{statement}"), and {why}, so it was not checked. {advice}',
  },
  run(result, context) {
    // A comparison linked to its ANOVA's groups is recomputed, adjustment included, by post-hoc-comparison-mismatch.
    if (result.postHoc) return [];
    const recomputation = context.recomputations[context.index];
    const range = recomputation?.pRange;
    if (!recomputation?.evaluable || !range) return [];
    const allowTruncation = context.options.allowTruncatedP;
    if (result.p) {
      if (pAgrees(result.p, range, allowTruncation)) return [];
      // Explained otherwise: halved-p and sphericity-corrected-p report these.
      if (fitsOnlyWhenHalved(result, recomputation, allowTruncation)) return [];
      if (fitsOnlyWithSphericityCorrection(result, recomputation, context.document.sphericity.length > 0, allowTruncation)) return [];
      if (fitsOnlyWithPrintedEpsilon(result, recomputation, linkedEpsilon(result, context), allowTruncation)) return [];
    } else if (!result.notSignificant || range.high >= context.alpha) {
      return [];
    }
    const verdict = judgeAdjustment(result, recomputation, context.text, context.document, context.alpha, allowTruncation);
    if (verdict.kind !== 'unverifiable') return [];
    const { adjustment } = verdict;
    const groupDependent = GROUP_DEPENDENT.has(adjustment.method);
    return [
      {
        messageId: 'unverifiable',
        crossesAlpha: false,
        data: {
          printedP: describeP(result),
          statistic: describeStatistic(result),
          recomputedP: formatP(recomputation.p ?? range.low),
          recomputedRange: formatRange(range.low, range.high),
          method: describeAdjustment(adjustment),
          statement: quoteFromDocument(adjustment.statement, 100),
          why: groupDependent
            ? 'such an adjusted p depends on the number of groups and on their data, not only on this statistic'
            : 'the adjusted p cannot be recomputed from the statistic alone without the number of comparisons',
          advice: groupDependent
            ? 'Reporting the unadjusted p beside it lets readers verify the statistic.'
            : 'Stating the number of comparisons (or the unadjusted p) lets readers verify it.',
        },
      },
    ];
  },
};
