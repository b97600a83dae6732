// Splitting and sub-pieces: de Casteljau halves and blossom sub-pieces must trace the
// original curve exactly, which is what keeps an outline in place when the editor or
// the fitter cuts it.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  controlPoints,
  cubic,
  endPoint,
  evaluate,
  splitAt,
  splitAtParameters,
  subsegment,
} from '../../core/geometry/index.ts';
import { PROPERTY_SETTINGS, coordinateScale, parameterArb, pointsClose, samePoint, segmentArb } from './support.ts';

/** Agreement expected between two rounding-level computations of the same point, per unit of coordinate scale. */
const ROUNDING = 1e-12;
const SAMPLES = [0, 0.13, 0.37, 0.5, 0.61, 0.89, 1];

describe('splitting a segment', () => {
  it('halves reproduce the original curve at the mapped parameters (a cut never moves the outline)', () => {
    fc.assert(
      fc.property(segmentArb, parameterArb, (segment, t) => {
        const [first, second] = splitAt(segment, t);
        const tolerance = ROUNDING * coordinateScale(controlPoints(segment));
        for (const s of SAMPLES) {
          expect(pointsClose(evaluate(first, s), evaluate(segment, s * t), 0, tolerance)).toBe(true);
          expect(pointsClose(evaluate(second, s), evaluate(segment, t + s * (1 - t)), 0, tolerance)).toBe(true);
        }
        expect(first.kind).toBe(segment.kind);
        expect(second.kind).toBe(segment.kind);
      }),
      PROPERTY_SETTINGS,
    );
  });

  it('the two halves share the split point bit-for-bit and keep the original end points (contours stay closed)', () => {
    fc.assert(
      fc.property(segmentArb, parameterArb, (segment, t) => {
        const [first, second] = splitAt(segment, t);
        expect(endPoint(first)).toEqual(evaluate(segment, t));
        expect(second.p0).toEqual(evaluate(segment, t));
        expect(first.p0).toEqual(segment.p0);
        expect(endPoint(second)).toEqual(endPoint(segment));
      }),
      PROPERTY_SETTINGS,
    );
  });

  it('leaves the input segment untouched', () => {
    const original = cubic({ x: 0, y: 0 }, { x: 1, y: 2 }, { x: 3, y: 2 }, { x: 4, y: 0 });
    const snapshot = JSON.parse(JSON.stringify(original));
    splitAt(original, 0.3);
    subsegment(original, 0.2, 0.7);
    expect(original).toEqual(snapshot);
  });

  it('matches the textbook de Casteljau construction for a known cubic at t = ½', () => {
    // Hand-computed de Casteljau points (Farin 2002, de Casteljau algorithm): for
    // P = (0,0), (0,4), (4,4), (4,0) the midpoints are (0,2), (2,4), (4,2); then (1,3),
    // (3,3); then (2,3).
    const [left, right] = splitAt(cubic({ x: 0, y: 0 }, { x: 0, y: 4 }, { x: 4, y: 4 }, { x: 4, y: 0 }), 0.5);
    expect(controlPoints(left)).toEqual([{ x: 0, y: 0 }, { x: 0, y: 2 }, { x: 1, y: 3 }, { x: 2, y: 3 }]);
    expect(controlPoints(right)).toEqual([{ x: 2, y: 3 }, { x: 3, y: 3 }, { x: 4, y: 2 }, { x: 4, y: 0 }]);
  });
});

describe('sub-pieces between two parameters', () => {
  it('have end points exactly equal to the curve evaluated at t0 and t1', () => {
    fc.assert(
      fc.property(segmentArb, parameterArb, parameterArb, (segment, t0, t1) => {
        const piece = subsegment(segment, t0, t1);
        expect(samePoint(piece.p0, evaluate(segment, t0))).toBe(true);
        expect(samePoint(endPoint(piece), evaluate(segment, t1))).toBe(true);
      }),
      PROPERTY_SETTINGS,
    );
  });

  it('trace the original curve in between (also when t0 > t1, backwards)', () => {
    fc.assert(
      fc.property(segmentArb, parameterArb, parameterArb, (segment, t0, t1) => {
        const piece = subsegment(segment, t0, t1);
        const tolerance = ROUNDING * 10 * coordinateScale(controlPoints(segment));
        for (const s of SAMPLES) {
          expect(pointsClose(evaluate(piece, s), evaluate(segment, t0 + s * (t1 - t0)), 0, tolerance)).toBe(true);
        }
      }),
      PROPERTY_SETTINGS,
    );
  });

  it('cutting at several parameters gives contiguous pieces that cover the curve', () => {
    fc.assert(
      fc.property(segmentArb, fc.array(parameterArb, { maxLength: 5 }), (segment, ts) => {
        const pieces = splitAtParameters(segment, ts);
        expect(pieces.length).toBeGreaterThanOrEqual(1);
        expect(samePoint(pieces[0]?.p0, segment.p0)).toBe(true);
        expect(samePoint(endPoint(pieces[pieces.length - 1] ?? segment), endPoint(segment))).toBe(true);
        for (let i = 1; i < pieces.length; i++) {
          expect(samePoint(pieces[i]?.p0, endPoint(pieces[i - 1] ?? segment))).toBe(true);
        }
      }),
      PROPERTY_SETTINGS,
    );
  });
});
