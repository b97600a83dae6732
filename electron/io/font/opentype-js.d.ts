// Minimal ambient types for opentype.js 2.0.0, which ships none: exactly what the
// font writer and reader use (building a CFF font from glyph paths, parsing a font,
// reading glyph outlines, metrics, names and tables) and what the tests use to
// render reference glyphs. The one declaration for the whole project.
//
// The module is imported by the path of the package's own `main` file,
// 'opentype.js/dist/opentype.js' (the same file, the same instance, as the bare
// 'opentype.js').

declare module 'opentype.js/dist/opentype.js' {
  /** One outline command; font units, y up, as found in `glyph.path.commands`. */
  export type PathCommand =
    | { readonly type: 'M' | 'L'; readonly x: number; readonly y: number }
    | { readonly type: 'C'; readonly x1: number; readonly y1: number; readonly x2: number; readonly y2: number; readonly x: number; readonly y: number }
    | { readonly type: 'Q'; readonly x1: number; readonly y1: number; readonly x: number; readonly y: number }
    | { readonly type: 'Z' };

  export class Path {
    constructor();
    commands: PathCommand[];
    moveTo(x: number, y: number): void;
    lineTo(x: number, y: number): void;
    curveTo(x1: number, y1: number, x2: number, y2: number, x: number, y: number): void;
    close(): void;
  }

  export interface GlyphOptions {
    name: string;
    unicode?: number;
    unicodes?: number[];
    advanceWidth: number;
    leftSideBearing: number;
    path: Path;
  }

  export class Glyph {
    constructor(options: GlyphOptions);
    readonly index: number;
    readonly name: string | null;
    readonly unicodes: readonly number[];
    readonly advanceWidth: number | undefined;
    readonly path: Path;
  }

  export interface GlyphSet {
    readonly length: number;
    get(index: number): Glyph | undefined;
  }

  /** The English names opentype.js knows by key (OpenType name IDs 1, 2, 16, 17). */
  export type EnglishNameKey = 'fontFamily' | 'fontSubfamily' | 'preferredFamily' | 'preferredSubfamily';

  /** Table fields as opentype.js parses them; only the fields read here. */
  export interface ParsedOs2Table {
    readonly version: number;
    readonly usWeightClass: number;
    readonly sTypoAscender: number;
    readonly sTypoDescender: number;
    readonly sTypoLineGap: number;
    readonly usWinAscent: number;
    readonly usWinDescent: number;
    readonly sxHeight?: number;
    readonly sCapHeight?: number;
  }
  export interface ParsedHheaTable {
    readonly ascender: number;
    readonly descender: number;
    readonly lineGap: number;
  }

  /** Tables a new font is given: fields here override what opentype.js computes. */
  export interface WritableTables {
    os2?: Record<string, number | string>;
    post?: Record<string, number>;
  }

  export interface FontOptions {
    familyName: string;
    styleName: string;
    fullName: string;
    postScriptName: string;
    version: string;
    unitsPerEm: number;
    ascender: number;
    descender: number;
    weightClass: number;
    fsSelection: number;
    createdTimestamp: number;
    tables: WritableTables;
    glyphs: Glyph[];
  }

  export class Font {
    constructor(options: FontOptions);
    readonly unitsPerEm: number;
    readonly ascender: number;
    readonly descender: number;
    readonly outlinesFormat: 'truetype' | 'cff' | string;
    readonly glyphs: GlyphSet;
    readonly tables: { readonly os2?: ParsedOs2Table; readonly hhea?: ParsedHheaTable };
    getEnglishName(name: EnglishNameKey): string | undefined;
    /** The glyph a character maps to (.notdef when none); the tests render reference glyphs with it. */
    charToGlyph(character: string): Glyph;
    toArrayBuffer(): ArrayBuffer;
  }

  interface OpentypeModule {
    readonly Font: typeof Font;
    readonly Glyph: typeof Glyph;
    readonly Path: typeof Path;
    parse(buffer: ArrayBuffer): Font;
  }

  const opentype: OpentypeModule;
  export default opentype;
}
