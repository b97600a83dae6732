// Messages between the page and the tracing worker. The worker runs the core
// raster stage off the main thread, so tracing a whole sheet never freezes the
// window, and reports progress as it goes.
import type { Contour, SheetSegmentation, TraceScanOptions, TraceStage } from '../../../core/raster/index.ts';

/** Settings the user can change for a trace (the rest use core defaults). */
export type TraceSettings = Pick<TraceScanOptions, 'method' | 'level' | 'invert' | 'speckAreaMm2' | 'pinholeAreaMm2' | 'characters'>;

export type TraceRequest =
  | { type: 'trace'; id: number; raster: { width: number; height: number; data: Uint8Array; dpi?: number }; settings: TraceSettings }
  | { type: 'assign'; id: number; characters: string };

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

export type TraceReply =
  | { type: 'progress'; id: number; fraction: number; stage: TraceStage }
  | { type: 'traced'; id: number; result: TracedSheet }
  | { type: 'failed'; id: number; message: string };
