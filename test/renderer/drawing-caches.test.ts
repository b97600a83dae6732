// The canvas's caches of combs and outline drawing (comb-cache.ts,
// outline-drawing-cache.ts): whatever edits come, in whatever order, what they give
// must be exactly what drawing the whole outline afresh gives. If they broke, a
// designer dragging a point would see combs, points or continuity labels left from
// an earlier shape of the letter.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { contourSegments, type GlyphOutline, type OutlineContour, type OutlinePoint } from '../../core/outline/index.ts';
import { CombCache } from '../../renderer/src/editor/comb-cache.ts';
import { contourCombs, envelopePathData, teethPathData, type CombSettings } from '../../renderer/src/editor/comb-geometry.ts';
import { contourContinuity } from '../../renderer/src/editor/continuity.ts';
import { handleLinesPathData, outlinePathData, pointMarks } from '../../renderer/src/editor/outline-drawing.ts';
import { OutlineDrawingCache } from '../../renderer/src/editor/outline-drawing-cache.ts';
import type { ViewTransform } from '../../renderer/src/editor/view-transform.ts';
import { denseRingOutline } from '../support/dense-outline.ts';

/** A letter with lines, corners and curves: a rounded "D"-like bowl and a square counter. */
const MIXED: GlyphOutline = {
  contours: [
    {
      points: [
        { x: 0, y: 0, kind: 'on', smooth: false },
        { x: 300, y: 0, kind: 'on', smooth: true },
        { x: 480, y: 0, kind: 'off', smooth: false },
        { x: 600, y: 160, kind: 'off', smooth: false },
        { x: 600, y: 350, kind: 'on', smooth: true },
        { x: 600, y: 540, kind: 'off', smooth: false },
        { x: 480, y: 700, kind: 'off', smooth: false },
        { x: 300, y: 700, kind: 'on', smooth: true },
        { x: 0, y: 700, kind: 'on', smooth: false },
      ],
    },
    { points: [{ x: 100, y: 100, kind: 'on', smooth: false }, { x: 100, y: 600, kind: 'on', smooth: false }, { x: 300, y: 600, kind: 'on', smooth: false }, { x: 300, y: 100, kind: 'on', smooth: false }] },
  ],
};
const DENSE = denseRingOutline(24, { x: 300, y: 300 }, 300);
const VIEWS: ViewTransform[] = [{ scale: 0.5, originX: 40, originY: 500 }, { scale: 1.3, originX: -20, originY: 900 }];
const SETTINGS: CombSettings[] = [{ density: 32, scale: 4500 }, { density: 9, scale: 12000 }];

/** One edit a designer could make, as the document makes it: the contours it leaves alone stay the same objects. */
type Edit =
  | { kind: 'move'; contour: number; point: number; dx: number; dy: number }
  | { kind: 'smooth'; contour: number; point: number }
  | { kind: 'drop-handles'; contour: number; point: number }
  | { kind: 'back'; steps: number }
  | { kind: 'view'; view: number }
  | { kind: 'settings'; settings: number };

const edit: fc.Arbitrary<Edit> = fc.oneof(
  { weight: 6, arbitrary: fc.record({ kind: fc.constant('move' as const), contour: fc.nat(), point: fc.nat(), dx: fc.integer({ min: -40, max: 40 }), dy: fc.integer({ min: -40, max: 40 }) }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('smooth' as const), contour: fc.nat(), point: fc.nat() }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('drop-handles' as const), contour: fc.nat(), point: fc.nat() }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('back' as const), steps: fc.integer({ min: 1, max: 4 }) }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('view' as const), view: fc.nat({ max: VIEWS.length - 1 }) }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('settings' as const), settings: fc.nat({ max: SETTINGS.length - 1 }) }) },
);

function replaceContour(outline: GlyphOutline, c: number, contour: OutlineContour): GlyphOutline {
  return { contours: outline.contours.map((old, i) => (i === c ? contour : old)) };
}

/** The outline after `e`, sharing every contour and point it does not change. */
function applyEdit(outline: GlyphOutline, e: Edit & { kind: 'move' | 'smooth' | 'drop-handles' }): GlyphOutline {
  const c = e.contour % outline.contours.length;
  const contour = outline.contours[c]!;
  const i = e.point % contour.points.length;
  const p = contour.points[i]!;
  if (e.kind === 'move') return replaceContour(outline, c, { points: contour.points.map((q, k): OutlinePoint => (k === i ? { ...q, x: q.x + e.dx, y: q.y + e.dy } : q)) });
  if (e.kind === 'smooth') return p.kind === 'on' ? replaceContour(outline, c, { points: contour.points.map((q, k) => (k === i ? { ...q, smooth: !q.smooth } : q)) }) : outline;
  // Turn the curve leaving an on-curve point into a line: its two handles go (fewer points, new indices after them).
  const next = contour.points[(i + 1) % contour.points.length];
  if (p.kind !== 'on' || next?.kind !== 'off' || i + 2 >= contour.points.length) return outline;
  return replaceContour(outline, c, { points: contour.points.filter((_, k) => k !== i + 1 && k !== i + 2) });
}

function checkAgainstFullRedraw(start: GlyphOutline, edits: readonly Edit[]): void {
  const combCache = new CombCache();
  const drawingCache = new OutlineDrawingCache();
  const history: GlyphOutline[] = [start];
  let outline = start;
  let view = VIEWS[0]!;
  let settings = SETTINGS[0]!;
  const check = () => {
    const combs = combCache.combs(outline, settings);
    const expectedCombs = outline.contours.flatMap((c) => contourCombs(contourSegments(c), settings));
    expect(combs).toEqual(expectedCombs);
    const paths = combCache.pathData(combs, view);
    // The still and moving parts together hold every tooth and every envelope, once each.
    const teeth = `${paths.teeth}${paths.movingTeeth}`.match(/M[^M]+/g) ?? [];
    const envelopes = `${paths.envelope}${paths.movingEnvelope}`.match(/M[^M]+/g) ?? [];
    expect(teeth.sort()).toEqual((teethPathData(expectedCombs, view).match(/M[^M]+/g) ?? []).sort());
    expect(envelopes.sort()).toEqual((envelopePathData(expectedCombs, view).match(/M[^M]+/g) ?? []).sort());
    const drawing = drawingCache.draw(outline, view);
    expect(drawing.path).toBe(outlinePathData(outline, view));
    expect(drawing.handleLines).toBe(handleLinesPathData(outline, view));
    const joins = outline.contours.map((c) => contourContinuity(c));
    expect(drawing.marks).toEqual(pointMarks(outline, view).map((m) => ({ ...m, continuity: m.role === 'handle' ? null : (joins[m.contour]?.get(m.point)?.continuity ?? null) })));
  };
  check();
  for (const e of edits) {
    if (e.kind === 'view') view = VIEWS[e.view]!;
    else if (e.kind === 'settings') settings = SETTINGS[e.settings]!;
    else if (e.kind === 'back') outline = history[Math.max(0, history.length - 1 - e.steps)]!; // as undo gives back the contours as they were
    else outline = applyEdit(outline, e);
    history.push(outline);
    check();
  }
}

describe('cached combs and outline drawing', () => {
  it('equal a full redraw after any run of moves, smooth toggles, removed handles, undos, zooms and comb settings', () => {
    fc.assert(fc.property(fc.constantFrom(MIXED, DENSE), fc.array(edit, { maxLength: 25 }), (start, edits) => checkAgainstFullRedraw(start, edits)), { numRuns: 60 });
  });

  it('keep the comb path of the segments standing still as the same string while a drag moves one point', () => {
    const cache = new CombCache();
    const view = VIEWS[0]!;
    const settings = SETTINGS[0]!;
    const drag = (dx: number) => applyEdit(DENSE, { kind: 'move', contour: 0, point: 3, dx, dy: 0 });
    cache.pathData(cache.combs(DENSE, settings), view);
    const first = cache.pathData(cache.combs(drag(5), settings), view);
    const second = cache.pathData(cache.combs(drag(9), settings), view);
    expect(second.teeth).toBe(first.teeth);
    expect(second.movingTeeth).not.toBe(first.movingTeeth);
    // Point 3 is the on-curve point where segment 0 ends and segment 1 starts: only those two combs move.
    expect(second.movingEnvelope.match(/M/g)).toHaveLength(2);
  });

  it('reuses the marks of the points a drag leaves where they are, and only those', () => {
    const cache = new OutlineDrawingCache();
    const view = VIEWS[0]!;
    const before = cache.draw(DENSE, view).marks;
    const after = cache.draw(applyEdit(DENSE, { kind: 'move', contour: 0, point: 3, dx: 7, dy: -4 }), view).marks;
    const renewed = after.flatMap((mark, i) => (mark === before[i] ? [] : [`${mark.contour}:${mark.point}`]));
    expect(renewed).toContain('0:3');
    expect(renewed.length).toBeLessThanOrEqual(3);
  });
});
