/**
 * Cap height and x-height set by the user on the sheet, over the measured ones. The
 * measurement (measure-metrics.ts) reads flat-topped letters; where the drawing has
 * none, or the artist drew to guide lines the ink does not show exactly, the user
 * drags the guide to where the letters are meant to stand, and that height is the
 * one the fit scales by and the font's metrics come from.
 */
import type { SheetMetrics } from './measure-metrics.ts';

/** Heights in pixels above each row's baseline; null keeps the measured height. */
export interface GuideHeights {
  readonly capHeightPixels: number | null;
  readonly xHeightPixels: number | null;
}

/** The letters a height set by hand was measured on: none. */
export const SET_BY_HAND = '';

/**
 * `metrics` with each height the user set in place of the measured one (its
 * `letters` is {@link SET_BY_HAND}), and the note about a height that could not be
 * measured dropped when the user has set it. A height set to anything but a positive
 * finite number is refused with a RangeError saying what to do.
 */
export function withGuideHeights(metrics: SheetMetrics, guides: GuideHeights): SheetMetrics {
  const check = (pixels: number | null, name: string): void => {
    if (pixels !== null && !(Number.isFinite(pixels) && pixels > 0)) throw new RangeError(`The ${name} set on the sheet is ${String(pixels)} px; it must be above the baseline. Drag the ${name} guide above the baseline.`);
  };
  check(guides.capHeightPixels, 'cap height');
  check(guides.xHeightPixels, 'x-height');
  const capHeight = guides.capHeightPixels === null ? metrics.capHeight : { pixels: guides.capHeightPixels, letters: SET_BY_HAND };
  const xHeight = guides.xHeightPixels === null ? metrics.xHeight : { pixels: guides.xHeightPixels, letters: SET_BY_HAND };
  const notes = metrics.notes.filter((note) => !(guides.capHeightPixels !== null && note.includes('cap height falls back')) && !(guides.xHeightPixels !== null && note.includes('x-height is not measured')));
  return { ...metrics, capHeight, xHeight, notes };
}
