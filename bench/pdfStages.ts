/**
 * Where the time of a result-dense PDF goes, stage by stage (issue 16), for
 * the corpus benchmark's dense PDFs: each PDF read as the pdftotext engine
 * reads it, in this process and on one thread, after a warm-up round, with
 * every stage timed apart (best of ROUNDS rounds over all the PDFs):
 *
 *   - the text run (`pdftotext -raw`), as the baseline runs it;
 *   - the word-box run (`pdftotext -raw -bbox`) over the pages from the first
 *     to the last that may hold a table, as the reader runs it;
 *   - tying the words to the text (BboxWordLocator, fed the run's output);
 *   - the pages composed with their rebuilt tables (composePages, pdfDocument);
 *   - scan (scanDocument) and checks (checkResults).
 *
 * The two runs are timed as the wall time of spawnSync (the child's work and
 * its start); the rest is this thread's time. No goal: the figures say where
 * a cold audit's time goes, beside the baseline's own run.
 */
import { spawnSync } from 'node:child_process';
import { resolveConfig } from '../src/checks/config.js';
import { checkResults } from '../src/checks/engine.js';
import { mayHoldTable } from '../src/documents/pdfCompose.js';
import { composePages, pdfDocument } from '../src/documents/pdfPages.js';
import { BboxWordLocator } from '../src/documents/pdfWords.js';
import { scanDocument } from '../src/scan/scanDocument.js';

const ROUNDS = 3;
const ENCODING = ['-enc', 'UTF-8', '-eol', 'unix'];

type Stage = 'text run' | 'word-box run' | 'tie words' | 'compose pages' | 'scan' | 'check';
const STAGES: Stage[] = ['text run', 'word-box run', 'tie words', 'compose pages', 'scan', 'check'];

function timed<T>(totals: Map<Stage, number>, stage: Stage, work: () => T): T {
  const start = process.hrtime.bigint();
  const result = work();
  totals.set(stage, (totals.get(stage) ?? 0) + Number(process.hrtime.bigint() - start) / 1e6);
  return result;
}

function readOne(path: string, totals: Map<Stage, number>): number {
  const text = timed(totals, 'text run', () => spawnSync('pdftotext', ['-raw', ...ENCODING, path, '-'], { encoding: 'utf8', maxBuffer: 1 << 28 }).stdout);
  const pages = text.split('\f');
  if (pages.length > 1 && pages[pages.length - 1]!.trim() === '') pages.pop();
  const mayHold = pages.map(mayHoldTable);
  const first = mayHold.indexOf(true);
  const last = mayHold.lastIndexOf(true);
  let words: ReturnType<BboxWordLocator['finish']> = pages.map(() => null);
  if (first !== -1) {
    const boxes = timed(totals, 'word-box run', () => spawnSync('pdftotext', ['-raw', '-bbox', ...ENCODING, '-f', String(first + 1), '-l', String(last + 1), path, '-'], { maxBuffer: 1 << 28 }).stdout);
    const located = timed(totals, 'tie words', () => {
      const locator = new BboxWordLocator(pages.slice(first, last + 1));
      locator.push(boxes);
      return locator.finish();
    });
    words = pages.map((_, index) => located[index - first] ?? null);
  }
  const document = timed(totals, 'compose pages', () => pdfDocument(path, composePages(pages, words)));
  const scan = timed(totals, 'scan', () => scanDocument(document));
  timed(totals, 'check', () => checkResults(document.text, scan, resolveConfig({})));
  return scan.results.length;
}

/** Prints each stage's time per PDF (best of ROUNDS after a warm-up), and the first, cold round's. */
export function printPdfStages(pdfs: readonly string[]): void {
  const rounds: Map<Stage, number>[] = [];
  let results = 0;
  for (let round = 0; round <= ROUNDS; round++) {
    const totals = new Map<Stage, number>();
    results = 0;
    for (const pdf of pdfs) results += readOne(pdf, totals);
    rounds.push(totals);
  }
  const [cold, ...warm] = rounds;
  console.log(`\nstages of the pdftotext reader, ${pdfs.length} result-dense PDFs (${results} results), ms per PDF on one thread: best of ${ROUNDS} warm rounds (first, cold round)`);
  for (const stage of STAGES) {
    const best = Math.min(...warm.map((totals) => totals.get(stage) ?? 0)) / pdfs.length;
    console.log(`  ${stage.padEnd(14)} ${best.toFixed(1).padStart(7)} ms  (cold ${((cold!.get(stage) ?? 0) / pdfs.length).toFixed(1)} ms)`);
  }
}
