import { describe, expect, it } from 'vitest';
import { isMissingCode, parseAnalysisSpec, parseMissingRule, RefitError } from '../../src/refit/index.js';

function errorOf(fn: () => unknown): RefitError {
  try {
    fn();
  } catch (err) {
    if (err instanceof RefitError) return err;
    throw err;
  }
  throw new Error('expected a RefitError');
}

describe('analysis description', () => {
  it('fills the defaults: type 3, sum coding', () => {
    const spec = parseAnalysisSpec({ model: 'y ~ a' });
    expect(spec.type).toBe(3);
    expect(spec.coding).toBe('sum');
    expect(spec.outcome).toBe('y');
    expect(spec.formula.terms.map((t) => t.name)).toEqual(['a']);
  });

  it('names the field of a validation error', () => {
    expect(errorOf(() => parseAnalysisSpec({ model: 'y ~ a', type: 4 })).details.field).toBe('type');
    expect(errorOf(() => parseAnalysisSpec({ model: 'y ~ a', coding: 'helmert' })).message).toMatch(/"coding"/);
    expect(errorOf(() => parseAnalysisSpec({ model: 'y ~ a', factors: { a: { levels: [] } } })).details.field).toBe('factors.a.levels');
    expect(errorOf(() => parseAnalysisSpec({ model: 'y ~ a', modle: 'x' })).code).toBe('INVALID_SPEC');
    expect(errorOf(() => parseAnalysisSpec({})).details.field).toBe('model');
  });

  it('rejects an outcome that differs from the model and a factor that is also a covariate', () => {
    expect(errorOf(() => parseAnalysisSpec({ outcome: 'z', model: 'y ~ a' })).details.field).toBe('outcome');
    expect(errorOf(() => parseAnalysisSpec({ model: 'y ~ a', factors: { a: {} }, covariates: ['a'] })).details.field).toBe('factors.a');
  });
});

describe('missing-value codes', () => {
  const miss = (codes: Parameters<typeof parseMissingRule>[0], text: string) => isMissingCode(parseMissingRule(codes, 'missing.x'), text, Number(text));

  it('reads lists, ranges and comparisons', () => {
    expect(miss('6,7,8', '7')).toBe(true);
    expect(miss('6,7,8', '9')).toBe(false);
    expect(miss('6-8', '7.5')).toBe(true);
    expect(miss('6-8', '8.01')).toBe(false);
    expect(miss('>=6', '6')).toBe(true);
    expect(miss('>6', '6')).toBe(false);
    expect(miss('<0', '-1')).toBe(true);
    expect(miss([6, 7, 8], '8.0')).toBe(true);
    expect(miss(-99, '-99')).toBe(true);
    expect(miss('-99', '-99')).toBe(true);
    expect(miss('-9--7', '-8')).toBe(true);
    expect(miss('refused, 99', 'refused')).toBe(true);
  });

  it('rejects a reversed range', () => {
    expect(() => parseMissingRule('8-6', 'missing.x')).toThrow(/missing\.x/);
  });
});

describe('names that are members of Object.prototype', () => {
  it('are read as own keys of factors, labels, missing and rename, "__proto__" included, into Maps', () => {
    // JSON.parse makes "__proto__" an own key, as in a description file a user wrote.
    const spec = parseAnalysisSpec(
      JSON.parse(
        '{"model": "valueOf ~ toString + __proto__", "factors": {"__proto__": {"labels": {"constructor": "c"}}, "toString": {}},' +
          ' "missing": {"__proto__": 9}, "rename": {"hasOwnProperty": "toString"}}',
      ),
    );
    expect([...spec.factors.keys()]).toEqual(['__proto__', 'toString']);
    expect(spec.factors.get('__proto__')!.labels).toEqual(new Map([['constructor', 'c']]));
    expect(spec.factors.get('constructor')).toBeUndefined();
    expect([...spec.missingRules.keys()]).toEqual(['__proto__']);
    expect(spec.rename).toEqual(new Map([['hasOwnProperty', 'toString']]));
  });

  it('a bad value under such a key is reported with the key in its field', () => {
    expect(() => parseAnalysisSpec(JSON.parse('{"model": "y ~ __proto__", "factors": {"__proto__": {"levels": []}}}'))).toThrow(
      /field "factors\.__proto__\.levels": Too small/,
    );
  });
});
