import { OffsetMap } from './sourceMap.js';
import type { DocumentTable, Region, RegionKind } from './types.js';

/**
 * Accumulates the text of a structured document (HTML, DOCX via HTML, JATS,
 * LaTeX) together with its regions and tables, so that every offset is
 * recorded while the text is written and nothing has to be re-located later.
 *
 * Whitespace follows HTML rules: runs of spaces and newlines inside inline
 * text collapse to one space; only `lineBreak` and `blockBreak` put line
 * breaks into the text. That keeps the offsets stable (no clean-up pass
 * after writing).
 *
 * A builder made with `{ sourceMap: true }` also records where its text
 * comes from in the file (`from`, `sourceOffsetOf`), for a reader whose
 * text is not the file's own and whose report should name the file's lines.
 */
export class TextBuilder {
  private parts: string[] = [];
  private length = 0;
  /** Last character written ('' at the start), to decide on spaces and breaks. */
  private last = '';
  /** Number of newlines at the end of the text written so far. */
  private trailingNewlines = 0;
  private spacePending = false;
  private readonly spans: Region[] = [];
  private readonly openSpans: { kind: RegionKind; start: number }[] = [];
  readonly tables: DocumentTable[] = [];
  private readonly sourceMap: OffsetMap | null;
  /** Where the next word or verbatim text comes from (see `from`), until it is written. */
  private pendingSource: { offset: number; copied: number } | null = null;

  constructor(options: { sourceMap?: boolean } = {}) {
    this.sourceMap = options.sourceMap ? new OffsetMap() : null;
  }

  get offset(): number {
    return this.length;
  }

  /**
   * Inline text: whitespace collapses to single spaces, none at line starts.
   * `sources`, when given, holds where each word (each run of non-space
   * characters) starts in the file, in order: the words are then written one
   * by one, each from its place. Without it, the words of one call are
   * written as one part, joined by single spaces (what writing them one by
   * one gives: a word never ends in a space or a newline), so a text node of
   * millions of words costs one string, not two per word and an array of them.
   */
  inline(text: string, sources?: readonly number[]): void {
    if (sources !== undefined) {
      this.inlineFromSources(text, sources);
      return;
    }
    const collapsed = collapseSpaces(text);
    const startsWithSpace = collapsed.startsWith(' ');
    const endsWithSpace = collapsed.length > 1 && collapsed.endsWith(' ');
    if (startsWithSpace) this.spacePending = true;
    const words = collapsed.slice(startsWithSpace ? 1 : 0, endsWithSpace ? -1 : collapsed.length);
    if (words.length === 0) return;
    this.writeWord(words);
    if (endsWithSpace) this.spacePending = true;
  }

  /** Writes the words of `text` one by one, each from where `sources` says it starts in the file. */
  private inlineFromSources(text: string, sources: readonly number[]): void {
    const pieces = text.split(/[ \t\n\r\f\v]+/);
    const startsWithSpace = /^[ \t\n\r\f\v]/.test(text);
    const endsWithSpace = /[ \t\n\r\f\v]$/.test(text);
    if (startsWithSpace) this.spacePending = true;
    const words = pieces.filter((piece) => piece.length > 0);
    words.forEach((word, index) => {
      if (index > 0) this.spacePending = true;
      const source = sources[index];
      if (source !== undefined) this.from(source);
      this.writeWord(word);
    });
    if (endsWithSpace && words.length > 0) this.spacePending = true;
  }

  /** Text written exactly as given (table rows, preformatted text). */
  verbatim(text: string): void {
    if (text.length === 0) return;
    this.flushSpace();
    this.anchor();
    this.write(text);
  }

  /**
   * Says where the next word or verbatim text comes from in the file: it
   * starts at `sourceOffset`, and its first `copied` characters are the
   * file's own, one for one. Spaces and line breaks written in between
   * belong to the text before. Does nothing without a source map.
   */
  from(sourceOffset: number, copied = 0): void {
    if (this.sourceMap !== null) this.pendingSource = { offset: sourceOffset, copied };
  }

  /** The file offset a text offset comes from (see `from`); null without a source map or before anything was mapped. */
  sourceOffsetOf(offset: number): number | null {
    return this.sourceMap?.sourceOffsetOf(offset) ?? null;
  }

  /** Asks for a space before the next word (not at a line start). */
  space(): void {
    this.spacePending = true;
  }

  /** Ends the current line (a <br>, a table row). */
  lineBreak(): void {
    this.spacePending = false;
    this.write('\n');
  }

  /** Ends a block: the text ends with at least `newlines` newlines (none at the very start). */
  blockBreak(newlines = 1): void {
    this.spacePending = false;
    if (this.length === 0) return;
    while (this.trailingNewlines < newlines) this.write('\n');
  }

  open(kind: RegionKind): void {
    this.openSpans.push({ kind, start: this.length });
  }

  close(): void {
    const span = this.openSpans.pop();
    if (span && this.length > span.start) this.spans.push({ kind: span.kind, start: span.start, end: this.length });
  }

  /** Records a span written earlier (a reference list that ends where the next heading begins). */
  addSpan(kind: RegionKind, start: number, end: number): void {
    if (end > start) this.spans.push({ kind, start, end });
  }

  text(): string {
    return this.parts.join('');
  }

  regions(): Region[] {
    while (this.openSpans.length > 0) this.close();
    return flattenRegions(this.spans, this.text());
  }

  private writeWord(word: string): void {
    this.flushSpace();
    this.anchor();
    this.write(word);
  }

  /** Records the pending source offset at the current end of the text, where the next characters go. */
  private anchor(): void {
    if (this.pendingSource === null) return;
    this.sourceMap?.add(this.length, this.pendingSource.offset, this.pendingSource.copied);
    this.pendingSource = null;
  }

  private flushSpace(): void {
    if (this.spacePending && this.length > 0 && this.last !== '\n' && this.last !== ' ') this.write(' ');
    this.spacePending = false;
  }

  private write(text: string): void {
    this.parts.push(text);
    this.length += text.length;
    this.last = text[text.length - 1] ?? this.last;
    // Counted by hand: /\n*$/ takes quadratic time on a long run of newlines followed by anything else.
    let trailing = 0;
    while (trailing < text.length && text.charCodeAt(text.length - 1 - trailing) === 10) trailing++;
    this.trailingNewlines = trailing === text.length ? this.trailingNewlines + trailing : trailing;
  }
}

/** Whether a character code is one of the spaces HTML collapses: space, tab, newline, carriage return, form feed, vertical tab. */
function isCollapsible(code: number): boolean {
  return code === 32 || (code >= 9 && code <= 13);
}

/**
 * `text` with every run of HTML's spaces ([ \t\n\r\f\v]+) written as one
 * space: what text.replace(/[ \t\n\r\f\v]+/g, ' ') gives, without the
 * memory that replace takes for millions of runs (gigabytes for 40 MB of
 * "a a a ..."): pieces are joined in groups as they are cut.
 */
export function collapseSpaces(text: string): string {
  if (!/[\t\n\r\f\v]| {2}/.test(text)) return text;
  const groups: string[] = [];
  let pieces: string[] = [];
  let from = 0;
  for (let index = 0; index < text.length; index++) {
    if (!isCollapsible(text.charCodeAt(index))) continue;
    let end = index + 1;
    while (end < text.length && isCollapsible(text.charCodeAt(end))) end++;
    if (end - index > 1 || text.charCodeAt(index) !== 32) {
      pieces.push(text.slice(from, index), ' ');
      from = end;
      if (pieces.length >= 4096) {
        groups.push(pieces.join(''));
        pieces = [];
      }
    }
    index = end - 1;
  }
  pieces.push(text.slice(from));
  groups.push(pieces.join(''));
  return groups.join('');
}

/**
 * Turns possibly nested spans into the contract's form: sorted, not
 * overlapping, body text left out. Where spans nest, the innermost one (the
 * one that started last) wins, so a footnote inside a table cell stays a
 * footnote. Each region is trimmed to its non-blank characters.
 */
export function flattenRegions(spans: readonly Region[], text: string): Region[] {
  const boundaries = [...new Set(spans.flatMap((span) => [span.start, span.end]))].sort((a, b) => a - b);
  const pieces: Region[] = [];
  for (let index = 0; index + 1 < boundaries.length; index += 1) {
    const start = boundaries[index]!;
    const end = boundaries[index + 1]!;
    const innermost = innermostSpanCovering(spans, start, end);
    if (!innermost || innermost.kind === 'body') continue;
    const previous = pieces[pieces.length - 1];
    if (previous && previous.kind === innermost.kind && previous.end === start) previous.end = end;
    else pieces.push({ kind: innermost.kind, start, end });
  }
  return pieces.map((piece) => trimRegion(piece, text)).filter((piece): piece is Region => piece !== null);
}

function innermostSpanCovering(spans: readonly Region[], start: number, end: number): Region | undefined {
  let best: Region | undefined;
  for (const span of spans) {
    if (span.start > start || span.end < end) continue;
    if (!best || span.start > best.start || (span.start === best.start && span.end < best.end)) best = span;
  }
  return best;
}

function trimRegion(region: Region, text: string): Region | null {
  let { start, end } = region;
  while (start < end && /\s/.test(text[start]!)) start += 1;
  while (end > start && /\s/.test(text[end - 1]!)) end -= 1;
  return end > start ? { kind: region.kind, start, end } : null;
}

/** Heading texts that open a reference list. */
export const REFERENCE_HEADING = /^(?:\d+\.?\s*)?(?:references?|reference list|bibliography|works cited|literature cited|literature|cited literature)\s*:?$/i;
