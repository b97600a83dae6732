// Which characters a font can map to a glyph of its own. Text never contains
// surrogates (halves of UTF-16 pairs) or noncharacters, U+0000 is kept for the
// .null glyph, and U+FFFF also ends every cmap format 4 subtable — so none of these
// can be a glyph's character (Unicode, "Surrogates" and "Noncharacters"; OpenType
// spec, 'cmap' format 4).

/** U+0000 is reserved for the .null glyph (opentype.js 2.0.0 refuses it for any other). */
const NULL_CODE_POINT = 0;
/** UTF-16 surrogates (Unicode, "Surrogates"). */
const SURROGATE_FIRST = 0xd800;
const SURROGATE_LAST = 0xdfff;
/** Noncharacters: U+FDD0–U+FDEF and the last two code points of every plane (Unicode, "Noncharacters"). */
const NONCHARACTER_BLOCK_FIRST = 0xfdd0;
const NONCHARACTER_BLOCK_LAST = 0xfdef;
const PLANE_END_MASK = 0xfffe;

export type UnencodableReason = 'null' | 'surrogate' | 'noncharacter';

/** Why `codePoint` cannot be a glyph's character, or undefined when it can. */
export function unencodableReason(codePoint: number): UnencodableReason | undefined {
  if (codePoint === NULL_CODE_POINT) return 'null';
  if (codePoint >= SURROGATE_FIRST && codePoint <= SURROGATE_LAST) return 'surrogate';
  if ((codePoint >= NONCHARACTER_BLOCK_FIRST && codePoint <= NONCHARACTER_BLOCK_LAST) || (codePoint & PLANE_END_MASK) === PLANE_END_MASK) return 'noncharacter';
  return undefined;
}

/** Whether `codePoint` can be a glyph's character. */
export function isEncodable(codePoint: number): boolean {
  return unencodableReason(codePoint) === undefined;
}
