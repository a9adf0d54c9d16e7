import { describe, expect, it } from 'vitest';
import { fitAnova } from '../../src/refit/index.js';
import { agreeingDigits, fixturePath, loadJson } from './helpers.js';

/**
 * NIST StRD ANOVA, one-factor data sets, certified values in
 * tests/fixtures/nist-strd-anova/certified.json. Goal: at least 9
 * significant digits for the between-treatment SS, MS and F.
 */
interface Certified {
  datasets: Record<string, { observations: number; between: { df: number; ss: string; ms: string; F: string }; within: { df: number; ss: string; ms: string } }>;
}

const certified = loadJson<Certified>('nist-strd-anova/certified.json');
const columns: Record<string, [string, string]> = {
  AtmWtAg: ['agwt', 'instrument'],
  SiRstv: ['resistance', 'instrument'],
};

describe('NIST StRD one-factor ANOVA', () => {
  const names = Object.keys(certified.datasets);
  it('has all eleven data sets', () => {
    expect(names.sort()).toEqual(['AtmWtAg', 'SiRstv', ...Array.from({ length: 9 }, (_, i) => `SmLs0${i + 1}`)].sort());
  });

  for (const name of names) {
    it(`NIST StRD ANOVA, dataset ${name}: between-treatment SS, MS and F to >= 9 significant digits`, async () => {
      const cert = certified.datasets[name]!;
      const [y, group] = columns[name] ?? ['response', 'treatment'];
      const table = await fitAnova(fixturePath(`nist-strd-anova/${name}.csv`), {
        model: `${y} ~ ${group}`,
        factors: { [group]: {} },
      });
      expect(table.n).toBe(cert.observations);
      const row = table.terms[0]!;
      expect(row.df).toBe(cert.between.df);
      expect(table.residual.df).toBe(cert.within.df);
      const failures: string[] = [];
      const check = (quantity: string, computed: number, certifiedText: string) => {
        const digits = agreeingDigits(computed, Number(certifiedText));
        if (!(digits >= 9)) {
          failures.push(`NIST StRD ANOVA, dataset ${name}: ${quantity} computed ${computed} vs certified ${certifiedText} (${digits.toFixed(1)} digits)`);
        }
      };
      check('between-treatment SS', row.ss, cert.between.ss);
      check('between-treatment MS', row.ms, cert.between.ms);
      check('F', row.F, cert.between.F);
      check('within-treatment SS', table.residual.ss, cert.within.ss);
      check('within-treatment MS', table.residual.ms, cert.within.ms);
      expect(failures).toEqual([]);
    });
  }
});
