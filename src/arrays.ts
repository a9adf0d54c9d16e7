/**
 * Array helpers for inputs of any length. Spreading an array into a call
 * (push(...items), Math.max(...values)) passes every element as an
 * argument on the stack, and a few hundred thousand elements (a folder of
 * 150,000 papers, a report of every p-value in a corpus) exceed it:
 * "Maximum call stack size exceeded". These walk the array instead.
 */

/** Appends every item to `target`, in order, and returns `target`. */
export function appendAll<T>(target: T[], items: Iterable<T>): T[] {
  for (const item of items) target.push(item);
  return target;
}

/** The smallest and largest of `values`, or null when there are none. */
export function extremes(values: Iterable<number>): { min: number; max: number } | null {
  let min = Infinity;
  let max = -Infinity;
  let any = false;
  for (const value of values) {
    any = true;
    if (value < min) min = value;
    if (value > max) max = value;
  }
  return any ? { min, max } : null;
}
