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
  it.each(['tab-06', 'more-04', 'soft-04', 'divf-01', 'divf-02', 'divb-01', 'divb-08'])('%s: tab-separated rows give what pipe rows give', (id) => {
    const piped = read(passage(id));
    expect(piped.length).toBeGreaterThan(0);
    expect(read(asTabs(passage(id)))).toEqual(piped);
  });

  it.each(['tab-06', 'more-04', 'soft-10', 'divf-02', 'soft-04', 'divf-01', 'divn-07'])('%s: rows crushed into single spaces give what pipe rows give', (id) => {
    const piped = read(passage(id));
    expect(piped.length).toBeGreaterThan(0);
    expect(read(crushed(passage(id)))).toEqual(piped);
  });
});

describe('a real table printed twice', () => {
  // As a PDF's or web page's text can give it: the table's rows crushed into an image's alternative text, then the table itself.
  it('is read once, the second printing given as another place of each result (tab-06)', () => {
    const text = passage('tab-06');
    const once = read(text);
    const twice = `${crushed(text)}\n\n${text}`;
    const scan = scanDocument(plainTextDocument('table.txt', 'text', twice));
    expect(read(twice)).toEqual(once);
    const tabled = scan.results.filter((result) => result.tableRow);
    expect(tabled.every((result) => result.alsoAt?.length === 1 && result.alsoAt[0]!.start > result.end)).toBe(true);
  });

  it('keeps two tables that share a single row apart', () => {
    const first = 'Table 1. Study 1\n| Source | F | df | p |\n|---|---|---|---|\n| Dose | 4.21 | 2, 57 | .020 |\n| Sex | 1.10 | 1, 57 | .30 |\n';
    const second = '\n\nTable 2. Study 2\n| Source | F | df | p |\n|---|---|---|---|\n| Dose | 4.21 | 2, 57 | .020 |\n| Age | 6.50 | 1, 57 | .014 |\n';
    expect(read(first + second)).toHaveLength(4);
  });
});
