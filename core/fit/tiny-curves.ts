/**
 * Tiny curves turned into corners: a cubic a few grid cells long between two other
 * segments is replaced by the corner where its neighbours' tangent lines meet, when
 * that corner stays within the tolerance of the scan.
 *
 * Why: such a curve is the fit's picture of a rounded tip too small to draw (a blunted
 * join of a diagonal and a serif, a pen's corner softened by the ink). On the unit grid
 * it cannot join its neighbours smoothly: its handles are at most a few cells long, and
 * a handle that short can point only in a few directions (see TINY_CURVE_CELLS), so rounding leaves a near-miss
 * kink at one or both ends, the flaw a type designer looks for first. Nor can a round
 * that small be seen in print. The corner it stands for has neither problem: a corner's
 * turn is whatever it is, and the tiny segment (a warning of its own) is gone.
 *
 * A curve is only replaced where its neighbours turn by more than a kink would (so
 * the new corner is not itself a near-miss), where the corner lies on the neighbours'
 * tangent lines on the far side of the curve, within the tolerance of every traced
 * point the curve stood for, and where the neighbours, re-ended at the corner, stay
 * within the tolerance of their own points with no extremum pushed inside them. Where
 * the sides run too nearly parallel to meet near the curve (the flat top of a narrow
 * apex or stroke end), the curve becomes its straight chord between two corners
 * instead, when both turn by more than a kink and the chord holds the traced points
 * within the tolerance. Where both neighbours are lines that continue each other (one
 * stem the line search cut in two, the curve bridging the cut), the three become one
 * line, when that line holds every traced point of the three within the tolerance.
 * Points a user forced smooth are never touched.
 */
import type { Point, Vec } from '../geometry/vector.ts';
import { normalize } from '../geometry/vector.ts';
import { cubic, line, type CubicSegment, type LineSegment } from '../geometry/segment.ts';
import { nearestPoint } from '../geometry/nearest.ts';
import { arcAt, type BoundaryChain } from './boundary-chain.ts';
import { intersectLines } from './corners.ts';
import { EXTREMUM_PROTRUSION_LIMIT, segmentExtrema } from './extrema.ts';
import type { FitNode, FitSpan, FittedContour } from './fitted-contour.ts';
import { measureSpanError } from './span-error.ts';
import { KINK_MIN_DEGREES } from './quality-report.ts';

/**
 * Longest chord (grid cells) of a curve treated as tiny: 6. A curve that short has
 * handles of a few cells at most, and lattice directions of length ≤ 6 cells leave gaps
 * of up to 9.5° (between (1, 0) and (6, 1)), so such a handle misses a neighbour's
 * direction by up to about 5°, inside the 0.3°–8° kink band. Measured on the round trip
 * (Cantarell, rough copy): at 4 cells the 5-unit blunted apex of the 4 stayed a curve
 * with its top inside it; at 6 it is the corner the font has.
 */
export const TINY_CURVE_CELLS = 6;
/**
 * Smallest turn (degrees) of a corner that replaces a tiny curve: 8°, the upper end of
 * the near-miss kink band (a turn of 0.3°–8° reads as a mistake, not a corner; common
 * practice in outline checking).
 */
export const TINY_CURVE_MIN_TURN_DEGREES = 8;
/** Arc (px) around a user-forced smooth point within which no curve is replaced, as corners.ts keeps corners away from one. */
const FORCED_SMOOTH_CLEARANCE_PX = 2;

/** The direction of travel at a segment's end (atEnd) or start. */
function endDirection(segment: LineSegment | CubicSegment, atEnd: boolean): Vec | undefined {
  let d: Vec;
  if (segment.kind === 'line') d = { x: segment.p1.x - segment.p0.x, y: segment.p1.y - segment.p0.y };
  else if (atEnd) d = segment.p3.x !== segment.p2.x || segment.p3.y !== segment.p2.y ? { x: segment.p3.x - segment.p2.x, y: segment.p3.y - segment.p2.y } : { x: segment.p3.x - segment.p1.x, y: segment.p3.y - segment.p1.y };
  else d = segment.p1.x !== segment.p0.x || segment.p1.y !== segment.p0.y ? { x: segment.p1.x - segment.p0.x, y: segment.p1.y - segment.p0.y } : { x: segment.p2.x - segment.p0.x, y: segment.p2.y - segment.p0.y };
  if (d.x === 0 && d.y === 0) return undefined;
  return normalize(d);
}

/** The segment with its end (atEnd) or start moved to `point`; a cubic keeps its handles, hence its tangent there. */
function reEnded(segment: LineSegment | CubicSegment, atEnd: boolean, point: Point): LineSegment | CubicSegment {
  if (segment.kind === 'line') return atEnd ? line(segment.p0, point) : line(point, segment.p1);
  return atEnd ? cubic(segment.p0, segment.p1, segment.p2, point) : cubic(point, segment.p1, segment.p2, segment.p3);
}

function protrudes(segment: LineSegment | CubicSegment): boolean {
  return segment.kind === 'cubic' && segmentExtrema(segment).some((e) => e.protrusion > EXTREMUM_PROTRUSION_LIMIT);
}

/**
 * The contour with its tiny curves replaced by corners (see the header). `grid` is the
 * unit grid the contour will be rounded to; `forcedSmooth` are chain indices the user
 * forced smooth; `pixel` is the scan pixel in font units. Repeats until no curve is
 * replaced; a contour of three segments or fewer is returned unchanged, and so is the
 * segment that closes the contour.
 */
export function cornerTinyCurves(chain: BoundaryChain, contour: FittedContour, tolerance: number, grid: number, pixel: number, forcedSmooth: readonly number[] = []): FittedContour {
  let nodes = [...contour.nodes];
  let spans = [...contour.spans];
  const maxChord = TINY_CURVE_CELLS * grid;
  const minTurn = (TINY_CURVE_MIN_TURN_DEGREES * Math.PI) / 180;
  const clearance = FORCED_SMOOTH_CLEARANCE_PX * pixel;
  const nearForcedSmooth = (first: number, last: number): boolean => {
    const from = arcAt(chain, first) - clearance;
    const to = arcAt(chain, Math.max(first, last)) + clearance;
    return forcedSmooth.some((index) => [-1, 0, 1].some((lap) => {
      const s = arcAt(chain, index) + lap * chain.perimeter;
      return s >= from && s <= to;
    }));
  };
  let changed = true;
  let anyChange = false;
  while (changed && spans.length > 3) {
    changed = false;
    const n = spans.length;
    // The shortest curves first: replacing one changes its neighbours, and a shorter
    // curve is the surer picture of a corner. The last span, which closes the contour
    // onto node 0, is left alone: replacing it would move the contour's start (and the
    // node order the chain indices follow).
    const chordOf = (k: number): number => {
      const segment = spans[k]!.segment;
      return segment.kind === 'cubic' ? Math.hypot(segment.p3.x - segment.p0.x, segment.p3.y - segment.p0.y) : Infinity;
    };
    const candidates = spans.map((_, k) => k).filter((k) => k < n - 1 && chordOf(k) <= maxChord).sort((a, b) => chordOf(a) - chordOf(b));
    for (const i of candidates) {
      if (nearForcedSmooth(spans[i]!.first, spans[i]!.last)) continue;
      const replaced = asStraight(chain, nodes, spans, i, tolerance) ?? asCorner(chain, nodes, spans, i, tolerance, minTurn) ?? asBevel(chain, nodes, spans, i, tolerance, minTurn);
      if (!replaced) continue;
      nodes = replaced.nodes;
      spans = replaced.spans;
      changed = true;
      anyChange = true;
      break;
    }
  }
  return anyChange ? { nodes, spans } : contour;
}

type Contour = { nodes: FitNode[]; spans: FitSpan[] };

/** Span i (a tiny cubic) replaced by the corner where its neighbours' tangent lines meet, or undefined where that does not hold (see the header). */
function asCorner(chain: BoundaryChain, nodes: readonly FitNode[], spans: readonly FitSpan[], i: number, tolerance: number, minTurn: number): Contour | undefined {
  const n = spans.length;
  const tiny = spans[i]!;
  if (tiny.segment.kind !== 'cubic') return undefined;
  const { p0, p3 } = tiny.segment;
  const before = spans[(i - 1 + n) % n]!;
  const after = spans[(i + 1) % n]!;
  const incoming = endDirection(before.segment, true);
  const outgoing = endDirection(after.segment, false);
  if (!incoming || !outgoing || turnBetween(incoming, outgoing) <= minTurn) return undefined;
  const corner = intersectLines(p0, incoming, p3, outgoing);
  if (!corner) return undefined;
  // The corner lies ahead of the incoming side and behind the outgoing one.
  if ((corner.x - p0.x) * incoming.x + (corner.y - p0.y) * incoming.y < 0) return undefined;
  if ((p3.x - corner.x) * outgoing.x + (p3.y - corner.y) * outgoing.y < 0) return undefined;
  const newBefore = reEnded(before.segment, true, corner);
  const newAfter = reEnded(after.segment, false, corner);
  if (protrudes(newBefore) || protrudes(newAfter)) return undefined;
  // Both ways: the traced tip near the new sides, and the new corner near the curve it replaces (no spike).
  if (tiny.last >= tiny.first && !tipWithin(chain, [p0, corner, p3], tiny.first, tiny.last, tolerance)) return undefined;
  if (distanceToSegment(corner, tiny.segment) > tolerance) return undefined;
  const beforeError = measureSpanError(chain, newBefore, before.first, before.last, tolerance);
  const afterError = measureSpanError(chain, newAfter, after.first, after.last, tolerance);
  if (beforeError > Math.max(tolerance, before.maxError) || afterError > Math.max(tolerance, after.maxError)) return undefined;
  const cornerNode: FitNode = {
    point: corner,
    smooth: false,
    tangentIn: null,
    tangentOut: null,
    extremum: null,
    corner: null,
    index: Math.min(nodes[i + 1]!.index, Math.max(nodes[i]!.index, Math.round((tiny.first + tiny.last) / 2))),
    pinned: true,
  };
  const nextSpans = spans.slice();
  nextSpans[(i - 1 + n) % n] = { ...before, segment: newBefore, maxError: beforeError };
  nextSpans[(i + 1) % n] = { ...after, segment: newAfter, maxError: afterError };
  const nextNodes = nodes.slice();
  // The tiny span i and its end node i + 1 go; node i becomes the corner, so span
  // i − 1 arrives at it and the former span i + 1 leaves it.
  nextNodes[i] = cornerNode;
  return { nodes: nextNodes.filter((_, k) => k !== i + 1), spans: nextSpans.filter((_, k) => k !== i) };
}

/**
 * Largest turn (degrees) between two lines on either side of a tiny curve that are
 * taken for one line cut in two: 0.3°, the low end of the near-miss kink band
 * (quality-report.ts). Lines meeting at more than that are a bend the scan shows;
 * those this close are one stroke edge, and nothing but the cut lies between them.
 * Measured on the round trip of Linux Libertine at 1 px per unit: M's right stem came
 * out as two lines 0.02° apart, the line search stopped by a drift of 0.36 unit at one
 * end of their union, with a 2-unit curve and two near-miss kinks between them.
 */
const CUT_LINE_MAX_TURN_DEGREES = KINK_MIN_DEGREES;

/**
 * Spans i − 1, i and i + 1 (a line, a tiny cubic, a line) replaced by one line from
 * the first line's start to the second's end, or undefined unless the two lines turn
 * by at most {@link CUT_LINE_MAX_TURN_DEGREES}, the new line turns by no more than that
 * from either, and it holds every traced point of the three spans within the
 * tolerance. Left alone next to the span that closes the contour (replacing it would
 * move the contour's start).
 */
function asStraight(chain: BoundaryChain, nodes: readonly FitNode[], spans: readonly FitSpan[], i: number, tolerance: number): Contour | undefined {
  const n = spans.length;
  if (i < 1 || i + 1 > n - 2) return undefined;
  const before = spans[i - 1]!;
  const after = spans[i + 1]!;
  if (before.segment.kind !== 'line' || after.segment.kind !== 'line' || spans[i]!.segment.kind !== 'cubic') return undefined;
  const start = before.segment.p0;
  const end = after.segment.p1;
  const incoming = endDirection(before.segment, true);
  const outgoing = endDirection(after.segment, false);
  const merged = line(start, end);
  const through = endDirection(merged, false);
  if (!incoming || !outgoing || !through) return undefined;
  const maxTurn = (CUT_LINE_MAX_TURN_DEGREES * Math.PI) / 180;
  if (turnBetween(incoming, outgoing) > maxTurn || turnBetween(incoming, through) > maxTurn || turnBetween(through, outgoing) > maxTurn) return undefined;
  const error = measureSpanError(chain, merged, before.first, after.last, tolerance);
  if (error > tolerance) return undefined;
  const mergedSpan: FitSpan = { segment: merged, first: before.first, last: after.last, maxError: error, carrier: { through: start, direction: through } };
  const nextSpans = spans.slice();
  nextSpans[i - 1] = mergedSpan;
  // The curve and the second line go, and so do their start nodes i and i + 1.
  return { nodes: nodes.filter((_, k) => k !== i && k !== i + 1), spans: nextSpans.filter((_, k) => k !== i && k !== i + 1) };
}

/**
 * Span i (a tiny cubic) replaced by the straight chord between its ends, both ends
 * corners: the flat top of a narrow apex or stroke end, whose sides run too nearly
 * parallel to meet near it. Undefined unless both new corners turn by more than a kink
 * and every traced point of the curve is within the tolerance of the chord.
 */
function asBevel(chain: BoundaryChain, nodes: readonly FitNode[], spans: readonly FitSpan[], i: number, tolerance: number, minTurn: number): Contour | undefined {
  const n = spans.length;
  const tiny = spans[i]!;
  if (tiny.segment.kind !== 'cubic') return undefined;
  const { p0, p3 } = tiny.segment;
  if (p0.x === p3.x && p0.y === p3.y) return undefined;
  const chord = normalize({ x: p3.x - p0.x, y: p3.y - p0.y });
  const incoming = endDirection(spans[(i - 1 + n) % n]!.segment, true);
  const outgoing = endDirection(spans[(i + 1) % n]!.segment, false);
  if (!incoming || !outgoing || turnBetween(incoming, chord) <= minTurn || turnBetween(chord, outgoing) <= minTurn) return undefined;
  if (tiny.last >= tiny.first && !tipWithin(chain, [p0, p3], tiny.first, tiny.last, tolerance)) return undefined;
  const bevel = line(p0, p3);
  const nextSpans = spans.slice();
  nextSpans[i] = { ...tiny, segment: bevel, maxError: tiny.last >= tiny.first ? measureSpanError(chain, bevel, tiny.first, tiny.last, tolerance) : 0, carrier: null };
  const nextNodes = nodes.slice();
  for (const k of [i, (i + 1) % n]) nextNodes[k] = { ...nodes[k]!, smooth: false, tangentIn: null, tangentOut: null, pinned: true };
  return { nodes: nextNodes, spans: nextSpans };
}

/** The unsigned angle between two directions, radians. */
function turnBetween(u: Vec, v: Vec): number {
  return Math.abs(Math.atan2(u.x * v.y - u.y * v.x, u.x * v.x + u.y * v.y));
}

function distanceToSegment(p: Point, segment: CubicSegment): number {
  const nearest = nearestPoint(segment, p);
  return Math.hypot(nearest.point.x - p.x, nearest.point.y - p.y);
}

/** Every chain point of [first, last] within `tolerance` of the polyline through `vertices`. */
function tipWithin(chain: BoundaryChain, vertices: readonly Point[], first: number, last: number, tolerance: number): boolean {
  const xs = vertices.map((v) => v.x - chain.origin.x);
  const ys = vertices.map((v) => v.y - chain.origin.y);
  for (let k = first; k <= last; k++) {
    const i = ((k % chain.count) + chain.count) % chain.count;
    const px = chain.xs[i]!, py = chain.ys[i]!;
    let nearest = Infinity;
    for (let v = 0; v + 1 < vertices.length; v++) nearest = Math.min(nearest, toSegment(px, py, xs[v]!, ys[v]!, xs[v + 1]!, ys[v + 1]!));
    if (nearest > tolerance) return false;
  }
  return true;
}

function toSegment(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  const dx = bx - ax, dy = by - ay;
  const l2 = dx * dx + dy * dy;
  let t = l2 > 0 ? ((px - ax) * dx + (py - ay) * dy) / l2 : 0;
  t = t < 0 ? 0 : t > 1 ? 1 : t;
  return Math.hypot(px - ax - t * dx, py - ay - t * dy);
}
