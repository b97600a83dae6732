/**
 * A glyph's traced boundaries in, its outline out: every chain fitted (fit-contour.ts)
 * and every contour turned to the direction its nesting depth asks for — outer
 * contours counter-clockwise, holes clockwise, islands in holes counter-clockwise
 * again (the CFF convention, core/outline orientByDepth).
 */
import type { Point } from '../geometry/vector.ts';
import { orientByDepth, type GlyphOutline } from '../outline/glyph-outline.ts';
import { fitContour } from './fit-contour.ts';
import type { FitOptions } from './fit-options.ts';
import { glyphReport, type GlyphFitReport } from './quality-report.ts';

/** One boundary chain of a glyph, in font units (y up), with its nesting depth. */
export interface GlyphChain {
  readonly points: readonly Point[];
  /** 0 for an outer boundary, 1 for a hole, 2 for an island in a hole, … */
  readonly depth: number;
  /** Per-chain forced corners and smooth points (chain indices); added to the options' lists. */
  readonly forcedCorners?: readonly number[];
  readonly forcedSmooth?: readonly number[];
}

export interface GlyphFit {
  readonly outline: GlyphOutline;
  readonly report: GlyphFitReport;
}

/**
 * Fits every chain of a glyph with the same options and orients the contours by depth.
 * Guarantees one contour per chain, in the same order. Throws what fitContour throws
 * (bad options, a chain with fewer than 3 distinct points).
 */
export function fitGlyph(chains: readonly GlyphChain[], options: FitOptions = {}): GlyphFit {
  const fits = chains.map((chain) =>
    fitContour(chain.points, {
      ...options,
      forcedCorners: [...(options.forcedCorners ?? []), ...(chain.forcedCorners ?? [])],
      forcedSmooth: [...(options.forcedSmooth ?? []), ...(chain.forcedSmooth ?? [])],
    }),
  );
  const outline = orientByDepth({ contours: fits.map((f) => f.contour) }, chains.map((c) => c.depth));
  return { outline, report: glyphReport(fits.map((f) => f.report)) };
}
