// Reading order of a sheet's letters after the user has corrected them: rows top to
// bottom (their order does not change), letters left to right within a row, and each
// letter's `index` its place in that order. Merging, splitting and cutting letters
// change which letters exist; this puts the survivors back in the order the
// characters are typed in, the order "Assign" deals them out and a project's glyphs
// refer to.

import type { SheetLetter } from './segment-sheet.ts';

/**
 * `letters` sorted by row, then by the left edge of their box (ties: by the top edge,
 * then by their first contour, so the order never depends on the input order), with
 * `index` renumbered from 0. New objects only where the index changes; the input is
 * not modified.
 */
export function inReadingOrder(letters: readonly SheetLetter[]): SheetLetter[] {
  const sorted = [...letters].sort(
    (a, b) => a.row - b.row || a.box.x - b.box.x || a.box.y - b.box.y || (a.contours[0] ?? 0) - (b.contours[0] ?? 0),
  );
  return sorted.map((letter, index) => (letter.index === index ? letter : { ...letter, index }));
}
