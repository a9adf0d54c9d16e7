import { existsSync, readFileSync } from 'node:fs';
import { mkdir, writeFile } from 'node:fs/promises';
import { basename, dirname } from 'node:path';
import { notRegularFileReason } from '../documents/regularFile.js';
import { RefitError } from '../refit/errors.js';
import { compareTables } from '../refit/compare.js';
import { explainMismatch, impliedSampleSize, loadTable } from '../refit/explain.js';
import { formatRefitHtml, formatRefitMarkdown, formatRefitText } from '../refit/format.js';
import { fitModel } from '../refit/model.js';
import { buildRefitOutput, type RefitResult } from '../refit/output.js';
import { parseTermMap } from '../refit/reportedTable.js';
import { readReportedWithinBudget } from '../refit/readReportedWithinBudget.js';
import { MAX_COLUMNS_CEILING, MAX_COLUMNS_CEILING_REASON, parseAnalysisSpec, type AnalysisSpecInput } from '../refit/spec.js';
import { parseCellNumber } from '../refit/numeric.js';
import { EXIT_CLEAN, EXIT_FLAGGED, limitsFrom, UsageError, type CliIo } from './common.js';

/**
 * `plumbline refit <data> --model "<formula>"`: rebuilds the ANOVA/ANCOVA
 * table from raw data, compares it with the reported numbers (--reported)
 * and names the usual slips that reproduce them.
 *
 * Exit codes: 0 when every reported number matches (or none is reported),
 * 1 when something differs, 2 for usage and input errors.
 */

type Format = 'text' | 'json' | 'md' | 'html' | 'docx';

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
  format: Format;
  output?: string;
}


/** Adds row and column to data-file errors that name only part of the place. */
export function refitErrorMessage(error: RefitError): string {
  const { file, row, column } = error.details;
  if (file === undefined) return error.message;
  const rest = (prefix: RegExp) => error.message.replace(prefix, '').trim();
  if (error.code === 'RAGGED_ROW' && row !== undefined && column === undefined) {
    const m = /(\d+) fields, but the header has (\d+) columns/.exec(error.message);
    if (m) {
      const fields = Number(m[1]);
      const width = Number(m[2]);
      const where = fields > width ? `column ${width + 1}` : `column ${fields + 1}`;
      return `${file}, row ${row}, ${where}: ${rest(/^[^:]*:\s*/)}`;
    }
  }
  if (error.code === 'UNKNOWN_COLUMN' && row === undefined && column !== undefined && error.message.startsWith(`${file}:`)) {
    return `${file}, row 1 (header), column '${column}': ${rest(/^[^:]*:\s*/)}`;
  }
  if (error.code === 'EMPTY_FILE' && row === undefined) {
    const r = /no data rows/.test(error.message) ? 2 : 1;
    return `${file}, row ${r}, column 1: ${rest(/^[^:]*:\s*/)}`;
  }
  return error.message;
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

function codesText(codes: unknown): string {
  return Array.isArray(codes) ? codes.join(',') : String(codes);
}

async function runRefit(dataFile: string, options: RefitOptions, io: CliIo): Promise<number> {
  if (options.format === 'docx' && options.output === undefined) throw new UsageError('--format docx writes a Word file: give it with --output <file.docx>');
  if (!existsSync(dataFile)) throw new UsageError(`${dataFile}: no such data file`);
  if (options.reported !== undefined && !existsSync(options.reported)) throw new UsageError(`--reported ${options.reported}: no such file`);
  // A FIFO or a device named as data, description or report would wait for ever or never end: only regular files are read.
  for (const [label, path] of [['', dataFile], ['--spec ', options.spec], ['--reported ', options.reported]] as const) {
    const reason = path === undefined ? null : await notRegularFileReason(path);
    if (reason !== null) throw new UsageError(`${label}${path}: ${reason}`);
  }
  const spec = buildSpec(options);
  // Reported rows printed with a display name (--name) match their terms; --map entries come first.
  const displayed = Object.entries((spec.names ?? {}) as Record<string, string>).map(([variable, name]) => `${name}=${variable}`);
  const map = parseTermMap([...displayed, ...options.map]);
  // Limits on reading the reported manuscript (its size, DOCX and PDF bounds, its time budget); refit takes no settings file.
  const limits = limitsFrom(undefined, options);
  const resolved = parseAnalysisSpec(spec); // validate before reading data

  const model = await fitModel(dataFile, spec, { keepOutcome: spec.levene !== undefined });
  const table = model.anova();
  const result: RefitResult = {
    dataFile,
    model,
    table,
    missing: Object.entries(spec.missing ?? {}).map(([column, codes]) => ({ column, codes: codesText(codes) })),
  };
  // Homogeneity of regression slopes: asked for, or by default in the text report of an ANCOVA.
  if (resolved.slopes === true || (resolved.slopes === undefined && options.format === 'text')) {
    const { testSlopes } = await import('../refit/assumptions.js');
    result.slopes = await testSlopes(dataFile, spec, model);
  }
  if (options.reported !== undefined) {
    const reported = await readReportedWithinBudget(options.reported, model.spec.formula.terms, map, limits ? { limits } : {});
    const comparison = compareTables(table, reported, map);
    result.reported = reported;
    result.comparison = comparison;
    result.impliedN = impliedSampleSize(table, reported);
    if (reported.means) {
      const { compareMeans } = await import('../refit/compareMeans.js');
      result.meansComparison = compareMeans(model, reported.means, map);
    }
    // A report with no ANOVA rows (means or comparisons only) has no table slip to search.
    if (!comparison.allMatch && comparison.compared + comparison.unmatched.length + comparison.ambiguous.length > 0) {
      const data = await loadTable(dataFile);
      result.explained = await explainMismatch(data, spec, model, comparison, reported, map);
    }
  }
  const output = buildRefitOutput(result);

  let text: string | Buffer;
  switch (options.format) {
    case 'json':
      text = `${JSON.stringify(output, null, 2)}\n`;
      break;
    case 'md':
      text = formatRefitMarkdown(output);
      break;
    case 'html':
      text = formatRefitHtml(output);
      break;
    case 'docx': {
      const { formatRefitDocx } = await import('../refit/formatDocx.js');
      text = await formatRefitDocx(output);
      break;
    }
    default:
      text = formatRefitText(output, { color: io.color && options.output === undefined });
  }
  if (options.output !== undefined) {
    await mkdir(dirname(options.output), { recursive: true });
    await writeFile(options.output, text);
    io.stderr(`plumbline refit: wrote ${options.output} (${options.format})\n`);
  } else {
    io.stdout(typeof text === 'string' ? text : text.toString('utf8'));
  }
  return output.verdict === 'differs' ? EXIT_FLAGGED : EXIT_CLEAN;
}

/** Name of the data file as shown in messages. */
export function dataName(path: string): string {
  return basename(path);
}

/** The refit command's work, loaded only when the command runs (it brings the data readers and the model). */
export async function runRefitCommand(dataFile: string, options: RefitOptions, io: CliIo): Promise<number> {
  try {
    return await runRefit(dataFile, options, io);
  } catch (error) {
    if (error instanceof RefitError) throw new UsageError(refitErrorMessage(error));
    throw error;
  }
}
