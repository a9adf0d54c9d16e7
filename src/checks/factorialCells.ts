import type { FactorialCellSet, FactorialLink } from '../scan/types.js';
import { factorialAnovaRange, type FactorialEffectRange, type SumOfSquaresType } from '../stats/factorialFromCells.js';
import { roundingInterval } from '../stats/reportedNumber.js';

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
