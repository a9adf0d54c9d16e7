import { describe, expect, it } from 'vitest';
import { normaliseText } from '../../src/scan/normalise.js';
import { scanText } from '../../src/scan/scan.js';
import { dfTexts, onlyResult, slice } from './helpers.js';

describe('Markdown and Word-to-text emphasis around symbols', () => {
  it.each([
    ['*t*(46.8) = 0.74, p = .463', 't', ['46.8'], '0.74'],
    ['*F*(1, 52) = 5.10, p = .03', 'F', ['1', '52'], '5.10'],
    ['**F**(2, 57) = 4.21, p = .021', 'F', ['2', '57'], '4.21'],
    ['***F***(2, 57) = 4.21, p = .021', 'F', ['2', '57'], '4.21'],
    ['__F__(2, 57) = 4.21, p = .021', 'F', ['2', '57'], '4.21'],
    ['_t_(30) = 2.10, p = .044', 't', ['30'], '2.10'],
    ['*r*(54) = \u2212.12, p = .378', 'r', ['54'], '-.12'],
    ['*z* = 2.81, p = .005', 'z', [], '2.81'],
    ['*\u03c7*\u00b2(2, *N* = 312) = 9.21, p = .010', 'chi2', ['2'], '9.21'],
    ['\u03c7\u00b2(2, *N* = 312) = 9.21, p = .010', 'chi2', ['2'], '9.21'],
    ['*t*(df = 30) = 2.10, p = .044', 't', ['30'], '2.10'],
  ])('reads %s', (written, kind, df, value) => {
    const text = `As expected, ${written}.`;
    const result = onlyResult(text);
    expect(result.kind).toBe(kind);
    expect(dfTexts(result)).toEqual(df);
    expect(result.value?.text).toBe(value);
    expect(result.p).not.toBeNull();
  });

  it('reads the chi-square sample size written as *N*', () => {
    expect(onlyResult('Parents differed, \u03c7\u00b2(2, *N* = 312) = 9.21, p = .010.').sampleSize?.value).toBe(312);
  });

  it.each([
    ['*p* < .001', '<', '.001'],
    ['_p_ = .03', '=', '.03'],
    ['**p** = .03', '=', '.03'],
    ['*p* \u2264 .05', '<=', '.05'],
    ['*p* <= .01', '<=', '.01'],
    ['*p*-value = .03', '=', '.03'],
  ])('reads the emphasised p %s', (written, comparator, value) => {
    const text = `The groups differed, F(1, 39) = 5.33, ${written}.`;
    const result = onlyResult(text);
    expect(result.p?.comparator).toBe(comparator);
    expect(result.p?.value.text).toBe(value);
    // The p's offsets point at the letter p of the original text, not at a marker.
    expect(text.charAt(result.p!.start)).toBe('p');
  });

  it('reads "*p*s" as a plural p', () => {
    const result = onlyResult('Both differed, Fs(3, 308) > 6.1, all *p*s < .02.');
    expect(result.p?.plural).toBe(true);
    expect(result.p?.value.text).toBe('.02');
  });

  it.each([
    ['*\u03b7*p2 = .12', 'partial-eta-squared', '.12'],
    ['*\u03b7*\u00b2p = .12', 'partial-eta-squared', '.12'],
    ['*d* = 0.45', 'cohens-d', '0.45'],
    ["Hedges' *g* = 0.81", 'hedges-g', '0.81'],
    ['*V* = .17', 'cramers-v', '.17'],
    ['\u03c9\u00b2 = .05', 'omega-squared', '.05'],
  ])('reads the emphasised effect size %s', (written, kind, value) => {
    const result = onlyResult(`The effect held, *F*(1, 39) = 5.33, *p* = .027, ${written}.`);
    expect(result.effects.map((effect) => [effect.kind, effect.value.text])).toEqual([[kind, value]]);
  });

  it('points the result at the symbol of the original text, not at the marker', () => {
    const text = 'Teachers rated them higher, *t*(54) = 2.53, *p* = .014, *d* = 0.69.';
    const result = onlyResult(text);
    expect(text.charAt(result.start)).toBe('t');
    expect(slice(text, result)).toBe(result.text);
    expect(result.text.startsWith('t*(54) = 2.53')).toBe(true);
    expect(result.text.endsWith('0.69')).toBe(true);
    const effect = result.effects[0]!;
    expect(slice(text, effect)).toBe('d* = 0.69');
  });

  it('reads bold list items and headings without losing the results after them', () => {
    const text = [
      '- **Fluency.** Pupils gained more, *t*(52.6) = 3.08, p = .003, Hedges\' *g* = 0.81, 95% CI [0.27, 1.35].',
      '1. **H2 (order).** The effect depended on order, *F*(1, 40) = 4.10, *p* = .05.',
      '- Delays did not change (*F*(1, 39) = 0.09, n.s.).',
    ].join('\n');
    const results = scanText(text).results;
    expect(results.map((result) => result.kind)).toEqual(['t', 'F', 'F']);
    expect(results[0]!.effects[0]!.interval?.high.text).toBe('1.35');
    expect(results[2]!.notSignificant).toBe(true);
  });

  it('keeps subscript underscores and multiplication stars', () => {
    expect(normaliseText('\u03b7_p^2 = .10').text).toBe('eta_p^2 = .10');
    expect(normaliseText('F_{1,44} = 5.10, p_{adj} = .03').text).toBe('F_{1,44} = 5.10, p_{adj} = .03');
    expect(normaliseText('p = 1.2*10^-5').text).toBe('p = 1.2*10^-5');
    expect(normaliseText('a 2 * 3 design').text).toBe('a 2 * 3 design');
    expect(normaliseText('my_var_name and __init__').text).toBe('my_var_name and init');
    const result = onlyResult('The effect was reliable, F_{1,44} = 5.10, p_{adj} = .03, \u03b7_p^2 = .10.');
    expect(dfTexts(result)).toEqual(['1', '44']);
    expect(result.p?.value.text).toBe('.03');
    expect(result.effects[0]?.kind).toBe('partial-eta-squared');
    expect(onlyResult('An effect, t(30) = 2.5, p = 1.2*10^-5.').p?.value.exponent).toBe(-5);
  });

  it('leaves significance stars, bullets and unclosed markers alone', () => {
    expect(normaliseText('r = .45**, r = .30*').text).toBe('r = .45**, r = .30*');
    expect(normaliseText('* item one\n* item two').text).toBe('* item one\n* item two');
    expect(normaliseText('Note. *p < .05. **p < .01. ***p < .001.').text).toBe('Note. *p < .05. **p < .01. ***p < .001.');
    expect(normaliseText('*t*\n(28) = 2.1*').text).toBe('t\n(28) = 2.1*');
    expect(normaliseText('an *unclosed\nline* here').text).toBe('an *unclosed\nline* here');
  });

  it('does not turn emphasised look-alikes into results', () => {
    expect(scanText('As shown in *Figure 2F*, the *t* distribution and *F1* = 0.83 differ.').results).toEqual([]);
    expect(scanText('Use a *t*-test (two-sided) for this, see *p*. 12.').results).toEqual([]);
  });

  it('stays linear on long runs of markers', () => {
    const text = `${'*a '.repeat(50_000)}${'_'.repeat(100_000)}${'*t*'.repeat(30_000)} *F*(1, 20) = 5.1, *p* = .03`;
    const results = scanText(text).results;
    expect(results.at(-1)?.kind).toBe('F');
  });
});
