/**
 * Common results-table shapes (common practice: how journals and statistics
 * programs lay out ANOVA, t-test, chi-square and correlation tables), each
 * rendered the five ways copies hand a table over (pipes, tabs, single
 * spaces, aligned columns, one cell per line), with and without a
 * "Table 3" title above it. Every table must give exactly the tests it
 * prints, with their df, and nothing else.
 *
 * The numbers are invented and consistent (SciPy 1.10.1, scipy.stats f.sf,
 * t.sf and chi2.sf, computed when the test was written): F(2, 57) = 5.10
 * gives p = .0091, F(1, 57) = 3.05 gives .086, F(2, 57) = 3.81 gives .028,
 * F(1.62, 46.98) = 6.02 gives .0075, t(58) = 2.41 gives .019, t(58) = 0.73
 * gives .468, t(58) = 2.25 gives .028, t(58) = 0.59 gives .557, χ²(1) = 2.40 gives .121, χ²(1) = 2.22
 * gives .136, F(2, 58) = 6.02 gives .0042, F(1.62, 46.98) = 6.02 gives .0076, F(1.70,
 * 49.30) = 6.02 gives .0067, F(1, 29) = 6.02 gives .020, F(2, 40) = 3.50 gives .040, F(2, 40) = 8.57 gives .0008, χ²(1) = 2.78 gives .096, χ²(2) = 1.53
 * gives .465, r(58) = .30 gives .020, r(58) = −.12 gives .361.
 */
import { describe, expect, it } from 'vitest';
import { plainTextDocument } from '../../../src/documents/text.js';
import { scanDocument } from '../../../src/scan/scanDocument.js';
import { WITHIN_SUBJECTS_HEADER, WITHIN_SUBJECTS_ROWS, WITHIN_SUBJECTS_TESTS } from './programOutput.js';

type Rendering = 'pipe' | 'tab' | 'crushed' | 'aligned' | 'cell-per-line';
const RENDERINGS: Rendering[] = ['pipe', 'tab', 'crushed', 'aligned', 'cell-per-line'];

function renderRow(cells: string[], rendering: Rendering): string {
  if (rendering === 'pipe') return `| ${cells.join(' | ')} |`;
  if (rendering === 'tab') return cells.join('\t');
  if (rendering === 'crushed') return cells.filter((cell) => cell !== '').join(' ');
  if (rendering === 'aligned') return cells.map((cell, index) => cell.padEnd(index === 0 ? 44 : 16)).join('').trimEnd();
  return cells.map((cell) => (cell === '' ? ' ' : cell)).join('\n\n');
}

function renderTable(header: string[], rows: string[][], rendering: Rendering): string {
  const separator = rendering === 'pipe' ? [`|${header.map(() => '---').join('|')}|`] : [];
  const lines = [renderRow(header, rendering), ...separator, ...rows.map((row) => renderRow(row, rendering))];
  return lines.join(rendering === 'cell-per-line' ? '\n\n' : '\n');
}

function testsRead(text: string): string[] {
  return scanDocument(plainTextDocument('table.txt', 'text', text)).results.map((result) => `${result.kind}(${result.df.map((df) => df.text).join(', ')}) = ${result.value?.text}`);
}

interface Shape {
  header: string[];
  rows: string[][];
  tests: string[];
  /** Renderings in which the shape is read; all five when not given. */
  renderings?: Rendering[];
}

const SHAPES: Record<string, Shape> = {
  'one-way ANOVA as a program prints it (Between Groups, Within Groups, Total)': {
    header: ['', 'Sum of Squares', 'df', 'Mean Square', 'F', 'Sig.'],
    rows: [
      ['Between Groups', '40.20', '2', '20.10', '5.10', '.009'],
      ['Within Groups', '224.58', '57', '3.94', '', ''],
      ['Total', '264.78', '59', '', '', ''],
    ],
    tests: ['F(2, 57) = 5.10'],
  },
  'two-way ANOVA with an effect df column named "df" after "Effect"': {
    header: ['Effect', 'df', 'F', 'p', 'ηp2'],
    rows: [
      ['Group', '2', '5.10', '.009', '.15'],
      ['Time', '1', '3.05', '.086', '.05'],
      ['Group × Time', '2', '3.81', '.028', '.12'],
      ['Error', '57', '', '', ''],
    ],
    tests: ['F(2, 57) = 5.10', 'F(1, 57) = 3.05', 'F(2, 57) = 3.81'],
  },
  'sphericity-corrected rows, the error row named after the effect': {
    header: ['Source', 'SS', 'df', 'MS', 'F', 'p'],
    rows: [
      ['Time (Greenhouse-Geisser)', '30.00', '1.62', '18.52', '6.02', '.007'],
      ['Error(Time) (Greenhouse-Geisser)', '143.20', '46.98', '3.05', '', ''],
    ],
    tests: ['F(1.62, 46.98) = 6.02'],
  },
  't tests with "M (SD)" per group and Cohen\'s d after p': {
    header: ['Variable', 'Control M (SD)', 'Training M (SD)', 't', 'df', 'p', 'd'],
    rows: [
      ['Recall', '12.1 (3.2)', '14.3 (3.9)', '2.41', '58', '.019', '0.62'],
      ['Recognition', '20.2 (4.1)', '21.0 (4.4)', '0.73', '58', '.468', '0.19'],
    ],
    tests: ['t(58) = 2.41', 't(58) = 0.73'],
  },
  'chi-square tests with counts per group and a df column': {
    header: ['Characteristic', 'Control', 'Training', 'χ2', 'df', 'p'],
    rows: [
      ['Female', '18 (60.0)', '12 (40.0)', '2.40', '1', '.121'],
      ['Education', '10/12/8', '6/14/10', '1.53', '2', '.465'],
    ],
    tests: ['chi2(1) = 2.40', 'chi2(2) = 1.53'],
  },
  'chi-square with its df in the cell, under "χ2 (df)"': {
    header: ['Characteristic', 'Control n (%)', 'Training n (%)', 'χ2 (df)', 'p'],
    rows: [
      ['Female', '18 (60.0)', '12 (40.0)', '2.40 (1)', '.121'],
      ['Smoker', '8 (26.7)', '3 (10.0)', '2.78 (1)', '.096'],
    ],
    tests: ['chi2(1) = 2.40', 'chi2(1) = 2.78'],
  },
  'results written in a cell, their p in a column of its own': {
    header: ['Outcome', 'Test', 'p'],
    rows: [
      ['Recall', 't = 2.41, df = 58', '.019'],
      ['Mood', 'χ2 = 2.40, df = 1', '.121'],
    ],
    tests: ['t(58) = 2.41', 'chi2(1) = 2.40'],
    // Crushed, aligned or one cell per line, a header that names only p ("Outcome Test p") is not told from prose.
    renderings: ['pipe', 'tab'],
  },
  'correlations written in a cell after their p': {
    header: ['Factor', 'p', 'Effect size'],
    rows: [
      ['Age', '.020', 'r = .30'],
      ['BMI', '.361', 'rs = −.12'],
    ],
    tests: ['r() = .30', 'r() = -.12'],
    renderings: ['pipe', 'tab', 'cell-per-line'],
  },
  // Common practice: a df column holding both df of each F, written with a comma, semicolon or slash, or in brackets.
  ...Object.fromEntries(
    ['2, 57', '2; 57', '2/57', '2 / 57', '(2, 57)', '[2, 57]', '(2/57)'].map((written) => [
      `F tests with both df in one cell, "${written}"`,
      {
        header: ['Measure', 'df', 'F', 'p'],
        rows: [
          ['Anxiety', written, '5.10', '.009'],
          ['Mood', written.replace('2', '1'), '3.05', '.086'],
        ],
        tests: ['F(2, 57) = 5.10', 'F(1, 57) = 3.05'],
      } satisfies Shape,
    ]),
  ),
  't tests with "M ± SD" cells and the df in the t header': {
    header: ['Variable', 'Men', 'Women', 't(58)', 'p'],
    rows: [
      ['Anxiety', '12.3 ± 4.1', '14.8 ± 4.5', '2.25', '.028'],
      ['Stress', '20.1 ± 6.0', '21.0 ± 5.8', '0.59', '.557'],
    ],
    tests: ['t(58) = 2.25', 't(58) = 0.59'],
  },
  'correlations with a column of their 95% CI': {
    header: ['Predictor', 'r', '95% CI', 'p', 'n'],
    rows: [
      ['Age', '.30', '[.05, .52]', '.020', '60'],
      ['BMI', '−.12', '[−.36, .14]', '.361', '60'],
    ],
    tests: ['r(58) = .30', 'r(58) = -.12'],
    // Aligned columns: a bracket after a wide gap is still joined to the value before it (not read, reported unread).
    renderings: ['pipe', 'tab', 'crushed', 'cell-per-line'],
  },
  'chi-square tests with "df=1" after the symbol in the header': {
    header: ['Variable', 'Intervention n (%)', 'Control n (%)', 'χ2 df=1', 'p'],
    rows: [
      ['Female', '18 (60.0)', '12 (40.0)', '2.40', '.121'],
      ['Smoker', '5 (16.7)', '10 (33.3)', '2.22', '.136'],
    ],
    tests: ['chi2(1) = 2.40', 'chi2(1) = 2.22'],
  },
  // Common practice: a statistics program's multivariate tests name the effect once, on the first of its four rows.
  'multivariate tests as a program prints them, the effect named on its first row only': {
    header: ['Effect', '', 'Value', 'F', 'Hypothesis df', 'Error df', 'Sig.', 'Partial Eta Squared'],
    rows: [
      ['Group', "Pillai's Trace", '.149', '3.500b', '2.000', '40.000', '.040', '.149'],
      ['', "Wilks' Lambda", '.851', '3.500b', '2.000', '40.000', '.040', '.149'],
      ['', "Hotelling's Trace", '.175', '3.500b', '2.000', '40.000', '.040', '.149'],
      ['', "Roy's Largest Root", '.175', '3.500b', '2.000', '40.000', '.040', '.149'],
    ],
    tests: ['F(2.000, 40.000) = 3.500', 'F(2.000, 40.000) = 3.500', 'F(2.000, 40.000) = 3.500', 'F(2.000, 40.000) = 3.500'],
    // One cell per line, its empty cells as blank lines: read under a title, not yet without one (nothing is read then).
    renderings: ['pipe', 'tab', 'crushed', 'aligned'],
  },
  'multivariate tests with "df" and "Error df" columns': {
    header: ['Source', 'Wilks lambda', 'F', 'df', 'Error df', 'p'],
    rows: [
      ['Group', '0.85', '3.50', '2', '40', '.040'],
      ['Time', '0.70', '8.57', '2', '40', '.001'],
    ],
    tests: ['F(2, 40) = 3.50', 'F(2, 40) = 8.57'],
  },
  'chi-square tests under groups whose sizes the header gives as "n = 30"': {
    header: ['Variable', 'Group A n = 30', 'Group B n = 30', 'χ2 (1)', 'p'],
    rows: [
      ['Female', '18 (60.0)', '12 (40.0)', '2.40', '.121'],
      ['Smoker', '5 (16.7)', '10 (33.3)', '2.22', '.136'],
    ],
    tests: ['chi2(1) = 2.40', 'chi2(1) = 2.22'],
  },
  // Common practice: a program's within-subjects table prints each effect and its error term once per correction.
  'within-subjects effects as a program prints them, four correction rows for the effect and for its error': {
    header: WITHIN_SUBJECTS_HEADER,
    rows: WITHIN_SUBJECTS_ROWS,
    tests: WITHIN_SUBJECTS_TESTS,
    // One cell per line, its empty cells as blank lines: only some rows are placed (none misread). Aligned: names
    // longer than this file's 16-character columns run into the next; padded copies are read in layoutDamage.test.ts.
    renderings: ['pipe', 'tab', 'crushed'],
  },
  ...Object.fromEntries(
    ['2 and 57', 'df = 2, 57'].map((written) => [
      `F tests with both df in one cell, "${written}"`,
      {
        header: ['Measure', 'df', 'F', 'p'],
        rows: [
          ['Anxiety', written, '5.10', '.009'],
          ['Mood', written.replace('2', '1'), '3.05', '.086'],
        ],
        tests: ['F(2, 57) = 5.10', 'F(1, 57) = 3.05'],
        // Single spaces or padding leave the pair's words among the row's values (read without df, never misread).
        renderings: ['pipe', 'tab', 'cell-per-line'],
      } satisfies Shape,
    ]),
  ),
  'a "df" header over two columns, numerator and denominator (a spanning cell lost in the copy)': {
    header: ['Effect', 'df', '', 'F', 'p'],
    rows: [
      ['Group', '2', '57', '5.10', '.009'],
      ['Time', '1', '57', '3.05', '.086'],
    ],
    tests: ['F(2, 57) = 5.10', 'F(1, 57) = 3.05'],
    renderings: ['pipe', 'tab'],
  },
  'correlations and their p in one column, "r (p)", the only value column': {
    header: ['Variable', 'r (p)'],
    rows: [
      ['Age', '.30 (.020)'],
      ['BMI', '−.12 (.361)'],
    ],
    tests: ['r() = .30', 'r() = -.12'],
    // One cell per line: a header of two names over rows of two cells is not told from prose (nothing is read).
    renderings: ['pipe', 'tab', 'crushed', 'aligned'],
  },
  'F tests and their p in one column, the df in the header, "F(2, 57) (p)"': {
    header: ['Effect', 'F(2, 57) (p)'],
    rows: [
      ['Group', '5.10 (.009)'],
      ['Time', '3.81 (.028)'],
    ],
    tests: ['F(2, 57) = 5.10', 'F(2, 57) = 3.81'],
    renderings: ['pipe', 'tab', 'crushed', 'aligned'],
  },
  't tests with their df in the cell, "t [df]" over "2.41 [58]"': {
    header: ['Measure', 't [df]', 'p'],
    rows: [
      ['Anxiety', '2.41 [58]', '.019'],
      ['Stress', '0.73 [58]', '.468'],
    ],
    tests: ['t(58) = 2.41', 't(58) = 0.73'],
  },
  't tests with their df named in the cell, "2.41 (df = 58)"': {
    header: ['Measure', 't (df)', 'p'],
    rows: [
      ['Anxiety', '2.41 (df = 58)', '.019'],
      ['Stress', '0.73 (df = 58)', '.468'],
    ],
    tests: ['t(58) = 2.41', 't(58) = 0.73'],
    // Single spaces or padding cut "(df = 58)" at its spaces: the row is not laid out (nothing is read).
    renderings: ['pipe', 'tab', 'cell-per-line'],
  },
  'correlations with p and n columns': {
    header: ['Variable', 'r', 'p', 'n'],
    rows: [
      ['Age', '.30', '.020', '60'],
      ['BMI', '−.12', '.361', '60'],
    ],
    tests: ['r(58) = .30', 'r(58) = -.12'],
  },
};

describe('common results-table shapes in five renderings, with and without a title', () => {
  for (const [name, shape] of Object.entries(SHAPES)) {
    for (const titled of [true, false]) {
      it.each(shape.renderings ?? RENDERINGS)(`${name}, ${titled ? 'titled' : 'untitled'}, %s`, (rendering) => {
        const lead = titled ? 'Table 3. Results' : 'The results are shown below.';
        const text = `${lead}\n\n${renderTable(shape.header, shape.rows, rendering)}\n\nNote. Values rounded.\n`;
        expect(testsRead(text)).toEqual(shape.tests);
      });
    }
  }

  it('reads no F with the second df of "2 and 57" taken for its only df (single spaces)', () => {
    const text = ['Table 3. Results', '', 'Effect df F p', 'Group 2 and 57 5.10 .009', 'Time 1 and 57 3.05 .086', ''].join('\n');
    expect(testsRead(text).filter((test) => /^F\(\d+\)/.test(test))).toEqual([]);
  });

  it('reads no correlation from an r written beside another test of its row (its effect size, diva-01)', () => {
    // "U = 349c | .211 | r = 0.18": r = z/√N is the Mann-Whitney test's effect size, not a correlation test.
    const text = ['Table 2. Group differences', '', '| Measure | Test | p | Effect size |', '|---|---|---|---|', '| Recall | U = 349 | .211 | r = 0.18 |', ''].join('\n');
    expect(testsRead(text).filter((test) => test.startsWith('r'))).toEqual([]);
  });

  it('does not read a table one cell per line without a title whose header names fewer columns than its rows print', () => {
    // A header cut off above ("MD" / "t (df=29)" / "Sig.") over rows of seven values: which value is t cannot be told.
    const text = ['MD', 't ( df=29 )', 'Sig.', 'SD', 'SD', 'LSPT', '57.23', '7.35', '61.43', '6.69', '10.34', '3.99', '0.000'].join('\n');
    expect(testsRead(text)).toEqual([]);
  });
});
