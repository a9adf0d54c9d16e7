import { readFileSync } from 'node:fs';
import { crc32, deflateRawSync } from 'node:zlib';
import fc from 'fast-check';
import mammoth from 'mammoth';
import { describe, expect, it } from 'vitest';
import { readDocxBytes } from '../../src/documents/docx.js';
import { htmlToDocument } from '../../src/documents/html.js';
import { openZip, XmlNodeCounter } from '../../src/documents/zipGuard.js';
import { defaultLimits, type Limits } from '../../src/limits.js';
import { zipArchive } from '../adversarial/build.js';
import { demo, DEMO_MANUSCRIPTS } from './helpers.js';

/**
 * The DOCX zip reader (src/documents/zipGuard.ts): the real directory is
 * walked whatever the end record says, what cannot be walked is refused,
 * parts are inflated only when read and within the limits, and the XML
 * nodes of what is read are counted. Valid documents read as mammoth's own
 * zip reader (JSZip) read them.
 */

const END_OF_CENTRAL_DIRECTORY = 0x06054b50;
const CENTRAL_HEADER = 0x02014b50;

function endRecordAt(bytes: Buffer): number {
  for (let at = bytes.length - 22; at >= 0; at--) if (bytes.readUInt32LE(at) === END_OF_CENTRAL_DIRECTORY) return at;
  throw new Error('no end record');
}

/** A copy whose end record says `count` entries. */
function withEntryCount(bytes: Buffer, count: number): Buffer {
  const copy = Buffer.from(bytes);
  const end = endRecordAt(copy);
  copy.writeUInt16LE(count, end + 8);
  copy.writeUInt16LE(count, end + 10);
  return copy;
}

/** `size` bytes put before the archive; with `shiftOffsets`, the directory's offsets count them (a self-extracting archive), else not. */
function withBytesBefore(bytes: Buffer, size: number, shiftOffsets: boolean): Buffer {
  const copy = Buffer.concat([Buffer.alloc(size, 0x2e), bytes]);
  if (!shiftOffsets) return copy;
  const end = endRecordAt(copy);
  const directory = copy.readUInt32LE(end + 16) + size;
  copy.writeUInt32LE(directory, end + 16);
  for (let at = directory; copy.readUInt32LE(at) === CENTRAL_HEADER; at += 46 + copy.readUInt16LE(at + 28) + copy.readUInt16LE(at + 30) + copy.readUInt16LE(at + 32)) {
    copy.writeUInt32LE(copy.readUInt32LE(at + 42) + size, at + 42);
  }
  return copy;
}

function deflated(name: string, text: string, declared?: number) {
  const bytes = Buffer.from(text, 'utf8');
  return { name, data: deflateRawSync(bytes), method: 8 as const, crc: crc32(bytes), size: declared ?? bytes.length };
}

const WORD = '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<w:document xmlns:w="http://schemas.openxmlformats.org/wordprocessingml/2006/main"><w:body>';
const minimalParts = (body: string) => [
  deflated('[Content_Types].xml', '<?xml version="1.0"?><Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types"><Default Extension="xml" ContentType="application/xml"/></Types>'),
  deflated(
    '_rels/.rels',
    '<?xml version="1.0"?><Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships"><Relationship Id="rId1" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/officeDocument" Target="word/document.xml"/></Relationships>',
  ),
  deflated('word/document.xml', `${WORD}${body}</w:body></w:document>`),
];

/** What a read gives, without the document's functions (pageOf), so two reads compare. */
async function readDocx(bytes: Buffer, limits: Partial<Limits> = {}) {
  const outcome = await readDocxBytes('test.docx', bytes, { ...defaultLimits, ...limits });
  if (!outcome.ok) return outcome;
  const { text, regions, tables, format } = outcome.document;
  return { ok: true as const, document: { text, regions, tables, format } };
}

describe('a valid DOCX reads as before', () => {
  it.each(DEMO_MANUSCRIPTS)('%s: mammoth gives the same HTML through this reader as through its own zip reader', async (name) => {
    const bytes = readFileSync(demo(`${name}.docx`));
    const convertImage = mammoth.images.imgElement(async () => ({ src: '' }));
    const own = await mammoth.convertToHtml({ buffer: bytes }, { convertImage });
    const outcome = await readDocx(bytes);
    expect(outcome.ok).toBe(true);
    const { text, regions, tables, format } = htmlToDocument(own.value, 'test.docx', 'docx');
    expect(outcome).toEqual({ ok: true, document: { text, regions, tables, format } });
  });

  it('whatever the end record says about the entry count, and with bytes before the first entry, shifted or not', async () => {
    const bytes = readFileSync(demo('orchard-noise-vigilance.docx'));
    const original = await readDocx(bytes);
    expect(original.ok).toBe(true);
    for (const variant of [withEntryCount(bytes, 0), withEntryCount(bytes, 1), withEntryCount(bytes, 65535), withBytesBefore(bytes, 4096, false), withBytesBefore(bytes, 333, true)]) {
      expect(await readDocx(variant)).toEqual(original);
    }
  });

  it('a zip64 end record is followed', async () => {
    const archive = zipArchive(minimalParts('<w:p><w:r><w:t>F(1, 20) = 4.20, p = .054.</w:t></w:r></w:p>'));
    const end = endRecordAt(archive);
    const directorySize = archive.readUInt32LE(end + 12);
    const directoryOffset = archive.readUInt32LE(end + 16);
    const zip64End = Buffer.alloc(56);
    zip64End.writeUInt32LE(0x06064b50, 0);
    zip64End.writeBigUInt64LE(44n, 4);
    zip64End.writeBigUInt64LE(3n, 24);
    zip64End.writeBigUInt64LE(3n, 32);
    zip64End.writeBigUInt64LE(BigInt(directorySize), 40);
    zip64End.writeBigUInt64LE(BigInt(directoryOffset), 48);
    const locator = Buffer.alloc(20);
    locator.writeUInt32LE(0x07064b50, 0);
    locator.writeBigUInt64LE(BigInt(end), 8);
    locator.writeUInt32LE(1, 16);
    const endRecord = Buffer.from(archive.subarray(end));
    endRecord.writeUInt16LE(0xffff, 8);
    endRecord.writeUInt16LE(0xffff, 10);
    endRecord.writeUInt32LE(0xffffffff, 16);
    const outcome = await readDocx(Buffer.concat([archive.subarray(0, end), zip64End, locator, endRecord]));
    expect(outcome.ok ? outcome.document.text : outcome.error).toBe('F(1, 20) = 4.20, p = .054.\n\n');
  });
});

describe('what cannot be walked is refused, with the reason', () => {
  const good = zipArchive(minimalParts('<w:p/>'));

  it('an archive cut before its end record', async () => {
    expect(await readDocx(good.subarray(0, good.length - 30))).toEqual({ ok: false, error: 'damaged DOCX: it is not a zip archive, or it was cut short: it has no end of central directory record, so its directory cannot be found' });
  });

  it('an end record that places the directory where none is', async () => {
    const outcome = await readDocx(zipArchive(minimalParts('<w:p/>'), { directoryOffset: 10, directorySize: 3 }));
    expect(outcome).toEqual({ ok: false, error: 'damaged DOCX: its zip directory cannot be walked: the end record places it at byte 10, where no directory entry starts' });
  });

  it('an entry whose data is not where the directory says, or runs past the end of the file', async () => {
    const moved = Buffer.from(good);
    moved.writeUInt32LE(0, 0); // the first local header's signature
    expect(await readDocx(moved)).toEqual({ ok: false, error: 'damaged DOCX: the zip entry "[Content_Types].xml" is not where its directory says (byte 0)' });
    const parts = minimalParts('<w:p/>');
    const tooLong = zipArchive(parts.map((part, index) => (index === 2 ? { ...part, data: part.data } : part)));
    // The last entry's compressed size, in its directory entry, made to reach past the file.
    const end = endRecordAt(tooLong);
    let at = tooLong.readUInt32LE(end + 16);
    for (let entry = 0; entry < 2; entry++) at += 46 + tooLong.readUInt16LE(at + 28);
    tooLong.writeUInt32LE(1_000_000, at + 20);
    expect(await readDocx(tooLong)).toEqual({ ok: false, error: 'damaged DOCX: the zip entry "word/document.xml" runs past the end of the file (cut short?)' });
  });

  it('a directory of more entries than the limit', async () => {
    const many = zipArchive(Array.from({ length: 12 }, (_, index) => deflated(`word/part${index}.xml`, '<a/>')));
    expect(await readDocx(many, { maxZipEntries: 10 })).toEqual({
      ok: false,
      error: 'the DOCX\'s zip directory holds more than 10 entries (limit maxZipEntries = 10 entries; raise it with --limit maxZipEntries=<n> or "limits": {"maxZipEntries": <n>} in the settings file)',
    });
  });

  it('a part compressed by another method than deflate, or encrypted', async () => {
    const parts = minimalParts('<w:p/>');
    const bzip2 = zipArchive(parts);
    const end = endRecordAt(bzip2);
    let at = bzip2.readUInt32LE(end + 16);
    for (let entry = 0; entry < 2; entry++) at += 46 + bzip2.readUInt16LE(at + 28);
    const encrypted = Buffer.from(bzip2);
    bzip2.writeUInt16LE(12, at + 10);
    expect(await readDocx(bzip2)).toEqual({ ok: false, error: 'the DOCX part "word/document.xml" is compressed with method 12, which a DOCX does not use (only stored and deflated parts are read)' });
    encrypted.writeUInt16LE(1, at + 8);
    expect(await readDocx(encrypted)).toEqual({ ok: false, error: 'the DOCX part "word/document.xml" is encrypted; save the document without a password and read that' });
  });
});

describe('sizes and XML nodes are counted while the parts are read', () => {
  it('a part that inflates beyond the size its directory entry declares is stopped there', async () => {
    const parts = minimalParts(`<w:p><w:r><w:t>${'a '.repeat(100_000)}</w:t></w:r></w:p>`);
    const liar = zipArchive(parts.map((part) => (part.name === 'word/document.xml' ? { ...part, size: 5000 } : part)));
    const outcome = await readDocx(liar);
    expect(outcome.ok ? '' : outcome.error).toMatch(/^the DOCX part "word\/document\.xml" expands beyond the 0\.0 MB its zip directory declares \(a zip bomb\?\) \(limit maxUnzippedMb = 100 MB;/);
  });

  it('a part that declares more than the limit of one part is refused before anything is inflated', async () => {
    const parts = minimalParts('<w:p/>').map((part) => (part.name === 'word/document.xml' ? { ...part, size: 60_000_000 } : part));
    expect(await readDocx(zipArchive(parts))).toEqual({
      ok: false,
      error:
        'the DOCX part "word/document.xml" would expand to 60.0 MB when unzipped (a zip bomb?) (limit maxUnzippedEntryMb = 50 MB; raise it with --limit maxUnzippedEntryMb=<n> or "limits": {"maxUnzippedEntryMb": <n>} in the settings file)',
    });
  });

  it('only the parts mammoth reads are inflated: a damaged image is never touched', async () => {
    const parts = [...minimalParts('<w:p><w:r><w:t>Recall.</w:t></w:r></w:p>'), { name: 'word/media/image1.png', data: Buffer.from('not deflate data at all'), method: 8 as const, crc: 0, size: 100 }];
    const outcome = await readDocx(zipArchive(parts));
    expect(outcome.ok ? outcome.document.text : outcome.error).toBe('Recall.\n\n');
  });

  it('XML of more nodes than the limit is refused as too many elements, naming the part', async () => {
    const outcome = await readDocx(zipArchive(minimalParts('<w:p/>'.repeat(2000))), { maxDocxXmlNodes: 1000 });
    expect(outcome).toEqual({
      ok: false,
      error:
        'too many elements: the XML read from this DOCX passes 1,000 nodes (elements, attributes and runs of text) in the part "word/document.xml" (a payload of tiny elements?) (limit maxDocxXmlNodes = 1,000 nodes; raise it with --limit maxDocxXmlNodes=<n> or "limits": {"maxDocxXmlNodes": <n>} in the settings file)',
    });
    expect((await readDocx(zipArchive(minimalParts('<w:p/>'.repeat(900))), { maxDocxXmlNodes: 1000 })).ok).toBe(true);
  });

  it('a demo manuscript holds about two thousand nodes, far below the default limit', async () => {
    for (const name of DEMO_MANUSCRIPTS) {
      const bytes = readFileSync(demo(`${name}.docx`));
      expect((await readDocx(bytes, { maxDocxXmlNodes: 3000 })).ok, name).toBe(true);
      expect((await readDocx(bytes, { maxDocxXmlNodes: 1000 })).ok, name).toBe(false);
    }
  });

  it('an archive is opened from its directory alone, and reads a part only when asked', async () => {
    const opened = openZip(zipArchive(minimalParts('<w:p/>')), defaultLimits);
    expect(opened.ok).toBe(true);
    if (!opened.ok) return;
    expect(opened.archive.names()).toEqual(['[Content_Types].xml', '_rels/.rels', 'word/document.xml']);
    expect(opened.archive.exists('word/styles.xml')).toBe(false);
    expect(await opened.archive.read('word/document.xml', 'utf-8')).toBe(`${WORD}<w:p/></w:body></w:document>`);
  });
});

describe('XmlNodeCounter', () => {
  const count = (...chunks: string[]): number => {
    const counter = new XmlNodeCounter();
    for (const chunk of chunks) counter.feed(Buffer.from(chunk, 'utf8'));
    counter.finish();
    return counter.count;
  };

  it('counts start tags, attributes and runs of text; not end tags, comments, declarations or instructions', () => {
    // \n, <a>, b=, c=, "text", <d/>: six; the ">" inside the quoted value and the comment are not markup.
    expect(count('<?xml version="1.0"?>\n<a b="1" c=\'x>y=z\'>text<d/><!-- c --></a>')).toBe(6);
    expect(count('<w:p/>'.repeat(10))).toBe(10);
    expect(count('<w:r> </w:r>'.repeat(10))).toBe(20);
  });

  it('gives the same count however the bytes are split into chunks', () => {
    const xml = '<?xml version="1.0"?>\n<w:document xmlns:w="u"><w:body><w:p w:rsidR="00A1"><w:r><w:t xml:space="preserve">F(1, 20) = 4.20 </w:t></w:r></w:p><!-- a > b --></w:body></w:document>';
    const whole = count(xml);
    fc.assert(
      fc.property(fc.uniqueArray(fc.integer({ min: 1, max: xml.length - 1 }), { maxLength: 8 }), (cuts) => {
        const points = [0, ...cuts.sort((a, b) => a - b), xml.length];
        return count(...points.slice(1).map((end, index) => xml.slice(points[index], end))) === whole;
      }),
    );
  });
});
