import { describe, expect, it } from 'vitest';
import { flagsOf } from '../helpers.js';

// F(2, 84) = 6.52 -> partial eta squared = 6.52*2 / (6.52*2 + 84) = 0.13438 (Lakens 2013, formula 13;
// arithmetic checked with SciPy 1.10.1's Python when the test was written).
const rule = 'partial-eta-squared-mismatch';
const base = { kind: 'F' as const, df: ['2', '84'], value: '6.52', p: '= .002' };

describe(`${rule}: must pass`, () => {
  it.each(['.13', '0.134', '.1344'])(
    'ηp2 = %s',
    (value) => {
      expect(flagsOf(rule, { ...base, effects: [{ kind: 'partial-eta-squared', value }] })).toEqual([]);
    },
  );
  it('ignores eta squared and generalized eta squared, which F alone cannot give', () => {
    expect(flagsOf(rule, { ...base, effects: [{ kind: 'eta-squared', value: '.05' }, { kind: 'generalized-eta-squared', value: '.03' }] })).toEqual([]);
  });
});

describe(`${rule}: must flag`, () => {
  it.each(['.31', '.10', '0.15'])('ηp2 = %s', (value) => {
    const [finding] = flagsOf(rule, { ...base, effects: [{ kind: 'partial-eta-squared', value }] });
    expect(finding).toMatchObject({ rule, severity: 'fail' });
    expect(finding!.message).toContain('gives partial eta squared = 0.1344');
  });
});
