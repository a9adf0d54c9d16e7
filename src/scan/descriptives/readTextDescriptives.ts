/**
 * Group descriptive statistics written in running text:
 *
 * - labelled: "M = 3.47, SD = 1.21, n = 25", "(n = 25; M = 3.47, SD = 1.21)",
 *   "M = 3.47 (SD = 1.21)", "Mean = 3.47, SD = 1.21";
 * - declared pairs: "means (SDs) were 3.47 (1.21) and 2.95 (1.30)", "M (SD)
 *   = ...", "means and standard deviations ...": after such a phrase, every
 *   "number (number)" of the same sentence is a mean with its SD (an "n = 25"
 *   inside the brackets is the group's size).
 *
 * Linear time: one global pass of each expression (bounded repetitions, no
 * nested unbounded ones) over the normalised text; a declared sentence is
 * read once, at most MAX_DECLARED_SPAN characters.
 */

import { normaliseText } from '../normalise.js';
import { parseReportedNumber } from '../../stats/reportedNumber.js';
import { commaNumberAsPoint } from '../cursor.js';
import type { ReportedNumber } from '../types.js';
import { namesAdjustedMeans } from '../contrasts/adjustedMeans.js';

/** One group's numbers as found in the text, with offsets into the original text. */
export interface TextGroup {
  mean: ReportedNumber;
  sd: ReportedNumber | null;
  n: number | null;
  start: number;
  end: number;
}

// Unambiguous: digits with an optional fraction, or a bare fraction (".85"), so no digit can be
// matched two ways (an ambiguous split made the patterns slow on long runs of digits). The
// fraction may follow a decimal comma ("M = 4,21"; see commaNumberAsPoint for "1,234").
const NUMBER = String.raw`(-?(?:\d{1,7}(?:[.,]\d{1,7})?|[.,]\d{1,7}))`;
const UNSIGNED = String.raw`((?:\d{1,7}(?:[.,]\d{1,7})?|[.,]\d{1,7}))`;
const LABELLED = new RegExp(
  String.raw`\b(?:n\s?=\s?(\d{1,6})\s?[,;]\s?)?(?:M|Mean|mean)\s?[=:]\s?${NUMBER}\s?(?:[,;]\s?|\(\s?)(?:SD|S\.D\.|sd|s\.d\.)\s?[=:]\s?${UNSIGNED}\s?\)?(?:\s?[,;]\s?n\s?=\s?(\d{1,6})\b)?`,
  'g',
);
const DECLARED =
  /\b(?:M\s?\(\s?SD\s?\)|Ms\s?\(\s?SDs\s?\)|means?\s?\(\s?SDs?\s?\)|means?\s?\(\s?standard deviations?\s?\)|means? and (?:\(\s?)?standard deviations?)/gi;
// A pair starts at the start of a number, never inside one (which also keeps the search linear).
const PAIR = new RegExp(String.raw`(?<![\d.]|\d,)${NUMBER}\s?\(\s?${UNSIGNED}\s?(?:[,;]\s?n\s?=\s?(\d{1,6})\s?)?\)`, 'g');

/** Longest stretch after a declaration ("means (SDs) were") read for pairs. */
const MAX_DECLARED_SPAN = 400;

function parse(text: string | undefined): ReportedNumber | null {
  return text === undefined ? null : parseReportedNumber(commaNumberAsPoint(text));
}

/** Offset of the end of the sentence that contains `from` (". " + capital, a blank line), at most `limit` on. */
export function sentenceEnd(text: string, from: number, limit: number): number {
  const last = Math.min(text.length, from + limit);
  for (let at = from; at < last; at++) {
    const code = text.charCodeAt(at);
    if (code === 10 && /^\n[ \t]*\n/.test(text.slice(at, at + 8))) return at;
    if ((code === 46 || code === 33 || code === 63) && /^[.!?]\s+[A-Z(]/.test(text.slice(at, at + 4))) return at + 1;
  }
  return last;
}

/**
 * The last text read and its groups: the descriptives and the factorial cells both read the whole document's
 * groups, one after the other (the second reading cost as much as the first). Callers never change a group.
 */
let lastReading: { text: string; groups: readonly TextGroup[] } | null = null;

/** Every group tuple written in the text, in order. */
export function readTextGroups(original: string): TextGroup[] {
  if (lastReading !== null && lastReading.text === original) return [...lastReading.groups];
  const groups = readGroupsOf(original);
  lastReading = { text: original, groups };
  return [...groups];
}

function readGroupsOf(original: string): TextGroup[] {
  const normalised = normaliseText(original);
  const text = normalised.text;
  const groups: TextGroup[] = [];
  const covered: [number, number][] = [];
  const add = (mean: ReportedNumber | null, sd: ReportedNumber | null, n: string | undefined, start: number, end: number): void => {
    if (mean === null || (sd !== null && sd.value < 0)) return;
    groups.push({
      mean,
      sd,
      n: n === undefined ? null : Number(n),
      start: normalised.toOriginal(start),
      end: normalised.toOriginalEnd(end),
    });
    covered.push([start, end]);
  };

  LABELLED.lastIndex = 0;
  for (let match = LABELLED.exec(text); match !== null; match = LABELLED.exec(text)) {
    const [whole, nBefore, mean, sd, nAfter] = match;
    // An adjusted mean (ANCOVA) is no raw mean of the group.
    if (namesAdjustedMeans(text, match.index + (whole.search(/M|mean/i) > 0 ? whole.search(/M|mean/i) : 0))) continue;
    add(parse(mean), parse(sd), nBefore ?? nAfter, match.index, match.index + whole.length);
  }

  DECLARED.lastIndex = 0;
  let readUpTo = 0;
  for (let match = DECLARED.exec(text); match !== null; match = DECLARED.exec(text)) {
    if (namesAdjustedMeans(text, match.index)) continue;
    const from = Math.max(readUpTo, match.index + match[0].length);
    const to = sentenceEnd(text, from, MAX_DECLARED_SPAN);
    readUpTo = to;
    const span = text.slice(from, to);
    PAIR.lastIndex = 0;
    for (let pair = PAIR.exec(span); pair !== null; pair = PAIR.exec(span)) {
      const start = from + pair.index;
      const before = text.charCodeAt(start - 1);
      // "t(58)", "x2(1)" or "Table 2(3)": a pair starts a number, not a word.
      if (/[A-Za-z0-9_.]/.test(String.fromCharCode(before))) continue;
      const end = start + pair[0].length;
      if (covered.some(([s, e]) => s < end && start < e)) continue;
      add(parse(pair[1]), parse(pair[2]), pair[3], start, end);
    }
    DECLARED.lastIndex = Math.max(DECLARED.lastIndex, to);
  }
  return groups.sort((a, b) => a.start - b.start);
}
