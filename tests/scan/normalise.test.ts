import { describe, expect, it } from 'vitest';
import { normaliseText } from '../../src/scan/normalise.js';

describe('normaliseText', () => {
  it('returns plain ASCII unchanged with an identity map', () => {
    const text = 'F(1, 44) = 5.10, p = .03';
    const normalised = normaliseText(text);
    expect(normalised.text).toBe(text);
    expect(normalised.toOriginal(9)).toBe(9);
    expect(normalised.toOriginalEnd(text.length)).toBe(text.length);
  });

  it.each([
    ['\u2212', '-'],
    ['\u2013', '-'],
    ['\u2014', '-'],
    ['\u2012', '-'],
    ['\u2010', '-'],
    ['\ufe63', '-'],
    ['\uff0d', '-'],
  ])('reads the dash glyph %j as a minus', (glyph, expected) => {
    expect(normaliseText(`t(28) = ${glyph}2.21`).text).toBe(`t(28) = ${expected}2.21`);
  });

  it('turns Unicode spaces into plain spaces', () => {
    const text = 'p\u00a0<\u2009.05\u202f\u2007\u3000x';
    expect(normaliseText(text).text).toBe('p < .05   x');
  });

  it('drops soft hyphens and zero-width characters', () => {
    expect(normaliseText('sig\u00adni\u200bfi\u200ccant\u200d\ufeff').text).toBe('significant');
  });

  it('expands ligatures', () => {
    expect(normaliseText('\ufb01xed \ufb02at e\ufb00ect o\ufb03ce ba\ufb04e').text).toBe('fixed flat effect office baffle');
  });

  it('joins a word hyphenated across a line break', () => {
    expect(normaliseText('was signif-\nicant here').text).toBe('was significant here');
    expect(normaliseText('was signif- \r\n  icant').text).toBe('was significant');
  });

  it('keeps a hyphen at a line end when the next line does not continue a word', () => {
    expect(normaliseText('Greenhouse-\nGeisser').text).toBe('Greenhouse-\nGeisser');
    expect(normaliseText('t(28) = -\n2.1').text).toBe('t(28) = -\n2.1');
  });

  it('maps full-width digits, letters and punctuation to ASCII', () => {
    expect(normaliseText('\uff26\uff08\uff11\uff0c\uff14\uff14\uff09\uff1d\uff15').text).toBe('F(1,44)=5');
  });

  it('reads superscript and subscript digits and signs', () => {
    expect(normaliseText('\u03c7\u00b2 \u03b7\u209a\u00b2 10\u207b\u2075 x\u2081\u2082').text).toBe('chi2 etap2 10-5 x12');
  });

  it('writes comparison signs as ASCII', () => {
    expect(normaliseText('p \u2264 .01, p \u2265 .10, p \u2a7d .05, p \u2a7e .5, F \uff1d 2').text).toBe(
      'p <= .01, p >= .10, p <= .05, p >= .5, F = 2',
    );
  });

  it('spells out the Greek letters used for statistics and effect sizes', () => {
    expect(normaliseText('\u03b7 \u03c9 \u03c7 \u03a7 \u03b1 \u03c6 \u03b5').text).toBe('eta omega chi chi alpha phi epsilon');
  });

  it('reads the multiplication sign and the middle dot', () => {
    expect(normaliseText('1.2 \u00d7 10\u207b\u2075').text).toBe('1.2 x 10-5');
    expect(normaliseText('p = 0\u00b703').text).toBe('p = 0.03');
  });

  it('straightens curly quotes and primes', () => {
    expect(normaliseText('Cohen\u2019s d, Hedges\u2032 g, \u201cquoted\u201d').text).toBe('Cohen\'s d, Hedges\' g, "quoted"');
  });

  it('reads mathematical italic letters and digits as plain ones', () => {
    // U+1D439 italic F, U+1D45D italic p, U+1D702 italic eta, U+1D7CF bold digit one
    expect(normaliseText('\u{1d439} \u{1d45d} \u{1d702} \u{1d7cf}').text).toBe('F p eta 1');
  });

  it('leaves other non-ASCII text in place', () => {
    expect(normaliseText('Müller & 北京').text).toBe('Müller & 北京');
  });

  it('maps offsets after expansions and removals back to the original', () => {
    const original = 'a\u00adb \u03b7p\u00b2 = .1 \u2264 c \u{1d439}!';
    const normalised = normaliseText(original);
    expect(normalised.text).toBe('ab etap2 = .1 <= c F!');
    const text = normalised.text;
    for (const [normalisedPiece, originalPiece] of [
      ['b', 'b'],
      ['etap2', '\u03b7p\u00b2'],
      ['= .1', '= .1'],
      ['<=', '\u2264'],
      ['F', '\u{1d439}'],
      ['!', '!'],
    ] as const) {
      const start = text.indexOf(normalisedPiece);
      const end = start + normalisedPiece.length;
      expect(original.slice(normalised.toOriginal(start), normalised.toOriginalEnd(end))).toBe(originalPiece);
    }
  });

  it('maps offsets across a joined line-break hyphenation', () => {
    const original = 'signif-\nicant F';
    const normalised = normaliseText(original);
    const at = normalised.text.indexOf('F');
    expect(normalised.toOriginal(at)).toBe(original.indexOf('F'));
    expect(original.slice(normalised.toOriginal(0), normalised.toOriginalEnd(11))).toBe('signif-\nicant');
  });

  it('handles text that starts and ends with removed characters', () => {
    const original = '\ufeffF\u00ad';
    const normalised = normaliseText(original);
    expect(normalised.text).toBe('F');
    expect(original.slice(normalised.toOriginal(0), normalised.toOriginalEnd(1))).toBe('F');
  });

  it('keeps dense runs of symbols in order', () => {
    const original = 'F(\u2212\u2009\u00a0\u2013'.repeat(2000);
    expect(normaliseText(original).text).toBe('F(-  -'.repeat(2000));
  });
});
