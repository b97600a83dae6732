// The scan's edge blur, measured on its own edges (core/raster/edge-blur.ts), checked
// against blur of known size: a shape rendered by an independent rasterizer (Skia via
// @napi-rs/canvas) and blurred by a Gaussian of known σ (test/raster/degrade.ts). The
// expected figure combines that σ with the render's own anti-aliasing (a one-pixel box,
// σ = 1/√12 px) in quadrature, as variances of independent blurs add.
import { describe, expect, it } from 'vitest';
import { PIXEL_APERTURE_SIGMA_PX, traceScan } from '../../core/raster/index.ts';
import type { GreyRaster } from '../../core/raster/index.ts';
import { degrade } from './degrade.ts';
import { renderAntialiased } from './reference-render.ts';

/** A letter-like shape with long straight and curved edges: a thick ring with a square notch. */
function shape(): GreyRaster {
  return renderAntialiased(220, 200, (context) => {
    context.beginPath();
    context.arc(110.3, 100.6, 70, 0, 2 * Math.PI);
    context.moveTo(110.3 + 35, 100.6);
    context.arc(110.3, 100.6, 35, 0, 2 * Math.PI, true);
    context.fill('nonzero');
    context.fillStyle = '#fff';
    context.fillRect(150.2, 60.7, 45, 30);
  }, 4);
}

describe('edge blur estimate', () => {
  for (const sigma of [0.8, 1.2, 2]) {
    it(`measures a Gaussian blur of σ = ${sigma} px within 12 %`, () => {
      const blurred = degrade(shape(), { blurSigma: sigma, paperLeft: 240, paperRight: 200, inkReflectance: 0.1, noiseSigma: 3, specks: [], seed: 7 });
      const { edgeBlurPx } = traceScan({ raster: blurred, dpiX: 300 });
      const expected = Math.hypot(sigma, PIXEL_APERTURE_SIGMA_PX);
      expect(edgeBlurPx).not.toBeNull();
      expect(Math.abs(edgeBlurPx! - expected) / expected).toBeLessThanOrEqual(0.12);
    });
  }

  it('reports a sharp anti-aliased render as about the pixel aperture, far below a blurred scan', () => {
    const { edgeBlurPx } = traceScan({ raster: shape(), dpiX: 300 });
    expect(edgeBlurPx).not.toBeNull();
    expect(edgeBlurPx!).toBeGreaterThanOrEqual(PIXEL_APERTURE_SIGMA_PX);
    expect(edgeBlurPx!).toBeLessThan(0.6);
  });

  it('has no figure for a bilevel scan, whose edges carry no profile', () => {
    const grey = shape();
    const bilevel: GreyRaster = { ...grey, data: grey.data.map((v) => (v < 128 ? 0 : 255)) };
    expect(traceScan({ raster: bilevel, dpiX: 300 }).edgeBlurPx).toBeNull();
  });
});
