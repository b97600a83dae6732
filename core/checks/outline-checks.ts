/**
 * Warnings about an outline as a type designer would judge it, with no scan to
 * compare against: for outlines being edited, imported from a font, or about to be
 * written. Each warning says where and by how much; the rules are the trade's
 * (common practice): on-curve points at extrema, no near-miss kinks, handles that do
 * not cross, points on the unit grid, no degenerate segments, and contour directions
 * that follow nesting (outer counter-clockwise, holes clockwise in y-up units).
 */
import type { Point } from '../geometry/vector.ts';
import { evaluate } from '../geometry/segment.ts';
import { contourArea, contourSegments, type GlyphOutline, type OutlineSegment } from '../outline/index.ts';
import { EXTREMUM_PROTRUSION_LIMIT, handlesCross, KINK_MAX_DEGREES, KINK_MIN_DEGREES, segmentExtrema, turnAtJoin } from '../fit/index.ts';

export type OutlineWarningKind =
  | 'extremum-inside-segment'
  | 'near-miss-kink'
  | 'crossing-handles'
  | 'off-grid-point'
  | 'tiny-segment'
  | 'wrong-direction';

export interface OutlineWarning {
  readonly kind: OutlineWarningKind;
  /** Index of the contour in the outline. */
  readonly contour: number;
  /** Where, in font units. */
  readonly at: Point;
  /** The measured quantity: protrusion or length (units), turn (degrees), or 0. */
  readonly value: number;
  readonly message: string;
}

/** Segments shorter than this many units are degenerate: no designer draws one (common practice). */
export const TINY_SEGMENT_UNITS = 1;
/** Samples per segment when flattening contours to tell which encloses which. */
const NESTING_SAMPLES_PER_SEGMENT = 8;

/** A plain copy of a position (outline points carry more fields). */
function where(p: Point): Point {
  return { x: p.x, y: p.y };
}

function segmentEnd(segment: OutlineSegment): Point {
  return segment.kind === 'line' ? segment.p1 : segment.p3;
}

function flatten(segments: readonly OutlineSegment[]): Point[] {
  return segments.flatMap((s) => Array.from({ length: NESTING_SAMPLES_PER_SEGMENT }, (_, i) => evaluate(s, i / NESTING_SAMPLES_PER_SEGMENT)));
}

/** Even–odd point-in-polygon (Jordan curve theorem; ray crossing). */
function inside(point: Point, polygon: readonly Point[]): boolean {
  let result = false;
  for (let i = 0, j = polygon.length - 1; i < polygon.length; j = i++) {
    const a = polygon[i]!;
    const b = polygon[j]!;
    if (a.y > point.y !== b.y > point.y && point.x < ((b.x - a.x) * (point.y - a.y)) / (b.y - a.y) + a.x) result = !result;
  }
  return result;
}

/** Nesting depth of each contour: how many other contours enclose its first point. */
export function contourDepths(outline: GlyphOutline): number[] {
  const polygons = outline.contours.map((c) => flatten(contourSegments(c)));
  return polygons.map((polygon, i) => {
    const probe = polygon[0];
    if (!probe) return 0;
    return polygons.reduce((depth, other, j) => (j !== i && other.length > 2 && inside(probe, other) ? depth + 1 : depth), 0);
  });
}

/** Every warning for `outline`, contour by contour, in order along each contour. */
export function checkOutline(outline: GlyphOutline): OutlineWarning[] {
  const warnings: OutlineWarning[] = [];
  const depths = contourDepths(outline);
  outline.contours.forEach((contour, c) => {
    for (const p of contour.points) {
      if (!Number.isInteger(p.x) || !Number.isInteger(p.y)) {
        warnings.push({ kind: 'off-grid-point', contour: c, at: { x: p.x, y: p.y }, value: 0, message: `A point at (${p.x}, ${p.y}) is off the unit grid; fonts store whole units, so it will move when the font is written.` });
      }
    }
    const segments = contourSegments(contour);
    segments.forEach((segment, s) => {
      const length = Math.hypot(segmentEnd(segment).x - segment.p0.x, segmentEnd(segment).y - segment.p0.y);
      if (length < TINY_SEGMENT_UNITS && (segment.kind === 'line' || Math.hypot(segment.p1.x - segment.p0.x, segment.p1.y - segment.p0.y) + Math.hypot(segment.p2.x - segment.p3.x, segment.p2.y - segment.p3.y) < TINY_SEGMENT_UNITS)) {
        warnings.push({ kind: 'tiny-segment', contour: c, at: where(segment.p0), value: length, message: `A segment ${length.toFixed(2)} units long at (${segment.p0.x}, ${segment.p0.y}): merge its points.` });
      }
      for (const extremum of segmentExtrema(segment)) {
        if (extremum.protrusion > EXTREMUM_PROTRUSION_LIMIT) {
          warnings.push({ kind: 'extremum-inside-segment', contour: c, at: where(extremum.point), value: extremum.protrusion, message: `The curve's ${extremum.axis === 'x' ? 'horizontal' : 'vertical'} extreme at (${extremum.point.x.toFixed(0)}, ${extremum.point.y.toFixed(0)}) has no on-curve point; it sticks out ${extremum.protrusion.toFixed(1)} units past its segment's ends.` });
        }
      }
      if (segment.kind === 'cubic' && handlesCross(segment)) {
        warnings.push({ kind: 'crossing-handles', contour: c, at: where(segment.p0), value: 0, message: `The handles of the segment starting at (${segment.p0.x}, ${segment.p0.y}) cross: shorten them.` });
      }
      const next = segments[(s + 1) % segments.length];
      if (next && segments.length > 1) {
        const turn = turnAtJoin(segment, next);
        if (turn >= KINK_MIN_DEGREES && turn <= KINK_MAX_DEGREES) {
          const at = where(segmentEnd(segment));
          warnings.push({ kind: 'near-miss-kink', contour: c, at, value: turn, message: `The join at (${at.x}, ${at.y}) turns ${turn.toFixed(1)}°: neither smooth nor a corner. Make its handles collinear or turn it into a real corner.` });
        }
      }
    });
    const area = contourArea(contour);
    const wantCounterClockwise = (depths[c] ?? 0) % 2 === 0;
    if (area !== 0 && area > 0 !== wantCounterClockwise) {
      const start = contour.points[0] ?? { x: 0, y: 0 };
      warnings.push({ kind: 'wrong-direction', contour: c, at: { x: start.x, y: start.y }, value: 0, message: `Contour ${c + 1} runs ${area > 0 ? 'counter-clockwise' : 'clockwise'}, but as ${wantCounterClockwise ? 'an outer contour' : 'a hole'} it should run ${wantCounterClockwise ? 'counter-clockwise' : 'clockwise'}; reverse it.` });
    }
  });
  return warnings;
}
