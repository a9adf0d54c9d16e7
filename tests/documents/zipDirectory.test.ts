import { closeSync, openSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { crc32, deflateRawSync } from 'node:zlib';
import { afterAll, describe, expect, it } from 'vitest';
import { bytesInMemory, bytesOfFile, walkZipDirectory, type WalkOptions, type ZipBytes } from '../../src/documents/zipDirectory.js';
import { zipArchive, type ZipEntryInput } from '../adversarial/build.js';
import { temporaryFolder } from '../batch/cli.js';

/**
 * The one zip directory walker (src/documents/zipDirectory.ts), which the
 * DOCX reader (in memory) and the XLSX reader (through a file) share: the
 * same archive gives the same entries from either source, whatever the end
 * record claims about the entry count; bytes before the first entry are
 * followed or refused as the caller asks; what cannot be walked, and
 * directories past the caller's caps, are refused with the reason.
 */

const folder = temporaryFolder('zip-directory');
afterAll(() => rmSync(folder, { recursive: true, force: true }));

function part(name: string, text: string, declared?: number): ZipEntryInput {
  const bytes = Buffer.from(text, 'utf8');
  return { name, data: deflateRawSync(bytes), method: 8, crc: crc32(bytes), size: declared ?? bytes.length };
}

const parts = [part('[Content_Types].xml', '<Types/>'), part('_rels/.rels', '<Relationships/>'), part('word/document.xml', '<w:document/>'.repeat(20))];
const honest = zipArchive(parts);

const lenient: WalkOptions = { maxEntries: 100, maxDirectoryBytes: Infinity, followPrependedBytes: true };
const strict: WalkOptions = { maxEntries: Infinity, maxDirectoryBytes: 1 << 24, followPrependedBytes: false };

/** Walks `bytes` from memory and from a file written with them; both must agree, and that one outcome is returned. */
function walkBoth(name: string, bytes: Buffer, options: WalkOptions) {
  const inMemory = walkZipDirectory(bytesInMemory(bytes), options);
  const path = join(folder, name);
  writeFileSync(path, bytes);
  const descriptor = openSync(path, 'r');
  try {
    expect(walkZipDirectory(bytesOfFile(descriptor, bytes.length), options), name).toEqual(inMemory);
  } finally {
    closeSync(descriptor);
  }
  return inMemory;
}

function names(outcome: ReturnType<typeof walkZipDirectory>): string[] {
  if (!outcome.ok) throw new Error(outcome.problem === 'damaged' ? outcome.reason : outcome.problem);
  return outcome.entries.map((entry) => entry.name);
}

/** A copy whose end record says `count` entries. */
function withCount(bytes: Buffer, count: number): Buffer {
  const copy = Buffer.from(bytes);
  copy.writeUInt16LE(count, copy.length - 22 + 8);
  copy.writeUInt16LE(count, copy.length - 22 + 10);
  return copy;
}

describe('the entries of an archive', () => {
  it('are the same from memory and from a file, with where each one\'s data starts', () => {
    const outcome = walkBoth('honest.zip', honest, strict);
    expect(names(outcome)).toEqual(['[Content_Types].xml', '_rels/.rels', 'word/document.xml']);
    if (!outcome.ok) return;
    for (const [index, entry] of outcome.entries.entries()) {
      const data = honest.subarray(entry.dataStart, entry.dataStart + entry.compressedSize);
      expect(data.equals(parts[index]!.data), entry.name).toBe(true);
    }
  });

  it('whatever entry count the end record claims (0, 1, 65,535): the records are walked', () => {
    for (const count of [0, 1, 2, 65_535]) {
      for (const options of [lenient, strict]) expect(names(walkBoth(`count-${count}.zip`, withCount(honest, count), options))).toEqual(names(walkZipDirectory(bytesInMemory(honest), strict)));
    }
  });

  it('whatever size the end record gives the directory: the walk goes on to the end record', () => {
    expect(names(walkBoth('short-size.zip', zipArchive(parts, { directorySize: 46 }), strict))).toHaveLength(3);
  });

  it('the last entry of a directory hidden by a count of 1 is listed with the size it declares', () => {
    const bomb = zipArchive([...parts, part('word/footnotes.xml', '<w:footnotes/>', 4_000_000_000)], { count: 1 });
    const outcome = walkBoth('hidden-bomb.zip', bomb, strict);
    expect(outcome.ok && outcome.entries.at(-1)).toMatchObject({ name: 'word/footnotes.xml', uncompressedSize: 4_000_000_000 });
  });
});

describe('bytes before the first entry, offsets not shifted', () => {
  const prepended = zipArchive(parts, { prepend: Buffer.alloc(4096, 0x2e) });

  it('are followed when the caller takes them (DOCX): every entry moves by as much', () => {
    const outcome = walkBoth('prepended-followed.zip', prepended, lenient);
    const plain = walkZipDirectory(bytesInMemory(honest), lenient);
    expect(outcome.ok && plain.ok).toBe(true);
    if (!outcome.ok || !plain.ok) return;
    expect(outcome.entries.map((entry) => entry.dataStart)).toEqual(plain.entries.map((entry) => entry.dataStart + 4096));
  });

  it('are refused when it does not (XLSX), with where the end record placed the directory', () => {
    expect(walkBoth('prepended-refused.zip', prepended, strict)).toEqual({
      ok: false,
      problem: 'damaged',
      reason: `its zip directory cannot be walked: the end record places it at byte ${(honest.length - 22 - 3 * 46 - '[Content_Types].xml_rels/.relsword/document.xml'.length).toLocaleString('en-US')}, where no directory entry starts`,
    });
  });
});

describe('what cannot be walked, and what passes the caller\'s caps, is refused', () => {
  const refusal = (name: string, bytes: Buffer, options: WalkOptions = strict): string => {
    const outcome = walkBoth(name, bytes, options);
    if (outcome.ok) return 'walked';
    return outcome.problem === 'damaged' ? outcome.reason : `${outcome.problem} (${outcome.maxEntries})`;
  };

  it('no end record: not a zip, cut short, or shorter than an end record', () => {
    const reason = 'it is not a zip archive, or it was cut short: it has no end of central directory record, so its directory cannot be found';
    expect(refusal('text.zip', Buffer.from('score,group\n1,a\n'))).toBe(reason);
    expect(refusal('cut.zip', honest.subarray(0, honest.length - 30))).toBe(reason);
    expect(refusal('empty.zip', Buffer.alloc(0))).toBe(reason);
  });

  it('a local header that is not where the directory says, or data past the end of the file', () => {
    const moved = Buffer.from(honest);
    moved.writeUInt32LE(0, 0);
    expect(refusal('moved.zip', moved)).toBe('the zip entry "[Content_Types].xml" is not where its directory says (byte 0)');
    const long = zipArchive(parts.map((entry, index) => (index === 2 ? { ...entry, data: Buffer.concat([entry.data, Buffer.alloc(10)]) } : entry)));
    const directoryEnd = long.length - 22;
    // The last record's compressed size, made to reach past the file.
    long.writeUInt32LE(1_000_000, directoryEnd - 46 - 'word/document.xml'.length + 20);
    expect(refusal('long.zip', long)).toBe('the zip entry "word/document.xml" runs past the end of the file (cut short?)');
  });

  it('more entries than the caller allows', () => {
    expect(refusal('many.zip', honest, { ...lenient, maxEntries: 2 })).toBe('too many entries (2)');
    expect(refusal('enough.zip', honest, { ...lenient, maxEntries: 3 })).toBe('walked');
  });

  it('a directory longer than the caller reads', () => {
    expect(refusal('long-directory.zip', honest, { ...strict, maxDirectoryBytes: 100 })).toBe(`its zip directory takes ${3 * 46 + 47} bytes, more than the 100 read from such a file`);
  });

  it('a zip64 end record is followed, from memory and from a file', () => {
    const end = honest.length - 22;
    const zip64End = Buffer.alloc(56);
    zip64End.writeUInt32LE(0x06064b50, 0);
    zip64End.writeBigUInt64LE(BigInt(honest.readUInt32LE(end + 12)), 40);
    zip64End.writeBigUInt64LE(BigInt(honest.readUInt32LE(end + 16)), 48);
    const locator = Buffer.alloc(20);
    locator.writeUInt32LE(0x07064b50, 0);
    locator.writeBigUInt64LE(BigInt(end), 8);
    const record = Buffer.from(honest.subarray(end));
    record.writeUInt32LE(0xffffffff, 16);
    const archive = Buffer.concat([honest.subarray(0, end), zip64End, locator, record]);
    expect(names(walkBoth('zip64.zip', archive, strict))).toHaveLength(3);
    expect(refusal('zip64-missing.zip', Buffer.concat([honest.subarray(0, end), Buffer.alloc(56), locator, record]))).toBe('its zip64 end record is missing, so its directory cannot be found');
  });
});

it('a source reads no further than the file', () => {
  const source: ZipBytes = bytesInMemory(Buffer.from('abc'));
  expect(source.read(2, 10).toString()).toBe('c');
});
