// The corrections the user made to a scan's letters and guides (core/raster
// sheet-edits.ts), as a project saves them under the scan: `sheetEdits`, applied in
// order to the scan as traced when the project opens. The field is optional, so a
// project saved before it existed opens as it always did (its `characters` assigned
// in reading order). Each kind of correction is validated field by field, so a
// hand-edited file is refused naming the field that is wrong.
import * as v from 'valibot';
import type { SheetEdit } from '../../../core/raster/index.ts';

/**
 * Largest pixel coordinate accepted: far beyond any scan Stemline decodes (the
 * 200-megapixel budget allows at most 200 million pixels on one side).
 */
const MAX_PIXEL = 200_000_000;
/** Longest character a letter may be typed with: a grapheme cluster of a few code points, with room for long emoji sequences. */
const MAX_CHARACTER_LENGTH = 64;
/** Longest "assign" text: far more characters than letters fit on a sheet. */
const MAX_ASSIGN_LENGTH = 100_000;

const letterIndex = v.pipe(v.number(), v.integer('a letter number counted from 0'), v.minValue(0));
const pixel = v.pipe(v.number(), v.finite('a position in pixels'), v.minValue(-MAX_PIXEL), v.maxValue(MAX_PIXEL));

export const sheetEditSchema = v.variant('kind', [
  v.strictObject({ kind: v.literal('assign'), characters: v.pipe(v.string(), v.maxLength(MAX_ASSIGN_LENGTH)) }),
  v.strictObject({ kind: v.literal('retype'), letter: letterIndex, character: v.pipe(v.string(), v.maxLength(MAX_CHARACTER_LENGTH)) }),
  v.strictObject({ kind: v.literal('merge'), letters: v.pipe(v.array(letterIndex), v.minLength(2, 'at least two letters to merge')) }),
  v.strictObject({ kind: v.literal('split'), letter: letterIndex, x: pixel }),
  v.strictObject({ kind: v.literal('cut'), letter: letterIndex, x: pixel }),
  v.strictObject({ kind: v.literal('baseline'), row: v.pipe(v.number(), v.integer('a row number counted from 0'), v.minValue(0)), y: pixel }),
  v.strictObject({ kind: v.literal('height'), guide: v.picklist(['cap-height', 'x-height']), pixels: v.nullable(v.pipe(pixel, v.gtValue(0, 'a height above the baseline'))) }),
], 'a sheet correction: "kind" one of assign, retype, merge, split, cut, baseline, height');

export const sheetEditsSchema = v.array(sheetEditSchema);

/** A correction as a project holds it. */
export type SavedSheetEdit = v.InferOutput<typeof sheetEditSchema>;
/** Every correction read from a project is one the core applies: checked here so the two cannot drift apart. */
const readsAsCoreEdit: [SavedSheetEdit] extends [SheetEdit] ? true : false = true;
void readsAsCoreEdit;

/** `edit` as a project saves it (the core's lists are read-only; the project's are plain arrays). */
export function savedSheetEdit(edit: SheetEdit): SavedSheetEdit {
  return edit.kind === 'merge' ? { ...edit, letters: [...edit.letters] } : { ...edit };
}
