import { rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { xlsxLimits } from '../../src/limits.js';
import { refitOutputSchema } from '../../src/refit/output.js';
import { builtCliExists, plumbline, temporaryFolder, type Run } from '../batch/cli.js';
import { withPart, xlsxFile } from './xlsx.js';

/**
 * XLSX data files through the built command: a sheet within the limits
 * (src/limits.ts, xlsxLimits) gives the table of the same data as CSV;
 * above a limit (rows, columns, cells, shared strings, unzipped size) the
 * file is refused before the spreadsheet reader parses it, with a message
 * that names the file and the limit and suggests CSV, never a stack trace;
 * a zip that lies about itself is refused as unreadable. Every file is made
 * in the test's temporary folder.
 */

const folder = temporaryFolder('refit-xlsx');
afterAll(() => rmSync(folder, { recursive: true, force: true }));

function file(name: string, content: Buffer | string): string {
  writeFileSync(join(folder, name), content);
  return name;
}

function refit(args: readonly string[]): Run {
  return plumbline(['refit', ...args], folder);
}

/** A refusal: exit code 2 and one line on standard error, never a stack trace. */
function refused(args: readonly string[]): string {
  const run = refit(args);
  expect(run.status).toBe(2);
  expect(run.stdout).toBe('');
  expect(run.stderr).not.toMatch(/^\s+at /m);
  expect(run.stderr.trim().split('\n')).toHaveLength(1);
  return run.stderr.trim();
}

const header = ['score', 'group', 'age'];
const rows = (count: number) =>
  (function* () {
    for (let index = 0; index < count; index++) yield [((index * 37) % 23) / 2, ['x', 'y', 'z'][index % 3]!, 20 + ((index * 7) % 13)];
  })();
const CSV_ADVICE = 'Save the sheet as CSV (in a spreadsheet program: Save As, CSV), which refit reads as a stream with no limit on rows.';

describe.skipIf(!builtCliExists())('XLSX within the limits', () => {
  it('gives the table of the same data written as CSV (shared strings and inline strings alike)', () => {
    const csv = file('data.csv', `${[header.join(','), ...[...rows(60)].map((row) => row.join(','))].join('\n')}\n`);
    const shared = file('shared.xlsx', xlsxFile(header, rows(60), 60, { sharedStrings: true }));
    const inline = file('inline.xlsx', xlsxFile(header, rows(60), 60));
    const table = (data: string) => {
      const run = refit([data, '--model', 'score ~ group + age', '--format', 'json']);
      expect(run.stderr).toBe('');
      const { data: _name, ...rest } = refitOutputSchema.parse(JSON.parse(run.stdout));
      return rest;
    };
    const expected = table(csv);
    expect(expected.n).toBe(60);
    expect(table(shared)).toEqual(expected);
    expect(table(inline)).toEqual(expected);
  });

  it('a zip whose end record claims no entries is still read: the directory is walked by its records, not by the count', () => {
    const bytes = xlsxFile(header, rows(60), 60);
    bytes.writeUInt16LE(0, bytes.length - 22 + 8);
    bytes.writeUInt16LE(0, bytes.length - 22 + 10);
    const run = refit([file('count-zero.xlsx', bytes), '--model', 'score ~ group + age', '--format', 'json']);
    expect(run.stderr).toBe('');
    expect(refitOutputSchema.parse(JSON.parse(run.stdout)).n).toBe(60);
  });
});

describe.skipIf(!builtCliExists())('XLSX above a limit: refused before parsing, naming the file and suggesting CSV', () => {
  it('600,000 rows', () => {
    file('large.xlsx', xlsxFile(['score', 'group'], (function* () {
      for (let index = 0; index < 600_000; index++) yield [index % 97, index % 2 === 0 ? 'a' : 'b'];
    })(), 600_000));
    expect(refused(['large.xlsx', '--model', 'score ~ group'])).toBe(
      `plumbline: large.xlsx: the sheet spans 600,001 rows, more than the ${xlsxLimits.maxRows.toLocaleString('en-US')} refit reads from an XLSX file (the whole sheet is held in memory to read it). ${CSV_ADVICE}`,
    );
  });

  it('one cell far down the sheet (the reader would lay out a million empty rows), whatever the sheet\'s <dimension> claims', () => {
    const bytes = xlsxFile(header, rows(10), 10, { dimension: 'A1:C11', extraRowsXml: '<row r="1048576"><c r="A1048576"><v>1</v></c></row>' });
    expect(refused([file('far-row.xlsx', bytes), '--model', 'score ~ group'])).toMatch(/^plumbline: far-row\.xlsx: the sheet spans 1,048,576 rows, more than the 200,000 /);
  });

  it('one cell far to the right (every row would be padded to 16,384 cells)', () => {
    const bytes = xlsxFile(header, rows(10), 10, { extraRowsXml: '<row r="12"><c r="XFD12"><v>1</v></c></row>' });
    expect(refused([file('far-column.xlsx', bytes), '--model', 'score ~ group'])).toBe(
      `plumbline: far-column.xlsx: the sheet spans 16,384 columns, more than the 1,000 refit reads from an XLSX file (the whole sheet is held in memory to read it). ${CSV_ADVICE}`,
    );
  });

  it('a reference hidden inside another attribute\'s value does not hide the real one', () => {
    const bytes = xlsxFile(header, rows(10), 10, { extraRowsXml: `<row r="12"><c s=' r="A12"' r="XFD12"><v>1</v></c></row>` });
    expect(refused([file('hidden-reference.xlsx', bytes), '--model', 'score ~ group'])).toMatch(/the sheet spans 16,384 columns/);
  });

  it('rows times columns above the cells limit', () => {
    const width = 900; // within the columns limit
    const wide = Array.from({ length: width }, (_, index) => `c${index}`);
    const bytes = xlsxFile(wide, (function* () {
      for (let index = 0; index < 2_500; index++) yield [index % 7];
    })(), 2_500);
    expect(refused([file('many-cells.xlsx', bytes), '--model', 'c0 ~ c1'])).toMatch(
      /^plumbline: many-cells\.xlsx: the sheet spans 2,501 rows by 900 columns, 2,250,900 cells, more than the 2,000,000 refit reads from an XLSX file/,
    );
  });

  it('more shared strings than the limit, in a small sheet', () => {
    const items = Array.from({ length: xlsxLimits.maxSharedStrings + 1 }, (_, index) => `<si><t>s${index}</t></si>`).join('');
    const sharedStrings = Buffer.from(`<?xml version="1.0" encoding="UTF-8"?><sst xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main">${items}</sst>`);
    const bytes = withPart(xlsxFile(header, rows(10), 10, { sharedStrings: true }), 'xl/sharedStrings.xml', sharedStrings);
    expect(refused([file('strings-small-sheet.xlsx', bytes), '--model', 'score ~ group'])).toBe(
      `plumbline: strings-small-sheet.xlsx: the XLSX file holds 1,000,001 shared strings (distinct texts), more than the 1,000,000 refit reads (all are held in memory). ${CSV_ADVICE}`,
    );
  });

  it('a sheet whose zip directory declares more than the unzipped-size limit, refused before anything is inflated', () => {
    const bytes = withPart(xlsxFile(header, rows(10), 10), 'xl/worksheets/sheet1.xml', null, 150 * 1_000_000);
    expect(refused([file('declared.xlsx', bytes), '--model', 'score ~ group'])).toBe(
      `plumbline: declared.xlsx: the XLSX file would expand to 150.0 MB when unzipped, more than the 100 MB refit reads from an XLSX file (the whole sheet is held in memory to read it). ${CSV_ADVICE}`,
    );
  });
});

describe.skipIf(!builtCliExists())('XLSX files that lie about themselves: unreadable, named', () => {
  it('a part that inflates beyond the size its directory declares (a zip bomb)', () => {
    const bytes = withPart(xlsxFile(header, rows(200), 200), 'xl/worksheets/sheet1.xml', null, 1_000);
    expect(refused([file('bomb.xlsx', bytes), '--model', 'score ~ group'])).toBe(
      'plumbline: bomb.xlsx: cannot be read as an XLSX file: its part "xl/worksheets/sheet1.xml" inflates beyond the 1,000 bytes its zip directory declares (a damaged file or a zip bomb). Open it in a spreadsheet program and save it again, or save the sheet as CSV.',
    );
  });

  it('bytes before the archive', () => {
    const bytes = Buffer.concat([Buffer.alloc(4096, 0x20), xlsxFile(header, rows(10), 10)]);
    expect(refused([file('prepended.xlsx', bytes), '--model', 'score ~ group'])).toMatch(
      // The offsets in the end record and the directory no longer point at records, and an XLSX is not followed past such bytes (a DOCX is).
      /^plumbline: prepended\.xlsx: cannot be read as an XLSX file: its zip directory cannot be walked: the end record places it at byte 1,\d{3}, where no directory entry starts\. Open it/,
    );
  });

  it('not a zip archive at all', () => {
    expect(refused([file('text.xlsx', 'score,group\n1,a\n'), '--model', 'score ~ group'])).toBe(
      'plumbline: text.xlsx: cannot be read as an XLSX file: it is not a zip archive, or it was cut short: it has no end of central directory record, so its directory cannot be found. Open it in a spreadsheet program and save it again, or save the sheet as CSV.',
    );
  });
});
