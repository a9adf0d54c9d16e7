/**
 * Analyses of covariance written in the text:
 *
 *   "Controlling for baseline anxiety, the groups differed, F(2, 62) =
 *   8.02, p < .001; the covariate, F(1, 62) = 214.81, p < .001."
 *
 * - adjusted means are left out of the group statistics (adjustedMeans.ts),
 *   so the groups read here are the raw ones;
 * - an F in a paragraph that speaks of an ANCOVA or covariates gets the
 *   number of groups and their total size from the raw group statistics
 *   printed in the paragraph (every group with its n), whether it tests the
 *   groups (df1 = k - 1) or a covariate (df1 = 1, its sentence naming a
 *   covariate), and the number of covariates when the text makes it plain
 *   ("two covariates", "controlling for age and baseline anxiety").
 *
 * Bounded: each pattern is anchored or scans a paragraph once.
 */

import type { AncovaLink, ReportedResult } from '../types.js';
import { readTextGroups } from '../descriptives/readTextDescriptives.js';
import { paragraphOf, sentenceStart, type Paragraph } from '../paragraphs.js';

const ANCOVA_WORDS = /\b(?:ANCOVAs?|analys[ie]s of covariance|covariates?|controlling for|adjusting for|adjusted for)\b/i;
const COVARIATE_SENTENCE = /\b(?:covariates?|controlling for|adjusting for)\b/i;
const COUNT_WORDS: Record<string, number> = { one: 1, a: 1, single: 1, two: 2, three: 3, four: 4, five: 5 };
const STATED_COUNT = /\b(one|a single|a|two|three|four|five|[1-5])\s(?:continuous\s)?covariates?\b/i;
const CONTROLLING = /\b(?:controlling|adjusting|adjusted|controlled)\sfor\s/gi;
const LIST_REACH = 60;

/** The covariates a paragraph states, and how many; null when not plain. */
export function statedCovariates(paragraph: string): AncovaLink['covariates'] {
  const counted = STATED_COUNT.exec(paragraph);
  if (counted !== null) {
    const word = counted[1]!.toLowerCase();
    return { text: counted[0], count: COUNT_WORDS[word] ?? Number(word) };
  }
  const found: NonNullable<AncovaLink['covariates']>[] = [];
  CONTROLLING.lastIndex = 0;
  for (let match = CONTROLLING.exec(paragraph); match !== null; match = CONTROLLING.exec(paragraph)) {
    const from = match.index + match[0].length;
    let end = from;
    const limit = Math.min(paragraph.length, from + LIST_REACH);
    while (end < limit && !',;()'.includes(paragraph[end]!) && !(paragraph[end] === '.' && /\s/.test(paragraph[end + 1] ?? ''))) end++;
    if (end >= limit) return null;
    const list = paragraph.slice(from, end).trim();
    // "age, sex and baseline" cannot be told from "age, the groups ... and": a comma after the list makes it unplain.
    if (paragraph[end] === ',' || list === '' || /\b(?:the|these|this)\b/i.test(list.split(/\s/)[0] ?? '')) return null;
    const count = list.split(/\s(?:and|&)\s/).length;
    found.push({ text: `${match[0]}${list}`, count });
  }
  if (found.length === 0) return null;
  // Several statements must agree.
  return found.every((f) => f.count === found[0]!.count) ? found[0]! : null;
}

/** For each result (same order), its ANCOVA link, or null. */
export function readAncova(text: string, results: readonly ReportedResult[], paragraphs: readonly Paragraph[]): (AncovaLink | null)[] {
  const byParagraph = new Map<number, { groups: number; totalN: number; covariates: AncovaLink['covariates'] } | null>();
  const paragraphFacts = (index: number) => {
    if (byParagraph.has(index)) return byParagraph.get(index)!;
    const { start, end } = paragraphs[index]!;
    const stretch = text.slice(start, end);
    let facts: { groups: number; totalN: number; covariates: AncovaLink['covariates'] } | null = null;
    if (ANCOVA_WORDS.test(stretch)) {
      const groups = readTextGroups(stretch);
      if (groups.length >= 2 && groups.every((group) => group.n !== null && group.sd !== null)) {
        facts = { groups: groups.length, totalN: groups.reduce((sum, group) => sum + group.n!, 0), covariates: statedCovariates(stretch) };
      }
    }
    byParagraph.set(index, facts);
    return facts;
  };
  return results.map((result): AncovaLink | null => {
    if (result.kind !== 'F' || result.tableRow !== undefined || result.df.length !== 2 || result.df.some((df) => df.decimals !== 0)) return null;
    const index = paragraphOf(paragraphs, result.start);
    const facts = paragraphFacts(index);
    if (facts === null) return null;
    const df1 = result.df[0]!.value;
    const sentence = text.slice(sentenceStart(text, result.start, paragraphs[index]!.start, 400), result.start);
    const covariateSentence = COVARIATE_SENTENCE.test(sentence) && df1 === 1 && facts.groups - 1 !== 1;
    const role = df1 === facts.groups - 1 && !covariateSentence ? 'groups' : covariateSentence ? 'covariate' : null;
    return role === null ? null : { role, ...facts };
  });
}
