import { describe, expect, it } from 'vitest';
import {
  brownForsytheAnovaFromSummary,
  brownForsytheAnovaRange,
  welchAnovaFromSummary,
  welchAnovaRange,
  type GroupSummaryBox,
} from '../../src/stats/summaryStatistics.js';
import { roundingInterval } from '../../src/stats/reportedNumber.js';
import { loadFixture, relativeFailures } from './referenceFixtures.js';

/**
 * Reference: tests/fixtures/stats/welch_brown_forsythe.json, written by
 * gen_welch_brown_forsythe.py with statsmodels 0.13.5
 * (statsmodels.stats.oneway.anova_oneway, use_var "unequal" for Welch and
 * "bf" for Brown-Forsythe) on simulated raw data; SciPy has neither test.
 */
interface Group { mean: number; sd: number; n: number; printedMean: number; printedSd: number }
interface Case {
  label: string;
  decimals: number;
  groups: Group[];
  welch: { f: number; df1: number; df2: number; p: number };
  brownForsythe: { f: number; df1: number; df2: number; p: number; mehrotraDf1: number; mehrotraP: number };
}
const fixture = loadFixture<{ versions: { statsmodels: string }; cases: Case[] }>('stats/welch_brown_forsythe.json');
const SM = `statsmodels ${fixture.versions.statsmodels}`;

function boxes(c: Case): GroupSummaryBox[] {
  const printed = (value: number) => ({ value, decimals: c.decimals, text: value.toFixed(c.decimals), exponent: 0 });
  return c.groups.map((g) => ({ mean: roundingInterval(printed(g.printedMean)), sd: roundingInterval(printed(g.printedSd)), n: g.n }));
}

const inside = (value: number, range: { low: number; high: number }) => value >= range.low * (1 - 1e-12) && value <= range.high * (1 + 1e-12);

describe(`Welch's and Brown-Forsythe's F from group statistics against ${SM} anova_oneway`, () => {
  for (const c of fixture.cases) {
    it(`${c.label}: F, df and p at the exact statistics to 1e-10 relative`, () => {
      const exact = c.groups.map((g) => ({ mean: g.mean, sd: g.sd, n: g.n }));
      const welch = welchAnovaFromSummary(exact)!;
      const bf = brownForsytheAnovaFromSummary(exact)!;
      expect(welch.df1).toBe(c.welch.df1);
      expect(bf.df1).toBe(c.brownForsythe.df1);
      const comparisons = [
        { label: `${c.label} Welch F`, computed: welch.f, reference: c.welch.f },
        { label: `${c.label} Welch df2`, computed: welch.df2, reference: c.welch.df2 },
        { label: `${c.label} Welch p`, computed: welch.p, reference: c.welch.p },
        { label: `${c.label} Brown-Forsythe F*`, computed: bf.f, reference: c.brownForsythe.f },
        { label: `${c.label} Brown-Forsythe df2`, computed: bf.df2, reference: c.brownForsythe.df2 },
        { label: `${c.label} Brown-Forsythe p (df1 = k - 1)`, computed: bf.p, reference: c.brownForsythe.p },
        { label: `${c.label} Mehrotra df1`, computed: bf.mehrotraDf1, reference: c.brownForsythe.mehrotraDf1 },
      ];
      expect(relativeFailures(comparisons, 1e-10)).toEqual([]);
    });

    it(`${c.label}: the range over the printed means and SDs (${c.decimals} decimals) holds the true F, df2 and p`, () => {
      const welch = welchAnovaRange(boxes(c))!;
      const bf = brownForsytheAnovaRange(boxes(c))!;
      expect(inside(c.welch.f, welch.f), `Welch F ${c.welch.f} in [${welch.f.low}, ${welch.f.high}]`).toBe(true);
      expect(inside(c.welch.df2, welch.df2), `Welch df2 ${c.welch.df2} in [${welch.df2.low}, ${welch.df2.high}]`).toBe(true);
      expect(inside(c.brownForsythe.f, bf.f), `BF F ${c.brownForsythe.f} in [${bf.f.low}, ${bf.f.high}]`).toBe(true);
      expect(inside(c.brownForsythe.df2, bf.df2), `BF df2 ${c.brownForsythe.df2} in [${bf.df2.low}, ${bf.df2.high}]`).toBe(true);
      expect(inside(c.brownForsythe.p, bf.p)).toBe(true);
      // Tight enough to catch a slip: with two decimals the df2 range is narrower than one unit and the F range than a
      // tenth of F; with one decimal, than a sixth of df2 and a quarter of F.
      expect(bf.df2.high - bf.df2.low).toBeLessThan(c.decimals === 2 ? 1 : c.brownForsythe.df2 / 6);
      expect(bf.f.high - bf.f.low).toBeLessThan((c.decimals === 2 ? 0.1 : 0.25) * c.brownForsythe.f + 0.01);
    });
  }

  it('Brown-Forsythe F* needs a positive SD; equal SDs of zero give null', () => {
    expect(brownForsytheAnovaFromSummary([{ mean: 1, sd: 0, n: 5 }, { mean: 2, sd: 0, n: 5 }])).toBeNull();
  });
});
