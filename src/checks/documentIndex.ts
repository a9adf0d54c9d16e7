/**
 * What rules need to know about the other results and statements of a
 * document, indexed once per document so that checking stays linear in the
 * number of results: a rule asks the index instead of walking every other
 * result (or the whole text) for each result it checks.
 *
 * Each part is built on first use, so a document whose rules never ask for
 * it (or whose rules are switched off) does not pay for it. Every answer is
 * the one the former walk over all results gave; tests/checks/documentIndex
 * keeps those walks as reference implementations and compares.
 */

import type { DescriptiveSet, DocumentContext, ReportedResult, StatedSampleSize } from '../scan/types.js';
import { scopeOf } from './documentDf.js';
import { partitionPoint } from '../sortedSearch.js';

/** The stated sample sizes, sorted by what a sample-size rule asks of them. */
export interface SampleStatements {
  /** Statements of the whole sample ('total' scope), in document order. */
  totals: StatedSampleSize[];
  /** The total with the largest value (the first of equals), or null without totals. */
  largestTotal: StatedSampleSize | null;
  /** A total whose value differs from the largest: the document states several samples. */
  otherTotal: StatedSampleSize | undefined;
  /** A size per group that does not divide the largest total into whole groups. */
  unevenPerGroup: StatedSampleSize | undefined;
  /** A part of the study or a single test stated larger than the largest total. */
  largerPart: StatedSampleSize | undefined;
}

/** Starts of F tests that share an error df value, sorted, for counting neighbours by binary search. */
type StartsByErrorDf = Map<number, number[]>;

/** Index of the first element of sorted `values` that is >= `bound`. */
function lowerBound(values: readonly number[], bound: number): number {
  return partitionPoint(values.length, (index) => values[index]! < bound);
}

/** Index of the first element of sorted `values` that is > `bound`. */
function upperBound(values: readonly number[], bound: number): number {
  return partitionPoint(values.length, (index) => values[index]! <= bound);
}

/**
 * The starts of the F tests of a document by the value of their error df.
 * NaN df are left out: NaN equals nothing, not even itself, so such a test
 * shares its error df with no other.
 */
export function fTestStartsByErrorDf(results: readonly ReportedResult[]): StartsByErrorDf {
  const byDf: StartsByErrorDf = new Map();
  for (const result of results) {
    const errorDf = result.df[1];
    if (result.kind !== 'F' || errorDf === undefined || Number.isNaN(errorDf.value)) continue;
    const starts = byDf.get(errorDf.value);
    if (starts === undefined) byDf.set(errorDf.value, [result.start]);
    else starts.push(result.start);
  }
  for (const starts of byDf.values()) starts.sort((a, b) => a - b);
  return byDf;
}

/**
 * How many F tests other than `result` have the error df value `errorDf`
 * and start within `neighbourhood` characters of it. `result` itself is one
 * of the indexed tests when it is an F with that error df, and is not counted.
 */
export function countFTestsNear(byDf: StartsByErrorDf, result: ReportedResult, errorDf: number, neighbourhood: number): number {
  const starts = byDf.get(errorDf);
  if (starts === undefined) return 0;
  const within = upperBound(starts, result.start + neighbourhood) - lowerBound(starts, result.start - neighbourhood);
  const itself = result.kind === 'F' && result.df[1]?.value === errorDf ? 1 : 0;
  return within - itself;
}

/** What makes two descriptive sets the same set: where they come from, where they are, and the measure. */
export function descriptiveSetKey(set: DescriptiveSet): string {
  // The measure goes last: it is the only part that may hold the separator.
  return `${set.source}|${set.start}|${set.end}|${set.measure}`;
}

/** For each descriptive set (by key), the index of the first result it is linked to. */
export function firstResultOfDescriptives(results: readonly ReportedResult[]): Map<string, number> {
  const first = new Map<string, number>();
  results.forEach((result, index) => {
    if (!result.descriptives) return;
    const key = descriptiveSetKey(result.descriptives);
    if (!first.has(key)) first.set(key, index);
  });
  return first;
}

/** The offset that identifies an error row within its table: its df, SS or MS cell, whichever is printed first in that order. */
function errorRowCellStart(cells: NonNullable<ReportedResult['tableRow']>['cells']): number | undefined {
  return cells.df?.start ?? cells.ss?.start ?? cells.ms?.start;
}

/**
 * The key of a result's error row: its table, its label and where it
 * starts. Null for a result that is no table row or has no error row.
 */
export function errorRowKey(result: ReportedResult): string | null {
  const row = result.tableRow;
  if (row === undefined || row.errorRow === null) return null;
  // The label goes last: it is the only part that may hold the separator.
  return `${row.tableIndex}|${errorRowCellStart(row.errorRow.cells)}|${row.errorRow.rowLabel}`;
}

/** For each error row (by key), the first result of the document that uses it. */
export function firstResultOfErrorRows(results: readonly ReportedResult[]): Map<string, ReportedResult> {
  const first = new Map<string, ReportedResult>();
  for (const result of results) {
    const key = errorRowKey(result);
    if (key !== null && !first.has(key)) first.set(key, result);
  }
  return first;
}

/** The stated sample sizes as df-exceeds-sample weighs them (see SampleStatements). */
export function sampleStatements(context: DocumentContext): SampleStatements {
  const statements = context.sampleSizes;
  const totals = statements.filter((statement) => scopeOf(statement) === 'total');
  const largestTotal = totals.length === 0 ? null : totals.reduce((a, b) => (b.value > a.value ? b : a));
  if (largestTotal === null) return { totals, largestTotal, otherTotal: undefined, unevenPerGroup: undefined, largerPart: undefined };
  return {
    totals,
    largestTotal,
    otherTotal: totals.find((statement) => statement.value !== largestTotal.value),
    unevenPerGroup: statements.find((statement) => scopeOf(statement) === 'per-group' && largestTotal.value % statement.value !== 0),
    largerPart: statements.find((statement) => scopeOf(statement) !== 'total' && scopeOf(statement) !== 'per-group' && statement.value > largestTotal.value),
  };
}

/**
 * The per-document index a rule reads through its check context. Built by
 * the engine once per document; each part on first use.
 */
export class DocumentIndex {
  private fStarts: StartsByErrorDf | undefined;
  private descriptivesFirst: Map<string, number> | undefined;
  private errorRowsFirst: Map<string, ReportedResult> | undefined;
  private samples: SampleStatements | undefined;
  private readonly wordingFound = new Map<RegExp, boolean>();

  constructor(
    private readonly text: string,
    private readonly document: DocumentContext,
    private readonly results: readonly ReportedResult[],
  ) {}

  /** How many other F tests share `errorDf` as their error df and start within `neighbourhood` characters of `result`. */
  fTestsSharingErrorDf(result: ReportedResult, errorDf: number, neighbourhood: number): number {
    if (Number.isNaN(errorDf)) return 0;
    this.fStarts ??= fTestStartsByErrorDf(this.results);
    return countFTestsNear(this.fStarts, result, errorDf, neighbourhood);
  }

  /** True when an earlier result of the document (before `index`) is linked to the same descriptive set. */
  descriptivesSeenBefore(set: DescriptiveSet, index: number): boolean {
    this.descriptivesFirst ??= firstResultOfDescriptives(this.results);
    const first = this.descriptivesFirst.get(descriptiveSetKey(set));
    return first !== undefined && first < index;
  }

  /** True when `result` is the first of the document to use its error row (false without one). */
  firstWithErrorRow(result: ReportedResult): boolean {
    const key = errorRowKey(result);
    if (key === null) return false;
    this.errorRowsFirst ??= firstResultOfErrorRows(this.results);
    return this.errorRowsFirst.get(key) === result;
  }

  /** The document's stated sample sizes, sorted for df-exceeds-sample. */
  sampleStatements(): SampleStatements {
    this.samples ??= sampleStatements(this.document);
    return this.samples;
  }

  /** Whether `wording` (a pattern without the g or y flag) occurs anywhere in the text; searched once per pattern. */
  textSays(wording: RegExp): boolean {
    let found = this.wordingFound.get(wording);
    if (found === undefined) this.wordingFound.set(wording, (found = wording.test(this.text)));
    return found;
  }
}
