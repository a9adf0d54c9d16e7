/**
 * Opens the HTML report in headless Chromium (Debian's chromium package,
 * driven by playwright-core) and checks it as a reader would meet it: the
 * flagged results are visible, the filters hide and show them, text from a
 * hostile manuscript runs no script, and the page asks for nothing over the
 * network.
 *
 * CI must have Debian's chromium installed (apt-get install -y chromium).
 * Elsewhere, without it, these tests are skipped with a warning that says why.
 */
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { formatHtml } from '../../src/report/html.js';
import { corpusReport, hostileReport } from '../fixtures/report/reports.js';

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
      // A document left with no visible flag is hidden; one with other flags stays.
      const documents = await page.$$eval('.doc.flagged', (sections) =>
        sections.map((section) => ({
          visible: section.checkVisibility(),
          others: section.querySelectorAll('.finding:not([data-severity="fail"])').length,
        })),
      );
      expect(documents.some((d) => d.others === 0)).toBe(true);
      for (const d of documents) expect(d.visible).toBe(d.others > 0);
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
