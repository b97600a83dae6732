// The raster stage as one call: from a decoded scan to nested sub-pixel contours
// grouped into letters. It fixes the order of the steps (binarize → cleanup →
// boundaries → nesting → segmentation), carries the resolution from the scan to the
// millimetre-based settings, and turns "nothing was found" into an error a person can
// act on.

import { binarize, type BinarizeMethod, type BinarizeOptions } from './binarize.ts';
import { cleanupMask } from './cleanup.ts';
import { estimateEdgeBlur } from './edge-blur.ts';
import { uniformIsoLevel, type IsoLevelField } from './iso-level-field.ts';
import { marchingSquaresChains } from './marching-squares.ts';
import { SMOOTHED_BILEVEL_NOISE_PX, smoothedBilevelBlurPx, smoothedMaskField } from './bilevel-smoothing.ts';
import { nestContours } from './nesting.ts';
import { assumedResolutionNote, millimetresToPixels, resolveResolution, type Resolution } from './physical-units.ts';
import { RasterError } from './raster-error.ts';
import { assertGreyRaster } from './raster-validation.ts';
import { segmentSheet, type SheetSegmentation } from './segment-sheet.ts';
import type { PaperAndInkLevels } from './threshold-otsu.ts';
import { DEFAULT_ISO_LEVEL, traceBoundaries, type BoundaryMethod } from './trace-boundaries.ts';
import type { Contour, GreyRaster, InkMask, ScanImage } from './types.ts';

/** Steps reported to onProgress, in order. */
export type TraceStage = 'binarize' | 'cleanup' | 'boundaries' | 'nesting' | 'segmentation' | 'done';

export interface TraceScanOptions {
  /** Thresholding method. Default 'otsu'. */
  readonly method?: BinarizeMethod;
  /** For method 'manual': ink is every grey level ≤ level (0–255). */
  readonly level?: number;
  /** For method 'sauvola': window side in mm on the paper. Default {@link DEFAULT_SAUVOLA_WINDOW_MM}. */
  readonly sauvolaWindowMm?: number;
  /** For method 'sauvola': Sauvola's k (0.2–0.5). Default 0.34. */
  readonly sauvolaK?: number;
  /** Light ink on dark paper. Default false. */
  readonly invert?: boolean;
  /** Cleanup limits in mm² (see cleanupMask); defaults 0.02 mm². */
  readonly speckAreaMm2?: number;
  readonly pinholeAreaMm2?: number;
  /** Boundary geometry; default 'auto' (pixel edges for bilevel scans). */
  readonly boundary?: BoundaryMethod;
  /**
   * For a bilevel (1-bit) scan traced with 'auto': place the boundaries on the mask
   * blurred by BILEVEL_SMOOTHING_SIGMA_PX instead of on the pixel staircase
   * (bilevel-smoothing.ts), as fitting needs; the result then says 'marching-squares'
   * and gives that blur as `edgeBlurPx`. Default false: the exact pixel edges.
   */
  readonly smoothBilevel?: boolean;
  /** Characters drawn on the sheet, in reading order, to assign to the letters. */
  readonly characters?: string;
  /** Called at the start of each step with the fraction of the work done (0–1). */
  readonly onProgress?: (fraction: number, stage: TraceStage) => void;
}

export interface TraceScanResult {
  readonly method: BinarizeMethod;
  /** Global threshold (ink ≤ level), or null for Sauvola. */
  readonly level: number | null;
  /** Page-wide iso-level of the sub-pixel boundaries. */
  readonly isoLevel: number;
  readonly isoField: IsoLevelField;
  readonly levels: PaperAndInkLevels;
  readonly resolution: Resolution;
  readonly boundary: 'marching-squares' | 'pixel-edges';
  /**
   * The scan's edge blur σ in px (edge-blur.ts), or null for bilevel scans and pages
   * with too few clean edges. The fitter takes it as `scanBlurPx`.
   */
  readonly edgeBlurPx: number | null;
  /**
   * The noise σ across the boundaries in px when the tracer knows it better than the
   * boundaries' own scatter shows (the smoothed 1-bit staircase, bilevel-smoothing.ts),
   * else null and the fitter measures it. The fitter takes it as `scanNoisePx`.
   */
  readonly edgeNoisePx: number | null;
  /** The greys the boundaries were placed on (inverted when `invert` was set): re-tracing a cut letter uses them. */
  readonly grey: GreyRaster;
  /** The cleaned ink mask the contours follow. */
  readonly mask: InkMask;
  readonly contours: Contour[];
  readonly sheet: SheetSegmentation;
  readonly notes: string[];
}

/**
 * Default Sauvola window: 8 mm on the paper. Chosen: the window must be wider than the
 * heaviest stroke (lettering strokes reach 2–3 mm) so that no window sits entirely in
 * ink, and narrow compared with the scale over which lighting varies (centimetres).
 */
export const DEFAULT_SAUVOLA_WINDOW_MM = 8;
/** Share of the page above which ink is suspicious: paper, not ink, normally dominates a sheet. */
const MOSTLY_INK_FRACTION = 0.5;
/** Progress fraction at the start of each step, roughly proportional to its cost. */
const PROGRESS_AT: Readonly<Record<TraceStage, number>> = {
  binarize: 0,
  cleanup: 0.3,
  boundaries: 0.5,
  nesting: 0.8,
  segmentation: 0.9,
  done: 1,
};

/**
 * Traces a scan: binarize → cleanup → boundaries → nesting → segmentation.
 *
 * Throws RasterError 'bad-raster' / 'bad-option' for invalid input, and 'empty-page'
 * when no ink is found or none survives cleanup. Never modifies the scan.
 */
export function traceScan(scan: ScanImage, options: TraceScanOptions = {}): TraceScanResult {
  const { raster } = scan;
  assertGreyRaster(raster);
  const report = (stage: TraceStage): void => options.onProgress?.(PROGRESS_AT[stage], stage);
  const resolution = resolveResolution({ dpiX: scan.dpiX, dpiY: scan.dpiY, dpi: raster.dpi });
  const notes: string[] = [];

  report('binarize');
  const binarized = binarize(raster, binarizeOptions(options, resolution));
  const pixels = raster.width * raster.height;
  if (binarized.inkPixels === 0) {
    throw new RasterError(
      'empty-page',
      `No ink found on the page: every pixel is lighter than the threshold${binarized.level === null ? '' : ` (grey level ${binarized.level})`}. Check the threshold (a manual level closer to the paper's grey keeps faint strokes) and the invert setting (light ink on dark paper needs invert).`,
    );
  }
  if (binarized.inkPixels > MOSTLY_INK_FRACTION * pixels) {
    notes.push(`More than half of the page (${Math.round((100 * binarized.inkPixels) / pixels)} %) was taken as ink. If the artwork is light on a dark ground, turn on invert.`);
  }

  report('cleanup');
  const cleaned = cleanupMask(binarized.mask, {
    dpiX: resolution.dpiX,
    dpiY: resolution.dpiY,
    speckAreaMm2: options.speckAreaMm2,
    pinholeAreaMm2: options.pinholeAreaMm2,
  });
  // cleanupMask was given the resolved dpi, so the assumption is reported here, once.
  if (resolution.assumed) notes.push(assumedResolutionNote());
  notes.push(...cleaned.notes);
  if (cleaned.inkPixels === 0) {
    throw new RasterError(
      'empty-page',
      `No ink found on the page: all ${binarized.inkPixels} ink pixels were specks smaller than ${cleaned.speckAreaPx.toFixed(1)} px. Check the threshold and invert settings, or lower the speck size (now ${options.speckAreaMm2 ?? 'the default'} mm²) or state the scan's real resolution.`,
    );
  }

  report('boundaries');
  const exact = traceBoundaries(binarized.grey, cleaned.mask, { method: options.boundary ?? 'auto', isoField: binarized.isoField });
  const smoothed = options.smoothBilevel === true && (options.boundary ?? 'auto') === 'auto' && exact.method === 'pixel-edges';
  const traced = smoothed ? { method: 'marching-squares' as const, chains: marchingSquaresChains(smoothedMaskField(cleaned.mask), cleaned.mask, uniformIsoLevel(DEFAULT_ISO_LEVEL)) } : exact;

  report('nesting');
  const contours = nestContours(traced.chains);

  const edgeBlurPx = smoothed ? smoothedBilevelBlurPx() : estimateEdgeBlur(binarized.grey, contours, binarized.levels, traced.method === 'pixel-edges');

  report('segmentation');
  const sheet = segmentSheet(contours, options.characters === undefined ? {} : { characters: options.characters });
  notes.push(...sheet.notes);

  report('done');
  return {
    method: binarized.method,
    level: binarized.level,
    isoLevel: binarized.isoLevel,
    isoField: binarized.isoField,
    levels: binarized.levels,
    resolution,
    boundary: traced.method,
    edgeBlurPx,
    edgeNoisePx: smoothed ? SMOOTHED_BILEVEL_NOISE_PX : null,
    grey: binarized.grey,
    mask: cleaned.mask,
    contours,
    sheet,
    notes,
  };
}

/** The ink of a scan as traceScan separates and cleans it, before any boundary is traced. */
export interface ScanInk {
  /** The cleaned ink mask (1 ink, 0 paper). */
  readonly mask: InkMask;
  /** Global threshold (ink ≤ level), or null for Sauvola. */
  readonly level: number | null;
  readonly inkPixels: number;
}

/**
 * The first two steps of traceScan alone — binarize and clean up — so that the ink a
 * setting gives can be shown while the setting is being chosen, at a fraction of a
 * whole trace's cost. Throws as traceScan does for bad options; an empty page is not
 * an error here (it shows as no ink).
 */
export function scanInk(scan: ScanImage, options: TraceScanOptions = {}): ScanInk {
  const { raster } = scan;
  assertGreyRaster(raster);
  const resolution = resolveResolution({ dpiX: scan.dpiX, dpiY: scan.dpiY, dpi: raster.dpi });
  const binarized = binarize(raster, binarizeOptions(options, resolution));
  const cleaned = cleanupMask(binarized.mask, { dpiX: resolution.dpiX, dpiY: resolution.dpiY, speckAreaMm2: options.speckAreaMm2, pinholeAreaMm2: options.pinholeAreaMm2 });
  return { mask: cleaned.mask, level: binarized.level, inkPixels: cleaned.inkPixels };
}

function binarizeOptions(options: TraceScanOptions, resolution: Resolution): BinarizeOptions {
  const invert = options.invert ?? false;
  switch (options.method ?? 'otsu') {
    case 'otsu':
      return { method: 'otsu', invert };
    case 'manual':
      if (options.level === undefined) {
        throw new RasterError('bad-option', 'The manual threshold needs a level: set level to a grey value between 0 and 255 (ink is every pixel at or below it).');
      }
      return { method: 'manual', level: options.level, invert };
    case 'sauvola': {
      const windowMm = options.sauvolaWindowMm ?? DEFAULT_SAUVOLA_WINDOW_MM;
      if (!Number.isFinite(windowMm) || windowMm <= 0) {
        throw new RasterError('bad-option', `The Sauvola window is ${String(windowMm)} mm; it must be a positive size, a few stroke widths (about 8 mm for most lettering).`);
      }
      const windowSize = 2 * Math.floor(millimetresToPixels(windowMm, resolution) / 2) + 1;
      return options.sauvolaK === undefined ? { method: 'sauvola', windowSize, invert } : { method: 'sauvola', windowSize, k: options.sauvolaK, invert };
    }
  }
}
