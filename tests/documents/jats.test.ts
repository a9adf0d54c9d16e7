import { describe, expect, it } from 'vitest';
import { jatsToDocument } from '../../src/documents/jats.js';
import { expectWellFormedRegions, fixture, readOk, regionAt, regionTexts } from './helpers.js';

describe('JATS reader', () => {
  it('reads the article title and abstract but not the rest of the front matter', async () => {
    const document = await readOk(fixture('article.xml'));
    expect(document.format).toBe('jats');
    expect(document.text.startsWith('Invented Study of Lamp Colour\n\nLamp colour mattered, F(2, 57) = 4.12, p = .021.')).toBe(true);
    expect(document.text).not.toContain('Dropped');
    expect(document.text).not.toContain('10.0000');
    expectWellFormedRegions(document);
  });

  it('flattens italic, sub and superscripts in place and writes footnote cross-references as [n]', async () => {
    const document = await readOk(fixture('article.xml'));
    expect(document.text).toContain('r(58) = .31, p = .016, ηp2 = .13.[1]');
  });

  it('reads table-wrap: label and caption, rows, and table-wrap-foot as notes', async () => {
    const document = await readOk(fixture('article.xml'));
    expect(document.tables).toHaveLength(1);
    const table = document.tables[0]!;
    expect(table.caption).toBe('Table 1. Analysis of variance of reading speed');
    expect(table.rows).toEqual([['Source', 'df', 'F'], ['Lamp', '2', '4.12'], ['Error', '57', '']]);
    expect(table.notes).toEqual(['Note. Speeds in words per minute.']);
    expect(document.text.slice(table.start, table.end)).toContain('Lamp | 2 | 4.12');
    expect(regionAt(document, document.text.indexOf('Lamp | 2'))).toBe('table');
  });

  it('marks the ref-list as references (structured citations spaced) and fn-group footnotes', async () => {
    const document = await readOk(fixture('article.xml'));
    expect(regionTexts(document, 'references')).toEqual(['Penrose, Q. (2011). Lamps and reading. Invented Review, 2, 1–9.\nQuill A 2015 Light']);
    expect(regionTexts(document, 'footnote')).toEqual(['1 Without outliers, t(38) = 2.45, p = .019.']);
    expect(regionTexts(document, 'heading')).toEqual(['Invented Study of Lamp Colour', 'Results', 'References']);
  });

  it('refuses XML that is not a JATS article, naming its root element', () => {
    const outcome = jatsToDocument('<?xml version="1.0"?><rss><channel/></rss>', 'feed.xml');
    expect(outcome).toEqual({ ok: false, error: 'XML, but not a JATS article (the root element is <rss>, not <article>)' });
  });
});
