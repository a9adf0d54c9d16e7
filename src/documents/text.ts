import { readFile } from 'node:fs/promises';
import { findReferenceListRegions } from './plainRegions.js';
import type { DocumentText, ReadOutcome } from './types.js';

/**
 * Plain text and Markdown. Bytes are decoded as UTF-8 (a byte-order mark is
 * dropped); a file with NUL bytes is binary, not text, and is refused.
 */
export async function readTextDocument(path: string, format: 'text' | 'markdown'): Promise<ReadOutcome> {
  let bytes: Buffer;
  try {
    bytes = await readFile(path);
  } catch (error) {
    return { ok: false, path, format, error: `cannot read the file (${(error as NodeJS.ErrnoException).code ?? (error as Error).message})` };
  }
  if (bytes.includes(0)) return { ok: false, path, format, error: 'binary content (NUL bytes) in a text file; is the extension right?' };
  const text = new TextDecoder('utf-8', { ignoreBOM: false }).decode(bytes);
  return { ok: true, document: plainTextDocument(path, format, text) };
}

/** A document from text with no markup: the reference list is found from its heading; tables are found later, in the text. */
export function plainTextDocument(path: string, format: string, text: string): DocumentText {
  return { path, format, text, pageOf: () => null, regions: findReferenceListRegions(text), tables: [] };
}
