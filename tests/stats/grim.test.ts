import { describe, expect, it } from 'vitest';
import { grimmerTest, grimTest } from '../../src/stats/grim.js';
import { parseReportedNumber } from '../../src/stats/reportedNumber.js';

const num = (text: string) => parseReportedNumber(text)!;

describe('GRIM (Brown & Heathers 2017)', () => {
  // The paper's illustration as remembered (FROM MEMORY): a mean of 5.19 from 28 participants
  // answering one integer item is impossible, because 145/28 = 5.18 and 146/28 = 5.21.
  it('flags 5.19 with n = 28 and names 5.18 and 5.21 (example from memory)', () => {
    const outcome = grimTest(num('5.19'), 28);
    expect(outcome).toEqual({ possible: false, informative: true, nearest: ['5.18', '5.21'] });
    expect(grimTest(num('5.18'), 28).possible).toBe(true);
    expect(grimTest(num('5.21'), 28).possible).toBe(true);
  });

  it('accepts every mean that n whole numbers can give, for n = 1..40 (exhaustive)', () => {
    for (let n = 1; n <= 40; n++) {
      for (let total = 0; total <= 7 * n; total++) {
        const mean = (total / n).toFixed(2);
        expect(grimTest(num(mean), n).possible, `${mean} n=${n}`).toBe(true);
      }
    }
  });

  it('flags exactly the two-decimal means that no total gives (n = 1..40, means 1.00..7.00)', () => {
    for (let n = 1; n <= 40; n++) {
      const possible = new Set<string>();
      for (let total = 0; total <= 8 * n; total++) possible.add((total / n).toFixed(2));
      for (let hundredths = 100; hundredths <= 700; hundredths++) {
        const mean = (hundredths / 100).toFixed(2);
        // Both rounding directions are accepted, so ties (x.xx5) count as possible either way.
        const tie = [...Array(8 * n + 1).keys()].some((total) => Math.abs(total / n - (hundredths - 0.5) / 100) < 1e-12 || Math.abs(total / n - (hundredths + 0.5) / 100) < 1e-12);
        expect(grimTest(num(mean), n).possible, `${mean} n=${n}`).toBe(possible.has(mean) || tie);
      }
    }
  });

  it('is not informative when n x items reaches 10^decimals', () => {
    expect(grimTest(num('3.47'), 100).informative).toBe(false);
    expect(grimTest(num('3.47'), 25, 4).informative).toBe(false);
    expect(grimTest(num('3.4'), 12).informative).toBe(false);
  });

  it('counts the items averaged per person: means of 3 items of 10 people move in steps of 1/30', () => {
    expect(grimTest(num('2.50'), 10, 3).possible).toBe(true); // 75/30
    expect(grimTest(num('2.51'), 10, 3)).toEqual({ possible: false, informative: true, nearest: ['2.50', '2.53'] });
  });
});

describe('GRIMMER (Anaya 2016, cited from memory)', () => {
  it('scores 1..5 (n = 5): mean 3.00, SD 1.58 is possible; 1.60 is not; 1.66 fails on parity', () => {
    expect(grimmerTest(num('3.00'), num('1.58'), 5).possible).toBe(true);
    expect(grimmerTest(num('3.00'), num('1.60'), 5)).toEqual({ possible: false, informative: true, nearest: ['1.58', '1.73'] });
    // Sum of squares 56 is a whole number but even, while the sum 15 is odd.
    expect(grimmerTest(num('3.00'), num('1.66'), 5).possible).toBe(false);
  });

  it('accepts the mean and SD of every multiset of 4 or 6 scores from 1..7 (exhaustive, no false alarms)', () => {
    for (const n of [4, 6]) {
      const scores: number[] = [];
      const visit = (from: number): void => {
        if (scores.length === n) {
          const mean = scores.reduce((a, b) => a + b, 0) / n;
          const sd = Math.sqrt(scores.reduce((a, b) => a + (b - mean) ** 2, 0) / (n - 1));
          const outcome = grimmerTest(num(mean.toFixed(2)), num(sd.toFixed(2)), n);
          expect(outcome.possible, `${scores.join(',')}: ${mean.toFixed(2)} (${sd.toFixed(2)})`).toBe(true);
          return;
        }
        for (let value = from; value <= 7; value++) {
          scores.push(value);
          visit(value);
          scores.pop();
        }
      };
      visit(1);
    }
  });

  it('says nothing when the mean itself is impossible or the input is unusable', () => {
    expect(grimmerTest(num('5.19'), num('1.00'), 28).informative).toBe(false);
    expect(grimmerTest(num('3.00'), num('1.00'), 1).informative).toBe(false);
  });
});
