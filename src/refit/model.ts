import { fUpperTail } from '../stats/fDistribution.js';
import { CellAccumulator, type NumericProduct } from './accumulate.js';
import { ModelFrameReader, streamRows, type OutOfRange, type CompleteRowSink, type DataSource, type VariableInfo, type VariableReader } from './data.js';
import { RefitError } from './errors.js';
import { factorOfBlocks, sequentialSS, solveUpper, solveUpperTransposed, type Matrix } from './leastSquares.js';
import { parseCellNumber } from './numeric.js';
import { MAX_COLUMNS_CEILING, MAX_COLUMNS_CEILING_REASON, parseAnalysisSpec, type ResolvedSpec } from './spec.js';

/**
 * The linear model and its ANOVA/ANCOVA table with type I, II or III sums of
 * squares.
 *
 * ## Method
 * Design: an intercept, then each term's columns in formula order. A factor
 * with L levels gets L - 1 columns, deviation ("sum", the default: level i
 * is 1 in column i, the last level is -1 in every column) or treatment
 * (dummy, first level as reference) coding; an interaction's columns are the
 * products of its factors' columns (the first factor varies fastest) times
 * its covariates. A covariate's main-effect column is measured from an
 * origin (its first value); in interactions covariates enter with their raw
 * values, as written in the model, so type III tests of the factors mean
 * what they mean in other software.
 *
 * Fit: the per-cell triangular factors collected while streaming
 * (accumulate.ts) are mapped to design columns, stacked and reduced with
 * Householder QR to the factor R of the augmented design [X y]. Sums of
 * squares come from re-triangularizing column subsets of R (leastSquares.ts,
 * sequentialSS):
 * - type I: term after all terms before it in the formula (sequential);
 * - type II: term after every term that does not contain it (a term
 *   contains another when its variables are a superset);
 * - type III: term after all other terms (meaningful with sum coding; with
 *   treatment coding the tests depend on the reference levels).
 * Every F uses the full model's residual mean square.
 *
 * ## References
 * - Searle, S. R. (1987). Linear Models for Unbalanced Data. Wiley,
 *   chapters 4 and 12 (sums of squares of types I-III).
 * - Fox, J. (2016). Applied Regression Analysis and Generalized Linear
 *   Models, 3rd ed. Sage, section 8.2.4 (types I, II, III) and 8.2.2
 *   (deviation coding).
 * - Golub, G. H. & Van Loan, C. F. (2013). Matrix Computations, 4th ed.,
 *   section 5.3 (least squares by QR).
 */

export type SsType = 1 | 2 | 3;
export type Coding = 'sum' | 'treatment';

export interface AnovaRow {
  term: string;
  ss: number;
  df: number;
  ms: number;
  F: number;
  p: number;
  partialEtaSquared: number;
}

export interface AnovaTable {
  n: number;
  droppedRows: number;
  type: SsType;
  coding: Coding;
  terms: AnovaRow[];
  residual: { ss: number; df: number; ms: number };
}

type NumericPart =
  | { kind: 'none' }
  | { kind: 'delta'; slot: number }
  | { kind: 'raw'; slot: number }
  | { kind: 'product'; index: number };

export interface DesignColumn {
  name: string;
  /** Index into the model's terms, or -1 for the intercept. */
  term: number;
  factorCodes: Array<{ factor: number; column: number }>;
  numeric: NumericPart;
}

export interface ModelTerm {
  name: string;
  variables: string[];
  /** Factor slots and numeric slots of the term's variables. */
  factors: number[];
  numerics: number[];
  columns: number[];
}

/** Value of deviation or treatment coding column `column` for level `level` of an L-level factor. */
export function codingValue(coding: Coding, levels: number, level: number, column: number): number {
  if (coding === 'sum') return level === column ? 1 : level === levels - 1 ? -1 : 0;
  return level === column + 1 ? 1 : 0;
}

/**
 * The factor's labels keyed by its level codes as they are in the data: a label given for "1" labels the level
 * written "1.0" too. A label for no level in the data is kept under its own key (checkData reports it).
 */
function labelsByLevel(v: VariableInfo): ReadonlyMap<string, string> {
  const out = new Map<string, string>();
  for (const [key, label] of v.labels) {
    const k = key.trim();
    const n = parseCellNumber(k);
    const level = v.levels.find((l) => l === k) ?? (Number.isNaN(n) ? undefined : v.levels.find((l) => parseCellNumber(l) === n));
    out.set(level ?? k, label);
  }
  return out;
}

function describeLevel(v: VariableInfo, code: string): string {
  const label = v.labels.get(code);
  return label !== undefined ? `${code} (${label})` : code;
}

export class FittedModel {
  readonly columns: DesignColumn[] = [];
  readonly terms: ModelTerm[] = [];
  /** Factor variables by slot, numeric variables by slot (outcome last). */
  readonly factorVars: VariableInfo[];
  readonly numericVars: VariableInfo[];
  readonly n: number;
  /** (p + 1) x (p + 1) triangular factor of [X y]. */
  readonly rAug: Matrix;
  readonly residualSS: number;
  readonly residualDf: number;
  /** Overall means of the numeric predictors (raw values), by numeric slot. */
  readonly numericMeans: number[];
  /**
   * Every combination of factor levels with data: final level indices (by
   * factor slot), rows, and the cell's triangular factor of [1, numeric
   * basis, outcome delta] (accumulate.ts).
   */
  readonly cells: ReadonlyArray<{ levels: Int32Array; n: number; r: Float64Array }>;
  /** The outcome's values (deltas from its origin) of each cell, in the order of `cells`, when the fit was asked to keep them. */
  readonly outcomeByCell: ReadonlyArray<readonly number[]> | undefined;
  /** Levels found in the data that have no analysed rows once rows with missing values are removed: left out of the model. */
  readonly droppedLevels: Array<{ factor: string; level: string; label: string }> = [];
  /** Cells of numeric columns outside their declared ranges (kept in the analysis). */
  outOfRange: OutOfRange[] = [];
  /** By numeric slot: what each covariate is measured from where it enters an interaction (its mean with --center, else 0). */
  readonly centers: number[];

  constructor(
    readonly spec: ResolvedSpec,
    readonly variables: VariableInfo[],
    readonly droppedRows: number,
    private readonly acc: CellAccumulator,
    readers: readonly VariableReader[],
    keptOutcome?: ReadonlyMap<string, number[]>,
  ) {
    const factorReaders = readers.filter((r) => r.kind === 'factor').sort((a, b) => a.slot - b.slot);
    const numericReaders = readers.filter((r) => r.kind === 'numeric').sort((a, b) => a.slot - b.slot);
    const info = (r: VariableReader): VariableInfo => variables.find((v) => v.name === r.name)!;
    this.numericVars = numericReaders.map(info);
    const remaps = factorReaders.map((r) => r.orderedLevels().remap);
    // Levels met in the data but with no analysed row (their rows all had a missing value elsewhere) leave the model, with a note;
    // a declared level without rows stays, and is reported as an error by checkData.
    const withRows = factorReaders.map(() => new Set<number>());
    for (const c of acc.cells.values()) c.levels.forEach((l, i) => withRows[i]!.add(remaps[i]![l]!));
    this.factorVars = factorReaders.map((r, i) => {
      const v = info(r);
      const labels = labelsByLevel(v);
      if (v.declaredLevels || withRows[i]!.size === v.levels.length) return { ...v, labels };
      const keep = v.levels.map((_, l) => withRows[i]!.has(l));
      const shift = new Int32Array(v.levels.length);
      let next = 0;
      v.levels.forEach((level, l) => {
        if (keep[l]) shift[l] = next++;
        else this.droppedLevels.push({ factor: v.name, level, label: labels.get(level) ?? level });
      });
      const remap = remaps[i]!;
      for (let k = 0; k < remap.length; k++) remap[k] = shift[remap[k]!]!;
      return { ...v, labels, levels: v.levels.filter((_, l) => keep[l]) };
    });
    const cells = [...acc.cells.values()].map((c) => ({
      n: c.n,
      r: c.r,
      levels: Int32Array.from(c.levels, (l, i) => remaps[i]![l]!),
      kept: keptOutcome?.get(Array.prototype.join.call(c.levels, ',')),
    }));
    // In level order, the first factor varying slowest: the order a table of cells is read in.
    // (A sorted copy: the fit below stacks the cells in the order they were met, as before.)
    const ordered = [...cells].sort((x, y) => {
      for (let i = 0; i < x.levels.length; i++) if (x.levels[i] !== y.levels[i]) return x.levels[i]! - y.levels[i]!;
      return 0;
    });
    this.cells = ordered.map(({ levels, n, r }) => ({ levels, n, r }));
    this.outcomeByCell = keptOutcome === undefined ? undefined : ordered.map((c) => c.kept ?? []);
    this.n = acc.n;
    this.checkData(cells);
    // Means of the numeric predictors (raw), weighted by cell size.
    this.numericMeans = this.numericVars.map((v, slot) => {
      if (slot === this.numericVars.length - 1) return NaN;
      let sum = 0;
      for (const c of cells) sum += c.r[0]! * c.r[this.acc.basisOfNumeric(slot)]!;
      return v.origin + sum / this.n;
    });
    this.centers = this.numericMeans.map((mean, slot) => (spec.center && slot < this.numericVars.length - 1 ? mean : 0));
    this.buildColumns();
    const p = this.columns.length;
    if (p > spec.maxColumns) this.tooManyColumns(p);
    const q = acc.q;

    // Stack R_g A_g for every cell, then reduce with Householder QR (in batches when the stack is large).
    const width = p + 1;
    const a = new Float64Array(q * width);
    const { r: rAug, columnNorms: colNorm } = factorOfBlocks(cells.length, q, width, (index, into) => {
      const cell = cells[index]!;
      this.cellMap(cell.levels, a);
      for (let i = 0; i < q; i++) {
        for (let j = 0; j <= p; j++) {
          let s = 0;
          for (let k = i; k < q; k++) s += cell.r[i * q + k]! * a[k * width + j]!;
          into[i * width + j] = s;
        }
      }
    });
    this.rAug = rAug;
    for (let j = 0; j < p; j++) {
      const d = Math.abs(this.rAug.data[j * (p + 1) + j]!);
      if (!(d > 1e-9 * colNorm[j]!)) this.aliased(j, colNorm[j]!);
    }
    const last = this.rAug.data[p * (p + 1) + p]!;
    this.residualSS = last * last;
    this.residualDf = this.n - p;
    if (this.residualDf < 1) {
      throw new RefitError(
        'RESIDUAL_DF',
        `The model has ${p} parameters for ${this.n} rows, leaving no residual degrees of freedom; simplify the model (drop interactions) or use more data.`,
      );
    }
  }

  private checkData(cells: Array<{ n: number; levels: Int32Array }>): void {
    const { spec } = this;
    const cli = spec.advice === 'command-line';
    // A column with one analysed row per level is an identifier (or a measure), not a grouping.
    this.factorVars.forEach((v, slot) => {
      const rows = new Map<number, number>();
      for (const c of cells) rows.set(c.levels[slot]!, (rows.get(c.levels[slot]!) ?? 0) + c.n);
      if (rows.size >= 5 && [...rows.values()].every((n) => n === 1)) {
        throw new RefitError(
          'IDENTIFIER_FACTOR',
          `Factor '${v.name}' has one analysed row per level (${rows.size} levels for ${this.n} rows): it looks like an identifier (a participant number or a name), not a grouping. ` +
            `Leave it out of the model${spec.factors.has(v.name) ? (cli ? ` and drop --factor ${v.name}` : ` and remove it from "factors"`) : ''}; if it is a measure, make it a covariate (${cli ? `--covariate ${v.name}` : `"covariates": ["${v.name}"]`}).`,
          { column: v.name },
        );
      }
    });
    for (const v of this.factorVars) {
      for (const key of v.labels.keys()) {
        if (v.levels.includes(key) || this.droppedLevels.some((d) => d.factor === v.name && d.level === key)) continue;
        throw new RefitError(
          'UNKNOWN_LABEL',
          `Factor '${v.name}': a label is given for level "${key}" ("${v.labels.get(key)}"), but '${v.name}' has no such level in the data (its levels: ${v.levels.join(', ')}). ` +
            `Fix or remove it in ${cli ? `--labels "${v.name}=..."` : `factors.${v.name}.labels`}.`,
          { column: v.name, field: `factors.${v.name}.labels` },
        );
      }
    }
    this.factorVars.forEach((v, slot) => {
      const present = new Set(cells.map((c) => c.levels[slot]!));
      if (v.levels.length < 2 || present.size < 2) {
        throw new RefitError(
          'SINGLE_LEVEL_FACTOR',
          `Factor '${v.name}' has only one level${present.size === 1 ? ` with data ("${v.levels[[...present][0]!]}")` : ''} among the ${this.n} analysed rows, ` +
            `so it cannot explain any variance. Remove it from the model, or check its missing-value codes and the rows dropped.`,
          { column: v.name },
        );
      }
      for (let l = 0; l < v.levels.length; l++) {
        if (!present.has(l)) {
          throw new RefitError(
            'EMPTY_CELL',
            `Factor '${v.name}': declared level "${describeLevel(v, v.levels[l]!)}" has no analysed rows; remove it from ${cli ? `--levels "${v.name}=..."` : `factors.${v.name}.levels`} or merge it with another level.`,
            { column: v.name, field: `factors.${v.name}.levels` },
          );
        }
      }
    });
    if (!(this.acc.outcomeMax > this.acc.outcomeMin)) {
      throw new RefitError(
        'CONSTANT_OUTCOME',
        `The outcome '${spec.outcome}' has the same value in all ${this.n} analysed rows (no variance to analyse). Check that the right column is the outcome and its missing-value codes.`,
        { column: spec.outcome },
      );
    }
    // Every combination of the levels of the factors in each interaction must have data.
    for (const term of spec.formula.terms) {
      const slots = term.variables.map((name) => this.factorVars.findIndex((v) => v.name === name)).filter((s) => s >= 0);
      if (slots.length < 2) continue;
      const seen = new Set(cells.map((c) => slots.map((s) => c.levels[s]).join(',')));
      const sizes = slots.map((s) => this.factorVars[s]!.levels.length);
      const idx = new Array<number>(slots.length).fill(0);
      for (;;) {
        if (!seen.has(idx.join(','))) {
          const where = slots.map((s, i) => `${this.factorVars[s]!.name}=${describeLevel(this.factorVars[s]!, this.factorVars[s]!.levels[idx[i]!]!)}`).join(', ');
          throw new RefitError(
            'EMPTY_CELL',
            `Empty cell ${where}: no analysed rows have this combination, so the ${term.name} interaction cannot be estimated in full ` +
              `and type III sums of squares are undefined. Drop the ${term.name} term, merge levels, or check the rows dropped for missing values.`,
            { term: term.name },
          );
        }
        let k = 0;
        while (k < idx.length && ++idx[k]! === sizes[k]!) idx[k++] = 0;
        if (k === idx.length) break;
      }
    }
  }

  /** Refuses a design too wide to fit in reasonable time, naming the factor with the most levels when it is the cause. */
  private tooManyColumns(p: number): never {
    const widest = [...this.factorVars].sort((a, b) => b.levels.length - a.levels.length)[0];
    // A factor with hundreds of levels is the usual cause (an identifier read as a factor); otherwise it is the interactions.
    const identifierLike = widest !== undefined && widest.levels.length > 100;
    const cause = identifierLike
      ? ` Factor '${widest.name}' has ${widest.levels.length} levels: a factor with that many is usually an identifier or a numeric measure read as a factor. Check the column (--covariate ${widest.name} if it is a measure), or`
      : ' The interactions of the factors make the design this wide: drop some interaction terms, or';
    // Raising the limit is advice only where a fit of that width can be done at all.
    const way =
      p <= MAX_COLUMNS_CEILING
        ? ` raise the limit with --max-columns ${p} (the time to fit grows with the cube of the number of columns).`
        : ` fit a smaller model: refit fits at most ${MAX_COLUMNS_CEILING.toLocaleString('en-US')} columns (${MAX_COLUMNS_CEILING_REASON}).`;
    throw new RefitError(
      'TOO_MANY_COLUMNS',
      `The model has ${p} design columns, more than maxColumns = ${this.spec.maxColumns}.${cause}${way}`,
      { field: 'maxColumns', ...(identifierLike ? { column: widest.name } : {}) },
    );
  }

  private buildColumns(): void {
    const coding = this.spec.coding;
    this.columns.push({ name: '(Intercept)', term: -1, factorCodes: [], numeric: { kind: 'none' } });
    const numericIndex = (name: string) => this.numericVars.findIndex((v) => v.name === name);
    const factorIndex = (name: string) => this.factorVars.findIndex((v) => v.name === name);
    this.spec.formula.terms.forEach((t, ti) => {
      const factors = t.variables.map(factorIndex).filter((s) => s >= 0);
      const numerics = t.variables.map(numericIndex).filter((s) => s >= 0);
      let numeric: NumericPart = { kind: 'none' };
      if (numerics.length === 1) numeric = factors.length === 0 ? { kind: 'delta', slot: numerics[0]! } : { kind: 'raw', slot: numerics[0]! };
      if (numerics.length > 1) {
        if (this.spec.center) {
          throw new RefitError(
            'INVALID_SPEC',
            `The term ${t.name} multiplies covariates, which centring (${this.spec.advice === 'command-line' ? '--center' : '"center": true'}) does not handle; leave centring out, or centre the columns in the data file.`,
            { term: t.name, field: 'center' },
          );
        }
        const key = numerics.slice().sort((x, y) => x - y).join(',');
        const index = this.acc.products.findIndex((p) => p.slots.slice().sort((x, y) => x - y).join(',') === key);
        numeric = { kind: 'product', index };
      }
      const term: ModelTerm = { name: t.name, variables: t.variables, factors, numerics, columns: [] };
      // Kronecker product of the factors' coding columns, first factor fastest.
      const sizes = factors.map((f) => this.factorVars[f]!.levels.length - 1);
      const idx = new Array<number>(factors.length).fill(0);
      for (;;) {
        const factorCodes = factors.map((f, i) => ({ factor: f, column: idx[i]! }));
        const label = t.variables
          .map((name) => {
            const f = factorIndex(name);
            if (f < 0) return name;
            const v = this.factorVars[f]!;
            const col = idx[factors.indexOf(f)]!;
            return `${name}[${coding === 'sum' ? 'S' : 'T'}.${v.levels[coding === 'sum' ? col : col + 1]}]`;
          })
          .join(':');
        term.columns.push(this.columns.length);
        this.columns.push({ name: label, term: ti, factorCodes, numeric });
        let k = 0;
        while (k < idx.length && ++idx[k]! === sizes[k]!) idx[k++] = 0;
        if (k === idx.length) break;
      }
      this.terms.push(term);
    });
  }

  /** Fills a (q x (p+1), row-major) with the map from a cell's basis [1, numerics, products, y] to [X y]. */
  private cellMap(levels: Int32Array, a: Float64Array): void {
    const p = this.columns.length;
    const q = this.acc.q;
    a.fill(0);
    this.columns.forEach((col, j) => {
      let f = 1;
      for (const { factor, column } of col.factorCodes) {
        f *= codingValue(this.spec.coding, this.factorVars[factor]!.levels.length, levels[factor]!, column);
      }
      if (f === 0) return;
      const num = col.numeric;
      if (num.kind === 'none') a[j] = f;
      else if (num.kind === 'delta') a[this.acc.basisOfNumeric(num.slot) * (p + 1) + j] = f;
      else if (num.kind === 'raw') {
        a[j] = f * (this.numericVars[num.slot]!.origin - this.centers[num.slot]!);
        a[this.acc.basisOfNumeric(num.slot) * (p + 1) + j] = f;
      } else a[this.acc.basisOfProduct(num.index) * (p + 1) + j] = f;
    });
    a[(q - 1) * (p + 1) + p] = 1;
  }

  /**
   * The design row at a point: factor levels by factor slot (final level
   * indices) and raw values of the numeric predictors by numeric slot.
   */
  designRow(levels: readonly number[], numericValues: readonly number[]): Float64Array {
    const x = new Float64Array(this.columns.length);
    this.columns.forEach((col, j) => {
      let f = 1;
      for (const { factor, column } of col.factorCodes) {
        f *= codingValue(this.spec.coding, this.factorVars[factor]!.levels.length, levels[factor]!, column);
      }
      const num = col.numeric;
      if (num.kind === 'delta') f *= numericValues[num.slot]! - this.numericVars[num.slot]!.origin;
      else if (num.kind === 'raw') f *= numericValues[num.slot]! - this.centers[num.slot]!;
      else if (num.kind === 'product') for (const s of this.acc.products[num.index]!.slots) f *= numericValues[s]!;
      x[j] = f;
    });
    return x;
  }

  private aliased(j: number, norm: number): never {
    const col = this.columns[j]!;
    const term = this.terms[col.term];
    const name = term?.name ?? '(Intercept)';
    const isCovariate = term !== undefined && term.factors.length === 0;
    const reason =
      norm === 0 || (isCovariate && term.variables.length === 1)
        ? `covariate '${name}' is constant or a linear combination of earlier terms`
        : `column ${col.name} of term '${name}' is a linear combination of the columns before it (the design is rank-deficient)`;
    throw new RefitError(
      'ALIASED_TERM',
      `The model cannot be fitted: ${reason}. Remove '${name}' or the term it duplicates, or check that two columns do not carry the same information.`,
      { term: name },
    );
  }

  /** Regression coefficients in design-column order (covariate main effects per unit, outcome measured from its origin). */
  coefficients(): Float64Array {
    const p = this.columns.length;
    const c = new Float64Array(p);
    for (let i = 0; i < p; i++) c[i] = this.rAug.data[i * (p + 1) + p]!;
    return solveUpper(this.rAug.data, p + 1, p, c);
  }

  /** Quadratic form x'(X'X)^{-1}x, via R'z = x. */
  unscaledVariance(x: Float64Array): number {
    const p = this.columns.length;
    const z = solveUpperTransposed(this.rAug.data, p + 1, p, x);
    let s = 0;
    for (const v of z) s += v * v;
    return s;
  }

  /** The outcome's origin (predictions from coefficients are relative to it). */
  get outcomeOrigin(): number {
    return this.numericVars[this.numericVars.length - 1]!.origin;
  }

  /** Sums of squares of each term for the given type. */
  sumsOfSquares(type: SsType): number[] {
    const p = this.columns.length;
    return this.terms.map((term) => {
      if (type === 1) {
        let ss = 0;
        for (const j of term.columns) {
          const t = this.rAug.data[j * (p + 1) + p]!;
          ss += t * t;
        }
        return ss;
      }
      const target = new Set(term.columns);
      const keep: number[] = [0];
      this.terms.forEach((other) => {
        if (other === term) return;
        if (type === 2 && term.variables.every((v) => other.variables.includes(v))) return;
        for (const j of other.columns) if (!target.has(j)) keep.push(j);
      });
      keep.sort((x, y) => x - y);
      return sequentialSS(this.rAug, keep, term.columns).ss;
    });
  }

  anova(type: SsType = this.spec.type): AnovaTable {
    const ssList = this.sumsOfSquares(type);
    const msRes = this.residualSS / this.residualDf;
    return {
      n: this.n,
      droppedRows: this.droppedRows,
      type,
      coding: this.spec.coding,
      terms: this.terms.map((term, i) => {
        const ss = ssList[i]!;
        const df = term.columns.length;
        const ms = ss / df;
        const F = ms / msRes;
        return { term: term.name, ss, df, ms, F, p: fUpperTail(F, df, this.residualDf), partialEtaSquared: ss / (ss + this.residualSS) };
      }),
      residual: { ss: this.residualSS, df: this.residualDf, ms: msRes },
    };
  }
}

/** Raw products of two or more numeric predictors that the formula's terms need. */
function productSets(spec: ResolvedSpec): (variables: readonly VariableReader[]) => NumericProduct[] {
  return (variables) => {
    const numericSlot = new Map(variables.filter((v) => v.kind === 'numeric').map((v) => [v.name, v.slot]));
    const out: NumericProduct[] = [];
    for (const t of spec.formula.terms) {
      const slots = t.variables.filter((v) => numericSlot.has(v)).map((v) => numericSlot.get(v)!);
      if (slots.length < 2) continue;
      const key = slots.slice().sort((x, y) => x - y).join(',');
      if (!out.some((p) => p.slots.slice().sort((x, y) => x - y).join(',') === key)) out.push({ slots });
    }
    return out;
  };
}

/** Passes rows on to the accumulator and keeps each row's outcome by cell (for Levene's test, which needs the values). */
class OutcomeKeeper implements CompleteRowSink {
  readonly values = new Map<string, number[]>();
  private outcome = 0;
  constructor(private readonly inner: CellAccumulator) {}
  start(variables: readonly VariableReader[]): void {
    this.inner.start(variables);
    this.outcome = variables.filter((v) => v.kind === 'numeric').length - 1;
  }
  add(levelIndex: Int32Array, deltas: Float64Array): void {
    this.inner.add(levelIndex, deltas);
    const key = Array.prototype.join.call(levelIndex, ',');
    let list = this.values.get(key);
    if (list === undefined) this.values.set(key, (list = []));
    list.push(deltas[this.outcome]!);
  }
}

/**
 * Reads the data (streaming) and fits the model described by `specInput`
 * (validated here). `keepOutcome` also keeps every analysed outcome value
 * (memory grows with the rows), as Levene's test needs.
 */
export async function fitModel(source: DataSource, specInput: unknown, options: { keepOutcome?: boolean } = {}): Promise<FittedModel> {
  const spec = parseAnalysisSpec(specInput);
  const acc = new CellAccumulator(productSets(spec));
  const keeper = options.keepOutcome ? new OutcomeKeeper(acc) : undefined;
  const frame = new ModelFrameReader({ spec, sink: keeper ?? acc });
  await streamRows(source, frame);
  try {
    const model = new FittedModel(spec, frame.describe(), frame.droppedRows, acc, frame.variables, keeper?.values);
    model.outOfRange = frame.outOfRange();
    return model;
  } catch (error) {
    // Errors found in the fitted data name the file they came from.
    if (error instanceof RefitError && error.details.file === undefined && frame.file !== '') {
      throw new RefitError(error.code, `${frame.file}: ${error.message}`, { ...error.details, file: frame.file });
    }
    throw error;
  }
}

/** Reads the data and returns the ANOVA/ANCOVA table of the type in the description (default 3). */
export async function fitAnova(source: DataSource, specInput: unknown): Promise<AnovaTable> {
  const model = await fitModel(source, specInput);
  return model.anova();
}
