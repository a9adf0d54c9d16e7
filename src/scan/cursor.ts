/**
 * Small, bounded readers over the normalised text.
 *
 * Every reader looks at a fixed maximum number of characters, so the scanner
 * stays linear however hostile the input is: a run of a million spaces or
 * digits is given up on after a few dozen characters instead of being walked
 * again from every candidate that precedes it.
 */

import type { Comparator } from './types.js';

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
  comparator: Comparator;
  end: number;
}

/** Reads "=", "<", ">", "<=", ">=", "=<", "=>" or "==" at `position` (already normalised from ≤ ≥ ＝). */
export function readComparator(text: string, position: number): ReadComparator | null {
  const first = text.charCodeAt(position);
  const second = text.charCodeAt(position + 1);
  const EQUALS = 61;
  const LESS = 60;
  const GREATER = 62;
  if (first === LESS) {
    return second === EQUALS ? { comparator: '<=', end: position + 2 } : { comparator: '<', end: position + 1 };
  }
  if (first === GREATER) {
    return second === EQUALS ? { comparator: '>=', end: position + 2 } : { comparator: '>', end: position + 1 };
  }
  if (first === EQUALS) {
    if (second === LESS) return { comparator: '<=', end: position + 2 };
    if (second === GREATER) return { comparator: '>=', end: position + 2 };
    if (second === EQUALS) return { comparator: '=', end: position + 2 };
    return { comparator: '=', end: position + 1 };
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

export interface ReadNumberText {
  /** The number's characters with any space after the sign removed ("- 2.1" -> "-2.1"). */
  text: string;
  start: number;
  end: number;
}

/**
 * Reads a plain decimal number: optional sign, digits, optional ".digits",
 * or a leading-dot decimal (".021"). A trailing "." that is not followed by a
 * digit is left alone: it ends the sentence, not the number.
 */
export function readPlainNumber(text: string, position: number, allowSign = true): ReadNumberText | null {
  let at = position;
  let sign = '';
  const MINUS = 45;
  const PLUS = 43;
  const first = text.charCodeAt(at);
  if (allowSign && (first === MINUS || first === PLUS)) {
    sign = first === MINUS ? '-' : '+';
    at++;
    // PDF extraction sometimes puts a space between the minus and the digits.
    if (text.charCodeAt(at) === 32 && isNumberStart(text, at + 1)) at++;
  }
  const digitsStart = at;
  const wholeEnd = isAsciiDigit(text.charCodeAt(at)) ? readDigits(text, at) : at;
  if (wholeEnd === -1) return null;
  at = wholeEnd;
  if (text.charCodeAt(at) === 46 && isAsciiDigit(text.charCodeAt(at + 1))) {
    const fractionEnd = readDigits(text, at + 1);
    if (fractionEnd === -1) return null;
    at = fractionEnd;
  }
  if (at === digitsStart) return null;
  return { text: sign + text.slice(digitsStart, at), start: position, end: at };
}

function isNumberStart(text: string, position: number): boolean {
  const code = text.charCodeAt(position);
  return isAsciiDigit(code) || (code === 46 && isAsciiDigit(text.charCodeAt(position + 1)));
}

/**
 * Reads a number that may carry a power of ten, as p-values do:
 * "1.2e-5", "1.2E-05", "1.2 x 10^-5", "1.2 x 10-5" (caret lost), "1.2*10^-5",
 * and a bare power "10^-4" / "10-4" (mantissa 1). The returned text is the
 * written form, which parseReportedNumber understands except for the bare power.
 */
export function readScientificNumber(text: string, position: number): (ReadNumberText & { barePower: number | null }) | null {
  const mantissa = readPlainNumber(text, position);
  if (mantissa === null) return null;
  const bare = readPowerOfTen(text, mantissa.start, mantissa.text);
  if (bare !== null) return { text: text.slice(position, bare.end), start: position, end: bare.end, barePower: bare.power };
  let at = mantissa.end;
  const code = text.charCodeAt(at);
  if (code === 101 || code === 69) {
    // "e" / "E"
    const exponent = readPlainNumber(text, at + 1);
    if (exponent !== null && !exponent.text.includes('.') && exponent.text.length <= 4 && endsWord(text, exponent.end)) {
      return { text: mantissa.text + 'e' + exponent.text, start: position, end: exponent.end, barePower: null };
    }
    return { ...mantissa, barePower: null };
  }
  at = skipSpacesUpTo(text, at, 2);
  const times = text.charCodeAt(at);
  if (times === 120 || times === 42) {
    // "x" or "*" (× was normalised to x)
    const tenAt = skipSpacesUpTo(text, at + 1, 2);
    if (text.charCodeAt(tenAt) === 49 && text.charCodeAt(tenAt + 1) === 48) {
      const power = readPowerOfTen(text, tenAt, '10');
      if (power !== null) {
        return {
          text: `${mantissa.text} x 10^${power.power}`,
          start: position,
          end: power.end,
          barePower: null,
        };
      }
    }
  }
  return { ...mantissa, barePower: null };
}

function skipSpacesUpTo(text: string, position: number, most: number): number {
  let at = position;
  while (at < position + most && text.charCodeAt(at) === 32) at++;
  return at;
}

/** Reads "10^-4", "10^ -4" or "10-4" starting at `tenAt`, where the mantissa text is exactly "10". */
function readPowerOfTen(text: string, tenAt: number, writtenTen: string): { power: number; end: number } | null {
  if (writtenTen !== '10') return null;
  let at = tenAt + 2;
  const hasCaret = text.charCodeAt(at) === 94;
  if (hasCaret) at = skipSpacesUpTo(text, at + 1, 1);
  const signCode = text.charCodeAt(at);
  // Without a caret only a minus marks an exponent ("10-4"); "10 4" or "10+4" stay ordinary text.
  if (!hasCaret && signCode !== 45) return null;
  const exponent = readPlainNumber(text, at);
  if (exponent === null || exponent.text.includes('.') || exponent.text.length > 4) return null;
  if (!endsWord(text, exponent.end)) return null;
  return { power: Number(exponent.text), end: exponent.end };
}
