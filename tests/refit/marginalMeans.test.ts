import { describe, expect, it } from 'vitest';
import { marginalMeans, pairwiseComparisons, plannedContrast, holmAdjust } from '../../src/refit/marginalMeans.js';
import { fitModel, RefitError } from '../../src/refit/index.js';
import { fixturePath, loadJson, relErr } from './helpers.js';
import { familyCritical, referenceBounds, tCritical, tukeyReferenceP } from './precisionReference.js';

/**
 * Reference: tests/fixtures/refit/statsmodels_emmeans.json, written by
 * gen_statsmodels.py (statsmodels OLSResults.t_test on averaged patsy
 * reference-grid rows; multipletests for Bonferroni/Holm; scipy
 * studentized_range for Tukey). Interval bounds and Tukey p are held to the
 * mpmath reference of precisionReference.ts instead of SciPy's quantiles and
 * studentized_range.sf (see there why).
 */
interface Lin { estimate: number; se: number; t: number; p: number; df: number; lower: number; upper: number }
interface Pair extends Lin { contrast: string; p_bonferroni: number; p_holm: number; p_tukey: number; tukey_lower: number; tukey_upper: number }
interface Case {
  dataset: string;
  file: string;
  spec: Record<string, unknown>;
  means: Record<string, Array<Lin & { levels: Record<string, string> }>>;
  pairwise: Record<string, Pair[]>;
  contrast?: Lin & { factor: string; weights: number[] };
}
const ref = loadJson<{ statsmodels: string; cases: Case[] }>('refit/statsmodels_emmeans.json');
const TOL = 1e-9;
/**
 * Interval bounds: statsmodels' estimate +- the mpmath critical value times
 * its SE (statsmodels takes its t quantile from scipy.stats.t.ppf, off by
 * about 2e-9 relative in this build: t.ppf(0.975, 45) = 2.0141033848 where
 * mpmath's root of the regularized incomplete beta gives 2.01410338888085).
 */
function bounds(r: { estimate: number; se: number }, critical: number) {
  return referenceBounds(r.estimate, r.se, critical);
}

/**
 * |ours - theirs| <= tol * max(|theirs|, scale). `scale` is the size of the
 * numbers a result is computed from: a difference of two means near 10 that
 * comes out as 0.005 carries the absolute rounding error of the means.
 */
function check(failures: string[], label: string, ours: number, theirs: number, tol = TOL, scale = 0): void {
  if (!(Math.abs(ours - theirs) <= tol * Math.max(Math.abs(theirs), scale)) && !(relErr(ours, theirs) <= tol)) {
    failures.push(`${label}: plumbline ${ours} vs statsmodels ${ref.statsmodels} ${theirs}`);
  }
}

describe(`estimated marginal means against statsmodels ${ref.statsmodels}`, () => {
  for (const c of ref.cases) {
    it(`${c.dataset}: means, SE, df and 95% intervals`, async () => {
      const model = await fitModel(fixturePath(`refit/${c.file}`), c.spec);
      const failures: string[] = [];
      for (const [target, rows] of Object.entries(c.means)) {
        const ours = marginalMeans(model, target);
        expect(ours.length).toBe(rows.length);
        for (const r of rows) {
          const m = ours.find((o) => Object.entries(r.levels).every(([k, v]) => o.levels[k] === v));
          expect(m, `${target} ${JSON.stringify(r.levels)}`).toBeDefined();
          const label = `${c.dataset} ${target} ${JSON.stringify(r.levels)}`;
          check(failures, `${label} mean`, m!.emmean, r.estimate);
          check(failures, `${label} SE`, m!.se, r.se);
          check(failures, `${label} lower`, m!.lower, bounds(r, tCritical(r.df)).lower);
          check(failures, `${label} upper`, m!.upper, bounds(r, tCritical(r.df)).upper);
          expect(m!.df).toBe(r.df);
        }
      }
      expect(failures).toEqual([]);
    });

    it(`${c.dataset}: pairwise comparisons with none, Bonferroni, Holm and Tukey`, async () => {
      const model = await fitModel(fixturePath(`refit/${c.file}`), c.spec);
      const failures: string[] = [];
      for (const [factor, pairs] of Object.entries(c.pairwise)) {
        const none = pairwiseComparisons(model, factor, { adjust: 'none' });
        const bonf = pairwiseComparisons(model, factor, { adjust: 'bonferroni' });
        const holm = pairwiseComparisons(model, factor, { adjust: 'holm' });
        const tukey = pairwiseComparisons(model, factor, { adjust: 'tukey' });
        expect(none.map((p) => p.contrast)).toEqual(pairs.map((p) => p.contrast));
        const meanScale = Math.max(...marginalMeans(model, factor).map((m) => Math.abs(m.emmean)));
        const k = marginalMeans(model, factor).length;
        pairs.forEach((r, i) => {
          const label = `${c.dataset} ${r.contrast}`;
          const halfWidth = r.upper - r.estimate;
          check(failures, `${label} estimate`, none[i]!.estimate, r.estimate, TOL, meanScale);
          check(failures, `${label} SE`, none[i]!.se, r.se);
          check(failures, `${label} t`, none[i]!.t, r.t, TOL, meanScale / r.se);
          check(failures, `${label} p`, none[i]!.p, r.p);
          check(failures, `${label} lower`, none[i]!.lower, bounds(r, tCritical(r.df)).lower, TOL, meanScale + halfWidth);
          check(failures, `${label} upper`, none[i]!.upper, bounds(r, tCritical(r.df)).upper, TOL, meanScale + halfWidth);
          check(failures, `${label} p Bonferroni`, bonf[i]!.p, r.p_bonferroni);
          check(failures, `${label} p Holm`, holm[i]!.p, r.p_holm);
          // Tukey p against mpmath where SciPy's is below 1e-3 (precisionReference.ts), at 1e-9 relative however small.
          // With two means the Tukey p is the t-test p exactly (statsmodels').
          const tukeyP = k === 2 ? { p: r.p, source: `statsmodels ${ref.statsmodels} t-test p (two means)` } : tukeyReferenceP(k, r.df, r.t, r.p_tukey);
          if (!(relErr(tukey[i]!.p, tukeyP.p) <= TOL)) failures.push(`${label} p Tukey: plumbline ${tukey[i]!.p} vs ${tukeyP.source} ${tukeyP.p}`);
          const tukeyBounds = bounds(r, familyCritical('tukey', k, pairs.length, r.df));
          check(failures, `${label} Tukey lower`, tukey[i]!.lower, tukeyBounds.lower, TOL, meanScale + halfWidth);
          check(failures, `${label} Tukey upper`, tukey[i]!.upper, tukeyBounds.upper, TOL, meanScale + halfWidth);
        });
      }
      expect(failures).toEqual([]);
    });

    if (c.contrast) {
      const con = c.contrast;
      it(`${c.dataset}: planned contrast ${JSON.stringify(con.weights)} on ${con.factor}, two- and one-sided`, async () => {
        const model = await fitModel(fixturePath(`refit/${c.file}`), c.spec);
        const failures: string[] = [];
        const two = plannedContrast(model, con.factor, con.weights);
        check(failures, 'estimate', two.estimate, con.estimate);
        check(failures, 'SE', two.se, con.se);
        check(failures, 't', two.t, con.t);
        check(failures, 'p two-sided', two.p, con.p);
        check(failures, 'lower', two.lower, bounds(con, tCritical(con.df)).lower);
        check(failures, 'upper', two.upper, bounds(con, tCritical(con.df)).upper);
        expect(two.df).toBe(con.df);
        const towardSign = plannedContrast(model, con.factor, con.weights, { alternative: con.t < 0 ? 'less' : 'greater' });
        check(failures, 'p one-sided (direction of t)', towardSign.p, con.p / 2);
        const against = plannedContrast(model, con.factor, con.weights, { alternative: con.t < 0 ? 'greater' : 'less' });
        check(failures, 'p one-sided (against t)', against.p, 1 - con.p / 2);
        expect(failures).toEqual([]);
      });
    }
  }
});

describe('contrast input checks', () => {
  it('rejects weights that do not sum to zero, a wrong count, unknown levels and unknown factors', async () => {
    const model = await fitModel(fixturePath('refit/unbalanced_3x2_cov.csv'), ref.cases[0]!.spec);
    expect(() => plannedContrast(model, 'group', [1, 1, -1])).toThrow(/sum to zero/);
    expect(() => plannedContrast(model, 'group', [1, -1])).toThrow(/3 means/);
    expect(() => plannedContrast(model, 'group', { lo: 1, max: -1 })).toThrow(/no such level/);
    expect(() => marginalMeans(model, 'age')).toThrow(RefitError);
    const byName = plannedContrast(model, 'group', { lo: 1, mid: -0.5, hi: -0.5 });
    const byOrder = plannedContrast(model, 'group', [1, -0.5, -0.5]);
    expect(byName.estimate).toBe(byOrder.estimate);
  });

  it('levels and factors named like members of Object.prototype are keys like any other', async () => {
    const levels = ['constructor', 'toString', 'valueOf'];
    const rows = Array.from({ length: 18 }, (_, index) => [String((index * 7) % 11), levels[index % 3]!]);
    const model = await fitModel({ name: 'names.csv', header: ['score', '__proto__'], rows }, { model: 'score ~ __proto__' });
    const means = marginalMeans(model, '__proto__');
    expect(means.map((m) => m.levels.__proto__)).toEqual(levels);
    expect(Object.getPrototypeOf(means[0]!.levels)).toBeNull();
    const byName = plannedContrast(model, '__proto__', { constructor: 1, toString: -1 });
    expect(byName.estimate).toBe(plannedContrast(model, '__proto__', [1, -1, 0]).estimate);
    expect(() => plannedContrast(model, '__proto__', { hasOwnProperty: 1, valueOf: -1 })).toThrow(/"hasOwnProperty": no such level/);
  });

  it('Holm adjustment is monotone and capped at 1 (Holm 1979, step-down)', () => {
    expect(holmAdjust([0.01, 0.04, 0.03, 0.5])).toEqual([0.04, 0.09, 0.09, 0.5]);
    expect(holmAdjust([0.6, 0.7])).toEqual([1, 1]);
  });
});
