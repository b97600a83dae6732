// Removal of scanning debris from an ink mask: ink specks (dust, paper grain, toner)
// too small to be a deliberate mark are erased, and pinholes (tiny unfilled spots
// inside solid ink, where the pen skipped or the paper fibre shows) are filled. Both
// would otherwise become contours that the artist has to delete by hand.

import { labelInkComponents, labelPaperComponents } from './components.ts';
import { assumedResolutionNote, resolveResolution, squareMillimetresToPixels, type Resolution } from './physical-units.ts';
import { assertInkMask } from './raster-validation.ts';
import { RasterError } from './raster-error.ts';
import type { InkMask } from './types.ts';

/**
 * Default largest speck erased and largest pinhole filled, in mm² on the paper. Chosen,
 * not published: well above scanner dust and paper grain (a few hundredths of a mm
 * across) and well below the smallest deliberate mark a letterer makes (the dot of a
 * 0.3 mm fine-liner covers about 0.07 mm²). At 300 dpi it is ≈ 2.8 px, at 600 dpi ≈ 11 px.
 */
export const DEFAULT_SPECK_AREA_MM2 = 0.02;
/** Default largest pinhole filled, in mm²; see {@link DEFAULT_SPECK_AREA_MM2}. */
export const DEFAULT_PINHOLE_AREA_MM2 = 0.02;

export interface CleanupOptions {
  /** Declared resolution; when missing, 300 dpi is assumed and the result says so. */
  readonly dpiX?: number;
  readonly dpiY?: number;
  readonly dpi?: number;
  /** Ink components with an area below this (mm²) are erased. 0 keeps everything. */
  readonly speckAreaMm2?: number;
  /** Enclosed paper components with an area below this (mm²) are filled. 0 fills none. */
  readonly pinholeAreaMm2?: number;
}

export interface CleanupResult {
  /** The cleaned mask (a new array; the input is untouched). */
  readonly mask: InkMask;
  readonly resolution: Resolution;
  /** The area limits actually applied, in pixels. */
  readonly speckAreaPx: number;
  readonly pinholeAreaPx: number;
  readonly specksRemoved: number;
  readonly pinholesFilled: number;
  readonly inkPixels: number;
  /** Human-readable remarks (assumed resolution, what was changed). */
  readonly notes: string[];
}

function assertArea(name: string, value: number): void {
  if (!Number.isFinite(value) || value < 0) {
    throw new RasterError('bad-option', `The option ${name} is ${String(value)}; it must be an area in mm² of 0 or more (0 turns this cleanup off).`);
  }
}

/**
 * Erases ink specks, then fills pinholes, and returns a new mask.
 *
 * Guarantees: an ink component (8-connected) is erased exactly when its pixel count is
 * below `speckAreaMm2` converted to pixels; then a paper component (4-connected) is
 * filled exactly when it touches no image border and its pixel count is below
 * `pinholeAreaMm2` in pixels. Pinholes are found after specks are gone, so a speck
 * inside a pinhole does not keep it open. No other pixel changes.
 */
export function cleanupMask(mask: InkMask, options: CleanupOptions = {}): CleanupResult {
  assertInkMask(mask);
  const speckAreaMm2 = options.speckAreaMm2 ?? DEFAULT_SPECK_AREA_MM2;
  const pinholeAreaMm2 = options.pinholeAreaMm2 ?? DEFAULT_PINHOLE_AREA_MM2;
  assertArea('speckAreaMm2', speckAreaMm2);
  assertArea('pinholeAreaMm2', pinholeAreaMm2);
  const resolution = resolveResolution(options);
  const speckAreaPx = squareMillimetresToPixels(speckAreaMm2, resolution);
  const pinholeAreaPx = squareMillimetresToPixels(pinholeAreaMm2, resolution);
  const { width } = mask;
  const cleaned = mask.data.slice();
  const notes: string[] = [];
  if (resolution.assumed) notes.push(assumedResolutionNote());

  let specksRemoved = 0;
  let removedPixels = 0;
  let inputInkPixels = -1; // known once ink has been labelled
  if (speckAreaPx > 0) {
    const ink = labelInkComponents(mask);
    inputInkPixels = 0;
    const erase = new Uint8Array(ink.count + 1);
    for (let id = 1; id <= ink.count; id++) {
      inputInkPixels += ink.area[id]!;
      if (ink.area[id]! < speckAreaPx) {
        erase[id] = 1;
        specksRemoved++;
        removedPixels += ink.area[id]!;
      }
    }
    if (specksRemoved > 0) {
      const { runs } = ink;
      for (let run = 0; run < runs.count; run++) {
        if (erase[runs.label[run]!] !== 0) {
          const offset = runs.row[run]! * width;
          cleaned.fill(0, offset + runs.start[run]!, offset + runs.end[run]!);
        }
      }
    }
  }

  let pinholesFilled = 0;
  let filledPixels = 0;
  const afterSpecks: InkMask = { width, height: mask.height, data: cleaned };
  if (pinholeAreaPx > 0) {
    const paper = labelPaperComponents(afterSpecks);
    const fill = new Uint8Array(paper.count + 1);
    for (let id = 1; id <= paper.count; id++) {
      if (paper.touchesBorder[id] === 0 && paper.area[id]! < pinholeAreaPx) {
        fill[id] = 1;
        pinholesFilled++;
        filledPixels += paper.area[id]!;
      }
    }
    if (pinholesFilled > 0) {
      const { runs } = paper;
      for (let run = 0; run < runs.count; run++) {
        if (fill[runs.label[run]!] !== 0) {
          const offset = runs.row[run]! * width;
          cleaned.fill(1, offset + runs.start[run]!, offset + runs.end[run]!);
        }
      }
    }
  }

  if (inputInkPixels < 0) {
    inputInkPixels = 0;
    for (let i = 0; i < mask.data.length; i++) inputInkPixels += mask.data[i]!;
  }
  const inkPixels = inputInkPixels - removedPixels + filledPixels;
  if (specksRemoved > 0) notes.push(`Removed ${specksRemoved} speck(s) smaller than ${speckAreaMm2} mm² (${formatPixels(speckAreaPx)} px), ${removedPixels} px of ink in all.`);
  if (pinholesFilled > 0) notes.push(`Filled ${pinholesFilled} pinhole(s) smaller than ${pinholeAreaMm2} mm² (${formatPixels(pinholeAreaPx)} px), ${filledPixels} px in all.`);
  return { mask: afterSpecks, resolution, speckAreaPx, pinholeAreaPx, specksRemoved, pinholesFilled, inkPixels, notes };
}

/** Pixel area rounded for display: one decimal is enough to recognise the setting. */
function formatPixels(pixels: number): string {
  return (Math.round(pixels * 10) / 10).toString();
}
