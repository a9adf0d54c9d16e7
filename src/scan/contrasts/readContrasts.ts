/**
 * Planned contrasts written after an ANOVA, linked to its groups and error
 * term:
 *
 *   "A planned contrast (-1, -1, 2) showed higher recall after spaced
 *   practice, t(57) = 2.85, p = .006."
 *   "The linear trend was significant, F(1, 57) = 8.35, p = .005."
 *   "The two training groups against control: t(61) = 3.72, p < .001."
 *
 * A written t, or an F on (1, df), is such a contrast when it is on the
 * error df of the last ANOVA before it (within LOOK_BACK characters) whose
 * groups the document prints (family.ts), is not a pairwise comparison
 * already read (scan/comparisons), and the words since the previous result
 * (within its sentence) give one weight per group (weights.ts): printed
 * weights after "contrast" or "weights", a named polynomial trend, or words
 * naming the groups on each side of "against" or "versus" in a sentence
 * that speaks of a contrast, a plan or a comparison.
 *
 * Bounded: each result looks back at most LOOK_BACK characters.
 */

import type { ComparisonFamily, ContrastLink, PrintedMeanSquareError, ReportedResult } from '../types.js';
import { paragraphOf, sentenceStart, type Paragraph } from '../paragraphs.js';
import { familyOf } from './family.js';
import { printedWeights, trendWeights, wordWeights } from './weights.js';

/** Most characters from the ANOVA to a contrast of its groups. */
export const LOOK_BACK = 2000;
const SENTENCE_LOOK_BACK = 600;
const CONTRAST_WORDS = /\b(?:contrasts?|contrasted|planned|compar(?:ed|ing|isons?))\b/i;

/** The families opened by each result (same order; null for a result that opens none). */
export function familiesOf(text: string, results: readonly ReportedResult[], errors: readonly PrintedMeanSquareError[]): (ComparisonFamily | null)[] {
  return results.map((result, index) => (result.tableRow === undefined ? familyOf(result, results[index + 1], errors, text) : null));
}

/** For each result (same order), its link as a planned contrast, or null. */
export function readContrasts(text: string, results: readonly ReportedResult[], paragraphs: readonly Paragraph[], families: readonly (ComparisonFamily | null)[]): (ContrastLink | null)[] {
  let open: { result: ReportedResult; family: ComparisonFamily } | null = null;
  let previousEnd = -1;
  return results.map((result, index): ContrastLink | null => {
    const before = previousEnd;
    if (result.tableRow === undefined) previousEnd = Math.max(previousEnd, result.end);
    const family = families[index];
    if (family) {
      open = { result, family };
      return null;
    }
    // Another omnibus F (of another outcome, say, whose groups are not printed) closes the family: what follows is its.
    if (result.kind === 'F' && result.tableRow === undefined && !(result.df.length === 2 && result.df[0]!.value === 1)) open = null;
    if (open === null || result.tableRow !== undefined || result.postHoc || result.value === null || result.valueComparator !== '=') return null;
    if (result.start - open.result.end > LOOK_BACK) return null;
    const { family: groups } = open;
    const df = result.kind === 't' && result.df.length === 1 ? result.df[0]! : result.kind === 'F' && result.df.length === 2 && result.df[0]!.value === 1 && result.df[0]!.decimals === 0 ? result.df[1]! : null;
    if (df === null || df.decimals !== 0 || df.value !== groups.errorDf) return null;
    const paragraphStart = paragraphs[paragraphOf(paragraphs, result.start)]!.start;
    const from = Math.max(sentenceStart(text, result.start, paragraphStart, SENTENCE_LOOK_BACK), before);
    const window = text.slice(from, result.start);
    const k = groups.groups.length;
    const printed = printedWeights(window, k);
    if (printed !== null) return { ...groups, weights: printed.weights, reading: 'weights', weightsText: printed.text };
    const trend = trendWeights(window, k);
    if (trend !== null) return { ...groups, weights: trend.weights, reading: 'trend', weightsText: trend.text };
    if (!CONTRAST_WORDS.test(text.slice(sentenceStart(text, result.start, paragraphStart, SENTENCE_LOOK_BACK), result.start))) return null;
    const words = wordWeights(window, groups.groups.map((group) => group.label));
    if (words !== null && words.weights.filter((w) => w !== 0).length >= 2) return { ...groups, weights: words.weights, reading: 'words', weightsText: words.text };
    return null;
  });
}
