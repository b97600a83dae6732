/**
 * Default spacing of a fitted letter: its outline moved so that its leftmost ink sits
 * at the left sidebearing, and an advance width that leaves the right sidebearing
 * after its rightmost ink. The designer changes sidebearings per glyph afterwards.
 */
import { boundsOfSegments } from '../geometry/bounds.ts';
import { contourSegments, mapContour, type GlyphOutline } from '../outline/index.ts';

/**
 * Default sidebearing as a share of the cap height: 50 units for a 700-unit cap
 * height. A starting point, not spacing: from memory, straight-sided letters of text
 * faces carry roughly 40–70 units a side at 1000 units per em (common practice).
 */
export const DEFAULT_SIDEBEARING_PER_CAP_HEIGHT = 50 / 700;

export interface SpacedGlyph {
  readonly outline: GlyphOutline;
  readonly advanceWidth: number;
  readonly leftSidebearing: number;
}

/** Horizontal extent of an outline's ink, or null for an empty outline. */
export function inkExtent(outline: GlyphOutline): { xMin: number; xMax: number } | null {
  const bounds = boundsOfSegments(outline.contours.flatMap((c) => contourSegments(c)));
  return bounds ? { xMin: bounds.minX, xMax: bounds.maxX } : null;
}

/**
 * Places `outline` between whole-unit sidebearings. The outline is moved by a whole
 * number of units, so integer coordinates stay integers.
 */
export function spaceGlyph(outline: GlyphOutline, leftSidebearing: number, rightSidebearing: number): SpacedGlyph {
  const extent = inkExtent(outline);
  const left = Math.round(leftSidebearing);
  const right = Math.round(rightSidebearing);
  if (!extent) return { outline, advanceWidth: left + right, leftSidebearing: left };
  const shift = left - Math.floor(extent.xMin);
  const moved = { contours: outline.contours.map((c) => mapContour(c, (p) => ({ x: p.x + shift, y: p.y }))) };
  return { outline: moved, advanceWidth: Math.ceil(extent.xMax) + shift + right, leftSidebearing: left };
}
