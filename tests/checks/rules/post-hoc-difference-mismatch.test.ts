/**
 * post-hoc-difference-mismatch on hand-built families (apart from the
 * scanner): the groups of tests/fixtures/contrasts/contrasts.json, SciPy
 * 1.10.1 tukey_hsd (differences, p, 95% intervals) and studentized_range (q's
 * p) on simulated raw data (gen_contrasts.py), means and SDs rounded to two
 * decimals as a paper prints them.
 */
import { describe, expect, it } from 'vitest';
import { findingsOf, result } from '../helpers.js';
import { contrastsFixture, fixed } from '../../fixtures/contrasts/passages.js';
import { roundingInterval, parseReportedNumber } from '../../../src/stats/reportedNumber.js';
import type { ComparisonFamily, PrintedComparison, ReportedResult } from '../../../src/scan/types.js';

const rule = 'post-hoc-difference-mismatch';
const number = (text: string) => parseReportedNumber(text)!;

function family(caseIndex: number): ComparisonFamily {
  const c = contrastsFixture.oneWay[caseIndex]!;
  const interval = (value: number) => roundingInterval(number(fixed(value)));
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
    family: 'F',
    sizesAssumed: false,
  };
}

function item(parts: Partial<PrintedComparison>): PrintedComparison {
  return { text: 'comparison', start: 0, end: 0, pair: null, q: null, qDf: null, difference: null, se: null, interval: null, p: null, method: null, ...parts };
}

function anova(caseIndex: number, items: PrintedComparison[]): ReportedResult {
  const c = contrastsFixture.oneWay[caseIndex]!;
  return { ...result({ kind: 'F', df: [String(c.anova.dfGroup), String(c.anova.dfError)], value: fixed(c.anova.f), p: '< .05' }), printedComparisons: { family: family(caseIndex), items } };
}

const flagsOf = (r: ReportedResult) => findingsOf(rule, [r])[0]!;
const pText = (p: number) => ({ comparator: (p < 0.001 ? '<' : '=') as '<' | '=', value: number(p < 0.001 ? '.001' : p.toFixed(3)), plural: false, start: 0, end: 0 });

describe(`${rule}: must pass`, () => {
  it('every pair\'s q and Tukey p, its SE, and its Tukey and unadjusted intervals, in either direction', () => {
    contrastsFixture.oneWay.forEach((c, index) => {
      for (const pair of c.pairs) {
        const p: [number, number] = [pair.first, pair.second];
        const items = [
          item({ pair: p, q: number(fixed(pair.q)), p: pText(pair.pTukey), method: 'tukey' }),
          item({ pair: p, difference: number(fixed(pair.difference)), se: number(fixed(pair.se)) }),
          item({ pair: p, difference: number(fixed(pair.difference)), interval: { level: 0.95, low: number(fixed(pair.tukeyLower)), high: number(fixed(pair.tukeyUpper)) }, method: 'tukey' }),
          item({ pair: p, difference: number(fixed(-pair.difference)), interval: { level: 0.95, low: number(fixed(-pair.tukeyUpper)), high: number(fixed(-pair.tukeyLower)) }, method: 'tukey' }),
          item({ pair: null, difference: number(fixed(pair.difference)), interval: { level: 0.95, low: number(fixed(pair.lsdLower)), high: number(fixed(pair.lsdUpper)) } }),
        ];
        expect(flagsOf(anova(index, items)), `${c.label} ${p}`).toEqual([]);
      }
    });
  });
});

describe(`${rule}: must flag`, () => {
  it('(fail) a q one too large for its named pair, and a q whose p is not the studentized range p', () => {
    const pair = contrastsFixture.oneWay[1]!.pairs[1]!;
    const p: [number, number] = [pair.first, pair.second];
    const flags = flagsOf(anova(1, [item({ pair: p, q: number(fixed(pair.q + 1)), method: 'tukey' }), item({ pair: p, q: number(fixed(pair.q)), p: pText(0.2), method: 'tukey' })]));
    expect(flags).toHaveLength(2);
    expect(flags.every((f) => f.severity === 'fail')).toBe(true);
  });
  it('(fail) an SE that is not sqrt(MSE (1/n_i + 1/n_j)); (warn) a difference no pair gives when the pair is not named', () => {
    const pair = contrastsFixture.oneWay[2]!.pairs[0]!;
    const flags = flagsOf(anova(2, [item({ pair: [pair.first, pair.second], difference: number(fixed(pair.difference)), se: number(fixed(pair.se * 1.3)) }), item({ difference: number('9.90'), se: number(fixed(pair.se)) })]));
    expect(flags.map((f) => f.severity)).toEqual(['fail', 'warn']);
    expect(flags[1]!.message).toContain('every pair was tried');
  });
  it('leaves alone a q printed with another family\'s k and df', () => {
    const pair = contrastsFixture.oneWay[0]!.pairs[0]!;
    expect(flagsOf(anova(0, [item({ pair: [pair.first, pair.second], q: number('9.99'), qDf: [4, 90], method: 'tukey' })]))).toEqual([]);
  });
});
