import { spawn } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { bin, builtCliExists, pathsOf, plumbline, reportOf, temporaryFolder, type Run } from './cli.js';

const consistent = 'Dose affected recall, F(2, 57) = 4.21, p = .020, ηp2 = .13.\n'; // p = .0197 (SciPy 1.10.1 scipy.stats.f.sf)
const inconsistent = 'Age did not, F(1, 44) = 4.21, p = .31.\n'; // p = .046 (SciPy 1.10.1 scipy.stats.f.sf)

/** `copies` files with one content (the same paper downloaded again and again) and two others. */
function duplicates(copies: number): string {
  const dir = temporaryFolder('duplicates');
  mkdirSync(join(dir, 'papers'));
  for (let i = 0; i < copies; i += 1) writeFileSync(join(dir, 'papers', `copy-${String(i).padStart(2, '0')}.txt`), consistent);
  writeFileSync(join(dir, 'papers', 'other.md'), inconsistent);
  writeFileSync(join(dir, 'papers', 'empty.txt'), '');
  return dir;
}

/** Every file in a folder and its subfolders. */
function filesUnder(dir: string): string[] {
  if (!existsSync(dir)) return [];
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => (entry.isDirectory() ? filesUnder(join(dir, entry.name)) : [join(dir, entry.name)]));
}

/** The audit entries of a cache folder (not its indexes). */
const entriesOf = (cache: string): string[] => filesUnder(cache).filter((file) => !file.includes('index-') && file.endsWith('.json'));

const json = ['--format', 'json', '--fail-on', 'never'];

/** The same scan as a separate process, started without waiting for it. */
function scanInBackground(args: string[], cwd: string): Promise<Run> {
  return new Promise((resolve) => {
    const child = spawn('node', [bin, 'scan', ...args], { cwd });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (chunk: Buffer) => (stdout += chunk.toString()));
    child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
    child.on('close', (status) => resolve({ status, stdout, stderr }));
  });
}

describe('the cache under concurrency', () => {
  expect(builtCliExists(), 'run npm run build first').toBe(true);

  it('identical files audited at once on several threads never crash the audit (they share one entry)', () => {
    // Before: both workers wrote "<entry>.json.<pid>.tmp" and the second rename failed, exit 70, no report.
    for (let attempt = 0; attempt < 3; attempt += 1) {
      const dir = duplicates(40);
      const run = plumbline(['scan', 'papers', '--jobs', '4', '--cache-dir', 'cache', ...json], dir);
      expect(run.stderr).toBe('');
      expect(run.status).toBe(0);
      expect(reportOf(run).documents).toHaveLength(42);
      expect(entriesOf(join(dir, 'cache'))).toHaveLength(3); // one audit per content: the copies, other.md, the empty file
      expect(filesUnder(join(dir, 'cache')).filter((file) => file.endsWith('.tmp'))).toEqual([]);
    }
  });

  it('several runs sharing one cache folder at once all finish with the report an uncached run gives', async () => {
    const dir = duplicates(20);
    const uncached = plumbline(['scan', 'papers', '--no-cache', '--jobs', '1', ...json], dir);
    const runs = await Promise.all([1, 2, 3, 4].map((jobs) => scanInBackground(['papers', '--jobs', String(jobs), '--cache-dir', 'cache', ...json], dir)));
    for (const run of runs) {
      expect(run.stderr).toBe('');
      expect(run.status).toBe(0);
      expect(reportOf(run).documents).toEqual(reportOf(uncached).documents);
    }
    // And what they stored is used afterwards, byte for byte.
    expect(plumbline(['scan', 'papers', '--cache-dir', 'cache', ...json], dir).stdout).toBe(runs[0]!.stdout);
  });
});

describe('the cache key', () => {
  it('includes the format: the same bytes as .txt, .md and .html are three audits', () => {
    // Found by tests/property/batch.property.test.ts: a .txt copy of a .md file took its audit, format and all.
    const dir = temporaryFolder('formats');
    mkdirSync(join(dir, 'papers'));
    const bytes = '<p>Groups differed, t(38) = 2.10, p = .042.</p>\n'; // p = .0423 (SciPy 1.10.1 scipy.stats.t.sf, two-sided)
    for (const name of ['a.md', 'b.txt', 'c.html']) writeFileSync(join(dir, 'papers', name), bytes);
    const uncached = plumbline(['scan', 'papers', '--no-cache', ...json], dir);
    expect(reportOf(uncached).documents.map((d) => d.format)).toEqual(['markdown', 'text', 'html']);
    for (const jobs of ['1', '3']) {
      const run = plumbline(['scan', 'papers', '--jobs', jobs, '--cache-dir', 'cache', ...json], dir);
      expect(reportOf(run).documents, `--jobs ${jobs}`).toEqual(reportOf(uncached).documents);
    }
  });
});

describe('cache entries are checked before use', () => {
  it('an entry changed in place (same length, other bytes) is a miss, and is rewritten', () => {
    const dir = duplicates(1);
    const cold = plumbline(['scan', 'papers', '--cache-dir', 'cache', ...json], dir);
    for (const entry of entriesOf(join(dir, 'cache'))) {
      const text = readFileSync(entry, 'utf8');
      // The recomputed p of every result in the body, changed digit for digit: the length stays the same.
      writeFileSync(entry, text.replace(/("p":0\.0)(\d)/g, (_, head: string, digit: string) => `${head}${(Number(digit) + 5) % 10}`));
    }
    expect(entriesOf(join(dir, 'cache')).some((entry) => readFileSync(entry, 'utf8').includes('"p":0.0'))).toBe(true);
    for (const format of ['json', 'text', 'csv']) {
      const again = plumbline(['scan', 'papers', '--cache-dir', 'cache', '--format', format, '--fail-on', 'never'], dir);
      const uncached = plumbline(['scan', 'papers', '--no-cache', '--format', format, '--fail-on', 'never'], dir);
      expect(again.stdout, format).toBe(format === 'json' ? cold.stdout : uncached.stdout);
    }
  });

  it('a forged entry (its hash made to match) never reaches a report that parses the audits, and is rewritten', () => {
    const dir = duplicates(1);
    const cold = plumbline(['scan', 'papers', '--cache-dir', 'cache', ...json], dir);
    for (const entry of entriesOf(join(dir, 'cache'))) {
      const stored = readFileSync(entry, 'utf8');
      const newline = stored.indexOf('\n');
      const header = JSON.parse(stored.slice(0, newline)) as { bodyBytes: number; bodySha256: string };
      // Markup where the report expects a number, and a severity the report does not know.
      const body = stored
        .slice(newline + 1)
        .replace(/"line":\d+/g, '"line":"<img src=x onerror=alert(1)>"')
        .replace(/"severity":"fail"/g, '"severity":"<b>fail</b>"');
      const bytes = Buffer.from(body, 'utf8');
      header.bodyBytes = bytes.length;
      header.bodySha256 = createHash('sha256').update(bytes).digest('hex');
      writeFileSync(entry, `${JSON.stringify(header)}\n${body}`);
    }
    const html = plumbline(['scan', 'papers', '--cache-dir', 'cache', '--format', 'html', '--fail-on', 'never'], dir);
    expect(html.status).toBe(0);
    expect(html.stdout).not.toContain('<img src=x');
    expect(html.stdout).not.toContain('<b>fail</b>');
    expect(html.stdout).toBe(plumbline(['scan', 'papers', '--no-cache', '--format', 'html', '--fail-on', 'never'], dir).stdout);
    // The HTML run audited those documents again and stored good entries in their place.
    expect(plumbline(['scan', 'papers', '--cache-dir', 'cache', ...json], dir).stdout).toBe(cold.stdout);
  });

  it('an index that names a key outside the cache folder is ignored, and nothing is written outside', () => {
    const dir = duplicates(1);
    // Deep enough that the key's climb ('<cache>/../../../escaped.json') still lands inside the test's folder.
    const cache = 'cache/a/b/c';
    plumbline(['scan', 'papers', '--cache-dir', cache, ...json], dir);
    const [index] = filesUnder(join(dir, cache)).filter((file) => file.includes('index-'));
    const entries = JSON.parse(readFileSync(index!, 'utf8')) as Record<string, { key: string }>;
    expect(Object.keys(entries)).toHaveLength(3);
    for (const path of Object.keys(entries)) entries[path]!.key = '../../escaped';
    writeFileSync(index!, JSON.stringify(entries));
    const run = plumbline(['scan', 'papers', '--cache-dir', cache, ...json], dir);
    expect(run.status).toBe(0);
    expect(pathsOf(run)).toHaveLength(3);
    expect(filesUnder(dir).filter((file) => file.includes('escaped'))).toEqual([]);
  });
});

describe('a cache folder that cannot be written', () => {
  const expectOneWarning = (run: Run): void => {
    const warnings = run.stderr.split('\n').filter((line) => line.includes('cannot write to the cache folder'));
    expect(warnings, run.stderr).toHaveLength(1);
    expect(run.stderr).not.toMatch(/unexpected error|\n\s+at /);
  };

  it('is a file: the audit goes on without the cache, with one warning', () => {
    const dir = duplicates(12);
    writeFileSync(join(dir, 'cache'), 'not a folder');
    const uncached = plumbline(['scan', 'papers', '--no-cache', ...json], dir);
    for (const jobs of ['1', '3']) {
      const run = plumbline(['scan', 'papers', '--jobs', jobs, '--cache-dir', 'cache', ...json], dir);
      expect(run.status).toBe(0);
      expectOneWarning(run);
      expect(reportOf(run).documents).toEqual(reportOf(uncached).documents);
    }
    expect(readFileSync(join(dir, 'cache'), 'utf8')).toBe('not a folder');
  });

  it('is inside a file, or has a file where an entry\'s subfolder goes: one warning, a full report', () => {
    const dir = duplicates(3);
    writeFileSync(join(dir, 'file'), '');
    expectOneWarning(plumbline(['scan', 'papers', '--cache-dir', 'file/cache', ...json], dir));
    // The index can be written, the entries cannot: their two-character subfolders are files.
    mkdirSync(join(dir, 'cache'));
    for (let i = 0; i < 256; i += 1) writeFileSync(join(dir, 'cache', i.toString(16).padStart(2, '0')), '');
    const run = plumbline(['scan', 'papers', '--jobs', '2', '--cache-dir', 'cache', '--format', 'text', '--fail-on', 'never'], dir);
    expect(run.status).toBe(0);
    expectOneWarning(run);
    expect(run.stdout).toContain('p-value-mismatch');
  });

  it.skipIf(process.getuid?.() === 0)('is not writable (not testable as root, who may write anywhere)', async () => {
    const { chmodSync } = await import('node:fs');
    const dir = duplicates(3);
    mkdirSync(join(dir, 'cache'));
    chmodSync(join(dir, 'cache'), 0o555);
    const run = plumbline(['scan', 'papers', '--cache-dir', 'cache', ...json], dir);
    expect(run.status).toBe(0);
    expectOneWarning(run);
  });
});
