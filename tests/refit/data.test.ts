import { describe, expect, it } from 'vitest';
import { detectDelimiter, fitAnova, fitModel, RefitError, type InMemoryTable } from '../../src/refit/index.js';
import { fixturePath } from './helpers.js';

async function refitError(promise: Promise<unknown>): Promise<RefitError> {
  try {
    await promise;
  } catch (err) {
    if (err instanceof RefitError) return err;
    throw err;
  }
  throw new Error('expected a RefitError');
}

const table = (rows: Array<Array<string | number | null>>, header = ['score', 'group', 'age']): InMemoryTable => ({ name: 'mem.csv', header, rows });

describe('delimiter detection', () => {
  it('picks the most frequent of comma, semicolon and tab in the header line', () => {
    expect(detectDelimiter('a,b,c')).toBe(',');
    expect(detectDelimiter('a;b;c')).toBe(';');
    expect(detectDelimiter('a\tb\tc')).toBe('\t');
    expect(detectDelimiter('"a;x",b,c')).toBe(',');
    expect(detectDelimiter('single')).toBe(',');
  });
});

describe('reading files', () => {
  it('reads a tab-separated file', async () => {
    const model = await fitModel(fixturePath('refit/simple.tsv'), { model: 'score ~ group + age' });
    expect(model.n).toBe(6);
    expect(model.variables.map((v) => [v.name, v.kind])).toEqual([['score', 'numeric'], ['group', 'factor'], ['age', 'numeric']]);
  });

  it('reads quoted fields with delimiters and doubled quotes inside', async () => {
    const model = await fitModel(fixturePath('refit/quoted.csv'), { model: 'score ~ group' });
    expect(model.n).toBe(6);
    expect(model.factorVars[0]!.levels).toEqual(['a', 'b']);
  });

  it('gives the same table for a file and the same table in memory', async () => {
    const mem = table([
      ['1.5', 'a', '30'], ['2.5', 'b', '31'], ['3.1', 'a', '29'], ['4.0', 'b', '33'], ['2.2', 'a', '35'], ['3.3', 'b', '28'],
    ]);
    const a = await fitAnova(fixturePath('refit/simple.tsv'), { model: 'score ~ group + age' });
    const b = await fitAnova(mem, { model: 'score ~ group + age' });
    expect(b).toEqual(a);
  });

  it('names file and row for a ragged row', async () => {
    const err = await refitError(fitAnova(fixturePath('refit/ragged.csv'), { model: 'score ~ group' }));
    expect(err.code).toBe('RAGGED_ROW');
    expect(err.details).toMatchObject({ file: 'ragged.csv', row: 4 });
    expect(err.message).toMatch(/ragged\.csv, row 4: 4 fields, but the header has 3 columns/);
  });

  it('names file, row and column for text in a numeric column', async () => {
    const err = await refitError(fitAnova(fixturePath('refit/text_in_numeric.csv'), { model: 'score ~ group + age' }));
    expect(err.code).toBe('TEXT_IN_NUMERIC_COLUMN');
    expect(err.details).toMatchObject({ file: 'text_in_numeric.csv', row: 5, column: 'age' });
    expect(err.message).toContain('"n/a"');
  });

  it('accepts that text once it is declared missing', async () => {
    const t = await fitAnova(fixturePath('refit/text_in_numeric.csv'), { model: 'score ~ group + age', missing: { age: 'n/a' } });
    expect(t.n).toBe(5);
    expect(t.droppedRows).toBe(1);
  });

  it('reports an empty file and a file with only a header', async () => {
    expect((await refitError(fitAnova(fixturePath('refit/empty.csv'), { model: 'score ~ group' }))).code).toBe('EMPTY_FILE');
    const err = await refitError(fitAnova(fixturePath('refit/header_only.csv'), { model: 'score ~ group' }));
    expect(err.code).toBe('EMPTY_FILE');
    expect(err.message).toMatch(/header but no data rows/);
  });

  it('reports a file that does not exist', async () => {
    expect((await refitError(fitAnova(fixturePath('refit/no_such_file.csv'), { model: 'score ~ group' }))).code).toBe('UNREADABLE_FILE');
  });

  it('suggests the closest column names for an unknown column in the formula', async () => {
    const err = await refitError(fitAnova(table([['1', 'a', '2']]), { model: 'score ~ grop + age' }));
    expect(err.code).toBe('UNKNOWN_COLUMN');
    expect(err.details.suggestions).toEqual(['group']);
    expect(err.message).toContain('did you mean "group"');
  });

  it('applies renames before reading the formula', async () => {
    const rows = [['1', 'a'], ['2', 'b'], ['3', 'a'], ['5', 'b']];
    const t = await fitAnova(table(rows, ['DV', 'GRP']), { model: 'score ~ group', rename: { DV: 'score', GRP: 'group' } });
    expect(t.terms[0]!.term).toBe('group');
    const err = await refitError(fitAnova(table(rows, ['DV', 'GRP']), { model: 'score ~ group', rename: { GRPX: 'group' } }));
    expect(err.details.field).toBe('rename.GRPX');
  });

  it('rejects a value outside the declared levels, naming row and column', async () => {
    const rows = [['1', '1'], ['2', '2'], ['3', '3'], ['4', '1'], ['5', '2']];
    const err = await refitError(fitAnova(table(rows, ['score', 'group']), { model: 'score ~ group', factors: { group: { levels: [1, 2] } } }));
    expect(err.code).toBe('UNKNOWN_LEVEL');
    expect(err.details).toMatchObject({ row: 4, column: 'group' });
  });

  it('matches declared numeric levels numerically ("1.0" is level 1) and keeps their order', async () => {
    const rows = [['1', '2.0'], ['2', '1.0'], ['3', '2'], ['4', '1'], ['6', '1']];
    const model = await fitModel(table(rows, ['score', 'group']), { model: 'score ~ group', factors: { group: { levels: [2, 1] } } });
    expect(model.factorVars[0]!.levels).toEqual(['2', '1']);
  });

  it('drops and counts rows with a missing value in a model variable only', async () => {
    const rows = [
      ['1', 'a', '30', 'x'], ['2', 'b', '', 'x'], ['NA', 'a', '31', 'x'], ['9', 'b', '32', ''], ['4', 'a', '99', 'x'],
      ['3', 'b', '33', 'x'], ['2', 'a', '34', 'x'], ['5', 'b', '35', 'x'],
    ];
    const t = await fitAnova(table(rows, ['score', 'group', 'age', 'note']), { model: 'score ~ group + age', missing: { age: '>=90', score: '9' } });
    expect(t.droppedRows).toBe(4);
    expect(t.n).toBe(4);
  });

  it('treats a numeric column as a factor only when declared', async () => {
    const rows = [['1', '1'], ['2', '2'], ['3', '3'], ['5', '1'], ['4', '2'], ['7', '3']];
    const asCovariate = await fitAnova(table(rows, ['score', 'g']), { model: 'score ~ g' });
    expect(asCovariate.terms[0]!.df).toBe(1);
    const asFactor = await fitAnova(table(rows, ['score', 'g']), { model: 'score ~ g', factors: { g: {} } });
    expect(asFactor.terms[0]!.df).toBe(2);
  });
});
