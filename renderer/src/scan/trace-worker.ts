// The tracing worker: runs core's traceScan on a decoded scan and keeps the result,
// so that correcting the sheet (assigning characters, merging, splitting and cutting
// letters, setting guides) re-runs only the corrections, and fitting the assigned
// letters (core/pipeline planSheetFit, then fitLetterJob per letter) needs no second trace. Each correction's
// result is kept, so undoing one (the same list, shortened) costs nothing and a cut
// — which traces ink again — runs only when it is new. It keeps the scan's pixels,
// to trace them again when the user changes a scan setting and to show the ink a
// setting gives before the letters are found again.
import {
  applySheetEdit,
  applySheetEdits,
  RasterError,
  rebaseSheetEdits,
  scanInk,
  SheetEditError,
  traceScan,
  uncorrectedSheet,
  type CorrectedSheet,
  type GreyRaster,
  type InkSource,
  type SheetEdit,
  type TraceScanResult,
} from '../../../core/raster/index.ts';
import { assembleSheetFit, fitLetterJob, fitOptionsOf, planForLetters, planSheetFit, sameScanSettings, SettingsError, traceScanOptionsOf, validateFitSettings, validateScanSettings, type ScanSettings, type SheetFitPlan } from '../../../core/pipeline/index.ts';
import { measureSheetMetrics, withGuideHeights } from '../../../core/metrics/index.ts';
import type { FitSettings } from '../../../core/pipeline/index.ts';
import { fittedMetrics } from './fitted-metrics.ts';
import { inkDigest } from './ink-digest.ts';
import type { FittedSheet, InkPreview, RetracedSheet, TraceReply, TraceRequest, TracedSheet } from './trace-protocol.ts';

/**
 * The ink preview is drawn at most this many pixels on its longer side: finer than the
 * sheet is shown on a screen, and a 600-dpi page's preview stays a few hundred
 * kilobytes, so it follows a slider.
 */
const PREVIEW_MAX_SIDE_PX = 2000;
/** The preview's ink colour: the theme's accent (theme.css --accent, #b8432b). */
const PREVIEW_INK_RGB = [0xb8, 0x43, 0x2b] as const;
const OPAQUE = 255;

let lastRaster: GreyRaster | null = null;
let lastScan: TraceScanResult | null = null;
/** The settings `lastScan` was traced with. */
let lastSettings: ScanSettings | null = null;
let frame: Pick<TracedSheet, 'width' | 'height' | 'dpi' | 'dpiAssumed' | 'level'> | null = null;
/** The edits last applied, and the sheet before the first and after each of them (one longer than `edits`). */
let applied: { edits: SheetEdit[]; states: CorrectedSheet[] } = { edits: [], states: [] };

function reply(message: TraceReply): void {
  postMessage(message);
}

function describe(error: unknown): string {
  if (error instanceof RasterError || error instanceof SheetEditError || error instanceof SettingsError) return error.message;
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

/**
 * The fit plan of the corrected sheet's assigned letters with these settings, kept
 * while the sheet and the settings stay the same: the page asks for a few letters at a
 * time, and each request fits its letters from the one plan (the whole sheet's scale
 * and tolerance).
 */
let lastPlan: { state: CorrectedSheet; settings: string; plan: SheetFitPlan; assigned: TraceScanResult['sheet'] } | null = null;

function planAssigned(scan: TraceScanResult, state: CorrectedSheet, settings: FitSettings): { plan: SheetFitPlan; assigned: TraceScanResult['sheet'] } {
  const key = JSON.stringify(settings);
  if (lastPlan && lastPlan.state === state && lastPlan.settings === key) return lastPlan;
  const assigned = { ...state.sheet, letters: state.sheet.letters.filter((l) => l.character !== null) };
  if (assigned.letters.length === 0) throw new Error('No letter has a character yet: type the characters on the sheet and assign them first.');
  const plan = planSheetFit({ ...scan, contours: state.contours as TraceScanResult['contours'], sheet: assigned }, { guides: state.guides, fit: fitOptionsOf(validateFitSettings(settings)) });
  lastPlan = { state, settings: key, plan, assigned };
  return lastPlan;
}

/**
 * Fits assigned letters of the corrected sheet, with its guides: those in `only`
 * (reading-order indices), or all of them; unassigned letters are left out. Each
 * letter is one core fitLetterJob, as the command line's batch build fits them.
 */
function fitAssigned(scan: TraceScanResult, state: CorrectedSheet, id: number, settings: FitSettings, only: readonly number[] | undefined): FittedSheet {
  const { plan: whole, assigned } = planAssigned(scan, state, settings);
  const plan = only === undefined ? whole : planForLetters(whole, only);
  const outcomes = plan.jobs.map((job, i) => {
    reply({ type: 'progress', id, fraction: i / Math.max(1, plan.jobs.length), stage: 'fitting' });
    return fitLetterJob(job);
  });
  reply({ type: 'progress', id, fraction: 1, stage: 'done' });
  const fitted = assembleSheetFit(plan, outcomes);
  const contoursOf = new Map(assigned.letters.map((l) => [l.index, l.contours]));
  return {
    letters: fitted.letters.map((letter) => ({
      index: letter.index,
      character: letter.character ?? '',
      contours: contoursOf.get(letter.index) ?? [],
      ink: inkDigest(state.contours, contoursOf.get(letter.index) ?? []),
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

/** Traces `raster` with `settings` and makes it the sheet the worker corrects and fits. */
function traceAndKeep(raster: GreyRaster, settings: ScanSettings, id: number): CorrectedSheet {
  const scan = traceScan({ raster }, {
    // A 1-bit scan is fitted on smoothed boundaries, not on its pixel staircase (core/raster/bilevel-smoothing.ts).
    smoothBilevel: true,
    ...traceScanOptionsOf(validateScanSettings(settings)),
    onProgress: (fraction, stage) => reply({ type: 'progress', id, fraction, stage }),
  });
  lastRaster = raster;
  lastScan = scan;
  lastSettings = settings;
  frame = { width: raster.width, height: raster.height, dpi: scan.resolution.dpiX, dpiAssumed: scan.resolution.assumed, level: scan.level };
  applied = { edits: [], states: [uncorrectedSheet(scan.contours, scan.sheet)] };
  return current();
}

/**
 * The sheet `from` describes: the kept scan traced with its settings (the sheet kept
 * now when they are the ones it was traced with) and its corrections applied.
 */
function correctedFrom(from: { settings: ScanSettings; edits: readonly SheetEdit[] }): { traced: CorrectedSheet; corrected: CorrectedSheet } {
  if (!lastRaster || !lastScan) throw new Error('no sheet has been traced yet');
  if (lastSettings !== null && sameScanSettings(from.settings, lastSettings)) {
    const traced = applied.states[0]!;
    const unchanged = JSON.stringify(from.edits) === JSON.stringify(applied.edits);
    return { traced, corrected: unchanged ? current() : applySheetEdits(traced, from.edits, sourceOf(lastScan)) };
  }
  const scan = traceScan({ raster: lastRaster }, { smoothBilevel: true, ...traceScanOptionsOf(validateScanSettings(from.settings)) });
  const traced = uncorrectedSheet(scan.contours, scan.sheet);
  return { traced, corrected: applySheetEdits(traced, from.edits, sourceOf(scan)) };
}

/** The kept scan traced with other settings and the corrections carried over; the previous sheet is kept when this fails. */
function retrace(settings: ScanSettings, edits: readonly SheetEdit[], from: { settings: ScanSettings; edits: readonly SheetEdit[] } | null, id: number): RetracedSheet {
  if (!lastRaster || !lastScan) throw new Error('no sheet has been traced yet');
  const previous = { raster: lastRaster, scan: lastScan, settings: lastSettings, frame, applied };
  const base = from === null ? null : correctedFrom(from);
  try {
    const fresh = traceAndKeep(previous.raster, settings, id);
    const carried = base && from ? rebaseSheetEdits(base.traced.sheet, base.corrected, from.edits, fresh.sheet) : { edits: [...edits], kept: 'all' as const, lostCharacters: 0, droppedCorrections: 0 };
    return { ...carried, sheet: result(correct(carried.edits, id)) };
  } catch (error) {
    lastRaster = previous.raster;
    lastScan = previous.scan;
    lastSettings = previous.settings;
    frame = previous.frame;
    applied = previous.applied;
    throw error;
  }
}

/** The cleaned ink `settings` give on the kept scan, drawn in the accent colour on transparent paper, scaled down to fit PREVIEW_MAX_SIDE_PX. */
async function preview(settings: ScanSettings): Promise<InkPreview> {
  if (!lastRaster) throw new Error('no sheet has been traced yet');
  const raster = lastRaster;
  const ink = scanInk({ raster }, traceScanOptionsOf(validateScanSettings(settings)));
  const inkShare = ink.inkPixels / (raster.width * raster.height);
  if (typeof OffscreenCanvas === 'undefined') return { image: null, level: ink.level, inkShare };
  const step = Math.max(1, Math.ceil(Math.max(raster.width, raster.height) / PREVIEW_MAX_SIDE_PX));
  const width = Math.ceil(raster.width / step);
  const height = Math.ceil(raster.height / step);
  const rgba = new Uint8ClampedArray(width * height * 4);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      // Each preview pixel is as opaque as the share of ink in the block of scan pixels it stands for.
      let inkCount = 0;
      let count = 0;
      for (let sy = y * step; sy < Math.min(raster.height, (y + 1) * step); sy++) {
        for (let sx = x * step; sx < Math.min(raster.width, (x + 1) * step); sx++) {
          inkCount += ink.mask.data[sy * raster.width + sx]!;
          count++;
        }
      }
      const o = (y * width + x) * 4;
      rgba[o] = PREVIEW_INK_RGB[0];
      rgba[o + 1] = PREVIEW_INK_RGB[1];
      rgba[o + 2] = PREVIEW_INK_RGB[2];
      rgba[o + 3] = Math.round((OPAQUE * inkCount) / count);
    }
  }
  const canvas = new OffscreenCanvas(width, height);
  const context = canvas.getContext('2d');
  if (!context) return { image: null, level: ink.level, inkShare };
  context.putImageData(new ImageData(rgba, width, height), 0, 0);
  return { image: await canvas.convertToBlob({ type: 'image/png' }), level: ink.level, inkShare };
}

onmessage = async (event: MessageEvent<TraceRequest>) => {
  const request = event.data;
  try {
    if (request.type === 'trace') {
      const raster = request.raster;
      reply({ type: 'traced', id: request.id, result: result(traceAndKeep(raster, request.settings, request.id)) });
      return;
    }
    if (!lastScan) throw new Error('no sheet has been traced yet');
    if (request.type === 'retrace') {
      reply({ type: 'retraced', id: request.id, result: retrace(request.settings, request.edits, request.from, request.id) });
      return;
    }
    if (request.type === 'preview') {
      reply({ type: 'previewed', id: request.id, result: await preview(request.settings) });
      return;
    }
    if (request.type === 'fit') {
      reply({ type: 'fitted', id: request.id, result: fitAssigned(lastScan, current(), request.id, request.settings, request.letters) });
      return;
    }
    reply({ type: 'traced', id: request.id, result: result(correct(request.edits, request.id)) });
  } catch (error) {
    reply({ type: 'failed', id: request.id, message: describe(error) });
  }
};
