import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { auditText, buildReport, unreadableDocument } from '../../src/audit.js';
import { resolveConfig } from '../../src/checks/config.js';
import { readFileSync } from 'node:fs';
import { z } from 'zod';
import { CSV_COLUMNS, formatCsv, neutraliseCell } from '../../src/report/csv.js';
import { csvRowJsonSchema } from '../../src/report/jsonSchema.js';
import type { Report } from '../../src/report/model.js';
import { corpusReport, demoReport, hostileReport, HOSTILE_PATH } from '../fixtures/report/reports.js';

const HEADER = CSV_COLUMNS.map((c) => c.name);

function parse(csv: string): string[][] {
  const parsed = Papa.parse<string[]>(csv, { header: false, skipEmptyLines: true, dynamicTyping: false });
  expect(parsed.errors).toEqual([]);
  return parsed.data;
}

function records(csv: string): Record<string, string>[] {
  const [header, ...rows] = parse(csv);
  return rows.map((row) => Object.fromEntries(header!.map((name, i) => [name, row[i]!])));
}

describe('formatCsv: shape', () => {
  const report = corpusReport();
  const csv = formatCsv(report);

  it('parses back to a header and one row per result, every row with every column', () => {
    const rows = parse(csv);
    expect(rows[0]).toEqual(HEADER);
    expect(rows).toHaveLength(1 + report.summary.statistics);
    for (const row of rows) expect(row).toHaveLength(HEADER.length);
  });

  it('carries the numbers of each result, grouped as a reviewer reads them', () => {
    const rows = records(csv);
    const statistics = report.documents.flatMap((d) => d.statistics.map((s) => ({ d, s })));
    rows.forEach((row, i) => {
      const { d, s } = statistics[i]!;
      expect(row.row).toBe('result');
      expect(row.document).toBe(d.path);
      expect(row.line).toBe(String(s.location.line));
      expect(row.column).toBe(String(s.location.column));
      expect(row.page).toBe('');
      expect(row.in).toBe(s.inTable ? 'table' : 'text');
      expect(row.printed).toBe(s.text.replace(/\s+/g, ' ').trim());
      expect(row.test).toBe(s.kind);
      expect(row.df).toBe(s.df.join(', '));
      expect(row['statistic']).toBe(s.value === null ? '' : String(s.value));
      expect(row['p as printed']).toBe(s.p ? `p ${s.p.comparator} ${s.p.text}` : '');
      expect(row.p).toBe(s.p ? String(s.p.value) : '');
      expect(row['recomputed p']).toBe(s.recomputed.p === null ? '' : String(s.recomputed.p));
      expect(row['recomputed p low']).toBe(s.recomputed.pLow === null ? '' : String(s.recomputed.pLow));
      expect(row['recomputed p high']).toBe(s.recomputed.pHigh === null ? '' : String(s.recomputed.pHigh));
      expect(row.verdict).toBe(
        s.findings.some((f) => f.severity === 'fail')
          ? 'fail'
          : s.findings.some((f) => f.severity === 'warn')
            ? 'warn'
            : s.findings.length
              ? 'note'
              : s.recomputed.evaluable
                ? 'no flag'
                : 'not checked',
      );
      expect(row['changes the conclusion']).toBe(s.findings.some((f) => f.crossesAlpha) ? 'yes' : 'no');
      expect(row['p off by']).toBe(s.findings.find((f) => f.pDiscrepancy)?.pDiscrepancy?.size ?? '');
      for (const finding of s.findings) {
        expect(row.rules!.split('; ')).toContain(finding.rule);
        expect(row.why).toContain(finding.message.replace(/\s+/g, ' ').trim());
      }
      expect(row.format).toBe(d.format ?? '');
      expect(row.alpha).toBe(d.alpha === undefined ? '' : String(d.alpha));
    });
    // The fixture has each kind of verdict a checked result can have.
    expect(new Set(rows.map((row) => row.verdict))).toEqual(new Set(['fail', 'warn', 'note', 'no flag']));
    expect(rows.some((row) => row['changes the conclusion'] === 'yes')).toBe(true);
  });

  it('orders the columns where, printed, recomputed, verdict, why, then the document\'s details', () => {
    const groups = CSV_COLUMNS.map((column) => column.group);
    const order = ['where', 'printed', 'recomputed', 'verdict', 'why', 'document'];
    expect([...new Set(groups)]).toEqual(order);
    for (let i = 1; i < groups.length; i++) expect(order.indexOf(groups[i]!)).toBeGreaterThanOrEqual(order.indexOf(groups[i - 1]!));
  });

  it('reads as numbers in statistics software (numeric columns typed as numbers)', () => {
    const typed = Papa.parse<Record<string, unknown>>(csv, { header: true, skipEmptyLines: true, dynamicTyping: true });
    const evaluable = typed.data.filter((row) => row['recomputed p'] !== null);
    expect(evaluable.length).toBeGreaterThan(0);
    for (const row of evaluable) {
      expect(typeof row['recomputed p']).toBe('number');
      expect(typeof row.line).toBe('number');
      expect(row.p === null || typeof row.p === 'number').toBe(true);
      expect(row.statistic === null || typeof row.statistic === 'number').toBe(true);
    }
  });

  it('writes a printed p with its letter, so that no cell starts with a bare "="', () => {
    const printed = new Set(records(csv).map((row) => row['p as printed']));
    expect([...printed].some((p) => p!.startsWith('p = '))).toBe(true);
    expect([...printed].some((p) => p!.startsWith('p < '))).toBe(true);
    expect([...printed].every((p) => p === '' || /^p [=<>]=? /.test(p!))).toBe(true);
  });

  it('writes effect sizes as a compact "kind=value; ..." cell', () => {
    const withInterval = records(csv).find((row) => row['effect sizes']!.includes('CI'));
    expect(withInterval?.['effect sizes']).toMatch(/^partial-eta-squared=0\.\d+ \[90% CI 0\.\d+, 0\.\d+\]$/);
  });
});

describe('formatCsv: other rows', () => {
  it('writes an unreadable document as one row with its error, and a document with no result as one row', () => {
    const config = resolveConfig({});
    const report = buildReport([
      unreadableDocument('scan.pdf', 'no text layer, a scanned image', 'pdf'),
      auditText('No statistics here at all.', config, 'empty.txt'),
    ]);
    const rows = records(formatCsv(report));
    expect(rows).toHaveLength(2);
    expect(rows[0]).toMatchObject({ row: 'unreadable', document: 'scan.pdf', format: 'pdf', note: 'no text layer, a scanned image', test: '', verdict: '' });
    expect(rows[1]).toMatchObject({ row: 'no results', document: 'empty.txt', note: 'No reported F, t, chi-square, r or z result was found in the document.' });
  });

  it('writes a finding about a whole document as its own row', () => {
    const report = corpusReport();
    const document = report.documents[0]!;
    document.findings.push({ rule: 'whole-document-rule', severity: 'warn', crossesAlpha: false, message: 'About the whole, document.', messageId: 'x', data: {} });
    const rows = records(formatCsv(report)).filter((row) => row.row === 'document finding');
    expect(rows).toEqual([expect.objectContaining({ document: document.path, rules: 'whole-document-rule', verdict: 'warn', why: 'warn whole-document-rule: About the whole, document.' })]);
  });
});

describe('formatCsv: spreadsheet safety and quoting', () => {
  it('neutralises cells that a spreadsheet would run as a formula', () => {
    expect(neutraliseCell('=HYPERLINK("http://example.invalid","x")')).toBe(`'=HYPERLINK("http://example.invalid","x")`);
    expect(neutraliseCell("+cmd|' /C calc'!A0")).toBe(`'+cmd|' /C calc'!A0`);
    expect(neutraliseCell('-2+3')).toBe(`'-2+3`);
    expect(neutraliseCell('@SUM(A1:A2)')).toBe(`'@SUM(A1:A2)`);
    expect(neutraliseCell('\tx')).toBe(`'\tx`);
    expect(neutraliseCell('\rx')).toBe(`'\rx`);
    expect(neutraliseCell('F(2, 57) = 4.21')).toBe('F(2, 57) = 4.21');
  });

  it('neutralises formulas in paths, result texts, messages and errors, and the text still parses back', () => {
    const config = resolveConfig({});
    const base = auditText('Dose affected recall, F(2, 57) = 4.21, p = .002.', config, '=HYPERLINK("http://example.invalid/","click")');
    const second = auditText('A test, t(40) = 2.10, p = .21.', config, "+cmd|' /C calc'!A0");
    second.statistics[0]!.text = '=HYPERLINK("http://example.invalid/","x")';
    second.statistics[0]!.recomputed.reason = '@SUM(1)';
    const report = buildReport([base, second, unreadableDocument('-bad.pdf', '=1+2, "quoted", and\na new line', 'pdf')]);
    const csv = formatCsv(report);
    const rows = records(csv);
    expect(rows).toHaveLength(3);
    expect(rows[0]!.document).toBe(`'=HYPERLINK("http://example.invalid/","click")`);
    expect(rows[1]!.document).toBe(`'+cmd|' /C calc'!A0`);
    expect(rows[1]!.printed).toBe(`'=HYPERLINK("http://example.invalid/","x")`);
    expect(rows[2]!.document).toBe(`'-bad.pdf`);
    expect(rows[2]!.note).toBe(`'=1+2, "quoted", and a new line`);
    for (const row of parse(csv)) {
      for (const cell of row) expect(cell, cell).not.toMatch(/^[=+\-@\t\r]/);
    }
  });

  it('keeps negative numbers in numeric columns as numbers', () => {
    const config = resolveConfig({});
    const report = buildReport([auditText('Scores fell, t(38) = -2.21, p = .033.', config, 'negative.txt')]);
    const csv = formatCsv(report);
    const [row] = records(csv);
    expect(row!.statistic).toBe('-2.21');
    expect(csv).toContain(',-2.21,');
    const typed = Papa.parse<Record<string, unknown>>(csv, { header: true, skipEmptyLines: true, dynamicTyping: true });
    expect(typed.data[0]!.statistic).toBe(-2.21);
    // The text column with the same number is text, so it is neutralised only when it starts with a sign.
    expect(row!.printed).toBe('t(38) = -2.21, p = .033');
  });

  it('quotes commas, quotes and markup in the hostile manuscript so that every row has every column', () => {
    const report = hostileReport();
    const csv = formatCsv(report);
    const rows = parse(csv);
    const expectedRows = report.documents.reduce((n, d) => n + Math.max(1, d.statistics.length + d.findings.length), 0);
    expect(rows).toHaveLength(1 + expectedRows);
    for (const row of rows) expect(row).toHaveLength(HEADER.length);
    expect(records(csv)[0]!.document).toBe(HOSTILE_PATH);
  });

  it('writes nothing but the header for an empty report', () => {
    const report: Report = buildReport([]);
    expect(parse(formatCsv(report))).toEqual([HEADER]);
  });
});

describe('formatCsv: the corpus-demo manuscripts', () => {
  it('has one row per result, every row with every column', () => {
    const report = demoReport();
    const rows = parse(formatCsv(report));
    const expected = report.documents.reduce((n, d) => n + (d.status === 'unreadable' ? 1 : Math.max(1, d.statistics.length + d.findings.length)), 0);
    expect(rows).toHaveLength(1 + expected);
    for (const row of rows) expect(row).toHaveLength(HEADER.length);
  });
});

describe('formatCsv: symbols tested as another kind, and df worked out from n', () => {
  it('writes the symbol beside the kind, and says when df were worked out from the sample size', () => {
    const text = 'Sites differed, H(2) = 9.84, p = .007. Ranks correlated, rs(58) = .32, p = .013. Scores correlated, r = .30, p = .004, n = 90.';
    const rows = records(formatCsv(buildReport([auditText(text, resolveConfig({}), 'symbols.txt')])));
    expect(rows.map((row) => row.test)).toEqual(['H (chi2)', 'rs (r)', 'r']);
    expect(rows[2]).toMatchObject({ df: '88 (from n)', note: 'df worked out from the sample size written after the result' });
    expect(rows[0]!.note).toBe('');
  });
});

/** Rows as the schema describes them: the numeric columns as numbers, the text columns as text, empty cells as null. */
function readTyped(csv: string): Record<string, unknown>[] {
  const numeric = new Set<string>(CSV_COLUMNS.filter((c) => c.numeric).map((c) => c.name));
  const parsed = Papa.parse<Record<string, unknown>>(csv, {
    header: true,
    skipEmptyLines: true,
    dynamicTyping: (field) => numeric.has(String(field)),
    transform: (value) => value,
  });
  return parsed.data.map((row) => Object.fromEntries(Object.entries(row).map(([name, value]) => [name, value === '' ? null : value])));
}

describe('formatCsv: its JSON Schema', () => {
  it('schema/report-csv.schema.json is the one generated from the columns (run `npm run schema` after changing them)', () => {
    const committed = JSON.parse(readFileSync('schema/report-csv.schema.json', 'utf8'));
    expect(committed).toEqual(JSON.parse(JSON.stringify(csvRowJsonSchema())));
    expect(committed['x-columns']).toEqual(HEADER);
  });

  it('every row of every fixture report, read with its header and typed numbers, is valid against it; a wrong row is not', () => {
    const schema = z.fromJSONSchema(csvRowJsonSchema() as Parameters<typeof z.fromJSONSchema>[0]);
    const config = resolveConfig({});
    const table = ['Table 2. Analysis of variance', 'Source | SS | df | MS | F | p', 'Condition | 12.40 | 2 | 6.20 | 2.41 | .099', 'Error | 83.95 | 57 | 1.47 | |'].join('\n');
    const reports = [corpusReport(), hostileReport(), demoReport(), buildReport([auditText(table, config, 'table.txt'), auditText('Nothing here.', config, 'none.txt')])];
    let checked = 0;
    for (const report of reports) {
      const typed = readTyped(formatCsv(report));
      for (const row of typed) {
        const result = schema.safeParse(row);
        expect(result.success, JSON.stringify(row)).toBe(true);
        checked += 1;
      }
    }
    expect(checked).toBeGreaterThan(100);
    const [row] = readTyped(formatCsv(corpusReport()));
    expect(schema.safeParse({ ...row, verdict: 'wrong' }).success).toBe(false);
    expect(schema.safeParse({ ...row, line: 'twelve' }).success).toBe(false);
    expect(schema.safeParse({ ...row, extra: 1 }).success).toBe(false);
    const { document: _document, ...withoutDocument } = row!;
    expect(schema.safeParse(withoutDocument).success).toBe(false);
  });

  it('carries what a table row that does not add up implies', () => {
    const table = ['Table 2. Analysis of variance', 'Source | SS | df | MS | F | p', 'Condition | 12.40 | 2 | 6.20 | 2.41 | .099', 'Error | 83.95 | 57 | 1.47 | |'].join('\n');
    const report = buildReport([auditText(table, resolveConfig({}), 'table.txt')]);
    const implied = report.documents[0]!.statistics[0]!.findings.find((f) => f.rowImplies)!.rowImplies!;
    const [row] = records(formatCsv(report));
    expect(row).toMatchObject({ in: 'table', 'row implies F': String(implied.statistic), 'row implies p': String(implied.p), verdict: 'fail' });
  });
});
