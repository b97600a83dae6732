// Nesting of boundary chains: which chain encloses which. A letter is an ink outline
// with holes (the counters of B, o, 8), and a hole may hold an island of ink; the
// curve fitter and the font need that tree, and a font's fill rule needs each
// contour's direction to match its depth.

import { boundingBox, boxContains, polygonContains, signedArea } from './polygon-measures.ts';
import type { Box, Contour, Point } from './types.ts';

/** Distance along the first edge at which a chain's test point is taken: half a pixel, i.e. the middle of a crack. */
const TEST_POINT_OFFSET = 0.5;

/**
 * A point on a chain's own boundary but on no other chain of a traced set: half a
 * pixel along its first edge (the edge's midpoint if shorter). Traced chains only ever
 * meet at isolated vertices (pixel-edge chains, at 8-connected pinch points), and this
 * point is never a vertex.
 */
function testPointOf(points: readonly Point[]): Point {
  const a = points[0]!;
  const b = points[1] ?? a;
  const length = Math.hypot(b.x - a.x, b.y - a.y);
  const fraction = length > 2 * TEST_POINT_OFFSET ? TEST_POINT_OFFSET / length : 0.5;
  return { x: a.x + (b.x - a.x) * fraction, y: a.y + (b.y - a.y) * fraction };
}

/**
 * Nests closed chains and orients them by depth.
 *
 * Precondition: the chains do not cross each other (they may touch at isolated
 * vertices), as is the case for every chain set this stage traces. Each chain has at
 * least three points.
 *
 * Guarantees, for the returned contour i (same order as the input):
 * - `parent` is the index of the smallest chain enclosing chain i, or -1;
 *   `depth` = parent's depth + 1 (0 for no parent).
 * - Winding follows depth: `area` > 0 for even depths, < 0 for odd depths (see
 *   {@link Contour}); a chain whose direction disagrees is returned reversed (a new
 *   array, same first point), any other keeps its input array.
 *
 * Method: chains are placed in order of decreasing |area|, so every possible parent is
 * placed before its children, and each chain descends the tree built so far from the
 * roots, testing one point of it against candidate parents (bounding box first, then
 * an even–odd crossing test). Cost O(n log n + n·k), k being the total size of the
 * candidates met on the way down, which is small for a page of letters.
 */
export function nestContours(chains: readonly Point[][]): Contour[] {
  const n = chains.length;
  const areas = new Float64Array(n);
  const boxes: Box[] = [];
  const testPoints: Point[] = [];
  for (let i = 0; i < n; i++) {
    const chain = chains[i]!;
    areas[i] = signedArea(chain);
    boxes.push(boundingBox(chain));
    testPoints.push(chain.length > 0 ? testPointOf(chain) : { x: 0, y: 0 });
  }
  const order = Array.from({ length: n }, (_, i) => i).sort((a, b) => Math.abs(areas[b]!) - Math.abs(areas[a]!) || a - b);

  const parent = new Int32Array(n).fill(-1);
  const depth = new Int32Array(n);
  const roots: number[] = [];
  const children: number[][] = Array.from({ length: n }, () => []);
  for (const index of order) {
    const point = testPoints[index]!;
    let container = -1;
    let candidates = roots;
    let descended = true;
    while (descended) {
      descended = false;
      for (const candidate of candidates) {
        if (boxContains(boxes[candidate]!, point) && polygonContains(chains[candidate]!, point)) {
          container = candidate;
          candidates = children[candidate]!;
          descended = true;
          break;
        }
      }
    }
    parent[index] = container;
    depth[index] = container === -1 ? 0 : depth[container]! + 1;
    (container === -1 ? roots : children[container]!).push(index);
  }

  const contours: Contour[] = [];
  for (let i = 0; i < n; i++) {
    const chain = chains[i]!;
    const area = areas[i]!;
    const wantPositive = depth[i]! % 2 === 0;
    const agrees = area === 0 || area > 0 === wantPositive;
    contours.push({
      points: agrees ? chain : reverseChain(chain),
      depth: depth[i]!,
      parent: parent[i]!,
      area: agrees ? area : -area,
    });
  }
  return contours;
}

/** The same closed chain traversed the other way, starting from the same point. */
function reverseChain(chain: readonly Point[]): Point[] {
  const reversed: Point[] = [];
  if (chain.length === 0) return reversed;
  reversed.push(chain[0]!);
  for (let i = chain.length - 1; i >= 1; i--) reversed.push(chain[i]!);
  return reversed;
}
