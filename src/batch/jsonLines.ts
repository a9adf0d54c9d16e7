import { closeSync, openSync, readFileSync, writeSync } from 'node:fs';
import type { DocumentOutput } from '../report/model.js';
import { entryJson, type AuditEntry } from './entry.js';

/**
 * Reads a JSON Lines audit file: one document per line. A last line cut off
 * by an interrupted run is ignored (it is audited again on --resume); any
 * other bad line is an error naming the file and line.
 */
export async function readJsonLines(path: string): Promise<DocumentOutput[]> {
  const text = readFileSync(path, 'utf8');
  // The record schema (zod) loads only when there is a file to check.
  const { documentSchema } = await import('../report/model.js');
  const lines = text.split('\n');
  const documents: DocumentOutput[] = [];
  lines.forEach((line, index) => {
    if (line.trim() === '') return;
    const isLast = index === lines.length - 1 || lines.slice(index + 1).every((l) => l.trim() === '');
    let parsed: unknown;
    try {
      parsed = JSON.parse(line);
    } catch {
      if (isLast && !text.endsWith('\n')) return; // interrupted while writing this line
      throw new Error(`${path}: line ${index + 1} is not valid JSON`);
    }
    const checked = documentSchema.safeParse(parsed);
    if (!checked.success) throw new Error(`${path}: line ${index + 1} is not a plumbline document record`);
    documents.push(checked.data);
  });
  return documents;
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
