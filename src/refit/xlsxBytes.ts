import type { ZipBytes, ZipEntry } from '../documents/zipDirectory.js';
import type { XlsxLimits } from '../limits.js';
import { checkSheetLimits, partsWithinDeclaredLimit, readerFailed, unreadableXlsx } from './xlsxChecks.js';
import { cannotInflate, compressedBeyondDeclared, crc32, DEFLATED, inflatesBeyond, methodNotRead, STORED, storedZipChunks, xlsxDirectory, type ZipOutcome } from './zipParts.js';

/**
 * The first sheet of an .xlsx file whose bytes are already in memory (the
 * web page: the file the user chose, with no path and no Node), read
 * within the same limits and in the same order as the command line's
 * reader of a file on disk (xlsx.ts, whose comment gives the steps):
 * the same directory walker (src/documents/zipDirectory.ts, bytes
 * before the archive refused), the same declared-size, row, column, cell
 * and shared-string checks with the same messages (xlsxChecks.ts), each
 * part inflated no further than its declared size (here by the browser's
 * DecompressionStream, counted chunk by chunk and cancelled past the
 * size), and read-excel-file's browser build handed a stored archive of
 * exactly the checked parts.
 *
 * Where a message depends on the inflater's own words (a part that is not
 * valid deflate data), the browser's words differ from zlib's; every limit
 * and size refusal is word for word the command line's.
 */

/**
 * The bytes of a file as the directory walker reads them. The walker is
 * written against Node's Buffer (readUInt16LE, readUInt32LE, toString);
 * this subclass of Uint8Array gives exactly those, with Buffer's range
 * errors, and its subarrays are of the same class (TypedArray species), so
 * the page walks a zip with the command line's code and no Buffer polyfill.
 */
class LittleEndianBytes extends Uint8Array {
  private checked(at: number, width: number): void {
    if (!Number.isInteger(at) || at < 0 || at + width > this.length) throw new RangeError(`offset ${at} is out of range for ${width} bytes of ${this.length}`);
  }

  readUInt16LE(at: number): number {
    this.checked(at, 2);
    return this[at]! | (this[at + 1]! << 8);
  }

  readUInt32LE(at: number): number {
    this.checked(at, 4);
    return (this[at]! | (this[at + 1]! << 8) | (this[at + 2]! << 16)) + this[at + 3]! * 0x1000000;
  }

  /** Text as Buffer gives it: "utf8" through TextDecoder, "latin1" one character per byte (names of entries: short). */
  override toString(encoding: 'utf8' | 'latin1' = 'utf8', start = 0, end = this.length): string {
    const bytes = this.subarray(start, end);
    if (encoding === 'utf8') return new TextDecoder('utf-8').decode(bytes);
    let text = '';
    for (const byte of bytes) text += String.fromCharCode(byte);
    return text;
  }
}

function bytesOf(data: Uint8Array): ZipBytes {
  const view = new LittleEndianBytes(data.buffer as ArrayBuffer, data.byteOffset, data.byteLength);
  // The walker's reads are typed as Buffer; LittleEndianBytes has every method it calls on them.
  return { size: view.length, read: (position, length) => view.subarray(position, position + length) as unknown as Buffer };
}

/**
 * One entry's data inflated through DecompressionStream("deflate-raw"),
 * cancelled as soon as the output passes the declared size: memory stays
 * within the size (plus one chunk) whatever the data expands to.
 */
async function inflateWithinDeclared(entry: ZipEntry, data: Uint8Array): Promise<ZipOutcome<Uint8Array>> {
  const cap = entry.uncompressedSize;
  const reader = new Blob([data as Uint8Array<ArrayBuffer>]).stream().pipeThrough(new DecompressionStream('deflate-raw')).getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  try {
    for (let read = await reader.read(); !read.done; read = await reader.read()) {
      total += read.value.length;
      if (total > cap) {
        await reader.cancel().catch(() => undefined);
        return { ok: false, error: inflatesBeyond(entry) };
      }
      chunks.push(read.value);
    }
  } catch (error) {
    return { ok: false, error: cannotInflate(entry, error instanceof Error ? error.message : String(error)) };
  }
  const inflated = new Uint8Array(total);
  let at = 0;
  for (const chunk of chunks) {
    inflated.set(chunk, at);
    at += chunk.length;
  }
  return { ok: true, value: inflated };
}

/** One entry's bytes, as zipEntries.ts's readZipEntry reads them from a file. */
async function entryBytes(data: Uint8Array, entry: ZipEntry): Promise<ZipOutcome<Uint8Array>> {
  if (entry.method !== STORED && entry.method !== DEFLATED) return { ok: false, error: methodNotRead(entry) };
  if (compressedBeyondDeclared(entry)) return { ok: false, error: inflatesBeyond(entry) };
  // The walk checked the local header and that the data ends inside the file.
  const raw = data.subarray(entry.dataStart, entry.dataStart + entry.compressedSize);
  if (entry.method === STORED) return { ok: true, value: raw };
  return inflateWithinDeclared(entry, raw);
}

/** The parts the reader would unpack, within the size limit. */
async function unpackWithinLimit(data: Uint8Array, file: string, limits: XlsxLimits): Promise<Map<string, Uint8Array>> {
  const directory = xlsxDirectory(bytesOf(data));
  if (!directory.ok) throw unreadableXlsx(file, directory.error);
  const wanted = partsWithinDeclaredLimit(file, directory.value, limits);
  const parts = new Map<string, Uint8Array>();
  for (const entry of wanted) {
    const part = await entryBytes(data, entry);
    if (!part.ok) throw unreadableXlsx(file, part.error);
    parts.set(entry.name, part.value);
  }
  return parts;
}

/** The first sheet of an .xlsx file's bytes as rows of cells, after the limits are checked; a RefitError naming the file otherwise. */
export async function readXlsxBytes(data: Uint8Array, file: string, limits: XlsxLimits): Promise<unknown[][]> {
  const parts = await unpackWithinLimit(data, file, limits);
  checkSheetLimits(file, parts, limits);
  try {
    // Loaded on demand; the browser build parses XML with the browser's own DOMParser.
    const { readSheet } = await import('read-excel-file/browser');
    const archive = new Blob(storedZipChunks(parts, crc32) as Uint8Array<ArrayBuffer>[]);
    return (await readSheet(archive, { parseNumber: (s: string) => s })) as unknown[][];
  } catch (error) {
    throw readerFailed(file, error);
  }
}
