import { readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { buildReport } from '../../src/report/build.js';
import { documentRecordSchema } from '../../src/report/jsonLayoutSchema.js';
import { countOf, findingsPhrase, resultsPhrase } from '../../src/report/wording.js';
import { builtCliExists, plumbline, reportOf, temporaryFolder } from '../batch/cli.js';
import { htmlDocumentsData } from '../report/htmlData.js';

/**
 * The reports' own words, in the built command: totals count results and
 * findings apart, with every noun in the right number ("1 result", never
 * "1 results" or "result(s)"); every text format ends with a newline; a
 * document that is empty or holds no result says so, in every format,
 * instead of passing for a clean one.
 */

const folder = temporaryFolder('report-wording');
afterAll(() => rmSync(folder, { recursive: true, force: true }));

// F(2, 57) = 4.21 -> p = .0197 (SciPy 1.10.1 scipy.stats.f.sf): ".020" agrees, ".002" does not.
writeFileSync(join(folder, 'consistent.txt'), 'Dose affected recall, F(2, 57) = 4.21, p = .020.\n');
writeFileSync(join(folder, 'inconsistent.txt'), 'Dose affected recall, F(2, 57) = 4.21, p = .002.\n');
writeFileSync(join(folder, 'empty.txt'), '');
writeFileSync(join(folder, 'blank.md'), '   \n\n\t\n');
writeFileSync(join(folder, 'prose.txt'), 'We thank the participants. No statistics are reported here.\n');
writeFileSync(join(folder, 'hollow.tex'), '\\documentclass{article}\n% only a comment, F(1, 20) = 4.50, p = .046\n\\begin{document}\n\\end{document}\n');

const scan = (args: string[]): ReturnType<typeof plumbline> => plumbline(['scan', ...args, '--no-cache', '-q'], folder);
const NO_RESULT_DOCUMENTS = ['blank.md', 'empty.txt', 'hollow.tex', 'prose.txt'];

describe('counts in words', () => {
  it('a count takes its noun in the right number', () => {
    expect([countOf(0, 'result'), countOf(1, 'result'), countOf(2, 'result'), countOf(1, 'results table')]).toEqual(['0 results', '1 result', '2 results', '1 results table']);
  });

  it('results and findings are counted apart', () => {
    const summary = buildReport([]).summary;
    const one = { ...summary, statistics: 1, resultsInText: 1, flaggedStatistics: 1, findings: { fail: 1, warn: 1, note: 0 } };
    expect(resultsPhrase(one)).toBe('1 result (1 in text, 0 in tables), flagged');
    expect(findingsPhrase(one)).toBe('2 findings (1 fail, 1 warn, 0 note)');
    expect(resultsPhrase({ ...one, statistics: 3, resultsInText: 3 })).toBe('3 results (3 in text, 0 in tables), 1 of them flagged');
    expect(findingsPhrase(summary)).toBe('0 findings');
  });
});

describe('report wording in the built command', () => {
  it('the built command exists', () => {
    expect(builtCliExists(), 'run npm run build first').toBe(true);
  });

  it('one document with one result: "1 document; 1 result ...; 0 findings", no "(s)" and no "1 results"', () => {
    const run = scan(['consistent.txt']);
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('1 document; 1 result (1 in text, 0 in tables), none flagged; 0 findings.');
    expect(run.stdout).not.toMatch(/\(s\)|\b1 (results|documents|findings)\b/);
  });

  it('a flagged result and its finding are said apart, in text and Markdown', () => {
    const text = scan(['inconsistent.txt']).stdout;
    expect(text).toContain('inconsistent.txt  (1 result, flagged)');
    expect(text).toContain('1 document; 1 result (1 in text, 0 in tables), flagged; 1 finding (1 fail, 0 warn, 0 note)');
    const markdown = scan(['inconsistent.txt', '--format', 'md']).stdout;
    expect(markdown).toContain('**Totals:** 1 document; 1 result (1 in text, 0 in tables), flagged; 1 finding (1 fail, 0 warn, 0 note)');
    const html = scan(['inconsistent.txt', '--format', 'html']).stdout;
    expect(html).toContain('<li><strong>1</strong> finding: ');
    expect(html).toContain('<title>plumbline report: 1 document, 1 result flagged</title>');
  });

  it('the whole folder: six documents, two results one of them flagged, one finding', () => {
    const run = scan(['.']);
    expect(run.status).toBe(1);
    expect(run.stdout).toContain('6 documents; 2 results (2 in text, 0 in tables), 1 of them flagged; 1 finding (1 fail, 0 warn, 0 note).');
    expect(run.stdout).not.toMatch(/\(s\)/);
  });

  for (const format of ['text', 'md', 'csv', 'jsonl', 'json', 'html']) {
    it(`${format}: ends with a newline, on standard output and in a file, from scan, check and merge`, () => {
      const run = scan(['.', '--format', format, '--jsonl', `all-${format}.jsonl`]);
      expect(run.stdout.length).toBeGreaterThan(0);
      expect(run.stdout).toMatch(/\n$/);
      scan(['empty.txt', '--format', format, '--output', `report.${format}`]);
      expect(readFileSync(join(folder, `report.${format}`), 'utf8')).toMatch(/\n$/);
      expect(plumbline(['check', 'no result here', '--format', format], folder).stdout).toMatch(/\n$/);
      expect(plumbline(['merge', `all-${format}.jsonl`, '--format', format], folder).stdout).toMatch(/\n$/);
      rmSync(join(folder, `report.${format}`));
      rmSync(join(folder, `all-${format}.jsonl`));
    });
  }

  it('JSON: each document without results says why, empty or none found; a document with results says nothing', () => {
    const run = scan(['.', '--format', 'json']);
    const report = reportOf(run);
    const byPath = new Map(report.documents.map((document) => [document.path, document]));
    for (const path of ['blank.md', 'empty.txt', 'hollow.tex']) expect(byPath.get(path)!.noResults, path).toMatchObject({ reason: 'empty', message: expect.stringContaining('no text') });
    expect(byPath.get('prose.txt')!.noResults).toMatchObject({ reason: 'none-found', message: expect.stringContaining('No reported F, t, chi-square, r or z result') });
    expect(byPath.get('consistent.txt')!.noResults).toBeUndefined();
    for (const document of (JSON.parse(run.stdout) as { documents: unknown[] }).documents) expect(documentRecordSchema.safeParse(document).success).toBe(true);
  });

  it('text lists each document without results with the reason, even without --all, and Markdown, HTML and CSV say so', () => {
    const text = scan(['.']).stdout;
    for (const path of NO_RESULT_DOCUMENTS) expect(text, path).toMatch(new RegExp(`${path.replace('.', '\\.')}  \\(0 results\\)\\n  no results: `));
    expect(text).not.toMatch(/^consistent\.txt/m); // a clean document with results stays out of the short report
    const markdown = scan(['.', '--format', 'md']).stdout;
    expect(markdown).toContain('- `empty.txt`: 0 results. The document holds no text to audit');
    expect(markdown).toContain('- `prose.txt`: 0 results. No reported F, t, chi-square, r or z result was found');
    const html = scan(['.', '--format', 'html']).stdout;
    // Each document without results carries why in the page's data (drawn as a line of the list of documents without flags).
    expect(htmlDocumentsData(html).filter((d) => d.n !== undefined && d.r === undefined).map((d) => d.p).sort()).toEqual([...NO_RESULT_DOCUMENTS].sort());
    const csv = scan(['.', '--format', 'csv']).stdout.split('\n').filter((line) => line.startsWith('no results,'));
    expect(csv).toHaveLength(NO_RESULT_DOCUMENTS.length);
    expect(csv.every((line) => /(no text to audit|was found in the document)/.test(line))).toBe(true);
  });

  it('check says so for pasted text without results', () => {
    const run = plumbline(['check', 'We thank the participants.'], folder);
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('no results: No reported F, t, chi-square, r or z result was found');
  });
});
