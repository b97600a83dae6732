/**
 * Exact degree elevation of lines and quadratics to cubics.
 *
 * The font pipeline stores every outline as cubics only, so straight pieces and
 * quadratic pieces produced by fitting must become cubics without changing the curve.
 * Degree elevation (Forrest 1972, "Interactive interpolation and approximation by
 * Bézier polynomials", The Computer Journal 15(1); Farin 2002, "Curves and Surfaces
 * for CAGD", 5th ed.) gives a cubic with the same point at every t, not merely
 * the same shape, so parameter-based data (split positions, comb samples) carry over.
 */
import type { CubicSegment, LineSegment, QuadSegment, Segment } from './segment.ts';
import { cubic } from './segment.ts';
import { lerp } from './vector.ts';

/** Where the inner control points of an elevated line sit along it (1/3 and 2/3). */
const ONE_THIRD = 1 / 3;
const TWO_THIRDS = 2 / 3;

/**
 * The cubic equal to the line at every t: controls at 1/3 and 2/3 of the way along.
 * End points are the input's own objects; inner points exact up to one rounding.
 */
export function lineToCubic(segment: LineSegment): CubicSegment {
  return cubic(segment.p0, lerp(segment.p0, segment.p1, ONE_THIRD), lerp(segment.p0, segment.p1, TWO_THIRDS), segment.p1);
}

/**
 * The cubic equal to the quadratic at every t: c1 = p0 + ⅔(p1 − p0),
 * c2 = p2 + ⅔(p1 − p2). End points are the input's own objects.
 */
export function quadToCubic(segment: QuadSegment): CubicSegment {
  return cubic(
    segment.p0,
    lerp(segment.p0, segment.p1, TWO_THIRDS),
    lerp(segment.p2, segment.p1, TWO_THIRDS),
    segment.p2,
  );
}

/** Any segment as an equal cubic (cubics are returned unchanged, the same object). */
export function toCubic(segment: Segment): CubicSegment {
  switch (segment.kind) {
    case 'line':
      return lineToCubic(segment);
    case 'quad':
      return quadToCubic(segment);
    case 'cubic':
      return segment;
  }
}
