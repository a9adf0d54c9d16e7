import { createCipheriv, createDecipheriv, createHash } from 'node:crypto';
import { isDict, nameOf, type PdfDict, type PdfValue } from './pdfObjects.js';

/**
 * Decryption of a PDF's streams under the standard security handler with an
 * empty user password, the only encrypted PDFs pdf.js and pdftotext open
 * without being given a password (ISO 32000-1, 7.6; ISO 32000-2 for
 * revision 6): RC4 (revisions 2 to 4), AES-128 (crypt filter AESV2) and
 * AES-256 (AESV3, revisions 5 and 6). Used only to measure how large a
 * stream decodes (pdfStreams.ts).
 */

/** How a stream of object (num, gen) is decrypted, or null when streams are not encrypted. */
export type StreamDecrypter = ((data: Buffer, num: number, gen: number) => Buffer) | null;

export type Decryption =
  /** `encryptMetadata` false: the metadata stream is not encrypted. */
  | { kind: 'decrypter'; decrypt: StreamDecrypter; encryptMetadata: boolean }
  /** The PDF needs a password (or a handler no reader here knows): the readers refuse it themselves and decode nothing. */
  | { kind: 'locked' };

const PADDING = Buffer.from('28bf4e5e4e758a4164004e56fffa01082e2e00b6d0683e802f0ca9fe6453697a', 'hex');

function md5(...parts: Buffer[]): Buffer {
  const hash = createHash('md5');
  for (const part of parts) hash.update(part);
  return hash.digest();
}

function bytesOf(value: PdfValue | undefined): Buffer {
  return Buffer.isBuffer(value) ? value : Buffer.alloc(0);
}

function numberOf(value: PdfValue | undefined, fallback: number): number {
  return typeof value === 'number' ? value : fallback;
}

/** RC4 (ARCFOUR): a stream cipher, its own inverse. */
export function rc4(key: Buffer, data: Buffer): Buffer {
  const s = new Uint8Array(256);
  for (let i = 0; i < 256; i++) s[i] = i;
  for (let i = 0, j = 0; i < 256; i++) {
    j = (j + s[i]! + key[i % key.length]!) & 0xff;
    [s[i], s[j]] = [s[j]!, s[i]!];
  }
  const out = Buffer.alloc(data.length);
  for (let n = 0, i = 0, j = 0; n < data.length; n++) {
    i = (i + 1) & 0xff;
    j = (j + s[i]!) & 0xff;
    [s[i], s[j]] = [s[j]!, s[i]!];
    out[n] = data[n]! ^ s[(s[i]! + s[j]!) & 0xff]!;
  }
  return out;
}

/** AES-CBC decryption of data that starts with its 16-byte IV; a valid PKCS#7 padding is removed. */
function aesDecrypt(key: Buffer, data: Buffer): Buffer {
  if (data.length < 32) return Buffer.alloc(0);
  const body = data.subarray(16, 16 + Math.floor((data.length - 16) / 16) * 16);
  const decipher = createDecipheriv(key.length === 32 ? 'aes-256-cbc' : 'aes-128-cbc', key, data.subarray(0, 16));
  decipher.setAutoPadding(false);
  const plain = Buffer.concat([decipher.update(body), decipher.final()]);
  const pad = plain[plain.length - 1]!;
  return pad >= 1 && pad <= 16 && plain.length >= pad ? plain.subarray(0, plain.length - pad) : plain;
}

function aesNoPadding(mode: 'encrypt' | 'decrypt', key: Buffer, iv: Buffer, data: Buffer): Buffer {
  const cipher = mode === 'encrypt' ? createCipheriv(key.length === 32 ? 'aes-256-cbc' : 'aes-128-cbc', key, iv) : createDecipheriv(key.length === 32 ? 'aes-256-cbc' : 'aes-128-cbc', key, iv);
  cipher.setAutoPadding(false);
  return Buffer.concat([cipher.update(data), cipher.final()]);
}

/** The hash of revision 6 (ISO 32000-2, algorithm 2.B), with an empty password. */
function hashRevision6(salt: Buffer, userKey: Buffer): Buffer {
  const password = Buffer.alloc(0);
  let k: Buffer = createHash('sha256').update(Buffer.concat([password, salt, userKey])).digest();
  let e: Buffer = Buffer.alloc(1);
  for (let round = 0; round < 64 || e[e.length - 1]! > round - 32; round++) {
    const block = Buffer.concat([password, k, userKey]);
    const k1 = Buffer.concat(Array.from({ length: 64 }, () => block));
    e = aesNoPadding('encrypt', k.subarray(0, 16), k.subarray(16, 32), k1);
    let sum = 0;
    for (let index = 0; index < 16; index++) sum += e[index]!;
    k = createHash(['sha256', 'sha384', 'sha512'][sum % 3]!).update(e).digest();
  }
  return k.subarray(0, 32);
}

/**
 * The decryption of a PDF's streams, from its encryption dictionary and the
 * first string of its trailer's /ID, with the empty user password.
 */
export function streamDecryption(encrypt: PdfDict, id: Buffer): Decryption {
  if (nameOf(encrypt.get('Filter')) !== 'Standard') return { kind: 'locked' };
  const version = numberOf(encrypt.get('V'), 0);
  const revision = numberOf(encrypt.get('R'), 0);
  const owner = bytesOf(encrypt.get('O'));
  const user = bytesOf(encrypt.get('U'));
  const encryptMetadata = encrypt.get('EncryptMetadata') !== false;

  // Version 4 and 5 name a crypt filter for streams; Identity leaves them as they are.
  let method: 'rc4' | 'aes128' | 'aes256' = 'rc4';
  if (version >= 4) {
    const filterName = nameOf(encrypt.get('StmF')) ?? 'Identity';
    if (filterName === 'Identity') return { kind: 'decrypter', decrypt: null, encryptMetadata };
    const filters = encrypt.get('CF');
    const filter = isDict(filters) ? filters.get(filterName) : undefined;
    const cfm = isDict(filter) ? nameOf(filter.get('CFM')) : null;
    if (cfm === 'None' || cfm === null) return { kind: 'decrypter', decrypt: null, encryptMetadata };
    if (cfm === 'AESV2') method = 'aes128';
    else if (cfm === 'AESV3') method = 'aes256';
    else if (cfm !== 'V2') return { kind: 'locked' };
  }

  if (revision >= 5) {
    if (user.length < 48) return { kind: 'locked' };
    const userEncrypted = bytesOf(encrypt.get('UE'));
    const validation = revision === 5 ? createHash('sha256').update(user.subarray(32, 40)).digest() : hashRevision6(user.subarray(32, 40), Buffer.alloc(0));
    if (!validation.equals(user.subarray(0, 32)) || userEncrypted.length < 32) return { kind: 'locked' };
    const intermediate = revision === 5 ? createHash('sha256').update(user.subarray(40, 48)).digest() : hashRevision6(user.subarray(40, 48), Buffer.alloc(0));
    const fileKey = aesNoPadding('decrypt', intermediate, Buffer.alloc(16), userEncrypted.subarray(0, 32));
    return { kind: 'decrypter', decrypt: (data) => aesDecrypt(fileKey, data), encryptMetadata };
  }

  if (revision < 2 || owner.length < 32 || user.length < 16) return { kind: 'locked' };
  const length = revision === 2 ? 5 : Math.min(16, Math.max(5, Math.floor(numberOf(encrypt.get('Length'), 40) / 8)));
  const permissions = Buffer.alloc(4);
  permissions.writeInt32LE(numberOf(encrypt.get('P'), 0) | 0, 0);
  const parts = [PADDING, owner.subarray(0, 32), permissions, id];
  if (revision >= 4 && !encryptMetadata) parts.push(Buffer.from([0xff, 0xff, 0xff, 0xff]));
  let key = md5(...parts);
  if (revision >= 3) for (let round = 0; round < 50; round++) key = md5(key.subarray(0, length));
  key = key.subarray(0, length);

  // The key is right when it gives the user entry (algorithms 4 and 5): otherwise the PDF has a user password.
  if (revision === 2) {
    if (!rc4(key, PADDING).equals(user.subarray(0, 32))) return { kind: 'locked' };
  } else {
    let check = rc4(key, md5(PADDING, id));
    for (let round = 1; round <= 19; round++) check = rc4(Buffer.from(key.map((byte) => byte ^ round)), check);
    if (!check.equals(user.subarray(0, 16))) return { kind: 'locked' };
  }

  const objectKey = (num: number, gen: number): Buffer => {
    const suffix = Buffer.from([num & 0xff, (num >> 8) & 0xff, (num >> 16) & 0xff, gen & 0xff, (gen >> 8) & 0xff]);
    const salted = method === 'aes128' ? md5(key, suffix, Buffer.from('sAlT', 'latin1')) : md5(key, suffix);
    return salted.subarray(0, Math.min(length + 5, 16));
  };
  return {
    kind: 'decrypter',
    decrypt: method === 'aes128' ? (data, num, gen) => aesDecrypt(objectKey(num, gen), data) : (data, num, gen) => rc4(objectKey(num, gen), data),
    encryptMetadata,
  };
}
