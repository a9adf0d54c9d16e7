/**
 * The refit as the page runs it, without a server: the text of the chosen
 * CSV/TSV file, the model and options of the tab, and the pasted table go
 * through the same code as `plumbline refit <file> --model ... --format
 * text --reported <pasted table saved as reported-table.md>` (buildSpec,
 * refitOutputOf, formatRefitText), so the page shows what the command would
 * print. An XLSX file's bytes are read here too, within the command's
 * limits and with its messages (src/refit/xlsxBytes.ts), so neither kind of
 * file is sent anywhere, served or opened from disk.
 */
import { buildSpec, type RefitOptions } from '../../cli/refitSpec.js';
import { UsageError } from '../../cli/usageError.js';
import { plainTextDocument } from '../../documents/text.js';
import { visibleControls } from '../../report/visible.js';
import { RefitError } from '../../refit/errors.js';
import { formatRefitText } from '../../refit/format.js';
import { reportedInDocument } from '../../refit/reportedTable.js';
import { refitErrorMessage, refitOutputOf, termMapOf } from '../../refit/run.js';

export interface PageRefitRequest {
  /** The chosen file's name (.csv, .tsv, .txt or .xlsx). */
  name: string;
  /** The file's text (CSV, TSV, TXT). */
  text?: string;
  /** The file's bytes (XLSX). */
  xlsx?: Uint8Array;
  model: string;
  /** Sums-of-squares type: "1", "2" or "3". */
  type: string;
  /** Numeric columns that are factors, separated by commas, semicolons or line breaks. */
  factors: string;
  /** Missing-value codes, "column=codes" separated by semicolons or line breaks. */
  missing: string;
  /** The pasted table or manuscript text; empty when nothing is reported. */
  reported: string;
}

/** Exit code, standard output and standard error, as the command would give them. */
export interface PageRefitAnswer {
  exitCode: number;
  output: string;
  errors: string;
}

/** The name under which the pasted table is read, as `plumbline web`'s server saved it. */
export const PASTED_TABLE_NAME = 'reported-table.md';

const TEXT_DATA = /\.(?:csv|tsv|txt)$/i;
const XLSX_DATA = /\.xlsx$/i;

export function isTextDataName(name: string): boolean {
  return TEXT_DATA.test(name);
}

export function isXlsxDataName(name: string): boolean {
  return XLSX_DATA.test(name);
}

/** The data source of a request: the text of a delimited file, or the bytes of an .xlsx file. */
function dataOf(request: PageRefitRequest): { name: string; text: string } | { name: string; xlsx: Uint8Array } {
  if (isXlsxDataName(request.name) && request.xlsx !== undefined) return { name: request.name, xlsx: request.xlsx };
  if (isTextDataName(request.name) && request.text !== undefined) return { name: request.name, text: request.text };
  throw new UsageError(`${request.name}: the page reads CSV, TSV, TXT or XLSX data; save the sheet as .xlsx or .csv`);
}

function splitList(text: string, separators: RegExp): string[] {
  return text
    .split(separators)
    .map((item) => item.trim())
    .filter((item) => item !== '');
}

/** What the tab's fields mean as options of the refit command. */
export function refitOptionsOf(request: PageRefitRequest): RefitOptions {
  return {
    model: request.model,
    type: request.type,
    factor: splitList(request.factors, /[;,\n]/),
    covariate: [],
    missing: splitList(request.missing, /[;\n]/),
    map: [],
    format: 'text',
  };
}

/** Runs the refit in the page; errors are shown as the command shows them (exit code 2). */
export async function refitInPage(request: PageRefitRequest): Promise<PageRefitAnswer> {
  try {
    const data = dataOf(request);
    if (!['1', '2', '3'].includes(request.type)) throw new UsageError(`the sums-of-squares type must be 1, 2 or 3, not "${request.type}"`);
    const spec = buildSpec(refitOptionsOf(request));
    const map = termMapOf(spec, []);
    const pasted = request.reported;
    const output = await refitOutputOf(data, spec, {
      dataName: request.name,
      slopesByDefault: true,
      map,
      ...(pasted.trim() !== ''
        ? { readReported: async (terms) => reportedInDocument(PASTED_TABLE_NAME, plainTextDocument(PASTED_TABLE_NAME, 'markdown', pasted), terms, map) }
        : {}),
    });
    return { exitCode: output.verdict === 'differs' ? 1 : 0, output: formatRefitText(output, { color: false }), errors: '' };
  } catch (error) {
    const message = error instanceof RefitError ? refitErrorMessage(error) : error instanceof UsageError ? error.message : null;
    if (message === null) throw error;
    return { exitCode: 2, output: '', errors: `plumbline: ${visibleControls(message, '\n')}\n` };
  }
}
