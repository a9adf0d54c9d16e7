import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import mammoth from 'mammoth';
import { describe, expect, it } from 'vitest';
import { refitOutputSchema, type RefitOutput } from '../../src/refit/output.js';
import { fixturePath, loadJson, runRefitInProcess as run } from './helpers.js';
import { familyCritical, MPMATH, referenceBounds, tCritical, tukeyReferenceP } from './precisionReference.js';

/**
 * What `plumbline refit` prints beside the ANOVA table, run as a command
 * (--format json) and checked against tests/fixtures/refit/refit_tables.json,
 * written by gen_refit_tables.py on invented data:
 * - marginal means, comparisons and contrasts: statsmodels OLSResults.t_test
 *   (estimate, SE, t, unadjusted p, df, intervals);
 * - adjusted p: statsmodels multipletests (Bonferroni, Holm, Šidák), SciPy
 *   f.sf (Scheffé), and for Tukey-Kramer mpmath's studentized range integral
 *   where SciPy's studentized_range.sf is below 1e-3 (SciPy's above);
 * - interval bounds: statsmodels' estimate +- an mpmath critical value times
 *   statsmodels' SE (t, F and studentized range points from
 *   refit_precision.json, see precisionReference.ts: SciPy's t.ppf, which
 *   statsmodels uses, is off by about 2e-9 relative);
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
  coefficients: Record<'sum' | 'treatment', Array<{ name: string; estimate: number; se: number; t: number; p: number; lower: number; upper: number }> | undefined>;
  proportional?: {
    means: Record<string, Array<Lin & { label: string }>>;
    pairwise: Record<string, Pair[]>;
    contrasts: Array<Lin & { term: string; weights: number[] }>;
  };
  within?: {
    by: string;
    means: string;
    families: Array<{ level: string; means: Array<Lin & { label: string }>; pairwise: Record<string, Pair[]> }>;
  };
  at?: {
    values: Record<string, number>;
    argv: string[];
    means: Record<string, Array<Lin & { label: string }>>;
    pairwise: Record<string, Pair[]>;
    contrasts: Array<Lin & { term: string; weights: number[] }>;
  };
}
const ref = loadJson<{ statsmodels: string; scipy: string; cases: Case[] }>('refit/refit_tables.json');

/**
 * Relative tolerance for every number, interval bounds and Tukey p
 * included. Measured when the test was written: means, SE, t, p and R²
 * agree with statsmodels to better than 1e-11; interval bounds with the
 * mpmath-based reference to better than 1e-12; Tukey p with mpmath to better
 * than 1e-12 down to p = 4e-17 (with SciPy's, above 1e-3, to about 5e-12).
 */
const TOL = 1e-9;


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

/**
 * Adjusted p against its reference at 1e-9 relative. Tukey's against mpmath
 * wherever SciPy's is below 1e-3 (SciPy's studentized_range.sf is off by
 * about 1.2e-14 absolute: 4e-5 relative at p = 3e-10, and 0 below 1e-14), so
 * it is held to 1e-9 relative however small it is; for two means (k = 2) the
 * Tukey p also equals the unadjusted t-test p exactly.
 */
function checkP(failures: string[], adjust: string, label: string, ours: { p: number | null; pUnadjusted: number | null }, theirs: { p: number; t: number; df: number; pUnadjusted: number }, k: number): void {
  if (adjust !== 'tukey') {
    check(failures, ADJUST_SOURCE[adjust]!, `${label} p`, ours.p, theirs.p);
    return;
  }
  // With two means the Tukey p is the t-test p exactly: statsmodels' (SciPy's studentized_range.sf gives 0 below 1e-14).
  const reference = k === 2 ? { p: theirs.pUnadjusted, source: `${SM} t-test p (Tukey with two means)` } : tukeyReferenceP(k, theirs.df, theirs.t, theirs.p);
  check(failures, reference.source, `${label} p`, ours.p, reference.p);
  if (k === 2) check(failures, 'the unadjusted t-test p (Tukey with two means)', `${label} p`, ours.p, ours.pUnadjusted ?? NaN);
}

/** Both interval bounds against estimate +- critical SE (mpmath critical values); `scale` as in check(). */
function checkBounds(failures: string[], label: string, ours: { lower: number | null; upper: number | null }, theirs: { estimate: number; se: number }, critical: number, scale = 0): void {
  const reference = referenceBounds(theirs.estimate, theirs.se, critical);
  const source = `${SM} estimate and SE with the ${MPMATH} critical value ${critical}`;
  check(failures, source, `${label} lower`, ours.lower, reference.lower, TOL, scale);
  check(failures, source, `${label} upper`, ours.upper, reference.upper, TOL, scale);
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
          checkBounds(failures, label, m, r, tCritical(r.df));
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
            checkP(failures, adjust, label, p, r, c.means[term]!.length);
            checkBounds(failures, label, p, r, familyCritical(adjust, c.means[term]!.length, theirs.length, r.df), meanScale + halfWidth);
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
        checkBounds(failures, label, x, r, tCritical(r.df), meanScale);
        expect(x.df).toBe(r.df);
      });
      expect(failures).toEqual([]);
    });

    for (const coding of ['sum', 'treatment'] as const) {
      const theirs = c.coefficients[coding];
      if (!theirs) continue;
      it(`--coefficients in ${coding} coding against ${SM} params, bse, tvalues, pvalues, conf_int`, async () => {
        // statsmodels (patsy) orders these design columns as the formula is written.
        const o = await refitJson(c, ['--coefficients', '--coding', coding, '--term-order', 'written']);
        const failures: string[] = [];
        expect(o.coefficients!.map((x) => x.name)).toEqual(theirs.map((x) => x.name));
        theirs.forEach((r, i) => {
          const x = o.coefficients![i]!;
          const scale = Math.abs(r.upper - r.lower);
          check(failures, SM, `${r.name} b`, x.estimate, r.estimate, TOL, scale);
          check(failures, SM, `${r.name} SE`, x.se, r.se);
          check(failures, SM, `${r.name} t`, x.t, r.t, TOL, scale / r.se);
          check(failures, SM, `${r.name} p`, x.p, r.p);
          checkBounds(failures, r.name, x, r, tCritical(c.means[terms[0]!]![0]!.df), scale + Math.abs(r.estimate));
        });
        expect(failures).toEqual([]);
      });
    }

    const prop = c.proportional;
    if (prop) {
      it(`--weights proportional: means, Tukey comparisons and a contrast with the other factors weighted by their rows, against ${SM} t_test and ${SP}`, async () => {
        const first = c.contrasts[0]!;
        const o = await refitJson(c, [
          ...Object.keys(prop.means).flatMap((t) => ['--means', t]),
          '--adjust', 'tukey', '--weights', 'proportional',
          '--contrast', `${first.term}=${first.weights.join(',')}`,
        ]);
        expect(o.cellWeights).toBe('proportional');
        const failures: string[] = [];
        for (const [term, rows] of Object.entries(prop.means)) {
          const ours = o.marginalMeans!.find((m) => m.term === term)!;
          rows.forEach((r, i) => {
            check(failures, SM, `${term} ${r.label} mean (proportional)`, ours.means[i]!.mean, r.estimate);
            check(failures, SM, `${term} ${r.label} SE (proportional)`, ours.means[i]!.se, r.se);
          });
          prop.pairwise[term]!.forEach((r, i) => {
            const p = ours.pairwise!.comparisons[i]!;
            check(failures, SM, `${term} ${r.first} - ${r.second} estimate (proportional)`, p.estimate, r.estimate, TOL, meanScale);
            checkP(failures, 'tukey', `${term} ${r.first} - ${r.second} Tukey p (proportional)`, p, r, c.proportional!.means[term]!.length);
            checkBounds(failures, `${term} ${r.first} - ${r.second} Tukey (proportional)`, p, r, familyCritical('tukey', c.proportional!.means[term]!.length, prop.pairwise[term]!.length, r.df), meanScale + r.upper - r.estimate);
          });
        }
        check(failures, SM, 'contrast estimate (proportional)', o.contrasts![0]!.estimate, prop.contrasts[0]!.estimate, TOL, meanScale);
        check(failures, SM, 'contrast SE (proportional)', o.contrasts![0]!.se, prop.contrasts[0]!.se);
        expect(failures).toEqual([]);
        // The weighting changes the numbers: equal weights give the other reference values.
        const firstTerm = Object.keys(prop.means)[0]!;
        const equal = await refitJson(c, ['--means', firstTerm]);
        expect(Math.abs(equal.marginalMeans![0]!.means[0]!.mean! - prop.means[firstTerm]![0]!.estimate)).toBeGreaterThan(1e-3);
        const text = await run(['refit', fixturePath(`refit/${c.file}`), ...c.argv, '--means', firstTerm, '--weights', 'proportional']);
        expect(text.out).toContain('levels of factors not in the table weighted by their share of the analysed rows');
      });
    }

    const within = c.within;
    if (within) {
      for (const adjust of ['tukey', 'bonferroni', 'holm', 'sidak', 'scheffe', 'none']) {
        it(`--means ${within.means} --within ${within.by} --adjust ${adjust}: simple comparisons, one family per level, against ${ADJUST_SOURCE[adjust]}`, async () => {
          const o = await refitJson(c, ['--means', within.means, '--within', within.by, '--adjust', adjust]);
          const failures: string[] = [];
          const ours = o.marginalMeans![0]!;
          expect(ours.within).toBe(within.by);
          const theirMeans = within.families.flatMap((f) => f.means.map((m) => ({ ...m, label: `${f.level}, ${m.label}` })));
          expect(ours.means.map((m) => m.label)).toEqual(theirMeans.map((m) => m.label));
          theirMeans.forEach((r, i) => {
            check(failures, SM, `${r.label} mean`, ours.means[i]!.mean, r.estimate);
            check(failures, SM, `${r.label} SE`, ours.means[i]!.se, r.se);
          });
          const theirs = within.families.flatMap((f) => f.pairwise[adjust]!.map((p) => ({ ...p, within: f.level, k: f.means.length, m: f.pairwise[adjust]!.length })));
          expect(ours.pairwise!.comparisons.map((p) => `${p.within}: ${p.first} - ${p.second}`)).toEqual(theirs.map((p) => `${p.within}: ${p.first} - ${p.second}`));
          theirs.forEach((r, i) => {
            const p = ours.pairwise!.comparisons[i]!;
            const label = `${r.within}: ${r.first} - ${r.second} (${adjust})`;
            const halfWidth = r.upper - r.estimate;
            check(failures, SM, `${label} estimate`, p.estimate, r.estimate, TOL, meanScale);
            check(failures, SM, `${label} SE`, p.se, r.se);
            checkP(failures, adjust, label, p, r, r.k);
            checkBounds(failures, label, p, r, familyCritical(adjust, r.k, r.m, r.df), meanScale + halfWidth);
          });
          expect(ours.pairwise!.method).toMatch(new RegExp(`, within each level of ${within.by}$`));
          expect(failures).toEqual([]);
        });
      }
    }

    const at = c.at;
    if (at) {
      it(`--at ${at.argv.join(' ')}: means, comparisons and contrasts with the covariate held there, against ${SM} t_test`, async () => {
        const o = await refitJson(c, [
          ...Object.keys(at.means).flatMap((t) => ['--means', t]),
          '--adjust', 'none',
          ...c.contrasts.flatMap((x) => ['--contrast', `${x.term}=${x.weights.join(',')}`]),
          ...at.argv.flatMap((a) => ['--at', a]),
        ]);
        const failures: string[] = [];
        expect(o.covariatesAt).toEqual(Object.entries(at.values).map(([name, value]) => ({ name, value, from: 'given' })));
        for (const [term, rows] of Object.entries(at.means)) {
          const ours = o.marginalMeans!.find((m) => m.term === term)!;
          rows.forEach((r, i) => {
            const m = ours.means[i]!;
            check(failures, SM, `${term} ${r.label} mean at ${at.argv}`, m.mean, r.estimate);
            check(failures, SM, `${term} ${r.label} SE at ${at.argv}`, m.se, r.se);
            checkBounds(failures, `${term} ${r.label} at ${at.argv}`, m, r, tCritical(r.df));
          });
          at.pairwise[term]!.forEach((r, i) => {
            const p = ours.pairwise!.comparisons[i]!;
            check(failures, SM, `${term} ${r.first} - ${r.second} estimate at ${at.argv}`, p.estimate, r.estimate, TOL, meanScale);
            check(failures, SM, `${term} ${r.first} - ${r.second} p at ${at.argv}`, p.p, r.p);
          });
        }
        at.contrasts.forEach((r, i) => {
          check(failures, SM, `contrast ${i + 1} estimate at ${at.argv}`, o.contrasts![i]!.estimate, r.estimate, TOL, meanScale);
          check(failures, SM, `contrast ${i + 1} SE at ${at.argv}`, o.contrasts![i]!.se, r.se);
          check(failures, SM, `contrast ${i + 1} p at ${at.argv}`, o.contrasts![i]!.p, r.p);
        });
        expect(failures).toEqual([]);
        const text = await run(['refit', fixturePath(`refit/${c.file}`), ...c.argv, '--means', terms[0]!, ...at.argv.flatMap((a) => ['--at', a])]);
        const given = Object.entries(at.values).map(([k, v]) => `${k} = ${v.toFixed(2)}`).join(', ');
        expect(text.out).toContain(`Covariates held at ${given} (the value${Object.keys(at.values).length > 1 ? 's' : ''} given)`);
      });
    }

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

const ancova = ref.cases.find((c) => c.name === 'ancova_3x2')!;
const balanced = ref.cases.find((c) => c.name === 'oneway_balanced')!;
const ANCOVA = [fixturePath(`refit/${ancova.file}`), ...ancova.argv];
const tmp = mkdtempSync(join(tmpdir(), 'plumbline-refit-tables-'));
/** A number as the reports print it (two decimals), from the reference value. */
const two = (x: number) => x.toFixed(2);
/** A p as the reports print it (APA), from the reference value. */
const apaP = (p: number) => (p < 0.001 ? '< \\.001' : p.toFixed(3).replace(/^0\./, '\\.'));

describe('refit reports: the tables beside the ANOVA table in every format', () => {
  const args = [...ANCOVA, '--means', 'group', '--adjust', 'holm', '--contrast', 'group=-0.5,1,-0.5', '--levene', 'median'];
  const groupMeans = ancova.means.group!;
  const holm = ancova.pairwise.group!.holm!;
  const contrast = ancova.contrasts[0]!;

  it('text: R², descriptives, adjusted means with CI, Holm comparisons, the contrast and Levene (median-centred)', async () => {
    const { code, out } = await run(['refit', ...args]);
    expect(code).toBe(0);
    expect(out).toContain(`R² = ${ancova.fit.rSquared.toFixed(3).replace(/^0/, '')}, adjusted R² = ${ancova.fit.adjustedRSquared.toFixed(3).replace(/^0/, '')}`);
    expect(out).toContain('Unadjusted descriptives of wellbeing by group × site');
    const cell = ancova.descriptives[0]!;
    expect(out).toMatch(new RegExp(`control\\s+north\\s+${cell.n}\\s+${two(cell.mean)}\\s+${two(cell.sd)}`));
    expect(out).toContain('Estimated marginal means of wellbeing by group');
    for (const m of groupMeans) expect(out).toMatch(new RegExp(`${m.label}\\s+${two(m.estimate)}\\s+${two(m.se)}\\s+\\[${two(m.lower)}, ${two(m.upper)}\\]`));
    expect(out).toContain(`Covariates held at baseline = ${two(ancova.covariatesAt[0]!.value)} (its mean over the ${ancova.n} analysed rows)`);
    expect(out).toContain('Pairwise comparisons of wellbeing by group, Holm adjustment');
    expect(out).toContain('p and intervals adjusted: Holm (step-down, 3 comparisons; intervals Bonferroni)');
    expect(out).toMatch(new RegExp(`control - training\\s+${two(holm[0]!.estimate)}\\s+${two(holm[0]!.se)}\\s+46\\s+${two(holm[0]!.t)}\\s+${apaP(holm[0]!.p)}\\s+\\[${two(holm[0]!.lower)}, ${two(holm[0]!.upper)}\\]`));
    expect(out).toMatch(new RegExp(`training vs control \\+ waitlist\\s+control -0\\.5; training 1; waitlist -0\\.5\\s+${two(contrast.estimate)}\\s+${two(contrast.se)}\\s+46`));
    const lev = ancova.levene.median;
    expect(out).toContain(`Levene's test of equal variances across the 6 cells, centred on each cell's median (Brown-Forsythe): F(5, ${lev.df2}) = ${two(lev.F)}, p = ${lev.p.toFixed(3).replace(/^0/, '')}`);
  });

  it('Markdown: italic symbols in the headers and a note naming N, exclusions, type, coding and the covariate', async () => {
    const { out } = await run(['refit', ...args, '--format', 'md']);
    expect(out).toContain('| group | *M* | *SE* | 95% CI |');
    expect(out).toContain('| Comparison | Difference | *SE* | *df* | *t* | *p* | 95% CI |');
    expect(out).toContain(`| control | ${two(groupMeans[0]!.estimate)} | ${two(groupMeans[0]!.se)} | [${two(groupMeans[0]!.lower)}, ${two(groupMeans[0]!.upper)}] |`);
    expect(out).toMatch(/\*Note\.\* Means adjusted by the model \(least-squares means\)\. Covariates held at baseline = [\d.]+ \(its mean over the 53 analysed rows\); levels of factors not in the table weighted equally\. df = 46\. N = 53; 3 of 56 rows excluded for missing values \(codes wellbeing = -9; baseline = 999\)\. Type III sums of squares, sum-to-zero \(deviation\) coding\./);
    expect(out).toContain("Levene's test of equal variances across the 6 cells, centred on each cell's median (Brown-Forsythe): *F*(5, 47)");
  });

  it('HTML and DOCX: numbered tables with italic symbols and notes', async () => {
    const htmlFile = join(tmp, 'tables.html');
    expect((await run(['refit', ...args, '--format', 'html', '--output', htmlFile])).code).toBe(0);
    const html = readFileSync(htmlFile, 'utf8');
    expect(html).toContain('<p class="caption">Estimated marginal means of wellbeing by group</p>');
    expect(html).toContain('<th class="src">group</th><th><i>M</i></th><th><i>SE</i></th><th>95% CI</th>');
    expect(html).toContain(`<td class="src">training</td><td>${two(groupMeans[1]!.estimate)}</td>`);
    expect(html).toMatch(/<b>Table 5<\/b>[\s\S]*Planned contrasts/);
    expect(html).toContain('<i>R</i>² = ');
    expect(html).not.toMatch(/<(link|script|img)\b|src=|href=/);

    const docxFile = join(tmp, 'tables.docx');
    expect((await run(['refit', ...args, '--format', 'docx', '--output', docxFile])).code).toBe(0);
    const { value } = await mammoth.convertToHtml({ path: docxFile });
    expect(value).toContain('<p><em>Estimated marginal means of wellbeing by group</em></p>');
    expect(value).toContain('<th><p><em>M</em></p></th><th><p><em>SE</em></p></th><th><p>95% CI</p></th>');
    expect(value).toContain(`[${two(groupMeans[0]!.lower)}, ${two(groupMeans[0]!.upper)}]`);
    expect(value).toContain('Pairwise comparisons of wellbeing by group, Holm adjustment');
    expect(value).toContain('Covariates held at baseline = ');
    expect(value).toContain('<em>F</em>(5, 47)');
  });

  it('names Tukey-Kramer for unequal cells and Tukey for a balanced design', async () => {
    const unequal = await run(['refit', ...ANCOVA, '--means', 'group', '--pairwise']);
    expect(unequal.out).toContain('Pairwise comparisons of wellbeing by group, Tukey-Kramer adjustment');
    const equal = await run(['refit', fixturePath(`refit/${balanced.file}`), ...balanced.argv, '--means', 'cond', '--pairwise']);
    expect(equal.out).toContain('Pairwise comparisons of score by cond, Tukey adjustment');
    expect(equal.out).toContain('No covariates');
  });
});

describe('refit reports: long and unadjusted', () => {
  it('leaves a descriptives table of more than 60 cells to the JSON output, and says so', async () => {
    const data = join(tmp, 'many-cells.csv');
    const rows = Array.from({ length: 186 }, (_, i) => `${(i * 37) % 23},p${i % 62}`);
    writeFileSync(data, ['y,person', ...rows].join('\n'));
    const text = await run(['refit', data, '--model', 'y ~ person']);
    expect(text.out).toContain('Cell descriptives (n, M, SD) of the 62 cells are in the JSON output (--format json).');
    expect(text.out).not.toContain('Unadjusted descriptives');
    const json = refitOutputSchema.parse(JSON.parse((await run(['refit', data, '--model', 'y ~ person', '--format', 'json'])).out));
    expect(json.descriptives.length).toBe(62);
  });

  it('--within prints the cell means and the comparisons grouped by the level they are made within', async () => {
    const family = ancova.within!.families[0]!;
    const first = family.pairwise.tukey![0]!;
    const { out } = await run(['refit', ...ANCOVA, '--means', 'group', '--within', 'site']);
    expect(out).toContain('Estimated marginal means of wellbeing by group within site');
    expect(out).toMatch(new RegExp(`site\\s+Comparison\\s+Difference`));
    expect(out).toMatch(new RegExp(`north\\s+control - training\\s+${two(first.estimate)}\\s+${two(first.se)}\\s+46\\s+${two(first.t)}\\s+${apaP(first.p)}`));
    expect(out).toContain('Tukey-Kramer (studentized range, 3 means), within each level of site');
  });

  it('--adjust none prints unadjusted comparisons and says so', async () => {
    const { out } = await run(['refit', ...ANCOVA, '--means', 'site', '--adjust', 'none']);
    expect(out).toContain('Pairwise comparisons of wellbeing by site, unadjusted');
    expect(out).toContain('Note. p and intervals not adjusted for multiple comparisons.');
  });
});

describe('refit: the same analysis from the description file', () => {
  it('means, adjust, contrasts (by level name) and levene in --spec give the numbers of the command line', async () => {
    const spec = join(tmp, 'analysis.json');
    writeFileSync(
      spec,
      JSON.stringify({
        model: 'wellbeing ~ group * site + baseline',
        missing: { wellbeing: '-9', baseline: '999' },
        means: ['group:site'],
        adjust: 'scheffe',
        contrasts: [{ term: 'group', weights: { control: -0.5, training: 1, waitlist: -0.5 }, name: 'training against the rest' }],
        levene: 'mean',
      }),
    );
    const { code, out } = await run(['refit', fixturePath(`refit/${ancova.file}`), '--spec', spec, '--format', 'json']);
    expect(code).toBe(0);
    const o = refitOutputSchema.parse(JSON.parse(out));
    const failures: string[] = [];
    const cells = o.marginalMeans![0]!;
    expect(cells.term).toBe('group:site');
    ancova.means['group:site']!.forEach((r, i) => check(failures, SM, `${r.label} mean`, cells.means[i]!.mean, r.estimate));
    ancova.pairwise['group:site']!.scheffe!.forEach((r, i) => check(failures, SP, `${r.first} - ${r.second} Scheffé p`, cells.pairwise!.comparisons[i]!.p, r.p));
    expect(o.contrasts![0]!.name).toBe('training against the rest');
    check(failures, SM, 'contrast estimate', o.contrasts![0]!.estimate, contrast0().estimate);
    check(failures, SP, 'Levene F (mean)', o.levene!.F, ancova.levene.mean.F);
    expect(failures).toEqual([]);
  });

  it('rejects an unknown adjustment in the file, naming the field', async () => {
    const spec = join(tmp, 'bad-adjust.json');
    writeFileSync(spec, JSON.stringify({ model: 'wellbeing ~ group * site + baseline', means: ['group'], adjust: 'tukee' }));
    const { code, err } = await run(['refit', fixturePath(`refit/${ancova.file}`), '--spec', spec]);
    expect(code).toBe(2);
    expect(err).toMatch(/field "adjust"/);
    expect(err).toContain('tukey');
  });
});

function contrast0(): Lin {
  return ancova.contrasts[0]!;
}

describe('refit: bad requests for means, comparisons and contrasts (exit 2, naming what is wrong)', () => {
  const cases: Array<[string, string[], RegExp]> = [
    ['a --means term not in the model', ['--means', 'grp'], /Marginal means "grp": 'grp' is not in the model .* \(its factors and covariates: group, site, baseline\)/],
    ['a --means term that is a covariate', ['--means', 'baseline'], /'baseline' is a covariate, not a factor/],
    ['a factor named twice', ['--means', 'group:group'], /"group:group" names a factor twice/],
    ['contrast weights of the wrong length', ['--contrast', 'group=1,-1'], /The contrast on group has 2 weights, but there are 3 means, one weight for each in this order: group=control; group=training; group=waitlist/],
    ['contrast weights that do not sum to zero', ['--contrast', 'group=1,1,1'], /The contrast weights on group must sum to zero \(they sum to 3\)/],
    ['a contrast weight that is not a number', ['--contrast', 'group=1,x,-1'], /--contrast "group=1,x,-1": weight 2 \("x"\) is not a number/],
    ['a contrast without weights', ['--contrast', 'group'], /--contrast "group": write it as "<factor>=<weights>"/],
    ['a contrast on a term not in the model', ['--contrast', 'arm=1,-1'], /Contrast "arm": 'arm' is not in the model/],
    ['an unknown adjustment', ['--means', 'group', '--adjust', 'tukee'], /'--adjust <method>' argument 'tukee' is invalid\. Allowed choices are tukey, bonferroni, holm, sidak, scheffe, none/],
    ['comparisons without means', ['--pairwise'], /Pairwise comparisons compare marginal means: name the factor whose means to compare \(--means <factor>/],
    ['an unknown Levene centre', ['--levene', 'trimmed'], /'--levene <center>' argument 'trimmed' is invalid/],
    ['--within a factor that the means include', ['--means', 'group:site', '--within', 'site'], /Marginal means "group:site" are to be compared within each level of 'site', so they cannot include 'site' itself; name the other factor\(s\), e\.g\. "group"/],
    ['--within a variable not in the model', ['--means', 'group', '--within', 'clinic'], /Comparisons within "clinic": 'clinic' is not in the model/],
    ['--within without --means', ['--within', 'site'], /Pairwise comparisons compare marginal means: name the factor/],
    ['--within a covariate', ['--means', 'group', '--within', 'baseline'], /'baseline' is a covariate, not a factor/],
    ['an unknown --weights', ['--means', 'group', '--weights', 'cells'], /'--weights <weights>' argument 'cells' is invalid\. Allowed choices are equal, proportional/],
    ['--at for a variable not in the model', ['--means', 'group', '--at', 'age=30'], /Covariate value "age": 'age' is not in the model/],
    ['--at for a factor', ['--means', 'group', '--at', 'site=1'], /Covariate value "site=1": 'site' is not a covariate of the model \(covariates: baseline\)/],
    ['--at without a number', ['--means', 'group', '--at', 'baseline=high'], /--at "baseline=high": write it as "<covariate>=<number>"/],
  ];
  for (const [what, extra, message] of cases) {
    it(what, async () => {
      const { code, err } = await run(['refit', ...ANCOVA, ...extra]);
      expect(err).toMatch(message);
      expect(code).toBe(2);
    });
  }

  it("Levene's test on a model without factors says why it cannot run", async () => {
    const { code, err } = await run(['refit', fixturePath(`refit/${ancova.file}`), '--model', 'wellbeing ~ baseline', '--missing', 'wellbeing=-9', '--missing', 'baseline=999', '--levene', 'median']);
    expect(err).toContain("Levene's test compares the cells of the model's factors, and this model has none");
    expect(code).toBe(2);
  });
});
