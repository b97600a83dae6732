// Correcting the letters of a traced sheet: merging letters the segmentation kept
// apart (a far-off dot, a broken stroke), splitting one letter by its pieces (a mark
// taken as another letter's accent), cutting the ink of two letters that touch and
// tracing each side again, retyping one letter, and the guides. Sheets are drawn by
// an independent rasterizer (Skia via @napi-rs/canvas) or painted pixel by pixel, so
// the ink each side of a cut must hold is known exactly.
import { describe, expect, it } from 'vitest';
import {
  applySheetEdit,
  applySheetEdits,
  inReadingOrder,
  letterPieces,
  pieceGaps,
  piecesCrossedAt,
  SheetEditError,
  signedArea,
  traceScan,
  uncorrectedSheet,
  type CorrectedSheet,
  type GreyRaster,
  type InkSource,
  type SheetEdit,
  type TraceScanResult,
} from '../../core/raster/index.ts';
import { renderAntialiased } from './reference-render.ts';

/** Two boundary points this close are the same point, moved by floating-point rounding only. */
const SAME_POINT_PX = 1e-9;

/** A white raster with black rectangles [x, y, width, height] painted on whole pixels: a bilevel scan, traced on pixel edges. */
function painted(width: number, height: number, rects: readonly (readonly [number, number, number, number])[]): GreyRaster {
  const data = new Uint8Array(width * height).fill(255);
  for (const [x, y, w, h] of rects) for (let r = y; r < y + h; r++) for (let c = x; c < x + w; c++) data[r * width + c] = 0;
  return { width, height, data, dpi: 300 };
}

function start(scan: TraceScanResult): CorrectedSheet {
  return uncorrectedSheet(scan.contours, scan.sheet);
}

function sourceOf(scan: TraceScanResult): InkSource {
  return { grey: scan.grey, mask: scan.mask, isoField: scan.isoField, boundary: scan.boundary };
}

/** Ink area of a letter: the signed areas of its contours (holes negative), in px². */
function inkArea(state: CorrectedSheet, index: number): number {
  return state.sheet.letters[index]!.contours.reduce((sum, c) => sum + signedArea(state.contours[c]!.points), 0);
}

function edit(state: CorrectedSheet, e: SheetEdit, scan?: TraceScanResult): CorrectedSheet {
  return applySheetEdit(state, e, scan ? sourceOf(scan) : undefined);
}

describe('merging letters', () => {
  // A stem with its dot a whole stem-height above (too far for the segmentation to join), and an "o" with its counter.
  const raster = painted(240, 200, [[40, 100, 14, 60], [40, 20, 14, 14], [100, 100, 50, 60]]);
  const scan = traceScan({ raster });
  // The same sheet with a counter opened in the block: an "o".
  const o = painted(240, 200, [[40, 100, 14, 60], [40, 20, 14, 14], [100, 100, 50, 60]]);
  for (let y = 115; y < 145; y++) for (let x = 115; x < 135; x++) o.data[y * 240 + x] = 255;
  const withHole = traceScan({ raster: o });

  it('finds the far dot as a letter of its own, and merging makes one "i" holding both pieces', () => {
    const before = start(scan);
    expect(before.sheet.letters).toHaveLength(3);
    const dot = before.sheet.letters.findIndex((l) => l.box.height < 20);
    const stem = before.sheet.letters.findIndex((l) => l.box.height === 60 && l.box.x === 40);
    // Reading order puts the dot first (same left edge as the stem, higher), so "i" goes to it and "." to the stem.
    const assigned = edit(before, { kind: 'assign', characters: 'i.o' });
    expect(assigned.sheet.letters.map((l) => l.character)).toEqual(['i', '.', 'o']);
    const merged = edit(assigned, { kind: 'merge', letters: [stem, dot] });
    expect(merged.sheet.letters).toHaveLength(2);
    const i = merged.sheet.letters[0]!;
    expect(i.box).toEqual({ x: 40, y: 20, width: 14, height: 140 });
    expect(i.contours).toEqual([...before.sheet.letters[stem]!.contours, ...before.sheet.letters[dot]!.contours].sort((a, b) => a - b));
    // The merged letter takes the first character among the letters merged, in reading order.
    expect(merged.sheet.letters.map((l) => [l.index, l.character])).toEqual([[0, 'i'], [1, 'o']]);
  });

  it('keeps a counter under its outer contour when a letter with a hole is merged', () => {
    const before = start(withHole);
    const o = before.sheet.letters.findIndex((l) => l.contours.length === 2);
    const dot = before.sheet.letters.findIndex((l) => l.box.height < 20);
    const merged = edit(before, { kind: 'merge', letters: [o, dot] });
    const letter = merged.sheet.letters.find((l) => l.contours.length === 3)!;
    const pieces = letterPieces(merged.contours, letter);
    expect(pieces).toHaveLength(2);
    const oPiece = pieces.find((p) => p.contours.length === 2)!;
    const hole = oPiece.contours.find((c) => c !== oPiece.outer)!;
    expect(merged.contours[hole]!.parent).toBe(oPiece.outer);
    expect(merged.contours[hole]!.depth).toBe(1);
    // Counter-clockwise-positive in the y-down frame: the hole winds opposite to its outer contour.
    expect(Math.sign(merged.contours[hole]!.area)).toBe(-Math.sign(merged.contours[oPiece.outer]!.area));
  });

  it('refuses to merge one letter, saying to select another', () => {
    expect(() => edit(start(scan), { kind: 'merge', letters: [0, 0] })).toThrow(/at least two letters: select another box/);
    expect(() => edit(start(scan), { kind: 'merge', letters: [0, 7] })).toThrow(/no letter #8/);
  });
});

describe('reading order after a correction', () => {
  it('goes row by row, left to right, and keeps the order of letters that start at the same x', () => {
    const letter = (row: number, x: number, y: number, tag: string) => ({ index: 9, box: { x, y, width: 10, height: 10 }, contours: [], row, character: tag });
    const ordered = inReadingOrder([letter(1, 5, 0, 'd'), letter(0, 30, 0, 'c'), letter(0, 10, 50, 'a'), letter(0, 10, 0, 'b')]);
    expect(ordered.map((l) => [l.index, l.character])).toEqual([[0, 'a'], [1, 'b'], [2, 'c'], [3, 'd']]);
  });
});

describe('the gaps between pieces', () => {
  it('are the spans a vertical line can cross without touching ink, left to right', () => {
    const scan = traceScan({ raster: painted(300, 120, [[20, 20, 20, 60], [60, 20, 20, 60], [70, 90, 30, 10], [130, 20, 20, 60]]) });
    const all = { index: 0, box: { x: 20, y: 20, width: 130, height: 80 }, contours: scan.contours.map((_, i) => i), row: 0, character: null };
    expect(pieceGaps(letterPieces(scan.contours, all))).toEqual([{ from: 40, to: 60 }, { from: 100, to: 130 }]);
  });
});

describe('splitting a letter by its pieces', () => {
  // A stem and, up and to its right, a mark overlapping its top: the segmentation takes the mark as the stem's accent.
  const scan = traceScan({ raster: painted(200, 200, [[40, 60, 20, 100], [56, 30, 20, 20]]) });

  it('gives two letters, the mark on the right without a character, when the line passes between the pieces\' centres', () => {
    const before = edit(start(scan), { kind: 'assign', characters: 'l' });
    expect(before.sheet.letters).toHaveLength(1);
    const pieces = letterPieces(before.contours, before.sheet.letters[0]!);
    expect(pieces).toHaveLength(2);
    expect(pieceGaps(pieces)).toEqual([]); // they overlap in x: no clean gap, the centres decide
    expect(piecesCrossedAt(pieces, 58).map((p) => p.box.x)).toEqual([40, 56]);
    expect(piecesCrossedAt(pieces, 70).map((p) => p.box.x)).toEqual([56]);
    expect(piecesCrossedAt(pieces, 76)).toEqual([]); // the right edge itself is not inside
    const split = edit(before, { kind: 'split', letter: 0, x: 60 });
    expect(split.sheet.letters.map((l) => [l.box.x, l.box.width, l.character])).toEqual([[40, 20, 'l'], [56, 20, null]]);
    expect(split.sheet.letters.map((l) => l.row)).toEqual([0, 0]);
  });

  it('refuses a line with every piece on one side, and says to move it or cut', () => {
    expect(() => edit(start(scan), { kind: 'split', letter: 0, x: 90 })).toThrow(/all 2 of its pieces lie left of the line\. Move the line between two pieces, or cut the ink/);
  });
});

describe('cutting touching letters', () => {
  // Two 30-px-wide stems joined by a 6-px-high bridge from x = 70 to 90: "letters that touch".
  const stems = painted(200, 160, [[40, 30, 30, 100], [90, 30, 30, 100], [70, 100, 20, 6]]);
  const scan = traceScan({ raster: stems });

  it('cuts on the pixel edge nearest the line; the sides share the ink exactly and meet at the cut', () => {
    const before = start(scan);
    expect(before.sheet.letters).toHaveLength(1);
    const cut = edit(before, { kind: 'cut', letter: 0, x: 80.3 }, scan);
    expect(cut.sheet.letters).toHaveLength(2);
    const [left, right] = cut.sheet.letters;
    expect(left!.box).toEqual({ x: 40, y: 30, width: 40, height: 100 });
    expect(right!.box).toEqual({ x: 80, y: 30, width: 40, height: 100 });
    // Pixel-edge contours enclose whole pixels: 30·100 + 10·6 on each side.
    expect(inkArea(cut, 0)).toBe(3060);
    expect(inkArea(cut, 1)).toBe(3060);
    expect(inkArea(cut, 0) + inkArea(cut, 1)).toBe(inkArea(before, 0));
    // The traced contours are kept; the new ones are appended.
    expect(cut.contours.slice(0, scan.contours.length)).toEqual(scan.contours);
    expect(Math.min(...left!.contours, ...right!.contours)).toBeGreaterThanOrEqual(scan.contours.length);
  });

  it('leaves a neighbour\'s ink inside the box out of both sides', () => {
    // A "T" whose bar reaches over a separate small block: the block is its own letter, inside the T's box.
    const raster = painted(220, 180, [[40, 30, 100, 14], [80, 44, 14, 90], [94, 120, 30, 14], [110, 70, 16, 16]]);
    const traced = traceScan({ raster });
    const before = start(traced);
    const t = before.sheet.letters.findIndex((l) => l.box.width === 100);
    const area = inkArea(before, t);
    const cut = edit(before, { kind: 'cut', letter: t, x: 100 }, traced);
    const sides = cut.sheet.letters.filter((l) => l.contours.some((c) => c >= traced.contours.length));
    expect(sides).toHaveLength(2);
    expect(sides.reduce((sum, l) => sum + inkArea(cut, l.index), 0)).toBe(area);
  });

  it('keeps a counter nested under its outer contour when the cut passes beside it', () => {
    // An "o" (with counter) touching a stem through a bridge.
    const raster = painted(220, 160, [[40, 40, 50, 70], [90, 80, 16, 6], [106, 40, 16, 70]]);
    for (let y = 55; y < 95; y++) for (let x = 55; x < 75; x++) raster.data[y * 220 + x] = 255;
    const traced = traceScan({ raster });
    const cut = edit(start(traced), { kind: 'cut', letter: 0, x: 98 }, traced);
    const o = cut.sheet.letters[0]!;
    expect(o.contours).toHaveLength(2);
    const [outer, hole] = [...o.contours].sort((a, b) => cut.contours[a]!.depth - cut.contours[b]!.depth);
    expect(cut.contours[hole!]!.parent).toBe(outer);
    expect(cut.contours[hole!]!.depth).toBe(1);
    expect(signedArea(cut.contours[hole!]!.points)).toBe(-20 * 40);
  });

  it('refuses a line that misses the ink and says where the ink is', () => {
    const e = (() => {
      try {
        edit(start(scan), { kind: 'cut', letter: 0, x: 150 }, scan);
      } catch (error) {
        return error;
      }
      return null;
    })();
    expect(e).toBeInstanceOf(SheetEditError);
    expect((e as Error).message).toMatch(/leaves no ink right of it: letter #1's ink runs from x = 40 to 120 px\. Place the line across the ink/);
    expect(() => edit(start(scan), { kind: 'cut', letter: 0, x: 80 })).toThrow(/needs the scan/);
  });

  for (const method of ['otsu', 'sauvola'] as const) {
    it(`re-traces an anti-aliased scan (${method} threshold) with the edge unchanged away from the cut`, () => {
      // Two discs touching along a short overlap, drawn by Skia.
      const raster = renderAntialiased(240, 160, (g) => {
        g.beginPath();
        g.arc(80.3, 80.6, 36, 0, 2 * Math.PI);
        g.arc(150.2, 80.6, 36, 0, 2 * Math.PI);
        g.fill('nonzero');
      });
      const traced = traceScan({ raster: { ...raster, dpi: 300 } }, { method });
      const before = start(traced);
      expect(before.sheet.letters).toHaveLength(1);
      const cut = edit(before, { kind: 'cut', letter: 0, x: 115.2 }, traced);
      expect(cut.sheet.letters).toHaveLength(2);
      const original = traced.contours[before.sheet.letters[0]!.contours[0]!]!.points;
      const leftChain = cut.contours[cut.sheet.letters[0]!.contours[0]!]!.points;
      // Same greys, same mask, same iso-levels: every boundary point more than 2 px from the cut is placed where it was
      // (to rounding: the crop's coordinates are moved back by adding its origin).
      const far = original.filter((p) => p.x < 113);
      expect(far.length).toBeGreaterThan(100);
      const moved = far.filter((p) => !leftChain.some((q) => Math.hypot(q.x - p.x, q.y - p.y) < SAME_POINT_PX));
      expect(moved).toEqual([]);
      // The cut edge lies on the pixel edge x = 115 to within the iso-level interpolation of a half-pixel step.
      const rightmost = Math.max(...leftChain.map((p) => p.x));
      expect(rightmost).toBeGreaterThan(114.4);
      expect(rightmost).toBeLessThan(115.6);
    });
  }
});

describe('retyping, assigning and guides', () => {
  const scan = traceScan({ raster: painted(300, 120, [[20, 20, 20, 60], [60, 20, 20, 60], [100, 20, 20, 60]]) });

  it('retypes one letter without touching the others, and clears one with an empty character', () => {
    const assigned = edit(start(scan), { kind: 'assign', characters: 'abc' });
    const retyped = edit(assigned, { kind: 'retype', letter: 1, character: 'é' });
    expect(retyped.sheet.letters.map((l) => l.character)).toEqual(['a', 'é', 'c']);
    expect(edit(retyped, { kind: 'retype', letter: 2, character: '' }).sheet.letters[2]!.character).toBeNull();
    expect(() => edit(retyped, { kind: 'retype', letter: 0, character: 'ab' })).toThrow(/"ab" is 2 characters; a letter is drawn for one/);
  });

  it('assigns typed characters to the corrected letters in reading order, noting a count that differs', () => {
    const merged = edit(start(scan), { kind: 'merge', letters: [0, 1] });
    const assigned = edit(merged, { kind: 'assign', characters: 'm n x' });
    expect(assigned.sheet.letters.map((l) => l.character)).toEqual(['m', 'n']);
    expect(assigned.sheet.notes.join(' ')).toMatch(/3 characters but only 2 letters.*"x" was not assigned/);
  });

  it('sets a row\'s baseline and the sheet\'s heights, refusing a height below the baseline', () => {
    const set = applySheetEdits(start(scan), [
      { kind: 'baseline', row: 0, y: 84.5 },
      { kind: 'height', guide: 'cap-height', pixels: 66 },
      { kind: 'height', guide: 'x-height', pixels: 44 },
    ]);
    expect(set.sheet.rows[0]!.baseline).toBe(84.5);
    expect(set.guides).toEqual({ baselinesSet: [0], capHeightPixels: 66, xHeightPixels: 44 });
    expect(() => edit(set, { kind: 'height', guide: 'x-height', pixels: -3 })).toThrow(/must lie above the baseline/);
    expect(edit(set, { kind: 'height', guide: 'x-height', pixels: null }).guides).toEqual({ baselinesSet: [0], capHeightPixels: 66, xHeightPixels: null });
    expect(() => edit(set, { kind: 'baseline', row: 4, y: 10 })).toThrow(/no row 5/);
  });

  it('replays a list of edits to the same letters, and names the first edit that cannot be made', () => {
    const edits: SheetEdit[] = [{ kind: 'assign', characters: 'abc' }, { kind: 'merge', letters: [1, 2] }, { kind: 'retype', letter: 1, character: 'm' }];
    const once = applySheetEdits(start(scan), edits);
    expect(applySheetEdits(start(scan), edits)).toEqual(once);
    expect(once.sheet.letters.map((l) => l.character)).toEqual(['a', 'm']);
    expect(() => applySheetEdits(start(scan), [...edits, { kind: 'retype', letter: 5, character: 'z' }])).toThrow(/^Correction 4 of 4 \(retype\) cannot be made on this scan: .*no letter #6/);
  });
});
