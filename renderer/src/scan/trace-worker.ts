// The tracing worker: runs core's traceScan on a decoded scan and keeps the result,
// so that reassigning characters re-runs only the cheap segmentation and fitting the
// assigned letters (core/pipeline fitTracedSheet) needs no second trace.
import { RasterError, segmentSheet, traceScan, type TraceScanResult } from '../../../core/raster/index.ts';
import { fitTracedSheet } from '../../../core/pipeline/index.ts';
import type { FittedSheet, TraceReply, TraceRequest, TracedSheet } from './trace-protocol.ts';

let lastScan: TraceScanResult | null = null;
let lastResult: TracedSheet | null = null;

function reply(message: TraceReply): void {
  postMessage(message);
}

function describe(error: unknown): string {
  if (error instanceof RasterError) return error.message;
  return `Tracing failed unexpectedly (${error instanceof Error ? error.message : String(error)}). Please report this with the scan.`;
}

/** Fits the assigned letters of the last traced sheet; unassigned letters are left out. */
function fitAssigned(scan: TraceScanResult, id: number): FittedSheet {
  const assigned = { ...scan.sheet, letters: scan.sheet.letters.filter((l) => l.character !== null) };
  if (assigned.letters.length === 0) throw new Error('No letter has a character yet: type the characters on the sheet and assign them first.');
  const fitted = fitTracedSheet({ ...scan, sheet: assigned }, {
    onProgress: (fraction, stage) => reply({ type: 'progress', id, fraction, stage }),
  });
  const units = (height: { pixels: number } | null) => (height ? height.pixels * fitted.unitsPerPixel : null);
  return {
    letters: fitted.letters.map((letter) => ({
      index: letter.index,
      character: letter.character ?? '',
      box: letter.box,
      frame: letter.frame,
      outline: letter.outline,
      warnings: letter.report?.warnings ?? [],
      maxDeviation: letter.report?.maxDeviation ?? null,
      problem: letter.problem,
    })),
    metrics: {
      capHeight: (fitted.metrics.capHeight?.pixels ?? fitted.metrics.letterHeightPixels) * fitted.unitsPerPixel,
      xHeight: units(fitted.metrics.xHeight),
      ascender: units(fitted.metrics.ascender),
      descender: units(fitted.metrics.descender),
    },
    unitsPerPixel: fitted.unitsPerPixel,
    tolerance: fitted.tolerance,
    notes: fitted.notes,
  };
}

onmessage = (event: MessageEvent<TraceRequest>) => {
  const request = event.data;
  try {
    if (request.type === 'trace') {
      const result = traceScan({ raster: request.raster }, {
        ...request.settings,
        onProgress: (fraction, stage) => reply({ type: 'progress', id: request.id, fraction, stage }),
      });
      lastScan = result;
      lastResult = {
        width: request.raster.width,
        height: request.raster.height,
        dpi: result.resolution.dpiX,
        dpiAssumed: result.resolution.assumed,
        level: result.level,
        contours: result.contours,
        sheet: result.sheet,
        notes: result.notes,
      };
      reply({ type: 'traced', id: request.id, result: lastResult });
      return;
    }
    if (!lastResult || !lastScan) throw new Error('no sheet has been traced yet');
    if (request.type === 'fit') {
      reply({ type: 'fitted', id: request.id, result: fitAssigned(lastScan, request.id) });
      return;
    }
    const sheet = segmentSheet(lastScan.contours, { characters: request.characters });
    lastScan = { ...lastScan, sheet };
    lastResult = { ...lastResult, sheet };
    reply({ type: 'traced', id: request.id, result: lastResult });
  } catch (error) {
    reply({ type: 'failed', id: request.id, message: describe(error) });
  }
};
