// The whole fitter on shapes with known answers: what a type designer checks first —
// points at extrema, exact tangents, integer coordinates, smooth joins that stay
// smooth, and an outline within the tolerance of the boundary.

import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { fitContour, fitGlyph } from '../../core/fit/index.ts';
import { contourArea } from '../../core/outline/index.ts';
import { evaluate, inflectionParameters } from '../../core/geometry/index.ts';
import { circleChain, ellipseChain, sCurveBandChain, squareChain, stadiumChain } from './synthetic-chains.ts';
import { allOnGrid, joinsOf, normalisedCross, segmentsOf, turnDegrees } from './support.ts';

/** Published maximum radial error of the four-arc cubic circle, as a share of the radius (Goldapp 1991). */
const CIRCLE_APPROXIMATION_ERROR = 2.7e-4;

describe('fitting a circle', () => {
  const r = 500;
  const centre = { x: 600, y: 600 };

  it('uses four on-curve points, at the extremes, with axis-aligned handles and exact G1', () => {
    const fit = fitContour(circleChain(centre, r, 0.15, 21));
    const joins = joinsOf(fit.contour);
    expect(joins).toHaveLength(4);
    for (const j of joins) {
      expect(j.smooth).toBe(true);
      expect(j.incoming.x === 0 || j.incoming.y === 0).toBe(true);
      expect(Math.abs(normalisedCross(j))).toBeLessThanOrEqual(1e-9);
      const atSide = Math.abs(Math.abs(j.point.x - centre.x) - r) <= 1 || Math.abs(Math.abs(j.point.y - centre.y) - r) <= 1;
      expect(atSide).toBe(true);
    }
  });

  it('deviates from the true circle about as little as the classic four-arc approximation', () => {
    const exact = Array.from({ length: 3142 }, (_, i) => ({ x: centre.x + r * Math.cos((2 * Math.PI * i) / 3142 + 0.2), y: centre.y + r * Math.sin((2 * Math.PI * i) / 3142 + 0.2) }));
    const radialError = (grid: number): number => {
      const fit = fitContour(exact, { grid, tolerance: 0.5 });
      let worst = 0;
      for (const s of segmentsOf(fit.contour)) for (let k = 0; k <= 200; k++) {
        const p = evaluate(s, k / 200);
        worst = Math.max(worst, Math.abs(Math.hypot(p.x - centre.x, p.y - centre.y) - r));
      }
      return worst;
    };
    // Reference: 2.7e-4·r = 0.135 for r = 500 (Goldapp 1991). A least-squares fit to
    // the boundary is not the interpolating approximation, so allow twice that; on the
    // integer grid add the rounding (at most half a unit per coordinate).
    expect(radialError(1e-6)).toBeLessThanOrEqual(2 * CIRCLE_APPROXIMATION_ERROR * r);
    expect(radialError(1)).toBeLessThanOrEqual(2 * CIRCLE_APPROXIMATION_ERROR * r + Math.SQRT1_2);
  });
});

describe('fitting lines and arcs together', () => {
  it('joins the lines and arcs of a stadium tangentially, exactly', () => {
    const fit = fitContour(stadiumChain({ x: 400, y: 300 }, 300, 100, 0.15, 8));
    for (const j of joinsOf(fit.contour)) {
      expect(j.smooth).toBe(true);
      expect(normalisedCross(j)).toBe(0);
    }
  });

  it('keeps the inflection of an S-curve inside one cubic instead of adding points', () => {
    const fit = fitContour(sCurveBandChain(300, 150, 60, 0.15, 4));
    const inflecting = segmentsOf(fit.contour).filter((s) => s.kind === 'cubic' && inflectionParameters(s).length > 0);
    expect(inflecting.length).toBeGreaterThanOrEqual(2);
    expect(fit.report.warnings.filter((w) => w.kind === 'tolerance-exceeded')).toEqual([]);
  });
});

describe('what every fitted contour guarantees', () => {
  const shapes = fc.oneof(
    fc.record({ kind: fc.constant('circle' as const), size: fc.integer({ min: 30, max: 400 }), noise: fc.double({ min: 0, max: 0.3, noNaN: true }), seed: fc.integer({ min: 1, max: 1e6 }) }),
    fc.record({ kind: fc.constant('square' as const), size: fc.integer({ min: 40, max: 500 }), noise: fc.double({ min: 0, max: 0.3, noNaN: true }), seed: fc.integer({ min: 1, max: 1e6 }) }),
    fc.record({ kind: fc.constant('ellipse' as const), size: fc.integer({ min: 60, max: 400 }), noise: fc.double({ min: 0, max: 0.3, noNaN: true }), seed: fc.integer({ min: 1, max: 1e6 }) }),
  );
  const chainOf = (shape: { kind: 'circle' | 'square' | 'ellipse'; size: number; noise: number; seed: number }) =>
    shape.kind === 'circle'
      ? circleChain({ x: 500, y: 500 }, shape.size, shape.noise, shape.seed)
      : shape.kind === 'square'
        ? squareChain(100, 100, shape.size, shape.noise, shape.seed)
        : ellipseChain({ x: 500, y: 500 }, shape.size, shape.size * 0.6, (shape.seed % 90) * (Math.PI / 180), shape.noise, shape.seed);

  it('stays within the tolerance, on the integer grid, with smooth joins kept smooth', () => {
    fc.assert(
      fc.property(shapes, (shape) => {
        const fit = fitContour(chainOf(shape));
        expect(allOnGrid(fit.contour)).toBe(true);
        expect(fit.report.maxDeviationOutsideCorners).toBeLessThanOrEqual(1.5 + 1e-9);
        for (const j of joinsOf(fit.contour)) {
          if (!j.smooth) continue;
          // Axis-aligned joins are exactly collinear; others as collinear as the grid search found (below the kink threshold).
          if (j.incoming.x === 0 || j.incoming.y === 0) expect(normalisedCross(j)).toBe(0);
          else expect(turnDegrees(j)).toBeLessThan(0.3);
        }
      }),
      { numRuns: 12, seed: 4242 },
    );
  });

  it('winds outer contours counter-clockwise and holes clockwise in a glyph', () => {
    const outer = squareChain(0, 0, 400, 0.1, 1);
    const hole = circleChain({ x: 200, y: 200 }, 100, 0.1, 2).reverse();
    const glyph = fitGlyph([{ points: outer, depth: 0 }, { points: hole, depth: 1 }]);
    expect(contourArea(glyph.outline.contours[0]!)).toBeGreaterThan(0);
    expect(contourArea(glyph.outline.contours[1]!)).toBeLessThan(0);
    expect(glyph.report.contourCount).toBe(2);
  });

  it('does not modify the chain it was given', () => {
    const chain = circleChain({ x: 0, y: 0 }, 80, 0.2, 3);
    const copy = chain.map((p) => ({ ...p }));
    fitContour(chain, { forcedCorners: [10] });
    expect(chain).toEqual(copy);
  });

  it('rejects options that cannot work, naming the option', () => {
    const chain = circleChain({ x: 0, y: 0 }, 80, 0.2, 3);
    expect(() => fitContour(chain, { tolerance: 0 })).toThrow(/tolerance/);
    expect(() => fitContour(chain, { cornerAngleDegrees: 200 })).toThrow(/cornerAngleDegrees/);
    expect(() => fitContour(chain, { grid: -1 })).toThrow(/grid/);
  });
});
