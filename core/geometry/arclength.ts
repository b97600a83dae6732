/**
 * Arc length of segments and its inverse, the parameter at a given distance along.
 *
 * Needed for even spacing of samples along outlines (curvature combs, stroke
 * analysis), for measuring stems, and for re-parameterising fitted curves. The length
 * ∫|B′(t)| dt is integrated with a fixed Gauss–Legendre rule (see gauss-legendre.ts)
 * inside adaptive bisection of the parameter interval (Kuncir 1962, "Algorithm 103:
 * Simpson's rule integrator", Comm. ACM 5(6), applied here with a Gauss rule; see
 * also Gander & Gautschi 2000, "Adaptive quadrature — revisited", BIT 40(1)): an
 * interval is accepted when the rule on the whole interval and on its two halves
 * agree to the requested tolerance. Subdivision concentrates effort near cusps, where
 * |B′| has a kink and a fixed rule converges slowly. The inverse s ↦ t(s) uses
 * Newton's method on L(t) − s, whose derivative is the speed |B′(t)|, safeguarded by
 * bisection so that it cannot leave [0, 1] or stall where the speed vanishes.
 */
import type { Segment } from './segment.ts';
import { controlPoints, derivative } from './segment.ts';
import { distance, length } from './vector.ts';
import type { QuadratureRule } from './gauss-legendre.ts';
import { gaussLegendreRule, integrateWithRule } from './gauss-legendre.ts';

/**
 * Nodes of the Gauss–Legendre rule used per interval: exact for degree-31
 * polynomials, so a smooth quarter-turn cubic is integrated to rounding level without
 * subdivision, while a single interval costs only 16 derivative evaluations.
 */
export const ARC_LENGTH_GAUSS_NODES = 16;

const ARC_LENGTH_RULE: QuadratureRule = gaussLegendreRule(ARC_LENGTH_GAUSS_NODES);

/**
 * Default accuracy, relative to the control-polygon length (an upper bound on the arc
 * length): 1e-12, a few hundred units in the last place of typical outline lengths.
 */
export const DEFAULT_ARC_LENGTH_TOLERANCE = 1e-12;

/**
 * Deepest bisection level: an interval of width 2⁻⁴⁰ ≈ 1e-12 in t is far below any
 * geometric feature of a glyph, so stopping there bounds the work near exact cusps.
 */
const MAX_SUBDIVISION_DEPTH = 40;

/** Iteration cap for the inverse; bisection alone reaches 2⁻¹⁰⁰ in t well within it. */
const MAX_INVERSE_ITERATIONS = 100;

/** Options for the arc-length functions. */
export interface ArcLengthOptions {
  /** Requested accuracy relative to the control-polygon length; default 1e-12. */
  readonly tolerance?: number;
}

/** Speed |B′(t)| of the segment at t. */
export function speed(segment: Segment, t: number): number {
  return length(derivative(segment, t));
}

/** Length of the control polygon: an upper bound on the arc length of the segment. */
export function controlPolygonLength(segment: Segment): number {
  const points = controlPoints(segment);
  let total = 0;
  for (let i = 0; i + 1 < points.length; i++) total += distance(points[i] ?? { x: 0, y: 0 }, points[i + 1] ?? { x: 0, y: 0 });
  return total;
}

/**
 * Arc length between t0 and t1 by a single fixed Gauss–Legendre rule with `nodeCount`
 * nodes (default 16), no adaptivity. Exact for lines; for curves its error is whatever
 * the rule achieves, which degrades near cusps. Provided for comparison and for
 * callers that want predictable cost; prefer `arcLengthBetween`.
 */
export function gaussLegendreArcLength(segment: Segment, t0 = 0, t1 = 1, nodeCount = ARC_LENGTH_GAUSS_NODES): number {
  const rule = nodeCount === ARC_LENGTH_GAUSS_NODES ? ARC_LENGTH_RULE : gaussLegendreRule(nodeCount);
  return Math.abs(integrateWithRule((t) => speed(segment, t), t0, t1, rule));
}

/**
 * Arc length of the piece of `segment` between parameters t0 and t1 (in either order;
 * the result is non-negative).
 *
 * Guarantees: exact (closed form) for lines; for curves the estimated error is at most
 * `tolerance` × control-polygon length, achieved by adaptive subdivision down to
 * intervals of 2⁻⁴⁰ in t. Limit: the estimate compares two Gauss rules, so a feature
 * invisible to both (never in practice for cubics) could be missed.
 */
export function arcLengthBetween(segment: Segment, t0: number, t1: number, options: ArcLengthOptions = {}): number {
  const a = Math.min(t0, t1);
  const b = Math.max(t0, t1);
  if (a === b) return 0;
  if (segment.kind === 'line') return distance(segment.p0, segment.p1) * (b - a);
  const scaleLength = controlPolygonLength(segment);
  if (scaleLength === 0) return 0;
  const tolerance = (options.tolerance ?? DEFAULT_ARC_LENGTH_TOLERANCE) * scaleLength;
  const f = (t: number): number => speed(segment, t);
  const whole = integrateWithRule(f, a, b, ARC_LENGTH_RULE);
  return adaptiveIntegral(f, a, b, whole, tolerance, 0);
}

function adaptiveIntegral(
  f: (t: number) => number,
  a: number,
  b: number,
  whole: number,
  tolerance: number,
  depth: number,
): number {
  const m = a + (b - a) / 2;
  const left = integrateWithRule(f, a, m, ARC_LENGTH_RULE);
  const right = integrateWithRule(f, m, b, ARC_LENGTH_RULE);
  const refined = left + right;
  if (depth >= MAX_SUBDIVISION_DEPTH || Math.abs(refined - whole) <= tolerance) return refined;
  return (
    adaptiveIntegral(f, a, m, left, tolerance / 2, depth + 1) + adaptiveIntegral(f, m, b, right, tolerance / 2, depth + 1)
  );
}

/** Total arc length of the segment; see `arcLengthBetween` for accuracy. */
export function arcLength(segment: Segment, options: ArcLengthOptions = {}): number {
  return arcLengthBetween(segment, 0, 1, options);
}

/** Total arc length of a list of segments (e.g. a contour). */
export function totalArcLength(segments: readonly Segment[], options: ArcLengthOptions = {}): number {
  let total = 0;
  for (const segment of segments) total += arcLength(segment, options);
  return total;
}

/**
 * The parameter t ∈ [0, 1] at which the arc length from t = 0 equals `s`.
 *
 * Guarantees: monotone in s; s ≤ 0 gives 0 and s ≥ the total length gives 1;
 * otherwise arcLengthBetween(segment, 0, t) = s to within about `tolerance` ×
 * control-polygon length. Where the curve has a stationary point (zero speed over
 * an instant) the bisection safeguard still converges. Limit: a fully degenerate
 * segment (all control points equal) has length 0 and returns 0.
 */
export function parameterAtArcLength(segment: Segment, s: number, options: ArcLengthOptions = {}): number {
  const total = arcLength(segment, options);
  if (total === 0 || s <= 0) return 0;
  if (s >= total) return 1;
  const tolerance = (options.tolerance ?? DEFAULT_ARC_LENGTH_TOLERANCE) * controlPolygonLength(segment);
  let lo = 0;
  let hi = 1;
  let t = s / total;
  let lengthAtT = arcLengthBetween(segment, 0, t, options);
  for (let iteration = 0; iteration < MAX_INVERSE_ITERATIONS; iteration++) {
    const residual = lengthAtT - s;
    if (Math.abs(residual) <= tolerance) return t;
    if (residual < 0) lo = t;
    else hi = t;
    const v = speed(segment, t);
    const newton = t - residual / v;
    const next = v > 0 && newton > lo && newton < hi ? newton : lo + (hi - lo) / 2;
    if (next === t || hi - lo <= Number.EPSILON) return t;
    // Integrate only the short stretch between the old and new parameter.
    const step = arcLengthBetween(segment, t, next, options);
    lengthAtT += next > t ? step : -step;
    t = next;
  }
  return t;
}
