/**
 * One real table, read the same in the renderings copies give it. Web pages
 * and PDFs hand the same table over as pipe rows, as tab-separated rows or
 * crushed into single spaces; the passages here are real pipe tables from
 * tests/corpus/real/passages (source and licence in their label files),
 * re-rendered by moving their cells, never changing a cell.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { plainTextDocument } from '../../../src/documents/text.js';
import { scanDocument } from '../../../src/scan/scanDocument.js';
import type { ReportedResult } from '../../../src/scan/types.js';

const passage = (id: string): string => readFileSync(join(__dirname, '..', '..', 'corpus', 'real', 'passages', `${id}.txt`), 'utf8');

/** The cells of each pipe row (separator rows left out), other lines as they are. */
function rowsOf(text: string): (string[] | string)[] {
  return text
    .split('\n')
    .filter((line) => !/^\s*\|?\s*-{3,}/.test(line))
    .map((line) => (line.includes('|') ? line.replace(/^\s*\|\s*/, '').replace(/\s*\|\s*$/, '').split(/\s*\|\s*/) : line));
}

const asTabs = (text: string): string => rowsOf(text).map((row) => (Array.isArray(row) ? row.join('\t') : row)).join('\n');
const crushed = (text: string): string => rowsOf(text).map((row) => (Array.isArray(row) ? row.filter((cell) => cell !== '').join(' ') : row)).join('\n');

function read(text: string): string[] {
  return scanDocument(plainTextDocument('table.txt', 'text', text))
    .results.filter((result) => result.tableRow)
    .map((result: ReportedResult) => {
      const p = result.p ? ` p ${result.p.comparator} ${result.p.value.text}` : '';
      return `${result.kind}(${result.df.map((d) => d.text).join(', ')}) ${result.valueComparator} ${result.value?.text}${p}`;
    });
}

describe('the same real table in other renderings', () => {
  it.each(['tab-06', 'more-04', 'soft-04', 'divf-01', 'divf-02', 'divb-01'])('%s: tab-separated rows give what pipe rows give', (id) => {
    const piped = read(passage(id));
    expect(piped.length).toBeGreaterThan(0);
    expect(read(asTabs(passage(id)))).toEqual(piped);
  });

  it.each(['tab-06', 'more-04', 'soft-10', 'divf-02'])('%s: rows crushed into single spaces give what pipe rows give', (id) => {
    const piped = read(passage(id));
    expect(piped.length).toBeGreaterThan(0);
    expect(read(crushed(passage(id)))).toEqual(piped);
  });
});
