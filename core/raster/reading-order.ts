// Reading order of a sheet's letters after the user has corrected them: rows top to
// bottom (their order does not change), letters left to right within a row, and each
// letter's `index` its place in that order. Merging, splitting and cutting letters
// change which letters exist; this puts the survivors back in the order the
// characters are typed in, the order "Assign" deals them out and a project's glyphs
// refer to.

import type { SheetLetter } from './segment-sheet.ts';

/**
 * `letters` sorted by row, then by the left edge of their box, with `index`
 * renumbered from 0. Letters with the same row and left edge (a dot found apart from
 * its stem) keep the order they have in `letters`, so a correction never swaps the
 * numbers of letters it did not touch. New objects only where the index changes; the
 * input is not modified.
 */
export function inReadingOrder(letters: readonly SheetLetter[]): SheetLetter[] {
  const sorted = [...letters].sort((a, b) => a.row - b.row || a.box.x - b.box.x);
  return sorted.map((letter, index) => (letter.index === index ? letter : { ...letter, index }));
}
