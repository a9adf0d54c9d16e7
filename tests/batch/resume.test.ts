import { appendFileSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { documentFromJson, readJsonReport } from '../../src/report/jsonLayoutSchema.js';
import { builtCliExists, plumbline, reportOf, temporaryFolder } from './cli.js';

/** Ten small manuscripts; every third has an inconsistent p (F(2, 57) = 4.21 gives p = .0197, SciPy 1.10.1 scipy.stats.f.sf). */
function papers(): string {
  const dir = temporaryFolder('resume');
  mkdirSync(join(dir, 'papers'));
  for (let i = 0; i < 10; i += 1) {
    writeFileSync(join(dir, 'papers', `paper-${i}.txt`), `Study ${i}. Dose affected recall, F(2, 57) = 4.21, p = ${i % 3 === 0 ? '.002' : '.020'}.\n`);
  }
  return dir;
}

const scanArgs = ['scan', 'papers', '--no-cache', '--jobs', '1', '--format', 'json', '--fail-on', 'never'];

/** The path of a JSON Lines record, read and checked as merge reads it. */
function documentRecordPath(line: string): string {
  const read = documentFromJson(JSON.parse(line));
  if (!read.ok) throw new Error(read.reason);
  return read.document.path;
}

/** Every line of a JSON Lines file parsed as a document record (throws on a bad one). */
function recordsOf(file: string): string[] {
  const text = readFileSync(file, 'utf8');
  expect(text.endsWith('\n')).toBe(true);
  return text
    .slice(0, -1)
    .split('\n')
    .map((line) => documentRecordPath(line));
}

describe('--resume after a JSON Lines file cut off mid-line', () => {
  expect(builtCliExists(), 'run npm run build first').toBe(true);

  it('drops the fragment (and says so) before appending; the file is whole, merges, and resumes again', () => {
    const dir = papers();
    const whole = reportOf(plumbline(scanArgs, dir));
    // A run that wrote four documents and was stopped while writing the fifth.
    plumbline([...scanArgs, '--jsonl', 'audit.jsonl'], dir);
    const lines = readFileSync(join(dir, 'audit.jsonl'), 'utf8').split('\n');
    const fifth = lines[4]!;
    writeFileSync(join(dir, 'audit.jsonl'), `${lines.slice(0, 4).join('\n')}\n${fifth.slice(0, 70)}`);

    const resumed = plumbline([...scanArgs, '--jsonl', 'audit.jsonl', '--resume'], dir);
    expect(resumed.status).toBe(0);
    expect(resumed.stderr).toMatch(/audit\.jsonl: line 5 was cut off mid-line \(70 bytes.*dropped it/);
    expect(reportOf(resumed).documents).toEqual(whole.documents);
    // Before, the next record was appended onto the fragment: one document lost and the file spoilt for merge.
    expect(recordsOf(join(dir, 'audit.jsonl')).sort()).toEqual(whole.documents.map((d) => d.path));
    const merged = plumbline(['merge', 'audit.jsonl', '--format', 'json', '--fail-on', 'never'], dir);
    expect(merged.stderr).toBe('');
    expect(reportOf(merged).documents).toEqual(whole.documents);
    // A second --resume finds nothing to do and changes nothing.
    const before = readFileSync(join(dir, 'audit.jsonl'), 'utf8');
    const again = plumbline([...scanArgs, '--jsonl', 'audit.jsonl', '--resume'], dir);
    expect(again.status).toBe(0);
    expect(again.stderr).toBe('');
    expect(reportOf(again).documents).toEqual(whole.documents);
    expect(readFileSync(join(dir, 'audit.jsonl'), 'utf8')).toBe(before);
  });

  it('a last record that lost only its newline is dropped too, and its document audited again', () => {
    const dir = papers();
    plumbline([...scanArgs, '--jsonl', 'audit.jsonl'], dir);
    const text = readFileSync(join(dir, 'audit.jsonl'), 'utf8');
    writeFileSync(join(dir, 'audit.jsonl'), text.slice(0, -1));
    const resumed = plumbline([...scanArgs, '--jsonl', 'audit.jsonl', '--resume'], dir);
    expect(resumed.stderr).toMatch(/line 10 was cut off mid-line/);
    expect(recordsOf(join(dir, 'audit.jsonl'))).toHaveLength(10);
  });

  it('a bad record before the last line is an error naming its line, and the file is not touched', () => {
    const dir = papers();
    plumbline([...scanArgs, '--jsonl', 'audit.jsonl'], dir);
    const lines = readFileSync(join(dir, 'audit.jsonl'), 'utf8').split('\n');
    const damaged = [
      [...lines.slice(0, 2), lines[2]!.slice(0, 50), ...lines.slice(3)].join('\n'), // line 3 not JSON
      [...lines.slice(0, 6), '{"path":"papers/x.txt","status":"perhaps"}', ...lines.slice(6)].join('\n'), // line 7 not a record
    ];
    for (const [index, text] of damaged.entries()) {
      writeFileSync(join(dir, 'audit.jsonl'), text);
      const resumed = plumbline([...scanArgs, '--jsonl', 'audit.jsonl', '--resume'], dir);
      expect(resumed.status).toBe(2);
      expect(resumed.stderr).toContain(index === 0 ? 'line 3 is not valid JSON' : 'line 7 is not a plumbline document record');
      expect(resumed.stderr).not.toMatch(/unexpected error|\n\s+at /);
      expect(resumed.stdout).toBe('');
      expect(readFileSync(join(dir, 'audit.jsonl'), 'utf8')).toBe(text);
    }
  });

  it('merge leaves out a cut-off last line and says which', () => {
    const dir = papers();
    plumbline([...scanArgs, '--jsonl', 'audit.jsonl'], dir);
    appendFileSync(join(dir, 'audit.jsonl'), '{"path":"papers/paper-1');
    const merged = plumbline(['merge', 'audit.jsonl', '--format', 'json', '--fail-on', 'never'], dir);
    expect(merged.status).toBe(0);
    expect(merged.stderr).toMatch(/audit\.jsonl: line 11 was cut off mid-line/);
    expect(reportOf(merged).documents).toHaveLength(10);
  });
});

/** The documents of a JSON report. */
function documentsOf(json: string) {
  return readJsonReport(json).documents;
}

describe('merge of a JSON Lines file larger than one read', () => {
  it('reads every record, lines that straddle the 1 MB reads included, and a cut-off last line is still left out', () => {
    const dir = papers();
    plumbline([...scanArgs, '--jsonl', 'audit.jsonl'], dir);
    const lines = readFileSync(join(dir, 'audit.jsonl'), 'utf8').slice(0, -1).split('\n');
    // 3,000 records (10 documents under 300 names each): several megabytes, read in 1 MB pieces.
    const copies = Array.from({ length: 300 }, (_, copy) => lines.map((line) => line.replace('"path":"papers/', `"path":"copy-${copy}/papers/`))).flat();
    writeFileSync(join(dir, 'big.jsonl'), `${copies.join('\n')}\n{"path":"cut`);
    expect(readFileSync(join(dir, 'big.jsonl')).length).toBeGreaterThan(2 * 1024 * 1024);
    // (The report goes to a file: several megabytes are more than a child's standard output is buffered for here.)
    const merged = plumbline(['merge', 'big.jsonl', '--format', 'json', '--fail-on', 'never', '--output', 'merged.json'], dir);
    expect(merged.status).toBe(0);
    expect(merged.stderr).toMatch(/big\.jsonl: line 3001 was cut off mid-line/);
    const report = documentsOf(readFileSync(join(dir, 'merged.json'), 'utf8'));
    expect(report).toHaveLength(3000);
  });
});
