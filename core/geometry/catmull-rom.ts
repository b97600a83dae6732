/**
 * Catmull–Rom splines through points, converted to cubic Bézier segments.
 *
 * The quickest smooth curve through the points a designer clicks or the tracer finds:
 * it passes through every point and each piece depends only on four neighbours
 * (Catmull & Rom 1974, "A class of local interpolating splines", in Computer Aided
 * Geometric Design, Academic Press). Knot spacing |Pᵢ₊₁ − Pᵢ|^α selects the
 * parameterisation: α = 0 uniform (the classical spline), α = 0.5 centripetal (no
 * cusps or self-intersections within a segment; Yuksel, Schaefer & Keyser 2011,
 * "Parameterization and applications of Catmull–Rom curves", Computer-Aided Design
 * 43(7)), α = 1 chordal. The tangent at Pᵢ is the derivative of the Barry–Goldman
 * pyramid (Barry & Goldman 1988, "A recursive evaluation algorithm for a class of
 * Catmull–Rom splines", SIGGRAPH '88):
 *   C′(tᵢ) = (Pᵢ − Pᵢ₋₁)/Δᵢ₋₁ − (Pᵢ₊₁ − Pᵢ₋₁)/(Δᵢ₋₁ + Δᵢ) + (Pᵢ₊₁ − Pᵢ)/Δᵢ,
 * and the Bézier handles of the segment Pᵢ → Pᵢ₊₁ are Pᵢ + Δᵢ·C′(tᵢ)/3 and
 * Pᵢ₊₁ − Δᵢ·C′(tᵢ₊₁)/3. For α = 0 this reduces to C′(tᵢ) = (Pᵢ₊₁ − Pᵢ₋₁)/2.
 */
import type { Point } from './vector.ts';
import { add, distance, scale, sub } from './vector.ts';
import type { CubicSegment } from './segment.ts';
import { cubic } from './segment.ts';
import { withoutRepeatedPoints } from './point-sequence.ts';

/**
 * A cubic Bézier's end derivative is 3 × its handle (B′(0) = 3(P1 − P0)), so a handle
 * is one third of the end derivative.
 */
const HANDLE_FRACTION = 1 / 3;

/** Knot exponent of the uniform (classical) Catmull–Rom spline. */
export const CATMULL_ROM_UNIFORM = 0;
/** Knot exponent of the centripetal Catmull–Rom spline (Yuksel et al. 2011). */
export const CATMULL_ROM_CENTRIPETAL = 0.5;
/** Knot exponent of the chordal Catmull–Rom spline. */
export const CATMULL_ROM_CHORDAL = 1;

/** Options for `catmullRomToBezier`. */
export interface CatmullRomOptions {
  /** Join the last point back to the first with C¹ continuity; default false. */
  readonly closed?: boolean;
  /** Knot exponent α in [0, 1]: 0 uniform, 0.5 centripetal (default), 1 chordal. */
  readonly alpha?: number;
}

/**
 * Cubic Bézier segments of the Catmull–Rom spline through `points`.
 *
 * Guarantees: segment i starts exactly at the i-th (de-duplicated) point and ends
 * exactly at the next, so the spline interpolates every point; consecutive segments
 * are C¹ in the spline's knot parameter (G¹ geometrically). Open splines have one
 * segment per consecutive pair; their end tangents come from phantom points reflected
 * through the ends, P₋₁ = 2P₀ − P₁ and Pₙ = 2Pₙ₋₁ − Pₙ₋₂ (for α = 0 the end tangent
 * is then P₁ − P₀). Closed splines have one segment per point, the last returning to
 * the first.
 * Limits: consecutive duplicate points are removed first (their knot spacing would be
 * 0); fewer than two distinct points give []. α outside [0, 1] is accepted but has no
 * established meaning.
 */
export function catmullRomToBezier(points: readonly Point[], options: CatmullRomOptions = {}): CubicSegment[] {
  const closed = options.closed ?? false;
  const alpha = options.alpha ?? CATMULL_ROM_CENTRIPETAL;
  const pts = withoutRepeatedPoints(points, closed);
  const n = pts.length;
  if (n < 2) return [];
  const at = (i: number): Point => {
    if (closed) return pts[((i % n) + n) % n] as Point;
    if (i < 0) return sub(scale(pts[0] as Point, 2), pts[1] as Point);
    if (i >= n) return sub(scale(pts[n - 1] as Point, 2), pts[n - 2] as Point);
    return pts[i] as Point;
  };
  const spacing = (a: Point, b: Point): number => distance(a, b) ** alpha;
  const segmentCount = closed ? n : n - 1;
  const segments: CubicSegment[] = [];
  for (let i = 0; i < segmentCount; i++) {
    const p0 = at(i - 1);
    const p1 = at(i);
    const p2 = at(i + 1);
    const p3 = at(i + 2);
    const d0 = spacing(p0, p1);
    const d1 = spacing(p1, p2);
    const d2 = spacing(p2, p3);
    const tangentAtStart = tangent(p0, p1, p2, d0, d1);
    const tangentAtEnd = tangent(p1, p2, p3, d1, d2);
    const handleScale = d1 * HANDLE_FRACTION;
    segments.push(cubic(p1, add(p1, scale(tangentAtStart, handleScale)), sub(p2, scale(tangentAtEnd, handleScale)), p2));
  }
  return segments;
}

/** Barry–Goldman tangent at `current` with knot spacings dBefore, dAfter around it. */
function tangent(before: Point, current: Point, after: Point, dBefore: number, dAfter: number): Point {
  return add(
    sub(scale(sub(current, before), 1 / dBefore), scale(sub(after, before), 1 / (dBefore + dAfter))),
    scale(sub(after, current), 1 / dAfter),
  );
}
