/**
 * Uniform cubic B-spline control polygons converted to cubic Bézier segments.
 *
 * B-spline control polygons give designers C²-smooth outlines that respond locally to
 * edits; the font stores cubic Béziers, so each span is converted. For uniform knots
 * the conversion is the "thirds and halves" construction (Böhm 1981,
 * "Generating the Bézier points of B-spline curves and surfaces", Computer-Aided
 * Design 13(6); Farin 2002, "Curves and Surfaces for CAGD", 5th ed.; Bartels, Beatty &
 * Barsky 1987, "An Introduction to Splines for Use in Computer Graphics and Geometric
 * Modeling"): each control leg DᵢDᵢ₊₁ is cut at its thirds, which become the inner
 * Bézier handles, and each junction point is the midpoint of the two thirds-points
 * adjacent to a control point, i.e. (Dᵢ₋₁ + 4Dᵢ + Dᵢ₊₁)/6.
 *
 * Open-end treatment (`ends`):
 * - 'clamped' (default): phantom control points D₋₁ = 2D₀ − D₁ and Dₙ = 2Dₙ₋₁ − Dₙ₋₂
 *   are added (Barsky 1982, "End conditions and boundary conditions for uniform
 *   B-spline curve and surface representations", Computers in Industry 3). With
 *   uniform knots throughout, the curve then starts exactly at D₀ and ends at Dₙ₋₁,
 *   is tangent to the first and last control legs there, and has zero curvature at
 *   both ends; it stays C² everywhere. (This differs from the non-uniform knot
 *   vector with quadruple end knots, which also interpolates the end points but has
 *   non-zero end curvature.)
 * - 'floating': the plain uniform spline, which starts at (D₀ + 4D₁ + D₂)/6 and ends
 *   at (Dₙ₋₃ + 4Dₙ₋₂ + Dₙ₋₁)/6, as drawn by the basis functions alone.
 */
import type { Point } from './vector.ts';
import { lerp, midpoint, scale, sub } from './vector.ts';
import type { CubicSegment } from './segment.ts';
import { cubic } from './segment.ts';

/** Where a leg is cut: its first and second third. */
const ONE_THIRD = 1 / 3;
const TWO_THIRDS = 2 / 3;

/** Options for `uniformBSplineToBezier`. */
export interface UniformBSplineOptions {
  /** Treat the control polygon as periodic (closed curve); default false. */
  readonly closed?: boolean;
  /** End treatment of open splines; default 'clamped'. Ignored when closed. */
  readonly ends?: 'clamped' | 'floating';
}

/**
 * Cubic Bézier segments of the uniform cubic B-spline with the given control polygon.
 *
 * Guarantees: the curve is identical to the B-spline evaluated from its basis
 * functions (up to rounding), consecutive segments share junction points exactly and
 * join with C² continuity, and a closed spline is C² across the wrap as well.
 * Segment counts: closed n (needs n ≥ 3); open 'clamped' n − 1 (needs n ≥ 2);
 * open 'floating' n − 3 (needs n ≥ 4). Fewer control points give [].
 */
export function uniformBSplineToBezier(
  controlPolygon: readonly Point[],
  options: UniformBSplineOptions = {},
): CubicSegment[] {
  const n = controlPolygon.length;
  if (options.closed ?? false) {
    if (n < 3) return [];
    const wrapped = [controlPolygon[n - 1] as Point, ...controlPolygon, controlPolygon[0] as Point, controlPolygon[1] as Point];
    return floatingSpans(wrapped);
  }
  if ((options.ends ?? 'clamped') === 'floating') return n < 4 ? [] : floatingSpans(controlPolygon);
  if (n < 2) return [];
  const first = controlPolygon[0] as Point;
  const second = controlPolygon[1] as Point;
  const last = controlPolygon[n - 1] as Point;
  const beforeLast = controlPolygon[n - 2] as Point;
  const extended = [sub(scale(first, 2), second), ...controlPolygon, sub(scale(last, 2), beforeLast)];
  const spans = floatingSpans(extended);
  // The construction yields D₀ and Dₙ₋₁ up to rounding; use them exactly.
  const head = spans[0] as CubicSegment;
  const tail = spans[spans.length - 1] as CubicSegment;
  spans[0] = cubic(first, head.p1, head.p2, spans.length === 1 ? last : head.p3);
  if (spans.length > 1) spans[spans.length - 1] = cubic(tail.p0, tail.p1, tail.p2, last);
  return spans;
}

/** Thirds and halves over the open uniform polygon D₀…D_{m−1}: m − 3 spans. */
function floatingSpans(polygon: readonly Point[]): CubicSegment[] {
  const legs = polygon.length - 1;
  const nearThird: Point[] = []; // point one third along leg i (near its start)
  const farThird: Point[] = []; // point two thirds along leg i (near its end)
  for (let i = 0; i < legs; i++) {
    nearThird.push(lerp(polygon[i] as Point, polygon[i + 1] as Point, ONE_THIRD));
    farThird.push(lerp(polygon[i] as Point, polygon[i + 1] as Point, TWO_THIRDS));
  }
  // Junction at control point j (1 ≤ j ≤ m − 2): midpoint of the thirds around it.
  const junction = (j: number): Point => midpoint(farThird[j - 1] as Point, nearThird[j] as Point);
  const spans: CubicSegment[] = [];
  for (let i = 1; i + 1 < legs; i++) {
    spans.push(cubic(junction(i), nearThird[i] as Point, farThird[i] as Point, junction(i + 1)));
  }
  return spans;
}
