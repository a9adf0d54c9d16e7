import { describe, expect, it } from 'vitest';
import { auditText } from '../../src/audit.js';
import { resolveConfig } from '../../src/checks/config.js';
import { scanText } from '../../src/scan/scan.js';
import { onlyResult } from './helpers.js';

// r = .30 with n = 90 (df = 88): t = .30 * sqrt(88 / (1 - .09)) = 2.950, two-tailed p = .00407
// (SciPy 1.10.1 scipy.stats.t.sf(2.950, 88) * 2, computed when the test was written).
describe('a correlation written without df, its sample size after it', () => {
  it.each(['r = .30, p = .004, n = 90', 'r = .30, p = .004, N = 90', 'r = .30, p = .004 (n = 90)', 'r = .30, n = 90, p = .004', 'r = .30 (N = 90), p = .004'])('%s has df = n - 2', (written) => {
    const result = onlyResult(`Scores correlated, ${written}.`);
    expect(result.df.map((df) => df.value)).toEqual([88]);
    expect(result.sampleSize?.value).toBe(90);
    expect(result.dfFrom).toBe('sample-size');
  });

  it('still needs a p to count as a result', () => {
    expect(scanText('The correlation was r = .30, n = 90, in the pilot.').results).toEqual([]);
  });

  it('keeps printed df as printed', () => {
    const result = onlyResult('Scores correlated, r(88) = .30, p = .004, n = 90.');
    expect(result.df.map((df) => df.value)).toEqual([88]);
    expect(result.dfFrom).toBeUndefined();
  });

  it('takes no sample size that is not a whole number of at least 3, and none for other statistics', () => {
    expect(onlyResult('Scores correlated, r = .30, p = .004, n = 2.5.').df).toEqual([]);
    expect(onlyResult('Scores correlated, r = .30, p = .004, n = 2.').df).toEqual([]);
    expect(onlyResult('Groups differed, t(88) = 2.95, p = .004, n = 120.').df.map((df) => df.value)).toEqual([88]);
  });

  it('is checked, and the message says the df were worked out, naming no df slip', () => {
    const config = resolveConfig({});
    expect(auditText('Scores correlated, r = .30, p = .004, n = 90.', config, 'r.txt').statistics[0]?.findings).toEqual([]);
    const [statistic] = auditText('Scores correlated, r = .30, p = .04, n = 90.', config, 'r.txt').statistics;
    expect(statistic?.dfFrom).toBe('sample-size');
    expect(statistic?.findings).toHaveLength(1);
    expect(statistic?.findings[0]).toMatchObject({ rule: 'p-value-mismatch' });
    expect(statistic?.findings[0]?.message).toMatch(/^r = \.30 \(n = 90, so df = 88\) gives p = 0\.00407/);
    expect(statistic?.findings[0]?.slip).toBeUndefined();
  });
});
