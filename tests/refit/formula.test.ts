import { describe, expect, it } from 'vitest';
import { parseFormula, RefitError } from '../../src/refit/index.js';

const names = (f: string) => parseFormula(f).terms.map((t) => t.name);

describe('Wilkinson-Rogers formulas', () => {
  it('reads sums, interactions and the outcome', () => {
    const f = parseFormula('y ~ a + b + a:b');
    expect(f.outcome).toBe('y');
    expect(names('y ~ a + b + a:b')).toEqual(['a', 'b', 'a:b']);
  });

  it('expands a*b and a*b*c by degree', () => {
    expect(names('y ~ a*b')).toEqual(['a', 'b', 'a:b']);
    expect(names('y ~ a*b*c')).toEqual(['a', 'b', 'c', 'a:b', 'a:c', 'b:c', 'a:b:c']);
  });

  it('keeps the written order at the top level and names interactions in formula order', () => {
    expect(names('y ~ c + a*b')).toEqual(['c', 'a', 'b', 'a:b']);
    expect(names('y ~ b:a + a')).toEqual(['b:a', 'a']);
  });

  it('drops duplicate terms, whatever their written order', () => {
    expect(names('y ~ a*b + b:a + a')).toEqual(['a', 'b', 'a:b']);
  });

  it('expands (a+b+c)^2 to interactions up to order 2', () => {
    expect(names('y ~ (a + b + c)^2')).toEqual(['a', 'b', 'c', 'a:b', 'a:c', 'b:c']);
  });

  it('reads back-quoted names and ignores an explicit intercept', () => {
    expect(names('`reaction time` ~ 1 + `test group` * age')).toEqual(['test group', 'age', 'test group:age']);
  });

  it('rejects malformed formulas with the position', () => {
    const cases = ['y a + b', 'y ~', 'y ~ a +', 'y ~ a - 1', 'y ~ a + 0', 'y ~ (a + b', 'y ~ a $ b'];
    for (const c of cases) {
      expect(() => parseFormula(c), c).toThrow(RefitError);
    }
    expect(() => parseFormula('y ~ a $ b')).toThrow(/character 7/);
  });
});
