import { closeSync, openSync, statSync, writeFileSync, writeSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { Option, type Command } from 'commander';
import type { ResolvedConfig } from '../checks/config.js';
import type { UserConfig } from '../checks/userConfig.js';
import { documentOf, entryJson, entryOf, type AuditEntry } from '../batch/entry.js';
import { notRegularFileReason } from '../documents/regularFile.js';
import { buildReport, reportHead } from '../report/build.js';
import { formatJsonParts, jsonReportPieces } from '../report/json.js';
import type { Report, StreamedReport, Summary } from '../report/model.js';
import { UsageError } from './usageError.js';
import { checkLimitValue, limitNames, type Limits } from '../limits.js';

/** Where the CLI reads and writes; tests pass their own. */
export interface CliIo {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  readStdin: () => Promise<string>;
  /** Colour on the console report (a terminal without NO_COLOR). */
  color: boolean;
  /** Progress bars on stderr (a terminal). */
  interactive?: boolean;
}

export const EXIT_CLEAN = 0;
export const EXIT_FLAGGED = 1;
export const EXIT_INPUT_ERROR = 2;
/** A fault in plumbline itself (the BSD sysexits code for an internal software error). */
export const EXIT_INTERNAL_FAULT = 70;

/** An error the user can fix (bad option, missing file): printed briefly, exit code 2. */
export { UsageError };

export type FailOn = 'fail' | 'warn' | 'never';
export const reportFormats = ['text', 'json', 'jsonl', 'html', 'csv', 'md'] as const;
export type ReportFormat = (typeof reportFormats)[number];

export interface CommonOptions {
  format: ReportFormat;
  config?: string;
  failOn: FailOn;
  alpha?: string;
  output?: string;
}

/** The settings as plain data (they cross into worker threads) and where they came from. */
export async function userConfigFrom(options: CommonOptions): Promise<{ userConfig: UserConfig; source: string }> {
  if (options.config) {
    // A settings file named /dev/zero would be read for ever, a FIFO would wait for ever: only a regular file is read.
    const reason = await notRegularFileReason(options.config);
    if (reason !== null) throw new UsageError(`--config ${options.config}: ${reason}`);
  }
  // The validator (zod) loads only when there is a settings file to validate.
  const userConfig = options.config ? (await import('../checks/userConfig.js')).readUserConfigFile(options.config) : {};
  if (options.alpha === undefined) return { userConfig, source: options.config ?? 'defaults' };
  const alpha = Number(options.alpha);
  if (!(alpha > 0 && alpha < 1)) throw new UsageError(`--alpha must be a number between 0 and 1, got "${options.alpha}"`);
  return { userConfig: { ...userConfig, alpha }, source: options.config ?? 'command line' };
}

/** Resolves the settings against the rules catalogue (loads every check, so only when checking). */
export async function configFrom(options: CommonOptions): Promise<ResolvedConfig> {
  const { userConfig, source } = await userConfigFrom(options);
  const { resolveConfig } = await import('../checks/config.js');
  return resolveConfig(userConfig, source);
}

/** 2 when a document could not be read; else 1 when a finding reaches the --fail-on severity; else 0. */
export function exitCodeFor(summary: Summary, failOn: FailOn): number {
  if (summary.unreadable > 0) return EXIT_INPUT_ERROR;
  if (failOn === 'never') return EXIT_CLEAN;
  const { fail, warn } = summary.findings;
  return fail > 0 || (failOn === 'warn' && warn > 0) ? EXIT_FLAGGED : EXIT_CLEAN;
}

/**
 * A scan's audits as they came from the batch, with their summary. The JSON
 * formats take each audit's JSON as it is (a cached audit is never parsed
 * for them); the other formats parse the audits into a report.
 */
export interface ScannedAudits {
  entries: readonly AuditEntry[];
  summary: Summary;
}

export type ReportInput = Report | ScannedAudits;

/** Formats a report; each formatter is loaded only when asked for. */
export async function formatReport(input: ReportInput, format: ReportFormat, color: boolean, showAll: boolean): Promise<string> {
  if ('entries' in input) {
    if (format === 'json') return formatJsonParts({ ...reportHead(), summary: input.summary }, input.entries.map(entryJson));
    if (format === 'jsonl') return input.entries.map((entry) => `${entryJson(entry)}\n`).join('');
    return formatReport(buildReport(input.entries.map(documentOf)), format, color, showAll);
  }
  const report = input;
  // The JSON formats are written one way, from each document's JSON.
  if (format === 'json' || format === 'jsonl') return formatReport({ entries: report.documents.map(entryOf), summary: report.summary }, format, color, showAll);
  switch (format) {
    case 'text':
      return (await import('../report/console.js')).formatConsole(report, { color, showAll });
    case 'html':
      return (await import('../report/html.js')).formatHtml(report);
    case 'csv':
      return (await import('../report/csv.js')).formatCsv(report);
    case 'md':
      return (await import('../report/markdown.js')).formatMarkdown(report);
  }
}

/**
 * Stops before a long audit, rather than after it, when the report could
 * not be written where --output says: its folder is missing or not a folder.
 */
export function checkOutputFolder(file: string): void {
  const folder = dirname(resolve(file));
  let isFolder: boolean;
  try {
    isFolder = statSync(folder).isDirectory();
  } catch {
    throw new UsageError(`--output ${file}: the folder ${folder} does not exist`);
  }
  if (!isFolder) throw new UsageError(`--output ${file}: ${folder} is not a folder`);
}

/** The JSON and JSON Lines reports as pieces in order (one per document); null for the other formats. */
function jsonPieces(input: ReportInput, format: ReportFormat): Iterable<string> | null {
  if (format !== 'json' && format !== 'jsonl') return null;
  return jsonPiecesOf(format, input.summary, 'entries' in input ? input.entries : input.documents.map(entryOf));
}

/** The JSON or JSON Lines report of audits given one at a time (an array, or made as they are written). */
function jsonPiecesOf(format: 'json' | 'jsonl', summary: Summary, entries: Iterable<Pick<AuditEntry, 'path' | 'body'>>): Iterable<string> {
  const documents = (function* () {
    for (const entry of entries) yield entryJson(entry);
  })();
  if (format === 'json') return jsonReportPieces({ ...reportHead(), summary }, documents);
  return (function* () {
    for (const text of documents) yield `${text}\n`;
  })();
}

/**
 * Writes a JSON or JSON Lines report whose audits are made as they are
 * written (merge reads each back from its file): only one audit, and one
 * batch of text, is held at a time.
 */
export function writeJsonReportOf(format: 'json' | 'jsonl', summary: Summary, entries: Iterable<Pick<AuditEntry, 'path' | 'body'>>, output: string | undefined, io: CliIo): void {
  writePieces(jsonPiecesOf(format, summary, entries), output, io);
}

/** Most characters gathered before a write: few writes, and never one string as long as the whole report. */
const WRITE_BATCH = 1 << 20;

/** Writes pieces to the file, or to standard output, a batch at a time. */
export function writePieces(pieces: Iterable<string>, output: string | undefined, io: CliIo): void {
  const descriptor = output ? openSync(output, 'w') : null;
  try {
    let batch: string[] = [];
    let length = 0;
    const flush = (): void => {
      if (batch.length === 0) return;
      const text = batch.join('');
      if (descriptor === null) io.stdout(text);
      else writeSync(descriptor, text);
      batch = [];
      length = 0;
    };
    for (const piece of pieces) {
      batch.push(piece);
      length += piece.length;
      if (length >= WRITE_BATCH) flush();
    }
    flush();
  } finally {
    if (descriptor !== null) closeSync(descriptor);
  }
}

/**
 * A report whose documents are given one at a time: a scan's audits are parsed each in turn (the JSON of all of
 * them is held, their parsed form one at a time).
 */
function streamedReportOf(input: ReportInput): StreamedReport {
  if (!('entries' in input)) return { caution: input.caution, summary: input.summary, documents: () => input.documents };
  const { entries } = input;
  return {
    caution: reportHead().caution,
    summary: input.summary,
    documents: function* () {
      for (const entry of entries) yield documentOf(entry);
    },
  };
}

/** The HTML report of a streamed report, as pieces (the formatter loaded only when asked for). */
export async function htmlPiecesOf(report: StreamedReport): Promise<Iterable<string>> {
  return (await import('../report/html.js')).htmlPieces(report, reportHead().tool);
}

/** Writes the report to --output or stdout. Colour only on a terminal, never into a file. */
export async function writeReport(input: ReportInput, options: CommonOptions, io: CliIo, showAll: boolean): Promise<void> {
  const pieces = jsonPieces(input, options.format) ?? (options.format === 'html' ? await htmlPiecesOf(streamedReportOf(input)) : null);
  if (pieces !== null) {
    writePieces(pieces, options.output, io);
    return;
  }
  if (options.output) {
    writeFileSync(options.output, await formatReport(input, options.format, false, showAll));
    return;
  }
  io.stdout(await formatReport(input, options.format, io.color, showAll));
}

export function addCommonOptions(command: Command): Command {
  return command
    .addOption(new Option('-f, --format <format>', 'report format').choices(reportFormats).default('text'))
    .option('-o, --output <file>', 'write the report to a file instead of standard output')
    .option('-c, --config <file>', 'settings file (JSON) that switches rules off or changes their severity and options')
    .addOption(new Option('--fail-on <severity>', 'lowest severity that makes the exit code 1').choices(['fail', 'warn', 'never']).default('fail'))
    .option('--alpha <level>', 'significance level when a document declares none (default .05)');
}

/** The option that changes any limit of src/limits.ts: "--limit name=value", repeatable. */
export function limitOption(what: string): Option {
  return new Option('--limit <name=value>', `${what}, repeatable (${limitNames.join(', ')}); see DEVELOPERS.md, "Limits"`).argParser(
    (item: string, earlier: string[] | undefined) => [...(earlier ?? []), item],
  );
}

/**
 * The settings file's limits with the command line's on top (--limit, and
 * --max-document-mb where the command has it); undefined when neither
 * changes any. A bad name or value is a usage error naming the option.
 */
export function limitsFrom(fromSettings: Partial<Limits> | undefined, options: { limit?: string[]; maxDocumentMb?: string }): Partial<Limits> | undefined {
  const limits: Partial<Limits> = { ...fromSettings };
  const set = (name: string, text: string, option: string): void => {
    const value = Number(text);
    const problem = text.trim() === '' ? `limit ${name} needs a value` : checkLimitValue(name, value);
    if (problem !== null) throw new UsageError(`${option}: ${problem}`);
    limits[name as keyof Limits] = value;
  };
  for (const item of options.limit ?? []) {
    const equals = item.indexOf('=');
    if (equals === -1) throw new UsageError(`--limit takes name=value, got "${item}"`);
    set(item.slice(0, equals).trim(), item.slice(equals + 1), '--limit');
  }
  if (options.maxDocumentMb !== undefined) set('maxDocumentMb', options.maxDocumentMb, '--max-document-mb');
  return Object.keys(limits).length > 0 ? limits : undefined;
}
