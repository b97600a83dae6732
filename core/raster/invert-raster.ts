// Photographic negative of a raster. The whole stage assumes dark ink on light paper;
// white-on-black artwork (a chalkboard, a linocut print scanned as a negative) is
// turned the right way round once, up front, instead of every step handling both.

import { assertGreyRaster } from './raster-validation.ts';
import type { GreyRaster } from './types.ts';

/** Brightest grey level; a value v maps to MAX_GREY − v. */
const MAX_GREY = 255;

/** A new raster with every value v replaced by 255 − v; dpi metadata is kept. */
export function invertRaster(raster: GreyRaster): GreyRaster {
  assertGreyRaster(raster);
  const source = raster.data;
  const inverted = new Uint8Array(source.length);
  for (let i = 0; i < source.length; i++) inverted[i] = MAX_GREY - source[i]!;
  return raster.dpi === undefined
    ? { width: raster.width, height: raster.height, data: inverted }
    : { width: raster.width, height: raster.height, data: inverted, dpi: raster.dpi };
}
