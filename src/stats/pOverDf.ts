import { chiSquareUpperTail } from './chiSquareDistribution.js';
import { fUpperTail } from './fDistribution.js';
import type { NumberInterval } from './monotoneImage.js';
import { tTwoTailed } from './tDistribution.js';

/**
 * The p-values a statistic can have over every plausible df.
 *
 * A value printed without its df (a table with an F and a p column but no
 * df anywhere) cannot be checked against its p; but no df at all makes an
 * F of 0.91 give p = .000, or a t of 0.05 give p = .01. A reader uses this
 * to tell a value and a p that belong together from two numbers of a row
 * placed under the wrong columns.
 *
 * ## Method
 * For a statistic in [low, high] (its rounding interval):
 * - t, two-tailed: P(|T| >= t) falls as |t| grows and as df grows (the t
 *   tails are heavier than the normal's and shrink towards it), so the range
 *   runs from the normal limit at the largest |t| to df = 1 at the smallest.
 *   Half the lower end is allowed for a one-tailed p.
 * - chi-square: P(X >= x) rises with df at a fixed x (the distribution moves
 *   right as df grows), so the range runs from df = 1 at the largest x to 1.
 * - F: no such order holds in both df, so the tails are taken over a grid of
 *   df1 from 1 to 100 and df2 from 1 to infinity (the limit df1 F ~
 *   chi-square(df1)); the grid's extremes are widened (halved and doubled)
 *   to cover df between its points.
 *
 * ## References
 * - Abramowitz, M. & Stegun, I. A. (1964). Handbook of Mathematical
 *   Functions, National Bureau of Standards AMS 55, 26.4 (chi-square),
 *   26.6 (F) and 26.7 (t): the distributions and their limits.
 */
export function pRangeOverDf(kind: 'F' | 't' | 'chi2', statistic: NumberInterval): NumberInterval {
  const low = Math.max(0, Math.min(Math.abs(statistic.low), Math.abs(statistic.high)));
  const high = Math.max(Math.abs(statistic.low), Math.abs(statistic.high));
  const spansZero = statistic.low <= 0 && statistic.high >= 0;
  switch (kind) {
    case 't':
      return { low: tTwoTailed(high, Infinity) / 2, high: spansZero ? 1 : tTwoTailed(low, 1) };
    case 'chi2':
      return { low: chiSquareUpperTail(high, 1), high: 1 };
    case 'F':
      return fRangeOnGrid(statistic.low <= 0 ? 0 : statistic.low, statistic.high);
  }
}

const DF1_GRID = [1, 2, 3, 4, 5, 6, 8, 10, 15, 20, 30, 50, 100];
const DF2_GRID = [1, 2, 3, 4, 5, 6, 8, 10, 15, 20, 30, 50, 100, 200, 500, 1000, 10000, Infinity];

function fRangeOnGrid(low: number, high: number): NumberInterval {
  let smallest = 1;
  let largest = 0;
  for (const df1 of DF1_GRID) {
    for (const df2 of DF2_GRID) {
      smallest = Math.min(smallest, fUpperTail(high, df1, df2));
      largest = Math.max(largest, low <= 0 ? 1 : fUpperTail(low, df1, df2));
    }
  }
  return { low: smallest / 2, high: Math.min(1, largest * 2) };
}
