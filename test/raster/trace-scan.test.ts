// The stage as a whole: chain invariants every consumer relies on (closed, no repeated
// points, no NaN), errors a person can act on, progress reporting, and options that
// must not change the geometry (invert) or must say what they assumed (resolution).

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  RasterError,
  marchingSquaresChains,
  pixelEdgeChains,
  traceScan,
  uniformIsoLevel,
  type Contour,
  type GreyRaster,
  type InkMask,
  type Point,
  type TraceStage,
} from '../../core/raster/index.ts';
import { degrade } from './degrade.ts';
import { renderDisc, renderRings } from './reference-render.ts';

function expectWellFormedChain(points: readonly Point[]): void {
  expect(points.length).toBeGreaterThanOrEqual(3);
  for (let i = 0; i < points.length; i++) {
    const point = points[i]!;
    const next = points[(i + 1) % points.length]!;
    expect(Number.isFinite(point.x) && Number.isFinite(point.y)).toBe(true);
    // No two consecutive points equal, including the closing pair (last → first).
    expect(point.x === next.x && point.y === next.y).toBe(false);
  }
}

function expectWellFormed(contours: readonly Contour[]): void {
  for (const contour of contours) {
    expectWellFormedChain(contour.points);
    expect(Number.isFinite(contour.area)).toBe(true);
  }
}

const randomGrey = fc
  .record({ width: fc.integer({ min: 1, max: 20 }), height: fc.integer({ min: 1, max: 20 }), seed: fc.integer(), iso: fc.double({ min: 1, max: 254, noNaN: true }) })
  .map(({ width, height, seed, iso }) => {
    let state = seed >>> 0;
    const data = new Uint8Array(width * height);
    for (let i = 0; i < data.length; i++) {
      state = (Math.imul(state, 1664525) + 1013904223) >>> 0; // Numerical Recipes LCG
      data[i] = state >>> 24;
    }
    return { raster: { width, height, data } satisfies GreyRaster, iso };
  });

describe('traced chains', () => {
  it('are closed, never repeat a point and contain no NaN, on discs, rings, a degraded scan and border-touching ink', () => {
    const disc = renderDisc(40, 40, 20.3, 19.8, 12.1);
    const rings = renderRings(80, 80, 40, 40, [35, 25, 15, 5]);
    const scan = degrade(rings, { blurSigma: 1.2, paperLeft: 240, paperRight: 150, inkReflectance: 0.1, noiseSigma: 8, specks: [{ x: 5, y: 5, radius: 2 }], seed: 3 });
    const edge = renderDisc(40, 40, 2, 20, 10); // cut by the left border
    for (const raster of [disc, rings, scan, edge]) {
      expectWellFormed(traceScan({ raster, dpiX: 300 }).contours);
      expectWellFormed(traceScan({ raster, dpiX: 300 }, { method: 'sauvola' }).contours);
    }
    const cut = traceScan({ raster: edge, dpiX: 300 }).contours[0]!;
    expect(Math.min(...cut.points.map((point) => point.x))).toBeCloseTo(0, 1);
  });

  it('stay well formed on arbitrary grey noise at any iso-level, with one chain per crack loop', () => {
    fc.assert(
      fc.property(randomGrey, ({ raster, iso }) => {
        const mask: InkMask = { width: raster.width, height: raster.height, data: raster.data.map((value) => (value <= iso ? 1 : 0)) };
        const chains = marchingSquaresChains(raster, mask, uniformIsoLevel(iso));
        expect(chains).toHaveLength(pixelEdgeChains(mask).length);
        for (const chain of chains) {
          expectWellFormedChain(chain);
          for (const point of chain) {
            // Every point lies on a segment between two pixel centres: one coordinate is a centre.
            const onColumn = Math.abs(point.x - Math.floor(point.x) - 0.5) < 1e-12;
            const onRow = Math.abs(point.y - Math.floor(point.y) - 0.5) < 1e-12;
            expect(onColumn || onRow).toBe(true);
            expect(point.x).toBeGreaterThan(-0.5);
            expect(point.y).toBeGreaterThan(-0.5);
            expect(point.x).toBeLessThan(raster.width + 0.5);
            expect(point.y).toBeLessThan(raster.height + 0.5);
          }
        }
      }),
      { numRuns: 300, seed: 42 },
    );
  });
});

describe('traceScan', () => {
  const disc = renderDisc(60, 60, 30.2, 29.7, 18.4);

  it('refuses a blank page with an empty-page error that says to check threshold and invert', () => {
    const blank: GreyRaster = { width: 50, height: 40, data: new Uint8Array(2000).fill(250) };
    expect(() => traceScan({ raster: blank })).toThrow(RasterError);
    try {
      traceScan({ raster: blank });
    } catch (error) {
      expect((error as RasterError).code).toBe('empty-page');
      expect((error as RasterError).message).toMatch(/No ink found on the page/);
      expect((error as RasterError).message).toMatch(/threshold/);
      expect((error as RasterError).message).toMatch(/invert/);
    }
  });

  it('refuses a page whose only ink is dust, naming the speck size', () => {
    const dusty = renderDisc(60, 60, 30, 30, 0.9);
    expect(() => traceScan({ raster: dusty, dpiX: 300 }, { speckAreaMm2: 1 })).toThrow(/specks smaller than/);
  });

  it('rejects malformed rasters and options with bad-raster / bad-option errors', () => {
    const codeOf = (action: () => unknown): string | undefined => {
      try {
        action();
      } catch (error) {
        return error instanceof RasterError ? error.code : 'not a RasterError';
      }
      return undefined;
    };
    expect(codeOf(() => traceScan({ raster: { width: 10, height: 10, data: new Uint8Array(99) } }))).toBe('bad-raster');
    expect(codeOf(() => traceScan({ raster: { width: 0, height: 10, data: new Uint8Array(0) } }))).toBe('bad-raster');
    expect(codeOf(() => traceScan({ raster: { width: 2, height: 2, data: new Uint8ClampedArray(4) as unknown as Uint8Array } }))).toBe('bad-raster');
    expect(codeOf(() => traceScan({ raster: disc }, { method: 'manual' }))).toBe('bad-option');
    expect(codeOf(() => traceScan({ raster: disc }, { method: 'manual', level: 300 }))).toBe('bad-option');
    expect(codeOf(() => traceScan({ raster: disc }, { speckAreaMm2: -1 }))).toBe('bad-option');
  });

  it('reports progress through every step in order, ending at 1', () => {
    const seen: [number, TraceStage][] = [];
    traceScan({ raster: disc, dpiX: 300 }, { onProgress: (fraction, stage) => seen.push([fraction, stage]) });
    expect(seen.map(([, stage]) => stage)).toEqual(['binarize', 'cleanup', 'boundaries', 'nesting', 'segmentation', 'done']);
    const fractions = seen.map(([fraction]) => fraction);
    expect(fractions).toEqual([...fractions].sort((a, b) => a - b));
    expect(fractions.at(-1)).toBe(1);
  });

  it('traces white-on-black artwork with invert exactly like the same artwork in black on white', () => {
    const negative: GreyRaster = { ...disc, data: disc.data.map((value) => 255 - value) };
    const normal = traceScan({ raster: disc, dpiX: 300 });
    const inverted = traceScan({ raster: negative, dpiX: 300 }, { invert: true });
    expect(inverted.contours).toEqual(normal.contours);
  });

  it('notes when most of the page is ink, the usual sign of a missing invert', () => {
    const negative: GreyRaster = { ...disc, data: disc.data.map((value) => 255 - value) };
    expect(traceScan({ raster: negative, dpiX: 300 }).notes.join(' ')).toMatch(/turn on invert/);
  });

  it('says when it had to assume the resolution, and uses the declared one otherwise', () => {
    const assumed = traceScan({ raster: disc });
    expect(assumed.resolution.assumed).toBe(true);
    expect(assumed.notes.join(' ')).toMatch(/300 dpi was assumed/);
    const declared = traceScan({ raster: { ...disc, dpi: 600 } });
    expect(declared.resolution).toEqual({ dpiX: 600, dpiY: 600, assumed: false });
    expect(declared.notes.join(' ')).not.toMatch(/assumed/);
  });

  it('does not modify the scan it is given', () => {
    const copy = disc.data.slice();
    traceScan({ raster: disc, dpiX: 300 }, { method: 'sauvola' });
    traceScan({ raster: disc, dpiX: 300 }, { invert: true, speckAreaMm2: 0 });
    expect(disc.data).toEqual(copy);
  });

  it('uses exact pixel edges for a 1-bit scan', () => {
    const bilevel: GreyRaster = { ...disc, data: disc.data.map((value) => (value < 128 ? 0 : 255)) };
    const result = traceScan({ raster: bilevel, dpiX: 300 });
    expect(result.boundary).toBe('pixel-edges');
    let ink = 0;
    for (const value of bilevel.data) if (value === 0) ink++;
    expect(result.contours[0]!.area).toBe(ink);
  });
});
