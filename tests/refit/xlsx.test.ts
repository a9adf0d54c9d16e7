import { describe, expect, it } from 'vitest';
import { countTags, sheetExtent } from '../../src/refit/xlsx.js';

/** The extent measured in one slice and in slices cut at every size from 1 byte up: a tag cut between slices is never lost or misread. */
function extentEverySlicing(xml: string): { rows: number; columns: number } {
  const bytes = Buffer.from(xml, 'utf8');
  const whole = sheetExtent(bytes);
  for (let slice = 1; slice <= bytes.length; slice++) expect(sheetExtent(bytes, slice), `slices of ${slice} bytes`).toEqual(whole);
  return whole;
}

describe('the extent of a sheet, as the reader lays it out', () => {
  it('rows take their r or follow the row before; cells take their reference or follow the cell before', () => {
    expect(extentEverySlicing('<sheetData><row r="3"><c r="B3"><v>1</v></c></row><row><c/><c/><c t="s"><v>0</v></c></row></sheetData>')).toEqual({ rows: 4, columns: 3 });
  });

  it('reads namespace prefixes, single quotes and r after other attributes', () => {
    expect(extentEverySlicing(`<x:sheetData><x:row spans="1:2" r='2'><x:c s="1" r='AA2'/></x:row></x:sheetData>`)).toEqual({ rows: 2, columns: 27 });
  });

  it('a cell reference beyond the rows counts: one cell at XFD1048576 spans the whole sheet', () => {
    expect(extentEverySlicing('<row r="1"><c r="A1"/></row><row r="2"><c r="XFD1048576"/></row>')).toEqual({ rows: 1_048_576, columns: 16_384 });
  });

  it('an r written inside another attribute\'s value is not taken for the real one', () => {
    expect(extentEverySlicing(`<row r="1"><c s=' r="A1"' r="XFD1"/></row>`)).toEqual({ rows: 1, columns: 16_384 });
  });

  it('a tag whose attributes cannot be read one by one counts every r in it: never less than the reader may lay out', () => {
    expect(extentEverySlicing('<row r="1"><c r="A1" hidden r="XFD1"/></row>')).toEqual({ rows: 1, columns: 16_384 });
  });

  it('column definitions and other tags starting with c or row are not cells or rows', () => {
    expect(extentEverySlicing('<cols><col min="1" max="16384"/></cols><rowBreaks count="1"><brk id="900000"/></rowBreaks><row r="2"><c r="C2"/></row>')).toEqual({ rows: 2, columns: 3 });
  });
});

describe('counting tags', () => {
  it('counts start and empty-element tags of one name, with or without a prefix, and nothing else', () => {
    expect(countTags(Buffer.from('<sst><si><t>a</t></si><x:si/><si ><t>b</t></si><sis/></sst>'), 'si')).toBe(3);
  });
});
