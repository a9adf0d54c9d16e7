import { existsSync } from 'node:fs';
import { mkdir, writeFile } from 'node:fs/promises';
import { basename, dirname } from 'node:path';
import { notRegularFileReason } from '../documents/regularFile.js';
import { RefitError } from '../refit/errors.js';
import { formatRefitHtml, formatRefitMarkdown, formatRefitText } from '../refit/format.js';
import { readReportedWithinBudget } from '../refit/readReportedWithinBudget.js';
import { refitErrorMessage, refitOutputOf, termMapOf } from '../refit/run.js';
import { EXIT_CLEAN, EXIT_FLAGGED, limitsFrom, UsageError, type CliIo } from './common.js';
import { buildSpec, type RefitOptions } from './refitSpec.js';

export { buildSpec, parseContrastOption, type RefitOptions } from './refitSpec.js';
export { refitErrorMessage } from '../refit/run.js';

/**
 * `plumbline refit <data> --model "<formula>"`: rebuilds the ANOVA/ANCOVA
 * table from raw data, compares it with the reported numbers (--reported)
 * and names the usual slips that reproduce them.
 *
 * Exit codes: 0 when every reported number matches (or none is reported),
 * 1 when something differs, 2 for usage and input errors.
 */

async function runRefit(dataFile: string, options: RefitOptions, io: CliIo): Promise<number> {
  if (options.format === 'docx' && options.output === undefined) throw new UsageError('--format docx writes a Word file: give it with --output <file.docx>');
  if (!existsSync(dataFile)) throw new UsageError(`${dataFile}: no such data file`);
  if (options.reported !== undefined && !existsSync(options.reported)) throw new UsageError(`--reported ${options.reported}: no such file`);
  // A FIFO or a device named as data, description or report would wait for ever or never end: only regular files are read.
  for (const [label, path] of [['', dataFile], ['--spec ', options.spec], ['--reported ', options.reported]] as const) {
    const reason = path === undefined ? null : await notRegularFileReason(path);
    if (reason !== null) throw new UsageError(`${label}${path}: ${reason}`);
  }
  const spec = buildSpec(options);
  const map = termMapOf(spec, options.map);
  // Limits on reading the reported manuscript (its size, DOCX and PDF bounds, its time budget); refit takes no settings file.
  const limits = limitsFrom(undefined, options);
  const reportedPath = options.reported;
  const output = await refitOutputOf(dataFile, spec, {
    dataName: dataFile,
    slopesByDefault: options.format === 'text',
    map,
    ...(reportedPath !== undefined ? { readReported: (terms) => readReportedWithinBudget(reportedPath, terms, map, limits ? { limits } : {}) } : {}),
  });

  let text: string | Buffer;
  switch (options.format) {
    case 'json':
      text = `${JSON.stringify(output, null, 2)}\n`;
      break;
    case 'md':
      text = formatRefitMarkdown(output);
      break;
    case 'html':
      text = formatRefitHtml(output);
      break;
    case 'docx': {
      const { formatRefitDocx } = await import('../refit/formatDocx.js');
      text = await formatRefitDocx(output);
      break;
    }
    default:
      text = formatRefitText(output, { color: io.color && options.output === undefined });
  }
  if (options.output !== undefined) {
    await mkdir(dirname(options.output), { recursive: true });
    await writeFile(options.output, text);
    io.stderr(`plumbline refit: wrote ${options.output} (${options.format})\n`);
  } else {
    io.stdout(typeof text === 'string' ? text : text.toString('utf8'));
  }
  return output.verdict === 'differs' ? EXIT_FLAGGED : EXIT_CLEAN;
}

/** Name of the data file as shown in messages. */
export function dataName(path: string): string {
  return basename(path);
}

/** The refit command's work, loaded only when the command runs (it brings the data readers and the model). */
export async function runRefitCommand(dataFile: string, options: RefitOptions, io: CliIo): Promise<number> {
  try {
    return await runRefit(dataFile, options, io);
  } catch (error) {
    if (error instanceof RefitError) throw new UsageError(refitErrorMessage(error));
    throw error;
  }
}
