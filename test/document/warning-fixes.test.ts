// One-click fixes for outline warnings (core/document/warning-fixes.ts): each removes
// the warning it was offered for, keeps the shape (within rounding to the unit grid),
// and undoes exactly. The extremum fix is checked against bezier-js's own extrema
// (npm `bezier-js`, Pomax), the rule itself being the trade's (common practice): an
// on-curve point at every horizontal and vertical extreme, with axis-aligned handles.
import { describe, expect, it } from 'vitest';
import { Bezier } from 'bezier-js';
import { cubic, type CubicSegment, type Point } from '../../core/geometry/index.ts';
import { contourArea, contourFromSegments, contourSegments, reverseContour } from '../../core/outline/index.ts';
import { checkOutline } from '../../core/checks/index.ts';
import { turnAtJoin, KINK_MIN_DEGREES } from '../../core/fit/index.ts';
import { apply, fixWarning, hasFix, invertTransaction, shapeDeviation } from '../../core/document/index.ts';
import { circleContour, oneGlyph, squareContour } from './support.ts';

/** A circle of four arcs turned by `degrees` and rounded to whole units: its extremes fall inside the arcs. */
function turnedCircle(degrees: number) {
  const circle = circleContour(0, 0, 200, 4);
  const a = (degrees * Math.PI) / 180;
  const turn = (p: Point): Point => ({ x: Math.round(500 + p.x * Math.cos(a) - p.y * Math.sin(a)), y: Math.round(400 + p.x * Math.sin(a) + p.y * Math.cos(a)) });
  return { points: circle.points.map((p) => ({ ...p, ...turn(p) })) };
}

describe('fixing warnings', () => {
  it('puts an on-curve point with axis-aligned handles at a missing extreme, where bezier-js finds it', () => {
    const doc = oneGlyph([turnedCircle(17)]);
    const warnings = checkOutline(doc.glyphs.o!.outline).filter((w) => w.kind === 'extremum-inside-segment');
    expect(warnings).toHaveLength(4);
    const warning = warnings[0]!;
    expect(hasFix(warning)).toBe(true);
    const before = contourSegments(doc.glyphs.o!.outline.contours[0]!);
    // The outside reference: bezier-js's extrema of the segment holding the extreme.
    const reference = before.flatMap((s) => {
      if (s.kind !== 'cubic') return [];
      const b = new Bezier(s.p0.x, s.p0.y, s.p1.x, s.p1.y, s.p2.x, s.p2.y, s.p3.x, s.p3.y);
      const e = b.extrema();
      return [...e.x.map((t) => ({ axis: 'x' as const, ...b.compute(t) })), ...e.y.map((t) => ({ axis: 'y' as const, ...b.compute(t) }))];
    }).find((p) => Math.hypot(p.x - warning.at.x, p.y - warning.at.y) < 1)!;
    expect(reference).toBeDefined();

    const tr = fixWarning(doc, 'o', warning)!;
    const fixed = apply(doc, tr);
    const contour = fixed.glyphs.o!.outline.contours[0]!;
    const after = checkOutline(fixed.glyphs.o!.outline).filter((w) => w.kind === 'extremum-inside-segment');
    expect(after).toHaveLength(3);
    const i = contour.points.findIndex((p) => p.kind === 'on' && Math.hypot(p.x - reference.x, p.y - reference.y) <= Math.SQRT1_2);
    expect(i).toBeGreaterThanOrEqual(0);
    const point = contour.points[i]!;
    const hIn = contour.points[(i - 1 + contour.points.length) % contour.points.length]!;
    const hOut = contour.points[(i + 1) % contour.points.length]!;
    expect(point.smooth).toBe(true);
    for (const q of [point, hIn, hOut]) expect(Number.isInteger(q.x) && Number.isInteger(q.y)).toBe(true);
    if (reference.axis === 'x') expect([hIn.x, hOut.x]).toEqual([point.x, point.x]);
    else expect([hIn.y, hOut.y]).toEqual([point.y, point.y]);
    // Rounding the split's new coordinates moves the curve by well under a unit.
    expect(shapeDeviation(before, contourSegments(contour))).toBeLessThanOrEqual(0.75);
    // No new warning: the new join is exactly smooth and on the grid (the turned circle's
    // own four joins, rounded on their own, were near-miss kinks already).
    const near = (w: { at: Point }) => Math.hypot(w.at.x - point.x, w.at.y - point.y) < 1;
    expect(checkOutline(fixed.glyphs.o!.outline).filter((w) => w.kind !== 'extremum-inside-segment' && near(w))).toEqual([]);
    expect(checkOutline(fixed.glyphs.o!.outline).filter((w) => w.kind !== 'extremum-inside-segment').length).toBeLessThanOrEqual(checkOutline(doc.glyphs.o!.outline).filter((w) => w.kind !== 'extremum-inside-segment').length);
    // Undo restores the contour exactly.
    expect(apply(fixed, invertTransaction(tr)).glyphs.o!.outline).toEqual(doc.glyphs.o!.outline);
  });

  it('makes a near-miss kink smooth', () => {
    // Two arcs of a bowl meeting at (300, 0) with a 3° turn between their handles.
    const a = cubic({ x: 0, y: 0 }, { x: 100, y: -80 }, { x: 200, y: -80 }, { x: 300, y: 0 });
    const kinkedHandle = { x: 300 + 80 * Math.cos((38.66 + 3) * (Math.PI / 180)), y: 80 * Math.sin((38.66 + 3) * (Math.PI / 180)) };
    const b = cubic({ x: 300, y: 0 }, kinkedHandle, { x: 150, y: 250 }, { x: 0, y: 0 });
    const doc = oneGlyph([contourFromSegments([a, b], [false, true])]);
    const warning = checkOutline(doc.glyphs.o!.outline).find((w) => w.kind === 'near-miss-kink')!;
    expect(warning).toBeDefined();
    const fixed = apply(doc, fixWarning(doc, 'o', warning)!);
    const [s0, s1] = contourSegments(fixed.glyphs.o!.outline.contours[0]!) as CubicSegment[];
    expect(turnAtJoin(s0!, s1!)).toBeLessThan(KINK_MIN_DEGREES);
    expect(checkOutline(fixed.glyphs.o!.outline).some((w) => w.kind === 'near-miss-kink')).toBe(false);
  });

  it('reverses a contour that runs the wrong way, and snaps off-grid points', () => {
    const doc = oneGlyph([reverseContour(squareContour(10.25, 0, 300, 700.5))]);
    const warnings = checkOutline(doc.glyphs.o!.outline);
    const direction = warnings.find((w) => w.kind === 'wrong-direction')!;
    const offGrid = warnings.find((w) => w.kind === 'off-grid-point')!;
    expect(direction && offGrid).toBeTruthy();
    const reversed = apply(doc, fixWarning(doc, 'o', direction)!);
    expect(contourArea(reversed.glyphs.o!.outline.contours[0]!)).toBeGreaterThan(0);
    const snapped = apply(reversed, fixWarning(reversed, 'o', offGrid)!);
    expect(checkOutline(snapped.glyphs.o!.outline)).toEqual([]);
  });

  it('offers no fix for crossing handles or tiny segments, which need the designer', () => {
    expect(hasFix({ kind: 'crossing-handles', contour: 0, at: { x: 0, y: 0 }, value: 0, message: '' })).toBe(false);
    expect(hasFix({ kind: 'tiny-segment', contour: 0, at: { x: 0, y: 0 }, value: 0, message: '' })).toBe(false);
  });
});
