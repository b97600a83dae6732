/**
 * Bézier segments of degree 1, 2 and 3 as plain data, with evaluation and derivatives.
 *
 * Outlines in Stemline are sequences of these segments. They are immutable records
 * tagged by `kind`; every operation elsewhere is a free function that dispatches on the
 * tag. Evaluation uses the Bernstein form directly (Bernstein 1912; see Farin 2002,
 * "Curves and Surfaces for CAGD", 5th ed.), which reproduces the end points
 * exactly at t = 0 and t = 1.
 */
import type { Point, Vec } from './vector.ts';

/** A straight segment from p0 to p1, B(t) = (1 − t)·p0 + t·p1. */
export interface LineSegment {
  readonly kind: 'line';
  readonly p0: Point;
  readonly p1: Point;
}

/** A quadratic Bézier segment with end points p0, p2 and control point p1. */
export interface QuadSegment {
  readonly kind: 'quad';
  readonly p0: Point;
  readonly p1: Point;
  readonly p2: Point;
}

/** A cubic Bézier segment with end points p0, p3 and control points p1, p2. */
export interface CubicSegment {
  readonly kind: 'cubic';
  readonly p0: Point;
  readonly p1: Point;
  readonly p2: Point;
  readonly p3: Point;
}

/** Any supported segment. */
export type Segment = LineSegment | QuadSegment | CubicSegment;

/** Builds a line segment. */
export function line(p0: Point, p1: Point): LineSegment {
  return { kind: 'line', p0, p1 };
}

/** Builds a quadratic segment. */
export function quad(p0: Point, p1: Point, p2: Point): QuadSegment {
  return { kind: 'quad', p0, p1, p2 };
}

/** Builds a cubic segment. */
export function cubic(p0: Point, p1: Point, p2: Point, p3: Point): CubicSegment {
  return { kind: 'cubic', p0, p1, p2, p3 };
}

/** The polynomial degree implied by the kind: 1, 2 or 3 (not reduced for degenerate data). */
export function degreeOf(segment: Segment): 1 | 2 | 3 {
  switch (segment.kind) {
    case 'line':
      return 1;
    case 'quad':
      return 2;
    case 'cubic':
      return 3;
  }
}

/** The control points in order, end points included (2, 3 or 4 of them). */
export function controlPoints(segment: Segment): readonly Point[] {
  switch (segment.kind) {
    case 'line':
      return [segment.p0, segment.p1];
    case 'quad':
      return [segment.p0, segment.p1, segment.p2];
    case 'cubic':
      return [segment.p0, segment.p1, segment.p2, segment.p3];
  }
}

/**
 * The segment whose control points are `points`: 2 → line, 3 → quad, 4 → cubic.
 * Limit: throws a RangeError for any other count, since no other degree is supported.
 */
export function segmentFromControlPoints(points: readonly Point[]): Segment {
  const [a, b, c, d] = points;
  if (points.length === 2 && a && b) return line(a, b);
  if (points.length === 3 && a && b && c) return quad(a, b, c);
  if (points.length === 4 && a && b && c && d) return cubic(a, b, c, d);
  throw new RangeError(`a segment needs 2, 3 or 4 control points, got ${points.length}`);
}

/** The point at t = 0. */
export function startPoint(segment: Segment): Point {
  return segment.p0;
}

/** The point at t = 1. */
export function endPoint(segment: Segment): Point {
  switch (segment.kind) {
    case 'line':
      return segment.p1;
    case 'quad':
      return segment.p2;
    case 'cubic':
      return segment.p3;
  }
}

/**
 * The same curve traversed in the opposite direction: reversed(t) = original(1 − t).
 * Guarantees the same kind and the same (shared) point objects.
 */
export function reverseSegment<S extends Segment>(segment: S): S;
export function reverseSegment(segment: Segment): Segment {
  switch (segment.kind) {
    case 'line':
      return line(segment.p1, segment.p0);
    case 'quad':
      return quad(segment.p2, segment.p1, segment.p0);
    case 'cubic':
      return cubic(segment.p3, segment.p2, segment.p1, segment.p0);
  }
}

/**
 * The segment with `transform` applied to every control point. Exact for affine maps
 * (Bézier curves are affinely invariant); for other maps the result only approximates
 * the mapped curve.
 */
export function mapControlPoints<S extends Segment>(segment: S, transform: (p: Point) => Point): S;
export function mapControlPoints(segment: Segment, transform: (p: Point) => Point): Segment {
  switch (segment.kind) {
    case 'line':
      return line(transform(segment.p0), transform(segment.p1));
    case 'quad':
      return quad(transform(segment.p0), transform(segment.p1), transform(segment.p2));
    case 'cubic':
      return cubic(transform(segment.p0), transform(segment.p1), transform(segment.p2), transform(segment.p3));
  }
}

// ---------------------------------------------------------------------------------------
// Per-kind evaluation. t is not clamped: values outside [0, 1] extrapolate the polynomial.

/** Point on a line at t. Exact end points at t = 0 and t = 1. */
export function evaluateLine(s: LineSegment, t: number): Point {
  const u = 1 - t;
  return { x: u * s.p0.x + t * s.p1.x, y: u * s.p0.y + t * s.p1.y };
}

/** Velocity dB/dt of a line (constant). */
export function derivativeLine(s: LineSegment): Vec {
  return { x: s.p1.x - s.p0.x, y: s.p1.y - s.p0.y };
}

/** Point on a quadratic at t, from the Bernstein form. Exact end points. */
export function evaluateQuad(s: QuadSegment, t: number): Point {
  const u = 1 - t;
  const b0 = u * u;
  const b1 = 2 * u * t;
  const b2 = t * t;
  return {
    x: b0 * s.p0.x + b1 * s.p1.x + b2 * s.p2.x,
    y: b0 * s.p0.y + b1 * s.p1.y + b2 * s.p2.y,
  };
}

/** Velocity of a quadratic: 2[(1 − t)(p1 − p0) + t(p2 − p1)]. */
export function derivativeQuad(s: QuadSegment, t: number): Vec {
  const u = 1 - t;
  return {
    x: 2 * (u * (s.p1.x - s.p0.x) + t * (s.p2.x - s.p1.x)),
    y: 2 * (u * (s.p1.y - s.p0.y) + t * (s.p2.y - s.p1.y)),
  };
}

/** Acceleration of a quadratic (constant): 2(p2 − 2p1 + p0). */
export function secondDerivativeQuad(s: QuadSegment): Vec {
  return {
    x: 2 * (s.p2.x - 2 * s.p1.x + s.p0.x),
    y: 2 * (s.p2.y - 2 * s.p1.y + s.p0.y),
  };
}

/** Point on a cubic at t, from the Bernstein form. Exact end points. */
export function evaluateCubic(s: CubicSegment, t: number): Point {
  const u = 1 - t;
  const b0 = u * u * u;
  const b1 = 3 * u * u * t;
  const b2 = 3 * u * t * t;
  const b3 = t * t * t;
  return {
    x: b0 * s.p0.x + b1 * s.p1.x + b2 * s.p2.x + b3 * s.p3.x,
    y: b0 * s.p0.y + b1 * s.p1.y + b2 * s.p2.y + b3 * s.p3.y,
  };
}

/** Velocity of a cubic: 3[(1 − t)²(p1 − p0) + 2(1 − t)t(p2 − p1) + t²(p3 − p2)]. */
export function derivativeCubic(s: CubicSegment, t: number): Vec {
  const u = 1 - t;
  const b0 = u * u;
  const b1 = 2 * u * t;
  const b2 = t * t;
  return {
    x: 3 * (b0 * (s.p1.x - s.p0.x) + b1 * (s.p2.x - s.p1.x) + b2 * (s.p3.x - s.p2.x)),
    y: 3 * (b0 * (s.p1.y - s.p0.y) + b1 * (s.p2.y - s.p1.y) + b2 * (s.p3.y - s.p2.y)),
  };
}

/** Acceleration of a cubic: 6[(1 − t)(p2 − 2p1 + p0) + t(p3 − 2p2 + p1)]. */
export function secondDerivativeCubic(s: CubicSegment, t: number): Vec {
  const u = 1 - t;
  return {
    x: 6 * (u * (s.p2.x - 2 * s.p1.x + s.p0.x) + t * (s.p3.x - 2 * s.p2.x + s.p1.x)),
    y: 6 * (u * (s.p2.y - 2 * s.p1.y + s.p0.y) + t * (s.p3.y - 2 * s.p2.y + s.p1.y)),
  };
}

// ---------------------------------------------------------------------------------------
// Generic dispatchers.

/** Point B(t) on any segment. Exact end points at t = 0 and t = 1; t is not clamped. */
export function evaluate(segment: Segment, t: number): Point {
  switch (segment.kind) {
    case 'line':
      return evaluateLine(segment, t);
    case 'quad':
      return evaluateQuad(segment, t);
    case 'cubic':
      return evaluateCubic(segment, t);
  }
}

/** Velocity B′(t) with respect to the segment parameter t. */
export function derivative(segment: Segment, t: number): Vec {
  switch (segment.kind) {
    case 'line':
      return derivativeLine(segment);
    case 'quad':
      return derivativeQuad(segment, t);
    case 'cubic':
      return derivativeCubic(segment, t);
  }
}

/** Acceleration B″(t) with respect to t (zero for a line). */
export function secondDerivative(segment: Segment, t: number): Vec {
  switch (segment.kind) {
    case 'line':
      return { x: 0, y: 0 };
    case 'quad':
      return secondDerivativeQuad(segment);
    case 'cubic':
      return secondDerivativeCubic(segment, t);
  }
}
