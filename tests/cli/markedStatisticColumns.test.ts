/**
 * Tables whose only test columns state their df in the header and whose cells give the statistic with
 * significance marks (stars, "n.s."), no p column: crushed, a label column of statements and one statistic
 * column ("Statements Chi-square (χ2) value with 88 d.f."), or one cell per line with effect titles over
 * "F (1,128)" columns and an effect size on the line under a statistic. Read through the built command line
 * from real passages of the corpus (tests/corpus/real/passages, CC BY; their sources are in the corpus
 * manifest) and from made-up layouts whose numbers are made up. What is asserted is what is read (value, df,
 * "n.s.", effect size), that no df is guessed where the columns' df differ, and that prose is not read as such
 * a table.
 */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { scanDocumentJson, scanTextJson } from './scanDocumentJson.js';

const passage = (id: string): string => join(__dirname, '..', 'corpus', 'real', 'passages', `${id}.txt`);

type Statistic = ReturnType<typeof scanTextJson>['statistics'][number];
const readAs = (statistics: Statistic[]) =>
  statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.notSignificant === true, statistic.effects.map((effect) => effect.value)]);

describe('a statistic column whose header states its df, cells marked with stars', () => {
  it('reads a crushed table of statements with one chi-square column "with 88 d.f." (dwfh-01)', () => {
    const document = scanDocumentJson(passage('dwfh-01'));
    // Rows "+ 1. In Bangladesh, all soybean oils are GM (…) 7.44*" … "+ 10. Bt cotton will be helpful … 42.56*".
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df])).toEqual(
      [7.44, 40.33, 88.59, 44.33, 37.56, 17.45, 68.79, 69.22, 51.89, 42.56].map((value) => ['chi2', value, [88]]),
    );
    // Stars are marks: no printed p is taken from them.
    expect(document.statistics.every((statistic) => statistic.p == null || statistic.p.fromMarks !== undefined)).toBe(true);
  });

  it('reads the F cells of a one-cell-per-line table with two "F (1,128)" columns, "n.s." and η2 under a statistic (divg-01)', () => {
    const document = scanDocumentJson(passage('divg-01'));
    expect(readAs(document.statistics)).toEqual([
      ['F', 9.69, [1, 128], false, [0.18]],
      ['F', 0.14, [1, 128], true, []],
      ['F', 0, [1, 128], true, []],
      ['F', 3.23, [1, 128], true, []],
      ['F', 4.18, [1, 128], false, [0.03]],
      ['F', 0.22, [1, 128], true, []],
      ['F', 0.58, [1, 128], true, []],
      ['F', 0.11, [1, 128], true, []],
    ]);
  });

  it('reads a crushed header over cells stacked one per line, two cells on one line (divg-05)', () => {
    const document = scanDocumentJson(passage('divg-05'));
    const read = readAs(document.statistics);
    expect(read).toHaveLength(16);
    // ".10, n.s. 15.05***" then "η2 = .11": two columns' cells on one line, the effect size the second's.
    expect(read.slice(0, 4)).toEqual([
      ['F', 172.46, [1, 128], false, [0.59]],
      ['F', 84.94, [1, 128], false, [0.41]],
      ['F', 0.1, [1, 128], true, []],
      ['F', 15.05, [1, 128], false, [0.11]],
    ]);
  });

  // Made-up layouts and numbers from here on.
  it('reads a made-up crushed table of statements and one "χ2 value with 2 d.f." column under a title, and not the same lines as prose', () => {
    const rows =
      'No. Statements χ2 value with 2 d.f.\n1. The sessions were useful for my work, and for my team 12.41*\n2. I would take part again 0.87 n.s.\n3. The material was clear and well organised 9.95**\n';
    const titled = scanTextJson(`Table 2 Answers of the three groups\n\n${rows}\nThe next section.\n`);
    expect(titled.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.notSignificant === true])).toEqual([
      ['chi2', 12.41, [2], false],
      ['chi2', 0.87, [2], true],
      ['chi2', 9.95, [2], false],
    ]);
    // Without a table's title above, a line naming a statistic with its df may be prose: nothing is read.
    const prose = scanTextJson(`We compared the answers.\n\n${rows}\nThe next section.\n`);
    expect(prose.statistics).toEqual([]);
  });

  it('reads made-up F cells one per line under columns sharing one df, and none where the columns\u2019 df differ', () => {
    const table = (second: string): string =>
      [
        'Table 3 Effects of the training',
        '',
        'Outcome',
        'Group',
        'M (SD)',
        'Group effect',
        'F (1,60)',
        'Time effect',
        second,
        'Reading speed',
        'Trained',
        '52.1 (8.2)',
        '12.40***',
        'η2 = .17',
        '1.02, n.s.',
        'Untrained',
        '47.3 (9.1)',
        '  ',
        'Accuracy',
        'Trained',
        '80.2 (6.0)',
        '5.31*',
        'η2 = .08',
        '2.90, n.s.',
        'Untrained',
        '76.4 (7.7)',
        '  ',
        '',
        'The next section.',
      ].join('\n');
    expect(readAs(scanTextJson(table('F (1,60)')).statistics)).toEqual([
      ['F', 12.4, [1, 60], false, [0.17]],
      ['F', 1.02, [1, 60], true, []],
      ['F', 5.31, [1, 60], false, [0.08]],
      ['F', 2.9, [1, 60], true, []],
    ]);
    // With "F (2,120)" for the second column, which column a cell is in decides its df: the marks do not say it,
    // so these cells are left to the readers of rows, and no cell takes the other column's df.
    const differing = readAs(scanTextJson(table('F (2,120)')).statistics);
    const otherColumns = differing.filter(([, value, df]) => ([12.4, 5.31].includes(value as number) && (df as number[])[0] !== 1) || ([1.02, 2.9].includes(value as number) && (df as number[])[0] !== 2));
    expect(otherColumns).toEqual([]);
  });

  it('reads no made-up cell when a marked number stands before an unmarked one in a row (a descriptive column may carry stars)', () => {
    const text = ['Table 3 Scores', '', 'Outcome', 'Group', 'F (1,60)', 'Reading speed', 'Trained', '12.40***', '52.1', 'Accuracy', 'Trained', '5.31*', '80.2', '', 'Next.'].join('\n');
    expect(scanTextJson(text).statistics.filter((statistic) => statistic.value === 12.4 || statistic.value === 5.31)).toEqual([]);
  });
});
