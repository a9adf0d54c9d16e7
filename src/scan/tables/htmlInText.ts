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
import { layOutSpans, spanAttribute, type SpanningCell } from '../../documents/tables.js';
import type { TextLine } from './cells.js';

type Line = TextLine;

/** Longest stretch of text searched for the table's end tag. */
const MAX_TABLE_MARKUP = 500_000;

const TABLE_START = /<table\b/i;

/** Where the end tags of tables and rows stand in a text, found once per text (so that many start tags cost one pass). */
export class EndTags {
  private tableEnds: number[] | null = null;
  private rowEnds: number[] | null = null;

  constructor(private readonly text: string) {}

  /** The first "</table>" at or after `from` and before `limit` (its end offset), or -1. */
  tableEndAfter(from: number, limit: number): number {
    this.tableEnds ??= endsOf(this.text, /<\/table\s*>/gi);
    return firstIn(this.tableEnds, from, limit);
  }

  /** The last "</tr>" at or after `from` and before `limit` (its end offset), or -1. */
  lastRowEndBefore(from: number, limit: number): number {
    this.rowEnds ??= endsOf(this.text, /<\/tr\s*>/gi);
    let found = -1;
    let low = 0;
    let high = this.rowEnds.length;
    while (low < high) {
      const middle = (low + high) >> 1;
      if (this.rowEnds[middle]! <= limit) low = middle + 1;
      else high = middle;
    }
    if (low > 0 && this.rowEnds[low - 1]! > from) found = this.rowEnds[low - 1]!;
    return found;
  }
}

function endsOf(text: string, pattern: RegExp): number[] {
  const ends: number[] = [];
  for (let match = pattern.exec(text); match !== null; match = pattern.exec(text)) ends.push(match.index + match[0].length);
  return ends;
}

function firstIn(sorted: number[], from: number, limit: number): number {
  let low = 0;
  let high = sorted.length;
  while (low < high) {
    const middle = (low + high) >> 1;
    if (sorted[middle]! <= from) low = middle + 1;
    else high = middle;
  }
  const found = sorted[low];
  return found !== undefined && found <= limit ? found : -1;
}

/**
 * An HTML table whose start tag stands on `lines[index]`: the table (null when the markup holds no table of two
 * rows or more) and the index of the line of its end, so that the markup is read once; null when no table starts
 * on that line or no row ends after it.
 */
export function readHtmlTableInText(text: string, lines: Line[], index: number, ends: EndTags): { table: DocumentTable | null; lastLine: number } | null {
  const line = lines[index];
  if (line === undefined) return null;
  const startInLine = line.text.search(TABLE_START);
  if (startInLine < 0) return null;
  const start = line.start + startInLine;
  const limit = start + MAX_TABLE_MARKUP;
  // A table cut off before its end tag (an excerpt, a truncated file) is read up to its last complete row.
  const tableEnd = ends.tableEndAfter(start, limit);
  const end = tableEnd >= 0 ? tableEnd : ends.lastRowEndBefore(start, limit);
  if (end < 0) return null;
  const markup = text.slice(start, end);
  let lastLine = index;
  while (lastLine + 1 < lines.length && lines[lastLine + 1]!.start < end) lastLine++;
  let root;
  try {
    root = parseLimitedDocument(markup, { decodeEntities: true, lowerCaseTags: true, lowerCaseAttributeNames: true, withStartIndices: true, withEndIndices: true }, defaultLimits);
  } catch {
    return { table: null, lastLine };
  }
  const table = root.children.find((node): node is Element => isTag(node) && node.name === 'table');
  if (table === undefined) return { table: null, lastLine };
  const read = readRows(table, start);
  if (read.rows.length < 2) return { table: null, lastLine };
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
  const rows: SpanningCell<{ text: string; span: CellSpan | null }>[][] = [];
  const notes: string[] = [];
  let headerRows = 0;
  let inHeader = true;
  let caption: string | null = null;
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
      const allHeaderCells = cellElements.length > 0 && cellElements.every((cell) => cell.name === 'th');
      if (inHeader && (section === 'thead' || allHeaderCells)) headerRows++;
      else inHeader = false;
      rows.push(cellElements.map((cell) => ({ value: { text: textOf(cell), span: innerSpan(cell, offset) }, colspan: spanAttribute(cell, 'colspan'), rowspan: spanAttribute(cell, 'rowspan') })));
    }
  }
  const laidOut = layOutSpans(rows, { text: '', span: null });
  // A header of the table's title alone ("<th>Table 7</th>" and empty cells, as converters set a title over the
  // columns): the title is the caption, and the column names are found in the body's first rows.
  const titleRows = headerRows > 0 && laidOut.slice(0, headerRows).every((row) => row.filter((cell) => cell.text.trim() !== '').length <= 1);
  if (titleRows) {
    const title = laidOut
      .slice(0, headerRows)
      .map((row) => row.map((cell) => cell.text.trim()).join(' ').trim())
      .filter((text) => text !== '')
      .join(' ');
    caption ??= title === '' ? null : title;
    laidOut.splice(0, headerRows);
    headerRows = 0;
  }
  return { rows: laidOut.map((row) => row.map((cell) => cell.text)), cells: laidOut.map((row) => row.map((cell) => cell.span)), headerRows, caption, notes };
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
