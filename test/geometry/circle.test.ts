// The standard four-arc cubic approximation of a circle, handle length k·r with
// k = 4/3·(√2 − 1) ≈ 0.5523, chosen so that each arc's midpoint lies on the circle.
// Its published maximum radial error is ≈ 2.7e-4·r, attained twice per arc, with the
// curve never inside the circle (Goldapp 1991, "Approximation of circular arcs by
// cubic polynomials", Computer Aided Geometric Design 8(3); Dokken, Dæhlen, Lyche &
// Mørken 1990, "Good approximation of circles by curvature-continuous Bézier curves",
// Computer Aided Geometric Design 7). Round letters (O, o, e, c) are built on it, so
// evaluation, area, arc length and curvature are all checked against it.
import { describe, expect, it } from 'vitest';
import type { CubicSegment, Point } from '../../core/geometry/index.ts';
import {
  arcLength,
  cubic,
  curvature,
  curvatureComb,
  distance,
  evaluate,
  reverseSegment,
  signedArea,
} from '../../core/geometry/index.ts';

/** Handle factor 4/3·(√2 − 1) of the standard approximation (Goldapp 1991). */
const K = (4 / 3) * (Math.SQRT2 - 1);
const RADIUS = 250;
const CENTRE: Point = { x: 120, y: -40 };

/** Counter-clockwise (y-up) four-arc circle starting at angle 0. */
function fourArcCircle(centre: Point, r: number): CubicSegment[] {
  const at = (x: number, y: number): Point => ({ x: centre.x + x * r, y: centre.y + y * r });
  return [
    cubic(at(1, 0), at(1, K), at(K, 1), at(0, 1)),
    cubic(at(0, 1), at(-K, 1), at(-1, K), at(-1, 0)),
    cubic(at(-1, 0), at(-1, -K), at(-K, -1), at(0, -1)),
    cubic(at(0, -1), at(K, -1), at(1, -K), at(1, 0)),
  ];
}

const circle = fourArcCircle(CENTRE, RADIUS);
const quarter = circle[0] as CubicSegment;
const DENSE = 20001;

describe('four-arc circle approximation', () => {
  it('deviates from the true circle by at most the published 2.7e-4·r, and never lies inside it', () => {
    let maxError = 0;
    let minError = Infinity;
    for (const arc of circle) {
      for (let i = 0; i < DENSE; i++) {
        const radialError = distance(evaluate(arc, i / (DENSE - 1)), CENTRE) / RADIUS - 1;
        maxError = Math.max(maxError, radialError);
        minError = Math.min(minError, radialError);
      }
    }
    // Published maximum ≈ 2.7253e-4 (Goldapp 1991; Dokken et al. 1990).
    expect(maxError).toBeGreaterThan(2.6e-4);
    expect(maxError).toBeLessThan(2.8e-4);
    expect(minError).toBeGreaterThan(-1e-15);
  });

  it('passes exactly through the 45° points (the condition that defines k)', () => {
    for (const arc of circle) {
      expect(Math.abs(distance(evaluate(arc, 0.5), CENTRE) - RADIUS)).toBeLessThan(1e-12 * RADIUS);
    }
  });

  it('encloses the closed-form area r²(2 + 12k/5 − 3k²/5) by Green’s theorem', () => {
    // Closed form derived by integrating ½∮(x dy − y dx) over the four arcs in terms
    // of k symbolically; ≈ 3.14247·r², 0.028% above πr².
    const expected = RADIUS * RADIUS * (2 + (12 * K) / 5 - (3 * K * K) / 5);
    expect(signedArea(circle)).toBeCloseTo(expected, 9);
    expect(signedArea(circle) / (Math.PI * RADIUS * RADIUS) - 1).toBeCloseTo(2.8e-4, 5);
  });

  it('has a quarter-arc length just above π/2·r, by the amount high-precision quadrature gives', () => {
    const length = arcLength(quarter);
    // The curve lies outside the circle by ≤ 2.8e-4·r, so π/2·r ≤ L ≤ π/2·r·(1 + 2.8e-4).
    expect(length).toBeGreaterThan((Math.PI / 2) * RADIUS);
    expect(length).toBeLessThan((Math.PI / 2) * RADIUS * (1 + 2.8e-4));
    // Reference 1.57101669807385565… per unit radius: mpmath 1.3.0 adaptive quadrature at
    // 30 significant digits of |B′(t)| for the unit quarter arc.
    expect(Math.abs(length / RADIUS - 1.5710166980738556) / 1.5710166980738556).toBeLessThan(1e-12);
  });

  it('has curvature within 2.2% of 1/r everywhere, with the closed-form values at the ends and the middle', () => {
    for (let i = 0; i <= 100; i++) {
      const kr = curvature(quarter, i / 100) * RADIUS;
      expect(kr).toBeGreaterThan(0.978);
      expect(kr).toBeLessThan(1.009);
    }
    // κ(0) = 2(1 − k)/(3k²r) and κ(½) = 8√2·k/(3(2 − k)²r), from κ = (B′ × B″)/|B′|³ of
    // the unit quarter arc evaluated symbolically.
    expect(curvature(quarter, 0) * RADIUS).toBeCloseTo((2 * (1 - K)) / (3 * K * K), 12);
    expect(curvature(quarter, 0.5) * RADIUS).toBeCloseTo((8 * Math.SQRT2 * K) / (3 * (2 - K) ** 2), 12);
  });

  it('curvature is negative for the clockwise circle, and comb teeth point outwards either way', () => {
    const clockwise = circle.map((arc) => reverseSegment(arc)).reverse();
    expect(curvature(clockwise[0] as CubicSegment, 0.3)).toBeLessThan(0);
    expect(signedArea(clockwise)).toBeLessThan(0);
    for (const contour of [circle, clockwise]) {
      for (const arc of contour) {
        for (const tooth of curvatureComb(arc, { samples: 17, scale: 50 * RADIUS })) {
          // Teeth stand on the convex side: away from the centre of curvature.
          expect(distance(tooth.tip, CENTRE)).toBeGreaterThan(distance(tooth.point, CENTRE) + 40);
        }
      }
    }
  });
});
