import { constants, createInflateRaw, inflateRawSync } from 'node:zlib';
import { formatMb, limitHint, MB, type Limits } from '../limits.js';
import { streamDecryption, type Decryption } from './pdfCrypt.js';
import { isDict, isRegular, nameOf, parseObject, PdfRef, skipSpace, type Parsed, type PdfDict, type PdfValue } from './pdfObjects.js';

/**
 * The decoded size of a PDF's streams, checked before either engine reads
 * the PDF. pdf.js (inside pdf-parse) decodes a stream whole into one
 * growing buffer, outside the JavaScript heap's limit, and poppler
 * (pdftotext) reads it through: a 4 MB PDF whose page content inflates to
 * 4 GB of spaces drove pdf-parse to 6 GB and kept pdftotext busy for 90 s.
 *
 * Every stream in the file is found from its "stream" keyword (not from the
 * cross-reference table, which may leave streams out or point into other
 * streams), its dictionary read back from its "N G obj", and its filters
 * applied here in order with the output counted as it comes, never kept
 * beyond what the next filter needs: FlateDecode (zlib, with the zlib header
 * checked as pdf.js checks it), LZWDecode (pdf.js's algorithm),
 * RunLengthDecode, ASCII85Decode and ASCIIHexDecode; a DCTDecode image
 * counts as its pixels (width x height x components from its frame header).
 * JPX, JBIG2 and CCITT images are not decoded: the engines decode them only
 * to draw images, which text extraction never does. A filter no engine
 * knows passes the data on unchanged, as pdf.js does, to the next one. Encrypted PDFs are
 * decrypted first (pdfCrypt.ts) when they open with the empty user
 * password; one that needs a password is left to the engines, which refuse
 * it without decoding anything.
 *
 * Refused: a stream that decodes to more than `maxPdfStreamMb`, or streams
 * that decode to more than `maxPdfDecodedMb` together. A Flate stream that
 * zlib finds damaged part-way counts as what it gave plus the most its
 * remaining bytes could give (1,032 bytes a byte: pdf.js decodes on past
 * some errors that stop zlib).
 *
 * Work and memory are bounded by the limits: decoding stops at the first
 * byte past one, and a filter's output is kept only to feed the next.
 */

export type PdfStreamLimits = Pick<Limits, 'maxPdfStreamMb' | 'maxPdfDecodedMb'>;

/** The most a deflate stream can expand: a match of 258 bytes in 2 bits. */
const DEFLATE_MAX_RATIO = 1032;
/** Below this many compressed bytes a Flate stream is inflated in one call (its output is then at most about 16 MB). */
const SYNC_INFLATE_BELOW = 16 * 1024;
const INFLATE_CHUNK = 64 * 1024;

class StreamLimitError extends Error {}

const ENDSTREAM = Buffer.from('endstream', 'latin1');
const IMAGE_CODECS = new Set(['JPXDecode', 'JPX', 'JBIG2Decode', 'CCITTFaxDecode', 'CCF']);

/** Returns null when every stream is within the limits, or the reason the PDF is refused. */
export async function checkPdfStreams(bytes: Uint8Array, limits: PdfStreamLimits): Promise<string | null> {
  const buffer = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const file = new PdfFile(buffer);
  const streams = file.findStreams();
  const decryption = file.decryption();
  if (decryption.kind === 'locked') return null;
  const streamCap = limits.maxPdfStreamMb * MB;
  const totalCap = limits.maxPdfDecodedMb * MB;
  let total = 0;
  try {
    for (const stream of streams) {
      const size = await file.decodedSize(file.streamAt(stream), decryption, streamCap);
      if (size.counted) total += size.bytes;
      if (total > totalCap) {
        return `the PDF's streams decode to more than ${formatMb(totalCap)} together (a decompression bomb?) ${limitHint('maxPdfDecodedMb', limits.maxPdfDecodedMb)}`;
      }
    }
  } catch (error) {
    if (!(error instanceof StreamLimitError)) throw error;
    return `${error.message} (a decompression bomb?) ${limitHint('maxPdfStreamMb', limits.maxPdfStreamMb)}`;
  }
  return null;
}

/**
 * Each stream's object number and decoded size (-1 for an object whose
 * dictionary could not be read), or 'locked' for a PDF that needs a
 * password; for tests and diagnosis.
 */
export async function decodedStreamSizes(bytes: Uint8Array, cap = Number.MAX_SAFE_INTEGER): Promise<{ object: number; bytes: number }[] | 'locked'> {
  const file = new PdfFile(Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength));
  const streams = file.findStreams();
  const decryption = file.decryption();
  if (decryption.kind === 'locked') return 'locked';
  const sizes: { object: number; bytes: number }[] = [];
  for (const keyword of streams) {
    const stream = file.streamAt(keyword);
    sizes.push({ object: stream.num, bytes: (await file.decodedSize(stream, decryption, cap)).bytes });
  }
  return sizes;
}

/** A "stream" keyword, and the object it belongs to when its dictionary could be read. */
interface FoundStream {
  /** Position of the "stream" keyword. */
  keyword: number;
  /** The object's number, generation and dictionary; null when no "N G obj <<...>>" leads up to the keyword. */
  num: number;
  gen: number;
  dict: PdfDict | null;
}

class PdfFile {
  /** Positions just after each "obj" keyword preceded by "num gen", in file order, with num and gen. */
  private objAt: Uint32Array | Float64Array = new Uint32Array(0);
  private objNum: Uint32Array = new Uint32Array(0);
  private objGen: Uint32Array = new Uint32Array(0);
  private objCount = 0;
  /** Object number and generation (num * 65536 + gen) to the index of its last definition; made when a reference is first resolved. */
  private lastDefinition: Map<number, number> | null = null;
  private readonly recentlyParsed = new Map<number, Parsed | null>();
  private readonly xrefTrailers: { at: number; dict: PdfDict }[] = [];
  private readonly endstreams: ForwardSearch;
  private readonly lineFeeds: ForwardSearch;
  private readonly carriageReturns: ForwardSearch;

  constructor(private readonly bytes: Buffer) {
    this.endstreams = new ForwardSearch(bytes, 'endstream');
    this.lineFeeds = new ForwardSearch(bytes, 0x0a);
    this.carriageReturns = new ForwardSearch(bytes, 0x0d);
    this.indexObjects();
  }

  private indexObjects(): void {
    const bytes = this.bytes;
    // Arrays of the right size, counted first: growing them one object at a time left hundreds of megabytes of copies on a file of millions of objects.
    const candidates = countOccurrences(bytes, 'obj');
    this.objAt = positionArray(candidates, bytes.length);
    this.objNum = new Uint32Array(candidates);
    this.objGen = new Uint32Array(candidates);
    for (let at = bytes.indexOf('obj', 0, 'latin1'); at !== -1; at = bytes.indexOf('obj', at + 3, 'latin1')) {
      if (isRegular(bytes[at + 3]) || at === 0 || isRegular(bytes[at - 1]) && !isDigit(bytes[at - 1])) continue;
      // Back over "num gen " before "obj" (white space between them; none is needed before "obj" after a digit).
      let cursor = at;
      const digitsBack = (): number | null => {
        const end = cursor;
        while (cursor > 0 && end - cursor < 10 && isDigit(bytes[cursor - 1])) cursor--;
        return cursor === end ? null : Number(bytes.toString('latin1', cursor, end));
      };
      const spaceBack = (required: boolean): boolean => {
        const end = cursor;
        while (cursor > 0 && end - cursor < 256 && isWhiteByte(bytes[cursor - 1])) cursor--;
        return !required || cursor < end;
      };
      spaceBack(false);
      const gen = digitsBack();
      if (gen === null || !spaceBack(true)) continue;
      const num = digitsBack();
      if (num === null || (cursor > 0 && isRegular(bytes[cursor - 1]))) continue;
      this.objAt[this.objCount] = at + 3;
      this.objNum[this.objCount] = Math.min(num, 0xffffffff);
      this.objGen[this.objCount] = Math.min(gen, 0xffff);
      this.objCount++;
    }
  }

  /**
   * The position of every "stream" keyword, in file order (their objects
   * are read one at a time, by streamAt, so a file of millions of streams
   * holds only their positions). Cross-reference streams' dictionaries,
   * which may name the encryption, are kept for `decryption`.
   */
  findStreams(): Uint32Array | Float64Array {
    const bytes = this.bytes;
    const all = positionArray(countOccurrences(bytes, 'stream'), bytes.length);
    let count = 0;
    for (let at = bytes.indexOf('stream', 0, 'latin1'); at !== -1; at = bytes.indexOf('stream', at + 6, 'latin1')) {
      if (isRegular(bytes[at + 6])) continue; // "streams", a word in text
      if (at >= 3 && bytes[at - 3] === 0x65 && bytes[at - 2] === 0x6e && bytes[at - 1] === 0x64) continue; // "endstream"
      all[count++] = at;
    }
    const found = all.subarray(0, count);
    // A cross-reference stream names /Type /XRef in its dictionary: the stream after each such name is looked at.
    for (let at = bytes.indexOf('/XRef', 0, 'latin1'); at !== -1; at = bytes.indexOf('/XRef', at + 5, 'latin1')) {
      const next = found[lastBefore(found, count, at) + 1];
      if (next === undefined) break;
      const stream = this.streamAt(next);
      if (stream.dict !== null && nameOf(stream.dict.get('Type')) === 'XRef' && !this.xrefTrailers.some((trailer) => trailer.at === next)) this.xrefTrailers.push({ at: next, dict: stream.dict });
    }
    return found;
  }

  /** The object whose dictionary ends right before the keyword at `keyword`: the nearest "obj" before it whose dictionary reads up to it. */
  streamAt(keyword: number): FoundStream {
    let index = lastBefore(this.objAt, this.objCount, keyword);
    for (let tries = 0; index >= 0 && tries < 4; tries++, index--) {
      const parsed = this.parsedObject(index);
      if (parsed !== null && isDict(parsed.value) && skipSpace(this.bytes, parsed.end) === keyword) {
        return { keyword, num: this.objNum[index]!, gen: this.objGen[index]!, dict: parsed.value };
      }
    }
    return { keyword, num: -1, gen: -1, dict: null };
  }

  /** The object after the index-th "obj", parsed once for the few keywords that look back to it (strings in one dictionary may hold many "stream" words). */
  private parsedObject(index: number): Parsed | null {
    const cached = this.recentlyParsed.get(index);
    if (cached !== undefined) return cached;
    const parsed = parseObject(this.bytes, this.objAt[index]!);
    this.recentlyParsed.set(index, parsed);
    if (this.recentlyParsed.size > 16) this.recentlyParsed.delete(this.recentlyParsed.keys().next().value!);
    return parsed;
  }

  /** The value of object (num, gen), from its last definition in the file (a later update replaces an earlier one). */
  resolve(value: PdfValue | undefined, depth = 0): PdfValue | undefined {
    if (!(value instanceof PdfRef)) return value;
    if (depth > 8) return undefined;
    if (this.lastDefinition === null) {
      this.lastDefinition = new Map();
      for (let index = 0; index < this.objCount; index++) this.lastDefinition.set(this.objNum[index]! * 65536 + this.objGen[index]!, index);
    }
    const index = this.lastDefinition.get(value.num * 65536 + value.gen);
    if (index === undefined) return undefined;
    return this.resolve(parseObject(this.bytes, this.objAt[index]!)?.value, depth + 1);
  }

  /**
   * How the streams are decrypted: from the last trailer (a "trailer"
   * dictionary or a cross-reference stream's) that names an /Encrypt.
   * After findStreams.
   */
  decryption(): Decryption {
    const trailers = [...this.xrefTrailers];
    for (let at = this.bytes.indexOf('trailer', 0, 'latin1'); at !== -1; at = this.bytes.indexOf('trailer', at + 7, 'latin1')) {
      const parsed = parseObject(this.bytes, at + 7);
      if (parsed !== null && isDict(parsed.value)) trailers.push({ at, dict: parsed.value });
    }
    trailers.sort((a, b) => b.at - a.at);
    const withEncrypt = trailers.find((trailer) => trailer.dict.has('Encrypt'));
    if (withEncrypt === undefined) return { kind: 'decrypter', decrypt: null, encryptMetadata: true };
    const encrypt = this.resolve(withEncrypt.dict.get('Encrypt'));
    if (!isDict(encrypt)) return { kind: 'locked' };
    const withId = withEncrypt.dict.has('ID') ? withEncrypt : trailers.find((trailer) => trailer.dict.has('ID'));
    const ids = this.resolve(withId?.dict.get('ID'));
    const first = Array.isArray(ids) ? this.resolve(ids[0]) : undefined;
    return streamDecryption(encrypt, Buffer.isBuffer(first) ? first : Buffer.alloc(0));
  }

  /** Where a stream's data starts: after "stream" and the end of its line. */
  private dataStart(keyword: number): number {
    const at = this.nextLineEnd(keyword + 6);
    if (at === -1) return this.bytes.length;
    if (this.bytes[at] === 0x0d && this.bytes[at + 1] === 0x0a) return at + 2;
    return at + 1;
  }

  /** The first CR or LF at or after `from`, or -1. */
  private nextLineEnd(from: number): number {
    const lf = this.lineFeeds.next(from);
    const cr = this.carriageReturns.next(from);
    return lf === -1 ? cr : cr === -1 ? lf : Math.min(lf, cr);
  }

  /**
   * Where a stream's data ends as pdf.js finds it: after /Length bytes when
   * "endstream" follows there, else at the next "endstream" (or the end of
   * the file). `lengthKnown` says whether /Length was a number in the file.
   */
  private dataEnd(start: number, dict: PdfDict | null): { end: number; lengthKnown: boolean } {
    const length = dict === null ? undefined : this.resolve(dict.get('Length'));
    if (typeof length === 'number' && Number.isInteger(length) && length >= 0 && start + length <= this.bytes.length) {
      const after = skipSpace(this.bytes, start + length);
      if (this.bytes.compare(ENDSTREAM, 0, 9, after, Math.min(this.bytes.length, after + 9)) === 0) return { end: start + length, lengthKnown: true };
    }
    const endstream = this.endstreams.next(start);
    return { end: endstream === -1 ? this.bytes.length : endstream, lengthKnown: typeof length === 'number' };
  }

  /**
   * The decoded size of one stream (`counted` when it counts towards the
   * total: not an image codec's pixels). Throws StreamLimitError past the
   * stream limit.
   */
  async decodedSize(stream: FoundStream, decryption: Extract<Decryption, { kind: 'decrypter' }>, cap: number): Promise<{ bytes: number; counted: boolean }> {
    const decrypt = decryption.decrypt;
    const start = this.dataStart(stream.keyword);
    const what = stream.dict === null ? 'a stream of the PDF' : `the PDF's stream in object ${stream.num}`;
    if (stream.dict === null) {
      // No dictionary could be read for it: if its data is zlib data, it is sized as a Flate stream.
      if (decrypt !== null) return { bytes: 0, counted: false };
      const data = this.bytes.subarray(start);
      if (!hasZlibHeader(data)) return { bytes: 0, counted: false };
      const { end } = this.dataEnd(start, null);
      const size = await inflatedSize(data, end - start, cap, false, what);
      return { bytes: size.size, counted: true };
    }
    const dict = stream.dict;
    const { end, lengthKnown } = this.dataEnd(start, dict);
    const filterValue = this.resolve(dict.get('Filter'));
    const filters = (Array.isArray(filterValue) ? filterValue.map((filter) => this.resolve(filter)) : [filterValue]).map((filter) => nameOf(filter)).filter((name): name is string => name !== null);
    const parmsValue = this.resolve(dict.get('DecodeParms') ?? dict.get('DP'));
    const parms = Array.isArray(parmsValue) ? parmsValue.map((parm) => this.resolve(parm)) : [parmsValue];

    // Never encrypted: cross-reference streams, the metadata when /EncryptMetadata is false, and streams with their own (identity) crypt filter.
    const type = nameOf(dict.get('Type'));
    const exempt = type === 'XRef' || (type === 'Metadata' && !decryption.encryptMetadata) || filters.includes('Crypt');
    const encrypted = decrypt !== null && !exempt;
    let data: Buffer;
    let extent: number;
    if (encrypted) {
      data = decrypt!(this.bytes.subarray(start, end), stream.num, stream.gen);
      extent = data.length;
    } else if (isFlate(filters[0]) && !lengthKnown) {
      // Without a /Length read here, the data may run past an "endstream" inside it; zlib stops at the end of the deflate data anyway.
      data = this.bytes.subarray(start);
      extent = end - start;
    } else {
      data = this.bytes.subarray(start, end);
      extent = data.length;
    }
    if (filters.length === 0) return { bytes: data.length, counted: true };

    for (let index = 0; index < filters.length; index++) {
      const filter = filters[index]!;
      const last = index === filters.length - 1;
      const parm = parms[index];
      let output: { size: number; bytes: Buffer | null };
      if (isFlate(filter)) {
        if (!hasZlibHeader(data)) return { bytes: 0, counted: true }; // pdf.js reads such a stream as empty
        const inflated = await inflatedSize(data, extent, cap, !last, what);
        output = { size: inflated.size, bytes: inflated.bytes };
      } else if (filter === 'LZWDecode' || filter === 'LZW') {
        const early = isDict(parm) && typeof parm.get('EarlyChange') === 'number' ? (parm.get('EarlyChange') as number) : 1;
        output = lzwDecode(data, early, cap, !last, what);
      } else if (filter === 'RunLengthDecode' || filter === 'RL') {
        output = runLengthDecode(data, cap, !last, what);
      } else if (filter === 'ASCII85Decode' || filter === 'A85') {
        output = ascii85Decode(data, !last);
      } else if (filter === 'ASCIIHexDecode' || filter === 'AHx') {
        output = asciiHexDecode(data, !last);
      } else if (filter === 'DCTDecode' || filter === 'DCT') {
        const pixels = jpegPixels(data);
        if (pixels > cap) throw new StreamLimitError(`${what} (a JPEG image) decodes to ${formatMb(pixels)}, more than ${formatMb(cap)}`);
        return { bytes: pixels, counted: false };
      } else if (IMAGE_CODECS.has(filter)) {
        // JPEG 2000, JBIG2 and fax images: decoded by the engines only to draw them.
        return { bytes: 0, counted: false };
      } else {
        // Crypt (the identity), or a filter the engines do not know: pdf.js passes the data on unchanged, to the next filter.
        output = { size: data.length, bytes: data };
      }
      if (output.size > cap) throw new StreamLimitError(`${what} decodes to more than ${formatMb(cap)}`);
      if (last) return { bytes: output.size, counted: true };
      data = output.bytes ?? Buffer.alloc(0);
      extent = data.length;
    }
    return { bytes: data.length, counted: true };
  }
}

/**
 * Finds the next occurrence of a needle at or after a position. Streams are
 * measured in file order, so the last answer is reused while it still lies
 * ahead: a file of a million "stream" words on one line, or with no
 * "endstream", is searched once, not once a word.
 */
class ForwardSearch {
  private from = -1;
  private found = -1;

  constructor(
    private readonly bytes: Buffer,
    private readonly needle: string | number,
  ) {}

  next(from: number): number {
    if (this.from !== -1 && this.from <= from && (this.found === -1 || this.found >= from)) return this.found;
    this.from = from;
    this.found = typeof this.needle === 'number' ? this.bytes.indexOf(this.needle, from) : this.bytes.indexOf(this.needle, from, 'latin1');
    return this.found;
  }
}

function isDigit(byte: number | undefined): boolean {
  return byte !== undefined && byte >= 0x30 && byte <= 0x39;
}

function isWhiteByte(byte: number | undefined): boolean {
  return byte === 0x20 || byte === 0x0a || byte === 0x0d || byte === 0x09 || byte === 0x0c || byte === 0x00;
}

function isFlate(filter: string | undefined): boolean {
  return filter === 'FlateDecode' || filter === 'Fl';
}

/** How many times `needle` occurs in `bytes` (overlaps aside). */
function countOccurrences(bytes: Buffer, needle: string): number {
  let count = 0;
  for (let at = bytes.indexOf(needle, 0, 'latin1'); at !== -1; at = bytes.indexOf(needle, at + needle.length, 'latin1')) count++;
  return count;
}

/** An array for `count` positions in a file of `size` bytes (4 bytes each while positions fit). */
function positionArray(count: number, size: number): Uint32Array | Float64Array {
  return size < 2 ** 32 ? new Uint32Array(count) : new Float64Array(count);
}

/** Index of the last of the first `length` entries of the sorted `positions` that is at most `at`, or -1. */
function lastBefore(positions: ArrayLike<number>, length: number, at: number): number {
  let low = 0;
  let high = length;
  while (low < high) {
    const middle = (low + high) >> 1;
    if (positions[middle]! <= at) low = middle + 1;
    else high = middle;
  }
  return low - 1;
}

/** The zlib header as pdf.js checks it: deflate, a valid check value, no preset dictionary. */
function hasZlibHeader(data: Buffer): boolean {
  if (data.length < 2) return false;
  const cmf = data[0]!;
  const flg = data[1]!;
  return (cmf & 0x0f) === 0x08 && ((cmf << 8) + flg) % 31 === 0 && (flg & 0x20) === 0;
}

/**
 * Inflates zlib data (header already checked) counting the output; the
 * bytes are kept only when `keep`. `extent` is how much of `data` the PDF
 * gives the stream (zlib may be handed more, and stops at its end).
 * Throws StreamLimitError past `cap`.
 */
async function inflatedSize(data: Buffer, extent: number, cap: number, keep: boolean, what: string): Promise<{ size: number; bytes: Buffer | null }> {
  const body = data.subarray(2);
  const bodyExtent = Math.max(0, extent - 2);
  if (bodyExtent < SYNC_INFLATE_BELOW && body.length < SYNC_INFLATE_BELOW * 4) {
    try {
      const out = inflateRawSync(body, { maxOutputLength: Math.min(cap + 1, (bodyExtent + 1) * DEFLATE_MAX_RATIO + 1024), finishFlush: constants.Z_SYNC_FLUSH });
      if (out.length > cap) throw new StreamLimitError(`${what} decodes to more than ${formatMb(cap)}`);
      return { size: out.length, bytes: keep ? out : null };
    } catch (error) {
      if (error instanceof StreamLimitError) throw error;
      // Damaged or over the bound: measured again as a stream, which says how far it got.
    }
  }
  return new Promise((resolve, reject) => {
    const inflater = createInflateRaw({ chunkSize: INFLATE_CHUNK, finishFlush: constants.Z_SYNC_FLUSH });
    const chunks: Buffer[] = [];
    let size = 0;
    let settled = false;
    const finish = (outcome: { size: number; bytes: Buffer | null } | Error): void => {
      if (settled) return;
      settled = true;
      inflater.destroy();
      if (outcome instanceof Error) reject(outcome);
      else resolve(outcome);
    };
    inflater.on('data', (chunk: Buffer) => {
      if (settled) return;
      size += chunk.length;
      if (size > cap) return finish(new StreamLimitError(`${what} decodes to more than ${formatMb(cap)}`));
      if (keep) chunks.push(chunk);
    });
    inflater.on('error', () => {
      // zlib stopped on damaged data; pdf.js may decode on past what stops zlib, as much as the bytes left could give.
      const left = Math.max(0, bodyExtent - inflater.bytesWritten);
      const bound = size + left * DEFLATE_MAX_RATIO;
      if (bound > cap) finish(new StreamLimitError(`${what} is damaged part-way, and what is left of it could decode to more than ${formatMb(cap)}`));
      else finish({ size: bound, bytes: keep ? Buffer.concat(chunks) : null });
    });
    inflater.on('end', () => finish({ size, bytes: keep ? Buffer.concat(chunks, size) : null }));
    inflater.end(body);
  });
}

/** LZW decoding as pdf.js does it (lzw_stream.js, including what it makes of codes past the table), counted. */
function lzwDecode(data: Buffer, earlyChange: number, cap: number, keep: boolean, what: string): { size: number; bytes: Buffer | null } {
  const values = new Uint8Array(4096);
  const lengths = new Uint16Array(4096);
  const previous = new Uint16Array(4096);
  const sequence = new Uint8Array(4096);
  for (let i = 0; i < 256; i++) {
    values[i] = i;
    lengths[i] = 1;
  }
  let codeLength = 9;
  let nextCode = 258;
  let sequenceLength = 0;
  let prevCode = 0;
  let cached = 0;
  let bitsCached = 0;
  let at = 0;
  let size = 0;
  const out: Buffer[] = [];
  let pending: number[] = [];
  for (;;) {
    while (bitsCached < codeLength && at < data.length) {
      cached = ((cached << 8) | data[at++]!) >>> 0;
      bitsCached += 8;
    }
    if (bitsCached < codeLength) break;
    bitsCached -= codeLength;
    const code = (cached >>> bitsCached) & ((1 << codeLength) - 1);
    cached &= (1 << bitsCached) - 1;
    const hasPrevious = sequenceLength > 0;
    if (code < 256) {
      sequence[0] = code;
      sequenceLength = 1;
    } else if (code >= 258) {
      if (code < nextCode) {
        sequenceLength = lengths[code]!;
        for (let j = sequenceLength - 1, q = code; j >= 0; j--) {
          sequence[j] = values[q]!;
          q = previous[q]!;
        }
      } else {
        sequence[sequenceLength++] = sequence[0]!;
      }
    } else if (code === 256) {
      codeLength = 9;
      nextCode = 258;
      sequenceLength = 0;
      continue;
    } else break;
    if (hasPrevious) {
      previous[nextCode] = prevCode;
      lengths[nextCode] = lengths[prevCode]! + 1;
      values[nextCode] = sequence[0]!;
      nextCode++;
      codeLength = (nextCode + earlyChange) & (nextCode + earlyChange - 1) ? codeLength : Math.min(Math.log(nextCode + earlyChange) / 0.6931471805599453 + 1, 12) | 0;
    }
    prevCode = code;
    size += sequenceLength;
    if (size > cap) throw new StreamLimitError(`${what} decodes to more than ${formatMb(cap)}`);
    if (keep) {
      for (let j = 0; j < sequenceLength; j++) pending.push(j < 4096 ? sequence[j]! : 0);
      if (pending.length >= 65536) {
        out.push(Buffer.from(pending));
        pending = [];
      }
    }
  }
  if (keep) out.push(Buffer.from(pending));
  return { size, bytes: keep ? Buffer.concat(out) : null };
}

function runLengthDecode(data: Buffer, cap: number, keep: boolean, what: string): { size: number; bytes: Buffer | null } {
  let size = 0;
  const out: Buffer[] = [];
  for (let at = 0; at + 1 < data.length; ) {
    const n = data[at]!;
    if (n === 128) break;
    if (n < 128) {
      const piece = data.subarray(at + 1, at + 2 + n);
      size += piece.length;
      if (keep) out.push(piece);
      at += 2 + n;
    } else {
      size += 257 - n;
      if (keep) out.push(Buffer.alloc(257 - n, data[at + 1]!));
      at += 2;
    }
    if (size > cap) throw new StreamLimitError(`${what} decodes to more than ${formatMb(cap)}`);
  }
  return { size, bytes: keep ? Buffer.concat(out) : null };
}

/** ASCII85: at most 4 bytes for each character ("z" stands for four zeros), so never far beyond the input. */
function ascii85Decode(data: Buffer, keep: boolean): { size: number; bytes: Buffer | null } {
  const out: number[] = [];
  let size = 0;
  const group: number[] = [];
  const flush = (count: number): void => {
    while (group.length < 5) group.push(0x21 + 84);
    let value = 0;
    for (const char of group) value = value * 85 + (char - 0x21);
    for (let index = 0; index < count - 1; index++) {
      size++;
      if (keep) out.push((value >>> (24 - 8 * index)) & 0xff);
    }
    group.length = 0;
  };
  for (const byte of data) {
    if (isWhiteByte(byte)) continue;
    if (byte === 0x7e /* ~ */) break;
    if (byte === 0x7a /* z */ && group.length === 0) {
      size += 4;
      if (keep) out.push(0, 0, 0, 0);
      continue;
    }
    group.push(byte);
    if (group.length === 5) flush(5);
  }
  if (group.length > 0) flush(group.length);
  return { size, bytes: keep ? Buffer.from(out) : null };
}

function asciiHexDecode(data: Buffer, keep: boolean): { size: number; bytes: Buffer | null } {
  const digits: number[] = [];
  for (const byte of data) {
    if (byte === 0x3e /* > */) break;
    const value = byte >= 0x30 && byte <= 0x39 ? byte - 0x30 : byte >= 0x41 && byte <= 0x46 ? byte - 0x37 : byte >= 0x61 && byte <= 0x66 ? byte - 0x57 : -1;
    if (value >= 0) digits.push(value);
  }
  const size = Math.ceil(digits.length / 2);
  if (!keep) return { size, bytes: null };
  const out = Buffer.alloc(size);
  for (let index = 0; index < digits.length; index++) out[index >> 1]! |= index % 2 === 0 ? digits[index]! << 4 : digits[index]!;
  return { size, bytes: out };
}

/** A JPEG's pixels (width x height x components) from its first frame header; 0 when it has none. */
function jpegPixels(data: Buffer): number {
  for (let at = 2; at + 9 < data.length; ) {
    if (data[at] !== 0xff) {
      at++;
      continue;
    }
    const marker = data[at + 1]!;
    if (marker === 0xff || marker === 0x01 || (marker >= 0xd0 && marker <= 0xd9)) {
      at += marker === 0xff ? 1 : 2;
      continue;
    }
    const isFrame = marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc;
    if (isFrame) return data.readUInt16BE(at + 5) * data.readUInt16BE(at + 7) * data[at + 9]!;
    at += 2 + data.readUInt16BE(at + 2);
  }
  return 0;
}
