import { Readable } from 'node:stream';
import { crc32 } from 'node:zlib';
import { openRegularFile } from '../documents/regularFile.js';
import { formatMb, MB, type XlsxLimits } from '../limits.js';
import { RefitError } from './errors.js';
import { readZipDirectory, readZipEntry, storedZipChunks, type ZipEntry } from './zipEntries.js';

/**
 * Reading the first sheet of an .xlsx file within limits (src/limits.ts,
 * xlsxLimits), checked before the spreadsheet reader (read-excel-file)
 * parses anything:
 *
 * 1. The zip's central directory is walked (zipEntries.ts, with the
 *    walker the DOCX reader uses, src/documents/zipDirectory.ts), and the
 *    sizes it declares for the parts the reader unpacks (its .xml parts)
 *    are added up: above maxUnzippedMb nothing is inflated.
 * 2. Those parts are inflated with the output capped at their declared
 *    sizes, so a part that lies about its size is caught.
 * 3. The first sheet's XML is scanned for the rows and columns its cells
 *    span, as the reader will lay them out (a single cell at XFD1048576
 *    makes it build a million rows of 16,384 cells; the sheet's own
 *    <dimension> is a claim the reader ignores, so it is not trusted
 *    either), and the shared strings are counted.
 * 4. The reader is handed an archive of exactly the parts that were
 *    checked (stored, not compressed), never the original file: it reads
 *    entries by their local headers in file order, which need not agree
 *    with the directory that was checked.
 *
 * Every refusal names the file and suggests saving the sheet as CSV, which
 * refit streams with no limit on rows.
 */

/** The parts read-excel-file unpacks (its own filter): XML and the relationships of XML parts. */
function isReaderPart(name: string): boolean {
  return name.endsWith('.xml') || name.endsWith('.xml.rels');
}

const CSV_ADVICE = 'Save the sheet as CSV (in a spreadsheet program: Save As, CSV), which refit reads as a stream with no limit on rows.';

function tooLarge(file: string, what: string): RefitError {
  return new RefitError('DATA_TOO_LARGE', `${file}: ${what} ${CSV_ADVICE}`, { file });
}

function unreadableXlsx(file: string, reason: string): RefitError {
  return new RefitError(
    'UNREADABLE_FILE',
    `${file}: cannot be read as an XLSX file: ${reason}. Open it in a spreadsheet program and save it again, or save the sheet as CSV.`,
    { file },
  );
}

function count(value: number): string {
  return value.toLocaleString('en-US');
}

/** XML parts are scanned in slices of about this many bytes, each decoded on its own (a large sheet never becomes one string). */
const SCAN_SLICE_BYTES = 1 << 23;

/**
 * Runs a global regular expression for tags over an XML part in slices,
 * each cut just before a "<" (or after the ">" of a tag longer than a
 * slice), so no tag is split between slices; `found` gets each match and
 * the byte offset of its slice. Slices are decoded as latin1, which maps
 * bytes to characters one to one, so a match's index is a byte offset.
 */
function scanTags(xml: Buffer, pattern: RegExp, found: (match: RegExpExecArray, sliceStart: number) => void, sliceBytes = SCAN_SLICE_BYTES): void {
  let start = 0;
  while (start < xml.length) {
    let end = Math.min(xml.length, start + sliceBytes);
    if (end < xml.length) {
      const lastTag = xml.lastIndexOf(0x3c, end);
      const closing = xml.indexOf(0x3e, end);
      end = lastTag > start ? lastTag : closing === -1 ? xml.length : closing + 1;
    }
    const slice = xml.toString('latin1', start, end);
    pattern.lastIndex = 0;
    for (let match = pattern.exec(slice); match !== null; match = pattern.exec(slice)) found(match, start);
    start = end;
  }
}

/**
 * A start or empty-element tag named `names` (plain words, alternatives),
 * any namespace prefix dropped ("x:c" is "c"). No part of it runs past a
 * "<" (which XML allows neither in a tag nor in an attribute's value), so
 * an attempt that fails stops at the next tag and the scan stays linear.
 */
function tagPattern(names: string): RegExp {
  return new RegExp(`<(?:[^\\s/<>:!?]+:)?(${names})(?=[\\s/>])([^<>]*)>`, 'g');
}

/**
 * Calls `visit` for every start tag (or empty-element tag) named one of
 * `names` (plain words) in an XML part, with its attributes' text decoded
 * as UTF-8. For the small parts (workbook, relationships).
 */
export function forEachTag(xml: Buffer, names: readonly string[], visit: (name: string, attributes: string) => void): void {
  scanTags(xml, tagPattern(names.join('|')), (match, sliceStart) => {
    const attributesStart = sliceStart + match.index + match[0].length - 1 - match[2]!.length;
    visit(match[1]!, xml.toString('utf8', attributesStart, attributesStart + match[2]!.length));
  });
}

/** How many start (or empty-element) tags named `name` an XML part holds. */
export function countTags(xml: Buffer, name: string): number {
  let tags = 0;
  scanTags(xml, tagPattern(name), () => tags++);
  return tags;
}

/** Attribute patterns by name, built once: the name may carry a namespace prefix ("r:id"); values are quoted with " or '. */
const attributePatterns = new Map<string, RegExp>();

function attribute(attributes: string, name: string): string | undefined {
  let pattern = attributePatterns.get(name);
  if (pattern === undefined) {
    pattern = new RegExp(`(?:^|\\s)(?:[\\w.-]+:)?${name}\\s*=\\s*(?:"([^"]*)"|'([^']*)')`);
    attributePatterns.set(name, pattern);
  }
  const match = pattern.exec(attributes);
  return match ? (match[1] ?? match[2]) : undefined;
}

/** The column number of a cell reference's letters (A -> 1, XFD -> 16,384). */
function columnNumber(letters: string): number {
  let column = 0;
  for (const letter of letters.toUpperCase()) column = column * 26 + (letter.charCodeAt(0) - 64);
  return column;
}

/** <row> and <c> tags, found as tagPattern finds tags (linear). */
const ROW_OR_CELL = tagPattern('row|c');

/** One attribute, name and quoted value, read from where the last one ended (sticky). */
const ATTRIBUTE = /\s*([^\s=<>/]+)\s*=\s*(?:"([^"<]*)"|'([^'<]*)')/y;

/** Every r="..." in a tag's text, for a tag whose attributes cannot be read one by one. */
const ANY_REFERENCE = /(?:^|\s)r\s*=\s*["']([^"'<>]*)["']/g;

/**
 * The values of a tag's r attribute. Attributes are read one by one, name
 * and quoted value, so an r=".." written inside another attribute's value
 * is not taken for it. When they cannot all be read (a tag the reader may
 * still accept), every r=".." in the tag counts: the extent may then come
 * out larger than the reader's, never smaller.
 */
function referencesOf(attributes: string): string[] {
  const references: string[] = [];
  let end = 0;
  ATTRIBUTE.lastIndex = 0;
  for (let match = ATTRIBUTE.exec(attributes); match !== null; match = ATTRIBUTE.exec(attributes)) {
    if (match[1] === 'r') references.push(match[2] ?? match[3] ?? '');
    end = ATTRIBUTE.lastIndex;
  }
  const rest = attributes.slice(end).trim();
  if (rest === '' || rest === '/') return references;
  return Array.from(attributes.matchAll(ANY_REFERENCE), (match) => match[1]!);
}

/**
 * The rows and columns a sheet's cells span, as the reader lays them out:
 * a <row> takes its r attribute or follows the row before; a cell takes
 * the row and column of its reference (r="C12") or follows the cell before.
 * Linear in the part (scanTags): a 67 MB sheet of 600,000 rows takes about
 * two seconds, against minutes for the reader.
 */
export function sheetExtent(xml: Buffer, sliceBytes = SCAN_SLICE_BYTES): { rows: number; columns: number } {
  let rows = 0;
  let columns = 0;
  let row = 0;
  let column = 0;
  scanTags(
    xml,
    ROW_OR_CELL,
    (match) => {
      let rowNumber = 0;
      let columnNumberOfCell = 0;
      for (const reference of referencesOf(match[2]!)) {
        const parts = /^([A-Za-z]*)(\d+)$/.exec(reference);
        if (!parts) continue;
        rowNumber = Math.max(rowNumber, Number(parts[2]));
        if (parts[1] !== '') columnNumberOfCell = Math.max(columnNumberOfCell, columnNumber(parts[1]!));
      }
      if (match[1] === 'row') {
        row = rowNumber > 0 ? rowNumber : row + 1;
        column = 0;
      } else {
        column = columnNumberOfCell > 0 ? columnNumberOfCell : column + 1;
        row = Math.max(row, rowNumber);
        if (column > columns) columns = column;
      }
      if (row > rows) rows = row;
    },
    sliceBytes,
  );
  return { rows, columns };
}

/** Resolves a relationship target as the reader does: "/xl/a.xml" from the root, anything else under "xl/". */
function partPath(target: string): string {
  return target.startsWith('/') ? target.slice(1) : `xl/${target}`;
}

/** The part of the first sheet (the one refit reads) and of the shared strings, from the workbook and its relationships. */
function workbookParts(parts: ReadonlyMap<string, Buffer>): { sheets: string[]; sharedStrings: string[] } {
  const targets = new Map<string, { type: string; path: string }>();
  const relationships = parts.get('xl/_rels/workbook.xml.rels');
  if (relationships) {
    forEachTag(relationships, ['Relationship'], (_name, attributes) => {
      const id = attribute(attributes, 'Id');
      const target = attribute(attributes, 'Target');
      if (id !== undefined && target !== undefined) targets.set(id, { type: attribute(attributes, 'Type') ?? '', path: partPath(target) });
    });
  }
  let first: string | undefined;
  const workbook = parts.get('xl/workbook.xml');
  if (workbook) {
    forEachTag(workbook, ['sheet'], (_name, attributes) => {
      const id = attribute(attributes, 'id');
      if (first === undefined && id !== undefined) first = targets.get(id)?.path;
    });
  }
  const byType = (suffix: string) => [...targets.values()].filter((t) => t.type.endsWith(suffix)).map((t) => t.path);
  // When the first sheet cannot be found, every worksheet part is measured: a refusal then errs on the side of memory.
  const sheets = first !== undefined && parts.has(first) ? [first] : [...parts.keys()].filter((name) => /^xl\/worksheets\/[^/]+\.xml$/.test(name)).concat(byType('/worksheet'));
  const sharedStrings = byType('/sharedStrings');
  return { sheets: [...new Set(sheets)], sharedStrings: sharedStrings.length > 0 ? sharedStrings : ['xl/sharedStrings.xml'] };
}

/** Unpacks the parts the reader would unpack, within the size limit. */
async function unpackWithinLimit(path: string, file: string, limits: XlsxLimits): Promise<Map<string, Buffer>> {
  let opened;
  try {
    opened = await openRegularFile(path);
  } catch (error) {
    throw new RefitError('UNREADABLE_FILE', `${file}: cannot be read (${(error as Error).message}).`, { file });
  }
  if (!opened.ok) throw new RefitError('UNREADABLE_FILE', `${file}: ${opened.error}.`, { file });
  const { handle, size } = opened;
  try {
    const directory = readZipDirectory(handle, size);
    if (!directory.ok) throw unreadableXlsx(file, directory.error);
    const wanted: ZipEntry[] = directory.value.filter((entry) => isReaderPart(entry.name));
    const budget = limits.maxUnzippedMb * MB;
    const declared = wanted.reduce((sum, entry) => sum + entry.uncompressedSize, 0);
    if (declared > budget) {
      throw tooLarge(file, `the XLSX file would expand to ${formatMb(declared)} when unzipped, more than the ${count(limits.maxUnzippedMb)} MB refit reads from an XLSX file (the whole sheet is held in memory to read it).`);
    }
    // Each part is inflated no further than its declared size, so the declared total just checked bounds the memory.
    const parts = new Map<string, Buffer>();
    for (const entry of wanted) {
      const part = await readZipEntry(handle, entry);
      if (!part.ok) throw unreadableXlsx(file, part.error);
      parts.set(entry.name, part.value);
    }
    return parts;
  } finally {
    await handle.close();
  }
}

/** Refuses a sheet or shared strings above the limits, naming what was measured. */
function checkSheetLimits(file: string, parts: ReadonlyMap<string, Buffer>, limits: XlsxLimits): void {
  const { sheets, sharedStrings } = workbookParts(parts);
  for (const sheet of sheets) {
    const xml = parts.get(sheet);
    if (!xml) continue;
    const { rows, columns } = sheetExtent(xml);
    const reason =
      rows > limits.maxRows
        ? `the sheet spans ${count(rows)} rows, more than the ${count(limits.maxRows)} refit reads from an XLSX file`
        : columns > limits.maxColumns
          ? `the sheet spans ${count(columns)} columns, more than the ${count(limits.maxColumns)} refit reads from an XLSX file`
          : rows * columns > limits.maxCells
            ? `the sheet spans ${count(rows)} rows by ${count(columns)} columns, ${count(rows * columns)} cells, more than the ${count(limits.maxCells)} refit reads from an XLSX file`
            : null;
    if (reason !== null) throw tooLarge(file, `${reason} (the whole sheet is held in memory to read it).`);
  }
  for (const name of sharedStrings) {
    const xml = parts.get(name);
    if (!xml) continue;
    const strings = countTags(xml, 'si');
    if (strings > limits.maxSharedStrings) {
      throw tooLarge(file, `the XLSX file holds ${count(strings)} shared strings (distinct texts), more than the ${count(limits.maxSharedStrings)} refit reads (all are held in memory).`);
    }
  }
}

/** The first sheet of an .xlsx file as rows of cells, after the limits are checked; a RefitError naming the file otherwise. */
export async function readXlsxSheet(path: string, file: string, limits: XlsxLimits): Promise<unknown[][]> {
  const parts = await unpackWithinLimit(path, file, limits);
  checkSheetLimits(file, parts, limits);
  try {
    // Loaded on demand: CSV-only runs do not pay for the spreadsheet reader.
    const { readSheet } = await import('read-excel-file/node');
    const archive = Readable.from(storedZipChunks(parts, crc32), { objectMode: false });
    return (await readSheet(archive, { parseNumber: (s: string) => s })) as unknown[][];
  } catch (error) {
    throw new RefitError('UNREADABLE_FILE', `${file}: cannot be read (${error instanceof Error ? error.message : String(error)}).`, { file });
  }
}
