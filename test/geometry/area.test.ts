// Signed area by Green's theorem: contour orientation decides which contours are
// counters in the font, so the sign convention and exactness matter.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Bezier } from 'bezier-js';
import type { Segment } from '../../core/geometry/index.ts';
import {
  controlPoints,
  cubic,
  line,
  mapControlPoints,
  orientation,
  quad,
  reverseSegment,
  segmentAreaTerm,
  signedArea,
} from '../../core/geometry/index.ts';
import { PROPERTY_SETTINGS, closedContourArb, coordinateScale, cubicArb, quadArb } from './support.ts';

const ROUNDING = 1e-12;

const contourScale = (contour: readonly Segment[]): number => coordinateScale(contour.flatMap((s) => controlPoints(s)));
const reversed = (contour: readonly Segment[]): Segment[] => contour.map((s) => reverseSegment(s)).reverse();
const square = (side: number): Segment[] => [
  line({ x: 0, y: 0 }, { x: side, y: 0 }),
  line({ x: side, y: 0 }, { x: side, y: side }),
  line({ x: side, y: side }, { x: 0, y: side }),
  line({ x: 0, y: side }, { x: 0, y: 0 }),
];

describe('signed area of a closed contour', () => {
  it('is positive for a counter-clockwise square in a y-up frame and negative when clockwise', () => {
    expect(signedArea(square(3))).toBe(9);
    expect(signedArea(reversed(square(3)))).toBe(-9);
    expect(orientation(square(1))).toBe('counter-clockwise');
    expect(orientation(reversed(square(1)))).toBe('clockwise');
    expect(orientation([])).toBe('degenerate');
  });

  it('only changes sign when the contour is reversed (counters keep their size)', () => {
    fc.assert(
      fc.property(closedContourArb, (contour) => {
        const tolerance = ROUNDING * contourScale(contour) ** 2 * (contour.length + 1);
        expect(Math.abs(signedArea(reversed(contour)) + signedArea(contour))).toBeLessThanOrEqual(tolerance);
      }),
      PROPERTY_SETTINGS,
    );
  });

  it('does not depend on where the contour starts or where it sits on the page', () => {
    fc.assert(
      fc.property(closedContourArb, fc.integer({ min: 0, max: 5 }), fc.double({ min: -5000, max: 5000, noNaN: true }), (contour, shift, offset) => {
        const tolerance = 10 * ROUNDING * (contourScale(contour) + Math.abs(offset)) ** 2 * (contour.length + 1);
        const k = shift % contour.length;
        const rotated = [...contour.slice(k), ...contour.slice(0, k)];
        const moved = contour.map((s) => mapControlPoints(s, (p) => ({ x: p.x + offset, y: p.y - offset })));
        expect(Math.abs(signedArea(rotated) - signedArea(contour))).toBeLessThanOrEqual(tolerance);
        expect(Math.abs(signedArea(moved) - signedArea(contour))).toBeLessThanOrEqual(tolerance);
      }),
      PROPERTY_SETTINGS,
    );
  });

  it('of a polygon equals the shoelace formula', () => {
    // Shoelace formula (Meister 1769 / Gauss 1795): A = ½Σ(xᵢyᵢ₊₁ − xᵢ₊₁yᵢ).
    const pts = [
      { x: 0, y: 0 },
      { x: 7, y: 1 },
      { x: 5, y: 6 },
      { x: 2, y: 4 },
      { x: -1, y: 5 },
    ];
    const shoelace = pts.reduce((sum, p, i) => {
      const q = pts[(i + 1) % pts.length] ?? p;
      return sum + (p.x * q.y - q.x * p.y) / 2;
    }, 0);
    expect(signedArea(pts.map((p, i) => line(p, pts[(i + 1) % pts.length] ?? p)))).toBeCloseTo(shoelace, 12);
  });

  it('per-segment closed forms equal Green’s integral ½∫(x·y′ − y·x′)dt computed with bezier-js', () => {
    // Reference: bezier-js 6.1.4 points and derivatives, integrated with its own
    // 24-node Legendre–Gauss rule, exact here because the integrand is a polynomial of
    // degree ≤ 5.
    const utils = Bezier.getUtils();
    const greensIntegral = (bz: Bezier): number => {
      let sum = 0;
      for (let i = 0; i < utils.Tvalues.length; i++) {
        const t = 0.5 + 0.5 * (utils.Tvalues[i] ?? 0);
        const p = bz.compute(t);
        const d = bz.derivative(t);
        sum += 0.5 * (utils.Cvalues[i] ?? 0) * 0.5 * (p.x * d.y - p.y * d.x);
      }
      return sum;
    };
    fc.assert(
      fc.property(fc.oneof(cubicArb, quadArb), (segment) => {
        const bz = new Bezier(controlPoints(segment).map((p) => ({ x: p.x, y: p.y })));
        const tolerance = 1e-10 * coordinateScale(controlPoints(segment)) ** 2;
        expect(Math.abs(segmentAreaTerm(segment) - greensIntegral(bz))).toBeLessThanOrEqual(tolerance);
      }),
      PROPERTY_SETTINGS,
    );
  });

  it('includes the closing chord when a contour is left open', () => {
    // Arch P = (0,0), (0,4), (4,4), (4,0): x(t) = 12t² − 8t³, y(t) = 12t(1 − t), so the
    // area under it is ∫y dx = ∫₀¹ 12t(1 − t)(24t − 24t²) dt = 288/30 = 9.6. Running left
    // to right over the top is clockwise, hence −9.6.
    const arch = cubic({ x: 0, y: 0 }, { x: 0, y: 4 }, { x: 4, y: 4 }, { x: 4, y: 0 });
    expect(signedArea([arch])).toBeCloseTo(-9.6, 12);
    expect(signedArea([arch, line({ x: 4, y: 0 }, { x: 0, y: 0 })])).toBeCloseTo(-9.6, 12);
    // Quadratic arch (0,0),(5,10),(10,0): area under = ⅔·base·height = ⅔·10·5.
    expect(signedArea([quad({ x: 0, y: 0 }, { x: 5, y: 10 }, { x: 10, y: 0 })])).toBeCloseTo(-100 / 3, 12);
  });
});
