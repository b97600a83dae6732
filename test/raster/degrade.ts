// Synthetic scanning defects for the raster tests, written here rather than borrowed so
// that each effect is known exactly: Gaussian optical blur, uneven paper illumination,
// sensor noise from a seeded generator (tests must be repeatable), and dust specks.

import type { GreyRaster } from '../../core/raster/index.ts';
import { seededRandom } from '../support/seeded-random.ts';
export { seededRandom };


/** Standard normal deviates by the Box–Muller transform (Box & Muller 1958). */
export function gaussianSource(random: () => number): () => number {
  return () => {
    const u = 1 - random();
    const v = random();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
  };
}

/**
 * Separable Gaussian blur with standard deviation `sigma` px, kernel truncated at 4σ
 * and renormalised; the image is extended by repeating its edge pixels.
 */
export function gaussianBlur(values: Float64Array, width: number, height: number, sigma: number): Float64Array {
  const radius = Math.ceil(4 * sigma);
  const kernel = new Float64Array(2 * radius + 1);
  let total = 0;
  for (let i = -radius; i <= radius; i++) {
    const weight = Math.exp(-(i * i) / (2 * sigma * sigma));
    kernel[i + radius] = weight;
    total += weight;
  }
  for (let i = 0; i < kernel.length; i++) kernel[i]! /= total;
  const horizontal = new Float64Array(values.length);
  for (let row = 0; row < height; row++) {
    for (let col = 0; col < width; col++) {
      let sum = 0;
      for (let i = -radius; i <= radius; i++) {
        const c = Math.min(width - 1, Math.max(0, col + i));
        sum += kernel[i + radius]! * values[row * width + c]!;
      }
      horizontal[row * width + col] = sum;
    }
  }
  const out = new Float64Array(values.length);
  for (let row = 0; row < height; row++) {
    for (let col = 0; col < width; col++) {
      let sum = 0;
      for (let i = -radius; i <= radius; i++) {
        const r = Math.min(height - 1, Math.max(0, row + i));
        sum += kernel[i + radius]! * horizontal[r * width + col]!;
      }
      out[row * width + col] = sum;
    }
  }
  return out;
}

export interface Degradation {
  /** Blur σ in px. */
  readonly blurSigma: number;
  /** Paper brightness at the left edge and at the right edge (linear in x, 0–255). */
  readonly paperLeft: number;
  readonly paperRight: number;
  /** Reflectance of ink relative to paper (0 = perfectly black). */
  readonly inkReflectance: number;
  /** Standard deviation of additive sensor noise, grey levels. */
  readonly noiseSigma: number;
  /** Dust specks: discs drawn before blurring. */
  readonly specks: readonly { readonly x: number; readonly y: number; readonly radius: number }[];
  readonly seed: number;
}

/**
 * A degraded copy of a clean black-on-white render. The clean grey g gives a
 * reflectance r = ink + (1 − ink)·g/255; specks are painted in (reflectance of ink),
 * the result is blurred, lit by the paper gradient and noised, then rounded and clamped.
 */
export function degrade(clean: GreyRaster, degradation: Degradation): GreyRaster {
  const { width, height } = clean;
  const reflectance = new Float64Array(width * height);
  const ink = degradation.inkReflectance;
  for (let i = 0; i < reflectance.length; i++) reflectance[i] = ink + (1 - ink) * (clean.data[i]! / 255);
  for (const speck of degradation.specks) {
    for (let row = Math.floor(speck.y - speck.radius - 1); row <= Math.ceil(speck.y + speck.radius + 1); row++) {
      for (let col = Math.floor(speck.x - speck.radius - 1); col <= Math.ceil(speck.x + speck.radius + 1); col++) {
        if (row < 0 || col < 0 || row >= height || col >= width) continue;
        if (Math.hypot(col + 0.5 - speck.x, row + 0.5 - speck.y) <= speck.radius) reflectance[row * width + col] = ink;
      }
    }
  }
  const blurred = gaussianBlur(reflectance, width, height, degradation.blurSigma);
  const noise = gaussianSource(seededRandom(degradation.seed));
  const data = new Uint8Array(width * height);
  for (let row = 0; row < height; row++) {
    for (let col = 0; col < width; col++) {
      const paper = degradation.paperLeft + ((degradation.paperRight - degradation.paperLeft) * col) / Math.max(1, width - 1);
      const value = paper * blurred[row * width + col]! + degradation.noiseSigma * noise();
      data[row * width + col] = Math.max(0, Math.min(255, Math.round(value)));
    }
  }
  return { width, height, data };
}
