/**
 * HTML tables left as markup in a text or Markdown file: Markdown converted
 * from a publisher's XML keeps complex tables as raw HTML, and text copied
 * from a page's source carries them too:
 *
 *     <table>
 *       <thead>
 *         <tr><th rowspan="2">Region name</th><th colspan="3">Criterion 1</th>…
 *         <tr><th>t</th><th>β ± SD</th><th>p</th>…
 *       <tbody>
 *         <tr><td>Left SFL</td><td>4.77</td>…
 *
 * The markup is parsed (htmlparser2, with the element limits every markup
 * reader has) and the table handed on as rows of cells: a cell spanning
 * columns is followed by empty cells, a cell spanning rows leaves an empty
 * cell in the rows below, header rows are those of <thead> (or the leading
 * rows of <th> cells), a <tfoot> row of one cell is a note. Each cell points
 * at its text inside the markup, so results are reported where they stand.
 */

import { isTag, isText, type ChildNode, type Element } from 'domhandler';
import type { CellSpan, DocumentTable } from '../../documents/types.js';
import { parseLimitedDocument } from '../../documents/markupLimits.js';
import { defaultLimits } from '../../limits.js';
import type { TextLine } from './cells.js';

type Line = TextLine;

/** Longest stretch of text searched for the table's end tag. */
const MAX_TABLE_MARKUP = 500_000;
/** Most columns one cell may span (a larger colspan is taken as this). */
const MAX_SPAN = 50;

const TABLE_START = /<table\b/i;

/** An HTML table whose start tag stands on `lines[index]`, with the index of the line of its end tag; or null. */
export function readHtmlTableInText(text: string, lines: Line[], index: number): { table: DocumentTable; lastLine: number } | null {
  const line = lines[index];
  if (line === undefined) return null;
  const startInLine = line.text.search(TABLE_START);
  if (startInLine < 0) return null;
  const start = line.start + startInLine;
  const window = text.slice(start, start + MAX_TABLE_MARKUP);
  const lower = window.toLowerCase();
  // A table cut off before its end tag (an excerpt, a truncated file) is read up to its last complete row.
  const endAt = lower.indexOf('</table>');
  const lastRowEnd = lower.lastIndexOf('</tr>');
  if (endAt < 0 && lastRowEnd < 0) return null;
  const markup = endAt >= 0 ? window.slice(0, endAt + '</table>'.length) : window.slice(0, lastRowEnd + '</tr>'.length);
  let root;
  try {
    root = parseLimitedDocument(markup, { decodeEntities: true, lowerCaseTags: true, lowerCaseAttributeNames: true, withStartIndices: true, withEndIndices: true }, defaultLimits);
  } catch {
    return null;
  }
  const table = root.children.find((node): node is Element => isTag(node) && node.name === 'table');
  if (table === undefined) return null;
  const read = readRows(table, start);
  if (read.rows.length < 2) return null;
  const end = start + markup.length;
  let lastLine = index;
  while (lastLine + 1 < lines.length && lines[lastLine + 1]!.start < end) lastLine++;
  return {
    table: {
      start,
      end,
      caption: read.caption,
      notes: read.notes,
      rows: read.rows,
      ...(read.headerRows > 0 ? { headerRows: read.headerRows } : {}),
      cells: read.cells,
      layout: 'pipe',
    },
    lastLine,
  };
}

interface ReadRows {
  rows: string[][];
  cells: (CellSpan | null)[][];
  headerRows: number;
  caption: string | null;
  notes: string[];
}

/** The table's rows in order (thead, tbody, tfoot, bare rows), spans laid out as empty cells. */
function readRows(table: Element, offset: number): ReadRows {
  const rows: string[][] = [];
  const cells: (CellSpan | null)[][] = [];
  const notes: string[] = [];
  let headerRows = 0;
  let inHeader = true;
  let caption: string | null = null;
  // Columns still covered by a cell spanning rows from above: column -> rows left.
  const carried = new Map<number, number>();
  for (const child of table.children) {
    if (!isTag(child)) continue;
    if (child.name === 'caption') {
      caption = textOf(child) || null;
      continue;
    }
    const section = child.name;
    const rowElements = section === 'tr' ? [child] : ['thead', 'tbody', 'tfoot'].includes(section) ? child.children.filter((row): row is Element => isTag(row) && row.name === 'tr') : [];
    for (const row of rowElements) {
      const cellElements = row.children.filter((cell): cell is Element => isTag(cell) && (cell.name === 'td' || cell.name === 'th'));
      if (section === 'tfoot' && cellElements.length === 1) {
        notes.push(textOf(cellElements[0]!));
        continue;
      }
      const texts: string[] = [];
      const spans: (CellSpan | null)[] = [];
      let column = 0;
      const fillCarried = (): void => {
        while ((carried.get(column) ?? 0) > 0) {
          carried.set(column, carried.get(column)! - 1);
          texts.push('');
          spans.push(null);
          column++;
        }
      };
      for (const cell of cellElements) {
        fillCarried();
        const colspan = spanOf(cell, 'colspan');
        const rowspan = spanOf(cell, 'rowspan');
        texts.push(textOf(cell));
        spans.push(innerSpan(cell, offset));
        for (let extra = 0; extra < colspan; extra++) {
          if (rowspan > 1) carried.set(column + extra, rowspan - 1);
          if (extra > 0) {
            texts.push('');
            spans.push(null);
          }
        }
        column += colspan;
      }
      fillCarried();
      const allHeaderCells = cellElements.length > 0 && cellElements.every((cell) => cell.name === 'th');
      if (inHeader && (section === 'thead' || allHeaderCells)) headerRows++;
      else inHeader = false;
      rows.push(texts);
      cells.push(spans);
    }
  }
  return { rows, cells, headerRows, caption, notes };
}

function spanOf(cell: Element, name: 'colspan' | 'rowspan'): number {
  const value = Number.parseInt(cell.attribs[name] ?? '1', 10);
  return Number.isFinite(value) && value >= 1 ? Math.min(value, MAX_SPAN) : 1;
}

/** The cell's text: its text nodes in order, markup (<sup>, <i>) flattened in place, white space collapsed. */
function textOf(node: Element): string {
  const parts: string[] = [];
  const walk = (children: ChildNode[]): void => {
    for (const child of children) {
      if (isText(child)) parts.push(child.data);
      else if (isTag(child)) walk(child.children);
    }
  };
  walk(node.children);
  return parts.join('').replace(/\s+/g, ' ').trim();
}

/** Where the cell's content stands in the text: from its first to its last non-blank text; null when empty. */
function innerSpan(cell: Element, offset: number): CellSpan | null {
  const texts: { start: number; end: number; data: string }[] = [];
  const walk = (children: ChildNode[]): void => {
    for (const child of children) {
      if (isText(child) && child.data.trim() !== '' && child.startIndex !== null && child.endIndex !== null) texts.push({ start: child.startIndex, end: child.endIndex + 1, data: child.data });
      else if (isTag(child)) walk(child.children);
    }
  };
  walk(cell.children);
  const first = texts[0];
  const last = texts[texts.length - 1];
  if (first === undefined || last === undefined) return null;
  const leading = first.data.length - first.data.trimStart().length;
  const trailing = last.data.length - last.data.trimEnd().length;
  return { start: offset + first.start + leading, end: offset + last.end - trailing };
}
