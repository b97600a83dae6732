/**
 * Gauss–Legendre quadrature rules, computed to full double precision.
 *
 * Arc length has no closed form for quadratics beyond a logarithm and none at all for
 * cubics, so it is integrated numerically. An n-node Gauss–Legendre rule integrates
 * polynomials of degree 2n − 1 exactly and converges geometrically for smooth
 * integrands such as the speed |B′(t)| away from cusps (Gauss 1814; Davis & Rabinowitz
 * 1984, "Methods of Numerical Integration", 2nd ed.). Rather than copying a table
 * of digits, the nodes are computed as the zeros of the Legendre polynomial Pₙ by
 * Newton's method on the three-term recurrence, and the weights by
 * wᵢ = 2 / ((1 − xᵢ²)·Pₙ′(xᵢ)²) (Abramowitz & Stegun 1964, "Handbook of Mathematical
 * Functions", formula 25.4.29).
 */

/** Nodes (ascending, in (−1, 1)) and weights of an n-point rule on [−1, 1]. */
export interface QuadratureRule {
  readonly nodes: readonly number[];
  readonly weights: readonly number[];
}

/**
 * Newton stops once the correction is below this multiple of machine epsilon; the
 * zeros are simple and well separated, so convergence is quadratic and the last step
 * is already at rounding level.
 */
const NODE_CONVERGENCE_EPSILONS = 4;

/** Safety cap on Newton steps per node; from the asymptotic start 4–6 steps suffice. */
const MAX_NEWTON_STEPS_PER_NODE = 100;

/**
 * The n-point Gauss–Legendre rule on [−1, 1] (n ≥ 1).
 *
 * Guarantees: nodes symmetric about 0 and ascending, weights positive and summing to 2,
 * both accurate to a few units in the last place (the initial guesses
 * xᵢ ≈ cos(π(i − ¼)/(n + ½)) are the standard asymptotic estimates, as used in
 * Press et al. 2007, "Numerical Recipes", 3rd ed., §4.6). Throws a RangeError for
 * n < 1 or non-integer n.
 */
export function gaussLegendreRule(n: number): QuadratureRule {
  if (!Number.isInteger(n) || n < 1) throw new RangeError(`Gauss–Legendre needs a positive integer node count, got ${n}`);
  const nodes = new Array<number>(n).fill(0);
  const weights = new Array<number>(n).fill(0);
  const half = Math.floor((n + 1) / 2);
  for (let i = 1; i <= half; i++) {
    let x = Math.cos((Math.PI * (i - 0.25)) / (n + 0.5));
    for (let step = 0; step < MAX_NEWTON_STEPS_PER_NODE; step++) {
      const { value, derivative } = legendreWithDerivative(n, x);
      const correction = value / derivative;
      x -= correction;
      if (Math.abs(correction) <= NODE_CONVERGENCE_EPSILONS * Number.EPSILON) break;
    }
    const { derivative } = legendreWithDerivative(n, x);
    const weight = 2 / ((1 - x * x) * derivative * derivative);
    // i = 1 gives the largest zero; the rule is symmetric, so mirror each zero.
    nodes[n - i] = x;
    nodes[i - 1] = -x;
    weights[n - i] = weight;
    weights[i - 1] = weight;
  }
  if (n % 2 === 1) nodes[(n - 1) / 2] = 0;
  return { nodes, weights };
}

/**
 * Pₙ(x) by the recurrence (k + 1)P_{k+1} = (2k + 1)x·P_k − k·P_{k−1}, and
 * Pₙ′(x) = n(x·Pₙ − Pₙ₋₁)/(x² − 1) (valid for |x| < 1).
 */
function legendreWithDerivative(n: number, x: number): { value: number; derivative: number } {
  let previous = 1;
  let current = x;
  for (let k = 1; k < n; k++) {
    const next = ((2 * k + 1) * x * current - k * previous) / (k + 1);
    previous = current;
    current = next;
  }
  return { value: current, derivative: (n * (x * current - previous)) / (x * x - 1) };
}

/**
 * ∫ₐᵇ f(t) dt by the given rule mapped affinely onto [a, b]. Exact for polynomials of
 * degree ≤ 2n − 1; otherwise the error depends on the smoothness of f.
 */
export function integrateWithRule(f: (t: number) => number, a: number, b: number, rule: QuadratureRule): number {
  const halfWidth = (b - a) / 2;
  const centre = (a + b) / 2;
  let sum = 0;
  for (let i = 0; i < rule.nodes.length; i++) {
    sum += (rule.weights[i] ?? 0) * f(centre + halfWidth * (rule.nodes[i] ?? 0));
  }
  return sum * halfWidth;
}
