import { describe, expect, it } from 'vitest';
import { auditText } from '../../../src/audit.js';
import { resolveConfig } from '../../../src/checks/config.js';
import { decimalSeparatorOf, readCell } from '../../../src/scan/tables/cells.js';

const config = resolveConfig({});

/**
 * An ANOVA table written with decimal commas (common practice in manuscripts
 * from many countries). Numbers: F(2, 57) = 4.21 gives p = .0197 (SciPy
 * 1.10.1 scipy.stats.f.sf), MS = SS / df: 12.40 / 2 = 6.20, 83.90 / 57 = 1.47,
 * F = 6.20 / 1.47 = 4.22, within rounding of 4.21.
 */
const commaTable = (p: string, f = '4,21'): string =>
  `Table 2\nANOVA of recall\n\n| Source | SS | df | MS | F | p |\n|---|---|---|---|---|---|\n| Dose | 12,40 | 2 | 6,20 | ${f} | ${p} |\n| Error | 83,90 | 57 | 1,47 | | |\n`;

describe('tables written with decimal commas', () => {
  it('are read, and a consistent row gets no flag', () => {
    for (const p of ['0,020', ',020', '0,02']) {
      const [statistic] = auditText(commaTable(p), config, 'table.md').statistics;
      expect(statistic, p).toMatchObject({ kind: 'F', df: [2, 57], value: 4.21, findings: [] });
      expect(statistic?.p?.value).toBeCloseTo(0.02, 12);
    }
  });

  it('are checked like any table: a wrong p and a wrong F are flagged', () => {
    expect(auditText(commaTable('0,002'), config, 'table.md').statistics[0]?.findings.map((f) => f.rule)).toContain('p-value-mismatch');
    expect(auditText(commaTable('0,020', '5,21'), config, 'table.md').statistics[0]?.findings.map((f) => f.rule)).toContain('table-arithmetic');
  });

  it('are found in plain text too (aligned columns)', () => {
    const text = 'Table 2\nANOVA of recall\n\nSource   SS     df   MS     F      p\nDose     12,40  2    6,20   4,21   ,020\nError    83,90  57   1,47\n\nThe text goes on.\n';
    expect(auditText(text, config, 'table.txt').statistics).toMatchObject([{ kind: 'F', df: [2, 57], value: 4.21, findings: [] }]);
  });

  it('decide the separator from cells that can only be one or the other', () => {
    expect(decimalSeparatorOf([['Dose', '12,40', '2', '0,019']])).toBe(',');
    expect(decimalSeparatorOf([['Dose', '1.234,5']])).toBe(',');
    expect(decimalSeparatorOf([['Dose', '12.40', '2', '.019']])).toBe('.');
    // Three digits after a whole number alone: a thousands group, as in English tables.
    expect(decimalSeparatorOf([['Total', '1,234', '2']])).toBe('.');
    // One cell that can only be a point outweighs any number of ambiguous ones.
    expect(decimalSeparatorOf([['Dose', '1,234', '0.05']])).toBe('.');
  });

  it('read each cell by the separator given', () => {
    expect(readCell('1,234', '.')).toMatchObject({ kind: 'number', number: { value: 1234, decimals: 0 } });
    expect(readCell('1,234', ',')).toMatchObject({ kind: 'number', number: { value: 1.234, decimals: 3 } });
    expect(readCell('1.234,5', ',')).toMatchObject({ kind: 'number', number: { value: 1234.5, decimals: 1 } });
    expect(readCell('< ,001***', ',')).toMatchObject({ kind: 'number', comparator: '<', number: { value: 0.001 } });
    expect(readCell('4,21', '.').kind).toBe('text');
    // A thousands group never follows a zero: "0,019" is not nineteen.
    expect(readCell('0,019', '.').kind).toBe('text');
    expect(readCell('0,019', 'either')).toMatchObject({ kind: 'number', number: { value: 0.019 } });
  });
});
