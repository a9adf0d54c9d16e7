import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Report } from '../../src/report/model.js';
import { readJsonReport } from '../../src/report/jsonLayoutSchema.js';

/**
 * Runs the built command (`npm test` builds first) in its own process, as a
 * user runs it: worker threads are real threads, and the exit code and
 * standard error are what a user sees.
 */
export const bin = join(process.cwd(), 'dist', 'src', 'cli', 'main.js');

export interface Run {
  status: number | null;
  stdout: string;
  stderr: string;
}

export function builtCliExists(): boolean {
  return existsSync(bin);
}

/** `plumbline <args>` in `cwd`; `nodeOptions` go before the script (e.g. --import of a preload). */
export function plumbline(args: readonly string[], cwd: string, options: { nodeOptions?: string[]; env?: NodeJS.ProcessEnv } = {}): Run {
  const result = spawnSync('node', [...(options.nodeOptions ?? []), bin, ...args], {
    cwd,
    encoding: 'utf8',
    env: { ...process.env, NO_COLOR: '1', ...options.env },
    timeout: 60_000,
  });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

export function temporaryFolder(prefix: string): string {
  return mkdtempSync(join(tmpdir(), `plumbline-${prefix}-`));
}

export function reportOf(run: Run): Report {
  return readJsonReport(run.stdout);
}

/** The documents' paths and statuses, in report order. */
export function pathsOf(run: Run): [string, string][] {
  return reportOf(run).documents.map((document) => [document.path, document.status]);
}

/**
 * A runner of the command that also measures it: how long each run took and its peak memory in MB (the
 * process's maxRSS, worker threads included, written at exit by a module loaded first with node --import).
 */
export function peakMemoryRunner(folder: string): (args: string[]) => Run & { seconds: number; peakMb: number } {
  const peakMemoryFile = join(folder, 'peak-rss.txt');
  const preload = join(folder, 'peak-rss.mjs');
  writeFileSync(preload, `import { writeFileSync } from 'node:fs';\nprocess.on('exit', () => writeFileSync(${JSON.stringify(peakMemoryFile)}, String(process.resourceUsage().maxRSS)));\n`);
  return (args) => {
    rmSync(peakMemoryFile, { force: true });
    const started = Date.now();
    const run = plumbline(args, folder, { nodeOptions: ['--import', `file://${preload}`] });
    const seconds = (Date.now() - started) / 1000;
    const peakMb = Number(readFileSync(peakMemoryFile, 'utf8')) / 1024;
    return { ...run, seconds, peakMb };
  };
}
