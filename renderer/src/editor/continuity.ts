/**
 * How smoothly two segments meet at an on-curve point, as the editor reports it
 * beside each point: a corner (the tangent turns), G1 (tangent-continuous: same
 * direction, curvature jumps) or G2 (curvature-continuous: same direction and the
 * same curvature on both sides, within tolerance). Curvature from core geometry
 * (κ = B′ × B″ / |B′|³ at the segment ends).
 */
import type { Vec } from '../../../core/geometry/vector.ts';
import { cross, dot, length, sub } from '../../../core/geometry/vector.ts';
import { curvature } from '../../../core/geometry/curvature.ts';
import { controlPoints, type Segment } from '../../../core/geometry/segment.ts';
import { contourSegments, type OutlineContour } from '../../../core/outline/index.ts';

export type Continuity = 'corner' | 'G1' | 'G2';

export interface JoinContinuity {
  readonly continuity: Continuity;
  /** Turn of the tangent at the join, degrees (0 for a perfectly smooth join). */
  readonly turnDegrees: number;
  /** Curvature at the end of the incoming segment and the start of the outgoing one, 1/units. */
  readonly curvatureIn: number;
  readonly curvatureOut: number;
}

export interface ContinuityTolerances {
  /** Largest tangent turn still counted as smooth, degrees. */
  readonly angleDegrees: number;
  /** Largest curvature step, as a share of the larger curvature, still counted as G2. */
  readonly relativeCurvature: number;
  /** Curvatures below this (1/units) count as flat: a radius over 100,000 units. */
  readonly flatCurvature: number;
}

/**
 * Default tolerances. 0.3° is about the smallest turn visible in a curvature comb at
 * editing zoom (common practice; the same bound the fit report uses for near-miss
 * kinks). 2 % is the curvature step the fitting's fairing aims under (core/fit
 * fairing.ts, G2_RELATIVE_TOLERANCE); an on-screen comb shows no visible step below it.
 */
export const DEFAULT_CONTINUITY_TOLERANCES: ContinuityTolerances = { angleDegrees: 0.3, relativeCurvature: 0.02, flatCurvature: 1e-5 };

/**
 * The tangent direction leaving a segment's start (toward its first distinct control
 * point) — the derivative's direction, robust to a handle retracted onto its point.
 */
function startDirection(segment: Segment): Vec | null {
  const points = controlPoints(segment);
  const start = points[0]!;
  for (const p of points.slice(1)) if (p.x !== start.x || p.y !== start.y) return sub(p, start);
  return null;
}

/** The tangent direction arriving at a segment's end (from its last distinct control point). */
function endDirection(segment: Segment): Vec | null {
  const points = controlPoints(segment);
  const end = points[points.length - 1]!;
  for (const p of points.slice(0, -1).reverse()) if (p.x !== end.x || p.y !== end.y) return sub(end, p);
  return null;
}

/** Curvature at an end of a segment; 0 for a degenerate end, where it is undefined. */
function endCurvature(segment: Segment, t: 0 | 1): number {
  const k = curvature(segment, t);
  return Number.isFinite(k) ? k : 0;
}

/** The continuity of the join where `incoming` ends and `outgoing` begins. */
export function classifyJoin(incoming: Segment, outgoing: Segment, tolerances: ContinuityTolerances = DEFAULT_CONTINUITY_TOLERANCES): JoinContinuity {
  const a = endDirection(incoming);
  const b = startDirection(outgoing);
  const curvatureIn = endCurvature(incoming, 1);
  const curvatureOut = endCurvature(outgoing, 0);
  if (!a || !b) return { continuity: 'corner', turnDegrees: 180, curvatureIn, curvatureOut };
  const turnDegrees = (Math.abs(Math.atan2(cross(a, b), dot(a, b))) * 180) / Math.PI;
  if (!(length(a) > 0 && length(b) > 0) || turnDegrees > tolerances.angleDegrees) return { continuity: 'corner', turnDegrees, curvatureIn, curvatureOut };
  const larger = Math.max(Math.abs(curvatureIn), Math.abs(curvatureOut));
  const step = Math.abs(curvatureIn - curvatureOut);
  const g2 = larger < tolerances.flatCurvature || step <= tolerances.relativeCurvature * larger;
  return { continuity: g2 ? 'G2' : 'G1', turnDegrees, curvatureIn, curvatureOut };
}

/**
 * The continuity at every on-curve point of a contour, keyed by the point's index in
 * `contour.points`: the join of the segment arriving there with the one leaving it.
 */
export function contourContinuity(contour: OutlineContour, tolerances: ContinuityTolerances = DEFAULT_CONTINUITY_TOLERANCES): Map<number, JoinContinuity> {
  const result = new Map<number, JoinContinuity>();
  const segments = contourSegments(contour);
  if (segments.length < 2) return result;
  const onIndices = contour.points.flatMap((p, i) => (p.kind === 'on' ? [i] : []));
  segments.forEach((outgoing, i) => {
    const incoming = segments[(i - 1 + segments.length) % segments.length]!;
    const pointIndex = onIndices[i];
    if (pointIndex !== undefined) result.set(pointIndex, classifyJoin(incoming, outgoing, tolerances));
  });
  return result;
}
