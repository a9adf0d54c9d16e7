import { closeSync, openSync, readFileSync, writeSync } from 'node:fs';
import type { DocumentOutput } from '../report/model.js';
import { entryJson, type AuditEntry } from './entry.js';

/** A JSON Lines file that cannot be used as it is: the message names the file and the line. */
export class JsonLinesError extends Error {}

export interface JsonLinesContent {
  documents: DocumentOutput[];
  /**
   * The file's last line when it has no newline: a write cut off by a crash
   * or a full disk (every record is written with its newline in one call,
   * JsonLinesWriter). Its line number, its length in bytes, and where the
   * complete lines end, in bytes. null when the file ends with a whole line.
   */
  cutOff: { line: number; bytes: number; completeBytes: number } | null;
}

const NEWLINE = 0x0a;

/**
 * Reads a JSON Lines audit file: one document per line. A last line cut off
 * mid-line is left out and described (`cutOff`): the caller decides what to
 * do with it (scan --resume drops it from the file and audits the document
 * again). Any other line that is not a document record is an error naming
 * the file and line (JsonLinesError), and the file is not changed.
 */
export async function readJsonLines(path: string): Promise<JsonLinesContent> {
  const bytes = readFileSync(path);
  const completeBytes = bytes.lastIndexOf(NEWLINE) + 1;
  const lines = bytes.subarray(0, completeBytes).toString('utf8').split('\n');
  lines.pop(); // the empty text after the last newline
  const cutOff = completeBytes < bytes.length ? { line: lines.length + 1, bytes: bytes.length - completeBytes, completeBytes } : null;
  // The record schema (zod) loads only when there is a file to check.
  const { documentSchema } = await import('../report/model.js');
  const documents: DocumentOutput[] = [];
  lines.forEach((line, index) => {
    if (line.trim() === '') return;
    let parsed: unknown;
    try {
      parsed = JSON.parse(line);
    } catch {
      throw new JsonLinesError(`${path}: line ${index + 1} is not valid JSON (the file was left as it is)`);
    }
    const checked = documentSchema.safeParse(parsed);
    if (!checked.success) throw new JsonLinesError(`${path}: line ${index + 1} is not a plumbline document record (the file was left as it is)`);
    documents.push(checked.data);
  });
  return { documents, cutOff };
}

/** Appends one line per document, synchronously, so an interrupted audit keeps every finished line. */
export class JsonLinesWriter {
  private readonly descriptor: number;

  constructor(path: string, append: boolean) {
    this.descriptor = openSync(path, append ? 'a' : 'w');
  }

  write(entry: AuditEntry): void {
    writeSync(this.descriptor, `${entryJson(entry)}\n`);
  }

  close(): void {
    closeSync(this.descriptor);
  }
}
