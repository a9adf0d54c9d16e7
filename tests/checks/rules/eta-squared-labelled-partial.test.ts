import { describe, expect, it } from 'vitest';
import { findingsOf, result } from '../helpers.js';

// Partial eta squared values F*df1/(F*df1 + df2) (Lakens 2013, formula 13):
// F(1, 96) = 8.40 -> .0805; F(1, 96) = 3.10 -> .0313; F(1, 96) = 0.60 -> .0062.
const rule = 'eta-squared-labelled-partial';

function twoWay(labels: 'eta-squared' | 'partial-eta-squared', values: [string, string, string]) {
  return [
    result({ kind: 'F', df: ['1', '96'], value: '8.40', p: '= .005', effects: [{ kind: labels, value: values[0] }], start: 0 }),
    result({ kind: 'F', df: ['1', '96'], value: '3.10', p: '= .082', effects: [{ kind: labels, value: values[1] }], start: 100 }),
    result({ kind: 'F', df: ['1', '96'], value: '0.60', p: '= .44', effects: [{ kind: labels, value: values[2] }], start: 200 }),
  ];
}

describe(`${rule}: must pass`, () => {
  it('partial eta squared labelled as such', () => {
    expect(findingsOf(rule, twoWay('partial-eta-squared', ['.08', '.03', '.01'])).flat()).toEqual([]);
  });
  it('eta squared smaller than partial (a genuine classical eta squared)', () => {
    expect(findingsOf(rule, twoWay('eta-squared', ['.07', '.02', '.004'])).flat()).toEqual([]);
  });
  it('a single F: eta squared equals partial eta squared in a one-way design', () => {
    expect(findingsOf(rule, [result({ kind: 'F', df: ['2', '57'], value: '4.21', p: '= .020', effects: [{ kind: 'eta-squared', value: '.13' }] })]).flat()).toEqual([]);
  });
});

describe(`${rule}: must flag`, () => {
  it('eta squared equal to partial eta squared for effects sharing an error term', () => {
    const findings = findingsOf(rule, twoWay('eta-squared', ['.08', '.03', '.01']));
    expect(findings.map((f) => f.length)).toEqual([1, 1, 1]);
    expect(findings[0]![0]).toMatchObject({ rule, severity: 'note' });
    expect(findings[0]![0]!.message).toContain('2 other F test(s) nearby share its error df (96)');
  });
});
