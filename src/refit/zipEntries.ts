import type { FileHandle } from 'node:fs/promises';
import { inflateRaw } from 'node:zlib';
import { promisify } from 'node:util';
import { bytesOfFile, type ZipEntry } from '../documents/zipDirectory.js';
import { cannotInflate, compressedBeyondDeclared, inflatesBeyond, methodNotRead, STORED, DEFLATED, xlsxDirectory, type ZipOutcome } from './zipParts.js';

export type { ZipEntry } from '../documents/zipDirectory.js';
export { storedZipChunks, type ZipOutcome } from './zipParts.js';

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
  return xlsxDirectory(bytesOfFile(handle.fd, fileSize));
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
  if (entry.method !== STORED && entry.method !== DEFLATED) return { ok: false, error: methodNotRead(entry) };
  const cap = entry.uncompressedSize;
  const beyond = inflatesBeyond(entry);
  if (compressedBeyondDeclared(entry)) return { ok: false, error: beyond };
  // The walk checked the local header and that the data ends inside the file.
  const data = await readAt(handle, entry.dataStart, entry.compressedSize);
  if (entry.method === STORED) return { ok: true, value: data };
  let inflated: Buffer;
  try {
    inflated = await inflateRawAsync(data, { maxOutputLength: Math.max(1, cap + 1) });
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'ERR_BUFFER_TOO_LARGE' || error instanceof RangeError) return { ok: false, error: beyond };
    return { ok: false, error: cannotInflate(entry, (error as Error).message) };
  }
  if (inflated.length > cap) return { ok: false, error: beyond };
  return { ok: true, value: inflated };
}
