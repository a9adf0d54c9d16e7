import { basename } from 'node:path';
import type { ReadOptions } from '../documents/read.js';
import { compiledModule, runWithinBudget } from '../batch/withinBudget.js';
import { hintsForLimitOptionOnly, resolveLimits, timeBudgetReason } from '../limits.js';
import { RefitError } from './errors.js';
import type { FormulaTerm } from './formula.js';
import type { ReportedSet } from './reportedTable.js';
import type { ReportedOutcome, ReportedTask } from './reportedWorker.js';

/**
 * What `refit --reported` reads, within the document time budget
 * (maxSecondsPerDocument). The manuscript is read on a thread of its own,
 * as `scan` reads a document, because only ending a thread stops a reader
 * that runs as JavaScript (mammoth for DOCX, pdf-parse's pdf.js, the
 * scanner over a text of tens of thousands of results). Past the budget the
 * thread is ended and a RefitError names the file and the limit. From
 * TypeScript sources (tests importing src/), where a thread cannot load the
 * worker, it is read on this thread without a budget.
 */
export async function readReportedWithinBudget(
  path: string,
  terms: readonly FormulaTerm[],
  map: ReadonlyMap<string, string>,
  readOptions: ReadOptions,
): Promise<ReportedSet> {
  try {
    return await readOnThread(path, terms, map, readOptions);
  } catch (error) {
    // The readers word their limits' hints for scan; refit takes them only as --limit name=value.
    if (error instanceof RefitError) throw new RefitError(error.code, hintsForLimitOptionOnly(error.message), error.details);
    throw error;
  }
}

async function readOnThread(path: string, terms: readonly FormulaTerm[], map: ReadonlyMap<string, string>, readOptions: ReadOptions): Promise<ReportedSet> {
  const module = compiledModule('./reportedWorker.js', import.meta.url);
  if (module === null) {
    const { readReported } = await import('./reportedTable.js');
    return readReported(path, terms, map, readOptions);
  }
  const { maxSecondsPerDocument } = resolveLimits(readOptions.limits);
  const { Piscina } = await import('piscina');
  const pool = new Piscina<ReportedTask, ReportedOutcome>({ filename: module, minThreads: 1, maxThreads: 1 });
  try {
    const task = { path, terms: [...terms], map: [...map], readOptions };
    const outcome = await runWithinBudget(pool, task, maxSecondsPerDocument);
    if (!outcome.done) {
      const file = basename(path);
      throw new RefitError('UNREADABLE_FILE', `${file}: reading it as the reported manuscript ${timeBudgetReason(maxSecondsPerDocument)}`, { file });
    }
    const { value } = outcome;
    if (!value.ok) throw new RefitError(value.error.code, value.error.message, value.error.details);
    return value.reported;
  } finally {
    await pool.destroy();
  }
}
