import { describe, expect, it } from 'vitest';
import { scanDocument } from '../../../src/scan/scanDocument.js';

/** Each result's text with the effect it is linked to ("0,1"), or "-" when it is not linked. */
function links(text: string): string[] {
  return scanDocument({ text, tables: [], regions: [] }).results.map((result) => `${result.text} -> ${result.factorial ? result.factorial.term.join(',') : '-'}`);
}

const cellTable = [
  'Table 1',
  'Recall by age group and load, M (SD)',
  '',
  '| Age group | Low load | High load |',
  '| --- | --- | --- |',
  '| Younger | 4.21 (1.10) | 3.80 (1.25) |',
  '| Older | 3.95 (1.02) | 3.10 (1.30) |',
  '',
  'Note. n = 20 per cell.',
].join('\n');

describe('F tests linked to the cells of their design', () => {
  it('main effects by name and the interaction, in the sentence that refers to the table', () => {
    const text = `${cellTable}\n\nRecall (Table 1) showed a main effect of age, F(1, 76) = 3.35, p = .071, and a main effect of load, F(1, 76) = 5.77, p = .019. The age × load interaction was not significant, F(1, 76) = 0.70, p = .404.\n`;
    expect(links(text)).toEqual(['F(1, 76) = 3.35, p = .071 -> 0', 'F(1, 76) = 5.77, p = .019 -> 1', 'F(1, 76) = 0.70, p = .404 -> 0,1']);
  });

  it('rows of an ANOVA table, a factor the cells leave unnamed taken by elimination', () => {
    const cells = ['Table 1', 'Recall, M (SD)', '', '| Age | Quiet | Noisy |', '| --- | --- | --- |', '| Younger | 4.21 (1.10) | 3.80 (1.25) |', '| Older | 3.95 (1.02) | 3.10 (1.30) |', '', 'Note. n = 20 per cell.'].join('\n');
    const anova = ['Table 2', 'Analysis of variance of recall', '', '| Source | df | F | p |', '| --- | --- | --- | --- |', '| Age | 1 | 3.35 | .071 |', '| Room | 1 | 5.77 | .019 |', '| Age × Room | 1 | 0.70 | .404 |', '| Error | 76 | | |'].join('\n');
    const linked = links(`${cells}\n\n${anova}\n`);
    expect(linked).toHaveLength(3);
    expect(linked.map((entry) => entry.split(' -> ')[1])).toEqual(['0', '1', '0,1']);
  });

  it('leaves alone: a simple effect, df the design cannot have, and a paragraph about repeated measures', () => {
    const simple = `${cellTable}\n\nIn Table 1, the effect of load among older adults was significant, F(1, 38) = 7.10, p = .011, and the age × load interaction was not, F(1, 76) = 0.70, p = .404.\n`;
    // The follow-up test is not linked; the interaction alone names both factors.
    expect(links(simple)).toEqual(['F(1, 38) = 7.10, p = .011 -> -', 'F(1, 76) = 0.70, p = .404 -> 0,1']);
    const wrongDf = `${cellTable}\n\nIn Table 1, the age × load interaction was not significant, F(1, 40) = 0.70, p = .408.\n`;
    expect(links(wrongDf)).toEqual(['F(1, 40) = 0.70, p = .408 -> -']);
    const repeated = `${cellTable}\n\nIn a repeated-measures ANOVA of Table 1, the age × load interaction was not significant, F(1, 76) = 0.70, p = .404.\n`;
    expect(links(repeated)).toEqual(['F(1, 76) = 0.70, p = .404 -> -']);
  });

  it('a set none of whose tests names one of its factors is not linked (two outcomes side by side are no factor)', () => {
    const sideBySide = ['Table 1', 'Recall and recognition by age', '', '|  | Recall |  | Recognition |  |', '| Age | M | SD | M | SD |', '| --- | --- | --- | --- | --- |', '| Younger | 4.21 | 1.10 | 3.80 | 1.25 |', '| Older | 3.95 | 1.02 | 3.10 | 1.30 |', '', 'Note. n = 20 per group.'].join('\n');
    expect(links(`${sideBySide}\n\nIn Table 1, recall showed a main effect of age, F(1, 76) = 3.35, p = .071.\n`)).toEqual(['F(1, 76) = 3.35, p = .071 -> -']);
  });

  it('cells written in the paragraph before the test, under a design statement', () => {
    const text =
      'Adults took part in a 2 (age: younger, older) × 2 (load: low, high) between-subjects design.\n\n' +
      'In the high-load condition, older adults (M = 3.10, SD = 1.30, n = 20) recalled fewer words than younger adults (M = 3.80, SD = 1.25, n = 20), ' +
      'whereas in the low-load condition older (M = 3.95, SD = 1.02, n = 20) and younger adults (M = 4.21, SD = 1.10, n = 20) did not differ.\n\n' +
      'The interaction of age and load was not significant, F(1, 76) = 0.70, p = .404.\n';
    expect(links(text)).toEqual(['F(1, 76) = 0.70, p = .404 -> 0,1']);
  });

  it('tests in the paragraph after the one that refers to the table', () => {
    const text = `${cellTable}\n\nRecall (Table 1) showed a main effect of age, F(1, 76) = 3.35, p = .071.\n\nThere was also a main effect of load, F(1, 76) = 5.77, p = .019.\n`;
    expect(links(text)).toEqual(['F(1, 76) = 3.35, p = .071 -> 0', 'F(1, 76) = 5.77, p = .019 -> 1']);
  });

  it('two tables of the same design and no reference: the one whose outcome the paragraph names, or none', () => {
    const second = cellTable.replace('Table 1', 'Table 2').replace('Recall by', 'Reading speed by');
    const naming = `${cellTable}\n\n${second}\n\nFor reading speed, the age × load interaction was not significant, F(1, 76) = 0.70, p = .404.\n`;
    const found = scanDocument({ text: naming, tables: [], regions: [] }).results[0]!.factorial;
    expect(found?.set.tableNumber).toBe('2');
    const silent = `${cellTable}\n\n${second}\n\nThe age × load interaction was not significant, F(1, 76) = 0.70, p = .404.\n`;
    expect(links(silent)).toEqual(['F(1, 76) = 0.70, p = .404 -> -']);
  });

  it('a marked-up table without a caption takes the "Table 1" line a reader left just above it in the text', () => {
    const tableText = 'Age group | Low load | High load\nYounger | 4.21 (1.10) | 3.80 (1.25)\nOlder | 3.95 (1.02) | 3.10 (1.30)';
    const before = 'Table 1 Recall, M (SD); n = 20 per cell\n\n';
    const after = '\n\nIn Table 1, the age × load interaction was not significant, F(1, 76) = 0.70, p = .404.\n';
    const text = before + tableText + after;
    const rows = tableText.split('\n').map((line) => line.split(' | '));
    const table = { start: before.length, end: before.length + tableText.length, caption: null, notes: ['n = 20 per cell'], rows, headerRows: 1, layout: 'markup' as const };
    const [result] = scanDocument({ text, tables: [table], regions: [] }).results;
    expect(result!.factorial?.set.tableNumber).toBe('1');
    expect(result!.factorial?.term).toEqual([0, 1]);
  });
});
