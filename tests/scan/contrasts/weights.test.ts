/**
 * The contrast weights readers. Orthogonal polynomial weights against
 * numpy's QR of the Vandermonde matrix (tests/fixtures/contrasts/
 * gen_contrasts.py, numpy 1.24 via Debian's python3-numpy), up to scale;
 * printed lists and words: common practice.
 */
import { describe, expect, it } from 'vitest';
import { polynomialWeights, printedWeights, wordWeights } from '../../../src/scan/contrasts/weights.js';
import { namesAdjustedMeans } from '../../../src/scan/contrasts/index.js';
import { contrastsFixture } from '../../fixtures/contrasts/passages.js';

function proportional(a: readonly number[], b: readonly number[]): boolean {
  const i = b.findIndex((v) => Math.abs(v) > 1e-9);
  const scale = a[i]! / b[i]!;
  return a.every((v, j) => Math.abs(v - scale * b[j]!) < 1e-9);
}

describe('contrast weights', () => {
  it('polynomial weights are numpy\'s orthogonal polynomials up to scale', () => {
    for (const c of contrastsFixture.oneWay) {
      for (const contrast of c.contrasts.filter((x) => x.kind !== 'weights')) {
        const weights = polynomialWeights(c.means.length, contrast.kind === 'linear' ? 1 : 2)!;
        expect(proportional(weights, contrast.weights), `${c.label} ${contrast.kind}`).toBe(true);
      }
    }
  });
  it('reads printed weights in their common forms, one per group, summing to zero', () => {
    expect(printedWeights('A planned contrast (-1, -1, 2) showed', 3)?.weights).toEqual([-1, -1, 2]);
    expect(printedWeights('with weights 1 -1 0 gave', 3)?.weights).toEqual([1, -1, 0]);
    expect(printedWeights('contrast coefficients of \u22123, \u22121, 1, 3', 4)?.weights).toEqual([-3, -1, 1, 3]);
    expect(printedWeights('weights: 1/2, 1/2, -1', 3)?.weights).toEqual([0.5, 0.5, -1]);
    // Not a contrast: the wrong number of weights, or weights that do not sum to zero.
    expect(printedWeights('contrast (-1, 1) of', 3)).toBeNull();
    expect(printedWeights('weights 1 2 3', 3)).toBeNull();
  });
  it('reads groups named in words on each side, with a count word that must agree', () => {
    const names = ['peer training', 'video training', 'control'];
    expect(wordWeights('a contrast of the control group against the two training groups', names)?.weights).toEqual([-0.5, -0.5, 1]);
    expect(wordWeights('compared peer training with the other two', names)?.weights).toEqual([1, -0.5, -0.5]);
    expect(wordWeights('the three training groups against control', names)).toBeNull();
    expect(wordWeights('accuracy against speed', names)).toBeNull();
  });
  it('knows adjusted means by the words before them', () => {
    const text = 'adjusted M = 4.37; covariate-adjusted mean = 3.1; estimated marginal means (SDs) were; M = 4.50';
    expect(namesAdjustedMeans(text, text.indexOf('M = 4.37'))).toBe(true);
    expect(namesAdjustedMeans(text, text.indexOf('mean = 3.1'))).toBe(true);
    expect(namesAdjustedMeans(text, text.indexOf('means (SDs)'))).toBe(true);
    expect(namesAdjustedMeans(text, text.indexOf('M = 4.50'))).toBe(false);
  });
});
