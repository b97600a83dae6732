// Round trip against reference fonts: glyph outlines from real font files are rendered
// by an independent rasterizer (Skia, via @napi-rs/canvas), traced, and every traced
// point is compared with the font's own outline. Fonts are Debian's fonts-cantarell,
// fonts-linuxlibertine and fonts-dejavu-core (see require-font.ts).

import { describe, expect, it } from 'vitest';
import type { PathCommand } from 'opentype.js/dist/opentype.js';
import { traceScan, type Contour, type GreyRaster, type Point } from '../../core/raster/index.ts';
import { degrade, type Degradation } from './degrade.ts';
import {
  acuteCorners,
  contourCount,
  distanceToPolylines,
  flattenOutline,
  loadFont,
  renderGlyph,
  type AcuteCorner,
  type FontPlacement,
} from './reference-render.ts';
import { CANTARELL, DEJAVU_SANS, LIBERTINE, describeWithFont, type ReferenceFont } from './require-font.ts';

const GLYPHS = ['a', 'e', 'g', 'o', 'B', 'R', '8', '&'];
/** The em square is drawn 250 px tall, so capitals are ≈ 170–190 px. */
const EM_PX = 250;
const CANVAS_PX = 300;
/** Sub-pixel offsets of the origin so that outlines do not line up with the pixel grid. */
const ORIGIN_X = 40.3;
const BASELINE_Y = 230.6;
/** Flattening tolerance of the reference outline: far below the bounds checked. */
const FLATTEN_TOLERANCE_PX = 0.01;

/** Clean render: every traced point within this distance of the font outline. */
const CLEAN_TOLERANCE_PX = 0.25;
/**
 * Except inside the tip of a wedge (a spike of ink or a notch of paper) where the wedge
 * is narrower than one pixel: no sampling method resolves that, and the traced contour
 * cuts across the wedge instead, at most half a pixel from either side.
 */
const SUB_PIXEL_WEDGE_TOLERANCE_PX = 0.5;
/** Corners sharper than this are examined for sub-pixel wedges (60°). */
const ACUTE_CORNER_ANGLE = Math.PI / 3;
/** Degraded scan: every traced point within 1 px of the font outline. */
const DEGRADED_TOLERANCE_PX = 1;

/** Mild uneven lighting: a global threshold copes. */
const MILD_SCAN: Omit<Degradation, 'seed'> = {
  blurSigma: 1.2,
  paperLeft: 245,
  paperRight: 185,
  inkReflectance: 0.08,
  noiseSigma: 6,
  specks: [
    { x: 12, y: 12, radius: 2 },
    { x: 285, y: 20, radius: 2.2 },
    { x: 280, y: 285, radius: 1.8 },
  ],
};
/** Strong shading (paper from 250 to 120): needs the locally adaptive threshold. */
const SHADED_SCAN: Omit<Degradation, 'seed'> = { ...MILD_SCAN, paperLeft: 250, paperRight: 120 };
/** Speck limit for the degraded scans, traced as 300 dpi: 0.2 mm² ≈ 27.9 px, above the painted specks. */
const SPECK_AREA_MM2 = 0.2;
const SCAN_DPI = 300;

interface GlyphCase {
  readonly character: string;
  readonly commands: readonly PathCommand[];
  readonly placement: FontPlacement;
  readonly outline: Point[][];
  readonly corners: AcuteCorner[];
  readonly clean: GreyRaster;
}

function prepareGlyphs(font: ReferenceFont): GlyphCase[] {
  const parsed = loadFont(font.path);
  const placement: FontPlacement = { scale: EM_PX / parsed.unitsPerEm, originX: ORIGIN_X, originY: BASELINE_Y };
  return GLYPHS.map((character) => {
    const commands = parsed.charToGlyph(character).path.commands;
    return {
      character,
      commands,
      placement,
      outline: flattenOutline(commands, placement, FLATTEN_TOLERANCE_PX),
      corners: acuteCorners(commands, placement, ACUTE_CORNER_ANGLE),
      clean: renderGlyph(CANVAS_PX, CANVAS_PX, commands, placement),
    };
  });
}

function inSubPixelWedge(point: Point, corners: readonly AcuteCorner[]): boolean {
  return corners.some((corner) => Math.hypot(point.x - corner.apex.x, point.y - corner.apex.y) <= corner.subPixelRadius);
}

function worstDistance(contours: readonly Contour[], outline: Point[][], include: (point: Point) => boolean = () => true): number {
  let worst = 0;
  for (const contour of contours) for (const point of contour.points) if (include(point)) worst = Math.max(worst, distanceToPolylines(point, outline));
  return worst;
}

function roundTripSuite(font: ReferenceFont): void {
  describeWithFont(`glyphs of ${font.label} traced back`, font, () => {
    const glyphs = prepareGlyphs(font);

    it.each(glyphs.map((glyph) => [glyph.character, glyph] as const))('reproduces "%s" within 0.25 px from a clean render, with the font\'s contour count', (_character, glyph) => {
      const result = traceScan({ raster: glyph.clean, dpiX: SCAN_DPI });
      // Reference: the number of closed contours (movetos) in the font's own outline.
      expect(result.contours).toHaveLength(contourCount(glyph.commands));
      const resolvable = (point: Point): boolean => !inSubPixelWedge(point, glyph.corners);
      // Reference: the font outline itself (flattened to 0.01 px).
      expect(worstDistance(result.contours, glyph.outline, resolvable)).toBeLessThanOrEqual(CLEAN_TOLERANCE_PX);
      expect(worstDistance(result.contours, glyph.outline)).toBeLessThanOrEqual(SUB_PIXEL_WEDGE_TOLERANCE_PX);
    });

    it.each(glyphs.map((glyph, index) => [glyph.character, glyph, index] as const))(
      'reproduces "%s" within 1 px from a blurred, noisy, unevenly lit scan with dust, specks removed',
      (_character, glyph, index) => {
        const scan = degrade(glyph.clean, { ...MILD_SCAN, seed: 1000 + index });
        const uncleaned = traceScan({ raster: scan, dpiX: SCAN_DPI }, { speckAreaMm2: 0, pinholeAreaMm2: 0 });
        expect(uncleaned.contours.length).toBeGreaterThanOrEqual(contourCount(glyph.commands) + MILD_SCAN.specks.length); // the specks are there to remove
        const result = traceScan({ raster: scan, dpiX: SCAN_DPI }, { speckAreaMm2: SPECK_AREA_MM2 });
        expect(result.method).toBe('otsu');
        expect(result.contours).toHaveLength(contourCount(glyph.commands));
        expect(worstDistance(result.contours, glyph.outline)).toBeLessThanOrEqual(DEGRADED_TOLERANCE_PX);
      },
    );

    it.each(glyphs.map((glyph, index) => [glyph.character, glyph, index] as const))(
      'reproduces "%s" within 1 px from a strongly shaded scan with the adaptive threshold',
      (_character, glyph, index) => {
        const scan = degrade(glyph.clean, { ...SHADED_SCAN, seed: 2000 + index });
        const result = traceScan({ raster: scan, dpiX: SCAN_DPI }, { method: 'sauvola', speckAreaMm2: SPECK_AREA_MM2 });
        expect(result.contours).toHaveLength(contourCount(glyph.commands));
        expect(worstDistance(result.contours, glyph.outline)).toBeLessThanOrEqual(DEGRADED_TOLERANCE_PX);
      },
    );
  });
}

describe('glyph round trip', () => {
  roundTripSuite(CANTARELL);
  roundTripSuite(LIBERTINE);
  roundTripSuite(DEJAVU_SANS);
});
