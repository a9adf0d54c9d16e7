/**
 * The table readers' copy of the text: characters that only change how the
 * text looks are written as ASCII, one for one (common practice: Unicode's
 * space characters and full-width forms, whose code points are listed in the
 * Unicode Standard's charts "General Punctuation" and "Halfwidth and
 * Fullwidth Forms").
 */
import { describe, expect, it } from 'vitest';
import { layoutTable, layoutText } from '../../src/scan/layoutText.js';

describe('layoutText', () => {
  it('writes no-break, thin, narrow and ideographic spaces as spaces, keeping every offset', () => {
    const text = 'p\u00a0<\u2009.001, F(1,\u202f44)\u3000=\u20074.2';
    const folded = layoutText(text);
    expect(folded).toBe('p < .001, F(1, 44) = 4.2');
    expect(folded.length).toBe(text.length);
  });

  it('writes zero-width spaces, word joiners and byte-order marks as spaces', () => {
    expect(layoutText('\ufeffF(\u200b1, 44) =\u20604.2')).toBe(' F( 1, 44) = 4.2');
  });

  it('writes full-width brackets, signs and digits as ASCII', () => {
    expect(layoutText('\uff08n\uff1d58\uff09 \uff10.05')).toBe('(n=58) 0.05');
  });

  it('ends lines at lone carriage returns, and leaves CRLF and plain text as they are', () => {
    expect(layoutText('a\rb\r\nc\n')).toBe('a\nb\r\nc\n');
    const plain = 'Table 2\nSource df F p\n';
    expect(layoutText(plain)).toBe(plain);
  });

  it('rewrites a marked-up table\'s cells, caption and notes, and returns an untouched table itself', () => {
    const table = { caption: 'Table\u00a02', notes: ['df\u00a0=\u00a01, 44'], rows: [['F\uff081, 44\uff09'], ['4.2']] };
    expect(layoutTable(table)).toEqual({ caption: 'Table 2', notes: ['df = 1, 44'], rows: [['F(1, 44)'], ['4.2']] });
    const plain = { caption: null, notes: [], rows: [['F'], ['4.2']] };
    expect(layoutTable(plain)).toBe(plain);
  });
});
