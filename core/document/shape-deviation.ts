/**
 * How far an edited stretch of outline strays from the shape it replaced: the larger
 * of the two one-sided distances (every sample of the new curve to the old, every
 * sample of the old to the new), an estimate of their Hausdorff distance.
 *
 * Each sample's distance is exact (the degree-5 nearest-point solve of
 * core/geometry/nearest.ts); the maximum is taken over samples only, so a narrow
 * excursion between samples can be missed. With the density below, on glyph-sized
 * curves the samples are a few units apart at most.
 */
import type { Point } from '../geometry/vector.ts';
import { evaluate } from '../geometry/segment.ts';
import { nearestPointOnSegments } from '../geometry/nearest.ts';
import type { OutlineSegment } from '../outline/index.ts';

/** Samples per segment, uniform in the parameter (common practice for flattening glyph curves for measurement). */
export const DEVIATION_SAMPLES_PER_SEGMENT = 48;

/** Points of the segments at uniform parameters, both ends included. */
export function samplePoints(segments: readonly OutlineSegment[], perSegment = DEVIATION_SAMPLES_PER_SEGMENT): Point[] {
  const points: Point[] = [];
  segments.forEach((segment, i) => {
    for (let k = i === 0 ? 0 : 1; k <= perSegment; k++) points.push(evaluate(segment, k / perSegment));
  });
  return points;
}

/** Largest distance from a sample of `from` to the curve `to` (0 when either is empty). */
export function oneSidedDeviation(from: readonly OutlineSegment[], to: readonly OutlineSegment[], perSegment = DEVIATION_SAMPLES_PER_SEGMENT): number {
  if (to.length === 0) return 0;
  let worst = 0;
  for (const p of samplePoints(from, perSegment)) worst = Math.max(worst, nearestPointOnSegments(to, p)?.distance ?? 0);
  return worst;
}

/** The larger of the two one-sided deviations between two runs of segments. */
export function shapeDeviation(a: readonly OutlineSegment[], b: readonly OutlineSegment[], perSegment = DEVIATION_SAMPLES_PER_SEGMENT): number {
  return Math.max(oneSidedDeviation(a, b, perSegment), oneSidedDeviation(b, a, perSegment));
}
