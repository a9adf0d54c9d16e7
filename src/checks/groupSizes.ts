import { sentenceAround, sentenceBefore } from './sentences.js';
import type { GroupDescriptives, ReportedResult } from '../scan/types.js';
import type { Severity } from './types.js';

/**
 * Group sizes stated near a two-group result ("30 in each group",
 * "(n = 31) ... (n = 29)"), read from a bounded window of the original text.
 * Returns the two sizes when their total fits the test's df (N = df + 2).
 */
export function statedGroupSizes(text: string, resultStart: number, df: number, window = 1500): [number, number] | null {
  const excerpt = text.slice(Math.max(0, resultStart - window), resultStart);
  const eachGroup = /\b(\d{1,5})\s+(?:[a-z]+\s+){0,2}(?:in|per)\s+(?:each|every)\s+(?:of\s+the\s+(?:two\s+)?)?(?:group|condition|arm|cell)s?\b/gi;
  let match: RegExpExecArray | null;
  let equal: number | null = null;
  while ((match = eachGroup.exec(excerpt))) equal = Number(match[1]);
  if (equal !== null && 2 * equal === df + 2) return [equal, equal];

  const sizes: number[] = [];
  const sizePattern = /\bn\s*[=:]\s*(\d{1,5})\b/g; // lower-case n: a group size, not the total N
  while ((match = sizePattern.exec(excerpt))) sizes.push(Number(match[1]));
  // Use the last pair whose total fits the df.
  for (let i = sizes.length - 1; i > 0; i -= 1) {
    if (sizes[i - 1]! + sizes[i]! === df + 2) return [sizes[i - 1]!, sizes[i]!];
  }
  return null;
}

/** Words of a within-subject comparison: the same people measured twice or under both conditions. */
const PAIRED =
  /\b(?:paired|within[- ]subjects?|within[- ]participants?|within[- ]person|repeated[- ]measures?|pre[- ]?(?:tests?|intervention|treatment)|post[- ]?(?:tests?|intervention|treatment)|pre\s?[-/\u2013]\s?post|pre[- ]and[- ]post|before\s+and\s+after|dependent[- ]samples?|matched[- ]pairs?|same\s+(?:participants|subjects|children|students|individuals|people|patients|respondents))\b/i;
/** Words of a one-sample test: one mean against a fixed value. */
const ONE_SAMPLE = /\bone[- ]sample\b|\bagainst\s+(?:chance|zero|the\s+(?:scale\s+)?mid-?point)\b|\b(?:differ(?:ed|ent)?|compared)\s+(?:from|with|to|against)\s+(?:chance|zero)\b/i;
/** Words of a comparison between independent groups. */
const INDEPENDENT =
  /\bindependent[- ](?:samples?|groups?|measures)\b|\bbetween[- ](?:subjects?|participants?|groups?)\b|\bunpaired\b|\btwo[- ]sample\b|\bWelch/i;

export type TDesign = 'independent' | 'paired' | 'one-sample';

/**
 * The design of the comparison a t test reports, from the words next to it:
 * the result's own sentence first, then the sentence before (an independent-
 * groups, one-sample or within-subject wording there decides), then the
 * preceding stretch of `window` characters, where a within-subject wording
 * makes the test paired. Without any of these, independent groups.
 */
export function tDesign(text: string, resultStart: number, resultEnd: number, window = 1500): TDesign {
  if (resultStart >= text.length) return 'independent';
  const own = sentenceAround(text, resultStart, Math.min(resultEnd, text.length));
  const previous = sentenceBefore(text, own.start);
  for (const sentence of previous === null ? [own] : [own, previous]) {
    const said = text.slice(sentence.start, sentence.end);
    if (INDEPENDENT.test(said)) return 'independent';
    if (ONE_SAMPLE.test(said)) return 'one-sample';
    if (PAIRED.test(said)) return 'paired';
  }
  const stretch = text.slice(Math.max(0, resultStart - window), Math.min(text.length, own.end));
  return PAIRED.test(stretch) ? 'paired' : 'independent';
}

/** A group's size written with it: "n = 24", "n1 = 24", "(n: 24)"; not "n = 20 per group". */
const GROUP_N = /\bn(?:_?\{?\d\}?)?\s?[=:]\s?(\d{1,6})\b(?!\s{0,3}(?:per|in each|each|for each)\b)/g;

/**
 * The group sizes printed with a result: those of the group statistics
 * linked to it when every group has its own n, else every lower-case "n ="
 * in the result's sentence (a group n in brackets after each mean, or
 * "n1 = 24, n2 = 26" after the test). Empty when none are printed.
 */
export function groupSizesPrintedWith(result: ReportedResult, text: string): number[] {
  const groups = result.descriptives?.groups;
  if (groups && groups.length >= 2 && groups.every((group) => group.n !== null && group.nSource === 'group')) {
    return groups.map((group) => group.n!);
  }
  if (result.start >= text.length) return [];
  const sentence = sentenceAround(text, result.start, Math.min(result.end, text.length));
  const said = text.slice(sentence.start, sentence.end);
  const sizes: number[] = [];
  GROUP_N.lastIndex = 0;
  for (let match = GROUP_N.exec(said); match !== null; match = GROUP_N.exec(said)) sizes.push(Number(match[1]));
  return sizes;
}

/**
 * How much a finding that uses these groups' sizes may weigh: a size taken
 * from a per-group statement in another paragraph ('document': the scanner
 * chose it because the test's df fit it) is a guess, so at most a note.
 * Sizes written with the groups or stated in their own paragraph ("17
 * hikers in each group") leave the severity alone.
 */
export function groupSizeSeverityCap(groups: readonly GroupDescriptives[]): Severity | undefined {
  return groups.some((group) => group.nSource === 'document') ? 'note' : undefined;
}

/** Words for where the group sizes came from, for a message; '' unless they come from another paragraph. */
export function groupSizeProvenance(groups: readonly GroupDescriptives[]): string {
  if (!groups.some((group) => group.nSource === 'document')) return '';
  return groups.length === 1
    ? ' The group size is not printed with the group but taken from a per-group statement elsewhere in the document, which may not apply to this test.'
    : ' The group sizes are not printed with the groups but taken from a per-group statement elsewhere in the document, which may not apply to this test.';
}
