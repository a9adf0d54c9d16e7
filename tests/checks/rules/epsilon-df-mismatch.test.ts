import { describe, expect, it } from 'vitest';
import { ruleFindings } from './descriptivesHelper.js';

// Reference values: SciPy 1.10.1 scipy.stats.f.sf. F = 4.50 on (2, 58): p = .0152; with epsilon = .72 the corrected
// df are (1.44, 41.76), where p = .0271.
const rule = 'epsilon-df-mismatch';
const findingsOf = (text: string, which = rule) => ruleFindings(which, text).flatMap((r) => r.findings);

describe(`${rule}: must pass`, () => {
  it('corrected df that the printed epsilon gives, with their p', () => {
    expect(findingsOf('Accuracy changed over the sessions, F(1.44, 41.76) = 4.50, p = .027, ε = .72.')).toEqual([]);
    expect(findingsOf('With the Greenhouse-Geisser correction (ε = .72), accuracy changed over the sessions, F(1.44, 41.76) = 4.50, p = .027.')).toEqual([]);
  });
  it('whole-number df with their own p beside an epsilon (sphericity held, the test left uncorrected)', () => {
    expect(findingsOf("Mauchly's test was not significant (ε = .72); accuracy changed, F(2, 58) = 4.50, p = .015.")).toEqual([]);
  });
  it('an epsilon in another sentence, or with another result between, is not this test\'s', () => {
    expect(findingsOf('Sphericity was violated for the first factor (ε = .81). Accuracy changed over the sessions, F(1.44, 41.76) = 4.50, p = .027.')).toEqual([]);
    expect(findingsOf('Speed, F(1.62, 46.98) = 3.10, p = .064, ε = .81, and accuracy, F(1.44, 41.76) = 4.50, p = .027, both changed.')).toEqual([]);
  });
});

describe(`${rule}: must flag`, () => {
  it('(warn) corrected df that no whole df times the printed epsilon give', () => {
    const [finding] = findingsOf('Accuracy changed over the sessions, F(1.44, 41.76) = 4.50, p = .027, ε = .81.');
    expect(finding).toMatchObject({ rule, severity: 'warn', messageId: 'epsilonDf' });
    expect(finding!.message).toContain('1.44 / epsilon = 1.78 and 41.76 / epsilon = 51.56');
  });
  it('(warn) a p that fits only the uncorrected df, with corrected df and epsilon printed', () => {
    const text = 'Accuracy changed over the sessions, F(1.44, 41.76) = 4.50, p = .015, Greenhouse-Geisser ε = .72.';
    const [finding] = findingsOf(text);
    expect(finding).toMatchObject({ rule, severity: 'warn', messageId: 'uncorrectedP' });
    expect(finding!.message).toContain('fits the uncorrected df of F(1.44, 41.76) = 4.50 (F(2, 58), p = ');
    expect(finding!.message).toContain('Greenhouse-Geisser epsilon = .72');
    // The p is wrong for the df printed: p-value-mismatch still says so.
    expect(findingsOf(text, 'p-value-mismatch')).toHaveLength(1);
  });
  it('(note) the corrected p printed with the whole-number df, and p-value-mismatch leaves it to this rule', () => {
    const text = 'Accuracy changed over the sessions, F(2, 58) = 4.50, p = .027, ε = .72.';
    const [finding] = findingsOf(text);
    expect(finding).toMatchObject({ rule, severity: 'note', messageId: 'correctedPOnly' });
    expect(finding!.message).toContain('(F(1.44, 41.76), p = ');
    expect(findingsOf(text, 'p-value-mismatch')).toEqual([]);
    expect(findingsOf(`Greenhouse-Geisser corrections were applied. ${text}`, 'sphericity-corrected-p')).toEqual([]);
  });
});
