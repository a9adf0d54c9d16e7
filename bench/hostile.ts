/**
 * Peak memory of auditing hostile documents (tests/fixtures/hostile/makeHostile.ts:
 * zips whose end record lies about its entry count, bytes before the first
 * entry, a directory that cannot be walked, millions of tiny XML elements,
 * a PDF page of 4,000 MiB of compressed spaces), each in a child process
 * running the built command as a user runs it:
 *
 *   plumbline scan <file> --format json --no-cache -q --jobs 1
 *
 * beside the same measurement of auditing a normal demo document, the named
 * baseline (corpus-demo/gravel-path-wayfinding.docx). The goal for every
 * case is a peak under 1 GB (10^9 bytes); before the bounded readers these
 * files took 1.7 to 6.3 GB.
 *
 * Below the hostile cases, files just inside the default limits
 * (`atLimitCases`: the most XML nodes, the largest part, the largest PDF
 * stream), which are read rather than refused: what the limits let through.
 *
 *   npx tsc -p tsconfig.json && node dist/bench/hostile.js
 *
 * Peak memory is the process's maximum resident set size: from GNU time
 * (`/usr/bin/time -f %M`, which also covers a pdftotext child) when it is
 * installed, else from the command's own process.resourceUsage().maxRSS at
 * exit (a preload, node --import; worker threads included, child processes
 * not). The PDF is audited with each engine; a row audits every hostile
 * file at once with --jobs 2.
 *
 * Then the hostile inputs that are not payloads (`writeHostileInputs`: a
 * FIFO and a link to /dev/zero named like papers, a paper whose name and
 * text carry escape sequences, a list file of 150,000 entries, named as
 * @list), each alone with --jobs 1 and all at once with --jobs 2.
 */

import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ESCAPES_NAME, LIST_NAME, writeAtLimitFiles, writeHostileFiles, writeHostileInputs } from '../tests/fixtures/hostile/makeHostile.js';

const GOAL_MB = 1000;
const GNU_TIME = '/usr/bin/time';

/** A folder of the repository, from dist/bench/ or bench/. */
function repositoryFolder(...parts: string[]): string {
  const here = dirname(fileURLToPath(import.meta.url));
  const fromDist = resolve(here, '..', '..', ...parts);
  return existsSync(fromDist) ? fromDist : resolve(here, '..', ...parts);
}

const cli = repositoryFolder('dist', 'src', 'cli', 'main.js');
const baseline = repositoryFolder('corpus-demo', 'gravel-path-wayfinding.docx');
const folder = mkdtempSync(join(tmpdir(), 'plumbline-bench-hostile-'));
const preload = join(folder, 'peak-rss.mjs');
const peakFile = join(folder, 'peak-rss.txt');
writeFileSync(preload, `import { writeFileSync } from 'node:fs';\nprocess.on('exit', () => writeFileSync(${JSON.stringify(peakFile)}, String(process.resourceUsage().maxRSS)));\n`);

/** Whether GNU time runs here and writes the peak in KiB with -f %M -o <file>. */
function gnuTimeWorks(): boolean {
  if (!existsSync(GNU_TIME)) return false;
  const probe = spawnSync(GNU_TIME, ['-f', '%M', '-o', peakFile, process.execPath, '-e', '0']);
  return probe.status === 0 && /^\d+\s*$/.test(readFileSync(peakFile, 'utf8').trim().split('\n').pop() ?? '');
}
const withGnuTime = gnuTimeWorks();

interface Measured {
  peakMb: number;
  seconds: number;
  status: number | null;
  /** Each document's reason when unreadable, or its status. */
  outcomes: string[];
}

function audit(paths: string[], extra: string[] = []): Measured {
  rmSync(peakFile, { force: true });
  const args = [cli, 'scan', ...paths, '--format', 'json', '--no-cache', '-q', '--jobs', '1', '--fail-on', 'never', ...extra];
  const started = process.hrtime.bigint();
  const run = withGnuTime
    ? spawnSync(GNU_TIME, ['-f', '%M', '-o', peakFile, process.execPath, ...args], { encoding: 'utf8', maxBuffer: 1 << 28 })
    : spawnSync(process.execPath, ['--import', `file://${preload}`, ...args], { encoding: 'utf8', maxBuffer: 1 << 28 });
  const seconds = Number(process.hrtime.bigint() - started) / 1e9;
  const kib = Number(readFileSync(peakFile, 'utf8').trim().split('\n').pop());
  let outcomes: string[] = [];
  try {
    const report = JSON.parse(run.stdout) as { documents: { status: string; error?: string }[] };
    outcomes = report.documents.map((document) => document.error ?? document.status);
  } catch {
    outcomes = [`no report (exit ${run.status}): ${run.stderr.trim().split('\n').pop() ?? ''}`];
  }
  return { peakMb: (kib * 1024) / 1e6, seconds, status: run.status, outcomes };
}

function row(name: string, measured: Measured, base: number): string {
  const verdict = measured.peakMb < GOAL_MB ? 'yes' : 'NO';
  const reason = measured.outcomes.length === 1 ? measured.outcomes[0]! : `${measured.outcomes.length} documents`;
  return `${name.padEnd(38)} ${measured.peakMb.toFixed(0).padStart(8)} ${(measured.peakMb / base).toFixed(2).padStart(11)} ${measured.seconds.toFixed(1).padStart(8)}   ${verdict.padEnd(11)} ${reason.slice(0, 70)}`;
}

let failures = 0;
try {
  if (!existsSync(cli)) throw new Error(`${cli} is missing: run npm run build first`);
  const cases = await writeHostileFiles(join(folder, 'files'));
  console.log(`peak memory: ${withGnuTime ? 'GNU time (%M), the command and its child processes' : 'process.resourceUsage().maxRSS of the command (child processes not counted)'}`);
  console.log(`${'case'.padEnd(38)} ${'peak MB'.padStart(8)} ${'x baseline'.padStart(11)} ${'seconds'.padStart(8)}   ${'< 1 GB'.padEnd(11)} outcome`);
  const base = audit([baseline]);
  console.log(row('baseline: gravel-path-wayfinding.docx', base, base.peakMb));
  for (const hostile of cases) {
    const engines = hostile.name.endsWith('.pdf') ? [['pdftotext', '--pdf-engine', 'pdftotext'], ['pdf-parse', '--pdf-engine', 'pdf-parse']] : [[null]];
    for (const [engine, ...options] of engines) {
      const measured = audit([hostile.path], options as string[]);
      if (measured.peakMb >= GOAL_MB) failures += 1;
      console.log(row(engine ? `${hostile.name} (${engine})` : hostile.name, measured, base.peakMb));
    }
  }
  for (const atLimit of await writeAtLimitFiles(join(folder, 'at-limit'))) {
    const engines = atLimit.name.endsWith('.pdf') ? [['pdftotext', '--pdf-engine', 'pdftotext'], ['pdf-parse', '--pdf-engine', 'pdf-parse']] : [[null]];
    for (const [engine, ...options] of engines) {
      const measured = audit([atLimit.path], options as string[]);
      if (measured.peakMb >= GOAL_MB) failures += 1;
      console.log(row(engine ? `${atLimit.name} (${engine})` : atLimit.name, measured, base.peakMb));
    }
  }
  const all = audit(
    cases.map((hostile) => hostile.path),
    ['--jobs', '2'],
  );
  if (all.peakMb >= GOAL_MB) failures += 1;
  console.log(row('all of them, --jobs 2', all, base.peakMb));
  const inputs = writeHostileInputs(join(folder, 'inputs'));
  for (const name of inputs.notMade) console.log(`${name.padEnd(38)} not made on this platform: not measured`);
  // The escapes paper's name would act on this terminal: it is shown by what it is.
  const label = (name: string) => (name === ESCAPES_NAME ? 'paper named with escape sequences' : name === LIST_NAME ? `@${LIST_NAME}` : name);
  const argument = (input: { name: string; path: string }) => (input.name === LIST_NAME ? `@${input.path}` : input.path);
  for (const input of inputs.written) {
    const measured = audit([argument(input)]);
    if (measured.peakMb >= GOAL_MB) failures += 1;
    console.log(row(label(input.name), measured, base.peakMb));
  }
  const allInputs = audit(inputs.written.map(argument), ['--jobs', '2']);
  if (allInputs.peakMb >= GOAL_MB) failures += 1;
  console.log(row('all the inputs, --jobs 2', allInputs, base.peakMb));
  console.log(`\n${failures === 0 ? 'every case' : `${failures} case(s) NOT`} under the goal of ${GOAL_MB} MB`);
} finally {
  rmSync(folder, { recursive: true, force: true });
}
process.exitCode = failures > 0 ? 1 : 0;
