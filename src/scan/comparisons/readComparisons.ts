/**
 * Pairwise comparisons written after an ANOVA, linked to the groups and the
 * error term they are computed from:
 *
 *   "Bonferroni-adjusted comparisons showed higher accuracy after vocal
 *   warm-ups (M = 78.87) than after none (M = 70.21), t(114) = 4.28, p <
 *   .001."
 *
 * A written t is such a comparison when the words since the previous
 * result (within its sentence) print exactly two means ("M = 78.87"), an
 * adjustment method is named between the ANOVA and the comparison (Tukey's
 * HSD or Tukey-Kramer, Bonferroni, Holm, Šidák, Scheffé, Fisher's LSD),
 * and the last F test before it (within LOOK_BACK characters) whose groups
 * the document prints is its ANOVA: a one-way set of means, SDs and ns
 * (scan/descriptives), or the main effect of a factor of a factorial
 * design (scan/factorial), whose groups are then the
 * factor's levels with their n-weighted (observed) marginal means. Each
 * printed mean must fall within the rounding of exactly one group's, and
 * the t's df must be the family's error df (N - k, or N - cells): a t on
 * other df is a test of its own (two groups' t test, say), not one computed
 * from the ANOVA's error term.
 *
 * Bounded: each result looks back at most LOOK_BACK characters.
 */

import type { DescriptiveSet, FactorialLink, PostHocLink, ReportedNumber, ReportedResult } from '../types.js';
import { parseReportedNumber, roundingInterval } from '../../stats/reportedNumber.js';
import { commaNumberAsPoint } from '../cursor.js';
import { paragraphOf, sentenceStart as sentenceStartWithin, type Paragraph } from '../paragraphs.js';

export type { Paragraph };

/** Most characters looked back from a comparison for the start of its sentence. */
const SENTENCE_LOOK_BACK = 600;

function sentenceStart(text: string, offset: number, floor: number): number {
  return sentenceStartWithin(text, offset, floor, SENTENCE_LOOK_BACK);
}


/** Most characters looked back from a comparison for its method and its ANOVA. */
const LOOK_BACK = 2000;

const MEAN = /\bM\s?=\s?(-?\d{1,6}(?:[.,]\d{1,6})?)(?![\d.])/g;
// Letters around rather than \b, which does not see "Š" or "é" as letters.
const METHOD = /(?<![A-Za-z])(?:Tukey(?:[-‐ ]Kramer)?(?:'s)?(?:\sHSD)?|HSD|Bonferroni|Holm(?:-Bonferroni)?|[SŠ]id[aá]k|Scheff[eé](?:'s)?|Fisher's\sLSD|LSD|least\ssignificant\sdifference)(?![A-Za-z])/gi;

function methodOf(word: string): PostHocLink['method'] {
  const lower = word.toLowerCase();
  if (lower.startsWith('tukey') || lower === 'hsd') return 'tukey';
  if (lower.startsWith('bonferroni')) return 'bonferroni';
  if (lower.startsWith('holm')) return 'holm';
  if (lower.startsWith('scheff')) return 'scheffe';
  if (lower.includes('lsd') || lower.startsWith('least')) return 'lsd';
  return 'sidak';
}

/** The method named last in `stretch`, or null. */
export function lastMethod(stretch: string): { method: PostHocLink['method']; text: string } | null {
  let found: { method: PostHocLink['method']; text: string } | null = null;
  METHOD.lastIndex = 0;
  for (let match = METHOD.exec(stretch); match !== null; match = METHOD.exec(stretch)) found = { method: methodOf(match[0]), text: match[0] };
  return found;
}



export type Family = Pick<PostHocLink, 'groups' | 'errorMeanSquare' | 'errorDf' | 'sizesAssumed'>;

/** The groups of a one-way set, with their mean ranges and the pooled error; null without every n and SD. */
function oneWayFamily(set: DescriptiveSet): Family | null {
  let low = 0;
  let high = 0;
  let total = 0;
  for (const group of set.groups) {
    if (group.sd === null || group.n === null || group.n < 2) return null;
    const sd = roundingInterval(group.sd);
    low += (group.n - 1) * Math.max(0, sd.low) ** 2;
    high += (group.n - 1) * sd.high ** 2;
    total += group.n;
  }
  const df = total - set.groups.length;
  if (df < 1) return null;
  return {
    groups: set.groups.map((group, index) => ({ label: group.label ?? `group ${index + 1}`, mean: roundingInterval(group.mean), n: group.n! })),
    errorMeanSquare: { low: low / df, high: high / df },
    errorDf: df,
    sizesAssumed: set.groups.some((group) => group.nSource === 'document'),
  };
}

/** A factor's levels with their n-weighted marginal means, and the cells' pooled error; null unless a main effect. */
export function marginalFamily(link: FactorialLink): Family | null {
  if (link.term.length !== 1) return null;
  const factor = link.term[0]!;
  const { set } = link;
  let low = 0;
  let high = 0;
  let total = 0;
  const sums = set.levels[factor]!.map((label) => ({ label, low: 0, high: 0, n: 0 }));
  for (const cell of set.cells) {
    const n = cell.n ?? link.assumedN;
    if (n === null || n < 2) return null;
    const mean = roundingInterval(cell.mean);
    const sd = roundingInterval(cell.sd);
    low += (n - 1) * Math.max(0, sd.low) ** 2;
    high += (n - 1) * sd.high ** 2;
    total += n;
    const level = sums[set.levels[factor]!.indexOf(cell.levels[factor]!)]!;
    level.low += n * mean.low;
    level.high += n * mean.high;
    level.n += n;
  }
  const df = total - set.cells.length;
  if (df < 1) return null;
  return {
    groups: sums.map((level) => ({ label: level.label, mean: { low: level.low / level.n, high: level.high / level.n }, n: level.n })),
    errorMeanSquare: { low: low / df, high: high / df },
    errorDf: df,
    sizesAssumed: link.assumedN !== null,
  };
}

/** The one group whose mean range meets the printed mean's, or -1. */
function groupOfMean(family: Family, printed: ReportedNumber): number {
  const range = roundingInterval(printed);
  const slack = 1e-9 * Math.max(1, Math.abs(printed.value));
  const matches = family.groups.map((group, index) => (group.mean.low <= range.high + slack && group.mean.high >= range.low - slack ? index : -1)).filter((index) => index >= 0);
  return matches.length === 1 ? matches[0]! : -1;
}

function describeF(result: ReportedResult): string {
  return `F(${result.df.map((df) => df.text).join(', ')}) = ${result.value?.text ?? '?'}`;
}

/** For each result (same order), its link as a pairwise comparison, or null. */
export function readComparisons(text: string, results: readonly ReportedResult[], paragraphs: readonly Paragraph[]): (PostHocLink | null)[] {
  let family: { result: ReportedResult; family: Family } | null = null;
  let previousEnd = -1;
  return results.map((result): PostHocLink | null => {
    const before = previousEnd;
    if (result.tableRow === undefined) previousEnd = Math.max(previousEnd, result.end);
    const paragraph = paragraphOf(paragraphs, result.start);
    if (result.kind === 'F') {
      const found = result.descriptives ? oneWayFamily(result.descriptives) : result.factorial ? marginalFamily(result.factorial) : null;
      if (found !== null) family = { result, family: found };
      return null;
    }
    if (result.kind !== 't' || result.tableRow !== undefined || result.value === null || result.valueComparator !== '=' || result.df.length !== 1) return null;
    // The ANOVA within LOOK_BACK characters before (however many paragraphs a reader made of the lines between).
    if (family === null || result.start - family.result.end > LOOK_BACK) return null;
    const df = result.df[0]!;
    if (df.decimals !== 0 || df.value !== family.family.errorDf) return null;
    const paragraphStart = paragraphs[paragraph]!.start;
    const from = Math.max(sentenceStart(text, result.start, paragraphStart), before);
    const window = text.slice(from, result.start);
    const means: ReportedNumber[] = [];
    MEAN.lastIndex = 0;
    for (let match = MEAN.exec(window); match !== null; match = MEAN.exec(window)) {
      const parsed = parseReportedNumber(commaNumberAsPoint(match[1]!));
      if (parsed !== null) means.push(parsed);
    }
    if (means.length !== 2) return null;
    // The method: named last between the ANOVA and the comparison (bounded).
    const lookFrom = Math.max(result.start - LOOK_BACK, family.result.start);
    const method = lastMethod(text.slice(lookFrom, result.start));
    if (method === null) return null;
    const first = groupOfMean(family.family, means[0]!);
    const second = groupOfMean(family.family, means[1]!);
    if (first < 0 || second < 0 || first === second) return null;
    return {
      method: method.method,
      methodText: method.text,
      ...family.family,
      first,
      second,
      printedMeans: [means[0]!, means[1]!],
      family: describeF(family.result),
    };
  });
}
