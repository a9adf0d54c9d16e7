import { z } from 'zod';
import type { CheckModule } from '../types.js';
import { describeStatistic } from '../describe.js';

const optionsSchema = z
  .object({
    skipFWhenRepeatedMeasures: z.boolean().default(true),
  })
  .strict();

const repeatedMeasuresWording =
  /\b(?:repeated[- ]measures?|within[- ]subjects?|within[- ]participants?|mixed[- ](?:design|model|ANOVA|factorial)|split[- ]plot)\b/i;

/** The largest error df each kind of test can have with N observations in a between-subjects design. */
function largestPossibleDf(kind: 'F' | 't' | 'r', sampleSize: number): number {
  // t: one-sample and paired t have N - 1; r has N - 2; F has at most N - 2 (two groups).
  return kind === 't' ? sampleSize - 1 : sampleSize - 2;
}

export const dfExceedsSample: CheckModule<z.infer<typeof optionsSchema>> = {
  id: 'df-exceeds-sample',
  appliesTo: ['F', 't', 'r'],
  optionsSchema,
  messages: {
    tooLarge:
      '{statistic} has error df = {df}, but the largest sample the document states is N = {sampleSize} ("{statement}"), which allows at most df = {largest} for this test. Either the df or the sample size is misreported, or the test used another sample.',
  },
  run(result, context) {
    if (result.kind !== 'F' && result.kind !== 't' && result.kind !== 'r') return [];
    const errorDf = result.kind === 'F' ? result.df[1] : result.df[0];
    if (!errorDf || context.document.sampleSizes.length === 0) return [];
    if (result.kind === 'F' && context.options.skipFWhenRepeatedMeasures && repeatedMeasuresWording.test(context.text)) return [];
    const largestStatement = context.document.sampleSizes.reduce((a, b) => (b.value > a.value ? b : a));
    const largest = largestPossibleDf(result.kind, largestStatement.value);
    if (errorDf.value <= largest) return [];
    return [
      {
        messageId: 'tooLarge',
        data: {
          statistic: describeStatistic(result),
          df: errorDf.text,
          sampleSize: largestStatement.value,
          statement: largestStatement.text.trim().slice(0, 80),
          largest,
        },
      },
    ];
  },
};
