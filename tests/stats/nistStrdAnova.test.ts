import { describe, expect, it } from 'vitest';
import { fUpperTail } from '../../src/stats/fDistribution.js';
import { loadFixture, relativeFailures } from './referenceFixtures.js';

interface Certified {
  datasets: Record<string, { between: { df: number; F: string }; within: { df: number } }>;
}
interface NistPoint { dataset: string; f: number; df1: number; df2: number; scipy: number; mpmath: number; mpmathLog10: number }

// NIST StRD ANOVA, certified values (tests/fixtures/nist-strd-anova/certified.json, copied from the
// NIST/ITL Statistical Reference Datasets). p references: SciPy 1.10.1 scipy.stats.f.sf and mpmath,
// via tests/fixtures/stats/gen_nist_p.py.
const certified = loadFixture<Certified>('nist-strd-anova/certified.json');
const pValues = loadFixture<{ points: NistPoint[] }>('stats/nist_strd_anova_p.json').points;

describe('fUpperTail on the NIST StRD ANOVA certified F statistics', () => {
  it('has a p fixture entry for every certified data set, with the certified F and df', () => {
    const names = Object.keys(certified.datasets).sort();
    expect(pValues.map((point) => point.dataset).sort()).toEqual(names);
    for (const point of pValues) {
      const data = certified.datasets[point.dataset]!;
      expect(point.f).toBe(Number(data.between.F));
      expect([point.df1, point.df2]).toEqual([data.between.df, data.within.df]);
    }
  });

  it('gives a p in [0, 1] that matches SciPy 1.10.1 and mpmath to 1e-10 relative', () => {
    const computed = pValues.map((point) => ({ point, p: fUpperTail(point.f, point.df1, point.df2) }));
    for (const { p } of computed) {
      expect(p).toBeGreaterThanOrEqual(0);
      expect(p).toBeLessThanOrEqual(1);
    }
    const representable = computed.filter(({ point }) => point.mpmathLog10 > -307);
    expect(representable.length).toBeGreaterThanOrEqual(8);
    const label = (point: NistPoint) => `NIST StRD ANOVA, dataset ${point.dataset}: F(${point.df1}, ${point.df2}) = ${point.f}`;
    expect(relativeFailures(representable.map(({ point, p }) => ({ label: `${label(point)} vs SciPy`, computed: p, reference: point.scipy })), 1e-10)).toEqual([]);
    expect(relativeFailures(representable.map(({ point, p }) => ({ label: `${label(point)} vs mpmath`, computed: p, reference: point.mpmath })), 1e-10)).toEqual([]);
  });

  it('underflows to exactly 0 only where the true p is below the smallest double (F = 2001 on 8 and 18000 df)', () => {
    for (const point of pValues.filter((entry) => entry.mpmathLog10 <= -324)) {
      expect(fUpperTail(point.f, point.df1, point.df2)).toBe(0);
      expect(point.scipy).toBe(0);
    }
  });
});
