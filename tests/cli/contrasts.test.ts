/**
 * The built command line (`node dist/src/cli/main.js scan <file> --format
 * json`) on passages printed from tests/fixtures/contrasts/contrasts.json:
 * statsmodels 0.13.5 (OLS t_test of contrast weights, anova_lm) and SciPy
 * 1.10.1 (tukey_hsd, studentized_range) on simulated raw data, written by
 * tests/fixtures/contrasts/gen_contrasts.py. The true numbers, rounded as a
 * paper prints them, must pass; numbers changed as a slip would change them
 * must be flagged.
 */
import { describe, expect, it } from 'vitest';
import { scanTextJson } from './scanDocumentJson.js';
import { anovaSentence, contrastsFixture, fixed, printP } from '../fixtures/contrasts/passages.js';

const rulesOf = (document: ReturnType<typeof scanTextJson>, rule: string) => document.statistics.map((s) => s.findings.filter((f) => f.rule === rule));

describe('plumbline scan: planned contrasts (contrast-mismatch)', () => {
  const c = contrastsFixture.oneWay[0]!;
  const names = ['spaced', 'massed', 'interleaved'];
  const [helmert, pair, linear, quadratic] = c.contrasts;
  const t = (value: number) => fixed(value);
  it('passes contrasts printed with weights, as a trend or as an F, each as statsmodels computes it', () => {
    const text = [
      anovaSentence(c, names),
      `A planned contrast (-1, -1, 2) showed higher recall after interleaving, t(${helmert!.df}) = ${t(helmert!.t)}, ${printP(helmert!.p)}.`,
      `A second contrast with weights 1 -1 0 gave t(${pair!.df}) = ${t(pair!.t)}, ${printP(pair!.p)}.`,
      `The linear trend was significant, t(${linear!.df}) = ${t(linear!.t)}, ${printP(linear!.p)}.`,
      `The quadratic trend was not, F(1, ${quadratic!.df}) = ${fixed(quadratic!.t ** 2)}, ${printP(quadratic!.p)}.`,
    ].join(' ');
    const document = scanTextJson(text);
    expect(document.statistics).toHaveLength(5);
    expect(rulesOf(document, 'contrast-mismatch').flat()).toEqual([]);
    expect(document.statistics.flatMap((s) => s.findings)).toEqual([]);
  });
  it('flags a contrast t that is not the weights\' t (fail), and a trend that no reading gives (warn: the order is an assumption)', () => {
    const text = [
      anovaSentence(c, names),
      `A second contrast with weights 1 -1 0 gave t(${pair!.df}) = ${t(Math.abs(pair!.t) * 2)}, p = .005.`,
      `The linear trend was significant, t(${linear!.df}) = ${t(linear!.t * 1.3)}, ${printP(linear!.p)}.`,
    ].join(' ');
    const flags = rulesOf(scanTextJson(text), 'contrast-mismatch');
    expect(flags[0]).toEqual([]);
    expect(flags[1]).toHaveLength(1);
    expect(flags[1]![0]).toMatchObject({ severity: 'fail' });
    expect(flags[1]![0]!.message).toContain(`weights (1, -1, 0) give t = ${fixed(Math.abs(pair!.t))}`);
    expect(flags[2]).toHaveLength(1);
    expect(flags[2]![0]).toMatchObject({ severity: 'warn' });
    expect(flags[2]![0]!.message).toContain('the groups taken in the order printed');
  });
  it('reads a contrast in words ("control against the two training groups") and flags one the words make wrong', () => {
    const u = contrastsFixture.oneWay[1]!;
    const weighted = u.contrasts[1]!; // (-0.5, -0.5, 1): the third group against the first two
    const words = ['peer training', 'video training', 'control'];
    const right = [anovaSentence(u, words), `A planned contrast of the control group against the two training groups showed higher scores, t(${weighted.df}) = ${fixed(weighted.t)}, ${printP(weighted.p)}.`].join(' ');
    expect(rulesOf(scanTextJson(right), 'contrast-mismatch').flat()).toEqual([]);
    const wrong = [anovaSentence(u, words), `A planned contrast compared peer training with video training, t(${weighted.df}) = ${fixed(weighted.t)}, ${printP(weighted.p)}.`].join(' ');
    const flags = rulesOf(scanTextJson(wrong), 'contrast-mismatch');
    expect(flags[1]).toHaveLength(1);
    expect(flags[1]![0]).toMatchObject({ severity: 'warn' });
  });
});

describe('plumbline scan: Tukey q and mean differences with SE or CI (post-hoc-difference-mismatch)', () => {
  const c = contrastsFixture.oneWay[0]!;
  const names = ['spaced', 'massed', 'interleaved'];
  const [spacedMassed, spacedInterleaved, massedInterleaved] = c.pairs;
  it('passes q, its p, a difference with SE and a Tukey interval as SciPy computes them', () => {
    const text = [
      anovaSentence(c, names),
      '',
      `Tukey's HSD showed that interleaved exceeded spaced, q = ${fixed(spacedInterleaved!.q)}, ${printP(spacedInterleaved!.pTukey)}, and spaced and massed did not differ, q = ${fixed(spacedMassed!.q)}, ${printP(spacedMassed!.pTukey)}.`,
      `Interleaved minus massed: mean difference = ${fixed(-massedInterleaved!.difference)}, SE = ${fixed(massedInterleaved!.se)}, 95% CI [${fixed(-massedInterleaved!.tukeyUpper)}, ${fixed(-massedInterleaved!.tukeyLower)}].`,
    ].join('\n');
    const document = scanTextJson(text);
    expect(rulesOf(document, 'post-hoc-difference-mismatch').flat()).toEqual([]);
  });
  it('flags a q that is not the pair\'s, and an interval that no method gives', () => {
    const text = [
      anovaSentence(c, names),
      '',
      `Tukey's HSD showed that spaced and massed did not differ, q = ${fixed(spacedMassed!.q + 1)}, ${printP(spacedMassed!.pTukey)}.`,
      `Interleaved minus massed: mean difference = ${fixed(-massedInterleaved!.difference)}, SE = ${fixed(massedInterleaved!.se)}, 95% CI [${fixed(-massedInterleaved!.tukeyUpper + 1.5)}, ${fixed(-massedInterleaved!.tukeyLower - 1.5)}].`,
    ].join('\n');
    const [flags] = rulesOf(scanTextJson(text), 'post-hoc-difference-mismatch');
    expect(flags).toHaveLength(2);
    expect(flags!.every((f) => f.severity === 'fail')).toBe(true);
    expect(flags![0]!.message).toContain(`q = ${fixed(spacedMassed!.q + 1)}`);
    expect(flags![0]!.message).toContain('spaced and massed');
    expect(flags![1]!.message).toContain('no tukey interval matches');
  });
});

describe('plumbline scan: an MSE printed with a table\'s F against the table\'s error row (mse-mismatch)', () => {
  const c = contrastsFixture.oneWay[0]!;
  const table = (mse: string) =>
    [
      'Table 2',
      'Analysis of variance for recall',
      '',
      '| Source | SS | df | MS | F | p |',
      '|---|---|---|---|---|---|',
      `| Condition | ${fixed(c.anova.ssGroup)} | ${c.anova.dfGroup} | ${fixed(c.anova.ssGroup / c.anova.dfGroup)} | ${fixed(c.anova.f)} | ${fixed(c.anova.p, 3).replace(/^0/, '')} |`,
      `| Error | ${fixed(c.anova.ssError)} | ${c.anova.dfError} | ${fixed(c.anova.mse)} | | |`,
      '',
      `Recall differed by condition, F(${c.anova.dfGroup}, ${c.anova.dfError}) = ${fixed(c.anova.f)}, MSE = ${mse}, ${printP(c.anova.p)}.`,
    ].join('\n');
  it('passes the error row\'s SS / df and flags another MSE', () => {
    expect(rulesOf(scanTextJson(table(fixed(c.anova.mse))), 'mse-mismatch').flat()).toEqual([]);
    const flags = rulesOf(scanTextJson(table(fixed(c.anova.mse * 1.5))), 'mse-mismatch').flat();
    expect(flags).toHaveLength(1);
    expect(flags[0]).toMatchObject({ severity: 'fail' });
    expect(flags[0]!.message).toContain(`SS = ${fixed(c.anova.ssError)} on ${c.anova.dfError} df`);
  });
});

describe('plumbline scan: an ANCOVA (ancova-df-mismatch, adjusted means)', () => {
  const a = contrastsFixture.ancova[0]!;
  const groups = a.means.map((m, i) => `M = ${fixed(m)}, SD = ${fixed(a.sds[i]!)}, n = ${a.ns[i]}`).join('; ');
  it('passes the error df statsmodels gives, and flags the ANOVA\'s df printed with the ANCOVA\'s F and a covariate on other df', () => {
    const right = `The ANCOVA, with one covariate, compared the groups (${groups}): F(${a.group.df1}, ${a.group.df2}) = ${fixed(a.group.f)}, ${printP(a.group.p)}; for the covariate, F(${a.covariate.df1}, ${a.covariate.df2}) = ${fixed(a.covariate.f)}, ${printP(a.covariate.p)}.`;
    expect(rulesOf(scanTextJson(right), 'ancova-df-mismatch').flat()).toEqual([]);
    const n = a.ns.reduce((s, x) => s + x, 0);
    const wrong = `The ANCOVA, with one covariate, compared the groups (${groups}): F(${a.group.df1}, ${n - 3}) = ${fixed(a.group.f)}, ${printP(a.group.p)}; for the covariate, F(${a.covariate.df1}, ${a.covariate.df2 - 1}) = ${fixed(a.covariate.f)}, ${printP(a.covariate.p)}.`;
    const flags = rulesOf(scanTextJson(wrong), 'ancova-df-mismatch');
    expect(flags[0]).toHaveLength(1);
    expect(flags[0]![0]).toMatchObject({ severity: 'warn', messageId: 'tooMany' });
    expect(flags[1]).toHaveLength(1);
    expect(flags[1]![0]).toMatchObject({ severity: 'warn', messageId: 'unequalError' });
  });
  it('does not read adjusted means as raw: GRIM stays quiet on them, and would flag them read as raw', () => {
    // Raw means of whole-number ratings are multiples of 1/n (4.50 = 99/22, 3.75 = 90/24, 5.10 = 102/20); the adjusted
    // means, statsmodels' predictions at the covariate's mean in the real analysis, are not (GRIM: common practice).
    // Raw SDs are GRIMMER-consistent too (each the SD of a set of whole numbers from 1 to 7 with that mean and n).
    const passage = (prefix: string) =>
      'Satisfaction was rated on a single 7-point item. Raw scores were M = 4.50, SD = 1.19, n = 22 (feedback), M = 3.75, SD = 0.99, n = 24 (praise) and M = 5.10, SD = 0.85, n = 20 (control). ' +
      'An ANCOVA controlling for baseline satisfaction found a group difference, F(2, 62) = 8.02, p < .001. ' +
      `Means at the covariate's mean were ${prefix}M = 4.37, SD = 1.10, n = 22; ${prefix}M = 3.81, SD = 1.21, n = 24; and ${prefix}M = 5.02, SD = 0.98, n = 20.`;
    const asAdjusted = scanTextJson(passage('adjusted '));
    expect(asAdjusted.statistics.flatMap((s) => s.findings)).toEqual([]);
    const asRaw = scanTextJson(passage(''));
    expect(asRaw.statistics.flatMap((s) => s.findings).filter((f) => f.rule === 'integer-data-granularity').length).toBeGreaterThan(0);
  });
});

describe('plumbline scan: what follows another analysis is not a contrast of these groups', () => {
  it('leaves alone a trend printed after the F of another outcome whose groups are not printed', () => {
    const c = contrastsFixture.oneWay[0]!;
    const text = [
      anovaSentence(c, ['spaced', 'massed', 'interleaved']),
      `Confidence differed too, F(2, ${c.anova.dfError}) = 3.90, p = .026, with a linear trend, t(${c.anova.dfError}) = 2.70, p = .009.`,
    ].join(' ');
    expect(rulesOf(scanTextJson(text), 'contrast-mismatch').flat()).toEqual([]);
  });
});
