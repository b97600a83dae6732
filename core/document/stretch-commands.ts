/**
 * Commands on a stretch of contour: refit it with the fewest cubics within a tolerance,
 * or draw a new contour or stretch through given points.
 */
import type { OutlineContour, OutlineSegment } from '../outline/index.ts';
import { contourFromSegments } from '../outline/index.ts';
import type { Change } from './change.ts';
import { endTangent, replaceSegments, segmentRing, startTangent, wrap, type SegmentRing } from './contour-edit.ts';
import { DocumentError } from './document-error.ts';
import { drawThrough, type DrawPoint } from './draw-through.ts';
import type { GlyphDocument, GlyphId, PointRef } from './glyph-document.ts';
import { glyphOf, selectedPointsByContour } from './glyph-document.ts';
import { DEFAULT_EDIT_TOLERANCE } from './point-commands.ts';
import { shapeDeviation } from './shape-deviation.ts';
import { FIT_SAMPLES_PER_SEGMENT, fitFewestPieces, sampleStretch } from './stretch-fit.ts';
import type { Transaction } from './transaction.ts';
import { transaction } from './transaction.ts';

/** A run of a contour from on-curve point `from` forward to on-curve point `to` (point indices); from = to is the whole contour. */
export interface Stretch {
  readonly glyph: GlyphId;
  readonly contour: number;
  readonly from: number;
  readonly to: number;
}

/** The contour, or DocumentError('unknown-point'). @internal shared with replace-stretch.ts */
export function contourOf(document: GlyphDocument, glyph: GlyphId, contour: number): OutlineContour {
  const found = glyphOf(document, glyph).outline.contours[contour];
  if (!found) throw new DocumentError('unknown-point', `Glyph "${glyph}" has no contour ${contour}.`);
  return found;
}

/** The stretch's first segment and its count of segments. @internal shared with replace-stretch.ts */
export function ordinals(ring: SegmentRing, stretch: Stretch): { first: number; span: number } {
  const first = ring.onCurve.indexOf(stretch.from);
  const last = ring.onCurve.indexOf(stretch.to);
  if (first < 0 || last < 0) {
    throw new DocumentError('bad-argument', `A stretch runs between on-curve points; point ${first < 0 ? stretch.from : stretch.to} of contour ${stretch.contour} is not one.`);
  }
  const n = ring.segments.length;
  return { first, span: wrap(last - first, n) || n };
}

/** The on-curve point indices of the replaced run in the new contour (see replaceSegments). @internal shared with replace-stretch.ts */
export function runPoints(contour: OutlineContour, first: number, span: number, oldCount: number, newCount: number): number[] {
  const ring = segmentRing(contour);
  const m = ring.segments.length;
  const start = first + span <= oldCount ? first : 0;
  const points: number[] = [];
  const last = newCount === m ? newCount - 1 : newCount; // a whole-contour run ends where it starts
  for (let k = 0; k <= last; k++) points.push(ring.onCurve[(start + k) % m] as number);
  return points;
}

/**
 * Refits a stretch with the fewest cubics whose dense samples of the old stretch lie
 * within `tolerance` (stretch-fit.ts). The stretch's end points stay, with their
 * tangents where they are smooth; corners inside the stretch are kept (toggle them
 * smooth first to let the refit pass over them), every other on-curve point inside is
 * replaced. New points lie on the old curve and are smooth. The report gives the
 * two-way sampled deviation from the old stretch. The stretch's points become the
 * selection.
 */
export function refitStretch(document: GlyphDocument, stretch: Stretch, tolerance = DEFAULT_EDIT_TOLERANCE): Transaction | null {
  if (!(tolerance > 0)) throw new DocumentError('bad-argument', `The refit tolerance must be a positive number of units, not ${tolerance}.`);
  const before = contourOf(document, stretch.glyph, stretch.contour);
  const ring = segmentRing(before);
  const n = ring.segments.length;
  if (n === 0) return null;
  const { first, span } = ordinals(ring, stretch);
  const old: OutlineSegment[] = [];
  for (let s = 0; s < span; s++) old.push(ring.segments[(first + s) % n] as OutlineSegment);
  const samples = sampleStretch(old);
  // Corners inside the stretch, and its ends, break it into independent runs.
  const fixed = [0];
  for (let s = 1; s < span; s++) if (!ring.smooth[(first + s) % n]) fixed.push(s);
  fixed.push(span);
  const segments: OutlineSegment[] = [];
  const smooth: boolean[] = [];
  for (let r = 0; r + 1 < fixed.length; r++) {
    const a = fixed[r] as number;
    const b = fixed[r + 1] as number;
    const aSmooth = ring.smooth[(first + a) % n] ?? false;
    const bSmooth = ring.smooth[(first + b) % n] ?? false;
    const fit = fitFewestPieces(
      samples,
      a * FIT_SAMPLES_PER_SEGMENT,
      b * FIT_SAMPLES_PER_SEGMENT,
      aSmooth ? startTangent(old[a] as OutlineSegment) : null,
      bSmooth ? endTangent(old[b - 1] as OutlineSegment) : null,
      tolerance,
    );
    fit.segments.forEach((segment, i) => {
      segments.push(segment);
      smooth.push(i === 0 ? aSmooth : true);
    });
  }
  const after = replaceSegments(ring, first, span, segments, smooth);
  const changes: Change[] = [];
  if (after.points.length !== before.points.length || after.points.some((p, i) => p !== before.points[i])) {
    changes.push({ kind: 'contour.replace', glyph: stretch.glyph, contour: stretch.contour, before, after });
  }
  if (changes.length === 0) return null;
  const selection: PointRef[] = runPoints(after, first, span, n, segments.length).map((point) => ({ glyph: stretch.glyph, contour: stretch.contour, point }));
  changes.push({ kind: 'selection.set', before: document.selection, after: [...new Map(selection.map((r) => [r.point, r])).values()].sort((p, q) => p.point - q.point) });
  return transaction('stretch.refit', changes, { report: { maxDeviation: shapeDeviation(old, segments), tolerance } });
}

/**
 * The stretch the selection spans in its contour: the selected on-curve points of one
 * contour, from the first to the last going forward and leaving out the longest run
 * of unselected on-curve points; the whole contour when all are selected. Null when
 * fewer than two on-curve points of one contour are selected (or several contours are).
 */
export function selectedStretch(document: GlyphDocument): Stretch | null {
  const glyphs = new Set(document.selection.map((r) => r.glyph));
  if (glyphs.size !== 1) return null;
  const glyph = [...glyphs][0] as GlyphId;
  const byContour = [...selectedPointsByContour(document.selection, glyph)].filter(([c, points]) => {
    const contour = contourOf(document, glyph, c);
    return [...points].some((p) => contour.points[p]?.kind === 'on');
  });
  if (byContour.length !== 1) return null;
  const [contourIndex, points] = byContour[0] as [number, Set<number>];
  const ring = segmentRing(contourOf(document, glyph, contourIndex));
  const n = ring.onCurve.length;
  const chosen = ring.onCurve.map((p, k) => (points.has(p) ? k : -1)).filter((k) => k >= 0);
  if (chosen.length < 2) return null;
  if (chosen.length === n) return { glyph, contour: contourIndex, from: ring.onCurve[0] as number, to: ring.onCurve[0] as number };
  let gapEnd = 0;
  let widest = -1;
  chosen.forEach((k, i) => {
    const next = chosen[(i + 1) % chosen.length] as number;
    const gap = wrap(next - k, n);
    if (gap > widest) {
      widest = gap;
      gapEnd = i;
    }
  });
  const from = chosen[(gapEnd + 1) % chosen.length] as number;
  const to = chosen[gapEnd] as number;
  return { glyph, contour: contourIndex, from: ring.onCurve[from] as number, to: ring.onCurve[to] as number };
}

/** Refits the stretch the selection spans (see selectedStretch, refitStretch). */
export function refitSelection(document: GlyphDocument, tolerance = DEFAULT_EDIT_TOLERANCE): Transaction | null {
  const stretch = selectedStretch(document);
  return stretch ? refitStretch(document, stretch, tolerance) : null;
}

/**
 * Adds a closed contour through `points` to `glyph` (draw-through.ts): each given
 * point becomes an on-curve point, exactly, smooth or a corner as flagged. The new
 * points become the selection. The contour runs in the order drawn; null for fewer
 * than two distinct points.
 */
export function drawContour(document: GlyphDocument, glyph: GlyphId, points: readonly DrawPoint[], options: { alpha?: number } = {}): Transaction | null {
  const drawn = drawThrough(points, { closed: true, ...options });
  if (drawn.segments.length === 0) return null;
  const contour = contourFromSegments(drawn.segments, drawn.smooth);
  const index = glyphOf(document, glyph).outline.contours.length;
  const selection = segmentRing(contour).onCurve.map((point) => ({ glyph, contour: index, point }));
  return transaction('stretch.draw', [
    { kind: 'contour.insert', glyph, contour: index, value: contour },
    { kind: 'selection.set', before: document.selection, after: selection },
  ]);
}

/**
 * Replaces the stretch from on-curve point `from` to `to` (which must differ) by the
 * spline through from, `through`…, to. Both ends become corners: the drawn curve's
 * tangents there need not match the untouched outline's.
 */
export function drawStretch(document: GlyphDocument, stretch: Stretch, through: readonly DrawPoint[], options: { alpha?: number } = {}): Transaction | null {
  if (stretch.from === stretch.to) throw new DocumentError('bad-argument', 'Drawing a stretch needs two different end points; use drawContour for a whole contour.');
  const before = contourOf(document, stretch.glyph, stretch.contour);
  const ring = segmentRing(before);
  const { first, span } = ordinals(ring, stretch);
  const start = before.points[stretch.from]!;
  const end = before.points[stretch.to]!;
  const drawn = drawThrough([{ x: start.x, y: start.y, smooth: false }, ...through, { x: end.x, y: end.y, smooth: false }], { closed: false, ...options });
  if (drawn.segments.length === 0) return null;
  const last = (first + span) % ring.segments.length;
  const cornered: SegmentRing = { ...ring, smooth: ring.smooth.map((s, k) => (k === last ? false : s)) };
  const after = replaceSegments(cornered, first, span, drawn.segments, drawn.smooth);
  const selection = runPoints(after, first, span, ring.segments.length, drawn.segments.length).map((point) => ({ glyph: stretch.glyph, contour: stretch.contour, point }));
  return transaction('stretch.draw', [
    { kind: 'contour.replace', glyph: stretch.glyph, contour: stretch.contour, before, after },
    { kind: 'selection.set', before: document.selection, after: [...selection].sort((p, q) => p.point - q.point) },
  ]);
}
