import { constants } from 'node:buffer';
import { closeSync, openSync, writeSync } from 'node:fs';
import { openRegularFile } from '../documents/regularFile.js';
import { timeBudgetReason } from '../limits.js';
import type { DocumentOutput } from '../report/model.js';
import { entryJson, type AuditEntry } from './entry.js';
import { runSyncWithinBudget } from './syncBudget.js';

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
 * The longest line read: the longest string V8 can make (about 512 MiB). A
 * record is written as one string, so no plumbline record is longer in
 * ASCII; a longer line (a file of zeros, a lost newline in a huge file) is
 * refused as soon as it passes this, before more of it is held.
 */
export const LONGEST_LINE_BYTES = constants.MAX_STRING_LENGTH;

/** Lines from this size on are parsed and checked under the time budget's watchdog; smaller ones take milliseconds at most. */
const WATCHED_FROM_BYTES = 1 << 20;

export interface JsonLinesReadOptions {
  /**
   * The time budget of one record, in seconds (the limit
   * maxSecondsPerDocument): counted from the moment its first byte is read.
   * Between reads a line still incomplete past it, and a line of a megabyte
   * or more still being parsed and checked past it, stop the read with a
   * JsonLinesError naming the line.
   */
  maxSecondsPerRecord?: number;
}

/** One document record of a JSON Lines file, with where its line is in the file (in bytes, without its newline). */
export interface JsonLinesRecord {
  document: DocumentOutput;
  line: number;
  offset: number;
  bytes: number;
}

/**
 * Reads a JSON Lines audit file: one document per line. A last line cut off
 * mid-line is left out and described (`cutOff`): the caller decides what to
 * do with it (scan --resume drops it from the file and audits the document
 * again). Any other line that is not a document record is an error naming
 * the file and line (JsonLinesError), and the file is not changed.
 */
export async function readJsonLines(path: string, options: JsonLinesReadOptions = {}): Promise<JsonLinesContent> {
  const documents: DocumentOutput[] = [];
  const { cutOff } = await forEachJsonLinesRecord(path, (record) => documents.push(record.document), options);
  return { documents, cutOff };
}

/**
 * readJsonLines one record at a time: `onRecord` gets each document as its
 * line is read and checked, so a caller that keeps only what it needs holds
 * one line and one document at a time. Only a regular file is read (a FIFO
 * would wait for ever, /dev/zero never end); missing or unreadable files
 * throw the file system's error for the caller's own words.
 */
export async function forEachJsonLinesRecord(
  path: string,
  onRecord: (record: JsonLinesRecord) => void,
  options: JsonLinesReadOptions = {},
): Promise<Pick<JsonLinesContent, 'cutOff'>> {
  // The record schemas (zod) load only when there is a file to check.
  const { documentFromJson } = await import('../report/jsonLayoutSchema.js');
  const budget = options.maxSecondsPerRecord ?? Infinity;
  const stopped = (number: number): JsonLinesError =>
    new JsonLinesError(`${path}: reading and checking line ${number} ${timeBudgetReason(budget)}; the file was left as it is`);
  const parseRecord = (line: string, number: number): DocumentOutput => {
    let parsed: unknown;
    try {
      parsed = JSON.parse(line);
    } catch {
      throw new JsonLinesError(`${path}: line ${number} is not valid JSON (the file was left as it is)`);
    }
    const read = documentFromJson(parsed);
    if (!read.ok) throw new JsonLinesError(`${path}: line ${number} is ${read.reason} (the file was left as it is)`);
    return read.document;
  };
  const readLine = (line: Buffer, number: number, offset: number, startedAt: number): void => {
    const left = budget - (performance.now() - startedAt) / 1000;
    if (left <= 0) throw stopped(number);
    const text = line.toString('utf8');
    if (text.trim() === '') return;
    let document: DocumentOutput;
    if (line.length < WATCHED_FROM_BYTES || budget === Infinity) document = parseRecord(text, number);
    else {
      const outcome = runSyncWithinBudget(() => parseRecord(text, number), left);
      if (!outcome.done) throw stopped(number);
      document = outcome.value;
    }
    onRecord({ document, line: number, offset, bytes: line.length });
  };

  const opened = await openRegularFile(path);
  if (!opened.ok) throw new JsonLinesError(`${path}: ${opened.error}`);
  // Read in chunks and cut at newlines, a line at a time: a file of hundreds of megabytes is more than one
  // string may hold, and only one line needs to be text at once.
  let partial: Buffer[] = [];
  let partialBytes = 0;
  let partialSince = 0;
  let lineNumber = 0;
  let bytesRead = 0;
  for await (const chunk of opened.handle.createReadStream({ highWaterMark: 1 << 20 }) as AsyncIterable<Buffer>) {
    const arrived = performance.now();
    if (partialBytes > 0 && (arrived - partialSince) / 1000 > budget) throw stopped(lineNumber + 1);
    let from = 0;
    for (let at = chunk.indexOf(NEWLINE, from); at !== -1; at = chunk.indexOf(NEWLINE, from)) {
      const piece = chunk.subarray(from, at);
      // A line's clock starts when its first bytes are there and the lines before it are done with.
      const startedAt = partialBytes === 0 ? performance.now() : partialSince;
      const offset = bytesRead + from - partialBytes;
      if (partialBytes + piece.length > LONGEST_LINE_BYTES) throw tooLong(path, lineNumber + 1);
      const line = partialBytes === 0 ? piece : Buffer.concat([...partial, piece], partialBytes + piece.length);
      partial = [];
      partialBytes = 0;
      readLine(line, ++lineNumber, offset, startedAt);
      from = at + 1;
    }
    if (from < chunk.length) {
      if (partialBytes === 0) partialSince = performance.now();
      partial.push(chunk.subarray(from));
      partialBytes += chunk.length - from;
      if (partialBytes > LONGEST_LINE_BYTES) throw tooLong(path, lineNumber + 1);
    }
    bytesRead += chunk.length;
  }
  const cutOff = partialBytes > 0 ? { line: lineNumber + 1, bytes: partialBytes, completeBytes: bytesRead - partialBytes } : null;
  return { cutOff };
}

function tooLong(path: string, line: number): JsonLinesError {
  return new JsonLinesError(
    `${path}: line ${line} is longer than ${LONGEST_LINE_BYTES.toLocaleString('en-US')} bytes, the longest text a line can be read as, so it is no plumbline record (the file was left as it is)`,
  );
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
