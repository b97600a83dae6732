/**
 * The pipeline from a scan to fitted letters, the one entry the app's worker, the CLI
 * and the tests call: scan → boundaries → letters (core/raster) → metrics and scale
 * (core/metrics) → one fitted outline per letter in font units (core/fit).
 *
 * Each letter gets its own frame: x from the left edge of its ink, y up from its row's
 * baseline, scaled by one sheet-wide factor (font units per pixel) so that the drawn
 * cap height becomes the chosen cap height.
 */
import type { Point } from '../geometry/vector.ts';
import { traceScan, type Box, type ScanImage, type TraceScanOptions, type TraceScanResult, type TraceStage } from '../raster/index.ts';
import { DEFAULT_CAP_HEIGHT_UNITS, measureSheetMetrics, unitsPerPixel as scaleFromMetrics, withGuideHeights, type GuideHeights, type SheetMetrics } from '../metrics/index.ts';
import { DEFAULT_TOLERANCE, fitGlyph, type FitOptions, type GlyphChain, type GlyphFitReport } from '../fit/index.ts';
import { contourArea, type GlyphOutline } from '../outline/index.ts';

/**
 * The tolerance never goes below this many scan pixels. Traced boundaries of clean
 * scans deviate from the drawn edge by about 0.6 px (median Hausdorff distance
 * measured in round trips on this project's machines); a tighter tolerance makes the
 * outline follow scan noise with extra points instead of following the drawing.
 */
export const MIN_TOLERANCE_PIXELS = 0.75;

/** Where a letter's font-unit frame sits on the scan. */
export interface LetterFrame {
  /** Pixel x of the frame's x = 0 (the left edge of the letter's ink). */
  readonly originX: number;
  /** Pixel y of the frame's y = 0 (the row's baseline). */
  readonly baselineY: number;
  /** Font units per scan pixel. */
  readonly unitsPerPixel: number;
}

export interface TracedLetter {
  readonly index: number;
  readonly character: string | null;
  readonly row: number;
  /** The letter's ink box on the scan (pixel frame). */
  readonly box: Box;
  readonly frame: LetterFrame;
  /** The fitted outline in font units (y up), or null when fitting failed (see `problem`). */
  readonly outline: GlyphOutline | null;
  readonly report: GlyphFitReport | null;
  readonly problem: string | null;
}

export interface TraceLettersOptions {
  readonly scan?: TraceScanOptions;
  readonly fit?: FitOptions;
  /** Font units per pixel; by default the measured cap height becomes `capHeightUnits`. */
  readonly unitsPerPixel?: number;
  /** Cap height in font units the drawn cap height maps to. Default 700. */
  readonly capHeightUnits?: number;
  /**
   * Cap height and x-height the user set on the sheet, in pixels, over the measured
   * ones: the scale and the reported metrics follow them. (Baselines the user set are
   * in the sheet's rows.)
   */
  readonly guides?: GuideHeights;
  /** Progress over the whole pipeline (0–1) with the current step. */
  readonly onProgress?: (fraction: number, stage: TraceStage | 'fitting') => void;
}

export interface TracedLetters {
  readonly scan: TraceScanResult;
  readonly metrics: SheetMetrics;
  readonly unitsPerPixel: number;
  /** The tolerance actually used, in font units. */
  readonly tolerance: number;
  readonly letters: readonly TracedLetter[];
  readonly notes: readonly string[];
}

/** Share of the progress bar given to the raster stage; fitting takes the rest. */
const RASTER_PROGRESS_SHARE = 0.5;

/** Maps a pixel-frame point into a letter's font-unit frame. */
export function toFontUnits(frame: LetterFrame, p: Point): Point {
  return { x: (p.x - frame.originX) * frame.unitsPerPixel, y: (frame.baselineY - p.y) * frame.unitsPerPixel };
}

/** Maps a font-unit point of a letter back onto the scan's pixel frame. */
export function toScanPixels(frame: LetterFrame, p: Point): Point {
  return { x: frame.originX + p.x / frame.unitsPerPixel, y: frame.baselineY - p.y / frame.unitsPerPixel };
}

/**
 * Traces and fits every letter of a scan. Throws what traceScan throws (a page with no
 * ink, bad options); a letter that cannot be fitted is kept with `problem` set.
 */
export function traceLetters(image: ScanImage, options: TraceLettersOptions = {}): TracedLetters {
  const report = options.onProgress;
  const scan = traceScan(image, {
    // A 1-bit scan is fitted on smoothed boundaries, not on its pixel staircase (bilevel-smoothing.ts).
    smoothBilevel: true,
    ...options.scan,
    onProgress: (fraction, stage) => report?.(fraction * RASTER_PROGRESS_SHARE, stage),
  });
  return fitTracedSheet(scan, {
    ...options,
    onProgress: (fraction, stage) => report?.(RASTER_PROGRESS_SHARE + (1 - RASTER_PROGRESS_SHARE) * fraction, stage),
  });
}

/** What fitting a sheet's letters reads from its trace: the contours and letters, the edge blur and the notes. */
export type FittableScan = Pick<TraceScanResult, 'sheet' | 'contours' | 'edgeBlurPx' | 'notes'> & Partial<Pick<TraceScanResult, 'edgeNoisePx'>>;

/** A sheet's fitted letters without the trace they came from (what the font is built from). */
export type FittedSheet = Omit<TracedLetters, 'scan'>;

/** One letter's fitting work: its chains in font units and the options, plain data a worker thread can take. */
export interface LetterFitJob {
  readonly chains: readonly GlyphChain[];
  readonly options: FitOptions;
}

/** What fitting one letter gave: its outline and report, or the reason it failed. */
export type LetterFitOutcome =
  | { readonly ok: true; readonly outline: GlyphOutline; readonly report: GlyphFitReport }
  | { readonly ok: false; readonly message: string };

/** Where a planned letter sits, before its outline is known. */
export type PlannedLetter = Pick<TracedLetter, 'index' | 'character' | 'row' | 'box' | 'frame'>;

/**
 * A sheet ready to fit: the scale, tolerance and notes settled, and one job per letter.
 * The jobs are independent, so they can be fitted in any order or on other threads;
 * assembleSheetFit puts the outcomes back in the letters' order.
 */
export interface SheetFitPlan {
  readonly metrics: SheetMetrics;
  readonly unitsPerPixel: number;
  readonly tolerance: number;
  readonly notes: readonly string[];
  readonly letters: readonly PlannedLetter[];
  readonly jobs: readonly LetterFitJob[];
}

/**
 * Settles how a traced sheet's letters are fitted: metrics (with the user's guides),
 * scale, tolerance and each letter's chains in its own font-unit frame.
 */
export function planSheetFit(scan: FittableScan, options: Omit<TraceLettersOptions, 'scan' | 'onProgress'> = {}): SheetFitPlan {
  const measured = measureSheetMetrics(scan.sheet, scan.contours);
  const metrics = options.guides ? withGuideHeights(measured, options.guides) : measured;
  const scale = options.unitsPerPixel ?? scaleFromMetrics(metrics, options.capHeightUnits ?? DEFAULT_CAP_HEIGHT_UNITS);
  if (!(scale > 0) || !Number.isFinite(scale)) throw new RangeError(`The scale must be a positive number of font units per pixel, not ${String(scale)}.`);
  const tolerance = Math.max(options.fit?.tolerance ?? DEFAULT_TOLERANCE, MIN_TOLERANCE_PIXELS * scale);
  // The scan's measured edge blur tells drawn roundings from scan rounding (core/fit/corners.ts).
  const scanBlurPx = options.fit?.scanBlurPx ?? scan.edgeBlurPx ?? undefined;
  const scanNoisePx = options.fit?.scanNoisePx ?? scan.edgeNoisePx ?? undefined;
  const fitOptions: FitOptions = { ...options.fit, tolerance, pixelSize: scale, ...(scanBlurPx === undefined ? {} : { scanBlurPx }), ...(scanNoisePx === undefined ? {} : { scanNoisePx }) };
  const letters: PlannedLetter[] = [];
  const jobs: LetterFitJob[] = [];
  for (const letter of scan.sheet.letters) {
    const baselineY = scan.sheet.rows[letter.row]?.baseline ?? letter.box.y + letter.box.height;
    const frame: LetterFrame = { originX: letter.box.x, baselineY, unitsPerPixel: scale };
    const chains: GlyphChain[] = letter.contours.flatMap((index) => {
      const contour = scan.contours[index];
      return contour ? [{ points: contour.points.map((p) => toFontUnits(frame, p)), depth: contour.depth }] : [];
    });
    letters.push({ index: letter.index, character: letter.character, row: letter.row, box: letter.box, frame });
    jobs.push({ chains, options: fitOptions });
  }
  return { metrics, unitsPerPixel: scale, tolerance, notes: [...scan.notes, ...metrics.notes], letters, jobs };
}

/**
 * The part of a plan that fits only the letters with these indices (reading order; an
 * index the sheet does not have is left out), so a caller can fit a sheet a few
 * letters at a time and stop between them. The metrics, scale and tolerance stay those
 * of the whole sheet, so each letter fits exactly as it does with the rest.
 */
export function planForLetters(plan: SheetFitPlan, indices: readonly number[]): SheetFitPlan {
  const only = new Set(indices);
  const kept = plan.letters.flatMap((letter, i) => (only.has(letter.index) ? [i] : []));
  return { ...plan, letters: kept.map((i) => plan.letters[i]!), jobs: kept.map((i) => plan.jobs[i]!) };
}

/** Fits one letter; a letter that cannot be fitted gives the reason instead of throwing. */
export function fitLetterJob(job: LetterFitJob): LetterFitOutcome {
  try {
    const fitted = fitGlyph(job.chains, job.options);
    // A stroke narrower than the tolerance can be fitted as its two sides on one line: a contour enclosing nothing, invisible in the font.
    const contours = fitted.outline.contours.filter((contour) => contourArea(contour) !== 0);
    if (contours.length === 0) {
      const tolerance = job.options.tolerance ?? DEFAULT_TOLERANCE;
      const pixels = job.options.pixelSize ? `, ${(tolerance / job.options.pixelSize).toFixed(2)} px` : '';
      return { ok: false, message: `its ink is too thin to fit: every stroke is narrower than the fitting tolerance (${tolerance.toFixed(1)} units${pixels}) and came out with no area. Scan at a higher resolution, or lower the tolerance.` };
    }
    const outline = contours.length === fitted.outline.contours.length ? fitted.outline : { ...fitted.outline, contours };
    return { ok: true, outline, report: fitted.report };
  } catch (error) {
    return { ok: false, message: error instanceof Error ? error.message : String(error) };
  }
}

/**
 * The fitted sheet from its plan and one outcome per job, in the jobs' order. A
 * letter that failed is kept with `problem` set, and the problem is added to the notes.
 */
export function assembleSheetFit(plan: Pick<SheetFitPlan, 'metrics' | 'unitsPerPixel' | 'tolerance' | 'notes' | 'letters'>, outcomes: readonly LetterFitOutcome[]): FittedSheet {
  if (outcomes.length !== plan.letters.length) throw new RangeError(`A sheet of ${plan.letters.length} letters needs as many fitting outcomes, not ${outcomes.length}.`);
  const notes = [...plan.notes];
  const letters = plan.letters.map((base, i): TracedLetter => {
    const outcome = outcomes[i] as LetterFitOutcome;
    if (outcome.ok) return { ...base, outline: outcome.outline, report: outcome.report, problem: null };
    const problem = `Letter ${base.index + 1}${base.character ? ` (${base.character})` : ''} could not be fitted: ${outcome.message}`;
    notes.push(problem);
    return { ...base, outline: null, report: null, problem };
  });
  return { metrics: plan.metrics, unitsPerPixel: plan.unitsPerPixel, tolerance: plan.tolerance, letters, notes };
}

/**
 * Fits the letters of an already traced sheet (its `sheet` may have been re-segmented,
 * e.g. to assign characters). Progress runs from 0 to 1 over the letters.
 */
export function fitTracedSheet(scan: TraceScanResult, options: Omit<TraceLettersOptions, 'scan'> = {}): TracedLetters {
  const report = options.onProgress;
  const plan = planSheetFit(scan, options);
  const outcomes = plan.jobs.map((job, i) => {
    report?.(i / Math.max(1, plan.jobs.length), 'fitting');
    return fitLetterJob(job);
  });
  report?.(1, 'done');
  return { scan, ...assembleSheetFit(plan, outcomes) };
}
