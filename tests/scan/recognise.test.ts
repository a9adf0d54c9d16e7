import { describe, expect, it } from 'vitest';
import { scanText } from '../../src/scan/scan.js';
import { dfTexts, onlyResult } from './helpers.js';

describe('F tests', () => {
  it.each([
    ['F(2, 57) = 4.21', ['2', '57'], '4.21'],
    ['F(1,44)=0.89', ['1', '44'], '0.89'],
    ['F[1, 44] = 5.10', ['1', '44'], '5.10'],
    ['F (1, 44) = 5.10', ['1', '44'], '5.10'],
    ['F1,44 = 5.10', ['1', '44'], '5.10'],
    ['F1, 44 = 5.10', ['1', '44'], '5.10'],
    ['F_{1,44} = 5.10', ['1', '44'], '5.10'],
    ['F(1.62, 45.36) = 3.87', ['1.62', '45.36'], '3.87'],
    ['F(df = 2, 57) = 4.21', ['2', '57'], '4.21'],
  ])('reads %s', (written, df, value) => {
    const result = onlyResult(`The effect was reliable, ${written}.`);
    expect(result.kind).toBe('F');
    expect(dfTexts(result)).toEqual(df);
    expect(result.value?.text).toBe(value);
    expect(result.valueComparator).toBe('=');
  });

  it('reads "F < 1" without df as value 1 with comparator "<"', () => {
    const result = onlyResult('The interaction was not significant, F < 1.');
    expect(result.df).toEqual([]);
    expect(result.value?.value).toBe(1);
    expect(result.valueComparator).toBe('<');
  });

  it('reads "F(1, 44) < 1" and "Fs < 1"', () => {
    const [withDf, plural] = scanText('Neither effect mattered, F(1, 44) < 1, and all other Fs < 1.').results;
    expect(dfTexts(withDf!)).toEqual(['1', '44']);
    expect(withDf!.valueComparator).toBe('<');
    expect(plural!.kind).toBe('F');
    expect(plural!.valueComparator).toBe('<');
  });

  it('keeps the decimals as written', () => {
    const result = onlyResult('F(2, 57) = 4.20, p = .021');
    expect(result.value).toEqual({ value: 4.2, text: '4.20', decimals: 2, exponent: 0 });
    expect(result.df[1]).toEqual({ value: 57, text: '57', decimals: 0, exponent: 0 });
    expect(result.p?.value.decimals).toBe(3);
  });

  it('accepts "F = 4.21" without df only when a p-value follows', () => {
    expect(onlyResult('F = 4.21, p = .02').df).toEqual([]);
    expect(scanText('the force F = 4.21 newtons').results).toEqual([]);
  });
});

describe('t tests', () => {
  it.each([
    ['t(28) = -2.21', ['28'], -2.21],
    ['t(28) = \u22122.21', ['28'], -2.21],
    ['t(28) = \u20132.21', ['28'], -2.21],
    ['t(45.3) = 2.05', ['45.3'], 2.05],
    ['t28 = 2.1', ['28'], 2.1],
    ['t(1,024) = 3.50', ['1024'], 3.5],
    ['t (df = 30) = 2.10', ['30'], 2.1],
  ])('reads %s', (written, df, value) => {
    const result = onlyResult(`Participants improved, ${written}.`);
    expect(result.kind).toBe('t');
    expect(dfTexts(result)).toEqual(df);
    expect(result.value?.value).toBeCloseTo(value, 10);
  });

  it('reads a flattened subscript with small df only when a p-value follows', () => {
    expect(scanText('At t1 = 3.2 the light came on.').results).toEqual([]);
    expect(dfTexts(onlyResult('The change was reliable, t3 = 3.2, p = .049.'))).toEqual(['3']);
  });

  it('normalises the minus sign in the value text', () => {
    expect(onlyResult('t(28) = \u22122.21').value?.text).toBe('-2.21');
  });

  it('reads "t = 2.10" without df only when a p-value follows', () => {
    expect(onlyResult('a difference, t = 2.10, p = .04').df).toEqual([]);
    expect(scanText('time t = 2.10 s after onset').results).toEqual([]);
  });
});

describe('chi-square tests', () => {
  it.each([
    ['\u03c72(2, N = 120) = 7.81', ['2'], '120'],
    ['\u03c7\u00b2(1) = 4.2', ['1'], null],
    ['\u03c7\u00b2 (1, N = 1,024) = 4.2', ['1'], '1024'],
    ['chi2(1) = 4.2', ['1'], null],
    ['X2(1) = 4.2', ['1'], null],
    ['X^2(1) = 4.2', ['1'], null],
    ['Chi-square(2) = 6.10', ['2'], null],
    ['chi-square(2, N = 120) = 7.81', ['2'], '120'],
    ['chi-squared(3) = 9.0', ['3'], null],
    ['\u03a7\u00b2(2, n = 60) = 5.99', ['2'], '60'],
    ['\u03c72(df = 2, N = 120) = 7.81', ['2'], '120'],
  ])('reads %s', (written, df, sampleSize) => {
    const result = onlyResult(`Choices differed by group, ${written}.`);
    expect(result.kind).toBe('chi2');
    expect(dfTexts(result)).toEqual(df);
    expect(result.sampleSize?.text ?? null).toBe(sampleSize);
  });

  it('requires brackets around the df when chi-square is written as X2', () => {
    expect(scanText('the predictor X2 = 4.2 in the model').results).toEqual([]);
  });
});

describe('correlations', () => {
  it('reads r with df', () => {
    const result = onlyResult('Scores correlated, r(48) = .32.');
    expect(result.kind).toBe('r');
    expect(dfTexts(result)).toEqual(['48']);
    expect(result.value).toEqual({ value: 0.32, text: '.32', decimals: 2, exponent: 0 });
  });

  it('reads r without df, with an empty df, only when a p-value follows', () => {
    const result = onlyResult('Scores correlated, r = \u2212.32, p = .02.');
    expect(result.df).toEqual([]);
    expect(result.value?.value).toBe(-0.32);
    expect(scanText('Scores correlated, r = .32, in both samples.').results).toEqual([]);
  });
});

describe('z tests', () => {
  it.each([
    ['z = 2.45', 2.45],
    ['Z = -1.96', -1.96],
    ['z = \u22121.96', -1.96],
  ])('reads %s', (written, value) => {
    const result = onlyResult(`The indirect effect was reliable (${written}).`);
    expect(result.kind).toBe('z');
    expect(result.df).toEqual([]);
    expect(result.value?.value).toBe(value);
  });
});

describe('placement in text', () => {
  it('finds several results in one sentence, separated by commas and semicolons', () => {
    const text =
      'Both main effects were reliable, F(1, 44) = 5.10, p = .029, and F(2, 88) = 3.20, p = .045; the interaction was not, F(2, 88) = 1.02, p = .37.';
    const results = scanText(text).results;
    expect(results.map((result) => result.value?.text)).toEqual(['5.10', '3.20', '1.02']);
    expect(results.map((result) => result.p?.value.text)).toEqual(['.029', '.045', '.37']);
  });

  it('finds results inside parentheses and brackets', () => {
    const results = scanText('A main effect (F(1, 44) = 5.10, p = .03) and a trend [t(30) = 1.80, p = .08].').results;
    expect(results.map((result) => result.kind)).toEqual(['F', 't']);
    expect(results[1]!.p?.value.text).toBe('.08');
  });

  it('finds a result split across a line break anywhere', () => {
    for (const text of [
      'reliable, F(1,\n44) = 5.10, p = .03.',
      'reliable, F(1, 44)\n= 5.10, p = .03.',
      'reliable, F(1, 44) =\n5.10, p = .03.',
      'reliable, F\n(1, 44) = 5.10, p = .03.',
      'reliable, F(1, 44) = 5.10,\np = .03.',
      'reliable, F(1, 44) = 5.10, p\n= .03.',
      'reliable, \u03c7\u00b2(2, N =\n120) = 7.81, p = .02.',
    ]) {
      const result = onlyResult(text);
      expect(result.value?.value).toBeGreaterThan(0);
      expect(result.p?.value.text).toBe(text.includes('7.81') ? '.02' : '.03');
    }
  });

  it('reads results typeset in full-width and mathematical italic characters', () => {
    const fullWidth = onlyResult('\uff26\uff08\uff11\uff0c\u3000\uff14\uff14\uff09\u3000\uff1d\u3000\uff15\uff0e\uff11\uff10');
    expect(dfTexts(fullWidth)).toEqual(['1', '44']);
    expect(fullWidth.value?.text).toBe('5.10');
    const italic = onlyResult('\u{1d439}(2, 40) = 3.30, \u{1d45d} = .047');
    expect(italic.p?.value.text).toBe('.047');
  });

  it('returns results in document order', () => {
    const results = scanText('r(40) = .30, p = .05. Then z = 2.00. Then t(9) = 3.1, p = .01.').results;
    expect(results.map((result) => result.kind)).toEqual(['r', 'z', 't']);
    expect(results.map((result) => result.start)).toEqual([...results.map((result) => result.start)].sort((a, b) => a - b));
  });
});

describe('df written after the value (older styles)', () => {
  it.each([
    ['F = 4.21, df = 1, 44, p = .046', 'F', [1, 44]],
    ['F = 4.21, df = 1/44, p = .046', 'F', [1, 44]],
    ['t = 2.21, df = 28, p = .035', 't', [28]],
    ['t = 2.21, df=28, p<.05', 't', [28]],
    ['chi2 = 3.9, df = 1, p = .048', 'chi2', [1]],
    ['r = .32, df = 48, p = .023', 'r', [48]],
  ])('%s', (text, kind, df) => {
    const results = scanText(`The effect (${text}) was clear.`).results;
    expect(results.map((r) => [r.kind, r.df.map((d) => d.value)])).toEqual([[kind, df]]);
  });
  it('an F with one trailing df is incomplete and not read; df elsewhere in the sentence is not taken', () => {
    expect(scanText('F = 4.21, df = 1, p = .046').results).toEqual([]);
    expect(scanText('we used df = 28 and t = 2.21.').results).toEqual([]);
  });
});
