/**
 * Real polynomials in the power (monomial) basis: evaluation, arithmetic, derivative.
 *
 * Several curve questions reduce to polynomials in the segment parameter t: extrema
 * (roots of a derivative coordinate), inflections (roots of B′ × B″), nearest points
 * (roots of (B − P)·B′). This module holds the small algebra those reductions need; the
 * root finding lives in polynomial-roots.ts.
 *
 * Representation: coefficients in ascending powers, p[i] multiplies xⁱ, so
 * [c0, c1, c2] is c0 + c1·x + c2·x². The empty array is the zero polynomial.
 */

/** Coefficients in ascending powers of x: p[i] is the coefficient of xⁱ. */
export type Polynomial = readonly number[];

/** Unit roundoff of IEEE-754 binary64 (half the machine epsilon), Higham 2002 §2.1. */
const UNIT_ROUNDOFF = Number.EPSILON / 2;

/**
 * p(x) by Horner's rule (Horner 1819). Returns 0 for the zero polynomial.
 */
export function evaluatePolynomial(p: Polynomial, x: number): number {
  let value = 0;
  for (let i = p.length - 1; i >= 0; i--) value = value * x + (p[i] ?? 0);
  return value;
}

/**
 * An upper bound on the rounding error of `evaluatePolynomial(p, x)`:
 * γ₂ₙ·Σ|pᵢ|·|x|ⁱ with γₖ = k·u/(1 − k·u), u the unit roundoff and n the degree
 * (Higham 2002, "Accuracy and Stability of Numerical Algorithms", 2nd ed., §5.1).
 * A computed value whose magnitude is at most this bound is indistinguishable from zero.
 */
export function polynomialEvaluationErrorBound(p: Polynomial, x: number): number {
  const degree = Math.max(p.length - 1, 1);
  const k = 2 * degree;
  const gamma = (k * UNIT_ROUNDOFF) / (1 - k * UNIT_ROUNDOFF);
  const ax = Math.abs(x);
  let magnitude = 0;
  for (let i = p.length - 1; i >= 0; i--) magnitude = magnitude * ax + Math.abs(p[i] ?? 0);
  return gamma * magnitude;
}

/** The derivative p′. The derivative of a constant is the zero polynomial []. */
export function derivativeOfPolynomial(p: Polynomial): Polynomial {
  const result: number[] = [];
  for (let i = 1; i < p.length; i++) result.push(i * (p[i] ?? 0));
  return result;
}

/** p + q, with length max(len p, len q) (not trimmed). */
export function addPolynomials(p: Polynomial, q: Polynomial): Polynomial {
  const n = Math.max(p.length, q.length);
  const result: number[] = [];
  for (let i = 0; i < n; i++) result.push((p[i] ?? 0) + (q[i] ?? 0));
  return result;
}

/** p − q, with length max(len p, len q) (not trimmed). */
export function subtractPolynomials(p: Polynomial, q: Polynomial): Polynomial {
  const n = Math.max(p.length, q.length);
  const result: number[] = [];
  for (let i = 0; i < n; i++) result.push((p[i] ?? 0) - (q[i] ?? 0));
  return result;
}

/** p·factor. */
export function scalePolynomial(p: Polynomial, factor: number): Polynomial {
  return p.map((c) => c * factor);
}

/** p·q by direct convolution; degree deg p + deg q (the zero polynomial if either is). */
export function multiplyPolynomials(p: Polynomial, q: Polynomial): Polynomial {
  if (p.length === 0 || q.length === 0) return [];
  const result = new Array<number>(p.length + q.length - 1).fill(0);
  for (let i = 0; i < p.length; i++) {
    for (let j = 0; j < q.length; j++) {
      result[i + j] = (result[i + j] ?? 0) + (p[i] ?? 0) * (q[j] ?? 0);
    }
  }
  return result;
}

/**
 * p without trailing (highest-power) coefficients that are exactly zero, so that
 * `p.length − 1` is the true degree. The zero polynomial becomes [].
 */
export function trimPolynomial(p: Polynomial): Polynomial {
  let n = p.length;
  while (n > 0 && p[n - 1] === 0) n--;
  return p.slice(0, n);
}
