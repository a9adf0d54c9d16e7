import { z } from 'zod';
import type { Comparison } from './compare.js';
import type { MeansComparison } from './compareMeans.js';
import type { ExplainResult, ImpliedN } from './explain.js';
import type { AnovaTable, Coding, FittedModel } from './model.js';
import { marginalMeans, pairwiseComparisons, plannedContrast, simpleComparisons, type Adjustment, type PairwiseComparison } from './marginalMeans.js';
import type { ReportedSet } from './reportedTable.js';
import { ADJUSTMENT_NAMES } from './spec.js';
import { cellDescriptives, coefficientTable, leveneTest, modelFit } from './summaries.js';
import { hasCovariateByFactor, type SlopesTest } from './assumptions.js';

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
      matchedBy: z.enum(['name', 'map', 'abbreviation']).nullable().describe('How the printed label was matched to the term: by its name, through --map or a display name, or as an abbreviation ("Grp" for group); null when not reported'),
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
  ambiguous: z
    .array(z.object({ label: z.string(), where: z.string(), candidates: z.array(z.string()) }))
    .describe('Reported rows whose label could name several terms: not guessed; --map says which'),
  termsNotReported: z.array(z.string()).describe('Terms of the model that no reported row names'),
  compared: z.number().int(),
  matches: z.number().int(),
  differs: z.number().int(),
  allMatch: z.boolean(),
});

const meanQuantitySchema = z.enum(['mean', 'estimate', 'se', 't', 'df', 'p', 'lower', 'upper']);

export const meansComparisonSchema = z.object({
  rows: z.array(
    z.object({
      kind: z.enum(['mean', 'comparison', 'contrast']),
      term: z.string().describe('The factor, or factors joined by ":", of the means'),
      label: z.string().describe('The level labels, "first - second", or the contrast\'s name'),
      printedAs: z.string(),
      where: z.string(),
      adjust: z.enum(ADJUSTMENT_NAMES).optional().describe('Comparisons: the adjustment of the recomputed p and interval'),
      numbers: z.array(
        z.object({
          quantity: meanQuantitySchema,
          reported: z.string().nullable(),
          reportedValue: num,
          recomputed: num,
          difference: num.describe('reported - recomputed'),
          verdict: verdictSchema,
        }),
      ),
    }),
  ),
  unmatched: z.array(z.object({ kind: z.enum(['mean', 'comparison', 'contrast']), label: z.string(), where: z.string(), reason: z.string() })).describe('Reported means, comparisons or contrasts that could not be tied to the model, with the reason'),
  compared: z.number().int(),
  matches: z.number().int(),
  differs: z.number().int(),
  allMatch: z.boolean(),
  adjust: z.object({ method: z.enum(ADJUSTMENT_NAMES), from: z.enum(['reported', 'analysis', 'default']).describe('Stated by the report, asked for in the analysis, or Tukey by default') }),
  explanations: z.array(
    z.object({
      slip: z.enum(['unadjusted-means', 'covariate-value', 'other-weights', 'other-adjustment']),
      description: z.string(),
      reproduces: z.enum(['all', 'most']),
      matches: z.number().int(),
      compared: z.number().int(),
    }),
  ),
});

export const explanationSchema = z.object({
  slip: z.enum(['type-1', 'type-1-order', 'type-2', 'type-3', 'type-3-other-coding', 'missing-codes-kept', 'covariate-omitted', 'interaction-omitted', 'interactions-omitted', 'out-of-range-missing']),
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

const levelSchema = z.object({
  factor: z.string(),
  level: z.string().describe('Level code as in the data'),
  label: z.string().describe('Label from the analysis description, else the code'),
});

export const marginalMeansSchema = z.object({
  term: z.string().describe('The factor, or factors joined by ":", whose means these are'),
  within: z.string().optional().describe('Simple comparisons: the factor within each of whose levels the means are compared (the means are then cells, this factor first)'),
  means: z.array(
    z.object({ levels: z.array(levelSchema), label: z.string(), mean: num, se: num, df: z.number(), lower: num, upper: num }),
  ),
  pairwise: z
    .object({
      adjust: z.enum(ADJUSTMENT_NAMES),
      method: z.string().describe('The adjustment in words, as the reports print it'),
      comparisons: z.array(
        z.object({
          within: z.string().optional().describe('Label of the level of the within factor this comparison belongs to'),
          first: z.string(),
          second: z.string(),
          estimate: num.describe('first - second'),
          se: num,
          df: z.number(),
          t: num,
          p: num.describe('Adjusted p (unadjusted when adjust is "none")'),
          pUnadjusted: num,
          lower: num.describe('Lower bound of the interval at confidenceLevel, adjusted like p (Bonferroni intervals for Holm)'),
          upper: num,
        }),
      ),
    })
    .optional(),
});

export const contrastOutputSchema = z.object({
  name: z.string(),
  term: z.string(),
  weights: z.array(z.object({ label: z.string(), weight: z.number() })),
  estimate: num,
  se: num,
  df: z.number(),
  t: num,
  p: num.describe('Two-sided, unadjusted'),
  lower: num,
  upper: num,
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
  termOrder: z.enum(['degree', 'written']).describe('Order of the terms (type I sums of squares follow it): by degree, main effects and covariates first, or as written'),
  factors: z.array(
    z.object({
      name: z.string(),
      levels: z.array(z.string()).describe('Level codes in analysis order'),
      labels: z.array(z.string()).describe('Label of each level (the code when none was given), in the order of levels'),
      reference: z.string().optional().describe('Treatment coding: the reference level (its code)'),
    }),
  ),
  displayNames: z.array(z.object({ variable: z.string(), name: z.string() })).describe('Names shown for variables in the tables (--name), in place of the column names'),
  centered: z.array(z.object({ name: z.string(), at: z.number() })).describe('Covariates centred (--center) where they interact with a factor, and the value subtracted (their mean)'),
  notes: z.array(z.string()).describe('What the reader of the table needs to know: levels left out, what type III tests mean here, covariates that could be factors'),
  outOfRange: z
    .array(
      z.object({
        column: z.string(),
        low: z.number(),
        high: z.number(),
        count: z.number().int(),
        rows: z.array(z.number().int()).describe('Up to 10 row numbers (the header is row 1)'),
        values: z.array(z.object({ value: z.string(), count: z.number().int() })),
      }),
    )
    .describe('Cells of numeric columns outside their declared ranges (kept in the analysis)'),
  slopes: z
    .object({
      covariates: z.array(z.string()),
      added: z.array(z.string()).describe('The covariate × factor interactions added to the model and tested together'),
      model: z.string(),
      F: num,
      df1: z.number(),
      df2: z.number(),
      p: num,
      sentence: z.string(),
    })
    .or(z.object({ error: z.string() }))
    .optional()
    .describe('Homogeneity of regression slopes, when tested'),
  covariates: z.array(z.string()),
  terms: z.array(anovaRowSchema),
  residual: z.object({ ss: num, df: z.number(), ms: num }),
  fit: z.object({ rSquared: num, adjustedRSquared: num }),
  confidenceLevel: z.number().describe('Level of every interval (0.95)'),
  cellWeights: z
    .enum(['equal', 'proportional'])
    .describe('How marginal means and contrasts weight the levels of the factors they average over: equally, or by their share of the analysed rows'),
  covariatesAt: z
    .array(z.object({ name: z.string(), value: z.number(), from: z.enum(['mean', 'given']).describe('Its mean over the analysed rows, or the value given (--at)') }))
    .describe('Where the covariates are held for marginal means and contrasts'),
  descriptives: z
    .array(z.object({ levels: z.array(levelSchema), label: z.string(), n: z.number().int(), mean: num, sd: num }))
    .describe('Unadjusted n, mean and SD (n - 1) of the outcome in every cell of the factors'),
  coefficients: z
    .array(z.object({ name: z.string(), estimate: num, se: num, t: num, df: z.number(), p: num, lower: num, upper: num }))
    .optional()
    .describe('Regression coefficients of the design columns in the coding fitted (intercept at raw covariate values), when asked for'),
  marginalMeans: z.array(marginalMeansSchema).optional().describe('Estimated marginal (covariate-adjusted) means, when asked for'),
  contrasts: z.array(contrastOutputSchema).optional().describe('Planned contrasts of marginal means, when asked for'),
  levene: z
    .object({
      center: z.enum(['median', 'mean']).describe('Absolute deviations from each cell\'s median (Brown-Forsythe) or mean (Levene)'),
      groups: z.number().int(),
      F: num,
      df1: z.number(),
      df2: z.number(),
      p: num,
    })
    .optional(),
  verdict: z.enum(['matches', 'differs', 'nothing reported']),
  comparison: comparisonSchema.optional(),
  meansComparison: meansComparisonSchema.optional().describe('Reported adjusted means, pairwise comparisons and contrasts against the recomputed ones, with the slips that reproduce them'),
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
    ambiguous: comparison.ambiguous,
    termsNotReported: comparison.termsNotReported,
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
  meansComparison?: MeansComparison | null;
  explained?: ExplainResult;
  impliedN?: ImpliedN | null;
  slopes?: SlopesTest | { error: string } | null;
}

const CONFIDENCE = 0.95;

function levelsOf(model: FittedModel, term: string, codes: readonly string[]): Array<z.infer<typeof levelSchema>> {
  return term.split(':').map((factor, i) => {
    const v = model.factorVars.find((f) => f.name === factor.trim());
    const level = codes[i]!;
    return { factor: factor.trim(), level, label: v?.labels.get(level) ?? level };
  });
}

/** The adjustment in words; Tukey is named Tukey-Kramer when the comparisons' standard errors differ (unequal cells). */
export function adjustmentMethod(adjust: Adjustment, comparisons: number, means: number, unequal: boolean): string {
  switch (adjust) {
    case 'tukey':
      return `${unequal ? 'Tukey-Kramer' : 'Tukey'} (studentized range, ${means} means)`;
    case 'bonferroni':
      return `Bonferroni (${comparisons} comparisons)`;
    case 'holm':
      return `Holm (step-down, ${comparisons} comparisons; intervals Bonferroni)`;
    case 'sidak':
      return `Šidák (${comparisons} comparisons)`;
    case 'scheffe':
      return `Scheffé (all contrasts of ${means} means)`;
    default:
      return 'none (unadjusted p and intervals)';
  }
}

type ComparisonOut = NonNullable<z.infer<typeof marginalMeansSchema>['pairwise']>['comparisons'][number];

function comparisonOut(c: PairwiseComparison, first: string, second: string, within?: string): ComparisonOut {
  return {
    ...(within === undefined ? {} : { within }),
    first,
    second,
    estimate: finite(c.estimate),
    se: finite(c.se),
    df: c.df,
    t: finite(c.t),
    p: finite(c.p),
    pUnadjusted: finite(c.pUnadjusted),
    lower: finite(c.lower),
    upper: finite(c.upper),
  };
}

/** True when the comparisons' standard errors differ (unequal cells: Tukey-Kramer rather than Tukey). */
function unequalErrors(pairs: readonly PairwiseComparison[]): boolean {
  const ses = pairs.map((c) => c.se);
  return ses.some((se) => Math.abs(se - ses[0]!) > 1e-9 * ses[0]!);
}

function meansOutput(model: FittedModel, term: string): z.infer<typeof marginalMeansSchema> {
  const spec = model.spec;
  const names = term.split(':').map((n) => n.trim());
  const adjust = spec.adjust ?? 'tukey';
  const meanRow = (codes: string[], allNames: string[], m: { emmean: number; se: number; df: number; lower: number; upper: number }) => {
    const levels = levelsOf(model, allNames.join(':'), codes);
    return { levels, label: levels.map((l) => l.label).join(', '), mean: finite(m.emmean), se: finite(m.se), df: m.df, lower: finite(m.lower), upper: finite(m.upper) };
  };
  if (spec.within !== undefined) {
    const within = spec.within;
    const families = simpleComparisons(model, names, within, { adjust, level: CONFIDENCE, at: spec.at, weights: spec.weights });
    const rows = families.flatMap((f) => f.means.map((m) => meanRow([f.within.level, ...names.map((n) => m.levels[n]!)], [within, ...names], m)));
    const comparisons: ComparisonOut[] = [];
    for (const f of families) {
      const labels = f.means.map((m) => levelsOf(model, names.join(':'), names.map((n) => m.levels[n]!)).map((l) => l.label).join(', '));
      let index = 0;
      for (let i = 0; i < labels.length; i++) for (let j = i + 1; j < labels.length; j++) comparisons.push(comparisonOut(f.comparisons[index++]!, labels[i]!, labels[j]!, f.within.label));
    }
    const all = families.flatMap((f) => f.comparisons);
    const k = families[0]?.means.length ?? 0;
    const method = `${adjustmentMethod(adjust, families[0]?.comparisons.length ?? 0, k, unequalErrors(all))}, within each level of ${within}`;
    return { term: names.join(':'), within, means: rows, pairwise: { adjust, method, comparisons } };
  }
  const means = marginalMeans(model, term, { level: CONFIDENCE, at: spec.at, weights: spec.weights });
  const rows = means.map((m) => meanRow(names.map((n) => m.levels[n]!), names, m));
  const out: z.infer<typeof marginalMeansSchema> = { term: names.join(':'), means: rows };
  if (spec.pairwise || spec.adjust !== undefined) {
    const pairs = pairwiseComparisons(model, names, { adjust, level: CONFIDENCE, at: spec.at, weights: spec.weights });
    const comparisons: ComparisonOut[] = [];
    let index = 0;
    for (let i = 0; i < rows.length; i++) for (let j = i + 1; j < rows.length; j++) comparisons.push(comparisonOut(pairs[index++]!, rows[i]!.label, rows[j]!.label));
    out.pairwise = { adjust, method: adjustmentMethod(adjust, pairs.length, rows.length, unequalErrors(pairs)), comparisons };
  }
  return out;
}

function contrastsOutput(model: FittedModel): Array<z.infer<typeof contrastOutputSchema>> {
  return model.spec.contrasts.map((c) => {
    const names = c.term.split(':').map((n) => n.trim());
    let weights: number[] | Record<string, number>;
    if (Array.isArray(c.weights)) weights = c.weights;
    else {
      // Keys are level codes or labels: an object without a prototype, so every key is a level.
      weights = Object.create(null) as Record<string, number>;
      for (const [key, w] of c.weights) weights[key] = w;
    }
    const result = plannedContrast(model, names, weights, { level: CONFIDENCE, at: model.spec.at, weights: model.spec.weights });
    const means = marginalMeans(model, names, { level: CONFIDENCE, at: model.spec.at, weights: model.spec.weights });
    const labels = means.map((m) => names.map((n) => { const code = m.levels[n]!; return model.factorVars.find((v) => v.name === n)?.labels.get(code) ?? code; }).join(', '));
    const weighted = labels.map((label, i) => ({ label, weight: result.weights[i]! }));
    const side = (sign: number) => weighted.filter((w) => Math.sign(w.weight) === sign).map((w) => w.label).join(' + ');
    const name = c.name ?? `${side(1)} vs ${side(-1)}`;
    return {
      name,
      term: names.join(':'),
      weights: weighted,
      estimate: finite(result.estimate),
      se: finite(result.se),
      df: result.df,
      t: finite(result.t),
      p: finite(result.p),
      lower: finite(result.lower),
      upper: finite(result.upper),
    };
  });
}

function levelText(model: FittedModel, factor: string, code: string): string {
  const label = model.factorVars.find((v) => v.name === factor)?.labels.get(code);
  return label === undefined || label === code ? code : `${code} (${label})`;
}

function round2(x: number): string {
  return x.toLocaleString('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 2 });
}

/** The homogeneity-of-slopes test in a plain sentence. */
export function slopesSentence(t: SlopesTest): string {
  const p = t.p < 0.001 ? '< .001' : t.p >= 0.9995 ? '> .999' : `= ${t.p.toFixed(3).replace(/^0\./, '.')}`;
  const stat = `F(${t.df1}, ${t.df2}) = ${round2(t.F)}, p ${p}`;
  const covs = t.covariates.join(' and ');
  const added = t.added.map((a) => a.split(':').join(' × ')).join(', ');
  const head = `Homogeneity of regression slopes (${added} added to the model and tested together): ${stat}.`;
  return t.p < 0.05
    ? `${head} The slope of ${covs} differs between the groups, so the ANCOVA's assumption of one common slope does not hold: the adjusted means and the tests of the factors depend on the value ${covs} is held at. Report the model with the interaction${t.added.length > 1 ? 's' : ''}, or the slopes group by group.`
    : `${head} No evidence that the slope of ${covs} differs between the groups: the ANCOVA's assumption of one common slope is not contradicted by these data (a test that is not significant does not prove the slopes equal).`;
}

/** What the reader of the table needs to know, in sentences. */
export function modelNotes(model: FittedModel): string[] {
  const notes: string[] = [];
  const spec = model.spec;
  const cli = spec.advice === 'command-line';
  for (const v of model.factorVars) {
    const dropped = model.droppedLevels.filter((d) => d.factor === v.name);
    if (dropped.length === 0) continue;
    const list = dropped.map((d) => `"${d.label === d.level ? d.level : `${d.level} (${d.label})`}"`).join(', ');
    notes.push(
      `Level${dropped.length > 1 ? 's' : ''} ${list} of ${v.name} ${dropped.length > 1 ? 'have' : 'has'} no analysed rows once rows with missing values are removed, so ${dropped.length > 1 ? 'they are' : 'it is'} left out of the model (levels analysed: ${v.levels.join(', ')}).`,
    );
  }
  // The reference levels matter where the coding does: type III tests and the coefficients.
  if (spec.coding === 'treatment' && model.factorVars.length > 0 && (spec.type === 3 || spec.coefficients)) {
    const change = cli ? 'list the levels with the reference first (--levels "<factor>=<reference>,...")' : 'list the levels with the reference first in factors.<factor>.levels';
    notes.push(`Treatment coding: each factor's first level is its reference (${model.factorVars.map((v) => `${v.name} = ${levelText(model, v.name, v.levels[0]!)}`).join(', ')}); to change it, ${change}.`);
    if (spec.type === 3) {
      const factorNames = new Set(model.factorVars.map((v) => v.name));
      const simple: string[] = [];
      for (const t of spec.formula.terms) {
        if (!t.variables.every((v) => factorNames.has(v))) continue;
        const others = new Set<string>();
        for (const u of spec.formula.terms) {
          if (u === t || !t.variables.every((v) => u.variables.includes(v))) continue;
          for (const v of u.variables) if (!t.variables.includes(v) && factorNames.has(v)) others.add(v);
        }
        if (others.size > 0) simple.push(`${t.name.split(':').join(' × ')} at ${[...others].map((o) => `${o} = ${levelText(model, o, model.factorVars.find((f) => f.name === o)!.levels[0]!)}`).join(', ')}`);
      }
      if (simple.length > 0) {
        notes.push(
          `With treatment coding, the type III tests of effects inside an interaction are simple effects at the reference levels of the other factors (${simple.join('; ')}), not main effects averaged over them. For main effects use sum-to-zero coding (${cli ? 'leave out --coding treatment' : '"coding": "sum"'}).`,
        );
      }
    }
  }
  if (hasCovariateByFactor(model)) {
    const covs = model.numericVars.slice(0, -1).map((v, slot) => ({ name: v.name, mean: model.numericMeans[slot]!, center: model.centers[slot]! }));
    const inInteraction = covs.filter((c) => spec.formula.terms.some((t) => t.variables.includes(c.name) && t.variables.length > 1));
    if (spec.center) {
      notes.push(`Covariates centred at their means in their interactions with factors (${inInteraction.map((c) => `${c.name} = ${round2(c.center)}`).join(', ')}): the type III tests of the factors are at these values.`);
    } else if (spec.type === 3) {
      notes.push(
        `The model has a covariate × factor interaction, so the type III tests of the factors compare the groups where ${inInteraction.map((c) => `${c.name} = 0`).join(' and ')} (${inInteraction.map((c) => `${c.name}'s mean is ${round2(c.mean)}`).join(', ')}), which may lie outside the data. ${cli ? '--center' : '"center": true'} tests them at the covariates' means instead.`,
      );
    }
  }
  const termVars = new Set(spec.formula.terms.flatMap((t) => t.variables));
  for (const v of model.numericVars.slice(0, -1)) {
    if (v.declaredNumeric || !termVars.has(v.name) || !v.wholeNumbers || v.distinct.length > 6) continue;
    notes.push(
      `'${v.name}' has only ${v.distinct.length} distinct values (${v.distinct.join(', ')}), all whole numbers: it is treated as a numeric covariate (one slope, 1 df). If its values are groups, make it a factor (${cli ? `--factor ${v.name}` : `"factors": {"${v.name}": {}}`}); ${cli ? `--covariate ${v.name}` : `"covariates": ["${v.name}"]`} keeps it numeric without this note.`,
    );
  }
  return notes;
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
    termOrder: model.spec.termOrder,
    factors: model.factorVars.map((v) => ({
      name: v.name,
      levels: v.levels,
      labels: v.levels.map((l) => v.labels.get(l) ?? l),
      ...(table.coding === 'treatment' ? { reference: v.levels[0]! } : {}),
    })),
    displayNames: [...model.spec.names].map(([variable, name]) => ({ variable, name })),
    centered: model.spec.center ? model.numericVars.slice(0, -1).map((v, slot) => ({ name: v.name, at: model.centers[slot]! })) : [],
    notes: modelNotes(model),
    outOfRange: model.outOfRange,
    covariates: model.numericVars.slice(0, -1).map((v) => v.name),
    terms: t.terms,
    residual: t.residual,
    fit: (() => {
      const f = modelFit(model);
      return { rSquared: finite(f.rSquared), adjustedRSquared: finite(f.adjustedRSquared) };
    })(),
    confidenceLevel: CONFIDENCE,
    cellWeights: model.spec.weights,
    covariatesAt: model.numericVars.slice(0, -1).map((v, slot) => {
      const given = model.spec.at.get(v.name);
      return given === undefined ? { name: v.name, value: model.numericMeans[slot]!, from: 'mean' as const } : { name: v.name, value: given, from: 'given' as const };
    }),
    descriptives: cellDescriptives(model).map((d) => {
      const levels = model.factorVars.map((v, i) => ({ factor: v.name, level: d.levels[i]!, label: v.labels.get(d.levels[i]!) ?? d.levels[i]! }));
      return { levels, label: d.label, n: d.n, mean: finite(d.mean), sd: finite(d.sd) };
    }),
    verdict:
      result.comparison === undefined
        ? 'nothing reported'
        : result.comparison.allMatch && (result.meansComparison ?? null) === null
          ? 'matches'
          : result.comparison.allMatch && result.meansComparison?.allMatch
            ? 'matches'
            : 'differs',
  };
  if (model.spec.coefficients) {
    out.coefficients = coefficientTable(model, CONFIDENCE).map((c) => ({
      name: c.name,
      estimate: finite(c.estimate),
      se: finite(c.se),
      t: finite(c.t),
      df: c.df,
      p: finite(c.p),
      lower: finite(c.lower),
      upper: finite(c.upper),
    }));
  }
  if (model.spec.means.length > 0) out.marginalMeans = model.spec.means.map((term) => meansOutput(model, term));
  if (model.spec.contrasts.length > 0) out.contrasts = contrastsOutput(model);
  if (result.slopes) out.slopes = 'error' in result.slopes ? { error: result.slopes.error } : { ...result.slopes, F: finite(result.slopes.F), p: finite(result.slopes.p), sentence: slopesSentence(result.slopes) };
  if (model.spec.levene !== undefined) {
    const l = leveneTest(model, model.spec.levene);
    out.levene = { center: l.center, groups: l.groups, F: finite(l.F), df1: l.df1, df2: l.df2, p: finite(l.p) };
  }
  if (result.comparison && result.reported) {
    out.comparison = comparisonOutput(result.comparison, result.reported);
    if (result.meansComparison) {
      const m = result.meansComparison;
      out.meansComparison = {
        ...m,
        rows: m.rows.map((r) => ({ ...r, numbers: r.numbers.map((n) => ({ ...n, recomputed: finite(n.recomputed), difference: n.difference === null ? null : finite(n.difference) })) })),
      };
    }
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
