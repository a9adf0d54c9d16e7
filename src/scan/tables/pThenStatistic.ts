/**
 * Tables whose last column names a p with its chi-square in brackets ("P value (χ2)", "p (χ2, df)"), each test's
 * cell holding the p first, then the chi-square and its df ("0.001 (12.05,1)"), as tables of risk factors print
 * them:
 *
 *     Table 5.
 *     Risk factors associated with tick infestation
 *     Variables Condition No. examined … Relative risk (95% confidence interval) P value (χ2)
 *     Gender Male 330 294 (91) 312.0 (25.46) 0.7432 (0.64–0.85) 0.001 (12.05,1)
 *     Female 74 30 (9) 52.00 (31.11)
 *
 * The other columns' names are often words no vocabulary knows, and the rows crushed into single spaces; but the
 * test's cell says everything by itself in the order the header names, so only that cell is read: a row whose line
 * ends in it becomes "label | χ2 | df | p" for the table reader, each cell pointing at its place in the text. A
 * line that does not end in such a cell (a factor's second level, on a line of its own) gives nothing.
 *
 * Read only under a "Table N" title a few lines above the header, so that a sentence ending "p (χ2)" starts none.
 */

import type { CellSpan, DocumentTable } from '../../documents/types.js';
import { TABLE_TITLE, type TextLine } from './cells.js';
import { captionBetween, tableOverLines, titleLineAbove } from './rebuilt.js';

type Line = TextLine;

/** The header's last name: "P value (χ2)", "p (χ2, df)", "P-value (chi-square)", "p (X2)". */
const P_THEN_CHI_SQUARE = /(?:^|\s)p(?:[- ]?values?)? ?\( ?(?:χ2|χ²|χ\^?\{?2\}?|x2|x²|chi2|chi-square|chi square)(?: ?, ?df)? ?\)\s*$/i;
/**
 * A test's cell ending its row: a p (or a bound, "<0.001"), then the chi-square and its df in brackets. Groups: the
 * bound, the p, the chi-square, the df. Bounded pieces, no nested quantifiers.
 */
const P_STATISTIC_DF_CELL = /(?:^|\s)(< ?)?(0?\.\d{1,6}|1(?:\.0{1,4})?) ?\( ?(\d{1,4}(?:\.\d{1,4})?) ?, ?(\d{1,3}) ?\)\s*$/;
/** Most non-blank lines between the title and the header (the caption's lines). */
const MAX_CAPTION_LINES = 3;
/** Most lines of a table after its header. */
const MAX_ROWS = 60;
/** Longest line read as a header or a row. */
const MAX_LINE = 400;


/** A table whose header is `lines[index]` and ends with "P value (χ2)", or null. */
export function readPThenStatisticTable(lines: Line[], index: number): { table: DocumentTable; firstLine: number; lastLine: number } | null {
  const header = lines[index]!;
  if (header.text.length > MAX_LINE || !header.text.includes('(') || !P_THEN_CHI_SQUARE.test(header.text)) return null;
  const title = titleLineAbove(lines, index, MAX_CAPTION_LINES);
  if (title < 0) return null;
  const rows: string[][] = [['', 'χ2', 'df', 'p']];
  const cells: (CellSpan | null)[][] = [[null, null, null, null]];
  let lastLine = index;
  for (let at = index + 1; at < lines.length && at <= index + MAX_ROWS; at++) {
    const line = lines[at]!;
    const text = line.text;
    // A blank line, a note or the next title ends the table; so does a line of prose.
    if (text.trim() === '' || text.length > MAX_LINE || TABLE_TITLE.test(text) || /^\s*(?:Notes?\b|Abbreviations?\b)/.test(text)) break;
    lastLine = at;
    const match = P_STATISTIC_DF_CELL.exec(text);
    if (match === null) continue;
    const cellStart = match.index + match[0].length - match[0].trimStart().length;
    // The row's label: its words before its first number (the other columns' values are not read).
    const before = text.slice(0, cellStart);
    const firstNumber = /(?:^|\s)[-\u2212\u2013<]?\.?\d/.exec(before);
    const label = (firstNumber === null ? before : before.slice(0, firstNumber.index)).trim();
    if (label === '') continue;
    const [, bound, p, statistic, df] = match;
    const pFrom = cellStart;
    const pTo = text.indexOf(p!, pFrom) + p!.length;
    const statisticFrom = text.indexOf(statistic!, pTo);
    const dfFrom = text.indexOf(df!, statisticFrom + statistic!.length);
    const labelFrom = text.length - text.trimStart().length;
    rows.push([label, statistic!, df!, `${bound ?? ''}${p!}`]);
    cells.push([
      { start: line.start + labelFrom, end: line.start + labelFrom + label.length },
      { start: line.start + statisticFrom, end: line.start + statisticFrom + statistic!.length },
      { start: line.start + dfFrom, end: line.start + dfFrom + df!.length },
      { start: line.start + pFrom, end: line.start + pTo },
    ]);
  }
  if (rows.length < 2) return null;
  return { table: tableOverLines(lines[title]!, lines[lastLine]!, captionBetween(lines, title, index), rows, cells, 'positions'), firstLine: title, lastLine };
}
