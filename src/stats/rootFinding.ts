/**
 * Root finding for monotone functions: outward bracketing and Brent's method.
 *
 * ## Method
 * Brent's method (zeroin): keeps a bracket [a, b] with a sign change and
 * takes inverse quadratic interpolation or secant steps when they land well
 * inside the bracket, falling back to bisection otherwise, so convergence is
 * superlinear on smooth functions and never slower than bisection. This is a
 * direct transcription of the ALGOL 60 procedure zero in Brent's book.
 *
 * ## References
 * - Brent, R. P. (1973). Algorithms for Minimization without Derivatives.
 *   Prentice-Hall, chapter 4 (procedure zero).
 * - Forsythe, G. E., Malcolm, M. A. & Moler, C. B. (1977). Computer Methods
 *   for Mathematical Computations. Prentice-Hall, section 7.2 (zeroin).
 */

export interface BrentOptions {
  /** Absolute tolerance on the root (default 1e-300, i.e. rely on relativeTolerance). */
  absoluteTolerance?: number;
  /** Relative tolerance on the root (default 4 * machine epsilon). */
  relativeTolerance?: number;
  /** Give up after this many function evaluations (default 200). */
  maxIterations?: number;
}

/**
 * A root of fn in [lower, upper], which must bracket a sign change
 * (fn(lower) * fn(upper) <= 0). Returns NaN when they do not.
 */
export function findRootBrent(fn: (x: number) => number, lower: number, upper: number, options: BrentOptions = {}): number {
  const absoluteTolerance = options.absoluteTolerance ?? 1e-300;
  const relativeTolerance = options.relativeTolerance ?? 4 * Number.EPSILON;
  const maxIterations = options.maxIterations ?? 200;
  let a = lower;
  let b = upper;
  let fa = fn(a);
  let fb = fn(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (!(fa * fb < 0)) return NaN;
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iteration = 0; iteration < maxIterations; iteration += 1) {
    if (Math.abs(fc) < Math.abs(fb)) {
      // Keep b the best estimate so far.
      a = b; b = c; c = a;
      fa = fb; fb = fc; fc = fa;
    }
    const tolerance = 2 * relativeTolerance * Math.abs(b) + 0.5 * absoluteTolerance;
    const halfInterval = 0.5 * (c - b);
    if (Math.abs(halfInterval) <= tolerance || fb === 0) return b;
    if (Math.abs(e) >= tolerance && Math.abs(fa) > Math.abs(fb)) {
      // Try interpolation: secant when only two points are distinct, else inverse quadratic.
      let p: number;
      let q: number;
      const s = fb / fa;
      if (a === c) {
        p = 2 * halfInterval * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * halfInterval * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * halfInterval * q - Math.abs(tolerance * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = halfInterval;
        e = d;
      }
    } else {
      d = halfInterval;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tolerance ? d : halfInterval > 0 ? tolerance : -tolerance;
    fb = fn(b);
    if ((fb > 0 && fc > 0) || (fb < 0 && fc < 0)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
  }
  return b;
}

/**
 * For fn decreasing on [start, Infinity) with fn(start) > 0, the smallest
 * upper = start + step * 2^k (k = 0, 1, ...) with fn(upper) <= 0, and the
 * previous point as lower; null when none is found within maxDoublings.
 * Common practice (outward search, e.g. Press et al., Numerical Recipes,
 * section 9.1 zbrac), restricted to one direction because our functions are
 * monotone.
 */
export function bracketDecreasingRoot(
  fn: (x: number) => number,
  start: number,
  step: number,
  maxDoublings = 200,
): { lower: number; upper: number } | null {
  let lower = start;
  let width = step;
  for (let k = 0; k < maxDoublings; k += 1) {
    const upper = start + width;
    if (fn(upper) <= 0) return { lower, upper };
    lower = upper;
    width *= 2;
  }
  return null;
}
