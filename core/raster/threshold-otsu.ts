// Global threshold selection by Otsu's method, plus the two class levels (ink and paper)
// it implies. The class levels matter beyond the threshold: their midpoint is the
// iso-level at which the boundary stage places sub-pixel edges, because on an
// anti-aliased or slightly blurred scan the true edge of a stroke is where the grey
// value is halfway between paper and ink.
//
// Method: N. Otsu (1979), "A Threshold Selection Method from Gray-Level Histograms",
// IEEE Transactions on Systems, Man, and Cybernetics SMC-9(1):62–66.

import { RasterError } from './raster-error.ts';
import { GREY_LEVELS } from './histogram.ts';

/**
 * Relative tolerance under which two between-class variances count as equal when
 * looking for the plateau of the maximum. Chosen, not published: it is far above
 * floating-point rounding (~1e-16) yet far below the change one real grey level makes
 * on a histogram with any spread, so it only merges genuinely flat stretches, such as
 * every level between the two spikes of a clean black-on-white render.
 */
export const OTSU_PLATEAU_RELATIVE_TOLERANCE = 1e-6;

/** Grey level of black ink, used when a histogram has no ink class at all. */
const BLACK_LEVEL = 0;
/** Grey level of white paper, used when a histogram has no paper class at all. */
const WHITE_LEVEL = 255;

function assertHistogram(histogram: ArrayLike<number>): void {
  if (histogram.length !== GREY_LEVELS) {
    throw new RasterError('bad-option', `A grey histogram needs exactly ${GREY_LEVELS} bins but this one has ${histogram.length}. Build it with greyHistogram().`);
  }
}

/**
 * Otsu's between-class variance σ_B²(t) for every candidate threshold t = 0…255, where
 * class 0 (ink) holds the levels ≤ t and class 1 (paper) the levels > t:
 * σ_B²(t) = ω₀ω₁(μ₀ − μ₁)², written in Otsu's single-pass form
 * σ_B²(t) = (μ_T·ω(t) − μ(t))² / (ω(t)·(1 − ω(t))) (Otsu 1979, eq. 18).
 * Where one class is empty σ_B² is 0. The histogram may be unnormalised.
 */
export function otsuBetweenClassVariance(histogram: ArrayLike<number>): Float64Array {
  assertHistogram(histogram);
  let total = 0;
  let totalMoment = 0;
  for (let level = 0; level < GREY_LEVELS; level++) {
    const count = histogram[level]!;
    total += count;
    totalMoment += level * count;
  }
  const variance = new Float64Array(GREY_LEVELS);
  if (total <= 0) return variance;
  const meanTotal = totalMoment / total;
  let omega = 0;
  let moment = 0;
  for (let level = 0; level < GREY_LEVELS; level++) {
    const p = histogram[level]! / total;
    omega += p;
    moment += level * p;
    const denominator = omega * (1 - omega);
    if (denominator > 0) {
      const numerator = meanTotal * omega - moment;
      variance[level] = (numerator * numerator) / denominator;
    }
  }
  return variance;
}

/**
 * Otsu's threshold: ink is every level ≤ the returned level.
 *
 * Guarantee: the returned level maximises σ_B². When the maximum is a plateau (equal
 * within {@link OTSU_PLATEAU_RELATIVE_TOLERANCE}), the middle of the contiguous plateau
 * around the first maximum is returned rather than its first level: on a clean
 * two-spike histogram (ink at 0, paper at 255) every level from 0 to 254 ties, and the
 * first one would put the threshold hard against the ink spike, where the smallest
 * amount of grain decides. A histogram with a single populated level (a blank page)
 * has σ_B² = 0 everywhere and yields the middle of the scale, 127.
 */
export function otsuLevel(histogram: ArrayLike<number>): number {
  const variance = otsuBetweenClassVariance(histogram);
  let best = 0;
  let bestLevel = 0;
  for (let level = 0; level < GREY_LEVELS; level++) {
    if (variance[level]! > best) {
      best = variance[level]!;
      bestLevel = level;
    }
  }
  const floor = best * (1 - OTSU_PLATEAU_RELATIVE_TOLERANCE);
  let first = bestLevel;
  while (first > 0 && variance[first - 1]! >= floor) first--;
  let last = bestLevel;
  while (last < GREY_LEVELS - 1 && variance[last + 1]! >= floor) last++;
  return Math.floor((first + last) / 2);
}

/** Representative grey levels of the two classes a threshold separates. */
export interface PaperAndInkLevels {
  /** Mean grey level of the ink class (levels ≤ the threshold). */
  readonly ink: number;
  /** Mean grey level of the paper class (levels > the threshold). */
  readonly paper: number;
}

/**
 * Mean grey levels of the ink class (≤ `level`) and the paper class (> `level`), i.e.
 * Otsu's μ₀ and μ₁. `level` defaults to {@link otsuLevel} of the same histogram. An
 * empty class falls back to pure black (ink) or pure white (paper), so the result is
 * always usable; the two means then still bracket every populated level.
 */
export function estimatePaperAndInk(histogram: ArrayLike<number>, level: number = otsuLevel(histogram)): PaperAndInkLevels {
  assertHistogram(histogram);
  let inkCount = 0;
  let inkMoment = 0;
  let paperCount = 0;
  let paperMoment = 0;
  for (let value = 0; value < GREY_LEVELS; value++) {
    const count = histogram[value]!;
    if (value <= level) {
      inkCount += count;
      inkMoment += value * count;
    } else {
      paperCount += count;
      paperMoment += value * count;
    }
  }
  return {
    ink: inkCount > 0 ? inkMoment / inkCount : BLACK_LEVEL,
    paper: paperCount > 0 ? paperMoment / paperCount : WHITE_LEVEL,
  };
}

/**
 * The iso-level for sub-pixel boundaries: halfway between paper and ink. For a step
 * edge seen through any symmetric blur (lens, scanner optics, anti-aliasing box filter)
 * the grey profile passes through the midpoint of its two plateaux exactly at the edge,
 * so the contour at this level is an unbiased estimate of the drawn edge.
 */
export function subpixelIsoLevel(levels: PaperAndInkLevels): number {
  return (levels.paper + levels.ink) / 2;
}
