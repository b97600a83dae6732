/**
 * What the canvas draws for an outline (outline-drawing.ts: the outline's path data,
 * the handle lines, the point marks with each on-curve point's join continuity),
 * kept between redraws so that a drag redoes only the contour it changed. A drag
 * replaces one contour and the glyph document shares every other contour object with
 * the state before, so everything here is cached per contour object and view; and
 * the point marks of a changed contour reuse the previous redraw's mark objects for
 * the points that did not move, so that the canvas (a keyed each block) updates only
 * the marks of the points that moved. Within a changed contour, only what lies
 * within reach of a moved point (its segments, the joins at their ends, its handle
 * lines) is made again, found by comparing point objects (an edit keeps the objects
 * of the points it does not move). Results equal the uncached functions'.
 *
 * Plain TypeScript with no DOM: one cache per canvas. Memory: entries for the
 * contours still held (a WeakMap), and the marks of the last redraw.
 */
import type { GlyphOutline, OutlineContour } from '../../../core/outline/index.ts';
import { contourSegments } from '../../../core/outline/index.ts';
import { classifyJoin, contourContinuity, type Continuity } from './continuity.ts';
import { handleAnchors, handleLinePathData, moveToPathData, segmentPathData, type PointMark } from './outline-drawing.ts';
import { toScreen, type ViewTransform } from './view-transform.ts';

/** A point mark with, for an on-curve point, how smoothly its segments join there. */
export interface DrawnMark extends PointMark {
  /** The join's continuity at an on-curve point of a contour of two or more segments; null otherwise. */
  readonly continuity: Continuity | null;
}

interface ContourDrawing {
  readonly view: ViewTransform;
  /** The contour's index in the outline it was drawn for (the marks carry it). */
  readonly index: number;
  readonly contour: OutlineContour;
  /** Indices of the on-curve points: segment s runs from onCurve[s] to onCurve[s + 1] (the last back to the first). */
  readonly onCurve: readonly number[];
  readonly startPath: string;
  /** Each segment's path data (outline-drawing.ts segmentPathData). */
  readonly segmentPaths: readonly string[];
  readonly path: string;
  /** [handle, its on-curve point] pairs (outline-drawing.ts handleAnchors) and each one's line. */
  readonly handlePairs: readonly [number, number][];
  readonly handlePaths: readonly string[];
  readonly handleLines: string;
  readonly marks: readonly DrawnMark[];
}

/** The drawing of a whole outline at one view. */
export interface OutlineDrawing {
  readonly path: string;
  readonly handleLines: string;
  /** Every point, contour by contour, in point order. */
  readonly marks: readonly DrawnMark[];
}

/** Points on either side of a changed point whose segments or joins it can change: a cubic spans three steps. */
const REACH = 3;

function markOf(contour: OutlineContour, index: number, point: number, view: ViewTransform, continuity: Continuity | null): DrawnMark {
  const p = contour.points[point]!;
  return {
    contour: index,
    point,
    at: { x: p.x, y: p.y },
    screen: toScreen(view, p),
    role: p.kind === 'off' ? 'handle' : p.smooth ? 'smooth' : 'corner',
    continuity: p.kind === 'off' ? null : continuity,
  };
}

function sameMark(a: DrawnMark, b: DrawnMark): boolean {
  return a.contour === b.contour && a.point === b.point && a.role === b.role && a.continuity === b.continuity
    && a.at.x === b.at.x && a.at.y === b.at.y && a.screen.x === b.screen.x && a.screen.y === b.screen.y;
}

/** The points of `after` that are not the same objects as in `before`, or null when the two differ in length or in any point's kind. */
function changedPoints(before: OutlineContour, after: OutlineContour): number[] | null {
  if (before.points.length !== after.points.length) return null;
  const changed: number[] = [];
  for (let i = 0; i < after.points.length; i++) {
    const a = before.points[i]!;
    const b = after.points[i]!;
    if (a === b) continue;
    if (a.kind !== b.kind) return null;
    changed.push(i);
  }
  return changed;
}

/** The whole drawing of one contour, made from scratch. */
function drawContour(contour: OutlineContour, index: number, view: ViewTransform): ContourDrawing {
  const segments = contourSegments(contour);
  const onCurve = contour.points.flatMap((p, i) => (p.kind === 'on' ? [i] : []));
  const joins = contourContinuity(contour);
  const first = segments[0];
  const startPath = first ? moveToPathData(first.p0, view) : '';
  const segmentPaths = segments.map((g) => segmentPathData(g, view));
  const handlePairs = handleAnchors(contour);
  const handlePaths = handlePairs.map(([h, a]) => handleLinePathData(contour.points[h]!, contour.points[a]!, view));
  return {
    view,
    index,
    contour,
    onCurve,
    startPath,
    segmentPaths,
    path: first ? `${startPath}${segmentPaths.join('')}Z` : '',
    handlePairs,
    handlePaths,
    handleLines: handlePaths.join(''),
    marks: contour.points.map((_, i) => markOf(contour, index, i, view, joins.get(i)?.continuity ?? null)),
  };
}

/**
 * The drawing of `contour`, a new version of `before`'s contour with the same points
 * in kind and number: only the segments, joins, handle lines and marks within REACH
 * of a point that changed are made again; the rest, marks included, are reused.
 */
function redrawContour(before: ContourDrawing, contour: OutlineContour, changed: readonly number[]): ContourDrawing {
  const { view, index, onCurve } = before;
  const n = contour.points.length;
  const near = new Set<number>();
  for (const i of changed) for (let d = -REACH; d <= REACH; d++) near.add((((i + d) % n) + n) % n);
  const segments = contourSegments(contour);
  const count = segments.length;
  const segmentPaths = before.segmentPaths.slice();
  /** Segment s is redone when any of its points (onCurve[s] to the next on-curve point) changed. */
  const redone = new Set<number>();
  for (let s = 0; s < count; s++) {
    const from = onCurve[s]!;
    const to = s + 1 < count ? onCurve[s + 1]! : n;
    for (let i = from; i <= to; i++) {
      if (changed.includes(i % n)) {
        redone.add(s);
        break;
      }
    }
  }
  for (const s of redone) segmentPaths[s] = segmentPathData(segments[s]!, view);
  const first = segments[0]!;
  const startPath = changed.includes(0) ? moveToPathData(first.p0, view) : before.startPath;
  const handlePaths = before.handlePaths.slice();
  before.handlePairs.forEach(([h, a], k) => {
    if (changed.includes(h) || changed.includes(a)) handlePaths[k] = handleLinePathData(contour.points[h]!, contour.points[a]!, view);
  });
  const marks = before.marks.slice();
  for (const i of near) {
    let continuity: Continuity | null = null;
    const s = onCurve.indexOf(i);
    if (s >= 0 && count >= 2) continuity = classifyJoin(segments[(s - 1 + count) % count]!, segments[s]!).continuity;
    const mark = markOf(contour, index, i, view, continuity);
    if (!sameMark(marks[i]!, mark)) marks[i] = mark;
  }
  return {
    ...before,
    contour,
    startPath,
    segmentPaths,
    path: `${startPath}${segmentPaths.join('')}Z`,
    handlePaths,
    handleLines: handlePaths.join(''),
    marks,
  };
}

export class OutlineDrawingCache {
  private readonly byContour = new WeakMap<OutlineContour, ContourDrawing>();
  /** The drawings of the last redraw, by contour index. */
  private previous: readonly ContourDrawing[] = [];

  private contourDrawing(contour: OutlineContour, index: number, view: ViewTransform): ContourDrawing {
    const known = this.byContour.get(contour);
    if (known && known.view === view && known.index === index) return known;
    const before = this.previous[index];
    const changed = before && before.view === view ? changedPoints(before.contour, contour) : null;
    const drawing = changed !== null && before && before.segmentPaths.length > 0 ? redrawContour(before, contour, changed) : drawContour(contour, index, view);
    this.byContour.set(contour, drawing);
    return drawing;
  }

  /**
   * The outline's path data, handle lines and point marks at `view`: equal to
   * outlinePathData, handleLinesPathData and pointMarks (with contourContinuity's
   * verdicts) for the whole outline. `view` is compared by identity.
   */
  draw(outline: GlyphOutline, view: ViewTransform): OutlineDrawing {
    const drawings = outline.contours.map((contour, c) => this.contourDrawing(contour, c, view));
    this.previous = drawings;
    return {
      path: drawings.map((d) => d.path).join(''),
      handleLines: drawings.map((d) => d.handleLines).join(''),
      marks: drawings.flatMap((d) => d.marks),
    };
  }
}
