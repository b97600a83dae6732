// Boundary following along the cracks of an ink mask: the unit edges between a pixel
// of ink and a 4-adjacent pixel of paper. Both boundary geometries of the stage are
// built from the loops found here — pixel-edge chains take the cracks' corners, and
// marching squares places one interpolated point on each crack — so both share one
// topology, which is exactly that of the mask's 8-connected ink and 4-connected paper.
//
// Method: border following along cracks (inter-pixel edges), as described by
// A. Rosenfeld and A. C. Kak (1982), Digital Picture Processing, 2nd ed., vol. 2,
// Academic Press, with the turning rule for 8-connected foreground. Each loop is
// started from the top crack of an ink pixel whose upper neighbour is paper: every
// outer boundary has one (at its topmost row) and so does every hole boundary (below
// the hole's lowest row), so one raster scan finds them all.

import { assertInkMask } from './raster-validation.ts';
import type { InkMask } from './types.ts';

/** Headings of travel along a crack, in the y-down pixel frame. Right turn = +1 (mod 4). */
export const HEADING_EAST = 0;
export const HEADING_SOUTH = 1;
export const HEADING_WEST = 2;
export const HEADING_NORTH = 3;

/** Unit step of each heading. */
export const HEADING_DX: readonly number[] = [1, 0, -1, 0];
export const HEADING_DY: readonly number[] = [0, 1, 0, -1];

/**
 * For a crack that starts at vertex (x, y) with a given heading: the offsets from
 * (x, y) of the ink pixel on its right and of the paper pixel on its left.
 */
export const CRACK_INK_DX: readonly number[] = [0, -1, -1, 0];
export const CRACK_INK_DY: readonly number[] = [0, 0, -1, -1];
export const CRACK_PAPER_DX: readonly number[] = [0, 0, -1, -1];
export const CRACK_PAPER_DY: readonly number[] = [-1, 0, 0, -1];

/**
 * On arriving at vertex (x, y) with a heading: offsets of the pixel ahead on the left
 * and of the pixel ahead on the right.
 */
const AHEAD_LEFT_DX: readonly number[] = [0, 0, -1, -1];
const AHEAD_LEFT_DY: readonly number[] = [-1, 0, 0, -1];
const AHEAD_RIGHT_DX: readonly number[] = [0, -1, -1, 0];
const AHEAD_RIGHT_DY: readonly number[] = [0, 0, -1, -1];

/** Initial capacity of the heading scratch buffer; it doubles as needed. */
const INITIAL_LOOP_CAPACITY = 1 << 16;

/**
 * One closed crack loop: it starts at integer vertex (startX, startY) heading east and
 * takes the unit steps `headings[0…length−1]` in turn, returning to the start.
 */
export interface CrackLoop {
  readonly startX: number;
  readonly startY: number;
  readonly headings: Uint8Array;
}

/**
 * All crack loops of the mask (pixels outside the mask count as paper, so ink touching
 * the border is closed off along the border).
 *
 * Guarantees: every crack is traversed by exactly one loop, exactly once, with ink on
 * the right-hand side of travel as seen on screen (y down) — so outer boundaries run
 * clockwise on screen (positive shoelace area in the pixel frame) and hole boundaries
 * counter-clockwise. Where two ink pixels touch only at a corner the loop keeps them
 * together (8-connected ink) and keeps the two paper pixels apart (4-connected paper);
 * such a pinch vertex is visited twice by one loop. There is one loop per 8-connected
 * ink component (its outer boundary) plus one per enclosed 4-connected paper component.
 * Loops come in raster order of their start crack. Cost: one pass over the mask plus
 * O(1) per crack; one byte per pixel of scratch.
 */
export function traceCrackLoops(mask: InkMask): CrackLoop[] {
  assertInkMask(mask);
  const { width, height, data: ink } = mask;
  // startedTop[p] = 1 once the top crack of ink pixel p has been traversed.
  const startedTop = new Uint8Array(width * height);
  const loops: CrackLoop[] = [];
  let headings = new Uint8Array(INITIAL_LOOP_CAPACITY);

  const inkAt = (px: number, py: number): boolean =>
    px >= 0 && py >= 0 && px < width && py < height && ink[py * width + px] !== 0;

  for (let row = 0; row < height; row++) {
    const rowStart = row * width;
    for (let col = 0; col < width; col++) {
      const p = rowStart + col;
      if (ink[p] === 0 || startedTop[p] !== 0) continue;
      if (row > 0 && ink[p - width] !== 0) continue;
      let x = col;
      let y = row;
      let heading = HEADING_EAST;
      let length = 0;
      do {
        if (heading === HEADING_EAST) startedTop[y * width + x] = 1;
        if (length === headings.length) {
          const larger = new Uint8Array(headings.length * 2);
          larger.set(headings);
          headings = larger;
        }
        headings[length++] = heading;
        x += HEADING_DX[heading]!;
        y += HEADING_DY[heading]!;
        if (inkAt(x + AHEAD_LEFT_DX[heading]!, y + AHEAD_LEFT_DY[heading]!)) {
          heading = (heading + 3) & 3; // turn left: joins diagonal ink (8-connected)
        } else if (!inkAt(x + AHEAD_RIGHT_DX[heading]!, y + AHEAD_RIGHT_DY[heading]!)) {
          heading = (heading + 1) & 3; // turn right: ink ends here
        } // else straight on: paper ahead-left, ink ahead-right
      } while (x !== col || y !== row || heading !== HEADING_EAST);
      loops.push({ startX: col, startY: row, headings: headings.slice(0, length) });
    }
  }
  return loops;
}
