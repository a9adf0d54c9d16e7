import { describe, expect, it } from 'vitest';
import { emptyContext, flagsOf, result } from '../helpers.js';
import { resolveConfig } from '../../../src/checks/config.js';
import { checkResults } from '../../../src/checks/engine.js';

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

// Scoped sample sizes: a total, a part of the sample, a size per group, the group sizes printed with the test.
describe(`${rule}: scoped sample sizes`, () => {
  const size = (value: number, text: string, scope: 'total' | 'subset' | 'per-group' | 'test') => ({ value, text, start: 0, end: text.length, scope });
  const t52 = { kind: 't' as const, df: ['52'], value: '2.10', p: '= .041' };

  describe('must pass', () => {
    it('a per-group statement alone bounds nothing (the number of groups is unknown)', () => {
      expect(flagsOf(rule, t52, emptyContext({ sampleSizes: [size(20, '20 in each condition', 'per-group')] }))).toEqual([]);
    });
    it('a part of the sample alone bounds nothing', () => {
      expect(flagsOf(rule, t52, emptyContext({ sampleSizes: [size(30, 'cortisol was available for 30 participants', 'subset')] }))).toEqual([]);
    });
    it('the N inside another test bounds nothing', () => {
      expect(flagsOf(rule, t52, emptyContext({ sampleSizes: [size(40, 'N = 40', 'test')] }))).toEqual([]);
    });
    it('the group sizes printed with the test allow its df (30 + 24 = 54 gives df = 52), whatever the stated N', () => {
      const text = 'A total of 48 adults took part. Older (M = 4.2, n = 30) and younger adults (M = 3.6, n = 24) differed, ';
      const spec = { ...t52, start: text.length };
      expect(flagsOf(rule, spec, total48, `${text}t(52) = 2.10, p = .041.`)).toEqual([]);
    });
    it('df worked out from a sample size are not checked against it', () => {
      const context = emptyContext({ sampleSizes: [size(214, '214 participants', 'total')] });
      expect(flagsOf(rule, { kind: 'r', value: '.30', p: '= .004' }, context)).toEqual([]);
    });
  });

  describe('must flag', () => {
    it('one stated total, and printed group sizes that do not allow the df either (20 + 20 = 40): fail', () => {
      const text = 'A total of 48 adults took part. Older (n = 20) and younger adults (n = 20) differed, ';
      const [finding] = flagsOf(rule, { ...t52, start: text.length }, total48, `${text}t(52) = 2.10, p = .041.`);
      expect(finding).toMatchObject({ rule, severity: 'fail', messageId: 'tooLarge' });
    });
    it('a per-group statement beside the total makes the scope unclear: a note that quotes it', () => {
      const context = emptyContext({ sampleSizes: [...total48.sampleSizes, size(20, '20 in each condition', 'per-group')] });
      const [finding] = flagsOf(rule, t52, context);
      expect(finding).toMatchObject({ rule, severity: 'note', messageId: 'unclearScope' });
      expect(finding!.message).toContain('"20 in each condition"');
    });
    it('several different totals (two studies, say): a note', () => {
      const context = emptyContext({ sampleSizes: [size(48, 'N = 48', 'total'), size(40, 'N = 40', 'total')] });
      const [finding] = flagsOf(rule, t52, context);
      expect(finding).toMatchObject({ rule, severity: 'note' });
      expect(finding!.message).toContain('more than one sample size');
    });
    it('a larger count for a single test than the stated total: a note', () => {
      const context = emptyContext({ sampleSizes: [...total48.sampleSizes, size(120, 'N = 120', 'test')] });
      expect(flagsOf(rule, t52, context)[0]).toMatchObject({ rule, severity: 'note' });
    });
    it('the severity stays at note even when the settings raise the rule', () => {
      const context = emptyContext({ sampleSizes: [...total48.sampleSizes, size(20, '20 per group', 'per-group')] });
      const config = resolveConfig({ rules: { [rule]: 'fail' } });
      const [checked] = checkResults('', { results: [result(t52)], context }, config);
      expect(checked!.findings.find((f) => f.rule === rule)).toMatchObject({ severity: 'note' });
    });
  });
});
