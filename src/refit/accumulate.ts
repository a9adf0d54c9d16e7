import type { CompleteRowSink, VariableReader } from './data.js';
import { givensRowUpdate } from './leastSquares.js';

/**
 * Streaming sufficient statistics: one small triangular factor per design
 * cell (combination of factor levels).
 *
 * ## Method
 * Within a cell every factor-coded design column is constant, and every
 * column that involves covariates is a linear function of the cell's numeric
 * vector b = [1, covariate deltas, raw covariate products, outcome delta].
 * So the cell's block of the augmented design is B_g A_g for a fixed matrix
 * A_g, and its QR factor follows from the QR factor R_g of B_g alone. R_g is
 * updated row by row with Givens rotations (no sums of squares, no
 * cross-products are formed). Memory is O(cells x q^2), whatever the number
 * of rows; each row costs O(q^2) with q = 2 + number of numeric columns.
 *
 * ## References
 * - Golub, G. H. & Van Loan, C. F. (2013). Matrix Computations, 4th ed.,
 *   section 6.5.3 (adding a row to a QR factorization).
 * - Miller, A. J. (1992). Algorithm AS 274: Least squares routines to
 *   supplement those of Gentleman. Applied Statistics 41(2), 458-478.
 */

export interface Cell {
  /** Factor level indices in order of first appearance, one per factor. */
  levels: Int32Array;
  n: number;
  /** q x q upper-triangular factor of the cell's [1, numeric basis] rows. */
  r: Float64Array;
}

/** A product of two or more numeric predictors used by a term (raw values, not deltas). */
export interface NumericProduct {
  /** Numeric slots (indices into the numeric variables) multiplied together. */
  slots: number[];
}

export class CellAccumulator implements CompleteRowSink {
  readonly cells = new Map<number | string, Cell>();
  factorCount = 0;
  /** Numeric variables (outcome last). */
  numericCount = 0;
  products: NumericProduct[] = [];
  /** Basis length q = 1 + (numeric predictors) + products + 1 (outcome). */
  q = 0;
  outcomeMin = Infinity;
  outcomeMax = -Infinity;
  private origins = new Float64Array(0);
  private w = new Float64Array(0);
  private numericKey = true;

  constructor(private readonly productSets: (variables: readonly VariableReader[]) => NumericProduct[]) {}

  start(variables: readonly VariableReader[]): void {
    const factors = variables.filter((v) => v.kind === 'factor');
    const numerics = variables.filter((v) => v.kind === 'numeric');
    this.factorCount = factors.length;
    this.numericCount = numerics.length;
    this.origins = new Float64Array(numerics.length);
    for (const v of numerics) this.origins[v.slot] = v.shifted.origin;
    this.products = this.productSets(variables);
    this.q = 1 + (this.numericCount - 1) + this.products.length + 1;
    this.w = new Float64Array(this.q);
    this.numericKey = this.factorCount <= 4;
  }

  /** Basis position of a numeric predictor slot (the outcome is at q - 1). */
  basisOfNumeric(slot: number): number {
    return slot === this.numericCount - 1 ? this.q - 1 : 1 + slot;
  }

  basisOfProduct(index: number): number {
    return this.numericCount + index;
  }

  add(levelIndex: Int32Array, deltas: Float64Array): void {
    let key: number | string;
    if (this.numericKey) {
      key = 0;
      for (let i = 0; i < this.factorCount; i++) {
        const l = levelIndex[i]!;
        if (l >= 4096) {
          this.numericKey = false;
          this.rekey();
          return this.add(levelIndex, deltas);
        }
        key = key * 4096 + l;
      }
    } else {
      key = Array.prototype.join.call(levelIndex, ',');
    }
    let cell = this.cells.get(key);
    if (cell === undefined) {
      cell = { levels: Int32Array.from(levelIndex), n: 0, r: new Float64Array(this.q * this.q) };
      this.cells.set(key, cell);
    }
    cell.n++;
    const w = this.w;
    const k = this.numericCount;
    w[0] = 1;
    for (let i = 0; i < k - 1; i++) w[1 + i] = deltas[i]!;
    for (let p = 0; p < this.products.length; p++) {
      let prod = 1;
      for (const s of this.products[p]!.slots) prod *= this.origins[s]! + deltas[s]!;
      w[k + p] = prod;
    }
    const y = deltas[k - 1]!;
    w[this.q - 1] = y;
    if (y < this.outcomeMin) this.outcomeMin = y;
    if (y > this.outcomeMax) this.outcomeMax = y;
    givensRowUpdate(cell.r, w, this.q);
  }

  private rekey(): void {
    const old = [...this.cells.values()];
    this.cells.clear();
    for (const c of old) this.cells.set(Array.prototype.join.call(c.levels, ','), c);
  }

  /** Total number of rows accumulated. */
  get n(): number {
    let n = 0;
    for (const c of this.cells.values()) n += c.n;
    return n;
  }
}
