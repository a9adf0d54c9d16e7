/**
 * The page of `plumbline web` in headless Chromium (Debian's chromium,
 * driven by playwright-core), started through the built command
 * (`plumbline web --no-open`) as a user starts it:
 *
 * - a demo paragraph pasted, and a demo PDF and DOCX dropped, give the
 *   flags the demo's answer key plants (corpus-demo/answer-key.json, whose
 *   numbers corpus-demo/tools/check_corpus.py verifies with SciPy), each
 *   marked in place in the manuscript; and for the PDF and DOCX exactly the
 *   results and findings `plumbline scan --format json --pdf-engine
 *   pdf-parse` gives for the same files (the page runs the same code);
 * - the CSV downloaded is the command line's CSV for the same documents;
 * - a refit of the demo data gives the command line's refit output;
 * - settings are kept in local storage and change the audit;
 * - no request leaves the page's origin; axe-core finds no serious or
 *   critical violation; everything works from the keyboard;
 * - a hostile manuscript (script tags, event attributes, javascript: links)
 *   runs nothing;
 * - the built file opened from disk works offline, the refit of a CSV and
 *   of an XLSX sheet included (the same output as `plumbline refit`, no
 *   request made), and a hostile XLSX (a zip bomb, a sheet that declares
 *   too much) is refused with the command's own message.
 *
 * CI must have Debian's chromium installed (apt-get install -y chromium).
 * Elsewhere, without it, these tests are skipped with a warning that says why.
 */
import { copyFileSync, existsSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import Papa from 'papaparse';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { plumbline, temporaryFolder } from '../batch/cli.js';
import { withPart, xlsxFile } from '../refit/xlsx.js';
import { startWeb, type RunningWeb } from '../web/startWeb.js';
import { NO_RESULTS_MESSAGE } from '../../src/report/wording.js';
import { readJsonReport } from '../../src/report/jsonLayoutSchema.js';

const CHROMIUM = '/usr/bin/chromium';
const ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];
const available = existsSync(CHROMIUM);
const inCi = Boolean(process.env.CI);
const MISSING = `${CHROMIUM} is missing: the browser tests of the web page need Debian's chromium package (apt-get install -y chromium).`;
if (!available && !inCi) console.warn(`Skipping the browser tests of the web page: ${MISSING}`);

const demo = join(process.cwd(), 'corpus-demo');
const PDF = 'lantern-reading-fluency.pdf';
const DOCX = 'gravel-path-wayfinding.docx';

interface KeyFinding {
  file: string;
  line: number;
  rule: string;
  severity: string;
}
const answerKey = (JSON.parse(readFileSync(join(demo, 'answer-key.json'), 'utf8')) as { findings: KeyFinding[] }).findings;

/** One result as the page shows it: the marked text, its line, and the findings its detail lists. */
interface Shown {
  document: string;
  line: number;
  text: string;
  findings: string[];
}

interface Watched {
  page: Page;
  requests: string[];
  errors: string[];
  dialogs: string[];
}

/** The demo's refit data (corpus-demo/refit/harbour-walks.csv) as an XLSX sheet: numbers as numbers, text as text. */
function demoSheet(): Buffer {
  const parsed = Papa.parse<string[]>(readFileSync(join(demo, 'refit', 'harbour-walks.csv'), 'utf8').trim(), { skipEmptyLines: true });
  const [header, ...rows] = parsed.data;
  const cells = rows.map((row) => row.map((cell) => (cell.trim() !== '' && Number.isFinite(Number(cell)) ? Number(cell) : cell)));
  return xlsxFile(header!, cells, cells.length);
}

/** Runs the refit tab and returns what it shows once the output changes (trimmed at the end). */
async function refitShown(page: Page): Promise<string> {
  const before = (await page.locator('#refit-output').textContent()) ?? '';
  await page.locator('#refit-run').click();
  await page.waitForFunction((previous) => {
    const now = document.getElementById('refit-output')?.textContent ?? '';
    return now.length > 0 && now !== previous;
  }, before, { timeout: 60_000 });
  return (await page.locator('#refit-output').textContent())!.trimEnd();
}

describe('web page in Chromium: the browser', () => {
  it.skipIf(!available && !inCi)(`is installed at ${CHROMIUM}`, () => {
    if (!available) throw new Error(`${MISSING} CI must install it before running the tests.`);
    expect(existsSync(CHROMIUM)).toBe(true);
  });
});

describe.skipIf(!available)('web page in Chromium', () => {
  let browser: Browser;
  let web: RunningWeb;
  let folder: string;

  beforeAll(async () => {
    folder = temporaryFolder('web-page');
    web = await startWeb();
    browser = await chromium.launch({ executablePath: CHROMIUM, headless: true, args: ARGS, timeout: 30_000 });
  }, 40_000);

  afterAll(async () => {
    await browser?.close();
    await web?.stop();
    if (folder) rmSync(folder, { recursive: true, force: true });
  });

  async function open(url = web.url, options: { acceptDownloads?: boolean } = {}): Promise<Watched> {
    const context = await browser.newContext({ acceptDownloads: options.acceptDownloads ?? true });
    const page = await context.newPage();
    const watched: Watched = { page, requests: [], errors: [], dialogs: [] };
    page.on('request', (request) => watched.requests.push(request.url()));
    page.on('console', (message) => {
      if (message.type() === 'error') watched.errors.push(message.text());
    });
    page.on('pageerror', (error) => watched.errors.push(error.message));
    page.on('dialog', (dialog) => {
      watched.dialogs.push(dialog.message());
      void dialog.dismiss();
    });
    await page.goto(url, { waitUntil: 'load' });
    await page.waitForSelector('body[data-ready="true"]', { state: 'attached', timeout: 15_000 });
    return watched;
  }

  /** Drops files on the drop zone as a user's drag and drop does (a drop event carrying them). */
  async function drop(page: Page, names: string[]): Promise<void> {
    const files = names.map((name) => ({ name, base64: readFileSync(join(demo, name)).toString('base64') }));
    const transfer = await page.evaluateHandle((list) => {
      const data = new DataTransfer();
      for (const file of list) data.items.add(new File([Uint8Array.from(atob(file.base64), (c) => c.charCodeAt(0))], file.name));
      return data;
    }, files);
    const before = await page.locator('.document-choice').count();
    await page.dispatchEvent('#drop-zone', 'drop', { dataTransfer: transfer });
    await page.waitForFunction((count) => document.querySelectorAll('.document-choice').length >= count, before + names.length, { timeout: 30_000 });
  }

  /** Every result in the list, chosen one by one: what the detail shows, and the marked text in the manuscript it selects. */
  async function shownResults(page: Page): Promise<Shown[]> {
    const rows = page.locator('#results-body tr');
    const count = await rows.count();
    const shown: Shown[] = [];
    for (let index = 0; index < count; index++) {
      const row = rows.nth(index);
      const [document, where] = await Promise.all([row.locator('td').nth(0).textContent(), row.locator('td').nth(1).textContent()]);
      const text = (await row.locator('button.show-result').textContent())!;
      await row.locator('button.show-result').click();
      // In place: a mark of the manuscript selected by this result holds exactly its printed text (its verdict tag aside).
      // (A result printed twice, a table row restated in the text, is marked at both places.)
      const marked = await page.locator('#manuscript button.result.selected').evaluateAll((buttons) =>
        buttons.map((button) => {
          const copy = button.cloneNode(true) as HTMLElement;
          copy.querySelector('.verdict-tag')?.remove();
          return copy.textContent;
        }),
      );
      expect(marked).toContain(text);
      const findings = await page.$$eval('#detail .finding', (sections) =>
        sections.map((section) => `${section.querySelector('.rule-id')!.textContent!.replace(/^rule (\S+?);?(?: .*)?$/, '$1')} ${section.className.replace(/.*v-/, '')}`),
      );
      shown.push({ document: document!, line: Number(/line (\d+)/.exec(where!)![1]), text, findings: findings.sort() });
    }
    return shown;
  }

  function expectOnlyOwnOrigin(requests: readonly string[], origin: string): void {
    expect(requests.length).toBeGreaterThan(0);
    expect(requests.filter((url) => !url.startsWith(origin) && !url.startsWith('blob:') && !url.startsWith('data:'))).toEqual([]);
  }

  it('pasted demo paragraph, dropped demo PDF and DOCX: the answer key\'s flags, in place, and the command line\'s audit of the same files', async () => {
    const { page, requests, errors } = await open();
    try {
      // sleep-and-recall.md lines 41 to 47: three planted flags on lines 43, 46 and 47.
      const lines = readFileSync(join(demo, 'sleep-and-recall.md'), 'utf8').split('\n');
      const first = 41;
      await page.locator('#paste').fill(lines.slice(first - 1, 47).join('\n'));
      await page.locator('#check-text').click();
      await drop(page, [PDF, DOCX]);
      expect(await page.locator('.document-choice').allTextContents()).toEqual([
        expect.stringMatching(/^pasted text: \d+ results, 3 flagged$/),
        expect.stringMatching(new RegExp(`^${PDF}: \\d+ results, \\d+ flagged$`)),
        expect.stringMatching(new RegExp(`^${DOCX}: \\d+ results, \\d+ flagged$`)),
      ]);
      const shown = await shownResults(page);

      const pasted = shown.filter((result) => result.document === 'pasted text');
      const planted = answerKey.filter((finding) => finding.file === 'sleep-and-recall.md' && finding.line >= first && finding.line <= 47);
      expect(planted).toHaveLength(3);
      for (const finding of planted) {
        const at = pasted.filter((result) => result.line === finding.line - first + 1);
        expect(at.flatMap((result) => result.findings), `line ${finding.line}`).toContain(`${finding.rule} ${finding.severity}`);
      }
      expect(pasted.filter((result) => result.findings.length > 0)).toHaveLength(3);

      // The PDF and DOCX: every result and finding the command line finds (same pdf.js as pdf-parse), and the planted ones among them.
      const cli = plumbline(['scan', PDF, DOCX, '--pdf-engine', 'pdf-parse', '--format', 'json', '--no-cache', '--fail-on', 'never'], demo);
      expect(cli.status, cli.stderr).toBe(0);
      const report = readJsonReport(cli.stdout);
      for (const name of [PDF, DOCX]) {
        const expected = report.documents
          .find((document) => document.path === name)!
          .statistics.map((statistic) => ({ document: name, line: statistic.location.line, text: statistic.text, findings: statistic.findings.map((f) => `${f.rule} ${f.severity}`).sort() }));
        expect(expected.length).toBeGreaterThan(3);
        expect(shown.filter((result) => result.document === name)).toEqual(expected);
        const key = answerKey.filter((finding) => finding.file === name.replace(/\.\w+$/, '.txt'));
        expect(key.length).toBeGreaterThan(0);
        for (const finding of key) expect(expected.some((result) => result.findings.includes(`${finding.rule} ${finding.severity}`))).toBe(true);
      }

      // The manuscript marks every result by its verdict, in colour and in its tag.
      await page.locator('.document-choice').nth(1).click();
      const marks = await page.$$eval('#manuscript button.result', (buttons) => buttons.map((button) => [button.className, button.querySelector('.verdict-tag')?.textContent]));
      expect(marks.filter(([name]) => name!.includes('v-fail')).every(([, tag]) => tag === 'fail')).toBe(true);
      expect(marks.filter(([name]) => name!.includes('v-fail')).length).toBe(shown.filter((r) => r.document === PDF && r.findings.some((f) => f.endsWith(' fail'))).length);

      expectOnlyOwnOrigin(requests, web.url.replace(/\/$/, ''));
      expect(errors).toEqual([]);
    } finally {
      await page.context().close();
    }
  }, 120_000);

  it('the list filters by verdict and rule and sorts; the caution stays in view', async () => {
    const { page } = await open();
    try {
      await drop(page, [PDF, DOCX]);
      const total = await page.locator('#results-body tr').count();
      const fails = await page.locator('#results-body tr.v-fail').count();
      expect(fails).toBeGreaterThan(0);
      await page.locator('input[name="filter-verdict"][value="none"]').uncheck();
      await page.locator('input[name="filter-verdict"][value="note"]').uncheck();
      await page.locator('input[name="filter-verdict"][value="warn"]').uncheck();
      expect(await page.locator('#results-body tr').count()).toBe(fails);
      expect(await page.locator('#list-count').textContent()).toBe(`${fails} of ${total} results shown`);
      await page.locator('input[name="filter-verdict"]').evaluateAll((boxes) => boxes.forEach((box) => ((box as HTMLInputElement).checked = true)));
      await page.locator('input[name="filter-verdict"][value="fail"]').dispatchEvent('change');
      await page.locator('#filter-rule').selectOption('p-value-mismatch');
      const rules = await page.locator('#results-body tr td:nth-child(5)').allTextContents();
      expect(rules.length).toBeGreaterThan(0);
      expect(rules.every((text) => text.includes('p-value-mismatch'))).toBe(true);
      await page.locator('#filter-rule').selectOption('');
      await page.locator('th[data-sort="verdict"] button').click();
      expect(await page.locator('th[data-sort="verdict"]').getAttribute('aria-sort')).toBe('ascending');
      const verdicts = await page.locator('#results-body tr td:nth-child(4)').allTextContents();
      const order = ['fail', 'warn', 'note', 'no flag'];
      expect(verdicts.map((v) => order.indexOf(v))).toEqual([...verdicts.map((v) => order.indexOf(v))].sort((a, b) => a - b));
      // The caution is in the sticky header, in view after scrolling to the end.
      await page.evaluate(() => window.scrollTo(0, document.body.scrollHeight));
      const caution = page.locator('#caution');
      expect(await caution.textContent()).toContain('not proof of an error');
      const box = await caution.boundingBox();
      expect(box!.y).toBeGreaterThanOrEqual(0);
      expect(box!.y).toBeLessThan(200);
    } finally {
      await page.context().close();
    }
  }, 60_000);

  it('downloads the CSV, which is the command line\'s CSV of the same files; HTML, JSON and Markdown too', async () => {
    const { page } = await open();
    try {
      await drop(page, [PDF, DOCX]);
      const [download] = await Promise.all([page.waitForEvent('download'), page.locator('#downloads button[data-format="csv"]').click()]);
      expect(download.suggestedFilename()).toBe('plumbline-report.csv');
      const csv = readFileSync((await download.path())!, 'utf8');
      const cli = plumbline(['scan', PDF, DOCX, '--pdf-engine', 'pdf-parse', '--format', 'csv', '--no-cache', '--fail-on', 'never'], demo);
      expect(cli.status, cli.stderr).toBe(0);
      // The command line lists documents in path order; the page in the order they were dropped.
      const rows = (text: string) => Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true }).data;
      const byPlace = (a: Record<string, string>, b: Record<string, string>) => (a.document! + a.line!.padStart(6, '0') + a.column!.padStart(6, '0')).localeCompare(b.document! + b.line!.padStart(6, '0') + b.column!.padStart(6, '0'));
      expect(Papa.parse(csv).data[0]).toEqual(Papa.parse(cli.stdout).data[0]);
      const pageRows = rows(csv).sort(byPlace);
      const cliRows = rows(cli.stdout).sort(byPlace);
      expect(pageRows.length).toBe(cliRows.length);
      // Cell by cell: text exactly; numbers to 1e-12 relative, since Chromium's and Node's V8 may differ in the last bit of exp and log.
      pageRows.forEach((row, index) => {
        for (const [column, value] of Object.entries(cliRows[index]!)) {
          const shown = row[column]!;
          const [a, b] = [Number(shown), Number(value)];
          if (value !== '' && Number.isFinite(b) && Number.isFinite(a) && shown !== value) expect(Math.abs(a - b), `${column}: ${shown} against ${value}`).toBeLessThanOrEqual(1e-12 * Math.max(Math.abs(a), Math.abs(b)));
          else expect(shown, column).toBe(value);
        }
      });
      expect(rows(csv).some((row) => row.verdict === 'fail')).toBe(true);

      // The HTML report's policy hashes its fixed script and style: the page's SHA-256 must give Node's.
      const cliHtml = plumbline(['scan', PDF, '--pdf-engine', 'pdf-parse', '--format', 'html', '--no-cache', '--fail-on', 'never'], demo);
      const policyOf = (html: string) => /<meta http-equiv="Content-Security-Policy" content="([^"]+)">/.exec(html)?.[1];
      expect(policyOf(cliHtml.stdout)).toMatch(/sha256-/);
      for (const [format, name, check] of [
        ['html', 'plumbline-report.html', (text: string) => text.startsWith('<!DOCTYPE html>') && text.includes(PDF) && policyOf(text) === policyOf(cliHtml.stdout)],
        ['json', 'plumbline-report.json', (text: string) => (JSON.parse(text) as { documents: unknown[] }).documents.length === 2],
        ['md', 'plumbline-report.md', (text: string) => text.includes(DOCX)],
      ] as const) {
        const [file] = await Promise.all([page.waitForEvent('download'), page.locator(`#downloads button[data-format="${format}"]`).click()]);
        expect(file.suggestedFilename()).toBe(name);
        expect(check(readFileSync((await file.path())!, 'utf8'))).toBe(true);
      }
    } finally {
      await page.context().close();
    }
  }, 60_000);

  it('refit tab: the demo data and model give the command line\'s refit, with the comparison and the slip', async () => {
    const { page, requests } = await open();
    try {
      await page.locator('#tab-refit').click();
      expect(await page.locator('#panel-refit').isVisible()).toBe(true);
      await page.locator('#refit-data').setInputFiles(join(demo, 'refit', 'harbour-walks.csv'));
      await page.locator('#refit-model').fill('mood ~ route * pace + loneliness');
      await page.locator('#refit-missing').fill('mood=99; loneliness=6-8');
      await page.locator('#refit-reported').fill(readFileSync(join(demo, 'refit', 'harbour-walks-manuscript.md'), 'utf8'));
      await page.locator('#refit-run').click();
      await page.waitForFunction(() => (document.getElementById('refit-output')?.textContent ?? '').length > 0, null, { timeout: 60_000 });
      const shown = (await page.locator('#refit-output').textContent())!;
      // The command line on the same files under the same names.
      copyFileSync(join(demo, 'refit', 'harbour-walks.csv'), join(folder, 'harbour-walks.csv'));
      copyFileSync(join(demo, 'refit', 'harbour-walks-manuscript.md'), join(folder, 'reported-table.md'));
      const cli = plumbline(['refit', 'harbour-walks.csv', '--model', 'mood ~ route * pace + loneliness', '--type', '3', '--missing', 'mood=99', '--missing', 'loneliness=6-8', '--reported', 'reported-table.md', '--format', 'text'], folder);
      expect(cli.status).toBe(1); // the reported table differs: the demo's planted slip
      expect(shown.trimEnd()).toBe(`${cli.stdout}${cli.stderr ? `\n${cli.stderr}` : ''}`.trimEnd());
      expect(shown).toContain('Missing-value codes left in the data as numbers');
      expect(await page.locator('#refit-status').textContent()).toContain('some reported numbers differ');
      expectOnlyOwnOrigin(requests, web.url.replace(/\/$/, ''));
      // A CSV is refitted in the page itself: the server is not asked.
      expect(requests.filter((url) => url.includes('/api/refit'))).toEqual([]);
    } finally {
      await page.context().close();
    }
  }, 90_000);

  it('refit tab, served: an XLSX sheet is refitted in the page and gives the command line\'s refit of the same sheet, the server not asked', async () => {
    const { page, requests } = await open();
    try {
      const parsed = Papa.parse<string[]>(readFileSync(join(demo, 'refit', 'harbour-walks.csv'), 'utf8').trim(), { skipEmptyLines: true });
      const [header, ...rows] = parsed.data;
      const cells = rows.map((row) => row.map((cell) => (cell.trim() !== '' && Number.isFinite(Number(cell)) ? Number(cell) : cell)));
      writeFileSync(join(folder, 'harbour-walks.xlsx'), xlsxFile(header!, cells, cells.length));
      await page.locator('#tab-refit').click();
      await page.locator('#refit-data').setInputFiles(join(folder, 'harbour-walks.xlsx'));
      await page.locator('#refit-model').fill('mood ~ route * pace + loneliness');
      await page.locator('#refit-missing').fill('mood=99; loneliness=6-8');
      await page.locator('#refit-reported').fill('');
      await page.locator('#refit-run').click();
      await page.waitForFunction(() => (document.getElementById('refit-output')?.textContent ?? '').length > 0, null, { timeout: 60_000 });
      const cli = plumbline(['refit', 'harbour-walks.xlsx', '--model', 'mood ~ route * pace + loneliness', '--type', '3', '--missing', 'mood=99', '--missing', 'loneliness=6-8', '--format', 'text'], folder);
      expect(cli.status).toBe(0);
      expect((await page.locator('#refit-output').textContent())!.trimEnd()).toBe(`${cli.stdout}${cli.stderr ? `\n${cli.stderr}` : ''}`.trimEnd());
      expect(requests.filter((url) => url.includes('/api/refit'))).toEqual([]);
      expectOnlyOwnOrigin(requests, web.url.replace(/\/$/, ''));
    } finally {
      await page.context().close();
    }
  }, 90_000);

  it('settings are kept in this browser only and change the audit: alpha, tails, rules, whole-number measures', async () => {
    const { page, requests } = await open();
    try {
      // t(28) = 2.21, p = .018: half the two-tailed p .035 (SciPy 1.10.1 scipy.stats.t.sf, as in tests/checks/rules/halved-p.test.ts).
      await page.locator('#paste').fill('The groups differed, t(28) = 2.21, p = .018. Recall also differed, F(2, 57) = 4.21, p = .21.');
      await page.locator('#check-text').click();
      const verdicts = () => page.locator('#results-body tr td:nth-child(4)').allTextContents();
      const rules = () => page.locator('#results-body tr td:nth-child(5)').allTextContents();
      expect(await rules()).toEqual(['halved-p', 'p-value-mismatch']);
      expect(await verdicts()).toEqual(['warn', 'fail']);

      await page.locator('#settings summary').click();
      await page.locator('#tails-one').check();
      await page.locator('#rule-p-value-mismatch').uncheck();
      await page.locator('#alpha').fill('0.01');
      await page.locator('#integer-measures').fill('errors, recall score');
      await page.locator('#settings-form button[type="submit"]').click();
      expect(await verdicts()).toEqual(['note', 'no flag']);
      const stored = await page.evaluate(() => localStorage.getItem('plumbline.page.settings'));
      expect(JSON.parse(stored!)).toEqual({ alpha: 0.01, tails: 'one', rulesOff: ['p-value-mismatch'], integerScales: false, integerMeasures: ['errors', 'recall score'] });

      // A new visit starts from the stored settings.
      await page.reload();
      await page.waitForSelector('body[data-ready="true"]', { state: 'attached' });
      expect(await page.locator('#alpha').inputValue()).toBe('0.01');
      expect(await page.locator('#tails-one').isChecked()).toBe(true);
      expect(await page.locator('#rule-p-value-mismatch').isChecked()).toBe(false);
      await page.locator('#paste').fill('The groups differed, t(28) = 2.21, p = .018. Recall also differed, F(2, 57) = 4.21, p = .21.');
      await page.locator('#check-text').click();
      expect(await verdicts()).toEqual(['note', 'no flag']);
      expect(await page.locator('#detail').textContent()).toContain('Choose a marked result');
      await page.locator('#results-body button.show-result').first().click();
      expect(await page.locator('#detail').textContent()).toContain('the settings take t, z and r tests as one-tailed by default');
      await page.evaluate(() => localStorage.clear());
      expectOnlyOwnOrigin(requests, web.url.replace(/\/$/, ''));
    } finally {
      await page.context().close();
    }
  }, 60_000);

  it('a hostile manuscript (script tags, event attributes, javascript: links) runs nothing', async () => {
    const { page, requests, dialogs, errors } = await open();
    try {
      const hostile =
        '<script>window.__ran = "script"; alert(1)</script> The effect was F(2, 57) = 4.21, p = .21. ' +
        '<img src=x onerror="window.__ran=\'img\'; alert(2)"> <a href="javascript:window.__ran=\'link\'">read</a> ' +
        '<svg onload="window.__ran=\'svg\'"></svg> t(28) = 2.21, p = .035 <iframe src="javascript:alert(3)"></iframe>';
      await page.locator('#paste').fill(hostile);
      await page.locator('#check-text').click();
      // The same hostile text as files in the formats whose readers see markup, dropped together.
      const files = [
        { name: 'hostile.md', text: hostile },
        { name: 'hostile.html', text: `<html><body><p>${hostile}</p></body></html>` },
        { name: 'hostile.txt', text: hostile },
      ];
      const transfer = await page.evaluateHandle((list) => {
        const data = new DataTransfer();
        for (const file of list) data.items.add(new File([file.text], file.name));
        return data;
      }, files);
      await page.dispatchEvent('#drop-zone', 'drop', { dataTransfer: transfer });
      await page.waitForFunction(() => document.querySelectorAll('.document-choice').length === 4);
      for (let index = 0; index < 4; index++) {
        await page.locator('.document-choice').nth(index).click();
        await page.locator('#manuscript button.result').first().click();
        expect(await page.locator('#manuscript script, #manuscript img, #manuscript a, #manuscript svg, #manuscript iframe, #detail script, #detail img, #detail a').count()).toBe(0);
      }
      // The pasted text is shown as the text it is.
      await page.locator('.document-choice').nth(0).click();
      expect(await page.locator('#manuscript').textContent()).toContain('<script>window.__ran = "script"');
      await page.waitForTimeout(300);
      expect(await page.evaluate(() => (window as unknown as { __ran?: string }).__ran)).toBeUndefined();
      expect(dialogs).toEqual([]);
      expect(errors).toEqual([]);
      expectOnlyOwnOrigin(requests, web.url.replace(/\/$/, ''));
    } finally {
      await page.context().close();
    }
  }, 60_000);

  it('works from the keyboard: paste and check, choose files, step through the marks, open a result, switch tabs', async () => {
    const { page } = await open();
    try {
      await page.locator('body').focus();
      // Tab order: the tabs, the audit panel, then the text box.
      const focused = () => page.evaluate(() => document.activeElement?.id || document.activeElement?.className || document.activeElement?.tagName);
      for (let step = 0; step < 6 && (await focused()) !== 'paste'; step++) await page.keyboard.press('Tab');
      expect(await focused()).toBe('paste');
      await page.keyboard.type('The effect was F(2, 57) = 4.21, p = .21, and t(28) = 2.21, p = .035.');
      await page.keyboard.press('Tab');
      expect(await focused()).toBe('check-text');
      await page.keyboard.press('Enter');
      await page.waitForSelector('#manuscript button.result');
      // The file chooser opens from the keyboard.
      await page.locator('#files').focus();
      const [chooser] = await Promise.all([page.waitForEvent('filechooser'), page.keyboard.press('Space')]);
      await chooser.setFiles(join(demo, DOCX));
      await page.waitForFunction(() => document.querySelectorAll('.document-choice').length === 2);
      // Back to the pasted text; Tab reaches its marks; Enter opens one.
      await page.locator('.document-choice').nth(0).focus();
      await page.keyboard.press('Enter');
      await page.locator('#manuscript button.result').first().focus();
      await page.keyboard.press('Enter');
      expect(await page.locator('#detail .finding').count()).toBeGreaterThan(0);
      expect(await page.locator('#detail').textContent()).toContain('p-value-mismatch');
      await page.keyboard.press('Tab');
      expect(await page.evaluate(() => document.activeElement?.classList.contains('result'))).toBe(true);
      await page.keyboard.press('Enter');
      expect(await page.locator('#detail').textContent()).toContain('t(28) = 2.21');
      // A sort heading and a list entry by keyboard.
      await page.locator('th[data-sort="verdict"] button').focus();
      await page.keyboard.press('Enter');
      expect(await page.locator('th[data-sort="verdict"]').getAttribute('aria-sort')).toBe('ascending');
      // The tabs: arrow keys move between them and show their panels.
      await page.locator('#tab-audit').focus();
      await page.keyboard.press('ArrowRight');
      expect(await focused()).toBe('tab-refit');
      expect(await page.locator('#panel-refit').isVisible()).toBe(true);
      expect(await page.locator('#panel-audit').isVisible()).toBe(false);
      await page.keyboard.press('ArrowLeft');
      expect(await page.locator('#panel-audit').isVisible()).toBe(true);
      // The settings open from the keyboard.
      await page.locator('#settings summary').focus();
      await page.keyboard.press('Enter');
      expect(await page.locator('#alpha').isVisible()).toBe(true);
    } finally {
      await page.context().close();
    }
  }, 60_000);

  it('axe-core finds no serious or critical accessibility violation, with documents loaded, a result open and on the refit tab', async () => {
    const { page } = await open();
    try {
      const axeSource = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');
      await drop(page, [PDF, DOCX]);
      await page.locator('#paste').fill('The effect was F(2, 57) = 4.21, p = .21.');
      await page.locator('#check-text').click();
      await page.locator('#manuscript button.result').first().click();
      await page.locator('#settings summary').click();
      // Evaluated through the browser's debugging protocol: the page's own policy would (rightly) refuse it as a script element.
      await page.evaluate(axeSource);
      type Violation = { id: string; impact: string; nodes: unknown[] };
      const run = () => page.evaluate(async () => ((await (window as unknown as { axe: { run: (context: Document) => Promise<{ violations: Violation[] }> } }).axe.run(document)).violations.map((v) => ({ id: v.id, impact: v.impact, nodes: v.nodes.length }))));
      const audit = await run();
      expect(audit.length, JSON.stringify(audit)).toBeGreaterThanOrEqual(0);
      expect(audit.filter((v) => v.impact === 'serious' || v.impact === 'critical')).toEqual([]);
      await page.locator('#tab-refit').click();
      const refit = await run();
      expect(refit.filter((v) => v.impact === 'serious' || v.impact === 'critical')).toEqual([]);
    } finally {
      await page.context().close();
    }
  }, 60_000);

  it('the built file opened from disk refits the demo CSV and the same data as XLSX as the command line does, refuses hostile XLSX files with its messages, asking for nothing', async () => {
    const url = pathToFileURL(join(process.cwd(), 'dist', 'web', 'plumbline.html')).href;
    const { page, requests, errors } = await open(url);
    try {
      await page.locator('#tab-refit').click();
      expect(await page.locator('#refit-run').isDisabled()).toBe(false);
      await page.locator('#refit-data').setInputFiles(join(demo, 'refit', 'harbour-walks.csv'));
      await page.locator('#refit-model').fill('mood ~ route * pace + loneliness');
      await page.locator('#refit-missing').fill('mood=99; loneliness=6-8');
      await page.locator('#refit-reported').fill(readFileSync(join(demo, 'refit', 'harbour-walks-manuscript.md'), 'utf8'));
      await page.locator('#refit-run').click();
      await page.waitForFunction(() => (document.getElementById('refit-output')?.textContent ?? '').length > 0, null, { timeout: 60_000 });
      const shown = (await page.locator('#refit-output').textContent())!;
      copyFileSync(join(demo, 'refit', 'harbour-walks.csv'), join(folder, 'harbour-walks.csv'));
      copyFileSync(join(demo, 'refit', 'harbour-walks-manuscript.md'), join(folder, 'reported-table.md'));
      const cli = plumbline(['refit', 'harbour-walks.csv', '--model', 'mood ~ route * pace + loneliness', '--type', '3', '--missing', 'mood=99', '--missing', 'loneliness=6-8', '--reported', 'reported-table.md', '--format', 'text'], folder);
      expect(cli.status).toBe(1);
      expect(shown.trimEnd()).toBe(`${cli.stdout}${cli.stderr ? `\n${cli.stderr}` : ''}`.trimEnd());
      expect(shown).toContain('Missing-value codes left in the data as numbers');
      expect(await page.locator('#refit-status').textContent()).toContain('some reported numbers differ');

      // Without the codes and the pasted table: the refit alone, as the command prints it.
      await page.locator('#refit-missing').fill('');
      await page.locator('#refit-reported').fill('');
      await page.locator('#refit-run').click();
      const bare = plumbline(['refit', 'harbour-walks.csv', '--model', 'mood ~ route * pace + loneliness', '--type', '3', '--format', 'text'], folder);
      await page.waitForFunction((before) => (document.getElementById('refit-output')?.textContent ?? '') !== before, shown, { timeout: 60_000 });
      expect((await page.locator('#refit-output').textContent())!.trimEnd()).toBe(`${bare.stdout}${bare.stderr ? `\n${bare.stderr}` : ''}`.trimEnd());

      // A column the data lacks: the command's message, as it prints it.
      await page.locator('#refit-model').fill('mood ~ rout * pace');
      await page.locator('#refit-run').click();
      const wrong = plumbline(['refit', 'harbour-walks.csv', '--model', 'mood ~ rout * pace', '--type', '3', '--format', 'text'], folder);
      expect(wrong.status).toBe(2);
      await page.waitForFunction(() => (document.getElementById('refit-output')?.textContent ?? '').includes('plumbline:'), null, { timeout: 60_000 });
      expect((await page.locator('#refit-output').textContent())!.trim()).toBe(wrong.stderr.trim());
      expect(await page.locator('#refit-status').textContent()).toContain('could not be run');

      // An XLSX sheet of the same data: read in the page within the command's limits, the command's output, nothing asked.
      writeFileSync(join(folder, 'harbour-walks.xlsx'), demoSheet());
      await page.locator('#refit-data').setInputFiles(join(folder, 'harbour-walks.xlsx'));
      await page.locator('#refit-model').fill('mood ~ route * pace + loneliness');
      await page.locator('#refit-missing').fill('mood=99; loneliness=6-8');
      await page.locator('#refit-reported').fill(readFileSync(join(demo, 'refit', 'harbour-walks-manuscript.md'), 'utf8'));
      const sheetCli = plumbline(['refit', 'harbour-walks.xlsx', '--model', 'mood ~ route * pace + loneliness', '--type', '3', '--missing', 'mood=99', '--missing', 'loneliness=6-8', '--reported', 'reported-table.md', '--format', 'text'], folder);
      expect(sheetCli.status).toBe(1);
      expect(await refitShown(page)).toBe(`${sheetCli.stdout}${sheetCli.stderr ? `\n${sheetCli.stderr}` : ''}`.trimEnd());
      expect(await page.locator('#refit-status').textContent()).toContain('some reported numbers differ');

      // Hostile sheets (tests/refit/xlsx-cli.test.ts makes the same ones): refused in the page with the command's own message.
      await page.locator('#refit-reported').fill('');
      const hostile: [string, Buffer][] = [
        // A zip bomb whose compressed size alone gives it away: the sheet is far larger than the 1,000 bytes its directory declares.
        ['bomb.xlsx', withPart(demoSheet(), 'xl/worksheets/sheet1.xml', null, 1_000)],
        // A zip bomb that has to be inflated to be caught: 20 MB of spaces (about 20 KB deflated) declared as 100,000 bytes.
        ['inflating-bomb.xlsx', withPart(demoSheet(), 'xl/worksheets/sheet1.xml', Buffer.alloc(20_000_000, 0x20), 100_000)],
        // A directory that declares 150 MB: refused before anything is inflated.
        ['declared.xlsx', withPart(demoSheet(), 'xl/worksheets/sheet1.xml', null, 150 * 1_000_000)],
        // One cell at the last row: the reader would lay out a million rows.
        ['far-row.xlsx', xlsxFile(['mood', 'route'], [[1, 'a'], [2, 'b']], 2, { extraRowsXml: '<row r="1048576"><c r="A1048576"><v>1</v></c></row>' })],
        // Not a zip archive at all.
        ['text.xlsx', Buffer.from('mood,route\n1,a\n')],
      ];
      for (const [name, bytes] of hostile) {
        writeFileSync(join(folder, name), bytes);
        await page.locator('#refit-data').setInputFiles(join(folder, name));
        await page.locator('#refit-model').fill('mood ~ route');
        await page.locator('#refit-missing').fill('');
        const refused = plumbline(['refit', name, '--model', 'mood ~ route', '--type', '3', '--format', 'text'], folder);
        expect(refused.status).toBe(2);
        expect(refused.stderr).toContain(`plumbline: ${name}: `);
        expect((await refitShown(page)).trim()).toBe(refused.stderr.trim());
        expect(await page.locator('#refit-status').textContent()).toContain('could not be run');
      }
      expect(requests).toEqual([url]);
      expect(errors).toEqual([]);
    } finally {
      await page.context().close();
    }
  }, 120_000);

  it('the built file opened from disk works offline: it audits and asks for nothing', async () => {
    const file = join(process.cwd(), 'dist', 'web', 'plumbline.html');
    const url = pathToFileURL(file).href;
    const { page, requests, errors } = await open(url);
    try {
      await drop(page, [PDF]);
      expect(await page.locator('#manuscript button.result.v-fail').count()).toBeGreaterThan(0);
      // A text without results says so above it, as every report does.
      await page.locator('#paste').fill('A paragraph that reports no test at all.');
      await page.locator('#check-text').click();
      expect(await page.locator('#manuscript-notes').textContent()).toBe(NO_RESULTS_MESSAGE);
      expect(await page.locator('#manuscript-notes').isVisible()).toBe(true);
      expect(requests).toEqual([url]);
      expect(errors).toEqual([]);
    } finally {
      await page.context().close();
    }
  }, 60_000);
});
