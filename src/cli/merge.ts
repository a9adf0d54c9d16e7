import type { Command } from 'commander';
import { buildReport } from '../report/build.js';
import { mergeByPath } from '../batch/entry.js';
import { JsonLinesError, readJsonLines } from '../batch/jsonLines.js';
import { resolveLimits } from '../limits.js';
import { addCommonOptions, exitCodeFor, limitOption, limitsFrom, UsageError, userConfigFrom, writeReport, type CliIo, type CommonOptions } from './common.js';

export function registerMergeCommand(program: Command, io: CliIo, setExitCode: (code: number) => void): void {
  addCommonOptions(
    program
      .command('merge')
      .description('join the JSON Lines outputs of several scans (for example shards) into one report')
      .argument('<files...>', 'JSON Lines files written by scan --jsonl'),
  )
    .option('--all', 'list results without findings too (text format)')
    .addOption(limitOption('change a limit (maxSecondsPerDocument: the time budget of reading and checking one record)'))
    .action(async (files: string[], options: CommonOptions & { all?: boolean; limit?: string[] }) => {
      const { userConfig } = await userConfigFrom(options);
      const { maxSecondsPerDocument } = resolveLimits(limitsFrom(userConfig.limits, options));
      const perFile = await Promise.all(files.map(async (file) => {
        try {
          const { documents, cutOff } = await readJsonLines(file, { maxSecondsPerRecord: maxSecondsPerDocument });
          if (cutOff) {
            // Not an error: the lines before it are whole. The document is missing from the merge, so say which line.
            io.stderr(`plumbline: ${file}: line ${cutOff.line} was cut off mid-line (an interrupted write) and is left out; scan --resume audits its document again\n`);
          }
          return documents;
        } catch (error) {
          const code = (error as NodeJS.ErrnoException).code;
          if (code === 'ENOENT') throw new UsageError(`${file}: file not found`);
          if (code) throw new UsageError(`${file}: cannot read the file (${code})`);
          if (error instanceof JsonLinesError) throw new UsageError(error.message);
          throw error;
        }
      }));
      const report = buildReport(mergeByPath(perFile.flat()));
      await writeReport(report, options, io, options.all ?? false);
      setExitCode(exitCodeFor(report.summary, options.failOn));
    });
}
