/**
 * Helpers for editing a contour as a ring of segments: where each on-curve point sits
 * in the point list, end tangents of segments, and replacing a run of segments while
 * keeping the contour's start point. Shared by the edit commands.
 * @internal not exported from core/document/index.ts
 */
import type { Point, Vec } from '../geometry/vector.ts';
import { normalize, sub } from '../geometry/vector.ts';
import { contourFromSegments, contourSegments, type OutlineContour, type OutlineSegment } from '../outline/index.ts';

/** A contour as segments plus the smooth flag of the on-curve point starting each. */
export interface SegmentRing {
  readonly segments: readonly OutlineSegment[];
  readonly smooth: readonly boolean[];
  /** onCurve[i]: index in `points` of the on-curve point that starts segment i. */
  readonly onCurve: readonly number[];
}

export function segmentRing(contour: OutlineContour): SegmentRing {
  const segments = contourSegments(contour);
  const onCurve: number[] = [];
  contour.points.forEach((p, i) => {
    if (p.kind === 'on') onCurve.push(i);
  });
  return { segments, smooth: onCurve.map((i) => contour.points[i]?.smooth ?? false), onCurve };
}

/** The on-curve ordinal (segment index) of point index `point`, or −1 for an off-curve point. */
export function ordinalOf(ring: SegmentRing, point: number): number {
  return ring.onCurve.indexOf(point);
}

/** Unit direction of travel at the start of a segment; (0, 0) for a degenerate one. */
export function startTangent(segment: OutlineSegment): Vec {
  if (segment.kind === 'line') return normalize(sub(segment.p1, segment.p0));
  for (const p of [segment.p1, segment.p2, segment.p3]) {
    const d = sub(p, segment.p0);
    if (d.x !== 0 || d.y !== 0) return normalize(d);
  }
  return { x: 0, y: 0 };
}

/** Unit direction of travel at the end of a segment; (0, 0) for a degenerate one. */
export function endTangent(segment: OutlineSegment): Vec {
  if (segment.kind === 'line') return normalize(sub(segment.p1, segment.p0));
  for (const p of [segment.p2, segment.p1, segment.p0]) {
    const d = sub(segment.p3, p);
    if (d.x !== 0 || d.y !== 0) return normalize(d);
  }
  return { x: 0, y: 0 };
}

export function endOf(segment: OutlineSegment): Point {
  return segment.kind === 'line' ? segment.p1 : segment.p3;
}

/**
 * The contour with segments `first`, `first + 1`, … (`count` of them, wrapping round
 * the ring) replaced by `replacement`, which must run from the start of segment `first`
 * to the end of the last replaced one. `smooth` gives the flags of the on-curve points
 * starting each replacement segment (the first is the stretch's start point). The
 * contour keeps its original first point when that point survives; when it was inside
 * the replaced run, the new contour starts at the run's start.
 */
export function replaceSegments(ring: SegmentRing, first: number, count: number, replacement: readonly OutlineSegment[], smooth: readonly boolean[]): OutlineContour {
  const n = ring.segments.length;
  const rest: OutlineSegment[] = [];
  const restSmooth: boolean[] = [];
  for (let k = count; k < n; k++) {
    const i = (first + k) % n;
    rest.push(ring.segments[i] as OutlineSegment);
    restSmooth.push(ring.smooth[i] ?? false);
  }
  const segments = [...replacement, ...rest];
  const flags = [...replacement.map((_, i) => smooth[i] ?? false), ...restSmooth];
  // Where does the original point 0 sit now?
  let shift = 0;
  if (first !== 0 && first + count <= n) shift = replacement.length + (n - first - count);
  const m = segments.length;
  const rotated = segments.map((_, i) => segments[(i + shift) % m] as OutlineSegment);
  const rotatedFlags = flags.map((_, i) => flags[(i + shift) % m] ?? false);
  return contourFromSegments(rotated, rotatedFlags);
}

/** Cyclic index helpers. */
export function wrap(i: number, n: number): number {
  return ((i % n) + n) % n;
}
