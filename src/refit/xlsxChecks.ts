import { formatMb, MB, type XlsxLimits } from '../limits.js';
import { RefitError } from './errors.js';

/**
 * The limits an .xlsx file is held to before the spreadsheet reader parses
 * it, as pure functions of the archive's directory and of its unpacked
 * parts (bytes): the command line's reader (xlsx.ts, a file on disk, Node's
 * zlib) and the page's (xlsxBytes.ts, the chosen file's bytes, the
 * browser's DecompressionStream) both call them, so the two refuse the same
 * files with the same messages. See xlsx.ts for the order of the checks.
 */

const UTF8 = new TextDecoder('utf-8');
/** Made on first use in the browser only. WHATWG "latin1" is windows-1252: still one character per byte, so a match's index is a byte offset; the tag and attribute patterns treat the bytes 0x80-0x9F alike under both (none is a space). */
let latin1: TextDecoder | undefined;

/**
 * Bytes decoded as text: through Buffer where there is one (Node: the
 * command line, as it always has), through TextDecoder in the browser.
 */
function decodeBytes(bytes: Uint8Array, encoding: 'utf8' | 'latin1', start: number, end: number): string {
  if (typeof Buffer !== 'undefined') return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString(encoding, start, end);
  if (encoding === 'utf8') return UTF8.decode(bytes.subarray(start, end));
  latin1 ??= new TextDecoder('latin1');
  return latin1.decode(bytes.subarray(start, end));
}

/** The parts read-excel-file unpacks (its own filter): XML and the relationships of XML parts. */
export function isReaderPart(name: string): boolean {
  return name.endsWith('.xml') || name.endsWith('.xml.rels');
}

export const CSV_ADVICE = 'Save the sheet as CSV (in a spreadsheet program: Save As, CSV), which refit reads as a stream with no limit on rows.';

export function tooLarge(file: string, what: string): RefitError {
  return new RefitError('DATA_TOO_LARGE', `${file}: ${what} ${CSV_ADVICE}`, { file });
}

export function unreadableXlsx(file: string, reason: string): RefitError {
  return new RefitError(
    'UNREADABLE_FILE',
    `${file}: cannot be read as an XLSX file: ${reason}. Open it in a spreadsheet program and save it again, or save the sheet as CSV.`,
    { file },
  );
}

/** The spreadsheet reader itself failed on the checked parts. */
export function readerFailed(file: string, error: unknown): RefitError {
  return new RefitError('UNREADABLE_FILE', `${file}: cannot be read (${error instanceof Error ? error.message : String(error)}).`, { file });
}

export function count(value: number): string {
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
function scanTags(xml: Uint8Array, pattern: RegExp, found: (match: RegExpExecArray, sliceStart: number) => void, sliceBytes = SCAN_SLICE_BYTES): void {
  let start = 0;
  while (start < xml.length) {
    let end = Math.min(xml.length, start + sliceBytes);
    if (end < xml.length) {
      const lastTag = xml.lastIndexOf(0x3c, end);
      const closing = xml.indexOf(0x3e, end);
      end = lastTag > start ? lastTag : closing === -1 ? xml.length : closing + 1;
    }
    const slice = decodeBytes(xml, 'latin1', start, end);
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
export function forEachTag(xml: Uint8Array, names: readonly string[], visit: (name: string, attributes: string) => void): void {
  scanTags(xml, tagPattern(names.join('|')), (match, sliceStart) => {
    const attributesStart = sliceStart + match.index + match[0].length - 1 - match[2]!.length;
    visit(match[1]!, decodeBytes(xml, 'utf8', attributesStart, attributesStart + match[2]!.length));
  });
}

/** How many start (or empty-element) tags named `name` an XML part holds. */
export function countTags(xml: Uint8Array, name: string): number {
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
export function sheetExtent(xml: Uint8Array, sliceBytes = SCAN_SLICE_BYTES): { rows: number; columns: number } {
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
export function workbookParts(parts: ReadonlyMap<string, Uint8Array>): { sheets: string[]; sharedStrings: string[] } {
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

/**
 * The directory's entries the reader would unpack, refused when the sizes
 * they declare add up to more than the unzipped-size limit (nothing is
 * inflated before this check).
 */
export function partsWithinDeclaredLimit<T extends { name: string; uncompressedSize: number }>(file: string, entries: readonly T[], limits: XlsxLimits): T[] {
  const wanted = entries.filter((entry) => isReaderPart(entry.name));
  const budget = limits.maxUnzippedMb * MB;
  const declared = wanted.reduce((sum, entry) => sum + entry.uncompressedSize, 0);
  if (declared > budget) {
    throw tooLarge(file, `the XLSX file would expand to ${formatMb(declared)} when unzipped, more than the ${count(limits.maxUnzippedMb)} MB refit reads from an XLSX file (the whole sheet is held in memory to read it).`);
  }
  return wanted;
}

/** Refuses a sheet or shared strings above the limits, naming what was measured. */
export function checkSheetLimits(file: string, parts: ReadonlyMap<string, Uint8Array>, limits: XlsxLimits): void {
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
