// Locally adaptive thresholding by Sauvola's method, for scans whose paper is not evenly
// lit: a shadow, a gradient from a curled page or a phone photo defeats any single
// global threshold, while a threshold that follows the local mean and contrast does not.
//
// Method: J. Sauvola and M. Pietikäinen (2000), "Adaptive document image binarization",
// Pattern Recognition 33(2):225–236. Local statistics use summed-area tables:
// F. C. Crow (1984), "Summed-area tables for texture mapping", SIGGRAPH '84.

import { assertGreyRaster, assertOptionInRange } from './raster-validation.ts';
import { RasterError } from './raster-error.ts';
import type { GreyRaster, InkMask } from './types.ts';

/**
 * Sauvola's k, the weight of local contrast. Sauvola & Pietikäinen (2000) used 0.5;
 * later practice settles between 0.2 and 0.5, and 0.34 is a common middle value.
 */
export const SAUVOLA_DEFAULT_K = 0.34;
/** Smallest and largest k accepted: the range used in practice (see above). */
export const SAUVOLA_K_RANGE = [0.2, 0.5] as const;
/** Sauvola's R, the dynamic range of the standard deviation: 128 for 8-bit images (Sauvola & Pietikäinen 2000). */
export const SAUVOLA_DEFAULT_DYNAMIC_RANGE = 128;
/** Smallest window side in pixels that has any neighbourhood at all. */
const MIN_WINDOW_SIZE = 3;

export interface SauvolaOptions {
  /**
   * Side of the square window in pixels (odd; an even value is rounded up). It should
   * span a few stroke widths, so derive it from the scan resolution (the caller knows
   * the dpi; see binarize()).
   */
  readonly windowSize: number;
  /** Weight of local contrast, within {@link SAUVOLA_K_RANGE}. Default {@link SAUVOLA_DEFAULT_K}. */
  readonly k?: number;
  /** Dynamic range R of the standard deviation. Default {@link SAUVOLA_DEFAULT_DYNAMIC_RANGE}. */
  readonly dynamicRange?: number;
}

/**
 * Binarizes with Sauvola's threshold T = m·(1 + k·(s/R − 1)), where m and s are the mean
 * and standard deviation of the grey values in the window centred on each pixel
 * (clipped at the image border, statistics over the pixels actually inside). A pixel is
 * ink when its grey value ≤ T, so solid black (m = s = 0, T = 0) stays ink.
 *
 * Cost: two summed-area tables of (width + 1) × (height + 1) doubles, i.e. about
 * 16 bytes per pixel transiently (≈ 540 MB for a 600-dpi letter page) — all sums are
 * integers below 2⁵³, so they are exact. Time is O(width × height), independent of the
 * window size. The input is not modified.
 */
export function sauvolaMask(raster: GreyRaster, options: SauvolaOptions): InkMask {
  assertGreyRaster(raster);
  const { width, height, data: grey } = raster;
  const k = options.k ?? SAUVOLA_DEFAULT_K;
  const dynamicRange = options.dynamicRange ?? SAUVOLA_DEFAULT_DYNAMIC_RANGE;
  assertOptionInRange('sauvola.k', k, SAUVOLA_K_RANGE[0], SAUVOLA_K_RANGE[1], 'Use about 0.34; lower keeps faint strokes, higher suppresses background stains.');
  if (!Number.isFinite(dynamicRange) || dynamicRange <= 0) {
    throw new RasterError('bad-option', `The option sauvola.dynamicRange is ${String(dynamicRange)}; it must be a positive number (128 for 8-bit scans).`);
  }
  if (!Number.isFinite(options.windowSize) || options.windowSize < MIN_WINDOW_SIZE) {
    throw new RasterError(
      'bad-option',
      `The Sauvola window is ${String(options.windowSize)} px; it must be at least ${MIN_WINDOW_SIZE} px. Derive it from the scan resolution, e.g. a few stroke widths.`,
    );
  }
  const half = Math.floor(Math.round(options.windowSize) / 2);

  const stride = width + 1;
  const sum = new Float64Array(stride * (height + 1));
  const sumOfSquares = new Float64Array(stride * (height + 1));
  for (let row = 0; row < height; row++) {
    let rowSum = 0;
    let rowSquares = 0;
    const source = row * width;
    const above = row * stride;
    const here = above + stride;
    for (let col = 0; col < width; col++) {
      const value = grey[source + col]!;
      rowSum += value;
      rowSquares += value * value;
      sum[here + col + 1] = sum[above + col + 1]! + rowSum;
      sumOfSquares[here + col + 1] = sumOfSquares[above + col + 1]! + rowSquares;
    }
  }

  const ink = new Uint8Array(width * height);
  const contrastWeight = k / dynamicRange;
  for (let row = 0; row < height; row++) {
    const top = Math.max(0, row - half) * stride;
    const bottom = Math.min(height, row + half + 1) * stride;
    const rows = (bottom - top) / stride;
    for (let col = 0; col < width; col++) {
      const left = Math.max(0, col - half);
      const right = Math.min(width, col + half + 1);
      const count = rows * (right - left);
      const windowSum = sum[bottom + right]! - sum[top + right]! - sum[bottom + left]! + sum[top + left]!;
      const windowSquares = sumOfSquares[bottom + right]! - sumOfSquares[top + right]! - sumOfSquares[bottom + left]! + sumOfSquares[top + left]!;
      const mean = windowSum / count;
      const variance = windowSquares / count - mean * mean;
      const deviation = variance > 0 ? Math.sqrt(variance) : 0;
      const threshold = mean * (1 - k + contrastWeight * deviation);
      const index = row * width + col;
      ink[index] = grey[index]! <= threshold ? 1 : 0;
    }
  }
  return { width, height, data: ink };
}
