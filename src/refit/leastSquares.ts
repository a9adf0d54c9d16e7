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
  const dots = new Float64Array(n);
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
    // x_j -= (2 v'x_j / v'v) v for every column j >= k. The dot products are
    // summed row by row, each in the same order as a column-by-column loop
    // would (so the result is the same to the last bit), but the matrix is
    // read along its rows, as it lies in memory: column by column, every
    // read of a wide matrix missed the cache.
    dots.fill(0, k, n);
    for (let i = k; i < m; i++) {
      const vi = v[i]!;
      const row = i * n;
      for (let j = k; j < n; j++) dots[j] = dots[j]! + vi * x[row + j]!;
    }
    for (let j = k; j < n; j++) dots[j] = (2 * dots[j]!) / vnorm2;
    for (let i = k; i < m; i++) {
      const vi = v[i]!;
      const row = i * n;
      for (let j = k; j < n; j++) x[row + j] = x[row + j]! - dots[j]! * vi;
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

/**
 * Most values (rows times columns) of stacked blocks held at once by
 * factorOfBlocks: 2^24 doubles, 128 MB (householderR copies them once more).
 */
export const STACKED_VALUES = 1 << 24;

/**
 * Folds `count` rows (row-major, `width` columns, overwritten) into the
 * upper-triangular factor `r` (width x width, row-major), so that afterwards
 * R'R = (R'R before) + rows' rows. One Householder reflection per column k
 * acts on R's diagonal entry and the rows' entries of column k only: R's
 * zeros below the diagonal stay zero, so a fold costs O(count x width^2),
 * whatever the size of R (Golub & Van Loan 2013, section 6.5.3, adding rows
 * to a QR factorization). Scaled and signed as in householderR.
 */
export function foldRowsIntoFactor(r: Float64Array, rows: Float64Array, count: number, width: number): void {
  const dots = new Float64Array(width);
  for (let k = 0; k < width; k++) {
    const kk = k * width + k;
    let scale = Math.abs(r[kk]!);
    for (let i = 0; i < count; i++) scale = Math.max(scale, Math.abs(rows[i * width + k]!));
    if (scale === 0) continue;
    const alpha0 = r[kk]!;
    let norm2 = (alpha0 / scale) ** 2;
    for (let i = 0; i < count; i++) norm2 += (rows[i * width + k]! / scale) ** 2;
    const norm = scale * Math.sqrt(norm2);
    const alpha = alpha0 > 0 ? -norm : norm;
    // The reflector is (alpha0 - alpha, rows' column k); no cancellation, as alpha has the opposite sign of alpha0.
    const head = alpha0 - alpha;
    let vnorm2 = head * head;
    for (let i = 0; i < count; i++) vnorm2 += rows[i * width + k]! ** 2;
    if (vnorm2 === 0) continue;
    // As in householderR: the rows are read along their length, not down the columns.
    for (let j = k + 1; j < width; j++) dots[j] = head * r[k * width + j]!;
    for (let i = 0; i < count; i++) {
      const vi = rows[i * width + k]!;
      const row = i * width;
      for (let j = k + 1; j < width; j++) dots[j] = dots[j]! + vi * rows[row + j]!;
    }
    for (let j = k + 1; j < width; j++) {
      dots[j] = (2 * dots[j]!) / vnorm2;
      r[k * width + j] = r[k * width + j]! - dots[j]! * head;
    }
    for (let i = 0; i < count; i++) {
      const vi = rows[i * width + k]!;
      const row = i * width;
      for (let j = k + 1; j < width; j++) rows[row + j] = rows[row + j]! - dots[j]! * vi;
    }
    r[kk] = alpha;
    for (let i = 0; i < count; i++) rows[i * width + k] = 0;
  }
}

/**
 * The triangular factor R of `blocks` blocks of `blockRows` rows each
 * (`width` columns), which `write(index, into)` writes row-major into
 * `into`, and the Euclidean norm of each column over all those rows.
 *
 * A stack within `budget` values is reduced at once with householderR.
 * A larger one (many design cells times many columns) is written in
 * batches of at most `budget` values, each folded into R as it fills
 * (foldRowsIntoFactor): the same R'R in the same time, and memory bounded
 * by R and one batch instead of the whole stack.
 */
export function factorOfBlocks(
  blocks: number,
  blockRows: number,
  width: number,
  write: (index: number, into: Float64Array) => void,
  budget = STACKED_VALUES,
): { r: Matrix; columnNorms: Float64Array } {
  const totalRows = blocks * blockRows;
  const oneStep = totalRows * width <= budget;
  const batchBlocks = oneStep ? blocks : Math.max(1, Math.floor(budget / (blockRows * width)));
  const stacked = new Float64Array(batchBlocks * blockRows * width);
  const columnNorms = new Float64Array(width);
  const r = oneStep ? null : matrix(width, width);
  let row = 0;
  for (let index = 0; index < blocks; index++) {
    if (r !== null && row + blockRows > batchBlocks * blockRows) {
      foldRowsIntoFactor(r.data, stacked, row, width);
      row = 0;
    }
    const into = stacked.subarray(row * width, (row + blockRows) * width);
    write(index, into);
    for (let i = 0; i < blockRows; i++) {
      for (let j = 0; j < width; j++) columnNorms[j] = Math.hypot(columnNorms[j]!, into[i * width + j]!);
    }
    row += blockRows;
  }
  if (r === null) return { r: householderR({ rows: row, cols: width, data: stacked.subarray(0, row * width) }), columnNorms };
  foldRowsIntoFactor(r.data, stacked, row, width);
  return { r, columnNorms };
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
