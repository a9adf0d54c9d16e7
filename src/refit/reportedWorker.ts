import type { ReadOptions } from '../documents/read.js';
import type { StartedPort } from '../batch/withinBudget.js';
import { RefitError, type RefitErrorCode, type RefitErrorDetails } from './errors.js';
import type { FormulaTerm } from './formula.js';
import { readReported, type ReportedSet } from './reportedTable.js';

/** What `refit --reported` sends to the thread that reads the reported manuscript (plain data: it crosses a thread boundary). */
export interface ReportedTask extends StartedPort {
  path: string;
  terms: FormulaTerm[];
  map: [string, string][];
  readOptions: ReadOptions;
}

/**
 * The reported numbers, or the refit error that refused the file: an error
 * thrown in a worker loses its class on the way back, and refit's messages
 * depend on its code and details.
 */
export type ReportedOutcome =
  | { ok: true; reported: ReportedSet }
  | { ok: false; error: { code: RefitErrorCode; message: string; details: RefitErrorDetails } };

/** The thread's entry point: reads the reported manuscript or table file (reportedTable.ts, readReported). */
export default async function readReportedInWorker(task: ReportedTask): Promise<ReportedOutcome> {
  task.started?.postMessage('started'); // the time budget starts now (withinBudget.ts)
  try {
    return { ok: true, reported: await readReported(task.path, task.terms, new Map(task.map), task.readOptions) };
  } catch (error) {
    if (error instanceof RefitError) return { ok: false, error: { code: error.code, message: error.message, details: error.details } };
    throw error;
  }
}
