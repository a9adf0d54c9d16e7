import { describe, expect, it } from 'vitest';
import { emptyContext, flagsOf, result } from '../helpers.js';
import { resolveConfig } from '../../../src/checks/config.js';
import { checkResults } from '../../../src/checks/engine.js';

// t(28) = 2.21: two-tailed p = .03545, one-tailed .01772; F(1, 44) = 4.21: p = .04617, half .02308
// (SciPy 1.10.1 scipy.stats.t.sf and f.sf, computed when this test was written).
const rule = 'halved-p';
const oneTailedStatement = { text: 'One-tailed tests were used for the directional hypotheses.', start: 0, end: 58 };

describe(`${rule}: must pass`, () => {
  it('the two-tailed p', () => {
    expect(flagsOf(rule, { kind: 't', df: ['28'], value: '2.21', p: '= .035' })).toEqual([]);
  });
  it('an inequality that both the one- and two-tailed p satisfy', () => {
    expect(flagsOf(rule, { kind: 't', df: ['28'], value: '2.21', p: '< .05' })).toEqual([]);
  });
});

describe(`${rule}: must flag`, () => {
  it('a halved t p without a declaration (warn)', () => {
    const [finding] = flagsOf(rule, { kind: 't', df: ['28'], value: '2.21', p: '= .018' });
    expect(finding).toMatchObject({ rule, severity: 'warn', messageId: 'undeclared' });
  });
  it('a halved t p where one-tailed testing is declared (note)', () => {
    const context = emptyContext({ oneTailed: [oneTailedStatement] });
    const [finding] = flagsOf(rule, { kind: 't', df: ['28'], value: '2.21', p: '= .018', start: 200 }, context);
    expect(finding).toMatchObject({ rule, severity: 'note', messageId: 'declared' });
  });
  it('a declaration far after the result does not cover it', () => {
    const far = emptyContext({ oneTailed: [{ ...oneTailedStatement, start: 9000, end: 9058 }] });
    const [finding] = flagsOf(rule, { kind: 't', df: ['28'], value: '2.21', p: '= .018', start: 100 }, far);
    expect(finding).toMatchObject({ severity: 'warn' });
  });
  it('a halved F p, even with a one-tailed declaration (warn)', () => {
    const context = emptyContext({ oneTailed: [oneTailedStatement] });
    const [finding] = flagsOf(rule, { kind: 'F', df: ['1', '44'], value: '4.21', p: '= .023', start: 200 }, context);
    expect(finding).toMatchObject({ rule, severity: 'warn', messageId: 'upperTail' });
  });
});

describe(`${rule}: which declaration covers a result`, () => {
  it('must flag as a note, quoting the declaration nearest before the result', () => {
    const context = emptyContext({
      oneTailed: [
        { text: 'In Study 1 we used one-tailed tests.', start: 0, end: 36 },
        { text: 'In Study 2, one-tailed tests were preregistered.', start: 500, end: 548 },
      ],
    });
    const [finding] = flagsOf(rule, { kind: 't', df: ['28'], value: '2.21', p: '= .018', start: 900 }, context);
    expect(finding).toMatchObject({ rule, severity: 'note', messageId: 'declared' });
    expect(finding!.message).toContain('In Study 2');
  });
  it('must flag as a warning when the only declaration comes long after the result', () => {
    const context = emptyContext({ oneTailed: [{ text: 'One-tailed tests were used in Study 3.', start: 5000, end: 5038 }] });
    expect(flagsOf(rule, { kind: 't', df: ['28'], value: '2.21', p: '= .018', start: 100 }, context)[0]).toMatchObject({ severity: 'warn' });
  });
});

describe(`${rule}: the settings' one-tailed default (oneTailedByDefault)`, () => {
  // Same numbers as above: t(28) = 2.21 two-tailed p = .03545, half .01772 (SciPy 1.10.1 scipy.stats.t.sf).
  const withDefault = resolveConfig({ rules: { 'halved-p': { options: { oneTailedByDefault: true } } } });
  const findings = (spec: Parameters<typeof result>[0], context = emptyContext()) =>
    checkResults('', { results: [result(spec)], context }, withDefault)[0]!.findings.filter((f) => f.rule === rule);
  it('must flag a halved t p as a note, saying the settings take it as one-tailed', () => {
    const [finding] = findings({ kind: 't', df: ['28'], value: '2.21', p: '= .018' });
    expect(finding).toMatchObject({ rule, severity: 'note', messageId: 'byDefault', crossesAlpha: false });
  });
  it('must still flag a halved F p as a warning: F has only an upper tail', () => {
    const [finding] = findings({ kind: 'F', df: ['1', '44'], value: '4.21', p: '= .023' });
    expect(finding).toMatchObject({ severity: 'warn', messageId: 'upperTail' });
  });
  it('must pass the two-tailed p', () => {
    expect(findings({ kind: 't', df: ['28'], value: '2.21', p: '= .035' })).toEqual([]);
  });
  it('is off unless the settings say so (the default stays two-tailed)', () => {
    expect(flagsOf(rule, { kind: 't', df: ['28'], value: '2.21', p: '= .018' })[0]).toMatchObject({ messageId: 'undeclared', severity: 'warn' });
  });
});
