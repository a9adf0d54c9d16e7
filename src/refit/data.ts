import type { FileHandle } from 'node:fs/promises';
import { basename, extname } from 'node:path';
import Papa from 'papaparse';
import { openRegularFile } from '../documents/regularFile.js';
import { xlsxLimits } from '../limits.js';
import { RefitError, closestNames } from './errors.js';
import { LineEndingsToLf, lineEndingsToLf } from './lineEndings.js';
import { ShiftedColumn, parseCellNumber } from './numeric.js';
import { isMissingCode, type MissingRule, type ResolvedSpec } from './spec.js';
import { readXlsxSheet } from './xlsx.js';
import { readXlsxBytes } from './xlsxBytes.js';

/**
 * Reading raw data: CSV/TSV (papaparse, streamed in chunks; the delimiter is
 * detected from the header line among comma, semicolon and tab) and .xlsx
 * (read-excel-file, first sheet). Rows reach a consumer in batches of text
 * cells; nothing keeps every row in memory.
 *
 * Interpretation of the model's columns (ModelFrameReader): text columns are
 * factors, numeric columns covariates unless declared factors; empty cells,
 * "NA" and the column's missing-value codes are missing; rows with a missing
 * value in any model variable are dropped and counted. Errors name the file,
 * the row (the header line is row 1) and the column.
 */

export type CellInput = string | number | boolean | Date | null | undefined;

/** A table already in memory (tests, callers that read data themselves). */
export interface InMemoryTable {
  /** Shown in error messages in place of a file name. */
  name?: string;
  header: string[];
  rows: Iterable<readonly CellInput[]>;
}

/**
 * The text of a CSV/TSV file already read (the web page, which has the
 * user's chosen file but no path): read exactly as the file would be.
 */
export interface DelimitedText {
  /** The file's name, shown in messages and the report. */
  name: string;
  text: string;
}

/**
 * The bytes of an .xlsx file already read (the web page): its first sheet
 * is read within the same limits as a file on disk (xlsxBytes.ts).
 */
export interface XlsxBytes {
  /** The file's name, shown in messages and the report. */
  name: string;
  xlsx: Uint8Array;
}

/** A path to a .csv, .tsv, .txt or .xlsx file, the text of a CSV/TSV file, the bytes of an .xlsx file, or a table in memory. */
export type DataSource = string | DelimitedText | XlsxBytes | InMemoryTable;

/** Whether a source is the text of a delimited file rather than a path or a table. */
export function isDelimitedText(source: DataSource): source is DelimitedText {
  return typeof source !== 'string' && 'text' in source;
}

export interface RowConsumer {
  header(names: string[], file: string, options: { decimalComma: boolean }): void;
  /** `firstRow` is the row number of batch[0] (the header line is row 1). */
  rows(batch: readonly (readonly string[])[], firstRow: number): void;
  end(): void;
}

export type Delimiter = ',' | ';' | '\t';

/** Picks the most frequent of comma, semicolon and tab outside double quotes in the header line (comma on a tie or none). */
export function detectDelimiter(headerLine: string): Delimiter {
  const counts = { ',': 0, ';': 0, '\t': 0 };
  let quoted = false;
  for (const ch of headerLine) {
    if (ch === '"') quoted = !quoted;
    else if (!quoted && (ch === ',' || ch === ';' || ch === '\t')) counts[ch]++;
  }
  let best: Delimiter = ',';
  for (const d of ['\t', ';'] as const) if (counts[d] > counts[best]) best = d;
  return best;
}

function cellText(value: CellInput): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'string') return value;
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  if (typeof value === 'boolean') return value ? 'TRUE' : 'FALSE';
  return value.toISOString();
}

async function firstLine(handle: FileHandle): Promise<string> {
  const buffer = Buffer.alloc(65536);
  const { bytesRead } = await handle.read(buffer, 0, buffer.length, 0);
  const text = buffer.subarray(0, bytesRead).toString('utf8').replace(/^\uFEFF/, '');
  const nl = text.search(/[\r\n]/); // CRLF, LF or a lone CR (lineEndings.ts)
  return nl < 0 ? text : text.slice(0, nl);
}

function unreadable(file: string, err: unknown): RefitError {
  const reason = err instanceof Error ? err.message : String(err);
  return new RefitError('UNREADABLE_FILE', `${file}: cannot be read (${reason}).`, { file });
}

/**
 * A cell without the white space around it (spaces, tabs, a stray CR,
 * no-break spaces), so " a", "a " and "a" are one level and " " is empty.
 * Most cells have none: the ends are looked at before anything is copied.
 */
export function trimCell(text: string): string {
  if (text.length === 0) return text;
  const first = text.charCodeAt(0);
  const last = text.charCodeAt(text.length - 1);
  // Code units up to 32 are ASCII white space and controls; above 127 may be Unicode white space.
  return first <= 32 || last <= 32 || first > 127 || last > 127 ? text.trim() : text;
}

function isBlank(row: readonly string[]): boolean {
  return row.length === 0 || (row.length === 1 && row[0]!.trim() === '');
}

async function streamDelimited(path: string, consumer: RowConsumer): Promise<void> {
  const file = basename(path);
  // Only a regular file: /dev/zero named as data would stream for ever, a FIFO would wait for ever (src/documents/regularFile.ts).
  let handle: FileHandle;
  try {
    const opened = await openRegularFile(path);
    if (!opened.ok) throw new RefitError('UNREADABLE_FILE', `${file}: ${opened.error}.`, { file });
    handle = opened.handle;
  } catch (err) {
    throw err instanceof RefitError ? err : unreadable(file, err);
  }
  let line: string;
  try {
    line = await firstLine(handle);
  } catch (err) {
    await handle.close();
    throw unreadable(file, err);
  }
  if (line.trim() === '') {
    await handle.close();
    throw new RefitError('EMPTY_FILE', `${file}: the file is empty (no header line).`, { file });
  }
  await parseDelimited(file, line, consumer, (parse, fail) => {
    // The stream closes the handle when it ends, fails or is destroyed.
    const stream = handle.createReadStream({ start: 0, encoding: 'utf8', highWaterMark: 1 << 17 });
    stream.on('error', (err) => fail(unreadable(file, err)));
    parse(stream.pipe(new LineEndingsToLf()) as unknown as File);
    // Once parsing stopped (at the end, or aborted on a bad row), the file is closed, not left to the garbage collector.
    return () => stream.destroy();
  });
}

/** The text of a CSV/TSV file read as streamDelimited reads the file: same delimiter, line endings, rows and messages. */
async function streamDelimitedText(source: DelimitedText, consumer: RowConsumer): Promise<void> {
  const file = basename(source.name);
  const text = source.text.replace(/^\uFEFF/, '');
  const nl = text.search(/[\r\n]/);
  const line = nl < 0 ? text : text.slice(0, nl);
  if (line.trim() === '') throw new RefitError('EMPTY_FILE', `${file}: the file is empty (no header line).`, { file });
  await parseDelimited(file, line, consumer, (parse) => {
    parse(lineEndingsToLf(text, false).text + (text.endsWith('\r') ? '\n' : ''));
    return () => {};
  });
}

/**
 * Parses delimited text with papaparse, handing the consumer the header and
 * batches of rows. `start` gives papaparse its input (a stream or a string)
 * and returns how to stop reading once parsing has stopped.
 */
async function parseDelimited(
  file: string,
  headerLine: string,
  consumer: RowConsumer,
  start: (parse: (input: string | File) => void, fail: (error: unknown) => void) => () => void,
): Promise<void> {
  const delimiter = detectDelimiter(headerLine);
  let nextRow = 1; // row number of the next record (header = 1)
  let sawHeader = false;
  let failure: unknown;
  let closeInput = (): void => {};
  try {
    await new Promise<void>((resolve, reject) => {
      closeInput = start((input) => {
        Papa.parse<string[]>(input as File, {
          delimiter,
          newline: '\n',
          quoteChar: '"',
          header: false,
          dynamicTyping: false,
          chunk: (results, parser) => {
            if (failure !== undefined) return;
            try {
              let data = results.data;
              const first = nextRow;
              nextRow += data.length;
              if (!sawHeader) {
                if (data.length === 0) return;
                const names = data[0]!.map((n, i) => (i === 0 ? n.replace(/^\uFEFF/, '') : n).trim());
                consumer.header(names, file, { decimalComma: delimiter === ';' });
                sawHeader = true;
                data = data.slice(1);
                consumer.rows(data, first + 1);
              } else {
                consumer.rows(data, first);
              }
            } catch (err) {
              failure = err;
              parser.abort();
            }
          },
          complete: () => resolve(),
          error: (err) => reject(unreadable(file, err)),
        });
      }, reject);
    });
  } finally {
    closeInput();
  }
  if (failure !== undefined) throw failure;
  if (!sawHeader) throw new RefitError('EMPTY_FILE', `${file}: the file is empty (no header line).`, { file });
  consumer.end();
}

/** Whether a source is the bytes of an .xlsx file. */
export function isXlsxBytes(source: DataSource): source is XlsxBytes {
  return typeof source !== 'string' && 'xlsx' in source;
}

async function streamXlsx(path: string, consumer: RowConsumer): Promise<void> {
  const file = basename(path);
  streamSheet(file, await readXlsxSheet(path, file, xlsxLimits), consumer);
}

async function streamXlsxBytes(source: XlsxBytes, consumer: RowConsumer): Promise<void> {
  streamSheet(source.name, await readXlsxBytes(source.xlsx, source.name, xlsxLimits), consumer);
}

/** A sheet's rows to a consumer: the header row, then the body from row 2. */
function streamSheet(file: string, sheet: readonly unknown[][], consumer: RowConsumer): void {
  const rows = sheet.map((r) => r.map((c) => cellText(c as CellInput)));
  // Trailing empty columns that only pad the sheet are not columns.
  const header = rows[0];
  if (!header || header.every((h) => h.trim() === '')) {
    throw new RefitError('EMPTY_FILE', `${file}: the first sheet is empty (no header row).`, { file });
  }
  let width = header.length;
  while (width > 0 && header[width - 1]!.trim() === '') width--;
  consumer.header(header.slice(0, width).map((h) => h.trim()), file, { decimalComma: false });
  const body = rows.slice(1).map((r) => {
    const extra = r.slice(width).some((c) => c.trim() !== '');
    return extra ? r : r.slice(0, width);
  });
  consumer.rows(body, 2);
  consumer.end();
}

function streamMemory(table: InMemoryTable, consumer: RowConsumer): void {
  const file = table.name ?? '(data in memory)';
  if (table.header.length === 0) throw new RefitError('EMPTY_FILE', `${file}: the table has no columns.`, { file });
  consumer.header(table.header.map((h) => h.trim()), file, { decimalComma: false });
  let batch: string[][] = [];
  let first = 2;
  let next = 2;
  for (const row of table.rows) {
    batch.push(row.map(cellText));
    next++;
    if (batch.length === 4096) {
      consumer.rows(batch, first);
      batch = [];
      first = next;
    }
  }
  consumer.rows(batch, first);
  consumer.end();
}

/** Streams the rows of a data source to a consumer. */
export async function streamRows(source: DataSource, consumer: RowConsumer): Promise<void> {
  if (isDelimitedText(source)) return streamDelimitedText(source, consumer);
  if (isXlsxBytes(source)) return streamXlsxBytes(source, consumer);
  if (typeof source !== 'string') {
    streamMemory(source, consumer);
    return;
  }
  const ext = extname(source).toLowerCase();
  if (ext === '.xlsx') return streamXlsx(source, consumer);
  if (ext === '.xls') {
    throw new RefitError('UNREADABLE_FILE', `${basename(source)}: the old .xls format is not supported; save the sheet as .xlsx or .csv.`, {
      file: basename(source),
    });
  }
  return streamDelimited(source, consumer);
}

// ---------------------------------------------------------------------------
// Interpreting the model's columns
// ---------------------------------------------------------------------------

export type VariableKind = 'factor' | 'numeric';

/** One model variable as read from the data. */
export interface VariableInfo {
  name: string;
  kind: VariableKind;
  /** Factor levels (text codes) in analysis order; empty for numeric variables. */
  levels: string[];
  /** Display labels by level code (from the analysis description). */
  labels: ReadonlyMap<string, string>;
  /** Numeric variables: the origin their deltas are measured from. */
  origin: number;
  /** Factors: true when the user declared the levels (an empty declared level is then an error, not dropped). */
  declaredLevels: boolean;
  /** Numeric variables: up to 11 distinct values seen (analysed or not), and whether all were whole numbers. */
  distinct: readonly number[];
  wholeNumbers: boolean;
  /** Declared by the user as a covariate (or the outcome): no note that it could be a factor. */
  declaredNumeric: boolean;
}

/** Cells of a numeric column outside its declared range. */
export interface OutOfRange {
  column: string;
  low: number;
  high: number;
  count: number;
  /** Up to 10 row numbers (the header is row 1). */
  rows: number[];
  /** The values outside, each with its count (the most frequent first). */
  values: Array<{ value: string; count: number }>;
}

/** Natural, case-insensitive order of level codes: "item2" before "item10", "apple" before "Banana" (code points break ties). */
export function naturalCompare(a: string, b: string): number {
  const x = a.toLowerCase();
  const y = b.toLowerCase();
  let i = 0;
  let j = 0;
  while (i < x.length && j < y.length) {
    const cx = x.charCodeAt(i);
    const cy = y.charCodeAt(j);
    const dx = cx >= 48 && cx <= 57;
    const dy = cy >= 48 && cy <= 57;
    if (dx && dy) {
      let ei = i;
      while (ei < x.length && x.charCodeAt(ei) >= 48 && x.charCodeAt(ei) <= 57) ei++;
      let ej = j;
      while (ej < y.length && y.charCodeAt(ej) >= 48 && y.charCodeAt(ej) <= 57) ej++;
      const nx = x.slice(i, ei).replace(/^0+(?=\d)/, '');
      const ny = y.slice(j, ej).replace(/^0+(?=\d)/, '');
      if (nx.length !== ny.length) return nx.length - ny.length;
      if (nx !== ny) return nx < ny ? -1 : 1;
      i = ei;
      j = ej;
      continue;
    }
    if (cx !== cy) return cx - cy;
    i++;
    j++;
  }
  if (x.length - i !== y.length - j) return x.length - i - (y.length - j);
  return a < b ? -1 : a > b ? 1 : 0;
}

/** Receives complete rows: factor level indices (order of first appearance) and numeric deltas. */
export interface CompleteRowSink {
  start(variables: readonly VariableReader[]): void;
  add(levelIndex: Int32Array, deltas: Float64Array): void;
}

export class VariableReader {
  kind: VariableKind | undefined;
  column = -1;
  readonly shifted = new ShiftedColumn();
  /** Level text -> index in order of first appearance (or declared order). */
  readonly levelIndex = new Map<string, number>();
  readonly levelTexts: string[] = [];
  private readonly numericLevel = new Map<number, number>();
  /** Index of this variable among factors or among numerics, set when the sink starts. */
  slot = -1;
  /** Numeric variables: distinct values seen (up to 11) and whether all were whole numbers. */
  readonly distinct = new Set<number>();
  wholeNumbers = true;
  /** Cells outside the declared range: count, first rows and values. */
  outside: { count: number; rows: number[]; values: Map<string, number> } = { count: 0, rows: [], values: new Map() };

  constructor(
    readonly name: string,
    declared: VariableKind | undefined,
    readonly declaredLevels: string[] | undefined,
    readonly missing: MissingRule | undefined,
    readonly labels: ReadonlyMap<string, string>,
    readonly range?: readonly [number, number],
  ) {
    this.kind = declared;
    if (declaredLevels) {
      for (const level of declaredLevels) this.addLevel(level);
    }
  }

  private addLevel(text: string): number {
    const idx = this.levelTexts.length;
    this.levelIndex.set(text, idx);
    this.levelTexts.push(text);
    const n = parseCellNumber(text);
    if (!Number.isNaN(n) && !this.numericLevel.has(n)) this.numericLevel.set(n, idx);
    return idx;
  }

  /** Level index for a factor cell, adding new levels unless levels were declared (-1: not a declared level). */
  level(text: string): number {
    const hit = this.levelIndex.get(text);
    if (hit !== undefined) return hit;
    const n = parseCellNumber(text);
    if (!Number.isNaN(n)) {
      const byNumber = this.numericLevel.get(n);
      if (byNumber !== undefined) {
        this.levelIndex.set(text, byNumber);
        return byNumber;
      }
    }
    if (this.declaredLevels) return -1;
    return this.addLevel(text);
  }

  /** Counts a numeric cell's value: distinct values, whole numbers, and cells outside the declared range. */
  noteValue(value: number, text: string, row: number): void {
    if (this.distinct.size <= 10) this.distinct.add(value);
    if (!Number.isInteger(value)) this.wholeNumbers = false;
    if (this.range !== undefined && (value < this.range[0] || value > this.range[1])) {
      const o = this.outside;
      o.count++;
      if (o.rows.length < 10) o.rows.push(row);
      if (o.values.size < 50 || o.values.has(text)) o.values.set(text, (o.values.get(text) ?? 0) + 1);
    }
  }

  /** Final level order: declared order, else numeric order when every level is a number, else natural case-insensitive order. */
  orderedLevels(): { levels: string[]; remap: Int32Array } {
    const texts = this.levelTexts;
    let order = texts.map((_, i) => i);
    if (!this.declaredLevels) {
      const nums = texts.map((t) => parseCellNumber(t));
      const allNumeric = nums.every((v) => !Number.isNaN(v));
      order.sort((a, b) => (allNumeric ? nums[a]! - nums[b]! : naturalCompare(texts[a]!, texts[b]!)));
    }
    const remap = new Int32Array(texts.length);
    order.forEach((oldIdx, newIdx) => (remap[oldIdx] = newIdx));
    order = order.slice();
    return { levels: order.map((i) => texts[i]!), remap };
  }
}

interface FrameOptions {
  spec: ResolvedSpec;
  sink: CompleteRowSink;
}

/** Column-resolution and per-cell interpretation of the model's variables. */
export class ModelFrameReader implements RowConsumer {
  file = '';
  readonly variables: VariableReader[] = [];
  droppedRows = 0;
  usedRows = 0;
  private header_: string[] = [];
  private decimalComma = false;
  private started = false;
  private factors: VariableReader[] = [];
  private numerics: VariableReader[] = [];
  private levelBuf = new Int32Array(0);
  private deltaBuf = new Float64Array(0);

  constructor(private readonly options: FrameOptions) {}

  header(names: string[], file: string, opts: { decimalComma: boolean }): void {
    this.file = file;
    this.decimalComma = opts.decimalComma;
    const { spec } = this.options;
    const renamed = names.slice();
    for (const [from, to] of spec.rename) {
      const idx = renamed.indexOf(from);
      if (idx < 0) {
        throw new RefitError(
          'UNKNOWN_COLUMN',
          `${file}: rename.${from}: there is no column "${from}" in the file${suggest(from, names)}.`,
          { file, column: from, field: `rename.${from}`, suggestions: closestNames(from, names) },
        );
      }
      renamed[idx] = to;
    }
    this.header_ = renamed;
    const seen = new Set<string>();
    for (const name of renamed) {
      if (name !== '' && seen.has(name)) {
        throw new RefitError('UNKNOWN_COLUMN', `${file}: the header has two columns named "${name}"; rename one of them.`, { file, column: name });
      }
      seen.add(name);
    }
    const missingFor = (name: string): MissingRule | undefined => {
      let oldName: string | undefined;
      for (const [from, to] of spec.rename) if (to === name) oldName = from;
      return spec.missingRules.get(name) ?? (oldName !== undefined ? spec.missingRules.get(oldName) : undefined);
    };
    const needed: Array<{ name: string; field: string }> = [{ name: spec.outcome, field: 'model' }];
    for (const t of spec.formula.terms) for (const v of t.variables) needed.push({ name: v, field: 'model' });
    for (const f of spec.factors.keys()) needed.push({ name: f, field: `factors.${f}` });
    for (const c of spec.covariates) needed.push({ name: c, field: 'covariates' });
    for (const m of spec.missing.keys()) {
      if (!renamed.includes(m) && !spec.rename.has(m)) needed.push({ name: m, field: `missing.${m}` });
    }
    for (const { name, field } of needed) {
      if (!renamed.includes(name)) {
        throw new RefitError(
          'UNKNOWN_COLUMN',
          `${file}: ${field === 'model' ? `the model formula uses "${name}"` : `${field} names "${name}"`}, but there is no such column${suggest(name, renamed)}.`,
          { file, column: name, field, suggestions: closestNames(name, renamed) },
        );
      }
    }
    const modelVars = [spec.outcome];
    for (const t of spec.formula.terms) for (const v of t.variables) if (!modelVars.includes(v)) modelVars.push(v);
    for (const name of modelVars) {
      const factor = spec.factors.get(name);
      const declared: VariableKind | undefined =
        name === spec.outcome || spec.covariates.includes(name) ? 'numeric' : factor ? 'factor' : undefined;
      const reader = new VariableReader(
        name,
        declared,
        factor?.levels?.map((l) => String(l).trim()),
        missingFor(name),
        factor?.labels ?? new Map(),
        spec.rangeBounds.get(name),
      );
      reader.column = renamed.indexOf(name);
      this.variables.push(reader);
    }
    for (const column of spec.rangeBounds.keys()) {
      if (modelVars.includes(column)) continue;
      const where = spec.advice === 'command-line' ? `--range "${column}=..."` : `ranges.${column}`;
      throw new RefitError(
        'INVALID_SPEC',
        `${file}: ${where}: '${column}' is not a variable of the model ${spec.model}; give ranges for its outcome and covariates (${modelVars.join(', ')}).`,
        { file, column, field: `ranges.${column}` },
      );
    }
  }

  /** Cells that cannot be read: kept until the end (or MAX_BAD_CELLS) so one run reports them all. */
  readonly problems: CellProblem[] = [];

  private problem(p: CellProblem): void {
    this.problems.push(p);
    if (this.problems.length >= MAX_BAD_CELLS) throw badCellsError(this.file, this.problems, this.options.spec, true);
  }

  private start(): void {
    this.started = true;
    this.factors = this.variables.filter((v) => v.kind === 'factor');
    // The outcome is the last numeric variable.
    this.numerics = this.variables.filter((v) => v.kind === 'numeric' && v !== this.variables[0]).concat([this.variables[0]!]);
    this.factors.forEach((v, i) => (v.slot = i));
    this.numerics.forEach((v, i) => (v.slot = i));
    this.levelBuf = new Int32Array(this.factors.length);
    this.deltaBuf = new Float64Array(this.numerics.length);
    this.options.sink.start(this.variables);
  }

  rows(batch: readonly (readonly string[])[], firstRow: number): void {
    const width = this.header_.length;
    const vars = this.variables;
    const nv = vars.length;
    const decimalComma = this.decimalComma;
    for (let r = 0; r < batch.length; r++) {
      const row = batch[r]!;
      if (row.length !== width) {
        if (isBlank(row)) continue;
        this.problem({ code: 'RAGGED_ROW', row: firstRow + r, fields: row.length, width });
        continue;
      }
      let missing = false;
      let bad = false;
      for (let j = 0; j < nv; j++) {
        const v = vars[j]!;
        const text = trimCell(row[v.column]!);
        if (text === '' || text === 'NA') {
          missing = true;
          continue;
        }
        const value = parseCellNumber(text, decimalComma);
        if (v.missing !== undefined && isMissingCode(v.missing, text, value)) {
          missing = true;
          continue;
        }
        if (v.kind === undefined) v.kind = Number.isNaN(value) ? 'factor' : 'numeric';
        if (v.kind === 'numeric') {
          if (Number.isNaN(value)) {
            this.problem({ code: 'TEXT_IN_NUMERIC_COLUMN', row: firstRow + r, column: v.name, text, outcome: v === vars[0], hint: thousandsHint(text, decimalComma) });
            bad = true;
            continue;
          }
          v.noteValue(value, text, firstRow + r);
          if (this.started) this.deltaBuf[v.slot] = v.shifted.delta(text, value);
          else v.shifted.delta(text, value);
        } else {
          const idx = v.level(text);
          if (idx < 0) {
            this.problem({ code: 'UNKNOWN_LEVEL', row: firstRow + r, column: v.name, text, levels: v.declaredLevels ?? [] });
            bad = true;
            continue;
          }
          if (this.started) this.levelBuf[v.slot] = idx;
        }
      }
      if (bad) continue;
      if (missing) {
        this.droppedRows++;
        continue;
      }
      if (!this.started) {
        // First complete row: every variable now has a kind. Re-read this row into the buffers.
        this.start();
        for (const v of vars) {
          const text = trimCell(row[v.column]!);
          if (v.kind === 'numeric') this.deltaBuf[v.slot] = v.shifted.delta(text, parseCellNumber(text, decimalComma));
          else this.levelBuf[v.slot] = v.level(text);
        }
      }
      this.usedRows++;
      this.options.sink.add(this.levelBuf, this.deltaBuf);
    }
  }

  end(): void {
    if (this.header_.length === 0) throw new RefitError('EMPTY_FILE', `${this.file}: the file is empty (no header line).`, { file: this.file });
    if (this.problems.length > 0) throw badCellsError(this.file, this.problems, this.options.spec, false);
    if (this.usedRows + this.droppedRows === 0) {
      throw new RefitError('EMPTY_FILE', `${this.file}: the file has a header but no data rows.`, { file: this.file });
    }
    if (this.usedRows === 0) {
      throw new RefitError(
        'NO_USABLE_ROWS',
        `${this.file}: all ${this.droppedRows} rows have a missing value in a model variable, so none can be analysed. Check the missing-value codes.`,
        { file: this.file },
      );
    }
  }

  /** Variables with their final kinds, levels and origins. */
  describe(): VariableInfo[] {
    const { spec } = this.options;
    return this.variables.map((v) => ({
      name: v.name,
      kind: v.kind ?? 'numeric',
      levels: v.kind === 'factor' ? v.orderedLevels().levels : [],
      labels: v.labels,
      origin: v.shifted.origin,
      declaredLevels: v.declaredLevels !== undefined,
      distinct: [...v.distinct].sort((a, b) => a - b),
      wholeNumbers: v.wholeNumbers,
      declaredNumeric: v.name === spec.outcome || spec.covariates.includes(v.name),
    }));
  }

  /** Cells outside their columns' declared ranges, column by column. */
  outOfRange(): OutOfRange[] {
    return this.variables
      .filter((v) => v.range !== undefined && v.outside.count > 0)
      .map((v) => ({
        column: v.name,
        low: v.range![0],
        high: v.range![1],
        count: v.outside.count,
        rows: v.outside.rows.slice(),
        values: [...v.outside.values].map(([value, count]) => ({ value, count })).sort((a, b) => b.count - a.count),
      }));
  }
}

/** The most unreadable cells collected before reading stops. */
export const MAX_BAD_CELLS = 20;

/** A cell (or row) that cannot be read. */
export type CellProblem =
  | { code: 'RAGGED_ROW'; row: number; fields: number; width: number }
  | { code: 'TEXT_IN_NUMERIC_COLUMN'; row: number; column: string; text: string; outcome: boolean; hint: string }
  | { code: 'UNKNOWN_LEVEL'; row: number; column: string; text: string; levels: readonly string[] };

/** A code list for --missing or "missing": the distinct texts, comma-separated. */
function codeList(texts: readonly string[]): string {
  return [...new Set(texts)].join(',');
}

/** The advice for one column's unreadable cells, in the syntax the user used (command line or description file). */
function columnAdvice(problems: readonly CellProblem[], spec: ResolvedSpec): string[] {
  const cli = spec.advice === 'command-line';
  const out: string[] = [];
  const byColumn = new Map<string, CellProblem[]>();
  for (const p of problems) {
    if (p.code === 'RAGGED_ROW') continue;
    const list = byColumn.get(p.column) ?? [];
    list.push(p);
    byColumn.set(p.column, list);
  }
  for (const [column, list] of byColumn) {
    const codes = codeList(list.map((p) => (p.code === 'RAGGED_ROW' ? '' : p.text)));
    const first = list[0]!;
    if (first.code === 'TEXT_IN_NUMERIC_COLUMN') {
      const missing = cli ? `--missing "${column}=${codes}"` : `"missing": {"${column}": "${codes}"} in the description file`;
      const factor = first.outcome ? '' : cli ? `, or --factor ${column} if the column holds groups` : `, or declare the column under "factors" if it holds groups`;
      out.push(`'${column}': fix the cells, or declare the codes missing with ${missing}${factor}.`);
    } else if (first.code === 'UNKNOWN_LEVEL') {
      const all = [...first.levels, ...new Set(list.map((p) => (p.code === 'UNKNOWN_LEVEL' ? p.text : '')))].join(',');
      const levels = cli ? `--levels "${column}=${all}"` : `factors.${column}.levels`;
      const missing = cli ? `--missing "${column}=${codes}"` : `missing.${column}`;
      out.push(`'${column}': add the values to the levels (${levels}), or declare them missing (${missing}).`);
    }
  }
  if (problems.some((p) => p.code === 'RAGGED_ROW')) out.push('Rows with the wrong number of fields: check for a stray delimiter or an unquoted text cell containing one.');
  return out;
}

function problemText(p: CellProblem): string {
  switch (p.code) {
    case 'RAGGED_ROW':
      return `row ${p.row}: ${p.fields} fields, but the header has ${p.width} columns`;
    case 'TEXT_IN_NUMERIC_COLUMN':
      return `row ${p.row}, column '${p.column}': "${p.text}" is not a number, but the column is numeric (${p.outcome ? 'it is the outcome' : 'a covariate'})${p.hint.replace(/\.\)$/, ')')}`;
    case 'UNKNOWN_LEVEL':
      return `row ${p.row}, column '${p.column}': value "${p.text}" is not one of the declared levels (${p.levels.join(', ')})`;
  }
}

/** One error for every unreadable cell found (one alone keeps the message it always had). */
function badCellsError(file: string, problems: readonly CellProblem[], spec: ResolvedSpec, stopped: boolean): RefitError {
  const first = problems[0]!;
  const cli = spec.advice === 'command-line';
  const details = { file, row: first.row, ...(first.code === 'RAGGED_ROW' ? {} : { column: first.column }) };
  if (problems.length === 1) {
    if (first.code === 'RAGGED_ROW') {
      return new RefitError(
        'RAGGED_ROW',
        `${file}, row ${first.row}: ${first.fields} fields, but the header has ${first.width} columns. Check for a stray delimiter or an unquoted text cell containing one.`,
        details,
      );
    }
    if (first.code === 'TEXT_IN_NUMERIC_COLUMN') {
      const c = first.column;
      const missing = cli ? `with --missing "${c}=${first.text}"` : `under missing.${c}`;
      const factor = first.outcome ? '' : cli ? `, or make the column a factor with --factor ${c}` : ', or declare the column under factors';
      return new RefitError(
        'TEXT_IN_NUMERIC_COLUMN',
        `${file}, row ${first.row}, column '${c}': "${first.text}" is not a number, but the column is numeric (${first.outcome ? 'it is the outcome' : 'a covariate'}). ` +
          `Fix the cell, declare the code missing ${missing}${factor}.${first.hint}`,
        details,
      );
    }
    const c = first.column;
    const how = cli
      ? `Add it to the levels (--levels "${c}=${[...first.levels, first.text].join(',')}"), or declare it missing with --missing "${c}=${first.text}".`
      : `Add it to factors.${c}.levels, or declare it missing under missing.${c}.`;
    return new RefitError(
      'UNKNOWN_LEVEL',
      `${file}, row ${first.row}, column '${c}': value "${first.text}" is not one of the declared levels (${first.levels.join(', ')}). ${how}`,
      { ...details, field: `factors.${c}.levels` },
    );
  }
  const lines = problems.map((p) => `  ${problemText(p)}`);
  const head = stopped
    ? `${file}: reading stopped at the first ${problems.length} cells that cannot be read (there may be more); nothing was fitted:`
    : `${file}: ${problems.length} cells cannot be read; nothing was fitted:`;
  return new RefitError(first.code, [head, ...lines, 'To fix:', ...columnAdvice(problems, spec).map((a) => `  ${a}`)].join('\n'), details);
}

/** For "1,234.5" (or "1.234,5" where the decimal mark is a comma): a hint that thousands separators are not read. */
function thousandsHint(text: string, decimalComma: boolean): string {
  const grouped = decimalComma ? /^[-+]?\d{1,3}(?:\.\d{3})+(?:,\d+)?$/ : /^[-+]?\d{1,3}(?:,\d{3})+(?:\.\d+)?$/;
  if (!grouped.test(text)) return '';
  const separator = decimalComma ? '.' : ',';
  return ` (It looks like a thousands separator: write ${text.split(separator).join('')}.)`;
}

function suggest(name: string, candidates: readonly string[]): string {
  const close = closestNames(name, candidates);
  return close.length > 0 ? ` (did you mean ${close.map((c) => `"${c}"`).join(' or ')}?)` : ` (columns: ${candidates.join(', ')})`;
}
