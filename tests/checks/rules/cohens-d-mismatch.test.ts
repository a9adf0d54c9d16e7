import { describe, expect, it } from 'vitest';
import { findingsOf, flagsOf, num, result } from '../helpers.js';

// t(58) = 2.50: d = t*sqrt(1/30 + 1/30) = 0.6455 for two groups of 30, and 2t/sqrt(df) = 0.6565
// (Lakens 2013, formulas 1-2; arithmetic checked with Python when the test was written).
const rule = 'cohens-d-mismatch';
const base = { kind: 't' as const, df: ['58'], value: '2.50', p: '= .015' };

describe(`${rule}: must pass`, () => {
  it.each(['0.65', '0.66', '.64'])('d = %s for two groups of 30', (value) => {
    expect(flagsOf(rule, { ...base, effects: [{ kind: 'cohens-d', value }] }, undefined, 'There were 30 pupils in each group. ')).toEqual([]);
  });
  it('an unequal split that is not stated (d somewhat above the equal-groups value)', () => {
    expect(flagsOf(rule, { ...base, effects: [{ kind: 'cohens-d', value: '0.70' }] })).toEqual([]);
  });
});

// Paired conventions (Lakens 2013, within-subjects designs, cited from memory): dz = t / sqrt(n), n = df + 1; d_av and d_rm equal
// dz * SD_diff / (mean of the two SDs) and dz * sqrt(2(1 - r)), both between 0 and 2 dz (r = -1).
// t(29) = 3.10: dz = 3.10 / sqrt(30) = 0.566, 2 dz = 1.132; t(9) = 3.00: dz = 0.949, 2 dz = 1.897,
// 2t / sqrt(df) = 2.000 (arithmetic checked with Python 3 / NumPy when the test was written).
describe(`${rule}: paired and within-subject t tests`, () => {
  const paired = (text: string, value: string, df = '29', t = '3.10') => {
    const start = text.indexOf('t(');
    return flagsOf(rule, { kind: 't', df: [df], value: t, p: '= .004', start, effects: [{ kind: 'cohens-d', value }] }, undefined, text);
  };
  describe('must pass', () => {
    it.each([
      ['A paired-samples t test showed a gain, t(29) = 3.10, p = .004, d = 0.57.', '0.57'],
      ['Scores rose from pre-test to post-test, t(29) = 3.10, p = .004, d = 0.80.', '0.80'],
      ['The same participants rated both faces, t(29) = 3.10, p = .004, d = 1.10.', '1.10'],
      ['We measured mood before and after the walk. Mood improved, t(29) = 3.10, p = .004, d = 0.30.', '0.30'],
      ['In this within-subjects design, recall improved, t(29) = 3.10, p = .004, d = 0.45.', '0.45'],
    ])('%s (a d_av or d_rm between 0 and 1.13, or dz = 0.57)', (text, value) => {
      expect(paired(text, value)).toEqual([]);
    });
    it('never judges a paired d by the independent-groups formula (d = 0.30 is far below 2t / sqrt(N))', () => {
      // Independent groups: 2 * 3.10 / sqrt(31) = 1.11 at the least, so d = 0.30 would be flagged.
      expect(paired('Repeated measures over two sessions, t(29) = 3.10, p = .004, d = 0.30.', '0.30')).toEqual([]);
      expect(paired('Two independent groups differed, t(29) = 3.10, p = .004, d = 0.30.', '0.30')).toHaveLength(1);
    });
  });
  describe('must flag', () => {
    it('a d above 2 dz, which no paired convention gives', () => {
      const [finding] = paired('A paired-samples t test showed a gain, t(29) = 3.10, p = .004, d = 1.25.', '1.25');
      expect(finding).toMatchObject({ rule, severity: 'warn', messageId: 'paired' });
      expect(finding!.message).toContain('dz = t / sqrt(n) with n = 30 pairs gives 0.57');
      expect(finding!.message).toContain('cannot exceed 2t / sqrt(n) = 1.13');
    });
    it('names the independent-groups formula applied to a paired test (2t / sqrt(df) = 2.00)', () => {
      const [finding] = paired('Scores before and after the course differed, t(9) = 3.00, p = .015, d = 2.00.', '2.00', '9', '3.00');
      expect(finding).toMatchObject({ slip: 'independent-groups-d-for-paired-t' });
      expect(finding!.message).toContain('formula for two independent groups');
    });
    it('a d labelled dz that is not t / sqrt(n)', () => {
      const text = 'A paired-samples t test showed a gain, t(29) = 3.10, p = .004, dz = 0.80.';
      const start = text.indexOf('t(');
      const effectStart = text.indexOf('dz');
      const spec = { kind: 't' as const, df: ['29'], value: '3.10', p: '= .004', start };
      const built = result(spec);
      built.effects = [{ kind: 'cohens-d', comparator: '=', value: num('0.80'), interval: null, start: effectStart, end: effectStart + 9 }];
      const [finding] = findingsOf(rule, [built], undefined, text)[0]!;
      expect(finding).toMatchObject({ rule, messageId: 'pairedDz' });
      expect(finding!.message).toContain('0.57');
    });
    it('a one-sample d that is not t / sqrt(n)', () => {
      const [finding] = paired('A one-sample t test against the scale midpoint, t(29) = 3.10, p = .004, d = 0.80.', '0.80');
      expect(finding).toMatchObject({ rule, messageId: 'oneSample' });
    });
  });
});

describe(`${rule}: must flag`, () => {
  it('d far above what the t allows', () => {
    const text = 'There were 30 participants in each group. ';
    const spec = { ...base, start: text.length, effects: [{ kind: 'cohens-d' as const, value: '1.20' }] };
    const [finding] = flagsOf(rule, spec, undefined, text);
    expect(finding).toMatchObject({ rule, severity: 'warn' });
    expect(finding!.message).toContain('groups of 30 and 30');
  });
  it('d far below the equal-groups minimum', () => {
    const [finding] = flagsOf(rule, { ...base, effects: [{ kind: 'cohens-d', value: '0.30' }] });
    expect(finding).toMatchObject({ rule });
  });
});
