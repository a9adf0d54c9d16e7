import { fUpperTail } from '../stats/fDistribution.js';
import { tTwoTailed } from '../stats/tDistribution.js';
import { tQuantileUpper } from '../stats/quantiles.js';
import { RefitError } from './errors.js';
import type { FittedModel } from './model.js';

/**
 * What is printed next to an ANOVA table: the model's R² and adjusted R²,
 * the unadjusted descriptives of every cell of the factors, and Levene's
 * test of equal variances across those cells.
 *
 * ## Method
 * R²: 1 - SS_residual / SS_total, SS_total the outcome's sum of squares
 * about its mean, read from the factor R of [X y] as the squared entries of
 * y's column below the intercept's row (R is an orthogonal transform of
 * [X y] and its first row is the intercept's). Adjusted R²: 1 - (SS_residual
 * / df_residual) / (SS_total / (N - 1)).
 *
 * Cell descriptives: from each cell's triangular factor of [1, ..., y]
 * (accumulate.ts): n, the mean R[0][y] / R[0][0] (plus the outcome's
 * origin) and the sum of squares about the mean as the squared entries of
 * y's column below the first row; SD with n - 1 in the denominator.
 *
 * Levene's test: the absolute deviations z = |y - centre of its cell|
 * (centre the cell's median, Brown and Forsythe's variant, or its mean,
 * Levene's), then the one-way ANOVA F of z across the cells:
 * F = ((N - k) / (k - 1)) sum n_i (zbar_i - zbar)^2 / sum sum (z_ij - zbar_i)^2,
 * on k - 1 and N - k degrees of freedom. It needs the outcome values, kept
 * when the model is fitted with keepOutcome.
 *
 * Coefficients: b = R^{-1} (Q'y) from the same factor, SE = sqrt(MSE
 * e_j'(X'X)^{-1}e_j), t on the residual df. Covariate main-effect columns
 * are fitted measured from an origin (model.ts); the intercept printed is
 * the one of the covariates' raw values, b_0 + origin_y - sum_j b_j o_j,
 * with its SE from the same linear function.
 *
 * ## References
 * - Levene, H. (1960). Robust tests for equality of variances. In I. Olkin
 *   (Ed.), Contributions to Probability and Statistics (pp. 278-292).
 *   Stanford University Press.
 * - Brown, M. B. & Forsythe, A. B. (1974). Robust tests for the equality of
 *   variances. Journal of the American Statistical Association 69(346),
 *   364-367.
 * - Golub, G. H. & Van Loan, C. F. (2013). Matrix Computations, 4th ed.,
 *   section 5.3 (least squares by QR).
 */

export interface ModelFit {
  rSquared: number;
  adjustedRSquared: number;
  /** Sum of squares of the outcome about its mean. */
  totalSS: number;
}

export function modelFit(model: FittedModel): ModelFit {
  const p = model.columns.length;
  const r = model.rAug.data;
  let totalSS = 0;
  for (let i = 1; i <= p; i++) {
    const v = r[i * (p + 1) + p]!;
    totalSS += v * v;
  }
  const rSquared = 1 - model.residualSS / totalSS;
  const adjustedRSquared = 1 - model.residualSS / model.residualDf / (totalSS / (model.n - 1));
  return { rSquared, adjustedRSquared, totalSS };
}

export interface CellDescriptive {
  /** Level code of each factor, in factor order (model.factorVars). */
  levels: string[];
  /** "lo, 2" with labels where the description gives them; "all rows" without factors. */
  label: string;
  n: number;
  mean: number;
  /** Sample SD (n - 1); NaN for a cell of one row. */
  sd: number;
}

function cellLabel(model: FittedModel, levels: Int32Array): { codes: string[]; label: string } {
  const codes = model.factorVars.map((v, slot) => v.levels[levels[slot]!]!);
  const label = codes.length === 0 ? 'all rows' : codes.map((c, slot) => model.factorVars[slot]!.labels.get(c) ?? c).join(', ');
  return { codes, label };
}

/** Unadjusted n, mean and SD of the outcome in every cell of the factors (first factor slowest). */
export function cellDescriptives(model: FittedModel): CellDescriptive[] {
  return model.cells.map((cell) => {
    const q = Math.round(Math.sqrt(cell.r.length));
    const y = q - 1;
    const mean = model.outcomeOrigin + cell.r[y]! / cell.r[0]!;
    let ss = 0;
    for (let i = 1; i < q; i++) ss += cell.r[i * q + y]! ** 2;
    const { codes, label } = cellLabel(model, cell.levels);
    return { levels: codes, label, n: cell.n, mean, sd: cell.n > 1 ? Math.sqrt(ss / (cell.n - 1)) : NaN };
  });
}

export type LeveneCenter = 'median' | 'mean';

export interface LeveneTest {
  center: LeveneCenter;
  /** Number of groups (cells of the factors). */
  groups: number;
  F: number;
  df1: number;
  df2: number;
  p: number;
}

function median(values: readonly number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 === 1 ? s[mid]! : (s[mid - 1]! + s[mid]!) / 2;
}

/** Levene's test across the cells of the factors (the model must be fitted with keepOutcome). */
export function leveneTest(model: FittedModel, center: LeveneCenter = 'median'): LeveneTest {
  const groups = model.outcomeByCell;
  if (groups === undefined) throw new Error('leveneTest needs a model fitted with { keepOutcome: true }');
  const k = groups.length;
  if (k < 2) {
    throw new RefitError('INVALID_SPEC', "Levene's test compares the cells of the model's factors, and this model has none; leave out levene.", { field: 'levene' });
  }
  const n = groups.reduce((a, g) => a + g.length, 0);
  const z = groups.map((g) => {
    const c = center === 'median' ? median(g) : g.reduce((a, b) => a + b, 0) / g.length;
    return g.map((v) => Math.abs(v - c));
  });
  const zMeans = z.map((g) => g.reduce((a, b) => a + b, 0) / g.length);
  const zMean = z.reduce((a, g) => a + g.reduce((s, v) => s + v, 0), 0) / n;
  let between = 0;
  let within = 0;
  z.forEach((g, i) => {
    between += g.length * (zMeans[i]! - zMean) ** 2;
    for (const v of g) within += (v - zMeans[i]!) ** 2;
  });
  const df1 = k - 1;
  const df2 = n - k;
  const F = (df2 / df1) * (between / within);
  return { center, groups: k, F, df1, df2, p: fUpperTail(F, df1, df2) };
}

export interface Coefficient {
  /** The design column: "(Intercept)", "group[S.lo]", "group[T.hi]:dose[T.2]", "age". */
  name: string;
  estimate: number;
  se: number;
  t: number;
  df: number;
  p: number;
  lower: number;
  upper: number;
}

/** The regression coefficients of the design columns (the coding as fitted), with SE, t, two-sided p and interval. */
export function coefficientTable(model: FittedModel, level = 0.95): Coefficient[] {
  const p = model.columns.length;
  const beta = model.coefficients();
  const mse = model.residualSS / model.residualDf;
  const df = model.residualDf;
  const crit = tQuantileUpper((1 - level) / 2, df);
  return model.columns.map((column, j) => {
    const l = new Float64Array(p);
    l[j] = 1;
    let shift = 0;
    if (j === 0) {
      // The intercept at raw covariate values: undo the origins the covariates' main effects were measured from.
      shift = model.outcomeOrigin;
      model.columns.forEach((c, k) => {
        if (c.numeric.kind === 'delta') l[k] = -model.numericVars[c.numeric.slot]!.origin;
      });
    }
    let estimate = shift;
    for (let k = 0; k < p; k++) estimate += l[k]! * beta[k]!;
    const se = Math.sqrt(mse * model.unscaledVariance(l));
    const t = estimate / se;
    return { name: column.name, estimate, se, t, df, p: tTwoTailed(t, df), lower: estimate - crit * se, upper: estimate + crit * se };
  });
}
