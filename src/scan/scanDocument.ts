import type { DocumentTable, Region } from '../documents/types.js';
import { layoutTable, layoutText } from './layoutText.js';
import { scanText } from './scan.js';
import { findTextTables, findUnrecognisedTables, readTables, type RowCompletion, type UnreadTable } from './tables/index.js';
import { readDescriptives } from './descriptives/index.js';
import { paragraphsOf, readFactorialCells } from './factorial/index.js';
import { readComparisons } from './comparisons/readComparisons.js';
import { familiesOf, readAncova, readContrasts, readPrintedComparisons } from './contrasts/index.js';
import type { ReportedNumber, ReportedResult, ScanOutput } from './types.js';

/** What the scanner needs of a document: its text, the tables its format marks up, and its regions. */
export interface ScannableDocument {
  text: string;
  tables: readonly DocumentTable[];
  regions: readonly Region[];
}

function inRegion(offset: number, regions: readonly Region[], kind: Region['kind']): boolean {
  return regions.some((region) => region.kind === kind && offset >= region.start && offset < region.end);
}

/** The tables in reading order, each once (a marked-up table is found again in the text; the first listed is kept). */
function distinctTables(tables: readonly DocumentTable[]): DocumentTable[] {
  const kept: DocumentTable[] = [];
  for (const table of tables) {
    if (!kept.some((other) => table.start < other.end && other.start < table.end)) kept.push(table);
  }
  return kept.sort((a, b) => a.start - b.start);
}

/**
 * Every reported result of a document: those written in running text, and
 * those in the rows of test tables (marked-up tables first, then tables
 * found in the text). Results inside the reference list are left out: a
 * cited title such as "F(1, 20) = 4.2 is not enough" is not a result of
 * this document.
 */
/**
 * A result written in a table cell gets what its row's other cells print:
 * the p of the p column when the cell itself has none, and effect sizes of
 * kinds it lacks. Each completion serves the first result in its cell.
 */
function completeFromRows(text: string, results: ReportedResult[], completions: readonly RowCompletion[]): void {
  for (const completion of completions) {
    const result = results.find((candidate) => candidate.start >= completion.start && candidate.start < completion.end) ?? readWithRowP(text, completion);
    if (result === undefined) continue;
    if (!results.includes(result)) results.push(result);
    if (result.df.length === 0 && completion.df.length > 0) result.df = completion.df;
    if (result.p === null && !result.notSignificant) {
      result.p = completion.p;
      result.notSignificant = completion.notSignificant;
    }
    for (const effect of completion.effects) {
      if (!result.effects.some((existing) => existing.kind === effect.kind)) result.effects.push(effect);
    }
  }
}

/** How a comparator is written, to put a row's p after a cell's text. */
const WRITTEN_COMPARATOR: Record<string, string> = { '=': '=', '<': '<', '>': '>', '<=': '\u2264', '>=': '\u2265' };

/**
 * A result written in a cell without the p that the scanner needs to read a statistic without df ("rs = 0.572",
 * "t = 0.73", "χ2 = 2.40, df = 1"), whose row prints the p in a column of its own: the cell is read as if the p
 * followed it, and the result takes the row's p (its place in the document included). Undefined when the cell
 * holds no such result or the row no p.
 */
function readWithRowP(text: string, completion: RowCompletion): ReportedResult | undefined {
  const p = completion.p;
  if (p === null && !completion.notSignificant) return undefined;
  const cell = text.slice(completion.start, completion.end);
  const comparator = p === null ? null : WRITTEN_COMPARATOR[p.comparator];
  if (p !== null && comparator === undefined) return undefined;
  const tail = p === null ? ', n.s.' : `, p ${comparator} ${p.value.text}`;
  const read = scanText(`${cell}${tail}`).results.find((result) => result.start < cell.length && result.value !== null);
  // An r beside another test of the row ("U = 349c | .211 | r = 0.18") is that test's effect size, not a correlation.
  if (read === undefined || (read.kind === 'r' && completion.besideOtherTest)) return undefined;
  const shift = completion.start;
  return {
    ...read,
    start: read.start + shift,
    end: Math.min(read.end, cell.length) + shift,
    p: p === null ? null : { ...p, value: { ...p.value } },
    notSignificant: completion.notSignificant,
    effects: read.effects.filter((effect) => effect.end <= cell.length).map((effect) => ({ ...effect, start: effect.start + shift, end: effect.end + shift })),
  };
}

/** The same number as printed: value and decimals. */
function sameNumber(a: ReportedNumber | null, b: ReportedNumber | null): boolean {
  return a !== null && b !== null && a.value === b.value && a.decimals === b.decimals;
}

/**
 * A result of a table row that the text restates with the same statistic,
 * df and p ("... as Table 2 shows, F(2, 57) = 4.21, p = .020") is one
 * result: the table's, with the text's place in `alsoAt`. Returns the text
 * results folded into a table result. Each table result takes at most one
 * restatement, the first; a restatement that differs in any printed number
 * is a result of its own (and will be checked on its own).
 */
function mergeRestatements(written: readonly ReportedResult[], tabled: readonly ReportedResult[]): Set<ReportedResult> {
  const folded = new Set<ReportedResult>();
  // Written results by what they print, in document order: each row looks up its twins instead of walking every written result.
  const byPrinted = new Map<string, ReportedResult[]>();
  for (const result of written) {
    const key = printedKey(result);
    if (key !== null) byPrinted.set(key, [...(byPrinted.get(key) ?? []), result]);
  }
  for (const row of tabled) {
    const key = printedKey(row);
    const twin = key === null ? undefined : byPrinted.get(key)?.find((result) => !folded.has(result) && samePrinted(result, row));
    if (twin === undefined) continue;
    folded.add(twin);
    row.alsoAt = [...(row.alsoAt ?? []), { start: twin.start, end: twin.end }];
  }
  return folded;
}

/** True when two results print the same statistic, df and p (a restatement of one in the other). */
function samePrinted(result: ReportedResult, row: ReportedResult): boolean {
  return (
    result.kind === row.kind &&
    sameNumber(result.value, row.value) &&
    result.df.length === row.df.length &&
    result.df.every((df, index) => sameNumber(df, row.df[index]!)) &&
    result.p !== null &&
    row.p !== null &&
    result.p.comparator === row.p.comparator &&
    sameNumber(result.p.value, row.p.value)
  );
}

/**
 * A key equal for results that samePrinted pairs (and, rarely, for others,
 * which samePrinted then tells apart); null for a result that can be no
 * restatement (no statistic or no p).
 */
function printedKey(result: ReportedResult): string | null {
  if (result.value === null || result.p === null) return null;
  const number = (n: ReportedNumber): string => `${n.value}/${n.decimals}`;
  return [result.kind, number(result.value), ...result.df.map(number), result.p.comparator, number(result.p.value)].join('|');
}

/**
 * A test of whether a span overlaps any of `spans`: the spans sorted by
 * start with the running largest end, so each test is a binary search
 * rather than a walk over every span.
 */
export function spanOverlapFinder(spans: readonly { start: number; end: number }[]): (span: { start: number; end: number }) => boolean {
  const sorted = [...spans].sort((a, b) => a.start - b.start);
  const starts = sorted.map((span) => span.start);
  const largestEnd: number[] = [];
  for (const span of sorted) largestEnd.push(Math.max(span.end, largestEnd[largestEnd.length - 1] ?? -Infinity));
  return (span) => {
    // The spans that start before `span` ends; one of them overlaps it when the largest of their ends is past its start.
    let low = 0;
    let high = starts.length;
    while (low < high) {
      const mid = (low + high) >> 1;
      if (starts[mid]! < span.end) low = mid + 1;
      else high = mid;
    }
    return low > 0 && largestEnd[low - 1]! > span.start;
  };
}

/** Least number of rows two tables share before the later one counts as the earlier printed again. */
const MIN_REPRINTED_ROWS = 2;

/**
 * A table printed twice (as an image's alternative text and as the table,
 * or in the text and again in an appendix) is read once: when at least
 * half the results of a later table (and MIN_REPRINTED_ROWS) repeat those
 * of an earlier one with the same statistic, df and p, the repeats are
 * folded into the earlier table's results as `alsoAt`. Returns the folded
 * results. A single row that happens to match another table's is kept.
 */
function mergeReprintedTables(tabled: readonly ReportedResult[]): Set<ReportedResult> {
  const folded = new Set<ReportedResult>();
  const byTable = new Map<number, ReportedResult[]>();
  for (const result of tabled) {
    const index = result.tableRow?.tableIndex;
    if (index === undefined) continue;
    byTable.set(index, [...(byTable.get(index) ?? []), result]);
  }
  // Results of the tables seen so far by what they print (statistic, df, p), so that each later table is
  // compared with the earlier ones through its own rows only (linear in the results, not in table pairs).
  const seen = new Map<string, ReportedResult[]>();
  const keyOf = (result: ReportedResult): string =>
    [result.kind, result.value?.value, result.value?.decimals, ...result.df.map((df) => `${df.value}/${df.decimals}`), result.p?.comparator ?? '', result.p?.value.value ?? '', result.p?.value.decimals ?? ''].join('|');
  for (const later of [...byTable.keys()].sort((a, b) => a - b)) {
    const rows = byTable.get(later)!;
    const candidates = new Map<number, [ReportedResult, ReportedResult][]>();
    const used = new Set<ReportedResult>();
    for (const row of rows) {
      for (const original of seen.get(keyOf(row)) ?? []) {
        const table = original.tableRow!.tableIndex;
        if (used.has(original) || folded.has(original)) continue;
        used.add(original);
        candidates.set(table, [...(candidates.get(table) ?? []), [original, row]]);
        break;
      }
    }
    // The earliest table that this one repeats in at least half its results.
    const repeated = [...candidates.entries()].sort((a, b) => a[0] - b[0]).find(([, pairs]) => pairs.length >= MIN_REPRINTED_ROWS && pairs.length * 2 >= rows.length);
    if (repeated !== undefined) {
      for (const [original, row] of repeated[1]) {
        folded.add(row);
        original.alsoAt = [...(original.alsoAt ?? []), { start: row.start, end: row.end }];
      }
      continue;
    }
    for (const row of rows) seen.set(keyOf(row), [...(seen.get(keyOf(row)) ?? []), row]);
  }
  return folded;
}

/**
 * The tables the reader gave results from or listed as not read: a table found
 * but neither read nor listed (its columns named nothing the reader knows) is
 * left to the search for unrecognised results tables, so that it is not
 * skipped without a word.
 */
function handledTables(tables: readonly DocumentTable[], reading: { results: readonly ReportedResult[]; unread: readonly UnreadTable[] }): DocumentTable[] {
  const overlaps = (table: DocumentTable, span: { start: number; end: number }): boolean => span.start < table.end && table.start < span.end;
  return tables.filter((table) => reading.results.some((result) => result.tableRow !== undefined && overlaps(table, result)) || reading.unread.some((unread) => overlaps(table, unread)));
}

/** A document's scan, with the results tables it could not read in full. */
export type DocumentScan = ScanOutput & { tablesNotRead: UnreadTable[] };

export function scanDocument(document: ScannableDocument): DocumentScan {
  const written = scanText(document.text);
  // (The table and descriptive readers get the text with no-break spaces, full-width signs and lone carriage
  // returns written plainly, at the same offsets.)
  const text = layoutText(document.text);
  const allTables = [...document.tables.map(layoutTable), ...findTextTables(text)];
  const tables = readTables(text, allTables);
  // A row the text scanner already read as a written result ("Dose  F < 1  n.s.") is reported once.
  const overlapsWritten = spanOverlapFinder(written.results);
  const tabled = tables.results.filter((row) => !overlapsWritten(row));
  completeFromRows(text, written.results, tables.completions);
  written.results.sort((a, b) => a.start - b.start);
  const reprinted = mergeReprintedTables(tabled);
  const restated = mergeRestatements(
    written.results,
    tabled.filter((row) => !reprinted.has(row)),
  );
  const results: ReportedResult[] = [...written.results.filter((result) => !restated.has(result)), ...tabled.filter((row) => !reprinted.has(row))]
    .filter((result) => !inRegion(result.start, document.regions, 'references'))
    .sort((a, b) => a.start - b.start || a.end - b.end);
  // Group means, SDs and ns (in the text and in descriptive tables), linked to the tests computed from them.
  const descriptives = readDescriptives(text, distinctTables(allTables), results);
  descriptives.links.forEach((set, index) => {
    if (set !== null) results[index]!.descriptives = set;
  });
  // Cell statistics of factorial designs, linked to the F tests of their effects; such an F is no one-way test of groups.
  const distinct = distinctTables(allTables);
  const factorial = readFactorialCells(text, distinct, results);
  factorial.links.forEach((link, index) => {
    if (link === null) return;
    results[index]!.factorial = link;
    delete results[index]!.descriptives;
  });
  // Pairwise comparisons after an ANOVA, linked to its groups and error term (needs the links above).
  const paragraphs = paragraphsOf(text);
  readComparisons(text, results, paragraphs).forEach((link, index) => {
    if (link !== null) results[index]!.postHoc = link;
  });
  // Planned contrasts, and comparisons printed without a t, after an ANOVA whose groups are printed (needs the links above).
  const families = familiesOf(text, results, written.context.meanSquareErrors ?? []);
  readContrasts(text, results, paragraphs, families).forEach((link, index) => {
    if (link !== null) results[index]!.contrast = link;
  });
  readPrintedComparisons(text, results, families).forEach((found, index) => {
    if (found !== null) results[index]!.printedComparisons = { family: families[index]!, items: found };
  });
  readAncova(text, results, paragraphs).forEach((link, index) => {
    if (link !== null) results[index]!.ancova = link;
  });
  return {
    results,
    context: written.context,
    descriptives: descriptives.sets.filter((set) => !inRegion(set.start, document.regions, 'references')),
    cellSets: factorial.sets.filter((set) => !inRegion(set.start, document.regions, 'references')),
    tablesNotRead: [...tables.unread, ...findUnrecognisedTables(text, handledTables(allTables, tables), written.results)]
      .filter((table) => !inRegion(table.start, document.regions, 'references'))
      // A table read as a factorial design's cell statistics was read.
      .filter((table) => !factorial.sets.some((set) => set.source === 'table' && set.start < table.end && table.start < set.end))
      .sort((a, b) => a.start - b.start),
  };
}
