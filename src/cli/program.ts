import { statSync } from 'node:fs';
import { Command, CommanderError, Option } from 'commander';
import { CatalogueError, ConfigError } from '../checks/errors.js';
import { buildReport } from '../report/build.js';
import { toolVersion } from '../version.js';
import { visibleControls } from '../report/visible.js';
import { resolveLimits } from '../limits.js';
import {
  addCommonOptions,
  configFrom,
  EXIT_CLEAN,
  limitOption,
  limitsFrom,
  userConfigFrom,
  EXIT_INPUT_ERROR,
  EXIT_INTERNAL_FAULT,
  exitCodeFor,
  UsageError,
  writeReport,
  type CliIo,
  type CommonOptions,
} from './common.js';
import { registerMergeCommand } from './merge.js';
import { registerScanCommand } from './scan.js';
import { registerRefitCommand } from './refit.js';
import { registerCellsCommand } from './cells.js';
import { registerWebCommand } from './web.js';

export { EXIT_CLEAN, EXIT_FLAGGED, EXIT_INPUT_ERROR, EXIT_INTERNAL_FAULT, UsageError, type CliIo } from './common.js';

/** A path as it would be typed into a POSIX shell: bare when that is safe, otherwise in single quotes. */
function shellWord(path: string): string {
  return /^[\w./@%+=:,-]+$/.test(path) ? path : `'${path.replace(/'/g, `'\\''`)}'`;
}

/**
 * `check` reads the text it is given, so `check paper.pdf` would audit the
 * nine characters "paper.pdf", find nothing and say so as if the paper were
 * clean. When the argument names a file or folder that exists, the user
 * meant `scan`: a usage error that says so. Text that cannot be a path
 * (too long, a NUL character) is simply not one.
 */
export function checkArgumentIsPath(text: string): string | null {
  let kind: string | null = null;
  try {
    const stats = statSync(text, { throwIfNoEntry: false });
    kind = stats === undefined ? null : stats.isDirectory() ? 'a folder' : 'a file';
  } catch {
    return null;
  }
  if (kind === null) return null;
  return `check reads the text of results given as its argument, but "${text}" is ${kind}; to audit it, use scan: plumbline scan ${shellWord(text)}`;
}

function registerCheckCommand(program: Command, io: CliIo, setExitCode: (code: number) => void): void {
  addCommonOptions(
    program
      .command('check')
      .description('check the results in a piece of text given as the argument, or "-" to read standard input')
      .argument('<text>', 'the text, or - for standard input')
      .addOption(limitOption('change a limit (maxSecondsPerDocument: the time budget of checking the text, 120 s)')),
  ).action(async (text: string, options: CommonOptions & { limit?: string[] }) => {
    const pathMessage = text === '-' ? null : checkArgumentIsPath(text);
    if (pathMessage !== null) throw new UsageError(pathMessage);
    const config = await configFrom(options);
    const { userConfig } = await userConfigFrom(options);
    const { maxSecondsPerDocument } = resolveLimits(limitsFrom(userConfig.limits, options));
    const input = text === '-' ? await io.readStdin() : text;
    const name = text === '-' ? '<stdin>' : '<text>';
    const { auditText } = await import('../audit.js');
    // Checking runs on this thread: the time budget stops it wherever it is (as for a document audited on the main thread).
    const { runSyncWithinBudget } = await import('../batch/syncBudget.js');
    const audited = runSyncWithinBudget(() => auditText(input, config, name), maxSecondsPerDocument);
    if (!audited.done) {
      throw new UsageError(`${name}: checking it took longer than ${maxSecondsPerDocument} s and was stopped (limit maxSecondsPerDocument; raise it with --limit maxSecondsPerDocument=<n>)`);
    }
    const report = buildReport([audited.value]);
    await writeReport(report, options, io, true);
    setExitCode(exitCodeFor(report.summary, options.failOn));
  });
}

function registerRulesCommand(program: Command, io: CliIo): void {
  program
    .command('rules')
    .description('list the rules catalogue: id, default severity and title')
    .addOption(new Option('-f, --format <format>', 'output format').choices(['text', 'json']).default('text'))
    .action(async (options: { format: 'text' | 'json' }) => {
      const { resolveConfig } = await import('../checks/config.js');
      const { catalogue } = resolveConfig({});
      if (options.format === 'json') {
        io.stdout(`${JSON.stringify(catalogue, null, 2)}\n`);
        return;
      }
      for (const entry of catalogue) io.stdout(`${entry.id.padEnd(32)} ${entry.defaultSeverity.padEnd(5)} ${entry.title}\n`);
      io.stdout(
        `\n${catalogue.length} rules. Rationale, options and sources: plumbline rules --format json, or rules/<id>.json.\n` +
          'Switch a rule off or change it in a settings file: plumbline scan --config plumbline.config.json ...\n',
      );
    });
}

export function buildProgram(io: CliIo, setExitCode: (code: number) => void): Command {
  const program = new Command()
    .name('plumbline')
    .description(
      'Audit reported F, t, chi-square, r and z results: recompute them and flag what does not add up.\n' +
        'A flag is a prompt to look again, not proof of error or misconduct.',
    )
    .version(toolVersion(), '-V, --version')
    .showHelpAfterError()
    .configureOutput({ writeOut: io.stdout, writeErr: io.stderr })
    .exitOverride();
  registerCheckCommand(program, io, setExitCode);
  registerScanCommand(program, io, setExitCode);
  registerMergeCommand(program, io, setExitCode);
  registerRulesCommand(program, io);
  registerRefitCommand(program, io, setExitCode);
  registerCellsCommand(program, io, setExitCode);
  registerWebCommand(program, io);
  return program;
}

/**
 * A failure of the system around plumbline (a file or folder missing, not
 * writable, a full disk): Node's errors with a code and the call that failed.
 * It is the user's to fix, like a usage error, not a fault to report.
 */
function isSystemError(error: unknown): error is NodeJS.ErrnoException {
  return error instanceof Error && typeof (error as NodeJS.ErrnoException).code === 'string' && typeof (error as NodeJS.ErrnoException).syscall === 'string';
}

/**
 * What the user reads when plumbline itself fails (exit code 70): that it is
 * a fault in plumbline, what to report and where to find the details.
 */
export function internalFaultMessage(error: unknown): string {
  const details = error instanceof Error ? (error.stack ?? `${error.name}: ${error.message}`) : String(error);
  return (
    `plumbline: internal error: ${error instanceof Error ? error.message : String(error)}\n` +
    `This is a fault in plumbline ${toolVersion()}, not in your documents or settings. Please report it, with the command ` +
    'you ran, the details below and, if you can share it, the document it stopped on (or its format, size and where it came from).\n' +
    `${details}\n`
  );
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
      // --help and --version end here with exit code 0; commander has already printed the message.
      return error.exitCode === 0 ? EXIT_CLEAN : EXIT_INPUT_ERROR;
    }
    if (error instanceof UsageError || error instanceof ConfigError || error instanceof CatalogueError || isSystemError(error)) {
      // The message may name a file or quote a settings file: its control characters are shown, not obeyed (line breaks separate messages).
      io.stderr(`plumbline: ${visibleControls(error.message, '\n')}\n`);
      return EXIT_INPUT_ERROR;
    }
    io.stderr(internalFaultMessage(error));
    return EXIT_INTERNAL_FAULT;
  }
}
