// Benchmarks for the curve-geometry core: the operations the editor runs per frame
// (evaluation for drawing, nearest point for hovering, bounding boxes for hit tests)
// and per edit (arc length for even sampling). Registered on a Bench supplied by
// test/bench/run.ts, which owns timing options and reporting.
import type { Bench } from 'tinybench';
import type { CubicSegment } from '../../core/geometry/index.ts';
import {
  arcLength,
  boundsOfSegments,
  cubic,
  evaluate,
  nearestPoint,
  parameterAtArcLength,
  segmentBounds,
} from '../../core/geometry/index.ts';

/** Points evaluated per iteration of the evaluation task. */
const EVALUATION_POINTS = 10_000;
/** Queries per iteration of the nearest-point task: one editor pointer sweep. */
const NEAREST_QUERIES = 100;
/** Segments in the synthetic glyph used for the bounding-box task. */
const GLYPH_SEGMENTS = 64;

/** A glyph-bowl-like cubic (font units), typical of what the tracer produces. */
const BOWL: CubicSegment = cubic({ x: 0, y: 0 }, { x: 0, y: 400 }, { x: 300, y: 700 }, { x: 600, y: 700 });
/** An S-shaped cubic with an inflection, the harder case for root finding. */
const S_CURVE: CubicSegment = cubic({ x: 0, y: 0 }, { x: 100, y: 300 }, { x: 200, y: -300 }, { x: 300, y: 0 });

/** Deterministic pseudo-random glyph contour pieces (no Math.random, so runs compare). */
function syntheticGlyph(count: number): CubicSegment[] {
  const segments: CubicSegment[] = [];
  for (let i = 0; i < count; i++) {
    const a = (i / count) * 2 * Math.PI;
    const b = ((i + 1) / count) * 2 * Math.PI;
    const r = 300 + 40 * Math.sin(5 * a);
    const rNext = 300 + 40 * Math.sin(5 * b);
    const p0 = { x: r * Math.cos(a), y: r * Math.sin(a) };
    const p3 = { x: rNext * Math.cos(b), y: rNext * Math.sin(b) };
    segments.push(cubic(p0, { x: p0.x * 1.05, y: p0.y * 0.95 }, { x: p3.x * 0.95, y: p3.y * 1.05 }, p3));
  }
  return segments;
}

/** Registers the geometry tasks on `bench`. */
export function geometryBenchmarks(bench: Bench): void {
  const glyph = syntheticGlyph(GLYPH_SEGMENTS);
  const queries = Array.from({ length: NEAREST_QUERIES }, (_, i) => ({
    x: -50 + (400 * i) / NEAREST_QUERIES,
    y: 150 * Math.sin(i),
  }));

  bench
    .add(`evaluate ${EVALUATION_POINTS.toLocaleString('en')} points on a cubic`, () => {
      let checksum = 0;
      for (let i = 0; i < EVALUATION_POINTS; i++) checksum += evaluate(BOWL, i / (EVALUATION_POINTS - 1)).x;
      return checksum;
    })
    .add(`nearest point, ${NEAREST_QUERIES} queries on an S-curve`, () => {
      let checksum = 0;
      for (const q of queries) checksum += nearestPoint(S_CURVE, q).distance;
      return checksum;
    })
    .add('adaptive arc length of a cubic (1e-12 relative)', () => arcLength(S_CURVE))
    .add('parameter at half the arc length of a cubic', () => parameterAtArcLength(BOWL, 600))
    .add('tight bounding box of one cubic', () => segmentBounds(S_CURVE))
    .add(`tight bounding box of a ${GLYPH_SEGMENTS}-segment glyph`, () => boundsOfSegments(glyph));
}
