import { describe, expect, it } from 'vitest';
import { emptyContext, flagsOf, result } from '../helpers.js';
import { resolveConfig } from '../../../src/checks/config.js';
import { checkResults } from '../../../src/checks/engine.js';

// F(2, 58) = 3.40: p = .0402 with the printed df; with epsilon = .70, F(1.4, 40.6) gives p = .0589;
// at the lower bound epsilon = 1/2, F(1, 29) gives .0754 (SciPy 1.10.1 scipy.stats.f.sf).
const rule = 'sphericity-corrected-p';
const statement = emptyContext({
  sphericity: [{ method: 'greenhouse-geisser', text: 'Greenhouse-Geisser corrections were applied', start: 0, end: 43 }],
});

describe(`${rule}: must pass`, () => {
  it('uncorrected p with uncorrected df', () => {
    expect(flagsOf(rule, { kind: 'F', df: ['2', '58'], value: '3.40', p: '= .040' }, statement)).toEqual([]);
  });
  it('no correction stated: a larger p is a plain mismatch', () => {
    expect(flagsOf(rule, { kind: 'F', df: ['2', '58'], value: '3.40', p: '= .059' })).toEqual([]);
    expect(flagsOf('p-value-mismatch', { kind: 'F', df: ['2', '58'], value: '3.40', p: '= .059' })).toHaveLength(1);
  });
});

describe(`${rule}: must flag`, () => {
  it('a corrected p beside uncorrected df', () => {
    const [finding] = flagsOf(rule, { kind: 'F', df: ['2', '58'], value: '3.40', p: '= .059' }, statement);
    expect(finding).toMatchObject({ rule, severity: 'note' });
    expect(flagsOf('p-value-mismatch', { kind: 'F', df: ['2', '58'], value: '3.40', p: '= .059' }, statement)).toEqual([]);
  });
  it('a p beyond any correction is still a mismatch', () => {
    expect(flagsOf(rule, { kind: 'F', df: ['2', '58'], value: '3.40', p: '= .20' }, statement)).toEqual([]);
    expect(flagsOf('p-value-mismatch', { kind: 'F', df: ['2', '58'], value: '3.40', p: '= .20' }, statement)).toHaveLength(1);
  });
});

describe(`${rule}: which statement it quotes`, () => {
  it('must flag (note), quoting the statement nearest before the result', () => {
    const two = emptyContext({
      sphericity: [
        { method: 'huynh-feldt', text: 'In Study 1 Huynh-Feldt corrections were applied', start: 0, end: 47 },
        { method: 'greenhouse-geisser', text: 'In Study 2 Greenhouse-Geisser corrections were applied', start: 400, end: 454 },
      ],
    });
    const [finding] = flagsOf(rule, { kind: 'F', df: ['2', '58'], value: '3.40', p: '= .059', start: 600 }, two);
    expect(finding).toMatchObject({ rule, severity: 'note' });
    expect(finding!.message).toContain('In Study 2');
  });
});

describe(`${rule}: a statement read elsewhere is never a fail`, () => {
  it('must flag at most as a warning, even when the settings raise the rule to fail', () => {
    const config = resolveConfig({ rules: { [rule]: 'fail' } });
    const [checked] = checkResults('', { results: [result({ kind: 'F', df: ['2', '58'], value: '3.40', p: '= .059' })], context: statement }, config);
    expect(checked!.findings.find((f) => f.rule === rule)).toMatchObject({ severity: 'warn' });
  });
});
