// Cleanup of scanning debris: specks of dust are erased and pinholes in solid ink are
// filled, with sizes given in mm² on the paper and converted with the scan resolution.

import { describe, expect, it } from 'vitest';
import { DEFAULT_SPECK_AREA_MM2, cleanupMask, labelInkComponents, squareMillimetresToPixels, resolveResolution, type InkMask } from '../../core/raster/index.ts';

/** A blank mask with rectangles of ink (value 1) or paper (value 0) painted in order. */
function paint(width: number, height: number, rectangles: readonly { x: number; y: number; w: number; h: number; value: 0 | 1 }[]): InkMask {
  const data = new Uint8Array(width * height);
  for (const r of rectangles) for (let y = r.y; y < r.y + r.h; y++) for (let x = r.x; x < r.x + r.w; x++) data[y * width + x] = r.value;
  return { width, height, data };
}

function inkAt(mask: InkMask, x: number, y: number): number {
  return mask.data[y * mask.width + x]!;
}

describe('speck and pinhole cleanup', () => {
  it('converts mm² to pixels with (dpi / 25.4)² at 300 and 600 dpi', () => {
    // 1 inch = 25.4 mm exactly (international inch, 1959).
    expect(squareMillimetresToPixels(1, resolveResolution({ dpi: 300 }))).toBeCloseTo((300 / 25.4) ** 2, 10);
    expect(squareMillimetresToPixels(0.02, resolveResolution({ dpi: 300 }))).toBeCloseTo(2.790006, 5);
    expect(squareMillimetresToPixels(0.02, resolveResolution({ dpi: 600 }))).toBeCloseTo(11.160022, 5);
    expect(squareMillimetresToPixels(1, resolveResolution({ dpiX: 300, dpiY: 600 }))).toBeCloseTo((300 / 25.4) * (600 / 25.4), 10);
  });

  it.each([
    [300, 2, 3],
    [600, 11, 12],
  ])('at %i dpi erases a %i px speck and keeps a %i px dot (default 0.02 mm²)', (dpi, removed, kept) => {
    const mask = paint(40, 20, [
      { x: 2, y: 2, w: removed, h: 1, value: 1 },
      { x: 2, y: 10, w: kept, h: 1, value: 1 },
      { x: 25, y: 2, w: 10, h: 10, value: 1 },
    ]);
    const result = cleanupMask(mask, { dpi });
    expect(result.speckAreaPx).toBeCloseTo(DEFAULT_SPECK_AREA_MM2 * (dpi / 25.4) ** 2, 10);
    expect(inkAt(result.mask, 2, 2)).toBe(0);
    expect(inkAt(result.mask, 2, 10)).toBe(1);
    expect(inkAt(result.mask, 30, 5)).toBe(1);
    expect(result.specksRemoved).toBe(1);
    expect(labelInkComponents(result.mask).count).toBe(2);
  });

  it('fills a pinhole inside ink but keeps a larger counter and the paper outside', () => {
    const mask = paint(40, 30, [
      { x: 5, y: 5, w: 30, h: 20, value: 1 },
      { x: 8, y: 8, w: 2, h: 1, value: 0 }, // 2 px pinhole: below 2.79 px at 300 dpi
      { x: 20, y: 10, w: 3, h: 1, value: 0 }, // 3 px counter: kept
    ]);
    const result = cleanupMask(mask, { dpi: 300 });
    expect(inkAt(result.mask, 8, 8)).toBe(1);
    expect(inkAt(result.mask, 9, 8)).toBe(1);
    expect(inkAt(result.mask, 20, 10)).toBe(0);
    expect(inkAt(result.mask, 0, 0)).toBe(0);
    expect(result.pinholesFilled).toBe(1);
  });

  it('never fills small paper areas that touch the page edge, since they are not enclosed', () => {
    const mask = paint(10, 10, [
      { x: 0, y: 0, w: 10, h: 10, value: 1 },
      { x: 0, y: 4, w: 1, h: 1, value: 0 },
    ]);
    expect(inkAt(cleanupMask(mask, { dpi: 300 }).mask, 0, 4)).toBe(0);
  });

  it('assumes 300 dpi when the scan states no resolution, and says so', () => {
    const mask = paint(10, 10, [{ x: 1, y: 1, w: 2, h: 1, value: 1 }]);
    const result = cleanupMask(mask);
    expect(result.resolution).toEqual({ dpiX: 300, dpiY: 300, assumed: true });
    expect(result.notes.join(' ')).toMatch(/300 dpi was assumed/);
  });

  it('leaves the input mask untouched', () => {
    const mask = paint(10, 10, [{ x: 1, y: 1, w: 1, h: 1, value: 1 }]);
    const before = mask.data.slice();
    cleanupMask(mask, { dpi: 300 });
    expect(mask.data).toEqual(before);
  });

  it('keeps everything when both limits are 0', () => {
    const mask = paint(10, 10, [
      { x: 1, y: 1, w: 1, h: 1, value: 1 },
      { x: 4, y: 4, w: 3, h: 3, value: 1 },
      { x: 5, y: 5, w: 1, h: 1, value: 0 },
    ]);
    expect(cleanupMask(mask, { dpi: 300, speckAreaMm2: 0, pinholeAreaMm2: 0 }).mask.data).toEqual(mask.data);
  });
});
