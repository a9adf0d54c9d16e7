/**
 * Opens the HTML report in headless Chromium (Debian's chromium package,
 * driven by playwright-core) and checks it as a reader would meet it: the
 * flagged results are visible, the filters hide and show them, the document
 * table sorts, searches and pages, the map's marks lead to their cards (on
 * any page, past any filter), seen marks last across a reload and the flags
 * shown are saved as CSV, text from a hostile manuscript runs no script, and
 * the page asks for nothing over the network.
 *
 * CI must have Debian's chromium installed (apt-get install -y chromium).
 * Elsewhere, without it, these tests are skipped with a warning that says why.
 */
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { buildReport } from '../../src/report/build.js';
import { formatHtml } from '../../src/report/html.js';
import type { Report } from '../../src/report/model.js';
import { corpusReport, hostileReport } from '../fixtures/report/reports.js';

/** `count` documents: the fixture corpus's documents again and again under new names, so the lists need paging. */
function manyDocuments(count: number): Report {
  const base = corpusReport().documents;
  const documents = Array.from({ length: count }, (_, i) => {
    const document = structuredClone(base[i % base.length]!);
    document.path = `batch/paper-${String(i).padStart(3, '0')}-${document.path.replace(/^.*\//, '')}`;
    return document;
  });
  return buildReport(documents);
}

const CHROMIUM = '/usr/bin/chromium';
const ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];
const available = existsSync(CHROMIUM);
const inCi = Boolean(process.env.CI);
const MISSING = `${CHROMIUM} is missing: the browser tests of the HTML report need Debian's chromium package (apt-get install -y chromium).`;

if (!available && !inCi) console.warn(`Skipping the browser tests of the HTML report: ${MISSING}`);

describe('HTML report in Chromium: the browser', () => {
  // Runs wherever chromium is present, and in CI, where its absence is an error; skipped (with the warning above) elsewhere.
  it.skipIf(!available && !inCi)(`is installed at ${CHROMIUM}`, () => {
    if (!available) throw new Error(`${MISSING} CI must install it before running the tests.`);
    expect(existsSync(CHROMIUM)).toBe(true);
  });
});

interface Watched {
  page: Page;
  url: string;
  requests: string[];
  /** Requests that got a response, and requests that failed with the reason. */
  finished: string[];
  failed: string[];
  dialogs: string[];
  errors: string[];
}

describe.skipIf(!available)('HTML report in Chromium', () => {
  let browser: Browser;
  let folder: string;

  beforeAll(async () => {
    folder = mkdtempSync(join(tmpdir(), 'plumbline-html-'));
    browser = await chromium.launch({ executablePath: CHROMIUM, headless: true, args: ARGS, timeout: 30_000 });
  }, 40_000);

  afterAll(async () => {
    await browser?.close();
    if (folder) rmSync(folder, { recursive: true, force: true });
  });

  async function open(name: string, html: string): Promise<Watched> {
    const file = join(folder, name);
    writeFileSync(file, html);
    const url = pathToFileURL(file).href;
    const page = await browser.newPage();
    const watched: Watched = { page, url, requests: [], finished: [], failed: [], dialogs: [], errors: [] };
    page.on('request', (request) => watched.requests.push(request.url()));
    page.on('requestfinished', (request) => watched.finished.push(request.url()));
    page.on('requestfailed', (request) => watched.failed.push(`${request.url()} ${request.failure()?.errorText ?? ''}`));
    page.on('dialog', (dialog) => {
      watched.dialogs.push(dialog.message());
      void dialog.dismiss();
    });
    page.on('console', (message) => {
      if (message.type() === 'error') watched.errors.push(message.text());
    });
    page.on('pageerror', (error) => watched.errors.push(error.message));
    await page.goto(url, { waitUntil: 'load' });
    return watched;
  }

  /** Whether each element matching the selector is rendered (not hidden by itself or an ancestor). */
  function visibility(page: Page, selector: string): Promise<boolean[]> {
    return page.$$eval(selector, (elements) => elements.map((element) => element.checkVisibility()));
  }

  it('shows every flagged result and lets the severity and rule filters hide and show them', async () => {
    const report = corpusReport();
    const { page, errors, requests, url } = await open('demo.html', formatHtml(report));
    try {
      // The page's own script ran (the CSP hash matches): the filters were revealed.
      expect(await page.locator('#filters').isVisible()).toBe(true);
      const marks = await visibility(page, '.result mark');
      expect(marks).toHaveLength(report.summary.flaggedStatistics);
      expect(marks.every(Boolean)).toBe(true);
      expect(await page.locator('.caution').first().textContent()).toBe(report.caution);

      const fails = await visibility(page, '.finding[data-severity="fail"]');
      expect(fails.length).toBe(report.summary.findings.fail);
      expect(fails.every(Boolean)).toBe(true);

      await page.locator('input[data-group="severity"][value="fail"]').uncheck();
      expect((await visibility(page, '.finding[data-severity="fail"]')).some(Boolean)).toBe(false);
      const others = await visibility(page, '.finding:not([data-severity="fail"])');
      expect(others.length).toBeGreaterThan(0);
      expect(others.every(Boolean)).toBe(true);
      // A document left with no visible flag is not drawn; one with other flags stays, showing only those.
      const severitiesOf = (d: Report['documents'][number]) => [...d.findings, ...d.statistics.flatMap((s) => s.findings)].map((f) => f.severity);
      const onlyFail = report.documents.filter((d) => severitiesOf(d).length > 0 && severitiesOf(d).every((s) => s === 'fail')).map((d) => d.path);
      expect(onlyFail.length).toBeGreaterThan(0);
      const documents = await page.$$eval('.doc.flagged', (sections) =>
        sections.map((section) => ({
          name: section.querySelector('h3')!.textContent,
          visible: section.checkVisibility(),
          others: section.querySelectorAll('.finding:not([data-severity="fail"])').length,
        })),
      );
      const withOthers = report.documents.filter((d) => severitiesOf(d).some((s) => s !== 'fail')).map((d) => d.path);
      expect(new Set(documents.map((d) => d.name))).toEqual(new Set(withOthers));
      for (const d of documents) expect(d.visible && d.others > 0).toBe(true);
      const total = report.summary.findings.fail + report.summary.findings.warn + report.summary.findings.note;
      expect(await page.locator('#filter-count').textContent()).toContain(`Showing ${total - report.summary.findings.fail} of ${total} flags`);

      await page.locator('input[data-group="severity"][value="fail"]').check();
      expect((await visibility(page, '.finding')).every(Boolean)).toBe(true);
      expect((await visibility(page, '.doc.flagged')).every(Boolean)).toBe(true);

      // Rules: "none" hides everything, then one rule brings back only its flags.
      await page.locator('button[data-set="rule"][data-value="off"]').click();
      expect((await visibility(page, '.doc.flagged')).some(Boolean)).toBe(false);
      await page.locator('input[data-group="rule"][value="p-value-mismatch"]').check();
      const shown = await page.$$eval('.finding', (items) => items.filter((item) => item.checkVisibility()).map((item) => item.getAttribute('data-rule')));
      expect(shown.length).toBeGreaterThan(0);
      expect(new Set(shown)).toEqual(new Set(['p-value-mismatch']));
      await page.locator('button[data-set="rule"][data-value="on"]').click();
      expect((await visibility(page, '.finding')).every(Boolean)).toBe(true);

      expect(errors).toEqual([]);
      expect(requests).toEqual([url]);
    } finally {
      await page.close();
    }
  });

  /** The names of the document table's rows that are shown, in order. */
  function shownRows(page: Page): Promise<string[]> {
    return page.$$eval('#documents-body tr', (rows) => rows.filter((row) => row.checkVisibility()).map((row) => row.getAttribute('data-name') ?? ''));
  }

  it('sorts, searches and pages the document table, with the mouse and with the keyboard', async () => {
    const report = manyDocuments(60);
    const { page, errors } = await open('many.html', formatHtml(report));
    try {
      const status = page.locator('nav[data-for="documents-body"] .page-status');
      // Ranked worst first, 25 to a page.
      let shown = await shownRows(page);
      expect(shown).toHaveLength(25);
      expect(await status.textContent()).toBe('Page 1 of 3: 1 to 25 of 60 documents');
      const ranks = await page.$$eval('#documents-body tr', (rows) => rows.filter((row) => row.checkVisibility()).map((row) => Number(row.getAttribute('data-rank'))));
      expect(ranks).toEqual(Array.from({ length: 25 }, (_, i) => i + 1));
      const worst = await page.$$eval('#documents-body tr', (rows) => rows.map((row) => Number(row.getAttribute('data-worst'))));
      expect(worst).toEqual([...worst].sort((a, b) => b - a));

      // Paging: next, last, first.
      const nav = page.locator('nav[data-for="documents-body"]');
      await nav.locator('[data-go="next"]').click();
      expect(await status.textContent()).toBe('Page 2 of 3: 26 to 50 of 60 documents');
      const second = await shownRows(page);
      expect(second).toHaveLength(25);
      expect(second.some((name) => shown.includes(name))).toBe(false);
      await nav.locator('[data-go="last"]').click();
      expect(await shownRows(page)).toHaveLength(10);
      expect(await nav.locator('[data-go="next"]').isDisabled()).toBe(true);
      await nav.locator('[data-go="first"]').click();
      expect(await shownRows(page)).toEqual(shown);

      // Sorting by name, A to Z and back, from the keyboard.
      const names = report.documents.map((d) => d.path).sort();
      await page.locator('th[data-sort="name"] button').focus();
      await page.keyboard.press('Enter');
      expect(await page.locator('th[data-sort="name"]').getAttribute('aria-sort')).toBe('ascending');
      expect(await page.locator('th[data-sort="rank"]').getAttribute('aria-sort')).toBeNull();
      expect(await shownRows(page)).toEqual(names.slice(0, 25));
      await page.keyboard.press('Enter');
      expect(await page.locator('th[data-sort="name"]').getAttribute('aria-sort')).toBe('descending');
      expect(await shownRows(page)).toEqual([...names].reverse().slice(0, 25));

      // Sorting by the number of warn flags: the most first, on every page.
      await page.locator('th[data-sort="warn"] button').click();
      const warns = await page.$$eval('#documents-body tr', (rows) => rows.map((row) => Number(row.getAttribute('data-warn'))));
      expect(warns).toEqual([...warns].sort((a, b) => b - a));
      expect(warns[0]).toBeGreaterThan(warns.at(-1)!);

      // Search by name: the pager counts what is left.
      await page.locator('#doc-search').fill('paper-01');
      shown = await shownRows(page);
      expect(shown).toHaveLength(10);
      expect(shown.every((name) => name.includes('paper-01'))).toBe(true);
      expect(await status.textContent()).toBe('Page 1 of 1: 1 to 10 of 10 documents');
      expect(await page.locator('#doc-count').textContent()).toBe('10 documents of 60 match.');
      await page.locator('#doc-search').fill('no such paper');
      expect(await shownRows(page)).toEqual([]);
      await page.locator('#doc-search').fill('');

      // Only the documents where a flag changes the conclusion.
      await page.locator('#doc-crosses').check();
      const crossing = report.documents.filter((d) => d.statistics.some((s) => s.findings.some((f) => f.crossesAlpha)) || d.findings.some((f) => f.crossesAlpha));
      expect(crossing.length).toBeGreaterThan(0);
      expect(crossing.length).toBeLessThan(60);
      await nav.locator('select[data-size]').selectOption('0');
      expect(new Set(await shownRows(page))).toEqual(new Set(crossing.map((d) => d.path)));
      await page.locator('#doc-crosses').uncheck();
      expect(await shownRows(page)).toHaveLength(60);
      expect(errors).toEqual([]);
    } finally {
      await page.close();
    }
  });

  it('pages the flag cards, and a mark on the map leads to its card on any page, past any filter', async () => {
    const report = manyDocuments(60);
    const { page, errors } = await open('map.html', formatHtml(report));
    try {
      const visibleCards = (): Promise<number> => visibility(page, '#flag-cards > .doc').then((v) => v.filter(Boolean).length);
      const flaggedDocuments = report.documents.filter((d) => d.statistics.some((s) => s.findings.length > 0)).length;
      expect(flaggedDocuments).toBeGreaterThan(10);
      expect(await visibleCards()).toBe(10);
      expect(await page.locator('nav[data-for="flag-cards"] .page-status').textContent()).toBe(
        `Page 1 of ${Math.ceil(flaggedDocuments / 10)}: 1 to 10 of ${flaggedDocuments} documents`,
      );

      // The last card's first flagged result is on the last page of cards (the last flagged document in the ranking): not drawn yet.
      await page.locator('nav[data-for="documents-body"] select[data-size]').selectOption('0');
      const target = await page.$$eval('#documents-body tr', (rows) =>
        rows.filter((row) => Number(row.getAttribute('data-worst')) > 0).at(-1)!.querySelector('a.map-mark')!.getAttribute('href')!.slice(1),
      );
      expect(await page.locator(`#${target}`).count()).toBe(0);
      const mark = page.locator(`a.map-mark[href="#${target}"]`);
      expect(await mark.count()).toBe(1);
      await mark.click();
      await expect.poll(() => page.locator(`#${target}`).isVisible()).toBe(true);
      await expect.poll(() => page.evaluate((id) => {
        const box = document.getElementById(id)!.getBoundingClientRect();
        // Scrolled to the top of the window (to within a pixel's rounding).
        return box.top > -1 && box.top < window.innerHeight;
      }, target)).toBe(true);
      expect(page.url().endsWith(`#${target}`)).toBe(true);

      // Hidden by a filter: the filters are reset so the result can be read. With the keyboard this time.
      await page.locator('nav[data-for="flag-cards"] select[data-size]').selectOption('0');
      const failTarget = await page.$$eval('#flag-cards .result', (articles) =>
        articles.find((article) => [...article.querySelectorAll('.finding')].every((item) => item.getAttribute('data-severity') === 'fail'))!.id,
      );
      await page.locator('input[data-group="severity"][value="fail"]').uncheck();
      expect(await page.locator(`#${failTarget}`).isVisible()).toBe(false);
      await page.locator(`a.map-mark[href="#${failTarget}"]`).focus();
      await page.keyboard.press('Enter');
      await expect.poll(() => page.locator(`#${failTarget}`).isVisible()).toBe(true);
      expect(await page.locator('input[data-group="severity"][value="fail"]').isChecked()).toBe(true);
      expect(page.url().endsWith(`#${failTarget}`)).toBe(true);
      // Only flagged results are marks that link; with every card and row drawn, every link on the page has its target.
      await page.locator('nav[data-for="flag-cards"] select[data-size]').selectOption('0');
      const missing = await page.$$eval('a[href]', (links) => links.map((link) => link.getAttribute('href')!).filter((href) => !document.getElementById(href.slice(1))));
      expect(missing).toEqual([]);
      expect(errors).toEqual([]);
    } finally {
      await page.close();
    }
  });

  it('keeps only the flags that change the conclusion, keeps seen marks across a reload, and saves the flags shown as CSV', async () => {
    const report = corpusReport();
    const { page, errors } = await open('seen.html', formatHtml(report));
    try {
      await page.locator('#only-crosses').check();
      const crossing = await page.$$eval('.finding', (items) => items.filter((item) => item.checkVisibility()).map((item) => item.getAttribute('data-crosses')));
      expect(crossing).toHaveLength(report.summary.crossesAlpha);
      expect(crossing.every((value) => value === 'true')).toBe(true);
      await page.locator('#only-crosses').uncheck();

      const first = page.locator('#flag-cards .finding').first();
      const key = await first.getAttribute('data-key');
      await first.locator('input.seen').check();
      await expect.poll(() => page.evaluate(() => localStorage.getItem('plumbline.seen.v1') ?? '')).toContain(JSON.stringify(key).slice(1, -1));
      await page.reload({ waitUntil: 'load' });
      // Waits for the script to have drawn the page again (a condition, not a time: a busy machine only makes it later).
      await page.waitForFunction(() => document.documentElement.hasAttribute('data-ready'));
      await expect.poll(() => page.locator('#flag-cards .finding').first().locator('input.seen').isChecked()).toBe(true);
      expect(await page.locator('#flag-cards .finding input.seen:checked').count()).toBe(1);
      expect(await page.evaluate(() => localStorage.getItem('plumbline.seen.v1'))).toContain(JSON.stringify(key).slice(1, -1));

      await page.locator('#seen-filter').selectOption('seen');
      expect((await visibility(page, '.finding')).filter(Boolean)).toHaveLength(1);
      const [download] = await Promise.all([page.waitForEvent('download'), page.locator('#export-csv').click()]);
      expect(download.suggestedFilename()).toBe('plumbline-flags.csv');
      const csv = readFileSync((await download.path())!, 'utf8');
      const rows = Papa.parse<Record<string, string>>(csv, { header: true, skipEmptyLines: true }).data;
      expect(rows).toHaveLength(1);
      expect(rows[0]).toMatchObject({ seen: 'yes', severity: await first.getAttribute('data-severity'), rule: await first.getAttribute('data-rule'), caution: report.caution });
      expect(rows[0]!.document).toBe(await page.locator('#flag-cards .doc h3').first().textContent());

      await page.locator('#seen-filter').selectOption('unseen');
      const total = report.summary.findings.fail + report.summary.findings.warn + report.summary.findings.note;
      expect((await visibility(page, '.finding')).filter(Boolean)).toHaveLength(total - 1);
      const [all] = await Promise.all([page.waitForEvent('download'), page.locator('#export-csv').click()]);
      const unseen = Papa.parse<Record<string, string>>(readFileSync((await all.path())!, 'utf8'), { header: true, skipEmptyLines: true }).data;
      expect(unseen).toHaveLength(total - 1);
      expect(unseen.every((row) => row.seen === 'no')).toBe(true);
      expect(errors).toEqual([]);
    } finally {
      await page.close();
    }
  });

  it('without its scripts says how to read the audit without one; with them, draws the first page of each list', async () => {
    const report = manyDocuments(60);
    const file = join(folder, 'noscript.html');
    writeFileSync(file, formatHtml(report));
    const context = await browser.newContext({ javaScriptEnabled: false });
    const page = await context.newPage();
    try {
      await page.goto(pathToFileURL(file).href, { waitUntil: 'load' });
      // The totals and the caution are markup; the documents are data the script draws.
      expect(await page.locator('header .caution').isVisible()).toBe(true);
      expect(await page.locator('.totals').textContent()).toContain(`${report.summary.documents} documents`);
      const notice = page.locator('.noscript');
      expect(await notice.isVisible()).toBe(true);
      expect(await notice.textContent()).toContain('--format md');
      expect(await page.locator('#documents-body tr').count()).toBe(0);
      expect((await visibility(page, 'nav.pager, .controls, #filters')).some(Boolean)).toBe(false);
    } finally {
      await context.close();
    }
    const { page: scripted, errors } = await open('scripted.html', formatHtml(report));
    try {
      expect(await scripted.evaluate(() => document.documentElement.hasAttribute('data-ready'))).toBe(true);
      expect(await scripted.locator('.noscript').count()).toBe(0);
      expect((await visibility(scripted, '#flag-cards > .doc')).filter(Boolean)).toHaveLength(10);
      expect((await visibility(scripted, '#documents-body tr')).filter(Boolean)).toHaveLength(25);
      expect(errors).toEqual([]);
    } finally {
      await scripted.close();
    }
  });

  it('runs no script from a hostile manuscript, opens no dialog and makes no network request', async () => {
    const { page, errors, requests, dialogs, url } = await open('hostile.html', formatHtml(hostileReport()));
    try {
      await page.waitForTimeout(300); // let any onerror/onload handler that slipped through fire
      expect(await page.evaluate(() => (window as unknown as { __pwned?: unknown }).__pwned)).toBeUndefined();
      expect(await page.title()).not.toContain('pwned');
      expect(await page.title()).toMatch(/^plumbline report/);
      expect(dialogs).toEqual([]);
      expect(requests).toEqual([url]);
      expect(errors).toEqual([]);
      // The markup is on the page as text.
      const context = await page.locator('.context').first().textContent();
      expect(context).toContain("<script>window.__pwned = 1; document.title = 'pwned';</script>");
      expect(context).toContain('<img src=x onerror="window.__pwned = 2; alert(1)">');
      expect(await page.locator('h3', { hasText: '<b>bold</b>' }).count()).toBe(1);
      expect(await page.locator('img, iframe, svg[onload], main script').count()).toBe(0);
      // Our own script did run.
      expect(await page.locator('#filters').isVisible()).toBe(true);
    } finally {
      await page.close();
    }
  });

  it('would block an injected script through its Content-Security-Policy even if escaping failed', async () => {
    const html = formatHtml(hostileReport()).replace(
      '<main>',
      '<main><script>window.__pwned = 1;</script><img src="x" onerror="window.__pwned = 2"><svg onload="window.__pwned = 3"></svg>' +
        '<img src="http://127.0.0.1:9/leak.png">',
    );
    const { page, requests, finished, failed, dialogs, url } = await open('injected.html', html);
    try {
      await page.waitForTimeout(300);
      expect(await page.evaluate(() => (window as unknown as { __pwned?: unknown }).__pwned)).toBeUndefined();
      expect(dialogs).toEqual([]);
      // The injected images are attempted by the parser but stopped by the policy before anything is fetched.
      expect(finished).toEqual([url]);
      const blocked = requests.filter((request) => request !== url);
      expect(blocked.length).toBeGreaterThan(0);
      expect(failed).toHaveLength(blocked.length);
      for (const failure of failed) expect(failure).toMatch(/ (csp|net::ERR_BLOCKED_BY_CSP)$/i);
      expect(await page.locator('#filters').isVisible()).toBe(true);
    } finally {
      await page.close();
    }
  });
});
