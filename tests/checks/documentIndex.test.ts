/**
 * The per-document index (src/checks/documentIndex.ts) and the indexed
 * look-ups of the scanner give exactly what the former walks over every
 * result gave. The walks are kept here as reference implementations, and
 * the findings of every document of the demo corpus, the labelled corpus and
 * the real corpus are compared with the index and with the walks.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { resolveConfig } from '../../src/checks/config.js';
import { checkResults } from '../../src/checks/engine.js';
import { scopeOf } from '../../src/checks/documentDf.js';
import { DocumentIndex, type SampleStatements } from '../../src/checks/documentIndex.js';
import { plainTextDocument } from '../../src/documents/text.js';
import { groupsWithin, readTextGroups } from '../../src/scan/descriptives/index.js';
import { scanDocument, spanOverlapFinder } from '../../src/scan/scanDocument.js';
import type { DescriptiveSet, DocumentContext, ReportedResult, TableRowOrigin } from '../../src/scan/types.js';
import { result as makeResult } from './helpers.js';

/** The walks the rules did before the index: each looks at every result (or the whole text) for one result. */
class PairwiseIndex extends DocumentIndex {
  constructor(
    private readonly allText: string,
    private readonly context: DocumentContext,
    private readonly all: readonly ReportedResult[],
  ) {
    super(allText, context, all);
  }

  override fTestsSharingErrorDf(result: ReportedResult, errorDf: number, neighbourhood: number): number {
    return this.all.filter(
      (other) => other !== result && other.kind === 'F' && other.df[1]?.value === errorDf && Math.abs(other.start - result.start) <= neighbourhood,
    ).length;
  }

  override descriptivesSeenBefore(set: DescriptiveSet, index: number): boolean {
    const same = (a: DescriptiveSet, b: DescriptiveSet): boolean => a.source === b.source && a.start === b.start && a.end === b.end && a.measure === b.measure;
    return this.all.slice(0, index).some((other) => other.descriptives !== undefined && same(other.descriptives, set));
  }

  override firstWithErrorRow(result: ReportedResult): boolean {
    const mine = result.tableRow;
    if (mine === undefined || mine.errorRow === null) return false;
    const cellStart = (a: TableRowOrigin['cells']): number | undefined => a.df?.start ?? a.ss?.start ?? a.ms?.start;
    const first = this.all.find(
      (other) =>
        other.tableRow?.tableIndex === mine.tableIndex &&
        other.tableRow.errorRow?.rowLabel === mine.errorRow?.rowLabel &&
        cellStart(other.tableRow.errorRow?.cells ?? {}) === cellStart(mine.errorRow?.cells ?? {}),
    );
    return first === result;
  }

  override sampleStatements(): SampleStatements {
    const statements = this.context.sampleSizes;
    const totals = statements.filter((s) => scopeOf(s) === 'total');
    if (totals.length === 0) return { totals, largestTotal: null, otherTotal: undefined, unevenPerGroup: undefined, largerPart: undefined };
    const largest = totals.reduce((a, b) => (b.value > a.value ? b : a));
    return {
      totals,
      largestTotal: largest,
      otherTotal: totals.find((s) => s.value !== largest.value),
      unevenPerGroup: statements.find((s) => scopeOf(s) === 'per-group' && largest.value % s.value !== 0),
      largerPart: statements.find((s) => scopeOf(s) !== 'total' && scopeOf(s) !== 'per-group' && s.value > largest.value),
    };
  }

  override textSays(wording: RegExp): boolean {
    return wording.test(this.allText);
  }
}

function textsIn(folder: string, extensions: readonly string[]): { name: string; text: string }[] {
  return readdirSync(folder)
    .filter((name) => extensions.some((extension) => name.endsWith(extension)))
    .sort()
    .map((name) => ({ name, text: readFileSync(join(folder, name), 'utf8') }));
}

const corpora = {
  demo: textsIn('corpus-demo', ['.txt', '.md']).filter(({ name }) => name !== 'README.md'),
  labelled: textsIn('tests/corpus/labelled', ['.txt']),
  real: textsIn('tests/corpus/real/passages', ['.txt']),
};

describe('the per-document index gives the findings the walks over every result gave', () => {
  // Every rule on, with a wide neighbourhood, so that the indexed look-ups are all exercised.
  const config = resolveConfig({
    rules: {
      'integer-data-granularity': { options: { integerScales: true } },
      'eta-squared-labelled-partial': { options: { neighbourhood: 100000 } },
    },
  });
  const defaults = resolveConfig({});

  for (const [corpus, documents] of Object.entries(corpora)) {
    it(`on the ${corpus} corpus (${documents.length} documents)`, () => {
      expect(documents.length).toBeGreaterThan(5);
      for (const { name, text } of documents) {
        const scan = scanDocument(plainTextDocument(name, 'text', text));
        for (const settings of [defaults, config]) {
          const indexed = checkResults(text, scan, settings);
          const walked = checkResults(text, scan, settings, (t, d, r) => new PairwiseIndex(t, d, r));
          expect(indexed, name).toEqual(walked);
        }
        // Every question a rule may ask, for every result, not only those whose answer changes a finding.
        const indexed = new DocumentIndex(text, scan.context, scan.results);
        const walked = new PairwiseIndex(text, scan.context, scan.results);
        expect(indexed.sampleStatements(), name).toEqual(walked.sampleStatements());
        scan.results.forEach((result, index) => {
          const errorDf = result.df[1]?.value;
          if (errorDf !== undefined) {
            for (const neighbourhood of [0, 300, 1500, 100000]) {
              expect(indexed.fTestsSharingErrorDf(result, errorDf, neighbourhood), name).toBe(walked.fTestsSharingErrorDf(result, errorDf, neighbourhood));
            }
          }
          if (result.descriptives) expect(indexed.descriptivesSeenBefore(result.descriptives, index), name).toBe(walked.descriptivesSeenBefore(result.descriptives, index));
          expect(indexed.firstWithErrorRow(result), name).toBe(walked.firstWithErrorRow(result));
        });
      }
    });
  }

  it('counts neighbouring F tests with the same error df at the edges of the neighbourhood', () => {
    const starts = [0, 100, 100, 250, 400, 401];
    const results = starts.map((start) => makeResult({ kind: 'F', df: ['2', '60'], value: '3.10', start }));
    results.push(makeResult({ kind: 'F', df: ['2', '61'], value: '3.10', start: 120 }), makeResult({ kind: 't', df: ['60'], value: '2.00', start: 110 }));
    const context: DocumentContext = { alpha: null, oneTailed: [], sampleSizes: [], sphericity: [] };
    const indexed = new DocumentIndex('', context, results);
    const walked = new PairwiseIndex('', context, results);
    for (const result of results) {
      for (const neighbourhood of [0, 1, 100, 150, 151, 300, 1000]) {
        expect(indexed.fTestsSharingErrorDf(result, 60, neighbourhood)).toBe(walked.fTestsSharingErrorDf(result, 60, neighbourhood));
      }
    }
  });
});

describe('the scanner finds overlaps and groups by index as it did by walking', () => {
  for (const [corpus, documents] of Object.entries(corpora)) {
    it(`on the ${corpus} corpus`, () => {
      for (const { name, text } of documents) {
        const results = scanDocument(plainTextDocument(name, 'text', text)).results;
        const overlaps = spanOverlapFinder(results);
        const groups = readTextGroups(text);
        // Spans at and around every result and group: starts, ends, empty spans, and spans that cover several.
        const probes = [...results, ...groups].flatMap(({ start, end }) => [
          { start, end },
          { start: end, end: end + 1 },
          { start: start - 1, end: start },
          { start, end: start },
          { start: start - 50, end: end + 50 },
        ]);
        for (const probe of probes) {
          expect(overlaps(probe), name).toBe(results.some((r) => r.start < probe.end && probe.start < r.end));
          expect(groupsWithin(groups, probe.start, probe.end), name).toEqual(groups.filter((g) => g.start >= probe.start && g.end <= probe.end));
        }
      }
    });
  }
});
