/** Public API of the pipeline: a scan in, fitted letters in font units out. */
export {
  assembleSheetFit,
  fitLetterJob,
  fitTracedSheet,
  MIN_TOLERANCE_PIXELS,
  planSheetFit,
  toFontUnits,
  toScanPixels,
  traceLetters,
  type FittableScan,
  type FittedSheet,
  type LetterFitJob,
  type LetterFitOutcome,
  type LetterFrame,
  type PlannedLetter,
  type SheetFitPlan,
  type TraceLettersOptions,
  type TracedLetter,
  type TracedLetters,
} from './trace-letters.ts';
export { draftFont, DraftFontError, type DraftFont, type DraftFontSettings, type DraftGlyph } from './draft-font.ts';
export { fitTracedSheets, letterCountMismatch, scaleReference, sheetUnitsPerPixel, traceSheets, traceSheetScan, type ScaleReference, type TraceSheetsOptions } from './trace-sheets.ts';
