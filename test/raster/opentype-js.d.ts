// Minimal ambient types for opentype.js 2.0.0, which ships none: only what the raster
// tests use (parsing a font, looking up a glyph, reading its outline commands).

declare module 'opentype.js' {
  /** One outline command. Font units, y up, for glyph.path; pixels, y down, for getPath. */
  export type PathCommand =
    | { readonly type: 'M' | 'L'; readonly x: number; readonly y: number }
    | { readonly type: 'C'; readonly x1: number; readonly y1: number; readonly x2: number; readonly y2: number; readonly x: number; readonly y: number }
    | { readonly type: 'Q'; readonly x1: number; readonly y1: number; readonly x: number; readonly y: number }
    | { readonly type: 'Z' };

  export interface Path {
    readonly commands: PathCommand[];
  }

  export interface Glyph {
    readonly name: string | null;
    readonly advanceWidth: number | undefined;
    readonly path: Path;
  }

  export interface Font {
    readonly unitsPerEm: number;
    charToGlyph(character: string): Glyph;
    hasChar(character: string): boolean;
  }

  const opentype: {
    parse(buffer: ArrayBuffer): Font;
  };
  export default opentype;
}
