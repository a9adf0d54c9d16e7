/**
 * Gauss-Legendre nodes and weights on [-1, 1], computed once per order.
 *
 * ## Method
 * Newton iteration on the Legendre polynomial P_n from the Tricomi initial
 * guess cos(pi (i - 1/4) / (n + 1/2)), with P_n and P_n' from the three-term
 * recurrence; weights 2 / ((1 - x^2) P_n'(x)^2). Accurate to a few ulps for
 * the small orders (<= 64) used here.
 *
 * ## References
 * - Abramowitz, M. & Stegun, I. A. (1964). Handbook of Mathematical
 *   Functions, 25.4.29 (Gauss-Legendre weights).
 * - Press, W. H. et al. (2007). Numerical Recipes, 3rd ed., Cambridge
 *   University Press, section 4.6 (gauleg).
 */
export interface QuadratureRule {
  nodes: Float64Array;
  weights: Float64Array;
}

const cache = new Map<number, QuadratureRule>();

export function gaussLegendreRule(order: number): QuadratureRule {
  const cached = cache.get(order);
  if (cached) return cached;
  const nodes = new Float64Array(order);
  const weights = new Float64Array(order);
  for (let i = 0; i < Math.ceil(order / 2); i += 1) {
    let x = Math.cos((Math.PI * (i + 0.75)) / (order + 0.5));
    let derivative = 0;
    for (let iteration = 0; iteration < 100; iteration += 1) {
      let previous = 1;
      let current = x;
      for (let n = 2; n <= order; n += 1) {
        const next = ((2 * n - 1) * x * current - (n - 1) * previous) / n;
        previous = current;
        current = next;
      }
      derivative = (order * (x * current - previous)) / (x * x - 1);
      const step = current / derivative;
      x -= step;
      if (Math.abs(step) < 1e-16) break;
    }
    const weight = 2 / ((1 - x * x) * derivative * derivative);
    nodes[i] = -x;
    nodes[order - 1 - i] = x;
    weights[i] = weight;
    weights[order - 1 - i] = weight;
  }
  const rule = { nodes, weights };
  cache.set(order, rule);
  return rule;
}

/** Integral of fn over [a, b] by one Gauss-Legendre panel of the given order. */
export function integratePanel(fn: (x: number) => number, a: number, b: number, rule: QuadratureRule): number {
  const half = 0.5 * (b - a);
  const middle = 0.5 * (a + b);
  let sum = 0;
  for (let i = 0; i < rule.nodes.length; i += 1) sum += (rule.weights[i] ?? 0) * fn(middle + half * (rule.nodes[i] ?? 0));
  return sum * half;
}

/**
 * Integral of a non-negative unimodal-ish fn over [lowerLimit, upperLimit]
 * (either may be infinite), by panels of width `width` placed outward from
 * `center` until a panel adds less than `relativeTolerance` of the running
 * total on each side (after at least `minimumPanels` panels per side).
 */
export function integrateOutward(
  fn: (x: number) => number,
  center: number,
  width: number,
  lowerLimit: number,
  upperLimit: number,
  rule: QuadratureRule,
  relativeTolerance = 1e-17,
  minimumPanels = 3,
): number {
  let total = 0;
  for (const direction of [1, -1] as const) {
    for (let panel = 0; panel < 100_000; panel += 1) {
      const near = center + direction * panel * width;
      const far = center + direction * (panel + 1) * width;
      const a = Math.max(lowerLimit, Math.min(near, far));
      const b = Math.min(upperLimit, Math.max(near, far));
      if (a >= b) break;
      const piece = integratePanel(fn, a, b, rule);
      total += piece;
      if (panel + 1 >= minimumPanels && piece <= relativeTolerance * total) break;
    }
  }
  return total;
}
