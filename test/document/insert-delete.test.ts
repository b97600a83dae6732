// Inserting a point leaves the outline's shape exactly as it was, and deleting a point
// refits its neighbours so the shape stays within the stated tolerance: on a circle of
// eight arcs, deleting one point leaves a quarter arc as good as the classic four-arc
// circle's, with smooth joins kept.
import { describe, expect, it } from 'vitest';
import { Bezier } from 'bezier-js';
import fc from 'fast-check';
import { cross, cubic, evaluate, line, type CubicSegment, type Point } from '../../core/geometry/index.ts';
import { contourFromSegments, contourSegments } from '../../core/outline/index.ts';
import { apply, deleteSelection, insertPoint, insertPointNear, selectPoints, type GlyphDocument } from '../../core/document/index.ts';
import { circleContour, oneGlyph, segmentsOf } from './support.ts';

/** Agreement with bezier-js's split, relative to the glyph's coordinate scale (rounding-level). */
const SPLIT_AGREEMENT = 1e-9;

function cubicOf(doc: GlyphDocument, segment: number): CubicSegment {
  const s = segmentsOf(doc.glyphs.o!.outline.contours[0])[segment];
  if (s?.kind !== 'cubic') throw new Error('expected a cubic');
  return s;
}

describe('insert a point', () => {
  it('splitting a cubic gives the halves bezier-js computes, so the curve is unchanged', () => {
    // Outside reference: bezier-js 6.1.4 (npm `bezier-js`, Pomax), Bezier.split(t).
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: -1000, max: 1000 }), { minLength: 4, maxLength: 4 }),
        fc.double({ min: 0.01, max: 0.99, noNaN: true }),
        ([a, b, c, d], t) => {
          const p0 = { x: 0, y: 0 };
          const p3 = { x: 1000, y: 200 };
          const segment = cubic(p0, { x: a!, y: b! }, { x: c!, y: d! }, p3);
          const doc = oneGlyph([contourFromSegments([segment, line(p3, p0)])]);
          const after = apply(doc, insertPoint(doc, { glyph: 'o', contour: 0, segment: 0, t })!);
          const left = cubicOf(after, 0);
          const right = cubicOf(after, 1);
          const reference = new Bezier(p0.x, p0.y, a!, b!, c!, d!, p3.x, p3.y).split(t);
          const close = (p: Point, q: { x: number; y: number }) => Math.hypot(p.x - q.x, p.y - q.y) <= SPLIT_AGREEMENT * 1000;
          [left.p0, left.p1, left.p2, left.p3].forEach((p, i) => expect(close(p, reference.left.points[i]!)).toBe(true));
          [right.p0, right.p1, right.p2, right.p3].forEach((p, i) => expect(close(p, reference.right.points[i]!)).toBe(true));
          // Samples of the halves lie on the original: left(s) = B(s·t), right(s) = B(t + s(1 − t)).
          for (let k = 0; k <= 16; k++) {
            const s = k / 16;
            expect(close(evaluate(left, s), evaluate(segment, s * t))).toBe(true);
            expect(close(evaluate(right, s), evaluate(segment, t + s * (1 - t)))).toBe(true);
          }
          expect(after.glyphs.o!.outline.contours[0]!.points[3]).toMatchObject({ kind: 'on', smooth: true });
          expect(after.selection).toEqual([{ glyph: 'o', contour: 0, point: 3 }]);
        },
      ),
      { seed: 1959, numRuns: 200 },
    );
  });

  it('inserting on the closing segment keeps the contour starting at the same point', () => {
    const doc = oneGlyph([circleContour(0, 0, 100, 4)]);
    const after = apply(doc, insertPoint(doc, { glyph: 'o', contour: 0, segment: 3, t: 0.5 })!);
    const points = after.glyphs.o!.outline.contours[0]!.points;
    expect(points[0]).toEqual(doc.glyphs.o!.outline.contours[0]!.points[0]);
    expect(points).toHaveLength(15);
    expect(after.selection[0]!.point).toBe(12);
  });

  it('a click near a line inserts a corner point on the line', () => {
    const square = contourFromSegments([line({ x: 0, y: 0 }, { x: 100, y: 0 }), line({ x: 100, y: 0 }, { x: 100, y: 100 }), line({ x: 100, y: 100 }, { x: 0, y: 0 })]);
    const doc = oneGlyph([square]);
    const after = apply(doc, insertPointNear(doc, 'o', { x: 40, y: -3 })!);
    expect(after.glyphs.o!.outline.contours[0]!.points[1]).toEqual({ x: 40, y: 0, kind: 'on', smooth: false });
  });
});

describe('delete a point and refit', () => {
  const R = 500;
  const TOLERANCE = 1; // font units, stated to the command

  function distanceFromCircle(p: Point): number {
    return Math.abs(Math.hypot(p.x, p.y) - R);
  }

  it('deleting one point of an eight-arc circle leaves a quarter arc within tolerance, like the four-arc circle', () => {
    let doc = oneGlyph([circleContour(0, 0, R, 8)]);
    doc = apply(doc, selectPoints(doc, [{ glyph: 'o', contour: 0, point: 3 }])); // the point at 45°
    const tr = deleteSelection(doc, { tolerance: TOLERANCE })!;
    const after = apply(doc, tr);
    const segments = contourSegments(after.glyphs.o!.outline.contours[0]!);
    expect(segments).toHaveLength(7);
    const merged = segments[0]!;
    if (merged.kind !== 'cubic') throw new Error('expected a cubic');
    expect(tr.report!.maxDeviation).toBeLessThanOrEqual(TOLERANCE);
    // Independent measure: the merged arc against the true circle.
    for (let k = 0; k <= 200; k++) expect(distanceFromCircle(evaluate(merged, k / 200))).toBeLessThan(TOLERANCE);
    // The neighbours were smooth, so their tangents are kept: the handles stay perpendicular to the radius.
    expect(merged.p1.x).toBeCloseTo(R, 9);
    expect(merged.p2.y).toBeCloseTo(R, 9);
    // Published reference: the four-arc circle's handle is 0.5522847498·r (Riškus 2006). A least-squares fit
    // to the arc may differ by the arc's own tolerance, a few ten-thousandths of r.
    expect(Math.abs((merged.p1.y - 0) / R - 0.5522847498)).toBeLessThan(2e-3);
    expect(Math.abs(merged.p2.x / R - 0.5522847498)).toBeLessThan(2e-3);
    // The joins at the neighbours stay smooth.
    const before = segments[segments.length - 1]!;
    if (before.kind !== 'cubic') throw new Error('expected a cubic');
    expect(Math.abs(cross({ x: merged.p1.x - merged.p0.x, y: merged.p1.y - merged.p0.y }, { x: before.p3.x - before.p2.x, y: before.p3.y - before.p2.y }))).toBeLessThan(1e-6);
    expect(after.selection).toEqual([]);
  });

  it('the reported deviation is the real one: deleting two of the eight points exceeds a tight tolerance and says so', () => {
    let doc = oneGlyph([circleContour(0, 0, R, 8)]);
    doc = apply(doc, selectPoints(doc, [{ glyph: 'o', contour: 0, point: 3 }, { glyph: 'o', contour: 0, point: 6 }]));
    const tr = deleteSelection(doc, { tolerance: 0.5 })!;
    const merged = contourSegments(apply(doc, tr).glyphs.o!.outline.contours[0]!)[0]!;
    let worst = 0;
    for (let k = 0; k <= 400; k++) worst = Math.max(worst, distanceFromCircle(evaluate(merged, k / 400)));
    // One cubic cannot follow 135° of a circle of radius 500 to half a unit.
    expect(worst).toBeGreaterThan(0.5);
    expect(tr.report!.maxDeviation).toBeGreaterThan(0.5);
    expect(tr.report!.maxDeviation).toBeGreaterThanOrEqual(worst * 0.9);
  });

  it('deleting a handle retracts both handles of its segment into a line', () => {
    let doc = oneGlyph([circleContour(0, 0, 100, 4)]);
    doc = apply(doc, selectPoints(doc, [{ glyph: 'o', contour: 0, point: 1 }]));
    const after = apply(doc, deleteSelection(doc)!);
    const segments = contourSegments(after.glyphs.o!.outline.contours[0]!);
    expect(segments[0]!.kind).toBe('line');
    expect(segments).toHaveLength(4);
  });

  it('deleting all but one on-curve point removes the contour', () => {
    let doc = oneGlyph([circleContour(0, 0, 100, 4), circleContour(500, 0, 100, 4)]);
    doc = apply(doc, selectPoints(doc, [0, 3, 6].map((point) => ({ glyph: 'o', contour: 0, point }))));
    const after = apply(doc, deleteSelection(doc)!);
    expect(after.glyphs.o!.outline.contours).toEqual([doc.glyphs.o!.outline.contours[1]]);
  });
});
