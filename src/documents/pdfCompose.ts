/**
 * A PDF page's text with its rebuilt tables in it: the engine's text stays
 * as it was (prose, its line breaks, de-hyphenation) except for the lines
 * that held a table's words, which are replaced by the table written as one
 * line per row, cells joined by " | " (as the HTML and DOCX readers write
 * tables), with its caption line above and its notes below. Every cell's
 * offsets are recorded while the table is written.
 */

import type { CellSpan } from './types.js';
import { CELL_SEPARATOR, collapseWhitespace } from './tables.js';
import { findPageTables, type LayoutTable } from './pdfLayout.js';
import type { LocatedWord } from './pdfWords.js';
import { dehyphenate } from './pdfText.js';

/** A table written into a page's text; offsets are from the start of the page. */
export interface PageTable {
  start: number;
  end: number;
  caption: string | null;
  /** The caption line [start, end), when there is a caption. */
  captionSpan: CellSpan | null;
  /** Rows and notes [start, end). */
  bodySpan: CellSpan;
  notes: string[];
  rows: string[][];
  headerRows: number;
  spans: number[][];
  cells: (CellSpan | null)[][];
}

export interface ComposedPage {
  text: string;
  tables: PageTable[];
}

/** Offsets of the starts of the lines of `text`. */
function lineStarts(text: string): number[] {
  const starts = [0];
  for (let at = text.indexOf('\n'); at !== -1; at = text.indexOf('\n', at + 1)) starts.push(at + 1);
  return starts;
}

/** Index of the line holding `offset` (binary search). */
function lineOf(starts: readonly number[], offset: number): number {
  let low = 0;
  let high = starts.length - 1;
  while (low < high) {
    const middle = (low + high + 1) >> 1;
    if (starts[middle]! <= offset) low = middle;
    else high = middle - 1;
  }
  return low;
}

type Part = { prose: string } | { table: LayoutTable };

/**
 * A number standing alone as a table cell holds it: "4.21", ".018", "12", "<.001", "-0.75", "(3.73)". The
 * brackets come in pairs: a number with only a closing one ends a bracket of running text ("(M = 3.63,
 * SD = 1.11, n = 36)", "χ2(1, N = 143)"), which result-dense prose holds on every page.
 */
const CELL_NUMBER = /^(?:\([<>\u2264\u2265]?[-\u2212\u2013]?(?:\d+(?:[.,]\d+)?|[.,]\d+)\)|[<>\u2264\u2265]?[-\u2212\u2013]?(?:\d+(?:[.,]\d+)?|[.,]\d+))$/u;
const TABLE_WORD = /^(?:Table|TABLE)$/;
const TABLE_NUMBER = /^[A-Z]{0,2}\d+[A-Za-z]?[.:]?$/;
/** Numbers standing alone as cells that make a page worth a look for tables. */
const MIN_CELL_NUMBERS = 6;

/**
 * The numbers standing alone on one line that look like table cells: two or more making at least a third
 * of the line's words (a row: "Condition 11.87 1 11.87 6.49 .012"), or one that is the whole line (a table
 * the PDF draws column by column, one cell per line). Numbers among the words of prose ("block 6 on
 * accuracy", "aged 18 to 65 took part in 2 sessions") are not counted.
 */
function cellNumbersOnLine(tokens: readonly string[]): number {
  let numbers = 0;
  for (const token of tokens) if (CELL_NUMBER.test(token)) numbers += 1;
  return (numbers >= 2 && numbers * 3 >= tokens.length) || (numbers === 1 && tokens.length === 1) ? numbers : 0;
}

/**
 * Whether a page's text may hold a table: it names one ("Table 2") or holds
 * at least six numbers standing alone as table cells do, in rows or one to a
 * line (a number in running text mostly carries a comma or a bracket, or
 * stands alone among words). A page without either is read as before without
 * looking at its words; the test reads whitespace-separated words line by
 * line, which both engines give alike.
 */
export function mayHoldTable(text: string): boolean {
  let numbers = 0;
  let previous = '';
  for (const line of text.split('\n')) {
    const tokens = line.split(/\s+/).filter((token) => token !== '');
    for (const token of tokens) {
      if (TABLE_WORD.test(previous) && TABLE_NUMBER.test(token)) return true;
      previous = token;
    }
    numbers += cellNumbersOnLine(tokens);
    if (numbers >= MIN_CELL_NUMBERS) return true;
  }
  return false;
}

/**
 * Rebuilds the tables of one page and writes them into its text. `text` is
 * the page as the engine read it from offset `base` on (page furniture cut
 * away), `words` its words in text order, tied to their letters by offsets
 * counted from `base`'s origin (null when the words could not be tied: the
 * page is read as before). Prose is de-hyphenated as before; tables are not.
 */
export function composePage(text: string, words: readonly LocatedWord[] | null, base = 0): ComposedPage {
  const tables = words === null || words.length === 0 || !mayHoldTable(text) ? [] : findPageTables(words);
  if (tables.length === 0) return { text: dehyphenate(text), tables: [] };
  const located = words!;
  const starts = lineStarts(text);
  const lineEnd = (line: number): number => (line + 1 < starts.length ? starts[line + 1]! - 1 : text.length);
  const parts: Part[] = [];
  let cursor = 0;
  let nextLine = 0;
  const ordered = tables.map((table) => ({ table, ...extentOf(table, located, base) })).sort((a, b) => a.start - b.start);
  for (const { table, start, end } of ordered) {
    const firstLine = lineOf(starts, start);
    const lastLine = lineOf(starts, end - 1);
    if (firstLine < nextLine) continue; // drawn among the lines of the table before: left as text
    // Words between the table's first and last letters that are not the table's (drawn in between) stay as prose, above it.
    const own = new Set(table.words);
    const stray: string[] = [];
    let strayLine = -1;
    for (let index = firstWordAt(located, starts[firstLine]! + base); index < located.length && located[index]!.start - base < lineEnd(lastLine); index++) {
      if (own.has(index)) continue;
      const line = lineOf(starts, located[index]!.start - base);
      if (line === strayLine) stray[stray.length - 1] += ` ${located[index]!.text}`;
      else stray.push(located[index]!.text);
      strayLine = line;
    }
    parts.push({ prose: text.slice(cursor, starts[firstLine]!) + stray.map((line) => `${line}\n`).join('') });
    parts.push({ table });
    cursor = Math.min(text.length, lineEnd(lastLine) + 1);
    nextLine = lastLine + 1;
  }
  parts.push({ prose: text.slice(cursor) });
  return writeParts(parts);
}

/** Where a table's words start and end in the text. */
function extentOf(table: LayoutTable, words: readonly LocatedWord[], base: number): { start: number; end: number } {
  let start = Infinity;
  let end = -Infinity;
  for (const index of table.words) {
    start = Math.min(start, words[index]!.start - base);
    end = Math.max(end, words[index]!.end - base);
  }
  return { start, end };
}

/** First word whose text starts at or after `offset` (words are in text order). */
function firstWordAt(words: readonly LocatedWord[], offset: number): number {
  let low = 0;
  let high = words.length;
  while (low < high) {
    const middle = (low + high) >> 1;
    if (words[middle]!.start < offset) low = middle + 1;
    else high = middle;
  }
  return low;
}

function writeParts(parts: readonly Part[]): ComposedPage {
  let text = '';
  const tables: PageTable[] = [];
  for (const part of parts) {
    if ('prose' in part) {
      const prose = dehyphenate(part.prose).replace(/\n$/, '');
      if (prose.trim() === '') continue;
      text += text === '' ? prose : `\n${prose}`;
      continue;
    }
    if (text !== '') text += '\n';
    const written = writeTable(part.table, text.length);
    text += written.text;
    tables.push(written.table);
  }
  return { text, tables };
}

/** Writes a table as lines (caption, rows with cells joined by " | ", notes), with the offsets of everything, from `offset` on. */
export function writeTable(table: LayoutTable, offset: number): { text: string; table: PageTable } {
  const lines: string[] = [];
  let at = offset;
  const caption = table.caption === null ? null : collapseWhitespace(table.caption) || null;
  let captionSpan: CellSpan | null = null;
  if (caption !== null) {
    captionSpan = { start: at, end: at + caption.length };
    lines.push(caption);
    at += caption.length + 1;
  }
  const bodyStart = at;
  const rows = table.rows.map((row) => row.map(collapseWhitespace));
  const cells: (CellSpan | null)[][] = [];
  for (const row of rows) {
    const spans: (CellSpan | null)[] = [];
    row.forEach((cell, index) => {
      if (index > 0) at += CELL_SEPARATOR.length;
      spans.push(cell === '' ? null : { start: at, end: at + cell.length });
      at += cell.length;
    });
    cells.push(spans);
    lines.push(row.join(CELL_SEPARATOR));
    at += 1;
  }
  const notes = table.notes.map(collapseWhitespace).filter((note) => note !== '');
  for (const note of notes) {
    lines.push(note);
    at += note.length + 1;
  }
  const written = lines.join('\n');
  const end = offset + written.length;
  return {
    text: written,
    table: { start: offset, end, caption, captionSpan, bodySpan: { start: bodyStart, end }, notes, rows, headerRows: table.headerRows, spans: table.spans.map((row) => [...row]), cells },
  };
}
