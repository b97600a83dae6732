/** Public API of the pipeline: a scan in, fitted letters in font units out. */
export { fitTracedSheet, MIN_TOLERANCE_PIXELS, toFontUnits, toScanPixels, traceLetters, type LetterFrame, type TraceLettersOptions, type TracedLetter, type TracedLetters } from './trace-letters.ts';
export { draftFont, DraftFontError, type DraftFont, type DraftFontSettings, type DraftGlyph } from './draft-font.ts';
export { traceSheets, type TraceSheetsOptions } from './trace-sheets.ts';
