import { rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { latexToDocument, stripComments, stripCommentsMapped } from '../../src/documents/latex.js';
import { OffsetMap } from '../../src/documents/sourceMap.js';
import { builtCliExists, plumbline, reportOf, temporaryFolder } from '../batch/cli.js';

/**
 * A LaTeX file's results are reported at the file's lines: the reader's
 * text drops comments, the preamble and markup and moves footnotes, and
 * results used to be reported at the line of that text (a result on line 5
 * of the file at line 3). Expected places are found in the source itself
 * (the line holding the result and the column of its first character).
 */

const LAMP = String.raw`\documentclass{article}
% Results of the invented lamp study; F(9, 9) = 99.0 in a comment is not read
\usepackage{amsmath}
\begin{document}

\section{Results}
% A comment line before the paragraph
% and a second one, right after the first
The colour of the lamp changed reading speed,
$F(2, 57) = 4.12$, $p = .021$.

\begin{quote}
  Amber light differed from white, % a comment inside the paragraph
  $\chi^2(1, N = 60) = 5.40$, $p = .020$.
\end{quote}

\begin{itemize}
  \item Younger readers, $t(38) = 2.45$, $p = .019$.\footnote{Without the
  outliers, $r(58) = .31$, $p = .016$.}
\end{itemize}

\begin{table}[t]
\caption{Analysis of variance of reading speed}
\begin{tabular}{lrrrrr}
\toprule
Source & SS & df & MS & $F$ & $p$ \\ \midrule
% the effect row
Lamp & 24.60 & 1 & 24.60 & 6.15 & .016 \\
Error & 228.00 & 57 & 4.00 & & \\
\bottomrule
\end{tabular}
\end{table}

Finally, $F(1, 40) = 7.20$, $p = .010$.
\end{document}
`;

/** The 1-based line of the source that holds `marker`, and the column where `startsAt` begins on it. */
function placeIn(source: string, marker: string, startsAt = marker): { line: number; column: number } {
  const lines = source.split(/\r?\n/);
  const index = lines.findIndex((line) => line.includes(marker));
  if (index === -1) throw new Error(`test: "${marker}" is not in the source`);
  return { line: index + 1, column: lines[index]!.indexOf(startsAt) + 1 };
}

/** Where the reader reports the first occurrence of `text` in its own text. */
function reported(source: string, text: string): { line: number; column: number } {
  const document = latexToDocument(source, 'lamp.tex');
  const offset = document.text.indexOf(text);
  if (offset === -1) throw new Error(`test: "${text}" is not in the converted text`);
  return document.lineOf!(offset);
}

describe('LaTeX: lines and columns of the .tex file', () => {
  it('a result after comments, \\begin{document}, a section and blank lines', () => {
    expect(reported(LAMP, 'F(2, 57)')).toEqual(placeIn(LAMP, '$F(2, 57)', 'F(2, 57)'));
    expect(placeIn(LAMP, '$F(2, 57)').line).toBe(10);
  });

  it('a result in an environment, after a comment that hid a line break', () => {
    // "\chi^2" is written "χ2": the result starts where the command does.
    expect(reported(LAMP, 'χ2(1, N = 60)')).toEqual(placeIn(LAMP, '\\chi^2(1', '\\chi'));
  });

  it('a result in a list item, and one on the second line of its footnote (written after the paragraph)', () => {
    expect(reported(LAMP, 't(38)')).toEqual(placeIn(LAMP, 't(38)'));
    expect(reported(LAMP, 'r(58)')).toEqual(placeIn(LAMP, 'r(58)'));
  });

  it('table rows, after a comment inside the tabular, and the caption', () => {
    expect(reported(LAMP, 'Lamp | 24.60')).toEqual(placeIn(LAMP, 'Lamp & 24.60', 'Lamp'));
    expect(reported(LAMP, 'Error | 228.00')).toEqual(placeIn(LAMP, 'Error & 228.00', 'Error'));
    expect(reported(LAMP, '6.15')).toEqual(placeIn(LAMP, 'Lamp & 24.60', '6.15'));
    expect(reported(LAMP, 'Analysis of variance')).toEqual(placeIn(LAMP, '\\caption{Analysis', 'Analysis'));
  });

  it('the last result, and the section heading', () => {
    expect(reported(LAMP, 'F(1, 40)')).toEqual(placeIn(LAMP, 'F(1, 40)'));
    expect(reported(LAMP, 'Results')).toEqual(placeIn(LAMP, '\\section{Results}', 'Results'));
  });

  it('lines ending in \\r\\n count as the file counts them', () => {
    const windows = LAMP.replace(/\n/g, '\r\n');
    expect(reported(windows, 'F(1, 40)')).toEqual(placeIn(LAMP, 'F(1, 40)'));
    expect(reported(windows, 'Lamp | 24.60')).toEqual(placeIn(LAMP, 'Lamp & 24.60', 'Lamp'));
  });

  it('a .bbl, another file, is placed at the \\bibliography command', () => {
    const source = 'Text, $F(1, 20) = 4.50$, $p = .046$.\n\n\\bibliography{refs}\n';
    const document = latexToDocument(source, 'paper.tex', '\\begin{thebibliography}{1}\n\\bibitem{a}\nA. (2000). F(1, 2) = 3.\n\\end{thebibliography}');
    expect(document.lineOf!(document.text.indexOf('A. (2000)'))).toMatchObject({ line: 3 });
    expect(document.lineOf!(document.text.indexOf('F(1, 20)'))).toEqual({ line: 1, column: 8 });
  });

  it('the converted text itself is what it was: comments, markup and the preamble are not in it', () => {
    const document = latexToDocument(LAMP, 'lamp.tex');
    expect(document.text).not.toContain('%');
    expect(document.text).not.toContain('second one');
    expect(document.text).not.toContain('99.0');
    expect(document.tables[0]!.rows[1]).toEqual(['Lamp', '24.60', '1', '24.60', '6.15', '.016']);
  });
});

describe('LaTeX comments', () => {
  it('a comment line right after another is removed too (the second was kept as text)', () => {
    expect(stripComments('a\n% one\n% two\nb')).toBe('a\nb');
    expect(stripComments('%first\n%second\n  % third\nz')).toBe('z');
  });

  it('"\\%" is text; "\\\\%" is an escaped backslash and then a comment', () => {
    expect(stripComments('a 5\\% rise % hidden\nnext')).toBe('a 5\\% rise next');
    expect(stripComments('x\\\\% c\ny')).toBe('x\\\\y');
    expect(stripComments('x\\\\\\% kept\ny')).toBe('x\\\\\\% kept\ny');
  });

  it('maps every character of the text without comments back to its place in the source', () => {
    const source = 'ab % one\n  cd\n% two\n%three\nef';
    const { text, map } = stripCommentsMapped(source);
    expect(text).toBe('ab cd\nef');
    for (let offset = 0; offset < text.length; offset += 1) expect(source[map.sourceOffsetOf(offset)!], `offset ${offset}`).toBe(text[offset]);
  });
});

describe('OffsetMap', () => {
  it('maps within a copy, not past it, and joins a copy that goes on at the same distance', () => {
    const map = new OffsetMap();
    map.add(0, 10, 3); // "abc" copied from 10
    map.add(4, 20); // a symbol written out for a command at 20
    map.add(5, 21, 2); // continues at the same distance: joined
    expect(map.sourceOffsetOf(2)).toBe(12);
    expect(map.sourceOffsetOf(3)).toBe(13); // the end of the copy
    expect(map.sourceOffsetOf(4)).toBe(20);
    expect(map.sourceOffsetOf(6)).toBe(22);
    expect(map.sourceOffsetOf(100)).toBe(23); // not past the joined copy
    expect(new OffsetMap().sourceOffsetOf(5)).toBeNull();
  });
});

describe('LaTeX lines in the built command', () => {
  const folder = temporaryFolder('latex-lines');
  afterAll(() => rmSync(folder, { recursive: true, force: true }));
  writeFileSync(join(folder, 'lamp.tex'), LAMP);

  it('the built command exists', () => {
    expect(builtCliExists(), 'run npm run build first').toBe(true);
  });

  it('JSON gives each result, in text and in the table, at its line of the .tex file', () => {
    const run = plumbline(['scan', 'lamp.tex', '--format', 'json', '--no-cache', '-q'], folder);
    expect(run.status, run.stderr).toBe(0);
    const places = reportOf(run).documents[0]!.statistics.map((s) => [s.text.replace(/\s*\|\s*/g, ' ').slice(0, 12), s.location.line, s.location.column]);
    expect(places).toEqual([
      ['F(2, 57) = 4', 10, 2],
      ['χ2(1, N = 60', 14, 4],
      ['t(38) = 2.45', 18, 27],
      ['r(58) = .31,', 19, 14],
      ['Lamp 24.60 1', 28, 1],
      ['F(1, 40) = 7', 34, 11],
    ]);
  });

  it('the console report says "line 10:2" for the first result', () => {
    const run = plumbline(['scan', 'lamp.tex', '--all', '--no-cache', '-q'], folder);
    expect(run.stdout).toMatch(/line 10:2 +ok +F\(2, 57\) = 4\.12/);
    expect(run.stdout).toMatch(/line 28:1 +ok +Lamp/);
  });
});
