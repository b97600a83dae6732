/**
 * The editor's view: how font units (y up, the glyph's own frame) map onto screen
 * pixels (y down, the drawing area's top-left at 0, 0). A uniform scale and an offset;
 * zooming keeps the font point under the pointer where it is, panning moves the offset.
 * Plain data and free functions, no DOM, so the maths is tested on its own.
 */
import type { Point } from '../../../core/geometry/vector.ts';

export interface ViewTransform {
  /** Screen pixels per font unit. */
  readonly scale: number;
  /** Screen position of the font-unit origin (the glyph's origin on the baseline). */
  readonly originX: number;
  readonly originY: number;
}

/** A box in font units. */
export interface UnitBox {
  readonly minX: number;
  readonly minY: number;
  readonly maxX: number;
  readonly maxY: number;
}

/**
 * Zoom limits in pixels per unit: 0.02 shows a 1000-unit em in 20 px; 64 shows one
 * unit as 64 px, enough to place a point on the unit grid by eye.
 */
export const MIN_SCALE = 0.02;
export const MAX_SCALE = 64;
/** Zoom step of the + and − keys and buttons: a factor of √2 per press (common practice in drawing tools). */
export const KEY_ZOOM_FACTOR = Math.SQRT2;
/** Wheel zoom per pixel of wheel delta: 100 px of wheel (one notch in most browsers) zooms by e^0.2 ≈ 1.22. */
export const WHEEL_ZOOM_PER_PIXEL = 0.002;
/** Pan per arrow key press, screen pixels (shift: ten times). */
export const KEY_PAN_PIXELS = 40;

export function clampScale(scale: number): number {
  return Math.min(MAX_SCALE, Math.max(MIN_SCALE, scale));
}

/** The screen position of a font-unit point. */
export function toScreen(view: ViewTransform, p: Point): Point {
  return { x: view.originX + p.x * view.scale, y: view.originY - p.y * view.scale };
}

/** The font-unit point shown at a screen position. */
export function toFontUnits(view: ViewTransform, s: Point): Point {
  return { x: (s.x - view.originX) / view.scale, y: (view.originY - s.y) / view.scale };
}

/**
 * The view zoomed by `factor` (clamped to the zoom limits) about the screen point
 * `about`: the font point shown there before is shown there after.
 */
export function zoomAbout(view: ViewTransform, about: Point, factor: number): ViewTransform {
  const scale = clampScale(view.scale * factor);
  const fixed = toFontUnits(view, about);
  return { scale, originX: about.x - fixed.x * scale, originY: about.y + fixed.y * scale };
}

/** The wheel zoom factor for a wheel delta in pixels (negative delta, wheel up, zooms in). */
export function wheelZoomFactor(deltaY: number): number {
  return Math.exp(-deltaY * WHEEL_ZOOM_PER_PIXEL);
}

/** The view moved by (dx, dy) screen pixels: what was under a pixel is now (dx, dy) further on. */
export function panBy(view: ViewTransform, dx: number, dy: number): ViewTransform {
  return { ...view, originX: view.originX + dx, originY: view.originY + dy };
}

/**
 * The view showing `box` as large as fits in a `width` × `height` screen area with
 * `margin` pixels left on every side, centred.
 */
export function fitBox(box: UnitBox, width: number, height: number, margin = 0): ViewTransform {
  const boxWidth = Math.max(box.maxX - box.minX, 1e-9);
  const boxHeight = Math.max(box.maxY - box.minY, 1e-9);
  const scale = clampScale(Math.min(Math.max(width - 2 * margin, 1) / boxWidth, Math.max(height - 2 * margin, 1) / boxHeight));
  const centreX = (box.minX + box.maxX) / 2;
  const centreY = (box.minY + box.maxY) / 2;
  return { scale, originX: width / 2 - centreX * scale, originY: height / 2 + centreY * scale };
}

/** The view with `p` (font units) at the centre of a `width` × `height` area, at `scale` (clamped). */
export function centreOn(p: Point, width: number, height: number, scale: number): ViewTransform {
  const s = clampScale(scale);
  return { scale: s, originX: width / 2 - p.x * s, originY: height / 2 + p.y * s };
}
