// Arc length and its inverse: even spacing along outlines (comb teeth, sampling for
// fitting) and stem measurements depend on them.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  ARC_LENGTH_GAUSS_NODES,
  arcLength,
  arcLengthBetween,
  controlPolygonLength,
  cubic,
  distance,
  evaluate,
  gaussLegendreArcLength,
  line,
  lineToCubic,
  parameterAtArcLength,
  quad,
  quadToCubic,
  totalArcLength,
} from '../../core/geometry/index.ts';
import { PROPERTY_SETTINGS, cubicArb, parameterArb } from './support.ts';

/**
 * High-accuracy references: mpmath 1.3.0 adaptive (tanh-sinh) quadrature of |B′(t)| at
 * 40 significant digits, with the interval split at the listed points.
 */
const REFERENCES = [
  { name: 'S-curve', curve: cubic({ x: 0, y: 0 }, { x: 100, y: 300 }, { x: 200, y: -300 }, { x: 300, y: 0 }), length: 478.6082970719982265 },
  { name: 'bowl', curve: cubic({ x: 0, y: 0 }, { x: 0, y: 400 }, { x: 300, y: 700 }, { x: 600, y: 700 }), length: 1018.081560374387689 },
  // Exact cusp at t = ½ (B′(½) = 0); the length is 100·(2√2 − 1) in closed form.
  { name: 'cusp', curve: cubic({ x: 0, y: 0 }, { x: 100, y: 100 }, { x: 0, y: 100 }, { x: 100, y: 0 }), length: 100 * (2 * Math.SQRT2 - 1) },
];

describe('arc length', () => {
  it('of a straight cubic with evenly spaced controls equals the chord', () => {
    const straight = cubic({ x: 0, y: 0 }, { x: 1, y: 2 }, { x: 2, y: 4 }, { x: 3, y: 6 });
    expect(arcLength(straight)).toBeCloseTo(Math.hypot(3, 6), 12);
    expect(arcLength(line({ x: 0, y: 0 }, { x: 3, y: 4 }))).toBe(5);
    expect(arcLength(lineToCubic(line({ x: -7, y: 2 }, { x: 5, y: 11 })))).toBeCloseTo(15, 12);
  });

  it('matches high-precision references to 1e-12 relative, including across an exact cusp', () => {
    for (const { curve, length } of REFERENCES) {
      expect(Math.abs(arcLength(curve) - length) / length).toBeLessThan(1e-12);
    }
  });

  it('of a partial stretch matches a high-precision reference', () => {
    // mpmath reference for the cusp curve on [0, 0.3].
    const cusp = REFERENCES[2]?.curve ?? cubic({ x: 0, y: 0 }, { x: 0, y: 0 }, { x: 0, y: 0 }, { x: 0, y: 0 });
    expect(Math.abs(arcLengthBetween(cusp, 0, 0.3) - 78.95344447454925812) / 78.95344447454925812).toBeLessThan(1e-12);
    expect(arcLengthBetween(cusp, 0.3, 0)).toBe(arcLengthBetween(cusp, 0, 0.3));
  });

  it('with a single fixed rule is inaccurate at a cusp, which is why the adaptive one exists', () => {
    const cusp = REFERENCES[2]?.curve ?? cubic({ x: 0, y: 0 }, { x: 0, y: 0 }, { x: 0, y: 0 }, { x: 0, y: 0 });
    const fixedError = Math.abs(gaussLegendreArcLength(cusp) - 100 * (2 * Math.SQRT2 - 1));
    expect(fixedError).toBeGreaterThan(1e-6);
    expect(ARC_LENGTH_GAUSS_NODES).toBe(16);
  });

  it('of a quadratic agrees with its closed-form logarithmic length', () => {
    // Closed form for a parabola arc: for B′(t) = 2(a + b·t) with a = p1 − p0,
    // b = p0 − 2p1 + p2, L = ∫₀¹ 2|a + bt| dt, integrated analytically (e.g. Bronshtein &
    // Semendyayev, Handbook of Mathematics, integral of √(ct² + dt + e)).
    const q = quad({ x: 0, y: 0 }, { x: 50, y: 120 }, { x: 200, y: 10 });
    const a = { x: 50, y: 120 };
    const b = { x: 0 - 100 + 200, y: 0 - 240 + 10 };
    const A = 4 * (b.x * b.x + b.y * b.y);
    const B = 8 * (a.x * b.x + a.y * b.y);
    const C = 4 * (a.x * a.x + a.y * a.y);
    const F = (t: number): number => {
      const root = Math.sqrt(A * t * t + B * t + C);
      return ((2 * A * t + B) * root) / (4 * A) + ((4 * A * C - B * B) / (8 * A ** 1.5)) * Math.log(2 * Math.sqrt(A) * root + 2 * A * t + B);
    };
    const closedForm = F(1) - F(0);
    expect(Math.abs(arcLength(q) - closedForm) / closedForm).toBeLessThan(1e-12);
    expect(Math.abs(arcLength(quadToCubic(q)) - closedForm) / closedForm).toBeLessThan(1e-12);
  });

  it('never exceeds the control polygon nor falls below the chord', () => {
    fc.assert(
      fc.property(cubicArb, (c) => {
        const length = arcLength(c);
        const slack = 1e-9 * (1 + controlPolygonLength(c));
        expect(length).toBeLessThanOrEqual(controlPolygonLength(c) + slack);
        expect(length).toBeGreaterThanOrEqual(distance(c.p0, c.p3) - slack);
      }),
      PROPERTY_SETTINGS,
    );
  });

  it('adds up over pieces and over contours', () => {
    const c = REFERENCES[0]?.curve ?? cubic({ x: 0, y: 0 }, { x: 0, y: 0 }, { x: 0, y: 0 }, { x: 0, y: 0 });
    expect(arcLengthBetween(c, 0, 0.4) + arcLengthBetween(c, 0.4, 1)).toBeCloseTo(arcLength(c), 9);
    expect(totalArcLength([c, c])).toBeCloseTo(2 * arcLength(c), 9);
  });
});

describe('parameter at a given arc length', () => {
  it('round-trips: the length up to t(s) is s', () => {
    fc.assert(
      fc.property(cubicArb, parameterArb, (c, fraction) => {
        const total = arcLength(c);
        const s = fraction * total;
        const t = parameterAtArcLength(c, s);
        expect(t).toBeGreaterThanOrEqual(0);
        expect(t).toBeLessThanOrEqual(1);
        expect(Math.abs(arcLengthBetween(c, 0, t) - s)).toBeLessThanOrEqual(1e-9 * (1 + controlPolygonLength(c)));
      }),
      { ...PROPERTY_SETTINGS, numRuns: 200 },
    );
  });

  it('is linear along a straight cubic with even controls, and clamps outside [0, L]', () => {
    const straight = cubic({ x: 0, y: 0 }, { x: 10, y: 0 }, { x: 20, y: 0 }, { x: 30, y: 0 });
    expect(parameterAtArcLength(straight, 12)).toBeCloseTo(0.4, 12);
    expect(evaluate(straight, parameterAtArcLength(straight, 12)).x).toBeCloseTo(12, 10);
    expect(parameterAtArcLength(straight, -5)).toBe(0);
    expect(parameterAtArcLength(straight, 99)).toBe(1);
  });

  it('steps across a cusp, where the speed is zero', () => {
    const cusp = REFERENCES[2]?.curve ?? cubic({ x: 0, y: 0 }, { x: 0, y: 0 }, { x: 0, y: 0 }, { x: 0, y: 0 });
    const half = arcLength(cusp) / 2;
    expect(parameterAtArcLength(cusp, half)).toBeCloseTo(0.5, 7);
    expect(parameterAtArcLength(cusp, 78.95344447454925812)).toBeCloseTo(0.3, 10);
  });
});
