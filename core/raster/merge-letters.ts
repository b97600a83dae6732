// Merging letters the segmentation kept apart: the dot of an i drawn too far from its
// stem, a stroke that broke on the scan with a wider crack than the segmentation
// bridges, the two parts of a letter a lettering artist drew with a gap. The merged
// letter holds every contour of the letters merged — outer contours with their holes
// and islands, exactly as traced — so nesting is untouched.

import type { Box } from './types.ts';
import { inReadingOrder } from './reading-order.ts';
import type { SheetLetter, SheetSegmentation } from './segment-sheet.ts';
import { SheetEditError } from './sheet-edit-error.ts';

/** The smallest box holding both. */
export function unionOfBoxes(a: Box, b: Box): Box {
  const x = Math.min(a.x, b.x);
  const y = Math.min(a.y, b.y);
  return { x, y, width: Math.max(a.x + a.width, b.x + b.width) - x, height: Math.max(a.y + a.height, b.y + b.height) - y };
}

/**
 * The sheet with the letters at `indices` (reading-order indices, at least two,
 * distinct) made one letter.
 *
 * The merged letter's contours are the sorted union of theirs (each contour keeps its
 * depth and parent, so holes stay under their outer contours), its box the union of
 * their boxes, its row the row of the first of them in reading order, and its
 * character the first assigned character among them in reading order. Letters are
 * renumbered in reading order. Throws SheetEditError for fewer than two letters or an
 * index the sheet does not have. Nothing passed in is modified.
 */
export function mergeLetters(sheet: SheetSegmentation, indices: readonly number[]): SheetSegmentation {
  const chosen = [...new Set(indices)].sort((a, b) => a - b);
  if (chosen.length < 2) throw new SheetEditError('Merging needs at least two letters: select another box (shift-click) and merge again.');
  const merged = chosen.map((index) => {
    const letter = sheet.letters[index];
    if (letter === undefined) throw new SheetEditError(`The sheet has ${sheet.letters.length} letters and no letter #${index + 1}; select letters on the sheet and merge again.`);
    return letter;
  });
  const first = merged[0]!;
  const union: SheetLetter = {
    index: first.index,
    box: merged.map((l) => l.box).reduce(unionOfBoxes),
    contours: [...new Set(merged.flatMap((l) => l.contours))].sort((a, b) => a - b),
    row: first.row,
    character: merged.find((l) => l.character !== null)?.character ?? null,
  };
  const gone = new Set(chosen);
  const kept = sheet.letters.filter((l) => !gone.has(l.index));
  return { ...sheet, letters: inReadingOrder([...kept, union]) };
}
