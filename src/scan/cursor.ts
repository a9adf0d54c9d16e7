/**
 * Small, bounded readers over the normalised text.
 *
 * Every reader looks at a fixed maximum number of characters, so the scanner
 * stays linear however hostile the input is: a run of a million spaces or
 * digits is given up on after a few dozen characters instead of being walked
 * again from every candidate that precedes it.
 */

import { parseReportedNumber } from '../stats/reportedNumber.js';
import type { Comparator, ReportedNumber } from './types.js';

/** Longest whitespace gap accepted between two parts of one result (covers "\n   " from PDFs). */
export const MAX_GAP = 16;
/** Longest run of digits read as one number; reported statistics never come close. */
const MAX_DIGITS = 12;

export function isAsciiDigit(code: number): boolean {
  return code >= 48 && code <= 57;
}

export function isAsciiLetter(code: number): boolean {
  return (code >= 65 && code <= 90) || (code >= 97 && code <= 122);
}

export function isWordCode(code: number): boolean {
  return isAsciiDigit(code) || isAsciiLetter(code) || code === 95; // 95: "_"
}

/** Space, tab, line breaks and form feed; Unicode spaces were turned into ' ' by normalisation. */
export function isSpaceCode(code: number): boolean {
  return code === 32 || code === 10 || code === 13 || code === 9 || code === 12 || code === 11;
}

/** Skips at most MAX_GAP whitespace characters; returns the new position. */
export function skipSpaces(text: string, position: number): number {
  const limit = Math.min(text.length, position + MAX_GAP);
  let at = position;
  while (at < limit && isSpaceCode(text.charCodeAt(at))) at++;
  return at;
}

/** True when no word character touches `position` from the left (a token may start here). */
export function startsWord(text: string, position: number): boolean {
  return position === 0 || !isWordCode(text.charCodeAt(position - 1));
}

/** True when no word character follows `position` (a token ending here is complete). */
export function endsWord(text: string, position: number): boolean {
  return position >= text.length || !isWordCode(text.charCodeAt(position));
}

export interface ReadComparator {
  readonly comparator: Comparator;
  /** Characters the comparator spans (1 or 2). */
  readonly length: number;
}

/** Shared results of readComparator: reading one allocates nothing. */
const EQUAL: ReadComparator = { comparator: '=', length: 1 };
const DOUBLE_EQUAL: ReadComparator = { comparator: '=', length: 2 };
const LESS: ReadComparator = { comparator: '<', length: 1 };
const LESS_OR_EQUAL: ReadComparator = { comparator: '<=', length: 2 };
const GREATER: ReadComparator = { comparator: '>', length: 1 };
const GREATER_OR_EQUAL: ReadComparator = { comparator: '>=', length: 2 };
const MUCH_LESS: ReadComparator = { comparator: '<', length: 2 };
const MUCH_GREATER: ReadComparator = { comparator: '>', length: 2 };

/** Reads "=", "<", ">", "<=", ">=", "=<", "=>", "==", "<<" or ">>" at `position` (already normalised from ≤ ≥ ＝). */
export function readComparator(text: string, position: number): ReadComparator | null {
  const first = text.charCodeAt(position);
  const second = text.charCodeAt(position + 1);
  const EQUALS = 61;
  const LESS_THAN = 60;
  const GREATER_THAN = 62;
  // "<<" and ">>" ("much less than", "p<<0.01"): an inequality all the same.
  if (first === LESS_THAN) return second === EQUALS ? LESS_OR_EQUAL : second === LESS_THAN ? MUCH_LESS : LESS;
  if (first === GREATER_THAN) return second === EQUALS ? GREATER_OR_EQUAL : second === GREATER_THAN ? MUCH_GREATER : GREATER;
  if (first === EQUALS) {
    if (second === LESS_THAN) return LESS_OR_EQUAL;
    if (second === GREATER_THAN) return GREATER_OR_EQUAL;
    return second === EQUALS ? DOUBLE_EQUAL : EQUAL;
  }
  return null;
}

/** Reads up to MAX_DIGITS digits; returns the end, or -1 when the run is empty or suspiciously long. */
function readDigits(text: string, position: number): number {
  const limit = Math.min(text.length, position + MAX_DIGITS + 1);
  let at = position;
  while (at < limit && isAsciiDigit(text.charCodeAt(at))) at++;
  if (at === position || at > position + MAX_DIGITS) return -1;
  return at;
}

export interface ReadNumber {
  number: ReportedNumber;
  start: number;
  end: number;
}

/**
 * A number written with a comma ("4,21", ",046", "1,234") as the plain text
 * parseReportedNumber reads: a decimal comma, except that exactly three
 * digits after a non-zero whole part are a thousands group, the rule of
 * readNumber's 'unlessThousands'. Text without a comma is returned as it is.
 */
export function commaNumberAsPoint(written: string): string {
  const match = /^(-?)(\d*),(\d+)$/.exec(written);
  if (match === null) return written;
  const [, sign, whole, after] = match as unknown as [string, string, string, string];
  return isThousandsGroup(whole, after.length) ? `${sign}${whole}${after}` : `${sign}${whole}.${after}`;
}

/** The thousands rule for a comma: exactly three digits after a whole part of one to three digits that is not zero ("1,234", not "0,123" or "4,21"). */
function isThousandsGroup(whole: string, digitsAfterComma: number): boolean {
  return digitsAfterComma === 3 && whole.length >= 1 && whole.length <= 3 && !/^0+$/.test(whole);
}

/** A ReportedNumber for a plain decimal already known to be well formed ("-.32", "4.20", "1024"). */
export function plainNumber(written: string, decimals: number): ReportedNumber {
  return { value: Number(written), text: written, decimals, exponent: 0 };
}

/**
 * How a comma right before a digit is read in a number:
 * - 'no': it ends the number (df lists "F(1,44)", interval bounds "[.01,.25]");
 * - 'yes': it is a decimal comma ("p = 0,046", "p = ,046"), for values that
 *   cannot run into thousands;
 * - 'unlessThousands': a decimal comma ("F = 4,21", "t = ,98"), except that
 *   exactly three digits after a non-zero whole part are a thousands group
 *   ("F = 1,234", "chi2 = 12,345.6"), as in English-language manuscripts.
 */
export type DecimalComma = 'no' | 'yes' | 'unlessThousands';

/**
 * Reads a plain decimal number: optional sign, digits, optional ".digits",
 * or a leading-dot decimal (".021"); with `decimalComma`, a comma may stand
 * for the point (see DecimalComma). A trailing "." that is not followed by a
 * digit is left alone: it ends the sentence, not the number. The number's
 * text is normalised: no space PDF extraction may put after the sign
 * ("- 2.1" -> "-2.1"), a point for a decimal comma ("0,046" -> "0.046") and
 * no thousands separators ("1,234" -> "1234").
 */
export function readNumber(text: string, position: number, allowSign = true, decimalComma: DecimalComma = 'no'): ReadNumber | null {
  let at = position;
  let sign = '';
  const first = text.charCodeAt(at);
  if (allowSign && (first === 45 || first === 43)) {
    // "-" or "+"
    sign = first === 45 ? '-' : '+';
    at++;
    if (text.charCodeAt(at) === 32 && isNumberStart(text, at + 1, decimalComma)) at++;
  }
  const digitsStart = at;
  if (isAsciiDigit(text.charCodeAt(at))) {
    at = readDigits(text, at);
    if (at === -1) return null;
  }
  let whole = text.slice(digitsStart, at);
  const separator = text.charCodeAt(at);
  if (separator === 44 && decimalComma !== 'no' && isAsciiDigit(text.charCodeAt(at + 1))) {
    const groupEnd = readDigits(text, at + 1);
    if (groupEnd === -1) return null;
    const isThousands = decimalComma === 'unlessThousands' && isThousandsGroup(whole, groupEnd - at - 1);
    if (!isThousands) {
      const fraction = text.slice(at + 1, groupEnd);
      return { number: plainNumber(`${sign}${whole}.${fraction}`, fraction.length), start: position, end: groupEnd };
    }
    // Thousands groups ("12,345,678"), then an optional ".digits".
    while (text.charCodeAt(at) === 44 && isAsciiDigit(text.charCodeAt(at + 1)) && readDigits(text, at + 1) === at + 4 && whole.length < MAX_DIGITS) {
      whole += text.slice(at + 1, at + 4);
      at += 4;
    }
  }
  let decimals = 0;
  let fraction = '';
  if (text.charCodeAt(at) === 46 && isAsciiDigit(text.charCodeAt(at + 1))) {
    const fractionEnd = readDigits(text, at + 1);
    if (fractionEnd === -1) return null;
    fraction = text.slice(at + 1, fractionEnd);
    decimals = fraction.length;
    at = fractionEnd;
  }
  if (at === digitsStart) return null;
  const digits = decimals > 0 ? `${whole}.${fraction}` : whole;
  return { number: plainNumber(sign === '' ? digits : sign + digits, decimals), start: position, end: at };
}

function isNumberStart(text: string, position: number, decimalComma: DecimalComma = 'no'): boolean {
  const code = text.charCodeAt(position);
  const separatorStarts = code === 46 || (code === 44 && decimalComma !== 'no');
  return isAsciiDigit(code) || (separatorStarts && isAsciiDigit(text.charCodeAt(position + 1)));
}

/**
 * Reads a number that may carry a power of ten, as p-values do:
 * "1.2e-5", "1.2E-05", "1.2 x 10^-5", "1.2 x 10-5" (caret lost), "1.2*10^-5",
 * and a bare power "10^-4" / "10-4" (mantissa 1, no decimals).
 */
export function readScientificNumber(text: string, position: number, decimalComma: DecimalComma = 'no'): ReadNumber | null {
  const mantissa = readNumber(text, position, true, decimalComma);
  if (mantissa === null) return null;
  const mantissaText = mantissa.number.text;
  if (mantissaText === '10') {
    const bare = readPowerOfTen(text, position);
    if (bare !== null) {
      const written = text.slice(position, bare.end);
      return { number: { value: Number(`1e${bare.power}`), text: written, decimals: 0, exponent: bare.power }, start: position, end: bare.end };
    }
  }
  // "9.4.E-07": a spreadsheet's scientific notation with a point before its "E" (as some tables print it); "5.4
  // E-5": with a space before its capital "E" and a minus after it (a space and "E5" alone may be a label).
  const spacedExponent = text.charCodeAt(mantissa.end) === 32 && text.charCodeAt(mantissa.end + 1) === 69 && text.charCodeAt(mantissa.end + 2) === 45 && isAsciiDigit(text.charCodeAt(mantissa.end + 3)) ? 1 : 0;
  const dottedExponent =
    spacedExponent === 1 ? 1 : text.charCodeAt(mantissa.end) === 46 && (text.charCodeAt(mantissa.end + 1) === 69 || text.charCodeAt(mantissa.end + 1) === 101) ? 1 : 0;
  const after = text.charCodeAt(mantissa.end + dottedExponent);
  if (after === 101 || after === 69) {
    // "e" / "E"
    const exponent = readNumber(text, mantissa.end + dottedExponent + 1);
    if (exponent !== null && exponent.number.decimals === 0 && exponent.number.text.length <= 4 && endsWord(text, exponent.end)) {
      return scientific(`${mantissaText}e${exponent.number.text}`, position, exponent.end) ?? mantissa;
    }
    return mantissa;
  }
  const timesAt = skipSpacesUpTo(text, mantissa.end, 2);
  const times = text.charCodeAt(timesAt);
  if (times !== 120 && times !== 42) return mantissa; // "x" (× was normalised to x) or "*"
  const tenAt = skipSpacesUpTo(text, timesAt + 1, 2);
  if (text.charCodeAt(tenAt) !== 49 || text.charCodeAt(tenAt + 1) !== 48) return mantissa;
  const power = readPowerOfTen(text, tenAt);
  if (power === null) return mantissa;
  return scientific(`${mantissaText} x 10^${power.power}`, position, power.end) ?? mantissa;
}

function isAsciiDigitCode(code: number): boolean {
  return code >= 48 && code <= 57;
}

function scientific(written: string, start: number, end: number): ReadNumber | null {
  const number = parseReportedNumber(written);
  return number === null ? null : { number, start, end };
}

function skipSpacesUpTo(text: string, position: number, most: number): number {
  let at = position;
  while (at < position + most && text.charCodeAt(at) === 32) at++;
  return at;
}

/** Reads "10^-4", "10^ -4" or "10-4" starting at `tenAt` (which holds "10"). */
function readPowerOfTen(text: string, tenAt: number): { power: number; end: number } | null {
  let at = tenAt + 2;
  const hasCaret = text.charCodeAt(at) === 94;
  if (hasCaret) at = skipSpacesUpTo(text, at + 1, 1);
  // A superscript a copy set apart by a space, its minus too: "10 −4", "10 − 4" (as "10-4").
  if (!hasCaret && text.charCodeAt(at) === 32 && text.charCodeAt(at + 1) === 45) at++;
  if (!hasCaret && text.charCodeAt(at) === 45 && text.charCodeAt(at + 1) === 32 && isAsciiDigitCode(text.charCodeAt(at + 2))) {
    const magnitude = readNumber(text, at + 2);
    if (magnitude === null || magnitude.number.decimals > 0 || magnitude.number.text.length > 3 || !endsWord(text, magnitude.end)) return null;
    return { power: -magnitude.number.value, end: magnitude.end };
  }
  // Without a caret only a minus marks an exponent ("10-4"); "10 4" or "10+4" stay ordinary text.
  if (!hasCaret && text.charCodeAt(at) !== 45) return null;
  const exponent = readNumber(text, at);
  if (exponent === null || exponent.number.decimals > 0 || exponent.number.text.length > 4) return null;
  if (!endsWord(text, exponent.end)) return null;
  return { power: exponent.number.value, end: exponent.end };
}
