/// <reference path="./opentype-js.d.ts" />
// Reads an existing font — OpenType with CFF outlines (.otf), TrueType (.ttf) or
// either inside WOFF 1.0 — into Stemline's outline model, so a lettering artist can
// compare their letters with a reference face, start from one, or check a font
// Stemline wrote. Parsing is opentype.js 2.0.0's; the outlines become cubic contours
// with smooth joins recovered (path-to-outline.ts, smooth-joins.ts). The result is
// a FontSource, so it can be written straight back out.
import { basename } from 'node:path';
import opentype, { type Font, type Glyph } from 'opentype.js/dist/opentype.js';
import type { GlyphOutline } from '../../../core/outline/index.ts';
import { InputError } from '../input-error.ts';
import { isEncodable } from './code-points.ts';
import { identifyFontContainer, type FontContainer } from './font-container.ts';
import { DEFAULT_WEIGHT_CLASS, type FontGlyph, type FontSource } from './font-model.ts';
import { glyphNameForCodePoint, isValidGlyphName, NOTDEF_GLYPH_NAME } from './glyph-names.ts';
import { tightBounds } from './integer-outline.ts';
import { pathToOutline } from './path-to-outline.ts';
import { woffToSfnt } from './woff-to-sfnt.ts';
import { readTableRecords } from './sfnt-tables.ts';
import { checkCffIndexes } from './cff-top-dict.ts';

/**
 * A glyph as read: a FontGlyph with its index, all its characters and a name that is
 * always valid and unique. It has no `leftSidebearing`: the outline is already where
 * the font puts it, and a separate number would move it when written back (the
 * writer places outlines at a given sidebearing).
 */
export interface ReadGlyph extends FontGlyph {
  /** Glyph index in the font (0 is .notdef). */
  readonly index: number;
  readonly name: string;
  /**
   * Every character the font's cmap maps to this glyph, lowest first, so `character`
   * (the lowest) is the primary one. Code points no glyph of ours can be for (U+0000,
   * surrogates, noncharacters: code-points.ts) are left out, and so is anything
   * mapped to glyph 0, which is shown for missing characters and is never mapped.
   */
  readonly characters: readonly string[];
}

export interface ReadFont extends FontSource {
  readonly fileName: string;
  readonly outlineFormat: 'cff' | 'truetype';
  readonly container: FontContainer;
  readonly unitsPerEm: number;
  readonly lineGap: number;
  readonly weightClass: number;
  readonly glyphs: readonly ReadGlyph[];
}

/** OS/2 versions 2 and later carry sxHeight and sCapHeight (OpenType spec, 'OS/2'). */
const OS2_VERSION_WITH_HEIGHTS = 2;
/** usWeightClass range (OpenType spec, 'OS/2'). */
const MIN_WEIGHT_CLASS = 1;
const MAX_WEIGHT_CLASS = 1000;
/** Glyph names made up for unnamed glyphs: "glyph" and five digits of the index (common practice). */
const GLYPH_INDEX_DIGITS = 5;

/**
 * What went wrong inside opentype.js, in words: its own checks throw an Error whose
 * message names the table ("Unsupported OpenType version"), but data it did not
 * check ends in a TypeError or RangeError about its internals, which says nothing
 * to a person; those are reported as tables that contradict each other or point
 * past their end.
 */
/** Words that show a parser message is about its own objects, not the font ("Object [object Object] already has key 0"). */
const PARSER_INTERNALS = /\[object |\bundefined\b|\bnull\b|\bNaN\b/;

function parserReason(error: unknown): string {
  if (error instanceof RangeError) return 'a table points past the end of its data';
  if (error instanceof TypeError || !(error instanceof Error) || PARSER_INTERNALS.test(error.message)) return 'its tables contradict each other';
  return error.message;
}

/** The CFF major version this reader takes (Adobe TN #5176, section 6 "Header": major 1). */
const CFF_MAJOR_VERSION = 1;

/**
 * Refuses a 'CFF ' table whose header claims another major version, and CFF2
 * (variable) outlines: opentype.js then reads the table as CFF2, whose INDEX counts
 * are 32-bit, and a damaged count of billions keeps it allocating for minutes. And
 * one whose INDEXes are damaged (cff-top-dict.ts, checkCffIndexes).
 */
function checkCffTable(sfnt: Uint8Array, fileName: string): void {
  const { records } = readTableRecords(sfnt);
  if (records.some((r) => r.tag === 'CFF2')) {
    throw new InputError('font-unsupported', fileName, `${fileName}: its outlines are CFF2 (a variable font); Stemline reads CFF (.otf) and TrueType (.ttf) outlines. Export a static instance of the font first.`);
  }
  const cff = records.find((r) => r.tag === 'CFF ');
  if (cff !== undefined && sfnt[cff.offset] !== CFF_MAJOR_VERSION) {
    throw new InputError('font-unreadable', fileName, `${fileName}: the font is damaged: its 'CFF ' table says it is version ${sfnt[cff.offset] ?? 'none'}, not ${CFF_MAJOR_VERSION}. Export it again or try another copy.`);
  }
  if (cff === undefined) return;
  try {
    checkCffIndexes(sfnt.subarray(cff.offset, cff.offset + cff.length));
  } catch (error) {
    throw new InputError('font-unreadable', fileName, `${fileName}: the font is damaged: in its 'CFF ' table, ${error instanceof Error ? error.message : String(error)}. Export it again or try another copy.`);
  }
}

function parse(bytes: Uint8Array, fileName: string): Font {
  // opentype.parse reads from offset 0 of the ArrayBuffer, so a view into a pooled buffer must be copied out.
  const buffer = bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer;
  try {
    return opentype.parse(buffer);
  } catch (error) {
    throw new InputError('font-unreadable', fileName, `${fileName}: the font is damaged and cannot be read (${parserReason(error)}). Export it again or try another copy.`);
  }
}

/**
 * TrueType contours run clockwise around ink (OpenType 'glyf'); Stemline's model uses
 * the CFF direction, outer contours counter-clockwise, so TrueType contours are
 * reversed on reading (each keeps its first on-curve point).
 */
function outlineOf(glyph: Glyph, fileName: string, truetype: boolean): GlyphOutline {
  let commands;
  try {
    commands = glyph.path.commands;
  } catch (error) {
    throw new InputError('font-unreadable', fileName, `${fileName}: the outline of glyph ${glyph.index} is damaged (${parserReason(error)}). Export the font again.`);
  }
  // A charstring that pops more operands than it pushed gives opentype.js NaN coordinates rather than an error.
  const numbers = commands.flatMap((c) => Object.values(c).filter((value): value is number => typeof value === 'number'));
  if (!numbers.every(Number.isFinite)) {
    throw new InputError('font-unreadable', fileName, `${fileName}: the outline of glyph ${glyph.index} is damaged (a point has no position). Export the font again.`);
  }
  return pathToOutline(commands, truetype ? 'reversed' : 'as-drawn');
}

/** The top of the ink of the glyph for `character` (0 without one), for fonts that do not state x-height or cap height. */
function heightFromGlyph(glyphs: readonly ReadGlyph[], character: string): number {
  const outline = glyphs.find((g) => g.character === character)?.outline;
  return outline === undefined ? 0 : Math.round(tightBounds(outline)?.maxY ?? 0);
}

/**
 * The font in `bytes` (`fileName` is used in messages). Throws InputError:
 * 'font-unsupported' for WOFF2, collections and outline formats other than CFF and
 * TrueType; 'font-unreadable' for files that are not fonts, are cut short or damaged.
 */
export function readFont(bytes: Uint8Array, fileName: string): ReadFont {
  return withoutParserChatter(() => {
    try {
      return readFontQuietly(bytes, fileName);
    } catch (error) {
      if (error instanceof InputError) throw error;
      // opentype.js parses some tables lazily, so damage can surface after parse() returned.
      throw new InputError('font-unreadable', fileName, `${fileName}: the font is damaged and cannot be read (${parserReason(error)}). Export it again or try another copy.`);
    }
  });
}

/** The font's English name of `kind`, or undefined when it has none or its 'name' table is damaged. */
function englishName(font: Font, kind: Parameters<Font['getEnglishName']>[0]): string | undefined {
  try {
    const name = font.getEnglishName(kind);
    return typeof name === 'string' && name.trim() !== '' ? name : undefined;
  } catch {
    return undefined;
  }
}

/**
 * Runs `read` with console output switched off: opentype.js logs every odd table
 * or charstring operator of a damaged font to the console (with stack traces),
 * which would bury the CLI's one-line message. What matters is reported by the
 * reader's own errors.
 */
function withoutParserChatter<T>(read: () => T): T {
  const saved = { log: console.log, warn: console.warn, error: console.error };
  const silent = () => undefined;
  console.log = silent;
  console.warn = silent;
  console.error = silent;
  try {
    return read();
  } finally {
    Object.assign(console, saved);
  }
}

function readFontQuietly(bytes: Uint8Array, fileName: string): ReadFont {
  const container = identifyFontContainer(bytes, fileName);
  const sfnt = container === 'woff' ? woffToSfnt(bytes, fileName) : bytes;
  checkCffTable(sfnt, fileName);
  const font = parse(sfnt, fileName);
  const outlineFormat = font.outlinesFormat;
  if (outlineFormat !== 'cff' && outlineFormat !== 'truetype') {
    throw new InputError('font-unsupported', fileName, `${fileName}: its outlines are in the "${outlineFormat}" format; Stemline reads CFF (.otf) and TrueType (.ttf) outlines.`);
  }

  const usedNames = new Set<string>();
  const glyphs: ReadGlyph[] = [];
  for (let index = 0; index < font.glyphs.length; index++) {
    const glyph = font.glyphs.get(index);
    if (glyph === undefined) continue;
    const codePoints = index === 0 ? [] : glyph.unicodes.filter(isEncodable).sort((a, b) => a - b);
    const primary = codePoints[0];
    const fontName = index === 0 ? NOTDEF_GLYPH_NAME : glyph.name;
    // A TrueType font with a format 3 'post' table stores no glyph names: opentype.js then gives none (undefined).
    let name = typeof fontName === 'string' && isValidGlyphName(fontName) && !usedNames.has(fontName) ? fontName : primary !== undefined ? glyphNameForCodePoint(primary) : '';
    if (name === '' || usedNames.has(name)) name = `glyph${String(index).padStart(GLYPH_INDEX_DIGITS, '0')}`;
    usedNames.add(name);
    const outline = outlineOf(glyph, fileName, outlineFormat === 'truetype');
    glyphs.push({
      index,
      name,
      character: primary === undefined ? '' : String.fromCodePoint(primary),
      characters: codePoints.map((c) => String.fromCodePoint(c)),
      outline,
      advanceWidth: Number.isFinite(glyph.advanceWidth) ? glyph.advanceWidth! : 0,
    });
  }

  const os2 = font.tables.os2;
  const hhea = font.tables.hhea;
  // The typo values where the font has them (OpenType spec, 'OS/2': the recommended line metrics), else hhea's.
  const ascender = os2 !== undefined && os2.sTypoAscender > 0 ? os2.sTypoAscender : (hhea?.ascender ?? font.ascender);
  const descender = Math.min(0, os2?.sTypoDescender ?? hhea?.descender ?? font.descender);
  const hasHeights = os2 !== undefined && os2.version >= OS2_VERSION_WITH_HEIGHTS;
  const xHeight = hasHeights && (os2.sxHeight ?? 0) > 0 ? os2.sxHeight! : heightFromGlyph(glyphs, 'x');
  const capHeight = hasHeights && (os2.sCapHeight ?? 0) > 0 ? os2.sCapHeight! : heightFromGlyph(glyphs, 'H');
  const weight = os2?.usWeightClass;
  const vertical = { unitsPerEm: font.unitsPerEm, ascender, descender, xHeight, capHeight };
  const broken = Object.entries(vertical).filter(([, value]) => typeof value !== 'number' || !Number.isFinite(value)).map(([key]) => key);
  if (broken.length > 0) {
    throw new InputError('font-unreadable', fileName, `${fileName}: the font is damaged: its ${broken.join(', ')} (tables 'head', 'hhea' and 'OS/2') are missing or not numbers. Export it again or try another copy.`);
  }
  const familyName = englishName(font, 'preferredFamily') ?? englishName(font, 'fontFamily') ?? basename(fileName).replace(/\.[^.]*$/, '');
  const styleName = englishName(font, 'preferredSubfamily') ?? englishName(font, 'fontSubfamily') ?? 'Regular';

  return {
    fileName,
    outlineFormat,
    container,
    familyName,
    styleName,
    unitsPerEm: font.unitsPerEm,
    ascender,
    descender,
    lineGap: Math.max(0, os2?.sTypoLineGap ?? hhea?.lineGap ?? 0),
    xHeight,
    capHeight,
    weightClass: weight !== undefined && weight >= MIN_WEIGHT_CLASS && weight <= MAX_WEIGHT_CLASS ? weight : DEFAULT_WEIGHT_CLASS,
    glyphs,
  };
}
