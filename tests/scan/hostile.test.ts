import { describe, expect, it } from 'vitest';
import { scanText } from '../../src/scan/scan.js';

// Speed is measured in bench/scan.ts; these tests check that hostile inputs
// are read correctly (no false results, results around them still found).

describe('hostile inputs', () => {
  it('finds nothing in a long line of brackets, digits and commas', () => {
    expect(scanText('F(((1,2,3,(,('.repeat(20_000)).results).toEqual([]);
  });

  it('finds nothing in long runs of digits, spaces or symbols without values', () => {
    expect(scanText('9'.repeat(100_000)).results).toEqual([]);
    expect(scanText(`F${' '.repeat(100_000)}(1, 2) = 3`).results).toEqual([]);
    expect(scanText('t(1, F(2, r = z = '.repeat(5_000)).results).toEqual([]);
    expect(scanText('p = .05, p < .01; '.repeat(5_000)).results).toEqual([]);
  });

  it('reads a result that follows a long hostile stretch', () => {
    const text = `${'F(((1,2,3,(,('.repeat(5_000)} Then F(1, 44) = 5.10, p = .03.`;
    const results = scanText(text).results;
    expect(results.map((result) => result.text)).toEqual(['F(1, 44) = 5.10, p = .03']);
  });

  it('does not read an overlong digit run as a number', () => {
    expect(scanText(`t(28) = ${'1'.repeat(40)}`).results).toEqual([]);
  });

  it('reads results separated by long column gaps and emphasis markers', () => {
    const row = `*F* < 1${' '.repeat(180)}n.s.${' '.repeat(300)}`;
    const results = scanText(row.repeat(2_000)).results;
    expect(results).toHaveLength(2_000);
    expect(results.every((result) => result.notSignificant)).toBe(true);
  });

  it('shares a plural p in a sentence of thousands of results without slowing down', () => {
    const text = `${'t(20) = 2.1 and '.repeat(3_000)}t(20) = 3.3, ps < .05.`;
    const results = scanText(text).results;
    expect(results).toHaveLength(3_001);
    // The plural p reaches a bounded number of results before it, not the whole line.
    const shared = results.filter((result) => result.p !== null).length;
    expect(shared).toBeGreaterThan(2);
    expect(shared).toBeLessThan(20);
  });

  it('reads thousands of results in one line', () => {
    const text = 'F(1, 44) = 5.10, p = .03; '.repeat(3_000);
    expect(scanText(text).results).toHaveLength(3_000);
  });
});
