import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { fitModel, RefitError } from '../../src/refit/index.js';

/** Data files a user did not make carefully: each is read, or refused naming the file, row and column. */
const folder = mkdtempSync(join(tmpdir(), 'plumbline-hostile-data-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

function data(name: string, content: string): string {
  const path = join(folder, name);
  writeFileSync(path, content);
  return path;
}

async function refused(path: string, model: string): Promise<RefitError> {
  try {
    await fitModel(path, { model });
  } catch (error) {
    if (error instanceof RefitError) return error;
    throw error;
  }
  throw new Error('expected a refusal');
}

const rows = (cells: string[], separator = ','): string =>
  ['score,group'.replaceAll(',', separator), ...cells.map((score, index) => `${score}${separator}${index % 2 === 0 ? 'a' : 'b'}`)].join('\n');

describe('numbers that are not numbers', () => {
  it.each(['NaN', 'Infinity', '-Infinity', '1e999', 'inf', '0x1F'])('"%s" in a numeric column is refused with file, row and column', async (cell) => {
    const error = await refused(data('special.csv', rows(['1.5', '2.5', cell, '3.5', '4.5', '2.0'])), 'score ~ group');
    expect(error.message).toBe(
      `special.csv, row 4, column 'score': "${cell}" is not a number, but the column is numeric (it is the outcome). Fix the cell, declare the code missing under missing.score.`,
    );
  });
});

describe('thousands separators and decimal commas', () => {
  it('"1,234.5" quoted in a comma-delimited file is refused with a hint about the separator', async () => {
    const error = await refused(data('thousands.csv', rows(['1.5', '2.5', '"1,234.5"', '3.5', '4.5', '2.0'])), 'score ~ group');
    expect(error.message).toMatch(/^thousands\.csv, row 4, column 'score': "1,234\.5" is not a number, .* \(It looks like a thousands separator: write 1234\.5\.\)$/);
  });

  it('unquoted, the same cell is a ragged row, named', async () => {
    const error = await refused(data('unquoted.csv', rows(['1.5', '2.5', '1,234.5', '3.5', '4.5', '2.0'])), 'score ~ group');
    expect(error.message).toMatch(/^unquoted\.csv, row 4: 3 fields, but the header has 2 columns\./);
  });

  it('decimal commas are read in a semicolon-delimited file', async () => {
    const model = await fitModel(data('comma.csv', rows(['1,5', '2,5', '3,0', '3,5', '4,5', '2,0'], ';')), { model: 'score ~ group' });
    expect(model.n).toBe(6);
  });

  it('"1.234,5" (thousands dot, decimal comma) in a semicolon file is refused with the hint', async () => {
    const error = await refused(data('european.csv', rows(['1,5', '2,5', '1.234,5', '3,5', '4,5', '2,0'], ';')), 'score ~ group');
    expect(error.message).toMatch(/^european\.csv, row 4, column 'score': "1\.234,5" is not a number, .* \(It looks like a thousands separator: write 1234,5\.\)$/);
  });
});

describe('structure', () => {
  it('a quoted newline inside a text cell is part of the cell', async () => {
    const content = 'score,group,comment\n1.5,a,"two\nlines"\n2.5,b,x\n3.0,a,y\n3.5,b,"a, b"\n';
    const model = await fitModel(data('newline.csv', content), { model: 'score ~ group' });
    expect(model.n).toBe(4);
  });

  it('duplicate column names are refused', async () => {
    const error = await refused(data('duplicate.csv', 'score,group,score\n1,a,2\n2,b,3\n'), 'score ~ group');
    expect(error.message).toBe('duplicate.csv: the header has two columns named "score"; rename one of them.');
  });

  it('a file with 10,000 columns is read (only the model\'s columns are interpreted)', async () => {
    const width = 10_000;
    const header = ['score', 'group', ...Array.from({ length: width - 2 }, (_, index) => `c${index}`)].join(',');
    const filler = Array.from({ length: width - 2 }, () => '7').join(',');
    const lines = Array.from({ length: 40 }, (_, index) => `${(index % 7) + 0.5},${index % 2 === 0 ? 'a' : 'b'},${filler}`);
    const model = await fitModel(data('wide.csv', [header, ...lines].join('\n')), { model: 'score ~ group' });
    expect(model.n).toBe(40);
    const error = await refused(data('wide.csv', [header, ...lines].join('\n')), 'score ~ c9998');
    expect(error.message).toMatch(/^wide\.csv: the model formula uses "c9998", but there is no such column/);
  });
});

describe('a model too wide to fit', () => {
  // 3,000 participants measured twice, with the participant code in the model as a factor by mistake.
  const wide = data('identifier.csv', ['participant,score', ...Array.from({ length: 6000 }, (_, i) => `p${i % 3000},${(i * 7919) % 101}`)].join('\n'));

  it('is refused quickly, naming the factor with thousands of levels and how to go on', async () => {
    const error = await refused(wide, 'score ~ participant');
    expect(error.code).toBe('TOO_MANY_COLUMNS');
    expect(error.details).toMatchObject({ column: 'participant', field: 'maxColumns' });
    expect(error.message).toContain("The model has 3000 design columns, more than maxColumns = 1000. Factor 'participant' has 3000 levels");
    expect(error.message).toContain('--max-columns 3000');
  });

  it('is fitted when the limit is raised above its width, and refused just below it', async () => {
    const narrow = data('thirty.csv', ['participant,score', ...Array.from({ length: 120 }, (_, i) => `p${i % 30},${(i * 7919) % 101}`)].join('\n'));
    // 30 levels: an intercept and 29 columns.
    expect((await fitModel(narrow, { model: 'score ~ participant', maxColumns: 30 })).columns).toHaveLength(30);
    await expect(fitModel(narrow, { model: 'score ~ participant', maxColumns: 29 })).rejects.toMatchObject({ code: 'TOO_MANY_COLUMNS' });
  });
});
