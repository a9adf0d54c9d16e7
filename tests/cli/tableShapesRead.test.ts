/**
 * Table shapes through the built command line, each a common way of
 * printing results tables (common practice, no single source): a table on
 * its side whose df row holds pairs or whose F row holds "F (df)" cells; a
 * statistic column whose cells hold their p ("F (p)", "χ2 (1) (p)") next
 * to group columns; a note that states df for one effect only; a header
 * name no vocabulary knows between known ones, one cell per line; a row
 * labelled with a mean square error ("MSE"); a program's univariate ANOVA
 * output with its Portuguese, French and Italian column names. The numbers are made up for
 * the layouts; what is asserted is what is read (value and df), and that
 * nothing is read with df that belong to another row.
 */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { scanDocumentJson, scanTextJson } from './scanDocumentJson.js';

type Statistic = ReturnType<typeof scanTextJson>['statistics'][number];
const readAs = (statistics: Statistic[]) => statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df]);

describe('results tables in the shapes papers print them', () => {
  it('reads a table on its side whose df row holds one pair per test, with tabs or crushed into single spaces', () => {
    const rows = [['', 'Group', 'Time', 'Group × Time'], ['F', '4.21', '2.11', '6.66'], ['df', '2, 57', '1, 57', '2, 57'], ['p', '.020', '.152', '.002']];
    for (const separator of ['\t', ' ']) {
      const table = rows.map((row) => row.filter((cell) => separator === '\t' || cell !== '').join(separator)).join('\n');
      const document = scanTextJson(`Results follow.\n\nTable 2\nMixed ANOVA of the scores\n${table}\n\nThe next section.\n`);
      expect(readAs(document.statistics), JSON.stringify(separator)).toEqual([
        ['F', 4.21, [2, 57]],
        ['F', 2.11, [1, 57]],
        ['F', 6.66, [2, 57]],
      ]);
    }
  });

  it('reads a table on its side whose F row prints each F with its df in brackets', () => {
    const document = scanTextJson('Table 2\nMixed ANOVA of the scores\n\tGroup\tTime\nF(df)\t4.21 (2, 57)\t2.11 (1, 57)\np\t.020\t.152\n\nThe next section.\n');
    expect(readAs(document.statistics)).toEqual([
      ['F', 4.21, [2, 57]],
      ['F', 2.11, [1, 57]],
    ]);
  });

  it('reads "F (p)" and "χ2 (1) (p)" columns whose cells hold the p in brackets, after columns named by answers', () => {
    const chi = scanTextJson('Table 2. Answers\nItem Agree Disagree χ2 (1) (p)\nQ1 34 26 2.40 (.121)\nQ2 41 19 2.22 (.136)\n\nNext.\n');
    expect(readAs(chi.statistics)).toEqual([
      ['chi2', 2.4, [1]],
      ['chi2', 2.22, [1]],
    ]);
    expect(chi.statistics.map((statistic) => statistic.p?.value)).toEqual([0.121, 0.136]);
    const f = scanTextJson('Table 2. Answers\nItem Agree Disagree F (p)\nQ1 34 26 2.40 (.121)\nQ2 41 19 2.22 (.136)\nNote. df = 1, 58.\n\nNext.\n');
    expect(readAs(f.statistics)).toEqual([
      ['F', 2.4, [1, 58]],
      ['F', 2.22, [1, 58]],
    ]);
  });

  it('does not give every column the df a note states for one effect, but gives each block the df stated for it by name', () => {
    const outcomes = (note: string): string =>
      `Table 3\nANOVA results for each outcome\n\tGroup\t\tTime\t\nOutcome\tF\tp\tF\tp\nAnxiety\t4.21\t.020\t2.11\t.152\nDepression\t6.66\t.002\t1.02\t.317\n${note}\n\nNext.\n`;
    const document = scanTextJson(outcomes('Note. df = 2, 57 for Group and 1, 57 for Time.'));
    // (The df of Time's F tests are not 2 and 57: each block takes the pair stated for its title.)
    expect(readAs(document.statistics)).toEqual([
      ['F', 4.21, [2, 57]],
      ['F', 2.11, [1, 57]],
      ['F', 6.66, [2, 57]],
      ['F', 1.02, [1, 57]],
    ]);
    // df stated for one effect only: no block takes them (the other's df are not stated).
    const one = scanTextJson(outcomes('Note. df = 2, 57 for Group.'));
    expect(readAs(one.statistics).filter((statistic) => (statistic[2] as number[]).length > 0)).toEqual([
      ['F', 4.21, [2, 57]],
      ['F', 6.66, [2, 57]],
    ]);
    // A note that states df for all tests still gives them to every row.
    const all = scanTextJson('Table 3\nANOVA results\nOutcome\tF\tp\nAnxiety\t4.21\t.020\nDepression\t6.66\t.002\nNote. df = 2, 57 for all tests.\n\nNext.\n');
    expect(readAs(all.statistics)).toEqual([
      ['F', 4.21, [2, 57]],
      ['F', 6.66, [2, 57]],
    ]);
  });

  it('keeps an unknown header name between known ones as a column, one cell per line (a Dutch ANOVA table)', () => {
    const cells = ['Bron', 'Kwadratensom', 'df', 'Gemiddelde kwadraten', 'F', 'Sig.', 'Groep', '12.40', '2', '6.20', '4.21', '.020', 'Tijd', '9.80', '1', '9.80', '6.66', '.012', 'Fout', '83.90', '57', '1.47'];
    const document = scanTextJson(`Tabel 3. Variantieanalyse\n${cells.join('\n')}\n\n\nVolgende sectie.\n`);
    expect(readAs(document.statistics)).toEqual([
      ['F', 4.21, [2, 57]],
      ['F', 6.66, [1, 57]],
    ]);
  });

  it('reads the univariate ANOVA output of statistics programs in Portuguese, French and Italian, one cell per line and crushed', () => {
    const headers = [
      ['Fonte', 'Soma dos Quadrados Tipo III', 'gl', 'Quadrado Médio', 'F', 'Sig.', 'Eta parcial ao quadrado', 'Erro'],
      ['Source', 'Somme des carrés de type III', 'ddl', 'Carré moyen', 'F', 'Signification', 'Eta-carré partiel', 'Erreur'],
      ['Origine', 'Somma dei quadrati di tipo III', 'gdl', 'Media dei quadrati', 'F', 'Sig.', 'Eta quadrato parziale', 'Errore'],
    ];
    for (const names of headers) {
      const header = names.slice(0, 7);
      const rows = [['A', '12.40', '2', '6.20', '4.21', '.020', '.13'], ['B', '9.80', '1', '9.80', '6.66', '.012', '.10'], [names[7]!, '83.90', '57', '1.47']];
      for (const layout of ['cell per line', 'crushed']) {
        const table = layout === 'crushed' ? [header, ...rows].map((row) => row.join(' ')).join('\n') : [...header, ...rows.flat()].join('\n');
        const document = scanTextJson(`Tabela 3. ANOVA\n${table}\n\n\nNext.\n`);
        expect(readAs(document.statistics), `${names[0]} ${layout}`).toEqual([
          ['F', 4.21, [2, 57]],
          ['F', 6.66, [1, 57]],
        ]);
      }
    }
  });

  it('reads shortened and named spellings of F, chi-square and their df in headers, crushed into single spaces', () => {
    const tables = [
      { header: 'Outcome F-Stat df1/df2 p', rows: ['Anxiety 4.21 2/57 .020'], expected: ['F', 4.21, [2, 57]] },
      { header: "Outcome Welch's F df1 df2 p", rows: ['Anxiety 4.21 2 31.4 .024'], expected: ['F', 4.21, [2, 31.4]] },
      { header: 'Predictor LR Chisq Df Pr(>Chisq)', rows: ['Group 8.12 2 .017'], expected: ['chi2', 8.12, [2]] },
      { header: 'Variable Wald Chi-Square df Sig.', rows: ['Group 8.12 2 .017'], expected: ['chi2', 8.12, [2]] },
      { header: 'Variable Chi-sq df p', rows: ['Sex 3.36 1 .067'], expected: ['chi2', 3.36, [1]] },
    ];
    for (const { header, rows, expected } of tables) {
      const document = scanTextJson(`Table 4. Tests\n${header}\n${rows.join('\n')}\n\nNext.\n`);
      expect(readAs(document.statistics), header).toEqual([expected]);
    }
  });

  it('reads "F (df)" cells with significance marks and no p column, the marks after the brackets or before them', () => {
    for (const [anxiety, mood] of [
      ['4.21 (2, 57)*', '6.66 (2, 57)**'],
      ['4.21* (2, 57)', '6.66** (2, 57)'],
    ]) {
      const document = scanTextJson(`Table 4. Tests\nMeasure\tF (df)\nAnxiety\t${anxiety}\nMood\t${mood}\nNote. *p < .05. **p < .01.\n\nNext.\n`);
      expect(readAs(document.statistics), anxiety).toEqual([
        ['F', 4.21, [2, 57]],
        ['F', 6.66, [2, 57]],
      ]);
      expect(document.statistics.map((statistic) => [statistic.p?.comparator, statistic.p?.value])).toEqual([
        ['<', 0.05],
        ['<', 0.01],
      ]);
    }
  });

  it('reads "4.21(2,57)" glued under "F(df)" as F and its df pair (not 2.57), crushed into single spaces', () => {
    const document = scanTextJson('Table 4. Tests\nMeasure F(df) p\nAnxiety 4.21(2,57) .020\nMood 6.66(2,57) .002\n\nNext.\n');
    expect(readAs(document.statistics)).toEqual([
      ['F', 4.21, [2, 57]],
      ['F', 6.66, [2, 57]],
    ]);
  });

  it('reads a df column headed "(df)"', () => {
    const document = scanTextJson('Table 4. Tests\nEffect\tF\t(df)\tp\nGroup\t4.21\t(2, 57)\t.020\nTime\t2.11\t(1, 57)\t.152\n\nNext.\n');
    expect(readAs(document.statistics)).toEqual([
      ['F', 4.21, [2, 57]],
      ['F', 2.11, [1, 57]],
    ]);
  });

  it('reads a "df" header over both df of each F in every copy: crushed, padded, tabs without the empty cell, one cell per line', () => {
    const rows = [['Group', '2', '57', '4.21', '.020', '.13'], ['Time', '1', '57', '2.11', 'n.s.', '.04']];
    const copies = {
      crushed: ['Effect df F p ηp2', ...rows.map((row) => row.join(' '))].join('\n'),
      padded: ['Effect          df         F       p       ηp2', ...rows.map((row) => row[0]!.padEnd(16) + row[1]!.padEnd(4) + row[2]!.padEnd(7) + row[3]!.padEnd(8) + row[4]!.padEnd(8) + row[5])].join('\n'),
      tabs: ['Effect\tdf\tF\tp\tηp2', ...rows.map((row) => row.join('\t'))].join('\n'),
      'one cell per line': ['Effect', 'df', 'F', 'p', 'ηp2', ...rows.flat()].join('\n'),
    };
    for (const [copy, table] of Object.entries(copies)) {
      const document = scanTextJson(`Table 2. Mixed ANOVA\n${table}\n\nNext.\n`);
      expect(readAs(document.statistics), copy).toEqual([
        ['F', 4.21, [2, 57]],
        ['F', 2.11, [1, 57]],
      ]);
    }
  });

  it('reads a chi-square column with its df in the header and stars for p after group columns, crushed and padded', () => {
    const header = ['Item', 'Women', 'Men', 'χ2(1)'];
    const rows = [['Q1 agree', '30 (50.0)', '31 (51.7)', '2.40'], ['Q2 agree', '41 (68.3)', '42 (70.0)', '8.31**'], ['Q3 agree', '22 (36.7)', '23 (38.3)', '4.12*']];
    const widths = header.map((_, column) => Math.max(...[header, ...rows].map((row) => row[column]!.length)) + 3);
    const copies = {
      crushed: [header, ...rows].map((row) => row.join(' ')).join('\n'),
      padded: [header, ...rows].map((row) => row.map((cell, column) => cell.padEnd(widths[column]!)).join('').trimEnd()).join('\n'),
    };
    for (const [copy, table] of Object.entries(copies)) {
      const document = scanTextJson(`Table 3. Answers by group\n${table}\nNote. *p < .05. **p < .01.\n\nNext.\n`);
      expect(readAs(document.statistics), copy).toEqual([
        ['chi2', 2.4, [1]],
        ['chi2', 8.31, [1]],
        ['chi2', 4.12, [1]],
      ]);
      expect(document.statistics.map((statistic) => statistic.p?.value ?? null), copy).toEqual([null, 0.01, 0.05]);
    }
  });

  it('reads a "t/χ2" row under groups\' means ± SD as t tests, and under counts with percentages as chi-square tests, each paired with the P row', () => {
    // (Values whose p some df can give: t(118) = 2.31 gives about .023; χ2(1) = 5.17 gives about .023.)
    const table = (cells: [string, string][], statistic: string, values = '2.31 0.92') =>
      [
        'Group Anxiety Mood',
        `Control group (n = 54) ${cells.map(([control]) => control).join(' ')}`,
        `Training group (n = 66) ${cells.map(([, training]) => training).join(' ')}`,
        `${statistic} ${values}`,
        'P 0.023 0.360',
      ].join('\n');
    const means = scanTextJson(`Table 3. Comparison between the two groups\n${table([['2.45 ± 0.19', '2.31 ± 0.41'], ['1.52 ± 0.09', '1.49 ± 0.22']], 't/χ2')}\n\nNext.\n`);
    expect(means.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.p?.value])).toEqual([
      ['t', 2.31, 0.023],
      ['t', 0.92, 0.36],
    ]);
    const counts = scanTextJson(`Table 3. Comparison between the two groups\n${table([['30 (55.6)', '25 (37.9)'], ['12 (22.2)', '10 (15.2)']], 'χ 2/t', '5.17 0.84')}\n\nNext.\n`);
    expect(counts.statistics.map((statistic) => statistic.kind)).toEqual(['chi2', 'chi2']);
    // Means and counts under one such row: which test each value is cannot be told, and none is read.
    const both = scanTextJson(`Table 3. Comparison between the two groups\n${table([['2.45 ± 0.19', '2.31 ± 0.41'], ['30 (55.6)', '25 (37.9)']], 't/χ2')}\n\nNext.\n`);
    expect(both.statistics).toEqual([]);
  });

  it('reads statistics programs\' ANOVA output with numerator and denominator df columns and a column of marks for p < .05', () => {
    const tables = [
      'Effect DFn DFd F p p<.05 ges\ngroup 2 57 4.21 0.0196 * 0.129\ntime 1 57 2.11 0.1518  0.036',
      'Effect\tdf (num)\tdf (den)\tF\tp\ngroup\t2\t57\t4.21\t.020\ntime\t1\t57\t2.11\t.152',
      'Effect Num DF Den DF F Value Pr > F\ngroup 2 57 4.21 0.0196\ntime 1 57 2.11 0.1518',
    ];
    for (const table of tables) {
      const document = scanTextJson(`Table 2. Mixed model ANOVA\n${table}\n\nNext.\n`);
      expect(readAs(document.statistics), table.split('\n')[0]).toEqual([
        ['F', 4.21, [2, 57]],
        ['F', 2.11, [1, 57]],
      ]);
    }
  });

  it('reads headers that name an effect beside its statistic and df ("Time effect, F(1,128)", "Sex χ2(1)", "t(58) Post"), crushed and one cell per line', () => {
    const header = ['Measure', 'Time effect, F(1,128)', 'p', 'Group effect, F(1,128)', 'p'];
    const rows = [['Anxiety', '4.21', '.042', '6.66', '.011'], ['Mood', '2.11', '.149', '9.02', '.003']];
    for (const table of [[header, ...rows].map((row) => row.join(' ')).join('\n'), [header, ...rows].flat().join('\n')]) {
      const document = scanTextJson(`Table 2. Results of the analyses\n${table}\n\nNext.\n`);
      expect(readAs(document.statistics)).toEqual([
        ['F', 4.21, [1, 128]],
        ['F', 6.66, [1, 128]],
        ['F', 2.11, [1, 128]],
        ['F', 9.02, [1, 128]],
      ]);
    }
    const chi = scanTextJson('Table 2. Results\nOutcome\tSex χ2(1)\tp\tt(58) Post\tp\nAnxiety\t4.21\t.040\t2.10\t.040\n\nNext.\n');
    expect(readAs(chi.statistics).sort()).toEqual([
      ['chi2', 4.21, [1]],
      ['t', 2.1, [58]],
    ]);
  });

  it('reads a row that prints one block of a table whose side-by-side blocks are alike, naming no block', () => {
    const cells = ['Effect', 'Growth', '', 'Survival', '', '', 'df', 'F', 'df', 'F', 'Site', '1, 28', '4.21', '1, 28', '6.66', 'Season', '2, 56', '3.40', 'Site × Season', '2, 56', '1.10', '2, 56', '0.52'];
    const document = scanTextJson(`Table 2. Mixed models for growth and survival\n${cells.map((cell) => (cell === '' ? ' ' : cell)).join('\n')}\n\nNext.\n`);
    expect(readAs(document.statistics)).toEqual([
      ['F', 4.21, [1, 28]],
      ['F', 6.66, [1, 28]],
      ['F', 3.4, [2, 56]],
      ['F', 1.1, [2, 56]],
      ['F', 0.52, [2, 56]],
    ]);
  });

  it('reads the df a note states as "All Fs(2, 57)" or "df = [2, 57]"', () => {
    for (const note of ['Note. All Fs(2, 57).', 'Note. df = [2, 57].']) {
      const document = scanTextJson(`Table 2. ANOVA results\nOutcome\tF\tp\nAnxiety\t4.21\t.020\nMood\t6.66\t.002\n${note}\n\nNext.\n`);
      expect(readAs(document.statistics), note).toEqual([
        ['F', 4.21, [2, 57]],
        ['F', 6.66, [2, 57]],
      ]);
    }
  });

  it('takes the p bound of stars from legends worded as lists or as a program\'s output notes, and from math-font asterisks', () => {
    const legends = [
      '*, ** and *** indicate p < 0.05, p < 0.01 and p < 0.001.',
      '*, ** denote significance at the 5% and 1% levels, respectively.',
      '*Correlation is significant at the 0.05 level (2-tailed). **Correlation is significant at the 0.01 level (2-tailed).',
      'Note: ∗p < .05, ∗∗p < .01.',
    ];
    for (const legend of legends) {
      const document = scanTextJson(`Table 2. ANOVA results\nOutcome\tdf\tF\nAnxiety\t2, 57\t4.21*\nMood\t2, 57\t6.66∗∗\n${legend}\n\nNext.\n`);
      expect(document.statistics.map((statistic) => [statistic.p?.comparator, statistic.p?.value]), legend).toEqual([
        ['<', 0.05],
        ['<', 0.01],
      ]);
    }
  });

  it('reads a "t/χ2" column row by row: t where the groups print means ± SD, chi-square where they print counts with percentages', () => {
    const header = ['Variable', 'Intervention (n = 60)', 'Control (n = 60)', 't/χ2', 'P'];
    const rows = [['Age (years)', '45.2 ± 8.1', '44.1 ± 7.9', '0.75', '0.454'], ['Female, n (%)', '30 (50.0)', '24 (40.0)', '1.21', '0.271'], ['Smokers, n (%)', '12 (20.0)', '10 (16.7)', '0.22', '0.639']];
    for (const table of [[header, ...rows].map((row) => row.join('\t')).join('\n'), [header, ...rows].map((row) => row.join(' ')).join('\n')]) {
      const document = scanTextJson(`Table 1. Baseline characteristics of the two groups\n${table}\n\nNext.\n`);
      expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.p?.value])).toEqual([
        ['t', 0.75, 0.454],
        ['chi2', 1.21, 0.271],
        ['chi2', 0.22, 0.639],
      ]);
    }
  });

  it('reads a program\'s independent-samples test crushed into single spaces: Levene\'s F, the pooled t and the t for unequal variances', () => {
    const table = [
      'Table 3. Independent Samples Test',
      "Levene's Test for Equality of Variances t-test for Equality of Means",
      'F Sig. t df Sig. (2-tailed) Mean Difference Std. Error Difference',
      'Score Equal variances assumed 1.234 .271 2.410 58 .019 3.100 1.286',
      'Equal variances not assumed 2.410 55.312 .019 3.100 1.286',
    ].join('\n');
    const document = scanTextJson(`${table}\n\nNext.\n`);
    expect(readAs(document.statistics)).toEqual([
      ['F', 1.234, [1, 58]],
      ['t', 2.41, [58]],
      ['t', 2.41, [55.312]],
    ]);
  });

  it('reads a row labelled with a mean square error ("Total MSE"), which is no row of means and SEs', () => {
    const document = scanTextJson(
      'Table 3. Paired t tests\nDomain\tN\tBefore M (SD)\tAfter M (SD)\tt\tdf\tp\nTotal MSE\t525\t35.92 (10.42)\t42.06 (10.44)\t25.04\t524\t< 0.001\nMothers\t361\t35.55 (10.29)\t41.41 (10.47)\t20.57\t360\t< 0.001\n\nNext.\n',
    );
    expect(readAs(document.statistics)).toEqual([
      ['t', 25.04, [524]],
      ['t', 20.57, [360]],
    ]);
  });

  it('reads a table a PDF gave column by column, the error df printed at the error term\'s place in the df column', () => {
    const columns = [['Source', 'Group', 'Time', 'Group × Time', 'Error', 'Total'], ['df', '1', '2', '2', '114', '119'], ['F', '4.21', '3.15', '0.88'], ['p', '.044', '.047', '.418']];
    const document = scanTextJson(`Table 2\nResults of the two-way ANOVA\n${columns.flat().join('\n')}\n\nThe next section.\n`);
    expect(readAs(document.statistics)).toEqual([
      ['F', 4.21, [1, 114]],
      ['F', 3.15, [2, 114]],
      ['F', 0.88, [2, 114]],
    ]);
    // Without an error term among the labels, the df column's extra value says nothing about the denominator.
    const noError = columns.map((column) => column.filter((cell) => cell !== 'Error' && cell !== '114'));
    const unread = scanTextJson(`Table 2\nResults of the two-way ANOVA\n${noError.flat().join('\n')}\n\nThe next section.\n`);
    expect(unread.statistics.filter((statistic) => statistic.df.length === 2)).toEqual([]);
  });

  it('reads a chi-square column whose header gives the sample size after the df ("χ2 (1, N = 82)")', () => {
    const document = scanTextJson('Table 1. Participants by group\nCharacteristic Control Intervention χ2 (1, N = 82) p\nFemale 22 (55.0) 25 (59.5) 0.17 .680\nSmoker 10 (25.0) 6 (14.3) 1.45 .228\n\nNext.\n');
    expect(readAs(document.statistics)).toEqual([
      ['chi2', 0.17, [1]],
      ['chi2', 1.45, [1]],
    ]);
  });

  it('takes a group\'s letter in a crushed header ("Group A Group B Group C") for the group\'s name, not a column of regression weights', () => {
    const document = scanTextJson('Table 1. Characteristics by group\nCharacteristic Group A Group B Group C χ2(2) p\nFemale 22 (55.0%) 25 (59.5%) 20 (52.6%) 0.17 .680\nSmoker 10 (25.0%) 6 (14.3%) 12 (31.6%) 1.45 .228\n\nNext.\n');
    expect(readAs(document.statistics)).toEqual([
      ['chi2', 0.17, [2]],
      ['chi2', 1.45, [2]],
    ]);
    // (A letter that begins a longer name still names its column: "X 2" after "High level" is a chi-square.)
    const chi = scanTextJson('Table 1. Levels\nItems Low level High level X 2 P\nNo 94 (29.3) 13 (17.1) 7.658 .022\nYes 227 (70.7) 63 (82.9)\nNote. df = 1.\n\nNext.\n');
    expect(chi.statistics.map((statistic) => [statistic.kind, statistic.value])).toEqual([['chi2', 7.658]]);
  });

  it('reads a "Value (df)" or "Statistic (df)" column whose test is named by a section row, a row labelled with the test, or a footnote letter', () => {
    const bySection = scanTextJson(
      'Table 1. Baseline characteristics\nVariable | Control | Intervention | Value (df) | p\nChi-square test | | | |\nFemale, n (%) | 22 (55.0) | 25 (59.5) | 0.17 (1) | .680\nSmoker, n (%) | 10 (25.0) | 6 (14.3) | 1.45 (1) | .228\nt test | | | |\nAge, M (SD) | 45.2 (10.1) | 44.0 (9.8) | 0.54 (80) | .590\n\nNext.\n',
    );
    expect(readAs(bySection.statistics)).toEqual([
      ['chi2', 0.17, [1]],
      ['chi2', 1.45, [1]],
      ['t', 0.54, [80]],
    ]);
    const byLetter = scanTextJson(
      'Table 1. Baseline characteristics\nVariable | Control | Intervention | Statistic (df) | p\nAge, M (SD) | 45.2 (10.1) | 44.0 (9.8) | 0.54 (80)a | .590\nFemale, n (%) | 22 (55.0) | 25 (59.5) | 0.17 (1)b | .680\nNote. a Independent-samples t test. b Chi-square test.\n\nNext.\n',
    );
    expect(readAs(byLetter.statistics)).toEqual([
      ['t', 0.54, [80]],
      ['chi2', 0.17, [1]],
    ]);
    // A row whose test nothing names, or one named as a test plumbline does not check, is not read.
    const unnamed = scanTextJson('Table 1. Baseline characteristics\nVariable | Control | Intervention | Value (df) | p\nFemale, n (%) | 22 (55.0) | 25 (59.5) | 0.17 (1) | .680\nMann-Whitney U test | | | |\nIncome | 12 (3) | 14 (4) | 3.10 (1) | .078\n\nNext.\n');
    expect(unnamed.statistics).toEqual([]);
  });

  it('keeps a pipe table whole across the lines of lone pipes a web page leaves between its rows, where no new header follows', () => {
    const document = scanTextJson('Table 1. Groups\n| Variable | Value (df) | P value |\n| Chi-square test | 41.64 (4) | <.01 |\n|\n|\n|\nGender, n (%) | 2.96 (4) | .57 |\n|\n|\nMale | 121 (40.1) | 140 (40.9) |\n\nNext.\n');
    expect(readAs(document.statistics)).toEqual([
      ['chi2', 41.64, [4]],
      ['chi2', 2.96, [4]],
    ]);
  });

  it('reads the rows of a second model under its formula line ("Anxiety score = Group × Sampling season × Location"), which heads a block like a section', () => {
    const document = scanTextJson(
      'Table 3. Linear models\nTerm F df p\nAnxiety score = Group × Sampling season × Location\nGroup 12.47 2, 90 <0.001\nSeason 3.41 2, 90 0.038\nAnxiety score = Group × Sampling season × Site\nGroup 12.09 2, 90 <0.001\nSite 0.12 1, 90 0.735\n\nThe first model includes all groups.\n',
    );
    expect(readAs(document.statistics)).toEqual([
      ['F', 12.47, [2, 90]],
      ['F', 3.41, [2, 90]],
      ['F', 12.09, [2, 90]],
      ['F', 0.12, [1, 90]],
    ]);
  });

  it('takes the error df a df column\'s name states ("df (error = 57)") for every F of the table', () => {
    for (const separator of ['\t', ' ']) {
      const rows = [['Effect', 'df (error = 57)', 'F', 'p'], ['Group', '2', '4.21', '.020'], ['Time', '1', '6.66', '.012']];
      const document = scanTextJson(`Table 3. ANOVA\n${rows.map((row) => row.join(separator)).join('\n')}\n\nNext.\n`);
      expect(readAs(document.statistics), JSON.stringify(separator)).toEqual([
        ['F', 4.21, [2, 57]],
        ['F', 6.66, [1, 57]],
      ]);
    }
  });

  it('reads rows under a spanned first column copied one cell per line, each row but the first ending with an empty cell', () => {
    const header = ['Factor', 'Variable', 'Type III sum of squares', 'df', 'Mean square', 'F', 'Sig.'];
    const rows = [
      ['Depth', 'Clay', '10.926', '5', '2.185', '4.312', '0.002'],
      ['Silt', '15.309', '5', '3.062', '0.410', '0.840 ns', ' '],
      ['Sand', '12.100', '5', '2.420', '2.910', '0.019', ' '],
      ['Site', 'Clay', '29.077', '2', '14.539', '2.077', '0.133 ns'],
      ['Silt', '23.003', '2', '11.501', '1.539', '0.222 ns', ' '],
      ['Error', '501.120', '100', '5.011', ' ', ' ', ' '],
    ];
    const table = [header, ...rows].map((row) => row.join('\n\n')).join('\n\n');
    const document = scanTextJson(`Table 2. Effects of depth and site\n\n${table}\n\nNote. ns, not significant.\n`);
    // (Without the span, "Variable" would name the sums of squares and every value would shift one column.)
    expect(readAs(document.statistics)).toEqual([
      ['F', 4.312, [5, 100]],
      ['F', 0.41, [5, 100]],
      ['F', 2.91, [5, 100]],
      ['F', 2.077, [2, 100]],
      ['F', 1.539, [2, 100]],
    ]);
  });

  // Layout of tune passages dvzi-01 (a title cell over "df" / "F" / "p", rows padded with two empty cells) and
  // dvzd-03 (groups over "F" / "Sig." printed three times, rows padded with one or two), re-rendered one cell per line.
  it('reads rows padded with empty cells past the last named column, one cell per line and on consecutive lines (real corpus dvzi-01, dvzd-03)', () => {
    const padded = [
      ['Table 2. Analysis of the ratings'],
      ['Ratings (first block)', '', '', '', '', ''],
      ['df', 'F', 'p', '', '', ''],
      ['Group', '1.23', '16.91', '.001', '', ''],
      ['Time', '2.46', '8.02', '.002', '', ''],
      ['Group × Time', '2.46', '3.58', '.03', '', ''],
    ];
    const blocks = [
      ['Table 3. Two-way ANOVA of the yields'],
      ['Parameters', 'S', 'C', 'S*C', '', '', '', '', ''],
      ['F', 'Sig.', 'F', 'Sig.', 'F', 'Sig.', '', '', ''],
      ['Yield', '5.819', '0.028', '5.669', '0.008', '24.382', '0.000', ''],
      ['Height', '37.266', '0.000', '2.716', '0.079', '5.100', '0.011', '', ''],
      ['Weight', '0.629', '0.439', '5.192', '0.011', '0.774', '0.525', '', ''],
    ];
    for (const [layout, render] of [
      ['one cell per line', (rows: string[][]) => rows.map((row) => row.map((cell) => (cell === '' ? ' ' : cell)).join('\n\n')).join('\n\n')],
      ['consecutive lines', (rows: string[][]) => rows.map((row) => row.join('\n')).join('\n')],
    ] as const) {
      const first = scanTextJson(`${render(padded)}\n\nNote. Made-up values.\n`);
      expect(readAs(first.statistics), layout).toEqual([
        ['F', 16.91, [1, 23]],
        ['F', 8.02, [2, 46]],
        ['F', 3.58, [2, 46]],
      ]);
      const second = scanTextJson(`${render(blocks)}\n\nNote. Made-up values.\n`);
      // (Counted, the padding made the rows eight values wide, and the header's names fell on the wrong columns.)
      expect(second.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.p?.value]), layout).toEqual([
        ['F', 5.819, 0.028],
        ['F', 5.669, 0.008],
        ['F', 24.382, 0],
        ['F', 37.266, 0],
        ['F', 2.716, 0.079],
        ['F', 5.1, 0.011],
        ['F', 0.629, 0.439],
        ['F', 5.192, 0.011],
        ['F', 0.774, 0.525],
      ]);
    }
  });

  // Layout of tune passage divb-01: a "Test" column naming each row's test and a "Statistic" column whose cells
  // write the df after the value, re-rendered one cell per line.
  it('reads a column of tests beside a "Statistic" column whose cells write their df ("4.12, df = 88.5"), one cell per line (real corpus divb-01)', () => {
    const rows = [
      ['Factor', 'Hypothesis', 'Test', 'Statistic', 'n', 'p-Value'],
      ['Boldness', 'Older birds bolder', 'correlation', '0.21', '152', '0.009'],
      ['Younger birds less bold', 't-test', '4.12, df = 88.5', '150', '<0.001', ''],
      ['Birds kept alone bolder', 't-test', '−2.64, df = 120.3', '149', '0.009', ''],
      ['Calls', 'Louder birds call more', 'correlation', '−0.18', '98', '0.076', ''],
    ];
    for (const [layout, render] of [
      ['one cell per line', (cells: string[][]) => cells.map((row) => row.map((cell) => (cell === '' ? ' ' : cell)).join('\n\n')).join('\n\n')],
      ['consecutive lines', (cells: string[][]) => cells.map((row) => row.join('\n')).join('\n')],
    ] as const) {
      const document = scanTextJson(`Table 3.\n\n${render(rows)}\n\nNote. Made-up values.\n`);
      // (A correlation's df follow from its row's n, n - 2.)
      expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.value]), layout).toEqual([
        ['r', 0.21, [150], 0.009],
        ['t', 4.12, [88.5], 0.001],
        ['t', -2.64, [120.3], 0.009],
        ['r', -0.18, [96], 0.076],
      ]);
    }
  });

  // Layout of tune passage divn-08: an upper header row of two group titles and six empty cells over the columns'
  // names, copied on consecutive lines (its empty cells empty lines).
  it('reads a table on consecutive lines whose upper header row holds two titles and then empty cells (real corpus divn-08)', () => {
    const rows = [
      ['Means', 'Paired differences', '', '', '', '', '', ''],
      ['Outdoors', 'Indoors', 'Mean', 'Std. dev.', 't-value', 'df', 'Effect size', ''],
      ['Teacher ratings', '1.20', '0.05', '1.15', '1.79', '2.88', '19', '0.74'],
      ['Student ratings', '81.01', '79.27', '1.74', '6.56', '1.18', '19', '0.60'],
      ['Redirects', '3.10', '5.70', '−2.60', '2.62', '4.43', '19', '0.84'],
    ];
    const document = scanTextJson(`Table 4.\n${rows.map((row) => row.join('\n')).join('\n')}\nNote. Made-up values.\n`);
    expect(readAs(document.statistics)).toEqual([
      ['t', 2.88, [19]],
      ['t', 1.18, [19]],
      ['t', 4.43, [19]],
    ]);
  });

  // Layout of tune passage dvze-05: counts with a chi-square column, then the header printed again partway down
  // ("(x̄ ± s)" ... "t" / "p") over rows of means ± SD, re-rendered one cell per line.
  it('reads a header printed again partway down under other names as the header of the rows under it, one cell per line (real corpus dvze-05)', () => {
    const rows = [
      ['Assessment', 'All', 'Group A', 'Group B', 'χ2', 'p'],
      ['Smoking', '73 (8.9)', '32 (8.0)', '41 (9.7)', '0.75', '0.390'],
      ['Drinking', '84 (10.2)', '41 (10.3)', '43 (10.2)', '0.003', '0.958'],
      ['(x̄ ± s)', '(x̄ ± s)', '(x̄ ± s)', 't', 'p', ''],
      ['Distress', '76.89 ± 21.42', '74.33 ± 22.60', '79.10 ± 20.11', '−3.56', '<0.001'],
      ['Hope', '37.05 ± 30.67', '41.09 ± 31.36', '33.56 ± 29.65', '3.84', '<0.001'],
    ];
    const table = rows.map((row) => row.map((cell) => (cell === '' ? ' ' : cell)).join('\n\n')).join('\n\n');
    const document = scanTextJson(`Table 3.\nComparison of the two groups.\n\n${table}\n\nNote. Made-up values.\n`);
    // (Before, the repeated header was read as a section and a row labelled "p", and its rows under "χ2".)
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.p?.value])).toEqual([
      ['chi2', 0.75, 0.39],
      ['chi2', 0.003, 0.958],
      ['t', -3.56, 0.001],
      ['t', 3.84, 0.001],
    ]);
  });

  it('reads a table copied one cell per line on consecutive lines, its empty cells empty lines', () => {
    const lines = [
      'Table 3. Repeated measures analysis of the scores',
      'Main effect of group',
      'Main effect of time',
      'Interaction',
      '',
      '',
      '',
      'F (1, 58)',
      'p',
      'F (2, 116)',
      'p',
      'F (2, 116)',
      'p',
      'Primary outcome',
      '',
      '',
      '',
      '',
      '',
      '',
      'Global score',
      '7.171',
      '.009',
      '34.382',
      '< .001',
      '10.811',
      '< .001',
      'Memory',
      '0.256',
      '.614',
      '7.069',
      '.001',
      '',
      '',
      'Note. Scores are sums.',
    ];
    const document = scanTextJson(`${lines.join('\n')}\n`);
    expect(readAs(document.statistics)).toEqual([
      ['F', 7.171, [1, 58]],
      ['F', 34.382, [2, 116]],
      ['F', 10.811, [2, 116]],
      ['F', 0.256, [1, 58]],
      ['F', 7.069, [2, 116]],
    ]);
  });

  it('reads a table copied with no-break spaces, thin spaces and full-width brackets as it reads the plain copy', () => {
    const plain = 'Table 2. ANOVA of the scores\nSource\tdf\tF\tp\nGroup\t2, 57\t4.21\t< .001\nTime\t1, 57\t2.11\t.152\n\nNext.\n';
    const damaged = plain.replace(/ (?=[<=>.\d])/g, '\u00a0').replace(/< /g, '<\u2009').replace(/Source/, '\uff08Source\uff09');
    const expected = [
      ['F', 4.21, [2, 57]],
      ['F', 2.11, [1, 57]],
    ];
    expect(readAs(scanTextJson(plain).statistics)).toEqual(expected);
    expect(readAs(scanTextJson(damaged).statistics)).toEqual(expected);
  });

  it('reads a crushed row whose p is glued to the value before it ("241.34<0.0001", "4.842 (15)<.001")', () => {
    const f = scanTextJson('Table 4. Analysis of variance\nSource SS df MS F p\nModel 5.88 15 0.392 241.34<0.0001\nVoltage 1.84 1 1.84 113.12<0.0001\nResidual 0.04 24 0.0016\n\nNext.\n');
    expect(readAs(f.statistics)).toEqual([
      ['F', 241.34, [15, 24]],
      ['F', 113.12, [1, 24]],
    ]);
    expect(f.statistics.map((statistic) => statistic.p?.value)).toEqual([0.0001, 0.0001]);
    const t = scanTextJson(
      'Table 2. Change in each group\nVariable Mean (SD) t value (df) P value Cohen d\nMood 0.59 (0.5) 4.842 (15)<.001 1.21\nAttention 0.63 (0.5) 2.953 (15) .01 0.74\nActivity 0.25 (0.4) 2.449 (15) .03 0.61\n\nNext.\n',
    );
    expect(readAs(t.statistics)).toEqual([
      ['t', 4.842, [15]],
      ['t', 2.953, [15]],
      ['t', 2.449, [15]],
    ]);
  });

  it('takes neither df pair of a note that states one for most columns and another for one of them, unless a block is so named', () => {
    const table = (titles: string): string =>
      `Table 2. ANOVA of each measure\n${titles}\n F P F P F P\nSC 5.81 0.02 8.48 0.007 5.22 0.03\nMR 0.06 0.81 0.12 0.73 0.09 0.76\nNote. d.f. = 1,28 except for output, where one subject was excluded and so d.f. = 1,27.\n\nNext.\n`;
    // (Titles in small letters cannot be cut into blocks: which column takes 1,27 the note says only in words, and
    // every F is read, none with df it may not have.)
    const uncut = scanTextJson(table('term mass count output'));
    expect(uncut.statistics.map((statistic) => statistic.value)).toEqual([5.81, 8.48, 5.22, 0.06, 0.12, 0.09]);
    expect(uncut.statistics.filter((statistic) => statistic.df.length > 0)).toEqual([]);
    // Titles cut at their capitals, one per block: the block titled "Output" takes the exception's pair.
    expect(readAs(scanTextJson(table('Term Mass Count Output')).statistics)).toEqual([
      ['F', 5.81, [1, 28]],
      ['F', 8.48, [1, 28]],
      ['F', 5.22, [1, 27]],
      ['F', 0.06, [1, 28]],
      ['F', 0.12, [1, 28]],
      ['F', 0.09, [1, 27]],
    ]);
  });

  it('does not place counts with their percentages ("7 (24)") under a "Chi-square (df)" column of a crushed table', () => {
    const document = scanTextJson(
      'Table 1. Characteristics by group\nCharacteristic Experimental (n=29) Control (n=29) Chi-square (df) t test (df) P value\nSex: female, n (%) 24 (83) 22 (76) 0.10 (1) .75\nAge (y), mean (SD) 84.03 (7.36) 84.38 (7.48) −0.177 (56) .86\nElementary 7 (24) 6 (21)\nSecondary 19 (66) 11 (38)\n\nNext.\n',
    );
    // (Nor the groups' counts or means under the chi-square or t column, nor a negative t as a chi-square.)
    expect(readAs(document.statistics)).toEqual([
      ['chi2', 0.1, [1]],
      ['t', -0.177, [56]],
    ]);
    // The groups named with their sizes are columns of their own, the label's name is "Characteristic".
    const groups = scanTextJson(
      'Table 1. Characteristics by group\nCharacteristic Experimental (n=29) Control (n=29) Chi-square (df) P value\nSex: female, n (%) 24 (83) 22 (76) 0.10 (1) .75\nSmoker, n (%) 7 (24) 6 (21) 0.11 (1) .74\n\nNext.\n',
    );
    expect(groups.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.value])).toEqual([
      ['chi2', 0.1, [1], 0.75],
      ['chi2', 0.11, [1], 0.74],
    ]);
  });

  it('reads a row whose label ends with an abbreviation\'s point ("Anger: FLD vs.") and whose label goes on below its values', () => {
    const document = scanTextJson(
      'Table 3. Results of the ANOVA\nEffect   F   p   ηp2\nStimulus type   13.26   <0.01   0.18\nStimulus type   53.41   <0.01   0.47\n× Emotion\nAnger: FLD vs.   43.48   <0.01   0.42\nPLD vs. Static\nFear   9.04   <0.01   0.13\n\nNote. df = 2, 58 for all tests.\n',
    );
    expect(readAs(document.statistics)).toEqual([
      ['F', 13.26, [2, 58]],
      ['F', 53.41, [2, 58]],
      ['F', 43.48, [2, 58]],
      ['F', 9.04, [2, 58]],
    ]);
  });

  it('reads on past a page\'s running head, page number or link that a page break put between two rows', () => {
    const furniture = ['Page 12 of 30', '12 of 30', 'https://doi.org/10.1234/abc.2021.522', 'Table 2 (continued)', 'Smith et al.', 'BMC Psychiatry (2021) 21:522'];
    for (const line of furniture) {
      const document = scanTextJson(
        `Table 2. ANOVA of the outcome measures\nOutcome   F   df   p   ηp2\nDepression   4.21   1, 58   .045   .07\nAnxiety   2.11   1, 58   .152   .04\n${line}\nQuality of life   6.66   1, 58   .012   .10\nSleep   8.30   1, 58   .006   .13\n\nNote. ηp2 = partial eta squared.\n`,
      );
      expect(readAs(document.statistics), line).toEqual([
        ['F', 4.21, [1, 58]],
        ['F', 2.11, [1, 58]],
        ['F', 6.66, [1, 58]],
        ['F', 8.3, [1, 58]],
      ]);
      expect(document.tablesNotRead, line).toEqual([]);
    }
  });

  it('reads on past a running head in a table copied with tabs, and one in a crushed table of correlations', () => {
    const tabbed = scanTextJson(
      'Table 2. ANOVA of the outcome measures\nOutcome\tF\tdf\tp\nDepression\t4.21\t1, 58\t.045\nAnxiety\t2.11\t1, 58\t.152\nJournal of Invented Studies 2021, 9, 522 11 of 16\nOutcome\tF\tdf\tp\nQuality of life\t6.66\t1, 58\t.012\nSleep\t8.30\t1, 58\t.006\n\nThe next section.\n',
    );
    expect(readAs(tabbed.statistics)).toEqual([
      ['F', 4.21, [1, 58]],
      ['F', 2.11, [1, 58]],
      ['F', 6.66, [1, 58]],
      ['F', 8.3, [1, 58]],
    ]);
    // A crushed table of correlations (N = 60 in the caption): the rows after the page's running head keep their columns.
    const crushed = scanTextJson(
      'Table 3.\nSpearman correlations between gait and test scores (N = 60).\nGait Variables Memory Attention\nGait speed 0.449 †† 0.430 ††\nStride length 0.446 †† 0.422 ††\nCadence 0.199 0.191\nPage 12 of 30\nDouble support −0.153 −0.149\nSwing phase 0.192 0.182\n†p < 0.05; †† p < 0.01.\n',
    );
    const read = crushed.statistics.map((statistic) => statistic.value);
    expect(read).toEqual(expect.arrayContaining([0.449, 0.43, -0.153, -0.149, 0.192, 0.182]));
    expect(crushed.tablesNotRead).toEqual([]);
  });

  it('reads rows whose long labels the page wrapped over two lines, copied with tabs, crushed or aligned', () => {
    const rows = [
      ['Effect', 'F', 'df', 'p'],
      ['Stimulus type', '13.26', '2, 58', '<.001'],
      ['Stimulus type', '× Emotion', '53.41', '6, 174', '<.001'],
      ['Anger: FLD vs.', 'PLD vs. Static', '43.48', '1, 29', '<.001'],
      ['Participants living in shared', 'households', '4.81', '1, 29', '.036'],
    ];
    const copies: [string, (cells: string[]) => string][] = [
      ['tabs', (cells) => cells.join('\t')],
      ['crushed', (cells) => cells.join(' ')],
      ['aligned', (cells) => cells.join('   ')],
    ];
    for (const [copy, join] of copies) {
      // A wrapped label's first words stand alone on a line; the rest opens the row's line.
      const lines = rows.flatMap((row, index) => (index === 0 || row.length === 4 ? [join(row)] : [row[0]!, join(row.slice(1))]));
      const document = scanTextJson(`Table 3. Repeated-measures ANOVA of accuracy\n${lines.join('\n')}\n\nThe next section.\n`);
      expect(readAs(document.statistics), copy).toEqual([
        ['F', 13.26, [2, 58]],
        ['F', 53.41, [6, 174]],
        ['F', 43.48, [1, 29]],
        ['F', 4.81, [1, 29]],
      ]);
      expect(document.tablesNotRead, copy).toEqual([]);
    }
  });

  it('reads a pipe row broken after its label cell whose values end with the row\'s closing pipe, and means with thousands apart by commas', () => {
    const table = [
      '| Variable | Group A | Group B | Group C | df | χ² | P value |',
      '|---|---|---|---|---|---|---|',
      '| Duration of the series (s) | 8.0 ± 3.1 | 23.4 ± 6.7 | 4.7 ± 2.7 | 2 | 10.5 | <0.05 |',
      '| Number of notes |',
      '11.0 ± 4.5 | 48.8 ± 14.4 | 7.4 ± 2.7 | 2 | 10.2 | <0.05 |',
      '| Song duration (s) | 789.4 ± 294.8 | 2,396.4 ± 775.8 | 1,006.8 ± 122.3 | 2 | 9.8 | <0.05 |',
    ];
    const expected = [
      ['chi2', 10.5, [2]],
      ['chi2', 10.2, [2]],
      ['chi2', 9.8, [2]],
    ];
    const piped = scanTextJson(`Table 3. Kruskal-Wallis tests of the song measures\n${table.join('\n')}\n\nThe next section.\n`);
    expect(readAs(piped.statistics)).toEqual(expected);
    // The same rows crushed into single spaces: "2,396.4 ± 775.8" is one cell, not a new row labelled "±".
    const crushedRows = table.filter((line) => !line.startsWith('|---')).map((line) => line.replace(/^\| /, '').replace(/ \|$/, '').split(' | ').join(' '));
    const crushed = scanTextJson(`Table 3. Kruskal-Wallis tests of the song measures\n${crushedRows.join('\n')}\n\nThe next section.\n`);
    expect(readAs(crushed.statistics).filter((statistic) => statistic[1] !== 10.2)).toEqual([expected[0], expected[2]]);
  });

  it('reads a model\'s coefficients whose header names only the value columns ("Estimate | Std. Error | z value | Pr(>|z|)"), the intercept too', () => {
    const rows = [
      ['Estimate', 'Std. Error', 'z value', 'Pr(>|z|)'],
      ['(Intercept)', '-0.69956', '0.13511', '-5.17778', '< 0.00001'],
      ['FREQ', '0.06766', '0.01676', '4.03729', '0.00005'],
      ['FREQ:LAUNCH', '-0.00768', '0.01026', '-0.74814', '0.45438'],
    ];
    for (const [copy, join] of [
      ['pipes', (cells: string[]) => `| ${cells.join(' | ')} |`],
      ['tabs', (cells: string[]) => cells.join('\t')],
    ] as const) {
      const document = scanTextJson(`Table 5. Fixed effects of the model for word skipping.\n${rows.map(join).join('\n')}\n\nThe next section.\n`);
      expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.p?.value]), copy).toEqual([
        ['z', -5.17778, 0.00001],
        ['z', 4.03729, 0.00005],
        ['z', -0.74814, 0.45438],
      ]);
    }
  });

  it('gives a block the df its note states for it as an exception ("d.f. = 1,28 except for daily sperm production … d.f. = 1,27")', () => {
    const note = 'Note. In all cases d.f. = 1,28 except for daily sperm production where one subject was excluded and so d.f. = 1,27.';
    const rows = ['Term\tTestes mass\t\tSperm count\t\tDaily sperm production\t', '\tF\tP\tF\tP\tF\tP', 'SC\t5.81\t0.02\t8.48\t0.007\t5.22\t0.03', 'MR\t0.06\t0.81\t0.12\t0.73\t0.09\t0.76'];
    const document = scanTextJson(`Table 2. ANOVAs of the ejaculate measures\n${rows.join('\n')}\n${note}\n`);
    expect(readAs(document.statistics)).toEqual([
      ['F', 5.81, [1, 28]],
      ['F', 8.48, [1, 28]],
      ['F', 5.22, [1, 27]],
      ['F', 0.06, [1, 28]],
      ['F', 0.12, [1, 28]],
      ['F', 0.09, [1, 27]],
    ]);
    // When no block is named as the exception says, no test takes either pair.
    const renamed = scanTextJson(`Table 2. ANOVAs of the ejaculate measures\n${rows.join('\n').replace('Daily sperm production', 'Sperm output')}\n${note}\n`);
    expect(renamed.statistics.every((statistic) => statistic.df.length === 0)).toBe(true);
    expect(renamed.statistics.length).toBeGreaterThan(0);
  });

  it('gives each row the df its note states for it by name ("Degrees of freedom: Group 2, 57; Time 1, 57"), and none to a row the note does not name', () => {
    const table = (note: string): string => `Table 2. Effects on recall\nEffect\tF\tp\tηp2\nGroup\t4.10\t.022\t.13\nTime\t6.20\t.016\t.10\nGroup × Time\t0.40\t.672\t.01\n${note}\n\nNext.\n`;
    for (const note of ['Note. Degrees of freedom: Group 2, 57; Time 1, 57; Group × Time 2, 57.', 'Note. df = 2, 57 for Group, 1, 57 for Time and 2, 57 for Group × Time.']) {
      expect(readAs(scanTextJson(table(note)).statistics), note).toEqual([
        ['F', 4.1, [2, 57]],
        ['F', 6.2, [1, 57]],
        ['F', 0.4, [2, 57]],
      ]);
    }
    // The interaction is not "Group": a row the note does not name takes no df.
    expect(readAs(scanTextJson(table('Note. Degrees of freedom: Group 2, 57; Time 1, 57.')).statistics)).toEqual([
      ['F', 4.1, [2, 57]],
      ['F', 6.2, [1, 57]],
      ['F', 0.4, []],
    ]);
    // A name that is no row's ("interaction" beside "Group × Time"): no row takes any pair.
    const unnamed = scanTextJson(table('Note. Degrees of freedom: Group 2, 57; Time 1, 57; interaction 2, 57.')).statistics;
    expect(unnamed.every((statistic) => statistic.df.length === 0)).toBe(true);
  });

  it('reads the titles of side-by-side blocks over a crushed header from their capitals, for a note that names one of them', () => {
    // Rows and note as a journal's table page gives them (tests/corpus/real/passages/dwbe-01.txt, CC BY 4.0).
    const text = [
      'Table 2 Sperm competition risk but not potential mating rate impacts on ejaculate production',
      '',
      'Term Paired testes mass Epididymal sperm count Daily sperm production Seminal vesicles mass',
      '  F P F P F P F P',
      'SC 5.81 0.02 8.48 0.007 5.22 0.03 4.37 0.046',
      'MR 0.06 0.81 0.12 0.73 0.09 0.76 0.21 0.65',
      '  1. In all cases, the degrees of freedom for each F test, d.f. = 1,28 except for daily sperm production where one subject was excluded and so d.f. = 1,27.',
      '',
    ].join('\n');
    expect(readAs(scanTextJson(text).statistics)).toEqual([
      ['F', 5.81, [1, 28]],
      ['F', 8.48, [1, 28]],
      ['F', 5.22, [1, 27]],
      ['F', 4.37, [1, 28]],
      ['F', 0.06, [1, 28]],
      ['F', 0.12, [1, 28]],
      ['F', 0.09, [1, 27]],
      ['F', 0.21, [1, 28]],
    ]);
    // Titles the capitals cut into one too many ("Sperm count DSP") are not taken, and the exception then names no block.
    const tooMany = scanTextJson(text.replace('Epididymal sperm count', 'Epididymal sperm count DSP')).statistics;
    expect(tooMany.every((statistic) => statistic.df.length === 0)).toBe(true);
  });

  it('reads a within-subjects table with a column naming each row\'s sphericity correction (JASP\'s and jamovi\'s layout), each corrected row with its own df', () => {
    const rows = [
      ['Cases', 'Sphericity Correction', 'Sum of Squares', 'df', 'Mean Square', 'F', 'p', 'η²p'],
      ['time', 'None', '17.55', '2', '8.78', '3.20', '0.048', '0.100'],
      ['', 'Greenhouse-Geisser', '17.55', '1.62', '10.83', '3.20', '0.060', '0.100'],
      ['Residuals', 'None', '158.90', '58', '2.74', '', '', ''],
      ['', 'Greenhouse-Geisser', '158.90', '46.98', '3.38', '', '', ''],
    ];
    const text = `Within Subjects Effects\n${rows.map((row) => row.join('\t')).join('\n')}\n\nNext.\n`;
    expect(scanTextJson(text).statistics.map((statistic) => [statistic.value, statistic.df, statistic.p?.value])).toEqual([
      [3.2, [2, 58], 0.048],
      [3.2, [1.62, 46.98], 0.06],
    ]);
  });

  it('reads a program\'s ANOVA table whose two last column names a narrow gap sets apart ("ges p.value"), rows numbered', () => {
    const text = [
      'Anova Table (Type 3 tests)',
      '',
      'Response: score',
      '     Effect    df  MSE         F   ges p.value',
      '1     group 1, 38 5.12    4.52 *  .062    .040',
      '2      time 2, 76 1.08 12.31 ***  .104   <.001',
      '3 group:time 2, 76 1.08      0.87  .007    .424',
      '',
    ].join('\n');
    expect(scanTextJson(text).statistics.map((statistic) => [statistic.value, statistic.df, statistic.p?.comparator, statistic.p?.value])).toEqual([
      [4.52, [1, 38], '=', 0.04],
      [12.31, [2, 76], '<', 0.001],
      [0.87, [2, 76], '=', 0.424],
    ]);
  });

  it('reads a regression table with an odds ratio and its interval after the p ("OR [95% CI]"), never a p as the z', () => {
    // The caption, header and rows run onto one line, as a paper stored as Markdown gives them
    // (tests/corpus/real/passages/dwib-01.txt, CC BY 4.0).
    const text =
      '### Table 6\n*Summary of the replication results of Part 1 based on logistic regression analysis Predictor Estimate SE Z p OR [95% CI] Intercept 0.51 0.09 5.46 <.001 1.67 [1.39, 2.00] Default: No-Default – Opt-In 0.32 0.14 2.37 0.018 1.38 [1.06, 1.80] Default: Opt-Out – Opt-In 0.51…*\n\nNext.\n';
    expect(scanTextJson(text).statistics.map((statistic) => [statistic.kind, statistic.value, statistic.p?.comparator, statistic.p?.value])).toEqual([
      ['z', 5.46, '<', 0.001],
      ['z', 2.37, '=', 0.018],
    ]);
  });

  it('never takes a p written as a bound ("<0.001") for the F beside it, and reads the F after it', () => {
    // A journal's table page as text (tests/corpus/real/passages/dvyc-01.txt, CC BY): the interaction's F (0.3, 6.2)
    // prints no df, so it is read without them, with its own p.
    const statistics = scanDocumentJson(join(__dirname, '..', 'corpus', 'real', 'passages', 'dvyc-01.txt')).statistics.map((statistic) => [
      statistic.value,
      statistic.df,
      statistic.p?.comparator,
      statistic.p?.value,
    ]);
    expect(statistics).toContainEqual([0.3, [], '=', 0.595]);
    expect(statistics).toContainEqual([6.2, [], '<', 0.001]);
    expect(statistics.filter(([value]) => value === 0.001)).toEqual([]);
  });

  it('reads cells in a program\'s scientific notation with the exponent\'s sign set apart ("4.50380E + 0003")', () => {
    // Rows as a journal's table page gives them (tests/corpus/real/passages/divr-02.txt, CC BY): a regression ANOVA whose
    // model and lack-of-fit F are tested against the residual and pure error rows below them.
    const statistics = scanDocumentJson(join(__dirname, '..', 'corpus', 'real', 'passages', 'divr-02.txt')).statistics.map((statistic) => [statistic.value, statistic.df]);
    expect(statistics).toContainEqual([714.8885, [9, 9]]);
    expect(statistics).toContainEqual([10.115, [5, 4]]);
  });

  it('reads an HTML table left in Markdown whose head holds only its title ("<th>Table 7</th>"), its column names in the body', () => {
    // The table as a paper stored as Markdown gives it (tests/corpus/real/passages/dwib-02.txt, CC BY 4.0): two models
    // side by side, each row's z and p read per model.
    const statistics = scanDocumentJson(join(__dirname, '..', 'corpus', 'real', 'passages', 'dwib-02.txt')).statistics;
    expect(statistics.slice(0, 4).map((statistic) => [statistic.kind, statistic.value, statistic.p?.comparator, statistic.p?.value])).toEqual([
      ['z', -7.65, '<', 0.001],
      ['z', -5.78, '<', 0.001],
      ['z', 24.14, '<', 0.001],
      ['z', 12.96, '<', 0.001],
    ]);
  });

  it('reads a converted table\'s header cells broken by "<br>" and values in LaTeX dollars ("$68,527.167$", "$6.979 \\times 10^{-6}$")', () => {
    // Rows as a paper converted to Markdown gives them (tests/corpus/real/passages/dwka-01.txt, CC BY 4.0), crushed.
    const text = [
      'Table 6. Between-subjects effects on weighted objectives.',
      '',
      'Source Type III Sum <br> of Squares df Mean Square F Sig. Partial Eta <br> Squared',
      'Intercept 257.993 1 257.993 $36,964,741.896$ 0.000 1.000',
      'Methods 0.478 1 0.478 $68,527.167$ 0.000 0.999',
      'Error 0.000 58 $6.979 \\times 10^{-6}$',
      '',
    ].join('\n');
    expect(scanTextJson(text).statistics.map((statistic) => [statistic.value, statistic.df])).toContainEqual([68527.167, [1, 58]]);
  });

  it('reads Minitab\'s "Adj SS" and "Adj MS" columns, so a lack-of-fit row\'s mean square is not taken for its F', () => {
    // Cells one per line as a journal's page gives them (tests/corpus/real/passages/dwie-02.txt, CC BY): the lack-of-fit
    // row prints DF, SS, Adj SS and Adj MS (735.5) and no F.
    const cells = ['Source', 'DF', 'SS', 'Adj SS', 'Adj MS', 'F-Value', 'p-Value', 'Linear', '4', '472,732', '171,535', '42,883.7', '62.96', '0.000', 'Square', '4', '178,450', '74,321', '18,580.4', '27.28', '0.000', 'Interaction between factors', '6', '175,332', '175,332', '29,221.9', '42.90', '0.000', 'Residual Error', '365', '248,607', '248,607', '681.1', 'Lack-of-Fit', '338', '248,607', '248,607', '735.5', 'Pure Error', '27', '0', '0', '0.0', 'Total', '379', '1,075,121'];
    const document = scanTextJson(`Table 2. ANOVA for the full regression model.\n${cells.join('\n')}\n\nNext.\n`);
    expect(readAs(document.statistics)).toEqual([
      ['F', 62.96, [4, 365]],
      ['F', 27.28, [4, 365]],
      ['F', 42.9, [6, 365]],
    ]);
  });

  it('gives a result written in a crushed row\'s cell ("t(58) = 2.12") the p of the p column after it', () => {
    const text = 'Table 3\nComparison of scores between groups\nMeasure Group A M (SD) Group B M (SD) Test statistic p\nAnxiety 12.3 (4.1) 10.1 (3.9) t(58) = 2.12 .038\nStress 15.2 (5.0) 13.0 (4.8) t(58) = −1.74 .087\n\nNext.\n';
    expect(scanTextJson(text).statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.value])).toEqual([
      ['t', 2.12, [58], 0.038],
      ['t', -1.74, [58], 0.087],
    ]);
  });

  it('gives a footnote\'s df ("a df = 1.") only to the values carrying its marker, never to the other rows', () => {
    const text = [
      'Table 1. Characteristics of the participants by group',
      'Characteristic Intervention (n = 40) Control (n = 40) χ2 P',
      'Gender 0.80a 0.371',
      'Female 22 (55.0) 18 (45.0)',
      'Male 18 (45.0) 22 (55.0)',
      'Age group 1.20 0.549',
      '<30 10 (25.0) 12 (30.0)',
      '30–50 20 (50.0) 16 (40.0)',
      '>50 10 (25.0) 12 (30.0)',
      'a df = 1.',
      '',
    ].join('\n');
    // (The age groups' chi-square has 2 df, which the table does not print: it is read without df, never with the footnote's.)
    expect(readAs(scanTextJson(text).statistics)).toEqual([
      ['chi2', 0.8, [1]],
      ['chi2', 1.2, []],
    ]);
    // A note that is no footnote gives its df to every test.
    expect(readAs(scanTextJson(text.replace('0.80a', '0.80').replace('a df = 1.', 'Note. df = 1 for all tests.')).statistics)).toEqual([
      ['chi2', 0.8, [1]],
      ['chi2', 1.2, [1]],
    ]);
  });

  it('reads df and p columns under the names programs print ("df_M", "df_R", "p.value", "p adj", "P>|z|") and df pairs joined by a dash ("1–28")', () => {
    const table = (header: string[], rows: string[][]): string => `Table 2. Results\n${[header, ...rows].map((row) => row.join('\t')).join('\n')}\n\nNext.\n`;
    const split = scanTextJson(table(['Effect', 'df_M', 'df_R', 'F', 'p.value', 'pes'], [['Group', '1', '28', '4.52', '.042', '.14'], ['Time', '2', '56', '3.20', '.048', '.10']]));
    expect(split.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.value, statistic.effects.map((effect) => effect.kind)])).toEqual([
      ['F', 4.52, [1, 28], 0.042, ['partial-eta-squared']],
      ['F', 3.2, [2, 56], 0.048, ['partial-eta-squared']],
    ]);
    for (const dash of ['\u2013', '-']) {
      const paired = scanTextJson(table(['Effect', 'df', 'F', 'p adj'], [['Group', `1${dash}28`, '4.52', '.042'], ['Time', `2${dash}56`, '3.20', '.048']]));
      expect(paired.statistics.map((statistic) => [statistic.value, statistic.df, statistic.p?.value]), dash).toEqual([
        [4.52, [1, 28], 0.042],
        [3.2, [2, 56], 0.048],
      ]);
    }
    const wald = scanTextJson(table(['Predictor', 'z', 'P>|z|'], [['Age', '2.10', '0.036'], ['Sex', '-1.20', '0.230']]));
    expect(wald.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.p?.value])).toEqual([
      ['z', 2.1, 0.036],
      ['z', -1.2, 0.23],
    ]);
  });

  it('gives each unknown word of a crushed header its own column when the rows hold one value per word', () => {
    // Rows as a journal's table page gives them (tests/corpus/real/passages/dwfb-01.txt, CC BY 4.0): "Bray Jaccard
    // Uni-U Uni-W" name four columns of p, and each block's F follows its "D.F." cell.
    const text = [
      'Table 3.',
      '',
      'Significance of tests to detect differences in zooplankton community and whale scat samples.',
      '',
      'Zooplankton Season Region',
      'D.F. F-value p-value Bray Jaccard Uni-U Uni-W D.F. F-value p-value Bray Jaccard Uni-U Uni-W',
      'COI 1, 21 5.249 0.042 <0.001 0.001 <0.001 0.025 2, 20 3.716 0.039 0.004 0.003 0.003 0.270',
      '18S 1, 22 0.353 0.559 0.032 0.047 0.032 0.005 2, 21 0.813 0.457 0.005 0.006 0.014 0.008',
      '',
    ].join('\n');
    expect(readAs(scanTextJson(text).statistics)).toEqual([
      ['F', 5.249, [1, 21]],
      ['F', 3.716, [2, 20]],
      ['F', 0.353, [1, 22]],
      ['F', 0.813, [2, 21]],
    ]);
    // With one value fewer per block than the words ask for, the header is not cut, and no F takes another's df.
    const ownDf = new Map([[5.249, '1,21'], [3.716, '2,20'], [0.353, '1,22'], [0.813, '2,21']]);
    const short = scanTextJson(text.replace(/ 0\.025 /, ' ').replace(/ 0\.005 2, 21/, ' 2, 21')).statistics;
    expect(short.filter((statistic) => statistic.df.length > 0 && ownDf.get(statistic.value) !== statistic.df.join(','))).toEqual([]);
  });

  it('reads correlation matrices the same when their caption is wrapped over two lines, as a PDF\'s text gives it', () => {
    const glued = (caption: string): string =>
      `Table 3\n\n${caption}\n\n1234\n\n1. Exhaustion\n2. Cynicism.61\n3. Inefficacy.58.55\n4. Satisfaction-.42-.36-.41\n\nNote. N = 220. p<.001\n`;
    const crushed = (caption: string): string =>
      `Table 2.\n\n${caption}\n\nVariables M SD 1 2 3\n1. GAD 11.1 4.49\n2. Age 20.9 2.55 −0.14\n3. BDI 19.2 10.83 0.47 *** −0.15\n4. Happy face RTs 694.5 86.5 −0.10 0.07 −0.16\n\nNote. *** p < .001.\n`;
    const cases: [(caption: string) => string, string, string, number][] = [
      [glued, 'Burnout, perception of the school, efficacy, commitment, and job satisfaction. Correlation matrix.', 'commitment,\nand', 218],
      [crushed, 'Correlations between age, depression, anxiety, and reaction times to emotional stimuli in the anxious group (n = 60).', 'to\nemotional', 58],
    ];
    for (const [table, caption, wrappedAt, df] of cases) {
      const [before, after] = wrappedAt.split('\n') as [string, string];
      const wrapped = caption.replace(`${before} ${after}`, `${before}\n${after}`);
      const one = scanTextJson(table(caption)).statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df]);
      const two = scanTextJson(table(wrapped)).statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df]);
      expect(one.length).toBeGreaterThanOrEqual(3);
      expect(one.every((statistic) => statistic[0] === 'r' && (statistic[2] as number[])[0] === df)).toBe(true);
      expect(two, wrappedAt).toEqual(one);
    }
  });

  it('does not read the means of rows labelled "M SD" as the test a wrapped header names over them', () => {
    const lines = [
      'Table 3 Effects for reading skills by reading level and training condition',
      '',
      'Measure Reading level Training condition Pretest Posttest Time effect,',
      'F(1,128) Reading level effect, F(1,128) Training condition effect, F(1,128)',
      'Time* reading level effect, F(1,128)',
      'Word identification rate (WPM) Typical readers Accelerated M',
      'SD', '39.82', '11.5', '55.9', '15.7', '172.46***', 'η2 = .59', '84.94***', 'η2 = .41', '.10, n.s. 15.05***', 'η2 = .11',
      'Self-paced control M', 'SD', '38.98', '12.92', '56.46', '14.32', '    ',
      'Struggling readers Accelerated M', 'SD', '23.59', '7.22', '30.78', '8.71', '    ',
      '  Total M', 'SD', '33.09', '12.97', '46.52', '17.64', '    ',
    ];
    const document = scanTextJson(`${lines.join('\n')}\n`);
    const means = [56.46, 30.78, 46.52, 38.98, 23.59, 33.09];
    expect(document.statistics.filter((statistic) => means.includes(statistic.value ?? NaN))).toEqual([]);
  });

  it('reads df pairs whose comma a copy turned into a point ("1.23" for "1, 23") only where the pairs keep a design\'s pattern', () => {
    const table = (dfs: string[]): string =>
      `Table 2. ANOVA of the N400 amplitudes\n| Effect | df | F | p |\n|---|---|---|---|\n${['NP', 'CO', 'ROI × NP × CO'].map((effect, index) => `| ${effect} | ${dfs[index]} | ${['16.91', '18.02', '4.58'][index]} | <.001 |`).join('\n')}\n`;
    // df2 = df1 × 23 on every row (a repeated-measures design with 24 participants): pairs.
    expect(readAs(scanTextJson(table(['1.23', '2.46', '6.138'])).statistics)).toEqual([
      ['F', 16.91, [1, 23]],
      ['F', 18.02, [2, 46]],
      ['F', 4.58, [6, 138]],
    ]);
    // The same error df on every row with the first varying (a between-subjects design): pairs.
    expect(readAs(scanTextJson(table(['1.56', '2.56', '3.56'])).statistics)).toEqual([
      ['F', 16.91, [1, 56]],
      ['F', 18.02, [2, 56]],
      ['F', 4.58, [3, 56]],
    ]);
    // Corrected df with decimals keep no such pattern: no pair is made of them.
    expect(scanTextJson(table(['1.46', '1.87', '2.31'])).statistics.every((statistic) => statistic.df.length !== 2)).toBe(true);
  });

  it('reads the bound that closes a crushed row after a result written with its df ("F6,89 = 10.10 <0.001") as its p, and no bare number', () => {
    const lines = [
      'Table 3. Effects of the marking methods on behaviour',
      'Behaviour Comparison Effect Size p-Value *',
      'Ear grooming Overall Treatment F6,89 = 10.10 <0.001',
      'Facial grimacing Overall Treatment F6,89 = 2.22 0.048 FDR',
      'Digging Overall Treatment F6,89 = 4.74 <0.001 FDR',
    ];
    const document = scanTextJson(`${lines.join('\n')}\n\nThe next section.\n`);
    expect(document.statistics.map((statistic) => [statistic.value, statistic.df, statistic.p === null ? null : `${statistic.p.comparator} ${statistic.p.value}`])).toEqual([
      [10.1, [6, 89], '< 0.001'],
      [2.22, [6, 89], null],
      [4.74, [6, 89], '< 0.001'],
    ]);
  });

  it('reads side-by-side blocks whose titles carry their numerator df ("Treatment (num. df = 1)") over an aligned or crushed header', () => {
    const rows = [
      ['Parameter', 'Treatment (num. df = 1)', 'Temperature (num. df = 7)'],
      ['', 'SS', 'MS', 'D. df', 'F', 'p', 'SS', 'MS', 'D. df', 'F', 'p'],
      ['Fv/Fm', '18.9', '18.9', '686.1', '676.4', '<0.01', '35.5', '5.1', '679.0', '181.9', '<0.01'],
      ['Gross P:R', '14.3', '14.3', '119.9', '41.3', '<0.01', '25.3', '3.6', '10.5', '126.2', '<0.01'],
    ];
    for (const [copy, gap] of [['aligned', '   '], ['crushed', ' ']] as const) {
      const table = rows.map((row) => row.filter((cell) => cell !== '').join(gap)).join('\n');
      const document = scanTextJson(`Table 3. Results of the laboratory experiment.\n${table}\n\nThe next section.\n`);
      expect(readAs(document.statistics), copy).toEqual([
        ['F', 676.4, [1, 686.1]],
        ['F', 181.9, [7, 679]],
        ['F', 41.3, [1, 119.9]],
        ['F', 126.2, [7, 10.5]],
      ]);
    }
  });

  it('tests a regression ANOVA\'s lack of fit against pure error, not the residual, and no lack of fit against a residual alone', () => {
    // F(4, 5) = 34.5 gives p = .0008, F(2, 3) = 6.00 gives p = .089 (SciPy 1.10.1 scipy.stats.f.sf, computed when the test was written).
    const rows = ['Source SS df MS F p', 'Model 89.70 4 22.43 34.5 0.0008', 'Residual 3.25 5 0.65', 'Lack of fit 2.60 2 1.30 6.00 0.0894', 'Pure error 0.65 3 0.217', 'Corr. Total 92.95 9'];
    const document = scanTextJson(`Table 4. ANOVA for the mixture design\n${rows.join('\n')}\n\nThe next section.\n`);
    expect(readAs(document.statistics)).toEqual([
      ['F', 34.5, [4, 5]],
      ['F', 6, [2, 3]],
    ]);
    expect(document.statistics.flatMap((statistic) => statistic.findings.filter((finding) => finding.severity === 'fail'))).toEqual([]);
    // Without a pure-error row the lack of fit's error df are not the residual's.
    const withoutPureError = scanTextJson(`Table 4. ANOVA for the mixture design\n${rows.filter((row) => !row.startsWith('Pure')).join('\n')}\n\nThe next section.\n`);
    expect(readAs(withoutPureError.statistics).filter((statistic) => statistic[1] === 6)).not.toContainEqual(['F', 6, [2, 5]]);
  });

  it('never gives a statistic at the end of a table row the p that stands on the next row', () => {
    for (const [copy, rows] of [
      ['tabs', ['Effect\tTest\tp', 'Group\tF2,73 = 2.20 (ns)\t', '\tP = 0.117\t', 'Time\tF1,73 = 5.10 (sig.)\t', '\tP = 0.027\t']],
      ['pipes', ['| Effect | Test | p |', '| Group | F2,73 = 2.20 (ns) | |', '| | | P = 0.117 |', '| Time | F1,73 = 5.10 (sig.) | |', '| | | P = 0.027 |']],
    ] as const) {
      const document = scanTextJson(`Table 2. Tests of the effects\n${rows.join('\n')}\n\nThe next section.\n`);
      expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p]), copy).toEqual([
        ['F', 2.2, [2, 73], null],
        ['F', 5.1, [1, 73], null],
      ]);
    }
  });

  it('reads a table comparing groups whose "χ2 (df)" and "t (df)" columns share one p column, its rows named "Age, mean (SD)"', () => {
    const rows = [
      ['Characteristic', 'Intervention (n = 60)', 'Control (n = 58)', 'χ2 (df)', 't (df)', 'p'],
      ['Female, n (%)', '30 (50.0)', '25 (43.1)', '0.56 (1)', '', '.454'],
      ['Age (years), mean (SD)', '44.2 (10.1)', '46.0 (11.3)', '', '−0.91 (116)', '.365'],
      ['Smoker, n (%)', '12 (20.0)', '20 (34.5)', '3.13 (1)', '', '.077'],
      ['BMI, mean ± SD', '27.1 ± 4.2', '28.3 ± 4.9', '', '−1.43 (116)', '.155'],
    ];
    for (const [copy, table] of [
      ['pipes', rows.map((row) => row.join(' | ')).join('\n')],
      ['tabs', rows.map((row) => row.join('\t')).join('\n')],
      ['spaced', rows.map((row) => row.filter((cell) => cell !== '').join('   ')).join('\n')],
    ]) {
      const document = scanTextJson(`Table 1. Baseline characteristics\n${table}\n\nNote. χ2, chi-square test.\n`);
      expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.value]), copy).toEqual([
        ['chi2', 0.56, [1], 0.454],
        ['t', -0.91, [116], 0.365],
        ['chi2', 3.13, [1], 0.077],
        ['t', -1.43, [116], 0.155],
      ]);
    }
  });

  it('reads one "χ2/t (df)" or "t or χ2 (df)" column, each row\'s statistic told by its cells (counts or means) and its df in the cell', () => {
    for (const name of ['χ2/t (df)', 't/χ2 (df)', 't or χ2 (df)']) {
      const rows = [
        ['Characteristic', 'Intervention (n = 60)', 'Control (n = 58)', name, 'p'],
        ['Female, n (%)', '30 (50.0)', '25 (43.1)', '0.56 (1)', '.454'],
        ['Age (years), mean (SD)', '44.2 (10.1)', '46.0 (11.3)', '−0.91 (116)', '.365'],
        ['Smoker, n (%)', '12 (20.0)', '20 (34.5)', '3.13 (1)', '.077'],
      ];
      for (const [copy, table] of [
        ['pipes', rows.map((row) => row.join(' | ')).join('\n')],
        ['tabs', rows.map((row) => row.join('\t')).join('\n')],
      ]) {
        const document = scanTextJson(`Table 1. Baseline characteristics\n${table}\n\nNext.\n`);
        expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.value]), `${name} ${copy}`).toEqual([
          ['chi2', 0.56, [1], 0.454],
          ['t', -0.91, [116], 0.365],
          ['chi2', 3.13, [1], 0.077],
        ]);
      }
    }
  });

  it('does not take "Control χ2" for a column when "χ2 or t (df)" follows in a crushed header (the chi-squares are not read as t)', () => {
    const document = scanTextJson(
      'Table 1. Baseline characteristics\nCharacteristic Intervention Control χ2 or t (df) p\nFemale, n (%) 30 (50.0) 25 (43.1) 0.56 (1) .454\nAge (years), mean (SD) 44.2 (10.1) 46.0 (11.3) −0.91 (116) .365\nSmoker, n (%) 12 (20.0) 20 (34.5) 3.13 (1) .077\n\nNext.\n',
    );
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.value])).toEqual([
      ['chi2', 0.56, [1], 0.454],
      ['t', -0.91, [116], 0.365],
      ['chi2', 3.13, [1], 0.077],
    ]);
  });

  it('reads a categorical variable\'s test on its own row above its categories, under "χ2/t (df)" or under "χ2 | t | df | p"', () => {
    const oneColumn = [
      'Variable | Intervention (n = 60) | Control (n = 58) | χ2/t (df) | p',
      'Education, n (%) |  |  | 5.91 (2) | .052',
      'Primary | 10 (16.7) | 15 (25.9) |  | ',
      'Secondary | 30 (50.0) | 28 (48.3) |  | ',
      'Tertiary | 20 (33.3) | 15 (25.9) |  | ',
      'Age (years), mean (SD) | 44.2 (10.1) | 46.0 (11.3) | −0.91 (116) | .365',
    ];
    const sharedDf = [
      'Variable | Intervention (n = 60) | Control (n = 58) | χ2 | t | df | p',
      'Education, n (%) |  |  |  |  |  | ',
      'Primary | 10 (16.7) | 15 (25.9) | 5.91 |  | 2 | .052',
      'Secondary | 30 (50.0) | 28 (48.3) |  |  |  | ',
      'Age (years), mean (SD) | 44.2 (10.1) | 46.0 (11.3) |  | −0.91 | 116 | .365',
    ];
    for (const [layout, lines] of [
      ['one column', oneColumn],
      ['shared df', sharedDf],
    ] as const) {
      const document = scanTextJson(`Table 1. Baseline characteristics\n${lines.join('\n')}\n\nNext.\n`);
      // (χ2(2) = 5.91 gives p = .052: SciPy 1.10.1, scipy.stats.chi2.sf(5.91, 2).)
      expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.value]), layout).toEqual([
        ['chi2', 5.91, [2], 0.052],
        ['t', -0.91, [116], 0.365],
      ]);
    }
  });

  it('reads a table one cell per line or crushed whose header leaves a column of the rows without a name, on whichever side the rows fit', () => {
    // An effect size printed as an image after "p" (its name lost), and a sum of squares without its name before "df".
    const trailing = [['Source', 'df', 'F', 'p'], ['Group', '1', '3.67', '.066*', '.116'], ['Time', '2', '7.27', '.002**', '.206'], ['Error', '28']];
    const leading = [['Source', 'df', 'F', 'p'], ['Group', '12.40', '1', '3.67', '.066'], ['Time', '30.12', '2', '7.27', '.002'], ['Error', '95.33', '28']];
    for (const [name, rows] of [
      ['unnamed last column', trailing],
      ['unnamed first column', leading],
    ] as const) {
      for (const separator of ['\n\n', ' ']) {
        const table = rows.map((row) => row.join(separator)).join(separator === ' ' ? '\n' : '\n\n');
        const document = scanTextJson(`Table 4\n\nMixed ANOVA of the ratings\n\n${table}\n\nThe next section.\n`);
        expect(readAs(document.statistics), `${name}, ${JSON.stringify(separator)}`).toEqual([
          ['F', 3.67, [1, 28]],
          ['F', 7.27, [2, 28]],
        ]);
      }
    }
  });

  it('reads a crushed header whose labels have two names (an outcome over "Source") and whose last column has none', () => {
    // The layout of tests/corpus/real/passages/divr-05.txt (CC BY) crushed into single spaces; the numbers are made up.
    const text = ['Table 7.', 'Mixed ANOVA for reading fluency.', 'Reading fluency Source df F p', 'Words per minute Between subjects', 'Method 1 4.12 0.049* 0.128', 'Level 1 40.31 0.000*** 0.590', 'Error 28', 'Within subjects', 'Time 2 7.27 0.002** 0.206', 'Error 56'].join('\n');
    expect(readAs(scanTextJson(`${text}\n\nNext.\n`).statistics)).toEqual([
      ['F', 4.12, [1, 28]],
      ['F', 40.31, [1, 28]],
      ['F', 7.27, [2, 56]],
    ]);
  });

  it('reads a crushed header with no name over its labels whose groups are named "Women n (%)" and "Men n (%)"', () => {
    const document = scanTextJson(
      'Table 2\nKnowledge of the condition by sex\nWomen n (%) Men n (%) Total N (240) Chi square value p value\nHeard of it\nYes 99 (82.5) 87 (72.5) 186 3.58 0.058\nNo 21 (17.5) 33 (27.5) 54\n\nNext.\n',
    );
    // (The group columns hold counts, so the chi-square is the only test, with its own p; its df is not printed.)
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.p?.value])).toEqual([['chi2', 3.58, 0.058]]);
  });

  it('never reads a row of percentages under the df and chi-square columns when the header names neither of its columns', () => {
    // Pre and post percentages whose names the copy set on a line of their own; the last category's row prints
    // only its two percentages (its test is the row above's).
    const cells = ['Variables', 'Df', 'χ2', 'η2', 'p value', 'Pre (%) Post (%)'];
    const rows = [
      ['Good knowledge', '4.1', '31.5', '2', '212.4', '0.51', 'p < 0.001'],
      ['Good practice', '1.2', '28.7', '2', '61.9', '0.44', 'p < 0.001'],
      ['Negative attitude', '22.6', '1.3', '1', '98.12', '0.29', 'p < 0.001'],
      ['Positive attitude', '77.4', '98.7'],
    ];
    const table = [...cells, ...rows.flat()].join('\n\n');
    const document = scanTextJson(`Table 6 Knowledge before and after the campaign\n\n${table}\n\nNext.\n`);
    expect(readAs(document.statistics)).toEqual([
      ['chi2', 212.4, [2]],
      ['chi2', 61.9, [2]],
      ['chi2', 98.12, [1]],
    ]);
  });

  it('gives a statistic standing alone on its line the p standing alone on the next, one cell per line, but never a line of prose', () => {
    // The layout of a journal's table page as text (tests/corpus/real/passages/dwmb-01.txt, CC BY): columns named by
    // conditions no vocabulary knows, each cell "F1,24 = …" then "p = …"; the numbers are made up. (F(1, 24) = 4.31
    // gives p = .049, F(1, 24) = 0.60 gives p = .446, F(1, 30) = 7.12 gives p = .012: SciPy 1.10.1
    // scipy.stats.f.sf, computed when the test was written.)
    const cells = ['Morning', 'Afternoon', 'Cortisol', 'F1,24 = 4.31', 'p = 0.049', 'F1,24 = 0.60', 'p = 0.45', 'F1,30 = 7.12', 'p = 0.012*'];
    const document = scanTextJson(`Table 1 Results of the assays\n\n${cells.join('\n\n')}\n\n`);
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.df, statistic.value, statistic.p?.value])).toEqual([
      ['F', [1, 24], 4.31, 0.049],
      ['F', [1, 24], 0.6, 0.45],
      ['F', [1, 30], 7.12, 0.012],
    ]);
    const prose = scanTextJson('The interaction was small, F(1, 24) = 0.60\n\np values below were adjusted.\n');
    expect(prose.statistics.map((statistic) => statistic.p)).toEqual([null]);
  });

  it('reads a crushed table of stacked blocks, each with its own error row, whose rows end in a column of words', () => {
    // The layout of an ANCOVA table as a journal's page gives it crushed (tests/corpus/real/passages/dwmd-01.txt,
    // CC BY 4.0): one block per outcome, each closed by its error row, a last column of pairwise comparisons in words.
    const document = scanTextJson(
      [
        'Table 3.',
        '',
        'Analysis of covariance on the two scores',
        '',
        'Dependent variable Source of variation Sum of squares d.f. Mean square F-value P-value Pairwise comparisons',
        'Recall Gender 20.00 1 20.00 4.00 0.047',
        'Group 60.00 2 30.00 6.00 0.003 Control = Low > High',
        'Error 750.00 150 5.00',
        'Recognition Gender 9.00 1 9.00 3.00 0.088',
        'Group 24.00 2 12.00 4.00 0.023 Control > High',
        'Error 117.00 39 3.00',
        '',
        'Next section.',
        '',
      ].join('\n'),
    );
    // (Each F takes the error df of its own block: 150 for recall, 39 for recognition.)
    expect(readAs(document.statistics)).toEqual([
      ['F', 4, [1, 150]],
      ['F', 6, [2, 150]],
      ['F', 3, [1, 39]],
      ['F', 4, [2, 39]],
    ]);
  });

  it('reads crushed "t (df)" blocks side by side whose rows the page wrapped over lines, df with thousands commas', () => {
    // The layout of three models' estimates, t (df) and p side by side, crushed, as a journal's page gives it
    // (tests/corpus/real/passages/dwmh-01.txt, CC BY 4.0): an interval wrapped at its spaces, the rest of the row
    // on lines of values, a large df written "12,000".
    const document = scanTextJson(
      [
        'Table 4.',
        '',
        'Mixed model results (n=1500).',
        '',
        'Model 1 Model 2',
        '',
        'Estimate (95% CI) tobsa (df) P value Estimate (95% CI) tobs (df) P value',
        'Intercept 10.20 (10.00 to 10.40) 98.10 (250) <.001 10.30 (10.10 to 10.50) 97.40 (262) <.001',
        'Week –0.90',
        '(–0.95 to',
        '–0.85)',
        '40.12 (8800) <.001 –0.91',
        '(–0.96 to',
        '–0.86)',
        '40.55 (8812) <.001',
        'Sessions 0.04 (0.03 to 0.05) 7.31 (12,000) <.001 0.04 (0.03 to 0.05) 7.02 (11,500) <.001',
        '',
        'atobs: observed t.',
        '',
      ].join('\n'),
    );
    expect(readAs(document.statistics)).toEqual([
      ['t', 98.1, [250]],
      ['t', 97.4, [262]],
      ['t', 40.12, [8800]],
      ['t', 40.55, [8812]],
      ['t', 7.31, [12000]],
      ['t', 7.02, [11500]],
    ]);
  });

  it('reads "F, p" cells one per line under headers that give their df ("F, p value (df 1, 24)")', () => {
    // The layout of a journal's table page, one cell per line (tests/corpus/real/passages/dwmf-01.txt, CC BY 4.0):
    // three effects side by side, each header naming F and p with their df, each cell "F, p", a notes column in words.
    const cells = [
      'Measure',
      'Group main effect',
      'Sex main effect',
      'Group X Sex interaction',
      'Special notes',
      ' ',
      'F, p value (df 1, 24)',
      'F, p value (df 1, 24)',
      'F, p value (df 1, 24)',
      ' ',
      'Sodium',
      '3.10, .09',
      '12.50, .002',
      '0.40, .53',
      'Females > Males',
      'Calcium',
      '0.02, .89',
      '21.30, <.001',
      '1.10, .30',
      'No interaction',
    ];
    const document = scanTextJson(`Skip to main content\n\nTable 5 Blood chemistry by group and sex\n\n${cells.join('\n\n')}\n`);
    expect(readAs(document.statistics)).toEqual([
      ['F', 3.1, [1, 24]],
      ['F', 12.5, [1, 24]],
      ['F', 0.4, [1, 24]],
      ['F', 0.02, [1, 24]],
      ['F', 21.3, [1, 24]],
      ['F', 1.1, [1, 24]],
    ]);
    expect(document.statistics.map((statistic) => statistic.p?.text)).toEqual(['.09', '.002', '.53', '.89', '.001', '.30']);
  });

  it('reads "F (df); p" cells one per line, and no F whose bracket holds a thousands comma', () => {
    // The layout of a journal's table page, one cell per line (tests/corpus/real/passages/dwmi-01.txt, CC BY 4.0):
    // joint tests of two outcomes, each cell "F (df1, df2); p".
    // (The page gives the empty corner cell as a line holding a space.)
    const cells = [' ', 'Score', 'Status', 'Joint tests', 'F (df); p', 'F (df); p', 'Time', '12.0 (3, 500); < 0.0001', '4.1 (3, 500); 0.007', 'Time X arm', '2.9 (4, 500); 0.021', '6.2 (2,000); < 0.0001'];
    const document = scanTextJson(`Table 2 Mixed models of the two outcomes\n\n${cells.join('\n\n')}\n\n  1. df = degrees of freedom\n`);
    // (The last cell's "(2,000)" is no pair of df for an F: its second would be 0.)
    expect(readAs(document.statistics)).toEqual([
      ['F', 12, [3, 500]],
      ['F', 4.1, [3, 500]],
      ['F', 2.9, [4, 500]],
    ]);
  });

  it('reads cells written "r = 0.586*" with the n the group header states over their column, its cells one short on the left (real corpus dwpc-01), in every copy: piped, tabs, aligned, crushed, one cell per line (blank lines between cells, or empty cells as empty lines)', () => {
    const groups = ['Day workers (n = 1,966)', 'Night workers (n = 1,223)'];
    const names = ['Exhaustion', 'Cynicism', 'Exhaustion', 'Cynicism'];
    const body = [
      ['KOSS', 'r = 0.586*', 'r = 0.536*', 'r = 0.569*', 'r = 0.486*'],
      ['PSQI', 'r = 0.300*', 'r = 0.162', 'r = 0.338*', 'r = 0.238*'],
    ];
    const piped = ['| ' + groups.join(' | ') + ' | | | |', '|---|---|---|---|---|', '| ' + names.join(' | ') + ' | |', ...body.map((row) => '| ' + row.join(' | ') + ' |')].join('\n');
    const tabbed = [groups.join('\t') + '\t\t\t', names.join('\t') + '\t', ...body.map((row) => row.join('\t'))].join('\n');
    // One cell per line: the groups' titles, then the names, then each row (its cells apart by blank lines).
    const perLine = [...groups, ...names, ...body.flat()].join('\n\n');
    // On consecutive lines, the header's empty cells as empty lines.
    const consecutive = [...groups, '', '', '', ...names, '', ...body.flat()].join('\n');
    // Aligned by runs of spaces.
    const aligned = [groups, names, ...body].map((row) => row.join('   ')).join('\n');
    // Crushed into single spaces.
    const crushed = [groups, names, ...body].map((row) => row.join(' ')).join('\n');
    for (const table of [piped, tabbed, perLine, consecutive, aligned, crushed]) {
      const document = scanTextJson(`Table 3.\nCorrelations of burnout with stress and sleep in day and night workers.\n${table}\n* p < 0.01.\n\nNext.\n`);
      // df = n - 2 of each column's group: 1964 under the first group's two columns, 1221 under the second's.
      expect(readAs(document.statistics)).toEqual([
        ['r', 0.586, [1964]],
        ['r', 0.536, [1964]],
        ['r', 0.569, [1221]],
        ['r', 0.486, [1221]],
        ['r', 0.3, [1964]],
        ['r', 0.162, [1964]],
        ['r', 0.338, [1221]],
        ['r', 0.238, [1221]],
      ]);
    }
    // Names that do not repeat group by group do not tie two groups to four columns: nothing is read.
    const untied = scanTextJson(`Table 3.\nCorrelations of burnout.\n| ${groups.join(' | ')} | | | |\n|---|---|---|---|---|\n| Exhaustion | Cynicism | Efficacy | Sleep | |\n${body.map((row) => '| ' + row.join(' | ') + ' |').join('\n')}\n\nNext.\n`);
    expect(untied.statistics).toEqual([]);
    const untiedCrushed = scanTextJson(`Table 3.\nCorrelations of burnout.\n${groups.join(' ')}\nExhaustion Cynicism Efficacy Sleep\n${body.map((row) => row.join(' ')).join('\n')}\n\nNext.\n`);
    expect(untiedCrushed.statistics).toEqual([]);
    // One N stated in the note for the whole table: every column's.
    const noted = scanTextJson(`Table 3.\nCorrelations of burnout.\n| | Exhaustion | Cynicism |\n|---|---|---|\n| KOSS | r = 0.586* | r = 0.536* |\n| PSQI | r = 0.300* | r = 0.162 |\nNote. N = 120. * p < 0.01.\n\nNext.\n`);
    expect(readAs(noted.statistics)).toEqual([
      ['r', 0.586, [118]],
      ['r', 0.536, [118]],
      ['r', 0.3, [118]],
      ['r', 0.162, [118]],
    ]);
  });

  it('reads a chi-square cell "10.84(1, 141)" as the value and its df, never the sample size after the df as a second df (real corpus dwpd-01), with tabs and one cell per line closed by pipes', () => {
    const header = ['Variables', "Pearson's χ2", 'P values', 'Treated', 'Control'];
    const body = [
      ['Pain', '10.84(1, 141)', 'P = 0.001', '25 (37%)', '9 (13%)'],
      ['Function', '8.34(1, 140)', 'P ≤ 0.006', '40 (60%)', '23 (34%)'],
      ['Mobility', '1.38 (1, 139)', 'P = 0.265', '23 (34%)', '17 (25%)'],
    ];
    const tabbed = [header, ...body].map((row) => row.join('\t')).join('\n');
    // As an old table page copies it: each cell on its line closed by " |", a lone "|" after each row, "||||" between
    // the header and a section row; the header names the two group columns after the known names.
    const piped = ['Table 6 |', '||||', '|', 'Responders by group |', '||||', '|', ...header.map((cell) => `${cell} |`), '|', '||||', '|', 'At 8 weeks |', '||||', '|', ...body.flatMap((row) => [...row.map((cell) => `${cell} |`), '|'])].join('\n');
    for (const table of [`Table 6\nResponders by group\n${tabbed}`, piped]) {
      const document = scanTextJson(`${table}\n\nNext.\n`);
      expect(readAs(document.statistics)).toEqual([
        ['chi2', 10.84, [1]],
        ['chi2', 8.34, [1]],
        ['chi2', 1.38, [1]],
      ]);
      expect(document.statistics.map((statistic) => [statistic.p?.comparator, statistic.p?.value])).toEqual([
        ['=', 0.001],
        ['<=', 0.006],
        ['=', 0.265],
      ]);
    }
    // A section's title right after the known names ("Demographics") over rows with one value more, whose first values
    // do not fit the known columns (a count under χ2, the chi-square under p): no column is named after it, nothing read.
    const section = scanTextJson('Table 2\nSample by group\n\nVariable\nχ2\np\nDemographics\nAge\n50\n3.21\n.073\nIncome\n48\n1.10\n.294\nSchooling\n52\n0.44\n.507\n\nNext.\n');
    expect(section.statistics).toEqual([]);
  });

  it('reads a table on its side whose chi-square row names its df in a subscript ("Chisquare (χ^{2 })_{df = 3}"), one cell per line (real corpus dwpf-01)', () => {
    const cells = ['Setting ', 'Site 1^{1} ', 'Site 2^{2} ', '', 'a. Clinic ', '48 (58%) ', '33 (58%) ', 'b. Home ', '35 (42%) ', '24 (42%) ', 'Total ', '83 ', '57 ', 'Chisquare (χ^{2 })_{df = 3} ', '67.6 ', '38.9 ', 'p value ', '<0.0001 ', '<0.0001 '];
    const document = scanTextJson(`Table 4 \n\nSetting of recruitment by site \n\n${cells.join('\n')}\n\n\nThe next section.\n`);
    expect(readAs(document.statistics)).toEqual([
      ['chi2', 67.6, [3]],
      ['chi2', 38.9, [3]],
    ]);
    expect(document.statistics.map((statistic) => [statistic.p?.comparator, statistic.p?.value])).toEqual([
      ['<', 0.0001],
      ['<', 0.0001],
    ]);
  });

  it('reads a program\'s aligned ANOVA output whose row carries R\'s "+" mark for p < .1 between its F and its effect size', () => {
    // afex's layout as a study's supplement prints it (tests/corpus/real/passages/dwqd-01.txt, CC BY 4.0); the numbers
    // are made up. (F(2.54, 319.72) = 3.31 gives p = .027 and F(8.57, 1079.96) = 1.87 gives p = .056, .055 as printed from the unrounded F: SciPy 1.10.1
    // scipy.stats.f.sf, computed when the test was written.)
    const text = [
      'Anova Table (Type 3 tests)',
      '',
      'Response: pos_total',
      '               Effect            df    MSE          F  pes p.value',
      '1       task:position  2.54, 319.72  10.71     3.31 * .026    .027',
      '2 task:sound:position 8.57, 1079.96   2.90     1.87 + .015    .055',
      '---',
      "Signif. codes:  0 '***' 0.001 '**' 0.01 '*' 0.05 '+' 0.1 ' ' 1",
    ].join('\n');
    const document = scanTextJson(`${text}\n`);
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.text])).toEqual([
      ['F', 3.31, [2.54, 319.72], '.027'],
      ['F', 1.87, [8.57, 1079.96], '.055'],
    ]);
  });

  it('reads chi-square cells that name their df ("0.61 (df = 1)") under a plain "Chi-square" header, and a crushed header\'s "Group 1 Group 2" as two columns', () => {
    // (χ2(1) = 0.61 gives p = .435 and χ2(2) = 5.91 gives p = .052: SciPy 1.10.1 scipy.stats.chi2.sf, computed when
    // the test was written.) Common practice in tables comparing groups; the numbers are made up.
    const rows = [
      ['Variables', 'Group 1', 'Group 2', 'Chi-square', 'P-value'],
      ['Sex', '', '', '0.61 (df = 1)', '0.44'],
      ['Male', '12', '15', '', ''],
      ['Female', '18', '15', '', ''],
      ['Education', '', '', '5.91 (df = 2)', '0.052'],
      ['Primary', '10', '15', '', ''],
      ['Secondary', '30', '28', '', ''],
    ];
    const layouts: Record<string, string> = {
      crushed: rows.map((row) => row.filter((cell) => cell !== '').join(' ')).join('\n'),
      aligned: rows.map((row) => row.map((cell) => (cell === '' ? ' ' : cell)).join('   ')).join('\n'),
      'one cell per line': rows.map((row) => row.map((cell) => (cell === '' ? ' ' : cell)).join('\n\n')).join('\n\n'),
    };
    for (const [layout, table] of Object.entries(layouts)) {
      const document = scanTextJson(`Table 2. Characteristics of the two groups compared by chi-square tests\n\n${table}\n\nNote. Values are n.\n`);
      expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.value]), layout).toEqual([
        ['chi2', 0.61, [1], 0.44],
        ['chi2', 5.91, [2], 0.052],
      ]);
    }
  });

  it("reads the intercept row of R's MANOVA output, whose every row prints its own numerator and denominator df (real corpus dwqd-02)", () => {
    // R's car::Anova layout for a multivariate test as a study's supplement prints it (tests/corpus/real/passages/dwqd-02.txt,
    // CC BY 4.0); the numbers are made up. (p from SciPy 1.10.1 scipy.stats.f.sf, computed when the test was written:
    // F(1, 96) = 212.40 gives 4.6e-26, F(2, 95) = 6.31 gives .0027, F(4, 93) = 1.42 gives .233.)
    const text = [
      'Type III Repeated Measures MANOVA Tests: Pillai test statistic',
      '            Df test stat approx F num Df den Df    Pr(>F)    ',
      '(Intercept)  1   0.68871   212.40      1     96 < 2.2e-16 ***',
      'block        1   0.11726     6.31      2     95 0.0026727 ** ',
      'block:cue    1   0.05754     1.42      4     93 0.2334749    ',
      '---',
      "Signif. codes:  0 '***' 0.001 '**' 0.01 '*' 0.05 '.' 0.1 ' ' 1",
    ].join('\n');
    const document = scanTextJson(`${text}\n`);
    expect(readAs(document.statistics)).toEqual([
      ['F', 212.4, [1, 96]],
      ['F', 6.31, [2, 95]],
      ['F', 1.42, [4, 93]],
    ]);
  });

  it('reads a "Test Statistics" column whose name carries a footnote letter the note defines as a Wald chi-square, the intercept\'s too, and nothing when the letter names no test (real corpus dwoe-01)', () => {
    // A logistic regression's table as a journal's web page gives it (tests/corpus/real/passages/dwoe-01.txt, CC BY); the
    // numbers are made up. (χ2(1) = 18.31 gives p = .00002, 3.95 gives .047, 7.12 gives .0076: SciPy 1.10.1 scipy.stats.chi2.sf.)
    const table = (note: string): string =>
      [
        'Table 3. Logistic regression model for relapse.',
        'Covariate | Coefficient (SE) | Test Statisticsa | P-valueb | Odds Ratio (95% CI) |',
        'Intercept | 8.10(1.89) | 18.31 | <0.001 | |',
        'Age | 0.91(0.46) | 3.95 | 0.047 | 2.48(1.01–6.11) |',
        'Dose | −0.27(0.10) | 7.12 | 0.008 | 0.76(0.63–0.93) |',
        'SE: standard error; CI: confidence interval.',
        note,
        'b P-values were 2-sided.',
        '',
        'The next section.',
      ].join('\n');
    const document = scanTextJson(`${table('a Wald chi-square tests.')}\n`);
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.text])).toEqual([
      ['chi2', 18.31, [], '0.001'],
      ['chi2', 3.95, [], '0.047'],
      ['chi2', 7.12, [], '0.008'],
    ]);
    // (A letter its note does not define as a test leaves the column's kind unknown: nothing is read from it.)
    expect(scanTextJson(`${table('a Estimated by maximum likelihood.')}\n`).statistics).toEqual([]);
  });

  it('reads rows one cell per line that end in a footnote letter or an empty cell after t, p and d, keeping the next row\'s label its own (real corpus dwoa-01)', () => {
    // A journal's web table as text (tests/corpus/real/passages/dwoa-01.txt, CC BY 4.0): a two-level header flattened into
    // cells, a footnote letter ("a", "b") or a blank cell closing each row. The numbers are made up. (t(38) = 4.80 gives
    // p = .00002, 2.05 gives .047, 1.20 gives .238: SciPy 1.10.1 scipy.stats.t.sf, two-sided.)
    const cells = [' ', 'Patients', 'Controls', 'Group difference', 'Effect size', 'Mean', 'SD', 'Mean', 'SD', 't', 'p', 'Cohen’s d',
      'Faces', ' Static', '  % Eye', '31.2', '20.5', '60.4', '18.1', '4.80', '< .001*', '1.52', 'b',
      '  % Mouth', '15.3', '12.2', '8.4', '9.0', '2.05', '.047', '.65', 'a',
      ' Dynamic', '  % Eye', '24.1', '19.9', '49.7', '20.2', '4.80', '< .001*', '1.26', 'b',
      '  % Mouth', '29.5', '25.1', '26.2', '16.0', '1.20', '.238', '.38', ' ',
      'Objects', '  % Moving', '40.2', '18.0', '55.1', '17.5', '2.05', '.047*', '.84', 'b'];
    const document = scanTextJson(`Table 2 Fixation percentages by group\n\n${cells.join('\n\n')}\n\n  1. * p < .025\n  2. aModerate effect size\n  3. bHigh effect size\n`);
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.p?.text, statistic.effects.map((effect) => effect.value)])).toEqual([
      ['t', 4.8, '.001', [1.52]],
      ['t', 2.05, '.047', [0.65]],
      ['t', 4.8, '.001', [1.26]],
      ['t', 1.2, '.238', [0.38]],
      ['t', 2.05, '.047', [0.84]],
    ]);
  });

  it('reads a one-cell-per-line table whose header is two full rows (groups, "X 2/t" and p over "n (%)" cells): chi-square for the rows of counts, t for the rows of means ± SD (real corpus dwoi-01)', () => {
    // A journal's web table as text (tests/corpus/real/passages/dwoi-01.txt, CC BY 4.0): blank lines between cells, lines
    // of spaces for empty cells, the test named by a letter after each p. The numbers are made up. (χ2(1) = 1.10 gives
    // p = .29, 0.42 gives .52; t(40) = 0.52 gives .61, 2.31 gives .026: SciPy 1.10.1 scipy.stats.chi2.sf and t.sf.)
    const cells = ['Item', 'Group A', 'Group B', 'Total', 'X 2/t', 'p', 'n (%)', 'n (%)', 'n (%)', '  ',
      'Ward type', '   ', '1.10', '0.29 a', '  Medical', '12 (57.1)', '9 (42.9)', '21 (50.0)', '  ', '  Surgical', '9 (42.9)', '12 (57.1)', '21 (50.0)', '  ',
      'Shift pattern', '   ', '0.42', '0.52 a', '  Fixed', '14 (66.7)', '12 (57.1)', '26 (61.9)', '  ', '  Rotating', '7 (33.3)', '9 (42.9)', '16 (38.1)', '  ',
      'Age (yr) (means±SD)', '27.10 ± 2.40', '26.72 ± 2.31', '26.91 ± 2.34', '0.52', '0.61 b',
      'Experience (yr) (means±SD)', '6.80 ± 2.10', '5.31 ± 2.08', '6.06 ± 2.21', '2.31', '0.026 b'];
    const document = scanTextJson(`Skip to main content\n\nTable 1 Characteristics of the two groups\n\n${cells.join('\n\n')}\n\n  1. a: Chi-square; b: independent 2-sample t test, 2 tailed\n`);
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.p?.text])).toEqual([
      ['chi2', 1.1, '0.29'],
      ['chi2', 0.42, '0.52'],
      ['t', 0.52, '0.61'],
      ['t', 2.31, '0.026'],
    ]);
  });

  it('reads a crushed table whose last column "P value (χ2)" holds each test as "p (χ2, df)", whatever its other columns, and nothing from such a line without a table title (real corpus dvzh-01)', () => {
    // A journal's web table as text (tests/corpus/real/passages/dvzh-01.txt, CC BY 4.0): rows crushed into single spaces,
    // a factor's second level on a line of its own, the test's cell last. The numbers are made up. (χ2(1) = 11.20 gives
    // p = .0008, 4.10 gives .043: SciPy 1.10.1 scipy.stats.chi2.sf.)
    const rows = [
      'Variables Condition No. examined dogs No of infested dogs (%) Relative risk (95% confidence interval) P value (χ2)',
      'Sex Male 210 150 (71) 0.7410 (0.62–0.88) 0.001 (11.20,1)',
      'Female 90 40 (44)',
      'Housing Kennel 120 90 (75) 1.210 (1.01–1.45) 0.04 (4.10, 1)',
      'Yard 180 100 (56)',
    ].join('\n');
    const document = scanTextJson(`Table 3.\n\nRisk factors for infestation\n\n${rows}\n\nThe next section.\n`);
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.text])).toEqual([
      ['chi2', 11.2, [1], '0.001'],
      ['chi2', 4.1, [1], '0.04'],
    ]);
    expect(scanTextJson(`Some prose first.\n\n${rows}\n\nThe next section.\n`).statistics.filter((statistic) => statistic.value === 11.2)).toEqual([]);
  });

  it('keeps the effect size of a result written whole in a crushed cell whose next row\'s label runs onto it', () => {
    // A table whose cells a PDF's text glued together, each row ending in its test written out
    // (tests/corpus/real/passages/dwqa-02.txt, CC BY); the numbers are made up.
    const text = [
      'Table 5',
      'Comparison by condition.MetricGroup AGroup B% ChangeStatistical Significance',
      'Reading Time (Part 1)210 ms250 ms+19.0%t(60) = 2.41, p = 0.019, d = 0.61Reading Time ',
      '(Part 2)190 ms230 ms+21.1%t(60) = 3.12, p = 0.003, d = 0.79K-Score ',
      '(Part 1)0.200.31+55.0%t(60) = 1.20, p = 0.235, d = 0.30',
    ].join('\n');
    const document = scanTextJson(`${text}\n\nThe next section.\n`);
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.effects.map((effect) => [effect.kind, effect.value])])).toEqual([
      ['t', 2.41, [60], [['cohens-d', 0.61]]],
      ['t', 3.12, [60], [['cohens-d', 0.79]]],
      ['t', 1.2, [60], [['cohens-d', 0.3]]],
    ]);
  });

  it('reads each F\'s df pair printed in an unnamed cell right before it ("(1, 6) 43.7 <0.001"), crushed, with tabs or aligned, and gives the F after no such cell no df', () => {
    // Side-by-side ANOVA blocks whose df stand in brackets before each F under no column name, the interaction's F
    // without any (tests/corpus/real/passages/dvyc-01.txt, CC BY); the numbers are made up.
    const rows = [
      ['', 'Control', 'Biochar', '', 'Treatment', '', '', 'Time', '', 'Interaction', ''],
      ['Pool', 'mean', 'mean', '', 'F', 'P', '', 'F', 'P', 'F', 'P'],
      ['Carbon', '18.66', '47.43', '(1, 6)', '48.4', '<0.001', '(2, 12)', '37.5', '<0.001', '2.5', '0.165'],
      ['Nitrogen', '1.47', '1.64', '(1, 6)', '5.3', '0.062', '(6, 36)', '218.7', '<0.001', '0.3', '0.778'],
    ];
    const layouts: Record<string, (row: string[]) => string> = {
      crushed: (row) => row.filter((cell) => cell !== '').join(' '),
      tabs: (row) => row.join('\t'),
      aligned: (row) => row.map((cell) => cell.padEnd(10)).join('  ').trimEnd(),
    };
    for (const [layout, render] of Object.entries(layouts)) {
      const document = scanTextJson(`Table 2. ANOVA of the soil data\n${rows.map(render).join('\n')}\n\nThe next section.\n`);
      expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.text]), layout).toEqual([
        ['F', 48.4, [1, 6], '0.001'],
        ['F', 37.5, [2, 12], '0.001'],
        ['F', 2.5, [], '0.165'],
        ['F', 5.3, [1, 6], '0.062'],
        ['F', 218.7, [6, 36], '0.001'],
        ['F', 0.3, [], '0.778'],
      ]);
    }
  });

  it('reads an aligned or crushed table whose rows name a phase by a number, end in a column of arrows and hold a row of NA cells', () => {
    // Post-hoc model tests per phase, "Estimate ± SE | Z | Df | p" and a column of arrows for the direction of each
    // difference, later rows of a variable starting with the phase's number (tests/corpus/real/passages/dwdc-01.txt,
    // CC BY, in an aligned copy); the numbers are made up (each p the two-sided normal p of its z, SciPy 1.17.1 scipy.stats.norm.sf, computed when
    // the test was written).
    const text = [
      'Table 2. Model results per phase.',
      'Variable   Phase   Estimate ± SE   Z   Df   p   Differences between test 1 and test 2',
      'Control group   Time spent inside   1   0.91 ± 0.36   2.05   1   0.040   ↘',
      '2   1.04 ± 0.53   1.32   1   0.187   −',
      'Exploration outside   1   0.09 ± 0.22   0.03   1   0.976   −',
      '2   NA   NA   NA   NA   NA',
      '3   0.85 ± 0.24   2.97   1   0.003   ↘↘',
    ].join('\n');
    // (Crushed, the header's last column of remarks holds "test", a name of label columns, and numbers: one column still.)
    for (const layout of [text, text.replace(/ {3}/g, ' ')]) {
      const document = scanTextJson(`${layout}\n\nThe next section.\n`);
      expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.p?.text])).toEqual([
        ['z', 2.05, '0.040'],
        ['z', 1.32, '0.187'],
        ['z', 0.03, '0.976'],
        ['z', 2.97, '0.003'],
      ]);
    }
  });

  it('reads a crushed table whose rows end their label with the test\'s name and hold "4.95, df = 4254.7" beside an n column, a row broken after its statistic', () => {
    // "Factor | Hypothesis | Test | Statistic | n | p-Value" crushed into single spaces, the rows' cells broken over two
    // lines after the statistic as the copy gives them (tests/corpus/real/passages/divb-01.txt, CC BY); the numbers
    // are made up (each p the two-sided p of its t, or of its r with n − 2 df: SciPy 1.17.1, computed when the test was
    // written). A correlation's df come from its row's n (n − 2).
    const text = [
      'Table 3.',
      'Factor Hypothesis Test Statistic n p-Value',
      'Fearfulness Older dogs more fearful t-test 3.12, df = 812.4',
      '830 0.0019',
      'Activity',
      'Older dogs less active correlation −0.21 640 <0.0001',
      'Fearful dogs less active correlation −0.12 830 0.0005',
    ].join('\n');
    const document = scanTextJson(`${text}\n\nThe next section.\n`);
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.text])).toEqual([
      ['t', 3.12, [812.4], '0.0019'],
      ['r', -0.21, [638], '0.0001'],
      ['r', -0.12, [828], '0.0005'],
    ]);
  });

  it('reads a corrected df pair run onto the cell before its F whose error df rounding left whole ("0.436 (1.2, 7) 7.2")', () => {
    // The layout of tests/corpus/real/passages/dvyc-01.txt (CC BY), crushed; the numbers are made up (F(1.2, 7) = 7.2
    // gives p = .028: SciPy 1.17.1 scipy.stats.f.sf, computed when the test was written).
    const text = ['Table 2. ANOVA of the soil data', 'Pool Control Biochar Treatment Time Interaction', 'mean mean F P F P F P', 'Water 0.14 0.17 (1, 6) 0.7 0.436 (1.2, 7) 7.2 0.028 1.6 0.246', 'Carbon 18.66 47.43 (1, 6) 48.4 <0.001 (2, 12) 37.5 <0.001 2.5 0.165'].join('\n');
    const document = scanTextJson(`${text}\n\nThe next section.\n`);
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.text])).toEqual([
      ['F', 0.7, [1, 6], '0.436'],
      ['F', 7.2, [1.2, 7], '0.028'],
      ['F', 1.6, [], '0.246'],
      ['F', 48.4, [1, 6], '0.001'],
      ['F', 37.5, [2, 12], '0.001'],
      ['F', 2.5, [], '0.165'],
    ]);
  });

  it('reads a crushed table whose caption goes on in a line listing abbreviations ("OR, odds ratio; CI, confidence interval; …"), not taken for its header', () => {
    // The layout of tests/corpus/real/passages/dxba-01.txt (CC BY), crushed as a PDF's text gives it, the caption
    // broken inside a word; the numbers are made up (z = 2.10 gives p = .0357, z = -3.00 gives p = .0027: SciPy
    // 1.10.1 2 * scipy.stats.norm.sf, computed when the test was written).
    const text = [
      'Table 2. Logistic model of passing the test. Passing was coded 0 (failed) or 1 (pass-',
      'ed). OR, odds ratio; CI, confidence interval; LL, lower limit; UL, upper limit; GPA, grade point average. Significance levels:',
      'p < 0.01, **; p < 0.05, *.',
      '95% CI z p',
      'OR LL UL',
      'Intercept 2.31 1.06 5.01 2.10 0.036 *',
      'Practice (yes) 0.41 0.23 0.74 −3.00 0.003 **',
      'GPA (z) 1.12 0.86 1.45 0.85 0.90',
    ].join('\n');
    const document = scanTextJson(`${text}\n\nThe next section.\n`);
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.p?.text])).toEqual([
      ['z', 2.1, '0.036'],
      ['z', -3, '0.003'],
      ['z', 0.85, '0.90'],
    ]);
    // The last row's p (.90) is not what z = 0.85 gives (.395).
    expect(document.statistics.map((statistic) => statistic.findings.some((finding) => finding.rule === 'p-value-mismatch'))).toEqual([false, false, true]);
  });

  it('reads a crushed header whose df columns are named "df num" and "df den" (each pair one name, not "df", "num df", "den")', () => {
    // A header form of numerator and denominator df columns (common practice in statistics programs' output); the
    // numbers are made up (F(3, 96) = 4.10 gives p = .0088, F(1, 96) = 6.50 gives p = .0124: SciPy 1.10.1
    // scipy.stats.f.sf, computed when the test was written).
    const text = ['Table 3. Tests of the fixed effects', 'Source df num df den F p', 'Load 3 96 4.10 .009', 'Time 1 96 6.50 .12'].join('\n');
    const document = scanTextJson(`${text}\n\nThe next section.\n`);
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.text])).toEqual([
      ['F', 4.1, [3, 96], '.009'],
      ['F', 6.5, [1, 96], '.12'],
    ]);
    expect(document.statistics.map((statistic) => statistic.findings.some((finding) => finding.rule === 'p-value-mismatch'))).toEqual([false, true]);
  });

  it('reads an F cell with its df in brackets under a plain "F" in a crushed row of group means ("2.90 (2, 132)")', () => {
    // A layout of tables comparing groups (common practice: "M (SD)" per group, then the test); the numbers are made
    // up (F(2, 132) = 2.90 gives p = .0586, F(2, 132) = 9.48 gives p = .00014: SciPy 1.10.1 scipy.stats.f.sf,
    // computed when the test was written).
    const text = ['Table 3. Group means and tests', 'Measure Placebo Control Training F p', 'Sleep 6.28 (1.89) 5.46 (0.82) 5.18 (1.77) 2.90 (2, 132) 0.059', 'Mood 6.93 (0.45) 2.10 (0.42) 4.60 (1.18) 9.48 (2, 132) 0.01'].join('\n');
    const document = scanTextJson(`${text}\n\nThe next section.\n`);
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.text])).toEqual([
      ['F', 2.9, [2, 132], '0.059'],
      ['F', 9.48, [2, 132], '0.01'],
    ]);
    expect(document.statistics.map((statistic) => statistic.findings.some((finding) => finding.rule === 'p-value-mismatch'))).toEqual([false, true]);
  });

  it('reads a pipe table that runs over a page break (the page\'s lines and the header printed again between its rows), its error df after the break', () => {
    // A PDF converted to Markdown (as tests/corpus/real/passages/dwrc-02.txt was; common practice of such converters
    // to keep a page's running head and number); the numbers are made up (F(2, 88) = 4.21 gives p = .0179, F(1, 88)
    // = 6.80 gives p = .0107, F(2, 88) = 1.12 gives p = .331: SciPy 1.10.1 scipy.stats.f.sf, computed when the test
    // was written).
    const text = [
      'Table 4. Analysis of variance of the recall scores',
      '| Source | df | F | p |',
      '|---|---|---|---|',
      '| Group | 2 | 4.21 | .018 |',
      '| Cue | 1 | 6.80 | .011 |',
      'Journal of Invented Studies (2024) 12:345',
      'Page 7 of 12',
      '| Source | df | F | p |',
      '|---|---|---|---|',
      '| Group × Cue | 2 | 1.12 | .033 |',
      '| Error | 88 | | |',
    ].join('\n');
    const document = scanTextJson(`${text}\n\nThe next section.\n`);
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.text])).toEqual([
      ['F', 4.21, [2, 88], '.018'],
      ['F', 6.8, [1, 88], '.011'],
      ['F', 1.12, [2, 88], '.033'],
    ]);
    expect(document.statistics.map((statistic) => statistic.findings.some((finding) => finding.rule === 'p-value-mismatch'))).toEqual([false, false, true]);
  });

  it('reads a tab table whose rows put each p under its value, on a line of leading tabs ("\\t\\t(.006)"), and its error row after them', () => {
    // A layout of tables that print the p on the row under its statistic (tests/corpus/real/README.md,
    // "table:value-p-two-rows"); the numbers are made up (F(1, 181) = 12.19 gives p = .0006, F(2, 181) = 5.34 gives
    // p = .0056: SciPy 1.10.1 scipy.stats.f.sf, computed when the test was written). Before, the first such line
    // ended the table, and the F's took no error df.
    const text = ['Table 2. Outcomes at follow-up', 'Source\tdf\tF', 'Time\t1\t12.19', '\t\t(<.001)', 'Group × Time\t2\t5.34', '\t\t(.006)', 'Error\t181\t'].join('\n');
    const document = scanTextJson(`${text}\n\nThe next section.\n`);
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df])).toEqual([
      ['F', 12.19, [1, 181]],
      ['F', 5.34, [2, 181]],
    ]);
    // The lines of p are no statistics of their own: nothing is listed as not read.
    expect(document.tablesNotRead).toEqual([]);
  });

  it('reads rows whose label sets a factor to a level by name ("ROI = Anterior Inferred vs. Given"), crushed or apart by runs of spaces', () => {
    // The layout of corpus passage dvzi-01 (contrasts nested under "ROI = <region>" in the label, a df column then F
    // and p); the numbers are made up (F(1, 23) = 18.20 gives p = .00029, 4.10 gives .0546, 7.61 gives .0112, 3.53
    // gives .0730: SciPy 1.10.1 scipy.stats.f.sf, computed when the test was written).
    const rows = [
      ['ROI = Anterior', 'Inferred vs. Given', '1, 23', '18.20', '<.001'],
      ['New vs. Given', '1, 23', '4.10', '.055'],
      ['ROI = Posterior', 'Inferred vs. Given', '1, 23', '7.61', '.011'],
      ['New vs. Given', '1, 23', '3.53', '.073'],
    ];
    for (const separator of [' ', '   ']) {
      const table = [['', 'df', 'F', 'p'].filter((cell) => cell !== '' || separator !== ' '), ...rows].map((row) => row.join(separator)).join('\n');
      const document = scanTextJson(`Table 2. Contrasts of the conditions in each region\n${table}\n\nThe next section.\n`);
      expect(readAs(document.statistics), JSON.stringify(separator)).toEqual([
        ['F', 18.2, [1, 23]],
        ['F', 4.1, [1, 23]],
        ['F', 7.61, [1, 23]],
        ['F', 3.53, [1, 23]],
      ]);
    }
  });

  it('reads side-by-side blocks aligned by position whose titles stand over a header that names each block\'s columns again, df from an Error row', () => {
    // The layout of corpus passage dwdf-01 (a title over each block of "df … F p", an error row under them), as a
    // PDF's layout copy aligns it by position; the numbers are made up (F(2, 198) = 3.56 gives p = .0303, F(2, 46) =
    // 15.03 gives p < .001, F(1, 198) = 1.18 gives .279, F(1, 46) = 10.04 gives .0027: SciPy 1.10.1
    // scipy.stats.f.sf, computed when the test was written).
    const text = [
      'Table 1. Analyses of variance of both outcomes',
      '          Confidence                 Errors',
      'Source    df           F      p      df       F       p',
      'Session   2            3.56   .030   2        15.03   .000',
      'Block     1            1.18   .279   1        10.04   .003',
      'Error     198                        46',
    ].join('\n');
    const document = scanTextJson(`${text}\n\nThe next section.\n`);
    expect(readAs(document.statistics)).toEqual([
      ['F', 3.56, [2, 198]],
      ['F', 15.03, [2, 46]],
      ['F', 1.18, [1, 198]],
      ['F', 10.04, [1, 46]],
    ]);
  });

  it('reads a t cell with its df in brackets under a plain "t" in crushed rows of group means ("-2.16 (40)"), not a mean and SD of a row without its t', () => {
    // A layout of tables comparing two groups (common practice: "M (SD)" per group, then the test); the numbers are
    // made up (t(40) = -2.16 gives p = .0368, 1.68 gives .1008: SciPy 1.10.1 scipy.stats.t.sf, computed when the
    // test was written).
    const rows = [
      ['Measure', 'Training (n = 21)', 'Control (n = 21)', 't', 'p'],
      ['Mood', '35.2 (12)', '40.1 (11)', '-2.16 (40)', '.037'],
      ['Anxiety', '30.2 (10)', '33.1 (9)'],
      ['Sleep', '7.88 (1.03)', '3.79 (0.55)', '1.68 (40)', '.101'],
    ];
    const crushed = rows.map((row) => row.join(' ')).join('\n');
    const cellPerLine = rows.map((row) => row.join('\n\n')).join('\n\n');
    for (const table of [crushed, cellPerLine]) {
      const document = scanTextJson(`Table 2. Group means and tests\n\n${table}\n\nThe next section.\n`);
      // (The row without its t keeps "40.1 (11)" under Control: it is no t with 11 df.)
      expect(readAs(document.statistics), table.slice(0, 60)).toEqual([
        ['t', -2.16, [40]],
        ['t', 1.68, [40]],
      ]);
    }
  });

  it('reads an aligned header of two lines whose second starts with the F column, under a caption line (not names stacked over the F)', () => {
    // The layout of corpus passage divf-01 (a caption line, "Variable   Group   Overall time effect   Interaction
    // …" over "F (dfM, dfR)   p   η² …", the cells apart by runs of spaces); the numbers are made up (F(2, 98) =
    // 9.34 gives p = .00019, F(4, 98) = 0.57 gives .685, F(2, 98) = 2.81 gives .0651, F(4, 98) = 0.25 gives .909:
    // SciPy 1.10.1 scipy.stats.f.sf, computed when the test was written).
    const text = [
      'Table 2.',
      'Overall time and group effects and within-group effect sizes for stress and stress-related symptoms',
      'Variable   Group   Overall time effect   Interaction time × group',
      'F (dfM, dfR)   p   η²   F (dfM, dfR)   p   η²',
      'Stress   Training   9.34 (2, 98)   < 0.001   0.16   0.57 (4, 98)   0.687   0.02',
      'Mood   Training   2.81 (2, 98)   0.065   0.05   0.25 (4, 98)   0.908   0.01',
    ].join('\n');
    const document = scanTextJson(`${text}\n\nThe next section.\n`);
    expect(readAs(document.statistics)).toEqual([
      ['F', 9.34, [2, 98]],
      ['F', 0.57, [4, 98]],
      ['F', 2.81, [2, 98]],
      ['F', 0.25, [4, 98]],
    ]);
  });

  it('reads partial correlations as software prints them whose "Significance (2-tailed)" a narrow column wrapped over two lines', () => {
    // The layout of corpus passage divt-05 (per variable a "Correlation", a "Significance (2-tailed)" and a "df" row),
    // its p row's name wrapped as a PDF's narrow column wraps it; the numbers are made up (r = -0.448 with df 52 gives
    // p = .00068, -0.361 gives .0073, -0.166 gives .230, -0.255 gives .0628: SciPy 1.10.1, 2 * scipy.stats.t.sf(|r| *
    // sqrt(52 / (1 - r²)), 52), computed when the test was written).
    const text = [
      'Table 3.',
      'Partial correlations between sleep quality and heart rate variability (n = 56).',
      'Control Variables: Age and BMI Sleep Latency Daytime Dysfunction',
      'Stress VLF Correlation −0.448 −0.361',
      'Significance',
      '(2-tailed) 0.001 * 0.007 *',
      'df 52 52',
      'Stress HF Correlation −0.166 −0.255',
      'Significance',
      '(2-tailed) 0.230 0.063',
      'df 52 52',
    ].join('\n');
    const document = scanTextJson(`${text}\n\nThe next section.\n`);
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.text])).toEqual([
      ['r', -0.448, [52], '0.001'],
      ['r', -0.361, [52], '0.007'],
      ['r', -0.166, [52], '0.230'],
      ['r', -0.255, [52], '0.063'],
    ]);
  });

  it('reads every row of a correlation table apart by runs of spaces, also those whose label is a group and a variable in two cells', () => {
    // The layout of corpus passage divq-07 (a caption naming correlations, a group's name and its first variable in
    // two cells of the first row, the other rows one label); the correlations are made up, read as printed (no n).
    const text = [
      'Table 3.',
      'Spearman’s coefficients for correlations between gait parameters and test scores.',
      'Gait Variables   MMSE   ACE-R',
      'Spatial-temporal parameters   Gait speed   0.449   0.430',
      'Stride length   0.446   0.422',
      'Cadence   0.199   0.191',
      'Harmonic Ratio   HR AP direction   0.323   0.303',
      'HR ML direction   0.213   0.251',
    ].join('\n');
    const document = scanTextJson(`${text}\n\nThe next section.\n`);
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value])).toEqual([
      ['r', 0.449],
      ['r', 0.43],
      ['r', 0.446],
      ['r', 0.422],
      ['r', 0.199],
      ['r', 0.191],
      ['r', 0.323],
      ['r', 0.303],
      ['r', 0.213],
      ['r', 0.251],
    ]);
  });

  it('reads a chi-square table one cell per line whose p are given by stars only, its group columns named by no vocabulary ("Cases n (%)")', () => {
    // The layout of a case-control comparison copied one cell per line (generic: "Risk factor" / "Cases n (%)" /
    // "Controls n (%)" / "χ2 (df = 2)", a note giving the stars' p); the numbers are made up (χ2(2) = 13.55 gives p =
    // .0011, 7.40 gives .025, 4.10 gives .129: SciPy 1.10.1 scipy.stats.chi2.sf, computed when the test was written).
    for (const labelName of ['Risk factor', 'Characteristic']) {
      const rows = [
        [labelName, 'Cases n (%)', 'Controls n (%)', 'χ2 (df = 2)'],
        ['Smoking', '41 (45.6)', '22 (24.4)', '13.55**'],
        ['Alcohol use', '30 (33.3)', '18 (20.0)', '7.40*'],
        ['Region', '25 (27.8)', '17 (18.9)', '4.10*'],
      ];
      const text = ['Table 1. Exposures of cases and controls', ...rows.flat(), 'Note. *p < .05. **p < .01. ***p < .001.'].join('\n');
      const document = scanTextJson(`${text}\n\nThe next section.\n`);
      expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.comparator, statistic.p?.value]), labelName).toEqual([
        ['chi2', 13.55, [2], '<', 0.01],
        ['chi2', 7.4, [2], '<', 0.05],
        ['chi2', 4.1, [2], '<', 0.05],
      ]);
      // The last row's star (p < .05) is not what χ2(2) = 4.10 gives (.129).
      expect(document.statistics.map((statistic) => statistic.findings.some((finding) => finding.rule === 'p-value-mismatch')), labelName).toEqual([false, false, true]);
    }
  });

  it('reads a table copied one cell per line with a lone "|" closing every cell, a test\'s row ("Z") with its p in the row below ("P")', () => {
    // The layout of tune passage dxab-01 (a preprint page's table as text: each cell followed by a line holding "|",
    // two pipes in a row for an empty cell, a header cell over two lines); the numbers are made up (z = -2.10 gives
    // two-sided p = .036, -3.00 gives .0027, 0.85 gives .395: SciPy 1.10.1 2 * scipy.stats.norm.sf(|z|), computed
    // when the test was written).
    const rows = [
      ['Variables', 'Frequency (n)\n/Percentage (%)', 'Sleep/P50 (P25, P75)', 'Mood/P50 (P25, P75)', 'Stress/P50 (P25, P75)'],
      ['Gender', '', '', '', ''],
      ['Male', '402/44.0', '12.00 (11.00, 13.00)', '8.00 (7.00, 9.00)', '3.00 (2.00, 5.00)'],
      ['Female', '510/56.0', '13.00 (11.00, 14.00)', '9.00 (7.00, 10.00)', '3.00 (2.00, 5.00)'],
      ['Z', '', '-2.10', '-3.00', '0.85'],
      ['P', '', '0.036', '0.003', '0.040'],
    ];
    const cells = rows.flat().flatMap((cell) => (cell === '' ? ['|'] : [cell, '|']));
    const text = ['Table 1. Characteristics of the participants (n = 912)', ...cells].join('\n');
    const document = scanTextJson(`${text}\n\nThe next section.\n`);
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.p?.text])).toEqual([
      ['z', -2.1, '0.036'],
      ['z', -3, '0.003'],
      ['z', 0.85, '0.040'],
    ]);
    // The last p (.040) is not what z = 0.85 gives (.395).
    expect(document.statistics.map((statistic) => statistic.findings.some((finding) => finding.rule === 'p-value-mismatch'))).toEqual([false, false, true]);
  });

  it('reads a t cell with its df in brackets under a plain "t", crushed or one cell per line ("2.28 (76)"), but never a group\'s "M (n)" as a t', () => {
    // A layout of tables comparing two groups (common practice: "M (SD)" per group, then the test); the numbers are
    // made up (t(76) = -1.29 gives p = .201, 2.28 gives .025, 2.60 gives .011: SciPy 1.10.1 2 * scipy.stats.t.sf,
    // computed when the test was written).
    const rows = [
      ['Measure', 'Control (n = 39)', 'Drug (n = 39)', 't', 'p'],
      ['Sleep quality', '7.06 (1.03)', '4.82 (1.79)', '−1.29 (76)', '.201'],
      ['Mood', '3.66 (1.64)', '7.88 (1.62)', '2.28 (76)', '.025'],
      ['Anxiety', '5.12 (0.90)', '4.40 (1.21)', '2.60 (76)', '.04'],
    ];
    for (const layout of ['crushed', 'one cell per line']) {
      const body = layout === 'crushed' ? rows.map((row) => row.join(' ')) : rows.flat();
      const document = scanTextJson(['Table 2. Comparison of the groups', ...body, '', 'The next section.', ''].join('\n'));
      expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.text]), layout).toEqual([
        ['t', -1.29, [76], '.201'],
        ['t', 2.28, [76], '.025'],
        ['t', 2.6, [76], '.04'],
      ]);
      // The last row's p (.04) is not what t(76) = 2.60 gives (.011).
      expect(document.statistics.map((statistic) => statistic.findings.some((finding) => finding.rule === 'p-value-mismatch')), layout).toEqual([false, false, true]);
    }
    // Group columns of a mean with its n ("5.20 (24)") beside a plain t: the t is read without df, no mean as a t.
    const counts = [['Measure', 'Control M (n)', 'Drug M (n)', 't', 'p'], ['Sleep', '5.20 (24)', '6.10 (25)', '2.28', '.025'], ['Mood', '4.90 (24)', '5.70 (25)', '', '']];
    for (const layout of ['crushed', 'one cell per line']) {
      const body = layout === 'crushed' ? counts.map((row) => row.filter((cell) => cell !== '').join(' ')) : counts.flat().filter((cell) => cell !== '');
      const document = scanTextJson(['Table 2. Comparison of the groups', ...body, '', 'The next section.', ''].join('\n'));
      expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df]), layout).toEqual([['t', 2.28, []]]);
    }
  });

  it('reads the cells of a value with its df ("6.2 (4)") under a "χ2(df)" header in a table copied one cell per line whose rows\' order is lost, each without a p', () => {
    // The layout of tune passage dxbc-01 (a PDF's text giving a table column block by column block: the column groups'
    // names, the row groups', the "χ2(df)" / "p-value" sub-headers, then two countries' χ2 cells side by side before
    // the first country's p); the numbers are made up.
    const header = ['Region A', 'Region B', 'Region C', 'LRT (block 1)', 'LRT (block 2)', 'R2', 'AIC', 'χ2(df)', 'p-value', 'χ2(df)', 'p-value', 'Model 0', 'Model 1', 'Model 0', 'Model 1'];
    const scattered = ['8.10 (4)', '120.3 (4)', '0.088', '-', '0.013', '0.091', '139.3', '141.0', '< 0.001', '-', '0.044', '0.196', '1447.5', '1310.0', '21.7 (4)', '< 0.001', '-', '0.045', '0.118', '417.2', '406.0'];
    const text = ['Table 4 Likelihood ratio tests and fit of the regression models', '', ...header.flatMap((cell) => [cell, '']), ...scattered, '', 'The next section.', ''].join('\n');
    const document = scanTextJson(text);
    // Each value with the df its cell holds, none with a p: nothing ties a p to it.
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p])).toEqual([
      ['chi2', 8.1, [4], null],
      ['chi2', 120.3, [4], null],
      ['chi2', 21.7, [4], null],
    ]);
    // Where a column of means holds brackets too ("Mean (SD)"), "8.10 (4)" could be a mean and its n: nothing is read.
    const withMeans = text.replace('R2', 'Mean (SD)');
    expect(scanTextJson(withMeans).statistics).toEqual([]);
  });

  it('reads each F with the p printed on the line under its value, crushed, aligned or one cell per line, up to the error row', () => {
    // The layout of the tab copies read already ("Source df F", each F's p on the next line under it, then "Error");
    // the numbers are made up. p from SciPy 1.x (/usr/bin/python3): f.sf(6.20, 1, 48) = 0.0163, f.sf(4.10, 2, 48) =
    // 0.0227, f.sf(0.85, 1, 48) = 0.361, f.sf(14.90, 1, 48) = 0.00034.
    const rows: [string, string, string, string][] = [
      ['Group', '1', '6.20', 'p = .016'],
      ['Age', '2', '4.10', '(.023)'],
      ['Dose', '1', '0.85', '(.361)'],
      ['Group × Age', '1', '14.90', 'p < .001'],
    ];
    const pad = (cell: string, width: number) => cell + ' '.repeat(Math.max(1, width - cell.length));
    const copies: Record<string, string[]> = {
      crushed: ['Source df F', ...rows.flatMap(([label, df, f, p]) => [`${label} ${df} ${f}`, p]), 'Error 48'],
      aligned: [
        `${pad('Source', 15)}${pad('df', 5)}F`,
        ...rows.flatMap(([label, df, f, p]) => [`${pad(label, 15)}${pad(df, 5)}${f}`, `${' '.repeat(20)}${p}`]),
        `${pad('Error', 15)}48`,
      ],
      'one cell per line': ['Source', 'df', 'F', ...rows.flat(), 'Error', '48'],
    };
    for (const [copy, lines] of Object.entries(copies)) {
      const text = ['Table 2. Outcomes at follow-up', ...lines, '', 'The next section.', ''].join('\n');
      const document = scanTextJson(text);
      expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.text]), copy).toEqual([
        ['F', 6.2, [1, 48], '.016'],
        ['F', 4.1, [2, 48], '.023'],
        ['F', 0.85, [1, 48], '.361'],
        ['F', 14.9, [1, 48], '.001'],
      ]);
      // Each p as printed is what its F and df give: nothing is flagged.
      expect(document.statistics.flatMap((statistic) => statistic.findings.map((finding) => finding.rule)), copy).not.toContain('p-value-mismatch');
    }
    // A p line that stands under another column than the F's (here the df's) is not the F's p: no row takes it.
    const elsewhere = ['Table 2. Outcomes at follow-up', 'Source         df   F', 'Group          1    6.20', '               p = .016', 'Age            2    4.10', 'Error          48', '', 'Next.', ''].join('\n');
    expect(scanTextJson(elsewhere).statistics.map((statistic) => [statistic.value, statistic.p?.text ?? null])).not.toContainEqual([6.2, '.016']);
  });

  it('reads columns headed by a test named with "test statistic" ("Z-test statistic2", "t-test statistic", "Chi-square test statistic")', () => {
    // Layout as journal pages print it (a footnote digit glued to the header); the numbers are made up.
    const z = scanTextJson('Table 3\nRegression of bites\n\n| Predictor | IRR [95% CI] | Z-test statistic2 | P-value3 |\n|---|---|---|---|\n| Hour 2 | 1.74 [0.80-3.82] | 1.39 | 0.164 |\n| Hour 3 | 3.71 [1.77-7.78] | 3.47 | 0.001 |\n');
    expect(z.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.p?.value ?? null])).toEqual([
      ['z', 1.39, 0.164],
      ['z', 3.47, 0.001],
    ]);
    const t = scanTextJson('Table 4\nGroup differences\n\n| Measure | t-test statistic | df | p |\n|---|---|---|---|\n| Recall | 2.31 | 58 | .024 |\n');
    expect(t.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df])).toEqual([['t', 2.31, [58]]]);
  });

  it('reads a p column headed with the equals sign its cells follow ("Significance P=", "P=")', () => {
    // Layout as a journal's table page prints it; the numbers are made up.
    const document = scanTextJson('Table 2.\nFactors associated with cortisol\n\n| Factor | Significance P= | Effect size |\n|---|---|---|\n| Temperature | <0.001 | rs = 0.572 |\n| Humidity | 0.002 | rs = −0.535 |\n');
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.p?.value ?? null])).toEqual([
      ['r', 0.572, 0.001],
      ['r', -0.535, 0.002],
    ]);
  });

  it('reads a crushed header a narrow column broke in two after a name ("... Sum of squares d.f. Mean square" / "F-value P-value ...")', () => {
    // Layout as a PDF's text gives a wrapped header; the numbers are made up (283.26 / 93.62 = 3.03, 157.50 / 93.62 = 1.68).
    const document = scanTextJson(
      'Table 3.\n\nAnalysis of covariance\n\nDependent variable Source of variation Sum of squares d.f. Mean square\nF-value P-value Pairwise comparisons\nPDSFS Gender 283.26 1 283.26 3.03 0.083\nAge 157.50 1 157.50 1.68 0.196\nError 2770.16 296 93.62\n',
    );
    expect(document.statistics.map((statistic) => [statistic.value, statistic.df, statistic.p?.value ?? null])).toEqual([
      [3.03, [1, 296], 0.083],
      [1.68, [1, 296], 0.196],
    ]);
  });
});
