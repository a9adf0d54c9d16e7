import { readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { documentData } from '../../src/report/html.js';
import { plumbline, reportOf, temporaryFolder } from '../batch/cli.js';
import { htmlDocumentsData } from '../report/htmlData.js';

/**
 * The HTML report through the built command: `scan --format html` and `merge --format html` write it as a
 * stream, a document at a time, and both write the same page for the same audits, carrying every document of
 * the JSON report.
 */

const folder = temporaryFolder('html-report');
afterAll(() => rmSync(folder, { recursive: true, force: true }));

describe('plumbline scan and merge --format html', () => {
  it('write the same page, with every document of the JSON report as its data, in the order of the report', () => {
    const demo = join(process.cwd(), 'corpus-demo');
    const scan = plumbline(['scan', demo, '--no-cache', '--quiet', '--jsonl', 'demo.jsonl', '--format', 'html', '--output', 'scan.html', '--fail-on', 'never'], folder);
    expect(scan.status, scan.stderr).toBe(0);
    const json = plumbline(['scan', demo, '--no-cache', '--quiet', '--format', 'json', '--fail-on', 'never'], folder);
    const report = reportOf(json);
    const html = readFileSync(join(folder, 'scan.html'), 'utf8');
    expect(html.startsWith('<!DOCTYPE html>')).toBe(true);
    expect(html).toContain(`<title>plumbline report: ${report.summary.documents} documents, ${report.summary.flaggedStatistics} results flagged</title>`);
    expect(htmlDocumentsData(html)).toEqual(report.documents.map(documentData));
    const merge = plumbline(['merge', 'demo.jsonl', '--format', 'html', '--output', 'merged.html', '--fail-on', 'never'], folder);
    expect(merge.status, merge.stderr).toBe(0);
    expect(readFileSync(join(folder, 'merged.html'), 'utf8')).toBe(html);
    // To standard output too, the same page.
    expect(plumbline(['merge', 'demo.jsonl', '--format', 'html', '--fail-on', 'never'], folder).stdout).toBe(html);
  }, 120_000);
});
