import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { plainTextDocument } from '../../src/documents/text.js';
import { scanDocument } from '../../src/scan/scanDocument.js';

/**
 * ANOVA tables as copies give them, generated at random: columns in the
 * orders and spellings journals and statistics programs use (common
 * practice), an error row or numerator and denominator df columns (also
 * under one "df" header whose span the copy lost), rendered
 * with pipes, tabs, single spaces, padded columns or one cell per line, with
 * or without a title, and one kind of damage a copy does (stars or footnote
 * letters on values, "< .001", "0.000", "n.s." or stars for p, decimal commas, blank lines
 * between rows, headers in capitals, an error row that prints only its df).
 *
 * Every F read must be one the table prints, with the df the table gives it
 * (or none), and every F printed must be read with its df. The F values and
 * p-values are random, not consistent: this is about reading, not checking.
 * Runs are seeded; fast-check prints the seed and the shrunk table on failure.
 */
const seed = 20261204;

type Column = 'label' | 'ss' | 'df' | 'df1' | 'df2' | 'ms' | 'F' | 'p' | 'eta' | 'dfSpanned' | 'df2Unnamed';
type Rendering = 'pipe' | 'tab' | 'crushed' | 'padded' | 'cell-per-line';
type Damage = 'none' | 'stars' | 'p-bound' | 'p-letter' | 'p-zero' | 'decimal-comma' | 'blank-lines' | 'capitals' | 'error-df-only' | 'ns' | 'p-stars';

const SPELLINGS: Record<Column, string[]> = {
  label: ['Source', 'Effect', 'Variable', 'Factor', 'Source of variation', ''],
  ss: ['SS', 'Sum of squares', 'Type III SS', 'Sum Sq'],
  df: ['df', 'DF', 'd.f.', 'Df'],
  df1: ['df1', 'Num df', 'Hypothesis df', 'ndf'],
  df2: ['df2', 'Den df', 'Error df', 'ddf'],
  ms: ['MS', 'Mean square', 'Mean Sq'],
  F: ['F', 'F value', 'F-ratio', 'F-value'],
  p: ['p', 'Sig.', 'p-value', 'P', 'Pr(>F)'],
  eta: ['ηp2', 'Partial η2', 'η2p', 'partial eta squared'],
  // One "df" header over both df columns (a spanning cell whose span the copy lost): the second is unnamed.
  dfSpanned: ['df', 'DF', 'd.f.', 'Df'],
  df2Unnamed: [''],
};
const LAYOUTS: Column[][] = [
  ['label', 'ss', 'df', 'ms', 'F', 'p'],
  ['label', 'df', 'ss', 'ms', 'F', 'p'],
  ['label', 'df', 'F', 'p', 'eta'],
  ['label', 'df1', 'df2', 'F', 'p'],
  ['label', 'F', 'df1', 'df2', 'p', 'eta'],
  ['label', 'ss', 'df', 'ms', 'F', 'p', 'eta'],
  ['label', 'df', 'F', 'p'],
  ['label', 'dfSpanned', 'df2Unnamed', 'F', 'p', 'eta'],
  ['label', 'F', 'dfSpanned', 'df2Unnamed', 'p'],
];
const ROW_LABELS = ['Group', 'Time', 'Group × Time', 'Condition'];
const ERROR_LABELS = ['Error', 'Residuals', 'Within groups', 'Error (within)'];

interface EffectRow {
  df1: number;
  f: string;
  ms: string;
  p: string;
  eta: string;
}

const effectRow = fc.record({
  df1: fc.integer({ min: 1, max: 4 }),
  f: fc.integer({ min: 1, max: 1500 }).map((hundredths) => (hundredths / 100).toFixed(2)),
  ms: fc.integer({ min: 100, max: 2000 }).map((hundredths) => (hundredths / 100).toFixed(2)),
  p: fc.integer({ min: 1, max: 999 }).map((thousandths) => `.${String(thousandths).padStart(3, '0')}`),
  eta: fc.integer({ min: 1, max: 40 }).map((hundredths) => `.${String(hundredths).padStart(2, '0')}`),
});

const tableCase = fc.record({
  layout: fc.constantFrom(...LAYOUTS),
  spellings: fc.array(fc.nat(), { minLength: 7, maxLength: 7 }),
  rows: fc.array(effectRow, { minLength: 2, maxLength: 4 }),
  errorDf: fc.integer({ min: 10, max: 240 }),
  errorLabel: fc.constantFrom(...ERROR_LABELS),
  rendering: fc.constantFrom<Rendering>('pipe', 'tab', 'crushed', 'padded', 'cell-per-line'),
  damage: fc.constantFrom<Damage>('none', 'stars', 'p-bound', 'p-letter', 'p-zero', 'decimal-comma', 'blank-lines', 'capitals', 'error-df-only', 'ns', 'p-stars'),
  mark: fc.constantFrom('*', '**', '***', '†', 'a', 'b'),
  titled: fc.boolean(),
});

type TableCase = typeof tableCase extends fc.Arbitrary<infer T> ? T : never;

function cellOf(column: Column, row: EffectRow, index: number, errorDf: number): string {
  switch (column) {
    case 'label':
      return ROW_LABELS[index]!;
    case 'ss':
      return (Number(row.ms) * row.df1).toFixed(2);
    case 'df':
    case 'df1':
    case 'dfSpanned':
      return String(row.df1);
    case 'df2':
    case 'df2Unnamed':
      return String(errorDf);
    case 'ms':
      return row.ms;
    case 'F':
      return row.f;
    case 'p':
      return row.p;
    case 'eta':
      return row.eta;
  }
}

/** The table's header and rows as printed, after the damage. */
function printed(input: TableCase): { header: string[]; rows: string[][] } {
  const { layout, damage } = input;
  let header = layout.map((column, index) => SPELLINGS[column][input.spellings[index]! % SPELLINGS[column].length]!);
  const rows = input.rows.map((row, index) => layout.map((column) => cellOf(column, row, index, input.errorDf)));
  const fColumn = layout.indexOf('F');
  const pColumn = layout.indexOf('p');
  for (const row of rows) {
    if (damage === 'stars') row[fColumn] += input.mark.replace(/[ab]/, '*');
    if (damage === 'p-bound') row[pColumn] = '<.001';
    if (damage === 'p-letter') row[pColumn] += input.mark.replace(/[*†]+/, 'a');
    if (damage === 'p-zero') row[pColumn] = '0.000';
    if (damage === 'ns') row[pColumn] = 'n.s.';
    if (damage === 'p-stars') row[pColumn] = `${row[pColumn]}**`;
  }
  // An error row where the table has one: a df column for the effects, or sums of squares.
  if (layout.includes('df') || layout.includes('ss')) {
    const onlyDf = damage === 'error-df-only';
    rows.push(
      layout.map((column) =>
        column === 'label' ? input.errorLabel : column === 'df' ? String(input.errorDf) : onlyDf ? '' : column === 'ss' ? (input.errorDf * 1.5).toFixed(2) : column === 'ms' ? '1.50' : '',
      ),
    );
  }
  if (damage === 'decimal-comma') for (const row of rows) row.forEach((cell, index) => (row[index] = index === 0 ? cell : cell.replace('.', ',').replace(/^,/, '0,')));
  if (damage === 'capitals') header = header.map((name) => name.toUpperCase());
  return { header, rows };
}

function render(header: string[], rows: string[][], rendering: Rendering, blankLines: boolean): string {
  const all = [header, ...rows];
  let lines: string[];
  if (rendering === 'pipe') lines = [`| ${header.join(' | ')} |`, `|${header.map(() => '---').join('|')}|`, ...rows.map((row) => `| ${row.join(' | ')} |`)];
  else if (rendering === 'tab') lines = all.map((row) => row.join('\t'));
  else if (rendering === 'crushed') lines = all.map((row) => row.filter((cell) => cell !== '').join(' '));
  else if (rendering === 'padded') {
    const widths = header.map((_, column) => Math.max(...all.map((row) => (row[column] ?? '').length)) + 3);
    lines = all.map((row) => row.map((cell, column) => cell.padEnd(widths[column]!)).join('').trimEnd());
  } else return all.flat().map((cell) => (cell === '' ? ' ' : cell)).join('\n');
  return lines.join(blankLines ? '\n\n' : '\n');
}

/** The F tests the table prints: value and df. */
function printedTests(input: TableCase): { value: number; df: [number, number] }[] {
  return input.rows.map((row) => ({ value: Number(row.f), df: [row.df1, input.errorDf] }));
}

/**
 * Cases the reader leaves alone on purpose: without a title, a table one cell per line is read only when its
 * header names every value column (cellPerLine.ts), which a "df" header over two columns does not.
 */
function readable(input: TableCase): boolean {
  return input.titled || input.rendering !== 'cell-per-line' || !input.layout.includes('df2Unnamed');
}

function readTests(input: TableCase) {
  const { header, rows } = printed(input);
  const body = render(header, rows, input.rendering, input.damage === 'blank-lines');
  const text = `${input.titled ? 'Table 2. Analysis of variance' : 'The analysis of variance is shown below.'}\n${body}\n\nThe next section.\n`;
  return { text, results: scanDocument(plainTextDocument('table.txt', 'text', text)).results.filter((result) => result.kind === 'F') };
}

describe('ANOVA tables as copies give them, at random', () => {
  it('reads every F the table prints with its df, and nothing else', () => {
    fc.assert(
      fc.property(tableCase.filter(readable), (input) => {
        const { results } = readTests(input);
        const wanted = printedTests(input);
        const read = results.map((result) => ({ value: result.value?.value, df: result.df.map((df) => df.value) }));
        expect(read).toEqual(wanted);
      }),
      { seed, numRuns: 400 },
    );
  });
});
