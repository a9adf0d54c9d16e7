import { createInflateRaw } from 'node:zlib';
import { formatMb, limitHint, MB, type Limits } from '../limits.js';
import { DocumentLimitError } from './markupLimits.js';
import { bytesInMemory, walkZipDirectory, type ZipEntry } from './zipDirectory.js';

/**
 * The zip reader of DOCX files, bounded before it allocates. mammoth reads
 * the parts of a DOCX through the archive this module opens (mammoth's
 * `{ file }` input: `exists(name)` and `read(name, encoding)`), so what is
 * checked here is exactly what mammoth reads; no other zip reader sees the
 * file.
 *
 * 1. The central directory is walked entry by entry from where it starts
 *    until its entries end, by zipDirectory.ts (the walker the XLSX reader
 *    uses too): the end record's entry count is not trusted (a count of 0
 *    or 1 must not hide the entries after it), bytes put before the first
 *    entry without shifting the offsets (self-extracting archives do this)
 *    are followed by the shift the end record's position reveals, as zip
 *    readers do, and a directory that cannot be walked (no entry where the
 *    end record places it, an entry whose data is not where it says, or
 *    that runs past the file) is refused with the reason ("damaged DOCX:
 *    ..."): it is not guessed at.
 * 2. Before anything is inflated: at most `maxZipEntries` entries, each
 *    declaring at most `maxUnzippedEntryMb`, all together at most
 *    `maxUnzippedMb`.
 * 3. A part is inflated only when mammoth reads it, as a stream whose bytes
 *    are counted as they come out: inflating stops past the part's declared
 *    size (a part that lies about its size), past `maxUnzippedEntryMb`, or
 *    when all the parts read so far pass `maxUnzippedMb`.
 * 4. While a part that is read as text (the XML parts) is inflated, its XML
 *    nodes (elements, attributes, runs of text) are counted; past
 *    `maxDocxXmlNodes` for all the parts read, inflating stops. mammoth
 *    parses each part into a tree at 1 to 3 KB a node, so a few hundred
 *    kilobytes of "<w:p/>" repeated would otherwise take gigabytes.
 *
 * Every refusal is a DocumentLimitError (a limit, with its name and how to
 * raise it) or a ZipFormatError (an archive that cannot be read as a zip).
 */

export type ZipLimits = Pick<Limits, 'maxUnzippedMb' | 'maxUnzippedEntryMb' | 'maxZipEntries' | 'maxDocxXmlNodes'>;

/** A zip archive that cannot be walked or read: damaged, cut short, or made to mislead. */
export class ZipFormatError extends Error {}

const DEFLATE = 8;
const STORED = 0;
/** Output chunks of the inflater: the counts are checked after each. */
const INFLATE_CHUNK = 64 * 1024;

/**
 * Opens a DOCX's zip archive within the limits; the archive inflates each
 * part only when it is read. Returns the reason when the archive cannot be
 * walked or declares too much.
 */
export function openZip(bytes: Uint8Array, limits: ZipLimits): { ok: true; archive: BoundedZip } | { ok: false; error: string } {
  const buffer = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  // In memory already: the directory is a view of these bytes, so only the entry count bounds the walk.
  const walked = walkZipDirectory(bytesInMemory(buffer), { maxEntries: limits.maxZipEntries, maxDirectoryBytes: Infinity, followPrependedBytes: true });
  if (!walked.ok && walked.problem === 'damaged') return { ok: false, error: `damaged DOCX: ${walked.reason}` };
  if (!walked.ok) {
    return { ok: false, error: `the DOCX's zip directory holds more than ${walked.maxEntries.toLocaleString('en-US')} entries ${limitHint('maxZipEntries', walked.maxEntries)}` };
  }
  const entries = walked.entries;
  let declared = 0;
  for (const entry of entries) {
    if (entry.uncompressedSize > limits.maxUnzippedEntryMb * MB) {
      return { ok: false, error: `the DOCX part "${entry.name}" would expand to ${formatMb(entry.uncompressedSize)} when unzipped (a zip bomb?) ${limitHint('maxUnzippedEntryMb', limits.maxUnzippedEntryMb)}` };
    }
    declared += entry.uncompressedSize;
  }
  if (declared > limits.maxUnzippedMb * MB) {
    return { ok: false, error: `the DOCX would expand to ${formatMb(declared)} when unzipped (a zip bomb?) ${limitHint('maxUnzippedMb', limits.maxUnzippedMb)}` };
  }
  return { ok: true, archive: new BoundedZip(buffer, entries, limits) };
}

/**
 * A walked archive, read part by part within the limits. Its `exists` and
 * `read` are what mammoth asks of a zip file (mammoth's lib/zipfile.js):
 * `read(name, encoding)` gives the part decoded with that encoding, or its
 * bytes without one.
 */
export class BoundedZip {
  private readonly byName = new Map<string, ZipEntry>();
  private inflatedTotal = 0;
  private nodesTotal = 0;
  /** The first refusal: once a limit is passed, every part still inflating stops. */
  private refusal: Error | null = null;

  constructor(
    private readonly buffer: Buffer,
    entries: readonly ZipEntry[],
    private readonly limits: ZipLimits,
  ) {
    // A name given twice is the later entry, as zip readers take it.
    for (const entry of entries) if (!entry.name.endsWith('/')) this.byName.set(entry.name, entry);
  }

  /** The names of the entries that are files. */
  names(): string[] {
    return [...this.byName.keys()];
  }

  exists(name: string): boolean {
    return this.byName.has(name);
  }

  async read(name: string, encoding?: string): Promise<string | Uint8Array> {
    const entry = this.byName.get(name);
    if (entry === undefined) throw new ZipFormatError(`the DOCX has no part "${name}"`);
    const bytes = await this.inflate(entry, encoding !== undefined && encoding !== 'base64');
    if (encoding === 'base64') return bytes.toString('base64');
    if (encoding) return new TextDecoder(encoding).decode(bytes);
    return new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  }

  /** Never used to convert a document; mammoth's interface has it (for embedding a style map). */
  write(): void {
    throw new Error('the DOCX is read only');
  }

  /** The bytes of a part, inflated within the limits (its XML nodes counted when `xml`). */
  private inflate(entry: ZipEntry, xml: boolean): Promise<Buffer> {
    if (this.refusal !== null) return Promise.reject(this.refusal);
    if (entry.flags & 1) return Promise.reject(new ZipFormatError(`the DOCX part "${entry.name}" is encrypted; save the document without a password and read that`));
    const data = this.buffer.subarray(entry.dataStart, entry.dataStart + entry.compressedSize);
    const counter = xml ? new XmlNodeCounter() : null;
    // An empty part written as deflated, with no data at all: zip readers give it as empty.
    if (entry.method === STORED || (entry.method === DEFLATE && entry.compressedSize === 0)) {
      const failure = this.count(entry, data.length, data.length) ?? (counter === null ? null : this.countNodes(entry, counter, data, true));
      return failure === null ? Promise.resolve(data) : Promise.reject(this.refuse(failure));
    }
    if (entry.method !== DEFLATE) {
      return Promise.reject(new ZipFormatError(`the DOCX part "${entry.name}" is compressed with method ${entry.method}, which a DOCX does not use (only stored and deflated parts are read)`));
    }
    return new Promise((resolve, reject) => {
      const inflater = createInflateRaw({ chunkSize: INFLATE_CHUNK });
      const chunks: Buffer[] = [];
      let size = 0;
      let settled = false;
      const fail = (error: Error): void => {
        if (settled) return;
        settled = true;
        chunks.length = 0;
        inflater.destroy();
        reject(error);
      };
      inflater.on('data', (chunk: Buffer) => {
        if (settled) return;
        const failure = this.refusal ?? this.count(entry, size + chunk.length, chunk.length) ?? (counter === null ? null : this.countNodes(entry, counter, chunk, false));
        if (failure !== null) return fail(this.refuse(failure));
        size += chunk.length;
        chunks.push(chunk);
      });
      inflater.on('error', (error) => fail(new ZipFormatError(`damaged DOCX: the part "${entry.name}" cannot be inflated (${error.message})`)));
      inflater.on('end', () => {
        if (settled) return;
        const failure = counter === null ? null : this.countNodes(entry, counter, Buffer.alloc(0), true);
        if (failure !== null) return fail(this.refuse(failure));
        settled = true;
        resolve(Buffer.concat(chunks, size));
      });
      inflater.end(data);
    });
  }

  /** Adds `added` inflated bytes (the part now at `partSize`); the refusal when a size limit is passed. */
  private count(entry: ZipEntry, partSize: number, added: number): Error | null {
    if (partSize > entry.uncompressedSize) {
      return new DocumentLimitError(
        `the DOCX part "${entry.name}" expands beyond the ${formatMb(entry.uncompressedSize)} its zip directory declares (a zip bomb?) ${limitHint('maxUnzippedMb', this.limits.maxUnzippedMb)}`,
      );
    }
    // The declared sizes were checked against both limits; these hold for parts whose sizes were not declared honestly.
    if (partSize > this.limits.maxUnzippedEntryMb * MB) {
      return new DocumentLimitError(`the DOCX part "${entry.name}" expands beyond ${formatMb(this.limits.maxUnzippedEntryMb * MB)} (a zip bomb?) ${limitHint('maxUnzippedEntryMb', this.limits.maxUnzippedEntryMb)}`);
    }
    this.inflatedTotal += added;
    if (this.inflatedTotal > this.limits.maxUnzippedMb * MB) {
      return new DocumentLimitError(`the DOCX expands beyond ${formatMb(this.limits.maxUnzippedMb * MB)} when unzipped (a zip bomb?) ${limitHint('maxUnzippedMb', this.limits.maxUnzippedMb)}`);
    }
    return null;
  }

  private countNodes(entry: ZipEntry, counter: XmlNodeCounter, chunk: Buffer, last: boolean): Error | null {
    const before = counter.count;
    counter.feed(chunk);
    if (last) counter.finish();
    this.nodesTotal += counter.count - before;
    if (this.nodesTotal <= this.limits.maxDocxXmlNodes) return null;
    const limit = this.limits.maxDocxXmlNodes.toLocaleString('en-US');
    return new DocumentLimitError(
      `too many elements: the XML read from this DOCX passes ${limit} nodes (elements, attributes and runs of text) in the part "${entry.name}" (a payload of tiny elements?) ${limitHint('maxDocxXmlNodes', this.limits.maxDocxXmlNodes)}`,
    );
  }

  private refuse(error: Error): Error {
    this.refusal ??= error;
    return this.refusal;
  }
}

/**
 * Counts the nodes of XML as its bytes go by, in constant memory: each
 * start tag (an element), each attribute (an "=" inside a start tag, out of
 * quotes) and each run of text between tags (whitespace included: a parser
 * keeps it as a text node). End tags, comments, processing instructions and
 * declarations are not counted. Markup split between chunks is followed
 * across them. Not a parser: it only bounds what a parser would build.
 */
export class XmlNodeCounter {
  count = 0;
  private state: 'text' | 'open' | 'tag' | 'double' | 'single' | 'skip' = 'text';
  private textPending = false;

  feed(bytes: Uint8Array): void {
    let { state, textPending, count } = this;
    for (let index = 0; index < bytes.length; index++) {
      const byte = bytes[index]!;
      switch (state) {
        case 'text':
          if (byte === 0x3c /* < */) {
            if (textPending) count++;
            textPending = false;
            state = 'open';
          } else textPending = true;
          break;
        case 'open':
          if (byte === 0x2f /* / */ || byte === 0x21 /* ! */ || byte === 0x3f /* ? */) state = 'skip';
          else {
            count++;
            state = byte === 0x3e /* > */ ? 'text' : 'tag';
          }
          break;
        case 'tag':
          if (byte === 0x22 /* " */) state = 'double';
          else if (byte === 0x27 /* ' */) state = 'single';
          else if (byte === 0x3d /* = */) count++;
          else if (byte === 0x3e /* > */) state = 'text';
          break;
        case 'double':
          if (byte === 0x22) state = 'tag';
          break;
        case 'single':
          if (byte === 0x27) state = 'tag';
          break;
        case 'skip':
          if (byte === 0x3e) state = 'text';
          break;
      }
    }
    this.state = state;
    this.textPending = textPending;
    this.count = count;
  }

  /** Counts text after the last tag. */
  finish(): void {
    if (this.textPending) this.count++;
    this.textPending = false;
  }
}
