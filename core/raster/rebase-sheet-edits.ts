// Carrying the user's corrections over to the letters found again with other scan
// settings (another threshold, another speck size). Corrections refer to letters by
// their reading-order index (sheet-edits.ts), which is only meaningful for the sheet
// they were made on. When the new settings find the same letters in the same places,
// every correction still applies and is kept as it is. When they find other letters
// (strokes joined or broken, specks become letters), each new letter takes the
// character of the corrected letter that covers the same place, and the guides the
// user set are kept; merges, splits and cuts are dropped (their letters are gone), and
// the result says how many, so the user can be told.

import type { SheetEdit, CorrectedSheet } from './sheet-edits.ts';
import type { SheetSegmentation } from './segment-sheet.ts';
import type { Box } from './types.ts';

/**
 * Two boxes are the same letter's when every edge is within this many pixels. A change
 * of threshold moves a scanned edge by a pixel or so on a 300–600 dpi scan (its grey
 * ramp is 2–4 px wide); chosen to cover that and no more.
 */
export const SAME_BOX_TOLERANCE_PX = 3;
/**
 * A new letter takes the character of the old one whose box overlaps it most, when the
 * overlap is at least this share of their union (intersection over union): a letter
 * whose ink merely thickened overlaps far more, while a neighbour never reaches it.
 * Chosen value.
 */
export const SAME_PLACE_OVERLAP = 0.5;

export interface RebasedEdits {
  /** The corrections for the new sheet. */
  readonly edits: SheetEdit[];
  /** 'all': the letters are the same and every correction was kept; 'characters': characters and guides carried over by place. */
  readonly kept: 'all' | 'characters';
  /** Letters that had a character and have no letter in the same place now. */
  readonly lostCharacters: number;
  /** Merges, splits and cuts that could not be carried over. */
  readonly droppedCorrections: number;
}

function sameBox(a: Box, b: Box): boolean {
  return (
    Math.abs(a.x - b.x) <= SAME_BOX_TOLERANCE_PX &&
    Math.abs(a.y - b.y) <= SAME_BOX_TOLERANCE_PX &&
    Math.abs(a.x + a.width - (b.x + b.width)) <= SAME_BOX_TOLERANCE_PX &&
    Math.abs(a.y + a.height - (b.y + b.height)) <= SAME_BOX_TOLERANCE_PX
  );
}

function overlap(a: Box, b: Box): number {
  const w = Math.min(a.x + a.width, b.x + b.width) - Math.max(a.x, b.x);
  const h = Math.min(a.y + a.height, b.y + b.height) - Math.max(a.y, b.y);
  if (w <= 0 || h <= 0) return 0;
  const intersection = w * h;
  return intersection / (a.width * a.height + b.width * b.height - intersection);
}

/** Whether two traced sheets found the same letters in the same places and rows. */
export function sameLetters(a: SheetSegmentation, b: SheetSegmentation): boolean {
  return (
    a.letters.length === b.letters.length &&
    a.rows.length === b.rows.length &&
    a.letters.every((letter, i) => {
      const other = b.letters[i]!;
      return letter.row === other.row && letter.contours.length === other.contours.length && sameBox(letter.box, other.box);
    })
  );
}

/**
 * The corrections `edits`, made on a sheet first traced as `before` and corrected to
 * `corrected`, carried over to the sheet traced again as `after`. Pure.
 */
export function rebaseSheetEdits(before: SheetSegmentation, corrected: CorrectedSheet, edits: readonly SheetEdit[], after: SheetSegmentation): RebasedEdits {
  if (sameLetters(before, after)) return { edits: [...edits], kept: 'all', lostCharacters: 0, droppedCorrections: 0 };

  // Each new letter takes the character of the corrected letter in the same place; each old letter gives it once, best overlaps first.
  const pairs: { from: number; to: number; overlap: number }[] = [];
  corrected.sheet.letters.forEach((old, from) => {
    if (old.character === null) return;
    after.letters.forEach((letter, to) => {
      const o = overlap(old.box, letter.box);
      if (o >= SAME_PLACE_OVERLAP) pairs.push({ from, to, overlap: o });
    });
  });
  pairs.sort((a, b) => b.overlap - a.overlap);
  const characters = new Map<number, string>();
  const given = new Set<number>();
  for (const pair of pairs) {
    if (given.has(pair.from) || characters.has(pair.to)) continue;
    given.add(pair.from);
    characters.set(pair.to, corrected.sheet.letters[pair.from]!.character!);
  }
  const hadCharacters = corrected.sheet.letters.filter((l) => l.character !== null).length;

  const rebased: SheetEdit[] = [];
  const assignedCount = characters.size;
  const isPrefix = [...characters.keys()].every((index) => index < assignedCount);
  if (assignedCount > 0 && isPrefix) {
    rebased.push({ kind: 'assign', characters: after.letters.slice(0, assignedCount).map((_, i) => characters.get(i)!).join('') });
  } else {
    for (const [letter, character] of [...characters].sort((a, b) => a[0] - b[0])) rebased.push({ kind: 'retype', letter, character });
  }
  // Guides: the heights hold for any letters; a row's baseline only while the rows are the same rows.
  const sameRows = before.rows.length === after.rows.length;
  for (const edit of edits) {
    if (edit.kind === 'height' || (edit.kind === 'baseline' && sameRows)) rebased.push(edit);
  }
  const droppedCorrections = edits.filter((e) => e.kind === 'merge' || e.kind === 'split' || e.kind === 'cut' || (e.kind === 'baseline' && !sameRows)).length;
  return { edits: rebased, kept: 'characters', lostCharacters: hadCharacters - given.size, droppedCorrections };
}
