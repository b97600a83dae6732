// Degree elevation must be exact: the font stores cubics only, and a straight stem or
// a quadratic bowl converted to a cubic must not move by even a rounding error's worth
// beyond the conversion itself, at any parameter.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  controlPoints,
  derivative,
  evaluate,
  lineToCubic,
  quad,
  quadToCubic,
  toCubic,
} from '../../core/geometry/index.ts';
import { PROPERTY_SETTINGS, coordinateScale, cubicArb, lineArb, parameterArb, pointsClose, quadArb } from './support.ts';

const ROUNDING = 1e-12;

describe('degree elevation', () => {
  it('a quadratic raised to a cubic has the same point and velocity at every t', () => {
    fc.assert(
      fc.property(quadArb, parameterArb, (q, t) => {
        const c = quadToCubic(q);
        const tolerance = ROUNDING * coordinateScale(controlPoints(q));
        expect(pointsClose(evaluate(c, t), evaluate(q, t), 0, tolerance)).toBe(true);
        expect(pointsClose(derivative(c, t), derivative(q, t), 0, 10 * tolerance)).toBe(true);
        expect(c.p0).toBe(q.p0);
        expect(c.p3).toBe(q.p2);
      }),
      PROPERTY_SETTINGS,
    );
  });

  it('a line raised to a cubic has the same point at every t (uniform speed preserved)', () => {
    fc.assert(
      fc.property(lineArb, parameterArb, (l, t) => {
        const c = lineToCubic(l);
        const tolerance = ROUNDING * coordinateScale(controlPoints(l));
        expect(pointsClose(evaluate(c, t), evaluate(l, t), 0, tolerance)).toBe(true);
        expect(pointsClose(derivative(c, t), derivative(l, t), 0, 10 * tolerance)).toBe(true);
      }),
      PROPERTY_SETTINGS,
    );
  });

  it('uses the published control points c1 = p0 + ⅔(p1 − p0), c2 = p2 + ⅔(p1 − p2)', () => {
    // Forrest 1972 / Farin 2002, degree elevation: bᵢ⁽¹⁾ = (i/(n+1))bᵢ₋₁ + (1 − i/(n+1))bᵢ.
    const c = quadToCubic(quad({ x: 0, y: 0 }, { x: 3, y: 6 }, { x: 6, y: 0 }));
    expect(c.p1).toEqual({ x: 2, y: 4 });
    expect(c.p2).toEqual({ x: 4, y: 4 });
  });

  it('leaves cubics as they are', () => {
    fc.assert(
      fc.property(cubicArb, (c) => {
        expect(toCubic(c)).toBe(c);
      }),
      PROPERTY_SETTINGS,
    );
  });
});
