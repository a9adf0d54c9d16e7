import { readAdjustment } from '../scan/pAdjustment.js';
import { scanText } from '../scan/scan.js';
import type { PAdjustmentMethod } from '../scan/types.js';
import { parseCell, type ReportedValue } from './reportedTable.js';

/**
 * Adjusted (estimated marginal) means, pairwise comparisons and planned
 * contrasts as a manuscript reports them, read from tables (a table file's
 * blocks, a manuscript's tables) and from written t results that name two
 * levels. What is read stays as printed: level names, comparison names and
 * the numbers with their decimals; matching them to the model's levels is
 * left to compareMeans.ts, which has the model.
 *
 * A table is recognised by its header:
 * - means: a mean column ("M", "Mean", "Adjusted M", "EMM", "LS mean") and
 *   at least one other text column (the factors' levels, one column per factor);
 * - pairwise comparisons: a "Comparison" (or "Pair", "Contrast between") column
 *   holding "harbour - park" (also "vs", "–", "−");
 * - planned contrasts: a "Contrast" column and a "Weights" column
 *   ("route=0.5,0.5,-1" or "0.5, 0.5, -1" with a "Term" column), or a contrast
 *   named as in the analysis description.
 * Number columns: SE, t, df, p, "Difference" / "Estimate", lower and upper
 * bounds ("LL", "UL", "Lower", "Upper") or one "95% CI" column ("[1.2, 3.4]").
 * A p column headed with an adjustment ("p (Bonferroni)", "p_tukey") or a
 * table's "Adjustment" column states the adjustment the authors used.
 */

export type MeanQuantity = 'mean' | 'estimate' | 'se' | 't' | 'df' | 'p' | 'lower' | 'upper';
export const MEAN_QUANTITIES: readonly MeanQuantity[] = ['mean', 'estimate', 'se', 't', 'df', 'p', 'lower', 'upper'];

export interface ReportedMeanRow {
  /** Headers of the level columns (factor names as printed), in order. */
  factors: string[];
  /** The level printed in each of those columns. */
  levels: string[];
  /** A mean written in the text: the words before it, in which compareMeans.ts looks for the level it is of. */
  clause?: string;
  values: Partial<Record<MeanQuantity, ReportedValue>>;
  where: string;
}

export interface ReportedComparisonRow {
  /** "harbour - park" as printed, or the clause of a written result. */
  label: string;
  /** The two sides, when printed as "a - b"; null for a written result (its clause names the levels). */
  first: string | null;
  second: string | null;
  values: Partial<Record<MeanQuantity, ReportedValue>>;
  /** The adjustment stated with this row or its table, null when none is. */
  adjust: PAdjustmentMethod | null;
  /** A simple comparison: the level of another factor within which it is made, from a text column ("Pace | self"). */
  within?: { header: string; level: string };
  where: string;
}

export interface ReportedContrastRow {
  name: string;
  /** "route" or "route:pace" when the weights are given with their term. */
  term: string | null;
  weights: number[] | null;
  values: Partial<Record<MeanQuantity, ReportedValue>>;
  where: string;
}

export interface ReportedMeansSet {
  means: ReportedMeanRow[];
  comparisons: ReportedComparisonRow[];
  contrasts: ReportedContrastRow[];
  /** A statement in the manuscript's text of how post hoc p were adjusted (null when none or a table file). */
  statedAdjustment: { method: PAdjustmentMethod; where: string } | null;
}

export function emptyMeansSet(): ReportedMeansSet {
  return { means: [], comparisons: [], contrasts: [], statedAdjustment: null };
}

function squash(text: string): string {
  return text.normalize('NFKC').toLowerCase().replace(/[_.]/g, ' ').replace(/\s+/g, ' ').trim();
}

type Column = MeanQuantity | 'ci' | 'comparison' | 'contrast' | 'weights' | 'term' | 'adjust' | 'text';

/** What a header of a means, comparisons or contrasts table means ("text" for a level column or anything else). */
export function meansColumnMeaning(header: string): Column {
  const h = squash(header);
  const open = h.lastIndexOf('(');
  const bare = h.endsWith(')') && open >= 0 ? h.slice(0, open).trim() : h;
  if (/^(comparison|comparisons|pair|pairwise comparison|contrast between)$/.test(bare)) return 'comparison';
  if (/^(contrast|contrasts|planned contrast)$/.test(bare)) return 'contrast';
  if (/^(weights|contrast weights|coefficients)$/.test(bare)) return 'weights';
  if (/^(term|effect|factor)$/.test(bare)) return 'term';
  if (/^(adjustment|adjust|correction|method)$/.test(bare)) return 'adjust';
  if (/^(m|mean|means|adjusted m|adjusted mean|adjusted means|adj m|emm|emmean|estimated marginal mean|marginal mean|ls mean|lsmean|least squares mean|m adj|madj)$/.test(bare)) return 'mean';
  if (/^(difference|diff|mean difference|md|estimate|est|δ|Δ|m diff)$/.test(bare)) return 'estimate';
  if (/^(se|s e|std error|std err|standard error|se diff|se of difference)$/.test(bare)) return 'se';
  if (/^(t|t value|t ratio|t-ratio|t-value)$/.test(bare)) return 't';
  if (/^(df|d f)$/.test(bare)) return 'df';
  if (/^(p|p value|p-value|pr|sig|p adj|p adjusted|adjusted p|padj|p-adj)$/.test(bare) || /^p[ -]?(tukey|bonferroni|bonf|holm|sidak|šidák|scheffe|scheffé)$/.test(bare)) return 'p';
  if (/^((\d{2}% )?ci (lower|ll)|lower|ll|lower bound|lower limit|lcl)$/.test(bare)) return 'lower';
  if (/^((\d{2}% )?ci (upper|ul)|upper|ul|upper bound|upper limit|ucl)$/.test(bare)) return 'upper';
  if (/^(\d{2}% )?(ci|confidence interval)$/.test(bare)) return 'ci';
  return 'text';
}

/** The adjustment a p column's header names ("p (Bonferroni)", "p_tukey"), else null. */
function headerAdjustment(header: string): PAdjustmentMethod | null {
  const reading = readAdjustment(header.replace(/_/g, ' '), false);
  return reading && reading.method !== 'unspecified' ? reading.method : null;
}

/** "[1.20, 3.90]", "1.20, 3.90", "(1.20; 3.90)" -> both bounds. */
function parseInterval(text: string): [ReportedValue, ReportedValue] | null {
  const inner = text.trim().replace(/^[[(]/, '').replace(/[\])]$/, '');
  const parts = inner.split(/[,;]|\s(?:to|–)\s/);
  if (parts.length !== 2) return null;
  const low = parseCell(parts[0]!);
  const high = parseCell(parts[1]!);
  return low && high ? [low, high] : null;
}

/** "harbour - park", "harbour vs. park", "harbour – park" -> the two sides. */
export function splitComparison(text: string): [string, string] | null {
  const t = text.normalize('NFKC').replace(/[\u2212\u2013\u2014]/g, '-');
  for (const sep of [' vs. ', ' vs ', ' versus ', ' - ']) {
    const at = t.toLowerCase().indexOf(sep);
    if (at > 0) {
      const a = t.slice(0, at).trim();
      const b = t.slice(at + sep.length).trim();
      if (a !== '' && b !== '') return [a, b];
    }
  }
  return null;
}

/** "route=0.5,0.5,-1" or "0.5, 0.5, -1" (fractions "1/3" allowed) -> term and weights. */
export function parseWeights(text: string): { term: string | null; weights: number[] } | null {
  const eq = text.indexOf('=');
  const term = eq > 0 ? text.slice(0, eq).trim() : null;
  const pieces = text.slice(eq + 1).split(/[,;]/).map((w) => w.trim());
  const weights = pieces.map((piece) => {
    const [a, b, ...rest] = piece.split('/');
    if (rest.length > 0) return NaN;
    const x = parseCell(a ?? '')?.value ?? NaN;
    return b === undefined ? x : x / (parseCell(b)?.value ?? NaN);
  });
  return weights.length >= 2 && weights.every(Number.isFinite) ? { term, weights } : null;
}

/** A header of a means, comparisons or contrasts table (tablesInText finds such tables in plain text and Markdown). */
export function isMeansHeader(cells: readonly string[]): boolean {
  const meanings = cells.map(meansColumnMeaning);
  return meanings.includes('comparison') || (meanings.includes('contrast') && (meanings.includes('weights') || meanings.includes('estimate'))) || (meanings.includes('mean') && meanings.includes('text'));
}

/** Reads rows of cells (header first, within the first rows) as a means, comparisons or contrasts table; appends to `into`. */
export function readMeansRows(cells: readonly (readonly string[])[], where: string, into: ReportedMeansSet): boolean {
  for (let h = 0; h < Math.min(cells.length, 3); h++) {
    const header = cells[h]!;
    const meanings = header.map(meansColumnMeaning);
    const has = (m: Column) => meanings.includes(m);
    const numberColumns = meanings.filter((m) => (MEAN_QUANTITIES as readonly string[]).includes(m) || m === 'ci').length;
    const kind = has('comparison') ? 'comparison' : has('contrast') && (has('weights') || has('estimate')) ? 'contrast' : has('mean') && meanings.some((m) => m === 'text') ? 'mean' : null;
    if (kind === null || numberColumns < 1) continue;
    const pAdjust = meanings.map((m, c) => (m === 'p' ? headerAdjustment(header[c]!) : null)).find((a) => a !== null) ?? null;
    const before = into.means.length + into.comparisons.length + into.contrasts.length;
    for (const row of cells.slice(h + 1)) {
      const values: Partial<Record<MeanQuantity, ReportedValue>> = {};
      const texts: string[] = [];
      const textHeads: string[] = [];
      let label = '';
      let weights: string | null = null;
      let term: string | null = null;
      let adjust: PAdjustmentMethod | null = pAdjust;
      meanings.forEach((m, c) => {
        const cell = (row[c] ?? '').trim();
        if (m === 'comparison' || m === 'contrast') label = cell;
        else if (m === 'weights') weights = cell;
        else if (m === 'term') term = cell;
        else if (m === 'adjust') adjust = headerAdjustment(cell) ?? adjust;
        else if (m === 'ci') {
          const ci = parseInterval(cell);
          if (ci) [values.lower, values.upper] = ci;
        } else if (m === 'text') {
          texts.push(cell);
          textHeads.push(header[c]!.trim());
        } else if (values[m] === undefined) {
          const v = parseCell(cell);
          if (v !== null) values[m] = v;
        }
      });
      if (Object.keys(values).length === 0) continue;
      if (kind === 'mean') {
        if (texts.every((t) => t === '')) continue;
        into.means.push({ factors: textHeads, levels: texts, values, where });
      } else if (kind === 'comparison') {
        const sides = splitComparison(label);
        if (sides === null) continue;
        // A text column beside the comparison names the level of another factor it is made within.
        const withinAt = texts.findIndex((text) => text !== '');
        const within = withinAt >= 0 ? { header: textHeads[withinAt]!, level: texts[withinAt]! } : null;
        into.comparisons.push({ label, first: sides[0], second: sides[1], values, adjust, where, ...(within ? { within } : {}) });
      } else {
        if (label === '' && weights === null) continue;
        const parsed = weights === null ? parseWeights(label) : parseWeights(weights);
        into.contrasts.push({ name: label, term: term ?? parsed?.term ?? null, weights: parsed?.weights ?? null, values, where });
      }
    }
    if (into.means.length + into.comparisons.length + into.contrasts.length > before) return true;
  }
  return false;
}

function lineOf(text: string, offset: number): number {
  let line = 1;
  for (let i = 0; i < offset && i < text.length; i++) if (text.charCodeAt(i) === 10) line++;
  return line;
}

/**
 * Written t results that may be pairwise comparisons ("harbour and park
 * differed, t(125) = 1.98, p = .121"): each kept with the clause before it,
 * in which compareMeans.ts looks for two levels of one factor; and the
 * manuscript's statement of how post hoc p were adjusted.
 */
export function textComparisons(text: string, into: ReportedMeansSet): void {
  textMeans(text, into);
  const { results, context } = scanText(text);
  const stated = (context.pAdjustments ?? []).find((a) => a.method !== 'unspecified');
  if (stated) into.statedAdjustment = { method: stated.method, where: `text, line ${lineOf(text, stated.start)}` };
  let previousEnd = 0;
  for (const result of results) {
    const from = Math.max(previousEnd, result.start - 200);
    previousEnd = result.end;
    if (result.kind !== 't' || result.value === null) continue;
    let clause = text.slice(from, result.start);
    const cut = Math.max(clause.lastIndexOf('. '), clause.lastIndexOf('; '), clause.lastIndexOf('\n\n'));
    if (cut >= 0) clause = clause.slice(cut + 1);
    const values: Partial<Record<MeanQuantity, ReportedValue>> = { t: { ...result.value, comparator: result.valueComparator } };
    if (result.df[0]) values.df = { ...result.df[0], comparator: '=' };
    if (result.p) values.p = { ...result.p.value, comparator: result.p.comparator };
    const own = readAdjustment(text.slice(result.start, Math.min(text.length, result.end + 40)), false);
    into.comparisons.push({
      label: `${clause.trim().slice(-80)} ${result.text}`.trim(),
      first: null,
      second: null,
      values,
      adjust: own && own.method !== 'unspecified' ? own.method : null,
      where: `text, line ${lineOf(text, result.start)}`,
    });
  }
}

/**
 * A mean written with its standard error ("the harbour route (M = 25.84, SE = 0.57)", "adjusted M = 25.84, SE =
 * 0.57"): an adjusted (model-based) mean as papers report them; means with an SD are the groups' descriptives,
 * not read here. Each is kept with the words before it back to the sentence's start or the mean before it, in
 * which compareMeans.ts looks for the level it is of.
 */
const MEAN_WITH_SE = /(?<![\p{L}\d])(?:M|Mean|mean|EMM|Madj|M_adj)\s?[=:]\s?(-?\d{1,7}(?:\.\d{1,6})?)\s?(?:[,;]\s?|\(\s?)(?:SE|S\.E\.|se)\s?[=:]\s?(\d{1,7}(?:\.\d{1,6})?)(?!\d)/gu;

function textMeans(text: string, into: ReportedMeansSet): void {
  let previousEnd = 0;
  for (const match of text.matchAll(MEAN_WITH_SE)) {
    const start = match.index!;
    let clause = text.slice(Math.max(previousEnd, start - 200), start);
    previousEnd = start + match[0].length;
    const cut = Math.max(clause.lastIndexOf('. '), clause.lastIndexOf('\n\n'));
    if (cut >= 0) clause = clause.slice(cut + 1);
    const mean = parseCell(match[1]!);
    const se = parseCell(match[2]!);
    if (mean === null || se === null) continue;
    // (Without the bracket the mean stands in, and the one closing the mean before: "), lower on the park route (".)
    const words = trimmed(clause, ' \t\n\r),;]', ' \t\n\r([');
    into.means.push({ factors: [], levels: [], clause: words, values: { mean, se }, where: `text, line ${lineOf(text, start)}` });
  }
}

/** The text without the characters of `before` at its start and of `after` at its end (a loop: linear whatever the text). */
function trimmed(text: string, before: string, after: string): string {
  let start = 0;
  let end = text.length;
  while (start < end && before.includes(text[start]!)) start++;
  while (end > start && after.includes(text[end - 1]!)) end--;
  return text.slice(start, end);
}
