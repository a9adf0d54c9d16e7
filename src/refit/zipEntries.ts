import type { FileHandle } from 'node:fs/promises';
import { inflateRaw } from 'node:zlib';
import { promisify } from 'node:util';

/**
 * A bounded reader of zip archives (an .xlsx file is one): the central
 * directory is found from the end record and walked entry by entry, and
 * each entry is read from its own offset and inflated with its output
 * capped. Nothing is read whole: at most the end of the file (the end
 * record and its comment), the directory (capped), and the entries asked
 * for.
 *
 * The directory is walked by its records, never by the count the end record
 * claims (a bomb may set it to 0 or 1 and hide its entries), and an archive
 * whose directory cannot be walked to its end is refused, not guessed at.
 *
 * ## References
 * - PKWARE, APPNOTE.TXT: .ZIP File Format Specification, version 6.3.10
 *   (2022): sections 4.3.7 (local file header), 4.3.12 (central directory
 *   header), 4.3.14-4.3.16 (zip64 end records, end of central directory),
 *   4.5.3 (zip64 extended information extra field).
 */

export interface ZipEntry {
  name: string;
  /** 0 stored, 8 deflated; anything else is refused when the entry is read. */
  method: number;
  compressedSize: number;
  /** As the directory declares it; the inflated size is checked against it. */
  uncompressedSize: number;
  localHeaderOffset: number;
}

export type ZipOutcome<T> = { ok: true; value: T } | { ok: false; error: string };

/** The largest central directory read: about 200,000 entries of 80-byte names; a spreadsheet has a few dozen. */
const MAX_DIRECTORY_BYTES = 16 * 1024 * 1024;

const END_OF_CENTRAL_DIRECTORY = 0x06054b50;
const ZIP64_LOCATOR = 0x07064b50;
const ZIP64_END = 0x06064b50;
const CENTRAL_HEADER = 0x02014b50;
const LOCAL_HEADER = 0x04034b50;
const STORED = 0;
const DEFLATED = 8;

async function readAt(handle: FileHandle, position: number, length: number): Promise<Buffer> {
  const buffer = Buffer.alloc(length);
  let done = 0;
  while (done < length) {
    const { bytesRead } = await handle.read(buffer, done, length - done, position + done);
    if (bytesRead === 0) break;
    done += bytesRead;
  }
  return done === length ? buffer : buffer.subarray(0, done);
}

/** Where the central directory is: from the end record (and the zip64 end record when a field overflows). */
async function directoryPlace(handle: FileHandle, fileSize: number): Promise<ZipOutcome<{ offset: number; size: number }>> {
  // The end record is in the last 22 + 65,535 bytes (its comment is at most 65,535 bytes).
  const tailStart = Math.max(0, fileSize - 22 - 0xffff);
  const tail = await readAt(handle, tailStart, fileSize - tailStart);
  let end = -1;
  for (let at = tail.length - 22; at >= 0; at--) {
    if (tail.readUInt32LE(at) === END_OF_CENTRAL_DIRECTORY) {
      end = at;
      break;
    }
  }
  if (end === -1) return { ok: false, error: 'it is not a zip archive (no end of central directory record)' };
  let size = tail.readUInt32LE(end + 12);
  let offset = tail.readUInt32LE(end + 16);
  if (size === 0xffffffff || offset === 0xffffffff || tail.readUInt16LE(end + 10) === 0xffff) {
    if (end < 20 || tail.readUInt32LE(end - 20) !== ZIP64_LOCATOR) return { ok: false, error: 'its zip64 end record is missing' };
    const zip64End = Number(tail.readBigUInt64LE(end - 20 + 8));
    const record = zip64End + 56 <= fileSize ? await readAt(handle, zip64End, 56) : Buffer.alloc(0);
    if (record.length < 56 || record.readUInt32LE(0) !== ZIP64_END) return { ok: false, error: 'its zip64 end record cannot be read' };
    size = Number(record.readBigUInt64LE(40));
    offset = Number(record.readBigUInt64LE(48));
  }
  if (offset + size > fileSize) return { ok: false, error: 'its central directory lies beyond the end of the file (a damaged or truncated file)' };
  if (size > MAX_DIRECTORY_BYTES) return { ok: false, error: `its central directory is ${size.toLocaleString('en-US')} bytes, more than a spreadsheet has` };
  return { ok: true, value: { offset, size } };
}

/** Sizes and offsets of 0xFFFFFFFF are in the zip64 extra field (id 1), in this order, each only when needed. */
function readZip64Extra(directory: Buffer, from: number, length: number, entry: ZipEntry): boolean {
  const to = from + length;
  for (let at = from; at + 4 <= to; ) {
    const id = directory.readUInt16LE(at);
    const size = directory.readUInt16LE(at + 2);
    if (id === 1) {
      let field = at + 4;
      const fieldEnd = Math.min(to, at + 4 + size);
      const next = (): number | null => {
        if (field + 8 > fieldEnd) return null;
        const value = Number(directory.readBigUInt64LE(field));
        field += 8;
        return value;
      };
      if (entry.uncompressedSize === 0xffffffff) entry.uncompressedSize = next() ?? -1;
      if (entry.compressedSize === 0xffffffff) entry.compressedSize = next() ?? -1;
      if (entry.localHeaderOffset === 0xffffffff) entry.localHeaderOffset = next() ?? -1;
      return entry.uncompressedSize >= 0 && entry.compressedSize >= 0 && entry.localHeaderOffset >= 0;
    }
    at += 4 + size;
  }
  return entry.uncompressedSize !== 0xffffffff && entry.compressedSize !== 0xffffffff && entry.localHeaderOffset !== 0xffffffff;
}

/** Every entry of the central directory, walked record by record to its end; or why it cannot be. */
export async function readZipDirectory(handle: FileHandle, fileSize: number): Promise<ZipOutcome<ZipEntry[]>> {
  const place = await directoryPlace(handle, fileSize);
  if (!place.ok) return place;
  const directory = await readAt(handle, place.value.offset, place.value.size);
  const entries: ZipEntry[] = [];
  let at = 0;
  while (at < directory.length) {
    if (at + 46 > directory.length || directory.readUInt32LE(at) !== CENTRAL_HEADER) {
      return { ok: false, error: `its central directory cannot be walked (no entry record at byte ${(place.value.offset + at).toLocaleString('en-US')})` };
    }
    const nameLength = directory.readUInt16LE(at + 28);
    const extraLength = directory.readUInt16LE(at + 30);
    const commentLength = directory.readUInt16LE(at + 32);
    const next = at + 46 + nameLength + extraLength + commentLength;
    if (next > directory.length) return { ok: false, error: 'its central directory ends in the middle of an entry record' };
    const entry: ZipEntry = {
      name: directory.toString('utf8', at + 46, at + 46 + nameLength),
      method: directory.readUInt16LE(at + 10),
      compressedSize: directory.readUInt32LE(at + 20),
      uncompressedSize: directory.readUInt32LE(at + 24),
      localHeaderOffset: directory.readUInt32LE(at + 42),
    };
    if (!readZip64Extra(directory, at + 46 + nameLength, extraLength, entry)) {
      return { ok: false, error: `the zip64 sizes of its part "${entry.name}" are missing` };
    }
    entries.push(entry);
    at = next;
  }
  return { ok: true, value: entries };
}

const inflateRawAsync = promisify(inflateRaw);

/**
 * The bytes of one entry, read from its local header's place and inflated
 * with the output capped at the size the directory declares: an entry that
 * inflates beyond it is refused after at most that much output, whatever
 * its headers claim. A caller that has checked the declared sizes against
 * a limit is thereby held to the limit.
 */
export async function readZipEntry(handle: FileHandle, fileSize: number, entry: ZipEntry): Promise<ZipOutcome<Buffer>> {
  if (entry.method !== STORED && entry.method !== DEFLATED) return { ok: false, error: `its part "${entry.name}" uses compression method ${entry.method}, which is not read` };
  const cap = entry.uncompressedSize;
  const beyond = `its part "${entry.name}" inflates beyond the ${cap.toLocaleString('en-US')} bytes its zip directory declares (a damaged file or a zip bomb)`;
  // Deflate adds at most 5 bytes per 64 KiB block to data it cannot compress: a part compressed to more than that is not one whose output fits the cap.
  if (entry.compressedSize > cap + Math.ceil(cap / 16_384) + 1024) {
    return { ok: false, error: beyond };
  }
  const header = entry.localHeaderOffset + 30 <= fileSize ? await readAt(handle, entry.localHeaderOffset, 30) : Buffer.alloc(0);
  if (header.length < 30 || header.readUInt32LE(0) !== LOCAL_HEADER) {
    return { ok: false, error: `its part "${entry.name}" is not where the central directory says (bytes added before the archive, or a damaged file)` };
  }
  const start = entry.localHeaderOffset + 30 + header.readUInt16LE(26) + header.readUInt16LE(28);
  if (start + entry.compressedSize > fileSize) return { ok: false, error: `its part "${entry.name}" runs past the end of the file` };
  const data = await readAt(handle, start, entry.compressedSize);
  if (entry.method === STORED) return { ok: true, value: data };
  let inflated: Buffer;
  try {
    inflated = await inflateRawAsync(data, { maxOutputLength: Math.max(1, cap + 1) });
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'ERR_BUFFER_TOO_LARGE' || error instanceof RangeError) return { ok: false, error: beyond };
    return { ok: false, error: `its part "${entry.name}" cannot be inflated (${(error as Error).message})` };
  }
  if (inflated.length > cap) return { ok: false, error: beyond };
  return { ok: true, value: inflated };
}

/**
 * A zip archive of the given parts, stored without compression, as a list
 * of chunks (the parts' own buffers are not copied). The .xlsx reader is
 * handed this archive of exactly the parts that were checked, so what it
 * parses is what the limits measured, whatever else the original file held.
 */
export function storedZipChunks(parts: ReadonlyMap<string, Buffer>, crc32: (data: Buffer) => number): Buffer[] {
  const chunks: Buffer[] = [];
  const directory: Buffer[] = [];
  let offset = 0;
  for (const [name, data] of parts) {
    const nameBytes = Buffer.from(name, 'utf8');
    const crc = crc32(data) >>> 0;
    const local = Buffer.alloc(30);
    local.writeUInt32LE(LOCAL_HEADER, 0);
    local.writeUInt16LE(20, 4);
    local.writeUInt16LE(0x0800, 6); // names in UTF-8
    local.writeUInt16LE(STORED, 8);
    local.writeUInt32LE(crc, 14);
    local.writeUInt32LE(data.length, 18);
    local.writeUInt32LE(data.length, 22);
    local.writeUInt16LE(nameBytes.length, 26);
    const central = Buffer.alloc(46);
    central.writeUInt32LE(CENTRAL_HEADER, 0);
    central.writeUInt16LE(20, 4);
    central.writeUInt16LE(20, 6);
    central.writeUInt16LE(0x0800, 8);
    central.writeUInt16LE(STORED, 10);
    central.writeUInt32LE(crc, 16);
    central.writeUInt32LE(data.length, 20);
    central.writeUInt32LE(data.length, 24);
    central.writeUInt16LE(nameBytes.length, 28);
    central.writeUInt32LE(offset, 42);
    chunks.push(local, nameBytes, data);
    directory.push(central, nameBytes);
    offset += 30 + nameBytes.length + data.length;
  }
  const directorySize = directory.reduce((sum, chunk) => sum + chunk.length, 0);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(END_OF_CENTRAL_DIRECTORY, 0);
  end.writeUInt16LE(parts.size, 8);
  end.writeUInt16LE(parts.size, 10);
  end.writeUInt32LE(directorySize, 12);
  end.writeUInt32LE(offset, 16);
  return [...chunks, ...directory, end];
}
