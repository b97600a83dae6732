/** Public API of the metrics stage: vertical metrics from a traced sheet, and the font scale. */
export { ASCENDER_LETTERS, CAP_HEIGHT_LETTERS, DESCENDER_LETTERS, DOTTED_LETTERS, X_HEIGHT_LETTERS } from './measuring-letters.ts';
export { DEFAULT_CAP_HEIGHT_UNITS, measureSheetMetrics, unitsPerPixel, type MeasuredHeight, type SheetMetrics } from './measure-metrics.ts';
export { DEFAULT_SIDEBEARING_PER_CAP_HEIGHT, inkExtent, spaceGlyph, type SpacedGlyph } from './spacing.ts';
export { DEFAULT_UNITS_PER_EM } from './units-per-em.ts';
export { DEFAULT_LINE_SPACING_EM, defaultLineGap } from './line-gap.ts';
export { SET_BY_HAND, withGuideHeights, type GuideHeights } from './guide-heights.ts';
export { FALLBACK_ASCENDER_PER_CAP, FALLBACK_DESCENDER_PER_CAP, FALLBACK_X_HEIGHT_PER_CAP, fontHeights, type DrawnHeights, type FontHeights, type PlaceholderHeight } from './font-heights.ts';
