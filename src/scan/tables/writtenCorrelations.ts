/**
 * Tables whose cells write each correlation with its symbol ("r = 0.586*"),
 * rows of variables against columns of other variables, often in groups
 * side by side whose header names each group's size:
 *
 *     | Non-shift workers (n = 1,966)   | Shift workers (n = 1,936)        |
 *     | Exhaustion | Cynicism           | Exhaustion | Cynicism            |
 *     | KOSS       | r = 0.586*  | r = 0.536* | r = 0.569* | r = 0.486* |
 *
 * A cell "r = value" with no df, n or p is no result the text scanner takes
 * (a correlation needs its sample to be checked); here the table supplies the
 * sample: each r's df are n − 2 with n from the group header over its column,
 * or from the one sample size the caption or notes state for the whole table.
 * A group header is tied to its columns only by what the table shows: the
 * spans the source gives, one group per column, or the names under the groups
 * repeating block by block (the same variables in every group). Where none
 * ties them, or the notes state several sample sizes, nothing is read: an r
 * given another group's n would be checked against the wrong df.
 */

import type { DocumentTable } from '../../documents/types.js';
import type { ReportedResult } from '../types.js';
import { readCell } from './cells.js';
import { correlationResult, NOTE_N, OTHER_CORRELATIONS, type MatrixInput, type ValueCell } from './matrix.js';
import { asciiAsterisks, readMarkLegend } from './marks.js';

/** A cell that writes a correlation with its symbol and optional marks: "r = 0.586*", "r = −.12", "ρ = .30**". */
const WRITTEN_R = /^(r|\u03c1)\s?=\s?([-\u2212\u2013]?\d?\.\d{1,4})\s?(\*{1,4}|\u2020{1,2}|\u2021{1,2})?$/;
/** A sample size written in a header cell, caption or note: "(n = 1,966)", "N = 60". */
const SAMPLE_SIZE = new RegExp(NOTE_N.source, 'g');
/** Fewest written correlations a table must hold to be read so. */
const MIN_WRITTEN = 3;

interface WrittenCell {
  row: number;
  /** Index of the cell in its row. */
  column: number;
  symbol: 'r' | 'rs';
  cell: ValueCell;
}

/** The written correlations of a table whose value cells all write "r = value", each with the n its column's group states; null when the table is not one. */
export function readWrittenCorrelations(input: MatrixInput): ReportedResult[] | null {
  const { table } = input;
  const found = writtenCells(input);
  if (found === null) return null;
  const { cells, headerCount } = found;
  if (OTHER_CORRELATIONS.test(`${table.caption ?? ''} ${input.notes.slice(0, 2000)}`)) return null;
  const valueColumns = [...new Set(cells.map((cell) => cell.column))].sort((a, b) => a - b);
  const sizeOf = columnSampleSizes(table, headerCount, valueColumns) ?? oneStatedSampleSize(table, input.notes);
  if (sizeOf === null) return null;
  const legend = readMarkLegend([...table.notes, input.notes].join(' '));
  const header = table.rows[headerCount - 1] ?? [];
  const namesOver = headerNamesOverValues(header, valueColumns);
  return cells.map((written) => {
    const n = sizeOf(written.column);
    const other = namesOver?.get(written.column) ?? `column ${written.column}`;
    const result = correlationResult(input, { variable: 0, name: (table.rows[written.row]![0] ?? '').trim(), rowIndex: written.row, values: [] }, other, written.cell, readNumber(written.cell.number), n, legend);
    return written.symbol === 'rs' ? { ...result, symbol: 'rs' as const } : result;
  });
}

function readNumber(written: string) {
  const read = readCell(written);
  if (read.kind !== 'number') throw new Error(`not a number: ${written}`);
  return read.number;
}

/**
 * The cells of the body that write a correlation, and how many rows head the table (those before the first row
 * that holds one); null unless every filled cell after the label of every body row writes one (a dash for a
 * variable with itself allowed) and there are enough of them.
 */
function writtenCells(input: MatrixInput): { cells: WrittenCell[]; headerCount: number } | null {
  const { table, text } = input;
  const headerCount = table.rows.findIndex((row) => row.slice(1).some((cell) => WRITTEN_R.test(asciiAsterisks(cell.trim()))));
  if (headerCount < 1) return null;
  const cells: WrittenCell[] = [];
  for (let row = headerCount; row < table.rows.length; row++) {
    const at = input.located[row];
    for (let column = 1; column < table.rows[row]!.length; column++) {
      const written = asciiAsterisks((table.rows[row]![column] ?? '').trim());
      if (written === '' || /^[-\u2013\u2014\u2212]$/.test(written)) continue;
      const match = WRITTEN_R.exec(written);
      const place = at?.[column] ?? null;
      if (match === null || place === null || text.slice(place.start, place.end).trim() !== (table.rows[row]![column] ?? '').trim()) return null;
      if (readCell(match[2]!).kind !== 'number') return null;
      // The number's place in the cell: after the symbol and the sign.
      const numberStart = place.start + written.indexOf(match[2]!, match[1]!.length);
      const marks = match[3] ?? '';
      cells.push({
        row,
        column,
        symbol: match[1] === 'r' ? 'r' : 'rs',
        cell: { number: match[2]!, marks, start: place.start, end: place.end, numberStart, marksStart: marks === '' ? place.end : place.start + written.lastIndexOf(marks) },
      });
    }
  }
  return cells.length >= MIN_WRITTEN ? { cells, headerCount } : null;
}

/** The sample sizes a text states, as numbers. */
function sampleSizesIn(text: string): number[] {
  return [...text.matchAll(SAMPLE_SIZE)].map((match) => Number(match[1]!.replace(/,/g, '')));
}

/**
 * Each value column's n from a header row whose every filled cell states one (the groups' sizes), tied to the
 * columns by the source's spans, by one group per value column, or by the names of the row under it repeating
 * block by block; null when no header row states sizes or they cannot be tied to the columns.
 */
function columnSampleSizes(table: DocumentTable, headerCount: number, valueColumns: number[]): ((column: number) => number) | null {
  for (let index = 0; index < headerCount; index++) {
    const row = table.rows[index]!;
    // (The label column's name, "Variable", states no size: it heads no group.)
    const filled = row.flatMap((cell, column) => (cell.trim() === '' || (column === 0 && sampleSizesIn(cell).length === 0) ? [] : [{ cell, column }]));
    const sizes = filled.map(({ cell }) => sampleSizesIn(cell));
    if (filled.length === 0 || sizes.some((found) => found.length !== 1)) continue;
    const groupSizes = sizes.map((found) => found[0]!);
    const spans = table.spans?.[index];
    if (spans !== undefined && spans.length === row.length) {
      // The source's spans: each header cell covers the columns from its start to its start plus its span.
      const starts = spans.map((_, at) => spans.slice(0, at).reduce((sum, span) => sum + span, 0));
      const groupOf = (column: number): number | null => {
        const at = filled.findIndex(({ column: headerColumn }) => column >= starts[headerColumn]! && column < starts[headerColumn]! + spans[headerColumn]!);
        return at < 0 ? null : at;
      };
      if (valueColumns.every((column) => groupOf(column) !== null)) return (column) => groupSizes[groupOf(column)!]!;
      return null;
    }
    const perGroup = valueColumns.length / groupSizes.length;
    if (!Number.isInteger(perGroup) || perGroup < 1) return null;
    if (perGroup > 1 && !namesRepeat(table.rows[index + 1], valueColumns.length, perGroup)) return null;
    return (column) => groupSizes[Math.floor(valueColumns.indexOf(column) / perGroup)]!;
  }
  return null;
}

/**
 * Whether the filled cells of the header row under the groups name the same variables group after group
 * ("Exhaustion | Cynicism | Exhaustion | Cynicism"; or, crushed into words, "Exhaustion Cynicism Professional
 * efficacy" three times over three groups): the layout of groups side by side, each over its own copy of the
 * columns, so that each group spans `perGroup` of them.
 */
function namesRepeat(row: string[] | undefined, valueCount: number, perGroup: number): boolean {
  if (row === undefined) return false;
  const names = row.map((cell) => cell.trim().toLowerCase()).filter((cell) => cell !== '');
  const groups = valueCount / perGroup;
  if (names.length % groups !== 0) return false;
  const period = names.length / groups;
  return names.every((name, index) => name === names[index % period]);
}

/** The one sample size the caption and notes state for the whole table ("N = 214"), as every column's; null when they state none or several. */
function oneStatedSampleSize(table: DocumentTable, notes: string): ((column: number) => number) | null {
  const sizes = new Set(sampleSizesIn(`${table.caption ?? ''} ${[...table.notes, notes].join(' ').slice(0, 2000)}`));
  if (sizes.size !== 1) return null;
  const n = [...sizes][0]!;
  return () => n;
}

/** The header's names over the value columns, by their order (the header may stand one cell left of the body): a name for each, or null. */
function headerNamesOverValues(header: string[], valueColumns: number[]): Map<number, string> | null {
  const names = header.map((cell) => cell.trim()).filter((cell) => cell !== '');
  if (names.length !== valueColumns.length) return null;
  return new Map(valueColumns.map((column, index) => [column, names[index]!]));
}
