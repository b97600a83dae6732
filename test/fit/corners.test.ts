// Corner detection and corner sharpening: the corners a designer drew come back as
// sharp corners at the right place, curves do not grow false corners, and the user's
// forced corners and smooth points win over the detector.

import { describe, expect, it } from 'vitest';
import { prepareChain } from '../../core/fit/boundary-chain.ts';
import { cornerReachMarginPx, detectCorners, roundingZoneFor } from '../../core/fit/corners.ts';
import { fitContour } from '../../core/fit/index.ts';
import type { Point } from '../../core/geometry/index.ts';
import { circleChain, polygonChain, squareChain } from './synthetic-chains.ts';
import { joinsOf } from './support.ts';

const DEGREES = Math.PI / 180;
const settings = { cornerAngle: 25 * DEGREES, pixel: 1, forcedCorners: [] as number[], forcedSmooth: [] as number[] };

/**
 * A square whose corners are rounded with radius r, as anti-aliasing and blur round
 * a scanned corner: the sharp corners are at (x0, y0), (x0 + side, y0), ….
 */
function roundedSquareChain(x0: number, y0: number, side: number, r: number): Point[] {
  const points: Point[] = [];
  const centres = [
    { x: x0 + side - r, y: y0 + r, start: -Math.PI / 2 },
    { x: x0 + side - r, y: y0 + side - r, start: 0 },
    { x: x0 + r, y: y0 + side - r, start: Math.PI / 2 },
    { x: x0 + r, y: y0 + r, start: Math.PI },
  ];
  // Walk the outline with unit steps: straight edges then quarter arcs.
  const edge = side - 2 * r;
  const path = (s: number): Point => {
    const per = edge + (Math.PI / 2) * r;
    const k = Math.floor(s / per) % 4;
    const d = s - Math.floor(s / per) * per;
    const c = centres[k]!;
    const startOfEdge = [
      { x: x0 + r, y: y0 },
      { x: x0 + side, y: y0 + r },
      { x: x0 + side - r, y: y0 + side },
      { x: x0, y: y0 + side - r },
    ][k]!;
    const direction = [{ x: 1, y: 0 }, { x: 0, y: 1 }, { x: -1, y: 0 }, { x: 0, y: -1 }][k]!;
    if (d < edge) return { x: startOfEdge.x + direction.x * d, y: startOfEdge.y + direction.y * d };
    const a = c.start + (d - edge) / r;
    return { x: c.x + r * Math.cos(a), y: c.y + r * Math.sin(a) };
  };
  const total = 4 * (edge + (Math.PI / 2) * r);
  for (let s = 0; s < total; s += 1) points.push(path(s));
  return points;
}

describe('corner detection', () => {
  it('finds the four corners of a noisy square and nothing else', () => {
    const { chain } = prepareChain(squareChain(100, 100, 300, 0.15));
    const corners = detectCorners(chain, settings);
    expect(corners).toHaveLength(4);
    // The detector's side fits are parabolas extrapolated over the rounded tip: on noisy
    // straight sides their turn scatters by up to about 10°.
    for (const c of corners) expect(Math.abs(Math.abs(c.turn) - 90 * DEGREES)).toBeLessThan(15 * DEGREES);
  });

  it('finds no corner on a noisy circle, however tight (radius 12 px)', () => {
    for (const radius of [12, 40, 200]) {
      const { chain } = prepareChain(circleChain({ x: 0, y: 0 }, radius, 0.15, radius));
      expect(detectCorners(chain, settings)).toHaveLength(0);
    }
  });

  it('finds a 30° corner but not a 15° bend (default threshold 25°)', () => {
    const bend = (degrees: number): Point[] => {
      const a = degrees * DEGREES;
      // A long triangle-like polygon whose first vertex turns by `degrees`.
      return [
        { x: 0, y: 0 },
        { x: 200, y: 0 },
        { x: 200 + 200 * Math.cos(a), y: 200 * Math.sin(a) },
        { x: 200 + 200 * Math.cos(a), y: 300 },
        { x: 0, y: 300 },
      ];
    };
    const cornersNear = (degrees: number): number => {
      const { chain } = prepareChain(polygonChain(bend(degrees), 0.1, 3));
      return detectCorners(chain, settings).filter((c) => {
        const p = { x: chain.xs[c.index]! + chain.origin.x, y: chain.ys[c.index]! + chain.origin.y };
        return Math.hypot(p.x - 200, p.y) < 6;
      }).length;
    };
    expect(cornersNear(30)).toBe(1);
    expect(cornersNear(15)).toBe(0);
  });

  it('finds a 22° corner between two straight strokes, but not where a curve leaves a line at 22°', () => {
    // Reference: the round trip counts a tangent turn of more than 20° as a corner. Two
    // lines cannot join smoothly, so straight strokes meeting at 22° are a corner under
    // the default corner angle of 25°; a curve leaving a line at that angle is not.
    const vertex = { x: 200, y: 0 };
    const turn = 22 * DEGREES;
    const nearVertex = (points: Point[], noisePx = 0): number => {
      const { chain } = prepareChain(points);
      return detectCorners(chain, { ...settings, noisePx }).filter((c) => Math.hypot(chain.xs[c.index]! + chain.origin.x - vertex.x, chain.ys[c.index]! + chain.origin.y - vertex.y) < 6).length;
    };
    const lines = [{ x: 0, y: 0 }, vertex, { x: 200 + 200 * Math.cos(turn), y: 200 * Math.sin(turn) }, { x: 200 + 200 * Math.cos(turn), y: 300 }, { x: 0, y: 300 }];
    expect(nearVertex(polygonChain(lines, 0.1, 3))).toBe(1);
    // The same vertex on a 1-bit scan's noise (σ = 1/√12 px): too noisy to tell the
    // sides straight, so the default angle holds.
    expect(nearVertex(polygonChain(lines, 0.1, 3), 1 / Math.sqrt(12))).toBe(0);
    // A line, then an arc of radius 40 px leaving it at 22° and turning on through 90°.
    const curved: Point[] = [];
    for (let x = 0; x < 200; x += 1) curved.push({ x, y: 0 });
    const radius = 40;
    const centre = { x: vertex.x - radius * Math.sin(turn), y: radius * Math.cos(turn) };
    for (let a = 0; a <= 90 * DEGREES; a += 1 / radius) curved.push({ x: centre.x + radius * Math.sin(turn + a), y: centre.y - radius * Math.cos(turn + a) });
    const end = curved[curved.length - 1]!;
    for (let y = end.y + 1; y < 300; y += 1) curved.push({ x: end.x, y });
    for (let x = end.x; x > 0; x -= 1) curved.push({ x, y: 300 });
    for (let y = 300; y > 0; y -= 1) curved.push({ x: 0, y });
    expect(nearVertex(curved)).toBe(0);
  });

  it('puts the sharp corner where the sides meet, not on the rounded tip (1 px rounding)', () => {
    const { chain } = prepareChain(roundedSquareChain(100, 100, 200, 1));
    const corners = detectCorners(chain, settings);
    expect(corners).toHaveLength(4);
    const truth = [{ x: 100, y: 100 }, { x: 300, y: 100 }, { x: 300, y: 300 }, { x: 100, y: 300 }];
    for (const c of corners) {
      const nearest = Math.min(...truth.map((t) => Math.hypot(t.x - c.estimate.x, t.y - c.estimate.y)));
      // The rounded tip itself lies r(√2 − 1) ≈ 0.41 px inside; the estimate must do better.
      expect(nearest).toBeLessThan(0.2);
    }
  });

  it('excludes a longer rounded tip for acute corners (the tracer cuts across thin wedges)', () => {
    expect(roundingZoneFor(90 * DEGREES, 1)).toBe(2);
    expect(roundingZoneFor(160 * DEGREES, 1)).toBeGreaterThan(2.5);
  });

  it('keeps a user-forced corner on a circle and drops a detected corner the user marked smooth', () => {
    const circle = circleChain({ x: 0, y: 0 }, 100, 0.1, 9);
    const forced = detectCorners(prepareChain(circle).chain, { ...settings, forcedCorners: [100] });
    expect(forced.map((c) => c.index)).toEqual([100]);
    expect(forced[0]!.forced).toBe(true);
    const square = squareChain(0, 0, 200, 0.1);
    const { chain } = prepareChain(square);
    const detected = detectCorners(chain, settings);
    const smoothed = detectCorners(chain, { ...settings, forcedSmooth: [detected[0]!.index] });
    expect(smoothed).toHaveLength(3);
  });
});

describe('corner sharpening in the fitted contour', () => {
  it('gives a square with corners rounded by 1 px its exact sharp corners', () => {
    const fit = fitContour(roundedSquareChain(100, 100, 200, 1));
    const corners = joinsOf(fit.contour).filter((j) => !j.smooth).map((j) => j.point);
    expect(corners).toHaveLength(4);
    // Reference: the square's drawn corners (construction above); integer grid.
    expect(corners).toEqual(expect.arrayContaining([{ x: 300, y: 100, kind: 'on', smooth: false }, { x: 300, y: 300, kind: 'on', smooth: false }, { x: 100, y: 300, kind: 'on', smooth: false }, { x: 100, y: 100, kind: 'on', smooth: false }]));
  });

  it('forced corners survive into the outline as corners', () => {
    const circle = circleChain({ x: 0, y: 0 }, 150, 0.1, 4);
    const fit = fitContour(circle, { forcedCorners: [200] });
    const corners = joinsOf(fit.contour).filter((j) => !j.smooth);
    expect(corners).toHaveLength(1);
    const forcedPoint = circle[200]!;
    expect(Math.hypot(corners[0]!.point.x - forcedPoint.x, corners[0]!.point.y - forcedPoint.y)).toBeLessThan(3);
  });
});

describe('the margin beyond the predicted tip within which a corner is sharpened', () => {
  it('is a full pixel when the scan\'s blur is unknown, whatever the scale', () => {
    for (const pixel of [0.5, 1, 2, 3]) expect(cornerReachMarginPx(pixel)).toBe(1);
  });

  it('shrinks to 1.5 font units on a scan coarser than that per pixel, but not below 0.6 px', () => {
    // Reference: the round trip of Linux Libertine at 0.5 px per unit (a pixel of 2 units),
    // where 5-unit brackets lay 0.82–1.04 px beyond the predicted tip and true corners
    // within 0.75 px (test/fit/round-trip.test.ts).
    expect(cornerReachMarginPx(1, 0.4)).toBe(1);
    expect(cornerReachMarginPx(2, 0.4)).toBeCloseTo(0.75, 12);
    expect(cornerReachMarginPx(3, 0.4)).toBeCloseTo(0.6, 12);
  });

  it('keeps room for the scan\'s noise: four σ of it, up to the full pixel', () => {
    // A smoothed 1-bit scan's edge is quantized to its pixels: σ = 1/√12 px (uniform quantization).
    expect(cornerReachMarginPx(3, 0.85, 1 / Math.sqrt(12))).toBe(1);
    expect(cornerReachMarginPx(3, 0.85, 0.2)).toBeCloseTo(0.8, 12);
    expect(cornerReachMarginPx(3, 0.85, 0.01)).toBeCloseTo(0.6, 12);
  });
});
