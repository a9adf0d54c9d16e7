import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { builtCliExists, pathsOf, plumbline, reportOf, temporaryFolder } from './cli.js';

/**
 * Faults are put into the built command from outside, by a module loaded
 * before it (node --import): plumbline has no switch for them. Worker
 * threads inherit the option, so the faults reach them too.
 */
function preload(dir: string, name: string, source: string): string[] {
  const file = join(dir, name);
  writeFileSync(file, source);
  return ['--import', `file://${file}`];
}

/**
 * A bug in plumbline that strikes one document: the audit of any document
 * printing "F(9, 99)" cannot be turned into JSON (JSON.stringify is replaced
 * by one that throws for it), after the reader and the checks have run.
 */
const faultInOneDocument = `
const original = JSON.stringify;
JSON.stringify = function (value, ...rest) {
  if (value && typeof value === 'object' && Array.isArray(value.results) && value.results.some((r) => String(r.printed.text).includes('F(9, 99)'))) {
    throw new TypeError('fault injected by the test');
  }
  return original.call(this, value, ...rest);
};
`;

function papers(): string {
  const dir = temporaryFolder('faults');
  mkdirSync(join(dir, 'papers'));
  for (let i = 0; i < 5; i += 1) writeFileSync(join(dir, 'papers', `paper-${i}.txt`), `Dose affected recall, F(2, 57) = 4.21, p = .020.\n`); // p = .0197 (SciPy 1.10.1)
  writeFileSync(join(dir, 'papers', 'struck.txt'), 'Dose affected recall, F(9, 99) = 2.50, p = .013.\n');
  return dir;
}

describe('an unexpected error in one document', () => {
  expect(builtCliExists(), 'run npm run build first').toBe(true);

  it('becomes that document\'s row with the reason, and the audit ends with its report', () => {
    const dir = papers();
    const nodeOptions = preload(dir, 'fault.mjs', faultInOneDocument);
    // In this thread (--jobs 1) and on worker threads, with the cache and without.
    for (const args of [['--jobs', '1', '--no-cache'], ['--jobs', '3', '--no-cache'], ['--jobs', '1'], ['--jobs', '2']]) {
      const run = plumbline(['scan', 'papers', ...args, '--format', 'json'], dir, { nodeOptions });
      const label = args.join(' ');
      expect(run.status, `${label}: ${run.stderr}`).toBe(2); // a document could not be audited
      expect(run.stderr, label).toBe('');
      expect(pathsOf(run), label).toEqual([...Array.from({ length: 5 }, (_, i) => [`papers/paper-${i}.txt`, 'checked']), ['papers/struck.txt', 'unreadable']]);
      const struck = reportOf(run).documents.find((d) => d.path === 'papers/struck.txt')!;
      expect(struck.error, label).toMatch(/^internal error in plumbline while auditing this document \(TypeError: fault injected by the test\); please report it/);
    }
  });
});

describe('exit code 70 is for a fault in plumbline itself', () => {
  it('a fault outside any document ends the run with 70 and asks the user to report it', () => {
    const dir = papers();
    // The report cannot be written, as a bug in a formatter would have it (not a file system error).
    const nodeOptions = preload(
      dir,
      'fault.mjs',
      `import fs from 'node:fs';
import { syncBuiltinESMExports } from 'node:module';
const original = fs.writeFileSync;
fs.writeFileSync = (file, ...rest) => {
  if (String(file).endsWith('.md')) throw new TypeError('fault injected by the test');
  return original(file, ...rest);
};
syncBuiltinESMExports();
`,
    );
    // (The Markdown summary of a scan is written whole with writeFileSync; the HTML page is written as a stream now.)
    const run = plumbline(['scan', 'papers', '--no-cache', '--format', 'md', '--output', 'audit.md'], dir, { nodeOptions });
    expect(run.status).toBe(70);
    expect(run.stderr).toMatch(/^plumbline: internal error: fault injected by the test\nThis is a fault in plumbline [\d.]+, not in your documents or settings\. Please report it/);
    expect(run.stderr).toContain('TypeError: fault injected by the test\n    at ');
  });

  it('so is an error thrown where nothing awaits it', () => {
    const dir = papers();
    const nodeOptions = preload(
      dir,
      'fault.mjs',
      // Thrown from a timer once the command has started (its handlers are in place), as a reader's callback might.
      `import { isMainThread } from 'node:worker_threads';
if (isMainThread) {
  const begun = Date.now();
  const wait = setInterval(() => {
    if (process.listenerCount('uncaughtException') === 0 && Date.now() - begun < 10_000) return;
    clearInterval(wait);
    throw new RangeError('thrown where nothing awaits it');
  }, 1);
}
`,
    );
    const run = plumbline(['scan', 'papers', '--no-cache', '--format', 'json'], dir, { nodeOptions });
    expect(run.status).toBe(70);
    expect(run.stderr).toMatch(/^plumbline: internal error: thrown where nothing awaits it\nThis is a fault in plumbline/);
  });

  it('a report or JSON Lines file that cannot be written is the user\'s to fix: exit 2, a short message, before the audit', () => {
    const dir = papers();
    for (const [args, message] of [
      [['--output', 'missing/audit.json'], /^plumbline: --output missing\/audit\.json: the folder .*missing does not exist\n$/],
      [['--jsonl', 'missing/audit.jsonl'], /^plumbline: ENOENT: no such file or directory, open 'missing\/audit\.jsonl'\n$/],
    ] as const) {
      const run = plumbline(['scan', 'papers', '--no-cache', ...args], dir);
      expect(run.status, run.stderr).toBe(2);
      expect(run.stderr).toMatch(message);
      expect(run.stdout).toBe('');
    }
  });
});
