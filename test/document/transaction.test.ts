// Transactions: applying one changes only what it names (everything else is shared
// with the old state), its inverse takes the document back exactly, and a transaction
// built from another state is refused rather than corrupting the outline.
import { describe, expect, it } from 'vitest';
import { apply, createDocument, DocumentError, invertTransaction, movePoints, transaction } from '../../core/document/index.ts';
import { circleContour, squareContour } from './support.ts';

function twoGlyphs() {
  return createDocument([
    { name: 'o', unicodes: [0x6f], outline: { contours: [circleContour(300, 300, 200, 4), squareContour(0, 0, 50, 50)] }, advanceWidth: 600 },
    { name: 'l', unicodes: [0x6c], outline: { contours: [squareContour(50, 0, 150, 700)] }, advanceWidth: 200 },
  ]);
}

describe('transactions', () => {
  it('an edit to one contour shares every other contour and glyph with the old state', () => {
    const doc = twoGlyphs();
    const before = doc.glyphs.o!.outline.contours[0]!;
    const after = movePoints(before, new Set([0]), { x: 5, y: 0 });
    const next = apply(doc, transaction('point.drag', [{ kind: 'contour.replace', glyph: 'o', contour: 0, before, after }]));
    expect(next.glyphs.o!.outline.contours[0]).toBe(after);
    expect(next.glyphs.o!.outline.contours[1]).toBe(doc.glyphs.o!.outline.contours[1]);
    expect(next.glyphs.l).toBe(doc.glyphs.l);
    expect(next.metrics).toBe(doc.metrics);
    expect(doc.glyphs.o!.outline.contours[0]).toBe(before); // the old state is untouched
  });

  it('the inverse of a transaction restores the document exactly', () => {
    const doc = twoGlyphs();
    const square = doc.glyphs.o!.outline.contours[1]!;
    const tr = transaction('point.delete', [
      { kind: 'contour.remove', glyph: 'o', contour: 1, value: square },
      { kind: 'advance.set', glyph: 'o', before: 600, after: 650 },
      { kind: 'contour.insert', glyph: 'l', contour: 0, value: square },
      { kind: 'selection.set', before: [], after: [{ glyph: 'l', contour: 0, point: 0 }] },
    ]);
    const next = apply(doc, tr);
    expect(next.glyphs.o!.outline.contours).toHaveLength(1);
    expect(next.glyphs.l!.outline.contours).toHaveLength(2);
    expect(apply(next, invertTransaction(tr))).toEqual(doc);
  });

  it('a transaction built from another state is refused with a stale-change error', () => {
    const doc = twoGlyphs();
    const tr = transaction('metrics.advance', [{ kind: 'advance.set', glyph: 'o', before: 999, after: 500 }]);
    expect(() => apply(doc, tr)).toThrow(DocumentError);
    expect(() => apply(doc, tr)).toThrow(/different state/);
  });
});
