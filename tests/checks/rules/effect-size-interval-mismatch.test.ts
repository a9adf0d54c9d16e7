import { describe, expect, it } from 'vitest';
import { flagsOf } from '../helpers.js';

// Steiger (2004) intervals for F(2, 84) = 6.52 computed with SciPy 1.10.1 (scipy.stats.ncf.cdf inverted
// with scipy.optimize.brentq) when this test was written: 90% [.0316, .2367], 95% [.0200, .2597].
const rule = 'effect-size-interval-mismatch';
const base = { kind: 'F' as const, df: ['2', '84'], value: '6.52', p: '= .002' };

describe(`${rule}: must pass`, () => {
  it('the 90% interval', () => {
    expect(flagsOf(rule, { ...base, effects: [{ kind: 'partial-eta-squared', value: '.13', ci: ['.03', '.24'], level: 0.9 }] })).toEqual([]);
  });
  it('the 95% interval', () => {
    expect(flagsOf(rule, { ...base, effects: [{ kind: 'partial-eta-squared', value: '.13', ci: ['.02', '.26'], level: 0.95 }] })).toEqual([]);
  });
  it('an unstated level is taken as 90%', () => {
    expect(flagsOf(rule, { ...base, effects: [{ kind: 'partial-eta-squared', value: '.13', ci: ['.03', '.24'], level: null }] })).toEqual([]);
  });
});

describe(`${rule}: must flag`, () => {
  it('a wrong interval', () => {
    const [finding] = flagsOf(rule, { ...base, effects: [{ kind: 'partial-eta-squared', value: '.13', ci: ['.06', '.19'], level: 0.9 }] });
    expect(finding).toMatchObject({ rule, severity: 'warn' });
    expect(finding!.message).toContain('[0.032, 0.237]');
  });
  it('the 95% interval labelled 90%, with a hint', () => {
    const [finding] = flagsOf(rule, { ...base, effects: [{ kind: 'partial-eta-squared', value: '.13', ci: ['.02', '.26'], level: 0.9 }] });
    expect(finding).toMatchObject({ slip: 'interval-level' });
  });
});
