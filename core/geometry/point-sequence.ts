/**
 * Clean-up of point sequences before spline construction.
 *
 * Interpolating splines divide by the distance between consecutive points (knot
 * spacing), so repeated points, which hand tracing produces routinely, would yield
 * division by zero. This module removes them in one agreed way for all spline modules.
 */
import type { Point } from './vector.ts';
import { pointsEqual } from './vector.ts';

/**
 * `points` without consecutive exact duplicates; when `closed`, also without trailing
 * points equal to the first (the closing point is implied). Returns a new array of the
 * same point objects; the input is not modified.
 */
export function withoutRepeatedPoints(points: readonly Point[], closed: boolean): Point[] {
  const result: Point[] = [];
  for (const p of points) {
    const previous = result[result.length - 1];
    if (previous === undefined || !pointsEqual(previous, p)) result.push(p);
  }
  if (closed) {
    const first = result[0];
    while (result.length > 1 && first !== undefined && pointsEqual(result[result.length - 1] as Point, first)) result.pop();
  }
  return result;
}
