/**
 * Results tables that cannot be read in full are listed in every output
 * format, with the reason, and the totals say how many results were read in
 * text and in tables: an audit must never look cleaner than it is. Runs the
 * built command line on real corpus passages (tests/corpus/real/passages;
 * sources and licences in tests/corpus/real/labels): soft-09 prints F
 * without df (read as printed, each beside its p, and listed as read
 * without df), web-02 prints its ten chi-squares without df (each read as
 * printed, the table listed as read without df), tab-06 is read in full (19
 * results).
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { scanDocumentJson, scanTextJson } from './scanDocumentJson.js';

const scanDocumentJsonOf = (passage: string) => scanDocumentJson(join(__dirname, '..', 'corpus', 'real', 'passages', passage));
import { htmlDocumentsData } from '../report/htmlData.js';
import { readJsonReport } from '../../src/report/jsonLayoutSchema.js';

const root = join(__dirname, '..', '..');
const cli = join(root, 'dist', 'src', 'cli', 'main.js');
const passage = (id: string): string => join(root, 'tests', 'corpus', 'real', 'passages', `${id}.txt`);
const inputs = [passage('soft-09'), passage('web-02'), passage('tab-06')];

function scan(format: string): string {
  // Exit code 1 (something failed) is expected: tab-06 has results that do not add up.
  try {
    return execFileSync('node', [cli, 'scan', ...inputs, '--no-cache', '--quiet', '--format', format], { encoding: 'utf8' });
  } catch (error) {
    return (error as { stdout: string }).stdout;
  }
}

describe('tables not read, in every output format', () => {
  it('JSON: each such table with its location, reason and message; totals of results in text and in tables', () => {
    const report = readJsonReport(scan('json'));
    const document = (id: string) => report.documents.find((candidate) => candidate.path.endsWith(`${id}.txt`))!;
    const [softTable] = document('soft-09').tablesNotRead;
    expect(softTable!.reason).toBe('read-without-df');
    expect(softTable!.rowsWithStatistic).toBe(20);
    expect(softTable!.rowsRead).toBe(20);
    expect(softTable!.message).toContain('without degrees of freedom');
    const softTabled = document('soft-09').statistics.filter((statistic) => statistic.inTable);
    expect(softTabled).toHaveLength(20);
    // Each row prints the effect's df (3) but the table gives no error df: read as printed, not recomputed.
    expect(softTabled.every((statistic) => statistic.df.length === 1 && statistic.df[0] === 3 && statistic.recomputed.evaluable === false)).toBe(true);
    expect(document('web-02').tablesNotRead.map((table) => table.reason)).toEqual(['read-without-df']);
    expect(document('tab-06').tablesNotRead).toEqual([]);
    expect(report.summary.tablesNotRead).toBe(2);
    expect(report.summary.resultsInTables).toBe(19 + 20 + 10);
    expect(report.summary.resultsInText).toBe(report.summary.statistics - 19 - 20 - 10);
    expect(document('tab-06').statistics.every((statistic) => statistic.inTable)).toBe(true);
  });

  it('text, Markdown, CSV, HTML and JSON Lines say so too', () => {
    expect(scan('text')).toMatch(/table read without df[\s\S]*2 results tables not read/);
    expect(scan('md')).toContain('2 results tables not read');
    expect(scan('csv').split('\n').filter((line) => line.startsWith('table not read,'))).toHaveLength(2);
    // Both tables are read without df (soft-09 and web-02): the page's data tags them so, as the text report does.
    expect(htmlDocumentsData(scan('html')).flatMap((d) => d.t ?? []).map((table) => table[0])).toEqual(['table read without df', 'table read without df']);
    const lines = scan('jsonl').trim().split('\n').map((line) => JSON.parse(line) as { tablesNotRead?: unknown[] });
    expect(lines.filter((line) => (line.tablesNotRead ?? []).length > 0)).toHaveLength(2);
  });
});

describe('a table that prints F and p without df', () => {
  it('reads each F beside its p, checks what needs no df (p = .000), and says the table was read without df', () => {
    const folder = mkdtempSync(join(tmpdir(), 'plumbline-nodf-'));
    const file = join(folder, 'invented.md');
    writeFileSync(file, ['Table 2. Reading speed by condition', '', 'Source | F | p | partial eta squared', '--- | --- | --- | ---', 'Condition | 12.60 | .000 | .18', 'Order | 1.30 | .26 | .02', ''].join('\n'));
    let output = '';
    try {
      output = execFileSync('node', [cli, 'scan', file, '--no-cache', '--quiet', '--format', 'json'], { encoding: 'utf8' });
    } catch (error) {
      output = (error as { stdout: string }).stdout;
    }
    const report = readJsonReport(output);
    const [document] = report.documents;
    expect(document!.statistics.map((statistic) => [statistic.value, statistic.df.length, statistic.inTable])).toEqual([
      [12.6, 0, true],
      [1.3, 0, true],
    ]);
    const zero = document!.statistics[0]!.findings.map((finding) => finding.rule);
    expect(zero).toContain('p-reported-as-zero');
    expect(document!.tablesNotRead.map((table) => table.reason)).toEqual(['read-without-df']);
  });
  it('does not list a table as not read when every result it prints is written out in a cell and read ("χ2(1) = 0.80" under "Statistic")', () => {
    const rows = [
      ['Characteristic', 'Intervention (n = 40)', 'Control (n = 40)', 'Statistic', 'p-value'],
      ['Gender, n (%)', '', '', 'χ2(1) = 0.80', '0.371'],
      ['Female', '22 (55.0)', '18 (45.0)', '', ''],
      ['Age, years, mean (SD)', '34.2 (8.1)', '35.0 (7.9)', 't(78) = −0.45', '0.655'],
    ];
    const text = `Table 1. Characteristics of the participants by group\n${rows.map((row) => row.join('\t')).join('\n')}\n\nNext.\n`;
    const document = scanTextJson(text);
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.p?.value])).toEqual([
      ['chi2', 0.8, 0.371],
      ['t', -0.45, 0.655],
    ]);
    expect(document.tablesNotRead).toEqual([]);
  });
  it('lists a titled table of correlations whose long column names run over one line before its rows of numbers', () => {
    // The table as a journal's table page gives it (tests/corpus/real/passages/dwaa-06.txt, CC BY 4.0): no reader
    // takes it, and the audit says so instead of skipping its 33 correlations without a word.
    const document = scanDocumentJsonOf('dwaa-06.txt');
    expect(document.statistics).toEqual([]);
    expect(document.tablesNotRead.map((table) => table.reason)).toEqual(['layout-not-recognised']);
  });

  it('lists a table whose caption the PDF text printed below its body, cells one per line, column block by column block', () => {
    // The table as an article's PDF text gives it (tests/corpus/real/passages/dwof-01.txt, CC BY 4.0): its cells come
    // column by column before its caption "Table 4. …"; no reader takes them, and the audit lists them as not read.
    const document = scanDocumentJsonOf('dwof-01.txt');
    const beforeCaption = document.tablesNotRead.find((table) => table.caption?.startsWith('Table 4.') && table.location.start === 0);
    expect(beforeCaption?.reason).toBe('layout-not-recognised');
    // (A paragraph of prose before a title is no table: the block must be mostly numbers alone on their lines.)
    const prose = scanTextJson(`${'The results are described in the text below, with each measure in turn. '.repeat(4)}\n\nTable 2. Correlations between the measures.\n\nNo values are given here.\n`);
    expect(prose.tablesNotRead).toEqual([]);
  });

  it('lists a table copied one cell per line without a title, whose header cells name a statistic and its p, when no reader takes it', () => {
    // A web page's table as its text gives it, one cell per line and no "Table 2" above it (common practice); the
    // rows print one value more than a reader can place. The numbers are made up.
    const cells = ['Effect', 'df', 'F', 'P', 'Slope', 'Season', '1,176', '12.40***', '<0.001', '0.35', 'Sex', '1,176', '3.10*', '0.047', '-0.12', 'Age', '1,176', '0.52', '0.47', '0.02', 'Site', '1,176', '5.61**', '0.004', '0.21'];
    const document = scanTextJson(`Some text of the page before the table.\n\n${cells.join('\n\n')}\n\nThe discussion follows.\n`);
    expect(document.statistics).toEqual([]);
    expect(document.tablesNotRead.map((table) => table.reason)).toEqual(['layout-not-recognised']);
    // (A line "F" and a line "P" in prose lists are no header when numbers alone do not follow.)
    const prose = scanTextJson('The letters used:\n\nF\n\nP\n\nand the rest of the text goes on in sentences, with no table here at all.\n');
    expect(prose.tablesNotRead).toEqual([]);
  });
});
