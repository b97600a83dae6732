// A project as the font writer's source: its font settings and every glyph with its
// characters in the project's order (the first its own), outline, advance width and
// sidebearing. The font is written from this (write-font.ts), so what the project
// holds is what the font maps.
import { outlineFromJson } from '../../../core/outline/index.ts';
import type { FontGlyph, FontSource } from '../font/font-model.ts';
import type { ProjectData, ProjectGlyph } from './project-schema.ts';
import { characterOfUnicodeHex } from './project-unicodes.ts';

/** The characters of a project glyph, primary first. */
export function glyphCharacters(glyph: ProjectGlyph): string[] {
  return glyph.unicodes.map(characterOfUnicodeHex);
}

/**
 * The font source for `project` (validated; not modified): only its font settings and
 * glyphs are read, so a project without its scans serves as well. Outline errors are
 * OutlineError.
 */
export function fontSourceFromProject(project: Pick<ProjectData, 'font' | 'glyphs'>): FontSource {
  const glyphs = project.glyphs.map((glyph): FontGlyph => {
    const characters = glyphCharacters(glyph);
    return {
      character: characters[0] ?? '',
      characters,
      ...(glyph.name === undefined ? {} : { name: glyph.name }),
      outline: outlineFromJson(glyph.outline),
      advanceWidth: glyph.advanceWidth,
      ...(glyph.leftSidebearing === undefined ? {} : { leftSidebearing: glyph.leftSidebearing }),
    };
  });
  // Which metrics the designer typed matters to the editor, not to the font.
  const { metricsSetByUser: _editorOnly, ...font } = project.font;
  return { ...font, glyphs };
}
