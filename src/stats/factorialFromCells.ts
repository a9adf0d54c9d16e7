import { fUpperTail } from './fDistribution.js';
import type { NumberInterval } from './monotoneImage.js';

/**
 * Factorial between-subjects ANOVA (two or three factors, every cell
 * observed) recomputed from the cells' means, SDs and sizes, under sums of
 * squares of types I, II and III, at the printed numbers and over every
 * combination of means and SDs that round to them.
 *
 * ## Method
 * The cell means, SDs and sizes are sufficient statistics for a model whose
 * terms are all factors: its predictions are constant within a cell, so
 * the residual sum of squares of any such model M on the raw data is
 *   RSS(M) = SS_within + sum_c n_c (m_c - fitted_M,c)^2,
 * with SS_within = sum_c (n_c - 1) s_c^2 and fitted_M the weighted least
 * squares fit of the cell means m_c with weights n_c. The sum of squares of
 * a term T given the terms S fitted before it is RSS(S) - RSS(S + T); it is
 * computed without that subtraction, as the squared length of the part of
 * the weighted means sqrt(n) * m that lies in the span of T's columns after
 * S's columns are projected out (Gram-Schmidt with reorthogonalisation):
 *   SS_T(m) = sum_j (v_j . m)^2,  v_j = sqrt(n) * q_j,
 * q_j an orthonormal basis of the new directions T adds. Columns use
 * sum-to-zero coding (level i of a factor with L levels: +1 in column i,
 * -1 in every column for level L, products of these for interactions).
 * The types differ only in S:
 * - type I (sequential): the intercept and the terms before T, with terms
 *   ordered by degree (A, B, C, A x B, A x C, B x C, A x B x C), as
 *   R's aov and statsmodels' anova_lm order a formula A * B * C;
 * - type II: the intercept and every term that does not contain T;
 * - type III: the intercept and every other term (with sum-to-zero coding
 *   this tests the unweighted-means hypotheses).
 * Error: SS_within on N - (number of cells) df, the error of the full
 * factorial model. F = (SS_T / df_T) / (SS_within / df_within), partial eta
 * squared = SS_T / (SS_T + SS_within).
 *
 * Rounding: each mean and SD stands for an interval (the sizes are exact).
 * SS_within depends only on the SDs and increases in each, so its range is
 * exact. SS_T depends only on the means and is a convex quadratic in them
 * (a squared length of a linear image), so:
 * - its maximum over the box of means lies at a vertex. With at most
 *   MAX_VERTEX_CELLS cells every vertex is visited (in Gray-code order, one
 *   coordinate changed per step, so each step costs df_T operations): the
 *   maximum is exact. With more cells it is bounded above by
 *   (sqrt(SS_T(centre)) + sqrt(sum_ik |A_ik| h_i h_k))^2, A the matrix of
 *   the quadratic form and h the half-widths (triangle inequality): an
 *   outer bound, not the maximum;
 * - its minimum is found by cyclic coordinate descent with each coordinate
 *   minimised exactly within its interval, which converges for a convex
 *   quadratic over a box (Luo & Tseng 1992); the value used is the
 *   certified lower bound f(y) + min over the box of grad f(y) . (z - y),
 *   which no point of the box goes below (convexity), so the range is an
 *   outer bound that is tight when the descent has converged.
 * Because SS_T and SS_within depend on disjoint inputs, the range of F is
 * [SS_T,min / SS_within,max, SS_T,max / SS_within,min] times df_within/df_T
 * (exact up to the two bounds above), p is the image under the decreasing
 * F tail, and partial eta squared the image of the pair.
 *
 * ## References
 * - Searle, S. R. (1987). Linear Models for Unbalanced Data. Wiley,
 *   chapters 4 and 9 (cell-means model, sums of squares from cell means
 *   and sizes; the hypotheses of each type). From memory.
 * - Langsrud, O. (2003). ANOVA for unbalanced data: use type II instead of
 *   type III sums of squares. Statistics and Computing 13, 163-167
 *   (definitions of types I-III as model comparisons).
 * - Golub, G. H. & Van Loan, C. F. (2013). Matrix Computations, 4th ed.
 *   Johns Hopkins, section 5.2.8 (Gram-Schmidt with reorthogonalisation).
 * - Luo, Z.-Q. & Tseng, P. (1992). On the convergence of the coordinate
 *   descent method for convex differentiable minimization. Journal of
 *   Optimization Theory and Applications 72(1), 7-35.
 * - Boyd, S. & Vandenberghe, L. (2004). Convex Optimization. Cambridge
 *   University Press, section 3.1.3 (first-order condition: a convex
 *   function lies above its tangent plane) and 3.1.4 (maxima at vertices).
 */

export type SumOfSquaresType = 1 | 2 | 3;

/** One cell of the design: its level of each factor (in factor order) and its statistics. */
export interface FactorialCell {
  levels: readonly string[];
  mean: number;
  sd: number;
  n: number;
}

/** A cell whose mean and SD are known only to an interval (rounding); n is exact. */
export interface FactorialCellBox {
  levels: readonly string[];
  mean: NumberInterval;
  sd: NumberInterval;
  n: number;
}

/** The factors' levels (in order of first appearance) and the cells in the order of their level indices. */
export interface FactorialLayout {
  factorLevels: string[][];
  /** Index into the caller's cell array for each combination, the last factor varying fastest. */
  cellOrder: number[];
  /** The level index of each factor for each combination, in the same order. */
  combinations: number[][];
}

export type LayoutResult = { ok: true; layout: FactorialLayout } | { ok: false; reason: string };

/** A model term: the indices of its factors, ascending. */
export type Term = readonly number[];

export interface FactorialEffect {
  term: Term;
  ss: number;
  df1: number;
  df2: number;
  f: number;
  p: number;
  partialEtaSquared: number;
}

export interface FactorialTable {
  type: SumOfSquaresType;
  effects: FactorialEffect[];
  ssWithin: number;
  dfWithin: number;
}

export interface FactorialEffectRange {
  term: Term;
  df1: number;
  df2: number;
  ss: NumberInterval;
  f: NumberInterval;
  p: NumberInterval;
  partialEtaSquared: NumberInterval;
  /** True when the upper end of SS (and so of F) is the maximum over the box; false when it is an outer bound. */
  highIsExact: boolean;
}

export interface FactorialRange {
  type: SumOfSquaresType;
  effects: FactorialEffectRange[];
  ssWithin: NumberInterval;
  dfWithin: number;
}

/** Most factors handled (the issue asks for two and three). */
export const MAX_FACTORS = 3;
/** Largest number of cells whose 2^cells vertices are all visited for the exact maximum of SS. */
export const MAX_VERTEX_CELLS = 20;
/** Largest number of cells accepted at all (the Gram-Schmidt basis is cells x cells). */
export const MAX_CELLS = 400;

/**
 * Checks that the cells form a full factorial (every combination of levels
 * present exactly once, each n a whole number >= 1, N above the number of
 * cells) and orders them.
 */
export function arrangeCells(factorCount: number, cells: readonly { levels: readonly string[]; n: number }[]): LayoutResult {
  if (!Number.isInteger(factorCount) || factorCount < 1 || factorCount > MAX_FACTORS) {
    return { ok: false, reason: `a design of 1 to ${MAX_FACTORS} factors is needed, not ${factorCount}` };
  }
  const factorLevels: string[][] = Array.from({ length: factorCount }, () => []);
  for (const cell of cells) {
    if (cell.levels.length !== factorCount) return { ok: false, reason: `a cell has ${cell.levels.length} levels for ${factorCount} factors` };
    cell.levels.forEach((level, f) => {
      if (!factorLevels[f]!.includes(level)) factorLevels[f]!.push(level);
    });
  }
  for (let f = 0; f < factorCount; f++) {
    if (factorLevels[f]!.length < 2) return { ok: false, reason: `factor ${f + 1} has ${factorLevels[f]!.length} level; at least 2 are needed` };
  }
  const expected = factorLevels.reduce((product, levels) => product * levels.length, 1);
  if (expected > MAX_CELLS) return { ok: false, reason: `the design has ${expected} cells; at most ${MAX_CELLS} are handled` };
  const combinations = allCombinations(factorLevels.map((levels) => levels.length));
  const position = new Map<string, number>();
  cells.forEach((cell, index) => {
    const key = JSON.stringify(cell.levels);
    if (!position.has(key)) position.set(key, index);
  });
  if (position.size !== cells.length) {
    const seen = new Set<string>();
    const twice = cells.find((cell) => (seen.has(JSON.stringify(cell.levels)) ? true : (seen.add(JSON.stringify(cell.levels)), false)))!;
    return { ok: false, reason: `the cell ${twice.levels.join(' / ')} is given twice` };
  }
  const cellOrder: number[] = [];
  for (const combination of combinations) {
    const levels = combination.map((level, f) => factorLevels[f]![level]!);
    const index = position.get(JSON.stringify(levels));
    if (index === undefined) return { ok: false, reason: `the cell ${levels.join(' / ')} is missing (every combination of levels is needed)` };
    cellOrder.push(index);
  }
  for (const cell of cells) {
    if (!Number.isInteger(cell.n) || cell.n < 1) return { ok: false, reason: `the cell ${cell.levels.join(' / ')} has n = ${cell.n}; a whole number of at least 1 is needed` };
  }
  const total = cells.reduce((sum, cell) => sum + cell.n, 0);
  if (total <= cells.length) return { ok: false, reason: `N = ${total} leaves no error df with ${cells.length} cells` };
  return { ok: true, layout: { factorLevels, cellOrder, combinations } };
}

/** Every combination of level indices, the last factor varying fastest. */
function allCombinations(levelCounts: readonly number[]): number[][] {
  let result: number[][] = [[]];
  for (const count of levelCounts) {
    const next: number[][] = [];
    for (const prefix of result) for (let level = 0; level < count; level++) next.push([...prefix, level]);
    result = next;
  }
  return result;
}

/** Main effects and interactions of a full factorial, ordered by degree, then by factor order. */
export function factorialTerms(factorCount: number): Term[] {
  const terms: number[][] = [];
  for (let mask = 1; mask < 1 << factorCount; mask++) {
    const term: number[] = [];
    for (let f = 0; f < factorCount; f++) if ((mask >> f) & 1) term.push(f);
    terms.push(term);
  }
  return terms.sort((a, b) => a.length - b.length || compareTerms(a, b));
}

function compareTerms(a: Term, b: Term): number {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return a[i]! - b[i]!;
  return 0;
}

/** A term's name from the factor names: "Dose x Time". */
export function termName(term: Term, factorNames: readonly string[]): string {
  return term.map((f) => factorNames[f]!).join(' × ');
}

/** Value of sum-to-zero column `column` (0 .. levels - 2) at level `level` (0 .. levels - 1). */
function sumCode(levels: number, level: number, column: number): number {
  if (level === levels - 1) return -1;
  return level === column ? 1 : 0;
}

/** The design columns of a term (one value per cell, cells in layout order): products of sum-to-zero codes. */
function termColumns(term: Term, layout: FactorialLayout): number[][] {
  const levelCounts = term.map((f) => layout.factorLevels[f]!.length);
  return allCombinations(levelCounts.map((count) => count - 1)).map((columnPerFactor) =>
    layout.combinations.map((combination) =>
      term.reduce((product, f, i) => product * sumCode(levelCounts[i]!, combination[f]!, columnPerFactor[i]!), 1),
    ),
  );
}

function dot(a: readonly number[], b: readonly number[]): number {
  let sum = 0;
  for (let i = 0; i < a.length; i++) sum += a[i]! * b[i]!;
  return sum;
}

/** Removes from `vector` its components along the orthonormal `basis`, twice (one pass loses orthogonality on near-dependent columns). */
function orthogonalise(vector: number[], basis: readonly number[][]): void {
  for (let pass = 0; pass < 2; pass++) {
    for (const q of basis) {
      const along = dot(vector, q);
      for (let i = 0; i < vector.length; i++) vector[i]! -= along * q[i]!;
    }
  }
}

/**
 * The vectors v_j with SS_T(means) = sum_j (v_j . means)^2, for term `tested`
 * fitted after the intercept and `before`; null when a column of the term is
 * (numerically) a combination of earlier ones, which a full factorial with
 * every n >= 1 cannot give.
 */
function termProjection(tested: Term, before: readonly Term[], layout: FactorialLayout, weights: readonly number[]): number[][] | null {
  const root = weights.map(Math.sqrt);
  const scaled = (column: readonly number[]): number[] => column.map((value, c) => value * root[c]!);
  const basis: number[][] = [];
  const addToBasis = (column: number[]): boolean => {
    const original = Math.sqrt(dot(column, column));
    orthogonalise(column, basis);
    const length = Math.sqrt(dot(column, column));
    if (!(length > 1e-10 * original)) return false;
    basis.push(column.map((value) => value / length));
    return true;
  };
  addToBasis(scaled(layout.combinations.map(() => 1)));
  for (const term of before) for (const column of termColumns(term, layout)) if (!addToBasis(scaled(column))) return null;
  const fittedBefore = basis.length;
  for (const column of termColumns(tested, layout)) if (!addToBasis(scaled(column))) return null;
  return basis.slice(fittedBefore).map((q) => q.map((value, c) => value * root[c]!));
}

/** The terms fitted before `term` under each type. */
function termsBefore(type: SumOfSquaresType, term: Term, terms: readonly Term[]): Term[] {
  const index = terms.indexOf(term);
  if (type === 1) return terms.slice(0, index);
  if (type === 2) return terms.filter((other) => other !== term && !term.every((f) => other.includes(f)));
  return terms.filter((other) => other !== term);
}

/** SS of a term at the given means (layout order): sum_j (v_j . means)^2. */
function quadraticSS(projection: readonly number[][], means: readonly number[]): number {
  let ss = 0;
  for (const v of projection) ss += dot(v, means) ** 2;
  return ss;
}

interface PreparedDesign {
  layout: FactorialLayout;
  terms: Term[];
  projections: number[][][];
  weights: number[];
  dfWithin: number;
}

function prepare(factorCount: number, cells: readonly { levels: readonly string[]; n: number }[], type: SumOfSquaresType): PreparedDesign | null {
  const arranged = arrangeCells(factorCount, cells);
  if (!arranged.ok) return null;
  const layout = arranged.layout;
  const weights = layout.cellOrder.map((index) => cells[index]!.n);
  const terms = factorialTerms(factorCount);
  const projections: number[][][] = [];
  for (const term of terms) {
    const projection = termProjection(term, termsBefore(type, term, terms), layout, weights);
    if (projection === null) return null;
    projections.push(projection);
  }
  const total = weights.reduce((a, b) => a + b, 0);
  return { layout, terms, projections, weights, dfWithin: total - weights.length };
}

/**
 * Every main effect and interaction of a full-factorial between-subjects
 * design from its cells (any order; `levels` gives each cell's level of
 * each factor), under SS type 1, 2 or 3. Null for a design that is not a
 * full factorial of 1 to 3 factors, or a negative or missing SD.
 */
export function factorialAnovaFromCells(factorCount: number, cells: readonly FactorialCell[], type: SumOfSquaresType): FactorialTable | null {
  if (cells.some((cell) => !(cell.sd >= 0) || !Number.isFinite(cell.mean))) return null;
  const design = prepare(factorCount, cells, type);
  if (design === null) return null;
  const means = design.layout.cellOrder.map((index) => cells[index]!.mean);
  const ssWithin = cells.reduce((sum, cell) => sum + (cell.n - 1) * cell.sd ** 2, 0);
  const effects = design.terms.map((term, t) => {
    const ss = quadraticSS(design.projections[t]!, means);
    const df1 = design.projections[t]!.length;
    const f = ssWithin === 0 ? (ss === 0 ? NaN : Infinity) : ss / df1 / (ssWithin / design.dfWithin);
    return { term, ss, df1, df2: design.dfWithin, f, p: fUpperTail(f, df1, design.dfWithin), partialEtaSquared: ss + ssWithin === 0 ? NaN : ss / (ss + ssWithin) };
  });
  return { type, effects, ssWithin, dfWithin: design.dfWithin };
}

/** Largest SS over the vertices of the box, one coordinate flipped per step (Gray code). */
function largestAtVertices(projection: readonly number[][], low: readonly number[], high: readonly number[]): number {
  const along = projection.map((v) => dot(v, low));
  const atHigh = low.map(() => false);
  let best = along.reduce((sum, s) => sum + s * s, 0);
  const vertices = 2 ** low.length;
  for (let step = 1; step < vertices; step++) {
    const coordinate = Math.log2(step & -step);
    const change = (atHigh[coordinate] ? -1 : 1) * (high[coordinate]! - low[coordinate]!);
    atHigh[coordinate] = !atHigh[coordinate];
    let ss = 0;
    for (let j = 0; j < projection.length; j++) {
      along[j]! += projection[j]![coordinate]! * change;
      ss += along[j]! ** 2;
    }
    if (ss > best) best = ss;
  }
  return best;
}

/** Outer bound of the largest SS: (sqrt(SS(centre)) + sqrt(sum |A_ik| h_i h_k))^2. */
function largestBound(projection: readonly number[][], low: readonly number[], high: readonly number[]): number {
  const centre = low.map((value, i) => (value + high[i]!) / 2);
  const half = low.map((value, i) => (high[i]! - value) / 2);
  let spread = 0;
  for (let i = 0; i < low.length; i++) {
    for (let k = 0; k < low.length; k++) {
      let entry = 0;
      for (const v of projection) entry += v[i]! * v[k]!;
      spread += Math.abs(entry) * half[i]! * half[k]!;
    }
  }
  // A little slack for the rounding of the sums above keeps this an outer bound.
  return (Math.sqrt(quadraticSS(projection, centre)) + Math.sqrt(spread)) ** 2 * (1 + 1e-12);
}

/** Certified lower bound of the smallest SS over the box: coordinate descent, then the tangent-plane bound. */
function smallestLowerBound(projection: readonly number[][], low: readonly number[], high: readonly number[]): number {
  const cells = low.length;
  const point = low.map((value, i) => (value + high[i]!) / 2);
  const along = projection.map((v) => dot(v, point));
  const curvature = low.map((_, i) => projection.reduce((sum, v) => sum + v[i]! ** 2, 0));
  const gradientAt = (i: number): number => 2 * projection.reduce((sum, v, j) => sum + along[j]! * v[i]!, 0);
  for (let sweep = 0; sweep < 5000; sweep++) {
    let largestMove = 0;
    for (let i = 0; i < cells; i++) {
      if (curvature[i]! === 0) continue;
      const target = Math.min(high[i]!, Math.max(low[i]!, point[i]! - gradientAt(i) / (2 * curvature[i]!)));
      const move = target - point[i]!;
      if (move === 0) continue;
      for (let j = 0; j < projection.length; j++) along[j]! += projection[j]![i]! * move;
      point[i] = target;
      largestMove = Math.max(largestMove, Math.abs(move) / Math.max(1e-300, high[i]! - low[i]!));
    }
    if (largestMove < 1e-13) break;
  }
  // Recompute the projections afresh so the accumulated updates carry no drift into the bound.
  projection.forEach((v, j) => (along[j] = dot(v, point)));
  let bound = along.reduce((sum, s) => sum + s * s, 0);
  for (let i = 0; i < cells; i++) {
    const gradient = gradientAt(i);
    bound += Math.min(gradient * (low[i]! - point[i]!), gradient * (high[i]! - point[i]!));
  }
  return Math.max(0, bound * (1 - 1e-12) - 1e-300);
}

/**
 * Range of every effect's SS, F, p and partial eta squared over the
 * rounding box of the cells' means and SDs (see the Method above for what
 * is exact and what is an outer bound). Null as for factorialAnovaFromCells,
 * or when an SD interval is not within [0, infinity).
 */
export function factorialAnovaRange(factorCount: number, cells: readonly FactorialCellBox[], type: SumOfSquaresType): FactorialRange | null {
  if (cells.some((cell) => !(cell.sd.high >= 0) || !(cell.mean.low <= cell.mean.high) || !(cell.sd.low <= cell.sd.high))) return null;
  const design = prepare(factorCount, cells, type);
  if (design === null) return null;
  const ordered = design.layout.cellOrder.map((index) => cells[index]!);
  const low = ordered.map((cell) => cell.mean.low);
  const high = ordered.map((cell) => cell.mean.high);
  const ssWithin = {
    low: cells.reduce((sum, cell) => sum + (cell.n - 1) * Math.max(0, cell.sd.low) ** 2, 0),
    high: cells.reduce((sum, cell) => sum + (cell.n - 1) * cell.sd.high ** 2, 0),
  };
  const dfWithin = design.dfWithin;
  const highIsExact = ordered.length <= MAX_VERTEX_CELLS;
  const effects = design.terms.map((term, t) => {
    const projection = design.projections[t]!;
    const df1 = projection.length;
    const ss = {
      low: smallestLowerBound(projection, low, high),
      high: highIsExact ? largestAtVertices(projection, low, high) : largestBound(projection, low, high),
    };
    const ratio = (effect: number, error: number): number => (error === 0 ? (effect === 0 ? 0 : Infinity) : effect / df1 / (error / dfWithin));
    const eta = (effect: number, error: number): number => (effect + error === 0 ? 0 : effect / (effect + error));
    const f = { low: ratio(ss.low, ssWithin.high), high: ratio(ss.high, ssWithin.low) };
    return {
      term,
      df1,
      df2: dfWithin,
      ss,
      f,
      p: { low: fUpperTail(f.high, df1, dfWithin), high: fUpperTail(f.low, df1, dfWithin) },
      partialEtaSquared: { low: eta(ss.low, ssWithin.high), high: eta(ss.high, ssWithin.low) },
      highIsExact,
    };
  });
  return { type, effects, ssWithin, dfWithin };
}
