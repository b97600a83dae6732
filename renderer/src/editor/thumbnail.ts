/**
 * A letter's thumbnail: its outline fitted into a small square, as SVG path data, so
 * the at-a-glance screen can show every letter filled at the same size per letter.
 */
import { boundsOfSegments } from '../../../core/geometry/bounds.ts';
import { contourSegments, type GlyphOutline } from '../../../core/outline/index.ts';
import { fitBox } from './view-transform.ts';
import { outlinePathData } from './outline-drawing.ts';

/** Path data of `outline` fitted into a `size` × `size` square with `margin` pixels each side. */
export function thumbnailPathData(outline: GlyphOutline, size: number, margin: number): string {
  const bounds = boundsOfSegments(outline.contours.flatMap((c) => contourSegments(c)));
  if (!bounds) return '';
  return outlinePathData(outline, fitBox(bounds, size, size, margin));
}
