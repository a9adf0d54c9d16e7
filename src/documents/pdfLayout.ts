/**
 * Tables rebuilt from the positions of the words on a PDF page.
 *
 * Input: the words of one page, each with its box (left, right, top, bottom
 * in points, y growing downwards) and listed in drawing order (the order of
 * the page's content stream, which both PDF engines keep). Output: the
 * tables found on the page, as rows of cell texts with their header rows,
 * spans, caption and notes, and the words each table took. Nothing here
 * knows which engine read the page: poppler's word boxes and pdf.js's text
 * items give the same tables.
 *
 * The steps, each a small function below:
 *
 * 1. Lines: words whose boxes overlap vertically by at least half the
 *    smaller height form a line (a raised or lowered index, "ηp2", stays on
 *    its line).
 * 2. Pieces: a line is cut where drawing order jumps: on a two-column page
 *    a line of the left column and the line beside it in the right column
 *    were drawn many words apart (or, in short columns, a few words apart
 *    across a gap as wide as a gutter), while the cells of a table row are
 *    drawn one after the other. Pieces are then taken in drawing order,
 *    which is reading order, so the lines of one column follow each other.
 * 3. Cells: a piece is cut into cells at gaps wider than a word space.
 * 4. Regions: a table starts at a row with at least two numbers after its
 *    label (and no more words than numbers: a justified line of running
 *    text has wide gaps too) and goes on, line after line near it, while
 *    lines hold numbers (or are short labels: group headings, wrapped
 *    labels); it needs two such rows and three columns. Above it, up to a
 *    "Table N" caption (or, without one, up to prose or a wide gap), are its
 *    header lines and the caption's title lines (as large as the caption
 *    and aligned with it); below it, a "Note." (or "*p <", or a footnote
 *    letter) line starts the notes, which run on at their own line spacing.
 * 5. Columns: from the rows with numbers only, the x ranges that no cell
 *    covers are the gaps between columns (a header cell spanning several
 *    columns is left out, so it cannot close a gap). Rows whose cells do not
 *    fall one to a column are not a table (lines of text that happen to
 *    hold numbers do not line up).
 * 6. Header: each header line's cells are put over the columns they cover;
 *    a cell over several columns spans them, and a line above takes the
 *    columns of the cells it stands over ("Within-group difference" over
 *    "Cohen d | t test (df) | P value"). A header cell that wraps onto a
 *    second line close below ("F" / "value") is joined into one cell.
 * 7. Body: a line with text only in the label column is the continuation of
 *    the row above when it follows as closely as lines inside a cell do
 *    (closer than rows follow rows) or, in tables without space between
 *    rows, when it cannot be a new label (it starts in lower case, the label
 *    above ends open, or its first word would not have fitted on the line
 *    above); otherwise it is a group heading row of its own. A line of
 *    numbers without a label takes the label line just above it (labels set
 *    in the middle of a two-line cell).
 *
 * Work stays bounded: words are sorted once per page, every later step
 * walks lines, pieces or cells once (look-ups are binary searches or
 * windows of fixed size), and a region with more than MAX_COLUMNS columns
 * is not a table.
 */

import { dehyphenate } from './pdfText.js';
import { appendAll } from '../arrays.js';

/** One word on a page (points, y downwards), in drawing order. */
export interface PageWord {
  text: string;
  x0: number;
  x1: number;
  top: number;
  bottom: number;
  /**
   * True when the next word of the list follows this one after a plain space
   * inside the same text run (pdf.js gives runs of several words, cut into
   * words by estimate): the two stay in one cell whatever the estimated gap.
   */
  spaceAfter?: boolean;
}

/** A table found on a page. */
export interface LayoutTable {
  caption: string | null;
  notes: string[];
  /** Header rows first, then body rows; every row has one cell per column. */
  rows: string[][];
  headerRows: number;
  /** Columns each cell spans: n >= 1 on a spanning cell's first column, 0 on the columns it covers. */
  spans: number[][];
  /** Every word the table took (caption, cells, notes), as indices into the page's words, ascending. */
  words: number[];
}

// ------------------------------------------------------------ constants

/** Words share a line when their boxes overlap by this share of the smaller height. */
const LINE_OVERLAP = 0.5;
/** A line is cut where drawing order jumps by more than this many words. */
const MAX_ORDER_JUMP = 24;
/** ...or, after a gap this wide (times the line height), where text follows that was not drawn right after the word before. */
const GUTTER_GAP = 1.0;
/** A gap wider than this (times the line height) separates cells. */
const CELL_GAP = 0.4;
/** Words closer than this (times the line height) are joined without a space ("η" "p" "2"). */
const NO_SPACE_GAP = 0.08;
/** Largest vertical gap between two lines of one table (times the line height). */
const MAX_ROW_GAP = 2.2;
/** Largest vertical gap between header lines, or between the header and the body, without a caption (times the line height). */
const MAX_HEADER_GAP = 1.5;
/** Caption lines follow each other at most this far apart (times the line height). */
const MAX_CAPTION_LINE_GAP = 1.0;
/** Note lines of one paragraph follow each other at most this far apart (times the line height). */
const MAX_NOTE_LINE_GAP = 0.8;
/** Gap between the lines of a note paragraph taken when no two of its lines show it (times the line height). */
const NOTE_LINE_GAP = 0.35;
/** Header lines this close (times the line height) may be one wrapped header line. */
const HEADER_WRAP_GAP = 0.35;
const MAX_HEADER_LINES = 8;
const MAX_CAPTION_LINES = 5;
const MAX_NOTE_LINES = 24;
/** Label-only lines in a row inside the body before the next row with numbers. */
const MAX_LABEL_LINES = 4;
const MIN_COLUMNS = 3;
const MAX_COLUMNS = 64;
const MIN_VALUE_ROWS = 2;
/** Cells longer than this are text, never numbers. */
const MAX_NUMBER_CELL = 60;

// ---------------------------------------------------------------- lines

export interface Line {
  /** Word indices, in no particular order. */
  words: number[];
  top: number;
  bottom: number;
}

/** A word with a finite box and a visible character. */
function validWord(word: PageWord): boolean {
  if (!(word.x1 >= word.x0 && word.bottom > word.top && Number.isFinite(word.x0 + word.x1 + word.top + word.bottom))) return false;
  const text = word.text;
  for (let index = 0; index < text.length; index++) {
    const code = text.charCodeAt(index);
    if (code > 32 && code !== 0xa0) return true;
  }
  return false;
}

/**
 * Groups words into lines: sorted by their vertical centres, a word joins the
 * current line when its box overlaps the line's tallest box by at least half
 * the smaller height; otherwise it starts the next line.
 */
export function groupLines(words: readonly PageWord[]): Line[] {
  const order: number[] = [];
  const centres = new Float64Array(words.length);
  for (let index = 0; index < words.length; index++) {
    const word = words[index]!;
    if (!validWord(word)) continue;
    order.push(index);
    centres[index] = (word.top + word.bottom) / 2;
  }
  order.sort((a, b) => centres[a]! - centres[b]! || words[a]!.x0 - words[b]!.x0);
  const lines: Line[] = [];
  let current: Line | null = null;
  for (const index of order) {
    const word = words[index]!;
    const height = word.bottom - word.top;
    if (current !== null) {
      const coreHeight = current.bottom - current.top;
      const overlap = Math.min(word.bottom, current.bottom) - Math.max(word.top, current.top);
      if (overlap >= LINE_OVERLAP * Math.min(height, coreHeight)) {
        current.words.push(index);
        if (height > coreHeight) {
          current.top = word.top;
          current.bottom = word.bottom;
        }
        continue;
      }
    }
    current = { words: [index], top: word.top, bottom: word.bottom };
    lines.push(current);
  }
  return lines;
}

// --------------------------------------------------------------- pieces

export interface Cell {
  x0: number;
  x1: number;
  text: string;
  /** Word indices, left to right. */
  words: number[];
}

export interface Piece {
  /** Word indices, left to right. */
  words: number[];
  x0: number;
  x1: number;
  top: number;
  bottom: number;
  /** Height of the piece's tallest box: the unit of every gap. */
  height: number;
  /** Smallest word index: where the piece stands in drawing order. */
  first: number;
  cells: Cell[];
  text: string;
}

/**
 * Cuts a line into pieces, each left to right: where drawing order jumps by
 * more than MAX_ORDER_JUMP words (a line of each column of a two-column
 * page), and where, after a gap as wide as a column gutter, text follows that
 * was not drawn right after the word before it (short columns, whose lines
 * are drawn only a few words apart). Cells of a table row are drawn one after
 * the other; a row whose label wraps onto a second line jumps only over the
 * rest of its label, and numbers after it are never cut off.
 */
export function splitLine(line: Line, words: readonly PageWord[]): Piece[] {
  const byOrder = [...line.words].sort((a, b) => a - b);
  const pieces: Piece[] = [];
  let start = 0;
  for (let index = 1; index <= byOrder.length; index++) {
    if (index < byOrder.length && byOrder[index]! - byOrder[index - 1]! <= MAX_ORDER_JUMP) continue;
    appendAll(pieces, splitAtGaps(byOrder.slice(start, index), words));
    start = index;
  }
  return pieces;
}

function splitAtGaps(indices: number[], words: readonly PageWord[]): Piece[] {
  const piece = makePiece(indices, words);
  const cuts: number[] = [];
  for (let at = 1; at < piece.words.length; at++) {
    const before = piece.words[at - 1]!;
    const after = piece.words[at]!;
    const gap = words[after]!.x0 - words[before]!.x1;
    if (Math.abs(after - before) > 1 && gap >= GUTTER_GAP * piece.height && !isNumberish(words[after]!.text)) cuts.push(at);
  }
  if (cuts.length === 0) return [piece];
  const pieces: Piece[] = [];
  let from = 0;
  for (const cut of [...cuts, piece.words.length]) {
    pieces.push(makePiece(piece.words.slice(from, cut), words));
    from = cut;
  }
  return pieces;
}

function makePiece(indices: number[], words: readonly PageWord[]): Piece {
  const sorted = indices.sort((a, b) => words[a]!.x0 - words[b]!.x0 || a - b);
  let x0 = Infinity;
  let x1 = -Infinity;
  let top = Infinity;
  let bottom = -Infinity;
  let first = Infinity;
  let height = 0;
  for (const index of sorted) {
    const word = words[index]!;
    height = Math.max(height, word.bottom - word.top);
    x0 = Math.min(x0, word.x0);
    x1 = Math.max(x1, word.x1);
    top = Math.min(top, word.top);
    bottom = Math.max(bottom, word.bottom);
    first = Math.min(first, index);
  }
  const cells = cutCells(sorted, height, words);
  return { words: sorted, x0, x1, top, bottom, height, first, cells, text: cells.map((cell) => cell.text).join(' ') };
}

/** Cuts a piece's words (left to right) into cells at gaps wider than CELL_GAP line heights. */
export function cutCells(sorted: readonly number[], height: number, words: readonly PageWord[]): Cell[] {
  const cells: Cell[] = [];
  let current: Cell | null = null;
  let previous = -1;
  for (const index of sorted) {
    const word = words[index]!;
    const text = wordText(word);
    if (current !== null) {
      const gap = word.x0 - current.x1;
      const sameRun = words[previous]!.spaceAfter === true && index === previous + 1;
      if (sameRun || gap < CELL_GAP * height) {
        current.text += sameRun || gap >= NO_SPACE_GAP * height ? ` ${text}` : text;
        current.x1 = Math.max(current.x1, word.x1);
        current.words.push(index);
        previous = index;
        continue;
      }
    }
    current = { x0: word.x0, x1: word.x1, text, words: [index] };
    cells.push(current);
    previous = index;
  }
  return cells;
}

/** A word's text without soft hyphens (poppler keeps them inside words, pdf.js drops them). */
function wordText(word: PageWord): string {
  const text = word.text.trim();
  return text.includes('\u00ad') ? text.replace(/\u00ad/g, '') : text;
}

/** The page's pieces in drawing order. */
export function pagePieces(words: readonly PageWord[]): Piece[] {
  return groupLines(words)
    .flatMap((line) => splitLine(line, words))
    .sort((a, b) => a.first - b.first);
}

// ----------------------------------------------------- what a piece says

/** "Table 3", "Table 3.", "TABLE S2: ...", "Table 4 Effects of ..." (not "Table 2 gives ...", a sentence that names a table). */
const CAPTION = /^(?:Table|TABLE)\s+(?:[A-Z]{0,2}\d+[A-Za-z]?|[IVXLC]{1,6})(?![\p{L}\p{N}])(?:\s*[.:|\u2013\u2014-]|\s*$|\s+[\p{Lu}(\d])/u;
const NOTE_START = /^(?:[Nn]otes?|NOTES?|[Ss]ources?|SOURCES?|[Aa]bbreviations?)\s*[.:]|^[*\u2020\u2021\u00a7\u00b6#]/u;
const VALUE_MARKER = /^(?:n\.?\s?s\.?|N\/?A|NA|[\u2014\u2013\u2012\u2212-]{1,2}|\.\.\.|\u2026)$/iu;
const STANDALONE_NUMBER = /(?:^|[^\p{L}\p{N}])[-\u2212\u2013+]?(?:\d+(?:[.,]\d+)*|[.,]\d+)(?![\p{L}\p{N}])/u;

/** A cell that holds a number (with signs, brackets, a comparator, stars or a footnote letter), or a value marker ("—", "n.s.", "N/A"). */
export function isNumberish(text: string): boolean {
  const trimmed = text.trim();
  if (trimmed.length === 0 || trimmed.length > MAX_NUMBER_CELL) return false;
  if (VALUE_MARKER.test(trimmed)) return true;
  if (!STANDALONE_NUMBER.test(trimmed)) return false;
  let letters = 0;
  for (const character of trimmed) if (/\p{L}/u.test(character)) letters++;
  return letters <= 2 + 0.3 * trimmed.length;
}

function isCaption(piece: Piece): boolean {
  return CAPTION.test(piece.text);
}

function isNoteStart(piece: Piece, words: readonly PageWord[]): boolean {
  if (NOTE_START.test(piece.text)) return true;
  // A footnote letter or digit set small and raised before the note's text ("a Statistics reported ...").
  const first = words[piece.words[0]!]!;
  const firstText = first.text.trim();
  return piece.words.length > 1 && /^[a-z\d]$/u.test(firstText) && first.bottom - first.top < 0.85 * piece.height && first.bottom < piece.bottom - 0.1 * piece.height;
}

/** Number cells after the first cell. */
function valueCount(piece: Piece): number {
  let count = 0;
  for (let index = 1; index < piece.cells.length; index++) if (isNumberish(piece.cells[index]!.text)) count++;
  return count;
}

/** Significance stars, daggers or a lone footnote letter: a cell of marks, neither number nor text. */
const MARKS = /^(?:[*\u2020\u2021#]{1,4}|[a-h])$/u;

/** Text cells after the first cell (not numbers, not marks). */
function textCount(piece: Piece): number {
  let count = 0;
  for (let index = 1; index < piece.cells.length; index++) {
    const text = piece.cells[index]!.text;
    if (!isNumberish(text) && !MARKS.test(text)) count++;
  }
  return count;
}

function numberCount(piece: Piece): number {
  let count = 0;
  for (const cell of piece.cells) if (isNumberish(cell.text)) count++;
  return count;
}

/** Running text: one cell of many words. */
function isProse(piece: Piece): boolean {
  return piece.cells.length === 1 && piece.words.length >= 7;
}

const gapBetween = (upper: Piece, lower: Piece): number => lower.top - upper.bottom;
/** `lower` starts below `upper`'s middle. */
const isBelow = (upper: Piece, lower: Piece): boolean => lower.top + lower.bottom > upper.top + upper.bottom + 0.6 * Math.min(upper.height, lower.height);
const overlapsX = (piece: Piece, x0: number, x1: number): boolean => piece.x0 < x1 && piece.x1 > x0;

// -------------------------------------------------------------- regions

interface Region {
  captionLines: Piece[];
  headerLines: Piece[];
  /** Body lines top to bottom: rows with numbers and label lines (those after the last row only if they continue its label). */
  bodyLines: Piece[];
  noteLines: Piece[];
  /** Position of the last piece the region reached, in drawing order. */
  last: number;
}

/** The tables of a page. */
export function findPageTables(words: readonly PageWord[]): LayoutTable[] {
  const pieces = pagePieces(words);
  const tables: LayoutTable[] = [];
  let floor = 0;
  for (let index = 0; index < pieces.length; index++) {
    if (!isSeedRow(pieces[index]!)) continue;
    const region = growRegion(pieces, index, floor, words);
    if (region === null) continue;
    const table = buildTable(region, words);
    if (table !== null) tables.push(table);
    // A region that gives no table is not tried again from a later row: the walk stays linear.
    floor = region.last + 1;
    index = region.last;
  }
  return tables;
}

/**
 * A row that can start a table: three cells or more, two of them numbers
 * after the first, and no more text cells than number cells after the first
 * (a line of running text spread by justification into "cells" holds more
 * words and "=" signs than numbers).
 */
function isSeedRow(piece: Piece): boolean {
  const values = valueCount(piece);
  return piece.cells.length >= MIN_COLUMNS && values >= 2 && textCount(piece) <= values;
}

/** A line of a table body: a number after its first cell, and no more text cells than numbers after it. */
function isValueLine(piece: Piece): boolean {
  const values = valueCount(piece);
  return piece.cells.length >= 2 && values >= 1 && textCount(piece) <= values;
}

/**
 * Grows a table region from a row with numbers. Pieces are taken in drawing
 * order, but their vertical order may differ within the table (a cell
 * spanning two rows is drawn with the first and set lower), so a piece
 * belongs while it stands within reach of the region rather than strictly
 * below the previous one.
 */
function growRegion(pieces: readonly Piece[], seedIndex: number, floor: number, words: readonly PageWord[]): Region | null {
  const seed = pieces[seedIndex]!;
  const body: Piece[] = [seed];
  let x0 = seed.x0;
  let x1 = seed.x1;
  let top = seed.top;
  // Label lines start left of the first value cell of every row.
  let labelLimit = seed.cells[1]!.x0;
  let pending: Piece[] = [];
  let reach = seed.bottom;
  let last = seedIndex;
  for (let index = seedIndex + 1; index < pieces.length; index++) {
    const piece = pieces[index]!;
    if (piece.top < top - 0.5 * piece.height || piece.top - reach > MAX_ROW_GAP * piece.height) break;
    if (!overlapsX(piece, x0, x1) || piece.x0 < x0 - 2 * piece.height) break;
    if (isCaption(piece) || isNoteStart(piece, words)) break;
    if (isValueLine(piece)) {
      appendAll(body, pending).push(piece);
      pending = [];
      last = index;
      x0 = Math.min(x0, piece.x0);
      x1 = Math.max(x1, piece.x1);
      top = Math.min(top, piece.top);
      reach = Math.max(reach, piece.bottom);
      labelLimit = Math.min(labelLimit, piece.cells[1]!.x0);
      continue;
    }
    if (pending.length < MAX_LABEL_LINES && numberCount(piece) === 0 && piece.x0 < labelLimit && piece.words.length <= 12) {
      pending.push(piece);
      reach = Math.max(reach, piece.bottom);
      continue;
    }
    break;
  }
  if (body.filter((piece) => valueCount(piece) >= 2).length < MIN_VALUE_ROWS) return null;
  // Label lines after the last row: kept for now, dropped later unless they continue its label.
  const bodyLines = [...body, ...pending];
  last += pending.length;

  // Upwards in drawing order: the lines above the body within reach (header, the caption's title) up to the caption.
  const above: Piece[] = [];
  let caption: Piece | null = null;
  let highest = top;
  for (let index = seedIndex - 1; index >= floor && seedIndex - index <= MAX_HEADER_LINES + MAX_CAPTION_LINES; index--) {
    const piece = pieces[index]!;
    if (piece.bottom > top + 0.3 * piece.height || highest - piece.bottom > MAX_ROW_GAP * piece.height) break;
    if (!overlapsX(piece, x0, x1)) break;
    if (isCaption(piece)) {
      caption = piece;
      break;
    }
    if (isNoteStart(piece, words) || isSeedRow(piece)) break;
    above.push(piece);
    highest = Math.min(highest, piece.top);
  }
  above.sort((a, b) => a.top - b.top || a.first - b.first);

  const captionLines: Piece[] = [];
  let start = 0;
  if (caption !== null) {
    captionLines.push(caption);
    for (; start < above.length && captionLines.length < MAX_CAPTION_LINES; start++) {
      const piece = above[start]!;
      const previous = captionLines[captionLines.length - 1]!;
      const aligned =
        Math.abs(piece.x0 - caption.x0) <= piece.height || Math.abs((piece.x0 + piece.x1) / 2 - (caption.x0 + caption.x1) / 2) <= piece.height;
      const sameSize = Math.abs(piece.height - caption.height) <= 0.08 * caption.height;
      if (piece.cells.length !== 1 || numberCount(piece) > 0 || !aligned || !sameSize || gapBetween(previous, piece) > MAX_CAPTION_LINE_GAP * piece.height) break;
      captionLines.push(piece);
    }
  }
  let headerLines = above.slice(start);
  if (caption === null) {
    // Without a caption, a header line sits close to the line below it and is not running text: it has
    // several cells, or one cell over the value columns (a title spanning them).
    let keepFrom = headerLines.length;
    let lower = body.reduce((upper, piece) => (piece.top < upper.top ? piece : upper), seed);
    for (let index = headerLines.length - 1; index >= 0; index--) {
      const piece = headerLines[index]!;
      if (gapBetween(piece, lower) > MAX_HEADER_GAP * piece.height) break;
      if (piece.cells.length === 1 && (isProse(piece) || piece.x0 < labelLimit - 0.5 * piece.height)) break;
      keepFrom = index;
      lower = piece;
    }
    headerLines = headerLines.slice(keepFrom);
  }
  // Label lines under the last header line with a cell over the value columns are group headings of the body.
  let lastNaming = -1;
  headerLines.forEach((piece, index) => {
    if (piece.cells.some((cell) => cell.x1 > labelLimit)) lastNaming = index;
  });
  const leading = headerLines.slice(lastNaming + 1);
  headerLines = headerLines.slice(0, lastNaming + 1);
  if (headerLines.length > MAX_HEADER_LINES) return null;

  // Downwards: notes, starting right after the body.
  const noteLines: Piece[] = [];
  const bottom = bodyLines.reduce((lowest, piece) => (piece.bottom > lowest.bottom ? piece : lowest), seed);
  const firstNote = pieces[last + 1];
  if (
    firstNote !== undefined &&
    isNoteStart(firstNote, words) &&
    isBelow(bottom, firstNote) &&
    gapBetween(bottom, firstNote) <= MAX_ROW_GAP * firstNote.height &&
    overlapsX(firstNote, x0, x1)
  ) {
    noteLines.push(firstNote);
    // A note's lines follow at its own line spacing (the first gap between two of them, or a tight one); the
    // text after the notes starts after a wider gap or in another size.
    let lineGap: number | null = null;
    for (let index = last + 2; index < pieces.length && noteLines.length < MAX_NOTE_LINES; index++) {
      const piece = pieces[index]!;
      const previous = noteLines[noteLines.length - 1]!;
      if (!isBelow(previous, piece) || !overlapsX(piece, x0, x1) || isCaption(piece)) break;
      if (Math.abs(piece.height - firstNote.height) > 0.08 * firstNote.height) break;
      const gap = gapBetween(previous, piece) / piece.height;
      const startsNote = isNoteStart(piece, words);
      const limit = Math.min(MAX_NOTE_LINE_GAP, (lineGap ?? NOTE_LINE_GAP) + 0.15);
      if (gap > limit && !(startsNote && gap <= MAX_ROW_GAP)) break;
      if (!startsNote && lineGap === null) lineGap = gap;
      noteLines.push(piece);
    }
    last += noteLines.length;
  }
  const sortedBody = [...leading, ...bodyLines].sort((a, b) => a.top - b.top || a.first - b.first);
  return { captionLines, headerLines, bodyLines: sortedBody, noteLines, last };
}

// -------------------------------------------------------------- columns

export interface Column {
  x0: number;
  x1: number;
}

/**
 * Columns from the cells of the rows with numbers: the x ranges their cells
 * cover, merged where they overlap or touch; the ranges no cell covers are
 * the gaps between columns.
 */
export function findColumns(rows: readonly Piece[]): Column[] {
  const spans = rows.flatMap((row) => row.cells.map((cell) => ({ x0: cell.x0, x1: cell.x1 })));
  spans.sort((a, b) => a.x0 - b.x0);
  const columns: Column[] = [];
  for (const span of spans) {
    const last = columns[columns.length - 1];
    if (last !== undefined && span.x0 <= last.x1 + 0.05) last.x1 = Math.max(last.x1, span.x1);
    else columns.push({ ...span });
  }
  return columns;
}

/** Columns whose range overlaps [x0, x1] (binary search for the first, then a walk), or the nearest column when none does. */
export function columnsUnder(columns: readonly Column[], x0: number, x1: number): { first: number; last: number } {
  let low = 0;
  let high = columns.length;
  while (low < high) {
    const middle = (low + high) >> 1;
    if (columns[middle]!.x1 <= x0) low = middle + 1;
    else high = middle;
  }
  let last = low - 1;
  for (let index = low; index < columns.length && columns[index]!.x0 < x1; index++) last = index;
  if (last >= low) return { first: low, last };
  // In a gap: the nearer of the columns on either side.
  const centre = (x0 + x1) / 2;
  const before = low - 1;
  if (before < 0) return { first: 0, last: 0 };
  if (low >= columns.length) return { first: before, last: before };
  return centre - columns[before]!.x1 <= columns[low]!.x0 - centre ? { first: before, last: before } : { first: low, last: low };
}

// --------------------------------------------------------------- header

interface HeaderCell {
  x0: number;
  x1: number;
  text: string;
  first: number;
  last: number;
}

interface HeaderLine {
  top: number;
  bottom: number;
  height: number;
  cells: HeaderCell[];
}

function headerLineOf(piece: Piece, columns: readonly Column[]): HeaderLine {
  return {
    top: piece.top,
    bottom: piece.bottom,
    height: piece.height,
    cells: piece.cells.map((cell) => ({ x0: cell.x0, x1: cell.x1, text: cell.text, ...columnsUnder(columns, cell.x0, cell.x1) })),
  };
}

/**
 * Two header lines are one wrapped line when every cell of the line with
 * fewer cells has a cell over the same columns in the other ("F" over
 * "value", "Sum of" over "squares"), and no two of their cells overlap in
 * part.
 */
function wrapsInto(upper: HeaderLine, lower: HeaderLine): boolean {
  for (const a of upper.cells) {
    for (const b of lower.cells) {
      const disjoint = a.last < b.first || b.last < a.first;
      if (!disjoint && (a.first !== b.first || a.last !== b.last)) return false;
    }
  }
  const [fewer, more] = upper.cells.length <= lower.cells.length ? [upper, lower] : [lower, upper];
  return fewer.cells.every((a) => more.cells.some((b) => a.first === b.first && a.last === b.last));
}

/** Pieces of one header line (cut where drawing order jumped over a wrapped cell's second line) made one line again. */
function sameLine(a: HeaderLine, b: HeaderLine): boolean {
  return Math.min(a.bottom, b.bottom) - Math.max(a.top, b.top) >= LINE_OVERLAP * Math.min(a.bottom - a.top, b.bottom - b.top);
}

/**
 * Joins header lines (top to bottom) that belong together: pieces of one
 * line, and the lines of wrapped header cells ("F" / "value").
 */
function joinWrappedHeaderLines(lines: HeaderLine[]): HeaderLine[] {
  const whole: HeaderLine[] = [];
  for (const line of lines) {
    const previous = whole[whole.length - 1];
    if (previous !== undefined && sameLine(previous, line)) {
      previous.cells = [...previous.cells, ...line.cells.map((cell) => ({ ...cell }))].sort((a, b) => a.first - b.first || a.x0 - b.x0);
      previous.top = Math.min(previous.top, line.top);
      previous.bottom = Math.max(previous.bottom, line.bottom);
    } else whole.push({ ...line, cells: line.cells.map((cell) => ({ ...cell })) });
  }
  const out: HeaderLine[] = [];
  for (const line of whole) {
    const previous = out[out.length - 1];
    if (previous !== undefined && line.top - previous.bottom <= HEADER_WRAP_GAP * line.height && wrapsInto(previous, line)) {
      const cells = [...line.cells];
      for (const upper of previous.cells) {
        const below = cells.find((cell) => cell.first === upper.first && cell.last === upper.last);
        if (below !== undefined) {
          below.text = `${upper.text} ${below.text}`;
          below.x0 = Math.min(below.x0, upper.x0);
          below.x1 = Math.max(below.x1, upper.x1);
        } else cells.push(upper);
      }
      cells.sort((a, b) => a.first - b.first);
      out[out.length - 1] = { top: previous.top, bottom: line.bottom, height: line.height, cells };
      continue;
    }
    out.push(line);
  }
  return out;
}

/**
 * Widens the cells of upper header lines to the columns of the cells they
 * stand over: a centred title over a block of narrow columns may reach over
 * the values of only some of them, but it overlaps the names under it and
 * takes the columns of each. Lines are taken from the bottom up; cells of
 * one line never share a column.
 */
function widenSpanningCells(lines: HeaderLine[], columns: readonly Column[]): void {
  for (let level = lines.length - 2; level >= 0; level--) {
    const lower = lines[level + 1]!;
    const extents = lower.cells.map((cell) => ({ x0: Math.min(cell.x0, columns[cell.first]!.x0), x1: Math.max(cell.x1, columns[cell.last]!.x1), first: cell.first, last: cell.last }));
    for (const cell of lines[level]!.cells) {
      for (const extent of extents) {
        if (extent.x0 < cell.x1 && extent.x1 > cell.x0) {
          cell.first = Math.min(cell.first, extent.first);
          cell.last = Math.max(cell.last, extent.last);
        }
      }
    }
    let free = 0;
    for (const cell of lines[level]!.cells) {
      cell.first = Math.max(cell.first, free);
      cell.last = Math.max(cell.last, cell.first);
      free = cell.last + 1;
    }
    lines[level]!.cells = lines[level]!.cells.filter((cell) => cell.first < columns.length).map((cell) => ({ ...cell, last: Math.min(cell.last, columns.length - 1) }));
  }
}

// ----------------------------------------------------------------- body

interface BodyRow {
  cells: string[];
  /** The row has numbers (or cells) in value columns. */
  values: boolean;
  /** Left and right of the label's last line. */
  labelX0: number;
  labelX1: number;
  /** Pieces the row was built from, top to bottom. */
  pieces: Piece[];
}

/** Texts per column of a body line: a cell over a gap between columns is cut between its words. */
function placeBodyLine(piece: Piece, columns: readonly Column[], words: readonly PageWord[]): string[] {
  const texts: string[][] = columns.map(() => []);
  for (const cell of piece.cells) {
    const under = columnsUnder(columns, cell.x0, cell.x1);
    if (under.first === under.last) {
      texts[under.first]!.push(cell.text);
      continue;
    }
    for (const index of cell.words) {
      const word = words[index]!;
      const centre = (word.x0 + word.x1) / 2;
      texts[columnsUnder(columns, centre, centre).first]!.push(word.text.trim());
    }
  }
  return texts.map((parts) => parts.join(' '));
}

/** Joins a label and its next line ("Digit span" + "forwards"), rejoining a word hyphenated at the line end. */
function joinLabel(first: string, second: string): string {
  if (first === '') return second;
  if (second === '') return first;
  return dehyphenate(`${first}\n${second}`).replace(/\n/g, ' ');
}

/** A label line that ends open: the next line goes on with it. */
const OPEN_END = /(?:[-\u2010(/&,]|\b(?:and|of|by|vs\.?|x|or|the|in|with|for|to|on|at))$/iu;

/** Median gap (in line heights) between consecutive lines that both hold numbers; null when there are none. */
function typicalRowGap(lines: readonly Piece[]): number | null {
  const gaps: number[] = [];
  for (let index = 1; index < lines.length; index++) {
    if (isValueLine(lines[index - 1]!) && isValueLine(lines[index]!)) gaps.push(gapBetween(lines[index - 1]!, lines[index]!) / lines[index]!.height);
  }
  if (gaps.length === 0) return null;
  gaps.sort((a, b) => a - b);
  return gaps[gaps.length >> 1]!;
}

/**
 * The body rows: rows with numbers, with the label lines that continue them
 * joined in, and group headings as rows of their own. Label lines after the
 * last row with numbers are left out. Returns the rows and the pieces used.
 */
function buildBody(lines: readonly Piece[], columns: readonly Column[], words: readonly PageWord[]): { rows: BodyRow[]; used: Piece[] } {
  const rowGap = typicalRowGap(lines);
  // Rows set with space between them: a wrapped line follows more closely than the next row does.
  const spaced = rowGap !== null && rowGap > 0.2;
  let labelRight = columns[0]!.x1;
  for (const piece of lines) {
    const first = piece.cells[0]!;
    if (columnsUnder(columns, first.x0, first.x0).first === 0 && (piece.cells.length > 1 || first.x1 <= columns[0]!.x1)) labelRight = Math.max(labelRight, first.x1);
  }

  const continues = (row: BodyRow, piece: Piece): boolean => {
    if (piece.x0 < row.labelX0 - 0.5 * piece.height) return false;
    const gap = gapBetween(row.pieces[row.pieces.length - 1]!, piece) / piece.height;
    const lowerStart = /^[\p{Ll}(\[]/u.test(piece.text);
    const openEnd = OPEN_END.test(row.cells[0]!);
    if (spaced) return gap < 0.6 * rowGap! || ((lowerStart || openEnd) && gap < rowGap!);
    const firstWord = words[piece.cells[0]!.words[0]!]!;
    const wouldNotFit = row.labelX1 + 0.25 * piece.height + (firstWord.x1 - firstWord.x0) > labelRight + 0.5;
    return gap < 0.6 && (lowerStart || openEnd || wouldNotFit);
  };

  const rows: BodyRow[] = [];
  for (const piece of lines) {
    const first = piece.cells[0]!;
    const startsInLabel = columnsUnder(columns, first.x0, first.x0).first === 0;
    const texts = placeBodyLine(piece, columns, words);
    const labelOnly = numberCount(piece) === 0 && startsInLabel && (piece.cells.length === 1 || texts.slice(1).every((text) => text === ''));
    const previous = rows[rows.length - 1];
    if (labelOnly) {
      if (previous !== undefined && continues(previous, piece)) {
        previous.cells[0] = joinLabel(previous.cells[0]!, piece.text);
        previous.labelX0 = piece.x0;
        previous.labelX1 = piece.x1;
        previous.pieces.push(piece);
        continue;
      }
      rows.push({ cells: [piece.text, ...columns.slice(1).map(() => '')], values: false, labelX0: piece.x0, labelX1: piece.x1, pieces: [piece] });
      continue;
    }
    if (texts[0] === '' && previous !== undefined) {
      const gap = gapBetween(previous.pieces[previous.pieces.length - 1]!, piece) / piece.height;
      if (!previous.values && gap < 0.35) {
        // Numbers set in the middle of a two-line label: the label line just above is theirs.
        for (let column = 1; column < texts.length; column++) previous.cells[column] = texts[column]!;
        previous.values = true;
        previous.pieces.push(piece);
        continue;
      }
      if (previous.values && gap < 0.35 && texts.every((text, column) => text === '' || previous.cells[column] !== '')) {
        // Cells whose text wraps onto a second line.
        texts.forEach((text, column) => {
          if (text !== '') previous.cells[column] = `${previous.cells[column]} ${text}`;
        });
        previous.pieces.push(piece);
        continue;
      }
    }
    rows.push({
      cells: texts,
      values: true,
      labelX0: startsInLabel ? first.x0 : piece.x0,
      labelX1: startsInLabel ? first.x1 : piece.x0,
      pieces: [piece],
    });
  }
  while (rows.length > 0 && !rows[rows.length - 1]!.values) rows.pop();
  return { rows, used: rows.flatMap((row) => row.pieces) };
}

// ---------------------------------------------------------------- table

/** Share of a table's cells that may fall in a column another cell of their row already holds. */
const MAX_CROWDING = 0.2;

/**
 * Share of the cells of the rows with numbers that share a column with an
 * earlier cell of their row. Rows of a table put one cell in each column;
 * lines of running text that happened to hold numbers do not line up, and
 * their many cells fall into few columns.
 */
export function crowding(rows: readonly Piece[], columns: readonly Column[]): number {
  let cells = 0;
  let crowded = 0;
  for (const row of rows) {
    let lastColumn = -1;
    for (const cell of row.cells) {
      const { first } = columnsUnder(columns, cell.x0, cell.x1);
      cells++;
      if (first <= lastColumn) crowded++;
      lastColumn = Math.max(lastColumn, first);
    }
  }
  return cells === 0 ? 0 : crowded / cells;
}

function buildTable(region: Region, words: readonly PageWord[]): LayoutTable | null {
  const valueLines = region.bodyLines.filter(isValueLine);
  const columns = findColumns(valueLines);
  if (columns.length < MIN_COLUMNS || columns.length > MAX_COLUMNS) return null;
  if (crowding(valueLines, columns) > MAX_CROWDING) return null;
  const body = buildBody(region.bodyLines, columns, words);
  if (body.rows.filter((row) => row.values).length < MIN_VALUE_ROWS) return null;

  // A header names each column once: a line of many more cells than columns is not a header (and would cost).
  if (region.headerLines.some((piece) => piece.cells.length > 2 * columns.length)) return null;
  const headerLines = joinWrappedHeaderLines(region.headerLines.map((piece) => headerLineOf(piece, columns)));
  widenSpanningCells(headerLines, columns);
  const width = columns.length;
  const rows: string[][] = [];
  const spans: number[][] = [];
  for (const line of headerLines) {
    const cells = new Array<string>(width).fill('');
    const lineSpans = new Array<number>(width).fill(1);
    for (const cell of line.cells) {
      cells[cell.first] = cells[cell.first] === '' ? cell.text : `${cells[cell.first]} ${cell.text}`;
      lineSpans[cell.first] = cell.last - cell.first + 1;
      for (let column = cell.first + 1; column <= cell.last; column++) lineSpans[column] = 0;
    }
    rows.push(cells);
    spans.push(lineSpans);
  }
  for (const row of body.rows) {
    rows.push(row.cells);
    spans.push(new Array<number>(width).fill(1));
  }
  const taken = [...region.captionLines, ...region.headerLines, ...body.used, ...region.noteLines];
  return {
    caption: region.captionLines.length > 0 ? joinLines(region.captionLines.map((piece) => piece.text)) : null,
    notes: groupNotes(region.noteLines, words),
    rows,
    headerRows: headerLines.length,
    spans,
    words: taken.flatMap((piece) => piece.words).sort((a, b) => a - b),
  };
}

function joinLines(lines: readonly string[]): string {
  return lines.reduce((joined, line) => joinLabel(joined, line), '');
}

/** Note lines as paragraphs: a line that starts a note starts a new one. */
function groupNotes(lines: readonly Piece[], words: readonly PageWord[]): string[] {
  const notes: string[] = [];
  for (const piece of lines) {
    if (notes.length === 0 || isNoteStart(piece, words)) notes.push(piece.text);
    else notes[notes.length - 1] = joinLabel(notes[notes.length - 1]!, piece.text);
  }
  return notes;
}
