import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { collapseSpaces, TextBuilder } from '../../src/documents/builder.js';

/**
 * TextBuilder.inline writes the words of a text node as one part (a DOCX of
 * 40 MB of "a a a ..." took 3.4 GB when every word and space was a part of
 * its own): the text is the same as writing the words one by one, as it did
 * before, which the reference below still does.
 */

/** The former inline(): each word written on its own, a space before every word after the first. */
class WordByWordBuilder {
  private text = '';
  private spacePending = false;

  inline(text: string): void {
    const words = text.split(/[ \t\n\r\f\v]+/).filter((piece) => piece.length > 0);
    if (/^[ \t\n\r\f\v]/.test(text)) this.spacePending = true;
    words.forEach((word, index) => {
      if (index > 0) this.spacePending = true;
      if (this.spacePending && this.text.length > 0 && !this.text.endsWith('\n') && !this.text.endsWith(' ')) this.text += ' ';
      this.spacePending = false;
      this.text += word;
    });
    if (/[ \t\n\r\f\v]$/.test(text) && words.length > 0) this.spacePending = true;
  }

  lineBreak(): void {
    this.spacePending = false;
    this.text += '\n';
  }

  result(): string {
    return this.text;
  }
}

const pieces = fc.array(fc.constantFrom('a', 'bc', ' ', '  ', '\t', '\n', '\r\n', '\f', '\v', '\u00a0', 'é', '.'), { maxLength: 12 }).map((parts) => parts.join(''));

describe('collapseSpaces and TextBuilder.inline', () => {
  it('collapseSpaces is replace(/[ \\t\\n\\r\\f\\v]+/g, " ")', () => {
    fc.assert(fc.property(pieces, (text) => collapseSpaces(text) === text.replace(/[ \t\n\r\f\v]+/g, ' ')));
    expect(collapseSpaces('a b c')).toBe('a b c');
    expect(collapseSpaces(' a \n\n b\t')).toBe(' a b ');
  });

  it('inline writes the same text as writing word by word', () => {
    const step = fc.oneof(pieces.map((text) => ({ inline: text })), fc.constant({ inline: null }));
    fc.assert(
      fc.property(fc.array(step, { maxLength: 10 }), (steps) => {
        const builder = new TextBuilder();
        const reference = new WordByWordBuilder();
        for (const { inline } of steps) {
          if (inline === null) {
            builder.lineBreak();
            reference.lineBreak();
          } else {
            builder.inline(inline);
            reference.inline(inline);
          }
        }
        return builder.text() === reference.result();
      }),
      { numRuns: 2000 },
    );
  });

  it('40 MB of one-letter words is written as one part, in well under a gigabyte', () => {
    const builder = new TextBuilder();
    const before = process.memoryUsage().rss;
    builder.inline('a '.repeat(20_000_000));
    expect(builder.text().length).toBe(39_999_999);
    expect(process.memoryUsage().rss - before).toBeLessThan(500_000_000);
  });
});
