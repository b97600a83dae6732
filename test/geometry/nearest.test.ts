// Nearest point on a curve: what the editor selects when a designer clicks near an
// outline, and how fitting error is measured. It must find the global minimum, even
// when the distance has several local minima.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { Point, Segment } from '../../core/geometry/index.ts';
import {
  cubic,
  distance,
  evaluate,
  line,
  nearestPoint,
  nearestPointOnSegments,
  quad,
} from '../../core/geometry/index.ts';
import { PROPERTY_SETTINGS, pointArb, randomCubic, randomPoint, seededRandom, segmentArb } from './support.ts';

/** Dense samples for the brute-force reference. */
const BRUTE_FORCE_SAMPLES = 2001;
/** Golden-section iterations: 0.618⁸⁰ ≈ 2e-17 of the bracket, i.e. to rounding. */
const GOLDEN_ITERATIONS = 80;
const INVERSE_GOLDEN_RATIO = (Math.sqrt(5) - 1) / 2;

/**
 * Independent reference: sample densely, then refine every sampled local minimum (and
 * the ends) by golden-section search on its neighbouring interval (Kiefer 1953,
 * "Sequential minimax search for a maximum", Proc. Amer. Math. Soc. 4).
 */
function bruteForceNearest(segment: Segment, query: Point): { distance: number; localMinima: number } {
  const d = (t: number): number => distance(evaluate(segment, t), query);
  const n = BRUTE_FORCE_SAMPLES;
  const values = Array.from({ length: n }, (_, i) => d(i / (n - 1)));
  let best = Math.min(values[0] ?? Infinity, values[n - 1] ?? Infinity);
  let localMinima = 0;
  for (let i = 0; i < n; i++) {
    const here = values[i] ?? Infinity;
    const left = values[i - 1] ?? Infinity;
    const right = values[i + 1] ?? Infinity;
    if (here > left || here > right) continue;
    localMinima++;
    let a = Math.max(0, (i - 1) / (n - 1));
    let b = Math.min(1, (i + 1) / (n - 1));
    let c = b - INVERSE_GOLDEN_RATIO * (b - a);
    let e = a + INVERSE_GOLDEN_RATIO * (b - a);
    let dc = d(c);
    let de = d(e);
    for (let k = 0; k < GOLDEN_ITERATIONS; k++) {
      if (dc < de) {
        b = e;
        e = c;
        de = dc;
        c = b - INVERSE_GOLDEN_RATIO * (b - a);
        dc = d(c);
      } else {
        a = c;
        c = e;
        dc = de;
        e = a + INVERSE_GOLDEN_RATIO * (b - a);
        de = d(e);
      }
    }
    best = Math.min(best, d((a + b) / 2), here);
  }
  return { distance: best, localMinima };
}

describe('nearest point on a segment', () => {
  it('is never further than brute-force dense sampling with local refinement (random curves and points)', () => {
    const random = seededRandom(0xc0ffee);
    for (let i = 0; i < 300; i++) {
      const c = randomCubic(random, 500);
      const query = randomPoint(random, 700);
      const ours = nearestPoint(c, query);
      const reference = bruteForceNearest(c, query);
      expect(ours.distance).toBeLessThanOrEqual(reference.distance + 1e-9);
      expect(ours.distance).toBeCloseTo(distance(ours.point, query), 9);
      expect(ours.point).toEqual(evaluate(c, ours.t));
    }
  });

  it('holds for any kind of segment, including degenerate ones fast-check invents', () => {
    fc.assert(
      fc.property(segmentArb, pointArb, (segment, query) => {
        const ours = nearestPoint(segment, query);
        const reference = bruteForceNearest(segment, query);
        expect(ours.t).toBeGreaterThanOrEqual(0);
        expect(ours.t).toBeLessThanOrEqual(1);
        expect(ours.distance).toBeLessThanOrEqual(reference.distance + 1e-9 * (1 + reference.distance));
      }),
      { ...PROPERTY_SETTINGS, numRuns: 200 },
    );
  });

  it('picks the global minimum when the distance has several local minima (S-curve, two lobes)', () => {
    const s = cubic({ x: 0, y: 0 }, { x: 100, y: 300 }, { x: 200, y: -300 }, { x: 300, y: 0 });
    const query = { x: 150, y: 90 };
    const reference = bruteForceNearest(s, query);
    expect(reference.localMinima).toBeGreaterThanOrEqual(2);
    const ours = nearestPoint(s, query);
    expect(ours.distance).toBeCloseTo(reference.distance, 9);
  });

  it('from the centre of the four-arc circle finds a point exactly on the circle (t = 0, ½ or 1 are all minima)', () => {
    // The standard approximation touches the circle at t = 0, ½, 1 and bulges outward
    // between, so from the centre there are three equal minima at distance r.
    const k = (4 / 3) * (Math.SQRT2 - 1);
    const arc = cubic({ x: 100, y: 0 }, { x: 100, y: 100 * k }, { x: 100 * k, y: 100 }, { x: 0, y: 100 });
    const ours = nearestPoint(arc, { x: 0, y: 0 });
    expect(ours.distance).toBeCloseTo(100, 10);
    expect(bruteForceNearest(arc, { x: 0, y: 0 }).localMinima).toBeGreaterThanOrEqual(3);
  });

  it('projects perpendicularly onto lines and clamps to their ends', () => {
    const l = line({ x: 0, y: 0 }, { x: 10, y: 0 });
    expect(nearestPoint(l, { x: 3, y: 4 })).toEqual({ t: 0.3, point: { x: 3, y: 0 }, distance: 4 });
    expect(nearestPoint(l, { x: -3, y: 4 })).toEqual({ t: 0, point: { x: 0, y: 0 }, distance: 5 });
  });

  it('finds the vertex of a parabola from a point on its axis', () => {
    // y = x²/… : quadratic (−10,10),(0,−10),(10,10) has vertex (0,0) at t = ½.
    const q = quad({ x: -10, y: 10 }, { x: 0, y: -10 }, { x: 10, y: 10 });
    const ours = nearestPoint(q, { x: 0, y: -3 });
    expect(ours.t).toBeCloseTo(0.5, 12);
    expect(ours.distance).toBeCloseTo(3, 12);
  });

  it('over several segments reports the segment that holds the closest point', () => {
    const a = line({ x: 0, y: 0 }, { x: 10, y: 0 });
    const b = line({ x: 0, y: 5 }, { x: 10, y: 5 });
    expect(nearestPointOnSegments([a, b], { x: 4, y: 4 })?.segmentIndex).toBe(1);
    expect(nearestPointOnSegments([], { x: 0, y: 0 })).toBeUndefined();
  });
});
