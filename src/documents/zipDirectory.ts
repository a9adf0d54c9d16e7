import { readSync } from 'node:fs';
import { crc32 } from 'node:zlib';

/**
 * The one walker of zip central directories, for the DOCX reader (a file
 * already in memory, src/documents/zipGuard.ts) and the XLSX reader (a file
 * read through its descriptor, src/refit/zipEntries.ts). Both formats are
 * zip archives that a reader other than plumbline's would otherwise list
 * in its own way; this module decides, once, which entries an archive
 * holds and where each one's data is, before anything is inflated.
 *
 * 1. The end record is found in the last 22 + 65,535 bytes (the record and
 *    the longest comment); when a field overflows and a zip64 locator is
 *    there, the zip64 end record gives the directory instead.
 * 2. The directory is walked record by record from where it starts until
 *    its records end. The entry count the end record claims is never used:
 *    a count of 0 or 1 hid the entries after it from an earlier guard while
 *    the zip reader behind it read them all.
 * 3. Bytes put before the first entry without shifting the offsets (as
 *    self-extracting archives do) move the directory and every entry by
 *    the same amount, which the end record's position reveals (it ends
 *    where the directory's declared size, counted back, begins). A reader
 *    that takes such archives (`followPrependedBytes`) follows the shift as
 *    zip readers do; one that does not refuses them.
 * 4. Every entry's local header is checked where the directory (and the
 *    shift) places it, and its data must end inside the file.
 * 5. What cannot be walked is refused with the reason, never guessed at; a
 *    directory of more entries or more bytes than the caller allows is
 *    refused before the entries are listed.
 *
 * Nothing is inflated here, and little is read: the end of the file, the
 * directory (capped), and 30 bytes of each entry's local header.
 *
 * ## References
 * - PKWARE, APPNOTE.TXT: .ZIP File Format Specification, version 6.3.10
 *   (2022): sections 4.3.7 (local file header), 4.3.12 (central directory
 *   header), 4.3.14-4.3.16 (zip64 end records, end of central directory),
 *   4.5.3 (zip64 extended information extra field), 4.6.9 (Info-ZIP
 *   Unicode path extra field).
 */

/** Random access to an archive's bytes; a read returns fewer bytes than asked only at the end of the file. */
export interface ZipBytes {
  readonly size: number;
  read(position: number, length: number): Buffer;
}

/** An archive held in memory: reads are views of it, nothing is copied. */
export function bytesInMemory(buffer: Buffer): ZipBytes {
  return { size: buffer.length, read: (position, length) => buffer.subarray(position, position + length) };
}

/**
 * An archive read through an open file descriptor, `size` bytes long.
 * Synchronous: the walk reads the end, the directory and a few bytes per
 * entry, and a walk that is one sequence of plain functions is easier to
 * follow than one that awaits at every step.
 */
export function bytesOfFile(descriptor: number, size: number): ZipBytes {
  return {
    size,
    read(position, length) {
      const wanted = Math.max(0, Math.min(length, size - position));
      const buffer = Buffer.alloc(wanted);
      let done = 0;
      while (done < wanted) {
        const read = readSync(descriptor, buffer, done, wanted - done, position + done);
        if (read === 0) break;
        done += read;
      }
      return done === wanted ? buffer : buffer.subarray(0, done);
    },
  };
}

export interface ZipEntry {
  name: string;
  /** 0 stored, 8 deflated; the readers refuse other methods when the entry is read. */
  method: number;
  /** General-purpose flags (bit 0: encrypted). */
  flags: number;
  compressedSize: number;
  /** As the directory declares it (a bomb may lie: the readers count what inflating gives). */
  uncompressedSize: number;
  /** Where the entry's data starts in the file, after its local header (shift included). */
  dataStart: number;
}

export interface WalkOptions {
  /** Most entries listed; past it the walk stops with `too many entries`. */
  maxEntries: number;
  /** Most bytes of directory read; an archive in memory needs no cap (Infinity). */
  maxDirectoryBytes: number;
  /** Follow bytes put before the first entry (true), or refuse such an archive (false). */
  followPrependedBytes: boolean;
}

/**
 * The entries, or why there are none: `damaged` with a reason that reads
 * after "the file" ("its zip directory cannot be walked: ..."), or more
 * entries than allowed.
 */
export type DirectoryOutcome =
  | { ok: true; entries: ZipEntry[] }
  | { ok: false; problem: 'damaged'; reason: string }
  | { ok: false; problem: 'too many entries'; maxEntries: number };

export const LOCAL_HEADER = 0x04034b50;
export const CENTRAL_HEADER = 0x02014b50;
export const END_OF_CENTRAL_DIRECTORY = 0x06054b50;
const ZIP64_LOCATOR = 0x07064b50;
const ZIP64_END = 0x06064b50;
const END_RECORD_BYTES = 22;
const LONGEST_COMMENT = 0xffff;
const CENTRAL_HEADER_BYTES = 46;
const LOCAL_HEADER_BYTES = 30;
const ZIP64_END_BYTES = 56;
const ZIP64_LOCATOR_BYTES = 20;

/** A walk that cannot go on; turned into a `damaged` outcome by walkZipDirectory. */
class Unwalkable extends Error {}

class TooManyEntries extends Error {}

/** Lists an archive's entries by walking its central directory (see the module's comment). */
export function walkZipDirectory(bytes: ZipBytes, options: WalkOptions): DirectoryOutcome {
  try {
    return { ok: true, entries: walk(bytes, options) };
  } catch (error) {
    if (error instanceof Unwalkable) return { ok: false, problem: 'damaged', reason: error.message };
    if (error instanceof TooManyEntries) return { ok: false, problem: 'too many entries', maxEntries: options.maxEntries };
    throw error;
  }
}

function walk(bytes: ZipBytes, options: WalkOptions): ZipEntry[] {
  const bounds = directoryBounds(bytes);
  const start = directoryStart(bytes, bounds, options.followPrependedBytes);
  // Bytes before the first entry move every local header by as much as they move the directory.
  const shift = start - bounds.declaredOffset;
  if (bounds.end - start > options.maxDirectoryBytes) {
    throw new Unwalkable(`its zip directory takes ${number(bounds.end - start)} bytes, more than the ${number(options.maxDirectoryBytes)} read from such a file`);
  }
  const directory = bytes.read(start, bounds.end - start);
  const entries: ZipEntry[] = [];
  for (let at = 0; at + 4 <= directory.length && directory.readUInt32LE(at) === CENTRAL_HEADER; ) {
    if (entries.length >= options.maxEntries) throw new TooManyEntries();
    const record = centralRecord(directory, at, start);
    entries.push(locatedEntry(bytes, record, shift));
    at = record.next;
  }
  if (entries.length === 0) throw new Unwalkable('its zip directory holds no entries');
  return entries;
}

// ---------------------------------------------------------------------------
// Where the directory is
// ---------------------------------------------------------------------------

/** Where the directory ends (the zip64 end record, or the end record) and where and how long the end record says it is. */
export interface DirectoryBounds {
  end: number;
  declaredOffset: number;
  declaredSize: number;
}

/** The place of the last end record in `tail` (the file's last bytes), or -1. */
export function lastEndRecord(tail: Buffer): number {
  for (let at = tail.length - END_RECORD_BYTES; at >= 0; at--) if (tail.readUInt32LE(at) === END_OF_CENTRAL_DIRECTORY) return at;
  return -1;
}

/** Reads the end record (and the zip64 end record when a field overflows and a locator is there). */
export function directoryBounds(bytes: ZipBytes): DirectoryBounds {
  const tailStart = Math.max(0, bytes.size - END_RECORD_BYTES - LONGEST_COMMENT);
  const tail = bytes.read(tailStart, bytes.size - tailStart);
  const inTail = lastEndRecord(tail);
  // A file shorter than an end record has none either.
  if (inTail === -1) throw new Unwalkable('it is not a zip archive, or it was cut short: it has no end of central directory record, so its directory cannot be found');
  const end = tailStart + inTail;
  const record = tail.subarray(inTail, inTail + END_RECORD_BYTES);
  const count = record.readUInt16LE(10);
  const size = record.readUInt32LE(12);
  const offset = record.readUInt32LE(16);
  const overflows = count === 0xffff || size === 0xffffffff || offset === 0xffffffff;
  // Without a locator an overflowing count is only a count (never used); the offset and size are taken as written.
  if (!overflows || end < ZIP64_LOCATOR_BYTES || bytes.read(end - ZIP64_LOCATOR_BYTES, 4).readUInt32LE(0) !== ZIP64_LOCATOR) {
    return { end, declaredSize: size, declaredOffset: offset };
  }
  return zip64Bounds(bytes, end);
}

/** The zip64 end record: where its locator says, or right before the locator (where bytes put before the archive move it). */
function zip64Bounds(bytes: ZipBytes, end: number): DirectoryBounds {
  const locator = end - ZIP64_LOCATOR_BYTES;
  const declared = Number(bytes.read(locator + 8, 8).readBigUInt64LE(0));
  for (const at of [declared, locator - ZIP64_END_BYTES]) {
    if (at < 0 || at + ZIP64_END_BYTES > bytes.size) continue;
    const record = bytes.read(at, ZIP64_END_BYTES);
    if (record.readUInt32LE(0) === ZIP64_END) {
      return { end: at, declaredSize: Number(record.readBigUInt64LE(40)), declaredOffset: Number(record.readBigUInt64LE(48)) };
    }
  }
  throw new Unwalkable('its zip64 end record is missing, so its directory cannot be found');
}

/**
 * Where the walk starts: where the end record places the directory, or,
 * when bytes were put before the archive and `follow` allows it, where the
 * directory's declared size counted back from its end places it.
 */
export function directoryStart(bytes: ZipBytes, bounds: DirectoryBounds, follow: boolean): number {
  const isHeader = (at: number): boolean => at >= 0 && at + CENTRAL_HEADER_BYTES <= bounds.end && bytes.read(at, 4).readUInt32LE(0) === CENTRAL_HEADER;
  if (isHeader(bounds.declaredOffset)) return bounds.declaredOffset;
  const shifted = bounds.end - bounds.declaredSize;
  if (follow && isHeader(shifted)) return shifted;
  throw new Unwalkable(`its zip directory cannot be walked: the end record places it at byte ${number(bounds.declaredOffset)}, where no directory entry starts`);
}

// ---------------------------------------------------------------------------
// The records
// ---------------------------------------------------------------------------

/** One central directory record as written, with where the next one starts. */
export interface CentralRecord {
  name: string;
  method: number;
  flags: number;
  compressedSize: number;
  uncompressedSize: number;
  localHeaderOffset: number;
  /** Offset of the next record in the directory. */
  next: number;
}

/** The record at `at` of `directory` (which starts at byte `base` of the file); it must end inside the directory. */
export function centralRecord(directory: Buffer, at: number, base: number): CentralRecord {
  const runsPast = () => new Unwalkable(`the zip directory entry at byte ${number(base + at)} runs past the directory's end`);
  if (at + CENTRAL_HEADER_BYTES > directory.length) throw runsPast();
  const flags = directory.readUInt16LE(at + 8);
  const nameLength = directory.readUInt16LE(at + 28);
  const extraLength = directory.readUInt16LE(at + 30);
  const commentLength = directory.readUInt16LE(at + 32);
  const next = at + CENTRAL_HEADER_BYTES + nameLength + extraLength + commentLength;
  if (next > directory.length) throw runsPast();
  const rawName = directory.subarray(at + CENTRAL_HEADER_BYTES, at + CENTRAL_HEADER_BYTES + nameLength);
  const extra = directory.subarray(at + CENTRAL_HEADER_BYTES + nameLength, at + CENTRAL_HEADER_BYTES + nameLength + extraLength);
  const sizes = zip64Sizes(extra, {
    compressedSize: directory.readUInt32LE(at + 20),
    uncompressedSize: directory.readUInt32LE(at + 24),
    localHeaderOffset: directory.readUInt32LE(at + 42),
  });
  return { name: entryName(rawName, flags, extra), method: directory.readUInt16LE(at + 10), flags, ...sizes, next };
}

/** The entry of a record, its local header checked where the directory (moved by `shift`) places it. */
function locatedEntry(bytes: ZipBytes, record: CentralRecord, shift: number): ZipEntry {
  const local = record.localHeaderOffset + shift;
  const header = local >= 0 && local + LOCAL_HEADER_BYTES <= bytes.size ? bytes.read(local, LOCAL_HEADER_BYTES) : null;
  if (header === null || header.readUInt32LE(0) !== LOCAL_HEADER) {
    throw new Unwalkable(`the zip entry "${record.name}" is not where its directory says (byte ${number(local)})`);
  }
  // The local header's own name and extra lengths (which may differ from the directory's) decide where the data starts.
  const dataStart = local + LOCAL_HEADER_BYTES + header.readUInt16LE(26) + header.readUInt16LE(28);
  if (dataStart + record.compressedSize > bytes.size) throw new Unwalkable(`the zip entry "${record.name}" runs past the end of the file (cut short?)`);
  const { name, method, flags, compressedSize, uncompressedSize } = record;
  return { name, method, flags, compressedSize, uncompressedSize, dataStart };
}

interface EntrySizes {
  compressedSize: number;
  uncompressedSize: number;
  localHeaderOffset: number;
}

/**
 * Sizes and offsets written as 0xFFFFFFFF are in the zip64 extra field
 * (id 1), in this order, each only when needed. One that is missing there
 * is unknown: taken as too large to be anything (a size then passes every
 * limit and the end of the file; an offset finds no local header).
 */
export function zip64Sizes(extra: Buffer, written: EntrySizes): EntrySizes {
  const sizes = { ...written };
  const field = zip64Field(extra);
  let at = 0;
  const next = (): number => {
    if (field === null || at + 8 > field.length) return Number.MAX_SAFE_INTEGER;
    const value = Number(field.readBigUInt64LE(at));
    at += 8;
    return value;
  };
  if (sizes.uncompressedSize === 0xffffffff) sizes.uncompressedSize = next();
  if (sizes.compressedSize === 0xffffffff) sizes.compressedSize = next();
  if (sizes.localHeaderOffset === 0xffffffff) sizes.localHeaderOffset = next();
  return sizes;
}

/** The first extra field `id`: its data (cut at the extra's end) and whether it was whole; or null. */
function extraField(extra: Buffer, id: number): { data: Buffer; whole: boolean } | null {
  for (let at = 0; at + 4 <= extra.length; ) {
    const size = extra.readUInt16LE(at + 2);
    if (extra.readUInt16LE(at) === id) return { data: extra.subarray(at + 4, at + 4 + size), whole: at + 4 + size <= extra.length };
    at += 4 + size;
  }
  return null;
}

/** The zip64 field's data; a field cut short still gives the values it holds whole. */
function zip64Field(extra: Buffer): Buffer | null {
  return extraField(extra, 0x0001)?.data ?? null;
}

/**
 * An entry's name as zip readers (JSZip, which mammoth used) give it: UTF-8
 * when the entry says so (flag bit 11), else from a Unicode path extra field
 * (0x7075) that matches the name, else one character per byte.
 */
export function entryName(raw: Buffer, flags: number, extra: Buffer): string {
  if (flags & 0x800) return raw.toString('utf8');
  // Version 1, then the CRC-32 of the name it replaces (a field left from before a rename does not match), then the name.
  const unicode = extraField(extra, 0x7075);
  if (unicode !== null && unicode.whole && unicode.data.length >= 5 && unicode.data[0] === 1 && unicode.data.readUInt32LE(1) === crc32(raw)) {
    return unicode.data.toString('utf8', 5);
  }
  return raw.toString('latin1');
}

function number(value: number): string {
  return value.toLocaleString('en-US');
}
