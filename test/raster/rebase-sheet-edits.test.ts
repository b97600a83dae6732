// Tracing a sheet again with another threshold or speck size keeps the user's
// corrections where the letters did not change, and carries the characters and guides
// over by place where they did.
import { describe, expect, it } from 'vitest';
import { applySheetEdits, rebaseSheetEdits, traceScan, uncorrectedSheet, type GreyRaster, type SheetEdit } from '../../core/raster/index.ts';

/** Three black blocks; the second and third joined by a mid-grey bridge (grey 150), so a threshold above 150 makes them one letter. */
function sheet(): GreyRaster {
  const width = 320;
  const height = 120;
  const data = new Uint8Array(width * height).fill(255);
  const block = (x: number, y: number, w: number, h: number, value = 0) => { for (let r = y; r < y + h; r++) for (let c = x; c < x + w; c++) data[r * width + c] = value; };
  block(20, 20, 60, 80);
  block(120, 20, 60, 80);
  block(180, 50, 40, 10, 150);
  block(220, 20, 60, 80);
  return { width, height, data, dpi: 300 };
}

function traced(level: number) {
  const scan = traceScan({ raster: sheet() }, { method: 'manual', level });
  return uncorrectedSheet(scan.contours, scan.sheet);
}

describe('corrections carried to letters found again', () => {
  const edits: SheetEdit[] = [
    { kind: 'assign', characters: 'HNO' },
    { kind: 'retype', letter: 2, character: 'M' },
    { kind: 'height', guide: 'cap-height', pixels: 78 },
  ];
  const before = traced(100);
  const corrected = applySheetEdits(before, edits);

  it('are kept as they are when the new threshold finds the same letters', () => {
    const again = traced(120);
    const rebased = rebaseSheetEdits(before.sheet, corrected, edits, again.sheet);
    expect(rebased.kept).toBe('all');
    expect(rebased.edits).toEqual(edits);
  });

  it('give each letter in the same place its character, and keep the guides, when letters join', () => {
    const joined = traced(200);
    expect(joined.sheet.letters).toHaveLength(2);
    const rebased = rebaseSheetEdits(before.sheet, corrected, edits, joined.sheet);
    expect(rebased.kept).toBe('characters');
    const after = applySheetEdits(joined, rebased.edits);
    // The joined letter covers the N and the M, each under half of it: neither character is taken for it.
    expect(after.sheet.letters.map((l) => l.character)).toEqual(['H', null]);
    expect(after.guides.capHeightPixels).toBe(78);
    expect(rebased.lostCharacters).toBe(2);
    expect(rebased.droppedCorrections).toBe(0);
  });

  it('say how many merges, splits and cuts could not be carried over', () => {
    const merged: SheetEdit[] = [...edits, { kind: 'merge', letters: [0, 1] }];
    const rebased = rebaseSheetEdits(before.sheet, applySheetEdits(before, merged), merged, traced(200).sheet);
    expect(rebased.droppedCorrections).toBe(1);
    expect(rebased.edits.some((e) => e.kind === 'merge')).toBe(false);
  });
});
