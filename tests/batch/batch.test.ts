import { spawn, spawnSync } from 'node:child_process';
import { appendFileSync, existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { inShard, parseShard } from '../../src/batch/shard.js';
import type { Report } from '../../src/report/model.js';
import { readJsonReport } from '../../src/report/jsonLayoutSchema.js';

// These tests run the built command (`npm test` builds first), so that the
// worker pool runs on real threads as it does for users.
const bin = join('dist', 'src', 'cli', 'main.js');

/** A folder of generated manuscripts; every fifth has an inconsistent p (F(2, 57) = 4.21 gives p = .0197, SciPy 1.10.1). */
function makeCorpus(count: number): string {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-batch-'));
  mkdirSync(join(dir, 'papers', 'nested'), { recursive: true });
  for (let i = 0; i < count; i += 1) {
    const p = i % 5 === 0 ? '.002' : '.020';
    const filler = 'Participants rated each item on a seven-point scale. '.repeat(40);
    const body = `Study ${i}\n\n${filler}\nDose affected recall, F(2, 57) = 4.21, p = ${p}, ηp2 = .13.\n${filler}\n`;
    writeFileSync(join(dir, 'papers', i % 2 ? 'nested' : '', `paper-${String(i).padStart(3, '0')}.${i % 3 ? 'txt' : 'md'}`), body);
  }
  return dir;
}

function scan(args: string[], cwd = '.'): { status: number | null; stdout: string; stderr: string } {
  const result = spawnSync('node', [join(process.cwd(), bin), 'scan', ...args], { cwd, encoding: 'utf8' });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

function reportOf(stdout: string): Report {
  return readJsonReport(stdout);
}

/** The report without the tool's version, which is not what these tests compare. */
function documentsOf(report: Report): unknown {
  return { documents: report.documents, summary: report.summary };
}

/** The audit files in a cache folder (two-character subfolders), not its indexes. */
function cacheFiles(cache: string): string[] {
  return readdirSync(cache)
    .filter((name) => name.length === 2)
    .flatMap((sub) => readdirSync(join(cache, sub)).map((name) => join(cache, sub, name)));
}

describe('scan at scale', () => {
  expect(existsSync(bin), `${bin} missing: run npm run build`).toBe(true);

  it('gives the same report with one worker and with several', () => {
    const dir = makeCorpus(30);
    const one = scan(['papers', '--jobs', '1', '--no-cache', '--format', 'json'], dir);
    const many = scan(['papers', '--jobs', '3', '--no-cache', '--format', 'json'], dir);
    expect(one.status).toBe(1);
    expect(documentsOf(reportOf(many.stdout))).toEqual(documentsOf(reportOf(one.stdout)));
    expect(reportOf(one.stdout).summary).toMatchObject({ documents: 30, statistics: 30, findings: { fail: 6 } });
  });

  it('reuses the cache for unchanged files and audits changed ones again', () => {
    const dir = makeCorpus(12);
    const cold = scan(['papers', '--cache-dir', 'cache', '--format', 'json'], dir);
    const warm = scan(['papers', '--cache-dir', 'cache', '--format', 'json'], dir);
    // Byte for byte: a cached audit goes into the JSON report as it was stored.
    expect(warm.stdout).toBe(cold.stdout);
    expect(documentsOf(reportOf(warm.stdout)).summary).toMatchObject({ documents: 12, findings: { fail: 3 } });
    expect(existsSync(join(dir, 'cache'))).toBe(true);
    // The other formats parse the cached audits: the same report as a run without the cache
    // (JSON Lines on standard output come in the order documents finish, so their lines are compared as a set).
    const linesOf = (text: string, format: string): string[] => (format === 'jsonl' ? text.split('\n').sort() : [text]);
    for (const format of ['text', 'csv', 'md', 'html', 'jsonl']) {
      const cached = scan(['papers', '--cache-dir', 'cache', '--format', format], dir).stdout;
      const uncached = scan(['papers', '--no-cache', '--format', format], dir).stdout;
      expect(cached.length, format).toBeGreaterThan(1000);
      expect(linesOf(cached, format), format).toEqual(linesOf(uncached, format));
    }
    // Change one file: its audit must change, not come from the cache.
    writeFileSync(join(dir, 'papers', 'paper-001.txt'.replace('paper-001', 'nested/paper-001')), 'F(1, 44) = 4.21, p = .31.\n');
    const changed = reportOf(scan(['papers', '--cache-dir', 'cache', '--format', 'json'], dir).stdout);
    const document = changed.documents.find((d) => d.path.endsWith('paper-001.txt'))!;
    expect(document.statistics[0]).toMatchObject({ df: [1, 44], findings: [{ rule: 'p-value-mismatch' }] });
    // Other settings must not reuse audits made with different rules.
    writeFileSync(join(dir, 'quiet.json'), JSON.stringify({ rules: { 'p-value-mismatch': 'off' } }));
    const otherSettings = reportOf(scan(['papers', '--cache-dir', 'cache', '--config', 'quiet.json', '--format', 'json'], dir).stdout);
    expect(otherSettings.summary.findings.fail).toBe(0);
  });

  it('audits again, and never copies into a report, a cache entry that is cut short or damaged', () => {
    const dir = makeCorpus(6);
    const cold = scan(['papers', '--cache-dir', 'cache', '--format', 'json'], dir);
    const entries = cacheFiles(join(dir, 'cache'));
    expect(entries).toHaveLength(6);
    const damage = [
      (text: string) => text.slice(0, text.length - 40), // cut short
      (text: string) => `${text}]`, // something appended
      (text: string) => text.replace('{', '['), // header garbled
      () => '', // emptied
      (text: string) => text.slice(0, text.indexOf('\n')), // body lost
      (text: string) => text.replace('\n', ' '), // no header line
    ];
    entries.forEach((file, index) => writeFileSync(file, damage[index]!(readFileSync(file, 'utf8'))));
    const again = scan(['papers', '--cache-dir', 'cache', '--format', 'json'], dir);
    expect(again.stdout).toBe(cold.stdout);
    // And the damaged entries were replaced by good ones.
    expect(scan(['papers', '--cache-dir', 'cache', '--format', 'json'], dir).stdout).toBe(cold.stdout);
  });

  it('shards merged equal the unsharded run', () => {
    const dir = makeCorpus(25);
    const whole = reportOf(scan(['papers', '--no-cache', '--format', 'json'], dir).stdout);
    const shardFiles = [1, 2, 3].map((k) => {
      const file = `shard-${k}.jsonl`;
      scan(['papers', '--no-cache', '--shard', `${k}/3`, '--jsonl', file, '--format', 'json'], dir);
      return file;
    });
    const sizes = shardFiles.map((f) => readFileSync(join(dir, f), 'utf8').trim().split('\n').length);
    expect(sizes.reduce((a, b) => a + b, 0)).toBe(25);
    expect(Math.min(...sizes)).toBeGreaterThan(0);
    const merged = spawnSync('node', [join(process.cwd(), bin), 'merge', ...shardFiles, '--format', 'json'], { cwd: dir, encoding: 'utf8' });
    expect(documentsOf(reportOf(merged.stdout))).toEqual(documentsOf(whole));
  });

  it('an interrupted audit resumed with --resume gives the same output as an uninterrupted one', async () => {
    const dir = makeCorpus(300);
    const whole = reportOf(scan(['papers', '--no-cache', '--jobs', '1', '--format', 'json'], dir).stdout);
    const jsonl = join(dir, 'audit.jsonl');
    const child = spawn('node', [join(process.cwd(), bin), 'scan', 'papers', '--no-cache', '--jobs', '1', '--jsonl', jsonl, '--format', 'json'], {
      cwd: dir,
      stdio: 'ignore',
    });
    // Kill it once some documents are written, well before all 300 are.
    const linesWritten = (): number => (existsSync(jsonl) ? readFileSync(jsonl, 'utf8').split('\n').length - 1 : 0);
    const exited = new Promise<void>((resolve) => child.on('exit', () => resolve()));
    while (linesWritten() < 10 && child.exitCode === null) await new Promise((r) => setTimeout(r, 5));
    child.kill('SIGKILL');
    await exited;
    const before = linesWritten();
    expect(before).toBeGreaterThanOrEqual(10);
    expect(before).toBeLessThan(300);
    // A write cut off mid-line, as a crash can leave.
    appendFileSync(jsonl, '{"path":"papers/paper-2');
    const resumed = scan(['papers', '--no-cache', '--jobs', '1', '--jsonl', jsonl, '--resume', '--format', 'json'], dir);
    expect(documentsOf(reportOf(resumed.stdout))).toEqual(documentsOf(whole));
    // The fragment was dropped, not appended to: every line of the file is a whole record, one per document.
    const records = readFileSync(jsonl, 'utf8').trimEnd().split('\n').map((line) => JSON.parse(line) as { path: string });
    expect(records.map((record) => record.path).sort()).toEqual(whole.documents.map((d) => d.path));
  }, 60_000);

  it('--resume needs --jsonl, and a bad --shard is refused', () => {
    expect(scan(['corpus-demo', '--resume']).stderr).toContain('--resume needs --jsonl');
    const bad = scan(['corpus-demo', '--shard', '4/3']);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toContain('K must be between 1 and N');
  });

  it('reads paths from a list file and reports a listed file that is missing', () => {
    const dir = makeCorpus(3);
    writeFileSync(join(dir, 'list.txt'), 'papers/paper-000.md\n# a comment\npapers/nested/paper-001.txt\npapers/gone.pdf\n');
    const result = scan(['@list.txt', '--no-cache', '--format', 'json'], dir);
    const report = reportOf(result.stdout);
    expect(report.documents.map((d) => [d.path, d.status])).toEqual([
      ['papers/gone.pdf', 'unreadable'],
      ['papers/nested/paper-001.txt', 'checked'],
      ['papers/paper-000.md', 'checked'],
    ]);
    expect(result.status).toBe(2);
  });
});

describe('shards', () => {
  it('split any list into disjoint parts that cover it', () => {
    const paths = Array.from({ length: 500 }, (_, i) => `corpus/${i}.pdf`);
    const shards = [1, 2, 3, 4].map((index) => paths.filter((p) => inShard(p, { index, count: 4 })));
    expect(shards.flat().sort()).toEqual([...paths].sort());
    expect(Math.min(...shards.map((s) => s.length))).toBeGreaterThan(80);
  });
  it('parse K/N', () => {
    expect(parseShard('2/8')).toEqual({ index: 2, count: 8 });
    expect(parseShard('0/8')).toMatch(/between 1 and N/);
    expect(parseShard('two')).toMatch(/K\/N/);
  });
});

describe('cache fingerprint', () => {
  it('differs for different nested settings and not for key order', async () => {
    const { settingsFingerprint } = await import('../../src/batch/cache.js');
    const a = settingsFingerprint({ version: '1', userConfig: { rules: { 'halved-p': 'off' } } });
    const b = settingsFingerprint({ version: '1', userConfig: { rules: { 'halved-p': 'warn' } } });
    const c = settingsFingerprint({ userConfig: { rules: { 'halved-p': 'off' } }, version: '1' });
    expect(a).not.toBe(b);
    expect(a).toBe(c);
  });
});

describe('content key index', () => {
  it('reuses a key only while size and modification time are unchanged', async () => {
    const { AuditCache, ContentKeyIndex } = await import('../../src/batch/cache.js');
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-index-'));
    const store = new AuditCache(dir);
    const key1 = 'a'.repeat(64);
    const index = new ContentKeyIndex(store, 'settings-a');
    await index.load();
    index.record('a.txt', 10, 1000, key1);
    index.record('b.txt', 10, 1000, '../../not-a-key'); // never kept: a key names a file in the cache folder
    await index.save();
    const again = new ContentKeyIndex(store, 'settings-a');
    await again.load();
    expect(again.lookup('a.txt', 10, 1000)).toBe(key1);
    expect(again.lookup('b.txt', 10, 1000)).toBeNull();
    expect(again.lookup('a.txt', 11, 1000)).toBeNull();
    expect(again.lookup('a.txt', 10, 1001)).toBeNull();
    const otherSettings = new ContentKeyIndex(store, 'settings-b');
    await otherSettings.load();
    expect(otherSettings.lookup('a.txt', 10, 1000)).toBeNull();
  });
});

describe('folder walk', () => {
  it('finds every supported document, in any letter case, and skips hidden folders, hidden files and node_modules', async () => {
    const { collectInputs } = await import('../../src/batch/inputs.js');
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-walk-'));
    const files = [
      'a.txt', 'B.PDF', 'c.Docx', 'deep/er/d.md', 'deep/e.html', 'deep/f.htm', 'g.xml', 'h.tex', // found
      'notes.csv', 'image.png', 'README', // unsupported
      '.hidden.txt', '.git/i.txt', 'node_modules/pkg/j.md', 'deep/node_modules/k.txt', 'deep/.cache/l.pdf', // skipped
    ];
    for (const file of files) {
      mkdirSync(join(dir, file, '..'), { recursive: true });
      writeFileSync(join(dir, file), 'text');
    }
    // Named relative to the folder the user stands in (here the walked folder itself).
    const { files: found, missing } = await collectInputs([dir], [dir]);
    expect(missing).toEqual([]);
    expect(found).toEqual(['B.PDF', 'a.txt', 'c.Docx', 'deep/e.html', 'deep/er/d.md', 'deep/f.htm', 'g.xml', 'h.tex']);
    // A file named on its own is taken as it is, hidden or not; a folder given with a trailing slash, or as ".", gives the same paths.
    expect((await collectInputs([join(dir, '.hidden.txt')], [dir])).files).toEqual(['.hidden.txt']);
    expect((await collectInputs([`${dir}/`], [dir])).files).toEqual(found);
    expect((await collectInputs(['.'], [dir])).files).toEqual(found);
    // From elsewhere, the names climb to the folder.
    expect((await collectInputs([dir], [join(dir, 'deep')])).files).toEqual(found.map((f) => (f.startsWith('deep/') ? f.slice(5) : `../${f}`)).sort());
  });
});
