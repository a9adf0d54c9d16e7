/**
 * Image of an interval under a monotone function.
 *
 * ## Method
 * Common practice: a function that is monotone on [low, high] attains its
 * extremes at the ends, so the image is [min(g(low), g(high)),
 * max(g(low), g(high))]. This is how a statistic known only to its rounding
 * (F = 4.21 means 4.205 <= F <= 4.215) is turned into the range of p-values
 * or effect sizes it is consistent with, without sampling the interval.
 *
 * The caller is responsible for monotonicity; the names of the exported
 * range functions say which argument they are monotone in.
 *
 * ## References
 * - Moore, R. E. (1966). Interval Analysis. Prentice-Hall (image of an
 *   interval under a monotone function, the basis of interval arithmetic).
 */
export interface NumberInterval {
  low: number;
  high: number;
}

/** {low, high} of g over [low, high] for g monotone there (either direction); NaN ends stay NaN. */
export function monotoneImage(g: (x: number) => number, low: number, high: number): NumberInterval {
  const atLow = g(low);
  const atHigh = g(high);
  if (Number.isNaN(atLow) || Number.isNaN(atHigh)) return { low: NaN, high: NaN };
  return { low: Math.min(atLow, atHigh), high: Math.max(atLow, atHigh) };
}
