/**
 * contrast-mismatch on hand-built links (apart from the scanner): the groups
 * of tests/fixtures/contrasts/contrasts.json (statsmodels 0.13.5 OLS t_test
 * of contrast weights on simulated raw data, gen_contrasts.py), their means
 * and SDs rounded to two decimals as a paper prints them.
 */
import { describe, expect, it } from 'vitest';
import { findingsOf, result } from '../helpers.js';
import { contrastsFixture, fixed } from '../../fixtures/contrasts/passages.js';
import { roundingInterval, parseReportedNumber } from '../../../src/stats/reportedNumber.js';
import type { ContrastLink, ReportedResult } from '../../../src/scan/types.js';

const rule = 'contrast-mismatch';

function link(caseIndex: number, weights: number[], reading: ContrastLink['reading'] = 'weights'): ContrastLink {
  const c = contrastsFixture.oneWay[caseIndex]!;
  const interval = (value: number) => roundingInterval(parseReportedNumber(fixed(value))!);
  let low = 0;
  let high = 0;
  c.sds.forEach((sd, i) => {
    const box = interval(sd);
    low += (c.ns[i]! - 1) * box.low ** 2;
    high += (c.ns[i]! - 1) * box.high ** 2;
  });
  return {
    groups: c.means.map((m, i) => ({ label: `g${i}`, mean: interval(m), n: c.ns[i]! })),
    errorReadings: [{ source: 'sds', meanSquare: { low: low / c.anova.dfError, high: high / c.anova.dfError } }],
    errorDf: c.anova.dfError,
    family: `F(${c.anova.dfGroup}, ${c.anova.dfError})`,
    sizesAssumed: false,
    weights,
    reading,
    weightsText: `(${weights.join(', ')})`,
  };
}

function contrastResult(kind: 't' | 'F', df: number, value: string, p: string, contrast: ContrastLink): ReportedResult {
  return { ...result({ kind, df: kind === 't' ? [String(df)] : ['1', String(df)], value, p }), contrast };
}

const flagsOf = (r: ReportedResult) => findingsOf(rule, [r])[0]!;

describe(`${rule}: must pass`, () => {
  it('every contrast of the fixture at its statsmodels t and p, as t and as F = t^2', () => {
    contrastsFixture.oneWay.forEach((c, index) => {
      for (const contrast of c.contrasts) {
        const p = contrast.p < 0.001 ? '< .001' : `= ${contrast.p.toFixed(3)}`;
        expect(flagsOf(contrastResult('t', contrast.df, fixed(contrast.t), p, link(index, contrast.weights))), `${c.label} ${contrast.weights}`).toEqual([]);
        expect(flagsOf(contrastResult('F', contrast.df, fixed(contrast.t ** 2), p, link(index, contrast.weights))), `${c.label} F ${contrast.weights}`).toEqual([]);
      }
    });
  });
  it('a one-tailed p (half the two-tailed) for a t', () => {
    const c = contrastsFixture.oneWay[0]!.contrasts[0]!;
    expect(flagsOf(contrastResult('t', c.df, fixed(c.t), `= ${(c.p / 2).toFixed(3)}`, link(0, c.weights)))).toEqual([]);
  });
});

describe(`${rule}: must flag`, () => {
  it('(fail) a t a fifth too large for printed weights', () => {
    const c = contrastsFixture.oneWay[2]!.contrasts[0]!;
    const [finding, ...rest] = flagsOf(contrastResult('t', c.df, fixed(Math.abs(c.t) * 1.2), '< .001', link(2, c.weights)));
    expect(rest).toEqual([]);
    expect(finding).toMatchObject({ rule, severity: 'fail', messageId: 'mismatch' });
    expect(finding!.message).toContain(`give t = ${fixed(Math.abs(c.t))}`);
  });
  it('(warn) the same slip when the weights come from words or a trend', () => {
    const c = contrastsFixture.oneWay[2]!.contrasts[1]!;
    for (const reading of ['words', 'trend'] as const) {
      const [finding] = flagsOf(contrastResult('t', c.df, fixed(Math.abs(c.t) * 1.2), '< .001', link(2, c.weights, reading)));
      expect(finding, reading).toMatchObject({ rule, severity: 'warn' });
    }
  });
  it('(fail) a p that does not fit the t, two- or one-tailed', () => {
    const c = contrastsFixture.oneWay[0]!.contrasts[0]!;
    const [finding] = flagsOf(contrastResult('t', c.df, fixed(c.t), '= .060', link(0, c.weights)));
    expect(finding).toMatchObject({ rule, severity: 'fail' });
    expect(finding!.message).toContain('the printed p (p = .060) fits no reading');
  });
});
