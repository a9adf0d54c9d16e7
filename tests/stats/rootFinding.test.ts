import { describe, expect, it } from 'vitest';
import { bracketDecreasingRoot, findRootBrent } from '../../src/stats/rootFinding.js';

describe('findRootBrent', () => {
  it('finds sqrt(2) and the root of cos(x) - x to near machine precision', () => {
    expect(Math.abs(findRootBrent((x) => x * x - 2, 0, 2) - Math.SQRT2)).toBeLessThan(1e-15);
    // Dottie number 0.7390851332151607 (common practice: fixed point of cos).
    expect(Math.abs(findRootBrent((x) => Math.cos(x) - x, 0, 1) - 0.7390851332151607)).toBeLessThan(1e-15);
  });

  it('copes with a step function (falls back to bisection)', () => {
    const root = findRootBrent((x) => (x < 0.3 ? -1 : 1), 0, 1);
    expect(Math.abs(root - 0.3)).toBeLessThan(1e-14);
  });

  it('returns NaN without a sign change', () => {
    expect(findRootBrent((x) => x * x + 1, -1, 1)).toBeNaN();
  });
});

describe('bracketDecreasingRoot', () => {
  it('doubles outward until the sign changes', () => {
    const bracket = bracketDecreasingRoot((x) => 1000 - x, 0, 1);
    expect(bracket).not.toBeNull();
    expect(bracket!.lower).toBeLessThan(1000);
    expect(bracket!.upper).toBeGreaterThanOrEqual(1000);
  });

  it('gives up (null) when there is no root', () => {
    expect(bracketDecreasingRoot(() => 1, 0, 1, 20)).toBeNull();
  });
});
