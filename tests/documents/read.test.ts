import { copyFileSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { isSupported, readDocument, supportedExtensions } from '../../src/documents/read.js';
import { fixture } from './helpers.js';

const scratch = mkdtempSync(join(tmpdir(), 'plumbline-read-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('readDocument dispatch', () => {
  it('supports the new formats by extension, case-insensitively', () => {
    for (const name of ['a.pdf', 'a.DOCX', 'a.html', 'a.htm', 'a.xml', 'a.tex', 'a.txt', 'a.md']) expect(isSupported(name)).toBe(true);
    expect(isSupported('a.doc')).toBe(false);
    expect(supportedExtensions).toEqual(expect.arrayContaining(['.pdf', '.docx', '.html', '.xml', '.tex']));
  });

  it('refuses an unsupported extension with the list of supported ones', async () => {
    const outcome = await readDocument('paper.odt');
    expect(outcome).toMatchObject({ ok: false, format: 'unknown' });
    if (!outcome.ok) expect(outcome.error).toContain('.pdf, .docx');
  });

  it('refuses a PDF named .html and a PDF named .docx, saying what the file is', async () => {
    const asHtml = join(scratch, 'paper.html');
    const asDocx = join(scratch, 'paper.docx');
    copyFileSync(fixture('two-pages.pdf'), asHtml);
    copyFileSync(fixture('two-pages.pdf'), asDocx);
    const html = await readDocument(asHtml);
    const docx = await readDocument(asDocx);
    expect(html).toMatchObject({ ok: false, error: 'not an HTML page: the file is really a PDF; if that is right, rename it to .pdf' });
    expect(docx).toMatchObject({ ok: false, error: 'not a DOCX file (a .docx is a zip archive): the file is really a PDF; if that is right, rename it to .pdf' });
  });

  it('refuses an HTML page named .xml as not JATS', async () => {
    const asXml = join(scratch, 'page.xml');
    copyFileSync(fixture('article.html'), asXml);
    const outcome = await readDocument(asXml);
    expect(outcome).toMatchObject({ ok: false, format: 'jats', error: 'not a JATS XML file: the file is really an HTML page; if that is right, rename it to .html' });
  });
});

describe('reference list in text without markup', async () => {
  const { findReferenceListRegions } = await import('../../src/documents/plainRegions.js');
  const references = (text: string) => findReferenceListRegions(text).find((r) => r.kind === 'references');
  it('ends at a Notes heading', () => {
    const text = 'Results F(1, 20) = 5.1.\nReferences\nAlmond, R. (2017). Noise. Journal, 12(3), 1-5.\nNotes\n[1] A check gave t(84) = 2.21, p = .030.\n';
    const region = references(text)!;
    expect(text.slice(region.start, region.end)).not.toContain('t(84)');
  });
  it('ends at a footnote that extraction placed after it, but not at a numbered reference', () => {
    const text = 'References\n1. Almond, R. P. (2017). Noise bursts. Journal, 12, 1-5.\n2. Dunmore, H. (2020). Sorting. Quarterly, 4, 33-49.\n1. A sensitivity analysis that left out six gave t(84) = 2.21, p = .030.\n';
    const region = references(text)!;
    const inside = text.slice(region.start, region.end);
    expect(inside).toContain('Dunmore');
    expect(inside).not.toContain('t(84)');
  });
});
