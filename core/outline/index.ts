/** Public API of the outline model shared by fitting, checks, the editor and font IO. */
export { offCurve, onCurve, type OutlinePoint, type PointKind } from './outline-point.ts';
export {
  contourFromSegments,
  contourSegments,
  mapContour,
  onCurvePoints,
  reverseContour,
  type OutlineContour,
  type OutlineSegment,
} from './outline-contour.ts';
export { contourArea, orientByDepth, type GlyphOutline } from './glyph-outline.ts';
export { outlineFromJson, outlineToJson, type GlyphOutlineJson, type PointJson } from './outline-json.ts';
export { OutlineError, type OutlineErrorCode } from './outline-error.ts';
