// Fitting again after correcting the sheet or changing a setting: a letter the user
// edited whose ink the change did not touch keeps the outline the user gave it (a
// moved point stays moved) and takes a retyped character; a letter the user never
// edited takes its fresh fit (new fit settings show on it); a letter whose ink changed
// (merged, split, cut, traced with another threshold) or whose baseline moved is
// fitted afresh.
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
    letter: { index: s.index, character: s.character, contours: s.contours, ink: `ink-${s.contours.join('+')}`, box: { x: 0, y: 0, width: 10, height: 10 }, frame: { originX: 10, baselineY: s.baselineY ?? 80, unitsPerPixel: 10 }, outline: square(s.x), warnings: [], maxDeviation: 0, problem: null },
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
  /** The letters as they were fitted: only "a" was edited since (moved from x 50 and its advance changed). */
  const asFitted = letters([
    { index: 0, character: 'a', contours: [0], x: 50, advance: 300 },
    { index: 1, character: 'b', contours: [1], x: 52, advance: 344 },
    { index: 2, character: 'c', contours: [2], x: 53, advance: 355 },
  ]).document;

  it('keeps the edited outline of untouched letters under their new number and character, and refits changed ones', () => {
    // "a" retyped "o" and renumbered after a merge of two letters before it; "b" and "c" merged; a new baseline under "d".
    const fresh = letters([
      { index: 0, character: 'm', contours: [1, 2], x: 50, advance: 600 },
      { index: 1, character: 'o', contours: [0], x: 50, advance: 300 },
      { index: 2, character: 'd', contours: [3], baselineY: 82, x: 50, advance: 300 },
    ]);
    const result = keptOutlines(previous, asFitted, fresh);
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
    expect(keptOutlines(edited, asFitted, fresh).document.metrics.xHeight).toBe(512);
    const refitted = { ...fresh, document: { ...fresh.document, metrics: { ...DEFAULT_FONT_METRICS, xHeight: 470 } } };
    expect(keptOutlines(edited, asFitted, refitted).document.metrics.xHeight).toBe(470);
  });

  it('gives the letters the user never edited their fresh fit, so new fit settings show on them', () => {
    // The same ink fitted with a looser tolerance: "b" and "c" come out differently; "a" keeps the user's outline.
    const fresh = letters([
      { index: 0, character: 'a', contours: [0], x: 60, advance: 310 },
      { index: 1, character: 'b', contours: [1], x: 61, advance: 311 },
      { index: 2, character: 'c', contours: [2], x: 62, advance: 312 },
    ]);
    const result = keptOutlines(previous, asFitted, fresh);
    expect(result.kept).toBe(1);
    expect(result.document.glyphs['letter-1']!.outline).toEqual(square(51));
    expect(result.document.glyphs['letter-2']!.outline).toEqual(square(61));
    expect(result.document.glyphs['letter-3']!.advanceWidth).toBe(312);
  });

  it('refits an edited letter whose ink was traced differently, though its contours keep their numbers', () => {
    const retraced = letters([{ index: 0, character: 'a', contours: [0], x: 50, advance: 300 }]);
    const otherInk = { ...retraced, letters: retraced.letters.map((l) => ({ ...l, letter: { ...l.letter, ink: 'ink-thicker' } })) };
    expect(keptOutlines(previous, asFitted, otherInk).kept).toBe(0);
  });
});
