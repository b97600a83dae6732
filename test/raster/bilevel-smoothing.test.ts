// Boundaries of 1-bit scans for fitting: what a user would notice if this broke — a
// Group 4 office scan fitted with a point every few pixels along the staircase of its
// pixels, instead of with the few points the same letter gets from a grey scan.
//
// References: circles and half-planes rendered by Skia (@napi-rs/canvas) and thresholded
// at the middle grey, as a 1-bit scanner does; the true geometry is the analytic circle
// and line. Glyphs from Debian's fonts-cantarell.

import { describe, expect, it } from 'vitest';
import { BILEVEL_SMOOTHING_SIGMA_PX, smoothedBilevelBlurPx, smoothedMaskField, traceScan, type GreyRaster } from '../../core/raster/index.ts';
import { fitGlyph } from '../../core/fit/index.ts';
import { addGlyphPath, loadFont, renderAntialiased, renderDisc, renderRings } from './reference-render.ts';
import { CANTARELL, describeWithFont } from './require-font.ts';

/** A 1-bit scanner's fixed threshold: the middle of the grey scale. */
const ONE_BIT_THRESHOLD = 128;
const rms = (values: readonly number[]): number => Math.sqrt(values.reduce((t, v) => t + v * v, 0) / values.length);
const oneBit = (raster: GreyRaster): GreyRaster => ({ ...raster, data: raster.data.map((v) => (v < ONE_BIT_THRESHOLD ? 0 : 255)) });

describe('smoothed boundaries of 1-bit scans', () => {
  it('follow a circle three times closer than the pixel staircase, and never more than half a pixel off', () => {
    for (const [cx, cy, r] of [[60.3, 58.7, 41.2], [50.5, 51.1, 17.8], [70.2, 69.6, 55.5]] as const) {
      const scan = oneBit(renderDisc(140, 140, cx, cy, r));
      const errors = (smooth: boolean): number[] => {
        const traced = traceScan({ raster: scan, dpiX: 600 }, { smoothBilevel: smooth });
        return traced.contours[0]!.points.map((p) => Math.abs(Math.hypot(p.x - cx, p.y - cy) - r));
      };
      const smoothed = errors(true);
      // Measured: RMS 0.15–0.17 px smoothed, 0.44–0.45 px along the pixel edges.
      expect(rms(smoothed)).toBeLessThanOrEqual(0.2);
      expect(rms(errors(false))).toBeGreaterThan(0.4);
      // Marching squares keeps each crossing on the mask's side of its crack (marching-squares.ts).
      expect(Math.max(...smoothed)).toBeLessThanOrEqual(0.5 + 1e-9);
    }
  });

  it('run along a sloped edge through the middle of its steps', () => {
    // A half-plane whose edge climbs 1 px every 7 px: the staircase is 1 px high.
    const slope = 1 / 7;
    const raster = oneBit(renderAntialiased(200, 120, (context) => {
      context.beginPath();
      context.moveTo(-10, 40 - 10 * slope);
      context.lineTo(210, 40 + 210 * slope);
      context.lineTo(210, 130);
      context.lineTo(-10, 130);
      context.closePath();
      context.fill();
    }));
    const distances = (smooth: boolean): number[] => {
      const traced = traceScan({ raster, dpiX: 600 }, { smoothBilevel: smooth });
      const distance = (p: { x: number; y: number }): number => Math.abs(p.y - (40 + p.x * slope)) / Math.hypot(1, slope);
      // Away from the image border (the blur sees paper beyond it).
      return traced.contours[0]!.points.filter((p) => p.x > 20 && p.x < 180 && p.y < 80).map(distance);
    };
    const smoothed = distances(true);
    expect(smoothed.length).toBeGreaterThan(100);
    // Measured: RMS 0.20 px and at most 0.34 px smoothed; RMS 0.50 px along the pixel edges.
    expect(rms(smoothed)).toBeLessThanOrEqual(0.25);
    expect(Math.max(...smoothed)).toBeLessThanOrEqual(0.4);
    expect(rms(distances(false))).toBeGreaterThan(0.45);
  });

  it('keep the contours, their nesting and the letters of the exact trace', () => {
    const raster = oneBit(renderRings(160, 160, 80.4, 79.7, [70, 52, 33, 14]));
    const exact = traceScan({ raster, dpiX: 600 });
    const smooth = traceScan({ raster, dpiX: 600 }, { smoothBilevel: true });
    expect(exact.boundary).toBe('pixel-edges');
    expect(smooth.boundary).toBe('marching-squares');
    expect(smooth.contours.map((c) => c.depth)).toEqual(exact.contours.map((c) => c.depth));
    expect(smooth.sheet.letters.length).toBe(exact.sheet.letters.length);
    // The blur a fitter should assume: the smoothing combined with the edge's 1-bit quantization.
    expect(smooth.edgeBlurPx).toBeCloseTo(Math.sqrt(BILEVEL_SMOOTHING_SIGMA_PX ** 2 + 1 / 12), 12);
    expect(exact.edgeBlurPx).toBeNull();
    // The noise it should assume: the 1-bit quantization of the edge, uniform over a pixel (σ = 1/√12 px).
    expect(smooth.edgeNoisePx).toBeCloseTo(1 / Math.sqrt(12), 12);
    expect(exact.edgeNoisePx).toBeNull();
  });

  it('leave ink and paper far from any edge at their exact greys', () => {
    const mask = { width: 30, height: 20, data: new Uint8Array(30 * 20) };
    for (let y = 5; y < 15; y++) for (let x = 5; x < 25; x++) mask.data[y * 30 + x] = 1;
    const field = smoothedMaskField(mask);
    expect(field.data[10 * 30 + 15]).toBe(0);
    expect(field.data[1 * 30 + 1]).toBe(255);
    expect(field.data[10 * 30 + 4]).toBeGreaterThan(127);
    expect(field.data[10 * 30 + 5]).toBeLessThan(128);
    expect(smoothedBilevelBlurPx(1)).toBeCloseTo(Math.sqrt(1 + 1 / 12), 12);
    expect(() => smoothedMaskField(mask, 0)).toThrow(/positive number of pixels/);
  });
});

describeWithFont('fitting a 1-bit scan of Cantarell', CANTARELL, () => {
  it('needs about as few segments as the same letters scanned in grey', () => {
    const font = loadFont(CANTARELL.path);
    const count = (characters: string, oneBitScan: boolean, smooth: boolean): number => {
      let segments = 0;
      for (const character of characters) {
        const commands = font.charToGlyph(character).path.commands;
        const placement = { scale: 1, originX: 30.37, originY: 760.61 };
        let raster = renderAntialiased(720, 820, (context) => {
          context.beginPath();
          addGlyphPath(context, commands, placement);
          context.fill('nonzero');
        }, 4);
        if (oneBitScan) raster = oneBit(raster);
        const traced = traceScan({ raster, dpiX: 300 }, { smoothBilevel: smooth });
        const chains = traced.contours.map((c) => ({ depth: c.depth, points: c.points.map((p) => ({ x: p.x - placement.originX, y: placement.originY - p.y })) }));
        const fit = fitGlyph(chains, traced.edgeBlurPx === null ? {} : { scanBlurPx: traced.edgeBlurPx });
        segments += fit.report.segmentCount;
      }
      return segments;
    };
    const grey = count('agS8', false, false);
    const smoothed = count('agS8', true, true);
    expect(smoothed).toBeLessThanOrEqual(Math.ceil(1.15 * grey));
    // The staircase itself, for comparison (one letter: fitting it is slow).
    expect(count('S', true, false)).toBeGreaterThan(3 * count('S', false, false));
  }, 120_000);
});
