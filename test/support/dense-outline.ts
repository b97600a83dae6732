// A deterministic glyph outline with a chosen number of cubic segments: a ring whose
// two edges wave gently (radius r(θ) = R·(1 + a·sin(kθ))), every on-curve point smooth
// and every segment a curve. It stands in for the densest letters a designer edits
// (a swash capital, an ornament) where no real one is at hand: all-cubic is the worst
// case for the editor, since only curves get curvature combs. Used by the editor
// benchmark (test/bench/editor.bench.ts) and the comb cache tests.
import type { GlyphOutline, OutlineContour, OutlinePoint } from '../../core/outline/index.ts';

/** Share of the radius the edges wave by: enough for combs that vary, too little to fold the curve. */
const WAVE_SHARE = 0.04;
/** Waves round each edge: a prime, so the waves never line up with the points. */
const WAVES = 7;
/** Share of the outer radius the inner edge (the counter) has. */
const INNER_SHARE = 0.6;
/** Share of the segments the outer edge takes; the counter gets the rest (a real letter's outer edge is the longer one). */
const OUTER_SEGMENT_SHARE = 0.6;

/**
 * One closed contour of `segments` cubic segments round `centre`: points on the
 * waved circle, handles along its tangent a third of the way to the neighbours
 * (the Hermite-to-Bézier rule B1 = P0 + P0′/3n), rounded to whole units as fitted
 * points are. Counter-clockwise unless `clockwise`.
 */
function wavedRing(centre: { x: number; y: number }, radius: number, segments: number, clockwise: boolean): OutlineContour {
  const sign = clockwise ? -1 : 1;
  const at = (theta: number) => {
    const r = radius * (1 + WAVE_SHARE * Math.sin(WAVES * theta));
    const dr = radius * WAVE_SHARE * WAVES * Math.cos(WAVES * theta);
    return {
      x: centre.x + r * Math.cos(theta),
      y: centre.y + r * Math.sin(theta),
      dx: dr * Math.cos(theta) - r * Math.sin(theta),
      dy: dr * Math.sin(theta) + r * Math.cos(theta),
    };
  };
  const step = (2 * Math.PI) / segments;
  const points: OutlinePoint[] = [];
  for (let i = 0; i < segments; i++) {
    const theta = sign * i * step;
    const p = at(theta);
    const q = at(theta + sign * step);
    const h = (sign * step) / 3;
    points.push({ x: Math.round(p.x), y: Math.round(p.y), kind: 'on', smooth: true });
    points.push({ x: Math.round(p.x + p.dx * h), y: Math.round(p.y + p.dy * h), kind: 'off', smooth: false });
    points.push({ x: Math.round(q.x - q.dx * h), y: Math.round(q.y - q.dy * h), kind: 'off', smooth: false });
  }
  return { points };
}

/**
 * A ring-shaped glyph of `segments` cubic segments in all (at least 6), two contours
 * (outer counter-clockwise, counter clockwise), centred on `centre` with outer
 * radius `radius` font units.
 */
export function denseRingOutline(segments: number, centre: { x: number; y: number }, radius: number): GlyphOutline {
  const total = Math.max(6, Math.round(segments));
  const outer = Math.round(total * OUTER_SEGMENT_SHARE);
  return { contours: [wavedRing(centre, radius, outer, false), wavedRing(centre, radius * INNER_SHARE, total - outer, true)] };
}
