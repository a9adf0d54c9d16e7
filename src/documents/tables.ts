import type { ChildNode, Element } from 'domhandler';
import type { TextBuilder } from './builder.js';
import { childByName, elementChildren } from './dom.js';

/** A table as a reader found it, before it is written into the text. */
export interface TableDraft {
  caption: string | null;
  notes: string[];
  rows: string[][];
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
  const rows = draft.rows.map((row) => row.map(collapseWhitespace)).filter((row) => row.some((cell) => cell.length > 0));
  const notes = draft.notes.map(collapseWhitespace).filter((note) => note.length > 0);
  const caption = draft.caption === null ? null : collapseWhitespace(draft.caption) || null;
  if (rows.length === 0 && caption === null && notes.length === 0) return;
  builder.blockBreak(2);
  const start = builder.offset;
  if (caption !== null) {
    builder.open('caption');
    builder.verbatim(caption);
    builder.close();
    builder.lineBreak();
  }
  builder.open('table');
  for (const row of rows) {
    builder.verbatim(row.join(CELL_SEPARATOR));
    builder.lineBreak();
  }
  for (const note of notes) {
    builder.verbatim(note);
    builder.lineBreak();
  }
  builder.close();
  const end = trimmedEnd(builder);
  builder.tables.push({ start, end, caption, notes, rows });
  builder.blockBreak(2);
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
  const rows: string[][] = [];
  const notes: string[] = [];
  for (const child of elementChildren(table)) {
    const section = child.name.toLowerCase();
    const rowElements = section === 'tr' ? [child] : ['thead', 'tbody', 'tfoot'].includes(section) ? elementChildren(child).filter((row) => row.name.toLowerCase() === 'tr') : [];
    for (const row of rowElements) {
      const cells = elementChildren(row).filter((cell) => ['td', 'th'].includes(cell.name.toLowerCase()));
      const texts = cells.map((cell) => collapseWhitespace(cellText(cell)));
      if (section === 'tfoot' && cells.length === 1) notes.push(texts[0]!);
      else rows.push(texts);
    }
  }
  const caption = captionElement ? collapseWhitespace(cellText(captionElement)) || null : null;
  return { caption, notes, rows };
}
