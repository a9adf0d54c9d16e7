/**
 * Text whose UTF-8 bytes a page read in another code page, through the built
 * command line: Windows-1252 ("âˆ’" for "−") and Windows-1257, the Baltic code
 * page, whose lead byte reads "ā" ("āˆ’" for "−", "Ļ‡" for "χ", "ā‰¤" for "≤"),
 * as journal pages served with the wrong encoding show them (common practice:
 * the byte values are those of the code pages' published tables). The
 * sentences are made up.
 */
import { describe, expect, it } from 'vitest';
import { scanTextJson } from './scanDocumentJson.js';

describe('glyphs garbled by a wrong text encoding', () => {
  it('reads minus signs, chi and less-or-equal garbled through Windows-1252 or Windows-1257', () => {
    const document = scanTextJson(
      'Scores fell, t(20) = âˆ’2.10, p = .049, and again, t(20) = āˆ’2.30, p = .032; the link was negative, r(30) = āˆ’0.33, p = .068; ' +
        'groups differed, Ļ‡2(1) = 4.20, p = .040, and F(1, 20) = 4.35, p ā‰¤ .05.\n',
    );
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.p?.comparator ?? null])).toEqual([
      ['t', -2.1, '='],
      ['t', -2.3, '='],
      ['r', -0.33, '='],
      ['chi2', 4.2, '='],
      ['F', 4.35, '<='],
    ]);
  });
});
