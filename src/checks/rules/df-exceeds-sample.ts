import { z } from 'zod';
import type { CheckModule } from '../types.js';
import { describeStatistic, quoteFromDocument } from '../describe.js';

const optionsSchema = z
  .object({
    skipWithinSubjectDesigns: z.boolean().default(true),
  })
  .strict();

const repeatedMeasuresWording =
  /\b(?:repeated[- ]measures?|within[- ]subjects?|within[- ]participants?|within[- ]person|mixed[- ](?:design|model|ANOVA|factorial)|split[- ]plot|paired)\b/i;

/** Statements about a part of the sample ("17 men", "32 girls") are not totals. */
const subgroupWording = /\b(?:men|women|males?|females?|boys|girls|controls|patients in|per group|each group)\b/i;
const totalWording = /\bN\s*=|\btotal\b|\bin all\b|\boverall\b/i;

/** The largest error df each kind of test can have with N observations in a between-subjects design. */
function largestPossibleDf(kind: 'F' | 't' | 'r', sampleSize: number): number {
  // t: one-sample and paired t have N - 1; r has N - 2; F has at most N - 2 (two groups).
  return kind === 't' ? sampleSize - 1 : sampleSize - 2;
}

/**
 * True when an F's error df could be a within-subject error term,
 * df2 = df1 * (n - 1) for some n up to N (common practice: the error term of a
 * one-way repeated-measures effect), so a large df2 proves nothing.
 */
function couldBeWithinSubjectError(df1: number, df2: number, sampleSize: number): boolean {
  const subjectsMinusOne = df2 / df1;
  return Number.isInteger(subjectsMinusOne) && subjectsMinusOne + 1 <= sampleSize;
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
    const totals = context.document.sampleSizes.filter((s) => totalWording.test(s.text) || !subgroupWording.test(s.text));
    if (!errorDf || totals.length === 0) return [];
    // Within-subject designs have error df that a between-subjects count cannot bound (r is the exception: N - 2 always).
    const withinSubjects =
      context.options.skipWithinSubjectDesigns &&
      (context.document.sphericity.length > 0 || repeatedMeasuresWording.test(context.text));
    if (result.kind !== 'r' && withinSubjects) return [];
    if (result.df.some((df) => df.decimals > 0)) return []; // corrected or Welch df
    const largestStatement = totals.reduce((a, b) => (b.value > a.value ? b : a));
    const largest = largestPossibleDf(result.kind, largestStatement.value);
    if (errorDf.value <= largest) return [];
    if (result.kind === 'F' && couldBeWithinSubjectError(result.df[0]!.value, errorDf.value, largestStatement.value)) return [];
    return [
      {
        messageId: 'tooLarge',
        data: {
          statistic: describeStatistic(result),
          df: errorDf.text,
          sampleSize: largestStatement.value,
          statement: quoteFromDocument(largestStatement.text, 80),
          largest,
        },
      },
    ];
  },
};
