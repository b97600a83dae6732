// Exact pixel-edge boundaries for bilevel artwork. When a scan is already 1-bit (or
// was drawn as pixel art), there is no sub-pixel information to recover: the honest
// outline is the staircase of pixel edges between ink and paper, with its corners on
// the integer grid. These chains reproduce the mask exactly — their areas are the
// pixel counts — which makes them the right input for pixel-perfect work and a useful
// check on everything else.

import { HEADING_DX, HEADING_DY, traceCrackLoops } from './crack-following.ts';
import type { InkMask, Point } from './types.ts';

/**
 * Boundary chains along the cracks between ink and paper pixels.
 *
 * Guarantees: vertices are integer pixel corners; a vertex is emitted only where the
 * boundary turns (runs of collinear cracks become one segment), so consecutive points
 * always differ and no segment has zero length. Orientation and connectivity are those
 * of {@link traceCrackLoops}: ink on the right, outer chains clockwise on screen
 * (positive shoelace area), holes counter-clockwise, ink 8-connected. The shoelace area
 * of an outer chain is exactly the number of pixels its component covers including
 * holes, and a hole chain's is minus the hole's pixel count. One chain per loop, in
 * the loops' raster order.
 */
export function pixelEdgeChains(mask: InkMask): Point[][] {
  const chains: Point[][] = [];
  for (const loop of traceCrackLoops(mask)) {
    const { headings } = loop;
    const length = headings.length;
    const chain: Point[] = [];
    let x = loop.startX;
    let y = loop.startY;
    let previous = headings[length - 1]!;
    for (let i = 0; i < length; i++) {
      const heading = headings[i]!;
      if (heading !== previous) chain.push({ x, y });
      x += HEADING_DX[heading]!;
      y += HEADING_DY[heading]!;
      previous = heading;
    }
    chains.push(chain);
  }
  return chains;
}
