/**
 * Corners that are pieces of a drawn round: two or more detected corners a few pixels
 * apart, turning the same way and each by less than a right angle, are the detector's
 * picture of one rounded turn (the blunt bottom of a v, the bracket where a serif meets
 * its stem, the rounded crotch of a y), not of corners the designer drew.
 *
 * Why: the detector measures the turn over stretches CORNER_SUPPORT_PX long, so on a
 * round whose radius is a few times that support the turn over any one support exceeds
 * the corner angle, and its non-maximum suppression leaves one peak per support
 * length along the round. Each peak verifies (its sides, bounded by the neighbouring
 * peaks, do turn), and the round becomes a polygon: two or three corners joined by
 * stubs a few pixels long, which a designer would have to redraw as the one smooth
 * curve they drew. Left to the curve fit, the round is fitted as a curve.
 *
 * Measured on the round trip of Linux Libertine (A–Z a–z 0–9, fonts-linuxlibertine):
 * of the fitted corners farther than 4 units from any corner of the font, 43 of 69
 * (clean, 1 px per unit) had such a neighbour within 5 px, against 2 of the 494
 * corners that match the font's. Drawn corners that close together with turns of a
 * right angle or more (the two corners of a square stroke end, a flat-topped apex)
 * are kept.
 */
import { wrapIndex, type BoundaryChain } from './boundary-chain.ts';
import type { DetectedCorner } from './corners.ts';

/**
 * Largest arc distance between two corners of one round: 5 px. Non-maximum suppression
 * keeps peaks at least CORNER_SUPPORT_PX = 4 px apart, so the pieces of one round are
 * 4–5 px apart; drawn corners that close are rare in lettering (measured above).
 */
export const ROUND_PIECE_SPACING_PX = 5;
/**
 * A piece of a round turns by less than this: 90°. A round cut into pieces 4–5 px long
 * has a radius of at least about 3 px there (tighter rounds are resolved as one corner),
 * so each piece turns by at most about 5/3 rad ≈ 95°, and measured pieces turned
 * 25°–87°; the drawn corners of a stroke end turn by a right angle or more.
 */
export const ROUND_PIECE_MAX_TURN_DEGREES = 90;

/** Cyclic arc distance between two chain indices. */
function arcBetween(chain: BoundaryChain, i: number, j: number): number {
  const d = Math.abs(chain.arc[wrapIndex(chain, i)]! - chain.arc[wrapIndex(chain, j)]!);
  return Math.min(d, chain.perimeter - d);
}

/**
 * `corners` (sorted by index) without the pieces of rounds: every unforced corner
 * turning by less than ROUND_PIECE_MAX_TURN_DEGREES that has a neighbour along the
 * chain within ROUND_PIECE_SPACING_PX turning the same way, also unforced and also
 * below that turn. The input is not modified.
 */
export function withoutRoundPieces(chain: BoundaryChain, corners: readonly DetectedCorner[], pixel: number): DetectedCorner[] {
  const count = corners.length;
  if (count < 2) return [...corners];
  const spacing = ROUND_PIECE_SPACING_PX * pixel;
  const maxTurn = (ROUND_PIECE_MAX_TURN_DEGREES * Math.PI) / 180;
  const piece = (c: DetectedCorner): boolean => !c.forced && Math.abs(c.turn) < maxTurn;
  const pieces = new Set<number>();
  for (let k = 0; k < count; k++) {
    const next = (k + 1) % count;
    if (next === k) continue;
    const a = corners[k]!;
    const b = corners[next]!;
    if (piece(a) && piece(b) && Math.sign(a.turn) === Math.sign(b.turn) && arcBetween(chain, a.index, b.index) <= spacing) {
      pieces.add(k);
      pieces.add(next);
    }
  }
  return corners.filter((_, k) => !pieces.has(k));
}
