import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { inflateRawSync } from 'node:zlib';
import { afterAll, describe, expect, it } from 'vitest';
import { auditFile } from '../../src/batch/auditFile.js';
import { resolveConfig } from '../../src/checks/config.js';
import { readDocument } from '../../src/documents/read.js';
import { findPdftotext } from '../../src/documents/pdf.js';
import { openZip } from '../../src/documents/zipGuard.js';
import { defaultLimits } from '../../src/limits.js';
import { deflatedZeros, pdfWithTextRuns, zipArchive } from './build.js';

/**
 * Hostile documents: each is read to the end or refused with a message that
 * names the limit. No wall-clock assertions: vitest's per-test timeout (60 s)
 * is only a guard against a hang.
 */
const folder = mkdtempSync(join(tmpdir(), 'plumbline-adversarial-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));
const config = resolveConfig({});

function file(name: string, content: string | Buffer): string {
  const path = join(folder, name);
  writeFileSync(path, content);
  return path;
}

describe('pathological text', () => {
  it('10 MB of "F(((((" is scanned to the end and holds no result', async () => {
    const path = file('parens.txt', 'F((((('.repeat(Math.ceil(10_000_000 / 6)));
    const output = await auditFile(path, config, {});
    expect(output.status).toBe('checked');
    expect(output.statistics).toEqual([]);
    rmSync(path);
  });

  it('10 MB of "= = = <" after a statistic symbol, and of digits, holds no result', async () => {
    for (const [name, unit] of [['equals.txt', 'F = = < > '], ['digits.txt', '1234567890.']] as const) {
      const path = file(name, unit.repeat(1_000_000));
      const output = await auditFile(path, config, {});
      expect(output.status).toBe('checked');
      rmSync(path);
    }
  });

  // A few results only: the descriptive-statistics linking (another change) takes time proportional to
  // results x line length on one huge line, which belongs in a benchmark, not here.
  it('a 50 MB single line is read whole, and the same results are found when it is streamed', async () => {
    const unit = `${'x'.repeat(9_999_970)} F(1, 20) = 4.20, p = .07 `;
    const path = file('one-line.txt', unit.repeat(5));
    const whole = await auditFile(path, config, {});
    expect(whole.status).toBe('checked');
    expect(whole.statistics.length).toBe(5);
    const streamed = await auditFile(path, config, { limits: { streamTextAboveMb: 10 } });
    expect(streamed.statistics.map((s) => s.location)).toEqual(whole.statistics.map((s) => s.location));
    expect(streamed.statistics.every((s) => s.location.line === 1)).toBe(true);
    rmSync(path);
  });
});

describe('markup nested too deep or too large', () => {
  it('100,000 nested <div>s are refused, naming the limit', async () => {
    const path = file('nested.html', `<html><body>${'<div>'.repeat(100_000)}F(1, 20) = 4.2${'</div>'.repeat(100_000)}</body></html>`);
    const outcome = await readDocument(path);
    expect(outcome).toMatchObject({ ok: false, format: 'html' });
    if (!outcome.ok) {
      expect(outcome.error).toBe(
        'elements nested more than 1000 deep (at <div>) (limit maxNestingDepth = 1,000 levels; raise it with --limit maxNestingDepth=<n> or "limits": {"maxNestingDepth": <n>} in the settings file)',
      );
    }
  });

  it('nesting just inside the limit is read (the readers recurse without overflowing)', async () => {
    const path = file('deep-ok.html', `<html><body>${'<div>'.repeat(990)}Recall, F(1, 20) = 4.20, p = .054.${'</div>'.repeat(990)}</body></html>`);
    const output = await auditFile(path, config, {});
    expect(output.status).toBe('checked');
    expect(output.statistics).toHaveLength(1);
  });

  it('deeply nested JATS XML is refused too, and a lower limit on elements applies', async () => {
    const xml = `<?xml version="1.0"?><article><body>${'<sec>'.repeat(5000)}<p>text</p>${'</sec>'.repeat(5000)}</body></article>`;
    const outcome = await readDocument(file('nested.xml', xml));
    expect(outcome.ok ? '' : outcome.error).toMatch(/^elements nested more than 1000 deep \(at <sec>\) \(limit maxNestingDepth = 1,000 levels;/);
    const many = await readDocument(file('many.html', `<html><body>${'<p>a</p>'.repeat(5000)}</body></html>`), { limits: { maxElements: 1000 } });
    expect(many.ok ? '' : many.error).toMatch(/^more than 1,000 elements \(limit maxElements = 1,000 elements; raise it with --limit maxElements=<n>/);
  });

  it('a document over the size limit is refused before it is read', async () => {
    const path = file('big.html', `<html><body><p>${'a'.repeat(1_500_000)}</p></body></html>`);
    const outcome = await readDocument(path, { limits: { maxDocumentMb: 1 } });
    expect(outcome.ok ? '' : outcome.error).toBe(
      'document too large: 1.5 MB (limit maxDocumentMb = 1 MB; raise it with --max-document-mb <n> or "limits": {"maxDocumentMb": <n>} in the settings file)',
    );
    const text = await readDocument(file('big.txt', 'a'.repeat(1_500_000)), { limits: { maxDocumentMb: 1 } });
    expect(text.ok ? '' : text.error).toMatch(/^text file too large to read whole: 1\.5 MB \(limit maxDocumentMb = 1 MB;.*plumbline scan streams text files larger than streamTextAboveMb \(64 MB\) instead$/);
  });
});

describe('zip bombs in DOCX files', () => {
  it('a DOCX whose document part expands to 2 GiB is refused from its directory, before inflating', async () => {
    const zeros = await deflatedZeros(2048);
    // (The payload is real: the same builder's 3 MiB archive inflates to 3 MiB of zeros, below.)
    const bomb = zipArchive([{ name: 'word/document.xml', method: 8, ...zeros }]);
    expect(bomb.length).toBeLessThan(5_000_000);
    const outcome = await readDocument(file('bomb.docx', bomb));
    expect(outcome.ok ? '' : outcome.error).toBe(
      'the DOCX part "word/document.xml" would expand to 2147.5 MB when unzipped (a zip bomb?) (limit maxUnzippedEntryMb = 50 MB; raise it with --limit maxUnzippedEntryMb=<n> or "limits": {"maxUnzippedEntryMb": <n>} in the settings file)',
    );
  });

  it('parts each within the limit of one part, together over the total, are refused from the directory', async () => {
    const zeros = await deflatedZeros(40);
    const parts = zipArchive(['a', 'b', 'c'].map((name) => ({ name: `word/${name}.xml`, method: 8 as const, ...zeros })));
    const outcome = await readDocument(file('parts.docx', parts));
    expect(outcome.ok ? '' : outcome.error).toBe(
      'the DOCX would expand to 125.8 MB when unzipped (a zip bomb?) (limit maxUnzippedMb = 100 MB; raise it with --limit maxUnzippedMb=<n> or "limits": {"maxUnzippedMb": <n>} in the settings file)',
    );
  });

  it('a part that lies about its size is stopped when its output passes the declared size', async () => {
    const zeros = await deflatedZeros(200);
    const liar = zipArchive([{ name: 'word/document.xml', method: 8, data: zeros.data, crc: zeros.crc, size: 1000 }]);
    const outcome = await readDocument(file('liar.docx', liar));
    expect(outcome.ok ? '' : outcome.error).toMatch(/^the DOCX part "word\/document\.xml" expands beyond the 0\.0 MB its zip directory declares \(a zip bomb\?\) \(limit maxUnzippedMb = 100 MB;/);
  });

  it('a normal archive passes, and the check follows a changed limit', async () => {
    const zeros = await deflatedZeros(3);
    expect(inflateRawSync(zeros.data).equals(Buffer.alloc(3 << 20))).toBe(true);
    const archive = zipArchive([{ name: 'word/document.xml', method: 8, ...zeros }]);
    const opened = openZip(archive, defaultLimits);
    expect(opened.ok).toBe(true);
    if (opened.ok) expect(((await opened.archive.read('word/document.xml')) as Uint8Array).length).toBe(3 << 20);
    expect(openZip(archive, { ...defaultLimits, maxUnzippedMb: 2 })).toEqual({ ok: false, error: expect.stringMatching(/^the DOCX would expand to 3\.1 MB when unzipped/) });
  });
});

describe('PDFs with huge content', () => {
  it('a PDF with a million tiny text runs is read to the end', async () => {
    const path = file('runs.pdf', pdfWithTextRuns(1_000_000));
    const outcome = await readDocument(path, { pdfEngine: 'pdf-parse' });
    expect(outcome.ok).toBe(true);
    if (outcome.ok) expect(outcome.document.text.replace(/\s/g, '').length).toBeGreaterThan(900_000);
  });

  const engines = ['pdf-parse', ...(findPdftotext() === null ? [] : ['pdftotext'])] as const;
  it.each(engines)('a PDF with more pages than the limit is refused (%s)', async (engine) => {
    const path = file(`pages-${engine}.pdf`, pdfWithTextRuns(2000, 3));
    const outcome = await readDocument(path, { pdfEngine: engine, limits: { maxPdfPages: 2 } });
    expect(outcome.ok ? '' : outcome.error).toMatch(
      new RegExp(`^the PDF has ${engine === 'pdf-parse' ? '3' : 'more than 2'} pages \\(limit maxPdfPages = 2 pages; raise it with --limit maxPdfPages=<n>`),
    );
    expect((await readDocument(path, { pdfEngine: engine, limits: { maxPdfPages: 3 } })).ok).toBe(true);
  });
});
