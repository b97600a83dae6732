// The 256-bin grey-level histogram of a raster: the only statistic global thresholding
// needs, computed in one pass with no allocation beyond the bins themselves.

import { assertGreyRaster } from './raster-validation.ts';
import type { GreyRaster } from './types.ts';

/** Number of grey levels in an 8-bit raster. */
export const GREY_LEVELS = 256;

/**
 * Counts pixels per grey level. `result[v]` is the number of pixels whose value is `v`;
 * the counts sum to width × height. Float64Array so that sums over it never overflow.
 */
export function greyHistogram(raster: GreyRaster): Float64Array {
  assertGreyRaster(raster);
  // Integer counting in a Uint32Array is faster than incrementing doubles; a page has
  // far fewer than 2³² pixels (the decoder cannot produce one that large).
  const counts = new Uint32Array(GREY_LEVELS);
  const data = raster.data;
  const n = data.length;
  for (let i = 0; i < n; i++) {
    counts[data[i]!]!++;
  }
  return Float64Array.from(counts);
}
