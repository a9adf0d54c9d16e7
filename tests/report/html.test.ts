import { createHash } from 'node:crypto';
import { parseDocument } from 'htmlparser2';
import { Element, Text, type ChildNode } from 'domhandler';
import { describe, expect, it } from 'vitest';
import { auditText, buildReport } from '../../src/audit.js';
import { resolveConfig } from '../../src/checks/config.js';
import { documentData, formatHtml, htmlPieces } from '../../src/report/html.js';
import type { DocumentOutput, Report } from '../../src/report/model.js';
import { htmlDataBlocks, htmlDocumentsData } from './htmlData.js';
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

/**
 * The page without a browser: its fixed parts (self-contained, its policy, its totals) and the documents' data
 * it carries, written a document at a time. What the script draws from that data is checked in Chromium
 * (tests/browser/html-drawn.test.ts and tests/browser/html-report.test.ts).
 */

describe('formatHtml: the page', () => {
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

  it('allows its one script and its one style by their sha256 hashes, and nothing else; the data blocks are not scripts', () => {
    const scripts = all.filter((el) => el.name === 'script');
    const code = scripts.filter((el) => el.attribs.type === undefined);
    const data = scripts.filter((el) => el.attribs.type === 'application/json');
    expect(code).toHaveLength(1);
    expect(data.length).toBeGreaterThan(0);
    expect(code.length + data.length).toBe(scripts.length);
    // The page's script comes last, after every data block it reads.
    expect(scripts.at(-1)).toBe(code[0]);
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
    expect(directives['script-src']).toEqual([`'sha256-${hash(code[0]!)}'`]);
    expect(directives['style-src']).toEqual([`'sha256-${hash(styles[0]!)}'`]);
    // The policy comes before the style and the scripts.
    expect(html.indexOf('Content-Security-Policy')).toBeLessThan(html.indexOf('<style>'));
  });

  it('shows the caution and the totals as markup, and says what to read where scripts do not run', () => {
    expect(all.filter((el) => hasClass(el, 'caution')).map(textOf)).toEqual([report.caution, report.caution]);
    const totals = textOf(all.find((el) => hasClass(el, 'totals'))!);
    expect(totals).toContain(`${report.summary.documents} documents`);
    expect(totals).toContain(`${report.summary.flaggedStatistics} flagged`);
    expect(textOf(all.find((el) => el.name === 'noscript')!)).toContain('--format md');
    const severityBoxes = all.filter((el) => el.name === 'input' && el.attribs['data-group'] === 'severity');
    expect(severityBoxes.map((b) => b.attribs.value)).toEqual(['fail', 'warn', 'note']);
  });

  it('carries every document as data, in the order of the report, each as documentData makes it', () => {
    const data = htmlDocumentsData(html);
    expect(data).toEqual(report.documents.map(documentData));
    expect(data.map((d) => d.p)).toEqual(report.documents.map((d) => d.path));
  });

  it('holds in the data what the cards, maps and tables need: each flagged result in its surrounding text, its findings, every result', () => {
    report.documents.forEach((document, index) => {
      const data = htmlDocumentsData(html)[index]!;
      expect(data.r ?? []).toHaveLength(document.statistics.length);
      const flagged = document.statistics.map((s, i) => ({ s, i })).filter(({ s }) => s.findings.length > 0);
      expect((data.c ?? []).map((card) => card[0])).toEqual(flagged.map(({ i }) => i));
      (data.c ?? []).forEach((card, k) => {
        const statistic = flagged[k]!.s;
        const text = card[5] || data.r![card[0]]![4];
        expect(`${card[1]}${text}${card[2]}`.replace(/^\u2026/, '')).toBe(`${statistic.surroundings.before}${statistic.text}${statistic.surroundings.after}`);
        expect(card[4].map((f) => [f[1], f[3]])).toEqual(statistic.findings.map((f) => [f.rule, f.message]));
        // The worst flag of the result, as the map and the table of all results draw it.
        const worst = Math.max(...statistic.findings.map((f) => ({ fail: 3, warn: 2, note: 1 })[f.severity]));
        expect(data.r![card[0]]![7]).toBe(worst);
      });
      // The map places each result by its offset in the document, in order.
      const xs = [...(data.r ?? [])].map((r, i) => ({ x: r[3], start: document.statistics[i]!.location.start })).sort((a, b) => a.start - b.start);
      for (let i = 1; i < xs.length; i++) expect(xs[i]!.x).toBeGreaterThanOrEqual(xs[i - 1]!.x);
    });
  });

  it('writes the reported p of a result once: as the length of the end of its text when it ends with it', () => {
    const statistic = report.documents.flatMap((d) => d.statistics).find((s) => s.p !== null && s.text.endsWith(`p ${s.p.comparator} ${s.p.text}`))!;
    const data = documentData({ ...report.documents[0]!, statistics: [statistic] } as DocumentOutput);
    const [row] = data.r!;
    expect(row![5]).toBe(`${statistic.p!.comparator} ${statistic.p!.text}`.length);
    expect(row![4].slice(row![4].length - Number(row![5]))).toBe(`${statistic.p!.comparator} ${statistic.p!.text}`);
  });
});

describe('formatHtml: written a document at a time', () => {
  it('reads a document only when its data block is written, and holds at most 200 documents in a block', () => {
    const base = corpusReport();
    const documents = Array.from({ length: 450 }, (_, i) => ({ ...structuredClone(base.documents[i % base.documents.length]!), path: `copy-${String(i).padStart(3, '0')}.txt` }));
    const report = buildReport(documents);
    let read = 0;
    const pieces = htmlPieces(
      {
        caution: report.caution,
        summary: report.summary,
        documents: function* () {
          for (const document of documents) {
            read += 1;
            yield document;
          }
        },
      },
      report.tool,
    )[Symbol.iterator]();
    const head = pieces.next().value as string;
    expect(head).toContain('<h1>plumbline report</h1>');
    expect(read).toBe(0);
    const first = pieces.next().value as string;
    expect(read).toBe(200);
    expect(htmlDocumentsData(first)).toHaveLength(200);
    const rest: string[] = [];
    for (let piece = pieces.next(); !piece.done; piece = pieces.next()) rest.push(piece.value);
    expect(read).toBe(450);
    const whole = head + first + rest.join('');
    expect(whole).toBe(formatHtml(report));
    expect(htmlDataBlocks(whole).map((block) => (JSON.parse(block) as unknown[]).length)).toEqual([200, 200, 50]);
  });
});

describe('formatHtml: escaping', () => {
  const report = hostileReport();
  const html = formatHtml(report);
  const all = parse(html);

  it('writes markup from a manuscript only inside JSON strings, with every < escaped', () => {
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
    for (const block of htmlDataBlocks(html)) expect(block).not.toContain('<');
    // Our own closing tags only: one per data block and the script's.
    expect(html.match(/<\/script/gi)).toHaveLength(htmlDataBlocks(html).length + 1);
  });

  it('has no element or attribute that came from a document', () => {
    const allowed = new Set([
      'html', 'head', 'meta', 'title', 'style', 'body', 'main', 'header', 'footer', 'section', 'h1', 'h2', 'h3', 'p', 'div', 'span',
      'strong', 'code', 'ul', 'li', 'table', 'thead', 'tbody', 'tr', 'th', 'noscript',
      'form', 'fieldset', 'legend', 'label', 'input', 'button', 'script', 'svg', 'rect', 'path', 'circle', 'nav', 'select', 'option',
    ]);
    for (const element of all) {
      expect(allowed.has(element.name), `unexpected <${element.name}>`).toBe(true);
      for (const name of Object.keys(element.attribs)) expect(name.startsWith('on'), `attribute ${name} on <${element.name}>`).toBe(false);
    }
  });

  it('keeps the text itself: paths, surroundings and errors read back exactly from the data', () => {
    const [hostile, clean, broken] = htmlDocumentsData(html);
    expect(hostile!.p).toBe(HOSTILE_PATH);
    const statistic = report.documents[0]!.statistics[0]!;
    const card = hostile!.c![0]!;
    expect(`${card[1]}${card[5] || hostile!.r![card[0]]![4]}${card[2]}`).toBe(`${statistic.surroundings.before}${statistic.text}${statistic.surroundings.after}`);
    expect(broken!.x).toBe(UNREADABLE_ERROR);
    expect(clean!.r).toHaveLength(1);
    expect(clean!.c).toBeUndefined();
  });
});

describe('formatHtml: small reports', () => {
  it('says so when nothing was flagged', () => {
    const report = singleFailReport();
    const empty: Report = { ...report, documents: [], summary: { ...report.summary, documents: 0, checked: 0, statistics: 0, flaggedStatistics: 0, findings: { fail: 0, warn: 0, note: 0 }, crossesAlpha: 0 } };
    const html = formatHtml(empty);
    expect(html).toContain('No result was flagged.');
    expect(html).toContain(report.caution);
    expect(htmlDocumentsData(html)).toEqual([]);
    expect(parse(html).some((el) => el.attribs.id === 'filters')).toBe(false);
  });

  it('carries every flag of the corpus-demo manuscripts', () => {
    const report = demoReport();
    const data = htmlDocumentsData(formatHtml(report));
    const flags = data.reduce((n, d) => n + (d.g ?? []).length + (d.c ?? []).reduce((m, card) => m + card[4].length, 0), 0);
    expect(flags).toBe(countFindings(report));
    expect(data.reduce((n, d) => n + (d.c ?? []).length, 0)).toBe(report.summary.flaggedStatistics);
  });
});

describe('formatHtml: a table row that does not add up', () => {
  it("carries the F and p the row's own SS and df imply, beside the printed F's p", () => {
    const text = [
      'Table 2. Analysis of variance for recall',
      'Source | SS | df | MS | F | p',
      'Condition | 12.40 | 2 | 6.20 | 2.41 | .099',
      'Error | 83.95 | 57 | 1.47 | |',
    ].join('\n');
    const report = buildReport([auditText(text, resolveConfig({}), 'table.txt')]);
    const card = htmlDocumentsData(formatHtml(report))[0]!.c![0]!;
    const finding = card[4].find((f) => f[1] === 'table-arithmetic')!;
    // (12.40 / 2) / (83.95 / 57) = 4.21, p = .0197 at df 2 and 57; the printed F = 2.41 gives p = .099.
    expect(finding[5]).toBe(
      "The row\u2019s own numbers imply F = 4.21 (4.208 to 4.212), p = 0.01972 (0.01968 to 0.01975): SS / df over SS / df of 'Error'; in brackets, the range over the values that round to the printed cells.",
    );
    // Reported p, recomputed p from the printed F (three significant digits), upper tail, from the printed F.
    expect(card[3].slice(0, 2)).toEqual(['= .099', 0.0989]);
    expect(card[3].slice(4, 6)).toEqual([1, 1]);
  });
});
