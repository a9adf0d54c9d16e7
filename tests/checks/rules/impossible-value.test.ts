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
    // φ² reaches min(r, c) − 1 (Cramér, 1946, §21.9, from memory): a 3 × 3 table (df 4) allows φ up to √2.
    { kind: 'chi2', df: ['4'], value: '150.0', p: '< .001', effects: [{ kind: 'phi', value: '1.22' }] },
    // Without df the table size is unknown.
    { kind: 'chi2', df: [], value: '150.0', p: '< .001', effects: [{ kind: 'phi', value: '1.22' }] },
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
    // A chi-square with 2 df is a 2 × 3 table: φ at most 1.
    [{ kind: 'chi2', df: ['2'], value: '1.263', p: '= .532', effects: [{ kind: 'phi', value: '1.78' }] }, 'must lie between -1 and 1'],
    // df 6 is 2 × 7 or 3 × 4: φ at most √2.
    [{ kind: 'chi2', df: ['6'], value: '190.1', p: '< .001', effects: [{ kind: 'phi', value: '1.52' }] }, 'cannot exceed 1.414 in a table with 6 df'],
  ])('%o', (spec, problem) => {
    const [finding] = flagsOf(rule, spec);
    expect(finding).toMatchObject({ rule, severity: 'fail' });
    expect(finding!.message).toContain(problem);
  });
});
