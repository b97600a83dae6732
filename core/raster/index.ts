// Public API of the raster stage: greyscale scan in, nested sub-pixel contours and
// letters out. Import from here rather than from the individual files.

export type { Box, Contour, GreyRaster, InkMask, Point, ScanImage } from './types.ts';
export { RasterError, type RasterErrorCode } from './raster-error.ts';

export { GREY_LEVELS, greyHistogram } from './histogram.ts';
export {
  OTSU_PLATEAU_RELATIVE_TOLERANCE,
  estimatePaperAndInk,
  otsuBetweenClassVariance,
  otsuLevel,
  subpixelIsoLevel,
  type PaperAndInkLevels,
} from './threshold-otsu.ts';
export { SAUVOLA_DEFAULT_DYNAMIC_RANGE, SAUVOLA_DEFAULT_K, SAUVOLA_K_RANGE, sauvolaMask, type SauvolaOptions } from './threshold-sauvola.ts';
export { isoLevelAt, localIsoLevelField, maskAtOrBelowIsoLevel, uniformIsoLevel, type IsoLevelField } from './iso-level-field.ts';
export { invertRaster } from './invert-raster.ts';
export {
  binarize,
  type BinarizeMethod,
  type BinarizeOptions,
  type BinarizeResult,
  type ManualBinarizeOptions,
  type OtsuBinarizeOptions,
  type SauvolaBinarizeOptions,
} from './binarize.ts';

export { componentLabelImage, labelComponents, labelInkComponents, labelPaperComponents, type Components, type Connectivity, type LabelledRuns } from './components.ts';
export { ASSUMED_DPI, MM_PER_INCH, millimetresToPixels, resolveResolution, squareMillimetresToPixels, type Resolution } from './physical-units.ts';
export { DEFAULT_PINHOLE_AREA_MM2, DEFAULT_SPECK_AREA_MM2, cleanupMask, type CleanupOptions, type CleanupResult } from './cleanup.ts';

export { traceCrackLoops, type CrackLoop } from './crack-following.ts';
export { marchingSquaresChains } from './marching-squares.ts';
export { pixelEdgeChains } from './pixel-edges.ts';
export { DEFAULT_ISO_LEVEL, isBilevel, traceBoundaries, type BoundaryMethod, type TraceBoundariesOptions, type TracedBoundaries } from './trace-boundaries.ts';

export { boundingBox, boxContains, polygonContains, signedArea } from './polygon-measures.ts';
export { nestContours } from './nesting.ts';
export { PIXEL_APERTURE_SIGMA_PX, estimateEdgeBlur } from './edge-blur.ts';
export { letterNumbers, repeatedCharacters, type RepeatedCharacter } from './repeated-characters.ts';
export { segmentSheet, splitCharacters, type SegmentSheetOptions, type SheetLetter, type SheetRow, type SheetSegmentation } from './segment-sheet.ts';
export { DEFAULT_SAUVOLA_WINDOW_MM, scanInk, traceScan, type ScanInk, type TraceScanOptions, type TraceScanResult, type TraceStage } from './trace-scan.ts';
export { inReadingOrder } from './reading-order.ts';
export { SheetEditError } from './sheet-edit-error.ts';
export { mergeLetters, unionOfBoxes } from './merge-letters.ts';
export { letterPieces, pieceGaps, pieceSide, piecesCrossedAt, splitLetterByPieces, type LetterPiece, type PieceGap } from './split-letter.ts';
export { cutLetterInk, letterInkPixels, type CutInk, type InkSource } from './cut-ink.ts';
export {
  NO_GUIDES_SET,
  applySheetEdit,
  applySheetEdits,
  assignInReadingOrder,
  hasSeveralPieces,
  uncorrectedSheet,
  type CorrectedSheet,
  type HeightGuide,
  type SheetEdit,
  type SheetGuides,
} from './sheet-edits.ts';
export { rebaseSheetEdits, sameLetters, SAME_BOX_TOLERANCE_PX, SAME_PLACE_OVERLAP, type RebasedEdits } from './rebase-sheet-edits.ts';
export { BILEVEL_SMOOTHING_SIGMA_PX, SMOOTHED_BILEVEL_NOISE_PX, smoothedBilevelBlurPx, smoothedMaskField } from './bilevel-smoothing.ts';
