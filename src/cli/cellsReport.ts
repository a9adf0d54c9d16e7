import {
  arrangeCells,
  factorialAnovaFromCells,
  factorialAnovaRange,
  termName,
  type FactorialCell,
  type FactorialCellBox,
  type SumOfSquaresType,
  type Term,
} from '../stats/factorialFromCells.js';
import type { NumberInterval } from '../stats/monotoneImage.js';
import { compareWithTypes, overlapsWithSlack } from '../checks/factorialCells.js';
import { CellsInputError, type CellsInput, type PrintedValue, type ReportedEffect } from './cellsInput.js';

/**
 * What `plumbline cells` finds: the table of every SS type recomputed from
 * the printed cell statistics, with intervals over their rounding, and for
 * each reported F which types reproduce it (F, p and partial eta squared
 * all within rounding, df equal to the design's).
 */

const TYPES: SumOfSquaresType[] = [1, 2, 3];

export interface CellsEffectRow {
  effect: string;
  df1: number;
  df2: number;
  f: number;
  p: number;
  partialEtaSquared: number;
  range: { f: NumberInterval; p: NumberInterval; partialEtaSquared: NumberInterval };
  /** False when the upper end is an outer bound rather than the maximum (more cells than are enumerated). */
  upperEndExact: boolean;
}

export interface CellsTypeCheck {
  type: SumOfSquaresType;
  df: boolean;
  f: boolean;
  /** null when no p was reported. */
  p: boolean | null;
  /** null when no partial eta squared was reported. */
  partialEtaSquared: boolean | null;
}

export interface CellsReportedCheck {
  text: string;
  effect: string;
  byType: CellsTypeCheck[];
  reproducedBy: SumOfSquaresType[];
  verdict: 'reproduced' | 'not reproduced';
  /** What no type reproduces, when the verdict is "not reproduced". */
  unmatched: Array<'df' | 'F' | 'p' | 'partial eta squared'>;
  /** fail, or warn when the ns were assumed; null when reproduced. */
  severity: 'fail' | 'warn' | null;
}

export interface CellsOutput {
  file: string;
  factors: Array<{ name: string; levels: string[] }>;
  cells: number;
  totalN: number;
  errorDf: number;
  equalNAssumed: { n: number; from: 'option' | 'reported error df' } | null;
  tables: Array<{ type: SumOfSquaresType; effects: CellsEffectRow[] }>;
  reported: CellsReportedCheck[];
}

/** The n of every cell, given, or assumed equal (from --cell-n or a reported error df). */
function cellSizes(input: CellsInput, file: string, cellN: number | undefined): { ns: number[]; assumed: CellsOutput['equalNAssumed'] } {
  const given = input.cells.filter((cell) => cell.n !== null);
  if (given.length === input.cells.length) return { ns: input.cells.map((cell) => cell.n!), assumed: null };
  if (given.length > 0) {
    const without = input.cells.find((cell) => cell.n === null)!;
    throw new CellsInputError(`${file}, ${without.where}: no n, where other cells give theirs; give every cell's n or none`);
  }
  if (cellN !== undefined) return { ns: input.cells.map(() => cellN), assumed: { n: cellN, from: 'option' } };
  const k = input.cells.length;
  for (const reported of input.reported) {
    if ((reported.df2 + k) % k === 0 && reported.df2 > 0) {
      const n = (reported.df2 + k) / k;
      return { ns: input.cells.map(() => n), assumed: { n, from: 'reported error df' } };
    }
  }
  throw new CellsInputError(
    `${file}: the cells give no n; add an n column, or give --cell-n <n> for equal ns, or a reported F with its error df (equal ns are then worked out from N - ${k})`,
  );
}

function sameFactors(written: readonly string[], term: Term, factorNames: readonly string[]): boolean {
  const wanted = term.map((f) => factorNames[f]!.toLowerCase()).sort();
  const given = written.map((name) => name.toLowerCase()).sort();
  return wanted.length === given.length && wanted.every((name, i) => name === given[i]);
}

function pAgrees(range: NumberInterval, reported: NonNullable<ReportedEffect['p']>): boolean {
  if (reported.relation === '<') return range.low < reported.value.value;
  if (reported.relation === '>') return range.high > reported.value.value;
  return overlapsWithSlack(range, reported.value.interval);
}

function box(value: PrintedValue): NumberInterval {
  return value.interval;
}

export function analyseCells(input: CellsInput, file: string, options: { cellN?: number } = {}): CellsOutput {
  const { ns, assumed } = cellSizes(input, file, options.cellN);
  const factorCount = input.factors.length;
  const layout = arrangeCells(
    factorCount,
    input.cells.map((cell, i) => ({ levels: cell.levels, n: ns[i]! })),
  );
  if (!layout.ok) throw new CellsInputError(`${file}: ${layout.reason}`);
  const points: FactorialCell[] = input.cells.map((cell, i) => ({ levels: cell.levels, mean: cell.mean.value, sd: cell.sd.value, n: ns[i]! }));
  const boxes: FactorialCellBox[] = input.cells.map((cell, i) => ({ levels: cell.levels, mean: box(cell.mean), sd: box(cell.sd), n: ns[i]! }));
  const tables = TYPES.map((type) => {
    const table = factorialAnovaFromCells(factorCount, points, type);
    const range = factorialAnovaRange(factorCount, boxes, type);
    if (table === null || range === null) throw new CellsInputError(`${file}: the cells cannot be analysed (an SD's rounding interval reaches below zero?)`);
    return {
      type,
      terms: table.effects.map((effect) => effect.term),
      effects: table.effects.map((effect, t) => ({
        effect: termName(effect.term, input.factors),
        df1: effect.df1,
        df2: effect.df2,
        f: effect.f,
        p: effect.p,
        partialEtaSquared: effect.partialEtaSquared,
        range: { f: range.effects[t]!.f, p: range.effects[t]!.p, partialEtaSquared: range.effects[t]!.partialEtaSquared },
        upperEndExact: range.effects[t]!.highIsExact,
      })),
    };
  });
  const terms = tables[0]!.terms;
  const reported = input.reported.map((effect, index): CellsReportedCheck => {
    const t = terms.findIndex((term) => sameFactors(effect.factors, term, input.factors));
    if (t < 0) {
      throw new CellsInputError(`${file}, reported effect ${index + 1} ("${effect.text}"): "${effect.factors.join(' x ')}" is not an effect of the design (factors: ${input.factors.join(', ')})`);
    }
    // The one comparison cell-statistics-test-mismatch makes too (checks/factorialCells.ts).
    const compared = compareWithTypes(
      tables.map(({ type, effects }) => ({ type, effect: { df1: effects[t]!.df1, df2: effects[t]!.df2, ...effects[t]!.range } })),
      {
        df: { df1: effect.df1, df2: effect.df2 },
        f: effect.f.interval,
        pFits: effect.p === null ? null : (range) => pAgrees(range, effect.p!),
        partialEtaSquaredFits: effect.partialEtaSquared === null ? null : (range) => overlapsWithSlack(range, effect.partialEtaSquared!.interval),
      },
    );
    const byType = compared.byType.map(({ type, df, f, p, partialEtaSquared }): CellsTypeCheck => ({ type, df, f, p, partialEtaSquared }));
    const reproducedBy = compared.reproducedBy.map((check) => check.type);
    const unmatched: CellsReportedCheck['unmatched'] = compared.unmatched;
    const verdict = reproducedBy.length > 0 ? 'reproduced' : 'not reproduced';
    return {
      text: effect.text,
      effect: tables[0]!.effects[t]!.effect,
      byType,
      reproducedBy,
      verdict,
      unmatched,
      severity: verdict === 'reproduced' ? null : assumed === null ? 'fail' : 'warn',
    };
  });
  const layoutLevels = layout.layout.factorLevels;
  return {
    file,
    factors: input.factors.map((name, f) => ({ name, levels: layoutLevels[f]! })),
    cells: input.cells.length,
    totalN: ns.reduce((a, b) => a + b, 0),
    errorDf: tables[0]!.effects[0]!.df2,
    equalNAssumed: assumed,
    tables: tables.map(({ type, effects }) => ({ type, effects })),
    reported,
  };
}

const TYPE_NAMES: Record<SumOfSquaresType, string> = { 1: 'I', 2: 'II', 3: 'III' };
const TYPE_TITLES: Record<SumOfSquaresType, string> = { 1: 'Type I (sequential)', 2: 'Type II', 3: 'Type III (sum-to-zero coding)' };

function fixed(x: number, digits: number): string {
  return Number.isFinite(x) ? x.toFixed(digits) : String(x);
}

function pText(p: number): string {
  if (!Number.isFinite(p)) return String(p);
  // Three significant digits: enough to see where a printed p falls in the range.
  return p < 0.001 ? p.toExponential(2) : p.toPrecision(3);
}

function listOfTypes(types: readonly SumOfSquaresType[]): string {
  const names = types.map((type) => TYPE_NAMES[type]);
  return names.length === 1 ? names[0]! : `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

/** Verdict line for one reported effect. */
export function reportedLine(check: CellsReportedCheck): string {
  if (check.verdict === 'reproduced') {
    const which = check.reproducedBy.length === 1 ? `type ${listOfTypes(check.reproducedBy)} only` : `types ${listOfTypes(check.reproducedBy)}`;
    return `reproduced by ${which}`;
  }
  const what = check.unmatched.length > 0 ? check.unmatched.join(', ') : 'F, p and partial eta squared together';
  return `${check.severity === 'warn' ? 'WARN' : 'FLAG'}: not reproduced by any type (${what} outside every type's interval)`;
}

export function formatCellsText(output: CellsOutput): string {
  const lines: string[] = [];
  const design = output.factors.map((factor) => factor.levels.length).join(' x ');
  lines.push(`${output.file}: ${design} between-subjects design, ${output.cells} cells, N = ${output.totalN}, error df ${output.errorDf}`);
  for (const factor of output.factors) lines.push(`  ${factor.name}: ${factor.levels.join(', ')}`);
  if (output.equalNAssumed !== null) {
    const source = output.equalNAssumed.from === 'option' ? '--cell-n' : 'the reported error df';
    lines.push(`WARN: the file gives no n; equal ns of ${output.equalNAssumed.n} per cell are assumed (from ${source}), so nothing below is more than a warning.`);
  }
  lines.push('Each value is at the printed means and SDs; [low, high] is its range over every mean and SD that rounds to the printed one.');
  const width = Math.max(6, ...output.tables[0]!.effects.map((row) => row.effect.length));
  for (const table of output.tables) {
    lines.push('', TYPE_TITLES[table.type]);
    lines.push(`  ${'effect'.padEnd(width)}  ${'df'.padEnd(9)} ${'F'.padEnd(30)} ${'p'.padEnd(30)} partial eta squared`);
    for (const row of table.effects) {
      const f = `${fixed(row.f, 3)} [${fixed(row.range.f.low, 3)}, ${fixed(row.range.f.high, 3)}${row.upperEndExact ? '' : '*'}]`;
      const p = `${pText(row.p)} [${pText(row.range.p.low)}, ${pText(row.range.p.high)}]`;
      const eta = `${fixed(row.partialEtaSquared, 3)} [${fixed(row.range.partialEtaSquared.low, 3)}, ${fixed(row.range.partialEtaSquared.high, 3)}]`;
      lines.push(`  ${row.effect.padEnd(width)}  ${`${row.df1}, ${row.df2}`.padEnd(9)} ${f.padEnd(30)} ${p.padEnd(30)} ${eta}`);
    }
  }
  if (output.tables.some((table) => table.effects.some((row) => !row.upperEndExact))) {
    lines.push('', '* an outer bound of the largest F (more cells than are enumerated), not its maximum');
  }
  if (output.reported.length > 0) {
    lines.push('', 'Reported');
    for (const check of output.reported) lines.push(`  ${check.text}`, `    ${reportedLine(check)}`);
    const flagged = output.reported.filter((check) => check.verdict !== 'reproduced').length;
    lines.push('', `${output.reported.length} reported effect${output.reported.length === 1 ? '' : 's'}, ${flagged} not reproduced by any type.`);
  }
  return `${lines.join('\n')}\n`;
}
