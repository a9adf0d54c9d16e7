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

// GRIM arithmetic (Brown & Heathers 2017): means of 20 whole numbers are multiples of 1/20 = .05, so 5.21 and 4.21 are
// impossible and 5.20, 4.20 possible. GRIMMER (Anaya 2016), by hand: the sum of squares is sum^2 / n + (n - 1) SD^2 and
// must be a whole number of the sum's parity. n = 20, M = 5.20 (sum 104), SD 1.11: 540.8 + 19 x [1.105^2, 1.115^2] =
// 564.00 to 564.42, and 564 is even: possible (SD 1.10 would give 563.58 to 564.00, just short: impossible).
// M = 4.85 (sum 97), SD 1.31: 470.45 + 19 x [1.305^2, 1.315^2] = 502.81 to 503.31, 503 odd: possible. The cells:
// 4.20 (1.11): 376.00 to 376.42, 376 even; 3.80 (1.24): 317.78 to 318.25, 318 even; 3.95 (1.00): 330.86 to 331.24,
// 331 odd; 3.10 (1.33): 225.56 to 226.06, 226 even: all possible.
describe(`${rule}: statistics no test is linked to, and factorial cells`, () => {
  const trails = (north: string) =>
    `Satisfaction was rated on a single 7-point item. Visitors to the north trail (M = ${north}, SD = 1.11, n = 20) and the south trail (M = 4.85, SD = 1.31, n = 20) both rated the signs highly.\n\nA later survey found no difference in visits, F(1, 38) = 0.40, p = .531.`;
  const cells = (first: string) =>
    [
      'Table 2',
      'Number of errors by age and load',
      '',
      '| Age | Low load | High load |',
      '| --- | --- | --- |',
      `| Younger | ${first} (1.11) | 3.80 (1.24) |`,
      '| Older | 3.95 (1.00) | 3.10 (1.33) |',
      '',
      'Note. Means (SDs); n = 20 per cell.',
      '',
      'In Table 2, the age × load interaction was not significant, F(1, 76) = 0.70, p = .404.',
    ].join('\n');

  it('must pass: possible means and SDs', () => {
    expect(ruleFindings(rule, trails('5.20')).flatMap((entry) => entry.findings)).toEqual([]);
    expect(ruleFindings(rule, cells('4.20')).flatMap((entry) => entry.findings)).toEqual([]);
  });
  it('must flag: a mean of groups linked to no test, at the first result after them, saying where the values are', () => {
    const [only] = ruleFindings(rule, trails('5.21'));
    expect(only!.findings).toHaveLength(1);
    expect(only!.findings[0]).toMatchObject({ severity: 'warn', messageId: 'printed-mean' });
    expect(only!.findings[0]!.message).toContain('M = 5.21 (n = 20) of group 1 printed in the text');
    expect(only!.findings[0]!.message).toContain('nearest possible means are 5.20 and 5.25');
  });
  it("must flag: a factorial cell's mean, at the design's first linked test", () => {
    const [only] = ruleFindings(rule, cells('4.21'));
    expect(only!.findings.map((finding) => finding.messageId)).toEqual(['printed-mean']);
    expect(only!.findings[0]!.message).toContain('of the Younger / Low load cell printed in Table 2');
  });
  it('must pass: the same values on a measure nobody declared whole-number', () => {
    expect(ruleFindings(rule, trails('5.21').replace('on a single 7-point item', 'on a slider')).flatMap((entry) => entry.findings)).toEqual([]);
  });
});
