/// <reference path="./opentype-js.d.ts" />
// The first draft of the font, assembled by opentype.js 2.0.0 from the prepared
// glyphs: CFF charstrings, hmtx, cmap, maxp, OS/2 and post come out right when it is
// given whole-unit paths, explicit sidebearings and our OS/2 and post values; the
// tables it gets wrong (name, ltag, CFF Top DICT, head, hhea) are fixed afterwards
// in finish-tables.ts. The names given to it here only reach the CFF table, whose
// strings are Latin-1, so they are the ASCII forms (the PostScript name's parts for
// a name with no Latin letters).
import opentype, { type Path } from 'opentype.js/dist/opentype.js';
import { contourSegments, type GlyphOutline } from '../../../core/outline/index.ts';
import { os2Values } from './os2-values.ts';
import { asciiLettersAndDigits } from './postscript-name.ts';
import type { PreparedFont } from './prepare-font.ts';

/**
 * The outline as an opentype.js path: one moveTo per contour, a lineTo or curveTo
 * per segment, and closePath. A final line back to the start is left out: CFF
 * closes every contour with that line itself (Adobe Technical Note #5177, "closepath
 * is implicit"). Coordinates are already whole units, so nothing drifts.
 */
export function outlineToPath(outline: GlyphOutline): Path {
  const path = new opentype.Path();
  for (const contour of outline.contours) {
    const segments = contourSegments(contour);
    const first = segments[0];
    if (first === undefined) continue;
    path.moveTo(first.p0.x, first.p0.y);
    segments.forEach((segment, i) => {
      if (segment.kind === 'line') {
        if (i < segments.length - 1) path.lineTo(segment.p1.x, segment.p1.y);
      } else {
        path.curveTo(segment.p1.x, segment.p1.y, segment.p2.x, segment.p2.y, segment.p3.x, segment.p3.y);
      }
    });
    path.close();
  }
  return path;
}

/** ASCII form of a name for the CFF strings (accents dropped, words kept), or `fallback` when nothing is left. */
function cffString(text: string, fallback: string): string {
  const words = text.split(' ').map(asciiLettersAndDigits).filter((w) => w.length > 0);
  return words.length > 0 ? words.join(' ') : fallback;
}

/**
 * The font as opentype.js writes it (before the fixes in finish-tables.ts). Every
 * code point of a glyph goes into the cmap through `unicodes`. opentype.js 2.0.0
 * decides whether to write the format 12 subtable (code points beyond U+FFFF) from
 * each glyph's `unicode` alone (makeCmapTable), so `unicode` is the glyph's largest
 * code point — else a glyph whose primary character is in the BMP would silently
 * lose its supplementary ones. Its other use, the OS/2 character range, is
 * overridden (os2-values.ts); the glyph name is always given, never derived from it.
 */
export function draftFontBytes(font: PreparedFont): Uint8Array {
  const glyphs = font.glyphs.map(
    (glyph) =>
      new opentype.Glyph({
        name: glyph.name,
        ...(glyph.codePoints.length === 0 ? {} : { unicode: Math.max(...glyph.codePoints), unicodes: [...glyph.codePoints] }),
        advanceWidth: glyph.advanceWidth,
        leftSideBearing: glyph.leftSidebearing,
        path: outlineToPath(glyph.outline),
      }),
  );
  const [familyPart = '', stylePart = ''] = font.postScriptName.split('-');
  const draft = new opentype.Font({
    familyName: cffString(font.familyName, familyPart),
    styleName: cffString(font.styleName, stylePart),
    fullName: cffString(font.fullName, `${familyPart} ${stylePart}`),
    postScriptName: font.postScriptName,
    version: font.versionNumber,
    unitsPerEm: font.unitsPerEm,
    ascender: font.ascender,
    descender: font.descender,
    weightClass: font.weightClass,
    fsSelection: font.linking.fsSelection,
    createdTimestamp: font.timestampSeconds,
    tables: {
      os2: os2Values(font),
      post: { underlinePosition: font.underlinePosition, underlineThickness: font.underlineThickness },
    },
    glyphs,
  });
  return new Uint8Array(draft.toArrayBuffer());
}
