/**
 * PDF reading speed: pages per second for each engine of the PDF reader on
 * corpus-demo's PDFs, each as a ratio to `pdftotext` alone (spawned, output
 * discarded) on the same files in the same run.
 *
 *   npx tsc -p tsconfig.json && node dist/bench/documents.js [rounds]
 *
 * Each measurement reads every demo PDF `rounds` times (default 20) after
 * one warm-up round. The reader's time includes what it adds to an engine:
 * reading the file, checking it, de-hyphenating, page offsets and the
 * reference-list search. Without pdftotext on PATH only pdf-parse is timed
 * and no ratio can be given.
 */

import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { findPdftotext, type PdfEngine } from '../src/documents/pdf.js';
import { readDocument } from '../src/documents/read.js';

const DEFAULT_ROUNDS = 20;

/** corpus-demo/ from dist/bench/ or bench/. */
function demoDirectory(): string {
  const here = dirname(fileURLToPath(import.meta.url));
  const fromDist = resolve(here, '..', '..', 'corpus-demo');
  const fromSource = resolve(here, '..', 'corpus-demo');
  return existsSync(fromDist) ? fromDist : fromSource;
}

interface Measurement {
  pages: number;
  seconds: number;
}

async function timeEngine(files: readonly string[], engine: PdfEngine, rounds: number): Promise<Measurement> {
  const readAll = async (): Promise<number> => {
    let pages = 0;
    for (const file of files) {
      const outcome = await readDocument(file, { pdfEngine: engine });
      if (!outcome.ok) throw new Error(`${file}: ${outcome.error}`);
      pages += outcome.document.text.split('\f').length - 1;
    }
    return pages;
  };
  await readAll();
  const start = process.hrtime.bigint();
  let pages = 0;
  for (let round = 0; round < rounds; round += 1) pages += await readAll();
  return { pages, seconds: Number(process.hrtime.bigint() - start) / 1e9 };
}

function timePdftotextAlone(executable: string, files: readonly string[], rounds: number): Measurement {
  const runAll = (): number => {
    let pages = 0;
    for (const file of files) {
      const run = spawnSync(executable, ['-raw', '-enc', 'UTF-8', file, '-'], { encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
      if (run.status !== 0) throw new Error(`pdftotext failed on ${file}`);
      pages += run.stdout.split('\f').length - 1;
    }
    return pages;
  };
  runAll();
  const start = process.hrtime.bigint();
  let pages = 0;
  for (let round = 0; round < rounds; round += 1) pages += runAll();
  return { pages, seconds: Number(process.hrtime.bigint() - start) / 1e9 };
}

const rate = (measurement: Measurement): number => measurement.pages / measurement.seconds;

async function main(): Promise<void> {
  const rounds = Number(process.argv[2] ?? DEFAULT_ROUNDS);
  const directory = demoDirectory();
  const files = readdirSync(directory).filter((name) => name.endsWith('.pdf')).sort().map((name) => join(directory, name));
  if (files.length === 0) throw new Error(`no PDFs in ${directory}`);
  console.log(`PDF reading: ${files.length} demo PDFs from ${directory}, ${rounds} rounds each`);
  const executable = findPdftotext();
  const baseline = executable ? timePdftotextAlone(executable, files, rounds) : null;
  if (baseline) console.log(`  pdftotext alone (spawned):      ${rate(baseline).toFixed(1).padStart(8)} pages/s   (baseline)`);
  else console.log('  pdftotext is not on PATH: no baseline, only pdf-parse is timed');
  const engines: PdfEngine[] = executable ? ['pdftotext', 'pdf-parse'] : ['pdf-parse'];
  for (const engine of engines) {
    const measurement = await timeEngine(files, engine, rounds);
    const ratio = baseline ? `   ratio to baseline ${(rate(measurement) / rate(baseline)).toFixed(2)}` : '';
    console.log(`  reader with ${engine.padEnd(10)}         ${rate(measurement).toFixed(1).padStart(8)} pages/s${ratio}`);
  }
}

await main();
