// The tracing worker: runs core's traceScan on a decoded scan and keeps the result,
// so that correcting the sheet (assigning characters, merging, splitting and cutting
// letters, setting guides) re-runs only the corrections, and fitting the assigned
// letters (core/pipeline fitTracedSheet) needs no second trace. Each correction's
// result is kept, so undoing one (the same list, shortened) costs nothing and a cut
// — which traces ink again — runs only when it is new.
import {
  applySheetEdit,
  RasterError,
  SheetEditError,
  traceScan,
  uncorrectedSheet,
  type CorrectedSheet,
  type InkSource,
  type SheetEdit,
  type TraceScanResult,
} from '../../../core/raster/index.ts';
import { fitTracedSheet } from '../../../core/pipeline/index.ts';
import { measureSheetMetrics, withGuideHeights } from '../../../core/metrics/index.ts';
import { fittedMetrics } from './fitted-metrics.ts';
import type { FittedSheet, TraceReply, TraceRequest, TracedSheet } from './trace-protocol.ts';

let lastScan: TraceScanResult | null = null;
let frame: Pick<TracedSheet, 'width' | 'height' | 'dpi' | 'dpiAssumed' | 'level'> | null = null;
/** The edits last applied, and the sheet before the first and after each of them (one longer than `edits`). */
let applied: { edits: SheetEdit[]; states: CorrectedSheet[] } = { edits: [], states: [] };

function reply(message: TraceReply): void {
  postMessage(message);
}

function describe(error: unknown): string {
  if (error instanceof RasterError || error instanceof SheetEditError) return error.message;
  return `Tracing failed unexpectedly (${error instanceof Error ? error.message : String(error)}). Please report this with the scan.`;
}

function current(): CorrectedSheet {
  const state = applied.states[applied.states.length - 1];
  if (!state || !lastScan) throw new Error('no sheet has been traced yet');
  return state;
}

function sourceOf(scan: TraceScanResult): InkSource {
  return { grey: scan.grey, mask: scan.mask, isoField: scan.isoField, boundary: scan.boundary };
}

/** The sheet as the page shows it: the corrected letters, and the heights the fit would use now. */
function result(state: CorrectedSheet): TracedSheet {
  const metrics = withGuideHeights(measureSheetMetrics(state.sheet, state.contours), state.guides);
  const from = (set: number | null, measured: boolean) => (set !== null ? 'set' : measured ? 'measured' : 'typical') as 'set' | 'measured' | 'typical';
  const capHeight = {
    pixels: metrics.capHeight?.pixels ?? metrics.letterHeightPixels,
    from: from(state.guides.capHeightPixels, metrics.capHeight !== null),
    letters: metrics.capHeight?.letters ?? '',
  };
  const xHeight = metrics.xHeight ? { pixels: metrics.xHeight.pixels, from: from(state.guides.xHeightPixels, true), letters: metrics.xHeight.letters } : null;
  return { ...frame!, contours: state.contours as TracedSheet['contours'], sheet: state.sheet, guides: state.guides, heights: { capHeight, xHeight }, notes: [...lastScan!.notes.filter((n) => !n.startsWith('The text has ')), ...state.sheet.notes.filter((n) => n.startsWith('The text has '))] };
}

/** Applies `edits`, reusing the states of the longest prefix already applied. On failure the applied prefix is kept. */
function correct(edits: readonly SheetEdit[], id: number): CorrectedSheet {
  const same = (a: SheetEdit, b: SheetEdit) => JSON.stringify(a) === JSON.stringify(b);
  let prefix = 0;
  while (prefix < edits.length && prefix < applied.edits.length && same(edits[prefix]!, applied.edits[prefix]!)) prefix++;
  applied = { edits: applied.edits.slice(0, prefix), states: applied.states.slice(0, prefix + 1) };
  const source = sourceOf(lastScan!);
  for (let i = prefix; i < edits.length; i++) {
    reply({ type: 'progress', id, fraction: (i - prefix) / (edits.length - prefix), stage: 'correcting' });
    const next = applySheetEdit(current(), edits[i]!, source);
    applied = { edits: [...applied.edits, edits[i]!], states: [...applied.states, next] };
  }
  return current();
}

/** Fits the assigned letters of the corrected sheet, with its guides; unassigned letters are left out. */
function fitAssigned(scan: TraceScanResult, state: CorrectedSheet, id: number): FittedSheet {
  const assigned = { ...state.sheet, letters: state.sheet.letters.filter((l) => l.character !== null) };
  if (assigned.letters.length === 0) throw new Error('No letter has a character yet: type the characters on the sheet and assign them first.');
  const fitted = fitTracedSheet({ ...scan, contours: state.contours as TraceScanResult['contours'], sheet: assigned }, {
    guides: state.guides,
    onProgress: (fraction, stage) => reply({ type: 'progress', id, fraction, stage }),
  });
  const contoursOf = new Map(assigned.letters.map((l) => [l.index, l.contours]));
  return {
    letters: fitted.letters.map((letter) => ({
      index: letter.index,
      character: letter.character ?? '',
      contours: contoursOf.get(letter.index) ?? [],
      box: letter.box,
      frame: letter.frame,
      outline: letter.outline,
      warnings: letter.report?.warnings ?? [],
      maxDeviation: letter.report?.maxDeviation ?? null,
      problem: letter.problem,
    })),
    metrics: fittedMetrics(fitted),
    unitsPerPixel: fitted.unitsPerPixel,
    tolerance: fitted.tolerance,
    notes: fitted.notes,
  };
}

onmessage = (event: MessageEvent<TraceRequest>) => {
  const request = event.data;
  try {
    if (request.type === 'trace') {
      const scan = traceScan({ raster: request.raster }, {
        // A 1-bit scan is fitted on smoothed boundaries, not on its pixel staircase (core/raster/bilevel-smoothing.ts).
        smoothBilevel: true,
        ...request.settings,
        onProgress: (fraction, stage) => reply({ type: 'progress', id: request.id, fraction, stage }),
      });
      lastScan = scan;
      frame = { width: request.raster.width, height: request.raster.height, dpi: scan.resolution.dpiX, dpiAssumed: scan.resolution.assumed, level: scan.level };
      applied = { edits: [], states: [uncorrectedSheet(scan.contours, scan.sheet)] };
      reply({ type: 'traced', id: request.id, result: result(current()) });
      return;
    }
    if (!lastScan) throw new Error('no sheet has been traced yet');
    if (request.type === 'fit') {
      reply({ type: 'fitted', id: request.id, result: fitAssigned(lastScan, current(), request.id) });
      return;
    }
    reply({ type: 'traced', id: request.id, result: result(correct(request.edits, request.id)) });
  } catch (error) {
    reply({ type: 'failed', id: request.id, message: describe(error) });
  }
};
