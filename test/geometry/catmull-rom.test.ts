// Catmull–Rom splines: the quick smooth curve through clicked or traced points. Users
// notice at once if it misses a point or kinks at one.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { Point } from '../../core/geometry/index.ts';
import {
  CATMULL_ROM_CENTRIPETAL,
  CATMULL_ROM_CHORDAL,
  CATMULL_ROM_UNIFORM,
  catmullRomToBezier,
  derivative,
  distance,
  evaluate,
} from '../../core/geometry/index.ts';
import { PROPERTY_SETTINGS, pointsClose, randomPoint, seededRandom } from './support.ts';

const random = seededRandom(0xca7);
const points: Point[] = Array.from({ length: 9 }, () => randomPoint(random, 400));

/**
 * Independent reference: the Barry–Goldman pyramid (Barry & Goldman 1988, "A recursive
 * evaluation algorithm for a class of Catmull–Rom splines", SIGGRAPH '88; as written in
 * Yuksel, Schaefer & Keyser 2011) at knot parameter t ∈ [t1, t2].
 */
function barryGoldman(p: readonly [Point, Point, Point, Point], alpha: number, s: number): Point {
  const [p0, p1, p2, p3] = p;
  const t0 = 0;
  const t1 = t0 + distance(p0, p1) ** alpha;
  const t2 = t1 + distance(p1, p2) ** alpha;
  const t3 = t2 + distance(p2, p3) ** alpha;
  const t = t1 + s * (t2 - t1);
  const mix = (a: Point, b: Point, ta: number, tb: number): Point => ({
    x: ((tb - t) / (tb - ta)) * a.x + ((t - ta) / (tb - ta)) * b.x,
    y: ((tb - t) / (tb - ta)) * a.y + ((t - ta) / (tb - ta)) * b.y,
  });
  const a1 = mix(p0, p1, t0, t1);
  const a2 = mix(p1, p2, t1, t2);
  const a3 = mix(p2, p3, t2, t3);
  const b1 = mix(a1, a2, t0, t2);
  const b2 = mix(a2, a3, t1, t3);
  return mix(b1, b2, t1, t2);
}

describe('Catmull–Rom splines', () => {
  it('pass through every input point, open and closed, for every parameterisation', () => {
    for (const alpha of [CATMULL_ROM_UNIFORM, CATMULL_ROM_CENTRIPETAL, CATMULL_ROM_CHORDAL]) {
      const open = catmullRomToBezier(points, { alpha });
      expect(open).toHaveLength(points.length - 1);
      open.forEach((segment, i) => {
        expect(segment.p0).toBe(points[i]);
        expect(segment.p3).toBe(points[i + 1]);
      });
      const closed = catmullRomToBezier(points, { alpha, closed: true });
      expect(closed).toHaveLength(points.length);
      closed.forEach((segment, i) => {
        expect(segment.p0).toBe(points[i]);
        expect(segment.p3).toBe(points[(i + 1) % points.length]);
      });
    }
  });

  it('uniform: the tangent at each interior point is (P[i+1] − P[i−1])/2, from both sides', () => {
    // Catmull & Rom 1974: the classical (uniform) spline's tangent rule.
    const segments = catmullRomToBezier(points, { alpha: CATMULL_ROM_UNIFORM });
    for (let i = 1; i < points.length - 1; i++) {
      const before = points[i - 1] as Point;
      const after = points[i + 1] as Point;
      const expected = { x: (after.x - before.x) / 2, y: (after.y - before.y) / 2 };
      const outgoing = segments[i];
      const incoming = segments[i - 1];
      if (!outgoing || !incoming) throw new Error('missing segment');
      expect(pointsClose(derivative(outgoing, 0), expected, 1e-12, 1e-9)).toBe(true);
      expect(pointsClose(derivative(incoming, 1), expected, 1e-12, 1e-9)).toBe(true);
    }
  });

  it('uniform closed: the same tangent rule holds across the wrap', () => {
    const segments = catmullRomToBezier(points, { alpha: CATMULL_ROM_UNIFORM, closed: true });
    const n = points.length;
    const expected = { x: ((points[1]?.x ?? 0) - (points[n - 1]?.x ?? 0)) / 2, y: ((points[1]?.y ?? 0) - (points[n - 1]?.y ?? 0)) / 2 };
    expect(pointsClose(derivative(segments[0]!, 0), expected, 1e-12, 1e-9)).toBe(true);
    expect(pointsClose(derivative(segments[n - 1]!, 1), expected, 1e-12, 1e-9)).toBe(true);
  });

  it('uniform open: end tangents come from reflected phantom points, P1 − P0 at the start', () => {
    const segments = catmullRomToBezier(points, { alpha: CATMULL_ROM_UNIFORM });
    const expected = { x: (points[1]?.x ?? 0) - (points[0]?.x ?? 0), y: (points[1]?.y ?? 0) - (points[0]?.y ?? 0) };
    expect(pointsClose(derivative(segments[0]!, 0), expected, 1e-12, 1e-9)).toBe(true);
  });

  it('centripetal and chordal segments equal the Barry–Goldman evaluation of the same points', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(CATMULL_ROM_UNIFORM, CATMULL_ROM_CENTRIPETAL, CATMULL_ROM_CHORDAL),
        fc.integer({ min: 1, max: points.length - 3 }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (alpha, i, s) => {
          const segment = catmullRomToBezier(points, { alpha })[i];
          if (!segment) throw new Error('missing segment');
          const window = [points[i - 1], points[i], points[i + 1], points[i + 2]] as [Point, Point, Point, Point];
          expect(pointsClose(evaluate(segment, s), barryGoldman(window, alpha, s), 1e-9, 1e-7)).toBe(true);
        },
      ),
      PROPERTY_SETTINGS,
    );
  });

  it('skip repeated points instead of producing NaN handles, and need two distinct points', () => {
    const withRepeats = [points[0]!, points[0]!, points[1]!, points[2]!, points[2]!];
    const segments = catmullRomToBezier(withRepeats);
    expect(segments).toHaveLength(2);
    for (const s of segments) for (const p of [s.p1, s.p2]) expect(Number.isFinite(p.x) && Number.isFinite(p.y)).toBe(true);
    expect(catmullRomToBezier([points[0]!, points[0]!])).toEqual([]);
    expect(catmullRomToBezier([])).toEqual([]);
  });
});
