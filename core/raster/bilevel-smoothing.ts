/**
 * Smooth boundaries for 1-bit scans: the ink mask blurred by a small Gaussian, for
 * marching squares to place the boundary on.
 *
 * A 1-bit scan (a Group 4 office scan, a thresholded photocopy) keeps no grey, so its
 * exact boundary is the pixel staircase: along a diagonal it steps a whole pixel every
 * few pixels, and a curve fitter held to less than a pixel follows the steps with a
 * point every few pixels (measured on a 600-dpi alphabet sheet: 11× the segments of the
 * same sheet in grey). The drawn edge runs through the middle of the steps. Blurring
 * the mask with a Gaussian of σ about a pixel and tracing its half-level is the
 * anti-aliasing the scanner did not keep: the half-level runs through the steps'
 * middles, a straight edge comes out straight, and a corner is rounded by the blur
 * exactly as a grey scan's optics round it, so the fitter's blurred-corner model
 * (core/fit/corners.ts) applies with σ known.
 *
 * The mask, not the blurred field, still decides which pixels are ink: marching squares
 * takes its topology from the mask (marching-squares.ts), so contour counts, nesting
 * and letters are those of the exact trace; only the positions move, by at most half a
 * pixel plus the clamp to the mask's side of each crack.
 */
import type { GreyRaster, InkMask } from './types.ts';

/**
 * Blur σ (px) for 1-bit scans: 0.8 px. Large enough that the half-level of a staircase
 * with steps two or more pixels long runs smoothly through their middles (at σ = 0.5 px
 * the level still bends at every step), small enough that it rounds corners no more
 * than a clean grey scan (σ ≈ 0.5–0.6 px measured by edge-blur.ts on clean renders) and
 * keeps hairlines two pixels wide. Measured on the round trip's glyphs thresholded to
 * 1 bit (test/raster/bilevel-smoothing.test.ts).
 */
export const BILEVEL_SMOOTHING_SIGMA_PX = 0.8;

/** Kernel half-width in σ: a Gaussian's weight beyond 3 σ is 0.3 %, below a grey level. */
const KERNEL_HALF_WIDTH_SIGMAS = 3;
const INK_GREY = 0;
const PAPER_GREY = 255;

/**
 * The edge blur (px) a fitter should assume for boundaries traced on the smoothed
 * mask: the smoothing σ combined with the 1-bit quantization of the edge position
 * (uniform over a pixel: variance 1/12 px²).
 */
export function smoothedBilevelBlurPx(sigma = BILEVEL_SMOOTHING_SIGMA_PX): number {
  return Math.sqrt(sigma * sigma + 1 / 12);
}

/**
 * The noise σ (px) a fitter should assume across boundaries traced on the smoothed
 * mask: the 1-bit quantization of the edge position, uniform over a pixel, whose
 * standard deviation is 1/√12 px (the standard result for uniform quantization). The
 * staircase's errors are not independent from point to point, so the scatter measured
 * along a smoothed boundary (core/fit/local-line.ts) understates it: on straight
 * axis-aligned edges it is nearly zero.
 */
export const SMOOTHED_BILEVEL_NOISE_PX = 1 / Math.sqrt(12);

/**
 * The mask as greys (ink 0, paper 255) blurred by a Gaussian of `sigma` px, separably,
 * with paper beyond the image border. Pixels farther than the kernel from any edge keep
 * their exact value, so the field agrees with the mask everywhere but near edges.
 */
export function smoothedMaskField(mask: InkMask, sigma = BILEVEL_SMOOTHING_SIGMA_PX): GreyRaster {
  if (!(sigma > 0) || !Number.isFinite(sigma)) throw new RangeError(`the smoothing σ must be a positive number of pixels, got ${String(sigma)}`);
  const { width, height, data } = mask;
  const radius = Math.max(1, Math.ceil(KERNEL_HALF_WIDTH_SIGMAS * sigma));
  const kernel = new Float64Array(2 * radius + 1);
  let total = 0;
  for (let k = -radius; k <= radius; k++) total += kernel[k + radius] = Math.exp(-(k * k) / (2 * sigma * sigma));
  for (let k = 0; k < kernel.length; k++) kernel[k]! /= total;
  // Horizontal pass on "paper fraction" (1 paper, 0 ink), then vertical, in floats.
  const horizontal = new Float32Array(width * height);
  for (let y = 0; y < height; y++) {
    const row = y * width;
    for (let x = 0; x < width; x++) {
      let sum = 0;
      for (let k = -radius; k <= radius; k++) {
        const xx = x + k;
        const paper = xx < 0 || xx >= width ? 1 : data[row + xx] ? 0 : 1;
        sum += kernel[k + radius]! * paper;
      }
      horizontal[row + x] = sum;
    }
  }
  const out = new Uint8Array(width * height);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      let sum = 0;
      for (let k = -radius; k <= radius; k++) {
        const yy = y + k;
        sum += kernel[k + radius]! * (yy < 0 || yy >= height ? 1 : horizontal[yy * width + x]!);
      }
      out[y * width + x] = Math.round(INK_GREY + (PAPER_GREY - INK_GREY) * sum);
    }
  }
  return { width, height, data: out };
}
