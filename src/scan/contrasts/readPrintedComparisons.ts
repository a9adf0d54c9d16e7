/**
 * Pairwise comparisons printed after an ANOVA without a t, read for the
 * ANOVA's F:
 *
 *   "Tukey's HSD: vocal (M = 78.9) vs none (M = 70.2), q = 4.09, p = .015"
 *   "the mean difference was 7.45, SE = 2.58, 95% CI [1.24, 13.65]"
 *
 * Tukey's studentized range statistic (q, optionally with its k and df:
 * "q(3, 57) = 4.09") needs Tukey's method (or "studentized range") named
 * between the ANOVA and the q; a mean difference ("mean difference =",
 * "Mdiff =", "MD =") counts only with its SE or an interval after it in the
 * same clause, and with a post-hoc method, "pairwise" or "post hoc" named
 * since the ANOVA. A clause that prints a t is left to the comparisons
 * reader (scan/comparisons). The pair is the one whose means are printed in
 * the clause, or the two groups it names; otherwise any pair may be meant.
 *
 * Bounded: each ANOVA's stretch ends at the next F or LOOK_BACK characters
 * on; every pattern is anchored or scans once.
 */

import type { ComparisonFamily, PostHocLink, PrintedComparison, ReportedNumber, ReportedP, ReportedResult } from '../types.js';
import { parseReportedNumber, roundingInterval } from '../../stats/reportedNumber.js';
import { commaNumberAsPoint } from '../cursor.js';
import { lastMethod } from '../comparisons/readComparisons.js';
import { LOOK_BACK } from './readContrasts.js';

const Q = /(?<![A-Za-z])q\s?(?:\(\s?(\d{1,2})\s?,\s?(\d{1,5})\s?\)\s?)?=\s?(\d{1,3}(?:\.\d{1,4})?)(?!\d|\.\d)/g;
const DIFFERENCE = /\b(?:mean difference|M_?diff|MD|M\s?difference)\s?(?:=|of|was)\s?([-\u2212]?\d{1,6}(?:\.\d{1,6})?)(?!\d|\.\d)/gi;
const SE = /\bSE\s?=\s?(\d{1,6}(?:\.\d{1,6})?)(?!\d|\.\d)/;
const INTERVAL = /\b(\d{2}(?:\.\d)?)\s?%\s?CI\s?[:=,]?\s?[[(]\s?([-\u2212]?\d{1,6}(?:\.\d{1,6})?)\s?(?:,|;|to|\u2013)\s?([-\u2212]?\d{1,6}(?:\.\d{1,6})?)\s?[\])]/;
const P = /\bp\s?(=|<|>)\s?(0?\.\d{1,6}|1(?:\.0+)?)(?!\d|\.\d)/;
const MEAN = /\bM\s?=\s?(-?\d{1,6}(?:\.\d{1,6})?)(?!\d|\.\d)/g;
const TEST = /\bt\s?\(\s?\d/;
const POST_HOC_WORDS = /\b(?:post[- ]hoc|pairwise|studentized range)\b/i;
/** Most characters of a clause after the statistic read for its SE, interval and p. */
const AFTER_REACH = 90;
const BEFORE_REACH = 300;

function number(text: string): ReportedNumber | null {
  return parseReportedNumber(commaNumberAsPoint(text.replace('\u2212', '-')));
}

/** From `at` to the end of its clause (";", a sentence end, a blank line), at most `limit` characters. */
function clauseAfter(text: string, at: number, limit: number): string {
  const end = Math.min(text.length, at + limit);
  for (let i = at; i < end; i++) {
    if (text[i] === ';' || text[i] === '\n' || (text[i] === '.' && /\s/.test(text[i + 1] ?? '') && !/\d/.test(text[i - 1] ?? ''))) return text.slice(at, i);
  }
  return text.slice(at, end);
}

/** Start of the clause holding `at`: after the last ";", sentence end or line break, no earlier than `floor`. */
function clauseBefore(text: string, at: number, floor: number): number {
  const lowest = Math.max(floor, at - BEFORE_REACH);
  for (let i = at - 1; i > lowest; i--) {
    if (text[i] === ';' || text[i] === '\n' || (text[i] === '.' && /\s/.test(text[i + 1] ?? '') && /[A-Z(]/.test(text[i + 2] ?? ''))) return i + 1;
  }
  return lowest;
}

/** The one group whose mean range holds the printed mean, or -1. */
function groupOfMean(family: ComparisonFamily, printed: ReportedNumber): number {
  const range = roundingInterval(printed);
  const matches = family.groups.map((group, index) => (group.mean.low <= range.high + 1e-9 && group.mean.high >= range.low - 1e-9 ? index : -1)).filter((i) => i >= 0);
  return matches.length === 1 ? matches[0]! : -1;
}

function words(phrase: string): string[] {
  return (phrase.toLowerCase().match(/[a-z][a-z-]{2,}/g) ?? []).filter((word) => !['the', 'group', 'groups', 'condition', 'and', 'with', 'than', 'versus'].includes(word));
}

/** The pair a clause names: two printed means of two groups, or the only two groups whose names it uses. */
function pairOf(family: ComparisonFamily, clause: string): [number, number] | null {
  const means: number[] = [];
  MEAN.lastIndex = 0;
  for (let match = MEAN.exec(clause); match !== null; match = MEAN.exec(clause)) {
    const parsed = number(match[1]!);
    if (parsed !== null) means.push(groupOfMean(family, parsed));
  }
  if (means.length === 2) return means[0]! >= 0 && means[1]! >= 0 && means[0] !== means[1] ? [means[0]!, means[1]!] : null;
  if (means.length > 0) return null;
  const clauseWords = words(clause);
  const named: { index: number; at: number }[] = [];
  family.groups.forEach((group, index) => {
    const nameWords = words(group.label);
    const at = clauseWords.findIndex((word) => nameWords.includes(word));
    if (nameWords.length > 0 && at >= 0) named.push({ index, at });
  });
  if (named.length !== 2) return null;
  named.sort((a, b) => a.at - b.at);
  return [named[0]!.index, named[1]!.index];
}

function pOf(clause: string, offset: number): ReportedP | null {
  const match = P.exec(clause);
  if (match === null) return null;
  const value = number(match[2]!);
  if (value === null) return null;
  return { comparator: match[1] as ReportedP['comparator'], value, plural: false, start: offset + match.index, end: offset + match.index + match[0].length };
}

/** The comparisons printed without a t after each F that opens a family (same order as the results; null for the others). */
export function readPrintedComparisons(text: string, results: readonly ReportedResult[], families: readonly (ComparisonFamily | null)[]): (PrintedComparison[] | null)[] {
  return results.map((result, index): PrintedComparison[] | null => {
    const family = families[index];
    if (!family) return null;
    // The stretch ends at the next F of another analysis (one opening a family, on other error df, or another omnibus
    // test; an F(1, df) on these df is a contrast of these groups) or LOOK_BACK characters on.
    let nextF = text.length;
    for (let j = index + 1; j < results.length && results[j]!.start < result.end + LOOK_BACK; j++) {
      const other = results[j]!;
      if (other.kind !== 'F' || other.tableRow !== undefined) continue;
      if (families[j] || other.df[1]?.value !== family.errorDf || other.df[0]?.value !== 1) {
        nextF = other.start;
        break;
      }
    }
    const end = Math.min(nextF, result.end + LOOK_BACK, text.length);
    const stretch = text.slice(result.end, end);
    const found: PrintedComparison[] = [];
    let lastEnd = result.end;
    const add = (at: number, length: number, item: Omit<PrintedComparison, 'text' | 'start' | 'end' | 'pair' | 'method'>, method: PostHocLink['method'] | null): void => {
      const start = result.end + at;
      const clauseStart = clauseBefore(text, start, lastEnd);
      const before = text.slice(clauseStart, start);
      if (TEST.test(before)) return;
      const itemEnd = start + length;
      lastEnd = itemEnd;
      found.push({ ...item, text: text.slice(start, itemEnd), start, end: itemEnd, pair: pairOf(family, before), method });
    };
    Q.lastIndex = 0;
    for (let match = Q.exec(stretch); match !== null; match = Q.exec(stretch)) {
      const method = lastMethod(stretch.slice(0, match.index));
      if (method?.method !== 'tukey' && !/studentized range/i.test(stretch.slice(0, match.index))) continue;
      const q = number(match[3]!);
      if (q === null) continue;
      const clause = clauseAfter(stretch, match.index + match[0].length, AFTER_REACH);
      if (TEST.test(clause)) continue;
      const p = pOf(clause, result.end + match.index + match[0].length);
      const qDf: [number, number] | null = match[1] === undefined ? null : [Number(match[1]), Number(match[2])];
      add(match.index, match[0].length + (p === null ? 0 : p.end - (result.end + match.index + match[0].length)), { q, qDf, difference: null, se: null, interval: null, p }, 'tukey');
    }
    lastEnd = result.end;
    DIFFERENCE.lastIndex = 0;
    for (let match = DIFFERENCE.exec(stretch); match !== null; match = DIFFERENCE.exec(stretch)) {
      const sinceAnova = stretch.slice(0, match.index);
      const method = lastMethod(sinceAnova);
      if (method === null && !POST_HOC_WORDS.test(sinceAnova)) continue;
      const difference = number(match[1]!);
      if (difference === null) continue;
      const clause = clauseAfter(stretch, match.index + match[0].length, AFTER_REACH);
      if (TEST.test(clause)) continue;
      const seMatch = SE.exec(clause);
      const intervalMatch = INTERVAL.exec(clause);
      const se = seMatch === null ? null : number(seMatch[1]!);
      const low = intervalMatch === null ? null : number(intervalMatch[2]!);
      const high = intervalMatch === null ? null : number(intervalMatch[3]!);
      const interval = low !== null && high !== null ? { level: Number(intervalMatch![1]) / 100, low, high } : null;
      if (se === null && interval === null) continue;
      const lastPart = Math.max(seMatch === null ? 0 : seMatch.index + seMatch[0].length, intervalMatch === null ? 0 : intervalMatch.index + intervalMatch[0].length);
      add(match.index, match[0].length + lastPart, { q: null, qDf: null, difference, se, interval, p: null }, method?.method ?? null);
    }
    return found.length > 0 ? found.sort((a, b) => a.start - b.start) : null;
  });
}
