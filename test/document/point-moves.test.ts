// Dragging and nudging behave as a type designer expects: arrow keys move by one unit
// (ten with shift), an on-curve point carries its handles, a handle of a smooth point
// turns its partner so the two stay collinear, shift keeps horizontal and vertical
// handles so, and a smooth point next to a line keeps following the line.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { cross, sub, type Point } from '../../core/geometry/index.ts';
import { contourFromSegments, type OutlineContour } from '../../core/outline/index.ts';
import { cubic, line } from '../../core/geometry/index.ts';
import { apply, beginDrag, dragTo, movePoints, nudgeSelection, selectPoints } from '../../core/document/index.ts';
import { circleContour, oneGlyph } from './support.ts';

/** Collinearity demanded of a smooth point's handles after a drag (the brief: 1e-9, on unit directions). */
const COLLINEAR = 1e-9;

function unitCross(anchor: Point, a: Point, b: Point): number {
  const u = sub(anchor, a);
  const v = sub(b, anchor);
  return cross(u, v) / (Math.hypot(u.x, u.y) * Math.hypot(v.x, v.y));
}

function pointsOf(contour: OutlineContour | undefined) {
  if (!contour) throw new Error('missing contour');
  return contour.points;
}

describe('nudging', () => {
  it('an arrow key moves the selection one unit, ten with shift, with the handles of moved on-curve points', () => {
    let doc = oneGlyph([circleContour(400, 400, 300, 4)]);
    doc = apply(doc, selectPoints(doc, [{ glyph: 'o', contour: 0, point: 0 }]));
    const before = pointsOf(doc.glyphs.o!.outline.contours[0]);
    const once = apply(doc, nudgeSelection(doc, 'right')!);
    const shifted = apply(doc, nudgeSelection(doc, 'up', { shift: true })!);
    const p1 = pointsOf(once.glyphs.o!.outline.contours[0]);
    const p10 = pointsOf(shifted.glyphs.o!.outline.contours[0]);
    const n = before.length;
    for (const i of [n - 1, 0, 1]) {
      expect(p1[i]!.x - before[i]!.x).toBe(1);
      expect(p1[i]!.y).toBe(before[i]!.y);
      expect(p10[i]!.y - before[i]!.y).toBe(10);
      expect(p10[i]!.x).toBe(before[i]!.x);
    }
    expect(p1[2]).toEqual(before[2]); // the far handle of the next segment stays
  });

  it('nudging with nothing selected does nothing', () => {
    expect(nudgeSelection(oneGlyph([circleContour(0, 0, 100, 4)]), 'left')).toBeNull();
  });
});

describe('dragging handles', () => {
  it('dragging one handle of a smooth point turns the other to stay collinear, keeping its length', () => {
    const contour = circleContour(400, 400, 300, 4);
    const points = contour.points; // [on, h1, h2, on, …]: handle 1 belongs to point 0, whose other handle is the last point
    const n = points.length;
    const oppositeLength = Math.hypot(points[n - 1]!.x - points[0]!.x, points[n - 1]!.y - points[0]!.y);
    fc.assert(
      fc.property(fc.double({ min: -300, max: 300, noNaN: true }), fc.double({ min: -300, max: 300, noNaN: true }), (dx, dy) => {
        const moved = movePoints(contour, new Set([1]), { x: dx, y: dy });
        const p = moved.points;
        if (Math.hypot(p[1]!.x - p[0]!.x, p[1]!.y - p[0]!.y) < 1e-6) return; // a handle dragged onto its point has no direction
        expect(Math.abs(unitCross(p[0]!, p[n - 1]!, p[1]!))).toBeLessThan(COLLINEAR);
        expect(Math.hypot(p[n - 1]!.x - p[0]!.x, p[n - 1]!.y - p[0]!.y)).toBeCloseTo(oppositeLength, 9);
        expect(p[0]).toEqual(points[0]);
      }),
      { seed: 4242, numRuns: 200 },
    );
  });

  it('a whole drag gesture keeps the handles collinear at every pointer move', () => {
    let doc = oneGlyph([circleContour(400, 400, 300, 8)]);
    doc = apply(doc, selectPoints(doc, [{ glyph: 'o', contour: 0, point: 5 }]));
    const gesture = beginDrag(doc);
    for (let move = 1; move <= 50; move++) {
      doc = apply(doc, dragTo(doc, gesture, { x: 3 * move * Math.cos(move), y: 2 * move }));
      const p = pointsOf(doc.glyphs.o!.outline.contours[0]);
      expect(Math.abs(unitCross(p[6]!, p[5]!, p[7]!))).toBeLessThan(COLLINEAR); // handle 5 belongs to on-curve point 6
    }
  });

  it('with shift, a horizontal handle stays horizontal and its partner too', () => {
    const contour = circleContour(0, 0, 100, 4); // at the top point (index 3) the handles are horizontal
    const moved = movePoints(contour, new Set([4]), { x: 17, y: 9 }, true);
    expect(moved.points[4]!.y).toBe(contour.points[3]!.y);
    expect(moved.points[2]!.y).toBe(contour.points[3]!.y);
    expect(moved.points[4]!.x).toBeCloseTo(contour.points[4]!.x + 17, 12);
  });

  it('with shift, an on-curve drag keeps to its larger axis', () => {
    const contour = circleContour(0, 0, 100, 4);
    const moved = movePoints(contour, new Set([3]), { x: 4, y: 30 }, true);
    expect(moved.points[3]!.x).toBe(contour.points[3]!.x);
    expect(moved.points[3]!.y).toBe(contour.points[3]!.y + 30);
  });

  it('dragging an on-curve point carries both handles by the same offset', () => {
    const contour = circleContour(0, 0, 100, 4);
    const moved = movePoints(contour, new Set([3]), { x: 12, y: -5 });
    for (const i of [2, 3, 4]) {
      expect(moved.points[i]!.x).toBeCloseTo(contour.points[i]!.x + 12, 12);
      expect(moved.points[i]!.y).toBeCloseTo(contour.points[i]!.y - 5, 12);
    }
  });

  it('a smooth point between a line and a curve keeps its handle on the line when either moves', () => {
    // A "D"-like shape: a vertical stem line into a smooth point at (0, 100), then a bowl.
    const a = { x: 0, y: 0 };
    const b = { x: 0, y: 100 };
    const bowl = cubic(b, { x: 0, y: 160 }, { x: 120, y: 160 }, { x: 120, y: 50 });
    const back = cubic({ x: 120, y: 50 }, { x: 120, y: -20 }, { x: 40, y: -20 }, a);
    const contour = contourFromSegments([line(a, b), bowl, back], [false, true, true]);
    // Drag the handle after the smooth point (index 2) sideways: it slides along the stem direction.
    const handleMoved = movePoints(contour, new Set([2]), { x: 30, y: 20 });
    expect(handleMoved.points[2]!.x).toBeCloseTo(0, 12);
    expect(handleMoved.points[2]!.y).toBeCloseTo(180, 12);
    // Move the stem's far end: the handle turns to follow the line.
    const endMoved = movePoints(contour, new Set([0]), { x: -40, y: 0 });
    const p = endMoved.points;
    expect(Math.abs(unitCross(p[1]!, p[0]!, p[2]!))).toBeLessThan(COLLINEAR);
  });
});
