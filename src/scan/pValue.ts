/**
 * p-values and "not significant" marks: "p = .021", "ps < .001", "p-values < .001",
 * "p ≤ .01" (normalised to "p <= .01"), "p-value = .03",
 * "p(two-tailed) = .03", "p = 1.2 x 10^-5", "p < 10^-4", "n.s.".
 */

import {
  endsWord,
  isAsciiLetter,
  readComparator,
  readScientificNumber,
  skipSpaces,
  startsWord,
  type ReadNumber,
} from './cursor.js';
import type { Comparator, ReportedP } from './types.js';

/** Longest parenthesised or subscripted qualifier read after "p" ("(two-tailed)", "_Holm"). */
const MAX_QUALIFIER = 28;

/**
 * Largest |value| read as a p-value written out of range. Right after a
 * statistic, "p = 1.20" or "p = -.03" is an impossible p that the checks
 * must see as written; anywhere else, "p = 12" is a page or a count.
 */
const MAX_OUT_OF_RANGE_P = 10;

/**
 * Reads a p-value at `position`; offsets are normalised-text offsets.
 * With `asWritten` (for a p standing among the parts of a result), a value
 * outside [0, 1] is kept, up to MAX_OUT_OF_RANGE_P, instead of being rejected.
 */
export function readPValue(text: string, position: number, asWritten = false, gluedToValue = false): ReportedP | null {
  // (A p glued to the statistic's value, "0.41p= 0.53", does not start a word but is still a p.)
  if (!gluedToValue && !startsWord(text, position)) return null;
  const letter = text.charCodeAt(position);
  if (letter !== 112 && letter !== 80) return null; // p, P
  let at = position + 1;
  let plural = false;
  if (text.charCodeAt(at) === 115) {
    // "ps"
    plural = true;
    at++;
  } else if (text.charCodeAt(at) === 39 && text.charCodeAt(at + 1) === 115) {
    // "p's"
    plural = true;
    at += 2;
  }
  const valueWordEnd = skipValueWord(text, at);
  // "p-values < .001"
  if (valueWordEnd !== at && text.charCodeAt(valueWordEnd - 1) === 115) plural = true;
  at = valueWordEnd;
  if (isAsciiLetter(text.charCodeAt(at))) return null; // "pp.", "power", "ps" inside a word
  at = skipQualifier(text, at);

  at = skipSpaces(text, at);
  const sign = readDamagedComparator(text, at, asWritten);
  if (sign === null) return null;
  at = skipSpaces(text, at + sign.length);
  // A p is at most 1, so a comma before digits can only be a decimal comma ("p = 0,046", "p = ,046").
  const read = readScientificNumber(text, at, 'yes') ?? readSpacedFraction(text, at);
  if (read === null || !(endsWord(text, read.end) || isFootnoteLetterAt(text, read.end))) return null;
  // A number broken by a hyphen at a line end (".0-" / "15"): what it was cannot be told, so no p is read.
  if (brokenAtLineEnd(text, read.end)) return null;
  const value = read.number;
  // A bare "p 0.05" (its sign lost): a conventional threshold had a "<"; any other value an "=".
  // Damaged signs are read only before a probability: "p 12" is a page.
  if (sign.damaged && !(value.value >= 0 && value.value <= 1)) return null;
  const comparator = sign.comparator ?? (isConventionalThreshold(value.value) ? '<' : '=');
  // A probability above 1 is not a p-value ("p = 12" is a page or a count), unless it is read as written.
  if (value.value < 0 || value.value > 1) {
    if (!asWritten || Math.abs(value.value) >= MAX_OUT_OF_RANGE_P) return null;
  }
  return sign.comparator === null ? { comparator, value, plural, start: position, end: read.end, signLost: true } : { comparator, value, plural, start: position, end: read.end };
}

/** A footnote letter glued to a p-value ("p = .12e", "p<.001a" in a table cell): one letter a-h and then no more word. */
function isFootnoteLetterAt(text: string, at: number): boolean {
  const code = text.charCodeAt(at);
  return code >= 97 && code <= 104 && endsWord(text, at + 1);
}

/** The comparator after "p", as written or as text extraction damaged it; `comparator` null when it was lost. */
interface PComparator {
  comparator: Comparator | null;
  /** Characters from the comparator's start to just after it. */
  length: number;
  /** Read from damaged text ("p b 0.01", "p 0.05"). */
  damaged: boolean;
}

/**
 * Reads the comparator after "p", including what PDF text extraction makes
 * of it: "p = < .05" and "p = <.001" (both signs kept: the inequality
 * counts), "p b 0.01" and "p N 0.05" (a symbol font's "<" and ">" extracted
 * as letters), and, right after a statistic (`afterStatistic`), no sign at
 * all: "p 0.05", whose sign was lost.
 */
function readDamagedComparator(text: string, at: number, afterStatistic: boolean): PComparator | null {
  const comparator = readComparator(text, at);
  if (comparator !== null) {
    if (comparator.comparator === '=') {
      const inequalityAt = skipSpaces(text, at + comparator.length);
      const inequality = readComparator(text, inequalityAt);
      if (inequality !== null && inequality.comparator !== '=') return { comparator: inequality.comparator, length: inequalityAt + inequality.length - at, damaged: false };
    }
    return { comparator: comparator.comparator, length: comparator.length, damaged: false };
  }
  const code = text.charCodeAt(at);
  if ((code === 98 || code === 78) && text.charCodeAt(at + 1) === 32 && startsNumber(text, at + 2)) {
    return { comparator: code === 98 ? '<' : '>', length: 1, damaged: true };
  }
  if (afterStatistic && at > 0 && text.charCodeAt(at - 1) === 32 && startsNumber(text, at)) return { comparator: null, length: 0, damaged: true };
  return null;
}

function startsNumber(text: string, at: number): boolean {
  const code = text.charCodeAt(at);
  return (code >= 48 && code <= 57) || (code === 46 && text.charCodeAt(at + 1) >= 48 && text.charCodeAt(at + 1) <= 57);
}

/** .05, .01, .001, .005, .0001 and .10: the thresholds a "<" is written with. */
function isConventionalThreshold(value: number): boolean {
  return [0.1, 0.05, 0.01, 0.005, 0.001, 0.0001].includes(value);
}

/** "p =. 318": a decimal point set apart from its digits by text extraction, read as ".318". */
function readSpacedFraction(text: string, at: number): ReadNumber | null {
  if (text.charCodeAt(at) !== 46 || text.charCodeAt(at + 1) !== 32) return null;
  let end = at + 2;
  while (end < text.length && end - at < 12 && text.charCodeAt(end) >= 48 && text.charCodeAt(end) <= 57) end++;
  const digits = text.slice(at + 2, end);
  if (digits === '') return null;
  return { number: { value: Number(`0.${digits}`), text: `.${digits}`, decimals: digits.length, exponent: 0 }, start: at, end };
}

/** Skips "-value", " value", "value" (from a joined line break), with an optional plural "s". */
function skipValueWord(text: string, position: number): number {
  let at = position;
  const joiner = text.charCodeAt(at);
  if (joiner === 45 || joiner === 32) at++;
  const first = text.charCodeAt(at);
  if (first !== 118 && first !== 86) return position; // v, V
  if (text.slice(at, at + 5).toLowerCase() !== 'value') return position;
  at += 5;
  if (text.charCodeAt(at) === 115) at++;
  return at;
}

/** Skips "(two-tailed)", " (one-sided)", "_{adj}", "_Holm" after "p"; returns `position` when absent. */
function skipQualifier(text: string, position: number): number {
  let at = position;
  if (text.charCodeAt(at) === 32 && text.charCodeAt(at + 1) === 40) at++;
  const opening = text.charCodeAt(at);
  if (opening === 40) {
    const limit = Math.min(text.length, at + MAX_QUALIFIER);
    for (let cursor = at + 1; cursor < limit; cursor++) {
      const code = text.charCodeAt(cursor);
      if (code === 41) return cursor + 1;
      // Only words belong in a qualifier; a digit means this is something else ("p (2, 3)").
      if (!(isAsciiLetter(code) || code === 32 || code === 45 || code === 44 || code === 46)) return position;
    }
    return position;
  }
  if (opening === 95) {
    const limit = Math.min(text.length, at + MAX_QUALIFIER);
    let cursor = at + 1;
    const braced = text.charCodeAt(cursor) === 123;
    if (braced) cursor++;
    while (cursor < limit && (isAsciiLetter(text.charCodeAt(cursor)) || text.charCodeAt(cursor) === 45)) cursor++;
    if (braced) return text.charCodeAt(cursor) === 125 ? cursor + 1 : position;
    return cursor;
  }
  return position;
}

/**
 * "Not significant" written out after a result, in English and in the
 * languages of the real corpus's sources (normalised text: accents on e are
 * already plain).
 */
const NOT_SIGNIFICANT_WORDS = [
  'not significant',
  'non-significant',
  'nonsignificant',
  'nicht signifikant',
  'no significativo',
  'no significativa',
  'nao significativo',
  'nao significativa',
  'non significatif',
  'non significative',
  'niet significant',
];

/** Reads "n.s.", "n.s", "ns", "NS", "n. s." (or "not significant" and its translations) at `position`; returns its end, or -1. */
export function readNotSignificant(text: string, position: number): number {
  if (!startsWord(text, position)) return -1;
  const lower = text.slice(position, position + 20).toLowerCase().replace(/\u00e3/g, 'a');
  for (const words of NOT_SIGNIFICANT_WORDS) {
    if (lower.startsWith(words) && endsWord(text, position + words.length)) return position + words.length;
  }
  const first = text.charCodeAt(position);
  if (first !== 110 && first !== 78) return -1; // n, N
  let at = position + 1;
  const second = text.charCodeAt(at);
  if (second === 115 || second === 83) {
    return endsWord(text, at + 1) ? at + 1 : -1;
  }
  if (second !== 46) return -1;
  at++;
  if (text.charCodeAt(at) === 32) at++;
  const third = text.charCodeAt(at);
  if (third !== 115 && third !== 83) return -1;
  at++;
  if (!endsWord(text, at)) return -1;
  return text.charCodeAt(at) === 46 ? at + 1 : at;
}

/** A hyphen right after a number, then only spaces to the line's end, then a digit: a number broken over lines. */
function brokenAtLineEnd(text: string, at: number): boolean {
  if (text.charCodeAt(at) !== 45) return false;
  let cursor = at + 1;
  while (text.charCodeAt(cursor) === 32 || text.charCodeAt(cursor) === 13) cursor++;
  if (text.charCodeAt(cursor) !== 10) return false;
  cursor++;
  while (text.charCodeAt(cursor) === 32) cursor++;
  const next = text.charCodeAt(cursor);
  return next >= 48 && next <= 57;
}
