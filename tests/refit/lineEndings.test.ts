import { Readable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import { lineEndingsToLf, LineEndingsToLf } from '../../src/refit/lineEndings.js';

/** Every way of cutting `text` into two chunks, run through the stream. */
async function throughStream(chunks: readonly string[]): Promise<string> {
  let out = '';
  for await (const piece of Readable.from(chunks).pipe(new LineEndingsToLf())) out += piece as string;
  return out;
}

describe('line endings to LF', () => {
  it('writes CRLF, LF and lone CR as LF, and leaves other text alone', () => {
    expect(lineEndingsToLf('a\r\nb\nc\rd', false)).toEqual({ text: 'a\nb\nc\nd', pendingCr: false });
    expect(lineEndingsToLf('"x\r\ny",z', false)).toEqual({ text: '"x\ny",z', pendingCr: false });
  });

  it('holds back a CR at the end of a chunk until it knows whether an LF follows', () => {
    expect(lineEndingsToLf('a\r', false)).toEqual({ text: 'a', pendingCr: true });
    expect(lineEndingsToLf('\nb', true)).toEqual({ text: '\nb', pendingCr: false });
    expect(lineEndingsToLf('b', true)).toEqual({ text: '\nb', pendingCr: false });
    expect(lineEndingsToLf('\r', true)).toEqual({ text: '\n', pendingCr: true });
  });

  it('gives the same text however the input is cut into chunks (a CRLF split between two chunks is one line ending)', async () => {
    const text = 'score,group\r\n1,x\n2,y\r3,x\r\n\r\n4,y\r';
    const expected = 'score,group\n1,x\n2,y\n3,x\n\n4,y\n';
    for (let cut = 0; cut <= text.length; cut++) {
      expect(await throughStream([text.slice(0, cut), text.slice(cut)])).toBe(expected);
    }
    expect(await throughStream([...text])).toBe(expected);
  });
});
