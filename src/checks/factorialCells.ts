import type { FactorialCellSet, FactorialLink } from '../scan/types.js';
import { factorialAnovaRange, type FactorialEffectRange, type SumOfSquaresType } from '../stats/factorialFromCells.js';
import { roundingInterval } from '../stats/reportedNumber.js';
import type { NumberInterval } from '../stats/monotoneImage.js';

/**
 * The ranges of a linked effect's F, p and partial eta squared under sums
 * of squares of types I, II and III, over the rounding of every printed
 * cell mean and SD (stats/factorialFromCells.ts), for the checks of F tests
 * linked to factorial cell statistics (scan/factorial). Computed once per
 * set and cell size: the F tests of one design share it.
 */

export const SS_TYPES: readonly SumOfSquaresType[] = [1, 2, 3];
export const TYPE_NAMES: Record<SumOfSquaresType, string> = { 1: 'I', 2: 'II', 3: 'III' };

export interface TypeRange {
  type: SumOfSquaresType;
  effect: FactorialEffectRange;
}

const cache = new WeakMap<FactorialCellSet, Map<string, (FactorialEffectRange[] | null)[]>>();

/** Every effect's range under each type (null for a type that cannot be computed), for the cells with their ns or `assumedN`. */
function rangesOf(set: FactorialCellSet, assumedN: number | null): (FactorialEffectRange[] | null)[] {
  const key = String(assumedN);
  let bySize = cache.get(set);
  if (bySize === undefined) cache.set(set, (bySize = new Map()));
  const known = bySize.get(key);
  if (known !== undefined) return known;
  const boxes = set.cells.map((cell) => {
    const sd = roundingInterval(cell.sd);
    return { levels: cell.levels, mean: roundingInterval(cell.mean), sd: { low: Math.max(0, sd.low), high: sd.high }, n: cell.n ?? assumedN ?? 0 };
  });
  const ranges = SS_TYPES.map((type) => factorialAnovaRange(set.factors.length, boxes, type)?.effects ?? null);
  bySize.set(key, ranges);
  return ranges;
}

/** The linked effect's range under each type that can be computed. */
export function linkedEffectRanges(link: FactorialLink): TypeRange[] {
  const ranges = rangesOf(link.set, link.assumedN);
  const found: TypeRange[] = [];
  SS_TYPES.forEach((type, index) => {
    const effect = ranges[index]?.find((candidate) => candidate.term.length === link.term.length && candidate.term.every((f, i) => f === link.term[i]));
    if (effect !== undefined) found.push({ type, effect });
  });
  return found;
}

/** "Age × Load" from the set's factor names (a factor without one: its levels, "Low/High"). */
export function effectName(link: FactorialLink): string {
  return link.term.map((f) => link.set.factors[f] ?? link.set.levels[f]!.join('/')).join(' × ');
}

/** "2 × 3 design, Table 2" or "2 × 2 design, written in the text". */
export function describeCellSet(set: FactorialCellSet): string {
  const shape = set.levels.map((levels) => levels.length).join(' × ');
  const where = set.source === 'table' ? (set.tableNumber !== null ? `Table ${set.tableNumber}` : 'a table') : 'the text';
  return `the ${shape} cell means and SDs in ${where}`;
}

/** What the cells' ns rest on, for a message. */
export function describeSizes(set: FactorialCellSet, assumedN: number | null): string {
  if (assumedN !== null) return ` No n is printed with the cells: equal ns of ${assumedN} per cell are assumed from the error df, so this is at most a warning.`;
  const total = set.cells.reduce((sum, cell) => sum + (cell.n ?? 0), 0);
  return set.nSource === 'statement' ? ` (ns from the statement of n per cell; N = ${total})` : ` (N = ${total})`;
}

/** What a printed F test states, for comparison with each type's ranges: predicates say whether a range fits the printed number. */
export interface PrintedEffectTest {
  /** The printed df; absent when the link already matched them to the design. */
  df?: { df1: number; df2: number };
  f: NumberInterval;
  /** null when no p is printed. */
  pFits: ((range: NumberInterval) => boolean) | null;
  /** null when no partial eta squared is printed. */
  partialEtaSquaredFits: ((range: NumberInterval) => boolean) | null;
}

/** One type's verdict on each printed number (null: not printed). */
export interface TypeVerdict<Effect> {
  type: SumOfSquaresType;
  effect: Effect;
  df: boolean;
  f: boolean;
  p: boolean | null;
  partialEtaSquared: boolean | null;
}

export type UnmatchedPart = 'df' | 'F' | 'p' | 'partial eta squared';

/**
 * Which types of sums of squares reproduce a printed F test: every printed
 * number within the type's range. The `cells` command and
 * cell-statistics-test-mismatch both decide with this, so they cannot
 * disagree. `unmatched` names what no type fits (empty when some type
 * reproduces the test, or when only the combination fails).
 */
export function compareWithTypes<Effect extends { df1: number; df2: number; f: NumberInterval; p: NumberInterval; partialEtaSquared: NumberInterval }>(
  ranges: ReadonlyArray<{ type: SumOfSquaresType; effect: Effect }>,
  printed: PrintedEffectTest,
): { byType: TypeVerdict<Effect>[]; reproducedBy: TypeVerdict<Effect>[]; unmatched: UnmatchedPart[] } {
  const byType = ranges.map(({ type, effect }): TypeVerdict<Effect> => ({
    type,
    effect,
    df: printed.df === undefined || (printed.df.df1 === effect.df1 && printed.df.df2 === effect.df2),
    f: overlapsWithSlack(effect.f, printed.f),
    p: printed.pFits === null ? null : printed.pFits(effect.p),
    partialEtaSquared: printed.partialEtaSquaredFits === null ? null : printed.partialEtaSquaredFits(effect.partialEtaSquared),
  }));
  const reproducedBy = byType.filter((check) => check.df && check.f && check.p !== false && check.partialEtaSquared !== false);
  const unmatched: UnmatchedPart[] = [];
  if (reproducedBy.length === 0) {
    if (!byType.some((check) => check.df)) unmatched.push('df');
    if (!byType.some((check) => check.f)) unmatched.push('F');
    if (byType.every((check) => check.p === false)) unmatched.push('p');
    if (byType.every((check) => check.partialEtaSquared === false)) unmatched.push('partial eta squared');
  }
  return { byType, reproducedBy, unmatched };
}

/** A range meets a printed number's rounding interval (with a relative slack of 1e-9 for floating point). */
export function overlapsWithSlack(range: NumberInterval, printed: NumberInterval): boolean {
  const slack = 1e-9 * Math.max(1, Math.abs(printed.high));
  return range.low <= printed.high + slack && range.high >= printed.low - slack;
}
