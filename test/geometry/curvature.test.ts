// Curvature, combs and inflections: what a type designer reads to judge whether a
// curve is smooth, so signs and sides must be right.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Bezier } from 'bezier-js';
import type { CubicSegment } from '../../core/geometry/index.ts';
import {
  cross,
  cubic,
  curvature,
  curvatureComb,
  derivative,
  dot,
  inflectionParameters,
  line,
  quad,
  secondDerivative,
  sub,
  velocityCrossAcceleration,
  evaluatePolynomial,
} from '../../core/geometry/index.ts';
import { PROPERTY_SETTINGS, cubicArb, parameterArb, randomCubic, seededRandom } from './support.ts';

const sCurve = cubic({ x: 0, y: 0 }, { x: 100, y: 300 }, { x: 200, y: -300 }, { x: 300, y: 0 });
/** cross(B′, B″) from the derivative functions, independent of the polynomial form. */
const crossAt = (c: CubicSegment, t: number): number => cross(derivative(c, t), secondDerivative(c, t));

describe('curvature', () => {
  it('is zero along straight segments and NaN where the velocity vanishes (cusp)', () => {
    expect(curvature(line({ x: 0, y: 0 }, { x: 5, y: 1 }), 0.4)).toBe(0);
    const cusp = cubic({ x: 0, y: 0 }, { x: 100, y: 100 }, { x: 0, y: 100 }, { x: 100, y: 0 });
    expect(curvature(cusp, 0.5)).toBeNaN();
    expect(curvatureComb(cusp, { samples: 3 }).map((tooth) => tooth.t)).toEqual([0, 1]);
  });

  it('of a parabola at its vertex is 2a for y = a·x²', () => {
    // Curvature of y = a·x² at 0 is 2a (standard calculus result κ = y″/(1 + y′²)^{3/2}).
    // Quadratic (−1, 1), (0, −1), (1, 1) traces y = x² with x = 2t − 1.
    expect(curvature(quad({ x: -1, y: 1 }, { x: 0, y: -1 }, { x: 1, y: 1 }), 0.5)).toBeCloseTo(2, 12);
  });

  it('polynomial B′ × B″ matches the cross product of the derivatives at every t', () => {
    fc.assert(
      fc.property(cubicArb, parameterArb, (c, t) => {
        const direct = crossAt(c, t);
        const scale = Math.hypot(derivative(c, t).x, derivative(c, t).y) ** 2 + 1;
        const magnitude = Math.max(1, ...[c.p0, c.p1, c.p2, c.p3].map((p) => Math.hypot(p.x, p.y))) ** 2;
        expect(Math.abs(evaluatePolynomial(velocityCrossAcceleration(c), t) - direct)).toBeLessThanOrEqual(1e-9 * (magnitude + scale));
      }),
      PROPERTY_SETTINGS,
    );
  });
});

describe('inflections', () => {
  it('of a point-symmetric S-curve is its centre, t = ½, where cross(B′, B″) changes sign', () => {
    const found = inflectionParameters(sCurve);
    expect(found).toHaveLength(1);
    expect(found[0]).toBeCloseTo(0.5, 14);
    expect(Math.sign(crossAt(sCurve, 0.49))).toBe(-Math.sign(crossAt(sCurve, 0.51)));
  });

  it('agree with bezier-js’s inflection finder on random cubics', () => {
    // bezier-js 6.1.4 Bezier.inflections(): roots of the aligned curve's cross term.
    const random = seededRandom(0x1f1ec7);
    let compared = 0;
    for (let i = 0; i < 500; i++) {
      const c = randomCubic(random, 500);
      const theirs = new Bezier(c.p0.x, c.p0.y, c.p1.x, c.p1.y, c.p2.x, c.p2.y, c.p3.x, c.p3.y)
        .inflections()
        .filter((t) => t > 1e-6 && t < 1 - 1e-6)
        .sort((a, b) => a - b);
      const ours = inflectionParameters(c).filter((t) => t > 1e-6 && t < 1 - 1e-6);
      // Skip near-double roots, where a sign change is not resolvable by either.
      if (ours.length === 2 && Math.abs((ours[1] ?? 0) - (ours[0] ?? 0)) < 1e-4) continue;
      compared++;
      expect(ours.length).toBe(theirs.length);
      ours.forEach((t, j) => expect(t).toBeCloseTo(theirs[j] ?? Number.NaN, 6));
    }
    expect(compared).toBeGreaterThan(450);
  });

  it('are exactly where the bending changes side: none missed, none invented', () => {
    fc.assert(
      fc.property(cubicArb, (c) => {
        const found = inflectionParameters(c);
        const magnitude = Math.max(1, ...[c.p0, c.p1, c.p2, c.p3].map((p) => Math.hypot(p.x, p.y))) ** 2;
        const negligible = 1e-9 * magnitude;
        for (const t of found) {
          // A sign change across each reported parameter…
          const before = crossAt(c, Math.max(0, t - 1e-6));
          const after = crossAt(c, Math.min(1, t + 1e-6));
          if (Math.abs(before) > negligible && Math.abs(after) > negligible) expect(Math.sign(before)).toBe(-Math.sign(after));
        }
        // …and none between them.
        const cuts = [0, ...found, 1];
        for (let i = 0; i + 1 < cuts.length; i++) {
          const a = cuts[i] ?? 0;
          const b = cuts[i + 1] ?? 1;
          const signs = new Set<number>();
          for (let k = 1; k < 50; k++) {
            const value = crossAt(c, a + ((b - a) * k) / 50);
            if (Math.abs(value) > negligible) signs.add(Math.sign(value));
          }
          expect(signs.size).toBeLessThanOrEqual(1);
        }
      }),
      PROPERTY_SETTINGS,
    );
  });

  it('do not exist for lines and quadratics', () => {
    expect(inflectionParameters(line({ x: 0, y: 0 }, { x: 1, y: 1 }))).toEqual([]);
    expect(inflectionParameters(quad({ x: 0, y: 0 }, { x: 1, y: 3 }, { x: 2, y: 0 }))).toEqual([]);
  });
});

describe('curvature comb', () => {
  it('puts teeth on the convex side: tip − point = −N·κ·scale, away from the centre of curvature', () => {
    for (const tooth of curvatureComb(sCurve, { samples: 41, scale: 1000 })) {
      const offset = sub(tooth.tip, tooth.point);
      // Along the normal, by −κ·scale exactly (within rounding).
      expect(dot(offset, tooth.normal)).toBeCloseTo(-tooth.curvature * 1000, 9);
      // The centre of curvature is point + N/κ; the tip is further from it than the point.
      if (Math.abs(tooth.curvature) > 1e-9) {
        const centre = { x: tooth.point.x + tooth.normal.x / tooth.curvature, y: tooth.point.y + tooth.normal.y / tooth.curvature };
        expect(Math.hypot(tooth.tip.x - centre.x, tooth.tip.y - centre.y)).toBeGreaterThan(
          Math.hypot(tooth.point.x - centre.x, tooth.point.y - centre.y),
        );
      }
    }
  });

  it('flips sides at the inflection of an S-curve', () => {
    const teeth = curvatureComb(sCurve, { samples: 11, scale: 1 });
    const first = teeth[1];
    const last = teeth[9];
    expect(first?.curvature).toBeLessThan(0);
    expect(last?.curvature).toBeGreaterThan(0);
    expect(teeth).toHaveLength(11);
    expect(teeth[0]?.t).toBe(0);
    expect(teeth[10]?.t).toBe(1);
  });

  it('uses the left unit normal (tangent turned +90°)', () => {
    const [tooth] = curvatureComb(cubic({ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 2, y: 1 }, { x: 3, y: 3 }), { samples: 2 });
    expect(tooth?.normal.x).toBeCloseTo(0, 15);
    expect(tooth?.normal.y).toBeCloseTo(1, 15);
  });
});
