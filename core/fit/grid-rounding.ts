/**
 * Rounding the fitted contour to the coordinate grid (integer font units by default)
 * without breaking smooth joins.
 *
 * Rounding each coordinate on its own turns a smooth join into a small kink: two
 * handles 40 units long, each moved by up to half a unit, meet at up to about 1°,
 * which shows in a curvature comb and in outline checks. Rounding is therefore done
 * per on-curve point together with its two handles:
 *
 * - axis-aligned smooth joins (every extremum, every join with a horizontal or
 *   vertical line): the on-curve point is rounded and the handles keep its x (vertical
 *   tangent) or y (horizontal tangent) exactly, so the join stays exactly smooth;
 * - other smooth joins between two cubics: integer points are searched near the
 *   ideal on-curve point (3 × 3 grid cells) and near each handle (5 × 5) for a triple
 *   that is exactly collinear (integer cross product 0, handles on opposite sides);
 *   the candidate nearest the ideal positions wins. Such a triple nearly always exists
 *   within these windows; when it does not, the triple with the smallest turn is used
 *   and the report lists the join if the turn exceeds the kink threshold;
 * - smooth joins between a sloped line and a cubic: the handle is the grid point near
 *   its ideal position that best continues the (rounded) line; exact only where the
 *   grid allows;
 * - corners: every coordinate rounded on its own.
 *
 * Lines stay exactly horizontal or vertical: their end points had equal coordinates
 * before rounding and round alike. The error against the chain is measured again.
 */
import type { Point, Vec } from '../geometry/vector.ts';
import { cubic, line } from '../geometry/segment.ts';
import type { BoundaryChain } from './boundary-chain.ts';
import type { FitNode, FitSpan, FittedContour } from './fitted-contour.ts';
import { measureSpanError } from './span-error.ts';

/** Search radius (grid cells) around the ideal on-curve point. */
const POINT_SEARCH_RADIUS = 1;
/** Search radius (grid cells) around each ideal handle. */
const HANDLE_SEARCH_RADIUS = 2;

/** The handle positions chosen for one on-curve point. */
interface RoundedJoin {
  point: Point;
  /** The handle of the arriving cubic (its p2), if that span is a cubic. */
  handleIn: Point | undefined;
  /** The handle of the leaving cubic (its p1), if that span is a cubic. */
  handleOut: Point | undefined;
}

/**
 * The contour with every coordinate a multiple of `grid` (see the header for how
 * smooth joins are kept). Node tangents are replaced by the rounded handles'
 * directions; span errors are re-measured against the chain (exact above `tolerance`).
 */
export function roundToGrid(chain: BoundaryChain, contour: FittedContour, grid: number, tolerance: number): FittedContour {
  const snap = (v: number): number => Math.round(v / grid) * grid;
  const { nodes, spans } = contour;
  const n = nodes.length;
  const joins: RoundedJoin[] = nodes.map((node, i) => {
    const before = spans[(i - 1 + n) % n]!.segment;
    const after = spans[i]!.segment;
    const handleIn = before.kind === 'cubic' ? before.p2 : undefined;
    const handleOut = after.kind === 'cubic' ? after.p1 : undefined;
    // A line end may move by a cell only when the line's other end is a corner (it does
    // not move with this one); two smooth ends moving independently would turn the line.
    const otherEnd = before.kind === 'line' ? nodes[(i - 1 + n) % n]! : after.kind === 'line' ? nodes[(i + 1) % n]! : undefined;
    const mayMove = otherEnd === undefined || !otherEnd.smooth;
    return roundJoin(node, handleIn, handleOut, before.kind === 'line' ? before.p0 : undefined, after.kind === 'line' ? after.p1 : undefined, grid, snap, mayMove);
  });
  const roundedSpans: FitSpan[] = spans.map((span, i) => {
    const start = joins[i]!;
    const end = joins[(i + 1) % n]!;
    const segment = span.segment.kind === 'line' ? line(start.point, end.point) : cubic(start.point, start.handleOut!, end.handleIn!, end.point);
    return { ...span, segment, maxError: measureSpanError(chain, segment, span.first, span.last, tolerance) };
  });
  const roundedNodes: FitNode[] = nodes.map((node, i) => ({ ...node, point: joins[i]!.point }));
  return { nodes: roundedNodes, spans: roundedSpans };
}

function roundJoin(node: FitNode, handleIn: Point | undefined, handleOut: Point | undefined, lineFrom: Point | undefined, lineTo: Point | undefined, grid: number, snap: (v: number) => number, mayMove: boolean): RoundedJoin {
  const p = node.point;
  const rounded = { x: snap(p.x), y: snap(p.y) };
  const roundPoint = (q: Point): Point => ({ x: snap(q.x), y: snap(q.y) });
  const tangent = node.smooth ? node.tangentOut : null;
  if (!tangent) {
    return { point: rounded, handleIn: handleIn && nonDegenerate(roundPoint(handleIn), rounded, handleIn, p, grid), handleOut: handleOut && nonDegenerate(roundPoint(handleOut), rounded, handleOut, p, grid) };
  }
  if (tangent.x === 0 || tangent.y === 0) {
    // Axis-aligned: handles keep the point's other coordinate exactly.
    const alongAxis = (h: Point, sign: number): Point => {
      if (tangent.y === 0) {
        let x = snap(h.x - p.x + rounded.x);
        if ((x - rounded.x) * tangent.x * sign <= 0) x = rounded.x + sign * tangent.x * grid;
        return { x, y: rounded.y };
      }
      let y = snap(h.y - p.y + rounded.y);
      if ((y - rounded.y) * tangent.y * sign <= 0) y = rounded.y + sign * tangent.y * grid;
      return { x: rounded.x, y };
    };
    return { point: rounded, handleIn: handleIn && alongAxis(handleIn, -1), handleOut: handleOut && alongAxis(handleOut, 1) };
  }
  if (handleIn && handleOut) return collinearTriple(p, handleIn, handleOut, grid, snap);
  // A sloped line on one side: continue the rounded line's direction as closely as the
  // grid allows, moving the on-curve point by up to one cell when that helps.
  const lineEnd = lineFrom ?? lineTo;
  const handle = (handleIn ?? handleOut) as Point;
  const sign = lineFrom ? 1 : -1;
  let best: { point: Point; handle: Point; score: number } | undefined;
  const radius = mayMove ? POINT_SEARCH_RADIUS : 0;
  for (let a = -radius; a <= radius; a++) {
    for (let b = -radius; b <= radius; b++) {
      const q = { x: rounded.x + a * grid, y: rounded.y + b * grid };
      const direction = lineEnd ? unit({ x: q.x - snap(lineEnd.x), y: q.y - snap(lineEnd.y) }, sign) : tangent;
      const found = bestHandleOnDirection(q, handle, p, direction, sign, grid, snap);
      const moved = Math.hypot(q.x - p.x, q.y - p.y) / grid;
      const score = found.score + moved * POINT_MOVE_WEIGHT;
      if (!best || score < best.score) best = { point: q, handle: found.handle, score };
    }
  }
  const chosen = best as { point: Point; handle: Point };
  return handleIn ? { point: chosen.point, handleIn: chosen.handle, handleOut: undefined } : { point: chosen.point, handleIn: undefined, handleOut: chosen.handle };
}

/** Weight of moving the on-curve point by one cell against the handle's length cost (score units). */
const POINT_MOVE_WEIGHT = 0.05;

function unit(v: Vec, sign: number): Vec {
  const l = Math.hypot(v.x, v.y) || 1;
  return { x: (sign * v.x) / l, y: (sign * v.y) / l };
}

/** A rounded handle that collapsed onto its rounded on-curve point is pushed one cell along its original direction. */
function nonDegenerate(h: Point, point: Point, original: Point, originalPoint: Point, grid: number): Point {
  if (h.x !== point.x || h.y !== point.y) return h;
  const dx = original.x - originalPoint.x;
  const dy = original.y - originalPoint.y;
  if (Math.abs(dx) >= Math.abs(dy)) return { x: point.x + Math.sign(dx || 1) * grid, y: point.y };
  return { x: point.x, y: point.y + Math.sign(dy || 1) * grid };
}

/**
 * Handle lengths searched, as shares of the ideal length, for a handle that must
 * continue a sloped line: lattice points lie close to a line of arbitrary slope only
 * here and there, so the search runs along the line (85–115 % of the length: a
 * handle that much longer or shorter moves the curve by at most about 7 % of the
 * handle, 0.44 × 15 %) and picks the point
 * whose direction is closest to the line's.
 */
const SLOPED_HANDLE_MIN_SHARE = 0.85;
const SLOPED_HANDLE_MAX_SHARE = 1.15;
/** Directions within this sine of the line's (≈ 0.06°) count as exactly continuing it. */
const COLLINEAR_SINE = 1e-3;

/**
 * The grid point whose direction from the on-curve point best continues `direction`
 * (which points from the point into the line for an incoming handle, sign −1): among
 * lattice points within a cell of the line and 85–115 % of the ideal handle length,
 * those nearly collinear (sine below {@link COLLINEAR_SINE}) nearest the ideal length
 * win; otherwise the smallest turn.
 */
function bestHandleOnDirection(point: Point, handle: Point, originalPoint: Point, direction: Vec, sign: number, grid: number, snap: (v: number) => number): { handle: Point; score: number } {
  const ideal = { x: handle.x - originalPoint.x + point.x, y: handle.y - originalPoint.y + point.y };
  const want = sign > 0 ? direction : { x: -direction.x, y: -direction.y };
  const idealLength = Math.hypot(ideal.x - point.x, ideal.y - point.y);
  const steps = Math.max(1, Math.ceil(((SLOPED_HANDLE_MAX_SHARE - SLOPED_HANDLE_MIN_SHARE) * idealLength) / grid));
  let best = { x: snap(ideal.x), y: snap(ideal.y) };
  let bestScore = Infinity;
  for (let k = 0; k <= steps; k++) {
    const along = (SLOPED_HANDLE_MIN_SHARE + ((SLOPED_HANDLE_MAX_SHARE - SLOPED_HANDLE_MIN_SHARE) * k) / steps) * idealLength;
    const cx = snap(point.x + want.x * along);
    const cy = snap(point.y + want.y * along);
    for (let dx = -1; dx <= 1; dx++) {
      for (let dy = -1; dy <= 1; dy++) {
        const h = { x: cx + dx * grid, y: cy + dy * grid };
        const vx = h.x - point.x;
        const vy = h.y - point.y;
        const l = Math.hypot(vx, vy);
        if (l === 0 || (vx * want.x + vy * want.y) / l <= 0) continue;
        const sine = Math.abs(vx * want.y - vy * want.x) / l;
        const lengthCost = Math.abs(l - idealLength) / Math.max(idealLength, grid);
        const score = sine <= COLLINEAR_SINE ? lengthCost : 1 + sine * 1e3 + lengthCost;
        if (score < bestScore) {
          bestScore = score;
          best = h;
        }
      }
    }
  }
  return { handle: best, score: bestScore };
}

/**
 * Grid points for an on-curve point and both its handles, exactly collinear with the
 * handles on opposite sides when the search windows contain such a triple, nearest to
 * the ideal positions among those; otherwise the triple with the smallest turn.
 */
function collinearTriple(p: Point, handleIn: Point, handleOut: Point, grid: number, snap: (v: number) => number): RoundedJoin {
  const px = snap(p.x);
  const py = snap(p.y);
  const ix = snap(handleIn.x);
  const iy = snap(handleIn.y);
  const ox = snap(handleOut.x);
  const oy = snap(handleOut.y);
  let bestExact = Infinity;
  let bestInexact = Infinity;
  let best: RoundedJoin | undefined;
  let fallback: RoundedJoin | undefined;
  const cost = (x: number, y: number, ideal: Point): number => ((x - ideal.x) ** 2 + (y - ideal.y) ** 2) / (grid * grid);
  for (let a = -POINT_SEARCH_RADIUS; a <= POINT_SEARCH_RADIUS; a++) {
    for (let b = -POINT_SEARCH_RADIUS; b <= POINT_SEARCH_RADIUS; b++) {
      const qx = px + a * grid;
      const qy = py + b * grid;
      const pointCost = cost(qx, qy, p);
      for (let c = -HANDLE_SEARCH_RADIUS; c <= HANDLE_SEARCH_RADIUS; c++) {
        for (let d = -HANDLE_SEARCH_RADIUS; d <= HANDLE_SEARCH_RADIUS; d++) {
          const hx = ix + c * grid;
          const hy = iy + d * grid;
          // Incoming handle vector (from the handle to the point), in grid units.
          const ux = Math.round((qx - hx) / grid);
          const uy = Math.round((qy - hy) / grid);
          if (ux === 0 && uy === 0) continue;
          const inCost = pointCost + cost(hx, hy, handleIn);
          if (inCost >= bestExact) continue;
          for (let e = -HANDLE_SEARCH_RADIUS; e <= HANDLE_SEARCH_RADIUS; e++) {
            for (let f = -HANDLE_SEARCH_RADIUS; f <= HANDLE_SEARCH_RADIUS; f++) {
              const gx = ox + e * grid;
              const gy = oy + f * grid;
              const vx = Math.round((gx - qx) / grid);
              const vy = Math.round((gy - qy) / grid);
              if (vx === 0 && vy === 0) continue;
              const dotProduct = ux * vx + uy * vy;
              if (dotProduct <= 0) continue;
              const crossProduct = ux * vy - uy * vx;
              const total = inCost + cost(gx, gy, handleOut);
              if (crossProduct === 0) {
                if (total < bestExact) {
                  bestExact = total;
                  best = { point: { x: qx, y: qy }, handleIn: { x: hx, y: hy }, handleOut: { x: gx, y: gy } };
                }
              } else if (best === undefined) {
                const sine = Math.abs(crossProduct) / (Math.hypot(ux, uy) * Math.hypot(vx, vy));
                const score = sine * 1e4 + total;
                if (score < bestInexact) {
                  bestInexact = score;
                  fallback = { point: { x: qx, y: qy }, handleIn: { x: hx, y: hy }, handleOut: { x: gx, y: gy } };
                }
              }
            }
          }
        }
      }
    }
  }
  return best ?? fallback ?? { point: { x: px, y: py }, handleIn: { x: ix, y: iy }, handleOut: { x: ox, y: oy } };
}
