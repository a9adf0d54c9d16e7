import { describe, expect, it } from 'vitest';
import { flagsOf } from '../helpers.js';

const rule = 'p-reported-as-zero';

describe(`${rule}: must pass`, () => {
  it.each(['< .001', '= .001', '< .0001'])('p %s', (p) => {
    expect(flagsOf(rule, { kind: 'F', df: ['3', '120'], value: '25.3', p })).toEqual([]);
  });
});

describe(`${rule}: must flag`, () => {
  it.each(['= .000', '= 0.000', '= 0'])('p %s', (p) => {
    const [finding] = flagsOf(rule, { kind: 'F', df: ['3', '120'], value: '25.3', p });
    expect(finding).toMatchObject({ rule, severity: 'warn' });
    expect(finding!.message).toContain('p < .001');
  });
  it('and p-value-mismatch stays quiet when the tiny p really rounds to zero', () => {
    expect(flagsOf('p-value-mismatch', { kind: 'F', df: ['3', '120'], value: '25.3', p: '= .000' })).toEqual([]);
  });
});
