import { zUpperTail } from './normalDistribution.js';

/**
 * Two-tailed p-values for Spearman's rank correlation rho of n untied
 * ranks, the way R's cor.test computes them (SPSS, Stata and SciPy use the t
 * approximation of rTwoTailed with df = n - 2 instead; plumbline accepts
 * both conventions, see checks/recompute.ts).
 *
 * ## Method
 * S = sum (i - pi(i))^2 and rho = 1 - 6 S / (n^3 - n). For n <= 9 the exact
 * permutation distribution of S is counted over all n! rankings (here by
 * dynamic programming over the set of values already placed, so each n is
 * counted once). For 10 <= n <= 1290, the Edgeworth series of algorithm
 * AS 89 approximates P(S >= s). The two-tailed p is 2 P(S <= s) for rho >= 0
 * and 2 P(S >= s) for rho < 0, at most 1; S is moved by the continuity
 * steps R uses (s + 2 in the lower tail, s - 1 in the upper).
 *
 * ## References
 * - Best, D. J. & Roberts, D. E. (1975). Algorithm AS 89: The upper tail
 *   probabilities of Spearman's rho. Applied Statistics 24(3), 377-379. The
 *   series' twelve coefficients are quoted from memory of R's prho.c; the
 *   tests compare the series with the exact distribution for n = 10..14.
 * - R Core Team, cor.test (method = "spearman"): exact for n < 1290 without
 *   ties (n <= 9 counted, larger n by AS 89), else the t approximation.
 */

/** Largest n whose distribution is counted exactly, as in R. */
const EXACT_UP_TO = 9;
/** Largest n R evaluates with AS 89; beyond it R uses the t approximation. */
export const SPEARMAN_SERIES_UP_TO = 1290;

const exactCounts = new Map<number, Float64Array>();

/** counts[s] = number of rankings of n items with S = s (n <= EXACT_UP_TO). */
function countsOfS(n: number): Float64Array {
  const cached = exactCounts.get(n);
  if (cached) return cached;
  const sMax = (n * n * n - n) / 3;
  // layer.get(mask) = distribution of the partial S over the positions filled so far, given the values used (mask).
  let layer = new Map<number, Float64Array>([[0, Float64Array.from({ length: sMax + 1 }, (_, s) => (s === 0 ? 1 : 0))]]);
  for (let position = 0; position < n; position++) {
    const next = new Map<number, Float64Array>();
    for (const [mask, distribution] of layer) {
      for (let value = 0; value < n; value++) {
        if (mask & (1 << value)) continue;
        const step = (position - value) ** 2;
        const key = mask | (1 << value);
        let target = next.get(key);
        if (!target) next.set(key, (target = new Float64Array(sMax + 1)));
        for (let s = 0; s + step <= sMax; s++) target[s + step]! += distribution[s]!;
      }
    }
    layer = next;
  }
  const [counts] = layer.values();
  exactCounts.set(n, counts!);
  return counts!;
}

/** The exact share of rankings of n items with S in [from, to] (n <= EXACT_UP_TO). */
function exactShare(n: number, from: number, to: number): number {
  const counts = countsOfS(n);
  let inside = 0;
  let total = 0;
  for (let value = 0; value < counts.length; value++) {
    total += counts[value]!;
    if (value >= from && value <= to) inside += counts[value]!;
  }
  return inside / total;
}

/** AS 89: P(S >= s) by an Edgeworth series in x = standardised rho, for n > 9. */
function edgeworthUpperTail(s: number, n: number): number {
  if (s <= 0) return 1;
  if (s > (n * n * n - n) / 3) return 0;
  const c1 = 0.2274;
  const c2 = 0.2531;
  const c3 = 0.1745;
  const c4 = 0.0758;
  const c5 = 0.1033;
  const c6 = 0.3932;
  const c7 = 0.0879;
  const c8 = 0.0151;
  const c9 = 0.0072;
  const c10 = 0.0831;
  const c11 = 0.0131;
  const c12 = 4.6e-4;
  const b = 1 / n;
  const x = ((6 * (s - 1) * b) / (n * n - 1) - 1) * Math.sqrt(1 / b - 1);
  let y = x * x;
  const u = x * b * (c1 + b * (c2 + c3 * b) + y * (-c4 + b * (c5 + c6 * b) - y * b * (c7 + c8 * b - y * (c9 - c10 * b + y * b * (c11 - c12 * y)))));
  y = u / Math.exp(y / 2);
  return Math.min(1, Math.max(0, y + zUpperTail(x)));
}

/**
 * How the upper tail P(S >= s) of a negative rho is evaluated: 'midpoint'
 * puts the series' continuity correction halfway between the even values of
 * S (symmetric with the lower tail, closest to the exact distribution);
 * 'shifted' evaluates P(S >= s - 1), as R's cor.test is remembered to call
 * it, which moves the series one unit of S. Exact counts are the same.
 */
export type SpearmanUpperStep = 'midpoint' | 'shifted';

/**
 * Two-tailed p of Spearman's rho for n untied ranks, the exact or AS 89 way
 * of R's cor.test (n from 3 to 1290; NaN outside, where R uses the t
 * approximation).
 */
export function spearmanTwoTailed(rho: number, n: number, upperStep: SpearmanUpperStep = 'midpoint'): number {
  if (!(Math.abs(rho) <= 1) || !Number.isInteger(n) || n < 3 || n > SPEARMAN_SERIES_UP_TO) return NaN;
  const scale = (n * n * n - n) / 6;
  const s = Math.round(scale * (1 - rho)); // S from rho (even for untied ranks; a rounded rho may give an odd one)
  let oneTail: number;
  if (n <= EXACT_UP_TO) {
    oneTail = s <= scale ? exactShare(n, 0, s) : exactShare(n, s, Infinity);
  } else {
    // P(S <= s) = 1 - P(S >= s + 2) when rho >= 0, else P(S >= s) (or s - 1, the shifted step).
    oneTail = s <= scale ? 1 - edgeworthUpperTail(s + 2, n) : edgeworthUpperTail(upperStep === 'midpoint' ? s : s - 1, n);
  }
  return Math.min(1, 2 * oneTail);
}
