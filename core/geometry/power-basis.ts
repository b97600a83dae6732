/**
 * Conversion of a segment from Bernstein (control point) form to power-basis
 * polynomials x(t), y(t).
 *
 * Questions answered by solving polynomial equations in t (extrema, inflections,
 * nearest points) need the coefficients of tⁱ explicitly. The conversion is the
 * standard change of basis (Farin 2002, "Curves and Surfaces for CAGD", 5th ed.);
 * for degree ≤ 3 on t ∈ [0, 1] it is well conditioned.
 */
import type { Point } from './vector.ts';
import type { Polynomial } from './polynomial.ts';
import type { Segment } from './segment.ts';

/** A segment's coordinates as power-basis polynomials in t (ascending powers). */
export interface PowerBasisCurve {
  readonly x: Polynomial;
  readonly y: Polynomial;
}

/**
 * x(t) and y(t) of the segment as power-basis polynomials, optionally measured from
 * `origin` (i.e. the polynomials of B(t) − origin). Subtracting the origin before the
 * change of basis avoids cancellation when the curve is far from the origin but the
 * question is local. The polynomial has the nominal degree of the kind (1, 2 or 3),
 * with possibly zero leading coefficients.
 */
export function powerBasisOf(segment: Segment, origin: Point = { x: 0, y: 0 }): PowerBasisCurve {
  // Module-level pickers rather than closures: nearest-point queries call this in the
  // fitter's innermost loops.
  return { x: coordinatePolynomial(segment, origin, pickX), y: coordinatePolynomial(segment, origin, pickY) };
}

function pickX(p: Point): number {
  return p.x;
}

function pickY(p: Point): number {
  return p.y;
}

/** One coordinate of the segment, measured from the origin's, as a power-basis polynomial. */
function coordinatePolynomial(segment: Segment, origin: Point, pick: (p: Point) => number): Polynomial {
  const o = pick(origin);
  switch (segment.kind) {
    case 'line': {
      const a = pick(segment.p0) - o;
      const b = pick(segment.p1) - o;
      return [a, b - a];
    }
    case 'quad': {
      const a = pick(segment.p0) - o;
      const b = pick(segment.p1) - o;
      const c = pick(segment.p2) - o;
      return [a, 2 * (b - a), a - 2 * b + c];
    }
    case 'cubic': {
      const a = pick(segment.p0) - o;
      const b = pick(segment.p1) - o;
      const c = pick(segment.p2) - o;
      const d = pick(segment.p3) - o;
      return [a, 3 * (b - a), 3 * (a - 2 * b + c), d - a + 3 * (b - c)];
    }
  }
}
