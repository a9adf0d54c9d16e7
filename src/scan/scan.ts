/**
 * The scanner's entry point: finds every reported test result in a
 * manuscript's text and reads the document-wide context the checks need.
 *
 * Design for linear time: comparators ("=", "<", ">") are found with
 * indexOf; from each, a bounded look back finds a possible statistic symbol,
 * and a hand-written parser with bounded lookahead reads the head and what
 * follows it. Text consumed by one result is never read again.
 */

import { readDocumentContext } from './context.js';
import { readEpsilons } from './epsilon.js';
import { readMeanSquareErrors } from './meanSquareError.js';
import { normaliseText, type NormalisedText } from './normalise.js';
import { startsWord } from './cursor.js';
import { readFitBefore } from './effects.js';
import { endsSentence, readResult, skipSeparators, startsResult, type ResultDraft } from './result.js';
import { readPValue } from './pValue.js';
import type { ReportedEffect, ReportedP, ReportedResult, ScanOutput } from './types.js';

/**
 * How far before its comparator a statistic's symbol may start:
 * "chi-square(df = 2, N = 1,024) =" with generous spacing still fits.
 */
const MAX_HEAD_BEFORE_COMPARATOR = 56;

/** Scans a manuscript's text (any size) for reported results and document context. */
export function scanText(text: string): ScanOutput {
  const normalised = normaliseText(text);
  return {
    results: findResults(normalised),
    context: { ...readDocumentContext(normalised), epsilons: readEpsilons(normalised), meanSquareErrors: readMeanSquareErrors(normalised) },
  };
}

/** All results in document order, with offsets into the original text. */
export function findResults(normalised: NormalisedText): ReportedResult[] {
  const source = withoutMarginNumbers(restoreLostSymbols(restoreWordComparators(restoreLostEquals(restoreMathFontGlyphs(normalised.text)))));
  const results: ReportedResult[] = [];
  const comparators = new ComparatorFinder(source);
  const spans: number[] = [];
  let sharedFloor = 0;
  let consumedUpTo = 0;
  // Statistics without df and p since the last result ("r = 0.48; ER: r = 0.86, both ps < .003"): a plural p
  // later in their sentence makes them results; anything else drops them.
  let waiting: ResultDraft[] = [];
  for (let at = comparators.next(0); at !== -1; at = comparators.next(at + 1)) {
    if (at < consumedUpTo) continue;
    const draft = readResultEndingHeadAt(source, at, consumedUpTo);
    if (draft === null) {
      // A statistic whose p a copy lost, leaving its slot empty ("(r = 0.222, )", where a formula was): the
      // author reported a test there, read without its p.
      const lostP = lostPAfter(source, at, consumedUpTo);
      if (lostP !== null) {
        results.push(toReportedResult(lostP, normalised));
        spans.push(lostP.head.start, lostP.end);
        consumedUpTo = lostP.end;
        waiting = [];
        continue;
      }
      // (Only where a plural p follows within reach: most comparators that start no result are not retried.)
      if (!PLURAL_P_AHEAD.test(source.slice(at, at + PLURAL_P_REACH))) continue;
      const bare = readResultEndingHeadAt(source, at, consumedUpTo, true);
      if (bare !== null && bare.head.df.length === 0 && waiting.length < MAX_SHARING_A_P) waiting.push(bare);
      continue;
    }
    if (draft.p?.plural === true) {
      for (const earlier of waiting) {
        if (earlier.end > draft.head.start || containsSentenceEnd(source, earlier.end, draft.head.start)) continue;
        results.push(toReportedResult(earlier, normalised));
        spans.push(earlier.head.start, earlier.end);
      }
    }
    waiting = [];
    // A critical value looked up for a test ("the critical F(1, 46) = 4.05", "critical value of t(58) = 2.00") is
    // not a result: passed over, and not read again.
    if (CRITICAL_BEFORE.test(source.slice(Math.max(0, draft.head.start - CRITICAL_REACH), draft.head.start))) {
      consumedUpTo = draft.end;
      continue;
    }
    // A regression model's fit is written before its F: "R2 = .12, F(3, 96) = 4.36".
    if (draft.head.kind === 'F') draft.effects.unshift(...readFitBefore(source, draft.head.start, consumedUpTo));
    takePWrittenFirst(source, draft, consumedUpTo);
    if (draft.head.kind === 'r' && draft.head.symbol === null && introducedAsSpearman(source, draft.head.start, consumedUpTo)) {
      draft.head = { ...draft.head, symbol: 'rs' };
    }
    results.push(toReportedResult(draft, normalised));
    spans.push(draft.head.start, draft.end);
    if (draft.p?.plural === true) {
      shareTheirP(source, results, spans, sharedFloor);
      sharedFloor = results.length;
    }
    // Whatever the result consumed (its p, effects, an "r" read as an effect size) is not read again.
    consumedUpTo = draft.end;
  }
  return results;
}

/** An empty slot after a value, where a copy dropped the p: "0.222, )", "0.222; )". */
const EMPTY_P_SLOT = /^ {0,2}[,;] {0,2}\)/;
const LOST_P_REACH = 40;

/** The statistic at `at` without df or p, when an empty slot follows its value (see EMPTY_P_SLOT); else null. */
function lostPAfter(source: string, at: number, notBefore: number): ResultDraft | null {
  const ahead = source.slice(at, at + LOST_P_REACH);
  if (!ahead.includes(')') || !/[,;] {0,2}\)/.test(ahead)) return null;
  const bare = readResultEndingHeadAt(source, at, notBefore, true);
  if (bare === null || bare.p !== null || !EMPTY_P_SLOT.test(source.slice(bare.end, bare.end + 6))) return null;
  return bare;
}

/** "critical", "critical value (of)", "tabulated", "table value of" right before a statistic: a looked-up value. */
const CRITICAL_BEFORE = /(?:(?:critical|tabulated)(?: values?)?|table values?)(?: of| for)?(?: the)? ?$/i;
const CRITICAL_REACH = 32;

/**
 * A statistic whose "=" a PDF font lost together with its p's comparator
 * ("Rho 0.21, p 0.001"): where a symbol (with or without bracketed df), a
 * space, a value, a comma and a p whose sign is lost follow one another,
 * the space after the symbol is read as the "=" it stood for. Both signs
 * lost in one result is what this damage looks like; a symbol and a number
 * alone ("t 2.1") are left alone. The text keeps its length, so offsets do
 * not move.
 */
const LOST_EQUALS = /(?<![\p{L}\d])((?:rho|Rho|ρ|rs|r|t|F|χ2|X2)(?:\s?\(\s?\d+(?:\.\d+)?(?:\s?,\s?\d+(?:\.\d+)?)?\s?\))?) ([-\u2212]?\d*\.\d+, ?p 0?\.\d+)(?![\d.])/gu;

function restoreLostEquals(text: string): string {
  if (!text.includes(', p 0') && !text.includes(', p .') && !text.includes(',p 0') && !text.includes(',p .')) return text;
  return text.replace(LOST_EQUALS, '$1=$2');
}

/**
 * A PDF whose mathematical font maps its signs onto other letters gives "r ¼ \uFFFD0:627, p ¼ :000" for
 * "r = -0.627, p = .000", "Fð1; 52Þ ¼ 6:30" for "F(1; 52) = 6.30": the equals sign comes out as "¼", the minus
 * as U+FFFD, the decimal point as ":" and the brackets as "ð" and "Þ" (common practice: a well-known extraction
 * damage of some publishers' symbol fonts). Normalisation already reads "¼" as "=" before a plain number
 * (normalise.ts symbolFontEquals); what it leaves is a "¼" before a lost minus or a ":" point. In a text that
 * shows that at least MIN_FONT_EQUALS times, each such "¼" becomes "=", the number after it (or after "<", ">")
 * gets its minus and decimal point back, and "ð" and "Þ" next to digits become brackets. One character each,
 * so offsets do not move. A text without the damage is returned as it is.
 */
const FONT_EQUALS = /(?<=[\p{L}\p{N}\u00de)\]] ?)\u00bc(?= ?[-\u2212\ufffd]? ?[:.]?\d)/gu;
const MIN_FONT_EQUALS = 2;
/** A value after a restored sign: its sign, spaces, and the digits around a ":" that stood for the decimal point. */
const FONT_VALUE = /(?<=[=<>\u2264\u2265] ?)(\ufffd?)( ?)(\d*):(?=\d)/gu;
const FONT_MINUS = /(?<=[=<>\u2264\u2265] ?)\ufffd(?= ?[.\d])/gu;
const FONT_OPEN = /\u00f0(?= ?\d)/gu;
const FONT_CLOSE = /(?<=\d ?)\u00de/gu;

function restoreMathFontGlyphs(text: string): string {
  if (!text.includes('\u00bc')) return text;
  const damaged = text.match(FONT_EQUALS)?.length ?? 0;
  if (damaged < MIN_FONT_EQUALS) return text;
  return text
    .replace(FONT_EQUALS, '=')
    .replace(FONT_VALUE, (_, minus: string, space: string, whole: string) => `${minus === '' ? '' : '-'}${space}${whole}.`)
    .replace(FONT_MINUS, '-')
    .replace(FONT_OPEN, '(')
    .replace(FONT_CLOSE, ')');
}

/**
 * A manuscript's margin line numbers run into its text by a PDF's extraction ("… was at 308 the choice point …",
 * "F(9,279)=15.53, 321 p=.135"): a run of at least MIN_MARGIN_RUN whole numbers, each the one before plus one (or
 * two, one number missing),
 * each standing inside a line between other words, MIN_MARGIN_GAP to MAX_MARGIN_GAP characters apart, is blanked
 * (spaces for its digits), so a result and its p are read across it and none of them is read as a value. Numbers at
 * a line's start are left alone (a table's numbered rows). The text keeps its length, so offsets do not move.
 */
const MIN_MARGIN_RUN = 8;
const MIN_MARGIN_GAP = 30;
const MAX_MARGIN_GAP = 400;
const INLINE_NUMBER = /(?<=[^\d\s\-\u2212] )\d{1,5}(?= [^\d\s=<>])/g;

function withoutMarginNumbers(text: string): string {
  const numbers = [...text.matchAll(INLINE_NUMBER)].map((match) => ({ at: match.index!, value: Number(match[0]), length: match[0].length }));
  if (numbers.length < MIN_MARGIN_RUN) return text;
  // Runs of numbers counting up one by one, each taken from the nearest next number in reach that continues it.
  const blanked: { at: number; length: number }[] = [];
  const used = new Set<number>();
  for (let first = 0; first < numbers.length; first++) {
    if (used.has(first)) continue;
    const run = [first];
    let last = first;
    for (let next = first + 1; next < numbers.length; next++) {
      const gap = numbers[next]!.at - numbers[last]!.at;
      if (gap > MAX_MARGIN_GAP) break;
      // (One number of the run may be missing: a line that starts with its number, or the excerpt's first line.)
      const step = numbers[next]!.value - numbers[last]!.value;
      if (gap >= MIN_MARGIN_GAP && (step === 1 || (step === 2 && gap >= 2 * MIN_MARGIN_GAP))) {
        run.push(next);
        last = next;
      }
    }
    if (run.length < MIN_MARGIN_RUN) continue;
    for (const index of run) {
      used.add(index);
      blanked.push(numbers[index]!);
    }
  }
  if (blanked.length === 0) return text;
  const characters = text.split('');
  for (const { at, length } of blanked) for (let offset = 0; offset < length; offset++) characters[at + offset] = ' ';
  return characters.join('');
}

/**
 * A text whose italic symbols a PDF's font lost, leaving their values behind: "( = 4.58, = 0.13)" for a mean and
 * its SD, "(1, 217) = 4.53, = .035" for an F and its p. In a text that shows this damage again and again
 * (MIN_LOST_SYMBOLS signs with no name before them), two whole df in brackets with nothing before them but a
 * space after a bracket or punctuation, then "=" and a value, were an F: the space becomes the "F"; and a lost p
 * right after that value (", = .035", a value under 1) gets its "p" back in the space before its sign. Only two
 * df whose first is at most the second (an F's); one df in brackets may be any statistic's and is left alone. The
 * text keeps its length, so offsets do not move.
 */
const LOST_SYMBOL_SIGN = /[(,;] = [-\u2212]?\.?\d/g;
const MIN_LOST_SYMBOLS = 3;
const LOST_F = /(?<=[(\[,;] |^ )\((\d{1,4}), ?(\d{1,6})\) ?= ?(\d{1,6}(?:\.\d{1,4})?)(, = (?=0?\.\d))?/gm;

function restoreLostSymbols(text: string): string {
  if (!text.includes(' = ')) return text;
  const lost = text.match(LOST_SYMBOL_SIGN)?.length ?? 0;
  if (lost < MIN_LOST_SYMBOLS) return text;
  let restored = text;
  for (const match of text.matchAll(LOST_F)) {
    const [whole, first, second, , lostP] = match;
    if (Number(first) < 1 || Number(first) > Number(second)) continue;
    const at = match.index!;
    // The space before the bracket becomes the F; the space before the lost p's sign, its "p".
    let fixed = `${restored.slice(0, at - 1)}F${restored.slice(at)}`;
    if (lostP !== undefined) {
      const pSpace = at + whole.length - 2;
      fixed = `${fixed.slice(0, pSpace)}p${fixed.slice(pSpace + 1)}`;
    }
    restored = fixed;
  }
  return restored;
}

/**
 * A statistic named with a word and given its value with another word: "the
 * F-value was 5.10", "a t value of 2.41", "the chi-square value is 12.3". The
 * word that stands for "=" is replaced by "=" and spaces, so the text keeps
 * its length and offsets do not move.
 */
const WORD_COMPARATOR = /(?<![\p{L}\d])((?:F|t|z|Z|\u03c72|chi2|chi-squared?|chi squared?|X2)[- ](?:values?|ratio|statistic|score)) (was|were|is|of|equals|equalled|equal to) (?=[-\u2212]?\.?\d)/gu;

function restoreWordComparators(text: string): string {
  const colons = text.includes(':') ? restoreColonSigns(text) : text;
  if (!colons.includes('value') && !colons.includes('ratio') && !colons.includes('statistic') && !colons.includes('score')) return colons;
  return colons
    .replace(WORD_COMPARATOR, (_, named: string, word: string) => `${named} =${' '.repeat(word.length)}`)
    .replace(NAME_COLON_VALUE, '$1=');
}

/**
 * A result written with colons for its signs, "(χ2: 4.21, df: 1, p: 0.04)", "t: 2.31; p: 0.03": a statistic's
 * symbol, a colon and its value, then (after its df written the same way, if any) a p, a colon and a value. Each
 * colon of the run becomes "=" (one character for one, so offsets do not move); a colon after a symbol with no p
 * written so after it ("Figure 2: 4 groups", "F: 4.2" alone) is left alone.
 */
const COLON_RESULT = /(?<![\p{L}\d])((?:F|t|z|Z|\u03c72|chi2|X2|r|rho|\u03c1)(?:\s?\(\d{1,6}(?:\.\d{1,3})?(?:,\s?\d{1,6}(?:\.\d{1,3})?)?\))?) ?: ?([-\u2212]?\d{0,6}\.?\d{1,6}[,;] ?)(?:(df) ?: ?(\d{1,6}(?:\.\d{1,3})?(?:, ?\d{1,6})?[,;] ?))?([pP]) ?: ?(?=[<>]? ?0?\.\d)/gu;

function restoreColonSigns(text: string): string {
  return text.replace(COLON_RESULT, (whole: string) => {
    // The colons of the run, one for each sign: the symbol's, the df's and the p's.
    return whole.replace(/ ?: ?/g, (colon) => colon.replace(':', '='));
  });
}

/**
 * "F-statistic: 4.21 on 1 and 38 DF,  p-value: 0.047", as statistics programs print a model's test: the colon
 * stands for "=" (for the p only after "p-value", where it cannot be a bound's sign).
 */
const NAME_COLON_VALUE = /(?<![\p{L}\d])((?:F|t|z|Z|\u03c72|chi2|X2|p|P)[- ](?:statistic|value|ratio)):(?= {1,2}[-\u2212]?\.?\d)/gu;

/** Longest stretch before a statistic's separator searched for a p written first ("p < 0.001, F(1,22) = 25.98"). */
const P_FIRST_WINDOW = 24;

/**
 * Some tables and texts write the p before its statistic: "Glucose p < 0.001, F(1,22) = 24.43 p = 0.010,
 * F(1,20) = 7.98". A statistic directly after a p and a comma (a p no earlier result took) takes that p;
 * the p it read after itself is given back when a statistic follows it the same way, since it is the
 * next result's. A p after the statistic that nothing follows stays its own ("p < .05, F(1, 20) = 5.1,
 * p = .03" keeps .03).
 */
function takePWrittenFirst(source: string, draft: ResultDraft, notBefore: number): void {
  const written = pWrittenBefore(source, draft.head.start, notBefore);
  if (written === null) return;
  if (draft.p === null && draft.notSignificant) return;
  if (draft.p !== null) {
    if (!startsResult(source, skipSeparators(source, draft.p.end))) return;
    const cut = draft.p.start;
    draft.effects = draft.effects.filter((effect) => effect.start < cut);
    draft.end = Math.max(draft.head.end, ...draft.effects.map((effect) => effect.end));
  }
  draft.p = written;
}

/** The p that ends, with a comma or semicolon and spaces, right where a statistic starts; null when there is none. */
function pWrittenBefore(source: string, headStart: number, notBefore: number): ResultDraft['p'] {
  let at = headStart;
  while (at > notBefore && source.charCodeAt(at - 1) === 32) at--;
  if (at <= notBefore) return null;
  const separator = source.charCodeAt(at - 1);
  if (separator !== 44 && separator !== 59) return null;
  const separatorAt = at - 1;
  for (let start = separatorAt - 1; start >= Math.max(notBefore, separatorAt - P_FIRST_WINDOW); start--) {
    const letter = source.charCodeAt(start);
    if (letter !== 112 && letter !== 80) continue;
    const p = readPValue(source, start);
    if (p === null) continue;
    return source.slice(p.end, separatorAt).trim() === '' ? p : null;
  }
  return null;
}

/** How far before an r the word "Spearman" makes it a rank correlation ("Spearman's correlation was small, r(58) = .12"). */
const SPEARMAN_WINDOW = 60;

/** True when "Spearman" stands shortly before the r, in the same sentence. */
function introducedAsSpearman(source: string, start: number, notBefore: number): boolean {
  const before = source.slice(Math.max(notBefore, start - SPEARMAN_WINDOW), start);
  const at = before.toLowerCase().lastIndexOf('spearman');
  return at !== -1 && !/[.!?]\s/.test(before.slice(at));
}

/** How far after a statistic without p a plural p is looked for. */
const PLURAL_P_REACH = 240;
/** A plural p: "ps", "p's", "p-values", "p values" followed by a comparator. */
const PLURAL_P_AHEAD = /(?<![A-Za-z])[pP](?:s|'s|[- ]?values)\s?(?:[<>=\u2264\u2265])/;

/** Most earlier results a plural p is shared with ("A, B, C and D, ps < .001"). */
const MAX_SHARING_A_P = 12;

/**
 * The newest result carries a plural p ("F(1, 86) = 18.42 and F(1, 86) =
 * 25.93, ps < .001"): every earlier result of the same sentence that has no
 * p (nor "n.s.") of its own gets a copy of it. `spans` holds the normalised
 * start and end of every result; results before `floor` already had their
 * chance, so each gap between results is read at most once (linear time).
 */
function shareTheirP(source: string, results: ReportedResult[], spans: number[], floor: number): void {
  const newest = results.length - 1;
  const shared = results[newest]!.p!;
  const lowest = Math.max(floor, newest - MAX_SHARING_A_P);
  for (let index = newest - 1; index >= lowest; index--) {
    if (containsSentenceEnd(source, spans[2 * index + 1]!, spans[2 * (index + 1)]!)) return;
    const earlier = results[index]!;
    if (earlier.p === null && !earlier.notSignificant) earlier.p = { ...shared, value: { ...shared.value } };
  }
}

function containsSentenceEnd(source: string, from: number, to: number): boolean {
  for (let at = from; at < to; at++) if (endsSentence(source, at)) return true;
  return false;
}

/**
 * Every statistic head contains a comparator ("=", "<", ">"), and prose
 * rarely does, so comparators are the anchors: found with indexOf, which
 * runs at memory speed, instead of testing every letter "t" or "r" of the
 * text as a possible symbol.
 */
class ComparatorFinder {
  private readonly nextOf = [0, 0, 0];
  private static readonly SIGNS = ['=', '<', '>'];

  constructor(private readonly text: string) {
    this.nextOf = ComparatorFinder.SIGNS.map((sign) => text.indexOf(sign));
  }

  /** Offset of the first comparator at or after `from`, or -1. */
  next(from: number): number {
    let nearest = -1;
    for (let index = 0; index < 3; index++) {
      let found = this.nextOf[index]!;
      if (found !== -1 && found < from) {
        found = this.text.indexOf(ComparatorFinder.SIGNS[index]!, from);
        this.nextOf[index] = found;
      }
      if (found !== -1 && (nearest === -1 || found < nearest)) nearest = found;
    }
    return nearest;
  }
}

/** Letters a statistic symbol can start with: F t T r R (Rho) z Z c C x X H. */
function canStartSymbol(code: number): boolean {
  // F, f (an F typed small, only with bracketed df), t, T (a t with its df), r, R, z, Z, c, C, x, X, H, and v ("v2(1)":
  // a symbol font's χ², statistic.ts).
  return code === 70 || code === 102 || code === 116 || code === 84 || code === 114 || code === 82 || code === 122 || code === 90 || code === 99 || code === 67 || code === 120 || code === 88 || code === 72 || code === 118;
}

/**
 * Characters that can stand between a statistic's first letter and its
 * comparator: digits, spaces, brackets and separators, "=" (of "N = 120"),
 * and the letters of the symbols and labels ("chi-squared", "Fs", "df", "N").
 * Looking back from a comparator stops at any other character, so "p = .03"
 * costs one step, not a scan of the whole window.
 */
const HEAD_CHARACTERS: Uint8Array = (() => {
  const table = new Uint8Array(128);
  for (const character of '0123456789 \t\n\r()[]{},;._^-/=FtTrRzZcChiquaredsSfNnxXHoglGlIv') table[character.charCodeAt(0)] = 1;
  return table;
})();

/** Most symbol positions tried per comparator; a real head has one, "chi-square" has no other. */
const MAX_SYMBOL_ATTEMPTS = 3;

/**
 * Looks back from the comparator at `comparatorAt` (no further than
 * `notBefore`) for the statistic whose head it completes, nearest symbol
 * first, and reads the whole result from there.
 */
function readResultEndingHeadAt(source: string, comparatorAt: number, notBefore: number, withoutP = false): ResultDraft | null {
  const lowest = Math.max(notBefore, comparatorAt - MAX_HEAD_BEFORE_COMPARATOR);
  let attempts = 0;
  for (let at = comparatorAt - 1; at >= lowest; at--) {
    const code = source.charCodeAt(at);
    if (code >= 128 || HEAD_CHARACTERS[code] === 0) return withoutP ? null : readFWithEffectName(source, comparatorAt, lowest);
    if (!canStartSymbol(code) || !startsWord(source, at)) continue;
    const draft = readResult(source, at, comparatorAt, withoutP, pWrittenBefore(source, at, notBefore) !== null);
    if (draft !== null) return draft;
    if (++attempts === MAX_SYMBOL_ATTEMPTS) return null;
  }
  return null;
}

/** How far after a comparator "d.f." or "df" must start for an F named by its effect to be looked for. */
const TRAILING_DF_WINDOW = 24;

/**
 * "F Region = 0.01, d.f. = 1,16, P = 0.912": an F whose flattened subscript is its effect's name. Looked for
 * only where df are written after the value (a cheap test first, since most comparators after a word are not
 * results): the nearest "F " before the comparator, then the whole result read from there.
 */
function readFWithEffectName(source: string, comparatorAt: number, lowest: number): ResultDraft | null {
  const after = source.slice(comparatorAt, comparatorAt + TRAILING_DF_WINDOW);
  if (!after.includes('d.f.') && !after.includes('df')) return null;
  for (let at = comparatorAt - 2; at >= lowest; at--) {
    if (source.charCodeAt(at) !== 70 || source.charCodeAt(at + 1) !== 32 || !startsWord(source, at)) continue;
    return readResult(source, at, comparatorAt);
  }
  return null;
}

function toReportedResult(draft: ResultDraft, normalised: NormalisedText): ReportedResult {
  const start = normalised.toOriginal(draft.head.start);
  const end = normalised.toOriginalEnd(draft.end);
  return {
    kind: draft.head.kind,
    ...(draft.head.symbol === null ? {} : { symbol: draft.head.symbol }),
    ...(draft.head.dfFromSampleSize ? { dfFrom: 'sample-size' as const } : {}),
    text: normalised.original.slice(start, end),
    start,
    end,
    df: draft.head.df,
    sampleSize: draft.head.sampleSize,
    value: draft.head.value,
    valueComparator: draft.head.valueComparator,
    p: draft.p === null ? null : mapP(draft.p, normalised),
    notSignificant: draft.notSignificant,
    effects: draft.effects.map((effect) => mapEffect(effect, normalised)),
  };
}

/** Moves a draft's offsets to the original text in place (the draft is not used again). */
function mapP(p: ReportedP, normalised: NormalisedText): ReportedP {
  p.start = normalised.toOriginal(p.start);
  p.end = normalised.toOriginalEnd(p.end);
  return p;
}

function mapEffect(effect: ReportedEffect, normalised: NormalisedText): ReportedEffect {
  effect.start = normalised.toOriginal(effect.start);
  effect.end = normalised.toOriginalEnd(effect.end);
  return effect;
}
