/**
 * A closed traced boundary prepared for fitting: coordinates in typed arrays, the
 * cumulative arc length, and prefix sums of the first and second moments.
 *
 * Every stage of the fitter asks questions about stretches of the chain ("which line
 * fits these points best", "where is this arc length"), thousands of times per
 * glyph. With prefix sums of x, y, x², y² and xy, the total-least-squares line of any
 * stretch costs O(1) instead of O(length), and typed arrays keep the inner loops free
 * of per-point allocation. The chain is closed: indices are taken modulo its length,
 * and "unwrapped" indices (any integer, negative or ≥ count) run round it repeatedly,
 * so a stretch may cross the seam between the last and the first point.
 */
import type { Point } from '../geometry/vector.ts';

export interface BoundaryChain {
  /** Number of distinct points. */
  readonly count: number;
  /** Coordinates relative to `origin` (keeps the moment sums well conditioned). */
  readonly xs: Float64Array;
  readonly ys: Float64Array;
  /** The chain's centroid; add it back to get font-unit coordinates. */
  readonly origin: Point;
  /** arc[i]: arc length from point 0 to point i along the chain; arc[count] = perimeter. */
  readonly arc: Float64Array;
  readonly perimeter: number;
  /** Prefix sums over points 0…i−1 (length count + 1) of x, y, x², y², x·y. */
  readonly sumX: Float64Array;
  readonly sumY: Float64Array;
  readonly sumXX: Float64Array;
  readonly sumYY: Float64Array;
  readonly sumXY: Float64Array;
  /** Median step between consecutive points: the scale of one scan pixel, in font units. */
  readonly medianStep: number;
}

/**
 * Prepares a closed chain. Consecutive duplicates (and a repeated closing point) are
 * dropped; the input is not modified. Indices of the result refer to the de-duplicated
 * points: `keptIndices[k]` is the input index of point k.
 * Limit: needs at least 3 distinct points; throws a RangeError otherwise.
 */
export function prepareChain(points: readonly Point[]): { chain: BoundaryChain; keptIndices: Int32Array } {
  const kept: number[] = [];
  for (let i = 0; i < points.length; i++) {
    const p = points[i] as Point;
    const previous = kept.length > 0 ? (points[kept[kept.length - 1] as number] as Point) : undefined;
    if (!Number.isFinite(p.x) || !Number.isFinite(p.y)) throw new RangeError(`chain point ${i} is not finite`);
    if (previous === undefined || previous.x !== p.x || previous.y !== p.y) kept.push(i);
  }
  while (kept.length > 1) {
    const first = points[kept[0] as number] as Point;
    const last = points[kept[kept.length - 1] as number] as Point;
    if (first.x === last.x && first.y === last.y) kept.pop();
    else break;
  }
  const count = kept.length;
  if (count < 3) throw new RangeError(`a closed chain needs at least 3 distinct points, got ${count}`);
  let cx = 0;
  let cy = 0;
  for (const k of kept) {
    cx += (points[k] as Point).x;
    cy += (points[k] as Point).y;
  }
  cx /= count;
  cy /= count;
  const xs = new Float64Array(count);
  const ys = new Float64Array(count);
  kept.forEach((k, i) => {
    xs[i] = (points[k] as Point).x - cx;
    ys[i] = (points[k] as Point).y - cy;
  });
  const arc = new Float64Array(count + 1);
  const steps = new Float64Array(count);
  for (let i = 0; i < count; i++) {
    const j = (i + 1) % count;
    const step = Math.hypot(xs[j]! - xs[i]!, ys[j]! - ys[i]!);
    steps[i] = step;
    arc[i + 1] = arc[i]! + step;
  }
  const sumX = new Float64Array(count + 1);
  const sumY = new Float64Array(count + 1);
  const sumXX = new Float64Array(count + 1);
  const sumYY = new Float64Array(count + 1);
  const sumXY = new Float64Array(count + 1);
  for (let i = 0; i < count; i++) {
    const x = xs[i]!;
    const y = ys[i]!;
    sumX[i + 1] = sumX[i]! + x;
    sumY[i + 1] = sumY[i]! + y;
    sumXX[i + 1] = sumXX[i]! + x * x;
    sumYY[i + 1] = sumYY[i]! + y * y;
    sumXY[i + 1] = sumXY[i]! + x * y;
  }
  steps.sort();
  const medianStep = steps[count >> 1]!;
  return {
    chain: { count, xs, ys, origin: { x: cx, y: cy }, arc, perimeter: arc[count]!, sumX, sumY, sumXX, sumYY, sumXY, medianStep },
    keptIndices: Int32Array.from(kept),
  };
}

/** The chain index (0 ≤ result < count) of an unwrapped index. */
export function wrapIndex(chain: BoundaryChain, index: number): number {
  const n = chain.count;
  return ((index % n) + n) % n;
}

/** Arc length from point 0 to the unwrapped index (beyond one lap it keeps growing). */
export function arcAt(chain: BoundaryChain, index: number): number {
  const n = chain.count;
  const lap = Math.floor(index / n);
  return lap * chain.perimeter + chain.arc[index - lap * n]!;
}

/** Point (font units) at an unwrapped index. */
export function chainPoint(chain: BoundaryChain, index: number): Point {
  const i = wrapIndex(chain, index);
  return { x: chain.xs[i]! + chain.origin.x, y: chain.ys[i]! + chain.origin.y };
}

/**
 * The unwrapped index of the last point whose arc position is ≤ `position` (itself
 * an unwrapped arc length, any real), by binary search within the lap.
 */
export function indexAtArc(chain: BoundaryChain, position: number): number {
  const lap = Math.floor(position / chain.perimeter);
  const within = position - lap * chain.perimeter;
  const arc = chain.arc;
  let lo = 0;
  let hi = chain.count - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (arc[mid]! <= within) lo = mid;
    else hi = mid - 1;
  }
  return lap * chain.count + lo;
}

/**
 * Second moments of the points in the unwrapped range [first, last]: count, mean and
 * the covariance entries, in chain-relative coordinates.
 */
export interface RangeMoments {
  count: number;
  meanX: number;
  meanY: number;
  cxx: number;
  cyy: number;
  cxy: number;
}

/** Fills `out` with the moments of [first, last] (inclusive, unwrapped, last ≥ first). O(1). */
export function rangeMoments(chain: BoundaryChain, first: number, last: number, out: RangeMoments): RangeMoments {
  const m = last - first + 1;
  // Each sum is the prefix below last + 1 less the prefix below first, whole laps
  // counted by the perimeter totals; the laps of both ends are found once for all five.
  const n = chain.count;
  const lapHigh = Math.floor((last + 1) / n);
  const high = last + 1 - lapHigh * n;
  const lapLow = Math.floor(first / n);
  const low = first - lapLow * n;
  const { sumX, sumY, sumXX, sumYY, sumXY } = chain;
  const mx = (lapHigh * sumX[n]! + sumX[high]! - (lapLow * sumX[n]! + sumX[low]!)) / m;
  const my = (lapHigh * sumY[n]! + sumY[high]! - (lapLow * sumY[n]! + sumY[low]!)) / m;
  out.count = m;
  out.meanX = mx;
  out.meanY = my;
  out.cxx = Math.max(0, (lapHigh * sumXX[n]! + sumXX[high]! - (lapLow * sumXX[n]! + sumXX[low]!)) / m - mx * mx);
  out.cyy = Math.max(0, (lapHigh * sumYY[n]! + sumYY[high]! - (lapLow * sumYY[n]! + sumYY[low]!)) / m - my * my);
  out.cxy = (lapHigh * sumXY[n]! + sumXY[high]! - (lapLow * sumXY[n]! + sumXY[low]!)) / m - mx * my;
  return out;
}

/** A fresh moments record to reuse as scratch space. */
export function emptyMoments(): RangeMoments {
  return { count: 0, meanX: 0, meanY: 0, cxx: 0, cyy: 0, cxy: 0 };
}
