/**
 * ancova-df-mismatch on passages scanned and checked: the ANCOVA of
 * tests/fixtures/contrasts/contrasts.json (statsmodels 0.13.5 OLS y ~
 * C(group) + x, anova_lm type II, on simulated raw data: error df N - k - 1 =
 * 62 for 3 groups of 66), and the covariate counts the text states.
 */
import { describe, expect, it } from 'vitest';
import { ruleFindings } from './descriptivesHelper.js';
import { contrastsFixture, fixed } from '../../fixtures/contrasts/passages.js';
import { statedCovariates } from '../../../src/scan/contrasts/index.js';

const rule = 'ancova-df-mismatch';
const a = contrastsFixture.ancova[0]!;
const groups = a.means.map((m, i) => `M = ${fixed(m)}, SD = ${fixed(a.sds[i]!)}, n = ${a.ns[i]}`).join('; ');
const passage = (covariates: string, groupDf2: number, covariateDf2: number) =>
  `The ANCOVA ${covariates} compared the groups (${groups}): F(2, ${groupDf2}) = ${fixed(a.group.f)}, p < .001; for the covariate, F(1, ${covariateDf2}) = ${fixed(a.covariate.f)}, p < .001.`;
const findings = (text: string) => ruleFindings(rule, text).map((r) => r.findings);

describe(`${rule}: must pass`, () => {
  it('the error df statsmodels gives, with the covariate stated or not', () => {
    expect(findings(passage('with one covariate', a.group.df2, a.covariate.df2)).flat()).toEqual([]);
    expect(findings(passage('controlling for baseline anxiety', a.group.df2, a.covariate.df2)).flat()).toEqual([]);
  });
  it('fewer df than N - k - c (cases missing on the covariate)', () => {
    expect(findings(passage('with one covariate', a.group.df2 - 2, a.covariate.df2 - 2)).flat()).toEqual([]);
  });
  it('reads the covariates stated: a count, a list joined by "and", nothing when a comma makes the list unclear', () => {
    expect(statedCovariates('with two covariates')?.count).toBe(2);
    expect(statedCovariates('controlling for age and baseline anxiety (both centred)')?.count).toBe(2);
    expect(statedCovariates('controlling for age, sex and baseline anxiety.')).toBeNull();
  });
});

describe(`${rule}: must flag`, () => {
  it('(warn) the ANOVA\'s N - k printed with an ANCOVA\'s F', () => {
    const [groupFlags] = findings(passage('with one covariate', 63, 63));
    expect(groupFlags).toHaveLength(1);
    expect(groupFlags![0]).toMatchObject({ rule, severity: 'warn', messageId: 'tooMany' });
    expect(groupFlags![0]!.message).toContain('63 = N - k are the df of the ANOVA without the covariate');
  });
  it('(warn) df that two stated covariates do not leave', () => {
    const [groupFlags] = findings(passage('with two covariates', 62, 62));
    expect(groupFlags![0]!.message).toContain('N - k - c = 61');
  });
  it('(warn) a covariate on other error df than the groups', () => {
    const [, covariateFlags] = findings(passage('with one covariate', 62, 60));
    expect(covariateFlags).toHaveLength(1);
    expect(covariateFlags![0]).toMatchObject({ severity: 'warn', messageId: 'unequalError' });
  });
});
