// Guides the user sets on the sheet are the ones the fit uses: a cap height set by
// hand sets the drawing scale (it becomes the font's 700-unit cap height), an
// x-height set by hand is the font's x-height, and a baseline set by hand is where
// each letter of its row stands (y = 0 of its frame).
import { describe, expect, it } from 'vitest';
import { applySheetEdits, traceScan, uncorrectedSheet, type GreyRaster } from '../../core/raster/index.ts';
import { DEFAULT_CAP_HEIGHT_UNITS, measureSheetMetrics, SET_BY_HAND, unitsPerPixel, withGuideHeights } from '../../core/metrics/index.ts';
import { fitTracedSheet } from '../../core/pipeline/index.ts';

/** "H" and "x" as plain blocks on whole pixels: cap height 80 px, x-height 50 px, both standing on y = 100. */
function sheet(): GreyRaster {
  const width = 240;
  const height = 140;
  const data = new Uint8Array(width * height).fill(255);
  const block = (x: number, y: number, w: number, h: number) => { for (let r = y; r < y + h; r++) for (let c = x; c < x + w; c++) data[r * width + c] = 0; };
  block(30, 20, 60, 80);
  block(130, 50, 50, 50);
  return { width, height, data, dpi: 300 };
}

describe('guides set on the sheet', () => {
  const scan = traceScan({ raster: sheet() }, { characters: 'Hx' });

  it('replace the measured heights, and drop the notes about heights that could not be measured', () => {
    const measured = measureSheetMetrics(scan.sheet, scan.contours);
    expect(measured.capHeight?.pixels).toBe(80);
    expect(measured.xHeight?.pixels).toBe(50);
    const set = withGuideHeights(measured, { capHeightPixels: 100, xHeightPixels: 62 });
    expect(set.capHeight).toEqual({ pixels: 100, letters: SET_BY_HAND });
    expect(set.xHeight).toEqual({ pixels: 62, letters: SET_BY_HAND });
    expect(unitsPerPixel(set)).toBe(DEFAULT_CAP_HEIGHT_UNITS / 100);
    const unmeasured = measureSheetMetrics({ ...scan.sheet, letters: scan.sheet.letters.map((l) => ({ ...l, character: null })) }, scan.contours);
    expect(unmeasured.notes).toHaveLength(2);
    expect(withGuideHeights(unmeasured, { capHeightPixels: 90, xHeightPixels: null }).notes.join(' ')).not.toMatch(/cap height/);
    expect(() => withGuideHeights(measured, { capHeightPixels: 0, xHeightPixels: null })).toThrow(/must be above the baseline/);
  });

  it('are what the fit scales by and where letters stand', () => {
    const corrected = applySheetEdits(uncorrectedSheet(scan.contours, scan.sheet), [
      { kind: 'baseline', row: 0, y: 96 },
      { kind: 'height', guide: 'cap-height', pixels: 70 },
      { kind: 'height', guide: 'x-height', pixels: 35 },
    ]);
    const fitted = fitTracedSheet({ ...scan, contours: [...corrected.contours], sheet: corrected.sheet }, { guides: corrected.guides });
    expect(fitted.unitsPerPixel).toBe(DEFAULT_CAP_HEIGHT_UNITS / 70);
    expect(fitted.metrics.xHeight?.pixels).toBe(35);
    expect(fitted.letters.map((l) => l.frame.baselineY)).toEqual([96, 96]);
    // The H's ink bottom is 4 px below the baseline set by hand: 4 px × 10 units/px under y = 0.
    const bottom = Math.min(...fitted.letters[0]!.outline!.contours.flatMap((c) => c.points.map((p) => p.y)));
    expect(bottom).toBeCloseTo(-4 * (DEFAULT_CAP_HEIGHT_UNITS / 70), 0);
  });
});
