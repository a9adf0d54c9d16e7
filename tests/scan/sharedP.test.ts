import { describe, expect, it } from 'vitest';
import { scanText } from '../../src/scan/scan.js';

function ps(text: string): Array<string | null> {
  return scanText(text).results.map((result) => (result.p === null ? null : `${result.p.comparator}${result.p.value.text}${result.p.plural ? ' plural' : ''}`));
}

describe('a plural p written after several results', () => {
  it('gives "ps" to every earlier result of the sentence without a p of its own', () => {
    expect(ps('Learners recalled more at both tests, F(1, 86) = 18.42 and F(1, 86) = 25.93, ps < .001, respectively.')).toEqual([
      '<.001 plural',
      '<.001 plural',
    ]);
    expect(ps('The three contrasts, t(40) = 2.9, t(40) = 3.4, and t(40) = 4.1, all ps < .01, held.')).toEqual([
      '<.01 plural',
      '<.01 plural',
      '<.01 plural',
    ]);
  });

  it.each([
    'A and B differed, t(20) = 2.1 and t(20) = 3.3 (both ps < .05).',
    'A and B differed, t(20) = 2.1 and t(20) = 3.3, all p < .05.',
    'A and B differed, t(20) = 2.1 and t(20) = 3.3, p-values < .05.',
    "A and B differed, t(20) = 2.1 and t(20) = 3.3, p's < .05.",
    'A and B differed, *t*(20) = 2.1 and *t*(20) = 3.3, *p*s < .05.',
  ])('reads the plural forms in %j', (text) => {
    expect(ps(text)).toEqual(['<.05 plural', '<.05 plural']);
  });

  it('keeps the p that a result has of its own', () => {
    expect(ps('Both held, F(1, 20) = 9.1, p = .007, t(20) = 2.1 and t(20) = 3.3, ps < .05.')).toEqual([
      '=.007',
      '<.05 plural',
      '<.05 plural',
    ]);
  });

  it('keeps "n.s." instead of the plural p', () => {
    const results = scanText('Neither held, F(1, 20) = 0.4, n.s., and t(20) = 2.1 and t(20) = 3.3, ps < .05.').results;
    expect(results[0]!.notSignificant).toBe(true);
    expect(results[0]!.p).toBeNull();
  });

  it('does not give the plural p to a result of an earlier sentence', () => {
    expect(ps('Accuracy rose, t(20) = 2.1. Speed and errors fell, t(20) = 3.3 and t(20) = 2.9, ps < .05.')).toEqual([
      null,
      '<.05 plural',
      '<.05 plural',
    ]);
    expect(ps('Accuracy rose, t(20) = 2.1\n\nSpeed fell, t(20) = 3.3, ps < .05.')).toEqual([null, '<.05 plural']);
  });

  it('does not share a singular p', () => {
    expect(ps('A and B, t(20) = 2.1 and t(20) = 3.3, p < .05.')).toEqual([null, '<.05']);
  });

  it('gives each result its own copy of the p', () => {
    const [first, second] = scanText('F(1, 86) = 18.42 and F(1, 86) = 25.93, ps < .001.').results;
    expect(first!.p).not.toBe(second!.p);
    expect(first!.p).toEqual(second!.p);
  });
});

describe('a table row typed with spaces', () => {
  it('attaches "n.s." and p across wide column gaps on the same line', () => {
    const gap = ' '.repeat(29);
    const text = [
      '  Effect                  Test                     p          \u03b7p2',
      '  Encoding task           F(1, 58) = 14.62         p < .001    .20',
      `  Task \u00d7 Length \u00d7 Delay   F < 1${gap}n.s.       \u2013`,
      `  Delay\tF(1, 58) = 3.44\t\t\t\t\t\t\t\t\t\t\t\t\t\t\t\t\t\t\tp = .069`,
      `  Order                   F(1, 58) = 0.44${' '.repeat(150)}p = .51`,
    ].join('\n');
    const results = scanText(text).results;
    expect(results.map((result) => [result.p?.value.text ?? null, result.notSignificant])).toEqual([
      ['.001', false],
      [null, true],
      ['.069', false],
      ['.51', false],
    ]);
  });

  it('reads the cells of a Markdown table row', () => {
    const text = ['| Effect | Test | p |', '|---|---|---|', '| Task | *F*(1, 58) = 14.62 | *p* < .001 |', '| Delay | *F* < 1 | n.s. |'].join('\n');
    const results = scanText(text).results;
    expect(results.map((result) => [result.kind, result.p?.value.text ?? null, result.notSignificant])).toEqual([
      ['F', '.001', false],
      ['F', null, true],
    ]);
  });

  it('does not reach a p on the next line or beyond the longest gap', () => {
    const far = onlyFirst(`F(1, 58) = 3.44${' '.repeat(260)}n.s.`);
    expect(far.notSignificant).toBe(false);
    const nextLine = onlyFirst('F < 1\n\n  n.s.');
    expect(nextLine.notSignificant).toBe(false);
  });
});

function onlyFirst(text: string) {
  const results = scanText(text).results;
  expect(results).toHaveLength(1);
  return results[0]!;
}

describe('a second effect size of the same kind', () => {
  it('belongs to something else and ends the result', () => {
    const text = 'For the time effect, F(2, 152) = 12.66, p < .001, \u03b7p2 = .25 has been corrected to \u03b7p2 = .14.';
    const results = scanText(text).results;
    expect(results).toHaveLength(1);
    expect(results[0]!.effects.map((effect) => effect.value.text)).toEqual(['.25']);
  });

  it('still reads different kinds side by side', () => {
    const [result] = scanText('F(1, 40) = 5.10, p = .03, \u03b7p2 = .11, \u03b72 = .08, \u03c9\u00b2 = .06.').results;
    expect(result!.effects.map((effect) => effect.kind)).toEqual(['partial-eta-squared', 'eta-squared', 'omega-squared']);
  });
});

describe('a plural p after statistics printed without df or p of their own', () => {
  // tests/corpus/real/passages/divu-09.txt: "(RT: r = 0.48; ER: r = 0.86, both ps<0.003, one-tailed)".
  it('makes each of them a result with the shared p', () => {
    expect(ps('Effects correlated between the approaches (RT: r = 0.48; ER: r = 0.86, both ps<0.003, one-tailed).')).toEqual(['<0.003 plural', '<0.003 plural']);
    expect(ps('Both rose, t = 2.1 and t = 3.3 (both ps < .05).')).toEqual(['<.05 plural', '<.05 plural']);
  });

  it('leaves a statistic without p alone when the plural p stands in another sentence, or no p follows', () => {
    expect(ps('Its r = .48 was small. Others held, r = .86, ps < .003.')).toEqual(['<.003 plural']);
    expect(scanText('The r = .48 and the r = .30 were descriptive.').results).toEqual([]);
  });
});
