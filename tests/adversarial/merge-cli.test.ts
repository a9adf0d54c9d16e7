import { spawnSync } from 'node:child_process';
import { closeSync, openSync, readFileSync, rmSync, symlinkSync, truncateSync, writeFileSync, writeSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { peakMemoryRunner, plumbline, reportOf, temporaryFolder } from '../batch/cli.js';
import { htmlDocumentsData } from '../report/htmlData.js';

/**
 * `plumbline merge` on inputs that could make it run without end: a FIFO
 * (waits for ever), a link to /dev/zero (never ends, one line without a
 * newline growing in memory), a file of zeros larger than any line can be,
 * and a record that takes longer to read and check than the time budget.
 * Each ends with exit code 2 and a message naming the file (and the line),
 * through the built command.
 */

const folder = temporaryFolder('merge-hostile');
afterAll(() => rmSync(folder, { recursive: true, force: true }));

/** A record scanned from one result, its statistics repeated `copies` times: a long but valid line. */
function bigRecord(copies: number): string {
  writeFileSync(join(folder, 'one.txt'), 'Dose affected recall, F(2, 57) = 4.21, p = .020, ηp2 = .13.\n');
  const scan = plumbline(['scan', 'one.txt', '--no-cache', '--jsonl', 'one.jsonl', '--format', 'json', '--fail-on', 'never'], folder);
  expect(scan.status, scan.stderr).toBe(0);
  const record = JSON.parse(readFileSync(join(folder, 'one.jsonl'), 'utf8')) as { results: unknown[] };
  record.results = Array.from({ length: copies }, () => record.results[0]);
  return `${JSON.stringify(record)}\n`;
}

describe('merge of hostile JSON Lines inputs', () => {
  it('refuses a FIFO and a link to /dev/zero by name, without opening them to read', () => {
    expect(spawnSync('mkfifo', [join(folder, 'pipe.jsonl')]).status).toBe(0);
    symlinkSync('/dev/zero', join(folder, 'zero.jsonl'));
    const pipe = plumbline(['merge', 'pipe.jsonl', '--format', 'json'], folder);
    expect(pipe.status).toBe(2);
    expect(pipe.stderr).toBe('plumbline: pipe.jsonl: not a regular file: a FIFO (named pipe); plumbline reads only regular files (a FIFO or a device can block or never end)\n');
    const zero = plumbline(['merge', 'zero.jsonl', '--format', 'json'], folder);
    expect(zero.status).toBe(2);
    expect(zero.stderr).toBe(
      'plumbline: zero.jsonl: not a regular file: a symbolic link to /dev/zero, a character device; plumbline reads only regular files (a FIFO or a device can block or never end)\n',
    );
  });

  it('refuses a line longer than any record can be as soon as it passes that length, in bounded memory', () => {
    // 600 MiB of zeros without a newline (a sparse file: nothing is written to the disk).
    writeFileSync(join(folder, 'zeros.jsonl'), '');
    truncateSync(join(folder, 'zeros.jsonl'), 600 * 1024 * 1024);
    const run = peakMemoryRunner(folder)(['merge', 'zeros.jsonl', '--format', 'json']);
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/^plumbline: zeros\.jsonl: line 1 is longer than 536,870,888 bytes, the longest text a line can be read as, so it is no plumbline record/);
    expect(run.peakMb).toBeLessThan(1000);
  });

  it('stops reading and checking a record past the time budget, and merges it within the default one', () => {
    writeFileSync(join(folder, 'big.jsonl'), bigRecord(40_000)); // about 28 MB on one line: a second or two of parsing and checking
    const stopped = plumbline(['merge', 'big.jsonl', '--format', 'json', '--limit', 'maxSecondsPerDocument=0.01'], folder);
    expect(stopped.status).toBe(2);
    expect(stopped.stdout).toBe('');
    expect(stopped.stderr).toBe(
      'plumbline: big.jsonl: reading and checking line 1 took longer than 0.01 s and was stopped (limit maxSecondsPerDocument = 0.01 seconds; raise it with --limit maxSecondsPerDocument=<n> or "limits": {"maxSecondsPerDocument": <n>} in the settings file); the file was left as it is\n',
    );
    // The settings file's limit counts too.
    writeFileSync(join(folder, 'settings.json'), JSON.stringify({ limits: { maxSecondsPerDocument: 0.01 } }));
    expect(plumbline(['merge', 'big.jsonl', '--format', 'json', '--config', 'settings.json'], folder).stderr).toMatch(/reading and checking line 1 took longer than 0\.01 s/);
    const merged = plumbline(['merge', 'big.jsonl', '--format', 'json', '--fail-on', 'never', '--output', 'merged.json'], folder);
    expect(merged.status, merged.stderr).toBe(0);
    expect(reportOf({ ...merged, stdout: readFileSync(join(folder, 'merged.json'), 'utf8') }).documents[0]!.statistics).toHaveLength(40_000);
  }, 60_000);

  it('streams a merge to JSON, JSON Lines and the other formats (HTML too): memory stays far below the records\' size, and the last record of each path is kept, in path order', () => {
    // Records of the demo manuscripts under 16,000 paths in reverse order, about 135 MB, then a second file
    // that gives one path a newer record.
    const scan = plumbline(['scan', join(process.cwd(), 'corpus-demo'), '--no-cache', '--jsonl', 'demo.jsonl', '--format', 'json', '--fail-on', 'never', '-q'], folder);
    expect(scan.status, scan.stderr).toBe(0);
    const demo = readFileSync(join(folder, 'demo.jsonl'), 'utf8').trim().split('\n').map((line) => JSON.parse(line) as { path: string; alpha: number });
    const count = 16_000;
    const name = (index: number) => `paper-${String(index).padStart(5, '0')}`;
    const descriptor = openSync(join(folder, 'many.jsonl'), 'w');
    for (let index = count - 1; index >= 0; index--) writeSync(descriptor, `${JSON.stringify({ ...demo[index % demo.length]!, path: name(index) })}\n`);
    closeSync(descriptor);
    writeFileSync(join(folder, 'newer.jsonl'), `${JSON.stringify({ ...demo[0]!, path: name(7), alpha: 0.01 })}\n`);
    const measured = peakMemoryRunner(folder);
    // (Text, CSV, Markdown and the HTML page are streamed too.)
    for (const format of ['jsonl', 'json', 'csv', 'md', 'text', 'html']) {
      const run = measured(['merge', 'many.jsonl', 'newer.jsonl', '--format', format, '--output', `merged.${format}`, '--fail-on', 'never']);
      expect(run.status, run.stderr).toBe(0);
      // Held whole, the parsed records took 846 MB at 150 MB of them.
      expect(run.peakMb, format).toBeLessThan(300);
    }
    const lines = readFileSync(join(folder, 'merged.jsonl'), 'utf8').trim().split('\n');
    expect(lines).toHaveLength(count);
    const paths = lines.map((line) => (JSON.parse(line) as { path: string }).path);
    expect(paths).toEqual(Array.from({ length: count }, (_, index) => name(index)));
    expect((JSON.parse(lines[7]!) as { alpha: number }).alpha).toBe(0.01);
    const report = reportOf({ status: 0, stderr: '', stdout: readFileSync(join(folder, 'merged.json'), 'utf8') });
    expect(report.documents).toHaveLength(count);
    expect(report.documents[7]!.alpha).toBe(0.01);
    expect(report.summary.documents).toBe(count);
    // Every document is in the streamed formats, in path order, with the totals of the whole merge.
    const csvPaths = new Set(readFileSync(join(folder, 'merged.csv'), 'utf8').split('\n').slice(1).filter((line) => line !== '').map((line) => line.split(',')[1]));
    expect(csvPaths.size).toBe(count);
    const text = readFileSync(join(folder, 'merged.text'), 'utf8');
    expect(text).toContain(`${count} documents`);
    expect(text.indexOf('paper-00007')).toBeLessThan(text.indexOf('paper-00008'));
    const markdown = readFileSync(join(folder, 'merged.md'), 'utf8');
    expect(markdown).toContain(`**Totals:** ${count} documents`);
    // The HTML page carries every document's data, in path order, with the newer record of paper-00007.
    const html = readFileSync(join(folder, 'merged.html'), 'utf8');
    expect(html).toContain(`<li><strong>${count}</strong> documents`);
    const data = htmlDocumentsData(html);
    expect(data.map((d) => d.p)).toEqual(Array.from({ length: count }, (_, index) => name(index)));
    expect(data[7]!.a).toBe(0.01);
  }, 300_000);
});
