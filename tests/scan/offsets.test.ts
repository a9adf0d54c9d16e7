import { describe, expect, it } from 'vitest';
import { scanText } from '../../src/scan/scan.js';
import { onlyResult, slice } from './helpers.js';

describe('offsets point at the original text', () => {
  it('spans the whole result from the symbol to its last part', () => {
    const text = 'Before. The effect was reliable, F(2, 57) = 4.21, p = .021, \u03b7p2 = .13. After.';
    const result = onlyResult(text);
    expect(result.text).toBe('F(2, 57) = 4.21, p = .021, \u03b7p2 = .13');
    expect(slice(text, result)).toBe(result.text);
    expect(slice(text, result.p!)).toBe('p = .021');
    expect(slice(text, result.effects[0]!)).toBe('\u03b7p2 = .13');
  });

  it('keeps the original characters when the text had a Unicode minus and spaces', () => {
    const text = 'so t(28)\u00a0=\u00a0\u22122.21, p\u2009<\u2009.05 held';
    const result = onlyResult(text);
    expect(result.text).toBe('t(28)\u00a0=\u00a0\u22122.21, p\u2009<\u2009.05');
    expect(result.value?.text).toBe('-2.21');
    expect(slice(text, result.p!)).toBe('p\u2009<\u2009.05');
  });

  it('keeps the original characters across a line break', () => {
    const text = 'reliable, F(1,\n44) = 5.10,\np = .03.';
    const result = onlyResult(text);
    expect(result.text).toBe('F(1,\n44) = 5.10,\np = .03');
    expect(result.start).toBe(text.indexOf('F('));
  });

  it('points at Greek letters and superscripts that normalisation expanded', () => {
    const text = 'Choices differed, \u03c7\u00b2(1, N = 80) = 4.20, p = .04, \u03c6 = .23.';
    const result = onlyResult(text);
    expect(result.text.startsWith('\u03c7\u00b2(1')).toBe(true);
    expect(text.charAt(result.start)).toBe('\u03c7');
    expect(slice(text, result.effects[0]!)).toBe('\u03c6 = .23');
    expect(result.end).toBe(text.indexOf('.23') + 3);
  });

  it('points at characters after removed soft hyphens and joined line breaks', () => {
    const text = 'The signif-\nicant e\u00adffect, t(9) = 3.10, p = .01.';
    const result = onlyResult(text);
    expect(slice(text, result)).toBe('t(9) = 3.10, p = .01');
  });

  it('points at astral mathematical letters', () => {
    const text = 'x \u{1d439}(2, 40) = 3.30, \u{1d45d} = .047 y';
    const result = onlyResult(text);
    expect(result.text).toBe('\u{1d439}(2, 40) = 3.30, \u{1d45d} = .047');
    expect(slice(text, result.p!)).toBe('\u{1d45d} = .047');
  });

  it('gives every result of a long text offsets that slice to its own text', () => {
    const unit = 'Text \u2014 with dashes\u00a0and F(1,\u00a044) = \u22125.10, p\u2009=\u2009.03, \u03b7p\u00b2 = .10. ';
    const text = unit.repeat(50);
    const results = scanText(text).results;
    expect(results).toHaveLength(50);
    for (const result of results) {
      expect(slice(text, result)).toBe(result.text);
      expect(result.text).toBe('F(1,\u00a044) = \u22125.10, p\u2009=\u2009.03, \u03b7p\u00b2 = .10');
    }
  });
});
