/**
 * Finishing touches on the fitted contour before rounding: fewer segments where one
 * cubic suffices, and handles that neither cross nor reach backwards.
 *
 * Merging complements the breakpoint search (minimum-segments.ts), which is optimal
 * only within each stretch between fixed points: after extrema have been split off
 * and corners moved, two neighbouring cubics joined at an unpinned smooth point may
 * fit as one. Handle checks catch the shapes a least-squares solve can produce on
 * awkward data and no designer would draw: the two handles of one cubic crossing each
 * other (the curve then has a loop or a cusp-like kink), or a handle pointing past the
 * far end of the segment. Both are fixed by shortening the offending handles to the
 * point where the two tangent lines meet (respectively to the chord's length), which
 * keeps the tangent directions and therefore every G1 join.
 */
import type { Point, Vec } from '../geometry/vector.ts';
import { cubic, type CubicSegment } from '../geometry/segment.ts';
import type { BoundaryChain } from './boundary-chain.ts';
import { intersectLines } from './corners.ts';
import { sideLine } from './corner-sharpening.ts';
import { EXTREMUM_PROTRUSION_LIMIT, segmentExtrema } from './extrema.ts';
import type { FitSpan, FittedContour } from './fitted-contour.ts';
import { fitCubic } from './least-squares.ts';
import { measureSpanError } from './span-error.ts';

/**
 * Merges pairs of cubics across unpinned smooth nodes wherever one cubic with the
 * outer tangents fits their joint data within the tolerance and has no protruding
 * extremum. Repeats until no merge succeeds. Pinned nodes (corners, line ends,
 * extrema, forced points) are never removed.
 */
export function mergeSegments(chain: BoundaryChain, contour: FittedContour, tolerance: number): FittedContour {
  const nodes = contour.nodes.slice();
  const spans = contour.spans.slice();
  let merged = true;
  while (merged && nodes.length > 2) {
    merged = false;
    for (let i = 0; i < nodes.length; i++) {
      const node = nodes[i]!;
      if (node.pinned || !node.smooth) continue;
      const n = nodes.length;
      const before = spans[(i - 1 + n) % n]!;
      const after = spans[i]!;
      if (before.segment.kind !== 'cubic' || after.segment.kind !== 'cubic') continue;
      const start = nodes[(i - 1 + n) % n]!;
      const end = nodes[(i + 1) % n]!;
      const first = before.first;
      let last = after.last;
      if (last < first) last += chain.count;
      const fit = fitCubic({ chain, first, last, start: start.point, end: end.point, startTangent: start.tangentOut, endTangent: end.tangentIn }, tolerance, false, true);
      if (fit.maxError > tolerance) continue;
      if (segmentExtrema(fit.segment).some((e) => e.protrusion > EXTREMUM_PROTRUSION_LIMIT)) continue;
      const span: FitSpan = { segment: fit.segment, first, last, maxError: fit.maxError, carrier: null };
      if (i === 0) {
        // Node 0 goes: the merged span becomes the last one and the contour starts at node 1.
        spans.splice(n - 1, 1);
        spans.splice(0, 1, span);
        nodes.splice(0, 1);
        spans.push(spans.shift()!);
      } else {
        spans.splice(i - 1, 2, span);
        nodes.splice(i, 1);
      }
      merged = true;
      break;
    }
  }
  return { nodes, spans };
}

/** True when the handles P0→P1 and P3→P2 cross each other (both reach past the tangent lines' meeting point). */
export function handlesCross(segment: CubicSegment): boolean {
  return crossingPoint(segment) !== undefined;
}

function crossingPoint(segment: CubicSegment): Point | undefined {
  const { p0, p1, p2, p3 } = segment;
  const u = { x: p1.x - p0.x, y: p1.y - p0.y };
  const v = { x: p2.x - p3.x, y: p2.y - p3.y };
  const lu = u.x * u.x + u.y * u.y;
  const lv = v.x * v.x + v.y * v.y;
  if (lu === 0 || lv === 0) return undefined;
  const meet = intersectLines(p0, u, p3, v);
  if (!meet) return undefined;
  const a = ((meet.x - p0.x) * u.x + (meet.y - p0.y) * u.y) / lu;
  const b = ((meet.x - p3.x) * v.x + (meet.y - p3.y) * v.y) / lv;
  return a > 0 && a < 1 && b > 0 && b < 1 ? meet : undefined;
}

/** True when a handle's projection on the chord reaches past the segment's far end. */
export function handleReachesBackwards(segment: CubicSegment): boolean {
  const { p0, p1, p2, p3 } = segment;
  const cx = p3.x - p0.x;
  const cy = p3.y - p0.y;
  const chord = cx * cx + cy * cy;
  return (p1.x - p0.x) * cx + (p1.y - p0.y) * cy > chord || (p3.x - p2.x) * cx + (p3.y - p2.y) * cy > chord;
}

/**
 * Shortens crossing handles to the tangent lines' meeting point and backward-reaching
 * handles to the chord length; directions are kept, so smooth joins stay smooth. The
 * error is measured again; a fix that breaks the tolerance is still applied (a looped
 * or crossed cubic is worse) and shows in the report.
 */
export function fixCrossingHandles(chain: BoundaryChain, contour: FittedContour, tolerance: number): FittedContour {
  const spans = contour.spans.map((span) => {
    if (span.segment.kind !== 'cubic') return span;
    let segment = span.segment;
    const meet = crossingPoint(segment);
    if (meet) segment = cubic(segment.p0, meet, meet, segment.p3);
    if (handleReachesBackwards(segment)) {
      const { p0, p1, p2, p3 } = segment;
      const cx = p3.x - p0.x;
      const cy = p3.y - p0.y;
      const chord = cx * cx + cy * cy;
      const limit = (q: Point, from: Point, sign: number): Point => {
        const reach = sign * ((q.x - from.x) * cx + (q.y - from.y) * cy);
        if (reach <= chord) return q;
        const f = chord / reach;
        return { x: from.x + (q.x - from.x) * f, y: from.y + (q.y - from.y) * f };
      };
      segment = cubic(p0, limit(p1, p0, 1), limit(p2, p3, -1), p3);
    }
    if (segment === span.segment) return span;
    return { ...span, segment, maxError: measureSpanError(chain, segment, span.first, span.last, tolerance) };
  });
  return { nodes: contour.nodes, spans };
}

/**
 * Turn below which a corner is made smooth: 8°, the top of the near-miss kink range
 * (quality-report.ts). A corner the fit leaves at such a small turn was a tight curve
 * or a noise artefact, and as a corner it would show as a kink.
 */
export const SMOOTHING_TURN_DEGREES = 8;

/**
 * Corners whose fitted sides meet at a turn below {@link SMOOTHING_TURN_DEGREES} become
 * smooth points: the tangent is the mean of the two side directions, both sides are
 * refitted with it (a line side keeps its direction and the other side takes it), and
 * the change is kept only if the tolerance still holds. User-forced corners are left.
 */
export function smoothShallowCorners(chain: BoundaryChain, contour: FittedContour, tolerance: number): FittedContour {
  const nodes = contour.nodes.slice();
  const spans = contour.spans.slice();
  const n = nodes.length;
  for (let i = 0; i < n; i++) {
    const node = nodes[i]!;
    if (node.smooth || node.corner?.forced) continue;
    const inIndex = (i - 1 + n) % n;
    const before = spans[inIndex]!;
    const after = spans[i]!;
    // The sides' directions where their data begin, outside the rounded tip: a short
    // last cubic may hook into the corner, and its end handle says nothing about the turn.
    const inDirection = sideLine(chain, before, true)?.direction;
    const outDirection = sideLine(chain, after, false)?.direction;
    if (!inDirection || !outDirection) continue;
    const turn = Math.abs(Math.atan2(inDirection.x * outDirection.y - inDirection.y * outDirection.x, inDirection.x * outDirection.x + inDirection.y * outDirection.y));
    if ((turn * 180) / Math.PI >= SMOOTHING_TURN_DEGREES) continue;
    if (before.segment.kind === 'line' && after.segment.kind === 'line') continue;
    let tangent: Vec;
    if (before.segment.kind === 'line') tangent = inDirection;
    else if (after.segment.kind === 'line') tangent = outDirection;
    else {
      const sx = inDirection.x + outDirection.x;
      const sy = inDirection.y + outDirection.y;
      const l = Math.hypot(sx, sy);
      tangent = { x: sx / l, y: sy / l };
    }
    const smooth = { ...node, smooth: true, tangentIn: tangent, tangentOut: tangent, corner: null };
    const previous = nodes[inIndex]!;
    const next = nodes[(i + 1) % n]!;
    const refit = (span: FitSpan, start: typeof node, end: typeof node): FitSpan | undefined => {
      if (span.segment.kind === 'line') return span;
      const fit = fitCubic({ chain, first: span.first, last: span.last, start: start.point, end: end.point, startTangent: start.tangentOut, endTangent: end.tangentIn }, tolerance, false, true);
      return fit.maxError <= tolerance ? { ...span, segment: fit.segment, maxError: fit.maxError } : undefined;
    };
    const newBefore = refit(before, previous, smooth);
    const newAfter = refit(after, smooth, next);
    if (!newBefore || !newAfter) continue;
    nodes[i] = smooth;
    spans[inIndex] = newBefore;
    spans[i] = newAfter;
  }
  return { nodes, spans };
}

