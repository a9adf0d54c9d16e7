import { CENTRAL_HEADER, END_OF_CENTRAL_DIRECTORY, LOCAL_HEADER, walkZipDirectory, type ZipBytes, type ZipEntry } from '../documents/zipDirectory.js';

/**
 * What reading one zip entry within its declared size means, whatever does
 * the inflating (Node's zlib on the command line, zipEntries.ts; the
 * browser's DecompressionStream in the page, xlsxBytes.ts): which methods
 * are read, when the compressed size alone rules an entry out, and the
 * messages of a refusal. And the stored archive the .xlsx reader is handed.
 */

export const STORED = 0;
export const DEFLATED = 8;

export type ZipOutcome<T> = { ok: true; value: T } | { ok: false; error: string };

/** The largest central directory read: about 200,000 entries of 80-byte names; a spreadsheet has a few dozen. */
const MAX_DIRECTORY_BYTES = 16 * 1024 * 1024;

/** Every entry of an .xlsx file's central directory, walked record by record to its end; or why it cannot be. */
export function xlsxDirectory(bytes: ZipBytes): ZipOutcome<ZipEntry[]> {
  // The directory's size caps its entries (46 bytes each at least), so no entry count is needed besides.
  const walked = walkZipDirectory(bytes, { maxEntries: Infinity, maxDirectoryBytes: MAX_DIRECTORY_BYTES, followPrependedBytes: false });
  if (walked.ok) return { ok: true, value: walked.entries };
  return { ok: false, error: walked.problem === 'damaged' ? walked.reason : `its zip directory holds more than ${walked.maxEntries} entries` };
}

export function methodNotRead(entry: ZipEntry): string {
  return `its part "${entry.name}" uses compression method ${entry.method}, which is not read`;
}

export function inflatesBeyond(entry: ZipEntry): string {
  return `its part "${entry.name}" inflates beyond the ${entry.uncompressedSize.toLocaleString('en-US')} bytes its zip directory declares (a damaged file or a zip bomb)`;
}

export function cannotInflate(entry: ZipEntry, reason: string): string {
  return `its part "${entry.name}" cannot be inflated (${reason})`;
}

/**
 * Whether an entry's compressed size alone shows that its output cannot fit
 * its declared size: deflate adds at most 5 bytes per 64 KiB block to data it
 * cannot compress, so a part compressed to more than that is not one whose
 * output fits.
 */
export function compressedBeyondDeclared(entry: ZipEntry): boolean {
  const cap = entry.uncompressedSize;
  return entry.compressedSize > cap + Math.ceil(cap / 16_384) + 1024;
}

/**
 * A zip archive of the given parts, stored without compression, as a list
 * of chunks (the parts' own bytes are not copied). The .xlsx reader is
 * handed this archive of exactly the parts that were checked, so what it
 * parses is what the limits measured, whatever else the original file held.
 */
export function storedZipChunks(parts: ReadonlyMap<string, Uint8Array>, crc32: (data: Uint8Array) => number): Uint8Array[] {
  const encoder = new TextEncoder();
  const chunks: Uint8Array[] = [];
  const directory: Uint8Array[] = [];
  let offset = 0;
  for (const [name, data] of parts) {
    const nameBytes = encoder.encode(name);
    const crc = crc32(data) >>> 0;
    const local = new Uint8Array(30);
    const localView = new DataView(local.buffer);
    localView.setUint32(0, LOCAL_HEADER, true);
    localView.setUint16(4, 20, true);
    localView.setUint16(6, 0x0800, true); // names in UTF-8
    localView.setUint16(8, STORED, true);
    localView.setUint32(14, crc, true);
    localView.setUint32(18, data.length, true);
    localView.setUint32(22, data.length, true);
    localView.setUint16(26, nameBytes.length, true);
    const central = new Uint8Array(46);
    const centralView = new DataView(central.buffer);
    centralView.setUint32(0, CENTRAL_HEADER, true);
    centralView.setUint16(4, 20, true);
    centralView.setUint16(6, 20, true);
    centralView.setUint16(8, 0x0800, true);
    centralView.setUint16(10, STORED, true);
    centralView.setUint32(16, crc, true);
    centralView.setUint32(20, data.length, true);
    centralView.setUint32(24, data.length, true);
    centralView.setUint16(28, nameBytes.length, true);
    centralView.setUint32(42, offset, true);
    chunks.push(local, nameBytes, data);
    directory.push(central, nameBytes);
    offset += 30 + nameBytes.length + data.length;
  }
  const directorySize = directory.reduce((sum, chunk) => sum + chunk.length, 0);
  const end = new Uint8Array(22);
  const endView = new DataView(end.buffer);
  endView.setUint32(0, END_OF_CENTRAL_DIRECTORY, true);
  endView.setUint16(8, parts.size, true);
  endView.setUint16(10, parts.size, true);
  endView.setUint32(12, directorySize, true);
  endView.setUint32(16, offset, true);
  return [...chunks, ...directory, end];
}

/** The CRC-32 table (IEEE 802.3 polynomial 0xEDB88320, reflected), built on first use. */
let crcTable: Uint32Array | undefined;

/**
 * CRC-32 as zip writes it (PKWARE APPNOTE 4.4.7), for where Node's
 * zlib.crc32 is not at hand (the page): ten lines, against bundling a zip
 * library for one function.
 */
export function crc32(data: Uint8Array, value = 0): number {
  if (crcTable === undefined) {
    crcTable = new Uint32Array(256);
    for (let n = 0; n < 256; n++) {
      let c = n;
      for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
      crcTable[n] = c >>> 0;
    }
  }
  let crc = ~value >>> 0;
  for (let index = 0; index < data.length; index++) crc = crcTable[(crc ^ data[index]!) & 0xff]! ^ (crc >>> 8);
  return ~crc >>> 0;
}
