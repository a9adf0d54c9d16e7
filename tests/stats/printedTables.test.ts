import { describe, expect, it } from 'vitest';
import { fUpperTail } from '../../src/stats/fDistribution.js';
import { tUpperTail } from '../../src/stats/tDistribution.js';
import { chiSquareUpperTail } from '../../src/stats/chiSquareDistribution.js';
import { studentizedRangeUpperTail } from '../../src/stats/studentizedRange.js';

/**
 * A tabled critical value c is correct to its printed precision when the exact critical value
 * lies in [c - h, c + h], h = half a unit in the last printed place. Since upper tails decrease,
 * that means upperTail(c + h) <= alpha <= upperTail(c - h): the test fails if the code's tail is
 * off by more than the table's rounding.
 */
function bracketsAlpha(upperTail: (x: number) => number, tabled: number, decimals: number, alpha: number): boolean {
  const half = 0.5 * 10 ** -decimals;
  return upperTail(tabled + half) <= alpha && alpha <= upperTail(tabled - half);
}

// Values FROM MEMORY of the printed tables in Pearson, E. S. & Hartley, H. O. (1966), Biometrika
// Tables for Statisticians, Vol. 1, 3rd ed., Cambridge University Press: Table 12 (t), Table 8
// (chi-square), Table 18 (F) and Table 29 (studentized range). They agree with every introductory
// textbook's appendix tables. Not re-read from the book in this session.
describe('printed critical-value tables (Biometrika Tables, from memory)', () => {
  it('F table (Table 18): F(.05; 1, 10) = 4.96, F(.05; 2, 20) = 3.49, F(.01; 3, 30) = 4.51, F(.05; 4, 60) = 2.53, F(.01; 1, 120) = 6.85', () => {
    const rows: Array<[number, number, number, number]> = [
      [0.05, 1, 10, 4.96], [0.05, 2, 20, 3.49], [0.01, 3, 30, 4.51], [0.05, 4, 60, 2.53], [0.01, 1, 120, 6.85],
    ];
    const misses = rows.filter(([alpha, df1, df2, tabled]) => !bracketsAlpha((f) => fUpperTail(f, df1, df2), tabled, 2, alpha));
    expect(misses).toEqual([]);
  });

  it('t table (Table 12): t(.025; 10) = 2.228, t(.005; 20) = 2.845, t(.05; 30) = 1.697', () => {
    const rows: Array<[number, number, number]> = [[0.025, 10, 2.228], [0.005, 20, 2.845], [0.05, 30, 1.697]];
    const misses = rows.filter(([alpha, df, tabled]) => !bracketsAlpha((t) => tUpperTail(t, df), tabled, 3, alpha));
    expect(misses).toEqual([]);
  });

  it('chi-square table (Table 8): chi2(.05; 1) = 3.841, chi2(.01; 10) = 23.209', () => {
    const rows: Array<[number, number, number]> = [[0.05, 1, 3.841], [0.01, 10, 23.209]];
    const misses = rows.filter(([alpha, df, tabled]) => !bracketsAlpha((x) => chiSquareUpperTail(x, df), tabled, 3, alpha));
    expect(misses).toEqual([]);
  });

  it('studentized range table (Table 29): q(.05; 3, 10) = 3.877, q(.05; 5, 20) = 4.232, q(.01; 3, 10) = 5.270', () => {
    const rows: Array<[number, number, number, number]> = [[0.05, 3, 10, 3.877], [0.05, 5, 20, 4.232], [0.01, 3, 10, 5.27]];
    const misses = rows.filter(([alpha, k, df, tabled]) => !bracketsAlpha((q) => studentizedRangeUpperTail(q, k, df), tabled, 3, alpha));
    expect(misses).toEqual([]);
  });

  it('would notice a wrong table entry (the check is not vacuous)', () => {
    expect(bracketsAlpha((t) => tUpperTail(t, 10), 2.238, 3, 0.025)).toBe(false);
    expect(bracketsAlpha((f) => fUpperTail(f, 1, 10), 4.97, 2, 0.05)).toBe(false);
  });
});
