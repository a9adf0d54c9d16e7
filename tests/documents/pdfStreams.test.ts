import { readdirSync, readFileSync, writeFileSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { deflateSync } from 'node:zlib';
import { afterAll, describe, expect, it } from 'vitest';
import { findPdftotext } from '../../src/documents/pdf.js';
import { checkPdfStreams, decodedStreamSizes } from '../../src/documents/pdfStreams.js';
import { readDocument } from '../../src/documents/read.js';
import { defaultLimits } from '../../src/limits.js';
import { deflateRepeated, zlibWrapped } from '../fixtures/hostile/makeHostile.js';
import { demo, DEMO_MANUSCRIPTS, fixture } from './helpers.js';
import { pdfOfObjects } from '../adversarial/build.js';

/**
 * The decoded size of a PDF's streams, checked before either engine reads
 * it (src/documents/pdfStreams.ts): every filter the engines decode for
 * text is measured here, encrypted PDFs that open without a password are
 * decrypted first, and a stream or a PDF over its limit is refused with a
 * message naming the limit. Valid PDFs are read as before.
 */

const folder = mkdtempSync(join(tmpdir(), 'plumbline-pdf-streams-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));
const engines = ['pdf-parse', ...(findPdftotext() === null ? [] : ['pdftotext'])] as const;

const CONTENT = 'BT /F1 12 Tf 72 720 Td (Recall improved, F\\(1, 20\\) = 4.20, p = .054.) Tj ET\n';

/** A one-page PDF: objects 1 to 4 are the catalog, the pages, the page (its content is object 5) and a font; then `streams`, objects 5, 6, ... */
function pdfWith(streams: { dict: string; data: Buffer }[], extraObjects: string[] = []): Buffer {
  const objects: Buffer[] = [
    Buffer.from('<< /Type /Catalog /Pages 2 0 R >>'),
    Buffer.from('<< /Type /Pages /Kids [3 0 R] /Count 1 >>'),
    Buffer.from('<< /Type /Page /Parent 2 0 R /MediaBox [0 0 612 792] /Resources << /Font << /F1 4 0 R >> >> /Contents 5 0 R >>'),
    Buffer.from('<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica >>'),
    ...streams.map(({ dict, data }) => Buffer.concat([Buffer.from(`<< ${dict.replace('{length}', String(data.length))} >>\nstream\n`), data, Buffer.from('\nendstream')])),
    ...extraObjects.map((object) => Buffer.from(object)),
  ];
  return pdfOfObjects(objects);
}

function write(name: string, bytes: Buffer): string {
  const path = join(folder, name);
  writeFileSync(path, bytes);
  return path;
}

/** LZW codes as PDF writes them: 9 to 12 bits, most significant bit first, widened one entry early (EarlyChange 1), as the decoder widens them. */
function lzwCodes(codes: readonly number[]): Buffer {
  let width = 9;
  let bits = 0;
  let bitCount = 0;
  const out: number[] = [];
  let sinceClear = 0;
  for (const code of codes) {
    bits = bits * 2 ** width + code;
    bitCount += width;
    while (bitCount >= 8) {
      out.push(Math.floor(bits / 2 ** (bitCount - 8)) & 0xff);
      bitCount -= 8;
      bits %= 2 ** bitCount;
    }
    if (code === 256) {
      width = 9;
      sinceClear = 0;
      continue;
    }
    // The decoder adds an entry for every code after the first since a clear, and widens its codes when the next entry plus one is a power of two.
    if (++sinceClear >= 2) {
      const next = 258 + sinceClear - 1;
      if (((next + 1) & next) === 0) width = Math.min(12, Math.log2(next + 1) + 1);
    }
  }
  if (bitCount > 0) out.push((bits * 2 ** (8 - bitCount)) & 0xff);
  return Buffer.from(out);
}

/** LZW-encodes a short input (the table never fills). */
function lzwEncode(input: Buffer): Buffer {
  const table = new Map<string, number>();
  for (let code = 0; code < 256; code++) table.set(String.fromCharCode(code), code);
  const codes = [256];
  let next = 258;
  let word = '';
  for (const byte of input) {
    const candidate = word + String.fromCharCode(byte);
    if (table.has(candidate)) {
      word = candidate;
      continue;
    }
    codes.push(table.get(word)!);
    if (next >= 4000) throw new Error('input too long for this encoder');
    table.set(candidate, next++);
    word = String.fromCharCode(byte);
  }
  if (word !== '') codes.push(table.get(word)!);
  return lzwCodes([...codes, 257]);
}

function ascii85Encode(input: Buffer): Buffer {
  let out = '';
  for (let at = 0; at < input.length; at += 4) {
    const group = Buffer.alloc(4);
    input.copy(group, 0, at, at + 4);
    const count = Math.min(4, input.length - at);
    let value = group.readUInt32BE(0);
    if (value === 0 && count === 4) {
      out += 'z';
      continue;
    }
    const digits: string[] = [];
    for (let index = 0; index < 5; index++) {
      digits.unshift(String.fromCharCode(33 + (value % 85)));
      value = Math.floor(value / 85);
    }
    out += digits.slice(0, count + 1).join('');
  }
  return Buffer.from(`${out}~>`, 'latin1');
}

function runLengthEncode(input: Buffer): Buffer {
  const out: number[] = [];
  for (let at = 0; at < input.length; ) {
    let run = 1;
    while (at + run < input.length && input[at + run] === input[at] && run < 128) run++;
    if (run > 1) {
      out.push(257 - run, input[at]!);
      at += run;
    } else {
      const end = Math.min(input.length, at + 128);
      let stop = at + 1;
      while (stop < end && !(stop + 1 < input.length && input[stop] === input[stop + 1])) stop++;
      out.push(stop - at - 1, ...input.subarray(at, stop));
      at = stop;
    }
  }
  out.push(128);
  return Buffer.from(out);
}

describe('valid PDFs: every stream measured, none refused, the text as before', () => {
  it('the demo PDFs and the fixtures', async () => {
    const paths = [...DEMO_MANUSCRIPTS.map((name) => demo(`${name}.pdf`)), fixture('two-pages.pdf')];
    const tables = fixture('../pdf-tables');
    paths.push(...readdirSync(tables).filter((name) => name.endsWith('.pdf')).map((name) => join(tables, name)));
    for (const path of paths) {
      const bytes = readFileSync(path);
      expect(await checkPdfStreams(bytes, defaultLimits), path).toBeNull();
      const sizes = await decodedStreamSizes(bytes);
      expect(Array.isArray(sizes) && sizes.every((size) => size.object > 0 && size.bytes >= 0), path).toBe(true);
    }
    // The decoded sizes of one demo PDF, as qpdf 11.3 gives them (qpdf --show-object=N --filtered-stream-data).
    const gravel = await decodedStreamSizes(readFileSync(demo('gravel-path-wayfinding.pdf')));
    expect(Array.isArray(gravel) && gravel.length).toBe(10);
    expect(Array.isArray(gravel) && gravel.reduce((sum, size) => sum + size.bytes, 0)).toBe(107_622);
  });

  const plain = (bytes: Buffer) => ({ dict: '/Length {length}', data: bytes });
  const content = Buffer.from(CONTENT, 'latin1');
  const chains: [string, { dict: string; data: Buffer }][] = [
    ['no filter', plain(content)],
    ['FlateDecode', { dict: '/Length {length} /Filter /FlateDecode', data: deflateSync(content) }],
    ['FlateDecode twice', { dict: '/Length {length} /Filter [/FlateDecode /FlateDecode]', data: deflateSync(deflateSync(content)) }],
    ['ASCII85Decode then FlateDecode', { dict: '/Length {length} /Filter [/A85 /Fl]', data: ascii85Encode(deflateSync(content)) }],
    ['ASCIIHexDecode', { dict: '/Length {length} /Filter /ASCIIHexDecode', data: Buffer.from(`${content.toString('hex')}>`) }],
    ['LZWDecode', { dict: '/Length {length} /Filter /LZWDecode', data: lzwEncode(content) }],
    ['RunLengthDecode', { dict: '/Length {length} /Filter /RunLengthDecode', data: runLengthEncode(content) }],
    ['an indirect /Length', { dict: '/Length 6 0 R /Filter /FlateDecode', data: deflateSync(content) }],
  ];
  it.each(chains)('%s: the decoded size is the content\'s, and the engines read the text', async (name, stream) => {
    const extra = stream.dict.includes('6 0 R') ? [String(stream.data.length)] : [];
    const bytes = pdfWith([stream], extra);
    expect(await decodedStreamSizes(bytes)).toEqual([{ object: 5, bytes: content.length }]);
    const path = write(`${name.replace(/\W+/g, '-')}.pdf`, bytes);
    for (const engine of engines) {
      const outcome = await readDocument(path, { pdfEngine: engine });
      expect(outcome.ok ? outcome.document.text : outcome.error, engine).toContain('F(1, 20) = 4.20, p = .054.');
    }
  });
});

describe('streams over the limits are refused before an engine reads them', () => {
  it('a Flate stream of compressed spaces, with either engine; read when the limit is raised', async () => {
    const spaces = await deflateRepeated(CONTENT, ' ', 3, '\n');
    const path = write('spaces.pdf', pdfWith([{ dict: '/Length {length} /Filter /FlateDecode', data: zlibWrapped(spaces) }]));
    for (const engine of engines) {
      const outcome = await readDocument(path, { pdfEngine: engine, limits: { maxPdfStreamMb: 2 } });
      expect(outcome.ok ? '' : outcome.error, engine).toBe(
        'the PDF\'s stream in object 5 decodes to more than 2.0 MB (a decompression bomb?) (limit maxPdfStreamMb = 2 MB; raise it with --limit maxPdfStreamMb=<n> or "limits": {"maxPdfStreamMb": <n>} in the settings file)',
      );
      expect((await readDocument(path, { pdfEngine: engine, limits: { maxPdfStreamMb: 4 } })).ok, engine).toBe(true);
    }
  });

  it('each filter of a chain is bounded: Flate inside Flate, LZW and RunLength payloads', async () => {
    const spaces = zlibWrapped(await deflateRepeated('', ' ', 3, ''));
    const runs = Buffer.concat([...Array.from({ length: 30_000 }, () => Buffer.from([129, 0x20])), Buffer.from([128])]);
    const cases = [
      { dict: '/Length {length} /Filter [/FlateDecode /FlateDecode]', data: deflateSync(spaces) },
      // Spaces as LZW codes them: one, then runs of 2, 3, ... 2,500 (each code one longer than the last): 3.1 MB.
      { dict: '/Length {length} /Filter /LZWDecode', data: lzwCodes([256, 0x20, ...Array.from({ length: 2499 }, (_, index) => 258 + index), 257]) },
      { dict: '/Length {length} /Filter /RL', data: runs },
      // pdf.js passes the data of a filter it does not know on unchanged, to the next.
      { dict: '/Length {length} /Filter [/NoSuchFilter /FlateDecode]', data: spaces },
    ];
    for (const stream of cases) {
      expect(stream.data.length, stream.dict).toBeLessThan(70_000);
      expect(await checkPdfStreams(pdfWith([stream]), { maxPdfStreamMb: 2, maxPdfDecodedMb: 100 }), stream.dict).toMatch(/^the PDF's stream in object 5 decodes to more than 2\.0 MB \(a decompression bomb\?\)/);
    }
  });

  it('streams each within the limit of one stream, together over the total', async () => {
    const spaces = zlibWrapped(await deflateRepeated('', ' ', 1, ''));
    const streams = Array.from({ length: 4 }, () => ({ dict: '/Length {length} /Filter /FlateDecode', data: spaces }));
    expect(await checkPdfStreams(pdfWith(streams), { maxPdfStreamMb: 2, maxPdfDecodedMb: 3 })).toBe(
      'the PDF\'s streams decode to more than 3.0 MB together (a decompression bomb?) (limit maxPdfDecodedMb = 3 MB; raise it with --limit maxPdfDecodedMb=<n> or "limits": {"maxPdfDecodedMb": <n>} in the settings file)',
    );
    expect(await checkPdfStreams(pdfWith(streams), { maxPdfStreamMb: 2, maxPdfDecodedMb: 5 })).toBeNull();
  });

  it('a Flate stream zlib stops on counts as the most its remaining bytes could give', async () => {
    // A fixed-Huffman block whose first code copies 258 bytes from 1 back, before anything was written: zlib stops
    // ("invalid distance too far back"), pdf.js copies on. Bits are written least significant first, codes most significant first.
    let bits = '';
    const put = (value: number, count: number, huffman = false): void => {
      const text = value.toString(2).padStart(count, '0');
      bits += huffman ? text : [...text].reverse().join('');
    };
    put(0, 1);
    put(1, 2);
    for (let index = 0; index < 3000; index++) {
      put(0b11000101, 8, true); // length 258
      put(0, 5, true); // distance 1
    }
    const bytes = Buffer.from((bits.padEnd(Math.ceil(bits.length / 8) * 8, '0').match(/.{8}/g) ?? []).map((byte) => parseInt([...byte].reverse().join(''), 2)));
    const data = Buffer.concat([Buffer.from([0x78, 0x9c]), bytes]);
    expect(await checkPdfStreams(pdfWith([{ dict: '/Length {length} /Filter /FlateDecode', data }]), { maxPdfStreamMb: 2, maxPdfDecodedMb: 100 })).toMatch(
      /^the PDF's stream in object 5 is damaged part-way, and what is left of it could decode to more than 2\.0 MB \(a decompression bomb\?\)/,
    );
  });

  it('a JPEG whose frame header claims a huge picture', async () => {
    const frame = Buffer.from([0xff, 0xd8, 0xff, 0xc0, 0x00, 0x11, 0x08, 0xfd, 0xe8, 0xfd, 0xe8, 0x03, 1, 0x22, 0, 2, 0x11, 1, 3, 0x11, 1, 0xff, 0xd9]);
    expect(await checkPdfStreams(pdfWith([{ dict: '/Length {length} /Filter /DCTDecode', data: frame }]), defaultLimits)).toMatch(
      /^the PDF's stream in object 5 \(a JPEG image\) decodes to 12675\.0 MB, more than 128\.0 MB \(a decompression bomb\?\) \(limit maxPdfStreamMb = 128 MB;/,
    );
  });
});

describe('encrypted PDFs that open without a password are decrypted to be measured', () => {
  const encrypted = (name: string) => fixture(`encrypted/${name}`);

  it.each(['rc4-40.pdf', 'rc4-128.pdf', 'aes-128.pdf', 'aes-256-r5.pdf', 'aes-256.pdf'])('%s: the same sizes and text as the PDF before encryption', async (name) => {
    const before = await decodedStreamSizes(readFileSync(fixture('two-pages.pdf')));
    const after = await decodedStreamSizes(readFileSync(encrypted(name)));
    const sizes = (list: typeof before) => (Array.isArray(list) ? list.map((size) => size.bytes).sort((a, b) => a - b) : list);
    expect(sizes(after)).toEqual(sizes(before));
    for (const engine of engines) {
      const original = await readDocument(fixture('two-pages.pdf'), { pdfEngine: engine });
      const outcome = await readDocument(encrypted(name), { pdfEngine: engine });
      expect(outcome.ok && original.ok && outcome.document.text === original.document.text, engine).toBe(true);
    }
  });

  it('compressed spaces inside an encrypted stream are measured, and refused over the limit', async () => {
    const bytes = readFileSync(encrypted('spaces-aes-256.pdf'));
    expect(bytes.length).toBeLessThan(30_000);
    expect(await checkPdfStreams(bytes, { maxPdfStreamMb: 10, maxPdfDecodedMb: 100 })).toMatch(/^the PDF's stream in object \d+ decodes to more than 10\.0 MB \(a decompression bomb\?\)/);
    expect(await checkPdfStreams(bytes, defaultLimits)).toBeNull();
  });

  it('a PDF that needs a password is left to the engines, which say so', async () => {
    expect(await decodedStreamSizes(readFileSync(fixture('broken/encrypted.pdf')))).toBe('locked');
    for (const engine of engines) {
      const outcome = await readDocument(fixture('broken/encrypted.pdf'), { pdfEngine: engine });
      expect(outcome.ok ? '' : outcome.error, engine).toMatch(/^encrypted PDF: it needs a password to open/);
    }
  });
});

describe('the text an engine extracts is bounded too', () => {
  it('a small PDF whose text passes the document limit: pdftotext is stopped, pdf-parse\'s text refused', async () => {
    // 4 MiB of "(aaaaaaaa) Tj T*", lines a ten-thousandth of a point apart: all on the page, so both engines write them.
    const text = await deflateRepeated('BT /F1 12 Tf 0.0001 TL 72 720 Td ', '(aaaaaaaa) Tj T*', 4, ' ET\n');
    const path = write('long-text.pdf', pdfWith([{ dict: '/Length {length} /Filter /FlateDecode', data: zlibWrapped(text) }]));
    expect(readFileSync(path).length).toBeLessThan(10_000);
    const expected: Record<string, RegExp> = {
      pdftotext: /^the extracted text is too long: pdftotext wrote more than 1\.0 MB of it and was stopped \(limit maxDocumentMb = 1 MB; raise it with --max-document-mb <n>/,
      'pdf-parse': /^the extracted text is too long: 2\.4 million characters \(limit maxDocumentMb = 1 MB;/,
    };
    for (const engine of engines) {
      const outcome = await readDocument(path, { pdfEngine: engine, limits: { maxDocumentMb: 1 } });
      expect(outcome.ok ? '' : outcome.error, engine).toMatch(expected[engine]!);
    }
  });
});
