// The least-squares cubic (Schneider 1990) and the fewest-segments search: fits keep
// their end points and tangents exactly, measure error as a true distance, and use as
// few segments as the tolerance allows.

import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { prepareChain } from '../../core/fit/boundary-chain.ts';
import { fitCubic } from '../../core/fit/least-squares.ts';
import { fitStretch } from '../../core/fit/minimum-segments.ts';
import { cubic, evaluate, nearestPoint, type Point } from '../../core/geometry/index.ts';

/** Points every ~1 unit along a cubic, closed by a far-away return so the chain is a loop. */
function sampledCubic(p0: Point, p1: Point, p2: Point, p3: Point, count = 200): Point[] {
  const c = cubic(p0, p1, p2, p3);
  const points = Array.from({ length: count + 1 }, (_, i) => evaluate(c, i / count));
  return [...points, { x: p3.x, y: p3.y - 500 }, { x: p0.x, y: p0.y - 500 }];
}

describe('least-squares cubic', () => {
  it('recovers a cubic from exact samples of it, given its end tangents (to half a unit)', () => {
    const p0 = { x: 0, y: 0 };
    const p1 = { x: 40, y: 120 };
    const p2 = { x: 180, y: 160 };
    const p3 = { x: 220, y: 40 };
    const { chain } = prepareChain(sampledCubic(p0, p1, p2, p3));
    const unit = (a: Point, b: Point): Point => ({ x: (b.x - a.x) / Math.hypot(b.x - a.x, b.y - a.y), y: (b.y - a.y) / Math.hypot(b.x - a.x, b.y - a.y) });
    const fit = fitCubic({ chain, first: 0, last: 200, start: p0, end: p3, startTangent: unit(p0, p1), endTangent: unit(p2, p3) }, 0.01);
    // Samples uniform in t are far from chord-length parameters; alternating handles and
    // Newton steps converges linearly, so a residual of a few tenths remains (measured 0.44).
    expect(fit.maxError).toBeLessThan(0.5);
    expect(fit.segment.p0).toEqual(p0);
    expect(fit.segment.p3).toEqual(p3);
    expect(Math.hypot(fit.segment.p1.x - 40, fit.segment.p1.y - 120)).toBeLessThan(12);
  });

  it('keeps given tangents exactly (handles on the tangent rays) and positive handle lengths', () => {
    fc.assert(
      fc.property(fc.double({ min: -1.2, max: 1.2, noNaN: true }), fc.double({ min: -1.2, max: 1.2, noNaN: true }), (a, b) => {
        const p0 = { x: 0, y: 0 };
        const p3 = { x: 300, y: 0 };
        const { chain } = prepareChain(sampledCubic(p0, { x: 100 * Math.cos(a), y: 100 * Math.sin(a) + 50 }, { x: 300 - 100 * Math.cos(b), y: 100 * Math.sin(b) + 50 }, p3));
        const t0 = { x: Math.cos(0.5), y: Math.sin(0.5) };
        const t3 = { x: Math.cos(-0.5), y: Math.sin(-0.5) };
        const fit = fitCubic({ chain, first: 0, last: 200, start: p0, end: p3, startTangent: t0, endTangent: t3 }, 1);
        const h0 = { x: fit.segment.p1.x - p0.x, y: fit.segment.p1.y - p0.y };
        const h3 = { x: p3.x - fit.segment.p2.x, y: p3.y - fit.segment.p2.y };
        expect(Math.abs(h0.x * t0.y - h0.y * t0.x)).toBeLessThan(1e-9 * Math.hypot(h0.x, h0.y) + 1e-12);
        expect(Math.abs(h3.x * t3.y - h3.y * t3.x)).toBeLessThan(1e-9 * Math.hypot(h3.x, h3.y) + 1e-12);
        expect(h0.x * t0.x + h0.y * t0.y).toBeGreaterThan(0);
        expect(h3.x * t3.x + h3.y * t3.y).toBeGreaterThan(0);
      }),
      { numRuns: 40 },
    );
  });

  it('never puts a handle farther out than the polyline it fits, however few its points', () => {
    // The stretch between two nearly collinear lines of Linux Libertine's e (crossbar,
    // traced at 1 px per unit, fitted at 0.375 unit): two chain points, which the
    // chord-length parameters put at u = 0 and u ≈ 1, so the normal equations leave the
    // handle lengths all but free. Their solution put a handle 6·10⁸ units out, and a
    // curve that far away is not seen by an error measured from the points to the curve.
    // Reference: a circular arc's cubic has handles (4/3)·tan(θ/4)·r against an arc of
    // θ·r (0.42 of the arc at 180°), so no drawn curve needs a handle longer than the arc.
    const points = [{ x: 241.13, y: 247.05213179466418 }, { x: 240.13, y: 247.06629919007264 }];
    const { chain } = prepareChain([...points, { x: 120, y: 248 }, { x: 120, y: 100 }, { x: 360, y: 100 }, { x: 360, y: 246 }]);
    const start = { x: 241.12958225898154, y: 246.98194477789542 };
    const end = { x: 240.1306948756941, y: 247.1817983090884 };
    const fit = fitCubic({ chain, first: 0, last: 1, start, end, startTangent: { x: -0.9999822883451074, y: 0.005951722110662109 }, endTangent: { x: -0.9999819026446786, y: 0.00601617678667513 } }, 0.375);
    const polyline = [start, ...points, end].reduce((sum, p, i, all) => (i === 0 ? 0 : sum + Math.hypot(p.x - all[i - 1]!.x, p.y - all[i - 1]!.y)), 0);
    const { p0, p1, p2, p3 } = fit.segment;
    expect(Math.hypot(p1.x - p0.x, p1.y - p0.y)).toBeLessThanOrEqual(polyline);
    expect(Math.hypot(p3.x - p2.x, p3.y - p2.y)).toBeLessThanOrEqual(polyline);
    expect(fit.maxError).toBeLessThanOrEqual(0.375);
  });

  it('reports its error as a true distance: exact whenever above the tolerance', () => {
    const { chain } = prepareChain(sampledCubic({ x: 0, y: 0 }, { x: 0, y: 200 }, { x: 300, y: -200 }, { x: 300, y: 0 }));
    // A deliberately poor model: a nearly straight cubic with fixed horizontal tangents.
    const fit = fitCubic({ chain, first: 0, last: 200, start: { x: 0, y: 0 }, end: { x: 300, y: 0 }, startTangent: { x: 1, y: 0 }, endTangent: { x: 1, y: 0 } }, 0.5);
    let worst = 0;
    for (let k = 0; k <= 200; k++) worst = Math.max(worst, nearestPoint(fit.segment, { x: chain.xs[k]! + chain.origin.x, y: chain.ys[k]! + chain.origin.y }).distance);
    // Reference: the exact nearest-point solve of core/geometry over every point.
    expect(fit.maxError).toBeCloseTo(worst, 9);
  });
});

describe('fewest segments', () => {
  it('uses one segment where one fits, and several only when it does not', () => {
    // A quarter circle of radius 200: one cubic fits it within 2.7e-4·r = 0.05 (Goldapp 1991).
    const quarter = Array.from({ length: 315 }, (_, i) => ({ x: 200 * Math.cos((i / 314) * (Math.PI / 2)), y: 200 * Math.sin((i / 314) * (Math.PI / 2)) }));
    const { chain } = prepareChain([...quarter, { x: -300, y: -300 }]);
    const start = { index: 0, point: { x: 200, y: 0 }, tangent: { x: 0, y: 1 } };
    const end = { index: 314, point: { x: 0, y: 200 }, tangent: { x: -1, y: 0 } };
    expect(fitStretch(chain, start, end, 0, 314, { tolerance: 0.5, pixel: 1 }).segments).toHaveLength(1);
    // A full semicircle with the same end tangent constraints cannot be one cubic within 0.5.
    const half = Array.from({ length: 629 }, (_, i) => ({ x: 200 * Math.cos((i / 628) * Math.PI), y: 200 * Math.sin((i / 628) * Math.PI) }));
    const semi = prepareChain([...half, { x: -200, y: -300 }, { x: 200, y: -300 }]).chain;
    const fit = fitStretch(semi, { index: 0, point: { x: 200, y: 0 }, tangent: { x: 0, y: 1 } }, { index: 628, point: { x: -200, y: 0 }, tangent: { x: 0, y: -1 } }, 0, 628, { tolerance: 0.5, pixel: 1 });
    expect(fit.segments).toHaveLength(2);
    for (const e of fit.errors) expect(e).toBeLessThanOrEqual(0.5);
  });

  it('shares one tangent between the segments at every breakpoint (G1 exact)', () => {
    const wave = Array.from({ length: 801 }, (_, i) => ({ x: i, y: 60 * Math.sin(i / 60) }));
    const { chain } = prepareChain([...wave, { x: 800, y: -300 }, { x: 0, y: -300 }]);
    const fit = fitStretch(chain, { index: 0, point: wave[0]!, tangent: null }, { index: 800, point: wave[800]!, tangent: null }, 0, 800, { tolerance: 0.3, pixel: 1 });
    expect(fit.segments.length).toBeGreaterThan(2);
    for (let i = 1; i < fit.segments.length; i++) {
      const a = fit.segments[i - 1]!;
      const b = fit.segments[i]!;
      const u = { x: a.p3.x - a.p2.x, y: a.p3.y - a.p2.y };
      const v = { x: b.p1.x - b.p0.x, y: b.p1.y - b.p0.y };
      expect(Math.abs(u.x * v.y - u.y * v.x) / (Math.hypot(u.x, u.y) * Math.hypot(v.x, v.y))).toBeLessThan(1e-12);
      expect(a.p3).toEqual(b.p0);
    }
  });
});
