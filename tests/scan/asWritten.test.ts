import { describe, expect, it } from 'vitest';
import { scanText } from '../../src/scan/scan.js';
import { onlyResult } from './helpers.js';

/** Impossible values must reach the checks exactly as written, so they can be reported. */
describe('impossible values are read as written', () => {
  it.each([
    ['t(78) = 1.57, p = 1.20', '=', 1.2],
    ['t(78) = 1.57, p = 1.0', '=', 1],
    ['F(2, 30) = 3.10, p = -.02', '=', -0.02],
    ['F(2, 30) = 3.10, p < 1.5', '<', 1.5],
    ['F(2, 30) = 3.10, p-value = 2.04', '=', 2.04],
  ])('reads the p of %s', (written, comparator, value) => {
    const result = onlyResult(`The difference was small, ${written}.`);
    expect(result.p?.comparator).toBe(comparator);
    expect(result.p?.value.value).toBeCloseTo(value, 10);
  });

  it('reads an out-of-range p found a few words after the statistic', () => {
    expect(onlyResult('F(1, 44) = 5.10, which was reliable, p = 1.03.').p?.value.text).toBe('1.03');
  });

  it('accepts a head without df when its out-of-range p follows directly', () => {
    expect(onlyResult('a difference, t = 2.10, p = 1.40').p?.value.value).toBe(1.4);
  });

  it('still does not read page-like numbers or a p standing alone', () => {
    expect(onlyResult('t(30) = 4.10, p = 12').p).toBeNull();
    expect(onlyResult('t(30) = 4.10, p = -12').p).toBeNull();
    expect(scanText('The probability was p = 1.20 in that model.').results).toEqual([]);
    expect(scanText('the force F = 4.21, p = 1.5 and so on').results.map((result) => result.text)).toEqual(['F = 4.21, p = 1.5']);
  });

  it.each([
    ['r(48) = 1.12, p < .001', 'r', '1.12'],
    ['r(48) = -1.12, p < .001', 'r', '-1.12'],
    ['F(2, 63) = -3.30, p = .04', 'F', '-3.30'],
    ['F(2, 63) = \u22123.30, p = .04', 'F', '-3.30'],
    ['\u03c7\u00b2(2, N = 90) = -1.4, p = .50', 'chi2', '-1.4'],
  ])('reads the statistic of %s', (written, kind, value) => {
    const result = onlyResult(`We found ${written}.`);
    expect(result.kind).toBe(kind);
    expect(result.value?.text).toBe(value);
    expect(result.p).not.toBeNull();
  });

  it.each([
    ['\u03b7p2 = 1.30', 'partial-eta-squared', '1.30'],
    ['\u03b7\u00b2 = 1.2', 'eta-squared', '1.2'],
    ['\u03c9\u00b2 = -.02', 'omega-squared', '-.02'],
    ['V = 1.4', 'cramers-v', '1.4'],
  ])('reads the effect size %s', (written, kind, value) => {
    const result = onlyResult(`The effect held, F(1, 20) = 4.10, p = .056, ${written}.`);
    expect(result.effects.map((effect) => [effect.kind, effect.value.text])).toEqual([[kind, value]]);
  });
});
