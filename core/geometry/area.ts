/**
 * Signed area enclosed by a closed contour of segments, in closed form.
 *
 * The font needs contour orientation (outer contours and counters must wind in
 * opposite directions) and the tracer compares areas to reject specks. By Green's
 * theorem (Green 1828, "An Essay on the Application of Mathematical Analysis to the
 * Theories of Electricity and Magnetism") the enclosed area is the boundary integral
 * A = ½∮(x dy − y dx), and for polynomial segments each piece of that integral is an
 * exact rational combination of the control points; no quadrature is involved.
 *
 * Sign convention: positive for a counter-clockwise contour in a y-up frame (font
 * units), negative for clockwise. In a y-down frame (image pixels) the same numbers
 * describe the mirrored picture, so there positive means clockwise on screen.
 */
import type { Point } from './vector.ts';
import type { Segment } from './segment.ts';

/** Coefficients of ½∫(x dy − y dx) for a cubic, derived by integrating the Bernstein forms; all over 20. */
const CUBIC_AREA_DENOMINATOR = 20;
/** Same for a quadratic; all over 6. */
const QUAD_AREA_DENOMINATOR = 6;
/** Same for a line: the shoelace term ½(x0·y1 − x1·y0). */
const LINE_AREA_DENOMINATOR = 2;

const relative = (p: Point, o: Point): Point => ({ x: p.x - o.x, y: p.y - o.y });

/**
 * The segment's contribution ½∫₀¹(x·y′ − y·x′) dt to the area of a contour it belongs
 * to, with coordinates measured from `origin`. Exact up to rounding of the closed form:
 *
 * - line:  (x0·y1 − x1·y0) / 2
 * - quad:  [x0(2y1 + y2) + x1(2y2 − 2y0) − x2(y0 + 2y1)] / 6
 * - cubic: [x0(6y1 + 3y2 + y3) + x1(−6y0 + 3y2 + 3y3) + x2(−3y0 − 3y1 + 6y3)
 *           − x3(y0 + 3y1 + 6y2)] / 20
 *
 * Only sums over closed contours are meaningful as areas; a single term depends on
 * the origin.
 */
export function segmentAreaTerm(segment: Segment, origin: Point = { x: 0, y: 0 }): number {
  switch (segment.kind) {
    case 'line': {
      const a = relative(segment.p0, origin);
      const b = relative(segment.p1, origin);
      return (a.x * b.y - b.x * a.y) / LINE_AREA_DENOMINATOR;
    }
    case 'quad': {
      const a = relative(segment.p0, origin);
      const b = relative(segment.p1, origin);
      const c = relative(segment.p2, origin);
      return (a.x * (2 * b.y + c.y) + b.x * (2 * c.y - 2 * a.y) - c.x * (a.y + 2 * b.y)) / QUAD_AREA_DENOMINATOR;
    }
    case 'cubic': {
      const a = relative(segment.p0, origin);
      const b = relative(segment.p1, origin);
      const c = relative(segment.p2, origin);
      const d = relative(segment.p3, origin);
      return (
        (a.x * (6 * b.y + 3 * c.y + d.y) +
          b.x * (-6 * a.y + 3 * c.y + 3 * d.y) +
          c.x * (-3 * a.y - 3 * b.y + 6 * d.y) -
          d.x * (a.y + 3 * b.y + 6 * c.y)) /
        CUBIC_AREA_DENOMINATOR
      );
    }
  }
}

/**
 * Signed area enclosed by the contour: positive counter-clockwise in a y-up frame.
 *
 * Guarantees: reversing the contour exactly negates the result up to rounding;
 * translation does not change it (coordinates are taken relative to the first point,
 * which also avoids cancellation far from the origin). If the last segment does not
 * end where the first begins, the straight closing chord is included, so the result
 * is the area of the implicitly closed contour. Self-intersecting contours give the
 * winding-number-weighted area (lobes of opposite winding cancel). An empty contour
 * has area 0.
 */
export function signedArea(contour: readonly Segment[]): number {
  const first = contour[0];
  if (first === undefined) return 0;
  // Coordinates are taken relative to the first point. The straight closing chord from
  // the last end point E back to that point then contributes ½(E − O) × (O − O) = 0,
  // so an open contour is implicitly closed without an extra term.
  const origin = first.p0;
  let sum = 0;
  for (const segment of contour) sum += segmentAreaTerm(segment, origin);
  return sum;
}

/** The unsigned area |signedArea(contour)|. */
export function absoluteArea(contour: readonly Segment[]): number {
  return Math.abs(signedArea(contour));
}

/** 'counter-clockwise' when signedArea > 0 (y-up), 'clockwise' when < 0, 'degenerate' when 0. */
export function orientation(contour: readonly Segment[]): 'counter-clockwise' | 'clockwise' | 'degenerate' {
  const area = signedArea(contour);
  return area > 0 ? 'counter-clockwise' : area < 0 ? 'clockwise' : 'degenerate';
}
