/**
 * Corner sharpening: each corner is moved to where its two fitted sides meet.
 *
 * The traced boundary rounds every corner (anti-aliasing by half a pixel to a pixel,
 * blur by more), and a fit that follows it ends in a rounded tip. A designer's corner
 * is where the sides meet: here, the intersection of the two sides' tangent lines
 * taken where the sides' data begin (outside the rounded tip), the line itself for a
 * line side. The corner moves there when the intersection lies within the corner's
 * reach of the traced apex (corners.ts: a tip rounded with radius r lies at most
 * r/sin(opening/2) inside the sharp corner), and the adjacent curves are fitted again
 * to the new corner point. The move is kept only if the tolerance still holds on the
 * sides' data; it is repeated so that the corner and the fits agree.
 */
import type { Point, Vec } from '../geometry/vector.ts';
import { normalize } from '../geometry/vector.ts';
import { derivative, evaluate, line, type CubicSegment, type LineSegment } from '../geometry/segment.ts';
import { nearestPoint } from '../geometry/nearest.ts';
import { chainPoint, type BoundaryChain } from './boundary-chain.ts';
import { intersectLines } from './corners.ts';
import type { FitNode, FitSpan, FittedContour } from './fitted-contour.ts';
import { fitCubic } from './least-squares.ts';
import { measureSpanError } from './span-error.ts';

/** Rounds of intersect-and-refit: the second round settles what the first moved (more changes < 0.1 unit). */
const SHARPENING_ROUNDS = 2;
/** Moves shorter than this (font units) are not worth a refit. */
const NEGLIGIBLE_MOVE = 0.05;

/** The tangent line of a side where its data meet the corner's rounded tip. */
export function sideLine(chain: BoundaryChain, span: FitSpan, atEnd: boolean): { point: Point; direction: Vec } | undefined {
  if (span.segment.kind === 'line') {
    if (span.carrier) return { point: span.carrier.through, direction: span.carrier.direction };
    const d = normalize({ x: span.segment.p1.x - span.segment.p0.x, y: span.segment.p1.y - span.segment.p0.y });
    return { point: span.segment.p0, direction: d };
  }
  if (span.last < span.first) return undefined;
  const boundary = chainPoint(chain, atEnd ? span.last : span.first);
  const t = nearestPoint(span.segment, boundary).t;
  const direction = normalize(derivative(span.segment, t));
  if (direction.x === 0 && direction.y === 0) return undefined;
  return { point: evaluate(span.segment, t), direction };
}

/** The span refitted (cubic) or re-ended (line) with a new start or end point. */
function refit(chain: BoundaryChain, span: FitSpan, start: FitNode, end: FitNode, startPoint: Point, endPoint: Point, tolerance: number): FitSpan {
  if (span.segment.kind === 'line') {
    const segment: LineSegment = line(startPoint, endPoint);
    return { ...span, segment, maxError: measureSpanError(chain, segment, span.first, span.last, tolerance) };
  }
  const fit = fitCubic({ chain, first: span.first, last: span.last, start: startPoint, end: endPoint, startTangent: start.tangentOut, endTangent: end.tangentIn }, tolerance);
  const segment: CubicSegment = fit.segment;
  return { ...span, segment, maxError: fit.maxError };
}

/**
 * The contour with its corners sharpened (see the header). Never moves a corner by
 * more than its reach from the traced apex, never moves a corner off an adjacent
 * line, and never accepts a move that takes a side beyond the tolerance (or beyond its
 * previous error, if that was already larger).
 */
export function sharpenCorners(chain: BoundaryChain, contour: FittedContour, tolerance: number): FittedContour {
  const nodes = contour.nodes.slice();
  const spans = contour.spans.slice();
  const n = nodes.length;
  if (n < 2) return contour;
  for (let round = 0; round < SHARPENING_ROUNDS; round++) {
    for (let i = 0; i < n; i++) {
      const node = nodes[i]!;
      const corner = node.corner;
      if (!corner || node.smooth) continue;
      const inIndex = (i - 1 + n) % n;
      const incoming = spans[inIndex]!;
      const outgoing = spans[i]!;
      if (incoming.segment.kind === 'line' && outgoing.segment.kind === 'line') continue; // already the lines' intersection
      const a = sideLine(chain, incoming, true);
      const b = sideLine(chain, outgoing, false);
      if (!a || !b) continue;
      const meet = intersectLines(a.point, a.direction, b.point, b.direction);
      if (!meet) continue;
      const apex = chainPoint(chain, corner.index);
      if (Math.hypot(meet.x - apex.x, meet.y - apex.y) > corner.reach) continue;
      if (Math.hypot(meet.x - node.point.x, meet.y - node.point.y) < NEGLIGIBLE_MOVE) continue;
      // The corner must lie ahead of the incoming side and behind the outgoing one.
      if ((meet.x - a.point.x) * a.direction.x + (meet.y - a.point.y) * a.direction.y < -corner.roundingZone) continue;
      if ((b.point.x - meet.x) * b.direction.x + (b.point.y - meet.y) * b.direction.y < -corner.roundingZone) continue;
      const previousNode = nodes[inIndex]!;
      const nextNode = nodes[(i + 1) % n]!;
      const moved: FitNode = { ...node, point: meet };
      const newIncoming = refit(chain, incoming, previousNode, moved, previousNode.point, meet, tolerance);
      const newOutgoing = refit(chain, outgoing, moved, nextNode, meet, nextNode.point, tolerance);
      if (newIncoming.maxError > Math.max(tolerance, incoming.maxError)) continue;
      if (newOutgoing.maxError > Math.max(tolerance, outgoing.maxError)) continue;
      nodes[i] = moved;
      spans[inIndex] = newIncoming;
      spans[i] = newOutgoing;
    }
  }
  return { nodes, spans };
}
