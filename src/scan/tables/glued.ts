/**
 * Tables whose cells ran together when a web page's table became text:
 *
 *     SourceType III sum of squaresDfMean squareFSig.Partial eta squared
 *     Corrected model3251.202a12270.93338.3190.0000.774
 *     Pretest1854.79511854.795262.3280.0000.662
 *     Error947.4511347.071
 *
 * The header is cut into the known column names it is made of. Each row is
 * its label (the text before its first digit) and a run of digits, cut into
 * numbers by what statistics software prints: every decimal column with
 * the same number of decimals, df whole numbers. Where a df runs into the
 * number after it ("12270.933": 12 and 270.933, or 1 and 2270.933?) the
 * cut is the one for which the mean square is the sum of squares over the
 * df, within rounding; a row whose cut this does not decide is left out
 * rather than guessed. Each row's cells keep their offsets in the text.
 */

import type { CellSpan, DocumentTable } from '../../documents/types.js';
import { classifyHeader, knownHeaderNames, type ColumnRole, type TextLine } from './cells.js';

type Line = TextLine;

/** Longest header line and row read. */
const MAX_LINE = 300;
/** Most rows of one table. */
const MAX_ROWS = 200;
/** Most blank lines between rows. */
const MAX_BLANKS = 2;

/**
 * The known names, longest first, filed under their first character: at each place of a line only the names
 * that start with its character can match, so the search tries a handful instead of the whole vocabulary (it
 * ran for every line of prose). Within a first character the names keep their order, so ties fall as before.
 */
let vocabulary: Map<string, string[]> | null = null;

function vocabularyByFirstCharacter(): Map<string, string[]> {
  const byFirst = new Map<string, string[]>();
  for (const name of knownHeaderNames().filter((name) => name.length >= 1).sort((a, b) => b.length - a.length)) {
    const bucket = byFirst.get(name[0]!);
    if (bucket === undefined) byFirst.set(name[0]!, [name]);
    else bucket.push(name);
  }
  return byFirst;
}

/** The header's column names, if the line is made only of known names run together (at least two joined without a space). */
export function splitGluedHeader(text: string): string[] | null {
  if (text.length > MAX_LINE || /\d\.\d/.test(text)) return null;
  vocabulary ??= vocabularyByFirstCharacter();
  const lower = text.toLowerCase();
  const n = lower.length;
  // best[i]: fewest names covering lower[0, i); from[i]: where the last name starts.
  const best = new Array<number>(n + 1).fill(Infinity);
  const from = new Array<number>(n + 1).fill(-1);
  best[0] = 0;
  for (let i = 0; i < n; i++) {
    if (best[i] === Infinity) continue;
    let at = i;
    while (lower[at] === ' ') at++;
    for (const name of vocabulary.get(lower[at] ?? '') ?? []) {
      if (!lower.startsWith(name, at)) continue;
      const end = at + name.length;
      if (best[i]! + 1 < best[end]!) {
        best[end] = best[i]! + 1;
        from[end] = i;
      }
    }
  }
  let end = n;
  while (end > 0 && lower[end - 1] === ' ') end--;
  if (best[end] === Infinity) return null;
  const pieces: string[] = [];
  for (let at = end; at > 0; at = from[at]!) pieces.unshift(text.slice(from[at]!, at).trim());
  const joinedWithoutSpace = pieces.filter((_, index) => index > 0 && !/\s$/.test(text.slice(0, text.indexOf(pieces[index]!)))).length;
  const roles = pieces.map(classifyHeader);
  const named = roles.filter((role) => role.role !== 'label' && role.role !== 'unknown');
  if (pieces.length < 4 || joinedWithoutSpace < 2 || !roles.some((role) => role.role === 'statistic') || named.length < 3) return null;
  return pieces;
}

interface GluedRow {
  label: string;
  labelSpan: CellSpan;
  blob: string;
  blobStart: number;
}

const ROW = /^(\D*?[^\d\s.<])\s*((?:<\s*)?\.?\d[\d.,a-h<*]*)\s*$/;

function readRow(line: Line): GluedRow | null {
  if (line.text.length > MAX_LINE) return null;
  const match = ROW.exec(line.text);
  if (!match) return null;
  const label = match[1]!.trim();
  const labelStart = line.start + line.text.indexOf(label);
  const blobStart = line.start + line.text.lastIndexOf(match[2]!);
  return { label, labelSpan: { start: labelStart, end: labelStart + label.length }, blob: match[2]!, blobStart };
}

/** How a column's numbers are printed. */
type ColumnFormat = 'decimal' | 'whole';

interface Cut {
  texts: string[];
  spans: CellSpan[];
}

/**
 * Every way to cut `blob` into numbers of the given formats, in order (fewer
 * numbers than columns is allowed: the last columns are then empty). A
 * decimal has `decimals` digits after its point, then maybe a footnote
 * letter; a whole number may only be cut where a decimal follows it.
 */
function cutsOf(blob: string, formats: ColumnFormat[], decimals: number): string[][] {
  const results: string[][] = [];
  const walk = (at: number, column: number, taken: string[]): void => {
    if (results.length > 16) return;
    if (at === blob.length) {
      results.push([...taken]);
      return;
    }
    if (column >= formats.length) return;
    const rest = blob.slice(at);
    if (formats[column] === 'decimal') {
      const match = new RegExp(`^(?:<\\s*)?\\d*\\.\\d{${decimals}}[a-h]?\\*{0,3}`).exec(rest);
      if (match) walk(at + match[0].length, column + 1, [...taken, match[0]]);
      return;
    }
    // A whole number: as many digits as leave a decimal (or nothing) after it.
    for (let length = 1; length <= 6 && length <= rest.length; length++) {
      const digits = rest.slice(0, length);
      if (!/^\d+$/.test(digits)) break;
      if (length > 1 && digits.startsWith('0')) break;
      walk(at + length, column + 1, [...taken, digits]);
    }
  };
  walk(0, 0, []);
  return results;
}

const numberOf = (text: string): number => Number(text.replace(/^< ?/, '').replace(/[a-h*]{1,4}$/, ''));

/** True when the cut's SS, df and MS agree (MS = SS / df within the rounding of the printed numbers). */
function arithmeticHolds(cut: string[], roles: ColumnRole[], decimals: number): boolean | null {
  const at = (role: string): number => roles.findIndex((r) => r.role === role);
  const ss = at('ss');
  const df = at('df');
  const ms = at('ms');
  if (ss < 0 || df < 0 || ms < 0 || cut[ss] === undefined || cut[df] === undefined) return null;
  if (cut[ms] === undefined) return null;
  // Rounding: the printed MS is within half a unit of SS / df, whose own rounding adds half a unit over df.
  const dfValue = numberOf(cut[df]!);
  const halfUnit = 0.5 * 10 ** -decimals;
  return Math.abs(numberOf(cut[ss]!) / dfValue - numberOf(cut[ms]!)) <= halfUnit * (1 + 1 / dfValue) + 1e-12;
}

export interface GluedTable {
  table: DocumentTable;
  lastLine: number;
}

/** A glued table whose header is `lines[headerLine]`, or null. */
export function readGluedTable(lines: Line[], headerLine: number): GluedTable | null {
  const header = lines[headerLine];
  if (header === undefined) return null;
  const names = splitGluedHeader(header.text);
  if (names === null) return null;
  const roles = names.map(classifyHeader);
  const labelColumns = roles[0]?.role === 'label' ? 1 : 0;
  const valueRoles = roles.slice(labelColumns);
  const formats: ColumnFormat[] = valueRoles.map((role) => (role.role === 'df' || role.role === 'df1' || role.role === 'df2' || role.role === 'n' ? 'whole' : 'decimal'));
  const rows: GluedRow[] = [];
  const rowLines: number[] = [];
  let blanks = 0;
  for (let index = headerLine + 1; index < lines.length && rows.length < MAX_ROWS; index++) {
    const line = lines[index]!;
    if (line.text.trim() === '') {
      if (++blanks > MAX_BLANKS) break;
      continue;
    }
    blanks = 0;
    const row = readRow(line);
    if (row === null) break;
    rows.push(row);
    rowLines.push(index);
  }
  if (rows.length === 0) return null;
  // The number of decimals the software printed: the one that cuts the most rows with their arithmetic right.
  let best: { decimals: number; cuts: (string[] | null)[]; score: number } | null = null;
  for (const decimals of [3, 2, 1, 4]) {
    const cuts = rows.map((row) => {
      const candidates = cutsOf(row.blob, formats, decimals);
      if (candidates.length === 1) return candidates[0]!;
      const agreeing = candidates.filter((cut) => arithmeticHolds(cut, valueRoles, decimals) === true);
      return agreeing.length === 1 ? agreeing[0]! : null;
    });
    const score = cuts.filter((cut) => cut !== null).length;
    if (best === null || score > best.score) best = { decimals, cuts, score };
  }
  if (best === null || best.score === 0) return null;
  const tableRows: string[][] = [names];
  const cells: (CellSpan | null)[][] = [names.map(() => null)];
  rows.forEach((row, index) => {
    const cut = best!.cuts[index];
    if (cut === null || cut === undefined) return;
    const texts = new Array<string>(names.length).fill('');
    const spans = new Array<CellSpan | null>(names.length).fill(null);
    texts[0] = row.label;
    spans[0] = row.labelSpan;
    let offset = row.blobStart;
    cut.forEach((text, column) => {
      texts[labelColumns + column] = text;
      spans[labelColumns + column] = { start: offset, end: offset + text.length };
      offset += text.length;
    });
    tableRows.push(texts);
    cells.push(spans);
  });
  const lastLine = rowLines[rowLines.length - 1]!;
  return {
    table: {
      start: header.start,
      end: lines[lastLine]!.end,
      caption: null,
      notes: [],
      rows: tableRows,
      headerRows: 1,
      cells,
      layout: 'glued',
    },
    lastLine,
  };
}
