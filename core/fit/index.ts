/**
 * Public API of the fitting engine: traced boundary chains (font units, y up) in,
 * type-quality outline contours of lines and cubics out, with a quality report.
 * Import from here; the stage files may change.
 */
export { fitContour, ROUNDING_RESERVE_GRID, type ContourFit } from './fit-contour.ts';
export { fitGlyph, type GlyphChain, type GlyphFit } from './fit-glyph.ts';
export {
  DEFAULT_AXIS_SNAP_DEGREES,
  DEFAULT_CORNER_ANGLE_DEGREES,
  DEFAULT_FAIRING,
  DEFAULT_FIT_MODE,
  DEFAULT_GRID,
  DEFAULT_TOLERANCE,
  resolveFitOptions,
  type FitMode,
  type FitOptions,
  type ResolvedFitOptions,
} from './fit-options.ts';
export { fitPeriodicSpline, fitSmoothContour, fitSmoothRuns, type PeriodicSplineFit, type SmoothFitSettings } from './smooth-fit.ts';
export {
  KINK_MAX_DEGREES,
  KINK_MIN_DEGREES,
  turnAtJoin,
  type ContourFitReport,
  type FitWarning,
  type FitWarningKind,
  type GlyphFitReport,
} from './quality-report.ts';
export { handlesCross } from './finishing.ts';
export {
  fairSmoothJoins,
  fairSmoothJoinsWithReport,
  G2_RELATIVE_TOLERANCE,
  joinCurvatures,
  type FairingOptions,
  type FairingOutcome,
  type FairingResult,
  type JoinCurvature,
  type JoinFairing,
} from './fairing.ts';
export { EXTREMUM_PROTRUSION_LIMIT, MIN_POINT_SPACING_UNITS, segmentExtrema, type SegmentExtremum } from './extrema.ts';
export type { FitNode, FitSpan, FittedContour } from './fitted-contour.ts';
