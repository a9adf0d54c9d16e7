/**
 * Factorial designs' cell statistics (tables and text) and their link to
 * the F tests of the same design: readCellTable.ts reads tables,
 * readCellText.ts running text with a design statement, linkCells.ts
 * decides which F tests which effect of which set.
 */

import type { DocumentTable } from '../../documents/types.js';
import type { FactorialCellSet, FactorialLink, ReportedResult } from '../types.js';
import { readTextGroups } from '../descriptives/readTextDescriptives.js';
import { integerStatements } from '../descriptives/index.js';
import { readCellTable } from './readCellTable.js';
import { readCellText } from './readCellText.js';
import { linkCellSets, type Paragraph } from './linkCells.js';

export { readCellTable } from './readCellTable.js';
export { readCellText, readDesignStatements } from './readCellText.js';
export { linkCellSets, termOfRowLabel, termOfWrittenLabel } from './linkCells.js';
import { paragraphsOf } from '../paragraphs.js';
export { paragraphsOf };

/** Characters looked back from a table without a caption for the caption line a reader left in the text. */
const CAPTION_LOOK_BACK = 300;

/**
 * The caption of a marked-up table whose reader kept none ("Table 1
 * Seedling height ..." left in the text just above it): the last two
 * non-blank lines before the table, when one starts with "Table N".
 */
function captionAbove(text: string, start: number): string | null {
  const lines = text
    .slice(Math.max(0, start - CAPTION_LOOK_BACK), start)
    .split('\n')
    .map((line) => line.trim())
    .filter((line) => line !== '')
    .slice(-2);
  const first = lines.findIndex((line) => /^Table\s[A-Z]?\d{1,3}[A-Za-z]?\b/.test(line));
  return first < 0 ? null : lines.slice(first).join(' ');
}

export interface FactorialReading {
  /** Every set of cell statistics found, in document order. */
  sets: FactorialCellSet[];
  /** The link of each result (same order as given), or null. */
  links: (FactorialLink | null)[];
}

/**
 * Reads the cell statistics of factorial designs in `tables` (the
 * document's tables, distinct, in reading order) and `text`, and links
 * `results` to them.
 */
export function readFactorialCells(text: string, tables: readonly DocumentTable[], results: readonly ReportedResult[]): FactorialReading {
  const paragraphs = paragraphsOf(text);
  const sets: FactorialCellSet[] = [];
  tables.forEach((table, index) => {
    const caption = table.caption ?? captionAbove(text, table.start);
    const set = readCellTable(caption === table.caption ? table : { ...table, caption }, index);
    if (set === null) return;
    // A whole-number outcome stated in the caption, notes or header rows (offsets: the table's).
    const scope = [caption ?? '', ...table.notes, ...table.rows.slice(0, 3).flat()].join('\n');
    const statement = integerStatements(scope, 0, scope.length)[0];
    sets.push(statement === undefined ? set : { ...set, integerScale: { ...statement, start: table.start, end: table.end } });
  });
  for (const set of readCellText(text, readTextGroups(text), paragraphs)) {
    const paragraph = paragraphs.find((candidate) => candidate.start <= set.start && set.start <= candidate.end)!;
    sets.push({ ...set, integerScale: integerStatements(text, paragraph.start, paragraph.end)[0] ?? null });
  }
  sets.sort((a, b) => a.start - b.start);
  return { sets, links: linkCellSets(text, sets, results, paragraphs) };
}
