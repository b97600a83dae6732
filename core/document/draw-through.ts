/**
 * Drawing through points: the segments of an interpolating spline through the points
 * a designer clicks, smooth or cornered per point. Between corners the curve is a
 * Catmull–Rom spline converted exactly to cubic Béziers (core/geometry/catmull-rom.ts;
 * Catmull & Rom 1974; centripetal knots by default, Yuksel, Schaefer & Keyser 2011),
 * which is C¹ in its knot parameter and so G¹ at every smooth point; at a corner the
 * spline starts afresh, its end tangent taken from a point reflected through the
 * corner, as catmull-rom.ts does at open ends. Two corners in a row are joined by a line.
 */
import type { Point } from '../geometry/vector.ts';
import { line } from '../geometry/segment.ts';
import { catmullRomToBezier, CATMULL_ROM_CENTRIPETAL } from '../geometry/catmull-rom.ts';
import type { OutlineSegment } from '../outline/index.ts';

/** A point the curve must pass through; `smooth` (default true) makes the curve tangent-continuous there. */
export interface DrawPoint {
  readonly x: number;
  readonly y: number;
  readonly smooth?: boolean;
}

/** The drawn segments and the smooth flag of the point starting each. */
export interface DrawnStretch {
  readonly segments: readonly OutlineSegment[];
  readonly smooth: readonly boolean[];
}

function withoutRepeats(points: readonly DrawPoint[], closed: boolean): DrawPoint[] {
  const result: DrawPoint[] = [];
  for (const p of points) {
    const last = result[result.length - 1];
    if (last && last.x === p.x && last.y === p.y) continue;
    result.push(p);
  }
  while (closed && result.length > 1) {
    const first = result[0] as DrawPoint;
    const last = result[result.length - 1] as DrawPoint;
    if (first.x !== last.x || first.y !== last.y) break;
    result.pop();
  }
  return result;
}

const position = (p: DrawPoint): Point => ({ x: p.x, y: p.y });

/** Segments of the open run from corner to corner (both ends included). */
function openRun(run: readonly DrawPoint[], alpha: number): OutlineSegment[] {
  if (run.length === 2) return [line(position(run[0] as DrawPoint), position(run[1] as DrawPoint))];
  return catmullRomToBezier(run.map(position), { alpha });
}

/**
 * Segments through `points`, in order. Closed: the last point joins the first, and the
 * result has one segment per (de-duplicated) point, segment i starting exactly at
 * point i. Open: one segment per consecutive pair; the ends are corners whatever their
 * flags (there is no curve beyond them to be tangent to).
 * Guarantees: every segment starts and ends exactly at given points (the on-curve
 * points are the input coordinates, bit for bit); at each smooth point the incoming and
 * outgoing handles are collinear and point the same way.
 * Limits: consecutive repeated points are dropped; fewer than two distinct points
 * give no segments.
 */
export function drawThrough(points: readonly DrawPoint[], options: { closed?: boolean; alpha?: number } = {}): DrawnStretch {
  const closed = options.closed ?? true;
  const alpha = options.alpha ?? CATMULL_ROM_CENTRIPETAL;
  let pts = withoutRepeats(points, closed);
  const n = pts.length;
  if (n < 2) return { segments: [], smooth: [] };
  const isSmooth = (p: DrawPoint) => p.smooth ?? true;
  if (closed && pts.every(isSmooth)) {
    return { segments: catmullRomToBezier(pts.map(position), { closed: true, alpha }), smooth: pts.map(() => true) };
  }
  let rotation = 0;
  if (closed) {
    rotation = pts.findIndex((p) => !isSmooth(p));
    pts = [...pts.slice(rotation), ...pts.slice(0, rotation)];
  }
  const ring = closed ? [...pts, pts[0] as DrawPoint] : pts;
  const segments: OutlineSegment[] = [];
  const smooth: boolean[] = [];
  let runStart = 0;
  for (let i = 1; i < ring.length; i++) {
    const p = ring[i] as DrawPoint;
    if (i === ring.length - 1 || !isSmooth(p)) {
      const run = ring.slice(runStart, i + 1);
      segments.push(...openRun(run, alpha));
      run.slice(0, -1).forEach((q, k) => smooth.push(k === 0 ? false : isSmooth(q))); // a run starts at a corner or an open end
      runStart = i;
    }
  }
  if (!closed || rotation === 0) return { segments, smooth };
  // Put the segments back in the caller's order: segment i starts at input point i.
  const back = (n - rotation) % n;
  return {
    segments: segments.map((_, i) => segments[(i + back) % n] as OutlineSegment),
    smooth: smooth.map((_, i) => smooth[(i + back) % n] as boolean),
  };
}
