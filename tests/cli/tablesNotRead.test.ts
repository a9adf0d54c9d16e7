/**
 * Results tables that cannot be read in full are listed in every output
 * format, with the reason, and the totals say how many results were read in
 * text and in tables: an audit must never look cleaner than it is. Runs the
 * built command line on real corpus passages (tests/corpus/real/passages;
 * sources and licences in tests/corpus/real/labels): soft-09 prints F
 * without df, web-02 is a table whose layout no reader recognises, tab-06 is
 * read in full (19 results).
 */
import { execFileSync } from 'node:child_process';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { reportSchema } from '../../src/report/model.js';

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
    const report = reportSchema.parse(JSON.parse(scan('json')));
    const document = (id: string) => report.documents.find((candidate) => candidate.path.endsWith(`${id}.txt`))!;
    const [softTable] = document('soft-09').tablesNotRead;
    expect(softTable!.reason).toBe('no-df');
    expect(softTable!.rowsWithStatistic).toBe(20);
    expect(softTable!.message).toContain('degrees of freedom');
    expect(document('web-02').tablesNotRead.map((table) => table.reason)).toEqual(['layout-not-recognised']);
    expect(document('tab-06').tablesNotRead).toEqual([]);
    expect(report.summary.tablesNotRead).toBe(2);
    expect(report.summary.resultsInTables).toBe(19);
    expect(report.summary.resultsInText).toBe(report.summary.statistics - 19);
    expect(document('tab-06').statistics.every((statistic) => statistic.inTable)).toBe(true);
  });

  it('text, Markdown, CSV, HTML and JSON Lines say so too', () => {
    expect(scan('text')).toMatch(/table not read[\s\S]*2 results tables not read/);
    expect(scan('md')).toContain('2 results tables not read');
    expect(scan('csv').split('\n').filter((line) => line.startsWith('table not read,'))).toHaveLength(2);
    expect(scan('html')).toContain('<h4>Tables not read</h4>');
    const lines = scan('jsonl').trim().split('\n').map((line) => JSON.parse(line) as { tablesNotRead?: unknown[] });
    expect(lines.filter((line) => (line.tablesNotRead ?? []).length > 0)).toHaveLength(2);
  });
});
