/**
 * Worker start-up: how soon a worker thread can audit its first document.
 *
 *   npm run build && node dist/bench/workers.js [starts]
 *
 * Starts worker threads as the batch's pool does, one at a time, each
 * loading a worker module, and times in each:
 *   - ready: from `new Worker` to the module loaded (what piscina waits for
 *     before it hands the thread a task);
 *   - first document: auditing a one-paragraph text file right after, with
 *     the default settings (resolving them, and V8 compiling the code the
 *     audit runs for the first time);
 *   - a demo paper (corpus-demo/lantern-reading-fluency.txt) after that.
 * for the bundled worker (dist/src/bundled/worker.js, written by `npm run
 * build`) and, as the baseline in the same run, the plain compiled modules
 * (dist/src/batch/worker.js). Medians over the starts.
 * Goal (issue 16): ready within 0.2 s.
 */
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';
import { workerModuleOf } from '../src/batch/run.js';

const here = dirname(fileURLToPath(import.meta.url));
const starts = Number(process.argv[2] ?? 7);

interface StartTimes {
  readyMs: number;
  firstMs: number;
  paperMs: number;
}

/** The code each thread runs: load the module, then audit the two files through its default export, as the pool does. */
const THREAD = `
const { parentPort, workerData } = require('node:worker_threads');
const begun = Date.now();
import(workerData.module).then(async (loaded) => {
  const ready = Date.now();
  const audit = (path) => loaded.default({ path, userConfig: {}, configSource: 'defaults', readOptions: {} });
  const first = performance.now();
  await audit(workerData.small);
  const firstMs = performance.now() - first;
  const paper = performance.now();
  await audit(workerData.paper);
  parentPort.postMessage({ begun, ready, firstMs, paperMs: performance.now() - paper });
});`;

function startOnce(module: string, small: string, paper: string): Promise<StartTimes> {
  return new Promise((resolvePromise, reject) => {
    const created = Date.now();
    const worker = new Worker(THREAD, { eval: true, workerData: { module, small, paper } });
    worker.once('message', (message: { ready: number; firstMs: number; paperMs: number }) => {
      resolvePromise({ readyMs: message.ready - created, firstMs: message.firstMs, paperMs: message.paperMs });
      void worker.terminate();
    });
    worker.once('error', reject);
  });
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)]!;
}

async function main(): Promise<void> {
  const folder = mkdtempSync(join(tmpdir(), 'plumbline-bench-workers-'));
  const small = join(folder, 'paragraph.txt');
  writeFileSync(small, 'Invented for a benchmark. The groups differed, F(2, 57) = 4.21, p = .020, and the scores correlated, r(58) = .31, p = .016.\n');
  const paper = join(here, '..', '..', 'corpus-demo', 'lantern-reading-fluency.txt');
  const plain = pathToFileURL(join(here, '..', 'src', 'batch', 'worker.js')).href;
  const chosen = workerModuleOf(pathToFileURL(join(here, '..', 'src', 'batch', 'run.js')).href);
  const bundled = pathToFileURL(join(here, '..', 'src', 'bundled', 'worker.js')).href;
  const modules: [string, string][] = [['plain modules (baseline)', plain]];
  if (existsSync(fileURLToPath(bundled))) modules.push([chosen === bundled ? 'bundled (what the batch loads)' : 'bundled (STALE: the batch loads the plain modules; npm run build)', bundled]);
  else console.log('no bundled worker (dist/src/bundled): run npm run build');

  const medians = new Map<string, StartTimes>();
  const runs = new Map<string, StartTimes[]>(modules.map(([label]) => [label, []]));
  // The modules take turns, so a busy spell of the machine falls on both alike.
  for (let run = 0; run < starts; run++) {
    for (const [label, module] of run % 2 === 0 ? modules : [...modules].reverse()) runs.get(label)!.push(await startOnce(module, small, paper));
  }
  for (const [label, times] of runs) {
    medians.set(label, { readyMs: median(times.map((t) => t.readyMs)), firstMs: median(times.map((t) => t.firstMs)), paperMs: median(times.map((t) => t.paperMs)) });
  }
  console.log(`worker threads started ${starts} times each, medians:`);
  for (const [label, times] of medians) {
    console.log(`  ${label.padEnd(44)} ready ${times.readyMs.toFixed(0).padStart(4)} ms   first document ${times.firstMs.toFixed(0).padStart(4)} ms   then a demo paper ${times.paperMs.toFixed(0).padStart(4)} ms`);
  }
  const [, loaded] = [...medians].find(([label]) => label.startsWith('bundled (what')) ?? [...medians][0]!;
  const baseline = medians.get('plain modules (baseline)')!;
  console.log(`ratio  ready, loaded worker / plain modules: ${(loaded.readyMs / baseline.readyMs).toFixed(2)}`);
  console.log(`worker ready ${loaded.readyMs.toFixed(0).padStart(5)} ms   goal <= 200 ms: ${loaded.readyMs <= 200 ? 'meets goal' : 'MISSES goal'}  (ready and first document: ${(loaded.readyMs + loaded.firstMs).toFixed(0)} ms)`);
  rmSync(folder, { recursive: true, force: true });
}

await main();
