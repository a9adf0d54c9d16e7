import { describe, expect, it } from 'vitest';
import { latexToDocument, readTabularRows, stripComments } from '../../src/documents/latex.js';
import { expectWellFormedRegions, fixture, readOk, regionAt, regionTexts } from './helpers.js';

describe('LaTeX reader', () => {
  it('drops comments and the preamble but keeps the title', async () => {
    const document = await readOk(fixture('article.tex'));
    expect(document.format).toBe('latex');
    expect(document.text).not.toContain('99.0');
    expect(document.text).not.toContain('amsmath');
    expect(regionTexts(document, 'heading')[0]).toBe('Invented Study of Lamp Colour');
    expectWellFormedRegions(document);
  });

  it('keeps math as its content with symbols written out', async () => {
    const document = await readOk(fixture('article.tex'));
    expect(document.text).toContain('F(2, 57) = 4.12, p = .021, ηp2 = .13.');
    expect(document.text).toContain('χ2(1, N = 60) = 5.40, p = .020');
    expect(document.text).toContain('all ps <= .05; the ratio was 2 × 3 (pages 10--12). Costs rose by 5%.');
  });

  it('writes a footnote as its own block after its paragraph', async () => {
    const document = await readOk(fixture('article.tex'));
    expect(regionTexts(document, 'footnote')).toEqual(['Without outliers, r(58) = .31, p = .016.']);
    expect(document.text.indexOf('Without outliers')).toBeGreaterThan(document.text.indexOf('Costs rose'));
  });

  it('reads a table float: numbered caption, tabular rows (rules and \\multicolumn read through), notes', async () => {
    const document = await readOk(fixture('article.tex'));
    expect(document.tables).toHaveLength(1);
    const table = document.tables[0]!;
    expect(table.caption).toBe('Table 1. Analysis of variance of reading speed');
    expect(table.rows).toEqual([
      ['Source', 'df', 'F', 'ηp2'],
      ['Lamp', '2', '4.12', '.13'],
      ['Error', '57', '', ''],
      ['Pairwise', 't(38) = 2.45, p = .019', ''],
    ]);
    expect(table.notes).toEqual(['Note. Speeds in words per minute.']);
    expect(regionAt(document, document.text.indexOf('t(38)'))).toBe('table');
  });

  it('marks thebibliography as references under a References heading', async () => {
    const document = await readOk(fixture('article.tex'));
    expect(regionTexts(document, 'references')).toEqual(['Penrose, Q. (2011). Lamps and reading. Invented Review, 2, 1--9.']);
    expect(regionTexts(document, 'heading')).toContain('References');
  });

  it('strips "%" comments but not "\\%"', () => {
    expect(stripComments('a 5\\% rise % hidden\nnext')).toBe('a 5\\% rise next');
  });

  it('splits rows on \\\\ and cells on & but not on \\& or inside braces', () => {
    // An & inside a brace group does not end the cell; as text it reads as a space, as in any LaTeX text.
    expect(readTabularRows('A \\& B & {x & y} \\\\ \\hline 1 & 2 \\\\[2pt] ')).toEqual([['A & B', 'x y'], ['1', '2']]);
  });

  it('reads \\section titles as headings and a References section as the reference list', () => {
    const document = latexToDocument('\\section{Method}\nText.\n\\section*{References}\nDoe (2020).\n', 'inline.tex');
    expect(regionTexts(document, 'heading')).toEqual(['Method', 'References']);
    expect(regionTexts(document, 'references')).toEqual(['Doe (2020).']);
  });
});
