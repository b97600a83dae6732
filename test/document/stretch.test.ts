// Refitting a stretch replaces many points by the fewest cubics that stay within the
// tolerance asked for, keeps corners and the stretch's end tangents; drawing through
// points gives a curve that passes exactly through every point and is smooth at the
// smooth ones (a Catmull–Rom spline converted to Béziers).
import { describe, expect, it } from 'vitest';
import { cross, dot, evaluate, sub, type Point } from '../../core/geometry/index.ts';
import { contourSegments } from '../../core/outline/index.ts';
import { apply, drawContour, drawStretch, drawThrough, refitSelection, refitStretch, selectPoints, type DrawPoint } from '../../core/document/index.ts';
import { circleContour, oneGlyph, squareContour } from './support.ts';

/** G1 demanded at smooth points: the sine of the angle between the handles (rounding-level). */
const G1_SINE = 1e-9;

function sine(u: Point, v: Point): number {
  return cross(u, v) / (Math.hypot(u.x, u.y) * Math.hypot(v.x, v.y));
}

describe('refit a stretch', () => {
  const R = 400;

  it('a circle of 32 arcs refitted at 1 unit becomes the few arcs the tolerance needs, and stays on the circle', () => {
    const doc = oneGlyph([circleContour(0, 0, R, 32)]);
    const first = doc.glyphs.o!.outline.contours[0]!.points[0]!;
    const tr = refitStretch(doc, { glyph: 'o', contour: 0, from: 0, to: 0 }, 1)!;
    const after = apply(doc, tr);
    const segments = contourSegments(after.glyphs.o!.outline.contours[0]!);
    // Cubic arcs with 4/3·tan(θ/4) handles (Riškus 2006) are off the circle by 1.84 % of r
    // over 180° (7 units here) and 0.154 % over 120° (0.6 units; both measured by dense
    // sampling), so two arcs cannot keep within one unit and three can.
    // Greedy breakpoints on samples may need one more than the optimum.
    expect(segments.length).toBeGreaterThanOrEqual(3);
    expect(segments.length).toBeLessThanOrEqual(4);
    expect(tr.report!.maxDeviation).toBeLessThanOrEqual(1);
    for (const s of segments) for (let k = 0; k <= 50; k++) {
      const p = evaluate(s, k / 50);
      expect(Math.abs(Math.hypot(p.x, p.y) - R)).toBeLessThanOrEqual(1);
    }
    expect(after.glyphs.o!.outline.contours[0]!.points[0]).toMatchObject({ x: first.x, y: first.y });
    // Every join is smooth.
    for (let i = 0; i < segments.length; i++) {
      const a = segments[i]!;
      const b = segments[(i + 1) % segments.length]!;
      if (a.kind !== 'cubic' || b.kind !== 'cubic') throw new Error('expected cubics');
      expect(Math.abs(sine(sub(a.p3, a.p2), sub(b.p1, b.p0)))).toBeLessThan(1e-6);
    }
  });

  it('a tighter tolerance keeps more points', () => {
    const doc = oneGlyph([circleContour(0, 0, R, 32)]);
    const count = (tolerance: number) => contourSegments(apply(doc, refitStretch(doc, { glyph: 'o', contour: 0, from: 0, to: 0 }, tolerance)!).glyphs.o!.outline.contours[0]!).length;
    expect(count(0.01)).toBeGreaterThan(count(1));
  });

  it('refitting the selected run changes only that run and keeps its ends and their tangents', () => {
    let doc = oneGlyph([circleContour(0, 0, R, 16)]);
    const points = doc.glyphs.o!.outline.contours[0]!.points;
    // On-curve points 0, 3, 6, 9, 12 (0°…90°) selected.
    doc = apply(doc, selectPoints(doc, [0, 3, 6, 9, 12].map((point) => ({ glyph: 'o', contour: 0, point }))));
    const after = apply(doc, refitSelection(doc, 1)!);
    const segments = contourSegments(after.glyphs.o!.outline.contours[0]!);
    expect(segments).toHaveLength(13);
    const quarter = segments[0]!;
    if (quarter.kind !== 'cubic') throw new Error('expected a cubic');
    expect(quarter.p0).toMatchObject({ x: points[0]!.x, y: points[0]!.y });
    expect(quarter.p3).toMatchObject({ x: points[12]!.x, y: points[12]!.y });
    expect(quarter.p1.x).toBeCloseTo(R, 9);
    expect(after.selection.map((r) => r.point)).toEqual([0, 3]);
  });

  it('a corner inside the stretch is kept', () => {
    const doc = oneGlyph([squareContour(0, 0, 100, 100)]);
    const after = apply(doc, refitStretch(doc, { glyph: 'o', contour: 0, from: 0, to: 0 }, 1) ?? { userEvent: 'stretch.refit', changes: [] });
    expect(contourSegments(after.glyphs.o!.outline.contours[0]!)).toEqual(contourSegments(doc.glyphs.o!.outline.contours[0]!));
  });
});

describe('draw through points', () => {
  const clicks: DrawPoint[] = [
    { x: 0, y: 0 },
    { x: 120, y: 40, smooth: true },
    { x: 260, y: 10 },
    { x: 330, y: 200, smooth: false },
    { x: 200, y: 320 },
    { x: 60, y: 250 },
  ];

  it('the curve passes exactly through every given point, in order', () => {
    const { segments } = drawThrough(clicks);
    expect(segments).toHaveLength(clicks.length);
    segments.forEach((s, i) => {
      expect(s.p0.x).toBe(clicks[i]!.x);
      expect(s.p0.y).toBe(clicks[i]!.y);
      const end = s.kind === 'line' ? s.p1 : s.p3;
      expect(end.x).toBe(clicks[(i + 1) % clicks.length]!.x);
      expect(end.y).toBe(clicks[(i + 1) % clicks.length]!.y);
    });
  });

  it('the curve is G1 at every smooth point, and a corner is where one was asked for', () => {
    const { segments, smooth } = drawThrough(clicks);
    expect(smooth).toEqual([true, true, true, false, true, true]);
    for (let i = 0; i < segments.length; i++) {
      const before = segments[(i + segments.length - 1) % segments.length]!;
      const after = segments[i]!;
      if (before.kind !== 'cubic' || after.kind !== 'cubic') throw new Error('expected cubics');
      const incoming = sub(before.p3, before.p2);
      const outgoing = sub(after.p1, after.p0);
      if (smooth[i]) {
        expect(Math.abs(sine(incoming, outgoing))).toBeLessThan(G1_SINE);
        expect(dot(incoming, outgoing)).toBeGreaterThan(0);
      } else {
        expect(Math.abs(sine(incoming, outgoing))).toBeGreaterThan(0.01);
      }
    }
  });

  it('drawing a contour adds it to the glyph and selects its points; undoing removes it', () => {
    const doc = oneGlyph([]);
    const tr = drawContour(doc, 'o', clicks)!;
    expect(tr.userEvent).toBe('stretch.draw');
    const after = apply(doc, tr);
    const contour = after.glyphs.o!.outline.contours[0]!;
    expect(contour.points.filter((p) => p.kind === 'on').map((p) => ({ x: p.x, y: p.y }))).toEqual(clicks.map(({ x, y }) => ({ x, y })));
    expect(after.selection).toHaveLength(clicks.length);
  });

  it('two corners in a row are joined by a line', () => {
    const { segments } = drawThrough([{ x: 0, y: 0, smooth: false }, { x: 100, y: 0, smooth: false }, { x: 50, y: 80 }]);
    expect(segments[0]!.kind).toBe('line');
  });

  it('drawing a stretch between two points of a contour passes through the given points and keeps the rest', () => {
    const doc = oneGlyph([squareContour(0, 0, 300, 300)]);
    const tr = drawStretch(doc, { glyph: 'o', contour: 0, from: 1, to: 2 }, [{ x: 360, y: 100 }, { x: 340, y: 220 }])!;
    const after = apply(doc, tr);
    const segments = contourSegments(after.glyphs.o!.outline.contours[0]!);
    expect(segments).toHaveLength(6);
    expect(segments.map((s) => s.p0).map(({ x, y }) => [x, y])).toEqual([[0, 0], [300, 0], [360, 100], [340, 220], [300, 300], [0, 300]]);
  });
});
