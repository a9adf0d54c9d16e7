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

/** Set semantics (SameValueZero): the two ends are one corner when equal (NaN included). */
function sameEnd(low: number, high: number): boolean {
  return low === high || (Number.isNaN(low) && Number.isNaN(high));
}

/**
 * Range of p over the rounding box. p is monotone in the statistic and, for
 * the distributions used here, in each df over the small widths that rounding
 * allows, so the extremes sit at the corners. The corners are visited one by
 * one without building their list: this runs for every result and for every
 * slip tried, and the list cost more than the p-values.
 */
export function pRangeOverBox(kind: ReportedResult['kind'], statistic: Interval, dfs: readonly Interval[]): Interval {
  let low = Infinity;
  let high = -Infinity;
  const dimensions = dfs.length + 1;
  let corners = 1;
  // Bit d of a corner's number picks the high end of dimension d (the statistic is dimension 0); an interval whose ends are equal has one corner.
  let twoEnded = 0;
  for (let d = 0; d < dimensions; d++) {
    const interval = d === 0 ? statistic : dfs[d - 1]!;
    if (!sameEnd(interval.low, interval.high)) {
      twoEnded |= 1 << d;
      corners *= 2;
    }
  }
  const df: number[] = new Array<number>(dfs.length);
  for (let corner = 0; corner < corners; corner++) {
    // The corner's bits are spread over the two-ended dimensions only.
    let bits = corner;
    let value = NaN;
    for (let d = 0; d < dimensions; d++) {
      const interval = d === 0 ? statistic : dfs[d - 1]!;
      let end = interval.low;
      if ((twoEnded >> d) & 1) {
        if (bits & 1) end = interval.high;
        bits >>= 1;
      }
      if (d === 0) value = end;
      else df[d - 1] = end;
    }
    const p = pValueFor(kind, value, df);
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

/** Why p cannot be recomputed for a result (null when it can); the result's statistic interval is given. */
function notEvaluableBecause(result: ReportedResult, statisticRange: Interval | null): string | null {
  if (!result.value || !statisticRange) return 'the statistic is not written as a number';
  if (result.df.length !== requiredDfCount[result.kind]) return `${result.kind} needs ${requiredDfCount[result.kind]} df, found ${result.df.length}`;
  for (const df of result.df) if (!(df.value > 0)) return 'df must be positive';
  if (result.kind === 'r' && Math.abs(result.value.value) > 1) return '|r| > 1';
  if ((result.kind === 'F' || result.kind === 'chi2') && result.value.value < 0) return `${result.kind} cannot be negative`;
  return null;
}

/** The p range over the rounding box, as recompute gives it, or null when p cannot be recomputed. */
function pRangeOfEvaluable(result: ReportedResult, statisticRange: Interval): Interval {
  return result.symbol === 'rs' ? spearmanPRange(statisticRange, result.df[0]!.value) : pRangeOverBox(result.kind, statisticRange, result.df.map(dfInterval));
}

/**
 * recompute(result).pRange when the result is evaluable, null otherwise, without the p at the
 * printed numbers and the effect size: the slip search asks this of dozens of variants per result.
 */
export function recomputedPRange(result: ReportedResult): Interval | null {
  const statisticRange = statisticInterval(result);
  if (notEvaluableBecause(result, statisticRange) !== null) return null;
  return pRangeOfEvaluable(result, statisticRange!);
}

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
  const reason = notEvaluableBecause(result, statisticRange);
  if (reason !== null) return { ...empty, statisticRange, reason };
  const value = result.value!;
  const dfValues = result.df.map((df) => df.value);
  const atPrinted = result.valueComparator === '=' ? pValueFor(result.kind, Math.abs(value.value), dfValues) : null;
  const pRange = pRangeOfEvaluable(result, statisticRange!);
  let partialEtaSquared: number | null = null;
  let partialEtaSquaredRange: Interval | null = null;
  if (result.kind === 'F') {
    const [df1, df2] = result.df.map(dfInterval) as [Interval, Interval];
    partialEtaSquared = result.valueComparator === '=' ? partialEtaSquaredFromF(value.value, dfValues[0]!, dfValues[1]!) : null;
    // Increasing in F and df1, decreasing in df2.
    partialEtaSquaredRange = {
      low: partialEtaSquaredFromF(statisticRange!.low, df1.low, df2.high),
      high: partialEtaSquaredFromF(statisticRange!.high, df1.high, df2.low),
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
