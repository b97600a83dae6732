/**
 * The point of a segment nearest to a given point.
 *
 * Used for hit testing and dragging in the editor and for measuring fitting error
 * against traced pixels. At an interior minimum of |B(t) − P|² the derivative
 * 2(B(t) − P)·B′(t) vanishes; for a cubic that is a degree-5 polynomial (Schneider
 * 1990, "Solving the nearest-point-on-curve problem", Graphics Gems, Academic Press).
 * All its real roots in [0, 1] are found with the critical-point root finder (see
 * polynomial-roots.ts), so every local minimum is a candidate, however many there are;
 * the end points are candidates too, and the closest candidate wins.
 */
import type { Point } from './vector.ts';
import { squaredDistance } from './vector.ts';
import type { Segment } from './segment.ts';
import { evaluate } from './segment.ts';
import { powerBasisOf } from './power-basis.ts';
import { addPolynomials, derivativeOfPolynomial, multiplyPolynomials } from './polynomial.ts';
import { rootsInUnitInterval } from './polynomial-roots.ts';

/** The result of a nearest-point query on one segment. */
export interface NearestPoint {
  /** Parameter of the nearest point, in [0, 1]. */
  readonly t: number;
  /** The nearest point itself, `evaluate(segment, t)`. */
  readonly point: Point;
  /** Euclidean distance from the query point. */
  readonly distance: number;
}

/** The result of a nearest-point query on a list of segments. */
export interface NearestPointOnSegments extends NearestPoint {
  /** Index of the segment that holds the nearest point. */
  readonly segmentIndex: number;
}

/**
 * The point of `segment` closest to `query`.
 *
 * Guarantees: the global minimum over t ∈ [0, 1] (not merely a local one), accurate
 * to the rounding of the root refinement; on ties the smallest t wins. Works for
 * degenerate segments (coincident control points, zero-length segments).
 */
export function nearestPoint(segment: Segment, query: Point): NearestPoint {
  // (B − P)·B′ as a polynomial, with coordinates relative to the query point.
  const { x, y } = powerBasisOf(segment, query);
  const stationary = addPolynomials(
    multiplyPolynomials(x, derivativeOfPolynomial(x)),
    multiplyPolynomials(y, derivativeOfPolynomial(y)),
  );
  const candidates = [0, ...rootsInUnitInterval(stationary), 1];
  let bestT = 0;
  let bestPoint = evaluate(segment, 0);
  let bestSquared = squaredDistance(bestPoint, query);
  for (const t of candidates) {
    const p = evaluate(segment, t);
    const d = squaredDistance(p, query);
    if (d < bestSquared) {
      bestT = t;
      bestPoint = p;
      bestSquared = d;
    }
  }
  return { t: bestT, point: bestPoint, distance: Math.sqrt(bestSquared) };
}

/**
 * The point closest to `query` over all `segments`, with the index of its segment, or
 * `undefined` for an empty list. On ties the earliest segment wins.
 */
export function nearestPointOnSegments(segments: readonly Segment[], query: Point): NearestPointOnSegments | undefined {
  let best: NearestPointOnSegments | undefined;
  segments.forEach((segment, segmentIndex) => {
    const candidate = nearestPoint(segment, query);
    if (best === undefined || candidate.distance < best.distance) best = { ...candidate, segmentIndex };
  });
  return best;
}
