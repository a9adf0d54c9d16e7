/**
 * Correlation matrices whose cells ran together when a web page's table
 * became text, numbered columns and all:
 *
 *     1234567891011121314
 *     1. Physical exhaustion
 *     2. Impaired relations.61
 *     5. Management team-.23-.27-.26-.34
 *     2Employment opportunity 0.49**1
 *
 * Each row is its label and a run of correlations: a sign, an optional
 * leading zero, a decimal point and the table's number of decimals, then
 * significance marks; the diagonal "1" or a dash may stand among them. The
 * number of decimals is the one (two or three) with which the most rows cut
 * into correlations with nothing left over; a row that does not cut cleanly
 * is left out rather than guessed. The header of run-together column numbers
 * ("1234567891011121314", "Number 12345678910") is cut into 1, 2, … k in
 * order, maybe with one more column named after them ("1 2 … 9 PHQ-9 Total"); a row's variable is the number
 * before or after its name ("1. Anxiety", "Item 3") or that last column's name. Read only under a title that
 * says the table holds correlations;
 * the table reader then reads it as any numbered matrix (matrix.ts), each
 * cell pointing at its place in the text.
 */

import type { CellSpan, DocumentTable } from '../../documents/types.js';
import { TABLE_TITLE, BARE_TABLE_TITLE, type TextLine } from './cells.js';
import { tableOverLines } from './rebuilt.js';

type Line = TextLine;

/** Most lines after the title looked at for the header and rows. */
const MAX_LINES = 120;
/** Longest line read as a row. */
const MAX_ROW_LENGTH = 400;
/** Most blank lines between two rows. */
const MAX_BLANKS = 2;
/** Fewest rows that must cut cleanly. */
const MIN_ROWS = 3;
/** Most columns of a numbered header. */
const MAX_COLUMNS = 40;

const SAYS_CORRELATIONS = /correlat|intercorrelat/i;
const OTHER_CORRELATIONS = /partial|intra-?class|canonical|\bICC|semi-?partial|cross-?lagged|polychoric|tetrachoric/i;
const NOTE_LINE = /^\s*(?:Notes?\b|\*|[a-h]\s|Correlation is significant|Abbreviations?)/i;

interface GluedCell {
  text: string;
  start: number;
  end: number;
}

/** A correlation (or the diagonal, or a dash) at the start of `text`, with `decimals` decimals; its length or 0. */
function valueLength(text: string, at: number, decimals: number): number {
  const correlation = new RegExp(`^(?:[-\\u2212\\u2013] ?)?0?\\.\\d{${decimals}}(?![\\d])(?:\\*{1,3}|[\\u2020\\u2021])?|^1(?:\\.0{1,3})?(?![\\d.])|^(?:--|[\\u2014\\u2013-])(?![\\d.])`);
  const match = correlation.exec(text.slice(at, at + 16));
  return match === null ? 0 : match[0].length;
}

/** The row's cells after its label, cut with `decimals`; null unless the whole run cuts cleanly. */
function cutRow(text: string, from: number, decimals: number): GluedCell[] | null {
  const cells: GluedCell[] = [];
  let at = from;
  while (at < text.length) {
    while (at < text.length && text[at] === ' ') at++;
    if (at >= text.length) break;
    const length = valueLength(text, at, decimals);
    if (length === 0) return null;
    cells.push({ text: text.slice(at, at + length), start: at, end: at + length });
    at += length;
  }
  return cells;
}

/** A row's run that is the diagonal alone: "1", "1.00", a dash. */
const DIAGONAL_RUN = /^\s*(?:1(?:\.0{1,3})?|--|[\u2014\u2013-])\s*$/;
/** A correlation of a lower triangle whose decimals vary ("-0.2", "0.53"), its leading zero printed: at the start of the text. */
const TRIANGLE_VALUE = /^(?:[-\u2212\u2013] ?)?0\.\d{1,3}(?:\*{1,3}|[\u2020\u2021])?/;

/**
 * Row `number` of a lower triangle whose diagonal is printed, its cells run together: `number` − 1 correlations,
 * each with its leading zero and one to three decimals, then the diagonal ("1", "1.00" or a dash); rows below the
 * last column hold `columns` correlations and no diagonal. The cut must be the only one: "0.670.641" is 0.67,
 * 0.64 and the diagonal 1, never 0.670 and .641. Null when no cut or more than one fits.
 */
function cutTriangleRow(text: string, from: number, number: number, columns: number): GluedCell[] | null {
  const values = Math.min(number - 1, columns);
  const withDiagonal = number <= columns;
  const cuts: GluedCell[][] = [];
  const walk = (at: number, cells: GluedCell[]): void => {
    if (cuts.length > 1) return;
    while (text[at] === ' ') at++;
    if (cells.length === values) {
      const rest = text.slice(at).trimEnd();
      if (!withDiagonal ? rest === '' : DIAGONAL_RUN.test(rest)) {
        cuts.push(withDiagonal ? [...cells, { text: rest.trim(), start: at, end: at + rest.length }] : cells);
      }
      return;
    }
    const head = text.slice(at, at + 12);
    for (let length = head.length; length > 0; length--) {
      const candidate = head.slice(0, length);
      const match = TRIANGLE_VALUE.exec(candidate);
      if (match === null || match[0].length !== length) continue;
      walk(at + length, [...cells, { text: candidate, start: at, end: at + length }]);
    }
  };
  walk(from, []);
  return cuts.length === 1 ? cuts[0]! : null;
}

/** Where a row's label ends: after its last letter (or closing bracket); -1 when it has no letter. */
function labelEnd(text: string): number {
  for (let at = text.length - 1; at >= 0; at--) {
    if (/[A-Za-z\u00c0-\u024f)]/.test(text[at]!)) return at + 1;
  }
  return -1;
}

/**
 * The column numbers 1..k, run together ("1234567891011") or apart by spaces ("1 2 3"), after an optional
 * word, and maybe one more column named after them ("1 2 … 9 PHQ-9 Total"): their spans and that name; or null.
 */
function numberedHeader(line: Line): { spans: CellSpan[]; extra: GluedCell | null } | null {
  const text = line.text.trimEnd();
  const firstDigit = text.search(/\d/);
  if (firstDigit < 0 || firstDigit > 24 || !/^[A-Za-z ]*$/.test(text.slice(0, firstDigit))) return null;
  const spans: CellSpan[] = [];
  let at = firstDigit;
  let expected = 1;
  while (at < text.length && expected <= MAX_COLUMNS) {
    if (text[at] === ' ') {
      at++;
      continue;
    }
    const written = String(expected);
    if (!text.startsWith(written, at)) break;
    spans.push({ start: line.start + at, end: line.start + at + written.length });
    at += written.length;
    expected++;
  }
  if (spans.length < MIN_ROWS) return null;
  if (at >= text.length) return { spans, extra: null };
  // One more column named after the numbers, set apart by a space.
  const rest = text.slice(at);
  const name = rest.trim();
  if (text[at - 1] !== ' ' && rest[0] !== ' ') return null;
  if (name.length > 30 || !/[A-Za-z]/.test(name)) return null;
  const nameAt = at + rest.indexOf(name);
  return { spans, extra: { text: name, start: line.start + nameAt, end: line.start + nameAt + name.length } };
}

/**
 * A row's variable and where its label ends: a number before the name ("1. Anxiety", "2Employment"), a number
 * after it ("Item 3"), or the name of the column after the numbered ones ("PHQ-9 Total"); null otherwise.
 */
function rowLabel(text: string, extra: GluedCell | null, columns: number): { number: number; name: string; nameStart: number; nameEnd: number } | null {
  const leading = /^(\s*)\(?(\d{1,2})[.)]?\s?(?=[A-Za-z\u00c0-\u024f])/.exec(text);
  if (leading !== null) {
    const end = labelEnd(text);
    if (end < 0) return null;
    return { number: Number(leading[2]), name: text.slice(leading[0].length, end).trim(), nameStart: leading[1]!.length, nameEnd: end };
  }
  const nameStart = text.length - text.trimStart().length;
  if (extra !== null && text.startsWith(extra.text, nameStart) && !/[A-Za-z\d]/.test(text[nameStart + extra.text.length] ?? '')) {
    return { number: columns + 1, name: extra.text, nameStart, nameEnd: nameStart + extra.text.length };
  }
  // "Item 3 0.476** 0.484** --": a word, a space and the variable's number.
  const firstDigit = text.search(/\d/);
  if (firstDigit < 2 || text[firstDigit - 1] !== ' ' || !/[A-Za-z]/.test(text.slice(nameStart, firstDigit))) return null;
  const number = /^\d{1,2}(?=\s|$)/.exec(text.slice(firstDigit));
  if (number === null) return null;
  const nameEnd = firstDigit + number[0].length;
  return { number: Number(number[0]), name: text.slice(nameStart, nameEnd), nameStart, nameEnd };
}

/** Most lines a wrapped caption goes on over after its first. */
const MAX_WRAPPED_CAPTION_LINES = 2;

/** A numbered matrix of run-together cells after the title at `lines[titleLine]`, or null. */
export function readGluedMatrix(lines: Line[], titleLine: number): { table: DocumentTable; lastLine: number } | null {
  const title = lines[titleLine];
  if (title === undefined || !TABLE_TITLE.test(title.text)) return null;
  // The caption: the title's line, and for a bare title ("Table 3") the next line of text.
  let index = titleLine + 1;
  while (index < lines.length && lines[index]!.text.trim() === '') index++;
  const captionLine = BARE_TABLE_TITLE.test(title.text) ? lines[index] : undefined;
  const captionParts = [title.text.trim(), captionLine?.text.trim() ?? ''].filter((part) => part !== '');
  if (captionLine !== undefined) index++;
  // (A caption a page wrapped goes on in the lines right under it that start in small letters.)
  for (let more = 0; captionLine !== undefined && more < MAX_WRAPPED_CAPTION_LINES && index < lines.length && /^\p{Ll}/u.test(lines[index]!.text.trim()); more++) {
    captionParts.push(lines[index]!.text.trim());
    index++;
  }
  const caption = captionParts.join(' ');
  if (!SAYS_CORRELATIONS.test(caption) || OTHER_CORRELATIONS.test(caption)) return null;
  // The header: the first line of run-together column numbers.
  let numbered: { spans: CellSpan[]; extra: GluedCell | null } | null = null;
  const limit = Math.min(lines.length, titleLine + MAX_LINES);
  const afterCaption = index;
  for (; index < limit && numbered === null; index++) numbered = numberedHeader(lines[index]!);
  if (numbered === null) return readNamedGrid(lines, afterCaption, limit, title, caption);
  const header = numbered.extra === null ? numbered.spans : [...numbered.spans, { start: numbered.extra.start, end: numbered.extra.end }];
  const columns = header.length;
  // The rows: numbered labels and their runs; section lines between them are skipped.
  const candidates: { line: Line; number: number; name: string; nameStart: number; nameEnd: number; runAt: number }[] = [];
  let blanks = 0;
  let lastLine = index - 1;
  // (A lower triangle without its diagonal has one row more than it has columns.)
  for (; index < limit && candidates.length <= columns; index++) {
    const line = lines[index]!;
    const text = line.text;
    if (text.trim() === '') {
      if (++blanks > MAX_BLANKS) break;
      continue;
    }
    blanks = 0;
    if (text.length > MAX_ROW_LENGTH || NOTE_LINE.test(text) || TABLE_TITLE.test(text)) break;
    const label = rowLabel(text, numbered.extra, numbered.spans.length);
    if (label === null) continue;
    candidates.push({ line, ...label, runAt: label.nameEnd });
    lastLine = index;
  }
  // The number of decimals with which the most rows cut cleanly; or, where the first row prints the diagonal,
  // each row k cut into k − 1 correlations and the diagonal (whatever their decimals).
  let best: { decimals: number; rows: (GluedCell[] | null)[]; clean: number } | null = null;
  const diagonalPrinted = candidates.length > 0 && candidates[0]!.number === 1 && DIAGONAL_RUN.test(candidates[0]!.line.text.slice(candidates[0]!.runAt));
  if (diagonalPrinted) {
    const rows = candidates.map((candidate) => cutTriangleRow(candidate.line.text, candidate.runAt, candidate.number, columns));
    best = { decimals: 0, rows, clean: rows.filter((row) => row !== null && row.length > 0).length };
  } else {
    for (const decimals of [2, 3]) {
      const rows = candidates.map((candidate) => cutRow(candidate.line.text, candidate.runAt, decimals));
      const clean = rows.filter((row) => row !== null && row.length > 0).length;
      if (best === null || clean > best.clean) best = { decimals, rows, clean };
    }
  }
  if (best === null || best.clean < MIN_ROWS) return null;
  const rows: string[][] = [['', ...header.map((_, column) => String(column + 1))]];
  const cells: (CellSpan | null)[][] = [[null, ...header]];
  candidates.forEach((candidate, row) => {
    const cut = best.rows[row];
    if (cut === null || cut === undefined) return;
    const start = candidate.line.start;
    rows.push([`${candidate.number}. ${candidate.name}`, ...cut.map((cell) => cell.text)]);
    cells.push([{ start: start + candidate.nameStart, end: start + candidate.nameEnd }, ...cut.map((cell) => ({ start: start + cell.start, end: start + cell.end }))]);
  });
  return matrixTable(title, lines[lastLine]!, lastLine, caption, rows, cells);
}

/** The rebuilt table from its title's line to its last row's line, one header row. */
function matrixTable(title: Line, last: Line, lastLine: number, caption: string, rows: string[][], cells: (CellSpan | null)[][]): { table: DocumentTable; lastLine: number } {
  return { table: tableOverLines(title, last, caption, rows, cells, 'crushed'), lastLine };
}

/**
 * Names run together without spaces ("MotivationRehearsalOrganizationCritical thinking"), cut where a lower-case
 * letter meets a capital: the names and their spans, or null for fewer than two.
 */
function camelNames(line: Line): GluedCell[] | null {
  const text = line.text;
  if (/\d/.test(text) || text.trim() === '') return null;
  const names: GluedCell[] = [];
  let start = text.length - text.trimStart().length;
  for (let at = start + 1; at <= text.length; at++) {
    const boundary = at === text.length || (/[a-z)]/.test(text[at - 1]!) && /[A-Z]/.test(text[at]!));
    if (!boundary) continue;
    const name = text.slice(start, at).trim();
    if (name !== '') names.push({ text: name, start: line.start + start, end: line.start + start + text.slice(start, at).trimEnd().length });
    start = at;
  }
  return names.length >= 2 ? names : null;
}

/**
 * A correlation table whose columns are named by the variables (no numbers), cells and header names run
 * together: "MotivationRehearsalOrganization…" over "Intrinsic.307.261.118…". The rows are the lines that cut
 * cleanly into a label and at least two correlations; the header is the nearest line of names run together
 * before them that names as many columns as the rows hold values (or one more, the label column's name).
 */
function readNamedGrid(lines: Line[], from: number, limit: number, title: Line, caption: string): { table: DocumentTable; lastLine: number } | null {
  let first = -1;
  let decimals = 0;
  for (let index = from; index < limit && first < 0; index++) {
    const text = lines[index]!.text;
    if (text.length > MAX_ROW_LENGTH || NOTE_LINE.test(text)) return null;
    const end = labelEnd(text);
    if (end <= 0 || !/\d/.test(text.slice(end))) continue;
    for (const places of [2, 3]) {
      const cut = cutRow(text, end, places);
      if (cut !== null && cut.length >= 2) {
        first = index;
        decimals = places;
        break;
      }
    }
  }
  if (first < 0) return null;
  const rows: string[][] = [];
  const cells: (CellSpan | null)[][] = [];
  let lastLine = first;
  let width = 0;
  let blanks = 0;
  for (let index = first; index < limit; index++) {
    const line = lines[index]!;
    if (line.text.trim() === '') {
      if (++blanks > MAX_BLANKS) break;
      continue;
    }
    blanks = 0;
    const end = labelEnd(line.text);
    const cut = end > 0 ? cutRow(line.text, end, decimals) : null;
    if (cut === null || cut.length < 2 || line.text.length > MAX_ROW_LENGTH) break;
    if (width === 0) width = cut.length;
    if (cut.length !== width) break;
    const labelStart = line.text.length - line.text.trimStart().length;
    rows.push([line.text.slice(labelStart, end).trim(), ...cut.map((cell) => cell.text)]);
    cells.push([{ start: line.start + labelStart, end: line.start + end }, ...cut.map((cell) => ({ start: line.start + cell.start, end: line.start + cell.end }))]);
    lastLine = index;
  }
  if (rows.length < MIN_ROWS) return null;
  let header: GluedCell[] | null = null;
  for (let index = first - 1; index >= from && header === null; index--) {
    const names = camelNames(lines[index]!);
    if (names !== null && (names.length === width || names.length === width + 1)) header = names.length === width ? names : names.slice(1);
  }
  if (header === null) return null;
  const headerCells = header.map((name): CellSpan => ({ start: name.start, end: name.end }));
  return matrixTable(title, lines[lastLine]!, lastLine, caption, [['', ...header.map((name) => name.text)], ...rows], [[null, ...headerCells], ...cells]);
}
