/**
 * Signed curvature, curvature combs and inflection points of segments.
 *
 * Type designers judge outline quality by curvature: a smooth glyph has curvature that
 * varies gradually and changes sign only where intended. The comb visualises κ along
 * the curve; inflections are where the bending changes side. For a plane curve
 * κ(t) = (B′ × B″) / |B′|³ (e.g. do Carmo 1976, "Differential Geometry of Curves and
 * Surfaces").
 *
 * Conventions: κ > 0 where the curve turns left (counter-clockwise in a y-up frame),
 * so a counter-clockwise circle of radius r has κ = +1/r. The normal used throughout
 * is the left unit normal N = perpendicular(unit tangent), the tangent rotated +90°,
 * which points towards the centre of curvature where κ > 0.
 */
import type { Point, Vec } from './vector.ts';
import { add, cross, length, normalize, perpendicular, scale } from './vector.ts';
import type { Segment } from './segment.ts';
import { derivative, evaluate, secondDerivative } from './segment.ts';
import { powerBasisOf } from './power-basis.ts';
import { evaluatePolynomial } from './polynomial.ts';
import type { Polynomial } from './polynomial.ts';
import { rootsInUnitInterval } from './polynomial-roots.ts';

/**
 * Signed curvature κ(t) = (B′ × B″)/|B′|³: positive turning left (y-up), 1/radius of
 * the osculating circle in magnitude, 0 on straight stretches.
 * Limit: undefined where the velocity vanishes (a cusp or a doubled control point at
 * an end); returns NaN there so that callers cannot mistake it for a real value.
 */
export function curvature(segment: Segment, t: number): number {
  const d1 = derivative(segment, t);
  const d2 = secondDerivative(segment, t);
  const speed = length(d1);
  if (speed === 0) return Number.NaN;
  return cross(d1, d2) / (speed * speed * speed);
}

/** The left unit normal at t (unit tangent rotated +90°), or (0, 0) where the velocity vanishes. */
export function unitNormal(segment: Segment, t: number): Vec {
  return perpendicular(normalize(derivative(segment, t)));
}

/** One tooth of a curvature comb. */
export interface CombSample {
  /** Parameter of the sample. */
  readonly t: number;
  /** Curve point at t. */
  readonly point: Point;
  /** Left unit normal at t. */
  readonly normal: Vec;
  /** Signed curvature at t. */
  readonly curvature: number;
  /** Outer end of the tooth: point − normal·κ·scale. */
  readonly tip: Point;
}

/** Options for `curvatureComb`. */
export interface CombOptions {
  /** Number of teeth, evenly spaced in t including both ends (≥ 2); default 32. */
  readonly samples?: number;
  /** Tooth length per unit curvature (length² units); default 1. */
  readonly scale?: number;
}

/** Default comb density: 32 teeth per segment read as continuous at editor zoom levels. */
const DEFAULT_COMB_SAMPLES = 32;
/** Fewest teeth that still include both end points. */
const MIN_COMB_SAMPLES = 2;

/**
 * Curvature comb: teeth at `samples` parameters evenly spaced over [0, 1], each from
 * the curve point to tip = point − N·κ·scale.
 *
 * Direction convention: because N points towards the centre of curvature when κ > 0
 * and away from it when κ < 0, −N·κ always points away from the centre of curvature,
 * so teeth stand on the convex (outer) side of the bend whichever way the contour
 * runs; they flip sides at inflections, and have length |κ|·scale. Samples where the
 * velocity vanishes (curvature undefined) are omitted. A `samples` value below 2 is
 * raised to 2; non-integers are rounded.
 */
export function curvatureComb(segment: Segment, options: CombOptions = {}): CombSample[] {
  const count = Math.max(MIN_COMB_SAMPLES, Math.round(options.samples ?? DEFAULT_COMB_SAMPLES));
  const toothScale = options.scale ?? 1;
  const teeth: CombSample[] = [];
  for (let i = 0; i < count; i++) {
    const t = i / (count - 1);
    const k = curvature(segment, t);
    if (!Number.isFinite(k)) continue;
    const point = evaluate(segment, t);
    const normal = unitNormal(segment, t);
    teeth.push({ t, point, normal, curvature: k, tip: add(point, scale(normal, -k * toothScale)) });
  }
  return teeth;
}

/**
 * B′(t) × B″(t) as a power-basis polynomial. For a cubic with power form
 * B = A·t³ + B·t² + C·t + D the t³ terms cancel, leaving
 * −6(A × B)t² − 6(A × C)t − 2(B × C); for a quadratic it is the constant
 * 4(p1 − p0) × (p0 − 2p1 + p2); for a line it is 0.
 */
export function velocityCrossAcceleration(segment: Segment): Polynomial {
  const { x, y } = powerBasisOf(segment, segment.p0);
  const A = { x: x[3] ?? 0, y: y[3] ?? 0 };
  const B = { x: x[2] ?? 0, y: y[2] ?? 0 };
  const C = { x: x[1] ?? 0, y: y[1] ?? 0 };
  return [-2 * cross(B, C), -6 * cross(A, C), -6 * cross(A, B)];
}

/**
 * Parameters in (0, 1) where the segment inflects: roots of B′ × B″ at which it changes
 * sign, ascending (at most two for a cubic; none for lines and quadratics, which
 * never inflect). A root where B′ × B″ only touches zero is not an inflection and is
 * excluded. Limit: at a cusp B′ × B″ also vanishes; a cusp with a sign change is
 * reported like an inflection.
 */
export function inflectionParameters(segment: Segment): number[] {
  if (segment.kind !== 'cubic') return [];
  const polynomial = velocityCrossAcceleration(segment);
  const roots = rootsInUnitInterval(polynomial, 'open');
  const breakpoints = [0, ...roots, 1];
  return roots.filter((_, i) => {
    const before = evaluatePolynomial(polynomial, ((breakpoints[i] ?? 0) + (breakpoints[i + 1] ?? 0)) / 2);
    const after = evaluatePolynomial(polynomial, ((breakpoints[i + 1] ?? 0) + (breakpoints[i + 2] ?? 0)) / 2);
    return Math.sign(before) * Math.sign(after) < 0;
  });
}
