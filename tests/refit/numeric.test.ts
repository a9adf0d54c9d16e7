import { describe, expect, it } from 'vitest';
import { CellAccumulator } from '../../src/refit/accumulate.js';
import { VariableReader } from '../../src/refit/data.js';
import { ShiftedColumn, parseCellNumber } from '../../src/refit/numeric.js';

describe('cell numbers', () => {
  it('parses plain and scientific decimals only', () => {
    expect(parseCellNumber('1.5')).toBe(1.5);
    expect(parseCellNumber('-2e3')).toBe(-2000);
    expect(parseCellNumber('.5')).toBe(0.5);
    expect(parseCellNumber('0x10')).toBeNaN();
    expect(parseCellNumber('Infinity')).toBeNaN();
    expect(parseCellNumber('abc')).toBeNaN();
    expect(parseCellNumber('1,5')).toBeNaN();
    expect(parseCellNumber('1,5', true)).toBe(1.5);
  });

  it('reads decimal numbers with an optional sign and exponent, and nothing else that Number() reads', () => {
    expect(parseCellNumber('+4.')).toBe(4);
    expect(parseCellNumber('-.5e-1')).toBe(-0.05);
    expect(parseCellNumber('1E3')).toBe(1000);
    // Other bases, special values, overflow, blanks and white space around a number (cells are trimmed before they are parsed).
    for (const text of ['0b101', '0o17', '0x1F', '0X1f', '-0x1', 'Infinity', '-Infinity', 'NaN', '1e999', '-1e999', '', ' ', '\t', ' 1', '1 ', '1\r', '1_000', '1.2.3', '.', '+', 'e5', '1e', '1e+']) {
      expect(parseCellNumber(text), JSON.stringify(text)).toBeNaN();
    }
  });

  it('measures values from the first one exactly in decimal when they share many digits', () => {
    const col = new ShiftedColumn();
    expect(col.delta('1000000000000.4', 1000000000000.4)).toBe(0);
    // The doubles of these two values differ by 0.0999755859375; the decimal difference is 0.1.
    expect(col.delta('1000000000000.3', 1000000000000.3)).toBe(-0.1);
    expect(col.delta('1000000000000.5', 1000000000000.5)).toBe(0.1);
    expect(col.delta('1.0000000000006e12', 1.0000000000006e12)).toBe(0.2);
    expect(col.delta('2000000000000', 2e12)).toBe(2e12 - 1000000000000.4);
  });
});

describe('cell accumulator', () => {
  it('switches to text keys when a factor has 4096 levels or more, keeping the cells', () => {
    const reader = new VariableReader('g', 'factor', undefined, undefined, {});
    reader.slot = 0;
    const y = new VariableReader('y', 'numeric', undefined, undefined, {});
    y.slot = 0;
    y.shifted.delta('0', 0);
    const acc = new CellAccumulator(() => []);
    acc.start([y, reader]);
    const deltas = new Float64Array([1]);
    for (const level of [0, 1, 4095, 4096, 5000, 1, 4096]) acc.add(Int32Array.of(level), deltas);
    expect(acc.cells.size).toBe(5);
    expect(acc.n).toBe(7);
    expect([...acc.cells.values()].find((c) => c.levels[0] === 4096)!.n).toBe(2);
  });
});
