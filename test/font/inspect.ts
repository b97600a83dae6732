// What fontTools sees in a font (test/font/inspect_font.py), typed for the tests.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runPythonScriptJson } from './fonttools.ts';

/** One pen call: moveTo/lineTo/curveTo with its points, closePath/endPath with none. */
export type PenCommand = [string, number[][]];

export interface FontToolsView {
  checksumError: string | null;
  tables: string[];
  glyphOrder: string[];
  head: { fontRevision: number; checkSumAdjustment: number; created: number; modified: number; xMin: number; yMin: number; xMax: number; yMax: number; macStyle: number; unitsPerEm: number };
  hhea: { ascent: number; descent: number; lineGap: number; advanceWidthMax: number; minLeftSideBearing: number; minRightSideBearing: number; xMaxExtent: number };
  os2: {
    version: number;
    xAvgCharWidth: number;
    usWeightClass: number;
    achVendID: string;
    fsSelection: number;
    sTypoAscender: number;
    sTypoDescender: number;
    sTypoLineGap: number;
    usWinAscent: number;
    usWinDescent: number;
    /** null before OS/2 version 2. */
    sxHeight: number | null;
    sCapHeight: number | null;
    usFirstCharIndex: number;
    usLastCharIndex: number;
    usDefaultChar: number;
    usBreakChar: number;
    unicodeRanges: number[];
  };
  post: { formatType: number; underlinePosition: number; underlineThickness: number; italicAngle: number };
  names: Array<{ platformID: number; platEncID: number; langID: number; nameID: number; string: string }>;
  cmap: Record<string, string>;
  hmtx: Record<string, [number, number]>;
  maxp: { numGlyphs: number };
  cff?: { fontNames: string[]; FontBBox: number[]; FullName: string | null; FamilyName: string | null; UnderlinePosition: number; UnderlineThickness: number; FontMatrix: number[] };
  outlines: Record<string, PenCommand[]>;
  /** Tight [xMin, yMin, xMax, yMax] per dumped glyph; null for glyphs without ink. */
  glyphBounds: Record<string, [number, number, number, number] | null>;
  recalculated: { FontBBox?: number[]; hhea: { advanceWidthMax: number; minLeftSideBearing: number; minRightSideBearing: number; xMaxExtent: number }; xAvgCharWidth: number; unicodeRanges: number[] };
  warnings: string[];
}

/** fontTools' view of the font file at `path`; `glyphs` limits the outline dump. */
export function inspectFontFile(path: string, glyphs: readonly string[] = []): FontToolsView {
  return runPythonScriptJson<FontToolsView>('inspect_font.py', [path, ...glyphs]);
}

/** fontTools' view of a font given as bytes. */
export function inspectFont(bytes: Uint8Array, glyphs: readonly string[] = []): FontToolsView {
  const directory = mkdtempSync(join(tmpdir(), 'stemline-fonttools-'));
  try {
    const path = join(directory, 'font.otf');
    writeFileSync(path, bytes);
    return inspectFontFile(path, glyphs);
  } finally {
    rmSync(directory, { recursive: true, force: true });
  }
}
