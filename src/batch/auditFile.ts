import { auditDocument, unreadableDocument } from '../audit.js';
import type { ResolvedConfig } from '../checks/config.js';
import { readDocument, type ReadOptions } from '../documents/read.js';
import type { DocumentOutput } from '../report/model.js';

/** Reads and audits one file; an unreadable file becomes a row with its reason, never an exception. */
export async function auditFile(path: string, config: ResolvedConfig, readOptions: ReadOptions): Promise<DocumentOutput> {
  try {
    const outcome = await readDocument(path, readOptions);
    if (!outcome.ok) return unreadableDocument(path, outcome.error, outcome.format);
    return { ...auditDocument(outcome.document, config, path), format: outcome.document.format };
  } catch (error) {
    // A reader bug must not stop an audit of thousands of files: record it against this file.
    return unreadableDocument(path, `internal error while reading: ${(error as Error).message}`);
  }
}
