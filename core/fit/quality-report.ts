/**
 * The quality report: how closely the outline follows the traced boundary, how
 * economical it is, and what a type designer would still have to fix by hand.
 *
 * Deviation is measured both ways (boundary points to the outline, and points sampled
 * along the outline to the boundary polyline), so that neither a missing nor an extra
 * piece of outline goes unseen: the larger is a symmetric (Hausdorff-style) figure
 * over the sampled points. Warnings name what breaks a professional outline:
 * tolerance exceeded, an x/y extremum left inside a segment, a near-miss kink (a join
 * that turns by 0.3°–8°: too little to be a corner, too much to look smooth), and
 * crossing handles.
 */
import type { Point } from '../geometry/vector.ts';
import { evaluate, type CubicSegment, type LineSegment } from '../geometry/segment.ts';
import { nearestPoint } from '../geometry/nearest.ts';
import { arcAt, wrapIndex, type BoundaryChain } from './boundary-chain.ts';
import { EXTREMUM_PROTRUSION_LIMIT, segmentExtrema } from './extrema.ts';
import { handlesCross } from './finishing.ts';
import type { FittedContour } from './fitted-contour.ts';

/** Near-miss kink range, degrees: 0.3° is about the smallest turn visible in a curvature comb at editing zoom (common practice), 8° the largest a designer would still mean as smooth. */
export const KINK_MIN_DEGREES = 0.3;
export const KINK_MAX_DEGREES = 8;
/** Outline samples per segment for the outline-to-boundary distance. */
const SAMPLES_PER_SEGMENT = 16;
/** Share of a segment's stretch at each end where the neighbouring segment is measured too. */
const NEIGHBOUR_SHARE = 0.15;
/** Boundary points searched beyond a segment's own stretch when measuring outline samples. */
const SEARCH_MARGIN_POINTS = 16;

export type FitWarningKind = 'tolerance-exceeded' | 'extremum-inside-segment' | 'near-miss-kink' | 'crossing-handles';

export interface FitWarning {
  readonly kind: FitWarningKind;
  /** Where, in font units. */
  readonly at: Point;
  /** The measured quantity: distance (units), protrusion (units) or turn (degrees). */
  readonly value: number;
  readonly message: string;
}

export interface ContourFitReport {
  /** Number of boundary points measured. */
  readonly boundaryPointCount: number;
  /** Largest distance from a boundary point to the outline (corner tips included). */
  readonly maxDeviation: number;
  /** Mean of those distances. */
  readonly meanDeviation: number;
  /** Largest distance from a boundary point outside the corners' rounded tips: what the tolerance bounds. */
  readonly maxDeviationOutsideCorners: number;
  /** Largest distance from a sampled outline point to the boundary polyline. */
  readonly maxOutlineDeviation: number;
  readonly segmentCount: number;
  readonly lineCount: number;
  readonly onCurveCount: number;
  /** On-curve points that are not smooth. */
  readonly cornerCount: number;
  readonly warnings: readonly FitWarning[];
}

export interface GlyphFitReport extends Omit<ContourFitReport, 'warnings'> {
  readonly contourCount: number;
  readonly contours: readonly ContourFitReport[];
  readonly warnings: readonly FitWarning[];
}

/** Distance from p to a line segment. */
function distanceToLine(segment: LineSegment, px: number, py: number): number {
  const dx = segment.p1.x - segment.p0.x;
  const dy = segment.p1.y - segment.p0.y;
  const l2 = dx * dx + dy * dy;
  let t = l2 > 0 ? ((px - segment.p0.x) * dx + (py - segment.p0.y) * dy) / l2 : 0;
  t = t < 0 ? 0 : t > 1 ? 1 : t;
  return Math.hypot(segment.p0.x + t * dx - px, segment.p0.y + t * dy - py);
}

/** Distance from p to a segment (exact: the global nearest point). */
function distanceToSegment(segment: LineSegment | CubicSegment, p: Point): number {
  return segment.kind === 'line' ? distanceToLine(segment, p.x, p.y) : nearestPoint(segment, p).distance;
}

/**
 * Distance from p to a cubic by Newton iteration from a parameter guess, an upper
 * bound on the true distance (exact when the iteration reaches the nearest point).
 */
function distanceToCubicFrom(s: CubicSegment, px: number, py: number, guess: number): number {
  let t = guess;
  for (let k = 0; k < 6; k++) {
    const u = 1 - t;
    const bx = u * u * u * s.p0.x + 3 * u * u * t * s.p1.x + 3 * u * t * t * s.p2.x + t * t * t * s.p3.x - px;
    const by = u * u * u * s.p0.y + 3 * u * u * t * s.p1.y + 3 * u * t * t * s.p2.y + t * t * t * s.p3.y - py;
    const dx = 3 * (u * u * (s.p1.x - s.p0.x) + 2 * u * t * (s.p2.x - s.p1.x) + t * t * (s.p3.x - s.p2.x));
    const dy = 3 * (u * u * (s.p1.y - s.p0.y) + 2 * u * t * (s.p2.y - s.p1.y) + t * t * (s.p3.y - s.p2.y));
    const ddx = 6 * (u * (s.p2.x - 2 * s.p1.x + s.p0.x) + t * (s.p3.x - 2 * s.p2.x + s.p1.x));
    const ddy = 6 * (u * (s.p2.y - 2 * s.p1.y + s.p0.y) + t * (s.p3.y - 2 * s.p2.y + s.p1.y));
    const f = bx * dx + by * dy;
    const fp = dx * dx + dy * dy + bx * ddx + by * ddy;
    if (!(fp > 0)) break;
    const next = Math.min(1, Math.max(0, t - f / fp));
    if (Math.abs(next - t) < 1e-9) {
      t = next;
      break;
    }
    t = next;
  }
  const u = 1 - t;
  const ex = u * u * u * s.p0.x + 3 * u * u * t * s.p1.x + 3 * u * t * t * s.p2.x + t * t * t * s.p3.x;
  const ey = u * u * u * s.p0.y + 3 * u * u * t * s.p1.y + 3 * u * t * t * s.p2.y + t * t * t * s.p3.y;
  return Math.hypot(ex - px, ey - py);
}

/** Distance from (px, py) to a segment, Newton from `guess` for cubics. */
function distanceNear(segment: LineSegment | CubicSegment, px: number, py: number, guess: number): number {
  return segment.kind === 'line' ? distanceToLine(segment, px, py) : distanceToCubicFrom(segment, px, py, guess);
}

/** Turn in degrees at the on-curve point between the incoming and outgoing tangents (from the nearest distinct control points). */
export function turnAtJoin(before: LineSegment | CubicSegment, after: LineSegment | CubicSegment): number {
  const end = before.kind === 'line' ? before.p1 : before.p3;
  const inFrom = before.kind === 'line' ? before.p0 : [before.p2, before.p1, before.p0].find((q) => q.x !== end.x || q.y !== end.y) ?? before.p0;
  const outTo = after.kind === 'line' ? after.p1 : [after.p1, after.p2, after.p3].find((q) => q.x !== end.x || q.y !== end.y) ?? after.p3;
  const ax = end.x - inFrom.x;
  const ay = end.y - inFrom.y;
  const bx = outTo.x - end.x;
  const by = outTo.y - end.y;
  return (Math.abs(Math.atan2(ax * by - ay * bx, ax * bx + ay * by)) * 180) / Math.PI;
}

/**
 * The report for one fitted contour against its chain; `tolerance` is the one the
 * caller asked for.
 */
export function contourReport(chain: BoundaryChain, contour: FittedContour, tolerance: number): ContourFitReport {
  const { nodes, spans } = contour;
  const n = nodes.length;
  const warnings: FitWarning[] = [];
  const ox = chain.origin.x;
  const oy = chain.origin.y;

  // Boundary → outline: every chain point, against the span whose node range holds it and its neighbours.
  let sum = 0;
  let counted = 0;
  let maxDeviation = 0;
  let maxInside = 0;
  const insideSpan = new Uint8Array(chain.count);
  for (const span of spans) for (let k = span.first; k <= span.last; k++) insideSpan[wrapIndex(chain, k)] = 1;
  for (let s = 0; s < n; s++) {
    const span = spans[s]!;
    const from = nodes[s]!.index;
    let to = nodes[(s + 1) % n]!.index;
    while (to <= from) to += chain.count;
    const segment = span.segment;
    const a = arcAt(chain, from);
    const length = arcAt(chain, to) - a || 1;
    for (let k = from; k < to; k++) {
      const i = wrapIndex(chain, k);
      const px = chain.xs[i]! + ox;
      const py = chain.ys[i]! + oy;
      const along = (arcAt(chain, k) - a) / length;
      let d = segment.kind === 'line' ? distanceToLine(segment, px, py) : distanceToCubicFrom(segment, px, py, along);
      // Near the ends a neighbour may be closer; beyond the tolerance measure exactly.
      if (along < NEIGHBOUR_SHARE || along > 1 - NEIGHBOUR_SHARE || d > tolerance) {
        const p = { x: px, y: py };
        const before = spans[(s - 1 + n) % n]!.segment;
        const after = spans[(s + 1) % n]!.segment;
        d = Math.min(d, distanceNear(before, px, py, 1), distanceNear(after, px, py, 0));
        if (d > tolerance) d = Math.min(distanceToSegment(segment, p), distanceToSegment(before, p), distanceToSegment(after, p));
      }
      sum += d;
      counted++;
      if (d > maxDeviation) maxDeviation = d;
      if (insideSpan[i] === 1 && d > maxInside) maxInside = d;
    }
  }

  // Outline → boundary: samples along each span, against the chain polyline near its stretch.
  let maxOutline = 0;
  for (let s = 0; s < n; s++) {
    const segment = spans[s]!.segment;
    const from = nodes[s]!.index - SEARCH_MARGIN_POINTS;
    let to = nodes[(s + 1) % n]!.index;
    while (to <= nodes[s]!.index) to += chain.count;
    to += SEARCH_MARGIN_POINTS;
    for (let j = 0; j <= SAMPLES_PER_SEGMENT; j++) {
      const q = evaluate(segment, j / SAMPLES_PER_SEGMENT);
      let best = Infinity;
      for (let k = from; k < to; k++) {
        const i = wrapIndex(chain, k);
        const i2 = wrapIndex(chain, k + 1);
        const ax = chain.xs[i]! + ox;
        const ay = chain.ys[i]! + oy;
        const dx = chain.xs[i2]! - chain.xs[i]!;
        const dy = chain.ys[i2]! - chain.ys[i]!;
        const l2 = dx * dx + dy * dy;
        let t = l2 > 0 ? ((q.x - ax) * dx + (q.y - ay) * dy) / l2 : 0;
        t = t < 0 ? 0 : t > 1 ? 1 : t;
        const d = (ax + t * dx - q.x) ** 2 + (ay + t * dy - q.y) ** 2;
        if (d < best) best = d;
      }
      maxOutline = Math.max(maxOutline, Math.sqrt(best));
    }
  }

  // Warnings.
  spans.forEach((span) => {
    const segment = span.segment;
    if (span.maxError > tolerance) {
      const at = segment.kind === 'line' ? segment.p0 : evaluate(segment, 0.5);
      warnings.push({ kind: 'tolerance-exceeded', at, value: span.maxError, message: `The outline strays ${span.maxError.toFixed(2)} units from the boundary here (tolerance ${tolerance}).` });
    }
    if (segment.kind === 'cubic') {
      for (const e of segmentExtrema(segment)) {
        if (e.protrusion > EXTREMUM_PROTRUSION_LIMIT) warnings.push({ kind: 'extremum-inside-segment', at: e.point, value: e.protrusion, message: `An ${e.axis} extremum lies inside a segment, ${e.protrusion.toFixed(2)} units past its end points.` });
      }
      if (handlesCross(segment)) warnings.push({ kind: 'crossing-handles', at: segment.p1, value: 0, message: 'The two handles of this segment cross.' });
    }
  });
  let cornerCount = 0;
  nodes.forEach((node, i) => {
    if (!node.smooth) cornerCount++;
    const turn = turnAtJoin(spans[(i - 1 + n) % n]!.segment, spans[i]!.segment);
    if (turn >= KINK_MIN_DEGREES && turn <= KINK_MAX_DEGREES) {
      warnings.push({ kind: 'near-miss-kink', at: node.point, value: turn, message: `The join turns by ${turn.toFixed(2)}°: too little for a corner, too much to look smooth.` });
    }
  });
  return {
    boundaryPointCount: counted,
    maxDeviation,
    meanDeviation: counted > 0 ? sum / counted : 0,
    maxDeviationOutsideCorners: maxInside,
    maxOutlineDeviation: maxOutline,
    segmentCount: spans.length,
    lineCount: spans.filter((s) => s.segment.kind === 'line').length,
    onCurveCount: nodes.length,
    cornerCount,
    warnings,
  };
}

/** Combines contour reports into the glyph's. */
export function glyphReport(contours: readonly ContourFitReport[]): GlyphFitReport {
  const points = contours.reduce((total, c) => total + c.onCurveCount, 0);
  const measured = contours.reduce((total, c) => total + c.boundaryPointCount, 0);
  return {
    contourCount: contours.length,
    contours,
    boundaryPointCount: measured,
    maxDeviation: Math.max(0, ...contours.map((c) => c.maxDeviation)),
    meanDeviation: measured > 0 ? contours.reduce((t, c) => t + c.meanDeviation * c.boundaryPointCount, 0) / measured : 0,
    maxDeviationOutsideCorners: Math.max(0, ...contours.map((c) => c.maxDeviationOutsideCorners)),
    maxOutlineDeviation: Math.max(0, ...contours.map((c) => c.maxOutlineDeviation)),
    segmentCount: contours.reduce((t, c) => t + c.segmentCount, 0),
    lineCount: contours.reduce((t, c) => t + c.lineCount, 0),
    onCurveCount: points,
    cornerCount: contours.reduce((t, c) => t + c.cornerCount, 0),
    warnings: contours.flatMap((c) => c.warnings),
  };
}
