import { tTwoTailed, tUpperTail } from '../stats/tDistribution.js';
import { RefitError } from './errors.js';
import type { FittedModel } from './model.js';
import { tQuantileUpper } from '../stats/quantiles.js';
import { adjustedPValues, criticalMultiplier, holmAdjusted, type PostHocMethod } from '../stats/postHoc.js';

/**
 * Estimated marginal means, pairwise comparisons and planned contrasts.
 *
 * ## Method
 * Reference grid: every combination of the levels of the requested factors;
 * the other factors in the model are averaged over their levels with equal
 * weights, or (weights: 'proportional') with weights proportional to the
 * analysed rows of each combination of their levels, and covariates are held at their overall means (products of
 * covariates at the product of the means), or at values the caller gives
 * (`at`). A marginal mean is L'b, where L
 * is the average design row over the grid points that share the requested
 * levels and b the least-squares coefficients, with standard error
 * sqrt(MSE L'(X'X)^{-1}L) computed as ||R^{-T} L|| from the triangular
 * factor (no inverse is formed) and the residual degrees of freedom.
 * Comparisons and contrasts are the same linear functions of b with L
 * replaced by differences or weighted sums of the means' L vectors.
 * Adjustments: Bonferroni (p m, capped at 1), Holm (step-down, monotone),
 * Tukey (studentized range with k = number of means, Tukey-Kramer for
 * unequal precision: p = P(Q > |t| sqrt 2)), Šidák (p = 1 - (1 - p)^m,
 * computed as -expm1(m log1p(-p)); intervals at the per-comparison level
 * 1 - level^(1/m)) and Scheffé (p = P(F(k - 1, df) > t^2 / (k - 1)), the
 * family being every contrast of the k means; intervals with the critical
 * value sqrt((k - 1) F(level; k - 1, df))).
 *
 * ## References
 * - Searle, S. R., Speed, F. M. & Milliken, G. A. (1980). Population
 *   marginal means in the linear model: an alternative to least squares
 *   means. The American Statistician 34(4), 216-221.
 * - Holm, S. (1979). A simple sequentially rejective multiple test
 *   procedure. Scandinavian Journal of Statistics 6(2), 65-70.
 * - Kramer, C. Y. (1956). Extension of multiple range tests to group means
 *   with unequal numbers of replications. Biometrics 12(3), 307-310.
 * - Šidák, Z. (1967). Rectangular confidence regions for the means of
 *   multivariate normal distributions. Journal of the American Statistical
 *   Association 62(318), 626-633.
 * - Scheffé, H. (1953). A method for judging all contrasts in the analysis
 *   of variance. Biometrika 40(1-2), 87-104.
 */

export interface MarginalMean {
  /**
   * Level code of each requested factor, by factor name; an object without a
   * prototype, so a factor named "constructor" or "__proto__" is a key like any other.
   */
  levels: Record<string, string>;
  /** e.g. "group=hi, dose=2" (labels from the description when given). */
  label: string;
  emmean: number;
  se: number;
  df: number;
  lower: number;
  upper: number;
}

export type Adjustment = 'none' | 'bonferroni' | 'holm' | 'tukey' | 'sidak' | 'scheffe';

/** Every adjustment, in the order the help lists them. */
export const ADJUSTMENTS: readonly Adjustment[] = ['tukey', 'bonferroni', 'holm', 'sidak', 'scheffe', 'none'];

export interface PairwiseComparison {
  contrast: string;
  estimate: number;
  se: number;
  df: number;
  t: number;
  /** Adjusted p (the unadjusted one when adjust is "none"). */
  p: number;
  pUnadjusted: number;
  lower: number;
  upper: number;
}

export type Alternative = 'two-sided' | 'greater' | 'less';

export interface ContrastResult {
  weights: number[];
  estimate: number;
  se: number;
  df: number;
  t: number;
  p: number;
  alternative: Alternative;
  lower: number;
  upper: number;
}

interface GridMean {
  levels: number[];
  l: Float64Array;
  label: string;
  /** The level code of each factor of the grid, in the order the factors were named. */
  codes: string[];
  /** The factors' names, in the same order. */
  names: string[];
}

function factorSlots(model: FittedModel, factors: string | readonly string[]): number[] {
  const names = typeof factors === 'string' ? factors.split(':') : [...factors];
  if (names.length === 0) throw new RefitError('INVALID_CONTRAST', 'Name at least one factor for marginal means.');
  return names.map((name) => {
    const slot = model.factorVars.findIndex((v) => v.name === name);
    if (slot < 0 && model.numericVars.slice(0, -1).some((v) => v.name === name)) {
      throw new RefitError(
        'INVALID_CONTRAST',
        `Marginal means: '${name}' is a covariate, not a factor; means are given per level of a factor, with covariates held at their means (factors: ${model.factorVars.map((v) => v.name).join(', ') || 'none'}).`,
        { column: name },
      );
    }
    if (slot < 0) {
      throw new RefitError(
        'INVALID_CONTRAST',
        `Marginal means: '${name}' is not a factor of the model (factors: ${model.factorVars.map((v) => v.name).join(', ') || 'none'}).`,
        { column: name },
      );
    }
    return slot;
  });
}

/** Iterates over all level combinations of the given factor slots, first slot fastest (callers reverse it for reading order). */
function combinations(sizes: number[], visit: (idx: number[]) => void): void {
  const idx = new Array<number>(sizes.length).fill(0);
  for (;;) {
    visit(idx.slice());
    let k = 0;
    while (k < idx.length && ++idx[k]! === sizes[k]!) idx[k++] = 0;
    if (k === idx.length) return;
  }
}

/** Where covariates are held, by name; those not named stay at their means. */
export type CovariateValues = Readonly<Record<string, number>> | ReadonlyMap<string, number>;

/** The numeric predictors' values of the reference grid: each covariate's mean unless `at` gives it a value. */
export function covariateValues(model: FittedModel, at: CovariateValues | undefined): number[] {
  const given = at instanceof Map ? at : new Map(Object.entries((at ?? {}) as Record<string, number>));
  const covariates = model.numericVars.slice(0, -1).map((v) => v.name);
  for (const [name, value] of given) {
    if (!covariates.includes(name)) {
      throw new RefitError(
        'INVALID_CONTRAST',
        `Covariate value "${name}=${value}": '${name}' is not a covariate of the model (covariates: ${covariates.join(', ') || 'none'}).`,
        { column: name, field: 'at' },
      );
    }
    if (!Number.isFinite(value)) throw new RefitError('INVALID_CONTRAST', `Covariate value for '${name}' must be a finite number.`, { column: name, field: 'at' });
  }
  return model.numericMeans.map((mean, slot) => given.get(model.numericVars[slot]!.name) ?? mean);
}

/**
 * How the levels of the factors a mean averages over are weighted: equally
 * (each combination of their levels counts the same), or in proportion to
 * the analysed rows that have each combination.
 */
export type CellWeights = 'equal' | 'proportional';

/** Where the reference grid is set: covariate values and the weights of the factors averaged over. */
export interface GridOptions {
  at?: CovariateValues;
  weights?: CellWeights;
}

/** Analysed rows per combination of the levels of the factor slots `others` (key: their level indices joined by ","). */
function rowsByCombination(model: FittedModel, others: readonly number[]): Map<string, number> {
  const counts = new Map<string, number>();
  for (const cell of model.cells) {
    const key = others.map((s) => cell.levels[s]).join(',');
    counts.set(key, (counts.get(key) ?? 0) + cell.n);
  }
  return counts;
}

function gridMeans(model: FittedModel, slots: number[], grid: GridOptions = {}): GridMean[] {
  const others = model.factorVars.map((_, i) => i).filter((i) => !slots.includes(i));
  const out: GridMean[] = [];
  const p = model.columns.length;
  const numericValues = covariateValues(model, grid.at);
  const counts = grid.weights === 'proportional' ? rowsByCombination(model, others) : null;
  // The grid in reading order: the first named factor varies slowest ("lo, 1", "lo, 2", "mid, 1", ...).
  combinations(
    slots.map((s) => model.factorVars[s]!.levels.length).reverse(),
    (reversed) => {
      const target = reversed.reverse();
      const l = new Float64Array(p);
      let count = 0;
      combinations(
        others.map((s) => model.factorVars[s]!.levels.length),
        (rest) => {
          const levels = new Array<number>(model.factorVars.length).fill(0);
          slots.forEach((s, i) => (levels[s] = target[i]!));
          others.forEach((s, i) => (levels[s] = rest[i]!));
          const w = counts === null ? 1 : (counts.get(rest.join(',')) ?? 0);
          if (w === 0) return;
          const x = model.designRow(levels, numericValues);
          for (let j = 0; j < p; j++) l[j] = l[j]! + w * x[j]!;
          count += w;
        },
      );
      for (let j = 0; j < p; j++) l[j] = l[j]! / count;
      const codes = slots.map((s, i) => model.factorVars[s]!.levels[target[i]!]!);
      const parts = slots.map((s, i) => {
        const v = model.factorVars[s]!;
        return `${v.name}=${v.labels.get(codes[i]!) ?? codes[i]!}`;
      });
      out.push({ levels: target, l, label: parts.join(', '), codes, names: slots.map((s) => model.factorVars[s]!.name) });
    },
  );
  return out;
}

function linear(model: FittedModel, beta: Float64Array, l: Float64Array): { estimate: number; se: number } {
  let est = 0;
  for (let j = 0; j < l.length; j++) est += l[j]! * beta[j]!;
  const mse = model.residualSS / model.residualDf;
  return { estimate: est, se: Math.sqrt(mse * model.unscaledVariance(l)) };
}

/** Estimated marginal means of one factor or a combination ("a:b" or ["a", "b"]). */
export function marginalMeans(model: FittedModel, factors: string | readonly string[], options: { level?: number } & GridOptions = {}): MarginalMean[] {
  const level = options.level ?? 0.95;
  const beta = model.coefficients();
  const df = model.residualDf;
  const tCrit = tQuantileUpper((1 - level) / 2, df);
  return gridMeans(model, factorSlots(model, factors), options).map((g) => {
    const { estimate, se } = linear(model, beta, g.l);
    const emmean = estimate + model.outcomeOrigin;
    const levels: Record<string, string> = Object.create(null) as Record<string, string>;
    g.names.forEach((name, i) => (levels[name] = g.codes[i]!));
    return { levels, label: g.label, emmean, se, df, lower: emmean - tCrit * se, upper: emmean + tCrit * se };
  });
}

/** Holm's step-down adjustment (monotone, capped at 1): src/stats/postHoc.ts' holmAdjusted, kept under refit's name. */
export const holmAdjust = holmAdjusted;

/** All pairwise differences of the marginal means (first minus second, in grid order). */
export function pairwiseComparisons(
  model: FittedModel,
  factors: string | readonly string[],
  options: { adjust?: Adjustment; level?: number } & GridOptions = {},
): PairwiseComparison[] {
  return comparePairs(model, gridMeans(model, factorSlots(model, factors), options), options.adjust ?? 'holm', options.level ?? 0.95);
}

export interface SimpleComparisons {
  /** The factor within whose level the comparisons are made, the level's code and its label. */
  within: { factor: string; level: string; label: string };
  /** Marginal means of `factors` at this level of the within factor. */
  means: MarginalMean[];
  /** Their pairwise comparisons, adjusted within this family (one per level of the within factor). */
  comparisons: PairwiseComparison[];
}

/**
 * Simple effects: pairwise comparisons of the means of `factors` within
 * each level of the factor `within` (the cell means of factors x within,
 * other factors averaged with equal weights). Each level of `within` is a
 * family of its own: the adjustment counts its comparisons (Bonferroni,
 * Holm, Šidák) or its means (Tukey, Scheffé) only.
 */
export function simpleComparisons(
  model: FittedModel,
  factors: string | readonly string[],
  within: string,
  options: { adjust?: Adjustment; level?: number } & GridOptions = {},
): SimpleComparisons[] {
  const level = options.level ?? 0.95;
  const slots = factorSlots(model, factors);
  const [withinSlot] = factorSlots(model, [within]);
  if (slots.includes(withinSlot!)) {
    throw new RefitError('INVALID_CONTRAST', `Simple comparisons within '${within}': the means compared must not include '${within}' itself.`, { column: within });
  }
  // The within factor first, so it varies slowest: each of its levels is one consecutive block.
  const grid = gridMeans(model, [withinSlot!, ...slots], options);
  const v = model.factorVars[withinSlot!]!;
  const size = grid.length / v.levels.length;
  const beta = model.coefficients();
  const tCrit = tQuantileUpper((1 - level) / 2, model.residualDf);
  return v.levels.map((code, index) => {
    const labelOf = (g: GridMean) =>
      g.names
        .slice(1)
        .map((name, i) => `${name}=${model.factorVars[slots[i]!]!.labels.get(g.codes[i + 1]!) ?? g.codes[i + 1]!}`)
        .join(', ');
    const block = grid.slice(index * size, (index + 1) * size).map((g) => ({ ...g, label: labelOf(g) }));
    const means = block.map((g) => {
      const { estimate, se } = linear(model, beta, g.l);
      const emmean = estimate + model.outcomeOrigin;
      const levels: Record<string, string> = Object.create(null) as Record<string, string>;
      g.names.forEach((name, i) => (levels[name] = g.codes[i]!));
      return { levels, label: g.label, emmean, se, df: model.residualDf, lower: emmean - tCrit * se, upper: emmean + tCrit * se };
    });
    return {
      within: { factor: v.name, level: code, label: v.labels.get(code) ?? code },
      means,
      comparisons: comparePairs(model, block, options.adjust ?? 'holm', level),
    };
  });
}

/** Every pairwise difference of the given means (first minus second, in their order), adjusted as one family. */
function comparePairs(model: FittedModel, means: readonly GridMean[], adjust: Adjustment, level: number): PairwiseComparison[] {
  const beta = model.coefficients();
  const df = model.residualDf;
  const k = means.length;
  const rows: Array<Omit<PairwiseComparison, 'p' | 'lower' | 'upper'>> = [];
  for (let i = 0; i < k; i++) {
    for (let j = i + 1; j < k; j++) {
      const l = means[i]!.l.map((v, c) => v - means[j]!.l[c]!);
      const { estimate, se } = linear(model, beta, l);
      const t = estimate / se;
      rows.push({ contrast: `${means[i]!.label} - ${means[j]!.label}`, estimate, se, df, t, pUnadjusted: tTwoTailed(t, df) });
    }
  }
  if (!ADJUSTMENTS.includes(adjust)) {
    throw new RefitError('INVALID_CONTRAST', `Unknown adjustment "${String(adjust)}"; use one of ${ADJUSTMENTS.join(', ')}.`);
  }
  // One implementation with the post-hoc tests from group means (src/stats/postHoc.ts): "none" is Fisher's LSD there.
  const method: PostHocMethod = adjust === 'none' ? 'lsd' : adjust;
  const adjusted = adjustedPValues(method, rows, k, df);
  const crit = criticalMultiplier(method, level, k, rows.length, df);
  return rows.map((r, i) => ({ ...r, p: adjusted[i]!, lower: r.estimate - crit * r.se, upper: r.estimate + crit * r.se }));
}

/**
 * A planned contrast of the marginal means of `factors`: weights in grid
 * order (an array; the first factor's levels vary slowest, as marginalMeans lists them) or by level code / label (an object). Weights must sum to
 * zero. One-sided tests: "greater" tests estimate > 0, "less" estimate < 0.
 */
export function plannedContrast(
  model: FittedModel,
  factors: string | readonly string[],
  weights: readonly number[] | Record<string, number>,
  options: { alternative?: Alternative; level?: number } & GridOptions = {},
): ContrastResult {
  const alternative = options.alternative ?? 'two-sided';
  const level = options.level ?? 0.95;
  const means = gridMeans(model, factorSlots(model, factors), options);
  let w: number[];
  if (Array.isArray(weights)) {
    w = [...(weights as readonly number[])];
  } else {
    // Keys are level codes or labels, which may be any text ("constructor"): only the object's own keys count.
    const byKey = new Map(Object.entries(weights as Record<string, number>));
    const keyOf = (g: GridMean) => g.codes.join(':');
    const labelOf = (g: GridMean) => g.label.replace(/^[^=]+=/, '');
    for (const key of byKey.keys()) {
      if (!means.some((g) => keyOf(g) === key || labelOf(g) === key || g.label === key)) {
        throw new RefitError('INVALID_CONTRAST', `Contrast weight for "${key}": no such level (levels: ${means.map(keyOf).join(', ')}).`);
      }
    }
    w = means.map((g) => byKey.get(keyOf(g)) ?? byKey.get(labelOf(g)) ?? byKey.get(g.label) ?? 0);
  }
  if (w.length !== means.length) {
    throw new RefitError('INVALID_CONTRAST', `The contrast on ${means[0]!.names.join(':')} has ${w.length} weight${w.length === 1 ? '' : 's'}, but there are ${means.length} means, one weight for each in this order: ${means.map((g) => g.label).join('; ')}.`);
  }
  if (w.some((x) => !Number.isFinite(x)) || w.every((x) => x === 0)) {
    throw new RefitError('INVALID_CONTRAST', 'Contrast weights must be finite numbers, not all zero.');
  }
  const sum = w.reduce((a, b) => a + b, 0);
  const scale = w.reduce((a, b) => a + Math.abs(b), 0);
  if (Math.abs(sum) > 1e-10 * scale) {
    throw new RefitError('INVALID_CONTRAST', `The contrast weights on ${means[0]!.names.join(':')} must sum to zero (they sum to ${sum}); adjust them, e.g. [1, -0.5, -0.5].`);
  }
  const p = model.columns.length;
  const l = new Float64Array(p);
  means.forEach((g, i) => {
    for (let j = 0; j < p; j++) l[j] = l[j]! + w[i]! * g.l[j]!;
  });
  const { estimate, se } = linear(model, model.coefficients(), l);
  const df = model.residualDf;
  const t = estimate / se;
  let pValue: number;
  let lower: number;
  let upper: number;
  if (alternative === 'two-sided') {
    pValue = tTwoTailed(t, df);
    const c = tQuantileUpper((1 - level) / 2, df);
    lower = estimate - c * se;
    upper = estimate + c * se;
  } else {
    const c = tQuantileUpper(1 - level, df);
    if (alternative === 'greater') {
      pValue = tUpperTail(t, df);
      lower = estimate - c * se;
      upper = Infinity;
    } else {
      pValue = tUpperTail(-t, df);
      lower = -Infinity;
      upper = estimate + c * se;
    }
  }
  return { weights: w, estimate, se, df, t, p: pValue, alternative, lower, upper };
}
