import { z } from 'zod';
import type { Comparison } from './compare.js';
import type { ExplainResult, ImpliedN } from './explain.js';
import type { AnovaTable, Coding, FittedModel } from './model.js';
import type { ReportedSet } from './reportedTable.js';

/**
 * The refit command's JSON output, defined with zod; schema/refit.schema.json
 * is generated from it (npm run schema:refit) and never edited by hand.
 * Non-finite numbers (an F with no residual variance) are written as null.
 */

const num = z.number().nullable();

export const anovaRowSchema = z.object({
  term: z.string().describe('Term as in the formula; interactions join variables with ":" in formula order'),
  ss: num,
  df: z.number(),
  ms: num,
  F: num,
  p: num,
  partialEtaSquared: num,
});

export const anovaTableSchema = z.object({
  n: z.number().int().describe('Rows analysed'),
  droppedRows: z.number().int().describe('Rows dropped for missing values'),
  type: z.union([z.literal(1), z.literal(2), z.literal(3)]),
  coding: z.enum(['sum', 'treatment']),
  terms: z.array(anovaRowSchema),
  residual: z.object({ ss: num, df: z.number(), ms: num }),
});

const quantitySchema = z.enum(['ss', 'df', 'ms', 'F', 'p', 'partialEtaSquared']);
const verdictSchema = z.enum(['matches', 'differs', 'not reported']);

export const comparisonSchema = z.object({
  reportedFile: z.string(),
  sources: z.array(z.string()).describe('Where the reported numbers were read: table file, manuscript table, manuscript text'),
  rows: z.array(
    z.object({
      term: z.string(),
      reportedLabel: z.string().nullable(),
      where: z.string().nullable(),
      numbers: z.array(
        z.object({
          quantity: quantitySchema,
          reported: z.string().nullable().describe('As printed, with its comparator'),
          reportedValue: num,
          recomputed: num,
          difference: num.describe('reported - recomputed'),
          verdict: verdictSchema,
        }),
      ),
    }),
  ),
  unmatched: z.array(z.object({ label: z.string(), where: z.string() })).describe('Reported rows that name no model term'),
  compared: z.number().int(),
  matches: z.number().int(),
  differs: z.number().int(),
  allMatch: z.boolean(),
});

export const explanationSchema = z.object({
  slip: z.enum(['type-1', 'type-1-order', 'type-2', 'type-3', 'type-3-other-coding', 'missing-codes-kept', 'covariate-omitted', 'interaction-omitted', 'interactions-omitted']),
  description: z.string(),
  model: z.string(),
  type: z.union([z.literal(1), z.literal(2), z.literal(3)]),
  coding: z.enum(['sum', 'treatment']),
  reproduces: z.enum(['all', 'most']),
  matches: z.number().int(),
  compared: z.number().int(),
  table: anovaTableSchema,
});

export const impliedNSchema = z.object({
  reportedErrorDf: z.number(),
  parameters: z.number().int(),
  parametersFrom: z.enum(['reported df', 'model']),
  impliedN: z.number(),
  analysedN: z.number().int(),
  rowsInFile: z.number().int(),
  note: z.string(),
});

export const refitOutputSchema = z.object({
  data: z.string().describe('The data file as given'),
  model: z.string(),
  outcome: z.string(),
  n: z.number().int().describe('Rows analysed (complete cases)'),
  rowsInFile: z.number().int(),
  droppedRows: z.number().int(),
  type: z.union([z.literal(1), z.literal(2), z.literal(3)]),
  coding: z.enum(['sum', 'treatment']),
  codingDescription: z.string(),
  missing: z.array(z.object({ column: z.string(), codes: z.string() })),
  factors: z.array(z.object({ name: z.string(), levels: z.array(z.string()) })),
  covariates: z.array(z.string()),
  terms: z.array(anovaRowSchema),
  residual: z.object({ ss: num, df: z.number(), ms: num }),
  verdict: z.enum(['matches', 'differs', 'nothing reported']),
  comparison: comparisonSchema.optional(),
  explanations: z.array(explanationSchema).optional(),
  impliedN: impliedNSchema.nullable().optional(),
  notFitted: z.array(z.object({ description: z.string(), reason: z.string() })).optional(),
});

export type RefitOutput = z.infer<typeof refitOutputSchema>;

/** The JSON Schema of the refit JSON output (generated from the zod model). */
export function refitJsonSchema(): Record<string, unknown> {
  return { ...z.toJSONSchema(refitOutputSchema, { target: 'draft-2020-12' }), title: 'plumbline refit output' };
}

export function codingDescription(coding: Coding): string {
  return coding === 'sum' ? 'sum-to-zero (deviation) coding' : 'treatment (dummy) coding, first level as reference';
}

const finite = (x: number): number | null => (Number.isFinite(x) ? x : null);

export function tableOutput(table: AnovaTable): z.infer<typeof anovaTableSchema> {
  return {
    n: table.n,
    droppedRows: table.droppedRows,
    type: table.type,
    coding: table.coding,
    terms: table.terms.map((t) => ({ term: t.term, ss: finite(t.ss), df: t.df, ms: finite(t.ms), F: finite(t.F), p: finite(t.p), partialEtaSquared: finite(t.partialEtaSquared) })),
    residual: { ss: finite(table.residual.ss), df: table.residual.df, ms: finite(table.residual.ms) },
  };
}

export function comparisonOutput(comparison: Comparison, reported: ReportedSet): z.infer<typeof comparisonSchema> {
  return {
    reportedFile: reported.file,
    sources: reported.sources,
    rows: comparison.rows.map((r) => ({
      ...r,
      numbers: r.numbers.map((n) => ({ ...n, reportedValue: n.reportedValue, recomputed: finite(n.recomputed), difference: n.difference === null ? null : finite(n.difference) })),
    })),
    unmatched: comparison.unmatched,
    compared: comparison.compared,
    matches: comparison.matches,
    differs: comparison.differs,
    allMatch: comparison.allMatch,
  };
}

export interface RefitResult {
  dataFile: string;
  model: FittedModel;
  table: AnovaTable;
  missing: Array<{ column: string; codes: string }>;
  reported?: ReportedSet;
  comparison?: Comparison;
  explained?: ExplainResult;
  impliedN?: ImpliedN | null;
}

/** Builds the JSON output object (validated against the schema). */
export function buildRefitOutput(result: RefitResult): RefitOutput {
  const { model, table } = result;
  const t = tableOutput(table);
  const out: RefitOutput = {
    data: result.dataFile,
    model: model.spec.model,
    outcome: model.spec.outcome,
    n: table.n,
    rowsInFile: table.n + table.droppedRows,
    droppedRows: table.droppedRows,
    type: table.type,
    coding: table.coding,
    codingDescription: codingDescription(table.coding),
    missing: result.missing,
    factors: model.factorVars.map((v) => ({ name: v.name, levels: v.levels })),
    covariates: model.numericVars.slice(0, -1).map((v) => v.name),
    terms: t.terms,
    residual: t.residual,
    verdict: result.comparison === undefined ? 'nothing reported' : result.comparison.allMatch ? 'matches' : 'differs',
  };
  if (result.comparison && result.reported) {
    out.comparison = comparisonOutput(result.comparison, result.reported);
    out.explanations = (result.explained?.explanations ?? []).map((e) => ({
      slip: e.slip,
      description: e.description,
      model: e.model,
      type: e.type,
      coding: e.coding,
      reproduces: e.reproduces,
      matches: e.matches,
      compared: e.compared,
      table: tableOutput(e.table),
    }));
    out.impliedN = result.impliedN ?? null;
    out.notFitted = result.explained?.notFitted ?? [];
  }
  return refitOutputSchema.parse(out);
}
