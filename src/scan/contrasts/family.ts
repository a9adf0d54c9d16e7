/**
 * The groups and error term of an ANOVA, for the contrasts and the
 * comparisons printed without a t that follow it: a one-way F linked to its
 * groups' means and ns (scan/descriptives), or the main effect of a factor
 * of a factorial design (scan/factorial, the levels' n-weighted marginal
 * means).
 *
 * The error mean square is known in up to three ways, each kept as a
 * reading: pooled from the groups' SDs (sum (n_i - 1) s_i^2 / (N - k)),
 * printed with the F ("MSE = 0.87"), or the between-groups mean square
 * over F (sum n_i (m_i - m)^2 / (k - 1) / F), each over the rounding of
 * what is printed. A check flags only what no reading reproduces.
 */

import type { ComparisonFamily, ErrorReading, FamilyGroup, PrintedMeanSquareError, ReportedResult } from '../types.js';
import { roundingInterval } from '../../stats/reportedNumber.js';
import { weightedSpreadRange } from '../../stats/summaryStatistics.js';
import { marginalFamily } from '../comparisons/readComparisons.js';
import { partitionPoint } from '../../sortedSearch.js';

/** How far after the F its MSE may be printed (characters), with no sentence end between. */
const MSE_REACH = 80;
/** Most groups whose between-groups range is worked out (it enumerates 2^k corners). */
const MAX_GROUPS = 12;
/** Most words before a group's numbers read as its name. */
const NAME_WORDS = 3;
const JOINING = new Set(['and', 'or', 'than', 'between', 'with', 'vs', 'vs.', 'versus', 'in', 'for', 'of', 'the', 'to', 'from']);
/** Most characters before a group's numbers read as its name. */
const NAME_REACH = 60;

function describeF(result: ReportedResult): string {
  return `F(${result.df.map((df) => df.text).join(', ')}) = ${result.value?.text ?? '?'}`;
}

/** The MSE printed inside the F's span or just after it in the same sentence, before the next result. */
export function meanSquareErrorOf(result: ReportedResult, next: ReportedResult | undefined, errors: readonly PrintedMeanSquareError[], text: string): PrintedMeanSquareError | null {
  for (let i = partitionPoint(errors.length, (j) => errors[j]!.start < result.start); i < errors.length; i++) {
    const error = errors[i]!;
    if (error.start > result.end + MSE_REACH || (next !== undefined && next.tableRow === undefined && error.start >= next.start)) return null;
    if (error.start >= result.end && /[.!?]\s+[A-Z(]/.test(text.slice(result.end, error.start))) return null;
    return error;
  }
  return null;
}

/** The words printed just before a group's numbers ("the vocal group (M = ..."), as its name when it has no label. */
function nameBefore(text: string, start: number, floor: number): string {
  let from = Math.max(0, floor, start - NAME_REACH);
  const stretch = text.slice(from, start);
  // From the last clause mark: the name is what follows the previous group's numbers.
  let cut = -1;
  for (let i = stretch.length - 1; i >= 0; i--) {
    if (';:)'.includes(stretch[i]!) || (stretch[i] === ',' && i < stretch.length - 3)) {
      cut = i;
      break;
    }
  }
  if (cut >= 0) from += cut + 1;
  let name = text.slice(from, start);
  while (name.length > 0 && ' ,(['.includes(name[name.length - 1]!)) name = name.slice(0, -1);
  // The last few words name the group ("... differed between the spaced" -> "the spaced"); a joining word is no part of it.
  const words = name.trim().split(/\s+/).slice(-NAME_WORDS);
  while (words.length > 0 && JOINING.has(words[0]!.toLowerCase())) words.shift();
  return words.join(' ');
}

/** The family of a one-way F linked to its groups: df (k - 1, N - k) exactly, every n printed. */
function oneWay(result: ReportedResult, text: string, printed: PrintedMeanSquareError | null): ComparisonFamily | null {
  const set = result.descriptives!;
  const k = set.groups.length;
  if (k < 2 || k > MAX_GROUPS || set.groups.some((group) => group.n === null || group.n < 1)) return null;
  const total = set.groups.reduce((sum, group) => sum + group.n!, 0);
  const [df1, df2] = result.df;
  if (df1 === undefined || df2 === undefined || df1.decimals !== 0 || df2.decimals !== 0 || df1.value !== k - 1 || df2.value !== total - k) return null;
  const groups: FamilyGroup[] = set.groups.map((group, index) => ({
    label: group.label ?? (nameBefore(text, group.start, index === 0 ? set.start - NAME_REACH : set.groups[index - 1]!.end) || `group ${index + 1}`),
    mean: roundingInterval(group.mean),
    n: group.n!,
  }));
  const readings: ErrorReading[] = [];
  if (set.groups.every((group) => group.sd !== null && group.n! >= 2)) {
    let low = 0;
    let high = 0;
    for (const group of set.groups) {
      const sd = roundingInterval(group.sd!);
      low += (group.n! - 1) * Math.max(0, sd.low) ** 2;
      high += (group.n! - 1) * sd.high ** 2;
    }
    readings.push({ source: 'sds', meanSquare: { low: low / df2.value, high: high / df2.value } });
  }
  if (printed !== null) readings.push({ source: 'printed', meanSquare: roundingInterval(printed.value) });
  const f = result.value === null || result.valueComparator !== '=' ? null : roundingInterval(result.value);
  if (f !== null && f.low > 0) {
    const between = weightedSpreadRange(
      groups.map((group) => group.mean),
      groups.map((group) => group.n),
    );
    readings.push({ source: 'anova', meanSquare: { low: between.low / (k - 1) / f.high, high: between.high / (k - 1) / f.low } });
  }
  if (readings.length === 0) return null;
  return { groups, errorReadings: readings, errorDf: df2.value, family: describeF(result), sizesAssumed: set.groups.some((group) => group.nSource === 'document') };
}

/**
 * The family an F opens, or null: its groups (with a mean range and an n each) and every reading of its error
 * mean square. `next` is the result after it, `errors` the document's printed MSEs.
 */
export function familyOf(result: ReportedResult, next: ReportedResult | undefined, errors: readonly PrintedMeanSquareError[], text: string): ComparisonFamily | null {
  if (result.kind !== 'F' || result.df.length !== 2) return null;
  const printed = meanSquareErrorOf(result, next, errors, text);
  if (result.descriptives) return oneWay(result, text, printed);
  if (result.factorial) {
    const marginal = marginalFamily(result.factorial);
    if (marginal === null) return null;
    const readings: ErrorReading[] = [{ source: 'sds', meanSquare: marginal.errorMeanSquare }];
    if (printed !== null && result.df[1]!.value === marginal.errorDf) readings.push({ source: 'printed', meanSquare: roundingInterval(printed.value) });
    return { groups: marginal.groups, errorReadings: readings, errorDf: marginal.errorDf, family: describeF(result), sizesAssumed: marginal.sizesAssumed };
  }
  return null;
}
