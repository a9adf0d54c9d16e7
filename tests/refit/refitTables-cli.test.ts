import { describe, expect, it } from 'vitest';
import { runCli, type CliIo } from '../../src/cli/program.js';
import { refitOutputSchema, type RefitOutput } from '../../src/refit/output.js';
import { fixturePath, loadJson } from './helpers.js';

/**
 * What `plumbline refit` prints beside the ANOVA table, run as a command
 * (--format json) and checked against tests/fixtures/refit/refit_tables.json,
 * written by gen_refit_tables.py on invented data:
 * - marginal means, comparisons and contrasts: statsmodels OLSResults.t_test
 *   (estimate, SE, t, unadjusted p, df, intervals);
 * - adjusted p: statsmodels multipletests (Bonferroni, Holm, Šidák), SciPy
 *   studentized_range.sf (Tukey-Kramer), SciPy f.sf (Scheffé); interval
 *   critical values from SciPy t.ppf, studentized_range.ppf and f.ppf;
 * - R² and adjusted R²: statsmodels OLSResults.rsquared, rsquared_adj;
 * - cell n, mean and SD: pandas (ddof = 1);
 * - Levene's test: SciPy stats.levene (center 'median' and 'mean').
 * The library versions are recorded in the fixture and named in every failure.
 */

interface Lin { estimate: number; se: number; t: number; p: number; df: number; lower: number; upper: number }
interface Pair { first: string; second: string; estimate: number; se: number; t: number; df: number; p: number; pUnadjusted: number; lower: number; upper: number }
interface Case {
  name: string;
  file: string;
  argv: string[];
  n: number;
  dropped: number;
  covariatesAt: Array<{ name: string; value: number }>;
  fit: { rSquared: number; adjustedRSquared: number };
  means: Record<string, Array<Lin & { label: string }>>;
  pairwise: Record<string, Record<string, Pair[]>>;
  contrasts: Array<Lin & { term: string; weights: number[] }>;
  descriptives: Array<{ label: string; n: number; mean: number; sd: number }>;
  levene: Record<'median' | 'mean', { F: number; p: number; df1: number; df2: number }>;
}
const ref = loadJson<{ statsmodels: string; scipy: string; cases: Case[] }>('refit/refit_tables.json');

/**
 * Relative tolerance for every number, Tukey's included. Measured when the
 * test was written: means, SE, t, p (Tukey's too) and R² agree to better
 * than 1e-11; interval bounds to about 1e-9, because SciPy's t.ppf in this
 * build is off by about 2e-9 relative (see marginalMeans.test.ts).
 */
const TOL = 1e-8;

async function run(argv: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const io: CliIo = { stdout: (t) => (out += t), stderr: (t) => (err += t), readStdin: async () => '', color: false };
  const code = await runCli(argv, io);
  return { code, out, err };
}

async function refitJson(c: Case, extra: string[]): Promise<RefitOutput> {
  const { code, out, err } = await run(['refit', fixturePath(`refit/${c.file}`), ...c.argv, ...extra, '--format', 'json']);
  expect(err).toBe('');
  expect(code).toBe(0);
  return refitOutputSchema.parse(JSON.parse(out));
}

/**
 * |ours - theirs| <= tol * max(|theirs|, scale): `scale` is the size of the
 * numbers a result is the difference of (a difference near 0 of two means
 * near 25 carries their absolute rounding).
 */
function check(failures: string[], source: string, label: string, ours: number | null, theirs: number, tol = TOL, scale = 0): void {
  if (ours === null || !(Math.abs(ours - theirs) <= tol * Math.max(Math.abs(theirs), scale))) {
    failures.push(`${label}: plumbline ${ours} vs ${source} ${theirs}`);
  }
}

const SM = `statsmodels ${ref.statsmodels}`;
const SP = `SciPy ${ref.scipy}`;
const ADJUST_SOURCE: Record<string, string> = {
  none: SM,
  bonferroni: `${SM} multipletests`,
  holm: `${SM} multipletests`,
  sidak: `${SM} multipletests`,
  tukey: `${SP} studentized_range`,
  scheffe: `${SP} f.sf`,
};

for (const c of ref.cases) {
  const terms = Object.keys(c.means);
  const meansArgs = terms.flatMap((t) => ['--means', t]);
  const meanScale = Math.max(...Object.values(c.means).flat().map((m) => Math.abs(m.estimate)));

  describe(`refit ${c.name} (${c.argv.join(' ')})`, () => {
    it(`marginal means, R², descriptives and covariates' values against ${SM} and pandas`, async () => {
      const o = await refitJson(c, meansArgs);
      const failures: string[] = [];
      expect(o.n).toBe(c.n);
      expect(o.droppedRows).toBe(c.dropped);
      check(failures, SM, 'R²', o.fit.rSquared, c.fit.rSquared);
      check(failures, SM, 'adjusted R²', o.fit.adjustedRSquared, c.fit.adjustedRSquared);
      expect(o.covariatesAt.map((x) => x.name)).toEqual(c.covariatesAt.map((x) => x.name));
      c.covariatesAt.forEach((x, i) => check(failures, 'pandas', `${x.name} mean`, o.covariatesAt[i]!.value, x.value));
      expect(o.descriptives.map((d) => d.label)).toEqual(c.descriptives.map((d) => d.label));
      c.descriptives.forEach((d, i) => {
        expect(o.descriptives[i]!.n).toBe(d.n);
        check(failures, 'pandas', `${d.label} M`, o.descriptives[i]!.mean, d.mean);
        check(failures, 'pandas', `${d.label} SD`, o.descriptives[i]!.sd, d.sd);
      });
      expect(o.marginalMeans!.map((m) => m.term)).toEqual(terms);
      for (const [term, rows] of Object.entries(c.means)) {
        const ours = o.marginalMeans!.find((m) => m.term === term)!;
        expect(ours.means.map((m) => m.label)).toEqual(rows.map((r) => r.label));
        rows.forEach((r, i) => {
          const m = ours.means[i]!;
          const label = `${term} ${r.label}`;
          check(failures, SM, `${label} mean`, m.mean, r.estimate);
          check(failures, SM, `${label} SE`, m.se, r.se);
          check(failures, SM, `${label} lower`, m.lower, r.lower);
          check(failures, SM, `${label} upper`, m.upper, r.upper);
          expect(m.df).toBe(r.df);
        });
        expect(ours.pairwise).toBeUndefined();
      }
      expect(failures).toEqual([]);
    });

    for (const adjust of ['none', 'bonferroni', 'holm', 'sidak', 'tukey', 'scheffe']) {
      it(`pairwise comparisons, --adjust ${adjust}, against ${ADJUST_SOURCE[adjust]}`, async () => {
        const o = await refitJson(c, [...meansArgs, '--adjust', adjust]);
        const failures: string[] = [];
        const tol = TOL;
        for (const term of terms) {
          const theirs = c.pairwise[term]![adjust]!;
          const ours = o.marginalMeans!.find((m) => m.term === term)!.pairwise!;
          expect(ours.adjust).toBe(adjust);
          expect(ours.comparisons.map((p) => `${p.first} - ${p.second}`)).toEqual(theirs.map((p) => `${p.first} - ${p.second}`));
          theirs.forEach((r, i) => {
            const p = ours.comparisons[i]!;
            const label = `${term} ${r.first} - ${r.second} (${adjust})`;
            const halfWidth = r.upper - r.estimate;
            check(failures, SM, `${label} estimate`, p.estimate, r.estimate, TOL, meanScale);
            check(failures, SM, `${label} SE`, p.se, r.se);
            check(failures, SM, `${label} t`, p.t, r.t, TOL, meanScale / r.se);
            check(failures, SM, `${label} unadjusted p`, p.pUnadjusted, r.pUnadjusted);
            check(failures, ADJUST_SOURCE[adjust]!, `${label} p`, p.p, r.p, tol);
            check(failures, ADJUST_SOURCE[adjust]!, `${label} lower`, p.lower, r.lower, tol, meanScale + halfWidth);
            check(failures, ADJUST_SOURCE[adjust]!, `${label} upper`, p.upper, r.upper, tol, meanScale + halfWidth);
            expect(p.df).toBe(r.df);
          });
        }
        expect(failures).toEqual([]);
      });
    }

    it(`planned contrasts given as --contrast weights against ${SM} t_test`, async () => {
      const o = await refitJson(c, c.contrasts.flatMap((x) => ['--contrast', `${x.term}=${x.weights.join(',')}`]));
      const failures: string[] = [];
      expect(o.contrasts!.length).toBe(c.contrasts.length);
      c.contrasts.forEach((r, i) => {
        const x = o.contrasts![i]!;
        const label = `contrast ${x.name}`;
        expect(x.term).toBe(r.term);
        expect(x.weights.map((w) => w.weight)).toEqual(r.weights);
        check(failures, SM, `${label} estimate`, x.estimate, r.estimate, TOL, meanScale);
        check(failures, SM, `${label} SE`, x.se, r.se);
        check(failures, SM, `${label} t`, x.t, r.t, TOL, meanScale / r.se);
        check(failures, SM, `${label} p`, x.p, r.p);
        check(failures, SM, `${label} lower`, x.lower, r.lower, TOL, meanScale);
        check(failures, SM, `${label} upper`, x.upper, r.upper, TOL, meanScale);
        expect(x.df).toBe(r.df);
      });
      expect(failures).toEqual([]);
    });

    for (const center of ['median', 'mean'] as const) {
      it(`--levene ${center} against ${SP} stats.levene(center='${center}')`, async () => {
        const o = await refitJson(c, ['--levene', center]);
        const failures: string[] = [];
        const r = c.levene[center];
        expect(o.levene).toMatchObject({ center, df1: r.df1, df2: r.df2, groups: r.df1 + 1 });
        check(failures, SP, 'Levene F', o.levene!.F, r.F);
        check(failures, SP, 'Levene p', o.levene!.p, r.p);
        expect(failures).toEqual([]);
      });
    }
  });
}
