import { fileURLToPath } from 'node:url';
import { readFileSync } from 'node:fs';
import { runCli, type CliIo } from '../../src/cli/program.js';

/** Absolute path of a file under tests/fixtures/ (inside the repository). */
export function fixturePath(relative: string): string {
  return fileURLToPath(new URL(`../fixtures/${relative}`, import.meta.url));
}

export function loadJson<T>(relative: string): T {
  return JSON.parse(readFileSync(fixturePath(relative), 'utf8')) as T;
}

/** |a - b| / |b| (|a| when b is 0). */
export function relErr(a: number, b: number): number {
  if (b === 0) return Math.abs(a);
  return Math.abs(a - b) / Math.abs(b);
}

/** Number of agreeing significant digits, -log10(relative error) (capped at 17). */
export function agreeingDigits(a: number, b: number): number {
  const e = relErr(a, b);
  return e === 0 ? 17 : Math.min(17, -Math.log10(e));
}

/** Runs the command line in this process (as the built command runs it) and collects what it writes. */
export async function runRefitInProcess(argv: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const io: CliIo = { stdout: (t) => (out += t), stderr: (t) => (err += t), readStdin: async () => '', color: false };
  const code = await runCli(argv, io);
  return { code, out, err };
}
