import { describe, expect, it } from 'vitest';
import {
  independentTRange,
  oneWayAnovaFromSummary,
  oneWayAnovaRange,
  studentTFromSummary,
  weightedSpreadRange,
  welchAnovaFromSummary,
  welchAnovaRange,
  welchTFromSummary,
  type GroupSummaryBox,
} from '../../src/stats/summaryStatistics.js';
import { loadFixture, relativeError } from './referenceFixtures.js';

interface SummaryCase {
  means: number[];
  sds: number[];
  ns: number[];
  f: number;
  p: number;
  df1: number;
  df2: number;
  welchF: number;
  welchDf2: number;
  welchP: number;
  studentT?: number;
  studentP?: number;
  welchT?: number;
  welchP2?: number;
  welchDf?: number;
  boxLowF: number;
  boxHighF: number;
}

// SciPy 1.10.1 reference values written by tests/fixtures/stats/gen_summary.py
// (f_oneway on raw data with exactly these means and SDs; ttest_ind_from_stats; Welch's ANOVA by formula).
const fixture = loadFixture<{ cases: SummaryCase[] }>('stats/summary_statistics.json');
const groupsOf = (c: SummaryCase) => c.means.map((mean, i) => ({ mean, sd: c.sds[i]!, n: c.ns[i]! }));
const boxesOf = (c: SummaryCase, half = 0.005): GroupSummaryBox[] =>
  c.means.map((mean, i) => ({ mean: { low: mean - half, high: mean + half }, sd: { low: c.sds[i]! - half, high: c.sds[i]! + half }, n: c.ns[i]! }));

describe('tests from summary statistics against SciPy 1.10.1 (gen_summary.py)', () => {
  it.each(fixture.cases.map((c, i) => [i, c] as const))('case %i: classic and Welch one-way ANOVA', (_, c) => {
    const classic = oneWayAnovaFromSummary(groupsOf(c))!;
    expect(classic.df1).toBe(c.df1);
    expect(classic.df2).toBe(c.df2);
    if (c.f > 1e-12) expect(relativeError(classic.f, c.f)).toBeLessThan(1e-9);
    else expect(classic.f).toBeLessThan(1e-12);
    expect(Math.abs(classic.p - c.p)).toBeLessThan(1e-9);
    const welch = welchAnovaFromSummary(groupsOf(c))!;
    expect(Math.abs(welch.f - c.welchF)).toBeLessThan(1e-9 * Math.max(1, c.welchF));
    expect(relativeError(welch.df2, c.welchDf2)).toBeLessThan(1e-9);
    expect(Math.abs(welch.p - c.welchP)).toBeLessThan(1e-9);
  });

  it.each(fixture.cases.filter((c) => c.ns.length === 2).map((c, i) => [i, c] as const))('two-group case %i: Student and Welch t', (_, c) => {
    const [a, b] = groupsOf(c) as [ReturnType<typeof groupsOf>[number], ReturnType<typeof groupsOf>[number]];
    const student = studentTFromSummary(a, b)!;
    const welch = welchTFromSummary(a, b)!;
    expect(Math.abs(student.statistic - c.studentT!)).toBeLessThan(1e-9 * Math.max(1, Math.abs(c.studentT!)));
    expect(Math.abs(student.p - c.studentP!)).toBeLessThan(1e-9);
    expect(Math.abs(welch.statistic - c.welchT!)).toBeLessThan(1e-9 * Math.max(1, Math.abs(c.welchT!)));
    expect(relativeError(welch.df, c.welchDf!)).toBeLessThan(1e-9);
    expect(Math.abs(welch.p - c.welchP2!)).toBeLessThan(1e-9);
    // F of two groups is t squared.
    expect(relativeError(oneWayAnovaFromSummary([a, b])!.f, student.statistic ** 2)).toBeLessThan(1e-9);
  });

  it.each(fixture.cases.map((c, i) => [i, c] as const))(
    'case %i: the F range over the rounding box contains SciPy-optimised extremes and is tight',
    (_, c) => {
      const range = oneWayAnovaRange(boxesOf(c))!;
      const slack = 1e-9 * Math.max(1, c.boxHighF);
      expect(range.f.low).toBeLessThanOrEqual(c.boxLowF + slack);
      expect(range.f.high).toBeGreaterThanOrEqual(c.boxHighF - slack);
      // The optimiser from every vertex reaches the exact extremes closely.
      expect(Math.abs(range.f.low - c.boxLowF)).toBeLessThan(1e-5 * Math.max(1, c.boxHighF));
      expect(Math.abs(range.f.high - c.boxHighF)).toBeLessThan(1e-5 * Math.max(1, c.boxHighF));
      const welchRange = welchAnovaRange(boxesOf(c))!;
      const welchAtPrinted = welchAnovaFromSummary(groupsOf(c))!;
      expect(welchRange.f.low).toBeLessThanOrEqual(welchAtPrinted.f + 1e-12);
      expect(welchRange.f.high).toBeGreaterThanOrEqual(welchAtPrinted.f - 1e-12);
      expect(welchRange.df2.low).toBeLessThanOrEqual(welchAtPrinted.df2);
      expect(welchRange.df2.high).toBeGreaterThanOrEqual(welchAtPrinted.df2);
    },
  );
});

describe('one-way ANOVA from summary statistics: textbook example', () => {
  // Howell, D. C., Statistical Methods for Psychology (chapter on simple ANOVA), Eysenck's (1974)
  // recall data for five groups of 10 (Counting, Rhyming, Adjective, Imagery, Intentional).
  // FROM MEMORY: means 7.00, 6.90, 11.00, 13.40, 12.00; variances 3.33, 4.54, 6.22, 20.27, 14.00;
  // MS_error = 9.67, F(4, 45) = 9.08.
  it('gives F(4, 45) of about 9.08 and MS_error 9.67', () => {
    const variances = [3.33, 4.54, 6.22, 20.27, 14.0];
    const groups = [7.0, 6.9, 11.0, 13.4, 12.0].map((mean, i) => ({ mean, sd: Math.sqrt(variances[i]!), n: 10 }));
    const anova = oneWayAnovaFromSummary(groups)!;
    expect([anova.df1, anova.df2]).toEqual([4, 45]);
    expect(anova.ssWithin / 45).toBeCloseTo(9.672, 3);
    expect(anova.ssBetween).toBeCloseTo(351.52, 2);
    expect(anova.f).toBeGreaterThan(9.075);
    expect(anova.f).toBeLessThan(9.095);
    expect(anova.partialEtaSquared).toBeCloseTo(351.52 / (351.52 + 435.24), 4);
  });
});

describe('ranges over the rounding box', () => {
  it('the minimum spread clamps the means to a common value when the boxes overlap', () => {
    expect(weightedSpreadRange([{ low: 1, high: 2 }, { low: 1.5, high: 3 }], [10, 10]).low).toBeCloseTo(0, 12);
    // Disjoint boxes: the closest ends, 2 and 3, with equal weights: 10 * 0.25 * 2 = 5.
    expect(weightedSpreadRange([{ low: 1, high: 2 }, { low: 3, high: 4 }], [10, 10]).low).toBeCloseTo(5, 9);
    expect(weightedSpreadRange([{ low: 1, high: 2 }, { low: 3, high: 4 }], [10, 10]).high).toBeCloseTo(45, 9);
  });

  it('F is not monotone in a middle mean: its range is still exact', () => {
    // The middle group's mean moves between the others; the smallest F puts it at the grand mean.
    const boxes: GroupSummaryBox[] = [
      { mean: { low: 2.995, high: 3.005 }, sd: { low: 1, high: 1 }, n: 10 },
      { mean: { low: 3.4, high: 4.6 }, sd: { low: 1, high: 1 }, n: 10 },
      { mean: { low: 4.995, high: 5.005 }, sd: { low: 1, high: 1 }, n: 10 },
    ];
    const range = oneWayAnovaRange(boxes)!;
    const at = (middle: number, low: number, high: number) =>
      oneWayAnovaFromSummary([
        { mean: low, sd: 1, n: 10 },
        { mean: middle, sd: 1, n: 10 },
        { mean: high, sd: 1, n: 10 },
      ])!.f;
    expect(range.f.low).toBeCloseTo(at(4, 3.005, 4.995), 9);
    expect(range.f.high).toBeCloseTo(Math.max(at(3.4, 2.995, 5.005), at(4.6, 2.995, 5.005)), 9);
    for (let middle = 3.4; middle <= 4.6; middle += 0.05) {
      const f = at(middle, 3, 5);
      expect(f).toBeGreaterThanOrEqual(range.f.low - 1e-12);
      expect(f).toBeLessThanOrEqual(range.f.high + 1e-12);
    }
  });

  it('|t| range contains 0 when the mean boxes overlap, and Welch df stay within their bounds', () => {
    const a: GroupSummaryBox = { mean: { low: 3.45, high: 3.55 }, sd: { low: 1.15, high: 1.25 }, n: 12 };
    const b: GroupSummaryBox = { mean: { low: 3.5, high: 3.6 }, sd: { low: 0.35, high: 0.45 }, n: 40 };
    const student = independentTRange(a, b, 'student')!;
    expect(student.t.low).toBe(0);
    expect(student.df).toEqual({ low: 50, high: 50 });
    const welch = independentTRange(a, b, 'welch')!;
    expect(welch.df.low).toBeGreaterThanOrEqual(11);
    expect(welch.df.high).toBeLessThanOrEqual(50);
    for (const s1 of [1.15, 1.2, 1.25]) {
      for (const s2 of [0.35, 0.4, 0.45]) {
        const df = welchTFromSummary({ mean: 3.5, sd: s1, n: 12 }, { mean: 3.55, sd: s2, n: 40 })!.df;
        expect(df).toBeGreaterThanOrEqual(welch.df.low - 1e-9);
        expect(df).toBeLessThanOrEqual(welch.df.high + 1e-9);
      }
    }
  });

  it('rejects what cannot be computed', () => {
    expect(oneWayAnovaFromSummary([{ mean: 1, sd: 1, n: 5 }])).toBeNull();
    expect(oneWayAnovaFromSummary([{ mean: 1, sd: 1, n: 1 }, { mean: 2, sd: 1, n: 5 }])).toBeNull();
    expect(welchTFromSummary({ mean: 1, sd: 0, n: 5 }, { mean: 2, sd: 1, n: 5 })).toBeNull();
  });
});
