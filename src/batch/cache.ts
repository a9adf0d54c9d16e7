import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { mkdir, readFile, rename, writeFile } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import type { DocumentTally } from '../report/build.js';
import type { AuditEntry } from './entry.js';

/**
 * A content-addressed cache of document audits. The key covers everything
 * the audit depends on: the file's bytes, the settings (rules, severities,
 * options, alpha), the reading options (PDF engine) and plumbline's version.
 * A cached audit is reused whatever the file is called now.
 */
export class AuditCache {
  constructor(readonly directory: string) {}

  static key(content: Buffer, settingsFingerprint: string): string {
    return createHash('sha256').update(settingsFingerprint).update('\0').update(content).digest('hex');
  }

  private pathOf(key: string): string {
    return join(this.directory, key.slice(0, 2), `${key}.json`);
  }

  /**
   * The cached audit under this key, named by the file's current path. A
   * synchronous read: cache entries are small, and on a re-audit of
   * hundreds of files the thread-pool round trips of asynchronous reads
   * cost three times the reads themselves (bench/corpus.ts). The audit's
   * JSON is not parsed here (see AuditEntry).
   */
  get(key: string, path: string): AuditEntry | null {
    let stored: string;
    try {
      stored = readFileSync(this.pathOf(key), 'utf8');
    } catch {
      return null; // absent: audit again
    }
    return parseStored(stored, path);
  }

  async set(key: string, entry: AuditEntry): Promise<void> {
    const target = this.pathOf(key);
    await mkdir(join(this.directory, key.slice(0, 2)), { recursive: true });
    // Write then rename, so a concurrent reader never sees half a file.
    const temporary = `${target}.${process.pid}.tmp`;
    await writeFile(temporary, formatStored(entry));
    await rename(temporary, target);
  }
}

/**
 * A cache file: one line of header (the summary counts and the body's
 * length), then the document's JSON without its path. The length guards
 * against a file cut short or altered outside plumbline, since the body
 * goes into reports unparsed.
 */
interface StoredHeader {
  tally: DocumentTally;
  bodyLength: number;
}

function formatStored(entry: AuditEntry): string {
  const header: StoredHeader = { tally: entry.tally, bodyLength: entry.body.length };
  return `${JSON.stringify(header)}\n${entry.body}`;
}

function parseStored(stored: string, path: string): AuditEntry | null {
  const newline = stored.indexOf('\n');
  if (newline === -1) return null;
  try {
    const header = JSON.parse(stored.slice(0, newline)) as StoredHeader;
    const body = stored.slice(newline + 1);
    const wellFormed = body.length === header.bodyLength && body.startsWith('{') && body.endsWith('}') && typeof header.tally?.statistics === 'number';
    return wellFormed ? { path, body, tally: header.tally } : null; // damaged: audit again
  } catch {
    return null;
  }
}

/** JSON with object keys sorted at every level, so equal settings always give equal text. */
function stableJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(stableJson).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${stableJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value);
}

/** A stable text of everything besides the file content that changes an audit. */
export function settingsFingerprint(parts: Record<string, unknown>): string {
  return stableJson(parts);
}

interface IndexEntry {
  size: number;
  mtimeMs: number;
  key: string;
}

/**
 * Remembers the content key of each file by its size and modification time,
 * so a re-audit of unchanged files does not read and hash every byte again
 * (the way build tools decide a file is unchanged). A file whose size or
 * time differs is hashed again; the audit itself is always found by the
 * content key. One index per settings fingerprint, since the key includes it.
 */
export class ContentKeyIndex {
  private entries = new Map<string, IndexEntry>();
  private changed = false;
  private readonly file: string;

  constructor(directory: string, settingsFingerprint: string) {
    const id = createHash('sha256').update(settingsFingerprint).digest('hex').slice(0, 16);
    this.file = join(directory, `index-${id}.json`);
  }

  async load(): Promise<void> {
    try {
      const raw = JSON.parse(await readFile(this.file, 'utf8')) as Record<string, IndexEntry>;
      this.entries = new Map(Object.entries(raw));
    } catch {
      this.entries = new Map(); // absent or damaged: every file is hashed
    }
  }

  lookup(path: string, size: number, mtimeMs: number): string | null {
    const entry = this.entries.get(path);
    return entry && entry.size === size && entry.mtimeMs === mtimeMs ? entry.key : null;
  }

  record(path: string, size: number, mtimeMs: number, key: string): void {
    const entry = this.entries.get(path);
    if (entry && entry.size === size && entry.mtimeMs === mtimeMs && entry.key === key) return;
    this.entries.set(path, { size, mtimeMs, key });
    this.changed = true;
  }

  async save(): Promise<void> {
    if (!this.changed) return;
    await mkdir(dirname(this.file), { recursive: true });
    const temporary = `${this.file}.${process.pid}.tmp`;
    await writeFile(temporary, JSON.stringify(Object.fromEntries(this.entries)));
    await rename(temporary, this.file);
    this.changed = false;
  }
}
