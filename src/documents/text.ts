import { readFile } from 'node:fs/promises';
import type { ReadOutcome } from './types.js';

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
  return { ok: true, document: { path, format, text, pageOf: () => null, regions: [], tables: [] } };
}
