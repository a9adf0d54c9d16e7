import { describe, expect, it } from 'vitest';
import { auditText } from '../../src/audit.js';
import { resolveConfig } from '../../src/checks/config.js';
import { chiSquareUpperTail } from '../../src/stats/index.js';
import { loadFixture } from '../stats/referenceFixtures.js';
import { onlyResult } from './helpers.js';
import { scanText } from '../../src/scan/scan.js';

interface KruskalCase { k: number; n: number; h: number; df: number; p: number }

// Reference: SciPy 1.10.1 scipy.stats.kruskal (tie-corrected H, p = chi2.sf(H, k - 1)) on seeded
// integer ratings, via tests/fixtures/stats/gen_kruskal.py.
const fixture = loadFixture<{ cases: KruskalCase[] }>('stats/kruskal_wallis.json');
const config = resolveConfig({});

/** The result as an author prints it: H to two decimals, p to three or "< .001". */
function printed({ h, df, p }: KruskalCase): string {
  return `H(${df}) = ${h.toFixed(2)}, p ${p < 0.001 ? '< .001' : `= ${p.toFixed(3).replace(/^0/, '')}`}`;
}

describe('Kruskal-Wallis H', () => {
  it('is read as a chi-square test with k - 1 df, its symbol kept', () => {
    const result = onlyResult('Ratings differed between the four kiosks, H(3) = 12.40, p = .006.');
    expect(result).toMatchObject({ kind: 'chi2', symbol: 'H', df: [{ value: 3 }], value: { value: 12.4 } });
    expect(onlyResult('Ratings differed, H(2, N = 60) = 7.81, p = .020.').sampleSize?.value).toBe(60);
  });

  it("recomputes SciPy's kruskal p from H to 1e-10 relative", () => {
    expect(fixture.cases.length).toBeGreaterThanOrEqual(45);
    for (const c of fixture.cases) expect(Math.abs(chiSquareUpperTail(c.h, c.df) - c.p) / c.p, `H(${c.df}) = ${c.h}`).toBeLessThan(1e-10);
  });

  it('gives no flag on any SciPy result printed as authors round it, and flags each with a wrong p', () => {
    for (const c of fixture.cases) {
      const consistent = auditText(`The kiosks differed, ${printed(c)}.`, config, 'h.txt').statistics;
      expect(consistent, printed(c)).toHaveLength(1);
      expect(consistent[0]!.findings, printed(c)).toEqual([]);
      // A p printed ten times too small (or too large) is caught.
      const wrongP = c.p > 0.1 ? c.p / 10 : Math.min(0.99, c.p * 10);
      if (c.p < 0.001) continue; // "< .001" with a smaller p is not wrong
      const wrong = auditText(`The kiosks differed, H(${c.df}) = ${c.h.toFixed(2)}, p = ${wrongP.toFixed(3).replace(/^0/, '')}.`, config, 'h.txt').statistics;
      expect(wrong[0]!.findings.map((f) => f.rule), printed(c)).toContain('p-value-mismatch');
      expect(wrong[0]!.findings[0]!.message).toMatch(/^H\(\d\) = /);
    }
  });

  it.each([
    ['Broad-sense heritability was high, H2 = .45, p < .001.'],
    ['Broad-sense heritability was high, H^2 = .45.'],
    ['The entropy H(X) = 2.3 bits, p = .04 in the second block.'],
    ['The cumulative hazard reached H(5) = 0.32 by the fifth year.'],
    ['Hypothesis H1 = supported; H(2) = 7.81 was the statistic.'],
    ['The Hs = 12 items'],
  ])('is not read in %s', (text) => {
    expect(scanText(text).results).toEqual([]);
  });
});
