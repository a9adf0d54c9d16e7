import { describe, expect, it } from 'vitest';
import { htmlToDocument } from '../../src/documents/html.js';
import { expectWellFormedRegions, fixture, readOk, regionAt, regionTexts } from './helpers.js';

describe('HTML reader', () => {
  it('keeps visible text, drops head, script and style, and flattens sub/superscripts in place', async () => {
    const document = await readOk(fixture('article.html'));
    expect(document.format).toBe('html');
    expect(document.text).toContain('F(2,\u00a057) = 4.12, p = .021, ηp2 = .13.[1]');
    expect(document.text).not.toContain('Head title is dropped');
    expect(document.text).not.toContain('99.0');
    expect(document.text).not.toContain('color: red');
    expect(document.pageOf(10)).toBeNull();
    expectWellFormedRegions(document);
  });

  it('reads a table with its caption paragraph before it and its note after it, once', async () => {
    const document = await readOk(fixture('article.html'));
    const table = document.tables[0]!;
    expect(table.caption).toBe('Table 2. Means by lamp colour');
    expect(table.notes).toEqual(['Note. Speeds in words per minute.']);
    expect(table.rows).toEqual([['Colour', 'Test'], ['Amber', 't(38) = 2.45, p = .019']]);
    expect(document.text.slice(table.start, table.end)).toBe('Table 2. Means by lamp colour\nColour | Test\nAmber | t(38) = 2.45, p = .019\nNote. Speeds in words per minute.');
    expect(document.text.split('Table 2. Means by lamp colour')).toHaveLength(2);
    expect(regionAt(document, document.text.indexOf('t(38)'))).toBe('table');
  });

  it('reads a table inside a figure with its figcaption and notes', async () => {
    const document = await readOk(fixture('article.html'));
    const table = document.tables[1]!;
    expect(table.caption).toBe('Table 3. Second table in a figure');
    expect(table.notes).toEqual(['Note. A figure note.']);
    expect(table.rows).toEqual([['Source', 'F'], ['Lamp', '4.12']]);
    expect(regionTexts(document, 'caption')).toEqual(['Table 2. Means by lamp colour', 'Table 3. Second table in a figure']);
  });

  it('marks headings, the reference list up to the next heading, and footnotes without their back-links', async () => {
    const document = await readOk(fixture('article.html'));
    expect(regionTexts(document, 'heading')).toEqual(['Invented Study of Lamp Colour', 'References', 'Appendix']);
    expect(regionTexts(document, 'references')).toEqual(['Penrose, Q. (2011). Lamps and reading. Invented Review, 2, 1–9.']);
    expect(regionAt(document, document.text.indexOf('Appendix text'))).toBe('body');
    expect(regionTexts(document, 'footnote')).toEqual(['Without outliers, r(58) = .31, p = .016.']);
    expect(document.text).not.toContain('↩');
  });

  it('turns <br> and block elements into line breaks and collapses other whitespace', () => {
    const document = htmlToDocument('<div>one\n   two<br>three</div><p>four</p><ul><li>five</li><li>six</li></ul>', 'inline.html', 'html');
    expect(document.text).toBe('one two\nthree\n\nfour\n\nfive\nsix\n\n');
  });

  it('marks a list with class "references" even without a heading, and keeps "[n]" apart from numbers', () => {
    const document = htmlToDocument('<p>p = .03<sup><a href="#fn2">2</a></sup></p><ol class="references"><li>Ref one.</li></ol>', 'inline.html', 'html');
    expect(document.text).toContain('p = .03[2]');
    expect(regionTexts(document, 'references')).toEqual(['Ref one.']);
  });
});
