// Glyph names: the font's glyphs carry the names text tools expect (the AGLFN names,
// uniXXXX / uXXXXX otherwise), so that text copied out of a PDF set in a Stemline
// test font comes out as the right characters. Reference: fontTools' `fontTools.agl`
// module (Debian python3-fonttools), which ships the AGLFN.
import { describe, expect, it } from 'vitest';
import {
  AGLFN_COVERED_RANGES,
  AGLFN_LISTED_CODE_POINTS,
  AGLFN_NAMES,
  glyphNameForCodePoint,
  isValidGlyphName,
} from '../../electron/io/font/glyph-names.ts';
import { FONTTOOLS_PYTHON } from '../support/require-tool.ts';
import { runPythonJson } from './fonttools.ts';
import { describeWith } from './require.ts';

function coveredCodePoints(): number[] {
  const codePoints: number[] = [...AGLFN_LISTED_CODE_POINTS];
  for (const [first, last] of AGLFN_COVERED_RANGES) for (let c = first; c <= last; c++) codePoints.push(c);
  return codePoints;
}

/** fontTools' AGLFN tables, restricted to what we ask about. */
const DUMP_AGLFN = `
import json, sys
from fontTools import agl
codes = json.loads(sys.argv[1])
names = json.loads(sys.argv[2])
print(json.dumps({
  "uv2agl": {str(c): agl.UV2AGL.get(c) for c in codes},
  "agl2uv": {n: agl.AGL2UV.get(n) for n in names},
}))
`;

describeWith('glyph names against fontTools.agl (the AGLFN)', [FONTTOOLS_PYTHON], () => {
  const codePoints = coveredCodePoints();
  const ourNames = [...AGLFN_NAMES.values()];
  const reference = runPythonJson<{ uv2agl: Record<string, string | null>; agl2uv: Record<string, number | null> }>(DUMP_AGLFN, [
    JSON.stringify(codePoints),
    JSON.stringify(ourNames),
  ]);

  it('names every covered character as the AGLFN does, and uniXXXX where the AGLFN has no name', () => {
    const differences: string[] = [];
    for (const codePoint of codePoints) {
      const hex = codePoint.toString(16).toUpperCase().padStart(4, '0');
      // Reference: fontTools.agl.UV2AGL (AGLFN); absent → uniXXXX (Adobe Glyph List Specification).
      const expected = reference.uv2agl[String(codePoint)] ?? `uni${hex}`;
      const ours = glyphNameForCodePoint(codePoint);
      if (ours !== expected) differences.push(`U+${hex}: ours ${ours}, AGLFN ${expected}`);
    }
    expect(differences).toEqual([]);
  });

  it('maps every name in our table back to its own character, as the AGLFN does', () => {
    const differences: string[] = [];
    for (const [codePoint, name] of AGLFN_NAMES) {
      // Reference: fontTools.agl.AGL2UV (AGLFN).
      if (reference.agl2uv[name] !== codePoint) differences.push(`${name}: ours U+${codePoint.toString(16)}, AGLFN ${reference.agl2uv[name]}`);
    }
    expect(differences).toEqual([]);
  });
});

describe('glyph names without a list entry', () => {
  it('names an unlisted BMP character uniXXXX with four uppercase hex digits', () => {
    expect(glyphNameForCodePoint(0x0416)).toBe('uni0416');
    expect(glyphNameForCodePoint(0x00a0)).toBe('uni00A0');
    expect(glyphNameForCodePoint(0x4e00)).toBe('uni4E00');
  });

  it('names a character beyond the BMP uXXXXX', () => {
    expect(glyphNameForCodePoint(0x1f600)).toBe('u1F600');
    expect(glyphNameForCodePoint(0x10ffff)).toBe('u10FFFF');
  });

  it('accepts the names the font can hold and refuses the rest', () => {
    for (const name of ['.notdef', '.null', 'space', 'A', 'a.alt', 'f_f_i', 'uni00A0', '_part']) expect(isValidGlyphName(name)).toBe(true);
    for (const name of ['', '1abc', '.hidden', 'a b', 'é', 'a-b', 'x'.repeat(64)]) expect(isValidGlyphName(name)).toBe(false);
  });
});
