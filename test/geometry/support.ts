// Shared helpers for the geometry tests: a seeded PRNG, fast-check arbitraries for
// points and segments, and tolerance comparisons. Nothing here is under test.
import fc from 'fast-check';
import type { CubicSegment, LineSegment, Point, QuadSegment, Segment } from '../../core/geometry/index.ts';
import { controlPoints, cubic, endPoint, line, quad, segmentFromControlPoints } from '../../core/geometry/index.ts';

/** Fixed fast-check settings: reproducible runs, and enough of them to find edge cases. */
export const PROPERTY_SETTINGS = { seed: 20240611, numRuns: 300 } as const;

/** The shared seeded generator, so the random-curve comparisons see the same curves on every run. */
export { seededRandom } from '../support/seeded-random.ts';

/** A random point with coordinates uniform in [−extent, extent]. */
export function randomPoint(random: () => number, extent: number): Point {
  return { x: (random() * 2 - 1) * extent, y: (random() * 2 - 1) * extent };
}

/** A random cubic with control points uniform in the square [−extent, extent]². */
export function randomCubic(random: () => number, extent = 500): CubicSegment {
  return cubic(randomPoint(random, extent), randomPoint(random, extent), randomPoint(random, extent), randomPoint(random, extent));
}

/** Coordinates in glyph-sized ranges (font units), including awkward values fast-check likes. */
export const coordinateArb = fc.double({ min: -2000, max: 2000, noNaN: true, noDefaultInfinity: true });
export const pointArb: fc.Arbitrary<Point> = fc.record({ x: coordinateArb, y: coordinateArb });
export const lineArb: fc.Arbitrary<LineSegment> = fc.tuple(pointArb, pointArb).map(([a, b]) => line(a, b));
export const quadArb: fc.Arbitrary<QuadSegment> = fc.tuple(pointArb, pointArb, pointArb).map(([a, b, c]) => quad(a, b, c));
export const cubicArb: fc.Arbitrary<CubicSegment> = fc
  .tuple(pointArb, pointArb, pointArb, pointArb)
  .map(([a, b, c, d]) => cubic(a, b, c, d));
export const segmentArb: fc.Arbitrary<Segment> = fc.oneof(lineArb, quadArb, cubicArb);
/** A parameter in [0, 1]. */
export const parameterArb = fc.double({ min: 0, max: 1, noNaN: true });

/** |actual − expected| ≤ max(relative·max(|actual|, |expected|), absoluteFloor). */
export function isClose(actual: number, expected: number, relative: number, absoluteFloor: number): boolean {
  return Math.abs(actual - expected) <= Math.max(relative * Math.max(Math.abs(actual), Math.abs(expected)), absoluteFloor);
}

/** Both coordinates close in the sense of `isClose`. */
export function pointsClose(a: Point, b: Point, relative: number, absoluteFloor: number): boolean {
  return isClose(a.x, b.x, relative, absoluteFloor) && isClose(a.y, b.y, relative, absoluteFloor);
}

/** The largest absolute control-point coordinate: the natural length scale of a segment. */
export function coordinateScale(points: readonly Point[]): number {
  return Math.max(1, ...points.map((p) => Math.max(Math.abs(p.x), Math.abs(p.y))));
}

/**
 * Exact numeric equality of two points (=== per coordinate, so −0 equals +0, which
 * matters for fast-check's signed zeros but not for geometry).
 */
export function samePoint(a: Point | undefined, b: Point | undefined): boolean {
  return a !== undefined && b !== undefined && a.x === b.x && a.y === b.y;
}

/**
 * Joins arbitrary segments into a closed contour: each segment is made to start where
 * the previous one ends, and the last to end where the first starts.
 */
export function closeContour(segments: readonly Segment[]): Segment[] {
  const first = segments[0];
  if (first === undefined) return [];
  const result: Segment[] = [];
  segments.forEach((segment, i) => {
    const points = controlPoints(segment).slice();
    const previous = result[i - 1];
    if (previous !== undefined) points[0] = endPoint(previous);
    if (i === segments.length - 1) points[points.length - 1] = first.p0;
    result.push(segmentFromControlPoints(points));
  });
  return result;
}

/** Closed contours of one to six segments of any kind. */
export const closedContourArb: fc.Arbitrary<Segment[]> = fc
  .array(segmentArb, { minLength: 1, maxLength: 6 })
  .map((segments) => closeContour(segments));
