/**
 * Tables rebuilt from word positions (src/documents/pdfLayout.ts), first on
 * words placed by hand (each rule on its own), then on the PDF fixtures of
 * tests/fixtures/pdf-tables/ read by both engines. The fixtures are printed
 * by Chromium from HTML (make-fixtures.mjs) with rows copied from real,
 * openly licensed table passages of tests/corpus/real/passages/: pdf-01
 * (anova-blocks.pdf), tab-02 (two-level-header.pdf), tab-06
 * (wrapped-labels.pdf), soft-06 with prose from soft-07 and soft-08
 * (two-column.pdf).
 */
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { PDFParse } from 'pdf-parse';
import { findPageTables, groupLines, isNumberish, type PageWord } from '../../src/documents/pdfLayout.js';
import { BboxWordLocator, pdfjsPageText, locateWords, parseBboxPages, type PdfJsStyles, type PdfJsViewport } from '../../src/documents/pdfWords.js';
import { composePage, mayHoldTable, writeTable } from '../../src/documents/pdfCompose.js';
import { pdfDocument } from '../../src/documents/pdf.js';
import type { DocumentTable, DocumentText } from '../../src/documents/types.js';
import { scanDocument } from '../../src/scan/scanDocument.js';
import { demo, DEMO_MANUSCRIPTS, expectWellFormedRegions, pdftotextMissing, readOk } from './helpers.js';

const tablesFixture = (name: string): string => fileURLToPath(new URL(`../fixtures/pdf-tables/${name}`, import.meta.url));

// ------------------------------------------------------ words by hand

/** A word 5 pt per character wide and 10 pt high, at (x, top). */
function word(x: number, top: number, text: string, height = 10): PageWord {
  return { text, x0: x, x1: x + 5 * text.length, top, bottom: top + height };
}

/** Words of lines given as [top, [[x, text], ...]], in the order listed (the drawing order). */
function page(lines: [number, [number, string][]][]): PageWord[] {
  return lines.flatMap(([top, cells]) => cells.flatMap(([x, text]) => text.split(' ').reduce<PageWord[]>((out, part) => {
    const at = out.length === 0 ? x : out[out.length - 1]!.x1 + 2.5;
    out.push(word(at, top, part));
    return out;
  }, [])));
}

describe('pdfLayout on words placed by hand', () => {
  it('keeps a raised or lowered index on its line', () => {
    const words = [word(100, 100, 'Source'), word(200, 100, 'η'), word(205, 104, 'p', 8), word(210, 97, '2', 8), word(100, 120, 'Next')];
    const lines = groupLines(words);
    expect(lines.map((line) => line.words.sort((a, b) => a - b))).toEqual([[0, 1, 2, 3], [4]]);
  });

  it('tells number cells from text cells', () => {
    for (const text of ['4.21', '<.001', '0.59 (0.5)', '3.48 (33)', '–0.75 (29)', '—', 'n.s.', 'N/A', '2, 180', 'F(1, 58) = 14.62', 'p<0.001', '1.84 × 10−5']) expect(isNumberish(text), text).toBe(true);
    for (const text of ['T1', 'Phase 2', 'Table 8', 'Intervention (n=63)', 'Source', '', 'ηp2']) expect(isNumberish(text), text).toBe(false);
  });

  it('rebuilds an ANOVA table with its caption, header, Error row and note', () => {
    const words = page([
      [60, [[50, 'Table 1']]],
      [74, [[50, 'Analysis of variance']]],
      [92, [[50, 'Source'], [200, 'SS'], [250, 'df'], [290, 'MS'], [340, 'F'], [380, 'p']]],
      [106, [[50, 'Condition'], [185, '12.40'], [250, '2'], [285, '6.20'], [335, '4.21'], [375, '.018']]],
      [120, [[50, 'Error'], [180, '130.22'], [245, '88'], [285, '1.48']]],
      [140, [[50, 'Note. Values are made up.']]],
      [175, [[50, 'The next paragraph goes on with a sentence of running text.']]],
    ]);
    const [table, ...others] = findPageTables(words);
    expect(others).toEqual([]);
    expect(table!.caption).toBe('Table 1 Analysis of variance');
    expect(table!.headerRows).toBe(1);
    expect(table!.rows).toEqual([
      ['Source', 'SS', 'df', 'MS', 'F', 'p'],
      ['Condition', '12.40', '2', '6.20', '4.21', '.018'],
      ['Error', '130.22', '88', '1.48', '', ''],
    ]);
    expect(table!.notes).toEqual(['Note. Values are made up.']);
    // The paragraph after the note is not the table's.
    const taken = new Set(table!.words.map((index) => words[index]!.text));
    expect(taken.has('paragraph')).toBe(false);
  });

  it('joins a label that wraps onto the next line, and keeps a group heading as a row of its own', () => {
    // Rows 15 pt apart, lines inside a cell 11 pt apart.
    const words = page([
      [100, [[50, 'Label'], [150, 'F'], [200, 'df'], [250, 'p']]],
      [115, [[50, 'Digit span'], [150, '2.26'], [200, '2'], [250, '.11']]],
      [126, [[50, 'forwards']]],
      [141, [[50, 'Memory']]],
      [156, [[55, 'Recall'], [150, '1.49'], [200, '2'], [250, '.23']]],
      [171, [[55, 'Recognition'], [150, '1.72'], [200, '2'], [250, '.18']]],
    ]);
    const [table] = findPageTables(words);
    expect(table!.rows.map((row) => row[0])).toEqual(['Label', 'Digit span forwards', 'Memory', 'Recall', 'Recognition']);
    expect(table!.rows[2]).toEqual(['Memory', '', '', '']);
  });

  it('gives the label of a row set in the middle of two label lines to its numbers', () => {
    // HTML tables centre cells vertically: the numbers stand between the label's two lines.
    const words = page([
      [100, [[50, 'Label'], [150, 'F'], [200, 'df'], [250, 'p']]],
      [115, [[50, 'Time by']]],
      [120, [[150, '6.32'], [200, '2'], [250, '.002']]],
      [126, [[50, 'location']]],
      [141, [[50, 'Location'], [150, '2.21'], [200, '2'], [250, '.11']]],
    ]);
    const [table] = findPageTables(words);
    expect(table!.rows.slice(1)).toEqual([
      ['Time by location', '6.32', '2', '.002'],
      ['Location', '2.21', '2', '.11'],
    ]);
  });

  it('puts a header cell over the columns of the names under it, and joins a header cell that wraps', () => {
    const words = page([
      [100, [[165, 'Within group diff']]],
      [112, [[100, 'F']]],
      [123, [[50, 'Source'], [100, 'value'], [160, 'd'], [200, 't'], [240, 'p']]],
      [138, [[50, 'Anger'], [100, '4.20'], [155, '0.60'], [195, '3.48'], [235, '.001']]],
      [153, [[50, 'Mood'], [100, '1.10'], [155, '0.27'], [195, '1.48'], [240, '.15']]],
    ]);
    const [table] = findPageTables(words);
    expect(table!.headerRows).toBe(2);
    expect(table!.rows.slice(0, 2)).toEqual([
      ['', '', 'Within group diff', '', ''],
      ['Source', 'F value', 'd', 't', 'p'],
    ]);
    // "Within group diff" stands over the names of all three columns of its block.
    expect(table!.spans[0]).toEqual([1, 1, 3, 0, 0]);
  });

  it('reads a table in the right column of a two-column page without the prose of the left column', () => {
    // Left column first (drawn first), numbers in it; the table in the right column, its rows level with prose lines.
    const left: [number, [number, string][]][] = [];
    for (let line = 0; line < 12; line++) left.push([100 + 14 * line, [[40, `left column text line ${line} with F = 4.${line} and p = .0${line} in it`]]]);
    const right: [number, [number, string][]][] = [
      [100, [[420, 'Table 2']]],
      [114, [[420, 'Source'], [520, 'df'], [560, 'F'], [600, 'p']]],
      [128, [[420, 'Group'], [520, '1'], [555, '4.83'], [595, '.031']]],
      [142, [[420, 'Error'], [515, '71'], [555, '1.00'], [595, '.500']]],
    ];
    const words = page([...left, ...right]);
    const tables = findPageTables(words);
    expect(tables).toHaveLength(1);
    expect(tables[0]!.caption).toBe('Table 2');
    expect(tables[0]!.rows).toEqual([
      ['Source', 'df', 'F', 'p'],
      ['Group', '1', '4.83', '.031'],
      ['Error', '71', '1.00', '.500'],
    ]);
    expect(tables[0]!.words.every((index) => words[index]!.x0 >= 420)).toBe(true);
  });

  it('finds no table in running text set justified, numbers or not', () => {
    // Every space stretched to 12 pt: wider than a cell gap.
    const lines: PageWord[] = [];
    const texts = ['(M = 4.47, SD = 1.11), t(118) = 3.31, p = .001, d = 0.61,', '95% CI [0.24, 0.98], so the manipulation worked as', 'effect of target, F(2, 236) = 1.43, p = .241, ηp2 = .01, and'];
    texts.forEach((text, line) => {
      let x = 50;
      for (const part of text.split(' ')) {
        lines.push(word(x, 100 + 14 * line, part));
        x += 5 * part.length + 12;
      }
    });
    expect(findPageTables(lines)).toEqual([]);
  });

  it('stays bounded on a page of a thousand rows', () => {
    const rows: [number, [number, string][]][] = [[50, [[50, 'Item'], [200, 'M'], [260, 'SD'], [320, 'F'], [380, 'p']]]];
    for (let row = 0; row < 1000; row++) rows.push([64 + 14 * row, [[50, `Item ${row}`], [195, `${row}.5`], [255, '1.25'], [315, '2.50'], [375, '.050']]]);
    const [table] = findPageTables(page(rows));
    expect(table!.rows).toHaveLength(1001);
  });
});

// --------------------------------------------------------- composition

describe('mayHoldTable (which pages are worth a look at their words)', () => {
  it('takes a page naming a table, or holding six numbers standing alone as cells do', () => {
    expect(mayHoldTable('Results are in Table 2 below.')).toBe(true);
    expect(mayHoldTable('Condition 12.40 2 6.20 4.21 .018\nError 130.22 88 1.48')).toBe(true);
    expect(mayHoldTable('Fluent 3.4 (1.2) 2.9 (0.8)\nHesitant 4.1 (1.5) 3.3 (1.1)')).toBe(true);
    // A table drawn column by column comes out one cell per line.
    expect(mayHoldTable('Condition\nError\n12.40\n130.22\n2\n88\n4.21\n.018')).toBe(true);
  });
  it('does not take prose whose numbers end a bracket of running text (common practice: "n = 36)" is not a cell)', () => {
    // The sentence shape of result-dense prose: every group n and every chi-square N closes a bracket.
    const prose = Array.from({ length: 4 }, (_, i) =>
      `Ratings were higher after the cue (M = 3.63, SD = 1.11, n = ${30 + i}) than without it (M = 3.03, SD = 0.94, n = ${30 + i}), t(70) = 2.90, p = .005. Choices differed, chi2(1, N = ${140 + i}) = 3.09, p = .079.`,
    ).join('\n');
    expect(mayHoldTable(prose)).toBe(false);
    // Nor numbers standing alone among words, one to a sentence.
    expect(mayHoldTable('The effect of block 6 on accuracy was reliable. Participants aged 18 to 65 took part\nin 2 sessions of 40 minutes each, 3 weeks apart, at 4 sites, with 12 raters and 30 items\nin each of 5 blocks.')).toBe(false);
  });
});

describe('composePage', () => {
  it('replaces the lines of a table by its rows and keeps the prose and its hyphenation joins', () => {
    const text = 'A recog-\nnition test.\nSource SS df MS F p\nCondition 12.40 2 6.20 4.21 .018\nError 130.22 88 1.48\nAfter the table.';
    const boxes = page([
      [40, [[50, 'A recog-']]],
      [54, [[50, 'nition test.']]],
      [92, [[50, 'Source'], [200, 'SS'], [250, 'df'], [290, 'MS'], [340, 'F'], [380, 'p']]],
      [106, [[50, 'Condition'], [185, '12.40'], [250, '2'], [285, '6.20'], [335, '4.21'], [375, '.018']]],
      [120, [[50, 'Error'], [180, '130.22'], [245, '88'], [285, '1.48']]],
      [160, [[50, 'After the table.']]],
    ]);
    const located = locateWords(text, boxes);
    expect(located).not.toBeNull();
    const composed = composePage(text, located);
    expect(composed.text).toBe(
      'A recognition\ntest.\nSource | SS | df | MS | F | p\nCondition | 12.40 | 2 | 6.20 | 4.21 | .018\nError | 130.22 | 88 | 1.48 |  | \nAfter the table.',
    );
    const [table] = composed.tables;
    table!.cells.forEach((row, r) => row.forEach((cell, c) => {
      if (cell !== null) expect(composed.text.slice(cell.start, cell.end)).toBe(table!.rows[r]![c]);
    }));
  });

  it('reads a page whose words cannot be tied to its text as before', () => {
    expect(composePage('a recog-\nnition test', null)).toEqual({ text: 'a recognition\ntest', tables: [] });
    expect(locateWords('abc def', [word(0, 0, 'abc'), word(30, 0, 'xyz')])).toBeNull();
  });

  it('places the tables of each page in the whole text and takes them out of the reference list', () => {
    const before = 'Results\nReferences\nDoe, J. (2020). A title. Journal, 1, 1-2.\n';
    const written = writeTable({ caption: 'Table 4. Tests of the effects', notes: ['Note. Made up.'], rows: [['Source', 'df', 'F', 'p'], ['Group', '1', '4.83', '.031']], headerRows: 1, spans: [[1, 1, 1, 1], [1, 1, 1, 1]], words: [] }, before.length);
    const document = pdfDocument('x.pdf', ['First page', { text: `${before}${written.text}\nRoe, K. (2019). Another title.`, tables: [written.table] }]);
    expectWellFormedRegions(document);
    const [table] = document.tables;
    expect(document.text.slice(table!.cells![1]![2]!.start, table!.cells![1]![2]!.end)).toBe('4.83');
    expect(document.pageOf(table!.start)).toBe(2);
    expect(table!.headerRows).toBe(1);
    expect(document.regions.map((region) => [region.kind, document.text.slice(region.start, region.end)])).toEqual([
      ['heading', 'References'],
      ['references', 'Doe, J. (2020). A title. Journal, 1, 1-2.'],
      // A caption line with a sentence in it does not end the list (plainRegions.ts); the table is cut out of it.
      ['caption', 'Table 4. Tests of the effects'],
      ['table', 'Source | df | F | p\nGroup | 1 | 4.83 | .031\nNote. Made up.'],
      ['references', 'Roe, K. (2019). Another title.'],
    ]);
  });

  it('parses poppler word boxes, entities included', () => {
    const xhtml = '<doc><page width="595" height="842">\n<word xMin="1" yMin="2" xMax="3" yMax="4">R&amp;D</word>\n<word xMin="5" yMin="2" xMax="9" yMax="4">&lt;.001</word>\n</page>\n<page width="595" height="842">\n</page></doc>';
    expect(parseBboxPages(xhtml)).toEqual([[{ text: 'R&D', x0: 1, top: 2, x1: 3, bottom: 4 }, { text: '<.001', x0: 5, top: 2, x1: 9, bottom: 4 }], []]);
  });
});

/** The words of poppler's output tied while it comes, in chunks of `size` bytes. */
function locateInChunks(xhtml: string, pages: string[], size: number): ReturnType<BboxWordLocator['finish']> {
  const bytes = new TextEncoder().encode(xhtml);
  const locator = new BboxWordLocator(pages);
  for (let at = 0; at < bytes.length; at += size) locator.push(bytes.subarray(at, at + size));
  return locator.finish();
}

/** What the reader did before it read poppler's output as it came: the whole output parsed, then each page's words tied. */
function locateWhole(xhtml: string, pages: string[]): (ReturnType<typeof locateWords>)[] {
  const boxPages = parseBboxPages(xhtml);
  return pages.map((page, index) => (boxPages.length === pages.length ? locateWords(page, boxPages[index]!) : null));
}

describe('BboxWordLocator (poppler word boxes tied while pdftotext writes them)', () => {
  const wordLine = (text: string, x: number): string => `    <word xMin="${x}" yMin="2" xMax="${x + 4}" yMax="4">${text}</word>\n`;
  const xhtml = `<doc>\n  <page width="595" height="842">\n${wordLine('R&amp;D', 1)}${wordLine('ηp2', 9)}${wordLine('&lt;.001', 20)}  </page>\n  <page width="595" height="842">\n${wordLine('Next', 1)}${wordLine('page', 9)}  </page>\n</doc>\n`;

  it('gives the words and offsets of parsing the whole output, however it is cut into chunks (multi-byte letters cut too)', () => {
    const pages = ['R&D ηp2\n<.001\n', 'Next page\n'];
    const whole = locateWhole(xhtml, pages);
    expect(whole[0]!.map((word) => [word.text, word.start, word.end])).toEqual([['R&D', 0, 3], ['ηp2', 4, 7], ['<.001', 8, 13]]);
    for (const size of [1, 2, 3, 7, 64, 1 << 16]) expect(locateInChunks(xhtml, pages, size)).toEqual(whole);
  });

  it('gives null for a page whose words part from its text, and for every page when the page counts differ', () => {
    const parted = ['R&D ηp2 <.002', 'Next page'];
    expect(locateInChunks(xhtml, parted, 5)).toEqual(locateWhole(xhtml, parted));
    expect(locateInChunks(xhtml, parted, 5)[0]).toBeNull();
    expect(locateInChunks(xhtml, parted, 5)[1]).not.toBeNull();
    expect(locateInChunks(xhtml, ['R&D ηp2 <.001'], 5)).toEqual([null]);
    expect(locateInChunks(xhtml, ['a', 'b', 'c'], 5)).toEqual([null, null, null]);
  });

  it.skipIf(pdftotextMissing)('gives the same words as parsing the whole output on the PDF fixtures and the demo PDFs (pdftotext)', () => {
    const files = [...['anova-blocks.pdf', 'two-level-header.pdf', 'wrapped-labels.pdf', 'two-column.pdf'].map(tablesFixture), ...DEMO_MANUSCRIPTS.map((name) => demo(`${name}.pdf`))];
    for (const file of files) {
      const run = (extra: string[]): string => execFileSync('pdftotext', [...extra, '-enc', 'UTF-8', '-eol', 'unix', file, '-'], { encoding: 'utf8', maxBuffer: 1 << 28 });
      const pages = run(['-raw']).split('\f');
      if (pages.length > 1 && pages[pages.length - 1]!.trim() === '') pages.pop();
      const bbox = run(['-raw', '-bbox']);
      const whole = locateWhole(bbox, pages);
      expect(whole.some((words) => words !== null && words.length > 0), file).toBe(true);
      for (const size of [997, 1 << 16]) expect(locateInChunks(bbox, pages, size), file).toEqual(whole);
    }
  });
});

// ------------------------------------------------------------ fixtures

const ENGINES = ['pdf-parse', 'pdftotext'] as const;

function expectCellsInText(document: DocumentText, table: DocumentTable): void {
  expect(table.layout).toBe('positions');
  expect(table.cells).toHaveLength(table.rows.length);
  table.rows.forEach((row, r) => {
    row.forEach((cell, c) => {
      const span = table.cells![r]![c];
      if (cell === '') expect(span).toBeNull();
      else expect(document.text.slice(span!.start, span!.end)).toBe(cell);
    });
  });
  expect(document.text.slice(table.start, table.end).split('\n').length).toBe((table.caption ? 1 : 0) + table.rows.length + table.notes.length);
}

interface Found {
  kind: string;
  df: number[];
  value: number;
  p: string | null;
  row: string | null;
}

function scanned(document: DocumentText): Found[] {
  return scanDocument(document).results.map((result) => ({
    kind: result.kind,
    df: result.df.map((df) => df.value),
    value: result.value.value,
    p: result.p === null ? null : `${result.p.comparator} ${result.p.value.text}`,
    row: result.tableRow?.rowLabel ?? null,
  }));
}

describe.each(ENGINES)('PDF tables read with %s', (engine) => {
  const skip = engine === 'pdftotext' && pdftotextMissing;

  it.skipIf(skip)('anova-blocks.pdf (pdf-01): an ANOVA table with SS, df, MS, F, p and partial eta squared, and an Error row', async () => {
    const document = await readOk(tablesFixture('anova-blocks.pdf'), { pdfEngine: engine });
    expect(document.tables).toHaveLength(1);
    const [table] = document.tables;
    expect(table!.caption).toBe('Table 8 ANOVA With Randomized Blocks');
    expect(table!.headerRows).toBe(1);
    expect(table!.rows).toEqual([
      ['Source', 'SS', 'df', 'MS', 'F', 'p', 'ηp2'],
      ['Block Factor (Row)', '4384.65', '18', '243.59', '1.5282', '0.1367', '.43'],
      ['Treatment Factor (Column)', '11369.96', '2', '5684.98', '5.6650', '0.0000', '.66'],
      ['Error', '5738.38', '36', '159.40', '', '', ''],
      ['Total', '21492.98', '56', '', '', '', ''],
    ]);
    expect(table!.notes).toEqual(['Note. SUS = System Usability Score (for systems A, B, and C).']);
    expectCellsInText(document, table!);
    expect(document.pageOf(table!.start)).toBe(1);
    expectWellFormedRegions(document);
    expect(document.regions.map((region) => region.kind)).toEqual(['caption', 'table']);
    // The prose around the table reads as before.
    expect(document.text).toContain('The ANOVA test is run with blocking\nor controlling the user background.\nTable 8 ANOVA With Randomized Blocks\nSource | SS | df | MS | F | p | ηp2\n');
    expect(scanned(document)).toEqual([
      { kind: 'F', df: [18, 36], value: 1.5282, p: '= 0.1367', row: 'Block Factor (Row)' },
      { kind: 'F', df: [2, 36], value: 5.665, p: '= 0.0000', row: 'Treatment Factor (Column)' },
    ]);
  });

  it.skipIf(skip)('two-level-header.pdf (tab-02): side-by-side blocks under header cells that span them', async () => {
    const document = await readOk(tablesFixture('two-level-header.pdf'), { pdfEngine: engine });
    const [table] = document.tables;
    expect(table!.caption).toBe('Table 3 Within-group and between-group differences for secondary outcomes and mediatorsa.');
    expect(table!.headerRows).toBe(2);
    expect(table!.rows.slice(0, 2)).toEqual([
      ['', '', '', 'Within-group difference', '', '', 'Between-group difference at posttest assessmentb', '', ''],
      ['Measure and condition', 'Baseline, mean (SD)', 'Posttest assessment, mean (SD)', 'Cohen d', 't test (df)', 'P value', 'Cohen d (95% CI)', 't test (df)', 'P value'],
    ]);
    expect(table!.spans![0]).toEqual([1, 1, 1, 3, 0, 0, 3, 0, 0]);
    expect(table!.rows.slice(2, 5)).toEqual([
      ['GAD-7c', '', '', '', '', '', '', '', ''],
      ['Treatment', '7.85 (3.73)', '5.06 (4.71)', '0.60', '3.48 (33)', '.001', '0.04 (–0.45 to 0.54)', '0.17 (62)', '.87'],
      ['Control', '6.17 (5.25)', '5.23 (3.38)', '0.27', '1.48 (29)', '.15', 'N/Ad', 'N/A', 'N/A'],
    ]);
    expect(table!.rows).toHaveLength(11);
    expectCellsInText(document, table!);
    const found = scanned(document);
    expect(found.filter((result) => result.kind === 't')).toHaveLength(9);
    expect(found.slice(0, 3)).toEqual([
      { kind: 't', df: [33], value: 3.48, p: '= .001', row: expect.stringContaining('Treatment') },
      { kind: 't', df: [62], value: 0.17, p: '= .87', row: expect.stringContaining('Treatment') },
      { kind: 't', df: [29], value: 1.48, p: '= .15', row: expect.stringContaining('Control') },
    ]);
    expect(found).toContainEqual({ kind: 't', df: [29], value: -0.75, p: '= .46', row: expect.stringContaining('Control') });
  });

  it.skipIf(skip)('wrapped-labels.pdf (tab-06): row labels that wrap onto a second line, and group headings', async () => {
    const document = await readOk(tablesFixture('wrapped-labels.pdf'), { pdfEngine: engine });
    const [table] = document.tables;
    expect(table!.caption).toBe('Table 3 ANOVA summary statistics for analyses.');
    expect(table!.rows[0]).toEqual(['', 'F', 'df', 'p', 'ηp2']);
    expect(table!.rows.map((row) => row[0])).toEqual([
      '',
      'Perceived restoration**',
      'Positive affect',
      'Time**',
      'Location',
      'Time X location**',
      'Outdoor nature**',
      'Negative affect',
      'Time**',
      'Time X location*',
      'Memory',
      'Recognition (d’)',
      'Attention',
      'Digit span forwards (DSF)',
      'Digit span backwards (DSB)',
      'Executive function',
      'Trail making A (TMTA)',
    ]);
    expect(table!.rows[13]).toEqual(['Digit span forwards (DSF)', '2.26', '2, 180', '0.11', '0.02']);
    expect(table!.notes).toEqual(['*p < 0.05; **p < 0.01.']);
    expectCellsInText(document, table!);
    const found = scanned(document);
    expect(found).toHaveLength(11);
    expect(found[0]).toEqual({ kind: 'F', df: [2, 180], value: 87.41, p: '< 0.001', row: 'Perceived restoration**' });
    expect(found).toContainEqual({ kind: 'F', df: [2, 180], value: 2.26, p: '= 0.11', row: 'Digit span forwards (DSF)' });
    expect(found).toContainEqual({ kind: 'F', df: [2, 179], value: 0.83, p: '= 0.44', row: 'Trail making A (TMTA)' });
  });

  it.skipIf(skip)('two-column.pdf (soft-06, soft-07, soft-08): tables inside the columns of a two-column page, prose in reading order', async () => {
    const document = await readOk(tablesFixture('two-column.pdf'), { pdfEngine: engine });
    expect(document.tables.map((table) => table.caption)).toEqual([
      'Table 32. ANOVA summary table for the Likert-type scale on detection.',
      'Table 33. ANOVA summary table for the Likert-type scale on recognition.',
    ]);
    const [detection] = document.tables;
    expect(detection!.rows.slice(0, 3)).toEqual([
      ['Statement 1: Detection', '', '', '', '', '', ''],
      ['Source', 'DF', 'SS', 'MS', 'F value', 'P value', ''],
      ['TOTAL', '107', '225.2', '', '', '', ''],
    ]);
    expect(detection!.rows.map((row) => row[0]).slice(2)).toEqual(['TOTAL', 'Between', 'Age', 'Subject/Age', 'Within', 'VES', 'VES by Age', 'VES by Subject/Age']);
    for (const table of document.tables) expectCellsInText(document, table);
    // The left column, its table, then the right column with its own.
    const order = ['A total of 240 observations', 'Subjective Ratings\nTable 32.', 'VES by Subject/Age | 75 | 92.5 | 1.2', 'The results for the ANOVAs conducted on the objective', 'Table 33.', 'VES by Subject/Age | 75 | 99.3 | 1.3'];
    const at = order.map((passage) => document.text.indexOf(passage));
    expect(at.every((position) => position >= 0)).toBe(true);
    expect([...at].sort((a, b) => a - b)).toEqual(at);
    expect(scanned(document)).toEqual([
      { kind: 'F', df: [2, 15], value: 0.23, p: '= 0.7936', row: 'Age' },
      { kind: 'F', df: [5, 75], value: 9.6, p: '< 0.0001', row: 'VES' },
      { kind: 'F', df: [10, 75], value: 1.46, p: '= 0.1724', row: 'VES by Age' },
      { kind: 'F', df: [2, 15], value: 0.03, p: '= 0.9677', row: 'Age' },
      { kind: 'F', df: [5, 75], value: 6.3, p: '< 0.0001', row: 'VES' },
      { kind: 'F', df: [10, 75], value: 0.77, p: '= 0.6559', row: 'VES by Age' },
    ]);
  });
});

/**
 * A four-page PDF written here with pdf-lib (standard Helvetica): prose, a table, a table, prose. With
 * pdftotext the word boxes are read only for the pages from the first to the last that may hold a table
 * (pages 2 and 3 here), and tied to those pages' text.
 */
async function tablesInTheMiddlePdf(): Promise<string> {
  const { PDFDocument, StandardFonts } = await import('pdf-lib');
  const pdf = await PDFDocument.create();
  const font = await pdf.embedFont(StandardFonts.Helvetica);
  const prose = (text: string): void => {
    const page = pdf.addPage([595, 842]);
    page.drawText(text, { x: 40, y: 780, size: 10, font });
  };
  // (Each page's lines differ: lines repeated at the top or bottom of pages would be taken for running heads.)
  const table = (before: string, caption: string, rows: string[][], after: string): void => {
    const page = pdf.addPage([595, 842]);
    page.drawText(before, { x: 40, y: 780, size: 10, font });
    page.drawText(caption, { x: 40, y: 740, size: 10, font });
    rows.forEach((row, r) => row.forEach((cell, c) => page.drawText(cell, { x: 40 + (c === 0 ? 0 : 100 + 60 * c), y: 715 - 15 * r, size: 10, font })));
    page.drawText(after, { x: 40, y: 640, size: 10, font });
  };
  prose('An invented study of reading speed; the tables follow on the next pages.');
  table('Reading speed was compared across the three conditions.', 'Table 1. Analysis of variance of reading speed', [['Source', 'SS', 'df', 'MS', 'F', 'p'], ['Condition', '12.40', '2', '6.20', '4.21', '.018'], ['Error', '130.22', '88', '1.48', '', '']], 'Speed differed between the conditions.');
  table('Recall was compared between the two groups.', 'Table 2. Analysis of variance of recall', [['Term', 'Sum of squares', 'df', 'Mean square', 'F', 'p'], ['Group', '8.10', '1', '8.10', '5.02', '.028'], ['Residual', '96.80', '60', '1.61', '', '']], 'Recall differed between the groups.');
  prose('The discussion of these invented results ends the manuscript.');
  const { mkdtempSync, writeFileSync } = await import('node:fs');
  const { tmpdir } = await import('node:os');
  const { join } = await import('node:path');
  const path = join(mkdtempSync(join(tmpdir(), 'plumbline-pdf-range-')), 'tables-in-the-middle.pdf');
  writeFileSync(path, await pdf.save());
  return path;
}

describe.skipIf(pdftotextMissing)('pdftotext word boxes for the pages that may hold tables', () => {
  it('rebuilds the tables of pages 2 and 3 of four as pdf-parse does, each on its page', async () => {
    const path = await tablesInTheMiddlePdf();
    const [parsed, poppler] = await Promise.all(ENGINES.map((engine) => readOk(path, { pdfEngine: engine })));
    const shape = (document: DocumentText): unknown => document.tables.map(({ caption, rows }) => ({ caption, rows }));
    expect(poppler!.tables).toHaveLength(2);
    expect(shape(poppler!)).toEqual(shape(parsed!));
    expect(poppler!.tables.map((table) => poppler!.pageOf(table.start))).toEqual([2, 3]);
    expect(poppler!.tables[1]!.rows[1]).toEqual(['Group', '8.10', '1', '8.10', '5.02', '.028']);
    for (const table of poppler!.tables) expectCellsInText(poppler!, table);
  });
});

describe.skipIf(pdftotextMissing)('both engines', () => {
  it.each(['anova-blocks.pdf', 'two-level-header.pdf', 'wrapped-labels.pdf', 'two-column.pdf'])('give the same tables for %s', async (name) => {
    const [parsed, poppler] = await Promise.all(ENGINES.map((engine) => readOk(tablesFixture(name), { pdfEngine: engine })));
    const shape = (document: DocumentText): unknown => document.tables.map(({ caption, notes, rows, headerRows, spans }) => ({ caption, notes, rows, headerRows, spans }));
    expect(shape(parsed!)).toEqual(shape(poppler!));
  });
});

describe('the pdf-parse engine', () => {
  it.each([...DEMO_MANUSCRIPTS.map((name) => demo(`${name}.pdf`)), tablesFixture('two-column.pdf')])('builds the same page text as pdf-parse getText from the items it places: %s', async (path) => {
    const bytes = readFileSync(path);
    const reference = new PDFParse({ data: new Uint8Array(bytes) });
    const expected = (await reference.getText({ pageJoiner: '' })).pages.map((item) => item.text);
    await reference.destroy();
    const parser = new PDFParse({ data: new Uint8Array(bytes) });
    await parser.getInfo();
    const document = await (parser as unknown as { load(): Promise<{ numPages: number; getPage(n: number): Promise<{ getViewport(o: { scale: number }): PdfJsViewport; getTextContent(o: object): Promise<{ items: unknown[]; styles: PdfJsStyles }> }> }> }).load();
    const pages: string[] = [];
    for (let number = 1; number <= document.numPages; number++) {
      const pdfPage = await document.getPage(number);
      const content = await pdfPage.getTextContent({ includeMarkedContent: false, disableNormalization: false });
      const built = pdfjsPageText(content.items, pdfPage.getViewport({ scale: 1 }), content.styles);
      for (const placed of built.words) expect(built.text.slice(placed.start, placed.end)).toBe(placed.text);
      pages.push(built.text);
    }
    await parser.destroy();
    expect(pages).toEqual(expected);
  });
});
