// The glyph list as the font will hold it, checked: .notdef first (our box unless
// the source draws its own), a space (the source's, or one a quarter em wide), then
// every source glyph in order, each with a valid unique name and its list of
// characters (the first its own, all mapped to it), at most one glyph per
// character, whole-unit outlines placed at their sidebearing, whole-unit advance
// widths, and every number within what a CFF font can store. Anything else is a
// FontError naming the glyph and saying what to change.
import { OutlineError, type GlyphOutline } from '../../../core/outline/index.ts';
import { unencodableReason } from './code-points.ts';
import { FontError } from './font-error.ts';
import type { FontGlyph } from './font-model.ts';
import { glyphNameForCodePoint, isValidGlyphName, MAX_GLYPH_NAME_LENGTH, NOTDEF_GLYPH_NAME, SPACE_GLYPH_NAME } from './glyph-names.ts';
import { integerBounds, roundOutline, translateOutline, type IntegerBox } from './integer-outline.ts';
import { notdefGlyph } from './notdef-glyph.ts';

/** A glyph ready for the font: whole units throughout. */
export interface PreparedGlyph {
  readonly name: string;
  /** The code points the cmap maps to the glyph, the primary (the one the name is from) first; empty for an unencoded glyph. */
  readonly codePoints: readonly number[];
  readonly outline: GlyphOutline;
  readonly advanceWidth: number;
  /** Whole-unit box of the ink; undefined for a glyph without contours. */
  readonly bounds: IntegerBox | undefined;
  /** hmtx left sidebearing: bounds.xMin, or 0 without ink (common practice). */
  readonly leftSidebearing: number;
}

/** U+0020, the space character. */
const SPACE_CODE_POINT = 0x20;
/** Width of the space the writer adds when the source has none, fraction of the em (common practice: a quarter em). */
const DEFAULT_SPACE_EM = 0.25;
/** Range of a charstring number and of glyph coordinates (Adobe Technical Note #5177: integer operands are 16-bit; OpenType 'head' bounds are int16). */
export const INT16_MIN = -32768;
export const INT16_MAX = 32767;
/** Characters worth showing in a message beside their code point: letters, digits, punctuation, symbols. */
const VISIBLE_CHARACTER = /^[\p{L}\p{N}\p{P}\p{S}]$/u;

/** Code points are written U+ and at least four hex digits (Unicode notation). */
const CODE_POINT_HEX_DIGITS = 4;

const describeCharacter = (codePoint: number) => {
  const character = String.fromCodePoint(codePoint);
  return `U+${codePoint.toString(16).toUpperCase().padStart(CODE_POINT_HEX_DIGITS, '0')}${VISIBLE_CHARACTER.test(character) ? ` "${character}"` : ''}`;
};

/** The code point of one character of a glyph; `what` says which ("is for", "also lists"). */
function codePointOfCharacter(character: unknown, where: string, what: string, glyphName: string | undefined): number {
  if (typeof character !== 'string' || character === '') {
    throw new FontError('bad-character', `Glyph "${where}" ${what} ${JSON.stringify(character)}; each character must be a string of exactly one character.`, glyphName);
  }
  const codePoints = [...character];
  const codePoint = character.codePointAt(0)!;
  if (codePoints.length !== 1) {
    throw new FontError('bad-character', `Glyph "${where}" ${what} "${character}", which is ${codePoints.length} characters; a glyph is for exactly one. Give a ligature or sequence glyph character '' and a name.`, glyphName);
  }
  const reason = unencodableReason(codePoint);
  if (reason === 'surrogate') {
    throw new FontError('bad-character', `Glyph "${where}" ${what} a lone UTF-16 surrogate (${describeCharacter(codePoint)}), which is half of a character. Use the whole character.`, glyphName);
  }
  if (reason === 'null') {
    throw new FontError('bad-character', `Glyph "${where}" ${what} U+0000, which fonts reserve for the .null glyph. Give it another character or ''.`, glyphName);
  }
  if (reason === 'noncharacter') {
    throw new FontError('bad-character', `Glyph "${where}" ${what} ${describeCharacter(codePoint)}, a Unicode noncharacter that text never contains. Give it a real character or ''.`, glyphName);
  }
  return codePoint;
}

/**
 * The glyph's code points, primary first: `character`, then the rest of
 * `characters`, whose first entry must be `character` itself. Each appears once.
 */
function codePointsOf(glyph: FontGlyph, index: number): number[] {
  const { character, characters } = glyph;
  if (typeof character !== 'string') throw new FontError('bad-character', `Glyph ${index + 1}: its character must be a string (one character, or '' for an unencoded glyph).`);
  const where = glyph.name ?? `glyph ${index + 1}`;
  if (characters !== undefined && !Array.isArray(characters)) {
    throw new FontError('bad-character', `Glyph "${where}": its characters must be a list of characters, its own character first.`, glyph.name);
  }
  const list = characters ?? (character === '' ? [] : [character]);
  if (character === '') {
    if (list.length > 0) {
      throw new FontError('bad-character', `Glyph "${where}" has character '' but lists characters ${JSON.stringify(list)}; a glyph reached by characters needs the first of them as its character.`, glyph.name);
    }
    return [];
  }
  const primary = codePointOfCharacter(character, where, 'is for', glyph.name);
  if (list[0] !== character) {
    throw new FontError('bad-character', `Glyph "${where}" is for ${describeCharacter(primary)} but its list of characters starts with ${list.length === 0 ? 'nothing' : JSON.stringify(list[0])}; the list starts with the glyph's own character. Put it first, or leave the list out.`, glyph.name);
  }
  const codePoints = [primary];
  for (const other of list.slice(1)) {
    const codePoint = codePointOfCharacter(other, where, 'also lists', glyph.name);
    if (codePoints.includes(codePoint)) {
      throw new FontError('bad-character', `Glyph "${where}" lists ${describeCharacter(codePoint)} twice; list each character once.`, glyph.name);
    }
    codePoints.push(codePoint);
  }
  return codePoints;
}

function nameOf(glyph: FontGlyph, codePoint: number | undefined, index: number): string {
  if (glyph.name !== undefined) {
    if (!isValidGlyphName(glyph.name)) {
      throw new FontError(
        'bad-glyph-name',
        `Glyph ${index + 1} is named "${glyph.name}"; a glyph name is 1–${MAX_GLYPH_NAME_LENGTH} characters from A–Z, a–z, 0–9, "." and "_", not starting with a digit or ".". Rename it (e.g. "a.alt").`,
        glyph.name,
      );
    }
    return glyph.name;
  }
  if (codePoint === undefined) {
    throw new FontError('bad-glyph-name', `Glyph ${index + 1} has no character and no name; an unencoded glyph needs a name (e.g. "a.alt").`);
  }
  return glyphNameForCodePoint(codePoint);
}

function checkFinite(value: number, what: string, glyph: string): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new FontError('bad-outline', `Glyph "${glyph}": ${what} is ${String(value)}, not a finite number.`, glyph);
}

function checkInt16(value: number, what: string, glyph: string): void {
  if (value < INT16_MIN || value > INT16_MAX) {
    throw new FontError(
      'coordinate-out-of-range',
      `Glyph "${glyph}" has ${what} = ${value}, beyond the ${INT16_MIN}…${INT16_MAX} font units a font can store. Scale the drawing down or check that it is in font units.`,
      glyph,
    );
  }
}

/**
 * Checks what the charstring will hold: every coordinate and every step from one
 * point to the next (charstrings store steps, Adobe Technical Note #5177) within int16.
 */
function checkOutlineRange(outline: GlyphOutline, glyph: string): void {
  let previous = { x: 0, y: 0 };
  for (const contour of outline.contours) {
    for (const p of contour.points) {
      checkInt16(p.x, 'a point at x', glyph);
      checkInt16(p.y, 'a point at y', glyph);
      checkInt16(p.x - previous.x, 'a step between consecutive points of dx', glyph);
      checkInt16(p.y - previous.y, 'a step between consecutive points of dy', glyph);
      previous = p;
    }
  }
}

function prepareOutline(outline: GlyphOutline, glyph: string): GlyphOutline {
  if (outline === null || typeof outline !== 'object' || !Array.isArray(outline.contours)) {
    throw new FontError('bad-outline', `Glyph "${glyph}" has no outline; give it { contours: [] } for an empty glyph.`, glyph);
  }
  for (const contour of outline.contours) for (const p of contour.points) {
    checkFinite(p.x, 'a point’s x', glyph);
    checkFinite(p.y, 'a point’s y', glyph);
  }
  try {
    return roundOutline(outline);
  } catch (error) {
    if (error instanceof OutlineError) throw new FontError('bad-outline', `Glyph "${glyph}": ${error.message}`, glyph);
    throw error;
  }
}

function prepareAdvance(advanceWidth: number, glyph: string): number {
  if (typeof advanceWidth !== 'number' || !Number.isFinite(advanceWidth) || advanceWidth < 0) {
    throw new FontError('bad-advance-width', `Glyph "${glyph}" has advance width ${String(advanceWidth)}; it must be a number of font units, 0 or more.`, glyph);
  }
  const rounded = Math.round(advanceWidth);
  if (rounded > INT16_MAX) {
    throw new FontError('bad-advance-width', `Glyph "${glyph}" has advance width ${rounded}, more than the ${INT16_MAX} units a CFF glyph can store. Check that it is in font units.`, glyph);
  }
  return rounded;
}

function placedGlyph(name: string, codePoints: readonly number[], source: { outline: GlyphOutline; advanceWidth: number; leftSidebearing?: number | undefined }): PreparedGlyph {
  const advanceWidth = prepareAdvance(source.advanceWidth, name);
  let outline = prepareOutline(source.outline, name);
  let bounds = integerBounds(outline);
  if (source.leftSidebearing !== undefined && bounds !== undefined) {
    checkFinite(source.leftSidebearing, 'the left sidebearing', name);
    const shift = Math.round(source.leftSidebearing) - bounds.xMin;
    outline = translateOutline(outline, shift);
    bounds = { ...bounds, xMin: bounds.xMin + shift, xMax: bounds.xMax + shift };
  }
  checkOutlineRange(outline, name);
  return { name, codePoints, outline, advanceWidth, bounds, leftSidebearing: bounds?.xMin ?? 0 };
}

export interface GlyphMetricsContext {
  readonly unitsPerEm: number;
  readonly capHeight: number;
  readonly ascender: number;
}

/** The font's glyph list from the source glyphs (which are not modified). */
export function prepareGlyphs(glyphs: readonly FontGlyph[], metrics: GlyphMetricsContext): PreparedGlyph[] {
  if (!Array.isArray(glyphs)) throw new FontError('bad-outline', 'The font source has no glyph list; give it glyphs: [] at least.');
  const byName = new Map<string, number>();
  const byCodePoint = new Map<number, string>();
  let notdef: PreparedGlyph | undefined;
  let hasSpace = false;
  const prepared: PreparedGlyph[] = [];

  glyphs.forEach((glyph, index) => {
    const codePoints = codePointsOf(glyph, index);
    const name = nameOf(glyph, codePoints[0], index);
    const previousIndex = byName.get(name);
    if (previousIndex !== undefined) {
      throw new FontError('duplicate-glyph-name', `Glyphs ${previousIndex + 1} and ${index + 1} are both named "${name}"; glyph names must be unique. Rename one (e.g. "${name}.alt").`, name);
    }
    byName.set(name, index);
    for (const codePoint of codePoints) {
      const other = byCodePoint.get(codePoint);
      if (other !== undefined) {
        throw new FontError(
          'duplicate-character',
          `Glyphs "${other}" and "${name}" are both for ${describeCharacter(codePoint)}; a character can have only one glyph. Take it out of one glyph's characters (or give that glyph character '', an alternate).`,
          name,
        );
      }
      byCodePoint.set(codePoint, name);
    }
    const primary = codePoints[0];
    if (name === NOTDEF_GLYPH_NAME) {
      if (primary !== undefined) throw new FontError('bad-character', `The .notdef glyph is for ${describeCharacter(primary)}; .notdef is shown for missing characters and must have character ''.`, name);
      notdef = placedGlyph(name, [], glyph);
      return;
    }
    if (codePoints.includes(SPACE_CODE_POINT)) hasSpace = true;
    prepared.push(placedGlyph(name, codePoints, glyph));
  });

  if (!hasSpace && byName.has(SPACE_GLYPH_NAME)) {
    throw new FontError('bad-glyph-name', `Glyph "${SPACE_GLYPH_NAME}" is not for the space character; the writer adds the space under that name. Rename the glyph or give it character ' '.`, SPACE_GLYPH_NAME);
  }
  const box = notdefGlyph(metrics.unitsPerEm, metrics.capHeight, metrics.ascender);
  const first = notdef ?? placedGlyph(NOTDEF_GLYPH_NAME, [], box);
  const space = hasSpace ? [] : [placedGlyph(SPACE_GLYPH_NAME, [SPACE_CODE_POINT], { outline: { contours: [] }, advanceWidth: Math.round(metrics.unitsPerEm * DEFAULT_SPACE_EM) })];
  return [first, ...space, ...prepared];
}
