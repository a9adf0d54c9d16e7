import type { DocumentTable, Region } from '../documents/types.js';
import { scanText } from './scan.js';
import { findTextTables, readTableResults } from './tables/index.js';
import type { ReportedResult, ScanOutput } from './types.js';

/** What the scanner needs of a document: its text, the tables its format marks up, and its regions. */
export interface ScannableDocument {
  text: string;
  tables: readonly DocumentTable[];
  regions: readonly Region[];
}

function inRegion(offset: number, regions: readonly Region[], kind: Region['kind']): boolean {
  return regions.some((region) => region.kind === kind && offset >= region.start && offset < region.end);
}

/**
 * Every reported result of a document: those written in running text, and
 * those in the rows of test tables (marked-up tables first, then tables
 * found in the text). Results inside the reference list are left out: a
 * cited title such as "F(1, 20) = 4.2 is not enough" is not a result of
 * this document.
 */
export function scanDocument(document: ScannableDocument): ScanOutput {
  const written = scanText(document.text);
  const tabled = readTableResults(document.text, [...document.tables, ...findTextTables(document.text)]).filter(
    // A row the text scanner already read as a written result ("Dose  F < 1  n.s.") is reported once.
    (row) => !written.results.some((result) => result.start < row.end && row.start < result.end),
  );
  const results: ReportedResult[] = [...written.results, ...tabled]
    .filter((result) => !inRegion(result.start, document.regions, 'references'))
    .sort((a, b) => a.start - b.start || a.end - b.end);
  return { results, context: written.context };
}
