import { z } from 'zod';
import type { CheckModule } from '../types.js';
import { describeP, describeStatistic } from '../describe.js';
import { correctedRange, linkedEpsilon, pRangeAt, uncorrectedDf } from '../epsilon.js';
import { formatP, formatRange, formatValue } from '../format.js';
import { pAgrees } from '../pAgreement.js';
import { crossesAlpha, printedSignificance, recomputedSignificance } from '../pAgreement.js';

const optionsSchema = z
  .object({
    /** Accept a p truncated rather than rounded in its last digit (as p-value-mismatch does). */
    allowTruncatedP: z.boolean().default(true),
  })
  .strict();

const METHOD_NAME: Record<string, string> = {
  'greenhouse-geisser': 'Greenhouse-Geisser ',
  'huynh-feldt': 'Huynh-Feldt ',
  'lower-bound': 'lower-bound ',
  unspecified: '',
};

/**
 * A sphericity epsilon printed beside an F test against the test's df and p:
 * corrected df are the whole-number df times epsilon, and the p belongs to
 * the df printed.
 */
export const epsilonDfMismatch: CheckModule<z.infer<typeof optionsSchema>> = {
  id: 'epsilon-df-mismatch',
  appliesTo: ['F'],
  optionsSchema,
  messages: {
    epsilonDf:
      'The printed {epsilon} does not turn whole-number df into the df of {statistic}: {df1} / epsilon = {ratio1} and {df2} / epsilon = {ratio2} are not whole numbers for any epsilon that rounds to {epsilonValue}. The df, the epsilon or their pairing was misreported.',
    uncorrectedP:
      '{printedP} fits the uncorrected df of {statistic} (F({u1}, {u2}), p = {uncorrectedP}) but not the corrected df printed with it and the {epsilon} (p = {recomputedP}): the p seems taken from the uncorrected test.',
    correctedPOnly:
      '{printedP} is the p of {statistic} with both df times the printed {epsilon} (F({c1}, {c2}), p = {correctedP}), not of the whole-number df printed (p = {recomputedP}). The p is corrected and the df are not: report the corrected df so readers can verify it.',
  },
  run(result, context) {
    const epsilon = linkedEpsilon(result, context);
    const recomputation = context.recomputations[context.index];
    if (epsilon === null || !recomputation?.pRange) return [];
    const [first, second] = result.df;
    if (!first || !second) return [];
    const epsilonText = `${METHOD_NAME[epsilon.method]}epsilon = ${epsilon.value.text}`;
    const allow = context.options.allowTruncatedP;
    const fractional = first.decimals > 0 || second.decimals > 0;
    if (fractional) {
      const whole = uncorrectedDf(result, epsilon);
      if (whole === null) {
        return [
          {
            messageId: 'epsilonDf',
            data: {
              epsilon: epsilonText,
              epsilonValue: epsilon.value.text,
              statistic: describeStatistic(result),
              df1: first.text,
              df2: second.text,
              ratio1: formatValue(first.value / epsilon.value.value, 2),
              ratio2: formatValue(second.value / epsilon.value.value, 2),
            },
          },
        ];
      }
      if (!result.p || result.p.comparator !== '=' || pAgrees(result.p, recomputation.pRange, allow)) return [];
      const uncorrected = pRangeAt(recomputation, { low: whole.df1, high: whole.df1 }, { low: whole.df2, high: whole.df2 });
      if (uncorrected === null || !pAgrees(result.p, uncorrected, allow)) return [];
      return [
        {
          messageId: 'uncorrectedP',
          crossesAlpha: crossesAlpha(printedSignificance(result.p, false, context.alpha), recomputedSignificance(recomputation.pRange, context.alpha)),
          data: {
            printedP: describeP(result),
            statistic: describeStatistic(result),
            u1: whole.df1,
            u2: whole.df2,
            uncorrectedP: formatRange(uncorrected.low, uncorrected.high),
            epsilon: epsilonText,
            recomputedP: formatP(recomputation.p ?? recomputation.pRange.low),
          },
        },
      ];
    }
    if (!result.p || result.p.comparator !== '=' || pAgrees(result.p, recomputation.pRange, allow)) return [];
    const corrected = correctedRange(result, recomputation, epsilon);
    if (corrected === null || !pAgrees(result.p, corrected.range, allow)) return [];
    return [
      {
        messageId: 'correctedPOnly',
        // The p is right for the corrected test; only the df are not reported: a note at most.
        severityAtMost: 'note',
        crossesAlpha: crossesAlpha(printedSignificance(result.p, false, context.alpha), recomputedSignificance(recomputation.pRange, context.alpha)),
        data: {
          printedP: describeP(result),
          statistic: describeStatistic(result),
          epsilon: epsilonText,
          c1: formatValue(first.value * epsilon.value.value, 2),
          c2: formatValue(second.value * epsilon.value.value, 2),
          correctedP: formatRange(corrected.range.low, corrected.range.high),
          recomputedP: formatP(recomputation.p ?? recomputation.pRange.low),
        },
      },
    ];
  },
};
