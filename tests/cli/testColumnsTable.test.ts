/**
 * Group-comparison tables whose header ends with one test's columns ("Variable Group χ2 df p") and whose rows with
 * a test end with its cells, between group sub-headers one per line, section lines, categories' counts and
 * descriptive rows, as a web page's table comes out as text. Read through the built command line from a real
 * passage of the corpus (tests/corpus/real/passages, CC BY; its source is in the corpus manifest) and from a
 * made-up layout. What is asserted is what the rows print, read by eye.
 */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { scanDocumentJson, scanTextJson } from './scanDocumentJson.js';

const passage = (id: string): string => join(__dirname, '..', 'corpus', 'real', 'passages', `${id}.txt`);

describe('tables ending with a test columns', () => {
  it('reads the rows that end with χ2, df and p under a header of group names one per line (dvya-07)', () => {
    const document = scanDocumentJson(passage('dvya-07'));
    const read = document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.value ?? null]);
    // " Reported malaria diagnosis      0.650 1 0.420" under "Variable Group χ2 df p"; "Haematocrit 1.573 321 0.117a"
    // is a t test by its footnote "(a) – p for t-test"; "Birth outcome - - 0.623" prints no statistic.
    expect(read).toEqual([
      ['chi2', 0.65, [1], 0.42],
      ['chi2', 4.345, [1], 0.037],
      ['chi2', 4.91, [1], 0.027],
      ['t', 1.573, [321], 0.117],
      ['chi2', 1.78, [1], 0.182],
    ]);
    expect(document.findings.filter((finding) => finding.severity === 'fail')).toEqual([]);
    expect(document.tablesNotRead).toEqual([]);
  });

  it('takes a row\'s test from its own line only, past count rows, descriptives and a "< 0.001" set apart', () => {
    // Layout as web pages copy such tables; the numbers are made up.
    const document = scanTextJson(
      'Table 1. Characteristics by group\n\nCharacteristic Group t df p\nTreated\nn = 40\nControl\nn = 41\n' +
        'Age, years      2.10 79 0.039\n Mean (SD) 34.2 (5.1) 31.9 (4.8)    \nSex      0.52 79 0.60\n  Female 20 (50.0) 22 (53.7)    \n  Male 20 (50.0) 19 (46.3)    \n' +
        'Smoking      - - 0.41\n  Yes 5 (12.5) 7 (17.1)    \nIncome      4.02 79 < 0.001\n\nThe groups were alike at baseline in most respects, as the table shows for each of them.\n',
    );
    expect(document.statistics.map((statistic) => [statistic.kind, statistic.value, statistic.df, statistic.p?.value ?? null])).toEqual([
      ['t', 2.1, [79], 0.039],
      ['t', 0.52, [79], 0.6],
      ['t', 4.02, [79], 0.001],
    ]);
  });
});
