/**
 * Real table and prose shapes through the built command line, on real corpus
 * passages (tests/corpus/real/passages/<id>.txt; source and licence in
 * tests/corpus/real/labels/<id>.json):
 * - dvyc-01: a crushed two-way ANOVA table whose df stand before each F and
 *   were run onto the cell before ("47.43 (1, 6) 43.7 0.001 (1, 6) 0.0");
 * - divt-06: one cell per line, years as column names, survey questions as
 *   row labels, "χ2 (1)" in the header and "0.07, n.s." under P;
 * - dvyb-10: correlations in an abstract without df, the sample stated once
 *   as "Questionnaires (n=125)".
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { scanDocumentJson, scanTextJson } from './scanDocumentJson.js';

const root = join(__dirname, '..', '..');
const passage = (id: string): string => join(root, 'tests', 'corpus', 'real', 'passages', `${id}.txt`);

const scanJson = scanDocumentJson;

describe('real table shapes from the command line', () => {
  it('reads the F tests of a crushed table with the df printed before each F, and flags none of them', () => {
    const document = scanJson(passage('dvyc-01'));
    const tests = document.statistics.filter((statistic) => statistic.inTable && statistic.kind === 'F' && statistic.df.length === 2);
    expect(tests.length).toBeGreaterThanOrEqual(25);
    expect(tests[0]).toMatchObject({ df: [1, 6], value: 43.7 });
    expect(tests.flatMap((statistic) => statistic.findings).filter((finding) => finding.rule === 'p-value-mismatch')).toEqual([]);
  });

  it('flags a p that the F and its df, printed before it, cannot give', () => {
    // F(1, 6) = 43.7 gives p = 0.00058 (SciPy 1.10.1 scipy.stats.f.sf(43.7, 1, 6), computed when the test was written).
    const directory = mkdtempSync(join(tmpdir(), 'plumbline-real-shapes-'));
    const changed = join(directory, 'anova.txt');
    writeFileSync(changed, readFileSync(passage('dvyc-01'), 'utf8').replace('47.43 (1, 6) 43.7 0.001', '47.43 (1, 6) 43.7 0.061'));
    const flagged = scanJson(changed).statistics.filter((statistic) => statistic.findings.some((finding) => finding.rule === 'p-value-mismatch'));
    expect(flagged.map((statistic) => [statistic.value, statistic.df])).toEqual([[43.7, [1, 6]]]);
  });

  it('reads each survey question\'s chi-square with the df of its header', () => {
    const document = scanJson(passage('divt-06'));
    const tests = document.statistics.filter((statistic) => statistic.kind === 'chi2');
    expect(tests).toHaveLength(9);
    expect(tests.every((statistic) => statistic.df[0] === 1)).toBe(true);
  });

  it('checks correlations without df against the sample the abstract states once', () => {
    const document = scanJson(passage('dvyb-10'));
    const correlations = document.statistics.filter((statistic) => statistic.kind === 'r');
    expect(correlations.length).toBeGreaterThanOrEqual(4);
    expect(correlations.every((statistic) => statistic.df[0] === 123 && statistic.dfFrom === 'study-sample-size')).toBe(true);
  });
});

describe('an HTML table left as markup in a Markdown file, from the command line', () => {
  // Invented example (common practice: Markdown converted from XML keeps tables with spanning cells as HTML).
  const markdown = [
    'Table 2. Effects of training on each outcome.',
    '',
    '<table><thead><tr><th rowspan="2">Measure</th><th colspan="2">Session 1</th><th colspan="2">Session 2</th></tr>',
    '<tr><th>F(1, 40)</th><th>p</th><th>F(1, 38)</th><th>p</th></tr></thead>',
    '<tbody><tr><td>Recall</td><td>5.21</td><td>.028</td><td>0.44</td><td>.511</td></tr>',
    '<tr><td>Recognition</td><td>7.90</td><td>.008</td><td>1.02</td><td>.019</td></tr></tbody></table>',
    '',
  ].join('\n');

  it('reads each cell under its spanning header with the df of its block, and flags the p its F cannot give', () => {
    const directory = mkdtempSync(join(tmpdir(), 'plumbline-html-in-md-'));
    const path = join(directory, 'results.md');
    writeFileSync(path, markdown);
    const statistics = scanJson(path).statistics;
    expect(statistics.map((statistic) => [statistic.value, statistic.df, statistic.p?.value])).toEqual([
      [5.21, [1, 40], 0.028],
      [0.44, [1, 38], 0.511],
      [7.9, [1, 40], 0.008],
      [1.02, [1, 38], 0.019],
    ]);
    // F(1, 38) = 1.02 gives p = 0.319 (SciPy 1.10.1 scipy.stats.f.sf(1.02, 1, 38), computed when the test was written).
    const flagged = statistics.filter((statistic) => statistic.findings.some((finding) => finding.rule === 'p-value-mismatch'));
    expect(flagged.map((statistic) => statistic.value)).toEqual([1.02]);
    // Each result points at its own cell inside the markup.
    const text = readFileSync(path, 'utf8');
    expect(text.slice(flagged[0]!.start, flagged[0]!.end)).toContain('1.02');
  });
});

describe('a t test as a spreadsheet prints it, from the command line', () => {
  // Invented numbers in the layout a spreadsheet's analysis add-in prints (common practice in theses).
  // t(38) = 1.90 gives a two-tailed p of 0.0650 (SciPy 1.10.1: 2 * scipy.stats.t.sf(1.90, 38), computed when the
  // test was written).
  const output = (twoTailed: string): string =>
    [
      't-Test: Two-Sample Assuming Equal Variances',
      '',
      '\tVariable 1\tVariable 2',
      'Mean\t4.2\t3.6',
      'Observations\t20\t20',
      'Hypothesized Mean Difference\t0',
      'df\t38',
      't Stat\t1.90',
      'P(T<=t) one-tail\t0.0326',
      't Critical one-tail\t1.686',
      `P(T<=t) two-tail\t${twoTailed}`,
      't Critical two-tail\t2.024',
      '',
    ].join('\n');

  it('reads t with its df row and the two-tailed p, and flags a two-tailed p that is the one-tailed one', () => {
    const directory = mkdtempSync(join(tmpdir(), 'plumbline-spreadsheet-'));
    const right = join(directory, 'right.txt');
    const wrong = join(directory, 'wrong.txt');
    writeFileSync(right, output('0.0651'));
    writeFileSync(wrong, output('0.0326'));
    const read = scanJson(right).statistics;
    expect(read.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.value])).toEqual([['t', 1.9, [38], 0.0651]]);
    expect(read[0]!.findings.filter((finding) => finding.rule === 'p-value-mismatch')).toEqual([]);
    const flagged = scanJson(wrong).statistics.flatMap((statistic) => statistic.findings);
    expect(flagged.map((finding) => finding.rule)).toEqual(['halved-p']);
  });
});

describe('table vocabulary and caption df from the command line', () => {
  // Invented numbers: F(2, 57) = 5.10 gives p = .0091 (SciPy 1.10.1 scipy.stats.f.sf(5.10, 2, 57), computed when
  // the test was written), so ".009" is consistent and ".09" is not.
  const table = (p: string): string =>
    ['Tabela 2. Análise de variância (graus de liberdade = 2 e 57)', '', 'FV\tSQ\tQM\tF calculado\tValor-p', `Tratamento\t40.20\t20.10\t5.10\t${p}`, ''].join('\n');

  it('reads an F whose df the caption states, under Portuguese column names, and flags a p it cannot give', () => {
    const right = scanTextJson(table('.009')).statistics.filter((statistic) => statistic.inTable);
    expect(right.map((statistic) => [statistic.kind, statistic.df, statistic.value])).toEqual([['F', [2, 57], 5.1]]);
    expect(right[0]!.findings.filter((finding) => finding.rule === 'p-value-mismatch')).toEqual([]);
    const wrong = scanTextJson(table('.09')).statistics.filter((statistic) => statistic.findings.some((finding) => finding.rule === 'p-value-mismatch'));
    expect(wrong.map((statistic) => [statistic.value, statistic.df])).toEqual([[5.1, [2, 57]]]);
  });
});

describe('a table one cell per line without a title, from the command line', () => {
  // Invented numbers: t(58) = 2.41 gives p = .019 (SciPy 1.10.1 scipy.stats.t.sf(2.41, 58) * 2, computed when the
  // test was written), so ".19" is a p the t cannot give.
  const cells = (p: string): string =>
    ['The comparison is shown below.', '', 'Variable', 'Control M (SD)', 'Training M (SD)', 't', 'df', 'p', 'Recall', '12.1 (3.2)', '14.3 (3.9)', '2.41', '58', p, ''].join('\n\n');

  it('reads the t test with its df and flags a p it cannot give', () => {
    const right = scanTextJson(cells('.019')).statistics.filter((statistic) => statistic.inTable);
    expect(right.map((statistic) => [statistic.kind, statistic.df, statistic.value])).toEqual([['t', [58], 2.41]]);
    const wrong = scanTextJson(cells('.19')).statistics.filter((statistic) => statistic.findings.some((finding) => finding.rule === 'p-value-mismatch'));
    expect(wrong.map((statistic) => [statistic.value, statistic.df])).toEqual([[2.41, [58]]]);
  });
});
