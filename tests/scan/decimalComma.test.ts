import { describe, expect, it } from 'vitest';
import { commaNumberAsPoint, readNumber } from '../../src/scan/cursor.js';
import { auditText } from '../../src/audit.js';
import { resolveConfig } from '../../src/checks/config.js';
import { dfTexts, onlyResult } from './helpers.js';

/**
 * Decimal commas, as manuscripts from many countries write numbers (the
 * German-language APA adaptation, for one, prints "p = ,046"; common
 * practice, no single source). A comma is a decimal comma only where the
 * number cannot be a list or a thousands group: the df stay a list.
 */
describe('decimal commas', () => {
  it.each([
    ['F(1, 44) = 4.21, p = 0,046', 4.21, 0.046, 3],
    ['F(1; 44) = 4,21; p = 0,046', 4.21, 0.046, 3],
    ['F(1, 44) = 4,21, p = ,046', 4.21, 0.046, 3],
    ['F(1,44) = 4,21, p < 0,05', 4.21, 0.05, 2],
    ['t(44) = -2,10, p = 3,2 × 10^-2', -2.1, 0.032, 1],
  ])('reads %s', (written, value, p, pDecimals) => {
    const result = onlyResult(`Scores differed, ${written}.`);
    expect(dfTexts(result).map(Number)).toEqual(result.kind === 'F' ? [1, 44] : [44]);
    expect(result.value?.value).toBe(value);
    expect(result.p?.value.value).toBeCloseTo(p, 12);
    expect(result.p?.value.decimals).toBe(pDecimals);
  });

  it('reads effect sizes and their intervals written with decimal commas', () => {
    const result = onlyResult('Scores differed, F(1; 44) = 4,21; p = 0,046; ηp2 = 0,09; 90% CI [0,00; 0,23].');
    expect(result.effects).toHaveLength(1);
    expect(result.effects[0]).toMatchObject({ kind: 'partial-eta-squared', value: { value: 0.09, decimals: 2 } });
    expect(result.effects[0]?.interval).toMatchObject({ level: 0.9, low: { value: 0 }, high: { value: 0.23 } });
  });

  it('keeps a comma between interval bounds a separator: [0,1] is 0 to 1', () => {
    const result = onlyResult('Scores differed, F(1, 44) = 4.21, p = .046, ηp2 = .09, 90% CI [0,1].');
    expect(result.effects[0]?.interval).toMatchObject({ low: { value: 0 }, high: { value: 1 } });
  });

  it('gives no flag on a consistent result written with decimal commas (before, "p = 0,046" was read as p = 0)', () => {
    const config = resolveConfig({});
    const audited = auditText('Scores differed, F(1; 44) = 4,21; p = 0,046; ηp2 = 0,09.', config, 'comma.txt');
    expect(audited.statistics).toHaveLength(1);
    expect(audited.statistics[0]?.findings).toEqual([]);
    // And a wrong one is still caught, with the numbers shown with points.
    const wrong = auditText('Scores differed, F(1; 44) = 4,21; p = 0,46.', config, 'comma.txt');
    expect(wrong.statistics[0]?.findings.map((f) => f.rule)).toEqual(['p-value-mismatch']);
    expect(wrong.statistics[0]?.findings[0]?.message).toContain('F(1, 44) = 4.21 gives p = 0.0462');
  });

  it('reads three digits after a whole number in a test statistic as a thousands group, as English-language manuscripts write it', () => {
    expect(onlyResult('The model fitted, χ2(1, N = 5000) = 1,234.50, p < .001.').value?.value).toBe(1234.5);
    expect(onlyResult('The model fitted, χ2(1, N = 5000) = 12,345, p < .001.').value?.value).toBe(12345);
    expect(onlyResult('Scores differed, t(44) = 0,125, p = .90.').value?.value).toBe(0.125);
  });

  it('readNumber: decimal commas only when asked for', () => {
    expect(readNumber('1,44)', 0)?.number.text).toBe('1');
    expect(readNumber('0,046.', 0, true, 'yes')?.number).toMatchObject({ text: '0.046', value: 0.046, decimals: 3 });
    expect(readNumber(',046', 0, true, 'yes')?.number).toMatchObject({ text: '.046', decimals: 3 });
    expect(readNumber('1,234,567.5 ', 0, true, 'unlessThousands')?.number).toMatchObject({ value: 1234567.5, decimals: 1 });
    expect(readNumber('4,21,', 0, true, 'unlessThousands')).toMatchObject({ number: { value: 4.21 }, end: 4 });
    expect(readNumber('- 2,5', 0, true, 'yes')?.number.value).toBe(-2.5);
  });
});

describe('decimal commas in group statistics', () => {
  const config = resolveConfig({});
  const rules = (text: string): string[] => auditText(text, config, 'groups.txt').statistics.flatMap((s) => s.findings.map((f) => f.rule));
  // Student's t from M = 4.21 (1.05) and 3.62 (1.10), n = 30 each: (4.21 - 3.62) / sqrt(1.05²/30 + 1.10²/30) = 2.12
  // (the formula of scipy.stats.ttest_ind_from_stats, as in tests/fixtures/stats/gen_summary.py; arithmetic by hand).
  const groups = 'the trained group (M = 4,21; SD = 1,05; n = 30) scored higher than the control group (M = 3,62; SD = 1,10; n = 30)';

  it('are read in text, and checked against the test', () => {
    expect(rules(`The groups differed: ${groups}, t(58) = 2,12; p = ,038.`)).toEqual([]);
    expect(rules(`The groups differed: ${groups}, t(58) = 3,50; p = ,001.`)).toEqual(['group-statistics-test-mismatch']);
  });

  it('are read in a table written with decimal commas', () => {
    const table = 'Table 1\nScores by group\n\n| Group | M (SD) | n |\n|---|---|---|\n| Trained | 4,21 (1,05) | 30 |\n| Control | 3,62 (1,10) | 30 |\n\n';
    expect(rules(`${table}The groups in Table 1 differed, t(58) = 2,12; p = ,038.`)).toEqual([]);
    expect(rules(`${table}The groups in Table 1 differed, t(58) = 3,50; p = ,001.`)).toEqual(['group-statistics-test-mismatch']);
  });

  it('commaNumberAsPoint: a decimal comma, or a thousands group of exactly three digits after a non-zero whole part', () => {
    expect(['4,21', ',046', '0,123', '-2,5', '1,234', '12,3456', '4.21'].map(commaNumberAsPoint)).toEqual(['4.21', '.046', '0.123', '-2.5', '1234', '12.3456', '4.21']);
  });
});
