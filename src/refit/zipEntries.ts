import type { FileHandle } from 'node:fs/promises';
import { inflateRaw } from 'node:zlib';
import { promisify } from 'node:util';
import { bytesOfFile, CENTRAL_HEADER, END_OF_CENTRAL_DIRECTORY, LOCAL_HEADER, walkZipDirectory, type ZipEntry } from '../documents/zipDirectory.js';

export type { ZipEntry } from '../documents/zipDirectory.js';

/**
 * A bounded reader of zip archives (an .xlsx file is one), through a file
 * handle: nothing is read whole. The directory is walked by the walker the
 * DOCX reader uses (src/documents/zipDirectory.ts: by its records, never by
 * the count the end record claims, and refused when it cannot be walked to
 * its end), reading at most the end of the file, the directory (capped) and
 * each entry's local header; each entry asked for is then read from its own
 * place and inflated with its output capped.
 *
 * Bytes put before the archive are refused here, not followed as the DOCX
 * reader follows them: spreadsheet programs never write them, and such a
 * file has always been refused with the advice to save it again.
 */

export type ZipOutcome<T> = { ok: true; value: T } | { ok: false; error: string };

/** The largest central directory read: about 200,000 entries of 80-byte names; a spreadsheet has a few dozen. */
const MAX_DIRECTORY_BYTES = 16 * 1024 * 1024;

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

/** Every entry of the central directory, walked record by record to its end; or why it cannot be. */
export function readZipDirectory(handle: FileHandle, fileSize: number): ZipOutcome<ZipEntry[]> {
  // The directory's size caps its entries (46 bytes each at least), so no entry count is needed besides.
  const walked = walkZipDirectory(bytesOfFile(handle.fd, fileSize), { maxEntries: Infinity, maxDirectoryBytes: MAX_DIRECTORY_BYTES, followPrependedBytes: false });
  if (walked.ok) return { ok: true, value: walked.entries };
  return { ok: false, error: walked.problem === 'damaged' ? walked.reason : `its zip directory holds more than ${walked.maxEntries} entries` };
}

const inflateRawAsync = promisify(inflateRaw);

/**
 * The bytes of one entry, read from where its walked local header puts it and inflated
 * with the output capped at the size the directory declares: an entry that
 * inflates beyond it is refused after at most that much output, whatever
 * its headers claim. A caller that has checked the declared sizes against
 * a limit is thereby held to the limit.
 */
export async function readZipEntry(handle: FileHandle, entry: ZipEntry): Promise<ZipOutcome<Buffer>> {
  if (entry.method !== STORED && entry.method !== DEFLATED) return { ok: false, error: `its part "${entry.name}" uses compression method ${entry.method}, which is not read` };
  const cap = entry.uncompressedSize;
  const beyond = `its part "${entry.name}" inflates beyond the ${cap.toLocaleString('en-US')} bytes its zip directory declares (a damaged file or a zip bomb)`;
  // Deflate adds at most 5 bytes per 64 KiB block to data it cannot compress: a part compressed to more than that is not one whose output fits the cap.
  if (entry.compressedSize > cap + Math.ceil(cap / 16_384) + 1024) {
    return { ok: false, error: beyond };
  }
  // The walk checked the local header and that the data ends inside the file.
  const data = await readAt(handle, entry.dataStart, entry.compressedSize);
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
