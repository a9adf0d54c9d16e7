import { Parser, type ParserOptions } from 'htmlparser2';
import { DomHandler, type Document, type DomHandlerOptions } from 'domhandler';
import { limitHint, type Limits } from '../limits.js';

/**
 * A document over one of the limits of src/limits.ts. Readers throw it from
 * deep inside parsing; readDocument turns it into a refusal with its message.
 */
export class DocumentLimitError extends Error {}

/**
 * A DOM builder that counts as it goes: parsing stops at the first element
 * nested deeper than `maxNestingDepth` or beyond the `maxElements`-th, before
 * the tree grows further. The readers walk the tree recursively, so without
 * this bound 100,000 nested <div>s would overflow the stack.
 */
class LimitedDomHandler extends DomHandler {
  private elements = 0;

  constructor(
    options: DomHandlerOptions,
    private readonly limits: Pick<Limits, 'maxNestingDepth' | 'maxElements'>,
  ) {
    super(undefined, options);
  }

  override onopentag(name: string, attribs: { [key: string]: string }): void {
    // tagStack holds the root document and every open element.
    const depth = this.tagStack.length;
    if (depth > this.limits.maxNestingDepth) {
      throw new DocumentLimitError(`elements nested more than ${this.limits.maxNestingDepth} deep (at <${name}>) ${limitHint('maxNestingDepth', this.limits.maxNestingDepth)}`);
    }
    if (++this.elements > this.limits.maxElements) {
      throw new DocumentLimitError(`more than ${this.limits.maxElements.toLocaleString('en-US')} elements ${limitHint('maxElements', this.limits.maxElements)}`);
    }
    super.onopentag(name, attribs);
  }
}

/** parseDocument of htmlparser2 within the nesting and element limits; throws DocumentLimitError past them. */
export function parseLimitedDocument(markup: string, options: ParserOptions & DomHandlerOptions, limits: Pick<Limits, 'maxNestingDepth' | 'maxElements'>): Document {
  const handler = new LimitedDomHandler(options, limits);
  new Parser(handler, options).end(markup);
  return handler.root;
}
