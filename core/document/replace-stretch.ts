/**
 * Redrawing a damaged stretch of a contour: the designer picks two on-curve points of
 * one contour and clicks the points the outline should pass through between them;
 * the stretch between the two is replaced by a curve through the clicks, joined to
 * the untouched rest of the contour at the two ends.
 *
 * The new curve is the Catmull–Rom spline through end, clicks, end, converted exactly
 * to cubic Béziers (draw-through.ts, core/geometry/catmull-rom.ts; Catmull & Rom 1974,
 * centripetal knots by default, Yuksel, Schaefer & Keyser 2011), with its end tangents
 * clamped where an end is smooth: the handle leaving a smooth end points along the
 * kept outline's tangent there (a Hermite end condition in place of the spline's
 * reflected phantom point), keeping the length the spline gave it, so the join is G¹.
 * At a corner end the spline's own tangent is kept and the end stays a corner.
 * Clicked corners (shift-click) break the spline as in draw-through.ts.
 */
import { totalArcLength } from '../geometry/arclength.ts';
import { add, distance, lerp, scale, sub, type Point, type Vec } from '../geometry/vector.ts';
import { cubic, type CubicSegment } from '../geometry/segment.ts';
import type { OutlineSegment } from '../outline/index.ts';
import { endTangent, replaceSegments, segmentRing, startTangent, type SegmentRing } from './contour-edit.ts';
import { DocumentError } from './document-error.ts';
import { drawThrough, type DrawPoint } from './draw-through.ts';
import type { GlyphDocument, GlyphId, PointRef } from './glyph-document.ts';
import { selectedPointsByContour } from './glyph-document.ts';
import { contourOf, ordinals, runPoints, type Stretch } from './stretch-commands.ts';
import type { Transaction } from './transaction.ts';
import { transaction } from './transaction.ts';

/** Which of the two stretches between two points of a closed contour: the shorter one along the outline, or the other. */
export type StretchSide = 'shorter' | 'longer';

/** Two on-curve points of one contour, in contour order: the ends of a stretch to redraw. */
export interface StretchEnds {
  readonly glyph: GlyphId;
  readonly contour: number;
  /** Point indices, the lower first. */
  readonly ends: readonly [number, number];
}

/**
 * The ends of the stretch to redraw when the selection holds exactly two on-curve
 * points, both on one contour of one glyph (selected handles are ignored); null
 * otherwise.
 */
export function selectedStretchEnds(document: GlyphDocument): StretchEnds | null {
  const glyphs = new Set(document.selection.map((r) => r.glyph));
  if (glyphs.size !== 1) return null;
  const glyph = [...glyphs][0] as GlyphId;
  const onCurve: PointRef[] = [];
  for (const [contour, points] of selectedPointsByContour(document.selection, glyph)) {
    const found = contourOf(document, glyph, contour);
    for (const point of points) if (found.points[point]?.kind === 'on') onCurve.push({ glyph, contour, point });
  }
  if (onCurve.length !== 2) return null;
  const [a, b] = onCurve as [PointRef, PointRef];
  if (a.contour !== b.contour) return null;
  return { glyph, contour: a.contour, ends: a.point < b.point ? [a.point, b.point] : [b.point, a.point] };
}

function stretchLength(ring: SegmentRing, stretch: Stretch): number {
  const { first, span } = ordinals(ring, stretch);
  const segments: OutlineSegment[] = [];
  for (let s = 0; s < span; s++) segments.push(ring.segments[(first + s) % ring.segments.length] as OutlineSegment);
  return totalArcLength(segments);
}

/**
 * The stretch between the two ends on the given side: each of the two runs forward
 * along the contour (so its direction is the contour's), one from the first end to the
 * second and one back round. 'shorter' is the one with less arc length along the
 * outline (on a tie, the one from the first end); 'longer' is the other.
 */
export function stretchBetween(document: GlyphDocument, ends: StretchEnds, side: StretchSide = 'shorter'): Stretch {
  const [a, b] = ends.ends;
  if (a === b) throw new DocumentError('bad-argument', 'A stretch to redraw needs two different on-curve points; select two.');
  const ring = segmentRing(contourOf(document, ends.glyph, ends.contour));
  const forward: Stretch = { glyph: ends.glyph, contour: ends.contour, from: a, to: b };
  const back: Stretch = { glyph: ends.glyph, contour: ends.contour, from: b, to: a };
  const forwardIsShorter = stretchLength(ring, forward) <= stretchLength(ring, back);
  return forwardIsShorter === (side === 'shorter') ? forward : back;
}

/** Length of the polyline start → points → end. */
function pathLength(start: Point, points: readonly DrawPoint[], end: Point): number {
  let total = 0;
  let previous = start;
  for (const p of [...points, end]) {
    total += distance(previous, p);
    previous = p;
  }
  return total;
}

function asCubic(segment: OutlineSegment): CubicSegment {
  if (segment.kind === 'cubic') return segment;
  // A line as a cubic: handles at its thirds (degree elevation, the same curve).
  return cubic(segment.p0, lerp(segment.p0, segment.p1, 1 / 3), lerp(segment.p0, segment.p1, 2 / 3), segment.p1);
}

const isZero = (v: Vec) => v.x === 0 && v.y === 0;
/** A handle's length where the spline gave a zero one: a third of the chord, as a cubic's thirds (common practice). */
const CHORD_HANDLE_FRACTION = 1 / 3;

/** The segment with its first handle along `tangent` (unit), keeping the handle's length. */
function clampStart(segment: OutlineSegment, tangent: Vec): CubicSegment {
  const c = asCubic(segment);
  const length = distance(c.p1, c.p0) || distance(c.p3, c.p0) * CHORD_HANDLE_FRACTION;
  return cubic(c.p0, add(c.p0, scale(tangent, length)), c.p2, c.p3);
}

/** The segment with its last handle along `tangent` (unit, the direction of travel), keeping the handle's length. */
function clampEnd(segment: OutlineSegment, tangent: Vec): CubicSegment {
  const c = asCubic(segment);
  const length = distance(c.p3, c.p2) || distance(c.p3, c.p0) * CHORD_HANDLE_FRACTION;
  return cubic(c.p0, c.p1, sub(c.p3, scale(tangent, length)), c.p3);
}

/**
 * Replaces `stretch` (from ≠ to) by the curve through `through`, joined to the rest of
 * the contour at its two ends; the redrawn stretch's on-curve points become the
 * selection. One transaction, tagged 'stretch.replace'.
 *
 * Guarantees: every point of the contour outside the stretch, its two ends included,
 * keeps its position, kind and smooth flag exactly; every clicked point becomes an
 * on-curve point at exactly its coordinates; at an end that is smooth the new handle is
 * collinear with the kept one and points the other way (G¹ up to rounding in the last
 * bits); the stretch runs from `from` to `to`, the contour's direction, whichever way
 * round the points were clicked (they are taken in the order that makes the shorter
 * path from `from` to `to`).
 * Limits: clicks that repeat the previous point are dropped; with no clicks the
 * stretch becomes one segment (a line between two corners). Null when the two ends lie
 * at the same place and nothing was clicked.
 */
export function replaceStretch(document: GlyphDocument, stretch: Stretch, through: readonly DrawPoint[], options: { alpha?: number } = {}): Transaction | null {
  if (stretch.from === stretch.to) throw new DocumentError('bad-argument', 'A stretch to redraw runs between two different on-curve points; select two.');
  const before = contourOf(document, stretch.glyph, stretch.contour);
  const ring = segmentRing(before);
  const n = ring.segments.length;
  const { first, span } = ordinals(ring, stretch);
  const last = (first + span) % n;
  const start = before.points[stretch.from] as Point;
  const end = before.points[stretch.to] as Point;
  const reversed = [...through].reverse();
  const clicks = pathLength(start, reversed, end) < pathLength(start, through, end) ? reversed : through;
  const drawn = drawThrough([{ x: start.x, y: start.y, smooth: false }, ...clicks, { x: end.x, y: end.y, smooth: false }], { closed: false, ...options });
  if (drawn.segments.length === 0) return null;

  const segments = drawn.segments.slice();
  const startSmooth = ring.smooth[first] ?? false;
  const endSmooth = ring.smooth[last] ?? false;
  // The kept outline's direction of travel arriving at `from` and leaving `to`.
  const arriving = endTangent(ring.segments[(first - 1 + n) % n] as OutlineSegment);
  const leaving = startTangent(ring.segments[last] as OutlineSegment);
  if (startSmooth && !isZero(arriving)) segments[0] = clampStart(segments[0] as OutlineSegment, arriving);
  const lastIndex = segments.length - 1;
  if (endSmooth && !isZero(leaving)) segments[lastIndex] = clampEnd(segments[lastIndex] as OutlineSegment, leaving);
  const smooth = drawn.smooth.map((flag, i) => (i === 0 ? startSmooth : flag));

  const after = replaceSegments(ring, first, span, segments, smooth);
  const selection = runPoints(after, first, span, n, segments.length).map((point) => ({ glyph: stretch.glyph, contour: stretch.contour, point }));
  return transaction('stretch.replace', [
    { kind: 'contour.replace', glyph: stretch.glyph, contour: stretch.contour, before, after },
    { kind: 'selection.set', before: document.selection, after: [...selection].sort((p, q) => p.point - q.point) },
  ]);
}
