// Marks the on-curve points where an outline read from a font joins smoothly: the
// incoming and outgoing directions are the same (collinear handles on opposite
// sides), so the editor keeps the join smooth when a handle is dragged. Fonts do not
// store this; it is recovered from the geometry. Works on the point list itself
// (no segment objects), since reading a large font asks it of every point.
import type { OutlineContour, OutlinePoint, PointKind } from '../../../core/outline/index.ts';

/**
 * Largest bend, in degrees, still taken as a smooth join (chosen here): whole-unit
 * coordinates can bend a join that was designed smooth by about atan(0.71 / L) per
 * handle of length L — some 1° each for 40-unit handles — while corners a designer
 * draws turn by far more.
 */
export const SMOOTH_JOIN_TOLERANCE_DEGREES = 2;
const SMOOTH_JOIN_TOLERANCE = (SMOOTH_JOIN_TOLERANCE_DEGREES * Math.PI) / 180;

/** Off-curve points of a cubic segment: the CFF model has none (a line) or two. */
const CUBIC_HANDLES = 2;

/** What the test needs of a point. */
interface JoinPoint {
  readonly x: number;
  readonly y: number;
  readonly kind: PointKind;
}

/**
 * Whether the on-curve point `points[k]` of a closed contour (lines and cubics, the
 * outline model's pattern) joins smoothly. The incoming direction comes from the
 * last control point of the segment ending there that differs from it, the outgoing
 * one goes to the first control point of the segment starting there that differs
 * from it; the join is smooth when they point the same way within
 * SMOOTH_JOIN_TOLERANCE_DEGREES. A join with a zero-length side is not smooth.
 */
export function isSmoothJoinAt(points: readonly JoinPoint[], k: number): boolean {
  const n = points.length;
  const at = points[k]!;
  // Outgoing: toward the first of the next segment's control points (one for a line, three for a cubic) that differs from `at`.
  let outX = 0;
  let outY = 0;
  const outCount = points[(k + 1) % n]!.kind === 'off' ? CUBIC_HANDLES + 1 : 1;
  for (let step = 1; step <= outCount; step++) {
    const p = points[(k + step) % n]!;
    if (p.x !== at.x || p.y !== at.y) {
      outX = p.x - at.x;
      outY = p.y - at.y;
      break;
    }
  }
  if (outX === 0 && outY === 0) return false;
  // Incoming: from the last of the previous segment's control points before `at` that differs from it.
  let inX = 0;
  let inY = 0;
  const inCount = points[(k - 1 + n) % n]!.kind === 'off' ? CUBIC_HANDLES + 1 : 1;
  for (let step = 1; step <= inCount; step++) {
    const p = points[(k - step + n * (CUBIC_HANDLES + 1)) % n]!;
    if (p.x !== at.x || p.y !== at.y) {
      inX = at.x - p.x;
      inY = at.y - p.y;
      break;
    }
  }
  if (inX === 0 && inY === 0) return false;
  const dot = inX * outX + inY * outY;
  if (dot <= 0) return false;
  return Math.atan2(Math.abs(inX * outY - inY * outX), dot) <= SMOOTH_JOIN_TOLERANCE;
}

/** The contour with each on-curve point's smooth flag set from its geometry (positions unchanged). */
export function withSmoothJoins(contour: OutlineContour): OutlineContour {
  const { points } = contour;
  if (points.length < 2) return contour;
  return { points: points.map((p, k): OutlinePoint => (p.kind === 'on' ? { ...p, smooth: isSmoothJoinAt(points, k) } : p)) };
}
