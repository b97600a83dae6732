// Messages between the page and the tracing worker. The worker runs the core
// raster stage off the main thread, so tracing a whole sheet never freezes the
// window, and reports progress as it goes.
import type { Box, Contour, SheetSegmentation, TraceScanOptions, TraceStage } from '../../../core/raster/index.ts';
import type { GlyphOutline } from '../../../core/outline/index.ts';
import type { FitWarning } from '../../../core/fit/index.ts';
import type { LetterFrame } from '../../../core/pipeline/index.ts';

/** Settings the user can change for a trace (the rest use core defaults). */
export type TraceSettings = Pick<TraceScanOptions, 'method' | 'level' | 'invert' | 'speckAreaMm2' | 'pinholeAreaMm2' | 'characters'>;

export type TraceRequest =
  | { type: 'trace'; id: number; raster: { width: number; height: number; data: Uint8Array; dpi?: number }; settings: TraceSettings }
  | { type: 'assign'; id: number; characters: string }
  /** Fits every assigned letter of the last traced sheet (core/pipeline fitTracedSheet). */
  | { type: 'fit'; id: number };

export interface TracedSheet {
  width: number;
  height: number;
  dpi: number;
  dpiAssumed: boolean;
  level: number | null;
  contours: Contour[];
  sheet: SheetSegmentation;
  notes: string[];
}

/** One assigned letter after fitting, in its own font-unit frame (y up, baseline at 0). */
export interface FittedLetter {
  readonly index: number;
  readonly character: string;
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
  | { type: 'progress'; id: number; fraction: number; stage: TraceStage | 'fitting' }
  | { type: 'traced'; id: number; result: TracedSheet }
  | { type: 'fitted'; id: number; result: FittedSheet }
  | { type: 'failed'; id: number; message: string };
