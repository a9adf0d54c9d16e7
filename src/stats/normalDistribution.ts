import erfc from '@stdlib/math-base-special-erfc';

/**
 * Standard normal tail probabilities for z statistics.
 *
 * ## Method
 * P(Z >= z) = erfc(z / sqrt(2)) / 2 (Abramowitz & Stegun 26.2.29), using
 * @stdlib/math-base-special-erfc (a port of the FreeBSD msun erfc, rational
 * approximations after W. J. Cody). erfc is evaluated directly for large
 * arguments, so upper tails keep relative accuracy down to about 1e-308
 * (z near 37.5) instead of cancelling in 1 - Phi(z).
 *
 * Edge cases: z = +Infinity gives 0, z = -Infinity gives 1, NaN gives NaN.
 *
 * ## References
 * - Abramowitz, M. & Stegun, I. A. (1964). Handbook of Mathematical
 *   Functions, National Bureau of Standards AMS 55, formula 26.2.29.
 * - Cody, W. J. (1969). Rational Chebyshev approximations for the error
 *   function. Mathematics of Computation 23(107), 631-637.
 */
export function zUpperTail(z: number): number {
  if (Number.isNaN(z)) return NaN;
  return 0.5 * erfc(z / Math.SQRT2);
}

/** Two-tailed p for a z statistic, P(|Z| >= |z|); same method as zUpperTail. */
export function zTwoTailed(z: number): number {
  if (Number.isNaN(z)) return NaN;
  return erfc(Math.abs(z) / Math.SQRT2);
}
