import { z } from 'zod';
import type { CheckModule } from '../types.js';
import { describeP, describeStatistic, quoteFromDocument } from '../describe.js';
import { formatP } from '../format.js';
import { fitsOnlyWithSphericityCorrection } from '../pExplanations.js';
import { linkedEpsilon } from '../epsilon.js';
import { crossesAlpha, printedSignificance, recomputedSignificance } from '../pAgreement.js';

const optionsSchema = z.object({}).strict();

export const sphericityCorrectedP: CheckModule<z.infer<typeof optionsSchema>> = {
  id: 'sphericity-corrected-p',
  appliesTo: ['F'],
  optionsSchema,
  messages: {
    correctedPOnly:
      '{printedP} is larger than the p of {statistic} with the printed df (p = {recomputedP}) but within what a sphericity correction gives; the document states one ("{statement}"). The p seems corrected and the df not: report the corrected df or epsilon so readers can verify it.',
  },
  run(result, context) {
    const recomputation = context.recomputations[context.index];
    // Quote the statement nearest before the result (the one most likely to cover it), else the first.
    const statements = context.document.sphericity;
    const statement = statements.filter((s) => s.start < result.start).pop() ?? statements[0];
    if (!recomputation || !statement) return [];
    if (!fitsOnlyWithSphericityCorrection(result, recomputation, true, true)) return [];
    // With an epsilon printed beside the F, epsilon-df-mismatch checks the p against that epsilon and reports it.
    if (linkedEpsilon(result, context) !== null) return [];
    const crosses = crossesAlpha(printedSignificance(result.p, false, context.alpha), recomputedSignificance(recomputation.pRange!, context.alpha));
    return [
      {
        messageId: 'correctedPOnly',
        crossesAlpha: crosses,
        // The correction is stated for the document, not for this F: never more than a warning.
        severityAtMost: 'warn',
        data: {
          printedP: describeP(result),
          statistic: describeStatistic(result),
          recomputedP: formatP(recomputation.p ?? recomputation.pRange!.low),
          statement: quoteFromDocument(statement.text, 100),
        },
      },
    ];
  },
};
