import { describe, expect, it } from 'vitest';
import { createLineIndex, lineAndColumn } from '../../src/scan/lines.js';

describe('line index', () => {
  const text = 'first line\nsecond\r\nthird\rfourth';

  it('gives 1-based lines and columns', () => {
    const at = createLineIndex(text);
    expect(at(0)).toEqual({ line: 1, column: 1 });
    expect(at(4)).toEqual({ line: 1, column: 5 });
    expect(at(text.indexOf('second'))).toEqual({ line: 2, column: 1 });
    expect(at(text.indexOf('third') + 2)).toEqual({ line: 3, column: 3 });
    expect(at(text.indexOf('fourth'))).toEqual({ line: 4, column: 1 });
  });

  it('counts "\\r\\n" as one line break', () => {
    expect(lineAndColumn(text, text.indexOf('third'))).toEqual({ line: 3, column: 1 });
  });

  it('clamps offsets outside the text', () => {
    const at = createLineIndex(text);
    expect(at(-5)).toEqual({ line: 1, column: 1 });
    expect(at(text.length + 10)).toEqual({ line: 4, column: 7 });
  });

  it('handles empty text', () => {
    expect(lineAndColumn('', 0)).toEqual({ line: 1, column: 1 });
  });
});
