// Otsu thresholding and the paper/ink levels that set the sub-pixel iso-level.

import { describe, expect, it } from 'vitest';
import { binarize, estimatePaperAndInk, greyHistogram, otsuBetweenClassVariance, otsuLevel, subpixelIsoLevel } from '../../core/raster/index.ts';

/** A 256-bin histogram of two Gaussians (weights, means, standard deviations). */
function twoGaussians(weight0: number, mean0: number, sd0: number, weight1: number, mean1: number, sd1: number): Float64Array {
  const histogram = new Float64Array(256);
  for (let level = 0; level < 256; level++) {
    histogram[level] =
      (weight0 * Math.exp(-((level - mean0) ** 2) / (2 * sd0 * sd0))) / sd0 + (weight1 * Math.exp(-((level - mean1) ** 2) / (2 * sd1 * sd1))) / sd1;
  }
  return histogram;
}

/**
 * Independent brute force of Otsu's criterion (Otsu 1979, "A Threshold Selection Method
 * from Gray-Level Histograms", IEEE SMC-9, eq. 14/15): for every t, split into
 * C0 = [0, t] and C1 = (t, 255], compute ω0, ω1, μ0, μ1 directly from the bins and
 * σ_B² = ω0·ω1·(μ0 − μ1)²; return the t of the maximum (first one on exact ties).
 */
function bruteForceOtsu(histogram: ArrayLike<number>): { level: number; variance: number[] } {
  let total = 0;
  for (let i = 0; i < 256; i++) total += histogram[i]!;
  const variance: number[] = [];
  let best = -1;
  let bestLevel = 0;
  for (let t = 0; t < 256; t++) {
    let n0 = 0;
    let m0 = 0;
    let n1 = 0;
    let m1 = 0;
    for (let i = 0; i < 256; i++) {
      if (i <= t) {
        n0 += histogram[i]!;
        m0 += i * histogram[i]!;
      } else {
        n1 += histogram[i]!;
        m1 += i * histogram[i]!;
      }
    }
    const omega0 = n0 / total;
    const omega1 = n1 / total;
    const sigma = n0 > 0 && n1 > 0 ? omega0 * omega1 * (m0 / n0 - m1 / n1) ** 2 : 0;
    variance.push(sigma);
    if (sigma > best) {
      best = sigma;
      bestLevel = t;
    }
  }
  return { level: bestLevel, variance };
}

describe('Otsu threshold', () => {
  // Overlapping classes, as on real scans: σ_B² has a single sharp maximum.
  it.each([
    ['balanced ink and paper', twoGaussians(1, 60, 25, 1, 190, 30)],
    ['little ink on much paper', twoGaussians(0.08, 40, 20, 1, 215, 18)],
    ['grey pencil on cream paper', twoGaussians(0.3, 120, 22, 1, 205, 16)],
  ])('picks the threshold that maximises between-class variance (%s)', (_name, histogram) => {
    const reference = bruteForceOtsu(histogram);
    // Otsu 1979: the optimal threshold maximises σ_B²; checked against the brute force above.
    expect(otsuLevel(histogram)).toBe(reference.level);
    const variance = otsuBetweenClassVariance(histogram);
    for (let t = 0; t < 256; t++) expect(variance[t]! / reference.variance[reference.level]!).toBeCloseTo(reference.variance[t]! / reference.variance[reference.level]!, 12);
  });

  it('on well-separated classes, picks a level of maximal between-class variance in the middle of the empty gap', () => {
    // Tails of N(40, 12²) and N(200, 15²) are below 1e-9 of the peaks between ~100 and ~130,
    // so σ_B² is flat there to ~1e-9 relative: every such t is an Otsu optimum.
    const histogram = twoGaussians(1, 40, 12, 1, 200, 15);
    const reference = bruteForceOtsu(histogram);
    const level = otsuLevel(histogram);
    const maximum = reference.variance[reference.level]!;
    const optimal = reference.variance.flatMap((sigma, t) => (sigma >= maximum * (1 - 1e-6) ? [t] : []));
    const first = optimal[0]!;
    const last = optimal[optimal.length - 1]!;
    expect(last - first + 1).toBe(optimal.length); // one contiguous plateau
    expect(optimal.length).toBeGreaterThan(10);
    expect(level).toBe(Math.floor((first + last) / 2));
  });

  it('puts the threshold in the middle of the flat optimum of a clean two-level image, not against the ink', () => {
    const histogram = new Float64Array(256);
    histogram[0] = 1200;
    histogram[255] = 8800;
    // Every t in [0, 254] ties (σ_B² identical); the plateau's middle is ⌊(0 + 254) / 2⌋.
    const reference = bruteForceOtsu(histogram);
    expect(reference.level).toBe(0);
    expect(otsuLevel(histogram)).toBe(127);
  });

  it('takes the middle of the plateau between two spikes wherever the spikes are', () => {
    const histogram = new Float64Array(256);
    histogram[30] = 500;
    histogram[220] = 4000;
    expect(otsuLevel(histogram)).toBe(Math.floor((30 + 219) / 2));
  });

  it('gives a usable level for a blank page (one populated level)', () => {
    const histogram = new Float64Array(256);
    histogram[250] = 1000;
    expect(otsuLevel(histogram)).toBe(127);
  });

  it('estimates paper and ink as the two class means and the iso-level halfway between', () => {
    const histogram = new Float64Array(256);
    histogram[10] = 100;
    histogram[20] = 100;
    histogram[200] = 300;
    histogram[240] = 100;
    const levels = estimatePaperAndInk(histogram);
    expect(levels.ink).toBeCloseTo(15, 12);
    expect(levels.paper).toBeCloseTo(210, 12);
    expect(subpixelIsoLevel(levels)).toBeCloseTo(112.5, 12);
  });

  it('counts every pixel of the raster in the histogram', () => {
    const data = Uint8Array.from({ length: 1000 }, (_, i) => (i * 37) % 256);
    const histogram = greyHistogram({ width: 40, height: 25, data });
    expect(histogram.reduce((a, b) => a + b, 0)).toBe(1000);
    expect(histogram[37]).toBe(data.filter((v) => v === 37).length);
  });

  it('marks exactly the pixels at or below the threshold as ink and does not touch the input', () => {
    const data = Uint8Array.from([0, 10, 127, 128, 200, 255, 255, 255, 30]);
    const copy = data.slice();
    const result = binarize({ width: 3, height: 3, data });
    expect(result.level).toBeGreaterThanOrEqual(30);
    expect(result.level).toBeLessThan(200);
    expect(Array.from(result.mask.data)).toEqual(Array.from(data, (v) => (v <= result.level! ? 1 : 0)));
    expect(data).toEqual(copy);
  });

  it('treats light-on-dark artwork like dark-on-light when invert is set', () => {
    const data = Uint8Array.from([255, 240, 20, 10, 0, 250]);
    const inverted = binarize({ width: 3, height: 2, data }, { invert: true });
    expect(Array.from(inverted.mask.data)).toEqual([1, 1, 0, 0, 0, 1]);
    expect(inverted.grey.data[0]).toBe(0);
  });

  it('uses a manual level as given and puts the iso-level just above it', () => {
    const data = Uint8Array.from([0, 100, 101, 255]);
    const result = binarize({ width: 2, height: 2, data }, { method: 'manual', level: 100 });
    expect(Array.from(result.mask.data)).toEqual([1, 1, 0, 0]);
    expect(result.level).toBe(100);
    expect(result.isoLevel).toBe(100.5);
  });
});
