import { describe, expect, it } from 'vitest';
import { flagsOf } from '../helpers.js';

// t(58) = 2.50: d = t*sqrt(1/30 + 1/30) = 0.6455 for two groups of 30, and 2t/sqrt(df) = 0.6565
// (Lakens 2013, formulas 1-2; arithmetic checked with Python when the test was written).
const rule = 'cohens-d-mismatch';
const base = { kind: 't' as const, df: ['58'], value: '2.50', p: '= .015' };

describe(`${rule}: must pass`, () => {
  it.each(['0.65', '0.66', '.64'])('d = %s for two groups of 30', (value) => {
    expect(flagsOf(rule, { ...base, effects: [{ kind: 'cohens-d', value }] }, undefined, 'There were 30 pupils in each group. ')).toEqual([]);
  });
  it('an unequal split that is not stated (d somewhat above the equal-groups value)', () => {
    expect(flagsOf(rule, { ...base, effects: [{ kind: 'cohens-d', value: '0.70' }] })).toEqual([]);
  });
  it('skips paired designs, whose d depends on the correlation between measures', () => {
    expect(flagsOf(rule, { ...base, effects: [{ kind: 'cohens-d', value: '1.40' }] }, undefined, 'A paired-samples t test compared')).toEqual([]);
  });
});

describe(`${rule}: must flag`, () => {
  it('d far above what the t allows', () => {
    const text = 'There were 30 participants in each group. ';
    const spec = { ...base, start: text.length, effects: [{ kind: 'cohens-d' as const, value: '1.20' }] };
    const [finding] = flagsOf(rule, spec, undefined, text);
    expect(finding).toMatchObject({ rule, severity: 'warn' });
    expect(finding!.message).toContain('groups of 30 and 30');
  });
  it('d far below the equal-groups minimum', () => {
    const [finding] = flagsOf(rule, { ...base, effects: [{ kind: 'cohens-d', value: '0.30' }] });
    expect(finding).toMatchObject({ rule });
  });
});
