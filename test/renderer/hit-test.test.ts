// Picking points and dragging them on the canvas. If these broke, a click would miss
// the point under the pointer at some zooms, or a drag would push points off the grid.
import { describe, expect, it } from 'vitest';
import { createDocument } from '../../core/document/index.ts';
import { offCurve, onCurve } from '../../core/outline/index.ts';
import { dragOffset, isDrag, marqueeRect, PICK_RADIUS_PIXELS, pointUnderPointer } from '../../renderer/src/editor/hit-test.ts';
import { toScreen, type ViewTransform } from '../../renderer/src/editor/view-transform.ts';

const document = createDocument([
  {
    name: 'a',
    unicodes: [97],
    advanceWidth: 500,
    outline: { contours: [{ points: [onCurve(0, 0), offCurve(100, 0), offCurve(200, 100), onCurve(200, 200, true), onCurve(0, 200)] }] },
  },
]);

describe('hit testing', () => {
  it('picks the point under the pointer within the same screen radius at any zoom', () => {
    for (const scale of [0.1, 1, 10]) {
      const view: ViewTransform = { scale, originX: 50, originY: 400 };
      const on = toScreen(view, { x: 200, y: 200 });
      expect(pointUnderPointer(document, 'a', view, { x: on.x + PICK_RADIUS_PIXELS - 1, y: on.y })).toEqual({ glyph: 'a', contour: 0, point: 3 });
      // Beyond the pick radius, and further than the radius from any other point, nothing is picked.
      expect(pointUnderPointer(document, 'a', view, { x: on.x + PICK_RADIUS_PIXELS + 1, y: on.y - PICK_RADIUS_PIXELS - 1 })).toBeNull();
    }
  });

  it('turns a marquee drawn in any direction into the font-unit rectangle it covers', () => {
    const view: ViewTransform = { scale: 2, originX: 0, originY: 1000 };
    expect(marqueeRect(view, { x: 400, y: 600 }, { x: 0, y: 1000 })).toEqual({ x0: 0, y0: 0, x1: 200, y1: 200 });
  });

  it('treats a press that barely moves as a click', () => {
    expect(isDrag({ x: 10, y: 10 }, { x: 11, y: 11 })).toBe(false);
    expect(isDrag({ x: 10, y: 10 }, { x: 14, y: 10 })).toBe(true);
  });

  it('drags by whole font units, with y up, whatever the zoom', () => {
    const view: ViewTransform = { scale: 0.37, originX: 12, originY: 700 };
    const offset = dragOffset(view, { x: 100, y: 100 }, { x: 140, y: 70 });
    expect(Number.isInteger(offset.x) && Number.isInteger(offset.y)).toBe(true);
    expect(offset.x).toBe(Math.round(40 / 0.37));
    expect(offset.y).toBe(Math.round(30 / 0.37));
  });
});
