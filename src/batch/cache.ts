import { createHash, randomBytes } from 'node:crypto';
import { existsSync, readFileSync } from 'node:fs';
import { mkdir, readFile, rename, rm, writeFile } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import type { DocumentTally } from '../report/build.js';
import type { AuditEntry } from './entry.js';

/**
 * A content-addressed cache of document audits. The key covers everything
 * the audit depends on: the file's bytes, the format its extension gives,
 * the settings (rules, severities, options, alpha), the reading options (PDF
 * engine) and plumbline's version. A cached audit is reused whatever the
 * file is called now, as long as its extension gives the same format.
 *
 * The cache only ever saves work: an entry that is damaged is a miss (the
 * document is audited again and the entry rewritten), and a folder that
 * cannot be written is used for nothing more after one warning, while the
 * audit goes on. Any number of writers, in one run or in several sharing
 * the folder, may write the same entry at once (see writeAtomically).
 */
export class AuditCache {
  private writeFailed = false;

  /** `warn` gets one message, the first time the folder cannot be written. */
  constructor(
    readonly directory: string,
    private readonly warn: (message: string) => void = () => {},
  ) {}

  static key(content: Buffer, settingsFingerprint: string): string {
    return createHash('sha256').update(settingsFingerprint).update('\0').update(content).digest('hex');
  }

  private pathOf(key: string): string {
    return join(this.directory, key.slice(0, 2), `${key}.json`);
  }

  /**
   * The cached audit under this key, named by the file's current path, or
   * null when there is none or it does not pass parseStored's checks. A
   * synchronous read: cache entries are small, and on a re-audit of
   * hundreds of files the thread-pool round trips of asynchronous reads
   * cost three times the reads themselves (bench/corpus.ts). The audit's
   * JSON is not parsed here (see AuditEntry).
   */
  get(key: string, path: string): AuditEntry | null {
    if (!isContentKey(key)) return null;
    let stored: Buffer;
    try {
      stored = readFileSync(this.pathOf(key));
    } catch {
      return null; // absent, or the folder is not a folder: audit again
    }
    return parseStored(stored, path);
  }

  /** Stores an audit; never throws (see write). */
  async set(key: string, entry: AuditEntry): Promise<void> {
    if (!isContentKey(key)) return;
    await this.write(this.pathOf(key), formatStored(entry));
  }

  /**
   * Writes one file of the cache. A failure (the folder is a file, is not
   * writable, the disk is full) is reported once through `warn`, and the
   * cache is written no more in this run: the audit itself goes on.
   */
  async write(target: string, text: string): Promise<void> {
    if (this.writeFailed) return;
    try {
      await mkdir(dirname(target), { recursive: true });
      await writeAtomically(target, text);
    } catch (error) {
      if (this.writeFailed) return; // several writes in flight failed together: one warning
      this.writeFailed = true;
      const reason = (error as NodeJS.ErrnoException).code ?? (error as Error).message;
      this.warn(`plumbline: cannot write to the cache folder ${this.directory} (${reason}); the audit goes on without storing audits there\n`);
    }
  }
}

/** A cache key as AuditCache.key makes it: 64 hexadecimal digits (never a path that could leave the folder). */
function isContentKey(key: unknown): key is string {
  return typeof key === 'string' && /^[0-9a-f]{64}$/.test(key);
}

/**
 * Writes a file so that a reader sees the old content or the new, never part
 * of either: the text goes to a temporary file that is this writer's alone
 * (process id and a random suffix: two workers of one run writing the audits
 * of two identical files, or two runs on two machines sharing the folder,
 * never write the same temporary file), then is renamed over the target.
 * On POSIX the rename replaces the target atomically. Where it fails because
 * another writer's file is in place (Windows refuses to replace a file that
 * is open), the other writer finished first; entries are named by the
 * content they hold, so its file is as good as ours.
 */
async function writeAtomically(target: string, text: string): Promise<void> {
  const temporary = `${target}.${process.pid}.${randomBytes(6).toString('hex')}.tmp`;
  try {
    await writeFile(temporary, text);
  } catch (error) {
    await rm(temporary, { force: true }).catch(() => {});
    throw error;
  }
  try {
    await rename(temporary, target);
  } catch (error) {
    await rm(temporary, { force: true }).catch(() => {});
    if (!existsSync(target)) throw error;
  }
}

/**
 * A cache file: one line of header (the summary counts, and the body's
 * length in bytes and SHA-256), then the document's JSON without its path.
 * The body goes into JSON reports unparsed, so it is used only when its
 * hash matches: a file cut short, with bytes appended, or changed in place
 * (same length, other bytes) is a miss. A forged entry with a matching hash
 * is stopped where the audits are parsed (runBatch's `validate`).
 */
interface StoredHeader {
  tally: DocumentTally;
  bodyBytes: number;
  bodySha256: string;
}

function sha256(bytes: Uint8Array): string {
  return createHash('sha256').update(bytes).digest('hex');
}

function formatStored(entry: AuditEntry): string {
  const body = Buffer.from(entry.body, 'utf8');
  const header: StoredHeader = { tally: entry.tally, bodyBytes: body.length, bodySha256: sha256(body) };
  return `${JSON.stringify(header)}\n${entry.body}`;
}

const NEWLINE = 0x0a;

function parseStored(stored: Buffer, path: string): AuditEntry | null {
  const newline = stored.indexOf(NEWLINE);
  if (newline === -1) return null;
  let header: unknown;
  try {
    header = JSON.parse(stored.subarray(0, newline).toString('utf8'));
  } catch {
    return null;
  }
  if (!isStoredHeader(header)) return null;
  const body = stored.subarray(newline + 1);
  if (body.length !== header.bodyBytes || sha256(body) !== header.bodySha256) return null; // damaged: audit again
  const text = body.toString('utf8');
  return text.startsWith('{') && text.endsWith('}') ? { path, body: text, tally: header.tally } : null;
}

const isCount = (value: unknown): boolean => Number.isSafeInteger(value) && (value as number) >= 0;

/** The header's shape, checked by hand: the fast path of a cached re-audit does not load the schema library (zod). */
function isStoredHeader(value: unknown): value is StoredHeader {
  if (typeof value !== 'object' || value === null) return false;
  const { tally, bodyBytes, bodySha256 } = value as Partial<StoredHeader>;
  return isCount(bodyBytes) && typeof bodySha256 === 'string' && /^[0-9a-f]{64}$/.test(bodySha256) && isTally(tally);
}

function isTally(value: unknown): value is DocumentTally {
  if (typeof value !== 'object' || value === null) return false;
  const tally = value as Partial<DocumentTally>;
  const findings = tally.findings as Partial<DocumentTally['findings']> | undefined;
  return (
    typeof tally.unreadable === 'boolean' &&
    [tally.statistics, tally.resultsInTables, tally.tablesNotRead, tally.flaggedStatistics, tally.crossesAlpha].every(isCount) &&
    typeof findings === 'object' &&
    findings !== null &&
    [findings.fail, findings.warn, findings.note].every(isCount)
  );
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

/** The index file's entries that have the right shape; anything else in it is dropped (the file is then hashed). */
function indexEntriesOf(raw: unknown): Map<string, IndexEntry> {
  const entries = new Map<string, IndexEntry>();
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) return entries;
  for (const [path, value] of Object.entries(raw as Record<string, unknown>)) {
    const entry = value as Partial<IndexEntry> | null;
    if (entry && typeof entry.size === 'number' && typeof entry.mtimeMs === 'number' && isContentKey(entry.key)) {
      entries.set(path, { size: entry.size, mtimeMs: entry.mtimeMs, key: entry.key });
    }
  }
  return entries;
}

/**
 * Remembers the content key of each file by its size and modification time,
 * so a re-audit of unchanged files does not read and hash every byte again
 * (the way build tools decide a file is unchanged). A file whose size or
 * time differs is hashed again; the audit itself is always found by the
 * content key. One index per settings fingerprint, since the key includes
 * it. Files are known by their absolute path: the same relative name from
 * another folder is another file.
 */
export class ContentKeyIndex {
  private entries = new Map<string, IndexEntry>();
  private changed = false;
  private readonly file: string;

  constructor(
    private readonly store: AuditCache,
    settingsFingerprint: string,
  ) {
    const id = createHash('sha256').update(settingsFingerprint).digest('hex').slice(0, 16);
    this.file = join(store.directory, `index-${id}.json`);
  }

  async load(): Promise<void> {
    try {
      this.entries = indexEntriesOf(JSON.parse(await readFile(this.file, 'utf8')));
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

  /** Saves the index through the cache (AuditCache.write): never throws. */
  async save(): Promise<void> {
    if (!this.changed) return;
    await this.store.write(this.file, JSON.stringify(Object.fromEntries(this.entries)));
    this.changed = false;
  }
}
