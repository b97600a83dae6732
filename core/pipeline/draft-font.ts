/**
 * From fitted sheets to a test font's contents: one glyph per assigned letter, spaced
 * with default sidebearings, and vertical metrics measured from the drawing. The
 * result is plain data in the shape the font writer takes (electron/io/font).
 */
import type { GlyphOutline } from '../outline/index.ts';
import { contourSegments } from '../outline/index.ts';
import { boundsOfSegments } from '../geometry/bounds.ts';
import { DEFAULT_SIDEBEARING_PER_CAP_HEIGHT, fontHeights, spaceGlyph } from '../metrics/index.ts';
import type { FittedSheet, TracedLetter } from './trace-letters.ts';

export interface DraftFontSettings {
  readonly familyName: string;
  readonly styleName: string;
  readonly unitsPerEm: number;
  readonly capHeight: number;
  /** Sidebearing on each side of every glyph; default 50 units per 700 of cap height. */
  readonly sidebearing?: number;
}

export interface DraftGlyph {
  readonly character: string;
  readonly outline: GlyphOutline;
  readonly advanceWidth: number;
  readonly leftSidebearing: number;
  /** The letter it came from: sheet index and letter index on that sheet. */
  readonly source: { readonly sheet: number; readonly letter: TracedLetter };
}

export interface DraftFont {
  readonly familyName: string;
  readonly styleName: string;
  readonly unitsPerEm: number;
  readonly ascender: number;
  readonly descender: number;
  readonly lineGap: number;
  readonly xHeight: number;
  readonly capHeight: number;
  readonly glyphs: readonly DraftGlyph[];
  readonly notes: readonly string[];
}

/** A mistake in what the user asked for (a character given twice, one that is several code points). */
export class DraftFontError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'DraftFontError';
  }
}

function median(values: readonly number[]): number | null {
  if (values.length === 0) return null;
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  return sorted.length % 2 === 1 ? (sorted[middle] ?? 0) : ((sorted[middle - 1] ?? 0) + (sorted[middle] ?? 0)) / 2;
}

/** Median over sheets of a measured height, in font units. */
function measuredUnits(sheets: readonly FittedSheet[], pick: (s: FittedSheet) => number | undefined): number | null {
  const values = sheets.flatMap((s) => {
    const pixels = pick(s);
    return pixels === undefined ? [] : [pixels * s.unitsPerPixel];
  });
  const m = median(values);
  return m === null ? null : Math.round(m);
}

/**
 * Builds the font contents from fitted sheets. Every assigned, fitted letter becomes a
 * glyph; a character assigned twice is an error naming both places.
 */
export function draftFont(sheets: readonly FittedSheet[], settings: DraftFontSettings): DraftFont {
  const notes: string[] = [];
  const sidebearing = settings.sidebearing ?? Math.round(settings.capHeight * DEFAULT_SIDEBEARING_PER_CAP_HEIGHT);
  const seen = new Map<string, string>();
  const glyphs: DraftGlyph[] = [];
  sheets.forEach((sheet, sheetIndex) => {
    for (const letter of sheet.letters) {
      if (letter.character === null) continue;
      const where = `letter ${letter.index + 1} of sheet ${sheetIndex + 1}`;
      if ([...letter.character].length !== 1) {
        throw new DraftFontError(`"${letter.character}" (${where}) is several code points; a glyph in the test font is reached by one character. Type it precomposed, or leave it out.`);
      }
      const earlier = seen.get(letter.character);
      if (earlier !== undefined) throw new DraftFontError(`"${letter.character}" is assigned twice, to ${earlier} and to ${where}. Each character can have one glyph.`);
      seen.set(letter.character, where);
      if (!letter.outline) {
        notes.push(`"${letter.character}" (${where}) is left out: ${letter.problem ?? 'it has no outline'}.`);
        continue;
      }
      const spaced = spaceGlyph(letter.outline, sidebearing, sidebearing);
      glyphs.push({ character: letter.character, ...spaced, source: { sheet: sheetIndex, letter } });
    }
  });

  // The heights the sheets show, and the shared rule for those they do not (core/metrics/font-heights.ts).
  const heights = fontHeights(
    {
      capHeight: settings.capHeight,
      xHeight: measuredUnits(sheets, (s) => s.metrics.xHeight?.pixels),
      ascender: measuredUnits(sheets, (s) => s.metrics.ascender?.pixels),
      descender: measuredUnits(sheets, (s) => s.metrics.descender?.pixels),
    },
    settings.unitsPerEm,
  );
  const { capHeight, xHeight, ascender, descender, lineGap } = heights;
  if (heights.placeholders.includes('xHeight')) notes.push(`The x-height was not measured (no x, z, v, w, y or u assigned); ${xHeight} units is a placeholder to change.`);
  const inkBounds = glyphs.map((g) => boundsOfSegments(g.outline.contours.flatMap((c) => contourSegments(c))));
  const inkTop = Math.max(capHeight, ...inkBounds.map((b) => b?.maxY ?? 0));
  const inkBottom = Math.min(0, ...inkBounds.map((b) => b?.minY ?? 0));
  if (inkTop > ascender || inkBottom < descender) notes.push(`Some ink reaches beyond the ascender and descender (${Math.round(inkBottom)} to ${Math.round(inkTop)} units); the font's clipping metrics cover it.`);
  return { familyName: settings.familyName, styleName: settings.styleName, unitsPerEm: settings.unitsPerEm, ascender, descender, lineGap, xHeight, capHeight, glyphs, notes };
}
