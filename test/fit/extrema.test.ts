// Extrema: every horizontal and vertical extreme of the outline is an on-curve point
// with axis-aligned handles, found on noisy chains without inventing extra ones.

import { describe, expect, it } from 'vitest';
import { prepareChain } from '../../core/fit/boundary-chain.ts';
import { chainExtrema, segmentExtrema } from '../../core/fit/extrema.ts';
import { fitContour } from '../../core/fit/index.ts';
import { cubic } from '../../core/geometry/index.ts';
import { circleChain, ellipseChain, ellipsePoint } from './synthetic-chains.ts';
import { joinsOf, segmentsOf } from './support.ts';

describe('extrema on the boundary', () => {
  it('finds exactly one extremum per side of a noisy circle, not a cluster along its flat top', () => {
    const { chain } = prepareChain(circleChain({ x: 0, y: 0 }, 300, 0.3, 11, 0.1));
    const found = chainExtrema(chain, 0, chain.count - 1, 1, 0.3);
    // The stretch starts at angle 0.1 rad, just past the right side's x-maximum, which it reaches again 0.1 rad before its end.
    expect(found.map((e) => e.axis)).toEqual(['y', 'x', 'y', 'x']);
    expect(found[0]!.point.y).toBeCloseTo(300, 0);
  });
});

describe('extrema in the fitted outline', () => {
  it('puts the on-curve points of an ellipse rotated 30° at its four extremes, with axis-aligned handles', () => {
    const c = { x: 400, y: 300 };
    const a = 250;
    const b = 120;
    const rotation = Math.PI / 6;
    const fit = fitContour(ellipseChain(c, a, b, rotation, 0.15, 2));
    // Reference: the extremes of x(θ) = a·cos θ·cos φ − b·sin θ·sin φ (+ c), where tan θ = −b·tan φ / a, and of y likewise.
    const thetaX = Math.atan2(-b * Math.sin(rotation), a * Math.cos(rotation));
    const thetaY = Math.atan2(b * Math.cos(rotation), a * Math.sin(rotation));
    const extremes = [thetaX, thetaX + Math.PI, thetaY, thetaY + Math.PI].map((t) => ellipsePoint(c, a, b, rotation, t));
    const joins = joinsOf(fit.contour);
    for (const e of extremes) {
      const nearest = joins.reduce((best, j) => (Math.hypot(j.point.x - e.x, j.point.y - e.y) < Math.hypot(best.point.x - e.x, best.point.y - e.y) ? j : best));
      expect(Math.hypot(nearest.point.x - e.x, nearest.point.y - e.y)).toBeLessThan(3);
      expect(nearest.incoming.x === 0 || nearest.incoming.y === 0).toBe(true);
      expect(nearest.incoming.x * nearest.outgoing.y - nearest.incoming.y * nearest.outgoing.x).toBe(0);
    }
    for (const s of segmentsOf(fit.contour)) if (s.kind === 'cubic') expect(segmentExtrema(s).every((e) => e.protrusion <= 0.5)).toBe(true);
  });

  it('measures how far an interior extremum sticks out past the segment ends', () => {
    const bump = cubic({ x: 0, y: 0 }, { x: 10, y: 40 }, { x: 90, y: 40 }, { x: 100, y: 0 });
    const [top] = segmentExtrema(bump);
    // Reference: y(½) = 3/8·40 + 3/8·40 = 30 for this symmetric cubic.
    expect(top!.axis).toBe('y');
    expect(top!.protrusion).toBeCloseTo(30, 9);
  });
});
