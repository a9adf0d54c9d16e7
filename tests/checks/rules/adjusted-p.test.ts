import { describe, expect, it } from 'vitest';
import { emptyContext, findingsOf, flagsOf, result } from '../helpers.js';

// SciPy 1.10.1, 2 * scipy.stats.t.sf(2.10, 28) = 0.0448632 (0.0443912 to 0.0453397 for t in [2.095, 2.105]);
// Bonferroni for 3 comparisons, min(1, 3p) = 0.134590; Šidák, 1 - (1 - p)^3 = 0.128642 (common practice:
// the definitions of the two adjustments, as in R's p.adjust and statsmodels' multipletests).
const rule = 'adjusted-p';
const t28 = (p: string, start = 0) => ({ kind: 't' as const, df: ['28'], value: '2.10', p, start });

/** A text whose result sits after `before`, with `after` following it. */
function placed(before: string, p: string, after = '.') {
  const resultText = `t(28) = 2.10, p ${p.replace(/^=\s*/, '= ')}`;
  return { text: `${before}${resultText}${after}`, spec: t28(p, before.length) };
}

describe(`${rule}: must pass`, () => {
  it('a p that fits the unadjusted p needs no note', () => {
    const { text, spec } = placed('Pairwise comparisons were Tukey-corrected. A and B differed, ', '= .045');
    expect(flagsOf(rule, spec, emptyContext(), text)).toEqual([]);
  });
  it('a larger p without any adjustment stated is left to p-value-mismatch', () => {
    const { text, spec } = placed('A and B differed, ', '= .135');
    expect(flagsOf(rule, spec, emptyContext(), text)).toEqual([]);
    expect(flagsOf('p-value-mismatch', spec, emptyContext(), text)).toHaveLength(1);
  });
  it('a Bonferroni p for a stated number of comparisons is recomputed, so no note (3 x 0.04486 = 0.1346)', () => {
    const { text, spec } = placed('A and B differed (Bonferroni-corrected for 3 comparisons), ', '= .135');
    expect(flagsOf(rule, spec, emptyContext(), text)).toEqual([]);
    expect(flagsOf('p-value-mismatch', spec, emptyContext(), text)).toEqual([]);
  });
  it('a Šidák p for three comparisons (1 - (1 - 0.04486)^3 = 0.1286)', () => {
    const { text, spec } = placed('With a Šidák correction for three comparisons, A and B differed, ', '= .129');
    expect(flagsOf(rule, spec, emptyContext(), text)).toEqual([]);
    expect(flagsOf('p-value-mismatch', spec, emptyContext(), text)).toEqual([]);
  });
  it('"α = .05/3" gives the number of comparisons', () => {
    const { text, spec } = placed('Comparisons used a Bonferroni-adjusted α = .05/3. A and B differed, ', '= .135');
    expect(flagsOf('p-value-mismatch', spec, emptyContext(), text)).toEqual([]);
    expect(flagsOf(rule, spec, emptyContext(), text)).toEqual([]);
  });
  it('an adjustment for a covariate is not an adjustment of p', () => {
    const { text, spec } = placed('Adjusted for age, A and B differed, ', '= .135');
    expect(flagsOf(rule, spec, emptyContext(), text)).toEqual([]);
    expect(flagsOf('p-value-mismatch', spec, emptyContext(), text)).toHaveLength(1);
  });
  it('a statement that no correction was applied', () => {
    const { text, spec } = placed('No correction for multiple comparisons was applied. A and B differed, ', '= .135');
    expect(flagsOf(rule, spec, emptyContext(), text)).toEqual([]);
    expect(flagsOf('p-value-mismatch', spec, emptyContext(), text)).toHaveLength(1);
  });
});

describe(`${rule}: must flag`, () => {
  it.each([
    ['Pairwise comparisons were Tukey-corrected. A and B differed, ', '= .135', '.', 'Tukey', 'number of groups'],
    ['A and B differed (Holm-adjusted), ', '= .090', '.', 'Holm', 'number of comparisons'],
    ['A and B differed, ', '= .090', ' (corrected for multiple comparisons).', 'an adjustment for multiple comparisons', 'number of comparisons'],
    ['Post hoc Scheffé tests: A and B differed, ', '> .05', '.', 'Scheffé', 'number of groups'],
  ])('%s... p %s%s (%s)', (before, p, after, method, why) => {
    const { text, spec } = placed(before, p, after);
    const [finding] = flagsOf(rule, spec, emptyContext(), text);
    expect(finding).toMatchObject({ rule, severity: 'note', crossesAlpha: false });
    expect(finding!.message).toContain(`adjusted (${method}`);
    expect(finding!.message).toContain(why);
    expect(finding!.message).toContain('unadjusted p of t(28) = 2.10 (p = 0.0449');
    expect(flagsOf('p-value-mismatch', spec, emptyContext(), text)).toEqual([]);
  });

  it('"p_adj" written with the result', () => {
    const text = 'A and B differed, t(28) = 2.10, p_adj = .090.';
    const spec = t28('= .090', text.indexOf('t(28)'));
    const [finding] = flagsOf(rule, { ...spec }, emptyContext(), text);
    expect(finding).toMatchObject({ rule, severity: 'note' });
  });

  it('a document-wide statement that all post hoc p values were adjusted covers a t test far from it', () => {
    const statement = 'All post hoc p values were adjusted with the Holm method.';
    const filler = ' The design had two factors. Data were screened. Analyses used R.';
    const before = `${statement}${filler}\n\nThen A and B differed, `;
    const { text, spec } = placed(before, '= .090');
    const context = emptyContext({
      pAdjustments: [{ text: statement, start: 0, end: statement.length, method: 'holm', comparisons: null, appliesTo: 'post-hoc' }],
    });
    const [finding] = flagsOf(rule, spec, context, text);
    expect(finding).toMatchObject({ rule, severity: 'note' });
    expect(finding!.message).toContain('All post hoc p values were adjusted');
  });

  it('"n.s." for a statistic significant before adjustment', () => {
    const text = 'A and B did not differ after Bonferroni correction, t(28) = 2.10, n.s.';
    const [finding] = flagsOf(rule, { kind: 't', df: ['28'], value: '2.10', ns: true, start: text.indexOf('t(28)') }, emptyContext(), text);
    expect(finding).toMatchObject({ rule, severity: 'note' });
    expect(findingsOf('p-value-mismatch', [result({ kind: 't', df: ['28'], value: '2.10', ns: true, start: text.indexOf('t(28)') })], emptyContext(), text)[0]).toEqual([]);
  });
});
