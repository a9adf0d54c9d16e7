/**
 * Just enough of PDF's object syntax to read stream dictionaries, the
 * trailer and the encryption dictionary from a PDF's bytes (pdfStreams.ts),
 * without a PDF library: numbers, names, strings, arrays, dictionaries,
 * indirect references and keywords, as pdf.js's lexer reads them
 * (ISO 32000-1, 7.2 and 7.3). Bounded: nesting deeper than MAX_DEPTH, or
 * anything it cannot read, is a failure (null), never a deep recursion.
 */

export class PdfName {
  constructor(readonly name: string) {}
}

export class PdfRef {
  constructor(
    readonly num: number,
    readonly gen: number,
  ) {}
}

export class PdfKeyword {
  constructor(readonly word: string) {}
}

export type PdfValue = number | boolean | null | PdfName | PdfRef | PdfKeyword | Buffer | PdfValue[] | PdfDict;
export type PdfDict = Map<string, PdfValue>;

const MAX_DEPTH = 64;

/** PDF white-space characters: NUL, tab, line feed, form feed, carriage return, space. */
export function isWhite(byte: number | undefined): boolean {
  return byte === 0x20 || byte === 0x0a || byte === 0x0d || byte === 0x09 || byte === 0x0c || byte === 0x00;
}

/** PDF delimiters: ( ) < > [ ] { } / %. */
export function isDelimiter(byte: number | undefined): boolean {
  return byte === 0x28 || byte === 0x29 || byte === 0x3c || byte === 0x3e || byte === 0x5b || byte === 0x5d || byte === 0x7b || byte === 0x7d || byte === 0x2f || byte === 0x25;
}

/** A character that continues a name, number or keyword. */
export function isRegular(byte: number | undefined): boolean {
  return byte !== undefined && !isWhite(byte) && !isDelimiter(byte);
}

/** The position after white space and comments from `at`. */
export function skipSpace(bytes: Buffer, at: number): number {
  while (at < bytes.length) {
    const byte = bytes[at];
    if (isWhite(byte)) at++;
    else if (byte === 0x25 /* % */) {
      while (at < bytes.length && bytes[at] !== 0x0a && bytes[at] !== 0x0d) at++;
    } else break;
  }
  return at;
}

export interface Parsed {
  value: PdfValue;
  end: number;
}

/** Reads one object at `at` (after white space); null when the bytes there are not one. */
export function parseObject(bytes: Buffer, at: number, depth = 0): Parsed | null {
  if (depth > MAX_DEPTH) return null;
  at = skipSpace(bytes, at);
  if (at >= bytes.length) return null;
  const byte = bytes[at]!;
  if (byte === 0x3c /* < */) {
    if (bytes[at + 1] === 0x3c) return parseDictionary(bytes, at + 2, depth);
    return parseHexString(bytes, at + 1);
  }
  if (byte === 0x5b /* [ */) return parseArray(bytes, at + 1, depth);
  if (byte === 0x28 /* ( */) return parseLiteralString(bytes, at + 1);
  if (byte === 0x2f /* / */) return parseName(bytes, at + 1);
  if (isNumberStart(byte)) {
    const number = parseNumber(bytes, at);
    if (number === null) return null;
    // "num gen R" is a reference.
    if (Number.isInteger(number.value) && number.value >= 0) {
      const second = skipSpace(bytes, number.end);
      if (second < bytes.length && bytes[second]! >= 0x30 && bytes[second]! <= 0x39) {
        const gen = parseNumber(bytes, second);
        if (gen !== null && Number.isInteger(gen.value)) {
          const r = skipSpace(bytes, gen.end);
          if (bytes[r] === 0x52 /* R */ && !isRegular(bytes[r + 1])) return { value: new PdfRef(number.value as number, gen.value as number), end: r + 1 };
        }
      }
    }
    return number;
  }
  if (isRegular(byte)) {
    let end = at;
    while (end < bytes.length && isRegular(bytes[end])) end++;
    const word = bytes.toString('latin1', at, end);
    if (word === 'true') return { value: true, end };
    if (word === 'false') return { value: false, end };
    if (word === 'null') return { value: null, end };
    return { value: new PdfKeyword(word), end };
  }
  return null;
}

function isNumberStart(byte: number): boolean {
  return (byte >= 0x30 && byte <= 0x39) || byte === 0x2b || byte === 0x2d || byte === 0x2e;
}

function parseNumber(bytes: Buffer, at: number): { value: number; end: number } | null {
  // The common case, an unsigned integer, read without making a string.
  let integer = 0;
  let digitsEnd = at;
  while (digitsEnd < bytes.length && digitsEnd - at < 15 && bytes[digitsEnd]! >= 0x30 && bytes[digitsEnd]! <= 0x39) integer = integer * 10 + (bytes[digitsEnd++]! - 0x30);
  if (digitsEnd > at && !isNumberStart(bytes[digitsEnd] ?? 0x20) && bytes[digitsEnd] !== 0x45 && bytes[digitsEnd] !== 0x65) return { value: integer, end: digitsEnd };
  let end = at;
  while (end < bytes.length && (isNumberStart(bytes[end]!) || bytes[end] === 0x45 || bytes[end] === 0x65)) end++;
  // pdf.js reads "--5" and "5-" leniently; a number here only sizes things, so a doubtful one is 0 or its digits.
  const text = bytes.toString('latin1', at, end);
  const value = Number(text.replace(/^[+-]+(?=[+-])/, '').replace(/(?<=\d)[+-]+$/, ''));
  return { value: Number.isFinite(value) ? value : 0, end };
}

function parseName(bytes: Buffer, at: number): Parsed {
  let end = at;
  while (end < bytes.length && isRegular(bytes[end]) && bytes[end] !== 0x23) end++;
  if (!isRegular(bytes[end])) return { value: new PdfName(bytes.toString('latin1', at, end)), end };
  end = at;
  const out: number[] = [];
  while (end < bytes.length && isRegular(bytes[end])) {
    const byte = bytes[end]!;
    if (byte === 0x23 /* # */ && /^[0-9a-fA-F]{2}$/.test(bytes.toString('latin1', end + 1, end + 3))) {
      out.push(parseInt(bytes.toString('latin1', end + 1, end + 3), 16));
      end += 3;
    } else {
      out.push(byte);
      end++;
    }
  }
  return { value: new PdfName(Buffer.from(out).toString('latin1')), end };
}

function parseHexString(bytes: Buffer, at: number): Parsed | null {
  const digits: number[] = [];
  let end = at;
  for (; end < bytes.length && bytes[end] !== 0x3e; end++) {
    const byte = bytes[end]!;
    const value = byte >= 0x30 && byte <= 0x39 ? byte - 0x30 : byte >= 0x41 && byte <= 0x46 ? byte - 0x37 : byte >= 0x61 && byte <= 0x66 ? byte - 0x57 : -1;
    if (value >= 0) digits.push(value);
  }
  if (end >= bytes.length) return null;
  if (digits.length % 2 === 1) digits.push(0);
  const out = Buffer.alloc(digits.length / 2);
  for (let index = 0; index < out.length; index++) out[index] = digits[2 * index]! * 16 + digits[2 * index + 1]!;
  return { value: out, end: end + 1 };
}

function parseLiteralString(bytes: Buffer, at: number): Parsed | null {
  const out: number[] = [];
  let depth = 1;
  let end = at;
  while (end < bytes.length) {
    const byte = bytes[end++]!;
    if (byte === 0x5c /* \ */) {
      const next = bytes[end++];
      if (next === undefined) return null;
      const escapes: Record<number, number> = { 0x6e: 0x0a, 0x72: 0x0d, 0x74: 0x09, 0x62: 0x08, 0x66: 0x0c, 0x28: 0x28, 0x29: 0x29, 0x5c: 0x5c };
      if (escapes[next] !== undefined) out.push(escapes[next]!);
      else if (next >= 0x30 && next <= 0x37) {
        let value = next - 0x30;
        for (let digits = 1; digits < 3 && bytes[end]! >= 0x30 && bytes[end]! <= 0x37; digits++) value = value * 8 + (bytes[end++]! - 0x30);
        out.push(value & 0xff);
      } else if (next === 0x0d) {
        if (bytes[end] === 0x0a) end++;
      } else if (next !== 0x0a) out.push(next);
      continue;
    }
    if (byte === 0x28) depth++;
    else if (byte === 0x29 && --depth === 0) return { value: Buffer.from(out), end };
    out.push(byte);
  }
  return null;
}

function parseArray(bytes: Buffer, at: number, depth: number): Parsed | null {
  const items: PdfValue[] = [];
  for (;;) {
    at = skipSpace(bytes, at);
    if (at >= bytes.length) return null;
    if (bytes[at] === 0x5d /* ] */) return { value: items, end: at + 1 };
    const item = parseObject(bytes, at, depth + 1);
    if (item === null) return null;
    items.push(item.value);
    at = item.end;
  }
}

function parseDictionary(bytes: Buffer, at: number, depth: number): Parsed | null {
  const dict: PdfDict = new Map();
  for (;;) {
    at = skipSpace(bytes, at);
    if (at >= bytes.length) return null;
    if (bytes[at] === 0x3e && bytes[at + 1] === 0x3e) return { value: dict, end: at + 2 };
    const key = parseObject(bytes, at, depth + 1);
    if (key === null || !(key.value instanceof PdfName)) return null;
    const value = parseObject(bytes, key.end, depth + 1);
    if (value === null) return null;
    dict.set(key.value.name, value.value);
    at = value.end;
  }
}

export function isDict(value: PdfValue | undefined): value is PdfDict {
  return value instanceof Map;
}

export function nameOf(value: PdfValue | undefined): string | null {
  return value instanceof PdfName ? value.name : null;
}
