import { inflateRawSync } from 'node:zlib';
import { formatMb, limitHint, MB } from '../limits.js';

/**
 * Guards against zip bombs before a DOCX reaches mammoth, which inflates
 * whole parts in memory: a part of a few kilobytes may expand to gigabytes.
 *
 * Two steps, both bounded by the limit `maxUnzippedMb`:
 * 1. The central directory's declared uncompressed sizes are added up
 *    (zip64 sizes included); above the limit the file is refused without
 *    inflating anything.
 * 2. Each entry is inflated with zlib's output capped at its declared size
 *    (and at what is left of the limit), so an entry that lies about its size
 *    is caught after at most the limit's worth of output, not after it has
 *    filled memory.
 *
 * Returns null when the archive is within the limit, or the reason it is not.
 * An archive this reader cannot parse is left to mammoth, which reports it.
 */
export function checkZipExpansion(bytes: Uint8Array, maxUnzippedMb: number): string | null {
  const buffer = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const limit = maxUnzippedMb * MB;
  const entries = readCentralDirectory(buffer);
  if (entries === null) return null;
  let declared = 0;
  for (const entry of entries) declared += entry.uncompressedSize;
  if (declared > limit) {
    return `the DOCX would expand to ${formatMb(declared)} when unzipped (a zip bomb?) ${limitHint('maxUnzippedMb', maxUnzippedMb)}`;
  }
  let inflated = 0;
  for (const entry of entries) {
    if (entry.method !== DEFLATE) continue; // stored entries are as large as they look
    const data = entryData(buffer, entry);
    if (data === null) continue;
    const cap = Math.min(entry.uncompressedSize, limit - inflated);
    let size: number;
    try {
      size = inflateRawSync(data, { maxOutputLength: Math.max(1, cap + 1) }).length;
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === 'ERR_BUFFER_TOO_LARGE' || error instanceof RangeError) {
        return `the DOCX part "${entry.name}" expands beyond the ${formatMb(entry.uncompressedSize)} its zip directory declares (a zip bomb?) ${limitHint('maxUnzippedMb', maxUnzippedMb)}`;
      }
      continue; // damaged data: mammoth will say so
    }
    if (size > cap) {
      return `the DOCX part "${entry.name}" expands beyond the ${formatMb(entry.uncompressedSize)} its zip directory declares (a zip bomb?) ${limitHint('maxUnzippedMb', maxUnzippedMb)}`;
    }
    inflated += size;
  }
  return null;
}

const DEFLATE = 8;
const END_OF_CENTRAL_DIRECTORY = 0x06054b50;
const ZIP64_LOCATOR = 0x07064b50;
const ZIP64_END = 0x06064b50;
const CENTRAL_HEADER = 0x02014b50;
const LOCAL_HEADER = 0x04034b50;

interface ZipEntry {
  name: string;
  method: number;
  compressedSize: number;
  uncompressedSize: number;
  localHeaderOffset: number;
}

/** The entries of the central directory, or null when the archive's end records cannot be found or read. */
function readCentralDirectory(buffer: Buffer): ZipEntry[] | null {
  // The end record is in the last 22 + 65535 bytes (its comment is at most 65535 bytes).
  const lowest = Math.max(0, buffer.length - 22 - 0xffff);
  let end = -1;
  for (let at = buffer.length - 22; at >= lowest; at--) {
    if (buffer.readUInt32LE(at) === END_OF_CENTRAL_DIRECTORY) {
      end = at;
      break;
    }
  }
  if (end === -1) return null;
  let count = buffer.readUInt16LE(end + 10);
  let directorySize = buffer.readUInt32LE(end + 12);
  let directoryOffset = buffer.readUInt32LE(end + 16);
  if ((count === 0xffff || directoryOffset === 0xffffffff || directorySize === 0xffffffff) && end >= 20 && buffer.readUInt32LE(end - 20) === ZIP64_LOCATOR) {
    const zip64End = Number(buffer.readBigUInt64LE(end - 20 + 8));
    if (zip64End + 56 > buffer.length || buffer.readUInt32LE(zip64End) !== ZIP64_END) return null;
    count = Number(buffer.readBigUInt64LE(zip64End + 32));
    directorySize = Number(buffer.readBigUInt64LE(zip64End + 40));
    directoryOffset = Number(buffer.readBigUInt64LE(zip64End + 48));
  }
  if (directoryOffset + directorySize > buffer.length) return null;
  const entries: ZipEntry[] = [];
  let at = directoryOffset;
  for (let index = 0; index < count; index++) {
    if (at + 46 > buffer.length || buffer.readUInt32LE(at) !== CENTRAL_HEADER) return entries.length > 0 ? entries : null;
    const nameLength = buffer.readUInt16LE(at + 28);
    const extraLength = buffer.readUInt16LE(at + 30);
    const commentLength = buffer.readUInt16LE(at + 32);
    const entry: ZipEntry = {
      name: buffer.toString('utf8', at + 46, Math.min(buffer.length, at + 46 + nameLength)),
      method: buffer.readUInt16LE(at + 10),
      compressedSize: buffer.readUInt32LE(at + 20),
      uncompressedSize: buffer.readUInt32LE(at + 24),
      localHeaderOffset: buffer.readUInt32LE(at + 42),
    };
    readZip64Extra(buffer, at + 46 + nameLength, extraLength, entry);
    entries.push(entry);
    at += 46 + nameLength + extraLength + commentLength;
  }
  return entries;
}

/** Sizes and offsets of 0xFFFFFFFF are in the zip64 extra field (id 1), in this order, each only when needed. */
function readZip64Extra(buffer: Buffer, from: number, length: number, entry: ZipEntry): void {
  const to = Math.min(buffer.length, from + length);
  for (let at = from; at + 4 <= to; ) {
    const id = buffer.readUInt16LE(at);
    const size = buffer.readUInt16LE(at + 2);
    if (id === 1) {
      let field = at + 4;
      const next = (): number | null => {
        if (field + 8 > Math.min(to, at + 4 + size)) return null;
        const value = Number(buffer.readBigUInt64LE(field));
        field += 8;
        return value;
      };
      if (entry.uncompressedSize === 0xffffffff) entry.uncompressedSize = next() ?? Number.MAX_SAFE_INTEGER;
      if (entry.compressedSize === 0xffffffff) entry.compressedSize = next() ?? Number.MAX_SAFE_INTEGER;
      if (entry.localHeaderOffset === 0xffffffff) entry.localHeaderOffset = next() ?? Number.MAX_SAFE_INTEGER;
      return;
    }
    at += 4 + size;
  }
  // A zip64 marker without its extra field: take the size as unknown and large.
  if (entry.uncompressedSize === 0xffffffff) entry.uncompressedSize = Number.MAX_SAFE_INTEGER;
}

/** The compressed bytes of an entry, or null when its local header is not where the directory says. */
function entryData(buffer: Buffer, entry: ZipEntry): Buffer | null {
  const at = entry.localHeaderOffset;
  if (at + 30 > buffer.length || buffer.readUInt32LE(at) !== LOCAL_HEADER) return null;
  const start = at + 30 + buffer.readUInt16LE(at + 26) + buffer.readUInt16LE(at + 28);
  if (start > buffer.length) return null;
  return buffer.subarray(start, Math.min(buffer.length, start + entry.compressedSize));
}
