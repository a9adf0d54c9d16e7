import { describe, expect, it } from 'vitest';
import { scanText } from '../../src/scan/scan.js';
import { dfTexts, onlyResult } from './helpers.js';

describe('a correlation with its df flattened from a subscript ("r18")', () => {
  it.each([
    ['r18 = \u2212.52, p = .019', ['18'], -0.52],
    ['r18 = .44, p = .025', ['18'], 0.44],
    ['r_{18} = .44, p = .025', ['18'], 0.44],
    ['r148 = .21, p = .01', ['148'], 0.21],
    ['r5 = .90, p = .04', ['5'], 0.9],
  ])('reads %s', (written, df, value) => {
    const result = onlyResult(`Rank correlated with wing length (${written}).`);
    expect(result.kind).toBe('r');
    expect(dfTexts(result)).toEqual(df);
    expect(result.value?.value).toBeCloseTo(value, 10);
  });

  it('reads an impossible flattened r as written when its p follows', () => {
    expect(onlyResult('They correlated, r18 = 1.12, p = .02.').value?.text).toBe('1.12');
  });

  it('keeps "t19" and "F1,18" beside it', () => {
    const results = scanText('Scanning rose (t19 = 4.90, p < .001), intake rose (F1,18 = 7.04, p = .016) and fell with rate (r18 = -.52, p = .019).').results;
    expect(results.map((result) => [result.kind, dfTexts(result)])).toEqual([
      ['t', ['19']],
      ['F', ['1', '18']],
      ['r', ['18']],
    ]);
  });

  it('needs a p-value right after it: "r18 = .44" alone may be a name', () => {
    expect(scanText('The coefficient r18 = .44 was fixed in the model.').results).toEqual([]);
    expect(scanText('Item r18 = .44 (see Table 3).').results).toEqual([]);
  });

  // "r2" is r squared: normalisation turns "r²" into "r2", and PDF extraction flattens
  // the superscript the same way. A correlation with df 2 (four cases) is far rarer than
  // an r squared followed by the p of its regression, so "r2" is never read as r(2).
  it.each([
    'The model explained variance, r2 = .45, p < .001.',
    'The model explained variance, r\u00b2 = .45, p < .001.',
    'The model explained variance, r^2 = .45, p < .001.',
  ])('does not read r squared as a correlation: %j', (text) => {
    expect(scanText(text).results).toEqual([]);
  });

  it.each([
    'The first two correlations, r1 = .30, p = .02, and r3 = .41, p = .01, were positive.',
    'The partial correlation r12.3 = .25, p = .01 was small.',
    'Cells r4 = .9, p = .04 were dropped.',
    'Run r18 = 4 trials, p = 3 blocks.',
  ])('does not read correlation names or small subscripts as df: %j', (text) => {
    expect(scanText(text).results).toEqual([]);
  });
});
