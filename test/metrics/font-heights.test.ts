// The font's vertical metrics for heights the drawing does not show: one rule, a share
// of the cap height, in the command line's build and in the app, so a drawing gives the
// same font heights either way. The drawing is the demo sheet's first three rows (the
// capitals and a–m): the cap height and the ascender (b d h k l) are measured there,
// the x-height (no x z v w y u) and the descender (no p q) are not.
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import sharp from 'sharp';
import { FALLBACK_DESCENDER_PER_CAP, FALLBACK_X_HEIGHT_PER_CAP, fontHeights } from '../../core/metrics/index.ts';
import { applySheetEdit, traceScan, uncorrectedSheet, type TraceScanResult } from '../../core/raster/index.ts';
import { draftFont, fitTracedSheet, traceSheets } from '../../core/pipeline/index.ts';
import { decodeScanBytes } from '../../electron/io/decode-scan.ts';
import { DEMO_SHEETS_FOLDER } from '../../electron/demo/demo-files.ts';
import { fittedMetrics } from '../../renderer/src/scan/fitted-metrics.ts';
import { fontMetricsOf } from '../../renderer/src/editor/letter-document.ts';

/** The characters of the demo sheet's first three rows (electron/demo/sheets/demo-sheets.json). */
const THREE_ROWS = 'ABCDEFGHIJKLM NOPQRSTUVWXYZ abcdefghijklm';

describe('font heights the drawing does not show', () => {
  it('are shares of the cap height, whatever the em', () => {
    const drawn = { capHeight: 600, xHeight: null, ascender: null, descender: null };
    for (const unitsPerEm of [1000, 2048]) {
      const heights = fontHeights(drawn, unitsPerEm);
      expect(heights).toMatchObject({ capHeight: 600, xHeight: 420, ascender: 643, descender: -214, placeholders: ['xHeight', 'ascender', 'descender'] });
      // The line gap tops ascender − descender up to 1.2 em (core/metrics/line-gap.ts).
      expect(heights.lineGap).toBe(Math.round(1.2 * unitsPerEm - (643 + 214)));
    }
    // At a 700-unit cap height the placeholders span one 1000-unit em.
    const usual = fontHeights({ capHeight: 700, xHeight: null, ascender: null, descender: null }, 1000);
    expect([usual.xHeight, usual.ascender, usual.descender, usual.lineGap]).toEqual([490, 750, -250, 200]);
    expect(FALLBACK_X_HEIGHT_PER_CAP * 700).toBeCloseTo(490, 9);
    expect(FALLBACK_DESCENDER_PER_CAP * 700).toBeCloseTo(-250, 9);
  });

  it('keep what the drawing measures, rounded, with the ascender never under the cap height and the descender never above the baseline', () => {
    expect(fontHeights({ capHeight: 700.4, xHeight: 481.6, ascender: 690, descender: 12 }, 1000)).toMatchObject({ capHeight: 700, xHeight: 482, ascender: 700, descender: 0, placeholders: [] });
  });

  it('are the same in the app and in the command line’s build for the same drawing', async () => {
    const png = readFileSync(join(DEMO_SHEETS_FOLDER, 'pellworth-alphabet.png'));
    const page = await decodeScanBytes(png, 'pellworth-alphabet.png');
    const whole = traceScan({ raster: { ...page.raster, dpi: page.dpi } });
    const [, , third, fourth] = whole.sheet.rows;
    const cropHeight = Math.round((third!.bottom + fourth!.top) / 2);
    const cropped = await decodeScanBytes(await sharp(png).extract({ left: 0, top: 0, width: page.raster.width, height: cropHeight }).png().withMetadata({ density: page.dpi }).toBuffer(), 'three-rows.png');
    const image = { raster: { ...cropped.raster, dpi: cropped.dpi } };

    // The command line: `stemline build` traces the sheets and drafts the font from them (electron/cli/commands/build.ts).
    const built = draftFont(traceSheets([image], THREE_ROWS), { familyName: 'Pellworth Fascia', styleName: 'Regular', unitsPerEm: 1000, capHeight: 700 });

    // The app: the worker traces the sheet, assigns the typed characters, fits the assigned letters (renderer/src/scan/trace-worker.ts)
    // and the letter document takes its metrics from the fitted sheet's heights (renderer/src/editor/letter-document.ts).
    const scan = traceScan(image, { smoothBilevel: true });
    const source = { grey: scan.grey, mask: scan.mask, isoField: scan.isoField, boundary: scan.boundary };
    const state = applySheetEdit(uncorrectedSheet(scan.contours, scan.sheet), { kind: 'assign', characters: THREE_ROWS }, source);
    const assigned = { ...state.sheet, letters: state.sheet.letters.filter((l) => l.character !== null) };
    expect(assigned.letters).toHaveLength(39);
    const fitted = fitTracedSheet({ ...scan, contours: state.contours as TraceScanResult['contours'], sheet: assigned }, { guides: state.guides });
    const app = fontMetricsOf({ metrics: fittedMetrics(fitted) });

    expect(fitted.metrics.xHeight).toBeNull();
    expect(fitted.metrics.descender).toBeNull();
    expect(fitted.metrics.ascender).not.toBeNull();
    const { unitsPerEm, capHeight, xHeight, ascender, descender, lineGap } = built;
    expect(app).toEqual({ unitsPerEm, capHeight, xHeight, ascender, descender, lineGap });
    expect([capHeight, xHeight, descender]).toEqual([700, 490, -250]);
    expect(ascender).toBeGreaterThan(capHeight);
  });
});
