import { isUtf8 } from 'node:buffer';
import { findReferenceListRegions } from './plainRegions.js';
import { openRegularFile } from './regularFile.js';
import type { DocumentText, ReadOutcome } from './types.js';
import { defaultLimits, formatMb, limitHint, MB, type Limits } from '../limits.js';

/**
 * Plain text and Markdown.
 *
 * Encodings: UTF-8, with or without a byte-order mark; UTF-16 (little or big
 * endian) when the file starts with its byte-order mark. The mark is dropped.
 * A file that is not valid UTF-8 (and has no UTF-16 mark) is refused, with
 * the position of the first bad byte: such a file is in some other encoding
 * (usually Latin-1 or Windows-1252), and reading it with replacement
 * characters could silently turn a minus sign or a "≤" into garbage; the
 * user is asked to save it as UTF-8. A file with NUL bytes (and no UTF-16
 * mark) is binary, not text, and is refused too. Only a regular file is
 * read: a FIFO or a device named like a text file is refused (regularFile.ts).
 *
 * Files larger than `maxDocumentMb` are refused here; `plumbline scan`
 * streams text files above `streamTextAboveMb` instead (src/scan/stream.ts),
 * so they never reach this reader whole.
 */
export async function readTextDocument(path: string, format: 'text' | 'markdown', limits: Limits = defaultLimits): Promise<ReadOutcome> {
  let bytes: Buffer;
  try {
    // A FIFO or a device under a text file's name is refused before it is opened (regularFile.ts).
    const opened = await openRegularFile(path);
    if (!opened.ok) return { ok: false, path, format, error: opened.error };
    const { handle, size } = opened;
    try {
      if (size > limits.maxDocumentMb * MB) {
        return {
          ok: false,
          path,
          format,
          error: `text file too large to read whole: ${formatMb(size)} ${limitHint('maxDocumentMb', limits.maxDocumentMb)}; plumbline scan streams text files larger than streamTextAboveMb (${limits.streamTextAboveMb} MB) instead`,
        };
      }
      bytes = await handle.readFile();
    } finally {
      await handle.close();
    }
  } catch (error) {
    return { ok: false, path, format, error: `cannot read the file (${(error as NodeJS.ErrnoException).code ?? (error as Error).message})` };
  }
  const decoded = decodeTextBytes(bytes);
  if (!decoded.ok) return { ok: false, path, format, error: decoded.error };
  return { ok: true, document: plainTextDocument(path, format, decoded.text) };
}

export type TextEncoding = 'utf-8' | 'utf-16le' | 'utf-16be';

/** The encoding a text file's first bytes announce, and how many bytes its byte-order mark takes; or why it is not text. */
export function detectTextEncoding(head: Uint8Array): { ok: true; encoding: TextEncoding; bomLength: number } | { ok: false; error: string } {
  if (head[0] === 0xff && head[1] === 0xfe && head[2] === 0 && head[3] === 0) return { ok: false, error: UTF32 };
  if (head[0] === 0 && head[1] === 0 && head[2] === 0xfe && head[3] === 0xff) return { ok: false, error: UTF32 };
  if (head[0] === 0xff && head[1] === 0xfe) return { ok: true, encoding: 'utf-16le', bomLength: 2 };
  if (head[0] === 0xfe && head[1] === 0xff) return { ok: true, encoding: 'utf-16be', bomLength: 2 };
  if (head[0] === 0xef && head[1] === 0xbb && head[2] === 0xbf) return { ok: true, encoding: 'utf-8', bomLength: 3 };
  return { ok: true, encoding: 'utf-8', bomLength: 0 };
}

const UTF32 = 'UTF-32 text is not supported: save the file as UTF-8';

/** The message for bytes with a NUL: UTF-16 without its byte-order mark, or binary data. */
export function nulBytesMessage(sample: Uint8Array): string {
  let evenNul = 0;
  let oddNul = 0;
  const length = Math.min(sample.length, 4096);
  for (let at = 0; at < length; at++) if (sample[at] === 0) at % 2 === 0 ? evenNul++ : oddNul++;
  const half = length / 2;
  if (length >= 8 && (oddNul > 0.4 * half || evenNul > 0.4 * half)) {
    return 'the file looks like UTF-16 text without a byte-order mark; save it as UTF-8 (or as UTF-16 with a byte-order mark)';
  }
  return 'binary content (NUL bytes) in a text file; is the extension right?';
}

/** Why bytes are not valid UTF-8: the first bad byte, its offset and its line. `base` and `baseLine` place a chunk in its file. */
export function invalidUtf8Message(bytes: Uint8Array, base = 0, baseLine = 1): string {
  const at = firstInvalidUtf8(bytes);
  let line = baseLine;
  for (let index = 0; index < at; index++) if (bytes[index] === 0x0a) line++;
  const byte = bytes[at] ?? 0;
  return (
    `not valid UTF-8 (first invalid byte 0x${byte.toString(16).toUpperCase().padStart(2, '0')} at byte ${base + at}, line ${line}): ` +
    'plumbline reads text files as UTF-8, or as UTF-16 when they start with a byte-order mark; ' +
    'save the file as UTF-8 (it is probably Latin-1 or Windows-1252)'
  );
}

/** Offset of the first byte that breaks UTF-8 (a truncated sequence at the end counts); bytes.length when valid. */
export function firstInvalidUtf8(bytes: Uint8Array): number {
  let at = 0;
  while (at < bytes.length) {
    const lead = bytes[at]!;
    if (lead < 0x80) {
      at++;
      continue;
    }
    let need: number;
    let low = 0x80;
    let high = 0xbf;
    if (lead >= 0xc2 && lead <= 0xdf) need = 1;
    else if (lead >= 0xe0 && lead <= 0xef) {
      need = 2;
      if (lead === 0xe0) low = 0xa0;
      if (lead === 0xed) high = 0x9f;
    } else if (lead >= 0xf0 && lead <= 0xf4) {
      need = 3;
      if (lead === 0xf0) low = 0x90;
      if (lead === 0xf4) high = 0x8f;
    } else return at;
    for (let k = 1; k <= need; k++) {
      const next = bytes[at + k];
      if (next === undefined) return at;
      if (k === 1 ? next < low || next > high : next < 0x80 || next > 0xbf) return at;
    }
    at += need + 1;
  }
  return bytes.length;
}

/** Decodes a whole text file by the rules above. */
export function decodeTextBytes(bytes: Buffer): { ok: true; text: string } | { ok: false; error: string } {
  const detected = detectTextEncoding(bytes);
  if (!detected.ok) return detected;
  const body = bytes.subarray(detected.bomLength);
  if (detected.encoding === 'utf-8') {
    if (body.includes(0)) return { ok: false, error: nulBytesMessage(body) };
    if (!isUtf8(body)) return { ok: false, error: invalidUtf8Message(body, detected.bomLength) };
    return { ok: true, text: body.toString('utf8') };
  }
  if (body.length % 2 !== 0) return { ok: false, error: `truncated ${detected.encoding.toUpperCase()} text: an odd number of bytes` };
  const text = new TextDecoder(detected.encoding, { ignoreBOM: true }).decode(body);
  if (text.includes('\u0000')) return { ok: false, error: 'binary content (NUL characters) in a UTF-16 text file; is the extension right?' };
  return { ok: true, text };
}

/** A document from text with no markup: the reference list is found from its heading; tables are found later, in the text. */
export function plainTextDocument(path: string, format: string, text: string): DocumentText {
  return { path, format, text, pageOf: () => null, regions: findReferenceListRegions(text), tables: [] };
}
