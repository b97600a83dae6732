// Locally adaptive thresholding on a page whose lighting falls off strongly: the case
// that defeats any single global threshold.

import { describe, expect, it } from 'vitest';
import { binarize, labelInkComponents, traceScan, type GreyRaster } from '../../core/raster/index.ts';
import { renderAntialiased } from './reference-render.ts';

const WIDTH = 640;
const HEIGHT = 160;
const RING_COUNT = 8;

/**
 * Eight rings (letter "o"s) across the page, lit from the left: the paper's brightness
 * falls from 250 to 50 and the ink (5 % reflectance) with it. On the dark side the paper
 * is darker than the ink on the bright side, so no single level separates them.
 */
function shadedPage(): GreyRaster {
  const clean = renderAntialiased(WIDTH, HEIGHT, (context) => {
    context.lineWidth = 9;
    context.strokeStyle = '#000000';
    for (let i = 0; i < RING_COUNT; i++) {
      context.beginPath();
      context.arc(40 + i * 80, 80, 26, 0, 2 * Math.PI);
      context.stroke();
    }
  }, 4);
  const data = new Uint8Array(WIDTH * HEIGHT);
  for (let row = 0; row < HEIGHT; row++) {
    for (let col = 0; col < WIDTH; col++) {
      const light = 250 - (200 * col) / (WIDTH - 1);
      const reflectance = 0.05 + 0.95 * (clean.data[row * WIDTH + col]! / 255);
      data[row * WIDTH + col] = Math.round(light * reflectance);
    }
  }
  return { width: WIDTH, height: HEIGHT, data };
}

describe('Sauvola thresholding on a shaded page', () => {
  const page = shadedPage();

  it('a global Otsu threshold cannot separate the letters on it (the premise)', () => {
    const otsu = labelInkComponents(binarize(page).mask);
    expect(otsu.count).not.toBe(RING_COUNT);
  });

  it('recovers every letter, each with its counter, where a global threshold fails', () => {
    const mask = binarize(page, { method: 'sauvola', windowSize: 61 }).mask;
    expect(labelInkComponents(mask).count).toBe(RING_COUNT);
    const rawSauvola = binarize(page, { method: 'sauvola', windowSize: 61, refineToLocalMidpoint: false }).mask;
    expect(labelInkComponents(rawSauvola).count).toBe(RING_COUNT);
    const result = traceScan({ raster: page, dpiX: 300 }, { method: 'sauvola' });
    expect(result.contours.filter((contour) => contour.depth === 0)).toHaveLength(RING_COUNT);
    expect(result.contours.filter((contour) => contour.depth === 1)).toHaveLength(RING_COUNT);
    expect(result.level).toBeNull();
  });

  it('places the boundary of each ring on its true circle even where the paper is dark', () => {
    const result = traceScan({ raster: page, dpiX: 300 }, { method: 'sauvola' });
    for (const contour of result.contours) {
      const centreX = 40 + Math.round((contour.points[0]!.x - 40) / 80) * 80;
      const radius = contour.depth === 0 ? 26 + 4.5 : 26 - 4.5;
      for (const point of contour.points) {
        // Reference: the stroked circle of radius 26 ± half the 9 px line width.
        expect(Math.abs(Math.hypot(point.x - centreX, point.y - 80) - radius)).toBeLessThan(0.5);
      }
    }
  });

  it('rejects a k outside the range used in practice with a message that says what to use', () => {
    expect(() => binarize(page, { method: 'sauvola', windowSize: 61, k: 0.9 })).toThrow(/between 0.2 and 0.5/);
  });
});
