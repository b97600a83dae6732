// Shared builders for the document tests: circles made of Bézier arcs, a square, and
// one-glyph documents. Nothing here is under test.
import type { CubicSegment, Point } from '../../core/geometry/index.ts';
import { cubic, evaluate, line } from '../../core/geometry/index.ts';
import { contourFromSegments, contourSegments, type OutlineContour, type OutlineSegment } from '../../core/outline/index.ts';
import { createDocument, type GlyphDocument } from '../../core/document/index.ts';

/**
 * Handle length, per unit radius, of a cubic approximating a circular arc of angle θ:
 * k = 4/3·tan(θ/4). For θ = 90° this is the four-arc circle constant 0.5522847498
 * (Riškus 2006, "Approximation of a cubic Bézier curve by circular arcs and vice
 * versa", Information Technology and Control 35(4)).
 */
export function arcHandleFactor(theta: number): number {
  return (4 / 3) * Math.tan(theta / 4);
}

/** A counter-clockwise circle of `count` equal cubic arcs, every on-curve point smooth. */
export function circleContour(cx: number, cy: number, r: number, count: number): OutlineContour {
  const theta = (2 * Math.PI) / count;
  const k = arcHandleFactor(theta) * r;
  const segments: CubicSegment[] = [];
  for (let i = 0; i < count; i++) {
    const a0 = i * theta;
    const a1 = (i + 1) * theta;
    const p0 = { x: cx + r * Math.cos(a0), y: cy + r * Math.sin(a0) };
    const p3 = { x: cx + r * Math.cos(a1), y: cy + r * Math.sin(a1) };
    const p1 = { x: p0.x - k * Math.sin(a0), y: p0.y + k * Math.cos(a0) };
    const p2 = { x: p3.x + k * Math.sin(a1), y: p3.y - k * Math.cos(a1) };
    segments.push(cubic(p0, p1, p2, p3));
  }
  return contourFromSegments(segments, segments.map(() => true));
}

/** A counter-clockwise axis-aligned square of lines, corners not smooth. */
export function squareContour(x0: number, y0: number, x1: number, y1: number): OutlineContour {
  const a = { x: x0, y: y0 };
  const b = { x: x1, y: y0 };
  const c = { x: x1, y: y1 };
  const d = { x: x0, y: y1 };
  return contourFromSegments([line(a, b), line(b, c), line(c, d), line(d, a)]);
}

/** A document with one glyph "o" holding the given contours, advance 1000. */
export function oneGlyph(contours: readonly OutlineContour[], advanceWidth = 1000): GlyphDocument {
  return createDocument([{ name: 'o', unicodes: [0x6f], outline: { contours }, advanceWidth }]);
}

/** Points along segments, `perSegment` per segment, uniform in t. */
export function samplesOf(segments: readonly OutlineSegment[], perSegment = 64): Point[] {
  return segments.flatMap((s) => Array.from({ length: perSegment + 1 }, (_, k) => evaluate(s, k / perSegment)));
}

export function segmentsOf(contour: OutlineContour | undefined): OutlineSegment[] {
  if (!contour) throw new Error('missing contour');
  return contourSegments(contour);
}
