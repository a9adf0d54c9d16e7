/**
 * Results tables that no table reader recognised: a "Table N" title with a
 * block of short lines after it that name a test statistic or p and hold
 * numbers, where no table was found and the text scanner read at most one
 * result (a test written out in a cell or in the caption).
 * Such a table is listed as not read, so that an audit of a paper whose
 * tables came out of extraction in an unknown shape does not look cleaner
 * than it is.
 */

import type { DocumentTable } from '../../documents/types.js';
import { mentionsStatistic, type UnreadTable } from './readTableResults.js';
import { TABLE_TITLE } from './cells.js';

const TITLE = TABLE_TITLE;
/** How far after its title a table's lines are looked at. */
const MAX_LINES = 150;
const MAX_CHARACTERS = 8000;
/** Longest caption line under a bare "Table N" title. */
const MAX_CAPTION_LINE = 500;
/** Lines longer than this are prose. */
const MAX_TABLE_LINE = 200;
/** Results read in a block that still leave it listed as not read (written out in a cell or in the caption). */
const MAX_STRAY_RESULTS = 1;
/** Numbers a block needs to count as a table of results. */
const MIN_NUMBERS = 6;

interface Span {
  start: number;
  end: number;
}

/** Titled blocks that look like results tables but overlap no table found and no result read. */
export function findUnrecognisedTables(text: string, tables: readonly DocumentTable[], results: readonly Span[]): UnreadTable[] {
  const titled = findTitledTables(text, tables, results);
  const untitled = findUntitledTables(text, [...tables, ...titled], results);
  const perLine = findUntitledCellTables(text, [...tables, ...titled, ...untitled], results);
  return [...titled, ...untitled, ...perLine].sort((a, b) => a.start - b.start);
}

/** Cells of a header line: apart by pipes, tabs or spaces. */
const HEADER_CELL_SPLIT = /[|\t ]+/;
/** Names of a test statistic as a header cell gives them (after normalisation, in lower case). */
const STATISTIC_HEADER = /^(?:f|t|z|h|r|rs|x2|chi2|\u03c72|chi-square|f-?value|t-?value|f-?ratio)$/;
/** A p's name standing as a word: the quick look before a line is split into cells. */
const NAMES_P = /(?:^|[\s|])(?:p|P|[Ss]ig|SIG|p-value|P-value|Pr)(?=[\s|.(]|$)/;
const SENTENCE_END = /[a-z]{3}[.!?]$/;
const MAX_HEADER_CELLS = 16;
const P_HEADER = /^(?:p|p-?value|sig\.?|pr\(>f\)|p\s?value)$/;

/** Each line's start and end (its line break left out). */
function lineSpans(text: string): Span[] {
  const lines: Span[] = [];
  for (let start = 0; start <= text.length; ) {
    let end = text.indexOf('\n', start);
    if (end === -1) end = text.length;
    lines.push({ start, end });
    start = end + 1;
  }
  return lines;
}

/**
 * Blocks without a "Table N" title that look like results tables: a short
 * header line naming a test statistic and p, then at least MIN_ROWS_AFTER
 * rows of numbers (with decimals), overlapping no table found or listed and
 * at most one result read. Listed as not read, so that a table no reader
 * recognised is never skipped without a word.
 */
function findUntitledTables(text: string, covered: readonly Span[], results: readonly Span[]): UnreadTable[] {
  const unread: UnreadTable[] = [];
  const lines = lineSpans(text);
  for (let index = 0; index < lines.length; index++) {
    const length = lines[index]!.end - lines[index]!.start;
    if (length === 0 || length > MAX_TABLE_LINE) continue;
    const header = text.slice(lines[index]!.start, lines[index]!.end);
    if (!NAMES_P.test(header) || digitShare(header) >= HEADER_DIGIT_SHARE) continue;
    // (A sentence is not a header: "We report F and p for each test.")
    if (SENTENCE_END.test(header.trimEnd())) continue;
    const cells = header.trim().split(HEADER_CELL_SPLIT).map((cell) => cell.toLowerCase());
    if (cells.length > MAX_HEADER_CELLS) continue;
    if (!cells.some((cell) => STATISTIC_HEADER.test(cell)) || !cells.some((cell) => P_HEADER.test(cell))) continue;
    let rows = 0;
    let last = index;
    for (let at = index + 1, blanks = 0; at < lines.length; at++) {
      const row = text.slice(lines[at]!.start, lines[at]!.end);
      if (row.trim() === '') {
        if (++blanks > 1) break;
        continue;
      }
      blanks = 0;
      if ((row.match(/\d*[.,]\d+|\d+/g) ?? []).length < MIN_NUMBERS_PER_ROW || !/\d[.,]\d/.test(row)) break;
      rows++;
      last = at;
    }
    const block = { start: lines[index]!.start, end: lines[last]!.end };
    const overlaps = (span: Span): boolean => span.start < block.end && block.start < span.end;
    if (rows >= MIN_ROWS_AFTER && !covered.some(overlaps) && results.filter(overlaps).length <= MAX_STRAY_RESULTS) {
      unread.push({ tableIndex: null, caption: null, start: block.start, end: block.end, rowsWithStatistic: rows, rowsRead: 0, reason: 'layout-not-recognised' });
      index = last;
    }
  }
  return unread;
}

/** Most non-blank lines between a one-cell-per-line header's statistic name and its p name. */
const MAX_HEADER_CELL_LINES = 12;
/** Longest line read as one header cell. */
const MAX_HEADER_CELL = 40;
/** Most non-blank lines looked at after such a header. */
const MAX_CELL_LINES = 600;
/** Lines looked ahead in all, per line of the text. */
const LOOK_AHEAD_PER_LINE = 4;

/**
 * Tables copied one cell per line without a title, that no reader took: a header cell that names a test
 * statistic alone on its line ("F", "χ2") and one that names p ("P", "Sig."), a few cells apart, followed by lines
 * most of which are numbers alone (at least MIN_NUMBER_LINES), overlapping no table found or listed and at most
 * one result read. Listed as not read, so that such a table is never skipped without a word.
 */
function findUntitledCellTables(text: string, covered: readonly Span[], results: readonly Span[]): UnreadTable[] {
  const unread: UnreadTable[] = [];
  const lines = lineSpans(text).filter((line) => line.end > line.start && text.slice(line.start, line.end).trim() !== '');
  // (What each line names, worked out once: the header search looks at each line many times.)
  const names = lines.map((line): 'statistic' | 'p' | null => {
    if (line.end - line.start > MAX_HEADER_CELL) return null;
    const cell = text.slice(line.start, line.end).replace(/\|/g, ' ').trim().toLowerCase();
    return STATISTIC_HEADER.test(cell) ? 'statistic' : P_HEADER.test(cell) ? 'p' : null;
  });
  // (The look-ahead is bounded in total, so a text of many lines naming a statistic stays linear.)
  let budget = LOOK_AHEAD_PER_LINE * lines.length;
  for (let index = 0; index < lines.length && budget > 0; index++) {
    if (names[index] !== 'statistic') continue;
    let pAt = -1;
    for (let at = Math.max(0, index - MAX_HEADER_CELL_LINES); at <= Math.min(lines.length - 1, index + MAX_HEADER_CELL_LINES); at++) {
      if (names[at] === 'p') {
        pAt = at;
        break;
      }
    }
    if (pAt < 0) continue;
    const first = Math.min(index, pAt);
    let numberLines = 0;
    let last = Math.max(index, pAt);
    let seen = 0;
    for (let at = last + 1; at < lines.length && seen < MAX_CELL_LINES && budget > 0; at++, seen++, budget--) {
      const line = text.slice(lines[at]!.start, lines[at]!.end).replace(/\|/g, ' ').trim();
      if (line.length > MAX_TABLE_LINE) break;
      if (NUMBER_LINE.test(line)) {
        numberLines++;
        last = at;
      }
    }
    const block = { start: lines[first]!.start, end: lines[last]!.end };
    const overlaps = (span: Span): boolean => span.start < block.end && block.start < span.end;
    const cellsAfter = last - Math.max(index, pAt);
    if (numberLines < MIN_NUMBER_LINES || numberLines < MIN_NUMBER_LINE_SHARE * cellsAfter || covered.some(overlaps) || results.filter(overlaps).length > MAX_STRAY_RESULTS) continue;
    unread.push({ tableIndex: null, caption: null, start: block.start, end: block.end, rowsWithStatistic: numberLines, rowsRead: 0, reason: 'layout-not-recognised' });
    while (index < lines.length && lines[index]!.start < block.end) index++;
  }
  return unread;
}

function findTitledTables(text: string, tables: readonly DocumentTable[], results: readonly Span[]): UnreadTable[] {
  const unread: UnreadTable[] = [];
  let lineStart = 0;
  while (lineStart < text.length) {
    let lineEnd = text.indexOf('\n', lineStart);
    if (lineEnd === -1) lineEnd = text.length;
    const line = text.slice(lineStart, lineEnd);
    if (line.length <= 300 && TITLE.test(line)) {
      const block = blockAfter(text, lineStart, lineEnd);
      const overlaps = (span: Span): boolean => span.start < block.end && block.start < span.end;
      const caption = [line, ...block.lines.filter((row) => row.trim() !== '').slice(0, 1)].join(' ');
      // (One result read in the block, a test written out in a cell or the caption, does not make the table read.)
      const readInside = results.filter(overlaps).length;
      const numericRows = block.lines.filter((row) => (row.match(/\d/g) ?? []).length >= 2).length;
      // A PDF's text may set a table's caption below its body: a block of short lines, most of them numbers alone,
      // right before the title, that overlaps nothing found or listed, is that table.
      const before = blockBefore(text, lineStart, unread.length > 0 ? unread[unread.length - 1]!.end : 0);
      const beforeOverlaps = (span: Span): boolean => before !== null && span.start < before.end && before.start < span.end;
      if (before !== null && !tables.some(beforeOverlaps) && results.filter(beforeOverlaps).length <= MAX_STRAY_RESULTS && looksLikeResults(before.lines, caption)) {
        unread.push({ tableIndex: null, caption: line.trim(), start: before.start, end: before.end, rowsWithStatistic: before.numberLines, rowsRead: 0, reason: 'layout-not-recognised' });
      }
      if (!tables.some(overlaps) && readInside <= MAX_STRAY_RESULTS && numericRows > 2 * readInside && looksLikeResults(block.lines, caption)) {
        unread.push({
          tableIndex: null,
          caption: line.trim(),
          start: lineStart,
          end: block.end,
          rowsWithStatistic: numericRows,
          rowsRead: readInside,
          reason: 'layout-not-recognised',
        });
        lineStart = block.end + 1;
        continue;
      }
      // A table found in the block but ended early (a row no reader took, "≤50 62 (29.4%) …"): rows of numbers
      // after it, left unread, are listed as a table not read.
      const rest = restAfterTables(text, block, tables.filter(overlaps));
      if (rest !== null && results.filter((span) => span.start < rest.end && rest.start < span.end).length <= MAX_STRAY_RESULTS && looksLikeResults(block.lines, caption)) {
        unread.push({ tableIndex: null, caption: line.trim(), start: rest.start, end: rest.end, rowsWithStatistic: rest.rows, rowsRead: 0, reason: 'layout-not-recognised' });
        lineStart = block.end + 1;
        continue;
      }
    }
    lineStart = lineEnd + 1;
  }
  return unread;
}

/** Rows of at least this many numbers after a found table's end that make the rest of its block a table of its own. */
const MIN_NUMBERS_PER_ROW = 3;
const MIN_ROWS_AFTER = 3;

/** The part of a block after the tables found in it, when it holds rows of numbers; null otherwise. */
function restAfterTables(text: string, block: { start: number; end: number }, found: readonly Span[]): { start: number; end: number; rows: number } | null {
  if (found.length === 0) return null;
  const coveredEnd = Math.max(...found.map((table) => table.end));
  if (coveredEnd >= block.end) return null;
  const lineAfter = text.indexOf('\n', coveredEnd);
  if (lineAfter === -1 || lineAfter >= block.end) return null;
  const start = lineAfter + 1;
  const rows = text
    .slice(start, block.end)
    .split('\n')
    // (With a decimal among them: notes under a table give ranges and dates, "range, 0–18", "2021; 12(2)".)
    .filter((row) => (row.match(/\d*[.,]\d+|\d+/g) ?? []).length >= MIN_NUMBERS_PER_ROW && /\d[.,]\d/.test(row)).length;
  return rows >= MIN_ROWS_AFTER ? { start, end: block.end, rows } : null;
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
    // The first line under a bare title may be a long caption ("Results of the MANCOVAs, ANCOVAs, and ...").
    const caption = lines.every((earlier) => earlier.trim() === '') && line.length <= MAX_CAPTION_LINE;
    // A long line is prose, unless it is mostly numbers (a whole table run onto one line), or a header of long
    // column names over a row of numbers ("Relationship between baseline value and program dose (Spearman's rho)
    // Relationship between …" over "Physical activity (# days/week > 30 min) 0.05 0.06 0.06").
    if (TITLE.test(line) || (!caption && line.length > MAX_TABLE_LINE && !(line.length <= 4000 && digitShare(line) >= 0.25) && !headsNumbers(text, next))) break;
    lines.push(line);
    if (line.trim() !== '') end = next;
    at = next + 1;
  }
  return { start: titleStart, end, lines };
}

/** Most lines looked at before a title for a table whose caption stands below it. */
const MAX_LINES_BEFORE = 400;
/** Share of a block's lines with text that must be numbers alone ("0.20*", "− 0.71") for it to be a table's cells. */
const MIN_NUMBER_LINE_SHARE = 0.5;
/** Fewest such lines. */
const MIN_NUMBER_LINES = 12;
/** A line that is one number, with its sign, stars or footnote letter ("− 0.71", "0.20*", "<0.001"). */
const NUMBER_LINE = /^[-\u2212\u2013<>]? ?(?:\d{1,6}(?:[.,]\d{1,6})?|[.,]\d{1,6})[*\u2020\u2021a-h]{0,3}$/;

/**
 * The block of short lines (one cell each) right before the line at `titleStart`, back to a long line of prose,
 * another title or `floor`, when at least MIN_NUMBER_LINES of its lines, and most of those with text, are numbers
 * alone; null otherwise.
 */
function blockBefore(text: string, titleStart: number, floor: number): { start: number; end: number; lines: string[]; numberLines: number } | null {
  if (titleStart <= floor) return null;
  const lines: string[] = [];
  let start = titleStart;
  let end = -1;
  let at = titleStart - 1;
  while (at > floor && lines.length < MAX_LINES_BEFORE) {
    const lineStart = text.lastIndexOf('\n', at - 1) + 1;
    const line = text.slice(lineStart, at);
    if (line.length > MAX_TABLE_LINE || TITLE.test(line) || lineStart < floor) break;
    if (line.trim() !== '' && end === -1) end = at;
    lines.push(line);
    start = lineStart;
    at = lineStart - 1;
  }
  const filled = lines.filter((line) => line.trim() !== '');
  const numberLines = filled.filter((line) => NUMBER_LINE.test(line.trim())).length;
  if (end === -1 || numberLines < MIN_NUMBER_LINES || numberLines < MIN_NUMBER_LINE_SHARE * filled.length) return null;
  // (The block starts at its first line with text.)
  while (start < end && /\s/.test(text[start]!)) start++;
  return { start, end, lines: lines.reverse(), numberLines };
}

/** Longest line read as a header of long column names over rows of numbers. */
const MAX_LONG_HEADER = 600;

/** Whether the line ending at `lineEnd` is followed, after at most one line (a section's name), by a short line with three numbers or more. */
function headsNumbers(text: string, lineEnd: number): boolean {
  if (lineEnd - text.lastIndexOf('\n', lineEnd - 1) > MAX_LONG_HEADER) return false;
  let at = lineEnd + 1;
  for (let line = 0; line < 2 && at < text.length; line++) {
    let next = text.indexOf('\n', at);
    if (next === -1) next = text.length;
    const row = text.slice(at, next);
    if (row.length <= MAX_TABLE_LINE && (row.match(/[.,]\d/g) ?? []).length >= 3) return true;
    at = next + 1;
  }
  return false;
}

/**
 * Digits among the characters that are not white space. (Counted in one pass: asked of every line naming a p,
 * the copy without spaces and the array of digits cost more than the rest of the search for untitled tables.)
 */
function digitShare(line: string): number {
  let visible = 0;
  let digits = 0;
  for (let index = 0; index < line.length; index++) {
    const code = line.charCodeAt(index);
    if (isWhiteSpace(code)) continue;
    visible++;
    if (code >= 48 && code <= 57) digits++;
  }
  return visible === 0 ? 0 : digits / visible;
}

/** The characters of a regular expression's \s: ASCII white space, no-break and Unicode spaces, line and paragraph separators, the byte-order mark. */
function isWhiteSpace(code: number): boolean {
  if (code <= 32) return code === 32 || (code >= 9 && code <= 13);
  if (code < 0xa0) return false;
  return code === 0xa0 || code === 0x1680 || (code >= 0x2000 && code <= 0x200a) || code === 0x2028 || code === 0x2029 || code === 0x202f || code === 0x205f || code === 0x3000 || code === 0xfeff;
}

/** A title that names a test or correlations ("Table 2 Repeated-measures ANOVA ...", "Correlations between ..."). */
const TITLE_NAMES_TESTS = /\b(?:AN(?:C|M)?OVAs?|MANC?OVAs?|t[- ]tests?|chi[- ]?squared?|\u03c7\s?2|correlat\w*|regressions?|Kruskal|Mann[- ]Whitney|Wilcoxon)\b/i;

/** Below this share of digits a line may be a header. */
const HEADER_DIGIT_SHARE = 0.2;
/**
 * Names of results columns that a copy glued to their neighbours ("Variabledf1df2FpPartial eta-squared%"):
 * found inside words, so only these unmistakable ones.
 */
const GLUED_HEADER_NAMES = /df[12]|[a-z]df[A-Z]|Df[A-Z]|Sig\.|[Ee]ta[- ]squared|Partial eta|\u03b7\s?[p2\u00b2]|p-?value|F-?value|t-?value/;

/** A statistic or p named in the block (or a test in its title), and enough numbers. */
function looksLikeResults(lines: string[], title: string): boolean {
  let numbers = 0;
  let named = TITLE_NAMES_TESTS.test(title);
  for (const line of lines) {
    numbers += (line.match(/\d*[.,]\d+|\d+/g) ?? []).length;
    if (!named) named = line.split(/\||\t| {2,}/).some((cell) => mentionsStatistic(cell.trim())) || line.split(/\s+/).some((word) => mentionsStatistic(word));
    if (!named && digitShare(line) < HEADER_DIGIT_SHARE) named = GLUED_HEADER_NAMES.test(line);
  }
  return named && numbers >= MIN_NUMBERS;
}
