import { z } from 'zod';
import type { CheckModule } from '../types.js';
import { describeStatistic, quoteFromDocument } from '../describe.js';
import { groupSizesPrintedWith } from '../groupSizes.js';

const optionsSchema = z
  .object({
    skipWithinSubjectDesigns: z.boolean().default(true),
  })
  .strict();

const repeatedMeasuresWording =
  /\b(?:repeated[- ]measures?|within[- ]subjects?|within[- ]participants?|within[- ]person|mixed[- ](?:design|model|ANOVA|factorial)|split[- ]plot|paired)\b/i;

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

/**
 * Error df against the sample sizes the document states, by what each
 * counts (src/scan/context.ts reads the scope): the whole sample, a part of
 * it, each group, one test. It fails only when no stated sample, nor the sum
 * of the group sizes printed with the test, allows the df, and the document
 * states one total; with several totals, a per-group statement or a part
 * larger than the total, the scope is unclear and it is a note.
 */
export const dfExceedsSample: CheckModule<z.infer<typeof optionsSchema>> = {
  id: 'df-exceeds-sample',
  appliesTo: ['F', 't', 'r'],
  optionsSchema,
  messages: {
    tooLarge:
      '{statistic} has error df = {df}, but the largest sample the document states is N = {sampleSize} ("{statement}"), which allows at most df = {largest} for this test. Either the df or the sample size is misreported, or the test used another sample.',
    unclearScope:
      '{statistic} has error df = {df}, more than the N = {sampleSize} the document states ("{statement}") allows (df = {largest} at most), but {why}, so the test may have used another sample. Check which sample this test used.',
  },
  run(result, context) {
    if (result.kind !== 'F' && result.kind !== 't' && result.kind !== 'r') return [];
    // df worked out from a sample size are N - 2 by construction.
    if (result.dfFrom !== undefined) return [];
    const errorDf = result.kind === 'F' ? result.df[1] : result.df[0];
    // The stated samples are sorted once per document, not for every result.
    const samples = context.documentIndex.sampleStatements();
    const largestStatement = samples.largestTotal;
    if (!errorDf || largestStatement === null) return [];
    // Within-subject designs have error df that a between-subjects count cannot bound (r is the exception: N - 2 always).
    const withinSubjects =
      context.options.skipWithinSubjectDesigns &&
      (context.document.sphericity.length > 0 || context.documentIndex.textSays(repeatedMeasuresWording));
    if (result.kind !== 'r' && withinSubjects) return [];
    if (result.df.some((df) => df.decimals > 0)) return []; // corrected or Welch df
    const largest = largestPossibleDf(result.kind, largestStatement.value);
    if (errorDf.value <= largest) return [];
    if (result.kind === 'F' && couldBeWithinSubjectError(result.df[0]!.value, errorDf.value, largestStatement.value)) return [];
    // The groups printed with the test are its own sample: when their sizes allow the df, the stated N is another sample's.
    const printed = groupSizesPrintedWith(result, context.text);
    if (printed.length >= 2 && errorDf.value <= largestPossibleDf(result.kind, printed.reduce((a, b) => a + b, 0))) return [];

    const reasons: string[] = [];
    const otherTotal = samples.otherTotal;
    if (otherTotal) reasons.push(`the document states more than one sample size ("${quoteFromDocument(otherTotal.text, 40)}" too)`);
    // A size per group that divides the stated total into whole groups describes the same sample.
    const perGroup = samples.unevenPerGroup;
    if (perGroup) reasons.push(`it also states a size per group ("${quoteFromDocument(perGroup.text, 40)}"), whose total depends on the number of groups`);
    const largerPart = samples.largerPart;
    if (largerPart) reasons.push(`it states a larger sample for a part of the study or a single test ("${quoteFromDocument(largerPart.text, 40)}")`);
    const data = {
      statistic: describeStatistic(result),
      df: errorDf.text,
      sampleSize: largestStatement.value,
      statement: quoteFromDocument(largestStatement.text, 80),
      largest,
    };
    if (reasons.length > 0) {
      return [{ messageId: 'unclearScope', data: { ...data, why: reasons.join(', and ') }, severityAtMost: 'note' }];
    }
    return [{ messageId: 'tooLarge', data }];
  },
};
