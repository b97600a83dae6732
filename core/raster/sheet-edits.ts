// The user's corrections of a traced sheet, as plain data: retyping one letter's
// character, assigning the typed characters in reading order, merging letters,
// splitting one by its pieces or cutting its ink, and setting the guides (a row's
// baseline, the sheet's cap height and x-height). A sheet as corrected is the traced
// sheet with its edits applied in order; the edits are what a project saves, and
// undo is the same list with the last one left off. Each edit refers to letters by
// their reading-order index at the moment it was made, so replaying the list on the
// same scan gives the same letters.

import type { Contour } from './types.ts';
import { cutLetterInk, type InkSource } from './cut-ink.ts';
import { mergeLetters, unionOfBoxes } from './merge-letters.ts';
import { inReadingOrder } from './reading-order.ts';
import { splitCharacters, type SheetLetter, type SheetSegmentation } from './segment-sheet.ts';
import { SheetEditError } from './sheet-edit-error.ts';
import { letterPieces, splitLetterByPieces } from './split-letter.ts';
import { boundingBox } from './polygon-measures.ts';

/** Which height guide a 'height' edit sets. */
export type HeightGuide = 'cap-height' | 'x-height';

export type SheetEdit =
  /** The typed characters dealt to the letters in reading order (whitespace skipped). */
  | { readonly kind: 'assign'; readonly characters: string }
  /** One letter's character; '' leaves the letter without one. */
  | { readonly kind: 'retype'; readonly letter: number; readonly character: string }
  /** The letters made one (see mergeLetters). */
  | { readonly kind: 'merge'; readonly letters: readonly number[] }
  /** One letter split by its pieces at x (see splitLetterByPieces). */
  | { readonly kind: 'split'; readonly letter: number; readonly x: number }
  /** One letter's ink cut at x and re-traced (see cutLetterInk). */
  | { readonly kind: 'cut'; readonly letter: number; readonly x: number }
  /** A row's baseline set to y (pixel frame, y down). */
  | { readonly kind: 'baseline'; readonly row: number; readonly y: number }
  /** The sheet's cap height or x-height set, in pixels above each row's baseline; null goes back to the measured height. */
  | { readonly kind: 'height'; readonly guide: HeightGuide; readonly pixels: number | null };

/** The guides the user has set by hand (the others are measured). */
export interface SheetGuides {
  /** Rows whose baseline the user set, ascending. */
  readonly baselinesSet: readonly number[];
  /** Cap height in pixels above the baseline, or null while measured. */
  readonly capHeightPixels: number | null;
  /** X-height in pixels above the baseline, or null while measured. */
  readonly xHeightPixels: number | null;
}

/** A sheet as the user corrected it. */
export interface CorrectedSheet {
  /** Every contour: the traced ones first, then those of each cut, appended (never removed, so indices stay valid). */
  readonly contours: readonly Contour[];
  /** Letters in reading order and rows, baselines as set. */
  readonly sheet: SheetSegmentation;
  readonly guides: SheetGuides;
}

export const NO_GUIDES_SET: SheetGuides = { baselinesSet: [], capHeightPixels: null, xHeightPixels: null };

/** The sheet as traced, before any correction. */
export function uncorrectedSheet(contours: readonly Contour[], sheet: SheetSegmentation): CorrectedSheet {
  return { contours, sheet, guides: NO_GUIDES_SET };
}

function letterAt(sheet: SheetSegmentation, index: number, doing: string): SheetLetter {
  const letter = Number.isInteger(index) ? sheet.letters[index] : undefined;
  if (letter === undefined) throw new SheetEditError(`The sheet has ${sheet.letters.length} letters and no letter #${index + 1}; select a box on the sheet and ${doing} again.`);
  return letter;
}

function finite(value: number, what: string): number {
  if (!Number.isFinite(value)) throw new SheetEditError(`The ${what} must be a number of pixels, not ${String(value)}; drag the line again.`);
  return value;
}

/**
 * The typed characters dealt to the letters in reading order; surplus letters get
 * none, and the sheet's notes say how the counts differ (as segmentSheet's do).
 */
export function assignInReadingOrder(sheet: SheetSegmentation, text: string): SheetSegmentation {
  const characters = splitCharacters(text);
  const letters = sheet.letters.map((letter, i) => ({ ...letter, character: characters[i] ?? null }));
  const notes = sheet.notes.filter((note) => !note.startsWith('The text has '));
  if (characters.length > 0 && characters.length < letters.length) {
    notes.push(`The text has ${characters.length} character(s) for ${letters.length} letters; the last ${letters.length - characters.length} letter(s) have no character yet.`);
  } else if (characters.length > letters.length) {
    notes.push(`The text has ${characters.length} characters but only ${letters.length} letters were found; "${characters.slice(letters.length).join('')}" was not assigned. Split letters that touch, or check for missing letters.`);
  }
  return { ...sheet, letters, notes };
}

/** Replaces the letter at `index` with `parts` (ink appended to `contours` first) and renumbers. */
function withCutLetter(state: CorrectedSheet, index: number, cut: ReturnType<typeof cutLetterInk>): CorrectedSheet {
  const letter = state.sheet.letters[index]!;
  const contours = [...state.contours];
  const append = (side: readonly Contour[]): number[] => {
    const base = contours.length;
    for (const c of side) contours.push({ ...c, parent: c.parent === -1 ? -1 : c.parent + base });
    return side.map((_, i) => base + i);
  };
  const part = (indices: number[], character: string | null): SheetLetter => ({
    index,
    box: indices.filter((i) => contours[i]!.parent === -1).map((i) => boundingBox(contours[i]!.points)).reduce(unionOfBoxes),
    contours: indices,
    row: letter.row,
    character,
  });
  const left = part(append(cut.left), letter.character);
  const right = part(append(cut.right), null);
  const others = state.sheet.letters.filter((l) => l.index !== index);
  return { ...state, contours, sheet: { ...state.sheet, letters: inReadingOrder([...others, left, right]) } };
}

/**
 * The sheet after `edit`. `source` is needed for a cut only (the ink is traced
 * again). Throws SheetEditError, with what to do, when the edit cannot be made on
 * this sheet. Nothing passed in is modified.
 */
export function applySheetEdit(state: CorrectedSheet, edit: SheetEdit, source?: InkSource): CorrectedSheet {
  const { sheet } = state;
  switch (edit.kind) {
    case 'assign':
      return { ...state, sheet: assignInReadingOrder(sheet, edit.characters) };
    case 'retype': {
      const letter = letterAt(sheet, edit.letter, 'type its character');
      const characters = splitCharacters(edit.character);
      if (characters.length > 1) throw new SheetEditError(`"${edit.character}" is ${characters.length} characters; a letter is drawn for one. Type one character (an accented letter counts as one), or none to clear it.`);
      const character = characters[0] ?? null;
      return { ...state, sheet: { ...sheet, letters: sheet.letters.map((l) => (l === letter ? { ...l, character } : l)) } };
    }
    case 'merge':
      return { ...state, sheet: mergeLetters(sheet, edit.letters) };
    case 'split':
      letterAt(sheet, edit.letter, 'split it');
      return { ...state, sheet: splitLetterByPieces(sheet, state.contours, edit.letter, finite(edit.x, 'split line')) };
    case 'cut': {
      const letter = letterAt(sheet, edit.letter, 'cut it');
      if (source === undefined) throw new SheetEditError('Cutting ink needs the scan the sheet was traced from; open the scan again and cut once more.');
      return withCutLetter(state, edit.letter, cutLetterInk(source, state.contours, letter, finite(edit.x, 'cut line')));
    }
    case 'baseline': {
      const row = Number.isInteger(edit.row) ? sheet.rows[edit.row] : undefined;
      if (row === undefined) throw new SheetEditError(`The sheet has ${sheet.rows.length} rows and no row ${edit.row + 1}; drag a baseline drawn on the sheet.`);
      const y = finite(edit.y, 'baseline');
      const baselinesSet = [...new Set([...state.guides.baselinesSet, row.index])].sort((a, b) => a - b);
      return { ...state, sheet: { ...sheet, rows: sheet.rows.map((r) => (r === row ? { ...r, baseline: y } : r)) }, guides: { ...state.guides, baselinesSet } };
    }
    case 'height': {
      if (edit.pixels === null) return { ...state, guides: edit.guide === 'cap-height' ? { ...state.guides, capHeightPixels: null } : { ...state.guides, xHeightPixels: null } };
      const pixels = finite(edit.pixels, edit.guide === 'cap-height' ? 'cap height' : 'x-height');
      if (!(pixels > 0)) throw new SheetEditError(`The ${edit.guide === 'cap-height' ? 'cap height' : 'x-height'} must lie above the baseline, not ${Math.round(-pixels)} px below it; drag the line above the baseline.`);
      return { ...state, guides: edit.guide === 'cap-height' ? { ...state.guides, capHeightPixels: pixels } : { ...state.guides, xHeightPixels: pixels } };
    }
  }
}

/**
 * `edits` applied in order to `start`. Throws SheetEditError naming the first edit
 * that cannot be made (its position in the list and why).
 */
export function applySheetEdits(start: CorrectedSheet, edits: readonly SheetEdit[], source?: InkSource): CorrectedSheet {
  return edits.reduce((state, edit, i) => {
    try {
      return applySheetEdit(state, edit, source);
    } catch (error) {
      if (error instanceof SheetEditError) throw new SheetEditError(`Correction ${i + 1} of ${edits.length} (${edit.kind}) cannot be made on this scan: ${error.message}`);
      throw error;
    }
  }, start);
}

/** Whether the sheet's pieces of letter `index` could be split (it has more than one piece). */
export function hasSeveralPieces(state: CorrectedSheet, index: number): boolean {
  const letter = state.sheet.letters[index];
  return letter !== undefined && letterPieces(state.contours, letter).length > 1;
}
