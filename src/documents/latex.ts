import { REFERENCE_HEADING, TextBuilder } from './builder.js';
import { OffsetMap } from './sourceMap.js';
import { collapseWhitespace, writeTable, type TableDraft } from './tables.js';
import type { DocumentText } from './types.js';
import { DocumentLimitError } from './markupLimits.js';
import { defaultLimits, limitHint, type Limits } from '../limits.js';
import { createLineIndex } from '../scan/lines.js';
import { appendAll } from '../arrays.js';

/**
 * LaTeX reader, hand-written on purpose: a real LaTeX "parser" has to run
 * TeX's macro expansion, and the packages on npm that claim to parse LaTeX
 * either do that partially and slowly or only tokenise. A manuscript's
 * results live in ordinary text, math and tabular environments, which a
 * small reader with a fixed table of commands gets right.
 *
 * Keeps: text; section titles (as headings); \emph, \textbf and friends as
 * their content; math as its content with symbols written out (\eta_p^2 ->
 * ηp2, \chi^2 -> χ2, \leq -> <=, \geq -> >=, \times -> ×, "--" kept);
 * tabular environments as tables (rows split on \\, cells on &, rules and
 * \multicolumn read through) with the float's \caption and its other text
 * (or tablenotes) as notes; figure captions; footnotes, written as their own
 * block after the paragraph that holds them; the bibliography
 * (thebibliography, or the .bbl file next to the .tex for \bibliography{...})
 * under a "References" heading.
 *
 * Drops: comments, the preamble (except \title), labels, spacing and font
 * size commands, \includegraphics, verbatim-like and comment environments'
 * markup. An unknown command is dropped and its braced arguments are read
 * as ordinary text, so nothing a reader can see is lost.
 *
 * Lines: the text is not the file's (comments, the preamble and markup go,
 * footnotes move), so the converter tells the builder where each piece of
 * text comes from, and `lineOf` gives a result's line and column in the
 * .tex file: through that map, then through the map of the comments
 * removed. A table cell, caption, note, or a word of a footnote or heading
 * maps to where it starts; the bibliography read from the .bbl, another
 * file, to the \bibliography command.
 */
export function latexToDocument(source: string, path: string, bibliography: string | null = null, limits: Pick<Limits, 'maxNestingDepth'> = defaultLimits): DocumentText {
  const { text: withoutComments, map: commentMap } = stripCommentsMapped(source);
  // The converter follows each nested environment and group by recursion: the depth is checked first, in one pass.
  const depth = checkNesting(withoutComments, limits.maxNestingDepth);
  if (bibliography !== null) checkNesting(stripComments(bibliography), limits.maxNestingDepth);
  const { preamble, body, bodyStart } = splitPreamble(withoutComments);
  const title = readCommandArgument(preamble, 'title');
  const converter = new LatexConverter(new TextBuilder({ sourceMap: true }), bibliography);
  try {
    if (title !== null && !/\\maketitle\b/.test(body)) converter.writeHeading(title.content, 0, (index) => title.start + index);
    converter.title = title;
    converter.run(body, { offset: bodyStart, pinned: false });
    converter.finishDocument();
  } catch (error) {
    if (isStackOverflow(error)) throw new DocumentLimitError(stackExhaustedMessage(depth));
    throw error;
  }
  const builder = converter.builder;
  const fileLines = createLineIndex(source);
  const lineOf = (offset: number): { line: number; column: number } => {
    const withoutCommentsOffset = builder.sourceOffsetOf(offset) ?? 0;
    return fileLines(commentMap.sourceOffsetOf(withoutCommentsOffset) ?? withoutCommentsOffset);
  };
  return { path, format: 'latex', text: builder.text(), pageOf: () => null, lineOf, regions: builder.regions(), tables: builder.tables };
}

/**
 * Where the piece of source being converted sits in the text without
 * comments: it starts at `offset`; or, `pinned`, all of it maps to
 * `offset` (a .bbl, which is another file, maps to its \bibliography).
 */
type Origin = { offset: number; pinned: boolean } | null;

/** Where each index of a piece of LaTeX sits in the text without comments (null: not known). */
type Place = (index: number) => number | null;

/** The deepest point of a LaTeX source's nesting: how deep, and what opened that level (for the message). */
export interface LatexNesting {
  depth: number;
  /** The opener at the deepest point: "{", "\\(", "\\[" or "\\begin{name}". */
  opener: string;
}

/**
 * How deeply a LaTeX source nests, in one pass: every \begin, brace, \( and
 * \[ opens a level and every \end, closing brace, \) and \] closes one (the
 * braces around an environment's name belong to its \begin or \end). The
 * converter reads each of these levels by a recursive call, so a source
 * nested 100,000 deep would exhaust the stack, after minutes of scanning
 * each level's body again. Escaped characters ("\{", "\%") open nothing.
 * Stops as soon as the depth passes `stopAbove`, so a hostile source costs
 * no more than the pass up to that point.
 */
export function latexNesting(source: string, stopAbove = Number.POSITIVE_INFINITY): LatexNesting {
  let depth = 0;
  let deepest: LatexNesting = { depth: 0, opener: '' };
  const open = (opener: string): void => {
    depth += 1;
    if (depth > deepest.depth) deepest = { depth, opener };
  };
  for (let index = 0; index < source.length && deepest.depth <= stopAbove; index += 1) {
    const code = source.charCodeAt(index);
    if (code === 0x7b /* { */) open('{');
    else if (code === 0x7d /* } */) depth = Math.max(0, depth - 1);
    else if (code === 0x5c /* \ */) {
      const next = source[index + 1];
      if (next === '(' || next === '[') open(`\\${next}`);
      else if (next === ')' || next === ']') depth = Math.max(0, depth - 1);
      else if (source.startsWith('begin', index + 1) && !isLetter(source.charCodeAt(index + 6))) {
        const after = afterEnvironmentName(source, index + 6);
        open(source.slice(index, after));
        index = after - 1;
        continue;
      } else if (source.startsWith('end', index + 1) && !isLetter(source.charCodeAt(index + 4))) {
        depth = Math.max(0, depth - 1);
        index = afterEnvironmentName(source, index + 4) - 1;
        continue;
      }
      index += 1; // the escaped character, or the first letter of the command name
    }
  }
  return deepest;
}

const ENVIRONMENT_NAME = /\{[^{}\\]{1,60}\}/y;

/**
 * Past the "{name}" right after \begin or \end: it is part of the opener,
 * not a level of its own. Only a plain name is passed over (no braces or
 * backslashes, at most 60 characters); anything else is counted as it
 * comes, so a malformed name cannot hide the levels after it.
 */
function afterEnvironmentName(source: string, at: number): number {
  ENVIRONMENT_NAME.lastIndex = at;
  return ENVIRONMENT_NAME.test(source) ? ENVIRONMENT_NAME.lastIndex : at;
}

function isLetter(code: number): boolean {
  return (code >= 0x41 && code <= 0x5a) || (code >= 0x61 && code <= 0x7a) || code === 0x40; // A-Z, a-z, @ (as in command names)
}

/**
 * Refuses a source nested deeper than the limit (DocumentLimitError, which
 * readDocument turns into the document's unreadable row); returns the depth
 * otherwise.
 */
function checkNesting(source: string, maxNestingDepth: number): number {
  const nesting = latexNesting(source, maxNestingDepth);
  if (nesting.depth > maxNestingDepth) {
    throw new DocumentLimitError(
      `too deeply nested: LaTeX environments and groups nested more than ${maxNestingDepth.toLocaleString('en-US')} deep (at ${nesting.opener}) ${limitHint('maxNestingDepth', maxNestingDepth)}`,
    );
  }
  return nesting.depth;
}

function isStackOverflow(error: unknown): boolean {
  return error instanceof RangeError && /call stack/i.test(error.message);
}

/**
 * Some constructs take many calls per level (a tabular inside a footnote
 * inside a tabular ...), so a source within the nesting limit can still
 * exhaust the stack, on the main thread above all, whose stack is the
 * smallest. The depth check has already bounded the time this takes; the
 * document is refused with the same words as one over the limit, and
 * raising the limit would not help.
 */
function stackExhaustedMessage(depth: number): string {
  return `too deeply nested: LaTeX environments and groups nested ${depth.toLocaleString('en-US')} deep, more than the reader can follow with this combination of environments`;
}

/** Removes "%..." comments (not "\%") together with the line break they hide, as TeX does. */
export function stripComments(source: string): string {
  return stripCommentsMapped(source).text;
}

/** stripComments, with the map from the text without comments back to the source. */
export function stripCommentsMapped(source: string): { text: string; map: OffsetMap } {
  return removeRanges(source, commentRanges(source));
}

/**
 * Where the comments are, in one pass, as TeX reads them: a "%" that is not
 * escaped, to the end of its line, with the line break and the next line's
 * indent. A backslash escapes the character after it, so "\%" is text and
 * "\\%" an escaped backslash and then a comment. A comment may follow right
 * after another one's line. A loop, like latexNesting: linear whatever the
 * input, where a pattern for "a % after an even number of backslashes"
 * needs a look-behind or backtracking.
 */
function commentRanges(source: string): [number, number][] {
  const ranges: [number, number][] = [];
  for (let index = 0; index < source.length; index += 1) {
    const code = source.charCodeAt(index);
    if (code === 0x5c /* \ */) {
      index += 1; // the escaped character
      continue;
    }
    if (code !== 0x25 /* % */) continue;
    const lineEnd = source.indexOf('\n', index);
    let end = lineEnd === -1 ? source.length : lineEnd + 1;
    while (end < source.length && (source[end] === ' ' || source[end] === '\t')) end += 1;
    ranges.push([index, end]);
    index = end - 1;
  }
  return ranges;
}

function splitPreamble(source: string): { preamble: string; body: string; bodyStart: number } {
  const begin = source.indexOf('\\begin{document}');
  if (begin === -1) return { preamble: '', body: source, bodyStart: 0 };
  const end = source.indexOf('\\end{document}', begin);
  const bodyStart = begin + '\\begin{document}'.length;
  return { preamble: source.slice(0, begin), body: source.slice(bodyStart, end === -1 ? undefined : end), bodyStart };
}

/** The braced argument of the first \command in `source`, and where its content starts. */
function readCommandArgument(source: string, command: string): { content: string; start: number } | null {
  const match = new RegExp(`\\\\${command}\\*?\\s*(?:\\[[^\\][]*\\]\\s*)?\\{`).exec(source);
  if (!match) return null;
  const open = match.index + match[0].length - 1;
  const group = readBalanced(source, open, '{', '}');
  return group ? { content: group.content, start: open + 1 } : null;
}

/** The content of a balanced group starting at `open` (which must hold the opening character). */
export function readBalanced(source: string, open: number, opener: string, closer: string): { content: string; end: number } | null {
  if (source[open] !== opener) return null;
  let depth = 0;
  for (let index = open; index < source.length; index += 1) {
    const char = source[index];
    if (char === '\\') {
      index += 1;
      continue;
    }
    if (char === opener) depth += 1;
    else if (char === closer) {
      depth -= 1;
      if (depth === 0) return { content: source.slice(open + 1, index), end: index + 1 };
    }
  }
  return { content: source.slice(open + 1), end: source.length };
}

/** Symbols written the same in text and math. */
const SYMBOLS: Record<string, string> = {
  alpha: 'α', beta: 'β', gamma: 'γ', delta: 'δ', epsilon: 'ε', varepsilon: 'ε', zeta: 'ζ', eta: 'η', theta: 'θ', iota: 'ι', kappa: 'κ', lambda: 'λ', mu: 'μ', nu: 'ν', xi: 'ξ', pi: 'π', rho: 'ρ', sigma: 'σ', tau: 'τ', upsilon: 'υ', phi: 'φ', varphi: 'φ', chi: 'χ', psi: 'ψ', omega: 'ω',
  Gamma: 'Γ', Delta: 'Δ', Theta: 'Θ', Lambda: 'Λ', Xi: 'Ξ', Pi: 'Π', Sigma: 'Σ', Phi: 'Φ', Psi: 'Ψ', Omega: 'Ω',
  leq: '<=', le: '<=', geq: '>=', ge: '>=', neq: '≠', ne: '≠', lt: '<', gt: '>', times: '×', pm: '±', mp: '∓', cdot: '·', approx: '≈', sim: '~', infty: '∞', prime: "'",
  ldots: '...', dots: '...', cdots: '...', textendash: '--', textemdash: '---', textminus: '−', textless: '<', textgreater: '>', textasciitilde: '~', S: '§', P: '¶', LaTeX: 'LaTeX', TeX: 'TeX', textpercent: '%', ss: 'ß',
};

/** Commands whose arguments are content: the command itself writes nothing. */
const TRANSPARENT = new Set(['emph', 'textit', 'textbf', 'textsc', 'textrm', 'textsf', 'texttt', 'textup', 'textmd', 'textnormal', 'underline', 'uline', 'mbox', 'hbox', 'fbox', 'text', 'mathrm', 'mathit', 'mathbf', 'mathsf', 'mathtt', 'mathcal', 'boldsymbol', 'bm', 'operatorname', 'textsuperscript', 'textsubscript', 'ensuremath', 'mathnormal']);

/** Commands dropped together with their arguments: how many braced arguments each takes. */
const DROPPED_WITH_ARGUMENTS: Record<string, number> = {
  label: 1, index: 1, vspace: 1, hspace: 1, setlength: 2, addtolength: 2, setcounter: 2, addtocounter: 2, includegraphics: 1, usepackage: 1, documentclass: 1,
  bibliographystyle: 1, thanks: 1, author: 1, date: 1, title: 1, cline: 1, cmidrule: 1, pagestyle: 1, thispagestyle: 1, input: 1, include: 1, newcommand: 2, renewcommand: 2,
  providecommand: 2, DeclareMathOperator: 2, newenvironment: 3, renewenvironment: 3, color: 1, definecolor: 3, hypersetup: 1, url: 1, graphicspath: 1, keywords: 1, affil: 1, affiliation: 1, email: 1,
  rule: 2, raisebox: 1, phantom: 1, hphantom: 1, vphantom: 1, linespread: 1, fontsize: 2, selectfont: 0, arraystretch: 0, extracolsep: 1,
};

const SECTION_LEVEL: Record<string, number> = { part: 0, chapter: 1, section: 2, subsection: 3, subsubsection: 4, paragraph: 5, subparagraph: 6 };
const CITATIONS = new Set(['cite', 'citep', 'citet', 'citealp', 'citealt', 'citeauthor', 'citeyear', 'citeyearpar', 'parencite', 'textcite', 'autocite', 'footcite', 'nocite']);
const REFERENCES_TO_LABELS = new Set(['ref', 'eqref', 'autoref', 'cref', 'Cref', 'pageref', 'nameref']);
const TABULARS = new Set(['tabular', 'tabular*', 'tabularx', 'tabulary', 'longtable', 'array', 'supertabular']);
const MATH_ENVIRONMENTS = new Set(['equation', 'equation*', 'align', 'align*', 'gather', 'gather*', 'multline', 'multline*', 'displaymath', 'eqnarray', 'eqnarray*', 'math']);
const RAW_ENVIRONMENTS = new Set(['verbatim', 'verbatim*', 'lstlisting', 'minted', 'Verbatim']);
const SKIPPED_ENVIRONMENTS = new Set(['comment', 'tikzpicture', 'picture']);
const LIST_ENVIRONMENTS = new Set(['itemize', 'enumerate', 'description', 'tablenotes']);

class LatexConverter {
  title: { content: string; start: number } | null = null;
  private math = false;
  private pendingFootnotes: InlineText[] = [];
  private tableCount = 0;
  private referencesByHeading: { start: number; level: number } | null = null;
  /** Where the source being converted sits (see Origin); null when nothing is mapped (convertInline). */
  private origin: Origin = null;

  constructor(
    readonly builder: TextBuilder,
    private readonly bibliography: string | null,
  ) {}

  /** Converts a piece of LaTeX into the builder; `origin` says where the piece sits in the file. */
  run(source: string, origin: Origin): void {
    const outer = this.origin;
    this.origin = origin;
    let index = 0;
    while (index < source.length) index = this.step(source, index);
    this.origin = outer;
  }

  finishDocument(): void {
    this.flushFootnotes();
    this.closeReferences();
  }

  /** A heading from its LaTeX, placed in the file by `place` when known. */
  writeHeading(raw: string, level: number, place: Place | null): void {
    this.flushFootnotes();
    if (this.referencesByHeading && level <= this.referencesByHeading.level) this.closeReferences();
    const text = convertInlinePlaced(raw, place);
    this.builder.blockBreak(2);
    this.builder.open('heading');
    this.builder.inline(text.text, text.sources);
    this.builder.close();
    this.builder.blockBreak(2);
    if (REFERENCE_HEADING.test(text.text)) this.referencesByHeading = { start: this.builder.offset, level };
  }

  private closeReferences(): void {
    if (!this.referencesByHeading) return;
    this.builder.addSpan('references', this.referencesByHeading.start, this.builder.offset);
    this.referencesByHeading = null;
  }

  /** Where `index` of the piece being converted sits in the text without comments; null when nothing is mapped. */
  private sourceAt(index: number): number | null {
    const origin = this.origin;
    if (origin === null) return null;
    return origin.pinned ? origin.offset : origin.offset + index;
  }

  /** Where each index of a part of the piece being converted, starting at `index`, sits; null when nothing is mapped. */
  private placeAt(index: number): Place | null {
    return this.origin === null ? null : (offset) => this.sourceAt(index + offset);
  }

  /** The origin of a part of the piece being converted that starts at `index`. */
  private within(index: number): Origin {
    const origin = this.origin;
    return origin === null || origin.pinned ? origin : { offset: origin.offset + index, pinned: false };
  }

  /** Tells the builder that what is written next comes from `index`, its first `copied` characters as they stand. */
  private mark(index: number, copied = 0): void {
    const at = this.sourceAt(index);
    if (at !== null) this.builder.from(at, this.origin!.pinned ? 0 : copied);
  }

  /** A part of the piece being converted (a caption, a footnote) that starts at `index`, as one line of text with its words placed. */
  private inlineText(source: string, index: number): InlineText {
    return convertInlinePlaced(source, this.placeAt(index));
  }

  /** Reads one token at `index` and returns where the next one starts. */
  private step(source: string, index: number): number {
    const char = source[index]!;
    this.mark(index);
    if (char === '\\') return this.command(source, index);
    if (char === '$') return this.inlineMath(source, index);
    if (char === '{' || char === '}') return index + 1;
    if (char === '~') {
      this.builder.inline(' ');
      return index + 1;
    }
    if (char === '&') {
      this.builder.space();
      return index + 1;
    }
    if (char === '^' || char === '_') {
      // In math a sub- or superscript is flattened in place; in text the character stands for itself.
      if (!this.math) this.builder.verbatim(char);
      return index + 1;
    }
    if (char === '`' || char === "'") {
      const doubled = source[index + 1] === char;
      this.builder.verbatim(doubled ? '"' : "'");
      return index + (doubled ? 2 : 1);
    }
    if (char === '\n' || char === ' ' || char === '\t' || char === '\r') {
      const whitespace = /^\s+/.exec(source.slice(index, index + 200))![0];
      if (!this.math && (whitespace.match(/\n/g)?.length ?? 0) >= 2) this.paragraphBreak();
      else this.builder.space();
      return index + whitespace.length;
    }
    const run = /^[^\\${}~&`'\s^_]+/.exec(source.slice(index, index + 400))![0];
    this.mark(index, run.length);
    this.builder.verbatim(run);
    return index + run.length;
  }

  private paragraphBreak(): void {
    this.builder.blockBreak(2);
    this.flushFootnotes();
  }

  private flushFootnotes(): void {
    if (this.pendingFootnotes.length === 0) return;
    const footnotes = this.pendingFootnotes;
    this.pendingFootnotes = [];
    this.builder.blockBreak(2);
    for (const footnote of footnotes) {
      this.builder.open('footnote');
      this.builder.inline(footnote.text, footnote.sources);
      this.builder.close();
      this.builder.blockBreak(1);
    }
    this.builder.blockBreak(2);
  }

  private inlineMath(source: string, index: number): number {
    const display = source[index + 1] === '$';
    const delimiter = display ? '$$' : '$';
    const start = index + delimiter.length;
    let end = start;
    while (end < source.length && !(source.startsWith(delimiter, end) && source[end - 1] !== '\\')) end += 1;
    this.runMath(source.slice(start, end), start);
    return Math.min(source.length, end + delimiter.length);
  }

  /** Converts `content`, which starts at `index` of the piece being converted, as math. */
  private runMath(content: string, index: number): void {
    const wasMath = this.math;
    this.math = true;
    this.run(content, this.within(index));
    this.math = wasMath;
  }

  private command(source: string, index: number): number {
    const next = source[index + 1];
    if (next === undefined) return index + 1;
    if (!/[A-Za-z@]/.test(next)) return this.symbolCommand(source, index, next);
    const name = /^[A-Za-z@]+/.exec(source.slice(index + 1, index + 60))![0];
    let position = index + 1 + name.length;
    // A starred form (\section*) reads like the plain one.
    if (source[position] === '*') position += 1;
    return this.namedCommand(source, name, position);
  }

  /** \\, \%, \&, \(, \[, \, and the other one-character commands. */
  private symbolCommand(source: string, index: number, symbol: string): number {
    if (symbol === '\\') {
      if (this.math) this.builder.space();
      else this.builder.lineBreak();
      return skipOptional(source, index + 2);
    }
    if (symbol === '(' || symbol === '[') {
      const closer = symbol === '(' ? '\\)' : '\\]';
      const end = source.indexOf(closer, index + 2);
      const stop = end === -1 ? source.length : end;
      if (symbol === '[') this.builder.blockBreak(2);
      this.runMath(source.slice(index + 2, stop), index + 2);
      if (symbol === '[') this.builder.blockBreak(2);
      return Math.min(source.length, stop + 2);
    }
    if (',;: '.includes(symbol) || symbol === '\n') this.builder.space();
    else if ('%&_#${}'.includes(symbol)) this.builder.verbatim(symbol);
    else if (symbol === '-') return index + 2; // discretionary hyphen
    return index + 2;
  }

  private namedCommand(source: string, name: string, position: number): number {
    if (name === 'begin') return this.environment(source, position);
    if (name === 'end') {
      const group = readBalanced(source, skipSpaces(source, position), '{', '}');
      this.builder.blockBreak(1);
      return group ? group.end : position;
    }
    if (name in SECTION_LEVEL) {
      const argumentStart = skipSpaces(source, skipOptional(source, skipSpaces(source, position)));
      const group = readBalanced(source, argumentStart, '{', '}');
      if (!group) return position;
      this.writeHeading(group.content, SECTION_LEVEL[name]!, this.placeAt(argumentStart + 1));
      return group.end;
    }
    if (name === 'maketitle') {
      const title = this.title;
      if (title !== null) this.writeHeading(title.content, 0, this.origin === null ? null : (offset) => title.start + offset);
      return position;
    }
    if (name === 'footnote' || name === 'footnotetext') {
      const open = skipSpaces(source, skipOptional(source, position));
      const group = readBalanced(source, open, '{', '}');
      if (!group) return position;
      this.pendingFootnotes.push(this.inlineText(group.content, open + 1));
      return group.end;
    }
    if (name === 'caption') {
      const open = skipSpaces(source, skipOptional(source, position));
      const group = readBalanced(source, open, '{', '}');
      if (!group) return position;
      this.writeCaption(this.inlineText(group.content, open + 1));
      return group.end;
    }
    if (name === 'par') {
      this.paragraphBreak();
      return position;
    }
    if (name === 'item' || name === 'bibitem') {
      this.builder.blockBreak(1);
      let after = skipSpaces(source, position);
      const label = source[after] === '[' ? readBalanced(source, after, '[', ']') : null;
      if (label) after = label.end;
      if (name === 'bibitem') after = readBalanced(source, skipSpaces(source, after), '{', '}')?.end ?? after;
      else if (label) this.builder.inline(`${convertInline(label.content)} `);
      return after;
    }
    if (name === 'bibliography') {
      const group = readBalanced(source, skipSpaces(source, position), '{', '}');
      // The .bbl is another file: all of it is placed at the \bibliography command.
      const at = this.sourceAt(position);
      if (this.bibliography !== null) this.run(stripComments(this.bibliography), at === null ? null : { offset: at, pinned: true });
      return group ? group.end : position;
    }
    if (CITATIONS.has(name)) return this.citation(source, position);
    if (REFERENCES_TO_LABELS.has(name)) {
      const group = readBalanced(source, skipSpaces(source, position), '{', '}');
      if (group) this.builder.verbatim(group.content);
      return group ? group.end : position;
    }
    if (name === 'multicolumn' || name === 'multirow') {
      // \multicolumn{n}{spec}{content}: only the content is text.
      let after = position;
      for (let skipped = 0; skipped < 2; skipped += 1) after = readBalanced(source, skipSpaces(source, skipOptional(source, after)), '{', '}')?.end ?? after;
      return after;
    }
    if (name === 'frac' || name === 'dfrac' || name === 'tfrac') return this.fraction(source, position);
    if (name === 'sqrt') {
      this.builder.verbatim('√');
      return skipOptional(source, position);
    }
    if (name in SYMBOLS) {
      this.builder.verbatim(SYMBOLS[name]!);
      return this.math ? position : skipEmptyGroup(source, position);
    }
    if (name in DROPPED_WITH_ARGUMENTS) return skipArguments(source, position, DROPPED_WITH_ARGUMENTS[name]!);
    // TRANSPARENT commands and unknown ones: the name goes, the arguments are read as text.
    if (!TRANSPARENT.has(name) && !this.math) return skipSpacesAfterWord(source, position);
    return position;
  }

  private citation(source: string, position: number): number {
    let after = skipSpaces(source, position);
    while (source[after] === '[') after = skipSpaces(source, readBalanced(source, after, '[', ']')?.end ?? after + 1);
    const group = readBalanced(source, after, '{', '}');
    if (!group) return after;
    this.builder.verbatim(`[${group.content.split(',').map((key) => key.trim()).join(', ')}]`);
    return group.end;
  }

  private fraction(source: string, position: number): number {
    const numeratorOpen = skipSpaces(source, position);
    const numerator = readBalanced(source, numeratorOpen, '{', '}');
    if (!numerator) return position;
    const denominatorOpen = skipSpaces(source, numerator.end);
    const denominator = readBalanced(source, denominatorOpen, '{', '}');
    this.run(numerator.content, this.within(numeratorOpen + 1));
    this.builder.verbatim('/');
    if (denominator) this.run(denominator.content, this.within(denominatorOpen + 1));
    return denominator ? denominator.end : numerator.end;
  }

  private environment(source: string, position: number): number {
    const nameGroup = readBalanced(source, skipSpaces(source, position), '{', '}');
    if (!nameGroup) return position;
    const name = nameGroup.content.trim();
    const endMarker = `\\end{${name}}`;
    const endIndex = findEnvironmentEnd(source, nameGroup.end, name);
    const bodyStart = nameGroup.end;
    const body = source.slice(bodyStart, endIndex);
    const after = Math.min(source.length, endIndex + endMarker.length);
    if (name === 'document' || name === 'center' || name === 'minipage' || name === 'flushleft' || name === 'threeparttable') {
      this.builder.blockBreak(1);
      const skipped = name === 'minipage' ? prefixLength(body, /^\s*(?:\[[^\][]*\]\s*)?\{[^}]*\}/) : 0;
      this.run(body.slice(skipped), this.within(bodyStart + skipped));
      this.builder.blockBreak(1);
      return after;
    }
    if (SKIPPED_ENVIRONMENTS.has(name)) return after;
    if (RAW_ENVIRONMENTS.has(name)) {
      this.builder.blockBreak(2);
      const skipped = prefixLength(body, /^\n/);
      this.mark(bodyStart + skipped, body.length - skipped);
      this.builder.verbatim(body.slice(skipped));
      this.builder.blockBreak(2);
      return after;
    }
    if (name === 'table' || name === 'table*') {
      const skipped = prefixLength(body, /^\s*\[[^\]]*\]/);
      const draft = readTableFloat(body.slice(skipped), this.placeAt(bodyStart + skipped));
      // LaTeX numbers captions itself; the reader writes the number a reader of the PDF would see.
      if (draft.caption !== null) {
        draft.caption = `Table ${++this.tableCount}. ${draft.caption}`;
        // The two words added stand where the caption does.
        const words = draft.sources?.caption;
        if (draft.sources && words) draft.sources.caption = [words[0]!, words[0]!, ...words];
      }
      writeTable(this.builder, draft);
      return after;
    }
    if (TABULARS.has(name) && !this.math) {
      const start = tabularBodyStart(body, name);
      const rows = readTabularCells(body.slice(start), this.placeAt(bodyStart + start));
      writeTable(this.builder, { caption: null, notes: [], rows: rows.map((row) => row.map((cell) => cell.text)), sources: sourcesOf(null, rows, []) });
      return after;
    }
    if (MATH_ENVIRONMENTS.has(name)) {
      this.builder.blockBreak(2);
      this.runMath(body, bodyStart);
      this.builder.blockBreak(2);
      return after;
    }
    if (name === 'thebibliography') {
      const skipped = prefixLength(body, /^\s*\{[^}]*\}/);
      this.writeBibliography(body.slice(skipped), this.within(bodyStart + skipped));
      return after;
    }
    if (name === 'figure' || name === 'figure*') {
      const caption = readCommandArgument(body, 'caption');
      if (caption !== null) this.writeCaption(this.inlineText(caption.content, bodyStart + caption.start));
      return after;
    }
    const block = LIST_ENVIRONMENTS.has(name) || name === 'abstract' || name === 'quote' || name === 'quotation' ? 2 : 1;
    this.builder.blockBreak(block);
    this.run(body, this.within(bodyStart));
    this.builder.blockBreak(block);
    return after;
  }

  private writeBibliography(body: string, origin: Origin): void {
    this.closeReferences();
    this.flushFootnotes();
    this.builder.blockBreak(2);
    this.builder.open('heading');
    this.builder.inline('References');
    this.builder.close();
    this.builder.blockBreak(2);
    this.builder.open('references');
    this.run(body, origin);
    this.builder.close();
    this.builder.blockBreak(2);
  }

  private writeCaption(caption: InlineText): void {
    this.builder.blockBreak(2);
    this.builder.open('caption');
    this.builder.inline(caption.text, caption.sources);
    this.builder.close();
    this.builder.blockBreak(2);
  }
}

/**
 * Where `\end{name}` closes the environment opened just before `from`,
 * counting nested ones of the same name. Each search starts where the last
 * found marker of its kind ended, so the body is read once: searching again
 * from every nested \begin made the same-name nesting the limit allows
 * (latexNesting) cost the cube of its depth.
 */
function findEnvironmentEnd(source: string, from: number, name: string): number {
  const begin = `\\begin{${name}}`;
  const end = `\\end{${name}}`;
  let depth = 1;
  let nextBegin = source.indexOf(begin, from);
  let nextEnd = source.indexOf(end, from);
  while (nextEnd !== -1) {
    if (nextBegin !== -1 && nextBegin < nextEnd) {
      depth += 1;
      nextBegin = source.indexOf(begin, nextBegin + begin.length);
      continue;
    }
    depth -= 1;
    if (depth === 0) return nextEnd;
    nextEnd = source.indexOf(end, nextEnd + end.length);
  }
  return source.length;
}

/** A table float: its \caption, its tabular rows, and whatever other text it holds as notes; `place` places `body` in the file. */
function readTableFloat(body: string, place: Place | null): TableDraft {
  const captionMatch = /\\caption\*?\s*(?:\[[^\][]*\]\s*)?\{/.exec(body);
  let caption: InlineText | null = null;
  let rest = removeRanges(body, []);
  if (captionMatch) {
    const open = captionMatch.index + captionMatch[0].length - 1;
    const group = readBalanced(body, open, '{', '}');
    if (group) {
      caption = convertInlinePlaced(group.content, shifted(place, open + 1));
      rest = removeRanges(body, [[captionMatch.index, group.end]]);
    }
  }
  const restPlace = through(place, rest.map);
  const rows: TabularCell[][] = [];
  const tabulars: [number, number][] = [];
  const tabularPattern = /\\begin\{(tabular\*?|tabularx|tabulary|longtable)\}/g;
  for (let match = tabularPattern.exec(rest.text); match; match = tabularPattern.exec(rest.text)) {
    const name = match[1]!;
    const bodyStart = match.index + match[0].length;
    const end = findEnvironmentEnd(rest.text, bodyStart, name);
    const tabular = rest.text.slice(bodyStart, end);
    const start = tabularBodyStart(tabular, name);
    appendAll(rows, readTabularCells(tabular.slice(start), shifted(restPlace, bodyStart + start)));
    const after = Math.min(rest.text.length, end + `\\end{${name}}`.length);
    tabulars.push([match.index, after]);
    tabularPattern.lastIndex = after;
  }
  const notesSource = removeRanges(rest.text, tabulars);
  const notes = readNotes(notesSource.text, through(restPlace, notesSource.map));
  return {
    caption: caption?.text || null,
    notes: notes.map((note) => note.text),
    rows: rows.map((row) => row.map((cell) => cell.text)),
    sources: sourcesOf(caption, rows, notes),
  };
}

/** Text of a float outside its tabular: one note per tablenotes item or per paragraph. */
function readNotes(source: string, place: Place | null): InlineText[] {
  const byItem = source.includes('\\item');
  const items: { text: string; start: number }[] = [];
  let start = 0;
  for (const match of source.matchAll(byItem ? /\\item\b/g : /\n\s*\n/g)) {
    items.push({ text: source.slice(start, match.index), start });
    start = match.index + match[0].length;
  }
  items.push({ text: source.slice(start), start });
  // Before the first \item there is no note.
  return (byItem ? items.slice(1) : items)
    .map((item) => {
      const markers = [...item.text.matchAll(/\\(?:begin|end)\{tablenotes\}/g)].map((match) => [match.index, match.index + match[0].length] as const);
      const note = removeRanges(item.text, markers);
      return convertInlinePlaced(note.text, through(shifted(place, item.start), note.map));
    })
    .filter((note) => note.text.length > 0);
}

/** Where the body of a tabular starts, after its column specification (and width, for tabular* and tabularx). */
function tabularBodyStart(body: string, name: string): number {
  let index = skipSpaces(body, 0);
  if (name === 'tabular*' || name === 'tabularx' || name === 'tabulary') index = skipSpaces(body, readBalanced(body, index, '{', '}')?.end ?? index);
  index = skipOptional(body, index);
  index = skipSpaces(body, index);
  const spec = readBalanced(body, index, '{', '}');
  return spec ? spec.end : index;
}

/** A cell of a tabular as one line of text, with its words placed in the file when known. */
type TabularCell = InlineText;

/** Rows split on \\ and cells on & (at brace depth 0, not escaped); rule commands dropped; empty rows left out. */
export function readTabularRows(body: string): string[][] {
  return readTabularCells(body, null).map((row) => row.map((cell) => cell.text));
}

/** readTabularRows, with each cell's words placed in the file by `place`. */
function readTabularCells(body: string, place: Place | null): TabularCell[][] {
  // Rules become spaces of their own length, so every index of `cleaned` is still one of `body`.
  const blank = (rule: string): string => ' '.repeat(rule.length);
  const cleaned = body
    .replace(/\\(?:hline|toprule|midrule|bottomrule|addlinespace|endhead|endfirsthead|endfoot|endlastfoot|noalign\{[^{}]*\})\b/g, blank)
    .replace(/\\(?:cline|cmidrule)(?:\([^()]*\))?\{[^{}]*\}/g, blank);
  return splitAtDepthZero(cleaned, '\\\\')
    .map((row) => {
      // A row's optional spacing ("\\[2pt]") is not a cell.
      const skipped = prefixLength(row.text, /^\s*\[[^\]]*\]/);
      return splitAtDepthZero(row.text.slice(skipped), '&').map((cell) => convertInlinePlaced(cell.text, shifted(place, row.start + skipped + cell.start)));
    })
    .filter((cells) => cells.some((cell) => cell.text.length > 0));
}

/** The parts of `source` between separators at brace depth 0 (not escaped), each with where it starts. */
function splitAtDepthZero(source: string, separator: string): { text: string; start: number }[] {
  const parts: { text: string; start: number }[] = [];
  let depth = 0;
  let start = 0;
  for (let index = 0; index < source.length; index += 1) {
    const char = source[index];
    if (source.startsWith(separator, index) && depth === 0) {
      parts.push({ text: source.slice(start, index), start });
      index += separator.length - 1;
      start = index + 1;
      continue;
    }
    if (char === '\\') {
      index += 1;
      continue;
    }
    if (char === '{') depth += 1;
    else if (char === '}') depth = Math.max(0, depth - 1);
  }
  parts.push({ text: source.slice(start), start });
  return parts;
}

/** A table's word sources for writeTable (TableDraft.sources). */
function sourcesOf(caption: InlineText | null, rows: readonly TabularCell[][], notes: readonly InlineText[]): NonNullable<TableDraft['sources']> {
  return { caption: caption?.sources ?? null, cells: rows.map((row) => row.map((cell) => cell.sources ?? null)), notes: notes.map((note) => note.sources ?? null) };
}

/** `place` for a part of its piece that starts at `by`. */
function shifted(place: Place | null, by: number): Place | null {
  return place === null ? null : (index) => place(by + index);
}

/** `place` for a text made from its piece by removing parts (removeRanges), through that text's map back to the piece. */
function through(place: Place | null, map: OffsetMap): Place | null {
  return place === null ? null : (index) => place(map.sourceOffsetOf(index) ?? index);
}

/** `source` without the given ranges ([start, end), sorted, not overlapping), and the map from the result back to `source`. */
function removeRanges(source: string, ranges: readonly (readonly [number, number])[]): { text: string; map: OffsetMap } {
  const map = new OffsetMap();
  const kept: string[] = [];
  let length = 0;
  let from = 0;
  const keep = (end: number): void => {
    if (end <= from) return;
    map.add(length, from, end - from);
    kept.push(source.slice(from, end));
    length += end - from;
  };
  for (const [start, end] of ranges) {
    keep(start);
    from = Math.max(from, end);
  }
  keep(source.length);
  return { text: kept.join(''), map };
}

/** How many characters at the start of `text` the (anchored) pattern matches: 0 when it does not. */
function prefixLength(text: string, pattern: RegExp): number {
  return pattern.exec(text)?.[0].length ?? 0;
}

/** Converted text on one line, with where each of its words starts in the file when known (see TextBuilder.inline). */
interface InlineText {
  text: string;
  sources?: number[];
}

/**
 * A piece of LaTeX as one line of text, as convertInline gives it, with
 * where each word (run of non-space characters) starts in the file when
 * `place` places the piece: the piece is converted with a map of its own,
 * and each word's place in the piece is placed by `place`.
 */
function convertInlinePlaced(source: string, place: Place | null): InlineText {
  if (place === null) return { text: convertInline(source) };
  const converter = new LatexConverter(new TextBuilder({ sourceMap: true }), null);
  converter.run(source, { offset: 0, pinned: false });
  const runs = [...converter.builder.text().matchAll(/\S+/g)];
  const sources: number[] = [];
  for (const run of runs) {
    const at = place(converter.builder.sourceOffsetOf(run.index) ?? 0);
    if (at === null) return { text: runs.map((r) => r[0]).join(' ') };
    sources.push(at);
  }
  return { text: runs.map((run) => run[0]).join(' '), sources };
}

/** A piece of LaTeX (a caption, a cell, a footnote) as one line of text. */
export function convertInline(source: string): string {
  const converter = new LatexConverter(new TextBuilder(), null);
  converter.run(source, null);
  return collapseWhitespace(converter.builder.text());
}

function skipSpaces(source: string, index: number): number {
  while (index < source.length && /\s/.test(source[index]!)) index += 1;
  return index;
}

/** After a control word TeX drops the spaces (but a blank line still ends the paragraph). */
function skipSpacesAfterWord(source: string, index: number): number {
  const spaces = /^[ \t]*\n?[ \t]*/.exec(source.slice(index, index + 100))![0];
  return source[index + spaces.length] === '\n' ? index : index + spaces.length;
}

function skipOptional(source: string, index: number): number {
  const at = skipSpaces(source, index);
  if (source[at] !== '[') return index;
  return readBalanced(source, at, '[', ']')?.end ?? index;
}

function skipEmptyGroup(source: string, index: number): number {
  return source.startsWith('{}', index) ? index + 2 : index;
}

function skipArguments(source: string, index: number, count: number): number {
  let position = skipOptional(source, index);
  for (let argument = 0; argument < count; argument += 1) {
    const at = skipSpaces(source, skipOptional(source, position));
    if (source[at] === '\\') {
      // \newcommand\foo{...}: a bare command as the first argument.
      position = at + 1 + (/^[A-Za-z@]+/.exec(source.slice(at + 1))?.[0].length ?? 1);
      continue;
    }
    const group = readBalanced(source, at, '{', '}');
    if (!group) break;
    position = group.end;
  }
  return position;
}
