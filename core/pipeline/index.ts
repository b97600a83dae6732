/** Public API of the pipeline: a scan in, fitted letters in font units out. */
export { fitTracedSheet, MIN_TOLERANCE_PIXELS, toFontUnits, toScanPixels, traceLetters, type LetterFrame, type TraceLettersOptions, type TracedLetter, type TracedLetters } from './trace-letters.ts';
export { draftFont, DraftFontError, type DraftFont, type DraftFontSettings, type DraftGlyph } from './draft-font.ts';
export { traceSheets, type TraceSheetsOptions } from './trace-sheets.ts';
export {
  CLEANUP_AREA_RANGE,
  CORNER_ANGLE_RANGE,
  DEFAULT_FIT_SETTINGS,
  DEFAULT_PIPELINE_SETTINGS,
  DEFAULT_SCAN_SETTINGS,
  FIT_MODES,
  fitOptionsOf,
  GREY_LEVEL_RANGE,
  inRange,
  sameFitSettings,
  sameScanSettings,
  SettingsError,
  TOLERANCE_RANGE,
  traceScanOptionsOf,
  validateFitSettings,
  validatePipelineSettings,
  validateScanSettings,
  type FitSettings,
  type PipelineSettings,
  type ScanSettings,
  type SettingRange,
  type ThresholdSetting,
} from './pipeline-settings.ts';
