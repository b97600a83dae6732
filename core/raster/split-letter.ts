// Splitting one letter into two by its pieces of ink: where the segmentation joined
// separate pieces that are really two letters (a mark taken for another letter's
// accent, two narrow letters overlapping horizontally, a kerned pair such as "To"
// whose pieces overlap in x but do not touch). A piece is an outer contour with every
// contour nested in it, so holes always go with their outer contour. Pieces are dealt
// to the two sides by a vertical line: a piece whose box centre lies left of the line
// goes left. Where the ink itself touches, cut-ink.ts cuts and re-traces it instead.

import { boundingBox } from './polygon-measures.ts';
import type { Box, Contour } from './types.ts';
import { inReadingOrder } from './reading-order.ts';
import { unionOfBoxes } from './merge-letters.ts';
import type { SheetLetter, SheetSegmentation } from './segment-sheet.ts';
import { SheetEditError } from './sheet-edit-error.ts';

/** One piece of a letter: an outer contour and the contours nested in it. */
export interface LetterPiece {
  /** Contour indices, ascending; the first-listed outer contour is `outer`. */
  readonly contours: readonly number[];
  /** The outer contour's index. */
  readonly outer: number;
  /** Bounding box of the outer contour (pixel frame). */
  readonly box: Box;
}

/** A span of x, [from, to], that a vertical line can cross without touching a piece. */
export interface PieceGap {
  readonly from: number;
  readonly to: number;
}

/**
 * The pieces of `letter`, left to right by their box's left edge. A contour of the
 * letter whose parent is not in the letter (or is -1) is an outer contour; every other
 * contour goes with the outer contour it is nested under. Throws SheetEditError when
 * the letter names a contour `contours` does not have.
 */
export function letterPieces(contours: readonly Contour[], letter: SheetLetter): LetterPiece[] {
  const own = new Set(letter.contours);
  const outerOf = (index: number): number => {
    let node = index;
    for (let guard = contours.length; guard > 0; guard--) {
      const parent = contours[node]!.parent;
      if (parent === -1 || !own.has(parent)) return node;
      node = parent;
    }
    return node;
  };
  const groups = new Map<number, number[]>();
  for (const index of letter.contours) {
    if (contours[index] === undefined) throw new SheetEditError(`Letter #${letter.index + 1} refers to ink the sheet does not have; open the scan again.`);
    const outer = outerOf(index);
    const list = groups.get(outer);
    if (list === undefined) groups.set(outer, [index]);
    else list.push(index);
  }
  return [...groups].map(([outer, list]) => ({ outer, contours: list.sort((a, b) => a - b), box: boundingBox(contours[outer]!.points) })).sort((a, b) => a.box.x - b.box.x || a.outer - b.outer);
}

/** The open spans between the pieces' horizontal extents, left to right (empty when they overlap all the way across). */
export function pieceGaps(pieces: readonly LetterPiece[]): PieceGap[] {
  const gaps: PieceGap[] = [];
  let reach = -Infinity;
  for (const piece of [...pieces].sort((a, b) => a.box.x - b.box.x)) {
    if (reach !== -Infinity && piece.box.x > reach) gaps.push({ from: reach, to: piece.box.x });
    reach = Math.max(reach, piece.box.x + piece.box.width);
  }
  return gaps;
}

/**
 * The pieces a vertical line at x = `at` runs through the ink of. A piece's outer
 * contour is one closed curve, so the line crosses it exactly when `at` lies strictly
 * inside the contour's horizontal extent: the box test is exact.
 */
export function piecesCrossedAt(pieces: readonly LetterPiece[], at: number): LetterPiece[] {
  return pieces.filter((piece) => piece.box.x < at && at < piece.box.x + piece.box.width);
}

/** Which side of a vertical line at x = `at` a piece goes to: left when its box centre is left of the line. */
export function pieceSide(piece: LetterPiece, at: number): 'left' | 'right' {
  return piece.box.x + piece.box.width / 2 < at ? 'left' : 'right';
}

/**
 * The sheet with letter `index` split into two letters by its pieces: those whose box
 * centre lies left of x = `at` (pixel frame) and the others. The left letter keeps the
 * character, the right one has none yet; both stay in the letter's row, and letters
 * are renumbered in reading order. Throws SheetEditError when there is no such letter
 * or when one side would have no piece (the message says to cut the ink instead where
 * letters touch). Nothing passed in is modified.
 */
export function splitLetterByPieces(sheet: SheetSegmentation, contours: readonly Contour[], index: number, at: number): SheetSegmentation {
  const letter = sheet.letters[index];
  if (letter === undefined) throw new SheetEditError(`The sheet has ${sheet.letters.length} letters and no letter #${index + 1}; select a box on the sheet and split again.`);
  const pieces = letterPieces(contours, letter);
  const left = pieces.filter((p) => pieceSide(p, at) === 'left');
  const right = pieces.filter((p) => pieceSide(p, at) === 'right');
  if (left.length === 0 || right.length === 0) {
    const why = pieces.length === 1 ? 'its ink is one piece' : `all ${pieces.length} of its pieces lie ${left.length === 0 ? 'right' : 'left'} of the line`;
    throw new SheetEditError(`Letter #${letter.index + 1} cannot be split there: ${why}. Move the line between two pieces, or cut the ink where the letters touch.`);
  }
  const part = (side: readonly LetterPiece[], character: string | null): SheetLetter => ({
    index: letter.index,
    box: side.map((p) => p.box).reduce(unionOfBoxes),
    contours: side.flatMap((p) => p.contours).sort((a, b) => a - b),
    row: letter.row,
    character,
  });
  const others = sheet.letters.filter((l) => l.index !== index);
  return { ...sheet, letters: inReadingOrder([...others, part(left, letter.character), part(right, null)]) };
}
