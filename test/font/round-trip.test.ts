// A reference face read into Stemline and written back out keeps its letters: CFF
// fonts come back whole, every glyph point for point (on whole units: Cantarell is drawn on whole
// units, Linux Libertine's fractions are rounded, and nothing else moves), TrueType
// outlines come back as their exact cubic equivalents rounded to whole units. The
// written fonts pass the browsers' sanitizer and open in fontTools without warnings.
// References: Debian's Cantarell, Linux Libertine and DejaVu Sans; ots-sanitize;
// fontTools 4.38.
import { expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { readFont, type ReadFont } from '../../electron/io/font/read-font.ts';
import { writeOtf } from '../../electron/io/font/write-font.ts';
import type { FontSource } from '../../electron/io/font/font-model.ts';
import { FONTTOOLS_PYTHON, OTS_SANITIZE, REFERENCE_FONTS, type Requirement } from '../support/require-tool.ts';
import { inspectFont } from './inspect.ts';
import { otsSanitize } from './ots.ts';
import { outlineDistance } from './outline-distance.ts';
import { normalizePen, penCommandsOf, roundToUnit } from './pen-commands.ts';
import { REFERENCE_CHARACTERS } from './reference-characters.ts';
import { describeWith } from './require.ts';

/**
 * Largest distance rounding to whole units can move a Bézier curve: each control
 * point moves at most 0.5 unit per axis, i.e. √0.5 ≈ 0.707 unit, and every curve
 * point is a convex combination of its control points, so it moves no further.
 */
const WHOLE_UNIT_ROUNDING_BOUND = Math.SQRT1_2;
/** Floating-point slack in the sampled distance when a point moves by exactly (0.5, 0.5). */
const SAMPLING_ROUNDING = 1e-9;

/** The font with only .notdef and the glyphs for `characters`. */
function subset(font: ReadFont, characters: readonly string[]): FontSource {
  return { ...font, glyphs: font.glyphs.filter((g) => g.index === 0 || characters.some((c) => g.characters.includes(c))) };
}

interface RoundTripCase {
  label: string;
  font: Requirement;
  /** 'exact': every point is the same; 'rounded': every point is the original rounded to a whole unit. */
  expectation: 'exact' | 'rounded';
}

const cffCases: RoundTripCase[] = [
  { label: 'Cantarell Regular (CFF, whole units)', font: REFERENCE_FONTS.cantarellRegular, expectation: 'exact' },
  { label: 'Linux Libertine Regular (CFF with fractional coordinates)', font: REFERENCE_FONTS.libertineRegular, expectation: 'rounded' },
];

for (const testCase of cffCases) {
  describeWith(`read and write back ${testCase.label}`, [testCase.font, OTS_SANITIZE, FONTTOOLS_PYTHON], () => {
    let memo: { original: ReadFont; bytes: Uint8Array; reread: ReadFont } | undefined;
    const trip = () => {
      if (memo === undefined) {
        const original = readFont(readFileSync(testCase.font.path), testCase.font.path);
        const bytes = writeOtf(original);
        memo = { original, bytes, reread: readFont(bytes, 'round-trip.otf') };
      }
      return memo;
    };

    it('gives back every glyph of the font point for point, with the same smooth joins and advance widths (Hausdorff distance 0 on whole units)', () => {
      const { original, reread } = trip();
      const problems: string[] = [];
      let compared = 0;
      for (const glyph of original.glyphs) {
        const back = reread.glyphs.find((g) => g.name === glyph.name);
        if (back === undefined) {
          problems.push(`${glyph.name} missing`);
          continue;
        }
        compared++;
        // Rounding can make points meet; the zero-length pieces that leaves draw nothing and are not written.
        const expected = testCase.expectation === 'exact' ? penCommandsOf(glyph.outline) : normalizePen(penCommandsOf(glyph.outline, roundToUnit));
        if (JSON.stringify(penCommandsOf(back.outline)) !== JSON.stringify(expected)) problems.push(`${glyph.name}: outline differs`);
        if (back.advanceWidth !== Math.round(glyph.advanceWidth)) problems.push(`${glyph.name}: advance ${back.advanceWidth} for ${glyph.advanceWidth}`);
        if (testCase.expectation === 'exact') {
          const flags = (g: typeof glyph) => g.outline.contours.flatMap((c) => c.points.map((p) => p.smooth));
          if (JSON.stringify(flags(back)) !== JSON.stringify(flags(glyph))) problems.push(`${glyph.name}: smooth joins differ`);
        }
      }
      expect(problems).toEqual([]);
      expect(compared).toBe(original.glyphs.length);
      expect(REFERENCE_CHARACTERS.every((c) => reread.glyphs.some((g) => g.characters.includes(c)))).toBe(true);
    });

    if (testCase.expectation === 'rounded') {
      it(`moves no fractional outline by more than whole-unit rounding allows (${WHOLE_UNIT_ROUNDING_BOUND.toFixed(3)} unit)`, () => {
        const { original, reread } = trip();
        let worst = 0;
        for (const glyph of subset(original, REFERENCE_CHARACTERS).glyphs) {
          worst = Math.max(worst, outlineDistance(glyph.outline, reread.glyphs.find((g) => g.name === glyph.name)!.outline));
        }
        expect(worst).toBeGreaterThan(0); // Libertine does have fractions
        // Measured when written: 0.640 unit (Aring).
        expect(worst).toBeLessThanOrEqual(WHOLE_UNIT_ROUNDING_BOUND + SAMPLING_ROUNDING);
      });
    }

    it('writes a font the browsers’ sanitizer accepts and fontTools opens without a warning', () => {
      const { bytes } = trip();
      // Reference: ots-sanitize; fontTools TTFont with logging at WARNING.
      expect(otsSanitize(bytes).passed).toBe(true);
      const view = inspectFont(bytes);
      expect(view.warnings).toEqual([]);
      expect(view.checksumError).toBeNull();
    });
  });
}

describeWith('read and write back DejaVu Sans (TrueType → CFF)', [REFERENCE_FONTS.dejavuSans, OTS_SANITIZE, FONTTOOLS_PYTHON], () => {
  let memo: { original: ReadFont; bytes: Uint8Array; reread: ReadFont } | undefined;
  const trip = () => {
    if (memo === undefined) {
      const original = readFont(readFileSync(REFERENCE_FONTS.dejavuSans.path), REFERENCE_FONTS.dejavuSans.path);
      const bytes = writeOtf(subset(original, REFERENCE_CHARACTERS));
      memo = { original, bytes, reread: readFont(bytes, 'dejavu-round-trip.otf') };
    }
    return memo;
  };

  it(`keeps every letter within whole-unit rounding of its quadratic outline (≤ ${WHOLE_UNIT_ROUNDING_BOUND.toFixed(3)} unit of a 2048-unit em, sampled)`, () => {
    const { original, reread } = trip();
    let worst = 0;
    let compared = 0;
    for (const glyph of subset(original, REFERENCE_CHARACTERS).glyphs) {
      const back = reread.glyphs.find((g) => g.name === glyph.name)!;
      // The original outline is the exact cubic form of DejaVu's quadratics (checked against fontTools in read-font.test.ts).
      worst = Math.max(worst, outlineDistance(glyph.outline, back.outline));
      expect(back.advanceWidth).toBe(glyph.advanceWidth);
      compared++;
    }
    expect(compared).toBeGreaterThanOrEqual(62 + 1);
    // Measured when written: 0.7071 unit (Aring: a point at half units in x and y), 0.00035 em.
    expect(worst).toBeLessThanOrEqual(WHOLE_UNIT_ROUNDING_BOUND + SAMPLING_ROUNDING);
  });

  it('writes a font the browsers’ sanitizer accepts and fontTools opens without a warning', () => {
    const { bytes } = trip();
    expect(otsSanitize(bytes).passed).toBe(true);
    const view = inspectFont(bytes);
    expect(view.warnings).toEqual([]);
    expect(view.head.unitsPerEm).toBe(2048);
  });
});
