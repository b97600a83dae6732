// Vertical metrics measured from a sheet of letters match the font the sheet was
// drawn from: Cantarell Regular (Debian fonts-cantarell) declares cap height 694 and
// x-height 482 in its OS/2 table, and its l, p, q outlines reach 739 and −217 units.
// The sheet is rasterized by an independent renderer (Skia via @napi-rs/canvas).
import { expect, it } from 'vitest';
import { traceScan } from '../../core/raster/index.ts';
import { measureSheetMetrics, unitsPerPixel } from '../../core/metrics/index.ts';
import { addGlyphPath, loadFont, renderAntialiased } from '../raster/reference-render.ts';
import { CANTARELL, describeWithFont } from '../raster/require-font.ts';

/** Pixels per font unit: a cap height of about 208 px, as a 600-dpi scan of 9 mm capitals. */
const SCALE = 0.3;
const ROWS = [
  { text: 'HIEFTZ', baseline: 300 },
  { text: 'xzvwlbhkpq', baseline: 620 },
];

describeWithFont('metrics measured from a sheet', CANTARELL, () => {
  const font = loadFont(CANTARELL.path);
  const raster = renderAntialiased(1900, 760, (context) => {
    context.beginPath();
    for (const row of ROWS) {
      let x = 40;
      for (const character of row.text) {
        const glyph = font.charToGlyph(character);
        addGlyphPath(context, glyph.path.commands, { scale: SCALE, originX: x, originY: row.baseline });
        x += (glyph.advanceWidth ?? 500) * SCALE + 20;
      }
    }
    context.fill('nonzero');
  });
  const traced = traceScan({ raster: { ...raster, dpi: 600 } }, { characters: ROWS.map((r) => r.text).join(' ') });
  const metrics = measureSheetMetrics(traced.sheet, traced.contours);

  it('finds each row and its baseline where the letters were set', () => {
    expect(traced.sheet.letters.map((l) => l.character).join('')).toBe(ROWS.map((r) => r.text).join(''));
    for (const [i, row] of ROWS.entries()) expect(Math.abs((traced.sheet.rows[i]?.baseline ?? 0) - row.baseline)).toBeLessThan(0.5);
  });

  it('measures the cap height and x-height the font declares (OS/2 sCapHeight 694, sxHeight 482)', () => {
    expect(metrics.capHeight?.pixels).toBeCloseTo(694 * SCALE, 0); // within 0.5 px of 208.2 px
    expect(metrics.xHeight?.pixels).toBeCloseTo(482 * SCALE, 0);
    expect(metrics.capHeight?.letters).toBe('HIEFTZ');
  });

  it('measures ascender and descender from flat-ended stems (Cantarell l: 739, p/q: −217 units)', () => {
    expect(metrics.ascender?.pixels).toBeCloseTo(739 * SCALE, 0);
    expect(metrics.descender?.pixels).toBeCloseTo(-217 * SCALE, 0);
  });

  it('scales the drawn cap height to the chosen cap height in units', () => {
    expect(unitsPerPixel(metrics, 700) * (metrics.capHeight?.pixels ?? 0)).toBeCloseTo(700, 9);
    expect(unitsPerPixel(metrics, 700)).toBeCloseTo(700 / (694 * SCALE), 2);
  });

  it('says which letters would give a metric the sheet lacks', () => {
    const capsOnly = traceScan({ raster: { ...raster, dpi: 600 } }, { characters: 'HIEFTZ' });
    const partial = measureSheetMetrics(capsOnly.sheet, capsOnly.contours);
    expect(partial.xHeight).toBeNull();
    expect(partial.notes.join(' ')).toMatch(/No flat-topped lower-case letter \(xzvwyu\)/);
  });
});
