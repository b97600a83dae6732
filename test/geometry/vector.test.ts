// Vector basics: every other module rests on these, so their conventions (cross
// product sign, perpendicular direction, exact interpolation ends) are pinned down.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  add,
  cross,
  distance,
  dot,
  length,
  lerp,
  midpoint,
  negate,
  normalize,
  perpendicular,
  pointsEqual,
  rotate,
  scale,
  squaredDistance,
  sub,
} from '../../core/geometry/index.ts';
import { PROPERTY_SETTINGS, pointArb } from './support.ts';

describe('vectors', () => {
  it('follow the y-up conventions: cross(x̂, ŷ) = +1 and perpendicular turns counter-clockwise', () => {
    expect(cross({ x: 1, y: 0 }, { x: 0, y: 1 })).toBe(1);
    expect(perpendicular({ x: 1, y: 0 })).toEqual({ x: -0, y: 1 });
    const turned = rotate({ x: 1, y: 0 }, Math.PI / 2);
    expect(turned.x).toBeCloseTo(0, 15);
    expect(turned.y).toBeCloseTo(1, 15);
  });

  it('do the arithmetic they promise', () => {
    expect(add({ x: 1, y: 2 }, { x: 3, y: 4 })).toEqual({ x: 4, y: 6 });
    expect(sub({ x: 1, y: 2 }, { x: 3, y: 5 })).toEqual({ x: -2, y: -3 });
    expect(scale({ x: 1, y: -2 }, 3)).toEqual({ x: 3, y: -6 });
    expect(negate({ x: 1, y: -2 })).toEqual({ x: -1, y: 2 });
    expect(dot({ x: 1, y: 2 }, { x: 3, y: 4 })).toBe(11);
    expect(length({ x: 3, y: 4 })).toBe(5);
    expect(distance({ x: 1, y: 1 }, { x: 4, y: 5 })).toBe(5);
    expect(squaredDistance({ x: 1, y: 1 }, { x: 4, y: 5 })).toBe(25);
    expect(midpoint({ x: 0, y: 0 }, { x: 2, y: 4 })).toEqual({ x: 1, y: 2 });
    expect(pointsEqual({ x: 1, y: 1 }, { x: 1 + 1e-9, y: 1 }, 1e-6)).toBe(true);
    expect(pointsEqual({ x: 1, y: 1 }, { x: 1 + 1e-9, y: 1 })).toBe(false);
  });

  it('normalise to unit length, leaving the zero vector as zero instead of NaN', () => {
    fc.assert(
      fc.property(pointArb, (v) => {
        fc.pre(length(v) > 1e-100);
        expect(length(normalize(v))).toBeCloseTo(1, 14);
      }),
      PROPERTY_SETTINGS,
    );
    expect(normalize({ x: 0, y: 0 })).toEqual({ x: 0, y: 0 });
  });

  it('interpolate with exact end points and never mutate inputs', () => {
    fc.assert(
      fc.property(pointArb, pointArb, (a, b) => {
        const frozenA = Object.freeze({ ...a });
        const frozenB = Object.freeze({ ...b });
        const start = lerp(frozenA, frozenB, 0);
        const end = lerp(frozenA, frozenB, 1);
        expect(start.x === a.x && start.y === a.y).toBe(true);
        expect(end.x === b.x && end.y === b.y).toBe(true);
      }),
      PROPERTY_SETTINGS,
    );
  });
});
