import { existsSync } from 'node:fs';
import { extname } from 'node:path';
import { Option, type Command } from 'commander';
import { notRegularFileReason, readSmallRegularFileSync } from '../documents/regularFile.js';
import { EXIT_CLEAN, EXIT_FLAGGED, UsageError, type CliIo } from './common.js';

/**
 * `plumbline cells <file>`: a factorial design's printed cell statistics
 * (CSV, TSV or JSON) -> the ANOVA table under SS types I, II and III with
 * intervals over the rounding, and which type reproduces each reported F.
 *
 * Exit codes: 0 when every reported effect is reproduced by some type (or
 * none is reported, or the ns were assumed: then a miss is a warning), 1
 * when one is not, 2 for usage and input errors.
 */

interface CellsOptions {
  reported: string[];
  cellN?: string;
  format: 'text' | 'json';
}

/** A file of cell statistics is a few lines; anything near this size is not one. */
const MAX_FILE_BYTES = 1_000_000;

const collect = (value: string, previous: string[]): string[] => [...previous, value];

export function registerCellsCommand(program: Command, io: CliIo, setExitCode: (code: number) => void): void {
  program
    .command('cells')
    .description('recompute a two- or three-factor between-subjects ANOVA (SS types I, II, III) from printed cell means, SDs and ns, and say which type reproduces each reported F')
    .argument('<file>', 'the cell statistics: CSV or TSV (factor columns, n, mean, sd) or JSON')
    .option('--reported <effect>', 'a reported effect: "dose x time: F(1, 84) = 5.23, p = .025, pes = .06" (repeatable)', collect, [])
    .option('--cell-n <n>', 'the n of every cell, when the file gives none (equal ns are then assumed)')
    .addOption(new Option('-f, --format <format>', 'output format').choices(['text', 'json']).default('text'))
    .action(async (file: string, options: CellsOptions) => {
      setExitCode(await runCellsCommand(file, options, io));
    });
}

async function runCellsCommand(file: string, options: CellsOptions, io: CliIo): Promise<number> {
  const { CellsInputError, parseCellsCsv, parseCellsJson, parseReportedEffect } = await import('./cellsInput.js');
  const { analyseCells, formatCellsText } = await import('./cellsReport.js');
  if (!existsSync(file)) throw new UsageError(`${file}: no such file`);
  // A FIFO or a device named as the file would wait for ever or never end: only regular files are read.
  const notRegular = await notRegularFileReason(file);
  if (notRegular !== null) throw new UsageError(`${file}: ${notRegular}`);
  let cellN: number | undefined;
  if (options.cellN !== undefined) {
    if (!/^\d+$/.test(options.cellN) || Number(options.cellN) < 1) throw new UsageError(`--cell-n ${options.cellN}: a whole number of at least 1 is needed`);
    cellN = Number(options.cellN);
  }
  try {
    const text = readSmallRegularFileSync(file, MAX_FILE_BYTES);
    if (text === null) throw new CellsInputError(`${file}: cannot be read, or is larger than ${MAX_FILE_BYTES / 1_000_000} MB (a table of cell statistics is a few KB)`);
    const input = extname(file).toLowerCase() === '.json' ? parseCellsJson(text, file) : parseCellsCsv(text, file);
    input.reported.push(...options.reported.map((entry, index) => parseReportedEffect(entry, `--reported ${index + 1}`)));
    const output = analyseCells(input, file, cellN === undefined ? {} : { cellN });
    io.stdout(options.format === 'json' ? `${JSON.stringify(output, null, 2)}\n` : formatCellsText(output));
    return output.reported.some((check) => check.severity === 'fail') ? EXIT_FLAGGED : EXIT_CLEAN;
  } catch (error) {
    if (error instanceof CellsInputError) throw new UsageError(error.message);
    throw error;
  }
}
