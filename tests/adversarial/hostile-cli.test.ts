import { rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { findPdftotext } from '../../src/documents/pdf.js';
import { builtCliExists, peakMemoryRunner, plumbline, reportOf, temporaryFolder } from '../batch/cli.js';
import {
  deflateRepeated,
  ESCAPES_NAME,
  hostileCases,
  hostileInputCases,
  LIST_NAME,
  LIST_PAPERS,
  onePagePdf,
  writeHostileFiles,
  writeHostileInputs,
  zlibWrapped,
} from '../fixtures/hostile/makeHostile.js';

/**
 * The hostile documents of tests/fixtures/hostile/makeHostile.ts (zips whose
 * end record lies about the entry count, bytes before the first entry, a
 * directory that cannot be walked, millions of tiny XML elements, a PDF page
 * of 4,000 MiB of compressed spaces), written to a temporary folder beside a
 * good paper and audited by the built command with --jobs 1 and --jobs 2,
 * with each PDF engine: each becomes its unreadable row with the reason, the
 * good paper is audited, the audit ends with its report, quickly and in
 * little memory. The same files through `refit --reported` end with the
 * same reason. (Before the bounded readers they took 1.7 to 6.3 GB, and
 * `refit --reported` ran V8 out of memory.) The generator's other hostile
 * inputs (a FIFO and a link to /dev/zero named like papers, a paper whose
 * name and text carry escape sequences, a list of 150,000 entries) are
 * audited together the same way, and their text reports searched for
 * control characters.
 */

const folder = temporaryFolder('hostile');
const papers = join(folder, 'papers');
afterAll(() => rmSync(folder, { recursive: true, force: true }));

const reasons: Record<string, RegExp> = {
  'count-zero.docx': /^the DOCX part "word\/document\.xml" would expand to 419\.4 MB when unzipped \(a zip bomb\?\) \(limit maxUnzippedEntryMb = 50 MB; raise it with --limit maxUnzippedEntryMb=<n>/,
  'count-one.docx': /^the DOCX part "word\/document\.xml" expands beyond the 0\.0 MB its zip directory declares \(a zip bomb\?\) \(limit maxUnzippedMb = 100 MB;/,
  'prepended.docx': /^the DOCX part "word\/document\.xml" would expand to 419\.4 MB when unzipped \(a zip bomb\?\) \(limit maxUnzippedEntryMb = 50 MB;/,
  'unwalkable.docx': /^damaged DOCX: its zip directory cannot be walked: the end record places it at byte [\d,]+, where no directory entry starts$/,
  'tiny-elements.docx': /^too many elements: the XML read from this DOCX passes 250,000 nodes \(elements, attributes and runs of text\) in the part "word\/document\.xml" \(a payload of tiny elements\?\) \(limit maxDocxXmlNodes = 250,000 nodes;/,
  'whitespace.pdf': /^the PDF's stream in object 5 decodes to more than 128\.0 MB \(a decompression bomb\?\) \(limit maxPdfStreamMb = 128 MB; raise it with --limit maxPdfStreamMb=<n>/,
};

/** A module loaded before the command (node --import) that writes the process's peak memory (maxRSS, in KiB) to a file at exit. */

beforeAll(async () => {
  const written = await writeHostileFiles(papers);
  expect(written.map((file) => file.name).sort()).toEqual(Object.keys(reasons).sort());
  writeFileSync(join(papers, 'good.txt'), 'Dose affected recall, F(2, 57) = 4.21, p = .020.\n'); // p = .0197 (SciPy 1.10.1 f.sf)
});

/** Runs the command and measures its time and peak memory (tests/batch/cli.ts). */
const timed = peakMemoryRunner(folder);

const engines = ['pdf-parse', ...(findPdftotext() === null ? [] : ['pdftotext'])];

describe('a folder of hostile documents, audited by the built command', () => {
  it('the built command exists', () => {
    expect(builtCliExists(), 'run npm run build first').toBe(true);
  });

  for (const jobs of ['1', '2']) {
    for (const engine of engines) {
      it(`--jobs ${jobs}, --pdf-engine ${engine}: each is unreadable with its reason, and the audit ends with its report`, () => {
        const run = timed(['scan', 'papers', '--format', 'json', '-q', '--no-cache', '--jobs', jobs, '--pdf-engine', engine]);
        expect(run.status, run.stderr).toBe(2); // unreadable documents
        expect(run.seconds).toBeLessThan(60);
        expect(run.peakMb).toBeLessThan(1000);
        const report = reportOf(run);
        for (const hostile of hostileCases) {
          const row = report.documents.find((document) => document.path === `papers/${hostile.name}`);
          expect(row?.status, hostile.name).toBe('unreadable');
          expect(row?.error, hostile.name).toMatch(reasons[hostile.name]!);
        }
        expect(report.documents.find((document) => document.path === 'papers/good.txt')).toMatchObject({ status: 'checked', statistics: [expect.anything()] });
        expect(report.summary).toMatchObject({ documents: hostileCases.length + 1, checked: 1, unreadable: hostileCases.length });
      });
    }
  }

  it('the text report names each file with its reason', () => {
    const run = plumbline(['scan', 'papers', '-q', '--no-cache', '--jobs', '2'], folder);
    expect(run.status).toBe(2);
    for (const hostile of hostileCases) {
      const reason = reasons[hostile.name]!.source.replace(/^\^/, '').replace(/\$$/, '\n');
      expect(run.stdout, hostile.name).toMatch(new RegExp(`papers/${hostile.name.replace('.', '\\.')}\\n  unreadable: ${reason}`));
    }
  });

  it('a small PDF whose text passes the document limit: pdftotext is stopped by its output, pdf-parse\'s text refused', async () => {
    // 4 MiB of "(aaaaaaaa) Tj T*", lines a ten-thousandth of a point apart (all on the page): 2.4 million characters of text from 9 KB.
    const text = await deflateRepeated('BT /F1 12 Tf 0.0001 TL 72 720 Td ', '(aaaaaaaa) Tj T*', 4, ' ET\n');
    writeFileSync(join(folder, 'long-text.pdf'), onePagePdf({ zlib: zlibWrapped(text) }));
    const expected: Record<string, RegExp> = {
      pdftotext: /^the extracted text is too long: pdftotext wrote more than 1\.0 MB of it and was stopped \(limit maxDocumentMb = 1 MB;/,
      'pdf-parse': /^the extracted text is too long: 2\.4 million characters \(limit maxDocumentMb = 1 MB;/,
    };
    for (const engine of engines) {
      for (const jobs of ['1', '2']) {
        const run = timed(['scan', 'long-text.pdf', '--format', 'json', '-q', '--no-cache', '--jobs', jobs, '--pdf-engine', engine, '--max-document-mb', '1']);
        expect(run.status, run.stderr).toBe(2);
        expect(run.peakMb).toBeLessThan(1000);
        expect(reportOf(run).documents[0]?.error, `${engine}, --jobs ${jobs}`).toMatch(expected[engine]!);
      }
    }
  });

  it('refit --reported with each of them ends with the file named and the reason, not out of memory', () => {
    const data = join(process.cwd(), 'corpus-demo', 'refit', 'harbour-walks.csv');
    const spec = join(process.cwd(), 'corpus-demo', 'refit', 'harbour-walks.analysis.json');
    for (const hostile of hostileCases) {
      const run = timed(['refit', data, '--spec', spec, '--reported', join('papers', hostile.name)]);
      expect(run.status, `${hostile.name}: ${run.stderr}`).toBe(2);
      expect(run.seconds).toBeLessThan(60);
      expect(run.peakMb).toBeLessThan(1000);
      const reason = reasons[hostile.name]!.source.replace(/^\^/, '').replace(/\$$/, '');
      expect(run.stderr, hostile.name).toMatch(new RegExp(`^plumbline: ${hostile.name.replace('.', '\\.')}: cannot be read \\(${reason}`));
    }
  });
});

/** The characters no text report may hold: C0 controls other than tab and line feed, DEL, C1 controls, bidi overrides and isolates. */
const FORBIDDEN = /[\u0000-\u0008\u000b-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/;

describe('the other hostile inputs: special files, escape sequences, a list of 150,000 entries', () => {
  const inputs = join(folder, 'inputs');
  const made = writeHostileInputs(inputs);
  const scanArgs = (jobs: string) => ['scan', 'inputs', `@inputs/${LIST_NAME}`, '-q', '--no-cache', '--jobs', jobs];

  it('every input was made (a FIFO and a link to /dev/zero need a Unix-like system)', () => {
    expect(made.notMade).toEqual([]);
    expect(made.written.map((input) => input.name)).toEqual(hostileInputCases.map((input) => input.name));
  });

  for (const jobs of ['1', '2']) {
    it(`--jobs ${jobs}: the special files are unreadable with what they are, the papers are audited once each, and the audit ends with its report`, () => {
      const run = plumbline([...scanArgs(jobs), '--format', 'json'], folder);
      expect(run.status, run.stderr).toBe(2); // the special files; null would mean it was killed at the 60 s timeout
      const report = reportOf(run);
      const row = (path: string) => report.documents.find((document) => document.path === path);
      expect(row('inputs/pipe.txt')?.error).toMatch(/^not a regular file: a FIFO \(named pipe\); plumbline reads only regular files/);
      expect(row('inputs/zero.txt')?.error).toBe(
        'not a regular file: a symbolic link to /dev/zero, a character device; plumbline reads only regular files (a FIFO or a device can block or never end)',
      );
      // The JSON keeps the text as it is: the paper really carries the escapes.
      const escapes = row(`inputs/${ESCAPES_NAME}`);
      expect(escapes).toMatchObject({ status: 'checked', statistics: [expect.objectContaining({ kind: 'F' })] });
      expect(escapes?.statistics[0]?.text).toContain('\u001b[2J');
      const papers = report.documents.filter((document) => document.path.startsWith('inputs/list/'));
      expect(papers).toHaveLength(LIST_PAPERS);
      expect(papers.every((document) => document.status === 'checked' && document.statistics.length === 1)).toBe(true);
      expect(report.summary).toMatchObject({ documents: LIST_PAPERS + 3, checked: LIST_PAPERS + 1, unreadable: 2 });
    });

    for (const format of ['text', 'md', 'csv']) {
      it(`--jobs ${jobs}, --format ${format}: no control character from a document or a file name reaches the report`, () => {
        const run = plumbline([...scanArgs(jobs), '--format', format, '--all'], folder);
        expect(run.status, run.stderr).toBe(2);
        const at = (run.stdout + run.stderr).search(FORBIDDEN);
        expect(at === -1 ? null : JSON.stringify((run.stdout + run.stderr).slice(Math.max(0, at - 30), at + 30))).toBeNull();
        // Shown as escapes, not dropped: the name, and the result's text where the format lists consistent results (the Markdown summary lists flags only).
        expect(run.stdout).toContain('paper\\x1b[2J\\x1b]0;pwned\\x07\\u202eexe.txt');
        if (format !== 'md') expect(run.stdout).toContain('4.21,\\x1b[2A\\x1b[2J p = .020');
        expect(run.stdout).toMatch(/pipe\.txt/);
      });
    }
  }
});
