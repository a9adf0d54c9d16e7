import { describe, expect, it } from 'vitest';
import { readEpsilons } from '../../src/scan/epsilon.js';
import { normaliseText } from '../../src/scan/normalise.js';
import { scanText } from '../../src/scan/scan.js';

const read = (text: string) => readEpsilons(normaliseText(text)).map((e) => ({ value: e.value.text, method: e.method, text: e.text }));

describe('printed sphericity epsilons', () => {
  it('reads the Greek letter and the word, with the value as printed', () => {
    expect(read('F(1.44, 41.76) = 5.20, p = .020, ε = .72')).toEqual([{ value: '.72', method: 'unspecified', text: 'ε = .72' }]);
    expect(read('Mauchly’s test was significant (epsilon = 0.685).')).toEqual([{ value: '0.685', method: 'unspecified', text: 'epsilon = 0.685' }]);
  });
  it('takes the method from a subscript or from the name just before', () => {
    expect(read('(εGG = .68)')).toEqual([{ value: '.68', method: 'greenhouse-geisser', text: 'εGG = .68' }]);
    expect(read('ε_HF = .91')).toEqual([{ value: '.91', method: 'huynh-feldt', text: 'ε_HF = .91' }]);
    expect(read('Greenhouse–Geisser ε = 0.72')[0]!.method).toBe('greenhouse-geisser');
    expect(read('with the Huynh-Feldt correction, ε = .81, F(1.62, 46.98) = 4.10')[0]!.method).toBe('huynh-feldt');
    expect(read('HF epsilon of .81')[0]).toMatchObject({ value: '.81', method: 'huynh-feldt' });
  });
  it('maps offsets to the original text', () => {
    const text = 'Time mattered, F(1.44, 41.76) = 5.20, p = .020, ε = .72.';
    const [epsilon] = readEpsilons(normaliseText(text));
    expect(text.slice(epsilon!.start, epsilon!.end)).toBe('ε = .72');
  });
  it('leaves alone what is not an epsilon value: other words, values above 1, no value', () => {
    expect(read('The Epsilonproteobacteria grew (n = 12).')).toEqual([]);
    expect(read('epsilon = 1.40')).toEqual([]);
    expect(read('Greenhouse-Geisser epsilon was reported where sphericity was violated.')).toEqual([]);
    expect(read('ε = 0')).toEqual([]);
  });
  it('reaches the document context through scanText', () => {
    expect(scanText('Time mattered, F(1.44, 41.76) = 5.20, p = .020, ε = .72.').context.epsilons!.map((e) => e.value.value)).toEqual([0.72]);
  });
});
