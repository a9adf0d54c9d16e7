import { rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { builtCliExists, plumbline, reportOf, temporaryFolder } from '../batch/cli.js';

/**
 * The LaTeX nesting limit (maxNestingDepth, src/documents/latex.ts), in the
 * built command: 100,000 nested environments, braces or \( ran for minutes
 * or exhausted the stack; each now ends at once as its document's
 * "too deeply nested" unreadable row, and the other documents are audited.
 */

const folder = temporaryFolder('latex-nesting');
afterAll(() => rmSync(folder, { recursive: true, force: true }));

const RESULT = 'Dose affected recall, F(2, 57) = 4.21, p = .020.'; // p = .0197 (SciPy 1.10.1 f.sf)

/** A LaTeX document whose result sits `depth` levels deep inside `open` ... `close`. */
function nestedDocument(depth: number, open: string, close: string): string {
  return `\\documentclass{article}\n\\begin{document}\n${open.repeat(depth)}${RESULT}${close.repeat(depth)}\n\\end{document}\n`;
}

writeFileSync(join(folder, 'environments.tex'), nestedDocument(100_000, '\\begin{quote}', '\\end{quote}'));
writeFileSync(join(folder, 'mixed.tex'), nestedDocument(50_000, '\\begin{itemize}\\item \\begin{center}', '\\end{center}\\end{itemize}'));
writeFileSync(join(folder, 'braces.tex'), nestedDocument(100_000, '\\frac{', '}{2}'));
writeFileSync(join(folder, 'math.tex'), nestedDocument(100_000, '\\(', '\\)'));
// Within the limit (the document environment is one level): read as usual.
writeFileSync(join(folder, 'within.tex'), nestedDocument(998, '\\begin{quote}', '\\end{quote}'));
// Within the limit, but a tabular in a footnote takes so many calls per level that the main thread's stack runs out.
writeFileSync(join(folder, 'stack.tex'), nestedDocument(497, '\\footnote{\\begin{tabular}{l} ', '\\end{tabular}}'));
writeFileSync(join(folder, 'plain.txt'), `${RESULT}\n`);

const OVER_LIMIT = /^too deeply nested: LaTeX environments and groups nested more than 1,000 deep \(at (\\begin\{(quote|itemize|center)\}|\{|\\\()\) \(limit maxNestingDepth = 1,000 levels; raise it with --limit maxNestingDepth=<n>/;

describe('LaTeX nested past the limit, in the built command', () => {
  it('the built command exists', () => {
    expect(builtCliExists(), 'run npm run build first').toBe(true);
  });

  for (const jobs of ['1', '2']) {
    it(`100,000 nested environments, braces and \\( end within seconds as "too deeply nested" rows; the rest is audited (--jobs ${jobs})`, () => {
      const started = Date.now();
      const run = plumbline(['scan', '.', '--format', 'json', '-q', '--no-cache', '--jobs', jobs], folder);
      const seconds = (Date.now() - started) / 1000;
      expect(run.status).toBe(2); // unreadable documents
      expect(seconds).toBeLessThan(20); // it ran past 300 s
      const byPath = new Map(reportOf(run).documents.map((document) => [document.path, document]));
      for (const name of ['environments.tex', 'mixed.tex', 'braces.tex', 'math.tex']) {
        expect(byPath.get(name), name).toMatchObject({ status: 'unreadable', error: expect.stringMatching(OVER_LIMIT) });
      }
      expect(byPath.get('within.tex')).toMatchObject({ status: 'checked', statistics: [expect.objectContaining({ text: 'F(2, 57) = 4.21, p = .020' })] });
      expect(byPath.get('plain.txt')).toMatchObject({ status: 'checked', statistics: [expect.anything()] });
    });
  }

  it('a document within the limit that still exhausts the main thread\'s stack is refused with the same words, not as a fault', () => {
    const run = plumbline(['scan', 'stack.tex', '--format', 'json', '-q', '--no-cache', '--jobs', '1'], folder);
    expect(run.status).toBe(2);
    expect(reportOf(run).documents[0]!.error).toMatch(/^too deeply nested: LaTeX environments and groups nested 996 deep, more than the reader can follow/);
  });

  it('the text report says so, and --limit maxNestingDepth changes the limit', () => {
    const text = plumbline(['scan', 'environments.tex', '-q', '--no-cache'], folder);
    expect(text.stdout).toContain('environments.tex\n  unreadable: too deeply nested: LaTeX environments and groups nested more than 1,000 deep (at \\begin{quote})');
    const lowered = plumbline(['scan', 'within.tex', '-q', '--no-cache', '--limit', 'maxNestingDepth=500', '--format', 'json'], folder);
    expect(reportOf(lowered).documents[0]!.error).toMatch(/^too deeply nested: .* more than 500 deep/);
  });
});
