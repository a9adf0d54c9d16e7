import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

/** Reads a JSON fixture from tests/fixtures/<relativePath>, inside the repository. */
export function loadFixture<T>(relativePath: string): T {
  const url = new URL(`../fixtures/${relativePath}`, import.meta.url);
  return JSON.parse(readFileSync(fileURLToPath(url), 'utf8')) as T;
}

/** |value - reference| / |reference|, or |value| when the reference is 0. */
export function relativeError(value: number, reference: number): number {
  if (reference === 0) return Math.abs(value);
  return Math.abs(value - reference) / Math.abs(reference);
}

export interface Comparison {
  /** Human-readable inputs, e.g. "F=4.21 df1=1 df2=44". */
  label: string;
  computed: number;
  reference: number;
}

/**
 * Returns one message per comparison whose relative error exceeds the tolerance
 * (NaN counts as a failure), naming the inputs and both values, so that
 * `expect(failures).toEqual([])` prints every miss.
 */
export function relativeFailures(comparisons: Iterable<Comparison>, tolerance: number): string[] {
  const failures: string[] = [];
  for (const { label, computed, reference } of comparisons) {
    const error = relativeError(computed, reference);
    if (!(error <= tolerance)) {
      failures.push(`${label}: computed ${computed}, reference ${reference}, relative error ${error.toExponential(2)}`);
    }
  }
  return failures;
}

/** Largest relative error over the comparisons (for reporting in test names and logs). */
export function worstRelativeError(comparisons: Iterable<Comparison>): number {
  let worst = 0;
  for (const { computed, reference } of comparisons) worst = Math.max(worst, relativeError(computed, reference));
  return worst;
}
