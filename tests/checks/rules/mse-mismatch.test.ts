import { describe, expect, it } from 'vitest';
import { ruleFindings } from './descriptivesHelper.js';

// Reference values: SciPy 1.10.1 scipy.stats.f_oneway on raw data built to have exactly these means and SDs (three
// groups of 21): F(2, 60) = 0.2867, p = .752; the MSE (pooled within-group variance, numpy) is 640.47.
const rule = 'mse-mismatch';
const text = (test: string) =>
  `Speed was similar in the three groups (M = 182.4, SD = 24.6, n = 21), (M = 179.8, SD = 26.1, n = 21) and (M = 176.5, SD = 25.2, n = 21), ${test}.`;
const findingsOf = (t: string) => ruleFindings(rule, t).flatMap((r) => r.findings);

describe(`${rule}: must pass`, () => {
  it('an F and MSE that follow from the groups', () => {
    expect(findingsOf(text('F(2, 60) = 0.29, MSE = 640.47, p = .752'))).toEqual([]);
    expect(findingsOf(text('F(2, 60) = 0.29, p = .752, MSE = 640'))).toEqual([]);
  });
  it('leaves alone an F whose df are not the one-way df of these groups (an ANCOVA: N - k - 1)', () => {
    expect(findingsOf(text('F(2, 59) = 3.10, MSE = 120.5, p = .052'))).toEqual([]);
  });
  it('an MSE in the next sentence is not this F\'s', () => {
    expect(findingsOf(text('F(2, 60) = 0.29, p = .752') + ' In the second study MSE = 12.4.')).toEqual([]);
  });
});

describe(`${rule}: must flag`, () => {
  it('(fail) an MSE that is not the pooled variance of the printed SDs', () => {
    const [finding] = findingsOf(text('F(2, 60) = 0.29, MSE = 25.31, p = .752'));
    expect(finding).toMatchObject({ rule, severity: 'fail', messageId: 'mseFromSds' });
    expect(finding!.message).toContain('their pooled variance, the one-way MSE, is 640.47');
  });
  it('(fail) an F that the printed means and MSE do not give, though the MSE fits the SDs', () => {
    const [finding] = findingsOf(text('F(2, 60) = 2.87, MSE = 640.47, p = .065'));
    expect(finding).toMatchObject({ rule, severity: 'fail', messageId: 'fFromMse' });
    expect(finding!.message).toContain('so F = 0.29');
  });
});
