/**
 * Commands on single points: insert a point on a segment without changing its shape,
 * delete points and refit their neighbours, toggle corner/smooth, force a corner where
 * the fitter rounded one over, and snap to the unit grid. Each is a pure function from
 * the document to a transaction (null when there is nothing to do).
 */
import type { Point, Vec } from '../geometry/vector.ts';
import { add, cross, distance, dot, normalize, scale, sub } from '../geometry/vector.ts';
import { line } from '../geometry/segment.ts';
import { splitAt } from '../geometry/split.ts';
import { nearestPointOnSegments } from '../geometry/nearest.ts';
import { contourFromSegments, type OutlineContour, type OutlinePoint, type OutlineSegment } from '../outline/index.ts';
import type { Change } from './change.ts';
import { contoursEqual } from './change.ts';
import { endOf, endTangent, replaceSegments, segmentRing, startTangent, wrap, type SegmentRing } from './contour-edit.ts';
import { DocumentError } from './document-error.ts';
import type { GlyphDocument, GlyphId, PointRef } from './glyph-document.ts';
import { glyphOf, selectedPointsByContour } from './glyph-document.ts';
import { shapeDeviation } from './shape-deviation.ts';
import { fitPiece, sampleStretch, type StretchSample } from './stretch-fit.ts';
import type { Transaction } from './transaction.ts';
import { transaction } from './transaction.ts';

/**
 * Default tolerance of the refitting commands, font units: one unit, the grid every
 * coordinate is rounded to anyway, so a refit within it changes nothing rounding
 * would not (common practice).
 */
export const DEFAULT_EDIT_TOLERANCE = 1;

/** Lines whose directions' cross product is below this are parallel (rounding-level). */
const PARALLEL_SINE = 1e-9;

function contourOf(document: GlyphDocument, glyph: GlyphId, contour: number): OutlineContour {
  const found = glyphOf(document, glyph).outline.contours[contour];
  if (!found) throw new DocumentError('unknown-point', `Glyph "${glyph}" has no contour ${contour}.`);
  return found;
}

function replace(glyph: GlyphId, contour: number, before: OutlineContour, after: OutlineContour): Change[] {
  return contoursEqual(before, after) ? [] : [{ kind: 'contour.replace', glyph, contour, before, after }];
}

function select(document: GlyphDocument, after: readonly PointRef[]): Change {
  return { kind: 'selection.set', before: document.selection, after };
}

// ——— insert ———

/** Where a point goes: segment `segment` (the one starting at on-curve point number `segment`) of a contour, at parameter t. */
export interface SegmentLocation {
  readonly glyph: GlyphId;
  readonly contour: number;
  readonly segment: number;
  readonly t: number;
}

/**
 * Inserts an on-curve point at `at` by splitting its segment exactly (de Casteljau,
 * core/geometry/split.ts): the two halves trace the same curve, so the shape does not
 * change. A point inserted in a cubic is smooth (the split leaves its handles
 * collinear); one inserted in a line is a corner. The new point becomes the selection.
 * Null when t is not strictly inside (0, 1).
 */
export function insertPoint(document: GlyphDocument, at: SegmentLocation): Transaction | null {
  if (!(at.t > 0 && at.t < 1)) return null;
  const before = contourOf(document, at.glyph, at.contour);
  const ring = segmentRing(before);
  const segment = ring.segments[at.segment];
  if (!segment) throw new DocumentError('unknown-point', `Contour ${at.contour} of "${at.glyph}" has no segment ${at.segment}.`);
  const halves = splitAt(segment, at.t);
  const after = replaceSegments(ring, at.segment, 1, halves, [ring.smooth[at.segment] ?? false, segment.kind === 'cubic']);
  const newPoint = segmentRing(after).onCurve[at.segment + 1] as number;
  return transaction('point.insert', [
    ...replace(at.glyph, at.contour, before, after),
    select(document, [{ glyph: at.glyph, contour: at.contour, point: newPoint }]),
  ]);
}

/** The segment location on `glyph` nearest to `at`, or null for a glyph without segments. */
export function nearestLocation(document: GlyphDocument, glyph: GlyphId, at: Point): (SegmentLocation & { distance: number }) | null {
  let best: (SegmentLocation & { distance: number }) | null = null;
  glyphOf(document, glyph).outline.contours.forEach((contour, c) => {
    const hit = nearestPointOnSegments(segmentRing(contour).segments, at);
    if (hit && (best === null || hit.distance < best.distance)) best = { glyph, contour: c, segment: hit.segmentIndex, t: hit.t, distance: hit.distance };
  });
  return best;
}

/** Inserts a point on the curve of `glyph` nearest to `at` (see insertPoint). */
export function insertPointNear(document: GlyphDocument, glyph: GlyphId, at: Point): Transaction | null {
  const location = nearestLocation(document, glyph, at);
  return location ? insertPoint(document, location) : null;
}

// ——— delete ———

/**
 * Deletes the selected points. Each run of consecutive selected on-curve points is
 * replaced by one segment between the unselected on-curve points either side, fitted
 * by least squares to dense samples of the old segments (stretch-fit.ts); where a
 * neighbour is smooth, its tangent is kept, so the join stays smooth. A selected handle
 * whose segment is otherwise kept is retracted with its partner: the segment becomes
 * a line. A contour left with fewer than two on-curve points is removed.
 * The report gives the largest deviation of the refitted segments from the old shape
 * (both ways, sampled) against `tolerance`; the retracted handles are not counted, the
 * user asked for that change of shape.
 * Null when nothing is selected.
 */
export function deleteSelection(document: GlyphDocument, options: { tolerance?: number } = {}): Transaction | null {
  const tolerance = options.tolerance ?? DEFAULT_EDIT_TOLERANCE;
  if (document.selection.length === 0) return null;
  const changes: Change[] = [];
  let maxDeviation = 0;
  const glyphs = [...new Set(document.selection.map((r) => r.glyph))];
  for (const glyph of glyphs) {
    const byContour = [...selectedPointsByContour(document.selection, glyph)].sort((a, b) => b[0] - a[0]);
    for (const [contourIndex, selected] of byContour) {
      const before = contourOf(document, glyph, contourIndex);
      const result = deleteFromContour(before, selected, tolerance);
      if (result === 'remove') {
        changes.push({ kind: 'contour.remove', glyph, contour: contourIndex, value: before });
        continue;
      }
      maxDeviation = Math.max(maxDeviation, result.deviation);
      changes.push(...replace(glyph, contourIndex, before, result.contour));
    }
  }
  changes.push(select(document, []));
  return transaction('point.delete', changes, { report: { maxDeviation, tolerance } });
}

function deleteFromContour(contour: OutlineContour, selected: ReadonlySet<number>, tolerance: number): 'remove' | { contour: OutlineContour; deviation: number } {
  const ring = segmentRing(contour);
  const n = ring.segments.length;
  const deleted = ring.onCurve.map((p) => selected.has(p));
  const kept: number[] = [];
  deleted.forEach((d, i) => {
    if (!d) kept.push(i);
  });
  if (kept.length < 2 || n < 2) return 'remove';
  const segments: OutlineSegment[] = [];
  const smooth: boolean[] = [];
  let deviation = 0;
  kept.forEach((a, k) => {
    const b = kept[(k + 1) % kept.length] as number;
    const span = wrap(b - a, n) || n;
    smooth.push(ring.smooth[a] ?? false);
    if (span === 1) {
      const segment = ring.segments[a] as OutlineSegment;
      const h1 = wrap(ring.onCurve[a]! + 1, contour.points.length);
      const h2 = wrap(ring.onCurve[a]! + 2, contour.points.length);
      const retract = segment.kind === 'cubic' && (selected.has(h1) || selected.has(h2));
      segments.push(retract ? line(segment.p0, segment.p3) : segment);
      return;
    }
    const old: OutlineSegment[] = [];
    for (let s = 0; s < span; s++) old.push(ring.segments[(a + s) % n] as OutlineSegment);
    const piece = refitRun(old, ring.smooth[a] ?? false, ring.smooth[b] ?? false, tolerance);
    deviation = Math.max(deviation, shapeDeviation(old, [piece]));
    segments.push(piece);
  });
  return { contour: contourFromSegments(segments, smooth), deviation };
}

/** One segment replacing `old`, keeping the end tangents where the ends are smooth. */
function refitRun(old: readonly OutlineSegment[], startSmooth: boolean, endSmooth: boolean, tolerance: number): OutlineSegment {
  const samples = sampleStretch(old);
  const t0 = startSmooth ? startTangent(old[0] as OutlineSegment) : null;
  const t1 = endSmooth ? endTangent(old[old.length - 1] as OutlineSegment) : null;
  return fitPiece(samples, 0, samples.length - 1, t0, t1, tolerance).segment;
}

// ——— corner / smooth ———

/**
 * The contour with on-curve point `index` made smooth: its two handles turned onto one
 * line through it (the bisector of their directions), each keeping its length; next to
 * a line, the handle turns onto the line's direction. Between two lines the point
 * becomes smooth only if the lines are already collinear; otherwise the contour is
 * returned unchanged.
 */
export function makeSmooth(contour: OutlineContour, index: number): OutlineContour {
  const points = contour.points;
  const n = points.length;
  const p = points[index];
  if (p?.kind !== 'on' || p.smooth) return contour;
  const inIndex = wrap(index - 1, n);
  const outIndex = wrap(index + 1, n);
  const hIn = points[inIndex] as OutlinePoint;
  const hOut = points[outIndex] as OutlinePoint;
  const next = points.slice();
  const place = (i: number, q: OutlinePoint, to: Point) => {
    next[i] = { x: to.x, y: to.y, kind: q.kind, smooth: q.smooth };
  };
  if (hIn.kind === 'off' && hOut.kind === 'off') {
    const inLength = distance(p, hIn);
    const outLength = distance(hOut, p);
    let direction = normalize(add(normalize(sub(p, hIn)), normalize(sub(hOut, p))));
    if (direction.x === 0 && direction.y === 0) direction = normalize(sub(hOut, p)); // a cusp: follow the outgoing handle
    place(inIndex, hIn, sub(p, scale(direction, inLength)));
    place(outIndex, hOut, add(p, scale(direction, outLength)));
  } else if (hIn.kind === 'on' && hOut.kind === 'off') {
    place(outIndex, hOut, add(p, scale(normalize(sub(p, hIn)), distance(hOut, p))));
  } else if (hIn.kind === 'off' && hOut.kind === 'on') {
    place(inIndex, hIn, sub(p, scale(normalize(sub(hOut, p)), distance(p, hIn))));
  } else {
    const u = normalize(sub(p, hIn));
    const v = normalize(sub(hOut, p));
    if (Math.abs(cross(u, v)) > PARALLEL_SINE || dot(u, v) <= 0) return contour;
  }
  next[index] = { ...p, smooth: true };
  return { points: next };
}

/**
 * Toggles each selected on-curve point between corner and smooth. Making a point
 * smooth aligns its handles (see makeSmooth); making it a corner only clears the flag.
 * Null when no on-curve point is selected.
 */
export function toggleSmooth(document: GlyphDocument): Transaction | null {
  const changes: Change[] = [];
  for (const glyph of new Set(document.selection.map((r) => r.glyph))) {
    for (const [contourIndex, selected] of selectedPointsByContour(document.selection, glyph)) {
      const before = contourOf(document, glyph, contourIndex);
      let after = before;
      for (const i of [...selected].sort((a, b) => a - b)) {
        const p = after.points[i];
        if (p?.kind !== 'on') continue;
        if (p.smooth) {
          const points = after.points.slice();
          points[i] = { ...p, smooth: false };
          after = { points };
        } else {
          after = makeSmooth(after, i);
        }
      }
      changes.push(...replace(glyph, contourIndex, before, after));
    }
  }
  return changes.length === 0 ? null : transaction('point.smooth-toggle', changes);
}

// ——— force a corner ———

/** Where two lines meet, p + s·u = q − w·v, with s and w; undefined when parallel. */
function meet(p: Point, u: Vec, q: Point, v: Vec): { point: Point; s: number; w: number } | undefined {
  const denominator = cross(u, v);
  if (Math.abs(denominator) <= PARALLEL_SINE) return undefined;
  const d = sub(q, p);
  const s = cross(d, v) / denominator;
  const w = cross(u, d) / denominator;
  return { point: add(p, scale(u, s)), s, w };
}

/**
 * How far from the sharp corner a circular rounding reaches along each side, per unit
 * of the distance between the corner and the rounding's apex: for an opening angle φ,
 * a rounding of radius ρ leaves the sides ρ/tan(φ/2) from the corner while its apex
 * lies ρ(1/sin(φ/2) − 1) inside, a ratio of cos(φ/2)/(1 − sin(φ/2)) (plane geometry).
 */
function roundingReachRatio(openingAngle: number): number {
  const half = openingAngle / 2;
  return Math.cos(half) / Math.max(1e-6, 1 - Math.sin(half));
}

/**
 * Makes on-curve point `target` a corner where its two sides meet, for a corner the
 * fitter rounded over. The sides' tangent lines are taken at the neighbouring on-curve
 * points (outside the rounded tip); the point moves to where they cross, when they
 * cross ahead of both neighbours, and both sides are fitted again to the old samples
 * outside the rounded tip (the share of each side a circular rounding would occupy),
 * keeping the neighbours' tangents where they are smooth and leaving the corner's free.
 * A line side stays a line. When the tangent lines do not cross usefully the point
 * stays where it is and only the sides are refitted with free tangents at it.
 * The report's deviation is then mostly the corner's move, which is the point.
 */
export function forceCorner(document: GlyphDocument, target: PointRef, options: { tolerance?: number } = {}): Transaction | null {
  const tolerance = options.tolerance ?? DEFAULT_EDIT_TOLERANCE;
  const before = contourOf(document, target.glyph, target.contour);
  const ring = segmentRing(before);
  const k = ring.onCurve.indexOf(target.point);
  if (k < 0) return null;
  const after = cornerAt(ring, k, tolerance);
  if (!after) return null;
  return transaction(
    'point.force-corner',
    [...replace(target.glyph, target.contour, before, after.contour), select(document, [{ ...target, point: segmentRing(after.contour).onCurve[after.ordinal] as number }])],
    { report: { maxDeviation: after.deviation, tolerance } },
  );
}

/**
 * Forces a corner at the curve point of contour `contour` nearest to `at`: at an
 * existing on-curve point when one lies within `pickRadius`, else at a point inserted
 * there by an exact split.
 */
export function forceCornerAt(document: GlyphDocument, glyph: GlyphId, contour: number, at: Point, options: { tolerance?: number; pickRadius?: number } = {}): Transaction | null {
  const tolerance = options.tolerance ?? DEFAULT_EDIT_TOLERANCE;
  const pickRadius = options.pickRadius ?? 0;
  const before = contourOf(document, glyph, contour);
  let ring = segmentRing(before);
  const hit = nearestPointOnSegments(ring.segments, at);
  if (!hit) return null;
  let k = -1;
  ring.onCurve.forEach((p, ordinal) => {
    if (k < 0 && distance(before.points[p] as Point, hit.point) <= pickRadius) k = ordinal;
  });
  if (k < 0) {
    if (hit.t <= 0 || hit.t >= 1) k = hit.t <= 0 ? hit.segmentIndex : (hit.segmentIndex + 1) % ring.segments.length;
    else {
      const segment = ring.segments[hit.segmentIndex] as OutlineSegment;
      ring = segmentRing(replaceSegments(ring, hit.segmentIndex, 1, splitAt(segment, hit.t), [ring.smooth[hit.segmentIndex] ?? false, true]));
      k = hit.segmentIndex + 1;
    }
  }
  const after = cornerAt(ring, k, tolerance);
  if (!after) return null;
  return transaction(
    'point.force-corner',
    [...replace(glyph, contour, before, after.contour), select(document, [{ glyph, contour, point: segmentRing(after.contour).onCurve[after.ordinal] as number }])],
    { report: { maxDeviation: after.deviation, tolerance } },
  );
}

function cornerAt(ring: SegmentRing, k: number, tolerance: number): { contour: OutlineContour; ordinal: number; deviation: number } | null {
  const n = ring.segments.length;
  if (n < 2) return null;
  const a = wrap(k - 1, n);
  const sideIn = ring.segments[a] as OutlineSegment;
  const sideOut = ring.segments[k] as OutlineSegment;
  const start = sideIn.p0;
  const apex = sideOut.p0;
  const end = endOf(sideOut);
  const tA = startTangent(sideIn);
  const tB = endTangent(sideOut);
  let corner = apex;
  let exclusion = 0;
  const crossing = n > 2 ? meet(start, tA, end, tB) : undefined;
  if (crossing && crossing.s > 0 && crossing.w > 0 && distance(crossing.point, apex) <= distance(start, end)) {
    corner = crossing.point;
    const opening = Math.PI - Math.acos(Math.max(-1, Math.min(1, dot(tA, tB))));
    exclusion = roundingReachRatio(opening) * distance(corner, apex);
  }
  const refitSide = (side: OutlineSegment, from: Point, to: Point, fromDirection: Vec | null, toDirection: Vec | null): OutlineSegment => {
    if (side.kind === 'line') return line(from, to);
    const interior = sampleStretch([side]).slice(1, -1).filter((s) => distance(s.point, corner) > exclusion);
    const samples: StretchSample[] = [{ point: from, tangent: { x: 0, y: 0 } }, ...interior, { point: to, tangent: { x: 0, y: 0 } }];
    return fitPiece(samples, 0, samples.length - 1, fromDirection, toDirection, tolerance).segment;
  };
  const newIn = refitSide(sideIn, start, corner, ring.smooth[a] ? tA : null, null);
  const newOut = refitSide(sideOut, corner, end, null, ring.smooth[(k + 1) % n] ? tB : null);
  const contour = replaceSegments(ring, a, 2, [newIn, newOut], [ring.smooth[a] ?? false, false]);
  const deviation = shapeDeviation([sideIn, sideOut], [newIn, newOut]);
  return { contour, ordinal: ordinalAfter(ring, a, k), deviation };
}

/** The ordinal of old on-curve point k after replaceSegments(ring, a, 2, …) (same count of segments). */
function ordinalAfter(ring: SegmentRing, a: number, k: number): number {
  const n = ring.segments.length;
  // replaceSegments keeps point 0 first unless it was inside the replaced run (ordinal k = 0 when a = n − 1).
  if (a + 2 > n) return 1; // the run wrapped past point 0: the contour now starts at a, the corner is next
  return k;
}

// ——— grid ———

/**
 * Rounds points to the grid (`grid` font units, default 1): every point of `glyph`
 * when given, else the selected points. Each point is rounded on its own, so a smooth
 * point's handles may leave exact collinearity by up to half a grid step.
 * Null when nothing would move.
 */
export function snapToGrid(document: GlyphDocument, options: { grid?: number; glyph?: GlyphId } = {}): Transaction | null {
  const grid = options.grid ?? 1;
  if (!(grid > 0)) throw new DocumentError('bad-argument', `The grid must be a positive number of units, not ${grid}.`);
  const snap = (v: number) => Math.round(v / grid) * grid;
  const changes: Change[] = [];
  const targets: [GlyphId, Map<number, Set<number> | 'all'>][] = [];
  if (options.glyph !== undefined) {
    const all = new Map<number, Set<number> | 'all'>();
    glyphOf(document, options.glyph).outline.contours.forEach((_, c) => all.set(c, 'all'));
    targets.push([options.glyph, all]);
  } else {
    for (const glyph of new Set(document.selection.map((r) => r.glyph))) targets.push([glyph, selectedPointsByContour(document.selection, glyph)]);
  }
  for (const [glyph, byContour] of targets) {
    for (const [c, which] of byContour) {
      const before = contourOf(document, glyph, c);
      const after = { points: before.points.map((p, i) => (which === 'all' || which.has(i) ? { ...p, x: snap(p.x), y: snap(p.y) } : p)) };
      changes.push(...replace(glyph, c, before, after));
    }
  }
  return changes.length === 0 ? null : transaction('point.snap', changes);
}
