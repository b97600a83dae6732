// Sub-pixel boundaries for greyscale scans. A scanner's optics and a renderer's
// anti-aliasing both leave the true position of an edge encoded in the grey values of
// the pixels it crosses; interpolating the iso-level between pixel centres recovers it
// to a small fraction of a pixel, which is what type-quality curve fitting needs.
//
// Method: the two-dimensional form of marching cubes — W. E. Lorensen and H. E. Cline
// (1987), "Marching cubes: a high resolution 3D surface construction algorithm",
// SIGGRAPH '87 — on the grid of pixel centres, with linear interpolation along cell
// edges. Its topology is taken from the cleaned ink mask instead of from the grey
// values, so that contours agree with the mask component for component:
//
// - The field sampled at each pixel centre is the grey value clamped to the mask's
//   side of the iso-level: at an ink pixel min(grey, iso − ε), at a paper pixel
//   max(grey, iso + ε). Where grey and mask agree that is the grey value itself.
//   Cleanup edits never reach the interpolation: an erased speck was 8-isolated, so
//   all its neighbours are paper, and a filled pinhole was 4-enclosed by ink, so no
//   cell edge joins it to paper. Specks therefore vanish and filled pinholes leave no
//   contour, with no special case.
// - Saddle cells (ink on one diagonal, paper on the other) always connect the ink
//   diagonal, matching 8-connected ink and 4-connected paper.
// - The image is padded with one pixel of white paper, so contours that touch the
//   border close along it.
//
// A cell edge that the contour crosses joins the centres of a 4-adjacent ink/paper
// pixel pair, i.e. it crosses exactly one crack of the mask, and marching squares with
// the saddle rule above visits those crossings in the order of the crack loops. So the
// chains are built by walking the crack loops and placing one point per crack.

import { CRACK_INK_DX, CRACK_INK_DY, CRACK_PAPER_DX, CRACK_PAPER_DY, HEADING_DX, HEADING_DY, traceCrackLoops } from './crack-following.ts';
import { isoLevelAt, type IsoLevelField } from './iso-level-field.ts';
import { assertGreyRaster, assertInkMask, assertSameGrid } from './raster-validation.ts';
import type { GreyRaster, InkMask, Point } from './types.ts';

/** Grey value of the one-pixel paper border added around the image: white. */
const PADDING_GREY = 255;
/**
 * How far (in grey levels) a clamped field value sits on the mask's side of the
 * iso-level. Any positive value keeps the sign right; a tiny one keeps the crossing as
 * close to the disagreeing pixel as the mask allows.
 */
const FIELD_CLAMP_MARGIN = 1 / 256;
/**
 * Closest a crossing may come to a pixel centre, as a fraction of the centre spacing.
 * The two crossings on either side of one pixel centre can then never coincide, so
 * chains have no duplicate points; 1/64 px is far below any scan's accuracy.
 */
const MIN_CROSSING_OFFSET = 1 / 64;

/**
 * Sub-pixel boundary chains of `mask` on `raster` (ink dark, same size) at the given
 * iso-level.
 *
 * Guarantees: one chain per crack loop of the mask (see traceCrackLoops), so exactly
 * one outer chain per 8-connected ink component and one hole chain per enclosed paper
 * component, in the same orientation (ink on the right: outer chains clockwise on
 * screen, positive shoelace area; holes negative). Every point lies on the segment
 * between the centres of an ink pixel and a 4-adjacent paper pixel, strictly inside it
 * (at least 1/64 px from either centre), hence within 0.5 px (in x or y) of the crack
 * between them; consecutive points differ; no NaN. Neither input is modified.
 */
export function marchingSquaresChains(raster: GreyRaster, mask: InkMask, isoField: IsoLevelField): Point[][] {
  assertGreyRaster(raster);
  assertInkMask(mask);
  assertSameGrid(raster, mask);
  const { width, height, data: grey } = raster;
  const uniformLevel = isoField.kind === 'uniform' ? isoField.level : Number.NaN;
  const chains: Point[][] = [];
  for (const loop of traceCrackLoops(mask)) {
    const { headings } = loop;
    const chain: Point[] = [];
    let x = loop.startX;
    let y = loop.startY;
    let lastX = Number.NaN;
    let lastY = Number.NaN;
    for (let i = 0; i < headings.length; i++) {
      const heading = headings[i]!;
      const inkCol = x + CRACK_INK_DX[heading]!;
      const inkRow = y + CRACK_INK_DY[heading]!;
      const paperCol = x + CRACK_PAPER_DX[heading]!;
      const paperRow = y + CRACK_PAPER_DY[heading]!;
      const iso = isoField.kind === 'uniform' ? uniformLevel : isoLevelAt(isoField, (inkCol + paperCol) / 2 + 0.5, (inkRow + paperRow) / 2 + 0.5);
      const inside = paperCol >= 0 && paperRow >= 0 && paperCol < width && paperRow < height;
      const inkValue = Math.min(grey[inkRow * width + inkCol]!, iso - FIELD_CLAMP_MARGIN);
      const paperValue = Math.max(inside ? grey[paperRow * width + paperCol]! : PADDING_GREY, iso + FIELD_CLAMP_MARGIN);
      let t = (iso - inkValue) / (paperValue - inkValue);
      if (t < MIN_CROSSING_OFFSET) t = MIN_CROSSING_OFFSET;
      else if (t > 1 - MIN_CROSSING_OFFSET) t = 1 - MIN_CROSSING_OFFSET;
      const px = inkCol + 0.5 + t * (paperCol - inkCol);
      const py = inkRow + 0.5 + t * (paperRow - inkRow);
      if (px !== lastX || py !== lastY) {
        chain.push({ x: px, y: py });
        lastX = px;
        lastY = py;
      }
      x += HEADING_DX[heading]!;
      y += HEADING_DY[heading]!;
    }
    const first = chain[0];
    if (chain.length > 1 && first !== undefined && first.x === lastX && first.y === lastY) chain.pop();
    chains.push(chain);
  }
  return chains;
}
