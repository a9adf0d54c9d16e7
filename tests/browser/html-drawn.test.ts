/**
 * The HTML report as its script draws it, in headless Chromium: every page of
 * every list shown and every table of all results opened, the page's DOM is
 * read back and checked as markup (cards, contexts, locations, filters, the
 * ranking, the flags by rule, the maps, the links, the lists, escaping). The
 * page itself holds the documents as data (tests/report/html.test.ts checks
 * that data and the page's fixed parts without a browser).
 *
 * Needs Debian's chromium, as tests/browser/html-report.test.ts (which says
 * so when it is missing, and fails in CI without it).
 */
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { parseDocument } from 'htmlparser2';
import { Element, Text, type ChildNode } from 'domhandler';
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditText, buildReport } from '../../src/audit.js';
import { resolveConfig } from '../../src/checks/config.js';
import { formatHtml } from '../../src/report/html.js';
import type { Report } from '../../src/report/model.js';
import { corpusReport, demoReport, hostileReport, HOSTILE_PATH, singleFailReport, UNREADABLE_ERROR } from '../fixtures/report/reports.js';

const CHROMIUM = '/usr/bin/chromium';

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

function countFindings(report: Report): number {
  return report.documents.reduce((n, d) => n + d.findings.length + d.statistics.reduce((m, s) => m + s.findings.length, 0), 0);
}

describe.skipIf(!existsSync(CHROMIUM))('formatHtml: the page as its script draws it', () => {
  let browser: Browser;
  let folder: string;
  let pages = 0;

  beforeAll(async () => {
    folder = mkdtempSync(join(tmpdir(), 'plumbline-html-drawn-'));
    browser = await chromium.launch({ executablePath: CHROMIUM, headless: true, args: ['--headless', '--no-sandbox', '--disable-gpu'], timeout: 30_000 });
  }, 40_000);

  afterAll(async () => {
    await browser?.close();
    if (folder) rmSync(folder, { recursive: true, force: true });
  });

  /** The page's elements once drawn whole: every list on one page, every table of all results open. */
  async function drawn(report: Report): Promise<Element[]> {
    const file = join(folder, `page-${(pages += 1)}.html`);
    writeFileSync(file, formatHtml(report));
    const page = await browser.newPage();
    const errors: string[] = [];
    page.on('pageerror', (error) => errors.push(error.message));
    try {
      await page.goto(pathToFileURL(file).href, { waitUntil: 'load' });
      await page.waitForFunction(() => document.documentElement.hasAttribute('data-ready'));
      await page.evaluate(() => {
        for (const select of document.querySelectorAll<HTMLSelectElement>('nav.pager select[data-size]')) {
          select.value = '0';
          select.dispatchEvent(new Event('change'));
        }
        for (const details of document.querySelectorAll('details')) details.open = true;
      });
      // A table of all results is drawn when its details element is opened (the toggle event comes after).
      await page.waitForFunction(() => [...document.querySelectorAll('details')].every((details) => details.querySelector('table') !== null));
      const html = await page.evaluate(() => document.documentElement.outerHTML);
      expect(errors).toEqual([]);
      return elements(parseDocument(html, { decodeEntities: true }).children);
    } finally {
      await page.close();
    }
  }

  describe('structure', () => {
    const report = corpusReport();
    let all: Element[] = [];
    /** The flagged results in the order of their cards: the documents worst first (the ranking). */
    let cardOrder: Report['documents'][number]['statistics'] = [];
    beforeAll(async () => {
      all = await drawn(report);
      cardOrder = all
        .filter((el) => el.name === 'section' && hasClass(el, 'flagged'))
        .flatMap((section) => report.documents.find((d) => d.path === textOf(elements(section.children).find((el) => el.name === 'h3')!))!.statistics.filter((s) => s.findings.length > 0));
    }, 60_000);

    it('shows the caution, the totals, and each flagged result marked inside its surrounding text', () => {
      expect(all.filter((el) => hasClass(el, 'caution')).map(textOf)).toEqual([report.caution, report.caution]);
      const marks = all.filter((el) => el.name === 'mark');
      const flagged = cardOrder;
      expect(cardOrder).toHaveLength(report.summary.flaggedStatistics);
      expect(marks).toHaveLength(report.summary.flaggedStatistics);
      expect(marks.map(textOf)).toEqual(flagged.map((s) => s.text));
      const contexts = all.filter((el) => hasClass(el, 'context')).map(textOf);
      flagged.forEach((statistic, i) => {
        expect(contexts[i]).toContain(`${statistic.surroundings.before}${statistic.text}${statistic.surroundings.after}`);
      });
      const findings = all.filter((el) => hasClass(el, 'finding'));
      expect(findings).toHaveLength(countFindings(report));
      const first = cardOrder[0]!;
      const firstFinding = findings[0]!;
      expect(firstFinding.attribs['data-severity']).toBe(first.findings[0]!.severity);
      expect(firstFinding.attribs['data-rule']).toBe(first.findings[0]!.rule);
      expect(textOf(firstFinding)).toContain(first.findings[0]!.message);
    });

    it('gives each flagged result its location', () => {
      const wheres = all.filter((el) => el.name === 'div' && hasClass(el, 'where')).map(textOf);
      const flagged = cardOrder;
      expect(wheres).toEqual(flagged.map((s) => `line ${s.location.line}, column ${s.location.column}`));
    });

    it('has a filter checkbox per severity and per rule, each with the matching count', () => {
      const boxes = all.filter((el) => el.name === 'input' && el.attribs.type === 'checkbox' && el.attribs['data-group'] !== undefined);
      expect(boxes.filter((b) => b.attribs['data-group'] === 'severity').map((b) => b.attribs.value)).toEqual(['fail', 'warn', 'note']);
      const rules = new Set(report.documents.flatMap((d) => d.statistics.flatMap((s) => s.findings.map((f) => f.rule))));
      expect(new Set(boxes.filter((b) => b.attribs['data-group'] === 'rule').map((b) => b.attribs.value))).toEqual(rules);
      expect(boxes.every((b) => b.attribs.checked !== undefined)).toBe(true);
    });

    it('ranks documents by their worst flag, then by their numbers of fail, warn and note flags', () => {
      const table = all.find((el) => el.name === 'table' && hasClass(el, 'documents'))!;
      const rows = elements(table.children).filter((el) => el.name === 'tr' && el.attribs['data-rank'] !== undefined);
      expect(rows).toHaveLength(report.documents.length);
      const key = (row: Element): number[] => ['worst', 'fail', 'warn', 'note'].map((k) => Number(row.attribs[`data-${k}`]));
      for (let i = 1; i < rows.length; i++) {
        const [a, b] = [key(rows[i - 1]!), key(rows[i]!)];
        const firstDifference = a.findIndex((value, k) => value !== b[k]);
        if (firstDifference >= 0) expect(a[firstDifference]!, `row ${i}`).toBeGreaterThan(b[firstDifference]!);
      }
      expect(rows.map((row) => Number(row.attribs['data-rank']))).toEqual(rows.map((_, i) => i + 1));
      // The worst document of the fixture: reading-tutoring.txt has only fail flags.
      expect(rows[0]!.attribs['data-name']).toBe('corpus/reading-tutoring.txt');
      expect(rows.at(-1)!.attribs['data-worst']).toBe('0');
      const counted = rows.map((row) => Number(row.attribs['data-fail']) + Number(row.attribs['data-warn']) + Number(row.attribs['data-note']));
      expect(counted.reduce((a, b) => a + b, 0)).toBe(countFindings(report));
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

    it('maps each document: one mark per result, flagged ones as links by severity in colour and shape, the others as ticks', () => {
      const table = all.find((el) => el.name === 'table' && hasClass(el, 'documents'))!;
      const rows = elements(table.children).filter((el) => el.name === 'tr' && el.attribs['data-rank'] !== undefined);
      const shapes = { fail: 'rect', warn: 'path', note: 'circle' } as const;
      const colours = new Map<string, Set<string>>();
      for (const row of rows) {
        const documentIndex = report.documents.findIndex((d) => d.path === row.attribs['data-name']);
        const document = report.documents[documentIndex]!;
        const map = elements(row.children).find((el) => el.name === 'svg' && hasClass(el, 'map'));
        expect(map, document.path).toBeDefined();
        const marks = elements(map!.children).filter((el) => el.name === 'a' && hasClass(el, 'map-mark'));
        const flagged = document.statistics.map((s, i) => ({ s, i })).filter(({ s }) => s.findings.length > 0);
        expect(marks).toHaveLength(flagged.length);
        // Every flagged result has its mark, linking to its own card, with the worst severity's shape.
        const hrefs = marks.map((m) => m.attribs.href);
        for (const { s, i } of flagged) {
          const mark = marks[hrefs.indexOf(`#doc-${documentIndex + 1}-result-${i + 1}`)];
          expect(mark, `${document.path} result ${i + 1}`).toBeDefined();
          const worst = s.findings.some((f) => f.severity === 'fail') ? 'fail' : s.findings.some((f) => f.severity === 'warn') ? 'warn' : 'note';
          expect(mark!.attribs['data-severity']).toBe(worst);
          const shape = elements(mark!.children).find((el) => ['rect', 'path', 'circle'].includes(el.name))!;
          expect(shape.name).toBe(shapes[worst]);
          const set = colours.get(worst) ?? new Set<string>();
          set.add(shape.attribs.fill!);
          colours.set(worst, set);
          expect(textOf(mark!)).toContain(s.text.replace(/\s+/g, ' '));
        }
        // The results without a flag are ticks in one path, one "M ... v" each, and no link.
        const ticks = elements(map!.children).find((el) => hasClass(el, 'map-ticks'));
        const unflagged = document.statistics.length - flagged.length;
        expect(ticks === undefined ? 0 : (ticks.attribs.d!.match(/M/g) ?? []).length).toBe(unflagged);
        expect(ticks === undefined ? 0 : Number(ticks.attribs['data-count'])).toBe(unflagged);
      }
      // One colour per severity, a different one for each.
      expect([...colours.values()].every((set) => set.size === 1)).toBe(true);
      expect(new Set([...colours.values()].map((set) => [...set][0])).size).toBe(colours.size);
      expect(colours.has('fail') && colours.has('warn') && colours.has('note')).toBe(true);
    });

    it('places each mark by where its result is in the document, in order along the map', () => {
      const table = all.find((el) => el.name === 'table' && hasClass(el, 'documents'))!;
      for (const row of elements(table.children).filter((el) => el.name === 'tr' && el.attribs['data-rank'] !== undefined)) {
        const documentIndex = report.documents.findIndex((d) => d.path === row.attribs['data-name']);
        const document = report.documents[documentIndex]!;
        const marks = elements(row.children).filter((el) => el.name === 'a' && hasClass(el, 'map-mark'));
        const xOf = (mark: Element): number => {
          const shape = elements(mark.children).find((el) => ['rect', 'path', 'circle'].includes(el.name))!;
          if (shape.name === 'circle') return Number(shape.attribs.cx);
          if (shape.name === 'rect') return Number(shape.attribs.x) + Number(shape.attribs.width) / 2;
          return Number(/^M([\d.]+)/.exec(shape.attribs.d!)![1]);
        };
        const byStart = marks
          .map((mark) => ({ x: xOf(mark), start: document.statistics[Number(/result-(\d+)$/.exec(mark.attribs.href!)![1]) - 1]!.location.start }))
          .sort((a, b) => a.start - b.start);
        for (let i = 1; i < byStart.length; i++) expect(byStart[i]!.x).toBeGreaterThanOrEqual(byStart[i - 1]!.x);
        if (byStart.length > 1) expect(byStart.at(-1)!.x).toBeGreaterThan(byStart[0]!.x);
      }
    });

  });

  it('links only to anchors on the page: every href="#..." has its id, and only flagged results have anchors', async () => {
    for (const fixture of [corpusReport(), hostileReport(), demoReport()]) {
      const elementsOf = await drawn(fixture);
      const ids = new Set(elementsOf.map((el) => el.attribs.id).filter((id): id is string => id !== undefined));
      const hrefs = elementsOf.map((el) => el.attribs.href).filter((href): href is string => href !== undefined);
      expect(hrefs.length).toBeGreaterThan(0);
      for (const href of hrefs) {
        expect(href.startsWith('#'), href).toBe(true);
        expect(ids.has(href.slice(1)), `${href} has no element with its id`).toBe(true);
      }
      const resultIds = [...ids].filter((id) => /^doc-\d+-result-\d+$/.test(id));
      const flaggedCount = fixture.documents.reduce((n, d) => n + d.statistics.filter((s) => s.findings.length > 0).length, 0);
      expect(resultIds).toHaveLength(flaggedCount);
    }
  }, 60_000);

  describe('escaping', () => {
    const report = hostileReport();
    let all: Element[] = [];
    beforeAll(async () => {
      all = await drawn(report);
    }, 60_000);

    it('has no element or attribute that came from a document', () => {
      const allowed = new Set([
        'html', 'head', 'meta', 'title', 'style', 'body', 'main', 'header', 'footer', 'section', 'article', 'h1', 'h2', 'h3', 'h4', 'p', 'div', 'span',
        'strong', 'code', 'mark', 'ul', 'li', 'a', 'table', 'thead', 'tbody', 'tr', 'th', 'td', 'details', 'summary', 'noscript',
        'form', 'fieldset', 'legend', 'label', 'input', 'button', 'script', 'svg', 'rect', 'line', 'path', 'circle', 'nav', 'select', 'option',
      ]);
      for (const element of all) {
        expect(allowed.has(element.name), `unexpected <${element.name}>`).toBe(true);
        for (const name of Object.keys(element.attribs)) expect(name.startsWith('on'), `attribute ${name} on <${element.name}>`).toBe(false);
      }
      // The page's one script; the others are data, which no browser runs.
      const scripts = all.filter((el) => el.name === 'script');
      expect(scripts.filter((el) => el.attribs.type === undefined)).toHaveLength(1);
      expect(scripts.every((el) => el.attribs.type === undefined || el.attribs.type === 'application/json')).toBe(true);
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

  describe('small reports', () => {
    it('draws a single-document report with its one row and map', async () => {
      const all = await drawn(singleFailReport());
      const table = all.find((el) => el.name === 'table' && hasClass(el, 'documents'))!;
      expect(elements(table.children).filter((el) => el.name === 'tr' && el.attribs['data-rank'] !== undefined)).toHaveLength(1);
      expect(elements(table.children).filter((el) => hasClass(el, 'map-mark'))).toHaveLength(1);
      expect(all.filter((el) => hasClass(el, 'finding'))).toHaveLength(1);
      expect(all.find((el) => hasClass(el, 'finding'))!.attribs['data-severity']).toBe('fail');
    });

    it('marks every flagged result of the corpus-demo manuscripts and lists every flag', async () => {
      const report = demoReport();
      const all = await drawn(report);
      expect(all.filter((el) => el.name === 'mark')).toHaveLength(report.summary.flaggedStatistics);
      expect(all.filter((el) => hasClass(el, 'finding'))).toHaveLength(countFindings(report));
    });

    it("shows on the card the F and p the row's own SS and df imply, beside the printed F's p", async () => {
      const text = [
        'Table 2. Analysis of variance for recall',
        'Source | SS | df | MS | F | p',
        'Condition | 12.40 | 2 | 6.20 | 2.41 | .099',
        'Error | 83.95 | 57 | 1.47 | |',
      ].join('\n');
      const report = buildReport([auditText(text, resolveConfig({}), 'table.txt')]);
      const finding = report.documents[0]!.statistics[0]!.findings.find((f) => f.rule === 'table-arithmetic')!;
      expect(finding.rowImplies).toBeDefined();
      const all = await drawn(report);
      const card = all.find((el) => el.name === 'article' && hasClass(el, 'result'))!;
      const implied = elements(card.children).find((el) => hasClass(el, 'implied'));
      // (12.40 / 2) / (83.95 / 57) = 4.21, p = .0197 at df 2 and 57; the printed F = 2.41 gives p = .099.
      expect(textOf(implied!)).toBe(
        "The row\u2019s own numbers imply F = 4.21 (4.208 to 4.212), p = 0.01972 (0.01968 to 0.01975): SS / df over SS / df of 'Error'; in brackets, the range over the values that round to the printed cells.",
      );
      expect(textOf(elements(card.children).find((el) => hasClass(el, 'numbers'))!)).toContain('reported p = .099; recomputed p from the printed F = 0.0989');
    });
  });
});
