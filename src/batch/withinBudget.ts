import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { MessageChannel, type MessagePort } from 'node:worker_threads';
import type { Piscina } from 'piscina';

/** What a task run within a budget carries: the port on which its worker says it has started (the clock starts then). */
export interface StartedPort {
  started?: MessagePort;
}

/** The task's result, or that it ran past its budget and its thread was ended. */
export type Budgeted<Result> = { done: true; value: Result } | { done: false };

/** The longest delay setTimeout takes; a longer one fires at once (with a warning). */
const LONGEST_TIMER_MS = 2 ** 31 - 1;

/**
 * Runs one task on the pool within `seconds`, counted from the moment a
 * worker takes the task up (the worker posts on `started`), never while it
 * waits in the queue. Past the budget piscina ends the thread (and starts
 * another) and the outcome is `{ done: false }`; any other failure of the
 * task is thrown as it came. The worker's module must post on `started`
 * first thing.
 */
export async function runWithinBudget<Task extends StartedPort, Result>(
  pool: Piscina<Task, Result>,
  task: Omit<Task, 'started'>,
  seconds: number,
): Promise<Budgeted<Result>> {
  const { port1: startedHere, port2: startedThere } = new MessageChannel();
  const stop = new AbortController();
  let timer: NodeJS.Timeout | undefined;
  let timedOut = false;
  startedHere.once('message', () => {
    // A budget longer than 24.8 days is for ever: never let setTimeout cut it to a millisecond.
    timer = setTimeout(
      () => {
        timedOut = true;
        stop.abort();
      },
      Math.min(seconds * 1000, LONGEST_TIMER_MS),
    );
    startedHere.close();
  });
  try {
    const value = await pool.run({ ...task, started: startedThere } as Task, { signal: stop.signal, transferList: [startedThere] });
    return { done: true, value };
  } catch (error) {
    if (timedOut) return { done: false };
    throw error;
  } finally {
    clearTimeout(timer);
    startedHere.close();
  }
}

/**
 * The URL of a compiled worker module next to `moduleUrl` (e.g. './worker.js'
 * beside run.js), or null when running from TypeScript sources (tests that
 * import src/ directly), where a thread cannot load it: callers then do the
 * work on their own thread.
 */
export function compiledModule(relative: string, moduleUrl: string): string | null {
  const url = new URL(relative, moduleUrl);
  return existsSync(fileURLToPath(url)) ? url.href : null;
}
