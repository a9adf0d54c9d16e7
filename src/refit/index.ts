/**
 * Refit: rebuild an ANOVA/ANCOVA table (types I, II, III) from raw data and
 * the model the authors describe, so it can be compared with the table a
 * manuscript reports.
 *
 * ```ts
 * const table = await fitAnova('study.csv', { model: 'score ~ group*dose + age', factors: { dose: {} } });
 * ```
 */
export { fitAnova, fitModel, FittedModel, codingValue } from './model.js';
export type { AnovaTable, AnovaRow, SsType, Coding, ModelTerm, DesignColumn } from './model.js';
export { parseAnalysisSpec, analysisSpecSchema, parseMissingRule, isMissingCode } from './spec.js';
export type { AnalysisSpec, AnalysisSpecInput, ResolvedSpec, MissingRule } from './spec.js';
export { parseFormula } from './formula.js';
export type { ParsedFormula, FormulaTerm } from './formula.js';
export { streamRows, detectDelimiter } from './data.js';
export type { DataSource, InMemoryTable, CellInput, VariableInfo } from './data.js';
export { marginalMeans, pairwiseComparisons, plannedContrast, holmAdjust } from './marginalMeans.js';
export type { MarginalMean, PairwiseComparison, ContrastResult, Adjustment, Alternative } from './marginalMeans.js';
export { RefitError } from './errors.js';
export type { RefitErrorCode, RefitErrorDetails } from './errors.js';
