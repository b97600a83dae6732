// Fitting again after correcting the sheet: a letter the corrections did not touch
// keeps the outline the user edited (a moved point stays moved) and takes a retyped
// character; a letter whose ink changed (merged, split, cut) or whose baseline moved
// is fitted afresh.
import { describe, expect, it } from 'vitest';
import { createDocument, DEFAULT_FONT_METRICS } from '../../core/document/index.ts';
import { onCurve } from '../../core/outline/index.ts';
import { keptOutlines } from '../../renderer/src/project/kept-outlines.ts';
import type { EditableLetter } from '../../renderer/src/editor/letter-document.ts';

const square = (x: number) => ({ contours: [{ points: [onCurve(x, 0), onCurve(250, 0), onCurve(250, 700), onCurve(x, 700)] }] });

function letters(specs: readonly { index: number; character: string; contours: number[]; baselineY?: number; x: number; advance: number }[]) {
  const list: EditableLetter[] = specs.map((s) => ({
    id: `letter-${s.index + 1}`,
    character: s.character,
    shiftX: 50,
    letter: { index: s.index, character: s.character, contours: s.contours, box: { x: 0, y: 0, width: 10, height: 10 }, frame: { originX: 10, baselineY: s.baselineY ?? 80, unitsPerPixel: 10 }, outline: square(s.x), warnings: [], maxDeviation: 0, problem: null },
  }));
  const document = createDocument(
    specs.map((s) => ({ id: `letter-${s.index + 1}`, name: `letter-${s.index + 1}`, unicodes: [s.character.codePointAt(0)!], outline: square(s.x), advanceWidth: s.advance })),
    DEFAULT_FONT_METRICS,
  );
  return { document, letters: list };
}

describe('fitting again after correcting the sheet', () => {
  const previous = letters([
    { index: 0, character: 'a', contours: [0], x: 51, advance: 333 }, // edited by the user
    { index: 1, character: 'b', contours: [1], x: 52, advance: 344 },
    { index: 2, character: 'c', contours: [2], x: 53, advance: 355 },
  ]);

  it('keeps the edited outline of untouched letters under their new number and character, and refits changed ones', () => {
    // "a" retyped "o" and renumbered after a merge of two letters before it; "b" and "c" merged; a new baseline under "d".
    const fresh = letters([
      { index: 0, character: 'm', contours: [1, 2], x: 50, advance: 600 },
      { index: 1, character: 'o', contours: [0], x: 50, advance: 300 },
      { index: 2, character: 'd', contours: [3], baselineY: 82, x: 50, advance: 300 },
    ]);
    const result = keptOutlines(previous, DEFAULT_FONT_METRICS, fresh);
    expect(result.kept).toBe(1);
    const o = result.document.glyphs['letter-2']!;
    expect(o.outline).toEqual(square(51));
    expect(o.advanceWidth).toBe(333);
    expect(o.unicodes).toEqual(['o'.codePointAt(0)]);
    expect(result.document.glyphs['letter-1']!.outline).toEqual(square(50));
    expect(result.document.glyphs['letter-1']!.advanceWidth).toBe(600);
  });

  it('keeps the metrics the user changed only while the fit gives the same ones as before', () => {
    const edited = { ...previous, document: { ...previous.document, metrics: { ...DEFAULT_FONT_METRICS, xHeight: 512 } } };
    const fresh = letters([{ index: 0, character: 'a', contours: [0], x: 50, advance: 300 }]);
    expect(keptOutlines(edited, DEFAULT_FONT_METRICS, fresh).document.metrics.xHeight).toBe(512);
    const refitted = { ...fresh, document: { ...fresh.document, metrics: { ...DEFAULT_FONT_METRICS, xHeight: 470 } } };
    expect(keptOutlines(edited, DEFAULT_FONT_METRICS, refitted).document.metrics.xHeight).toBe(470);
  });
});
