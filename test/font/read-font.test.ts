// Reading fonts: a reference face opened in Stemline shows exactly the outlines,
// spacing, names and metrics the font holds — CFF outlines point for point,
// TrueType outlines as the cubics equal to their quadratics — and a file that is
// not a readable font is refused with a message saying what it is. References:
// fontTools 4.38 (Debian python3-fonttools; its pen elevates quadratics to cubics
// exactly) and Debian's Cantarell, Linux Libertine and DejaVu Sans fonts.
import { describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DEBIAN_PYTHON } from './fonttools.ts';
import { InputError } from '../../electron/io/input-error.ts';
import { readFont, type ReadFont } from '../../electron/io/font/read-font.ts';
import { writeOtf } from '../../electron/io/font/write-font.ts';
import { FONTTOOLS_PYTHON, REFERENCE_FONTS, type Requirement } from '../support/require-tool.ts';
import { contourDifference } from './contour-compare.ts';
import { inspectFont, inspectFontFile, type FontToolsView } from './inspect.ts';
import { normalizePen, penCommandsOf, roundToUnit } from './pen-commands.ts';
import { REFERENCE_CHARACTERS } from './reference-characters.ts';
import { describeWith } from './require.ts';
import { LETTER_O, LETTER_S, TEST_FONT } from './sample-fonts.ts';


/** CFF outlines are read exactly: fontTools and opentype.js add the same 16.16 deltas, so even fractions agree to 1e-9. */
const CFF_TOLERANCE = 1e-9;
/** TrueType outlines pass through quadratic-to-cubic elevation on both sides, with rounding in the last bits (1e-9 units is far below anything visible). */
const TRUETYPE_TOLERANCE = 1e-9;

interface ReferenceCase {
  label: string;
  font: Requirement;
  tolerance: number;
  /** A sans serif, whose H is straight lines and corners only. */
  sans: boolean;
}

const referenceCases: ReferenceCase[] = [
  { label: 'Cantarell Regular (CFF)', font: REFERENCE_FONTS.cantarellRegular, tolerance: CFF_TOLERANCE, sans: true },
  { label: 'Linux Libertine Regular (CFF, with fractional coordinates)', font: REFERENCE_FONTS.libertineRegular, tolerance: CFF_TOLERANCE, sans: false },
  { label: 'DejaVu Sans (TrueType)', font: REFERENCE_FONTS.dejavuSans, tolerance: TRUETYPE_TOLERANCE, sans: true },
];

function glyphFor(font: ReadFont, character: string) {
  return font.glyphs.find((g) => g.characters.includes(character));
}

for (const referenceCase of referenceCases) {
  describeWith(`reading ${referenceCase.label}`, [referenceCase.font, FONTTOOLS_PYTHON], () => {
    let memo: { font: ReadFont; view: FontToolsView } | undefined;
    const loaded = () => {
      if (memo === undefined) {
        const font = readFont(readFileSync(referenceCase.font.path), referenceCase.font.path);
        const names = REFERENCE_CHARACTERS.map((c) => glyphFor(font, c)?.name).filter((n): n is string => n !== undefined);
        memo = { font, view: inspectFontFile(referenceCase.font.path, names) };
      }
      return memo;
    };

    it('shows every reference letter with the outline fontTools draws from the font', () => {
      const { font, view } = loaded();
      const problems: string[] = [];
      for (const character of REFERENCE_CHARACTERS) {
        const glyph = glyphFor(font, character);
        if (glyph === undefined) continue;
        // Reference: fontTools' glyph drawing (T2 charstrings, or glyf quadratics elevated by BasePen).
        const difference = contourDifference(normalizePen(view.outlines[glyph.name]!), penCommandsOf(glyph.outline), referenceCase.tolerance);
        if (difference !== undefined) problems.push(`${character} (${glyph.name}): ${difference}`);
      }
      expect(problems).toEqual([]);
      expect(REFERENCE_CHARACTERS.filter((c) => glyphFor(font, c) !== undefined).length).toBeGreaterThanOrEqual(62);
    });

    it('keeps every glyph’s name, advance width and characters as the font has them', () => {
      const { font, view } = loaded();
      // Reference: fontTools glyph order, hmtx and best cmap.
      expect(font.glyphs.length).toBe(view.glyphOrder.length);
      const nameDifferences = font.glyphs.filter((g, i) => g.name !== view.glyphOrder[i]).length;
      expect(nameDifferences).toBe(0);
      for (const glyph of font.glyphs) expect(glyph.advanceWidth).toBe(view.hmtx[glyph.name]?.[0]);
      for (const [codePoint, name] of Object.entries(view.cmap)) {
        const character = String.fromCodePoint(Number(codePoint));
        expect(font.glyphs.find((g) => g.name === name)?.characters).toContain(character);
      }
    });

    it('reports the units per em, vertical metrics, weight and names the font declares', () => {
      const { font, view } = loaded();
      // Reference: fontTools head, OS/2 and name tables.
      expect(font.unitsPerEm).toBe(view.head.unitsPerEm);
      expect([font.ascender, font.descender, font.lineGap]).toEqual([view.os2.sTypoAscender, view.os2.sTypoDescender, view.os2.sTypoLineGap]);
      // OS/2 before version 2 has no x-height or cap height: then they are measured from x and H (fontTools BoundsPen).
      const measured = (c: string) => Math.round(view.glyphBounds[glyphFor(font, c)!.name]![3]);
      expect([font.xHeight, font.capHeight]).toEqual([view.os2.sxHeight ?? measured('x'), view.os2.sCapHeight ?? measured('H')]);
      expect(font.weightClass).toBe(view.os2.usWeightClass);
      const name = (id: number) => view.names.find((n) => n.nameID === id && n.platformID === 3)?.string;
      expect(font.familyName).toBe(name(16) ?? name(1));
      expect(font.styleName).toBe(name(17) ?? name(2));
      expect(font.outlineFormat).toBe(view.tables.includes('glyf') ? 'truetype' : 'cff');
    });

    it('marks the round letters’ joins smooth and the corners of H not', () => {
      const { font } = loaded();
      const onCurve = (c: string) => glyphFor(font, c)!.outline.contours.flatMap((contour) => contour.points.filter((p) => p.kind === 'on'));
      // An o has at least its four extrema per contour as smooth joins.
      expect(onCurve('o').filter((p) => p.smooth).length).toBeGreaterThanOrEqual(8);
      // An H has at least the four corners where the crossbar meets the stems.
      expect(onCurve('H').filter((p) => !p.smooth).length).toBeGreaterThanOrEqual(4);
      if (referenceCase.sans) expect(onCurve('H').some((p) => p.smooth)).toBe(false);
    });
  });
}

describeWith('reading back a font Stemline wrote', [FONTTOOLS_PYTHON], () => {
  it('gives back the written outlines, names, widths, metrics and smooth joins', () => {
    const bytes = writeOtf(TEST_FONT);
    const font = readFont(bytes, 'test.otf');
    const view = inspectFont(bytes);
    expect(font.familyName).toBe(TEST_FONT.familyName);
    expect(font.styleName).toBe(TEST_FONT.styleName);
    expect([font.unitsPerEm, font.ascender, font.descender, font.lineGap, font.xHeight, font.capHeight, font.weightClass]).toEqual([1000, 800, -200, 90, 500, 700, 400]);
    expect(font.glyphs.map((g) => g.name)).toEqual(view.glyphOrder);
    for (const source of TEST_FONT.glyphs) {
      const glyph = font.glyphs.find((g) => (source.character === '' ? g.name === source.name : g.character === source.character))!;
      expect(glyph.advanceWidth).toBe(Math.round(source.advanceWidth));
      expect(penCommandsOf(glyph.outline)).toEqual(penCommandsOf(source.outline, roundToUnit));
    }
    const smoothFlags = (outline: typeof LETTER_S) => outline.contours.flatMap((c) => c.points.filter((p) => p.kind === 'on').map((p) => p.smooth));
    expect(smoothFlags(font.glyphs.find((g) => g.character === 'S')!.outline)).toEqual(smoothFlags(LETTER_S));
    expect(smoothFlags(font.glyphs.find((g) => g.character === 'o')!.outline)).toEqual(smoothFlags(LETTER_O));
  });

  it('reads a font from a view into a larger, pooled buffer', () => {
    const bytes = writeOtf(TEST_FONT);
    const pooled = Buffer.concat([Buffer.from('padding before the font'), Buffer.from(bytes)]);
    const view = pooled.subarray(pooled.length - bytes.length);
    expect(view.byteOffset).toBeGreaterThan(0);
    expect(readFont(view, 'pooled.otf').glyphs.length).toBe(readFont(bytes, 'plain.otf').glyphs.length);
  });
});

function expectInputError(bytes: Uint8Array, kind: string, pattern: RegExp): void {
  let caught: unknown;
  try {
    readFont(bytes, 'sample.otf');
  } catch (error) {
    caught = error;
  }
  expect(caught).toBeInstanceOf(InputError);
  expect((caught as InputError).kind).toBe(kind);
  expect((caught as InputError).file).toBe('sample.otf');
  expect((caught as InputError).message).toMatch(pattern);
}

describe('files that are not readable fonts', () => {
  const font = writeOtf(TEST_FONT);
  const ascii = (text: string) => new TextEncoder().encode(text);

  it('says a file is not a font when it is something else', () => {
    expectInputError(ascii('\x89PNG\r\n\x1a\n and then some image data'), 'font-unreadable', /sample\.otf: not a font file.*\.otf, \.ttf or \.woff/);
    expectInputError(ascii('hello'), 'font-unreadable', /not a font file/);
    expectInputError(new Uint8Array(0), 'font-unreadable', /not a font file \(only 0 bytes\)/);
  });

  it('says a font file is incomplete when it was cut short', () => {
    expectInputError(font.subarray(0, Math.floor(font.length / 2)), 'font-unreadable', /incomplete.*end past/);
    expectInputError(font.subarray(0, 20), 'font-unreadable', /incomplete.*table directory/);
  });

  it('says WOFF2 files and font collections are not supported and what to do instead', () => {
    expectInputError(new Uint8Array([...ascii('wOF2'), ...font.subarray(4)]), 'font-unsupported', /WOFF2 fonts are not supported.*Convert/);
    expectInputError(new Uint8Array([...ascii('ttcf'), ...font.subarray(4)]), 'font-unsupported', /collections.*not supported/);
  });

  it('says a font is damaged when its tables are garbage', () => {
    const damaged = font.slice();
    for (let i = 200; i < damaged.length; i++) damaged[i] = (i * 131) & 0xff;
    expectInputError(damaged, 'font-unreadable', /damaged/);
  });
});

describeWith('a TrueType font that stores no glyph names', [FONTTOOLS_PYTHON, REFERENCE_FONTS.dejavuSans], () => {
  it('opens with names made from its characters (a format 3 post table, as many shipped TrueType fonts have)', () => {
    const out = join(mkdtempSync(join(tmpdir(), 'stemline-post3-')), 'subset.ttf');
    // fontTools' subsetter writes 'post' format 3 (no names) unless asked to keep them (fontTools.subset --help, --glyph-names).
    execFileSync(DEBIAN_PYTHON, ['-m', 'fontTools.subset', REFERENCE_FONTS.dejavuSans.path, '--text=Ag', `--output-file=${out}`]);
    const font = readFont(readFileSync(out), 'subset.ttf');
    expect(font.glyphs.map((g) => g.name)).toEqual(['.notdef', 'A', 'g']);
  });
});
