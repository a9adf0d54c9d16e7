import { existsSync, readFileSync } from 'node:fs';
import { parseCellNumber } from '../refit/numeric.js';
import { MAX_COLUMNS_CEILING, MAX_COLUMNS_CEILING_REASON, type AnalysisSpecInput } from '../refit/spec.js';
import { UsageError } from './usageError.js';

/**
 * The refit command's options and the analysis description built from them
 * (buildSpec). Kept apart from the command's file handling so that the web
 * page, which has the same fields but no files, builds the same description
 * with the same messages.
 */

export type RefitFormat = 'text' | 'json' | 'md' | 'html' | 'docx';

export interface RefitOptions {
  model?: string;
  type?: string;
  coding?: 'sum' | 'treatment';
  factor: string[];
  covariate: string[];
  missing: string[];
  map: string[];
  reported?: string;
  spec?: string;
  maxColumns?: string;
  limit?: string[];
  means?: string[];
  pairwise?: boolean;
  adjust?: string;
  contrast?: string[];
  at?: string[];
  within?: string;
  coefficients?: boolean;
  weights?: 'equal' | 'proportional';
  levene?: 'median' | 'mean';
  labels?: string[];
  levels?: string[];
  range?: string[];
  termOrder?: 'degree' | 'written';
  center?: boolean;
  slopes?: boolean;
  name?: string[];
  format: RefitFormat;
  output?: string;
}


function readSpecFile(path: string): AnalysisSpecInput & Record<string, unknown> {
  if (!existsSync(path)) throw new UsageError(`--spec ${path}: no such file`);
  try {
    const value = JSON.parse(readFileSync(path, 'utf8')) as unknown;
    if (typeof value !== 'object' || value === null || Array.isArray(value)) throw new Error('the file must hold one JSON object');
    return value as AnalysisSpecInput & Record<string, unknown>;
  } catch (error) {
    throw new UsageError(`--spec ${path}: not valid JSON (${(error as Error).message})`);
  }
}

/** The analysis description: the --spec file, overridden by the command line. */
export function buildSpec(
  options: Pick<RefitOptions, 'spec' | 'model' | 'type' | 'coding' | 'factor' | 'covariate' | 'missing' | 'maxColumns' | 'means' | 'pairwise' | 'adjust' | 'contrast' | 'at' | 'within' | 'coefficients' | 'weights' | 'levene' | 'labels' | 'levels' | 'range' | 'termOrder' | 'center' | 'slopes' | 'name'>,
): AnalysisSpecInput {
  const raw: Record<string, unknown> = options.spec ? { ...readSpecFile(options.spec) } : {};
  // Advice in messages is written in the syntax the user used: options when there is no description file.
  raw.advice = options.spec === undefined ? 'command-line' : 'description';
  if (options.model !== undefined) {
    raw.model = options.model;
    delete raw.outcome; // the command line's formula names the outcome
  }
  if (typeof raw.model !== 'string' || raw.model.trim() === '') {
    throw new UsageError('refit needs a model: --model "outcome ~ factor * factor + covariate" (or "model" in the --spec file)');
  }
  if (options.type !== undefined) raw.type = Number(options.type);
  if (options.coding !== undefined) raw.coding = options.coding;
  if (options.maxColumns !== undefined) {
    const maxColumns = /^\d+$/.test(options.maxColumns.trim()) ? Number(options.maxColumns) : NaN;
    if (!(maxColumns >= 2 && maxColumns <= MAX_COLUMNS_CEILING)) {
      throw new UsageError(`--max-columns must be a whole number from 2 to ${MAX_COLUMNS_CEILING.toLocaleString('en-US')}, got "${options.maxColumns}" (${MAX_COLUMNS_CEILING_REASON})`);
    }
    raw.maxColumns = maxColumns;
  }
  // Keyed by column names, which may be "constructor" or "__proto__": objects without a prototype, so every name is an own key.
  const factors = namedCopy(raw.factors, 'factors', options.spec);
  let covariates = [...((raw.covariates as string[] | undefined) ?? [])];
  for (const f of options.factor) {
    factors[f] ??= {};
    covariates = covariates.filter((c) => c !== f);
  }
  for (const c of options.covariate) {
    if (!covariates.includes(c)) covariates.push(c);
    delete factors[c];
  }
  for (const entry of options.levels ?? []) {
    const { column, rest } = splitNamed(entry, '--levels', 'write it as "<factor>=<level>,<level>,...", in the order wanted, e.g. "group=control,training,waitlist"');
    const levels = rest.split(',').map((l) => l.trim());
    if (levels.some((l) => l === '')) throw new UsageError(`--levels "${entry}": an empty level; write it as "<factor>=<level>,<level>,...", e.g. "group=control,training,waitlist"`);
    factors[column] = { ...(factors[column] as object | undefined), levels };
    covariates = covariates.filter((c) => c !== column);
  }
  for (const entry of options.labels ?? []) {
    const usage = 'write it as "<factor>=<level>:<label>,<level>:<label>,...", e.g. "group=1:control,2:training,3:waitlist"';
    const { column, rest } = splitNamed(entry, '--labels', usage);
    const labels = Object.create(null) as Record<string, string>;
    for (const piece of rest.split(',')) {
      const colon = piece.indexOf(':');
      const level = piece.slice(0, colon).trim();
      const label = piece.slice(colon + 1).trim();
      if (colon <= 0 || level === '' || label === '') throw new UsageError(`--labels "${entry}": "${piece.trim()}" is not "<level>:<label>"; ${usage}`);
      labels[level] = label;
    }
    const existing = factors[column] as { labels?: Record<string, string> } | undefined;
    factors[column] = { ...existing, labels: Object.assign(Object.create(null) as Record<string, string>, existing?.labels, labels) };
    covariates = covariates.filter((c) => c !== column);
  }
  raw.factors = factors;
  raw.covariates = covariates;
  if ((options.range ?? []).length > 0) {
    const ranges = namedCopy(raw.ranges, 'ranges', options.spec);
    for (const entry of options.range ?? []) {
      const { column, rest } = splitNamed(entry, '--range', 'write it as "<column>=<low>..<high>", e.g. "mood=1..5"');
      ranges[column] = rest;
    }
    raw.ranges = ranges;
  }
  if ((options.name ?? []).length > 0) {
    const names = namedCopy(raw.names, 'names', options.spec);
    for (const entry of options.name ?? []) {
      const { column, rest } = splitNamed(entry, '--name', 'write it as "<variable>=<name shown>", e.g. "route=Walking route"');
      names[column] = rest;
    }
    raw.names = names;
  }
  if (options.termOrder !== undefined) raw.termOrder = options.termOrder;
  if (options.center) raw.center = true;
  if (options.slopes !== undefined) raw.slopes = options.slopes;
  const missing = namedCopy(raw.missing, 'missing', options.spec);
  for (const entry of options.missing) {
    const eq = entry.indexOf('=');
    if (eq <= 0 || eq === entry.length - 1) {
      throw new UsageError(`--missing "${entry}": write it as "<column>=<codes>", e.g. "mood=99", "anxiety=6-8", "age=>=200" or "group=8,9"`);
    }
    missing[entry.slice(0, eq).trim()] = entry.slice(eq + 1).trim();
  }
  raw.missing = missing;
  // Lists given on the command line replace the file's.
  if (options.means !== undefined && options.means.length > 0) raw.means = options.means.map((m) => m.trim());
  if (options.pairwise) raw.pairwise = true;
  if (options.adjust !== undefined) raw.adjust = options.adjust;
  if (options.contrast !== undefined && options.contrast.length > 0) raw.contrasts = options.contrast.map(parseContrastOption);
  if (options.levene !== undefined) raw.levene = options.levene;
  if (options.within !== undefined) raw.within = options.within.trim();
  if (options.coefficients) raw.coefficients = true;
  if (options.weights !== undefined) raw.weights = options.weights;
  if (options.at !== undefined && options.at.length > 0) {
    const at = namedCopy(raw.at, 'at', options.spec);
    for (const entry of options.at) {
      const eq = entry.indexOf('=');
      const value = eq > 0 ? parseCellNumber(entry.slice(eq + 1).trim()) : NaN;
      if (!Number.isFinite(value)) throw new UsageError(`--at "${entry}": write it as "<covariate>=<number>", e.g. "baseline=30"`);
      at[entry.slice(0, eq).trim()] = value;
    }
    raw.at = at;
  }
  return raw as unknown as AnalysisSpecInput;
}

/** "<column>=<rest>" of an option, or a usage error naming the option and the syntax. */
function splitNamed(entry: string, option: string, usage: string): { column: string; rest: string } {
  const eq = entry.indexOf('=');
  if (eq <= 0 || entry.slice(eq + 1).trim() === '') throw new UsageError(`${option} "${entry}": ${usage}`);
  return { column: entry.slice(0, eq).trim(), rest: entry.slice(eq + 1).trim() };
}

/** One weight: a decimal number or a fraction of two ("1/3", "-2/3"). */
function parseWeight(text: string): number {
  const parts = text.split('/');
  if (parts.length > 2) return NaN;
  const values = parts.map((part) => parseCellNumber(part.trim()));
  return values.length === 2 ? values[0]! / values[1]! : values[0]!;
}

/** "--contrast group=-0.5,-0.5,1" -> { term, weights }. */
export function parseContrastOption(entry: string): { term: string; weights: number[] } {
  const eq = entry.indexOf('=');
  const usage = 'write it as "<factor>=<weights>", one weight per level in level order, e.g. "group=-0.5,-0.5,1" (or "group:time=1,-1,-1,1" for cells)';
  if (eq <= 0 || eq === entry.length - 1) throw new UsageError(`--contrast "${entry}": ${usage}`);
  const term = entry.slice(0, eq).trim();
  const pieces = entry.slice(eq + 1).split(',').map((w) => w.trim());
  const weights = pieces.map(parseWeight);
  const bad = pieces.findIndex((_, i) => !Number.isFinite(weights[i]!));
  if (bad >= 0) throw new UsageError(`--contrast "${entry}": weight ${bad + 1} ("${pieces[bad]}") is not a number; ${usage}`);
  if (weights.length < 2) throw new UsageError(`--contrast "${entry}": a contrast needs a weight for each of at least two levels; ${usage}`);
  return { term, weights };
}

/**
 * A copy of the spec file's object keyed by names (`field`), without a
 * prototype: nothing inherited is read as a name, and a key "__proto__" is
 * stored like any other instead of setting the prototype.
 */
function namedCopy(value: unknown, field: string, specFile: string | undefined): Record<string, unknown> {
  const copy = Object.create(null) as Record<string, unknown>;
  if (value === undefined) return copy;
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw new UsageError(`--spec ${specFile ?? ''}: "${field}" must be an object keyed by column names, e.g. {"group": {}}`);
  }
  return Object.assign(copy, value);
}
