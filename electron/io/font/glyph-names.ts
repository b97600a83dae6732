// Glyph names for characters, the names that go into the font's CFF charset and
// that text tools use to recover the characters of a glyph run (e.g. for copying
// text out of a PDF): the Adobe Glyph List for New Fonts (AGLFN 1.7, an open
// standard under the BSD licence, https://github.com/adobe-type-tools/agl-aglfn)
// where it has a name, otherwise `uniXXXX` (BMP) or `uXXXXX` (beyond the BMP), the
// forms the Adobe Glyph List Specification defines for any code point.
//
// The table below was transcribed from memory of AGLFN 1.7, not copied from a file.
// test/font/glyph-names.test.ts checks every code point of the ranges covered here
// against fontTools' `fontTools.agl` module (which ships the AGLFN) in both
// directions; entries that check corrected are noted beside them.

/** Glyph 0 of every OpenType font (OpenType spec, "Recommendations": glyph 0 must be the missing-character glyph). */
export const NOTDEF_GLYPH_NAME = '.notdef';
/** The AGLFN name of U+0020. */
export const SPACE_GLYPH_NAME = 'space';

/** Basic Latin, U+0020–U+007E, in code point order: all are in the AGLFN. */
const BASIC_LATIN_FIRST = 0x20;
const BASIC_LATIN = [
  'space', 'exclam', 'quotedbl', 'numbersign', 'dollar', 'percent', 'ampersand', 'quotesingle',
  'parenleft', 'parenright', 'asterisk', 'plus', 'comma', 'hyphen', 'period', 'slash',
  'zero', 'one', 'two', 'three', 'four', 'five', 'six', 'seven', 'eight', 'nine',
  'colon', 'semicolon', 'less', 'equal', 'greater', 'question', 'at',
  'A', 'B', 'C', 'D', 'E', 'F', 'G', 'H', 'I', 'J', 'K', 'L', 'M',
  'N', 'O', 'P', 'Q', 'R', 'S', 'T', 'U', 'V', 'W', 'X', 'Y', 'Z',
  'bracketleft', 'backslash', 'bracketright', 'asciicircum', 'underscore', 'grave',
  'a', 'b', 'c', 'd', 'e', 'f', 'g', 'h', 'i', 'j', 'k', 'l', 'm',
  'n', 'o', 'p', 'q', 'r', 's', 't', 'u', 'v', 'w', 'x', 'y', 'z',
  'braceleft', 'bar', 'braceright', 'asciitilde',
] as const;

/**
 * Latin-1 Supplement, U+00A0–U+00FF, in code point order; null where the AGLFN has
 * no name (no-break space and soft hyphen are left to uni00A0 / uni00AD).
 * Corrected by the check: the superior figures ¹ ² ³ (U+00B9, U+00B2, U+00B3) were
 * transcribed as onesuperior / twosuperior / threesuperior, which are Adobe Glyph
 * List names but not AGLFN 1.7 names.
 */
const LATIN_1_FIRST = 0xa0;
const LATIN_1: readonly (string | null)[] = [
  null, 'exclamdown', 'cent', 'sterling', 'currency', 'yen', 'brokenbar', 'section',
  'dieresis', 'copyright', 'ordfeminine', 'guillemotleft', 'logicalnot', null, 'registered', 'macron',
  'degree', 'plusminus', null, null, 'acute', 'mu', 'paragraph', 'periodcentered',
  'cedilla', null, 'ordmasculine', 'guillemotright', 'onequarter', 'onehalf', 'threequarters', 'questiondown',
  'Agrave', 'Aacute', 'Acircumflex', 'Atilde', 'Adieresis', 'Aring', 'AE', 'Ccedilla',
  'Egrave', 'Eacute', 'Ecircumflex', 'Edieresis', 'Igrave', 'Iacute', 'Icircumflex', 'Idieresis',
  'Eth', 'Ntilde', 'Ograve', 'Oacute', 'Ocircumflex', 'Otilde', 'Odieresis', 'multiply',
  'Oslash', 'Ugrave', 'Uacute', 'Ucircumflex', 'Udieresis', 'Yacute', 'Thorn', 'germandbls',
  'agrave', 'aacute', 'acircumflex', 'atilde', 'adieresis', 'aring', 'ae', 'ccedilla',
  'egrave', 'eacute', 'ecircumflex', 'edieresis', 'igrave', 'iacute', 'icircumflex', 'idieresis',
  'eth', 'ntilde', 'ograve', 'oacute', 'ocircumflex', 'otilde', 'odieresis', 'divide',
  'oslash', 'ugrave', 'uacute', 'ucircumflex', 'udieresis', 'yacute', 'thorn', 'ydieresis',
];

/**
 * Latin Extended-A, U+0100–U+017F, in code point order; null where the AGLFN has no
 * name. The AGLFN leaves out the letters with a comma below that older lists named
 * "…commaaccent" although Unicode calls them "with cedilla" (G, K, L, N, R, T).
 */
const LATIN_EXTENDED_A_FIRST = 0x100;
const LATIN_EXTENDED_A: readonly (string | null)[] = [
  'Amacron', 'amacron', 'Abreve', 'abreve', 'Aogonek', 'aogonek', 'Cacute', 'cacute',
  'Ccircumflex', 'ccircumflex', 'Cdotaccent', 'cdotaccent', 'Ccaron', 'ccaron', 'Dcaron', 'dcaron',
  'Dcroat', 'dcroat', 'Emacron', 'emacron', 'Ebreve', 'ebreve', 'Edotaccent', 'edotaccent',
  'Eogonek', 'eogonek', 'Ecaron', 'ecaron', 'Gcircumflex', 'gcircumflex', 'Gbreve', 'gbreve',
  'Gdotaccent', 'gdotaccent', null, null, 'Hcircumflex', 'hcircumflex', 'Hbar', 'hbar',
  'Itilde', 'itilde', 'Imacron', 'imacron', 'Ibreve', 'ibreve', 'Iogonek', 'iogonek',
  'Idotaccent', 'dotlessi', 'IJ', 'ij', 'Jcircumflex', 'jcircumflex', null, null,
  'kgreenlandic', 'Lacute', 'lacute', null, null, 'Lcaron', 'lcaron', 'Ldot',
  'ldot', 'Lslash', 'lslash', 'Nacute', 'nacute', null, null, 'Ncaron',
  'ncaron', 'napostrophe', 'Eng', 'eng', 'Omacron', 'omacron', 'Obreve', 'obreve',
  'Ohungarumlaut', 'ohungarumlaut', 'OE', 'oe', 'Racute', 'racute', null, null,
  'Rcaron', 'rcaron', 'Sacute', 'sacute', 'Scircumflex', 'scircumflex', 'Scedilla', 'scedilla',
  'Scaron', 'scaron', null, null, 'Tcaron', 'tcaron', 'Tbar', 'tbar',
  'Utilde', 'utilde', 'Umacron', 'umacron', 'Ubreve', 'ubreve', 'Uring', 'uring',
  'Uhungarumlaut', 'uhungarumlaut', 'Uogonek', 'uogonek', 'Wcircumflex', 'wcircumflex', 'Ycircumflex', 'ycircumflex',
  'Ydieresis', 'Zacute', 'zacute', 'Zdotaccent', 'zdotaccent', 'Zcaron', 'zcaron', 'longs',
];

/**
 * Punctuation, spacing accents and symbols a Latin test font commonly carries, as
 * [code point, AGLFN name]. The AGLFN gives "Omega" and "Delta" to the ohm and
 * increment signs (U+2126, U+2206) and "mu" to the micro sign (U+00B5, above),
 * leaving the Greek letters to uniXXXX. Corrected by the check: S and s with comma
 * below (U+0218, U+0219) and the fi / fl ligatures (U+FB01, U+FB02) were transcribed
 * with names the AGLFN 1.7 does not have; they get uniXXXX.
 */
const PUNCTUATION_AND_SYMBOLS: readonly (readonly [number, string])[] = [
  [0x0192, 'florin'],
  [0x02c6, 'circumflex'],
  [0x02c7, 'caron'],
  [0x02d8, 'breve'],
  [0x02d9, 'dotaccent'],
  [0x02da, 'ring'],
  [0x02db, 'ogonek'],
  [0x02dc, 'tilde'],
  [0x02dd, 'hungarumlaut'],
  [0x2013, 'endash'],
  [0x2014, 'emdash'],
  [0x2017, 'underscoredbl'],
  [0x2018, 'quoteleft'],
  [0x2019, 'quoteright'],
  [0x201a, 'quotesinglbase'],
  [0x201b, 'quotereversed'],
  [0x201c, 'quotedblleft'],
  [0x201d, 'quotedblright'],
  [0x201e, 'quotedblbase'],
  [0x2020, 'dagger'],
  [0x2021, 'daggerdbl'],
  [0x2022, 'bullet'],
  [0x2024, 'onedotenleader'],
  [0x2025, 'twodotenleader'],
  [0x2026, 'ellipsis'],
  [0x2030, 'perthousand'],
  [0x2032, 'minute'],
  [0x2033, 'second'],
  [0x2039, 'guilsinglleft'],
  [0x203a, 'guilsinglright'],
  [0x203c, 'exclamdbl'],
  [0x2044, 'fraction'],
  [0x20ac, 'Euro'],
  [0x2122, 'trademark'],
  [0x2126, 'Omega'],
  [0x2202, 'partialdiff'],
  [0x2206, 'Delta'],
  [0x220f, 'product'],
  [0x2211, 'summation'],
  [0x2212, 'minus'],
  [0x221a, 'radical'],
  [0x221e, 'infinity'],
  [0x222b, 'integral'],
  [0x2248, 'approxequal'],
  [0x2260, 'notequal'],
  [0x2264, 'lessequal'],
  [0x2265, 'greaterequal'],
  [0x25ca, 'lozenge'],
];

/** Code point ranges whose every code point this file decides (named or not), for the tests. */
export const AGLFN_COVERED_RANGES: readonly (readonly [number, number])[] = [
  [BASIC_LATIN_FIRST, BASIC_LATIN_FIRST + BASIC_LATIN.length - 1],
  [LATIN_1_FIRST, LATIN_1_FIRST + LATIN_1.length - 1],
  [LATIN_EXTENDED_A_FIRST, LATIN_EXTENDED_A_FIRST + LATIN_EXTENDED_A.length - 1],
];

function buildTable(): ReadonlyMap<number, string> {
  const table = new Map<number, string>();
  const addRun = (first: number, names: readonly (string | null)[]) =>
    names.forEach((name, i) => {
      if (name !== null) table.set(first + i, name);
    });
  addRun(BASIC_LATIN_FIRST, BASIC_LATIN);
  addRun(LATIN_1_FIRST, LATIN_1);
  addRun(LATIN_EXTENDED_A_FIRST, LATIN_EXTENDED_A);
  for (const [codePoint, name] of PUNCTUATION_AND_SYMBOLS) table.set(codePoint, name);
  return table;
}

/** AGLFN name by code point, for the code points this file covers. */
export const AGLFN_NAMES: ReadonlyMap<number, string> = buildTable();

/** Code points listed individually (outside AGLFN_COVERED_RANGES), for the tests. */
export const AGLFN_LISTED_CODE_POINTS: readonly number[] = PUNCTUATION_AND_SYMBOLS.map(([codePoint]) => codePoint);

/** Last code point of the Basic Multilingual Plane (Unicode, "Planes"). */
const LAST_BMP_CODE_POINT = 0xffff;
/** Hex digits in a uniXXXX name (Adobe Glyph List Specification: exactly four). */
const UNI_NAME_DIGITS = 4;
/** Fewest hex digits in a uXXXXX name (Adobe Glyph List Specification: four to six; five for the supplementary planes). */
const U_NAME_DIGITS = 5;

/** The name for a code point: its AGLFN name, else uniXXXX (BMP) or uXXXXX (beyond). */
export function glyphNameForCodePoint(codePoint: number): string {
  const listed = AGLFN_NAMES.get(codePoint);
  if (listed !== undefined) return listed;
  const hex = codePoint.toString(16).toUpperCase();
  return codePoint <= LAST_BMP_CODE_POINT ? `uni${hex.padStart(UNI_NAME_DIGITS, '0')}` : `u${hex.padStart(U_NAME_DIGITS, '0')}`;
}

/** Longest glyph name (OpenType spec, 'post' table: names are at most 63 characters). */
export const MAX_GLYPH_NAME_LENGTH = 63;

/**
 * The two names that may start with a period: .notdef and .null, the first two of
 * the standard Macintosh glyph names (OpenType spec, 'post' table), which TrueType
 * fonts carry as glyphs 0 and 1.
 */
const PERIOD_NAMES = new Set([NOTDEF_GLYPH_NAME, '.null']);

/**
 * Whether `name` can be a glyph name in the font: 1–63 characters from A–Z a–z 0–9
 * . _ , not starting with a digit or a period, except ".notdef" and ".null" (Adobe
 * Glyph List Specification, "glyph name" syntax; from memory).
 */
export function isValidGlyphName(name: string): boolean {
  if (PERIOD_NAMES.has(name)) return true;
  return name.length <= MAX_GLYPH_NAME_LENGTH && /^[A-Za-z_][A-Za-z0-9._]*$/.test(name);
}
