/**
 * A table a reader rebuilt from lines of text: its span runs from the first
 * line's first visible character to the last line's last one, with one
 * header row and each cell pointing at its place in the text.
 */

import type { CellSpan, DocumentTable, TableLayout } from '../../documents/types.js';
import { TABLE_TITLE, type TextLine } from './cells.js';

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

/** The "Table N" title line at most `captionLines` non-blank lines above `header` (the caption's lines), or -1. */
export function titleLineAbove(lines: readonly TextLine[], header: number, captionLines: number): number {
  let seen = 0;
  for (let index = header - 1; index >= 0 && seen <= captionLines; index--) {
    const text = lines[index]!.text;
    if (text.trim() === '') continue;
    if (TABLE_TITLE.test(text)) return index;
    seen++;
  }
  return -1;
}

/** A table rebuilt from cells under its title line: from the title's first visible character to `end`. */
export function tableUnderTitle(title: TextLine, end: number, rows: string[][], cells: (CellSpan | null)[][], layout: TableLayout): DocumentTable {
  return {
    start: title.start + (title.text.length - title.text.trimStart().length),
    end,
    caption: title.text.trim(),
    notes: [],
    rows,
    headerRows: 1,
    cells,
    layout,
  };
}

/** The caption: the non-blank lines from the title line up to the header, trimmed and joined by spaces. */
export function captionBetween(lines: readonly TextLine[], title: number, header: number): string {
  return lines
    .slice(title, header)
    .map((line) => line.text.trim())
    .filter((text) => text !== '')
    .join(' ');
}
