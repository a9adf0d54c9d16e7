/**
 * Results tables that no table reader recognised: a "Table N" title with a
 * block of short lines after it that name a test statistic or p and hold
 * numbers, where no table was found and the text scanner read no result.
 * Such a table is listed as not read, so that an audit of a paper whose
 * tables came out of extraction in an unknown shape does not look cleaner
 * than it is.
 */

import type { DocumentTable } from '../../documents/types.js';
import { mentionsStatistic, type UnreadTable } from './readTableResults.js';
import { TABLE_TITLE } from './cells.js';

const TITLE = TABLE_TITLE;
/** How far after its title a table's lines are looked at. */
const MAX_LINES = 40;
const MAX_CHARACTERS = 5000;
/** Lines longer than this are prose. */
const MAX_TABLE_LINE = 200;
/** Numbers a block needs to count as a table of results. */
const MIN_NUMBERS = 6;

interface Span {
  start: number;
  end: number;
}

/** Titled blocks that look like results tables but overlap no table found and no result read. */
export function findUnrecognisedTables(text: string, tables: readonly DocumentTable[], results: readonly Span[]): UnreadTable[] {
  const unread: UnreadTable[] = [];
  let lineStart = 0;
  while (lineStart < text.length) {
    let lineEnd = text.indexOf('\n', lineStart);
    if (lineEnd === -1) lineEnd = text.length;
    const line = text.slice(lineStart, lineEnd);
    if (line.length <= 300 && TITLE.test(line)) {
      const block = blockAfter(text, lineStart, lineEnd);
      const overlaps = (span: Span): boolean => span.start < block.end && block.start < span.end;
      if (!tables.some(overlaps) && !results.some(overlaps) && looksLikeResults(block.lines)) {
        unread.push({
          tableIndex: null,
          caption: line.trim(),
          start: lineStart,
          end: block.end,
          rowsWithStatistic: block.lines.filter((row) => (row.match(/\d/g) ?? []).length >= 2).length,
          rowsRead: 0,
          reason: 'layout-not-recognised',
        });
        lineStart = block.end + 1;
        continue;
      }
    }
    lineStart = lineEnd + 1;
  }
  return unread;
}

/** The lines after a title up to the next title, a long line of prose, or the bounds. */
function blockAfter(text: string, titleStart: number, titleEnd: number): { start: number; end: number; lines: string[] } {
  const lines: string[] = [];
  let end = titleEnd;
  let at = titleEnd + 1;
  while (at < text.length && lines.length < MAX_LINES && at - titleStart < MAX_CHARACTERS) {
    let next = text.indexOf('\n', at);
    if (next === -1) next = text.length;
    const line = text.slice(at, next);
    // A long line is prose, unless it is mostly numbers (a whole table run onto one line).
    if (TITLE.test(line) || (line.length > MAX_TABLE_LINE && !(line.length <= 4000 && digitShare(line) >= 0.25))) break;
    lines.push(line);
    if (line.trim() !== '') end = next;
    at = next + 1;
  }
  return { start: titleStart, end, lines };
}

function digitShare(line: string): number {
  const visible = line.replace(/\s/g, '').length;
  return visible === 0 ? 0 : (line.match(/\d/g) ?? []).length / visible;
}

/** A statistic or p named in the block, and enough numbers. */
function looksLikeResults(lines: string[]): boolean {
  let numbers = 0;
  let named = false;
  for (const line of lines) {
    numbers += (line.match(/\d*[.,]\d+|\d+/g) ?? []).length;
    if (!named) named = line.split(/\||\t| {2,}/).some((cell) => mentionsStatistic(cell.trim())) || line.split(/\s+/).some((word) => mentionsStatistic(word));
  }
  return named && numbers >= MIN_NUMBERS;
}
