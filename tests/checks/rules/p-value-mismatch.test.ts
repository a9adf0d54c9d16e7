import { describe, expect, it } from 'vitest';
import { emptyContext, findingsOf, flagsOf, result } from '../helpers.js';

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
