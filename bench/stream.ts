/**
 * Memory of the streamed audit of large text files: peak resident memory
 * (RSS) while auditing generated text files of growing size, beside the
 * file size. Streaming keeps the peak roughly flat as the file grows; a
 * whole read would need about three times the file size (the bytes, the
 * string, the scanner's normalised copy), and cannot hold 1 GB at all.
 *
 *   npx tsc -p tsconfig.json && node dist/bench/stream.js [largest MB]
 *
 * Sizes: 64, 256 and 1024 MB by default (the largest can be changed). The
 * files are written to a temporary folder and removed afterwards. Each is
 * prose with a result about every 10 KB, so the results themselves (which
 * the audit keeps) stay small beside the text.
 */

import { mkdtempSync, openSync, closeSync, rmSync, writeSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { auditTextStream } from '../src/batch/auditFile.js';
import { resolveConfig } from '../src/checks/config.js';

const largest = Number(process.argv[2] ?? 1024);
const sizes = [64, 256, 1024].filter((size) => size <= largest);
if (!sizes.includes(largest)) sizes.push(largest);

const paragraph = `${'The participants read short passages and answered questions about them. '.repeat(136)}\nRecall improved, F(2, 57) = 4.21, p = .020, ηp2 = .13.\n`;

function writeFile(path: string, megabytes: number): void {
  const chunk = Buffer.from(paragraph.repeat(Math.ceil(1_000_000 / paragraph.length)));
  const fd = openSync(path, 'w');
  for (let written = 0; written < megabytes * 1_000_000; written += chunk.length) writeSync(fd, chunk);
  closeSync(fd);
}

const folder = mkdtempSync(join(tmpdir(), 'plumbline-bench-stream-'));
const config = resolveConfig({});
try {
  console.log('file MB   results   seconds   peak RSS MB   RSS before MB');
  for (const size of sizes) {
    const path = join(folder, `text-${size}.txt`);
    writeFile(path, size);
    global.gc?.();
    const before = process.memoryUsage().rss;
    let peak = before;
    const timer = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 20);
    const started = process.hrtime.bigint();
    const output = await auditTextStream(path, 'text', config);
    const seconds = Number(process.hrtime.bigint() - started) / 1e9;
    clearInterval(timer);
    peak = Math.max(peak, process.memoryUsage().rss);
    console.log(
      `${String(size).padStart(7)}   ${String(output.statistics.length).padStart(7)}   ${seconds.toFixed(1).padStart(7)}   ${(peak / 1e6).toFixed(0).padStart(11)}   ${(before / 1e6).toFixed(0).padStart(13)}`,
    );
    rmSync(path);
  }
} finally {
  rmSync(folder, { recursive: true, force: true });
}
