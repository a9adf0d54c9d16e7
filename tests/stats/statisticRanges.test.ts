import { describe, expect, it } from 'vitest';
import { fUpperTailRange, partialEtaSquaredRange, tTwoTailedRange } from '../../src/stats/statisticRanges.js';
import { monotoneImage } from '../../src/stats/monotoneImage.js';
import { fUpperTail } from '../../src/stats/fDistribution.js';
import { tTwoTailed } from '../../src/stats/tDistribution.js';
import { partialEtaSquaredFromF } from '../../src/stats/effectSizes.js';
import { parseReportedNumber, roundingInterval } from '../../src/stats/reportedNumber.js';

describe('monotoneImage', () => {
  it('orders the image of increasing and decreasing functions', () => {
    expect(monotoneImage((x) => 2 * x, 1, 3)).toEqual({ low: 2, high: 6 });
    expect(monotoneImage((x) => -x, 1, 3)).toEqual({ low: -3, high: -1 });
    expect(monotoneImage(() => NaN, 1, 3).low).toBeNaN();
  });
});

describe('ranges for statistics known to their rounding', () => {
  const reportedF = parseReportedNumber('4.21')!;
  const { low, high } = roundingInterval(reportedF);

  it('fUpperTailRange spans the p-values of every F that rounds to 4.21', () => {
    const range = fUpperTailRange(low, high, 1, 44);
    expect(range.pLow).toBe(fUpperTail(4.215, 1, 44));
    expect(range.pHigh).toBe(fUpperTail(4.205, 1, 44));
    // Any F inside the rounding interval gives a p inside the range.
    for (const f of [4.206, 4.21, 4.2149]) {
      const p = fUpperTail(f, 1, 44);
      expect(p).toBeGreaterThanOrEqual(range.pLow);
      expect(p).toBeLessThanOrEqual(range.pHigh);
    }
  });

  it('partialEtaSquaredRange is increasing in F', () => {
    const range = partialEtaSquaredRange(low, high, 1, 44);
    expect(range.low).toBe(partialEtaSquaredFromF(4.205, 1, 44));
    expect(range.high).toBe(partialEtaSquaredFromF(4.215, 1, 44));
  });

  it('tTwoTailedRange handles negative intervals and intervals around 0', () => {
    const negative = tTwoTailedRange(-2.235, -2.225, 10);
    expect(negative.pLow).toBe(tTwoTailed(2.235, 10));
    expect(negative.pHigh).toBe(tTwoTailed(2.225, 10));
    expect(tTwoTailedRange(-0.05, 0.05, 10).pHigh).toBe(1);
  });

  it('returns NaN for reversed intervals', () => {
    expect(fUpperTailRange(5, 4, 1, 44).pLow).toBeNaN();
    expect(partialEtaSquaredRange(5, 4, 1, 44).low).toBeNaN();
  });
});
