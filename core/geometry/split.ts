/**
 * Splitting a segment at a parameter and extracting the piece between two parameters.
 *
 * Tracing and editing constantly cut curves: at extrema (so that every point is a
 * bounding-box point), at inflections, at a user's click. Splitting uses de Casteljau's
 * algorithm (de Casteljau 1959; Farin 2002, "Curves and Surfaces for CAGD", 5th ed.); arbitrary sub-pieces use the blossom (polar form) of the curve (Ramshaw 1989,
 * "Blossoms are polar forms", Computer Aided Geometric Design 6(4)), which gives the
 * control points of the piece over [t0, t1] directly without two successive splits.
 */
import type { Point } from './vector.ts';
import { lerp } from './vector.ts';
import type { Segment } from './segment.ts';
import { cubic, evaluate, line, quad } from './segment.ts';

/**
 * The two halves of `segment` split at t: the first covers [0, t], the second [t, 1],
 * both of the same kind as the input and each re-parameterised over [0, 1] so that
 * first(s) = segment(s·t) and second(s) = segment(t + s·(1 − t)).
 *
 * Guarantees: the shared point is exactly `evaluate(segment, t)`, and the outer end
 * points are exactly the input's, so contours stay closed bit-for-bit after a split.
 * Limit: t outside [0, 1] extrapolates; t = 0 or 1 yields one degenerate piece.
 */
export function splitAt<S extends Segment>(segment: S, t: number): [S, S];
export function splitAt(segment: Segment, t: number): [Segment, Segment] {
  const joint = evaluate(segment, t);
  switch (segment.kind) {
    case 'line':
      return [line(segment.p0, joint), line(joint, segment.p1)];
    case 'quad': {
      const a = lerp(segment.p0, segment.p1, t);
      const b = lerp(segment.p1, segment.p2, t);
      return [quad(segment.p0, a, joint), quad(joint, b, segment.p2)];
    }
    case 'cubic': {
      const a = lerp(segment.p0, segment.p1, t);
      const b = lerp(segment.p1, segment.p2, t);
      const c = lerp(segment.p2, segment.p3, t);
      const ab = lerp(a, b, t);
      const bc = lerp(b, c, t);
      return [cubic(segment.p0, a, ab, joint), cubic(joint, bc, c, segment.p3)];
    }
  }
}

/**
 * The blossom (polar form) of the segment at the given arguments, one per degree
 * (Ramshaw 1989). blossom(t, t, …, t) is the curve point B(t). Throws a RangeError when
 * the argument count does not match the degree.
 */
export function blossom(segment: Segment, args: readonly number[]): Point {
  let points: Point[] =
    segment.kind === 'line'
      ? [segment.p0, segment.p1]
      : segment.kind === 'quad'
        ? [segment.p0, segment.p1, segment.p2]
        : [segment.p0, segment.p1, segment.p2, segment.p3];
  if (args.length !== points.length - 1) {
    throw new RangeError(`blossom of a degree-${points.length - 1} segment needs ${points.length - 1} arguments`);
  }
  for (const u of args) {
    const next: Point[] = [];
    for (let i = 0; i + 1 < points.length; i++) next.push(lerp(points[i] as Point, points[i + 1] as Point, u));
    points = next;
  }
  return points[0] as Point;
}

/**
 * The piece of `segment` between parameters t0 and t1, of the same kind, re-parameterised
 * so that piece(s) = segment(t0 + s·(t1 − t0)). When t0 > t1 the piece runs backwards.
 *
 * Guarantees: its end points are exactly `evaluate(segment, t0)` and
 * `evaluate(segment, t1)`; interior control points are the blossom values, exact up to
 * rounding. Limit: parameters outside [0, 1] extrapolate the polynomial.
 */
export function subsegment<S extends Segment>(segment: S, t0: number, t1: number): S;
export function subsegment(segment: Segment, t0: number, t1: number): Segment {
  const start = evaluate(segment, t0);
  const end = evaluate(segment, t1);
  switch (segment.kind) {
    case 'line':
      return line(start, end);
    case 'quad':
      return quad(start, blossom(segment, [t0, t1]), end);
    case 'cubic':
      return cubic(start, blossom(segment, [t0, t0, t1]), blossom(segment, [t0, t1, t1]), end);
  }
}

/**
 * The pieces of `segment` between consecutive parameters of `ts` (values are clamped
 * to [0, 1], sorted, and 0 and 1 added), each of the input's kind. Consecutive pieces
 * share end points exactly. Duplicated parameters produce no zero-length pieces.
 */
export function splitAtParameters<S extends Segment>(segment: S, ts: readonly number[]): S[];
export function splitAtParameters(segment: Segment, ts: readonly number[]): Segment[] {
  const cuts = [0, ...ts.map((t) => Math.min(1, Math.max(0, t))), 1].sort((a, b) => a - b);
  const distinct = cuts.filter((t, i) => i === 0 || t !== cuts[i - 1]);
  const pieces: Segment[] = [];
  for (let i = 0; i + 1 < distinct.length; i++) {
    pieces.push(subsegment(segment, distinct[i] ?? 0, distinct[i + 1] ?? 1));
  }
  return pieces;
}
