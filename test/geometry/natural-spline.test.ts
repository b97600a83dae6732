// Natural cubic spline interpolation: curvature-continuous curves through points,
// the smoothest thing a designer can ask for. Kinks in curvature are visible in the
// comb, so C² is checked at every knot in the spline's own parameter units.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { CubicSegment, Point } from '../../core/geometry/index.ts';
import { derivative, evaluate, naturalSpline, secondDerivative } from '../../core/geometry/index.ts';
import type { SplineParameterization } from '../../core/geometry/index.ts';
import { PROPERTY_SETTINGS, pointsClose, randomPoint, seededRandom } from './support.ts';

const random = seededRandom(0x5911e);
const points: Point[] = Array.from({ length: 10 }, () => randomPoint(random, 500));

const scaleBy = (v: Point, f: number): Point => ({ x: v.x * f, y: v.y * f });

/**
 * Checks C¹ and C² at each join in the knot parameter u: on segment i, d/du = (1/hᵢ)d/dt,
 * so velocities are compared as B′/h and accelerations as B″/h².
 */
function expectC2(segments: readonly CubicSegment[], intervals: readonly number[], wrap: boolean): void {
  const joins = wrap ? segments.length : segments.length - 1;
  for (let i = 0; i < joins; i++) {
    const j = (i + 1) % segments.length;
    const a = segments[i]!;
    const b = segments[j]!;
    const ha = intervals[i]!;
    const hb = intervals[j]!;
    const magnitude = Math.max(1, Math.hypot(derivative(a, 1).x / ha, derivative(a, 1).y / ha));
    expect(pointsClose(scaleBy(derivative(a, 1), 1 / ha), scaleBy(derivative(b, 0), 1 / hb), 1e-9, 1e-9 * magnitude)).toBe(true);
    const left = scaleBy(secondDerivative(a, 1), 1 / (ha * ha));
    const right = scaleBy(secondDerivative(b, 0), 1 / (hb * hb));
    const accelerationScale = Math.max(1e-3, Math.hypot(left.x, left.y));
    expect(pointsClose(left, right, 1e-8, 1e-9 * accelerationScale)).toBe(true);
  }
}

describe('natural cubic splines', () => {
  for (const parameterization of ['chord-length', 'uniform'] as SplineParameterization[]) {
    it(`open (${parameterization}): interpolates every point exactly, C² at interior knots, S″ = 0 at both ends`, () => {
      const { segments, intervals } = naturalSpline(points, { parameterization });
      expect(segments).toHaveLength(points.length - 1);
      segments.forEach((s, i) => {
        expect(s.p0).toBe(points[i]);
        expect(s.p3).toBe(points[i + 1]);
      });
      expectC2(segments, intervals, false);
      const first = segments[0]!;
      const last = segments[segments.length - 1]!;
      expect(pointsClose(secondDerivative(first, 0), { x: 0, y: 0 }, 0, 1e-9)).toBe(true);
      expect(pointsClose(secondDerivative(last, 1), { x: 0, y: 0 }, 0, 1e-9)).toBe(true);
    });

    it(`closed (${parameterization}): interpolates every point and is C² everywhere, including the wrap`, () => {
      const { segments, intervals } = naturalSpline(points, { closed: true, parameterization });
      expect(segments).toHaveLength(points.length);
      segments.forEach((s, i) => {
        expect(s.p0).toBe(points[i]);
        expect(s.p3).toBe(points[(i + 1) % points.length]);
      });
      expectC2(segments, intervals, true);
    });
  }

  it('uses chord lengths as knot spacing by default', () => {
    const { intervals } = naturalSpline(points);
    intervals.forEach((h, i) => expect(h).toBeCloseTo(Math.hypot(points[i + 1]!.x - points[i]!.x, points[i + 1]!.y - points[i]!.y), 12));
  });

  it('reproduces the published natural spline for eˣ at x = 0, 1, 2, 3', () => {
    // Burden & Faires, "Numerical Analysis" (9th ed., 2011), §3.5 example, coefficients
    // aⱼ + bⱼ(x − xⱼ) + cⱼ(x − xⱼ)² + dⱼ(x − xⱼ)³ to five decimals.
    const published = [
      [1, 1.466, 0, 0.25228],
      [2.71828, 2.22285, 0.75685, 1.69107],
      [7.38906, 8.80977, 5.83007, -1.94336],
    ];
    const data = [0, 1, 2, 3].map((x) => ({ x, y: Math.exp(x) }));
    const { segments } = naturalSpline(data, { parameterization: 'uniform' });
    segments.forEach((segment, j) => {
      // x(u) = u exactly (a natural spline reproduces linear data), so the y-polynomial
      // in local t is the published one in (x − xⱼ); its Taylor coefficients at t = 0:
      const y0 = evaluate(segment, 0).y;
      const y1 = derivative(segment, 0).y;
      const y2 = secondDerivative(segment, 0).y / 2;
      const y3 = (secondDerivative(segment, 1).y - secondDerivative(segment, 0).y) / 6;
      const expected = published[j]!;
      [y0, y1, y2, y3].forEach((value, k) => expect(Math.abs(value - expected[k]!)).toBeLessThan(1e-5));
      expect(evaluate(segment, 0.5).x).toBeCloseTo(j + 0.5, 12);
    });
  });

  it('is C² for arbitrary point sets, open and closed', () => {
    const pointArb = fc.record({ x: fc.integer({ min: -1000, max: 1000 }), y: fc.integer({ min: -1000, max: 1000 }) });
    fc.assert(
      fc.property(fc.array(pointArb, { minLength: 3, maxLength: 12 }), fc.boolean(), (pts, closed) => {
        const { segments, intervals } = naturalSpline(pts, { closed });
        expectC2(segments, intervals, closed);
        for (const s of segments) for (const p of [s.p1, s.p2]) expect(Number.isFinite(p.x) && Number.isFinite(p.y)).toBe(true);
      }),
      PROPERTY_SETTINGS,
    );
  });

  it('handles degenerate inputs: repeats removed, two points give a straight segment, too few give nothing', () => {
    const two = naturalSpline([{ x: 0, y: 0 }, { x: 0, y: 0 }, { x: 3, y: 3 }]);
    expect(two.segments).toHaveLength(1);
    expect(evaluate(two.segments[0]!, 0.5)).toEqual({ x: 1.5, y: 1.5 });
    expect(naturalSpline([{ x: 1, y: 1 }]).segments).toEqual([]);
    expect(naturalSpline([{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 0, y: 0 }], { closed: true }).segments).toEqual([]);
  });
});
