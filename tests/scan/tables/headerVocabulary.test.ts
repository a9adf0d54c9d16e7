/**
 * Header words of results tables in the spellings and languages statistics
 * programs and journals print them, each table rendered the ways copies
 * hand a table over (pipes, tabs, single spaces, aligned columns, one cell
 * per line). The words are common practice, from memory of published
 * tables and program output (English, Spanish, Portuguese, French, German);
 * the numbers are invented and consistent: F(2, 57) = 5.10 gives
 * p = .0091, t(58) = 2.41 gives p = .019, χ²(2) = 9.35 gives p = .0093
 * (SciPy 1.10.1, scipy.stats f.sf, t.sf and chi2.sf, computed when the test
 * was written).
 */
import { describe, expect, it } from 'vitest';
import { plainTextDocument } from '../../../src/documents/text.js';
import { scanDocument } from '../../../src/scan/scanDocument.js';

type Rendering = 'pipe' | 'tab' | 'crushed' | 'aligned' | 'cell-per-line';
const RENDERINGS: Rendering[] = ['pipe', 'tab', 'crushed', 'aligned', 'cell-per-line'];

function render(rows: string[][], rendering: Rendering): string {
  const line = (cells: string[]): string => {
    if (rendering === 'pipe') return `| ${cells.join(' | ')} |`;
    if (rendering === 'tab') return cells.join('\t');
    if (rendering === 'crushed') return cells.filter((cell) => cell !== '').join(' ');
    if (rendering === 'aligned') return cells.map((cell) => cell.padEnd(26)).join('').trimEnd();
    return cells.map((cell) => (cell === '' ? ' ' : cell)).join('\n\n');
  };
  const [header, ...body] = rows.map(line);
  const separator = rendering === 'pipe' ? [`|${rows[0]!.map(() => '---').join('|')}|`] : [];
  return [header!, ...separator, ...body].join(rendering === 'cell-per-line' ? '\n\n' : '\n');
}

function readAll(caption: string, rows: string[][], rendering: Rendering): string[] {
  const text = `${caption}\n\n${render(rows, rendering)}\n`;
  return scanDocument(plainTextDocument('vocabulary.txt', 'text', text)).results.map(
    (result) => `${result.kind}(${result.df.map((df) => df.text).join(', ')}) = ${result.value?.text} p ${result.p?.comparator ?? ''} ${result.p?.value.text ?? ''}`,
  );
}

/** An ANOVA table: header cells in the order [source, df, SS, MS, F, p] are placed by `order`. */
function anova(header: [string, string, string, string, string, string], errorLabel = 'Error'): string[][] {
  return [header, ['Group', '2', '40.20', '20.10', '5.10', '.009'], [errorLabel, '57', '224.58', '3.94', '', '']];
}

describe('ANOVA tables with the column names programs and journals print', () => {
  const tables: [string, string[][]][] = [
    ['program output with "Pr > F"', anova(['Source', 'DF', 'Sum of Squares', 'Mean Square', 'F Value', 'Pr > F'])],
    ['program output with "Partial SS" and "Prob>F"', anova(['Source', 'df', 'Partial SS', 'MS', 'F', 'Prob>F'])],
    ['"SOV" and "F cal"', anova(['SOV', 'DF', 'SS', 'MS', 'F cal', 'P'])],
    ['Spanish "F.V." and "CM"', anova(['F.V.', 'gl', 'SC', 'CM', 'F', 'p-valor'], 'Error experimental')],
    ['Portuguese "FV", "SQ", "QM" and "Resíduo"', anova(['FV', 'GL', 'SQ', 'QM', 'F calculado', 'Valor-p'], 'Resíduo')],
    ['French "Somme des carrés" and "Résidus"', anova(['Source', 'ddl', 'Somme des carrés', 'Carré moyen', 'F', 'p'], 'Résidus')],
    ['German "Quadratsumme" and "Fehler"', anova(['Quelle', 'df', 'Quadratsumme', 'Mittel der Quadrate', 'F', 'Sig.'], 'Fehler')],
    ['a p with a footnote dagger', anova(['Source', 'df', 'SS', 'MS', 'F', 'p†'])],
    ['"Significance level"', anova(['Variable', 'df', 'SS', 'MS', 'F', 'Significance level'])],
  ];
  for (const [name, rows] of tables) {
    it.each(RENDERINGS)(`${name}, %s`, (rendering) => {
      expect(readAll('Table 3. Analysis of variance', rows, rendering)).toEqual(['F(2, 57) = 5.10 p = .009']);
    });
  }
});

describe('t, chi-square and correlation tables with the column names programs print', () => {
  it.each(RENDERINGS)('chi-square output with "Asymp. Sig. (2-sided)", %s', (rendering) => {
    const rows = [
      ['Test', 'Value', 'df', 'Asymp. Sig. (2-sided)'],
      ['Pearson Chi-Square', '9.35', '2', '.009'],
    ];
    // "Value" names no column of ours; the row label names the test.
    const results = readAll('Table 4. Chi-square tests', rows, rendering);
    expect(results.every((result) => !result.startsWith('F'))).toBe(true);
  });

  it.each(RENDERINGS)('a chi-square column named "Chi-square value" with "g.l.", %s', (rendering) => {
    const rows = [
      ['Variable', 'Chi-square value', 'g.l.', 'p'],
      ['Sex', '9.35', '2', '.009'],
    ];
    expect(readAll('Table 4. Associations', rows, rendering)).toEqual(['chi2(2) = 9.35 p = .009']);
  });

  it.each(RENDERINGS)('a t column named "t Stat" with "Pr > |t|", %s', (rendering) => {
    const rows = [
      ['Outcome', 't Stat', 'df', 'Pr > |t|'],
      ['Recall', '2.41', '58', '.019'],
    ];
    expect(readAll('Table 5. Group differences', rows, rendering)).toEqual(['t(58) = 2.41 p = .019']);
  });

  it.each(RENDERINGS)('a "Correlation coefficient" column with "Pb" (P and a footnote letter), %s', (rendering) => {
    // r(58) = .30 gives p = .0199 (SciPy 1.10.1, via t = r√(df/(1−r²)), computed when the test was written).
    const rows = [
      ['Pair', 'Correlation coefficient', 'df', 'Pb'],
      ['Sleep and mood', '.30', '58', '.020'],
    ];
    expect(readAll('Table 6. Correlations', rows, rendering)).toEqual(['r(58) = .30 p = .020']);
  });
});
