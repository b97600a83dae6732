// An existing font as a new Stemline project: its names, metrics and every glyph's
// characters (all the cmap maps to it, the primary first), outline and spacing,
// ready to clean up, extend with scanned letters, and write out again. Unencoded
// glyphs come along under their names.
import { outlineToJson } from '../../../core/outline/index.ts';
import type { ReadFont } from '../font/read-font.ts';
import { newProject } from './new-project.ts';
import type { ProjectData } from './project-schema.ts';
import { unicodeHexOf } from './project-unicodes.ts';

export function projectFromFont(font: ReadFont): ProjectData {
  const base = newProject(font.familyName);
  return {
    ...base,
    font: {
      familyName: font.familyName,
      styleName: font.styleName,
      unitsPerEm: font.unitsPerEm,
      capHeight: font.capHeight,
      xHeight: font.xHeight,
      ascender: font.ascender,
      descender: font.descender,
      lineGap: font.lineGap,
    },
    glyphs: font.glyphs
      .filter((glyph) => glyph.index !== 0)
      .map((glyph) => ({
        unicodes: glyph.characters.map(unicodeHexOf),
        name: glyph.name,
        advanceWidth: glyph.advanceWidth,
        leftSidebearing: glyph.leftSidebearing,
        outline: outlineToJson(glyph.outline),
      })),
  };
}
