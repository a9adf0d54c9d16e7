/**
 * Entry point for bench/refit.ts: fits one model on one file in a fresh
 * process and prints one JSON line with the table, the fit's wall time and
 * the process's peak resident memory.
 *
 * Usage: node dist/src/refit/benchEntry.js <data file> '<analysis description JSON>'
 */
import { fitAnova } from './model.js';

async function main(): Promise<void> {
  const [file, specText] = process.argv.slice(2);
  if (file === undefined || specText === undefined) {
    process.stderr.write('usage: benchEntry <data file> <analysis description JSON>\n');
    process.exitCode = 2;
    return;
  }
  const t0 = performance.now();
  const table = await fitAnova(file, JSON.parse(specText));
  const fitMs = performance.now() - t0;
  const maxRssBytes = process.resourceUsage().maxRSS * 1024;
  process.stdout.write(`${JSON.stringify({ fitMs, maxRssBytes, table })}\n`);
}

main().catch((err: unknown) => {
  process.stderr.write(`${err instanceof Error ? err.message : String(err)}\n`);
  process.exitCode = 1;
});
