import { describe, expect, it } from 'vitest';
import { scanText } from '../../src/scan/scan.js';
import { onlyResult, slice } from './helpers.js';

describe('p-values', () => {
  it.each([
    ['p = .021', '=', 0.021, 3, 0],
    ['p = 0.021', '=', 0.021, 3, 0],
    ['p < .05', '<', 0.05, 2, 0],
    ['p <= .01', '<=', 0.01, 2, 0],
    ['p \u2264 .01', '<=', 0.01, 2, 0],
    ['p > .10', '>', 0.1, 2, 0],
    ['p = .000', '=', 0, 3, 0],
    ['p=.03', '=', 0.03, 2, 0],
    ['P = 0.03', '=', 0.03, 2, 0],
    ['p-value = .03', '=', 0.03, 2, 0],
    ['p value = .03', '=', 0.03, 2, 0],
    ['p(two-tailed) = .03', '=', 0.03, 2, 0],
    ['p (one-sided) = .03', '=', 0.03, 2, 0],
    ['p_{adj} = .03', '=', 0.03, 2, 0],
    ['p = 1.2e-5', '=', 1.2e-5, 1, -5],
    ['p = 1.2E-05', '=', 1.2e-5, 1, -5],
    ['p = 1.2 x 10^-5', '=', 1.2e-5, 1, -5],
    ['p = 1.2 \u00d7 10\u22125', '=', 1.2e-5, 1, -5],
    ['p = 1.2 \u00d7 10\u207b\u2075', '=', 1.2e-5, 1, -5],
    ['p < 10^-4', '<', 1e-4, 0, -4],
    ['p < 10\u207b\u2074', '<', 1e-4, 0, -4],
  ])('reads %s', (written, comparator, value, decimals, exponent) => {
    const text = `The effect was reliable, t(30) = 4.10, ${written}.`;
    const p = onlyResult(text).p;
    expect(p?.comparator).toBe(comparator);
    expect(p?.value.value).toBeCloseTo(value, 12);
    expect(p?.value.decimals).toBe(decimals);
    expect(p?.value.exponent).toBe(exponent);
    expect(p?.plural).toBe(false);
    expect(slice(text, p!)).toBe(written);
  });

  it('marks "ps < .001" as plural', () => {
    const p = onlyResult('Both were reliable, Fs(1, 44) > 12.1, ps < .001.').p;
    expect(p?.plural).toBe(true);
    expect(p?.value.text).toBe('.001');
  });

  it.each(['n.s.', 'ns', 'n.s', 'NS', 'n. s.'])('reads "%s" as not significant with no p', (mark) => {
    const result = onlyResult(`The interaction was not reliable, F(1, 44) = 0.89, ${mark}.`);
    expect(result.notSignificant).toBe(true);
    expect(result.p).toBeNull();
  });

  it('does not take a probability above 1 as a p-value', () => {
    expect(onlyResult('t(30) = 4.10, p = 12').p).toBeNull();
  });

  it('attaches a p-value that stands a few words after the statistic', () => {
    const result = onlyResult('F(1, 44) = 5.10, which was reliable, p = .03.');
    expect(result.p?.value.text).toBe('.03');
  });

  it('does not attach a p-value from the next sentence', () => {
    const result = onlyResult('F(1, 44) = 5.10. In the second study the rate was p = .03 lower.');
    expect(result.p).toBeNull();
  });

  it('does not attach the p-value of the next statistic', () => {
    const [first, second] = scanText('F(1, 44) = 0.50 and t(30) = 2.50, p = .02.').results;
    expect(first!.p).toBeNull();
    expect(second!.p?.value.text).toBe('.02');
  });

  it('does not read "pp." or "p." page references as p-values', () => {
    expect(onlyResult('t(30) = 4.10 (see p. 12)').p).toBeNull();
    expect(onlyResult('t(30) = 4.10 (see pp. 12-15)').p).toBeNull();
  });
});
