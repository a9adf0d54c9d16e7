import { expect } from 'vitest';
import { scanText } from '../../src/scan/scan.js';
import type { ReportedResult } from '../../src/scan/types.js';

/** Scans `text` and returns its single result, failing the test when there is not exactly one. */
export function onlyResult(text: string): ReportedResult {
  const { results } = scanText(text);
  expect(results.map((result) => result.text)).toHaveLength(1);
  return results[0]!;
}

/** The df of a result as written. */
export function dfTexts(result: ReportedResult): string[] {
  return result.df.map((df) => df.text);
}

/** The original characters a result's offsets point at. */
export function slice(text: string, span: { start: number; end: number }): string {
  return text.slice(span.start, span.end);
}
