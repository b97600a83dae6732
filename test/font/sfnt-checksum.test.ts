// Checksums: a font whose tables were edited after opentype.js assembled it still
// carries correct table checksums and head.checkSumAdjustment, which some systems
// check before installing a font. Reference: fontTools' calcChecksum (Debian
// python3-fonttools) and the OpenType spec's whole-file rule.
import { describe, expect, it } from 'vitest';
import { CHECKSUM_MAGIC, checkSumAdjustment, tableChecksum } from '../../electron/io/font/font-checksum.ts';
import { assembleSfnt, readSfntTables, SFNT_VERSION_CFF } from '../../electron/io/font/sfnt-tables.ts';
import { FONTTOOLS_PYTHON } from '../support/require-tool.ts';
import { runPythonJson } from './fonttools.ts';
import { describeWith } from './require.ts';

/** Deterministic bytes of every length 0–40, so every padding case is covered. */
function samples(): Uint8Array[] {
  return Array.from({ length: 41 }, (_, n) => Uint8Array.from({ length: n }, (_, i) => (i * 197 + n * 31 + 255) & 0xff));
}

const CALC = `
import json, sys
from fontTools.ttLib.sfnt import calcChecksum
print(json.dumps([calcChecksum(bytes(b)) for b in json.loads(sys.argv[1])]))
`;

describeWith('table checksums against fontTools', [FONTTOOLS_PYTHON], () => {
  it('computes the same checksum as fontTools for tables of every padding length', () => {
    const data = samples();
    const reference = runPythonJson<number[]>(CALC, [JSON.stringify(data.map((d) => [...d]))]);
    // Reference: fontTools.ttLib.sfnt.calcChecksum.
    expect(data.map(tableChecksum)).toEqual(reference);
  });
});

describe('assembling a font file', () => {
  const head = new Uint8Array(54).fill(7);
  const tables = [
    { tag: 'head', data: head },
    { tag: 'name', data: Uint8Array.from([1, 2, 3]) },
    { tag: 'CFF ', data: Uint8Array.from({ length: 13 }, (_, i) => i) },
  ];

  it('makes the whole file sum to 0xB1B0AFBA and keeps every table’s bytes (OpenType spec, "Calculating checksums")', () => {
    const bytes = assembleSfnt(SFNT_VERSION_CFF, tables);
    expect(tableChecksum(bytes)).toBe(CHECKSUM_MAGIC);
    const back = readSfntTables(bytes);
    expect(back.sfntVersion).toBe(SFNT_VERSION_CFF);
    expect(back.tables.map((t) => t.tag)).toEqual(['head', 'name', 'CFF ']);
    expect([...back.tables[1]!.data]).toEqual([1, 2, 3]);
    expect([...back.tables[2]!.data]).toEqual([...tables[2]!.data]);
    expect(head[8]).toBe(7); // the input table is not modified
  });

  it('sorts the directory by tag and aligns every table to 4 bytes (OpenType spec, table directory)', () => {
    const bytes = assembleSfnt(SFNT_VERSION_CFF, tables);
    const view = new DataView(bytes.buffer);
    const tags = [0, 1, 2].map((i) => String.fromCharCode(...bytes.subarray(12 + 16 * i, 16 + 16 * i)));
    expect(tags).toEqual(['CFF ', 'head', 'name']);
    for (let i = 0; i < 3; i++) expect(view.getUint32(12 + 16 * i + 8) % 4).toBe(0);
    expect([view.getUint16(6), view.getUint16(8), view.getUint16(10)]).toEqual([32, 1, 16]); // searchRange, entrySelector, rangeShift for 3 tables
  });

  it('computes checkSumAdjustment as 0xB1B0AFBA minus the font’s sum, modulo 2³²', () => {
    expect(checkSumAdjustment(0)).toBe(CHECKSUM_MAGIC);
    expect(checkSumAdjustment(CHECKSUM_MAGIC + 5)).toBe(2 ** 32 - 5);
  });
});
