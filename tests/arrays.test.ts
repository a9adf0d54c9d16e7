import { describe, expect, it } from 'vitest';
import { appendAll, extremes } from '../src/arrays.js';

describe('array helpers for inputs of any length', () => {
  const million = Array.from({ length: 1_000_000 }, (_, index) => (index * 7919) % 1_000_003);

  it('appendAll appends a million items in order (push(...items) overflows the stack)', () => {
    expect(() => [0].push(...million)).toThrow(RangeError);
    const target = appendAll([-1], million);
    expect(target).toHaveLength(1_000_001);
    expect(target[0]).toBe(-1);
    expect(target[1_000_000]).toBe(million[999_999]);
  });

  it('extremes finds the smallest and largest of a million values (Math.min(...values) overflows the stack)', () => {
    expect(() => Math.min(...million)).toThrow(RangeError);
    expect(extremes(million)).toEqual({ min: million.reduce((a, b) => Math.min(a, b)), max: million.reduce((a, b) => Math.max(a, b)) });
    expect(extremes([])).toBeNull();
    expect(extremes([3, -2, 7])).toEqual({ min: -2, max: 7 });
  });
});
