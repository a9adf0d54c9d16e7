import { existsSync, truncateSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { Option, type Command } from 'commander';
import { summaryOfTallies, unreadableDocument } from '../report/build.js';
import { AuditCache, settingsFingerprint } from '../batch/cache.js';
import { collectInputs, workingFolders } from '../batch/inputs.js';
import { entryJson, entryOf, mergeByPath, type AuditEntry } from '../batch/entry.js';
import { JsonLinesError, JsonLinesWriter, readJsonLines } from '../batch/jsonLines.js';
import { createProgress } from '../batch/progress.js';
import { runBatch } from '../batch/run.js';
import { inShard, parseShard } from '../batch/shard.js';
import type { ReadOptions } from '../documents/read.js';
import type { DocumentOutput } from '../report/model.js';
import { defaultLimits, resolveLimits } from '../limits.js';
import { buildFingerprint } from '../version.js';
import { addCommonOptions, checkOutputFolder, exitCodeFor, limitOption, limitsFrom, UsageError, userConfigFrom, writeReport, type CliIo, type CommonOptions } from './common.js';

interface ScanOptions extends CommonOptions {
  all?: boolean;
  jobs?: string;
  jsonl?: string;
  resume?: boolean;
  cache: boolean;
  cacheDir: string;
  shard?: string;
  pdfEngine: NonNullable<ReadOptions['pdfEngine']>;
  quiet?: boolean;
  maxDocumentMb?: string;
  limit?: string[];
  followLinks?: boolean;
}

function parseJobs(text: string | undefined): number {
  if (text === undefined) return availableParallelism();
  const jobs = Number(text);
  if (!Number.isInteger(jobs) || jobs < 1) throw new UsageError(`--jobs must be a whole number of at least 1, got "${text}"`);
  return jobs;
}

/**
 * The documents already in the --jsonl file that --resume continues. A last
 * line cut off mid-line (a crash, a full disk) is dropped from the file,
 * and said so, before anything is appended: the next record would otherwise
 * be glued onto it, losing a document and spoiling the file for merge. A bad
 * line anywhere else stops the scan with its line number, before the file is
 * touched.
 */
async function resumedDocuments(file: string, io: CliIo, maxSecondsPerRecord: number): Promise<DocumentOutput[]> {
  if (!existsSync(file)) return [];
  let content;
  try {
    content = await readJsonLines(file, { maxSecondsPerRecord });
  } catch (error) {
    if (error instanceof JsonLinesError) throw new UsageError(`--resume: ${error.message}`);
    throw error;
  }
  const { cutOff } = content;
  if (cutOff) {
    truncateSync(file, cutOff.completeBytes);
    io.stderr(
      `plumbline: ${file}: line ${cutOff.line} was cut off mid-line (${cutOff.bytes} bytes, an interrupted write); ` +
        'dropped it before appending, and its document is audited again\n',
    );
  }
  return content.documents;
}

export function registerScanCommand(program: Command, io: CliIo, setExitCode: (code: number) => void): void {
  addCommonOptions(
    program
      .command('scan')
      .description(
        'audit every supported document (.txt .md .pdf .docx .html .xml .tex) in the given files and folders; @list.txt reads paths from a list file',
      )
      .argument('<paths...>', 'files, folders, or @file with one path per line'),
  )
    .option('--all', 'list results without findings too (text format)')
    .option('-j, --jobs <n>', 'documents audited in parallel (default: the number of cores)')
    .option('--jsonl <file>', 'write each document as one JSON line as soon as it is audited')
    .option('--resume', 'skip documents already in the --jsonl file and append the rest')
    .option('--no-cache', 'do not reuse or store audits of unchanged files')
    .option('--cache-dir <folder>', 'where audits of unchanged files are kept', '.plumbline-cache')
    .option('--shard <K/N>', 'audit only the K-th of N deterministic shares of the inputs (for batch arrays)')
    .addOption(
      new Option('--pdf-engine <engine>', 'PDF text extraction: pdftotext (poppler, faster) when installed, else pdf-parse')
        .choices(['auto', 'pdf-parse', 'pdftotext'])
        .default('auto'),
    )
    .option('--follow-links', 'also audit files that links in a scanned folder point to outside it')
    .option('-q, --quiet', 'no progress bar')
    .option('--max-document-mb <n>', `largest document read whole, in MB (default ${defaultLimits.maxDocumentMb}; larger text files are streamed)`)
    .addOption(limitOption('change another limit'))
    .action(async (paths: string[], options: ScanOptions) => {
      const { userConfig, source } = await userConfigFrom(options);
      const limits = limitsFrom(userConfig.limits, options);
      if (options.resume && !options.jsonl) throw new UsageError('--resume needs --jsonl <file>: the file to resume');
      const shard = options.shard === undefined ? null : parseShard(options.shard);
      if (typeof shard === 'string') throw new UsageError(shard);
      const jobs = parseJobs(options.jobs);
      if (options.output) checkOutputFolder(options.output);

      const { files, missing } = await collectInputs(paths, workingFolders(), { followLinks: options.followLinks === true });
      if (files.length === 0 && missing.length === 0) throw new UsageError(`no supported documents found in ${paths.join(', ')}`);
      const inputs = [
        ...missing.map((m) => ({ path: m.path, reason: m.reason })),
        ...files.map((path) => ({ path, reason: null as string | null })),
      ].filter((input) => shard === null || inShard(input.path, shard));

      const previous = options.resume && options.jsonl ? await resumedDocuments(options.jsonl, io, resolveLimits(limits).maxSecondsPerDocument) : [];
      const done = new Set(previous.map((d) => d.path));
      const writer = options.jsonl ? new JsonLinesWriter(options.jsonl, Boolean(options.resume)) : null;
      const streamToStdout = options.format === 'jsonl' && !options.jsonl && !options.output;
      const entries: AuditEntry[] = previous.map(entryOf);
      const progress = await createProgress(inputs.length - done.size, Boolean(io.interactive) && !options.quiet);
      const totals = { results: 0, flags: 0 };
      const emit = (entry: AuditEntry): void => {
        // Streamed to standard output, an audit is not needed again: only its counts, for the exit code.
        entries.push(streamToStdout ? { ...entry, body: '{}' } : entry);
        writer?.write(entry);
        if (streamToStdout) io.stdout(`${entryJson(entry)}\n`);
        const { statistics, findings } = entry.tally;
        totals.results += statistics;
        totals.flags += findings.fail + findings.warn + findings.note;
        progress.tick(totals);
      };

      try {
        for (const input of inputs) if (input.reason !== null && !done.has(input.path)) emit(entryOf(unreadableDocument(input.path, input.reason)));
        const readOptions: ReadOptions = { pdfEngine: options.pdfEngine, ...(limits ? { limits } : {}) };
        await runBatch({
          files: inputs.filter((i) => i.reason === null && !done.has(i.path)).map((i) => i.path),
          task: { userConfig, configSource: source, readOptions },
          jobs,
          cache: options.cache
            ? {
                store: new AuditCache(options.cacheDir, io.stderr),
                fingerprint: settingsFingerprint({ build: buildFingerprint(), userConfig, readOptions }),
                // The formats that parse the audits check each cached one against the schema as well.
                validate: !streamToStdout && options.format !== 'json' && options.format !== 'jsonl',
              }
            : null,
          onDocument: emit,
        });
      } finally {
        progress.stop();
        writer?.close();
      }

      const merged = mergeByPath(entries);
      const summary = summaryOfTallies(merged.map((entry) => entry.tally));
      if (!streamToStdout) await writeReport({ entries: merged, summary }, options, io, options.all ?? false);
      setExitCode(exitCodeFor(summary, options.failOn));
    });
}
