// Connected components, the ground truth for cleanup and for contour counts: checked
// against an independent flood fill on random masks, for both connectivities.

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { componentLabelImage, labelInkComponents, labelPaperComponents, type InkMask } from '../../core/raster/index.ts';

/** Breadth-first flood fill labelling (the textbook definition of connectivity). */
function floodFill(mask: InkMask, value: 0 | 1, connectivity: 4 | 8): { count: number; labels: Int32Array } {
  const { width, height, data } = mask;
  const labels = new Int32Array(width * height);
  const steps = connectivity === 4 ? [[1, 0], [-1, 0], [0, 1], [0, -1]] : [[1, 0], [-1, 0], [0, 1], [0, -1], [1, 1], [1, -1], [-1, 1], [-1, -1]];
  let count = 0;
  for (let start = 0; start < data.length; start++) {
    if (data[start] !== value || labels[start] !== 0) continue;
    labels[start] = ++count;
    const queue = [start];
    while (queue.length > 0) {
      const p = queue.pop()!;
      const x = p % width;
      const y = (p - x) / width;
      for (const [dx, dy] of steps) {
        const nx = x + dx!;
        const ny = y + dy!;
        if (nx < 0 || ny < 0 || nx >= width || ny >= height) continue;
        const q = ny * width + nx;
        if (data[q] === value && labels[q] === 0) {
          labels[q] = count;
          queue.push(q);
        }
      }
    }
  }
  return { count, labels };
}

const randomMask = fc
  .record({ width: fc.integer({ min: 1, max: 30 }), height: fc.integer({ min: 1, max: 30 }), density: fc.double({ min: 0.05, max: 0.95, noNaN: true }), seed: fc.integer() })
  .map(({ width, height, density, seed }) => {
    let state = seed >>> 0;
    const data = new Uint8Array(width * height);
    for (let i = 0; i < data.length; i++) {
      state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
      data[i] = state / 4294967296 < density ? 1 : 0;
    }
    return { width, height, data } satisfies InkMask;
  });

describe('connected components', () => {
  it('labels 8-connected ink and 4-connected paper exactly as a flood fill does (random masks)', () => {
    fc.assert(
      fc.property(randomMask, (mask) => {
        for (const [components, value, connectivity] of [
          [labelInkComponents(mask), 1, 8],
          [labelPaperComponents(mask), 0, 4],
        ] as const) {
          const reference = floodFill(mask, value, connectivity);
          expect(components.count).toBe(reference.count);
          const labels = componentLabelImage(components);
          // Same partition: labels correspond one to one.
          const mapping = new Map<number, number>();
          for (let p = 0; p < labels.length; p++) {
            expect(labels[p] === 0).toBe(reference.labels[p] === 0);
            if (labels[p] === 0) continue;
            const known = mapping.get(labels[p]!);
            if (known === undefined) mapping.set(labels[p]!, reference.labels[p]!);
            else expect(known).toBe(reference.labels[p]);
          }
          // Areas and boxes agree with the label image.
          for (let id = 1; id <= components.count; id++) {
            let area = 0;
            for (let p = 0; p < labels.length; p++) if (labels[p] === id) area++;
            expect(components.area[id]).toBe(area);
            expect(components.minX[id]!).toBeLessThanOrEqual(components.maxX[id]!);
          }
        }
      }),
      { numRuns: 150, seed: 11 },
    );
  });

  it('joins ink that touches only at a corner, but not paper', () => {
    const mask: InkMask = { width: 2, height: 2, data: Uint8Array.from([1, 0, 0, 1]) };
    expect(labelInkComponents(mask).count).toBe(1);
    expect(labelPaperComponents(mask).count).toBe(2);
  });
});
