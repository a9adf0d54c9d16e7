/**
 * Tables whose cells ran together when a web page's table became text:
 *
 *     SourceType III sum of squaresDfMean squareFSig.Partial eta squared
 *     Corrected model3251.202a12270.93338.3190.0000.774
 *     Pretest1854.79511854.795262.3280.0000.662
 *     Error947.4511347.071
 *
 * The header is cut into the known column names it is made of (or, where some
 * names are not known, where one word runs into the next with a capital).
 * Each row is its label and the run of digits that ends its line, cut into
 * the columns' numbers by gluedCuts.ts (arithmetic first, then what software
 * prints); a row whose cut nothing sure decides is left out rather than
 * guessed, and counted so its table is listed as not fully read. Each row's
 * cells keep their offsets in the text.
 */

import type { CellSpan, DocumentTable } from '../../documents/types.js';
import { classifyHeader, ERROR_LABEL, knownHeaderNames, withLostPSymbol, type ColumnRole, type TextLine } from './cells.js';
import { chooseCuts, cutsOfRun, meanSquareHolds, numberKindOf, type CutNumber, type NumberKind, type RowCuts } from './gluedCuts.js';

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

/**
 * A known name as a page prints it with its Greek letters and superscripts ("etap2" is also "ηp2" and "ηp²"):
 * the vocabulary holds names spelled out, and a glued header is matched as printed.
 */
function printedVariants(name: string): string[] {
  if (!/eta|chi|omega/.test(name)) return [name];
  const greek = name.replace(/eta/g, '\u03b7').replace(/chi/g, '\u03c7').replace(/omega/g, '\u03c9');
  return [...new Set([name, greek, greek.replace(/2/g, '\u00b2')])];
}

function vocabularyByFirstCharacter(): Map<string, string[]> {
  const byFirst = new Map<string, string[]>();
  const names = knownHeaderNames().flatMap(printedVariants);
  for (const name of names.filter((name) => name.length >= 1).sort((a, b) => b.length - a.length)) {
    const bucket = byFirst.get(name[0]!);
    if (bucket === undefined) byFirst.set(name[0]!, [name]);
    else bucket.push(name);
  }
  return byFirst;
}

/** Where each known name that starts at `from` (after spaces) ends, longest first. */
function knownNameEnds(lower: string, from: number): number[] {
  vocabulary ??= vocabularyByFirstCharacter();
  let at = from;
  while (lower[at] === ' ') at++;
  return (vocabulary.get(lower[at] ?? '') ?? []).filter((name) => lower.startsWith(name, at)).map((name) => at + name.length);
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
    for (const end of knownNameEnds(lower, i)) {
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

/**
 * Where a glued header may be cut between words it does not know: a lower-case letter, digit or closing bracket
 * before a capital ("varianceSum", "squaresDf"), or a capital before a capitalised word ("FValue", "SEAdj").
 */
function isWordJoin(text: string, at: number): boolean {
  const before = text[at - 1] ?? '';
  const here = text[at] ?? '';
  const after = text[at + 1] ?? '';
  if (/[a-z0-9)\].%²]/.test(before) && /[A-Z]/.test(here)) return true;
  return /[A-Z]/.test(before) && /[A-Z]/.test(here) && /[a-z]/.test(after);
}

/** Costs of the cut: a known name costs little, a piece the vocabulary does not know costs its length (the cut reads as much of the header with known names as it can). */
const KNOWN_PIECE_COST = 0.01;
const unknownPieceCost = (piece: string): number => 1 + piece.replace(/\s/g, '').length;

/**
 * The header's column names when some of them are not known ("Source of varianceSum of squaresDfMean of
 * squaresValue of calculated F..."): known names where they fit, the rest cut where one word runs into the next
 * with a capital. At least three known names, two of them joined without a space, and a statistic among them.
 */
export function splitGluedHeaderLoosely(text: string): string[] | null {
  if (text.length > MAX_LINE || /\d\.\d/.test(text) || /\s{3,}|\t|\|/.test(text.trim())) return null;
  vocabulary ??= vocabularyByFirstCharacter();
  const lower = text.toLowerCase();
  const n = text.trimEnd().length;
  const cuttable = (at: number): boolean => at === 0 || at === n || isWordJoin(text, at);
  // The next place to cut at or after each place (computed once: the line is walked from its end).
  const nextCut = new Array<number>(n + 1).fill(n);
  let joins = 0;
  for (let at = n - 1; at >= 1; at--) {
    const join = isWordJoin(text, at);
    if (join) joins++;
    nextCut[at] = join ? at : nextCut[at + 1]!;
  }
  // Cells run together leave words joined without a space: a line with fewer is no glued header.
  if (joins < 2) return null;
  const best = new Array<number>(n + 1).fill(Infinity);
  const from = new Array<number>(n + 1).fill(-1);
  best[0] = 0;
  for (let i = 0; i < n; i++) {
    if (best[i] === Infinity) continue;
    let at = i;
    while (lower[at] === ' ') at++;
    for (const end of knownNameEnds(lower, i)) {
      // A known name ends where the text does or where another word starts.
      if (end !== n && !cuttable(end) && !/[\s.)]/.test(text[end - 1]!) && /[a-z]/i.test(text[end]!)) continue;
      if (best[i]! + KNOWN_PIECE_COST < best[end]!) {
        best[end] = best[i]! + KNOWN_PIECE_COST;
        from[end] = i;
      }
    }
    // An unknown piece runs from where the last piece ended to the next join (a join inside it would be a cell
    // boundary).
    const end = nextCut[Math.min(at + 1, n)]!;
    const cost = unknownPieceCost(text.slice(i, end));
    if (best[i]! + cost < best[end]!) {
      best[end] = best[i]! + cost;
      from[end] = i;
    }
  }
  if (best[n] === Infinity) return null;
  const pieces: string[] = [];
  for (let at = n; at > 0; at = from[at]!) pieces.unshift(text.slice(from[at]!, at).trim());
  const roles = withLostPSymbol(pieces, pieces.map(classifyHeader));
  const named = roles.filter((role) => role.role !== 'label' && role.role !== 'unknown');
  if (pieces.length < 4 || named.length < 3 || !roles.some((role) => role.role === 'statistic')) return null;
  return pieces;
}

interface GluedRow {
  label: string;
  labelStart: number;
  run: string;
  runStart: number;
}

/** Characters of a run of numbers: digits, points, commas, signs, comparators, stars, percent. */
const RUN_CHARACTER = /[\d.,<%*\u2212\u2013-]/;

/**
 * Where the run of numbers that ends `text` starts (a footnote letter may sit inside it, "3251.202a12"), or -1.
 * Found by walking back from the end, so the cost is linear in the line.
 */
function runStartOf(text: string): number {
  let at = text.length;
  while (at > 0 && (RUN_CHARACTER.test(text[at - 1]!) || (/[a-h]/.test(text[at - 1]!) && /\d/.test(text[at - 2] ?? '') && !/[a-z]/.test(text[at] ?? '')))) at--;
  // The run starts at a digit, a point before a digit, a comparator or a minus sign.
  while (at < text.length && !/[\d<\u2212\u2013-]/.test(text[at]!) && !(text[at] === '.' && /\d/.test(text[at + 1] ?? ''))) at++;
  return at < text.length && /\d/.test(text.slice(at)) ? at : -1;
}

/** A row: its label, then a run of numbers to the end of the line. */
function readRow(line: Line): GluedRow | null {
  const text = line.text.trimEnd();
  if (text.length > MAX_LINE) return null;
  const start = runStartOf(text);
  if (start < 0) return null;
  const label = text.slice(0, start).trim();
  // A label is a name: it has a letter (a run alone, or after a bracket, is no row of this kind).
  if (!/[A-Za-z\u00c0-\u024f\u0370-\u03ff]/.test(label) || /[\d.]\s*$/.test(text.slice(0, start))) return null;
  return { label, labelStart: line.start + text.indexOf(label), run: text.slice(start), runStart: line.start + start };
}

/** A label that is a code ("X1", "X1X2", "MVC1") may end in digits glued to the run: how many digits it may take. */
const CODE_LABEL = /(?:^|[^A-Za-z])[A-Z]{1,4}$/;

function rowCuts(row: GluedRow, kinds: readonly NumberKind[], roles: readonly ColumnRole[]): RowCuts {
  const cuts: RowCuts['cuts'] = [];
  let overflow = false;
  const extensions = CODE_LABEL.test(row.label) ? 2 : 0;
  // A partial cut whose SS, df and MS are read must have MS = SS / df.
  const holds = (partial: readonly CutNumber[]): boolean => meanSquareHolds(partial, roles) !== false;
  for (let taken = 0; taken <= extensions; taken++) {
    if (taken > 0 && !/^\d$/.test(row.run[taken - 1]!)) break;
    const found = cutsOfRun(row.run.slice(taken), kinds, holds);
    if (found === null) overflow = true;
    else for (const numbers of found) cuts.push({ labelEnd: taken, numbers });
  }
  return { cuts, overflow };
}

export interface GluedTable {
  table: DocumentTable;
  lastLine: number;
}

/** A glued table whose header is `lines[headerLine]`, or null. */
export function readGluedTable(lines: Line[], headerLine: number): GluedTable | null {
  const header = lines[headerLine];
  if (header === undefined) return null;
  const names = splitGluedHeader(header.text) ?? splitGluedHeaderLoosely(header.text);
  if (names === null) return null;
  const roles = withLostPSymbol(names, names.map(classifyHeader));
  const labelColumns = roles[0]?.role === 'label' || roles[0]?.role === 'unknown' ? 1 : 0;
  const valueRoles = roles.slice(labelColumns);
  const kinds = valueRoles.map(numberKindOf);
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
  const cutsByRow = rows.map((row) => rowCuts(row, kinds, valueRoles));
  const chosen = chooseCuts(
    cutsByRow,
    valueRoles,
    kinds,
    (index) => ERROR_LABEL.test(rows[index]!.label.toLowerCase()),
  );
  if (chosen.every((cut) => cut === null)) return null;
  const tableRows: string[][] = [names];
  const cells: (CellSpan | null)[][] = [names.map(() => null)];
  rows.forEach((row, index) => {
    const cut = chosen[index];
    if (cut === null || cut === undefined) return;
    const texts = new Array<string>(names.length).fill('');
    const spans = new Array<CellSpan | null>(names.length).fill(null);
    const labelEnd = cut.labelEnd > 0 ? row.runStart + cut.labelEnd : row.labelStart + row.label.length;
    texts[0] = cut.labelEnd > 0 ? `${row.label}${row.run.slice(0, cut.labelEnd)}` : row.label;
    spans[0] = { start: row.labelStart, end: labelEnd };
    let offset = row.runStart + cut.labelEnd;
    cut.numbers.forEach((number, column) => {
      texts[labelColumns + column] = number.text;
      spans[labelColumns + column] = { start: offset, end: offset + number.text.length };
      offset += number.text.length;
    });
    tableRows.push(texts);
    cells.push(spans);
  });
  const lastLine = rowLines[rowLines.length - 1]!;
  // Rows whose run cut more than one way, among those whose cells would reach a statistic's column.
  const statisticAt = valueRoles.findIndex((role) => role.role === 'statistic');
  const notRebuilt = cutsByRow.filter((cuts, index) => chosen[index] === null && statisticAt >= 0 && cuts.cuts.some((cut) => cut.numbers.length > statisticAt)).length;
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
      ...(notRebuilt > 0 ? { rowsNotRebuilt: notRebuilt } : {}),
    },
    lastLine,
  };
}
