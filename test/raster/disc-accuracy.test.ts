// Sub-pixel accuracy on the simplest curved shape with a known answer: a disc, rendered
// with anti-aliasing by an independent rasterizer (Skia, via @napi-rs/canvas).
//
// Pixel frame: canvas pixel (i, j) covers [i, i + 1] × [j, j + 1], y down — the same as
// Stemline's — so the canvas centre (cx, cy) and radius r are the traced circle's.

import { describe, expect, it } from 'vitest';
import { traceScan } from '../../core/raster/index.ts';
import { renderDisc } from './reference-render.ts';

/**
 * Largest allowed distance from a traced point to the true circle. Linear interpolation
 * between pixel centres of an area-sampled (box-filtered) step edge is itself biased
 * by up to 3/2 − √2 ≈ 0.086 px (edge covering 1/√2 of a pixel), so 0.1 px is close to
 * the best this method can do on a sharp render.
 */
const CIRCLE_TOLERANCE_PX = 0.1;

const cases = [
  { cx: 20.25, cy: 20.6, radius: 8.2 },
  { cx: 30.5, cy: 30.5, radius: 12.3 },
  { cx: 30.37, cy: 29.81, radius: 20.5 },
  { cx: 50.13, cy: 49.71, radius: 30.7 },
  { cx: 80.9, cy: 80.35, radius: 61.25 },
];

describe('disc traced from an anti-aliased render', () => {
  it.each(cases)('stays within 0.1 px of the true circle (r = $radius, centre $cx, $cy)', ({ cx, cy, radius }) => {
    const size = Math.ceil(cx + radius + 4);
    const result = traceScan({ raster: renderDisc(size, size, cx, cy, radius), dpiX: 600 });
    expect(result.boundary).toBe('marching-squares');
    expect(result.contours).toHaveLength(1);
    const [contour] = result.contours;
    let worst = 0;
    for (const point of contour!.points) worst = Math.max(worst, Math.abs(Math.hypot(point.x - cx, point.y - cy) - radius));
    // Reference: the exact circle the canvas was asked to draw.
    expect(worst).toBeLessThanOrEqual(CIRCLE_TOLERANCE_PX);
    // The traced area matches πr² to within the same boundary tolerance (perimeter × 0.1 px).
    expect(Math.abs(contour!.area - Math.PI * radius * radius)).toBeLessThan(2 * Math.PI * radius * CIRCLE_TOLERANCE_PX);
    expect(contour!.area).toBeGreaterThan(0);
  });
});
