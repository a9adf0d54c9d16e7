import { isTag, isText, type ChildNode, type Element } from 'domhandler';
import { REFERENCE_HEADING, TextBuilder } from './builder.js';
import { attribute, childByName, elementChildren, nextElement, previousElement, tagName } from './dom.js';
import { collapseWhitespace, readTableElement, writeTable, type TableDraft } from './tables.js';
import type { DocumentText } from './types.js';
import { defaultLimits, type Limits } from '../limits.js';
import { parseLimitedDocument } from './markupLimits.js';

/**
 * HTML reader (also reads the HTML that mammoth makes from DOCX).
 *
 * Keeps: the visible text, with block elements (p, div, li, headings,
 * table rows...) as line breaks and paragraphs as blank lines; <sup>, <sub>,
 * <i>, <em> flattened in place ("η<sub>p</sub><sup>2</sup>" -> "ηp2");
 * tables as tables (caption from <caption>, a <figure>'s <figcaption>, or a
 * "Table 2." paragraph right before the table; notes from <tfoot> rows of
 * one cell, other paragraphs of the table's <figure>, or "Note." paragraphs
 * right after it); footnote references as "[n]" so that a marker never
 * sticks to a number ("p = .03[2]", not "p = .032").
 *
 * Marks: headings, captions, tables, footnotes (ids like "fn1",
 * "footnote-1", class "footnotes", role doc-footnote/doc-endnotes) and
 * reference lists (after a heading such as "References" up to the next
 * heading of the same or a higher level, or markup with class "references",
 * "bibliography", "ref-list" or role doc-bibliography).
 *
 * Drops: <head>, <script>, <style>, <template>, <noscript>, <svg>, <iframe>,
 * images, and the back-links of footnotes.
 */
export function htmlToDocument(html: string, path: string, format: string, limits: Pick<Limits, 'maxNestingDepth' | 'maxElements'> = defaultLimits): DocumentText {
  // Throws DocumentLimitError for markup nested too deep or with too many elements (see src/limits.ts).
  const root = parseLimitedDocument(html, { decodeEntities: true, lowerCaseTags: true, lowerCaseAttributeNames: true }, limits);
  const walker = new HtmlWalker();
  walker.walkChildren(root.children);
  return walker.finish(path, format);
}

const DROPPED = new Set(['head', 'script', 'style', 'template', 'noscript', 'svg', 'iframe', 'object', 'embed', 'img', 'video', 'audio', 'canvas', 'button', 'select', 'input', 'textarea']);
const PARAGRAPH_BLOCKS = new Set(['p', 'blockquote', 'pre', 'ul', 'ol', 'dl', 'figure', 'hr', 'address', 'h1', 'h2', 'h3', 'h4', 'h5', 'h6']);
const LINE_BLOCKS = new Set(['div', 'section', 'article', 'main', 'header', 'footer', 'aside', 'nav', 'li', 'dt', 'dd', 'figcaption', 'caption', 'details', 'summary', 'form', 'fieldset', 'body', 'html', 'tr', 'center', 'legend']);
const HEADING_LEVEL: Record<string, number> = { h1: 1, h2: 2, h3: 3, h4: 4, h5: 5, h6: 6 };

const REFERENCES_MARKUP = /\b(?:references|reference-list|ref-list|reflist|bibliography|citations|csl-bib-body)\b/i;
const FOOTNOTES_MARKUP = /\b(?:footnotes?|endnotes?)\b/i;
const FOOTNOTE_ID = /^(?:fn|footnote|endnote|note)[-_:]?\d+$/i;
const FOOTNOTE_BACKLINK = /^#(?:fnref|footnote-ref|endnote-ref|ref-fn)/i;
const FOOTNOTE_LINK = /^#(?:fn|footnote|endnote|note)[-_:]?\d+$/i;
const TABLE_CAPTION_PARAGRAPH = /^\s*Table\s+[A-Z]?\d+[A-Za-z]?\b/;
const TABLE_LABEL_ONLY = /^\s*Table\s+[A-Z]?\d+[A-Za-z]?\.?\s*$/;
const TABLE_NOTE_PARAGRAPH = /^\s*(?:Notes?|Source)\s*[.:]/;

class HtmlWalker {
  private readonly builder = new TextBuilder();
  /** Paragraphs read as a table's caption or notes, so they are not written twice. */
  private readonly claimed = new Set<Element>();
  private readonly neighbours = new Map<Element, { caption: string | null; notes: string[] }>();
  /** An open reference list started by a heading: where it began and the heading's level. */
  private referencesByHeading: { start: number; level: number } | null = null;
  private preformatted = 0;

  finish(path: string, format: string): DocumentText {
    this.closeReferencesByHeading();
    const text = this.builder.text();
    return { path, format, text, pageOf: () => null, regions: this.builder.regions(), tables: this.builder.tables };
  }

  walkChildren(children: readonly ChildNode[]): void {
    // Captions and notes written as paragraphs beside a table are claimed before anything is written.
    for (const child of children) {
      if (isTag(child) && (child.name === 'table' || (child.name === 'figure' && figureTable(child)))) this.claimNeighbours(child);
    }
    for (const child of children) this.walk(child);
  }

  private walk(node: ChildNode): void {
    if (isText(node)) {
      if (this.preformatted > 0) this.builder.verbatim(node.data);
      else this.builder.inline(node.data);
      return;
    }
    if (!isTag(node) || this.claimed.has(node)) return;
    const name = node.name.toLowerCase();
    if (DROPPED.has(name) || isFootnoteBacklink(node)) return;
    if (name === 'br') return this.builder.lineBreak();
    if (name === 'table') return this.walkTable(node);
    if (name in HEADING_LEVEL) return this.walkHeading(node, HEADING_LEVEL[name]!);
    if (isFootnoteReference(node)) return this.writeFootnoteReference(node);
    if (name === 'figure' && figureTable(node)) return this.walkFigureWithTable(node);
    const kind = regionOf(node);
    const block = PARAGRAPH_BLOCKS.has(name) ? 2 : LINE_BLOCKS.has(name) ? 1 : 0;
    if (block > 0) this.builder.blockBreak(block);
    if (kind) this.builder.open(kind);
    if (name === 'pre') this.preformatted += 1;
    this.walkChildren(node.children);
    if (name === 'pre') this.preformatted -= 1;
    if (kind) this.builder.close();
    if (block > 0) this.builder.blockBreak(block);
  }

  private walkHeading(node: Element, level: number): void {
    if (this.referencesByHeading && level <= this.referencesByHeading.level) this.closeReferencesByHeading();
    this.builder.blockBreak(2);
    this.builder.open('heading');
    this.walkChildren(node.children);
    this.builder.close();
    this.builder.blockBreak(2);
    if (REFERENCE_HEADING.test(collapseWhitespace(inlineText(node)))) {
      this.closeReferencesByHeading();
      this.referencesByHeading = { start: this.builder.offset, level };
    }
  }

  private closeReferencesByHeading(): void {
    if (!this.referencesByHeading) return;
    this.builder.addSpan('references', this.referencesByHeading.start, this.builder.offset);
    this.referencesByHeading = null;
  }

  private writeFootnoteReference(node: Element): void {
    const label = collapseWhitespace(inlineText(node)).replace(/^\[|\]$/g, '');
    this.builder.verbatim(`[${label}]`);
  }

  private walkTable(table: Element): void {
    writeTable(this.builder, this.withNeighbours(table, readTableElement(table, inlineText)));
  }

  private walkFigureWithTable(figure: Element): void {
    const table = figureTable(figure)!;
    const draft = readTableElement(table, inlineText);
    for (const child of elementChildren(figure)) {
      if (child === table || child.name === 'table') continue;
      const text = collapseWhitespace(inlineText(child));
      if (child.name === 'figcaption' && draft.caption === null) draft.caption = text;
      else if (text) draft.notes.push(text);
    }
    writeTable(this.builder, this.withNeighbours(figure, draft));
  }

  /** Adds the caption and notes found beside the table when its own markup has none. */
  private withNeighbours(tableNode: Element, draft: TableDraft): TableDraft {
    const found = this.neighbours.get(tableNode);
    if (!found) return draft;
    return { caption: draft.caption ?? found.caption, notes: [...draft.notes, ...found.notes], rows: draft.rows };
  }

  /**
   * A "Table 1. Title" paragraph (or a "Table 1" paragraph followed by a
   * title paragraph) right before a table is its caption, and "Note."
   * paragraphs right after it are its notes (that is how a word processor's
   * tables arrive through mammoth). They are claimed so they are written
   * once, inside the table's block.
   */
  private claimNeighbours(tableNode: Element): void {
    const found: { caption: string | null; notes: string[] } = { caption: null, notes: [] };
    const table = tableNode.name === 'table' ? tableNode : figureTable(tableNode)!;
    const hasOwnCaption = childByName(table, 'caption') !== undefined || childByName(tableNode, 'figcaption') !== undefined;
    const before = previousElement(tableNode);
    if (!hasOwnCaption && before && tagName(before) === 'p' && !this.claimed.has(before)) {
      const title = collapseWhitespace(inlineText(before));
      const label = previousElement(before);
      const labelText = label && tagName(label) === 'p' ? collapseWhitespace(inlineText(label)) : '';
      if (TABLE_CAPTION_PARAGRAPH.test(title)) {
        found.caption = title;
        this.claimed.add(before);
      } else if (label && TABLE_LABEL_ONLY.test(labelText)) {
        found.caption = `${labelText} ${title}`;
        this.claimed.add(label);
        this.claimed.add(before);
      }
    }
    for (let after = nextElement(tableNode); after && tagName(after) === 'p'; after = nextElement(after)) {
      const text = collapseWhitespace(inlineText(after));
      if (!TABLE_NOTE_PARAGRAPH.test(text)) break;
      found.notes.push(text);
      this.claimed.add(after);
    }
    if (found.caption !== null || found.notes.length > 0) this.neighbours.set(tableNode, found);
  }
}

function figureTable(figure: Element): Element | undefined {
  return childByName(figure, 'table');
}

/** Footnote, reference-list and caption markup by element, class, id or ARIA role. */
function regionOf(node: Element): 'footnote' | 'references' | 'caption' | null {
  const name = node.name.toLowerCase();
  const classes = attribute(node, 'class');
  const role = attribute(node, 'role');
  const id = attribute(node, 'id');
  if (role === 'doc-bibliography' || (name !== 'a' && REFERENCES_MARKUP.test(classes)) || /^(?:references|bibliography)$/i.test(id)) return 'references';
  if (role === 'doc-endnotes' || role === 'doc-footnote' || role === 'doc-endnote' || FOOTNOTES_MARKUP.test(classes) || (name === 'li' && FOOTNOTE_ID.test(id))) return 'footnote';
  if (name === 'figcaption' || name === 'caption') return 'caption';
  return null;
}

function isFootnoteBacklink(node: Element): boolean {
  return node.name === 'a' && (FOOTNOTE_BACKLINK.test(attribute(node, 'href')) || attribute(node, 'role') === 'doc-backlink');
}

/** A link to a footnote, or a <sup> holding only such a link. */
function isFootnoteReference(node: Element): boolean {
  if (node.name === 'a') return attribute(node, 'role') === 'doc-noteref' || FOOTNOTE_LINK.test(attribute(node, 'href'));
  if (node.name !== 'sup') return false;
  const meaningful = node.children.filter((child) => !(isText(child) && child.data.trim() === ''));
  return meaningful.length === 1 && isTag(meaningful[0]!) && isFootnoteReference(meaningful[0]);
}

/**
 * The text of an element as one line: sub/superscripts joined in place,
 * block children and <br> separated by a space, footnote references as
 * "[n]", dropped elements and back-links left out.
 */
export function inlineText(node: ChildNode): string {
  if (isText(node)) return node.data;
  if (!isTag(node)) return '';
  const name = node.name.toLowerCase();
  if (DROPPED.has(name) || isFootnoteBacklink(node)) return '';
  if (name === 'br') return ' ';
  if (isFootnoteReference(node)) return `[${collapseWhitespace(node.children.map(inlineText).join('')).replace(/^\[|\]$/g, '')}]`;
  const inner = node.children.map(inlineText).join('');
  return PARAGRAPH_BLOCKS.has(name) || LINE_BLOCKS.has(name) || name === 'td' || name === 'th' ? ` ${inner} ` : inner;
}
