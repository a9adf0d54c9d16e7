import { readFile, stat } from 'node:fs/promises';
import { basename, extname } from 'node:path';
import Papa from 'papaparse';
import { readDocument, tooLargeMessage, type ReadOptions } from '../documents/read.js';
import { MB, resolveLimits } from '../limits.js';
import { scanText } from '../scan/scan.js';
import type { Comparator, ReportedNumber } from '../scan/types.js';
import type { DocumentText } from '../documents/types.js';
import { parseReportedNumber } from '../stats/reportedNumber.js';
import { RefitError } from './errors.js';
import type { FormulaTerm } from './formula.js';
import { emptyMeansSet, isMeansHeader, readMeansRows, textComparisons, type ReportedMeansSet } from './reportedMeans.js';

/**
 * The numbers a manuscript reports for an ANOVA/ANCOVA, read from a table
 * file (CSV, TSV, Markdown pipe table) or from a manuscript (its tables and
 * its written "F(1, 44) = 4.21, p = .045" results). Every number keeps the
 * decimals it was printed with, so a comparison can allow for its rounding.
 */

export type Quantity = 'ss' | 'df' | 'ms' | 'F' | 'p' | 'partialEtaSquared';
export const QUANTITIES: readonly Quantity[] = ['ss', 'df', 'ms', 'F', 'p', 'partialEtaSquared'];

/** A printed number; `comparator` is "<" or ">" for "p < .001". */
export interface ReportedValue extends ReportedNumber {
  comparator: Comparator;
}

export interface ReportedRow {
  /** The row's label as printed ("Group × Dose", "Error"). */
  label: string;
  values: Partial<Record<Quantity, ReportedValue>>;
  /** Where the row came from, e.g. "table 1" or "text, line 14". */
  where: string;
}

export interface ReportedSet {
  /** The file the numbers were read from (as given). */
  file: string;
  /** Effect rows (everything but the error row, totals and the intercept). */
  rows: ReportedRow[];
  /** The error (residual, within) row, when reported. */
  residual: ReportedRow | null;
  /** What was read: "table file", "manuscript table 2", "manuscript text". */
  sources: string[];
  /** Reported adjusted means, pairwise comparisons and contrasts (reportedMeans.ts). */
  means: ReportedMeansSet;
}

// ---------------------------------------------------------------------------
// Column headers and row labels
// ---------------------------------------------------------------------------

function squash(text: string): string {
  return text
    .normalize('NFKC')
    .toLowerCase()
    .replace(/[²₂]/g, '2')
    .replace(/[_'’`.]/g, '')
    .replace(/\s+/g, ' ')
    .trim();
}

/**
 * The header without a parenthesis at its end ("F (1, 40)" -> "F"): what
 * .replace(/\s*\(.*\)\s*$/, '') does, without that pattern's quadratic time
 * on long runs of spaces.
 */
function withoutTrailingParenthesis(text: string): string {
  const end = text.trimEnd();
  if (!end.endsWith(')')) return text;
  const lastBreak = Math.max(end.lastIndexOf('\n'), end.lastIndexOf('\r'), end.lastIndexOf('\u2028'), end.lastIndexOf('\u2029'));
  const open = end.indexOf('(', lastBreak + 1);
  return open === -1 ? text : end.slice(0, open).trimEnd();
}

/** What a column header means: the label column, a quantity, or null (ignored). */
export function columnMeaning(header: string): 'label' | Quantity | null {
  const h = withoutTrailingParenthesis(squash(header));
  if (h === '' || /^(source|sources|effect|effects|term|terms|variable|predictor|source of variation|variation)$/.test(h)) return 'label';
  if (/^(ss|sum sq|sumsq|sum of squares|sums of squares|type (i|ii|iii|1|2|3) (sum of squares|ss)|(i|ii|iii) ss)$/.test(h)) return 'ss';
  if (/^(df|d ?f|dof|degrees of freedom)$/.test(h)) return 'df';
  if (/^(ms|mean sq|mean square|mean squares)$/.test(h)) return 'ms';
  if (/^(f|f value|f ratio|f-value|f-ratio|f statistic)$/.test(h)) return 'F';
  if (/^(p|p value|p-value|sig|significance|pr|pr\(>f\)|pr ?> ?f|prob|probability)$/.test(h)) return 'p';
  if (
    /^(partial eta squared|partial eta sq|partial eta2|partial eta\^2|partial η2|partial η\^2|ηp2|η2p|ηp\^2|η\^2p|η2 ?partial|ηp|eta2p|etap2|eta2 partial|pes|np2|partial eta-squared)$/.test(h)
  ) {
    return 'partialEtaSquared';
  }
  return null;
}

const RESIDUAL_LABEL = /^(error|errors|residual|residuals|within|within groups|within-groups|error \(within\)|within \(error\)|error term|s\/a)$/;
const SKIPPED_LABEL = /^(total|corrected total|intercept|\(intercept\)|constant|model|corrected model|between groups|regression)$/;

/** Cleans a label: footnote marks, "Main effect of", surrounding spaces. */
function cleanLabel(label: string): string {
  return label
    .normalize('NFKC')
    .replace(/(?<![*†‡§])[*†‡§]+$/u, '')
    .replace(/^(main effect of|main effect|effect of)\s+/i, '')
    .trim();
}

export function isResidualLabel(label: string): boolean {
  return RESIDUAL_LABEL.test(squash(cleanLabel(label)));
}

function isSkippedLabel(label: string): boolean {
  return SKIPPED_LABEL.test(squash(cleanLabel(label)));
}

/** Parses "--map" entries "reported name=term" into a normalised lookup. */
export function parseTermMap(entries: readonly string[]): Map<string, string> {
  const map = new Map<string, string>();
  for (const entry of entries) {
    const eq = entry.lastIndexOf('=');
    if (eq <= 0 || eq === entry.length - 1) {
      throw new RefitError('INVALID_SPEC', `--map "${entry}": write it as "<reported name>=<term>", e.g. "Teaching method=method".`, { field: 'map' });
    }
    map.set(squash(entry.slice(0, eq)), entry.slice(eq + 1).trim());
  }
  return map;
}

/** Splits a printed interaction label into its parts ("Group × Dose", "group*dose", "group:dose", "Group by Dose"). */
function labelParts(label: string): string[] {
  return squash(label)
    .split(/(?<!\s)\s*(?:×|:|\*|\bx\b|\bby\b|(?<=\s)\/(?=\s))\s*/u)
    .map((s) => s.trim())
    .filter((s) => s.length > 0);
}

/** How a reported row label was matched to its term. */
export type MatchedBy = 'name' | 'map' | 'abbreviation';

/** What a printed row label names: one term, several (ambiguous: never guessed), or nothing. */
export type TermMatch =
  | { kind: 'term'; term: FormulaTerm; by: MatchedBy }
  | { kind: 'ambiguous'; candidates: FormulaTerm[] }
  | { kind: 'none' };

/** A name squashed to letters and digits ("Start height", "start_height" -> "startheight"). */
function nameKey(text: string): string {
  return squash(text).replace(/\s+/g, '');
}

/**
 * True when the printed name abbreviates the variable's: it is shorter,
 * starts with the same character and its characters appear in the
 * variable's in order ("g" and "grp" for "group", "dos" for "dosage"; a
 * longer printed name such as "Age group" never matches "age"). A linear
 * walk, no regular expression.
 */
export function abbreviates(short: string, long: string): boolean {
  if (short.length >= long.length) return false;
  if (short.length === 0 || short === long || short[0] !== long[0]) return false;
  let at = 0;
  for (const ch of long) if (ch === short[at]) at++;
  return at >= short.length;
}

/**
 * The model term a printed row label names: case-insensitive, with "x",
 * "×", "*", ":" and "by" read as ":" for interactions (in any order), the
 * --map names (whole labels or parts of interactions, display names among
 * them) taken first, then exact names, then abbreviations ("Grp", "G" for
 * "group"). A label whose parts could name several terms is ambiguous and
 * is not matched.
 */
export function matchTermDetailed(label: string, terms: readonly FormulaTerm[], map: ReadonlyMap<string, string> = new Map()): TermMatch {
  const cleaned = cleanLabel(label);
  const whole = map.get(squash(cleaned));
  if (whole !== undefined) {
    const hit = byNames(whole, terms, map, false);
    return hit.kind === 'term' ? { ...hit, by: 'map' } : hit;
  }
  return byNames(cleaned, terms, map, true);
}

function byNames(name: string, terms: readonly FormulaTerm[], map: ReadonlyMap<string, string>, abbreviations: boolean): TermMatch {
  const exact = terms.find((t) => t.name.toLowerCase() === name.trim().toLowerCase());
  if (exact !== undefined) return { kind: 'term', term: exact, by: 'name' };
  // Both sides are compared squashed ("start_height", "start.height" and "Start height" are one name once "_", "." and case
  // and spaces are set aside), so a variable named with "_" or "." matches its printed row and a --map naming it.
  const whole = terms.find((t) => nameKey(t.name) === nameKey(name));
  if (whole !== undefined) return { kind: 'term', term: whole, by: 'name' };
  const parts = labelParts(name);
  if (parts.length === 0) return { kind: 'none' };
  const variables = [...new Set(terms.flatMap((t) => t.variables))];
  let by: MatchedBy = 'name';
  // The variables each printed part may name: through --map, by its name, else (when allowed) as an abbreviation.
  const options = parts.map((part) => {
    const mapped = map.get(part);
    if (mapped !== undefined) {
      by = by === 'name' ? 'map' : by;
      return variables.filter((v) => nameKey(v) === nameKey(mapped));
    }
    const named = variables.filter((v) => nameKey(v) === nameKey(part));
    if (named.length > 0 || !abbreviations) return named;
    const short = variables.filter((v) => abbreviates(nameKey(part), nameKey(v)));
    if (short.length > 0) by = 'abbreviation';
    return short;
  });
  if (options.some((o) => o.length === 0)) return { kind: 'none' };
  const candidates = terms.filter(
    (t) => t.variables.length === parts.length && assignable(options, t.variables),
  );
  if (candidates.length === 1) return { kind: 'term', term: candidates[0]!, by };
  return candidates.length === 0 ? { kind: 'none' } : { kind: 'ambiguous', candidates };
}

/** True when each part can be given a different one of `variables` from its options (a small matching, parts are few). */
function assignable(options: readonly string[][], variables: readonly string[]): boolean {
  const walk = (i: number, used: Set<string>): boolean => {
    if (i === options.length) return true;
    for (const v of options[i]!) {
      if (!variables.includes(v) || used.has(v)) continue;
      used.add(v);
      if (walk(i + 1, used)) return true;
      used.delete(v);
    }
    return false;
  };
  return options.length <= 8 && walk(0, new Set());
}

/** The model term a printed row label names, or null (none, or ambiguous: see matchTermDetailed). */
export function matchTerm(label: string, terms: readonly FormulaTerm[], map: ReadonlyMap<string, string> = new Map()): FormulaTerm | null {
  const hit = matchTermDetailed(label, terms, map);
  return hit.kind === 'term' ? hit.term : null;
}

// ---------------------------------------------------------------------------
// Cells
// ---------------------------------------------------------------------------

/** Reads one printed cell: ".003", "< .001", "4.21**", "(4.21)"; null for blanks and dashes. */
export function parseCell(text: string): ReportedValue | null {
  let s = text
    .normalize('NFKC')
    .replace(/[\u2212\u2013\u2014]/g, '-')
    .replace(/^\s*[pP]\s*(?=[<>=])/, '')
    .replace(/(?<![*†‡§])[*†‡§]+$/u, '')
    .replace(/(?<=\d)[a-z]$/, '')
    .trim();
  if (/^\(.*\)$/.test(s)) s = s.slice(1, -1).trim();
  let comparator: Comparator = '=';
  const cmp = /^(<=|>=|≤|≥|<|>|=)\s*/.exec(s);
  if (cmp) {
    comparator = cmp[1] === '≤' ? '<=' : cmp[1] === '≥' ? '>=' : (cmp[1] as Comparator);
    s = s.slice(cmp[0].length);
  }
  const number = parseReportedNumber(s);
  return number === null ? null : { ...number, comparator };
}

// ---------------------------------------------------------------------------
// Tables (rows of cell strings)
// ---------------------------------------------------------------------------

/** A table read as an ANOVA table: its effect rows and its error row. */
export interface ReadTable {
  rows: ReportedRow[];
  residual: ReportedRow | null;
}

/**
 * Reads rows of cell strings (header rows included) as an ANOVA table: the
 * header is the first of the first rows that names at least two quantities;
 * the label column is the one headed "Source" (or similar, or empty), else
 * the first. Returns null when no such header is found.
 */
export function readAnovaRows(cells: readonly (readonly string[])[], where: string): ReadTable | null {
  for (let h = 0; h < Math.min(cells.length, 4); h++) {
    const header = cells[h]!;
    const meanings = header.map(columnMeaning);
    const quantities = meanings.filter((m) => m !== null && m !== 'label');
    if (new Set(quantities).size < 2) continue;
    let labelColumn = meanings.indexOf('label');
    if (labelColumn < 0) labelColumn = 0;
    const rows: ReportedRow[] = [];
    let residual: ReportedRow | null = null;
    for (const row of cells.slice(h + 1)) {
      const label = (row[labelColumn] ?? '').trim();
      if (label === '' || isSkippedLabel(label)) continue;
      const values: Partial<Record<Quantity, ReportedValue>> = {};
      meanings.forEach((meaning, c) => {
        if (meaning === null || meaning === 'label' || c === labelColumn) return;
        if (values[meaning] !== undefined) return;
        const value = parseCell(row[c] ?? '');
        if (value !== null) values[meaning] = value;
      });
      if (Object.keys(values).length === 0) continue;
      const entry = { label, values, where };
      if (isResidualLabel(label)) residual ??= entry;
      else rows.push(entry);
    }
    if (rows.length === 0 && residual === null) continue;
    return { rows, residual };
  }
  return null;
}

/** A header naming at least two ANOVA quantities. */
function anovaHeader(cells: string[]): boolean {
  return new Set(cells.map(columnMeaning).filter((m) => m !== null && m !== 'label')).size >= 2;
}

/** Tables written in plain text or Markdown: pipe tables, or columns separated by tabs or 2+ spaces. */
export function tablesInText(text: string, isHeader: (cells: string[]) => boolean = anovaHeader): Array<{ cells: string[][]; line: number }> {
  const lines = text.split(/\r?\n/);
  const found: Array<{ cells: string[][]; line: number }> = [];
  const split = (line: string): string[] | null => {
    const t = line.trim();
    if (t.includes('|')) {
      return t.replace(/^\|/, '').replace(/\|$/, '').split('|').map((c) => c.trim());
    }
    const parts = t.split(/\t|\s{2,}/).map((c) => c.trim());
    return parts.length >= 3 ? parts : null;
  };
  const isRule = (line: string) => /^\s*(?:\|\s*)?:?-{2,}:?(?:\s*\|\s*:?-{2,}:?)*\s*(?:\|\s*)?$/.test(line) || /^\s*[-=─━_]{5,}\s*$/.test(line);
  for (let i = 0; i < lines.length; i++) {
    const header = split(lines[i]!);
    if (!header || !isHeader(header)) continue;
    const cells = [header];
    let j = i + 1;
    for (; j < lines.length; j++) {
      const line = lines[j]!;
      if (isRule(line)) continue;
      if (line.trim() === '') break;
      const row = split(line);
      if (!row) break;
      // Split on spaces, a row loses its blank cells: a blank label when it starts with a number
      // (pad on the left), blank trailing cells (F, p of an error row) otherwise.
      if (!line.includes('|')) {
        const startsWithNumber = parseCell(row[0] ?? '') !== null;
        while (row.length < header.length) {
          if (startsWithNumber) row.unshift('');
          else row.push('');
        }
      }
      cells.push(row);
    }
    found.push({ cells, line: i + 1 });
    i = j - 1;
  }
  return found;
}

// ---------------------------------------------------------------------------
// Written results
// ---------------------------------------------------------------------------

function lineOf(text: string, offset: number): number {
  let line = 1;
  for (let i = 0; i < offset && i < text.length; i++) if (text.charCodeAt(i) === 10) line++;
  return line;
}

/**
 * The F results written in running text, each assigned to the model term its
 * sentence names (the last term named before the result in the same
 * sentence; an interaction when the sentence says "interaction" and names
 * all its variables). Results that name no term are left out.
 */
export function textResults(text: string, terms: readonly FormulaTerm[], map: ReadonlyMap<string, string> = new Map()): Array<{ term: FormulaTerm; row: ReportedRow; errorDf: ReportedValue | null }> {
  const out: Array<{ term: FormulaTerm; row: ReportedRow; errorDf: ReportedValue | null }> = [];
  const { results } = scanText(text);
  let previousEnd = 0;
  for (const result of results) {
    if (result.kind !== 'F' || result.value === null) {
      previousEnd = result.end;
      continue;
    }
    // The clause before the result, back to the previous result or the start of the sentence.
    const from = Math.max(previousEnd, result.start - 240);
    let window = text.slice(from, result.start);
    const sentence = Math.max(window.lastIndexOf('. '), window.lastIndexOf('.\n'), window.lastIndexOf('; '));
    if (sentence >= 0) window = window.slice(sentence + 1);
    previousEnd = result.end;
    const term = termInWindow(window, terms, map);
    if (term === null) continue;
    const values: Partial<Record<Quantity, ReportedValue>> = { F: { ...result.value, comparator: result.valueComparator } };
    const df1 = result.df[0];
    if (df1) values.df = { ...df1, comparator: '=' };
    if (result.p) values.p = { ...result.p.value, comparator: result.p.comparator };
    const pes = result.effects.find((e) => e.kind === 'partial-eta-squared');
    if (pes) values.partialEtaSquared = { ...pes.value, comparator: pes.comparator };
    const df2 = result.df[1];
    out.push({
      term,
      row: { label: result.text, values, where: `text, line ${lineOf(text, result.start)}` },
      errorDf: df2 ? { ...df2, comparator: '=' } : null,
    });
  }
  return out;
}

function escapeRegExp(s: string): string {
  return s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}

function termInWindow(window: string, terms: readonly FormulaTerm[], map: ReadonlyMap<string, string>): FormulaTerm | null {
  const lower = window.normalize('NFKC').toLowerCase();
  // Names that stand for each variable: the variable itself and any --map name pointing at it.
  const namesOf = (variable: string): string[] => {
    const names = [variable.toLowerCase()];
    for (const [reported, target] of map) if (target.toLowerCase() === variable.toLowerCase()) names.push(reported);
    return names;
  };
  const lastMention = (variable: string): number => {
    let best = -1;
    for (const name of namesOf(variable)) {
      const re = new RegExp(`(?<![\\p{L}\\p{N}_])${escapeRegExp(name)}(?![\\p{L}\\p{N}_])`, 'gu');
      for (const m of lower.matchAll(re)) best = Math.max(best, m.index);
    }
    return best;
  };
  // A --map name for a whole interaction term ("the crossover effect=route:pace").
  for (const [reported, target] of map) {
    if (target.includes(':') && lower.includes(reported)) {
      const hit = matchTerm(target, terms);
      if (hit) return hit;
    }
  }
  if (/interaction|×|\bx\b|\bby\b/.test(lower)) {
    const interactions = terms
      .filter((t) => t.variables.length > 1 && t.variables.every((v) => lastMention(v) >= 0))
      .sort((a, b) => b.variables.length - a.variables.length);
    if (interactions[0]) return interactions[0];
  }
  let best: FormulaTerm | null = null;
  let bestAt = -1;
  for (const t of terms) {
    if (t.variables.length !== 1) continue;
    const at = lastMention(t.variables[0]!);
    if (at > bestAt) {
      best = t;
      bestAt = at;
    }
  }
  return best;
}

// ---------------------------------------------------------------------------
// Files
// ---------------------------------------------------------------------------

const TABLE_FILE_EXTENSIONS = new Set(['.csv', '.tsv']);

function readDelimited(path: string, text: string): string[][] {
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { skipEmptyLines: 'greedy', delimiter: extname(path).toLowerCase() === '.tsv' ? '\t' : '' });
  return parsed.data.map((row) => row.map((c) => String(c)));
}

/**
 * Reads what a file reports. A .csv/.tsv file is one ANOVA table; any other
 * file is read as a manuscript (readDocument): every table in it that reads
 * as an ANOVA table (its own tables for DOCX/HTML/JATS/LaTeX, tables found in
 * the text for Markdown, plain text and PDF), the one that names the most
 * model terms taken, then written F results for terms the table lacks.
 */
export async function readReported(
  path: string,
  terms: readonly FormulaTerm[],
  map: ReadonlyMap<string, string> = new Map(),
  readOptions: ReadOptions = {},
): Promise<ReportedSet> {
  const file = basename(path);
  const ext = extname(path).toLowerCase();
  if (TABLE_FILE_EXTENSIONS.has(ext)) {
    let text: string;
    try {
      // A table file is read whole: one larger than a document may be is refused before it is read.
      const { size } = await stat(path);
      const { maxDocumentMb } = resolveLimits(readOptions.limits);
      if (size > maxDocumentMb * MB) throw new RefitError('UNREADABLE_FILE', `${file}: cannot be read (${tooLargeMessage(size, resolveLimits(readOptions.limits))}).`, { file });
      text = await readFile(path, 'utf8');
    } catch (error) {
      if (error instanceof RefitError) throw error;
      throw new RefitError('UNREADABLE_FILE', `${file}: cannot be read (${(error as NodeJS.ErrnoException).code ?? (error as Error).message}).`, { file });
    }
    // Tables are separated by blank lines: an ANOVA table, and tables of means, comparisons or contrasts.
    const means = emptyMeansSet();
    let table: ReadTable | null = null;
    const blocks = tableFileBlocks(text);
    for (const block of blocks) {
      const cells = readDelimited(path, block.text);
      const where = blocks.length > 1 ? `table file, line ${block.line}` : 'table file';
      if (readMeansRows(cells, where, means)) continue;
      table ??= readAnovaRows(cells, where);
    }
    if (table === null && means.means.length + means.comparisons.length + means.contrasts.length === 0) {
      throw new RefitError(
        'INVALID_SPEC',
        `${file}, row 1: no table header found; name the columns of an ANOVA table like Source, SS, df, MS, F, p, partial eta squared, of adjusted means like <factor>, M, SE, 95% CI, of comparisons like Comparison, Difference, SE, t, p, or of contrasts like Contrast, Weights, Estimate, SE, t, p (tables separated by a blank line).`,
        { file, row: 1 },
      );
    }
    return { file: path, rows: table?.rows ?? [], residual: table?.residual ?? null, sources: ['table file'], means };
  }

  const outcome = await readDocument(path, readOptions);
  if (!outcome.ok) throw new RefitError('UNREADABLE_FILE', `${file}: cannot be read (${outcome.error}).`, { file });
  return reportedInDocument(path, outcome.document, terms, map);
}

/**
 * What a manuscript already read reports (the web page reads the pasted
 * table itself): its ANOVA table that names the most model terms, written F
 * results for the terms that table lacks, and its means and comparisons.
 */
export function reportedInDocument(path: string, document: DocumentText, terms: readonly FormulaTerm[], map: ReadonlyMap<string, string> = new Map()): ReportedSet {
  const file = basename(path);
  const candidates: Array<{ table: ReadTable; name: string }> = [];
  const means = emptyMeansSet();
  document.tables.forEach((t, i) => {
    if (readMeansRows(t.rows, `table ${i + 1}`, means)) return;
    const read = readAnovaRows(t.rows, `table ${i + 1}`);
    if (read) candidates.push({ table: read, name: `table ${i + 1}${t.caption ? ` (${t.caption.slice(0, 60)})` : ''}` });
  });
  if (candidates.length === 0) {
    for (const t of tablesInText(document.text)) {
      if (readMeansRows(t.cells, `table at line ${t.line}`, means)) continue;
      const read = readAnovaRows(t.cells, `table at line ${t.line}`);
      if (read) candidates.push({ table: read, name: `table at line ${t.line}` });
    }
  }
  const score = (t: ReadTable) => t.rows.filter((r) => matchTerm(r.label, terms, map) !== null).length;
  candidates.sort((a, b) => score(b.table) - score(a.table));
  const best = candidates[0] && score(candidates[0].table) > 0 ? candidates[0] : undefined;
  const rows = best ? best.table.rows.slice() : [];
  let residual = best ? best.table.residual : null;
  const sources = best ? [`manuscript ${best.name}`] : [];
  const covered = new Set(rows.map((r) => matchTerm(r.label, terms, map)?.name).filter((n) => n !== undefined));
  let usedText = false;
  for (const { term, row, errorDf } of textResults(document.text, terms, map)) {
    if (covered.has(term.name)) continue;
    covered.add(term.name);
    rows.push({ ...row, label: term.name });
    if (residual === null && errorDf !== null) residual = { label: 'error df of the written result', values: { df: errorDf }, where: row.where };
    usedText = true;
  }
  if (usedText) sources.push('manuscript text');
  if (document.tables.length === 0) {
    for (const t of tablesInText(document.text, isMeansHeader)) readMeansRows(t.cells, `table at line ${t.line}`, means);
  }
  textComparisons(document.text, means);
  const meansRead = means.means.length + means.contrasts.length + means.comparisons.filter((c) => c.first !== null).length;
  if (meansRead > 0 && !sources.includes('manuscript table of means or comparisons')) sources.push('manuscript table of means or comparisons');
  if (rows.length === 0 && meansRead === 0) {
    throw new RefitError(
      'INVALID_SPEC',
      `${file}: found no ANOVA table and no written F results naming a model term (${terms.map((t) => t.name).join(', ')}); use --map "<reported name>=<term>" when the manuscript names them differently.`,
      { file },
    );
  }
  return { file: path, rows, residual, sources, means };
}

/** The blocks of a table file separated by blank lines, with the line each starts on. */
function tableFileBlocks(text: string): Array<{ text: string; line: number }> {
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\r|\n/);
  const blocks: Array<{ text: string; line: number }> = [];
  let current: string[] = [];
  let start = 1;
  lines.forEach((line, i) => {
    if (line.trim() === '' || /^[,;\t ]+$/.test(line)) {
      if (current.length > 0) blocks.push({ text: current.join('\n'), line: start });
      current = [];
      start = i + 2;
    } else current.push(line);
  });
  if (current.length > 0) blocks.push({ text: current.join('\n'), line: start });
  return blocks;
}
