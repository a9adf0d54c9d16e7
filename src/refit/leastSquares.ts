/**
 * Least-squares building blocks: Givens row updates of a triangular factor,
 * Householder QR of a small dense matrix, and triangular solves.
 *
 * ## Method
 * The model is never solved through the normal equations. Rows are folded
 * into an upper-triangular factor R with Givens rotations as they stream in
 * (R'R = X'X at every step, without forming X'X), and small stacked matrices
 * are reduced with Householder reflections. For an augmented matrix [X y],
 * the last column of R holds Q'y: the sequential (type I) sum of squares of
 * a block of columns is the sum of squares of its entries of Q'y, and the
 * residual sum of squares is the square of the last diagonal entry. Both are
 * sums of squares of computed numbers, never differences of large totals.
 * The rank is checked on the diagonal of R against the column norms.
 *
 * ## References
 * - Golub, G. H. & Van Loan, C. F. (2013). Matrix Computations, 4th ed.,
 *   Johns Hopkins University Press: sections 5.1 (Householder and Givens),
 *   5.2 (QR factorization), 5.3 (full-rank least squares), 6.5 (updating
 *   matrix factorizations).
 * - Lawson, C. L. & Hanson, R. J. (1974). Solving Least Squares Problems.
 *   Prentice-Hall, chapter 27 (sequential accumulation of rows).
 */

/**
 * Folds one row `w` (length q, overwritten) into the q x q upper-triangular
 * factor `r` (row-major) with Givens rotations, keeping R'R + w w' = new R'R.
 */
export function givensRowUpdate(r: Float64Array, w: Float64Array, q: number): void {
  for (let j = 0; j < q; j++) {
    const b = w[j]!;
    if (b === 0) continue;
    const jj = j * q + j;
    const a = r[jj]!;
    const h = Math.sqrt(a * a + b * b);
    const c = a / h;
    const s = b / h;
    r[jj] = h;
    for (let l = j + 1; l < q; l++) {
      const t = r[j * q + l]!;
      const u = w[l]!;
      r[j * q + l] = c * t + s * u;
      w[l] = c * u - s * t;
    }
  }
}

/** A dense matrix, row-major. */
export interface Matrix {
  rows: number;
  cols: number;
  data: Float64Array;
}

export function matrix(rows: number, cols: number): Matrix {
  return { rows, cols, data: new Float64Array(rows * cols) };
}

/**
 * Householder QR of `a` (m x n, copied); returns the n x n upper-triangular R
 * (rows beyond min(m, n) are zero). Signs follow the reflections (the
 * diagonal may be negative); sums of squares do not depend on them.
 */
export function householderR(a: Matrix): Matrix {
  const m = a.rows;
  const n = a.cols;
  const x = Float64Array.from(a.data);
  const v = new Float64Array(m);
  const steps = Math.min(m, n);
  for (let k = 0; k < steps; k++) {
    // Norm of column k below the diagonal, scaled to avoid overflow.
    let scale = 0;
    for (let i = k; i < m; i++) scale = Math.max(scale, Math.abs(x[i * n + k]!));
    if (scale === 0) continue;
    let norm2 = 0;
    for (let i = k; i < m; i++) {
      const t = x[i * n + k]! / scale;
      norm2 += t * t;
    }
    const alpha0 = x[k * n + k]!;
    const norm = scale * Math.sqrt(norm2);
    const alpha = alpha0 > 0 ? -norm : norm;
    // v = x_k - alpha e_k (no cancellation: alpha has the opposite sign of x_kk)
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
  const r = matrix(n, n);
  for (let i = 0; i < Math.min(m, n); i++) {
    for (let j = i; j < n; j++) r.data[i * n + j] = x[i * n + j]!;
  }
  return r;
}

/** Columns `cols` of `a`, in that order. */
export function selectColumns(a: Matrix, cols: readonly number[]): Matrix {
  const out = matrix(a.rows, cols.length);
  for (let i = 0; i < a.rows; i++) {
    for (let j = 0; j < cols.length; j++) out.data[i * cols.length + j] = a.data[i * a.cols + cols[j]!]!;
  }
  return out;
}

/**
 * For the triangular factor R of an augmented matrix [X y] (y last), the sum
 * of squares explained by the columns `target` after the columns `keep`, and
 * the residual sum of squares of the model keep + target. Re-triangularizes
 * R restricted to keep, target, y (in that order) with Householder QR.
 */
export function sequentialSS(rAug: Matrix, keep: readonly number[], target: readonly number[]): { ss: number; rss: number } {
  const y = rAug.cols - 1;
  const cols = [...keep, ...target, y];
  const r = householderR(selectColumns(rAug, cols));
  const q = cols.length;
  let ss = 0;
  for (let i = keep.length; i < keep.length + target.length; i++) {
    const t = r.data[i * q + q - 1]!;
    ss += t * t;
  }
  const last = r.data[(q - 1) * q + q - 1]!;
  return { ss, rss: last * last };
}

/** Solves R b = c for upper-triangular R (n x n, leading block of a larger row-major matrix with stride `stride`). */
export function solveUpper(r: Float64Array, stride: number, n: number, c: Float64Array): Float64Array {
  const b = new Float64Array(n);
  for (let i = n - 1; i >= 0; i--) {
    let s = c[i]!;
    for (let j = i + 1; j < n; j++) s -= r[i * stride + j]! * b[j]!;
    b[i] = s / r[i * stride + i]!;
  }
  return b;
}

/** Solves R' b = c for upper-triangular R (forward substitution). */
export function solveUpperTransposed(r: Float64Array, stride: number, n: number, c: Float64Array): Float64Array {
  const b = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = c[i]!;
    for (let j = 0; j < i; j++) s -= r[j * stride + i]! * b[j]!;
    b[i] = s / r[i * stride + i]!;
  }
  return b;
}
