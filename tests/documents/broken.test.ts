import { describe, expect, it } from 'vitest';
import { readDocument } from '../../src/documents/read.js';
import { fixture, pdftotextMissing } from './helpers.js';

const engines = ['pdf-parse', ...(pdftotextMissing ? [] : ['pdftotext'])] as const;

describe.each(engines)('broken PDFs give their reason (engine %s)', (engine) => {
  it.each([
    ['empty.pdf', /^empty file \(0 bytes\)$/],
    ['truncated.pdf', /^truncated PDF: the end-of-file marker is missing/],
    ['corrupt.pdf', /^corrupt PDF: its structure cannot be read/],
    ['encrypted.pdf', /^encrypted PDF: it needs a password to open/],
    ['scanned.pdf', /^no text layer: the PDF seems to be scanned images; run OCR first$/],
    ['really-html.pdf', /^not a PDF: the file is really an HTML page; if that is right, rename it to \.html$/],
  ])('%s', async (name, message) => {
    const outcome = await readDocument(fixture(`broken/${name}`), { pdfEngine: engine });
    expect(outcome.ok).toBe(false);
    if (!outcome.ok) {
      expect(outcome.error).toMatch(message);
      expect(outcome.format).toBe('pdf');
      expect(outcome.path).toBe(fixture(`broken/${name}`));
    }
  });
});

describe('broken DOCX files give their reason', () => {
  it.each([
    ['not-a-zip.docx', /^not a DOCX file \(a \.docx is a zip archive\): the file is really plain text/],
    ['zip-not-word.docx', /^a zip archive, but not a Word document \(it has no word\/document\.xml part\)$/],
  ])('%s', async (name, message) => {
    const outcome = await readDocument(fixture(`broken/${name}`));
    expect(outcome.ok).toBe(false);
    if (!outcome.ok) expect(outcome.error).toMatch(message);
  });
});

describe('the dispatcher', () => {
  it('says when a file does not exist, without throwing', async () => {
    const outcome = await readDocument(fixture('no-such-file.pdf'));
    expect(outcome).toMatchObject({ ok: false, error: 'cannot read the file (ENOENT)' });
  });

});
