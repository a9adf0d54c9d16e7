import { tallyOf, type DocumentTally } from '../report/build.js';
import { documentBodyJson, documentJsonFromBody } from '../report/json.js';
import { documentFromRecord } from '../report/jsonLayout.js';
import type { DocumentRecord } from '../report/jsonLayoutSchema.js';
import type { DocumentOutput } from '../report/model.js';

/**
 * A document's audit as it travels through a batch: its JSON and the counts
 * the summary needs. The JSON is made once, in the worker that audited the
 * document, and is what the cache stores, the JSON Lines file gets and the
 * JSON report holds; a cached audit is parsed only when a report format
 * needs its fields (text, HTML, CSV, Markdown). On a re-audit of unchanged
 * files, parsing and re-serialising every audit was most of the time left.
 */
export interface AuditEntry {
  path: string;
  /** The document's compact JSON without its path (json.ts, documentBodyJson). */
  body: string;
  tally: DocumentTally;
  /** The audit already parsed (and checked against the schema), when a cached audit was checked before use. */
  document?: DocumentOutput;
}

export function entryOf(document: DocumentOutput): AuditEntry {
  return { path: document.path, body: documentBodyJson(document), tally: tallyOf(document) };
}

/**
 * The reason listed for a document whose audit failed in a way plumbline did
 * not foresee (a fault in plumbline, not in the document): the error, and a
 * request to report it. The rest of the audit goes on.
 */
export function internalErrorReason(error: unknown): string {
  const described = error instanceof Error ? `${error.name}: ${error.message}` : String(error);
  return `internal error in plumbline while auditing this document (${described}); please report it, with the document if you can share it`;
}

/** The entry as one line of compact JSON, path first. */
export function entryJson(entry: Pick<AuditEntry, 'path' | 'body'>): string {
  return documentJsonFromBody(entry.path, entry.body);
}

/** The entry's audit in the model: the body is a record this build wrote (or one checked when it came from the cache). */
export function documentOf(entry: AuditEntry): DocumentOutput {
  if (entry.document) return entry.document;
  const document = documentFromRecord(JSON.parse(entryJson(entry)) as DocumentRecord);
  if (document === null) throw new Error(`${entry.path}: the audit's record does not give back its results' context`);
  return document;
}

/** Keeps the last record per path and sorts by path, so shards merged equal the unsharded run. */
export function mergeByPath<T extends { path: string }>(records: readonly T[]): T[] {
  const byPath = new Map<string, T>();
  for (const record of records) byPath.set(record.path, record);
  return [...byPath.values()].sort((a, b) => (a.path < b.path ? -1 : a.path > b.path ? 1 : 0));
}
