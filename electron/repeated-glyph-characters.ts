// Glyphs of a project that share a character: a font maps each character to one glyph,
// so such a project cannot make a font. The font writer refuses it by glyph number;
// the font intents ask here first, so the proof and the export can say which letters
// of the scan clash and where to fix them (on the sheet, where both boxes are marked).
import type { ProjectGlyph } from './io/project/project-schema.ts';
import { glyphCharacters } from './io/project/font-from-project.ts';
import { letterNumbers } from '../core/raster/index.ts';

/** The message for the first character two or more of `glyphs` share, or null when every character has one glyph. */
export function repeatedCharacterProblem(glyphs: readonly ProjectGlyph[]): string | null {
  const holders = new Map<string, number[]>();
  glyphs.forEach((glyph, index) => {
    for (const character of new Set(glyphCharacters(glyph))) {
      const list = holders.get(character);
      if (list) list.push(index);
      else holders.set(character, [index]);
    }
  });
  const clash = [...holders].find(([, list]) => list.length > 1);
  if (clash === undefined) return null;
  const [character, indices] = clash;
  const shown = /^[\p{L}\p{M}\p{N}\p{P}\p{S}]+$/u.test(character) ? `“${character}”` : `U+${character.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')}`;
  const fromScan = indices.map((i) => glyphs[i]!.source?.letter).filter((letter): letter is number => letter !== undefined);
  const others = indices.filter((i) => glyphs[i]!.source === undefined);
  if (others.length === 0) {
    return `${shown} is assigned to letters ${letterNumbers(fromScan)} of the scan, and a font has one glyph per character. Go back to the sheet, where those boxes are marked: select one and type its right character, or, if they are pieces of one letter, select them and merge them. Then fit the letters again.`;
  }
  const glyphNames = others.map((i) => `glyph ${i + 1}${glyphs[i]!.name === undefined ? '' : ` ("${glyphs[i]!.name}")`}`);
  const parts = [...(fromScan.length > 0 ? [`letter${fromScan.length > 1 ? 's' : ''} ${letterNumbers(fromScan)} of the scan`] : []), ...glyphNames];
  const fix = fromScan.length > 0 ? `Retype th${fromScan.length > 1 ? 'ose letters' : 'at letter'} on the sheet and fit again.` : 'Give all but one of them another character.';
  return `${shown} belongs to ${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}, and a font has one glyph per character. ${fix}`;
}
