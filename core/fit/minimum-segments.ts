/**
 * Fewest cubic segments for a curved stretch, by a shortest-path search over
 * candidate breakpoints.
 *
 * Recursive splitting at the worst point (Schneider 1990, "An Algorithm for
 * Automatically Fitting Digitized Curves", Graphics Gems) finds *a* piecewise fit under
 * the tolerance, but splits where the error happens to peak, so it often uses more
 * segments than needed and puts on-curve points where a designer would not. Choosing
 * breakpoints that minimise the number of segments is a shortest-path problem over
 * candidate breakpoints (for polygons: Imai & Iri 1986, "Computational-geometric
 * methods for polygonal approximations of a curve", Computer Vision, Graphics, and
 * Image Processing 36). When feasibility is monotone — a stretch that fits, fits also
 * when shortened — the greedy path that always reaches as far as possible is a
 * shortest path (the classical argument for interval covering), and each farthest
 * reach is found by exponential and binary search, O(k log m) fits for k segments over
 * m candidates instead of the O(m²) of a full dynamic programme. The greedy path puts
 * the slack at the end; the path is then balanced by also walking greedily backwards
 * and moving each breakpoint to the middle of its forward and backward positions
 * where every segment still fits, which lowers the worst error at the same count.
 *
 * Candidates lie every few pixels along the stretch. G1 by construction: each
 * candidate's tangent is estimated once (regression line over a window scaled to the
 * scan pixel, local-line.ts) and shared by the segments on both sides, so the handles
 * at every join are collinear exactly.
 */
import type { Point, Vec } from '../geometry/vector.ts';
import type { CubicSegment } from '../geometry/segment.ts';
import { arcAt, type BoundaryChain } from './boundary-chain.ts';
import { fitCubic } from './least-squares.ts';
import { localTangent } from './local-line.ts';

/** Spacing of candidate breakpoints: 3 px of arc (a designer places points no closer on a curve). */
export const BREAKPOINT_SPACING_PX = 3;
/** Half-window of the regression line giving a candidate's tangent and denoised position: 3 px. */
export const TANGENT_HALF_WINDOW_PX = 3;

/** An end of a curved stretch. */
export interface CurveEnd {
  /** Unwrapped chain index of the end. */
  readonly index: number;
  readonly point: Point;
  /** Unit tangent along the direction of travel, or null where it is free (a corner). */
  readonly tangent: Vec | null;
}

/** A breakpoint the search chose: a smooth join with its shared tangent. */
export interface Breakpoint {
  readonly index: number;
  readonly point: Point;
  readonly tangent: Vec;
}

export interface StretchFit {
  readonly segments: readonly CubicSegment[];
  /** Data range of each segment (unwrapped chain indices, inclusive). */
  readonly ranges: readonly (readonly [number, number])[];
  readonly errors: readonly number[];
  /** Interior breakpoints, one fewer than segments. */
  readonly breakpoints: readonly Breakpoint[];
}

export interface StretchSettings {
  readonly tolerance: number;
  readonly pixel: number;
}

interface Candidate {
  readonly index: number;
  readonly point: Point;
  readonly tangentIn: Vec | null;
  readonly tangentOut: Vec | null;
}

/**
 * The fewest cubics for the chain points [dataFirst, dataLast] between `start` and
 * `end`.
 *
 * Guarantees: consecutive segments share end points and, at interior breakpoints, a
 * tangent direction (G1 exact); a single segment is used whenever one fits; the count
 * is the minimum over the candidates when feasibility is monotone (see the header).
 * Limit: where even neighbouring candidates cannot be joined within the tolerance
 * (noise spikes above it), that segment exceeds it and its error says so.
 */
export function fitStretch(chain: BoundaryChain, start: CurveEnd, end: CurveEnd, dataFirst: number, dataLast: number, settings: StretchSettings): StretchFit {
  return fitStretchWithin(chain, start, end, dataFirst, dataLast, settings, Infinity) as StretchFit;
}

/**
 * {@link fitStretch}, or undefined as soon as the search shows that the fewest cubics
 * number more than `maxSegments`. A caller comparing several ways of fitting one
 * stretch (fit-contour.ts, where a line end may retreat) skips the rest of the search,
 * the balancing pass and the final fits for a way that cannot win. With an infinite
 * limit the result is exactly fitStretch's.
 */
export function fitStretchWithin(chain: BoundaryChain, start: CurveEnd, end: CurveEnd, dataFirst: number, dataLast: number, settings: StretchSettings, maxSegments: number): StretchFit | undefined {
  const { tolerance, pixel } = settings;
  // Only a whole fit within the tolerance is used, so its error is measured for the verdict alone.
  const whole = fitCubic({ chain, first: dataFirst, last: dataLast, start: start.point, end: end.point, startTangent: start.tangent, endTangent: end.tangent }, tolerance, false, true);
  if (whole.maxError <= tolerance) return { segments: [whole.segment], ranges: [[dataFirst, dataLast]], errors: [whole.maxError], breakpoints: [] };

  const spacing = BREAKPOINT_SPACING_PX * pixel;
  const candidates: Candidate[] = [{ index: start.index, point: start.point, tangentIn: null, tangentOut: start.tangent }];
  const sEnd = arcAt(chain, dataLast);
  let nextArc = arcAt(chain, dataFirst) + spacing;
  for (let k = dataFirst + 1; k < dataLast; k++) {
    const s = arcAt(chain, k);
    if (s < nextArc || sEnd - s < spacing) continue;
    const estimate = localTangent(chain, k, TANGENT_HALF_WINDOW_PX * pixel);
    candidates.push({ index: k, point: estimate.point, tangentIn: estimate.tangent, tangentOut: estimate.tangent });
    nextArc = s + spacing;
  }
  candidates.push({ index: end.index, point: end.point, tangentIn: end.tangent, tangentOut: null });
  const last = candidates.length - 1;
  const rangeOf = (i: number, j: number): [number, number] => [i === 0 ? dataFirst : candidates[i]!.index, j === last ? dataLast : candidates[j]!.index];
  const memo = new Map<number, boolean>();
  const fits = (i: number, j: number): boolean => {
    const key = i * (last + 1) + j;
    const known = memo.get(key);
    if (known !== undefined) return known;
    const [first, lastPoint] = rangeOf(i, j);
    const a = candidates[i]!;
    const b = candidates[j]!;
    const ok = fitCubic({ chain, first, last: lastPoint, start: a.point, end: b.point, startTangent: a.tangentOut, endTangent: b.tangentIn }, tolerance, true).maxError <= tolerance;
    memo.set(key, ok);
    return ok;
  };
  const forward = greedyPath(last, (i, j) => fits(i, j), maxSegments);
  if (!forward) return undefined;
  const backward = greedyPath(last, (i, j) => fits(last - j, last - i), Infinity)!.map((p) => last - p).reverse();
  let path = forward;
  if (backward.length === forward.length) {
    const balanced = forward.map((f, m) => Math.round((f + backward[m]!) / 2));
    if (balanced.every((p, m) => m === 0 || (p > balanced[m - 1]! && fits(balanced[m - 1]!, p)))) path = balanced;
  }
  const segments: CubicSegment[] = [];
  const ranges: [number, number][] = [];
  const errors: number[] = [];
  const breakpoints: Breakpoint[] = [];
  for (let m = 1; m < path.length; m++) {
    const i = path[m - 1]!;
    const j = path[m]!;
    const [first, lastPoint] = rangeOf(i, j);
    const a = candidates[i]!;
    const b = candidates[j]!;
    const fit = fitCubic({ chain, first, last: lastPoint, start: a.point, end: b.point, startTangent: a.tangentOut, endTangent: b.tangentIn }, tolerance);
    segments.push(fit.segment);
    ranges.push([first, lastPoint]);
    errors.push(fit.maxError);
    if (j !== last) breakpoints.push({ index: b.index, point: b.point, tangent: b.tangentOut! });
  }
  return { segments, ranges, errors, breakpoints };
}

/**
 * Node sequence 0 = p₀ < p₁ < … < p_k = last where each step reaches the farthest node
 * that `fits` from the previous one (one node ahead when none does); undefined once k
 * is certain to exceed `maxSteps`.
 */
function greedyPath(last: number, fits: (i: number, j: number) => boolean, maxSteps: number): number[] | undefined {
  const path = [0];
  let at = 0;
  while (at < last) {
    if (path.length - 1 >= maxSteps) return undefined;
    if (fits(at, last)) {
      path.push(last);
      break;
    }
    let good = at + 1;
    let step = 1;
    let bad = last;
    while (good + step < last) {
      if (fits(at, good + step)) {
        good += step;
        step *= 2;
      } else {
        bad = good + step;
        break;
      }
    }
    while (bad - good > 1) {
      const mid = (good + bad) >> 1;
      if (fits(at, mid)) good = mid;
      else bad = mid;
    }
    path.push(good);
    at = good;
  }
  return path;
}
