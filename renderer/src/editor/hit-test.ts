/**
 * Hit testing in screen terms: what the pointer is over, and when a press becomes a
 * drag. Pick distances are in screen pixels (what the hand can aim at), converted to
 * font units for core/document's point picking, so picking feels the same at any zoom.
 */
import type { Point } from '../../../core/geometry/vector.ts';
import { pointAt, type GlyphDocument, type GlyphId, type PointRef, type Rect } from '../../../core/document/index.ts';
import { toFontUnits, type ViewTransform } from './view-transform.ts';

/** Pick radius around a point, screen pixels: a little larger than the drawn marks (common practice). */
export const PICK_RADIUS_PIXELS = 7;
/** Pointer travel, screen pixels, below which a press and release is a click, not a drag or marquee. */
export const DRAG_THRESHOLD_PIXELS = 3;

/** A screen distance expressed in font units at this view. */
export function pixelsToUnits(view: ViewTransform, pixels: number): number {
  return pixels / view.scale;
}

/** The point of `glyph` under the screen position `at`, or null (handles win ties; see core pointAt). */
export function pointUnderPointer(document: GlyphDocument, glyph: GlyphId, view: ViewTransform, at: Point): PointRef | null {
  return pointAt(document, glyph, toFontUnits(view, at), pixelsToUnits(view, PICK_RADIUS_PIXELS));
}

/** The font-unit rectangle spanned by two screen corners of a marquee. */
export function marqueeRect(view: ViewTransform, a: Point, b: Point): Rect {
  const p = toFontUnits(view, a);
  const q = toFontUnits(view, b);
  return { x0: Math.min(p.x, q.x), y0: Math.min(p.y, q.y), x1: Math.max(p.x, q.x), y1: Math.max(p.y, q.y) };
}

/** True once the pointer has travelled far enough from where it was pressed to count as a drag. */
export function isDrag(down: Point, now: Point): boolean {
  return Math.hypot(now.x - down.x, now.y - down.y) >= DRAG_THRESHOLD_PIXELS;
}

/**
 * The offset of a point drag in whole font units: the pointer's travel since
 * pressing, converted at this view and rounded, so fitted points (on the unit grid)
 * stay on it while dragged.
 */
export function dragOffset(view: ViewTransform, down: Point, now: Point): Point {
  const a = toFontUnits(view, down);
  const b = toFontUnits(view, now);
  return { x: Math.round(b.x - a.x), y: Math.round(b.y - a.y) };
}
