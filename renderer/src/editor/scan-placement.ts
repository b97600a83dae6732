/**
 * Where the scan goes under a letter's outline: the scan's pixel frame (y down) mapped
 * through the letter's font-unit frame (core/pipeline toFontUnits, then the spacing
 * shift) and the view, as the screen rectangle the whole image fills. Both maps are
 * scales and offsets with y flipped twice, so the image needs no flip.
 */
import type { LetterFrame } from '../../../core/pipeline/index.ts';
import type { ViewTransform } from './view-transform.ts';

export interface ScreenRect {
  readonly x: number;
  readonly y: number;
  readonly width: number;
  readonly height: number;
}

/**
 * The screen rectangle of a `width` × `height` pixel scan for a letter with `frame`,
 * whose outline was moved `shiftX` units right when spaced.
 */
export function scanPlacement(view: ViewTransform, frame: LetterFrame, shiftX: number, width: number, height: number): ScreenRect {
  const pixel = view.scale * frame.unitsPerPixel;
  return {
    x: view.originX + view.scale * (shiftX - frame.originX * frame.unitsPerPixel),
    y: view.originY - pixel * frame.baselineY,
    width: width * pixel,
    height: height * pixel,
  };
}
