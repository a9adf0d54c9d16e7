import { fUpperTail } from './fDistribution.js';
import { tTwoTailed } from './tDistribution.js';
import type { NumberInterval } from './monotoneImage.js';

/**
 * Tests recomputed from group summary statistics (means, standard
 * deviations, sizes), at the printed numbers and over every combination of
 * values that round to them.
 *
 * ## Method
 * One-way between-subjects ANOVA (k groups, N = sum of n_i):
 *   SS_between = sum n_i (m_i - m)^2 with m = sum n_i m_i / N,
 *   SS_within = sum (n_i - 1) s_i^2,
 *   F = (SS_between / (k - 1)) / (SS_within / (N - k)), df = (k - 1, N - k),
 *   partial eta squared = SS_between / (SS_between + SS_within).
 * Welch's heteroscedastic one-way ANOVA: w_i = n_i / s_i^2, W = sum w_i,
 *   m~ = sum w_i m_i / W, A = sum w_i (m_i - m~)^2 / (k - 1),
 *   L = sum (1 - w_i / W)^2 / (n_i - 1),
 *   F_W = A / (1 + 2 (k - 2) L / (k^2 - 1)), df = (k - 1, (k^2 - 1) / (3 L)).
 * Brown-Forsythe's one-way ANOVA for unequal variances: with
 *   c_i = (1 - n_i / N) s_i^2 and D = sum c_i,
 *   F* = SS_between / D, df = (k - 1, D^2 / sum c_i^2 / (n_i - 1))
 *   (Satterthwaite's df; Mehrotra's 1997 df1 = D^2 / (sum s_i^4 +
 *   (sum n_i s_i^2 / N)^2 - 2 sum n_i s_i^4 / N) is given beside it).
 * Independent-samples t: Student's with the pooled variance
 *   s_p^2 = ((n1 - 1) s1^2 + (n2 - 1) s2^2) / (n1 + n2 - 2),
 *   t = (m1 - m2) / sqrt(s_p^2 (1/n1 + 1/n2)), df = n1 + n2 - 2;
 * Welch's t = (m1 - m2) / sqrt(s1^2/n1 + s2^2/n2) with the
 * Welch-Satterthwaite df (a + b)^2 / (a^2/(n1 - 1) + b^2/(n2 - 1)),
 * a = s1^2/n1, b = s2^2/n2.
 *
 * Rounding: every mean and SD stands for an interval (the group sizes are
 * exact). F is not monotone in the means, so the bounds are found as
 * follows. SS_within is increasing in every s_i and does not involve the
 * means; SS_between involves only the means and is a convex quadratic (the
 * weighted spread of the means): its maximum over the box of means lies at
 * a vertex (all 2^k are tried; k is capped), and its minimum is the point
 * where every mean is clamped to a common value c that equals the weighted
 * mean of the clamped values (the Karush-Kuhn-Tucker condition of this
 * convex problem), found by bisection on c. Because the two sums depend on
 * disjoint inputs, [SSb_min / SSw_max, SSb_max / SSw_min] (times the df
 * ratio) is the exact range of F. For Welch's F the numerator
 * S(w, m) = min over c of sum w_i (m_i - c)^2 is nondecreasing in every
 * weight (a minimum of nondecreasing functions) and convex in the means, so
 * it is bounded exactly in the same way at the extreme weights; L is
 * bounded by interval arithmetic on w_i / W (increasing in w_i, decreasing
 * in the others), which gives an outer bound of the range of F_W.
 * Brown-Forsythe's F* has SS_between (exact range as above) over D, which
 * rises with every s_i, so its range is exact too; its df2 g(c) =
 * (sum c_i)^2 / sum c_i^2 / (n_i - 1) is quasi-concave in c >= 0 (its
 * upper level sets {sum c >= sqrt(t) ||c||} are convex), so its minimum
 * over the box of c lies at a vertex (all are tried), and its maximum is
 * bounded by (sum c_high)^2 / sum c_low^2 / (n_i - 1) and by N - k
 * (Cauchy-Schwarz), an outer bound. Welch's t
 * df depends only on the ratio a/b, rises up to a/b = (n1 - 1)/(n2 - 1) and
 * falls after it, so its range over the box is exact.
 *
 * ## References
 * - Welch, B. L. (1951). On the comparison of several mean values: an
 *   alternative approach. Biometrika 38, 330-336.
 * - Welch, B. L. (1947). The generalization of "Student's" problem when
 *   several different population variances are involved. Biometrika 34,
 *   28-35. Satterthwaite, F. E. (1946). Biometrics Bulletin 2, 110-114.
 * - Brown, M. B. & Forsythe, A. B. (1974). The small sample behavior of
 *   some statistics which test the equality of several means.
 *   Technometrics 16(1), 129-132. Mehrotra, D. V. (1997). Improving the
 *   Brown-Forsythe solution to the generalized Behrens-Fisher problem.
 *   Communications in Statistics - Simulation and Computation 26(3),
 *   1139-1145.
 * - Boyd, S. & Vandenberghe, L. (2004). Convex Optimization. Cambridge
 *   University Press, sections 3.1.4 (maxima of convex functions lie at
 *   vertices of a polytope) and 5.5.3 (KKT conditions).
 */

export interface GroupSummary {
  mean: number;
  sd: number;
  n: number;
}

/** A group whose mean and SD are known only to an interval (rounding); n is exact. */
export interface GroupSummaryBox {
  mean: NumberInterval;
  sd: NumberInterval;
  n: number;
}

export interface AnovaFromSummary {
  f: number;
  df1: number;
  df2: number;
  p: number;
  partialEtaSquared: number;
  ssBetween: number;
  ssWithin: number;
}

export interface TestFromSummary {
  statistic: number;
  df: number;
  p: number;
}

export interface WelchAnovaFromSummary {
  f: number;
  df1: number;
  df2: number;
  p: number;
}

/** Largest number of groups whose 2^k vertices are enumerated. */
export const MAX_GROUPS = 12;

function validGroups(groups: readonly { n: number }[]): boolean {
  return groups.length >= 2 && groups.length <= MAX_GROUPS && groups.every((g) => Number.isFinite(g.n) && g.n >= 2);
}

/** Weighted spread sum w_i (m_i - m_w)^2 with m_w the weighted mean. */
export function weightedSpread(means: readonly number[], weights: readonly number[]): number {
  let total = 0;
  let weighted = 0;
  for (let i = 0; i < means.length; i++) {
    total += weights[i]!;
    weighted += weights[i]! * means[i]!;
  }
  const centre = weighted / total;
  let spread = 0;
  for (let i = 0; i < means.length; i++) spread += weights[i]! * (means[i]! - centre) ** 2;
  return spread;
}

/** Exact range of the weighted spread of means, each free in its interval (weights fixed and positive). */
export function weightedSpreadRange(means: readonly NumberInterval[], weights: readonly number[]): NumberInterval {
  const k = means.length;
  let high = 0;
  const point = new Array<number>(k);
  for (let mask = 0; mask < 1 << k; mask++) {
    for (let i = 0; i < k; i++) point[i] = (mask >> i) & 1 ? means[i]!.high : means[i]!.low;
    high = Math.max(high, weightedSpread(point, weights));
  }
  // Minimum: m_i = clamp(c), with c the weighted mean of the clamped values (g(c) below is nonincreasing).
  const clamp = (c: number, i: number): number => Math.min(means[i]!.high, Math.max(means[i]!.low, c));
  const g = (c: number): number => {
    let total = 0;
    let weighted = 0;
    for (let i = 0; i < k; i++) {
      total += weights[i]!;
      weighted += weights[i]! * clamp(c, i);
    }
    return weighted / total - c;
  };
  let lo = Math.min(...means.map((m) => m.low));
  let hi = Math.max(...means.map((m) => m.high));
  for (let step = 0; step < 200 && hi - lo > 1e-15 * Math.max(1, Math.abs(hi)); step++) {
    const mid = (lo + hi) / 2;
    if (g(mid) > 0) lo = mid;
    else hi = mid;
  }
  const c = (lo + hi) / 2;
  for (let i = 0; i < k; i++) point[i] = clamp(c, i);
  const low = weightedSpread(point, weights);
  return { low: Math.max(0, Math.min(low, high)), high };
}

/** Classic one-way between-subjects ANOVA from group means, SDs and sizes. */
export function oneWayAnovaFromSummary(groups: readonly GroupSummary[]): AnovaFromSummary | null {
  if (!validGroups(groups) || groups.some((g) => !(g.sd >= 0))) return null;
  const k = groups.length;
  const total = groups.reduce((sum, g) => sum + g.n, 0);
  const ssBetween = weightedSpread(
    groups.map((g) => g.mean),
    groups.map((g) => g.n),
  );
  const ssWithin = groups.reduce((sum, g) => sum + (g.n - 1) * g.sd ** 2, 0);
  const df1 = k - 1;
  const df2 = total - k;
  const f = ssWithin === 0 ? (ssBetween === 0 ? NaN : Infinity) : ssBetween / df1 / (ssWithin / df2);
  const p = fUpperTail(f, df1, df2);
  return { f, df1, df2, p, partialEtaSquared: ssBetween / (ssBetween + ssWithin), ssBetween, ssWithin };
}

/** Range of the classic one-way ANOVA F (and of its p and partial eta squared) over the rounding box. */
export function oneWayAnovaRange(groups: readonly GroupSummaryBox[]): {
  f: NumberInterval;
  p: NumberInterval;
  partialEtaSquared: NumberInterval;
  df1: number;
  df2: number;
} | null {
  if (!validGroups(groups)) return null;
  const k = groups.length;
  const total = groups.reduce((sum, g) => sum + g.n, 0);
  const df1 = k - 1;
  const df2 = total - k;
  const between = weightedSpreadRange(
    groups.map((g) => g.mean),
    groups.map((g) => g.n),
  );
  const withinLow = groups.reduce((sum, g) => sum + (g.n - 1) * Math.max(0, g.sd.low) ** 2, 0);
  const withinHigh = groups.reduce((sum, g) => sum + (g.n - 1) * Math.max(0, g.sd.high) ** 2, 0);
  const ratio = (ssb: number, ssw: number): number => (ssw === 0 ? (ssb === 0 ? 0 : Infinity) : ssb / df1 / (ssw / df2));
  const f = { low: ratio(between.low, withinHigh), high: ratio(between.high, withinLow) };
  const eta = (ssb: number, ssw: number): number => (ssb + ssw === 0 ? 0 : ssb / (ssb + ssw));
  return {
    f,
    p: { low: fUpperTail(f.high, df1, df2), high: fUpperTail(f.low, df1, df2) },
    partialEtaSquared: { low: eta(between.low, withinHigh), high: eta(between.high, withinLow) },
    df1,
    df2,
  };
}

/** Welch's one-way ANOVA from group means, SDs and sizes (every SD must be positive). */
export function welchAnovaFromSummary(groups: readonly GroupSummary[]): WelchAnovaFromSummary | null {
  if (!validGroups(groups) || groups.some((g) => !(g.sd > 0))) return null;
  const k = groups.length;
  const weights = groups.map((g) => g.n / g.sd ** 2);
  const totalWeight = weights.reduce((a, b) => a + b, 0);
  const spread = weightedSpread(
    groups.map((g) => g.mean),
    weights,
  );
  const lambda = groups.reduce((sum, g, i) => sum + (1 - weights[i]! / totalWeight) ** 2 / (g.n - 1), 0);
  const f = spread / (k - 1) / (1 + (2 * (k - 2) * lambda) / (k * k - 1));
  const df2 = (k * k - 1) / (3 * lambda);
  return { f, df1: k - 1, df2, p: fUpperTail(f, k - 1, df2) };
}

/** An outer bound of Welch's F and its df2 over the rounding box (every SD's low end must be positive). */
export function welchAnovaRange(groups: readonly GroupSummaryBox[]): { f: NumberInterval; df2: NumberInterval; p: NumberInterval; df1: number } | null {
  if (!validGroups(groups) || groups.some((g) => !(g.sd.low > 0))) return null;
  const k = groups.length;
  const weightLow = groups.map((g) => g.n / g.sd.high ** 2);
  const weightHigh = groups.map((g) => g.n / g.sd.low ** 2);
  const means = groups.map((g) => g.mean);
  const numeratorLow = weightedSpreadRange(means, weightLow).low;
  const numeratorHigh = weightedSpreadRange(means, weightHigh).high;
  const sumLow = weightLow.reduce((a, b) => a + b, 0);
  const sumHigh = weightHigh.reduce((a, b) => a + b, 0);
  let lambdaLow = 0;
  let lambdaHigh = 0;
  for (let i = 0; i < k; i++) {
    const shareLow = weightLow[i]! / (weightLow[i]! + (sumHigh - weightHigh[i]!));
    const shareHigh = weightHigh[i]! / (weightHigh[i]! + (sumLow - weightLow[i]!));
    const n = groups[i]!.n;
    lambdaLow += (1 - shareHigh) ** 2 / (n - 1);
    lambdaHigh += (1 - shareLow) ** 2 / (n - 1);
  }
  const factor = (2 * (k - 2)) / (k * k - 1);
  const f = {
    low: numeratorLow / (k - 1) / (1 + factor * lambdaHigh),
    high: numeratorHigh / (k - 1) / (1 + factor * lambdaLow),
  };
  const df2 = { low: (k * k - 1) / (3 * lambdaHigh), high: lambdaLow === 0 ? Infinity : (k * k - 1) / (3 * lambdaLow) };
  const ps = [f.low, f.high].flatMap((value) => [df2.low, df2.high].map((d) => fUpperTail(value, k - 1, d))).filter((p) => !Number.isNaN(p));
  return { f, df2, p: { low: Math.min(...ps), high: Math.max(...ps) }, df1: k - 1 };
}

export interface BrownForsytheAnovaFromSummary extends WelchAnovaFromSummary {
  /** Mehrotra's (1997) df1, fractional; df1 is Brown and Forsythe's k - 1. */
  mehrotraDf1: number;
}

/** Brown-Forsythe's one-way ANOVA for unequal variances from group means, SDs and sizes (some SD positive). */
export function brownForsytheAnovaFromSummary(groups: readonly GroupSummary[]): BrownForsytheAnovaFromSummary | null {
  if (!validGroups(groups) || groups.some((g) => !(g.sd >= 0)) || groups.every((g) => g.sd === 0)) return null;
  const k = groups.length;
  const total = groups.reduce((sum, g) => sum + g.n, 0);
  const ssBetween = weightedSpread(
    groups.map((g) => g.mean),
    groups.map((g) => g.n),
  );
  const parts = groups.map((g) => (1 - g.n / total) * g.sd ** 2);
  const denominator = parts.reduce((a, b) => a + b, 0);
  const f = ssBetween / denominator;
  const df2 = brownForsytheDf2(parts, groups);
  const sumFourth = groups.reduce((sum, g) => sum + g.sd ** 4, 0);
  const weightedSquares = groups.reduce((sum, g) => sum + (g.n / total) * g.sd ** 2, 0);
  const weightedFourth = groups.reduce((sum, g) => sum + (g.n / total) * g.sd ** 4, 0);
  const mehrotraDf1 = denominator ** 2 / (sumFourth + weightedSquares ** 2 - 2 * weightedFourth);
  return { f, df1: k - 1, df2, p: fUpperTail(f, k - 1, df2), mehrotraDf1 };
}

/** Satterthwaite's df of D = sum c_i, c_i = (1 - n_i / N) s_i^2. */
function brownForsytheDf2(parts: readonly number[], groups: readonly { n: number }[]): number {
  const sum = parts.reduce((a, b) => a + b, 0);
  const squares = parts.reduce((acc, c, i) => acc + (c * c) / (groups[i]!.n - 1), 0);
  return (sum * sum) / squares;
}

/** Range of Brown-Forsythe's F* (exact) and an outer bound of its df2 and p over the rounding box. */
export function brownForsytheAnovaRange(groups: readonly GroupSummaryBox[]): { f: NumberInterval; df2: NumberInterval; p: NumberInterval; df1: number } | null {
  if (!validGroups(groups) || groups.every((g) => !(g.sd.high > 0))) return null;
  const k = groups.length;
  const total = groups.reduce((sum, g) => sum + g.n, 0);
  const between = weightedSpreadRange(
    groups.map((g) => g.mean),
    groups.map((g) => g.n),
  );
  const partsLow = groups.map((g) => (1 - g.n / total) * Math.max(0, g.sd.low) ** 2);
  const partsHigh = groups.map((g) => (1 - g.n / total) * g.sd.high ** 2);
  const denominatorLow = partsLow.reduce((a, b) => a + b, 0);
  const denominatorHigh = partsHigh.reduce((a, b) => a + b, 0);
  const f = { low: between.low / denominatorHigh, high: denominatorLow === 0 ? (between.high === 0 ? 0 : Infinity) : between.high / denominatorLow };
  let df2Low = Infinity;
  const vertex = new Array<number>(k);
  for (let mask = 0; mask < 1 << k; mask++) {
    for (let i = 0; i < k; i++) vertex[i] = (mask >> i) & 1 ? partsHigh[i]! : partsLow[i]!;
    if (vertex.some((c) => c > 0)) df2Low = Math.min(df2Low, brownForsytheDf2(vertex, groups));
  }
  const squaresLow = partsLow.reduce((acc, c, i) => acc + (c * c) / (groups[i]!.n - 1), 0);
  const df2High = Math.min(total - k, squaresLow === 0 ? Infinity : denominatorHigh ** 2 / squaresLow);
  const df2 = { low: df2Low, high: Math.max(df2Low, df2High) };
  const ps = [f.low, f.high].flatMap((value) => [df2.low, df2.high].map((d) => fUpperTail(value, k - 1, d))).filter((p) => !Number.isNaN(p));
  return { f, df2, p: { low: Math.min(...ps), high: Math.max(...ps) }, df1: k - 1 };
}

/** Student's independent-samples t (pooled variance), group 1 minus group 2. */
export function studentTFromSummary(first: GroupSummary, second: GroupSummary): TestFromSummary | null {
  if (!validGroups([first, second]) || !(first.sd >= 0) || !(second.sd >= 0)) return null;
  const df = first.n + second.n - 2;
  const pooled = ((first.n - 1) * first.sd ** 2 + (second.n - 1) * second.sd ** 2) / df;
  const statistic = (first.mean - second.mean) / Math.sqrt(pooled * (1 / first.n + 1 / second.n));
  return { statistic, df, p: tTwoTailed(statistic, df) };
}

/** Welch-Satterthwaite df for two groups. */
export function welchDf(firstSd: number, firstN: number, secondSd: number, secondN: number): number {
  const a = firstSd ** 2 / firstN;
  const b = secondSd ** 2 / secondN;
  return (a + b) ** 2 / (a ** 2 / (firstN - 1) + b ** 2 / (secondN - 1));
}

/** Welch's independent-samples t with the Welch-Satterthwaite df, group 1 minus group 2. */
export function welchTFromSummary(first: GroupSummary, second: GroupSummary): TestFromSummary | null {
  if (!validGroups([first, second]) || !(first.sd > 0) || !(second.sd > 0)) return null;
  const statistic = (first.mean - second.mean) / Math.sqrt(first.sd ** 2 / first.n + second.sd ** 2 / second.n);
  const df = welchDf(first.sd, first.n, second.sd, second.n);
  return { statistic, df, p: tTwoTailed(statistic, df) };
}

/** Range of |m1 - m2| over two mean intervals. */
function absoluteDifferenceRange(first: NumberInterval, second: NumberInterval): NumberInterval {
  const low = first.low - second.high;
  const high = first.high - second.low;
  const smallest = low <= 0 && high >= 0 ? 0 : Math.min(Math.abs(low), Math.abs(high));
  return { low: smallest, high: Math.max(Math.abs(low), Math.abs(high)) };
}

/** Exact range of |t| (Student's or Welch's) and its two-tailed p over the rounding box; Welch's df range too. */
export function independentTRange(
  first: GroupSummaryBox,
  second: GroupSummaryBox,
  variant: 'student' | 'welch',
): { t: NumberInterval; df: NumberInterval; p: NumberInterval } | null {
  if (!validGroups([first, second])) return null;
  if (variant === 'welch' && !(first.sd.low > 0 && second.sd.low > 0)) return null;
  const difference = absoluteDifferenceRange(first.mean, second.mean);
  const scale = (s1: number, s2: number): number =>
    variant === 'student'
      ? Math.sqrt((((first.n - 1) * s1 ** 2 + (second.n - 1) * s2 ** 2) / (first.n + second.n - 2)) * (1 / first.n + 1 / second.n))
      : Math.sqrt(s1 ** 2 / first.n + s2 ** 2 / second.n);
  const smallestScale = scale(Math.max(0, first.sd.low), Math.max(0, second.sd.low));
  const largestScale = scale(first.sd.high, second.sd.high);
  const t = {
    low: largestScale === 0 ? (difference.low === 0 ? 0 : Infinity) : difference.low / largestScale,
    high: smallestScale === 0 ? (difference.high === 0 ? 0 : Infinity) : difference.high / smallestScale,
  };
  let df: NumberInterval;
  if (variant === 'student') {
    df = { low: first.n + second.n - 2, high: first.n + second.n - 2 };
  } else {
    // df depends on r = a/b only; it rises to r* = (n1 - 1)/(n2 - 1) and falls after.
    const ofRatio = (r: number): number => (r + 1) ** 2 / (r ** 2 / (first.n - 1) + 1 / (second.n - 1));
    const rLow = first.sd.low ** 2 / first.n / (second.sd.high ** 2 / second.n);
    const rHigh = first.sd.high ** 2 / first.n / (second.sd.low ** 2 / second.n);
    const peak = (first.n - 1) / (second.n - 1);
    const ends = [ofRatio(rLow), ofRatio(rHigh)];
    df = { low: Math.min(...ends), high: peak >= rLow && peak <= rHigh ? ofRatio(peak) : Math.max(...ends) };
  }
  const ps = [t.low, t.high].flatMap((value) => [df.low, df.high].map((d) => tTwoTailed(value, d))).filter((p) => !Number.isNaN(p));
  return { t, df, p: { low: Math.min(...ps), high: Math.max(...ps) } };
}
