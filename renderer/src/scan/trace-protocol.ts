// Messages between the page and the tracing worker. The worker runs the core
// raster stage off the main thread, so tracing a whole sheet never freezes the
// window, and reports progress as it goes.
import type { Box, Contour, SheetEdit, SheetGuides, SheetSegmentation, TraceStage } from '../../../core/raster/index.ts';
import type { GlyphOutline } from '../../../core/outline/index.ts';
import type { FitWarning } from '../../../core/fit/index.ts';
import type { FitSettings, LetterFrame, ScanSettings } from '../../../core/pipeline/index.ts';

export type TraceRequest =
  /** Traces a decoded scan; the worker keeps its pixels, to trace it again with other settings. */
  | { type: 'trace'; id: number; raster: { width: number; height: number; data: Uint8Array; dpi?: number }; settings: ScanSettings }
  /**
   * Traces the kept scan again with other settings. With `from`, the corrections
   * `from.edits`, made on the scan traced with `from.settings` (the user's last
   * corrections, whatever settings were tried since), are carried over to the letters
   * found now (core/raster rebase-sheet-edits.ts); without it, `edits` are applied as
   * they are (undo and redo of a settings change send the list they had). On failure
   * the worker keeps the sheet it had.
   */
  | { type: 'retrace'; id: number; settings: ScanSettings; edits: readonly SheetEdit[]; from: { settings: ScanSettings; edits: readonly SheetEdit[] } | null }
  /** The cleaned ink mask the settings give on the kept scan, as an image to lay over it. */
  | { type: 'preview'; id: number; settings: ScanSettings }
  /**
   * The traced sheet with `edits` applied in order (core/raster sheet-edits.ts): the
   * whole list each time, so undo is the same list shortened; the worker re-applies
   * only what differs from the list it last applied.
   */
  | { type: 'correct'; id: number; edits: readonly SheetEdit[] }
  /**
   * Fits assigned letters of the last traced sheet (core/pipeline fitLetterJob):
   * those in `letters` (reading-order indices), or all of them. The page fits a few at
   * a time, so it can stop between them.
   */
  | { type: 'fit'; id: number; settings: FitSettings; letters?: readonly number[] };

/** A traced scan traced again: the sheet, the corrections it carries, and how they were carried. */
export interface RetracedSheet {
  readonly sheet: TracedSheet;
  readonly edits: readonly SheetEdit[];
  readonly kept: 'all' | 'characters';
  readonly lostCharacters: number;
  readonly droppedCorrections: number;
}

/** The ink a scan setting gives, to judge it before the letters are found again. */
export interface InkPreview {
  /** A PNG of the ink (tinted, paper transparent) the size of the scan or smaller, or null where the worker cannot draw. */
  readonly image: Blob | null;
  readonly level: number | null;
  /** Share of the page taken as ink, 0–1. */
  readonly inkShare: number;
}

/** One height guide as the fit will use it, in pixels above each row's baseline. */
export interface GuideHeight {
  readonly pixels: number;
  /** 'set': by the user; 'measured': on the letters named; 'typical': the typical letter height, for want of a flat-topped capital. */
  readonly from: 'set' | 'measured' | 'typical';
  readonly letters: string;
}

export interface TracedSheet {
  width: number;
  height: number;
  dpi: number;
  dpiAssumed: boolean;
  level: number | null;
  /** Every contour, those of cut letters appended after the traced ones. */
  contours: Contour[];
  /** The letters and rows as corrected. */
  sheet: SheetSegmentation;
  /** Which guides the user set. */
  guides: SheetGuides;
  /** The cap height and x-height the fit will use (the x-height null while neither measured nor set). */
  heights: { capHeight: GuideHeight; xHeight: GuideHeight | null };
  notes: string[];
}

/** One assigned letter after fitting, in its own font-unit frame (y up, baseline at 0). */
export interface FittedLetter {
  readonly index: number;
  readonly character: string;
  /** The contours of the sheet that make the letter. */
  readonly contours: readonly number[];
  /** A digest of the letter's traced boundary points: the same digest means the same ink, whatever settings traced it. */
  readonly ink: string;
  /** The letter's ink box on the scan, pixels. */
  readonly box: Box;
  /** Where the letter's font-unit frame sits on the scan. */
  readonly frame: LetterFrame;
  /** The fitted outline, or null when fitting failed (see `problem`). */
  readonly outline: GlyphOutline | null;
  /** The fit report's warnings: what a designer would still fix by hand. */
  readonly warnings: readonly FitWarning[];
  /** Largest distance from the traced boundary to the outline, font units. */
  readonly maxDeviation: number | null;
  readonly problem: string | null;
}

/** Vertical metrics measured on the sheet, in font units (null where not measured). */
export interface FittedMetrics {
  readonly capHeight: number;
  readonly xHeight: number | null;
  readonly ascender: number | null;
  readonly descender: number | null;
}

export interface FittedSheet {
  readonly letters: readonly FittedLetter[];
  readonly metrics: FittedMetrics;
  readonly unitsPerPixel: number;
  /** The fitting tolerance used, font units. */
  readonly tolerance: number;
  readonly notes: readonly string[];
}

export type TraceReply =
  | { type: 'progress'; id: number; fraction: number; stage: TraceStage | 'fitting' | 'correcting' }
  | { type: 'traced'; id: number; result: TracedSheet }
  | { type: 'fitted'; id: number; result: FittedSheet }
  | { type: 'retraced'; id: number; result: RetracedSheet }
  | { type: 'previewed'; id: number; result: InkPreview }
  | { type: 'failed'; id: number; message: string };
