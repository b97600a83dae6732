// A drawn round comes back as a curve, not as a polygon of short corners (Linux
// Libertine's v and y); the rule that tells a round's pieces from drawn corners; a
// sharp vertex and the corners of a square stroke end a few pixels wide stay corners.

import { describe, expect, it } from 'vitest';
import { fitContour } from '../../core/fit/index.ts';
import { withoutRoundPieces } from '../../core/fit/round-pieces.ts';
import { prepareChain } from '../../core/fit/boundary-chain.ts';
import type { DetectedCorner } from '../../core/fit/corners.ts';
import type { Point } from '../../core/geometry/index.ts';
import { LIBERTINE, describeWithFont } from '../raster/require-font.ts';
import { measureRoundTripGlyph } from './round-trip-measure.ts';
import { polygonChain } from './synthetic-chains.ts';
import { joinsOf, turnDegrees } from './support.ts';

/**
 * A v-shape (counter-clockwise, y up): a flat top from (0, 100) to (120, 100) and two
 * straight legs down to a bottom vertex at (60, 0) rounded with radius `radius`,
 * sampled about every unit along the outline as a boundary tracer steps.
 */
function roundedVee(radius: number): { points: Point[]; roundBottom: Point } {
  const apex = { x: 60, y: 0 };
  const legs = [{ x: 120, y: 100 }, { x: 0, y: 100 }];
  const halfOpening = Math.atan2(60, 100); // between each leg and the vertical
  const centre = { x: apex.x, y: apex.y + radius / Math.sin(halfOpening) };
  const tangentDistance = radius / Math.tan(halfOpening);
  const legLength = Math.hypot(60, 100);
  const along = (to: Point, d: number): Point => ({ x: apex.x + ((to.x - apex.x) * d) / legLength, y: apex.y + ((to.y - apex.y) * d) / legLength });
  const points: Point[] = [];
  // Left leg going down (from (0,100) towards the apex), the arc, then the right leg up.
  const leftStart = along(legs[1]!, tangentDistance);
  const rightStart = along(legs[0]!, tangentDistance);
  for (let d = legLength; d > tangentDistance; d -= 1) points.push(along(legs[1]!, d));
  const a0 = Math.atan2(leftStart.y - centre.y, leftStart.x - centre.x);
  const a1 = Math.atan2(rightStart.y - centre.y, rightStart.x - centre.x);
  const arcLength = radius * Math.abs(a1 - a0);
  const steps = Math.max(2, Math.round(arcLength));
  for (let k = 0; k < steps; k++) {
    const a = a0 + ((a1 - a0) * k) / steps;
    points.push({ x: centre.x + radius * Math.cos(a), y: centre.y + radius * Math.sin(a) });
  }
  for (let d = tangentDistance; d < legLength; d += 1) points.push(along(legs[0]!, d));
  for (let x = 120; x > 0; x -= 1) points.push({ x, y: 100 });
  return { points, roundBottom: { x: apex.x, y: centre.y - radius } };
}

const cornersOf = (contour: ReturnType<typeof fitContour>['contour'], minTurn = 20): Point[] =>
  joinsOf(contour).filter((j) => turnDegrees(j) > minTurn).map((j) => j.point);

describe('rounds drawn at a vertex', () => {
  it('keeps a sharp v-shape sharp', () => {
    const { points } = roundedVee(0.5);
    const fit = fitContour(points, { pixelSize: 1 });
    const near = cornersOf(fit.contour, 45).filter((p) => Math.hypot(p.x - 60, p.y) < 4);
    expect(near.length).toBe(1);
  });

  it('keeps both corners of a square stroke end 5 px wide', () => {
    // A hairline 5 px thick ending square: its two end corners, 5 px apart, turn 90° each.
    const fit = fitContour(polygonChain([{ x: 0, y: 0 }, { x: 80, y: 0 }, { x: 80, y: 5 }, { x: 0, y: 5 }], 0), { pixelSize: 1 });
    expect(cornersOf(fit.contour, 80).length).toBe(4);
  });

  const corner = (index: number, turnDegrees: number, forced = false): DetectedCorner => ({
    index, turn: (turnDegrees * Math.PI) / 180, incoming: { x: 1, y: 0 }, outgoing: { x: 0, y: 1 }, roundingZone: 2, reach: 2, estimate: { x: 0, y: 0 }, forced,
  });
  const { chain } = prepareChain(roundedVee(9).points);
  const at = (arc: number): number => chain.arc.findIndex((s) => s >= arc);

  it('drops corners a few pixels apart that turn the same way by less than a right angle, and only those', () => {
    const pair = [corner(at(100), 35), corner(at(104.5), 50)];
    expect(withoutRoundPieces(chain, pair, 1)).toEqual([]);
    // Farther apart than ROUND_PIECE_SPACING_PX: two corners the designer drew.
    expect(withoutRoundPieces(chain, [corner(at(100), 35), corner(at(106), 50)], 1)).toHaveLength(2);
    // Turning opposite ways (a notch), or by a right angle (a square stroke end): kept.
    expect(withoutRoundPieces(chain, [corner(at(100), 35), corner(at(104), -50)], 1)).toHaveLength(2);
    expect(withoutRoundPieces(chain, [corner(at(100), 90), corner(at(104), 90)], 1)).toHaveLength(2);
    // A third corner next to the pair is dropped with it; a far one stays.
    const kept = withoutRoundPieces(chain, [corner(at(100), 30), corner(at(104), 45), corner(at(108), 30), corner(at(200), 40)], 1);
    expect(kept.map((c) => c.index)).toEqual([at(200)]);
  });

  it('never removes a corner the user forced, nor its neighbour on its account', () => {
    const kept = withoutRoundPieces(chain, [corner(at(100), 30, true), corner(at(104), 40), corner(at(200), 50)], 1);
    expect(kept.map((c) => c.index)).toEqual([at(100), at(104), at(200)]);
  });
});

describeWithFont('rounds of Linux Libertine', LIBERTINE, () => {
  it('fits the blunt bottoms of v and y as curves: every fitted corner is one of the font\'s', () => {
    for (const character of 'vy') {
      const glyph = measureRoundTripGlyph('Linux Libertine Regular', character, 'clean 1 px/unit');
      // Reference: the font's own corners (tangent turn > 20°), fonts-linuxlibertine.
      // Before rounds were told from corners, v had 3 and y 3 corners on their rounds.
      expect(glyph.fittedCorners - glyph.preciseCorners, character).toBe(0);
      expect(glyph.hausdorff, character).toBeLessThanOrEqual(2);
    }
  }, 60_000);
});
