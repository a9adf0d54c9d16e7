import { describe, expect, it } from 'vitest';
import { auditText } from '../../src/audit.js';
import { resolveConfig } from '../../src/checks/config.js';
import { scanText } from '../../src/scan/scan.js';
import { loadFixture } from '../stats/referenceFixtures.js';
import { onlyResult } from './helpers.js';

const config = resolveConfig({});
const fixture = loadFixture<{
  exact: { n: number; rho: number; p: number }[];
  scipy: { n: number; ties: boolean; rho: number; p: number }[];
}>('stats/spearman.json');

const twoDecimals = (value: number): string => value.toFixed(2).replace(/^(-?)0\./, '$1.');
const printedP = (p: number): string => (p < 0.001 ? 'p < .001' : `p = ${p.toFixed(3).replace(/^0\./, '.')}`);

describe("Spearman's rank correlation", () => {
  it.each([
    ['Ranks correlated, rs(10) = .60, p = .045.'],
    ['Ranks correlated, r_s(10) = .60, p = .045.'],
    ['Ranks correlated, ρ(10) = .60, p = .045.'],
    ["Spearman's correlation was large, r(10) = .60, p = .045."],
  ])('is read in %s', (text) => {
    expect(onlyResult(text)).toMatchObject({ kind: 'r', symbol: 'rs', df: [{ value: 10 }] });
  });

  it('is not read into a Pearson r, a rho of a model, or an r after the sentence that named Spearman', () => {
    expect(onlyResult('Pearson r(10) = .60, p = .045.').symbol).toBeUndefined();
    expect(onlyResult('We used Spearman correlations for the ranks. Pearson r(10) = .60, p = .045.').symbol).toBeUndefined();
    expect(scanText('The rho of the model, rho = 2.1, was fixed.').results).toEqual([]);
    expect(scanText('The ranks, rs, were stored.').results).toEqual([]);
  });

  it('gives no flag on SciPy spearmanr output (t approximation, with and without ties), printed as authors round it', () => {
    // Reference: SciPy 1.10.1 scipy.stats.spearmanr on seeded samples, via tests/fixtures/stats/gen_spearman.py.
    expect(fixture.scipy.length).toBeGreaterThanOrEqual(50);
    for (const c of fixture.scipy) {
      const text = `Ranks correlated, rs(${c.n - 2}) = ${twoDecimals(c.rho)}, ${printedP(c.p)}.`;
      expect(auditText(text, config, 'rs.txt').statistics[0]?.findings, text).toEqual([]);
    }
  });

  it('gives no flag on the exact permutation p, the one R prints for small samples without ties', () => {
    // Reference: the exact distribution of S counted by tests/fixtures/stats/gen_spearman.py.
    let checked = 0;
    for (const point of fixture.exact) {
      if (Math.abs(point.rho) >= 0.995 || point.p >= 0.9995) continue; // printed as 1.00, or p = 1.000
      const text = `Ranks correlated, rs(${point.n - 2}) = ${twoDecimals(point.rho)}, ${printedP(point.p)}.`;
      expect(auditText(text, config, 'rs.txt').statistics[0]?.findings, text).toEqual([]);
      checked += 1;
    }
    expect(checked).toBeGreaterThan(300);
  });

  it('flags a p that fits no convention, and says the range spans them', () => {
    const [statistic] = auditText('Ranks correlated, rs(10) = .60, p = .010.', config, 'rs.txt').statistics;
    expect(statistic?.findings.map((f) => f.rule)).toEqual(['p-value-mismatch']);
    expect(statistic?.findings[0]?.message).toContain("over the usual conventions for the p of Spearman's rs and allowing for rounding");
    // The same numbers as a Pearson r: the t approximation alone (p = .039) does not fit .045.
    expect(auditText('Pearson r(10) = .60, p = .045.', config, 'r.txt').statistics[0]?.findings.map((f) => f.rule)).toEqual(['p-value-mismatch']);
  });
});
