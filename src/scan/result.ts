/**
 * Assembles one result: a statistic head followed by what belongs to it —
 * p-value, "n.s.", effect sizes and their confidence intervals — read in the
 * order written, across commas, semicolons, brackets and "and"/"with".
 *
 * Offsets here are normalised-text offsets; scan.ts maps them back.
 */

import { MAX_GAP, isAsciiLetter, isSpaceCode, plainNumber, startsWord } from './cursor.js';
import { isUnambiguousEffectName, readInterval, readNameAndValue, type NameValueRead } from './effects.js';
import { readNotSignificant, readPValue } from './pValue.js';
import { readStatisticHead, type StatisticHead } from './statistic.js';
import type { ReportedEffect, ReportedInterval, ReportedNumber, ReportedP } from './types.js';
import { parseReportedNumber } from '../stats/reportedNumber.js';

/** A result before its offsets are mapped back to the original text. */
export interface ResultDraft {
  head: StatisticHead;
  end: number;
  p: ReportedP | null;
  notSignificant: boolean;
  effects: ReportedEffect[];
}

/** How far past the last recognised part a p-value may stand ("..., which was reliable, p = .03"). */
const P_SEARCH_WINDOW = 80;
/** How far past the last recognised part an unambiguous effect size may stand. */
const EFFECT_SEARCH_WINDOW = 60;
/** Upper bound on parts after the head, so a long list cannot keep one result growing. */
const MAX_TAIL_PARTS = 12;
/** Longest stretch of separators skipped between two parts. */
const MAX_SEPARATOR_RUN = 24;
/**
 * Longest run of spaces and tabs, within one line, skipped between two parts
 * in addition: the columns of a table typed with spaces ("F < 1      n.s.").
 */
const MAX_COLUMN_GAP = 200;

/**
 * Reads a full result starting at `position`, or null when no statistic
 * starts there (or, when `comparatorAt` is given, when the statistic's
 * comparator is not the one at that offset).
 */
export function readResult(text: string, position: number, comparatorAt = -1, withoutP = false, pWrittenFirst = false): ResultDraft | null {
  const head = readStatisticHead(text, position);
  if (head === null || (comparatorAt !== -1 && head.comparatorAt !== comparatorAt)) return null;
  const draft: ResultDraft = { head, end: head.end, p: null, notSignificant: false, effects: [] };
  withSampleSizeBefore(text, position, draft);
  const directP = readTail(text, draft);
  // (`withoutP`: the caller keeps such a head aside, for a plural p later in the sentence to complete it.)
  // (A p written right before the statistic, "(P = 0.99, chi square = 0.462, df = 8)", is as direct as one after it,
  // once df were read after the value.)
  const pFirst = pWrittenFirst && draft.p === null && draft.head.df.length > 0;
  if (head.needsP && !directP && !pFirst && !(withoutP && draft.p === null && !draft.notSignificant)) return null;
  if (head.needsTrailingDf === true && draft.head.df.length === 0) return null;
  return draft;
}

type LastPart = 'head' | 'p' | 'effect' | 'interval' | 'other';

/**
 * Reads the parts after the head into `draft`. Returns true when a p-value
 * (or "n.s.") stood directly after the head, with nothing but separators
 * between them.
 */
function readTail(text: string, draft: ResultDraft): boolean {
  let position = draft.end;
  let last: LastPart = 'head';
  let directP = false;
  let searchedNearby = false;
  // Whether only effect sizes stood between the head and where the reading is ("t = 2.10, d = 0.77, p = .045": the
  // p is the test's as directly as without the d).
  let onlyEffectsBefore = true;

  for (let parts = 0; parts < MAX_TAIL_PARTS; parts++) {
    if (last === 'effect') {
      // Unlabelled brackets count only here, right after the effect size (a comma may stand between).
      let intervalAt = skipOnlySpaces(text, position);
      if (text.charCodeAt(intervalAt) === 44) intervalAt = skipOnlySpaces(text, intervalAt + 1);
      const interval = readInterval(text, intervalAt, true);
      if (interval !== null) {
        attachInterval(draft, interval.interval, interval.end);
        position = interval.end;
        last = 'interval';
        continue;
      }
    }
    if (last === 'head' && draft.head.df.length === 0) {
      // df in brackets right after the value: "F = 4.21 (1, 38)" (before the separators, which skip brackets).
      const bracketed = readBracketedDf(text, skipOnlySpaces(text, position), draft.head.kind === 'F' ? 2 : 1);
      if (bracketed !== null && (draft.head.kind === 'F' || draft.head.kind === 't' || draft.head.kind === 'chi2')) {
        draft.head = { ...draft.head, df: bracketed.df };
        position = draft.end = bracketed.end;
        continue;
      }
    }
    // Unlabelled brackets right after a correlation are its interval ("r = .32 [.19, .44], p < .001"): read past,
    // the p after it as direct as without it.
    if (last === 'head' && draft.head.kind === 'r') {
      const own = readInterval(text, skipOnlySpaces(text, position), true);
      if (own !== null) {
        position = own.end;
        continue;
      }
    }
    // A statistic alone on its line, as a copy that puts each table cell on its own line gives it, with its p alone
    // on the next line after a blank one ("F1,24 = 0.08" / "" / "p = 0.78"): the p cell is the result's.
    if (last === 'head' && draft.p === null) {
      const below = pCellBelow(text, draft.head.start, position);
      if (below !== null) {
        draft.p = below;
        directP = true;
        position = draft.end = below.end;
        last = 'p';
        continue;
      }
    }
    const next = skipSeparators(text, position);
    if (next >= text.length || startsResult(text, next)) break;

    if ((last === 'head' || last === 'p') && draft.head.df.length === 0) {
      // Older styles give the df after the value: "t = 2.21, df = 28, p = .035", "F = 4.21, df = 1, 44"; some
      // after the p: "χ2 = 7.80, p = 0.020, df = 2".
      const trailing = readTrailingDf(text, next, draft.head.kind === 'F' ? 2 : 1);
      if (trailing !== null) {
        draft.head = { ...draft.head, df: trailing.df };
        position = draft.end = trailing.end;
        continue; // still right after the head: a p that follows counts as direct
      }
    }
    // "F1,18 = 0.41p= 0.53": the statistic's value ended only because a p follows glued to it (statistic.ts).
    // "F6,89 = 10.10 <0.001" closing a crushed table's row: the p column's bound, its "p" left in the header.
    const p = readTailPValue(text, next, last === 'head' && next === draft.head.end) ?? (last === 'head' && draft.p === null && draft.head.df.length > 0 ? boundClosingRow(text, draft.head.end) : null);
    if (p !== null) {
      // A second p-value belongs to something else.
      if (draft.p !== null) break;
      draft.p = p;
      directP ||= last === 'head' || (last === 'effect' && onlyEffectsBefore);
      position = draft.end = p.end;
      last = 'p';
      continue;
    }
    const notSignificantEnd = readNotSignificant(text, next);
    if (notSignificantEnd !== -1) {
      draft.notSignificant = true;
      directP ||= last === 'head' || (last === 'effect' && onlyEffectsBefore);
      position = draft.end = notSignificantEnd;
      last = 'p';
      continue;
    }
    const interval = readInterval(text, next, false);
    if (interval !== null) {
      if (last === 'effect') {
        attachInterval(draft, interval.interval, interval.end);
        last = 'interval';
      } else if (last === 'head' && draft.head.kind === 'r') {
        // A correlation's own interval right after it ("r = .32 [.19, .44], p < .001"): the p after it is still
        // the correlation's, as directly as without the interval.
        last = 'head';
      } else {
        // An interval for something unrecorded (a mean difference): read past it.
        last = 'other';
        onlyEffectsBefore = false;
      }
      position = interval.end;
      continue;
    }
    const named = readNameAndValue(text, next);
    if (named !== null) {
      // A correlation is its own effect size; an "r = ..." after it is another correlation.
      if (named.kind === 'r' && draft.head.kind === 'r') break;
      // One test has one effect size of each kind: a second one belongs to something else
      // ("ηp2 = .25 has been corrected to ηp2 = .14").
      if (named.kind !== null && hasEffectOfKind(draft, named.kind)) break;
      if (named.kind !== null) {
        draft.effects.push({
          kind: named.kind,
          comparator: named.comparator,
          value: named.value,
          interval: null,
          start: named.start,
          end: named.end,
        });
        position = draft.end = named.end;
        last = 'effect';
      } else if (isCorrelationSampleSize(draft, named)) {
        // "r = .30, p = .004, n = 90": a correlation's df are N - 2.
        const n = named.value.value;
        draft.head = { ...draft.head, df: [plainNumber(String(n - 2), 0)], sampleSize: named.value, dfFromSampleSize: true };
        position = draft.end = named.end;
        // Like df written after the value, it leaves a p that follows directly after the head ("r = .30, n = 90, p = .004").
        if (last !== 'head') {
          last = 'other';
          onlyEffectsBefore = false;
        }
      } else {
        // "MSE = 12.4", "b = 0.3": reported alongside, not recorded, but the result continues.
        position = named.end;
        last = 'other';
        onlyEffectsBefore = false;
      }
      continue;
    }
    if (searchedNearby) break;
    searchedNearby = true;
    const nearby = findNearby(text, position, draft.p === null);
    if (nearby === -1) break;
    position = nearby;
    last = 'other';
    onlyEffectsBefore = false;
  }
  return directP;
}

/** Longest run of digits read as one df (a bounded read, like every reader here). */
const MAX_DF_DIGITS = 7;

function readDfNumber(text: string, at: number): { number: ReportedNumber; end: number } | null {
  let end = at;
  while (end < text.length && end - at < MAX_DF_DIGITS && text.charCodeAt(end) >= 48 && text.charCodeAt(end) <= 57) end++;
  if (end === at) return null;
  if (text.charCodeAt(end) === 46 && text.charCodeAt(end + 1) >= 48 && text.charCodeAt(end + 1) <= 57) {
    end++;
    while (end < text.length && end - at < 2 * MAX_DF_DIGITS && text.charCodeAt(end) >= 48 && text.charCodeAt(end) <= 57) end++;
  }
  const number = parseReportedNumber(text.slice(at, end));
  return number === null ? null : { number, end };
}

/** The df named in words before "=" or ":" (the longer first). */
const DF_WORDS = ['degrees of freedom', 'degree of freedom'];

/**
 * "df = 28" or "df = 1, 44" ("dfs", "d.f.", ":" and "/" also read) after a statistic
 * written without df. `count` numbers are needed: two for F, one otherwise;
 * a second number that is not there leaves the part unread.
 */
export function readTrailingDf(text: string, at: number, count: 1 | 2): { df: ReportedNumber[]; end: number } | null {
  const inWords = readDfInWords(text, at, count);
  if (inWords !== null) return inWords;
  // (Also the words themselves: "degrees of freedom = 8", "degree of freedom: 8".)
  const written = text.startsWith('dfs', at)
    ? 'dfs'
    : text.startsWith('df', at)
      ? 'df'
      : text.startsWith('d.f.', at)
        ? 'd.f.'
        : text.startsWith('gl', at)
          ? 'gl'
          : text.startsWith('ddl', at)
            ? 'ddl'
            : (DF_WORDS.find((words) => text.startsWith(words, at) || text.startsWith(words[0]!.toUpperCase() + words.slice(1), at)) ?? null);
  if (written === null) return null;
  let position = at + written.length;
  while (isSpaceCode(text.charCodeAt(position))) position++;
  const sign = text.charCodeAt(position);
  if (sign !== 61 && sign !== 58) return null; // "=" or ":"
  position++;
  while (isSpaceCode(text.charCodeAt(position))) position++;
  const first = readDfNumber(text, position);
  if (first === null) return null;
  if (count === 1) return { df: [first.number], end: first.end };
  position = first.end;
  const separator = text.charCodeAt(position);
  if (text.startsWith(' and ', position)) position += 4; // "d.f. = 1 and 23"
  else if (separator !== 44 && separator !== 47 && separator !== 59) return null; // "," "/" ";"
  position++;
  while (isSpaceCode(text.charCodeAt(position))) position++;
  const second = readDfNumber(text, position);
  return second === null ? null : { df: [first.number, second.number], end: second.end };
}

/**
 * df in brackets right after a statistic's value: "F = 4.21 (1, 38)", "t = 2.05 (38)". Only the df alone in the
 * brackets (whole numbers, or corrected ones with decimals; two for F with the first not above the second,
 * one otherwise), and only where the brackets stand right after the value: "t = 2.05 (SE = 0.4)" is not df.
 */
const BRACKETED_DF = /^\( ?(\d{1,6}(?:\.\d{1,3})?)(?: ?[,;] ?(\d{1,6}(?:\.\d{1,3})?))? ?\)/;
/** The same in square brackets, whole numbers only ("F = 4.50 [1, 23]"): square brackets with decimals are an interval. */
const SQUARE_BRACKETED_DF = /^\[ ?(\d{1,6})(?: ?[,;] ?(\d{1,6}))? ?\]/;

function readBracketedDf(text: string, at: number, count: 1 | 2): { df: ReportedNumber[]; end: number } | null {
  const opening = text.charCodeAt(at);
  if (opening !== 40 && opening !== 91) return null; // "(" or "["
  const match = (opening === 40 ? BRACKETED_DF : SQUARE_BRACKETED_DF).exec(text.slice(at, at + 30));
  if (match === null || (match[2] === undefined) !== (count === 1)) return null;
  const df = [match[1], match[2]].filter((part): part is string => part !== undefined).map((part) => parseReportedNumber(part)!);
  if (df.some((number) => number.value < 1) || (df.length === 2 && df[0]!.value > df[1]!.value)) return null;
  return { df, end: at + match[0].length };
}

/** "with 2 and 57 degrees of freedom", "with 58 df", "on 1 and 44 d.f.", "58 df" after a statistic's value. */
const DF_IN_WORDS = /^(?:(?:with|on) )?(\d{1,6}(?:\.\d{1,3})?)(?: and (\d{1,6}(?:\.\d{1,3})?))? (?:degrees of freedom|dfs?|d\.f\.|DF)(?![A-Za-z])/;

function readDfInWords(text: string, at: number, count: 1 | 2): { df: ReportedNumber[]; end: number } | null {
  // ("with" itself is skipped as a connecting word, so the df may start right at `at`.)
  const first = text.charCodeAt(at);
  if (first !== 119 && first !== 111 && !(first >= 48 && first <= 57)) return null; // "w", "o", a digit
  const match = DF_IN_WORDS.exec(text.slice(at, at + 60));
  if (match === null || (match[2] === undefined) !== (count === 1)) return null;
  const df = [match[1], match[2]].filter((part): part is string => part !== undefined).map((part) => parseReportedNumber(part)!);
  return { df, end: at + match[0].length };
}

/** "n = 90" or "N = 90" after a correlation written without df: a whole number of at least 3. */
function isCorrelationSampleSize(draft: ResultDraft, named: NameValueRead): boolean {
  const { head } = draft;
  if (head.kind !== 'r' || head.df.length > 0 || named.name !== 'n' || named.comparator !== '=') return false;
  const { value, decimals, exponent } = named.value;
  return decimals === 0 && exponent === 0 && Number.isInteger(value) && value >= 3;
}

/** "(N = 18, " right before a correlation, in its brackets: the correlation's sample size. */
const SAMPLE_SIZE_BEFORE = /[([]\s{0,2}[Nn]\s{0,2}=\s{0,2}(\d{1,7})\s{0,2}[,;]\s{0,2}$/;

/** "(N = 18, r = −0.595, p = .009)": a correlation's df are N - 2, from the N written before it in its brackets. */
function withSampleSizeBefore(text: string, position: number, draft: ResultDraft): void {
  const { head } = draft;
  if (head.kind !== 'r' || head.df.length > 0) return;
  const before = SAMPLE_SIZE_BEFORE.exec(text.slice(Math.max(0, position - 30), position));
  if (before === null) return;
  const n = Number(before[1]);
  if (n < 3) return;
  draft.head = { ...head, df: [plainNumber(String(n - 2), 0)], sampleSize: plainNumber(before[1]!, 0), dfFromSampleSize: true };
}

function hasEffectOfKind(draft: ResultDraft, kind: ReportedEffect['kind']): boolean {
  for (const effect of draft.effects) if (effect.kind === kind) return true;
  return false;
}

/** Most blank lines between a statistic's cell and its p's cell (one cell per line, blank lines between). */
const MAX_BLANK_LINES_TO_P_CELL = 2;
/** Longest p cell read below a statistic's cell ("p = 0.0001***"). */
const MAX_P_CELL = 24;

/**
 * The p standing alone on a line just below a statistic that stands alone on its own line (from `headStart`
 * to `valueEnd`, nothing else on the line but spaces and a cell's pipe), blank lines between; null otherwise.
 * Only a whole line that is a p ("p = 0.78", "P < .001*"): a line of prose after a table is no cell.
 */
function pCellBelow(text: string, headStart: number, valueEnd: number): ReportedP | null {
  const lineStart = text.lastIndexOf('\n', headStart - 1) + 1;
  if (!onlyCellSpace(text, lineStart, headStart)) return null;
  let lineEnd = text.indexOf('\n', valueEnd);
  if (lineEnd < 0 || !onlyCellSpace(text, valueEnd, lineEnd)) return null;
  let blank = 0;
  for (;;) {
    const next = lineEnd + 1;
    const nextEnd = text.indexOf('\n', next);
    const end = nextEnd < 0 ? text.length : nextEnd;
    if (onlyCellSpace(text, next, end)) {
      if (++blank > MAX_BLANK_LINES_TO_P_CELL || nextEnd < 0) return null;
      lineEnd = nextEnd;
      continue;
    }
    let first = next;
    while (first < end && (isSpaceCode(text.charCodeAt(first)) || text.charCodeAt(first) === 124)) first++;
    if (end - first > MAX_P_CELL || (text.charCodeAt(first) !== 112 && text.charCodeAt(first) !== 80)) return null;
    const p = readPValue(text, first, true);
    if (p === null || !onlyCellSpace(text, p.end, end, true)) return null;
    // Cells alternate, statistic then p, in a row's cells; a run of statistics then a run of p's is a table on its
    // side (the row of F's, then the row of their p's): the p below the last F is the first F's.
    const before = neighbourCell(text, lineStart, -1);
    const after = neighbourCell(text, end, 1);
    if (before !== null && before.charCodeAt(0) === text.charCodeAt(headStart) && /[=<>]/.test(before)) return null;
    if (after !== null && /^[pP] ?[=<>\u2264\u2265]/.test(after)) return null;
    return p;
  }
}

/** Most lines looked past for a neighbouring cell (blank lines and lines of a pipe alone). */
const MAX_LINES_TO_NEIGHBOUR = 4;

/**
 * The trimmed text of the nearest line with more than spaces and pipes before the line starting at `from`
 * (`direction` -1) or after the line ending at `from` (1); null when none is near.
 */
function neighbourCell(text: string, from: number, direction: -1 | 1): string | null {
  let at = from;
  for (let lines = 0; lines < MAX_LINES_TO_NEIGHBOUR; lines++) {
    let start: number;
    let end: number;
    if (direction < 0) {
      if (at <= 0) return null;
      end = at - 1;
      start = text.lastIndexOf('\n', end - 1) + 1;
      at = start;
    } else {
      if (at >= text.length) return null;
      start = at + 1;
      const next = text.indexOf('\n', start);
      end = next < 0 ? text.length : next;
      at = end;
    }
    if (!onlyCellSpace(text, start, end)) return text.slice(start, end).replace(/\|/g, ' ').trim();
  }
  return null;
}

/** Whether text[from, to) holds only spaces and a cell's pipe (and, when `marks`, significance marks). */
function onlyCellSpace(text: string, from: number, to: number, marks = false): boolean {
  for (let at = from; at < to; at++) {
    const code = text.charCodeAt(at);
    if (isSpaceCode(code) || code === 124 || code === 13) continue;
    if (marks && (code === 42 || code === 0x2020 || code === 0x2021)) continue;
    return false;
  }
  return true;
}

/**
 * A p-value among the parts of a result: read as written even when out of
 * range ("p = 1.20"), and a plural one may be introduced by "all" or "both"
 * ("all ps < .001").
 */
function readTailPValue(text: string, at: number, gluedToValue = false): ReportedP | null {
  const p = readPValue(text, at, true, gluedToValue);
  if (p !== null) return p;
  const described = describedPValue(text, at);
  if (described !== null) return described;
  const quantifier = quantifierLength(text, at);
  if (quantifier === 0) return null;
  const shared = readPValue(text, at + quantifier, true);
  // "all p < .05" is as plural as "all ps < .05".
  if (shared !== null) shared.plural = true;
  return shared;
}

/**
 * Words that say how a p was worked out, written before it: "two-tailed p = .02", "exact p = .031",
 * "Bonferroni-corrected p = .04". The p is the result's all the same; the tails and the adjustment are read
 * from the same words by the document context and the adjustment reader.
 */
const P_DESCRIPTIONS: ReadonlySet<string> = new Set([
  'two-tailed', 'two-sided', 'one-tailed', 'one-sided', 'exact', 'uncorrected', 'unadjusted', 'corrected', 'adjusted',
  'bonferroni-corrected', 'bonferroni-adjusted', 'holm-corrected', 'holm-adjusted', 'fdr-corrected', 'fdr-adjusted',
  'tukey-adjusted', 'asymptotic', 'permutation', 'bootstrapped',
]);
/** Longest such word read. */
const MAX_P_DESCRIPTION = 22;

/** A p after a describing word ("two-tailed p = .02"), or SPSS's "Sig. = .020" after a statistic; null otherwise. */
function describedPValue(text: string, at: number): ReportedP | null {
  if (!startsWord(text, at) || !isAsciiLetter(text.charCodeAt(at))) return null;
  if (text.startsWith('Sig.', at) || text.startsWith('sig.', at)) {
    const signAt = skipSpaceRun(text, at + 4);
    const sign = text.charCodeAt(signAt);
    if (sign !== 61 && sign !== 60 && sign !== 62) return null; // "=", "<", ">"
    // Read as "p " and what follows the word (the comparator and the value); offset i there is signAt - 2 + i here.
    const read = readPValue(`p ${text.slice(signAt, signAt + 24)}`, 0, true);
    if (read === null) return null;
    return { ...read, start: at, end: signAt - 2 + read.end };
  }
  let end = at;
  const limit = Math.min(text.length, at + MAX_P_DESCRIPTION + 1);
  while (end < limit && (isAsciiLetter(text.charCodeAt(end)) || text.charCodeAt(end) === 45)) end++;
  if (end === limit || text.charCodeAt(end) !== 32) return null;
  if (!P_DESCRIPTIONS.has(text.slice(at, end).toLowerCase())) return null;
  return readPValue(text, end + 1, true);
}

function skipSpaceRun(text: string, at: number): number {
  let position = at;
  while (text.charCodeAt(position) === 32) position++;
  return position;
}

/** Words a p column's cell may carry after its bound ("<0.001 FDR", "< .05 a", "<0.001 ***"). */
const AFTER_ROW_BOUND = /^(?:[ \t]{1,3}(?:FDR|[*\u2020\u2021]{1,4}|[a-h]))?[ \t]*(?:\r?\n|$)/;

/**
 * A bound that closes a table row right after a statistic written with its df ("F6,89 = 10.10 <0.001", one
 * space apart, then the line's end): the p column's cell, its "p" left in the header. Only "<" and "≤" (a bare
 * number there could be an effect size or a count); only at a line's end.
 */
function boundClosingRow(text: string, valueEnd: number): ReportedP | null {
  if (text.charCodeAt(valueEnd) !== 32) return null;
  let at = valueEnd + 1;
  const sign = text.charCodeAt(at);
  if (sign !== 60 && sign !== 8804) return null; // "<", "≤"
  at++;
  if (text.charCodeAt(at) === 32) at++;
  const read = readPValue(`p < ${text.slice(at, at + 12)}`, 0, false);
  if (read === null || read.value.value <= 0 || read.value.value > MAX_ROW_BOUND) return null;
  const end = at + read.end - 4;
  if (!AFTER_ROW_BOUND.test(text.slice(end, end + 12))) return null;
  return { ...read, comparator: sign === 60 ? '<' : '<=', start: valueEnd + 1, end };
}

/** Largest bound read as a row's p ("<0.10"). */
const MAX_ROW_BOUND = 0.1;

/** Length of "all " or "both " (with its space) at `at`; 0 otherwise. */
function quantifierLength(text: string, at: number): number {
  const first = text.charCodeAt(at);
  if (first !== 97 && first !== 98 && first !== 65 && first !== 66) return 0; // a, b, A, B
  if (!startsWord(text, at)) return 0;
  for (const word of ['all ', 'both ']) {
    if (text.slice(at, at + word.length).toLowerCase() === word) return word.length;
  }
  return 0;
}

/** Gives the last effect size its confidence interval, which ends at `end`. */
function attachInterval(draft: ResultDraft, interval: ReportedInterval, end: number): void {
  const effect = draft.effects[draft.effects.length - 1];
  if (effect === undefined) return;
  effect.interval = interval;
  effect.end = end;
  draft.end = end;
}

/**
 * True when a complete result starts at `at`: a head that stands on its own,
 * or a head without df ("r = .38") that a p-value follows directly. The
 * latter distinction keeps "t(28) = 2.21, p = .03, r = .38" reading r as the
 * t-test's effect size rather than as a new result.
 */
export function startsResult(text: string, at: number): boolean {
  const head = readStatisticHead(text, at);
  if (head === null) return false;
  if (!head.needsP) return true;
  const next = skipSeparators(text, head.end);
  return readTailPValue(text, next) !== null || readNotSignificant(text, next) !== -1;
}

/**
 * Looks a short way ahead, within the sentence and before the next
 * statistic, for where a p-value (when still missing) or an unambiguous
 * effect size starts. Returns that position, or -1.
 */
function findNearby(text: string, from: number, wantP: boolean): number {
  const window = wantP ? P_SEARCH_WINDOW : EFFECT_SEARCH_WINDOW;
  const limit = Math.min(text.length, from + window);
  for (let at = from; at < limit; at++) {
    const code = text.charCodeAt(at);
    if (endsSentence(text, at)) return -1;
    // Nor past the end of a table row: a p on the next line is the next row's.
    if (code === 10 && endsTableRow(text, at)) return -1;
    if (!isAsciiLetter(code) || !startsWord(text, at)) continue;
    if (startsResult(text, at)) return -1;
    if (wantP && readTailPValue(text, at) !== null) return at;
    const named = readNameAndValue(text, at);
    if (named !== null && named.start === at && isUnambiguousEffectName(named.name)) return at;
  }
  return -1;
}

/** Abbreviations whose point stands inside a sentence: "vs", "e.g", "i.e", "cf", "Fig", "approx", "resp", "ca". */
const ABBREVIATION_BEFORE = /(?:^|[^A-Za-z.])(?:vs|e\.g|i\.e|cf|Fig|Figs|approx|resp|ca)$/;

/** A full stop, "!" or "?" followed by space, or a blank line: parts of a result do not cross it. */
export function endsSentence(text: string, at: number): boolean {
  const code = text.charCodeAt(at);
  if (code === 46 || code === 33 || code === 63) {
    const after = text.charCodeAt(at + 1);
    if (!(Number.isNaN(after) || isSpaceCode(after))) return false;
    // (The point of an abbreviation inside a sentence, "primary vs. associative", "e.g.", "Fig.", ends nothing.)
    return code !== 46 || !ABBREVIATION_BEFORE.test(text.slice(Math.max(0, at - 6), at));
  }
  if (code === 10) {
    let cursor = at + 1;
    while (cursor < text.length && cursor < at + MAX_GAP && (text.charCodeAt(cursor) === 32 || text.charCodeAt(cursor) === 13)) cursor++;
    return text.charCodeAt(cursor) === 10;
  }
  return false;
}

function skipOnlySpaces(text: string, position: number): number {
  let at = position;
  const limit = Math.min(text.length, position + MAX_GAP);
  while (at < limit && isSpaceCode(text.charCodeAt(at))) at++;
  return at;
}

/**
 * Skips what stands between two parts of one result: spaces, line breaks,
 * commas, semicolons, colons, brackets, the "|" of a Markdown table row, and
 * the words "and" / "with". One
 * run of spaces and tabs within a line may be longer (MAX_COLUMN_GAP), as
 * between the columns of a table. A blank line is not skipped.
 */
export function skipSeparators(text: string, position: number): number {
  let limit = Math.min(text.length, position + MAX_SEPARATOR_RUN);
  let at = position;
  let columnGapUsed = false;
  let lineBreaks = 0;
  let lastMark = 0;
  let blankCrossed = false;
  while (at < limit) {
    const code = text.charCodeAt(at);
    if (code === 10) {
      // A blank line ends the paragraph, and parts of a result do not cross it,
      // except once after a comma or semicolon: a table cell broken over two
      // cells of a copy that puts each cell on its own line ("F1, 24 = 2.26,"
      // then "P > 0.05") says by its comma that the result goes on.
      if (++lineBreaks === 2) {
        if (blankCrossed || (lastMark !== 44 && lastMark !== 59)) break;
        blankCrossed = true;
        lineBreaks = 1;
      }
      // Nor does the end of a table row: a line that ends in the pipe of its last cell.
      if (endsTableRow(text, at)) break;
    } else if (!isSpaceCode(code)) {
      lineBreaks = 0;
      lastMark = code;
    }
    if ((code === 32 || code === 9) && !columnGapUsed) {
      const runEnd = skipLineSpaces(text, at);
      if (runEnd - at > 1) {
        columnGapUsed = true;
        limit = Math.min(text.length, Math.max(limit, runEnd + MAX_SEPARATOR_RUN));
        at = runEnd;
        continue;
      }
    }
    // 124: "|", the cell border of a Markdown table.
    if (isSpaceCode(code) || code === 44 || code === 59 || code === 58 || code === 40 || code === 41 || code === 91 || code === 93 || code === 124) {
      at++;
      continue;
    }
    const connector = connectorLength(text, at);
    if (connector > 0) {
      at += connector;
      continue;
    }
    break;
  }
  return at;
}

/** True when the line break at `at` ends a row of a pipe table ("... | .041 |\n"). */
function endsTableRow(text: string, at: number): boolean {
  let cursor = at - 1;
  while (cursor >= 0 && cursor > at - MAX_GAP && (text.charCodeAt(cursor) === 32 || text.charCodeAt(cursor) === 13 || text.charCodeAt(cursor) === 9)) cursor--;
  if (cursor >= 0 && text.charCodeAt(cursor) === 124) return true;
  return holdsTabbedCells(text, at);
}

/** Longest line looked back over for a tab between cells. */
const MAX_ROW_LOOKBACK = 400;

/**
 * Whether the line that ends at `at` is a row of cells apart by tabs (a tab after some text: indentation does not
 * count). Its next line is the next row, and a p there is another row's.
 */
function holdsTabbedCells(text: string, at: number): boolean {
  let textSeen = false;
  for (let cursor = at - 1; cursor >= 0 && cursor >= at - MAX_ROW_LOOKBACK; cursor--) {
    const code = text.charCodeAt(cursor);
    if (code === 10) return false;
    if (code === 9) {
      if (textSeen && lineHasTextBefore(text, cursor)) return true;
    } else if (code !== 32 && code !== 13) textSeen = true;
  }
  return false;
}

function lineHasTextBefore(text: string, at: number): boolean {
  for (let cursor = at - 1; cursor >= 0 && cursor >= at - MAX_ROW_LOOKBACK; cursor--) {
    const code = text.charCodeAt(cursor);
    if (code === 10) return false;
    if (code !== 32 && code !== 9 && code !== 13) return true;
  }
  return false;
}

/** End of the run of spaces and tabs at `position`, read no further than MAX_COLUMN_GAP characters. */
function skipLineSpaces(text: string, position: number): number {
  const limit = Math.min(text.length, position + MAX_COLUMN_GAP);
  let at = position;
  while (at < limit) {
    const code = text.charCodeAt(at);
    if (code !== 32 && code !== 9) break;
    at++;
  }
  return at;
}

/** Length of "and", "with" or "&" standing as a word at `at`; 0 otherwise. */
function connectorLength(text: string, at: number): number {
  if (text.charCodeAt(at) === 38) return 1;
  if (!startsWord(text, at)) return 0;
  for (const word of ['and', 'with']) {
    if (text.startsWith(word, at) && !isAsciiLetter(text.charCodeAt(at + word.length))) return word.length;
  }
  return 0;
}
