/**
 * Tables comparing two groups at baseline, the commonest results table of
 * trials and surveys (common practice, no single source): a row per
 * variable, the groups' counts with percentages or means with SDs, then a
 * chi-square for categorical and a t for continuous variables, in separate
 * columns ("χ2 (df) | t (df) | p", "χ2 | t | df | p") or in one named for
 * both ("χ2/t (df)", "t or χ2 (df)"), a categorical variable's test on its
 * own row or on its first category's. Each layout is rendered the ways
 * copies hand a table over. What is asserted: nothing is read that the
 * table does not print (no chi-square read as a t, no count as a
 * statistic), and at least the share of tables read in full that the
 * scanner reached when this test was written (raise it as it improves).
 *
 * The numbers are invented and consistent (SciPy 1.10.1, computed when the
 * test was written): χ²(1) = 0.56 gives p = .454 and χ²(1) = 3.13 gives
 * .077 (scipy.stats.chi2.sf), χ²(2) = 5.91 gives .052, t(116) = −0.91 gives
 * .365 and t(116) = −1.43 gives .155 (2 * scipy.stats.t.sf).
 */
import { describe, expect, it } from 'vitest';
import { plainTextDocument } from '../../../src/documents/text.js';
import { scanDocument } from '../../../src/scan/scanDocument.js';

type Copy = 'pipes' | 'tabs' | 'crushed' | 'spaced' | 'cells';
const COPIES: Copy[] = ['pipes', 'tabs', 'crushed', 'spaced', 'cells'];

function render(rows: string[][], copy: Copy): string {
  if (copy === 'cells') return rows.map((row) => row.map((cell) => (cell === '' ? ' ' : cell)).join('\n\n')).join('\n\n');
  const line = (row: string[]): string =>
    copy === 'pipes' ? row.join(' | ') : copy === 'tabs' ? row.join('\t') : copy === 'crushed' ? row.filter((cell) => cell !== '').join(' ') : row.map((cell) => cell || ' ').join('    ');
  return rows.map(line).join('\n');
}

function readAs(text: string): string[] {
  return scanDocument(plainTextDocument('table.txt', 'text', text)).results.map((result) => `${result.kind}|${result.value?.value}|${result.df.map((df) => df.value).join(',')}|${result.p?.value.value}`);
}

/** Tables read in full and results read that the table does not print, over every layout and copy. */
function tally(tables: { text: string; printed: string[] }[]): { full: number; misread: string[] } {
  let full = 0;
  const misread: string[] = [];
  for (const { text, printed } of tables) {
    const read = readAs(text);
    if (printed.every((result) => read.includes(result))) full++;
    misread.push(...read.filter((result) => !printed.includes(result)));
  }
  return { full, misread };
}

describe('tables comparing two groups', () => {
  it('one row per variable: separate or shared test columns, five header wordings, four p headings, three group headings', () => {
    const statisticHeaders: [string, string | null][] = [
      ['χ2 (df)', 't (df)'],
      ['χ2/t (df)', null],
      ['t/χ2 (df)', null],
      ['Test statistic (df)', null],
      ['χ2 or t (df)', null],
    ];
    const groupHeaders = [
      ['Intervention (n = 60)', 'Control (n = 58)'],
      ['Intervention', 'Control'],
      ['Group A n (%) / M (SD)', 'Group B n (%) / M (SD)'],
    ];
    const labels = [
      ['Female, n (%)', 'Age (years), mean (SD)', 'Smoker, n (%)', 'BMI, mean ± SD'],
      ['Female', 'Age', 'Smoker', 'BMI'],
    ];
    const data: [string, string, string, 'chi2' | 't', string, string][] = [
      ['', '30 (50.0)', '25 (43.1)', 'chi2', '0.56 (1)', '.454'],
      ['', '44.2 (10.1)', '46.0 (11.3)', 't', '−0.91 (116)', '.365'],
      ['', '12 (20.0)', '20 (34.5)', 'chi2', '3.13 (1)', '.077'],
      ['', '27.1 ± 4.2', '28.3 ± 4.9', 't', '−1.43 (116)', '.155'],
    ];
    const printed = ['chi2|0.56|1|0.454', 't|-0.91|116|0.365', 'chi2|3.13|1|0.077', 't|-1.43|116|0.155'];
    const tables: { text: string; printed: string[] }[] = [];
    for (const [first, second] of statisticHeaders)
      for (const pHeader of ['p', 'P value', 'p-value', 'Sig.'])
        for (const groups of groupHeaders)
          for (const label of labels)
            for (const copy of COPIES.filter((copy) => copy !== 'cells')) {
              const header = ['Characteristic', ...groups, ...(second === null ? [first] : [first, second]), pHeader];
              const body = data.map(([, a, b, kind, value, p], index) =>
                second === null ? [label[index]!, a, b, value, p] : [label[index]!, a, b, kind === 'chi2' ? value : '', kind === 't' ? value : '', p],
              );
              tables.push({ text: `Table 1. Baseline characteristics of the participants\n${render([header, ...body], copy)}\n\nNote. Chi-square tests for categorical and t tests for continuous variables.\n`, printed });
            }
    const { full, misread } = tally(tables);
    expect(tables.length).toBe(480);
    expect(misread).toEqual([]);
    expect(full).toBeGreaterThanOrEqual(376); // (2026-12-05: 376 of 480; 88 before that day's changes)
  });

  it('a categorical variable over category rows, its test on its own row or its first category\'s, df in the cell or a column', () => {
    const tables: { text: string; printed: string[] }[] = [];
    for (const copy of COPIES)
      for (const testRow of ['variable', 'first category'] as const)
        for (const dfIn of ['cell', 'column'] as const)
          for (const columns of ['separate', 'one'] as const)
            for (const p of ['.052', '< .10']) {
              const statisticHeaders = columns === 'one' ? (dfIn === 'cell' ? ['χ2/t (df)'] : ['χ2/t', 'df']) : dfIn === 'cell' ? ['χ2 (df)', 't (df)'] : ['χ2', 't', 'df'];
              const header = ['Variable', 'Intervention (n = 60)', 'Control (n = 58)', ...statisticHeaders, 'p'];
              const test = (kind: 'chi2' | 't', value: string, df: string): string[] => {
                const cells = dfIn === 'cell' ? [`${value} (${df})`] : [value];
                const inColumns = columns === 'one' ? cells : kind === 'chi2' ? [cells[0]!, ''] : ['', cells[0]!];
                return dfIn === 'cell' ? inColumns : [...inColumns, df];
              };
              const pad = (row: string[]): string[] => [...row, ...new Array<string>(Math.max(0, header.length - row.length)).fill('')];
              const categories = [
                ['Primary', '10 (16.7)', '15 (25.9)'],
                ['Secondary', '30 (50.0)', '28 (48.3)'],
                ['Tertiary', '20 (33.3)', '15 (25.9)'],
              ];
              const rows =
                testRow === 'variable'
                  ? [['Education, n (%)', '', '', ...test('chi2', '5.91', '2'), p], ...categories.map(pad)]
                  : [pad(['Education, n (%)']), [...categories[0]!, ...test('chi2', '5.91', '2'), p], ...categories.slice(1).map(pad)];
              rows.push(['Age (years), mean (SD)', '44.2 (10.1)', '46.0 (11.3)', ...test('t', '−0.91', '116'), '.365']);
              tables.push({
                text: `Table 1. Baseline characteristics\n${copy === 'cells' ? '\n' : ''}${render([header, ...rows], copy)}\n\nNote. Chi-square tests and t tests.\n`,
                printed: [`chi2|5.91|2|${p === '.052' ? 0.052 : 0.1}`, 't|-0.91|116|0.365'],
              });
            }
    const { full, misread } = tally(tables);
    expect(tables.length).toBe(80);
    expect(misread).toEqual([]);
    expect(full).toBeGreaterThanOrEqual(60); // (2026-12-05: 60 of 80; 34 before that day's changes)
  });
});
