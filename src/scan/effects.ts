/**
 * Effect sizes and confidence intervals written after a test statistic:
 * "ηp2 = .13", "partial eta squared = .13", "Cohen's d = 0.45",
 * "90% CI [.01, .25]", "95% CI: .01 to .12".
 */

import {
  endsWord,
  isAsciiDigit,
  isAsciiLetter,
  readComparator,
  readNumber,
  readScientificNumber,
  skipSpaces,
  startsWord,
  type ReadNumber,
} from './cursor.js';
import type { Comparator, EffectKind, ReportedEffect, ReportedInterval, ReportedNumber } from './types.js';

/**
 * Effect-size names after canonicalisation (lower case; spaces, hyphens,
 * apostrophes, "_", "^", braces removed; Greek already spelled out by
 * normalisation, so "η²p" arrives as "eta2p").
 */
const EFFECT_NAMES: ReadonlyMap<string, EffectKind> = new Map<string, EffectKind>([
  ...names('partial-eta-squared', [
    'etap2', 'eta2p', 'etap', 'partialeta2', 'partialetasquared', 'partialeta', 'partialetasq', 'etasquaredp', 'etapsquared',
    // A symbol font's η as some PDFs give it ("g2 p", "gp2"), and η typed as an n ("np2").
    'gp2', 'g2p', 'np2',
  ]),
  ...names('eta-squared', ['eta2', 'etasquared', 'etasq']),
  ...names('generalized-eta-squared', [
    'etag2', 'eta2g', 'ges', 'generalizedeta2', 'generalisedeta2', 'generalizedetasquared', 'generalisedetasquared',
  ]),
  ...names('omega-squared', ['omega2', 'omegasquared', 'omegasq']),
  ...names('partial-omega-squared', ['omegap2', 'omega2p', 'partialomega2', 'partialomegasquared']),
  ...names('cohens-d', ['d', 'dz', 'ds', 'dav', 'drm', 'cohensd', 'cohend', 'cohensdz', 'cohensds']),
  ...names('hedges-g', ['g', 'gs', 'hedgesg', 'hedgeg', 'hedgessg', 'gav', 'grm']),
  ...names('cohens-f', ['f', 'cohensf', 'cohenf']),
  ...names('r', ['r']),
  ...names('phi', ['phi']),
  ...names('cramers-v', ['v', 'cramersv', 'cramerv', 'cramersphi']),
  ...names('r-squared', ['r2', 'rsquared', 'rsq', 'multipler2']),
  ...names('adjusted-r-squared', ['adjr2', 'adjustedr2', 'r2adj', 'r2adjusted', 'radj2', 'adjrsquared', 'adjustedrsquared']),
]);

function names(kind: EffectKind, spellings: string[]): Array<[string, EffectKind]> {
  return spellings.map((spelling) => [spelling, kind]);
}

/**
 * Names that are clear on their own, so they may be searched for a little
 * further away from the statistic. Single letters (d, g, f, V, r) are only
 * taken right after the result, where their meaning is not in doubt.
 */
export function isUnambiguousEffectName(canonical: string): boolean {
  return canonical.length > 2 && EFFECT_NAMES.has(canonical);
}

/** Most words an effect-size name spans ("partial eta squared"), and most characters read. */
const MAX_NAME_WORDS = 4;
const MAX_NAME_LENGTH = 40;

function isNameCode(code: number): boolean {
  // Letters, digits, "_", "^", "{", "}", "'".
  return isAsciiLetter(code) || isAsciiDigit(code) || code === 95 || code === 94 || code === 123 || code === 125 || code === 39;
}

function canonicalName(written: string): string {
  return written.toLowerCase().replace(/[^a-z0-9]/g, '');
}

/** "adj" (any case) from `start` to `end`: the one abbreviation with a period read inside an effect-size name. */
function isAbbreviatedAdjusted(text: string, start: number, end: number): boolean {
  return end - start === 3 && text.slice(start, end).toLowerCase() === 'adj';
}

export interface NameValueRead {
  /** Canonical name ("etap2"). */
  name: string;
  /** Effect kind, or null for a name the scanner does not record ("MSE", "b"). */
  kind: EffectKind | null;
  comparator: Comparator;
  value: ReportedNumber;
  /** Normalised offsets of the name's first character and the value's end. */
  start: number;
  end: number;
}

/** Scratch space for the word starts of a name being read (no allocation per attempt). */
const wordStarts = new Int32Array(MAX_NAME_WORDS);

/**
 * Reads "name = number" at `position`, where the name is one to four words
 * ("d", "Cohen's d", "partial eta squared"). When the whole name is not an
 * effect size, its trailing words are tried ("effect size d" -> "d").
 */
export function readNameAndValue(text: string, position: number): NameValueRead | null {
  if (!startsWord(text, position) || !isNameCode(text.charCodeAt(position))) return null;
  const limit = Math.min(text.length, position + MAX_NAME_LENGTH);
  let words = 0;
  let at = position;
  let nameEnd = position;
  while (at < limit && words < MAX_NAME_WORDS) {
    wordStarts[words++] = at;
    while (at < limit && isNameCode(text.charCodeAt(at))) at++;
    nameEnd = at;
    const gap = text.charCodeAt(at);
    // Words are joined by one space or hyphen ("partial eta-squared"), or by a line break
    // where a narrow column wrapped the name ("partial eta\nsquared").
    if ((gap === 32 || gap === 45 || gap === 10) && isNameCode(text.charCodeAt(at + 1))) at++;
    else if ((gap === 13 || gap === 32) && text.charCodeAt(at + 1) === 10 && isNameCode(text.charCodeAt(at + 2))) at += 2; // "\r\n", " \n" ("𝜂2 \n𝑝= .013")
    else if (gap === 46 && text.charCodeAt(at + 1) === 32 && isAbbreviatedAdjusted(text, wordStarts[words - 1]!, at)) at += 2; // "adj. R2"
    else break;
  }
  const comparatorAt = skipSpaces(text, nameEnd);
  const comparator = readComparator(text, comparatorAt);
  if (comparator === null) return null;
  const valueAt = skipSpaces(text, comparatorAt + comparator.length);
  // ("ηp2 = 2⋅10–3": an effect size in scientific notation, as the p beside it may be.)
  const valueRead = readScientificNumber(text, valueAt, 'unlessThousands');
  if (valueRead === null) return null;
  const glued = !endsWord(text, valueRead.end);
  if (glued && !startsGluedLabel(text, valueRead.end, valueRead.number)) return null;
  const value = valueRead.number;
  const end = valueRead.end;

  for (let word = 0; word < words; word++) {
    const name = canonicalName(text.slice(wordStarts[word]!, nameEnd));
    const kind = EFFECT_NAMES.get(name);
    if (kind !== undefined) {
      return { name, kind, comparator: comparator.comparator, value, start: wordStarts[word]!, end };
    }
  }
  // (A value glued to the next word is taken for effect sizes only: another name's value may go on in a unit.)
  if (glued) return null;
  const lastWordStart = wordStarts[words - 1]!;
  const name = canonicalName(text.slice(lastWordStart, nameEnd));
  return { name, kind: null, comparator: comparator.comparator, value, start: lastWordStart, end };
}

/**
 * Whether the word glued to a value at `position` is the next cell's label run onto it by a crushed table
 * ("d = 0.52Avg. Fixation Duration", "d = 0.21K-Coefficient"): a capital letter and then a small letter or a
 * hyphen, after a value with decimals (an effect size is unitless; a whole number glued to a word is a
 * different token, "2Avg").
 */
function startsGluedLabel(text: string, position: number, value: ReportedNumber): boolean {
  if (value.decimals === 0) return false;
  const capital = text.charCodeAt(position);
  const next = text.charCodeAt(position + 1);
  return capital >= 65 && capital <= 90 && ((next >= 97 && next <= 122) || next === 45);
}

/** How far before a statistic's symbol a model fit may start: "adjusted R2 = .087, F(...)". */
const FIT_BEFORE_WINDOW = 40;
/** Most separator characters between a model fit and the statistic after it: ", (". */
const FIT_BEFORE_GAP = 4;

function isFitSeparator(code: number): boolean {
  return code === 32 || code === 44 || code === 59 || code === 40 || code === 91; // space , ; ( [
}

/**
 * R² and adjusted R² written just before a statistic, as APA style reports
 * a regression model: "R2 = .12, F(3, 96) = 4.36" or "R2 = .12, adjusted R2 =
 * .09, F(...)". At most two, each ending where the next begins (only
 * separators between), none before `notBefore` (text an earlier result
 * consumed). Anything else written before a statistic belongs to the
 * sentence, not to the test.
 */
export function readFitBefore(text: string, statisticStart: number, notBefore: number): ReportedEffect[] {
  const found: ReportedEffect[] = [];
  let end = statisticStart;
  for (let count = 0; count < 2; count++) {
    let valueEnd = end;
    while (valueEnd > notBefore && end - valueEnd < FIT_BEFORE_GAP && isFitSeparator(text.charCodeAt(valueEnd - 1))) valueEnd--;
    if (valueEnd === end) break;
    const fit = fitEndingAt(text, valueEnd, Math.max(notBefore, valueEnd - FIT_BEFORE_WINDOW));
    if (fit === null) break;
    found.unshift({ kind: fit.kind!, comparator: fit.comparator, value: fit.value, interval: null, start: fit.start, end: fit.end });
    end = fit.start;
  }
  return found;
}

/** An R² or adjusted R² whose value ends exactly at `valueEnd`; the longest name wins ("adjusted R2", not "R2"). */
function fitEndingAt(text: string, valueEnd: number, lowest: number): NameValueRead | null {
  for (let start = lowest; start < valueEnd; start++) {
    if (!mayStartFitName(text, start)) continue;
    const read = readNameAndValue(text, start);
    if (read !== null && read.end === valueEnd && (read.kind === 'r-squared' || read.kind === 'adjusted-r-squared')) {
      return isChangeMarked(text, read.start) ? null : read;
    }
  }
  return null;
}

/** "R2", "R^2", "R squared", "r2" or "adj...": the only names readFitBefore reads, checked before reading one. */
function mayStartFitName(text: string, at: number): boolean {
  const code = text.charCodeAt(at);
  if (code === 82 || code === 114) {
    // R r
    const next = text.charCodeAt(at + 1);
    return next === 50 || next === 94 || next === 32 || next === 45 || next === 115; // 2 ^ space - s
  }
  return (code === 65 || code === 97) && text.startsWith('dj', at + 1); // A a
}

/** "ΔR2", "∆R2", "Delta R2": the change in R² between two models, which the F of the change does not determine alone. */
function isChangeMarked(text: string, nameStart: number): boolean {
  const before = text.charCodeAt(nameStart - 1);
  if (before === 0x394 || before === 0x2206) return true;
  return /delta ?$/i.test(text.slice(Math.max(0, nameStart - 6), nameStart));
}

export interface IntervalRead {
  interval: ReportedInterval;
  start: number;
  end: number;
}

/**
 * Reads a confidence interval: "95% CI [0.12, 0.45]", "90% CI (.01, .12)",
 * "CI = [.01; .12]", "95% CI: .01 to .12", "95% confidence interval [...]";
 * with `allowBareBrackets`, also an unlabelled "[.01, .25]" (used only right
 * after an effect size, where a bracketed pair can only be its interval).
 */
export function readInterval(text: string, position: number, allowBareBrackets: boolean): IntervalRead | null {
  let at = position;
  let level: number | null = null;
  const levelRead = readNumber(text, at, false);
  if (levelRead !== null && text.charCodeAt(levelRead.end) === 37) {
    // "95%"
    level = levelRead.number.value / 100;
    at = skipSpaces(text, levelRead.end + 1);
  }
  const labelEnd = readIntervalLabel(text, at);
  const labelled = labelEnd !== -1;
  if (labelled) {
    at = skipSpaces(text, labelEnd);
    const code = text.charCodeAt(at);
    if (code === 58 || code === 61) at = skipSpaces(text, at + 1); // ":" or "="
  } else if (level === null && !allowBareBrackets) {
    return null;
  }

  const opening = text.charCodeAt(at);
  const bracketed = opening === 91 || opening === 40; // [ (
  if (!bracketed && !labelled) return null;
  if (bracketed) at = skipSpaces(text, at + 1);

  // Decimal commas ("[0,01; 0,23]") only when the bounds are not separated by a comma; "[0,1]" is 0 to 1.
  const bounds = readBounds(text, at, 'yes') ?? readBounds(text, at, 'no');
  if (bounds === null) return null;
  const { low: lowRead, high: highRead } = bounds;
  at = highRead.end;
  if (bracketed) {
    at = skipSpaces(text, at);
    const closing = text.charCodeAt(at);
    if (closing !== 93 && closing !== 41) return null;
    at++;
  } else if (!endsWord(text, at)) {
    return null;
  }
  return { interval: { level, low: lowRead.number, high: highRead.number }, start: position, end: at };
}

/** The two ends of an interval and what separates them; with decimal commas, the separator must not be a comma. */
function readBounds(text: string, position: number, decimalComma: 'yes' | 'no'): { low: ReadNumber; high: ReadNumber } | null {
  const low = readNumber(text, position, true, decimalComma);
  if (low === null) return null;
  const separatorAt = skipSpaces(text, low.end);
  if (decimalComma === 'yes' && text.charCodeAt(separatorAt) === 44) return null;
  const separatorEnd = readRangeSeparator(text, separatorAt);
  if (separatorEnd === -1) return null;
  const high = readNumber(text, skipSpaces(text, separatorEnd), true, decimalComma);
  return high === null ? null : { low, high };
}

/** End of "CI" or "confidence interval" at `position`, or -1. */
function readIntervalLabel(text: string, position: number): number {
  if (text.charCodeAt(position) === 67 && text.charCodeAt(position + 1) === 73 && !isAsciiLetter(text.charCodeAt(position + 2))) {
    return position + 2;
  }
  const phrase = 'confidence interval';
  const first = text.charCodeAt(position);
  if ((first === 99 || first === 67) && text.slice(position, position + phrase.length).toLowerCase() === phrase) {
    return position + phrase.length;
  }
  return -1;
}

/** End of the separator between the ends of an interval: ",", ";", "to", or a dash. */
function readRangeSeparator(text: string, position: number): number {
  const code = text.charCodeAt(position);
  if (code === 44 || code === 59 || code === 45) return position + 1;
  if (code === 116 && text.charCodeAt(position + 1) === 111 && !isAsciiLetter(text.charCodeAt(position + 2))) {
    return position + 2;
  }
  return -1;
}
