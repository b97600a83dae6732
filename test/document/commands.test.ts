// The smaller editing commands: selecting by click and marquee, toggling corner and
// smooth, forcing a corner the fitter rounded over, snapping to the unit grid, and
// spacing by sidebearings — each as a designer would see it.
import { describe, expect, it } from 'vitest';
import { cross, cubic, line, sub, type Point } from '../../core/geometry/index.ts';
import { contourFromSegments, contourSegments } from '../../core/outline/index.ts';
import {
  apply,
  createEditorState,
  dispatch,
  forceCorner,
  forceCornerAt,
  glyphSidebearings,
  pointAt,
  selectAt,
  selectInRect,
  selectPoints,
  setAdvanceWidth,
  setLeftSidebearing,
  setRightSidebearing,
  snapToGrid,
  toggleSmooth,
  undo,
} from '../../core/document/index.ts';
import { circleContour, oneGlyph, squareContour } from './support.ts';

function sine(u: Point, v: Point): number {
  return cross(u, v) / (Math.hypot(u.x, u.y) * Math.hypot(v.x, v.y));
}

describe('selection', () => {
  const doc = oneGlyph([squareContour(0, 0, 100, 100), squareContour(200, 0, 300, 100)]);

  it('a click picks the nearest point within the radius, and a click on nothing clears the selection', () => {
    expect(pointAt(doc, 'o', { x: 103, y: 2 }, 5)).toEqual({ glyph: 'o', contour: 0, point: 1 });
    expect(pointAt(doc, 'o', { x: 150, y: 50 }, 5)).toBeNull();
    const picked = apply(doc, selectAt(doc, 'o', { x: 198, y: 1 }, 5));
    expect(picked.selection).toEqual([{ glyph: 'o', contour: 1, point: 0 }]);
    expect(apply(picked, selectAt(picked, 'o', { x: 150, y: 50 }, 5)).selection).toEqual([]);
  });

  it('a marquee selects every point inside, and shift/alt add, remove or toggle', () => {
    const boxed = apply(doc, selectInRect(doc, 'o', { x0: -10, y0: -10, x1: 110, y1: 50 }));
    expect(boxed.selection.map((r) => r.point)).toEqual([0, 1]);
    const added = apply(boxed, selectInRect(boxed, 'o', { x0: 190, y0: 90, x1: 210, y1: 110 }, 'add'));
    expect(added.selection).toHaveLength(3);
    const removed = apply(added, selectPoints(added, [{ glyph: 'o', contour: 0, point: 0 }], 'remove'));
    expect(removed.selection).toEqual([{ glyph: 'o', contour: 0, point: 1 }, { glyph: 'o', contour: 1, point: 3 }]);
    const toggled = apply(removed, selectPoints(removed, [{ glyph: 'o', contour: 0, point: 1 }, { glyph: 'o', contour: 0, point: 2 }], 'toggle'));
    expect(toggled.selection).toEqual([{ glyph: 'o', contour: 0, point: 2 }, { glyph: 'o', contour: 1, point: 3 }]);
  });
});

describe('corner and smooth', () => {
  // A corner at (100, 0) between two curves whose handles make a 30° kink.
  const kinked = contourFromSegments(
    [cubic({ x: 0, y: 0 }, { x: 30, y: 40 }, { x: 60, y: -10 }, { x: 100, y: 0 }), cubic({ x: 100, y: 0 }, { x: 140, y: 30 }, { x: 120, y: 80 }, { x: 50, y: 90 }), line({ x: 50, y: 90 }, { x: 0, y: 0 })],
    [false, false, false],
  );

  it('making a corner smooth turns its handles onto one line, each keeping its length', () => {
    let doc = oneGlyph([kinked]);
    doc = apply(doc, selectPoints(doc, [{ glyph: 'o', contour: 0, point: 3 }]));
    const after = apply(doc, toggleSmooth(doc)!);
    const p = after.glyphs.o!.outline.contours[0]!.points;
    const q = kinked.points;
    expect(p[3]!.smooth).toBe(true);
    expect(Math.abs(sine(sub(p[3]!, p[2]!), sub(p[4]!, p[3]!)))).toBeLessThan(1e-12);
    expect(Math.hypot(p[2]!.x - 100, p[2]!.y)).toBeCloseTo(Math.hypot(q[2]!.x - 100, q[2]!.y), 9);
    expect(Math.hypot(p[4]!.x - 100, p[4]!.y)).toBeCloseTo(Math.hypot(q[4]!.x - 100, q[4]!.y), 9);
    // Toggling back clears the flag and moves nothing.
    const back = apply(after, toggleSmooth(after)!);
    expect(back.glyphs.o!.outline.contours[0]!.points[3]).toEqual({ ...p[3]!, smooth: false });
    expect(back.glyphs.o!.outline.contours[0]!.points[2]).toEqual(p[2]);
  });

  it('a point between two lines that meet at an angle cannot become smooth', () => {
    let doc = oneGlyph([squareContour(0, 0, 100, 100)]);
    doc = apply(doc, selectPoints(doc, [{ glyph: 'o', contour: 0, point: 1 }]));
    expect(toggleSmooth(doc)).toBeNull();
  });
});

describe('force a corner', () => {
  // A box whose bottom-right corner the fitter rounded: a smooth run B → apex → C where the sides meet at (300, 0).
  const B = { x: 200, y: 0 };
  const C = { x: 300, y: 100 };
  const rounding = cubic(B, { x: 255, y: 0 }, { x: 300, y: 45 }, C);
  const box = contourFromSegments([line({ x: 0, y: 0 }, B), rounding, line(C, { x: 300, y: 300 }), line({ x: 300, y: 300 }, { x: 0, y: 300 }), line({ x: 0, y: 300 }, { x: 0, y: 0 })], [false, true, true, false, false]);

  it('forcing a corner on a rounded-over curve puts a sharp corner where the sides meet', () => {
    const doc = oneGlyph([box]);
    const tr = forceCornerAt(doc, 'o', 0, { x: 290, y: 15 })!;
    expect(tr.userEvent).toBe('point.force-corner');
    const after = apply(doc, tr);
    const contour = after.glyphs.o!.outline.contours[0]!;
    const corner = contour.points[after.selection[0]!.point]!;
    expect(corner.x).toBeCloseTo(300, 9);
    expect(corner.y).toBeCloseTo(0, 9);
    expect(corner.smooth).toBe(false);
    const segments = contourSegments(contour);
    // Here the rounding filled the whole tip, so both sides come out straight, along the old tangents.
    const into = segments[1]!;
    const out = segments[2]!;
    const endDirection = into.kind === 'line' ? sub(into.p1, into.p0) : sub(into.p3, into.p2);
    const startDirection = sub(out.p1, out.p0);
    // The join turns by a right angle now (it was smooth before).
    expect(Math.abs(sine(endDirection, startDirection))).toBeCloseTo(1, 9);
    expect(into.p0).toMatchObject(B);
    expect(segments[3]!.p0).toMatchObject(C);
    expect(tr.report!.maxDeviation).toBeGreaterThan(10); // the corner moved out of the rounding, as asked
  });

  it('forcing a corner at an existing smooth point of the rounding moves it to where the sides meet', () => {
    const [left, right] = [cubic(B, { x: 230, y: 0 }, { x: 262, y: 8 }, { x: 280, y: 20 }), cubic({ x: 280, y: 20 }, { x: 292, y: 38 }, { x: 300, y: 70 }, C)];
    const split = contourFromSegments([line({ x: 0, y: 0 }, B), left, right, line(C, { x: 300, y: 300 }), line({ x: 300, y: 300 }, { x: 0, y: 300 }), line({ x: 0, y: 300 }, { x: 0, y: 0 })], [false, true, true, true, false, false]);
    const doc = oneGlyph([split]);
    const after = apply(doc, forceCorner(doc, { glyph: 'o', contour: 0, point: 4 })!);
    const corner = after.glyphs.o!.outline.contours[0]!.points[4]!;
    expect(corner).toMatchObject({ kind: 'on', smooth: false });
    expect(corner.x).toBeCloseTo(300, 9);
    expect(corner.y).toBeCloseTo(0, 9);
  });
});

describe('grid', () => {
  it('snapping a glyph rounds every point to whole units', () => {
    const doc = oneGlyph([circleContour(10.3, 20.6, 99.9, 8)]);
    const after = apply(doc, snapToGrid(doc, { glyph: 'o' })!);
    for (const p of after.glyphs.o!.outline.contours[0]!.points) {
      expect(Number.isInteger(p.x) && Number.isInteger(p.y)).toBe(true);
    }
  });

  it('snapping the selection moves only the selected points', () => {
    let doc = oneGlyph([circleContour(10.3, 20.6, 99.9, 4)]);
    doc = apply(doc, selectPoints(doc, [{ glyph: 'o', contour: 0, point: 0 }]));
    const after = apply(doc, snapToGrid(doc, { grid: 10 })!);
    const p = after.glyphs.o!.outline.contours[0]!.points;
    expect(p[0]).toMatchObject({ x: 110, y: 20 });
    expect(p[1]).toEqual(doc.glyphs.o!.outline.contours[0]!.points[1]);
  });
});

describe('metrics', () => {
  it('setting the left sidebearing moves the outline and keeps the right sidebearing; undo restores both', () => {
    let state = createEditorState(oneGlyph([squareContour(40, 0, 440, 700)], 520));
    expect(glyphSidebearings(state.document.glyphs.o!)).toEqual({ left: 40, right: 80 });
    state = dispatch(state, setLeftSidebearing(state.document, 'o', 60));
    expect(state.history.done[0]!.userEvent).toBe('metrics.sidebearing');
    expect(glyphSidebearings(state.document.glyphs.o!)).toEqual({ left: 60, right: 80 });
    expect(state.document.glyphs.o!.advanceWidth).toBe(540);
    state = undo(state);
    expect(state.document.glyphs.o!.advanceWidth).toBe(520);
    expect(glyphSidebearings(state.document.glyphs.o!)).toEqual({ left: 40, right: 80 });
  });

  it('setting the right sidebearing or the advance changes only the advance', () => {
    const doc = oneGlyph([squareContour(40, 0, 440, 700)], 520);
    const right = apply(doc, setRightSidebearing(doc, 'o', 100)!);
    expect(right.glyphs.o!.advanceWidth).toBe(540);
    expect(right.glyphs.o!.outline).toBe(doc.glyphs.o!.outline);
    const wide = apply(doc, setAdvanceWidth(doc, 'o', 600)!);
    expect(glyphSidebearings(wide.glyphs.o!)).toEqual({ left: 40, right: 160 });
  });

  it('a glyph without ink has no sidebearings to set', () => {
    const doc = oneGlyph([], 250);
    expect(glyphSidebearings(doc.glyphs.o!)).toBeNull();
    expect(setLeftSidebearing(doc, 'o', 10)).toBeNull();
  });
});
