/**
 * Reads the head of a reported test statistic: its symbol, degrees of
 * freedom, comparator and value ("F(2, 57) = 4.21", "t28 = 2.1", "F < 1",
 * "χ2(2, N = 120) = 7.81" once normalised to "chi2(2, N = 120) = 7.81").
 *
 * Works on the normalised text with bounded lookahead: a head is at most a
 * few dozen characters, so each candidate costs a constant amount of work.
 */

import {
  isAsciiDigit,
  isAsciiLetter,
  plainNumber,
  readComparator,
  readNumber,
  skipSpaces,
  startsWord,
  type ReadNumber,
} from './cursor.js';
import type { Comparator, ReportedNumber, StatisticKind, StatisticSymbol } from './types.js';
import { parseReportedNumber } from '../stats/reportedNumber.js';

export interface StatisticHead {
  kind: StatisticKind;
  /** The symbol written, when it is not the kind's own (types.ts, StatisticSymbol). */
  symbol: StatisticSymbol | null;
  /** True when the df were worked out from a sample size written after the result ("r = .30, p = .004, n = 90"). */
  dfFromSampleSize?: boolean;
  /** Normalised offsets of the symbol's first character and the value's end. */
  start: number;
  end: number;
  /** Normalised offset of the comparator ("=" in "F(1, 44) = 5.1"). */
  comparatorAt: number;
  df: ReportedNumber[];
  sampleSize: ReportedNumber | null;
  value: ReportedNumber;
  valueComparator: Comparator;
  /**
   * Written without degrees of freedom (or with an ambiguous flattened
   * subscript such as "t1"): it only counts as a result when a p-value
   * follows directly, because "r = 2.5 cm" or "t1 = 3.2" are not tests.
   */
  needsP: boolean;
  /** A symbol trusted only with its df ("X2"), which must then follow the value ("X2 = 18.4, df = 4"). */
  needsTrailingDf?: boolean;
}

/**
 * Smallest flattened subscript df accepted for t without a p-value ("t28 = 2.1";
 * "t1 = 0.5" is a time point), and for r at all (see readSubscriptDf).
 */
const MIN_BARE_SUBSCRIPT_DF = 5;

interface SymbolRead {
  kind: StatisticKind;
  symbol?: StatisticSymbol;
  end: number;
  /** "X2": only trusted with degrees of freedom in brackets... */
  requiresBracketedDf: boolean;
  /** ...or written after the value ("X2 = 18.4, df = 4"). */
  acceptsTrailingDf?: boolean;
  /** The symbol's superscript 2 comes after its bracketed df ("χ(1)2 = 4.21"). */
  superscriptAfterDf?: boolean;
  /** "T": only with df in brackets or a subscript of two digits or more. */
  requiresDf?: boolean;
  /** The df a LaTeX subscript gives the symbol ("\chi _2^2", "\chi^{2}_{1}"). */
  subscriptDf?: ReportedNumber;
  /** A symbol that lost a glyph ("X(1)" for "χ²(1)"): a test only with its p after it. */
  requiresP?: boolean;
}

/** Reads the statistic symbol at `position`, or null. */
function readSymbol(text: string, position: number): SymbolRead | null {
  if (!startsWord(text, position)) return null;
  const code = text.charCodeAt(position);
  switch (code) {
    case 70: // F
    case 116: // t
      return singleLetterSymbol(text, position, code === 70 ? 'F' : 't', true);
    case 102: // f
      // "f(2,11)=23.5: p=0.008": an F typed in small letters, trusted only with two df in brackets and its p
      // (a small f alone is Cohen's f, "f(x)" a function).
      return LOWER_F_WITH_DF.test(text.slice(position, position + 16)) ? { kind: 'F', end: position + 1, requiresBracketedDf: true, requiresP: true } : null;
    case 84: {
      // "T(28) = 2.2", "T28 = 2.2": a t test typed with a capital, trusted only with its df (and its p, as any t).
      // (Not "T2 = 12.3": a one-digit subscript may be Hotelling's T², a time point "T1" has no df.)
      const capital = singleLetterSymbol(text, position, 't', false);
      return capital === null ? null : { ...capital, requiresDf: true };
    }
    case 114: // r
      return spearmanSymbol(text, position) ?? singleLetterSymbol(text, position, 'r', false);
    case 82: // R: only "Rho", Spearman's rho at the start of a sentence or cell ("R" alone is a multiple correlation)
      return text.startsWith('Rho', position) && !isAsciiLetter(text.charCodeAt(position + 3))
        ? { kind: 'r', symbol: 'rs', end: position + 3, requiresBracketedDf: false }
        : null;
    case 122: // z
    case 90: // Z
      return singleLetterSymbol(text, position, 'z', false);
    case 99: // c
    case 67: // C
      return chiSquareWord(text, position);
    case 120: // x
    case 88: // X
      return chiSquareLetterX(text, position);
    case 72: // H
      return kruskalWallisH(text, position);
    case 118: // v
      return symbolFontChi(text, position);
    default:
      return null;
  }
}

/** "F", "Fs" (as in "all Fs < 1"), "t", "ts", "r", "z": the letter must stand alone. */
function singleLetterSymbol(text: string, position: number, kind: StatisticKind, allowPlural: boolean): SymbolRead | null {
  let end = position + 1;
  if (allowPlural && text.charCodeAt(end) === 115 && !isAsciiLetter(text.charCodeAt(end + 1))) end++;
  if (isAsciiLetter(text.charCodeAt(end))) return null;
  return { kind, end, requiresBracketedDf: false };
}

/** "chi2", "chi^2", "chi-square", "chi square", "chisquare", "chi-squared" (any capitalisation of the first letter). */
function chiSquareWord(text: string, position: number): SymbolRead | null {
  const word = text.slice(position, position + 3).toLowerCase();
  if (word !== 'chi') return null;
  const latex = LATEX_CHI_WITH_DF.exec(text.slice(position + 3, position + 3 + MAX_LATEX_CHI));
  if (latex !== null) {
    const df = parseReportedNumber(latex[1] ?? latex[2]!);
    if (df !== null) return { kind: 'chi2', end: position + 3 + latex[0].length, requiresBracketedDf: false, subscriptDf: df };
  }
  const flattened = flattenedChiDf(text, position + 3);
  if (flattened !== null) return { kind: 'chi2', end: flattened.end, requiresBracketedDf: false, subscriptDf: flattened.df, requiresP: true };
  let at = position + 3;
  if (text.charCodeAt(at) === 94) at++; // "^"
  // "χ 2(2) = 5.9": the superscript set apart from its χ, as web pages and PDFs give it.
  else if (text.charCodeAt(at) === 32 && text.charCodeAt(at + 1) === 50 && !isAsciiDigit(text.charCodeAt(at + 2)) && !isAsciiLetter(text.charCodeAt(at + 2))) at++;
  if (text.charCodeAt(at) === 50 && !isAsciiDigit(text.charCodeAt(at + 1))) {
    return { kind: 'chi2', end: at + 1, requiresBracketedDf: false };
  }
  // "chi^{2}", as LaTeX writes it.
  if (text.startsWith('^{2}', position + 3)) return { kind: 'chi2', end: position + 7, requiresBracketedDf: false };
  // "χ(1)2 = 4.21", "χ (1) 2": the superscript 2 set after the df, as a typeset χ²₁ can come out of a PDF or a web page.
  if (superscriptFollowsDf(text, skipOnlySpace(text, position + 3))) return { kind: 'chi2', end: position + 3, requiresBracketedDf: true, superscriptAfterDf: true };
  at = position + 3;
  const joiner = text.charCodeAt(at);
  if (joiner === 45 || joiner === 32) at++;
  if (text.slice(at, at + 6).toLowerCase() !== 'square') return null;
  at += 6;
  if (text.charCodeAt(at) === 100) at++; // "d"
  if (isAsciiLetter(text.charCodeAt(at))) return null;
  return { kind: 'chi2', end: at, requiresBracketedDf: false };
}

/**
 * A chi-square's df as a LaTeX subscript beside its superscript 2, after "\chi" (normalised to "chi"): "_2^2",
 * " _2^2" (MathJax's source keeps a space), "_{2}^{2}", "^2_1", "^{2}_{(1)}".
 */
const LATEX_CHI_WITH_DF = /^ ?(?:_\{?\(?(\d{1,3})\)?\}?\^\{?2\}?|\^\{?2\}?_\{?\(?(\d{1,3})\)?\}?)(?![\d.])/;
const MAX_LATEX_CHI = 24;

/**
 * A χ² whose subscript df and superscript 2 a copy ran onto the symbol, in either order, right before its sign:
 * "χ32 = 9.96" (χ²₃, the subscript first, as some journals' pages give it) or "χ23 = 9.96" (the superscript first),
 * both df 3; "χ22" is df 2 either way. A run that both orders read differently ("χ212": df 12 or 21) is not read.
 * Only with a p after it (the scanner asks for one): "χ23" could otherwise be a χ² with a footnote.
 */
function flattenedChiDf(text: string, at: number): { df: ReportedNumber; end: number } | null {
  let end = at;
  while (end < text.length && end - at < 4 && isAsciiDigit(text.charCodeAt(end))) end++;
  const digits = text.slice(at, end);
  if (digits.length < 2 || isAsciiDigit(text.charCodeAt(end)) || isAsciiLetter(text.charCodeAt(end))) return null;
  const sign = skipOnlySpace(text, end);
  if (!'=<>'.includes(text[sign] ?? 'x')) return null;
  const superscriptFirst = digits.startsWith('2') ? digits.slice(1) : null;
  const subscriptFirst = digits.endsWith('2') ? digits.slice(0, -1) : null;
  const readings = new Set([superscriptFirst, subscriptFirst].filter((df): df is string => df !== null && df !== '' && !df.startsWith('0')));
  if (readings.size !== 1) return null;
  const df = parseReportedNumber([...readings][0]!);
  return df === null || df.value > 200 ? null : { df, end };
}

/**
 * Kruskal-Wallis "H(2) = 7.81" or "H(2, N = 60) = 7.81": tested against the
 * chi-square distribution with k - 1 df, as statistical software reports it
 * (Kruskal & Wallis, 1952; SciPy's scipy.stats.kruskal). Bracketed df are
 * required: "H2 = .45" is a heritability, "H = 0.8" an entropy.
 */
function kruskalWallisH(text: string, position: number): SymbolRead | null {
  if (isAsciiLetter(text.charCodeAt(position + 1)) || isAsciiDigit(text.charCodeAt(position + 1))) return null;
  // ("H = 9.35, df = 2": df written after the value are read too.)
  return { kind: 'chi2', symbol: 'H', end: position + 1, requiresBracketedDf: true, acceptsTrailingDf: true };
}

/** Spearman's "rs", "r_s" (a flattened or marked subscript) and "rho" (ρ spelled out by normalisation). */
function spearmanSymbol(text: string, position: number): SymbolRead | null {
  for (const written of ['rs', 'r_s', 'rho']) {
    if (text.startsWith(written, position) && !isAsciiLetter(text.charCodeAt(position + written.length))) {
      return { kind: 'r', symbol: 'rs', end: position + written.length, requiresBracketedDf: false };
    }
  }
  // "r s (34)": the subscript set apart from its r, as web pages and PDFs flatten it; only with bracketed df.
  if (text.startsWith('r s', position) && !isAsciiLetter(text.charCodeAt(position + 3))) {
    const bracket = skipSpaces(text, position + 3);
    if (OPENING_BRACKETS.has(text.charCodeAt(bracket))) return { kind: 'r', symbol: 'rs', end: position + 3, requiresBracketedDf: true };
  }
  return null;
}

/** One space at most. */
function skipOnlySpace(text: string, at: number): number {
  return text.charCodeAt(at) === 32 ? at + 1 : at;
}

/** Whether a bracket at `at` closes within a few characters and is followed by a lone "2" (after one space at most). */
function superscriptFollowsDf(text: string, at: number): boolean {
  if (text.charCodeAt(at) !== 40 && text.charCodeAt(at) !== 91) return false;
  for (let close = at + 1; close < text.length && close - at <= 24; close++) {
    const code = text.charCodeAt(close);
    if (code === 41 || code === 93) {
      const two = skipOnlySpace(text, close + 1);
      const next = text.charCodeAt(two + 1);
      return text.charCodeAt(two) === 50 && !isAsciiDigit(next) && !isAsciiLetter(next) && next !== 46 && next !== 44;
    }
    if (code === 40 || code === 91 || code === 10) return false;
  }
  return false;
}

/**
 * "v2(1) = 4.80": χ² as a symbol font's χ comes out of some PDFs (as its "<" comes out as "b" and its "=" as
 * "¼"); trusted only with bracketed df right after it.
 */
function symbolFontChi(text: string, position: number): SymbolRead | null {
  if (text.charCodeAt(position + 1) !== 50 || text.charCodeAt(position + 2) !== 40) return null;
  return { kind: 'chi2', end: position + 2, requiresBracketedDf: true, acceptsTrailingDf: false };
}

/** "f(2,11)=", "f (2, 11) =": a small f with a pair of whole-number df in brackets, then "=". */
const LOWER_F_WITH_DF = /^f ?\(\d{1,3}, ?\d{1,5}\) ?=/;

/** "(1) = ", "(12) =": whole-number df in brackets right after the X, then "=". */
const LOST_SQUARE_DF = /^\(\d{1,3}\) ?=/;

/** The last document asked about and whether it names the chi-square ("chi-square", "chi2", "χ²" normalised to "chi2"). */
let chiSquareNamed: { text: string; named: boolean } | null = null;

function mentionsChiSquare(text: string): boolean {
  if (chiSquareNamed?.text !== text) chiSquareNamed = { text, named: /chi(?:2|\^|[- ]?squ)/i.test(text) };
  return chiSquareNamed.named;
}

/** "X2" / "X^2" / "x2": how χ² often survives PDF extraction; bracketed df required. */
function chiSquareLetterX(text: string, position: number): SymbolRead | null {
  // "X-squared (1) = 2.19", "X-squared = 2.19, df = 1": the name R's chisq.test prints (common practice to paste it).
  if (text.slice(position + 1, position + 9).toLowerCase() === '-squared' && !isAsciiLetter(text.charCodeAt(position + 9))) {
    return { kind: 'chi2', end: position + 9, requiresBracketedDf: false, acceptsTrailingDf: true };
  }
  // "X(1) = 4.28, p = 0.039": a χ² whose superscript a copy lost, in a document that names the chi-square
  // elsewhere; only a capital X with whole-number df in brackets and a p after its value.
  if (text.charCodeAt(position) === 88 && LOST_SQUARE_DF.test(text.slice(position + 1, position + 12)) && mentionsChiSquare(text)) {
    return { kind: 'chi2', end: position + 1, requiresBracketedDf: true, acceptsTrailingDf: false, requiresP: true };
  }
  let at = position + 1;
  if (text.charCodeAt(at) === 94) at++;
  // "X 2 (2, N = 188)": the superscript set apart, as PDF text gives it.
  else if (text.charCodeAt(at) === 32 && text.charCodeAt(at + 1) === 50) at++;
  if (text.charCodeAt(at) !== 50 || isAsciiDigit(text.charCodeAt(at + 1)) || isAsciiLetter(text.charCodeAt(at + 1))) {
    return null;
  }
  return { kind: 'chi2', end: at + 1, requiresBracketedDf: true, acceptsTrailingDf: at === position + 1 };
}

const OPENING_BRACKETS = new Set([40, 91, 123]); // ( [ {
const CLOSING_BRACKETS = new Set([41, 93, 125]); // ) ] }

interface DfRead {
  df: ReportedNumber[];
  sampleSize: ReportedNumber | null;
  end: number;
  bracketed: boolean;
  /** True for a flattened subscript that is not trusted without a p ("t3", any "r18"). */
  doubtful: boolean;
  /** The df are N − 2 from a sample size in the brackets ("r(N = 60)"). */
  fromSampleSize?: boolean;
}

/** An unsigned df, allowing a thousands separator when `allowThousands` ("t(1,024)"). */
function readDf(text: string, position: number, allowThousands: boolean): { number: ReportedNumber; end: number } | null {
  const read = readNumber(text, position, false);
  if (read === null) return null;
  if (allowThousands && read.number.decimals === 0 && read.number.text.length <= 3 && text.charCodeAt(read.end) === 44) {
    const group = readNumber(text, read.end + 1, false);
    const closes = group !== null && CLOSING_BRACKETS.has(text.charCodeAt(group.end));
    if (group !== null && closes && group.number.text.length === 3 && group.number.decimals === 0) {
      return { number: plainNumber(read.number.text + group.number.text, 0), end: group.end };
    }
  }
  return read;
}

/** How df are labelled inside brackets: "df", "gl" (Spanish, Portuguese), "ddl" (French), "FG" (German). */
const DF_LABELS = ['df', 'gl', 'ddl', 'dl', 'FG', 'fg'];

/** Skips an optional "df =" or "df:" label (or its translation, DF_LABELS) inside the brackets. */
function skipDfLabel(text: string, position: number): number {
  const label = DF_LABELS.find((word) => text.startsWith(word, position) && !isAsciiLetter(text.charCodeAt(position + word.length)));
  if (label === undefined) return position;
  let at = skipSpaces(text, position + label.length);
  const code = text.charCodeAt(at);
  if (code !== 61 && code !== 58) return position;
  at = skipSpaces(text, at + 1);
  return at;
}

/** Most characters of a whole df written with OCR's "l" or "I" for a 1 ("l8", "1l8", "l20"). */
const MAX_OCR_DF_LENGTH = 6;

/**
 * "l" or "I" where a 1 of a whole df belongs, alone or among digits ("F(l, 57)", "t(l8)", "F(2, l20)"): a
 * slip of optical character recognition, read as 1 only when a separator or the closing bracket follows the
 * run, so no word can be meant.
 */
function readOcrOne(text: string, position: number): { number: ReportedNumber; end: number } | null {
  let end = position;
  let slips = 0;
  while (end - position < MAX_OCR_DF_LENGTH) {
    const code = text.charCodeAt(end);
    if (code === 108 || code === 73) slips++; // l, I
    else if (code < 48 || code > 57) break;
    end++;
  }
  if (slips === 0) return null;
  const after = text.charCodeAt(skipSpaces(text, end));
  if (after !== 44 && after !== 59 && !CLOSING_BRACKETS.has(after)) return null;
  const digits = text.slice(position, end).replace(/[lI]/g, '1');
  return { number: plainNumber(digits, 0), end };
}

/** Reads the bracketed df of any statistic: "(2, 57)", "[1, 44]", "(45.3)", "(2, N = 120)". */
function readBracketedDf(text: string, position: number, kind: StatisticKind): DfRead | null {
  if (!OPENING_BRACKETS.has(text.charCodeAt(position))) return null;
  // A correlation with its sample size in the brackets ("r(N = 60) = .30"): its df are N − 2 (common practice).
  if (kind === 'r') {
    const sample = readSampleSizeLabel(text, skipSpaces(text, position + 1));
    if (sample !== null && sample.number.decimals === 0 && sample.number.value >= 4) {
      const close = skipSpaces(text, sample.end);
      if (!CLOSING_BRACKETS.has(text.charCodeAt(close))) return null;
      const df = sample.number.value - 2;
      return { df: [{ value: df, text: String(df), decimals: 0, exponent: 0 }], sampleSize: sample.number, end: close + 1, bracketed: true, doubtful: false, fromSampleSize: true };
    }
  }
  let at = skipDfLabel(text, skipSpaces(text, position + 1));
  // (An OCR run is tried first: read as digits, "1l8" would stop at its "l".)
  const first = readOcrOne(text, at) ?? readDf(text, at, kind !== 'F');
  if (first === null) return null;
  const df = [first.number];
  let sampleSize: ReportedNumber | null = null;
  at = skipSpaces(text, first.end);
  const separator = text.charCodeAt(at);
  // F's two df may also stand apart by a dash ("F(3–112)", en dash normalised to "-") or a slash ("F(1/40)").
  const fSeparator = kind === 'F' && (separator === 45 || separator === 47);
  if (separator === 44 || separator === 59 || fSeparator) {
    at = skipSpaces(text, at + 1);
    if (kind === 'F') {
      const secondAt = skipDfLabel(text, at);
      const second = readOcrOne(text, secondAt) ?? readDf(text, secondAt, false);
      if (second === null) return null;
      df.push(second.number);
      at = skipSpaces(text, second.end);
    } else if (kind === 'chi2') {
      const sample = readSampleSizeLabel(text, at);
      if (sample === null) return null;
      sampleSize = sample.number;
      at = skipSpaces(text, sample.end);
    } else {
      return null;
    }
  }
  // A stray comma typed before the closing bracket ("F(18,1,) = 2.22") once the df are complete.
  if (text.charCodeAt(at) === 44 && df.length === (kind === 'F' ? 2 : 1) && CLOSING_BRACKETS.has(text.charCodeAt(skipSpaces(text, at + 1)))) at = skipSpaces(text, at + 1);
  if (!CLOSING_BRACKETS.has(text.charCodeAt(at))) return null;
  if (kind === 'F' && df.length !== 2) return null;
  return { df, sampleSize, end: at + 1, bracketed: true, doubtful: false };
}

/** "N = 120" / "n = 1,024" inside a chi-square's brackets. */
function readSampleSizeLabel(text: string, position: number): { number: ReportedNumber; end: number } | null {
  const letter = text.charCodeAt(position);
  if (letter !== 78 && letter !== 110) return null; // N, n
  let at = skipSpaces(text, position + 1);
  if (text.charCodeAt(at) !== 61) return null;
  at = skipSpaces(text, at + 1);
  const read = readNumber(text, at, false);
  if (read === null) return null;
  let written = read.number.text;
  let end = read.end;
  // Thousands groups: "1,024" (at most two groups keeps this bounded).
  for (let groups = 0; groups < 2 && text.charCodeAt(end) === 44 && read.number.decimals === 0; groups++) {
    const group = readNumber(text, end + 1, false);
    if (group === null || group.number.text.length !== 3 || group.number.decimals > 0) break;
    written += group.number.text;
    end = group.end;
  }
  return { number: written === read.number.text ? read.number : plainNumber(written, 0), end };
}

/**
 * Degrees of freedom flattened from a subscript by PDF extraction:
 * "F1,44" / "F1, 44" (the comma is required: "F1 = 0.83" is an F1 score),
 * "t28" and "r18".
 *
 * A correlation's flattened df is read with more care, because "r" followed
 * by digits is also a name: "r2" is r squared ("r²" is normalised to "r2",
 * and extraction flattens it the same way), "r1"/"r3" number correlations,
 * "r12.3" is a partial-correlation subscript. So "r" takes only a whole
 * number of at least MIN_BARE_SUBSCRIPT_DF (never 2), and always needs a
 * p-value right after it ("r18 = -.52, p = .019"). What remains ambiguous,
 * "r12 = .34, p < .001" written for the correlation of variables 1 and 2, is
 * rare in results sections; the flattened df form is read there.
 */
function readSubscriptDf(text: string, position: number, kind: StatisticKind): DfRead | null {
  if (kind !== 'F' && kind !== 't' && kind !== 'r') return null;
  if (!isAsciiDigit(text.charCodeAt(position))) return null;
  const first = readDf(text, position, false);
  if (first === null) return null;
  if (kind === 'r') {
    if (first.number.decimals > 0 || first.number.value < MIN_BARE_SUBSCRIPT_DF) return null;
    return { df: [first.number], sampleSize: null, end: first.end, bracketed: false, doubtful: true };
  }
  if (kind === 't') {
    const doubtful = first.number.value < MIN_BARE_SUBSCRIPT_DF;
    return { df: [first.number], sampleSize: null, end: first.end, bracketed: false, doubtful };
  }
  let at = first.end;
  // "F2/87 = 4.10": a slash between subscript df, set close (a spaced slash may be a ratio of two numbers).
  if (text.charCodeAt(at) === 47 && isAsciiDigit(text.charCodeAt(at + 1))) {
    const afterSlash = readDf(text, at + 1, false);
    return afterSlash === null ? null : { df: [first.number, afterSlash.number], sampleSize: null, end: afterSlash.end, bracketed: false, doubtful: false };
  }
  if (text.charCodeAt(at) === 32) at++;
  if (text.charCodeAt(at) !== 44) return null;
  at++;
  // (A line may end after the comma: "F22," / "233 = 1.06" in text wrapped as a PDF's is.)
  if (text.charCodeAt(at) === 32 || text.charCodeAt(at) === 10) at++;
  if (text.charCodeAt(at) === 32) at++;
  const second = readDf(text, at, false);
  if (second === null) return null;
  return { df: [first.number, second.number], sampleSize: null, end: second.end, bracketed: false, doubtful: false };
}

/** Reads a complete statistic head at `position` (normalised text), or null. */
export function readStatisticHead(text: string, position: number): StatisticHead | null {
  const symbol = readSymbol(text, position);
  if (symbol === null) return null;
  let at = symbol.end;
  // "F-value", "t value", "F ratio", "z-score", "chi-square statistic": the statistic named with a word after its
  // symbol ("was", "of" or "is" after it stand for "=", scan.ts).
  const named = symbol.symbol === undefined ? statisticWordEnd(text, at, symbol.kind) : -1;
  if (named !== -1) at = named;
  // "F_(1,44)" / "F_{1,44}": a LaTeX-style subscript marker.
  // ("F_{(1, 42)}": the subscript's braces around bracketed df, closed after them.)
  let subscriptBraces = false;
  if (text.charCodeAt(at) === 95) {
    at++;
    if (text.charCodeAt(at) === 123 && (text.charCodeAt(at + 1) === 40 || text.charCodeAt(at + 1) === 91)) {
      at++;
      subscriptBraces = true;
    }
  }

  let dfRead: DfRead | null = symbol.subscriptDf === undefined ? null : { df: [symbol.subscriptDf], sampleSize: null, end: at, bracketed: false, doubtful: false };
  let brokenOverLines = false;
  if (symbol.kind !== 'z' && dfRead === null) {
    dfRead = readSubscriptDf(text, at, symbol.kind) ?? readBracketedDf(text, skipSpaces(text, at), symbol.kind);
    // "F 1, 22 = 1240.19": an F's subscript df set apart by a space (web pages flatten "F₁,₂₂" so); only a df pair.
    // A table cell broken over lines sets them apart by line breaks: "F" / "1,175" / "= 10.8".
    if (dfRead === null && symbol.kind === 'F' && (text.charCodeAt(at) === 32 || text.charCodeAt(at) === 10) && isAsciiDigit(text.charCodeAt(at + 1))) {
      dfRead = readSubscriptDf(text, at + 1, 'F');
      brokenOverLines = dfRead !== null && text.charCodeAt(at) === 10;
    }
    // "F1(1, 31) = 6.02; F2(1, 46) = 3.95": by-participant and by-item analyses, each an F test with its own bracketed df.
    if (dfRead === null && symbol.kind === 'F' && isByParticipantOrItem(text, at)) {
      dfRead = readBracketedDf(text, skipSpaces(text, at + 1), 'F');
    }
    // Digits glued to the symbol that are not a valid subscript ("F1 = 0.83", "F2 gas") end the matter.
    if (dfRead === null && isAsciiDigit(text.charCodeAt(at))) return null;
  }
  let needsTrailingDf = false;
  // "F Region = 0.01, d.f. = 1,16": an F subscripted by its effect's name, flattened; trusted only with its df after it.
  const effectName = symbol.kind === 'F' && dfRead === null ? effectNameEnd(text, at) : -1;
  if (effectName !== -1) {
    at = effectName;
    needsTrailingDf = true;
  }
  if (symbol.requiresDf === true && (dfRead === null || (!dfRead.bracketed && (dfRead.df[0]?.value ?? 0) < 10))) return null;
  if (symbol.requiresBracketedDf && (dfRead === null || !dfRead.bracketed)) {
    if (!(symbol.acceptsTrailingDf === true && dfRead === null)) return null;
    needsTrailingDf = true;
  }
  if (subscriptBraces) {
    if (dfRead === null || !dfRead.bracketed || text.charCodeAt(dfRead.end) !== 125) return null;
    dfRead = { ...dfRead, end: dfRead.end + 1 };
  }
  if (dfRead !== null) at = dfRead.end;
  if (symbol.superscriptAfterDf === true) {
    at = skipOnlySpace(text, at);
    if (text.charCodeAt(at) !== 50) return null;
    at++;
  }

  let comparatorAt = skipSpaces(text, at);
  if (brokenOverLines && text.charCodeAt(comparatorAt) === 10) comparatorAt = skipSpaces(text, comparatorAt + 1);
  const comparator = readComparator(text, comparatorAt);
  if (comparator === null) return null;
  at = skipSpaces(text, comparatorAt + comparator.length);
  // "F = 4,21": a decimal comma, as manuscripts from many countries write it.
  const valueRead = withSpaceAfterPoint(text, readNumber(text, at, true, 'unlessThousands'));
  if (valueRead === null) return null;
  // A value running into letters or digits is a unit or a label ("t = 5s"), not a statistic.
  // With bracketed df, a footnote mark of one to three letters may follow ("t(37.5) =18.55ab" in a table cell).
  if (!endsValue(text, valueRead.end) && !(dfRead?.bracketed === true && footnoteLettersEnd(text, valueRead.end) !== -1)) return null;

  const df = dfRead?.df ?? [];
  // "H(5) = 0.32" may be a cumulative hazard: an H counts only with its p.
  // (A "z-score" is a test only with its p: it may be a standard score.)
  const needsP = symbol.symbol === 'H' || (named !== -1 && symbol.kind === 'z') || needsPValue(symbol.kind, dfRead, comparator.comparator);
  if (symbol.kind === 'z' && looksLikeCoordinate(text, position)) return null;

  return {
    kind: symbol.kind,
    symbol: symbol.symbol ?? null,
    start: position,
    comparatorAt: comparatorAt,
    end: valueRead.end,
    df,
    sampleSize: dfRead?.sampleSize ?? null,
    value: valueRead.number,
    valueComparator: comparator.comparator,
    needsP: needsP || needsTrailingDf || symbol.requiresP === true,
    ...(needsTrailingDf ? { needsTrailingDf } : {}),
    ...(dfRead?.fromSampleSize === true ? { dfFromSampleSize: true } : {}),
  };
}

/** Words that name a statistic after its symbol, by kind ("F-value", "t ratio", "z-score", "chi-square statistic"). */
const STATISTIC_WORDS: Record<StatisticKind, readonly string[]> = {
  F: ['value', 'ratio', 'statistic'],
  t: ['value', 'ratio', 'statistic'],
  z: ['value', 'score', 'statistic'],
  chi2: ['value', 'statistic'],
  r: [],
};

/** The end of "-value", " value", "-ratio" … after a statistic's symbol (a hyphen or one space before the word), or -1. */
function statisticWordEnd(text: string, at: number, kind: StatisticKind): number {
  const joiner = text.charCodeAt(at);
  if (joiner !== 45 && joiner !== 32) return -1;
  for (const word of STATISTIC_WORDS[kind]) {
    if (text.slice(at + 1, at + 1 + word.length).toLowerCase() !== word) continue;
    let end = at + 1 + word.length;
    if (text.charCodeAt(end) === 115) end++; // "values"
    return isAsciiLetter(text.charCodeAt(end)) ? -1 : end;
  }
  return -1;
}

/** Longest effect name read as a flattened subscript of F. */
const MAX_EFFECT_NAME = 40;

/**
 * End of an effect's name standing as an F's subscript ("F Region", "F Soil treatment", "F Region×soil
 * treatment"): a space, a capital letter, then letters, spaces, hyphens and "×" up to the comparator; -1 otherwise.
 */
function effectNameEnd(text: string, position: number): number {
  if (text.charCodeAt(position) !== 32) return -1;
  const first = text.charCodeAt(position + 1);
  if (!(first >= 65 && first <= 90)) return -1;
  let at = position + 1;
  const limit = Math.min(text.length, at + MAX_EFFECT_NAME);
  while (at < limit) {
    const code = text.charCodeAt(at);
    if (code === 61 || code === 60 || code === 62) break;
    // (A line a PDF's text wrapped may end after the name: "F Region" / "= 0.01"; the name ends there.)
    if (code === 10 && comparatorFollows(text, at + 1)) break;
    if (!(isAsciiLetter(code) || code === 32 || code === 45 || code === 0xd7)) return -1;
    at++;
  }
  if (at >= limit) return -1;
  let end = at;
  while (end > position && text.charCodeAt(end - 1) === 32) end--;
  return end - position >= 3 ? end : -1;
}

/** Whether "=", "<" or ">" stands at `position`, after spaces. */
function comparatorFollows(text: string, position: number): boolean {
  let at = position;
  while (at < position + 3 && text.charCodeAt(at) === 32) at++;
  const code = text.charCodeAt(at);
  return code === 61 || code === 60 || code === 62;
}

/** "1" or "2" right after an F, then its bracketed df: "F1(1, 31)", "F2 (1, 46)". */
function isByParticipantOrItem(text: string, position: number): boolean {
  const digit = text.charCodeAt(position);
  if (digit !== 49 && digit !== 50) return false;
  return OPENING_BRACKETS.has(text.charCodeAt(skipSpaces(text, position + 1)));
}

/** End of one to three footnote letters (a-h) at `position` that no other letter or digit follows, or -1. */
function footnoteLettersEnd(text: string, position: number): number {
  let at = position;
  while (at < position + 3 && text.charCodeAt(at) >= 97 && text.charCodeAt(at) <= 104) at++;
  return at > position && endsValue(text, at) ? at : -1;
}

function endsValue(text: string, position: number): boolean {
  const code = text.charCodeAt(position);
  if (isAsciiLetter(code) || isAsciiDigit(code) || code === 95) return gluedPValue(text, position);
  return true;
}

/**
 * A p-value glued to the value, where a copy lost the space or line break
 * between them ("F1,18 = 0.41p= 0.53" from a table cell): a "p" and then,
 * after at most one space, a comparator.
 */
function gluedPValue(text: string, position: number): boolean {
  const code = text.charCodeAt(position);
  if (code !== 112 && code !== 80) return false;
  let at = position + 1;
  if (text.charCodeAt(at) === 32) at++;
  const next = text.charCodeAt(at);
  return next === 61 || next === 60 || next === 62 || next === 0x2264 || next === 0x2265;
}

/** Whether the head needs a p-value right after it to count as a result (see StatisticHead.needsP). */
function needsPValue(kind: StatisticKind, dfRead: DfRead | null, comparator: Comparator): boolean {
  if (kind === 'z') return false;
  if (dfRead === null) {
    // "F < 1" is a standard way to report a small F; "F = 4.2" alone could be anything.
    return !(kind === 'F' && (comparator === '<' || comparator === '<='));
  }
  return dfRead.doubtful;
}

/** "x = 12, y = -40, z = 8" and "x, y, z = ...": brain or map coordinates, not a z test. */
const COORDINATE_BEFORE = /(?:\by\s{0,3}=\s{0,3}[-+]?\d{1,6}(?:\.\d{1,6})?|\by)\s{0,3}[,;]?\s{0,3}(?:and\s{1,3})?$/;

function looksLikeCoordinate(text: string, zPosition: number): boolean {
  const before = text.slice(Math.max(0, zPosition - 40), zPosition);
  return COORDINATE_BEFORE.test(before);
}

/**
 * A statistic's whole-number value followed by a point, a space and digits that end the value ("F1,155 = 4. 54,
 * p = ..."): the space a PDF's text put after the decimal point. Read as "4.54" only where a comma, semicolon,
 * closing bracket or the line's end follows: a sentence that ends after the value goes on with a word.
 */
function withSpaceAfterPoint(text: string, read: ReadNumber | null): ReadNumber | null {
  if (read === null || read.number.decimals !== 0 || text.charCodeAt(read.end) !== 46 || text.charCodeAt(read.end + 1) !== 32) return read;
  let end = read.end + 2;
  while (end < text.length && end - read.end < 9 && isAsciiDigit(text.charCodeAt(end))) end++;
  if (end === read.end + 2 || isAsciiDigit(text.charCodeAt(end))) return read;
  const after = text.charCodeAt(end);
  if (!(after === 44 || after === 59 || after === 41 || after === 10 || Number.isNaN(after))) return read;
  const fraction = text.slice(read.end + 2, end);
  return { number: plainNumber(`${read.number.text}.${fraction}`, fraction.length), start: read.start, end };
}
