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
 *     ratio HTML / JSON, and the peak memory of each;
 * and in this process, on the report read back: formatJson (baseline) and
 * formatHtml on all documents and on a quarter of them, with the ratio
 * HTML / JSON and the growth from a quarter to all (4 when writing is
 * linear in the results); sizes of the files, the HTML page's beside its
 * goal (20 MB at 10,000 documents, 2 kB a document). Where Debian's chromium
 * is installed, the HTML report is opened in it (headless, playwright-core):
 * the time until the page is loaded and its script has drawn the first page
 * of each list (goal: 2 s at 10,000 documents), and the time of a sort and
 * of a search of the document table and of a filter of the flags.
 *
 * With PLUMBLINE_BENCH_BEFORE=<another build's dist/src/cli/main.js> (for
 * example a checkout of an earlier commit, built), the same JSON Lines are
 * merged into HTML by that build too, in this run, and its page's size and
 * load time are printed beside these with the ratio after / before.
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

function plumbline(args: string[], cwd: string, command = cli): void {
  const result = spawnSync(process.execPath, [command, ...args, '--fail-on', 'never'], { cwd, encoding: 'utf8', maxBuffer: 1 << 30 });
  if (result.status !== 0) throw new Error(`plumbline ${args[0]} exited ${result.status}: ${result.stderr}`);
}

/** A run of the command with its time and its peak memory (resident set, MB), read by a preloaded module at exit. */
function measured(args: string[], cwd: string, command = cli): { seconds: number; peakMb: number } {
  const peakFile = join(cwd, 'peak-rss.txt');
  const preload = join(cwd, 'peak-rss.mjs');
  writeFileSync(preload, `import { writeFileSync } from 'node:fs';\nprocess.on('exit', () => writeFileSync(${JSON.stringify(peakFile)}, String(process.resourceUsage().maxRSS)));\n`);
  const started = process.hrtime.bigint();
  const result = spawnSync(process.execPath, ['--import', pathToFileURL(preload).href, command, ...args, '--fail-on', 'never'], { cwd, encoding: 'utf8', maxBuffer: 1 << 30 });
  const seconds = Number(process.hrtime.bigint() - started) / 1e9;
  if (result.status !== 0) throw new Error(`plumbline ${args[0]} exited ${result.status}: ${result.stderr}`);
  return { seconds, peakMb: Number(readFileSync(peakFile, 'utf8')) / 1024 };
}

/** The goals of the HTML page, scaled from 10,000 documents to the corpus measured. */
const SIZE_GOAL_MB_PER_10K = 20;
const LOAD_GOAL_SECONDS_AT_10K = 2;

function megabytes(path: string): string {
  return `${(statSync(path).size / 1e6).toFixed(1)} MB`;
}

interface BrowserTimes {
  load: number;
  sort: number;
  search: number;
  filter: number;
}

/**
 * Times in a headless Chromium: load until the script has drawn the first page of each list, a sort by name,
 * a search, a filter of the flags (fail only off); null without chromium.
 */
async function inBrowser(file: string): Promise<BrowserTimes | null> {
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
    const filter = await page.evaluate(() => {
      const start = performance.now();
      (document.querySelector('input[data-group="severity"][value="fail"]') as HTMLInputElement).click();
      document.body.getBoundingClientRect();
      return (performance.now() - start) / 1000;
    });
    return { load, sort, search, filter };
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
  const mergeJson = measured(['merge', jsonl, '--format', 'json', '--output', mergeJsonFile], root);
  const mergeHtml = measured(['merge', jsonl, '--format', 'html', '--output', mergeHtmlFile], root);
  const before = process.env.PLUMBLINE_BENCH_BEFORE;
  const beforeHtmlFile = join(root, 'merged-before.html');
  const mergeBefore = before ? measured(['merge', jsonl, '--format', 'html', '--output', beforeHtmlFile], root, before) : null;

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
  const mb = (path: string): number => statSync(path).size / 1e6;
  const scale = documents / 10_000;
  row('baseline  merge JSON Lines -> JSON', `${mergeJson.seconds.toFixed(2)} s, peak memory ${mergeJson.peakMb.toFixed(0)} MB`);
  row('merge JSON Lines -> HTML', `${mergeHtml.seconds.toFixed(2)} s, peak memory ${mergeHtml.peakMb.toFixed(0)} MB`);
  row('ratio  merge HTML / merge JSON: time, peak memory', `${(mergeHtml.seconds / mergeJson.seconds).toFixed(2)}, ${(mergeHtml.peakMb / mergeJson.peakMb).toFixed(2)}`);
  row(`baseline  formatJson, ${report.documents.length} documents, ${results} results`, `${jsonAll.toFixed(0)} ms`);
  row(`formatHtml, the same`, `${htmlAll.toFixed(0)} ms (${((htmlAll * 1000) / Math.max(1, results)).toFixed(1)} µs a result)`);
  row('ratio  formatHtml / formatJson', (htmlAll / jsonAll).toFixed(2));
  row(`formatHtml, a quarter (${quarter.documents.length} documents)`, `${htmlQuarter.toFixed(0)} ms; formatJson ${jsonQuarter.toFixed(0)} ms`);
  row('ratio  formatHtml all / a quarter (4 when linear)', (htmlAll / htmlQuarter).toFixed(2));
  row('ratio  formatJson all / a quarter (4 when linear)', (jsonAll / jsonQuarter).toFixed(2));
  row('sizes  JSON report / HTML report', `${megabytes(scanJson)} / ${megabytes(mergeHtmlFile)} (${(html.length / Math.max(1, results)).toFixed(0)} characters of HTML a result)`);
  const sizeGoal = SIZE_GOAL_MB_PER_10K * scale;
  row(`HTML size: goal <= ${sizeGoal.toFixed(1)} MB (${SIZE_GOAL_MB_PER_10K} MB at 10,000 documents)`, `${mb(mergeHtmlFile).toFixed(1)} MB: ${mb(mergeHtmlFile) <= sizeGoal ? 'met' : 'NOT met'}`);
  row('ratio  HTML report / JSON report (size)', (mb(mergeHtmlFile) / mb(scanJson)).toFixed(2));
  row('summary', `${report.summary.flaggedStatistics} results flagged, ${report.summary.crossesAlpha} findings change the conclusion`);
  const browser = await inBrowser(mergeHtmlFile);
  const loadGoal = LOAD_GOAL_SECONDS_AT_10K * Math.max(1, scale);
  if (browser === null) row('HTML in Chromium', 'not measured: /usr/bin/chromium is not installed (apt-get install -y chromium)');
  else {
    row(`HTML in Chromium: load and first pages drawn, goal <= ${loadGoal.toFixed(1)} s`, `${browser.load.toFixed(2)} s: ${browser.load <= loadGoal ? 'met' : 'NOT met'}`);
    row('HTML in Chromium: sort the document table by name', `${(browser.sort * 1000).toFixed(0)} ms`);
    row('HTML in Chromium: search it', `${(browser.search * 1000).toFixed(0)} ms`);
    row('HTML in Chromium: filter the flags (fail off)', `${(browser.filter * 1000).toFixed(0)} ms`);
  }
  if (mergeBefore !== null) {
    row('before (PLUMBLINE_BENCH_BEFORE): merge JSON Lines -> HTML', `${mergeBefore.seconds.toFixed(2)} s, peak memory ${mergeBefore.peakMb.toFixed(0)} MB`);
    row('before: HTML size', `${mb(beforeHtmlFile).toFixed(1)} MB; ratio after / before ${(mb(mergeHtmlFile) / mb(beforeHtmlFile)).toFixed(2)}`);
    row('ratio  peak memory of the HTML merge, after / before', (mergeHtml.peakMb / mergeBefore.peakMb).toFixed(2));
    const old = browser === null ? null : await inBrowser(beforeHtmlFile);
    if (old !== null && browser !== null) {
      row('before: HTML in Chromium, load and first pages drawn', `${old.load.toFixed(2)} s; ratio after / before ${(browser.load / old.load).toFixed(2)}`);
      row('before: sort, search, filter', `${(old.sort * 1000).toFixed(0)} ms, ${(old.search * 1000).toFixed(0)} ms, ${(old.filter * 1000).toFixed(0)} ms`);
    }
  }
  if (process.env.PLUMBLINE_BENCH_KEEP) console.log(`kept ${root}`);
  else rmSync(root, { recursive: true, force: true });
}

await main();
