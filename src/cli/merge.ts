import type { Command } from 'commander';
import { buildReport } from '../report/build.js';
import { mergeByPath } from '../batch/entry.js';
import { readJsonLines } from '../batch/jsonLines.js';
import { addCommonOptions, exitCodeFor, UsageError, writeReport, type CliIo, type CommonOptions } from './common.js';

export function registerMergeCommand(program: Command, io: CliIo, setExitCode: (code: number) => void): void {
  addCommonOptions(
    program
      .command('merge')
      .description('join the JSON Lines outputs of several scans (for example shards) into one report')
      .argument('<files...>', 'JSON Lines files written by scan --jsonl'),
  )
    .option('--all', 'list results without findings too (text format)')
    .action(async (files: string[], options: CommonOptions & { all?: boolean }) => {
      const perFile = await Promise.all(files.map(async (file) => {
        try {
          return await readJsonLines(file);
        } catch (error) {
          const code = (error as NodeJS.ErrnoException).code;
          throw new UsageError(code === 'ENOENT' ? `${file}: file not found` : (error as Error).message);
        }
      }));
      const report = buildReport(mergeByPath(perFile.flat()));
      await writeReport(report, options, io, options.all ?? false);
      setExitCode(exitCodeFor(report.summary, options.failOn));
    });
}
