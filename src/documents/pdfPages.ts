/**
 * The PDF reader's work on page text that needs no engine and no file: page
 * furniture, de-hyphenation and tables (through pdfCompose.ts), the page
 * boundaries and regions of the whole text. Kept apart from pdf.ts, which
 * runs the engines, so that the page of `plumbline web` reads PDFs with the
 * same code (src/web/page/readers.ts) without Node's modules.
 */
import { findReferenceListRegions } from './plainRegions.js';
import { composePage, type ComposedPage } from './pdfCompose.js';
import type { LocatedWord } from './pdfWords.js';
import type { DocumentTable, DocumentText, Region } from './types.js';

/** Below this many visible characters per page on average, a PDF is taken to be scanned images. */
const MIN_CHARACTERS_PER_PAGE = 20;

/**
 * Each page without its furniture (see withoutPageFurniture), de-hyphenated,
 * with its tables rebuilt from its words (the words inside the furniture
 * are left out).
 */
export function composePages(pages: readonly string[], words: readonly (readonly LocatedWord[] | null)[]): ComposedPage[] {
  return furnitureRanges(pages).map((range, index) => {
    const pageWords = words[index] ?? null;
    // Words are in text order: those inside the kept range are one slice of them.
    const kept = pageWords === null ? null : pageWords.slice(firstEndingAfter(pageWords, range.start), firstEndingAfter(pageWords, range.end));
    return composePage(pages[index]!.slice(range.start, range.end), kept, range.start);
  });
}

/** Index of the first word (in text order) that ends after `offset` (binary search). */
function firstEndingAfter(words: readonly LocatedWord[], offset: number): number {
  let low = 0;
  let high = words.length;
  while (low < high) {
    const middle = (low + high) >> 1;
    if (words[middle]!.end <= offset) low = middle + 1;
    else high = middle;
  }
  return low;
}

/** A PDF ends with "%%EOF" (possibly followed by a little whitespace or junk); a cut file does not. */
export function looksScanned(pages: readonly string[]): boolean {
  const visible = pages.reduce((sum, page) => sum + page.replace(/\s+/g, '').length, 0);
  return visible < MIN_CHARACTERS_PER_PAGE * pages.length;
}

/** A line that is only a page number: "12", "Page 12", "12 of 30", "- 12 -". */
const PAGE_NUMBER_LINE = /^[-\u2013\u2014\s]*(?:page\s+)?\d{1,4}(?:\s*(?:of|\/)\s*\d{1,4})?[-\u2013\u2014\s]*$/i;
/** How many lines at the top and bottom of a page may be running heads, feet or page numbers. */
const FURNITURE_LINES = 3;

function furnitureKey(line: string): string {
  return line.trim().replace(/\d+/g, '#').toLowerCase();
}

/**
 * Drops page furniture that text extraction leaves inside the running text,
 * where it can fall between a result and its p ("F(1, 39) = 0.09,\fJournal of
 * Things\n2\nn.s."): page-number lines, and running heads and feet, i.e.
 * lines among the first or last few of a page that recur (numbers aside) on
 * at least two pages and at least a third of them. Only the edges of pages
 * are touched; body text is never removed.
 */
export function withoutPageFurniture(pages: readonly string[]): string[] {
  return furnitureRanges(pages).map((range, index) => pages[index]!.slice(range.start, range.end));
}

/** What withoutPageFurniture keeps of each page: [start, end) of its text. */
export function furnitureRanges(pages: readonly string[]): { start: number; end: number }[] {
  const split = pages.map((page) => page.split('\n'));
  const edgeCounts = new Map<string, number>();
  for (const lines of split) {
    const nonEmpty = lines.map((line, index) => ({ line, index })).filter(({ line }) => line.trim() !== '');
    const edges = new Set([...nonEmpty.slice(0, FURNITURE_LINES), ...nonEmpty.slice(-FURNITURE_LINES)].map(({ line }) => furnitureKey(line)));
    for (const key of edges) edgeCounts.set(key, (edgeCounts.get(key) ?? 0) + 1);
  }
  const recurring = (line: string): boolean => {
    const count = edgeCounts.get(furnitureKey(line)) ?? 0;
    return pages.length >= 2 && count >= 2 && count * 3 >= pages.length;
  };
  const isFurniture = (line: string): boolean => PAGE_NUMBER_LINE.test(line) || recurring(line);
  return split.map((lines) => {
    let first = 0;
    let last = lines.length - 1;
    for (let removed = 0; removed < FURNITURE_LINES && first <= last; ) {
      if (lines[first]!.trim() === '') first += 1;
      else if (isFurniture(lines[first]!)) {
        first += 1;
        removed += 1;
      } else break;
    }
    for (let removed = 0; removed < FURNITURE_LINES && last >= first; ) {
      if (lines[last]!.trim() === '') last -= 1;
      else if (isFurniture(lines[last]!)) {
        last -= 1;
        removed += 1;
      } else break;
    }
    if (first > last) return { start: 0, end: 0 };
    let start = 0;
    for (let index = 0; index < first; index++) start += lines[index]!.length + 1;
    let end = start;
    for (let index = first; index <= last; index++) end += lines[index]!.length + (index < last ? 1 : 0);
    return { start, end };
  });
}

/**
 * Joins the pages with a form feed after each (as pdftotext writes them),
 * records where each starts, and places the pages' tables in the whole text
 * (a caption region and a table region each, taken out of the reference
 * list when a table stands in it).
 */
export function pdfDocument(path: string, pages: readonly (string | ComposedPage)[]): DocumentText {
  const pageStarts: number[] = [];
  const tables: DocumentTable[] = [];
  const tableRegions: Region[] = [];
  let text = '';
  for (const page of pages) {
    const composed = typeof page === 'string' ? { text: page, tables: [] } : page;
    const base = text.length;
    pageStarts.push(base);
    text += `${composed.text.trimEnd()}\n\f`; // not /\s+$/, which is quadratic on a long run of spaces
    for (const table of composed.tables) {
      const shift = (span: { start: number; end: number }): { start: number; end: number } => ({ start: span.start + base, end: span.end + base });
      tables.push({
        start: table.start + base,
        end: table.end + base,
        caption: table.caption,
        notes: table.notes,
        rows: table.rows,
        ...(table.headerRows > 0 ? { headerRows: table.headerRows } : {}),
        spans: table.spans,
        cells: table.cells.map((row) => row.map((cell) => (cell === null ? null : shift(cell)))),
        layout: 'positions',
      });
      if (table.captionSpan !== null) tableRegions.push({ kind: 'caption', ...shift(table.captionSpan) });
      tableRegions.push({ kind: 'table', ...shift(table.bodySpan) });
    }
  }
  const regions = withRegionsCutOut(text, findReferenceListRegions(text), tableRegions);
  return { path, format: 'pdf', text, pageOf: (offset) => pageAt(pageStarts, offset, text.length), regions, tables };
}

/**
 * `regions` without the spans of `cuts` (sorted, not overlapping), with
 * `cuts` added; what is left of a region is trimmed of white space at its
 * ends and dropped when nothing else is left. Sorted and not overlapping.
 */
function withRegionsCutOut(text: string, regions: readonly Region[], cuts: readonly Region[]): Region[] {
  if (cuts.length === 0) return [...regions];
  const out: Region[] = [...cuts];
  const keep = (kind: Region['kind'], start: number, end: number): void => {
    while (start < end && /\s/.test(text[start]!)) start++;
    while (end > start && /\s/.test(text[end - 1]!)) end--;
    if (end > start) out.push({ kind, start, end });
  };
  for (const region of regions) {
    let start = region.start;
    for (const cut of cuts) {
      if (cut.end <= start || cut.start >= region.end) continue;
      if (cut.start > start) keep(region.kind, start, cut.start);
      start = Math.max(start, cut.end);
    }
    if (start < region.end) keep(region.kind, start, region.end);
  }
  return out.sort((a, b) => a.start - b.start);
}

/** 1-based page holding `offset` (binary search over page starts); null outside the text. */
export function pageAt(pageStarts: readonly number[], offset: number, textLength: number): number | null {
  if (!Number.isInteger(offset) || offset < 0 || offset > textLength || pageStarts.length === 0) return null;
  let low = 0;
  let high = pageStarts.length - 1;
  while (low < high) {
    const middle = (low + high + 1) >> 1;
    if (pageStarts[middle]! <= offset) low = middle;
    else high = middle - 1;
  }
  return low + 1;
}

