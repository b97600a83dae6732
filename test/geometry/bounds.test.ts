// Tight bounding boxes: glyph extents (advance widths, side bearings) come from these,
// so a box must contain the whole curve and be no larger than the curve needs.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  boundsOfSegments,
  boxContains,
  controlPoints,
  controlPolygonBounds,
  cubic,
  evaluate,
  extremaParameters,
  line,
  quad,
  segmentBounds,
} from '../../core/geometry/index.ts';
import { PROPERTY_SETTINGS, coordinateScale, segmentArb } from './support.ts';

const ROUNDING = 1e-12;
const DENSE_SAMPLES = 257;

describe('tight bounding boxes', () => {
  it('contain every sampled point of the curve', () => {
    fc.assert(
      fc.property(segmentArb, (segment) => {
        const box = segmentBounds(segment);
        const tolerance = ROUNDING * coordinateScale(controlPoints(segment));
        const outside = Array.from({ length: DENSE_SAMPLES }, (_, i) => evaluate(segment, i / (DENSE_SAMPLES - 1))).filter(
          (p) => !boxContains(box, p, tolerance),
        );
        expect(outside).toEqual([]);
      }),
      PROPERTY_SETTINGS,
    );
  });

  it('are touched by the curve on every side (tight, not the control-polygon box)', () => {
    fc.assert(
      fc.property(segmentArb, (segment) => {
        const box = segmentBounds(segment);
        const polygon = controlPolygonBounds(segment);
        expect(box.minX).toBeGreaterThanOrEqual(polygon.minX);
        expect(box.maxX).toBeLessThanOrEqual(polygon.maxX);
        expect(box.minY).toBeGreaterThanOrEqual(polygon.minY);
        expect(box.maxY).toBeLessThanOrEqual(polygon.maxY);
        const { x, y } = extremaParameters(segment);
        const xs = [0, ...x, 1].map((t) => evaluate(segment, t).x);
        const ys = [0, ...y, 1].map((t) => evaluate(segment, t).y);
        // Numeric equality (=== treats −0 and +0 alike).
        expect(Math.min(...xs) === box.minX && Math.max(...xs) === box.maxX).toBe(true);
        expect(Math.min(...ys) === box.minY && Math.max(...ys) === box.maxY).toBe(true);
      }),
      PROPERTY_SETTINGS,
    );
  });

  it('of a symmetric arch peak at the analytic apex', () => {
    // B(t) for P = (0,0), (0,4), (4,4), (4,0): y(t) = 12t(1 − t), maximum 3 at t = ½.
    const box = segmentBounds(cubic({ x: 0, y: 0 }, { x: 0, y: 4 }, { x: 4, y: 4 }, { x: 4, y: 0 }));
    expect(box).toEqual({ minX: 0, minY: 0, maxX: 4, maxY: 3 });
    expect(extremaParameters(cubic({ x: 0, y: 0 }, { x: 0, y: 4 }, { x: 4, y: 4 }, { x: 4, y: 0 })).y).toEqual([0.5]);
  });

  it('of a quadratic reaches its analytic extreme, and a line has no interior extrema', () => {
    // y(t) = 2t(1 − t)·10 peaks at 5 for t = ½.
    expect(segmentBounds(quad({ x: 0, y: 0 }, { x: 5, y: 10 }, { x: 10, y: 0 })).maxY).toBe(5);
    expect(extremaParameters(line({ x: 0, y: 0 }, { x: 3, y: 4 }))).toEqual({ x: [], y: [] });
  });

  it('of several segments is the union, and of none is undefined', () => {
    const a = line({ x: 0, y: 0 }, { x: 1, y: 1 });
    const b = line({ x: -2, y: 5 }, { x: 0, y: 0 });
    expect(boundsOfSegments([a, b])).toEqual({ minX: -2, minY: 0, maxX: 1, maxY: 5 });
    expect(boundsOfSegments([])).toBeUndefined();
  });
});
