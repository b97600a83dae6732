// Uniform cubic B-splines: designers edit a control polygon and see a C²-smooth
// outline. The Bézier conversion must be the very same curve, with no visible joins.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { CubicSegment, Point } from '../../core/geometry/index.ts';
import { derivative, evaluate, secondDerivative, uniformBSplineToBezier } from '../../core/geometry/index.ts';
import { PROPERTY_SETTINGS, pointsClose, randomPoint, seededRandom } from './support.ts';

const random = seededRandom(0xb5);
const polygon: Point[] = Array.from({ length: 8 }, () => randomPoint(random, 300));

/**
 * Independent reference: the curve Σ Dᵢ·Nᵢ,₃(u) with the Cox–de Boor recursion for the
 * basis functions on the uniform knots uⱼ = j (de Boor 1978, "A Practical Guide to
 * Splines"; Cox 1972, "The numerical evaluation of B-splines", IMA J. Appl. Math. 10).
 */
function coxDeBoorBasis(i: number, degree: number, u: number): number {
  if (degree === 0) return u >= i && u < i + 1 ? 1 : 0;
  return ((u - i) / degree) * coxDeBoorBasis(i, degree - 1, u) + ((i + degree + 1 - u) / degree) * coxDeBoorBasis(i + 1, degree - 1, u);
}
function bSplinePoint(controls: readonly Point[], u: number): Point {
  let x = 0;
  let y = 0;
  controls.forEach((d, i) => {
    const n = coxDeBoorBasis(i, 3, u);
    x += n * d.x;
    y += n * d.y;
  });
  return { x, y };
}

/** Span k of a uniform spline over `controls` covers u ∈ [k + 3, k + 4]. */
function expectSameCurve(segments: readonly CubicSegment[], controls: readonly Point[]): void {
  expect(segments).toHaveLength(controls.length - 3);
  segments.forEach((segment, k) => {
    for (const s of [0, 0.2, 0.5, 0.77, 0.999]) {
      expect(pointsClose(evaluate(segment, s), bSplinePoint(controls, k + 3 + s), 1e-12, 1e-9)).toBe(true);
    }
  });
}

/** C² joins: velocity and acceleration agree across each join (unit knot spacing everywhere). */
function expectC2Joins(segments: readonly CubicSegment[], wrap: boolean): void {
  const joins = wrap ? segments.length : segments.length - 1;
  for (let k = 0; k < joins; k++) {
    const a = segments[k] as CubicSegment;
    const b = segments[(k + 1) % segments.length] as CubicSegment;
    expect(b.p0).toEqual(a.p3);
    expect(pointsClose(derivative(a, 1), derivative(b, 0), 1e-12, 1e-9)).toBe(true);
    expect(pointsClose(secondDerivative(a, 1), secondDerivative(b, 0), 1e-12, 1e-9)).toBe(true);
  }
}

describe('uniform cubic B-spline to Bézier (thirds and halves)', () => {
  it('floating ends: the same curve as the basis-function definition, C² at every join', () => {
    const segments = uniformBSplineToBezier(polygon, { ends: 'floating' });
    expectSameCurve(segments, polygon);
    expectC2Joins(segments, false);
    const [d0, d1, d2] = polygon as [Point, Point, Point];
    expect(pointsClose(segments[0]!.p0, { x: (d0.x + 4 * d1.x + d2.x) / 6, y: (d0.y + 4 * d1.y + d2.y) / 6 }, 1e-12, 1e-9)).toBe(true);
  });

  it('closed: the periodic spline, C² everywhere including across the wrap', () => {
    const segments = uniformBSplineToBezier(polygon, { closed: true });
    expect(segments).toHaveLength(polygon.length);
    const n = polygon.length;
    const periodic = [polygon[n - 1]!, ...polygon, polygon[0]!, polygon[1]!];
    expectSameCurve(segments, periodic);
    expectC2Joins(segments, true);
  });

  it('clamped ends: starts and ends on the end control points, tangent to the end legs, with zero end curvature', () => {
    const segments = uniformBSplineToBezier(polygon);
    expect(segments).toHaveLength(polygon.length - 1);
    const n = polygon.length;
    const first = polygon[0]!;
    const last = polygon[n - 1]!;
    // Phantom points D₋₁ = 2D₀ − D₁, Dₙ = 2Dₙ₋₁ − Dₙ₋₂ (Barsky 1982), then the uniform spline.
    const extended = [
      { x: 2 * first.x - polygon[1]!.x, y: 2 * first.y - polygon[1]!.y },
      ...polygon,
      { x: 2 * last.x - polygon[n - 2]!.x, y: 2 * last.y - polygon[n - 2]!.y },
    ];
    expectSameCurve(segments, extended);
    expectC2Joins(segments, false);
    expect(segments[0]!.p0).toBe(first);
    expect(segments[segments.length - 1]!.p3).toBe(last);
    const startTangent = derivative(segments[0]!, 0);
    const leg = { x: polygon[1]!.x - first.x, y: polygon[1]!.y - first.y };
    expect(Math.abs(startTangent.x * leg.y - startTangent.y * leg.x)).toBeLessThan(1e-9 * Math.hypot(leg.x, leg.y) ** 2);
    expect(startTangent.x * leg.x + startTangent.y * leg.y).toBeGreaterThan(0);
    expect(pointsClose(secondDerivative(segments[0]!, 0), { x: 0, y: 0 }, 0, 1e-9)).toBe(true);
    expect(pointsClose(secondDerivative(segments[segments.length - 1]!, 1), { x: 0, y: 0 }, 0, 1e-9)).toBe(true);
  });

  it('is C² for any control polygon', () => {
    const pointArb = fc.record({ x: fc.double({ min: -1000, max: 1000, noNaN: true }), y: fc.double({ min: -1000, max: 1000, noNaN: true }) });
    fc.assert(
      fc.property(fc.array(pointArb, { minLength: 4, maxLength: 12 }), fc.boolean(), (controls, closed) => {
        expectC2Joins(uniformBSplineToBezier(controls, { closed }), closed);
      }),
      PROPERTY_SETTINGS,
    );
  });

  it('returns no segments for too few control points', () => {
    expect(uniformBSplineToBezier(polygon.slice(0, 3), { ends: 'floating' })).toEqual([]);
    expect(uniformBSplineToBezier(polygon.slice(0, 2), { closed: true })).toEqual([]);
    expect(uniformBSplineToBezier(polygon.slice(0, 1))).toEqual([]);
    expect(uniformBSplineToBezier(polygon.slice(0, 2))).toHaveLength(1);
  });
});
