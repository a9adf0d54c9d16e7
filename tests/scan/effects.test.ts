import { describe, expect, it } from 'vitest';
import { onlyResult, slice } from './helpers.js';
import { scanText } from '../../src/scan/scan.js';
import type { EffectKind } from '../../src/scan/types.js';

describe('effect sizes', () => {
  it.each<[string, EffectKind]>([
    ['\u03b7p2 = .13', 'partial-eta-squared'],
    ['\u03b7p\u00b2 = .13', 'partial-eta-squared'],
    ['\u03b7\u209a\u00b2 = .13', 'partial-eta-squared'],
    ['\u03b72p = .13', 'partial-eta-squared'],
    ['\u03b7\u00b2p = .13', 'partial-eta-squared'],
    ['\u03b7_p^2 = .13', 'partial-eta-squared'],
    ['partial \u03b72 = .13', 'partial-eta-squared'],
    ['partial eta squared = .13', 'partial-eta-squared'],
    ['partial eta-squared = .13', 'partial-eta-squared'],
    ['eta2p = .13', 'partial-eta-squared'],
    ['\u03b72 = .13', 'eta-squared'],
    ['\u03b7\u00b2 = .13', 'eta-squared'],
    ['\u03b7G2 = .13', 'generalized-eta-squared'],
    ['\u03b7\u00b2G = .13', 'generalized-eta-squared'],
    ['generalized eta squared = .13', 'generalized-eta-squared'],
    ['ges = .13', 'generalized-eta-squared'],
    ['\u03c92 = .13', 'omega-squared'],
    ['\u03c9\u00b2 = .13', 'omega-squared'],
    ['\u03c9p2 = .13', 'partial-omega-squared'],
    ['Cohen\u2019s d = .13', 'cohens-d'],
    ["Cohen's d = .13", 'cohens-d'],
    ['d = .13', 'cohens-d'],
    ['dz = .13', 'cohens-d'],
    ["Hedges' g = .13", 'hedges-g'],
    ['g = .13', 'hedges-g'],
    ["Cohen's f = .13", 'cohens-f'],
    ['\u03c6 = .13', 'phi'],
    ['phi = .13', 'phi'],
    ['Cram\u00e9r\u2019s V = .13', 'cramers-v'],
    ['V = .13', 'cramers-v'],
    ['r = .13', 'r'],
  ])('reads %s after a result', (written, kind) => {
    const text = `The effect was reliable, F(2, 57) = 4.21, p = .021, ${written}.`;
    const result = onlyResult(text);
    expect(result.effects.map((effect) => effect.kind)).toEqual([kind]);
    const effect = result.effects[0]!;
    expect(effect.value).toEqual({ value: 0.13, text: '.13', decimals: 2, exponent: 0 });
    expect(slice(text, effect)).toBe(written);
    expect(result.end).toBe(effect.end);
  });

  it('reads an effect size inside the same parentheses', () => {
    const result = onlyResult('(F(2, 57) = 4.21, p = .021, \u03b7p2 = .13)');
    expect(result.effects[0]?.kind).toBe('partial-eta-squared');
  });

  it('reads several effect sizes in order', () => {
    const result = onlyResult('t(28) = 2.21, p = .035, d = 0.41, g = 0.40');
    expect(result.effects.map((effect) => [effect.kind, effect.value.text])).toEqual([
      ['cohens-d', '0.41'],
      ['hedges-g', '0.40'],
    ]);
  });

  it('reads an effect size placed between the statistic and the p-value', () => {
    const result = onlyResult('F(1, 44) = 5.10, MSE = 12.40, \u03b7p2 = .10, p = .03');
    expect(result.effects.map((effect) => effect.kind)).toEqual(['partial-eta-squared']);
    expect(result.p?.value.text).toBe('.03');
  });

  it('does not record other name = value pairs as effect sizes', () => {
    const result = onlyResult('F(1, 44) = 5.10, MSE = 12.40, p = .03');
    expect(result.effects).toEqual([]);
    expect(result.p?.value.text).toBe('.03');
  });
});

describe('confidence intervals', () => {
  it.each([
    ['90% CI [.01, .12]', 0.9, '.01', '.12'],
    ['95% CI [0.12, 0.45]', 0.95, '0.12', '0.45'],
    ['CI = [.01; .12]', null, '.01', '.12'],
    ['95% CI: .01 to .12', 0.95, '.01', '.12'],
    ['95% CI (\u2212.10, .20)', 0.95, '-.10', '.20'],
    ['95% CI [.01 \u2013 .12]', 0.95, '.01', '.12'],
    ['[.01, .12]', null, '.01', '.12'],
    ['95% confidence interval [.01, .12]', 0.95, '.01', '.12'],
  ])('attaches %s to the effect size it follows', (written, level, low, high) => {
    const text = `F(2, 57) = 4.21, p = .021, \u03b7p2 = .06, ${written}.`;
    const effect = onlyResult(text).effects[0]!;
    expect(effect.interval?.level ?? null).toBe(level);
    expect(effect.interval?.low.text).toBe(low);
    expect(effect.interval?.high.text).toBe(high);
    expect(slice(text, effect).endsWith(written)).toBe(true);
  });

  it('does not attach an interval that follows the statistic rather than an effect size', () => {
    const result = onlyResult('t(28) = 2.21, p = .035, 95% CI [0.10, 0.90], d = 0.41');
    expect(result.effects).toHaveLength(1);
    expect(result.effects[0]!.interval).toBeNull();
    expect(result.effects[0]!.kind).toBe('cohens-d');
  });
});

describe('effect-size names wrapped by a narrow column', () => {
  it.each(['partial eta\nsquared = .09', 'partial\neta squared = .09', 'partial eta\r\nsquared = .09'])('%j', (effect) => {
    const [result] = scanText(`F(1, 40) = 4.00, p = .052, ${effect}.`).results;
    expect(result?.effects.map((e) => [e.kind, e.value.value])).toEqual([['partial-eta-squared', 0.09]]);
  });
});
