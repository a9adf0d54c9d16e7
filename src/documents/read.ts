import { extname } from 'node:path';
import { readTextDocument } from './text.js';
import type { ReadOutcome } from './types.js';

const formatByExtension: Record<string, 'text' | 'markdown'> = {
  '.txt': 'text',
  '.text': 'text',
  '.md': 'markdown',
  '.markdown': 'markdown',
};

export const supportedExtensions = Object.keys(formatByExtension);

export function isSupported(path: string): boolean {
  return extname(path).toLowerCase() in formatByExtension;
}

/** Reads any supported document; never throws for a bad file, returns its reason instead. */
export async function readDocument(path: string): Promise<ReadOutcome> {
  const format = formatByExtension[extname(path).toLowerCase()];
  if (!format) return { ok: false, path, format: 'unknown', error: `unsupported file type "${extname(path) || '(none)'}"; supported: ${supportedExtensions.join(', ')}` };
  return readTextDocument(path, format);
}
