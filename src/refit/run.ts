import { compareTables } from './compare.js';
import type { DataSource } from './data.js';
import type { RefitError } from './errors.js';
import { explainMismatch, impliedSampleSize, loadTable } from './explain.js';
import type { FormulaTerm } from './formula.js';
import { fitModel } from './model.js';
import { buildRefitOutput, type RefitOutput, type RefitResult } from './output.js';
import { parseTermMap, type ReportedSet } from './reportedTable.js';
import { parseAnalysisSpec, type AnalysisSpecInput } from './spec.js';

/**
 * One refit from a data source that is already at hand: fits the model,
 * tests the slopes, compares with what the manuscript reports and searches
 * the slips. The refit command calls it with a path (after checking its
 * files); the web page with the text of the file the user chose. Reading
 * the reported table is the caller's (the command reads a file within a
 * time budget, the page reads the pasted text directly).
 */

export interface RefitRunOptions {
  /** How the data is named in the report (the path given, or the chosen file's name). */
  dataName: string;
  /** The text report tests the homogeneity of slopes unless told not to. */
  slopesByDefault: boolean;
  /** Reported names mapped to model terms (termMapOf). */
  map: Map<string, string>;
  /** Reads what the manuscript reports, for the model's terms; absent when nothing is reported. */
  readReported?: (terms: readonly FormulaTerm[]) => Promise<ReportedSet>;
}

/** Reported names mapped to terms: names shown with --name first match their variables, then the --map entries. */
export function termMapOf(spec: AnalysisSpecInput, mapEntries: readonly string[]): Map<string, string> {
  const displayed = Object.entries((spec.names ?? {}) as Record<string, string>).map(([variable, name]) => `${name}=${variable}`);
  return parseTermMap([...displayed, ...mapEntries]);
}

function codesText(codes: unknown): string {
  return Array.isArray(codes) ? codes.join(',') : String(codes);
}

/** Validates the description, fits the model and builds the report's output object. */
export async function refitOutputOf(source: DataSource, spec: AnalysisSpecInput, options: RefitRunOptions): Promise<RefitOutput> {
  const { map } = options;
  const resolved = parseAnalysisSpec(spec); // validate before reading data
  const model = await fitModel(source, spec, { keepOutcome: spec.levene !== undefined });
  const table = model.anova();
  const result: RefitResult = {
    dataFile: options.dataName,
    model,
    table,
    missing: Object.entries(spec.missing ?? {}).map(([column, codes]) => ({ column, codes: codesText(codes) })),
  };
  // Homogeneity of regression slopes: asked for, or by default in the text report of an ANCOVA.
  if (resolved.slopes === true || (resolved.slopes === undefined && options.slopesByDefault)) {
    const { testSlopes } = await import('./assumptions.js');
    result.slopes = await testSlopes(source, spec, model);
  }
  if (options.readReported !== undefined) {
    const reported = await options.readReported(model.spec.formula.terms);
    const comparison = compareTables(table, reported, map);
    result.reported = reported;
    result.comparison = comparison;
    result.impliedN = impliedSampleSize(table, reported);
    if (reported.means) {
      const { compareMeans } = await import('./compareMeans.js');
      result.meansComparison = compareMeans(model, reported.means, map);
    }
    // A report with no ANOVA rows (means or comparisons only) has no table slip to search.
    if (!comparison.allMatch && comparison.compared + comparison.unmatched.length + comparison.ambiguous.length > 0) {
      const data = await loadTable(source);
      result.explained = await explainMismatch(data, spec, model, comparison, reported, map);
    }
  }
  return buildRefitOutput(result);
}

function isDigit(code: number): boolean {
  return code >= 48 && code <= 57;
}

/**
 * The counts of a ragged-row message, "<n> fields, but the header has <m>
 * columns", read by walking the digits: a regular expression with an
 * unanchored run of digits backtracks quadratically on a long one (the
 * message holds the file's name).
 */
function raggedCounts(message: string): { fields: number; width: number } | null {
  const middle = ' fields, but the header has ';
  const at = message.indexOf(middle);
  if (at < 0) return null;
  let start = at;
  while (start > 0 && isDigit(message.charCodeAt(start - 1))) start--;
  const widthStart = at + middle.length;
  let end = widthStart;
  while (end < message.length && isDigit(message.charCodeAt(end))) end++;
  if (start === at || end === widthStart || !message.startsWith(' columns', end)) return null;
  return { fields: Number(message.slice(start, at)), width: Number(message.slice(widthStart, end)) };
}

/** Adds row and column to data-file errors that name only part of the place. */
export function refitErrorMessage(error: RefitError): string {
  const { file, row, column } = error.details;
  if (file === undefined) return error.message;
  const rest = (prefix: RegExp) => error.message.replace(prefix, '').trim();
  if (error.code === 'RAGGED_ROW' && row !== undefined && column === undefined) {
    const counts = raggedCounts(error.message);
    if (counts) {
      const { fields, width } = counts;
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
