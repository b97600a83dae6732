// Segment evaluation and derivatives: the definitions everything else is checked
// against, pinned to hand-computed values and to finite differences.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  controlPoints,
  cubic,
  degreeOf,
  derivative,
  endPoint,
  evaluate,
  line,
  mapControlPoints,
  quad,
  reverseSegment,
  secondDerivative,
  segmentFromControlPoints,
} from '../../core/geometry/index.ts';
import { PROPERTY_SETTINGS, coordinateScale, parameterArb, pointsClose, samePoint, segmentArb } from './support.ts';

describe('segments', () => {
  it('evaluate to hand-computed Bernstein values', () => {
    // B(½) = (P0 + 3P1 + 3P2 + P3)/8 for a cubic; (P0 + 2P1 + P2)/4 for a quadratic.
    expect(evaluate(cubic({ x: 0, y: 0 }, { x: 0, y: 4 }, { x: 4, y: 4 }, { x: 4, y: 0 }), 0.5)).toEqual({ x: 2, y: 3 });
    expect(evaluate(quad({ x: 0, y: 0 }, { x: 2, y: 4 }, { x: 4, y: 0 }), 0.5)).toEqual({ x: 2, y: 2 });
    expect(evaluate(line({ x: 0, y: 0 }, { x: 4, y: 2 }), 0.25)).toEqual({ x: 1, y: 0.5 });
  });

  it('start and end exactly on their end points', () => {
    fc.assert(
      fc.property(segmentArb, (s) => {
        expect(samePoint(evaluate(s, 0), s.p0)).toBe(true);
        expect(samePoint(evaluate(s, 1), endPoint(s))).toBe(true);
      }),
      PROPERTY_SETTINGS,
    );
  });

  it('have derivatives that match central finite differences', () => {
    const h = 1e-5;
    fc.assert(
      fc.property(segmentArb, fc.double({ min: 0.01, max: 0.99, noNaN: true }), (s, t) => {
        const tolerance = 1e-5 * coordinateScale(controlPoints(s));
        const before = evaluate(s, t - h);
        const after = evaluate(s, t + h);
        const difference = { x: (after.x - before.x) / (2 * h), y: (after.y - before.y) / (2 * h) };
        expect(pointsClose(derivative(s, t), difference, 0, tolerance)).toBe(true);
        const dBefore = derivative(s, t - h);
        const dAfter = derivative(s, t + h);
        const secondDifference = { x: (dAfter.x - dBefore.x) / (2 * h), y: (dAfter.y - dBefore.y) / (2 * h) };
        expect(pointsClose(secondDerivative(s, t), secondDifference, 0, tolerance)).toBe(true);
      }),
      PROPERTY_SETTINGS,
    );
  });

  it('reverse to the same curve traversed backwards', () => {
    fc.assert(
      fc.property(segmentArb, parameterArb, (s, t) => {
        const tolerance = 1e-12 * coordinateScale(controlPoints(s));
        expect(pointsClose(evaluate(reverseSegment(s), t), evaluate(s, 1 - t), 0, tolerance)).toBe(true);
      }),
      PROPERTY_SETTINGS,
    );
  });

  it('round-trip through control points and map affinely', () => {
    fc.assert(
      fc.property(segmentArb, (s) => {
        expect(segmentFromControlPoints(controlPoints(s))).toEqual(s);
        expect(controlPoints(s)).toHaveLength(degreeOf(s) + 1);
      }),
      PROPERTY_SETTINGS,
    );
    const moved = mapControlPoints(quad({ x: 0, y: 0 }, { x: 1, y: 1 }, { x: 2, y: 0 }), (p) => ({ x: p.x + 1, y: 2 * p.y }));
    expect(evaluate(moved, 0.5)).toEqual({ x: 2, y: 1 });
    expect(() => segmentFromControlPoints([{ x: 0, y: 0 }])).toThrow(RangeError);
  });
});
