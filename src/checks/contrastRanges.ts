import type { ComparisonFamily, ErrorReading } from '../scan/types.js';
import type { NumberInterval } from '../stats/monotoneImage.js';

/**
 * Ranges of a contrast's and a pairwise comparison's statistics over the
 * rounding of the printed means and of one reading of the error mean
 * square, for contrast-mismatch and post-hoc-difference-mismatch.
 *
 * A contrast L = sum c_i m_i of k group means has SE = sqrt(MSE sum c_i^2 /
 * n_i) and t = L / SE on the error df (F = t^2 on 1 and the error df). L is
 * linear in the means, so its range over the box of means is exact (each
 * mean at the end its weight's sign picks); |t| takes |L| over SE at the
 * other end of the error mean square's range. When the reading is MS_between
 * / F, L and the mean square share the means, and the range is an outer
 * bound (wider, so quieter).
 *
 * Reference: Maxwell, S. E. & Delaney, H. D. (2004). Designing Experiments
 * and Analyzing Data, 2nd ed., chapter 4 (individual comparisons of means),
 * from memory; common practice.
 */

/** The range of a linear combination of means (weights c) over their rounding. */
export function contrastRange(family: ComparisonFamily, weights: readonly number[]): NumberInterval {
  let low = 0;
  let high = 0;
  family.groups.forEach((group, i) => {
    const c = weights[i]!;
    low += c * (c >= 0 ? group.mean.low : group.mean.high);
    high += c * (c >= 0 ? group.mean.high : group.mean.low);
  });
  return { low, high };
}

/** The range of |x| for x in a range. */
export function absoluteRange(range: NumberInterval): NumberInterval {
  if (range.low >= 0) return range;
  if (range.high <= 0) return { low: -range.high, high: -range.low };
  return { low: 0, high: Math.max(-range.low, range.high) };
}

/** sum c_i^2 / n_i: the contrast's variance over the error mean square. */
export function varianceFactor(family: ComparisonFamily, weights: readonly number[]): number {
  return family.groups.reduce((sum, group, i) => sum + weights[i]! ** 2 / group.n, 0);
}

/** The range of |L| / sqrt(MSE factor) for |L| in `magnitude` and MSE in the reading's range. */
export function ratioRange(magnitude: NumberInterval, reading: ErrorReading, factor: number): NumberInterval {
  const seLow = Math.sqrt(reading.meanSquare.low * factor);
  const seHigh = Math.sqrt(reading.meanSquare.high * factor);
  return { low: seHigh === 0 ? 0 : magnitude.low / seHigh, high: seLow === 0 ? Infinity : magnitude.high / seLow };
}

/** A range meets a printed number's rounding interval (relative slack 1e-9). */
export function meets(range: NumberInterval, printed: NumberInterval): boolean {
  const slack = 1e-9 * Math.max(1, Math.abs(printed.high), Math.abs(printed.low));
  return range.low <= printed.high + slack && range.high >= printed.low - slack;
}

/** "pooled from the SDs", "printed (MSE = 0.87)", "MS_between / F". */
export function describeReading(reading: ErrorReading): string {
  return reading.source === 'sds' ? 'pooled from the SDs' : reading.source === 'printed' ? 'as printed' : 'the means\' MS_between over F';
}
