// How a font is named in menus and files: every family name gets a PostScript name
// that printers, PDFs and browsers accept, and styles are grouped into families the
// way font menus expect (OpenType spec, 'name' IDs 1, 2, 6, 16, 17; 'OS/2'
// fsSelection; 'head' macStyle).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { MAX_POSTSCRIPT_NAME_LENGTH, postScriptName } from '../../electron/io/font/postscript-name.ts';
import { FS_SELECTION, MAC_STYLE, styleLinking } from '../../electron/io/font/style-linking.ts';

describe('PostScript names', () => {
  it('drops accents and spaces: "Café Écrit" Regular → "CafeEcrit-Regular"', () => {
    expect(postScriptName('Café Écrit', 'Regular')).toBe('CafeEcrit-Regular');
    expect(postScriptName('Straße Ærø', 'Bold Italic')).toBe('StrasseAEro-BoldItalic');
    expect(postScriptName('Łódź Script', 'Régulier')).toBe('LodzScript-Regulier');
  });

  it('spells a family with no Latin letters as its code points, so it is never empty', () => {
    expect(postScriptName('手書き', 'Regular')).toBe('F624B66F8304D-Regular');
    expect(postScriptName('Hand (v2)', '標準')).toBe('Handv2-S6A196E96');
  });

  it('is always 1–63 characters of A–Z a–z 0–9 and one hyphen, whatever the names', () => {
    fc.assert(
      fc.property(fc.string({ minLength: 1, maxLength: 120, unit: 'grapheme' }), fc.string({ minLength: 1, maxLength: 80, unit: 'grapheme' }), (family, style) => {
        fc.pre(family.trim().length > 0 && style.trim().length > 0);
        const name = postScriptName(family, style);
        expect(name.length).toBeLessThanOrEqual(MAX_POSTSCRIPT_NAME_LENGTH);
        expect(name).toMatch(/^[A-Za-z0-9]+-[A-Za-z0-9]+$/);
      }),
      { seed: 20240611, numRuns: 300 },
    );
  });
});

describe('style linking', () => {
  it('keeps the four linked styles in the family, with matching bold and italic flags', () => {
    expect(styleLinking('Stem', 'Regular')).toEqual({ legacyFamily: 'Stem', legacySubfamily: 'Regular', fsSelection: FS_SELECTION.regular | FS_SELECTION.useTypoMetrics, macStyle: 0 });
    expect(styleLinking('Stem', 'bold italic')).toMatchObject({ legacyFamily: 'Stem', legacySubfamily: 'Bold Italic', macStyle: MAC_STYLE.bold | MAC_STYLE.italic });
    expect(styleLinking('Stem', 'Bold Italic').fsSelection).toBe(FS_SELECTION.bold | FS_SELECTION.italic | FS_SELECTION.useTypoMetrics);
  });

  it('gives other styles their own family name and typographic names', () => {
    expect(styleLinking('Stem', 'Light Italic')).toMatchObject({ legacyFamily: 'Stem Light', legacySubfamily: 'Italic', typographic: { family: 'Stem', subfamily: 'Light Italic' } });
    expect(styleLinking('Stem', 'Black')).toMatchObject({ legacyFamily: 'Stem Black', legacySubfamily: 'Regular', typographic: { family: 'Stem', subfamily: 'Black' } });
    expect(styleLinking('Stem', 'Oblique')).toMatchObject({ legacyFamily: 'Stem', legacySubfamily: 'Italic', typographic: { family: 'Stem', subfamily: 'Oblique' } });
    expect(styleLinking('Stem', 'Oblique').fsSelection).toBe(FS_SELECTION.italic | FS_SELECTION.oblique | FS_SELECTION.useTypoMetrics);
    expect(styleLinking('Stem', 'Black').macStyle).toBe(0);
  });
});
