import { describe, expect, it } from 'vitest';
import { ruleFindings } from './descriptivesHelper.js';

const rule = 'group-sizes-df-mismatch';
const twoGroups = (t: string) => `Warm (M = 4.25, SD = 1.11, n = 24) and cool (M = 3.52, SD = 1.23, n = 25) rooms differed, ${t}.`;

describe(`${rule}: must pass`, () => {
  it.each(['t(47) = 2.18, p = .034', 't(46.83) = 2.18, p = .034'])('%s (n1 + n2 - 2 = 47; Welch df within 23..47)', (t) => {
    expect(ruleFindings(rule, twoGroups(t))[0]!.findings).toEqual([]);
  });
  it('integer Welch df when the text says Welch', () => {
    expect(ruleFindings(rule, twoGroups("Welch's t(46) = 2.18, p = .034"))[0]!.findings).toEqual([]);
  });
});

describe(`${rule}: must flag`, () => {
  it('Student df that are not n1 + n2 - 2', () => {
    const [only] = ruleFindings(rule, twoGroups('t(49) = 2.18, p = .036'));
    expect(only!.findings[0]).toMatchObject({ rule, severity: 'fail' });
    expect(only!.findings[0]!.message).toContain('gives df = 47 (n1 + n2 - 2)');
  });
  it('Welch df outside min(n) - 1 .. n1 + n2 - 2', () => {
    const [only] = ruleFindings(rule, twoGroups('t(52.40) = 2.18, p = .034'));
    expect(only!.findings[0]!.message).toContain('between 23 and 47');
  });
  it('one-way ANOVA df2 that are not N - k', () => {
    const text = 'Comfort (M = 5.43, SD = 1.08, n = 21), (M = 4.71, SD = 1.19, n = 21), (M = 4.38, SD = 1.31, n = 21), F(2, 66) = 4.29, p = .018.';
    const [only] = ruleFindings(rule, text);
    expect(only!.findings[0]!.message).toContain('total N = 63, which gives df = 60');
  });
});

// Group sizes that are not printed with the groups are a guess, and the severity says so.
describe(`${rule}: group sizes read elsewhere`, () => {
  it('must flag, as a fail: sizes from a per-group statement of the same paragraph are as sure as printed ones (3 x 21 - 3 = 60, not 66)', () => {
    const text = 'There were 21 per group. Comfort was (M = 5.43, SD = 1.08), (M = 4.71, SD = 1.19) and (M = 4.38, SD = 1.31), F(2, 66) = 4.29, p = .018.';
    const [finding] = ruleFindings(rule, text)[0]!.findings;
    expect(finding).toMatchObject({ rule, severity: 'fail' });
  });
  it('must flag, as a note: one size from a per-group statement elsewhere in the document (24 + 25 - 2 = 47, not 48)', () => {
    const text =
      'Participants were randomised, 25 per group.\n\nComfort was higher in the warm room (M = 4.25, SD = 1.11, n = 24) than in the cool room (M = 3.52, SD = 1.23), t(48) = 2.18, p = .034.';
    const [finding] = ruleFindings(rule, text)[0]!.findings;
    expect(finding).toMatchObject({ rule, severity: 'note' });
    expect(finding!.message).toContain('elsewhere in the document');
  });
  it('must pass: sizes printed with the groups keep the severity (see must flag above: fail)', () => {
    expect(ruleFindings(rule, twoGroups('t(49) = 2.18, p = .036'))[0]!.findings[0]).toMatchObject({ severity: 'fail' });
  });
});
