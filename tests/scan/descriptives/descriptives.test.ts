import { describe, expect, it } from 'vitest';
import { scanDocument } from '../../../src/scan/scanDocument.js';
import { readTextGroups } from '../../../src/scan/descriptives/index.js';
import { readDescriptiveTable } from '../../../src/scan/descriptives/readTableDescriptives.js';

const scan = (text: string, tables = []) => scanDocument({ text, tables, regions: [] });
const summary = (text: string) =>
  scan(text).results.map((r) => r.descriptives?.groups.map((g) => [g.mean.text, g.sd?.text ?? null, g.n, g.nSource]) ?? null);

describe('descriptive statistics in text', () => {
  it.each([
    ['(M = 3.47, SD = 1.21, n = 25)', ['3.47', '1.21', 25]],
    ['(n = 25; M = 3.47, SD = 1.21)', ['3.47', '1.21', 25]],
    ['(M = 3.47 (SD = 1.21))', ['3.47', '1.21', null]],
    ['(Mean = 3.47; SD = 1.21)', ['3.47', '1.21', null]],
    ['(*M* = 3.47, *SD* = 1.21)', ['3.47', '1.21', null]],
    ['(M = −0.47, SD = 1.21)', ['-0.47', '1.21', null]],
  ])('%s', (written, [mean, sd, n]) => {
    const [group] = readTextGroups(`The group ${written} did well.`);
    expect([group?.mean.text, group?.sd?.text, group?.n]).toEqual([mean, sd, n]);
    expect(`The group ${written} did well.`.slice(group!.start, group!.end)).toContain(String(mean).replace('-', ''));
  });

  it('reads declared "means (SDs)" pairs, and not t(58) or other brackets', () => {
    const groups = readTextGroups('Means (SDs) were 3.47 (1.21) and 2.95 (1.30; n = 20), t(58) = 2.10, p = .040 (Figure 2).');
    expect(groups.map((g) => [g.mean.text, g.sd?.text, g.n])).toEqual([
      ['3.47', '1.21', null],
      ['2.95', '1.30', 20],
    ]);
    expect(readTextGroups('Scores were 3.47 (1.21) and 2.95 (1.30).')).toEqual([]);
  });
});

describe('linking descriptive statistics to tests', () => {
  it('links two groups to a t and k groups to an F(k - 1, df2), per paragraph', () => {
    const text = [
      'A (M = 4.25, SD = 1.11, n = 24) beat B (M = 3.52, SD = 1.23, n = 25), t(47) = 2.18, p = .034. Later, C (M = 1.00, SD = 1.00, n = 10), D (M = 2.00, SD = 1.00, n = 10) and E (M = 3.00, SD = 1.00, n = 10) differed, F(2, 27) = 22.5, p < .001.',
      '',
      'Nothing here is linked: t(30) = 2.00, p = .054.',
    ].join('\n');
    expect(summary(text)).toEqual([
      [
        ['4.25', '1.11', 24, 'group'],
        ['3.52', '1.23', 25, 'group'],
      ],
      [
        ['1.00', '1.00', 10, 'group'],
        ['2.00', '1.00', 10, 'group'],
        ['3.00', '1.00', 10, 'group'],
      ],
      null,
    ]);
  });

  it('does not link a wrong number of groups, or tests in paragraphs about covariates or repeated measures', () => {
    expect(summary('A (M = 1.00, SD = 1.00, n = 10), B (M = 2.00, SD = 1.00, n = 10), C (M = 3.00, SD = 1.00, n = 10), t(18) = 2.2, p = .04.')).toEqual([null]);
    expect(summary('Adjusted for age, A (M = 1.00, SD = 1.00, n = 10) beat B (M = 2.00, SD = 1.00, n = 10), t(18) = 2.2, p = .04.')).toEqual([null]);
    expect(summary('We used a within-subjects design.\n\nA (M = 1.00, SD = 1.00, n = 10) beat B (M = 2.00, SD = 1.00, n = 10), t(18) = 2.2, p = .04.')).toEqual([null]);
  });

  it('takes n from a per-group statement in the paragraph, or elsewhere when the df agree', () => {
    expect(summary('Means (SDs) were 3.47 (1.21) and 2.95 (1.30) (n = 20 per group), t(38) = 1.31, p = .198.')[0]).toEqual([
      ['3.47', '1.21', 20, 'paragraph'],
      ['2.95', '1.30', 20, 'paragraph'],
    ]);
    const method = 'Participants (n = 20 per group) were assigned at random.\n\n';
    expect(summary(`${method}Means (SDs) were 3.47 (1.21) and 2.95 (1.30), t(38) = 1.31, p = .198.`)[0]![0]).toEqual(['3.47', '1.21', 20, 'document']);
    expect(summary(`${method}Means (SDs) were 3.47 (1.21) and 2.95 (1.30), t(30) = 1.31, p = .198.`)[0]![0]).toEqual(['3.47', '1.21', null, null]);
  });

  it('links a descriptive table that the sentence names, and reads the integer-scale statement of its note', () => {
    const text = [
      'Table 1',
      'Comfort by room',
      '',
      '| Room | n | M | SD |',
      '|---|---|---|---|',
      '| Warm | 24 | 4.25 | 1.11 |',
      '| Cool | 25 | 3.52 | 1.23 |',
      '',
      'Note. Comfort was rated on a single 7-point item.',
      '',
      'Rooms differed in comfort (Table 1), t(47) = 2.18, p = .034.',
    ].join('\n');
    const [result] = scan(text).results;
    expect(result!.descriptives?.source).toBe('table');
    expect(result!.descriptives?.groups.map((g) => [g.label, g.mean.text, g.n])).toEqual([
      ['Warm', '4.25', 24],
      ['Cool', '3.52', 25],
    ]);
    expect(result!.descriptives?.integerScale?.items).toBe(1);
  });
});

describe('descriptive tables', () => {
  const table = (rows: string[][], caption = 'Table 2 Errors', notes: string[] = []) => ({ start: 0, end: 10, caption, notes, rows });

  it('groups as rows with an "M (SD)" column and n from the note', () => {
    const read = readDescriptiveTable(table([['Group', 'M (SD)'], ['Quiet', '3.45 (1.20)'], ['Noise', '4.10 (1.45)']], 'Table 2 Errors', ['Note. n = 20 per group.']));
    expect(read?.number).toBe('2');
    expect(read?.measures[0]!.groups.map((g) => [g.label, g.mean.text, g.sd?.text, g.n, g.nSource])).toEqual([
      ['Quiet', '3.45', '1.20', 20, 'paragraph'],
      ['Noise', '4.10', '1.45', 20, 'paragraph'],
    ]);
  });

  it('groups as columns', () => {
    const read = readDescriptiveTable(table([['', 'Quiet', 'Noise', 'Music'], ['M', '3.45', '4.10', '3.90'], ['SD', '1.20', '1.45', '1.33'], ['n', '20', '20', '20']]));
    expect(read?.measures[0]!.groups.map((g) => [g.label, g.mean.text, g.n])).toEqual([
      ['Quiet', '3.45', 20],
      ['Noise', '4.10', 20],
      ['Music', '3.90', 20],
    ]);
  });

  it('several measures under a spanning header', () => {
    const read = readDescriptiveTable(table([['', 'Recall', '', 'Recognition', ''], ['Group', 'M', 'SD', 'M', 'SD'], ['A', '10.2', '2.1', '0.81', '0.09'], ['B', '11.4', '2.3', '0.77', '0.10']]));
    expect(read?.measures.map((m) => [m.measure.split(' (')[0], m.groups.map((g) => g.mean.text)])).toEqual([
      ['Recall', ['10.2', '11.4']],
      ['Recognition', ['0.81', '0.77']],
    ]);
  });

  it('an ANOVA table is not a descriptive table', () => {
    expect(readDescriptiveTable(table([['Source', 'SS', 'df', 'MS', 'F'], ['Group', '12.4', '2', '6.2', '4.21'], ['Error', '80.1', '54', '1.48', '']]))).toBeNull();
  });
});

describe('linear time on hostile input', () => {
  it('reads 200,000 characters of near-misses without backtracking blow-up', () => {
    const text = 'M = 1.2, SD = '.repeat(5000) + 'Means (SDs) were ' + '1 (2 '.repeat(20000);
    expect(() => readTextGroups(text)).not.toThrow();
  });
});
