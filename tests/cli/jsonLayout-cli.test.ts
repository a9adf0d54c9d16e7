/**
 * The JSON layout (layout 2) through the built command: what `scan` writes
 * as JSON and JSON Lines is of the published layout, grouped as a reviewer
 * reads a result, and everything that reads those files (merge to JSON and
 * HTML, --resume) reads layout 2 and the layout 1 written before.
 * `npm test` builds first; running vitest alone needs `npm run build`.
 */
import { copyFileSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { documentFromJson, documentRecordSchema, readJsonReport, reportRecordSchema } from '../../src/report/jsonLayoutSchema.js';
import { builtCliExists, plumbline, temporaryFolder } from '../batch/cli.js';
import { htmlDataStrings } from '../report/htmlData.js';

const folder = temporaryFolder('json-layout');
afterAll(() => rmSync(folder, { recursive: true, force: true }));

// Invented demo manuscripts: text, Markdown and one PDF (which has pages).
const papers = ['brannock-commute-survey.txt', 'carbon-label-trust.md', 'classroom-feedback.txt', 'gravel-path-wayfinding.pdf', 'lantern-reading-fluency.txt', 'sleep-and-recall.md'];
mkdirSync(join(folder, 'papers'));
for (const name of papers) copyFileSync(join(process.cwd(), 'corpus-demo', name), join(folder, 'papers', name));

const common = ['--no-cache', '--jobs', '1', '--fail-on', 'never', '-q'];
const run = (args: string[]) => {
  const result = plumbline(args, folder);
  expect(result.status, result.stderr).toBe(0);
  return result.stdout;
};

/** A JSON Lines record rewritten in layout 1: the in-memory model as it is, which is what records were before. */
function asLayoutOne(line: string): string {
  const read = documentFromJson(JSON.parse(line));
  if (!read.ok) throw new Error(read.reason);
  return JSON.stringify(read.document);
}

describe('the JSON layout through the built command', () => {
  it('the built command exists', () => {
    expect(builtCliExists(), 'run npm run build first').toBe(true);
  });

  const json = run(['scan', 'papers', '--format', 'json', ...common]);
  const jsonl = run(['scan', 'papers', '--format', 'jsonl', ...common]);

  it('scan --format json writes layout 2, valid against its schema, each result grouped where / printed / recomputed / verdict / why', () => {
    const raw = JSON.parse(json) as { layout: number; documents: { path: string; format: string; results: Record<string, unknown>[]; passages: unknown[] }[] };
    expect(raw.layout).toBe(2);
    expect(reportRecordSchema.safeParse(raw).success).toBe(true);
    expect(raw.documents.map((document) => document.path)).toEqual(papers.map((name) => `papers/${name}`));
    const results = raw.documents.flatMap((document) => document.results);
    expect(results.length).toBeGreaterThan(30);
    for (const result of results) expect(Object.keys(result)).toEqual(['where', 'printed', 'recomputed', 'verdict', 'why']);
    // Pages where the format has them, and none where it has not.
    const pdf = raw.documents.find((document) => document.format === 'pdf')!;
    expect(pdf.results.every((result) => typeof (result.where as { page?: number }).page === 'number')).toBe(true);
    expect(raw.documents.find((document) => document.format === 'text')!.results.some((result) => 'page' in (result.where as object))).toBe(false);
    // The report reads back into the model, with the text around every result.
    const report = readJsonReport(json);
    expect(report.summary.statistics).toBe(results.length);
    for (const statistic of report.documents.flatMap((document) => document.statistics)) expect(statistic.surroundings.before.length + statistic.surroundings.after.length).toBeGreaterThan(0);
  });

  it('scan --format jsonl writes one record per line, each of the schema\'s $defs.document and the same as in the JSON report', () => {
    const lines = jsonl.trimEnd().split('\n');
    expect(lines).toHaveLength(papers.length);
    for (const line of lines) expect(documentRecordSchema.safeParse(JSON.parse(line)).success).toBe(true);
    const documentLines = json.split('\n').filter((line) => line.startsWith('    {"path":')).map((line) => line.trim().replace(/,$/, ''));
    expect(documentLines).toEqual(lines);
  });

  it('merge reads layout 1, layout 2 and a mix of them, and writes the scan\'s own JSON report and HTML page', () => {
    const lines = jsonl.trimEnd().split('\n');
    writeFileSync(join(folder, 'new.jsonl'), `${lines.join('\n')}\n`);
    writeFileSync(join(folder, 'old.jsonl'), `${lines.map(asLayoutOne).join('\n')}\n`);
    writeFileSync(join(folder, 'mixed-a.jsonl'), `${lines.slice(0, 3).map(asLayoutOne).join('\n')}\n`);
    writeFileSync(join(folder, 'mixed-b.jsonl'), `${lines.slice(3).join('\n')}\n`);
    expect(readFileSync(join(folder, 'old.jsonl'), 'utf8')).toContain('"surroundings"');
    for (const files of [['new.jsonl'], ['old.jsonl'], ['mixed-a.jsonl', 'mixed-b.jsonl']]) {
      expect(run(['merge', ...files, '--format', 'json', '--fail-on', 'never']), files.join(' ')).toBe(json);
    }
    const html = run(['scan', 'papers', '--format', 'html', ...common]);
    const mergedHtml = run(['merge', 'old.jsonl', '--format', 'html', '--fail-on', 'never']);
    expect(mergedHtml).toBe(run(['merge', 'new.jsonl', '--format', 'html', '--fail-on', 'never']));
    expect(mergedHtml).toBe(html);
    // The context shown on the cards came back from the passages.
    const plainEnds = readJsonReport(json)
      .documents.flatMap((document) => document.statistics)
      // Flagged results have a card, with the result in its context.
      .filter((statistic) => statistic.findings.length > 0)
      .map((statistic) => statistic.surroundings.before.slice(-30))
      .filter((end) => /^[A-Za-z ,.]{30}$/.test(end));
    expect(plainEnds.length).toBeGreaterThan(5);
    // (The page holds each document as data its script draws: the text before a result is one of its strings.)
    const strings = htmlDataStrings(html);
    for (const end of plainEnds) expect(strings.some((text) => text.endsWith(end)), end).toBe(true);
  });

  it('--resume appends layout 2 to a file of layout 1 records, and the whole merges into the scan\'s report', () => {
    const lines = jsonl.trimEnd().split('\n');
    writeFileSync(join(folder, 'resumed.jsonl'), `${lines.slice(0, 2).map(asLayoutOne).join('\n')}\n`);
    run(['scan', 'papers', '--jsonl', 'resumed.jsonl', '--resume', '--format', 'json', ...common]);
    const resumed = readFileSync(join(folder, 'resumed.jsonl'), 'utf8').trimEnd().split('\n');
    expect(resumed).toHaveLength(papers.length);
    expect(resumed.slice(2).every((line) => line.includes('"layout":2'))).toBe(true);
    expect(run(['merge', 'resumed.jsonl', '--format', 'json', '--fail-on', 'never'])).toBe(json);
  });

  it('merge refuses a record of a layout it does not know, naming the file, the line and the layout', () => {
    const lines = jsonl.trimEnd().split('\n');
    writeFileSync(join(folder, 'future.jsonl'), `${lines[0]}\n${lines[1]!.replace('"layout":2', '"layout":3')}\n`);
    const refused = plumbline(['merge', 'future.jsonl', '--format', 'json'], folder);
    expect(refused.status).toBe(2);
    expect(refused.stderr).toBe('plumbline: future.jsonl: line 2 is a document record of layout 3, which this plumbline does not read (it reads layouts 1 and 2) (the file was left as it is)\n');
  });
});
