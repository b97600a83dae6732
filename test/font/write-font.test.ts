// Writing the test font: what a lettering artist installs or loads in a browser
// must open everywhere, show exactly their outlines, space lines as they set, and be
// named properly in font menus. References: ots-sanitize (Debian
// opentype-sanitizer, the checks browsers apply), fontTools 4.38 (Debian
// python3-fonttools: an independent parser, and its own recalculation of bounds and
// metrics), fontkit 2.0.4 (a third parser).
import { describe, expect, it } from 'vitest';
import * as fontkit from 'fontkit';
import { offCurve, onCurve, type GlyphOutline } from '../../core/outline/index.ts';
import { FontError, type FontErrorKind } from '../../electron/io/font/font-error.ts';
import type { FontGlyph, FontSource } from '../../electron/io/font/font-model.ts';
import { glyphNameForCodePoint } from '../../electron/io/font/glyph-names.ts';
import { writeOtf } from '../../electron/io/font/write-font.ts';
import { FONTTOOLS_PYTHON, OTS_SANITIZE } from '../support/require-tool.ts';
import { inspectFont, type FontToolsView } from './inspect.ts';
import { otsSanitize } from './ots.ts';
import { penCommandsOf, roundToUnit } from './pen-commands.ts';
import { describeWith } from './require.ts';
import { deepFreeze, ellipse, LETTER_I, LETTER_O, rectangle, syntheticFont, TEST_FONT, TEST_GLYPHS } from './sample-fonts.ts';

/** The whole file must sum to this (OpenType spec, 'head' checkSumAdjustment: 0xB1B0AFBA). */
const WHOLE_FONT_CHECKSUM = 0xb1b0afba;
/** Seconds from 1904-01-01 to 2000-01-01 (the writer's default timestamp), computed here from the calendar. */
const DEFAULT_TIMESTAMP_LONGDATETIME = (Date.UTC(2000, 0, 1) - Date.UTC(1904, 0, 1)) / 1000;
/** fsSelection bit 7 USE_TYPO_METRICS and bit 6 REGULAR (OpenType spec, 'OS/2'). */
const USE_TYPO_METRICS = 1 << 7;
const REGULAR = 1 << 6;
/** The code point that ends every cmap format 4 subtable (OpenType spec, 'cmap' format 4: the last segment is 0xFFFF). */
const CMAP_FORMAT_4_END = 0xffff;

/** Independent whole-file checksum: big-endian uint32 words, zero-padded, modulo 2³² (OpenType spec, "Calculating checksums"). */
function wholeFileChecksum(bytes: Uint8Array): number {
  let sum = 0n;
  for (let i = 0; i < bytes.length; i += 4) {
    sum += BigInt(((bytes[i] ?? 0) * 2 ** 24) + ((bytes[i + 1] ?? 0) << 16) + ((bytes[i + 2] ?? 0) << 8) + (bytes[i + 3] ?? 0));
  }
  return Number(sum % 2n ** 32n);
}

interface WriterCase {
  label: string;
  source: FontSource;
  /** Expected outline per glyph name, when not the source outline rounded. */
  expectedOutline?: Record<string, GlyphOutline>;
}

const nonAsciiFamily: FontSource = { ...TEST_FONT, familyName: 'Café Écrit', styleName: 'Régulier' };
const cases: WriterCase[] = [
  { label: 'the Latin test letters', source: TEST_FONT },
  { label: 'a family named "Café Écrit" in style "Régulier"', source: nonAsciiFamily },
  { label: 'a family named in Japanese (手書き)', source: { ...TEST_FONT, familyName: '手書き', styleName: 'Regular' } },
  { label: 'a Light Italic style (not one of the four linked styles)', source: { ...TEST_FONT, styleName: 'Light Italic', weightClass: 300 } },
  { label: 'a Bold style', source: { ...TEST_FONT, styleName: 'Bold', weightClass: 700, vendorId: 'ABCD', version: 2.5 } },
  {
    label: 'a 2048-unit em with ink far beyond the ascender and descender',
    source: {
      ...TEST_FONT,
      unitsPerEm: 2048,
      ascender: 1600,
      descender: -450,
      xHeight: 1050,
      capHeight: 1450,
      glyphs: [
        { character: 'I', outline: { contours: [rectangle(180, -1900.4, 380, 3100)] }, advanceWidth: 560 },
        { character: 'o', outline: { contours: [ellipse(600, 500, 2500, 520)] }, advanceWidth: 1200 },
      ],
    },
  },
  {
    label: 'a character beyond the BMP (😀) and an unencoded alternate',
    source: { ...TEST_FONT, glyphs: [...TEST_GLYPHS, { character: '😀', outline: LETTER_O, advanceWidth: 700 }] },
  },
  {
    label: 'glyphs for several characters: the space also for the no-break space, the hyphen also for the soft hyphen, an o also for 😀 (beyond the BMP)',
    source: {
      ...TEST_FONT,
      glyphs: [
        { character: ' ', characters: [' ', '\u00a0'], outline: { contours: [] }, advanceWidth: 250 },
        { character: '-', characters: ['-', '\u00ad', '\u2010'], outline: { contours: [rectangle(40, 220, 300, 290)] }, advanceWidth: 340 },
        { character: 'o', characters: ['o', '😀'], outline: LETTER_O, advanceWidth: 580 },
        { character: 'I', outline: LETTER_I, advanceWidth: 300 },
      ],
    },
  },
  { label: 'no glyphs at all (only .notdef and the space the writer adds)', source: { ...TEST_FONT, glyphs: [] } },
  {
    label: 'its own .notdef and space, and a glyph placed by its sidebearing',
    source: {
      ...TEST_FONT,
      glyphs: [
        { character: ' ', outline: { contours: [] }, advanceWidth: 230 },
        { character: '', name: '.notdef', outline: { contours: [rectangle(40, 0, 460, 720)] }, advanceWidth: 500 },
        { character: 'I', outline: LETTER_I, advanceWidth: 300, leftSidebearing: 55.2 },
      ],
    },
    expectedOutline: { I: { contours: [rectangle(55, 0, 155, 700)] } },
  },
  { label: '500 synthetic glyphs', source: syntheticFont(500) },
];

/** Every code point the glyph is for: its characters, or its one character. */
const codePointsOf = (glyph: FontGlyph): number[] => (glyph.characters ?? (glyph.character === '' ? [] : [glyph.character])).map((c) => c.codePointAt(0)!);

function expectedGlyphs(source: FontSource): Map<string, FontGlyph> {
  const byName = new Map<string, FontGlyph>();
  for (const glyph of source.glyphs) byName.set(glyph.name ?? glyphNameForCodePoint(glyph.character.codePointAt(0)!), glyph);
  return byName;
}

describeWith('a written font, as browsers and fontTools see it', [OTS_SANITIZE, FONTTOOLS_PYTHON], () => {
  for (const testCase of cases) {
    describe(testCase.label, () => {
      const { source } = testCase;
      let memo: { bytes: Uint8Array; view: FontToolsView } | undefined;
      const written = () => {
        if (memo === undefined) {
          const bytes = writeOtf(source);
          memo = { bytes, view: inspectFont(bytes) };
        }
        return memo;
      };

      it('is accepted by the browsers’ font sanitizer (ots-sanitize exits 0)', () => {
        const result = otsSanitize(written().bytes);
        // Reference: ots-sanitize (Debian opentype-sanitizer).
        expect(result.output).not.toMatch(/ERROR|Failed/i);
        expect(result.passed).toBe(true);
      });

      it('opens in fontTools with every table decompiled and every glyph drawn, without a warning, checksums right', () => {
        const { bytes, view } = written();
        // Reference: fontTools TTFont (checkChecksums=2 raises on a wrong table checksum), logging at WARNING.
        expect(view.warnings).toEqual([]);
        expect(view.checksumError).toBeNull();
        expect(view.tables).toEqual(['CFF ', 'OS/2', 'cmap', 'head', 'hhea', 'hmtx', 'maxp', 'name', 'post']);
        // Reference: OpenType spec, 'head' checkSumAdjustment — the whole file sums to 0xB1B0AFBA.
        expect(wholeFileChecksum(bytes)).toBe(WHOLE_FONT_CHECKSUM);
      });

      it('draws every glyph exactly as the source outline on whole units, same contours, order and direction', () => {
        const { view } = written();
        const glyphs = expectedGlyphs(source);
        const mismatches: string[] = [];
        for (const [name, glyph] of glyphs) {
          const expected = penCommandsOf(testCase.expectedOutline?.[name] ?? glyph.outline, roundToUnit);
          // Reference: fontTools' charstring decompiler and pen (T2CharString.draw).
          if (JSON.stringify(view.outlines[name]) !== JSON.stringify(expected)) mismatches.push(name);
        }
        expect(mismatches).toEqual([]);
      });

      it('puts a hollow box at glyph 0 for missing characters, and a space', () => {
        const { view } = written();
        expect(view.glyphOrder[0]).toBe('.notdef');
        expect(view.cmap['32']).toBeDefined();
        const ownNotdef = source.glyphs.find((g) => g.name === '.notdef');
        if (ownNotdef !== undefined) return;
        // Two closed polygons, outer counter-clockwise (positive shoelace area) and inner clockwise.
        const polygons: number[][][] = [];
        for (const [op, points] of view.outlines['.notdef']!) {
          if (op === 'moveTo') polygons.push([points[0]!]);
          else if (op === 'lineTo') polygons[polygons.length - 1]!.push(points[0]!);
          else expect(op).toBe('closePath');
        }
        const area = (poly: number[][]) => poly.reduce((a, p, i) => a + (p[0]! * poly[(i + 1) % poly.length]![1]! - poly[(i + 1) % poly.length]![0]! * p[1]!) / 2, 0);
        expect(polygons.map((p) => Math.sign(area(p)))).toEqual([1, -1]);
      });

      it('maps every character to its glyph and gives every glyph its whole-unit advance, as fontTools and fontkit read them', () => {
        const { bytes, view } = written();
        const font = fontkit.create(Buffer.from(bytes)) as fontkit.Font;
        for (const glyph of source.glyphs) {
          const name = glyph.name ?? glyphNameForCodePoint(glyph.character.codePointAt(0)!);
          const advance = Math.round(glyph.advanceWidth);
          // Reference: fontTools hmtx and cmap.
          expect(view.hmtx[name]?.[0]).toBe(advance);
          for (const codePoint of codePointsOf(glyph)) {
            expect(view.cmap[String(codePoint)]).toBe(name);
            // Reference: fontkit (independent parser).
            expect(font.glyphForCodePoint(codePoint).advanceWidth).toBe(advance);
            expect(font.glyphForCodePoint(codePoint).name).toBe(name);
          }
        }
        const encoded = source.glyphs.flatMap(codePointsOf);
        // Reference: fontkit's character set; the writer adds U+0020 when the source has none.
        // fontkit also lists U+FFFF, the end marker every cmap format 4 subtable carries
        // (OpenType spec, 'cmap' format 4), which maps to glyph 0 — in Debian's own fonts too.
        expect(font.glyphForCodePoint(CMAP_FORMAT_4_END).id).toBe(0);
        expect(new Set(font.characterSet.filter((c) => c !== CMAP_FORMAT_4_END))).toEqual(new Set([...encoded, 0x20]));
      });

      it('records each glyph’s left sidebearing as its ink’s left edge', () => {
        const { view } = written();
        for (const name of view.glyphOrder) {
          const bounds = view.glyphBounds[name];
          // Reference: fontTools BoundsPen (tight bounds); whole units floored (as fontTools' own hhea recalculation does).
          expect(view.hmtx[name]?.[1]).toBe(bounds ? Math.floor(bounds[0]) : 0);
        }
      });

      it('states the bounding box, sidebearing extremes and average width fontTools computes from the glyphs', () => {
        const { view } = written();
        // Reference: fontTools TopDict.recalcFontBBox (union of BoundsPen boxes, widened to whole units).
        expect(view.cff?.FontBBox).toEqual(view.recalculated.FontBBox);
        const [xMin, yMin, xMax, yMax] = view.recalculated.FontBBox!;
        expect([view.head.xMin, view.head.yMin, view.head.xMax, view.head.yMax]).toEqual([xMin, yMin, xMax, yMax]);
        // Reference: fontTools hhea.recalc.
        expect({
          advanceWidthMax: view.hhea.advanceWidthMax,
          minLeftSideBearing: view.hhea.minLeftSideBearing,
          minRightSideBearing: view.hhea.minRightSideBearing,
          xMaxExtent: view.hhea.xMaxExtent,
        }).toEqual(view.recalculated.hhea);
        // Reference: fontTools OS/2 recalcAvgCharWidth and recalcUnicodeRanges.
        expect(view.os2.xAvgCharWidth).toBe(view.recalculated.xAvgCharWidth);
        expect(view.os2.unicodeRanges).toEqual(view.recalculated.unicodeRanges);
      });

      it('spaces lines as the source says, identically in hhea and OS/2, and never clips ink on Windows', () => {
        const { view } = written();
        const upm = source.unitsPerEm ?? 1000;
        expect(view.head.unitsPerEm).toBe(upm);
        expect([view.hhea.ascent, view.hhea.descent, view.hhea.lineGap]).toEqual([source.ascender, source.descender, source.lineGap ?? 0]);
        expect([view.os2.sTypoAscender, view.os2.sTypoDescender, view.os2.sTypoLineGap]).toEqual([source.ascender, source.descender, source.lineGap ?? 0]);
        // OpenType spec, 'OS/2' fsSelection bit 7 (defined from version 4).
        expect(view.os2.fsSelection & USE_TYPO_METRICS).toBe(USE_TYPO_METRICS);
        expect(view.os2.version).toBeGreaterThanOrEqual(4);
        const [, yMin, , yMax] = view.recalculated.FontBBox!;
        expect(view.os2.usWinAscent).toBeGreaterThanOrEqual(Math.max(yMax!, source.ascender));
        expect(view.os2.usWinDescent).toBeGreaterThanOrEqual(Math.max(-yMin!, -source.descender));
        expect([view.os2.sxHeight, view.os2.sCapHeight]).toEqual([source.xHeight, source.capHeight]);
        expect(view.os2.usWeightClass).toBe(source.weightClass ?? 400);
        expect(view.os2.achVendID).toBe((source.vendorId ?? 'STML').padEnd(4, ' '));
        // Common practice: underline 0.1 em below the baseline, 0.05 em thick.
        expect(view.post.underlinePosition).toBe(Math.round(-0.1 * upm));
        expect(view.post.underlineThickness).toBe(Math.round(0.05 * upm));
        expect([view.cff?.UnderlinePosition, view.cff?.UnderlineThickness]).toEqual([view.post.underlinePosition, view.post.underlineThickness]);
        expect(view.cff?.FontMatrix[0]).toBeCloseTo(1 / upm, 12);
      });

      it('carries real names only: no blank records, a unique ID, an ASCII PostScript name matching the CFF font name', () => {
        const { view } = written();
        const ids = view.names.map((n) => n.nameID);
        expect(view.names.filter((n) => n.string.trim() === '')).toEqual([]);
        for (const required of [1, 2, 3, 4, 5, 6]) expect(ids).toContain(required);
        for (const placeholder of [0, 7, 8, 10, 11, 12, 13, 14]) expect(ids).not.toContain(placeholder);
        const name = (id: number) => view.names.find((n) => n.nameID === id)?.string;
        const postScript = name(6)!;
        // OpenType spec, name ID 6: ≤ 63 printable ASCII characters; we use [A-Za-z0-9-] only.
        expect(postScript).toMatch(/^[A-Za-z0-9-]{1,63}$/);
        expect(view.cff?.fontNames).toEqual([postScript]);
        expect(name(3)).toBe(`${(source.version ?? 1).toFixed(3)};${source.vendorId ?? 'STML'};${postScript}`);
        expect(name(5)).toBe(`Version ${(source.version ?? 1).toFixed(3)}`);
        expect(name(4)).toBe(`${source.familyName} ${source.styleName}`);
        expect(name(9)).toBe(source.designer);
        const family = name(16) ?? name(1);
        expect(family).toBe(source.familyName);
        expect(name(17) ?? name(2)).toBe(source.styleName);
      });

      it('stamps the fixed default time, so the same source gives the same file', () => {
        const { bytes, view } = written();
        expect(view.head.created).toBe(DEFAULT_TIMESTAMP_LONGDATETIME);
        expect(view.head.modified).toBe(DEFAULT_TIMESTAMP_LONGDATETIME);
        expect(Buffer.from(writeOtf(source)).equals(Buffer.from(bytes))).toBe(true);
      });
    });
  }

  it('links Bold into its family and gives Light Italic its own family name with typographic names', () => {
    const bold = inspectFont(writeOtf({ ...TEST_FONT, styleName: 'Bold', weightClass: 700, glyphs: [] }));
    const names = (view: FontToolsView) => Object.fromEntries(view.names.map((n) => [n.nameID, n.string]));
    // OpenType spec, name IDs 1/2 (the four linked styles) and 16/17 (everything else).
    expect(names(bold)).toMatchObject({ 1: 'Stemline Test', 2: 'Bold' });
    expect(names(bold)[16]).toBeUndefined();
    expect(bold.os2.fsSelection & 0b1100001).toBe(1 << 5); // BOLD set, REGULAR and ITALIC clear
    expect(bold.head.macStyle).toBe(1); // bit 0 bold
    const light = inspectFont(writeOtf({ ...TEST_FONT, styleName: 'Light Italic', weightClass: 300, glyphs: [] }));
    expect(names(light)).toMatchObject({ 1: 'Stemline Test Light', 2: 'Italic', 16: 'Stemline Test', 17: 'Light Italic' });
    expect(light.os2.fsSelection & 0b1100001).toBe(1); // ITALIC only
    expect(light.head.macStyle).toBe(2); // bit 1 italic
    const regular = inspectFont(writeOtf({ ...TEST_FONT, glyphs: [] }));
    expect(regular.os2.fsSelection).toBe(REGULAR | USE_TYPO_METRICS);
  });

  it('derives an ASCII PostScript name from a family with accents: "Café Écrit" → "CafeEcrit-Regular"', () => {
    const view = inspectFont(writeOtf({ ...TEST_FONT, familyName: 'Café Écrit', glyphs: [] }));
    expect(view.names.find((n) => n.nameID === 6)?.string).toBe('CafeEcrit-Regular');
    expect(view.names.find((n) => n.nameID === 1)?.string).toBe('Café Écrit');
  });
});

describe('reproducible font files', () => {
  it('writes the same bytes for the same source, and only the head dates differ for another timestamp', () => {
    const first = writeOtf(TEST_FONT);
    expect(Buffer.from(writeOtf(TEST_FONT)).equals(Buffer.from(first))).toBe(true);
    const dated = writeOtf({ ...TEST_FONT, timestamp: new Date(Date.UTC(2024, 5, 1)) });
    expect(dated.length).toBe(first.length);
    const differing = [...first.keys()].filter((i) => first[i] !== dated[i]);
    expect(differing.length).toBeGreaterThan(0);
    expect(differing.length).toBeLessThanOrEqual(20); // created + modified (16 bytes) and head.checkSumAdjustment (4)
  });

  it('does not modify the source it is given', () => {
    const source = deepFreeze(structuredClone(TEST_FONT));
    const before = JSON.stringify(source);
    expect(() => writeOtf(source)).not.toThrow();
    expect(JSON.stringify(source)).toBe(before);
  });
});

function expectFontError(source: FontSource, kind: FontErrorKind, pattern: RegExp, glyph?: string): void {
  let caught: unknown;
  try {
    writeOtf(source);
  } catch (error) {
    caught = error;
  }
  expect(caught).toBeInstanceOf(FontError);
  expect((caught as FontError).kind).toBe(kind);
  expect((caught as FontError).message).toMatch(pattern);
  if (glyph !== undefined) expect((caught as FontError).glyph).toBe(glyph);
}

const withGlyphs = (...glyphs: FontGlyph[]): FontSource => ({ ...TEST_FONT, glyphs });
const bar = (x0: number, y0: number, x1: number, y1: number): GlyphOutline => ({ contours: [rectangle(x0, y0, x1, y1)] });

describe('font sources that cannot make a font', () => {
  it('names the glyph whose points lie beyond what a font can store', () => {
    expectFontError(withGlyphs({ character: 'W', outline: bar(0, 0, 40000, 700), advanceWidth: 600 }), 'coordinate-out-of-range', /"W".*40000.*-32768…32767/, 'W');
    expectFontError(withGlyphs({ character: 'V', outline: bar(0, -33000.2, 100, 0), advanceWidth: 600 }), 'coordinate-out-of-range', /"V".*-33000/, 'V');
  });

  it('refuses a glyph whose consecutive points are further apart than a charstring step can be', () => {
    expectFontError(withGlyphs({ character: 'X', outline: bar(-20000, 0, 20000, 10), advanceWidth: 600 }), 'coordinate-out-of-range', /"X".*step/, 'X');
  });

  it('refuses two glyphs for one character, and two glyphs with one name', () => {
    expectFontError(withGlyphs({ character: 'I', outline: LETTER_I, advanceWidth: 300 }, { character: 'I', name: 'I.alt', outline: LETTER_I, advanceWidth: 300 }), 'duplicate-character', /"I" and "I.alt".*U\+0049/);
    expectFontError(withGlyphs({ character: 'I', outline: LETTER_I, advanceWidth: 300 }, { character: 'l', name: 'I', outline: LETTER_I, advanceWidth: 300 }), 'duplicate-glyph-name', /both named "I"/);
  });

  it('refuses a character listed by two glyphs, naming both, and a list that does not start with the glyph’s own character', () => {
    const space = { character: ' ', characters: [' ', '\u00a0'], outline: { contours: [] }, advanceWidth: 250 };
    expectFontError(withGlyphs(space, { character: '\u00a0', name: 'nbspace', outline: { contours: [] }, advanceWidth: 250 }), 'duplicate-character', /"space" and "nbspace" are both for U\+00A0/, 'nbspace');
    expectFontError(withGlyphs({ character: 'o', characters: ['o', '😀'], outline: LETTER_O, advanceWidth: 580 }, { character: 'O', characters: ['O', '😀'], outline: LETTER_O, advanceWidth: 700 }), 'duplicate-character', /"o" and "O" are both for U\+1F600/);
    expectFontError(withGlyphs({ ...space, characters: ['\u00a0', ' '] }), 'bad-character', /U\+0020.*starts with "\u00a0".*own character/);
    expectFontError(withGlyphs({ ...space, characters: [' ', '\u00a0', ' '] }), 'bad-character', /lists U\+0020 twice/);
    expectFontError(withGlyphs({ ...space, characters: [' ', 'ab'] }), 'bad-character', /also lists "ab".*2 characters/);
    expectFontError(withGlyphs({ character: '', name: 'a.alt', characters: ['a'], outline: LETTER_I, advanceWidth: 300 }), 'bad-character', /"a.alt" has character '' but lists/);
  });

  it('refuses glyph names a font cannot hold and unencoded glyphs without a name', () => {
    expectFontError(withGlyphs({ character: 'a', name: 'a alt', outline: LETTER_I, advanceWidth: 300 }), 'bad-glyph-name', /"a alt".*A–Z/);
    expectFontError(withGlyphs({ character: '', outline: LETTER_I, advanceWidth: 300 }), 'bad-glyph-name', /no character and no name/);
    expectFontError(withGlyphs({ character: 'a', name: '.notdef', outline: LETTER_I, advanceWidth: 300 }), 'bad-character', /\.notdef.*character ''/);
  });

  it('refuses characters that are not exactly one real character', () => {
    expectFontError(withGlyphs({ character: 'fi', outline: LETTER_I, advanceWidth: 300 }), 'bad-character', /"fi".*2 characters/);
    expectFontError(withGlyphs({ character: '\ud800', outline: LETTER_I, advanceWidth: 300 }), 'bad-character', /surrogate/);
    expectFontError(withGlyphs({ character: '\u0000', outline: LETTER_I, advanceWidth: 300 }), 'bad-character', /U\+0000/);
    expectFontError(withGlyphs({ character: '\uffff', outline: LETTER_I, advanceWidth: 300 }), 'bad-character', /noncharacter/);
  });

  it('refuses advance widths that are not a width', () => {
    expectFontError(withGlyphs({ character: 'I', outline: LETTER_I, advanceWidth: -5 }), 'bad-advance-width', /"I".*-5/);
    expectFontError(withGlyphs({ character: 'I', outline: LETTER_I, advanceWidth: Number.NaN }), 'bad-advance-width', /"I".*NaN/);
    expectFontError(withGlyphs({ character: 'I', outline: LETTER_I, advanceWidth: 40000 }), 'bad-advance-width', /"I".*40000/);
  });

  it('refuses malformed or non-numeric outlines, naming the glyph', () => {
    const threeHandles: GlyphOutline = { contours: [{ points: [onCurve(0, 0), offCurve(10, 10), offCurve(20, 10), offCurve(30, 0), onCurve(40, 0)] }] };
    expectFontError(withGlyphs({ character: 'c', outline: threeHandles, advanceWidth: 300 }), 'bad-outline', /"c".*3 off-curve/, 'c');
    expectFontError(withGlyphs({ character: 'd', outline: bar(0, 0, Number.POSITIVE_INFINITY, 10), advanceWidth: 300 }), 'bad-outline', /"d".*Infinity/, 'd');
  });

  it('refuses metrics and names that make no sense, saying what is allowed', () => {
    expectFontError({ ...TEST_FONT, unitsPerEm: 10 }, 'bad-metrics', /units per em is 10.*16–16384/);
    expectFontError({ ...TEST_FONT, ascender: 0 }, 'bad-metrics', /ascender is 0/);
    expectFontError({ ...TEST_FONT, descender: 120 }, 'bad-metrics', /descender is 120/);
    expectFontError({ ...TEST_FONT, lineGap: -1 }, 'bad-metrics', /line gap/);
    expectFontError({ ...TEST_FONT, weightClass: 1001 }, 'bad-metrics', /weight class is 1001/);
    expectFontError({ ...TEST_FONT, weightClass: 450.5 }, 'bad-metrics', /weight class/);
    expectFontError({ ...TEST_FONT, xHeight: Number.NaN }, 'bad-metrics', /x-height is NaN/);
    expectFontError({ ...TEST_FONT, familyName: '  ' }, 'bad-name', /family name is empty/);
    expectFontError({ ...TEST_FONT, styleName: 'Reg\nular' }, 'bad-name', /control character/);
    expectFontError({ ...TEST_FONT, vendorId: 'TOOLONG' }, 'bad-name', /vendor ID/);
    expectFontError({ ...TEST_FONT, vendorId: 'ÉCR' }, 'bad-name', /vendor ID/);
    expectFontError({ ...TEST_FONT, version: -1 }, 'bad-metrics', /version/);
    expectFontError({ ...TEST_FONT, timestamp: new Date(Number.NaN) }, 'bad-metrics', /timestamp/);
  });
});
