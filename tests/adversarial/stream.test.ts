import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { afterAll, describe, expect, it } from 'vitest';
import { auditTextStream } from '../../src/batch/auditFile.js';
import { auditText } from '../../src/audit.js';
import { resolveConfig } from '../../src/checks/config.js';
import { createLineIndex } from '../../src/scan/lines.js';
import { scanText } from '../../src/scan/scan.js';
import { scanTextStream, textWindows, TextDecodingError } from '../../src/scan/stream.js';

const folder = mkdtempSync(join(tmpdir(), 'plumbline-stream-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

/** A long text with results of every kind, line endings of every kind, and multi-byte characters, deterministic. */
function manuscript(paragraphs: number): string {
  const pieces = [
    'Recall improved, F(2, 57) = 4.21, p = .020, ηp2 = .13.',
    'The groups differed, t(46) = −2.10, p = .041, d = 0.61.',
    'Choice depended on frame, χ2(1, N = 120) = 6.50, p = .011.',
    'Scores correlated, r(98) = .32, p = .001.',
    'The sign test gave z = 2.40, p = .016.',
    'Both effects held, F(1, 86) = 18.42 and F(1, 86) = 25.93, ps < .001.',
    'Nothing here but prose about données and naïve ﬁndings.',
  ];
  const endings = ['\n', '\r\n', '\r', ' ', '\n\n'];
  let text = '';
  for (let index = 0; index < paragraphs; index++) text += pieces[(index * 7) % pieces.length] + endings[(index * 3) % endings.length];
  return text;
}

async function collect<T>(iterable: AsyncIterable<T>): Promise<T[]> {
  const items: T[] = [];
  for await (const item of iterable) items.push(item);
  return items;
}

/** Bytes in pieces of an awkward size, so multi-byte characters and "\r\n" pairs are cut across pieces. */
function piecesOf(bytes: Buffer, size: number): Readable {
  const pieces: Buffer[] = [];
  for (let at = 0; at < bytes.length; at += size) pieces.push(bytes.subarray(at, at + size));
  return Readable.from(pieces);
}

describe('scanTextStream', () => {
  const text = manuscript(600);
  const whole = scanText(text).results;
  const lineOf = createLineIndex(text);

  it.each([
    [97, 700],
    [1000, 500],
    [4096, 2048],
    [1 << 20, 1 << 16],
  ])('finds each result once, as a whole-text scan does (chunk %i, overlap %i)', async (chunkSize, overlap) => {
    const streamed = await collect(scanTextStream(piecesOf(Buffer.from(text, 'utf8'), 333), { chunkSize, overlap }));
    expect(streamed.map((r) => [r.kind, r.start, r.end, r.value?.value, r.p?.value.value, r.p?.start])).toEqual(
      whole.map((r) => [r.kind, r.start, r.end, r.value?.value, r.p?.value.value, r.p?.start]),
    );
    for (const result of streamed) {
      expect(result.text).toBe(text.slice(result.start, result.end));
      expect({ line: result.line, column: result.column }).toEqual(lineOf(result.start));
    }
  });

  it('reads UTF-16 by its byte-order mark, and refuses invalid UTF-8 naming the byte', async () => {
    const sample = manuscript(40);
    const utf16 = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(sample, 'utf16le')]);
    const streamed = await collect(scanTextStream(piecesOf(utf16, 101), { chunkSize: 200, overlap: 400 }));
    expect(streamed.map((r) => r.start)).toEqual(scanText(sample).results.map((r) => r.start));
    const broken = Buffer.concat([Buffer.from('F(1, 20) = 4.2, p = .05\n'), Buffer.from([0xe9, 0x20])]);
    await expect(collect(scanTextStream(piecesOf(broken, 7)))).rejects.toThrow(/^not valid UTF-8 \(first invalid byte 0xE9 at byte 24, line 2\)/);
    await expect(collect(scanTextStream(piecesOf(broken, 7)))).rejects.toBeInstanceOf(TextDecodingError);
  });

  it('gives one empty window for an empty text', async () => {
    expect((await collect(textWindows(Readable.from([])))).map((w) => w.text)).toEqual(['']);
  });
});

describe('auditing a large text file as a stream', () => {
  it('gives the same statistics, locations and findings as auditing it whole', async () => {
    const config = resolveConfig({});
    const text = `${manuscript(900)}\nReferences\nSmith, J. (2001). F(1, 20) = 4.2 is not enough. Journal, 1, 1-2.\n`;
    const path = join(folder, 'large.txt');
    writeFileSync(path, text);
    const whole = auditText(text, config, path);
    const streamed = await auditTextStream(path, 'text', config, { chunkSize: 2000, overlap: 1500 });
    expect(streamed.status).toBe('checked');
    const summary = (d: typeof whole) => d.statistics.map((s) => [s.text, s.location, s.findings.map((f) => f.rule), s.recomputed.p]);
    expect(summary(streamed)).toEqual(summary(whole));
    // The result cited in the reference list is left out in both.
    expect(streamed.statistics.some((s) => s.location.start > text.indexOf('References'))).toBe(false);
  });

  it('carries a declared significance level to later windows', async () => {
    const config = resolveConfig({});
    const text = `We set alpha = .01 for all tests.\n${'Filler sentence without numbers.\n'.repeat(200)}The effect was F(1, 40) = 5.00, p = .031.\n`;
    const path = join(folder, 'alpha.txt');
    writeFileSync(path, text);
    const streamed = await auditTextStream(path, 'text', config, { chunkSize: 500, overlap: 200 });
    expect(streamed.alpha).toBe(0.01);
    expect(streamed.statistics.map((s) => s.findings.map((f) => f.rule))).toEqual(auditText(text, config, path).statistics.map((s) => s.findings.map((f) => f.rule)));
  });
});
