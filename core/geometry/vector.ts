/**
 * Two-dimensional points and vectors.
 *
 * Every other geometry module builds on these plain, immutable `{ x, y }` records and
 * the free functions below. `Vec` is the same shape as `Point`; the separate name only
 * documents intent (a displacement rather than a position). No function here mutates
 * its arguments; each returns a fresh object.
 */

/** A position in the plane. */
export interface Point {
  readonly x: number;
  readonly y: number;
}

/** A displacement in the plane (same shape as `Point`). */
export type Vec = Point;

/** Builds a point. Guarantees a fresh object; performs no validation. */
export function point(x: number, y: number): Point {
  return { x, y };
}

/** The origin (0, 0). Frozen so that accidental mutation fails loudly. */
export const ORIGIN: Point = Object.freeze({ x: 0, y: 0 });

/** Component-wise sum a + b. */
export function add(a: Vec, b: Vec): Vec {
  return { x: a.x + b.x, y: a.y + b.y };
}

/** Component-wise difference a − b (the vector from b to a). */
export function sub(a: Vec, b: Vec): Vec {
  return { x: a.x - b.x, y: a.y - b.y };
}

/** The vector v multiplied by the scalar factor. */
export function scale(v: Vec, factor: number): Vec {
  return { x: v.x * factor, y: v.y * factor };
}

/** The vector −v. */
export function negate(v: Vec): Vec {
  return { x: -v.x, y: -v.y };
}

/** Dot (inner) product a·b. */
export function dot(a: Vec, b: Vec): number {
  return a.x * b.x + a.y * b.y;
}

/**
 * Two-dimensional cross product a × b = a.x·b.y − a.y·b.x (the z component of the 3-D
 * cross product). Positive when b is counter-clockwise from a in a y-up frame.
 */
export function cross(a: Vec, b: Vec): number {
  return a.x * b.y - a.y * b.x;
}

/** Squared Euclidean length |v|². Exact for the inputs up to one rounding per operation. */
export function squaredLength(v: Vec): number {
  return v.x * v.x + v.y * v.y;
}

/**
 * Euclidean length |v|. Uses `Math.hypot`, so it neither overflows nor underflows for
 * components whose squares would.
 */
export function length(v: Vec): number {
  return Math.hypot(v.x, v.y);
}

/** Euclidean distance |a − b|. */
export function distance(a: Point, b: Point): number {
  return Math.hypot(a.x - b.x, a.y - b.y);
}

/** Squared Euclidean distance |a − b|². */
export function squaredDistance(a: Point, b: Point): number {
  const dx = a.x - b.x;
  const dy = a.y - b.y;
  return dx * dx + dy * dy;
}

/**
 * The unit vector in the direction of v. Limit: the zero vector has no direction, so it
 * is returned unchanged as (0, 0) rather than producing NaN; callers that must
 * distinguish this case should test `length(v) === 0` first.
 */
export function normalize(v: Vec): Vec {
  const len = length(v);
  return len === 0 ? { x: 0, y: 0 } : { x: v.x / len, y: v.y / len };
}

/**
 * Linear interpolation a + (b − a)·t. Guarantees lerp(a, b, 0) === a and lerp(a, b, 1)
 * === b exactly (the form (1 − t)·a + t·b is used for that reason). t is not clamped.
 */
export function lerp(a: Point, b: Point, t: number): Point {
  const s = 1 - t;
  return { x: s * a.x + t * b.x, y: s * a.y + t * b.y };
}

/** The midpoint of a and b. */
export function midpoint(a: Point, b: Point): Point {
  return { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 };
}

/**
 * v rotated by +90° (counter-clockwise in a y-up frame): (−y, x). Exact; the length is
 * preserved.
 */
export function perpendicular(v: Vec): Vec {
  return { x: -v.y, y: v.x };
}

/** v rotated by `angle` radians, counter-clockwise in a y-up frame. */
export function rotate(v: Vec, angle: number): Vec {
  const c = Math.cos(angle);
  const s = Math.sin(angle);
  return { x: c * v.x - s * v.y, y: s * v.x + c * v.y };
}

/**
 * True when a and b differ by at most `tolerance` in each coordinate (0 means exact
 * equality).
 */
export function pointsEqual(a: Point, b: Point, tolerance = 0): boolean {
  return Math.abs(a.x - b.x) <= tolerance && Math.abs(a.y - b.y) <= tolerance;
}
