/**
 * A table a reader rebuilt from lines of text: its span runs from the first
 * line's first visible character to the last line's last one, with one
 * header row and each cell pointing at its place in the text.
 */

import type { CellSpan, DocumentTable, TableLayout } from '../../documents/types.js';
import type { TextLine } from './cells.js';

export function tableOverLines(first: TextLine, last: TextLine, caption: string | null, rows: string[][], cells: (CellSpan | null)[][], layout: TableLayout): DocumentTable {
  return {
    start: first.start + (first.text.length - first.text.trimStart().length),
    end: last.start + last.text.trimEnd().length,
    caption,
    notes: [],
    rows,
    headerRows: 1,
    cells,
    layout,
  };
}

/** A cell's offsets as a span. */
export function spanOfCell(cell: { start: number; end: number }): CellSpan {
  return { start: cell.start, end: cell.end };
}
