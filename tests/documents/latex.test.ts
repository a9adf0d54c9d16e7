import { describe, expect, it } from 'vitest';
import { latexNesting, latexToDocument, readTabularRows, stripComments } from '../../src/documents/latex.js';
import { DocumentLimitError } from '../../src/documents/markupLimits.js';
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

describe('LaTeX nesting limit', () => {
  const nested = (depth: number, open: string, close: string): string => `${open.repeat(depth)}F(2, 57) = 4.21, p = .020.${close.repeat(depth)}`;

  it('counts environments, braces, \\( and \\[ as levels, and an environment\'s name as part of its \\begin', () => {
    expect(latexNesting('plain text')).toEqual({ depth: 0, opener: '' });
    expect(latexNesting(nested(3, '\\begin{quote}', '\\end{quote}'))).toEqual({ depth: 3, opener: '\\begin{quote}' });
    expect(latexNesting(nested(4, '\\frac{', '}{2}')).depth).toBe(4);
    expect(latexNesting(nested(2, '\\(', '\\)')).depth).toBe(2);
    expect(latexNesting('\\[ x \\] \\[ y \\]').depth).toBe(1);
    expect(latexNesting('\\begin{itemize}\\item \\emph{a} \\end{itemize}')).toEqual({ depth: 2, opener: '{' });
  });

  it('does not count escaped characters, a line break\'s spacing or a command that only starts like \\begin', () => {
    expect(latexNesting('\\{ \\{ \\{ a 5\\% rise').depth).toBe(0);
    expect(latexNesting('a \\\\[2pt] b \\\\ c').depth).toBe(0);
    expect(latexNesting('\\beginning \\endnote').depth).toBe(0);
    expect(latexNesting('} } { \\end{x}').depth).toBe(1); // unbalanced closers never go below zero
  });

  it('stops counting once past the limit', () => {
    expect(latexNesting(nested(100_000, '{', '}'), 10).depth).toBe(11);
  });

  it('reads a document nested up to the limit and refuses one level more, naming the limit', () => {
    const document = (depth: number): string => `\\begin{document}\n${nested(depth, '\\begin{quote}', '\\end{quote}')}\n\\end{document}\n`;
    expect(latexToDocument(document(49), 'at-limit.tex', null, { maxNestingDepth: 50 }).text).toContain('F(2, 57) = 4.21, p = .020.');
    expect(() => latexToDocument(document(50), 'over.tex', null, { maxNestingDepth: 50 })).toThrow(DocumentLimitError);
    expect(() => latexToDocument(document(50), 'over.tex', null, { maxNestingDepth: 50 })).toThrow(
      /^too deeply nested: LaTeX environments and groups nested more than 50 deep \(at \\begin\{quote\}\) \(limit maxNestingDepth = 50 levels; raise it with --limit maxNestingDepth=<n>/,
    );
  });

  it('checks the .bbl beside the document too', () => {
    expect(() => latexToDocument('\\bibliography{refs}', 'paper.tex', nested(60, '{', '}'), { maxNestingDepth: 50 })).toThrow(/^too deeply nested/);
  });

  it('100,000 nested environments are refused in well under a second', () => {
    const started = performance.now();
    expect(() => latexToDocument(nested(100_000, '\\begin{quote}', '\\end{quote}'), 'deep.tex')).toThrow(/^too deeply nested: .* more than 1,000 deep \(at \\begin\{quote\}\)/);
    expect(performance.now() - started).toBeLessThan(1000);
  });

  it('a source within the limit that still exhausts the stack is refused with the same words', () => {
    // A tabular inside a footnote, 497 times: about 1,000 levels, each taking many calls.
    const source = `\\begin{document}\n${nested(497, '\\footnote{\\begin{tabular}{l} ', '\\end{tabular}}')}\n\\end{document}\n`;
    // Whether it fits depends on the thread's stack (a worker thread's is larger): either outcome is checked in full.
    let outcome: string;
    try {
      outcome = latexToDocument(source, 'stack.tex').text;
    } catch (error) {
      expect(error).toBeInstanceOf(DocumentLimitError);
      outcome = (error as Error).message;
    }
    expect(outcome).toMatch(/^too deeply nested: LaTeX environments and groups nested 996 deep, more than the reader can follow|F\(2, 57\) = 4\.21, p = \.020\./);
  });
});
