/**
 * What the canvas draws for an outline, computed in screen pixels: the outline (and
 * one contour, or a stretch of one, for the redraw preview) as SVG path data, the on-curve points (corners and smooth points told apart), the handles
 * and the lines tying each handle to its on-curve point.
 */
import type { Point } from '../../../core/geometry/vector.ts';
import { contourSegments, type GlyphOutline, type OutlineContour, type OutlineSegment } from '../../../core/outline/index.ts';
import { toScreen, type ViewTransform } from './view-transform.ts';

function fmt(n: number): string {
  return (Math.round(n * 100) / 100).toString();
}

function screenPair(p: Point, view: ViewTransform): string {
  const q = toScreen(view, p);
  return `${fmt(q.x)} ${fmt(q.y)}`;
}

/** The path data that moves to a contour's start point at this view ("M x y"). */
export function moveToPathData(p: Point, view: ViewTransform): string {
  return `M${screenPair(p, view)}`;
}

/** One segment's path data at this view, from its start (L or C, absolute screen pixels). */
export function segmentPathData(g: OutlineSegment, view: ViewTransform): string {
  return g.kind === 'line' ? `L${screenPair(g.p1, view)}` : `C${screenPair(g.p1, view)} ${screenPair(g.p2, view)} ${screenPair(g.p3, view)}`;
}

function openPathData(segments: readonly OutlineSegment[], view: ViewTransform): string {
  const first = segments[0];
  if (!first) return '';
  return moveToPathData(first.p0, view) + segments.map((g) => segmentPathData(g, view)).join('');
}

/** SVG path data of one closed contour at this view (M/L/C/Z, absolute screen pixels). */
export function contourPathData(contour: OutlineContour, view: ViewTransform): string {
  const path = openPathData(contourSegments(contour), view);
  return path === '' ? '' : `${path}Z`;
}

/** SVG path data of the whole outline at this view (M/L/C/Z, absolute screen pixels). */
export function outlinePathData(outline: GlyphOutline, view: ViewTransform): string {
  return outline.contours.map((contour) => contourPathData(contour, view)).join('');
}

/**
 * SVG path data (open) of the stretch of `contour` from on-curve point index `from`
 * forward to on-curve point index `to`; the whole contour when they are the same.
 * Empty when either is not an on-curve point.
 */
export function stretchPathData(contour: OutlineContour, from: number, to: number, view: ViewTransform): string {
  const segments = contourSegments(contour);
  const onCurve = contour.points.flatMap((p, i) => (p.kind === 'on' ? [i] : []));
  const first = onCurve.indexOf(from);
  const last = onCurve.indexOf(to);
  if (first < 0 || last < 0 || segments.length === 0) return '';
  const n = segments.length;
  const span = (last - first + n) % n || n;
  return openPathData(Array.from({ length: span }, (_, k) => segments[(first + k) % n] as OutlineSegment), view);
}

/** One drawn point: where it is in font units and on screen, and what it is. */
export interface PointMark {
  readonly contour: number;
  readonly point: number;
  readonly at: Point;
  readonly screen: Point;
  /** 'corner' and 'smooth' are on-curve points; 'handle' is off-curve. */
  readonly role: 'corner' | 'smooth' | 'handle';
}

/** Every point of the outline as a mark. */
export function pointMarks(outline: GlyphOutline, view: ViewTransform): PointMark[] {
  return outline.contours.flatMap((contour, c) =>
    contour.points.map((p, i): PointMark => ({
      contour: c,
      point: i,
      at: { x: p.x, y: p.y },
      screen: toScreen(view, p),
      role: p.kind === 'off' ? 'handle' : p.smooth ? 'smooth' : 'corner',
    })),
  );
}

/** Index pairs [handle, its on-curve point] of a contour: each handle's neighbour that is on-curve. */
export function handleAnchors(contour: OutlineContour): [number, number][] {
  const n = contour.points.length;
  const pairs: [number, number][] = [];
  contour.points.forEach((p, i) => {
    if (p.kind !== 'off') return;
    const before = (i - 1 + n) % n;
    const after = (i + 1) % n;
    pairs.push([i, contour.points[before]?.kind === 'on' ? before : after]);
  });
  return pairs;
}

/** SVG path data of one handle line, from the handle `h` to its on-curve point `a`, at this view. */
export function handleLinePathData(h: Point, a: Point, view: ViewTransform): string {
  return `M${screenPair(h, view)}L${screenPair(a, view)}`;
}

/** SVG path data of every handle line (handle to its on-curve point) at this view. */
export function handleLinesPathData(outline: GlyphOutline, view: ViewTransform): string {
  return outline.contours
    .flatMap((contour) =>
      handleAnchors(contour).map(([h, a]) => {
        return handleLinePathData(contour.points[h]!, contour.points[a]!, view);
      }),
    )
    .join('');
}
