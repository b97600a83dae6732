// Shared checks for the fitting tests: reading a fitted contour's joins and testing
// the properties a type designer relies on (integer grid, smooth joins collinear,
// extrema as on-curve points, tolerance against the boundary).

import type { Point } from '../../core/geometry/index.ts';
import { contourSegments, type OutlineContour, type OutlineSegment } from '../../core/outline/index.ts';

/** Each on-curve point with its incoming and outgoing handle vectors (from the nearest distinct control points). */
export interface Join {
  readonly point: Point;
  readonly smooth: boolean;
  /** point − previous control point. */
  readonly incoming: Point;
  /** next control point − point. */
  readonly outgoing: Point;
}

export function joinsOf(contour: OutlineContour): Join[] {
  const segments = contourSegments(contour);
  const on = contour.points.filter((p) => p.kind === 'on');
  return segments.map((segment, i) => {
    const before = segments[(i - 1 + segments.length) % segments.length]!;
    const p = segment.p0;
    const from = before.kind === 'line' ? before.p0 : [before.p2, before.p1, before.p0].find((q) => q.x !== p.x || q.y !== p.y)!;
    const to = segment.kind === 'line' ? segment.p1 : [segment.p1, segment.p2, segment.p3].find((q) => q.x !== p.x || q.y !== p.y)!;
    return { point: p, smooth: on[i]!.smooth, incoming: { x: p.x - from.x, y: p.y - from.y }, outgoing: { x: to.x - p.x, y: to.y - p.y } };
  });
}

/** Turn in degrees between a join's incoming and outgoing directions. */
export function turnDegrees(join: Join): number {
  const { incoming: a, outgoing: b } = join;
  return (Math.abs(Math.atan2(a.x * b.y - a.y * b.x, a.x * b.x + a.y * b.y)) * 180) / Math.PI;
}

/** Normalised cross product of the two handle directions (0 for exactly collinear). */
export function normalisedCross(join: Join): number {
  const { incoming: a, outgoing: b } = join;
  return (a.x * b.y - a.y * b.x) / (Math.hypot(a.x, a.y) * Math.hypot(b.x, b.y));
}

export function allOnGrid(contour: OutlineContour, grid = 1): boolean {
  return contour.points.every((p) => Number.isInteger(p.x / grid) && Number.isInteger(p.y / grid));
}

export function segmentsOf(contour: OutlineContour): OutlineSegment[] {
  return contourSegments(contour);
}
