// The scan under the outline. If this broke, the outline would sit beside the ink it
// was traced from and nobody could judge the fit by eye.
import { describe, expect, it } from 'vitest';
import { toFontUnits } from '../../core/pipeline/index.ts';
import { scanPlacement } from '../../renderer/src/editor/scan-placement.ts';
import { toScreen, type ViewTransform } from '../../renderer/src/editor/view-transform.ts';

describe('scan placement', () => {
  it('puts every scan pixel where its font-unit point is drawn', () => {
    const frame = { originX: 212.5, baselineY: 160, unitsPerPixel: 5.8 };
    const shiftX = 48;
    const view: ViewTransform = { scale: 0.63, originX: 140, originY: 520 };
    const rect = scanPlacement(view, frame, shiftX, 420, 200);
    for (const pixel of [{ x: 0, y: 0 }, { x: 420, y: 200 }, { x: 230, y: 75 }]) {
      const units = toFontUnits(frame, pixel);
      const expected = toScreen(view, { x: units.x + shiftX, y: units.y });
      expect(rect.x + (pixel.x / 420) * rect.width).toBeCloseTo(expected.x, 9);
      expect(rect.y + (pixel.y / 200) * rect.height).toBeCloseTo(expected.y, 9);
    }
  });
});
