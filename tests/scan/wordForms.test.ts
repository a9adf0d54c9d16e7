/**
 * Results written partly in words, as many published papers write them
 * (common practice): the statistic named with a word ("F-value", "t value",
 * "F ratio", "chi-square value", "z-value"), "was" or "of" for "=", and df
 * given in words after the value ("with 2 and 57 degrees of freedom").
 * The numbers are invented and consistent (SciPy 1.10.1, computed when the
 * test was written: F(2, 57) = 5.10 gives p = .0091; t(58) = 2.41 gives
 * p = .019; χ²(1) = 2.40 gives p = .121; χ²(2) = 9.35 gives p = .0093;
 * z = 2.33 gives p = .020).
 */
import { describe, expect, it } from 'vitest';
import { plainTextDocument } from '../../src/documents/text.js';
import { scanDocument } from '../../src/scan/scanDocument.js';

function read(text: string): string[] {
  return scanDocument(plainTextDocument('words.txt', 'text', text)).results.map(
    (result) => `${result.kind}(${result.df.map((df) => df.text).join(', ')}) = ${result.value?.text} p ${result.p?.comparator ?? ''} ${result.p?.value.text ?? ''}`.trimEnd(),
  );
}

describe('statistics named with a word, their value given with "was", "of" or "is"', () => {
  it.each([
    ['The F-value was 5.10 with 2 and 57 degrees of freedom (p = .009).', 'F(2, 57) = 5.10 p = .009'],
    ['a main effect of group (F ratio = 5.10, df = 2, 57, p = .009)', 'F(2, 57) = 5.10 p = .009'],
    ['The t-value was 2.41 (df = 58, p = .019).', 't(58) = 2.41 p = .019'],
    ['Groups differed, with a t value of 2.41 (df = 58, p = .019).', 't(58) = 2.41 p = .019'],
    ['The chi-square value was 2.40 (df = 1, p = .121).', 'chi2(1) = 2.40 p = .121'],
    ['The z-value was 2.33 (p = .020).', 'z() = 2.33 p = .020'],
  ])('%s', (text, expected) => {
    expect(read(text)).toEqual([expected]);
  });

  it('reads no test from a z-score given without a p (a standard score)', () => {
    expect(read('The child had a z-score of 2.33 on the vocabulary test.')).toEqual([]);
  });

  it('reads no test from a word that is not a statistic before "was"', () => {
    expect(read('The mean value was 5.10 and the t-shirt value was 12.')).toEqual([]);
  });
});

describe('df written in words after the value', () => {
  it.each([
    ['F = 5.10 with 2 and 57 degrees of freedom, p = .009.', 'F(2, 57) = 5.10 p = .009'],
    ['t = 2.41 with 58 df, p = .019', 't(58) = 2.41 p = .019'],
    ['t = 2.41, 58 df, p = .019', 't(58) = 2.41 p = .019'],
    // Kruskal-Wallis H with its df after the value (Kruskal & Wallis, 1952: referred to chi-square with k − 1 df).
    ['Kruskal–Wallis test: H = 9.35, df = 2, p = 0.009.', 'chi2(2) = 9.35 p = 0.009'],
  ])('%s', (text, expected) => {
    expect(read(text)).toEqual([expected]);
  });

  it('takes no df from a count that is not df ("12 trials")', () => {
    expect(read('the interaction (F = 3.1, 12 trials, p = .04)')).toEqual([]);
  });
});

describe('a p broken over lines by a hyphen', () => {
  it('reads the statistic and no p from "p = .0-" / "15" (what the p was cannot be told)', () => {
    expect(read('F(1, 52) = 6.30, p = .0-\n15')).toEqual(['F(1, 52) = 6.30 p']);
  });
});

describe('inline markup left in text (Markdown converted from publishers\' XML, text copied from web pages)', () => {
  it.each([
    ['The effect was significant, <italic>F</italic>(2, 57) = 5.10, <italic>p</italic> = .009.', 'F(2, 57) = 5.10 p = .009'],
    ['Groups differed, <em>t</em>(58) = 2.41, <em>p</em> = .019.', 't(58) = 2.41 p = .019'],
    ['Proportions did not differ, χ<sup>2</sup>(1) = 2.40, <i>p</i> = .121.', 'chi2(1) = 2.40 p = .121'],
    ['The effect was significant, F<sub>2,57</sub> = 5.10, p = .009.', 'F(2, 57) = 5.10 p = .009'],
  ])('%s', (text, expected) => {
    expect(read(text)).toEqual([expected]);
  });

  it('keeps a "<" that is a comparator', () => {
    expect(read('The effect was significant, F(2, 57) = 15.10, p <.001.')).toEqual(['F(2, 57) = 15.10 p < .001']);
  });
});

describe('a correlation with its sample size in the brackets', () => {
  // r(58) = .30 gives p = .0199 (SciPy 1.10.1, scipy.stats.pearsonr's t with 58 df, computed when the test was written).
  it('reads "r(N = 60) = .30" with df N − 2', () => {
    expect(read('Recall correlated with age, r(N = 60) = .30, p = .020.')).toEqual(['r(58) = .30 p = .020']);
  });
});
