/**
 * Significance marks and the legend that defines them. Tables often print
 * no p, only stars after a value, and say under the table what each mark
 * means ("* p < .05, ** p < .01, *** p < .001"). A mark defined there is a
 * bound on the p of the value it follows, which the checks can hold against
 * the p recomputed from the value and its df.
 */

import { normaliseText } from '../normalise.js';
import { parseReportedNumber } from '../../stats/reportedNumber.js';
import type { Comparator, ReportedNumber } from '../types.js';

/** What a legend says one mark means: p below (or at most) a level. */
export interface MarkBound {
  comparator: Extract<Comparator, '<' | '<='>;
  value: ReportedNumber;
}

/** The marks a legend can define: one to four stars, daggers, double daggers, hash signs, section signs. */
export const MARK = /^(?:\*{1,4}|\u2020{1,2}|\u2021{1,2}|#{1,2}|\u00a7)$/;

/**
 * "* p < .05", "**p<0.01", "***: p ≤ .001", "† p < .10"; and "* significant
 * at the 0.05 level", "** significant at p < .01". The mark stands right
 * before its definition (common practice in table notes).
 */
const MARK_GROUP = '(\\*{1,4}|\\u2020{1,2}|\\u2021{1,2}|#{1,2}|\\u00a7)';
/** "* p < .05", "**p<0.01", "***: p ≤ .001". (Two simple patterns rather than one with alternatives: quick to match and to prove safe.) */
const LEGEND_P = new RegExp(`${MARK_GROUP}\\s?[:=]?\\s?p\\s?(<=|<|\\u2264)\\s?(0?[.,]\\d{1,4})(?!\\d)`, 'gi');
/** "* significant at the 0.05 level", "** significant at p < .01". */
const LEGEND_SIGNIFICANT = new RegExp(`${MARK_GROUP}\\s?(?:statistically\\s)?significant\\s(?:at\\s)?(?:the\\s)?(?:p\\s?(<=|<|\\u2264)\\s?)?(0?[.,]\\d{1,4})(?!\\d)`, 'gi');
/** "* Correlation is significant at the 0.05 level (2-tailed)", as a statistics program's output notes say it. */
const LEGEND_IS_SIGNIFICANT = new RegExp(`${MARK_GROUP}\\s?[A-Za-z]{1,15}\\sis\\s(?:statistically\\s)?significant\\sat\\sthe\\s()(0?[.,]\\d{1,4})\\slevel`, 'gi');

/** Most characters of a table's notes looked at for a legend. */
const MAX_LEGEND_TEXT = 4000;

/** The marks a table's notes define, each with its p bound; empty when the notes define none. */
export function readMarkLegend(notes: string): Map<string, MarkBound> {
  const legend = new Map<string, MarkBound>();
  const text = normaliseText(notes.slice(0, MAX_LEGEND_TEXT)).text;
  const entries = [...text.matchAll(LEGEND_P), ...text.matchAll(LEGEND_SIGNIFICANT), ...text.matchAll(LEGEND_IS_SIGNIFICANT)].sort((a, b) => a.index! - b.index!);
  for (const match of entries) {
    const mark = match[1]!;
    const written = match[3]!.replace(',', '.');
    const value = parseReportedNumber(written);
    if (value === null || value.value <= 0 || value.value >= 1) continue;
    const sign = match[2] || '<';
    // The first definition of a mark counts; a second one is another table's.
    if (!legend.has(mark)) legend.set(mark, { comparator: sign === '<' ? '<' : '<=', value });
  }
  for (const [mark, bound] of listedLegend(text)) if (!legend.has(mark)) legend.set(mark, bound);
  return legend;
}

/**
 * Marks listed together, then their levels in the same order: "*, ** and *** indicate p < 0.05, p < 0.01 and
 * p < 0.001", "*, ** denote significance at the 5% and 1% levels". Read only when there are as many levels as
 * marks and the levels fall as the marks grow.
 */
const LISTED_MARKS = /(\*{1,4})((?:\s?,\s?\*{1,4}){0,3})(?:,?\s(?:and|&)\s(\*{1,4}))?\s(?:indicate|indicates|denote|denotes|represent|represents|show|shows|mark|marks)\s/g;
const LISTED_LEVEL = /(?:p\s?(<=|<)\s?(0?\.\d{1,4})|(\d{1,2}(?:\.\d{1,2})?)\s?%)/g;

function listedLegend(text: string): Map<string, MarkBound> {
  const found = new Map<string, MarkBound>();
  if (!/(?:indicate|denote|represent|show|mark)/i.test(text)) return found;
  for (const match of text.matchAll(LISTED_MARKS)) {
    const marks = [match[1]!, ...(match[2] ?? '').split(',').map((part) => part.trim()).filter((part) => part !== ''), ...(match[3] ? [match[3]] : [])];
    const after = text.slice(match.index! + match[0].length, match.index! + match[0].length + 120);
    const levels = [...after.matchAll(LISTED_LEVEL)].slice(0, marks.length).map((level) =>
      level[2] !== undefined
        ? { comparator: (level[1] === '<=' ? '<=' : '<') as MarkBound['comparator'], written: level[2] }
        : { comparator: '<' as const, written: String(Number(level[3]) / 100) },
    );
    if (levels.length !== marks.length) continue;
    const values = levels.map((level) => parseReportedNumber(level.written));
    if (values.some((value) => value === null || value.value <= 0 || value.value >= 1)) continue;
    if (values.some((value, index) => index > 0 && value!.value >= values[index - 1]!.value)) continue;
    marks.forEach((mark, index) => found.set(mark, { comparator: levels[index]!.comparator, value: values[index]! }));
  }
  return found;
}

/** A value cell split into its number and the marks after it ("0.47***", "0.47 ***", "−0.27*"). */
export function splitMarks(cell: string): { number: string; marks: string } {
  const text = asciiAsterisks(cell.trim());
  const match = /^(.*?\d)\s{0,2}(\*{1,4}|\u2020{1,2}|\u2021{1,2}|#{1,2}|\u00a7)$/.exec(text);
  return match ? { number: match[1]!, marks: match[2]! } : { number: text, marks: '' };
}

/** The asterisks of math and wide fonts ("∗", as PDF copies give marks) as "*": one character for one, so places keep. */
export function asciiAsterisks(text: string): string {
  return /[\u2217\ufe61\uff0a]/.test(text) ? text.replace(/[\u2217\ufe61\uff0a]/g, '*') : text;
}

/** Marks after a statistic's bracketed df: "4.21 (2, 57)*" and "4.21* (2, 57)". */
const MARKS_AROUND_DF = /^[^()[\]]{0,20}?\d(?:\s{0,2}(\*{1,4}|\u2020{1,2}|\u2021{1,2}))?\s{0,2}[([][^()[\]]{1,20}[)\]]\s{0,2}(\*{1,4}|\u2020{1,2}|\u2021{1,2})?$/;

/**
 * The significance marks of a cell, also where it holds a statistic with its df in brackets and the marks
 * stand after the brackets or between the value and them ("4.21 (2, 57)**", "4.21** (2, 57)").
 */
export function marksOf(cell: string): string {
  const plain = splitMarks(cell).marks;
  if (plain !== '') return plain;
  const match = MARKS_AROUND_DF.exec(asciiAsterisks(cell.trim()));
  if (match === null || (match[1] !== undefined && match[2] !== undefined)) return '';
  return match[1] ?? match[2] ?? '';
}
