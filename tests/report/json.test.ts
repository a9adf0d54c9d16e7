import { describe, expect, it } from 'vitest';
import { documentOf, entryJson, entryOf } from '../../src/batch/entry.js';
import { summarise, tallyOf, summaryOfTallies } from '../../src/report/build.js';
import { documentJson, documentJsonFromBody, formatJson, formatJsonParts } from '../../src/report/json.js';
import { documentFromJson, readJsonReport, reportRecordSchema } from '../../src/report/jsonLayoutSchema.js';
import { corpusReport, hostileReport } from '../fixtures/report/reports.js';

describe('JSON report', () => {
  it('holds exactly the report: reading it back gives every field, and it is of the published layout', () => {
    for (const report of [corpusReport(), hostileReport()]) {
      const text = formatJson(report);
      expect(readJsonReport(text)).toEqual(JSON.parse(JSON.stringify(report)));
      expect(reportRecordSchema.safeParse(JSON.parse(text)).success).toBe(true);
    }
  });

  it('puts each document on one line of its own, the header and summary indented', () => {
    const report = corpusReport();
    const lines = formatJson(report).split('\n');
    const documentLines = lines.filter((line) => line.startsWith('    {"path":'));
    expect(documentLines).toHaveLength(report.documents.length);
    documentLines.forEach((line, index) => expect(documentFromJson(JSON.parse(line.replace(/,$/, '')))).toEqual({ ok: true, document: JSON.parse(JSON.stringify(report.documents[index])) }));
    expect(lines).toContain('  "summary": {');
    expect(lines.at(-1)).toBe('');
  });

  it('writes an empty audit as valid JSON', () => {
    const empty = formatJsonParts({ tool: { name: 'plumbline', version: '1' }, caution: 'c', summary: summaryOfTallies([]) }, []);
    expect(JSON.parse(empty).documents).toEqual([]);
  });

  it('puts the path first whatever order the document was built in, so cached and fresh audits give the same text', () => {
    const [document] = corpusReport().documents;
    const { path, ...rest } = document!;
    const pathLast = { ...rest, path };
    expect(documentJson(pathLast)).toBe(documentJson(document!));
    expect(documentJson(document!).startsWith(`{"path":${JSON.stringify(path)},"layout":2,"status":`)).toBe(true);
    expect(documentJsonFromBody('a "quoted" name.txt', '{}')).toBe('{"path":"a \\"quoted\\" name.txt"}');
  });
});

describe('audit entries', () => {
  it('carry the same document and the same summary counts as the report they come from', () => {
    const report = hostileReport();
    const entries = report.documents.map(entryOf);
    expect(entries.map(documentOf)).toEqual(JSON.parse(JSON.stringify(report.documents)));
    expect(entries.map(entryJson)).toEqual(report.documents.map(documentJson));
    expect(summaryOfTallies(entries.map((e) => e.tally))).toEqual(summarise(report.documents));
    expect(report.documents.map(tallyOf).some((t) => t.unreadable)).toBe(true);
  });

  it('take the name they are given now: a cached audit of the same content under another path', () => {
    const entry = entryOf(corpusReport().documents[0]!);
    const renamed = documentOf({ ...entry, path: 'elsewhere/renamed.txt' });
    expect(renamed.path).toBe('elsewhere/renamed.txt');
    expect(renamed.statistics).toEqual(documentOf(entry).statistics);
  });
});
