// A glyph's characters as the project file writes them: each code point as 4 to 6
// uppercase hex digits, the UFO format's spelling (UFO 3, glif "unicode" element,
// e.g. "0041" for A, "1F600" for 😀), so invisible characters such as the no-break
// space or the soft hyphen stay readable in the file.

/** Fewest hex digits written: the four of a BMP code point (UFO 3 and Unicode notation). */
const MIN_HEX_DIGITS = 4;
const HEX = 16;

/** "0041" for "A". `character` is one code point. */
export function unicodeHexOf(character: string): string {
  return (character.codePointAt(0) ?? 0).toString(HEX).toUpperCase().padStart(MIN_HEX_DIGITS, '0');
}

/** "A" for "0041" (the project schema has checked the spelling and range). */
export function characterOfUnicodeHex(hex: string): string {
  return String.fromCodePoint(Number.parseInt(hex, HEX));
}
