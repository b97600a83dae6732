/**
 * Horizontal and vertical extrema: where type design wants on-curve points.
 *
 * Every x or y extremum of an outline should be an on-curve point whose handles are
 * axis-aligned (horizontal at a top or bottom, vertical at a left or right side):
 * rasterisers and hinting rely on it, and font validators flag missing extrema. The
 * fitter therefore places breakpoints AT the boundary's extrema before fitting and
 * fits with axis tangents there, so the tolerance holds by construction; afterwards
 * any cubic that still has an interior extremum protruding more than half a unit past
 * its end points is split there.
 *
 * Finding extrema on a noisy chain is a peak-detection problem: a coordinate that
 * wobbles by scan noise along a flat top must not produce a cluster of extrema. Peaks
 * are found with hysteresis (a maximum counts once the coordinate has fallen by the
 * prominence since it, and a minimum once it has risen by it: the "zigzag" form of
 * peak detection by prominence), and each peak is then located by a least-squares
 * parabola through the points near it, whose vertex is far less noisy than the
 * highest point.
 */
import type { Point, Vec } from '../geometry/vector.ts';
import { cubic, evaluate, type CubicSegment, type Segment } from '../geometry/segment.ts';
import { extremaParameters } from '../geometry/extrema.ts';
import { splitAt } from '../geometry/split.ts';
import { wrapIndex, type BoundaryChain } from './boundary-chain.ts';
import type { FitNode, FitSpan, FittedContour } from './fitted-contour.ts';
import { fitCubic } from './least-squares.ts';
import { measureSpanError } from './span-error.ts';

/**
 * Prominence an extremum of the boundary needs: 0.5 units, or four times the noise
 * left after smoothing, whichever is larger. Half a unit is the protrusion the
 * outline check reports (a smaller bump is invisible and left alone); four standard
 * deviations keep noise wiggles along a flat top from passing for extrema (a run of a
 * few hundred points reaches about ±3σ).
 */
export const EXTREMUM_PROMINENCE_UNITS = 0.5;
const EXTREMUM_PROMINENCE_NOISE = 4;
/** Half-window (px) of the moving average the peak search runs on. */
const SMOOTHING_HALF_WINDOW_PX = 2;
/**
 * Protrusion beyond which an interior extremum of a fitted cubic is split off: 0.5
 * units (the limit set for the product's outline check).
 */
export const EXTREMUM_PROTRUSION_LIMIT = 0.5;
/**
 * No new on-curve point is placed within 4 font units of an existing one (the middle
 * of the 3–5 unit range a designer would merge by hand); the existing point or its
 * tangent is moved instead.
 */
export const MIN_POINT_SPACING_UNITS = 4;
/** Band below the peak (in prominences) whose points locate it by a parabola. */
const LOCATING_BAND_PROMINENCES = 3;
/**
 * The locating parabola uses at most this many pixels of arc either side of the peak.
 * Flat extremes need a long window: on a circle of radius 500 px the band covers
 * ±40 px, and a window capped at 8 px left the vertex 6 units off along the curve
 * (measured), where the forced axis tangent is already 0.7° wrong.
 */
const LOCATING_HALF_WINDOW_PX = 48;

export type ExtremumAxis = 'x' | 'y';

export interface ChainExtremum {
  /** Unwrapped chain index nearest the extremum. */
  readonly index: number;
  /** 'y' for a top or bottom (horizontal tangent), 'x' for a left or right side (vertical tangent). */
  readonly axis: ExtremumAxis;
  /** Located extremum (parabola vertex), font units. */
  readonly point: Point;
  /** Unit tangent there along the chain: (±1, 0) for 'y', (0, ±1) for 'x'. */
  readonly tangent: Vec;
}

/**
 * The interior extrema of the unwrapped stretch [first, last] of the chain, sorted by
 * index. An extremum at either end of the stretch is not interior and is not listed.
 */
export function chainExtrema(chain: BoundaryChain, first: number, last: number, pixel: number, noise: number): ChainExtremum[] {
  const found = [...peaksOf(chain, first, last, 'x', pixel, noise), ...peaksOf(chain, first, last, 'y', pixel, noise)];
  return found.sort((a, b) => a.index - b.index);
}

/** The prominence for a given noise and pixel size (see EXTREMUM_PROMINENCE_UNITS). */
function prominenceFor(chain: BoundaryChain, pixel: number, noise: number): number {
  const averaged = Math.max(1, Math.round((2 * SMOOTHING_HALF_WINDOW_PX * pixel) / chain.medianStep) + 1);
  return Math.max(EXTREMUM_PROMINENCE_UNITS, (EXTREMUM_PROMINENCE_NOISE * noise) / Math.sqrt(averaged));
}

function peaksOf(chain: BoundaryChain, first: number, last: number, axis: ExtremumAxis, pixel: number, noise: number): ChainExtremum[] {
  const prominence = prominenceFor(chain, pixel, noise);
  const prefix = axis === 'x' ? chain.sumX : chain.sumY;
  const n = chain.count;
  const total = prefix[n]!;
  const prefixAt = (k: number): number => {
    const lap = Math.floor(k / n);
    return lap * total + prefix[k - lap * n]!;
  };
  // Moving average over ±h points (h from the pixel size), clipped to the stretch.
  const h = Math.max(0, Math.round((SMOOTHING_HALF_WINDOW_PX * pixel) / chain.medianStep));
  const value = (k: number): number => {
    const a = Math.max(first, k - h);
    const b = Math.min(last, k + h);
    return (prefixAt(b + 1) - prefixAt(a)) / (b - a + 1);
  };
  // Zigzag: alternate between looking for a maximum and a minimum.
  const turning: { index: number; isMax: boolean }[] = [];
  let direction = 0; // +1 rising (looking for a max), −1 falling, 0 not yet known
  let extremeIndex = first;
  let lowIndex = first;
  let highIndex = first;
  for (let k = first + 1; k <= last; k++) {
    const v = value(k);
    if (direction === 0) {
      if (v > value(highIndex)) highIndex = k;
      if (v < value(lowIndex)) lowIndex = k;
      if (value(highIndex) - value(lowIndex) >= prominence) {
        direction = highIndex > lowIndex ? 1 : -1;
        extremeIndex = direction === 1 ? highIndex : lowIndex;
        turning.push({ index: direction === 1 ? lowIndex : highIndex, isMax: direction !== 1 });
      }
      continue;
    }
    if (direction === 1) {
      if (v > value(extremeIndex)) extremeIndex = k;
      else if (value(extremeIndex) - v >= prominence) {
        turning.push({ index: extremeIndex, isMax: true });
        direction = -1;
        extremeIndex = k;
      }
    } else {
      if (v < value(extremeIndex)) extremeIndex = k;
      else if (v - value(extremeIndex) >= prominence) {
        turning.push({ index: extremeIndex, isMax: false });
        direction = 1;
        extremeIndex = k;
      }
    }
  }
  // The first turning point is never prominent on its near side: until the direction
  // was known the coordinate had moved by less than the prominence. Drop it.
  const interior = turning.slice(1);
  return interior.map((t) => locatePeak(chain, t.index, t.isMax, axis, first, last, Math.max(prominence, 2 * noise), pixel));
}

/** Refines a peak with a parabola through the neighbouring points within the locating band. */
function locatePeak(chain: BoundaryChain, index: number, isMax: boolean, axis: ExtremumAxis, first: number, last: number, prominence: number, pixel: number): ChainExtremum {
  const along = axis === 'x' ? chain.ys : chain.xs; // the coordinate the peak is a function of
  const across = axis === 'x' ? chain.xs : chain.ys;
  const peak = across[wrapIndex(chain, index)]!;
  const band = LOCATING_BAND_PROMINENCES * prominence;
  const halfWindow = LOCATING_HALF_WINDOW_PX * pixel;
  const inBand = (k: number): boolean => Math.abs(across[wrapIndex(chain, k)]! - peak) <= band;
  const sIndex = chain.arc[wrapIndex(chain, index)]!;
  const arcDistance = (k: number): number => {
    const d = Math.abs(chain.arc[wrapIndex(chain, k)]! - sIndex);
    return Math.min(d, chain.perimeter - d);
  };
  let a = index;
  while (a > first && inBand(a - 1) && arcDistance(a - 1) <= halfWindow) a--;
  let b = index;
  while (b < last && inBand(b + 1) && arcDistance(b + 1) <= halfWindow) b++;
  const ox = along[wrapIndex(chain, index)]!;
  let s0 = 0, s1 = 0, s2 = 0, s3 = 0, s4 = 0, t0 = 0, t1 = 0, t2 = 0;
  let lo = Infinity;
  let hi = -Infinity;
  for (let k = a; k <= b; k++) {
    const i = wrapIndex(chain, k);
    const w = along[i]! - ox;
    const v = across[i]!;
    lo = Math.min(lo, w);
    hi = Math.max(hi, w);
    const w2 = w * w;
    s0 += 1; s1 += w; s2 += w2; s3 += w2 * w; s4 += w2 * w2;
    t0 += v; t1 += w * v; t2 += w2 * v;
  }
  let vertexAlong = 0;
  let vertexAcross = peak;
  const det = s0 * (s2 * s4 - s3 * s3) - s1 * (s1 * s4 - s3 * s2) + s2 * (s1 * s3 - s2 * s2);
  if (b - a >= 4 && Math.abs(det) > 1e-12) {
    const c0 = (t0 * (s2 * s4 - s3 * s3) - s1 * (t1 * s4 - s3 * t2) + s2 * (t1 * s3 - s2 * t2)) / det;
    const c1 = (s0 * (t1 * s4 - s3 * t2) - t0 * (s1 * s4 - s3 * s2) + s2 * (s1 * t2 - t1 * s2)) / det;
    const c2 = (s0 * (s2 * t2 - t1 * s3) - s1 * (s1 * t2 - t1 * s2) + t0 * (s1 * s3 - s2 * s2)) / det;
    // A parabola opening the right way has a vertex; otherwise keep the highest point.
    if ((isMax && c2 < 0) || (!isMax && c2 > 0)) {
      vertexAlong = Math.min(hi, Math.max(lo, -c1 / (2 * c2)));
      vertexAcross = c0 + c1 * vertexAlong + c2 * vertexAlong * vertexAlong;
    } else {
      vertexAcross = c0 + c1 * vertexAlong + c2 * vertexAlong * vertexAlong;
    }
  }
  // The chain index nearest the vertex along the peak's neighbourhood.
  let bestIndex = index;
  let bestDistance = Infinity;
  for (let k = a; k <= b; k++) {
    const d = Math.abs(along[wrapIndex(chain, k)]! - ox - vertexAlong);
    if (d < bestDistance) {
      bestDistance = d;
      bestIndex = k;
    }
  }
  // Direction of travel at the peak: past a y-maximum a chain runs towards −x if it is counter-clockwise.
  const before = along[wrapIndex(chain, a)]!;
  const after = along[wrapIndex(chain, b)]!;
  const sign = after - before >= 0 ? 1 : -1;
  const alongValue = ox + vertexAlong + (axis === 'x' ? chain.origin.y : chain.origin.x);
  const acrossValue = vertexAcross + (axis === 'x' ? chain.origin.x : chain.origin.y);
  return axis === 'y'
    ? { index: bestIndex, axis, point: { x: alongValue, y: acrossValue }, tangent: { x: sign, y: 0 } }
    : { index: bestIndex, axis, point: { x: acrossValue, y: alongValue }, tangent: { x: 0, y: sign } };
}

/** An interior extremum of a fitted segment and how far it sticks out past the segment's ends. */
export interface SegmentExtremum {
  readonly t: number;
  readonly axis: ExtremumAxis;
  readonly point: Point;
  /** Distance beyond the nearer bound of the end points' coordinates (0 when inside them). */
  readonly protrusion: number;
}

/** The interior x and y extrema of a segment with their protrusion. */
export function segmentExtrema(segment: Segment): SegmentExtremum[] {
  const end = segment.kind === 'line' ? segment.p1 : segment.kind === 'quad' ? segment.p2 : segment.p3;
  const { x, y } = extremaParameters(segment);
  const out: SegmentExtremum[] = [];
  for (const [axis, ts] of [['x', x], ['y', y]] as const) {
    const a = axis === 'x' ? segment.p0.x : segment.p0.y;
    const b = axis === 'x' ? end.x : end.y;
    for (const t of ts) {
      const point = evaluate(segment, t);
      const v = axis === 'x' ? point.x : point.y;
      const protrusion = Math.max(0, v - Math.max(a, b), Math.min(a, b) - v);
      out.push({ t, axis, point, protrusion });
    }
  }
  return out.sort((p, q) => p.t - q.t);
}

/**
 * The chain's topmost point located as an extremum: a seam for contours with no corner
 * and no line, where fitting needs a first on-curve point (the top of a closed curve
 * is always a y-extremum with a horizontal tangent).
 */
export function topExtremum(chain: BoundaryChain, pixel: number, noise: number): ChainExtremum {
  let top = 0;
  for (let i = 1; i < chain.count; i++) if (chain.ys[i]! > chain.ys[top]!) top = i;
  const half = chain.count >> 1;
  const located = locatePeak(chain, top, true, 'y', top - half, top + half, Math.max(prominenceFor(chain, pixel, noise), 2 * noise), pixel);
  return { ...located, index: wrapIndex(chain, located.index) };
}

/** Passes over the contour when enforcing extrema; each pass fixes at least one extremum or stops. */
const MAX_EXTREMUM_PASSES = 64;

/** The axis-aligned unit tangent of a segment at an interior extremum, along the direction of travel. */
function axisTangentAt(segment: CubicSegment, t: number, axis: ExtremumAxis): Vec {
  const d = cubicDerivative(segment, t);
  return axis === 'y' ? { x: d.x >= 0 ? 1 : -1, y: 0 } : { x: 0, y: d.y >= 0 ? 1 : -1 };
}

function cubicDerivative(s: CubicSegment, t: number): Vec {
  const u = 1 - t;
  return {
    x: 3 * (u * u * (s.p1.x - s.p0.x) + 2 * u * t * (s.p2.x - s.p1.x) + t * t * (s.p3.x - s.p2.x)),
    y: 3 * (u * u * (s.p1.y - s.p0.y) + 2 * u * t * (s.p2.y - s.p1.y) + t * t * (s.p3.y - s.p2.y)),
  };
}

/** The first extremum of a cubic span protruding past the limit, if any. */
function protrudingExtremum(span: FitSpan): SegmentExtremum | undefined {
  if (span.segment.kind !== 'cubic') return undefined;
  return segmentExtrema(span.segment).find((e) => e.protrusion > EXTREMUM_PROTRUSION_LIMIT);
}

/**
 * Every interior extremum of a cubic that protrudes more than
 * {@link EXTREMUM_PROTRUSION_LIMIT} past its end points becomes an on-curve point with
 * an axis-aligned handle pair.
 *
 * Within {@link MIN_POINT_SPACING_UNITS} of an existing on-curve point no point is
 * added: that point's tangent is turned to the axis instead (a corner's tangent on
 * that side, or a smooth point's shared tangent with both neighbours refitted), when
 * the tolerance still holds. Otherwise the cubic is split exactly at the extremum (de
 * Casteljau), which leaves the curve unchanged, so the tolerance holds by
 * construction; the split point's handles are made exactly axis-aligned.
 */
export function enforceExtrema(chain: BoundaryChain, contour: FittedContour, tolerance: number): FittedContour {
  const nodes = contour.nodes.slice();
  const spans = contour.spans.slice();
  for (let pass = 0; pass < MAX_EXTREMUM_PASSES; pass++) {
    let changed = false;
    for (let i = 0; i < spans.length; i++) {
      const span = spans[i]!;
      const extremum = protrudingExtremum(span);
      if (!extremum || span.segment.kind !== 'cubic') continue;
      const segment = span.segment;
      const n = nodes.length;
      const tangent = axisTangentAt(segment, extremum.t, extremum.axis);
      const nearStart = Math.hypot(extremum.point.x - segment.p0.x, extremum.point.y - segment.p0.y) < MIN_POINT_SPACING_UNITS;
      const nearEnd = Math.hypot(extremum.point.x - segment.p3.x, extremum.point.y - segment.p3.y) < MIN_POINT_SPACING_UNITS;
      if (nearStart || nearEnd) {
        const at = nearStart ? i : (i + 1) % n;
        if (turnNodeToAxis(chain, nodes, spans, at, tangent, extremum.axis, nearStart, tolerance)) {
          changed = true;
          continue;
        }
      }
      // Exact split at the extremum.
      const [left, right] = splitAt(segment, extremum.t);
      const joint = left.p3;
      const l = extremum.axis === 'y' ? cubic(left.p0, left.p1, { x: left.p2.x, y: joint.y }, joint) : cubic(left.p0, left.p1, { x: joint.x, y: left.p2.y }, joint);
      const r = extremum.axis === 'y' ? cubic(joint, { x: right.p1.x, y: joint.y }, right.p2, right.p3) : cubic(joint, { x: joint.x, y: right.p1.y }, right.p2, right.p3);
      const splitIndex = nearestChainIndex(chain, span.first, span.last, joint);
      const leftSpan: FitSpan = { segment: l, first: span.first, last: splitIndex, maxError: measureSpanError(chain, l, span.first, splitIndex, tolerance), carrier: null };
      const rightSpan: FitSpan = { segment: r, first: splitIndex, last: span.last, maxError: measureSpanError(chain, r, splitIndex, span.last, tolerance), carrier: null };
      const node: FitNode = { point: joint, smooth: true, tangentIn: tangent, tangentOut: tangent, extremum: extremum.axis, corner: null, index: splitIndex, pinned: true };
      spans.splice(i, 1, leftSpan, rightSpan);
      nodes.splice(i + 1, 0, node);
      changed = true;
    }
    if (!changed) break;
  }
  return { nodes, spans };
}

/**
 * Turns node `at`'s tangent (on the side of span `i` only, for a corner; both sides for
 * a smooth node) to the axis and refits the affected cubics. True when accepted: the
 * tolerance holds and the affected spans no longer protrude.
 */
function turnNodeToAxis(chain: BoundaryChain, nodes: FitNode[], spans: FitSpan[], at: number, tangent: Vec, axis: ExtremumAxis, isStartOfSpan: boolean, tolerance: number): boolean {
  const n = nodes.length;
  const node = nodes[at]!;
  if (node.extremum !== null && node.extremum !== axis) return false;
  let turned: FitNode;
  if (!node.smooth) {
    turned = isStartOfSpan ? { ...node, tangentOut: tangent } : { ...node, tangentIn: tangent };
  } else {
    const before = spans[(at - 1 + n) % n]!;
    const after = spans[at]!;
    if (before.segment.kind !== 'cubic' || after.segment.kind !== 'cubic') return false;
    turned = { ...node, tangentIn: tangent, tangentOut: tangent, extremum: axis, pinned: true };
  }
  const affected = node.smooth ? [(at - 1 + n) % n, at] : [isStartOfSpan ? at : (at - 1 + n) % n];
  const trial = nodes.slice();
  trial[at] = turned;
  const replacements: FitSpan[] = [];
  for (const s of affected) {
    const span = spans[s]!;
    if (span.segment.kind !== 'cubic') return false;
    const start = trial[s]!;
    const end = trial[(s + 1) % n]!;
    const fit = fitCubic({ chain, first: span.first, last: span.last, start: start.point, end: end.point, startTangent: start.tangentOut, endTangent: end.tangentIn }, tolerance, false, true);
    const candidate: FitSpan = { ...span, segment: fit.segment, maxError: fit.maxError };
    if (fit.maxError > tolerance || protrudingExtremum(candidate)) return false;
    replacements.push(candidate);
  }
  nodes[at] = turned;
  affected.forEach((s, k) => {
    spans[s] = replacements[k]!;
  });
  return true;
}

/** The chain index in [first, last] nearest to p (first when the range is empty). */
function nearestChainIndex(chain: BoundaryChain, first: number, last: number, p: Point): number {
  let best = first;
  let bestDistance = Infinity;
  const px = p.x - chain.origin.x;
  const py = p.y - chain.origin.y;
  for (let k = first; k <= last; k++) {
    const i = wrapIndex(chain, k);
    const d = (chain.xs[i]! - px) ** 2 + (chain.ys[i]! - py) ** 2;
    if (d < bestDistance) {
      bestDistance = d;
      best = k;
    }
  }
  return best;
}
