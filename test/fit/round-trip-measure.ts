// The round trip, the measure of the product: glyphs of professionally drawn fonts are
// rendered by an independent rasterizer (Skia via @napi-rs/canvas, test/raster/
// reference-render.ts), traced by core/raster, fitted by core/fit, and compared with
// the font's own outline. Three variants: clean renders at 1 px and at 0.5 px per font
// unit, and a degraded "rough scan" copy at 1 px per unit (blur σ = 1.2 px, paper
// gradient, sensor noise, dust specks; test/raster/degrade.ts). The unit suite runs a
// subset (round-trip.test.ts); the benchmark runner calls measureRoundTrip for all of
// A–Z a–z 0–9.

import type { PathCommand } from 'opentype.js/dist/opentype.js';
import { traceScan, type GreyRaster } from '../../core/raster/index.ts';
import { fitGlyph, type FitOptions } from '../../core/fit/index.ts';
import type { GlyphOutline } from '../../core/outline/index.ts';
import { degrade, type Degradation } from '../raster/degrade.ts';
import { addGlyphPath, loadFont, renderAntialiased, type FontPlacement } from '../raster/reference-render.ts';
import { REFERENCE_FONTS } from '../support/require-tool.ts';
import { commandsToContours, contourAreas, corners, extremaInside, hausdorff, kinks, matched, onCurveCount, outlineToContours, turnZones } from './outline-metrics.ts';

export type RoundTripVariant = 'clean 1 px/unit' | 'clean 0.5 px/unit' | 'rough 1 px/unit' | '1-bit 1 px/unit';
export const ALL_VARIANTS: readonly RoundTripVariant[] = ['clean 1 px/unit', 'clean 0.5 px/unit', 'rough 1 px/unit', '1-bit 1 px/unit'];
/** Grey level at which the clean render is thresholded for the 1-bit variant: the middle of the scale, as a 1-bit scanner's fixed threshold. */
const ONE_BIT_THRESHOLD = 128;
export const ALL_GLYPHS = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789';
export const ROUND_TRIP_FONTS = {
  'Cantarell Regular': REFERENCE_FONTS.cantarellRegular.path,
  'Linux Libertine Regular': REFERENCE_FONTS.libertineRegular.path,
} as const;
export type RoundTripFont = keyof typeof ROUND_TRIP_FONTS;

/**
 * Supersampling of the reference renders: 4×. Skia's single-sample anti-aliasing errs
 * by up to ≈ 0.25 px on curved edges and box-filtering n× supersampled renders divides
 * that by n (reference-render.ts), so 4× leaves ≈ 0.06 px, a tenth of the figures
 * measured here, at a quarter of the 8× render time.
 */
const SUPERSAMPLING = 4;
/** Blank margin round each glyph, px: room for the degradation's specks and blur. */
const MARGIN_PX = 24;
/** Sub-pixel offsets of the glyph origin, so that outlines do not line up with the pixel grid. */
const OFFSET_X = 0.37;
const OFFSET_Y = 0.61;
/** The rough scan: as the raster round trip's mild scan (test/raster/glyph-round-trip.test.ts). */
const ROUGH_SCAN: Omit<Degradation, 'specks' | 'seed'> = { blurSigma: 1.2, paperLeft: 245, paperRight: 185, inkReflectance: 0.08, noiseSigma: 6 };
/** Speck limit when tracing the rough scan, as in the raster round trip (0.2 mm² at 300 dpi ≈ 28 px, above the painted specks). */
const SPECK_AREA_MM2 = 0.2;
const SCAN_DPI = 300;
/** Corners: on-curve points whose tangent turns more than 20°, matched within 4 units (the definition). */
export const CORNER_TURN_DEGREES = 20;
export const CORNER_MATCH_UNITS = 4;
/** Hausdorff sampling step, font units. */
const HAUSDORFF_SPACING = 0.5;

export interface GlyphMeasurement {
  readonly font: RoundTripFont;
  readonly variant: RoundTripVariant;
  readonly character: string;
  readonly hausdorff: number;
  readonly onCurve: number;
  readonly fontOnCurve: number;
  readonly extremaInside: number;
  readonly fontExtremaInside: number;
  readonly fontCorners: number;
  readonly fittedCorners: number;
  readonly recalledCorners: number;
  readonly preciseCorners: number;
  /** Fitted corners within 4 units of a place where the font turns > 20° within 4 units of arc (its corners and micro-rounds). */
  readonly turnZoneCorners: number;
  readonly kinks: number;
  readonly fontKinks: number;
  readonly contours: number;
  readonly fontContours: number;
  /** Every contour winds by its depth (even counter-clockwise) and the filled area matches the font's. */
  readonly windingCorrect: boolean;
  readonly fitMs: number;
  /** The scan's edge blur as the tracer measured it (px). */
  readonly edgeBlurPx: number | null;
  /** Fitter's own report: tolerance exceeded (outside corners), for diagnosis. */
  readonly maxDeviationOutsideCorners: number;
  /** The fitted outline (for figures and inspection). */
  readonly outline: GlyphOutline;
}

export interface VariantSummary {
  readonly font: RoundTripFont;
  readonly variant: RoundTripVariant;
  readonly glyphs: number;
  readonly hausdorffP95: number;
  readonly hausdorffMedian: number;
  readonly hausdorffMax: number;
  readonly worstGlyph: string;
  /** Σ fitted on-curve points / Σ the font's own. */
  readonly onCurveRatio: number;
  readonly extremaInside: number;
  readonly fontExtremaInside: number;
  readonly cornerRecall: number;
  readonly cornerPrecision: number;
  /** Precision counting the font's micro-rounds (a turn > 20° within 4 units of arc) as corners. */
  readonly cornerPrecisionWithRounds: number;
  readonly kinks: number;
  readonly fontKinks: number;
  readonly contourMismatches: number;
  readonly windingErrors: number;
  readonly meanFitMs: number;
}

export interface RoundTripOptions {
  readonly fonts?: readonly RoundTripFont[];
  readonly glyphs?: string;
  readonly variants?: readonly RoundTripVariant[];
  /** Fit options for every variant; the tolerance is scaled per variant unless given here. */
  readonly fit?: FitOptions;
}

export interface RoundTripResult {
  readonly glyphs: readonly GlyphMeasurement[];
  readonly summaries: readonly VariantSummary[];
}

/** px per font unit of a variant. */
function scaleOf(variant: RoundTripVariant): number {
  return variant === 'clean 0.5 px/unit' ? 0.5 : 1;
}

function bounds(commands: readonly PathCommand[]): { minX: number; minY: number; maxX: number; maxY: number } {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const c of commands) {
    if (c.type === 'Z') continue;
    const xs = c.type === 'C' ? [c.x, c.x1, c.x2] : c.type === 'Q' ? [c.x, c.x1] : [c.x];
    const ys = c.type === 'C' ? [c.y, c.y1, c.y2] : c.type === 'Q' ? [c.y, c.y1] : [c.y];
    for (const x of xs) { minX = Math.min(minX, x); maxX = Math.max(maxX, x); }
    for (const y of ys) { minY = Math.min(minY, y); maxY = Math.max(maxY, y); }
  }
  return { minX, minY, maxX, maxY };
}

/** Renders, traces and fits one glyph, and measures it against the font's outline. */
export function measureGlyph(font: RoundTripFont, commands: readonly PathCommand[], character: string, variant: RoundTripVariant, fit: FitOptions, seed: number): GlyphMeasurement {
  const scale = scaleOf(variant);
  const box = bounds(commands);
  const width = Math.ceil((box.maxX - box.minX) * scale + 2 * MARGIN_PX);
  const height = Math.ceil((box.maxY - box.minY) * scale + 2 * MARGIN_PX);
  const placement: FontPlacement = { scale, originX: MARGIN_PX - box.minX * scale + OFFSET_X, originY: MARGIN_PX + box.maxY * scale + OFFSET_Y };
  let raster: GreyRaster = renderAntialiased(width, height, (context) => {
    context.beginPath();
    addGlyphPath(context, commands, placement);
    context.fill('nonzero');
  }, SUPERSAMPLING);
  const rough = variant === 'rough 1 px/unit';
  if (rough) {
    const specks = [
      { x: MARGIN_PX / 2, y: MARGIN_PX / 2, radius: 2 },
      { x: width - MARGIN_PX / 2, y: MARGIN_PX / 2 + 3, radius: 2.2 },
      { x: width - MARGIN_PX / 2 - 2, y: height - MARGIN_PX / 2, radius: 1.8 },
    ];
    raster = degrade(raster, { ...ROUGH_SCAN, specks, seed });
  }
  if (variant === '1-bit 1 px/unit') {
    const data = raster.data.map((v) => (v < ONE_BIT_THRESHOLD ? 0 : 255));
    raster = { ...raster, data };
  }
  const traced = traceScan({ raster, dpiX: SCAN_DPI }, rough ? { speckAreaMm2: SPECK_AREA_MM2 } : { smoothBilevel: true });
  const chains = traced.contours.map((c) => ({
    depth: c.depth,
    points: c.points.map((p) => ({ x: (p.x - placement.originX) / scale, y: (placement.originY - p.y) / scale })),
  }));
  const started = performance.now();
  const scanBlurPx = fit.scanBlurPx ?? traced.edgeBlurPx ?? undefined;
  const scanNoisePx = fit.scanNoisePx ?? traced.edgeNoisePx ?? undefined;
  const fitted = fitGlyph(chains, { ...fit, ...(scanBlurPx === undefined ? {} : { scanBlurPx }), ...(scanNoisePx === undefined ? {} : { scanNoisePx }) });
  const fitMs = performance.now() - started;

  const reference = commandsToContours(commands);
  const result = outlineToContours(fitted.outline);
  const fontCorners = corners(reference, CORNER_TURN_DEGREES);
  const fittedCorners = corners(result, CORNER_TURN_DEGREES);
  const areas = contourAreas(result);
  const windingByDepth = areas.every((a, i) => (chains[i]!.depth % 2 === 0 ? a > 0 : a < 0));
  const fittedFill = areas.reduce((t, a) => t + a, 0);
  const fontFill = Math.abs(contourAreas(reference).reduce((t, a) => t + a, 0));
  return {
    font,
    variant,
    character,
    hausdorff: hausdorff(reference, result, HAUSDORFF_SPACING),
    onCurve: onCurveCount(result),
    fontOnCurve: onCurveCount(reference),
    extremaInside: extremaInside(result),
    fontExtremaInside: extremaInside(reference),
    fontCorners: fontCorners.length,
    fittedCorners: fittedCorners.length,
    recalledCorners: matched(fontCorners, fittedCorners, CORNER_MATCH_UNITS),
    preciseCorners: matched(fittedCorners, fontCorners, CORNER_MATCH_UNITS),
    turnZoneCorners: matched(fittedCorners, turnZones(reference, CORNER_TURN_DEGREES, CORNER_MATCH_UNITS), CORNER_MATCH_UNITS),
    kinks: kinks(result),
    fontKinks: kinks(reference),
    contours: result.length,
    fontContours: reference.length,
    windingCorrect: windingByDepth && Math.abs(fittedFill - fontFill) <= 0.02 * fontFill,
    fitMs,
    edgeBlurPx: traced.edgeBlurPx,
    maxDeviationOutsideCorners: fitted.report.maxDeviationOutsideCorners,
    outline: fitted.outline,
  };
}

function percentile(values: readonly number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  if (sorted.length === 0) return 0;
  const rank = Math.min(sorted.length - 1, Math.max(0, Math.ceil(p * sorted.length) - 1));
  return sorted[rank]!;
}

export function summarize(glyphs: readonly GlyphMeasurement[]): VariantSummary[] {
  const groups = new Map<string, GlyphMeasurement[]>();
  for (const g of glyphs) {
    const key = `${g.font}|${g.variant}`;
    const list = groups.get(key);
    if (list) list.push(g);
    else groups.set(key, [g]);
  }
  return [...groups.values()].map((list) => {
    const sum = (pick: (g: GlyphMeasurement) => number): number => list.reduce((t, g) => t + pick(g), 0);
    const worst = list.reduce((a, b) => (b.hausdorff > a.hausdorff ? b : a));
    return {
      font: list[0]!.font,
      variant: list[0]!.variant,
      glyphs: list.length,
      hausdorffP95: percentile(list.map((g) => g.hausdorff), 0.95),
      hausdorffMedian: percentile(list.map((g) => g.hausdorff), 0.5),
      hausdorffMax: worst.hausdorff,
      worstGlyph: worst.character,
      onCurveRatio: sum((g) => g.onCurve) / Math.max(1, sum((g) => g.fontOnCurve)),
      extremaInside: sum((g) => g.extremaInside),
      fontExtremaInside: sum((g) => g.fontExtremaInside),
      cornerRecall: sum((g) => g.recalledCorners) / Math.max(1, sum((g) => g.fontCorners)),
      cornerPrecision: sum((g) => g.preciseCorners) / Math.max(1, sum((g) => g.fittedCorners)),
      cornerPrecisionWithRounds: sum((g) => g.turnZoneCorners) / Math.max(1, sum((g) => g.fittedCorners)),
      kinks: sum((g) => g.kinks),
      fontKinks: sum((g) => g.fontKinks),
      contourMismatches: list.filter((g) => g.contours !== g.fontContours).length,
      windingErrors: list.filter((g) => !g.windingCorrect).length,
      meanFitMs: sum((g) => g.fitMs) / list.length,
    };
  });
}

/**
 * The full round trip (defaults: both fonts, A–Z a–z 0–9, all three variants).
 * Fit options default to the fitter's defaults, with the tolerance in font units
 * scaled by the pixel size (1.5 units per pixel, i.e. 3 units at 0.5 px/unit) unless
 * `fit.tolerance` is given: a scan's noise is measured in pixels, so a user fitting
 * a coarser scan would raise the tolerance by the same factor.
 */
export function measureRoundTrip(options: RoundTripOptions = {}): RoundTripResult {
  const fonts = options.fonts ?? (Object.keys(ROUND_TRIP_FONTS) as RoundTripFont[]);
  const characters = [...(options.glyphs ?? ALL_GLYPHS)];
  const variants = options.variants ?? ALL_VARIANTS;
  const glyphs: GlyphMeasurement[] = [];
  for (const font of fonts) {
    const parsed = loadFont(ROUND_TRIP_FONTS[font]);
    characters.forEach((character, index) => {
      const commands = parsed.charToGlyph(character).path.commands;
      for (const variant of variants) {
        const fit: FitOptions = { ...options.fit, tolerance: options.fit?.tolerance ?? DEFAULT_TOLERANCE_PER_PIXEL / scaleOf(variant) };
        glyphs.push(measureGlyph(font, commands, character, variant, fit, NOISE_SEED_BASE + index));
      }
    });
  }
  return { glyphs, summaries: summarize(glyphs) };
}

/** Tolerance per scan pixel used by the round trip (the fitter's default at 1 px per unit). */
export const DEFAULT_TOLERANCE_PER_PIXEL = 1.5;

/** The rough copy's noise seed of a glyph is this plus the glyph's place in the list measured. */
const NOISE_SEED_BASE = 5000;

/**
 * One glyph measured exactly as the full round trip (all of ALL_GLYPHS) measures it:
 * the same copy, the same noise seed, and the round trip's tolerance unless `fit` gives
 * one. For tests that check a single letter against the figures of the whole run.
 */
export function measureRoundTripGlyph(font: RoundTripFont, character: string, variant: RoundTripVariant, fit: FitOptions = {}): GlyphMeasurement {
  const commands = loadFont(ROUND_TRIP_FONTS[font]).charToGlyph(character).path.commands;
  const tolerance = fit.tolerance ?? DEFAULT_TOLERANCE_PER_PIXEL / scaleOf(variant);
  return measureGlyph(font, commands, character, variant, { ...fit, tolerance }, NOISE_SEED_BASE + ALL_GLYPHS.indexOf(character));
}

/** The summaries as rows for console.table. */
export function summaryTable(summaries: readonly VariantSummary[]): Record<string, string | number>[] {
  return summaries.map((s) => ({
    font: s.font,
    variant: s.variant,
    glyphs: s.glyphs,
    'Hausdorff p95': +s.hausdorffP95.toFixed(2),
    'Hausdorff median': +s.hausdorffMedian.toFixed(2),
    'Hausdorff max': `${s.hausdorffMax.toFixed(2)} (${s.worstGlyph})`,
    'on-curve ratio': +s.onCurveRatio.toFixed(3),
    'extrema inside >0.5': s.extremaInside,
    'corner recall': +s.cornerRecall.toFixed(3),
    'corner precision': +s.cornerPrecision.toFixed(3),
    'precision, micro-rounds as corners': +s.cornerPrecisionWithRounds.toFixed(3),
    kinks: s.kinks,
    'font kinks': s.fontKinks,
    'contour mismatches': s.contourMismatches,
    'winding errors': s.windingErrors,
    'fit ms/glyph': +s.meanFitMs.toFixed(1),
  }));
}
