import { describe, expect, it } from 'vitest';
import { factorOfBlocks, householderR } from '../../src/refit/leastSquares.js';
import { seededRandom } from '../../bench/seededRandom.js';

/** R'R, which does not depend on the signs Householder gives R's rows. */
function gram(r: Float64Array, n: number): Float64Array {
  const out = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += r[k * n + i]! * r[k * n + j]!;
      out[i * n + j] = s;
    }
  }
  return out;
}

describe('factor of stacked blocks', () => {
  const width = 7;
  const blockRows = 3;
  const blocks = 40;
  const random = seededRandom(19);
  const data = Float64Array.from({ length: blocks * blockRows * width }, () => random() * 10 - 5);
  const write = (index: number, into: Float64Array) => into.set(data.subarray(index * blockRows * width, (index + 1) * blockRows * width));

  it('reduced in batches within a small budget, gives the factor of the whole stack (same R\'R, same column norms)', () => {
    const whole = factorOfBlocks(blocks, blockRows, width, write);
    // A budget of 12 rows: the 120 rows go in batches of 12, each under the factor so far.
    const batched = factorOfBlocks(blocks, blockRows, width, write, 12 * width);
    const a = gram(whole.r.data, width);
    const b = gram(batched.r.data, width);
    for (let index = 0; index < a.length; index++) expect(Math.abs(a[index]! - b[index]!)).toBeLessThan(1e-10 * Math.max(1, Math.abs(a[index]!)));
    expect(batched.columnNorms).toEqual(whole.columnNorms);
    // And R'R is X'X of the rows themselves.
    let xtx00 = 0;
    for (let row = 0; row < blocks * blockRows; row++) xtx00 += data[row * width]! ** 2;
    expect(a[0]).toBeCloseTo(xtx00, 8);
  });

  it('holds a stack within the budget at once: the budget is not the number of rows', () => {
    const one = factorOfBlocks(blocks, blockRows, width, write, blocks * blockRows * width);
    const whole = factorOfBlocks(blocks, blockRows, width, write);
    expect(one.r.data).toEqual(whole.r.data);
  });
});

/** Householder QR written column by column, as householderR was before it read the matrix along its rows: the reference for bit-for-bit equality. */
function householderColumnByColumn(data: Float64Array, m: number, n: number): Float64Array {
  const x = Float64Array.from(data);
  const v = new Float64Array(m);
  for (let k = 0; k < Math.min(m, n); k++) {
    let scale = 0;
    for (let i = k; i < m; i++) scale = Math.max(scale, Math.abs(x[i * n + k]!));
    if (scale === 0) continue;
    let norm2 = 0;
    for (let i = k; i < m; i++) norm2 += (x[i * n + k]! / scale) ** 2;
    const alpha0 = x[k * n + k]!;
    const norm = scale * Math.sqrt(norm2);
    const alpha = alpha0 > 0 ? -norm : norm;
    for (let i = k; i < m; i++) v[i] = x[i * n + k]!;
    v[k] = alpha0 - alpha;
    let vnorm2 = 0;
    for (let i = k; i < m; i++) vnorm2 += v[i]! * v[i]!;
    if (vnorm2 === 0) continue;
    for (let j = k; j < n; j++) {
      let dot = 0;
      for (let i = k; i < m; i++) dot += v[i]! * x[i * n + j]!;
      const f = (2 * dot) / vnorm2;
      for (let i = k; i < m; i++) x[i * n + j] = x[i * n + j]! - f * v[i]!;
    }
    x[k * n + k] = alpha;
    for (let i = k + 1; i < m; i++) x[i * n + k] = 0;
  }
  const r = new Float64Array(n * n);
  for (let i = 0; i < Math.min(m, n); i++) for (let j = i; j < n; j++) r[i * n + j] = x[i * n + j]!;
  return r;
}

describe('Householder QR read along the rows', () => {
  it('gives the same R, to the last bit, as the column-by-column loops (tall, square, wide, with zero columns)', () => {
    const random = seededRandom(7);
    for (const [m, n] of [[40, 7], [9, 9], [5, 12], [60, 30]] as const) {
      const data = Float64Array.from({ length: m * n }, (_, index) => (index % n === 3 ? 0 : random() * 200 - 100));
      expect(householderR({ rows: m, cols: n, data }).data).toEqual(householderColumnByColumn(data, m, n));
    }
  });
});
