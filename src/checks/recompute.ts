import type { ReportedNumber, ReportedResult } from '../scan/types.js';
import { roundingInterval } from '../stats/reportedNumber.js';
import {
  chiSquareUpperTail,
  fUpperTail,
  partialEtaSquaredFromF,
  rTwoTailed,
  SPEARMAN_SERIES_UP_TO,
  spearmanTwoTailed,
  tTwoTailed,
  zTwoTailed,
} from '../stats/index.js';

export interface Interval {
  low: number;
  high: number;
}

/**
 * What the statistics core says about one reported result, at the printed
 * numbers and over every combination of values that round to them.
 */
export interface Recomputation {
  /** False when the result lacks what is needed (no df for r, no number). */
  evaluable: boolean;
  reason: string | null;
  /** 'upper' for F and chi-square, 'two' for t, z and r (as usually reported). */
  tails: 'upper' | 'two';
  /** p at the printed statistic and df. */
  p: number | null;
  /** Range of p over the rounding box of the statistic and df. */
  pRange: Interval | null;
  /** The range of the statistic the printed value stands for. */
  statisticRange: Interval | null;
  /** F only: partial eta squared at the printed F and its range. */
  partialEtaSquared: number | null;
  partialEtaSquaredRange: Interval | null;
}

/** p for a statistic of the given kind (two-tailed for t, z and r). */
export function pValueFor(kind: ReportedResult['kind'], statistic: number, df: readonly number[]): number {
  switch (kind) {
    case 'F':
      return fUpperTail(statistic, df[0] ?? NaN, df[1] ?? NaN);
    case 'chi2':
      return chiSquareUpperTail(statistic, df[0] ?? NaN);
    case 't':
      return tTwoTailed(statistic, df[0] ?? NaN);
    case 'z':
      return zTwoTailed(statistic);
    case 'r':
      return rTwoTailed(statistic, df[0] ?? NaN);
  }
}

/** The interval a printed df stands for: integers are exact, decimals (Welch, corrected) are rounded. */
export function dfInterval(df: ReportedNumber): Interval {
  return df.decimals === 0 && df.exponent === 0 ? { low: df.value, high: df.value } : roundingInterval(df);
}

/** The interval of |statistic| the printed value stands for, clipped to the statistic's support. */
export function statisticInterval(result: ReportedResult): Interval | null {
  if (!result.value) return null;
  const magnitude = Math.abs(result.value.value);
  if (result.valueComparator === '<' || result.valueComparator === '<=') return { low: 0, high: magnitude };
  const { low, high } = roundingInterval({ ...result.value, value: magnitude });
  const upperLimit = result.kind === 'r' ? 1 : Infinity;
  return { low: Math.max(0, low), high: Math.min(upperLimit, high) };
}

/** Every combination of interval ends (the corners of the rounding box). */
function corners(intervals: readonly Interval[]): number[][] {
  return intervals.reduce<number[][]>(
    (combos, interval) => combos.flatMap((combo) => [...new Set([interval.low, interval.high])].map((end) => [...combo, end])),
    [[]],
  );
}

/**
 * Range of p over the rounding box. p is monotone in the statistic and, for
 * the distributions used here, in each df over the small widths that rounding
 * allows, so the extremes sit at the corners.
 */
export function pRangeOverBox(kind: ReportedResult['kind'], statistic: Interval, dfs: readonly Interval[]): Interval {
  let low = Infinity;
  let high = -Infinity;
  for (const [value, ...df] of corners([statistic, ...dfs])) {
    const p = pValueFor(kind, value ?? NaN, df);
    if (Number.isNaN(p)) continue;
    low = Math.min(low, p);
    high = Math.max(high, p);
  }
  return { low, high };
}

/**
 * p range of a Spearman rho (|rho| in `size`, df = n - 2) under every
 * convention in use: the t approximation (SPSS, Stata, SciPy, and R with
 * ties or n > 1290) and R's exact or AS 89 p for untied ranks, with either
 * continuity step (stats/spearman.ts). A printed p that fits any of them
 * is not flagged; the lenient union costs little sensitivity, while one
 * convention alone would flag correct output of the others.
 */
function spearmanPRange(size: Interval, df: number): Interval {
  let { low, high } = pRangeOverBox('r', size, [{ low: df, high: df }]);
  const n = df + 2;
  if (Number.isInteger(n) && n >= 3 && n <= SPEARMAN_SERIES_UP_TO) {
    for (const rho of [size.low, size.high]) {
      for (const p of [spearmanTwoTailed(rho, n), spearmanTwoTailed(-rho, n, 'midpoint'), spearmanTwoTailed(-rho, n, 'shifted')]) {
        low = Math.min(low, p);
        high = Math.max(high, p);
      }
    }
  }
  return { low, high };
}

const requiredDfCount: Record<ReportedResult['kind'], number> = { F: 2, t: 1, chi2: 1, r: 1, z: 0 };

export function recompute(result: ReportedResult): Recomputation {
  const tails = result.kind === 'F' || result.kind === 'chi2' ? 'upper' : 'two';
  const empty: Recomputation = {
    evaluable: false,
    reason: null,
    tails,
    p: null,
    pRange: null,
    statisticRange: null,
    partialEtaSquared: null,
    partialEtaSquaredRange: null,
  };
  const statisticRange = statisticInterval(result);
  if (!result.value || !statisticRange) return { ...empty, reason: 'the statistic is not written as a number' };
  if (result.df.length !== requiredDfCount[result.kind]) {
    return { ...empty, statisticRange, reason: `${result.kind} needs ${requiredDfCount[result.kind]} df, found ${result.df.length}` };
  }
  const dfValues = result.df.map((df) => df.value);
  if (dfValues.some((df) => !(df > 0))) return { ...empty, statisticRange, reason: 'df must be positive' };
  if (result.kind === 'r' && Math.abs(result.value.value) > 1) return { ...empty, statisticRange, reason: '|r| > 1' };
  if ((result.kind === 'F' || result.kind === 'chi2') && result.value.value < 0) {
    return { ...empty, statisticRange, reason: `${result.kind} cannot be negative` };
  }
  const atPrinted = result.valueComparator === '=' ? pValueFor(result.kind, Math.abs(result.value.value), dfValues) : null;
  const pRange = result.symbol === 'rs' ? spearmanPRange(statisticRange, dfValues[0]!) : pRangeOverBox(result.kind, statisticRange, result.df.map(dfInterval));
  let partialEtaSquared: number | null = null;
  let partialEtaSquaredRange: Interval | null = null;
  if (result.kind === 'F') {
    const [df1, df2] = result.df.map(dfInterval) as [Interval, Interval];
    partialEtaSquared = result.valueComparator === '=' ? partialEtaSquaredFromF(result.value.value, dfValues[0]!, dfValues[1]!) : null;
    // Increasing in F and df1, decreasing in df2.
    partialEtaSquaredRange = {
      low: partialEtaSquaredFromF(statisticRange.low, df1.low, df2.high),
      high: partialEtaSquaredFromF(statisticRange.high, df1.high, df2.low),
    };
  }
  return {
    evaluable: true,
    reason: null,
    tails,
    p: atPrinted,
    pRange,
    statisticRange,
    partialEtaSquared,
    partialEtaSquaredRange,
  };
}
