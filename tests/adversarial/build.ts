import { deflateSync } from 'node:zlib';

/**
 * Builders of hostile inputs, made in the test run (nothing large is committed).
 */

/** A one-page PDF whose content stream draws `runs` text runs of one character each (compressed). */
export function pdfWithTextRuns(runs: number, pages = 1): Buffer {
  const parts: string[] = [];
  for (let index = 0; index < runs; index++) {
    parts.push(`BT /F1 2 Tf ${(index % 300) * 2} ${Math.floor(index / 300) % 400 * 2} Td (${String.fromCharCode(97 + (index % 26))}) Tj ET\n`);
  }
  const content = deflateSync(Buffer.from(parts.join(''), 'latin1'));
  const objects: Buffer[] = [];
  const kids = Array.from({ length: pages }, (_, page) => `${5 + page} 0 R`).join(' ');
  objects.push(Buffer.from('<< /Type /Catalog /Pages 2 0 R >>'));
  objects.push(Buffer.from(`<< /Type /Pages /Kids [${kids}] /Count ${pages} >>`));
  objects.push(Buffer.from('<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica >>'));
  objects.push(Buffer.concat([Buffer.from(`<< /Length ${content.length} /Filter /FlateDecode >>\nstream\n`), content, Buffer.from('\nendstream')]));
  for (let page = 0; page < pages; page++) {
    objects.push(Buffer.from('<< /Type /Page /Parent 2 0 R /MediaBox [0 0 612 792] /Resources << /Font << /F1 3 0 R >> >> /Contents 4 0 R >>'));
  }
  return pdfOfObjects(objects);
}

/** A PDF file of the given object bodies, numbered from 1 (object 1 the catalogue), with its cross-reference table. */
export function pdfOfObjects(objects: readonly Buffer[]): Buffer {
  const chunks: Buffer[] = [Buffer.from('%PDF-1.4\n%\xE2\xE3\xCF\xD3\n', 'latin1')];
  let length = chunks[0]!.length;
  const offsets: number[] = [];
  objects.forEach((body, index) => {
    offsets.push(length);
    const object = Buffer.concat([Buffer.from(`${index + 1} 0 obj\n`), body, Buffer.from('\nendobj\n')]);
    chunks.push(object);
    length += object.length;
  });
  const xref = [`xref\n0 ${objects.length + 1}\n`, '0000000000 65535 f \n', ...offsets.map((offset) => `${String(offset).padStart(10, '0')} 00000 n \n`)].join('');
  chunks.push(Buffer.from(`${xref}trailer\n<< /Size ${objects.length + 1} /Root 1 0 R >>\nstartxref\n${length}\n%%EOF\n`));
  return Buffer.concat(chunks);
}

export interface ZipEntryInput {
  name: string;
  /** Raw deflate data (method 8) or the stored bytes (method 0). */
  data: Buffer;
  method: 0 | 8;
  crc: number;
  /** The uncompressed size written in the headers (a bomb may lie). */
  size: number;
}

export interface ZipOptions {
  /** The entry count written in the end record (the true count when not given). */
  count?: number;
  /** Bytes written before the first entry; the offsets in the directory do not count them. */
  prepend?: Buffer;
  /** The directory offset written in the end record (the true one when not given). */
  directoryOffset?: number;
  /** The directory size written in the end record (the true one when not given). */
  directorySize?: number;
}

/** A zip archive of the given entries (no zip64: sizes below 4 GiB), with an end record that may lie (`options`). */
export function zipArchive(entries: readonly ZipEntryInput[], options: ZipOptions = {}): Buffer {
  const locals: Buffer[] = [];
  const centrals: Buffer[] = [];
  let offset = 0;
  for (const entry of entries) {
    const name = Buffer.from(entry.name, 'utf8');
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4);
    local.writeUInt16LE(entry.method, 8);
    local.writeUInt32LE(entry.crc >>> 0, 14);
    local.writeUInt32LE(entry.data.length, 18);
    local.writeUInt32LE(entry.size, 22);
    local.writeUInt16LE(name.length, 26);
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0);
    central.writeUInt16LE(20, 4);
    central.writeUInt16LE(20, 6);
    central.writeUInt16LE(entry.method, 10);
    central.writeUInt32LE(entry.crc >>> 0, 16);
    central.writeUInt32LE(entry.data.length, 20);
    central.writeUInt32LE(entry.size, 24);
    central.writeUInt16LE(name.length, 28);
    central.writeUInt32LE(offset, 42);
    locals.push(local, name, entry.data);
    centrals.push(central, name);
    offset += 30 + name.length + entry.data.length;
  }
  const directory = Buffer.concat(centrals);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  const count = options.count ?? entries.length;
  end.writeUInt16LE(count, 8);
  end.writeUInt16LE(count, 10);
  end.writeUInt32LE(options.directorySize ?? directory.length, 12);
  end.writeUInt32LE(options.directoryOffset ?? offset, 16);
  return Buffer.concat([options.prepend ?? Buffer.alloc(0), ...locals, directory, end]);
}

/**
 * Raw deflate data that inflates to `megabytes` MiB of zeros, built without
 * compressing them all: once the window is full of zeros, every further MiB
 * flushed with Z_SYNC_FLUSH compresses to the same bytes, which are repeated.
 */
export async function deflatedZeros(megabytes: number): Promise<{ data: Buffer; crc: number; size: number }> {
  const { createDeflateRaw, constants, crc32 } = await import('node:zlib');
  const mib = Buffer.alloc(1 << 20);
  const deflate = createDeflateRaw({ level: 9 });
  const output: Buffer[] = [];
  deflate.on('data', (chunk: Buffer) => output.push(chunk));
  const segment = async (): Promise<Buffer> => {
    const before = output.length;
    deflate.write(mib);
    await new Promise<void>((resolve) => deflate.flush(constants.Z_SYNC_FLUSH, () => resolve()));
    return Buffer.concat(output.slice(before));
  };
  const first = await segment();
  const second = await segment();
  const third = await segment();
  if (!second.equals(third)) throw new Error('deflate did not reach a steady state');
  const before = output.length;
  await new Promise<void>((resolve) => deflate.end(() => resolve()));
  await new Promise<void>((resolve) => (deflate.closed ? resolve() : deflate.on('close', () => resolve())));
  const tail = Buffer.concat(output.slice(before));
  const data = Buffer.concat([first, ...Array.from({ length: megabytes - 1 }, () => second), tail]);
  let crc = 0;
  for (let index = 0; index < megabytes; index++) crc = crc32(mib, crc);
  return { data, crc, size: megabytes * (1 << 20) };
}
