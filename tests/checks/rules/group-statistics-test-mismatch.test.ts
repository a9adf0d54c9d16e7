import { describe, expect, it } from 'vitest';
import { ruleFindings } from './descriptivesHelper.js';
import { loadFixture } from '../../stats/referenceFixtures.js';

const rule = 'group-statistics-test-mismatch';
// Reference values: SciPy 1.10.1 (scipy.stats.ttest_ind_from_stats, and f_oneway on data with these
// summaries; see tests/fixtures/stats/gen_summary.py, first hand-picked case): 4.25 (1.11, n = 24) vs
// 3.52 (1.23, n = 25) give Student's t(47) = 2.178 and Welch's t = 2.183, df = 46.83.
const twoGroups = (t: string) =>
  `Comfort was higher in the warm room (M = 4.25, SD = 1.11, n = 24) than in the cool room (M = 3.52, SD = 1.23, n = 25), ${t}.`;

describe(`${rule}: must pass`, () => {
  it.each(['t(47) = 2.18, p = .034', 't(47) = -2.18, p = .034', 't(46.83) = 2.18, p = .034', 't(47) = 2.17, p = .035'])('%s', (t) => {
    const [only] = ruleFindings(rule, twoGroups(t));
    expect(only!.findings).toEqual([]);
  });
  it('a one-way ANOVA that follows from three groups (SciPy: F(2, 60) = 0.287)', () => {
    const text =
      'Speed was similar (M = 182.4, SD = 24.6, n = 21), (M = 179.8, SD = 26.1, n = 21) and (M = 176.5, SD = 25.2, n = 21), F(2, 60) = 0.29, p = .749.';
    expect(ruleFindings(rule, text)[0]!.findings).toEqual([]);
  });
  it('leaves tests alone whose paragraph mentions a covariate', () => {
    expect(ruleFindings(rule, twoGroups('t(46) = 3.90, p < .001') + ' Age was a covariate.')[0]!.findings).toEqual([]);
  });
  it('needs n: without group sizes nothing is recomputed', () => {
    const text = 'Warm (M = 4.25, SD = 1.11) and cool (M = 3.52, SD = 1.23) rooms differed, t(47) = 3.90, p < .001.';
    expect(ruleFindings(rule, text)[0]!.findings).toEqual([]);
  });
});

describe(`${rule}: must flag`, () => {
  it('a t that the groups do not give, with the recomputed numbers in the message', () => {
    const [only] = ruleFindings(rule, twoGroups('t(47) = 3.18, p = .003'));
    expect(only!.findings).toHaveLength(1);
    expect(only!.findings[0]).toMatchObject({ rule, severity: 'fail', crossesAlpha: false });
    expect(only!.findings[0]!.message).toContain("Student's t = 2.18");
    expect(only!.findings[0]!.message).toContain('M = 4.25, SD = 1.11, n = 24');
  });
  it('an F that the groups do not give (SciPy: 5.97) and marks the changed conclusion', () => {
    const text =
      'Decision time, means (SDs), was 6.8 (2.1), 7.9 (2.4) and 9.6 (2.2) (n = 15 per group), F(2, 42) = 2.10, p = .135.';
    const [only] = ruleFindings(rule, text);
    expect(only!.findings).toHaveLength(1);
    expect(only!.findings[0]!.crossesAlpha).toBe(true);
    expect(only!.findings[0]!.message).toContain('one-way ANOVA F = 5.97');
  });
});

// SciPy 1.10.1 scipy.stats.ttest_ind_from_stats(4.25, 1.11, 24, 3.52, 1.23, 24): t(46) = 2.159 (Welch: 2.159).
describe(`${rule}: group sizes read elsewhere`, () => {
  const text = (t: string) =>
    `Participants were randomised, 24 per group.\n\nComfort was higher in the warm room (M = 4.25, SD = 1.11) than in the cool room (M = 3.52, SD = 1.23), ${t}.`;
  it('must pass: the t that the stated sizes give', () => {
    expect(ruleFindings(rule, text('t(46) = 2.16, p = .036'))[0]!.findings).toEqual([]);
  });
  it('must flag, only as a note: sizes taken from a per-group statement elsewhere in the document', () => {
    const [finding] = ruleFindings(rule, text('t(46) = 3.90, p < .001'))[0]!.findings;
    expect(finding).toMatchObject({ rule, severity: 'note' });
    expect(finding!.message).toContain("Student's t = 2.16");
    expect(finding!.message).toContain('elsewhere in the document');
  });
});

// SciPy 1.10.1 scipy.stats.ttest_ind_from_stats(4.25, 1.11, 24, 3.52, 1.23, 25): Student's t(47) = 2.178 (first case above).
describe(`${rule}: group statistics in the paragraph before the test`, () => {
  const groups = 'Comfort ratings were higher in the warm room (M = 4.25, SD = 1.11, n = 24) than in the cool room (M = 3.52, SD = 1.23, n = 25).';
  it('must pass: the t the groups give, in the next paragraph on the same outcome', () => {
    const [only] = ruleFindings(rule, `${groups}\n\nAn independent-samples t test on the comfort ratings confirmed the difference, t(47) = 2.18, p = .034.`);
    expect(only!.findings).toEqual([]);
  });
  it('must flag: a t the groups do not give, in the next paragraph on the same outcome', () => {
    const [only] = ruleFindings(rule, `${groups}\n\nAn independent-samples t test on the comfort ratings confirmed the difference, t(47) = 3.18, p = .003.`);
    expect(only!.findings).toHaveLength(1);
    expect(only!.findings[0]!.message).toContain("Student's t = 2.18");
  });
  it('must pass: a test of another outcome, or after a test of its own in that paragraph, is not linked', () => {
    const other = `${groups}\n\nReading speed did not differ between the rooms, t(47) = 3.18, p = .003.`;
    expect(ruleFindings(rule, other)[0]!.findings).toEqual([]);
    const owned = `${groups.slice(0, -1)}, t(47) = 2.18, p = .034.\n\nA second t test on the comfort ratings gave t(47) = 3.18, p = .003.`;
    expect(ruleFindings(rule, owned).map((entry) => entry.findings)).toEqual([[], []]);
  });
});

// Welch's and Brown-Forsythe's F with their fractional df, from the groups' printed means, SDs and sizes. The
// groups and the true F and df come from tests/fixtures/stats/welch_brown_forsythe.json (statsmodels 0.13.5
// anova_oneway, use_var "unequal" and "bf", on simulated data; gen_welch_brown_forsythe.py), case "4 groups,
// one wide group": Welch F(3, 30.76) = 5.99, Brown-Forsythe F*(3, 23.32) = 9.63.
describe(`${rule}: tests for unequal variances (Welch, Brown-Forsythe) and their df`, () => {
  const unequal = loadFixture<{ cases: Array<{ label: string; groups: Array<{ printedMean: number; printedSd: number; n: number }>; welch: { f: number; df2: number }; brownForsythe: { f: number; df2: number } }> }>(
    'stats/welch_brown_forsythe.json',
  ).cases.find((c) => c.label === '4 groups, one wide group')!;
  const groups = unequal.groups.map((g) => `(M = ${g.printedMean.toFixed(2)}, SD = ${g.printedSd.toFixed(2)}, n = ${g.n})`).join(', ');
  const text = (test: string) => `Scores differed across the four sites ${groups}, ${test}.`;
  const welchF = unequal.welch.f.toFixed(2);
  const welchDf = unequal.welch.df2.toFixed(2);
  const bfF = unequal.brownForsythe.f.toFixed(2);
  const bfDf = unequal.brownForsythe.df2.toFixed(2);

  it('must pass: Welch F with its df, and Brown-Forsythe F* with its df', () => {
    expect(ruleFindings(rule, text(`Welch's F(3, ${welchDf}) = ${welchF}, p = .002`))[0]!.findings).toEqual([]);
    expect(ruleFindings(rule, text(`Brown-Forsythe F(3, ${bfDf}) = ${bfF}, p < .001`))[0]!.findings).toEqual([]);
  });
  it('must pass: the Brown-Forsythe F is recognised without its name (no finding for an F the groups give)', () => {
    expect(ruleFindings(rule, text(`F(3, ${bfDf}) = ${bfF}, p < .001`))[0]!.findings).toEqual([]);
  });
  it("must flag (warn): Brown-Forsythe's F* printed with Welch's df", () => {
    const [finding] = ruleFindings(rule, text(`Brown-Forsythe F(3, ${welchDf}) = ${bfF}, p < .001`))[0]!.findings;
    expect(finding).toMatchObject({ rule, messageId: 'dfMismatch', severity: 'warn' });
    expect(finding!.message).toContain(`as Brown-Forsythe's test, but its error df ${welchDf} does not: the SDs and sizes give df = ${bfDf}`);
  });
  it("must flag (warn): Welch's F printed with a df off by three", () => {
    const wrong = (unequal.welch.df2 - 3).toFixed(2);
    const [finding] = ruleFindings(rule, text(`Welch's F(3, ${wrong}) = ${welchF}, p = .002`))[0]!.findings;
    expect(finding).toMatchObject({ rule, messageId: 'dfMismatch' });
    // Recomputed at the printed (rounded) SDs: within a unit in the last place of the true df.
    expect(finding!.message).toMatch(new RegExp(`as Welch's test, but its error df ${wrong} does not: the SDs and sizes give df = ${welchDf.slice(0, -1).replace('.', '\\.')}\\d`));
  });
  it('must flag (fail): a Brown-Forsythe F that no form of the test reproduces, naming it first', () => {
    const [finding] = ruleFindings(rule, text(`Brown-Forsythe F(3, ${bfDf}) = 7.50, p < .001`))[0]!.findings;
    expect(finding).toMatchObject({ rule, messageId: 'mismatch', severity: 'fail' });
    expect(finding!.message).toContain(`they give Brown-Forsythe's F = ${bfF}`);
  });
});
