/**
 * Axis-aligned bounding boxes: the tight box of a segment and of a list of segments.
 *
 * Used for glyph metrics (ink extents), hit testing and viewport fitting. "Tight" means
 * the box of the curve itself, not of its control polygon: it is spanned by the end
 * points and the points at the x/y extremum parameters.
 */
import type { Point } from './vector.ts';
import type { Segment } from './segment.ts';
import { controlPoints, endPoint, evaluate } from './segment.ts';
import { extremaParameters } from './extrema.ts';

/** An axis-aligned box, min ≤ max in both coordinates. */
export interface BoundingBox {
  readonly minX: number;
  readonly minY: number;
  readonly maxX: number;
  readonly maxY: number;
}

/** The smallest box containing both boxes. */
export function unionOfBoxes(a: BoundingBox, b: BoundingBox): BoundingBox {
  return {
    minX: Math.min(a.minX, b.minX),
    minY: Math.min(a.minY, b.minY),
    maxX: Math.max(a.maxX, b.maxX),
    maxY: Math.max(a.maxY, b.maxY),
  };
}

/** True when p lies in the box enlarged by `tolerance` on every side. */
export function boxContains(box: BoundingBox, p: Point, tolerance = 0): boolean {
  return (
    p.x >= box.minX - tolerance && p.x <= box.maxX + tolerance && p.y >= box.minY - tolerance && p.y <= box.maxY + tolerance
  );
}

/**
 * The tight axis-aligned box of the segment.
 *
 * Guarantees: contains both end points exactly, and every curve point up to the
 * rounding of evaluation at the extremum parameters (a few units in the last place);
 * no larger than the control-polygon box.
 */
export function segmentBounds(segment: Segment): BoundingBox {
  const start = segment.p0;
  const end = endPoint(segment);
  let minX = Math.min(start.x, end.x);
  let maxX = Math.max(start.x, end.x);
  let minY = Math.min(start.y, end.y);
  let maxY = Math.max(start.y, end.y);
  const { x, y } = extremaParameters(segment);
  for (const t of x) {
    const px = evaluate(segment, t).x;
    minX = Math.min(minX, px);
    maxX = Math.max(maxX, px);
  }
  for (const t of y) {
    const py = evaluate(segment, t).y;
    minY = Math.min(minY, py);
    maxY = Math.max(maxY, py);
  }
  return { minX, minY, maxX, maxY };
}

/**
 * The box of the segment's control points. Always contains the curve (convex hull
 * property of Bézier curves), but is usually looser than `segmentBounds`.
 */
export function controlPolygonBounds(segment: Segment): BoundingBox {
  const points = controlPoints(segment);
  return {
    minX: Math.min(...points.map((p) => p.x)),
    minY: Math.min(...points.map((p) => p.y)),
    maxX: Math.max(...points.map((p) => p.x)),
    maxY: Math.max(...points.map((p) => p.y)),
  };
}

/**
 * The tight box of all segments (e.g. of a glyph's contours), or `undefined` for an
 * empty list, which has no extent.
 */
export function boundsOfSegments(segments: readonly Segment[]): BoundingBox | undefined {
  let box: BoundingBox | undefined;
  for (const segment of segments) {
    const b = segmentBounds(segment);
    box = box === undefined ? b : unionOfBoxes(box, b);
  }
  return box;
}
