import { REFERENCE_HEADING, TextBuilder } from './builder.js';
import { collapseWhitespace, writeTable, type TableDraft } from './tables.js';
import type { DocumentText } from './types.js';
import { DocumentLimitError } from './markupLimits.js';
import { defaultLimits, limitHint, type Limits } from '../limits.js';
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
 */
export function latexToDocument(source: string, path: string, bibliography: string | null = null, limits: Pick<Limits, 'maxNestingDepth'> = defaultLimits): DocumentText {
  const withoutComments = stripComments(source);
  // The converter follows each nested environment and group by recursion: the depth is checked first, in one pass.
  const depth = checkNesting(withoutComments, limits.maxNestingDepth);
  if (bibliography !== null) checkNesting(stripComments(bibliography), limits.maxNestingDepth);
  const { preamble, body } = splitPreamble(withoutComments);
  const title = readCommandArgument(preamble, 'title');
  const converter = new LatexConverter(new TextBuilder(), bibliography);
  try {
    if (title !== null && !/\\maketitle\b/.test(body)) converter.writeHeading(title, 0);
    converter.title = title;
    converter.run(body);
    converter.finishDocument();
  } catch (error) {
    if (isStackOverflow(error)) throw new DocumentLimitError(stackExhaustedMessage(depth));
    throw error;
  }
  const builder = converter.builder;
  return { path, format: 'latex', text: builder.text(), pageOf: () => null, regions: builder.regions(), tables: builder.tables };
}

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
  return source.replace(/(^|[^\\])((?:\\\\)*)%[^\n]*\n?[ \t]*/g, '$1$2');
}

function splitPreamble(source: string): { preamble: string; body: string } {
  const begin = source.indexOf('\\begin{document}');
  if (begin === -1) return { preamble: '', body: source };
  const end = source.indexOf('\\end{document}', begin);
  return { preamble: source.slice(0, begin), body: source.slice(begin + '\\begin{document}'.length, end === -1 ? undefined : end) };
}

function readCommandArgument(source: string, command: string): string | null {
  const match = new RegExp(`\\\\${command}\\*?\\s*(?:\\[[^\\][]*\\]\\s*)?\\{`).exec(source);
  if (!match) return null;
  const group = readBalanced(source, match.index + match[0].length - 1, '{', '}');
  return group ? group.content : null;
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
  title: string | null = null;
  private math = false;
  private pendingFootnotes: string[] = [];
  private tableCount = 0;
  private referencesByHeading: { start: number; level: number } | null = null;

  constructor(
    readonly builder: TextBuilder,
    private readonly bibliography: string | null,
  ) {}

  /** Converts a piece of LaTeX into the builder. */
  run(source: string): void {
    let index = 0;
    while (index < source.length) index = this.step(source, index);
  }

  finishDocument(): void {
    this.flushFootnotes();
    this.closeReferences();
  }

  writeHeading(raw: string, level: number): void {
    this.flushFootnotes();
    if (this.referencesByHeading && level <= this.referencesByHeading.level) this.closeReferences();
    const text = convertInline(raw);
    this.builder.blockBreak(2);
    this.builder.open('heading');
    this.builder.inline(text);
    this.builder.close();
    this.builder.blockBreak(2);
    if (REFERENCE_HEADING.test(text)) this.referencesByHeading = { start: this.builder.offset, level };
  }

  private closeReferences(): void {
    if (!this.referencesByHeading) return;
    this.builder.addSpan('references', this.referencesByHeading.start, this.builder.offset);
    this.referencesByHeading = null;
  }

  /** Reads one token at `index` and returns where the next one starts. */
  private step(source: string, index: number): number {
    const char = source[index]!;
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
      this.builder.inline(footnote);
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
    this.runMath(source.slice(start, end));
    return Math.min(source.length, end + delimiter.length);
  }

  private runMath(content: string): void {
    const wasMath = this.math;
    this.math = true;
    this.run(content);
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
      this.runMath(source.slice(index + 2, stop));
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
      this.writeHeading(group.content, SECTION_LEVEL[name]!);
      return group.end;
    }
    if (name === 'maketitle') {
      if (this.title !== null) this.writeHeading(this.title, 0);
      return position;
    }
    if (name === 'footnote' || name === 'footnotetext') {
      const group = readBalanced(source, skipSpaces(source, skipOptional(source, position)), '{', '}');
      if (!group) return position;
      this.pendingFootnotes.push(convertInline(group.content));
      return group.end;
    }
    if (name === 'caption') {
      const group = readBalanced(source, skipSpaces(source, skipOptional(source, position)), '{', '}');
      if (!group) return position;
      this.writeCaption(convertInline(group.content));
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
      if (this.bibliography !== null) this.run(stripComments(this.bibliography));
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
    const numerator = readBalanced(source, skipSpaces(source, position), '{', '}');
    if (!numerator) return position;
    const denominator = readBalanced(source, skipSpaces(source, numerator.end), '{', '}');
    this.run(numerator.content);
    this.builder.verbatim('/');
    if (denominator) this.run(denominator.content);
    return denominator ? denominator.end : numerator.end;
  }

  private environment(source: string, position: number): number {
    const nameGroup = readBalanced(source, skipSpaces(source, position), '{', '}');
    if (!nameGroup) return position;
    const name = nameGroup.content.trim();
    const endMarker = `\\end{${name}}`;
    const endIndex = findEnvironmentEnd(source, nameGroup.end, name);
    const body = source.slice(nameGroup.end, endIndex);
    const after = Math.min(source.length, endIndex + endMarker.length);
    if (name === 'document' || name === 'center' || name === 'minipage' || name === 'flushleft' || name === 'threeparttable') {
      this.builder.blockBreak(1);
      this.run(name === 'minipage' ? body.replace(/^\s*(?:\[[^\][]*\]\s*)?\{[^}]*\}/, '') : body);
      this.builder.blockBreak(1);
      return after;
    }
    if (SKIPPED_ENVIRONMENTS.has(name)) return after;
    if (RAW_ENVIRONMENTS.has(name)) {
      this.builder.blockBreak(2);
      this.builder.verbatim(body.replace(/^\n/, ''));
      this.builder.blockBreak(2);
      return after;
    }
    if (name === 'table' || name === 'table*') {
      const draft = readTableFloat(body.replace(/^\s*\[[^\]]*\]/, ''));
      // LaTeX numbers captions itself; the reader writes the number a reader of the PDF would see.
      if (draft.caption !== null) draft.caption = `Table ${++this.tableCount}. ${draft.caption}`;
      writeTable(this.builder, draft);
      return after;
    }
    if (TABULARS.has(name) && !this.math) {
      writeTable(this.builder, { caption: null, notes: [], rows: readTabularRows(tabularBody(body, name)) });
      return after;
    }
    if (MATH_ENVIRONMENTS.has(name)) {
      this.builder.blockBreak(2);
      this.runMath(body);
      this.builder.blockBreak(2);
      return after;
    }
    if (name === 'thebibliography') {
      this.writeBibliography(body.replace(/^\s*\{[^}]*\}/, ''));
      return after;
    }
    if (name === 'figure' || name === 'figure*') {
      const caption = readCommandArgument(body, 'caption');
      if (caption !== null) this.writeCaption(convertInline(caption));
      return after;
    }
    const block = LIST_ENVIRONMENTS.has(name) || name === 'abstract' || name === 'quote' || name === 'quotation' ? 2 : 1;
    this.builder.blockBreak(block);
    this.run(body);
    this.builder.blockBreak(block);
    return after;
  }

  private writeBibliography(body: string): void {
    this.closeReferences();
    this.flushFootnotes();
    this.builder.blockBreak(2);
    this.builder.open('heading');
    this.builder.inline('References');
    this.builder.close();
    this.builder.blockBreak(2);
    this.builder.open('references');
    this.run(body);
    this.builder.close();
    this.builder.blockBreak(2);
  }

  private writeCaption(text: string): void {
    this.builder.blockBreak(2);
    this.builder.open('caption');
    this.builder.inline(text);
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

/** A table float: its \caption, its tabular rows, and whatever other text it holds as notes. */
function readTableFloat(body: string): TableDraft {
  const captionMatch = /\\caption\*?\s*(?:\[[^\][]*\]\s*)?\{/.exec(body);
  let caption: string | null = null;
  let rest = body;
  if (captionMatch) {
    const group = readBalanced(body, captionMatch.index + captionMatch[0].length - 1, '{', '}');
    if (group) {
      caption = convertInline(group.content) || null;
      rest = body.slice(0, captionMatch.index) + body.slice(group.end);
    }
  }
  const rows: string[][] = [];
  const tabularPattern = /\\begin\{(tabular\*?|tabularx|tabulary|longtable)\}/g;
  let notesSource = '';
  let cursor = 0;
  for (let match = tabularPattern.exec(rest); match; match = tabularPattern.exec(rest)) {
    const name = match[1]!;
    const end = findEnvironmentEnd(rest, match.index + match[0].length, name);
    appendAll(rows, readTabularRows(tabularBody(rest.slice(match.index + match[0].length, end), name)));
    notesSource += rest.slice(cursor, match.index);
    cursor = Math.min(rest.length, end + `\\end{${name}}`.length);
    tabularPattern.lastIndex = cursor;
  }
  notesSource += rest.slice(cursor);
  const notes = readNotes(notesSource);
  return { caption, notes, rows };
}

/** Text of a float outside its tabular: one note per tablenotes item or per paragraph. */
function readNotes(source: string): string[] {
  const items = source.includes('\\item') ? source.split(/\\item\b/).slice(1) : source.split(/\n\s*\n/);
  return items.map((item) => convertInline(item.replace(/\\(?:begin|end)\{tablenotes\}/g, ''))).filter((note) => note.length > 0);
}

/** The body of a tabular without its column specification (and width, for tabular* and tabularx). */
function tabularBody(body: string, name: string): string {
  let index = skipSpaces(body, 0);
  if (name === 'tabular*' || name === 'tabularx' || name === 'tabulary') index = skipSpaces(body, readBalanced(body, index, '{', '}')?.end ?? index);
  index = skipOptional(body, index);
  index = skipSpaces(body, index);
  const spec = readBalanced(body, index, '{', '}');
  return spec ? body.slice(spec.end) : body.slice(index);
}

/** Rows split on \\ and cells on & (at brace depth 0, not escaped); rule commands dropped; empty rows left out. */
export function readTabularRows(body: string): string[][] {
  const cleaned = body.replace(/\\(?:hline|toprule|midrule|bottomrule|addlinespace|endhead|endfirsthead|endfoot|endlastfoot|noalign\{[^{}]*\})\b/g, ' ').replace(/\\(?:cline|cmidrule)(?:\([^()]*\))?\{[^{}]*\}/g, ' ');
  return splitAtDepthZero(cleaned, '\\\\')
    .map((row) => row.replace(/^\s*\[[^\]]*\]/, ''))
    .map((row) => splitAtDepthZero(row, '&').map((cell) => convertInline(cell)))
    .filter((cells) => cells.some((cell) => cell.length > 0));
}

function splitAtDepthZero(source: string, separator: string): string[] {
  const parts: string[] = [];
  let depth = 0;
  let start = 0;
  for (let index = 0; index < source.length; index += 1) {
    const char = source[index];
    if (source.startsWith(separator, index) && depth === 0) {
      parts.push(source.slice(start, index));
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
  parts.push(source.slice(start));
  return parts;
}

/** A piece of LaTeX (a caption, a cell, a footnote) as one line of text. */
export function convertInline(source: string): string {
  const converter = new LatexConverter(new TextBuilder(), null);
  converter.run(source);
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
