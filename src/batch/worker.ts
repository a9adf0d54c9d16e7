import type { MessagePort } from 'node:worker_threads';
import { resolveConfig, type ResolvedConfig, type UserConfig } from '../checks/config.js';
import type { ReadOptions } from '../documents/read.js';
import { auditFile } from './auditFile.js';
import { entryOf, type AuditEntry } from './entry.js';

/** What the main thread sends for each document (plain data: it crosses a thread boundary). */
export interface WorkerTask {
  path: string;
  userConfig: UserConfig;
  configSource: string;
  readOptions: ReadOptions;
  /** Told when this worker starts the document: the document's time budget runs from then (run.ts, auditOnPool). */
  started?: MessagePort;
}

// Resolving the config reads the rules catalogue from disk; do it once per worker and settings.
let cachedKey = '';
let cachedConfig: ResolvedConfig | null = null;

function configFor(task: WorkerTask): ResolvedConfig {
  const key = JSON.stringify(task.userConfig);
  if (cachedConfig === null || key !== cachedKey) {
    cachedConfig = resolveConfig(task.userConfig, task.configSource);
    cachedKey = key;
  }
  return cachedConfig;
}

/** The worker pool's entry point: one document in, its audit out, already as JSON (serialised here, in parallel, not on the main thread). */
export default async function auditInWorker(task: WorkerTask): Promise<AuditEntry> {
  task.started?.postMessage('started'); // the main thread closes the port
  return entryOf(await auditFile(task.path, configFor(task), task.readOptions));
}
