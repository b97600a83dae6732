// Elementary measures of closed polygons — signed area, bounding box and point
// containment — shared by nesting and sheet segmentation.

import type { Box, Point } from './types.ts';

/**
 * Signed shoelace area ½·Σ(xᵢ·yᵢ₊₁ − xᵢ₊₁·yᵢ) of the closed polygon (first point not
 * repeated). In the y-down pixel frame it is positive for chains running clockwise on
 * screen. Coordinates are taken relative to the first point, which keeps the sum
 * accurate far from the origin. 0 for fewer than three points.
 */
export function signedArea(points: readonly Point[]): number {
  const n = points.length;
  if (n < 3) return 0;
  const origin = points[0]!;
  let twice = 0;
  let previousX = 0;
  let previousY = 0;
  for (let i = 1; i < n; i++) {
    const point = points[i]!;
    const x = point.x - origin.x;
    const y = point.y - origin.y;
    twice += previousX * y - x * previousY;
    previousX = x;
    previousY = y;
  }
  return twice / 2;
}

/** Smallest box containing every point; a zero box at the origin for no points. */
export function boundingBox(points: readonly Point[]): Box {
  if (points.length === 0) return { x: 0, y: 0, width: 0, height: 0 };
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const point of points) {
    if (point.x < minX) minX = point.x;
    if (point.x > maxX) maxX = point.x;
    if (point.y < minY) minY = point.y;
    if (point.y > maxY) maxY = point.y;
  }
  return { x: minX, y: minY, width: maxX - minX, height: maxY - minY };
}

/** True when `point` lies in `box` (edges included). */
export function boxContains(box: Box, point: Point): boolean {
  return point.x >= box.x && point.x <= box.x + box.width && point.y >= box.y && point.y <= box.y + box.height;
}

/**
 * Even–odd point-in-polygon test by ray crossing (W. R. Franklin's PNPOLY form of the
 * Jordan curve test; E. Haines (1994), "Point in Polygon Strategies", Graphics Gems IV).
 * Half-open edge rule, so a ray through a vertex is counted once. The answer for a
 * point exactly on the boundary is unspecified; callers pass interior test points.
 */
export function polygonContains(polygon: readonly Point[], point: Point): boolean {
  const n = polygon.length;
  let inside = false;
  let j = n - 1;
  for (let i = 0; i < n; i++) {
    const a = polygon[i]!;
    const b = polygon[j]!;
    if (a.y > point.y !== b.y > point.y) {
      const crossingX = a.x + ((point.y - a.y) * (b.x - a.x)) / (b.y - a.y);
      if (point.x < crossingX) inside = !inside;
    }
    j = i;
  }
  return inside;
}
