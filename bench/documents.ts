/**
 * PDF reading speed: pages per second of the PDF reader, which rebuilds
 * tables from word positions, for each engine, and of the table rebuilding
 * alone, each as a ratio to `pdftotext -raw` alone (spawned, output
 * discarded) on the same files in the same run.
 *
 *   npx tsc -p tsconfig.json && node dist/bench/documents.js [rounds]
 *
 * The files are corpus-demo's PDFs (manuscripts with an ANOVA table each)
 * and the table fixtures of tests/fixtures/pdf-tables/. Each measurement
 * reads every file `rounds` times (default 20) after one warm-up round. The
 * reader's time includes everything it adds to an engine: reading the file,
 * checking it, the word boxes (a second `pdftotext -raw -bbox` run beside
 * the text run, or pdf.js's text items), tying the words to the text, the
 * table rebuilding, de-hyphenating, page offsets and the reference-list
 * search. "tables alone" times only the rebuilding (src/documents/pdfLayout.ts
 * and the writing of the rows into the text) on words read beforehand.
 * Without pdftotext on PATH only pdf-parse is timed and no ratio can be
 * given.
 */

import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { composePages, findPdftotext, type PdfEngine } from '../src/documents/pdf.js';
import { locateWords, parseBboxPages, type LocatedWord } from '../src/documents/pdfWords.js';
import { readDocument } from '../src/documents/read.js';

const DEFAULT_ROUNDS = 20;

/** A folder of the repository, from dist/bench/ or bench/. */
function repositoryFolder(...parts: string[]): string {
  const here = dirname(fileURLToPath(import.meta.url));
  const fromDist = resolve(here, '..', '..', ...parts);
  return existsSync(fromDist) ? fromDist : resolve(here, '..', ...parts);
}

function pdfsIn(directory: string): string[] {
  return readdirSync(directory).filter((name) => name.endsWith('.pdf')).sort().map((name) => join(directory, name));
}

interface Measurement {
  pages: number;
  seconds: number;
}

function time(rounds: number, once: () => number): Measurement {
  once();
  const start = process.hrtime.bigint();
  let pages = 0;
  for (let round = 0; round < rounds; round += 1) pages += once();
  return { pages, seconds: Number(process.hrtime.bigint() - start) / 1e9 };
}

async function timeAsync(rounds: number, once: () => Promise<number>): Promise<Measurement> {
  await once();
  const start = process.hrtime.bigint();
  let pages = 0;
  for (let round = 0; round < rounds; round += 1) pages += await once();
  return { pages, seconds: Number(process.hrtime.bigint() - start) / 1e9 };
}

async function timeReader(files: readonly string[], engine: PdfEngine, rounds: number): Promise<Measurement> {
  return timeAsync(rounds, async () => {
    let pages = 0;
    for (const file of files) {
      const outcome = await readDocument(file, { pdfEngine: engine });
      if (!outcome.ok) throw new Error(`${file}: ${outcome.error}`);
      pages += outcome.document.text.split('\f').length - 1;
    }
    return pages;
  });
}

function runPdftotext(executable: string, args: string[], file: string): string {
  const run = spawnSync(executable, [...args, '-enc', 'UTF-8', file, '-'], { encoding: 'utf8', maxBuffer: 256 * 1024 * 1024 });
  if (run.status !== 0) throw new Error(`pdftotext failed on ${file}`);
  return run.stdout;
}

function timePdftotextAlone(executable: string, files: readonly string[], rounds: number): Measurement {
  return time(rounds, () => {
    let pages = 0;
    for (const file of files) pages += runPdftotext(executable, ['-raw'], file).split('\f').length - 1;
    return pages;
  });
}

/** The table rebuilding alone, on pages and word boxes read once beforehand with pdftotext. */
function timeTablesAlone(executable: string, files: readonly string[], rounds: number): Measurement {
  const documents = files.map((file) => {
    const pages = runPdftotext(executable, ['-raw'], file).split('\f');
    if (pages.length > 1 && pages[pages.length - 1]!.trim() === '') pages.pop();
    const boxes = parseBboxPages(runPdftotext(executable, ['-raw', '-bbox'], file));
    const words: (LocatedWord[] | null)[] = pages.map((page, index) => locateWords(page, boxes[index] ?? []));
    return { pages, words };
  });
  return time(rounds, () => {
    let pages = 0;
    for (const document of documents) pages += composePages(document.pages, document.words).length;
    return pages;
  });
}

const rate = (measurement: Measurement): number => measurement.pages / measurement.seconds;

async function main(): Promise<void> {
  const rounds = Number(process.argv[2] ?? DEFAULT_ROUNDS);
  const files = [...pdfsIn(repositoryFolder('corpus-demo')), ...pdfsIn(repositoryFolder('tests', 'fixtures', 'pdf-tables'))];
  if (files.length === 0) throw new Error('no PDFs found');
  console.log(`PDF reading: ${files.length} PDFs (corpus-demo and tests/fixtures/pdf-tables), ${rounds} rounds each`);
  const executable = findPdftotext();
  const baseline = executable ? timePdftotextAlone(executable, files, rounds) : null;
  const ratio = (measurement: Measurement): string => (baseline ? `   ratio to baseline ${(rate(measurement) / rate(baseline)).toFixed(2)}` : '');
  if (baseline) console.log(`  pdftotext -raw alone (spawned):            ${rate(baseline).toFixed(1).padStart(9)} pages/s   (baseline)`);
  else console.log('  pdftotext is not on PATH: no baseline, only pdf-parse is timed');
  const engines: PdfEngine[] = executable ? ['pdftotext', 'pdf-parse'] : ['pdf-parse'];
  for (const engine of engines) {
    const measurement = await timeReader(files, engine, rounds);
    console.log(`  reader with word positions, ${engine.padEnd(10)}    ${rate(measurement).toFixed(1).padStart(9)} pages/s${ratio(measurement)}`);
  }
  if (executable) {
    const tables = timeTablesAlone(executable, files, rounds);
    console.log(`  tables alone (layout and writing):         ${rate(tables).toFixed(1).padStart(9)} pages/s${ratio(tables)}`);
  }
}

await main();
