/**
 * Results written partly in words, through the built command line: the
 * statistic and its df read, and a p the statistic cannot give flagged.
 * Invented numbers: F(2, 57) = 5.10 gives p = .0091 (SciPy 1.10.1
 * scipy.stats.f.sf(5.10, 2, 57), computed when the test was written).
 */
import { describe, expect, it } from 'vitest';
import { scanTextJson } from './scanDocumentJson.js';

describe('results written in words, from the command line', () => {
  it('reads "the F-value was 5.10 with 2 and 57 degrees of freedom" and flags a p it cannot give', () => {
    const text = (p: string): string => `The F-value was 5.10 with 2 and 57 degrees of freedom (p = ${p}).\n`;
    const right = scanTextJson(text('.009')).statistics;
    expect(right.map((statistic) => [statistic.kind, statistic.df, statistic.value])).toEqual([['F', [2, 57], 5.1]]);
    expect(right[0]!.findings.filter((finding) => finding.rule === 'p-value-mismatch')).toEqual([]);
    const wrong = scanTextJson(text('.09')).statistics;
    expect(wrong.flatMap((statistic) => statistic.findings.map((finding) => finding.rule))).toContain('p-value-mismatch');
  });
});

describe('inline markup left in a Markdown file, from the command line', () => {
  it('reads "<italic>F</italic>(2, 57)" and "χ<sup>2</sup>(1)" and flags a p the F cannot give', () => {
    // χ²(1) = 2.40 gives p = .121 (SciPy 1.10.1 scipy.stats.chi2.sf(2.40, 1), computed when the test was written).
    const text = 'The association was weak, χ<sup>2</sup>(1) = 2.40, <italic>p</italic> = .121. The effect was significant, <italic>F</italic>(2, 57) = 5.10, <italic>p</italic> = .09.\n';
    const statistics = scanTextJson(text, 'results.md').statistics;
    expect(statistics.map((statistic) => [statistic.kind, statistic.df, statistic.value])).toEqual([
      ['chi2', [1], 2.4],
      ['F', [2, 57], 5.1],
    ]);
    const flagged = statistics.filter((statistic) => statistic.findings.some((finding) => finding.rule === 'p-value-mismatch'));
    expect(flagged.map((statistic) => statistic.kind)).toEqual(['F']);
  });
});

describe('critical values looked up for a test, from the command line', () => {
  it('reads the test and not "the critical F(1, 46) = 4.05" beside it (a table value, no p to check)', () => {
    // F(1, 46) = 12.30 gives p = .0010 (SciPy 1.10.1 scipy.stats.f.sf(12.30, 1, 46), computed when the test was written).
    const text = 'The observed F(1, 46) = 12.30, p = .001, exceeds the critical F(1, 46) = 4.05; the tabulated value of t(58) = 2.00 is not a result either.\n';
    const statistics = scanTextJson(text).statistics;
    expect(statistics.map((statistic) => [statistic.kind, statistic.df, statistic.value])).toEqual([['F', [1, 46], 12.3]]);
  });
});

describe('a df written after the p, from the command line', () => {
  it('reads "χ2 = 7.80, p = 0.020, df = 2" with its df and flags a p the statistic cannot give', () => {
    // χ²(2) = 7.80 gives p = .0202 (SciPy scipy.stats.chi2.sf(7.80, 2) = 0.020242, computed when the test was written).
    const text = (p: string): string => `The groups differed in their choices (chi-square test, χ2 = 7.80, p = ${p}, df = 2).\n`;
    const right = scanTextJson(text('0.020')).statistics;
    expect(right.map((statistic) => [statistic.kind, statistic.df, statistic.value])).toEqual([['chi2', [2], 7.8]]);
    expect(right[0]!.findings.filter((finding) => finding.rule === 'p-value-mismatch')).toEqual([]);
    const wrong = scanTextJson(text('0.20')).statistics;
    expect(wrong.flatMap((statistic) => statistic.findings.map((finding) => finding.rule))).toContain('p-value-mismatch');
  });
});

describe('a statistic whose p a copy lost, from the command line', () => {
  it('reads "(r = 0.222, )", an empty slot where a formula stood, as a correlation without its p', () => {
    const text = 'In a sample of 251 students there was a weak correlation between performance and motivation (r = 0.222, ), and with intrinsic motivation (r = 0.242, ).\n';
    const statistics = scanTextJson(text).statistics;
    expect(statistics.map((statistic) => [statistic.kind, statistic.value, statistic.p])).toEqual([
      ['r', 0.222, null],
      ['r', 0.242, null],
    ]);
    // Without the empty slot a bare "r = 0.222" is not a reported test (a reliability, a description).
    expect(scanTextJson('The retest reliability was high (r = 0.85).\n').statistics).toEqual([]);
  });
});

describe('df in brackets after the value, and a program\'s model summary line, from the command line', () => {
  it('reads "F = 4.21 (1, 38), p = .047" with its df and flags a p the F cannot give', () => {
    // F(1, 38) = 4.21 gives p = .0471 (SciPy scipy.stats.f.sf(4.21, 1, 38) = 0.04712, computed when the test was written).
    const right = scanTextJson('The groups differed, F = 4.21 (1, 38), p = .047.\n').statistics;
    expect(right.map((statistic) => [statistic.kind, statistic.df, statistic.value])).toEqual([['F', [1, 38], 4.21]]);
    expect(right[0]!.findings.filter((finding) => finding.rule === 'p-value-mismatch')).toEqual([]);
    const wrong = scanTextJson('The groups differed, F = 4.21 (1, 38), p = .47.\n').statistics;
    expect(wrong.flatMap((statistic) => statistic.findings.map((finding) => finding.rule))).toContain('p-value-mismatch');
  });

  it('reads "F-statistic: 4.21 on 1 and 38 DF,  p-value: 0.047" as F(1, 38) = 4.21, p = .047', () => {
    const statistics = scanTextJson('Multiple R-squared: 0.1, F-statistic: 4.21 on 1 and 38 DF,  p-value: 0.047\n').statistics;
    expect(statistics.map((statistic) => [statistic.kind, statistic.df, statistic.value, statistic.p?.value])).toEqual([['F', [1, 38], 4.21, 0.047]]);
  });
});

describe('a chi-square whose superscript follows its df, and a p in a spreadsheet\'s scientific notation, from the command line', () => {
  it('reads "χ(1)2 = 1.72" and "p = 9.4.E-07" without flagging consistent results, and flags an exponent that does not fit', () => {
    // χ²(1) = 1.72 gives p = .190; F(1, 468) = 24.7 gives p = 9.41e-7; t(334.7) = 3.62 gives p = .00034 (SciPy 1.10.1
    // scipy.stats.chi2.sf(1.72, 1), f.sf(24.7, 1, 468), 2 * t.sf(3.62, 334.7), computed when the test was written).
    const text = (exponent: string): string =>
      `Groups differed in smoking, χ(1)2 = 1.72, p = 0.19. Income differed, F(1, 468) = 24.7, p = 9.4.E-${exponent}, and so did age, t(334.7) = 3.62, p = 3.4.E-04.\n`;
    const statistics = scanTextJson(text('07')).statistics;
    expect(statistics.map((statistic) => [statistic.kind, statistic.df, statistic.value, statistic.p?.value])).toEqual([
      ['chi2', [1], 1.72, 0.19],
      ['F', [1, 468], 24.7, 9.4e-7],
      ['t', [334.7], 3.62, 3.4e-4],
    ]);
    expect(statistics.flatMap((statistic) => statistic.findings.filter((finding) => finding.severity === 'fail'))).toEqual([]);
    const wrong = scanTextJson(text('03')).statistics;
    expect(wrong[1]!.findings.map((finding) => finding.rule)).toContain('p-value-mismatch');
  });

  it('reads a t typed with a capital and its df ("T28 = 2.2", "T(28) = 2.2"), and not "T2 = 12.3", "T1 = 3.4" or "T = 45"', () => {
    // t(28) = 2.2 gives p = .036 (SciPy 1.10.1, 2 * scipy.stats.t.sf(2.2, 28)).
    const statistics = scanTextJson(
      'Groups differed (T28 = 2.2, P = 0.036) and again (T(28) = 2.2, P = 0.036). Hotelling T2 = 12.3, p = .01. At T1 = 3.4 s and T2 = 5.1, p = .02; Wilcoxon T = 45, p = .03.\n',
    ).statistics;
    expect(statistics.map((statistic) => [statistic.kind, statistic.df, statistic.value])).toEqual([
      ['t', [28], 2.2],
      ['t', [28], 2.2],
    ]);
    expect(statistics.flatMap((statistic) => statistic.findings)).toEqual([]);
  });
});


describe('p and df written in further ways after a statistic, from the command line', () => {
  // F(2, 57) = 4.21 gives p = .0197; F(1, 23) = 4.50 gives p = .0449; t(38) = 2.45 gives p = .0190 (SciPy 1.10.1
  // scipy.stats.f.sf and 2 * scipy.stats.t.sf, computed when the test was written).
  const readAll = (text: string): unknown[][] =>
    scanTextJson(text).statistics.map((statistic) => [statistic.kind, statistic.df, statistic.value, statistic.p === null ? null : `${statistic.p.comparator} ${statistic.p.text}`]);

  it('reads a p after a word that says how it was worked out ("two-tailed p", "two-sided p") and SPSS\'s "Sig."', () => {
    const text = 'Group differed, F(2, 57) = 4.21, two-tailed p = .020. Scores differed (t(38) = 2.45, two-sided p = .019). Time mattered, F(2, 57) = 4.21, Sig. = .020.\n';
    expect(readAll(text)).toEqual([
      ['F', [2, 57], 4.21, '= .020'],
      ['t', [38], 2.45, '= .019'],
      ['F', [2, 57], 4.21, '= .020'],
    ]);
  });

  it('flags a p after "two-tailed" that the statistic cannot give', () => {
    const statistics = scanTextJson('Group differed, F(2, 57) = 4.21, two-tailed p = .20.\n').statistics;
    expect(statistics.flatMap((statistic) => statistic.findings.map((finding) => finding.rule))).toContain('p-value-mismatch');
  });

  it('reads df in square brackets after the value and df joined by "and" ("F = 4.50 [1, 23]", "d.f. = 1 and 23")', () => {
    const text = 'The effect was significant (F = 4.50 [1, 23], p = .045). So was the other (F = 4.50, d.f. = 1 and 23, P = 0.045).\n';
    expect(readAll(text)).toEqual([
      ['F', [1, 23], 4.5, '= .045'],
      ['F', [1, 23], 4.5, '= 0.045'],
    ]);
  });

  it('does not take square brackets with decimals after an F for its df (they are an interval)', () => {
    const statistics = scanTextJson('The effect was significant (F = 4.50 [1.2, 9.8], p = .045).\n').statistics;
    // (An F in running text without its df is not read at all, so nothing is left.)
    expect(statistics).toEqual([]);
  });

  it('reads an F whose flattened subscript df a wrapped line breaks after the comma ("F22," / "233 = 1.06")', () => {
    // F(22, 233) = 1.06 gives p = .393 (SciPy 1.10.1 scipy.stats.f.sf(1.06, 22, 233), computed when the test was written).
    expect(readAll('The interaction was not significant, F22,\n233 = 1.06, p = 0.393, in either group.\n')).toEqual([['F', [22, 233], 1.06, '= 0.393']]);
    // And an F subscripted by its effect's name, the line ending after the name (F(1, 16) = 0.01 gives p = .922;
    // SciPy 1.10.1 scipy.stats.f.sf(0.01, 1, 16), computed when the test was written).
    expect(readAll('The effect of region was small (F Region\n= 0.01, d.f. = 1,16, P = 0.922).\n')).toEqual([['F', [1, 16], 0.01, '= 0.922']]);
  });

  it('reads an F whose subscript df are set apart by a slash ("F2/87 = 4.10"), as a flattened subscript prints them', () => {
    // F(2, 87) = 4.10 gives p = .020 (SciPy 1.10.1 scipy.stats.f.sf(4.10, 2, 87) = 0.0199, computed when the test was written).
    expect(readAll('Growth differed between the diets (F2/87 = 4.10, P = 0.020).\n')).toEqual([['F', [2, 87], 4.1, '= 0.020']]);
  });

  it('reads an F whose df stand in brackets inside a LaTeX subscript\'s braces ("$$F_{(1, 42)} = 17.68, p < 0.05$$")', () => {
    // F(1, 42) = 17.68 gives p = .00013 and F(1, 42) = 2.58 gives p = .116 (SciPy 1.10.1 scipy.stats.f.sf, computed when
    // the test was written). (The form as a converted article gives it: tests/corpus/real/passages/dwnc-03.txt.)
    expect(readAll('The main effect of condition was significant [$$F_{(1, 42)} = 17.68, p < 0.05$$], that of week was not [$F_{(1,42)}=2.58$, $p = 0.12$].\n')).toEqual([
      ['F', [1, 42], 17.68, '< 0.05'],
      ['F', [1, 42], 2.58, '= 0.12'],
    ]);
  });

  it('reads df named in words after the value ("degrees of freedom = 8") and a p written before a statistic whose df follow it', () => {
    // chi2(8) = 5.46 gives p = .707 and t(58) = 2.41 gives p = .019 (SciPy 1.10.1 scipy.stats.chi2.sf and 2 *
    // scipy.stats.t.sf, computed when the test was written).
    expect(readAll('The model fitted (chi-square = 5.46, degree of freedom = 8, P = 0.71).\n')).toEqual([['chi2', [8], 5.46, '= 0.71']]);
    expect(readAll('Scores differed (t = 2.41, degrees of freedom = 58, p = .019).\n')).toEqual([['t', [58], 2.41, '= .019']]);
    expect(readAll('The model fitted (P = 0.71, chi square = 5.46, df = 8).\n')).toEqual([['chi2', [8], 5.46, '= 0.71']]);
    // (Without a p before or after, a statistic whose df follow it is not read as a result: nothing ties it to a test.)
    expect(readAll('The model fitted (chi square = 5.46, df = 8).\n')).toEqual([]);
  });

  it('reads a correlation whose interval, or a statistic whose effect size, stands between it and its p ("r = .32 [.19, .44], p < .001")', () => {
    for (const interval of ['[0.19, 0.44]', '(0.19, 0.44)', ', 95% CI 0.19–0.44', ', 95% CI [0.19, 0.44]']) {
      expect(readAll(`Anxiety and stress were correlated (r = 0.32 ${interval}, p < .001).\n`), interval).toEqual([['r', [], 0.32, '< .001']]);
    }
    // (A citation's number in brackets is no interval: nothing ties the p to the r.)
    expect(readAll('Anxiety and stress were correlated, r = 0.32 [12], p < .001.\n')).toEqual([]);
    // Nor does an effect size keep a p from a statistic printed without df ("t = 2.10, d = 0.77, p = .045"); a value
    // of something else between them does.
    expect(readAll('Groups differed (t = 2.10, d = 0.77, p = .045).\n')).toEqual([['t', [], 2.1, '= .045']]);
    expect(readAll('Groups differed (t = 2.10, MSE = 2.1, d = 0.77, p = .045).\n')).toEqual([]);
  });

  it('reads an F and its p whose symbols a PDF font lost ("(1, 217) = 4.53, = .035") in a text that lost its symbols again and again', () => {
    // The damage as an article's PDF text gives it (tests/corpus/real/passages/dwjb-01.txt, CC BY): the means, SDs, F and
    // p lost their italic letters; the numbers here are made up. (F(1, 217) = 4.53 gives p = .034 and F(1, 217) = 6.39
    // gives p = .012: SciPy 1.10.1 scipy.stats.f.sf, computed when the test was written.)
    const damaged =
      'Participants rated the adaptive agent ( = 4.58, = 0.13) as more adaptable than the consistent one ( = 4.01, = 0.13), (1, 217) = 4.53, = .034. The complimentary agent ( = 4.97, = 0.11) was rated warmer, (1, 217) = 6.39, = .012.\n';
    expect(readAll(damaged)).toEqual([
      ['F', [1, 217], 4.53, '= .034'],
      ['F', [1, 217], 6.39, '= .012'],
    ]);
    // (Without that damage elsewhere, two numbers in brackets and a value are no F: a point's coordinates, a range.)
    expect(readAll('The target appeared at (1, 217) = 4.53 pixels from the centre.\n')).toEqual([]);
  });

  it('reads a result and its p across a manuscript\'s margin line number that a PDF\'s text ran into it ("F(9,270)=27.36, 324 p=.193")', () => {
    // The damage as a preprint's PDF text gives it (tests/corpus/real/passages/dwqc-01.txt, CC BY): the line numbers
    // stand inside the text, a line's width apart; the words and numbers here are made up. (F(9, 270) = 1.42 gives
    // p = .179: SciPy 1.10.1 scipy.stats.f.sf(1.42, 9, 270), computed when the test was written.)
    const lines = Array.from({ length: 12 }, (_, index) => `the animals were tested on the maze with the goal arms baited in turn and the choice ${300 + index}`).join(' ');
    expect(readAll(`${lines} compared across bins, ANOVA: F(9,270)=1.42, 312 p=.179; and the rest 313 of the text.\n`)).toEqual([['F', [9, 270], 1.42, '= .179']]);
    // (Numbers that do not count up a line apart are no line numbers: the p stays unread rather than guessed.)
    expect(readAll('The effect held, F(9,270)=1.42, 312 p=.179, in all.\n')).toEqual([['F', [9, 270], 1.42, null]]);
  });

  it('reads a chi-square whose df are a LaTeX subscript left in web text ("\\(\\chi _2^2\\) = 7.2", "\\chi^{2}_{1}"), two in a sentence', () => {
    // chi2(2) = 7.2 gives p = .027 and chi2(1) = 4.10 gives p = .043 (SciPy 1.10.1 scipy.stats.chi2.sf, computed when the test was written).
    // (The first sentence as a journal's figure page gives it: tests/corpus/real/passages/dwfk-01.txt.)
    const text =
      'Strikes differed (significant interaction between location and treatment (zero-inflated GLMM): \\(\\chi _2^2\\) = 7.2, P = 0.028). ' +
      'Bags differed (\\(\\chi^{2}_{1}\\) = 4.10, p = .043) and so did farms, $\\chi_{(2)}^2 = 7.2$, $p = .027$.\n';
    expect(readAll(text)).toEqual([
      ['chi2', [2], 7.2, '= 0.028'],
      ['chi2', [1], 4.1, '= .043'],
      ['chi2', [2], 7.2, '= .027'],
    ]);
  });

  it('reads "X(1) = 4.28, p = 0.039", a chi-square that lost its superscript, only in a document that names the chi-square and with its p', () => {
    // Row text as a journal's table page gives it (tests/corpus/real/passages/dwbf-01.txt, CC BY 4.0); chi2(1) = 4.28
    // gives p = .0386 (SciPy 1.10.1 scipy.stats.chi2.sf(4.28, 1), computed when the test was written).
    const row = 'Younger children—otitis media with effusion 40 (64.5%) 24 (45.3%) OR = 2.20 (1.04, 4.65), X(1) = 4.28, p = 0.039a\n';
    expect(readAll(`${row}Comparisons were made with chi-squared tests.\n`)).toEqual([['chi2', [1], 4.28, '= 0.039']]);
    // Without a word for the chi-square in the document, or without a p after it, an X is a variable.
    expect(readAll(row)).toEqual([]);
    expect(readAll('Chi-squared tests were used. At baseline X(1) = 4.28 and later X(2) = 5.10.\n')).toEqual([]);
  });

  it('reads math-italic letters a PDF\'s text gives ("𝜌 = −0.617, 𝑝 < 0.001") and a partial eta squared whose subscript a line break set apart ("𝜂2 \\n𝑝= .013")', () => {
    // Sentences as a CC BY 4.0 paper's PDF text gives them (tests/corpus/real/passages/dwga-02.txt and dwgb-01.txt).
    const text = 'Hint use was negatively correlated with posttest scores (𝜌 = −0.617, 𝑝 < 0.001) in the 277 students.\nThere was no effect of avatar, 𝐹 (1, 23) = 0.311, \n𝑝 = .583, 𝜂2 \n𝑝= .013.\n';
    const statistics = scanTextJson(text).statistics;
    expect(statistics.map((statistic) => [statistic.kind, statistic.value, statistic.p?.comparator, statistic.p?.value])).toEqual([
      ['r', -0.617, '<', 0.001],
      ['F', 0.311, '=', 0.583],
    ]);
    expect(statistics[1]!.effects.map((effect) => [effect.kind, effect.value])).toEqual([['partial-eta-squared', 0.013]]);
  });

  it('reads a χ² whose subscript df and superscript 2 a copy ran onto the symbol ("χ32=9.96", "χ23 = 9.96"), only with its p', () => {
    // chi2(3) = 9.96 gives p = .019 and chi2(2) = 7.81 gives p = .020 (SciPy 1.10.1 scipy.stats.chi2.sf, computed when the test was written).
    expect(readAll('Use differed by age (χ32=9.96, P=.02) and by sex (χ23 = 9.96, p = .02) and site (χ22 = 7.81, p = .020).\n')).toEqual([
      ['chi2', [3], 9.96, '= .02'],
      ['chi2', [3], 9.96, '= .02'],
      ['chi2', [2], 7.81, '= .020'],
    ]);
    // "χ212" reads as df 12 or df 21 (which order the copy kept cannot be told), and without a p "χ23" may carry a footnote.
    expect(readAll('Use differed (χ212 = 21.0, p = .05); the index was χ23 = 9.96 overall.\n')).toEqual([]);
  });

  it('reads a p after group means set in brackets and an abbreviation\'s point ("primary [6.3 ± 1.0] vs. associative [11.1 ± 2.2], p=0.0033")', () => {
    // A results sentence of a CC BY paper (tests/corpus/real/passages/dwlb-01.txt); F(1, 40) = 9.768 gives p = .0033
    // (SciPy 1.10.1 scipy.stats.f.sf(9.768, 1, 40) = 0.00330, computed when the test was written).
    expect(readAll('Errors were fewer (F(1,40) = 9.768, primary [6.3 ± 1.0] vs. associative [11.1 ± 2.2], p=0.0033).\n')).toEqual([['F', [1, 40], 9.768, '= 0.0033']]);
    // A full stop still ends the search: the next sentence's p is not this test's.
    expect(readAll('Errors were fewer, F(1,40) = 9.768. Accuracy was higher, p = 0.0033.\n')).toEqual([['F', [1, 40], 9.768, null]]);
  });

  it('reads an F typed in small letters ("f(2,11)=23.5: p=0.008") only with two df in brackets and its p', () => {
    // A figure legend of a CC BY paper (tests/corpus/real/passages/dwja-02.txt); F(2, 11) = 23.5 gives p = .0001
    // (SciPy 1.10.1 scipy.stats.f.sf(23.5, 2, 11) = 0.000107, computed when the test was written), far from the
    // printed .008, so the reading is flagged, as it should be.
    expect(readAll('Decoding improved over sessions (f(2,11)=23.5: p=0.008).\n')).toEqual([['F', [2, 11], 23.5, '= 0.008']]);
    // A function's value, or Cohen's f, is no test.
    expect(readAll('We define f(2,11) = 23.5 as the score. The effect size f = 0.25 was assumed.\n')).toEqual([]);
  });

  it('reads an effect size in scientific notation ("ηp2 = 2⋅10–3"), never as 2', () => {
    // A results sentence of a CC BY paper (tests/corpus/real/passages/dwlf-03.txt); F(2, 4038) = 3.43 gives p = .033
    // (SciPy 1.10.1 scipy.stats.f.sf(3.43, 2, 4038) = 0.0325, computed when the test was written).
    const statistics = scanTextJson('Load mattered, F(2,4038)=3.43, p=0.033, ηp2 = 2⋅10–3.\n').statistics;
    expect(statistics.map((statistic) => [statistic.value, statistic.effects.map((effect) => [effect.kind, effect.value])])).toEqual([[3.43, [['partial-eta-squared', 0.002]]]]);
    expect(statistics[0]!.findings.filter((finding) => finding.severity === 'fail')).toEqual([]);
  });

  it('reads a p in scientific notation with a space before its "E" ("p=5.4 E-5"), never as p = 5.4', () => {
    // A figure legend's sentence (tests/corpus/real/passages/dwja-09.txt, CC BY 4.0); F(1, 27) = 22.9 gives p = 5.4e-5
    // (SciPy 1.10.1 scipy.stats.f.sf(22.9, 1, 27) = 5.37e-5, computed when the test was written).
    expect(readAll('Licking fell after the lesion (F(1,27) = 22.9, p=5.4 E-5).\n')).toEqual([['F', [1, 27], 22.9, '= 5.4e-5']]);
  });

  it('reads a p in scientific notation whose superscript a copy set apart ("4.2 × 10 −5", "4.2 × 10 − 5", "p < 10 −4"), never as p = 4.2', () => {
    // F(2, 57) = 12.10 gives p = 4.17e-5 (SciPy 1.10.1 scipy.stats.f.sf(12.10, 2, 57), computed when the test was written).
    const text = 'Groups differed, F(2, 57) = 12.10, p = 4.2 × 10 −5. They did again, F(2, 57) = 12.10, p = 4.2 × 10 − 5. And again, F(2, 57) = 12.10, p < 10 −4.\n';
    const statistics = scanTextJson(text).statistics;
    expect(statistics.map((statistic) => [statistic.p?.comparator, statistic.p?.value])).toEqual([
      ['=', 0.000042],
      ['=', 0.000042],
      ['<', 0.0001],
    ]);
    expect(statistics.flatMap((statistic) => statistic.findings.filter((finding) => finding.severity === 'fail'))).toEqual([]);
    // The same in a table's p cells.
    const table = scanTextJson('Table 2. ANOVA of the scores\nEffect\tF\tdf\tp\nGroup\t12.10\t2, 57\t4.2 × 10 −5\nTime\t12.10\t2, 57\t4.2 × 10 − 5\n\nThe next section.\n').statistics;
    expect(table.map((statistic) => [statistic.df, statistic.p?.value])).toEqual([
      [[2, 57], 0.000042],
      [[2, 57], 0.000042],
    ]);
  });
});

describe('a symbol font that lost its minus, decimal point and brackets, from the command line', () => {
  it('reads "t(40) ¼ \uFFFD2:60, p ¼ :013" and "Fð1; 52Þ ¼ 6:30, p ¼ :015" in a text that shows the damage, and flags a p the F cannot give', () => {
    // t(40) = -2.60 gives p = .0130 and F(1, 52) = 6.30 gives p = .0152 (SciPy 1.10.1 2 * scipy.stats.t.sf(2.60, 40)
    // and scipy.stats.f.sf(6.30, 1, 52), computed when the test was written). The layout follows a corpus passage
    // (dxbb-01: "r ¼ \uFFFD0:627, p ¼ :000"); the numbers are invented.
    const text = (p: string): string => `Scores fell after the break, t(40) ¼ \uFFFD2:60, p ¼ :013, and the cue mattered, Fð1; 52Þ ¼ 6:30, p ¼ ${p}.\n`;
    const right = scanTextJson(text(':015')).statistics;
    expect(right.map((statistic) => [statistic.kind, statistic.df, statistic.value])).toEqual([
      ['t', [40], -2.6],
      ['F', [1, 52], 6.3],
    ]);
    expect(right.flatMap((statistic) => statistic.findings.filter((finding) => finding.severity === 'fail'))).toEqual([]);
    const wrong = scanTextJson(text(':15')).statistics;
    expect(wrong.filter((statistic) => statistic.findings.some((finding) => finding.rule === 'p-value-mismatch')).map((statistic) => statistic.kind)).toEqual(['F']);
  });
  it('leaves a lone "¼" and quarters alone', () => {
    expect(scanTextJson('A quarter ¼ of the sample waited 3¼ hours; t ¼ \uFFFD2:60 once.\n').statistics).toEqual([]);
  });
});

describe('an OCR "l" or "I" for a 1 inside a df, from the command line', () => {
  it('reads "t(l8)" as t(18) and "F(2, l20)" as F(2, 120), and flags a p the F cannot give', () => {
    // t(18) = 2.31 gives p = .0330 and F(2, 120) = 4.40 gives p = .0143 (SciPy 1.10.1 2 * scipy.stats.t.sf(2.31, 18)
    // and scipy.stats.f.sf(4.40, 2, 120), computed when the test was written); invented numbers.
    const text = (p: string): string => `Recall improved, t(l8) = 2.31, p = .033, and so did speed, F(2, l20) = 4.40, p = ${p}.\n`;
    const right = scanTextJson(text('.014')).statistics;
    expect(right.map((statistic) => [statistic.kind, statistic.df, statistic.value])).toEqual([
      ['t', [18], 2.31],
      ['F', [2, 120], 4.4],
    ]);
    expect(right.flatMap((statistic) => statistic.findings.filter((finding) => finding.rule === 'p-value-mismatch'))).toEqual([]);
    const wrong = scanTextJson(text('.14')).statistics;
    expect(wrong.filter((statistic) => statistic.findings.some((finding) => finding.rule === 'p-value-mismatch')).map((statistic) => statistic.kind)).toEqual(['F']);
  });
});

describe('a result written with colons for its signs, from the command line', () => {
  it('reads "(χ2: 4.21, df: 1, p: 0.04)" and flags a p the statistic cannot give; leaves "Figure 2: 4 groups" alone', () => {
    // χ2(1) = 4.21 gives p = .0402 (SciPy 1.10.1 scipy.stats.chi2.sf(4.21, 1), computed when the test was written);
    // invented numbers. Colons for signs: common practice in some theses and journals' house styles.
    const text = (p: string): string => `Women chose the cue more often (χ2: 4.21, df: 1, p: ${p}). Figure 2: 4 groups, p: 0.5 in all.\n`;
    const right = scanTextJson(text('0.04')).statistics;
    expect(right.map((statistic) => [statistic.kind, statistic.df, statistic.value, statistic.p?.text])).toEqual([['chi2', [1], 4.21, '0.04']]);
    expect(right[0]!.findings.filter((finding) => finding.rule === 'p-value-mismatch')).toEqual([]);
    const wrong = scanTextJson(text('0.4')).statistics;
    expect(wrong[0]!.findings.map((finding) => finding.rule)).toContain('p-value-mismatch');
  });
});
