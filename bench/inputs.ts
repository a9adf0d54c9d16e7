/**
 * Large inputs, run through the built command as a user runs it:
 *
 * - a folder of 150,000 tiny text documents, and the same documents named
 *   in an @list file (`scan --jobs 1 --no-cache --format jsonl`): wall time
 *   and peak memory, beside a run on 1,500 of them (per-document time and
 *   memory as ratios: near 1 for time means the work grows linearly);
 * - `refit` on an XLSX file of 600,000 rows, refused by its limits before
 *   it is parsed, beside `refit` on the same rows written as CSV (streamed):
 *   the refusal's time and peak memory (goal: well under 1 GB).
 *
 * Peak memory is the child's maxRSS, written at exit by a preloaded module.
 * Everything is made in a temporary folder and removed afterwards.
 *
 * Run: npm run build && node dist/bench/inputs.js [documents]
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { xlsxFile } from '../tests/refit/xlsx.js';

const cli = join(dirname(fileURLToPath(import.meta.url)), '..', 'src', 'cli', 'main.js');

interface Measured {
  seconds: number;
  peakMb: number;
  status: number | null;
  stderr: string;
}

function run(folder: string, args: readonly string[]): Measured {
  const peakFile = join(folder, 'peak-rss.txt');
  const preload = join(folder, 'peak-rss.mjs');
  writeFileSync(preload, `import { writeFileSync } from 'node:fs';\nprocess.on('exit', () => writeFileSync(${JSON.stringify(peakFile)}, String(process.resourceUsage().maxRSS)));\n`);
  rmSync(peakFile, { force: true });
  const started = process.hrtime.bigint();
  const child = spawnSync(process.execPath, ['--import', `file://${preload}`, cli, ...args], {
    cwd: folder,
    encoding: 'utf8',
    maxBuffer: 1 << 30,
    env: { ...process.env, NO_COLOR: '1' },
  });
  const seconds = Number(process.hrtime.bigint() - started) / 1e9;
  let peakMb = NaN;
  try {
    peakMb = Number(readFileSync(peakFile, 'utf8')) / 1024;
  } catch {
    // The child died before its exit handler ran; the status says how.
  }
  return { seconds, peakMb, status: child.status, stderr: child.stderr };
}

function describe(label: string, measured: Measured): string {
  const status = measured.status === 0 || measured.status === 1 ? '' : `, exit ${measured.status}: ${measured.stderr.trim().split('\n')[0]}`;
  return `${label}: ${measured.seconds.toFixed(2)} s, peak ${measured.peakMb.toFixed(0)} MB${status}`;
}

/** A folder of `count` one-line documents and a list file naming each of them. */
function documents(folder: string, name: string, count: number): void {
  const documentsFolder = join(folder, name);
  mkdirSync(documentsFolder);
  const lines: string[] = [];
  for (let index = 0; index < count; index++) {
    const path = join(name, `paper-${index}.txt`);
    // F(1, 20) = 4.35 gives p = .050 (SciPy 1.10.1 f.sf); every tenth paper prints a slip.
    writeFileSync(join(folder, path), `Dose affected recall, F(1, 20) = 4.35, p = ${index % 10 === 0 ? '.005' : '.050'}.\n`);
    lines.push(path);
  }
  writeFileSync(join(folder, `${name}.list`), `${lines.join('\n')}\n`);
}

function scanBench(folder: string, count: number): void {
  const baseCount = Math.max(1, Math.round(count / 100));
  documents(folder, 'base', baseCount);
  documents(folder, 'many', count);
  const scan = (target: string) => run(folder, ['scan', target, '--jobs', '1', '--no-cache', '--format', 'jsonl', '--output', join(folder, 'out.jsonl'), '--quiet']);
  for (const [label, base, large] of [
    ['folder', scan('base'), scan('many')],
    ['@list', scan('@base.list'), scan('@many.list')],
  ] as const) {
    console.log(describe(`scan ${label} of ${baseCount.toLocaleString('en-US')} documents (baseline)`, base));
    console.log(describe(`scan ${label} of ${count.toLocaleString('en-US')} documents`, large));
    const perDocument = large.seconds / count / (base.seconds / baseCount);
    console.log(`  time per document against the baseline: ${perDocument.toFixed(2)}x (1 = linear); peak memory ${(large.peakMb / base.peakMb).toFixed(1)}x for ${(count / baseCount).toFixed(0)}x the documents`);
  }
}

function xlsxBench(folder: string): void {
  const rows = 600_000;
  const cells = (function* () {
    for (let index = 0; index < rows; index++) yield [(index * 7919) % 101, index % 3 === 0 ? 'a' : index % 3 === 1 ? 'b' : 'c', (index * 31) % 97];
  })();
  writeFileSync(join(folder, 'large.xlsx'), xlsxFile(['score', 'group', 'age'], cells, rows, { sharedStrings: true }));
  const csv: string[] = ['score,group,age'];
  for (let index = 0; index < rows; index++) csv.push(`${(index * 7919) % 101},${index % 3 === 0 ? 'a' : index % 3 === 1 ? 'b' : 'c'},${(index * 31) % 97}`);
  writeFileSync(join(folder, 'large.csv'), `${csv.join('\n')}\n`);
  const baseline = run(folder, ['refit', 'large.csv', '--model', 'score ~ group + age']);
  const refused = run(folder, ['refit', 'large.xlsx', '--model', 'score ~ group + age']);
  console.log(describe(`refit of ${rows.toLocaleString('en-US')} rows as CSV (baseline, streamed)`, baseline));
  console.log(describe(`refit of the same rows as XLSX (refused by its limits)`, { ...refused, status: refused.status === 2 ? 0 : refused.status }));
  console.log(`  refusal: ${refused.stderr.trim().split('\n')[0]}`);
  console.log(`  time ${(refused.seconds / baseline.seconds).toFixed(2)}x and peak memory ${(refused.peakMb / baseline.peakMb).toFixed(2)}x the CSV refit's (goal: peak well under 1 GB)`);
}

const count = Number(process.argv[2] ?? 150_000);
const folder = mkdtempSync(join(tmpdir(), 'plumbline-inputs-bench-'));
try {
  scanBench(folder, count);
  xlsxBench(folder);
} finally {
  rmSync(folder, { recursive: true, force: true });
}
