import { describe, expect, it } from 'vitest';
import { findTextTables } from '../../../src/scan/tables/index.js';
import { paragraphsOf, readCellTable, readCellText, readDesignStatements } from '../../../src/scan/factorial/index.js';
import { readTextGroups } from '../../../src/scan/descriptives/readTextDescriptives.js';
import type { FactorialCellSet } from '../../../src/scan/types.js';

/** The one table found in `text`, read as cell statistics. */
function readOnlyTable(text: string): FactorialCellSet | null {
  const tables = findTextTables(text);
  expect(tables).toHaveLength(1);
  return readCellTable(tables[0]!, 0);
}

/** "level/level: mean (sd) n" for every cell, to compare a reading at a glance. */
function cellsOf(set: FactorialCellSet): string[] {
  return set.cells.map((cell) => `${cell.levels.join('/')}: ${cell.mean.text} (${cell.sd.text}) n=${cell.n}`);
}

describe('cell statistics in tables', () => {
  it('a grid of "M (SD)" cells with a marginal row and column, ns from the note', () => {
    const set = readOnlyTable(
      [
        'Table 2',
        'Recall by age group and load, M (SD)',
        '',
        '| Age group | Low load | High load | Total |',
        '| --- | --- | --- | --- |',
        '| Younger | 4.21 (1.10) | 3.80 (1.25) | 4.00 (1.18) |',
        '| Older | 3.95 (1.02) | 3.10 (1.30) | 3.52 (1.22) |',
        '| Total | 4.08 (1.06) | 3.45 (1.31) | |',
        '',
        'Note. n = 20 per cell.',
      ].join('\n'),
    )!;
    expect(set.factors).toEqual(['Age group', 'load']);
    expect(set.levels).toEqual([['Younger', 'Older'], ['Low load', 'High load']]);
    expect(set.nSource).toBe('statement');
    expect(set.tableNumber).toBe('2');
    expect(cellsOf(set)).toEqual(['Younger/Low load: 4.21 (1.10) n=20', 'Younger/High load: 3.80 (1.25) n=20', 'Older/Low load: 3.95 (1.02) n=20', 'Older/High load: 3.10 (1.30) n=20']);
  });

  it('M, SD and n sub-columns under spanning column levels, and the factor named above them', () => {
    const set = readOnlyTable(
      [
        'Table 4',
        'Recall',
        '',
        '|  | Load |  |  |  |  |  |',
        '|  | Low |  |  | High |  |  |',
        '| Age | M | SD | n | M | SD | n |',
        '| --- | --- | --- | --- | --- | --- | --- |',
        '| Younger | 4.21 | 1.10 | 20 | 3.80 | 1.25 | 21 |',
        '| Older | 3.95 | 1.02 | 19 | 3.10 | 1.30 | 22 |',
      ].join('\n'),
    )!;
    expect(set.factors[0]).toBe('Age');
    expect(set.levels).toEqual([['Younger', 'Older'], ['Low', 'High']]);
    expect(set.nSource).toBe('cell');
    expect(set.cells.map((cell) => cell.n)).toEqual([20, 21, 19, 22]);
  });

  it('long format with the outer level written once, in a crushed copy whose label cells ran together', () => {
    const set = readOnlyTable(
      ['Table 3', 'Errors by load and age', '', 'Load    Age       n    M      SD', 'Low     Younger   20   4.21   1.10', '        Older     20   3.95   1.02', 'High    Younger   20   3.80   1.25', '        Older     20   3.10   1.30'].join('\n'),
    )!;
    expect(set.factors).toEqual(['Load', 'Age']);
    expect(set.levels).toEqual([['Low', 'High'], ['Younger', 'Older']]);
    expect(set.nSource).toBe('cell');
  });

  it('group headings carry a level of their own', () => {
    const set = readOnlyTable(
      ['Table 5', 'Scores', '', '| Condition | n | M | SD |', '| --- | --- | --- | --- |', '| Low load | | | |', '| Younger | 20 | 4.21 | 1.10 |', '| Older | 20 | 3.95 | 1.02 |', '| High load | | | |', '| Younger | 20 | 3.80 | 1.25 |', '| Older | 20 | 3.10 | 1.30 |'].join('\n'),
    )!;
    expect(set.levels).toEqual([['Low load', 'High load'], ['Younger', 'Older']]);
    // The header over the label column names the rows as a whole, not one factor.
    expect(set.factors).toEqual(['load', null]);
  });

  it('three factors: two label columns and the column levels', () => {
    const set = readOnlyTable(
      [
        'Table 1',
        'Means (SDs) of recall',
        '',
        '| Age | Load | Quiet | Noise |',
        '| --- | --- | --- | --- |',
        '| Younger | Low | 4.2 (1.1) | 4.0 (1.2) |',
        '| | High | 3.8 (1.3) | 3.5 (1.2) |',
        '| Older | Low | 3.9 (1.0) | 3.6 (1.1) |',
        '| | High | 3.1 (1.3) | 2.7 (1.4) |',
      ].join('\n'),
    )!;
    expect(set.factors).toEqual(['Age', 'Load', null]);
    expect(set.levels).toEqual([['Younger', 'Older'], ['Low', 'High'], ['Quiet', 'Noise']]);
    expect(set.cells).toHaveLength(8);
    expect(set.nSource).toBeNull();
  });

  it('reads nothing from a table that is not a full factorial or not means', () => {
    // One factor only.
    expect(readOnlyTable(['Table 1', 'Means', '', '| Group | M | SD |', '| --- | --- | --- |', '| A | 4.2 | 1.1 |', '| B | 3.9 | 1.0 |', '| C | 3.1 | 1.2 |'].join('\n'))).toBeNull();
    // A cell missing.
    expect(
      readOnlyTable(['Table 1', 'Scores', '', '| Age | Load | n | M | SD |', '| --- | --- | --- | --- | --- |', '| Younger | Low | 20 | 4.2 | 1.1 |', '| | High | 20 | 3.8 | 1.3 |', '| Older | Low | 20 | 3.9 | 1.0 |'].join('\n')),
    ).toBeNull();
    // An ANOVA table.
    expect(readOnlyTable(['Table 3', 'ANOVA', '', '| Source | df | F | p |', '| --- | --- | --- | --- |', '| Age | 1 | 4.21 | .044 |', '| Load | 1 | 6.10 | .016 |', '| Age x Load | 1 | 0.80 | .374 |'].join('\n'))).toBeNull();
    // "value (value)" cells with nothing saying they are means and SDs (they could be t and df).
    expect(readOnlyTable(['Table 1', 'Tests', '', '| Age | Low | High |', '| --- | --- | --- |', '| Younger | 2.10 (38) | 1.20 (38) |', '| Older | 3.40 (38) | 0.90 (38) |'].join('\n'))).toBeNull();
  });
});

describe('cell statistics in running text', () => {
  const design = 'Adults took part in a 2 (age: younger, older) × 2 (load: low, high) between-subjects design.\n\n';
  it('the design statement gives the factors and levels', () => {
    expect(readDesignStatements(design)).toMatchObject([{ factors: ['age', 'load'], levels: [['younger', 'older'], ['low', 'high']] }]);
    expect(readDesignStatements('a 2 (Age: younger vs. older) x 3 (Task: sort, type, or draw) design')[0]!.levels).toEqual([['younger', 'older'], ['sort', 'type', 'draw']]);
    // Counts that disagree with the levels listed, and a single factor, are not designs.
    expect(readDesignStatements('a 2 (age: younger, middle, older) × 2 (load: low, high) design')).toEqual([]);
    expect(readDesignStatements('a 3 (load: low, medium, high) design')).toEqual([]);
  });

  it('each group takes the level named last before it, or the one of the group before it in the same sentence', () => {
    const text =
      design +
      'In the high-load condition, older adults (M = 3.10, SD = 1.30, n = 20) recalled fewer words than younger adults (M = 3.80, SD = 1.25, n = 20), ' +
      'whereas in the low-load condition older (M = 3.95, SD = 1.02, n = 20) and younger adults (M = 4.21, SD = 1.10, n = 20) did not differ.';
    const sets = readCellText(text, readTextGroups(text), paragraphsOf(text));
    expect(sets).toHaveLength(1);
    expect(sets[0]!.factors).toEqual(['age', 'load']);
    expect(cellsOf(sets[0]!)).toEqual(['older/high: 3.10 (1.30) n=20', 'younger/high: 3.80 (1.25) n=20', 'older/low: 3.95 (1.02) n=20', 'younger/low: 4.21 (1.10) n=20']);
    expect(sets[0]!.nSource).toBe('cell');
  });

  it('reads no set when a combination is missing or given twice', () => {
    const missing = design + 'Under high load, older adults (M = 3.10, SD = 1.30) and younger adults (M = 3.80, SD = 1.25) differed; under low load, older adults (M = 3.95, SD = 1.02) did well.';
    expect(readCellText(missing, readTextGroups(missing), paragraphsOf(missing))).toEqual([]);
    const twice =
      design +
      'Under high load, older adults (M = 3.10, SD = 1.30) and younger adults (M = 3.80, SD = 1.25) differed; under low load, older adults (M = 3.95, SD = 1.02) and older adults (M = 4.21, SD = 1.10) did not.';
    expect(readCellText(twice, readTextGroups(twice), paragraphsOf(twice))).toEqual([]);
  });
});
