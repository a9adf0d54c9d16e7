/**
 * Tables whose cells ran together when a web page's table became text
 * ("X10.997410.997426.860.0001"), read through the built command line from
 * real passages of the corpus (tests/corpus/real/passages, CC BY; their
 * sources are in the corpus manifest). What is asserted is what the rows
 * print, read by eye from the passages; the df of each F come from the
 * table's own df column and error rows.
 */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { scanDocumentJson, scanTextJson } from './scanDocumentJson.js';

const passage = (id: string): string => join(__dirname, '..', 'corpus', 'real', 'passages', `${id}.txt`);

describe('glued table rows', () => {
  it('cuts a response-surface ANOVA whose columns print different decimals, with row labels ending in digits (dwhg-01)', () => {
    const document = scanDocumentJson(passage('dwhg-01'));
    const read = document.statistics.map((statistic) => [statistic.value, statistic.df, statistic.p?.value ?? null]);
    // Rows "X10.997410.997426.860.0001" (X1: SS 0.9974, df 1, MS 0.9974, F 26.86, p .0001), "X1X40.000810.00080.02250.8829"
    // (F 0.0225 printed to four places), "X2X31.9511.9552.59<0.0001" (two places), "X1214.51114.51390.72<0.0001"
    // (label X12, F 390.72); the residual row gives df 14, the pure-error row df 4 for the lack-of-fit test.
    expect(read).toContainEqual([26.86, [1, 14], 0.0001]);
    expect(read).toContainEqual([0.0225, [1, 14], 0.8829]);
    expect(read).toContainEqual([52.59, [1, 14], 0.0001]);
    expect(read).toContainEqual([390.72, [1, 14], 0.0001]);
    expect(read).toContainEqual([41.78, [14, 14], 0.0001]);
    expect(read).toContainEqual([1.05, [10, 4], 0.526]);
    expect(read).toHaveLength(16);
  });

  it('reads a header with names no vocabulary knows and thousands separators in the cells (divx-08)', () => {
    const document = scanDocumentJson(passage('divx-08'));
    // "Pretest achievement (ANCOVA)1,082.87111,082.87181.7240.00067.8%": SS 1,082.871, df 1, MS 1,082.871, F 81.724.
    expect(document.statistics.map((statistic) => [statistic.value, statistic.df])).toEqual([
      [81.724, [1, 39]],
      [6.253, [1, 39]],
    ]);
    // F differs from MS / MS(error) in its last digits only: a warning, not a failure.
    expect(document.findings.filter((finding) => finding.severity === 'fail')).toEqual([]);
  });

  it('leaves a row whose df cut nothing decides unread and says so ("/MVC139...": df 1 and 39, or 13 and 9; divx-02)', () => {
    const document = scanDocumentJson(passage('divx-02'));
    expect(document.statistics).toEqual([]);
    expect(document.tablesNotRead).toHaveLength(1);
  });

  it('reads header names with a footnote letter set apart or a Greek footnote mark, and "value" for a lost italic P', () => {
    // Layout as journal pages print it; the numbers are made up.
    const document = scanTextJson(
      'Table 2\nTwo-way ANOVA\n\n| Effect | df c | F c | p-valueβ | ηp2 b |\n|---|---|---|---|---|\n| Group | 1, 40 | 6.20 | .017 | .13 |\n| Time | 2, 80 | 3.41 | .038 | .08 |\n\n' +
        'Table 3\nOne-way ANOVA\n\n| Source | df | F-value | value |\n|---|---|---|---|\n| Dose | 2, 57 | 4.21 | 0.020 |\n',
    );
    expect(document.statistics.map((statistic) => [statistic.value, statistic.df, statistic.p?.value ?? null])).toEqual([
      [6.2, [1, 40], 0.017],
      [3.41, [2, 80], 0.038],
      [4.21, [2, 57], 0.02],
    ]);
  });

  it('cuts glued rows printed in four styles (fixed three decimals, APA, thousands separators, significant digits) back into their cells', () => {
    // Made-up tables: each row's MS is its SS / df and its F its MS / MS(error) (worked out by hand), printed in the
    // style named; the expected F and df are the cells as printed before they were run together. In the last table
    // "641.71641.727.62" could also be cut MS 641.72, F 7.62, and "207.81207.88.945" MS 207.88, F .945: F = MS / MS
    // of the residual row decides.
    const tables = [
      ['SourceType III sum of squaresdfMean squareFSig.Partial eta squared', 'Group330.2941330.29429.7270.0000.339', 'Dose × Sex1094.7873364.92932.8440.0000.629', 'Error644.4405811.111'],
      ['SourceSSdfMSFpηp2', 'Age3416.294854.0729.73<.001.70', 'Condition1305.3011305.3045.44<.001.47', 'Error1465.005128.73'],
      ['Source of varianceSum of squaresdfMean squareF valuep value', 'Treatment64,171.00164,171.0054.66<0.001', 'Block1,427.004356.750.300.878', 'Error331,100.002821,174.11'],
      ['SourceSum of squaresdfMean squareF-valuep-value', 'Group14852742.531.96<0.0001', 'Time641.71641.727.62<0.0001', 'Dose × Time207.81207.88.9450.0032', 'Residual388016723.23'],
    ];
    const text = tables.map((rows, index) => `Table ${index + 1}\n\nANOVA results.\n\n${rows.join('\n')}\n\nNote. Made up.\n`).join('\n');
    const read = scanTextJson(text).statistics.map((statistic) => [statistic.value, statistic.df]);
    expect(read).toEqual([
      [29.727, [1, 58]],
      [32.844, [3, 58]],
      [29.73, [4, 51]],
      [45.44, [1, 51]],
      [54.66, [1, 282]],
      [0.3, [4, 282]],
      [31.96, [2, 167]],
      [27.62, [1, 167]],
      [8.945, [1, 167]],
    ]);
  });

  it('lists a glued table as not fully read when one of its rows cuts two ways, and reads the others', () => {
    // Made-up rows: "Session1391.270.2667" is df 1 and 39, or 13 and 9; the other rows cut one way only.
    const document = scanTextJson('Table 4\n\nEffects on recall.\n\nVariabledf1df2Fp\n\nGroup2401.270.29\nSession1391.270.2667\nDose3405.120.004\n\nNote. Made up.\n');
    expect(document.statistics.map((statistic) => [statistic.value, statistic.df])).toEqual([
      [1.27, [2, 40]],
      [5.12, [3, 40]],
    ]);
    expect(document.tablesNotRead.map((table) => [table.rowsWithStatistic, table.rowsRead])).toEqual([[3, 2]]);
  });
});
