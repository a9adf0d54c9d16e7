/**
 * How many significant digits the report carries for what plumbline
 * recomputed (p, its interval, partial eta squared, what a table row
 * implies). Six: more than any printed p or effect size has (they are
 * printed to two to four), so a reader comparing them loses nothing, while
 * the seventeen digits of a double are mostly below the statistics core's
 * accuracy anyway (its tests hold it to SciPy and mpmath at about 1e-9
 * relative). The checks run on the full values; only the report is rounded.
 * The ends of an interval are rounded outward, so the interval written
 * still holds every value the full one held.
 */
export const REPORTED_DIGITS = 6;

/** The value at REPORTED_DIGITS significant digits, to the nearest. */
export function reported(value: number): number {
  return Number.isFinite(value) && value !== 0 ? Number(value.toPrecision(REPORTED_DIGITS)) : value;
}

/** One unit in the last reported digit of a value near `value`. */
function lastDigitUnit(value: number): number {
  return 10 ** (Math.floor(Math.log10(Math.abs(value))) - (REPORTED_DIGITS - 1));
}

/** The largest value at REPORTED_DIGITS significant digits that is at most `value` (for an interval's low end). */
export function reportedDown(value: number): number {
  const rounded = reported(value);
  if (!(rounded > value)) return rounded;
  // Stepping down from the nearest value and rounding again gives the short decimal, not 0.07883079999999999.
  // The step is a unit of the value's own last digit: 999999.5 rounds up to 1000000, whose unit is ten.
  return Number((rounded - lastDigitUnit(value)).toPrecision(REPORTED_DIGITS));
}

/** The smallest value at REPORTED_DIGITS significant digits that is at least `value` (for an interval's high end). */
export function reportedUp(value: number): number {
  return -reportedDown(-value);
}

export function reportedOrNull(value: number | null): number | null {
  return value === null ? null : reported(value);
}
