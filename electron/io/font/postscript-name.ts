// The PostScript name of a font ("CafeEcrit-Regular"): the one name that must be
// plain ASCII, because it is the CFF FontName (Adobe Technical Note #5176, Name
// INDEX) and name ID 6, which printers, PDF files and browsers use as a key. Any
// family name a lettering artist types, in any script, gets one: letters with
// accents lose them, a few Latin letters are spelled out, anything else that has no
// ASCII form is replaced by its code point in hex, so the result is never empty.
// A non-ASCII family name without such a name is what makes OTS reject a font.

/**
 * Longest PostScript name (OpenType spec, name ID 6: "no longer than 63
 * characters"; the CFF Name INDEX allows 127).
 */
export const MAX_POSTSCRIPT_NAME_LENGTH = 63;

/**
 * Latin letters that Unicode does not decompose into a base letter and an accent,
 * spelled the way they are usually spelled in ASCII (common practice).
 */
const SPELLED_OUT: Readonly<Record<string, string>> = {
  ß: 'ss', ẞ: 'SS', æ: 'ae', Æ: 'AE', œ: 'oe', Œ: 'OE', ø: 'o', Ø: 'O', ł: 'l', Ł: 'L',
  đ: 'd', Đ: 'D', ð: 'd', Ð: 'D', þ: 'th', Þ: 'Th', ı: 'i', ħ: 'h', Ħ: 'H', ŋ: 'n', Ŋ: 'N',
};

/** Combining marks, which NFKD splits off accented letters. */
const COMBINING_MARK = /\p{M}/u;
/** What a PostScript name part may contain (the brief's safe subset of printable ASCII). */
const NAME_CHARACTER = /[A-Za-z0-9]/;

/**
 * `text` as ASCII letters and digits: accents dropped (NFKD, then marks removed),
 * ligature-like letters spelled out, spaces and punctuation removed. Characters with
 * no ASCII form are dropped; the result may be empty.
 */
export function asciiLettersAndDigits(text: string): string {
  let result = '';
  for (const character of text.normalize('NFKD')) {
    if (COMBINING_MARK.test(character)) continue;
    const spelled = SPELLED_OUT[character] ?? character;
    for (const c of spelled) if (NAME_CHARACTER.test(c)) result += c;
  }
  return result;
}

/** The code points of `text` in uppercase hex, for names with no ASCII letters at all. */
function codePointSpelling(text: string): string {
  return [...text.trim()].map((c) => (c.codePointAt(0) ?? 0).toString(16).toUpperCase()).join('');
}

function namePart(text: string, prefixWhenNoAscii: string): string {
  const ascii = asciiLettersAndDigits(text);
  if (ascii.length > 0) return ascii;
  return `${prefixWhenNoAscii}${codePointSpelling(text)}`;
}

/**
 * "Family-Style" with only A–Z a–z 0–9 and one hyphen, at most 63 characters: e.g.
 * "Café Écrit" + "Regular" → "CafeEcrit-Regular". A family with no Latin letters
 * becomes "F" + its code points in hex ("手書き" → "F624B66F8304D-Regular").
 */
export function postScriptName(familyName: string, styleName: string): string {
  // The style keeps room for the hyphen and at least one family character; the family gets the rest.
  const style = namePart(styleName, 'S').slice(0, MAX_POSTSCRIPT_NAME_LENGTH - 2);
  const family = namePart(familyName, 'F').slice(0, MAX_POSTSCRIPT_NAME_LENGTH - 1 - style.length);
  return `${family}-${style}`;
}
