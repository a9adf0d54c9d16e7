/**
 * Notations real published text uses beyond the textbook forms: df
 * separators, by-participant and by-item F tests, chi-square spellings, LaTeX
 * left in web text, Spearman's subscript set apart, and the damage PDF text
 * extraction does to comparators and numbers. Each form is one that occurs
 * in the real corpus (tests/corpus/real/) or in the forms the issue on real
 * prose lists; the expectations are what the text says, read by eye.
 */
import { describe, expect, it } from 'vitest';
import { scanText } from '../../src/scan/scan.js';
import { normaliseText } from '../../src/scan/normalise.js';
import { dfTexts, onlyResult } from './helpers.js';

describe('df separators and labels', () => {
  it.each([
    ['F (3\u2013112) = 14.62, p < .001', ['3', '112']],
    ['F(3-112) = 14.62, p < .001', ['3', '112']],
    ['F(1/40) = 4.50, p = .040', ['1', '40']],
    ['F(1; 40) = 4.50, p = .040', ['1', '40']],
    ['F [2, 310] = 5.21, p = .006', ['2', '310']],
    ['F (gl = 2, 57) = 4.21, p = .02', ['2', '57']],
    ['F(ddl = 2, 57) = 4.21, p = .02', ['2', '57']],
    // A subscript df pair set apart by a space, as a web page flattens it (tests/corpus/real/passages/divr-04.txt).
    ['F 1, 22 = 1240.19, P < 0.001', ['1', '22']],
  ])('reads %s', (written, df) => {
    const result = onlyResult(`The effect was reliable, ${written}.`);
    expect(result.kind).toBe('F');
    expect(dfTexts(result)).toEqual(df);
  });

  it('reads "t[44]" and a t with its df labelled "gl"', () => {
    expect(dfTexts(onlyResult('The groups differed, t[44] = 2.31, p = .026.'))).toEqual(['44']);
    expect(dfTexts(onlyResult('Los grupos difieren, t(gl = 44) = 2,31; p = 0,026.'))).toEqual(['44']);
  });

  it('does not read a dash between df for t or chi-square', () => {
    expect(scanText('scores t(3-4) = 2.1, p = .04').results).toEqual([]);
  });

  it('reads an "l" where a df of 1 belongs, only before a separator', () => {
    const result = onlyResult('An effect of group, F(l, 57) = 4.21, p = .044.');
    expect(dfTexts(result)).toEqual(['1', '57']);
    expect(scanText('An effect, F(lo, 57) = 4.21, p = .044.').results).toEqual([]);
  });
});

describe('by-participant and by-item F tests', () => {
  it('reads F1 and F2 with their own df', () => {
    const [byParticipant, byItem] = scanText('The effect held, F1(1, 31) = 6.02, p = .02; F2(1, 46) = 3.95, p = .05.').results;
    expect(byParticipant!.kind).toBe('F');
    expect(dfTexts(byParticipant!)).toEqual(['1', '31']);
    expect(byParticipant!.value?.text).toBe('6.02');
    expect(dfTexts(byItem!)).toEqual(['1', '46']);
    expect(byItem!.p?.value.text).toBe('.05');
  });

  it('leaves an F1 score alone', () => {
    expect(scanText('The classifier reached F1 = 0.83 on the test set.').results).toEqual([]);
  });
});

describe('chi-square spellings', () => {
  it('reads "X2 = 18.4, df = 4" with df written after the value', () => {
    const result = onlyResult('The distributions differed, X2 = 18.4, df = 4, p = .001.');
    expect(result.kind).toBe('chi2');
    expect(dfTexts(result)).toEqual(['4']);
  });

  it('reads "X 2 (2, N = 188)", the superscript set apart', () => {
    const result = onlyResult('Groups differed, X 2 (2, N = 188) = 9.21, p = .010.');
    expect(result.kind).toBe('chi2');
    expect(result.sampleSize?.value).toBe(188);
  });

  it('reads "χ 2(2) = 5.9", the superscript set apart from the χ (tests/corpus/real/passages/dvzb-01.txt)', () => {
    const result = onlyResult('Tooth cleaning medium differed, \u03c7 2(2) = 5.9, p = 0.52.');
    expect(result.kind).toBe('chi2');
    expect(dfTexts(result)).toEqual(['2']);
    expect(scanText('Its \u03c7 22 = 4 is no chi-square.').results).toEqual([]);
  });

  it('still needs df for X2: "X2 = 4.1" alone is a variable', () => {
    expect(scanText('The predictor X2 = 4.1, p = .04, was kept.').results).toEqual([]);
  });
});

describe('LaTeX and MathJax left in web text', () => {
  it('reads "$$\\chi^2$$(2, N = 188) = 9.21"', () => {
    const text = 'The association was reliable, $$\\chi^2$$(2, N = 188) = 9.21, p = .010.';
    const result = onlyResult(text);
    expect(result.kind).toBe('chi2');
    expect(dfTexts(result)).toEqual(['2']);
    expect(text.slice(result.start, result.end)).toBe('\\chi^2$$(2, N = 188) = 9.21, p = .010');
  });

  it('reads "$F(1, 52) = 6.3$" with "\\(\\eta_{p}^{2}\\) = .07"', () => {
    const result = onlyResult('There was an effect, $F(1, 52) = 6.3$, $p = .015$, \\(\\eta_{p}^{2}\\) = .11.');
    expect(dfTexts(result)).toEqual(['1', '52']);
    expect(result.p?.value.text).toBe('.015');
    expect(result.effects.map((e) => [e.kind, e.value.text])).toEqual([['partial-eta-squared', '.11']]);
  });

  it('reads "\\textit{t}(30) = 2.10, \\textit{p} \\leq .05" and "\\chi^{2}(1) = 4.2"', () => {
    const [t, chi] = scanText('A difference, \\textit{t}(30) = 2.10, \\textit{p} \\leq .05, and \\(\\chi^{2}(1) = 4.20, p = .040\\).').results;
    expect(t!.kind).toBe('t');
    expect(t!.p?.comparator).toBe('<=');
    expect(chi!.kind).toBe('chi2');
    expect(dfTexts(chi!)).toEqual(['1']);
  });
});

describe("Spearman's subscript set apart", () => {
  it('reads "r s (34) = .41"', () => {
    const result = onlyResult('Ranks agreed, r s (34) = .41, p = .013.');
    expect(result.kind).toBe('r');
    expect(result.symbol).toBe('rs');
    expect(dfTexts(result)).toEqual(['34']);
  });

  it('does not read "r s" without bracketed df', () => {
    expect(scanText('the r s = .41 mentioned').results).toEqual([]);
  });
});

describe('p-values damaged by text extraction', () => {
  it.each([
    ['p =. 318', '=', 0.318, '.318'],
    ['p b 0.01', '<', 0.01, '0.01'],
    ['p N 0.05', '>', 0.05, '0.05'],
    ['p = < .05', '<', 0.05, '.05'],
    ['p = <.001', '<', 0.001, '.001'],
    ['p 0.05', '<', 0.05, '0.05'],
    ['p 0.032', '=', 0.032, '0.032'],
    ['p < .0000', '<', 0, '.0000'],
  ])('reads "%s" after a statistic', (written, comparator, value, text) => {
    const result = onlyResult(`The difference was t(28) = 2.47, ${written}.`);
    expect(result.p?.comparator).toBe(comparator);
    expect(result.p?.value.value).toBe(value);
    expect(result.p?.value.text).toBe(text);
  });

  it('reads no p from "p 12" (a page) or from "p b" before a word', () => {
    expect(onlyResult('The difference was t(28) = 2.47, see p 12.').p).toBeNull();
    expect(onlyResult('The difference was t(28) = 2.47, p b elsewhere.').p).toBeNull();
  });

  it('reads the "=" a symbol font gives as "¼" ("F(1, 40) ¼ 5.20, p ¼ 0.028"), and no "¼" that is a quarter', () => {
    const result = onlyResult('The effect was F(1, 40) \u00bc 5.20, p \u00bc 0.028, as expected.');
    expect([result.value?.value, result.df.map((df) => df.value), result.p?.comparator, result.p?.value.value]).toEqual([5.2, [1, 40], '=', 0.028]);
    expect(onlyResult('About \u00bc of them said so; t(28) = 2.47, p = .020.').value?.value).toBe(2.47);
  });

  it('reads what a symbol font gives for "χ", "−" and "η" ("v2(1, N = 42) ¼ 4.80", "t(40) ¼ À2.28", "g2 p ¼ .12")', () => {
    const chi = onlyResult('The groups differed, v2(1, N = 42) \u00bc 4.80, p \u00bc .028.');
    expect([chi.kind, chi.df.map((df) => df.value), chi.value?.value]).toEqual(['chi2', [1], 4.8]);
    expect(onlyResult('They differed, t(40) \u00bc \u00c02.28, p \u00bc .028.').value?.value).toBe(-2.28);
    expect(onlyResult('It was F(1, 40) = 5.20, p = .028, g2 p = .12.').effects.map((effect) => [effect.kind, effect.value.value])).toEqual([['partial-eta-squared', 0.12]]);
  });

  it('reads no chi-square from "v2" without bracketed df, and leaves a capital À before a word alone', () => {
    expect(scanText('The version v2 = 3.1 was used.').results).toEqual([]);
    expect(normaliseText('\u00c0 20 ans, t(20) = 2.10').text.startsWith('\u00c0 20')).toBe(true);
  });

  it('reads a minus sign set apart from its number', () => {
    expect(onlyResult('The difference was t(28) = \u2212 0.47, p = .64.').value?.value).toBe(-0.47);
  });
});

describe('"not significant" written out, and other damage real pages carry', () => {
  it.each(['not significant', 'nicht signifikant', 'no significativo', 'não significativo', 'non significatif', 'niet significant'])('reads "%s" after a result as n.s.', (words) => {
    const result = onlyResult(`The interaction was F(1, 20) = 1.20, ${words}.`);
    expect(result.notSignificant).toBe(true);
    expect(result.p).toBeNull();
  });

  it('reads glyphs garbled by a wrong text encoding (âˆ’ for −, â€‰ for a thin space, Î· for η)', () => {
    const result = onlyResult('The effect was t(30) = âˆ’2.10, pâ€‰=â€‰.044, and Î·p2 is not given.');
    expect(result.value?.value).toBe(-2.1);
    expect(result.p?.value.text).toBe('.044');
  });

  it('does not take the p of the next table row (a line that ends in a pipe ends the row; the p row of a table on its side)', () => {
    // (tests/corpus/real/passages/diva-06.txt: a row of F's, each cell on its line, then the row of their p's.)
    const results = scanText('F(2, 24) = 43.408 |\nF(2, 24) = 14.272 |\np = 0.001* |\np = 0.022* |').results;
    expect(results.map((result) => result.p ?? null)).toEqual([null, null]);
  });

  it('reads a p with a footnote letter, "p = .12e", and a value with footnote letters after bracketed df', () => {
    expect(onlyResult('| t(24.22) = 1.64, p = .12e | 0.67 |').p?.value.text).toBe('.12');
    expect(onlyResult('t(37.5) =18.55ab').value?.text).toBe('18.55');
  });
});

describe('Spearman written "Rho"', () => {
  it('reads "Rho = 0.18, p = 0.008" as Spearman and leaves a multiple R alone', () => {
    const [rho, ...rest] = scanText('Rho = 0.18, p = 0.008, while R = .45, p = .01 was the model fit.').results;
    expect(rho!.kind).toBe('r');
    expect(rho!.symbol).toBe('rs');
    expect(rest).toEqual([]);
  });
});

describe('a result broken over two cells of a copy with one cell per line', () => {
  // tests/corpus/real/passages/divd-01.txt: "F1, 24 = 2.26," and "P > 0.05" are one cell printed on two lines.
  it('takes the p after a blank line when the result ends in a comma', () => {
    const [result] = scanText('Interaction\n\nF2, 24 = 0.21,\n\nP > 0.05\n\nMale\n').results;
    expect(result?.p?.comparator).toBe('>');
    expect(result?.p?.value.text).toBe('0.05');
  });

  it('does not cross a blank line without the comma, nor three blank lines, unless statistic and p each stand alone on their lines', () => {
    expect(scanText('The main effect was small, F(2, 24) = 0.21\n\nP > 0.05 held for the rest.\n').results[0]?.p).toBeNull();
    expect(scanText('F(2, 24) = 0.21,\n\n\n\nP > 0.05\n').results[0]?.p ?? null).toBeNull();
    // (tests/corpus/real/passages/dwmb-01.txt: a table page one cell per line, "F1,24 = 0.08" then "p = 0.78".)
    expect(scanText('F(2, 24) = 0.21\n\nP > 0.05\n').results[0]?.p?.value.text).toBe('0.05');
  });
});

describe('a p glued to the value', () => {
  // tests/corpus/real/passages/divf-06.txt: cells "F1,18 = 0.41p= 0.53 ηG2 <0.01", the space before p lost.
  it('reads "F1,18 = 0.41p= 0.53" with its p', () => {
    const result = onlyResult('velocity F1,18 = 0.41p= 0.53 ηG2 <0.01');
    expect(result.value?.text).toBe('0.41');
    expect(result.p?.value.text).toBe('0.53');
  });

  it('still takes a value running into other letters for a unit or a label', () => {
    expect(scanText('the delay was t = 5s, p = .04').results).toEqual([]);
    expect(scanText('t(20) = 5pm').results).toEqual([]);
  });
});

describe('a statistic whose "=" was lost with its p\'s sign', () => {
  // tests/corpus/real/passages/prose-10.txt: "(Rho 0.21, p 0.001) and (Rho = 0.18, p = 0.008)".
  it('reads "Rho 0.21, p 0.001" and marks the p\'s sign as lost', () => {
    const result = onlyResult('Both correlated with sleep scores (Rho 0.21, p 0.001).');
    expect(result.kind).toBe('r');
    expect(result.value?.text).toBe('0.21');
    expect(result.p?.value.text).toBe('0.001');
    expect(result.p?.signLost).toBe(true);
  });

  it('leaves a symbol and a number alone when nothing else was lost', () => {
    expect(scanText('The t 2.1 version and the F 3 key, p = .04, were used.').results).toEqual([]);
  });
});

describe('"much less than" written "<<"', () => {
  // tests/corpus/real/passages/divf-06.txt: "F1,18 = 21.4p<<0.01 (*)ηG2=0.10", "ηG2 <<0.01".
  it('reads "p<<0.01" and "ηG2 <<0.01" as "<"', () => {
    const result = onlyResult('velocity F1,18 = 21.4p<<0.01 (*)ηG2=0.10 here');
    expect(result.p?.comparator).toBe('<');
    expect(result.p?.value.text).toBe('0.01');
    expect(result.effects.map((effect) => effect.value.text)).toEqual(['0.10']);
    expect(onlyResult('F1,18 = 0.10p= 0.76 ηG2 <<0.01').effects.map((effect) => effect.comparator)).toEqual(['<']);
  });
});

describe('chi-square as R prints it', () => {
  // tests/corpus/real/passages/divk-06.txt: "X-squared (1) = 2.1896, p = 0.1389".
  it.each([
    ['X-squared (1) = 2.1896, p = 0.1389', ['1'], '2.1896'],
    ['X-squared = 2.19, df = 1, p-value = 0.1389', ['1'], '2.19'],
  ])('reads %j', (written, df, value) => {
    const result = onlyResult(`Groups differed: ${written}.`);
    expect(result.kind).toBe('chi2');
    expect(dfTexts(result)).toEqual(df);
    expect(result.value?.text).toBe(value);
  });
});

describe('a sample size before the correlation in its brackets', () => {
  // tests/corpus/real/passages/divl-06.txt: "(N = 18, r = −0.595, p = 0.009)".
  it('gives the correlation df N - 2', () => {
    const result = onlyResult('with an average ERD (N = 18, r = \u22120.595, p = 0.009) and');
    expect(result.kind).toBe('r');
    expect(dfTexts(result)).toEqual(['16']);
    expect(result.sampleSize?.text).toBe('18');
  });
});

describe('a stray comma before the closing bracket of the df', () => {
  // tests/corpus/real/passages/divl-05.txt: "F(18,1,) = 2.22, p = 0.144".
  it('reads "F(18,1,)" with both df, and leaves "F(18,) = 2.22" alone', () => {
    expect(dfTexts(onlyResult('no effect, F(18,1,) = 2.22, p = 0.144.'))).toEqual(['18', '1']);
    expect(scanText('no effect, F(18,) = 2.22, p = 0.144.').results).toEqual([]);
  });
});

describe('a p written before its statistic', () => {
  // The layout of a real table (tests/corpus/real/passages/divr-03.txt, CC BY 4.0): each cell is
  // "p < 0.001, F(1,22) = 25.98", two cells to a line.
  it('gives each statistic the p written before it, not the next cell\'s', () => {
    const results = scanText('Glucose p < 0.001, F(1,22) = 24.43 p = 0.010, F(1,20) = 7.98\nInsulin p = 0.015, F(1,22) = 6.97 p < 0.001, F(1,20) = 25.50\n').results;
    expect(results.map((result) => [result.value?.text, result.p?.comparator, result.p?.value.text])).toEqual([
      ['24.43', '<', '0.001'],
      ['7.98', '=', '0.010'],
      ['6.97', '=', '0.015'],
      ['25.50', '<', '0.001'],
    ]);
  });

  it('keeps a p written after the statistic as its own when no statistic follows it', () => {
    const results = scanText('The effect was significant, p < .05, F(1, 20) = 5.10, p = .03.').results;
    expect(results.map((result) => result.p?.value.text)).toEqual(['.03']);
    const chain = scanText('Both were reliable, F(1, 20) = 5.10, p = .035, F(1, 20) = 9.20, p = .006.').results;
    expect(chain.map((result) => result.p?.value.text)).toEqual(['.035', '.006']);
  });
});

describe('an F subscripted by its effect name, with "d.f." after the value', () => {
  // The form of tests/corpus/real/passages/divr-07.txt (CC BY): ecology writes F with the effect as subscript.
  it('reads "F Region = 0.01, d.f. = 1,16, P = 0.912" and "F Region×soil treatment = 0.53, ..."', () => {
    const results = scanText('Neither mattered (F Region = 0.01, d.f. = 1,16, P = 0.912; F Region\u00d7soil treatment = 0.53, d.f. = 1,16, P = 0.475).').results;
    expect(results.map((result) => [result.kind, result.value?.text, dfTexts(result), result.p?.value.text])).toEqual([
      ['F', '0.01', ['1', '16'], '0.912'],
      ['F', '0.53', ['1', '16'], '0.475'],
    ]);
  });

  it('does not read an F with a name but no df after it ("F Region = 0.01" alone), nor words before an "="', () => {
    expect(scanText('We set F Region = 0.01 for the model, p = .02.').results).toEqual([]);
    expect(scanText('The Fisher Region score = 4.1, df = 12, p = .03 was high.').results.filter((result) => result.kind === 'F')).toEqual([]);
  });
});

describe('an F whose cell a table broke over lines', () => {
  // tests/corpus/real/passages/dvzd-05.txt: one cell per line, "F" / "1,175" / "= 10.8" on lines of their own.
  it('reads "F", its subscript df and its value from three lines', () => {
    const result = onlyResult('Caudate\nF\n1,175\n= 10.8\n|\n0.0012');
    expect(result.kind).toBe('F');
    expect(dfTexts(result)).toEqual(['1', '175']);
    expect(result.value?.text).toBe('10.8');
  });
});
