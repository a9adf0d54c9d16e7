import type { ReadStream } from 'node:fs';
import { stat } from 'node:fs/promises';
import { extname } from 'node:path';
import { auditDocument, unreadableDocument } from '../audit.js';
import type { ResolvedConfig } from '../checks/config.js';
import { formatByExtension } from '../documents/formats.js';
import { ReferenceListTracker } from '../documents/plainRegions.js';
import { readDocument, type ReadOptions } from '../documents/read.js';
import { openRegularFile } from '../documents/regularFile.js';
import type { Region } from '../documents/types.js';
import { MB, resolveLimits, timeBudgetReason } from '../limits.js';
import type { DocumentOutput, StatisticOutput } from '../report/model.js';
import { noResultsOf } from '../report/wording.js';
import { internalErrorReason } from './entry.js';
import { runSyncWithinBudget } from './syncBudget.js';
import { decodeChunks, TextDecodingError, textWindows, type StreamOptions } from '../scan/stream.js';

/**
 * Texts from this length on are scanned and checked under the time budget's
 * watchdog on the main thread. Starting the watchdog costs 0.05 to 0.4 ms
 * (a thread; more on a loaded machine), about the whole audit of a
 * one-page text, and under 1% of the audit of a paper's 30 to 100 K
 * characters; a shorter text takes at most about 0.2 s even when it holds
 * nothing but results (12 K characters of them: 0.16 s).
 */
const WATCHED_FROM_CHARACTERS = 16 * 1024;

export interface AuditFileOptions {
  /** How a text file too large to read whole is cut into windows (tests make them small). */
  stream?: StreamOptions;
  /**
   * The document's time budget, in seconds, when it is audited on this
   * thread rather than on a worker thread that can be ended: reading is
   * checked against it when it ends (the readers kept on this thread are
   * bounded by the limits, and pdftotext is killed on time), and scanning
   * and checking a text of WATCHED_FROM_CHARACTERS or more are stopped when
   * they run past what is left of it (syncBudget.ts). Undefined: no budget
   * here (a worker thread's is kept by ending the thread, run.ts).
   */
  timeBudgetSeconds?: number;
}

/** Reads and audits one file; an unreadable file becomes a row with its reason, never an exception. */
export async function auditFile(path: string, config: ResolvedConfig, readOptions: ReadOptions, options: AuditFileOptions = {}): Promise<DocumentOutput> {
  const started = performance.now();
  try {
    const limits = resolveLimits(readOptions.limits);
    const format = formatByExtension[extname(path).toLowerCase()];
    if (format === 'text' || format === 'markdown') {
      const size = await stat(path).then(
        (stats) => stats.size,
        () => -1, // the reader says why the file cannot be read
      );
      if (size > limits.streamTextAboveMb * MB) return await auditTextStream(path, format, config, options.stream);
    }
    const outcome = await readDocument(path, readOptions);
    if (!outcome.ok) return unreadableDocument(path, outcome.error, outcome.format);
    const audit = () => ({ ...auditDocument(outcome.document, config, path), format: outcome.document.format });
    const budget = options.timeBudgetSeconds;
    if (budget === undefined) return audit();
    const left = budget - (performance.now() - started) / 1000;
    if (left <= 0) return unreadableDocument(path, timeBudgetReason(budget), outcome.document.format);
    if (outcome.document.text.length < WATCHED_FROM_CHARACTERS) return audit();
    const audited = runSyncWithinBudget(audit, left);
    return audited.done ? audited.value : unreadableDocument(path, timeBudgetReason(budget), outcome.document.format);
  } catch (error) {
    // A reader bug must not stop an audit of thousands of files: record it against this file.
    return unreadableDocument(path, internalErrorReason(error));
  }
}

/**
 * Audits a large text file in bounded memory (src/scan/stream.ts): the file
 * is read twice, first to find its reference list (which, as in a whole
 * read, starts at the LAST "References" line, so it is only known at the
 * end), then window by window, each window audited as a text of its own and
 * keeping the results that start in the stretch it owns. Locations are those
 * of the whole file.
 *
 * Document-wide context is read per window: a significance level declared
 * in the text applies from the window where it is declared onwards (it is
 * usually declared in the Method section, before the results).
 */
export async function auditTextStream(path: string, format: 'text' | 'markdown', config: ResolvedConfig, options: StreamOptions = {}): Promise<DocumentOutput> {
  let regions: Region[];
  try {
    const tracker = new ReferenceListTracker();
    const first = await regularFileStream(path);
    if (!first.ok) return unreadableDocument(path, first.error, format);
    for await (const piece of decodeChunks(first.stream)) tracker.add(piece);
    regions = tracker.finish();
  } catch (error) {
    return unreadableDocument(path, describeStreamError(error), format);
  }

  const statistics: StatisticOutput[] = [];
  let declaredAlpha: number | null = null;
  let hasText = false;
  try {
    const second = await regularFileStream(path);
    if (!second.ok) return unreadableDocument(path, second.error, format);
    for await (const window of textWindows(second.stream, options)) {
      const windowEnd = window.start + window.text.length;
      hasText ||= /\S/.test(window.text);
      const windowRegions = regions
        .filter((region) => region.end > window.start && region.start < windowEnd)
        .map((region) => ({ ...region, start: Math.max(0, region.start - window.start), end: Math.min(window.text.length, region.end - window.start) }));
      const windowConfig = declaredAlpha === null ? config : { ...config, defaultAlpha: declaredAlpha };
      const audited = auditDocument({ text: window.text, tables: [], regions: windowRegions }, windowConfig, path);
      if (declaredAlpha === null && audited.alpha !== undefined && audited.alpha !== config.defaultAlpha) declaredAlpha = audited.alpha;
      for (const statistic of audited.statistics) {
        const local = statistic.location.start;
        const start = local + window.start;
        if (start < window.ownStart || start >= window.ownEnd) continue;
        const { line, column } = window.locate(local);
        // A copy: the result's strings are slices of the window's text, and would keep every window in memory.
        const kept = structuredClone(statistic);
        statistics.push({ ...kept, location: { ...kept.location, line, column, start, end: statistic.location.end + window.start } });
      }
    }
  } catch (error) {
    return unreadableDocument(path, describeStreamError(error), format);
  }
  // A file this large is read as a stream of windows, where tables are not rebuilt.
  return {
    path,
    status: 'checked',
    alpha: declaredAlpha ?? config.defaultAlpha,
    statistics,
    findings: [],
    tablesNotRead: [],
    ...(statistics.length === 0 ? { noResults: noResultsOf(hasText) } : {}),
    format,
  };
}

/**
 * A stream of a file's bytes, opened only when it is a regular file
 * (regularFile.ts): the file was a regular one when its size was taken, but
 * may have been replaced by a FIFO before either pass opens it. The stream
 * closes the file when it ends.
 */
async function regularFileStream(path: string): Promise<{ ok: true; stream: ReadStream } | { ok: false; error: string }> {
  const opened = await openRegularFile(path);
  return opened.ok ? { ok: true, stream: opened.handle.createReadStream({ highWaterMark: 1 << 20 }) } : opened;
}

function describeStreamError(error: unknown): string {
  if (error instanceof TextDecodingError) return error.message;
  const code = (error as NodeJS.ErrnoException).code;
  return code ? `cannot read the file (${code})` : internalErrorReason(error);
}
