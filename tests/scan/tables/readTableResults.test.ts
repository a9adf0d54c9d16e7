import { describe, expect, it } from 'vitest';
import { htmlToDocument } from '../../../src/documents/html.js';
import { jatsToDocument } from '../../../src/documents/jats.js';
import { latexToDocument } from '../../../src/documents/latex.js';
import type { DocumentText } from '../../../src/documents/types.js';
import { findTextTables, readTableResults } from '../../../src/scan/tables/index.js';
import { scanDocument } from '../../../src/scan/scanDocument.js';
import { plainTextDocument } from '../../../src/documents/text.js';
import type { ReportedResult } from '../../../src/scan/types.js';
import { demo, readOk } from '../../documents/helpers.js';

// Every table here is invented; numbers are made to agree (MS = SS/df, F = MS/MSerror) unless a test says otherwise.

/** Results of the tables found in plain text, as the audit will call it. */
function fromText(text: string): ReportedResult[] {
  return readTableResults(text, findTextTables(text));
}

/** Results of a document read by its reader: marked-up tables plus those found in its text. */
function fromDocument(document: DocumentText): ReportedResult[] {
  return readTableResults(document.text, [...document.tables, ...findTextTables(document.text)]);
}

function summary(result: ReportedResult): string {
  const df = result.df.map((d) => d.text).join(', ');
  const p = result.p ? `, p ${result.p.comparator} ${result.p.value.text}` : result.notSignificant ? ', ns' : '';
  const effects = result.effects.map((e) => `, ${e.kind} ${e.comparator} ${e.value.text}`).join('');
  return `${result.tableRow?.rowLabel}: ${result.kind}(${df}) ${result.valueComparator} ${result.value?.text}${p}${effects}`;
}

/** Every offset of a result points at the characters it claims. */
function expectOffsets(text: string, result: ReportedResult): void {
  expect(text.slice(result.start, result.end)).toBe(result.text);
  expect(result.text.startsWith(result.tableRow!.rowLabel.replace(/ \(.*\)$/, '').slice(0, 5))).toBe(true);
  for (const cell of Object.values(result.tableRow!.cells)) expect(text.slice(cell!.start, cell!.end)).toMatch(new RegExp(`${cell!.text.replace('.', '\\.')}$`));
  if (result.p) expect(text.slice(result.p.start, result.p.end)).toContain(result.p.value.text);
  for (const effect of result.effects) expect(text.slice(effect.start, effect.end)).toBe(effect.value.text);
  for (const cell of Object.values(result.tableRow!.errorRow?.cells ?? {})) expect(text.slice(cell!.start, cell!.end)).toBe(cell!.text);
}

const pipeAnova = [
  'Results are in Table 2.',
  '',
  'Table 2. Analysis of variance for recall',
  '| Source | SS | df | MS | F | p | ηp2 |',
  '|---|---|---|---|---|---|---|',
  '| Condition | 12.40 | 2 | 6.20 | 4.21 | .020 | .13 |',
  '| Age (covariate) | 1.20 | 1 | 1.20 | 0.81 | .371 | .01 |',
  '| Error | 83.95 | 57 | 1.47 | | | |',
  '| Total | 97.55 | 60 | | | | |',
].join('\n');

describe('readTableResults: ANOVA summary tables', () => {
  it('turns each effect row of a Markdown table into an F result with the error row df', () => {
    const results = fromText(pipeAnova);
    expect(results.map(summary)).toEqual([
      'Condition: F(2, 57) = 4.21, p = .020, partial-eta-squared = .13',
      'Age (covariate): F(1, 57) = 0.81, p = .371, partial-eta-squared = .01',
    ]);
    const [condition] = results;
    expect(condition!.text).toBe('Condition | 12.40 | 2 | 6.20 | 4.21 | .020 | .13');
    expect(condition!.tableRow).toMatchObject({ tableIndex: 0, caption: 'Table 2. Analysis of variance for recall', rowLabel: 'Condition' });
    expect(condition!.tableRow!.errorRow!.rowLabel).toBe('Error');
    expect(Object.keys(condition!.tableRow!.cells).sort()).toEqual(['df', 'ms', 'p', 'partial-eta-squared', 'ss', 'statistic'].sort());
    expect(condition!.tableRow!.errorRow!.cells.ms!.text).toBe('1.47');
    for (const result of results) expectOffsets(pipeAnova, result);
  });

  it('reads SPSS spellings, skips Error, Total and Corrected Total, keeps Corrected Model and (one error term) Intercept', () => {
    const text = [
      'Tests of Between-Subjects Effects',
      'Source | Type III Sum of Squares | df | Mean Square | F | Sig. | Partial Eta Squared',
      'Corrected Model | 30.000 | 3 | 10.000 | 5.000 | .003 | .136',
      'Intercept | 900.000 | 1 | 900.000 | 450.000 | .000 | .826',
      'Dose | 20.000 | 1 | 20.000 | 10.000 | .002 | .095',
      'Sex | 6.000 | 1 | 6.000 | 3.000 | .087 | .031',
      'Dose * Sex | 4.000 | 1 | 4.000 | 2.000 | .161 | .021',
      'Error | 190.000 | 95 | 2.000 |  |  | ',
      'Total | 1120.000 | 99 |  |  |  | ',
      'Corrected Total | 220.000 | 98 |  |  |  | ',
    ].join('\n');
    const results = fromText(text);
    expect(results.map((r) => r.tableRow!.rowLabel)).toEqual(['Corrected Model', 'Intercept', 'Dose', 'Sex', 'Dose * Sex']);
    expect(results.every((r) => r.df[1]!.text === '95')).toBe(true);
    for (const result of results) expectOffsets(text, result);
  });

  it('reads columns in any order and a subset of them, with "<.001" as p < .001 and "ns"', () => {
    const text = ['| Effect | F | p | partial η² | df |', '|--|--|--|--|--|', '| Load | 18.20 | <.001 | .24 | 1 |', '| Cue | 0.52 | ns | .01 | 1 |', '| Residuals | | | | 58 |'].join('\n');
    const results = fromText(text);
    expect(results.map(summary)).toEqual(['Load: F(1, 58) = 18.20, p < .001, partial-eta-squared = .24', 'Cue: F(1, 58) = 0.52, ns, partial-eta-squared = .01']);
  });

  it('reads separate numerator and denominator df columns', () => {
    const text = ['Effect | df effect | df error | F | p | η²p', 'Time | 2 | 114 | 6.40 | .002 | .10', 'Group | 1 | 57 | 3.10 | .084 | .05'].join('\n');
    expect(fromText(text).map(summary)).toEqual([
      'Time: F(2, 114) = 6.40, p = .002, partial-eta-squared = .10',
      'Group: F(1, 57) = 3.10, p = .084, partial-eta-squared = .05',
    ]);
    const text2 = ['Predictor | df1 | df2 | F value | Pr(>F)', 'Dose | 3 | 76 | 2.95 | .038'].join('\n');
    expect(fromText(text2).map(summary)).toEqual(['Dose: F(3, 76) = 2.95, p = .038']);
  });

  it('reads df from a column header "F(1, 170)" or "F (2, 57)"', () => {
    const text = ['Table 4. Effects on recall', 'Outcome | F(1, 170) | p | ηp2', 'Immediate recall | 5.20 | .024 | .03', 'Delayed recall | 9.80 | .002 | .05'].join('\n');
    expect(fromText(text).map(summary)).toEqual([
      'Immediate recall: F(1, 170) = 5.20, p = .024, partial-eta-squared = .03',
      'Delayed recall: F(1, 170) = 9.80, p = .002, partial-eta-squared = .05',
    ]);
    const spaced = ['Outcome | F (2, 57) | p', 'Recall | 4.21 | .020'].join('\n');
    expect(fromText(spaced).map(summary)).toEqual(['Recall: F(2, 57) = 4.21, p = .020']);
  });

  it('reads df from the row label', () => {
    const text = ['Effect | F | p', 'Sleep effect on recall, F(1, 170) | 5.20 | .024', 'Sleep effect on mood, F(1, 168) | 1.10 | .296'].join('\n');
    expect(fromText(text).map(summary)).toEqual([
      'Sleep effect on recall, F(1, 170): F(1, 170) = 5.20, p = .024',
      'Sleep effect on mood, F(1, 168): F(1, 168) = 1.10, p = .296',
    ]);
  });

  it.each([
    ['Note. df = 1, 170 for all effects.', '1, 170'],
    ['Note. dfs = (2, 57).', '2, 57'],
    ['Note. All tests are F(3, 96).', '3, 96'],
  ])('reads df from a note under the table: %s', (note, df) => {
    const text = ['Table 3', 'Effect | F | p | ηp2', 'Framing | 5.20 | .024 | .03', note].join('\n');
    const [result] = fromText(text);
    expect(result!.df.map((d) => d.text).join(', ')).toBe(df);
  });

  it('takes a row df column plus the error df from a note when the table has no error row', () => {
    const text = ['Source | df | F | p', 'Group | 2 | 3.30 | .041', 'Note. Error df = 117.'].join('\n');
    expect(fromText(text).map(summary)).toEqual(['Group: F(2, 117) = 3.30, p = .041']);
  });

  it('gives each effect of a mixed table the nearest error row below it', () => {
    const text = [
      'Source | SS | df | MS | F | p | ηp2',
      'Between subjects | | | | | |',
      'Group | 871.82 | 1 | 871.82 | 4.83 | .031 | .06',
      'Error (between) | 12815.50 | 71 | 180.50 | | |',
      'Within subjects | | | | | |',
      'Session | 566.27 | 2 | 283.14 | 12.64 | < .001 | .15',
      'Session × Group | 152.77 | 2 | 76.38 | 3.41 | .036 | .05',
      'Error (session) | 3180.80 | 142 | 22.40 | | |',
    ].join('\n');
    const results = fromText(text);
    expect(results.map((r) => [r.tableRow!.rowLabel, r.tableRow!.errorRow!.rowLabel, r.df[1]!.text])).toEqual([
      ['Group', 'Error (between)', '71'],
      ['Session', 'Error (session)', '142'],
      ['Session × Group', 'Error (session)', '142'],
    ]);
    for (const result of results) expectOffsets(text, result);
  });

  it('gives each effect of a repeated-measures table its own error term, and leaves its Intercept (error term not shown) unread', () => {
    const text = [
      'Source | SS | df | MS | F | p',
      'Intercept | 4000.00 | 1 | 4000.00 | 20.00 | < .001',
      'Cue | 40.00 | 1 | 40.00 | 10.00 | .003',
      'Error (cue) | 160.00 | 40 | 4.00 | |',
      'Tone | 18.00 | 2 | 9.00 | 3.00 | .055',
      'Error (tone) | 240.00 | 80 | 3.00 | |',
      'Cue × Tone | 6.00 | 2 | 3.00 | 1.50 | .229',
      'Error (cue × tone) | 160.00 | 80 | 2.00 | |',
    ].join('\n');
    expect(fromText(text).map((r) => `${r.tableRow!.rowLabel} / ${r.tableRow!.errorRow!.rowLabel}`)).toEqual([
      'Cue / Error (cue)',
      'Tone / Error (tone)',
      'Cue × Tone / Error (cue × tone)',
    ]);
  });

  it('reads one-way tables with "Between groups" and "Within groups"', () => {
    const text = ['Source | SS | df | MS | F | p', 'Between groups | 12.40 | 2 | 6.20 | 4.21 | .020', 'Within groups | 83.95 | 57 | 1.47 | |', 'Total | 96.35 | 59 | | |'].join('\n');
    expect(fromText(text).map(summary)).toEqual(['Between groups: F(2, 57) = 4.21, p = .020']);
  });

  it('reads a table with two outcomes side by side as two results per row', () => {
    const text = ['| | | Recall | | Recognition | |', '| Source | df | F | p | F | p |', '| Sleep | 1 | 5.20 | .024 | 0.90 | .344 |', '| Error | 170 | | | | |'].join('\n');
    expect(fromText(text).map(summary)).toEqual(['Sleep (Recall): F(1, 170) = 5.20, p = .024', 'Sleep (Recognition): F(1, 170) = 0.90, p = .344']);
  });
});

describe('readTableResults: tables of t, r and chi-square tests', () => {
  it('reads a table of t tests with Cohen d', () => {
    const text = ['Table 5. Group comparisons', 'Measure | M1 | M2 | t | df | p | d', 'Recall | 12.1 | 10.4 | 2.10 | 58 | .040 | 0.54', 'Mood | 3.2 | 3.1 | 0.40 | 58 | .691 | 0.10'].join('\n');
    const results = fromText(text);
    expect(results.map(summary)).toEqual(['Recall: t(58) = 2.10, p = .040, cohens-d = 0.54', 'Mood: t(58) = 0.40, p = .691, cohens-d = 0.10']);
    for (const result of results) expectOffsets(text, result);
  });

  it('reads correlations with n (df = n - 2) or with df', () => {
    const withN = ['Variable | r | n | p', 'Sleep hours | .29 | 90 | .006', 'Annoyance | -.17 | 90 | .109'].join('\n');
    expect(fromText(withN).map(summary)).toEqual(['Sleep hours: r(88) = .29, p = .006', 'Annoyance: r(88) = -.17, p = .109']);
    const withDf = ['Pair | r | df | p', 'Age and recall | −.30 | 48 | .034'].join('\n');
    expect(fromText(withDf).map(summary)).toEqual(['Age and recall: r(48) = -.30, p = .034']);
  });

  it('reads a chi-square table with N', () => {
    const text = ['Outcome | χ2 | df | p | N', 'Returned | 5.26 | 1 | .022 | 120', 'Recruited a friend | 1.10 | 1 | .294 | 118'].join('\n');
    const results = fromText(text);
    expect(results.map(summary)).toEqual(['Returned: chi2(1) = 5.26, p = .022', 'Recruited a friend: chi2(1) = 1.10, p = .294']);
    expect(results.map((r) => r.sampleSize?.text)).toEqual(['120', '118']);
  });

  it('reads z tests when the table also gives p', () => {
    const text = ['Comparison | z | p', 'Eyes vs. flowers | 2.45 | .014'].join('\n');
    expect(fromText(text).map(summary)).toEqual(['Eyes vs. flowers: z() = 2.45, p = .014']);
  });

  it('leaves rows whose cell holds a full written result to the text scanner', () => {
    const text = ['Comparison | Test | Mean difference', 'Map vs. none | t(62) = 3.58, p < .001 | 1.21'].join('\n');
    expect(fromText(text)).toEqual([]);
    const mixed = ['Measure | t | df | p', 'Recall | t(58) = 2.10 | 58 | .040', 'Mood | 0.40 | 58 | .691'].join('\n');
    expect(fromText(mixed).map(summary)).toEqual(['Mood: t(58) = 0.40, p = .691']);
  });
});

describe('readTableResults: tables that give no results', () => {
  it.each([
    ['descriptive statistics', ['Condition | M | SD | n', 'Nap | 12.4 | 2.1 | 20', 'Rest | 10.9 | 2.4 | 20']],
    ['counts of men (M) and women (F)', ['Site | M | F', 'North | 12 | 15', 'South | 9 | 14']],
    ['a frequency table', ['Score | f | %', '1 | 4 | 10.0', '2 | 12 | 30.0']],
    ['a correlation matrix', ['Variable | 1 | 2 | 3', '1. Recall | — | .32 | .10', '2. Sleep | | — | .21']],
    ['an F column without any df or p', ['Source | F | M', 'Group | 4.21 | 20.3']],
    ['regression weights', ['Predictor | B | SE | β', 'Age | 0.12 | 0.05 | .21', 'Sleep | 0.40 | 0.10 | .35']],
    ['standard scores (z without p)', ['Pupil | Score | z', 'A | 41 | 1.20', 'B | 30 | -0.40']],
  ])('%s', (_name, lines) => {
    expect(fromText(lines.join('\n'))).toEqual([]);
  });
});

describe('readTableResults: statistics printed without df', () => {
  // Common practice: many results tables print F or t with its p and no df anywhere. The value is read as
  // printed (no df, so its p is not recomputed), as running text's "F = 5.60, p = .000" is.
  it('reads a value beside its printed p, with no df', () => {
    const [result, ...rest] = fromText(['Source | F | p | partial eta squared', 'Group | 4.21 | .020 | .12', 'Time | 1.30 | .26 | .02'].join('\n'));
    expect(rest).toHaveLength(1);
    expect(result!.df).toEqual([]);
    expect(result!.value?.text).toBe('4.21');
    expect(result!.p?.value.text).toBe('.020');
    expect(result!.effects.map((effect) => effect.value.text)).toEqual(['.12']);
  });

  it('does not read a value whose p no df can give (an F of 0.91 with p = .001: the columns were misread)', () => {
    expect(fromText(['Source | F | p', 'Group | 0.91 | .001'].join('\n'))).toEqual([]);
  });

  it('does not read a value without df tied only by marks or an effect size', () => {
    expect(fromText(['Source | F | partial eta squared', 'Group | 4.21** | .12', '', 'Note. ** p < .01.'].join('\n'))).toEqual([]);
  });

  it('does not read a value without df from a crushed row whose numbers outnumber the columns', () => {
    const crushed = ['Table 2. Group differences', 'Measure F p', 'Anxiety 12.1 3.2 4.21 .020', 'Stress 11.0 2.9 1.30 .260'].join('\n');
    expect(fromText(crushed).filter((result) => result.df.length === 0)).toEqual([]);
  });
});

describe('readTableResults: tables from document markup and from PDF text', () => {
  const html = `<html><body><p>Recall differed, F(2, 57) = 4.21, p = .020.</p>
<table><caption>Table 1. Analysis of variance for recall</caption>
<thead><tr><th>Source</th><th>SS</th><th>df</th><th>MS</th><th>F</th><th>p</th><th>η<sub>p</sub><sup>2</sup></th></tr></thead>
<tbody><tr><td>Condition</td><td>12.40</td><td>2</td><td>6.20</td><td>4.21</td><td>.020</td><td>.13</td></tr>
<tr><td>Error</td><td>83.95</td><td>57</td><td>1.47</td><td></td><td></td><td></td></tr></tbody>
<tfoot><tr><td colspan="7">Note. Recall in words.</td></tr></tfoot></table></body></html>`;

  it('reads an HTML table from the tables field once, though its rows are in the text too', () => {
    const document = htmlToDocument(html, 'invented.html', 'html');
    expect(document.tables).toHaveLength(1);
    const results = fromDocument(document);
    expect(results.map(summary)).toEqual(['Condition: F(2, 57) = 4.21, p = .020, partial-eta-squared = .13']);
    expect(results[0]!.tableRow!.caption).toBe('Table 1. Analysis of variance for recall');
    expectOffsets(document.text, results[0]!);
  });

  it('reads a JATS table', () => {
    const xml = `<?xml version="1.0"?><article><body><sec><p>See Table 1.</p>
<table-wrap id="t1"><label>Table 1</label><caption><p>Tests of group differences</p></caption>
<table><thead><tr><th>Measure</th><th>t</th><th>df</th><th>p</th></tr></thead>
<tbody><tr><td>Recall</td><td>2.10</td><td>58</td><td>.040</td></tr></tbody></table></table-wrap></sec></body></article>`;
    const outcome = jatsToDocument(xml, 'invented.xml');
    if (!outcome.ok) expect.fail(outcome.error);
    const results = fromDocument(outcome.document);
    expect(results.map(summary)).toEqual(['Recall: t(58) = 2.10, p = .040']);
    expectOffsets(outcome.document.text, results[0]!);
  });

  it('reads a LaTeX tabular', () => {
    const latex = String.raw`\documentclass{article}\begin{document}
\begin{table}\caption{Analysis of variance}
\begin{tabular}{lrrrrr}
Source & SS & df & MS & $F$ & $p$ \\ \hline
Group & 24.60 & 1 & 24.60 & 6.15 & .016 \\
Error & 228.00 & 57 & 4.00 & & \\
\end{tabular}\end{table}
\end{document}`;
    const document = latexToDocument(latex, 'invented.tex');
    const results = fromDocument(document);
    expect(results.map(summary)).toEqual(['Group: F(1, 57) = 6.15, p = .016']);
    expectOffsets(document.text, results[0]!);
  });

  it.each(['docx', 'html', 'xml', 'pdf', 'txt'])('reads the demo mixed-design table from the %s version alike', async (extension) => {
    const document = await readOk(demo(`lantern-reading-fluency.${extension}`));
    const results = fromDocument(document);
    expect(results.map(summary)).toEqual([
      'Group: F(1, 71) = 4.83, p = .031, partial-eta-squared = .06',
      'Session: F(2, 142) = 12.64, p < .001, partial-eta-squared = .15',
      'Session × Group: F(2, 142) = 3.41, p = .036, partial-eta-squared = .05',
    ]);
    for (const result of results) expectOffsets(document.text, result);
  });

  it('reads a crushed PDF-style table with offsets on the right characters', () => {
    const text = 'Table 2. Analysis of variance for recall\nSource SS df MS F p ηp\n2\nCondition 12.40 2 6.20 4.21 .020 .13\nError 83.95 57 1.47\nNote. Recall in words.\n';
    const [result] = fromText(text);
    expect(summary(result!)).toBe('Condition: F(2, 57) = 4.21, p = .020, partial-eta-squared = .13');
    expect(result!.text).toBe('Condition 12.40 2 6.20 4.21 .020 .13');
    expect(text.slice(result!.tableRow!.cells.ms!.start, result!.tableRow!.cells.ms!.end)).toBe('6.20');
    expect(text.slice(result!.p!.start, result!.p!.end)).toBe('.020');
    expectOffsets(text, result!);
  });

  it('reads a whitespace-aligned table', () => {
    const text = ['Table 3', 'Analysis of Variance for Reaction Time', 'Source          SS     df      MS       F      p', 'Cue          24.60      1   24.60    6.15   .016', 'Error       228.00     57    4.00'].join('\n');
    const results = fromText(text);
    expect(results.map(summary)).toEqual(['Cue: F(1, 57) = 6.15, p = .016']);
    expect(results[0]!.tableRow!.caption).toBe('Table 3 Analysis of Variance for Reaction Time');
    expectOffsets(text, results[0]!);
  });

  it('numbers tables in reading order and sorts results by position', () => {
    const text = `${pipeAnova}\n\nTable 3. More\nMeasure | t | df | p\nRecall | 2.10 | 58 | .040\n`;
    const results = fromText(text);
    expect(results.map((r) => r.tableRow!.tableIndex)).toEqual([0, 0, 1]);
    expect(results.map((r) => r.start)).toEqual([...results.map((r) => r.start)].sort((a, b) => a - b));
  });
});

describe('a table with tests of two kinds', () => {
  // The layout of a statistics program's independent-samples table (common practice): Levene's F and its Sig.,
  // then t, df and Sig. (2-tailed). Numbers invented for the layout; the expectations are read by eye.
  const table = [
    'Table 4. Independent samples test',
    '| | F | Sig. | t | df | Sig. (2-tailed) |',
    '|---|---|---|---|---|---|',
    '| Equal variances assumed | 0.84 | .363 | 2.10 | 58 | .040 |',
    '| Equal variances not assumed | | | 2.10 | 55.31 | .041 |',
  ].join('\n');

  it('reads the t tests with their df and p, and an F without df as printed, and says the table was read without df', () => {
    const scan = scanDocument(plainTextDocument('t.txt', 'text', table));
    const tabled = scan.results.filter((result) => result.tableRow);
    expect(tabled.map((result) => [result.kind, result.df.map((df) => df.text).join(','), result.value?.text, result.p?.value.text])).toEqual([
      ['F', '', '0.84', '.363'],
      ['t', '58', '2.10', '.040'],
      ['t', '55.31', '2.10', '.041'],
    ]);
    expect(scan.tablesNotRead.map((unread) => unread.reason)).toEqual(['read-without-df']);
  });

  it("reads Levene's F with df 1 and the pooled t test's df when the table names Levene's test", () => {
    const levene = table.replace('| | F | Sig. |', "| | Levene's F | Sig. |");
    const scan = scanDocument(plainTextDocument('t.txt', 'text', levene.replace('Independent samples test', "Independent samples test with Levene's test")));
    const tabled = scan.results.filter((result) => result.tableRow);
    expect(tabled.map((result) => [result.kind, result.df.map((df) => df.text).join(','), result.value?.text, result.dfFrom ?? ''])).toEqual([
      ['F', '1,58', '0.84', 'levene-two-groups'],
      ['t', '58', '2.10', ''],
      ['t', '55.31', '2.10', ''],
    ]);
    expect(scan.tablesNotRead).toEqual([]);
  });
});

describe('rows a crushed table holds that are not tests', () => {
  // The layout of a results table copied from a journal's web page (telrp.springeropen.com, tables of
  // doi:10.1186/s41039-019-0102-7, CC BY 4.0): rows of means and SDs, labelled "M SD", under a header whose
  // Pretest and Posttest columns were taken into the label's header. Read by eye: the first row's F values stand among its means and SDs, the other rows hold no F.
  const text = [
    'Table 3 Effects for reading skills by reading level and training condition',
    '',
    'Measure Reading level Training condition Pretest Posttest Time effect, F(1,128) Reading level effect, F(1,128) Training condition effect, F(1,128) Time* reading level effect, F(1,128)',
    'Word identification—reading rate (WPM) Typical readers Accelerated M SD 39.82 11.5 55.9 15.7 172.46*** η2 = .59 84.94*** η2 = .41 .10, n.s. 15.05*** η2 = .11',
    'Self-paced control M SD 38.98 12.92 56.46 14.32',
    'Struggling readers Accelerated M SD 23.59 7.22 30.78 8.71',
  ].join('\n');

  it('reads no mean or SD as an F, and lists the table as not read', () => {
    const scan = scanDocument(plainTextDocument('t.txt', 'text', text));
    expect(scan.results).toEqual([]);
    expect(scan.tablesNotRead).toHaveLength(1);
  });
});

describe('a statistic, its df and its p in one cell', () => {
  // A cell form real tables use ("t (df) p" over "2.71 (41) .010"); numbers invented for the layout, read by eye.
  it('reads "2.71 (41) .010" under "t (df) p" as t(41) = 2.71, p = .010', () => {
    const text = 'Table 2. Group differences\n| Measure | t (df) p |\n|---|---|\n| Recall | 2.71 (41) .010 |\n| Speed | 1.20 (41) <.001 |\n';
    const tabled = scanDocument(plainTextDocument('t.txt', 'text', text)).results.filter((result) => result.tableRow);
    expect(tabled.map((result) => [result.kind, result.df.map((df) => df.text).join(','), result.value?.text, result.p?.comparator, result.p?.value.text])).toEqual([
      ['t', '41', '2.71', '=', '.010'],
      ['t', '41', '1.20', '<', '.001'],
    ]);
  });
});

describe('a correlation table with M and SD columns', () => {
  // Invented: columns named by the variables after M and SD, stars defined in the note.
  const text = [
    'Table 1. Means, standard deviations and correlations',
    '',
    '| Variable | M | SD | Anxiety | Mood |',
    '|---|---|---|---|---|',
    '| Anxiety | 2.10 | 0.85 | – | .32** |',
    '| Mood | 3.40 | 0.91 | .32** | – |',
    '| Sleep | 1.50 | 0.47 | -.21* | .40** |',
    'Note. N = 120. * p < .05, ** p < .01.',
  ].join('\n');

  it('reads the correlations, never an SD of 0.85 as one, with df N - 2 and the p bound of the stars', () => {
    const results = scanDocument(plainTextDocument('grid.txt', 'text', text)).results;
    expect(results.map((result) => `${result.tableRow!.rowLabel}: r(${result.df[0]!.value}) = ${result.value!.text} ${result.p!.comparator} ${result.p!.value.text}`)).toEqual([
      'Anxiety \u00d7 Mood: r(118) = .32 < .01',
      'Mood \u00d7 Anxiety: r(118) = .32 < .01',
      'Sleep \u00d7 Anxiety: r(118) = -.21 < .05',
      'Sleep \u00d7 Mood: r(118) = .40 < .01',
    ]);
  });
});

describe('a correlation matrix with the p values in the other triangle', () => {
  // Invented: the note says which triangle holds what; each r takes the p that mirrors it across the diagonal.
  const text = [
    'Table 2. Correlations among the measures',
    '',
    '| Measure | Anxiety | Mood | Sleep |',
    '|---|---|---|---|',
    '| Anxiety | – | .004 | .300 |',
    '| Mood | .26 | – | .020 |',
    '| Sleep | -.10 | .21 | – |',
    'Note. N = 120. Correlations below the diagonal, p values above the diagonal.',
  ].join('\n');

  it('reads the lower triangle as r and gives each its p from the upper triangle', () => {
    const results = scanDocument(plainTextDocument('grid.txt', 'text', text)).results;
    expect(results.map((result) => `${result.tableRow!.rowLabel}: r(${result.df[0]!.value}) = ${result.value!.text}, p = ${result.p?.value.text}`)).toEqual([
      'Mood \u00d7 Anxiety: r(118) = .26, p = .004',
      'Sleep \u00d7 Anxiety: r(118) = -.10, p = .300',
      'Sleep \u00d7 Mood: r(118) = .21, p = .020',
    ]);
  });
});
