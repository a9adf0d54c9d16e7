import type { Command } from 'commander';
import { entryOf, type AuditEntry } from '../batch/entry.js';
import { JsonLinesError } from '../batch/jsonLines.js';
import { indexRecords, mergedDocuments, type MergeIndex } from '../batch/mergeRecords.js';
import { resolveLimits } from '../limits.js';
import { reportHead } from '../report/build.js';
import { JSON_LAYOUT } from '../report/jsonLayout.js';
import type { DocumentOutput, StreamedReport } from '../report/model.js';
import {
  addCommonOptions,
  exitCodeFor,
  htmlPiecesOf,
  limitOption,
  limitsFrom,
  UsageError,
  userConfigFrom,
  writeJsonReportOf,
  writePieces,
  type CliIo,
  type CommonOptions,
} from './common.js';

/** An error reading the JSON Lines files as the user's error it is (exit code 2), naming the file; other errors pass. */
function usageErrorOf(error: unknown): unknown {
  if (error instanceof JsonLinesError) return new UsageError(error.message);
  const code = (error as NodeJS.ErrnoException).code;
  const where = (error as NodeJS.ErrnoException).path ?? 'a JSON Lines file';
  if (code === 'ENOENT') return new UsageError(`${where}: file not found`);
  if (code) return new UsageError(`${where}: cannot read the file (${code})`);
  return error;
}

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
      let index: MergeIndex;
      try {
        index = await indexRecords(
          files,
          { maxSecondsPerRecord: maxSecondsPerDocument },
          (file, line) =>
            // Not an error: the lines before it are whole. The document is missing from the merge, so say which line.
            io.stderr(`plumbline: ${file}: line ${line} was cut off mid-line (an interrupted write) and is left out; scan --resume audits its document again\n`),
        );
      } catch (error) {
        throw usageErrorOf(error);
      }
      const { documentFromJson, documentRecordSchema } = await import('../report/jsonLayoutSchema.js');
      const parseRecord = (text: string): DocumentOutput | null => {
        try {
          const read = documentFromJson(JSON.parse(text));
          return read.ok ? read.document : null;
        } catch {
          return null;
        }
      };
      /**
       * A record as its JSON for the JSON formats: one of the layout written (layout 2) is checked and passed
       * on as it is, without reading it into the model and writing it again (a third of a merge's time); one of
       * layout 1 is read into the model and written in layout 2.
       */
      const recordJson = (text: string): Pick<AuditEntry, 'path' | 'body'> | null => {
        try {
          const value = JSON.parse(text) as { layout?: unknown; path?: unknown };
          if (value.layout !== JSON_LAYOUT) {
            const read = documentFromJson(value);
            return read.ok ? entryOf(read.document) : null;
          }
          return documentRecordSchema.safeParse(value).success ? { path: value.path as string, body: JSON.stringify({ ...value, path: undefined }) } : null;
        } catch {
          return null;
        }
      };
      try {
        if (options.format === 'json' || options.format === 'jsonl') {
          // Streamed: each document is read back, written and let go (the summary came from the first pass).
          writeJsonReportOf(options.format, index.summary, mergedDocuments(index, recordJson), options.output, io);
        } else {
          // Streamed like JSON: the summary came from the first pass, and each document is read back from its
          // file when its piece is written (the Markdown summary reads them three times, once per section; the
          // HTML page once, its script ranking and counting them in the browser).
          const report: StreamedReport = { caution: reportHead().caution, summary: index.summary, documents: () => mergedDocuments(index, parseRecord) };
          const color = options.output === undefined && io.color;
          const pieces =
            options.format === 'html'
              ? await htmlPiecesOf(report)
              : options.format === 'csv'
              ? (await import('../report/csv.js')).csvPieces(report)
              : options.format === 'md'
                ? (await import('../report/markdown.js')).markdownPieces(report)
                : (await import('../report/console.js')).consolePieces(report, { color, showAll: options.all ?? false });
          writePieces(pieces, options.output, io);
        }
      } catch (error) {
        // A record no longer where the first pass found it; errors writing the report pass as they are.
        throw error instanceof JsonLinesError ? new UsageError(error.message) : error;
      }
      setExitCode(exitCodeFor(index.summary, options.failOn));
    });
}
