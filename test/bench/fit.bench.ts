// Benchmarks for the fitting engine: one glyph's traced chains fitted into an outline,
// the operation the app runs per letter and the CLI per file. The chains are traced
// once, outside the timed tasks, from Linux Libertine renders at 1 px per font unit
// (rendered by test/raster/reference-render.ts); registered on a Bench supplied by
// test/bench/run.ts, which owns timing options and reporting.
import type { Bench } from 'tinybench';
import { traceScan } from '../../core/raster/index.ts';
import { fitGlyph, type GlyphChain } from '../../core/fit/index.ts';
import { addGlyphPath, loadFont, renderAntialiased } from '../raster/reference-render.ts';
import { REFERENCE_FONTS } from '../support/require-tool.ts';

/** Blank margin round the glyph (px). */
const MARGIN_PX = 24;
/** Supersampling of the reference render (see test/fit/round-trip-measure.ts). */
const SUPERSAMPLING = 4;

/** The traced chains of one glyph in font units, as the pipeline hands them to the fitter. */
export function tracedGlyphChains(fontPath: string, character: string, pxPerUnit = 1): GlyphChain[] {
  const font = loadFont(fontPath);
  const commands = font.charToGlyph(character).path.commands;
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const c of commands) {
    if (c.type === 'Z') continue;
    minX = Math.min(minX, c.x); maxX = Math.max(maxX, c.x); minY = Math.min(minY, c.y); maxY = Math.max(maxY, c.y);
  }
  const placement = { scale: pxPerUnit, originX: MARGIN_PX - minX * pxPerUnit + 0.37, originY: MARGIN_PX + maxY * pxPerUnit + 0.61 };
  const width = Math.ceil((maxX - minX) * pxPerUnit + 2 * MARGIN_PX);
  const height = Math.ceil((maxY - minY) * pxPerUnit + 2 * MARGIN_PX);
  const raster = renderAntialiased(width, height, (context) => {
    context.beginPath();
    addGlyphPath(context, commands, placement);
    context.fill('nonzero');
  }, SUPERSAMPLING);
  return traceScan({ raster }).contours.map((c) => ({
    depth: c.depth,
    points: c.points.map((p) => ({ x: (p.x - placement.originX) / pxPerUnit, y: (placement.originY - p.y) / pxPerUnit })),
  }));
}

/** Registers the fitting tasks on `bench`. */
export function fitBenchmarks(bench: Bench): void {
  for (const character of ['g', 'S']) {
    const chains = tracedGlyphChains(REFERENCE_FONTS.libertineRegular.path, character);
    const points = chains.reduce((t, c) => t + c.points.length, 0);
    bench.add(`fit Linux Libertine '${character}' at 1 px/unit (${points} boundary points)`, () => fitGlyph(chains).report.onCurveCount);
  }
}
