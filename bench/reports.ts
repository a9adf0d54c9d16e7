/**
 * Reports of a large corpus: a generated corpus of text manuscripts (about
 * fifteen results each, one in ten printed p wrong, an ANOVA table in one in
 * five) in which one file in ten is a byte-for-byte copy of another under a
 * new name, audited by the built command and written as JSON and as HTML.
 *
 *   npm run build && node dist/bench/reports.js [documents]
 *
 * `npm run bench` runs it on 10,000 documents (about a minute and a half on
 * two cores: 41 s of it the scan); give a smaller number for a quicker run.
 *
 * Prints, for the command as a user runs it:
 *   - scan (audit, JSON Lines and the JSON report), no cache;
 *   - merge of the JSON Lines into JSON (baseline) and into HTML, with the
 *     ratio HTML / JSON;
 * and in this process, on the report read back: formatJson (baseline) and
 * formatHtml on all documents and on a quarter of them, with the ratio
 * HTML / JSON and the growth from a quarter to all (4 when writing is
 * linear in the results); sizes of the files. Where Debian's chromium is
 * installed, the HTML report is opened in it (headless, playwright-core):
 * the time until the page is loaded and its script has paged it, and the
 * time of a sort and of a search of the document table.
 */
import { spawnSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { buildReport } from '../src/report/build.js';
import { formatHtml } from '../src/report/html.js';
import { formatJson } from '../src/report/json.js';
import { readJsonReport } from '../src/report/jsonLayoutSchema.js';
import { fUpperTail, rTwoTailed, tTwoTailed } from '../src/stats/index.js';
import { bestTime } from './bestTime.js';
import { printedP, seededRandom } from './seededRandom.js';

const here = dirname(fileURLToPath(import.meta.url));
const cli = join(here, '..', 'src', 'cli', 'main.js');
const documents = Number(process.argv[2] ?? 10000);
if (!Number.isInteger(documents) || documents < 8) throw new Error(`documents: a whole number of at least 8, not ${process.argv[2]}`);

const filler = 'Participants completed the questionnaire in a quiet room and were debriefed afterwards.';

function manuscript(index: number): string {
  const random = seededRandom(7000 + index);
  const lines = [`Study ${index}: an invented manuscript for the benchmark`, ''];
  for (let paragraph = 0; paragraph < 15; paragraph += 1) {
    const df2 = 40 + Math.floor(random() * 160);
    const f = (1 + random() * 9).toFixed(2);
    const t = (random() * 4).toFixed(2);
    const r = `.${10 + Math.floor(random() * 80)}`;
    for (let sentence = 0; sentence < 3; sentence += 1) lines.push(filler);
    lines.push(
      paragraph % 3 === 0
        ? `The effect of condition was reliable, F(2, ${df2}) = ${f}, p ${printedP(fUpperTail(Number(f), 2, df2), random)}.`
        : paragraph % 3 === 1
          ? `Groups differed, t(${df2}) = ${t}, p ${printedP(tTwoTailed(Number(t), df2), random)}.`
          : `Scores correlated, r(${df2}) = ${r}, p ${printedP(rTwoTailed(Number(r), df2), random)}.`,
    );
  }
  if (index % 5 === 0) {
    // An ANOVA table; in one of two its F does not follow from its own SS and df.
    const f = index % 10 === 0 ? '2.41' : '4.22';
    lines.push('', 'Table 1. Analysis of variance', 'Source | SS | df | MS | F | p', `Condition | 12.40 | 2 | 6.20 | ${f} | .020`, 'Error | 83.95 | 57 | 1.47 | |');
  }
  return lines.join('\n');
}

function seconds(run: () => void): number {
  const start = process.hrtime.bigint();
  run();
  return Number(process.hrtime.bigint() - start) / 1e9;
}

function plumbline(args: string[], cwd: string): void {
  const result = spawnSync(process.execPath, [cli, ...args, '--fail-on', 'never'], { cwd, encoding: 'utf8', maxBuffer: 1 << 30 });
  if (result.status !== 0) throw new Error(`plumbline ${args[0]} exited ${result.status}: ${result.stderr}`);
}

function megabytes(path: string): string {
  return `${(statSync(path).size / 1e6).toFixed(1)} MB`;
}

/** Times in a headless Chromium: load (script run included), a sort by name, a search; null without chromium. */
async function inBrowser(file: string): Promise<{ load: number; sort: number; search: number } | null> {
  const executablePath = '/usr/bin/chromium';
  if (!existsSync(executablePath)) return null;
  const { chromium } = await import('playwright-core');
  const browser = await chromium.launch({ executablePath, headless: true, args: ['--headless', '--no-sandbox', '--disable-gpu'] });
  try {
    const page = await browser.newPage();
    const started = process.hrtime.bigint();
    await page.goto(pathToFileURL(file).href, { waitUntil: 'load', timeout: 600_000 });
    await page.waitForFunction(() => document.querySelector('nav[data-for="documents-body"] .page-status')?.textContent !== '', undefined, { timeout: 600_000 });
    const load = Number(process.hrtime.bigint() - started) / 1e9;
    const sort = await page.evaluate(() => {
      const start = performance.now();
      (document.querySelector('th[data-sort="name"] button') as HTMLButtonElement).click();
      document.body.getBoundingClientRect(); // the layout the sort causes
      return (performance.now() - start) / 1000;
    });
    const search = await page.evaluate(() => {
      const start = performance.now();
      const input = document.getElementById('doc-search') as HTMLInputElement;
      input.value = 'paper-001';
      input.dispatchEvent(new Event('input'));
      document.body.getBoundingClientRect();
      return (performance.now() - start) / 1000;
    });
    return { load, sort, search };
  } finally {
    await browser.close();
  }
}

async function main(): Promise<void> {
  const root = mkdtempSync(join(tmpdir(), 'plumbline-bench-reports-'));
  const corpus = join(root, 'corpus');
  mkdirSync(corpus);
  const copies = Math.floor(documents / 10);
  const originals = documents - copies;
  for (let i = 0; i < originals; i += 1) writeFileSync(join(corpus, `paper-${String(i).padStart(5, '0')}.txt`), manuscript(i));
  // The same paper downloaded twice: a copy under another name, which is its own document in the report.
  for (let i = 0; i < copies; i += 1) copyFileSync(join(corpus, `paper-${String(i * 7 % originals).padStart(5, '0')}.txt`), join(corpus, `copy-${String(i).padStart(5, '0')}.txt`));
  const cores = availableParallelism();
  console.log(`corpus: ${documents} text documents (${copies} of them copies of others under new names), about 15 results each; ${cores} cores`);

  const jsonl = join(root, 'audit.jsonl');
  const scanJson = join(root, 'scan.json');
  const scan = seconds(() => plumbline(['scan', 'corpus', '--jobs', String(cores), '--no-cache', '--quiet', '--jsonl', jsonl, '--format', 'json', '--output', scanJson], root));
  const mergeJsonFile = join(root, 'merged.json');
  const mergeHtmlFile = join(root, 'merged.html');
  const mergeJson = seconds(() => plumbline(['merge', jsonl, '--format', 'json', '--output', mergeJsonFile], root));
  const mergeHtml = seconds(() => plumbline(['merge', jsonl, '--format', 'html', '--output', mergeHtmlFile], root));

  const report = readJsonReport(readFileSync(scanJson, 'utf8'));
  const quarter = buildReport(report.documents.slice(0, Math.floor(report.documents.length / 4)));
  const results = report.summary.statistics;
  const jsonAll = bestTime(() => formatJson(report), 3);
  const htmlAll = bestTime(() => formatHtml(report), 3);
  const jsonQuarter = bestTime(() => formatJson(quarter), 3);
  const htmlQuarter = bestTime(() => formatHtml(quarter), 3);
  const html = formatHtml(report);

  const row = (label: string, value: string): void => console.log(`${label.padEnd(58)} ${value}`);
  row(`scan: audit, JSON Lines and JSON report, ${cores} jobs, no cache`, `${scan.toFixed(2)} s (${(documents / scan).toFixed(0)} documents/s)`);
  row('baseline  merge JSON Lines -> JSON', `${mergeJson.toFixed(2)} s`);
  row('merge JSON Lines -> HTML', `${mergeHtml.toFixed(2)} s`);
  row('ratio  merge HTML / merge JSON', mergeHtml / mergeJson >= 0 ? (mergeHtml / mergeJson).toFixed(2) : 'n/a');
  row(`baseline  formatJson, ${report.documents.length} documents, ${results} results`, `${jsonAll.toFixed(0)} ms`);
  row(`formatHtml, the same`, `${htmlAll.toFixed(0)} ms (${((htmlAll * 1000) / Math.max(1, results)).toFixed(1)} µs a result)`);
  row('ratio  formatHtml / formatJson', (htmlAll / jsonAll).toFixed(2));
  row(`formatHtml, a quarter (${quarter.documents.length} documents)`, `${htmlQuarter.toFixed(0)} ms; formatJson ${jsonQuarter.toFixed(0)} ms`);
  row('ratio  formatHtml all / a quarter (4 when linear)', (htmlAll / htmlQuarter).toFixed(2));
  row('ratio  formatJson all / a quarter (4 when linear)', (jsonAll / jsonQuarter).toFixed(2));
  row('sizes  JSON report / HTML report', `${megabytes(scanJson)} / ${megabytes(mergeHtmlFile)} (${(html.length / Math.max(1, results)).toFixed(0)} characters of HTML a result)`);
  row('summary', `${report.summary.flaggedStatistics} results flagged, ${report.summary.crossesAlpha} findings change the conclusion`);
  const browser = await inBrowser(mergeHtmlFile);
  if (browser === null) row('HTML in Chromium', 'not measured: /usr/bin/chromium is not installed (apt-get install -y chromium)');
  else {
    row('HTML in Chromium: load, script run and first page shown', `${browser.load.toFixed(2)} s`);
    row('HTML in Chromium: sort the document table by name', `${(browser.sort * 1000).toFixed(0)} ms`);
    row('HTML in Chromium: search it', `${(browser.search * 1000).toFixed(0)} ms`);
  }
  if (process.env.PLUMBLINE_BENCH_KEEP) console.log(`kept ${root}`);
  else rmSync(root, { recursive: true, force: true });
}

await main();
