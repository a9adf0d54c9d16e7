import { spawnSync } from 'node:child_process';
import { chmodSync, copyFileSync, mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readJsonReport } from '../../src/report/jsonLayoutSchema.js';

// Runs the built command (`npm test` builds first) so documents go through the worker pool.
const bin = join(process.cwd(), 'dist', 'src', 'cli', 'main.js');

/**
 * A valid one-page PDF whose content stream draws 400,000 single letters:
 * pdf-parse takes seconds over it (about 2.7 s here), though it is not broken.
 */
function slowPdf(path: string): void {
  const operators = Array.from({ length: 400_000 }, (_, i) => `BT /F1 9 Tf ${40 + (i % 500)} ${800 - (i % 700)} Td (F) Tj ET`).join('\n');
  const objects = [
    '<< /Type /Catalog /Pages 2 0 R >>',
    '<< /Type /Pages /Kids [3 0 R] /Count 1 >>',
    '<< /Type /Page /Parent 2 0 R /MediaBox [0 0 595 842] /Contents 4 0 R /Resources << /Font << /F1 5 0 R >> >> >>',
    `<< /Length ${operators.length} >>\nstream\n${operators}\nendstream`,
    '<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica >>',
  ];
  let pdf = '%PDF-1.4\n';
  const offsets: number[] = [];
  objects.forEach((object, index) => {
    offsets.push(pdf.length);
    pdf += `${index + 1} 0 obj\n${object}\nendobj\n`;
  });
  const xref = pdf.length;
  pdf += `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n${offsets.map((o) => `${String(o).padStart(10, '0')} 00000 n \n`).join('')}`;
  pdf += `trailer\n<< /Size ${objects.length + 1} /Root 1 0 R >>\nstartxref\n${xref}\n%%EOF\n`;
  writeFileSync(path, pdf);
}

describe('time budget per document', () => {
  it('stops pdf-parse past the budget even with --jobs 1 (the PDF is read on a thread of its own)', () => {
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-time-'));
    slowPdf(join(dir, 'slow.pdf'));
    writeFileSync(join(dir, 'fine.txt'), 'F(2, 57) = 4.21, p = .020.\n');
    const run = (limit: string[]) =>
      spawnSync('node', [bin, 'scan', dir, '--jobs', '1', '--pdf-engine', 'pdf-parse', ...limit, '--no-cache', '--format', 'json'], { encoding: 'utf8', timeout: 25_000 });
    const stopped = readJsonReport(run(['--limit', 'maxSecondsPerDocument=1']).stdout);
    expect(stopped.documents.find((d) => d.path.endsWith('slow.pdf'))?.error).toMatch(/took longer than 1 s .*maxSecondsPerDocument/);
    expect(stopped.documents.find((d) => d.path.endsWith('fine.txt'))?.status).toBe('checked');
    // Within the default budget the same file is read: it was the budget that stopped it.
    const read = readJsonReport(run([]).stdout);
    expect(read.documents.find((d) => d.path.endsWith('slow.pdf'))?.status).toBe('checked');
  }, 30_000);

  it('stops a large text file past the budget even with --jobs 1 (a file over 2 MB is audited on a thread of its own)', () => {
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-time-'));
    // About 2.2 MB of results on one line: tens of seconds of checking, far past a budget of 1 s.
    const results = Array.from({ length: 90_000 }, (_, i) => `F(1, 20) = ${(1 + (i % 50)) / 10}, p = .0${(i % 9) + 1}; `).join('');
    writeFileSync(join(dir, 'dense.txt'), results);
    writeFileSync(join(dir, 'fine.txt'), 'F(2, 57) = 4.21, p = .020.\n');
    const run = spawnSync('node', [bin, 'scan', dir, '--jobs', '1', '--limit', 'maxSecondsPerDocument=1', '--no-cache', '--format', 'json'], { encoding: 'utf8', timeout: 25_000 });
    const report = readJsonReport(run.stdout);
    expect(report.documents.find((d) => d.path.endsWith('dense.txt'))?.error).toMatch(/took longer than 1 s .*maxSecondsPerDocument/);
    expect(report.documents.find((d) => d.path.endsWith('fine.txt'))?.status).toBe('checked');
  }, 30_000);

  it('stops a document under 2 MB audited on the main thread (--jobs 1) past the budget, and the audit goes on', () => {
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-time-'));
    // About 1.7 MB of results (under the 2 MB above which a file goes to a worker thread): 18 s of checking on
    // the main thread here, far past a budget of 1 s. Before, nothing stopped it.
    const results = Array.from({ length: 70_000 }, (_, i) => `F(1, 20) = ${(1 + (i % 50)) / 10}, p = .0${(i % 9) + 1}; `).join('');
    expect(Buffer.byteLength(results)).toBeLessThan(2 * 1024 * 1024);
    writeFileSync(join(dir, 'dense.txt'), results);
    writeFileSync(join(dir, 'fine.txt'), 'F(2, 57) = 4.21, p = .020.\n');
    const run = spawnSync('node', [bin, 'scan', dir, '--jobs', '1', '--limit', 'maxSecondsPerDocument=1', '--no-cache', '--format', 'json'], { encoding: 'utf8', timeout: 25_000 });
    expect(run.status).toBe(2);
    const report = readJsonReport(run.stdout);
    const dense = report.documents.find((d) => d.path.endsWith('dense.txt'))!;
    expect(dense.status).toBe('unreadable');
    expect(dense.error).toBe(
      'took longer than 1 s and was stopped (limit maxSecondsPerDocument = 1 seconds; raise it with --limit maxSecondsPerDocument=<n> or "limits": {"maxSecondsPerDocument": <n>} in the settings file)',
    );
    const fine = report.documents.find((d) => d.path.endsWith('fine.txt'))!;
    expect(fine.status).toBe('checked');
    expect(fine.statistics).toHaveLength(1);
  }, 30_000);

  it('stops pdftotext when it runs past maxSecondsPerDocument, and the audit goes on', () => {
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-time-'));
    // A stand-in pdftotext that never finishes, first on the PATH: the budget must stop it.
    const fakeBin = join(dir, 'bin');
    spawnSync('mkdir', [fakeBin]);
    writeFileSync(join(fakeBin, 'pdftotext'), '#!/bin/sh\nsleep 30\n');
    chmodSync(join(fakeBin, 'pdftotext'), 0o755);
    writeFileSync(join(dir, 'slow.pdf'), '%PDF-1.4\n1 0 obj << >> endobj\ntrailer << >>\n%%EOF\n');
    writeFileSync(join(dir, 'fine.txt'), 'F(2, 57) = 4.21, p = .020.\n');
    const result = spawnSync('node', [bin, 'scan', dir, '--pdf-engine', 'pdftotext', '--limit', 'maxSecondsPerDocument=1', '--no-cache', '--format', 'json'], {
      encoding: 'utf8',
      env: { ...process.env, PATH: `${fakeBin}:${process.env.PATH}` },
      timeout: 25_000,
    });
    const report = readJsonReport(result.stdout);
    const slow = report.documents.find((d) => d.path.endsWith('slow.pdf'))!;
    expect(slow.status).toBe('unreadable');
    expect(slow.error).toMatch(/took longer than 1 s .*maxSecondsPerDocument/);
    expect(report.documents.find((d) => d.path.endsWith('fine.txt'))?.status).toBe('checked');
    expect(result.status).toBe(2);
  }, 30_000);

  it('counts a document\'s own work from the moment a worker starts it, not its wait in the queue', () => {
    // 200 documents of about 10 ms each, a budget of 1 s: every one fits its budget many times over, but the
    // queue takes longer than the budget. Before, the clock started when a document was queued, and most were
    // listed as "took longer than 1 s and was stopped".
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-queue-'));
    const sentence = 'Participants rated every item twice. '.repeat(5);
    for (let i = 0; i < 200; i += 1) {
      const results = Array.from({ length: 20 }, (_, k) => `${sentence}Dose affected recall, F(2, ${50 + k}) = 4.21, p = .020.`);
      writeFileSync(join(dir, `paper-${i}.txt`), `${results.join('\n')}\n`);
    }
    // With --jobs 1 a PDF read by pdf-parse sends every document to one worker thread, one after another.
    copyFileSync(join(process.cwd(), 'tests', 'fixtures', 'documents', 'two-pages.pdf'), join(dir, 'two-pages.pdf'));
    for (const jobs of ['1', '2']) {
      const result = spawnSync(
        'node',
        [bin, 'scan', dir, '--jobs', jobs, '--pdf-engine', 'pdf-parse', '--limit', 'maxSecondsPerDocument=1', '--no-cache', '--format', 'json', '--fail-on', 'never'],
        { encoding: 'utf8', timeout: 50_000, maxBuffer: 1 << 28 },
      );
      const report = readJsonReport(result.stdout);
      expect(report.documents, `--jobs ${jobs}`).toHaveLength(201);
      expect(report.documents.filter((d) => d.status === 'unreadable').map((d) => d.error), `--jobs ${jobs}`).toEqual([]);
    }
  }, 60_000);

  it('stops reading a refit --reported manuscript past the budget (it is read on a thread of its own)', () => {
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-time-'));
    slowPdf(join(dir, 'slow.pdf'));
    // No pdftotext on the PATH, so the PDF is read by pdf-parse (JavaScript, stopped only by ending its thread).
    const emptyBin = join(dir, 'bin');
    mkdirSync(emptyBin);
    const demo = (name: string) => join(process.cwd(), 'corpus-demo', 'refit', name);
    const run = (limit: string[]) =>
      spawnSync(process.execPath, [bin, 'refit', demo('harbour-walks.csv'), '--spec', demo('harbour-walks.analysis.json'), '--reported', join(dir, 'slow.pdf'), ...limit], {
        encoding: 'utf8',
        env: { ...process.env, PATH: emptyBin, NO_COLOR: '1' },
        timeout: 25_000,
      });
    const stopped = run(['--limit', 'maxSecondsPerDocument=1']);
    expect(stopped.status).toBe(2);
    expect(stopped.stderr).toBe(
      'plumbline: slow.pdf: reading it as the reported manuscript took longer than 1 s and was stopped (limit maxSecondsPerDocument = 1 seconds; raise it with --limit maxSecondsPerDocument=<n>)\n',
    );
    // Within the default budget the same PDF is read to its end (it reports no table): it was the budget that stopped it.
    const read = run([]);
    expect(read.status).toBe(2);
    expect(read.stderr).toMatch(/^plumbline: slow\.pdf: found no ANOVA table and no written F results/);
  }, 30_000);

  it('refit --limit passes the document limits to the reported manuscript, and refuses a bad one by name', () => {
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-time-'));
    const demo = (name: string) => join(process.cwd(), 'corpus-demo', 'refit', name);
    const refit = (limit: string[]) =>
      spawnSync(process.execPath, [bin, 'refit', demo('harbour-walks.csv'), '--spec', demo('harbour-walks.analysis.json'), '--reported', demo('harbour-walks-manuscript.md'), ...limit], {
        encoding: 'utf8',
        env: { ...process.env, NO_COLOR: '1' },
        timeout: 25_000,
        cwd: dir,
      });
    const tooSmall = refit(['--limit', 'maxDocumentMb=0.000001']);
    expect(tooSmall.status).toBe(2);
    expect(tooSmall.stderr).toMatch(/^plumbline: harbour-walks-manuscript\.md: cannot be read \(text file too large to read whole: .*\(limit maxDocumentMb = 0\.000001 MB; raise it with --limit maxDocumentMb=<n>\)/);
    const bad = refit(['--limit', 'maxSecondsPerDocument=soon']);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toBe('plumbline: --limit: limit maxSecondsPerDocument must be a positive number, got NaN\n');
    // The demo within its limits: the planted slip is found as before (exit 1).
    expect(refit([]).status).toBe(1);
  }, 30_000);
});

describe('the time budget of check', () => {
  it('stops checking a pasted text past the budget, with exit code 2 and the limit named', () => {
    // About 1.7 MB of results given on standard input: many seconds of checking, far past a budget of 1 s.
    const results = Array.from({ length: 70_000 }, (_, i) => `F(1, 20) = ${(1 + (i % 50)) / 10}, p = .0${(i % 9) + 1}; `).join('');
    const run = spawnSync('node', [bin, 'check', '-', '--limit', 'maxSecondsPerDocument=1'], { input: results, encoding: 'utf8', timeout: 25_000 });
    expect(run.status).toBe(2);
    expect(run.stderr).toContain('<stdin>: checking it took longer than 1 s and was stopped (limit maxSecondsPerDocument');
    // A short text is checked as before.
    const fine = spawnSync('node', [bin, 'check', 'F(2, 57) = 4.21, p = .020.', '--limit', 'maxSecondsPerDocument=1'], { encoding: 'utf8', timeout: 25_000 });
    expect(fine.status).toBe(0);
  }, 30_000);
});
