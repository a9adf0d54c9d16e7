import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { crc32, deflateRawSync } from 'node:zlib';
import { afterAll, describe, expect, it } from 'vitest';
import { refitOutputSchema } from '../../src/refit/output.js';
import { builtCliExists, plumbline, reportOf, temporaryFolder, type Run } from '../batch/cli.js';
import { xlsxEntries } from '../refit/xlsx.js';
import { zipArchive, type ZipEntryInput } from './build.js';

/**
 * DOCX and XLSX files whose zip end record lies about the entry count,
 * through the built command. Both readers walk the directory with the one
 * walker (src/documents/zipDirectory.ts), by its records: a document or a
 * sheet whose end record says 0, 1 or 65,535 entries reads as its honest
 * copy, and a part hidden behind a count of 1 that declares too much is
 * still found and refused, naming the file and the part.
 */

const folder = temporaryFolder('zip-counts');
afterAll(() => rmSync(folder, { recursive: true, force: true }));

function part(name: string, text: string, declared?: number): ZipEntryInput {
  const bytes = Buffer.from(text, 'utf8');
  return { name, data: deflateRawSync(bytes), method: 8, crc: crc32(bytes), size: declared ?? bytes.length };
}

const RELATIONSHIPS = 'http://schemas.openxmlformats.org/package/2006/relationships';
/** A Word document of one paragraph; the document part comes last, after the ones a count of 1 leaves visible. */
function docxParts(paragraph: string, declaredDocumentSize?: number): ZipEntryInput[] {
  return [
    part('[Content_Types].xml', '<?xml version="1.0"?><Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types"><Default Extension="xml" ContentType="application/xml"/></Types>'),
    part('_rels/.rels', `<?xml version="1.0"?><Relationships xmlns="${RELATIONSHIPS}"><Relationship Id="rId1" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/officeDocument" Target="word/document.xml"/></Relationships>`),
    part(
      'word/document.xml',
      `<?xml version="1.0" encoding="UTF-8"?><w:document xmlns:w="http://schemas.openxmlformats.org/wordprocessingml/2006/main"><w:body><w:p><w:r><w:t>${paragraph}</w:t></w:r></w:p></w:body></w:document>`,
      declaredDocumentSize,
    ),
  ];
}

const PARAGRAPH = 'Dose affected recall, F(2, 57) = 4.21, p = .020.'; // p = .0197 (SciPy 1.10.1 f.sf)
const COUNTS = [0, 1, 65_535];

const papers = join(folder, 'papers');
mkdirSync(papers);
writeFileSync(join(papers, 'honest.docx'), zipArchive(docxParts(PARAGRAPH)));
for (const count of COUNTS) writeFileSync(join(papers, `count-${count}.docx`), zipArchive(docxParts(PARAGRAPH), { count }));
// 60 MB declared, over maxUnzippedEntryMb (50), behind an end record that names only the first entry.
writeFileSync(join(papers, 'hidden-large.docx'), zipArchive(docxParts(PARAGRAPH, 60_000_000), { count: 1 }));

const header = ['score', 'group'];
const rows = Array.from({ length: 30 }, (_, index) => [((index * 37) % 23) / 2, ['x', 'y', 'z'][index % 3]!] as const);
writeFileSync(join(folder, 'honest.xlsx'), zipArchive(xlsxEntries(header, rows, rows.length)));
for (const count of COUNTS) writeFileSync(join(folder, `count-${count}.xlsx`), zipArchive(xlsxEntries(header, rows, rows.length), { count }));
// The sheet, last of the parts, declares 150 MB (over the 100 MB refit reads from an XLSX), behind a count of 1.
const hiddenSheet = xlsxEntries(header, rows, rows.length).map((entry) => (entry.name === 'xl/worksheets/sheet1.xml' ? { ...entry, size: 150_000_000 } : entry));
writeFileSync(join(folder, 'hidden-large.xlsx'), zipArchive(hiddenSheet, { count: 1 }));

describe('a zip end record that lies about the entry count, through the built command', () => {
  it('the built command exists', () => {
    expect(builtCliExists(), 'run npm run build first').toBe(true);
  });

  for (const jobs of ['1', '2']) {
    it(`scan --jobs ${jobs}: each DOCX reads as its honest copy; the part hidden behind a count of 1 is found and refused`, () => {
      const run = plumbline(['scan', 'papers', '--format', 'json', '-q', '--no-cache', '--jobs', jobs], folder);
      expect(run.status, run.stderr).toBe(2); // the refused document
      const report = reportOf(run);
      const honest = report.documents.find((document) => document.path === 'papers/honest.docx');
      expect(honest).toMatchObject({ status: 'checked', statistics: [expect.objectContaining({ kind: 'F' })] });
      for (const count of COUNTS) {
        const lying = report.documents.find((document) => document.path === `papers/count-${count}.docx`);
        expect(lying?.status, `count ${count}`).toBe('checked');
        expect(lying?.statistics, `count ${count}`).toEqual(honest?.statistics);
      }
      expect(report.documents.find((document) => document.path === 'papers/hidden-large.docx')).toMatchObject({
        status: 'unreadable',
        error: expect.stringMatching(/^the DOCX part "word\/document\.xml" would expand to 60\.0 MB when unzipped \(a zip bomb\?\) \(limit maxUnzippedEntryMb = 50 MB;/),
      });
    });
  }

  it('refit: each XLSX gives the table of its honest copy; the sheet hidden behind a count of 1 is found and refused', () => {
    const table = (file: string) => {
      const run = plumbline(['refit', file, '--model', 'score ~ group', '--format', 'json'], folder);
      expect(run.stderr, file).toBe('');
      const { data: _name, ...rest } = refitOutputSchema.parse(JSON.parse(run.stdout));
      return rest;
    };
    const expected = table('honest.xlsx');
    expect(expected.n).toBe(30);
    for (const count of COUNTS) expect(table(`count-${count}.xlsx`), `count ${count}`).toEqual(expected);
    const refused: Run = plumbline(['refit', 'hidden-large.xlsx', '--model', 'score ~ group'], folder);
    expect(refused.status).toBe(2);
    expect(refused.stderr).toMatch(/^plumbline: hidden-large\.xlsx: the XLSX file would expand to 150\.0 MB when unzipped, more than the 100 MB refit reads from an XLSX file/);
    expect(refused.stderr).not.toMatch(/^\s+at /m);
  });
});
