import { Transform, type TransformCallback } from 'node:stream';

/**
 * Line endings as a CSV user expects them: CRLF (Windows), LF (Unix) and a
 * lone CR (old Mac) all end a line, however they are mixed in one file.
 *
 * papaparse guesses one line ending from the first chunk and splits only on
 * that one: in a file that starts with CRLF lines and goes on with LF lines
 * (rows appended by another program), the LF lines run together into one
 * ragged row; the other way round, every CR stays at the end of the last
 * cell, and "x" and "x\r" become two levels of a factor. Every ending is
 * therefore rewritten to LF before the parser sees the text, and the parser
 * is told to split on LF. A line break inside a quoted cell becomes LF too,
 * which changes nothing a model reads.
 */

/** One chunk with CRLF and lone CR written as LF; `pendingCr` says the previous chunk ended with a CR. */
export function lineEndingsToLf(chunk: string, pendingCr: boolean): { text: string; pendingCr: boolean } {
  // A CR at the very end may be the first half of a CRLF split across chunks: hold it back.
  const endsWithCr = chunk.endsWith('\r');
  let body = endsWithCr ? chunk.slice(0, -1) : chunk;
  // The CR held back from the previous chunk ends a line whether or not an LF follows it.
  if (pendingCr) body = body.startsWith('\n') ? body : `\n${body}`;
  return { text: body.replace(/\r\n?/g, '\n'), pendingCr: endsWithCr };
}

/** A stream of text chunks with every line ending written as LF (see lineEndingsToLf). */
export class LineEndingsToLf extends Transform {
  private pendingCr = false;

  constructor() {
    super({ decodeStrings: false, encoding: 'utf8' });
  }

  override _transform(chunk: string | Buffer, _encoding: BufferEncoding, callback: TransformCallback): void {
    const { text, pendingCr } = lineEndingsToLf(typeof chunk === 'string' ? chunk : chunk.toString('utf8'), this.pendingCr);
    this.pendingCr = pendingCr;
    callback(null, text);
  }

  override _flush(callback: TransformCallback): void {
    callback(null, this.pendingCr ? '\n' : '');
  }
}
