import gammaln from '@stdlib/math-base-special-gammaln';

/**
 * Accurate "Poisson-like" densities x^a e^(-x) / Gamma(a + 1) for real a >= 0,
 * the prefix of the incomplete gamma function and the weight of a Poisson
 * mixture (noncentral F).
 *
 * ## Method
 * Loader's saddle-point form: x^a e^(-x) / Gamma(a + 1)
 *   = exp(-stirlingError(a) - deviance(a, x)) / sqrt(2 pi a),
 * where deviance(a, x) = a log(a/x) + x - a is summed as a series when a and
 * x are close, so that nothing of size a log a is formed and cancelled. For
 * a < 10 the direct formula is as accurate and cheaper.
 *
 * ## References
 * - Loader, C. (2000). Fast and accurate computation of binomial
 *   probabilities. Technical report, Bell Labs (the dbinom/dpois method used
 *   by R).
 * - Abramowitz, M. & Stegun, I. A. (1964). Handbook of Mathematical
 *   Functions, 6.1.41 (Stirling series).
 */
export function poissonLikeDensity(a: number, x: number): number {
  if (x === 0) return a === 0 ? 1 : 0;
  if (a === 0) return Math.exp(-x);
  if (a < 10) return Math.exp(a * Math.log(x) - x - gammaln(a + 1));
  return Math.exp(-stirlingError(a) - deviance(a, x)) / Math.sqrt(2 * Math.PI * a);
}

/** log Gamma(z + 1) - [(z + 1/2) log z - z + log(2 pi)/2], for z > 0. */
export function stirlingError(z: number): number {
  if (z < 15) return gammaln(z + 1) - (z + 0.5) * Math.log(z) + z - 0.5 * Math.log(2 * Math.PI);
  const inverse = 1 / z;
  const inverseSquared = inverse * inverse;
  // Stirling series coefficients B_2k / (2k (2k - 1)); enough terms for z >= 15.
  const coefficients = [1 / 12, -1 / 360, 1 / 1260, -1 / 1680, 1 / 1188, -691 / 360360];
  let sum = 0;
  for (let index = coefficients.length - 1; index >= 0; index -= 1) sum = sum * inverseSquared + (coefficients[index] ?? 0);
  return sum * inverse;
}

/** a log(a / x) + x - a >= 0, without cancellation when a is close to x. */
export function deviance(a: number, x: number): number {
  if (Math.abs(a - x) < 0.1 * (a + x)) {
    const ratio = (a - x) / (a + x);
    const ratioSquared = ratio * ratio;
    let sum = (a - x) * ratio;
    let power = 2 * a * ratio;
    for (let j = 1; j < 1000; j += 1) {
      power *= ratioSquared;
      const next = sum + power / (2 * j + 1);
      if (next === sum) return next;
      sum = next;
    }
    return sum;
  }
  return a * Math.log(a / x) + x - a;
}
