import { describe, expect, it } from 'vitest';
import { ruleFindings } from './descriptivesHelper.js';

const rule = 'integer-data-granularity';
// GRIM arithmetic (Brown & Heathers 2017): with n = 21, 91/21 = 4.33 and 92/21 = 4.38, so 4.37 is impossible.
const comfort = (third: string, wording = 'on the single 7-point item', thirdSd = '1.31') =>
  `Comfort ${wording} was (M = 5.43, SD = 1.08, n = 21), (M = 4.71, SD = 1.19, n = 21) and (M = ${third}, SD = ${thirdSd}, n = 21), F(2, 60) = 4.29, p = .018.`;

describe(`${rule}: must pass`, () => {
  it('possible means and SDs on a declared 7-point item (4.38 = 92/21; SD 1.32 passes GRIMMER, 1.31 would not)', () => {
    expect(ruleFindings(rule, comfort('4.38', undefined, '1.32'))[0]!.findings).toEqual([]);
  });
  it('an impossible mean on a measure nobody declared whole-number', () => {
    expect(ruleFindings(rule, comfort('4.37', 'as a slider score'))[0]!.findings).toEqual([]);
  });
});

describe(`${rule}: must flag`, () => {
  it('an impossible mean on a declared 7-point item, with the nearest possible values', () => {
    const [only] = ruleFindings(rule, comfort('4.37'));
    expect(only!.findings).toHaveLength(1);
    expect(only!.findings[0]).toMatchObject({ rule, severity: 'warn', messageId: 'mean' });
    expect(only!.findings[0]!.message).toContain('nearest possible means are 4.33 and 4.38');
  });
  it('when the settings name the measure, or declare every measure whole-number', () => {
    const text = comfort('4.37', 'as a slider score');
    expect(ruleFindings(rule, text, { rules: { [rule]: { options: { integerMeasures: ['comfort'] } } } })[0]!.findings).toHaveLength(1);
    expect(ruleFindings(rule, text, { rules: { [rule]: { options: { integerScales: true } } } })[0]!.findings).toHaveLength(1);
    // Three items per person: steps of 1/63, and 4.37 (= 275.3/63) is still impossible; 4.38 (276/63) is possible.
    expect(ruleFindings(rule, comfort('4.38', 'as a slider score'), { rules: { [rule]: { options: { integerScales: true, items: 3 } } } })[0]!.findings).toEqual([]);
  });
  it('an impossible SD (GRIMMER): scores of 5 people with mean 3.00 cannot have SD 1.60', () => {
    const text = 'The number of errors was (M = 3.00, SD = 1.60, n = 5) and (M = 4.00, SD = 1.58, n = 5), t(8) = 1.00, p = .347.';
    const [only] = ruleFindings(rule, text);
    expect(only!.findings.map((f) => f.messageId)).toEqual(['sd']);
    expect(only!.findings[0]!.message).toContain('nearest possible SDs are 1.58 and 1.73');
  });
  it('rejects bad settings', () => {
    expect(() => ruleFindings(rule, '', { rules: { [rule]: { options: { integerMeasures: 'comfort' } } } })).toThrow(/integerMeasures/);
  });
});

describe(`${rule}: group sizes read elsewhere`, () => {
  const text = (third: string) =>
    `Participants were randomised, 21 per group.\n\nThe number of errors was (M = 5.43, SD = 1.08), (M = 4.71, SD = 1.19) and (M = ${third}, SD = 1.32), F(2, 60) = 4.29, p = .018.`;
  it('must pass: a possible mean with the stated size (92/21 = 4.38)', () => {
    expect(ruleFindings(rule, text('4.38'))[0]!.findings).toEqual([]);
  });
  it('must flag, only as a note: an impossible mean when n comes from a per-group statement elsewhere', () => {
    const [finding] = ruleFindings(rule, text('4.37'))[0]!.findings;
    expect(finding).toMatchObject({ rule, severity: 'note', messageId: 'mean' });
    expect(finding!.message).toContain('The group size is not printed with the group');
  });
});
