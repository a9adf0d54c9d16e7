import { Chalk, type ChalkInstance } from 'chalk';
import type { ComparedNumber } from './compare.js';
import type { RefitOutput } from './output.js';
import { extremes } from '../arrays.js';
import { visibleStrings } from '../report/visible.js';

/**
 * Pure formatters of a refit result: console text (chalk; plain when not a
 * terminal), Markdown, and a self-contained HTML page whose ANOVA table is
 * ready to paste into a response to reviewers. (DOCX: formatDocx.ts.)
 */

type Row = RefitOutput['terms'][number];
type Quantity = ComparedNumber['quantity'];

export const QUANTITY_LABEL: Record<Quantity, string> = { ss: 'SS', df: 'df', ms: 'MS', F: 'F', p: 'p', partialEtaSquared: 'ηp²' };

/** "12.35", "1,661.00" (thousands separated); small values keep three significant digits. */
export function formatSS(x: number | null): string {
  if (x === null) return '—';
  if (x !== 0 && Math.abs(x) < 0.1) return x.toPrecision(3);
  return formatNumber(x, 2);
}

export function formatF(x: number | null): string {
  return formatNumber(x, 2);
}

/** ".007", "< .001", "> .999" (APA style, no leading zero). */
export function formatP(p: number | null): string {
  if (p === null) return '—';
  if (p < 0.001) return '< .001';
  if (p >= 0.9995) return '> .999';
  return p.toFixed(3).replace(/^0\./, '.');
}

export function formatProportion(x: number | null): string {
  return x === null ? '—' : x.toFixed(3).replace(/^0\./, '.').replace(/^-0\./, '-.');
}

export function formatDf(x: number): string {
  return Number.isInteger(x) ? String(x) : x.toFixed(2);
}

/** "route:pace" -> "route × pace", each variable by its display name when it has one (--name). */
export function termLabel(term: string, names?: Pick<RefitOutput, 'displayNames'>): string {
  const display = new Map((names?.displayNames ?? []).map((d) => [d.variable, d.name]));
  return term
    .split(':')
    .map((v) => display.get(v) ?? v)
    .join(' × ');
}

export function typeLabel(type: 1 | 2 | 3): string {
  return type === 1 ? 'type I (sequential)' : type === 2 ? 'type II' : 'type III';
}

function decimalsOf(text: string): number {
  const m = /\.(\d+)/.exec(text);
  return m ? m[1]!.length : 0;
}

/** The recomputed value shown two decimals finer than the reported one (so its rounding can be seen). */
export function showRecomputed(n: { quantity: Quantity; reported: string | null; recomputed: number | null }): string {
  const x = n.recomputed;
  if (x === null || !Number.isFinite(x)) return '—';
  if (n.quantity === 'df') return formatDf(x);
  if (n.reported === null) {
    return n.quantity === 'p' ? formatP(x) : n.quantity === 'partialEtaSquared' ? formatProportion(x) : formatSS(x);
  }
  const d = decimalsOf(n.reported) + 2;
  if (n.quantity === 'p' && x < 10 ** -d) return x.toExponential(2);
  const s = x.toFixed(d);
  return n.quantity === 'p' || n.quantity === 'partialEtaSquared' ? s.replace(/^0\./, '.') : s;
}

function showDifference(n: { quantity: Quantity; reported: string | null; difference: number | null }): string {
  if (n.difference === null || n.reported === null) return '';
  if (n.quantity === 'df') return n.difference === 0 ? '0' : `${n.difference > 0 ? '+' : ''}${formatDf(n.difference)}`;
  const d = decimalsOf(n.reported) + 2;
  let s = n.difference.toFixed(d);
  if (n.quantity === 'p' || n.quantity === 'partialEtaSquared') s = s.replace(/^(-?)0\./, '$1.');
  return `${n.difference > 0 ? '+' : ''}${s}`;
}

function tableCells(r: Row, o?: Pick<RefitOutput, 'displayNames'>): string[] {
  return [termLabel(r.term, o), formatSS(r.ss), formatDf(r.df), formatSS(r.ms), formatF(r.F), formatP(r.p), formatProportion(r.partialEtaSquared)];
}

function residualCells(o: Pick<RefitOutput, 'residual'>, label = 'Residual'): string[] {
  return [label, formatSS(o.residual.ss), formatDf(o.residual.df), formatSS(o.residual.ms), '', '', ''];
}

const TABLE_HEAD = ['Source', 'SS', 'df', 'MS', 'F', 'p', 'ηp²'];

function pad(cells: string[][], rightAlignFrom = 1): string[] {
  const widths = cells[0]!.map((_, c) => extremes(cells.map((r) => [...(r[c] ?? '')].length))?.max ?? 0);
  return cells.map((r) =>
    r
      .map((cell, c) => {
        const gap = ' '.repeat(widths[c]! - [...cell].length);
        return c >= rightAlignFrom ? gap + cell : cell + gap;
      })
      .join('  ')
      .trimEnd(),
  );
}

function missingText(o: RefitOutput): string {
  const codes = o.missing.map((m) => `${m.column}=${m.codes}`).join('; ');
  return `${o.droppedRows} row${o.droppedRows === 1 ? '' : 's'} dropped for missing values (empty, NA${codes ? `, codes ${codes}` : ''})`;
}

/** One line on the type and coding used (and, for type I, the order of the terms). */
export function methodLine(o: Pick<RefitOutput, 'type' | 'coding' | 'codingDescription'> & Partial<Pick<RefitOutput, 'terms' | 'termOrder' | 'factors' | 'displayNames'>>): string {
  const reference =
    o.coding === 'treatment' && o.factors !== undefined && o.factors.length > 0
      ? ` (reference ${o.factors.map((f) => `${f.name} = ${f.reference ?? f.levels[0]}`).join(', ')})`
      : '';
  if (o.type === 3) return `type III sums of squares, ${o.codingDescription}${reference}`;
  const order =
    o.type === 1 && o.terms !== undefined
      ? `, terms ${o.termOrder === 'written' ? 'in the order written' : 'in order of degree (main effects and covariates, then interactions)'}: ${o.terms.map((t) => termLabel(t.term, o as Pick<RefitOutput, 'displayNames'>)).join(', ')}`
      : '';
  return `${typeLabel(o.type)} sums of squares${order} (${o.codingDescription}; type ${o.type === 1 ? 'I' : 'II'} sums of squares do not depend on the coding)`;
}

/** "group: 1 control, 2 training, 3 waitlist" for factors with labels (levels in analysis order). */
export function factorsLine(o: RefitOutput): string | null {
  if (o.factors.length === 0) return null;
  // A factor with many levels shows its first 12 and the count (the JSON output lists them all).
  const shown = (f: RefitOutput['factors'][number]) => {
    const list = f.levels.slice(0, 12).map((l, i) => (f.labels[i] !== undefined && f.labels[i] !== l ? `${l} = ${f.labels[i]}` : l));
    return f.levels.length > 12 ? `${list.join(', ')}, ... (${f.levels.length} levels)` : list.join(', ');
  };
  return o.factors.map((f) => `${termLabel(f.name, o)}: ${shown(f)}`).join('; ');
}

/** Sentences printed after the tables: notes on the model, values outside declared ranges, the homogeneity-of-slopes test. */
export function reportNotes(o: RefitOutput): string[] {
  const out = [...o.notes];
  for (const r of o.outOfRange) {
    const values = r.values.map((v) => `${v.value}${v.count > 1 ? ` ×${v.count}` : ''}`).join(', ');
    const codes = [...new Set(r.values.map((v) => v.value))].join(',');
    out.push(
      `${r.count} value${r.count === 1 ? '' : 's'} of ${r.column} outside its range ${r.low}..${r.high} (${values}), row${r.rows.length === 1 ? '' : 's'} ${r.rows.join(', ')}${r.count > r.rows.length ? ', ...' : ''}: ${r.count === 1 ? 'it is' : 'they are'} in the analysis. If ${r.count === 1 ? 'it is a missing-value code' : 'they are missing-value codes'}, declare ${r.count === 1 ? 'it' : 'them'}: --missing "${r.column}=${codes}".`,
    );
  }
  if (o.slopes) out.push('error' in o.slopes ? `Homogeneity of regression slopes could not be tested: ${o.slopes.error}` : o.slopes.sentence);
  return out;
}

function verdictWord(chalk: ChalkInstance, v: ComparedNumber['verdict']): string {
  return v === 'matches' ? chalk.green(v) : v === 'differs' ? chalk.red.bold(v) : chalk.gray(v);
}

/** Comparison rows as cell arrays: term, printed as, quantity, reported, recomputed, difference, verdict. */
export function comparisonCells(o: RefitOutput, includeUnreported: boolean): Array<{ cells: string[]; verdict: ComparedNumber['verdict'] }> {
  const out: Array<{ cells: string[]; verdict: ComparedNumber['verdict'] }> = [];
  for (const row of o.comparison?.rows ?? []) {
    const reportedAny = row.numbers.some((n) => n.verdict !== 'not reported');
    if (!reportedAny) {
      out.push({ cells: [termLabel(row.term, o), '', '', '', '', '', 'not reported'], verdict: 'not reported' });
      continue;
    }
    let first = true;
    for (const n of row.numbers) {
      if (n.verdict === 'not reported' && !includeUnreported) continue;
      out.push({
        cells: [
          first ? termLabel(row.term, o) : '',
          first ? (row.reportedLabel ?? '') : '',
          QUANTITY_LABEL[n.quantity],
          n.reported ?? '',
          showRecomputed(n),
          showDifference(n),
          n.verdict,
        ],
        verdict: n.verdict,
      });
      first = false;
    }
  }
  return out;
}

export function summaryLine(o: RefitOutput): string {
  const c = o.comparison!;
  const extra: string[] = [];
  if (c.unmatched.length > 0) extra.push(`${c.unmatched.length} reported row(s) name no model term: ${c.unmatched.map((u) => `"${u.label}"`).join(', ')} (use --map "<reported name>=<term>").`);
  if (c.ambiguous.length > 0) {
    extra.push(
      `${c.ambiguous.length} reported row(s) could name more than one term and are left unmatched: ${c.ambiguous.map((a) => `"${a.label}" (${a.candidates.map((t) => termLabel(t, o)).join(' or ')})`).join(', ')}; say which with --map "<reported name>=<term>".`,
    );
  }
  const unreported = c.termsNotReported ?? [];
  if (unreported.length > 0 && (c.unmatched.length > 0 || c.ambiguous.length > 0)) extra.push(`Terms no reported row names: ${unreported.map((t) => termLabel(t, o)).join(', ')}.`);
  const abbreviated = c.rows.filter((r) => r.matchedBy === 'abbreviation');
  if (abbreviated.length > 0) extra.push(`Matched as abbreviations: ${abbreviated.map((r) => `"${r.reportedLabel}" = ${termLabel(r.term, o)}`).join(', ')}.`);
  const tail = extra.length > 0 ? ` ${extra.join(' ')}` : '';
  if (c.compared === 0) return `No reported number could be compared.${tail}`;
  return c.differs === 0
    ? `All ${c.compared} reported numbers match the refit.${tail}`
    : `${c.differs} of ${c.compared} reported numbers differ from the refit.${tail}`;
}

const MEAN_QUANTITY_LABEL: Record<string, string> = { mean: 'M', estimate: 'Difference', se: 'SE', t: 't', df: 'df', p: 'p', lower: 'CI lower', upper: 'CI upper' };

function showMeanNumber(quantity: string, reported: string | null, x: number | null): string {
  if (x === null || !Number.isFinite(x)) return '—';
  if (quantity === 'df') return formatDf(x);
  const d = (reported === null ? 2 : decimalsOf(reported)) + 2;
  if (quantity === 'p' && x < 10 ** -d) return x.toExponential(2);
  const s = x.toFixed(d);
  return quantity === 'p' ? s.replace(/^0\./, '.') : s;
}

/** The reported means, comparisons and contrasts against the recomputed ones: one row per reported number. */
export function meansComparisonCells(o: RefitOutput): Array<{ cells: string[]; verdict: ComparedNumber['verdict'] }> {
  const out: Array<{ cells: string[]; verdict: ComparedNumber['verdict'] }> = [];
  for (const row of o.meansComparison?.rows ?? []) {
    const what = row.kind === 'mean' ? `M ${row.label} (${termLabel(row.term, o)})` : row.kind === 'comparison' ? `${row.label}${row.adjust ? ` (${row.adjust})` : ''}` : `contrast ${row.label}`;
    row.numbers.forEach((n, i) => {
      const diff = n.difference === null ? '' : n.quantity === 'df' ? (n.difference === 0 ? '0' : `${n.difference > 0 ? '+' : ''}${formatDf(n.difference)}`) : `${n.difference > 0 ? '+' : ''}${showMeanNumber(n.quantity === 'p' ? 'p' : 'x', n.reported, n.difference)}`;
      out.push({
        cells: [i === 0 ? what : '', i === 0 ? row.printedAs : '', MEAN_QUANTITY_LABEL[n.quantity] ?? n.quantity, n.reported ?? '', showMeanNumber(n.quantity, n.reported, n.recomputed), diff, n.verdict],
        verdict: n.verdict,
      });
    });
  }
  return out;
}

/** The ANOVA comparison is shown unless the report gave no ANOVA row at all (a file of means or comparisons only). */
export function showsAnovaComparison(o: RefitOutput): boolean {
  const c = o.comparison;
  if (!c) return false;
  return !(o.meansComparison && c.compared === 0 && c.unmatched.length === 0 && c.ambiguous.length === 0);
}

export const MEANS_COMPARISON_HEAD = ['Mean or comparison', 'Printed as', 'Quantity', 'Reported', 'Recomputed', 'Difference', 'Verdict'];

/** The summary of the means comparison, the adjustment used and what could not be tied to the model. */
export function meansSummaryLines(o: RefitOutput): string[] {
  const m = o.meansComparison;
  if (!m) return [];
  const lines: string[] = [];
  const from = m.adjust.from === 'reported' ? 'as the report states' : m.adjust.from === 'analysis' ? 'as the analysis asks' : 'the default; the report states none';
  const hasComparisons = m.rows.some((r) => r.kind === 'comparison');
  lines.push(
    `${m.compared === 0 ? 'No reported mean, comparison or contrast number could be compared.' : m.differs === 0 ? `All ${m.compared} reported numbers of the means, comparisons and contrasts match.` : `${m.differs} of ${m.compared} reported numbers of the means, comparisons and contrasts differ.`}${hasComparisons ? ` Comparisons recomputed with the ${m.adjust.method} adjustment (${from}).` : ''} Means held at: ${o.covariatesAt.length > 0 ? covariatesAtText(o) : 'no covariates'}.`,
  );
  for (const u of m.unmatched) lines.push(`Not compared: ${u.kind} "${u.label}" (${u.where}): ${u.reason}.`);
  return lines;
}

export function meansExplanationLines(o: RefitOutput): string[] {
  const m = o.meansComparison;
  if (!m || m.differs === 0) return [];
  if (m.explanations.length === 0) return ['None of the usual slips reproduces the reported means, comparisons or contrasts.'];
  return m.explanations.map((e, i) => `${i + 1}. ${e.description[0]!.toUpperCase()}${e.description.slice(1)}: ${e.reproduces === 'all' ? `all ${e.compared}` : `${e.matches} of ${e.compared}`} reported numbers it changes match.`);
}

export function explanationLines(o: RefitOutput): string[] {
  const list = o.explanations ?? [];
  if (!o.comparison || o.comparison.allMatch) return [];
  if (list.length === 0) return ['None of the usual slips reproduces the reported numbers.'];
  return list.map(
    (e, i) =>
      `${i + 1}. ${e.description[0]!.toUpperCase()}${e.description.slice(1)}: ${e.reproduces === 'all' ? `all ${e.compared}` : `${e.matches} of ${e.compared}`} reported numbers match (refit: ${e.model}, ${typeLabel(e.type)}${e.type === 3 ? `, ${e.coding === 'sum' ? 'sum-to-zero' : 'treatment'} coding` : ''}, N = ${e.table.n}).`,
  );
}

/** A number with `decimals` decimals and thousands separators ("1,234.57"); "—" for none. */
export function formatNumber(x: number | null, decimals = 2): string {
  if (x === null || !Number.isFinite(x)) return '—';
  const s = x.toLocaleString('en-US', { minimumFractionDigits: decimals, maximumFractionDigits: decimals });
  return s === `-${(0).toFixed(decimals)}` ? (0).toFixed(decimals) : s;
}

/** "[21.92, 24.12]" (APA style interval). */
export function formatInterval(lower: number | null, upper: number | null): string {
  return `[${formatNumber(lower)}, ${formatNumber(upper)}]`;
}

/** Header cells that are statistic symbols, printed in italics where the format allows. */
export const ITALIC_SYMBOLS = new Set(['SS', 'df', 'MS', 'F', 'p', 'M', 'SD', 'SE', 'n', 't', 'N', 'b']);

/** More cells than this and the reports leave the descriptives table to the JSON output (and say so). */
export const MAX_DESCRIPTIVE_CELLS = 60;

/** What the reports say instead of a descriptives table too long to read. */
export function descriptivesOmitted(o: RefitOutput): string | null {
  return o.descriptives.length > MAX_DESCRIPTIVE_CELLS
    ? `Cell descriptives (n, M, SD) of the ${o.descriptives.length} cells are in the JSON output (--format json).`
    : null;
}

/** One of the tables printed beside the ANOVA table. */
export interface ExtraTable {
  title: string;
  head: string[];
  rows: string[][];
  /** Columns from this index on are right-aligned numbers. */
  numbersFrom: number;
  /** What this table needs said (starts "Note."). */
  note: string;
  /** The analysis: N, exclusions, type of sums of squares, coding, model (for formats whose tables stand alone). */
  analysis: string;
}

function percent(level: number): string {
  return `${Math.round(level * 1000) / 10}%`;
}

/** Where the covariates were held, in words. */
export function covariatesAtText(o: RefitOutput): string {
  if (o.covariatesAt.length === 0) return '';
  const means = o.covariatesAt.filter((c) => c.from === 'mean');
  const given = o.covariatesAt.filter((c) => c.from === 'given');
  const list = (cs: typeof means) => cs.map((c) => `${c.name} = ${formatNumber(c.value)}`).join(', ');
  const parts: string[] = [];
  if (means.length > 0) parts.push(`${list(means)} (${means.length === 1 ? 'its mean' : 'their means'} over the ${o.n} analysed rows)`);
  if (given.length > 0) parts.push(`${list(given)} (${given.length === 1 ? 'the value' : 'the values'} given)`);
  return parts.join('; ');
}

function exclusionsText(o: RefitOutput): string {
  const codes = o.missing.map((m) => `${m.column} = ${m.codes}`).join('; ');
  return o.droppedRows > 0 ? `${o.droppedRows} of ${o.rowsInFile} rows excluded for missing values${codes ? ` (codes ${codes})` : ''}` : 'no rows excluded';
}

/** R² and adjusted R² in one line. */
export function fitLine(o: RefitOutput): string {
  return `R² = ${formatProportion(o.fit.rSquared)}, adjusted R² = ${formatProportion(o.fit.adjustedRSquared)}`;
}

/** Levene's test in one line, saying how it was centred. */
export function leveneLine(o: RefitOutput): string | null {
  const l = o.levene;
  if (!l) return null;
  const how = l.center === 'median' ? "centred on each cell's median (Brown-Forsythe)" : "centred on each cell's mean";
  return `Levene's test of equal variances across the ${l.groups} cells, ${how}: F(${formatDf(l.df1)}, ${formatDf(l.df2)}) = ${formatF(l.F)}, p ${l.p !== null && l.p < 0.001 ? '< .001' : `= ${formatP(l.p)}`}`;
}

/** The descriptives, marginal means, pairwise comparisons and contrasts as tables with captions and notes. */
export function extraTables(o: RefitOutput): ExtraTable[] {
  const tables: ExtraTable[] = [];
  const ci = `${percent(o.confidenceLevel)} CI`;
  const method = `${methodLine(o)[0]!.toUpperCase()}${methodLine(o).slice(1)}`;
  const where = o.covariatesAt.length > 0 ? `Covariates held at ${covariatesAtText(o)}` : 'No covariates';
  const weighting = o.cellWeights === 'proportional' ? 'weighted by their share of the analysed rows' : 'weighted equally';
  const analysis = `N = ${o.n}; ${exclusionsText(o)}. ${method}. Model: ${o.model}.`;
  const factorNames = o.factors.map((f) => termLabel(f.name, o));
  const outcome = termLabel(o.outcome, o);
  if (o.descriptives.length > 0 && o.descriptives.length <= MAX_DESCRIPTIVE_CELLS) {
    tables.push({
      title: `Unadjusted descriptives of ${outcome}${factorNames.length > 0 ? ` by ${factorNames.join(' × ')}` : ''}`,
      head: [...(factorNames.length > 0 ? factorNames : ['Rows']), 'n', 'M', 'SD'],
      rows: o.descriptives.map((d) => [...(d.levels.length > 0 ? d.levels.map((l) => l.label) : [d.label]), String(d.n), formatNumber(d.mean), formatNumber(d.sd)]),
      numbersFrom: Math.max(1, factorNames.length),
      note: 'Note. Observed cell means and standard deviations (n - 1), not adjusted for covariates.',
      analysis,
    });
  }
  if (o.coefficients) {
    tables.push({
      title: `Regression coefficients of the model for ${outcome}`,
      head: ['Term', 'b', 'SE', 't', 'p', ci],
      rows: o.coefficients.map((c) => [c.name, formatNumber(c.estimate, 3), formatNumber(c.se, 3), formatF(c.t), formatP(c.p), `[${formatNumber(c.lower, 3)}, ${formatNumber(c.upper, 3)}]`]),
      numbersFrom: 1,
      note: `Note. One coefficient per design column, in ${o.codingDescription}: ${o.coding === 'sum' ? '"[S.level]" is the column of that level (the last level is -1 in every column), its coefficient the level\'s deviation from the unweighted mean of the levels' : '"[T.level]" is that level against the first'}. Intercept at covariates = 0. df = ${formatDf(o.residual.df)}.`,
      analysis,
    });
  }
  for (const m of o.marginalMeans ?? []) {
    const names = (m.within === undefined ? m.term.split(':') : [m.within, ...m.term.split(':')]).map((n) => termLabel(n, o));
    const by = `${termLabel(m.term, o)}${m.within === undefined ? '' : ` within ${termLabel(m.within, o)}`}`;
    tables.push({
      title: `Estimated marginal means of ${outcome} by ${by}`,
      head: [...names, 'M', 'SE', ci],
      rows: m.means.map((r) => [...r.levels.map((l) => l.label), formatNumber(r.mean), formatNumber(r.se), formatInterval(r.lower, r.upper)]),
      numbersFrom: names.length,
      note: `Note. Means adjusted by the model (least-squares means). ${where}; levels of factors not in the table ${weighting}. df = ${formatDf(m.means[0]?.df ?? o.residual.df)}.`,
      analysis,
    });
    if (m.pairwise) {
      tables.push({
        title: `Pairwise comparisons of ${outcome} by ${by}, ${m.pairwise.adjust === 'none' ? 'unadjusted' : `${m.pairwise.method.split(' (')[0]} adjustment`}`,
        head: [...(m.within === undefined ? [] : [termLabel(m.within, o)]), 'Comparison', 'Difference', 'SE', 'df', 't', 'p', ci],
        rows: m.pairwise.comparisons.map((c) => [
          ...(m.within === undefined ? [] : [c.within ?? '']),
          `${c.first} - ${c.second}`,
          formatNumber(c.estimate),
          formatNumber(c.se),
          formatDf(c.df),
          formatF(c.t),
          formatP(c.p),
          formatInterval(c.lower, c.upper),
        ]),
        numbersFrom: m.within === undefined ? 1 : 2,
        note: `Note. ${m.pairwise.adjust === 'none' ? 'p and intervals not adjusted for multiple comparisons' : `p and intervals adjusted: ${m.pairwise.method}`}. Differences of the estimated marginal means (first minus second); ${where.charAt(0).toLowerCase()}${where.slice(1)}.`,
      analysis,
      });
    }
  }
  if (o.contrasts && o.contrasts.length > 0) {
    tables.push({
      title: `Planned contrasts of the estimated marginal means of ${outcome}`,
      head: ['Contrast', 'Weights', 'Estimate', 'SE', 'df', 't', 'p', ci],
      rows: o.contrasts.map((c) => [c.name, c.weights.map((w) => `${w.label} ${w.weight}`).join('; '), formatNumber(c.estimate), formatNumber(c.se), formatDf(c.df), formatF(c.t), formatP(c.p), formatInterval(c.lower, c.upper)]),
      numbersFrom: 2,
      note: `Note. Two-sided, not adjusted for multiplicity. ${where}; levels of factors not in the contrast ${weighting}.`,
      analysis,
    });
  }
  return tables;
}

/** Console report. Controls from the files and the manuscript are shown as escapes (src/report/visible.ts), as in scan's reports. */
export function formatRefitText(output: RefitOutput, options: { color: boolean }): string {
  const o = visibleStrings(output);
  const chalk = new Chalk({ level: options.color ? 1 : 0 });
  const lines: string[] = [];
  lines.push(chalk.bold(`Refit of ${o.data}`));
  lines.push(`  Model    ${o.model}`);
  lines.push(`  Method   ${methodLine(o)}`);
  lines.push(`  Rows     ${o.rowsInFile} in the file, N = ${o.n} analysed; ${missingText(o)}`);
  const factors = factorsLine(o);
  if (factors) lines.push(`  Levels   ${factors}`);
  lines.push('');
  const table = pad([TABLE_HEAD, ...o.terms.map((r) => tableCells(r, o)), residualCells(o)]);
  lines.push(`  ${chalk.bold(table[0]!)}`, ...table.slice(1).map((l) => `  ${l}`));
  lines.push(`  ${fitLine(o)}`);
  const omitted = descriptivesOmitted(o);
  if (omitted) lines.push('', omitted);
  for (const t of extraTables(o)) {
    lines.push('', chalk.bold(t.title));
    const padded = pad([t.head, ...t.rows], t.numbersFrom);
    lines.push(`  ${chalk.bold(padded[0]!)}`, ...padded.slice(1).map((l) => `  ${l}`));
    lines.push(`  ${t.note}`);
  }
  const levene = leveneLine(o);
  if (levene) lines.push('', levene);
  const notes = reportNotes(o);
  if (notes.length > 0) lines.push('', chalk.bold('Notes'), ...notes.map((n) => `  - ${n}`));
  if (o.comparison && showsAnovaComparison(o)) {
    const c = o.comparison;
    lines.push('');
    lines.push(chalk.bold(`Compared with ${c.reportedFile} (${c.sources.join(', ')})`));
    const rows = comparisonCells(o, false);
    const padded = pad([['Term', 'Printed as', '', 'Reported', 'Recomputed', 'Difference', 'Verdict'], ...rows.map((r) => r.cells)], 3);
    lines.push(`  ${chalk.bold(padded[0]!)}`);
    padded.slice(1).forEach((line, i) => {
      const verdict = rows[i]!.verdict;
      lines.push(`  ${line.slice(0, line.length - verdict.length)}${verdictWord(chalk, verdict)}`);
    });
    lines.push('');
    lines.push(c.differs === 0 && c.unmatched.length === 0 && c.ambiguous.length === 0 ? chalk.green(summaryLine(o)) : chalk.red(summaryLine(o)));
    const explanations = explanationLines(o);
    if (explanations.length > 0) {
      lines.push('');
      lines.push(chalk.bold('What reproduces the reported numbers'));
      for (const e of explanations) lines.push(`  ${e}`);
    }
    if (o.impliedN) {
      lines.push('');
      lines.push(o.impliedN.note);
    }
  }
  if (o.meansComparison) {
    const rows = meansComparisonCells(o);
    lines.push('', chalk.bold('Reported means, comparisons and contrasts against the refit'));
    if (rows.length > 0) {
      const padded = pad([MEANS_COMPARISON_HEAD, ...rows.map((r) => r.cells)], 3);
      lines.push(`  ${chalk.bold(padded[0]!)}`);
      padded.slice(1).forEach((line, i) => {
        const verdict = rows[i]!.verdict;
        lines.push(`  ${line.slice(0, line.length - verdict.length)}${verdictWord(chalk, verdict)}`);
      });
    }
    for (const l of meansSummaryLines(o)) lines.push(`  ${l}`);
    const why = meansExplanationLines(o);
    if (why.length > 0) lines.push('', chalk.bold('What reproduces the reported means and comparisons'), ...why.map((e) => `  ${e}`));
  }
  return `${lines.join('\n')}\n`;
}

function mdEscape(s: string): string {
  return s.replace(/\|/g, '\\|');
}

function mdTable(head: string[], rows: string[][], numbersFrom = 1): string[] {
  return [`| ${head.join(' | ')} |`, `|${head.map((_, i) => (i < numbersFrom ? ' --- ' : ' ---: ')).join('|')}|`, ...rows.map((r) => `| ${r.map(mdEscape).join(' | ')} |`)];
}

/** A header cell for Markdown: statistic symbols in italics, the rest escaped. */
function mdSymbol(h: string): string {
  if (ITALIC_SYMBOLS.has(h)) return `*${h}*`;
  if (h === 'ηp²') return '*η*p²';
  return mdEscape(h).replace(/[*_]/g, '\\$&');
}

/** "F(5, 47) = 1.31, p = .277" with its symbols in italics (Markdown). */
function mdItalicLine(text: string): string {
  return text.replace(/\b([Fp])(?=[( ])/g, '*$1*');
}

/** Markdown report, controls shown as escapes. */
export function formatRefitMarkdown(output: RefitOutput): string {
  const o = visibleStrings(output);
  const lines: string[] = [];
  lines.push(`# Refit of ${o.data}`, '');
  lines.push(`- Model: \`${o.model}\``);
  lines.push(`- Method: ${methodLine(o)}`);
  lines.push(`- Rows: ${o.rowsInFile} in the file, N = ${o.n} analysed; ${missingText(o)}`);
  const factors = factorsLine(o);
  if (factors) lines.push(`- Levels: ${mdEscape(factors)}`);
  lines.push('');
  lines.push(...mdTable(TABLE_HEAD.map(mdSymbol), [...o.terms.map((r) => tableCells(r, o)), residualCells(o)]));
  lines.push('', `${tableNote(o)} ${fitLine(o)}.`);
  const omitted = descriptivesOmitted(o);
  if (omitted) lines.push('', omitted);
  for (const t of extraTables(o)) {
    lines.push('', `## ${t.title}`, '', ...mdTable(t.head.map(mdSymbol), t.rows, t.numbersFrom), '', `*Note.* ${mdEscape(`${t.note.replace(/^Note\.\s*/, '')} ${t.analysis}`)}`);
  }
  const levene = leveneLine(o);
  if (levene) lines.push('', mdItalicLine(levene));
  const notes = reportNotes(o);
  if (notes.length > 0) lines.push('', '## Notes', '', ...notes.map((n) => `- ${mdItalicLine(mdEscape(n).replace(/[*_]/g, '\\$&'))}`));
  if (o.comparison && showsAnovaComparison(o)) {
    lines.push('', `## Compared with ${o.comparison.reportedFile}`, '', `Read from: ${o.comparison.sources.join(', ')}.`, '');
    lines.push(...mdTable(['Term', 'Printed as', 'Quantity', 'Reported', 'Recomputed', 'Difference', 'Verdict'], comparisonCells(o, false).map((r) => r.cells)));
    lines.push('', summaryLine(o));
    const explanations = explanationLines(o);
    if (explanations.length > 0) lines.push('', '## What reproduces the reported numbers', '', ...explanations);
    if (o.impliedN) lines.push('', o.impliedN.note);
  }
  if (o.meansComparison) {
    lines.push('', '## Reported means, comparisons and contrasts against the refit', '');
    const rows = meansComparisonCells(o);
    if (rows.length > 0) lines.push(...mdTable(MEANS_COMPARISON_HEAD, rows.map((r) => r.cells)), '');
    lines.push(...meansSummaryLines(o).map(mdEscape));
    const why = meansExplanationLines(o);
    if (why.length > 0) lines.push('', '## What reproduces the reported means and comparisons', '', ...why.map(mdEscape));
  }
  return `${lines.join('\n')}\n`;
}

function esc(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

/** Escapes text and sets the statistic symbols of a result line in italics ("F(5, 47)", "p = ", "R²"). */
function htmlSymbols(text: string): string {
  return esc(text).replace(/\b([FpR])(?=[( ²])/g, '<i>$1</i>');
}

/** The note printed under the formatted table. */
export function tableNote(o: RefitOutput): string {
  const codes = o.missing.map((m) => `${m.column} = ${m.codes}`).join('; ');
  return (
    `Note. ${methodLine(o)[0]!.toUpperCase()}${methodLine(o).slice(1)}. N = ${o.n}` +
    `${o.droppedRows > 0 ? `; ${o.droppedRows} of ${o.rowsInFile} rows excluded for missing values${codes ? ` (codes ${codes})` : ''}` : ''}. ` +
    `ηp² = partial eta squared. Model: ${o.model}.`
  );
}

/** Self-contained HTML page: the recomputed ANOVA table (APA-like), and the comparison when numbers were reported. */
export function formatRefitHtml(output: RefitOutput): string {
  // Tabs and line breaks are white space to a browser; the other controls and the bidi overrides are shown as escapes.
  const o = visibleStrings(output, '\t\n\r');
  const title = `Refit of ${termLabel(o.outcome, o)}: ${o.type === 3 ? 'type III' : typeLabel(o.type)} ANOVA table`;
  const row = (cells: string[], tag = 'td') => `<tr>${cells.map((c, i) => `<${tag}${i === 0 ? ' class="src"' : ''}>${esc(c)}</${tag}>`).join('')}</tr>`;
  const italicHead = `<tr>${TABLE_HEAD.map((h, i) => `<th${i === 0 ? ' class="src"' : ''}>${['SS', 'df', 'MS', 'F', 'p'].includes(h) ? `<i>${esc(h)}</i>` : h === 'ηp²' ? '<i>η</i><sub>p</sub><sup>2</sup>' : esc(h)}</th>`).join('')}</tr>`;
  const parts: string[] = [];
  parts.push('<!DOCTYPE html>', '<html lang="en">', '<head>', '<meta charset="utf-8">', `<title>${esc(title)}</title>`);
  parts.push(
    '<style>',
    'body{font-family:"Times New Roman",Times,serif;max-width:52rem;margin:2rem auto;padding:0 1rem;color:#111}',
    'table{border-collapse:collapse;margin:.5rem 0 1rem}',
    'th,td{padding:.2rem .8rem;text-align:right;font-variant-numeric:tabular-nums}',
    'th.src,td.src{text-align:left}',
    'table.anova thead tr{border-top:1.5px solid #000;border-bottom:1px solid #000}',
    'table.anova tbody tr:last-child{border-bottom:1.5px solid #000}',
    'table.cmp th{border-bottom:1px solid #000} td.differs{color:#a00;font-weight:bold} td.matches{color:#060} td.not{color:#777}',
    '.caption{font-style:italic}.note{font-size:.9rem}',
    '</style>',
    '</head>',
    '<body>',
  );
  parts.push('<p><b>Table 1</b></p>', `<p class="caption">${esc(`${o.covariates.length > 0 ? 'Analysis of covariance' : 'Analysis of variance'} of ${termLabel(o.outcome, o)}`)}</p>`);
  parts.push('<table class="anova">', `<thead>${italicHead}</thead>`, '<tbody>');
  for (const r of o.terms) parts.push(row(tableCells(r, o)));
  parts.push(row(residualCells(o)));
  parts.push('</tbody>', '</table>', `<p class="note">${esc(tableNote(o))} ${htmlSymbols(fitLine(o))}.</p>`);
  extraTables(o).forEach((t, i) => {
    const head = `<tr>${t.head.map((h, c) => `<th${c < t.numbersFrom ? ' class="src"' : ''}>${ITALIC_SYMBOLS.has(h) ? `<i>${esc(h)}</i>` : esc(h)}</th>`).join('')}</tr>`;
    parts.push(`<p><b>Table ${i + 2}</b></p>`, `<p class="caption">${esc(t.title)}</p>`, '<table class="anova">', `<thead>${head}</thead>`, '<tbody>');
    for (const r of t.rows) parts.push(`<tr>${r.map((c, ci) => `<td${ci < t.numbersFrom ? ' class="src"' : ''}>${esc(c)}</td>`).join('')}</tr>`);
    parts.push('</tbody>', '</table>', `<p class="note"><i>Note.</i> ${esc(`${t.note.replace(/^Note\.\s*/, '')} ${t.analysis}`)}</p>`);
  });
  const levene = leveneLine(o);
  if (levene) parts.push(`<p>${htmlSymbols(levene)}</p>`);
  const factors = factorsLine(o);
  const notes = reportNotes(o);
  if (factors || notes.length > 0) {
    parts.push('<h2>Notes</h2>', '<ul>');
    if (factors) parts.push(`<li>Levels: ${esc(factors)}</li>`);
    for (const n of notes) parts.push(`<li>${htmlSymbols(n)}</li>`);
    parts.push('</ul>');
  }
  if (o.comparison && showsAnovaComparison(o)) {
    parts.push(`<h2>Compared with ${esc(o.comparison.reportedFile)}</h2>`, `<p>Read from: ${esc(o.comparison.sources.join(', '))}.</p>`);
    parts.push('<table class="cmp"><thead>', row(['Term', 'Printed as', 'Quantity', 'Reported', 'Recomputed', 'Difference', 'Verdict'], 'th'), '</thead><tbody>');
    for (const r of comparisonCells(o, false)) {
      const cls = r.verdict === 'not reported' ? 'not' : r.verdict;
      parts.push(`<tr>${r.cells.map((c, i) => `<td${i === 0 || i === 1 ? ' class="src"' : i === 6 ? ` class="${cls}"` : ''}>${esc(c)}</td>`).join('')}</tr>`);
    }
    parts.push('</tbody></table>', `<p>${esc(summaryLine(o))}</p>`);
    const explanations = explanationLines(o);
    if (explanations.length > 0) {
      parts.push('<h2>What reproduces the reported numbers</h2>', '<ul>', ...explanations.map((e) => `<li>${esc(e.replace(/^\d+\.\s*/, ''))}</li>`), '</ul>');
    }
    if (o.impliedN) parts.push(`<p>${esc(o.impliedN.note)}</p>`);
  }
  if (o.meansComparison) {
    parts.push('<h2>Reported means, comparisons and contrasts against the refit</h2>');
    const rows = meansComparisonCells(o);
    if (rows.length > 0) {
      parts.push('<table class="cmp"><thead>', row(MEANS_COMPARISON_HEAD, 'th'), '</thead><tbody>');
      for (const r of rows) {
        const cls = r.verdict === 'not reported' ? 'not' : r.verdict;
        parts.push(`<tr>${r.cells.map((c, i) => `<td${i === 0 || i === 1 ? ' class="src"' : i === 6 ? ` class="${cls}"` : ''}>${esc(c)}</td>`).join('')}</tr>`);
      }
      parts.push('</tbody></table>');
    }
    for (const l of meansSummaryLines(o)) parts.push(`<p>${esc(l)}</p>`);
    const why = meansExplanationLines(o);
    if (why.length > 0) parts.push('<h2>What reproduces the reported means and comparisons</h2>', '<ul>', ...why.map((e) => `<li>${esc(e.replace(/^\d+\.\s*/, ''))}</li>`), '</ul>');
  }
  parts.push('</body>', '</html>');
  return `${parts.join('\n')}\n`;
}
