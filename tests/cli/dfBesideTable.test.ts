/**
 * df that only the lines beside a table state ("F-values have 2 and 57
 * degrees of freedom." under it), through the built command line: the
 * results are read with those df, the report says where they came from, and
 * a p they cannot give is flagged as a warning at most, since the sentence
 * may be about another analysis (common practice; see
 * src/scan/tables/readTableResults.ts, linesBeside).
 */
import { describe, expect, it } from 'vitest';
import { scanTextJson } from './scanDocumentJson.js';

const table = (p: string): string =>
  ['Results are shown below.', '', 'Table 2. Group differences', 'Variable F p', `Anxiety 4.21 ${p}`, 'Depression 1.05 .357', 'F-values have 2 and 57 degrees of freedom.', ''].join('\n');

describe('scan: df stated beside a table', () => {
  it('reads the table with those df and says where they came from', () => {
    const document = scanTextJson(table('.020'));
    const statistics = document.statistics.filter((statistic) => statistic.inTable);
    expect(statistics.map((statistic) => [statistic.value, statistic.df, statistic.dfFrom])).toEqual([
      [4.21, [2, 57], 'text-beside-table'],
      [1.05, [2, 57], 'text-beside-table'],
    ]);
    // F(2, 57) = 4.21 gives p = 0.0197 (SciPy 1.10.1 scipy.stats.f.sf(4.21, 2, 57), computed when the test was written).
    expect(statistics.flatMap((statistic) => statistic.findings)).toEqual([]);
  });

  it('flags a p those df cannot give, as a warning, naming where the df came from', () => {
    const document = scanTextJson(table('.200'));
    const findings = document.statistics.flatMap((statistic) => statistic.findings);
    expect(findings.map((finding) => [finding.rule, finding.severity])).toEqual([['p-value-mismatch', 'warn']]);
    expect(findings[0]!.message).toContain('from the text beside it');
  });
});
