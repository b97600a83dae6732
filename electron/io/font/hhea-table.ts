// The 'hhea' table's values and the patch that sets them (OpenType spec, 'hhea').
// opentype.js 2.0.0 writes lineGap 0 whatever the font says, and computes the
// sidebearing extremes from control points, counting glyphs without ink and leaving
// out .notdef. Here ascender/descender/lineGap equal the OS/2 typo values (so line
// spacing agrees on every platform), and the extremes follow the spec's definitions
// over glyphs with contours, on the same whole-unit boxes the font records.
import type { PreparedFont } from './prepare-font.ts';

/** Field offsets in 'hhea' (OpenType spec, 'hhea' version 1.0 layout). */
const HHEA_OFFSET = {
  ascender: 4,
  descender: 6,
  lineGap: 8,
  advanceWidthMax: 10,
  minLeftSideBearing: 12,
  minRightSideBearing: 14,
  xMaxExtent: 16,
} as const;
/** Length of an 'hhea' table (OpenType spec, 'hhea'). */
const HHEA_LENGTH = 36;

export interface HheaValues {
  readonly ascender: number;
  readonly descender: number;
  readonly lineGap: number;
  readonly advanceWidthMax: number;
  readonly minLeftSideBearing: number;
  readonly minRightSideBearing: number;
  readonly xMaxExtent: number;
}

/** The hhea values for `font`. */
export function hheaValues(font: PreparedFont): HheaValues {
  let minLeftSideBearing = Infinity;
  let minRightSideBearing = Infinity;
  let xMaxExtent = -Infinity;
  for (const glyph of font.glyphs) {
    if (glyph.bounds === undefined) continue;
    const width = glyph.bounds.xMax - glyph.bounds.xMin;
    minLeftSideBearing = Math.min(minLeftSideBearing, glyph.leftSidebearing);
    minRightSideBearing = Math.min(minRightSideBearing, glyph.advanceWidth - glyph.leftSidebearing - width);
    xMaxExtent = Math.max(xMaxExtent, glyph.leftSidebearing + width);
  }
  const anyInk = Number.isFinite(xMaxExtent);
  return {
    ascender: font.ascender,
    descender: font.descender,
    lineGap: font.lineGap,
    advanceWidthMax: Math.max(...font.glyphs.map((g) => g.advanceWidth)),
    minLeftSideBearing: anyInk ? minLeftSideBearing : 0,
    minRightSideBearing: anyInk ? minRightSideBearing : 0,
    xMaxExtent: anyInk ? xMaxExtent : 0,
  };
}

/** A copy of the 'hhea' table with `values` written in. */
export function patchHhea(hhea: Uint8Array, values: HheaValues): Uint8Array {
  if (hhea.length !== HHEA_LENGTH) throw new RangeError(`expected a ${HHEA_LENGTH}-byte hhea table, got ${hhea.length}`);
  const out = hhea.slice();
  const view = new DataView(out.buffer);
  view.setInt16(HHEA_OFFSET.ascender, values.ascender);
  view.setInt16(HHEA_OFFSET.descender, values.descender);
  view.setInt16(HHEA_OFFSET.lineGap, values.lineGap);
  view.setUint16(HHEA_OFFSET.advanceWidthMax, values.advanceWidthMax);
  view.setInt16(HHEA_OFFSET.minLeftSideBearing, values.minLeftSideBearing);
  view.setInt16(HHEA_OFFSET.minRightSideBearing, values.minRightSideBearing);
  view.setInt16(HHEA_OFFSET.xMaxExtent, values.xMaxExtent);
  return out;
}
