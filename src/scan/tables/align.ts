/**
 * Puts a table's value cells under the columns their headers name, when the
 * layout alone does not say which cell is which: headers shifted against
 * the body (a missing label header, spanning header cells), rows whose
 * columns collapsed into single spaces, rows with cells left empty, and
 * footnote marks standing as cells of their own.
 *
 * Both problems are solved the same way: an order-keeping assignment of
 * cells to columns that maximises how well each cell fits its column's
 * meaning (a df column takes whole numbers, a p column numbers up to 1 or
 * "n.s.", a statistic column numbers, ...). Order is never changed and no
 * value is invented: an assignment only decides which column each printed
 * cell belongs to. Tables are small (a row has at most a few dozen cells),
 * so the dynamic programmes here cost a few thousand steps per row.
 */

import { readCell, type ColumnRole } from './cells.js';
import { scanText } from '../scan.js';
import { normaliseText } from '../normalise.js';
import { readNameAndValue } from '../effects.js';
import { readPValue } from '../pValue.js';
import { splitMarks } from './marks.js';

/** What a body cell holds, as far as fitting it to a column goes. */
export type CellShape =
  | { shape: 'number'; value: number; decimals: number; comparator: string }
  /** A number with a bracketed number after it: "4.842 (15)", "0.59 (0.5)", "6.81(0.078)"; `innerPair`: two df, "9.34 (2, 98)". */
  /** `innerThousands`: the pair may be one number with its thousands set apart, "(12,000)"; `dfThenSize`: a whole pair, the second larger, "(1, 141)" (a chi-square's df and sample size). */
  | { shape: 'number-bracket'; value: number; inner: number; innerDecimals: number; innerPair?: boolean; innerThousands?: boolean; innerComparator?: string; plusMinus?: boolean; wholeValue?: boolean; dfThenSize?: boolean; namedDf?: boolean }
  /** A number with its interval: "0.04 (–0.45 to 0.54)", "0.31 [0.12, 0.50]"; `wholePair`: whole bounds that may be an F's df, "9.34 (2, 98)". */
  | { shape: 'number-interval'; value: number; wholePair?: boolean; dfThenSize?: boolean }
  /** Two numbers that may be a df pair: "2, 180", "(2, 180)", "2/180" (`slash`: also how counts are written, "12/30"). */
  | { shape: 'pair'; first: number; second: number; slash?: boolean; bracketed?: boolean }
  | { shape: 'ns' }
  /** A statistic with its p: "0.11, p > 0.05", "4.29, p = 0.04*". */
  | { shape: 'statistic-p'; value: number }
  /** A range of two numbers, "81–152" (minimum to maximum). */
  | { shape: 'range' }
  /** Other numbers without words: "10/23 (41.9, 14.6)", "12:30" (descriptive). */
  | { shape: 'numeric' }
  /** A complete written result, "t(46) = 1.06" (the text scanner reads it). */
  | { shape: 'written' }
  /** A named effect size, "d = 0.31". */
  | { shape: 'named' }
  /** A p-value with its name, "P = 0.064", "p < .001". */
  | { shape: 'p-cell' }
  | { shape: 'empty' }
  /** Stars, daggers or a lone footnote letter standing as a cell. */
  | { shape: 'mark' }
  | { shape: 'text' };

/**
 * Two df: "2, 180", "2 and 180", "df = 2, 180", corrected ones "2.18, 47.92" (a decimal comma in the second,
 * "2.67, 58,83", is read as its point), in brackets, "(2, 180)" (each at least 1: "(0.05, 0.52)" is an interval), or with a slash, "2/180"
 * (whole first df).
 */
const PAIR = /^(?:df ?= ?)?(\d{1,5}(?:\.\d+)?)(?:\s*[,;]\s*| and )(\d{1,6}(?:[.,]\d+)?)$/;
const BRACKETED_PAIR = /^[([]\s*([1-9]\d{0,4}(?:\.\d+)?)\s*[,;/]\s*([1-9]\d{0,5}(?:\.\d+)?)\s*[)\]]$/;
const SLASH_PAIR = /^(\d{1,5}) ?\/ ?(\d{1,6}(?:\.\d+)?)$/;
/** A bracket that names what it holds as df: "0.61 (df = 1)", "5.91 [df=2]". */
const NAMED_DF_BRACKET = /[([] ?df ?= ?\d/i;
const NUMBER_BRACKET = /^([-\u2212\u2013]?\s*[\d.,]+)\s*(?:[*\u2020\u2021]{1,4}\s*)?[([](?:df ?= ?)?\s*(?:(<=|>=|<|>|\u2264|\u2265)\s*)?([-\u2212]?[\d.,]+)[a-h]?\s*[)\]]\s*(?:[*\u2020\u2021]{1,4}|[a-h])?$/;
// (R's "+" for p < .1 in afex's and emmeans' output, "1.87 + .015", stands alone like the stars.)
const MARK = /^(?:[*\u2020\u2021\u271d\u00a7\u00b6#\u00a5\u0166\u00aa\u00ba^]{1,4}|[a-j]|\+)$/;
/** A statistic and its p in one cell, the p named: "0.11, p > 0.05". Groups: value, comparator, p. */
export const STATISTIC_WITH_P = /^ *(-?(?:\d+(?:\.\d+)?|\.\d+)) *[,;] *p *(<=|>=|<|>|=) *(\d+(?:\.\d+)?|\.\d+)(?: *(?:[*\u2020\u2021]{1,4}|[a-h]))? *$/i;
/**
 * A statistic and its p in one cell, the p not named, under a header that names both ("F, p": "18.31, <.001",
 * "2.24, .15"). Groups: value, comparator, p (below 1, written with its point).
 */
export const STATISTIC_COMMA_P = /^ ?((?:[-\u2212] ?)?(?:\d+(?:\.\d+)?|\.\d+)) ?[,;] ?(?:(<=|>=|<|>|=|\u2264|\u2265) ?)?(0?\.\d+)(?: ?(?:[*\u2020\u2021]{1,4}|[a-h]))? ?$/;
/** A bound below 1 and a df pair in brackets after it: "<0.001 (1, 6)", "< .001 (1.6, 9.9)". Groups: the bound, the first df. */
const BOUND_WITH_DF_PAIR = /^(?:<=|>=|<|>|\u2264|\u2265) ?(0?\.\d{1,6}) {1,16}\((\d{1,4}(?:\.\d{1,2})?), ?\d{1,5}(?:\.\d{1,2})?\)$/;
/** (Either number may have its thousands set apart by commas: "2,396.4 ± 775.8".) */
const PLUS_MINUS = /^([-\u2212]?(?:\d{1,3}(?:,\d{3})+\.\d+|\d+(?:[.,]\d+)?))[a-h*]{0,3} ?\u00b1 ?(\d{1,3}(?:,\d{3})+\.\d+|\d+(?:[.,]\d+)?)[a-h*]{0,3}$/;
const RANGE = /^[-\u2212]?\d+(?:[.,]\d+)?\s*(?:[\u2013\u2014-]|to)\s*[-\u2212]?\d+(?:[.,]\d+)?$/;
const NUMBER_INTERVAL = /^((?:[-\u2212\u2013] *)?(?:\d+(?:\.\d+)?|\.\d+)) *(?:[*\u2020\u2021]{1,4} *)?[([] *((?:[-\u2212\u2013] *)?(?:\d+(?:\.\d+)?|\.\d+)) *(?:,|;|to|\u2013|-) *((?:[-\u2212\u2013] *)?(?:\d+(?:\.\d+)?|\.\d+)) *[)\]](?: *(?:[*\u2020\u2021]{1,4}|[a-h]))?$/;

/** Garbled glyphs and thin spaces, which shapeOf reads in the cell's normalised copy. */
const NEEDS_REPAIR = /[\u00c2\u00c3\u00e2\u00ce\u00cf\u2009\u202f]/;

/**
 * Whether a cell is read as a df pair in brackets ("(2, 57)", "[1; 38]"), as shapeOf reads it. A cell read as is
 * (nothing to repair) that the pattern does not fit is not one, and is not read whole: the tokenizer asks this of
 * every bracket in a line, and a bracket of prose, "(M = 4.32, SD = 1.10, n = 30)", went to the text scanner.
 */
export function isBracketedPairCell(cell: string): boolean {
  if (!NEEDS_REPAIR.test(cell) && !BRACKETED_PAIR.test(cell.trim())) return false;
  const shape = shapeOf(cell);
  return shape.shape === 'pair' && shape.bracketed === true;
}

/** The shape of one cell as written. */
export function shapeOf(cell: string): CellShape {
  // Garbled glyphs and thin spaces ("âˆ’â€‰0.05") are read as what they stand for.
  const text = (NEEDS_REPAIR.test(cell) ? normaliseText(cell).text : cell).trim();
  if (MARK.test(text)) return { shape: 'mark' };
  const read = readCell(text, 'either');
  if (read.kind === 'empty') return { shape: 'empty' };
  if (read.kind === 'ns') return { shape: 'ns' };
  if (read.kind === 'number') {
    return { shape: 'number', value: read.number.value, decimals: read.number.decimals, comparator: read.comparator };
  }
  const pair = PAIR.exec(text);
  if (pair) return { shape: 'pair', first: Number(pair[1]), second: Number(pair[2]!.replace(',', '.')) };
  const bracketedPair = BRACKETED_PAIR.exec(text);
  if (bracketedPair) return { shape: 'pair', first: Number(bracketedPair[1]), second: Number(bracketedPair[2]), bracketed: true };
  const slashPair = SLASH_PAIR.exec(text);
  if (slashPair) return { shape: 'pair', first: Number(slashPair[1]), second: Number(slashPair[2]), slash: true };
  // "12.3 ± 4.1": a mean and its SD, as "12.3 (4.1)" is.
  const plusMinus = PLUS_MINUS.exec(text);
  if (plusMinus) {
    const outer = readCell(plusMinus[1]!, 'either');
    const inner = readCell(plusMinus[2]!, 'either');
    if (outer.kind === 'number' && inner.kind === 'number') return { shape: 'number-bracket', value: outer.number.value, inner: inner.number.value, innerDecimals: inner.number.decimals, plusMinus: true };
  }
  const bracket = NUMBER_BRACKET.exec(text);
  if (bracket) {
    const outer = readCell(bracket[1]!, 'either');
    const inner = readCell(bracket[3]!, 'either');
    if (outer.kind === 'number' && inner.kind === 'number') {
      // "4.21(2,57)": beside a value written with a decimal point, a comma between whole numbers parts a df
      // pair (a decimal comma would be the cell's separator for both numbers).
      if (/\./.test(bracket[1]!) && /^\d{1,4},\d{1,5}$/.test(bracket[3]!.trim())) {
        // (Or, for a statistic with one df, one df with its thousands set apart: "30.74 (12,000)"; see fit.)
        const thousands = /^\d{1,3},\d{3}$/.test(bracket[3]!.trim());
        return { shape: 'number-bracket', value: outer.number.value, inner: Number(bracket[3]!.split(',')[0]), innerDecimals: 0, innerPair: true, ...(thousands ? { innerThousands: true } : {}) };
      }
      const shape: CellShape = {
        shape: 'number-bracket',
        value: outer.number.value,
        inner: inner.number.value,
        innerDecimals: inner.number.decimals,
        ...(outer.number.decimals === 0 ? { wholeValue: true } : {}),
        ...(NAMED_DF_BRACKET.test(text) ? { namedDf: true } : {}),
      };
      return bracket[2] === undefined ? shape : { ...shape, innerComparator: bracket[2] };
    }
  }
  const withP = STATISTIC_WITH_P.exec(normaliseText(text).text);
  if (withP) return { shape: 'statistic-p', value: Number(withP[1]) };
  // "18.31, <.001", "2.24, .15": a value and a bound p, or a non-negative value and a p written without its zero as
  // journals write p (an interval's bounds printed without brackets, "-0.12, 0.45", stay numeric).
  const withBareP = STATISTIC_COMMA_P.exec(text);
  const boundP = withBareP !== null && withBareP[2] !== undefined && withBareP[2] !== '=';
  const pWithoutZero = withBareP !== null && withBareP[2] === undefined && withBareP[3]!.startsWith('.') && !/^[-\u2212]/.test(withBareP[1]!);
  if (withBareP !== null && (boundP || pWithoutZero)) return { shape: 'statistic-p', value: Number(withBareP[1]!.replace(/[\u2212]\s?/, '-')) };
  // "<0.001 (1, 6)": a bound p with the next F's df run onto it by a crushed copy, shaped as "0.001 (1, 6)" is
  // (readTableResults.ts numberAt reads the bound, dfPairBefore the df).
  const boundWithPair = BOUND_WITH_DF_PAIR.exec(text);
  if (boundWithPair) return { shape: 'number-bracket', value: Number(boundWithPair[1]), inner: Number(boundWithPair[2]), innerDecimals: 0, innerPair: true };
  if (/[=<>]/.test(text) && text.length <= 80) {
    if (readsAsWrittenResult(text)) return { shape: 'written' };
    // A result written with significance marks after it ("r = 0.586*"): the marks do not make it a label. (Only a
    // cell that opens with the statistic: a whole row of cells run together ends with marks too.)
    const { number: beforeMarks, marks } = splitMarks(text);
    if (marks !== '' && OPENS_WITH_SYMBOL.test(beforeMarks) && readsAsWrittenResult(beforeMarks)) return { shape: 'written' };
    const normalised = normaliseText(text).text;
    const pRead = readPValue(normalised, 0);
    if (pRead !== null && pRead.end >= normalised.trimEnd().length - 1) return { shape: 'p-cell' };
    const named = readNameAndValue(normalised, 0);
    if (named !== null && named.kind !== null && named.end === normalised.trimEnd().length) return { shape: 'named' };
  }
  if (RANGE.test(text)) return { shape: 'range' };
  const interval = NUMBER_INTERVAL.exec(text);
  if (interval) {
    const outer = readCell(interval[1]!, 'either');
    const low = readCell(interval[2]!, 'either');
    const high = readCell(interval[3]!, 'either');
    if (outer.kind === 'number' && low.kind === 'number' && high.kind === 'number') {
      const value = outer.number.value;
      // An estimate lies inside its interval (with room for rounding). Two whole numbers around a value
      // outside them are its df: "9.34 (2, 98)" under "F (dfM, dfR)".
      const slack = 10 ** -Math.max(outer.number.decimals, low.number.decimals, high.number.decimals);
      const inside = value >= Math.min(low.number.value, high.number.value) - slack && value <= Math.max(low.number.value, high.number.value) + slack;
      const wholePair = /^\d+$/.test(low.number.text) && /^\d+(?:\.\d+)?$/.test(high.number.text) && /\d\s*[,;]\s*\d/.test(text);
      // Two whole numbers, the second the larger, may be a chi-square's df and sample size: "10.84(1, 141)".
      const dfThenSize = wholePair && /^\d+$/.test(high.number.text) && low.number.value >= 1 && high.number.value > low.number.value;
      if (inside) return wholePair ? { shape: 'number-interval', value, wholePair, ...(dfThenSize ? { dfThenSize } : {}) } : { shape: 'number-interval', value };
      // Outside its bracket, a value's two positive numbers are its df, corrected ones too: "1.19 (1.48, 72.71)".
      const correctedPair = /^\d+\.\d+$/.test(low.number.text) && /^\d+(?:\.\d+)?$/.test(high.number.text) && low.number.value <= high.number.value && /\d\s*[,;]\s*\d/.test(text);
      if (wholePair || correctedPair) return { shape: 'number-bracket', value, inner: low.number.value, innerDecimals: 0, innerPair: true, ...(dfThenSize ? { dfThenSize } : {}) };
      return { shape: 'numeric' };
    }
  }
  // "2.71 (41) .010": a statistic with its df and its p (under "t (df) p").
  const withDfAndP = STATISTIC_DF_AND_P.exec(text);
  if (withDfAndP) return { shape: 'statistic-p', value: Number(withDfAndP[1]!.replace(/[\u2212\u2013]/, '-').replace(/\s/g, '')) };
  if (NUMERIC.test(text)) return { shape: 'numeric' };
  return { shape: 'text' };
}

/** A statistic, its df in brackets and a p: "2.71 (41) .010", "4.21 (2, 57) <.001". */
const STATISTIC_DF_AND_P = /^((?:[-\u2212\u2013] ?)?(?:\d+(?:\.\d+)?|\.\d+)) ?[([] ?\d{1,6}(?:\.\d+)?(?: ?[,;] ?\d{1,6}(?:\.\d+)?)? ?[)\]][*\u2020\u2021]{0,3}[,;]? ?(?:p ?)?(?:<=|>=|<|>|=|\u2264|\u2265)? ?(?:0|1)?\.\d+[*\u2020\u2021]{0,3}[a-h]?$/;

/**
 * Whether a cell holds a written result: one the text scanner reads ("t(46) = 1.06"), or a statistic without df
 * that it reads only with a p after it ("rs = 0.572", "t = 0.73"), which the row's p column may hold.
 */
export function readsAsWrittenResult(cell: string): boolean {
  if (cell.length <= 3 || !/[=<>]/.test(cell)) return false;
  if (scanText(cell).results.length > 0) return true;
  // (Only a cell with a statistic's symbol before "=" is read again: most cells with "<" are p values.)
  return cell.length <= MAX_WRITTEN_CELL && SYMBOL_BEFORE_EQUALS.test(cell) && scanText(`${cell}, p = .5`).results.some((result) => result.start < cell.length);
}

/** A statistic's symbol, its df perhaps, then "=": "rs = ", "t = ", "χ2 = ", "F(2, 57) =". */
const SYMBOL_BEFORE_EQUALS = /(?:^|[^A-Za-z])(?:r|rs|r_s|rho|Rho|\u03c1|t|F|z|Z|H|[\u03c7\u03a7xX]\s?[2\u00b2]|[Cc]hi[-\s^]?(?:2|square[d]?))\s{0,2}(?:\([^()]{0,20}\)\s{0,2})?=/;

/** A cell that opens with a statistic's symbol, its df perhaps, then "=" and no cell separator: "r = ", "F(2, 57) =". */
const OPENS_WITH_SYMBOL = /^(?:r|rs|r_s|rho|\u03c1|t|F|z|Z|H|[\u03c7\u03a7xX]\s?[2\u00b2]|[Cc]hi[-\s^]?(?:2|square[d]?))\s{0,2}(?:\([^()|]{0,20}\)\s{0,2})?=[^|\t]*$/;

/** Longest cell read as a written result waiting for its row's p. */
const MAX_WRITTEN_CELL = 80;

/** Digits with punctuation and no words: counts, fractions, percentages and their brackets. */
const NUMERIC = /^(?=.*\d)[\d\s.,:;/()[\]%±+\-\u2212\u2013]{1,60}$/;

/** True for cells that are values of a row (not its label). */
export function isValueShape(shape: CellShape): boolean {
  return shape.shape !== 'text';
}

const NEVER = -1e6;
/** How well "2.28 (76)" fits a plain "t" column: barely, below any other column a value in brackets fits (see fit). */
const LAST_RESORT_T_DF = 0.1;

/** What leaving out an empty cell costs (see placeFrom): a blank one, and a printed placeholder ("N/A", "—"), which surely holds a column's place. */
const EMPTY_DROP_COST = 0.5;
const PLACEHOLDER_DROP_COST = 1;

/**
 * How well a cell fits a column of the given meaning: positive when it fits
 * (the more telling the fit, the higher), negative when it cannot be such a
 * value, 0 for an empty cell (which fits anywhere and tells nothing).
 */
export function fit(role: ColumnRole, cell: CellShape): number {
  if (cell.shape === 'empty') return 0;
  if (cell.shape === 'mark') return NEVER;
  if (cell.shape === 'text') return role.role === 'label' ? 1 : -2;
  if (cell.shape === 'statistic-p') return role.role === 'statistic' ? 2.5 : role.role === 'unknown' ? 0.3 : -2;
  if (cell.shape === 'written') return role.role === 'result' ? 2 : role.role === 'statistic' ? 1.5 : role.role === 'unknown' || role.role === 'descriptive' ? 0.5 : -2;
  if (cell.shape === 'p-cell') return role.role === 'p' ? 2.5 : role.role === 'result' || role.role === 'unknown' ? 0.5 : -2;
  if (cell.shape === 'named') return role.role === 'effect' || role.role === 'result' ? 1.5 : role.role === 'unknown' ? 0.5 : -2;
  if (role.role === 'result') return cell.shape === 'number' ? 0.3 : -1;
  // "12/30" under a descriptive column is a count of a total, "(1.20, 3.40)" an interval, as other numbers without words.
  if (cell.shape === 'range' || cell.shape === 'numeric' || (cell.shape === 'pair' && (cell.slash === true || cell.bracketed === true) && role.role !== 'df')) return role.role === 'descriptive' || role.role === 'unknown' ? 0.5 : -2;
  switch (role.role) {
    case 'statistic': {
      // Under a chi-square, a whole pair after the value is its one df and the sample size ("10.84(1, 141)", as
      // "χ2(1, N = 141)" without the "N ="), with or without "(df)" in the header.
      if ((cell.shape === 'number-interval' || cell.shape === 'number-bracket') && cell.dfThenSize === true && role.kind === 'chi2') return cell.value >= 0 ? 3 : -4;
      // Under an F, a value with two whole numbers in brackets is the F with its df ("2.90 (2, 132)"), as a pipe
      // table's cell is read, whether or not the header says "(df)" (an interval holds a value's estimate, not an F's).
      if (cell.shape === 'number-interval') return cell.wholePair === true && role.kind === 'F' ? (role.dfInCell === true ? 3 : 2.5) : -3;
      if (cell.shape === 'ns' || cell.shape === 'pair') return -3;
      // A bracketed number in a statistic column is its df only where the header says so ("t (df)").
      // Whole-number df only: "62.3 (9.64)" beside "1.48 (29)" is a mean and SD.
      // Under "r (p value)" the bracket holds the p: "−0.06 (.60)", "−0.50 (<.001)".
      if (cell.shape === 'number-bracket' && cell.plusMinus === true) return -3;
      if (cell.shape === 'number-bracket' && role.pInCell === true) return cell.inner >= 0 && cell.inner <= 1 && cell.innerPair !== true ? 3 : -3;
      // (A whole number with a whole number in brackets, "7 (24)", is a count and its percentage rather than a test
      // statistic, which tables print with decimals; an F or chi-square is never negative.)
      if (cell.shape === 'number-bracket') {
        // (Under a statistic with one df, "(12,000)" is that df with its thousands set apart.)
        const twoDf = cell.innerPair === true && !(cell.innerThousands === true && role.kind !== 'F');
        // (A bracket that says it holds df, "(df = 1)", holds them whatever the header says.)
        // (Under a plain "F", a pair of whole numbers in brackets: an F's df, as above.)
        const fPair = role.kind === 'F' && twoDf && cell.innerDecimals === 0 && cell.innerComparator === undefined;
        const withDf = ((role.dfInCell === true || cell.namedDf === true) && role.kind !== 'r' && cell.innerDecimals === 0 && cell.innerComparator === undefined && twoDf === (role.kind === 'F')) || fPair;
        // (Under a plain "t", one whole number in brackets after a value with decimals, "2.28 (76)", is its df only
        // where nothing else fits: a mean with its n, "5.20 (24)", fits a group's column better, so the row's cells
        // must leave this one to the t column, as a row of exactly one cell per column does.)
        const tDfUnnamed = role.kind === 't' && !twoDf && cell.innerDecimals === 0 && cell.innerComparator === undefined && cell.inner >= 1 && cell.wholeValue !== true;
        if (!withDf) return tDfUnnamed ? LAST_RESORT_T_DF : -3;
        if ((role.kind === 'F' || role.kind === 'chi2') && cell.value < 0) return -4;
        return cell.wholeValue === true && cell.innerPair !== true ? -1 : 3;
      }
      // A bound under 1 ("<.001", "<0.05") is a p: a table prints a tiny F or chi-square so ("<0.001" before its
      // p of 0.995), never a z, t or r.
      // (Under an F or chi-square it fits only where no other placement of the row's cells does.)
      if (cell.shape === 'number' && cell.comparator !== '=' && cell.value < 1) return role.kind === 'F' || role.kind === 'chi2' ? 0.1 : -4;
      // Under "t (df)" the cells carry their df; a bare number there is weak evidence.
      if (role.dfInCell === true) return (role.kind === 'F' || role.kind === 'chi2') && cell.value < 0 ? -4 : 0.5;
      if (role.kind === 'F' || role.kind === 'chi2') return cell.value >= 0 ? 2 : -4;
      if (role.kind === 'r') return Math.abs(cell.value) <= 1 ? 2 : -4;
      return 2;
    }
    case 'df':
      if (cell.shape === 'pair') return 3;
      return dfFit(cell);
    case 'df1':
    case 'df2':
      return dfFit(cell);
    case 'p':
      if (cell.shape === 'ns') return 2.5;
      // "0.048* (0.51)" under "p (d)": the p with an effect size in brackets.
      if (cell.shape === 'number-bracket') return cell.value >= 0 && cell.value <= 1 && cell.innerComparator === undefined && cell.plusMinus !== true ? 1 : -3;
      if (cell.shape !== 'number') return -3;
      if (cell.value < 0 || cell.value > 1) return -5;
      return cell.comparator !== '=' ? 2.5 : cell.decimals >= 2 ? 2 : 1;
    case 'effect':
      if (cell.shape === 'number-interval') return 1.5;
      if (cell.shape !== 'number') return -2;
      if (role.effect === 'cohens-d' || role.effect === 'hedges-g' || role.effect === 'cohens-f') return 1;
      if (role.effect === 'r') return Math.abs(cell.value) <= 1 ? 1.5 : -4;
      return cell.value >= 0 && cell.value <= 1 ? 1.5 : -4;
    case 'ss':
    case 'ms':
      return cell.shape === 'number' && cell.value >= 0 ? 2 : -2;
    case 'n':
      return cell.shape === 'number' && cell.decimals === 0 && cell.value >= 1 ? 1.5 : -2;
    case 'descriptive':
      return cell.shape === 'number-bracket' || cell.shape === 'number-interval' ? 1 : cell.shape === 'number' ? 1.5 : -1;
    case 'label':
      return -1;
    default:
      return cell.shape === 'number' || cell.shape === 'number-bracket' ? 0.3 : -1;
  }
}

function dfFit(cell: CellShape): number {
  if (cell.shape !== 'number') return -3;
  if (cell.comparator !== '=' || cell.value < 1) return -4;
  return cell.decimals === 0 ? 2 : 1;
}

/**
 * The form a column's values take: plain numbers, or numbers with a bracket
 * ("0.048* (0.51)", "4.842 (15)", "0.31 [0.12, 0.50]").
 */
/**
 * The form a column's cells take: whole numbers ("2", "57": df, counts), other plain numbers, or numbers with a
 * bracket ("4.21 (2, 57)"). A column of whole numbers also holds plain ones where some rows print decimals.
 */
export type ShapeFamily = 'whole' | 'plain' | 'bracketed';

export function familyOf(shape: CellShape): ShapeFamily | null {
  if (shape.shape === 'number') return shape.decimals === 0 && shape.comparator === '' ? 'whole' : 'plain';
  if (shape.shape === 'number-bracket' || shape.shape === 'number-interval') return 'bracketed';
  return null;
}

/** The family of a column whose cells so far were of `before` and now include one of `next` (null: mixed). */
export function joinFamilies(before: ShapeFamily, next: ShapeFamily): ShapeFamily | null {
  if (before === next) return before;
  if (before === 'bracketed' || next === 'bracketed') return null;
  return 'plain';
}

/** What a cell of the other family costs in a column whose full rows all hold one family (a column's cells share a form). */
const OTHER_FAMILY_COST = 3;

/**
 * A cell's fit to a column's family: a bracketed cell where every full row holds plain numbers, or the reverse,
 * and a number with decimals where every full row holds whole numbers (a percentage under a df column: "75.2"
 * under "Df" over "2", "2", "1"), cost OTHER_FAMILY_COST.
 */
function familyFit(family: ShapeFamily | null, shape: CellShape): number {
  if (family === null) return 0;
  const own = familyOf(shape);
  if (own === null || own === family) return 0;
  return family === 'plain' && own === 'whole' ? 0 : -OTHER_FAMILY_COST;
}

/** A cell to place, as written, with its shape. */
export interface CellToPlace {
  text: string;
  shape: CellShape;
}

/**
 * Places a row's value cells, in order, under `roles` (the value columns, in
 * order). Marks may be dropped; leading cells beyond what the columns take
 * go back to the row's label (`absorbed`); every other cell must land in a
 * column. Ties go to the assignment that fills the earliest columns, since
 * rows leave their trailing cells empty (an error row has no F or p).
 * Returns, for each cell, its column index in `roles` (or -1: dropped or
 * absorbed), or null when the cells cannot be placed sensibly.
 */
export function placeCells(cells: CellToPlace[], roles: ColumnRole[], families?: readonly (ShapeFamily | null)[]): { columns: number[]; absorbed: number } | null {
  const n = cells.length;
  const m = roles.length;
  if (m === 0) return null;
  // Leading cells may go back to the label (at a cost, so only cells that fit no column do):
  // "Treatment 7.85 (3.73) 5.06 (4.71) 0.60 3.48 (33) .001" under d, t (df), p.
  const maxAbsorbed = cells.filter((cell) => cell.shape.shape !== 'mark' && cell.shape.shape !== 'empty').length;
  let best: { score: number; columns: number[]; absorbed: number } | null = null;
  for (let absorbed = 0; absorbed <= Math.min(maxAbsorbed, n); absorbed++) {
    const placed = placeFrom(cells.slice(absorbed), roles, undefined, families);
    if (placed === null) continue;
    const score = placed.score - 0.5 * absorbed;
    if (best === null || score > best.score + 1e-9) best = { score, columns: [...new Array<number>(absorbed).fill(-1), ...placed.columns], absorbed };
  }
  if (best === null || best.score <= 0) return null;
  return { columns: best.columns, absorbed: best.absorbed };
}

/**
 * How much better a cell fits where it was placed than anywhere else it
 * could go: below this, the placement rests on the tie-break alone.
 */
const CLEAR_MARGIN = 0.75;

/**
 * Whether a placement of a row with cells left out is clear for the columns
 * that matter (`keyColumns`: the statistic, its df and its p): for each such
 * column that received a cell, the best placement that keeps the cell out of
 * that column must score clearly worse. "83.95 57 1.47" under SS, df, MS,
 * F, p is clear (57 is the only whole number); "2.10 .04" under F, p,
 * partial eta squared is not (.04 fits p and partial eta squared alike).
 */
export function placementIsClear(
  cells: CellToPlace[],
  roles: ColumnRole[],
  placed: { columns: number[]; absorbed: number },
  keyColumns: number[],
  families?: readonly (ShapeFamily | null)[],
  /** Set when the placement is clear only because its rivals read the same under another, alike block. */
  found: { blockUnknown: boolean } = { blockUnknown: false },
): boolean {
  const rest = cells.slice(placed.absorbed);
  const best = placeFrom(rest, roles, undefined, families);
  if (best === null) return false;
  for (const column of keyColumns) {
    const cellIndex = placed.columns.indexOf(column);
    if (cellIndex < placed.absorbed) continue;
    const alternative = placeFrom(rest, roles, { cell: cellIndex - placed.absorbed, column }, families);
    // (An alternative that reads the same, the cells under columns of the same meanings in another block of a
    // side-by-side table whose blocks are alike, "D.f. | F ratio | D.f. | F ratio" over a row that prints one
    // block, leaves the reading clear: the statistic, its df and its p are the same either way.)
    if (alternative !== null && alternative.score > best.score - CLEAR_MARGIN) {
      if (!readsTheSame(best.columns, alternative.columns, roles)) return false;
      found.blockUnknown = true;
    }
  }
  return true;
}

/** Whether two placements put every cell under columns of the same meaning (role, statistic and its df). */
function readsTheSame(first: number[], second: number[], roles: ColumnRole[]): boolean {
  return first.every((column, index) => {
    const other = second[index]!;
    if (column < 0 || other < 0) return column === other;
    return sameMeaning(roles[column]!, roles[other]!);
  });
}

function sameMeaning(a: ColumnRole, b: ColumnRole): boolean {
  if (a.role !== b.role) return false;
  if (a.role === 'statistic' && b.role === 'statistic') {
    return a.kind === b.kind && a.dfInCell === b.dfInCell && a.pInCell === b.pInCell && a.df.map((df) => df.value).join() === b.df.map((df) => df.value).join();
  }
  if (a.role === 'effect' && b.role === 'effect') return a.effect === b.effect;
  return true;
}

/** Order-keeping assignment by dynamic programming over (cell, column); `forbidden` keeps one cell out of one column. */
function placeFrom(
  cells: CellToPlace[],
  roles: ColumnRole[],
  forbidden?: { cell: number; column: number },
  families?: readonly (ShapeFamily | null)[],
): { score: number; columns: number[] } | null {
  const n = cells.length;
  const m = roles.length;
  // score[i][j]: best score placing cells[0..i) using columns [0..j); choice records the step taken.
  const width = m + 1;
  const score = new Float64Array((n + 1) * width).fill(-Infinity);
  const choice = new Int8Array((n + 1) * width); // 0: skip column, 1: place cell i-1 in column j-1, 2: drop cell i-1
  for (let j = 0; j <= m; j++) score[j] = -0.001 * j;
  for (let i = 1; i <= n; i++) {
    const cell = cells[i - 1]!;
    for (let j = 0; j <= m; j++) {
      let bestHere = -Infinity;
      let how = 0;
      if (j > 0) {
        // Skipping a column costs a little more the further left it is, so earlier columns fill first.
        const skip = score[i * width + j - 1]! - 0.001;
        if (skip > bestHere) {
          bestHere = skip;
          how = 0;
        }
        const f = forbidden !== undefined && forbidden.cell === i - 1 && forbidden.column === j - 1 ? NEVER : fit(roles[j - 1]!, cell.shape) + familyFit(families?.[j - 1] ?? null, cell.shape);
        if (f > NEVER / 2) {
          const place = score[(i - 1) * width + j - 1]! + f + 0.0005 * (m - j);
          if (place > bestHere) {
            bestHere = place;
            how = 1;
          }
        }
      }
      // Marks may be left out; so may surplus empty cells (extraction leaves extra ones), at a cost,
      // since an empty cell usually holds its column's place ("0.27 1.48 (29) .15 N/A N/A N/A").
      if (cell.shape.shape === 'mark' || cell.shape.shape === 'empty') {
        const drop = score[(i - 1) * width + j]! - (cell.shape.shape === 'empty' ? (cell.text.trim() === '' ? EMPTY_DROP_COST : PLACEHOLDER_DROP_COST) : 0);
        if (drop > bestHere) {
          bestHere = drop;
          how = 2;
        }
      }
      score[i * width + j] = bestHere;
      choice[i * width + j] = how;
    }
  }
  let j = m;
  const total = score[n * width + m]!;
  if (!Number.isFinite(total)) return null;
  const columns = new Array<number>(n).fill(-1);
  let i = n;
  while (i > 0) {
    const how = choice[i * width + j]!;
    if (how === 0) j--;
    else if (how === 1) {
      columns[i - 1] = j - 1;
      i--;
      j--;
    } else {
      columns[i - 1] = -1;
      i--;
    }
  }
  return { score: total, columns };
}

/** Value roles: columns a cell of a result can stand in (not labels). */
export function isValueRole(role: ColumnRole): boolean {
  return role.role !== 'label';
}

/**
 * The shift that best puts a header row's cells over the body's columns:
 * header cell k goes over column k + shift. Only header cells whose meaning
 * is known are scored, against the body cells of the column they would
 * stand over; a shift that puts the statistic's header over anything but
 * numbers scores badly. Returns 0 when no shift fits better.
 */
export function bestHeaderShift(headerRoles: (ColumnRole | null)[], bodyShapes: CellShape[][], width: number, claimed: ReadonlySet<number> = new Set()): number {
  let bestShift = 0;
  let bestScore = -Infinity;
  const known = headerRoles.map((role, index) => ({ role, index })).filter((entry) => entry.role !== null && entry.role.role !== 'unknown');
  if (known.length === 0) return 0;
  // Header cells of unknown meaning still name columns that exist: a shift that pushes one off the table costs a little.
  const named = headerRoles.flatMap((role, index) => (role !== null && role.role === 'unknown' ? [index] : []));
  for (let shift = -known[0]!.index; shift + known[known.length - 1]!.index < width; shift++) {
    let total = 0;
    for (const index of named) if (index + shift < 0 || index + shift >= width) total -= 0.5;
    for (const { role, index } of known) {
      const column = index + shift;
      if (column < 0 || column >= width) {
        total -= 3;
        continue;
      }
      if (role!.role === 'label') {
        total += column === 0 ? 0.5 : 0;
        continue;
      }
      // A column an upper header row names (placeHeaderCells).
      if (claimed.has(column)) {
        total -= 3;
        continue;
      }
      let columnScore = 0;
      let counted = 0;
      for (const row of bodyShapes) {
        const shape = row[column];
        if (shape === undefined || shape.shape === 'empty') continue;
        const f = fit(role!, shape);
        columnScore += f <= NEVER / 2 ? -3 : Math.max(-3, f);
        counted++;
      }
      total += counted === 0 ? -0.5 : columnScore / counted;
    }
    const preferred = total - 0.01 * Math.abs(shift);
    if (preferred > bestScore + 1e-9) {
      bestScore = preferred;
      bestShift = shift;
    }
  }
  return bestShift;
}

/** Body rows looked at to place a header: enough to judge a column, few enough to stay cheap on huge tables. */
const HEADER_SAMPLE_ROWS = 200;
/** How much better a placement with gaps must fit than the best single shift to be taken. */
const SPREAD_MARGIN = 1;

/**
 * Where each header cell goes, as a column per cell (-1: nowhere). Usually
 * the best single shift (bestHeaderShift). But a header copied from markup
 * loses its spanning cells' widths: "F (dfM, dfR) | p | η² | T0–1 | T0–2 |
 * F (dfM, dfR) | p | η²" over a body where T0–1 and T0–2 each span two
 * columns (d and its CI). Then the header cells are spread over the columns
 * in order, with gaps, by a dynamic programme that maximises the same fit;
 * the spread is taken only when it fits clearly better than any shift
 * (SPREAD_MARGIN), so a header that a shift explains keeps that reading.
 */
export function placeHeaderCells(headerRoles: (ColumnRole | null)[], bodyShapes: CellShape[][], width: number, claimed: ReadonlySet<number> = new Set()): number[] {
  const shift = bestHeaderShift(headerRoles, bodyShapes, width, claimed);
  const shifted = headerRoles.map((_, index) => index + shift);
  const count = headerRoles.length;
  if (count === 0 || count >= width) return shifted;
  const sample = bodyShapes.slice(0, HEADER_SAMPLE_ROWS);
  const scoreCache = new Map<string, number>();
  const score = (index: number, column: number): number => {
    const role = headerRoles[index];
    if (role === null || role === undefined || role.role === 'unknown') return 0;
    if (role.role === 'label') return column === 0 ? 0.5 : 0;
    if (claimed.has(column)) return -3;
    const key = `${index}:${column}`;
    const cached = scoreCache.get(key);
    if (cached !== undefined) return cached;
    let total = 0;
    let counted = 0;
    for (const row of sample) {
      const shape = row[column];
      if (shape === undefined || shape.shape === 'empty') continue;
      const f = fit(role, shape);
      total += f <= NEVER / 2 ? -3 : Math.max(-3, f);
      counted++;
    }
    const value = counted === 0 ? -0.5 : total / counted;
    scoreCache.set(key, value);
    return value;
  };
  const shiftedScore = shifted.reduce((sum, column, index) => sum + (column >= 0 && column < width ? score(index, column) : -3), 0);
  // A shift that puts every known name over cells that fit it explains the header: no spreading.
  const shiftMisfits = shifted.some((column, index) => {
    const role = headerRoles[index];
    return role !== null && role !== undefined && role.role !== 'unknown' && role.role !== 'label' && (column < 0 || column >= width || score(index, column) < 0);
  });
  if (!shiftMisfits) return shifted;
  // best[i][j]: the best score of header cells 0..i with cell i over column j (columns strictly increase).
  const best: number[][] = [];
  const from: number[][] = [];
  for (let index = 0; index < count; index++) {
    best.push(new Array<number>(width).fill(-Infinity));
    from.push(new Array<number>(width).fill(-1));
    for (let column = index; column < width - (count - 1 - index); column++) {
      const own = score(index, column);
      if (index === 0) {
        best[0]![column] = own - 0.01 * column;
        continue;
      }
      for (let previous = index - 1; previous < column; previous++) {
        const candidate = best[index - 1]![previous]! + own - 0.01 * (column - previous - 1);
        if (candidate > best[index]![column]!) {
          best[index]![column] = candidate;
          from[index]![column] = previous;
        }
      }
    }
  }
  let end = -1;
  for (let column = 0; column < width; column++) if (end < 0 || best[count - 1]![column]! > best[count - 1]![end]!) end = column;
  if (end < 0 || !(best[count - 1]![end]! > shiftedScore + SPREAD_MARGIN)) return shifted;
  const spread = new Array<number>(count).fill(-1);
  for (let index = count - 1, column = end; index >= 0; index--) {
    spread[index] = column;
    column = from[index]![column]!;
  }
  return spread;
}
