// Chooses the boundary geometry for a mask: exact pixel edges when the raster carries
// no grey information (a 1-bit scan, pixel art), sub-pixel marching squares otherwise.
// Both share the crack-loop topology, so the choice changes positions, never counts.

import { uniformIsoLevel, type IsoLevelField } from './iso-level-field.ts';
import { marchingSquaresChains } from './marching-squares.ts';
import { pixelEdgeChains } from './pixel-edges.ts';
import { assertGreyRaster, assertInkMask, assertSameGrid } from './raster-validation.ts';
import type { GreyRaster, InkMask, Point } from './types.ts';

export type BoundaryMethod = 'auto' | 'marching-squares' | 'pixel-edges';

export interface TraceBoundariesOptions {
  /** 'auto' (default): pixel edges for a bilevel raster, marching squares otherwise. */
  readonly method?: BoundaryMethod;
  /** Iso-level field for marching squares; takes precedence over `isoLevel`. */
  readonly isoField?: IsoLevelField;
  /** Uniform iso-level for marching squares. Default {@link DEFAULT_ISO_LEVEL}. */
  readonly isoLevel?: number;
}

export interface TracedBoundaries {
  readonly method: 'marching-squares' | 'pixel-edges';
  /** Closed chains, unnested, in raster order of their topmost-left crack. */
  readonly chains: Point[][];
}

/** Iso-level when none is given: the middle of the 8-bit scale, between 127 and 128. */
export const DEFAULT_ISO_LEVEL = 127.5;
/** The two values a bilevel 8-bit raster may hold. */
const BLACK = 0;
const WHITE = 255;

/** True when every pixel is 0 or 255 (stops at the first other value). */
export function isBilevel(raster: GreyRaster): boolean {
  assertGreyRaster(raster);
  const data = raster.data;
  for (let i = 0; i < data.length; i++) {
    const value = data[i]!;
    if (value !== BLACK && value !== WHITE) return false;
  }
  return true;
}

/**
 * Boundary chains of `mask`, using `raster` (ink dark, same size) for sub-pixel
 * positions. Orientation, connectivity and chain guarantees are those of
 * pixelEdgeChains / marchingSquaresChains; the chain count and order are the same
 * whichever method runs.
 */
export function traceBoundaries(raster: GreyRaster, mask: InkMask, options: TraceBoundariesOptions = {}): TracedBoundaries {
  assertGreyRaster(raster);
  assertInkMask(mask);
  assertSameGrid(raster, mask);
  const requested = options.method ?? 'auto';
  const method = requested === 'auto' ? (isBilevel(raster) ? 'pixel-edges' : 'marching-squares') : requested;
  if (method === 'pixel-edges') return { method, chains: pixelEdgeChains(mask) };
  const isoField = options.isoField ?? uniformIsoLevel(options.isoLevel ?? DEFAULT_ISO_LEVEL);
  return { method, chains: marchingSquaresChains(raster, mask, isoField) };
}
