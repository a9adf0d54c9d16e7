/**
 * Reads back the documents' data an HTML report holds (src/report/html.ts: JSON in
 * `<script type="application/json" class="report-data">` blocks), for tests that look at what the page will
 * draw without a browser.
 */
import type { DocumentData } from '../../src/report/html.js';

/** The JSON text of each data block, in order. */
export function htmlDataBlocks(html: string): string[] {
  const blocks: string[] = [];
  const open = '<script type="application/json" class="report-data">';
  let from = html.indexOf(open);
  while (from >= 0) {
    const start = from + open.length;
    const end = html.indexOf('</script>', start);
    if (end < 0) throw new Error('a data block is not closed');
    blocks.push(html.slice(start, end));
    from = html.indexOf(open, end);
  }
  return blocks;
}

/** Every document's data, in the order of the report. */
export function htmlDocumentsData(html: string): DocumentData[] {
  return htmlDataBlocks(html).flatMap((block) => JSON.parse(block) as DocumentData[]);
}

/** Every string in the documents' data (paths, results, surroundings, messages), decoded. */
export function htmlDataStrings(html: string): string[] {
  const strings: string[] = [];
  const walk = (value: unknown): void => {
    if (typeof value === 'string') strings.push(value);
    else if (Array.isArray(value)) value.forEach(walk);
    else if (value !== null && typeof value === 'object') Object.values(value).forEach(walk);
  };
  walk(htmlDocumentsData(html));
  return strings;
}
