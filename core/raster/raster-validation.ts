// Entry checks for rasters, masks and numeric options. Every public function of the
// stage validates its inputs here first, so a malformed image fails with a message that
// says what was wrong instead of producing garbage contours or an out-of-bounds read.

import { RasterError } from './raster-error.ts';
import type { GreyRaster, InkMask } from './types.ts';

function describeSize(width: unknown, height: unknown): string {
  return `${String(width)}×${String(height)}`;
}

function assertGrid(kind: string, width: number, height: number, data: unknown): void {
  if (!Number.isInteger(width) || !Number.isInteger(height) || width <= 0 || height <= 0) {
    throw new RasterError(
      'bad-raster',
      `The ${kind} has size ${describeSize(width, height)}: width and height must be positive whole numbers of pixels. Decode the image again or check the crop.`,
    );
  }
  if (!(data instanceof Uint8Array)) {
    throw new RasterError(
      'bad-raster',
      `The ${kind} data is not a Uint8Array (one byte per pixel). Convert it first, e.g. take one channel of RGBA data into a new Uint8Array(width * height).`,
    );
  }
  if (data.length !== width * height) {
    throw new RasterError(
      'bad-raster',
      `The ${kind} is ${describeSize(width, height)} = ${width * height} pixels but its data holds ${data.length} bytes. Pass exactly one byte per pixel, row by row, with no padding.`,
    );
  }
}

/** Throws `bad-raster` unless `raster` is a well-formed {@link GreyRaster}. */
export function assertGreyRaster(raster: GreyRaster): void {
  assertGrid('raster', raster.width, raster.height, raster.data);
}

/** Throws `bad-raster` unless `mask` is a well-formed {@link InkMask} (values 0/1 are not re-checked). */
export function assertInkMask(mask: InkMask): void {
  assertGrid('ink mask', mask.width, mask.height, mask.data);
}

/** Throws `bad-raster` unless the raster and the mask are the same size. */
export function assertSameGrid(raster: GreyRaster, mask: InkMask): void {
  if (raster.width !== mask.width || raster.height !== mask.height) {
    throw new RasterError(
      'bad-raster',
      `The ink mask is ${describeSize(mask.width, mask.height)} but the raster is ${describeSize(raster.width, raster.height)}. Binarize the same raster you trace.`,
    );
  }
}

/** Throws `bad-option` unless `value` is a finite number within [min, max]. */
export function assertOptionInRange(name: string, value: number, min: number, max: number, hint: string): void {
  if (!Number.isFinite(value) || value < min || value > max) {
    throw new RasterError('bad-option', `The option ${name} is ${String(value)}; it must be between ${min} and ${max}. ${hint}`);
  }
}
