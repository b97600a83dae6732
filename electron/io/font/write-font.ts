// Writes a Stemline font source as an OpenType font with CFF outlines (.otf), the
// test font a lettering artist installs or loads in a browser to set text with
// their letters. Three steps: the source is checked and settled into whole-unit
// values (prepare-font.ts), opentype.js 2.0.0 drafts the font (opentype-draft.ts),
// and the tables it gets wrong are fixed (finish-tables.ts). The same source always
// gives the same bytes.
import type { FontSource } from './font-model.ts';
import { finishTables } from './finish-tables.ts';
import { draftFontBytes } from './opentype-draft.ts';
import { prepareFont } from './prepare-font.ts';

/**
 * The font file for `source`, which is not modified. Glyph 0 is a .notdef box (or
 * the source's own .notdef), a space is added when the source has none, and every
 * source glyph follows in order. Throws FontError (font-error.ts) for a source that
 * cannot make a valid font, saying which glyph or value to change.
 */
export function writeOtf(source: FontSource): Uint8Array {
  const font = prepareFont(source);
  return finishTables(draftFontBytes(font), font);
}
