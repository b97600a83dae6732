// Agreement with an outside implementation: bezier-js 6.1.4 (npm `bezier-js`, Pomax),
// a widely used general-purpose Bézier library, on 2,500 seeded random cubics.
// Quantities that both compute in closed form (extrema, boxes, curvature, split,
// evaluation) must agree to 1e-6 relative. For arc length bezier-js uses one fixed
// 24-node Legendre–Gauss rule over [0, 1], accurate only for well-behaved curves, so
// the comparison there is bounded by bezier-js's own error against an independent
// high-accuracy reference.
import { describe, expect, it } from 'vitest';
import { Bezier } from 'bezier-js';
import type { CubicSegment } from '../../core/geometry/index.ts';
import {
  arcLength,
  curvature,
  evaluate,
  extremaParameters,
  nearestPoint,
  segmentBounds,
  splitAt,
} from '../../core/geometry/index.ts';
import { coordinateScale, isClose, randomPoint, seededRandom } from './support.ts';

/** How many random curves are generated; at least 1,000 must survive the degeneracy filters. */
const CURVE_COUNT = 2500;
const REQUIRED_COMPARISONS = 1000;
/** Agreement demanded of closed-form quantities (the brief: 1e-6 relative). */
const RELATIVE = 1e-6;
/** Absolute floor for parameters near 0 and coordinates near the origin. */
const ABSOLUTE_FLOOR = 1e-9;
/** Roots this close to t = 0 or 1 may legitimately be in or out of (0, 1). */
const BOUNDARY_MARGIN = 1e-9;
/**
 * bezier-js solves B′ = 0 with an unguarded quadratic formula; when the discriminant
 * or the leading coefficient is this small relative to the coefficients, its roots are
 * inaccurate or NaN, so such coordinates are skipped (and counted).
 */
const ILL_CONDITIONED = 1e-8;

const random = seededRandom(0x57e3);
const curves: CubicSegment[] = Array.from({ length: CURVE_COUNT }, () => ({
  kind: 'cubic' as const,
  p0: randomPoint(random, 500),
  p1: randomPoint(random, 500),
  p2: randomPoint(random, 500),
  p3: randomPoint(random, 500),
}));

const toBezierJs = (c: CubicSegment): Bezier => new Bezier(c.p0.x, c.p0.y, c.p1.x, c.p1.y, c.p2.x, c.p2.y, c.p3.x, c.p3.y);

const SAMPLE_PARAMETERS = [0, 0.1, 0.25, 0.5, 0.75, 0.9, 1];

describe('agreement with bezier-js on 2,500 random cubics', () => {
  it('finds the same horizontal and vertical extremum positions (on-curve extreme points land where expected)', () => {
    const utils = Bezier.getUtils();
    let compared = 0;
    const mismatches: string[] = [];
    for (const [index, c] of curves.entries()) {
      const bz = toBezierJs(c);
      const ours = extremaParameters(c);
      let usable = true;
      const perDimension: Array<[readonly number[], number[]]> = [];
      for (const dim of ['x', 'y'] as const) {
        // Hodograph coefficients (a, b, c) in Bernstein form: condition of the quadratic.
        const [a = 0, b = 0, cc = 0] = (bz.dpoints[0] ?? []).map((p) => p[dim]);
        const leading = a - 2 * b + cc;
        const scaleOfCoefficients = Math.abs(a) + Math.abs(b) + Math.abs(cc);
        if (Math.abs(leading) < ILL_CONDITIONED * scaleOfCoefficients) usable = false;
        if (Math.abs(b * b - a * cc) < ILL_CONDITIONED * (b * b + Math.abs(a * cc))) usable = false;
        // bezier-js's extrema() also lists the root of B″ for cubics; remove it.
        const secondDerivativeRoots = utils.droots((bz.dpoints[1] ?? []).map((p) => p[dim]));
        const theirs = bz.extrema()[dim].filter((t) => !secondDerivativeRoots.includes(t));
        const inside = (t: number): boolean => t > BOUNDARY_MARGIN && t < 1 - BOUNDARY_MARGIN;
        perDimension.push([ours[dim].filter(inside), theirs.filter(inside).sort((p, q) => p - q)]);
      }
      if (!usable) continue;
      compared++;
      for (const [mine, reference] of perDimension) {
        const agree =
          mine.length === reference.length && mine.every((t, i) => isClose(t, reference[i] ?? Number.NaN, RELATIVE, ABSOLUTE_FLOOR));
        if (!agree) mismatches.push(`curve ${index}: ours [${mine.join(', ')}] vs bezier-js [${reference.join(', ')}]`);
      }
    }
    expect(mismatches).toEqual([]);
    expect(compared).toBeGreaterThanOrEqual(REQUIRED_COMPARISONS);
  });

  it('computes the same tight bounding boxes (glyph extents and fit-to-view are right)', () => {
    const mismatches: string[] = [];
    for (const [index, c] of curves.entries()) {
      const theirs = toBezierJs(c).bbox(); // bezier-js: evaluates the curve at its extrema
      const ours = segmentBounds(c);
      const pairs: Array<[number, number]> = [
        [ours.minX, theirs.x.min],
        [ours.maxX, theirs.x.max],
        [ours.minY, theirs.y.min],
        [ours.maxY, theirs.y.max],
      ];
      if (!pairs.every(([a, b]) => isClose(a, b, RELATIVE, ABSOLUTE_FLOOR))) {
        mismatches.push(`curve ${index}: ${JSON.stringify(ours)} vs ${JSON.stringify(theirs)}`);
      }
    }
    expect(mismatches).toEqual([]);
    expect(curves.length).toBeGreaterThanOrEqual(REQUIRED_COMPARISONS);
  });

  it('measures the same arc length wherever bezier-js itself is accurate, and is never further from the truth', () => {
    const utils = Bezier.getUtils();
    // Independent high-accuracy reference: bezier-js's own 24-node Legendre–Gauss
    // nodes and weights applied as a composite rule on 256 equal panels, with
    // bezier-js's derivative. Per-panel exactness for degree 47 makes this accurate to
    // rounding except right at a cusp.
    const PANELS = 256;
    const reference = (bz: Bezier): number => {
      let total = 0;
      for (let panel = 0; panel < PANELS; panel++) {
        const a = panel / PANELS;
        const half = 0.5 / PANELS;
        for (let i = 0; i < utils.Tvalues.length; i++) {
          const d = bz.derivative(a + half + half * (utils.Tvalues[i] ?? 0));
          total += half * (utils.Cvalues[i] ?? 0) * Math.hypot(d.x, d.y);
        }
      }
      return total;
    };
    let agreedWithinRelative = 0;
    const mismatches: string[] = [];
    for (const [index, c] of curves.entries()) {
      const bz = toBezierJs(c);
      const truth = reference(bz);
      const ours = arcLength(c);
      const theirs = bz.length(); // bezier-js: one 24-node Legendre–Gauss rule
      // Ours is adaptive with 1e-12 relative tolerance.
      if (!isClose(ours, truth, 1e-9, ABSOLUTE_FLOOR)) mismatches.push(`curve ${index}: ours ${ours} vs reference ${truth}`);
      // Any disagreement with bezier-js must be explained by bezier-js's own error.
      const allowed = Math.max(RELATIVE * truth, Math.abs(theirs - truth) + 1e-9 * truth);
      if (Math.abs(ours - theirs) > allowed) mismatches.push(`curve ${index}: ours ${ours} vs bezier-js ${theirs}`);
      if (isClose(ours, theirs, RELATIVE, ABSOLUTE_FLOOR)) agreedWithinRelative++;
    }
    expect(mismatches).toEqual([]);
    expect(agreedWithinRelative).toBeGreaterThanOrEqual(REQUIRED_COMPARISONS);
  });

  it('reports the same signed curvature at seven positions per curve (curvature combs match)', () => {
    const mismatches: string[] = [];
    let compared = 0;
    for (const [index, c] of curves.entries()) {
      const bz = toBezierJs(c);
      for (const t of SAMPLE_PARAMETERS) {
        const theirs = bz.curvature(t).k; // bezier-js: (x′y″ − y′x″)/|B′|³
        const ours = curvature(c, t);
        compared++;
        if (!isClose(ours, theirs, RELATIVE, 1e-12)) mismatches.push(`curve ${index} t=${t}: ${ours} vs ${theirs}`);
      }
    }
    expect(mismatches).toEqual([]);
    expect(compared / SAMPLE_PARAMETERS.length).toBeGreaterThanOrEqual(REQUIRED_COMPARISONS);
  });

  it('splits into the same two halves (cutting a curve in the editor does not move it)', () => {
    const mismatches: string[] = [];
    for (const [index, c] of curves.entries()) {
      const t = SAMPLE_PARAMETERS[1 + (index % 5)] ?? 0.5;
      const theirs = toBezierJs(c).split(t); // bezier-js: de Casteljau hull
      const [left, right] = splitAt(c, t);
      const ours = [left.p0, left.p1, left.p2, left.p3, right.p0, right.p1, right.p2, right.p3];
      const reference = [...theirs.left.points, ...theirs.right.points];
      const floor = ABSOLUTE_FLOOR * coordinateScale(ours);
      const agree = ours.every(
        (p, i) => isClose(p.x, reference[i]?.x ?? Number.NaN, RELATIVE, floor) && isClose(p.y, reference[i]?.y ?? Number.NaN, RELATIVE, floor),
      );
      if (!agree) mismatches.push(`curve ${index} at t=${t}`);
    }
    expect(mismatches).toEqual([]);
  });

  it('evaluates the same points (outlines are drawn where bezier-js draws them)', () => {
    const mismatches: string[] = [];
    for (const [index, c] of curves.entries()) {
      const bz = toBezierJs(c);
      for (const t of SAMPLE_PARAMETERS) {
        const ours = evaluate(c, t);
        const theirs = bz.compute(t);
        const floor = ABSOLUTE_FLOOR * coordinateScale([ours]);
        if (!isClose(ours.x, theirs.x, RELATIVE, floor) || !isClose(ours.y, theirs.y, RELATIVE, floor)) {
          mismatches.push(`curve ${index} t=${t}`);
        }
      }
    }
    expect(mismatches).toEqual([]);
  });

  it('never finds a nearest point further away than bezier-js’s projection (clicks select the right curve point)', () => {
    const mismatches: string[] = [];
    const queryRandom = seededRandom(0x9e37);
    for (const [index, c] of curves.entries()) {
      const query = randomPoint(queryRandom, 700);
      // bezier-js: look-up table + local search. Its reported `d` can belong to an
      // extrapolated parameter outside [0, 1] (its search window is not clamped), so the
      // distance of the point it actually returns is used instead.
      const theirs = toBezierJs(c).project(query);
      const theirDistance = Math.hypot(theirs.x - query.x, theirs.y - query.y);
      const ours = nearestPoint(c, query);
      if (ours.distance > theirDistance + 1e-9) {
        mismatches.push(`curve ${index}: ours ${ours.distance} vs bezier-js ${theirDistance}`);
      }
    }
    expect(mismatches).toEqual([]);
  });
});
