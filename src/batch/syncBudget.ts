import { createContext, Script } from 'node:vm';
import type { Budgeted } from './withinBudget.js';

/**
 * Synchronous work on this thread, stopped when it runs past a time budget.
 *
 * Node's `vm` runs a script with a watchdog (`timeout`) that interrupts the
 * thread's JavaScript wherever it is, also inside functions of this module's
 * own context that the script calls, and inside a regular expression: the
 * same interruption a worker thread's end gives, without a thread. The
 * script here only calls `work`; everything it does runs as ordinary code.
 * Starting the watchdog costs about 60 µs a call (a thread of libuv's), so
 * callers use it for work of milliseconds or more, not per small item.
 *
 * What an interrupted call leaves half done is dropped: the callers use it
 * for pure work (scanning and checking one document, parsing one record)
 * whose result is thrown away when it is stopped.
 */

const context = createContext({ work: null as (() => unknown) | null });
const callWork = new Script('work()', { filename: 'plumbline-time-budget' });

/** The longest timeout vm takes without complaint (it must fit a 32-bit signed integer of milliseconds). */
const LONGEST_TIMEOUT_MS = 2 ** 31 - 1;

export function runSyncWithinBudget<T>(work: () => T, seconds: number): Budgeted<T> {
  const timeout = Math.max(1, Math.min(Math.ceil(seconds * 1000), LONGEST_TIMEOUT_MS));
  const previous = context.work as (() => unknown) | null;
  context.work = work;
  try {
    return { done: true, value: callWork.runInContext(context, { timeout }) as T };
  } catch (error) {
    if ((error as NodeJS.ErrnoException | null)?.code === 'ERR_SCRIPT_EXECUTION_TIMEOUT') return { done: false };
    throw error;
  } finally {
    context.work = previous; // a nested call restores the outer call's work
  }
}
