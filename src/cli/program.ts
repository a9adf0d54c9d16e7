import { readdir, stat } from 'node:fs/promises';
import { join } from 'node:path';
import { Command, CommanderError, Option } from 'commander';
import { auditText, buildReport, unreadableDocument } from '../audit.js';
import { ConfigError, loadConfigFile, resolveConfig, type ResolvedConfig } from '../checks/config.js';
import { CatalogueError } from '../checks/catalogue.js';
import { isSupported, readDocument } from '../documents/read.js';
import { formatConsole } from '../report/console.js';
import { formatJson } from '../report/json.js';
import type { Report } from '../report/model.js';
import { toolVersion } from '../version.js';

/** Where the CLI reads and writes; tests pass their own. */
export interface CliIo {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  readStdin: () => Promise<string>;
  /** Colour on the console report (a terminal without NO_COLOR). */
  color: boolean;
}

export const EXIT_CLEAN = 0;
export const EXIT_FLAGGED = 1;
export const EXIT_INPUT_ERROR = 2;

/** An error the user can fix (bad option, missing file): printed briefly, exit code 2. */
export class UsageError extends Error {}

type FailOn = 'fail' | 'warn' | 'never';

interface CommonOptions {
  format: 'text' | 'json';
  config?: string;
  failOn: FailOn;
  alpha?: string;
}

function configFrom(options: CommonOptions): ResolvedConfig {
  const config = options.config ? loadConfigFile(options.config) : resolveConfig({});
  if (options.alpha === undefined) return config;
  const alpha = Number(options.alpha);
  if (!(alpha > 0 && alpha < 1)) throw new UsageError(`--alpha must be a number between 0 and 1, got "${options.alpha}"`);
  return { ...config, defaultAlpha: alpha };
}

/** 1 when a finding reaches the --fail-on severity. */
function exitCodeFor(report: Report, failOn: FailOn): number {
  if (report.summary.unreadable > 0) return EXIT_INPUT_ERROR;
  if (failOn === 'never') return EXIT_CLEAN;
  const { fail, warn } = report.summary.findings;
  return fail > 0 || (failOn === 'warn' && warn > 0) ? EXIT_FLAGGED : EXIT_CLEAN;
}

function render(report: Report, options: CommonOptions, io: CliIo, showAll: boolean): void {
  io.stdout(options.format === 'json' ? formatJson(report) : formatConsole(report, { color: io.color, showAll }));
}

/** Expands folders into the supported files inside them, in a stable order. */
async function collectFiles(paths: readonly string[]): Promise<{ files: string[]; missing: string[] }> {
  const files: string[] = [];
  const missing: string[] = [];
  for (const path of paths) {
    let info;
    try {
      info = await stat(path);
    } catch {
      missing.push(path);
      continue;
    }
    if (info.isDirectory()) {
      const entries = await readdir(path, { recursive: true, withFileTypes: true });
      const found = entries
        .filter((entry) => entry.isFile() && isSupported(entry.name))
        .map((entry) => join(entry.parentPath, entry.name))
        .sort();
      files.push(...found);
    } else {
      files.push(path);
    }
  }
  return { files, missing };
}

function commonOptions(command: Command): Command {
  return command
    .addOption(new Option('-f, --format <format>', 'output format').choices(['text', 'json']).default('text'))
    .option('-c, --config <file>', 'settings file (JSON) that switches rules off or changes their severity and options')
    .addOption(new Option('--fail-on <severity>', 'lowest severity that makes the exit code 1').choices(['fail', 'warn', 'never']).default('fail'))
    .option('--alpha <level>', 'significance level when a document declares none (default .05)');
}

export function buildProgram(io: CliIo, setExitCode: (code: number) => void): Command {
  const program = new Command()
    .name('plumbline')
    .description('Audit reported F, t, chi-square, r and z results: recompute them and flag what does not add up.\nA flag is a prompt to look again, not proof of error or misconduct.')
    .version(toolVersion(), '-V, --version')
    .showHelpAfterError()
    .configureOutput({ writeOut: io.stdout, writeErr: io.stderr })
    .exitOverride();

  commonOptions(
    program
      .command('check')
      .description('check the results in a piece of text given as the argument, or "-" to read standard input')
      .argument('<text>', 'the text, or - for standard input'),
  ).action(async (text: string, options: CommonOptions) => {
    const config = configFrom(options);
    const input = text === '-' ? await io.readStdin() : text;
    const report = buildReport([auditText(input, config, text === '-' ? '<stdin>' : '<text>')]);
    render(report, options, io, true);
    setExitCode(exitCodeFor(report, options.failOn));
  });

  commonOptions(
    program
      .command('scan')
      .description('check every supported document (.txt, .md) in the given files and folders')
      .argument('<paths...>', 'files or folders'),
  )
    .option('--all', 'list results without findings too')
    .action(async (paths: string[], options: CommonOptions & { all?: boolean }) => {
      const config = configFrom(options);
      const { files, missing } = await collectFiles(paths);
      if (files.length === 0 && missing.length === 0) throw new UsageError(`no supported documents found in ${paths.join(', ')}`);
      const documents = missing.map((path) => unreadableDocument(path, 'no such file or folder'));
      for (const file of files) {
        const outcome = await readDocument(file);
        documents.push(
          outcome.ok
            ? { ...auditText(outcome.document.text, config, file, outcome.document.pageOf), format: outcome.document.format }
            : unreadableDocument(file, outcome.error, outcome.format),
        );
      }
      const report = buildReport(documents);
      render(report, options, io, options.all ?? false);
      setExitCode(exitCodeFor(report, options.failOn));
    });

  program
    .command('rules')
    .description('list the rules catalogue: id, default severity, title and sources')
    .addOption(new Option('-f, --format <format>', 'output format').choices(['text', 'json']).default('text'))
    .action((options: { format: 'text' | 'json' }) => {
      const { catalogue } = resolveConfig({});
      if (options.format === 'json') {
        io.stdout(`${JSON.stringify(catalogue, null, 2)}\n`);
        return;
      }
      for (const entry of catalogue) {
        io.stdout(`${entry.id.padEnd(32)} ${entry.defaultSeverity.padEnd(5)} ${entry.title}\n`);
      }
      io.stdout(`\n${catalogue.length} rules. Switch one off or change it in a settings file: plumbline scan --config plumbline.config.json ...\n`);
    });

  return program;
}

/** Runs the CLI; returns the exit code instead of exiting, so it can be tested in-process. */
export async function runCli(argv: readonly string[], io: CliIo): Promise<number> {
  let exitCode = EXIT_CLEAN;
  const program = buildProgram(io, (code) => {
    exitCode = code;
  });
  try {
    await program.parseAsync([...argv], { from: 'user' });
    return exitCode;
  } catch (error) {
    if (error instanceof CommanderError) {
      // --help and --version end here with exit code 0.
      return error.exitCode === 0 ? EXIT_CLEAN : EXIT_INPUT_ERROR;
    }
    if (error instanceof UsageError || error instanceof ConfigError || error instanceof CatalogueError) {
      io.stderr(`plumbline: ${error.message}\n`);
      return EXIT_INPUT_ERROR;
    }
    throw error;
  }
}
