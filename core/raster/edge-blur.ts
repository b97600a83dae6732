/**
 * How blurred the scan's ink edges are: one figure per scan, in pixels.
 *
 * A scan rounds every drawn corner by its blur (optics, ink spread, the sensor's pixel
 * aperture, a renderer's anti-aliasing), and the fitter needs that figure to tell a
 * corner the scan rounded from a rounding the designer drew (core/fit/corners.ts).
 * It is measured on the scan's own edges: across an edge blurred by a Gaussian of
 * standard deviation σ, the grey profile is the step convolved with the Gaussian (the
 * edge-spread function), which rises from 25 % to 75 % of the step over 2·0.6745·σ =
 * 1.349 σ (the interquartile range of the normal distribution). The profile is sampled
 * along the grey gradient at boundary points, normalised by its own paper and ink
 * plateaus (so that paper gradients do not matter), and the median width over the
 * page's edges gives σ, after removing in quadrature the spread that reading the
 * profile by linear interpolation adds (the triangle kernel of half-width one pixel has
 * variance 1/6 px²). Edges whose plateaus differ by less than half the page's ink
 * contrast (hairlines narrower than the profile, faint ink) are skipped.
 *
 * Bilevel scans (1-bit, or already thresholded) carry no edge profile: the result is
 * null, and the fitter falls back to its conservative default.
 */
import type { PaperAndInkLevels } from './threshold-otsu.ts';
import type { Contour, GreyRaster } from './types.ts';

/** Interquartile range of the standard normal distribution, 2 × 0.6745 (any statistics table). */
const NORMAL_INTERQUARTILE_RANGE = 1.349;
/**
 * Least blur reported, px: the box aperture of one pixel has a standard deviation of
 * 1/√12 ≈ 0.29 px, and no sampled edge is sharper than its own pixels.
 */
export const PIXEL_APERTURE_SIGMA_PX = 1 / Math.sqrt(12);
/** Variance of linear interpolation between pixel centres, px²: the triangle kernel's, 1/6. */
const INTERPOLATION_VARIANCE_PX2 = 1 / 6;
/** Half-length of the sampled profile across an edge, px: room for σ up to about 2 px. */
const PROFILE_HALF_LENGTH_PX = 5;
/** Sampling step along the profile, px. */
const PROFILE_STEP_PX = 0.25;
/** Samples at each end of the profile averaged as its plateau. */
const PLATEAU_SAMPLES = 4;
/** An edge counts when its plateaus differ by at least this share of the page's contrast. */
const MIN_EDGE_CONTRAST_SHARE = 0.5;
/** Boundary points measured at most (evenly spread over the page), to bound the cost. */
const MAX_MEASURED_POINTS = 4000;
/** Fewest usable edges for a figure; below it the page is too small or too faint to say. */
const MIN_MEASURED_EDGES = 20;

/** Bilinear grey value at (x, y) in the pixel frame (pixel centres at col + 0.5). */
function greyAt(raster: GreyRaster, x: number, y: number): number {
  const fx = Math.min(Math.max(x - 0.5, 0), raster.width - 1);
  const fy = Math.min(Math.max(y - 0.5, 0), raster.height - 1);
  const c0 = Math.min(Math.floor(fx), raster.width - 2 < 0 ? 0 : raster.width - 2);
  const r0 = Math.min(Math.floor(fy), raster.height - 2 < 0 ? 0 : raster.height - 2);
  const c1 = Math.min(c0 + 1, raster.width - 1);
  const r1 = Math.min(r0 + 1, raster.height - 1);
  const tx = fx - c0;
  const ty = fy - r0;
  const d = raster.data;
  const top = d[r0 * raster.width + c0]! * (1 - tx) + d[r0 * raster.width + c1]! * tx;
  const bottom = d[r1 * raster.width + c0]! * (1 - tx) + d[r1 * raster.width + c1]! * tx;
  return top * (1 - ty) + bottom * ty;
}

/** Offset (px, along the profile) where it first reaches `level` walking out from the middle towards the paper side. */
function crossing(profile: Float64Array, level: number, middle: number): number | undefined {
  for (let k = middle; k + 1 < profile.length; k++) {
    if ((profile[k]! - level) * (profile[k + 1]! - level) <= 0 && profile[k] !== profile[k + 1]) {
      return (k + (level - profile[k]!) / (profile[k + 1]! - profile[k]!) - middle) * PROFILE_STEP_PX;
    }
  }
  for (let k = middle; k > 0; k--) {
    if ((profile[k]! - level) * (profile[k - 1]! - level) <= 0 && profile[k] !== profile[k - 1]) {
      return (k - (level - profile[k]!) / (profile[k - 1]! - profile[k]!) - middle) * PROFILE_STEP_PX;
    }
  }
  return undefined;
}

/** The width from 25 % to 75 % of one edge's profile, or undefined where the edge is unusable. */
function edgeWidth(raster: GreyRaster, x: number, y: number, contrast: number): number | undefined {
  // The gradient by central differences one pixel apart: its direction is the profile's.
  const gx = greyAt(raster, x + 1, y) - greyAt(raster, x - 1, y);
  const gy = greyAt(raster, x, y + 1) - greyAt(raster, x, y - 1);
  const g = Math.hypot(gx, gy);
  if (g === 0) return undefined;
  const ux = gx / g; // towards lighter grey: the paper side
  const uy = gy / g;
  const half = Math.round(PROFILE_HALF_LENGTH_PX / PROFILE_STEP_PX);
  const profile = new Float64Array(2 * half + 1);
  for (let k = -half; k <= half; k++) profile[k + half] = greyAt(raster, x + k * PROFILE_STEP_PX * ux, y + k * PROFILE_STEP_PX * uy);
  let ink = 0;
  let paper = 0;
  for (let k = 0; k < PLATEAU_SAMPLES; k++) {
    ink += profile[k]!;
    paper += profile[profile.length - 1 - k]!;
  }
  ink /= PLATEAU_SAMPLES;
  paper /= PLATEAU_SAMPLES;
  if (paper - ink < MIN_EDGE_CONTRAST_SHARE * contrast) return undefined;
  const low = crossing(profile, ink + 0.25 * (paper - ink), half);
  const high = crossing(profile, ink + 0.75 * (paper - ink), half);
  if (low === undefined || high === undefined || high <= low) return undefined;
  return high - low;
}

/**
 * The scan's edge blur σ in px (at least {@link PIXEL_APERTURE_SIGMA_PX}), measured on
 * the traced boundaries, or null when the raster is bilevel or has too few clean edges.
 */
export function estimateEdgeBlur(raster: GreyRaster, contours: readonly Contour[], levels: PaperAndInkLevels, bilevel: boolean): number | null {
  if (bilevel) return null;
  const contrast = Math.abs(levels.paper - levels.ink);
  if (!(contrast > 0)) return null;
  const total = contours.reduce((t, c) => t + c.points.length, 0);
  const stride = Math.max(1, Math.ceil(total / MAX_MEASURED_POINTS));
  const widths: number[] = [];
  let seen = 0;
  for (const contour of contours) {
    for (const p of contour.points) {
      if (seen++ % stride !== 0) continue;
      const w = edgeWidth(raster, p.x, p.y, contrast);
      if (w !== undefined) widths.push(w);
    }
  }
  if (widths.length < MIN_MEASURED_EDGES) return null;
  widths.sort((a, b) => a - b);
  const median = widths[Math.floor(widths.length / 2)]!;
  const measured = median / NORMAL_INTERQUARTILE_RANGE;
  return Math.max(PIXEL_APERTURE_SIGMA_PX, Math.sqrt(Math.max(0, measured * measured - INTERPOLATION_VARIANCE_PX2)));
}
