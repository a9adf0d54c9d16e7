import { closeSync, createReadStream, openSync, writeSync } from 'node:fs';
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
  // The record schema (zod) loads only when there is a file to check.
  const { documentSchema } = await import('../report/model.js');
  const documents: DocumentOutput[] = [];
  const readLine = (line: string, number: number): void => {
    if (line.trim() === '') return;
    let parsed: unknown;
    try {
      parsed = JSON.parse(line);
    } catch {
      throw new JsonLinesError(`${path}: line ${number} is not valid JSON (the file was left as it is)`);
    }
    const checked = documentSchema.safeParse(parsed);
    if (!checked.success) throw new JsonLinesError(`${path}: line ${number} is not a plumbline document record (the file was left as it is)`);
    documents.push(checked.data);
  };
  // Read in chunks and cut at newlines, a line at a time: a file of hundreds of megabytes is more than one
  // string may hold, and only one line needs to be text at once.
  let partial: Buffer[] = [];
  let partialBytes = 0;
  let lineNumber = 0;
  let bytesRead = 0;
  for await (const chunk of createReadStream(path, { highWaterMark: 1 << 20 }) as AsyncIterable<Buffer>) {
    bytesRead += chunk.length;
    let from = 0;
    for (let at = chunk.indexOf(NEWLINE, from); at !== -1; at = chunk.indexOf(NEWLINE, from)) {
      const piece = chunk.subarray(from, at);
      const line = partialBytes === 0 ? piece : Buffer.concat([...partial, piece], partialBytes + piece.length);
      partial = [];
      partialBytes = 0;
      readLine(line.toString('utf8'), ++lineNumber);
      from = at + 1;
    }
    if (from < chunk.length) {
      partial.push(chunk.subarray(from));
      partialBytes += chunk.length - from;
    }
  }
  const cutOff = partialBytes > 0 ? { line: lineNumber + 1, bytes: partialBytes, completeBytes: bytesRead - partialBytes } : null;
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
