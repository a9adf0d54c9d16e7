import { createHash } from 'node:crypto';
import { parseDocument } from 'htmlparser2';
import { Element, Text, type ChildNode } from 'domhandler';
import { describe, expect, it } from 'vitest';
import { formatHtml } from '../../src/report/html.js';
import type { Report } from '../../src/report/model.js';
import { corpusReport, demoReport, hostileReport, HOSTILE_PATH, singleFailReport, UNREADABLE_ERROR } from '../fixtures/report/reports.js';

function elements(nodes: readonly ChildNode[]): Element[] {
  const found: Element[] = [];
  const walk = (list: readonly ChildNode[]): void => {
    for (const node of list) {
      if (node instanceof Element) {
        found.push(node);
        walk(node.children);
      }
    }
  };
  walk(nodes);
  return found;
}

function textOf(node: ChildNode): string {
  if (node instanceof Text) return node.data;
  if (node instanceof Element) return node.children.map(textOf).join('');
  return '';
}

function hasClass(element: Element, name: string): boolean {
  return (element.attribs.class ?? '').split(/\s+/).includes(name);
}

function parse(html: string): Element[] {
  return elements(parseDocument(html, { decodeEntities: true }).children);
}

function countFindings(report: Report): number {
  return report.documents.reduce((n, d) => n + d.findings.length + d.statistics.reduce((m, s) => m + s.findings.length, 0), 0);
}

describe('formatHtml: structure', () => {
  const report = corpusReport();
  const html = formatHtml(report);
  const all = parse(html);

  it('is one self-contained page: no external script, style, font, image or link', () => {
    expect(html.startsWith('<!DOCTYPE html>')).toBe(true);
    for (const element of all) {
      expect(element.attribs.src, `${element.name} has src`).toBeUndefined();
      if (element.name === 'link') throw new Error('a <link> element would load something');
      const href = element.attribs.href;
      if (href !== undefined) expect(href.startsWith('#'), `href ${href}`).toBe(true);
    }
    expect(html).not.toMatch(/@import|url\(|https?:\/\/(?!www\.w3\.org\/2000\/svg)/);
  });

  it('allows its one inline script and its one style by their sha256 hashes, and nothing else', () => {
    const scripts = all.filter((el) => el.name === 'script');
    expect(scripts).toHaveLength(1);
    const styles = all.filter((el) => el.name === 'style');
    expect(styles).toHaveLength(1);
    const csp = all.find((el) => el.name === 'meta' && el.attribs['http-equiv'] === 'Content-Security-Policy')?.attribs.content;
    expect(csp).toBeDefined();
    const hash = (node: Element) => createHash('sha256').update(textOf(node), 'utf8').digest('base64');
    const directives = Object.fromEntries(
      csp!.split(';').map((part) => {
        const [name, ...values] = part.trim().split(/\s+/);
        return [name, values];
      }),
    );
    expect(directives['default-src']).toEqual(["'none'"]);
    expect(directives['script-src']).toEqual([`'sha256-${hash(scripts[0]!)}'`]);
    expect(directives['style-src']).toEqual([`'sha256-${hash(styles[0]!)}'`]);
    // The policy comes before the style and the script.
    expect(html.indexOf('Content-Security-Policy')).toBeLessThan(html.indexOf('<style>'));
  });

  it('shows the caution, the totals, and each flagged result marked inside its surrounding text', () => {
    expect(html).toContain(report.caution);
    const marks = all.filter((el) => el.name === 'mark');
    const flagged = report.documents.flatMap((d) => d.statistics.filter((s) => s.findings.length > 0));
    expect(marks).toHaveLength(report.summary.flaggedStatistics);
    expect(marks.map(textOf)).toEqual(flagged.map((s) => s.text));
    const contexts = all.filter((el) => hasClass(el, 'context')).map(textOf);
    flagged.forEach((statistic, i) => {
      expect(contexts[i]).toContain(`${statistic.surroundings.before}${statistic.text}${statistic.surroundings.after}`);
    });
    const findings = all.filter((el) => hasClass(el, 'finding'));
    expect(findings).toHaveLength(countFindings(report));
    const first = report.documents.flatMap((d) => d.statistics).find((s) => s.findings.length > 0)!;
    const firstFinding = findings[0]!;
    expect(firstFinding.attribs['data-severity']).toBe(first.findings[0]!.severity);
    expect(firstFinding.attribs['data-rule']).toBe(first.findings[0]!.rule);
    expect(textOf(firstFinding)).toContain(first.findings[0]!.message);
  });

  it('gives each flagged result its location', () => {
    const wheres = all.filter((el) => el.name === 'div' && hasClass(el, 'where')).map(textOf);
    const flagged = report.documents.flatMap((d) => d.statistics.filter((s) => s.findings.length > 0));
    expect(wheres).toEqual(flagged.map((s) => `line ${s.location.line}, column ${s.location.column}`));
  });

  it('has a filter checkbox per severity and per rule, each with the matching count', () => {
    const boxes = all.filter((el) => el.name === 'input' && el.attribs.type === 'checkbox');
    expect(boxes.filter((b) => b.attribs['data-group'] === 'severity').map((b) => b.attribs.value)).toEqual(['fail', 'warn', 'note']);
    const rules = new Set(report.documents.flatMap((d) => d.statistics.flatMap((s) => s.findings.map((f) => f.rule))));
    expect(new Set(boxes.filter((b) => b.attribs['data-group'] === 'rule').map((b) => b.attribs.value))).toEqual(rules);
    expect(boxes.every((b) => b.attribs.checked !== undefined)).toBe(true);
  });

  it('ranks documents by number of flags', () => {
    const table = all.find((el) => el.name === 'table' && hasClass(el, 'ranking'))!;
    const rows = elements(table.children).filter((el) => el.name === 'tr').slice(1);
    expect(rows).toHaveLength(report.documents.length);
    const flags = rows.map((row) => Number(textOf(row.children.filter((c): c is Element => c instanceof Element)[2]!)));
    expect(flags).toEqual([...flags].sort((a, b) => b - a));
    const expected = report.documents
      .map((d) => d.findings.length + d.statistics.reduce((n, s) => n + s.findings.length, 0))
      .sort((a, b) => b - a);
    expect(flags).toEqual(expected);
  });

  it('counts flags by rule', () => {
    const table = all.find((el) => el.name === 'table' && hasClass(el, 'by-rule'))!;
    const rows = elements(table.children).filter((el) => el.name === 'tr').slice(1);
    const counted = Object.fromEntries(
      rows.map((row) => {
        const cells = row.children.filter((c): c is Element => c instanceof Element).map(textOf);
        return [cells[0], Number(cells[1])];
      }),
    );
    const expected: Record<string, number> = {};
    for (const finding of report.documents.flatMap((d) => [...d.findings, ...d.statistics.flatMap((s) => s.findings)])) {
      expected[finding.rule] = (expected[finding.rule] ?? 0) + 1;
    }
    expect(counted).toEqual(expected);
  });

  it('draws one chart mark per result with a reported and a recomputed p, "<" values as triangles, and the diagonal', () => {
    const svg = all.find((el) => el.name === 'svg' && hasClass(el, 'chart'))!;
    const inChart = elements(svg.children);
    const points = inChart.filter((el) => el.name === 'a' && hasClass(el, 'point'));
    const drawable = report.documents.flatMap((d) => d.statistics).filter((s) => s.p !== null && s.recomputed.p !== null);
    expect(points).toHaveLength(drawable.length);
    const below = drawable.filter((s) => s.p!.comparator === '<' || s.p!.comparator === '<=').length;
    expect(below).toBeGreaterThan(0);
    expect(points.filter((p) => p.attribs['data-comparator'] === 'below')).toHaveLength(below);
    for (const point of points.filter((p) => p.attribs['data-comparator'] === 'below')) {
      expect(elements(point.children).some((el) => el.name === 'path')).toBe(true);
    }
    for (const point of points.filter((p) => p.attribs['data-comparator'] === 'equal')) {
      expect(elements(point.children).some((el) => el.name === 'circle')).toBe(true);
    }
    expect(inChart.filter((el) => el.name === 'line' && hasClass(el, 'diagonal'))).toHaveLength(1);
    const severities = new Set(points.map((p) => p.attribs['data-severity']));
    expect(severities.has('fail')).toBe(true);
    expect(severities.has('none')).toBe(true);
  });
});

describe('formatHtml: the chart puts each mark on the right side of the diagonal', () => {
  it('a reported p larger than the recomputed one lies above the diagonal, a smaller one below', () => {
    const html = formatHtml(hostileReport());
    const all = parse(html);
    const svg = all.find((el) => el.name === 'svg' && hasClass(el, 'chart'))!;
    const diagonal = elements(svg.children).find((el) => hasClass(el, 'diagonal'))!;
    const [x1, y1, x2, y2] = ['x1', 'y1', 'x2', 'y2'].map((k) => Number(diagonal.attribs[k]));
    const side = (point: Element): number => {
      const circle = elements(point.children).find((el) => el.name === 'circle')!;
      const cx = Number(circle.attribs.cx);
      const cy = Number(circle.attribs.cy);
      // Screen y grows downwards: a positive cross product is above the line.
      return (x2! - x1!) * (y1! - cy) - (y2! - y1!) * (x1! - cx) > 0 ? 1 : -1;
    };
    const points = elements(svg.children).filter((el) => el.name === 'a' && hasClass(el, 'point'));
    const byText = (fragment: string) => points.find((p) => textOf(p).includes(fragment))!;
    expect(side(byText('t(40) = 2.10, p = .21'))).toBe(1); // printed .21, recomputed .042
    expect(side(byText('F(2, 57) = 4.21, p = .002'))).toBe(-1); // printed .002, recomputed .0197
  });
});

describe('formatHtml: escaping', () => {
  const report = hostileReport();
  const html = formatHtml(report);
  const all = parse(html);

  it('shows markup from a manuscript as text, never as elements', () => {
    for (const raw of [
      '<script>window.__pwned',
      '<img src=x',
      '"><svg onload',
      '<iframe',
      '<a href="javascript',
      '</script><script>',
      '<b>bold</b>',
      "<script>alert('path')",
      '<i>scan</i>',
      '<img src=x onerror=alert(9)>',
    ]) {
      expect(html, raw).not.toContain(raw);
    }
    expect(html).toContain('&lt;script&gt;window.__pwned = 1; document.title = &#39;pwned&#39;;&lt;/script&gt;');
    expect(html).toContain('&lt;img src=x onerror=&quot;window.__pwned = 2; alert(1)&quot;&gt;');
    expect(html).toContain('&quot;&gt;&lt;svg onload=');
    expect(html).toContain('papers/&lt;b&gt;bold&lt;/b&gt;&quot;quoted&#39;&lt;script&gt;alert(&#39;path&#39;)&lt;/script&gt;.txt');
  });

  it('has no element or attribute that came from a document', () => {
    const allowed = new Set([
      'html', 'head', 'meta', 'title', 'style', 'body', 'main', 'header', 'footer', 'section', 'article', 'h1', 'h2', 'h3', 'h4', 'p', 'div', 'span',
      'strong', 'code', 'mark', 'ul', 'li', 'a', 'table', 'thead', 'tbody', 'tr', 'th', 'td', 'details', 'summary', 'figure', 'figcaption',
      'form', 'fieldset', 'legend', 'label', 'input', 'button', 'script', 'svg', 'rect', 'line', 'text', 'path', 'circle',
    ]);
    for (const element of all) {
      expect(allowed.has(element.name), `unexpected <${element.name}>`).toBe(true);
      for (const name of Object.keys(element.attribs)) expect(name.startsWith('on'), `attribute ${name} on <${element.name}>`).toBe(false);
    }
    expect(all.filter((el) => el.name === 'script')).toHaveLength(1);
  });

  it('keeps the text itself: paths, surroundings and errors read back exactly once decoded', () => {
    const headings = all.filter((el) => el.name === 'h3').map(textOf);
    expect(headings).toContain(HOSTILE_PATH);
    const context = all.find((el) => hasClass(el, 'context'))!;
    const statistic = report.documents[0]!.statistics[0]!;
    expect(textOf(context)).toBe(`${statistic.surroundings.before}${statistic.text}${statistic.surroundings.after}`);
    const reason = all.find((el) => hasClass(el, 'reason'))!;
    expect(textOf(reason)).toBe(UNREADABLE_ERROR);
  });

  it('lists unreadable documents with their reason and clean documents in one line', () => {
    const unreadable = all.filter((el) => el.name === 'li' && hasClass(el, 'unreadable'));
    expect(unreadable).toHaveLength(1);
    expect(textOf(unreadable[0]!)).toContain('broken/<i>scan</i>.pdf');
    const clean = all.filter((el) => el.name === 'li' && hasClass(el, 'clean'));
    expect(clean).toHaveLength(1);
    expect(textOf(clean[0]!)).toContain('clean.txt: 1 result, none flagged');
  });
});

describe('formatHtml: small reports', () => {
  it('renders a single-document report without a ranking table', () => {
    const report = singleFailReport();
    const html = formatHtml(report);
    const all = parse(html);
    expect(all.some((el) => el.name === 'table' && hasClass(el, 'ranking'))).toBe(false);
    expect(all.filter((el) => hasClass(el, 'finding'))).toHaveLength(1);
    expect(all.find((el) => hasClass(el, 'finding'))!.attribs['data-severity']).toBe('fail');
  });

  it('says so when nothing was flagged or nothing could be drawn', () => {
    const report = singleFailReport();
    const empty: Report = { ...report, documents: [], summary: { ...report.summary, documents: 0, checked: 0, statistics: 0, flaggedStatistics: 0, findings: { fail: 0, warn: 0, note: 0 }, crossesAlpha: 0 } };
    const html = formatHtml(empty);
    expect(html).toContain('No result was flagged.');
    expect(html).toContain('nothing to draw');
    expect(html).toContain(report.caution);
  });
});

describe('formatHtml: the corpus-demo manuscripts', () => {
  it('marks every flagged result and lists every flag', () => {
    const report = demoReport();
    const all = parse(formatHtml(report));
    expect(all.filter((el) => el.name === 'mark')).toHaveLength(report.summary.flaggedStatistics);
    expect(all.filter((el) => hasClass(el, 'finding'))).toHaveLength(countFindings(report));
    expect(all.filter((el) => el.name === 'script')).toHaveLength(1);
  });
});
