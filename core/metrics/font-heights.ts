/**
 * The font's vertical metrics from the heights measured on the drawing, with the one
 * rule for a height the drawing does not show: a fixed share of the cap height. The
 * command-line build (core/pipeline/draft-font.ts) and the app (the letter document
 * in renderer/src/editor/letter-document.ts) both take their metrics from here, so
 * the same drawing gives the same font heights either way.
 *
 * The shares are those of a common Latin text design (common practice, from memory):
 * on a 1000-unit em with a 700-unit cap height, an x-height of 0.7 of the cap height,
 * ascenders rising to 750 and descenders falling to −250, so that ascender to
 * descender spans one em. They are kept relative to the cap height rather than to the
 * em, because they stand for proportions of the letters, and the cap height is what
 * sets the drawing's scale: a designer who sets a larger em or a smaller cap height
 * expects the placeholder descender to stay in proportion with the capitals.
 */
import { defaultLineGap } from './line-gap.ts';

/** Placeholder x-height per unit of cap height (common practice for Latin text faces, from memory). */
export const FALLBACK_X_HEIGHT_PER_CAP = 0.7;
/** Placeholder ascender per unit of cap height: 750 over a 700-unit cap height (common practice, from memory). */
export const FALLBACK_ASCENDER_PER_CAP = 750 / 700;
/** Placeholder descender per unit of cap height: −250 under a 700-unit cap height, so ascender to descender spans a 1000-unit em (common practice, from memory). */
export const FALLBACK_DESCENDER_PER_CAP = -250 / 700;

/** Heights measured on the drawing, in font units; null where the drawing does not show one. */
export interface DrawnHeights {
  readonly capHeight: number;
  readonly xHeight: number | null;
  readonly ascender: number | null;
  readonly descender: number | null;
}

export type PlaceholderHeight = 'xHeight' | 'ascender' | 'descender';

/** The font's vertical metrics, whole units, and which of them are placeholders. */
export interface FontHeights {
  readonly unitsPerEm: number;
  readonly capHeight: number;
  readonly xHeight: number;
  readonly ascender: number;
  readonly descender: number;
  /** What tops ascender − descender up to 1.2 em (line-gap.ts). */
  readonly lineGap: number;
  /** The heights the drawing did not show, taken as their share of the cap height. */
  readonly placeholders: readonly PlaceholderHeight[];
}

/**
 * The metrics for `drawn` on an em of `unitsPerEm`: every measured height rounded to
 * whole units, each missing one its share of the cap height; the ascender never below
 * the cap height and the descender never above the baseline, as a font needs them.
 */
export function fontHeights(drawn: DrawnHeights, unitsPerEm: number): FontHeights {
  const capHeight = Math.round(drawn.capHeight);
  const placeholders: PlaceholderHeight[] = [];
  const pick = (name: PlaceholderHeight, measured: number | null, share: number) => {
    if (measured !== null) return Math.round(measured);
    placeholders.push(name);
    return Math.round(capHeight * share);
  };
  const xHeight = pick('xHeight', drawn.xHeight, FALLBACK_X_HEIGHT_PER_CAP);
  const ascender = Math.max(pick('ascender', drawn.ascender, FALLBACK_ASCENDER_PER_CAP), capHeight);
  const descender = Math.min(pick('descender', drawn.descender, FALLBACK_DESCENDER_PER_CAP), 0);
  return { unitsPerEm, capHeight, xHeight, ascender, descender, lineGap: defaultLineGap(unitsPerEm, ascender, descender), placeholders };
}
