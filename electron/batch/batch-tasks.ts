// Tracing one sheet file of a batch build, as plain data in and out, so it runs the
// same in the calling thread (`--jobs 1`) or in a worker thread (batch-worker.ts).
// Errors the user must see (a file that will not decode, a page with no ink) cross
// the thread boundary as plain data and are rebuilt as the same error classes.
import { decodeScanFile } from '../io/decode-scan.ts';
import { InputError, type InputErrorKind } from '../io/input-error.ts';
import { RasterError, type RasterErrorCode, type TraceScanOptions, type TraceScanResult } from '../../core/raster/index.ts';
import { traceSheetScan, type FittableScan } from '../../core/pipeline/index.ts';

/** Trace the sheet in `path`: decode it, apply the resolution override, trace. */
export interface TraceSheetTask {
  readonly kind: 'trace';
  readonly path: string;
  /** The resolution to use over the file's own (`--dpi`). */
  readonly dpi: number | undefined;
  readonly scan: TraceScanOptions;
}

/** The part of a sheet's trace that fitting needs (no rasters). */
export type TracedSheetScan = FittableScan & Pick<TraceScanResult, 'resolution'>;

/**
 * What tracing a sheet file gives back: how the file was read and the trace, or
 * (for a page with no ink) the tracer's error, so the notes reach the user either way.
 */
export interface TracedSheetFile {
  /** Notes on how the file was read (pages skipped, resolution assumed…), for the user. */
  readonly decodeNotes: readonly string[];
  readonly scan: TracedSheetScan | null;
  readonly traceError: PortableError | null;
}

/** An error of the user's input, as plain data. */
export type PortableError =
  | { readonly type: 'input'; readonly kind: InputErrorKind; readonly file: string; readonly message: string }
  | { readonly type: 'raster'; readonly code: RasterErrorCode; readonly message: string }
  | { readonly type: 'other'; readonly message: string; readonly stack?: string };

/**
 * Decodes and traces one sheet file. Throws InputError for a file that will not
 * decode; a RasterError from tracing (a page with no ink) is returned as `traceError`.
 */
export async function traceSheetFile(task: TraceSheetTask): Promise<TracedSheetFile> {
  const decoded = await decodeScanFile(task.path);
  const dpi = task.dpi ?? decoded.dpi;
  try {
    const traced = traceSheetScan({ raster: dpi === undefined ? decoded.raster : { ...decoded.raster, dpi } }, task.scan);
    return {
      decodeNotes: decoded.notes,
      scan: { sheet: traced.sheet, contours: traced.contours, edgeBlurPx: traced.edgeBlurPx, edgeNoisePx: traced.edgeNoisePx, notes: traced.notes, resolution: traced.resolution },
      traceError: null,
    };
  } catch (error) {
    if (error instanceof RasterError) return { decodeNotes: decoded.notes, scan: null, traceError: toPortableError(error) };
    throw error;
  }
}

/** The error as plain data for another thread. */
export function toPortableError(error: unknown): PortableError {
  if (error instanceof InputError) return { type: 'input', kind: error.kind, file: error.file, message: error.message };
  if (error instanceof RasterError) return { type: 'raster', code: error.code, message: error.message };
  if (error instanceof Error) return error.stack === undefined ? { type: 'other', message: error.message } : { type: 'other', message: error.message, stack: error.stack };
  return { type: 'other', message: String(error) };
}

/** The error rebuilt from plain data, of the class it was thrown as. */
export function fromPortableError(error: PortableError): Error {
  switch (error.type) {
    case 'input':
      return new InputError(error.kind, error.file, error.message);
    case 'raster':
      return new RasterError(error.code, error.message);
    case 'other': {
      const rebuilt = new Error(error.message);
      if (error.stack !== undefined) rebuilt.stack = error.stack;
      return rebuilt;
    }
  }
}
