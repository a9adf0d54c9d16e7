import { crc32, deflateRawSync, inflateRawSync } from 'node:zlib';
import { zipArchive, type ZipEntryInput } from '../adversarial/build.js';

/**
 * Builders of .xlsx files for tests and benchmarks: the few parts a reader
 * needs (content types, relationships, a workbook with one sheet, the sheet
 * and, optionally, shared strings), zipped with deflate. Nothing is
 * committed: files are made in the test's temporary folder.
 */

export interface SheetOptions {
  /** Text cells as shared strings (as Excel writes them) instead of inline strings. */
  sharedStrings?: boolean;
  /** The <dimension ref> written at the top of the sheet; by default the real extent. */
  dimension?: string | null;
  /** Extra raw XML appended inside <sheetData> after the rows (a hostile file's stray cells). */
  extraRowsXml?: string;
}

/** Column letters of a 1-based column number (1 -> A, 27 -> AA). */
export function columnLetters(column: number): string {
  let letters = '';
  for (let rest = column; rest > 0; rest = Math.floor((rest - 1) / 26)) letters = String.fromCharCode(65 + ((rest - 1) % 26)) + letters;
  return letters;
}

function escapeXml(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

function entry(name: string, text: string | Buffer): ZipEntryInput {
  const bytes = typeof text === 'string' ? Buffer.from(text, 'utf8') : text;
  return { name, data: deflateRawSync(bytes), method: 8, crc: crc32(bytes), size: bytes.length };
}

/** The sheet's XML, built in pieces so that hundreds of thousands of rows never form one giant intermediate array of strings. */
function sheetXml(rows: Iterable<readonly (string | number)[]>, rowCount: number, columnCount: number, options: SheetOptions, strings: Map<string, number>): Buffer {
  const parts: Buffer[] = [];
  let pending: string[] = [];
  const flush = () => {
    parts.push(Buffer.from(pending.join(''), 'utf8'));
    pending = [];
  };
  const dimension = options.dimension === undefined ? `A1:${columnLetters(columnCount)}${rowCount}` : options.dimension;
  pending.push('<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main">');
  if (dimension !== null) pending.push(`<dimension ref="${dimension}"/>`);
  pending.push('<sheetData>');
  let r = 0;
  for (const row of rows) {
    r++;
    const cells = row.map((value, index) => {
      const ref = `${columnLetters(index + 1)}${r}`;
      if (typeof value === 'number') return `<c r="${ref}"><v>${value}</v></c>`;
      if (options.sharedStrings) {
        let id = strings.get(value);
        if (id === undefined) strings.set(value, (id = strings.size));
        return `<c r="${ref}" t="s"><v>${id}</v></c>`;
      }
      return `<c r="${ref}" t="inlineStr"><is><t>${escapeXml(value)}</t></is></c>`;
    });
    pending.push(`<row r="${r}">${cells.join('')}</row>`);
    if (pending.length >= 10_000) flush();
  }
  pending.push(options.extraRowsXml ?? '', '</sheetData></worksheet>');
  flush();
  return Buffer.concat(parts);
}

/** An .xlsx file with one sheet: the header row, then the rows. */
export function xlsxFile(header: readonly string[], rows: Iterable<readonly (string | number)[]>, rowCount: number, options: SheetOptions = {}): Buffer {
  return zipArchive(xlsxEntries(header, rows, rowCount, options));
}

/** The zip entries of xlsxFile's file, for a test that zips them its own way (an end record that lies). */
export function xlsxEntries(header: readonly string[], rows: Iterable<readonly (string | number)[]>, rowCount: number, options: SheetOptions = {}): ZipEntryInput[] {
  const strings = new Map<string, number>();
  const all = (function* () {
    yield header;
    yield* rows;
  })();
  const xml = sheetXml(all, rowCount + 1, header.length, options, strings);
  const entries = [
    entry(
      '[Content_Types].xml',
      '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types">' +
        '<Default Extension="rels" ContentType="application/vnd.openxmlformats-package.relationships+xml"/><Default Extension="xml" ContentType="application/xml"/>' +
        '<Override PartName="/xl/workbook.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml"/>' +
        '<Override PartName="/xl/worksheets/sheet1.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.worksheet+xml"/>' +
        (options.sharedStrings ? '<Override PartName="/xl/sharedStrings.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sharedStrings+xml"/>' : '') +
        '</Types>',
    ),
    entry(
      '_rels/.rels',
      '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships">' +
        '<Relationship Id="rId1" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/officeDocument" Target="xl/workbook.xml"/></Relationships>',
    ),
    entry(
      'xl/workbook.xml',
      '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<workbook xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships">' +
        '<sheets><sheet name="Data" sheetId="1" r:id="rId1"/></sheets></workbook>',
    ),
    entry(
      'xl/_rels/workbook.xml.rels',
      '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships">' +
        '<Relationship Id="rId1" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/worksheet" Target="worksheets/sheet1.xml"/>' +
        (options.sharedStrings ? '<Relationship Id="rId2" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/sharedStrings" Target="sharedStrings.xml"/>' : '') +
        '</Relationships>',
    ),
    entry('xl/worksheets/sheet1.xml', xml),
  ];
  if (options.sharedStrings) {
    const items = [...strings.keys()].map((text) => `<si><t>${escapeXml(text)}</t></si>`).join('');
    entries.push(
      entry(
        'xl/sharedStrings.xml',
        `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<sst xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" count="${strings.size}" uniqueCount="${strings.size}">${items}</sst>`,
      ),
    );
  }
  return entries;
}

/**
 * The archive with one part replaced (`data`, or the part's own bytes when
 * null) and its declared size set to `declaredSize` (the real size when
 * omitted): re-zipped from the parts, read back with the test builder's
 * layout (local headers in order, then the directory).
 */
export function withPart(archive: Buffer, name: string, data: Buffer | null, declaredSize?: number): Buffer {
  const entries = readParts(archive);
  return zipArchive(
    entries.map((entry) => {
      if (entry.name !== name) return { name: entry.name, data: deflateRawSync(entry.bytes), method: 8 as const, crc: crc32(entry.bytes), size: entry.bytes.length };
      const bytes = data ?? entry.bytes;
      return { name, data: deflateRawSync(bytes), method: 8 as const, crc: crc32(bytes), size: declaredSize ?? bytes.length };
    }),
  );
}

/** The parts of an archive made by zipArchive (deflated, sizes in the local headers). */
function readParts(archive: Buffer): { name: string; bytes: Buffer }[] {
  const parts: { name: string; bytes: Buffer }[] = [];
  let at = 0;
  while (archive.readUInt32LE(at) === 0x04034b50) {
    const compressed = archive.readUInt32LE(at + 18);
    const nameLength = archive.readUInt16LE(at + 26);
    const extraLength = archive.readUInt16LE(at + 28);
    const name = archive.toString('utf8', at + 30, at + 30 + nameLength);
    const start = at + 30 + nameLength + extraLength;
    parts.push({ name, bytes: inflateRawSync(archive.subarray(start, start + compressed)) });
    at = start + compressed;
  }
  return parts;
}
