import { agrees } from './compare.js';
import type { FittedModel } from './model.js';
import { ADJUSTMENTS, marginalMeans, pairwiseComparisons, plannedContrast, simpleComparisons, type Adjustment, type CellWeights, type MarginalMean, type SimpleComparisons } from './marginalMeans.js';
import type { MeanQuantity, ReportedComparisonRow, ReportedMeansSet } from './reportedMeans.js';
import type { ReportedValue } from './reportedTable.js';
import { matchTermDetailed } from './reportedTable.js';

/**
 * Reported adjusted means, pairwise comparisons and contrasts against the
 * recomputed ones, each printed number allowed its rounding (compare.ts,
 * agrees), and the usual slips tried when they differ:
 *
 * - unadjusted means reported as adjusted: the observed means of the
 *   analysed rows at each level (no covariate adjustment, cells weighted by
 *   their rows);
 * - the covariate held at another value than its mean: at 0, and at the value
 *   that best reproduces the reported means (least squares over the means,
 *   one covariate at a time; at least two reported means);
 * - the other factors' levels weighted the other way (equally or by their rows);
 * - another adjustment of the pairwise comparisons' p and intervals (e.g.
 *   Bonferroni p reported as Tukey's).
 *
 * A slip reproduces the report when every reported number it changes matches.
 */

export type MeansSlip = 'unadjusted-means' | 'covariate-value' | 'other-weights' | 'other-adjustment';

export interface ComparedMeanNumber {
  quantity: MeanQuantity;
  reported: string | null;
  reportedValue: number | null;
  recomputed: number;
  difference: number | null;
  verdict: 'matches' | 'differs' | 'not reported';
}

export interface ComparedMeanRow {
  kind: 'mean' | 'comparison' | 'contrast';
  /** The factor or factors ("route:pace") of the means compared. */
  term: string;
  /** Our name for it: the level labels, "harbour - park", or the contrast's name. */
  label: string;
  printedAs: string;
  where: string;
  /** Comparisons: the adjustment of the recomputed p and intervals. */
  adjust?: Adjustment;
  numbers: ComparedMeanNumber[];
}

export interface MeansExplanation {
  slip: MeansSlip;
  description: string;
  reproduces: 'all' | 'most';
  matches: number;
  compared: number;
}

export interface MeansComparison {
  rows: ComparedMeanRow[];
  unmatched: Array<{ kind: 'mean' | 'comparison' | 'contrast'; label: string; where: string; reason: string }>;
  compared: number;
  matches: number;
  differs: number;
  allMatch: boolean;
  /** The adjustment the comparisons were recomputed with, and why that one. */
  adjust: { method: Adjustment; from: 'reported' | 'analysis' | 'default' };
  explanations: MeansExplanation[];
}

interface Settings {
  at: Map<string, number>;
  weights: CellWeights;
  adjust: Adjustment;
}

/** A reported row resolved to the model: the factors and level codes it names. */
interface Resolved {
  kind: 'mean' | 'comparison' | 'contrast';
  factors: string[];
  /** Level codes of the mean (kind mean) or of both sides (comparison). */
  codes: string[];
  second?: string[];
  /** A simple comparison: the other factor and the level it is made within. */
  within?: { factor: string; code: string };
  contrast?: { weights: number[]; name: string };
  adjust: Adjustment | null;
  printedAs: string;
  where: string;
  values: Partial<Record<MeanQuantity, ReportedValue>>;
}

const norm = (s: string) => s.normalize('NFKC').toLowerCase().replace(/[_.]/g, ' ').replace(/\s+/g, ' ').trim();

function levelCode(model: FittedModel, factor: string, printed: string): string | null {
  const v = model.factorVars.find((f) => f.name === factor);
  if (!v) return null;
  const want = norm(printed);
  return v.levels.find((code) => norm(code) === want || norm(v.labels.get(code) ?? code) === want) ?? null;
}

/** Factors that have a level printed as `printed`. */
function factorsWithLevel(model: FittedModel, printed: string): string[] {
  return model.factorVars.filter((v) => levelCode(model, v.name, printed) !== null).map((v) => v.name);
}

function factorOfHeader(model: FittedModel, header: string, map: ReadonlyMap<string, string>): string | null {
  const terms = model.factorVars.map((v) => ({ name: v.name, variables: [v.name] }));
  const hit = matchTermDetailed(header, terms, map);
  return hit.kind === 'term' ? hit.term.name : null;
}

/** "harbour, self" -> factor and code of each part, in model order; null when a part names no level or several ways. */
function sideLevels(model: FittedModel, side: string): Map<string, string> | null {
  const parts = side.split(/[,:×]/).map((p) => p.trim()).filter((p) => p !== '');
  const out = new Map<string, string>();
  for (const part of parts) {
    const factors = factorsWithLevel(model, part).filter((f) => !out.has(f));
    if (factors.length !== 1) return null;
    out.set(factors[0]!, levelCode(model, factors[0]!, part)!);
  }
  return out.size > 0 ? out : null;
}

/** Every whole-word mention of a level of each factor in a clause, in order of appearance. */
function levelsMentioned(model: FittedModel, clause: string): Map<string, string[]> {
  const text = norm(clause);
  const isWordChar = (c: string | undefined) => c !== undefined && /[\p{L}\p{N}]/u.test(c);
  const out = new Map<string, string[]>();
  for (const v of model.factorVars) {
    const hits: Array<{ at: number; code: string }> = [];
    for (const code of v.levels) {
      for (const name of new Set([norm(code), norm(v.labels.get(code) ?? code)])) {
        if (name === '') continue;
        let at = text.indexOf(name);
        while (at >= 0) {
          if (!isWordChar(text[at - 1]) && !isWordChar(text[at + name.length])) {
            hits.push({ at, code });
            break;
          }
          at = text.indexOf(name, at + 1);
        }
      }
    }
    hits.sort((a, b) => a.at - b.at);
    const codes = [...new Set(hits.map((h) => h.code))];
    if (codes.length > 0) out.set(v.name, codes);
  }
  return out;
}

const ADJUST_OF: Partial<Record<string, Adjustment>> = { tukey: 'tukey', bonferroni: 'bonferroni', holm: 'holm', sidak: 'sidak', scheffe: 'scheffe' };

function resolveComparison(model: FittedModel, row: ReportedComparisonRow): { factors: string[]; first: string[]; second: string[] } | string {
  if (row.first !== null && row.second !== null) {
    const a = sideLevels(model, row.first);
    const b = sideLevels(model, row.second);
    if (a === null || b === null) return 'its sides name no level of a factor, or a level of several factors';
    const factors = model.factorVars.map((v) => v.name).filter((f) => a.has(f));
    if (factors.length !== a.size || factors.some((f) => !b.has(f)) || b.size !== a.size) return 'its two sides name levels of different factors';
    return { factors, first: factors.map((f) => a.get(f)!), second: factors.map((f) => b.get(f)!) };
  }
  const mentioned = [...levelsMentioned(model, row.label)].filter(([, codes]) => codes.length >= 2);
  if (mentioned.length !== 1 || mentioned[0]![1].length !== 2) return 'its sentence does not name exactly two levels of one factor';
  const [factor, codes] = mentioned[0]!;
  return { factors: [factor], first: [codes[0]!], second: [codes[1]!] };
}

function resolveAll(model: FittedModel, reported: ReportedMeansSet, map: ReadonlyMap<string, string>): { resolved: Resolved[]; unmatched: MeansComparison['unmatched'] } {
  const resolved: Resolved[] = [];
  const unmatched: MeansComparison['unmatched'] = [];
  for (const row of reported.means) {
    if (row.clause !== undefined) {
      // A mean written in the text: the level its words name last before it, when they name levels of one factor only.
      const mentioned = [...levelsMentioned(model, row.clause)];
      if (mentioned.length !== 1) {
        unmatched.push({ kind: 'mean', label: row.clause.slice(-80), where: row.where, reason: mentioned.length === 0 ? 'its sentence names no level of a factor' : 'its sentence names levels of several factors' });
        continue;
      }
      const [factor, codes] = mentioned[0]!;
      const code = codes[codes.length - 1]!;
      resolved.push({ kind: 'mean', factors: [factor], codes: [code], adjust: null, printedAs: row.clause.slice(-80), where: row.where, values: row.values });
      continue;
    }
    const factors: string[] = [];
    const codes: string[] = [];
    let failed: string | null = null;
    row.levels.forEach((printed, i) => {
      if (failed !== null || printed === '') return;
      let factor = factorOfHeader(model, row.factors[i] ?? '', map);
      if (factor === null || levelCode(model, factor, printed) === null) {
        const candidates = factorsWithLevel(model, printed).filter((f) => !factors.includes(f));
        factor = candidates.length === 1 ? candidates[0]! : null;
      }
      if (factor === null) failed = `"${printed}" is not a level of ${row.factors[i] ? `the factor headed "${row.factors[i]}"` : 'one factor'}`;
      else {
        factors.push(factor);
        codes.push(levelCode(model, factor, printed)!);
      }
    });
    if (failed !== null || factors.length === 0) {
      unmatched.push({ kind: 'mean', label: row.levels.join(', '), where: row.where, reason: failed ?? 'no level printed' });
      continue;
    }
    const order = model.factorVars.map((v) => v.name).filter((f) => factors.includes(f));
    resolved.push({ kind: 'mean', factors: order, codes: order.map((f) => codes[factors.indexOf(f)]!), adjust: null, printedAs: row.levels.join(', '), where: row.where, values: row.values });
  }
  for (const row of reported.comparisons) {
    if (row.first === null && row.values.t === undefined) continue;
    const hit = resolveComparison(model, row);
    if (typeof hit === 'string') {
      // Written t results that name no two levels are other tests, not comparisons of these means: left out silently.
      if (row.first !== null) unmatched.push({ kind: 'comparison', label: row.label, where: row.where, reason: hit });
      continue;
    }
    // A simple comparison: the level of another factor it is made within.
    let within: { factor: string; code: string } | undefined;
    if (row.within !== undefined) {
      const named = factorOfHeader(model, row.within.header, map);
      const candidates = named !== null && levelCode(model, named, row.within.level) !== null ? [named] : factorsWithLevel(model, row.within.level);
      const factor = candidates.length === 1 && !hit.factors.includes(candidates[0]!) ? candidates[0]! : null;
      if (factor === null) {
        unmatched.push({ kind: 'comparison', label: `${row.label} (${row.within.level})`, where: row.where, reason: `"${row.within.level}" is not a level of one other factor` });
        continue;
      }
      within = { factor, code: levelCode(model, factor, row.within.level)! };
    }
    resolved.push({
      kind: 'comparison',
      factors: hit.factors,
      codes: hit.first,
      second: hit.second,
      ...(within ? { within } : {}),
      adjust: row.adjust === null ? null : (ADJUST_OF[row.adjust] ?? null),
      printedAs: within ? `${row.label} (${row.within!.level})` : row.label,
      where: row.where,
      values: row.values,
    });
  }
  for (const row of reported.contrasts) {
    let term = row.term;
    let weights = row.weights;
    let name = row.name;
    if (weights === null) {
      const named = model.spec.contrasts.find((c) => c.name !== undefined && norm(c.name) === norm(row.name));
      if (named && Array.isArray(named.weights)) {
        term = named.term;
        weights = named.weights;
      }
    }
    if (weights === null || term === null) {
      unmatched.push({ kind: 'contrast', label: row.name, where: row.where, reason: 'give its weights ("route=0.5,0.5,-1") or name a contrast of the analysis' });
      continue;
    }
    const factors = term.split(/[:×*]| x /).map((f) => factorOfHeader(model, f, map));
    if (factors.some((f) => f === null)) {
      unmatched.push({ kind: 'contrast', label: row.name || term, where: row.where, reason: `"${term}" names no factor of the model` });
      continue;
    }
    if (name === '') name = `${term}=${weights.join(',')}`;
    resolved.push({ kind: 'contrast', factors: factors as string[], codes: [], contrast: { weights, name }, adjust: null, printedAs: row.name || `${term}=${weights.join(',')}`, where: row.where, values: row.values });
  }
  return { resolved, unmatched };
}

function labelOf(model: FittedModel, factors: readonly string[], codes: readonly string[]): string {
  return factors.map((f, i) => model.factorVars.find((v) => v.name === f)?.labels.get(codes[i]!) ?? codes[i]!).join(', ');
}

interface Recomputed {
  label: string;
  values: Partial<Record<MeanQuantity, number>>;
}

/** The recomputed numbers of one resolved row under the given settings; null when they cannot be computed. */
function recompute(model: FittedModel, r: Resolved, s: Settings, cache: Map<string, unknown>): Recomputed | string {
  const grid = { at: s.at, weights: s.weights };
  const key = (what: string) => `${what}|${r.factors.join(':')}|${[...s.at].join(';')}|${s.weights}`;
  const meansOf = (): MarginalMean[] => {
    const k = key('means');
    if (!cache.has(k)) cache.set(k, marginalMeans(model, r.factors, grid));
    return cache.get(k) as MarginalMean[];
  };
  const indexOf = (codes: readonly string[]) => meansOf().findIndex((m) => r.factors.every((f, i) => m.levels[f] === codes[i]));
  if (r.kind === 'mean') {
    const m = meansOf()[indexOf(r.codes)];
    if (!m) return 'no such mean';
    return { label: labelOf(model, r.factors, r.codes), values: { mean: m.emmean, se: m.se, df: m.df, lower: m.lower, upper: m.upper } };
  }
  if (r.kind === 'comparison' && r.within !== undefined) {
    const adjust = r.adjust ?? s.adjust;
    const k = key(`simple ${adjust} ${r.within.factor}`);
    if (!cache.has(k)) cache.set(k, simpleComparisons(model, r.factors, r.within.factor, { ...grid, adjust }));
    const family = (cache.get(k) as SimpleComparisons[]).find((block) => block.within.level === r.within!.code);
    if (!family) return 'no such level';
    const at = (codes: readonly string[]) => family.means.findIndex((m) => r.factors.every((f, i) => m.levels[f] === codes[i]));
    let i = at(r.codes);
    let j = at(r.second!);
    if (i < 0 || j < 0 || i === j) return 'no such pair';
    const flip = i > j;
    if (flip) [i, j] = [j, i];
    const n = family.means.length;
    const c = family.comparisons[(i * (2 * n - i - 1)) / 2 + (j - i - 1)]!;
    const sign = flip ? -1 : 1;
    const withinLabel = model.factorVars.find((v) => v.name === r.within!.factor)?.labels.get(r.within.code) ?? r.within.code;
    return {
      label: `${labelOf(model, r.factors, r.codes)} - ${labelOf(model, r.factors, r.second!)} (${r.within.factor} = ${withinLabel})`,
      values: { estimate: sign * c.estimate, se: c.se, t: sign * c.t, df: c.df, p: c.p, lower: flip ? -c.upper : c.lower, upper: flip ? -c.lower : c.upper },
    };
  }
  if (r.kind === 'comparison') {
    const adjust = r.adjust ?? s.adjust;
    const k = key(`pairs ${adjust}`);
    if (!cache.has(k)) cache.set(k, pairwiseComparisons(model, r.factors, { ...grid, adjust }));
    const pairs = cache.get(k) as ReturnType<typeof pairwiseComparisons>;
    let i = indexOf(r.codes);
    let j = indexOf(r.second!);
    if (i < 0 || j < 0 || i === j) return 'no such pair';
    const flip = i > j;
    if (flip) [i, j] = [j, i];
    const n = meansOf().length;
    const c = pairs[(i * (2 * n - i - 1)) / 2 + (j - i - 1)]!;
    const sign = flip ? -1 : 1;
    return {
      label: `${labelOf(model, r.factors, r.codes)} - ${labelOf(model, r.factors, r.second!)}`,
      values: { estimate: sign * c.estimate, se: c.se, t: sign * c.t, df: c.df, p: c.p, lower: flip ? -c.upper : c.lower, upper: flip ? -c.lower : c.upper },
    };
  }
  const c = plannedContrast(model, r.factors, r.contrast!.weights, grid);
  return { label: r.contrast!.name, values: { estimate: c.estimate, se: c.se, t: c.t, df: c.df, p: c.p, lower: c.lower, upper: c.upper } };
}

function printed(v: ReportedValue): string {
  return v.comparator === '=' ? v.text : `${v.comparator} ${v.text}`;
}

function compareRows(model: FittedModel, resolved: readonly Resolved[], s: Settings, only?: ReadonlySet<MeanQuantity>): { rows: ComparedMeanRow[]; failed: MeansComparison['unmatched'] } {
  const cache = new Map<string, unknown>();
  const rows: ComparedMeanRow[] = [];
  const failed: MeansComparison['unmatched'] = [];
  for (const r of resolved) {
    let got: Recomputed | string;
    try {
      got = recompute(model, r, s, cache);
    } catch (error) {
      got = (error as Error).message;
    }
    if (typeof got === 'string') {
      failed.push({ kind: r.kind, label: r.printedAs, where: r.where, reason: got });
      continue;
    }
    const numbers: ComparedMeanNumber[] = [];
    for (const [q, v] of Object.entries(r.values) as Array<[MeanQuantity, ReportedValue]>) {
      const x = got.values[q === 'mean' && r.kind !== 'mean' ? 'estimate' : q === 'estimate' && r.kind === 'mean' ? 'mean' : q];
      if (x === undefined || (only && !only.has(q))) continue;
      numbers.push({ quantity: q, reported: printed(v), reportedValue: v.value, recomputed: x, difference: v.value - x, verdict: agrees(x, v) ? 'matches' : 'differs' });
    }
    rows.push({
      kind: r.kind,
      term: r.factors.join(':'),
      label: got.label,
      printedAs: r.printedAs,
      where: r.where,
      ...(r.kind === 'comparison' ? { adjust: r.adjust ?? s.adjust } : {}),
      numbers,
    });
  }
  return { rows, failed };
}

function tally(rows: readonly ComparedMeanRow[]): { compared: number; matches: number } {
  let compared = 0;
  let matches = 0;
  for (const r of rows) for (const n of r.numbers) {
    compared++;
    if (n.verdict === 'matches') matches++;
  }
  return { compared, matches };
}

function fmt(x: number): string {
  return x.toLocaleString('en-US', { maximumFractionDigits: 2, minimumFractionDigits: 2 });
}

/** Observed (unadjusted) means of the analysed rows at each level combination of `factors`, cells weighted by their rows. */
function observedMeans(model: FittedModel, factors: readonly string[]): Map<string, number> {
  const slots = factors.map((f) => model.factorVars.findIndex((v) => v.name === f));
  const sums = new Map<string, { n: number; sum: number }>();
  for (const cell of model.cells) {
    const q = Math.round(Math.sqrt(cell.r.length));
    const mean = model.outcomeOrigin + cell.r[q - 1]! / cell.r[0]!;
    const key = slots.map((s) => model.factorVars[s]!.levels[cell.levels[s]!]).join('\u0000');
    const acc = sums.get(key) ?? { n: 0, sum: 0 };
    acc.n += cell.n;
    acc.sum += cell.n * mean;
    sums.set(key, acc);
  }
  return new Map([...sums].map(([k, v]) => [k, v.sum / v.n]));
}

/** Compares the reported means, comparisons and contrasts with the recomputed ones, and searches the slips when they differ. */
export function compareMeans(model: FittedModel, reported: ReportedMeansSet, map: ReadonlyMap<string, string> = new Map()): MeansComparison | null {
  const { resolved, unmatched } = resolveAll(model, reported, map);
  if (resolved.length === 0 && unmatched.length === 0) return null;
  const stated = reported.statedAdjustment === null ? undefined : ADJUST_OF[reported.statedAdjustment.method];
  const rowAdjust = resolved.find((r) => r.adjust !== null)?.adjust ?? undefined;
  const fromReport = rowAdjust ?? stated;
  const adjust: MeansComparison['adjust'] =
    fromReport !== undefined ? { method: fromReport, from: 'reported' } : model.spec.adjust !== undefined ? { method: model.spec.adjust, from: 'analysis' } : { method: 'tukey', from: 'default' };
  // Rows that state no adjustment of their own take the one the report states.
  const rows = resolved.map((r) => (r.kind === 'comparison' && r.adjust === null && stated !== undefined ? { ...r, adjust: stated } : r));
  const settings: Settings = { at: new Map(model.spec.at), weights: model.spec.weights, adjust: adjust.method };
  const base = compareRows(model, rows, settings);
  const all = [...unmatched, ...base.failed];
  const { compared, matches } = tally(base.rows);
  const result: MeansComparison = { rows: base.rows, unmatched: all, compared, matches, differs: compared - matches, allMatch: matches === compared && all.length === 0, adjust, explanations: [] };
  if (matches < compared) result.explanations = searchSlips(model, rows, settings, base.rows);
  return result;
}

function searchSlips(model: FittedModel, resolved: readonly Resolved[], s: Settings, baseRows: readonly ComparedMeanRow[]): MeansExplanation[] {
  const out: MeansExplanation[] = [];
  const consider = (slip: MeansSlip, description: string, rows: readonly ComparedMeanRow[], kinds: ReadonlySet<string>) => {
    const relevant = rows.filter((r) => kinds.has(r.kind));
    const baseRelevant = baseRows.filter((r) => kinds.has(r.kind));
    const { compared, matches } = tally(relevant);
    const before = tally(baseRelevant);
    if (compared === 0 || matches <= before.matches) return;
    const share = matches / compared;
    if (share < 1 && share < 0.75) return;
    out.push({ slip, description, reproduces: share === 1 ? 'all' : 'most', matches, compared });
  };
  const means = resolved.filter((r) => r.kind === 'mean');
  const comparisons = resolved.filter((r) => r.kind === 'comparison');
  const contrasts = resolved.filter((r) => r.kind === 'contrast');

  // Unadjusted means reported as adjusted: the observed means (the SE and interval of an adjusted mean do not apply).
  if (means.length > 0 && model.numericVars.length > 1) {
    const rows: ComparedMeanRow[] = [];
    for (const r of means) {
      const observed = observedMeans(model, r.factors).get(r.codes.join('\u0000'));
      const v = r.values.mean;
      if (observed === undefined || v === undefined) continue;
      rows.push({ kind: 'mean', term: r.factors.join(':'), label: labelOf(model, r.factors, r.codes), printedAs: r.printedAs, where: r.where, numbers: [{ quantity: 'mean', reported: printed(v), reportedValue: v.value, recomputed: observed, difference: v.value - observed, verdict: agrees(observed, v) ? 'matches' : 'differs' }] });
    }
    const baseMeanOnly = compareRows(model, means, s, new Set(['mean'])).rows;
    const { compared, matches } = tally(rows);
    if (compared > 0 && matches > tally(baseMeanOnly).matches && (matches === compared || matches / compared >= 0.75)) {
      out.push({ slip: 'unadjusted-means', description: 'unadjusted (observed) means reported as adjusted means: the reported means are the means of the analysed rows at each level, not adjusted for the covariates', reproduces: matches === compared ? 'all' : 'most', matches, compared });
    }
  }

  // The covariate held at another value: at 0, and at the value that best reproduces the reported means.
  const covariates = model.numericVars.slice(0, -1).map((v, slot) => ({ name: v.name, mean: model.numericMeans[slot]! }));
  const meanKinds = new Set(['mean', 'contrast']);
  for (const c of covariates) {
    const current = s.at.get(c.name) ?? c.mean;
    const tried = new Set<number>([current]);
    const tryAt = (value: number, why: string) => {
      if (tried.has(value) || !Number.isFinite(value)) return;
      tried.add(value);
      const at = new Map(s.at).set(c.name, value);
      consider('covariate-value', `covariate ${c.name} held at ${fmt(value)}${why} instead of ${s.at.has(c.name) ? 'the value given' : 'its mean'} ${fmt(current)}`, compareRows(model, [...means, ...contrasts], { ...s, at }).rows, meanKinds);
    };
    tryAt(0, ' (0, as the uncentred model\'s intercept gives)');
    const withMean = means.filter((r) => r.values.mean !== undefined);
    if (withMean.length >= 2) {
      const at0 = compareRows(model, withMean, s, new Set(['mean'])).rows;
      const at1 = compareRows(model, withMean, { ...s, at: new Map(s.at).set(c.name, current + 1) }, new Set(['mean'])).rows;
      let num = 0;
      let den = 0;
      at0.forEach((row, i) => {
        const n0 = row.numbers[0];
        const n1 = at1[i]?.numbers[0];
        if (!n0 || !n1) return;
        const slope = n1.recomputed - n0.recomputed;
        num += slope * (n0.reportedValue! - n0.recomputed);
        den += slope * slope;
      });
      if (den > 1e-12) tryAt(current + num / den, ' (the value that best reproduces the reported means)');
    }
  }

  // The other factors' levels weighted the other way.
  if (model.factorVars.length > 1 && (means.length > 0 || contrasts.length > 0)) {
    const weights: CellWeights = s.weights === 'equal' ? 'proportional' : 'equal';
    consider(
      'other-weights',
      weights === 'proportional' ? 'levels of the other factors weighted by their share of the rows (proportional weights) instead of equally' : 'levels of the other factors weighted equally instead of by their share of the rows',
      compareRows(model, [...means, ...contrasts, ...comparisons], { ...s, weights }).rows,
      new Set(['mean', 'contrast', 'comparison']),
    );
  }

  // Another adjustment of the comparisons.
  if (comparisons.length > 0) {
    const used = new Set(comparisons.map((r) => r.adjust ?? s.adjust));
    for (const adjust of ADJUSTMENTS) {
      if (used.size === 1 && used.has(adjust)) continue;
      const rows = compareRows(model, comparisons.map((r) => ({ ...r, adjust })), { ...s, adjust }, new Set(['p', 'lower', 'upper'])).rows;
      const baseP = compareRows(model, comparisons, s, new Set(['p', 'lower', 'upper'])).rows;
      const { compared, matches } = tally(rows);
      if (compared === 0 || matches <= tally(baseP).matches || (matches < compared && matches / compared < 0.75)) continue;
      out.push({
        slip: 'other-adjustment',
        description: `${adjust === 'none' ? 'unadjusted p and intervals' : `${ADJUSTMENT_WORD[adjust]} p and intervals`} reported as ${ADJUSTMENT_WORD[[...used][0]!]} (${[...used].join(', ')} used here)`,
        reproduces: matches === compared ? 'all' : 'most',
        matches,
        compared,
      });
    }
  }
  out.sort((a, b) => b.matches / b.compared - a.matches / a.compared);
  return out;
}

const ADJUSTMENT_WORD: Record<Adjustment, string> = { tukey: "Tukey's", bonferroni: 'Bonferroni', holm: "Holm's", sidak: 'Šidák', scheffe: "Scheffé's", none: 'unadjusted' };
