// A glyph outline on whole font units, as the font will hold it. CFF charstrings can
// carry fractions, but opentype.js 2.0.0 writes each curve delta rounded relative to
// the *unrounded* previous control point, so rounding errors pile up along a
// contour (up to 2.27 units observed) and carry into the next one. Rounding every
// coordinate first makes every delta an exact integer and the written outline equal
// to this one. Rounding can make points coincide; the zero-length pieces that
// leaves are dropped here, and so are contours that shrink to nothing.
import { boundsOfSegments, type BoundingBox } from '../../../core/geometry/index.ts';
import {
  contourFromSegments,
  contourSegments,
  type GlyphOutline,
  type OutlineContour,
  type OutlineSegment,
} from '../../../core/outline/index.ts';

/** A box on whole units: the tight box of an outline with its minima floored and maxima ceiled. */
export interface IntegerBox {
  readonly xMin: number;
  readonly yMin: number;
  readonly xMax: number;
  readonly yMax: number;
}

/**
 * Distance below which a bound counts as lying on a whole unit before floor/ceil:
 * extrema of integer-controlled curves that are exact integers can come out of the
 * root finder a few units in the last place off (1e-9 is far above that and far
 * below anything visible).
 */
const WHOLE_UNIT_SNAP = 1e-9;

/** Math.round without negative zero (a −0 written to a font reads back as 0 anyway). */
const roundUnit = (v: number): number => Math.round(v) + 0;

function isZeroLength(segment: OutlineSegment): boolean {
  const { p0 } = segment;
  const same = (p: { x: number; y: number }) => p.x === p0.x && p.y === p0.y;
  return segment.kind === 'line' ? same(segment.p1) : same(segment.p1) && same(segment.p2) && same(segment.p3);
}

/** The contour without zero-length lines and collapsed cubics; undefined when nothing is left. */
function withoutZeroLengthSegments(contour: OutlineContour): OutlineContour | undefined {
  const segments = contourSegments(contour);
  const smooth = contour.points.filter((p) => p.kind === 'on').map((p) => p.smooth);
  const keptSegments: OutlineSegment[] = [];
  const keptSmooth: boolean[] = [];
  segments.forEach((segment, i) => {
    if (isZeroLength(segment)) return;
    keptSegments.push(segment);
    keptSmooth.push(smooth[i] ?? false);
  });
  if (keptSegments.length === 0) return undefined;
  return contourFromSegments(keptSegments, keptSmooth);
}

/**
 * Every coordinate rounded to the nearest whole unit; zero-length segments and empty
 * contours removed; point kinds, smooth flags, order and direction kept. Throws
 * OutlineError (core/outline) for a malformed contour.
 */
export function roundOutline(outline: GlyphOutline): GlyphOutline {
  const contours: OutlineContour[] = [];
  for (const contour of outline.contours) {
    const rounded = { points: contour.points.map((p) => ({ x: roundUnit(p.x), y: roundUnit(p.y), kind: p.kind, smooth: p.smooth })) };
    const cleaned = withoutZeroLengthSegments(rounded);
    if (cleaned !== undefined) contours.push(cleaned);
  }
  return { contours };
}

/** The outline moved right by `dx` units (kinds and flags kept). */
export function translateOutline(outline: GlyphOutline, dx: number): GlyphOutline {
  if (dx === 0) return outline;
  return { contours: outline.contours.map((c) => ({ points: c.points.map((p) => ({ ...p, x: p.x + dx })) })) };
}

/** The tight box of the outline (of its curves, not its handles), or undefined when it has no contours. */
export function tightBounds(outline: GlyphOutline): BoundingBox | undefined {
  return boundsOfSegments(outline.contours.flatMap((c) => contourSegments(c)));
}

function snap(v: number): number {
  const nearest = Math.round(v);
  return Math.abs(v - nearest) < WHOLE_UNIT_SNAP ? nearest : v;
}

/** The tight box widened to whole units (never smaller than the ink), or undefined for an empty outline. */
export function integerBounds(outline: GlyphOutline): IntegerBox | undefined {
  const box = tightBounds(outline);
  if (box === undefined) return undefined;
  return {
    xMin: Math.floor(snap(box.minX)) + 0,
    yMin: Math.floor(snap(box.minY)) + 0,
    xMax: Math.ceil(snap(box.maxX)) + 0,
    yMax: Math.ceil(snap(box.maxY)) + 0,
  };
}

/** The smallest box holding both. */
export function unionOfIntegerBoxes(a: IntegerBox, b: IntegerBox): IntegerBox {
  return { xMin: Math.min(a.xMin, b.xMin), yMin: Math.min(a.yMin, b.yMin), xMax: Math.max(a.xMax, b.xMax), yMax: Math.max(a.yMax, b.yMax) };
}
