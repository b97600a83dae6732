// The iso-level at which sub-pixel boundaries are placed, as a function of position.
// A global threshold has one iso-level for the page. A locally adaptive threshold
// exists because paper and ink levels drift across the page (shading, a curled sheet,
// uneven lighting), so its iso-level must drift with them: halfway between the *local*
// paper and ink levels. That is estimated on a coarse grid of tiles and interpolated,
// which is smooth, costs a few kilobytes, and is only ever evaluated at boundary
// crossings.

import { GREY_LEVELS } from './histogram.ts';
import type { PaperAndInkLevels } from './threshold-otsu.ts';
import type { GreyRaster, InkMask } from './types.ts';

/** A position-dependent iso-level in grey levels (0–255 scale). */
export type IsoLevelField =
  | { readonly kind: 'uniform'; readonly level: number }
  | {
      readonly kind: 'tiled';
      /** Side of one square tile, in pixels. */
      readonly tileSize: number;
      readonly columns: number;
      readonly rows: number;
      /** Iso-level at each tile centre, row-major (`rows × columns`). */
      readonly levels: Float32Array;
    };

/** The same iso-level everywhere. */
export function uniformIsoLevel(level: number): IsoLevelField {
  return { kind: 'uniform', level };
}

/**
 * The iso-level at point (x, y) of the pixel frame: the uniform level, or the bilinear
 * interpolation of the tile-centre levels (held constant beyond the outermost centres).
 * Continuous in (x, y), so two crossings close together see nearly the same level.
 */
export function isoLevelAt(field: IsoLevelField, x: number, y: number): number {
  if (field.kind === 'uniform') return field.level;
  const { tileSize, columns, rows, levels } = field;
  const gx = clamp(x / tileSize - 0.5, 0, columns - 1);
  const gy = clamp(y / tileSize - 0.5, 0, rows - 1);
  const c0 = Math.floor(gx);
  const r0 = Math.floor(gy);
  const c1 = Math.min(c0 + 1, columns - 1);
  const r1 = Math.min(r0 + 1, rows - 1);
  const fx = gx - c0;
  const fy = gy - r0;
  const top = levels[r0 * columns + c0]! * (1 - fx) + levels[r0 * columns + c1]! * fx;
  const bottom = levels[r1 * columns + c0]! * (1 - fx) + levels[r1 * columns + c1]! * fx;
  return top * (1 - fy) + bottom * fy;
}

function clamp(value: number, low: number, high: number): number {
  return value < low ? low : value > high ? high : value;
}

/**
 * Tiles per window side: a window of side w is covered by a 3 × 3 block of tiles of
 * side ⌈w / 3⌉, so each tile-centre estimate uses about one window of pixels.
 */
const TILES_PER_WINDOW = 3;
/** Smallest tile side in pixels; below this the grid costs more than it resolves. */
const MIN_TILE_SIZE = 4;
/**
 * A class (ink or paper) must fill at least this fraction of a neighbourhood for its
 * local level to be trusted; otherwise its pixels are mostly the blurred rim of a
 * stroke and even their median sits between the true levels. 1/32 is about one stroke
 * crossing a window. Chosen, not published; the page-wide level of that class is used
 * instead.
 */
const MIN_LOCAL_CLASS_FRACTION = 1 / 32;

/**
 * Builds the local iso-level of a locally binarized page: at each tile, the midpoint of
 * the median grey of the mask's ink pixels and of its paper pixels within the 3 × 3
 * tiles around it (about `windowSize` pixels square). Where a class is too sparse
 * locally, `globalLevels` stands in for it. Reads `raster` and `mask` (same size);
 * allocates the tile grid and two 256-bin histograms per tile (2 KiB per tile).
 *
 * Medians rather than means: a window-sized neighbourhood holds far more blurred rim
 * pixels, relative to plateau pixels, than a whole page, and rim pixels drag a class
 * mean toward the other class; the median stays on the plateau while rim pixels are a
 * minority. (Measured on the blurred reference glyphs of test/raster: up to 0.15 px
 * less boundary error than with means.)
 */
export function localIsoLevelField(raster: GreyRaster, mask: InkMask, windowSize: number, globalLevels: PaperAndInkLevels): IsoLevelField {
  const { width, height, data: grey } = raster;
  const ink = mask.data;
  const tileSize = Math.max(MIN_TILE_SIZE, Math.ceil(windowSize / TILES_PER_WINDOW));
  const columns = Math.ceil(width / tileSize);
  const rows = Math.ceil(height / tileSize);
  const tileCount = columns * rows;
  // Per tile, a histogram of ink grey levels (bins 0–255) and of paper grey levels (256–511).
  const histograms = new Uint32Array(tileCount * CLASS_HISTOGRAM_BINS);
  for (let row = 0; row < height; row++) {
    const tileRowStart = Math.floor(row / tileSize) * columns;
    const rowStart = row * width;
    for (let col = 0; col < width; col++) {
      const tile = tileRowStart + Math.floor(col / tileSize);
      const offset = ink[rowStart + col] !== 0 ? 0 : GREY_LEVELS;
      histograms[tile * CLASS_HISTOGRAM_BINS + offset + grey[rowStart + col]!]!++;
    }
  }
  const levels = new Float32Array(tileCount);
  const neighbourhood = new Float64Array(CLASS_HISTOGRAM_BINS);
  for (let tileRow = 0; tileRow < rows; tileRow++) {
    for (let tileCol = 0; tileCol < columns; tileCol++) {
      neighbourhood.fill(0);
      for (let r = Math.max(0, tileRow - 1); r <= Math.min(rows - 1, tileRow + 1); r++) {
        for (let c = Math.max(0, tileCol - 1); c <= Math.min(columns - 1, tileCol + 1); c++) {
          const base = (r * columns + c) * CLASS_HISTOGRAM_BINS;
          for (let bin = 0; bin < CLASS_HISTOGRAM_BINS; bin++) neighbourhood[bin]! += histograms[base + bin]!;
        }
      }
      let nInk = 0;
      let nPaper = 0;
      for (let bin = 0; bin < GREY_LEVELS; bin++) {
        nInk += neighbourhood[bin]!;
        nPaper += neighbourhood[GREY_LEVELS + bin]!;
      }
      const minimum = (nInk + nPaper) * MIN_LOCAL_CLASS_FRACTION;
      const inkLevel = nInk >= minimum && nInk > 0 ? medianOfBins(neighbourhood, 0, nInk) : globalLevels.ink;
      const paperLevel = nPaper >= minimum && nPaper > 0 ? medianOfBins(neighbourhood, GREY_LEVELS, nPaper) : globalLevels.paper;
      levels[tileRow * columns + tileCol] = (inkLevel + paperLevel) / 2;
    }
  }
  return { kind: 'tiled', tileSize, columns, rows, levels };
}

/** Bins of one tile's two class histograms (ink, then paper). */
const CLASS_HISTOGRAM_BINS = 2 * GREY_LEVELS;

/** Median grey level of the class histogram stored at bins[offset … offset + 255]. */
function medianOfBins(bins: Float64Array, offset: number, count: number): number {
  let seen = 0;
  for (let level = 0; level < GREY_LEVELS; level++) {
    seen += bins[offset + level]!;
    if (seen >= count / 2) return level;
  }
  return GREY_LEVELS - 1;
}

/**
 * The mask of pixels whose grey value is at or below the field's iso-level at their
 * centre. With it, mask and sub-pixel boundary agree at every pixel, so the boundary
 * never has to be clamped to the mask. O(pixels), no allocation besides the mask and
 * one row of tile-interpolated levels.
 */
export function maskAtOrBelowIsoLevel(raster: GreyRaster, field: IsoLevelField): InkMask {
  const { width, height, data: grey } = raster;
  const ink = new Uint8Array(width * height);
  if (field.kind === 'uniform') {
    for (let i = 0; i < grey.length; i++) ink[i] = grey[i]! <= field.level ? 1 : 0;
    return { width, height, data: ink };
  }
  const { tileSize, columns, rows, levels } = field;
  const rowLevels = new Float64Array(columns);
  for (let row = 0; row < height; row++) {
    // Vertical interpolation of the tile rows, once per pixel row.
    const gy = clamp((row + 0.5) / tileSize - 0.5, 0, rows - 1);
    const r0 = Math.floor(gy);
    const r1 = Math.min(r0 + 1, rows - 1);
    const fy = gy - r0;
    for (let c = 0; c < columns; c++) rowLevels[c] = levels[r0 * columns + c]! * (1 - fy) + levels[r1 * columns + c]! * fy;
    const rowStart = row * width;
    for (let col = 0; col < width; col++) {
      const gx = clamp((col + 0.5) / tileSize - 0.5, 0, columns - 1);
      const c0 = Math.floor(gx);
      const c1 = Math.min(c0 + 1, columns - 1);
      const fx = gx - c0;
      const level = rowLevels[c0]! * (1 - fx) + rowLevels[c1]! * fx;
      ink[rowStart + col] = grey[rowStart + col]! <= level ? 1 : 0;
    }
  }
  return { width, height, data: ink };
}
