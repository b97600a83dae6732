// The editor's view maths: font units ↔ screen pixels, zoom and pan. If these broke,
// points would be drawn away from where they are, or zooming would slide the letter
// out from under the pointer.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { centreOn, fitBox, MAX_SCALE, MIN_SCALE, panBy, toFontUnits, toScreen, wheelZoomFactor, zoomAbout, type ViewTransform } from '../../renderer/src/editor/view-transform.ts';

const coordinate = fc.double({ min: -5000, max: 5000, noNaN: true });
const viewArb = fc.record({ scale: fc.double({ min: MIN_SCALE, max: MAX_SCALE, noNaN: true }), originX: coordinate, originY: coordinate });
const pointArb = fc.record({ x: coordinate, y: coordinate });

describe('view transform', () => {
  it('maps a font point to the screen and back to the same point', () => {
    fc.assert(fc.property(viewArb, pointArb, (view, p) => {
      const back = toFontUnits(view, toScreen(view, p));
      expect(back.x).toBeCloseTo(p.x, 6);
      expect(back.y).toBeCloseTo(p.y, 6);
    }));
  });

  it('draws y up in font units as y down on the screen', () => {
    const view: ViewTransform = { scale: 2, originX: 100, originY: 300 };
    expect(toScreen(view, { x: 0, y: 0 })).toEqual({ x: 100, y: 300 });
    expect(toScreen(view, { x: 10, y: 50 })).toEqual({ x: 120, y: 200 });
  });

  it('keeps the font point under the pointer fixed while zooming about it', () => {
    fc.assert(fc.property(viewArb, pointArb, fc.double({ min: 0.1, max: 10, noNaN: true }), (view, pointer, factor) => {
      const under = toFontUnits(view, pointer);
      const zoomed = zoomAbout(view, pointer, factor);
      const after = toScreen(zoomed, under);
      expect(after.x).toBeCloseTo(pointer.x, 4);
      expect(after.y).toBeCloseTo(pointer.y, 4);
      expect(zoomed.scale).toBeGreaterThanOrEqual(MIN_SCALE);
      expect(zoomed.scale).toBeLessThanOrEqual(MAX_SCALE);
    }));
  });

  it('zooms in on wheel up and out on wheel down, by reciprocal factors', () => {
    expect(wheelZoomFactor(-100)).toBeGreaterThan(1);
    expect(wheelZoomFactor(100)).toBeLessThan(1);
    expect(wheelZoomFactor(-100) * wheelZoomFactor(100)).toBeCloseTo(1, 12);
  });

  it('pans by exactly the pointer travel', () => {
    const view: ViewTransform = { scale: 0.7, originX: 10, originY: 20 };
    const p = { x: 123, y: -45 };
    const before = toScreen(view, p);
    const after = toScreen(panBy(view, 15, -8), p);
    expect(after.x - before.x).toBeCloseTo(15, 12);
    expect(after.y - before.y).toBeCloseTo(-8, 12);
  });

  it('fits a letter box inside the area with the margin and centres it', () => {
    const box = { minX: 0, minY: -200, maxX: 600, maxY: 800 };
    const view = fitBox(box, 800, 600, 50);
    const topLeft = toScreen(view, { x: box.minX, y: box.maxY });
    const bottomRight = toScreen(view, { x: box.maxX, y: box.minY });
    // The box is taller than wide for this area: it touches the top and bottom margins.
    expect(topLeft.y).toBeCloseTo(50, 9);
    expect(bottomRight.y).toBeCloseTo(550, 9);
    expect((topLeft.x + bottomRight.x) / 2).toBeCloseTo(400, 9);
    expect(topLeft.x).toBeGreaterThanOrEqual(50);
  });

  it('centres on a warning at the asked zoom', () => {
    const view = centreOn({ x: 300, y: 420 }, 800, 600, 3);
    expect(toScreen(view, { x: 300, y: 420 })).toEqual({ x: 400, y: 300 });
    expect(view.scale).toBe(3);
  });
});
