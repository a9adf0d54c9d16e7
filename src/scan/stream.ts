/**
 * Scanning text too large to hold as one string (a 1 GB text file is more
 * than a JavaScript string can be) in bounded memory.
 *
 * The text is decoded as it is read and cut into windows. Each window owns a
 * stretch of `chunkSize` characters and sees `overlap` characters on each
 * side of it; it is scanned like a whole text, and of what it finds only the
 * results that START in its own stretch are kept. Every result therefore
 * comes from exactly one window, and since a result (with its p and effect
 * sizes, and the earlier results a plural "ps" reaches back to) is far
 * shorter than the overlap, the window that owns it reads it exactly as a
 * scan of the whole text would. Offsets are offsets into the whole text
 * (UTF-16 code units, like the scanner's); line and column numbers are those
 * of the whole text.
 *
 * Memory: about (chunkSize + 2 * overlap) characters of text, plus the
 * scanner's copies of one window, plus the results.
 */

import { createLineIndex, type LineAndColumn } from './lines.js';
import { scanText } from './scan.js';
import type { ReportedResult } from './types.js';
import { detectTextEncoding, invalidUtf8Message, nulBytesMessage, type TextEncoding } from '../documents/text.js';

export interface StreamOptions {
  /** Characters each window owns (default 4 Mi). */
  chunkSize?: number;
  /** Characters each window sees before and after the stretch it owns (default 64 Ki). */
  overlap?: number;
}

export const DEFAULT_CHUNK_SIZE = 4 * 1024 * 1024;
export const DEFAULT_OVERLAP = 64 * 1024;

/** One window of the text: its characters and where they sit in the whole text. */
export interface TextWindow {
  text: string;
  /** Offset in the whole text of text[0]. */
  start: number;
  /** The stretch [ownStart, ownEnd) of the whole text whose results this window reports. */
  ownStart: number;
  ownEnd: number;
  /** Line and column in the whole text of a window offset. */
  locate(offset: number): LineAndColumn;
}

/** A text that cannot be decoded (invalid UTF-8, NUL bytes, UTF-32). */
export class TextDecodingError extends Error {}

/** A chunk source: a Node readable stream of bytes, or any async iterable of byte chunks or strings. */
export type TextSource = AsyncIterable<Uint8Array | string>;

/**
 * Decodes byte chunks to text: UTF-8, or UTF-16 by its byte-order mark
 * (src/documents/text.ts has the rules); strings pass through. Throws
 * TextDecodingError on invalid UTF-8 or NUL bytes, naming the byte offset.
 */
export async function* decodeChunks(source: TextSource): AsyncGenerator<string> {
  let decoder: TextDecoder | null = null;
  let encoding: TextEncoding = 'utf-8';
  let head: Uint8Array | null = new Uint8Array(0);
  let consumed = 0;
  let lines = 1;
  for await (const chunk of source) {
    if (typeof chunk === 'string') {
      yield chunk;
      continue;
    }
    let bytes: Uint8Array = chunk;
    if (decoder === null) {
      // The byte-order mark needs the first four bytes, which may come in more than one chunk.
      head = concat(head!, bytes);
      if (head.length < 4) continue;
      const detected = detectTextEncoding(head);
      if (!detected.ok) throw new TextDecodingError(detected.error);
      encoding = detected.encoding;
      decoder = new TextDecoder(encoding, { fatal: true, ignoreBOM: true });
      bytes = head.subarray(detected.bomLength);
      consumed = detected.bomLength;
      head = null;
    }
    yield decodePiece(decoder, bytes, encoding, consumed, lines, true);
    if (encoding === 'utf-8') for (const byte of bytes) if (byte === 0x0a) lines++;
    consumed += bytes.length;
  }
  if (decoder === null && head !== null && head.length > 0) {
    const detected = detectTextEncoding(head);
    if (!detected.ok) throw new TextDecodingError(detected.error);
    encoding = detected.encoding;
    decoder = new TextDecoder(encoding, { fatal: true, ignoreBOM: true });
    yield decodePiece(decoder, head.subarray(detected.bomLength), encoding, detected.bomLength, 1, true);
  }
  if (decoder !== null) yield decodePiece(decoder, new Uint8Array(0), encoding, consumed, lines, false);
}

function decodePiece(decoder: TextDecoder, bytes: Uint8Array, encoding: TextEncoding, base: number, line: number, stream: boolean): string {
  if (encoding === 'utf-8' && bytes.includes(0)) throw new TextDecodingError(nulBytesMessage(bytes));
  try {
    const text = decoder.decode(bytes, { stream });
    if (encoding !== 'utf-8' && text.includes('\u0000')) throw new TextDecodingError('binary content (NUL characters) in a UTF-16 text file; is the extension right?');
    return text;
  } catch (error) {
    if (error instanceof TextDecodingError) throw error;
    if (encoding === 'utf-8') throw new TextDecodingError(invalidUtf8Message(bytes, base, line));
    throw new TextDecodingError(`truncated ${encoding.toUpperCase()} text: an odd number of bytes`);
  }
}

function concat(a: Uint8Array, b: Uint8Array): Uint8Array {
  const joined = new Uint8Array(a.length + b.length);
  joined.set(a, 0);
  joined.set(b, a.length);
  return joined;
}

/**
 * Cuts decoded text into overlapping windows (see the module comment). A
 * window never starts between "\r" and "\n", so line counts stay right.
 */
export async function* textWindows(source: TextSource, options: StreamOptions = {}): AsyncGenerator<TextWindow> {
  const chunkSize = Math.max(1, Math.floor(options.chunkSize ?? DEFAULT_CHUNK_SIZE));
  const overlap = Math.max(0, Math.floor(options.overlap ?? DEFAULT_OVERLAP));
  let buffer = '';
  /** Offset in the whole text of buffer[0]. */
  let bufferStart = 0;
  /** Lines before buffer[0] (line breaks counted), and the offset where the line holding buffer[0] starts. */
  let linesBefore = 0;
  let lineStart = 0;
  let ownStart = 0;
  let ended = false;
  const pieces = decodeChunks(source)[Symbol.asyncIterator]();

  const makeWindow = (ownEnd: number, textEnd: number): TextWindow => {
    let start = Math.max(bufferStart, ownStart - overlap);
    if (start > bufferStart && buffer.charCodeAt(start - bufferStart - 1) === 13 && buffer.charCodeAt(start - bufferStart) === 10) start -= 1;
    // Lines from buffer[0] to the window's start.
    const skipped = countLineBreaks(buffer, 0, start - bufferStart);
    const startLine = linesBefore + skipped.count + 1;
    const startLineStart = skipped.lastStart === -1 ? lineStart : bufferStart + skipped.lastStart;
    const text = buffer.slice(start - bufferStart, textEnd - bufferStart);
    let index: ((offset: number) => LineAndColumn) | null = null;
    return {
      text,
      start,
      ownStart,
      ownEnd,
      locate(offset: number): LineAndColumn {
        index ??= createLineIndex(text);
        const local = index(offset);
        if (local.line === 1) return { line: startLine, column: start + offset - startLineStart + 1 };
        return { line: startLine + local.line - 1, column: local.column };
      },
    };
  };

  for (;;) {
    // Fill the buffer until the window owning [ownStart, ownStart + chunkSize) can see its overlap after.
    while (!ended && bufferStart + buffer.length < ownStart + chunkSize + overlap) {
      const next = await pieces.next();
      if (next.done) ended = true;
      else buffer += next.value;
    }
    const textEnd = bufferStart + buffer.length;
    if (ended && ownStart >= textEnd) {
      if (ownStart === 0) yield makeWindow(0, 0); // an empty text is one empty window
      return;
    }
    const ownEnd = ended ? Math.min(textEnd, ownStart + chunkSize) : ownStart + chunkSize;
    yield makeWindow(ownEnd, Math.min(textEnd, ownEnd + overlap));
    if (ownEnd >= textEnd && ended) return;
    ownStart = ownEnd;
    // Drop what no later window sees; keep one character more, to see a "\r\n" pair whole.
    const keepFrom = Math.max(bufferStart, ownStart - overlap - 1);
    if (keepFrom > bufferStart) {
      const dropped = countLineBreaks(buffer, 0, keepFrom - bufferStart);
      linesBefore += dropped.count;
      if (dropped.lastStart !== -1) lineStart = bufferStart + dropped.lastStart;
      buffer = buffer.slice(keepFrom - bufferStart);
      bufferStart = keepFrom;
    }
  }
}

/**
 * Line breaks ("\r\n", "\r", "\n") that END in text[from, to), and where the
 * last line starting in it begins (-1 when none). A "\r" at to - 1 followed
 * by "\n" at `to` is left for the next count, so a pair is counted once.
 */
function countLineBreaks(text: string, from: number, to: number): { count: number; lastStart: number } {
  let count = 0;
  let lastStart = -1;
  for (let at = from; at < to; at++) {
    const code = text.charCodeAt(at);
    if (code === 10 || (code === 13 && text.charCodeAt(at + 1) !== 10)) {
      count++;
      lastStart = at + 1;
    }
  }
  return { count, lastStart };
}

/** A result found by the stream scanner, with its line and column in the whole text. */
export type StreamedResult = ReportedResult & { line: number; column: number };

/**
 * Scans a text source of any size for reported results, in document order;
 * offsets, lines and columns refer to the whole text. Throws
 * TextDecodingError when the bytes are not valid UTF-8 (or UTF-16 with a mark).
 */
export async function* scanTextStream(source: TextSource, options: StreamOptions = {}): AsyncGenerator<StreamedResult> {
  for await (const window of textWindows(source, options)) {
    for (const result of scanText(window.text).results) {
      const start = result.start + window.start;
      if (start < window.ownStart || start >= window.ownEnd) continue;
      const { line, column } = window.locate(result.start);
      // A copy: the result's strings are slices of the window's text, and would keep the window alive as long as the result.
      yield { ...shiftResult(structuredClone(result), window.start), line, column };
    }
  }
}

/** A result with every offset in it (its own, its p's, its effects', its table cells') moved by `by`. */
export function shiftResult<T extends ReportedResult>(result: T, by: number): T {
  if (by === 0) return result;
  const cells = (record: Record<string, { start: number; end: number } | undefined>): Record<string, unknown> =>
    Object.fromEntries(Object.entries(record).map(([key, cell]) => [key, cell === undefined ? cell : { ...cell, start: cell.start + by, end: cell.end + by }]));
  return {
    ...result,
    start: result.start + by,
    end: result.end + by,
    p: result.p === null ? null : { ...result.p, start: result.p.start + by, end: result.p.end + by },
    effects: result.effects.map((effect) => ({ ...effect, start: effect.start + by, end: effect.end + by })),
    ...(result.tableRow
      ? {
          tableRow: {
            ...result.tableRow,
            cells: cells(result.tableRow.cells),
            errorRow: result.tableRow.errorRow === null ? null : { ...result.tableRow.errorRow, cells: cells(result.tableRow.errorRow.cells) },
          },
        }
      : {}),
  };
}
