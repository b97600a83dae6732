/**
 * Real roots of polynomials, robust to double roots and tiny leading coefficients.
 *
 * Curve geometry needs real roots of low-degree polynomials in t, usually restricted to
 * [0, 1]: derivative coordinates (extrema), B′ × B″ (inflections) and the degree-5
 * (B − P)·B′ (nearest point). Quadratics use the cancellation-free closed form
 * (Forsythe 1967, "How do you solve a quadratic equation?", Stanford CS report 40;
 * Higham 2002, "Accuracy and Stability of Numerical Algorithms", §1.8). Higher degrees
 * use the critical-point method of Yuksel 2022 ("High-Performance Polynomial Root
 * Finding for Graphics", Proc. ACM Comput. Graph. Interact. Tech. 5(3)): the roots of p′
 * split the interval into pieces on which p is monotone, so each piece holds at most
 * one root, which is then found by Newton's method safeguarded by bisection
 * (Press et al. 2007, "Numerical Recipes", 3rd ed., §9.4). This never loses a root
 * because of a poor starting guess, and reports a double root once.
 */
import type { Polynomial } from './polynomial.ts';
import {
  derivativeOfPolynomial,
  evaluatePolynomial,
  polynomialEvaluationErrorBound,
  trimPolynomial,
} from './polynomial.ts';

/**
 * Relative size below which a quadratic's discriminant b² − 4ac is treated as zero.
 * Computing b² and 4ac commits one rounding each (relative error ≤ ε/2) and the
 * coefficients themselves usually carry one rounding from whatever produced them;
 * 4ε·(b² + |4ac|) covers these with a small margin, so a mathematically double root
 * is reported as one root instead of two near-equal roots or none.
 */
const DISCRIMINANT_ROUNDING_TOLERANCE = 4 * Number.EPSILON;

/**
 * Cap on safeguarded-Newton iterations. Every iteration at least halves the bracket
 * when Newton misbehaves, and 1100 halvings span the whole binary64 exponent range
 * (2¹⁰²⁴ down to 2⁻¹⁰⁷⁴), so the cap is never the reason a finite bracket stops
 * shrinking; it only guarantees termination.
 */
const MAX_REFINEMENT_ITERATIONS = 1100;

/**
 * Coefficient magnitudes outside [2⁻⁴⁰⁰, 2⁴⁰⁰] are rescaled before forming b² − 4ac,
 * whose terms would otherwise overflow or underflow (binary64 spans about 2^±1022);
 * inside this range no rescaling happens, so ordinary inputs are not perturbed.
 */
const SAFE_COEFFICIENT_EXPONENT = 400;
/** Largest power-of-two exponent whose scale factor 2^±e is itself a normal binary64. */
const MAX_SCALE_EXPONENT = 1022;

/**
 * Real roots of a·x + b = 0. Returns [] when a = 0 (no root, or every x when b = 0 too:
 * an identically-zero equation has no isolated roots).
 */
export function solveLinear(a: number, b: number): number[] {
  return a === 0 ? [] : [-b / a];
}

/**
 * Distinct real roots of a·x² + b·x + c = 0, ascending.
 *
 * Guarantees: no cancellation between b and √(b² − 4ac) (the smaller root is computed
 * as c/q); a discriminant within rounding of zero yields one double root; a = 0 falls
 * back to the linear equation; coefficients of extreme magnitude are rescaled by an
 * exact power of two so that b² cannot overflow or underflow. A tiny but non-zero a still yields its (huge) second root accurately.
 * Limit: complex roots are not reported.
 */
export function solveQuadratic(a: number, b: number, c: number): number[] {
  if (a === 0) return solveLinear(b, c);
  // Exact power-of-two rescaling, only when b² or 4ac could overflow or underflow.
  const exponent = Math.round(Math.log2(Math.max(Math.abs(a), Math.abs(b), Math.abs(c))));
  const factor =
    Math.abs(exponent) > SAFE_COEFFICIENT_EXPONENT
      ? 2 ** -Math.max(-MAX_SCALE_EXPONENT, Math.min(MAX_SCALE_EXPONENT, exponent))
      : 1;
  const A = a * factor;
  const B = b * factor;
  const C = c * factor;
  const discriminant = B * B - 4 * A * C;
  const tolerance = DISCRIMINANT_ROUNDING_TOLERANCE * (B * B + Math.abs(4 * A * C));
  if (discriminant < -tolerance) return [];
  if (discriminant <= tolerance) return [-B / (2 * A)];
  const q = -0.5 * (B + (B >= 0 ? 1 : -1) * Math.sqrt(discriminant));
  const r1 = q / A;
  const r2 = C / q;
  return r1 < r2 ? [r1, r2] : [r2, r1];
}

/**
 * Distinct real roots of a·x³ + b·x² + c·x + d = 0, ascending, each refined to about
 * full double precision (multiple roots to the accuracy their conditioning allows,
 * roughly √ε for double and ∛ε for triple roots). a = 0 falls back to the quadratic.
 */
export function solveCubic(a: number, b: number, c: number, d: number): number[] {
  if (a === 0) return solveQuadratic(b, c, d);
  return realRoots([d, c, b, a]);
}

/**
 * Distinct real roots of p anywhere on the real line, ascending.
 *
 * Uses Cauchy's bound |x| < 1 + maxᵢ|pᵢ/pₙ| (Cauchy 1829) to bracket all roots, then
 * `realRootsInInterval`. Limit: a leading coefficient so small that the bound
 * overflows is treated as zero (the polynomial is taken to be of lower degree), and
 * the zero polynomial and non-zero constants return [].
 */
export function realRoots(p: Polynomial): number[] {
  let q = trimPolynomial(p);
  for (;;) {
    const degree = q.length - 1;
    if (degree <= 0) return [];
    if (degree === 1) return solveLinear(q[1] ?? 0, q[0] ?? 0);
    if (degree === 2) return solveQuadratic(q[2] ?? 0, q[1] ?? 0, q[0] ?? 0);
    const leading = Math.abs(q[degree] ?? 0);
    let ratio = 0;
    for (let i = 0; i < degree; i++) ratio = Math.max(ratio, Math.abs(q[i] ?? 0) / leading);
    const bound = 1 + ratio;
    if (Number.isFinite(bound)) return realRootsInInterval(q, -bound, bound);
    q = trimPolynomial(q.slice(0, degree));
  }
}

/**
 * Distinct real roots of p in the closed interval [lo, hi], ascending.
 *
 * Guarantees every root whose sign change (or touch of zero at a critical point) is
 * resolvable in double precision is reported, however close to its neighbours; a root
 * at a critical point (double root) is reported once. A value within the Horner
 * rounding bound of zero counts as zero. Limits: the zero polynomial and constants
 * return []; a root lying within rounding of lo or hi may be reported at lo or hi
 * itself or, for degree ≤ 2, just outside the interval and hence dropped.
 */
export function realRootsInInterval(p: Polynomial, lo: number, hi: number): number[] {
  // Written with loops and module-level helpers rather than closures: this runs in the
  // fitter's innermost loops (nearest points, extrema), where a closure per call costs
  // more than the arithmetic.
  if (!(lo <= hi)) return [];
  const q = trimPolynomial(p);
  const degree = q.length - 1;
  if (degree <= 0) return [];
  if (degree === 1) return within(solveLinear(q[1] ?? 0, q[0] ?? 0), lo, hi);
  if (degree === 2) return within(solveQuadratic(q[2] ?? 0, q[1] ?? 0, q[0] ?? 0), lo, hi);

  const dq = derivativeOfPolynomial(q);
  const critical = realRootsInInterval(dq, lo, hi);
  const breakpoints = [lo];
  for (const x of critical) if (x > lo && x < hi) breakpoints.push(x);
  breakpoints.push(hi);
  const count = breakpoints.length;
  const values = new Array<number>(count);
  const isZero = new Array<boolean>(count);
  const roots: number[] = [];
  for (let i = 0; i < count; i++) {
    const x = breakpoints[i]!;
    values[i] = evaluatePolynomial(q, x);
    isZero[i] = Math.abs(values[i]!) <= polynomialEvaluationErrorBound(q, x);
    if (isZero[i]) roots.push(x);
  }
  for (let i = 0; i + 1 < count; i++) {
    if (isZero[i] || isZero[i + 1] || Math.sign(values[i]!) === Math.sign(values[i + 1]!)) continue;
    roots.push(refineRoot(evaluatePolynomial, q, dq, breakpoints[i]!, breakpoints[i + 1]!));
  }
  roots.sort(ascending);
  const distinct: number[] = [];
  for (let i = 0; i < roots.length; i++) if (i === 0 || roots[i] !== roots[i - 1]) distinct.push(roots[i]!);
  return distinct;
}

function ascending(x: number, y: number): number {
  return x - y;
}

/** The values of xs inside [lo, hi], in order. */
function within(xs: readonly number[], lo: number, hi: number): number[] {
  const kept: number[] = [];
  for (const x of xs) if (x >= lo && x <= hi) kept.push(x);
  return kept;
}

/**
 * Roots of p in [0, 1] (`'closed'`, the default) or in (0, 1) (`'open'`), ascending.
 * Same guarantees and limits as `realRootsInInterval`.
 */
export function rootsInUnitInterval(p: Polynomial, endpoints: 'closed' | 'open' = 'closed'): number[] {
  const roots = realRootsInInterval(p, 0, 1);
  return endpoints === 'closed' ? roots : roots.filter((t) => t > 0 && t < 1);
}

/**
 * A root of f in [lo, hi], given that f(lo) and f(hi) have opposite signs (or one is
 * zero), by Newton's method safeguarded by bisection (Press et al. 2007, "Numerical
 * Recipes", 3rd ed., §9.4, routine rtsafe).
 *
 * Guarantees: the result stays inside the bracket and the bracket shrinks on every
 * iteration in which Newton is not converging quickly, so the result is accurate to
 * about one unit in the last place for a simple root, whatever f′ does. Throws a
 * RangeError when the end values do not bracket a sign change.
 */
export function refineBracketedRoot(
  f: (x: number) => number,
  fPrime: (x: number) => number,
  lo: number,
  hi: number,
): number {
  return refineRoot(callAt, f, fPrime, lo, hi);
}

function callAt(fn: (x: number) => number, x: number): number {
  return fn(x);
}

/**
 * refineBracketedRoot for a function given as data (`fn`, `dfn`) and an evaluator, so
 * that polynomials are refined without a closure per call.
 */
function refineRoot<F>(evaluate: (fn: F, x: number) => number, fn: F, dfn: F, lo: number, hi: number): number {
  let a = Math.min(lo, hi);
  let b = Math.max(lo, hi);
  let fa = evaluate(fn, a);
  let fb = evaluate(fn, b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (Math.sign(fa) === Math.sign(fb)) {
    throw new RangeError(`refineBracketedRoot: f(${a}) and f(${b}) do not bracket a root`);
  }
  let x = a + (b - a) / 2;
  let previousStep = b - a;
  for (let iteration = 0; iteration < MAX_REFINEMENT_ITERATIONS; iteration++) {
    const fx = evaluate(fn, x);
    if (fx === 0) return x;
    if (Math.sign(fx) === Math.sign(fa)) {
      a = x;
      fa = fx;
    } else {
      b = x;
      fb = fx;
    }
    const mid = a + (b - a) / 2;
    if (mid <= a || mid >= b) break; // a and b are adjacent doubles
    const newton = x - fx / evaluate(dfn, x);
    const newtonIsUseful =
      Number.isFinite(newton) && newton > a && newton < b && Math.abs(newton - x) <= previousStep / 2;
    const next = newtonIsUseful ? newton : mid;
    previousStep = Math.abs(next - x);
    if (next === x) break;
    x = next;
  }
  // Return whichever of the last iterate and the bracket ends has the smallest residual.
  const fx = evaluate(fn, x);
  let best = x;
  let bestResidual = Math.abs(fx);
  if (Math.abs(fa) < bestResidual) {
    best = a;
    bestResidual = Math.abs(fa);
  }
  if (Math.abs(fb) < bestResidual) best = b;
  return best;
}
