import { describe, expect, it } from 'vitest';
import { quoteFromDocument } from '../../src/checks/describe.js';

describe('quotes from the document in messages', () => {
  it('collapse line breaks and runs of spaces', () => {
    expect(quoteFromDocument("  Where Mauchly's test indicated\na violation   of sphericity  ", 100)).toBe("Where Mauchly's test indicated a violation of sphericity");
  });

  it('are cut at a word boundary with an ellipsis, never mid-word', () => {
    const sentence = "Where Mauchly's test indicated a violation of sphericity, Greenhouse-Geisser corrections were applied to the degrees of freedom.";
    const quoted = quoteFromDocument(sentence, 100);
    expect(quoted).toBe("Where Mauchly's test indicated a violation of sphericity, Greenhouse-Geisser corrections were…");
    expect(quoted.length).toBeLessThanOrEqual(101);
  });

  it('drop a trailing comma before the ellipsis, and cut a single very long word where it must', () => {
    expect(quoteFromDocument('one two three, four five', 15)).toBe('one two three…');
    expect(quoteFromDocument('x'.repeat(50), 10)).toBe(`${'x'.repeat(10)}…`);
  });
});
