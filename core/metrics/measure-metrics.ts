/**
 * Vertical metrics measured from the letters found on a sheet: cap height, x-height,
 * ascender and descender, each as a distance in pixels from the letter's row
 * baseline, taken as the median over the letters that measure it well (see
 * measuring-letters.ts). From these comes the scale that maps the drawn cap height
 * to the font's cap height in units (700 by default, a common choice for a
 * 1000-unit em).
 */
import type { Contour, SheetSegmentation } from '../raster/index.ts';
import { ASCENDER_LETTERS, CAP_HEIGHT_LETTERS, DESCENDER_LETTERS, DOTTED_LETTERS, X_HEIGHT_LETTERS } from './measuring-letters.ts';

/** Default cap height in font units: 70 % of a 1000-unit em (common practice for text faces). */
export const DEFAULT_CAP_HEIGHT_UNITS = 700;

/** A measured height and the letters it came from. */
export interface MeasuredHeight {
  /** Pixels above the baseline (positive up); for the descender, below it as a negative number. */
  readonly pixels: number;
  readonly letters: string;
}

export interface SheetMetrics {
  readonly capHeight: MeasuredHeight | null;
  readonly xHeight: MeasuredHeight | null;
  readonly ascender: MeasuredHeight | null;
  readonly descender: MeasuredHeight | null;
  /** Typical letter height from segmentation, the fallback for a sheet with no measuring letters. */
  readonly letterHeightPixels: number;
  readonly notes: string[];
}

function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  return sorted.length % 2 === 1 ? (sorted[middle] ?? 0) : ((sorted[middle - 1] ?? 0) + (sorted[middle] ?? 0)) / 2;
}

/** Top and bottom (pixel frame, y down) of a letter's ink, the dot of i/j left out. */
function bodyExtent(contours: readonly Contour[], indices: readonly number[], dropDot: boolean): { top: number; bottom: number } {
  const outlines = indices.map((i) => contours[i]).filter((c): c is Contour => c !== undefined && c.depth === 0);
  const pieces = outlines.map((c) => {
    let top = Infinity;
    let bottom = -Infinity;
    for (const p of c.points) {
      if (p.y < top) top = p.y;
      if (p.y > bottom) bottom = p.y;
    }
    return { top, bottom, height: bottom - top };
  });
  const kept = dropDot && pieces.length > 1 ? pieces.filter((p) => p.height !== Math.min(...pieces.map((q) => q.height))) : pieces;
  return { top: Math.min(...kept.map((p) => p.top)), bottom: Math.max(...kept.map((p) => p.bottom)) };
}

function measure(
  sheet: SheetSegmentation,
  contours: readonly Contour[],
  letters: string,
  pick: (extent: { top: number; bottom: number }, baseline: number) => number,
): MeasuredHeight | null {
  const values: number[] = [];
  const used = new Set<string>();
  for (const letter of sheet.letters) {
    if (letter.character === null || !letters.includes(letter.character)) continue;
    const row = sheet.rows[letter.row];
    if (!row) continue;
    values.push(pick(bodyExtent(contours, letter.contours, DOTTED_LETTERS.includes(letter.character)), row.baseline));
    used.add(letter.character);
  }
  if (values.length === 0) return null;
  return { pixels: median(values), letters: [...used].join('') };
}

/**
 * Measures the sheet's vertical metrics from its assigned letters. A metric with no
 * measuring letter on the sheet is null, and a note says which letters would give it.
 */
export function measureSheetMetrics(sheet: SheetSegmentation, contours: readonly Contour[]): SheetMetrics {
  const notes: string[] = [];
  const above = (extent: { top: number }, baseline: number) => baseline - extent.top;
  const below = (extent: { bottom: number }, baseline: number) => baseline - extent.bottom;
  const capHeight = measure(sheet, contours, CAP_HEIGHT_LETTERS, above);
  const xHeight = measure(sheet, contours, X_HEIGHT_LETTERS, above);
  const ascender = measure(sheet, contours, ASCENDER_LETTERS, above);
  const descender = measure(sheet, contours, DESCENDER_LETTERS, below);
  if (!capHeight) notes.push(`No flat-topped capital (${CAP_HEIGHT_LETTERS}) is assigned, so the cap height falls back to the typical letter height.`);
  if (!xHeight) notes.push(`No flat-topped lower-case letter (${X_HEIGHT_LETTERS}) is assigned, so the x-height is not measured.`);
  return { capHeight, xHeight, ascender, descender, letterHeightPixels: sheet.letterHeight, notes };
}

/**
 * Font units per scan pixel so that the measured cap height (or, failing that, the
 * typical letter height) becomes `capHeightUnits`.
 */
export function unitsPerPixel(metrics: SheetMetrics, capHeightUnits: number = DEFAULT_CAP_HEIGHT_UNITS): number {
  const pixels = metrics.capHeight?.pixels ?? metrics.letterHeightPixels;
  if (!(pixels > 0)) throw new RangeError('The sheet has no letters to measure a cap height from.');
  return capHeightUnits / pixels;
}
