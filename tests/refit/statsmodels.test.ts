import { describe, expect, it } from 'vitest';
import { fitModel, type AnovaTable } from '../../src/refit/index.js';
import { fixturePath, loadJson, relErr } from './helpers.js';

/**
 * Reference tables from statsmodels anova_lm (typ=1, 2, 3; type III with
 * C(factor, Sum) coding), written by tests/fixtures/refit/gen_statsmodels.py
 * into statsmodels_anova.json (the statsmodels version is recorded there).
 */
interface RefTable {
  formula: string;
  terms: Array<{ term: string; ss: number; df: number; F: number; p: number }>;
  residual: { ss: number; df: number };
}
interface RefFile {
  statsmodels: string;
  datasets: Array<{ name: string; file: string; spec: Record<string, unknown>; n: number; dropped: number; tables: Record<'1' | '2' | '3', RefTable> }>;
}

const ref = loadJson<RefFile>('refit/statsmodels_anova.json');
const TOL = 1e-9;

function compare(label: string, ours: AnovaTable, theirs: RefTable): string[] {
  const failures: string[] = [];
  const cmp = (what: string, a: number, b: number) => {
    if (!(relErr(a, b) <= TOL)) failures.push(`${label} ${what}: plumbline ${a} vs statsmodels ${ref.statsmodels} ${b} (rel. error ${relErr(a, b).toExponential(2)})`);
  };
  // Type I follows the order of the terms; types II and III do not, and are matched by name.
  if (ours.type === 1) expect(ours.terms.map((t) => t.term)).toEqual(theirs.terms.map((t) => t.term));
  else expect(ours.terms.map((t) => t.term).sort()).toEqual(theirs.terms.map((t) => t.term).sort());
  theirs.terms.forEach((t) => {
    const o = ours.terms.find((x) => x.term === t.term)!;
    cmp(`${t.term} SS`, o.ss, t.ss);
    cmp(`${t.term} df`, o.df, t.df);
    cmp(`${t.term} F`, o.F, t.F);
    cmp(`${t.term} p`, o.p, t.p);
  });
  cmp('residual SS', ours.residual.ss, theirs.residual.ss);
  cmp('residual df', ours.residual.df, theirs.residual.df);
  return failures;
}

describe(`types I, II, III against statsmodels ${ref.statsmodels} anova_lm`, () => {
  for (const ds of ref.datasets) {
    for (const type of [1, 2, 3] as const) {
      it(`${ds.name}, type ${type} (statsmodels: ${ds.tables[type].formula})`, async () => {
        // statsmodels (patsy) keeps these formulas' written order for type I (it puts terms with a numeric variable last,
        // as they are written here); refit's default order by degree is checked in degreeOrder-cli.test.ts.
        const model = await fitModel(fixturePath(`refit/${ds.file}`), { ...ds.spec, type, ...(type === 1 ? { termOrder: 'written' as const } : {}) });
        const table = model.anova(type);
        expect(table.n).toBe(ds.n);
        expect(table.droppedRows).toBe(ds.dropped);
        expect(table.type).toBe(type);
        expect(compare(`${ds.name} type ${type}`, table, ds.tables[type])).toEqual([]);
      });
    }
  }

  const threeByTwo = ref.datasets.find((d) => d.name === 'unbalanced_3x2_cov')!;
  for (const variant of ['unbalanced_3x2_cov_semicolon.csv', 'unbalanced_3x2_cov.xlsx']) {
    it(`${variant} (same data, other format) gives statsmodels' type III table`, async () => {
      const model = await fitModel(fixturePath(`refit/${variant}`), threeByTwo.spec);
      const table = model.anova(3);
      expect(table.n).toBe(threeByTwo.n);
      expect(compare(variant, table, threeByTwo.tables['3'])).toEqual([]);
    });
  }
});
