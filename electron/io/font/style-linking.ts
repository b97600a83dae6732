// How a style is presented to font menus: the family/subfamily pair that older
// applications group by (name IDs 1 and 2, at most Regular, Italic, Bold and Bold
// Italic per family), the typographic family/subfamily for the rest (name IDs 16
// and 17), and the bold and italic flags that must agree with them (OS/2
// fsSelection, head macStyle). OpenType spec, 'name' table notes on name IDs 1, 2,
// 16 and 17, 'OS/2' fsSelection and 'head' macStyle.

/** OS/2 fsSelection bits (OpenType spec, 'OS/2' fsSelection). */
export const FS_SELECTION = {
  italic: 1 << 0,
  bold: 1 << 5,
  regular: 1 << 6,
  /** Line spacing comes from sTypo* (bit 7, OS/2 version 4 and later). */
  useTypoMetrics: 1 << 7,
  oblique: 1 << 9,
} as const;

/** head macStyle bits (OpenType spec, 'head' macStyle: bit 0 bold, bit 1 italic). */
export const MAC_STYLE = { bold: 1 << 0, italic: 1 << 1 } as const;

/** The four styles name IDs 1/2 can express (OpenType spec, 'name' ID 2). */
const LINKED_STYLES = new Map([
  ['regular', 'Regular'],
  ['italic', 'Italic'],
  ['bold', 'Bold'],
  ['bold italic', 'Bold Italic'],
]);
const SLANT_WORD = /\b(italic|oblique)\b/i;
const OBLIQUE_WORD = /\boblique\b/i;

export interface StyleLinking {
  /** Name ID 1. */
  readonly legacyFamily: string;
  /** Name ID 2: Regular, Italic, Bold or Bold Italic. */
  readonly legacySubfamily: string;
  /** Name IDs 16 and 17, only when they differ from 1 and 2. */
  readonly typographic?: { readonly family: string; readonly subfamily: string };
  readonly fsSelection: number;
  readonly macStyle: number;
}

const collapseSpaces = (text: string) => text.replace(/\s+/g, ' ').trim();

/**
 * Names and flags for `familyName` in `styleName`. "Bold Italic" stays a linked
 * style of the family; "Light Italic" becomes family "X Light", subfamily "Italic",
 * typographic family "X" and subfamily "Light Italic".
 */
export function styleLinking(familyName: string, styleName: string): StyleLinking {
  const family = collapseSpaces(familyName);
  const style = collapseSpaces(styleName);
  const isSlanted = SLANT_WORD.test(style);
  const linked = LINKED_STYLES.get(style.toLowerCase());
  const isBold = linked === 'Bold' || linked === 'Bold Italic';

  let fsSelection = FS_SELECTION.useTypoMetrics;
  if (isSlanted) fsSelection |= FS_SELECTION.italic;
  if (OBLIQUE_WORD.test(style)) fsSelection |= FS_SELECTION.oblique;
  if (isBold) fsSelection |= FS_SELECTION.bold;
  if (!isSlanted && !isBold) fsSelection |= FS_SELECTION.regular;
  const macStyle = (isBold ? MAC_STYLE.bold : 0) | (isSlanted ? MAC_STYLE.italic : 0);

  if (linked !== undefined) {
    return { legacyFamily: family, legacySubfamily: linked, fsSelection, macStyle };
  }
  const uprightPart = collapseSpaces(style.replace(SLANT_WORD, ''));
  return {
    legacyFamily: uprightPart.length > 0 ? `${family} ${uprightPart}` : family,
    legacySubfamily: isSlanted ? 'Italic' : 'Regular',
    typographic: { family, subfamily: style },
    fsSelection,
    macStyle,
  };
}
