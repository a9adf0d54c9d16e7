/**
 * Word boxes from the two PDF engines, each word tied to where its letters
 * stand in the page's text (the text the reader has always read), so a
 * table rebuilt from the boxes can replace exactly its own lines.
 *
 * - poppler: `pdftotext -raw -bbox` lists the words with their boxes in the
 *   order `pdftotext -raw` writes them (content-stream order). Its `-tsv`
 *   output gives the same boxes but ignores `-raw` (it prints nothing with
 *   it) and lists words in poppler's own column order, which is what the
 *   reader avoids (see pdf.ts), so their letters could not be walked in
 *   step with the text. The words' letters, walked in step with the text's
 *   non-space characters, give each word's offsets. The reader ties them
 *   while pdftotext is still writing (BboxWordLocator): each word becomes
 *   one object, and the XHTML (about 150 bytes a word) is never held whole.
 *   The text itself cannot be built from these words: they carry neither
 *   the baseline nor the space-after flag that `-raw` uses to put line
 *   breaks and spaces between them, hence the two runs.
 * - pdf.js (inside pdf-parse): the page's text items (a run of text, its
 *   transform, width and font) in drawing order. The page text is built
 *   from them exactly as pdf-parse's getText builds it (same thresholds for
 *   line breaks and tab separators), recording where each item lands; an
 *   item is cut into words at spaces, their positions estimated from the
 *   item's width in proportion to the characters.
 */

import type { PageWord } from './pdfLayout.js';

/** A word with where its text stands in the page's text [start, end). */
export interface LocatedWord extends PageWord {
  start: number;
  end: number;
}

// --------------------------------------------------------------- poppler

const ENTITY = /&(?:amp|lt|gt|quot|apos|#\d{1,7}|#x[0-9a-fA-F]{1,6});/g;

function decodeEntities(text: string): string {
  if (!text.includes('&')) return text;
  return text.replace(ENTITY, (entity) => {
    switch (entity) {
      case '&amp;':
        return '&';
      case '&lt;':
        return '<';
      case '&gt;':
        return '>';
      case '&quot;':
        return '"';
      case '&apos;':
        return "'";
      default: {
        const code = entity[2] === 'x' || entity[2] === 'X' ? Number.parseInt(entity.slice(3, -1), 16) : Number.parseInt(entity.slice(2, -1), 10);
        return code > 0 && code <= 0x10ffff ? String.fromCodePoint(code) : '';
      }
    }
  });
}

/** One `<page>` and one `<word>` element each, attributes as poppler writes them: no backtracking. */
const BBOX_ELEMENT = /<page width="([^"]*)" height="([^"]*)">|<word xMin="([^"]*)" yMin="([^"]*)" xMax="([^"]*)" yMax="([^"]*)">([^<]*)<\/word>/g;

/** The words of each page of `pdftotext -bbox` output (XHTML), in the order listed. */
export function parseBboxPages(xhtml: string): PageWord[][] {
  const pages: PageWord[][] = [];
  let current: PageWord[] | null = null;
  BBOX_ELEMENT.lastIndex = 0;
  for (let match = BBOX_ELEMENT.exec(xhtml); match !== null; match = BBOX_ELEMENT.exec(xhtml)) {
    if (match[1] !== undefined) {
      current = [];
      pages.push(current);
      continue;
    }
    if (current === null) continue;
    current.push({ text: decodeEntities(match[7]!), x0: Number(match[3]), top: Number(match[4]), x1: Number(match[5]), bottom: Number(match[6]) });
  }
  return pages;
}

const isSpace = (code: number): boolean => code === 32 || code === 9 || code === 10 || code === 13 || code === 12 || code === 11 || code === 0xa0;

/** Where the walk through a page's text stands, and where the word just tied starts (-1: a word of spaces only). */
interface Walk {
  at: number;
  start: number;
}

/**
 * Ties one word's letters to the text from `walk.at` on (spaces skipped on
 * both sides); false when they part. Moves `walk.at` past the word.
 */
function tieWord(text: string, word: string, walk: Walk): boolean {
  let at = walk.at;
  let start = -1;
  for (let index = 0; index < word.length; index++) {
    const code = word.charCodeAt(index);
    if (isSpace(code)) continue;
    while (at < text.length && isSpace(text.charCodeAt(at))) at++;
    if (at >= text.length || text.charCodeAt(at) !== code) return false;
    if (start === -1) start = at;
    at++;
  }
  walk.at = at;
  walk.start = start;
  return true;
}

/**
 * Ties each word to its letters in `text`, walking both in step (the words'
 * letters in order are the text's non-space characters). Returns null when
 * they part (the page is then read without its tables).
 */
export function locateWords(text: string, words: readonly PageWord[]): LocatedWord[] | null {
  const located: LocatedWord[] = [];
  const walk: Walk = { at: 0, start: -1 };
  for (const word of words) {
    if (!tieWord(text, word.text, walk)) return null;
    if (walk.start === -1) continue;
    // Written out rather than spread ({ ...word, start, end }): a spread copy cost ten times as much per word.
    const tied: LocatedWord = { text: word.text, x0: word.x0, top: word.top, x1: word.x1, bottom: word.bottom, start: walk.start, end: walk.at };
    if (word.spaceAfter !== undefined) tied.spaceAfter = word.spaceAfter;
    located.push(tied);
  }
  return located;
}

/** The end of a word element and its line: no element of poppler's output runs across one (see BboxWordLocator.push). */
const WORD_LINE_END = '</word>\n';

/**
 * `pdftotext -raw -bbox` output read as it comes, each word tied to its
 * letters in the text of its page (`pages`, from the text run) at once: the
 * same words and offsets as parseBboxPages then locateWords page by page,
 * without the whole XHTML in memory or a second object per word.
 *
 * finish() gives each page's words, null for a page whose words part from
 * its text, and null for every page when the output lists another number of
 * pages than the text has.
 */
export class BboxWordLocator {
  private readonly decoder = new TextDecoder('utf-8');
  /** Output not yet read: from just after the last complete word line. */
  private pending = '';
  private readonly located: (LocatedWord[] | null)[] = [];
  /** The page being read (-1 before the first `<page>`). */
  private page = -1;
  private readonly walk: Walk = { at: 0, start: -1 };

  constructor(private readonly pages: readonly string[]) {}

  /** Reads a chunk of output; what follows its last complete word line waits for the next chunk. */
  push(chunk: Uint8Array): void {
    this.pending += this.decoder.decode(chunk, { stream: true });
    const cut = this.pending.lastIndexOf(WORD_LINE_END);
    if (cut === -1) return;
    const end = cut + WORD_LINE_END.length;
    // An element cannot straddle the cut: a word's text holds no "<" (poppler writes it as &lt;) and attributes are numbers.
    this.read(this.pending.slice(0, end));
    this.pending = this.pending.slice(end);
  }

  finish(): (LocatedWord[] | null)[] {
    this.read(this.pending + this.decoder.decode());
    this.pending = '';
    if (this.located.length !== this.pages.length) return this.pages.map(() => null);
    return this.located;
  }

  private read(xhtml: string): void {
    BBOX_ELEMENT.lastIndex = 0;
    for (let match = BBOX_ELEMENT.exec(xhtml); match !== null; match = BBOX_ELEMENT.exec(xhtml)) {
      if (match[1] !== undefined) {
        this.page++;
        this.located.push([]);
        this.walk.at = 0;
        continue;
      }
      const words = this.page === -1 ? null : this.located[this.page]!;
      const text = this.pages[this.page];
      // Before the first page, on a page whose words have parted from its text, or past the text's pages: nothing to tie.
      if (words === null || text === undefined) continue;
      const word = decodeEntities(match[7]!);
      if (!tieWord(text, word, this.walk)) {
        this.located[this.page] = null;
        continue;
      }
      if (this.walk.start === -1) continue;
      words.push({ text: word, x0: Number(match[3]), top: Number(match[4]), x1: Number(match[5]), bottom: Number(match[6]), start: this.walk.start, end: this.walk.at });
    }
  }
}

// ---------------------------------------------------------------- pdf.js

/** What is used of a pdf.js text item. */
export interface PdfJsTextItem {
  str: string;
  transform: number[];
  width: number;
  height: number;
  hasEOL: boolean;
  fontName?: string;
}

/** What is used of a pdf.js page viewport (scale 1). */
export interface PdfJsViewport {
  transform: number[];
  convertToViewportPoint(x: number, y: number): number[];
}

export type PdfJsStyles = Record<string, { ascent?: number; descent?: number } | undefined>;

/** pdf-parse's defaults (ParseParameters): a new line when y moves more than this... */
const LINE_THRESHOLD = 4.6;
/** ...and a tab between items on one line more than this apart. */
const CELL_THRESHOLD = 7;

function isTextItem(item: unknown): item is PdfJsTextItem {
  return typeof item === 'object' && item !== null && typeof (item as { str?: unknown }).str === 'string' && Array.isArray((item as { transform?: unknown }).transform);
}

/**
 * The page's text as pdf-parse's getText writes it with its default
 * parameters (line breaks when an item moves down by more than the line's
 * height, a tab before an item far to the right of the previous one on the
 * same line, a newline after an item that ends a line), and the words of
 * every upright item with their boxes and offsets in that text.
 */
export function pdfjsPageText(items: readonly unknown[], viewport: PdfJsViewport, styles: PdfJsStyles): { text: string; words: LocatedWord[] } {
  const parts: string[] = [];
  let length = 0;
  const push = (part: string): void => {
    parts.push(part);
    length += part.length;
  };
  const words: LocatedWord[] = [];
  let lastX: number | undefined;
  let lastY: number | undefined;
  let lineHeight = 0;
  for (const item of items) {
    if (!isTextItem(item)) continue;
    const [x, y] = viewport.convertToViewportPoint(item.transform[4]!, item.transform[5]!) as [number, number];
    let str = item.str;
    if (lastY !== undefined && Math.abs(lastY - y) > LINE_THRESHOLD) {
      const lastPart = parts.length > 0 ? parts[parts.length - 1] : undefined;
      const startsNewLine = str.startsWith('\n') || (str.trim() === '' && item.hasEOL);
      if (lastPart !== undefined && !lastPart.endsWith('\n') && !startsNewLine && Math.abs(lastY - y) - 1 > lineHeight) {
        push('\n');
        lineHeight = 0;
      }
    }
    let prefix = 0;
    if (lastY !== undefined && Math.abs(lastY - y) < LINE_THRESHOLD && lastX !== undefined && Math.abs(lastX - x) > CELL_THRESHOLD) {
      str = `\t${str}`;
      prefix = 1;
    }
    const itemStart = length + prefix;
    push(str);
    addItemWords(item, itemStart, viewport, styles, words);
    lastX = x + item.width;
    lastY = y;
    lineHeight = Math.max(lineHeight, item.height);
    if (item.hasEOL) push('\n');
    if (item.hasEOL || str.endsWith('\n')) lineHeight = 0;
  }
  return { text: parts.join(''), words };
}

const WORD = /\S+/g;

/** The words of one upright text item, placed along its width in proportion to their characters. */
function addItemWords(item: PdfJsTextItem, itemStart: number, viewport: PdfJsViewport, styles: PdfJsStyles, words: LocatedWord[]): void {
  if (item.str.trim() === '' || !(item.width > 0)) return;
  const [va, vb, vc, vd, ve, vf] = viewport.transform as [number, number, number, number, number, number];
  const [ta, tb, tc, td, tx, ty] = item.transform as [number, number, number, number, number, number];
  // The item's matrix on the page as seen (viewport): upright text has no shear and a y axis pointing up.
  const a = va * ta + vc * tb;
  const b = vb * ta + vd * tb;
  const c = va * tc + vc * td;
  const d = vb * tc + vd * td;
  const x = va * tx + vc * ty + ve;
  const baseline = vb * tx + vd * ty + vf;
  if (!(a > 0) || !(d < 0) || Math.abs(b) > 1e-3 * a || Math.abs(c) > 1e-3 * -d) return;
  const size = -d;
  const style = item.fontName === undefined ? undefined : styles[item.fontName];
  const ascent = typeof style?.ascent === 'number' && style.ascent > 0 ? style.ascent : 0.8;
  const descent = typeof style?.descent === 'number' && style.descent < 0 ? style.descent : -0.2;
  const top = baseline - ascent * size;
  const bottom = baseline - descent * size;
  const perCharacter = (item.width * Math.hypot(va, vb)) / item.str.length;
  WORD.lastIndex = 0;
  let previous: LocatedWord | null = null;
  let previousEnd = 0;
  for (let match = WORD.exec(item.str); match !== null; match = WORD.exec(item.str)) {
    const from = match.index;
    const to = from + match[0].length;
    if (previous !== null) previous.spaceAfter = from - previousEnd === 1;
    previous = { text: match[0], x0: x + from * perCharacter, x1: x + to * perCharacter, top, bottom, start: itemStart + from, end: itemStart + to };
    words.push(previous);
    previousEnd = to;
  }
}
