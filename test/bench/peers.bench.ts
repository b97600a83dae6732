// Stemline's fitter against two general-purpose fitters from the npm registry on the
// same traced boundary chains at the same maximum error: `fit-curve` (an
// implementation of Schneider 1990, "An Algorithm for Automatically Fitting Digitized
// Curves") and paper.js's Path.simplify. For a fair comparison: both take their
// tolerance as a squared distance, so they get the square of the error meant; paper.js
// mishandles the closing segment of a closed path, so it gets the contour as an open
// path with the start point repeated; and each one's achieved maximum error is
// measured and printed beside the ratios.
import type { Bench } from 'tinybench';
import fitCurve from 'fit-curve';
import paper from 'paper/dist/paper-core.js';
import { cubic, nearestPointOnSegments, type CubicSegment, type Point, type Segment } from '../../core/geometry/index.ts';
import { contourSegments } from '../../core/outline/index.ts';
import { DEFAULT_TOLERANCE, fitGlyph, type GlyphChain } from '../../core/fit/index.ts';
import { REFERENCE_FONTS } from '../support/require-tool.ts';
import { tracedGlyphChains } from './fit.bench.ts';
import { loadFont } from '../raster/reference-render.ts';
import { commandsToContours } from '../fit/outline-metrics.ts';

/** The glyphs compared: rounds, stems, bowls, diagonals and figures from both reference fonts. */
const GLYPHS = 'aegnosBHRS28';
/** The maximum error every fitter is held to, font units (Stemline's default tolerance at 1 px per unit). */
const MAX_ERROR = DEFAULT_TOLERANCE;

/** A tighter error for the segment counts: 0.75 units, the fitter's floor of 0.75 px at 1 px per unit (core/pipeline MIN_TOLERANCE_PIXELS). */
const TIGHT_MAX_ERROR = 0.75;

/** Segments of the reference fonts' own outlines of GLYPHS (lines and curves; a closing line back onto the start is not counted). */
function fontSegmentCount(): number {
  return [REFERENCE_FONTS.cantarellRegular.path, REFERENCE_FONTS.libertineRegular.path].reduce((total, font) => {
    const parsed = loadFont(font);
    return total + [...GLYPHS].reduce((n, character) => n + commandsToContours(parsed.charToGlyph(character).path.commands).reduce((m, c) => m + c.length, 0), 0);
  }, 0);
}

export const PEER_TASKS = {
  stemline: `Stemline fit, ${GLYPHS.length * 2} glyphs at 1 px/unit`,
  fitCurve: `fit-curve (Schneider), same chains`,
  paper: `paper.js Path.simplify, same chains`,
} as const;

let chainsCache: GlyphChain[][] | undefined;
function glyphChains(): GlyphChain[][] {
  chainsCache ??= [REFERENCE_FONTS.cantarellRegular.path, REFERENCE_FONTS.libertineRegular.path].flatMap((font) =>
    [...GLYPHS].map((character) => tracedGlyphChains(font, character, 1)),
  );
  return chainsCache;
}

function stemlineSegments(glyphs: readonly GlyphChain[][], maxError = MAX_ERROR): Segment[][] {
  return glyphs.flatMap((chains) => fitGlyph(chains, { tolerance: maxError }).outline.contours.map((c) => contourSegments(c)));
}

function fitCurveSegments(glyphs: readonly GlyphChain[][], maxError = MAX_ERROR): Segment[][] {
  return glyphs.flatMap((chains) =>
    chains.map((chain) => {
      const points = chain.points.map((p): [number, number] => [p.x, p.y]);
      const first = points[0];
      if (first) points.push(first);
      return fitCurve(points, maxError * maxError).map(([a, b, c, d]) => cubic({ x: a[0], y: a[1] }, { x: b[0], y: b[1] }, { x: c[0], y: c[1] }, { x: d[0], y: d[1] }));
    }),
  );
}

let paperReady = false;
function paperSegments(glyphs: readonly GlyphChain[][], maxError = MAX_ERROR): Segment[][] {
  if (!paperReady) {
    paper.setup(new paper.Size(1, 1));
    paperReady = true;
  }
  return glyphs.flatMap((chains) =>
    chains.map((chain) => {
      const points = chain.points.map((p) => new paper.Point(p.x, p.y));
      const first = points[0];
      if (first) points.push(new paper.Point(first.x, first.y));
      const path = new paper.Path({ segments: points, insert: false });
      path.simplify(maxError * maxError);
      const segments: CubicSegment[] = path.curves.map((c) =>
        cubic({ x: c.point1.x, y: c.point1.y }, { x: c.point1.x + c.handle1.x, y: c.point1.y + c.handle1.y }, { x: c.point2.x + c.handle2.x, y: c.point2.y + c.handle2.y }, { x: c.point2.x, y: c.point2.y }),
      );
      return segments;
    }),
  );
}

/** Largest distance from any chain point to the fitted contour drawn for it (the achieved maximum error). */
function achievedMaxError(glyphs: readonly GlyphChain[][], fitted: readonly Segment[][]): number {
  const chains = glyphs.flat();
  let worst = 0;
  chains.forEach((chain, i) => {
    const segments = fitted[i] ?? [];
    // Every 4th point: the figure is a maximum over thousands of points; a quarter of them finds it within a fraction of a unit.
    for (let k = 0; k < chain.points.length; k += 4) {
      const p = chain.points[k] as Point;
      worst = Math.max(worst, nearestPointOnSegments(segments, p)?.distance ?? 0);
    }
  });
  return worst;
}

export function peerBenchmarks(bench: Bench): void {
  bench.add(PEER_TASKS.stemline, () => stemlineSegments(glyphChains()), { beforeAll: () => void glyphChains() });
  bench.add(PEER_TASKS.fitCurve, () => fitCurveSegments(glyphChains()));
  bench.add(PEER_TASKS.paper, () => paperSegments(glyphChains()));
}

/** The ratio lines: Stemline's segments and time over each peer's, and the errors each achieved. */
export function peerReport(bench: Bench): string[] {
  const glyphs = glyphChains();
  const ours = stemlineSegments(glyphs);
  const theirs = { 'fit-curve': fitCurveSegments(glyphs), 'paper.js': paperSegments(glyphs) };
  const count = (contours: readonly Segment[][]) => contours.reduce((n, c) => n + c.length, 0);
  const median = (name: string) => {
    const result = bench.tasks.find((t) => t.name === name)?.result;
    return result?.state === 'completed' ? result.latency.p50 : Number.NaN;
  };
  const ourTime = median(PEER_TASKS.stemline);
  const lines = [`Stemline: ${count(ours)} segments, achieved max error ${achievedMaxError(glyphs, ours).toFixed(2)} units (asked ${MAX_ERROR})`];
  for (const [name, segments] of Object.entries(theirs)) {
    const time = median(name === 'fit-curve' ? PEER_TASKS.fitCurve : PEER_TASKS.paper);
    lines.push(`${name}: ${count(segments)} segments, achieved max error ${achievedMaxError(glyphs, segments).toFixed(2)} units`);
    lines.push(`fit segments ratio vs ${name}: ${(count(ours) / count(segments)).toFixed(3)}`);
    lines.push(`fit time ratio vs ${name}: ${(ourTime / time).toFixed(3)}`);
  }
  // Context for the segment ratios: the professional outlines' own count on these glyphs
  // is the economy a type designer accepts, and the peers' counts grow fastest as the
  // error tightens (at the fitter's floor of 0.75 px here).
  lines.push(`the fonts' own outlines of these glyphs: ${fontSegmentCount()} segments`);
  const tight = { stemline: stemlineSegments(glyphs, TIGHT_MAX_ERROR), 'fit-curve': fitCurveSegments(glyphs, TIGHT_MAX_ERROR), 'paper.js': paperSegments(glyphs, TIGHT_MAX_ERROR) };
  lines.push(`at max error ${TIGHT_MAX_ERROR}: Stemline ${count(tight.stemline)}, fit-curve ${count(tight['fit-curve'])}, paper.js ${count(tight['paper.js'])} segments; ratios ${(count(tight.stemline) / count(tight['fit-curve'])).toFixed(3)} and ${(count(tight.stemline) / count(tight['paper.js'])).toFixed(3)}`);
  return lines;
}
