// OS/2 Unicode range bits: systems that pick a font by script see the blocks the
// font really covers, and an emoji does not make a font claim General Punctuation.
// Reference: fontTools' OS2_UNICODE_RANGES and intersectUnicodeRanges (Debian
// python3-fonttools), the OpenType 1.7 block table.
import { expect, it } from 'vitest';
import { UNICODE_RANGE_BLOCKS, unicodeRangeBits } from '../../electron/io/font/unicode-ranges.ts';
import { FONTTOOLS_PYTHON } from '../support/require-tool.ts';
import { runPythonJson } from './fonttools.ts';
import { describeWith } from './require.ts';

const DUMP_RANGES = `
import json, sys
from fontTools.ttLib.tables.O_S_2f_2 import OS2_UNICODE_RANGES, intersectUnicodeRanges
codes = json.loads(sys.argv[1])
print(json.dumps({
  "table": [[[start, stop] for _, (start, stop) in blocks] for blocks in OS2_UNICODE_RANGES],
  "bits": {str(c): sorted(intersectUnicodeRanges([c])) for c in codes},
}))
`;

/** Every block edge, one in from each edge, and a spread of code points across all planes. */
function probeCodePoints(): number[] {
  const probes = new Set<number>();
  for (const blocks of UNICODE_RANGE_BLOCKS) for (const [first, last] of blocks) for (const c of [first - 1, first, first + 1, last - 1, last, last + 1]) if (c >= 0) probes.add(c);
  for (let c = 0; c <= 0x10ffff; c += 0x3b7) probes.add(c);
  return [...probes];
}

describeWith('OS/2 Unicode range bits against fontTools', [FONTTOOLS_PYTHON], () => {
  const probes = probeCodePoints();
  const reference = runPythonJson<{ table: number[][][]; bits: Record<string, number[]> }>(DUMP_RANGES, [JSON.stringify(probes)]);

  it('has the same blocks for every bit as the OpenType 1.7 table', () => {
    // Reference: fontTools OS2_UNICODE_RANGES (OpenType 1.7).
    expect(UNICODE_RANGE_BLOCKS.map((blocks) => blocks.map(([a, b]) => [a, b]))).toEqual(reference.table);
  });

  it('sets the same bits as fontTools for characters across every plane, including 57 beyond the BMP', () => {
    const differences = probes.filter((c) => JSON.stringify([...unicodeRangeBits([c])].sort((a, b) => a - b)) !== JSON.stringify(reference.bits[String(c)]));
    // Reference: fontTools intersectUnicodeRanges.
    expect(differences.map((c) => `U+${c.toString(16)}`)).toEqual([]);
  });
});
