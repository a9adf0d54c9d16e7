import { describe, expect, it } from 'vitest';
import { holmAdjusted, pairwiseComparisons, POST_HOC_METHODS, sidakAdjusted, type PostHocMethod } from '../../src/stats/postHoc.js';
import { loadFixture, relativeError, relativeFailures, type Comparison } from './referenceFixtures.js';

interface FixturePair {
  first: number;
  second: number;
  difference: number;
  se: number;
  t: number;
  pLsd: number;
  tukeyDifference: number;
  pTukey: number;
  tukeyLower: number;
  tukeyHigh: number;
  pBonferroni: number;
  pHolm: number;
  pSidak: number;
  pScheffe: number;
  [bound: string]: number;
}
interface FixtureCase {
  label: string;
  means: number[];
  ns: number[];
  errorMeanSquare: number;
  errorDf: number;
  level: number;
  pairs: FixturePair[];
}

// Written by tests/fixtures/stats/gen_post_hoc.py: scipy 1.10.1 tukey_hsd (Tukey's p and interval),
// statsmodels 0.13.5 multipletests (Bonferroni, Holm, Sidak p), scipy t / f sf (LSD and Scheffe p), and t and F
// quantiles from mpmath at 50 digits for the other intervals (SciPy's t.ppf misses 1e-8 there; see the generator).
const fixture = loadFixture<{ cases: FixtureCase[] }>('stats/post_hoc.json');
// Written by tests/fixtures/stats/gen_post_hoc_tukey.py from post_hoc.json: the Tukey(-Kramer) p and interval of every
// pair of the cases with more than two groups, by mpmath 1.2.1 (the 30-digit studentized range integral of
// tests/fixtures/refit/gen_refit_precision.py), which tukey_hsd's 1e-9 absolute accuracy cannot give.
const tukeyReference = loadFixture<{ cases: Array<{ label: string; pairs: Array<{ p: number; lower: number; upper: number }> }> }>('stats/post_hoc_tukey.json');
const groupsOf = (c: FixtureCase) => c.means.map((mean, i) => ({ label: `g${i + 1}`, mean, n: c.ns[i]! }));
const run = (c: FixtureCase, method: PostHocMethod) => pairwiseComparisons(groupsOf(c), c.errorMeanSquare, c.errorDf, method, c.level)!;

const P_COLUMN: Record<Exclude<PostHocMethod, 'tukey'>, string> = { lsd: 'pLsd', bonferroni: 'pBonferroni', holm: 'pHolm', sidak: 'pSidak', scheffe: 'pScheffe' };

describe('pairwise comparisons against SciPy 1.10.1 and statsmodels 0.13.5 (gen_post_hoc.py)', () => {
  for (const c of fixture.cases) {
    it(`${c.label}: differences, SEs and t to 1e-10 relative`, () => {
      const rows = run(c, 'lsd');
      expect(rows).toHaveLength(c.pairs.length);
      const comparisons: Comparison[] = rows.flatMap((row, i) => [
        { label: `difference ${i}`, computed: row.difference, reference: c.pairs[i]!.difference },
        { label: `SE ${i}`, computed: row.se, reference: c.pairs[i]!.se },
        { label: `t ${i}`, computed: row.statistic, reference: c.pairs[i]!.t },
        // SciPy's tukey_hsd reports the same mean difference.
        { label: `tukey_hsd difference ${i}`, computed: row.difference, reference: c.pairs[i]!.tukeyDifference },
      ]);
      expect(relativeFailures(comparisons, 1e-10)).toEqual([]);
    });

    for (const method of ['lsd', 'bonferroni', 'holm', 'sidak', 'scheffe'] as const) {
      it(`${c.label}: ${method} p (${method === 'lsd' || method === 'scheffe' ? 'scipy t/f sf' : 'statsmodels multipletests'}) and interval (mpmath quantiles) to 1e-9 relative`, () => {
        const rows = run(c, method);
        const bounds = method === 'holm' ? 'bonferroni' : method;
        const comparisons: Comparison[] = rows.flatMap((row, i) => [
          { label: `p ${i}`, computed: row.p, reference: c.pairs[i]![P_COLUMN[method]]! },
          { label: `lower ${i}`, computed: row.lower, reference: c.pairs[i]![`${bounds}Lower`]! },
          { label: `upper ${i}`, computed: row.upper, reference: c.pairs[i]![`${bounds}Upper`]! },
        ]);
        expect(relativeFailures(comparisons, 1e-9)).toEqual([]);
      });
    }

    const exact = tukeyReference.cases.find((entry) => entry.label === c.label);
    if (exact) {
      it(`${c.label}: Tukey(-Kramer) p and interval against mpmath (gen_post_hoc_tukey.py) to 1e-9 relative`, () => {
        const rows = run(c, 'tukey');
        const comparisons: Comparison[] = rows.flatMap((row, i) => [
          { label: `p ${i}`, computed: row.p, reference: exact.pairs[i]!.p },
          { label: `lower ${i}`, computed: row.lower, reference: exact.pairs[i]!.lower },
          { label: `upper ${i}`, computed: row.upper, reference: exact.pairs[i]!.upper },
        ]);
        expect(relativeFailures(comparisons, 1e-9)).toEqual([]);
      });
    }

    it(`${c.label}: Tukey(-Kramer) p and interval against scipy.stats.tukey_hsd`, () => {
      const rows = run(c, 'tukey');
      // SciPy 1.10.1's tukey_hsd takes p as 1 - cdf of its studentized range (numerical integration), good to
      // about 1e-9 absolute; ours is the direct upper tail (held to 1e-8 relative against QUADPACK in
      // studentizedRange.test.ts). So p is compared to 1e-7 absolute and, where p > 1e-4, 1e-6 relative.
      const pFailures = rows.flatMap((row, i) => {
        const reference = c.pairs[i]!.pTukey;
        const ok = Math.abs(row.p - reference) < 1e-7 && (reference <= 1e-4 || relativeError(row.p, reference) < 1e-6);
        return ok ? [] : [`pair ${i}: p ${row.p} against ${reference}`];
      });
      expect(pFailures).toEqual([]);
      const comparisons: Comparison[] = rows.flatMap((row, i) => [
        { label: `q ${i}`, computed: row.statistic, reference: Math.SQRT2 * Math.abs(c.pairs[i]!.t) },
        { label: `lower ${i}`, computed: row.lower, reference: c.pairs[i]!.tukeyLower },
        { label: `upper ${i}`, computed: row.upper, reference: c.pairs[i]!.tukeyHigh },
      ]);
      expect(relativeFailures(comparisons, 1e-6)).toEqual([]);
    });
  }
});

describe('adjustments and edge cases', () => {
  it('two groups: every method gives the LSD p and interval except Scheffe (same F) and Tukey (q = sqrt 2 |t|, same p)', () => {
    const c = fixture.cases.find((entry) => entry.means.length === 2)!;
    const lsd = run(c, 'lsd')[0]!;
    for (const method of POST_HOC_METHODS) {
      const row = run(c, method)[0]!;
      expect(relativeError(row.p, lsd.p)).toBeLessThan(1e-10);
      expect(relativeError(row.upper, lsd.upper)).toBeLessThan(1e-10);
    }
  });

  it("Holm is monotone in the sorted p and capped at 1; Sidak keeps the digits of a tiny p", () => {
    // Holm (1979): sorted .01, .02, .03, .5 times 4, 3, 2, 1 -> .04, .06, .06 (made nondecreasing), .5.
    expect(holmAdjusted([0.03, 0.5, 0.01, 0.02])).toEqual([expect.closeTo(0.06, 14), 0.5, expect.closeTo(0.04, 14), expect.closeTo(0.06, 14)]);
    expect(holmAdjusted([0.4, 0.6])).toEqual([0.8, 0.8]);
    expect(relativeError(sidakAdjusted(1e-15, 10), 1e-14)).toBeLessThan(1e-12);
  });

  it('refuses what cannot be computed', () => {
    expect(pairwiseComparisons([{ label: 'a', mean: 1, n: 5 }], 1, 10, 'tukey')).toBeNull();
    expect(pairwiseComparisons([{ label: 'a', mean: 1, n: 5 }, { label: 'b', mean: 2, n: 5 }], 0, 10, 'tukey')).toBeNull();
    expect(pairwiseComparisons([{ label: 'a', mean: 1, n: 5 }, { label: 'b', mean: 2, n: 5 }], 1, 0, 'lsd')).toBeNull();
  });
});
