// Marks the on-curve points where an outline read from a font joins smoothly: the
// incoming and outgoing directions are the same (collinear handles on opposite
// sides), so the editor keeps the join smooth when a handle is dragged. Fonts do not
// store this; it is recovered from the geometry.
import { cross, dot, sub, type Point, type Vec } from '../../../core/geometry/index.ts';
import { contourSegments, type OutlineContour, type OutlineSegment } from '../../../core/outline/index.ts';

/**
 * Largest bend, in degrees, still taken as a smooth join (chosen here): whole-unit
 * coordinates can bend a join that was designed smooth by about atan(0.71 / L) per
 * handle of length L — some 1° each for 40-unit handles — while corners a designer
 * draws turn by far more.
 */
export const SMOOTH_JOIN_TOLERANCE_DEGREES = 2;
const SMOOTH_JOIN_TOLERANCE = (SMOOTH_JOIN_TOLERANCE_DEGREES * Math.PI) / 180;

const controlPointsOf = (s: OutlineSegment): Point[] => (s.kind === 'line' ? [s.p0, s.p1] : [s.p0, s.p1, s.p2, s.p3]);

/** Direction the segment leaves its start in: toward its first control point that differs from the start. */
function outgoingDirection(segment: OutlineSegment): Vec | undefined {
  const [start, ...rest] = controlPointsOf(segment);
  const next = rest.find((p) => p.x !== start!.x || p.y !== start!.y);
  return next === undefined ? undefined : sub(next, start!);
}

/** Direction the segment arrives at its end in: from its last control point that differs from the end. */
function incomingDirection(segment: OutlineSegment): Vec | undefined {
  const points = controlPointsOf(segment);
  const end = points[points.length - 1]!;
  const previous = points.slice(0, -1).reverse().find((p) => p.x !== end.x || p.y !== end.y);
  return previous === undefined ? undefined : sub(end, previous);
}

function isSmoothJoin(incoming: Vec | undefined, outgoing: Vec | undefined): boolean {
  if (incoming === undefined || outgoing === undefined) return false;
  const d = dot(incoming, outgoing);
  if (d <= 0) return false;
  return Math.atan2(Math.abs(cross(incoming, outgoing)), d) <= SMOOTH_JOIN_TOLERANCE;
}

/** The contour with each on-curve point's smooth flag set from its geometry (positions unchanged). */
export function withSmoothJoins(contour: OutlineContour): OutlineContour {
  const segments = contourSegments(contour);
  if (segments.length === 0) return contour;
  const smooth = segments.map((segment, i) => isSmoothJoin(incomingDirection(segments[(i - 1 + segments.length) % segments.length]!), outgoingDirection(segment)));
  let onIndex = 0;
  return {
    points: contour.points.map((p) => (p.kind === 'on' ? { ...p, smooth: smooth[onIndex++] ?? false } : p)),
  };
}
