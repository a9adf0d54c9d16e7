import { fUpperTail } from '../stats/fDistribution.js';
import type { DataSource } from './data.js';
import { RefitError } from './errors.js';
import type { FormulaTerm } from './formula.js';
import { fitModel, type FittedModel } from './model.js';
import type { AnalysisSpecInput } from './spec.js';

/**
 * Homogeneity of regression slopes, the assumption of an ANCOVA that the
 * covariate has one slope in every cell of the factors.
 *
 * ## Method
 * The model is refitted with the interactions of each covariate with every
 * term of the model made of factors alone (for `y ~ a * b + x`: x:a, x:b and
 * x:a:b) and the added terms are tested together, as the extra sum of squares
 * of the larger model: F = ((RSS_0 - RSS_1) / (df_0 - df_1)) / (RSS_1 / df_1),
 * with RSS_0, df_0 the residual sum of squares and df of the model as
 * described and RSS_1, df_1 those of the larger one.
 *
 * ## References
 * - Maxwell, S. E., Delaney, H. D. & Kelley, K. (2018). Designing
 *   Experiments and Analyzing Data, 3rd ed. Routledge, chapter 9
 *   (heterogeneity of regression).
 */

export interface SlopesTest {
  covariates: string[];
  /** The interactions added to the model, named as in the formula ("loneliness:route"). */
  added: string[];
  /** The larger model's formula. */
  model: string;
  F: number;
  df1: number;
  df2: number;
  p: number;
}

/** The covariate × factor-term interactions the model lacks; none when it has no covariate or no factor. */
export function slopeTerms(model: FittedModel): FormulaTerm[] {
  const factors = new Set(model.factorVars.map((v) => v.name));
  const covariates = model.numericVars.slice(0, -1).map((v) => v.name);
  const factorTerms = model.spec.formula.terms.filter((t) => t.variables.every((v) => factors.has(v)));
  const has = (vars: string[]) => model.spec.formula.terms.some((t) => t.variables.length === vars.length && vars.every((v) => t.variables.includes(v)));
  const out: FormulaTerm[] = [];
  for (const c of covariates) {
    if (!model.spec.formula.terms.some((t) => t.variables.length === 1 && t.variables[0] === c)) continue;
    for (const t of factorTerms) {
      const variables = [c, ...t.variables];
      if (!has(variables)) out.push({ name: variables.join(':'), variables });
    }
  }
  return out;
}

/** True when the model already has an interaction of a covariate with a factor. */
export function hasCovariateByFactor(model: FittedModel): boolean {
  const factors = new Set(model.factorVars.map((v) => v.name));
  const covariates = new Set(model.numericVars.slice(0, -1).map((v) => v.name));
  return model.spec.formula.terms.some((t) => t.variables.some((v) => factors.has(v)) && t.variables.some((v) => covariates.has(v)));
}

const SIMPLE_NAME = /^[\p{L}_.][\p{L}\p{N}_.]*$/u;
const quote = (name: string) => (SIMPLE_NAME.test(name) ? name : `\`${name}\``);

/**
 * Tests the homogeneity of regression slopes by refitting the data with the
 * covariate × factor interactions added. Null when there is nothing to test
 * (no covariate, no factor, or the interactions are in the model already);
 * `{ error }` when the larger model cannot be fitted (a cell with one row, or
 * a covariate constant within a cell).
 */
export async function testSlopes(source: DataSource, spec: AnalysisSpecInput, model: FittedModel): Promise<SlopesTest | { error: string } | null> {
  if (hasCovariateByFactor(model)) return null;
  const added = slopeTerms(model);
  if (added.length === 0) return null;
  const terms = [...model.spec.formula.terms, ...added];
  const formula = `${quote(model.spec.outcome)} ~ ${terms.map((t) => t.variables.map(quote).join(':')).join(' + ')}`;
  let larger: FittedModel;
  try {
    larger = await fitModel(source, {
      ...spec,
      model: formula,
      outcome: undefined,
      means: [],
      contrasts: [],
      pairwise: false,
      adjust: undefined,
      within: undefined,
      levene: undefined,
      coefficients: false,
      slopes: false,
      center: false,
    });
  } catch (error) {
    if (error instanceof RefitError) return { error: error.message };
    throw error;
  }
  const df1 = model.residualDf - larger.residualDf;
  const df2 = larger.residualDf;
  const F = (model.residualSS - larger.residualSS) / df1 / (larger.residualSS / df2);
  return {
    covariates: [...new Set(added.map((t) => t.variables[0]!))],
    added: added.map((t) => t.name),
    model: formula,
    F,
    df1,
    df2,
    p: fUpperTail(F, df1, df2),
  };
}
