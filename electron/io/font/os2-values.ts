// What the OS/2 table says (OpenType spec, 'OS/2' version 4): opentype.js 2.0.0
// builds the table but fills several fields wrongly for us — weight 500 whatever the
// source says, vendor "XXXX", Windows ascent/descent from the bounding box only,
// line gap 0, fsSelection without USE_TYPO_METRICS, first/last character overflowing
// beyond the BMP, sub- and superscript sizes fixed for a 1000-unit em. These values
// override its own (it merges font.tables.os2 over what it computes), and so do the
// Unicode range bits (unicode-ranges.ts); the code page bits are left to it.
import type { PreparedFont } from './prepare-font.ts';
import { unicodeRangeFields } from './unicode-ranges.ts';

/** OS/2 version whose fsSelection defines bit 7 USE_TYPO_METRICS (OpenType spec, 'OS/2': version 4). */
const OS2_VERSION = 4;
/** The last code point usFirstCharIndex / usLastCharIndex can hold; larger ones are written as 0xFFFF (OpenType spec, 'OS/2'). */
const MAX_CHAR_INDEX = 0xffff;
/** usDefaultChar 0 means "show .notdef" (OpenType spec, 'OS/2' usDefaultChar). */
const DEFAULT_CHAR_NOTDEF = 0;
/** usBreakChar: the space (OpenType spec, 'OS/2' usBreakChar: usually 0x20). */
const BREAK_CHAR_SPACE = 0x20;
/**
 * Sub- and superscript box sizes and offsets for a 1000-unit em, scaled to the font's
 * em: opentype.js 2.0.0's own fixed values, kept as proportions (common practice:
 * about two thirds of the em, dropped 0.14 em / raised 0.48 em).
 */
const SCRIPT_X_SIZE_PER_1000 = 650;
const SCRIPT_Y_SIZE_PER_1000 = 699;
const SUBSCRIPT_Y_OFFSET_PER_1000 = 140;
const SUPERSCRIPT_Y_OFFSET_PER_1000 = 479;
/** Fraction of the ascender used for the strikeout centre when there is no x-height (common practice). */
const STRIKEOUT_CENTRE_OF_ASCENDER = 0.25;
/** units per em the per-1000 proportions are stated for. */
const PER_1000 = 1000;

/** OS/2 field values by opentype.js field name. */
export function os2Values(font: PreparedFont): Record<string, number | string> {
  const scale = (per1000: number) => Math.round((per1000 * font.unitsPerEm) / PER_1000);
  const advances = font.glyphs.map((g) => g.advanceWidth).filter((w) => w > 0);
  // Average of the non-zero advance widths of all glyphs (OpenType spec, 'OS/2' xAvgCharWidth, version 3 and later).
  const xAvgCharWidth = advances.length > 0 ? Math.floor(advances.reduce((a, b) => a + b, 0) / advances.length + 0.5) : 0;
  const codePoints = font.glyphs.flatMap((g) => g.codePoints);
  const [ulUnicodeRange1, ulUnicodeRange2, ulUnicodeRange3, ulUnicodeRange4] = unicodeRangeFields(codePoints);
  const strikeoutCentre = font.xHeight > 0 ? font.xHeight / 2 : font.ascender * STRIKEOUT_CENTRE_OF_ASCENDER;
  return {
    version: OS2_VERSION,
    xAvgCharWidth,
    usWeightClass: font.weightClass,
    ySubscriptXSize: scale(SCRIPT_X_SIZE_PER_1000),
    ySubscriptYSize: scale(SCRIPT_Y_SIZE_PER_1000),
    ySubscriptYOffset: scale(SUBSCRIPT_Y_OFFSET_PER_1000),
    ySuperscriptXSize: scale(SCRIPT_X_SIZE_PER_1000),
    ySuperscriptYSize: scale(SCRIPT_Y_SIZE_PER_1000),
    ySuperscriptYOffset: scale(SUPERSCRIPT_Y_OFFSET_PER_1000),
    yStrikeoutSize: font.underlineThickness,
    // The top of the stroke (OpenType spec, 'OS/2' yStrikeoutPosition), centred as above.
    yStrikeoutPosition: Math.round(strikeoutCentre + font.underlineThickness / 2),
    ulUnicodeRange1,
    ulUnicodeRange2,
    ulUnicodeRange3,
    ulUnicodeRange4,
    achVendID: font.vendorId,
    fsSelection: font.linking.fsSelection,
    usFirstCharIndex: Math.min(Math.min(...codePoints), MAX_CHAR_INDEX),
    usLastCharIndex: Math.min(Math.max(...codePoints), MAX_CHAR_INDEX),
    sTypoAscender: font.ascender,
    sTypoDescender: font.descender,
    sTypoLineGap: font.lineGap,
    // Windows clips ink outside usWinAscent/usWinDescent, so they cover every glyph (OpenType spec, 'OS/2' usWinAscent).
    usWinAscent: Math.max(font.ascender, font.inkBounds.yMax, 0),
    usWinDescent: Math.max(-font.descender, -font.inkBounds.yMin, 0),
    sxHeight: font.xHeight,
    sCapHeight: font.capHeight,
    usDefaultChar: DEFAULT_CHAR_NOTDEF,
    usBreakChar: BREAK_CHAR_SPACE,
  };
}
