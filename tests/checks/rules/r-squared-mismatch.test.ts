import { describe, expect, it } from 'vitest';
import { auditText } from '../../../src/audit.js';
import { resolveConfig } from '../../../src/checks/config.js';
import { adjustedRSquared, partialEtaSquaredFromF } from '../../../src/stats/index.js';
import { loadFixture } from '../../stats/referenceFixtures.js';
import { flagsOf } from '../helpers.js';

const rule = 'r-squared-mismatch';

// F(3, 96) = 4.36: R² = 4.36*3 / (4.36*3 + 96) = 0.11990 and adjusted R² = 1 - (1 - R²) * 99 / 96 = 0.09240
// (the formulas of the rule's sources; arithmetic checked against statsmodels below).
const base = { kind: 'F' as const, df: ['3', '96'], value: '4.36', p: '= .006' };

describe(`${rule}: must pass`, () => {
  it.each([
    [[{ kind: 'r-squared' as const, value: '.12' }]],
    [[{ kind: 'r-squared' as const, value: '0.120' }, { kind: 'adjusted-r-squared' as const, value: '.09' }]],
    [[{ kind: 'adjusted-r-squared' as const, value: '.092' }]],
    // A change in R² is not read as R² by the scanner; other effect kinds are other rules' business.
    [[{ kind: 'partial-eta-squared' as const, value: '.12' }]],
  ])('%j', (effects) => {
    expect(flagsOf(rule, { ...base, effects })).toEqual([]);
  });
});

describe(`${rule}: must flag`, () => {
  it('an R² the F does not give', () => {
    const [finding] = flagsOf(rule, { ...base, effects: [{ kind: 'r-squared', value: '.30' }] });
    expect(finding).toMatchObject({ rule, severity: 'warn' });
    expect(finding!.message).toBe('R² = .30 is reported with F(3, 96) = 4.36, but if this F tests the whole model it gives R² = 0.1199 (0.1198 to 0.12 allowing for rounding).');
    expect(finding!.slip).toBeUndefined();
  });

  it('adjusted R² labelled R², and the reverse, named as the slip', () => {
    const [asR2] = flagsOf(rule, { ...base, effects: [{ kind: 'r-squared', value: '.09' }] });
    expect(asR2).toMatchObject({ slip: 'adjusted-r-squared-labelled-r-squared' });
    expect(asR2!.message).toContain('The value matches adjusted R² (0.0924)');
    const [asAdjusted] = flagsOf(rule, { ...base, effects: [{ kind: 'adjusted-r-squared', value: '.12' }] });
    expect(asAdjusted).toMatchObject({ slip: 'r-squared-labelled-adjusted' });
    expect(asAdjusted!.message).toMatch(/^R²adj = \.12 is reported/);
  });
});

interface FitCase { n: number; k: number; rsquared: number; rsquared_adj: number; f: number; p: number; df1: number; df2: number }

// Reference: statsmodels 0.13.5 OLS with a constant on seeded data, via tests/fixtures/stats/gen_regression_fit.py.
const fits = loadFixture<{ cases: FitCase[] }>('stats/regression_fit.json').cases;
const config = resolveConfig({});
const twoDecimals = (value: number): string => value.toFixed(2).replace(/^(-?)0\./, '$1.');

describe(`${rule} against statsmodels`, () => {
  it('R² and adjusted R² follow from F and df as statsmodels computes them (1e-10)', () => {
    expect(fits.length).toBeGreaterThanOrEqual(48);
    for (const c of fits) {
      const rSquared = partialEtaSquaredFromF(c.f, c.df1, c.df2);
      expect(Math.abs(rSquared - c.rsquared), `n = ${c.n}, k = ${c.k}`).toBeLessThan(1e-10);
      expect(Math.abs(adjustedRSquared(c.rsquared, c.df1, c.df2) - c.rsquared_adj), `n = ${c.n}, k = ${c.k}`).toBeLessThan(1e-10);
    }
  });

  it('no flag on any fit printed as APA style has it; a flag whenever R² is printed as the adjusted value that rounds differently', () => {
    let swapped = 0;
    for (const c of fits) {
      const f = c.f.toFixed(2);
      const p = c.p < 0.001 ? '< .001' : `= ${c.p.toFixed(3).replace(/^0/, '')}`;
      const text = `The model fitted, R² = ${twoDecimals(c.rsquared)}, adjusted R² = ${twoDecimals(c.rsquared_adj)}, F(${c.df1}, ${c.df2}) = ${f}, p ${p}.`;
      const [statistic] = auditText(text, config, 'fit.txt').statistics;
      expect(statistic?.effects.map((e) => e.kind), text).toEqual(['r-squared', 'adjusted-r-squared']);
      expect(statistic?.findings.filter((finding) => finding.rule === rule), text).toEqual([]);
      if (twoDecimals(c.rsquared) === twoDecimals(c.rsquared_adj) || c.rsquared_adj < 0) continue;
      const mislabelled = `The model fitted, R² = ${twoDecimals(c.rsquared_adj)}, F(${c.df1}, ${c.df2}) = ${f}, p ${p}.`;
      const findings = auditText(mislabelled, config, 'fit.txt').statistics[0]!.findings.filter((finding) => finding.rule === rule);
      // F printed to two decimals allows a range of R²; where that range reaches the adjusted value, no flag is right.
      const range = [partialEtaSquaredFromF(Number(f) - 0.005, c.df1, c.df2), partialEtaSquaredFromF(Number(f) + 0.005, c.df1, c.df2)];
      if (Number(twoDecimals(c.rsquared_adj)) + 0.005 < range[0]! - 0.005) {
        expect(findings, mislabelled).toHaveLength(1);
        swapped += 1;
      }
    }
    expect(swapped).toBeGreaterThan(10);
  });
});

describe('R² as the scanner reads it', () => {
  it.each([
    ['The model fitted, F(3, 96) = 4.36, p = .006, R² = .12, adj. R² = .09.'],
    ['The model fitted, R² = .12, adj. R² = .09, F(3, 96) = 4.36, p = .006.'],
    ['The model fitted, R2 = .12, adjusted R2 = .09, F(3, 96) = 4.36, p = .006.'],
  ])('%s: both read, no flag', (text) => {
    const [statistic] = auditText(text, config, 'fit.txt').statistics;
    expect(statistic?.effects.map((e) => [e.kind, e.value])).toEqual([
      ['r-squared', 0.12],
      ['adjusted-r-squared', 0.09],
    ]);
    expect(statistic?.findings).toEqual([]);
  });

  it('a change in R² before the F is not R²', () => {
    for (const text of ['ΔR² = .05, F(1, 95) = 5.40, p = .022.', '∆R2 = .05; F(1, 95) = 5.40, p = .022.', 'Delta R2 = .05, F(1, 95) = 5.40, p = .022.']) {
      expect(auditText(text, config, 'step.txt').statistics[0]?.effects, text).toEqual([]);
    }
  });
});
