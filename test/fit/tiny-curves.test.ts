// Tiny curves turned into corners: what a type designer would notice if it broke — a
// blunted corner a couple of units across left as a curve that kinks against its
// sides once on the unit grid, or, the other way, a round they drew (or a flat-topped
// apex) turned into a sharp spike.

import { describe, expect, it } from 'vitest';
import { prepareChain } from '../../core/fit/boundary-chain.ts';
import type { FitNode, FitSpan, FittedContour } from '../../core/fit/fitted-contour.ts';
import { cornerTinyCurves, TINY_CURVE_CELLS } from '../../core/fit/tiny-curves.ts';
import { cubic, evaluate, line, type CubicSegment, type LineSegment, type Point } from '../../core/geometry/index.ts';

/** A unit vector at `degrees`. */
const heading = (degrees: number): Point => ({ x: Math.cos((degrees * Math.PI) / 180), y: Math.sin((degrees * Math.PI) / 180) });

/**
 * A triangle whose apex is a circular round of radius `radius` between two sides,
 * as a fitted contour (the round one cubic, smooth at both ends), and a chain sampled
 * along its own segments every 0.25 unit (so the contour lies on its chain exactly).
 * The sides turn by `turnDegrees` at the apex.
 */
function bluntedTriangle(radius: number, turn: number): { chain: ReturnType<typeof prepareChain>['chain']; contour: FittedContour } {
  // An upward apex: the incoming side rises from the lower left, the outgoing one falls
  // to the lower right, each at half the opening (180° − turn) from the vertical.
  const halfOpening = (180 - turn) / 2;
  const inDir = heading(90 - halfOpening);
  const outDir = heading(halfOpening - 90);
  // The sharp apex of the two sides (off the grid), and the round's tangent points at distance d from it.
  const apex = { x: 150 + Math.SQRT2 / 9, y: 320 + Math.PI / 7 };
  const d = radius * Math.tan(((turn / 2) * Math.PI) / 180);
  const a = { x: apex.x - inDir.x * d, y: apex.y - inDir.y * d };
  const b = { x: apex.x + outDir.x * d, y: apex.y + outDir.y * d };
  // A circular arc of turn θ as one cubic: handles 4/3·tan(θ/4)·r along the tangents.
  const h = (4 / 3) * Math.tan(((turn / 4) * Math.PI) / 180) * radius;
  const round = cubic(a, { x: a.x + inDir.x * h, y: a.y + inDir.y * h }, { x: b.x - outDir.x * h, y: b.y - outDir.y * h }, b);
  const start = { x: apex.x - inDir.x * 300, y: apex.y - inDir.y * 300 };
  const end = { x: apex.x + outDir.x * 300, y: apex.y + outDir.y * 300 };
  const segments: (LineSegment | CubicSegment)[] = [line(start, a), round, line(b, end), line(end, start)];
  const samples: Point[] = [];
  const starts: number[] = [];
  for (const s of segments) {
    starts.push(samples.length);
    const p0 = s.p0;
    const p1 = s.kind === 'line' ? s.p1 : s.p3;
    const steps = Math.max(4, Math.ceil(Math.hypot(p1.x - p0.x, p1.y - p0.y) * 4));
    for (let k = 0; k < steps; k++) samples.push(evaluate(s, k / steps));
  }
  const { chain } = prepareChain(samples);
  const tangents = [null, inDir, outDir, null];
  const nodes: FitNode[] = segments.map((s, k) => {
    const t = tangents[k] ?? null;
    return { point: s.p0, smooth: t !== null, tangentIn: t, tangentOut: t, extremum: null, corner: null, index: starts[k]!, pinned: true };
  });
  const spans: FitSpan[] = segments.map((segment, k) => ({ segment, first: starts[k]!, last: k < 3 ? starts[k + 1]! : samples.length, maxError: 0, carrier: null }));
  return { chain, contour: { nodes, spans } };
}

describe('blunted corners a few units across', () => {
  it('become the corner where the sides meet, the sides kept on their own lines', () => {
    for (const turn of [60, 90, 120]) {
      const { chain, contour } = bluntedTriangle(1, turn);
      const result = cornerTinyCurves(chain, contour, 1.5, 1, 1);
      expect(result.nodes).toHaveLength(3);
      expect(result.spans.every((s) => s.segment.kind === 'line')).toBe(true);
      const corner = result.nodes[1]!;
      expect(corner.smooth).toBe(false);
      // The sides' own directions: the corner lies on both lines (to rounding error).
      const [before, after] = [contour.spans[0]!.segment as LineSegment, contour.spans[2]!.segment as LineSegment];
      const offLine = (p: Point, s: LineSegment): number => {
        const dx = s.p1.x - s.p0.x, dy = s.p1.y - s.p0.y;
        return Math.abs((p.x - s.p0.x) * dy - (p.y - s.p0.y) * dx) / Math.hypot(dx, dy);
      };
      expect(offLine(corner.point, before)).toBeLessThan(1e-9);
      expect(offLine(corner.point, after)).toBeLessThan(1e-9);
      for (const span of result.spans) expect(span.maxError).toBeLessThanOrEqual(1.5);
    }
  });

  it('leave the fitted contour untouched when the round is larger than the tiny-curve limit', () => {
    const { chain, contour } = bluntedTriangle(12, 90);
    const chord = Math.hypot(contour.spans[1]!.segment.p0.x - (contour.spans[1]!.segment as CubicSegment).p3.x, contour.spans[1]!.segment.p0.y - (contour.spans[1]!.segment as CubicSegment).p3.y);
    expect(chord).toBeGreaterThan(TINY_CURVE_CELLS);
    expect(cornerTinyCurves(chain, contour, 1.5, 1, 1)).toBe(contour);
  });

  it('keep a round the designer forced smooth', () => {
    const { chain, contour } = bluntedTriangle(1.5, 90);
    const middle = Math.round((contour.spans[1]!.first + contour.spans[1]!.last) / 2);
    expect(cornerTinyCurves(chain, contour, 1.5, 1, 1, [middle])).toBe(contour);
  });

  it('end a narrow stroke in its flat chord between two corners, not in a spike beyond the tolerance', () => {
    // At a 160° turn the sides meet r·(1/sin(10°) − 1) ≈ 4.8 r beyond the round's middle;
    // the chord between the round's ends holds it within r·(1 − cos(80°)) ≈ 0.83 r.
    const { chain, contour } = bluntedTriangle(1.5, 160);
    const result = cornerTinyCurves(chain, contour, 1.5, 1, 1);
    expect(result.nodes).toHaveLength(4);
    const flat = result.spans[1]!.segment;
    expect(flat.kind).toBe('line');
    const round = contour.spans[1]!.segment as CubicSegment;
    expect(flat.p0).toEqual(round.p0);
    expect(flat.kind === 'line' ? flat.p1 : undefined).toEqual(round.p3);
    expect(result.nodes[1]!.smooth).toBe(false);
    expect(result.nodes[2]!.smooth).toBe(false);
    expect(result.spans[1]!.maxError).toBeLessThanOrEqual(1.5);
  });

  it('keep a round stroke end that neither a corner nor a flat holds within the tolerance', () => {
    // A near-semicircular end 5.8 units across: its middle is 2.8 units beyond the chord.
    const { chain, contour } = bluntedTriangle(2.9, 176);
    expect(cornerTinyCurves(chain, contour, 1.5, 1, 1)).toBe(contour);
  });
});

describe('a stem cut in two', () => {
  /**
   * A sloped stem 460 units long leaning 4° from the vertical, fitted as two lines with
   * a 2-unit cubic bridging the cut between them (the fit's picture when the line
   * search stops short of the union), closed by a bar and a second stem; the chain
   * samples the straight stem every 0.25 unit, with the cut `bend` degrees off it.
   */
  function cutStem(bend: number): { chain: ReturnType<typeof prepareChain>['chain']; contour: FittedContour } {
    const down = heading(-90 + 4);
    const bent = heading(-90 + 4 + bend);
    const top = { x: 100.3, y: 600.2 };
    const cutStart = { x: top.x + down.x * 200, y: top.y + down.y * 200 };
    const cutEnd = { x: cutStart.x + bent.x * 2, y: cutStart.y + bent.y * 2 };
    const bottom = { x: cutEnd.x + bent.x * 258, y: cutEnd.y + bent.y * 258 };
    const bridge = cubic(cutStart, { x: cutStart.x + bent.x * 0.7, y: cutStart.y + bent.y * 0.7 }, { x: cutEnd.x - bent.x * 0.7, y: cutEnd.y - bent.y * 0.7 }, cutEnd);
    const right = { x: bottom.x + 80, y: bottom.y };
    const rightTop = { x: top.x + 80, y: top.y };
    const segments: (LineSegment | CubicSegment)[] = [line(top, cutStart), bridge, line(cutEnd, bottom), line(bottom, right), line(right, rightTop), line(rightTop, top)];
    const samples: Point[] = [];
    const starts: number[] = [];
    for (const s of segments) {
      starts.push(samples.length);
      const p1 = s.kind === 'line' ? s.p1 : s.p3;
      const steps = Math.max(4, Math.ceil(Math.hypot(p1.x - s.p0.x, p1.y - s.p0.y) * 4));
      for (let k = 0; k < steps; k++) samples.push(evaluate(s, k / steps));
    }
    const { chain } = prepareChain(samples);
    const nodes: FitNode[] = segments.map((s, k) => ({ point: s.p0, smooth: k === 1 || k === 2, tangentIn: null, tangentOut: null, extremum: null, corner: null, index: starts[k]!, pinned: true }));
    const spans: FitSpan[] = segments.map((segment, k) => ({ segment, first: starts[k]!, last: k + 1 < segments.length ? starts[k + 1]! : samples.length, maxError: 0, carrier: null }));
    return { chain, contour: { nodes, spans } };
  }

  it('becomes one line when its halves continue each other', () => {
    // Reference: the near-miss kink band of outline checking (0.3°–8°, common practice):
    // halves 0.1° apart are one stroke edge, and the bridge between them could only kink.
    const { chain, contour } = cutStem(0.1);
    const result = cornerTinyCurves(chain, contour, 1.5, 1, 1);
    expect(result.spans).toHaveLength(4);
    const stem = result.spans[0]!.segment;
    expect(stem.kind).toBe('line');
    expect(stem.p0).toEqual(contour.spans[0]!.segment.p0);
    expect(stem.kind === 'line' ? stem.p1 : undefined).toEqual((contour.spans[2]!.segment as LineSegment).p1);
    expect(result.spans[0]!.maxError).toBeLessThanOrEqual(1.5);
    expect(result.spans[0]!.first).toBe(contour.spans[0]!.first);
    expect(result.spans[0]!.last).toBe(contour.spans[2]!.last);
    expect(result.nodes).toHaveLength(4);
  });

  it('keeps a bend of a degree, which one line would not hold', () => {
    // 1° over 258 units puts the stem's end 4.5 units off the line through its top half,
    // and a turn of 1° is too little for a corner.
    const { chain, contour } = cutStem(1);
    expect(cornerTinyCurves(chain, contour, 1.5, 1, 1)).toBe(contour);
  });
});
