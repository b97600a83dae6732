/**
 * A closed contour as a list of outline points, and its exact conversion to and from
 * a list of line and cubic segments. Between two consecutive on-curve points there
 * are either no off-curve points (a line) or exactly two (a cubic): the CFF model
 * (Adobe Technical Note #5177, Type 2 Charstring Format, rlineto / rrcurveto).
 */
import { cubic, line, type CubicSegment, type LineSegment } from '../geometry/segment.ts';
import type { Point } from '../geometry/vector.ts';
import type { OutlinePoint } from './outline-point.ts';
import { OutlineError } from './outline-error.ts';

/** A closed contour. The first point is on-curve; the contour closes back to it. */
export interface OutlineContour {
  readonly points: readonly OutlinePoint[];
}

/** The segments of an outline: lines and cubics only. */
export type OutlineSegment = LineSegment | CubicSegment;

/**
 * Splits a contour into its segments, in order, the last one closing back to the
 * first point. Throws OutlineError when the points do not form lines and cubics
 * (a contour starting off-curve, or one or three handles between on-curve points).
 */
export function contourSegments(contour: OutlineContour): OutlineSegment[] {
  const { points } = contour;
  const first = points[0];
  if (first === undefined || points.length === 1) return [];
  if (first.kind !== 'on') throw new OutlineError('bad-contour', 'A contour must start with an on-curve point.');
  const segments: OutlineSegment[] = [];
  let start: Point = first;
  let handles: OutlinePoint[] = [];
  for (let i = 1; i <= points.length; i++) {
    const point = points[i % points.length] ?? first;
    if (point.kind === 'off') {
      handles.push(point);
      continue;
    }
    if (handles.length === 0) {
      segments.push(line(start, point));
    } else if (handles.length === 2) {
      const [h1, h2] = handles as [OutlinePoint, OutlinePoint];
      segments.push(cubic(start, h1, h2, point));
    } else {
      throw new OutlineError('bad-contour', `Found ${handles.length} off-curve point(s) between two on-curve points; a segment has none (a line) or two (a cubic).`);
    }
    start = point;
    handles = [];
  }
  return segments;
}

/**
 * Builds a contour from closed segments (each starting where the previous ended, the
 * last ending at the first's start). `smooth[i]` marks the on-curve point that starts
 * segment i; the default marks nothing smooth.
 */
export function contourFromSegments(segments: readonly OutlineSegment[], smooth: readonly boolean[] = []): OutlineContour {
  const points: OutlinePoint[] = [];
  segments.forEach((segment, i) => {
    points.push({ x: segment.p0.x, y: segment.p0.y, kind: 'on', smooth: smooth[i] ?? false });
    if (segment.kind === 'cubic') {
      points.push({ x: segment.p1.x, y: segment.p1.y, kind: 'off', smooth: false });
      points.push({ x: segment.p2.x, y: segment.p2.y, kind: 'off', smooth: false });
    }
  });
  return { points };
}

/** The on-curve points of a contour, in order. */
export function onCurvePoints(contour: OutlineContour): OutlinePoint[] {
  return contour.points.filter((p) => p.kind === 'on');
}

/** The same contour run the other way, still starting at the same on-curve point. */
export function reverseContour(contour: OutlineContour): OutlineContour {
  const [first, ...rest] = contour.points;
  if (first === undefined) return contour;
  return { points: [first, ...rest.reverse()] };
}

/** The contour with every point moved by `transform`; kinds and smooth flags kept. */
export function mapContour(contour: OutlineContour, transform: (p: Point) => Point): OutlineContour {
  return { points: contour.points.map((p) => ({ ...transform(p), kind: p.kind, smooth: p.smooth })) };
}
