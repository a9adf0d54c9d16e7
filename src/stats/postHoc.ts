import { fUpperTail } from './fDistribution.js';
import { fQuantileUpper, studentizedRangeQuantileUpper, tQuantileUpper } from './quantiles.js';
import { studentizedRangeUpperTail } from './studentizedRange.js';
import { tTwoTailed } from './tDistribution.js';

/**
 * Pairwise comparisons of group means after an ANOVA, from the groups'
 * means and sizes and the error mean square and df (printed with the
 * ANOVA, or SS_within / (N - k) from the groups' SDs), with adjusted p and
 * simultaneous confidence intervals.
 *
 * ## Method
 * For groups i < j (k groups, m = k (k - 1) / 2 pairs), the difference
 * d = m_i - m_j, its standard error SE = sqrt(MSE (1/n_i + 1/n_j)) and
 * t = d / SE on the error df:
 * - Fisher's LSD: p = 2 P(T > |t|); interval d +- t(alpha/2) SE.
 * - Bonferroni: p = min(1, m p_LSD); interval with t(alpha / (2m)).
 * - Sidak: p = 1 - (1 - p_LSD)^m, computed as -expm1(m log1p(-p_LSD)) so a
 *   small p keeps its digits; interval with t(a/2), a = 1 - (1 - alpha)^(1/m).
 * - Holm: the step-down adjustment of the LSD p-values (sorted ascending,
 *   p_(r) times m - r + 1, made nondecreasing, capped at 1). Holm's
 *   procedure has no simultaneous intervals of its own; the interval given
 *   is Bonferroni's (which contains the Holm decisions' intervals), and
 *   intervalIsBonferroni says so.
 * - Tukey HSD, and Tukey-Kramer when the n differ: q = |d| / sqrt(MSE/2
 *   (1/n_i + 1/n_j)) = sqrt(2) |t|, p = P(Q(k, df) > q) (studentized range
 *   upper tail, computed directly); interval d +- q(alpha; k, df) / sqrt(2) SE.
 * - Scheffe: F = t^2 / (k - 1), p = P(F(k - 1, df) > F); interval
 *   d +- sqrt((k - 1) F(alpha; k - 1, df)) SE.
 * Critical values come from quantiles.ts (the upper tails inverted by
 * Brent's method to about 1e-14 relative), which refit's intervals use too.
 *
 * ## References
 * - Tukey, J. W. (1953). The problem of multiple comparisons. Unpublished
 *   manuscript, Princeton University. Kramer, C. Y. (1956). Extension of
 *   multiple range tests to group means with unequal numbers of
 *   replications. Biometrics 12(3), 307-310.
 * - Scheffe, H. (1953). A method for judging all contrasts in the analysis
 *   of variance. Biometrika 40, 87-104.
 * - Sidak, Z. (1967). Rectangular confidence regions for the means of
 *   multivariate normal distributions. Journal of the American Statistical
 *   Association 62, 626-633.
 * - Holm, S. (1979). A simple sequentially rejective multiple test
 *   procedure. Scandinavian Journal of Statistics 6(2), 65-70.
 * - Hochberg, Y. & Tamhane, A. C. (1987). Multiple Comparison Procedures.
 *   Wiley, chapters 2-3 (LSD, Bonferroni, Sidak, Scheffe and Tukey-Kramer
 *   intervals as written above). From memory.
 */

export type PostHocMethod = 'tukey' | 'bonferroni' | 'holm' | 'sidak' | 'scheffe' | 'lsd';

export const POST_HOC_METHODS: readonly PostHocMethod[] = ['tukey', 'bonferroni', 'holm', 'sidak', 'scheffe', 'lsd'];

export interface GroupMeanSize {
  label: string;
  mean: number;
  n: number;
}

export interface PairwiseComparison {
  first: string;
  second: string;
  /** first minus second */
  difference: number;
  se: number;
  /** t for every method but Tukey's, whose statistic is q = sqrt(2) |t|. */
  statistic: number;
  statisticName: 't' | 'q';
  df: number;
  /** Unadjusted two-tailed p of t (Fisher's LSD). */
  pUnadjusted: number;
  /** p adjusted by the method. */
  p: number;
  lower: number;
  upper: number;
  /** True for Holm, whose interval is Bonferroni's. */
  intervalIsBonferroni: boolean;
}

/** Holm's step-down adjusted p-values, in the input order. */
export function holmAdjusted(pValues: readonly number[]): number[] {
  const m = pValues.length;
  const order = pValues.map((p, index) => ({ p, index })).sort((a, b) => a.p - b.p);
  const adjusted = new Array<number>(m);
  let running = 0;
  order.forEach(({ p, index }, rank) => {
    running = Math.max(running, Math.min(1, (m - rank) * p));
    adjusted[index] = running;
  });
  return adjusted;
}

/** Sidak's adjusted p for m tests: 1 - (1 - p)^m without cancellation. */
export function sidakAdjusted(p: number, m: number): number {
  return p >= 1 ? 1 : -Math.expm1(m * Math.log1p(-p));
}

/**
 * The method's adjusted p of each comparison of a family of pairwise
 * comparisons among k means (t and its unadjusted two-tailed p on df; m =
 * the family's size), in the input order. Refit's comparisons of marginal
 * means use it too.
 */
export function adjustedPValues(method: PostHocMethod, comparisons: ReadonlyArray<{ t: number; pUnadjusted: number }>, k: number, df: number): number[] {
  const m = comparisons.length;
  const unadjusted = comparisons.map((c) => c.pUnadjusted);
  switch (method) {
    case 'lsd':
      return unadjusted;
    case 'bonferroni':
      return unadjusted.map((p) => Math.min(1, m * p));
    case 'sidak':
      return unadjusted.map((p) => sidakAdjusted(p, m));
    case 'holm':
      return holmAdjusted(unadjusted);
    case 'tukey':
      return comparisons.map((c) => studentizedRangeUpperTail(Math.SQRT2 * Math.abs(c.t), k, df));
    case 'scheffe':
      return comparisons.map((c) => fUpperTail((c.t * c.t) / (k - 1), k - 1, df));
  }
}

/**
 * Every pairwise comparison (first group before second, in input order)
 * with the method's p and a two-sided interval at `level`. Null for fewer
 * than two groups, an n below 1, a nonpositive error mean square or df.
 */
export function pairwiseComparisons(
  groups: readonly GroupMeanSize[],
  errorMeanSquare: number,
  errorDf: number,
  method: PostHocMethod,
  level = 0.95,
): PairwiseComparison[] | null {
  const k = groups.length;
  if (k < 2 || !(errorMeanSquare > 0) || !(errorDf > 0) || !(level > 0 && level < 1)) return null;
  if (groups.some((g) => !(g.n >= 1) || !Number.isFinite(g.mean))) return null;
  const pairs: Array<Omit<PairwiseComparison, 'p' | 'lower' | 'upper' | 'statistic' | 'statisticName' | 'intervalIsBonferroni'> & { t: number }> = [];
  for (let i = 0; i < k; i++) {
    for (let j = i + 1; j < k; j++) {
      const difference = groups[i]!.mean - groups[j]!.mean;
      const se = Math.sqrt(errorMeanSquare * (1 / groups[i]!.n + 1 / groups[j]!.n));
      const t = difference / se;
      pairs.push({ first: groups[i]!.label, second: groups[j]!.label, difference, se, t, df: errorDf, pUnadjusted: tTwoTailed(t, errorDf) });
    }
  }
  const adjusted = adjustedPValues(method, pairs, k, errorDf);
  const critical = criticalMultiplier(method, level, k, pairs.length, errorDf);
  return pairs.map(({ t, ...pair }, index) => {
    return {
      ...pair,
      statistic: method === 'tukey' ? Math.SQRT2 * Math.abs(t) : t,
      statisticName: method === 'tukey' ? 'q' : 't',
      p: adjusted[index]!,
      lower: pair.difference - critical * pair.se,
      upper: pair.difference + critical * pair.se,
      intervalIsBonferroni: method === 'holm',
    };
  });
}

/**
 * The multiple of the SE that gives the method's simultaneous interval at
 * `level` for a family of m comparisons among k means on df (Holm's is
 * Bonferroni's). Refit's comparisons of marginal means use it too.
 */
export function criticalMultiplier(method: PostHocMethod, level: number, k: number, m: number, df: number): number {
  const alpha = 1 - level;
  switch (method) {
    case 'lsd':
      return tQuantileUpper(alpha / 2, df);
    case 'bonferroni':
    case 'holm':
      return tQuantileUpper(alpha / (2 * m), df);
    case 'sidak':
      return tQuantileUpper(-Math.expm1(Math.log1p(-alpha) / m) / 2, df);
    case 'tukey':
      return studentizedRangeQuantileUpper(alpha, k, df) / Math.SQRT2;
    case 'scheffe':
      return Math.sqrt((k - 1) * fQuantileUpper(alpha, k - 1, df));
  }
}
