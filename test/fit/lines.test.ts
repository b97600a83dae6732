// Straight runs: stems and bars come out exactly straight and, within the axis-snap
// angle, exactly horizontal or vertical; intended slants stay slanted; curves, even
// flat ones, do not turn into lines.

import { describe, expect, it } from 'vitest';
import { prepareChain } from '../../core/fit/boundary-chain.ts';
import { detectLines, runsBetweenCorners, testLine } from '../../core/fit/lines.ts';
import { fitContour } from '../../core/fit/index.ts';
import { circleChain, polygonChain, squareChain, stadiumChain } from './synthetic-chains.ts';
import { segmentsOf } from './support.ts';

const DEGREES = Math.PI / 180;
const lineSettings = { tolerance: 1.15, pixel: 1, axisSnap: 2 * DEGREES };

describe('lines', () => {
  it('makes the sides of a noisy square exactly horizontal and vertical', () => {
    const fit = fitContour(squareChain(100, 100, 400, 0.2, 7));
    const segments = segmentsOf(fit.contour);
    expect(segments).toHaveLength(4);
    for (const s of segments) {
      expect(s.kind).toBe('line');
      // Exactly axis-aligned: one coordinate identical at both ends.
      expect(s.p0.x === s.p1.x || s.p0.y === s.p1.y).toBe(true);
    }
  });

  it('snaps a stem drawn a quarter degree off vertical to vertical, but keeps a 5° slant', () => {
    const slanted = (degrees: number) => {
      const dx = 400 * Math.tan(degrees * DEGREES);
      return polygonChain([{ x: 0, y: 0 }, { x: 200, y: 0 }, { x: 200 + dx, y: 400 }, { x: dx, y: 400 }], 0.1, 2);
    };
    // Over 400 units 0.25° is 1.7 units of drift: the snapped line stays within the tolerance.
    const near = segmentsOf(fitContour(slanted(0.25)).contour).filter((s) => s.kind === 'line' && Math.abs(s.p1.y - s.p0.y) > 300);
    expect(near).toHaveLength(2);
    for (const s of near) expect(s.p0.x).toBe(s.p1.x);
    // 1.5° over 400 units drifts 10 units: snapping would break the tolerance, so it is not done.
    const tooFar = segmentsOf(fitContour(slanted(1.5)).contour).filter((s) => s.kind === 'line' && Math.abs(s.p1.y - s.p0.y) > 300);
    for (const s of tooFar) expect(s.p0.x).not.toBe(s.p1.x);
    const far = segmentsOf(fitContour(slanted(5)).contour).filter((s) => s.kind === 'line' && Math.abs(s.p1.y - s.p0.y) > 300);
    expect(far).toHaveLength(2);
    for (const s of far) expect(Math.atan(Math.abs(s.p1.x - s.p0.x) / Math.abs(s.p1.y - s.p0.y)) / DEGREES).toBeCloseTo(5, 0);
  });

  it('finds no line on a circle of radius 200 px with scan noise', () => {
    const { chain } = prepareChain(circleChain({ x: 0, y: 0 }, 200, 0.15, 5));
    expect(detectLines(chain, runsBetweenCorners(chain, [], 0), lineSettings)).toHaveLength(0);
  });

  it('rejects a stretch that bows, even when every point is within the tolerance', () => {
    // A circular arc of radius 2000 over 120 px bows by 0.9 px: within 1.15 but clearly curved.
    const points = Array.from({ length: 121 }, (_, i) => {
      const a = (i - 60) / 2000;
      return { x: 2000 * Math.sin(a), y: 2000 * Math.cos(a) - 2000 };
    });
    const closed = [...points, { x: 60, y: -300 }, { x: -60, y: -300 }];
    const { chain } = prepareChain(closed);
    expect(testLine(chain, 0, 120, lineSettings).ok).toBe(false);
  });

  it('keeps the straight sides of a stadium as lines joined tangentially to the arcs', () => {
    const fit = fitContour(stadiumChain({ x: 400, y: 300 }, 300, 100, 0.15, 3));
    const segments = segmentsOf(fit.contour);
    const lines = segments.filter((s) => s.kind === 'line');
    expect(lines).toHaveLength(2);
    for (const l of lines) expect(l.p0.y).toBe(l.p1.y);
    // 2 lines + 4 quarter arcs (Reference: the construction: two semicircles split at their x-extrema).
    expect(segments).toHaveLength(6);
    expect(fit.report.cornerCount).toBe(0);
  });
});
