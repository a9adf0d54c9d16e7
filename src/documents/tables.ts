import type { ChildNode, Element } from 'domhandler';
import type { TextBuilder } from './builder.js';
import { childByName, elementChildren } from './dom.js';

/** A table as a reader found it, before it is written into the text. */
export interface TableDraft {
  caption: string | null;
  notes: string[];
  rows: string[][];
  /**
   * Where each word (run of non-space characters) of the caption, of each
   * cell and of each note starts in the file, parallel to them (null where
   * unknown), for a reader that maps its text back to the file's lines
   * (LaTeX; see TextBuilder.from).
   */
  sources?: { caption: readonly number[] | null; cells: (readonly number[] | null)[][]; notes: (readonly number[] | null)[] };
}

/** Cell separator in the text: results inside cells stay on one line and cells stay apart. */
export const CELL_SEPARATOR = ' | ';

/** Collapses a cell's or caption's whitespace to single spaces. */
export function collapseWhitespace(text: string): string {
  return text.replace(/\s+/g, ' ').trim();
}

/**
 * Writes a table into the text as its own block: the caption line (a
 * caption region), then one line per row with cells joined by " | ", then
 * one line per note (rows and notes form the table region). The table's
 * recorded span covers caption, rows and notes, so a result found anywhere
 * in that span can be said to sit in the table.
 */
export function writeTable(builder: TextBuilder, draft: TableDraft): void {
  const { sources } = draft;
  const rowsWithSources = draft.rows
    .map((row, r) => ({ cells: row.map(collapseWhitespace), sources: sources?.cells[r] }))
    .filter((row) => row.cells.some((cell) => cell.length > 0));
  const rows = rowsWithSources.map((row) => row.cells);
  const notesWithSources = draft.notes.map((note, n) => ({ text: collapseWhitespace(note), sources: sources?.notes[n] })).filter((note) => note.text.length > 0);
  const notes = notesWithSources.map((note) => note.text);
  const caption = draft.caption === null ? null : collapseWhitespace(draft.caption) || null;
  if (rows.length === 0 && caption === null && notes.length === 0) return;
  builder.blockBreak(2);
  const start = builder.offset;
  if (caption !== null) {
    builder.open('caption');
    writeWords(builder, caption, sources?.caption);
    builder.close();
    builder.lineBreak();
  }
  builder.open('table');
  for (const row of rowsWithSources) {
    writeRow(builder, row.cells, row.sources);
    builder.lineBreak();
  }
  for (const note of notesWithSources) {
    writeWords(builder, note.text, note.sources);
    builder.lineBreak();
  }
  builder.close();
  const end = trimmedEnd(builder);
  builder.tables.push({ start, end, caption, notes, rows });
  builder.blockBreak(2);
}

/** One row, its cells joined by CELL_SEPARATOR, each cell's words placed in the file when known. */
function writeRow(builder: TextBuilder, cells: readonly string[], sources: readonly (readonly number[] | null)[] | undefined): void {
  if (sources === undefined) {
    builder.verbatim(cells.join(CELL_SEPARATOR));
    return;
  }
  cells.forEach((cell, c) => {
    if (c > 0) builder.verbatim(CELL_SEPARATOR);
    writeWords(builder, cell, sources[c]);
  });
}

/**
 * Text on one line (whitespace collapsed), written as it stands; with
 * `sources`, where each of its words starts in the file, each word says so
 * (TextBuilder.from). Sources that do not match the words are not used.
 */
function writeWords(builder: TextBuilder, text: string, sources: readonly number[] | null | undefined): void {
  const words = text.split(' ');
  if (!sources || text.length === 0 || words.length !== sources.length) {
    builder.verbatim(text);
    return;
  }
  words.forEach((word, w) => {
    if (w > 0) builder.verbatim(' ');
    builder.from(sources[w]!);
    builder.verbatim(word);
  });
}

function trimmedEnd(builder: TextBuilder): number {
  // The last line break belongs to the layout, not to the table.
  return builder.offset - 1;
}

/**
 * Rows of an HTML-style <table> (HTML, and JATS, which borrows the same
 * elements) in order: thead, tbody, tfoot or bare rows, without entering
 * nested tables. A <tfoot> row of a single cell is a note, not data.
 */
export function readTableElement(table: Element, cellText: (node: ChildNode) => string): TableDraft {
  const captionElement = childByName(table, 'caption');
  const rows: SpanningCell<string>[][] = [];
  const notes: string[] = [];
  for (const child of elementChildren(table)) {
    const section = child.name.toLowerCase();
    const rowElements = section === 'tr' ? [child] : ['thead', 'tbody', 'tfoot'].includes(section) ? elementChildren(child).filter((row) => row.name.toLowerCase() === 'tr') : [];
    for (const row of rowElements) {
      const cells = elementChildren(row).filter((cell) => ['td', 'th'].includes(cell.name.toLowerCase()));
      const texts = cells.map((cell) => collapseWhitespace(cellText(cell)));
      if (section === 'tfoot' && cells.length === 1) notes.push(texts[0]!);
      else rows.push(cells.map((cell, index) => ({ value: texts[index]!, colspan: spanAttribute(cell, 'colspan'), rowspan: spanAttribute(cell, 'rowspan') })));
    }
  }
  const caption = captionElement ? collapseWhitespace(cellText(captionElement)) || null : null;
  return { caption, notes, rows: layOutSpans(rows, '') };
}

/** Most columns or rows one cell is taken to span (a larger span in the markup is cut to this). */
const MAX_SPAN = 50;

/** A cell's colspan or rowspan (1 when absent or not a positive number; at most MAX_SPAN). */
export function spanAttribute(cell: Element, name: 'colspan' | 'rowspan'): number {
  const value = Number.parseInt(cell.attribs[name] ?? '1', 10);
  return Number.isFinite(value) && value >= 1 ? Math.min(value, MAX_SPAN) : 1;
}

/** A cell of a markup table with the columns and rows it spans. */
export interface SpanningCell<T> {
  value: T;
  colspan: number;
  rowspan: number;
}

/**
 * Rows of cells laid out on the table's grid: a cell spanning columns is followed by `empty` cells, a cell
 * spanning rows leaves `empty` cells in the rows below, so every cell stands in its column (a spanning title
 * over side-by-side blocks over the first of its columns, the row-label column's header over an empty cell).
 */
export function layOutSpans<T>(rows: readonly SpanningCell<T>[][], empty: T): T[][] {
  // Columns still covered by a cell spanning rows from above: column -> rows left.
  const carried = new Map<number, number>();
  return rows.map((row) => {
    const out: T[] = [];
    const fillCarried = (): void => {
      while ((carried.get(out.length) ?? 0) > 0) {
        carried.set(out.length, carried.get(out.length)! - 1);
        out.push(empty);
      }
    };
    for (const cell of row) {
      fillCarried();
      const column = out.length;
      out.push(cell.value);
      for (let extra = 1; extra < cell.colspan; extra++) out.push(empty);
      if (cell.rowspan > 1) for (let extra = 0; extra < cell.colspan; extra++) carried.set(column + extra, cell.rowspan - 1);
    }
    fillCarried();
    return out;
  });
}
