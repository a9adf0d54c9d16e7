/**
 * The first index in [0, length) at which `isBefore` turns false, for a
 * predicate that is true on a prefix and false after it (binary search,
 * O(log length)). One search for the sorted look-ups of the scanner and the
 * checks, which ask "the first element at or after" or "after" an offset.
 */
export function partitionPoint(length: number, isBefore: (index: number) => boolean): number {
  let low = 0;
  let high = length;
  while (low < high) {
    const mid = (low + high) >> 1;
    if (isBefore(mid)) low = mid + 1;
    else high = mid;
  }
  return low;
}
