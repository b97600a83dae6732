// Cutting a letter's ink at a vertical line, for two letters whose strokes touch on
// the sheet (a serif running into the next letter, "rn" drawn tight). The letter's
// own ink is taken from the scan — only the pixels inside its traced contours, so a
// neighbour's ink in the same box is left out — the pixels on the far side of the
// line are made paper, and each side is traced again with the sheet's own boundary
// method, threshold and iso-level. Each side's new contours therefore follow the drawn
// edge exactly as before everywhere but at the cut, where they run straight along the
// line, one pixel edge for both sides.
//
// The cut is vertical, at a whole pixel edge (the nearest to the line the user
// placed): a type designer separates touching letters where their ink is narrowest,
// which is where a vertical cut is shortest, and a pixel edge is the finest line the
// scan resolves. A slanted cut is not offered.

import type { IsoLevelField } from './iso-level-field.ts';
import { nestContours } from './nesting.ts';
import { traceBoundaries } from './trace-boundaries.ts';
import type { Box, Contour, GreyRaster, InkMask, Point } from './types.ts';
import type { SheetLetter } from './segment-sheet.ts';
import { SheetEditError } from './sheet-edit-error.ts';

/** What the sheet was traced from, as traceScan returns it: re-tracing uses the same greys, mask and iso-level. */
export interface InkSource {
  /** The greys the boundaries were placed on (after any inversion). */
  readonly grey: GreyRaster;
  /** The cleaned ink mask. */
  readonly mask: InkMask;
  readonly isoField: IsoLevelField;
  readonly boundary: 'marching-squares' | 'pixel-edges';
}

/** Both sides of a cut letter: new contours in the sheet's pixel frame, each side nested on its own (parents index into that side's list). */
export interface CutInk {
  /** The pixel edge the cut ran along. */
  readonly x: number;
  readonly left: Contour[];
  readonly right: Contour[];
}

/**
 * Pixels of margin kept around the letter: marching squares reads the grey of the
 * paper pixel beside each ink pixel, so one pixel suffices; two leave the padding the
 * tracer adds outside the crop far from any kept ink.
 */
const CROP_MARGIN_PX = 2;
/** The grey of paper, given to every pixel taken out of a side. */
const PAPER_GREY = 255;

/** The crop around `box` (with margin, on tile boundaries for a tiled iso-level so its levels stay where they were), clamped to the image. */
function cropFor(box: Box, source: InkSource): { x0: number; y0: number; x1: number; y1: number; isoField: IsoLevelField } {
  const { width, height } = source.mask;
  const field = source.isoField;
  const margin = field.kind === 'tiled' ? Math.max(CROP_MARGIN_PX, field.tileSize) : CROP_MARGIN_PX;
  let x0 = Math.max(0, Math.floor(box.x) - margin);
  let y0 = Math.max(0, Math.floor(box.y) - margin);
  let x1 = Math.min(width, Math.ceil(box.x + box.width) + margin);
  let y1 = Math.min(height, Math.ceil(box.y + box.height) + margin);
  if (field.kind === 'uniform') return { x0, y0, x1, y1, isoField: field };
  const t = field.tileSize;
  const c0 = Math.floor(x0 / t);
  const r0 = Math.floor(y0 / t);
  const c1 = Math.min(field.columns, Math.ceil(x1 / t));
  const r1 = Math.min(field.rows, Math.ceil(y1 / t));
  x0 = c0 * t;
  y0 = r0 * t;
  x1 = Math.min(width, c1 * t);
  y1 = Math.min(height, r1 * t);
  const columns = c1 - c0;
  const rows = r1 - r0;
  const levels = new Float32Array(columns * rows);
  for (let r = 0; r < rows; r++) levels.set(field.levels.subarray((r0 + r) * field.columns + c0, (r0 + r) * field.columns + c0 + columns), r * columns);
  return { x0, y0, x1, y1, isoField: { kind: 'tiled', tileSize: t, columns, rows, levels } };
}

/**
 * Which pixels of the crop lie inside the letter's ink: a pixel is inside when its
 * centre is inside an odd number of the letter's contours (outer contours, holes,
 * islands — even–odd, which for properly nested contours is the ink). For traced
 * contours this is exactly the mask's ink of that letter: marching-squares contours
 * pass between an ink and a paper pixel centre, pixel-edge contours along pixel edges.
 * Row-major, crop-sized, 1 inside.
 */
export function letterInkPixels(contours: readonly Contour[], letter: SheetLetter, crop: { x0: number; y0: number; x1: number; y1: number }): Uint8Array {
  const w = crop.x1 - crop.x0;
  const h = crop.y1 - crop.y0;
  const inside = new Uint8Array(w * h);
  const crossings: number[][] = Array.from({ length: h }, () => []);
  for (const index of letter.contours) {
    const points = contours[index]?.points ?? [];
    for (let i = 0, j = points.length - 1; i < points.length; j = i++) {
      const a = points[j]!;
      const b = points[i]!;
      if (a.y === b.y) continue;
      const low = Math.min(a.y, b.y);
      const high = Math.max(a.y, b.y);
      // Rows whose centre y = row + 0.5 lies in [low, high): half-open, so a vertex is counted once.
      for (let row = Math.max(crop.y0, Math.ceil(low - 0.5)); row < crop.y1 && row + 0.5 < high; row++) {
        const y = row + 0.5;
        crossings[row - crop.y0]!.push(a.x + ((y - a.y) * (b.x - a.x)) / (b.y - a.y));
      }
    }
  }
  for (let r = 0; r < h; r++) {
    const xs = crossings[r]!.sort((p, q) => p - q);
    for (let k = 0; k + 1 < xs.length; k += 2) {
      // Pixel centres col + 0.5 in [xs[k], xs[k + 1]).
      const from = Math.max(crop.x0, Math.ceil(xs[k]! - 0.5));
      const to = Math.min(crop.x1, Math.ceil(xs[k + 1]! - 0.5));
      for (let col = from; col < to; col++) inside[r * w + col - crop.x0] = 1;
    }
  }
  return inside;
}

/** Whether any of the 8 neighbours of (col, row) in a w × h grid is set. */
function nearSet(grid: Uint8Array, w: number, h: number, col: number, row: number): boolean {
  for (let dy = -1; dy <= 1; dy++) {
    const r = row + dy;
    if (r < 0 || r >= h) continue;
    for (let dx = -1; dx <= 1; dx++) {
      const c = col + dx;
      if (c >= 0 && c < w && grid[r * w + c] === 1) return true;
    }
  }
  return false;
}

/** The contours of one side: its ink re-traced on the crop and moved back into the sheet's frame. */
function traceSide(source: InkSource, crop: ReturnType<typeof cropFor>, inside: Uint8Array, keep: (col: number) => boolean): Contour[] {
  const w = crop.x1 - crop.x0;
  const h = crop.y1 - crop.y0;
  const grey = new Uint8Array(w * h);
  const mask = new Uint8Array(w * h);
  const sideInk = new Uint8Array(w * h);
  for (let r = 0; r < h; r++) for (let c = 0; c < w; c++) if (inside[r * w + c] === 1 && keep(c + crop.x0)) sideInk[r * w + c] = 1;
  let inkPixels = 0;
  for (let r = 0; r < h; r++) {
    for (let c = 0; c < w; c++) {
      const i = r * w + c;
      const page = (crop.y0 + r) * source.mask.width + crop.x0 + c;
      if (sideInk[i] === 1) {
        mask[i] = 1;
        grey[i] = source.grey.data[page]!;
        inkPixels++;
      } else {
        // Paper that borders the side's ink keeps its grey (it places the edge); ink of the other side or of a neighbour becomes paper.
        grey[i] = source.mask.data[page] === 0 && nearSet(sideInk, w, h, c, r) ? source.grey.data[page]! : PAPER_GREY;
      }
    }
  }
  if (inkPixels === 0) return [];
  const traced = traceBoundaries({ width: w, height: h, data: grey }, { width: w, height: h, data: mask }, { method: source.boundary, isoField: crop.isoField });
  const moved: Point[][] = traced.chains.map((chain) => chain.map((p) => ({ x: p.x + crop.x0, y: p.y + crop.y0 })));
  return nestContours(moved);
}

/**
 * Cuts `letter`'s ink along the pixel edge nearest to x = `x` (pixel frame) and traces
 * each side again. Throws SheetEditError when the line misses the letter's ink (one
 * side would be empty): the message says where the ink is. Nothing passed in is
 * modified.
 */
export function cutLetterInk(source: InkSource, contours: readonly Contour[], letter: SheetLetter, x: number): CutInk {
  const cutX = Math.round(x);
  const crop = cropFor(letter.box, source);
  const inside = letterInkPixels(contours, letter, crop);
  const left = traceSide(source, crop, inside, (col) => col < cutX);
  const right = traceSide(source, crop, inside, (col) => col >= cutX);
  if (left.length === 0 || right.length === 0) {
    const from = Math.round(letter.box.x);
    const to = Math.round(letter.box.x + letter.box.width);
    throw new SheetEditError(`The cut at x = ${cutX} px leaves no ink ${left.length === 0 ? 'left' : 'right'} of it: letter #${letter.index + 1}'s ink runs from x = ${from} to ${to} px. Place the line across the ink, where the letters touch.`);
  }
  return { x: cutX, left, right };
}
