// The tracing worker: runs core's traceScan on a decoded scan and keeps the
// contours, so that reassigning characters re-runs only the cheap segmentation.
import { RasterError, segmentSheet, traceScan, type Contour } from '../../../core/raster/index.ts';
import type { TraceReply, TraceRequest, TracedSheet } from './trace-protocol.ts';

let lastContours: Contour[] = [];
let lastResult: TracedSheet | null = null;

function reply(message: TraceReply): void {
  postMessage(message);
}

function describe(error: unknown): string {
  if (error instanceof RasterError) return error.message;
  return `Tracing failed unexpectedly (${error instanceof Error ? error.message : String(error)}). Please report this with the scan.`;
}

onmessage = (event: MessageEvent<TraceRequest>) => {
  const request = event.data;
  try {
    if (request.type === 'trace') {
      const result = traceScan({ raster: request.raster }, {
        ...request.settings,
        onProgress: (fraction, stage) => reply({ type: 'progress', id: request.id, fraction, stage }),
      });
      lastContours = result.contours;
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
    if (!lastResult) throw new Error('no sheet has been traced yet');
    const sheet = segmentSheet(lastContours, { characters: request.characters });
    lastResult = { ...lastResult, sheet };
    reply({ type: 'traced', id: request.id, result: lastResult });
  } catch (error) {
    reply({ type: 'failed', id: request.id, message: describe(error) });
  }
};
