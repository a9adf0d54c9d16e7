/**
 * Cutting a glued run of digits back into the numbers of a table row
 * ("0.997410.997426.860.0001" under SS, df, MS, F, p: 0.9974, 1, 0.9974,
 * 26.86, 0.0001), when the cells lost their separators and each column
 * may print its own number of decimals.
 *
 * Every way to cut a run is listed, then cut down, in this order, by:
 * - each column's kind of number (df whole and at least 1, p and proportions
 *   at most 1, statistics with decimals, sums of squares not negative), and
 *   an error row that prints nothing after its (positive) MS;
 * - the arithmetic of a source table: MS = SS / df (within the rounding of
 *   the printed numbers, or 0.1%), and F = MS / MS(error) of the first error
 *   row below (or 0.5%: F is computed from unrounded mean squares);
 * - habits of printing (common practice: software prints a column with one
 *   format): numbers below 1 with their leading zero, each column's usual
 *   number of decimals (80% of the rows), SS and MS alike, then the fewest
 *   different decimals and digits given to decimals rather than whole parts;
 *   these last never choose between different df or label ends, nor cut a row
 *   whose cuts all break F = MS / MS(error).
 * Cuts that give the same numbers are one reading. A row left with more than
 * one reading is not read: a cut decided by the p it would make agree is never
 * taken, since that would hide the inconsistencies the audit is for.
 *
 * Pure functions over short strings; the number of cuts listed per row is
 * capped, so the cost per row is bounded.
 */

import type { ColumnRole } from './cells.js';

/** How a column's numbers may be printed. */
export type NumberKind = 'whole' | 'proportion' | 'nonNegative' | 'statistic' | 'signedStatistic' | 'signed';

/** Most cuts listed for one row (beyond it the row is not read). */
const MAX_CUTS = 400;
/** Most digits after a decimal point. */
const MAX_DECIMALS = 5;

export function numberKindOf(role: ColumnRole): NumberKind {
  switch (role.role) {
    case 'df':
    case 'df1':
    case 'df2':
    case 'n':
      return 'whole';
    case 'p':
      return 'proportion';
    case 'effect':
      return role.effect === 'partial-eta-squared' || role.effect === 'eta-squared' || role.effect === 'generalized-eta-squared' || role.effect === 'omega-squared'
        ? 'proportion'
        : 'signed';
    case 'ss':
    case 'ms':
      return 'nonNegative';
    case 'statistic':
      return role.kind === 'F' || role.kind === 'chi2' ? 'statistic' : 'signedStatistic';
    default:
      return 'signed';
  }
}

/** One number taken from a run: its text and what it says. */
export interface CutNumber {
  text: string;
  value: number;
  decimals: number;
  /** Printed without its leading zero (".23"). */
  leadingDot: boolean;
}

const MINUS = /^[\u2212\u2013-]/;
/** A footnote letter or stars after a number ("3251.202a", "0.013*"). */
const MARKS = /^(?:[a-h](?![a-h])|\*{1,3})?/;

/** Every number of `kind` the run `rest` can start with. */
function numbersAtStart(rest: string, kind: NumberKind): CutNumber[] {
  const found: CutNumber[] = [];
  let at = 0;
  if (kind === 'proportion' && rest.startsWith('<')) at = 1;
  let negative = false;
  if ((kind === 'signed' || kind === 'signedStatistic') && MINUS.test(rest.slice(at))) {
    negative = true;
    at += 1;
  }
  // Integer parts: "0", or a first digit 1-9 and more digits (or thousands groups); or none before a point.
  const integerParts: string[] = [];
  const body = rest.slice(at);
  if (body.startsWith('0')) integerParts.push('0');
  else if (/^[1-9]/.test(body)) {
    for (let length = 1; length <= 7 && length <= body.length && /^\d$/.test(body[length - 1]!); length++) integerParts.push(body.slice(0, length));
    const grouped = /^[1-9]\d{0,2}(?:,\d{3})+/.exec(body);
    if (grouped !== null && kind !== 'whole') {
      // Every prefix of whole groups ("1,082" of "1,082,871").
      for (let end = grouped[0].indexOf(','); end !== -1 && end < grouped[0].length; ) {
        const next = grouped[0].indexOf(',', end + 1);
        const stop = next === -1 ? grouped[0].length : next;
        integerParts.push(grouped[0].slice(0, stop));
        end = next;
      }
    }
  }
  if (kind !== 'whole' && body.startsWith('.')) integerParts.push('');
  for (const integer of integerParts) {
    const afterInteger = body.slice(integer.length);
    const fractions: string[] = [];
    if (integer !== '') fractions.push('');
    if (kind !== 'whole' && afterInteger.startsWith('.')) {
      for (let length = 1; length <= MAX_DECIMALS && length < afterInteger.length && /\d/.test(afterInteger[length]!); length++) fractions.push(afterInteger.slice(0, length + 1));
    }
    for (const fraction of fractions) {
      const digits = integer + fraction;
      const after = afterInteger.slice(fraction.length);
      const marks = MARKS.exec(after)![0];
      const percent = after.slice(marks.length).startsWith('%') ? '%' : '';
      const value = Number(digits.replace(/,/g, '')) * (negative ? -1 : 1);
      if (!Number.isFinite(value)) continue;
      if (kind === 'proportion' && value > 1) continue;
      // A df or n is at least 1; a test statistic, a p and a proportion print decimals.
      if (kind === 'whole' && value < 1) continue;
      if ((kind === 'proportion' || kind === 'statistic' || kind === 'signedStatistic') && fraction === '') continue;
      const text = rest.slice(0, at) + digits + marks + percent;
      found.push({ text, value, decimals: fraction.length === 0 ? 0 : fraction.length - 1, leadingDot: integer === '' });
    }
  }
  return found;
}

/**
 * Every way to cut `run` into numbers of the columns' kinds, in order (the last columns may be left empty);
 * `holds` rejects a partial cut early (the arithmetic of the columns read so far). Null when there are more
 * cuts than are listed: such a row is not read.
 */
export function cutsOfRun(run: string, kinds: readonly NumberKind[], holds: (partial: readonly CutNumber[]) => boolean = () => true): CutNumber[][] | null {
  const cuts: CutNumber[][] = [];
  let overflow = false;
  const walk = (at: number, column: number, taken: CutNumber[]): void => {
    if (overflow) return;
    if (at === run.length) {
      if (taken.length === 0) return;
      if (cuts.length >= MAX_CUTS) overflow = true;
      else cuts.push([...taken]);
      return;
    }
    if (column >= kinds.length) return;
    for (const number of numbersAtStart(run.slice(at), kinds[column]!)) {
      taken.push(number);
      if (holds(taken)) walk(at + number.text.length, column + 1, taken);
      taken.pop();
    }
  };
  walk(0, 0, []);
  return overflow ? null : cuts;
}

/** Half a unit in the last printed place of a number. */
const halfUnit = (number: CutNumber): number => 0.5 * 10 ** -number.decimals;

/** MS = SS / df, or null when the cut lacks one of them. */
export function meanSquareHolds(cut: readonly CutNumber[], roles: readonly ColumnRole[]): boolean | null {
  const at = (role: string): number => roles.findIndex((r) => r.role === role);
  const ss = cut[at('ss')];
  const df = cut[at('df')] ?? cut[at('df1')];
  const ms = cut[at('ms')];
  if (ss === undefined || df === undefined || ms === undefined || df.value <= 0) return null;
  // Within rounding, or within 0.1%: a printed table's MS may be off in its last digit (it decides between cuts
  // that differ by a digit moved from one number to the next, which changes a number many times over).
  const tolerance = Math.max(halfUnit(ms) + halfUnit(ss) / df.value, 0.001 * Math.abs(ms.value));
  return Math.abs(ss.value / df.value - ms.value) <= tolerance + 1e-12;
}

/** F = MS / MS(error), or null when the cut has no MS or F. */
export function fRatioHolds(cut: readonly CutNumber[], roles: readonly ColumnRole[], errorMeanSquare: CutNumber): boolean | null {
  const msAt = roles.findIndex((r) => r.role === 'ms');
  const fAt = roles.findIndex((r) => r.role === 'statistic' && r.kind === 'F');
  const ms = cut[msAt];
  const f = cut[fAt];
  if (ms === undefined || f === undefined || errorMeanSquare.value <= 0) return null;
  const low = Math.max(0, ms.value - halfUnit(ms)) / (errorMeanSquare.value + halfUnit(errorMeanSquare));
  const high = (ms.value + halfUnit(ms)) / Math.max(1e-12, errorMeanSquare.value - halfUnit(errorMeanSquare));
  // As for MS, within 0.5% too: F is computed from unrounded mean squares.
  return f.value >= Math.min(low - halfUnit(f), 0.995 * low) && f.value <= Math.max(high + halfUnit(f), 1.005 * high);
}

/** The cuts of one row, with where its label ends for each (a label may end in digits: "X1", "X12"). */
export interface RowCuts {
  cuts: { labelEnd: number; numbers: CutNumber[] }[];
  /** More cuts than were listed: the row cannot be decided. */
  overflow: boolean;
}

const valuesKey = (numbers: readonly CutNumber[]): string => numbers.map((n) => n.value).join('|');

/** Cuts that say different numbers (cuts printing the same numbers differently are one reading). */
export function distinctReadings<T extends { numbers: CutNumber[] }>(cuts: readonly T[]): T[] {
  const seen = new Map<string, T>();
  for (const cut of cuts) {
    const key = valuesKey(cut.numbers);
    if (!seen.has(key)) seen.set(key, cut);
  }
  return [...seen.values()];
}

/** Keeps the cuts that pass `keep` when some do; otherwise all of them (a test that says nothing removes nothing). */
function narrowed<T>(cuts: readonly T[], keep: (cut: T) => boolean): T[] {
  const kept = cuts.filter(keep);
  return kept.length > 0 ? kept : [...cuts];
}

/**
 * The one reading of each row, or null for a row whose cut stays open:
 * `rows[i]` lists the row's cuts; `roles` are the value columns' roles;
 * `errorRow` says which rows are error rows (their MS divides the F above).
 */
export function chooseCuts(rows: readonly RowCuts[], roles: readonly ColumnRole[], kinds: readonly NumberKind[], isErrorRow: (row: number) => boolean): ({ labelEnd: number; numbers: CutNumber[] } | null)[] {
  // Sure by kind and by MS = SS / df.
  let open = rows.map((row) => (row.overflow ? [] : row.cuts.filter((cut) => meanSquareHolds(cut.numbers, roles) !== false)));
  const single = (cuts: readonly { numbers: CutNumber[] }[]): boolean => distinctReadings(cuts).length <= 1;
  // An error row prints its SS, df and MS and nothing after them (common practice: it has no F of its own).
  const msColumn = roles.findIndex((r) => r.role === 'ms');
  // (And a positive MS: an error MS of zero would make every F above it infinite.)
  if (msColumn >= 0) open = open.map((cuts, row) => (isErrorRow(row) ? narrowed(cuts, (cut) => cut.numbers.length <= msColumn + 1 && (cut.numbers[msColumn]?.value ?? 1) > 0) : cuts));
  // Leading zeros, as the rest of the row prints them.
  open = open.map((cuts) => narrowed(cuts, (cut) => cut.numbers.every((n) => !n.leadingDot)));
  // F = MS / MS(error), with the MS of the first error row below, once it is sure (by its own arithmetic, else by
  // its column's usual decimals): arithmetic decides before any habit of printing does.
  const msAt = roles.findIndex((r) => r.role === 'ms');
  const errorMeanSquare = (row: number, from: readonly { numbers: CutNumber[] }[][]): CutNumber | undefined => {
    for (let below = row + 1; below < from.length; below++) {
      if (!isErrorRow(below)) continue;
      const cuts = from[below]!;
      return cuts.length > 0 && single(cuts) ? cuts[0]!.numbers[msAt] : undefined;
    }
    return undefined;
  };
  // A row none of whose cuts gives F = MS / MS(error) has a cell off (a mistyped F or MS): only its column's usual
  // decimals may still decide its cut, not the weaker habits of printing applied last.
  const arithmeticOff = new Set<number>();
  const byFRatio = (from: { labelEnd: number; numbers: CutNumber[] }[][]): { labelEnd: number; numbers: CutNumber[] }[][] =>
    from.map((cuts, row) => {
      const error = errorMeanSquare(row, from);
      if (error === undefined || single(cuts)) return cuts;
      const kept = cuts.filter((cut) => fRatioHolds(cut.numbers, roles, error) !== false);
      if (kept.length === 0) arithmeticOff.add(row);
      return kept.length > 0 ? kept : cuts;
    });
  open = byFRatio(open);
  // Each column's usual number of decimals; then rows cut to match it, and F = MS / MS(error) again with error rows
  // the decimals made sure.
  const decimals = usualDecimals(open);
  open = byFRatio(open.map((cuts) => narrowed(cuts, (cut) => cut.numbers.every((n, column) => decimals[column] === undefined || n.decimals === decimals[column]))));
  // The sum of squares and the mean square in one format, as software prints them.
  const ssAt = roles.findIndex((r) => r.role === 'ss');
  if (ssAt >= 0 && msAt >= 0) open = open.map((cuts, row) => (arithmeticOff.has(row) ? cuts : narrowed(cuts, (cut) => cut.numbers[msAt] === undefined || cut.numbers[ssAt]?.decimals === cut.numbers[msAt]!.decimals)));
  // Last, the fewest different numbers of decimals in the row (common practice: a table prints to fixed decimals),
  // These last preferences only choose how digits are shared between decimals: cuts that differ in a df (a whole
  // number) or in where the label ends are left open ("/MVC139..." is df 1 and 39, or 13 and 9: nothing says).
  const wholeAt = kinds.flatMap((kind, column) => (kind === 'whole' ? [column] : []));
  const sameFrame = (cuts: readonly { labelEnd: number; numbers: CutNumber[] }[]): boolean =>
    new Set(cuts.map((cut) => [cut.labelEnd, ...wholeAt.map((column) => cut.numbers[column]?.value ?? '')].join('|'))).size === 1;
  open = open.map((cuts, row) => {
    if (cuts.length <= 1 || !sameFrame(cuts) || arithmeticOff.has(row)) return cuts;
    const spread = (cut: { numbers: CutNumber[] }): number => new Set(cut.numbers.filter((n) => n.decimals > 0).map((n) => n.decimals)).size;
    const least = Math.min(...cuts.map(spread));
    const fewest = cuts.filter((cut) => spread(cut) === least);
    // Then digits given to decimals rather than to whole parts ("81.724 | 0.000" before "81.7 | 240.000").
    const wholeDigits = (cut: { numbers: CutNumber[] }): number => cut.numbers.reduce((sum, n) => sum + (n.text.replace(/[^\d.]/g, '').split('.')[0]?.length ?? 0), 0);
    const shortest = Math.min(...fewest.map(wholeDigits));
    return fewest.filter((cut) => wholeDigits(cut) === shortest);
  });
  return open.map((cuts, row) => (cuts.length > 0 && single(cuts) && !rows[row]!.overflow ? cuts[0]! : null));
}

/**
 * Per column, the number of decimals nearly every row can be read with (undefined where the rows differ, as
 * when software prints significant digits rather than fixed decimals): a row supports a number of decimals
 * when one of its readings prints the column with it.
 */
function usualDecimals(open: readonly { numbers: CutNumber[] }[][]): (number | undefined)[] {
  const support: Map<number, number>[] = [];
  const covering: number[] = [];
  for (const cuts of open) {
    const seen = new Map<number, Set<number>>();
    for (const cut of cuts) cut.numbers.forEach((n, column) => (seen.get(column) ?? seen.set(column, new Set()).get(column)!).add(n.decimals));
    for (const [column, decimals] of seen) {
      covering[column] = (covering[column] ?? 0) + 1;
      const map = (support[column] ??= new Map());
      for (const d of decimals) map.set(d, (map.get(d) ?? 0) + 1);
    }
  }
  return support.map((map, column) => {
    const ranked = [...(map ?? new Map<number, number>())].sort((a, b) => b[1] - a[1]);
    const [decimals, count] = ranked[0] ?? [0, 0];
    const runnerUp = ranked[1]?.[1] ?? 0;
    return count >= 2 && count > runnerUp && count >= 0.8 * covering[column]! ? decimals : undefined;
  });
}
