import { describe, expect, it } from 'vitest';
import { dehyphenate, pageAt, pdfDocument, resolvePdfEngine } from '../../src/documents/pdf.js';
import { findReferenceListRegions } from '../../src/documents/plainRegions.js';
import { DEMO_MANUSCRIPTS, demo, fixture, pdftotextMissing, pdftotextRequired, PDFTOTEXT_SKIP_REASON, readOk, regionAt, regionTexts } from './helpers.js';

if (pdftotextMissing && !pdftotextRequired) console.warn(`[tests/documents/pdf] ${PDFTOTEXT_SKIP_REASON}`);

describe('pdftotext availability', () => {
  // Defined only when asked for, so that an ordinary run shows no unexplained skip.
  if (pdftotextRequired) {
    it('pdftotext is on PATH (PLUMBLINE_REQUIRE_PDFTOTEXT=1)', () => {
      if (pdftotextMissing) expect.fail('PLUMBLINE_REQUIRE_PDFTOTEXT=1 but pdftotext is not on PATH: install poppler-utils');
    });
  }

  it('auto picks pdftotext exactly when it is installed', () => {
    expect(resolvePdfEngine('auto')).toBe(pdftotextMissing ? 'pdf-parse' : 'pdftotext');
    expect(resolvePdfEngine('pdf-parse')).toBe('pdf-parse');
  });
});

describe.each(['pdf-parse', 'pdftotext'] as const)('PDF reader with %s', (engine) => {
  const skip = engine === 'pdftotext' && pdftotextMissing;

  it.skipIf(skip)('keeps page boundaries for pageOf and joins a word hyphenated at a line end', async () => {
    const document = await readOk(fixture('two-pages.pdf'), { pdfEngine: engine });
    expect(document.format).toBe('pdf');
    expect(document.text).toContain('F(1, 20) = 5.00, p = .037, in their recognition\nscores');
    expect(document.pageOf(document.text.indexOf('F(1, 20)'))).toBe(1);
    expect(document.pageOf(document.text.indexOf('t(20) = 2.50'))).toBe(2);
    expect(document.text.split('\f')).toHaveLength(3);
  });

  it.skipIf(skip)('marks the reference list after its heading line', async () => {
    const document = await readOk(fixture('two-pages.pdf'), { pdfEngine: engine });
    expect(regionTexts(document, 'references')).toEqual(['Doe, J. (2020). An invented reference. Journal of Examples, 1, 1-2.']);
    expect(regionAt(document, document.text.indexOf('t(20)'))).toBe('body');
  });

  it.skipIf(skip)('reads the two-column demo PDF column by column', async () => {
    const document = await readOk(demo('orchard-noise-vigilance.pdf'), { pdfEngine: engine });
    // Sentences that run down the left column and on into the right one stay whole and in order.
    const order = ['We asked whether the intermittent noise of orchard\nmachinery harms', 'Participants\nNinety adults', 'In the steady condition a recorded machinery\nhum played at 68 dB(A)', 'Results\nA one-way analysis', 'r(88) = −.17, p = .011'];
    const positions = order.map((passage) => document.text.indexOf(passage));
    expect(positions.every((position) => position >= 0)).toBe(true);
    expect([...positions].sort((a, b) => a - b)).toEqual(positions);
  });

  it.skipIf(skip)('finds the pages of a multi-page demo PDF', async () => {
    const document = await readOk(demo(`${DEMO_MANUSCRIPTS[1]}.pdf`), { pdfEngine: engine });
    expect(document.pageOf(document.text.indexOf('Abstract'))).toBe(1);
    expect(document.pageOf(document.text.lastIndexOf('Quillon'))).toBe(2);
  });
});

describe('PDF text helpers', () => {
  it('de-hyphenates before a lower-case continuation only, moving the line break after the word', () => {
    expect(dehyphenate('the recog-\nnition of faces')).toBe('the recognition\nof faces');
    expect(dehyphenate('a chi-\nsquare test')).toBe('a chi-square\ntest');
    expect(dehyphenate('r(58) = -\n.32 and p-\nvalue')).toBe('r(58) = -\n.32 and p-\nvalue');
    expect(dehyphenate('Smith-\nJones')).toBe('Smith-\nJones');
    expect(dehyphenate('Smith-\nJones and well-\nknown')).toBe('Smith-\nJones and well-known');
  });

  it('maps offsets to 1-based pages and outside offsets to null', () => {
    const document = pdfDocument('x.pdf', ['one', 'two', 'three']);
    expect(document.text).toBe('one\n\ftwo\n\fthree\n\f');
    expect(document.pageOf(0)).toBe(1);
    expect(document.pageOf(4)).toBe(1);
    expect(document.pageOf(5)).toBe(2);
    expect(document.pageOf(document.text.indexOf('three'))).toBe(3);
    expect(document.pageOf(-1)).toBeNull();
    expect(pageAt([0, 10], 999, 20)).toBeNull();
  });

  it('takes the last "References" line and stops the list at an appendix', () => {
    const text = 'Contents\nReferences\nMethod\nReferences\nA. (2000).\nAppendix A\nMore';
    expect(findReferenceListRegions(text).map((region) => [region.kind, text.slice(region.start, region.end)])).toEqual([
      ['heading', 'References'],
      ['references', 'A. (2000).'],
    ]);
  });
});

describe('page furniture', async () => {
  const { withoutPageFurniture } = await import('../../src/documents/pdf.js');
  it('drops running heads and page numbers at page edges, never body text', () => {
    const pages = withoutPageFurniture([
      'Journal of Invented Findings 12\nIntro text, F(1, 39) = 0.09,\n1',
      'Journal of Invented Findings 13\nn.s.) and the rest.\n2',
      'Journal of Invented Findings 14\nJournal of Invented Findings is cited here.\nLast line\nPage 3 of 3',
    ]);
    expect(pages).toEqual(['Intro text, F(1, 39) = 0.09,', 'n.s.) and the rest.', 'Journal of Invented Findings is cited here.\nLast line']);
  });
  it('leaves a single page alone apart from a page number', () => {
    expect(withoutPageFurniture(['Title\nBody text\n7'])).toEqual(['Title\nBody text']);
  });
});
