/**
 * A glyph's outline: its contours, in font units with y up (the OpenType convention:
 * the baseline at y = 0, ascenders positive). Contour direction follows the CFF
 * convention: outer contours counter-clockwise, holes clockwise (Adobe Technical
 * Note #5177 recommends this direction for Type 2 charstrings), which the nonzero
 * fill rule renders with holes open.
 */
import { signedArea } from '../geometry/area.ts';
import { contourSegments, reverseContour, type OutlineContour } from './outline-contour.ts';

export interface GlyphOutline {
  readonly contours: readonly OutlineContour[];
}

/** Signed area of a contour in its own frame: positive is counter-clockwise with y up. */
export function contourArea(contour: OutlineContour): number {
  return signedArea(contourSegments(contour));
}

/**
 * Sets each contour's direction from its nesting depth: even depth (outer, island)
 * counter-clockwise, odd depth (hole) clockwise, in a y-up frame. `depths[i]` is the
 * depth of contour i.
 */
export function orientByDepth(outline: GlyphOutline, depths: readonly number[]): GlyphOutline {
  return {
    contours: outline.contours.map((contour, i) => {
      const wantCounterClockwise = (depths[i] ?? 0) % 2 === 0;
      const isCounterClockwise = contourArea(contour) > 0;
      return wantCounterClockwise === isCounterClockwise ? contour : reverseContour(contour);
    }),
  };
}
