import { describe, expect, it } from 'vitest';
import { fitAnova, RefitError, type InMemoryTable } from '../../src/refit/index.js';

async function refitError(promise: Promise<unknown>): Promise<RefitError> {
  try {
    await promise;
  } catch (err) {
    if (err instanceof RefitError) return err;
    throw err;
  }
  throw new Error('expected a RefitError');
}

const mem = (header: string[], rows: Array<Array<string | number>>): InMemoryTable => ({ name: 'mem', header, rows });

describe('designs that cannot be analysed', () => {
  it('names the empty cell of an interaction', async () => {
    const rows = [
      ['1', 'a1', 'b1'], ['2', 'a1', 'b1'], ['3', 'a1', 'b2'], ['4', 'a1', 'b2'],
      ['5', 'a2', 'b1'], ['6', 'a2', 'b1'], ['2', 'a3', 'b1'], ['1', 'a3', 'b2'], ['9', 'a3', 'b2'],
    ];
    const err = await refitError(fitAnova(mem(['y', 'a', 'b'], rows), { model: 'y ~ a*b' }));
    expect(err.code).toBe('EMPTY_CELL');
    expect(err.message).toContain('a=a2, b=b2');
    expect(err.details.term).toBe('a:b');
  });

  it('reports a factor with one level', async () => {
    const rows = [['1', 'x', 'u'], ['2', 'x', 'v'], ['3', 'x', 'u'], ['5', 'x', 'v']];
    const err = await refitError(fitAnova(mem(['y', 'a', 'b'], rows), { model: 'y ~ a + b' }));
    expect(err.code).toBe('SINGLE_LEVEL_FACTOR');
    expect(err.details.column).toBe('a');
  });

  it('reports a declared level without data', async () => {
    const rows = [['1', 'x'], ['2', 'y'], ['3', 'x'], ['5', 'y']];
    const err = await refitError(fitAnova(mem(['y', 'a'], rows), { model: 'y ~ a', factors: { a: { levels: ['x', 'y', 'z'] } } }));
    expect(err.code).toBe('EMPTY_CELL');
    expect(err.message).toContain('"z"');
  });

  it('reports an outcome with no variance', async () => {
    const rows = [['4', 'x'], ['4', 'y'], ['4.0', 'x'], ['4', 'y']];
    const err = await refitError(fitAnova(mem(['y', 'a'], rows), { model: 'y ~ a' }));
    expect(err.code).toBe('CONSTANT_OUTCOME');
  });

  it('reports an aliased covariate (a copy of another)', async () => {
    const rows = [['1', '3', '6'], ['2', '5', '10'], ['4', '2', '4'], ['3', '7', '14'], ['6', '1', '2']];
    const err = await refitError(fitAnova(mem(['y', 'x', 'x2'], rows), { model: 'y ~ x + x2' }));
    expect(err.code).toBe('ALIASED_TERM');
    expect(err.details.term).toBe('x2');
  });

  it('reports a constant covariate', async () => {
    const rows = [['1', 'a', '3'], ['2', 'b', '3'], ['4', 'a', '3'], ['3', 'b', '3'], ['6', 'a', '3']];
    const err = await refitError(fitAnova(mem(['y', 'g', 'x'], rows), { model: 'y ~ g + x' }));
    expect(err.code).toBe('ALIASED_TERM');
    expect(err.message).toContain("covariate 'x' is constant");
  });

  it('reports a factor aliased with another (same grouping under two names)', async () => {
    const rows = [['1', 'a', 'p'], ['2', 'b', 'q'], ['4', 'a', 'p'], ['3', 'b', 'q'], ['6', 'a', 'p']];
    const err = await refitError(fitAnova(mem(['y', 'g', 'h'], rows), { model: 'y ~ g + h' }));
    expect(err.code).toBe('ALIASED_TERM');
    expect(err.details.term).toBe('h');
  });

  it('reports a saturated model (no residual df)', async () => {
    const rows = [['1', 'a'], ['2', 'b']];
    const err = await refitError(fitAnova(mem(['y', 'g'], rows), { model: 'y ~ g' }));
    expect(err.code).toBe('RESIDUAL_DF');
  });
});
