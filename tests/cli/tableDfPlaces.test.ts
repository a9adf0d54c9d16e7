/**
 * The places tables print df other than a df column, through the built
 * command line: block titles that each close with their statistic's df over
 * "F | p" pairs, a note's "χ2 tests with 1 df", a note under a table copied
 * one cell per line, a multivariate test's "Hyp. df" and "Err. df" columns,
 * and a header's "χ2 with 2 df". Each is a common way of printing results
 * tables (common practice, no single source); each layout follows a passage
 * of the real corpus (tests/corpus/real), named beside its test. The
 * numbers are made up; what is asserted is what is read (value and df), and
 * that no df is tied where the table does not tie it.
 */
import { describe, expect, it } from 'vitest';
import { scanTextJson } from './scanDocumentJson.js';

type Statistic = ReturnType<typeof scanTextJson>['statistics'][number];
const readAs = (statistics: Statistic[]) => statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df]);

/** The same rows as a pipe table, with tabs, crushed into single spaces and one cell per line (blank lines between). */
function layouts(rows: string[][]): Record<string, string> {
  return {
    pipe: rows.map((row) => `| ${row.join(' | ')} |`).join('\n'),
    tabs: rows.map((row) => row.join('\t')).join('\n'),
    crushed: rows.map((row) => row.filter((cell) => cell !== '').join(' ')).join('\n'),
    'one cell per line': rows.map((row) => row.map((cell) => (cell === '' ? ' ' : cell)).join('\n\n')).join('\n\n'),
  };
}

describe('df a table prints outside a df column', () => {
  // Layout of dvzf-03 (effects' blocks headed by "F (1, 24)", "F (2, 48)") and divg-05 ("Time effect, F(1,128)").
  it('gives each block the df its title closes with ("Group F(1, 58) | Time F(2, 116)" over "F | p | F | p"), in every layout', () => {
    const rows = [
      ['', 'Group F(1, 58)', '', 'Time F(2, 116)', ''],
      ['Outcome', 'F', 'p', 'F', 'p'],
      ['Anxiety', '4.21', '.045', '6.10', '.003'],
      ['Mood', '1.33', '.253', '0.48', '.620'],
    ];
    for (const [layout, table] of Object.entries(layouts(rows))) {
      const document = scanTextJson(`Results follow.\n\nTable 7\nMixed ANOVA by outcome\n${table}\n\nThe next section.\n`);
      expect(readAs(document.statistics), layout).toEqual([
        ['F', 4.21, [1, 58]],
        ['F', 6.1, [2, 116]],
        ['F', 1.33, [1, 58]],
        ['F', 0.48, [2, 116]],
      ]);
      expect(document.statistics.map((statistic) => statistic.p?.value), layout).toEqual([0.045, 0.003, 0.253, 0.62]);
    }
  });

  // Layout of dvzf-03 again, with fewer titles than blocks, or names no vocabulary knows under the titles.
  it('ties no df where block titles with df do not stand one over each block, crushed or aligned', () => {
    const threeBlocks = [
      ['', 'Group F(1, 58)', '', 'Time F(2, 116)', '', '', ''],
      ['Outcome', 'F', 'p', 'F', 'p', 'F', 'p'],
      ['Anxiety', '4.21', '.045', '6.10', '.003', '0.52', '.597'],
    ];
    const unknownNames = [
      ['', 'Group F(1, 58)', '', 'Time F(2, 116)', ''],
      ['Outcome', 'Value', 'p', 'Value', 'p'],
      ['Anxiety', '4.21', '.045', '6.10', '.003'],
    ];
    const aligned = (rows: string[][]): string => rows.map((row) => row.map((cell) => cell.padEnd(16)).join('').trimEnd()).join('\n');
    for (const table of [layouts(threeBlocks).crushed, aligned(threeBlocks)]) {
      const document = scanTextJson(`Results follow.\n\nTable 7\nMixed ANOVA by outcome\n${table}\n\nThe next section.\n`);
      // (Which block the third F is, and so its df, the titles do not say: no F takes a title's df.)
      expect(document.statistics.filter((statistic) => statistic.df.length > 0), table).toEqual([]);
    }
    for (const table of [layouts(unknownNames).crushed, aligned(unknownNames)]) {
      const document = scanTextJson(`Results follow.\n\nTable 7\nMixed ANOVA by outcome\n${table}\n\nThe next section.\n`);
      // Never a p read as an F.
      expect(document.statistics.map((statistic) => statistic.value).filter((value) => value === 0.045 || value === 0.003), table).toEqual([]);
    }
  });

  // Layout of dvzb-09 (the df stated in words in the note under a crushed table).
  it('reads the one df a note states after its number ("χ2 tests with 1 df"), and none when the note states another for one row', () => {
    const rows = [
      ['Variable', 'Control', 'Treated', 'χ2', 'p'],
      ['Smoker', '12', '20', '4.10', '.043'],
      ['Female', '30', '28', '0.25', '.617'],
    ];
    for (const [layout, table] of Object.entries(layouts(rows))) {
      const document = scanTextJson(`Results follow.\n\nTable 3\nAssociations with group\n${table}\nNote. χ2 tests with 1 df.\n\nThe next section.\n`);
      expect(readAs(document.statistics), layout).toEqual([
        ['chi2', 4.1, [1]],
        ['chi2', 0.25, [1]],
      ]);
    }
    const degree = scanTextJson(`Table 3\nAssociations with group\n${layouts(rows).tabs}\nNote. Each chi-square test has 1 degree of freedom.\n\nNext.\n`);
    expect(readAs(degree.statistics)).toEqual([
      ['chi2', 4.1, [1]],
      ['chi2', 0.25, [1]],
    ]);
    // Another df stated for one row: which row takes which is not said for every row, so no row takes either.
    const except = scanTextJson(`Table 3\nAssociations with group\n${layouts(rows).tabs}\nNote. χ2 tests with 1 df, except Female with 3 df.\n\nNext.\n`);
    expect(except.statistics.every((statistic) => statistic.df.length === 0)).toBe(true);
  });

  // Layout of divg-01 (a table copied one cell per line, its notes the lines right after its last cell).
  it('takes the df of a note right after a table copied one cell per line ("Note. F(2, 96) for all effects")', () => {
    const cells = ['Outcome', 'F', 'p', 'Anxiety', '4.21', '.018', 'Depression', '6.66', '.002'];
    for (const separator of ['\n\n', '\n']) {
      const document = scanTextJson(`Results follow.\n\nTable 2\nANOVA results for each outcome\n${cells.join(separator)}\nNote. F(2, 96) for all effects.\n\nThe next section.\n`);
      expect(readAs(document.statistics), JSON.stringify(separator)).toEqual([
        ['F', 4.21, [2, 96]],
        ['F', 6.66, [2, 96]],
      ]);
    }
  });

  // Layout of dwka-01 (a program's multivariate tests: a statistic's value, its F, "Hypothesis df", "Error df").
  it('reads a multivariate test\'s F with the df of its "Hyp. df" and "Err. df" columns, in every layout', () => {
    const rows = [
      ['Effect', "Pillai's V", 'F', 'Hyp. df', 'Err. df', 'p'],
      ['Group', '.188', '4.52', '3', '58', '.006'],
      ['Time', '.205', '5.02', '3', '58', '.004'],
    ];
    for (const [layout, table] of Object.entries(layouts(rows))) {
      const document = scanTextJson(`Results follow.\n\nTable 8\nMANOVA results\n${table}\n\nThe next section.\n`);
      expect(readAs(document.statistics), layout).toEqual([
        ['F', 4.52, [3, 58]],
        ['F', 5.02, [3, 58]],
      ]);
    }
  });

  // Layout of dwfh-01 (a chi-square column headed "Chi-square (χ2) value with 88 d.f.").
  it('reads the df a header states after "with" ("χ2 with 2 df"), crushed without taking "with 2" for a column', () => {
    const rows = [
      ['Item', 'Agree', 'Disagree', 'χ2 with 2 df', 'p'],
      ['Q1', '34', '26', '6.40', '.041'],
      ['Q2', '41', '19', '2.22', '.330'],
    ];
    for (const [layout, table] of Object.entries(layouts(rows))) {
      const document = scanTextJson(`Results follow.\n\nTable 5\nAnswers by group\n${table}\n\nThe next section.\n`);
      expect(readAs(document.statistics), layout).toEqual([
        ['chi2', 6.4, [2]],
        ['chi2', 2.22, [2]],
      ]);
    }
    const words = scanTextJson('Table 5\nAnswers by statement\n| Statement | Chi-square (χ2) value with 88 d.f. |\n| Soy oils are modified | 7.44 |\n| Crops reduce diversity | 40.33 |\n\nNext.\n');
    expect(readAs(words.statistics)).toEqual([
      ['chi2', 7.44, [88]],
      ['chi2', 40.33, [88]],
    ]);
  });
});
