import { isDelimitedText, isXlsxBytes, streamRows, type DataSource, type InMemoryTable } from './data.js';
import { RefitError } from './errors.js';
import { parseFormula, type FormulaTerm } from './formula.js';
import { fitModel, type AnovaTable, type Coding, type FittedModel, type SsType } from './model.js';
import { compareTables, type Comparison } from './compare.js';
import type { ReportedSet } from './reportedTable.js';
import { orderTerms, type AnalysisSpecInput } from './spec.js';

/**
 * When the reported table does not match the recomputed one, refit the
 * usual analysis slips and keep those that reproduce the reported numbers:
 *
 * - type I (sequential) sums of squares in the formula's order, and in other
 *   orders of the terms (each interaction after the terms it contains);
 * - type II sums of squares;
 * - type III computed with treatment (dummy) coding instead of sum-to-zero
 *   coding (or the other way round when treatment coding was asked for);
 * - missing-value codes left in the data as numbers (all codes, and each
 *   column's codes alone);
 * - a covariate left out; an interaction left out (with the terms that
 *   contain it), and all interactions left out;
 * - values outside a declared range (usually undeclared missing-value codes)
 *   removed as missing.
 *
 * A slip reproduces the report when every reported number matches its table
 * ("all"), or at least three quarters of them and more than the model as
 * described does ("most"). Best first: the share of reported numbers
 * matched, then the simpler slip.
 */

export type SlipKind =
  | 'type-1'
  | 'type-1-order'
  | 'type-2'
  | 'type-3'
  | 'type-3-other-coding'
  | 'missing-codes-kept'
  | 'covariate-omitted'
  | 'interaction-omitted'
  | 'interactions-omitted'
  | 'out-of-range-missing';

const SLIP_RANK: Record<SlipKind, number> = {
  'type-3-other-coding': 0,
  'type-2': 1,
  'type-1': 2,
  'type-3': 3,
  'missing-codes-kept': 4,
  'covariate-omitted': 5,
  'interaction-omitted': 6,
  'interactions-omitted': 7,
  'type-1-order': 8,
  'out-of-range-missing': 9,
};

export interface Explanation {
  slip: SlipKind;
  /** Plain description of the slip. */
  description: string;
  /** The refit that reproduces the report. */
  model: string;
  type: SsType;
  coding: Coding;
  /** "all" reported numbers match, or "most" of them. */
  reproduces: 'all' | 'most';
  matches: number;
  compared: number;
  table: AnovaTable;
  comparison: Comparison;
}

export interface ImpliedN {
  /** The error df the manuscript reports (table or written F results). */
  reportedErrorDf: number;
  /** Parameters of the reported model: 1 + the reported effect df (or the model's, when some df are not reported). */
  parameters: number;
  parametersFrom: 'reported df' | 'model';
  impliedN: number;
  /** Rows analysed (complete cases) and rows in the file (analysed + dropped). */
  analysedN: number;
  rowsInFile: number;
  /** One sentence for the reader. */
  note: string;
}

export interface ExplainResult {
  explanations: Explanation[];
  /** Slips that could not be fitted on this data (e.g. a missing code becomes a factor level with an empty cell). */
  notFitted: Array<{ description: string; reason: string }>;
  /** How many slips were tried. */
  tried: number;
}

interface Variant {
  slip: SlipKind;
  description: string;
  spec: AnalysisSpecInput;
  type: SsType;
}

/** Reads a data source once into memory, so the slips can be refitted without reading the file again. */
export async function loadTable(source: DataSource): Promise<InMemoryTable> {
  if (typeof source !== 'string' && !isDelimitedText(source) && !isXlsxBytes(source)) return { name: source.name, header: source.header, rows: [...source.rows] };
  let header: string[] = [];
  let name = typeof source === 'string' ? source : source.name;
  let decimalComma = false;
  const rows: string[][] = [];
  await streamRows(source, {
    header(names, file, options) {
      header = names;
      name = file;
      decimalComma = options.decimalComma;
    },
    rows(batch) {
      for (const row of batch) {
        if (row.length === 0 || (row.length === 1 && row[0]!.trim() === '')) continue;
        rows.push(decimalComma ? row.map((c) => (/^\s*[-+]?\d*,\d+\s*$/.test(c) ? c.replace(',', '.') : c)) : row.slice());
      }
    },
    end() {},
  });
  return { name, header, rows };
}

const SIMPLE_NAME = /^[\p{L}_.][\p{L}\p{N}_.]*$/u;

function quote(name: string): string {
  return SIMPLE_NAME.test(name) ? name : `\`${name}\``;
}

/** A formula with the terms written out one by one, in the given order. */
export function formulaOf(outcome: string, terms: readonly FormulaTerm[]): string {
  return `${quote(outcome)} ~ ${terms.map((t) => t.variables.map(quote).join(':')).join(' + ')}`;
}

function contains(big: FormulaTerm, small: FormulaTerm): boolean {
  return big !== small && small.variables.every((v) => big.variables.includes(v));
}

/** Orders of the terms in which every term comes after the terms it contains (at most `limit`, the formula's own order excluded). */
export function hierarchicalOrders(terms: readonly FormulaTerm[], limit = 60): FormulaTerm[][] {
  const out: FormulaTerm[][] = [];
  const original = terms.map((t) => t.name).join('|');
  const walk = (prefix: FormulaTerm[], rest: FormulaTerm[]): void => {
    if (out.length >= limit) return;
    if (rest.length === 0) {
      if (prefix.map((t) => t.name).join('|') !== original) out.push(prefix);
      return;
    }
    for (const t of rest) {
      if (rest.some((u) => contains(t, u))) continue;
      walk([...prefix, t], rest.filter((u) => u !== t));
    }
  };
  walk([], terms.slice());
  return out;
}

function describeCodes(codes: unknown): string {
  return Array.isArray(codes) ? codes.join(',') : String(codes);
}

function variants(spec: AnalysisSpecInput, model: FittedModel): Variant[] {
  const written = parseFormula(spec.model);
  const outcome = written.outcome;
  const terms = orderTerms(written.terms, spec.termOrder ?? 'degree');
  const type = (spec.type ?? 3) as SsType;
  const coding: Coding = spec.coding ?? 'sum';
  const list: Variant[] = [];
  const termNames = (ts: readonly FormulaTerm[]) => ts.map((t) => t.name).join(', ');
  const add = (slip: SlipKind, description: string, changes: Partial<AnalysisSpecInput>, t: SsType = type) =>
    list.push({ slip, description, spec: { ...spec, ...changes, type: t }, type: t });

  if (type !== 1) add('type-1', `type I (sequential) sums of squares with the terms in the order ${termNames(terms)}`, {}, 1);
  // Other orders, the written one among them when it differs (software that keeps the written order).
  for (const order of hierarchicalOrders(terms)) {
    add('type-1-order', `type I (sequential) sums of squares with the terms in the order ${termNames(order)}`, { model: formulaOf(outcome, order), termOrder: 'written' }, 1);
  }
  if (type !== 2) add('type-2', 'type II sums of squares', {}, 2);
  if (type !== 3) add('type-3', 'type III sums of squares (sum-to-zero coding)', { coding: 'sum' }, 3);
  if (type === 3 && model.factorVars.length > 0) {
    add(
      'type-3-other-coding',
      coding === 'sum'
        ? 'type III sums of squares computed with treatment (dummy) coding instead of sum-to-zero coding'
        : 'type III sums of squares computed with sum-to-zero coding instead of treatment (dummy) coding',
      { coding: coding === 'sum' ? 'treatment' : 'sum' },
      3,
    );
  }

  const missing = spec.missing ?? {};
  const columns = Object.keys(missing);
  if (columns.length > 0) {
    const all = columns.map((c) => `${c}=${describeCodes(missing[c])}`).join('; ');
    add('missing-codes-kept', `missing-value codes left in the data as numbers (${all} not removed)`, { missing: {} });
    if (columns.length > 1) {
      for (const c of columns) {
        const rest = Object.fromEntries(Object.entries(missing).filter(([k]) => k !== c));
        add('missing-codes-kept', `missing-value codes of ${c} left in the data as numbers (${c}=${describeCodes(missing[c])} not removed)`, { missing: rest });
      }
    }
  }

  // Cells outside the declared ranges are kept in the refit; the report may come from data without them.
  if (model.outOfRange.length > 0) {
    const withRanges: Record<string, unknown> = Object.assign(Object.create(null) as Record<string, unknown>, missing);
    for (const r of model.outOfRange) {
      const before = withRanges[r.column];
      const codes: Array<string | number> = before === undefined ? [] : Array.isArray(before) ? [...(before as Array<string | number>)] : typeof before === 'number' ? [before] : String(before).split(',');
      withRanges[r.column] = [...codes, `<${r.low}`, `>${r.high}`];
    }
    const what = model.outOfRange.map((r) => `${r.column} outside ${r.low}..${r.high}: ${r.count} value${r.count === 1 ? '' : 's'}`).join('; ');
    add('out-of-range-missing', `values outside the declared ranges removed as missing (${what}), as undeclared missing-value codes would be`, { missing: withRanges as AnalysisSpecInput['missing'] });
  }

  const numeric = new Set(model.numericVars.map((v) => v.name));
  for (const t of terms) {
    if (t.variables.length !== 1 || !numeric.has(t.variables[0]!)) continue;
    const kept = terms.filter((u) => !u.variables.includes(t.variables[0]!));
    if (kept.length === 0) continue;
    add('covariate-omitted', `covariate ${t.name} left out of the model`, { model: formulaOf(outcome, kept), covariates: (spec.covariates ?? []).filter((c) => c !== t.name) });
  }
  const interactions = terms.filter((t) => t.variables.length > 1);
  for (const t of interactions) {
    const kept = terms.filter((u) => u !== t && !contains(u, t));
    add('interaction-omitted', `interaction ${t.name} left out of the model`, { model: formulaOf(outcome, kept) });
  }
  if (interactions.length > 1) {
    add('interactions-omitted', 'all interactions left out (main effects only)', { model: formulaOf(outcome, terms.filter((t) => t.variables.length === 1)) });
  }
  return list;
}

/** Numbers in reported rows that no term of the table takes (they count as not reproduced). */
function unmatchedNumbers(comparison: Comparison, reported: ReportedSet): number {
  let count = 0;
  for (const u of [...comparison.unmatched, ...comparison.ambiguous]) {
    const row = reported.rows.find((r) => r.label === u.label && r.where === u.where);
    if (row) count += Object.keys(row.values).length;
  }
  return count;
}

/** Refits the usual slips on the data and returns those that reproduce the reported numbers, best first. */
export async function explainMismatch(
  data: InMemoryTable,
  spec: AnalysisSpecInput,
  model: FittedModel,
  baseline: Comparison,
  reported: ReportedSet,
  map: ReadonlyMap<string, string> = new Map(),
): Promise<ExplainResult> {
  const baselineShare = baseline.compared === 0 ? 0 : baseline.matches / (baseline.compared + unmatchedNumbers(baseline, reported));
  const explanations: Explanation[] = [];
  const notFitted: Array<{ description: string; reason: string }> = [];
  // The slips change the ANOVA table only: what is reported beside it (means, contrasts, Levene) is left out of their refits.
  const { means: _means, pairwise: _pairwise, adjust: _adjust, contrasts: _contrasts, levene: _levene, at: _at, within: _within, coefficients: _coefficients, weights: _weights, ...tableSpec } = spec;
  const list = variants(tableSpec, model);
  for (const variant of list) {
    let table: AnovaTable;
    try {
      table = (await fitModel(data, variant.spec)).anova(variant.type);
    } catch (error) {
      if (error instanceof RefitError) {
        notFitted.push({ description: variant.description, reason: error.message });
        continue;
      }
      throw error;
    }
    const comparison = compareTables(table, reported, map);
    const total = comparison.compared + unmatchedNumbers(comparison, reported);
    if (total === 0) continue;
    const share = comparison.matches / total;
    const all = comparison.matches === total;
    if (!all && !(share >= 0.75 && share > baselineShare)) continue;
    explanations.push({
      slip: variant.slip,
      description: variant.description,
      model: variant.spec.model,
      type: variant.type,
      coding: table.coding,
      reproduces: all ? 'all' : 'most',
      matches: comparison.matches,
      compared: total,
      table,
      comparison,
    });
  }
  explanations.sort((a, b) => b.matches / b.compared - a.matches / a.compared || SLIP_RANK[a.slip] - SLIP_RANK[b.slip]);
  return { explanations, notFitted, tried: list.length };
}

/** The N the reported error df implies (error df + parameters), against the N in the data. */
export function impliedSampleSize(table: AnovaTable, reported: ReportedSet): ImpliedN | null {
  const errorDf = reported.residual?.values.df;
  if (errorDf === undefined || errorDf.comparator !== '=' || !Number.isInteger(errorDf.value)) return null;
  const dfs = reported.rows.map((r) => r.values.df);
  const fromReported = reported.rows.length > 0 && dfs.every((d) => d !== undefined && Number.isInteger(d.value));
  const parameters = fromReported ? 1 + dfs.reduce((s, d) => s + d!.value, 0) : 1 + table.terms.reduce((s, t) => s + t.df, 0);
  const impliedN = errorDf.value + parameters;
  const analysedN = table.n;
  const rowsInFile = table.n + table.droppedRows;
  const base = `The reported error df ${errorDf.text} implies N = ${impliedN} (${errorDf.text} + ${parameters} parameters${fromReported ? ', counted from the reported df' : ''})`;
  let note: string;
  if (impliedN === analysedN) note = `${base}, the N analysed here.`;
  else if (impliedN === rowsInFile && table.droppedRows > 0) {
    note = `${base}: every row of the file, including the ${table.droppedRows} dropped here for missing values (were the missing-value codes analysed as numbers?).`;
  } else {
    note = `${base}, but ${analysedN} rows are analysed here (${rowsInFile} in the file, ${table.droppedRows} dropped for missing values).`;
  }
  return { reportedErrorDf: errorDf.value, parameters, parametersFrom: fromReported ? 'reported df' : 'model', impliedN, analysedN, rowsInFile, note };
}
