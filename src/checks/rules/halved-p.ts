import { z } from 'zod';
import type { CheckModule } from '../types.js';
import { describeP, describeStatistic, quoteFromDocument, describePRange } from '../describe.js';
import { formatP, formatRange } from '../format.js';
import { fitsOnlyWhenHalved } from '../pExplanations.js';
import { crossesAlpha, printedSignificance, recomputedSignificance } from '../pAgreement.js';
import { severitySchema } from '../catalogue.js';

const optionsSchema = z
  .object({
    declaredOneTailedSeverity: severitySchema.default('note'),
    statementDistance: z.number().int().nonnegative().default(2000),
    /** The user's settings say t, z and r tests are one-tailed unless the text says otherwise (the web page's tails setting). */
    oneTailedByDefault: z.boolean().default(false),
  })
  .strict();

type Options = z.infer<typeof optionsSchema>;

/** A p that fits only half of the recomputed two-tailed (or upper-tail) p. */
export const halvedP: CheckModule<Options> = {
  id: 'halved-p',
  appliesTo: ['F', 't', 'chi2', 'r', 'z'],
  optionsSchema,
  messages: {
    undeclared:
      '{printedP} is half the two-tailed p of {statistic} (p = {recomputedP}, {recomputedRange} allowing for rounding). One-tailed testing is not declared for this result; if it was intended, say so, otherwise report the two-tailed p.{alphaNote}',
    declared:
      '{printedP} is the one-tailed p of {statistic} (two-tailed p = {recomputedP}). The document declares one-tailed testing ("{statement}"), so this is consistent; make sure the direction was set in advance.',
    byDefault:
      '{printedP} is the one-tailed p of {statistic} (two-tailed p = {recomputedP}). The document does not declare one-tailed testing, but the settings take t, z and r tests as one-tailed by default, so this is consistent; make sure the manuscript says the tests were one-tailed and that the direction was set in advance.',
    upperTail:
      '{printedP} is half the p of {statistic} (p = {recomputedP}, {recomputedRange} allowing for rounding). {kind} tests have only an upper tail, so their p cannot be halved.{alphaNote}',
  },
  run(result, context) {
    const recomputation = context.recomputations[context.index];
    if (!recomputation?.pRange || !fitsOnlyWhenHalved(result, recomputation, true)) return [];
    const range = recomputation.pRange;
    const data = {
      statistic: describeStatistic(result),
      printedP: describeP(result),
      recomputedP: formatP(recomputation.p ?? range.low),
      recomputedRange: describePRange(result, formatRange(range.low, range.high)),
      kind: result.kind === 'chi2' ? 'Chi-square' : result.kind,
    };
    const crosses = crossesAlpha(printedSignificance(result.p, false, context.alpha), recomputedSignificance(range, context.alpha));
    const alphaNote = crosses ? ` With the two-tailed p the result is not significant at alpha = ${context.alpha}.` : '';
    if (recomputation.tails === 'upper') {
      return [{ messageId: 'upperTail', data: { ...data, alphaNote }, crossesAlpha: crosses }];
    }
    // The statement nearest before the result, else one shortly after it.
    const statements = context.document.oneTailed;
    const statement =
      statements.filter((s) => s.start < result.start).pop() ??
      statements.find((s) => s.start >= result.start && s.start - result.end <= context.options.statementDistance);
    if (statement) {
      return [
        {
          messageId: 'declared',
          data: { ...data, statement: quoteFromDocument(statement.text, 120) },
          severity: context.options.declaredOneTailedSeverity,
          // Consistent with a declaration read elsewhere in the document: never more than a warning.
          severityAtMost: 'warn',
          crossesAlpha: false,
        },
      ];
    }
    if (context.options.oneTailedByDefault) {
      return [{ messageId: 'byDefault', data, severity: context.options.declaredOneTailedSeverity, severityAtMost: 'warn', crossesAlpha: false }];
    }
    return [{ messageId: 'undeclared', data: { ...data, alphaNote }, crossesAlpha: crosses }];
  },
};
