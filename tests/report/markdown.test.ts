import MarkdownIt from 'markdown-it';
import { parseDocument } from 'htmlparser2';
import { Element, Text, type ChildNode } from 'domhandler';
import { describe, expect, it } from 'vitest';
import { buildReport } from '../../src/audit.js';
import { codeSpan, escapeMarkdown, formatMarkdown } from '../../src/report/markdown.js';
import type { Report } from '../../src/report/model.js';
import { corpusReport, demoReport, hostileReport, HOSTILE_PATH, singleFailReport } from '../fixtures/report/reports.js';

/** Renders Markdown the way a CommonMark viewer would, with raw HTML allowed (the worst case). */
const markdown = new MarkdownIt({ html: true, linkify: false });

function elements(nodes: readonly ChildNode[]): Element[] {
  const found: Element[] = [];
  for (const node of nodes) {
    if (node instanceof Element) found.push(node, ...elements(node.children));
  }
  return found;
}

function textOf(node: ChildNode): string {
  if (node instanceof Text) return node.data;
  if (node instanceof Element) return node.children.map(textOf).join('');
  return '';
}

function rendered(source: string): Element[] {
  return elements(parseDocument(markdown.render(source), { decodeEntities: true }).children);
}

function flat(text: string): string {
  return text.replace(/\s+/g, ' ').trim();
}

describe('formatMarkdown', () => {
  const report = corpusReport();
  const md = formatMarkdown(report);
  const html = rendered(md);

  it('lists every flag with its severity, rule and message, under its result', () => {
    const flagLines = md.split('\n').filter((line) => /^\s+- \*\*(fail|warn|note)\*\*/.test(line));
    const findings = report.documents.flatMap((d) => [...d.findings, ...d.statistics.flatMap((s) => s.findings)]);
    expect(flagLines).toHaveLength(findings.length);
    const items = html.filter((el) => el.name === 'li' && el.children.some((c) => c instanceof Element && c.name === 'strong'));
    expect(items.map((li) => flat(textOf(li)))).toEqual(
      findings.map((f) => `${f.severity} ${f.rule}${f.crossesAlpha ? ' (changes the conclusion at alpha)' : ''}: ${flat(f.message)}`),
    );
  });

  it('gives each flagged result its location and its text in a code span', () => {
    const flagged = report.documents.flatMap((d) => d.statistics.filter((s) => s.findings.length > 0));
    const codes = html.filter((el) => el.name === 'code').map(textOf);
    for (const statistic of flagged) {
      expect(md).toContain(`- line ${statistic.location.line}, column ${statistic.location.column}: `);
      expect(codes).toContain(flat(statistic.text));
    }
  });

  it('has a heading per document with flags, the totals and the caution', () => {
    const headings = html.filter((el) => el.name === 'h3' && el.children.some((c) => c instanceof Element && c.name === 'code')).map(textOf);
    expect(html.filter((el) => el.name === 'h3').map(textOf)).toContain('Documents without flags');
    const withFlags = report.documents.filter((d) => d.statistics.some((s) => s.findings.length > 0) || d.findings.length > 0);
    expect(headings).toEqual(withFlags.map((d) => d.path));
    const { summary } = report;
    expect(md).toContain(`${summary.statistics} results (${summary.resultsInText} in text, ${summary.resultsInTables} in tables), ${summary.flaggedStatistics} of them flagged`);
    expect(md).toContain(`${summary.tablesNotRead} results tables not read`);
    const findings = summary.findings.fail + summary.findings.warn + summary.findings.note;
    expect(md).toContain(`; ${findings} findings (${summary.findings.fail} fail, ${summary.findings.warn} warn, ${summary.findings.note} note)`);
    expect(textOf(html.find((el) => el.name === 'blockquote')!).trim()).toBe(report.caution);
  });

  it('gives documents without flags and unreadable documents one line each', () => {
    const hostile = formatMarkdown(hostileReport());
    expect(hostile).toContain('- `clean.txt`: 1 result, none flagged.');
    const unreadableLines = hostile.split('\n').filter((line) => line.startsWith('- `broken/<i>scan</i>.pdf`'));
    expect(unreadableLines).toHaveLength(1);
  });

  it('says so when nothing was flagged', () => {
    const empty: Report = buildReport([]);
    const text = formatMarkdown(empty);
    expect(text).toContain('0 documents');
    expect(text).toContain(empty.caution);
  });
});

describe('formatMarkdown: escaping', () => {
  it('keeps backticks inside a result text in its code span', () => {
    const report = singleFailReport();
    report.documents[0]!.statistics[0]!.text = 'F(2, 57) = 4.21 ``x` `';
    const md = formatMarkdown(report);
    const codes = rendered(md).filter((el) => el.name === 'code').map(textOf);
    expect(codes).toContain('F(2, 57) = 4.21 ``x` `');
    expect(codeSpan('`a`')).toBe('`` `a` ``');
    expect(codeSpan('plain')).toBe('`plain`');
  });

  it('renders nothing from a manuscript as HTML, links or emphasis', () => {
    const report = hostileReport();
    const first = report.documents[0]!.statistics[0]!.findings[0]!;
    first.message = `${first.message} <img src=x onerror=alert(1)> [link](javascript:alert(2)) *bold* _it_ &amp; \`tick\``;
    const md = formatMarkdown(report);
    const all = rendered(md);
    const allowed = new Set(['h2', 'h3', 'p', 'strong', 'code', 'ul', 'li', 'blockquote']);
    for (const element of all) expect(allowed.has(element.name), `<${element.name}>`).toBe(true);
    const strong = all.filter((el) => el.name === 'strong').map(textOf);
    expect(strong.every((s) => ['Totals:', 'fail', 'warn', 'note'].includes(s))).toBe(true);
    const item = all.find((el) => el.name === 'li' && textOf(el).includes('onerror'))!;
    expect(textOf(item)).toContain('<img src=x onerror=alert(1)> [link](javascript:alert(2)) *bold* _it_ &amp; `tick`');
    expect(all.filter((el) => el.name === 'h3').map(textOf)).toContain(HOSTILE_PATH);
  });

  it('leaves a plain "p < .05" readable', () => {
    expect(escapeMarkdown('p < .05 and p > .01')).toBe('p < .05 and p > .01');
    expect(escapeMarkdown('<b>')).toBe('\\<b>');
  });
});

describe('formatMarkdown: the corpus-demo manuscripts', () => {
  it('lists every flag', () => {
    const report = demoReport();
    const md = formatMarkdown(report);
    const flagLines = md.split('\n').filter((line) => /^\s+- \*\*(fail|warn|note)\*\*/.test(line));
    const { fail, warn, note } = report.summary.findings;
    expect(flagLines).toHaveLength(fail + warn + note);
  });
});
