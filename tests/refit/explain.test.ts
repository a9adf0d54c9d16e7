import { describe, expect, it } from 'vitest';
import { compareTables } from '../../src/refit/compare.js';
import { explainMismatch, hierarchicalOrders, impliedSampleSize, loadTable } from '../../src/refit/explain.js';
import { parseFormula } from '../../src/refit/formula.js';
import { fitModel } from '../../src/refit/model.js';
import { parseCell, type ReportedSet, type ReportedValue } from '../../src/refit/reportedTable.js';
import type { AnalysisSpecInput } from '../../src/refit/spec.js';
import { fixturePath, loadJson, relErr } from './helpers.js';

/**
 * Each slip's table from statsmodels (tests/fixtures/refit/gen_statsmodels.py
 * writes statsmodels_slips.json): the refit of the slip must agree with it,
 * and, printed with the usual rounding as a "reported" table, the slip must
 * be found and named from the analysis the authors describe.
 */
interface SlipEntry {
  dataset: string;
  file: string;
  slip: string;
  base: AnalysisSpecInput;
  refit: Partial<AnalysisSpecInput>;
  formula: string | string[];
  typ: 1 | 2 | 3;
  n: number;
  terms: Array<{ term: string; ss: number; df: number; F: number; p: number }>;
  residual: { ss: number; df: number };
}
const ref = loadJson<{ statsmodels: string; slips: SlipEntry[] }>('refit/statsmodels_slips.json');

function cell(text: string): ReportedValue {
  const v = parseCell(text);
  if (v === null) throw new Error(`bad cell ${text}`);
  return v;
}

/** The slip's table as a manuscript would print it: SS and F to 2 decimals, p to 3 (or "< .001"). */
function printed(entry: SlipEntry): ReportedSet {
  const p = (x: number) => (x < 0.001 ? '< .001' : x.toFixed(3).replace(/^0/, ''));
  return {
    file: 'printed',
    rows: entry.terms.map((t) => ({
      label: t.term.split(':').join(' × '),
      values: { ss: cell(t.ss.toFixed(2)), df: cell(String(t.df)), F: cell(t.F.toFixed(2)), p: cell(p(t.p)) },
      where: 'test',
    })),
    residual: { label: 'Error', values: { ss: cell(entry.residual.ss.toFixed(2)), df: cell(String(entry.residual.df)) }, where: 'test' },
    sources: ['test'],
  };
}

describe(`each slip reproduced against statsmodels ${ref.statsmodels}`, () => {
  it('covers every kind of slip the brief names', () => {
    const kinds = new Set(ref.slips.map((s) => s.slip));
    for (const k of ['type-1', 'type-1-order', 'type-2', 'type-3-other-coding', 'missing-codes-kept', 'covariate-omitted', 'interaction-omitted']) {
      expect(kinds.has(k), k).toBe(true);
    }
  });

  for (const entry of ref.slips) {
    const label = `${entry.slip} on ${entry.dataset} (statsmodels: ${Array.isArray(entry.formula) ? entry.formula.at(-1) : entry.formula}, typ=${entry.typ})`;

    it(`${label}: the refit of the slip agrees with statsmodels`, async () => {
      // Type I in the order statsmodels (patsy) took the terms, as written in these formulas; types II and III matched by name.
      const spec = { ...entry.base, ...entry.refit, ...(entry.typ === 1 ? { termOrder: 'written' } : {}) } as AnalysisSpecInput;
      const table = (await fitModel(fixturePath(`refit/${entry.file}`), spec)).anova(entry.typ);
      expect(table.n).toBe(entry.n);
      if (entry.typ === 1) expect(table.terms.map((t) => t.term)).toEqual(entry.terms.map((t) => t.term));
      else expect(table.terms.map((t) => t.term).sort()).toEqual(entry.terms.map((t) => t.term).sort());
      entry.terms.forEach((t) => {
        const o = table.terms.find((x) => x.term === t.term)!;
        expect(relErr(o.ss, t.ss), `${t.term} SS`).toBeLessThan(1e-9);
        expect(o.df).toBe(t.df);
        expect(relErr(o.F, t.F), `${t.term} F`).toBeLessThan(1e-9);
        expect(relErr(o.p, t.p), `${t.term} p`).toBeLessThan(1e-8);
      });
      expect(relErr(table.residual.ss, entry.residual.ss)).toBeLessThan(1e-9);
      expect(table.residual.df).toBe(entry.residual.df);
    });

    it(`${label}: found and named from the described analysis`, async () => {
      const file = fixturePath(`refit/${entry.file}`);
      const model = await fitModel(file, entry.base);
      const reported = printed(entry);
      const baseline = compareTables(model.anova(), reported);
      expect(baseline.allMatch).toBe(false);
      const result = await explainMismatch(await loadTable(file), entry.base, model, baseline, reported);
      const hit = result.explanations.find((e) => e.slip === entry.slip);
      expect(hit, result.explanations.map((e) => e.description).join('; ')).toBeDefined();
      expect(hit!.reproduces).toBe('all');
      // Nothing explains the table better than the planted slip.
      expect(result.explanations[0]!.reproduces).toBe('all');
    });
  }
});

describe('explanations', () => {
  it('orders terms so that each interaction follows the terms it contains', () => {
    const { terms } = parseFormula('y ~ a*b + x');
    const orders = hierarchicalOrders(terms).map((o) => o.map((t) => t.name).join(' '));
    expect(orders).toContain('x a b a:b');
    expect(orders).not.toContain('a b a:b x'); // the formula's own order
    for (const o of orders) expect(o.indexOf('a:b')).toBeGreaterThan(Math.max(o.indexOf('a '), o.indexOf('b ')));
  });

  it('lists none when the reported numbers are nothing like any slip', async () => {
    const file = fixturePath('refit/unbalanced_3x2_cov.csv');
    const spec = { factors: { group: { levels: ['lo', 'mid', 'hi'] }, dose: {} }, covariates: ['age'], model: 'score ~ group*dose + age' };
    const model = await fitModel(file, spec);
    const reported: ReportedSet = {
      file: 'x',
      rows: ['group', 'dose', 'group x dose', 'age'].map((label) => ({ label, values: { F: cell('99.99'), p: cell('.5') }, where: 't' })),
      residual: null,
      sources: [],
    };
    const baseline = compareTables(model.anova(), reported);
    const result = await explainMismatch(await loadTable(file), spec, model, baseline, reported);
    expect(result.explanations).toEqual([]);
    expect(result.tried).toBeGreaterThan(5);
  });

  it('says what N the reported error df implies', async () => {
    const file = fixturePath('refit/oneway_cov_missing.csv');
    const spec = { factors: { cond: {} }, missing: { post: '-99', pretest: [-99] }, model: 'post ~ cond + pretest' };
    const table = (await fitModel(file, spec)).anova();
    // 4 groups + covariate: 5 parameters. Error df 38 would mean N = 43.
    const implied = impliedSampleSize(table, {
      file: 'x',
      rows: [
        { label: 'cond', values: { df: cell('3') }, where: 't' },
        { label: 'pretest', values: { df: cell('1') }, where: 't' },
      ],
      residual: { label: 'Error', values: { df: cell(String(table.n + table.droppedRows - 5)) }, where: 't' },
      sources: [],
    })!;
    expect(implied.parameters).toBe(5);
    expect(implied.impliedN).toBe(table.n + table.droppedRows);
    expect(implied.note).toMatch(/every row of the file/);
    const same = impliedSampleSize(table, { file: 'x', rows: [], residual: { label: 'Error', values: { df: cell(String(table.residual.df)) }, where: 't' }, sources: [] })!;
    expect(same.impliedN).toBe(table.n);
    expect(same.parametersFrom).toBe('model');
  });
});
