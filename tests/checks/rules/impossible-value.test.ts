import { describe, expect, it } from 'vitest';
import { flagsOf, type ResultSpec } from '../helpers.js';

// Common practice: the supports of the distributions and of the effect sizes.
const rule = 'impossible-value';

describe(`${rule}: must pass`, () => {
  it.each<ResultSpec>([
    { kind: 'F', df: ['2', '57'], value: '4.21', p: '= .020', effects: [{ kind: 'partial-eta-squared', value: '.13' }] },
    { kind: 'r', df: ['48'], value: '-.99', p: '< .001' },
    { kind: 't', df: ['28'], value: '-2.21', p: '= .035' },
    { kind: 'F', df: ['2', '57'], value: '0.50', p: '= .61', effects: [{ kind: 'omega-squared', value: '-.02' }] },
  ])('%o', (spec) => {
    expect(flagsOf(rule, spec)).toEqual([]);
  });
});

describe(`${rule}: must flag`, () => {
  it.each<[ResultSpec, string]>([
    [{ kind: 'r', df: ['48'], value: '1.12', p: '< .001' }, 'a correlation must lie between -1 and 1'],
    [{ kind: 'F', df: ['2', '57'], value: '-4.21', p: '= .020' }, 'F cannot be negative'],
    [{ kind: 'F', df: ['2', '57'], value: '4.21', p: '= 1.20' }, 'p = 1.20 lies outside 0 to 1'],
    [{ kind: 'F', df: ['0', '57'], value: '4.21', p: '= .02' }, 'df1 = 0 must be positive'],
    [{ kind: 'F', df: ['2', '57'], value: '4.21', p: '= .020', effects: [{ kind: 'partial-eta-squared', value: '1.30' }] }, 'must lie between 0 and 1'],
  ])('%o', (spec, problem) => {
    const [finding] = flagsOf(rule, spec);
    expect(finding).toMatchObject({ rule, severity: 'fail' });
    expect(finding!.message).toContain(problem);
  });
});
