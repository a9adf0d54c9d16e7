import { describe, expect, it } from 'vitest';
import { emptyContext, flagsOf } from '../helpers.js';

// Common practice: error df of a between-subjects test is N minus the number of estimated means.
const rule = 'df-exceeds-sample';
const total48 = emptyContext({ sampleSizes: [{ value: 48, text: 'A total of 48 adults', start: 0, end: 20 }] });

describe(`${rule}: must pass`, () => {
  it.each([
    { kind: 't' as const, df: ['46'], value: '2.10', p: '= .041' },
    { kind: 'F' as const, df: ['2', '45'], value: '3.30', p: '= .046' },
    { kind: 'r' as const, df: ['46'], value: '.30', p: '= .038' },
  ])('%o with N = 48', (spec) => {
    expect(flagsOf(rule, spec, total48)).toEqual([]);
  });
  it('no stated sample size: nothing to compare', () => {
    expect(flagsOf(rule, { kind: 't', df: ['146'], value: '2.10', p: '= .037' })).toEqual([]);
  });
  it('repeated-measures F whose error df exceeds N', () => {
    expect(flagsOf(rule, { kind: 'F', df: ['2', '94'], value: '3.30', p: '= .041' }, total48, 'a repeated-measures ANOVA')).toEqual([]);
  });
  it('an F whose error df fit a within-subject error term, df1 * (n - 1)', () => {
    expect(flagsOf(rule, { kind: 'F', df: ['2', '94'], value: '3.30', p: '= .041' }, total48)).toEqual([]);
  });
  it('a subgroup count is not a total', () => {
    const subgroup = emptyContext({ sampleSizes: [{ value: 17, text: '17 men', start: 0, end: 6 }] });
    expect(flagsOf(rule, { kind: 't', df: ['28'], value: '2.10', p: '= .045' }, subgroup)).toEqual([]);
  });
});

describe(`${rule}: must flag`, () => {
  it.each([
    { kind: 't' as const, df: ['52'], value: '2.10', p: '= .041' },
    { kind: 'F' as const, df: ['1', '48'], value: '4.30', p: '= .043' },
    { kind: 'r' as const, df: ['47'], value: '.30', p: '= .038' },
  ])('%o with N = 48', (spec) => {
    const [finding] = flagsOf(rule, spec, total48);
    expect(finding).toMatchObject({ rule, severity: 'fail' });
    expect(finding!.message).toContain('N = 48');
  });
});
