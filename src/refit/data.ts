import type { FileHandle } from 'node:fs/promises';
import { basename, extname } from 'node:path';
import Papa from 'papaparse';
import { openRegularFile } from '../documents/regularFile.js';
import { xlsxLimits } from '../limits.js';
import { RefitError, closestNames } from './errors.js';
import { LineEndingsToLf } from './lineEndings.js';
import { ShiftedColumn, parseCellNumber } from './numeric.js';
import { isMissingCode, type MissingRule, type ResolvedSpec } from './spec.js';
import { readXlsxSheet } from './xlsx.js';

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

/** A path to a .csv, .tsv, .txt or .xlsx file, or a table in memory. */
export type DataSource = string | InMemoryTable;

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
  const delimiter = detectDelimiter(line);
  let nextRow = 1; // row number of the next record (header = 1)
  let sawHeader = false;
  let failure: unknown;
  let closeStream = (): void => {};
  try {
    await new Promise<void>((resolve, reject) => {
      // The stream closes the handle when it ends, fails or is destroyed.
      const stream = handle.createReadStream({ start: 0, encoding: 'utf8', highWaterMark: 1 << 17 });
      closeStream = () => stream.destroy();
      stream.on('error', (err) => reject(unreadable(file, err)));
      const lines = stream.pipe(new LineEndingsToLf());
      Papa.parse<string[]>(lines as unknown as File, {
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
    });
  } finally {
    // Once parsing stopped (at the end, or aborted on a bad row), the file is closed, not left to the garbage collector.
    closeStream();
  }
  if (failure !== undefined) throw failure;
  if (!sawHeader) throw new RefitError('EMPTY_FILE', `${file}: the file is empty (no header line).`, { file });
  consumer.end();
}

async function streamXlsx(path: string, consumer: RowConsumer): Promise<void> {
  const file = basename(path);
  const sheet = await readXlsxSheet(path, file, xlsxLimits);
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

  constructor(
    readonly name: string,
    declared: VariableKind | undefined,
    readonly declaredLevels: string[] | undefined,
    readonly missing: MissingRule | undefined,
    readonly labels: ReadonlyMap<string, string>,
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

  /** Level index for a factor cell, adding new levels unless levels were declared. */
  level(text: string, file: string, row: number): number {
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
    if (this.declaredLevels) {
      throw new RefitError(
        'UNKNOWN_LEVEL',
        `${file}, row ${row}, column '${this.name}': value "${text}" is not one of the declared levels ` +
          `(${this.declaredLevels.join(', ')}). Add it to factors.${this.name}.levels, or declare it missing under missing.${this.name}.`,
        { file, row, column: this.name, field: `factors.${this.name}.levels` },
      );
    }
    return this.addLevel(text);
  }

  /** Final level order: declared order, else numeric order when every level is a number, else code-point order. */
  orderedLevels(): { levels: string[]; remap: Int32Array } {
    const texts = this.levelTexts;
    let order = texts.map((_, i) => i);
    if (!this.declaredLevels) {
      const nums = texts.map((t) => parseCellNumber(t));
      const allNumeric = nums.every((v) => !Number.isNaN(v));
      order.sort((a, b) => (allNumeric ? nums[a]! - nums[b]! : texts[a]! < texts[b]! ? -1 : texts[a]! > texts[b]! ? 1 : 0));
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
      );
      reader.column = renamed.indexOf(name);
      this.variables.push(reader);
    }
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
        const rowNumber = firstRow + r;
        throw new RefitError(
          'RAGGED_ROW',
          `${this.file}, row ${rowNumber}: ${row.length} fields, but the header has ${width} columns. ` +
            'Check for a stray delimiter or an unquoted text cell containing one.',
          { file: this.file, row: rowNumber },
        );
      }
      let missing = false;
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
            const rowNumber = firstRow + r;
            throw new RefitError(
              'TEXT_IN_NUMERIC_COLUMN',
              `${this.file}, row ${rowNumber}, column '${v.name}': "${text}" is not a number, but the column is numeric ` +
                `(${v === vars[0] ? 'it is the outcome' : 'a covariate'}). Fix the cell, declare the code missing under missing.${v.name}` +
                `${v === vars[0] ? '' : `, or declare the column under factors`}.${thousandsHint(text, decimalComma)}`,
              { file: this.file, row: rowNumber, column: v.name },
            );
          }
          if (this.started) this.deltaBuf[v.slot] = v.shifted.delta(text, value);
          else v.shifted.delta(text, value);
        } else {
          const idx = v.level(text, this.file, firstRow + r);
          if (this.started) this.levelBuf[v.slot] = idx;
        }
      }
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
          else this.levelBuf[v.slot] = v.level(text, this.file, firstRow + r);
        }
      }
      this.usedRows++;
      this.options.sink.add(this.levelBuf, this.deltaBuf);
    }
  }

  end(): void {
    if (this.header_.length === 0) throw new RefitError('EMPTY_FILE', `${this.file}: the file is empty (no header line).`, { file: this.file });
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
    return this.variables.map((v) => ({
      name: v.name,
      kind: v.kind ?? 'numeric',
      levels: v.kind === 'factor' ? v.orderedLevels().levels : [],
      labels: v.labels,
      origin: v.shifted.origin,
    }));
  }
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
