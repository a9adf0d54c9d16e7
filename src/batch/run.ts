import { createHash } from 'node:crypto';
import { statSync } from 'node:fs';
import { stat } from 'node:fs/promises';
import { extname, resolve } from 'node:path';
import type { ResolvedConfig } from '../checks/config.js';
import { formatByExtension } from '../documents/formats.js';
import { openRegularFile } from '../documents/regularFile.js';
import { resolveLimits, timeBudgetReason } from '../limits.js';
import { tallyOf, unreadableDocument } from '../report/build.js';
import { AuditCache, ContentKeyIndex } from './cache.js';
import { entryJson, entryOf, internalErrorReason, type AuditEntry } from './entry.js';
import type { PdfEngine } from '../documents/pdf.js';
import type { WorkerTask } from './worker.js';
import { mapConcurrently } from './concurrently.js';
import { appendAll } from '../arrays.js';
import { compiledModule, runWithinBudget } from './withinBudget.js';

export interface BatchOptions {
  files: readonly string[];
  task: Omit<WorkerTask, 'path' | 'started'>;
  /** Worker threads; 1 audits in this thread. */
  jobs: number;
  cache: {
    store: AuditCache;
    fingerprint: string;
    /**
     * Parse every cached audit and check it against the report schema
     * before use; one that fails is a miss. Set when the report parses the
     * audits anyway (text, HTML, CSV, Markdown), so the check costs little
     * there, and a forged entry never reaches a formatter. The JSON formats
     * copy cached audits unparsed, guarded by their hash (AuditCache).
     */
    validate?: boolean;
  } | null;
  /** Called once per document, in completion order, as soon as it is done. */
  onDocument: (entry: AuditEntry, fromCache: boolean) => void;
}

const CACHE_LOOKUPS_AT_ONCE = 32;
/** Documents handed to the pool per thread at a time: enough that no thread waits for the next. */
const TASKS_QUEUED_PER_THREAD = 4;


/**
 * Whether a file is read by a third-party parser that runs as JavaScript in
 * the auditing thread (pdf-parse's pdf.js, mammoth for DOCX): the time
 * budget can stop such a read only by ending its thread, so these documents
 * go to a worker thread even with --jobs 1. pdftotext is a child process,
 * killed on time wherever it runs; the other readers are plumbline's own and
 * bounded by the limits.
 */
function needsStoppableThread(path: string, pdfEngine: PdfEngine): boolean {
  const extension = extname(path).toLowerCase();
  return extension === '.docx' || (extension === '.pdf' && pdfEngine === 'pdf-parse');
}

/**
 * Files larger than this are audited on a worker thread even with --jobs 1, whatever their format: a document
 * this large may hold tens of thousands of results, and its reading (not only its scan and check, which the
 * main thread interrupts too: auditFile) is stopped only by ending a thread. Papers are far smaller (a long
 * thesis as text is well under 1 MB), so they keep the quicker path on the main thread.
 */
const STOPPABLE_ABOVE_BYTES = 2 * 1024 * 1024;

/** Whether some file is larger than STOPPABLE_ABOVE_BYTES (a file that cannot be looked at counts as small: the reader says why). */
async function anyLarge(paths: readonly string[]): Promise<boolean> {
  const sizes = await mapConcurrently(paths, CACHE_LOOKUPS_AT_ONCE, async (path) => {
    try {
      return (await stat(path)).size;
    } catch {
      return 0;
    }
  });
  return sizes.some((size) => size > STOPPABLE_ABOVE_BYTES);
}


type SchemaCheck = (entry: AuditEntry) => AuditEntry | null;

/**
 * The check of runBatch's `validate`: the cached audit parsed and checked
 * against the report schema (zod, loaded only here), its counts taken from
 * the audit itself rather than the entry's header; null when it fails.
 */
async function schemaCheck(): Promise<SchemaCheck> {
  const { documentRecordSchema } = await import('../report/jsonLayoutSchema.js');
  const { documentFromRecord } = await import('../report/jsonLayout.js');
  return (entry) => {
    try {
      // Only the layout this build writes: an entry of another layout is a miss, audited again.
      const checked = documentRecordSchema.safeParse(JSON.parse(entryJson(entry)));
      const document = checked.success ? documentFromRecord(checked.data) : null;
      return document === null ? null : { ...entry, document, tally: tallyOf(document) };
    } catch {
      return null;
    }
  };
}

/**
 * What besides its bytes decides a file's audit: the settings (the batch's
 * fingerprint) and the format its name gives. The same bytes are read one
 * way as .html and another as .txt, and even a .md and a .txt of the same
 * text differ in their reported format, so a copy under another extension
 * never takes the other's audit.
 */
function fileFingerprint(path: string, fingerprint: string): string {
  const extension = extname(path).toLowerCase();
  return `${fingerprint}\0${formatByExtension[extension] ?? extension}`;
}

/**
 * The cached audit of a file, when there is a good one, and the file's
 * content key. Never throws: whatever goes wrong makes a miss (the document
 * is audited, and the reader says why it cannot be read, if it cannot).
 */
async function cachedOrKey(
  path: string,
  cache: NonNullable<BatchOptions['cache']>,
  index: ContentKeyIndex,
  check: SchemaCheck | null,
): Promise<{ entry: AuditEntry | null; key: string | null }> {
  try {
    // Synchronous stat: for an unchanged file this and the cache read below are all the work (see AuditCache.get).
    const info = statSync(path);
    // Not a regular file (a FIFO, a device, a link to one): hashing it would block or never end; the reader refuses it by name.
    if (!info.isFile()) return { entry: null, key: null };
    const absolute = resolve(path);
    const key = index.lookup(absolute, info.size, info.mtimeMs) ?? (await contentKey(path, info.size, fileFingerprint(path, cache.fingerprint)));
    index.record(absolute, info.size, info.mtimeMs, key);
    const stored = cache.store.get(key, path);
    return { entry: stored && check ? check(stored) : stored, key };
  } catch {
    return { entry: null, key: null };
  }
}

/** Files up to this size are hashed from one read; larger ones as a stream. */
const READ_WHOLE_BELOW = 16 << 20;

/**
 * AuditCache.key of a file's content. Small files are read at once; large
 * ones are hashed as they are read, so a 1 GB text file is never held in memory.
 */
async function contentKey(path: string, size: number, fingerprint: string): Promise<string> {
  // Opened only as a regular file, should the path have been replaced by a FIFO since it was looked at (regularFile.ts).
  const opened = await openRegularFile(path);
  if (!opened.ok) throw new Error(opened.error); // a miss: the reader refuses the file with this reason
  if (size < READ_WHOLE_BELOW) {
    try {
      return AuditCache.key(await opened.handle.readFile(), fingerprint);
    } finally {
      await opened.handle.close();
    }
  }
  const hash = createHash('sha256').update(fingerprint).update('\0');
  for await (const chunk of opened.handle.createReadStream({ highWaterMark: 1 << 20 })) hash.update(chunk as Buffer);
  return hash.digest('hex'); // the same as AuditCache.key(content, fingerprint)
}

/**
 * Audits many documents: cache hits first (in this thread, cheap), then the
 * rest on a worker pool. Every document, readable or not, reaches onDocument
 * exactly once; an error while auditing one document becomes that
 * document's row (internalErrorReason), never the end of the audit. Only an
 * error thrown by onDocument itself (writing the output) ends the batch.
 */
export async function runBatch(options: BatchOptions): Promise<void> {
  const pending: { path: string; key: string | null }[] = [];
  if (!options.cache) {
    appendAll(pending, options.files.map((path) => ({ path, key: null })));
  } else {
    // Look up many files at once: the lookups wait on the disk, not the processor.
    const cache = options.cache;
    const check = cache.validate ? await schemaCheck() : null;
    const index = new ContentKeyIndex(cache.store, cache.fingerprint);
    await index.load();
    const lookups = await mapConcurrently(options.files, CACHE_LOOKUPS_AT_ONCE, (path) => cachedOrKey(path, cache, index, check));
    await index.save();
    lookups.forEach(({ entry, key }, index) => {
      const path = options.files[index]!;
      if (entry) options.onDocument(entry, true);
      else pending.push({ path, key });
    });
  }
  if (pending.length === 0) return;

  const finish = async ({ key }: { key: string | null }, entry: AuditEntry): Promise<void> => {
    // Only audits are kept: a document that could not be read (or ran out of time, which may be the
    // machine's load) is tried again next time. The cache never throws (AuditCache.write).
    if (key && options.cache && !entry.tally.unreadable) await options.cache.store.set(key, entry);
    options.onDocument(entry, false);
  };

  // Everything that checks documents is loaded only now, when some document is not in the cache.
  const { resolveConfig } = await import('../checks/config.js');
  const config = resolveConfig(options.task.userConfig, options.task.configSource); // bad settings fail here, before any thread starts
  const module = workerModuleOf(import.meta.url);
  const pdfEngine = (await import('../documents/pdf.js')).resolvePdfEngine(options.task.readOptions.pdfEngine);
  const onThisThread =
    module === null ||
    ((options.jobs <= 1 || pending.length === 1) && !pending.some((item) => needsStoppableThread(item.path, pdfEngine)) && !(await anyLarge(pending.map((item) => item.path))));
  if (onThisThread) {
    const { auditFile } = await import('./auditFile.js');
    const { maxSecondsPerDocument } = resolveLimits(options.task.readOptions.limits);
    for (const item of pending) await finish(item, await auditHere(auditFile, item.path, config, options.task.readOptions, maxSecondsPerDocument));
    return;
  }

  const { Piscina } = await import('piscina');
  const threads = Math.min(options.jobs, pending.length);
  const pool = new Piscina<WorkerTask, AuditEntry>({ filename: module, minThreads: threads, maxThreads: threads, idleTimeout: 1000 });
  try {
    const { maxSecondsPerDocument } = resolveLimits(options.task.readOptions.limits);
    // A few tasks per thread in the pool's queue at a time, not thousands: each holds a message port until it starts.
    await mapConcurrently(pending, threads * TASKS_QUEUED_PER_THREAD, async (item) =>
      finish(item, await auditOnPool(pool, { ...options.task, path: item.path }, maxSecondsPerDocument)),
    );
  } finally {
    await pool.destroy();
  }
}

/**
 * The module the worker threads load: the bundled worker (dist/src/bundled/worker.js, written by
 * `npm run build`, bundleWorker.ts) when it is at least as new as the compiled worker.js, which
 * loads in a third of the time; otherwise worker.js itself (a bundle older than the compiled code
 * is stale: `tsc` was run alone since). Null when running from TypeScript sources.
 */
export function workerModuleOf(moduleUrl: string): string | null {
  const plain = compiledModule('./worker.js', moduleUrl);
  if (plain === null) return null;
  const bundled = new URL('../bundled/worker.js', moduleUrl);
  try {
    return bundleIsFresh(statSync(bundled).mtimeMs, statSync(new URL(plain)).mtimeMs) ? bundled.href : plain;
  } catch {
    return plain; // no bundle
  }
}

/** Whether a bundle written at `bundledMs` holds the code compiled at `compiledMs` (it was written after it). */
export function bundleIsFresh(bundledMs: number, compiledMs: number): boolean {
  return bundledMs >= compiledMs;
}

/** One document audited in this thread, within its time budget (auditFile); any error becomes its row. */
async function auditHere(
  auditFile: typeof import('./auditFile.js').auditFile,
  path: string,
  config: ResolvedConfig,
  readOptions: WorkerTask['readOptions'],
  timeBudgetSeconds: number,
): Promise<AuditEntry> {
  try {
    return entryOf(await auditFile(path, config, readOptions, { timeBudgetSeconds }));
  } catch (error) {
    return entryOf(unreadableDocument(path, internalErrorReason(error)));
  }
}

/**
 * One document audited on the pool, within its time budget. The budget is
 * the document's own work: its clock starts when a worker takes the task up
 * (the worker says so on a message port, worker.ts), not when it was queued,
 * so a long queue (thousands of documents, --jobs 1) never uses it up. Past
 * the budget, piscina ends the thread (and starts another) and the document
 * is listed with the reason.
 */
async function auditOnPool(
  pool: import('piscina').Piscina<WorkerTask, AuditEntry>,
  task: Omit<WorkerTask, 'started'>,
  maxSecondsPerDocument: number,
): Promise<AuditEntry> {
  try {
    const outcome = await runWithinBudget(pool, task, maxSecondsPerDocument);
    return outcome.done ? outcome.value : entryOf(unreadableDocument(task.path, timeBudgetReason(maxSecondsPerDocument)));
  } catch (error) {
    return entryOf(unreadableDocument(task.path, internalErrorReason(error)));
  }
}
