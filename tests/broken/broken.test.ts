import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli, type CliIo } from '../../src/cli/program.js';
import { readJsonReport } from '../../src/report/jsonLayoutSchema.js';

/**
 * A corpus of broken and awkward files, audited together through
 * `plumbline scan`: each gives exactly the message in the table (or is
 * read, with its results on the right lines), and the audit finishes for
 * all the others. Text files: UTF-8 (a byte-order mark is dropped) or
 * UTF-16 with a byte-order mark; invalid UTF-8 is refused with the first
 * bad byte's position (see src/documents/text.ts for why).
 */
const folder = join(import.meta.dirname, 'files');
const pdfEngine = 'pdf-parse'; // the engine every machine has; tests/documents covers pdftotext

const unreadable: [string, string][] = [
  ['empty.pdf', 'empty file (0 bytes)'],
  ['truncated.pdf', 'truncated PDF: the end-of-file marker is missing, so the file was cut short (an interrupted download or copy?)'],
  ['encrypted.pdf', 'encrypted PDF: it needs a password to open; save a copy without a password (or print it to a new PDF) and read that'],
  ['scanned.pdf', 'no text layer: the PDF seems to be scanned images; run OCR first'],
  ['really-html.pdf', 'not a PDF: the file is really an HTML page; if that is right, rename it to .html'],
  ['text-named.docx', 'not a DOCX file (a .docx is a zip archive): the file is really plain text; if that is right, rename it to .txt'],
  [
    'invalid-utf8.txt',
    'not valid UTF-8 (first invalid byte 0xE9 at byte 57, line 3): plumbline reads text files as UTF-8, or as UTF-16 when they start with a byte-order mark; save the file as UTF-8 (it is probably Latin-1 or Windows-1252)',
  ],
  ['utf16-no-bom.txt', 'the file looks like UTF-16 text without a byte-order mark; save it as UTF-8 (or as UTF-16 with a byte-order mark)'],
];

/** Readable files: the results' text and line. */
const readable: [string, [string, number][]][] = [
  ['zero-bytes.txt', []],
  ['bom-utf8.txt', [['F(2, 57) = 4.21, p = .020', 1]]],
  ['utf16le.txt', [['F(2, 57) = 4.21, p = .020', 2]]],
  ['utf16be.txt', [['F(2, 57) = 4.21, p = .020', 2]]],
  [
    'mixed-line-endings.txt',
    [
      ['F(2, 57) = 4.21, p = .020', 3],
      ['t(20) = 2.10, p = .048', 5],
    ],
  ],
  ['ordinary.md', [['F(2, 57) = 4.21, p = .020', 3]]],
];

interface JsonDocument {
  path: string;
  status: string;
  error?: string;
  statistics: { text: string; location: { line: number; column: number } }[];
}

describe('plumbline scan over a corpus of broken files', async () => {
  let out = '';
  let err = '';
  const io: CliIo = { stdout: (text) => (out += text), stderr: (text) => (err += text), readStdin: async () => '', color: false };
  const code = await runCli(['scan', folder, '--format', 'json', '--no-cache', '--jobs', '1', '--quiet', '--pdf-engine', pdfEngine], io);
  const documents: JsonDocument[] = readJsonReport(out).documents;
  const byName = new Map(documents.map((document) => [relative(folder, document.path), document]));

  it('audits every file and exits 2 (some could not be read)', () => {
    expect(err).toBe('');
    expect(code).toBe(2);
    expect([...byName.keys()].sort()).toEqual([...unreadable.map(([name]) => name), ...readable.map(([name]) => name)].sort());
  });

  it.each(unreadable)('%s: %s', (name, message) => {
    expect(byName.get(name)).toMatchObject({ status: 'unreadable', error: message });
  });

  it.each(readable)('%s is read', (name, results) => {
    const document = byName.get(name)!;
    expect(document.status).toBe('checked');
    expect(document.statistics.map((s) => [s.text, s.location.line])).toEqual(results);
  });
});
