import { isTag, isText, type ChildNode, type Element } from 'domhandler';
import { REFERENCE_HEADING, TextBuilder } from './builder.js';
import { attribute, childByName, childrenByName, descendantsByName, elementChildren } from './dom.js';
import { collapseWhitespace, readTableElement, writeTable } from './tables.js';
import type { DocumentText } from './types.js';
import { defaultLimits, type Limits } from '../limits.js';
import { parseLimitedDocument } from './markupLimits.js';
import { appendAll } from '../arrays.js';

/** Why a JATS file could not be read (not a thrown error: the caller turns it into a ReadOutcome). */
export type JatsOutcome = { ok: true; document: DocumentText } | { ok: false; error: string };

/**
 * JATS XML reader (journal article XML).
 *
 * Keeps: <article-title> and <abstract> from the front matter; the <body>
 * (sections with their titles, paragraphs, lists, formulas as text); the
 * back matter (acknowledgements, appendices, <fn-group> footnotes,
 * <ref-list>); <table-wrap> as tables (label and caption as the caption,
 * <table> rows as cells, <table-wrap-foot> as notes); figure captions.
 * <sup>, <sub>, <italic>, <bold> are flattened in place ("η<sub>p</sub><sup>2</sup>"
 * -> "ηp2"); footnote cross-references become "[n]".
 *
 * Marks: headings (titles), captions, tables, footnotes, the reference list.
 *
 * Drops: the rest of the front matter (journal data, authors, dates,
 * permissions), graphics, and of alternative renderings of one formula all
 * but the first textual one.
 */
export function jatsToDocument(xml: string, path: string, limits: Pick<Limits, 'maxNestingDepth' | 'maxElements'> = defaultLimits): JatsOutcome {
  // Throws DocumentLimitError for markup nested too deep or with too many elements (see src/limits.ts).
  const root = parseLimitedDocument(xml, { xmlMode: true, decodeEntities: true }, limits);
  const article = root.children.filter(isTag).find((element) => localName(element) === 'article');
  if (!article) {
    const rootName = root.children.filter(isTag)[0]?.name;
    return { ok: false, error: rootName ? `XML, but not a JATS article (the root element is <${rootName}>, not <article>)` : 'no XML elements found; the file is not a JATS article' };
  }
  const walker = new JatsWalker();
  walker.readArticle(article);
  return { ok: true, document: walker.finish(path) };
}

/** Element names without a namespace prefix ("mml:math" -> "math"). */
function localName(element: Element): string {
  const name = element.name;
  const colon = name.indexOf(':');
  return colon === -1 ? name : name.slice(colon + 1);
}

const DROPPED = new Set(['graphic', 'inline-graphic', 'media', 'object-id', 'processing-meta', 'permissions', 'history', 'pub-date', 'contrib-group', 'aff', 'author-notes', 'kwd-group', 'funding-group', 'counts', 'self-uri', 'related-article', 'custom-meta-group', 'article-categories', 'article-id', 'journal-meta']);
const PARAGRAPH_BLOCKS = new Set(['p', 'list', 'disp-formula', 'disp-quote', 'preformat', 'statement', 'def-list', 'speech', 'verse-group']);
const LINE_BLOCKS = new Set(['sec', 'app', 'app-group', 'ack', 'boxed-text', 'notes', 'glossary', 'list-item', 'def-item', 'abstract', 'trans-abstract', 'body', 'back', 'floats-group', 'ref', 'sub-article', 'front-stub']);
/** Citation parts written without spaces between them in element-citation. */
const STRUCTURED_CITATIONS = new Set(['element-citation', 'nlm-citation']);

class JatsWalker {
  private readonly builder = new TextBuilder();
  private structuredCitation = 0;

  finish(path: string): DocumentText {
    return { path, format: 'jats', text: this.builder.text(), pageOf: () => null, regions: this.builder.regions(), tables: this.builder.tables };
  }

  readArticle(article: Element): void {
    const front = childByName(article, 'front');
    const meta = front ? childByName(front, 'article-meta') : undefined;
    if (meta) {
      for (const titleGroup of childrenByName(meta, 'title-group')) {
        for (const title of [...childrenByName(titleGroup, 'article-title'), ...childrenByName(titleGroup, 'subtitle')]) this.writeHeading(title);
      }
      for (const abstract of elementChildren(meta).filter((child) => ['abstract', 'trans-abstract'].includes(localName(child)))) this.walk(abstract);
    }
    for (const part of elementChildren(article)) {
      if (['body', 'back', 'floats-group', 'sub-article'].includes(localName(part))) this.walk(part);
    }
  }

  private walkChildren(children: readonly ChildNode[]): void {
    for (const child of children) this.walk(child);
  }

  private walk(node: ChildNode): void {
    if (isText(node)) return this.builder.inline(node.data);
    if (!isTag(node)) return;
    const name = localName(node);
    if (DROPPED.has(name)) return;
    switch (name) {
      case 'title':
        return this.writeHeading(node);
      case 'break':
        return this.builder.lineBreak();
      case 'table-wrap':
        return this.writeTableWrap(node);
      case 'fig':
        return this.writeCaptionBlock(node);
      case 'fn-group':
      case 'fn':
      case 'table-wrap-foot':
        return this.writeFootnotes(node);
      case 'ref-list':
        return this.writeRegionBlock(node, 'references');
      case 'sec':
        if (isReferenceSection(node)) return this.writeRegionBlock(node, 'references');
        break;
      case 'xref':
        return this.writeCrossReference(node);
      case 'alternatives':
        return this.walkFirstAlternative(node);
      case 'label':
        this.walkChildren(node.children);
        return this.builder.space();
    }
    const block = PARAGRAPH_BLOCKS.has(name) ? 2 : LINE_BLOCKS.has(name) ? 1 : 0;
    if (block > 0) this.builder.blockBreak(block);
    const structured = STRUCTURED_CITATIONS.has(name);
    if (structured) this.structuredCitation += 1;
    for (const child of node.children) {
      this.walk(child);
      if (this.structuredCitation > 0 && isTag(child)) this.builder.space();
    }
    if (structured) this.structuredCitation -= 1;
    if (block > 0) this.builder.blockBreak(block);
  }

  private writeHeading(node: Element): void {
    this.builder.blockBreak(2);
    this.builder.open('heading');
    this.walkChildren(node.children);
    this.builder.close();
    this.builder.blockBreak(2);
  }

  private writeRegionBlock(node: Element, kind: 'references'): void {
    this.builder.blockBreak(2);
    this.builder.open(kind);
    for (const child of node.children) {
      this.walk(child);
      if (isTag(child) && ['fn', 'ref', 'p'].includes(localName(child))) this.builder.blockBreak(1);
    }
    this.builder.close();
    this.builder.blockBreak(2);
  }

  /** Each footnote on its own line, its label first ("1 Without outliers, ..."). */
  private writeFootnotes(node: Element): void {
    const footnotes = localName(node) === 'fn' ? [node] : elementChildren(node).filter((child) => localName(child) === 'fn');
    const title = childByName(node, 'title');
    if (title) this.writeHeading(title);
    this.builder.blockBreak(2);
    for (const footnote of footnotes) {
      this.builder.open('footnote');
      this.builder.inline(collapseWhitespace(jatsInlineText(footnote)));
      this.builder.close();
      this.builder.blockBreak(1);
    }
    this.builder.blockBreak(2);
  }

  private writeCaptionBlock(figure: Element): void {
    const caption = captionText(figure);
    if (!caption) return;
    this.builder.blockBreak(2);
    this.builder.open('caption');
    this.builder.verbatim(caption);
    this.builder.close();
    this.builder.blockBreak(2);
  }

  private writeTableWrap(wrap: Element): void {
    const table = descendantsByName(wrap, 'table')[0];
    const draft = table ? readTableElement(table, jatsInlineText) : { caption: null, notes: [], rows: [] };
    draft.caption = captionText(wrap) || draft.caption;
    for (const foot of childrenByName(wrap, 'table-wrap-foot')) {
      const parts = elementChildren(foot);
      const notes = parts.length > 0 ? parts.map((part) => jatsInlineText(part)) : [jatsInlineText(foot)];
      appendAll(draft.notes, notes.map(collapseWhitespace).filter((note) => note.length > 0));
    }
    writeTable(this.builder, draft);
  }

  private writeCrossReference(node: Element): void {
    const text = collapseWhitespace(jatsInlineText(node));
    if (attribute(node, 'ref-type') === 'fn' || attribute(node, 'ref-type') === 'table-fn') this.builder.verbatim(`[${text.replace(/^\[|\]$/g, '')}]`);
    else this.builder.inline(text);
  }

  private walkFirstAlternative(node: Element): void {
    const textual = elementChildren(node).find((child) => !DROPPED.has(localName(child)));
    if (textual) this.walk(textual);
  }
}

/** A section titled "References" (or typed so) holds a reference list even without <ref-list>. */
function isReferenceSection(section: Element): boolean {
  const title = childByName(section, 'title');
  return attribute(section, 'sec-type') === 'references' || (title !== undefined && REFERENCE_HEADING.test(collapseWhitespace(jatsInlineText(title))));
}

/** "Table 1. Title. More caption text." from <label> and <caption>. */
function captionText(wrap: Element): string {
  const label = childByName(wrap, 'label');
  const caption = childByName(wrap, 'caption');
  const captionParts = caption ? elementChildren(caption).map(jatsInlineText) : [];
  const parts = [label ? jatsInlineText(label) : '', ...(captionParts.length > 0 ? captionParts : caption ? [jatsInlineText(caption)] : [])];
  return collapseWhitespace(parts.join(' '));
}

/** An element's text on one line: inline markup flattened, footnote cross-references as "[n]". */
export function jatsInlineText(node: ChildNode): string {
  if (isText(node)) return node.data;
  if (!isTag(node)) return '';
  const name = localName(node);
  if (DROPPED.has(name)) return '';
  const inner = node.children.map(jatsInlineText).join('');
  if (name === 'xref' && ['fn', 'table-fn'].includes(attribute(node, 'ref-type'))) return `[${collapseWhitespace(inner).replace(/^\[|\]$/g, '')}]`;
  if (name === 'break' || PARAGRAPH_BLOCKS.has(name) || LINE_BLOCKS.has(name) || name === 'td' || name === 'th' || name === 'title') return ` ${inner} `;
  return inner;
}
