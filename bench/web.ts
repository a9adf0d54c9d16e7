/**
 * The page of `plumbline web` in headless Chromium (Debian's chromium,
 * driven by playwright-core), started through the built command:
 *
 *   npm run build && node dist/bench/web.js
 *
 * (a) page load: from navigation to the page's script being ready (median
 *     of 5 fresh tabs); goal under 1 s. Baseline: the command line's HTML
 *     report of the same PDF opened from disk in the same browser.
 * (b) auditing a generated 30-page PDF in the page: from the drop to its
 *     results listed (median of 3); goal under 3 s. Baseline: `plumbline
 *     scan` of the same file with the same PDF engine (pdf-parse, i.e.
 *     pdf.js) as a whole process, start-up included.
 */
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { PDFDocument, StandardFonts } from 'pdf-lib';
import { chromium, type Page } from 'playwright-core';
import { fUpperTail, tTwoTailed } from '../src/stats/index.js';
import { printedP, seededRandom } from './seededRandom.js';

const here = dirname(fileURLToPath(import.meta.url));
const cli = join(here, '..', 'src', 'cli', 'main.js');
const CHROMIUM = '/usr/bin/chromium';
const ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];
const PAGES = 30;

const filler = 'Participants completed the questionnaire in a quiet room and were debriefed afterwards; responses were screened first.';

/** An invented manuscript of about PAGES pages: prose with an F or t result every 29 lines, most consistent. */
function manuscriptLines(): string[] {
  const random = seededRandom(2026);
  const lines = ['An invented manuscript for the benchmark of the web page', ''];
  for (let result = 0; lines.length < PAGES * 58 - 30; result += 1) {
    for (let sentence = 0; sentence < 28; sentence += 1) lines.push(filler);
    const df2 = 40 + Math.floor(random() * 160);
    const f = (1 + random() * 9).toFixed(2);
    const t = (random() * 4).toFixed(2);
    lines.push(
      result % 2 === 0
        ? `The effect of condition was reliable, F(2, ${df2}) = ${f}, p ${printedP(fUpperTail(Number(f), 2, df2), random)}.`
        : `Groups differed, t(${df2}) = ${t}, p ${printedP(tTwoTailed(Number(t), df2), random)}.`,
    );
  }
  return lines;
}

async function writePdf(path: string, lines: string[]): Promise<number> {
  const pdf = await PDFDocument.create();
  const font = await pdf.embedFont(StandardFonts.Helvetica);
  let page = pdf.addPage([595, 842]);
  let y = 800;
  for (const line of lines) {
    if (y < 50) {
      page = pdf.addPage([595, 842]);
      y = 800;
    }
    page.drawText(line, { x: 40, y, size: 9, font });
    y -= 13;
  }
  writeFileSync(path, await pdf.save());
  return pdf.getPageCount();
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)]!;
}

function startWeb(): Promise<{ url: string; stop: () => void }> {
  const child = spawn(process.execPath, [cli, 'web', '--no-open'], { stdio: ['ignore', 'pipe', 'inherit'] });
  let out = '';
  return new Promise((resolve, reject) => {
    child.stdout.on('data', (chunk: Buffer) => {
      out += chunk.toString('utf8');
      const found = /plumbline web: (http:\/\/127\.0\.0\.1:\d+\/)/.exec(out);
      if (found) resolve({ url: found[1]!, stop: () => child.kill('SIGTERM') });
    });
    child.once('exit', (code) => reject(new Error(`plumbline web ended with ${code}: ${out}`)));
  });
}

/**
 * Milliseconds from navigation to ready, by the page's own clock (counted from the navigation's start): the end of
 * its load event, or later when its script says it was ready later (data-ready-at).
 */
async function loadTime(page: Page, url: string, ready: string): Promise<number> {
  await page.goto(url, { waitUntil: 'load' });
  await page.waitForSelector(ready, { state: 'attached', timeout: 30_000 });
  await page.waitForFunction(() => (performance.getEntriesByType('navigation')[0] as PerformanceNavigationTiming | undefined)?.loadEventEnd ?? 0 > 0);
  return page.evaluate(() => {
    const navigation = performance.getEntriesByType('navigation')[0] as PerformanceNavigationTiming;
    return Math.max(navigation.loadEventEnd, Number(document.body.dataset.readyAt ?? 0));
  });
}

async function main(): Promise<void> {
  if (!existsSync(CHROMIUM)) {
    console.log(`${CHROMIUM} is missing: this benchmark needs Debian's chromium package (apt-get install -y chromium).`);
    process.exitCode = 1;
    return;
  }
  const folder = mkdtempSync(join(tmpdir(), 'plumbline-bench-web-'));
  const pdfPath = join(folder, 'thirty-pages.pdf');
  const pages = await writePdf(pdfPath, manuscriptLines());
  const web = await startWeb();
  const browser = await chromium.launch({ executablePath: CHROMIUM, headless: true, args: ARGS });
  try {
    // Baseline (a): the command line's HTML report of the same PDF, opened from disk.
    const reportPath = join(folder, 'report.html');
    const report = spawnSync(process.execPath, [cli, 'scan', pdfPath, '--pdf-engine', 'pdf-parse', '--no-cache', '--format', 'html', '--output', reportPath, '--fail-on', 'never', '--quiet'], { encoding: 'utf8' });
    if (report.status !== 0) throw new Error(`scan failed: ${report.stderr}`);

    const loads: number[] = [];
    const reportLoads: number[] = [];
    for (let run = 0; run < 5; run++) {
      const context = await browser.newContext();
      const page = await context.newPage();
      reportLoads.push(await loadTime(page, pathToFileURL(reportPath).href, 'footer'));
      loads.push(await loadTime(page, web.url, 'body[data-ready="true"]'));
      await context.close();
    }

    // (b) the 30-page PDF dropped on the page.
    const base64 = readFileSync(pdfPath).toString('base64');
    const audits: number[] = [];
    let resultsInPage = 0;
    for (let run = 0; run < 3; run++) {
      const context = await browser.newContext();
      const page = await context.newPage();
      await page.goto(web.url);
      await page.waitForSelector('body[data-ready="true"]', { state: 'attached' });
      const transfer = await page.evaluateHandle((data) => {
        const transferred = new DataTransfer();
        transferred.items.add(new File([Uint8Array.from(atob(data), (c) => c.charCodeAt(0))], 'thirty-pages.pdf'));
        return transferred;
      }, base64);
      const started = await page.evaluate(() => performance.now());
      await page.dispatchEvent('#drop-zone', 'drop', { dataTransfer: transfer });
      await page.waitForSelector('.document-choice', { timeout: 60_000 });
      const ended = await page.evaluate(() => performance.now());
      audits.push(ended - started);
      resultsInPage = await page.locator('#results-body tr').count();
      await context.close();
    }

    const cliRuns = [0, 1, 2].map(() => {
      const start = process.hrtime.bigint();
      const run = spawnSync(process.execPath, [cli, 'scan', pdfPath, '--pdf-engine', 'pdf-parse', '--no-cache', '--jobs', '1', '--format', 'json', '--fail-on', 'never', '--quiet'], { encoding: 'utf8', maxBuffer: 1 << 28 });
      if (run.status !== 0) throw new Error(`scan failed: ${run.stderr}`);
      return Number(process.hrtime.bigint() - start) / 1e6;
    });

    const pageSize = readFileSync(join(here, '..', '..', 'dist', 'web', 'plumbline.html')).length;
    const load = median(loads);
    const audit = median(audits);
    const cliTime = median(cliRuns);
    const reportLoad = median(reportLoads);
    console.log(`page: dist/web/plumbline.html, ${(pageSize / 1e6).toFixed(2)} MB; PDF: ${pages} pages, ${resultsInPage} results`);
    console.log(`(a) page load to ready, median of 5:            ${load.toFixed(0).padStart(6)} ms   goal < 1000 ms: ${load < 1000 ? 'met' : 'NOT met'}`);
    console.log(`    baseline, the HTML report of the same PDF:  ${reportLoad.toFixed(0).padStart(6)} ms   ratio ${(load / reportLoad).toFixed(2)}`);
    console.log(`(b) ${pages}-page PDF audited in the page, median of 3: ${audit.toFixed(0).padStart(6)} ms   goal < 3000 ms: ${audit < 3000 ? 'met' : 'NOT met'}`);
    console.log(`    baseline, plumbline scan (pdf-parse, whole process): ${cliTime.toFixed(0).padStart(6)} ms   ratio ${(audit / cliTime).toFixed(2)}`);
  } finally {
    await browser.close();
    web.stop();
    rmSync(folder, { recursive: true, force: true });
  }
}

main().catch((error: unknown) => {
  console.error(error);
  process.exitCode = 1;
});
