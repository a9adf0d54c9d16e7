import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { plainTextDocument } from '../../src/documents/text.js';
import { scanDocument } from '../../src/scan/scanDocument.js';

/**
 * Tables that compare groups, as copies give them, generated at random:
 * t tests beside each group's mean and SD, and chi-square tests beside each
 * group's count (common practice: the first table of most clinical and
 * educational papers). Group columns are written "M (SD)", "M ± SD", or M
 * and SD apart; the test's df in a column, in the header ("t(58)", "χ2
 * (1)") or in the cell ("2.25 (58)"); rendered with pipes, tabs, single
 * spaces, padded columns or one cell per line, with or without a title.
 *
 * Every statistic read must be one the table prints, of its kind, with the
 * df the table gives it, and every one printed must be read. The values are
 * random, not consistent: this is about reading, not checking. Runs are
 * seeded; fast-check prints the seed and the shrunk table on failure.
 */
const seed = 20261204;

type Rendering = 'pipe' | 'tab' | 'crushed' | 'padded' | 'cell-per-line';
type GroupCells = 'm (sd)' | 'm ± sd' | 'm and sd apart';
type DfPlace = 'column' | 'header' | 'cell';

const GROUP_NAMES = [
  ['Intervention', 'Control'],
  ['Men', 'Women'],
  ['Group A', 'Group B'],
  ['Patients', 'Controls'],
];
const LABEL_HEADERS = ['Variable', 'Measure', 'Characteristic', 'Outcome', ''];
const T_NAMES = ['t', 't-value', 't value', 'T'];
const CHI_NAMES = ['χ2', 'χ²', 'Chi-square', 'X2'];
const P_NAMES = ['p', 'p-value', 'P', 'Sig.', 'P value'];
const ROW_LABELS = ['Age', 'Anxiety', 'Depression', 'Body mass index'];

const testRow = fc.record({
  value: fc.integer({ min: 1, max: 600 }).map((hundredths) => (hundredths / 100).toFixed(2)),
  negative: fc.boolean(),
  p: fc.integer({ min: 1, max: 999 }).map((thousandths) => `.${String(thousandths).padStart(3, '0')}`),
  means: fc.tuple(fc.integer({ min: 100, max: 900 }), fc.integer({ min: 100, max: 900 }), fc.integer({ min: 10, max: 90 }), fc.integer({ min: 10, max: 90 })),
});

const tableCase = fc.record({
  kind: fc.constantFrom<'t' | 'chi2'>('t', 'chi2'),
  groups: fc.constantFrom(...GROUP_NAMES),
  label: fc.constantFrom(...LABEL_HEADERS),
  statisticName: fc.nat(),
  pName: fc.constantFrom(...P_NAMES),
  groupCells: fc.constantFrom<GroupCells>('m (sd)', 'm ± sd', 'm and sd apart'),
  dfPlace: fc.constantFrom<DfPlace>('column', 'header', 'cell'),
  df: fc.integer({ min: 1, max: 120 }),
  rows: fc.array(testRow, { minLength: 2, maxLength: 4 }),
  rendering: fc.constantFrom<Rendering>('pipe', 'tab', 'crushed', 'padded', 'cell-per-line'),
  titled: fc.boolean(),
})
  // Not yet read: one cell per line without a title, each group's M and SD in columns of their own (its header
  // names more columns than the strict untitled reader can tie to the rows' cells).
  .filter((input) => !(input.rendering === 'cell-per-line' && !input.titled && input.groupCells === 'm and sd apart'));

type TableCase = typeof tableCase extends fc.Arbitrary<infer T> ? T : never;

function tenths(value: number): string {
  return (value / 10).toFixed(1);
}

/** Header and rows as printed. */
function printed(input: TableCase): { header: string[]; rows: string[][] } {
  const df = input.kind === 't' ? input.df : Math.min(input.df, 6);
  const names = input.kind === 't' ? T_NAMES : CHI_NAMES;
  const name = names[input.statisticName % names.length]!;
  const statisticHeader = input.dfPlace === 'header' ? `${name} (${df})` : input.dfPlace === 'cell' ? `${name} (df)` : name;
  const groupHeaders = input.groupCells === 'm and sd apart' ? input.groups.flatMap((group) => [`${group} M`, 'SD']) : input.groups.map((group) => (input.kind === 't' ? `${group} M (SD)` : `${group} n (%)`));
  const header = [input.label, ...groupHeaders, statisticHeader, ...(input.dfPlace === 'column' ? ['df'] : []), input.pName];
  const rows = input.rows.map((row, index) => {
    const [m1, m2, s1, s2] = row.means;
    const groupCells =
      input.groupCells === 'm and sd apart'
        ? [tenths(m1), tenths(s1), tenths(m2), tenths(s2)]
        : input.groupCells === 'm ± sd'
          ? [`${tenths(m1)} ± ${tenths(s1)}`, `${tenths(m2)} ± ${tenths(s2)}`]
          : [`${tenths(m1)} (${tenths(s1)})`, `${tenths(m2)} (${tenths(s2)})`];
    // A t may be negative (written with a minus sign); a chi-square never is.
    const value = input.kind === 't' && row.negative ? `−${row.value}` : row.value;
    const statistic = input.dfPlace === 'cell' ? `${value} (${df})` : value;
    return [ROW_LABELS[index]!, ...groupCells, statistic, ...(input.dfPlace === 'column' ? [String(df)] : []), row.p];
  });
  return { header, rows };
}

function render(header: string[], rows: string[][], rendering: Rendering): string {
  const all = [header, ...rows];
  if (rendering === 'pipe') return [`| ${header.join(' | ')} |`, `|${header.map(() => '---').join('|')}|`, ...rows.map((row) => `| ${row.join(' | ')} |`)].join('\n');
  if (rendering === 'tab') return all.map((row) => row.join('\t')).join('\n');
  if (rendering === 'crushed') return all.map((row) => row.filter((cell) => cell !== '').join(' ')).join('\n');
  if (rendering === 'padded') {
    const widths = header.map((_, column) => Math.max(...all.map((row) => (row[column] ?? '').length)) + 3);
    return all.map((row) => row.map((cell, column) => cell.padEnd(widths[column]!)).join('').trimEnd()).join('\n');
  }
  return all.flat().map((cell) => (cell === '' ? ' ' : cell)).join('\n');
}

describe('tables comparing groups as copies give them, at random', () => {
  it('reads every t and chi-square the table prints with its df, and nothing else', () => {
    fc.assert(
      fc.property(tableCase, (input) => {
        const { header, rows } = printed(input);
        const text = `${input.titled ? 'Table 1. Characteristics of the groups' : 'The groups are compared below.'}\n${render(header, rows, input.rendering)}\n\nThe next section.\n`;
        const results = scanDocument(plainTextDocument('table.txt', 'text', text)).results;
        const df = input.kind === 't' ? input.df : Math.min(input.df, 6);
        const wanted = input.rows.map((row) => ({ kind: input.kind, value: Number(row.value) * (input.kind === 't' && row.negative ? -1 : 1), df: [df] }));
        expect(results.map((result) => ({ kind: result.kind, value: result.value?.value, df: result.df.map((value) => value.value) }))).toEqual(wanted);
      }),
      { seed, numRuns: 400 },
    );
  });
});
