import { spawnSync } from 'node:child_process';
import { chmodSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { reportSchema } from '../../src/report/model.js';

// Runs the built command (`npm test` builds first) so documents go through the worker pool.
const bin = join(process.cwd(), 'dist', 'src', 'cli', 'main.js');

describe('time budget per document', () => {
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
    const report = reportSchema.parse(JSON.parse(result.stdout));
    const slow = report.documents.find((d) => d.path.endsWith('slow.pdf'))!;
    expect(slow.status).toBe('unreadable');
    expect(slow.error).toMatch(/took longer than 1 s .*maxSecondsPerDocument/);
    expect(report.documents.find((d) => d.path.endsWith('fine.txt'))?.status).toBe('checked');
    expect(result.status).toBe(2);
  }, 30_000);
});
