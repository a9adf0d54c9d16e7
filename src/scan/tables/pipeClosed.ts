/**
 * Tables a web page copied one cell per line with a line holding a lone "|"
 * after every cell, as a preprint server's pages give them:
 *
 *     Z
 *     |
 *     |
 *     -4.576
 *     |
 *     -5.317
 *     |
 *
 * Each such pipe closes the cell above it; a pipe right after another is an
 * empty cell. The readers of one-cell-per-line and transposed tables take a
 * lone pipe for an empty cell (as it is where a copy closes only its empty
 * cells), which here doubles every row and puts no column's values in line.
 * This gives them the lines as such a copy reads: closing pipes marked as
 * no cell, a cell written over lines joined. Linear in the lines read.
 */

import type { TextLine } from './cells.js';

type Line = TextLine;

/** Longest cell; a longer line is prose and ends the table (as in the one-cell-per-line reader). */
const MAX_CELL_LENGTH = 120;

/** Lines looked at for a copy that closes each cell with a lone "|". */
const PIPE_CLOSED_PROBE = 40;
/** Fewest lone "|" lines among them, each right after a cell, that show such a copy. */
const MIN_CLOSING_PIPES = 6;
/** Most lines of one cell in such a copy ("Frequency (n)" / "/Percentage (%)" / "|"). */
const MAX_LINES_PER_CLOSED_CELL = 3;

/** Whether a line is a lone "|" (spaces around it allowed). */
function isLonePipe(text: string): boolean {
  return text.trim() === '|';
}

/**
 * A web page's table copied one cell per line with a line holding a lone "|" after every cell ("Z" / "|" / "|" /
 * "-4.576" / "|"): each such pipe closes the cell above it, and a pipe right after another is an empty cell. Read
 * as one pipe for each, a row of five cells becomes ten, empty and filled alternating, and no column's values line
 * up. The lines from `from` as such a copy reads them, or null when they are not one: the closing pipes marked
 * (they are no cells), a cell written over two or three lines joined on its first ("Frequency (n)" /
 * "/Percentage (%)"), and everything else as it was (caption lines before the first cell, which is the line right
 * before the first pipe, too). The copy is recognised from its first lines: at least MIN_CLOSING_PIPES pipes that
 * close a cell, and after the first no run of text lines longer than a cell's.
 */
export function linesClosedByPipes(lines: Line[], from: number): Line[] | null {
  let closing = 0;
  let textRun = 0;
  for (let index = from; index < lines.length && index < from + PIPE_CLOSED_PROBE; index++) {
    const text = lines[index]!.text.trim();
    if (text === '') continue;
    if (isLonePipe(text)) {
      if (textRun > 0) closing++;
      textRun = 0;
      continue;
    }
    // (Caption lines under the title before the first cell are not counted: the copy's cells start after them.)
    if (++textRun > MAX_LINES_PER_CLOSED_CELL && closing > 0) return null;
  }
  if (closing < MIN_CLOSING_PIPES) return null;
  let firstPipe = from;
  while (!isLonePipe(lines[firstPipe]!.text)) firstPipe++;
  const read = lines.slice();
  // The first line of the cell open (text since the last pipe), or -1.
  let open = -1;
  let linesInCell = 0;
  for (let index = Math.max(from, firstPipe - 1); index < lines.length; index++) {
    const line = lines[index]!;
    const text = line.text.trim();
    if (text === '') {
      open = -1;
      continue;
    }
    if (isLonePipe(text)) {
      if (open !== -1) read[index] = { ...line, text: '', closesCell: true };
      open = -1;
      continue;
    }
    // (A line longer than a cell is prose after the table: the copy ends there.)
    if (text.length > MAX_CELL_LENGTH) break;
    if (open !== -1 && linesInCell < MAX_LINES_PER_CLOSED_CELL && line.start > read[open]!.end) {
      // (Joined with the characters between as spaces, so the cell's text keeps its place in the document.)
      const cell = read[open]!;
      read[open] = { ...cell, text: cell.text + ' '.repeat(line.start - cell.end) + line.text, end: line.end };
      read[index] = { ...line, text: '', closesCell: true };
      linesInCell++;
      continue;
    }
    open = index;
    linesInCell = 1;
  }
  return read;
}
