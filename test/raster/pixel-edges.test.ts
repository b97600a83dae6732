// Pixel-edge chains for 1-bit artwork: exact staircases along pixel boundaries, with the
// same connectivity and winding as the sub-pixel boundaries.

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  labelInkComponents,
  labelPaperComponents,
  marchingSquaresChains,
  nestContours,
  pixelEdgeChains,
  traceBoundaries,
  uniformIsoLevel,
  type GreyRaster,
  type InkMask,
} from '../../core/raster/index.ts';

function maskFromRows(rows: readonly string[]): InkMask {
  const width = rows[0]!.length;
  const data = new Uint8Array(width * rows.length);
  rows.forEach((row, y) => {
    for (let x = 0; x < width; x++) data[y * width + x] = row[x] === '#' ? 1 : 0;
  });
  return { width, height: rows.length, data };
}

function bilevelRaster(mask: InkMask): GreyRaster {
  return { width: mask.width, height: mask.height, data: Uint8Array.from(mask.data, (ink) => (ink ? 0 : 255)) };
}

function enclosedPaperComponents(mask: InkMask): number {
  const paper = labelPaperComponents(mask);
  let count = 0;
  for (let id = 1; id <= paper.count; id++) if (paper.touchesBorder[id] === 0) count++;
  return count;
}

const randomMask = fc
  .record({ width: fc.integer({ min: 1, max: 24 }), height: fc.integer({ min: 1, max: 24 }), density: fc.double({ min: 0.1, max: 0.9, noNaN: true }), seed: fc.integer() })
  .map(({ width, height, density, seed }) => {
    let state = seed >>> 0;
    const data = new Uint8Array(width * height);
    for (let i = 0; i < data.length; i++) {
      state = (Math.imul(state, 1664525) + 1013904223) >>> 0; // Numerical Recipes LCG
      data[i] = state / 4294967296 < density ? 1 : 0;
    }
    return { width, height, data } satisfies InkMask;
  });

describe('pixel-edge chains', () => {
  it('puts every vertex on a pixel corner and gives a square of n×n pixels the area n²', () => {
    const mask = maskFromRows(['......', '.####.', '.####.', '.####.', '.####.', '......']);
    const [chain, ...rest] = pixelEdgeChains(mask);
    expect(rest).toHaveLength(0);
    expect(chain).toEqual([
      { x: 1, y: 1 },
      { x: 5, y: 1 },
      { x: 5, y: 5 },
      { x: 1, y: 5 },
    ]);
    expect(nestContours([chain!])[0]!.area).toBe(16);
  });

  it('keeps diagonally touching ink together and the paper on the other diagonal apart', () => {
    const mask = maskFromRows(['#..', '.#.', '..#']);
    const chains = pixelEdgeChains(mask);
    expect(chains).toHaveLength(1);
    expect(nestContours(chains)[0]!.area).toBe(3);
    // A ring whose wall is only diagonally connected still encloses its hole.
    const diamond = maskFromRows(['..#..', '.#.#.', '#...#', '.#.#.', '..#..']);
    const contours = nestContours(pixelEdgeChains(diamond));
    expect(contours.map((contour) => contour.depth).sort()).toEqual([0, 1]);
    expect(contours.reduce((sum, contour) => sum + contour.area, 0)).toBe(8);
  });

  it('closes ink that touches the image border along the border', () => {
    const chains = pixelEdgeChains(maskFromRows(['##', '##']));
    expect(chains[0]).toEqual([
      { x: 0, y: 0 },
      { x: 2, y: 0 },
      { x: 2, y: 2 },
      { x: 0, y: 2 },
    ]);
  });

  it('has areas that count pixels exactly: outline minus holes equals each component\'s pixels (random masks)', () => {
    fc.assert(
      fc.property(randomMask, (mask) => {
        const contours = nestContours(pixelEdgeChains(mask));
        const ink = labelInkComponents(mask);
        // One outer chain per 8-connected ink component, one hole per enclosed 4-connected paper component.
        expect(contours.filter((c) => c.area > 0)).toHaveLength(ink.count);
        expect(contours.filter((c) => c.area < 0)).toHaveLength(enclosedPaperComponents(mask));
        let inkPixels = 0;
        for (const value of mask.data) inkPixels += value;
        expect(contours.reduce((sum, contour) => sum + contour.area, 0)).toBe(inkPixels);
        // Per component: outline area plus its (negative) hole areas = its pixel count.
        contours.forEach((contour, index) => {
          if (contour.area <= 0) return;
          const start = contour.points[0]!;
          const label = ink.runs.label[findRun(ink, start.x, start.y)]!;
          const holes = contours.filter((other) => other.parent === index && other.area < 0);
          expect(contour.area + holes.reduce((sum, hole) => sum + hole.area, 0)).toBe(ink.area[label]);
        });
        for (const contour of contours) {
          for (const point of contour.points) {
            expect(Number.isInteger(point.x) && Number.isInteger(point.y)).toBe(true);
          }
          expect(Math.sign(contour.area)).toBe(contour.depth % 2 === 0 ? 1 : -1);
        }
      }),
      { numRuns: 200, seed: 20_240_601 },
    );
  });

  it('gives marching squares exactly the same chains, count and order, as pixel edges (random masks)', () => {
    fc.assert(
      fc.property(randomMask, (mask) => {
        const grey = bilevelRaster(mask);
        const edges = pixelEdgeChains(mask);
        const smooth = marchingSquaresChains(grey, mask, uniformIsoLevel(127.5));
        expect(smooth).toHaveLength(edges.length);
        const edgeContours = nestContours(edges);
        const smoothContours = nestContours(smooth);
        smoothContours.forEach((contour, index) => {
          expect(contour.depth).toBe(edgeContours[index]!.depth);
          expect(contour.parent).toBe(edgeContours[index]!.parent);
        });
      }),
      { numRuns: 200, seed: 7 },
    );
  });

  it('is chosen automatically for a 1-bit raster, and marching squares for a greyscale one', () => {
    const mask = maskFromRows(['....', '.##.', '.##.', '....']);
    expect(traceBoundaries(bilevelRaster(mask), mask).method).toBe('pixel-edges');
    const grey = bilevelRaster(mask);
    const soft = { ...grey, data: grey.data.map((value) => (value === 255 ? 250 : value)) };
    expect(traceBoundaries(soft, mask).method).toBe('marching-squares');
    expect(traceBoundaries(bilevelRaster(mask), mask, { method: 'marching-squares' }).method).toBe('marching-squares');
  });
});

/** Index of the run of `components` containing pixel (x, y). */
function findRun(components: ReturnType<typeof labelInkComponents>, x: number, y: number): number {
  const { runs } = components;
  for (let run = 0; run < runs.count; run++) {
    if (runs.row[run] === y && runs.start[run]! <= x && x < runs.end[run]!) return run;
  }
  throw new Error(`no run contains (${x}, ${y})`);
}
