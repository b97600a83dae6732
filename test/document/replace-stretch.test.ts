// Redrawing a damaged stretch: between two on-curve points of a contour the outline is
// replaced by a curve through the points the designer clicks. The rest of the contour
// must not move at all, every click must be on the new outline exactly, a smooth end
// must stay smooth (the new handle in line with the kept one) and a corner a corner,
// the contour must keep its direction whichever way the points were clicked, and undo
// must bring the old stretch back in one step.
import { describe, expect, it } from 'vitest';
import { cross, dot, signedArea, sub, type Point } from '../../core/geometry/index.ts';
import { contourSegments, type OutlineContour, type OutlinePoint } from '../../core/outline/index.ts';
import {
  apply,
  contoursEqual,
  createEditorState,
  dispatch,
  replaceStretch,
  selectedStretchEnds,
  selectPoints,
  stretchBetween,
  undo,
  type DrawPoint,
  type GlyphDocument,
  type Stretch,
} from '../../core/document/index.ts';
import { circleContour, oneGlyph, squareContour } from './support.ts';

/** G¹ demanded at a smooth end: the sine of the angle between the kept and the new handle (rounding-level, as the brief asks). */
const G1_SINE = 1e-9;

function sine(u: Point, v: Point): number {
  return cross(u, v) / (Math.hypot(u.x, u.y) * Math.hypot(v.x, v.y));
}

/** `count` points of `points` from index `start` forward, wrapping. */
function cyclicRun(points: readonly OutlinePoint[], start: number, count: number): OutlinePoint[] {
  return Array.from({ length: count }, (_, k) => points[(start + k) % points.length] as OutlinePoint);
}

/** Index in `contour` of the on-curve point at `at`. */
function onCurveIndexAt(contour: OutlineContour, at: Point): number {
  const index = contour.points.findIndex((p) => p.kind === 'on' && p.x === at.x && p.y === at.y);
  if (index < 0) throw new Error(`no on-curve point at ${at.x},${at.y}`);
  return index;
}

/** The kept part of the contour, from the stretch's end round to its start (both included). */
function keptRun(contour: OutlineContour, from: Point, to: Point): OutlinePoint[] {
  const a = onCurveIndexAt(contour, to);
  const b = onCurveIndexAt(contour, from);
  const n = contour.points.length;
  return cyclicRun(contour.points, a, ((b - a + n) % n) + 1);
}

function contourOf(doc: GlyphDocument): OutlineContour {
  return doc.glyphs.o!.outline.contours[0]!;
}

/** A circle of radius 300 in eight smooth arcs: on-curve point k is point index 3k. */
const circle = () => oneGlyph([circleContour(500, 500, 300, 8)]);
/** Clicks outside the circle between on-curve points 1 (45°) and 3 (135°), in that direction (counter-clockwise). */
const bulge: DrawPoint[] = [
  { x: 780, y: 800 },
  { x: 500, y: 900 },
  { x: 220, y: 800 },
];

describe('redraw a stretch between two points', () => {
  const stretch: Stretch = { glyph: 'o', contour: 0, from: 3, to: 9 };

  it('leaves every point outside the stretch exactly where and what it was', () => {
    const doc = circle();
    const before = contourOf(doc);
    const from = before.points[3]!;
    const to = before.points[9]!;
    const after = contourOf(apply(doc, replaceStretch(doc, stretch, bulge)!));
    expect(keptRun(after, from, to)).toEqual(keptRun(before, from, to));
    expect(keptRun(before, from, to)).toHaveLength(3 * 6 + 1);
  });

  it('passes exactly through every clicked point, each an on-curve point, in order from one end to the other', () => {
    const doc = circle();
    const after = contourOf(apply(doc, replaceStretch(doc, stretch, bulge)!));
    const from = onCurveIndexAt(after, contourOf(doc).points[3]!);
    const onCurve = after.points.map((p, i) => ({ p, i })).filter(({ p }) => p.kind === 'on');
    const start = onCurve.findIndex(({ i }) => i === from);
    const next = [1, 2, 3].map((k) => onCurve[(start + k) % onCurve.length]!.p);
    expect(next.map(({ x, y }) => ({ x, y }))).toEqual(bulge.map(({ x, y }) => ({ x, y })));
    expect(next.every((p) => p.smooth)).toBe(true);
  });

  it('joins smooth ends tangent-continuously: the new handle in line with the kept one and pointing on (G¹ within 1e-9)', () => {
    const doc = circle();
    const after = contourOf(apply(doc, replaceStretch(doc, stretch, bulge)!));
    const segments = contourSegments(after);
    for (const end of [contourOf(doc).points[3]!, contourOf(doc).points[9]!]) {
      const k = segments.findIndex((s) => s.p0.x === end.x && s.p0.y === end.y);
      const incoming = segments[(k - 1 + segments.length) % segments.length]!;
      const outgoing = segments[k]!;
      if (incoming.kind !== 'cubic' || outgoing.kind !== 'cubic') throw new Error('expected cubics at the ends');
      const arriving = sub(incoming.p3, incoming.p2);
      const leaving = sub(outgoing.p1, outgoing.p0);
      expect(Math.abs(sine(arriving, leaving))).toBeLessThan(G1_SINE);
      expect(dot(arriving, leaving)).toBeGreaterThan(0);
      expect(after.points[onCurveIndexAt(after, end)]!.smooth).toBe(true);
    }
  });

  it('keeps the contour’s direction however the points were clicked: clicked backwards gives the same outline', () => {
    const doc = circle();
    const forwards = contourOf(apply(doc, replaceStretch(doc, stretch, bulge)!));
    const backwards = contourOf(apply(doc, replaceStretch(doc, stretch, [...bulge].reverse())!));
    expect(contoursEqual(forwards, backwards)).toBe(true);
    expect(Math.sign(signedArea(contourSegments(forwards)))).toBe(Math.sign(signedArea(contourSegments(contourOf(doc)))));
    expect(signedArea(contourSegments(forwards))).toBeGreaterThan(0);
  });

  it('is one undo step, and undo brings back the old stretch exactly and the selection from before', () => {
    const doc = circle();
    let state = dispatch(createEditorState(doc), selectPoints(doc, [{ glyph: 'o', contour: 0, point: 3 }, { glyph: 'o', contour: 0, point: 9 }]));
    const selected = state.document.selection;
    const tr = replaceStretch(state.document, stretch, bulge)!;
    expect(tr.userEvent).toBe('stretch.replace');
    state = dispatch(state, tr);
    expect(state.history.done).toHaveLength(1);
    expect(contoursEqual(contourOf(state.document), contourOf(doc))).toBe(false);
    // The redrawn stretch's on-curve points become the selection: both ends and three clicks.
    expect(state.document.selection).toHaveLength(5);
    state = undo(state);
    expect(contoursEqual(contourOf(state.document), contourOf(doc))).toBe(true);
    expect(state.document.selection).toEqual(selected);
  });

  it('replaces a stretch that runs over the contour’s first point, keeping the rest exact', () => {
    const doc = circle();
    const before = contourOf(doc);
    // On-curve 7 (point 21, at 315°) forward over point 0 (0°) to on-curve 1 (point 3, at 45°).
    const wrapping: Stretch = { glyph: 'o', contour: 0, from: 21, to: 3 };
    const after = contourOf(apply(doc, replaceStretch(doc, wrapping, [{ x: 900, y: 500 }])!));
    expect(keptRun(after, before.points[21]!, before.points[3]!)).toEqual(keptRun(before, before.points[21]!, before.points[3]!));
    expect(after.points.filter((p) => p.kind === 'on')).toHaveLength(8 - 1 + 1);
    expect(after.points.some((p) => p.kind === 'on' && p.x === 900 && p.y === 500)).toBe(true);
  });

  it('keeps corner ends corners, with the new curve free to leave them at an angle', () => {
    const doc = oneGlyph([squareContour(0, 0, 300, 300)]);
    // The right edge, from (300, 0) (point 1) to (300, 300) (point 2), pushed out through two clicks.
    const tr = replaceStretch(doc, { glyph: 'o', contour: 0, from: 1, to: 2 }, [{ x: 360, y: 100 }, { x: 360, y: 200 }])!;
    const after = contourOf(apply(doc, tr));
    const segments = contourSegments(after);
    expect(segments.map((s) => [s.p0.x, s.p0.y])).toEqual([[0, 0], [300, 0], [360, 100], [360, 200], [300, 300], [0, 300]]);
    for (const at of [{ x: 300, y: 0 }, { x: 300, y: 300 }]) {
      const k = segments.findIndex((s) => s.p0.x === at.x && s.p0.y === at.y);
      const incoming = segments[(k - 1 + segments.length) % segments.length]!;
      const outgoing = segments[k]!;
      const arriving = incoming.kind === 'line' ? sub(incoming.p1, incoming.p0) : sub(incoming.p3, incoming.p2);
      const leaving = outgoing.kind === 'line' ? sub(outgoing.p1, outgoing.p0) : sub(outgoing.p1, outgoing.p0);
      expect(Math.abs(sine(arriving, leaving))).toBeGreaterThan(0.1);
      expect(after.points[onCurveIndexAt(after, at)]!.smooth).toBe(false);
    }
  });

  it('clamps only the smooth end when one end is smooth and the other a corner', () => {
    // The circle with on-curve 3 (point 9) made a corner.
    const base = circleContour(500, 500, 300, 8);
    const points = base.points.map((p, i) => (i === 9 ? { ...p, smooth: false } : p));
    const doc = oneGlyph([{ points }]);
    const after = contourOf(apply(doc, replaceStretch(doc, stretch, bulge)!));
    const segments = contourSegments(after);
    const at = (p: Point) => segments.findIndex((s) => s.p0.x === p.x && s.p0.y === p.y);
    const handlesAt = (p: Point) => {
      const k = at(p);
      const incoming = segments[(k - 1 + segments.length) % segments.length]!;
      const outgoing = segments[k]!;
      if (incoming.kind !== 'cubic' || outgoing.kind !== 'cubic') throw new Error('expected cubics');
      return { arriving: sub(incoming.p3, incoming.p2), leaving: sub(outgoing.p1, outgoing.p0) };
    };
    const smoothEnd = handlesAt(points[3]!);
    expect(Math.abs(sine(smoothEnd.arriving, smoothEnd.leaving))).toBeLessThan(G1_SINE);
    const cornerEnd = handlesAt(points[9]!);
    expect(Math.abs(sine(cornerEnd.arriving, cornerEnd.leaving))).toBeGreaterThan(0.01);
    expect(after.points[onCurveIndexAt(after, points[9]!)]!.smooth).toBe(false);
  });

  it('with no clicks, joins the two ends with one curve, still tangent at smooth ends', () => {
    const doc = circle();
    const after = contourOf(apply(doc, replaceStretch(doc, stretch, [])!));
    expect(after.points.filter((p) => p.kind === 'on')).toHaveLength(8 - 1);
    const segments = contourSegments(after);
    const k = segments.findIndex((s) => s.p0.x === contourOf(doc).points[3]!.x && s.p0.y === contourOf(doc).points[3]!.y);
    const incoming = segments[(k - 1 + segments.length) % segments.length]!;
    const outgoing = segments[k]!;
    if (incoming.kind !== 'cubic' || outgoing.kind !== 'cubic') throw new Error('expected cubics');
    expect(Math.abs(sine(sub(incoming.p3, incoming.p2), sub(outgoing.p1, outgoing.p0)))).toBeLessThan(G1_SINE);
  });
});

describe('which stretch is redrawn', () => {
  it('two selected on-curve points of one contour are the ends; a selected handle does not count', () => {
    const doc = circle();
    const selected = apply(doc, selectPoints(doc, [{ glyph: 'o', contour: 0, point: 9 }, { glyph: 'o', contour: 0, point: 3 }, { glyph: 'o', contour: 0, point: 4 }])!);
    expect(selectedStretchEnds(selected)).toEqual({ glyph: 'o', contour: 0, ends: [3, 9] });
  });

  it('one, three, or points on two contours are not two ends', () => {
    const doc = oneGlyph([circleContour(500, 500, 300, 8), squareContour(0, 0, 100, 100)]);
    const select = (points: [number, number][]) => apply(doc, selectPoints(doc, points.map(([contour, point]) => ({ glyph: 'o', contour, point })))!);
    expect(selectedStretchEnds(select([[0, 3]]))).toBeNull();
    expect(selectedStretchEnds(select([[0, 0], [0, 3], [0, 6]]))).toBeNull();
    expect(selectedStretchEnds(select([[0, 3], [1, 1]]))).toBeNull();
  });

  it('the shorter way round by default, the other way when asked, each running in the contour’s direction', () => {
    const doc = circle();
    // On-curve 0 (point 0) and on-curve 2 (point 6): a quarter of the circle one way, three quarters the other.
    const ends = { glyph: 'o', contour: 0, ends: [0, 6] as const };
    expect(stretchBetween(doc, ends)).toEqual({ glyph: 'o', contour: 0, from: 0, to: 6 });
    expect(stretchBetween(doc, ends, 'longer')).toEqual({ glyph: 'o', contour: 0, from: 6, to: 0 });
    const otherWay = { glyph: 'o', contour: 0, ends: [6, 18] as const };
    // From 6 (90°) to 18 (270°) is half either way: the tie goes to the one from the first end.
    expect(stretchBetween(doc, otherWay)).toEqual({ glyph: 'o', contour: 0, from: 6, to: 18 });
    const far = { glyph: 'o', contour: 0, ends: [3, 21] as const };
    // 45° to 315°: 270° forward, 90° back round over 0°.
    expect(stretchBetween(doc, far)).toEqual({ glyph: 'o', contour: 0, from: 21, to: 3 });
  });
});
