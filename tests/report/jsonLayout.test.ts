import fc from 'fast-check';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { auditText, buildReport } from '../../src/audit.js';
import { resolveConfig } from '../../src/checks/config.js';
import { formatCsv } from '../../src/report/csv.js';
import { documentJson, formatJson } from '../../src/report/json.js';
import { documentRecordOf, JSON_LAYOUT } from '../../src/report/jsonLayout.js';
import { documentFromJson, documentRecordSchema, readJsonReport } from '../../src/report/jsonLayoutSchema.js';
import type { DocumentOutput, Report } from '../../src/report/model.js';
import { REPORTED_DIGITS, reportedDown, reportedUp } from '../../src/report/reportedDigits.js';
import { denseDocument } from '../../bench/denseText.js';
import { corpusReport, demoReport, hostileReport } from '../fixtures/report/reports.js';

/** The model as JSON gives it back (optional fields left out, not undefined). */
function plain<T>(value: T): T {
  return JSON.parse(JSON.stringify(value)) as T;
}

/** A table that prints F and p without df: listed as read without df, its results not recomputed (invented). */
const TABLE_WITHOUT_DF = ['Table 2. Reading speed by condition', '', 'Source | F | p | partial eta squared', '--- | --- | --- | ---', 'Condition | 12.60 | .000 | .18', 'Order | 1.30 | .26 | .02', ''].join('\n');

function tableWithoutDfReport(): Report {
  return buildReport([auditText(TABLE_WITHOUT_DF, resolveConfig({}), 'no-df.md')]);
}

function reports(): Report[] {
  return [corpusReport(), hostileReport(), demoReport(), tableWithoutDfReport()];
}

function readBack(document: DocumentOutput): DocumentOutput {
  const read = documentFromJson(JSON.parse(documentJson(document)));
  if (!read.ok) throw new Error(read.reason);
  return read.document;
}

describe('JSON layout 2', () => {
  it('gives back every document field for field: the text around each result too, from the passages', () => {
    const documents = reports().flatMap((report) => report.documents);
    expect(documents.some((d) => d.statistics.some((s) => s.alsoAt))).toBe(true);
    expect(documents.some((d) => d.tablesNotRead.length > 0)).toBe(true);
    expect(documents.some((d) => d.status === 'unreadable')).toBe(true);
    for (const document of documents) expect(readBack(document), document.path).toEqual(plain(document));
  });

  it('groups each result as a reviewer reads it: where, printed, recomputed, verdict, why; the document\'s own context once, first', () => {
    for (const document of corpusReport().documents) {
      const line = documentJson(document);
      expect(line.startsWith(`{"path":${JSON.stringify(document.path)},"layout":${JSON_LAYOUT},"status":"checked"`)).toBe(true);
      const record = JSON.parse(line) as { results: Record<string, unknown>[]; passages: unknown[] };
      expect(record.results).toHaveLength(document.statistics.length);
      for (const result of record.results) {
        expect(Object.keys(result)).toEqual(['where', 'printed', 'recomputed', 'verdict', 'why']);
        expect(JSON.stringify(result)).not.toMatch(/"surroundings"|"path"|"alpha"|"format"/);
      }
      expect(documentRecordSchema.safeParse(record).success).toBe(true);
    }
  });

  it('gives each result the CSV report\'s verdict (worst severity, "no flag", "not checked")', () => {
    const seen = new Set<string>();
    for (const report of reports()) {
      const rows = Papa.parse<Record<string, string>>(formatCsv(report), { header: true, skipEmptyLines: true }).data.filter((row) => row.row === 'result');
      const verdicts = report.documents.flatMap((document) => documentRecordOf(document).results.map((result) => result.verdict));
      expect(verdicts).toEqual(rows.map((row) => row.verdict));
      verdicts.forEach((verdict) => seen.add(verdict));
    }
    expect(seen).toEqual(new Set(['fail', 'warn', 'note', 'no flag', 'not checked']));
  });

  it('writes the text around results once: the passages of a result-dense document are no longer than its text, and in order without overlap', () => {
    const text = denseDocument(300);
    const document = auditText(text, resolveConfig({}), 'dense.txt');
    const { passages, results } = documentRecordOf(document);
    const written = passages.reduce((sum, passage) => sum + passage.text.length, 0);
    expect(written).toBeLessThanOrEqual(text.length);
    // Layout 1 wrote the text around every result with it: several times the document's text.
    const repeated = document.statistics.reduce((sum, s) => sum + s.surroundings.before.length + s.surroundings.after.length, 0);
    expect(repeated).toBeGreaterThan(2 * text.length);
    for (let i = 1; i < passages.length; i++) expect(passages[i]!.at).toBeGreaterThan(passages[i - 1]!.at + passages[i - 1]!.text.length);
    for (const passage of passages) expect(passage.text).toBe(text.slice(passage.at, passage.at + passage.text.length));
    expect(results.length).toBeGreaterThan(250);
    expect(readBack(document)).toEqual(plain(document));
  });

  it('gives back the text around a result whose own text is not the document\'s text at its span (a tidied result)', () => {
    const document = auditText('Dose affected recall, F(2, 57) = 4.21, p = .020, and mood did not, F(2, 57) = 0.51, p = .603.', resolveConfig({}), 'tidied.txt');
    const tidied = plain(document);
    tidied.statistics[0]!.text = tidied.statistics[0]!.text.replace('F(2, 57)', 'F[2, 57]');
    expect(readBack(tidied)).toEqual(tidied);
  });

  it('reads layout 1 (records without a layout field, the model as it is) and refuses an unknown layout or a context outside the passages, saying why', () => {
    const [document] = corpusReport().documents;
    const layoutOne = documentFromJson(plain(document));
    expect(layoutOne.ok && layoutOne.document).toEqual(plain(document));
    const record = JSON.parse(documentJson(document!)) as { layout: number; results: { where: { context: [number, number] } }[] };
    expect(documentFromJson({ ...record, layout: 3 })).toEqual({ ok: false, reason: expect.stringMatching(/^a document record of layout 3, which this plumbline does not read/) });
    record.results[0]!.where.context = [record.results[0]!.where.context[0] - 10_000, record.results[0]!.where.context[1]];
    expect(documentFromJson(record)).toMatchObject({ ok: false, reason: expect.stringMatching(/context spans are not in its passages/) });
    expect(documentFromJson({ path: 'x.txt', layout: 2 })).toEqual({ ok: false, reason: 'not a plumbline document record' });
  });

  it('reads a whole JSON report of either layout into the model', () => {
    const report = corpusReport();
    expect(readJsonReport(formatJson(report))).toEqual(plain(report));
    expect(readJsonReport(JSON.stringify(report))).toEqual(plain(report));
    const written = JSON.parse(formatJson(report)) as Record<string, unknown>;
    expect(Object.keys(written)).toEqual(['layout', 'tool', 'caution', 'documents', 'summary']);
    expect(Object.keys(written.summary as object)).toContain('flaggedResults');
  });
});

describe('six significant digits for what plumbline recomputed (common practice: more digits than any printed p or effect size)', () => {
  const significantDigits = (value: number): number => value.toExponential().replace(/e.*$/, '').replace('-', '').replace('.', '').length;

  it('rounds an interval outward to short decimals: low end at most the value, high end at least, within one unit of the last digit', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-300, max: 1e6, noNaN: true }), (value) => {
        const low = reportedDown(value);
        const high = reportedUp(value);
        const unit = 10 ** (Math.floor(Math.log10(value)) - (REPORTED_DIGITS - 1));
        expect(low).toBeLessThanOrEqual(value);
        expect(high).toBeGreaterThanOrEqual(value);
        expect(value - low).toBeLessThanOrEqual(unit * 1.000001);
        expect(high - value).toBeLessThanOrEqual(unit * 1.000001);
        expect(significantDigits(low)).toBeLessThanOrEqual(REPORTED_DIGITS);
        expect(significantDigits(high)).toBeLessThanOrEqual(REPORTED_DIGITS);
      }),
    );
    expect([reportedDown(0.07883088404705263), reportedUp(0.07959020603420015)]).toEqual([0.0788308, 0.0795903]);
    expect([reportedDown(0), reportedUp(1)]).toEqual([0, 1]);
  });

  it('keeps every recomputed interval of the demo holding its recomputed value', () => {
    for (const document of demoReport().documents) {
      for (const { recomputed } of document.statistics) {
        if (recomputed.p !== null && recomputed.pLow !== null && recomputed.pHigh !== null) {
          expect(recomputed.pLow).toBeLessThanOrEqual(recomputed.p);
          expect(recomputed.pHigh).toBeGreaterThanOrEqual(recomputed.p);
        }
        for (const value of [recomputed.p, recomputed.pLow, recomputed.pHigh, recomputed.partialEtaSquared]) if (value !== null && value !== 0) expect(significantDigits(value)).toBeLessThanOrEqual(REPORTED_DIGITS);
      }
    }
  });
});
