// Messages between the page and the tracing worker. The worker runs the core
// raster stage off the main thread, so tracing a whole sheet never freezes the
// window, and reports progress as it goes.
import type { Box, Contour, SheetEdit, SheetGuides, SheetSegmentation, TraceScanOptions, TraceStage } from '../../../core/raster/index.ts';
import type { GlyphOutline } from '../../../core/outline/index.ts';
import type { FitWarning } from '../../../core/fit/index.ts';
import type { LetterFrame } from '../../../core/pipeline/index.ts';

/** Settings the user can change for a trace (the rest use core defaults). */
export type TraceSettings = Pick<TraceScanOptions, 'method' | 'level' | 'invert' | 'speckAreaMm2' | 'pinholeAreaMm2' | 'characters'>;

export type TraceRequest =
  | { type: 'trace'; id: number; raster: { width: number; height: number; data: Uint8Array; dpi?: number }; settings: TraceSettings }
  /**
   * The traced sheet with `edits` applied in order (core/raster sheet-edits.ts): the
   * whole list each time, so undo is the same list shortened; the worker re-applies
   * only what differs from the list it last applied.
   */
  | { type: 'correct'; id: number; edits: readonly SheetEdit[] }
  /** Fits every assigned letter of the last traced sheet (core/pipeline fitTracedSheet). */
  | { type: 'fit'; id: number };

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
  /** The contours of the sheet that make the letter: the same list means the same ink. */
  readonly contours: readonly number[];
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
  | { type: 'failed'; id: number; message: string };
