// Connected-component labelling of an ink mask, for ink (8-connected) and for paper
// (4-connected). Cleanup needs it to find specks and pinholes, and it is the ground
// truth that the traced contours must agree with: one outer contour per ink component,
// one hole contour per enclosed paper component.
//
// The two connectivities are dual (Rosenfeld 1970, "Connectivity in digital pictures",
// J. ACM 17): with 8-connected ink and 4-connected paper, two diagonal ink pixels
// belong together and the two paper pixels of the other diagonal are kept apart, so
// every paper component other than the outside is enclosed by exactly one ink
// component.
//
// Method: two-pass labelling with union-find on runs of equal pixels rather than on
// single pixels, as in L. He, Y. Chao, K. Suzuki (2008), "A Run-Based Two-Scan
// Labeling Algorithm", IEEE Transactions on Image Processing 17(5):749–756. Working
// on runs makes the cost per row proportional to its number of runs, which on a
// lettering sheet is a handful per row, and needs no per-pixel label image at all.

import { assertInkMask } from './raster-validation.ts';
import type { InkMask } from './types.ts';

export type Connectivity = 4 | 8;

/** Maximal horizontal runs of one pixel value, each with its component label. */
export interface LabelledRuns {
  readonly count: number;
  readonly row: Int32Array;
  /** First column of the run. */
  readonly start: Int32Array;
  /** One past the last column of the run. */
  readonly end: Int32Array;
  /** Component label, 1…componentCount. */
  readonly label: Int32Array;
}

/**
 * The connected components of one pixel value of a mask. Per-component arrays are
 * indexed by label (1…count; index 0 is unused), and pixel bounds are inclusive.
 * Labels are numbered in raster order of each component's first pixel.
 */
export interface Components {
  readonly width: number;
  readonly height: number;
  readonly value: 0 | 1;
  readonly connectivity: Connectivity;
  readonly count: number;
  readonly area: Int32Array;
  readonly minX: Int32Array;
  readonly minY: Int32Array;
  readonly maxX: Int32Array;
  readonly maxY: Int32Array;
  /** 1 if the component has a pixel in the first or last row or column. */
  readonly touchesBorder: Uint8Array;
  readonly runs: LabelledRuns;
}

/** Initial capacity of the run buffers; they double as needed. */
const INITIAL_RUN_CAPACITY = 4096;

class RunBuffer {
  row: Int32Array<ArrayBuffer> = new Int32Array(INITIAL_RUN_CAPACITY);
  start: Int32Array<ArrayBuffer> = new Int32Array(INITIAL_RUN_CAPACITY);
  end: Int32Array<ArrayBuffer> = new Int32Array(INITIAL_RUN_CAPACITY);
  parent: Int32Array<ArrayBuffer> = new Int32Array(INITIAL_RUN_CAPACITY);
  count = 0;

  push(row: number, start: number, end: number): number {
    if (this.count === this.row.length) this.grow();
    const index = this.count++;
    this.row[index] = row;
    this.start[index] = start;
    this.end[index] = end;
    this.parent[index] = index;
    return index;
  }

  private grow(): void {
    const capacity = this.row.length * 2;
    this.row = copyInto(new Int32Array(capacity), this.row);
    this.start = copyInto(new Int32Array(capacity), this.start);
    this.end = copyInto(new Int32Array(capacity), this.end);
    this.parent = copyInto(new Int32Array(capacity), this.parent);
  }
}

function copyInto(target: Int32Array<ArrayBuffer>, source: Int32Array): Int32Array<ArrayBuffer> {
  target.set(source);
  return target;
}

/** Root of a run's set, halving the path on the way (Tarjan & van Leeuwen 1984). */
function findRoot(parent: Int32Array, index: number): number {
  let node = index;
  while (parent[node]! !== node) {
    const grandparent = parent[parent[node]!]!;
    parent[node] = grandparent;
    node = grandparent;
  }
  return node;
}

/** Joins two sets, keeping the smaller run index as root so roots precede members. */
function unite(parent: Int32Array, a: number, b: number): void {
  const rootA = findRoot(parent, a);
  const rootB = findRoot(parent, b);
  if (rootA < rootB) parent[rootB] = rootA;
  else if (rootB < rootA) parent[rootA] = rootB;
}

/**
 * Labels the connected components of the pixels equal to `value` under the given
 * connectivity. Guarantees: every pixel of that value lies in exactly one run, and two
 * runs share a label exactly when their pixels are connected. O(pixels) time to find
 * the runs, near-linear in the number of runs for the rest. The mask is not modified.
 */
export function labelComponents(mask: InkMask, value: 0 | 1, connectivity: Connectivity): Components {
  assertInkMask(mask);
  const { width, height, data } = mask;
  const runs = new RunBuffer();
  const reach = connectivity === 8 ? 1 : 0;
  let previousFirst = 0;
  let previousEnd = 0;
  for (let row = 0; row < height; row++) {
    const rowStart = row * width;
    const currentFirst = runs.count;
    let candidate = previousFirst;
    let col = 0;
    while (col < width) {
      while (col < width && data[rowStart + col] !== value) col++;
      if (col >= width) break;
      const start = col;
      while (col < width && data[rowStart + col] === value) col++;
      const run = runs.push(row, start, col);
      // Runs of the previous row that touch [start − reach, col + reach).
      while (candidate < previousEnd && runs.end[candidate]! + reach <= start) candidate++;
      for (let other = candidate; other < previousEnd && runs.start[other]! < col + reach; other++) {
        unite(runs.parent, run, other);
      }
    }
    previousFirst = currentFirst;
    previousEnd = runs.count;
  }

  const runCount = runs.count;
  const labelOfRoot = new Int32Array(runCount);
  const label = new Int32Array(runCount);
  let count = 0;
  for (let run = 0; run < runCount; run++) {
    const root = findRoot(runs.parent, run);
    if (root === run) labelOfRoot[run] = ++count;
    label[run] = labelOfRoot[root]!;
  }

  const area = new Int32Array(count + 1);
  const minX = new Int32Array(count + 1).fill(width);
  const minY = new Int32Array(count + 1).fill(height);
  const maxX = new Int32Array(count + 1).fill(-1);
  const maxY = new Int32Array(count + 1).fill(-1);
  const touchesBorder = new Uint8Array(count + 1);
  for (let run = 0; run < runCount; run++) {
    const id = label[run]!;
    const row = runs.row[run]!;
    const start = runs.start[run]!;
    const end = runs.end[run]!;
    area[id]! += end - start;
    if (start < minX[id]!) minX[id] = start;
    if (end - 1 > maxX[id]!) maxX[id] = end - 1;
    if (row < minY[id]!) minY[id] = row;
    if (row > maxY[id]!) maxY[id] = row;
    if (row === 0 || row === height - 1 || start === 0 || end === width) touchesBorder[id] = 1;
  }
  return {
    width,
    height,
    value,
    connectivity,
    count,
    area,
    minX,
    minY,
    maxX,
    maxY,
    touchesBorder,
    runs: {
      count: runCount,
      row: runs.row.slice(0, runCount),
      start: runs.start.slice(0, runCount),
      end: runs.end.slice(0, runCount),
      label,
    },
  };
}

/** Components of ink, 8-connected (the stage's convention for ink). */
export function labelInkComponents(mask: InkMask): Components {
  return labelComponents(mask, 1, 8);
}

/** Components of paper, 4-connected (dual to 8-connected ink). */
export function labelPaperComponents(mask: InkMask): Components {
  return labelComponents(mask, 0, 4);
}

/**
 * A per-pixel label image: each pixel of the labelled value gets its component label
 * (1…count), every other pixel 0. For inspection and tests; the stage itself works on
 * runs and never needs it.
 */
export function componentLabelImage(components: Components): Int32Array {
  const image = new Int32Array(components.width * components.height);
  const { runs } = components;
  for (let run = 0; run < runs.count; run++) {
    const offset = runs.row[run]! * components.width;
    image.fill(runs.label[run]!, offset + runs.start[run]!, offset + runs.end[run]!);
  }
  return image;
}
