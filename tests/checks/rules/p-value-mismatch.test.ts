import { describe, expect, it } from 'vitest';
import { resolveConfig } from '../../../src/checks/config.js';
import { checkResults } from '../../../src/checks/engine.js';
import { checkedOf, emptyContext, findingsOf, flagsOf, result } from '../helpers.js';

// Exact p-values quoted in comments were computed with SciPy 1.10.1
// (scipy.stats.f.sf, t.sf, chi2.sf, norm.sf) when these tests were written.
const rule = 'p-value-mismatch';

describe('p-value-mismatch: must pass', () => {
  it.each([
    // F(1, 44) = 4.21 -> p = 0.0461667
    [{ kind: 'F' as const, df: ['1', '44'], value: '4.21', p: '= .046' }],
    [{ kind: 'F' as const, df: ['1', '44'], value: '4.21', p: '= 0.05' }],
    [{ kind: 'F' as const, df: ['1', '44'], value: '4.21', p: '< .05' }],
    // F(2, 57) = 4.21 -> p = 0.0197098
    [{ kind: 'F' as const, df: ['2', '57'], value: '4.21', p: '= .020' }],
    [{ kind: 'F' as const, df: ['2', '57'], value: '4.21', p: '= .02' }],
    // truncation (".019" for .01971) is allowed by default
    [{ kind: 'F' as const, df: ['2', '57'], value: '4.21', p: '= .019' }],
    // t(28) = -2.21 -> two-tailed p = 0.0354496
    [{ kind: 't' as const, df: ['28'], value: '-2.21', p: '= .035' }],
    // chi2(2) = 7.81 -> p = 0.0201410
    [{ kind: 'chi2' as const, df: ['2'], value: '7.81', p: '= .020' }],
    // z = 2.45 -> two-tailed p = 0.0142856
    [{ kind: 'z' as const, value: '2.45', p: '= .014' }],
    // r(48) = .32 -> p = 0.0234855
    [{ kind: 'r' as const, df: ['48'], value: '.32', p: '= .023' }],
    // F(3, 120) = 25.3 -> p = 9.39e-13
    [{ kind: 'F' as const, df: ['3', '120'], value: '25.3', p: '< .001' }],
    [{ kind: 'F' as const, df: ['3', '120'], value: '25.3', p: '= 9.4e-13' }],
    // F < 1 with a p above .05 (any F below 1 gives p > .3 with these df)
    [{ kind: 'F' as const, df: ['1', '44'], value: '1', valueComparator: '<' as const, p: '> .05' }],
    [{ kind: 'F' as const, df: ['1', '44'], value: '0.89', ns: true }],
  ])('%o', (spec) => {
    expect(flagsOf(rule, spec)).toEqual([]);
  });

  it('leaves a p that only fits when halved to halved-p', () => {
    expect(flagsOf(rule, { kind: 't', df: ['28'], value: '2.21', p: '= .018' })).toEqual([]);
  });
});

describe('p-value-mismatch: must flag', () => {
  it('a wrong p that does not cross alpha', () => {
    const [finding] = flagsOf(rule, { kind: 'F', df: ['1', '44'], value: '4.21', p: '= .031' });
    expect(finding).toMatchObject({ rule, severity: 'fail', crossesAlpha: false });
    expect(finding!.message).toContain('F(1, 44) = 4.21 gives p = 0.0462');
    expect(finding!.message).toContain('p = .031 is reported');
  });

  it('a p whose sign was lost in the text at warn, saying the sign was read (common practice: the sign is not known)', () => {
    // r(212) = 0.21 -> p = 0.0020; "p 0.001" read as "p < 0.001".
    const lost = result({ kind: 'r', df: ['212'], value: '0.21', p: '< 0.001' });
    lost.p!.signLost = true;
    const [finding] = checkedOf([lost])[0]!.findings.filter((f) => f.rule === rule);
    expect(finding).toMatchObject({ rule, severity: 'warn' });
    expect(finding!.message).toContain('sign is missing in the text');
  });

  it('a p that changes the conclusion at alpha', () => {
    // t(58) = 1.80 -> p = 0.077
    const [finding] = flagsOf(rule, { kind: 't', df: ['58'], value: '1.80', p: '< .05' });
    expect(finding).toMatchObject({ crossesAlpha: true });
    expect(finding!.message).toContain('changes the conclusion at alpha = 0.05');
  });

  it('uses the alpha the document declares', () => {
    // t(58) = 2.40 -> p = 0.0196: significant at .05 but not at .01
    const [atDefault] = flagsOf(rule, { kind: 't', df: ['58'], value: '2.40', p: '< .01' });
    expect(atDefault).toMatchObject({ crossesAlpha: false });
    const declared = emptyContext({ alpha: { value: 0.01, text: 'alpha = .01', start: 0, end: 11 } });
    const [atDeclared] = flagsOf(rule, { kind: 't', df: ['58'], value: '2.40', p: '< .01' }, declared);
    expect(atDeclared).toMatchObject({ crossesAlpha: true });
  });

  it('"n.s." on a significant result', () => {
    const [finding] = flagsOf(rule, { kind: 'F', df: ['2', '57'], value: '4.21', ns: true });
    expect(finding).toMatchObject({ messageId: 'notSignificantButIs', crossesAlpha: true });
  });

  it('names the slip: the sample size typed as df2', () => {
    // F(1, 20) = 4.21 -> p = 0.05351; F(1, 22) = 4.21 -> p = 0.05228 (SciPy 1.10.1): with two groups
    // of 11, N = 22 was typed where df2 = N - 2 = 20 belongs.
    const [finding] = flagsOf(rule, { kind: 'F', df: ['1', '22'], value: '4.21', p: '= .0535' });
    expect(finding).toMatchObject({ slip: 'df-typed-as-sample-size' });
    expect(finding!.message).toContain('F(1, 20)');
  });

  it('names the slip: r reported with N instead of N - 2', () => {
    // r(18) = .45 -> p = .0465 (.0438 to .0493 over r's rounding); r(20) = .45 -> p = .0356
    // (.0334 to .0380) (SciPy 1.10.1 via t = r*sqrt(df/(1-r^2))): 20 participants, printed as r(20).
    const [finding] = flagsOf(rule, { kind: 'r', df: ['20'], value: '.45', p: '= .046' });
    expect(finding).toMatchObject({ slip: 'r-df-as-sample-size' });
  });

  it('names the slip: digits of the statistic transposed', () => {
    // F(1, 44) = 4.12 -> p = .0485 (".048"); printed value 4.21 gives .0462
    const [finding] = flagsOf(rule, { kind: 'F', df: ['1', '44'], value: '4.12', p: '= .046' });
    expect(finding).toMatchObject({ slip: 'statistic-digits-transposed' });
    expect(finding!.message).toContain('4.21');
  });

  it('names the slip: F that is really t', () => {
    // t(44) = 2.05 -> p = .0464; F(1, 44) = 2.05 -> p = .159
    const [finding] = flagsOf(rule, { kind: 'F', df: ['1', '44'], value: '2.05', p: '= .046' });
    expect(finding).toMatchObject({ slip: 'f-reported-as-t' });
  });

  it('names the slip: the p of the neighbouring result', () => {
    const first = result({ kind: 'F', df: ['2', '57'], value: '4.21', p: '= .020', start: 0 });
    const second = result({ kind: 'F', df: ['1', '57'], value: '1.30', p: '= .020', start: 40 });
    const [firstFindings, secondFindings] = findingsOf(rule, [first, second]);
    expect(firstFindings).toEqual([]);
    expect(secondFindings![0]).toMatchObject({ slip: 'neighbour-p-copied' });
  });
});

describe('p-value-mismatch: slips across a decimal point, and none for inequalities', () => {
  it('names digits swapped across the decimal point (6.31 typed as 3.61)', () => {
    // F(2, 86) = 6.31 -> p = .0028; F(2, 86) = 3.61 -> p = .0312 (SciPy 1.10.1 scipy.stats.f.sf)
    const [finding] = flagsOf(rule, { kind: 'F', df: ['2', '86'], value: '3.61', p: '= .003' });
    expect(finding).toMatchObject({ slip: 'statistic-digits-transposed' });
    expect(finding!.message).toContain('F(2, 86) = 6.31');
  });
  it('names no slip for a p given as an inequality, which many alternatives would fit', () => {
    // chi2(2) = 5.10 -> p = .078 (SciPy 1.10.1 scipy.stats.chi2.sf)
    const [finding] = flagsOf(rule, { kind: 'chi2', df: ['2'], value: '5.10', p: '< .05' });
    expect(finding).toMatchObject({ crossesAlpha: true });
    expect(finding!.slip).toBeUndefined();
  });
});

// r with df = N - 2: p from t = r * sqrt(df / (1 - r^2)), 2 * scipy.stats.t.sf (SciPy 1.10.1):
// r = .20, df = 212 -> p = 0.0032996; r = .30, df = 212 -> p = 7.96e-6.
describe('p-value-mismatch: df from the sample size the document states for the study', () => {
  const study = (text = 'We recruited 214 participants.') =>
    emptyContext({ sampleSizes: [{ value: 214, text: '214 participants', start: text.indexOf('214'), end: text.indexOf('214') + 16, scope: 'total' }] });
  const r = (value: string, p: string) => ({ kind: 'r' as const, value, p, start: 40 });

  it('must pass: r = .20, p = .003 with N = 214 (df = 212, p = .0033)', () => {
    expect(flagsOf(rule, r('.20', '= .003'), study())).toEqual([]);
  });
  it('must pass: without a stated N the correlation stays unchecked', () => {
    expect(flagsOf(rule, r('.30', '= .004'))).toEqual([]);
  });
  it('must pass: with two different totals stated, no N is taken as the study\'s', () => {
    const context = emptyContext({
      sampleSizes: [
        { value: 214, text: 'N = 214', start: 0, end: 7, scope: 'total' },
        { value: 98, text: 'N = 98', start: 10, end: 16, scope: 'total' },
      ],
    });
    expect(flagsOf(rule, r('.30', '= .004'), context)).toEqual([]);
  });
  it('must flag, as a warning that names the N: r = .30, p = .004 with N = 214 (p = 7.96e-6)', () => {
    const [finding] = flagsOf(rule, r('.30', '= .004'), study());
    expect(finding).toMatchObject({ rule, severity: 'warn' });
    expect(finding!.message).toContain('no df printed; df = 212 from the N = 214 the document states for the study');
    expect(finding!.slip).toBeUndefined(); // the df were not typed, so no df slip
  });
  it('must flag, as a note, when the document also states a part of the sample', () => {
    const context = study();
    context.sampleSizes.push({ value: 96, text: '96 participants', start: 60, end: 75, scope: 'subset' });
    const [finding] = flagsOf(rule, r('.30', '= .004'), context);
    expect(finding).toMatchObject({ rule, severity: 'note' });
  });
  it('the df worked out are in the checked result, marked as such', () => {
    const [checked] = checkedOf([result(r('.30', '= .004'))], study());
    expect(checked!.result.df.map((df) => df.value)).toEqual([212]);
    expect(checked!.result.dfFrom).toBe('study-sample-size');
  });
});

// chi2.sf (SciPy 1.10.1): chi2(2) = 9.56 -> p = 0.008396; chi2(1) = 5.41 -> p = 0.020022.
describe('p-value-mismatch: a chi-square without df, with the table dimensions stated', () => {
  const chi = (text: string, value: string, p: string) => ({ kind: 'chi2' as const, value, p, start: text.indexOf('χ2') });
  it('must pass: a 2 x 2 table, chi2 = 5.41, p = .020', () => {
    const text = 'A 2 x 2 chi-square test showed that choice depended on condition, χ2 = 5.41, p = .020.';
    expect(flagsOf(rule, chi(text, '5.41', '= .020'), emptyContext(), text)).toEqual([]);
  });
  it('must pass: no dimensions stated, so the chi-square stays unchecked whatever the N', () => {
    const text = 'We recruited 214 participants. Choice depended on condition, χ2 = 9.56, p = .002.';
    const context = emptyContext({ sampleSizes: [{ value: 214, text: '214 participants', start: 13, end: 29, scope: 'total' }] });
    expect(flagsOf(rule, chi(text, '9.56', '= .002'), context, text)).toEqual([]);
  });
  it('must flag, as a warning: a 2 × 3 table gives df = 2, and chi2 = 9.56 gives p = .0084, not .002', () => {
    const text = 'We cross-tabulated the 2 × 3 contingency table. Choice depended on condition, χ2 = 9.56, p = .002.';
    const [finding] = flagsOf(rule, chi(text, '9.56', '= .002'), emptyContext(), text);
    expect(finding).toMatchObject({ rule, severity: 'warn' });
    expect(finding!.message).toContain('df = 2 from the 2 × 3 table');
  });
});

// 2 * scipy.stats.t.sf(2.10, 28) = 0.044863 (SciPy 1.10.1); Bonferroni for 3 comparisons: 0.1346
// (0.1332 to 0.1360 over t's rounding).
describe('p-value-mismatch: adjusted p-values', () => {
  const at = (before: string, p: string, after = '.') => {
    const text = `${before}t(28) = 2.10, p ${p}${after}`;
    return { text, spec: { kind: 't' as const, df: ['28'], value: '2.10', p, start: before.length } };
  };
  it('must pass: a Holm p larger than the unadjusted one (adjusted-p notes it instead)', () => {
    const { text, spec } = at('Holm-corrected comparisons showed that A and B differed, ', '= .090');
    expect(flagsOf(rule, spec, emptyContext(), text)).toEqual([]);
  });
  it('must pass: a Holm p for 3 comparisons lies between p and 3p (0.045 to 0.135)', () => {
    const { text, spec } = at('Holm-corrected for 3 comparisons, A and B differed, ', '= .090');
    expect(flagsOf(rule, spec, emptyContext(), text)).toEqual([]);
  });
  it('must flag: a p smaller than the unadjusted p, which no adjustment gives', () => {
    const { text, spec } = at('Bonferroni-corrected comparisons showed that A and B differed, ', '= .009');
    const [finding] = flagsOf(rule, spec, emptyContext(), text);
    expect(finding).toMatchObject({ rule, severity: 'fail' });
    expect(finding!.message).toContain('an adjusted p is never smaller than the unadjusted one');
  });
  it('must flag: "p < .01" with an adjustment stated (the unadjusted p is already .045)', () => {
    const { text, spec } = at('Bonferroni-corrected comparisons showed that A and B differed, ', '< .01');
    expect(flagsOf(rule, spec, emptyContext(), text)[0]).toMatchObject({ rule, severity: 'fail' });
  });
  it('must flag: a Bonferroni p for 3 comparisons that is neither p nor 3p', () => {
    const { text, spec } = at('A and B differed (Bonferroni-corrected for 3 comparisons), ', '= .070');
    const [finding] = flagsOf(rule, spec, emptyContext(), text);
    expect(finding).toMatchObject({ rule, severity: 'fail', crossesAlpha: false });
    expect(finding!.message).toContain('Bonferroni for 3 comparisons');
    expect(finding!.message).toContain('adjusted p of 0.133 to 0.136');
  });
  it('must flag, as a warning, when the adjustment is stated only elsewhere in the document', () => {
    const statement = 'All post hoc comparisons were Bonferroni-corrected for 3 comparisons.';
    const { text, spec } = at(`${statement} Then came the task. It took ten minutes.\n\nA and B differed, `, '= .070');
    const context = emptyContext({
      pAdjustments: [{ text: statement, start: 0, end: statement.length, method: 'bonferroni', comparisons: 3, appliesTo: 'post-hoc' }],
    });
    expect(flagsOf(rule, spec, context, text)[0]).toMatchObject({ rule, severity: 'warn' });
  });
  it('a statement about post hoc comparisons does not cover an F with df1 = 2', () => {
    const statement = 'All post hoc comparisons were Holm-corrected.';
    const text = `${statement} Then came the task. It took ten minutes.\n\nDose mattered, F(2, 57) = 4.21, p = .060.`;
    const context = emptyContext({
      pAdjustments: [{ text: statement, start: 0, end: statement.length, method: 'holm', comparisons: null, appliesTo: 'post-hoc' }],
    });
    // F(2, 57) = 4.21 -> p = 0.0197 (scipy.stats.f.sf, SciPy 1.10.1)
    const spec = { kind: 'F' as const, df: ['2', '57'], value: '4.21', p: '= .060', start: text.indexOf('F(2') };
    expect(flagsOf(rule, spec, context, text)[0]).toMatchObject({ rule, severity: 'fail' });
  });
});

describe('p-value-mismatch: how large the discrepancy is', () => {
  // F(2, 57) = 4.21 -> p = 0.0197, 0.0196 to 0.0198 over the rounding of F (scipy.stats.f.sf, SciPy 1.10.1).
  it('a p off only in its last digit: said so, and pDiscrepancy "last-digit"', () => {
    const [finding] = flagsOf(rule, { kind: 'F', df: ['2', '57'], value: '4.21', p: '= .018' });
    expect(finding).toMatchObject({ severity: 'fail', pDiscrepancy: { size: 'last-digit', truncated: false } });
    expect(finding!.message).toContain('The printed p is off only in its last digit, by one.');
  });

  it('a p off by a factor below ten: "moderate", with the factor', () => {
    const [finding] = flagsOf(rule, { kind: 'F', df: ['2', '57'], value: '4.21', p: '= .012' });
    expect(finding).toMatchObject({ pDiscrepancy: { size: 'moderate' } });
    expect(finding!.message).toContain('The printed p is off by a factor of 1.6.');
  });

  it('a p off by an order of magnitude: "order-of-magnitude", with the factor', () => {
    const [finding] = flagsOf(rule, { kind: 'F', df: ['2', '57'], value: '4.21', p: '= .001' });
    expect(finding).toMatchObject({ pDiscrepancy: { size: 'order-of-magnitude', factor: expect.closeTo(19.6, 1) } });
    expect(finding!.message).toContain('The printed p is off by an order of magnitude or more (a factor of 20).');
  });

  it('a p truncated instead of rounded, where the settings do not allow truncation, is said to be truncated', () => {
    // t(28) = 2.21 -> two-tailed p = 0.0354 (0.0351 to 0.0358): ".03" is it truncated, ".04" rounded.
    const config = resolveConfig({ rules: { 'p-value-mismatch': { options: { allowTruncatedP: false } } } });
    const checked = checkResults('', { results: [result({ kind: 't', df: ['28'], value: '2.21', p: '= .03' })], context: emptyContext() }, config);
    const [finding] = checked[0]!.findings.filter((f) => f.rule === rule);
    expect(finding).toMatchObject({ pDiscrepancy: { size: 'last-digit', truncated: true } });
    expect(finding!.message).toContain('it is the recomputed p truncated instead of rounded');
  });
});
